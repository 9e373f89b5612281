/**
 * Storage in the running app: autosave of the open project, the project list, delete with undo,
 * import and export of files, the two-tab conflict check and the browser's storage status.
 *
 * - Autosave: every change to the draft (state/editor.ts counts them in `draftRevision`) is written
 *   at most every AUTOSAVE_MS, and at once when the page is hidden or left. Writes run one after the
 *   other. A demo is a read-only template: its first edit stores a copy ("… (my copy)") and the copy
 *   is what is saved from then on; a new project is stored from its first edit. While a write is
 *   waiting, failed or held by a question, leaving the page asks first (`beforeunload`).
 * - A failed write (quota, storage switched off) changes nothing stored, says so plainly and keeps the
 *   draft in memory, per project (opening another project does not drop it); the next edit tries again.
 * - Two tabs: each write checks, in the same transaction, that the stored revision is the one this
 *   tab last loaded or wrote (store.ts); tabs also announce writes and deletes on a BroadcastChannel.
 *   When another tab wrote first, or deleted the project, nothing is written and the user chooses.
 *   The question belongs to its project: it holds that project's own version from this tab (`mine`),
 *   and opening another project parks it (still shown, naming the project) — it is never answered
 *   with another project's draft.
 * - A record of a newer layout (another tab or an updated app wrote it) is never written over,
 *   renamed or deleted: the write is refused with a message to update the app.
 */
import { batch, effect, signal } from '@preact/signals';
import {
  draft,
  draftOrigin,
  draftRevision,
  lastSolved,
  loadProject,
  renameDraft,
  type DraftOrigin,
  type DraftProject,
} from '../state/editor.ts';
// The file checks and their schemas load on the first import or export (outside the first-load budget).
const fileFormat = () => import('./file-format.ts');
import { RESCUE_KEY_PREFIX, copyName, recordName, type RescueRecord, type StoredProject } from './record.ts';
import { ProjectStore, type ListedProject, type WriteOutcome } from './store.ts';

/** Longest wait between an edit and its write. */
export const AUTOSAVE_MS = 300;
/** How long a deleted project can be brought back. */
export const UNDO_DELETE_MS = 8000;
/** Records still marked deleted this long after (their tab closed during the undo period) are removed. */
const STALE_DELETE_MS = 60_000;
const CHANNEL_NAME = 'joulepath-projects';
const HASH_PREFIX = '#project=';

/** This tab's id (written into every record it saves). */
export const tabId: string = globalThis.crypto.randomUUID();

export type SaveStatus =
  | { state: 'idle' }
  | { state: 'pending' }
  | { state: 'saved'; savedAt: string }
  | { state: 'failed'; message: string }
  | { state: 'conflict' };

export const saveStatus = signal<SaveStatus>({ state: 'idle' });
/** Milliseconds the last successful write took (shown in the storage details; measured in the browser tests). */
export const lastWriteMs = signal<number | null>(null);
export const projectList = signal<ListedProject[]>([]);
export const listLoaded = signal(false);

/**
 * A stored project that another tab changed (`changed`) or deleted (`deleted`) after this tab last
 * loaded or saved it, while this tab has its own version of it. Nothing of `mine` is written until
 * the user answers; the answer writes `mine`, this project's own version, and nothing else.
 */
export interface StorageConflict {
  id: string;
  kind: 'changed' | 'deleted';
  /** What is stored now (null: removed for good). */
  theirs: StoredProject | null;
  /** This tab's version: captured when the question arose, kept up to date while the project is open here. */
  mine: DraftProject;
}
/** Open questions, one per project (a parked one stays while another project is open). */
export const conflicts = signal<readonly StorageConflict[]>([]);
export const pendingDelete = signal<{ id: string; name: string; wasOpen: boolean } | null>(null);
export const persistence = signal<{ supported: boolean; persisted: boolean | null; usage: number | null; quota: number | null }>({
  supported: typeof navigator !== 'undefined' && !!navigator.storage,
  persisted: null,
  usage: null,
  quota: null,
});
/** An import whose project id is already stored: the user picks (keep both is the default). */
export const importQuestion = signal<{ fileName: string; existingName: string; existingSavedAt: string; answer: (choice: ImportChoice) => void } | null>(null);
export type ImportChoice = 'keep-both' | 'replace' | 'cancel';
/** A short sentence about the last storage action, for a polite live region. */
export const storageNotice = signal('');

let projectStore: ProjectStore | null | undefined;
/** The store, or null when this browser offers no IndexedDB here. */
function store(): ProjectStore | null {
  if (projectStore === undefined) {
    try {
      projectStore = typeof indexedDB === 'undefined' ? null : new ProjectStore();
    } catch {
      projectStore = null;
    }
  }
  return projectStore;
}
const NO_STORAGE = 'this browser offers no storage to this page (private browsing, or site data switched off)';

// ---------- addresses ----------

