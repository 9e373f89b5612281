/**
 * Named errors. Every problem names the element (by id, or "project") and the field, carries the
 * offending value, and has a message a user can act on.
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

export interface Problem {
  code: ProblemCode;
  /** Element id, or "project" for problems of the whole file. */
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
  const where = p.elementId === 'project' ? 'project' : `element "${p.elementId}"`;
  const field = p.field ? `, field "${p.field}"` : '';
  return `${where}${field}: ${p.message}`;
}
