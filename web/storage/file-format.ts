/**
 * The project file: export (an envelope around the project) and import (never trusting the file).
 * Pure: bytes in, a checked project or a message out. No DOM, no storage — web/storage/session.ts reads
 * the file and stores the result; the Node tests call these functions directly.
 *
 * An import is refused, with a sentence saying why, when the file is too large, empty, not UTF-8 text,
 * not JSON, nested too deeply, holds too many values or elements, holds a key that could reach an
 * object's prototype ("__proto__", "constructor", "prototype"), a number that is not finite or is
 * absurdly large, an envelope or element shape that is wrong, or a version this build does not read.
 * A project whose fields the engine rejects is still accepted (it opens with its problems listed, to
 * be fixed); the engine's checks run on it afterwards, not here.
 */
import * as z from 'zod/mini';
import { issueMessage } from '../../core/solve/issue-messages.ts';
import type { DraftProject } from '../state/editor.ts';
import { fileNameStem } from '../format/labels.ts';
import { FILE_LIMITS, FORBIDDEN_KEYS, scanLimits } from './limits.ts';

export const EXPORT_FORMAT = 'joulepath-export';
export const EXPORT_VERSION = 1;
/** The project schema version this build reads (core/model.ts). */
export const PROJECT_VERSION = 1;

/**
 * Limits of an import (each refusal names the one that was passed). They live in limits.ts, which the
 * editor reads too, so no edit can make a project this import refuses.
 */
export const IMPORT_LIMITS = FILE_LIMITS;
export { FORBIDDEN_KEYS };

/** The export envelope (documented in web/storage/README.md). */
export interface ExportEnvelope {
  format: typeof EXPORT_FORMAT;
  exportVersion: typeof EXPORT_VERSION;
  exportedAt: string;
  exportedBy: string;
  /** The stored project's id, so importing it back can tell it is the same project. */
  projectId?: string;
  project: DraftProject;
}

export function buildExport(project: DraftProject, meta: { exportedAt: Date; appVersion: string; projectId?: string }): ExportEnvelope {
  const envelope: ExportEnvelope = {
    format: EXPORT_FORMAT,
    exportVersion: EXPORT_VERSION,
    exportedAt: meta.exportedAt.toISOString(),
    exportedBy: `Joulepath ${meta.appVersion}`,
    project: structuredClone(project),
  };
  if (meta.projectId !== undefined) envelope.projectId = meta.projectId;
  return envelope;
}

/** The file's text: indented, so a person can read or compare two backups. */
export function exportText(envelope: ExportEnvelope): string {
  return `${JSON.stringify(envelope, null, 2)}\n`;
}

/** A file name from the project name: letters, digits and dashes only. */
export function exportFileName(name: string): string {
  return `${fileNameStem(name) || 'project'}.joulepath.json`;
}

export type ImportOutcome =
  | { ok: true; project: DraftProject; projectId?: string; envelope: boolean }
  | { ok: false; message: string };

const refuse = (message: string): ImportOutcome => ({ ok: false, message });

const MB = (bytes: number) => `${(bytes / (1024 * 1024)).toFixed(1)} MB`;

/** Check the size before anything is read (the page calls this with File.size). */
export function checkSize(bytes: number): string | null {
  if (bytes > IMPORT_LIMITS.maxBytes) {
    return `The file is ${MB(bytes)}; project files are limited to ${MB(IMPORT_LIMITS.maxBytes)}. Nothing was imported.`;
  }
  return null;
}

/** Bytes → text: UTF-8 (a leading byte-order mark is allowed); UTF-16 and invalid UTF-8 are refused. */
export function decodeText(bytes: Uint8Array): { ok: true; text: string } | { ok: false; message: string } {
  if ((bytes[0] === 0xff && bytes[1] === 0xfe) || (bytes[0] === 0xfe && bytes[1] === 0xff)) {
    return { ok: false, message: 'The file is UTF-16 text; project files are UTF-8. Save it again as UTF-8 and import that. Nothing was imported.' };
  }
  const start = bytes[0] === 0xef && bytes[1] === 0xbb && bytes[2] === 0xbf ? 3 : 0;
  try {
    return { ok: true, text: new TextDecoder('utf-8', { fatal: true }).decode(bytes.subarray(start)) };
  } catch {
    return { ok: false, message: 'The file is not UTF-8 text (it may be a binary file or another encoding). Nothing was imported.' };
  }
}