export function storedIdFromHash(hash: string): string | undefined {
  if (!hash.startsWith(HASH_PREFIX)) return undefined;
  const id = decodeURIComponent(hash.slice(HASH_PREFIX.length));
  return /^[A-Za-z0-9-]{1,64}$/.test(id) ? id : undefined;
}

export function hashForStored(id: string): string {
  return `${HASH_PREFIX}${encodeURIComponent(id)}`;
}

function setAddress(id: string, push: boolean): void {
  const hash = hashForStored(id);
  if (!globalThis.history || globalThis.location?.hash === hash) return;
  if (push) globalThis.history.pushState(null, '', hash);
  else globalThis.history.replaceState(null, '', hash);
}

// ---------- autosave ----------

/** One version of a project to write; `seq` numbers the edits of this tab (later edits, higher numbers). */
type Snapshot = { origin: DraftOrigin; project: DraftProject; seq: number };
let editSeq = 0;

/** Edits not yet written, at most one (the latest) per project, oldest first. */
let pending: Snapshot[] = [];
/** Snapshots kept after a refused write (the save line stays "Not saved" while any is left). */
const unwritten = new WeakSet<Snapshot>();
let timer: ReturnType<typeof setTimeout> | undefined;
let queue: Promise<void> = Promise.resolve();
/** Write rounds queued or under way. */
let writing = 0;
/** Demo / new / file origins whose first edit has been stored, and the id it got. */
const createdFor = new WeakMap<DraftOrigin, string>();
/** The id a not-yet-stored origin's first write uses (chosen before the write, so a rescue copy names it too). */
const plannedFor = new WeakMap<DraftOrigin, string>();
/** Snapshots taken by a write round and not written yet. */
const inFlight = new Set<Snapshot>();
/** The revision of each record this tab last loaded or wrote. */
const known = new Map<string, number>();
/** The origin of the draft the autosave last saw: a different one means a project was opened. */
let seenOrigin: DraftOrigin | null = null;
let rebinding = false;
let askedPersistence = false;
let channel: BroadcastChannel | null = null;

function storedIdOf(origin: DraftOrigin | null | undefined): string | undefined {
  if (!origin) return undefined;
  return origin.kind === 'stored' ? origin.storedKey : createdFor.get(origin);
}

/** Two origins of one project (a demo's origin and the stored copy it became count as one). */
function sameProject(a: DraftOrigin, b: DraftOrigin): boolean {
  if (a === b) return true;
  const id = storedIdOf(a);
  return id !== undefined && id === storedIdOf(b);
}

function openId(): string | undefined {
  return storedIdOf(draftOrigin.peek());
}

export function conflictFor(id: string | undefined): StorageConflict | undefined {
  return id === undefined ? undefined : conflicts.peek().find((c) => c.id === id);
}

function setConflict(next: StorageConflict): void {
  const list = conflicts.peek();
  conflicts.value = list.some((c) => c.id === next.id) ? list.map((c) => (c.id === next.id ? next : c)) : [...list, next];
  if (openId() === next.id) saveStatus.value = { state: 'conflict' };
}

function dropConflict(id: string): void {
  conflicts.value = conflicts.peek().filter((c) => c.id !== id);
}

/** Take the pending edit of a project out of the queue (it goes into a question, or is given up). */
function takePending(id: string): Snapshot | undefined {
  const mine = pending.filter((p) => storedIdOf(p.origin) === id);
  if (!mine.length) return undefined;
  pending = pending.filter((p) => !mine.includes(p));
  return mine.at(-1);
}

function markEdited(): void {
  const origin = draftOrigin.peek();
  const project = draft.peek();
  if (!origin || !project) return;
  const c = conflictFor(storedIdOf(origin));
  if (c) {
    // No write while the question is open: the answer takes this version.
    setConflict({ ...c, mine: project });
    return;
  }
  pending = [...pending.filter((p) => !sameProject(p.origin, origin)), { origin, project, seq: ++editSeq }];
  const s = saveStatus.peek().state;
  // Set once per batch of edits (a new object on every keystroke would redraw the save line each time).
  if (s !== 'failed' && s !== 'conflict' && s !== 'pending') saveStatus.value = { state: 'pending' };
  if (timer === undefined) timer = setTimeout(() => void flush(), AUTOSAVE_MS);
}

/** Write the pending edits now (also waits for writes under way). */
export function flush(): Promise<void> {
  if (timer !== undefined) {
    clearTimeout(timer);
    timer = undefined;
  }
  const snaps = pending;
  if (snaps.length) {
    pending = [];
    writing++;
    for (const snap of snaps) inFlight.add(snap);
    queue = queue
      .then(async () => {
        for (const snap of snaps) {
          try {
            await write(snap);
          } finally {
            inFlight.delete(snap);
          }
        }
      })
      .catch((error: unknown) => {
        saveStatus.value = { state: 'failed', message: `the save stopped unexpectedly (${String(error)})` };
      })
      .finally(() => {
        writing--;
      });
  }
  return queue;
}

