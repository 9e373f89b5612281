/** Speed of the energy-flow graph (core/studies/energy-flow.ts) on the demo projects, solved once beforehand. */
import { bench, describe } from 'vitest';
import { demoProjects, flowGraph, solveProject, type SolveResult } from '../../core/index.ts';

const results: [string, SolveResult][] = demoProjects.map((d) => {
  const outcome = solveProject(d.project);
  if (!outcome.ok) throw new Error(`${d.id}: ${JSON.stringify(outcome.problems)}`);
  return [d.id, outcome.result];
});

describe('flowGraph', () => {
  for (const [id, result] of results) bench(id, () => void flowGraph(result));
});
