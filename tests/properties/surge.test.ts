/**
 * Invariants of the surge and fault study (fast-check):
 * - a longer cable never raises the prospective fault current at its far end (AC and DC);
 * - a larger motor (by rating, same code letter) never lowers the generator's transient dip,
 *   and never raises the voltage at its terminals during the start;
 * - a weaker supply (smaller short-circuit power) never raises the voltage at the motor during
 *   the start, and a stiffer one never lowers it (every series impedance counts);
 * - a transformer of higher u_k never raises it either;
 * - the generator's transient reactance X'd (≥ X''d) never gives a smaller dip than X''d alone.
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { studySurges, type SurgeStudyResult } from '../../core/index.ts';
import { gridTransformerCable, project, transformerFed, weakGrid } from '../surge/fixtures.ts';
import { onSolved } from '../core/solved.ts';

function study(p: unknown): SurgeStudyResult {
  const o = onSolved(studySurges, p);
  if (!o.ok) throw new Error(JSON.stringify(o.problems));
  return o.result;
}

describe('fault current falls with cable length', () => {
  it('AC: far end of the sub-feeder', () => {
    fc.assert(
      fc.property(fc.double({ min: 1, max: 500, noNaN: true }), fc.double({ min: 1.001, max: 3, noNaN: true }), (l, k) => {
        const at = (len: number) => study(gridTransformerCable(len)).acFaults.points.find((p) => p.elementId === 'sub')!.current!;
        expect(at(l * k)).toBeLessThan(at(l));
      }),
      { numRuns: 25 },
    );
  });

  it('DC: far end of a bank cable', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0.5, max: 50, noNaN: true }),
        fc.double({ min: 1.001, max: 3, noNaN: true }),
        fc.double({ min: 0.0005, max: 0.05, noNaN: true }),
        (l, k, rInt) => {
          const at = (len: number) =>
            study(
              project('dc', [
                { id: 'b', kind: 'battery', voltage: 48, internalResistance: rInt },
                { id: 'c', kind: 'cable', from: 'b', length: len, resistancePerKm: 0.5 },
                { id: 'l', kind: 'dc-load', from: 'c', power: 100 },
              ]),
            ).batteryFaults.points.find((p) => p.elementId === 'c')!.current!;
          expect(at(l * k)).toBeLessThan(at(l));
        },
      ),
      { numRuns: 25 },
    );
  });
});

describe('generator dip grows with motor size', () => {
  it('same code letter, larger rated output: dip never smaller, terminal voltage never higher', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 1000, max: 20000, noNaN: true }),
        fc.double({ min: 1.01, max: 3, noNaN: true }),
        fc.double({ min: 8, max: 30, noNaN: true }),
        fc.constantFrom('D', 'G', 'J', 'L'),
        (p, k, xd, letter) => {
          const run = (rated: number) =>
            study(
              project('gen', [
                { id: 'gen', kind: 'generator', phases: 3, voltage: 400, frequency: 50, ratedApparentPower: 150000, subtransientReactancePercent: xd },
                { id: 'c', kind: 'cable', from: 'gen', length: 30, resistancePerKm: 0.5, reactancePerKm: 0.08 },
                { id: 'm', kind: 'motor', from: 'c', ratedOutput: rated, ratedVoltage: 400, nameplate: { efficiency: 0.9, powerFactor: 0.85 }, starting: { method: 'dol', codeLetter: letter } },
                { id: 's', kind: 'shaft-load', from: 'm', power: rated * 0.8 },
              ]),
            ).starts[0]!;
          const small = run(p);
          const large = run(p * k);
          expect(large.generator!.dipPercent!).toBeGreaterThan(small.generator!.dipPercent!);
          // A start the chain cannot carry at all (voltage collapse: no operating point, duringStart
          // null, verdict "will not start") is the lowest terminal voltage there is.
          if (small.duringStart === null) expect(large.duringStart).toBeNull();
          if (large.duringStart === null) expect(large.verdict).toBe('will-not-start');
          else expect(large.duringStart.terminalVoltagePercent).toBeLessThan(small.duringStart!.terminalVoltagePercent);
        },
      ),
      { numRuns: 25 },
    );
  });
});

describe('every series impedance lowers the voltage at a starting motor', () => {
  it('a weaker supply (smaller S″kQ) never gives a higher terminal voltage', () => {
    fc.assert(
      fc.property(fc.double({ min: 2e5, max: 5e7, noNaN: true }), fc.double({ min: 1.01, max: 10, noNaN: true }), fc.double({ min: 100, max: 600, noNaN: true }), (sk, k, ilr) => {
        const v = (s: number) => {
          const st = study(weakGrid({ lockedRotorCurrent: ilr, startingPowerFactor: 0.3 }, { shortCircuitPower: s })).starts[0]!;
          return st.duringStart === null ? 0 : st.duringStart.terminalVoltagePercent;
        };
        expect(v(sk)).toBeLessThanOrEqual(v(sk * k));
        expect(v(sk * k)).toBeLessThan(100);
      }),
      { numRuns: 25 },
    );
  });

  it('a transformer of higher u_k never gives a higher terminal voltage', () => {
    fc.assert(
      fc.property(fc.double({ min: 2, max: 10, noNaN: true }), fc.double({ min: 1.01, max: 2, noNaN: true }), (uk, k) => {
        const v = (z: number) => study(transformerFed(z)).starts[0]!.duringStart!.terminalVoltagePercent;
        expect(v(uk * k)).toBeLessThan(v(uk));
      }),
      { numRuns: 20 },
    );
  });

  it('a generator dip behind X′d is never below the dip behind X″d alone', () => {
    fc.assert(
      fc.property(fc.double({ min: 5, max: 25, noNaN: true }), fc.double({ min: 1, max: 3, noNaN: true }), (xdd, k) => {
        const run = (extra: Record<string, unknown>) =>
          study(
            project('gen', [
              { id: 'gen', kind: 'generator', phases: 3, voltage: 400, frequency: 50, ratedApparentPower: 150000, subtransientReactancePercent: xdd, ...extra },
              { id: 'm', kind: 'motor', from: 'gen', ratedOutput: 11000, ratedVoltage: 400, nameplate: { efficiency: 0.9, powerFactor: 0.85, current: 21 }, starting: { method: 'dol', lockedRotorCurrent: 150 } },
              { id: 's', kind: 'shaft-load', from: 'm', power: 9000 },
            ]),
          ).starts[0]!.generator!.dipPercent!;
        expect(run({ transientReactancePercent: xdd * k })).toBeGreaterThanOrEqual(run({}));
      }),
      { numRuns: 20 },
    );
  });
});