/** Keep a snapshot that could not be written, unless a newer edit of that project replaced it meanwhile. */
function keepUnwritten(snap: Snapshot): void {
  unwritten.add(snap);
  if (!pending.some((p) => sameProject(p.origin, snap.origin))) pending = [snap, ...pending];
}

/** Whether leaving the page now could lose work: a write waiting or under way, refused, or held by a question. */
export function hasUnsavedWork(): boolean {
  const s = saveStatus.peek().state;
  return pending.length > 0 || writing > 0 || conflicts.peek().length > 0 || s === 'pending' || s === 'failed' || s === 'conflict';
}

/** Point the open draft at its stored record (after its first edit was stored) without reloading it. */
function rebind(from: DraftOrigin, to: DraftOrigin): void {
  if (draftOrigin.peek() !== from) return;
  const keep = lastSolved.peek();
  rebinding = true;
  try {
    seenOrigin = to;
    draftOrigin.value = to;
    // The editor clears the last valid results when the origin changes; this is the same project.
    lastSolved.value = keep;
  } finally {
    rebinding = false;
  }
  if (to.storedKey) setAddress(to.storedKey, false);
}

/**
 * Give the open draft the name its stored copy got, without writing it a second time when that is
 * the only change since `written` (the version just stored).
 */
function nameDraftAsStored(name: string, written: DraftProject): void {
  const unchanged = draft.peek() === written;
  renameDraft(name);
  if (!unchanged) return;
  const origin = draftOrigin.peek();
  if (origin) pending = pending.filter((p) => !sameProject(p.origin, origin));
  if (!pending.length && timer !== undefined) {
    clearTimeout(timer);
    timer = undefined;
  }
}

function isOpen(origin: DraftOrigin): boolean {
  const open = draftOrigin.peek();
  return !!open && sameProject(open, origin);
}

async function write(snap: Snapshot): Promise<void> {
  const s = store();
  if (!s) {
    keepUnwritten(snap);
    saveStatus.value = { state: 'failed', message: NO_STORAGE };
    return;
  }
  const id = storedIdOf(snap.origin);
  const held = conflictFor(id);
  if (id !== undefined && held) {
    // Paused until the user chooses; the answer writes this version.
    setConflict({ ...held, mine: snap.project });
    return;
  }
  const t0 = performance.now();
  let outcome: WriteOutcome;
  if (id === undefined) {
    let project = snap.project;
    if (snap.origin.kind === 'demo') {
      // The draft is renamed only once the copy is stored: a refused write and its retries keep one mark.
      project = { ...project, name: copyName(project.name, listedNames(), 'my copy') };
    }
    let planned = plannedFor.get(snap.origin);
    if (planned === undefined) plannedFor.set(snap.origin, (planned = globalThis.crypto.randomUUID()));
    outcome = await s.create(project, tabId, snap.origin.demoId !== undefined ? { demoId: snap.origin.demoId, id: planned } : { id: planned });
    if (outcome.ok) {
      const name = recordName(outcome.record);
      createdFor.set(snap.origin, outcome.record.id);
      rebind(snap.origin, { kind: 'stored', title: name, storedKey: outcome.record.id });
      if (isOpen(snap.origin) && draft.peek()?.name === snap.project.name && project.name !== snap.project.name) nameDraftAsStored(project.name, snap.project);
      storageNotice.value = snap.origin.kind === 'demo' ? `Demos stay as they are: your changes are saved in “${name}”.` : `Saved as “${name}”.`;
    }
  } else {
    outcome = await s.save(id, snap.project, tabId, known.get(id) ?? null);
  }
  const ms = performance.now() - t0;
  if (outcome.ok) {
    known.set(outcome.record.id, outcome.record.revision);
    dropRescue(outcome.record.id, snap.seq);
    lastWriteMs.value = ms;
    if (!pending.some((p) => unwritten.has(p)) && isOpen(snap.origin)) saveStatus.value = { state: 'saved', savedAt: outcome.record.savedAt };
    announce({ type: 'saved', id: outcome.record.id, revision: outcome.record.revision, tabId });
    void refreshList();
    void checkPersistence(!askedPersistence);
    askedPersistence = true;
  } else if (outcome.reason === 'conflict' || outcome.reason === 'deleted') {
    // A newer edit of the same project waiting behind this one joins the question too.
    const later = takePending(id!);
    setConflict({ id: id!, kind: outcome.reason === 'conflict' ? 'changed' : 'deleted', theirs: outcome.theirs, mine: later?.project ?? snap.project });
  } else {
    keepUnwritten(snap);
    const named = isOpen(snap.origin) ? '' : `changes to “${snap.project.name || 'Untitled project'}”: `;
    saveStatus.value = { state: 'failed', message: `${named}${outcome.message}` };
  }
}

function listedNames(): string[] {
  return projectList.peek().flatMap((r) => (r.ok ? [recordName(r.record)] : []));
}

// ---------- opening ----------

