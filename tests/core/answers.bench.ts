/**
 * What the answers strip costs in the edit's frame: `solveAnswers` (core/solve/answers.ts, one pass
 * over the result) on each demo, for a new result each call (a shallow copy: the answers are kept per
 * result object). Run with `npx vitest bench --run tests/core/answers.bench.ts`; the medians are
 * reported in the issue notes, not asserted here. The study answers run in the panel worker.
 */
import { bench, describe } from 'vitest';
import { demoProjects } from '../../core/demos/index.ts';
import { solveAnswers } from '../../core/solve/answers.ts';
import { answerStudies } from '../../core/studies/answers.ts';
import { solvedOf } from './solved.ts';

describe('answers of the demos', () => {
  for (const d of demoProjects) {
    const solved = solvedOf(d.project);
    bench(`solveAnswers, ${d.id} (the strip's part of an edit)`, () => {
      solveAnswers({ result: { ...solved.result } });
    });
    bench(`answerStudies, ${d.id} (in the worker, after the paint)`, () => {
      answerStudies(solved, { pricePerKWh: 0.3, hoursPerYear: 8760 });
    });
  }
});