function pathText(path: readonly (string | number)[]): string {
  return path.length ? path.map((p) => (typeof p === 'number' ? `[${p}]` : `.${p}`)).join('').replace(/^\./, '') : 'the top level';
}

/**
 * Walk the parsed value without recursion (so no file can exhaust the stack): depth, count, keys,
 * numbers and string lengths (limits.ts). Returns the first reason to refuse, or null.
 */
export function scanValue(root: unknown): string | null {
  const { issue } = scanLimits(root);
  if (!issue) return null;
  const { path } = issue;
  switch (issue.kind) {
    case 'count':
      return `The file holds more than ${IMPORT_LIMITS.maxValues} values; that is not a project this app wrote.`;
    case 'depth':
      return `The file nests objects and lists more than ${IMPORT_LIMITS.maxDepth} levels deep (at ${pathText(path.slice(0, 6))}…).`;
    case 'infinite':
      return `The number at ${pathText(path)} is too large to be read (it overflows to infinity).`;
    case 'magnitude':
      return `The number at ${pathText(path)} (${issue.value}) is larger than any value in a power chain (limit ${IMPORT_LIMITS.maxMagnitude}).`;
    case 'string':
      return `The text at ${pathText(path)} is ${issue.length} characters long (limit ${IMPORT_LIMITS.maxStringLength}).`;
    case 'forbidden-key':
      return `The file holds a key named "${issue.key}" (at ${pathText(path)}), which could alter the app's own objects; such files are refused.`;
    case 'key-length':
      return `The file holds a key ${issue.key.length} characters long (at ${pathText(path)}, starting "${issue.key.slice(0, 40)}…"); keys are at most ${IMPORT_LIMITS.maxKeyLength} characters.`;
  }
}

const text = (error: string) => z.string({ error });

const elementShape = z.looseObject({
  id: text('must be text').check(z.minLength(1, 'must not be empty'), z.maxLength(FILE_LIMITS.maxIdLength, `must be at most ${FILE_LIMITS.maxIdLength} characters`)),
  kind: text('must be text').check(z.minLength(1, 'must not be empty'), z.maxLength(FILE_LIMITS.maxKindLength, `must be at most ${FILE_LIMITS.maxKindLength} characters`)),
  from: z.optional(text('must be text (the id of the feeding element)')),
  name: z.optional(text('must be text')),
});

const projectShape = z.looseObject({
  format: z.literal('joulepath-project', { error: 'must be "joulepath-project"' }),
  version: z.number({ error: 'must be a number' }),
  name: text('must be text').check(z.maxLength(FILE_LIMITS.maxProjectNameLength, `must be at most ${FILE_LIMITS.maxProjectNameLength} characters`)),
  description: z.optional(text('must be text')),
  elements: z
    .array(elementShape, { error: 'must be a list of elements' })
    .check(
      z.minLength(1, 'is empty: a project needs at least its source'),
      z.maxLength(IMPORT_LIMITS.maxElements, `has more than ${IMPORT_LIMITS.maxElements} elements`),
    ),
});

const envelopeShape = z.object({
  format: z.literal(EXPORT_FORMAT),
  exportVersion: z.number({ error: 'must be a number' }),
  exportedAt: z.optional(text('must be text')),
  exportedBy: z.optional(text('must be text')),
  projectId: z.optional(text('must be text').check(z.regex(/^[A-Za-z0-9-]{1,64}$/, 'must be letters, digits and dashes (at most 64)'))),
  project: z.optional(z.unknown()),
});

