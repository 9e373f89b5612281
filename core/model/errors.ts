/**
 * Named errors. Every problem names the element (by id, or PROJECT_LEVEL for the project as a whole)
 * and the field, carries the offending value, and has a message a user can act on.
 */

export type ProblemCode =
  | 'invalid-value'
  | 'unknown-kind'
  | 'missing-source'
  | 'several-sources'
  | 'unknown-feed'
  | 'duplicate-id'
  | 'cycle'
  | 'kind-mismatch'
  | 'not-a-feeder'
  | 'infeasible-load'
  | 'no-convergence'
  // Battery sizing and recharge (core/studies/backup/sizing.ts, recharge.ts).
  | 'unknown-chemistry'
  | 'outside-table'
  | 'no-feasible-bank'
  | 'charger-too-small'
  | 'charge-too-cold'
  | 'not-achievable'
  /** Conductor sizing (core/conductors/): no listed size meets the current, protection or drop limit. */
  | 'no-size-fits'
  /** Power-factor correction (core/studies/pf/correction.ts): no element has the id asked for. */
  | 'unknown-element'
  /** Power-factor correction: the interface is DC, a shaft, leading already or draws no power. */
  | 'not-correctable'
  /** A computed figure is not a finite number (NaN, ±Infinity): the result is refused (core/solve/finite.ts). */
  | 'non-finite';

/**
 * The `elementId` of a problem about the project as a whole (its name, its study settings, the file),
 * and the owner the page writes the project's own fields with: setField(PROJECT_LEVEL, 'name', …).
 * The empty text, because no element can carry it: an element id must not be empty
 * (core/kinds/spec.ts idField), and an element whose id cannot be read is named by its place ("#3").
 * So an element may be called "project" and still be told apart from the project. Messages keep
 * saying "project" in words (formatProblem, the page's problem list).
 */
export const PROJECT_LEVEL = '';

export interface Problem {
  code: ProblemCode;
  /** Element id, or PROJECT_LEVEL for problems of the project as a whole (its own fields, the file). */
  elementId: string;
  /** Field path inside the element, e.g. "loss.efficiency" ("" when the element as a whole). */
  field: string;
  value?: unknown;
  message: string;
}

/** Thrown (or returned) when a project cannot be solved as given. Nothing is computed from it. */
export class ProjectError extends Error {
  readonly problems: readonly Problem[];
  constructor(problems: readonly Problem[]) {
    super(problems.map(formatProblem).join('\n'));
    this.name = 'ProjectError';
    this.problems = problems;
  }
}

/** One line per problem: `element "inv1", field "loss.efficiency": must be …`. */
export function formatProblem(p: Problem): string {
  const where = p.elementId === PROJECT_LEVEL ? 'project' : `element "${p.elementId}"`;
  const field = p.field ? `, field "${p.field}"` : '';
  return `${where}${field}: ${p.message}`;
}
