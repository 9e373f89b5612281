/**
 * Autosave: every change to the draft is written at most every AUTOSAVE_MS, one write after the other,
 * each checking the stored revision in the same transaction (store.ts). A demo's first edit stores a
 * copy, a new project is stored from its first edit; a refused write keeps the version in memory and
 * says so; a write that meets another tab's change or delete becomes a question (session-state.ts).
 */
import { batch } from '@preact/signals';
import { draft, draftOrigin, draftRevision, type DraftOrigin, type DraftProject, lastSolved, renameDraft } from '../state/editor.ts';
import { copyName, recordName } from './record.ts';
import type { WriteOutcome } from './store.ts';
import { AUTOSAVE_MS, checkPersistence, conflictFor, conflicts, createdFor, inFlight, known, lastWriteMs, listedNames, NO_STORAGE, plannedFor, refreshList, sameProject, saveStatus, setAddress, setConflict, type Snapshot, storageNotice, store, storedIdOf, tabId } from './session-state.ts';
import { announce } from './tabs.ts';
import { dropRescue } from './rescue.ts';

let editSeq = 0;
/** Edits not yet written, at most one (the latest) per project, oldest first (other parts read it; only this file changes it). */
export let pending: Snapshot[] = [];
/** The origin of the draft the autosave last saw: a different one means a project was opened. */
let seenOrigin: DraftOrigin | null = null;
let rebinding = false;
/** Snapshots kept after a refused write (the save line stays "Not saved" while any is left). */
const unwritten = new WeakSet<Snapshot>();
let timer: ReturnType<typeof setTimeout> | undefined;
let queue: Promise<void> = Promise.resolve();
/** Write rounds queued or under way. */
let writing = 0;
let askedPersistence = false;

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
export function rebind(from: DraftOrigin, to: DraftOrigin): void {
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
export function nameDraftAsStored(name: string, written: DraftProject): void {
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

/** Put a project's version back in the autosave queue (after its question was answered or dropped). */
export function requeue(id: string, project: DraftProject): void {
  const open = draftOrigin.peek();
  const origin = open && storedIdOf(open) === id ? open : { kind: 'stored' as const, title: project.name, storedKey: id };
  const latest = origin === open ? (draft.peek() ?? project) : project;
  pending = [...pending.filter((p) => storedIdOf(p.origin) !== id), { origin, project: latest, seq: ++editSeq }];
  if (origin === open) saveStatus.value = { state: 'pending' };
  void flush();
}

/** Take the pending edit of a project out of the queue (it goes into a question, or is given up). */
export function takePending(id: string): Snapshot | undefined {
  const mine = pending.filter((p) => storedIdOf(p.origin) === id);
  if (!mine.length) return undefined;
  pending = pending.filter((p) => !mine.includes(p));
  return mine.at(-1);
}

/**
 * The autosave's reaction to the draft (run as an effect from startStorage): an edit is queued; another
 * project opened writes what the last one still had pending, then starts afresh. A question about the
 * last one stays open (parked) and keeps that project's own version.
 */
export function followDraft(): void {
  void draftRevision.value;
  const origin = draftOrigin.value;
  if (rebinding) return;
  if (origin !== seenOrigin) {
    seenOrigin = origin;
    if (pending.length) void flush();
    if (origin?.kind !== 'stored' && saveStatus.peek().state !== 'failed') saveStatus.value = { state: 'idle' };
    return;
  }
  // A shared project is read-only and never stored by itself (web/state/share-open.ts).
  if (origin?.kind === 'shared') return;
  batch(markEdited);
}

/** The open draft became a copy stored as `to`: its edits waiting under the old id follow it. */
export function retarget(id: string, to: DraftOrigin): void {
  pending = pending.map((p) => (storedIdOf(p.origin) === id ? { ...p, origin: to } : p));
}
