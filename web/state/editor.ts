/**
 * The project being edited: a draft (plain project data), its undo/redo history, the chain
 * operations (add, insert, remove, reorder, duplicate), field edits checked by the engine's own
 * validation before they are taken in, and the solution of the draft with the last valid results.
 *
 * Rules:
 * - A field edit the engine rejects for that field (a value out of range, text where a number goes)
 *   never enters the draft: the field shows the message and the results are marked out of date.
 *   So nothing is stored from an invalid value.
 * - Structural states the engine refuses (a kind mismatch after an insert, an infeasible load) may
 *   be in the draft; their problems are listed and the last valid results stay, marked out of date.
 * - Every change goes through `edit()`, which records it for undo. Typing in one field coalesces
 *   into one undo step.
 * - No edit makes a project the import would refuse (web/storage/limits.ts: text lengths, number
 *   sizes, nesting, values and elements): a field edit past a limit is refused at the field, a chain
 *   operation past one is refused with a message, and the draft stays as it was.
 */
import { batch, computed, effect, signal } from '@preact/signals';
import { PROJECT_LEVEL, type Problem, PROJECT_VERSION, type SolveOutcome, solveProject, type SolveResult, validateProject } from '../../core/page.ts';
import { DEPTH_IN_FILE, ENVELOPE_VALUES, FILE_LIMITS, limitWords, scanLimits, withSuffix, type LimitIssue } from '../storage/limits.ts';

/** One element as edited: plain data, checked by the engine on every solve. */
export type DraftElement = { id: string; kind: string; from?: string; name?: string } & Record<string, unknown>;

/** The project as edited (the stored project format of core/model/project.ts, not yet validated). */
export type DraftProject = {
  format: 'joulepath-project';
  version: number;
  name: string;
  description?: string;
  elements: DraftElement[];
} & Record<string, unknown>;

/** Where the open project came from. */
export interface DraftOrigin {
  kind: 'demo' | 'file' | 'new' | 'stored';
  title: string;
  summary?: string;
  demoId?: string;
  fileName?: string;
  /** Key of the stored project, when it is one (storage). */
  storedKey?: string;
}

const HISTORY_LIMIT = 200;

export const draft = signal<DraftProject | null>(null);
export const draftOrigin = signal<DraftOrigin | null>(null);
/** The element whose form is open. */
export const selectedId = signal<string | null>(null);

const past = signal<readonly { project: DraftProject; label: string; selected: string | null }[]>([]);
const future = signal<readonly { project: DraftProject; label: string; selected: string | null }[]>([]);
/** Coalescing key of the last edit (the same field typed again replaces rather than stacks). */
let lastCoalesceKey: string | null = null;

export const canUndo = computed(() => past.value.length > 0);
export const canRedo = computed(() => future.value.length > 0);
/** What undo would take back / redo would do again, for button titles. */
export const undoLabel = computed(() => past.value.at(-1)?.label ?? '');
export const redoLabel = computed(() => future.value.at(-1)?.label ?? '');
/** A short sentence about the last change, for a polite live region. */
export const lastChange = signal('');

/** Counts every change to the draft (storage and timing hooks listen to it). */
export const draftRevision = signal(0);
/**
 * Counts projects opened (loadProject): a key for state that belongs to one opened project. It does
 * not change when the open project only changes where it is kept (a demo's first edit stores a copy).
 */
export const openCount = signal(0);

function clone<T>(value: T): T {
  return structuredClone(value);
}

/** Is this plain data shaped enough to be edited (an object with a list of elements with id and kind)? */
export function isEditable(data: unknown): data is DraftProject {
  if (typeof data !== 'object' || data === null || Array.isArray(data)) return false;
  const elements = (data as Record<string, unknown>)['elements'];
  if (!Array.isArray(elements)) return false;
  return elements.every(
    (e) =>
      typeof e === 'object' &&
      e !== null &&
      !Array.isArray(e) &&
      typeof (e as Record<string, unknown>)['id'] === 'string' &&
      typeof (e as Record<string, unknown>)['kind'] === 'string',
  );
}

