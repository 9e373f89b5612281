/**
 * Storage in the running app: autosave of the open project, the project list, delete with undo,
 * import and export of files, the two-tab conflict check and the browser's storage status.
 *
 * - Autosave: every change to the draft (state/editor.ts counts them in `draftRevision`) is written
 *   at most every AUTOSAVE_MS, and at once when the page is hidden or left. Writes run one after the
 *   other. A demo is a read-only template: its first edit stores a copy ("… (my copy)") and the copy
 *   is what is saved from then on; a new project is stored from its first edit.
 * - A failed write (quota, storage switched off) changes nothing stored, says so plainly and keeps the
 *   draft in memory; the next edit tries again.
 * - Two tabs: each write checks, in the same transaction, that the stored revision is the one this
 *   tab last loaded or wrote (store.ts); tabs also announce writes on a BroadcastChannel. When another
 *   tab wrote first, nothing is written and the user chooses (load theirs, keep mine, save mine as a copy).
 */
import { batch, effect, signal } from '@preact/signals';
import {
  draft,
  draftOrigin,
  draftRevision,
  lastValidResult,
  loadProject,
  renameDraft,
  type DraftOrigin,
  type DraftProject,
} from '../state/editor.ts';
// The file checks and their schemas load on the first import or export (outside the first-load budget).
const fileFormat = () => import('./file-format.ts');
import { recordName, type StoredProject } from './record.ts';
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
/** Another tab saved the open project after this tab last loaded or saved it. */
export const conflict = signal<{ id: string; theirs: StoredProject } | null>(null);
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
  if (globalThis.location?.hash === hash) return;
  if (push) globalThis.history.pushState(null, '', hash);
  else globalThis.history.replaceState(null, '', hash);
}

// ---------- autosave ----------

type Snapshot = { origin: DraftOrigin; project: DraftProject };

/** The latest edit not yet written. */
let pending: Snapshot | null = null;
let timer: ReturnType<typeof setTimeout> | undefined;
let queue: Promise<void> = Promise.resolve();
/** Demo / new / file origins whose first edit has been stored, and the id it got. */
const createdFor = new WeakMap<DraftOrigin, string>();
/** The revision of each record this tab last loaded or wrote. */
const known = new Map<string, number>();
/** The origin of the draft the autosave last saw: a different one means a project was opened. */
let seenOrigin: DraftOrigin | null = null;
let rebinding = false;
let askedPersistence = false;
let channel: BroadcastChannel | null = null;

function storedIdOf(origin: DraftOrigin): string | undefined {
  return origin.kind === 'stored' ? origin.storedKey : createdFor.get(origin);
}

function markEdited(): void {
  const origin = draftOrigin.peek();
  const project = draft.peek();
  if (!origin || !project) return;
  pending = { origin, project };
  const s = saveStatus.peek().state;
  // Set once per batch of edits (a new object on every keystroke would redraw the save line each time).
  if (s !== 'failed' && s !== 'conflict' && s !== 'pending') saveStatus.value = { state: 'pending' };
  if (timer === undefined) timer = setTimeout(() => void flush(), AUTOSAVE_MS);
}

/** Write the latest edit now (also waits for writes under way). */
export function flush(): Promise<void> {
  if (timer !== undefined) {
    clearTimeout(timer);
    timer = undefined;
  }
  const snap = pending;
  if (snap) {
    pending = null;
    queue = queue.then(() => write(snap)).catch((error: unknown) => {
      saveStatus.value = { state: 'failed', message: `the save stopped unexpectedly (${String(error)})` };
    });
  }
  return queue;
}

/** Keep a snapshot that could not be written, unless a newer edit replaced it meanwhile. */
function keepUnwritten(snap: Snapshot): void {
  if (!pending) pending = snap;
}

/** Point the open draft at its stored record (after its first edit was stored) without reloading it. */
function rebind(from: DraftOrigin, to: DraftOrigin): void {
  if (draftOrigin.peek() !== from) return;
  const keep = lastValidResult.peek();
  rebinding = true;
  try {
    seenOrigin = to;
    draftOrigin.value = to;
    // The editor clears the last valid results when the origin changes; this is the same project.
    lastValidResult.value = keep;
  } finally {
    rebinding = false;
  }
  if (to.storedKey) setAddress(to.storedKey, false);
}

