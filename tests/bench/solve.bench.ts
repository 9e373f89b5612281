/**
 * Speed of one full solve (validate → plan → sweep → report) of a 20-element tree with branches
 * and three cable links, both as the app ships the engine (one bundle) and through Vitest's module
 * runner; and of the solve past validation (`solveVariant` of the solved project with nothing
 * changed: plan → sweep → report → the finite check), which is what the runtime spread and the
 * option search run per sample or candidate (issue 20 point 5 asks ≤ 30 µs for the single solve).
 * Run with `npm run bench`; the medians are reported in issue notes, not asserted here.
 */
import { bench, describe } from 'vitest';
import { solveProject } from '../../core/index.ts';
import { bundledCore } from './bundled-core.ts';
import { twentyStageTree } from './trees.ts';

const project = twentyStageTree();
const check = solveProject(project);
if (!check.ok) throw new Error(`bench project does not solve: ${JSON.stringify(check.problems)}`);
const bundled = await bundledCore();
const solvedBundled = bundled.solveProject(project);
if (!solvedBundled.ok) throw new Error('bench project does not solve (bundled)');

describe('solve', () => {
  bench('20-stage tree, 3 cable links, branches (engine bundled, as shipped)', () => {
    bundled.solveProject(project);
  });
  bench('20-stage tree, 3 cable links, branches (through the Vitest module runner)', () => {
    solveProject(project);
  });
  bench('20-stage tree, past validation: solveVariant, nothing changed (engine bundled, as shipped)', () => {
    bundled.solveVariant(solvedBundled, {});
  });
});
