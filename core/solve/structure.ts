/**
 * Tree checks that need only each element's id, kind and `from`: unique ids, one source, every
 * `from` naming an element that can feed, no loops. They run on every element whose id and kind
 * can be read, even one whose other fields are bad, so that all problems are reported at once.
 */
import type { ElementKind } from '../model.ts';
import type { Problem } from '../errors.ts';
import { KINDS } from '../stages/index.ts';

/** What the tree checks need of an element. */
export interface Skeleton {
  id: string;
  /** Absent when the kind is not one we know (reported by the field checks). */
  kind?: ElementKind;
  from?: string;
}

/** The skeleton of a raw element, or null when its id cannot be read. */
export function skeletonOf(raw: unknown): Skeleton | null {
  if (typeof raw !== 'object' || raw === null) return null;
  const { id, kind, from } = raw as Record<string, unknown>;
  if (typeof id !== 'string' || id === '') return null;
  const known = typeof kind === 'string' && KINDS.has(kind as ElementKind);
  return { id, ...(known ? { kind: kind as ElementKind } : {}), ...(typeof from === 'string' ? { from } : {}) };
}

const roleOf = (s: Skeleton) => (s.kind === undefined ? undefined : KINDS.get(s.kind)!.role);

export function checkStructure(skeletons: readonly Skeleton[]): Problem[] {
  const problems: Problem[] = [];
  const byId = new Map<string, Skeleton>();
  for (const s of skeletons) {
    if (byId.has(s.id)) {
      problems.push({ code: 'duplicate-id', elementId: s.id, field: 'id', value: s.id, message: 'this id is used by more than one element' });
    } else {
      byId.set(s.id, s);
    }
  }
  const sources = skeletons.filter((s) => roleOf(s) === 'source');
  // An element of unknown kind might have been meant as the source: do not also claim none exists.
  if (sources.length === 0 && skeletons.every((s) => s.kind !== undefined)) {
    problems.push({ code: 'missing-source', elementId: 'project', field: 'elements', message: 'needs one source (grid, generator or battery) to feed the chain' });
  }
  for (const s of sources.slice(1)) {
    problems.push({ code: 'several-sources', elementId: s.id, field: 'kind', value: s.kind!, message: `a chain has one source; "${sources[0]!.id}" is already the source` });
  }
  for (const s of skeletons) {
    if (s.from === undefined) continue;
    const feeder = byId.get(s.from);
    if (!feeder) {
      problems.push({ code: 'unknown-feed', elementId: s.id, field: 'from', value: s.from, message: `no element has the id "${s.from}"` });
    } else if (roleOf(feeder) === 'load') {
      problems.push({ code: 'not-a-feeder', elementId: s.id, field: 'from', value: s.from, message: `"${s.from}" is a load and feeds nothing` });
    }
  }
  // Loops: follow `from` upwards; an element that comes back to itself is on a loop.
  for (const s of skeletons) {
    const path = [s.id];
    let cur = s.from;
    while (cur !== undefined && cur !== s.id && !path.includes(cur)) {
      path.push(cur);
      cur = byId.get(cur)?.from;
    }
    if (cur === s.id) {
      problems.push({ code: 'cycle', elementId: s.id, field: 'from', value: s.from, message: `is part of a loop (${[...path, s.id].join(' → ')}); a chain must be a tree fed from its source` });
    }
  }
  return problems;
}
