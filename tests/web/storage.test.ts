// Stored projects (web/storage/record.ts, store.ts) on fake-indexeddb: the record layout, the
// migration from the unversioned layout 0 (a hand-written fixture), the revision check that keeps two
// tabs from overwriting each other, delete with undo, and writes the browser refuses. Behaviour of our
// own storage format, so the expected values are the format's rules: common practice (no source).
import 'fake-indexeddb/auto';
import { readFileSync } from 'node:fs';
import { createStore, set, type UseStore } from 'idb-keyval';
import { beforeEach, describe, expect, it } from 'vitest';
import type { DraftProject } from '../../web/state/editor.ts';
import { STORAGE_VERSION, copyName, projectKey, readRecord, recordName, storedVersionOf } from '../../web/storage/record.ts';
import { ProjectStore, describeWriteError } from '../../web/storage/store.ts';

const v0Fixture: unknown = JSON.parse(readFileSync(new URL('./fixtures/stored-v0.json', import.meta.url), 'utf8'));

function project(name: string, elements = 2): DraftProject {
  return {
    format: 'joulepath-project',
    version: 2,
    name,
    elements: [
      { id: 'src', kind: 'battery', voltage: 48 },
      ...Array.from({ length: elements - 1 }, (_, i) => ({ id: `load-${i + 1}`, kind: 'dc-load', from: 'src', power: 100 })),
    ],
  };
}

let dbCount = 0;
let idb: UseStore;
let clockMs: number;
let ids: number;
let store: ProjectStore;

beforeEach(() => {
  // A fresh database per test; a clock that moves one second per reading.
  idb = createStore(`joulepath-test-${++dbCount}`, 'projects');
  clockMs = Date.UTC(2025, 0, 1, 12, 0, 0);
  ids = 0;
  store = new ProjectStore({ store: idb, now: () => new Date((clockMs += 1000)), newId: () => `p-${++ids}` });
});

describe('record layout and migrations', () => {
  it('reads a current record as it is', () => {
    const raw = {
      storageVersion: 2,
      id: 'a',
      createdAt: '2025-01-01T00:00:00.000Z',
      savedAt: '2025-01-02T00:00:00.000Z',
      revision: 3,
      tabId: 't',
      project: project('Pump house'),
    };
    const read = readRecord('a', raw);
    expect(read.ok).toBe(true);
    if (read.ok) {
      expect(read.migratedFrom).toBeUndefined();
      expect(read.record.revision).toBe(3);
      expect(recordName(read.record)).toBe('Pump house');
    }
  });

  it('migrates the unversioned layout 0 (fixture): title → project name, epoch ms → ISO time', () => {
    expect(storedVersionOf(v0Fixture)).toBe(0);
    const read = readRecord('old-1', v0Fixture);
    expect(read.ok).toBe(true);
    if (!read.ok) return;
    expect(read.migratedFrom).toBe(0);
    expect(read.record.storageVersion).toBe(STORAGE_VERSION);
    expect(read.record.id).toBe('old-1');
    expect(read.record.project.name).toBe('Workshop feed before the layout had a version');
    // 1735732800000 ms after the epoch is 2025-01-01T12:00:00Z (the fixture's own value).
    expect(read.record.savedAt).toBe('2025-01-01T12:00:00.000Z');
    expect(read.record.createdAt).toBe(read.record.savedAt);
    expect(read.record.revision).toBe(1);
    expect(read.record.project.elements.map((e) => e.id)).toEqual(['mains', 'saw']);
  });

  it('refuses a record from a newer layout and a damaged one, each with a sentence', () => {
    const newer = readRecord('n', { storageVersion: STORAGE_VERSION + 1, whatever: true });
    expect(newer).toMatchObject({ ok: false, reason: 'newer' });
    if (!newer.ok) expect(newer.message).toMatch(/newer version of Joulepath/);
    const damaged = readRecord('d', { storageVersion: 2, id: 'd', project: 'not a project' });
    expect(damaged).toMatchObject({ ok: false, reason: 'damaged' });
    expect(readRecord('x', 'text')).toMatchObject({ ok: false, reason: 'damaged' });
    expect(readRecord('y', { title: 'v0 without data', updated: 5 })).toMatchObject({ ok: false, reason: 'damaged' });
  });

  it('lists a layout-0 record stored by hand, migrated, and saves it back in the current layout', async () => {
    await set(projectKey('old-1'), v0Fixture, idb);
    const list = await store.list();
    expect(list).toHaveLength(1);
    const first = list[0]!;
    expect(first.ok && first.migratedFrom).toBe(0);
    const out = await store.save('old-1', project('Workshop feed, rewired'), 'tab-a', 1);
    expect(out.ok).toBe(true);
    const [[, raw]] = (await store.dump()) as [[string, Record<string, unknown>]];
    expect(raw['storageVersion']).toBe(STORAGE_VERSION);
    expect(raw['revision']).toBe(2);
    expect(raw['title']).toBeUndefined();
  });
});

