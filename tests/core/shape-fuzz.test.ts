/**
 * Hostile shapes at random (issue 15, points 5 and 8): ids drawn from a small pool that holds
 * reserved names (`__proto__`, `toString` …) and repeats, `from` naming any id, itself, nothing
 * or no element. The solve never throws; it returns a finite result whose energy balances to 1e-9 (and
 * a fault study of it that is finite or refused), or
 * problems naming an element (or the project) and a field; every loop of `from` is reported exactly
 * once, on its first element in file order; every reserved id is refused at its `id`.
 *
 * The loops are found here independently, by the plain definition (an id whose feeds lead back to
 * it within n steps lies on a loop), in O(n²) for these small files.
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { solveProject, studySurges } from '../../core/index.ts';
import { findNonFinite } from '../../core/solve/finite.ts';
import { RESERVED_IDS } from '../../core/solve/structure.ts';
import { onSolved } from './solved.ts';

type Json = Record<string, any>;

const SCALE = Math.max(1, Number(process.env['JP_FC_SCALE'] ?? '1') || 1);

const POOL = ['a', 'b', 'c', 'd', 'e', 'f', 'g', 'h', '__proto__', 'toString', 'constructor', 'valueOf'];

/** A DC chain's worth of element bodies: every kind here takes and (but the load) gives DC. */
const body = fc.constantFrom<Json>(
  { kind: 'cable', length: 1, resistancePerKm: 0.1 },
  { kind: 'dc-bus', fixedLoss: 0.5 },
  { kind: 'dc-dc', outputVoltage: 24, loss: { model: 'constant', efficiency: 0.95 } },
  { kind: 'dc-load', power: 10 },
  { kind: 'dc-current-load', current: 0.5 },
  // Kinds that do not fit a DC feed, a second source, a kind nobody knows.
  { kind: 'inverter', phases: 1, outputVoltage: 230, frequency: 50, loss: { model: 'constant', efficiency: 0.94 } },
  { kind: 'ac-load', power: 10, powerFactor: 0.9 },
  { kind: 'battery', voltage: 12, internalResistance: 0.01 },
  { kind: 'flux-capacitor' },
);

const shape = fc.array(
  fc.record({
    id: fc.constantFrom(...POOL),
    from: fc.option(fc.constantFrom(...POOL, 'bank', 'missing'), { nil: undefined }),
    body,
  }),
  { minLength: 1, maxLength: 30 },
);

/** Loops by the definition, each as the set of its ids, with its first element in file order. */
function loops(elements: readonly Json[]): { ids: Set<string>; first: string }[] {
  const byId = new Map<string, Json>();
  for (const e of elements) if (!byId.has(e['id'])) byId.set(e['id'], e);
  const found = new Map<string, { ids: Set<string>; first: string }>();
  for (const [id] of byId) {
    const path: string[] = [];
    let at: string | undefined = id;
    for (let k = 0; k <= byId.size && at !== undefined; k++) {
      path.push(at);
      at = byId.get(at)?.['from'];
      if (at === id) {
        const ids = new Set(path);
        const key = [...ids].sort().join(',');
        const first = elements.find((e) => ids.has(e['id']))!['id'];
        found.set(key, { ids, first });
        break;
      }
    }
  }
  return [...found.values()];
}

describe('hostile shapes', () => {
  it('never throw; loops once each, reserved ids at their id, or a finite balanced result', () => {
    fc.assert(
      fc.property(shape, (drawn) => {
        const elements: Json[] = [{ id: 'bank', kind: 'battery', voltage: 48, internalResistance: 0.01 }];
        for (const d of drawn) elements.push({ id: d.id, ...(d.from !== undefined ? { from: d.from } : {}), ...d.body });
        const project = { format: 'joulepath-project', version: 2, name: 'shape', elements };
        const out = solveProject(project);
        if (out.ok) {
          expect(findNonFinite(out.result)).toEqual([]);
          expect(out.result.totals.balanceError).toBeLessThanOrEqual(1e-9);
          // The fault study walks the same tree: finite, or refused.
          const surge = onSolved(studySurges, project);
          if (surge.ok) expect(findNonFinite(surge.result)).toEqual([]);
          return;
        }
        for (const p of out.problems) {
          expect(typeof p.elementId).toBe('string');
          expect(typeof p.field).toBe('string');
          expect(p.message).not.toMatch(/NaN|undefined|\[object|function/);
        }
        // Every loop once, on its first element in file order.
        const cycles = out.problems.filter((p) => p.code === 'cycle');
        const expected = loops(elements);
        expect(cycles.map((p) => p.elementId).sort()).toEqual(expected.map((l) => l.first).sort());
        // Every reserved id refused at its id.
        for (const id of new Set(elements.map((e) => e['id'] as string))) {
          if (RESERVED_IDS.has(id)) expect(out.problems.some((p) => p.elementId === id && p.field === 'id' && /reserved name/.test(p.message))).toBe(true);
        }
      }),
      { numRuns: 300 * SCALE },
    );
  }, 120_000 * SCALE);
});
