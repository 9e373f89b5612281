/**
 * Leaving the page: a rescue copy of every version not stored yet is committed at once when the page
 * is hidden or left (the normal write may be cut off), dropped once its version is stored, and applied
 * at the next start (recover.ts).
 */
import type { DraftOrigin } from '../state/editor.ts';
import { RESCUE_KEY_PREFIX, type RescueRecord } from './record.ts';
import { conflicts, inFlight, known, plannedFor, storageNotice, store, storedIdOf, tabId } from './session-state.ts';
import { pending } from './write-queue.ts';

export const TAB_LOCK_PREFIX = 'joulepath-tab:';
/** Rescue keys this tab wrote, with the edit number of the version each holds (Infinity: an open question's). */
const rescued = new Map<string, number>();
function rescueKeyOf(origin: DraftOrigin): { key: string; storedId: string } {
  let id = storedIdOf(origin) ?? plannedFor.get(origin);
  // Not stored yet: the id its first write will use is chosen now, so the copy and that write agree.
  if (id === undefined) plannedFor.set(origin, (id = globalThis.crypto.randomUUID()));
  return { key: `${RESCUE_KEY_PREFIX}${tabId}:${id}`, storedId: id };
}

/**
 * The page is hidden or left: write a rescue copy of every version not stored yet (edits waiting,
 * writes under way, answers not given). One committed put each, no read first — the normal write
 * (a read, then a write, for the revision check) may be cut off when the page is torn down. The next
 * start applies them (recoverRescued).
 */
export function writeRescues(): void {
  const s = store();
  if (!s) return;
  const time = new Date().toISOString();
  const items = new Map<string, { seq: number; value: RescueRecord }>();
  for (const snap of [...inFlight, ...pending]) {
    const { key, storedId } = rescueKeyOf(snap.origin);
    const stored = storedIdOf(snap.origin) !== undefined;
    const value: RescueRecord = {
      rescueVersion: 1,
      tabId,
      savedAt: time,
      storedId,
      baseRevision: stored ? (known.get(storedId) ?? null) : null,
      ...(!stored && snap.origin.kind === 'demo' && snap.origin.demoId !== undefined ? { demoId: snap.origin.demoId } : {}),
      project: snap.project,
    };
    items.set(key, { seq: snap.seq, value });
  }
  for (const c of conflicts.peek()) {
    const value: RescueRecord = { rescueVersion: 1, tabId, savedAt: time, storedId: c.id, baseRevision: known.get(c.id) ?? null, project: c.mine };
    items.set(`${RESCUE_KEY_PREFIX}${tabId}:${c.id}`, { seq: Infinity, value });
  }
  for (const [key, { seq, value }] of items) {
    if (rescued.get(key) === seq && seq !== Infinity) continue; // this version is in its copy already
    rescued.set(key, seq);
    s.putRescue(key, value).catch(() => rescued.delete(key));
  }
}

/**
 * Remove this tab's rescue copy of a project once what it holds is stored: `seq` is the edit number of
 * the version just written (the copy stays while it holds a later one); null when an answer to a
 * question settled the project.
 */
export function dropRescue(id: string, seq: number | null): void {
  const key = `${RESCUE_KEY_PREFIX}${tabId}:${id}`;
  const held = rescued.get(key);
  if (held === undefined || (seq !== null && seq < held)) return;
  rescued.delete(key);
  void store()?.removeRescue(key).catch(() => undefined);
}

/**
 * At start: apply the rescue copies of pages that are gone (recover.ts, loaded only when there are
 * any). Nothing is written over another tab's newer work, and nothing is lost.
 */
export async function recoverRescued(afterLate?: () => void): Promise<void> {
  // One page at a time applies rescue copies (a page that started while another was still open may
  // apply that one's copies when it closes, as the other's reload does): each reads them afresh.
  const locks = globalThis.navigator?.locks;
  if (locks?.request) await locks.request(RECOVER_LOCK, () => recoverNow(afterLate));
  else await recoverNow(afterLate);
}

/** Name of the lock held while rescue copies are applied. */
const RECOVER_LOCK = 'joulepath-recover';

async function recoverNow(afterLate?: () => void): Promise<void> {
  const s = store();
  if (!s) return;
  const raw = await s.rescues().catch(() => []);
  if (!raw.length) return;
  const { recoverRescues } = await import('./recover.ts');
  // A closing tab that lets go of its lock late: its copies are applied then, and `afterLate` runs (the list is read again).
  const late = () => void recoverRescued(afterLate).then(() => afterLate?.());
  const recovered = await recoverRescues(s, raw, tabId, TAB_LOCK_PREFIX, late);
  if (recovered.length) storageNotice.value = `Changes a closed page had not stored are saved: ${recovered.map((n) => `“${n}”`).join(', ')}.`;
}