/** Open a project for editing: a fresh history, the source selected. */
export function loadProject(project: DraftProject, origin: DraftOrigin): void {
  batch(() => {
    draft.value = clone(project);
    draftOrigin.value = origin;
    openCount.value++;
    past.value = [];
    future.value = [];
    fieldErrors.value = new Map();
    lastCoalesceKey = null;
    selectedId.value = null;
    lastChange.value = '';
    draftRevision.value++;
  });
}

/**
 * Give the open project another name without an undo step (a stored copy's name, a rename from the
 * project list): the history takes the name too, so undo never brings the old one back.
 */
export function renameDraft(name: string): void {
  const d = draft.value;
  if (!d || d.name === name) return;
  const rename = (e: { project: DraftProject; label: string; selected: string | null }) => ({ ...e, project: { ...e.project, name } });
  batch(() => {
    draft.value = { ...d, name };
    past.value = past.value.map(rename);
    future.value = future.value.map(rename);
    draftRevision.value++;
  });
}

/** Close the open project (nothing shown). */
export function closeProject(): void {
  batch(() => {
    draft.value = null;
    draftOrigin.value = null;
    past.value = [];
    future.value = [];
    fieldErrors.value = new Map();
    selectedId.value = null;
    draftRevision.value++;
  });
}

/**
 * Apply a change to the draft and record it for undo. `change` receives a copy it may mutate or
 * replace. With `coalesce`, a change with the same key right after the last one replaces it in the
 * history (typing in one field is one step).
 */
export function edit(
  label: string,
  change: (project: DraftProject) => DraftProject | void,
  options: { coalesce?: string; select?: string | null } = {},
): string | null {
  const current = draft.value;
  if (!current) return 'No project is open.';
  const copy = clone(current);
  const next = change(copy) ?? copy;
  // A change that would make a project the import refuses is not taken in (limits.ts).
  const limit = newLimitIssue(current, next);
  if (limit) {
    lastChange.value = `Not done: ${limit.where}${limit.words}`;
    return lastChange.value;
  }
  commit(current, next, label, options);
  return null;
}

/**
 * Make `next` the draft, after `current`, as one undoable step. `next` must be a new object that
 * never changes afterwards; it may share unchanged elements with `current` (setField's candidates
 * do), since no draft or element is ever changed in place.
 */
function commit(current: DraftProject, next: DraftProject, label: string, options: { coalesce?: string; select?: string | null }): void {
  batch(() => {
    const sameField = options.coalesce !== undefined && options.coalesce === lastCoalesceKey && past.value.length > 0;
    if (!sameField) {
      past.value = [...past.value, { project: current, label, selected: selectedId.value }].slice(-HISTORY_LIMIT);
    }
    future.value = [];
    lastCoalesceKey = options.coalesce ?? null;
    draft.value = next;
    if (options.select !== undefined) selectedId.value = options.select;
    lastChange.value = label;
    draftRevision.value++;
  });
}

/** Take back the last change. */
export function undo(): void {
  const entry = past.value.at(-1);
  const current = draft.value;
  if (!entry || !current) return;
  batch(() => {
    past.value = past.value.slice(0, -1);
    future.value = [...future.value, { project: current, label: entry.label, selected: selectedId.value }];
    draft.value = entry.project;
    selectedId.value = entry.selected !== null && entry.project.elements.some((e) => e.id === entry.selected) ? entry.selected : null;
    fieldErrors.value = new Map();
    lastCoalesceKey = null;
    lastChange.value = `Undone: ${entry.label}`;
    draftRevision.value++;
  });
}