function openRecord(record: StoredProject, push: boolean): void {
  known.set(record.id, record.revision);
  loadProject(record.project, { kind: 'stored', title: recordName(record), storedKey: record.id });
  saveStatus.value = { state: 'saved', savedAt: record.savedAt };
  setAddress(record.id, push);
}

/**
 * Open a stored project; false (with a notice) when it cannot be read. A project with an open
 * question opens with this tab's version (the question's `mine`), still waiting for the answer; one
 * whose last changes were refused opens with them (never with the older stored version).
 */
export async function openStored(id: string, options: { updateAddress?: boolean } = {}): Promise<boolean> {
  const s = store();
  if (!s) return false;
  await starting;
  await flush();
  const held = conflictFor(id);
  if (held) {
    loadProject(held.mine, { kind: 'stored', title: held.mine.name || 'Untitled project', storedKey: id });
    saveStatus.value = { state: 'conflict' };
    setAddress(id, options.updateAddress !== false);
    storageNotice.value = `This is your version of “${held.mine.name || 'Untitled project'}”, not saved yet: choose which version to keep.`;
    return true;
  }
  const waiting = pending.filter((p) => storedIdOf(p.origin) === id).at(-1);
  if (waiting) {
    // Its last changes could not be written (refused): this tab's version is newer than the stored one.
    loadProject(waiting.project, { kind: 'stored', title: waiting.project.name || 'Untitled project', storedKey: id });
    setAddress(id, options.updateAddress !== false);
    storageNotice.value = `This is your version of “${waiting.project.name || 'Untitled project'}”, with changes not stored yet.`;
    return true;
  }
  const read = await s.get(id);
  if (!read || !read.ok || read.record.deletedAt) {
    storageNotice.value = read && !read.ok ? read.message : 'That project is not stored in this browser.';
    return false;
  }
  openRecord(read.record, options.updateAddress !== false);
  return true;
}

/** Open the most recently saved project, if there is one. */
export async function openLatestStored(): Promise<boolean> {
  const s = store();
  if (!s) return false;
  await starting;
  const list = await s.list().catch(() => []);
  const latest = list.find((r) => r.ok);
  return latest?.ok ? openStored(latest.record.id, { updateAddress: false }) : false;
}

export async function refreshList(): Promise<void> {
  const s = store();
  if (!s) {
    listLoaded.value = true;
    return;
  }
  try {
    projectList.value = await s.list();
  } catch (error) {
    storageNotice.value = `The project list could not be read (${error instanceof Error ? error.message : String(error)}).`;
  }
  listLoaded.value = true;
}

// ---------- list actions ----------

function questionFirst(id: string): boolean {
  const c = conflictFor(id);
  if (c) storageNotice.value = `First choose which version of “${c.mine.name || 'Untitled project'}” to keep.`;
  return !!c;
}

export async function renameStored(id: string, name: string): Promise<void> {
  const trimmed = name.trim();
  if (!trimmed || questionFirst(id)) return;
  if (openId() === id) {
    renameDraft(trimmed); // autosave writes it, with the conflict check
    await flush();
  } else {
    const out = await store()?.rename(id, trimmed, tabId);
    if (out && !out.ok) {
      storageNotice.value = `Not renamed: ${
        out.reason === 'conflict' ? 'changed in another tab, try again' : out.reason === 'deleted' ? 'it was deleted in another tab' : out.message
      }.`;
    }
    announce({ type: 'list' });
  }
  await refreshList();
}

export async function duplicateStored(id: string): Promise<void> {
  if (openId() === id) await flush();
  const out = await store()?.duplicate(id, tabId);
  if (out?.ok) storageNotice.value = `Duplicated as “${recordName(out.record)}”.`;
  else if (out) storageNotice.value = `Not duplicated: ${out.reason === 'write-failed' || out.reason === 'not-writable' ? out.message : 'try again'}.`;
  announce({ type: 'list' });
  await refreshList();
}

let deleteTimer: ReturnType<typeof setTimeout> | undefined;

async function finishDelete(): Promise<void> {
  const p = pendingDelete.peek();
  if (deleteTimer !== undefined) clearTimeout(deleteTimer);
  deleteTimer = undefined;
  if (!p) return;
  pendingDelete.value = null;
  await store()?.purge(p.id);
}

/** Hide a project for UNDO_DELETE_MS, then remove it; returns whether it was the open one (and is deleted). */
export async function deleteStored(id: string): Promise<boolean> {
  const s = store();
  if (!s || questionFirst(id)) return false;
  await finishDelete();
  const wasOpen = openId() === id;
  if (wasOpen) await flush();
  if (questionFirst(id)) return false; // the last write met another tab's change
  const listed = projectList.peek().find((r) => r.ok && r.record.id === id);
  const name = listed?.ok ? recordName(listed.record) : 'the project';
  const out = await s.markDeleted(id);
  if (!out.ok) {
    storageNotice.value = `Not deleted: ${out.message}.`;
    return false;
  }
  pendingDelete.value = { id, name, wasOpen };
  deleteTimer = setTimeout(() => void finishDelete(), UNDO_DELETE_MS);
  announce({ type: 'deleted', id, tabId });
  await refreshList();
  return wasOpen;
}

