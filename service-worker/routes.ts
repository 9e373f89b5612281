/**
 * Caching rules of the service worker. The app is a static shell: every file it needs is precached,
 * so there is no runtime caching and no request ever goes past the service worker to another origin.
 */
/// <reference lib="webworker" />
import { cacheNames, setCacheNameDetails } from 'workbox-core';
import { createHandlerBoundToURL } from 'workbox-precaching';
import { NavigationRoute, registerRoute } from 'workbox-routing';
import { deleteUnknownCaches, OWN_CACHE_PREFIX } from './cache-owner.ts';

declare const self: ServiceWorkerGlobalScope;

/** Cache names carry the app's name and the shell format's version (bump on a change of layout). */
export const SHELL_CACHE_DETAILS = {
  // Workbox joins prefix and name with "-": every name starts with OWN_CACHE_PREFIX ("joulepath-").
  prefix: OWN_CACHE_PREFIX.slice(0, -1),
  precache: 'shell-v1',
  apply(): void {
    setCacheNameDetails({ prefix: this.prefix, precache: this.precache, runtime: 'runtime-v1' });
  },
};

/**
 * Every navigation inside the scope (the page, with or without #demo=… / #project=…, or a deep
 * link) is answered with the precached index.html, so the app opens with no network.
 */
export function routeNavigationsToShell(): void {
  registerRoute(new NavigationRoute(createHandlerBoundToURL('index.html')));
}

/**
 * On activation, delete this app's caches the worker does not use (older shells, older layouts);
 * caches of other apps on the same origin stay (cache-owner.ts).
 */
export async function deleteOwnUnusedCaches(): Promise<void> {
  await deleteUnknownCaches(self.caches, [cacheNames.precache, cacheNames.runtime], OWN_CACHE_PREFIX);
}
