/**
 * One of the project's named variants (core/model/variants.ts) turned into the typed change the
 * variant machinery solves (variant.ts `VariantChange`): each `set` merged into a copy of its
 * element (`mergeSet`: plain objects field by field at any depth, so a later edit of the base reaches
 * the fields the variant does not set; null takes a field out; a list or a value replaces), each
 * `swap` put in place of its element, each `remove` taken out with its branch. Only the variant's own ids are checked here (they must name elements of the
 * base; `id` and `kind` are not set but swapped); the changed elements are then checked by their
 * kinds' schemas in variantProject, as a file holding them would be. Nothing is solved from a
 * variant that has any problem: the comparison shows its problems in its column instead.
 */
import type { Element } from '../model/project.ts';
import type { Problem } from '../model/errors.ts';
import type { ProjectVariant } from '../model/variants.ts';
import type { ValidProject } from './validate.ts';
import { solveVariant, type VariantChange } from './variant.ts';
import type { Solved, SolveOutcome } from './solved.ts';
import { withProjectWarnings } from './project-warnings.ts';

export type VariantChangeOutcome = { ok: true; change: VariantChange } | { ok: false; problems: Problem[] };

const FIXED_FIELDS = new Set(['id', 'kind']);

/**
 * The keys that say which form an element's object field takes (its union's discriminating keys), by
 * the field's name: a loss model's `model` (constant, curve, polynomial, fitted polynomial), a motor's
 * power-factor `model`, a conductor's `system` (NEC or IEC tables), a motor start's `method` (a current
 * limit belongs to a soft starter), an IEC 61800-9-2 drive loss's `basis` (the points' order), a
 * bank's `chemistry` (its overrides and float current are that chemistry's). A variant that sets one
 * of them to another value than the base's holds the whole object: it replaces the base's, which is
 * another form whose fields would not fit. `network` (an R, L, C network: each entry is exactly one
 * of its forms) is always replaced whole.
 */
export const VARIANT_FORM_KEYS: Readonly<Record<string, readonly string[]>> = {
  loss: ['model'],
  powerFactor: ['model'],
  conductor: ['system'],
  starting: ['method'],
  standardLoss: ['basis'],
  bank: ['chemistry'],
};
const WHOLE_FIELDS = new Set(['network']);

type Plain = Record<string, unknown>;
const isPlain = (v: unknown): v is Plain => typeof v === 'object' && v !== null && !Array.isArray(v);

/** The object field `field` of an element goes whole: it is a network, or `set` gives it in another form than `base`. */
function goesWhole(field: string, base: Plain, set: Plain): boolean {
  if (WHOLE_FIELDS.has(field)) return true;
  return (VARIANT_FORM_KEYS[field] ?? []).some((k) => set[k] !== undefined && set[k] !== null && set[k] !== base[k]);
}

/** A value as it is stored when nothing is merged under it: the nulls in its objects taken out (null = not given). */
function withoutNulls(value: unknown): unknown {
  if (!isPlain(value)) return value;
  const out: Plain = {};
  for (const [k, v] of Object.entries(value)) if (v !== null) out[k] = withoutNulls(v);
  return out;
}

/** `set` merged into a copy of `base`, field by field: null takes a field out, a plain object merges into a plain object, anything else replaces. */
function mergeObject(base: Plain, set: Plain): Plain {
  const merged: Plain = { ...base };
  for (const [k, v] of Object.entries(set)) {
    if (v === null) delete merged[k];
    else if (isPlain(v) && isPlain(base[k])) merged[k] = mergeObject(base[k], v);
    else merged[k] = withoutNulls(v);
  }
  return merged;
}

/**
 * One element with a variant's fields set on it (see the file's top): each field as `mergeObject`, except
 * that an object field given in another form (`goesWhole`) replaces the base's whole. A variant that
 * holds a whole object (as older files do) overrides each field it holds and keeps the rest of the base's.
 */
export function mergeSet(element: Plain, fields: Plain): Plain {
  const merged: Plain = { ...element };
  for (const [field, value] of Object.entries(fields)) {
    const base = element[field];
    if (value === null) delete merged[field];
    else if (isPlain(value) && isPlain(base) && !goesWhole(field, base, value)) merged[field] = mergeObject(base, value);
    else merged[field] = withoutNulls(value);
  }
  return merged;
}

