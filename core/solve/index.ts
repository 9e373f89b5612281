/**
 * The solve as an ordered list of named steps: validate → plan (order the tree, check port kinds,
 * build models) → sweep (self-consistent operating point), both inside size-conductors (the outer
 * loop that sizes conductor links and re-solves until sizes and resistances settle) → report
 * (ports, totals, balance) → conductor results and whole-path voltage drops.
 * Pure: takes plain data, returns new plain data, mutates nothing.
 */
import type { Project } from '../model/project.ts';
import { ProjectError, type Problem } from '../model/errors.ts';
import type { SolveResult } from '../model/result.ts';
import { validateProject } from './validate.ts';
import { plan } from './plan.ts';
import { buildResult } from './report.ts';
import { attachConductors, sizeConductors } from './size-conductors.ts';
import { nonFiniteProblems } from './finite.ts';

export type SolveOutcome = { ok: true; result: SolveResult } | { ok: false; problems: Problem[] };

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
  // Conductor links get their size and impedance; the chain is solved with them in place.
  const sized = sizeConductors(valid.project);
  if (!sized.ok) return sized;
  const built = buildResult(valid.project.name, sized.order, sized.point);
  if (!built.ok) return built;
  const result = attachConductors(built.result, sized);
  // Last step: a figure that is not finite anywhere refuses the whole result (never a table of NaN).
  const names = new Map(valid.project.elements.map((e) => [e.id, e.name ?? e.id]));
  const notFinite = nonFiniteProblems('The solve', result, names);
  if (notFinite.length) return { ok: false, problems: notFinite };
  return { ok: true, result };
}

/** Like solveProject, but throws a ProjectError listing every problem. */
export function solve(project: Project): SolveResult {
  const outcome = solveProject(project);
  if (!outcome.ok) throw new ProjectError(outcome.problems);
  return outcome.result;
}

export { validateProject };
