/**
 * The stored project record (one IndexedDB value per project) and the migrations from older layouts.
 * Pure functions and plain data: no IndexedDB, no DOM, no clock (the caller passes times), so the
 * Node tests check them directly. The format is documented in web/storage/README.md.
 */
import { FILE_LIMITS, withSuffix } from './limits.ts';
import { z } from 'zod/mini';
import { issueMessage, migrateProject } from '../../core/page.ts';
import type { DraftProject } from '../state/editor.ts';

/** Version of the stored record layout written by this build. Raise it with a migration below. */
export const STORAGE_VERSION = 2;

/** Key prefix of project records in the object store ("project:<id>"). */
export const PROJECT_KEY_PREFIX = 'project:';

export function projectKey(id: string): string {
  return `${PROJECT_KEY_PREFIX}${id}`;
}

/** One stored project (layout version 2: layout 1 with its project in file format 2). */
export interface StoredProject {
  storageVersion: 2;
  /** Key without the prefix; never changes for the life of the record. */
  id: string;
  /** ISO 8601 times (UTC). */
  createdAt: string;
  savedAt: string;
  /** Counts writes of this record: a tab that loaded revision n and finds n+1 stored knows another tab wrote. */
  revision: number;
  /** The tab that wrote last (a random id per open tab). */
  tabId: string;
  /** The demo this project was copied from, if any. */
  demoId?: string;
  /** Set while a delete can still be undone; such records are hidden from the list and removed later. */
  deletedAt?: string;
  /** The project as edited (the project file format of core/model/project.ts, possibly with problems to fix). */
  project: DraftProject;
}

// zod/mini (the engine's flavour): the same checks without the chained API in the first load.
const isoTime = z.string().check(z.refine((s) => !Number.isNaN(Date.parse(s)), 'must be an ISO 8601 time'));

const elementShape = z.looseObject({ id: z.string(), kind: z.string(), from: z.optional(z.string()), name: z.optional(z.string()) });
const projectShape = z.looseObject({
  format: z.literal('joulepath-project'),
  version: z.number(),
  name: z.string(),
  description: z.optional(z.string()),
  elements: z.array(elementShape),
});

const recordV2 = z.object({
  storageVersion: z.literal(2),
  id: z.string().check(z.minLength(1)),
  createdAt: isoTime,
  savedAt: isoTime,
  revision: z.int().check(z.nonnegative()),
  tabId: z.string(),
  demoId: z.optional(z.string()),
  deletedAt: z.optional(isoTime),
  project: projectShape,
});

/**
 * Layout 0: the development layout before records carried a version (never shipped in a release;
 * kept so the migration path is exercised from the first version on). The project sat under `data`,
 * its display name under `title`, and the time of the last write was epoch milliseconds in `updated`.
 */
const recordV0 = z.object({
  title: z.string(),
  updated: z.number(),
  data: z.extend(projectShape, { name: z.optional(z.string()) }),
});

export type ReadRecord =
  | { ok: true; record: StoredProject; migratedFrom?: number }
  | { ok: false; id: string; reason: 'newer' | 'damaged'; message: string; /** The newer layout's version. */ layout?: number };

/** Each step lifts a record from version n to n+1. */
const MIGRATIONS: Record<number, (raw: unknown, id: string) => unknown> = {
  0: (raw, id) => {
    const v0 = recordV0.parse(raw, { error: issueMessage });
    const time = new Date(v0.updated).toISOString();
    const { data } = v0;
    return {
      storageVersion: 1,
      id,
      createdAt: time,
      savedAt: time,
      revision: 1,
      tabId: 'migrated',
      project: { ...data, name: data.name ?? v0.title },
    };
  },
  // Layout 2: the project inside is brought to file format 2 (core/model/migrate.ts: kind and field
  // renames). The record's other fields are unchanged; an older build then refuses to write over it.
  1: (raw) => {
    const v1 = z.looseObject({ storageVersion: z.literal(1), project: z.unknown() }).parse(raw, { error: issueMessage });
    return { ...v1, storageVersion: 2, project: migrateProject(v1.project).value } satisfies Partial<Omit<StoredProject, 'project'>> & { project: unknown };
  },
};

/** The layout version of a stored value (0 for the unversioned development layout). */
export function storedVersionOf(raw: unknown): number | undefined {
  if (typeof raw !== 'object' || raw === null) return undefined;
  const v = (raw as Record<string, unknown>)['storageVersion'];
  if (v === undefined) return 0;
  return typeof v === 'number' && Number.isInteger(v) && v >= 0 ? v : undefined;
}

