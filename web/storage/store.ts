/**
 * Stored projects in IndexedDB through idb-keyval: one record per project (record.ts), written
 * with a revision check in the same transaction as the read, so two tabs cannot overwrite each
 * other's newer work unnoticed. The object store and the clock are parameters with defaults, so the
 * Node tests run the same code on fake-indexeddb with a fixed clock.
 */
import { createStore, del, entries, get, set, update, type UseStore } from 'idb-keyval';
import type { DraftProject } from '../state/editor.ts';
import { PROJECT_KEY_PREFIX, STORAGE_VERSION, projectKey, readRecord, recordName, type ReadRecord, type StoredProject } from './record.ts';

/** Database and object store names (one store: keys are "project:<id>"). */
export const DB_NAME = 'joulepath';
export const STORE_NAME = 'projects';

export type WriteOutcome =
  | { ok: true; record: StoredProject }
  /** Another tab wrote a newer revision since this tab loaded or saved (`theirs` is what is stored). */
  | { ok: false; reason: 'conflict'; theirs: StoredProject }
  /** The browser refused the write (quota, private mode, storage cleared …). Nothing was changed. */
  | { ok: false; reason: 'write-failed'; message: string };

/** A record as listed: readable, or not (newer layout, damaged) with the reason. */
export type ListedProject = ReadRecord;

/** A plain sentence for a failed IndexedDB operation (quota first: the common one on a full phone). */
export function describeWriteError(error: unknown): string {
  const name = typeof error === 'object' && error !== null && 'name' in error ? String((error as { name: unknown }).name) : '';
  if (name === 'QuotaExceededError') return 'the browser has no more storage space for this site (quota exceeded)';
  if (name === 'InvalidStateError' || name === 'UnknownError') return 'the browser refused to open its storage (private browsing or storage switched off?)';
  return `the browser refused the write (${error instanceof Error ? error.message : String(error)})`;
}

export interface ProjectStoreOptions {
  store?: UseStore;
  now?: () => Date;
  newId?: () => string;
}

export class ProjectStore {
  readonly #store: UseStore;
  readonly #now: () => Date;
  readonly #newId: () => string;

  constructor(options: ProjectStoreOptions = {}) {
    this.#store = options.store ?? createStore(DB_NAME, STORE_NAME);
    this.#now = options.now ?? (() => new Date());
    this.#newId = options.newId ?? (() => globalThis.crypto.randomUUID());
  }

