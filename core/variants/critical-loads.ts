/**
 * Critical loads against the whole site: the loads the user marks as not critical are taken out
 * (each with its branch), so the comparison shows what the chain, the bank and its runtime are for
 * the critical loads alone.
 */
import { PROJECT_LEVEL, type Problem } from '../model/errors.ts';
import type { Element, Project } from '../model/project.ts';
import { elementWords } from '../model/field-labels.ts';
import type { QuickVariantOutcome } from './types.ts';

/** The elements below `id` (its branch, itself first). */
function branch(elements: readonly Element[], id: string): string[] {
  const out = [id];
  for (let i = 0; i < out.length; i++) {
    for (const e of elements) if ('from' in e && e.from === out[i]) out.push(e.id);
  }
  return out;
}

/** The variant without the loads (or branches) the user marks as not critical, or why it does not apply. */
export function criticalLoadsVariant(project: Pick<Project, 'elements'>, notCritical: readonly string[]): QuickVariantOutcome {
  const { names } = elementWords(project);
  const problems: Problem[] = [];
  const byId = new Map(project.elements.map((e) => [e.id, e]));
  const removed = new Set<string>();
  for (const id of notCritical) {
    const e = byId.get(id);
    if (!e) problems.push({ code: 'unknown-element', elementId: id, field: 'id', value: id, message: 'names no element of the project: pick the loads that are not critical from the chain' });
    else if (!('from' in e) || e.from === undefined) problems.push({ code: 'invalid-value', elementId: id, field: 'id', value: id, message: `"${names.get(id) ?? id}" is the chain's source: it cannot be left out` });
    else for (const b of branch(project.elements, id)) removed.add(b);
  }
  if (!problems.length && removed.size === 0) problems.push({ code: 'invalid-value', elementId: PROJECT_LEVEL, field: 'variants', value: [], message: 'pick at least one load that is not critical' });
  if (problems.length) return { ok: false, problems };
  const left = project.elements.filter((e) => !removed.has(e.id));
  // A chain needs a load at its end: leaving none out of the whole site is no comparison.
  const leaves = left.filter((e) => !left.some((c) => 'from' in c && c.from === e.id));
  if (leaves.length === 1 && !('from' in leaves[0]! && leaves[0].from !== undefined)) {
    return { ok: false, problems: [{ code: 'invalid-value', elementId: PROJECT_LEVEL, field: 'variants', value: [...notCritical], message: 'every load would be left out: keep at least one critical load' }] };
  }
  const picked = notCritical.map((id) => names.get(id) ?? id);
  return {
    ok: true,
    variant: {
      name: 'Critical loads only',
      note: `without ${picked.join(', ')} (marked not critical)`,
      // Each branch whole: the variant machinery takes out exactly the ids listed.
      remove: project.elements.filter((e) => removed.has(e.id)).map((e) => e.id),
    },
  };
}
