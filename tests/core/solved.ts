/**
 * Test helper: run a study on a project given as plain data, as the CLI and the page do — solve it
 * once (core/solve), hand the solved value to the study; a project the solve refuses gives the
 * solve's problems, in the study's outcome shape ({ ok: false, problems }).
 */
import { solveProject, type Solved } from '../../core/solve/index.ts';
import type { Problem } from '../../core/model/errors.ts';

export function solvedOf(input: unknown): Solved {
  const s = solveProject(input);
  if (!s.ok) throw new Error(`the project does not solve: ${s.problems.map((p) => `${p.elementId} ${p.field}: ${p.message}`).join('; ')}`);
  return s;
}

export function onSolved<A extends unknown[], R>(study: (solved: Solved, ...rest: A) => R, input: unknown, ...rest: A): R | { ok: false; problems: Problem[] } {
  const s = solveProject(input);
  return s.ok ? study(s, ...rest) : { ok: false, problems: s.problems };
}