  /** Every project record, newest save first; records hidden by a pending delete are left out. */
  async list(): Promise<ListedProject[]> {
    const all = await entries(this.#store);
    const out: ListedProject[] = [];
    for (const [key, value] of all) {
      if (typeof key !== 'string' || !key.startsWith(PROJECT_KEY_PREFIX)) continue;
      const read = readRecord(key.slice(PROJECT_KEY_PREFIX.length), value);
      if (read.ok && read.record.deletedAt) continue;
      out.push(read);
    }
    return out.sort((a, b) => savedTime(b) - savedTime(a));
  }

  /** One record (migrated when older), or undefined when there is none. */
  async get(id: string): Promise<ReadRecord | undefined> {
    const raw = await get(projectKey(id), this.#store);
    return raw === undefined ? undefined : readRecord(id, raw);
  }

  /** Store a project as a new record (a fresh id unless one is given and free). */
  async create(project: DraftProject, tabId: string, extra: { demoId?: string; id?: string } = {}): Promise<WriteOutcome> {
    const time = this.#now().toISOString();
    const record: StoredProject = {
      storageVersion: STORAGE_VERSION,
      id: extra.id ?? this.#newId(),
      createdAt: time,
      savedAt: time,
      revision: 1,
      tabId,
      project: structuredClone(project),
    };
    if (extra.demoId !== undefined) record.demoId = extra.demoId;
    try {
      await set(projectKey(record.id), record, this.#store);
      return { ok: true, record };
    } catch (error) {
      return { ok: false, reason: 'write-failed', message: describeWriteError(error) };
    }
  }

  /**
   * Write a project over its record. `expectedRevision` is the revision this tab last loaded or
   * wrote; when the stored record has another one, nothing is written and the stored record comes
   * back as a conflict. `null` writes whatever is stored ("keep mine"). A record that is gone (deleted
   * in another tab) is written again: the work in this tab is never dropped.
   */
  async save(id: string, project: DraftProject, tabId: string, expectedRevision: number | null): Promise<WriteOutcome> {
    let conflict: StoredProject | undefined;
    let written: StoredProject | undefined;
    const time = this.#now().toISOString();
    try {
      // idb-keyval's update reads and writes in one readwrite transaction: no other tab can write between.
      await update(
        projectKey(id),
        (old: unknown) => {
          const read = old === undefined ? undefined : readRecord(id, old);
          const stored = read?.ok ? read.record : undefined;
          if (stored && expectedRevision !== null && stored.revision !== expectedRevision && !stored.deletedAt) {
            conflict = stored;
            return old;
          }
          const next: StoredProject = {
            storageVersion: STORAGE_VERSION,
            id,
            createdAt: stored?.createdAt ?? time,
            savedAt: time,
            revision: Math.max(stored?.revision ?? 0, expectedRevision ?? 0) + 1,
            tabId,
            project: structuredClone(project),
          };
          if (stored?.demoId !== undefined) next.demoId = stored.demoId;
          written = next;
          return next;
        },
        this.#store,
      );
    } catch (error) {
      return { ok: false, reason: 'write-failed', message: describeWriteError(error) };
    }
    if (conflict) return { ok: false, reason: 'conflict', theirs: conflict };
    return { ok: true, record: written! };
  }

  /** Rename a stored project (its project name; the record's revision goes up). */
  async rename(id: string, name: string, tabId: string): Promise<WriteOutcome> {
    const read = await this.get(id);
    if (!read?.ok) return { ok: false, reason: 'write-failed', message: 'the project is not stored any more' };
    return this.save(id, { ...read.record.project, name }, tabId, read.record.revision);
  }

  /** A copy as a new record, named "<name> (copy)". */
  async duplicate(id: string, tabId: string): Promise<WriteOutcome> {
    const read = await this.get(id);
    if (!read?.ok) return { ok: false, reason: 'write-failed', message: 'the project is not stored any more' };
    return this.create({ ...read.record.project, name: `${recordName(read.record)} (copy)` }, tabId);
  }

  /** Hide a record for the undo period: it stays stored until `purge` (or `restore` brings it back). */
  async markDeleted(id: string): Promise<boolean> {
    return this.#setDeleted(id, this.#now().toISOString());
  }

  async restore(id: string): Promise<boolean> {
    return this.#setDeleted(id, undefined);
  }

  /** Remove a record for good, only if it is still marked deleted (another tab may have restored it). */
  async purge(id: string): Promise<void> {
    const read = await this.get(id);
    if (read?.ok && read.record.deletedAt) await del(projectKey(id), this.#store);
  }

  /** Remove records whose delete was not undone within `graceMs` (a tab closed during its undo period). */
  async purgeDeletedBefore(graceMs: number): Promise<number> {
    const cutoff = this.#now().getTime() - graceMs;
    let removed = 0;
    for (const [key, value] of await entries(this.#store)) {
      if (typeof key !== 'string' || !key.startsWith(PROJECT_KEY_PREFIX)) continue;
      const read = readRecord(key.slice(PROJECT_KEY_PREFIX.length), value);
      if (read.ok && read.record.deletedAt && Date.parse(read.record.deletedAt) < cutoff) {
        await del(key, this.#store);
        removed++;
      }
    }
    return removed;
  }

  /** Every raw value in the store (tests and the browser tests compare before/after). */
  async dump(): Promise<[string, unknown][]> {
    return (await entries(this.#store)).map(([k, v]) => [String(k), v]);
  }

  async #setDeleted(id: string, deletedAt: string | undefined): Promise<boolean> {
    // update() would write `undefined` under a missing key: look first.
    if ((await get(projectKey(id), this.#store)) === undefined) return false;
    let found = false;
    await update(
      projectKey(id),
      (old: unknown) => {
        if (old === undefined) return old;
        const read = readRecord(id, old);
        if (!read.ok) return old;
        found = true;
        const { deletedAt: _was, ...rest } = read.record;
        return deletedAt === undefined ? rest : { ...rest, deletedAt };
      },
      this.#store,
    );
    return found;
  }
}

function savedTime(r: ListedProject): number {
  return r.ok ? Date.parse(r.record.savedAt) : -Infinity;
}
