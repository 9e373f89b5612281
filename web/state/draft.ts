/**
 * The project being edited: the draft (plain project data), where it came from, and its undo/redo
 * history. Every change goes through `edit()` (or `commit()` for a candidate already checked, as
 * setField's), which records it for undo; typing in one field coalesces into one undo step. No edit
 * makes a project the import would refuse (draft-limits.ts). The rest of the editor state is split
 * by job: field-edit.ts (engine-checked field writes), field-errors.ts, chain-ops.ts (add, insert,
 * remove, reorder …), tree.ts (pure reads of the tree), solution.ts (the draft's solve and the last
 * valid solved pair); editor.ts re-exports them for the page.
 */
import { batch, computed, signal } from '@preact/signals';
import { fieldErrors } from './field-errors.ts';
import { newLimitIssue } from './draft-limits.ts';

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
  /** 'shared': opened from a read-only share link (web/state/share-open.ts): no edit is taken, nothing is stored. */
  kind: 'demo' | 'file' | 'new' | 'stored' | 'shared';
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

export function clone<T>(value: T): T {
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
export function commit(current: DraftProject, next: DraftProject, label: string, options: { coalesce?: string; select?: string | null }): void {
  // A project opened from a share link is read-only: save a copy to change it.
  if (draftOrigin.peek()?.kind === 'shared') {
    lastChange.value = 'Not done: a shared project is read-only. Save a copy to your projects to change it.';
    return;
  }
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
