/**
 * Which caches this app's service worker may delete: only its own. Other apps can live on the same
 * origin (a shared host, a sub-path) and keep their own caches in the same CacheStorage; a worker that
 * deleted every cache it did not use would wipe their offline copies. No DOM or worker types here, so
 * the Node tests check this file with a fake cache list.
 */

/** Every cache this app makes starts with this (workbox names: `<prefix>-<name>-<scope>`). */
export const OWN_CACHE_PREFIX = 'joulepath-';

/** The part of CacheStorage this needs (the worker passes `self.caches`). */
export interface CacheList {
  keys(): Promise<string[]>;
  delete(name: string): Promise<boolean>;
}

/** Names to delete: this app's own caches that the running worker does not use. */
export function cachesToDelete(names: readonly string[], keep: Iterable<string>, prefix: string = OWN_CACHE_PREFIX): string[] {
  const kept = new Set(keep);
  return names.filter((name) => name.startsWith(prefix) && !kept.has(name));
}

/**
 * On activation: delete this app's caches the new worker does not use (older shells, older layouts),
 * never another app's. Returns the names deleted.
 */
export async function deleteUnknownCaches(caches: CacheList, keep: Iterable<string>, prefix: string = OWN_CACHE_PREFIX): Promise<string[]> {
  const gone = cachesToDelete(await caches.keys(), keep, prefix);
  await Promise.all(gone.map((name) => caches.delete(name)));
  return gone;
}