/** Read a stored value, migrating it to the current layout. Nothing is written here. */
export function readRecord(id: string, raw: unknown): ReadRecord {
  const from = storedVersionOf(raw);
  if (from === undefined) return { ok: false, id, reason: 'damaged', message: 'The stored record is not readable (no layout version).' };
  if (from > STORAGE_VERSION) {
    return {
      ok: false,
      id,
      reason: 'newer',
      layout: from,
      message: `This project was saved by a newer version of Joulepath (storage layout ${from}); update the app to open it.`,
    };
  }
  let value = raw;
  try {
    for (let v = from; v < STORAGE_VERSION; v++) {
      const step = MIGRATIONS[v];
      if (!step) throw new Error(`no migration from layout ${v}`);
      value = step(value, id);
    }
  } catch (error) {
    return { ok: false, id, reason: 'damaged', message: `The stored record could not be migrated (${error instanceof Error ? error.message : String(error)}).` };
  }
  const parsed = recordV2.safeParse(value, { error: issueMessage });
  if (!parsed.success) {
    const first = parsed.error.issues[0];
    return { ok: false, id, reason: 'damaged', message: `The stored record is damaged (${first ? `${first.path.join('.')}: ${first.message}` : 'unknown shape'}).` };
  }
  const record = { ...parsed.data, id } as StoredProject;
  return from < STORAGE_VERSION ? { ok: true, record, migratedFrom: from } : { ok: true, record };
}

/**
 * Why a stored value that cannot be read is not written over (a newer layout: update the app; a
 * damaged one: it is left as it is). A sentence part, after "Not saved: ".
 */
export function notWritableMessage(read: Extract<ReadRecord, { ok: false }>): string {
  if (read.reason === 'newer') {
    return `this project was saved by a newer version of Joulepath (storage layout ${read.layout ?? '?'}), so this version never writes over it: update the app (reload the page, or accept the update when it is offered) to change it`;
  }
  return 'the stored project is damaged and is left as it is';
}

/** The name shown for a stored project. */
export function recordName(record: StoredProject): string {
  const name = record.project.name.trim();
  return name || 'Untitled project';
}

/** A trailing copy mark this app adds: " (copy)", " (copy 2)", " (my copy)", " (my copy 3)". */
const COPY_MARK = / \((?:my )?copy(?: \d+)?\)$/;

/**
 * The name of a copy: the name without the copy mark it may already carry, then " (<label>)", or
 * " (<label> 2)", " (<label> 3)" … when that name is taken. A copy of a copy, or a copy retried after
 * a failed write, never grows a chain of marks ("X (copy) (copy)").
 */
export function copyName(name: string, taken: Iterable<string>, label: 'copy' | 'my copy' = 'copy'): string {
  let base = name.trim();
  while (COPY_MARK.test(base)) base = base.replace(COPY_MARK, '').trim();
  base ||= 'Untitled project';
  const used = new Set(taken);
  // Within the project-name limit the import checks (limits.ts): a long name is shortened, not the mark.
  const named = (mark: string) => withSuffix(base, ` (${mark})`, FILE_LIMITS.maxProjectNameLength);
  let candidate = named(label);
  for (let n = 2; used.has(candidate); n++) candidate = named(`${label} ${n}`);
  return candidate;
}

/** Key prefix of rescue copies ("rescue:<tab id>:<project id or draft id>"). */
export const RESCUE_KEY_PREFIX = 'rescue:';

/**
 * A rescue copy: the changes a page had not stored yet when it was hidden or left, written in one
 * put without reading first (so it lands even when the page is torn down right after). It never
 * replaces a project record; the next start applies it with the revision check (or keeps it as a
 * copy) and removes it.
 */
export interface RescueRecord {
  rescueVersion: 1;
  /** The tab that wrote it (its lock tells whether it is still open). */
  tabId: string;
  savedAt: string;
  /** The stored project these changes belong to, and the revision they were made on (null: none known). */
  storedId?: string;
  baseRevision: number | null;
  /** Not stored yet: a demo's first changes (its copy gets " (my copy)") or a new project. */
  demoId?: string;
  project: DraftProject;
}

// ---------- Rescue copies (read at start by recover.ts) ----------

const rescueShape = z.object({
  rescueVersion: z.literal(1),
  tabId: z.string(),
  savedAt: isoTime,
  storedId: z.optional(z.string()),
  baseRevision: z.nullable(z.int()),
  demoId: z.optional(z.string()),
  project: z.looseObject({
    format: z.literal('joulepath-project'),
    version: z.number(),
    name: z.string(),
    elements: z.array(z.looseObject({ id: z.string(), kind: z.string() })),
  }),
});

/** A rescue copy as stored, or undefined when it is not one this build reads (left alone). */
export function readRescue(raw: unknown): RescueRecord | undefined {
  const parsed = rescueShape.safeParse(raw, { error: issueMessage });
  if (!parsed.success) return undefined;
  // A copy written by a build of an older file format holds its project in that format: brought up to date.
  return { ...parsed.data, project: migrateProject(parsed.data.project).value } as RescueRecord;
}
