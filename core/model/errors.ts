/**
 * Named errors. Every problem names the element (by id, or PROJECT_LEVEL for the project as a whole)
 * and the field, carries the offending value, and has a message a user can act on.
 */

import { elementName, elementWords, fieldLabel, pathWords } from './field-labels.ts';
import type { MessageValue } from './message.ts';

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
  /** A bank on a bus fed from something that is not a DC bus (through cables at most). */
  | 'not-on-bus'
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
  /** The message in SI with sensible digits, naming elements by name and fields by form label. */
  message: string;
  /** The message with holes `{0}` … for `values` (core/model/message.ts); the page renders it in the user's units. */
  template?: string;
  values?: MessageValue[];
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

/**
 * One line per problem, in the user's words: `"3 kW inverter", Efficiency (%): must be …`,
 * `Project, Design margin: must be …`. Given the project (as read, untrusted), the element is named
 * by its name (its kind and place when unnamed) and the field by its form label
 * (core/model/field-labels.ts); without it, by the element's id and the field's path in words.
 */
export function formatProblem(p: Problem, project?: unknown): string {
  const words = project === undefined ? undefined : elementWords(project);
  const kind = p.elementId === PROJECT_LEVEL ? 'project' : words?.kinds.get(p.elementId);
  const where = p.elementId === PROJECT_LEVEL ? 'Project' : elementName(words, p.elementId);
  // A figure that is not finite is a result's field, not one of the form's.
  const field = p.field ? `, ${p.code === 'non-finite' ? pathWords(p.field.split('.')) : fieldLabel(kind, p.field)}` : '';
  return `${where}${field}: ${p.message}`;
}
