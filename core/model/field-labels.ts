/**
 * The words users read for the file format's fields: the form label of every field of every kind
 * (and of the project's own fields and study settings), one table the engine's messages and the
 * page's forms share. The forms (web/editor/fields/) show these labels; tests/web/field-labels.test.ts
 * checks that every form field's label is the one here, so a label is changed in one place for both.
 * Keys are the fields' paths inside the element ("loss.efficiency"); a path that is a group of
 * fields (a loss model given one of several ways) carries the group's label.
 *
 * `Problem.field` stays the machine path (the page marks the field with it); messages and the CLI
 * word it with `fieldLabel`.
 */
import type { ElementKind } from './project.ts';
import { ELEMENT_FIELD_LABELS, KIND_LABELS } from './kind-labels.ts';
import { PROJECT_FIELD_LABELS } from './project-labels.ts';

// The tables live by topic: the kinds' names and fields in kind-labels.ts, the project's own in project-labels.ts.
export { KIND_LABELS, ELEMENT_FIELD_LABELS, PROJECT_FIELD_LABELS };

/** Form labels per kind (and "project" for the project's own fields and study settings). */
export const FIELD_LABELS: Readonly<Record<ElementKind | 'project', Readonly<Record<string, string>>>> = { ...ELEMENT_FIELD_LABELS, project: PROJECT_FIELD_LABELS };

/** Labels of the element base's fields that every kind has beside its own (core/model/element-base.ts). */
const ELEMENT_BASE_LABELS: Readonly<Record<string, string>> = {
  price: 'Purchase price',
};

/** Words for the keys no form shows (list entries, parts of a field): "loadFraction" → "load fraction". */
const KEY_WORDS: Readonly<Record<string, string>> = {
  loadFraction: 'load fraction',
  p0: 'no-load loss',
  k1: 'linear loss term',
  k2: 'resistive loss term',
  // The power-factor correction's request (the CLI's --correct-pf, the machines panel's form).
  at: 'element to correct',
  targetPowerFactor: 'target power factor',
};

/** A path users have no label for, in plain words: `segments.0.loads` → "segments item 1 loads". */
export function pathWords(path: readonly string[]): string {
  return path
    .map((key) => (/^\d+$/.test(key) ? `item ${Number(key) + 1}` : (Object.hasOwn(KEY_WORDS, key) ? KEY_WORDS[key] : undefined) ?? key.replace(/([a-z0-9])([A-Z])/g, '$1 $2').toLowerCase()))
    .join(' ');
}

/**
 * The label of a field as the form shows it: the longest labelled path the field starts with, then
 * the rest in words ("Datasheet points, item 2 load fraction"). `kind` is the element's kind, or
 * "project" for the project's own fields; an unknown kind or path gives the path in words.
 */
export function fieldLabel(kind: string | undefined, field: string): string {
  const parts = field.split('.');
  const table = kind !== undefined && Object.hasOwn(FIELD_LABELS, kind) ? FIELD_LABELS[kind as ElementKind] : undefined;
  if (table) {
    for (let n = parts.length; n > 0; n--) {
      const path = parts.slice(0, n).join('.');
      if (Object.hasOwn(table, path)) return n === parts.length ? table[path]! : `${table[path]!}, ${pathWords(parts.slice(n))}`;
    }
    if (kind !== 'project' && Object.hasOwn(ELEMENT_BASE_LABELS, field)) return ELEMENT_BASE_LABELS[field]!;
  }
  return pathWords(parts);
}

/** The trade name of a kind; an unknown kind is shown as given. */
export function kindLabel(kind: string): string {
  return Object.hasOwn(KIND_LABELS, kind) ? KIND_LABELS[kind as ElementKind] : kind;
}

const isRecord = (v: unknown): v is Record<string, unknown> => typeof v === 'object' && v !== null && !Array.isArray(v);

/** How messages name the elements of a project given as untrusted data. */
export interface ElementWords {
  /** id → the element's name, or its kind's label and place ("Inverter #4") when it has none. */
  readonly names: ReadonlyMap<string, string>;
  /** id → kind (for field labels). */
  readonly kinds: ReadonlyMap<string, string>;
}

/** The words for every element of a project (ids that cannot be read are left out). */
export function elementWords(project: unknown): ElementWords {
  const names = new Map<string, string>();
  const kinds = new Map<string, string>();
  const elements = isRecord(project) ? project['elements'] : undefined;
  if (Array.isArray(elements)) {
    elements.forEach((e, i) => {
      if (!isRecord(e) || typeof e['id'] !== 'string') return;
      const kind = typeof e['kind'] === 'string' ? e['kind'] : undefined;
      if (kind !== undefined) kinds.set(e['id'], kind);
      const name = typeof e['name'] === 'string' && e['name'].trim() !== '' ? e['name'] : `${kind !== undefined ? kindLabel(kind) : 'Element'} #${i + 1}`;
      if (!names.has(e['id'])) names.set(e['id'], name);
    });
  }
  return { names, kinds };
}

/** An element as a message names it: its name in quotes, else its id (a project that could not be read). */
export function elementName(words: ElementWords | undefined, id: string): string {
  return `"${words?.names.get(id) ?? id}"`;
}
