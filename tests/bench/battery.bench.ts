/**
 * Speed of the battery backup study: a 24-hour daily profile at 1-minute steps (1440 steps) through
 * a chain of ten stages fed by a battery bank, with two loads cycling on duty schedules. Run with
 * `npm run bench`; the median is reported in issue notes, not asserted here.
 * - "solve + discharge": the project validated and solved, then its discharge (what the CLI and the
 *   page run for one project), bundled as shipped and through the module runner;
 * - "discharge alone": the study given the solved value (solved once beforehand), as the runtime
 *   spread runs it per sample: the figure issue 20 point 5 asks for (≤ 0.5 ms), with the engine
 *   bundled as the page ships it (tests/bench/bundled-core.ts) and through Vitest's module runner,
 *   which adds a per-call cost to every cross-module call.
 */
import { bench, describe } from 'vitest';
import { simulateDischarge } from '../../core/studies/backup/discharge.ts';
import { solveProject } from '../../core/solve/index.ts';
import { batteryBenchProject } from '../battery/fixtures.ts';
import { onSolved } from '../core/solved.ts';
import { bundledCore } from './bundled-core.ts';

const project = batteryBenchProject();
const check = onSolved(simulateDischarge, project);
if (!check.ok) throw new Error(`bench project does not run: ${JSON.stringify(check.problems)}`);
if (check.result.endReason !== 'profile-complete' || check.result.series.time.length < 1440) {
  throw new Error(`bench project should run the whole 24 h profile, ended: ${check.result.endText}`);
}
const solved = solveProject(project);
if (!solved.ok) throw new Error('bench project does not solve');
const bundled = await bundledCore();
const solvedBundled = bundled.solveProject(project);
if (!solvedBundled.ok) throw new Error('bench project does not solve (bundled)');

describe('battery backup study', () => {
  bench('24 h profile, 1-minute steps, 10-stage chain, two duty-cycled loads (solve + discharge, engine bundled, as shipped)', () => {
    const s = bundled.solveProject(project);
    if (s.ok) bundled.simulateDischarge(s);
  });
  bench('the same, solve + discharge (through the Vitest module runner)', () => {
    onSolved(simulateDischarge, project);
  });
  bench('the same, discharge alone, solved once (engine bundled, as shipped)', () => {
    bundled.simulateDischarge(solvedBundled);
  });
  bench('the same, discharge alone, solved once (through the Vitest module runner)', () => {
    simulateDischarge(solved);
  });
});
