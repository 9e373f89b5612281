/**
 * What the parts of the storage session share (web/storage/session.ts is the session's API): the
 * signals the page shows, the store, the address of a stored project, the bookkeeping of open
 * questions and of the records this tab knows (at which revision, under which id), the project list
 * and the browser's storage status. The edits waiting to be written belong to write-queue.ts.
 */
import { signal } from '@preact/signals';
import { draftOrigin, type DraftOrigin, type DraftProject, loadProject } from '../state/editor.ts';
import { recordName, type StoredProject } from './record.ts';
import { type ListedProject, ProjectStore } from './store.ts';

/** Longest wait between an edit and its write. */
export const AUTOSAVE_MS = 300;
/** How long a deleted project can be brought back. */
export const UNDO_DELETE_MS = 8000;
/** Records still marked deleted this long after (their tab closed during the undo period) are removed. */
export const STALE_DELETE_MS = 60_000;
export const CHANNEL_NAME = 'joulepath-projects';
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
export function store(): ProjectStore | null {
  if (projectStore === undefined) {
    try {
      projectStore = typeof indexedDB === 'undefined' ? null : new ProjectStore();
    } catch {
      projectStore = null;
    }
  }
  return projectStore;
}

export const NO_STORAGE = 'this browser offers no storage to this page (private browsing, or site data switched off)';

export function storedIdFromHash(hash: string): string | undefined {
  if (!hash.startsWith(HASH_PREFIX)) return undefined;
  const id = decodeURIComponent(hash.slice(HASH_PREFIX.length));
  return /^[A-Za-z0-9-]{1,64}$/.test(id) ? id : undefined;
}

export function hashForStored(id: string): string {
  return `${HASH_PREFIX}${encodeURIComponent(id)}`;
}

export function setAddress(id: string, push: boolean): void {
  const hash = hashForStored(id);
  if (!globalThis.history || globalThis.location?.hash === hash) return;
  if (push) globalThis.history.pushState(null, '', hash);
  else globalThis.history.replaceState(null, '', hash);
}

/** One version of a project to write; `seq` numbers the edits of this tab (later edits, higher numbers). */
export type Snapshot = { origin: DraftOrigin; project: DraftProject; seq: number };

// Set by the list actions (session.ts) and ended by the tabs (tabs.ts): changed through its setter only.
/** Removes a deleted project for good when the undo period ends. */
let deleteTimer: ReturnType<typeof setTimeout> | undefined;
/** Start the undo period's timer, or end it (undefined); a timer still running is cleared first. */
export const setDeleteTimer = (next: ReturnType<typeof setTimeout> | undefined): void => {
  if (deleteTimer !== undefined) clearTimeout(deleteTimer);
  deleteTimer = next;
};

/** Demo / new / file origins whose first edit has been stored, and the id it got. */
export const createdFor = new WeakMap<DraftOrigin, string>();
/** The id a not-yet-stored origin's first write uses (chosen before the write, so a rescue copy names it too). */
export const plannedFor = new WeakMap<DraftOrigin, string>();
/** Snapshots taken by a write round and not written yet. */
export const inFlight = new Set<Snapshot>();
/** The revision of each record this tab last loaded or wrote. */
export const known = new Map<string, number>();
export function storedIdOf(origin: DraftOrigin | null | undefined): string | undefined {
  if (!origin) return undefined;
  return origin.kind === 'stored' ? origin.storedKey : createdFor.get(origin);
}

/** Two origins of one project (a demo's origin and the stored copy it became count as one). */
export function sameProject(a: DraftOrigin, b: DraftOrigin): boolean {
  if (a === b) return true;
  const id = storedIdOf(a);
  return id !== undefined && id === storedIdOf(b);
}

export function openId(): string | undefined {
  return storedIdOf(draftOrigin.peek());
}

export function conflictFor(id: string | undefined): StorageConflict | undefined {
  return id === undefined ? undefined : conflicts.peek().find((c) => c.id === id);
}

export function setConflict(next: StorageConflict): void {
  const list = conflicts.peek();
  conflicts.value = list.some((c) => c.id === next.id) ? list.map((c) => (c.id === next.id ? next : c)) : [...list, next];
  if (openId() === next.id) saveStatus.value = { state: 'conflict' };
}

export function dropConflict(id: string): void {
  conflicts.value = conflicts.peek().filter((c) => c.id !== id);
}


export function listedNames(): string[] {
  return projectList.peek().flatMap((r) => (r.ok ? [recordName(r.record)] : []));
}

export function openRecord(record: StoredProject, push: boolean): void {
  known.set(record.id, record.revision);
  loadProject(record.project, { kind: 'stored', title: recordName(record), storedKey: record.id });
  saveStatus.value = { state: 'saved', savedAt: record.savedAt };
  setAddress(record.id, push);
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