export async function undoDelete(): Promise<void> {
  const p = pendingDelete.peek();
  if (!p) return;
  if (deleteTimer !== undefined) clearTimeout(deleteTimer);
  deleteTimer = undefined;
  pendingDelete.value = null;
  const out = await store()?.restore(p.id);
  if (out && !out.ok) {
    storageNotice.value = `“${p.name}” could not be brought back: ${out.message}.`;
    await refreshList();
    return;
  }
  announce({ type: 'restored', id: p.id, tabId });
  await refreshList();
  if (p.wasOpen) await openStored(p.id);
  storageNotice.value = `“${p.name}” is back.`;
}

// ---------- two tabs ----------

type ChannelMessage =
  | { type: 'saved'; id: string; revision: number; tabId: string }
  | { type: 'deleted'; id: string; tabId: string }
  | { type: 'restored'; id: string; tabId: string }
  | { type: 'list' };

function announce(message: ChannelMessage): void {
  try {
    channel?.postMessage(message);
  } catch {
    // A closed channel only loses the notice; the revision check before each write still holds.
  }
}

/** This tab's version of a project, when it has one (an edit waiting, or the project is open). */
function mineOf(id: string): DraftProject | undefined {
  const waiting = pending.filter((p) => storedIdOf(p.origin) === id).at(-1);
  if (waiting) return waiting.project;
  return openId() === id ? (draft.peek() ?? undefined) : undefined;
}

/** Handle another tab's announcement (exported for the Node tests, which have no second tab). */
export async function onChannelMessage(message: unknown): Promise<void> {
  if (typeof message !== 'object' || message === null) return;
  const m = message as Partial<ChannelMessage> & { id?: unknown; tabId?: unknown; revision?: unknown };
  await refreshList();
  if (typeof m.id !== 'string' || m.tabId === tabId) return;
  const id = m.id;
  const s = store();
  if (!s) return;
  if (m.type === 'saved' && typeof m.revision === 'number') {
    const d = pendingDelete.peek();
    if (d?.id === id) {
      // That tab kept its version of a project deleted here: the delete is cancelled, and said so.
      const read = await s.get(id);
      if (read?.ok && !read.record.deletedAt) {
        if (deleteTimer !== undefined) clearTimeout(deleteTimer);
        deleteTimer = undefined;
        pendingDelete.value = null;
        storageNotice.value = `“${d.name}” was not deleted: another tab kept its version of it.`;
      }
    }
    const held = conflictFor(id);
    if (held) {
      const read = await s.get(id);
      if (read?.ok && !read.record.deletedAt) setConflict({ ...held, kind: 'changed', theirs: read.record });
      return;
    }
    if (openId() !== id || m.revision <= (known.get(id) ?? Infinity)) return;
    const read = await s.get(id);
    const mine = mineOf(id);
    if (mine && read?.ok && read.record.revision > (known.get(id) ?? Infinity) && read.record.tabId !== tabId && !conflictFor(id)) {
      takePending(id);
      setConflict({ id, kind: 'changed', theirs: read.record, mine });
    }
  } else if (m.type === 'deleted') {
    const mine = mineOf(id);
    if (!mine || conflictFor(id)) return;
    const read = await s.get(id);
    if (read?.ok && read.record.deletedAt) {
      takePending(id);
      setConflict({ id, kind: 'deleted', theirs: read.record, mine: mineOf(id) ?? mine });
    }
  } else if (m.type === 'restored') {
    const held = conflictFor(id);
    if (held?.kind !== 'deleted') return;
    const read = await s.get(id);
    if (!read?.ok || read.record.deletedAt) return;
    if (read.record.revision === known.get(id)) {
      // Back as this tab last knew it: nothing to choose; this tab's version is written as usual.
      dropConflict(id);
      requeue(id, held.mine);
      storageNotice.value = `“${recordName(read.record)}” was brought back in the other tab; your changes are saved.`;
    } else {
      setConflict({ ...held, kind: 'changed', theirs: read.record });
    }
  }
}

/** Put a project's version back in the autosave queue (after its question was answered or dropped). */
function requeue(id: string, project: DraftProject): void {
  const open = draftOrigin.peek();
  const origin = open && storedIdOf(open) === id ? open : { kind: 'stored' as const, title: project.name, storedKey: id };
  const latest = origin === open ? (draft.peek() ?? project) : project;
  pending = [...pending.filter((p) => storedIdOf(p.origin) !== id), { origin, project: latest, seq: ++editSeq }];
  if (origin === open) saveStatus.value = { state: 'pending' };
  void flush();
}

