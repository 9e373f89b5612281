/** Pure reads of a draft's tree: names, children, the source, fresh ids, a branch's ids. */
import type { DraftElement, DraftProject } from './draft.ts';
import { FILE_LIMITS } from '../storage/limits.ts';

export function elementName(project: DraftProject, id: string): string {
  const e = project.elements.find((x) => x.id === id);
  return (e && typeof e.name === 'string' && e.name) || id;
}

/** Elements fed by `id`, in their display order (the order of the elements list). */
export function childrenOf(project: DraftProject, id: string): DraftElement[] {
  return project.elements.filter((e) => e.from === id);
}

/** The element with no feeder (the source), if exactly one can be told. */
export function rootOf(project: DraftProject): DraftElement | undefined {
  return project.elements.find((e) => e.from === undefined);
}

/** A fresh id, unique in the project, made from a base ("inverter" → "inverter-2"). */
export function freshId(project: DraftProject, base: string, taken: Set<string> = new Set()): string {
  const used = new Set([...project.elements.map((e) => e.id), ...taken]);
  const stem = base.replace(/-\d+$/, '') || 'stage';
  if (!used.has(stem) && stem.length <= FILE_LIMITS.maxIdLength) return stem;
  // An id stays within the file's limit, however long the one it was made from.
  for (let n = 2; ; n++) {
    const suffix = `-${n}`;
    const id = `${stem.slice(0, FILE_LIMITS.maxIdLength - suffix.length)}${suffix}`;
    if (!used.has(id)) return id;
  }
}

/** The ids of an element and everything downstream of it. */
export function subtreeIds(project: DraftProject, id: string): string[] {
  const out: string[] = [];
  const seen = new Set<string>();
  const walk = (at: string) => {
    if (seen.has(at)) return; // a loop in a damaged file: do not walk forever
    seen.add(at);
    out.push(at);
    for (const c of childrenOf(project, at)) walk(c.id);
  };
  walk(id);
  return out;
}