/** Do again the last change taken back. */
export function redo(): void {
  const entry = future.value.at(-1);
  const current = draft.value;
  if (!entry || !current) return;
  batch(() => {
    future.value = future.value.slice(0, -1);
    past.value = [...past.value, { project: current, label: entry.label, selected: selectedId.value }];
    draft.value = entry.project;
    fieldErrors.value = new Map();
    lastCoalesceKey = null;
    lastChange.value = `Redone: ${entry.label}`;
    draftRevision.value++;
  });
}

// ---------- field paths ----------

/** The value at a dotted path ("loss.efficiency", "loss.points.0.efficiency"). */
export function getAt(target: unknown, path: string): unknown {
  let at: unknown = target;
  for (const key of path.split('.')) {
    if (typeof at !== 'object' || at === null) return undefined;
    at = (at as Record<string, unknown>)[key];
  }
  return at;
}

/**
 * Set the value at a dotted path in place (creating objects on the way); `undefined` removes the
 * key (an optional field left empty). Numeric keys index arrays.
 */
export function setAt(target: Record<string, unknown>, path: string, value: unknown): void {
  const keys = path.split('.');
  let at: Record<string, unknown> = target;
  for (const key of keys.slice(0, -1)) {
    const next = at[key];
    if (typeof next !== 'object' || next === null) at[key] = {};
    at = at[key] as Record<string, unknown>;
  }
  const last = keys[keys.length - 1]!;
  if (value === undefined) {
    if (Array.isArray(at)) at.splice(Number(last), 1);
    else delete at[last];
  } else {
    at[last] = value;
  }
}

// ---------- the project file's limits ----------

/** A limit of the project file passed by a draft: where (element id, field path) and what. */
interface DraftLimitIssue {
  elementId: string;
  path: string;
  issue: LimitIssue | { kind: 'elements' } | { kind: 'id'; id: string } | { kind: 'project-name'; length: number };
  /** "Inverter 2, loss: " (empty for the project's own fields). */
  where: string;
  words: string;
}

/** Each element's own scan (count and first issue), kept by identity: drafts share unchanged elements. */
const elementScans = new WeakMap<DraftElement, ReturnType<typeof scanLimits>>();

function scanElement(e: DraftElement): ReturnType<typeof scanLimits> {
  let scan = elementScans.get(e);
  if (!scan) {
    scan = scanLimits(e, { depth: DEPTH_IN_FILE.element });
    elementScans.set(e, scan);
  }
  return scan;
}

const pathWords = (path: (string | number)[]) => path.join('.');

/**
 * The first limit of the project file (web/storage/limits.ts, the import's own) that a draft passes,
 * or null: what `exportText` writes of this draft is then a file `parseImportText` reads.
 */
export function draftLimitIssue(project: DraftProject): DraftLimitIssue | null {
  if (project.elements.length > FILE_LIMITS.maxElements) {
    return { elementId: PROJECT_LEVEL, path: 'elements', issue: { kind: 'elements' }, where: '', words: elementsWords(project.elements.length) };
  }
  const { elements, ...own } = project;
  const ownScan = scanLimits(own, { depth: DEPTH_IN_FILE.project });
  if (ownScan.issue) {
    return { elementId: PROJECT_LEVEL, path: pathWords(ownScan.issue.path), issue: ownScan.issue, where: '', words: limitWords(ownScan.issue) };
  }
  if (typeof project.name === 'string' && project.name.length > FILE_LIMITS.maxProjectNameLength) {
    const issue = { kind: 'project-name', length: project.name.length } as const;
    return { elementId: PROJECT_LEVEL, path: 'name', issue, where: '', words: `a project name holds at most ${FILE_LIMITS.maxProjectNameLength} characters (this one has ${project.name.length})` };
  }
  let count = ENVELOPE_VALUES + ownScan.count;
  for (const e of elements) {
    const scan = scanElement(e);
    if (scan.issue) {
      const path = pathWords(scan.issue.path);
      return { elementId: e.id, path, issue: scan.issue, where: `${elementName(project, e.id)}${path ? `, ${path}` : ''}: `, words: limitWords(scan.issue) };
    }
    if (e.id.length > FILE_LIMITS.maxIdLength) {
      return { elementId: e.id, path: 'id', issue: { kind: 'id', id: e.id }, where: `${elementName(project, e.id)}: `, words: `its id is longer than ${FILE_LIMITS.maxIdLength} characters` };
    }
    count += scan.count;
  }
  if (count > FILE_LIMITS.maxValues) {
    const issue: LimitIssue = { kind: 'count', path: [] };
    return { elementId: PROJECT_LEVEL, path: '', issue, where: '', words: limitWords(issue) };
  }
  return null;
}

