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
 *
 * This file is the session's API (what the page and the tests import) and holds opening, the list's
 * actions and the start. Its parts: session-state.ts (signals, the store, the queue's and questions'
 * bookkeeping, the list and the storage status), write-queue.ts (autosave), tabs.ts (the other tabs and
 * the questions' answers), rescue.ts (leaving the page), files.ts (export and import).
 */
import { effect } from '@preact/signals';
import { loadProject, renameDraft } from '../state/editor.ts';
import { recordName } from './record.ts';
import { checkPersistence, conflictFor, openId, openRecord, pendingDelete, projectList, refreshList, saveStatus, setAddress, setDeleteTimer, STALE_DELETE_MS, storageNotice, store, storedIdOf, tabId, UNDO_DELETE_MS } from './session-state.ts';
import { flush, followDraft, hasUnsavedWork, pending } from './write-queue.ts';
import { announce, openChannel } from './tabs.ts';
import { recoverRescued, TAB_LOCK_PREFIX, writeRescues } from './rescue.ts';

export {
  AUTOSAVE_MS,
  UNDO_DELETE_MS,
  tabId,
  saveStatus,
  lastWriteMs,
  projectList,
  listLoaded,
  conflicts,
  pendingDelete,
  persistence,
  importQuestion,
  storageNotice,
  storedIdFromHash,
  hashForStored,
  conflictFor,
  refreshList,
  checkPersistence,
  type SaveStatus,
  type StorageConflict,
  type ImportChoice,
} from './session-state.ts';
export { flush, hasUnsavedWork } from './write-queue.ts';
export { onChannelMessage, resolveConflict, type ConflictChoice } from './tabs.ts';
export { recoverRescued } from './rescue.ts';
export { exportOpenProject, downloadExport, importFile, type ImportResult } from './files.ts';

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

async function finishDelete(): Promise<void> {
  const p = pendingDelete.peek();
  setDeleteTimer(undefined);
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
  setDeleteTimer(setTimeout(() => void finishDelete(), UNDO_DELETE_MS));
  announce({ type: 'deleted', id, tabId });
  await refreshList();
  return wasOpen;
}

export async function undoDelete(): Promise<void> {
  const p = pendingDelete.peek();
  if (!p) return;
  setDeleteTimer(undefined);
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

let started = false;
/** The start's own work (old deletes removed, rescue copies applied): opening a project waits for it. */
let starting: Promise<void> = Promise.resolve();

/** Start autosave, the tab channel and the list (once, from main.tsx). */
export function startStorage(): void {
  if (started) return;
  started = true;
  effect(followDraft);
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
  openChannel();
  // Held for the life of this tab: another tab's start leaves this tab's rescue copies alone.
  void globalThis.navigator?.locks?.request(`${TAB_LOCK_PREFIX}${tabId}`, () => new Promise<void>(() => undefined)).catch(() => undefined);
  starting = (async () => {
    await store()?.purgeDeletedBefore(STALE_DELETE_MS).catch(() => 0);
    await recoverRescued(() => void refreshList()).catch(() => undefined);
  })();
  void (async () => {
    await starting;
    await refreshList();
    await checkPersistence(false);
  })();
}
