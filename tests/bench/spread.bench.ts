/**
 * Speed of the runtime spread (issue 20 point 5 asks ≤ 1 s in the worker for 1000 samples of the
 * hillside demo): 1000 samples at the typical tolerances, each a variant solve and the runtime study
 * (discharge and sizing), then the one-at-a-time swings, with the engine bundled as the page ships it
 * (tests/bench/bundled-core.ts; the worker runs that bundle) and through Vitest's module runner. Run
 * with `npm run bench`; the figures are reported in issue notes, never asserted.
 */
import { bench, describe } from 'vitest';
import { demoProjects } from '../../core/index.ts';
import { runSpread } from '../../core/studies/spread/run.ts';
import { solvedOf } from '../core/solved.ts';
import { bundledCore } from './bundled-core.ts';

const hillside = demoProjects.find((d) => d.id === 'hillside-relay-hut')!.project;
const solved = solvedOf(hillside);
const bundled = await bundledCore();
const solvedBundled = bundled.solveProject(hillside);
if (!solvedBundled.ok) throw new Error('the hillside demo does not solve (bundled)');
const settings = { samples: 1000, seed: 1 };
const check = bundled.runSpread(solvedBundled, { settings });
if (!check.ok || check.value.failed > 0) throw new Error('the hillside spread does not run');

// One run takes seconds: a few iterations, no time budget.
const few = { iterations: 3, warmupIterations: 1, time: 0, warmupTime: 0 };

describe('runtime spread, hillside demo', () => {
  bench('1000 samples and the swings (engine bundled, as shipped)', () => {
    bundled.runSpread(solvedBundled, { settings });
  }, few);
  bench('1000 samples and the swings (through the Vitest module runner)', () => {
    runSpread(solved, { settings });
  }, few);
});
