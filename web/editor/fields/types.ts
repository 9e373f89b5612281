/**
 * The form descriptors' types: fields, choice groups and a kind's form (plain data the form components render).
 * Part of the form descriptors; web/editor/fields.ts is their entry (today's exports, callers import it).
 */
import type { ElementKind } from '../../../core/page.ts';
import type { Quantity } from '../../format/parse.ts';
import type { UnitSystem } from '../../format/units.ts';

/** An element as the form sees it: plain data, not yet validated. */
export type FormElement = Record<string, unknown>;

/** Display context some choice lists depend on (conductor sizes show the other system's area). */
export interface FormContext {
  units: UnitSystem;
  locale?: string;
}

export interface ChoiceOption {
  value: string | number;
  label: string;
  /** Why the option cannot be chosen; the option is then shown disabled with this reason. */
  disabled?: string;
}

interface FieldBase {
  /** Dotted path inside the element ("loss.efficiency", "conductor.size"). */
  path: string;
  label: string;
  /** One line shown under the field. */
  help?: string;
  required: boolean;
  /** Shown only when this holds (e.g. the output frequency of a converter with an AC output). */
  when?: (e: FormElement) => boolean;
}

export interface NumberSpec extends FieldBase {
  type: 'number';
  quantity: Quantity;
  integer?: boolean;
  /** SI value a new element starts with. */
  default?: number;
  /** SI value that applies when the field is left empty (shown as the input's placeholder). */
  placeholder?: (e: FormElement) => number | undefined;
  /** The unit beside the input when not the quantity's own (a price in the locale's currency). */
  unitText?: (locale: string | undefined) => string;
}

export interface ChoiceSpec extends FieldBase {
  type: 'choice';
  options: readonly ChoiceOption[] | ((e: FormElement, ctx: FormContext) => readonly ChoiceOption[]);
  default?: string | number;
  /**
   * Other fields that must follow this choice (a conductor size missing from the new material's
   * table goes back to "auto"). Runs on a copy of the element, inside one undoable edit.
   */
  follow?: (e: FormElement, value: string | number | undefined) => void;
}

export interface TextSpec extends FieldBase {
  type: 'text';
  multiline?: boolean;
  default?: string;
}

export interface BooleanSpec extends FieldBase {
  type: 'boolean';
  default?: boolean;
}

export interface PointsColumn {
  key: string;
  label: string;
  quantity: Quantity;
}

/** A small table of datasheet points (load fraction and efficiency or power factor). */
export interface PointsSpec extends FieldBase {
  type: 'points';
  columns: readonly PointsColumn[];
  minRows: number;
  default: readonly Record<string, number>[];
  /** The row added by "Add a point", from the rows there are. */
  newRow(rows: readonly Record<string, number>[]): Record<string, number>;
}

/** A circuit network of R, L, C parts (core/physics/network.ts), values as text with SI prefixes. */
export interface NetworkSpec extends FieldBase {
  type: 'network';
  default: unknown;
}

export interface Variant {
  id: string;
  label: string;
  help?: string;
  fields: readonly FieldSpec[];
  /** Replace the group's part of the element with this variant's defaults (mutates a copy). */
  apply(e: FormElement): void;
}

/** One of several ways of giving part of an element. */
export interface GroupSpec {
  type: 'group';
  /** Stable key (used for ids and to match the engine's problems). */
  key: string;
  /** Paths the engine reports this group's "give exactly one of" problems under. */
  paths: readonly string[];
  label: string;
  help?: string;
  variants: readonly Variant[];
  /** The variant the element uses now (undefined when it uses none, e.g. a damaged file). */
  current(e: FormElement): string | undefined;
  when?: (e: FormElement) => boolean;
}

export type FieldSpec = NumberSpec | ChoiceSpec | TextSpec | BooleanSpec | PointsSpec | NetworkSpec | GroupSpec;

export interface KindForm {
  kind: ElementKind;
  fields: readonly FieldSpec[];
}
