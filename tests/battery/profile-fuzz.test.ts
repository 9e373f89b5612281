/**
 * Hostile backup profiles (issue 15, point 7), drawn at random: segment lengths, duty periods,
 * horizons and time steps from the smallest double to the largest, keys that name no load. Every
 * outcome is a clean refusal naming the project or an element and a field, in words without NaN, or
 * a run whose every figure is finite and whose energy balances: energy from the cells = energy out of
 * the terminals + internal I²R, and energy out of the terminals = energy of the loads + chain losses
 * (conservation of energy, to 1e-9 relative). No case throws; none runs out of memory (the bounds
 * of core/solve/load-profile.ts). A case that hangs fails on the test's time limit.
 */
import { describe, expect, it } from 'vitest';
import { PROJECT_LEVEL } from '../../core/model/errors.ts';
import fc from 'fast-check';
import { simulateDischarge } from '../../core/studies/backup/discharge.ts';
import { findNonFinite } from '../../core/solve/finite.ts';
import { demoProjects } from '../../core/index.ts';
import { onSolved } from '../core/solved.ts';

type Json = Record<string, any>; // fixtures hold values the schema refuses on purpose

/** Multiply numRuns by JP_FC_SCALE (default 1) for a longer hunt. */
const SCALE = Math.max(1, Number(process.env['JP_FC_SCALE'] ?? '1') || 1);

const base = demoProjects.find((d) => d.id === 'hillside-relay-hut')!.project as Json;

/** A positive number from the smallest double to the largest (log-uniform), or an ordinary one. */
const anyPositive = (ordinaryMin: number, ordinaryMax: number) =>
  fc.oneof(
    fc.constantFrom(5e-324, 1e-300, 1e300, Number.MAX_VALUE),
    fc.tuple(fc.double({ min: 1, max: 9.99, noNaN: true }), fc.integer({ min: -320, max: 300 })).map(([m, e]) => m * 10 ** e),
    fc.double({ min: ordinaryMin, max: ordinaryMax, noNaN: true }),
  );

const loadKey = fc.constantFrom('lights', 'fridge', 'radios', 'bus', 'nowhere', '__proto__', 'toString');

const loads = fc.dictionary(loadKey, fc.oneof(fc.boolean(), anyPositive(0, 500), fc.constant(0)), { maxKeys: 2 });

const duty = fc.array(
  fc.record(
    { load: loadKey, periodMinutes: anyPositive(1, 120), onMinutes: anyPositive(0.1, 60), offsetMinutes: anyPositive(0, 60) },
    { requiredKeys: ['load', 'periodMinutes', 'onMinutes'] },
  ),
  { maxLength: 2 },
);

const profile = fc.oneof(
  fc.record({ kind: fc.constant('constant'), duty }),
  fc.record({
    kind: fc.constant('segments'),
    segments: fc.array(fc.record({ durationHours: anyPositive(0.01, 24), loads }), { minLength: 1, maxLength: 4 }),
    repeat: fc.boolean(),
    duty,
  }),
  fc.record({
    kind: fc.constant('daily'),
    segments: fc
      .uniqueArray(fc.double({ min: 0, max: 23.99, noNaN: true }), { minLength: 1, maxLength: 4 })
      .chain((hours) => fc.tuple(...[...hours].sort((a, b) => a - b).map((startHour) => loads.map((l) => ({ startHour, loads: l }))))),
    startHour: fc.double({ min: 0, max: 23.99, noNaN: true }),
    duty,
  }),
);

const settings = fc.record(
  { profile, horizonHours: anyPositive(0.1, 200), timeStepSeconds: anyPositive(1, 3600) },
  { requiredKeys: ['profile'] },
);

describe('hostile backup profiles', () => {
  it('are refused at a field or run to a finite, balanced result; nothing throws', () => {
    let ran = 0;
    fc.assert(
      fc.property(settings, (s) => {
        // The demo's temperature and bank; its profile, horizon and step replaced by the drawn ones.
        const p: Json = { ...structuredClone(base), backup: { temperatureC: base['backup'].temperatureC, ...s } };
        const out = onSolved(simulateDischarge, p);
        if (!out.ok) {
          expect(out.problems.length).toBeGreaterThan(0);
          for (const x of out.problems) {
            expect(typeof x.elementId).toBe('string');
            // A problem of the project names its field; one of an element may be the element as a whole ('').
            expect(typeof x.field).toBe('string');
            if (x.elementId === PROJECT_LEVEL) expect(x.field.length, JSON.stringify(x)).toBeGreaterThan(0);
            expect(x.message).not.toMatch(/NaN|Infinity|undefined|\[object/);
          }
          return;
        }
        ran++;
        const r = out.result;
        expect(findNonFinite(r)).toEqual([]);
        const close = (a: number, b: number) => expect(Math.abs(a - b)).toBeLessThanOrEqual(1e-9 * Math.max(Math.abs(a), Math.abs(b), 1e-12));
        close(r.drawnWh, r.deliveredWh + r.internalLossWh);
        close(r.deliveredWh, r.loadWh + r.chainLossWh);
      }),
      { numRuns: 120 * SCALE },
    );
    // Not a bound on the outcome, only a sign the generator reaches runs at all.
    expect(ran).toBeGreaterThan(0);
  }, 240_000 * SCALE);
});
