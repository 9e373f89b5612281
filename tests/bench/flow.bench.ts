/** Speed of the energy-flow graph (core/studies/energy-flow.ts) on the demo projects, solved once beforehand. */
import { bench, describe } from 'vitest';
import { demoProjects, flowGraph, solveProject, type SolveResult } from '../../core/index.ts';
import { layout } from '../../web/components/flow-layout.ts';
import { thirtyElementChain } from './flow-chain.ts';

const results: [string, SolveResult][] = demoProjects.map((d) => {
  const outcome = solveProject(d.project);
  if (!outcome.ok) throw new Error(`${d.id}: ${JSON.stringify(outcome.problems)}`);
  return [d.id, outcome.result];
});

describe('flowGraph', () => {
  for (const [id, result] of results) bench(id, () => void flowGraph(result));
});

// The diagram's layout with its labels (web/components/flow-layout.ts) of the 30-element chain, as the
// page runs it after an edit (the graph made once beforehand), at a desktop box width, with the rough
// text measure (the page measures with a canvas, cached).
const chain = solveProject(thirtyElementChain());
if (!chain.ok) throw new Error(JSON.stringify(chain.problems));
const chainGraph = flowGraph(chain.result);
describe('diagram layout', () => {
  bench('30-element chain', () => {
    void layout(chainGraph, 1200, 'en-US');
  }, { time: 3000 });
});
