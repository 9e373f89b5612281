/**
 * The chain operations (new project, add a branch, insert before or after, remove, duplicate, move,
 * reorder, reattach), each one undoable edit of the draft; a refusal says why in a sentence (also
 * the last change, for the live region). Each keeps to the project file's element limit.
 */
import { PROJECT_VERSION } from '../../core/page.ts';
import { FILE_LIMITS, withSuffix } from '../storage/limits.ts';
import { clone, draft, edit, lastChange, loadProject, selectedId, type DraftElement, type DraftProject } from './draft.ts';
import { elementsWords } from './draft-limits.ts';
import { elementKindLabel } from '../format/labels.ts';
import { childrenOf, elementName, freshId, subtreeIds } from './tree.ts';

/** Result of a chain operation: done, or refused with a sentence saying why. */
export type OperationOutcome = { ok: true } | { ok: false; message: string };

function refuse(message: string): OperationOutcome {
  lastChange.value = message;
  return { ok: false, message };
}

/**
 * A new element's name: its kind's word in sentence case ("Motor", "DC–DC converter", without a
 * bracketed note such as "(VA)"), with a number when another element already has it ("Motor 2").
 */
export function freshName(project: DraftProject, kind: string): string {
  const base = elementKindLabel(kind).replace(/\s*\(.*\)$/, '') || 'Stage';
  // Compared without case: an older element shown by its id "motor" takes "Motor" too.
  const used = new Set(project.elements.map((e) => (typeof e.name === 'string' && e.name ? e.name : e.id).toLowerCase()));
  if (!used.has(base.toLowerCase())) return base;
  for (let n = 2; ; n++) if (!used.has(`${base} ${n}`.toLowerCase())) return `${base} ${n}`;
}

/** The element with an id unique in the project (made as before) and, when it has none, a name after its kind. */
function withFreshId(project: DraftProject, element: DraftElement): DraftElement {
  const named = typeof element.name === 'string' && element.name ? {} : { name: freshName(project, element.kind) };
  return { ...clone(element), ...named, id: freshId(project, element.id || element.kind) };
}

/** Start a new project from scratch with its source. */
export function newProject(name: string, source: DraftElement): void {
  const { from: _from, ...rest } = source;
  // A project name the file holds (the new-chain box has no length limit of its own).
  const named = withSuffix(name, '', FILE_LIMITS.maxProjectNameLength);
  loadProject(
    { format: 'joulepath-project', version: PROJECT_VERSION, name: named, elements: [rest as DraftElement] },
    { kind: 'new', title: named },
  );
  selectedId.value = source.id;
}

/** Add `element` as a new branch fed from `parentId`. */
export function addBranch(parentId: string, element: DraftElement): OperationOutcome {
  const p = draft.value;
  if (!p) return refuse('No project is open.');
  if (!p.elements.some((e) => e.id === parentId)) return refuse(`There is no element "${parentId}".`);
  const room = roomFor(p, 1);
  if (!room.ok) return room;
  const added = { ...withFreshId(p, element), from: parentId };
  const notDone = edit(`Added ${added.name || added.id}`, (x) => {
    x.elements.push(added);
  }, { select: added.id });
  return notDone ? { ok: false, message: notDone } : { ok: true };
}

/**
 * Insert `element` right after `afterId` in the chain: it is fed from `afterId` and everything
 * `afterId` fed is now fed from it.
 */
export function insertAfter(afterId: string, element: DraftElement): OperationOutcome {
  const p = draft.value;
  if (!p) return refuse('No project is open.');
  if (!p.elements.some((e) => e.id === afterId)) return refuse(`There is no element "${afterId}".`);
  const room = roomFor(p, 1);
  if (!room.ok) return room;
  const added = { ...withFreshId(p, element), from: afterId };
  const notDone = edit(`Inserted ${added.name || added.id} after ${elementName(p, afterId)}`, (x) => {
    for (const e of x.elements) if (e.from === afterId) e.from = added.id;
    const at = x.elements.findIndex((e) => e.id === afterId);
    x.elements.splice(at + 1, 0, added);
  }, { select: added.id });
  return notDone ? { ok: false, message: notDone } : { ok: true };
}

/**
 * Insert `element` right before `beforeId`: fed from `beforeId`'s feeder, feeding `beforeId`.
 * Before the source it becomes nothing useful, so that is refused.
 */