/**
 * The answers. For a project changed in another tab: load that version, keep mine (write over it),
 * save mine as a copy. For a project deleted in another tab: leave it deleted ('load-theirs'),
 * restore it with my version ('keep-mine'; the other tab's undo is cancelled and it is told), save
 * mine as a copy.
 */
export type ConflictChoice = 'load-theirs' | 'keep-mine' | 'save-copy';

/**
 * Answer the question about project `id` (default: the open project's, else the first). Only that
 * project's own version (`mine`) is written. Resolves to whether that project was open and is now
 * left deleted (the page then shows something else).
 */
export async function resolveConflict(choice: ConflictChoice, id?: string): Promise<boolean> {
  const s = store();
  const first = conflictFor(id ?? openId()) ?? (id === undefined ? conflicts.peek()[0] : undefined);
  if (!first || !s) return false;
  await flush();
  const c = conflictFor(first.id);
  if (!c) return false;
  const wasOpen = openId() === c.id;
  const name = c.mine.name || 'Untitled project';
  if (choice === 'load-theirs') {
    dropConflict(c.id);
    takePending(c.id);
    dropRescue(c.id, null);
    if (c.kind === 'changed') {
      const read = await s.get(c.id);
      if (wasOpen && openId() === c.id && read?.ok && !read.record.deletedAt) openRecord(read.record, false);
      else if (read?.ok) known.set(c.id, read.record.revision);
      storageNotice.value = wasOpen ? 'Loaded the version saved in the other tab.' : `Your unsaved changes to “${name}” were dropped; the other tab's version is kept.`;
    } else {
      storageNotice.value = `“${name}” stays deleted.`;
    }
    return wasOpen && c.kind === 'deleted';
  }
  if (choice === 'keep-mine') {
    const out = await s.save(c.id, c.mine, tabId, null);
    if (!out.ok) {
      saveStatus.value = { state: 'failed', message: `“${name}”: ${out.reason === 'write-failed' || out.reason === 'not-writable' ? out.message : 'changed again in another tab'}` };
      return false;
    }
    const latest = conflictFor(c.id)?.mine ?? c.mine;
    dropConflict(c.id);
    dropRescue(c.id, null);
    known.set(c.id, out.record.revision);
    announce({ type: 'saved', id: c.id, revision: out.record.revision, tabId });
    if (openId() === c.id) saveStatus.value = { state: 'saved', savedAt: out.record.savedAt };
    // Edits made while the answer was being written go out as a normal save.
    if (latest !== c.mine) requeue(c.id, latest);
    storageNotice.value =
      c.kind === 'changed' ? `Your version of “${name}” is saved over the other one.` : `“${name}” is restored with your version.`;
  } else {
    const copy = copyName(c.mine.name, listedNames());
    const out = await s.create({ ...c.mine, name: copy }, tabId);
    if (!out.ok) {
      saveStatus.value = { state: 'failed', message: `“${name}”: ${out.reason === 'write-failed' || out.reason === 'not-writable' ? out.message : 'try again'}` };
      return false;
    }
    dropConflict(c.id);
    dropRescue(c.id, null);
    known.set(out.record.id, out.record.revision);
    const open = draftOrigin.peek();
    if (open && storedIdOf(open) === c.id) {
      // The open draft becomes the copy; edits waiting for the old id follow it (they are the copy's).
      const to: DraftOrigin = { kind: 'stored', title: copy, storedKey: out.record.id };
      pending = pending.map((p) => (storedIdOf(p.origin) === c.id ? { ...p, origin: to } : p));
      rebind(open, to);
      nameDraftAsStored(copy, c.mine);
      saveStatus.value = pending.length ? { state: 'pending' } : { state: 'saved', savedAt: out.record.savedAt };
    }
    announce({ type: 'saved', id: out.record.id, revision: out.record.revision, tabId });
    storageNotice.value =
      c.kind === 'changed' ? `Your version is saved as “${copy}”; the other tab's version is kept too.` : `Your version is saved as “${copy}”; “${name}” stays deleted.`;
  }
  await refreshList();
  return false;
}

// ---------- rescue copies (the page goes away) ----------

const TAB_LOCK_PREFIX = 'joulepath-tab:';
/** Rescue keys this tab wrote, with the edit number of the version each holds (Infinity: an open question's). */
const rescued = new Map<string, number>();
function rescueKeyOf(origin: DraftOrigin): { key: string; storedId: string } {
  let id = storedIdOf(origin) ?? plannedFor.get(origin);
  // Not stored yet: the id its first write will use is chosen now, so the copy and that write agree.
  if (id === undefined) plannedFor.set(origin, (id = globalThis.crypto.randomUUID()));
  return { key: `${RESCUE_KEY_PREFIX}${tabId}:${id}`, storedId: id };
}

/**
 * The page is hidden or left: write a rescue copy of every version not stored yet (edits waiting,
 * writes under way, answers not given). One committed put each, no read first — the normal write
 * (a read, then a write, for the revision check) may be cut off when the page is torn down. The next
 * start applies them (recoverRescued).
 */
