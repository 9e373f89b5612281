/**
 * Two tabs: each announces its writes and deletes on a BroadcastChannel, and a change or delete of a
 * project this tab has its own version of becomes a question to the user (`conflicts`); the answers
 * write only that project's own version.
 */
import { draft, draftOrigin, type DraftOrigin, type DraftProject } from '../state/editor.ts';
import { copyName, recordName } from './record.ts';
import { CHANNEL_NAME, conflictFor, conflicts, dropConflict, known, listedNames, openId, openRecord, pendingDelete, refreshList, saveStatus, setConflict, setDeleteTimer, storageNotice, store, storedIdOf, tabId } from './session-state.ts';
import { flush, nameDraftAsStored, pending, rebind, requeue, retarget, takePending } from './write-queue.ts';
import { dropRescue } from './rescue.ts';

let channel: BroadcastChannel | null = null;

/** Listen to the other tabs (once, from startStorage). */
export function openChannel(): void {
  if (typeof BroadcastChannel === 'undefined') return;
  channel = new BroadcastChannel(CHANNEL_NAME);
  channel.onmessage = (event: MessageEvent) => void onChannelMessage(event.data);
}

type ChannelMessage =
  | { type: 'saved'; id: string; revision: number; tabId: string }
  | { type: 'deleted'; id: string; tabId: string }
  | { type: 'restored'; id: string; tabId: string }
  | { type: 'list' };

export function announce(message: ChannelMessage): void {
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
        setDeleteTimer(undefined);
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
      retarget(c.id, to);
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
