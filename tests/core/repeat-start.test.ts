/**
 * The repeated solve of the passive elements next to the bank (core/solve/repeat.ts) starts each step
 * from the voltages extrapolated from the last two steps of the same load state (issue 20 point 5):
 * the starting point changes, the operating point it converges to must not. Checked against the same
 * step solved by a fresh solver (started from the open-circuit voltage everywhere), which is the
 * sweep's own fixed point at the tolerance core/solve/sweep.ts sets (1e-12 relative): reference is
 * the engine's method itself, no outside figure.
 */
import { describe, expect, it } from 'vitest';
import { validateProject } from '../../core/solve/index.ts';
import { prepareRepeat, type RepeatSolver, type StepPoint } from '../../core/solve/repeat.ts';
import { batteryBenchProject } from '../battery/fixtures.ts';

const valid = validateProject(batteryBenchProject());
if (!valid.ok) throw new Error(JSON.stringify(valid.problems));
const project = valid.project;

/** Two load states (every load at its rating; the lights off and the compressor on a low level). */
function solver(): { solver: RepeatSolver; full: number; light: number } {
  const r = prepareRepeat(project);
  if (!r.ok) throw new Error(JSON.stringify(r.problems));
  const ids = r.solver.loadIds;
  const rated: Record<string, number> = { compressor: 400, lights: 150, pump: 500, radios: 120, fans: 30 };
  const full = r.solver.prepare(ids.map((id) => rated[id]!));
  const light = r.solver.prepare(ids.map((id) => (id === 'lights' ? 0 : id === 'compressor' ? 100 : rated[id]!)));
  if (!full.ok || !light.ok) throw new Error('the load states do not solve');
  return { solver: r.solver, full: full.state, light: light.state };
}

const close = (a: number, b: number) => Math.abs(a - b) <= 1e-11 * Math.max(Math.abs(a), Math.abs(b));

describe('repeated solve: the extrapolated start changes no step', () => {
  it('a falling bank voltage, load changes between, each step as a fresh solve gives it', () => {
    const run = solver();
    expect(run.solver.fast).toBe(true); // bank → cables and bus → converters: the real-arithmetic top
    const R = 0.0023;
    let steps = 0;
    for (let k = 0; k < 120; k++) {
      // Steps of uneven size, the state switching now and then (as duty cycles do).
      const emf = 54.4 - 0.01 * k - (k % 7 === 0 ? 0.03 : 0);
      const state = Math.floor(k / 25) % 2 === 0 ? run.full : run.light;
      const p = run.solver.solve(state, emf, R);
      const fresh = solver();
      const q = fresh.solver.solve(state === run.full ? fresh.full : fresh.light, emf, R);
      expect(p).not.toBeNull();
      expect(q).not.toBeNull();
      for (const key of ['voltage', 'current', 'terminalPower', 'internalLoss', 'chainLoss', 'loadPower'] as const) {
        if (!close((p as StepPoint)[key], (q as StepPoint)[key])) throw new Error(`step ${k}: ${key} ${p![key]} against ${q![key]} from a fresh start`);
      }
      steps++;
    }
    expect(steps).toBe(120);
  });

  it('after a step the chain cannot carry, the next one still finds the operating point', () => {
    const run = solver();
    expect(run.solver.solve(run.full, 54, 0.002)).not.toBeNull();
    expect(run.solver.solve(run.full, 53.9, 0.002)).not.toBeNull();
    // A bank resistance no chain could draw its load through: no operating point (null).
    expect(run.solver.solve(run.full, 53.8, 5)).toBeNull();
    const after = run.solver.solve(run.full, 53.7, 0.002)!;
    const fresh = solver();
    const ref = fresh.solver.solve(fresh.full, 53.7, 0.002)!;
    expect(close(after.voltage, ref.voltage)).toBe(true);
    expect(close(after.current, ref.current)).toBe(true);
  });
});
