/**
 * Tree checks that need only each element's id, kind and `from`: ids that are not reserved words,
 * unique ids, one source, every `from` naming an element that can feed, no loops. They run on every
 * element whose id and kind can be read, even one whose other fields are bad, so that all problems
 * are reported at once.
 *
 * Cost: linear in the number of elements (one Map of ids; the loop search visits each element
 * once, without recursion), so a chain of thousands of elements, deep or wide, is checked at once.
 */
import type { ElementKind } from '../model/project.ts';
import type { Problem } from '../model/errors.ts';
import { PROJECT_LEVEL } from '../model/errors.ts';
import { KINDS } from '../kinds/index.ts';

/** What the tree checks need of an element. */
export interface Skeleton {
  id: string;
  /** The name users gave it (messages name elements by it), when it has one. */
  name?: string;
  /** Absent when the kind is not one we know (reported by the field checks). */
  kind?: ElementKind;
  from?: string;
}

/**
 * Ids an element may not take: the names every plain JavaScript object already answers to
 * (`__proto__`, `constructor`, `toString`, `hasOwnProperty` …). An element so named would be
 * confused with them wherever an id is looked up in a plain object (a file's load levels keyed by
 * id, a record on another program's side), so such an id is refused. The list is the standard
 * one (ECMAScript, Properties of the Object Prototype Object) together with whatever names this
 * engine's Object.prototype carries.
 */
export const RESERVED_IDS: ReadonlySet<string> = new Set([
  '__proto__',
  '__defineGetter__',
  '__defineSetter__',
  '__lookupGetter__',
  '__lookupSetter__',
  'constructor',
  'hasOwnProperty',
  'isPrototypeOf',
  'propertyIsEnumerable',
  'toLocaleString',
  'toString',
  'valueOf',
  ...Object.getOwnPropertyNames(Object.prototype),
]);

/** The problem for a reserved id, or null. */
export function reservedIdProblem(id: string, elementId: string): Problem | null {
  if (!RESERVED_IDS.has(id)) return null;
  return {
    code: 'invalid-value',
    elementId,
    field: 'id',
    value: id,
    message: `the id ${JSON.stringify(id)} is a reserved name (programs that read the project file would take it for one of their own): choose another id`,
  };
}

/** The skeleton of a raw element, or null when its id cannot be read. */
export function skeletonOf(raw: unknown): Skeleton | null {
  if (typeof raw !== 'object' || raw === null) return null;
  const r = raw as Record<string, unknown>;
  // Own fields only: an element given as a plain object never inherits an id, kind or feed.
  const own = (key: string): unknown => (Object.hasOwn(r, key) ? r[key] : undefined);
  const id = own('id');
  const kind = own('kind');
  const from = own('from');
  const name = own('name');
  if (typeof id !== 'string' || id === '') return null;
  const known = typeof kind === 'string' && KINDS.has(kind as ElementKind);
  return {
    id,
    ...(typeof name === 'string' && name !== '' ? { name } : {}),
    ...(known ? { kind: kind as ElementKind } : {}),
    ...(typeof from === 'string' ? { from } : {}),
  };
}

/** What an element is in the tree: its kind's role, or its `fedRole` when a source kind is fed (a bank on a bus). */
const roleOf = (s: Skeleton) => {
  if (s.kind === undefined) return undefined;
  const spec = KINDS.get(s.kind)!;
  return s.from !== undefined && spec.fedRole !== undefined ? spec.fedRole : spec.role;
};

/** An element as messages name it: by its name, by its id only when it has none (the file's own handle then). */
const label = (s: Skeleton) => `"${s.name ?? s.id}"`;

/** Names listed in a loop's message before "… n more". */
const LOOP_NAMES_SHOWN = 4;

/** The words for a loop: its first few elements by name, in feeding order upwards, back to the first. */
function loopWords(loop: readonly Skeleton[]): string {
  const shown = loop.slice(0, LOOP_NAMES_SHOWN).map(label);
  const more = loop.length - shown.length;
  return [...shown, ...(more > 0 ? [`… ${more} more`] : []), label(loop[0]!)].join(' → ');
}

