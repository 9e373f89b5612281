/**
 * Rescue copies at start (web/storage/README.md "Leaving the page"): the changes a page had not stored
 * when it was hidden or left, applied once that page is closed. Loaded only when there are rescue
 * copies, so it stays out of the first load.
 */
import type { DraftProject } from '../state/editor.ts';
import { copyName, readRescue, recordName, type StoredProject } from './record.ts';

export { readRescue };
import type { ProjectStore, WriteOutcome } from './store.ts';

/** How long the start waits for a closing tab to let go of its lock (a reload opens the new page at once). */
const CLOSING_TAB_WAIT_MS = 1500;

/**
 * Which of `tabs` are still open: each tab holds the lock `<prefix><tab id>` for its life. A tab
 * that is closing lets go shortly after its page is gone, so each lock is waited for a moment.
 * Null when the browser cannot say (no Web Locks): every copy is then applied.
 */
async function stillOpen(tabs: Set<string>, prefix: string): Promise<Set<string> | null> {
  const locks = typeof navigator !== 'undefined' ? navigator.locks : undefined;
  if (!locks?.request) return null;
  const open = new Set<string>();
  // Locks nobody holds need no wait (the usual case: those tabs closed long ago).
  let held: Set<string> | null = null;
  try {
    held = new Set(((await locks.query()).held ?? []).flatMap((l) => (l.name ? [l.name] : [])));
  } catch {
    held = null;
  }
  await Promise.all(
    [...tabs].map(async (tab) => {
      if (held && !held.has(`${prefix}${tab}`)) return;
      try {
        await locks.request(`${prefix}${tab}`, { signal: AbortSignal.timeout(CLOSING_TAB_WAIT_MS) }, () => undefined);
      } catch {
        open.add(tab); // not let go in time: that tab is open
      }
    }),
  );
  return open;
}

/** Tabs whose lock this page already waits for (each once). */
const watched = new Set<string>();

/** Wait, in the background and without a time limit, for a tab's lock to be let go; then call `then`. */
function watchTab(tab: string, prefix: string, then: () => void): void {
  const locks = typeof navigator !== 'undefined' ? navigator.locks : undefined;
  if (!locks?.request || watched.has(tab)) return;
  watched.add(tab);
  void locks.request(`${prefix}${tab}`, () => undefined).then(then, () => undefined);
}

/**
 * Equal plain JSON values, key order ignored (a record and its rescue copy come from drafts whose
 * elements were rebuilt in different key orders); an explicit stack, no recursion on depth.
 */
function sameJson(a: unknown, b: unknown): boolean {
  const stack: [unknown, unknown][] = [[a, b]];
  while (stack.length) {
    const [x, y] = stack.pop()!;
    if (x === y) continue;
    if (typeof x !== 'object' || typeof y !== 'object' || x === null || y === null) return false;
    if (Array.isArray(x) !== Array.isArray(y)) return false;
    if (Array.isArray(x) && Array.isArray(y)) {
      if (x.length !== y.length) return false;
      x.forEach((v, i) => stack.push([v, y[i]]));
      continue;
    }
    const xo = x as Record<string, unknown>;
    const yo = y as Record<string, unknown>;
    const keys = Object.keys(xo).filter((k) => xo[k] !== undefined);
    if (keys.length !== Object.keys(yo).filter((k) => yo[k] !== undefined).length) return false;
    for (const k of keys) {
      if (!Object.hasOwn(yo, k)) return false;
      stack.push([xo[k], yo[k]]);
    }
  }
  return true;
}

/**
 * Apply the rescue copies `raw` of closed tabs: one made on the revision still stored is saved over
 * it (with the revision check); one already stored is dropped; a first save that never landed is
 * stored under the id it was meant to get; otherwise (the project changed or was deleted since, or is
 * of a newer layout) it is kept as a copy beside it. Copies of tabs still open, and of this tab, are
 * left alone; a write the browser refuses leaves its copy for the next start. Returns the names saved.
 */
export async function recoverRescues(s: ProjectStore, raw: [string, unknown][], ownTabId: string, lockPrefix: string, onTabClosed?: () => void): Promise<string[]> {
  const tabs = new Set(
    raw.flatMap(([, v]) => {
      const r = readRescue(v);
      return r && r.tabId !== ownTabId ? [r.tabId] : [];
    }),
  );
  const alive = await stillOpen(tabs, lockPrefix);
  // A tab that had not let go in time (a reload on a busy machine, or a tab really open): its copies are
  // applied as soon as it does, not only at the next start.
  if (alive && onTabClosed) for (const tab of alive) watchTab(tab, lockPrefix, onTabClosed);
  const names = await s.names().catch(() => [] as string[]);
  const recovered: string[] = [];
  for (const [key, value] of raw) {
    const r = readRescue(value);
    if (!r || r.tabId === ownTabId || alive?.has(r.tabId)) continue;
    const read = r.storedId !== undefined ? await s.get(r.storedId) : undefined;
    const record = read?.ok && !read.record.deletedAt ? read.record : undefined;
    // A first write that landed: the rescue copy carries the draft's name from before the copy got its own.
    const base = r.baseRevision ?? (record && record.tabId === r.tabId && record.revision === 1 ? 1 : null);
    const project = record && r.baseRevision === null && base !== null ? { ...r.project, name: record.project.name } : r.project;
    if (record && sameJson(record.project, project)) {
      await s.removeRescue(key).catch(() => undefined);
      continue;
    }
    let out: WriteOutcome | undefined;
    if (record && base !== null && record.revision === base) {
      out = await s.save(record.id, project, ownTabId, base);
    } else if (r.storedId !== undefined && !read && r.baseRevision === null) {
      const name = r.demoId !== undefined ? copyName(project.name, names, 'my copy') : project.name;
      out = await s.create({ ...project, name }, ownTabId, { id: r.storedId, ...(r.demoId !== undefined ? { demoId: r.demoId } : {}) });
    }
    if (!out?.ok) {
      if (out?.reason === 'write-failed') continue;
      out = await s.create({ ...project, name: copyName(project.name, names) }, ownTabId);
      if (!out.ok) continue;
    }
    const name = recordName(out.record as StoredProject);
    names.push(name);
    recovered.push(name);
    await s.removeRescue(key).catch(() => undefined);
  }
  return recovered;
}
