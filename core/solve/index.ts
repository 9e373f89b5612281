/**
 * The solve as an ordered list of named steps: validate → plan (order the tree, check port kinds,
 * build models) → sweep (self-consistent operating point) → report (ports, totals, balance).
 * Pure: takes plain data, returns new plain data, mutates nothing.
 */
import type { Project } from '../model.ts';
import { ProjectError, type Problem } from '../errors.ts';
import type { SolveResult } from '../result.ts';
import { validateProject } from './validate.ts';
import { plan } from './plan.ts';
import { sweep } from './sweep.ts';
import { buildResult } from './report.ts';

export type SolveOutcome = { ok: true; result: SolveResult } | { ok: false; problems: Problem[] };

/** Validate and solve a project given as untrusted data (e.g. parsed JSON). Never throws on bad input. */
export function solveProject(input: unknown): SolveOutcome {
  const valid = validateProject(input);
  if (!valid.ok) {
    // Every field is fine and only the tree is wrong: also report the port-kind mismatches.
    const ports = valid.project ? plan(valid.project) : undefined;
    return { ok: false, problems: ports && !ports.ok ? [...valid.problems, ...ports.problems] : valid.problems };
  }
  const planned = plan(valid.project);
  if (!planned.ok) return planned;
  const swept = sweep(planned.order);
  if (!swept.ok) return swept;
  return buildResult(valid.project.name, planned.order, swept.point);
}

/** Like solveProject, but throws a ProjectError listing every problem. */
export function solve(project: Project): SolveResult {
  const outcome = solveProject(project);
  if (!outcome.ok) throw new ProjectError(outcome.problems);
  return outcome.result;
}

export { validateProject };
