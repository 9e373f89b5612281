/**
 * Stored projects in IndexedDB through idb-keyval: one record per project (record.ts), written
 * with a revision check in the same transaction as the read, so two tabs cannot overwrite each
 * other's newer work unnoticed. The object store and the clock are parameters with defaults, so the
 * Node tests run the same code on fake-indexeddb with a fixed clock.
 */
import { createStore, entries, get, promisifyRequest, type UseStore } from 'idb-keyval';
import type { DraftProject } from '../state/editor.ts';
import {
  PROJECT_KEY_PREFIX,
  RESCUE_KEY_PREFIX,
  STORAGE_VERSION,
  copyName,
  notWritableMessage,
  projectKey,
  readRecord,
  recordName,
  type ReadRecord,
  type RescueRecord,
  type StoredProject,
} from './record.ts';

/** Database and object store names (one store: keys are "project:<id>"). */
export const DB_NAME = 'joulepath';
export const STORE_NAME = 'projects';

export type WriteOutcome =
  | { ok: true; record: StoredProject }
  /** Another tab wrote a newer revision since this tab loaded or saved (`theirs` is what is stored). */
  | { ok: false; reason: 'conflict'; theirs: StoredProject }
  /**
   * Another tab deleted the project since this tab loaded or saved it: `theirs` is the record while
   * its delete can still be undone, null once it is removed. Nothing was written (no silent restore).
   */
  | { ok: false; reason: 'deleted'; theirs: StoredProject | null }
  /** The stored value is of a newer layout (or damaged): it is never written over. */
  | { ok: false; reason: 'not-writable'; message: string }
  /** The browser refused the write (quota, private mode, storage cleared …). Nothing was changed. */
  | { ok: false; reason: 'write-failed'; message: string };

/** Outcome of marking a record deleted or restoring it. */
export type MarkOutcome = { ok: true; record: StoredProject } | { ok: false; message: string };

/** A record as listed: readable, or not (newer layout, damaged) with the reason. */
export type ListedProject = ReadRecord;

/** A plain sentence for a failed IndexedDB operation (quota first: the common one on a full phone). */
export function describeWriteError(error: unknown): string {
  const name = typeof error === 'object' && error !== null && 'name' in error ? String((error as { name: unknown }).name) : '';
  if (name === 'QuotaExceededError') return 'the browser has no more storage space for this site (quota exceeded)';
  if (name === 'InvalidStateError' || name === 'UnknownError') return 'the browser refused to open its storage (private browsing or storage switched off?)';
  return `the browser refused the write (${error instanceof Error ? error.message : String(error)})`;
}

/** What a decision in `change` does with the key: write a value, remove it, or leave it. */
type Change = { put: unknown } | { remove: true } | null;

/**
 * Read one key and write or remove it in the same readwrite transaction (no other tab can write
 * between), or leave it untouched. Unlike idb-keyval's `update`, "leave it" writes nothing: no
 * `undefined` value under a missing key, no rewrite of a record that must stay byte-identical.
 */