export function checkStructure(skeletons: readonly Skeleton[]): Problem[] {
  const problems: Problem[] = [];
  const byId = new Map<string, Skeleton>();
  for (const s of skeletons) {
    const reserved = reservedIdProblem(s.id, s.id);
    if (reserved) problems.push(reserved);
    if (byId.has(s.id)) {
      problems.push({ code: 'duplicate-id', elementId: s.id, field: 'id', value: s.id, message: 'this id is used by more than one element' });
    } else {
      byId.set(s.id, s);
    }
  }
  const sources = skeletons.filter((s) => roleOf(s) === 'source');
  // An element of unknown kind might have been meant as the source: do not also claim none exists.
  if (sources.length === 0 && skeletons.every((s) => s.kind !== undefined)) {
    problems.push({ code: 'missing-source', elementId: PROJECT_LEVEL, field: 'elements', message: 'needs one source (grid, generator or battery) to feed the chain' });
  }
  for (const s of sources.slice(1)) {
    problems.push({ code: 'several-sources', elementId: s.id, field: 'kind', value: s.kind!, message: `a chain has one source; ${label(sources[0]!)} is already the source` });
  }
  for (const s of skeletons) {
    if (s.from === undefined) continue;
    const feeder = byId.get(s.from);
    if (!feeder) {
      problems.push({ code: 'unknown-feed', elementId: s.id, field: 'from', value: s.from, message: `no element has the id "${s.from}"` });
    } else if (roleOf(feeder) === 'load') {
      problems.push({ code: 'not-a-feeder', elementId: s.id, field: 'from', value: s.from, message: `${label(feeder)} is a load and feeds nothing` });
    }
  }
  problems.push(...loopProblems(skeletons, byId));
  problems.push(...bankOnBusProblems(skeletons, byId));
  return problems;
}

/**
 * A bank on a bus (a source kind with a `fedRole`, fed): it must hang on a DC bus, directly or
 * through cables only (the path core/solve/modes.ts turns round when the supply is cut), and a
 * project holds one (the on-battery mode has one root). Walks stop at a loop (reported above).
 */
function bankOnBusProblems(skeletons: readonly Skeleton[], byId: ReadonlyMap<string, Skeleton>): Problem[] {
  const problems: Problem[] = [];
  const banks = skeletons.filter((s) => s.from !== undefined && s.kind !== undefined && KINDS.get(s.kind)!.fedRole !== undefined);
  for (const b of banks.slice(1)) {
    problems.push({ code: 'several-sources', elementId: b.id, field: 'from', value: b.from, message: `a project holds one bank on a bus; ${label(banks[0]!)} is already on one` });
  }
  for (const b of banks) {
    const seen = new Set<string>([b.id]);
    let at = b.from === undefined ? undefined : byId.get(b.from);
    while (at !== undefined && at.kind === 'cable' && at.from !== undefined && !seen.has(at.id)) {
      seen.add(at.id);
      at = byId.get(at.from);
    }
    if (at === undefined || seen.has(at.id)) continue; // an unknown feed or a loop: reported above
    if (at.kind !== 'dc-bus') {
      problems.push({ code: 'not-on-bus', elementId: b.id, field: 'from', value: b.from, message: `a bank on a bus must be fed from a DC bus, directly or through cables; ${label(at)} is not a DC bus` });
    }
  }
  return problems;
}

/**
 * Loops: follow `from` upwards from each element in file order, marking every element passed with
 * the walk that reached it first. A walk that meets an element of an earlier walk stops (whatever
 * lies above was settled then); a walk that meets its own mark has closed a loop. Each element is
 * passed once, so the search is linear; each loop is reported once, on its first element in file
 * order, naming a few of its elements and how many more there are.
 */
function loopProblems(skeletons: readonly Skeleton[], byId: ReadonlyMap<string, Skeleton>): Problem[] {
  const walkOf = new Map<string, number>();
  const fileOrder = new Map<string, number>();
  skeletons.forEach((s, i) => {
    if (!fileOrder.has(s.id)) fileOrder.set(s.id, i);
  });
  const problems: Problem[] = [];
  skeletons.forEach((start, walk) => {
    if (walkOf.has(start.id)) return;
    const path: Skeleton[] = [];
    let cur: Skeleton | undefined = byId.get(start.id) === start ? start : undefined;
    while (cur !== undefined && !walkOf.has(cur.id)) {
      walkOf.set(cur.id, walk);
      path.push(cur);
      cur = cur.from === undefined ? undefined : byId.get(cur.from);
    }
    if (cur === undefined || walkOf.get(cur.id) !== walk) return;
    // `cur` is on this walk's path: the loop runs from it to the path's end.
    const cycle = path.slice(path.indexOf(cur));
    let first = 0;
    cycle.forEach((s, k) => {
      if (fileOrder.get(s.id)! < fileOrder.get(cycle[first]!.id)!) first = k;
    });
    const loop = [...cycle.slice(first), ...cycle.slice(0, first)];
    const head = loop[0]!;
    const size = loop.length === 1 ? 'is fed from itself, a loop of one element' : `is part of a loop of ${loop.length} elements (${loopWords(loop)})`;
    problems.push({ code: 'cycle', elementId: head.id, field: 'from', value: head.from, message: `${size}; a chain must be a tree fed from its source` });
  });
  return problems;
}