/** Two stored values alike (numbers, text, lists and objects as the file holds them). */
const same = (a: unknown, b: unknown) => JSON.stringify(a) === JSON.stringify(b);

/** The fields of `after` that differ from `before`, at any depth (null where one was taken out). */
function diffObject(before: Plain, after: Plain): Plain {
  const out: Plain = {};
  for (const k of new Set([...Object.keys(before), ...Object.keys(after)])) {
    const a = before[k];
    const b = after[k];
    if (b === undefined) {
      if (a !== undefined) out[k] = null;
    } else if (isPlain(a) && isPlain(b)) {
      const d = diffObject(a, b);
      if (Object.keys(d).length) out[k] = d;
    } else if (!same(a, b)) out[k] = b;
  }
  return out;
}

/**
 * The `set` of a variant that turns `before` (an element of the base) into `after` (its edited copy):
 * only what changed, at any depth (`bank: { series: 8, strings: 2 }`, `conductor: { size: "50 mm²" }`),
 * null where a field was taken out; an object field whose form changed (`VARIANT_FORM_KEYS`) or a
 * network whole. `mergeSet(before, changedFields(before, after))` gives `after` back, and a later edit of
 * the base's other fields reaches the variant.
 */
export function changedFields(before: Plain, after: Plain): Plain {
  const out: Plain = {};
  for (const k of new Set([...Object.keys(before), ...Object.keys(after)])) {
    if (FIXED_FIELDS.has(k)) continue;
    const a = before[k];
    const b = after[k];
    if (b === undefined) {
      if (a !== undefined) out[k] = null;
    } else if (isPlain(a) && isPlain(b) && !goesWhole(k, a, b)) {
      const d = diffObject(a, b);
      if (Object.keys(d).length) out[k] = d;
    } else if (!same(a, b)) out[k] = b;
  }
  return out;
}

/** The variant as a VariantChange on `base` (see the header), or the problems of its own ids and fields. */
export function variantChangeOf(base: Solved | ValidProject, variant: ProjectVariant): VariantChangeOutcome {
  const project: ValidProject = 'result' in base ? base.project : base;
  const byId = new Map(project.elements.map((e) => [e.id, e]));
  const problems: Problem[] = [];
  const unknown = (id: string, field: string) =>
    problems.push({ code: 'unknown-element', elementId: id, field, value: id, message: `names no element of the project (variant "${variant.name}"): it may have been deleted or renamed since` });
  const replace: Element[] = [];
  const swapped = new Set((variant.swap ?? []).map((e) => e.id));
  for (const [id, fields] of Object.entries(variant.set ?? {})) {
    const element = byId.get(id);
    if (!element) {
      unknown(id, 'id');
      continue;
    }
    if (swapped.has(id)) {
      problems.push({ code: 'invalid-value', elementId: id, field: 'id', value: id, message: `is both swapped and changed in variant "${variant.name}": change the swapped element instead` });
      continue;
    }
    const fixed = Object.keys(fields).filter((field) => FIXED_FIELDS.has(field));
    for (const field of fixed) {
      problems.push({ code: 'invalid-value', elementId: id, field, value: fields[field], message: `cannot be changed by variant "${variant.name}": swap the whole element instead` });
    }
    if (fixed.length) continue;
    replace.push(mergeSet(element as unknown as Plain, fields) as unknown as Element);
  }
  for (const element of variant.swap ?? []) {
    if (!byId.has(element.id)) unknown(element.id, 'id');
    else replace.push(element);
  }
  const remove = new Set<string>();
  for (const id of variant.remove ?? []) {
    if (!byId.has(id)) unknown(id, 'id');
    else remove.add(id);
  }
  if (problems.length) return { ok: false, problems };
  return { ok: true, change: { ...(replace.length ? { replace } : {}), ...(remove.size ? { remove } : {}) } };
}

/** Solve one named variant of a solved project: its ids checked here, its elements by variantProject. */
export function solveProjectVariant(base: Solved | ValidProject, variant: ProjectVariant): SolveOutcome {
  const change = variantChangeOf(base, variant);
  if (!change.ok) return change;
  const solved = solveVariant(base, change.change);
  // A named variant is a project of the user's: it gets the project-level warnings too.
  return solved.ok ? withProjectWarnings(solved) : solved;
}
