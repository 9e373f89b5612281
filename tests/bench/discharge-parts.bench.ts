/**
 * Where the battery bench's discharge (battery.bench.ts: 24 h at 1-minute steps, ten stages, two
 * duty-cycled loads) spends its time, part by part, so that work on issue 20 point 5 (≤ 0.5 ms for
 * the whole discharge) can aim at the largest part:
 * - the timeline: the profile cut into intervals of one load state (core/solve/load-profile.ts);
 * - the plan for repeated solves and one whole-chain sweep per distinct load state (core/solve/repeat.ts
 *   `prepareRepeat` and `prepare`);
 * - the step solves alone: as many solves of the passive elements next to the bank as the discharge
 *   runs (one per step and one per load change), the bank's open-circuit voltage falling a little
 *   each step, the load state changing as the timeline's intervals do, each written in place into
 *   one step point (`RepeatSolver.solveInto`, as the time loop in discharge-steps.ts does);
 * - the whole discharge, for comparison.
 * Through Vitest's module runner (cross-module calls cost more than in the shipped bundle). Run with
 * `npm run bench`; the figures are reported in issue notes, not asserted here.
 */
import { bench, describe } from 'vitest';
import { simulateDischarge } from '../../core/studies/backup/discharge.ts';
import { solveProject } from '../../core/solve/index.ts';
import { buildTimeline } from '../../core/solve/load-profile.ts';
import { emptyPoint, prepareRepeat, type RepeatSolver } from '../../core/solve/repeat.ts';
import { batteryBenchProject } from '../battery/fixtures.ts';

const solved = solveProject(batteryBenchProject());
if (!solved.ok) throw new Error('bench project does not solve');
const project = solved.project;
const study = project.backup!;
const timeline = buildTimeline(project, study);

/** The solver with every load state of the timeline prepared, and the state of each interval. */
function prepared(): { solver: RepeatSolver; stateOf: number[] } {
  const r = prepareRepeat(project);
  if (!r.ok) throw new Error('bench project cannot be prepared for repeated solves');
  const pos = new Map(timeline.loads.map((l, i) => [l.id, i]));
  const ids = timeline.states.map((values) => {
    const s = r.solver.prepare(r.solver.loadIds.map((id) => values[pos.get(id)!]!));
    if (!s.ok) throw new Error('a load state does not solve');
    return s.state;
  });
  return { solver: r.solver, stateOf: timeline.intervals.map((iv) => ids[iv.state]!) };
}

const ready = prepared();
const discharge = simulateDischarge(solved);
if (!discharge.ok) throw new Error('bench project does not discharge');
// The solves the discharge runs: one per step plus one per load change (its own count).
const steps = discharge.result.series.time.length;
const volts = discharge.result.series.voltage;
const resistance = discharge.result.bank.internalResistance;
const point = emptyPoint();

describe('battery discharge, part by part', () => {
  bench('the timeline (intervals of one load state)', () => {
    buildTimeline(project, study);
  });
  bench('the plan for repeated solves and one sweep per load state', () => {
    prepared();
  });
  bench(`the step solves alone (${steps}, the load state following the intervals)`, () => {
    const { solver, stateOf } = ready;
    const perInterval = Math.max(1, Math.floor(steps / stateOf.length));
    for (let k = 0; k < steps; k++) {
      const state = stateOf[Math.min(stateOf.length - 1, Math.floor(k / perInterval))]!;
      // The terminal voltages the discharge went through stand in for the open-circuit voltage;
      // written in place, as the discharge's time loop does (`solveInto`).
      solver.solveInto(state, volts[k]! + 0.5, resistance, point);
    }
  });
  bench('the whole discharge (solved once beforehand)', () => {
    simulateDischarge(solved);
  });
});