export function insertBefore(beforeId: string, element: DraftElement): OperationOutcome {
  const p = draft.value;
  if (!p) return refuse('No project is open.');
  const target = p.elements.find((e) => e.id === beforeId);
  if (!target) return refuse(`There is no element "${beforeId}".`);
  if (target.from === undefined) return refuse('Nothing can go before the source: the chain starts there.');
  const room = roomFor(p, 1);
  if (!room.ok) return room;
  const added = { ...withFreshId(p, element), from: target.from };
  const notDone = edit(`Inserted ${added.name || added.id} before ${elementName(p, beforeId)}`, (x) => {
    const t = x.elements.find((e) => e.id === beforeId)!;
    t.from = added.id;
    const at = x.elements.findIndex((e) => e.id === beforeId);
    x.elements.splice(at, 0, added);
  }, { select: added.id });
  return notDone ? { ok: false, message: notDone } : { ok: true };
}

/**
 * Remove one element; what it fed is fed from its feeder instead (so removing a cable joins its
 * two ends). The source is never removed: a project has exactly one.
 */
export function removeElement(id: string): OperationOutcome {
  const p = draft.value;
  if (!p) return refuse('No project is open.');
  const target = p.elements.find((e) => e.id === id);
  if (!target) return refuse(`There is no element "${id}".`);
  // A project keeps its one source (removing a lone source would leave a project with none).
  if (target.from === undefined) {
    return refuse(
      childrenOf(p, id).length > 0
        ? 'The source feeds the whole chain: remove what it feeds first, or start a new project.'
        : 'A project keeps its source: start a new project to begin from another one.',
    );
  }
  const notDone = edit(`Removed ${elementName(p, id)}`, (x) => {
    for (const e of x.elements) if (e.from === id) e.from = target.from;
    x.elements = x.elements.filter((e) => e.id !== id);
  }, { select: target.from ?? null });
  return notDone ? { ok: false, message: notDone } : { ok: true };
}

/** Remove an element and everything downstream of it. */
export function removeBranch(id: string): OperationOutcome {
  const p = draft.value;
  if (!p) return refuse('No project is open.');
  const target = p.elements.find((e) => e.id === id);
  if (!target) return refuse(`There is no element "${id}".`);
  if (target.from === undefined) return refuse('The source is the whole chain: start a new project instead.');
  const gone = new Set(subtreeIds(p, id));
  const notDone = edit(`Removed ${elementName(p, id)} and the ${gone.size - 1} element(s) it fed`, (x) => {
    x.elements = x.elements.filter((e) => !gone.has(e.id));
  }, { select: target.from });
  return notDone ? { ok: false, message: notDone } : { ok: true };
}

/**
 * Duplicate an element with everything downstream of it, as a new branch from the same feeder
 * (a second identical circuit). The copies get fresh ids; names get " (copy)".
 */
export function duplicate(id: string): OperationOutcome {
  const p = draft.value;
  if (!p) return refuse('No project is open.');
  const target = p.elements.find((e) => e.id === id);
  if (!target) return refuse(`There is no element "${id}".`);
  if (target.from === undefined) return refuse('A project has one source: the source cannot be duplicated.');
  const ids = subtreeIds(p, id);
  const room = roomFor(p, ids.length);
  if (!room.ok) return room;
  const taken = new Set<string>();
  const rename = new Map<string, string>();
  for (const old of ids) {
    const fresh = freshId(p, old, taken);
    taken.add(fresh);
    rename.set(old, fresh);
  }
  const copies = ids.map((old) => {
    const e = clone(p.elements.find((x) => x.id === old)!);
    e.id = rename.get(old)!;
    if (e.from !== undefined && rename.has(e.from)) e.from = rename.get(e.from)!;
    if (old === id && typeof e.name === 'string' && e.name) e.name = withSuffix(e.name, ' (copy)', FILE_LIMITS.maxStringLength);
    return e;
  });
  const notDone = edit(`Duplicated ${elementName(p, id)}`, (x) => {
    const last = Math.max(...ids.map((i) => x.elements.findIndex((e) => e.id === i)));
    x.elements.splice(last + 1, 0, ...copies);
  }, { select: rename.get(id)! });
  return notDone ? { ok: false, message: notDone } : { ok: true };
}

/**
 * Move a stage one step towards the source: it swaps places with its feeder. Allowed when the
 * feeder is not the source and feeds only this element (otherwise the other branches would move too).
 */
