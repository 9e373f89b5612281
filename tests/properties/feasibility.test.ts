/**
 * Feasibility at the nose of the P–V curve, over random single links.
 *
 * Law (maximum power transfer through a series resistance, a textbook result): a stiff source of
 * voltage V behind a resistance R can deliver at most P_max = V²/(4R) to a constant-power load at
 * unity power factor, and below that the operating point is the upper root
 * V_r = (V + √(V² − 4·R·P))/2 of P = V_r·(V − V_r)/R. Per phase on three-phase: V_ph²/(4R) per
 * phase, so V_LL²/(4R) in total. R here is the loop resistance on DC and single-phase.
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { solveProject, type Project } from '../../core/index.ts';

type Kind = 'dc' | 'ac1' | 'ac3';

function link(kind: Kind, voltage: number, length: number, rPerKm: number, power: number): Project {
  const source =
    kind === 'dc'
      ? { id: 'src', kind: 'battery' as const, voltage }
      : { id: 'src', kind: 'grid' as const, phases: kind === 'ac3' ? (3 as const) : (1 as const), voltage, frequency: 50 };
  const load = kind === 'dc' ? { id: 'load', kind: 'dc-load' as const, from: 'run', power } : { id: 'load', kind: 'ac-load' as const, from: 'run', power, powerFactor: 1 };
  return {
    format: 'joulepath-project',
    version: 1,
    name: 'Nose check',
    elements: [source, { id: 'run', kind: 'cable', from: 'src', length, resistancePerKm: rPerKm }, load],
  };
}

/** Loop resistance on DC/1φ (2 × length), one conductor on 3φ (model.ts, cable). */
const resistance = (kind: Kind, length: number, rPerKm: number) => ((kind === 'ac3' ? 1 : 2) * length * rPerKm) / 1000;
/** P_max = V²/(4R) (V line-to-line and R per phase on 3φ). */
const pMax = (kind: Kind, v: number, r: number) => (v * v) / (4 * r);

const kindArb = fc.constantFrom<Kind>('dc', 'ac1', 'ac3');
const voltageArb = fc.constantFrom(12, 48, 230, 400, 690);
const lengthArb = fc.double({ min: 1, max: 500, noNaN: true });
const rPerKmArb = fc.double({ min: 0.05, max: 20, noNaN: true });

describe('feasibility at the nose of the P–V curve', () => {
  it('below P_max the load is delivered at the upper root V_r = (V + √(V² − 4RP))/2', () => {
    fc.assert(
      fc.property(kindArb, voltageArb, lengthArb, rPerKmArb, fc.double({ min: 0.001, max: 0.99, noNaN: true }), (kind, v, length, rPerKm, k) => {
        const r = resistance(kind, length, rPerKm);
        const p = k * pMax(kind, v, r);
        const outcome = solveProject(link(kind, v, length, rPerKm, p));
        if (!outcome.ok) throw new Error(`refused ${p} W below P_max ${pMax(kind, v, r)} W: ${JSON.stringify(outcome.problems)}`);
        const run = outcome.result.elements.find((e) => e.id === 'run')!;
        // Per phase on 3φ: V_ph and P/3 give V_r,ph; the same ratio holds line-to-line.
        const vr = (v + Math.sqrt(v * v - 4 * r * p)) / 2;
        expect(Math.abs(run.output!.voltage - vr)).toBeLessThanOrEqual(1e-9 * v);
        expect(run.output!.voltage).toBeGreaterThanOrEqual(v / 2 - 1e-9 * v); // upper branch
      }),
      { numRuns: 300 },
    );
  });

  it('above P_max the solve refuses with infeasible-load naming the link', () => {
    fc.assert(
      fc.property(kindArb, voltageArb, lengthArb, rPerKmArb, fc.double({ min: 1.001, max: 5, noNaN: true }), (kind, v, length, rPerKm, k) => {
        const r = resistance(kind, length, rPerKm);
        const outcome = solveProject(link(kind, v, length, rPerKm, k * pMax(kind, v, r)));
        expect(outcome.ok).toBe(false);
        if (outcome.ok) return;
        expect(outcome.problems.map((p) => [p.code, p.elementId])).toEqual([['infeasible-load', 'run']]);
        expect(outcome.problems[0]!.message.length).toBeGreaterThan(20);
      }),
      { numRuns: 300 },
    );
  });
});
