/**
 * The solve as an ordered list of named steps: validate → plan (order the tree, check port kinds,
 * build models) → sweep (self-consistent operating point), both inside size-conductors (the outer
 * loop that sizes conductor links and re-solves until sizes and resistances settle) → report
 * (ports, totals, balance) → conductor results and whole-path voltage drops.
 * Pure: takes plain data, returns new plain data, mutates nothing.
 *
 * `solveProject` returns one solved value, `Solved` = { ok, project, result }: the validated,
 * normalised project (format 2) beside its result. Every study takes that value and never validates
 * or solves the base case again; a study that must solve a changed chain does it from the solved
 * project through `solveVariant` (variant.ts, imported from there: the page's first load, which
 * solves only the base case, does not carry it), which skips the whole-project validation.
 */
import type { Project } from '../model/project.ts';
import { ProjectError } from '../model/errors.ts';
import type { SolveResult } from '../model/result.ts';
import { validateProject, type ValidProject } from './validate.ts';
import { plan } from './plan.ts';
import { countSolveStep } from './count.ts';
import { solveValid, type Solved, type SolveOutcome } from './solved.ts';
import { withProjectWarnings } from './project-warnings.ts';

/** Validate and solve a project given as untrusted data (e.g. parsed JSON). Never throws on bad input. */
export function solveProject(input: unknown): SolveOutcome {
  const valid = validateProject(input);
  if (!valid.ok) {
    // Every field is fine and only the tree is wrong: also report the port-kind mismatches. Not with
    // two elements of one id: the plan would take the second's children as the first's, build a
    // stage fed by a load's missing port, or walk a loop without end (found by tests/properties/hostile.test.ts).
    const ports = valid.project && !valid.problems.some((p) => p.code === 'duplicate-id') ? plan(valid.project) : undefined;
    return { ok: false, problems: ports && !ports.ok ? [...valid.problems, ...ports.problems] : valid.problems };
  }
  countSolveStep('solves');
  // Fresh from validation, these elements are solved once here: no models kept (core/solve/plan.ts).
  const solved = solveValid(valid.project, false);
  // The warnings about the project as a whole (core/solve/project-warnings.ts).
  return solved.ok ? withProjectWarnings(solved) : solved;
}

/** Like solveProject, but throws a ProjectError listing every problem. */
export function solve(project: Project): SolveResult {
  const outcome = solveProject(project);
  if (!outcome.ok) throw new ProjectError(outcome.problems);
  return outcome.result;
}

export { validateProject, type ValidProject, type Solved, type SolveOutcome };
