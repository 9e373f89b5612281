/**
 * Speed of the option search over 500 candidates (issue 20 point 5 asks ≤ 2 s), both as the app ships
 * the engine (one bundle) and through Vitest's module runner: each candidate a named variant solved
 * past validation, checked for drops and, when those pass, for runtime (a 12 h discharge at 1-minute
 * steps). Run with `npm run bench`; figures are reported in issue notes, not asserted.
 */
import { bench, describe } from 'vitest';
import { searchOptions, solveProject } from '../../core/index.ts';
import { bundledCore } from './bundled-core.ts';
import { benchSearchProject, benchSearchSettings } from './search-case.ts';

const solved = solveProject(benchSearchProject);
if (!solved.ok) throw new Error(`bench project does not solve: ${JSON.stringify(solved.problems)}`);
const first = searchOptions(solved, benchSearchSettings);
if (!first.ok || first.search.tried !== 500) throw new Error('bench search does not try 500 candidates');
const bundled = await bundledCore();
const solvedBundled = bundled.solveProject(benchSearchProject);
if (!solvedBundled.ok) throw new Error('bench project does not solve (bundled)');

describe('option search, 500 candidates', () => {
  bench('engine bundled, as shipped', () => {
    bundled.searchOptions(solvedBundled, benchSearchSettings);
  }, { iterations: 3, warmupIterations: 1 });
  bench('through the Vitest module runner', () => {
    searchOptions(solved, benchSearchSettings);
  }, { iterations: 3, warmupIterations: 1 });
});
