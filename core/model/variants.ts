/**
 * Named variants of a project (the file's `variants`): each one a few changes to the base chain —
 * fields of some elements set to other values, whole elements swapped for others of the same id,
 * branches removed — solved side by side with the base (core/solve/project-variant.ts applies one;
 * the comparison reads the solved values). A variant stores only what differs, so an edit of the
 * base reaches every variant.
 */
import type { Element } from './project.ts';

/** Longest list of variants a project keeps (a comparison of more is no longer read side by side). */
export const MAX_VARIANTS = 12;
/** Longest variant name (it heads a column of the comparison). */
export const VARIANT_NAME_MAX = 80;

export interface ProjectVariant {
  /** The variant's name, unique within the project ("48 V system", "50 mm² feeders"). */
  name: string;
  /** What the variant is for, in the planner's words (printed under its name). */
  note?: string;
  /**
   * Fields set on elements of the base, by element id: `{ "bank": { "bank": { "series": 8, "strings": 2 } } }`.
   * An object is merged into the element's own field by field, at any depth, so the fields it does not
   * give stay the base's and follow its later edits; a list or a value replaces. An object given in
   * another form (another loss `model`, conductor `system`, start `method`, drive loss `basis`, bank
   * `chemistry`) replaces the base's whole, as does a `network`. A field set to null is taken out (the
   * element's default applies), at any depth. `id` and `kind` cannot be set: swap the element.
   */
  set?: Record<string, Record<string, unknown>>;
  /** Whole elements put in place of the base's element of the same id (another inverter, another kind). */
  swap?: Element[];
  /** Ids of elements taken out with their branch (critical loads only). */
  remove?: string[];
}
