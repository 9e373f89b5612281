/**
 * The project's variants as the page edits them: the list kept in the project (`variants`, the file
 * format's, core/model/variants.ts), each change written whole through `setField` on the project's
 * own fields, so the engine checks it (a refused list never enters the draft: nothing saved is lost)
 * and it can be undone. Exported and imported with the project: the variants are part of its file.
 */
import { PROJECT_LEVEL, type ProjectVariant } from '../../../core/page.ts';
import { changedFields, mergeSet } from '../../../core/studies/index.ts';
import { draft, setField } from '../../state/editor.ts';

/** The open project's variants (the draft's: what the user edits). */
export function draftVariants(): ProjectVariant[] {
  const list = (draft.value as { variants?: unknown } | null)?.variants;
  return Array.isArray(list) ? (list as ProjectVariant[]) : [];
}

/** A name not yet taken in the list: the name, or the name with " (2)", " (3)", … */
export function freeName(name: string, list: readonly ProjectVariant[]): string {
  const taken = new Set(list.map((v) => v.name));
  if (!taken.has(name)) return name;
  for (let i = 2; ; i++) if (!taken.has(`${name} (${i})`)) return `${name} (${i})`;
}

/** Write the whole list (an empty list takes the key out); returns the refusal, or null. */
export function writeVariants(next: ProjectVariant[], label: string): string | null {
  return setField(PROJECT_LEVEL, 'variants', next.length ? next : undefined, label);
}

export function addVariant(v: ProjectVariant): string | null {
  const list = draftVariants();
  const named = { ...v, name: freeName(v.name, list) };
  return writeVariants([...list, named], `Add variant "${named.name}"`);
}

export function renameVariant(index: number, name: string): string | null {
  const list = draftVariants();
  const v = list[index];
  if (!v) return null;
  const trimmed = name.trim();
  if (trimmed === '') return 'A variant needs a name.';
  if (list.some((x, i) => i !== index && x.name === trimmed)) return `Another variant is already called "${trimmed}".`;
  return writeVariants(list.map((x, i) => (i === index ? { ...x, name: trimmed } : x)), `Rename variant "${v.name}"`);
}

export function noteVariant(index: number, note: string): string | null {
  const list = draftVariants();
  const v = list[index];
  if (!v) return null;
  const { note: _old, ...rest } = v;
  const next = note.trim() === '' ? rest : { ...rest, note };
  return writeVariants(list.map((x, i) => (i === index ? next : x)), `Note on variant "${v.name}"`);
}

export function deleteVariant(index: number): string | null {
  const list = draftVariants();
  const v = list[index];
  if (!v) return null;
  return writeVariants(list.filter((_, i) => i !== index), `Delete variant "${v.name}"`);
}

/** The element as a variant has it: the plan's element with the variant's fields for it set (core's `mergeSet`). */
export function variantElement(element: Record<string, unknown>, variant: ProjectVariant): Record<string, unknown> {
  const fields = variant.set?.[String(element['id'])];
  return fields ? mergeSet(element, fields as Record<string, unknown>) : element;
}

/** The variants a change of this element can be added to: those that do not swap it whole (a swap and a change of one element are refused). */
export function variantsChanging(elementId: string, list: readonly ProjectVariant[]): number[] {
  return list.flatMap((v, i) => ((v.swap ?? []).some((e) => e.id === elementId) ? [] : [i]));
}

/**
 * A change added to an existing variant: its `set` for the element becomes `fields` (what the element as
 * the variant has it, with the new change made, differs from the plan's by: `fieldChange` or
 * `editedChange` from the variant's element), so the variant keeps its other changes of that element and
 * of the others; returns the refusal, or null.
 */
export function changeInVariant(index: number, elementId: string, fields: Record<string, unknown>): string | null {
  const list = draftVariants();
  const v = list[index];
  if (!v) return null;
  const set = { ...(v.set ?? {}) };
  if (Object.keys(fields).length) set[elementId] = fields;
  else delete set[elementId];
  const { set: _old, ...rest } = v;
  const next: ProjectVariant = Object.keys(set).length ? { ...rest, set } : rest;
  return writeVariants(list.map((x, i) => (i === index ? next : x)), `Change variant "${v.name}"`);
}

/**
 * The `set` of a variant that changes one field of one element (a dotted path such as "loss.efficiency"
 * or "standardLoss.points.3"): only that value (`{ loss: { efficiency: 0.96 } }`; a list whole), so a
 * later edit of the element's other fields in the plan reaches the variant (core's `changedFields`).
 * `from`: the element as a variant has it, when the change joins that variant's (`variantElement`).
 */
export function fieldChange(element: Record<string, unknown>, path: string, value: unknown, from: Record<string, unknown> = element): Record<string, unknown> {
  const copy = structuredClone(from);
  setAtPath(copy, path, value);
  return changedFields(element, copy);
}

/**
 * The `set` of a variant that makes an edit on a copy of one element (a choice field set, what must
 * follow it, or another way of describing a part of it applied): each field the edit changed, at any
 * depth, set to its new value, each it took out set to null (the element's default applies); a part
 * described another way (another loss model, the other conductor table) is set whole (core's
 * `changedFields`). `from` as in `fieldChange`.
 */
export function editedChange(element: Record<string, unknown>, edit: (copy: Record<string, unknown>) => void, from: Record<string, unknown> = element): Record<string, unknown> {
  const copy = structuredClone(from);
  edit(copy);
  return changedFields(element, copy);
}

/** Set (or, with undefined, take out) the value at a dotted path of an element's copy. */
export function setAtPath(e: Record<string, unknown>, path: string, value: unknown): void {
  const keys = path.split('.');
  let at = e;
  for (const k of keys.slice(0, -1)) {
    if (typeof at[k] !== 'object' || at[k] === null) at[k] = {};
    at = at[k] as Record<string, unknown>;
  }
  const last = keys[keys.length - 1]!;
  if (value === undefined) delete at[last];
  else at[last] = value;
}
