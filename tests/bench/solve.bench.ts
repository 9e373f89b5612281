/**
 * Speed of one full solve (validate → plan → sweep → report) of a 20-element tree with branches
 * and three cable links. Run with `npm run bench`; the median is reported in issue notes, not
 * asserted here.
 */
import { bench, describe } from 'vitest';
import { solveProject } from '../../core/index.ts';
import { twentyStageTree } from './trees.ts';

const project = twentyStageTree();
const check = solveProject(project);
if (!check.ok) throw new Error(`bench project does not solve: ${JSON.stringify(check.problems)}`);

describe('solve', () => {
  bench('20-stage tree, 3 cable links, branches', () => {
    solveProject(project);
  });
});
