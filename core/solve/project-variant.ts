/**
 * One of the project's named variants (core/model/variants.ts) turned into the typed change the
 * variant machinery solves (variant.ts `VariantChange`): each `set` merged into a copy of its
 * element (null takes a field out), each `swap` put in place of its element, each `remove` taken out
 * with its branch. Only the variant's own ids are checked here (they must name elements of the
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
    const merged: Record<string, unknown> = { ...element };
    for (const [field, value] of Object.entries(fields)) {
      if (FIXED_FIELDS.has(field)) {
        problems.push({ code: 'invalid-value', elementId: id, field, value, message: `cannot be changed by variant "${variant.name}": swap the whole element instead` });
        continue;
      }
      if (value === null) delete merged[field];
      else merged[field] = value;
    }
    replace.push(merged as unknown as Element);
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