function firstIssue(error: z.core.$ZodError, prefix: (string | number)[] = []): string {
  const issue = error.issues[0];
  if (!issue) return 'its shape is not that of a project';
  const path = [...prefix, ...issue.path.map((p) => (typeof p === 'number' ? p : String(p)))];
  return `${pathText(path)} ${issue.message}`;
}

function versionMessage(what: string, found: unknown, reads: number): string | null {
  if (found === reads) return null;
  if (typeof found === 'number' && Number.isInteger(found) && found > reads) {
    return `This file was written by a newer version of Joulepath (${what} version ${found}); this version reads version ${reads}. Update the app, then import it.`;
  }
  return `The file's ${what} version is ${JSON.stringify(found)}; this version of Joulepath reads version ${reads}.`;
}

/** Check a parsed project (bare, or from an envelope) for shape and version. */
function checkProject(data: unknown, prefix: (string | number)[]): ImportOutcome {
  if (typeof data !== 'object' || data === null || Array.isArray(data)) {
    return refuse(`The file has no project: ${pathText(prefix)} must be an object.`);
  }
  const format = (data as Record<string, unknown>)['format'];
  if (format !== 'joulepath-project') {
    return refuse(
      format === undefined
        ? 'This JSON file is not a Joulepath project: it has no "format" field (expected "joulepath-export" or "joulepath-project").'
        : `This JSON file is not a Joulepath project: its format is ${JSON.stringify(format).slice(0, 80)} (expected "joulepath-export" or "joulepath-project").`,
    );
  }
  const version = versionMessage('project schema', (data as Record<string, unknown>)['version'], PROJECT_VERSION);
  if (version) return refuse(version);
  const parsed = projectShape.safeParse(data, { error: issueMessage });
  if (!parsed.success) return refuse(`The project in the file is not usable: ${firstIssue(parsed.error, prefix)}.`);
  const seen = new Map<string, number>();
  for (const [i, e] of parsed.data.elements.entries()) {
    const before = seen.get(e.id);
    if (before !== undefined) {
      return refuse(`Two elements share the id "${e.id}" (elements ${before + 1} and ${i + 1}); each element needs its own id.`);
    }
    seen.set(e.id, i);
  }
  return { ok: true, project: parsed.data as DraftProject, envelope: false };
}

/** Check a file's text: JSON, the limits, then the envelope (or a bare project) and its versions. */
export function parseImportText(text: string): ImportOutcome {
  if (text.trim() === '') return refuse('The file is empty. Nothing was imported.');
  let data: unknown;
  try {
    data = JSON.parse(text);
  } catch (error) {
    return refuse(`This file is not a JSON project file (${error instanceof Error ? error.message : String(error)}). Nothing was imported.`);
  }
  const unsafe = scanValue(data);
  if (unsafe) return refuse(`${unsafe} Nothing was imported.`);
  if (typeof data !== 'object' || data === null || Array.isArray(data)) {
    return refuse('This JSON file is not a Joulepath project: it must hold an object at the top level.');
  }
  const format = (data as Record<string, unknown>)['format'];
  if (format !== EXPORT_FORMAT) return checkProject(data, []);
  const version = versionMessage('export format', (data as Record<string, unknown>)['exportVersion'], EXPORT_VERSION);
  if (version) return refuse(version);
  const envelope = envelopeShape.safeParse(data, { error: issueMessage });
  if (!envelope.success) return refuse(`The file's envelope is not usable: ${firstIssue(envelope.error)}.`);
  const inner = checkProject(envelope.data.project, ['project']);
  if (!inner.ok) return inner;
  return envelope.data.projectId !== undefined
    ? { ok: true, project: inner.project, projectId: envelope.data.projectId, envelope: true }
    : { ok: true, project: inner.project, envelope: true };
}

/** The whole check from the file's bytes. */
export function parseImportBytes(bytes: Uint8Array): ImportOutcome {
  const size = checkSize(bytes.byteLength);
  if (size) return refuse(size);
  if (bytes.byteLength === 0) return refuse('The file is empty. Nothing was imported.');
  const decoded = decodeText(bytes);
  if (!decoded.ok) return refuse(decoded.message);
  return parseImportText(decoded.text);
}
