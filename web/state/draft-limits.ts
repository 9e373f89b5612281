/**
 * The project file's limits in the editor (web/storage/limits.ts, the import's own: text lengths,
 * number sizes, nesting, keys, values, 2000 elements): the first limit a draft passes, and whether an
 * edit passes a new one. Pure: reads drafts, changes nothing.
 */
import { PROJECT_LEVEL } from '../../core/page.ts';
import type { DraftElement, DraftProject } from './draft.ts';
import { elementName } from './tree.ts';
import { DEPTH_IN_FILE, ENVELOPE_VALUES, FILE_LIMITS, limitWords, scanLimits, type LimitIssue } from '../storage/limits.ts';

/** A limit of the project file passed by a draft: where (element id, field path) and what. */
export interface DraftLimitIssue {
  elementId: string;
  path: string;
  issue: LimitIssue | { kind: 'elements' } | { kind: 'id'; id: string } | { kind: 'project-name'; length: number };
  /** "Inverter 2, loss: " (empty for the project's own fields). */
  where: string;
  words: string;
}

/** Each element's own scan (count and first issue), kept by identity: drafts share unchanged elements. */
const elementScans = new WeakMap<DraftElement, ReturnType<typeof scanLimits>>();

function scanElement(e: DraftElement): ReturnType<typeof scanLimits> {
  let scan = elementScans.get(e);
  if (!scan) {
    scan = scanLimits(e, { depth: DEPTH_IN_FILE.element });
    elementScans.set(e, scan);
  }
  return scan;
}

const pathWords = (path: (string | number)[]) => path.join('.');

/**
 * The first limit of the project file (web/storage/limits.ts, the import's own) that a draft passes,
 * or null: what `exportText` writes of this draft is then a file `parseImportText` reads.
 */
export function draftLimitIssue(project: DraftProject): DraftLimitIssue | null {
  if (project.elements.length > FILE_LIMITS.maxElements) {
    return { elementId: PROJECT_LEVEL, path: 'elements', issue: { kind: 'elements' }, where: '', words: elementsWords(project.elements.length) };
  }
  const { elements, ...own } = project;
  const ownScan = scanLimits(own, { depth: DEPTH_IN_FILE.project });
  if (ownScan.issue) {
    return { elementId: PROJECT_LEVEL, path: pathWords(ownScan.issue.path), issue: ownScan.issue, where: '', words: limitWords(ownScan.issue) };
  }
  if (typeof project.name === 'string' && project.name.length > FILE_LIMITS.maxProjectNameLength) {
    const issue = { kind: 'project-name', length: project.name.length } as const;
    return { elementId: PROJECT_LEVEL, path: 'name', issue, where: '', words: `a project name holds at most ${FILE_LIMITS.maxProjectNameLength} characters (this one has ${project.name.length})` };
  }
  let count = ENVELOPE_VALUES + ownScan.count;
  for (const e of elements) {
    const scan = scanElement(e);
    if (scan.issue) {
      const path = pathWords(scan.issue.path);
      return { elementId: e.id, path, issue: scan.issue, where: `${elementName(project, e.id)}${path ? `, ${path}` : ''}: `, words: limitWords(scan.issue) };
    }
    if (e.id.length > FILE_LIMITS.maxIdLength) {
      return { elementId: e.id, path: 'id', issue: { kind: 'id', id: e.id }, where: `${elementName(project, e.id)}: `, words: `its id is longer than ${FILE_LIMITS.maxIdLength} characters` };
    }
    count += scan.count;
  }
  if (count > FILE_LIMITS.maxValues) {
    const issue: LimitIssue = { kind: 'count', path: [] };
    return { elementId: PROJECT_LEVEL, path: '', issue, where: '', words: limitWords(issue) };
  }
  return null;
}

export function elementsWords(count: number): string {
  return `a project holds at most ${FILE_LIMITS.maxElements} elements (this would make ${count}); remove some first, or plan the rest of the chain as a second project`;
}

/**
 * The limit `next` passes that `current` did not pass at the same place, or null. A project stored
 * before a limit existed can still be edited (its old excess is not the edit's doing), but never
 * made worse at a new place.
 */
export function newLimitIssue(current: DraftProject, next: DraftProject): DraftLimitIssue | null {
  const after = draftLimitIssue(next);
  if (!after) return null;
  const before = draftLimitIssue(current);
  const same = before && before.elementId === after.elementId && before.path === after.path && before.issue.kind === after.issue.kind;
  if (same && !(after.issue.kind === 'elements' && next.elements.length > current.elements.length)) return null;
  return after;
}
