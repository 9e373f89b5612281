// The service worker deletes only its own caches (issue 15, point 11): another app on the same origin
// keeps its offline copy. Names are invented; the workbox naming `<prefix>-<name>-<scope>` is
// workbox-core's cacheNames (reference library).
import { describe, expect, it } from 'vitest';
import { cachesToDelete, deleteUnknownCaches, OWN_CACHE_PREFIX, type CacheList } from '../../service-worker/cache-owner.ts';

/** A CacheStorage stand-in: a set of names. */
function fakeCaches(names: string[]): CacheList & { names: Set<string> } {
  const set = new Set(names);
  return {
    names: set,
    keys: async () => [...set],
    delete: async (name) => set.delete(name),
  };
}

const scope = 'https://plans.example/joulepath/';
const current = `joulepath-shell-v1-${scope}`;
const runtime = `joulepath-runtime-v1-${scope}`;

describe('deleteUnknownCaches', () => {
  it('deletes this app\'s unused caches and keeps every other app\'s', async () => {
    const caches = fakeCaches([
      current,
      runtime,
      `joulepath-shell-v0-${scope}`, // an older layout of ours: goes
      'joulepath-precache-v2-https://plans.example/', // workbox's default name with our prefix: ours, goes
      'other-app-v1', // another app on the origin: stays
      'workbox-precache-v2-https://plans.example/other/', // another workbox app's precache: stays
      'joulepathology-notes', // shares letters, not our prefix: stays
      'JOULEPATH-shell-v1', // not our (case-sensitive) prefix: stays
    ]);
    const gone = await deleteUnknownCaches(caches, [current, runtime]);
    expect(gone.sort()).toEqual([`joulepath-shell-v0-${scope}`, 'joulepath-precache-v2-https://plans.example/'].sort());
    expect([...caches.names].sort()).toEqual([current, runtime, 'other-app-v1', 'workbox-precache-v2-https://plans.example/other/', 'joulepathology-notes', 'JOULEPATH-shell-v1'].sort());
  });

  it('never deletes a cache it keeps, and nothing at all when only other apps\' caches are there', async () => {
    const caches = fakeCaches(['other-app-v1', 'my-site-images']);
    expect(await deleteUnknownCaches(caches, [current])).toEqual([]);
    expect(caches.names.size).toBe(2);
    expect(cachesToDelete([current], [current])).toEqual([]);
    expect(OWN_CACHE_PREFIX).toBe('joulepath-');
  });
});