function change(key: string, store: UseStore, decide: (old: unknown) => Change): Promise<void> {
  return store('readwrite', (s) =>
    new Promise<void>((resolve, reject) => {
      const read = s.get(key);
      read.onerror = () => reject(read.error);
      read.onsuccess = () => {
        try {
          const d = decide(read.result);
          if (d && 'put' in d) s.put(d.put, key);
          else if (d) s.delete(key);
          resolve(promisifyRequest(s.transaction));
        } catch (error) {
          reject(error);
        }
      };
    }),
  );
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

  /** The names of the listed (readable, not deleted) projects: copies get a name not among them. */
  async names(): Promise<string[]> {
    return (await this.list()).flatMap((r) => (r.ok ? [recordName(r.record)] : []));
  }

  /** One record (migrated when older), or undefined when there is none. */
  async get(id: string): Promise<ReadRecord | undefined> {
    const raw = await get(projectKey(id), this.#store);
    return raw === undefined ? undefined : readRecord(id, raw);
  }

  /**
   * Store a project as a new record: under `extra.id` when given and free, else under a fresh id
   * (never over anything stored).
   */
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
      let taken = false;
      await change(projectKey(record.id), this.#store, (old) => {
        taken = old !== undefined;
        return taken ? null : { put: record };
      });
      if (taken) return extra.id !== undefined ? this.create(project, tabId, { ...extra, id: this.#newId() }) : { ok: false, reason: 'write-failed', message: 'the new id was taken' };
      return { ok: true, record };
    } catch (error) {
      return { ok: false, reason: 'write-failed', message: describeWriteError(error) };
    }
  }

  /**
   * Write a project over its record. `expectedRevision` is the revision this tab last loaded or
   * wrote; when the stored record has another one, nothing is written and the stored record comes
   * back as a conflict. A record deleted in another tab (marked for undo, or removed) is not written
   * either ('deleted'): this tab's user decides. `null` writes whatever is stored ("keep mine",
   * "restore it with my version"; a pending delete is then cancelled). A record of a newer layout
   * (or damaged) is never written over, whatever the expected revision.
   */
  async save(id: string, project: DraftProject, tabId: string, expectedRevision: number | null): Promise<WriteOutcome> {
    let refused: WriteOutcome | undefined;
    let written: StoredProject | undefined;
    const time = this.#now().toISOString();
    try {
      await change(projectKey(id), this.#store, (old) => {
        let stored: StoredProject | undefined;
        if (old === undefined) {
          if (expectedRevision !== null) {
            refused = { ok: false, reason: 'deleted', theirs: null };
            return null;
          }
        } else {
          const read = readRecord(id, old);
          if (!read.ok) {
            refused = { ok: false, reason: 'not-writable', message: notWritableMessage(read) };
            return null;
          }
          stored = read.record;
          if (expectedRevision !== null && stored.deletedAt) {
            refused = { ok: false, reason: 'deleted', theirs: stored };
            return null;
          }
          if (expectedRevision !== null && stored.revision !== expectedRevision) {
            refused = { ok: false, reason: 'conflict', theirs: stored };
            return null;
          }
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
        return { put: next };
      });
    } catch (error) {
      return { ok: false, reason: 'write-failed', message: describeWriteError(error) };
    }
    return refused ?? { ok: true, record: written! };
  }

  /** Rename a stored project (its project name; the record's revision goes up). */
  async rename(id: string, name: string, tabId: string): Promise<WriteOutcome> {
    const read = await this.get(id);
    if (!read) return { ok: false, reason: 'deleted', theirs: null };
    if (!read.ok) return { ok: false, reason: 'not-writable', message: notWritableMessage(read) };
    if (read.record.deletedAt) return { ok: false, reason: 'deleted', theirs: read.record };
    return this.save(id, { ...read.record.project, name }, tabId, read.record.revision);
  }

  /** A copy as a new record, named "<name> (copy)" ("(copy 2)" … when taken; never "(copy) (copy)"). */
  async duplicate(id: string, tabId: string): Promise<WriteOutcome> {
    const read = await this.get(id);
    if (!read || (read.ok && read.record.deletedAt)) return { ok: false, reason: 'write-failed', message: 'the project is not stored any more' };
    if (!read.ok) return { ok: false, reason: 'not-writable', message: read.message };
    return this.create({ ...read.record.project, name: copyName(recordName(read.record), await this.names()) }, tabId);
  }

  /** Hide a record for the undo period: it stays stored until `purge` (or `restore` brings it back). */
  async markDeleted(id: string): Promise<MarkOutcome> {
    return this.#setDeleted(id, this.#now().toISOString());
  }

  /** Bring back a record marked deleted (refused when it was removed meanwhile). */
  async restore(id: string): Promise<MarkOutcome> {
    return this.#setDeleted(id, undefined);
  }

  /** Remove a record for good, only if it is still marked deleted (another tab may have restored it). */
  async purge(id: string): Promise<void> {
    await change(projectKey(id), this.#store, (old) => {
      if (old === undefined) return null;
      const read = readRecord(id, old);
      return read.ok && read.record.deletedAt ? { remove: true } : null;
    });
  }

  /** Remove records whose delete was not undone within `graceMs` (a tab closed during its undo period). */
  async purgeDeletedBefore(graceMs: number): Promise<number> {
    const cutoff = this.#now().getTime() - graceMs;
    let removed = 0;
    for (const [key, value] of await entries(this.#store)) {
      if (typeof key !== 'string' || !key.startsWith(PROJECT_KEY_PREFIX)) continue;
      const id = key.slice(PROJECT_KEY_PREFIX.length);
      const listed = readRecord(id, value);
      if (!listed.ok || !listed.record.deletedAt) continue;
      // Checked again in the removing transaction: another tab may have restored it since.
      await change(key, this.#store, (old) => {
        const read = old === undefined ? undefined : readRecord(id, old);
        if (read?.ok && read.record.deletedAt && Date.parse(read.record.deletedAt) < cutoff) {
          removed++;
          return { remove: true };
        }
        return null;
      });
    }
    return removed;
  }

  /**
   * Write a rescue copy in one put and commit at once, without reading first: a page being torn
   * down gets no second turn (a read-then-write started in \`pagehide\` can be cut off between the
   * two). Never under a project key.
   */
  async putRescue(key: string, value: RescueRecord): Promise<void> {
    if (!key.startsWith(RESCUE_KEY_PREFIX)) throw new Error('not a rescue key');
    await this.#store('readwrite', (s) => {
      s.put(value, key);
      // Hand the transaction to the database now rather than after this task.
      s.transaction.commit?.();
      return promisifyRequest(s.transaction);
    });
  }

  /** Every rescue copy (raw values; recover.ts reads them). */
  async rescues(): Promise<[string, unknown][]> {
    return (await entries(this.#store)).flatMap(([k, v]) => (typeof k === 'string' && k.startsWith(RESCUE_KEY_PREFIX) ? [[k, v] as [string, unknown]] : []));
  }

  async removeRescue(key: string): Promise<void> {
    if (!key.startsWith(RESCUE_KEY_PREFIX)) return;
    await this.#store('readwrite', (s) => {
      s.delete(key);
      return promisifyRequest(s.transaction);
    });
  }

  /** Every raw value in the store (tests and the browser tests compare before/after). */
  async dump(): Promise<[string, unknown][]> {
    return (await entries(this.#store)).map(([k, v]) => [String(k), v]);
  }

  async #setDeleted(id: string, deletedAt: string | undefined): Promise<MarkOutcome> {
    let outcome: MarkOutcome = { ok: false, message: 'the project is not stored any more' };
    try {
      await change(projectKey(id), this.#store, (old) => {
        if (old === undefined) return null;
        const read = readRecord(id, old);
        if (!read.ok) {
          outcome = { ok: false, message: notWritableMessage(read) };
          return null;
        }
        const { deletedAt: _was, ...rest } = read.record;
        const record: StoredProject = deletedAt === undefined ? rest : { ...rest, deletedAt };
        outcome = { ok: true, record };
        return { put: record };
      });
    } catch (error) {
      return { ok: false, message: describeWriteError(error) };
    }
    return outcome;
  }
}

function savedTime(r: ListedProject): number {
  return r.ok ? Date.parse(r.record.savedAt) : -Infinity;
}
