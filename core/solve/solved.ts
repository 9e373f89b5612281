/**
 * The solved value and the solve past validation (shared by solveProject in index.ts and
 * solveVariant in variant.ts; neither imports the other's file).
 */
import type { Problem } from '../model/errors.ts';
import type { SolveResult } from '../model/result.ts';
import type { ValidProject } from './validate.ts';
import { buildResult } from './report.ts';
import { attachConductors, sizeConductors } from './size-conductors.ts';
import { findNonFinite, nonFiniteProblems, resultMayHoldNonFinite } from './finite.ts';

/** A solved project: the validated, normalised project and its result, which came from it and nothing else. */
export interface Solved {
  ok: true;
  project: ValidProject;
  result: SolveResult;
}

export type SolveOutcome = Solved | { ok: false; problems: Problem[] };

/**
 * The solve past validation, for a project that is valid by its type (validateProject's output, or
 * a variant built by variant.ts). Not exported from core's public
 * API: the entries are solveProject and solveVariant. `reuseModels` (core/solve/plan.ts): the
 * elements' models are kept for the next solve of the same elements (a variant's), and those kept
 * are used; solveProject, whose elements come fresh from validation, passes false.
 */
export function solveValid(project: ValidProject, reuseModels = true): SolveOutcome {
  // Conductor links get their size and impedance; the chain is solved with them in place.
  const sized = sizeConductors(project, undefined, reuseModels);
  if (!sized.ok) return sized;
  const built = buildResult(project.name, sized.order, sized.point);
  if (!built.ok) return built;
  const result = attachConductors(built.result, sized);
  // Last step: a figure that is not finite anywhere refuses the whole result (never a table of NaN).
  // (The result's figures are read by name first; the full walk, and the names, only for a result
  // that may hold such a figure.)
  if (resultMayHoldNonFinite(result) && findNonFinite(result, 1).length) {
    const names = new Map(project.elements.map((e) => [e.id, e.name ?? e.id]));
    return { ok: false, problems: nonFiniteProblems('The solve', result, names) };
  }
  return { ok: true, project, result };
}