function writeRescues(): void {
  const s = store();
  if (!s) return;
  const time = new Date().toISOString();
  const items = new Map<string, { seq: number; value: RescueRecord }>();
  for (const snap of [...inFlight, ...pending]) {
    const { key, storedId } = rescueKeyOf(snap.origin);
    const stored = storedIdOf(snap.origin) !== undefined;
    const value: RescueRecord = {
      rescueVersion: 1,
      tabId,
      savedAt: time,
      storedId,
      baseRevision: stored ? (known.get(storedId) ?? null) : null,
      ...(!stored && snap.origin.kind === 'demo' && snap.origin.demoId !== undefined ? { demoId: snap.origin.demoId } : {}),
      project: snap.project,
    };
    items.set(key, { seq: snap.seq, value });
  }
  for (const c of conflicts.peek()) {
    const value: RescueRecord = { rescueVersion: 1, tabId, savedAt: time, storedId: c.id, baseRevision: known.get(c.id) ?? null, project: c.mine };
    items.set(`${RESCUE_KEY_PREFIX}${tabId}:${c.id}`, { seq: Infinity, value });
  }
  for (const [key, { seq, value }] of items) {
    if (rescued.get(key) === seq && seq !== Infinity) continue; // this version is in its copy already
    rescued.set(key, seq);
    s.putRescue(key, value).catch(() => rescued.delete(key));
  }
}

/**
 * Remove this tab's rescue copy of a project once what it holds is stored: `seq` is the edit number of
 * the version just written (the copy stays while it holds a later one); null when an answer to a
 * question settled the project.
 */
function dropRescue(id: string, seq: number | null): void {
  const key = `${RESCUE_KEY_PREFIX}${tabId}:${id}`;
  const held = rescued.get(key);
  if (held === undefined || (seq !== null && seq < held)) return;
  rescued.delete(key);
  void store()?.removeRescue(key).catch(() => undefined);
}

/**
 * At start: apply the rescue copies of pages that are gone (recover.ts, loaded only when there are
 * any). Nothing is written over another tab's newer work, and nothing is lost.
 */
export async function recoverRescued(): Promise<void> {
  const s = store();
  if (!s) return;
  const raw = await s.rescues().catch(() => []);
  if (!raw.length) return;
  const { recoverRescues } = await import('./recover.ts');
  const recovered = await recoverRescues(s, raw, tabId, TAB_LOCK_PREFIX);
  if (recovered.length) storageNotice.value = `Changes a closed page had not stored are saved: ${recovered.map((n) => `“${n}”`).join(', ')}.`;
}

// ---------- files ----------

/** The open project as an export file (text and a file name), or null when nothing is open. */
export async function exportOpenProject(appVersion: string): Promise<{ fileName: string; text: string } | null> {
  const project = draft.peek();
  const origin = draftOrigin.peek();
  if (!project || !origin) return null;
  const { buildExport, exportFileName, exportText } = await fileFormat();
  const id = storedIdOf(origin);
  const envelope = buildExport(project, { exportedAt: new Date(), appVersion, ...(id !== undefined ? { projectId: id } : {}) });
  return { fileName: exportFileName(project.name), text: exportText(envelope) };
}

/** Offer the export as a download (a blob URL, same origin: nothing leaves the device). */
export async function downloadExport(appVersion: string): Promise<boolean> {
  const file = await exportOpenProject(appVersion);
  if (!file) return false;
  const url = URL.createObjectURL(new Blob([file.text], { type: 'application/json' }));
  const a = document.createElement('a');
  a.href = url;
  a.download = file.fileName;
  document.body.append(a);
  a.click();
  a.remove();
  setTimeout(() => URL.revokeObjectURL(url), 10_000);
  storageNotice.value = `Exported “${file.fileName}”. Keep it somewhere safe: it is your backup.`;
  return true;
}

function ask(fileName: string, existing: StoredProject): Promise<ImportChoice> {
  return new Promise((resolve) => {
    importQuestion.value = {
      fileName,
      existingName: recordName(existing),
      existingSavedAt: existing.savedAt,
      answer: (choice) => {
        importQuestion.value = null;
        resolve(choice);
      },
    };
  });
}

export type ImportResult = { ok: true; name: string } | { ok: false; message: string; cancelled?: boolean };

/**
 * Import a project file: checked (file-format.ts), then stored as a new project and opened. A file
 * whose project id is already stored asks first: keep both (default) or replace. Nothing stored
 * changes for a refused file.
 */