export function moveUpstream(id: string): OperationOutcome {
  const p = draft.value;
  if (!p) return refuse('No project is open.');
  const b = p.elements.find((e) => e.id === id);
  if (!b || b.from === undefined) return refuse('The source is already first.');
  const a = p.elements.find((e) => e.id === b.from);
  if (!a) return refuse(`The feeder "${b.from}" of ${elementName(p, id)} does not exist.`);
  if (a.from === undefined) return refuse(`${elementName(p, id)} is already next to the source.`);
  if (childrenOf(p, a.id).length !== 1) {
    return refuse(`${elementName(p, a.id)} feeds other branches too: swapping would move them. Move the whole branch instead.`);
  }
  const notDone = edit(`Moved ${elementName(p, id)} before ${elementName(p, a.id)}`, (x) => {
    const xa = x.elements.find((e) => e.id === a.id)!;
    const xb = x.elements.find((e) => e.id === id)!;
    for (const e of x.elements) if (e.from === id) e.from = a.id;
    xb.from = xa.from;
    xa.from = id;
    const ia = x.elements.indexOf(xa);
    const ib = x.elements.indexOf(xb);
    x.elements[ia] = xb;
    x.elements[ib] = xa;
  }, { select: id });
  return notDone ? { ok: false, message: notDone } : { ok: true };
}

/** Move a stage one step towards the loads: it swaps places with the one element it feeds. */
export function moveDownstream(id: string): OperationOutcome {
  const p = draft.value;
  if (!p) return refuse('No project is open.');
  const kids = childrenOf(p, id);
  if (kids.length !== 1) {
    return refuse(
      kids.length === 0
        ? `${elementName(p, id)} is already at the end of its branch.`
        : `${elementName(p, id)} feeds ${kids.length} branches: there is no single next stage to swap with.`,
    );
  }
  const target = p.elements.find((e) => e.id === id)!;
  if (target.from === undefined) return refuse('The source stays first.');
  return moveUpstream(kids[0]!.id);
}

/** Move a branch before or after its neighbouring branch from the same feeder (display order). */
export function reorderBranch(id: string, direction: -1 | 1): OperationOutcome {
  const p = draft.value;
  if (!p) return refuse('No project is open.');
  const target = p.elements.find((e) => e.id === id);
  if (!target || target.from === undefined) return refuse('The source has no sibling branches.');
  const siblings = childrenOf(p, target.from);
  const at = siblings.findIndex((e) => e.id === id);
  const other = siblings[at + direction];
  if (!other) return refuse(`${elementName(p, id)} is already the ${direction < 0 ? 'first' : 'last'} branch.`);
  const notDone = edit(`Moved ${elementName(p, id)} ${direction < 0 ? 'up' : 'down'} among its branches`, (x) => {
    const i = x.elements.findIndex((e) => e.id === id);
    const j = x.elements.findIndex((e) => e.id === other.id);
    const [ei, ej] = [x.elements[i]!, x.elements[j]!];
    x.elements[i] = ej;
    x.elements[j] = ei;
  }, { select: id });
  return notDone ? { ok: false, message: notDone } : { ok: true };
}

/** Give a different feeder to an element (move a branch to another point of the chain). */
export function reattach(id: string, newFeederId: string): OperationOutcome {
  const p = draft.value;
  if (!p) return refuse('No project is open.');
  const target = p.elements.find((e) => e.id === id);
  if (!target || target.from === undefined) return refuse('The source has no feeder.');
  if (subtreeIds(p, id).includes(newFeederId)) return refuse(`${elementName(p, newFeederId)} is downstream of ${elementName(p, id)}: that would make a loop.`);
  if (!p.elements.some((e) => e.id === newFeederId)) return refuse(`There is no element "${newFeederId}".`);
  const notDone = edit(`Moved ${elementName(p, id)} to be fed from ${elementName(p, newFeederId)}`, (x) => {
    x.elements.find((e) => e.id === id)!.from = newFeederId;
  }, { select: id });
  return notDone ? { ok: false, message: notDone } : { ok: true };
}

/** Whether `added` more elements fit in the open project (a chain operation asks before it adds). */
function roomFor(project: DraftProject, added: number): OperationOutcome {
  const count = project.elements.length + added;
  if (count <= FILE_LIMITS.maxElements) return { ok: true };
  const at = project.elements.length >= FILE_LIMITS.maxElements;
  return refuse(
    at
      ? `Not added: ${elementsWords(count)}.`
      : `Not added: this adds ${added} elements and ${elementsWords(count)}.`,
  );
}

/** Whether `added` more elements fit in the open project; a refusal says so (the chain editor asks before it offers kinds). */
export function roomForElements(added = 1): OperationOutcome {
  const p = draft.value;
  return p ? roomFor(p, added) : refuse('No project is open.');
}