async function write(snap: Snapshot): Promise<void> {
  const s = store();
  if (!s) {
    keepUnwritten(snap);
    saveStatus.value = { state: 'failed', message: NO_STORAGE };
    return;
  }
  const id = storedIdOf(snap.origin);
  if (id !== undefined && conflict.peek()?.id === id) {
    keepUnwritten(snap); // paused until the user chooses
    return;
  }
  const t0 = performance.now();
  let outcome: WriteOutcome;
  if (id === undefined) {
    let project = snap.project;
    if (snap.origin.kind === 'demo') {
      const name = `${project.name} (my copy)`;
      project = { ...project, name };
      const unchangedSince = draftOrigin.peek() === snap.origin && draft.peek() === snap.project;
      if (draftOrigin.peek() === snap.origin) renameDraft(name);
      if (unchangedSince) {
        // The rename is the only change since the snapshot: it is written now, not a second time.
        project = draft.peek()!;
        pending = null;
        if (timer !== undefined) clearTimeout(timer);
        timer = undefined;
      }
    }
    outcome = await s.create(project, tabId, snap.origin.demoId !== undefined ? { demoId: snap.origin.demoId } : {});
    if (outcome.ok) {
      createdFor.set(snap.origin, outcome.record.id);
      rebind(snap.origin, { kind: 'stored', title: recordName(outcome.record), storedKey: outcome.record.id });
      storageNotice.value =
        snap.origin.kind === 'demo' ? `Demos stay as they are: your changes are saved in “${recordName(outcome.record)}”.` : `Saved as “${recordName(outcome.record)}”.`;
    }
  } else {
    outcome = await s.save(id, snap.project, tabId, known.get(id) ?? null);
  }
  const ms = performance.now() - t0;
  if (outcome.ok) {
    known.set(outcome.record.id, outcome.record.revision);
    lastWriteMs.value = ms;
    saveStatus.value = { state: 'saved', savedAt: outcome.record.savedAt };
    announce({ type: 'saved', id: outcome.record.id, revision: outcome.record.revision, tabId });
    void refreshList();
    void checkPersistence(!askedPersistence);
    askedPersistence = true;
  } else if (outcome.reason === 'conflict') {
    keepUnwritten(snap);
    conflict.value = { id: id!, theirs: outcome.theirs };
    saveStatus.value = { state: 'conflict' };
  } else {
    keepUnwritten(snap);
    saveStatus.value = { state: 'failed', message: outcome.message };
  }
}

// ---------- opening ----------

function openRecord(record: StoredProject, push: boolean): void {
  known.set(record.id, record.revision);
  loadProject(record.project, { kind: 'stored', title: recordName(record), storedKey: record.id });
  saveStatus.value = { state: 'saved', savedAt: record.savedAt };
  setAddress(record.id, push);
}