function elementsWords(count: number): string {
  return `a project holds at most ${FILE_LIMITS.maxElements} elements (this would make ${count}); remove some first, or plan the rest of the chain as a second project`;
}

/**
 * The limit `next` passes that `current` did not pass at the same place, or null. A project stored
 * before a limit existed can still be edited (its old excess is not the edit's doing), but never
 * made worse at a new place.
 */
function newLimitIssue(current: DraftProject, next: DraftProject): DraftLimitIssue | null {
  const after = draftLimitIssue(next);
  if (!after) return null;
  const before = draftLimitIssue(current);
  const same = before && before.elementId === after.elementId && before.path === after.path && before.issue.kind === after.issue.kind;
  if (same && !(after.issue.kind === 'elements' && next.elements.length > current.elements.length)) return null;
  return after;
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

// ---------- field edits ----------

function fieldKey(elementId: string, path: string): string {
  return `${elementId}\u0000${path}`;
}

/** Messages of fields whose typed text was not taken in (key: element id + path). */
export const fieldErrors = signal<ReadonlyMap<string, string>>(new Map());

export function fieldError(elementId: string, path: string): string | undefined {
  return fieldErrors.value.get(fieldKey(elementId, path));
}

/** Set (or clear, with null) the message shown at a field. */
export function setFieldError(elementId: string, path: string, message: string | null): void {
  const key = fieldKey(elementId, path);
  const had = fieldErrors.value.get(key);
  if (message === null ? had === undefined : had === message) return;
  const next = new Map(fieldErrors.value);
  if (message === null) next.delete(key);
  else next.set(key, message);
  fieldErrors.value = next;
}

/** Problems the engine's validation reports for one field of one element (or of the project). */
export function problemsForField(project: DraftProject, elementId: string, path: string): Problem[] {
  const checked = validateProject(project);
  if (checked.ok) return [];
  return checked.problems.filter(
    (p) => p.elementId === elementId && (p.field === path || p.field.startsWith(`${path}.`)) && p.code === 'invalid-value',
  );
}

/**
 * Set one field of one element (or of the project, with elementId PROJECT_LEVEL) — the way every form
 * field writes. The candidate is checked by the engine's validation first: if the engine rejects this
 * field, the draft is left as it was, the message is kept at the field and returned. `undefined`
 * clears an optional field.
 */
export function setField(elementId: string, path: string, value: unknown, label?: string): string | null {
  const current = draft.value;
  if (!current) return 'No project is open.';
  // A new project object with a copy of the one element (or of the project's own fields) that
  // changes; the other elements are shared with the draft, so a memo'd view of an unchanged stage
  // sees the same object and skips its work.
  let candidate: DraftProject;
  let target: Record<string, unknown>;
  if (elementId === PROJECT_LEVEL) {
    const { elements, ...own } = current;
    candidate = { ...clone(own), elements } as DraftProject;
    target = candidate as Record<string, unknown>;
  } else {
    const at = current.elements.findIndex((e) => e.id === elementId);
    if (at < 0) return `There is no element "${elementId}".`;
    const copy = clone(current.elements[at]!);
    candidate = { ...current, elements: current.elements.map((e, i) => (i === at ? copy : e)) };
    target = copy;
  }
  setAt(target, path, value);
  // What the import would refuse never enters the draft (limits.ts), before anything is solved.
  const limit = newLimitIssue(current, candidate);
  if (limit) {
    const message = limit.words;
    setFieldError(elementId, path, message);
    return message;
  }
  // Solve the candidate once: when it solves, no field of it is invalid (the solve validates it
  // first) and the outcome is kept for `outcome`, so a keystroke validates the project once, not twice.
  const solved = solveOnce(candidate);
  const problems = solved?.ok ? [] : problemsForField(candidate, elementId, path);
  if (problems.length) {
    const message = problems.map((p) => p.message).join('; ');
    setFieldError(elementId, path, message);
    return message;
  }
  setFieldError(elementId, path, null);
  const name = elementId === PROJECT_LEVEL ? 'project' : elementName(current, elementId);
  commit(current, candidate, label ?? `${name}: ${path}`, { coalesce: fieldKey(elementId, path) });
  return null;
}

// ---------- the tree ----------

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

/** Result of a chain operation: done, or refused with a sentence saying why. */
export type OperationOutcome = { ok: true } | { ok: false; message: string };

function refuse(message: string): OperationOutcome {
  lastChange.value = message;
  return { ok: false, message };
}

function withFreshId(project: DraftProject, element: DraftElement): DraftElement {
  return { ...clone(element), id: freshId(project, element.id || element.kind) };
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

// ---------- solution ----------

/** Outcomes solved by setField for the candidate it took in (the draft object itself is the key). */
const solvedDrafts = new WeakMap<DraftProject, SolveOutcome>();

/** Solve a candidate draft and keep its outcome for `outcome`; undefined when the engine threw (`outcome` reports it). */
function solveOnce(candidate: DraftProject): SolveOutcome | undefined {
  try {
    const o = solveProject(candidate);
    solvedDrafts.set(candidate, o);
    return o;
  } catch {
    return undefined;
  }
}

/** The engine's outcome for the draft as it stands. */
export const outcome = computed<SolveOutcome | { ok: false; crashed: string } | null>(() => {
  const p = draft.value;
  if (!p) return null;
  const known = solvedDrafts.get(p);
  if (known) return known;
  try {
    return solveProject(p);
  } catch (error) {
    // An engine fault must not blank the page; show it so it can be reported.
    return { ok: false, crashed: `The calculation stopped unexpectedly: ${String(error)}` };
  }
});

/** The last result the engine gave for a valid draft of this project (kept while inputs are invalid). */
export const lastValidResult = signal<SolveResult | null>(null);
effect(() => {
  const o = outcome.value;
  if (o?.ok) lastValidResult.value = o.result;
});
// A different project starts without old results.
effect(() => {
  void openCount.value;
  const o = outcome.peek();
  lastValidResult.value = o?.ok ? o.result : null;
});

/** One empty list, so that an edit that solves does not hand every reader a new (empty) array. */
const NO_PROBLEMS = Object.freeze([]) as unknown as Problem[];

/** Problems of the draft as it stands (empty when it solves). */
export const draftProblems = computed<Problem[]>(() => {
  const o = outcome.value;
  return o && !o.ok && 'problems' in o ? o.problems : NO_PROBLEMS;
});

/** A crash message, when the engine stopped unexpectedly. */
export const crashMessage = computed(() => {
  const o = outcome.value;
  return o && !o.ok && 'crashed' in o ? o.crashed : null;
});

/**
 * Whether the results shown are those of the inputs on screen: "current", or "stale" (the draft
 * does not solve, or a field holds text that was not taken in), or "none" (no valid result yet).
 */
export const resultsState = computed<'current' | 'stale' | 'none'>(() => {
  if (!lastValidResult.value) return 'none';
  return outcome.value?.ok && fieldErrors.value.size === 0 ? 'current' : 'stale';
});