describe('the project store', () => {
  it('creates, lists newest first, renames and duplicates', async () => {
    const a = await store.create(project('Alpha'), 'tab-a');
    const b = await store.create(project('Bravo'), 'tab-a', { demoId: 'riverside' });
    expect(a.ok && b.ok).toBe(true);
    let names = (await store.list()).map((r) => (r.ok ? recordName(r.record) : '?'));
    expect(names).toEqual(['Bravo', 'Alpha']);
    await store.rename('p-1', 'Alpha, renamed', 'tab-a');
    names = (await store.list()).map((r) => (r.ok ? recordName(r.record) : '?'));
    expect(names).toEqual(['Alpha, renamed', 'Bravo']);
    const dup = await store.duplicate('p-2', 'tab-a');
    expect(dup.ok && dup.record.project.name).toBe('Bravo (copy)');
    expect(dup.ok && dup.record.demoId).toBeUndefined();
    expect(dup.ok && dup.record.id).toBe('p-3');
    expect((await store.list()).length).toBe(3);
    const bravo = await store.get('p-2');
    expect(bravo?.ok && bravo.record.demoId).toBe('riverside');
  });

  it('counts revisions and refuses to write over a newer revision from another tab', async () => {
    const created = await store.create(project('Shared'), 'tab-a');
    expect(created.ok && created.record.revision).toBe(1);
    // Both tabs loaded revision 1; tab B saves first.
    const b = await store.save('p-1', project('Shared, edited in B', 3), 'tab-b', 1);
    expect(b.ok && b.record.revision).toBe(2);
    const a = await store.save('p-1', project('Shared, edited in A', 4), 'tab-a', 1);
    expect(a.ok).toBe(false);
    if (!a.ok && a.reason === 'conflict') {
      expect(a.theirs.revision).toBe(2);
      expect(a.theirs.tabId).toBe('tab-b');
      expect(a.theirs.project.name).toBe('Shared, edited in B');
    } else throw new Error('expected a conflict');
    // Nothing of A's was written.
    const stored = await store.get('p-1');
    expect(stored?.ok && stored.record.project.name).toBe('Shared, edited in B');
    // "Keep mine": A writes over it knowingly.
    const forced = await store.save('p-1', project('Shared, edited in A', 4), 'tab-a', null);
    expect(forced.ok && forced.record.revision).toBe(3);
    expect(forced.ok && forced.record.createdAt).toBe(created.ok ? created.record.createdAt : '');
  });

  it('refuses to write over a record deleted in another tab (undo pending or removed), unless told to restore it', async () => {
    await store.create(project('Gone elsewhere'), 'tab-a');
    // Tab A deletes it; its undo period is running. Tab B, which loaded revision 1, saves.
    await store.markDeleted('p-1');
    const pendingDelete = await store.save('p-1', project('Gone elsewhere, edited in B', 3), 'tab-b', 1);
    expect(pendingDelete).toMatchObject({ ok: false, reason: 'deleted' });
    if (!pendingDelete.ok && pendingDelete.reason === 'deleted') expect(pendingDelete.theirs?.deletedAt).toBeDefined();
    const stillMarked = await store.get('p-1');
    expect(stillMarked?.ok && stillMarked.record.deletedAt).toBeTruthy(); // not silently brought back
    expect(stillMarked?.ok && stillMarked.record.project.name).toBe('Gone elsewhere');
    // Removed for good: B's save is refused the same way, nothing is stored again.
    await store.purge('p-1');
    const removed = await store.save('p-1', project('Gone elsewhere, edited in B', 3), 'tab-b', 1);
    expect(removed).toEqual({ ok: false, reason: 'deleted', theirs: null });
    expect(await store.get('p-1')).toBeUndefined();
    expect(await store.dump()).toEqual([]);
    // B's user chooses "restore it with my version": written knowingly.
    const again = await store.save('p-1', project('Gone elsewhere, edited in B', 3), 'tab-b', null);
    expect(again.ok && again.record.revision).toBe(1);
    expect(again.ok && again.record.deletedAt).toBeUndefined();
  });

  it('restoring with "keep mine" over a delete still in its undo period clears the mark', async () => {
    await store.create(project('Marked'), 'tab-a');
    await store.markDeleted('p-1');
    const kept = await store.save('p-1', project('Marked, kept by B'), 'tab-b', null);
    expect(kept.ok && kept.record.revision).toBe(2);
    const read = await store.get('p-1');
    expect(read?.ok && read.record.deletedAt).toBeUndefined();
    // The other tab's purge at the end of its undo period leaves it alone.
    await store.purge('p-1');
    expect((await store.list()).map((r) => r.ok && r.record.project.name)).toEqual(['Marked, kept by B']);
  });

  it('deletes with undo: hidden first, removed only by purge, restorable until then', async () => {
    await store.create(project('Keep me'), 'tab-a');
    await store.create(project('Delete me'), 'tab-a');
    expect((await store.markDeleted('p-2')).ok).toBe(true);
    expect((await store.list()).map((r) => r.ok && r.record.id)).toEqual(['p-1']);
    expect((await store.dump()).length).toBe(2); // still stored during the undo period
    expect((await store.restore('p-2')).ok).toBe(true);
    expect((await store.list()).length).toBe(2);
    await store.markDeleted('p-2');
    await store.purge('p-2');
    expect((await store.dump()).map(([k]) => k)).toEqual([projectKey('p-1')]);
    // Restoring a missing record reports false and writes nothing.
    expect((await store.restore('nope')).ok).toBe(false);
    expect((await store.dump()).length).toBe(1);
  });

  it('purges records left marked deleted by a tab that closed during its undo period', async () => {
    await store.create(project('Stale delete'), 'tab-a');
    await store.markDeleted('p-1');
    expect(await store.purgeDeletedBefore(60_000)).toBe(0); // one second later: still in its grace time
    clockMs += 120_000;
    expect(await store.purgeDeletedBefore(60_000)).toBe(1);
    expect(await store.dump()).toEqual([]);
  });

  it('reports a refused write (quota) without changing what is stored', async () => {
    await store.create(project('Before the disk filled'), 'tab-a');
    const before = await store.dump();
    // A store whose every write fails the way a full browser storage does.
    const quota = Object.assign(new Error('The quota has been exceeded.'), { name: 'QuotaExceededError' });
    const refusing: UseStore = (mode, callback) =>
      mode === 'readwrite' ? Promise.reject(quota) : idb(mode, callback);
    const full = new ProjectStore({ store: refusing, now: () => new Date(clockMs), newId: () => 'never' });
    const saved = await full.save('p-1', project('After', 5), 'tab-a', 1);
    expect(saved).toEqual({ ok: false, reason: 'write-failed', message: describeWriteError(quota) });
    expect(describeWriteError(quota)).toMatch(/no more storage space.*quota/);
    const created = await full.create(project('New'), 'tab-a');
    expect(created.ok).toBe(false);
    expect(await store.dump()).toEqual(before);
  });

  it('never writes over a record of a newer layout: save, rename, delete, undo and purge leave it byte-identical', async () => {
    // A record as a later version of the app might write it: a higher layout and fields this build does not know.
    const newer = {
      storageVersion: STORAGE_VERSION + 1,
      id: 'future',
      createdAt: '2026-01-01T00:00:00.000Z',
      savedAt: '2026-01-02T00:00:00.000Z',
      revision: 7,
      tabId: 'tab-future',
      deletedAt: undefined,
      layoutNotes: { branches: [1, 2, 3], colour: 'teal' },
      project: { format: 'joulepath-project', version: 2, name: 'From the future', elements: [], groups: [{ id: 'g1' }] },
    };
    await set(projectKey('future'), newer, idb);
    const before = JSON.stringify(await store.dump());
    const saved = await store.save('future', project('Older layout'), 'tab-a', 7);
    expect(saved).toMatchObject({ ok: false, reason: 'not-writable' });
    if (!saved.ok && saved.reason === 'not-writable') expect(saved.message).toMatch(/newer version of Joulepath \(storage layout 3\).*update the app/);
    expect(await store.save('future', project('Older layout'), 'tab-a', null)).toMatchObject({ ok: false, reason: 'not-writable' });
    const renamed = await store.rename('future', 'Renamed', 'tab-a');
    expect(renamed).toMatchObject({ ok: false, reason: 'not-writable' });
    const deleted = await store.markDeleted('future');
    expect(deleted.ok).toBe(false);
    if (!deleted.ok) expect(deleted.message).toMatch(/update the app/);
    const restored = await store.restore('future');
    expect(restored.ok).toBe(false);
    await store.purge('future');
    clockMs += 3_600_000;
    expect(await store.purgeDeletedBefore(0)).toBe(0);
    expect((await store.duplicate('future', 'tab-a')).ok).toBe(false);
    // Byte-identical, unknown fields included (the structured clone of the stored value, as JSON).
    expect(JSON.stringify(await store.dump())).toBe(before);
    const [[, raw]] = (await store.dump()) as [[string, Record<string, unknown>]];
    expect(raw['layoutNotes']).toEqual({ branches: [1, 2, 3], colour: 'teal' });
    // It is still listed, with the message to update the app.
    expect(await store.list()).toMatchObject([{ ok: false, reason: 'newer' }]);
  });

  it('names copies without piling up marks', async () => {
    // Our own naming rule (web/storage/record.ts copyName): common practice (no source).
    expect(copyName('Pump house', [])).toBe('Pump house (copy)');
    expect(copyName('Pump house (copy)', ['Pump house (copy)'])).toBe('Pump house (copy 2)');
    expect(copyName('Pump house (copy 2)', ['Pump house (copy)', 'Pump house (copy 2)'])).toBe('Pump house (copy 3)');
    expect(copyName('Pump house (my copy)', [], 'copy')).toBe('Pump house (copy)');
    expect(copyName('Pump house (my copy) (my copy)', [], 'my copy')).toBe('Pump house (my copy)');
    expect(copyName('Riverside', ['Riverside (my copy)'], 'my copy')).toBe('Riverside (my copy 2)');
    expect(copyName('  ', [])).toBe('Untitled project (copy)');
    // A copy of a name at the import's 200-character limit (limits.ts) stays within it: the name is shortened, the mark kept.
    const long = 'P'.repeat(200);
    expect(copyName(long, [])).toBe(`${'P'.repeat(193)} (copy)`);
    expect(copyName(long, [`${'P'.repeat(193)} (copy)`])).toHaveLength(200);
    expect(copyName(long, [], 'my copy')).toMatch(/^P{190} \(my copy\)$/);
    // Duplicating a copy through the store: "(copy 2)", never "(copy) (copy)".
    await store.create(project('Bravo'), 'tab-a');
    const first = await store.duplicate('p-1', 'tab-a');
    const second = first.ok ? await store.duplicate(first.record.id, 'tab-a') : first;
    expect(first.ok && first.record.project.name).toBe('Bravo (copy)');
    expect(second.ok && second.record.project.name).toBe('Bravo (copy 2)');
  });
});
