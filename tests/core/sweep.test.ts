/**
 * The sweep's limits: convergence near voltage collapse, and the two ways it refuses.
 * Reference: a constant-power load P behind a resistance R from a stiff source V has the operating
 * voltage V_r = (V + √(V² − 4RP))/2 and no solution above P_max = V²/(4R) (closed form of the
 * quadratic; the DC case of the two-bus equation).
 */
import { describe, expect, it } from 'vitest';
import { solveProject } from '../../core/index.ts';

/**
 * 48 V bank and a cable, 0.2 Ω in all, feeding one DC load: either a stiff bank and 0.2 Ω of loop
 * resistance (100 m one way at 1 Ω/km), or 0.1 Ω inside the bank and 0.1 Ω in the cable (50 m).
 * Two resistances in series need several sweeps; one alone is solved exactly in the first.
 */
const chain = (power: number, split = false) => ({
  format: 'joulepath-project',
  version: 2,
  name: 'near collapse',
  elements: [
    { id: 'bank', kind: 'battery', voltage: 48, internalResistance: split ? 0.1 : 0 },
    { id: 'run', kind: 'cable', from: 'bank', length: split ? 50 : 100, resistancePerKm: 1 },
    { id: 'load', kind: 'dc-load', from: 'run', power },
  ],
});
const P_MAX = (48 * 48) / (4 * 0.2); // 2880 W, closed form above

describe('sweep near voltage collapse', () => {
  it('at 99 % of the maximum transfer it converges to the upper root of the quadratic', () => {
    const p = 0.99 * P_MAX;
    const outcome = solveProject(chain(p, true));
    expect(outcome.ok).toBe(true);
    if (!outcome.ok) return;
    const vr = (48 + Math.sqrt(48 * 48 - 4 * 0.2 * p)) / 2; // closed form above
    const load = outcome.result.elements.find((e) => e.id === 'load')!;
    expect(load.input!.voltage).toBeCloseTo(vr, 6);
    expect(outcome.result.method.iterations).toBeGreaterThan(10); // slow near the nose, but there
  });

  it('just below the maximum it may not settle within the sweep limit, and says so clearly', () => {
    // 99.97 % of P_max: a solution exists (24.4 V) but fixed-point sweeps converge too slowly there.
    const outcome = solveProject(chain(0.9997 * P_MAX, true));
    expect(outcome.ok).toBe(false);
    if (outcome.ok) return;
    expect(outcome.problems).toHaveLength(1);
    expect(outcome.problems[0]!.code).toBe('no-convergence');
    expect(outcome.problems[0]!.message).toMatch(/did not settle within 200 sweeps.*close to voltage collapse/);
  });

  it('above the maximum it names the link and quotes the load asked of it', () => {
    const outcome = solveProject(chain(5000));
    expect(outcome.ok).toBe(false);
    if (outcome.ok) return;
    expect(outcome.problems).toEqual([
      expect.objectContaining({ code: 'infeasible-load', elementId: 'run', value: 5000 }),
    ]);
    expect(outcome.problems[0]!.message).toContain('the 5 kW of load beyond it');
  });
});
