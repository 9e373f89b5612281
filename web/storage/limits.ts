/**
 * The limits of a project file, in one place: the import (file-format.ts) refuses a file past any of
 * them, and the editor (web/state/editor.ts) refuses an edit that would pass one, so every project the
 * app exports is one it imports again. Pure: no DOM, no storage.
 *
 * The figures are this format's own rules (common practice, no source): far above any real power
 * chain, low enough that a hostile file cannot exhaust the page.
 */
export const FILE_LIMITS = {
  /** Largest file read at all; a 200-stage project is about 100 kB. */
  maxBytes: 5 * 1024 * 1024,
  maxElements: 2000,
  /** Objects and lists inside one another, counted from the export envelope (a project needs about 7). */
  maxDepth: 32,
  /** Every value in the file counted (numbers, strings, objects …). */
  maxValues: 200_000,
  maxStringLength: 20_000,
  /** No quantity in a power chain comes near this in SI units (1 PW, 1 PJ …). */
  maxMagnitude: 1e15,
  /** A key (a field's name, or an element id used as a key) longer than this is no key this app writes. */
  maxKeyLength: 200,
  maxIdLength: 100,
  maxKindLength: 60,
  maxProjectNameLength: 200,
} as const;

/** Keys that could reach an object's prototype: refused anywhere in a file, never written by an edit. */
export const FORBIDDEN_KEYS: readonly string[] = ['__proto__', 'constructor', 'prototype'];

/** How deep a project's own fields and its elements sit in the export file (envelope → project → elements → [i]). */
export const DEPTH_IN_FILE = { project: 1, element: 3 } as const;
/**
 * Values the export adds around the project, counted as the import counts them: the envelope object,
 * $schema, format, exportVersion, exportedAt, exportedBy, projectId, and the elements list.
 */
export const ENVELOPE_VALUES = 8;

export type LimitIssue =
  | { kind: 'count'; path: (string | number)[] }
  | { kind: 'depth'; path: (string | number)[] }
  | { kind: 'infinite'; path: (string | number)[] }
  | { kind: 'magnitude'; path: (string | number)[]; value: number }
  | { kind: 'string'; path: (string | number)[]; length: number }
  | { kind: 'forbidden-key'; path: (string | number)[]; key: string }
  | { kind: 'key-length'; path: (string | number)[]; key: string };

/**
 * Walk a value without recursion (so no file can exhaust the stack), counting every value and stopping
 * at the first limit passed. `depth` is where the value sits in the file (0: the file's top level);
 * `budget` how many values may still be counted.
 */
export function scanLimits(
  root: unknown,
  options: { depth?: number; budget?: number } = {},
): { count: number; issue: LimitIssue | null } {
  const base = options.depth ?? 0;
  const budget = options.budget ?? FILE_LIMITS.maxValues;
  const stack: { value: unknown; path: (string | number)[] }[] = [{ value: root, path: [] }];
  let count = 0;
  while (stack.length) {
    const { value, path } = stack.pop()!;
    if (++count > budget) return { count, issue: { kind: 'count', path } };
    if (base + path.length > FILE_LIMITS.maxDepth) return { count, issue: { kind: 'depth', path } };
    if (typeof value === 'number') {
      if (!Number.isFinite(value)) return { count, issue: { kind: 'infinite', path } };
      if (Math.abs(value) > FILE_LIMITS.maxMagnitude) return { count, issue: { kind: 'magnitude', path, value } };
    } else if (typeof value === 'string') {
      if (value.length > FILE_LIMITS.maxStringLength) return { count, issue: { kind: 'string', path, length: value.length } };
    } else if (Array.isArray(value)) {
      value.forEach((v, i) => stack.push({ value: v, path: [...path, i] }));
    } else if (typeof value === 'object' && value !== null) {
      for (const key of Object.keys(value)) {
        if (FORBIDDEN_KEYS.includes(key)) return { count, issue: { kind: 'forbidden-key', path, key } };
        if (key.length > FILE_LIMITS.maxKeyLength) return { count, issue: { kind: 'key-length', path, key } };
        stack.push({ value: (value as Record<string, unknown>)[key], path: [...path, key] });
      }
    }
  }
  return { count, issue: null };
}

/** A number as people write it: thousands grouped by a thin space (20 000), large ones as 1e15. */
const figure = (n: number) => (n >= 1e6 ? n.toExponential().replace('e+', 'e') : String(n).replace(/\B(?=(\d{3})+(?!\d))/g, '\u202f'));

/** What an editor says about a limit an edit would pass (the field's label is put in front by the form). */
export function limitWords(issue: LimitIssue): string {
  switch (issue.kind) {
    case 'count':
      return `the project would hold more than ${figure(FILE_LIMITS.maxValues)} values, more than a project file holds; remove rows or elements first`;
    case 'depth':
      return `it nests more than ${FILE_LIMITS.maxDepth} levels deep, more than a project file holds`;
    case 'infinite':
      return 'must be a finite number';
    case 'magnitude':
      return `is larger than any value in a power chain (at most ${figure(FILE_LIMITS.maxMagnitude)} in SI units: 1 PW, 1 PJ), so a project file could not hold it`;
    case 'string':
      return `${figure(issue.length)} characters is too long: a project file holds at most ${figure(FILE_LIMITS.maxStringLength)} characters in one text`;
    case 'forbidden-key':
      return `"${issue.key}" cannot be used as a name here (a project file refuses it)`;
    case 'key-length':
      return `a name inside it is ${issue.key.length} characters long; a project file holds names of at most ${FILE_LIMITS.maxKeyLength}`;
  }
}

/**
 * `name` followed by `suffix` (" (copy)"), the name shortened so that the whole stays within `max`
 * characters (a copy of a name at the limit is still a name the import reads).
 */
export function withSuffix(name: string, suffix: string, max: number): string {
  let room = Math.max(0, max - suffix.length);
  if (name.length <= room) return `${name}${suffix}`;
  // Never cut a character written as two UTF-16 units in half.
  const last = name.charCodeAt(room - 1);
  if (last >= 0xd800 && last <= 0xdbff) room--;
  return `${name.slice(0, room).trimEnd()}${suffix}`;
}