export async function importFile(file: File): Promise<ImportResult> {
  const { checkSize, parseImportBytes } = await fileFormat();
  const tooLarge = checkSize(file.size);
  if (tooLarge) return { ok: false, message: tooLarge };
  const checked = parseImportBytes(new Uint8Array(await file.arrayBuffer()));
  if (!checked.ok) return checked;
  const s = store();
  await flush();
  let replaceId: string | undefined;
  let reuseId: string | undefined;
  if (s && checked.projectId !== undefined) {
    const existing = await s.get(checked.projectId);
    if (existing?.ok && !existing.record.deletedAt) {
      const choice = await ask(file.name, existing.record);
      if (choice === 'cancel') return { ok: false, message: 'Import cancelled: nothing was changed.', cancelled: true };
      if (choice === 'replace') replaceId = checked.projectId;
    } else if (!existing) {
      reuseId = checked.projectId;
    }
  }
  const project = checked.project;
  if (!s) {
    loadProject(project, { kind: 'file', title: file.name, fileName: file.name });
    saveStatus.value = { state: 'failed', message: NO_STORAGE };
    return { ok: true, name: project.name };
  }
  const out =
    replaceId !== undefined
      ? await s.save(replaceId, project, tabId, null)
      : await s.create(project, tabId, reuseId !== undefined ? { id: reuseId } : {});
  if (!out.ok) {
    // Not stored: open it anyway so nothing is lost; the next edit tries to store it again.
    loadProject(project, { kind: 'file', title: file.name, fileName: file.name });
    saveStatus.value = { state: 'failed', message: out.reason === 'write-failed' || out.reason === 'not-writable' ? out.message : 'changed in another tab' };
    return { ok: true, name: project.name };
  }
  openRecord(out.record, true);
  announce({ type: 'saved', id: out.record.id, revision: out.record.revision, tabId });
  await refreshList();
  storageNotice.value = replaceId !== undefined ? `Replaced “${recordName(out.record)}” with the imported file.` : `Imported “${recordName(out.record)}”.`;
  return { ok: true, name: recordName(out.record) };
}

// ---------- storage status ----------

/** Whether the browser keeps this site's data until the user clears it, and how much is used. */
export async function checkPersistence(askForIt: boolean): Promise<void> {
  const s = typeof navigator !== 'undefined' ? navigator.storage : undefined;
  if (!s) {
    persistence.value = { supported: false, persisted: null, usage: null, quota: null };
    return;
  }
  let persisted: boolean | null = null;
  try {
    persisted = (await s.persisted?.()) ?? null;
    if (!persisted && askForIt && s.persist) persisted = await s.persist();
  } catch {
    persisted = null;
  }
  let usage: number | null = null;
  let quota: number | null = null;
  try {
    const e = await s.estimate?.();
    usage = e?.usage ?? null;
    quota = e?.quota ?? null;
  } catch {
    // No estimate: shown as unknown.
  }
  persistence.value = { supported: true, persisted, usage, quota };
}

// ---------- start ----------

let started = false;
/** The start's own work (old deletes removed, rescue copies applied): opening a project waits for it. */
let starting: Promise<void> = Promise.resolve();

/** Start autosave, the tab channel and the list (once, from main.tsx). */
export function startStorage(): void {
  if (started) return;
  started = true;
  effect(() => {
    void draftRevision.value;
    const origin = draftOrigin.value;
    if (rebinding) return;
    if (origin !== seenOrigin) {
      // Another project was opened: write what the last one still had pending, then start afresh. A
      // question about the last one stays open (parked) and keeps that project's own version.
      seenOrigin = origin;
      if (pending.length) void flush();
      if (origin?.kind !== 'stored' && saveStatus.peek().state !== 'failed') saveStatus.value = { state: 'idle' };
      return;
    }
    batch(markEdited);
  });
  const flushNow = () => void flush();
  // Leaving or hidden: the normal write starts, and a rescue copy is committed at once beside it.
  const leaving = () => {
    flushNow();
    writeRescues();
  };
  globalThis.addEventListener?.('pagehide', leaving);
  // Leaving while a write waits, failed or waits for an answer: the browser asks first (a write
  // started now still runs, and the page-hide flush follows if the user leaves anyway).
  globalThis.addEventListener?.('beforeunload', (event: BeforeUnloadEvent) => {
    const unsaved = hasUnsavedWork();
    flushNow();
    if (!unsaved) return;
    event.preventDefault();
    // Older Chromium and Safari ask only when returnValue is set.
    event.returnValue = '';
  });
  globalThis.document?.addEventListener('visibilitychange', () => {
    if (document.visibilityState === 'hidden') leaving();
  });
  if (typeof BroadcastChannel !== 'undefined') {
    channel = new BroadcastChannel(CHANNEL_NAME);
    channel.onmessage = (event: MessageEvent) => void onChannelMessage(event.data);
  }
  // Held for the life of this tab: another tab's start leaves this tab's rescue copies alone.
  void globalThis.navigator?.locks?.request(`${TAB_LOCK_PREFIX}${tabId}`, () => new Promise<void>(() => undefined)).catch(() => undefined);
  starting = (async () => {
    await store()?.purgeDeletedBefore(STALE_DELETE_MS).catch(() => 0);
    await recoverRescued().catch(() => undefined);
  })();
  void (async () => {
    await starting;
    await refreshList();
    await checkPersistence(false);
  })();
}
