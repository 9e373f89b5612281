/**
 * The project's variants as the page edits them: the list kept in the project (`variants`, the file
 * format's, core/model/variants.ts), each change written whole through `setField` on the project's
 * own fields, so the engine checks it (a refused list never enters the draft: nothing saved is lost)
 * and it can be undone. Exported and imported with the project: the variants are part of its file.
 */
import { PROJECT_LEVEL, type ProjectVariant } from '../../../core/page.ts';
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

/**
 * The `set` of a variant that changes one field of one element: a field at the element's top level is
 * set as it is; a field inside an object ("loss.efficiency") sets a copy of that whole object with the
 * one value changed (a variant sets an element's top-level fields).
 */
export function fieldChange(element: Record<string, unknown>, path: string, value: unknown): Record<string, unknown> {
  const keys = path.split('.');
  const top = keys[0]!;
  if (keys.length === 1) return { [top]: value };
  const copy = structuredClone(element[top] ?? {}) as Record<string, unknown>;
  let at = copy;
  for (const k of keys.slice(1, -1)) {
    if (typeof at[k] !== 'object' || at[k] === null) at[k] = {};
    at = at[k] as Record<string, unknown>;
  }
  at[keys[keys.length - 1]!] = value;
  return { [top]: copy };
}