/** Open a stored project; false (with a notice) when it cannot be read. */
export async function openStored(id: string, options: { updateAddress?: boolean } = {}): Promise<boolean> {
  const s = store();
  if (!s) return false;
  await flush();
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

export async function renameStored(id: string, name: string): Promise<void> {
  const trimmed = name.trim();
  if (!trimmed) return;
  if (draftOrigin.peek()?.storedKey === id) {
    renameDraft(trimmed); // autosave writes it, with the conflict check
    await flush();
  } else {
    const out = await store()?.rename(id, trimmed, tabId);
    if (out && !out.ok) storageNotice.value = `Not renamed: ${out.reason === 'conflict' ? 'changed in another tab, try again' : out.message}.`;
    announce({ type: 'list' });
  }
  await refreshList();
}

export async function duplicateStored(id: string): Promise<void> {
  if (draftOrigin.peek()?.storedKey === id) await flush();
  const out = await store()?.duplicate(id, tabId);
  if (out?.ok) storageNotice.value = `Duplicated as “${recordName(out.record)}”.`;
  else if (out) storageNotice.value = `Not duplicated: ${out.reason === 'write-failed' ? out.message : 'try again'}.`;
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

/** Hide a project for UNDO_DELETE_MS, then remove it; returns whether it was the open one. */
export async function deleteStored(id: string): Promise<boolean> {
  const s = store();
  if (!s) return false;
  await finishDelete();
  const wasOpen = draftOrigin.peek()?.storedKey === id;
  if (wasOpen) await flush();
  const listed = projectList.peek().find((r) => r.ok && r.record.id === id);
  const name = listed?.ok ? recordName(listed.record) : 'the project';
  if (!(await s.markDeleted(id))) return false;
  pendingDelete.value = { id, name, wasOpen };
  deleteTimer = setTimeout(() => void finishDelete(), UNDO_DELETE_MS);
  announce({ type: 'list' });
  await refreshList();
  return wasOpen;
}

export async function undoDelete(): Promise<void> {
  const p = pendingDelete.peek();
  if (!p) return;
  if (deleteTimer !== undefined) clearTimeout(deleteTimer);
  deleteTimer = undefined;
  pendingDelete.value = null;
  await store()?.restore(p.id);
  announce({ type: 'list' });
  await refreshList();
  if (p.wasOpen) await openStored(p.id);
  storageNotice.value = `“${p.name}” is back.`;
}

// ---------- two tabs ----------

type ChannelMessage = { type: 'saved'; id: string; revision: number; tabId: string } | { type: 'list' };

function announce(message: ChannelMessage): void {
  try {
    channel?.postMessage(message);
  } catch {
    // A closed channel only loses the notice; the revision check before each write still holds.
  }
}

async function onChannelMessage(message: unknown): Promise<void> {
  if (typeof message !== 'object' || message === null) return;
  const m = message as Partial<ChannelMessage>;
  await refreshList();
  if (m.type !== 'saved' || typeof m.id !== 'string' || typeof m.revision !== 'number' || m.tabId === tabId) return;
  const open = draftOrigin.peek();
  const openId = open ? storedIdOf(open) : undefined;
  if (openId !== m.id || m.revision <= (known.get(m.id) ?? Infinity)) return;
  const read = await store()?.get(m.id);
  if (read?.ok && read.record.revision > (known.get(m.id) ?? Infinity) && read.record.tabId !== tabId) {
    conflict.value = { id: m.id, theirs: read.record };
    saveStatus.value = { state: 'conflict' };
  }
}

export type ConflictChoice = 'load-theirs' | 'keep-mine' | 'save-copy';

export async function resolveConflict(choice: ConflictChoice): Promise<void> {
  const c = conflict.peek();
  const s = store();
  if (!c || !s) return;
  if (timer !== undefined) clearTimeout(timer);
  timer = undefined;
  await queue;
  const mine = pending?.project ?? draft.peek();
  const origin = draftOrigin.peek();
  pending = null;
  if (choice === 'load-theirs') {
    const read = await s.get(c.id);
    conflict.value = null;
    if (read?.ok) openRecord(read.record, false);
    storageNotice.value = 'Loaded the version saved in the other tab.';
    return;
  }
  if (!mine || !origin) {
    conflict.value = null;
    return;
  }
  if (choice === 'keep-mine') {
    const out = await s.save(c.id, mine, tabId, null);
    conflict.value = null;
    if (out.ok) {
      known.set(c.id, out.record.revision);
      saveStatus.value = { state: 'saved', savedAt: out.record.savedAt };
      announce({ type: 'saved', id: c.id, revision: out.record.revision, tabId });
      storageNotice.value = 'Your version is saved over the other one.';
    } else {
      pending = { origin, project: mine };
      saveStatus.value = { state: 'failed', message: out.reason === 'write-failed' ? out.message : 'changed again in another tab' };
    }
  } else {
    const name = `${mine.name} (copy)`;
    const out = await s.create({ ...mine, name }, tabId);
    conflict.value = null;
    if (out.ok) {
      known.set(out.record.id, out.record.revision);
      renameDraft(name);
      pending = null;
      rebind(draftOrigin.peek()!, { kind: 'stored', title: name, storedKey: out.record.id });
      if (timer !== undefined) clearTimeout(timer);
      timer = undefined;
      pending = null;
      saveStatus.value = { state: 'saved', savedAt: out.record.savedAt };
      announce({ type: 'saved', id: out.record.id, revision: out.record.revision, tabId });
      storageNotice.value = `Your version is saved as “${name}”; the other tab's version is kept too.`;
    } else {
      pending = { origin, project: mine };
      saveStatus.value = { state: 'failed', message: out.reason === 'write-failed' ? out.message : 'try again' };
    }
  }
  await refreshList();
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
    saveStatus.value = { state: 'failed', message: out.reason === 'write-failed' ? out.message : 'changed in another tab' };
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

/** Start autosave, the tab channel and the list (once, from main.tsx). */
export function startStorage(): void {
  if (started) return;
  started = true;
  effect(() => {
    void draftRevision.value;
    const origin = draftOrigin.value;
    if (rebinding) return;
    if (origin !== seenOrigin) {
      // Another project was opened: write what the last one still had pending, then start afresh.
      seenOrigin = origin;
      if (pending) void flush();
      if (origin?.kind !== 'stored' && saveStatus.peek().state !== 'failed') saveStatus.value = { state: 'idle' };
      conflict.value = null;
      return;
    }
    batch(markEdited);
  });
  const flushNow = () => void flush();
  globalThis.addEventListener?.('pagehide', flushNow);
  globalThis.document?.addEventListener('visibilitychange', () => {
    if (document.visibilityState === 'hidden') flushNow();
  });
  if (typeof BroadcastChannel !== 'undefined') {
    channel = new BroadcastChannel(CHANNEL_NAME);
    channel.onmessage = (event: MessageEvent) => void onChannelMessage(event.data);
  }
  void (async () => {
    await store()?.purgeDeletedBefore(STALE_DELETE_MS).catch(() => 0);
    await refreshList();
    await checkPersistence(false);
  })();
}
