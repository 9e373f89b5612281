/**
 * Caching rules of the service worker. The app is a static shell: every file it needs is precached,
 * so there is no runtime caching and no request ever goes past the service worker to another origin.
 */
/// <reference lib="webworker" />
import { cacheNames, setCacheNameDetails } from 'workbox-core';
import { createHandlerBoundToURL } from 'workbox-precaching';
import { NavigationRoute, registerRoute } from 'workbox-routing';

declare const self: ServiceWorkerGlobalScope;

/** Cache names carry the app's name and the shell format's version (bump on a change of layout). */
export const SHELL_CACHE_DETAILS = {
  prefix: 'joulepath',
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

/** On activation, delete caches this worker does not use (older shells, older layouts). */
export async function deleteUnknownCaches(): Promise<void> {
  const keep = new Set([cacheNames.precache, cacheNames.runtime]);
  const names = await self.caches.keys();
  await Promise.all(names.filter((name) => !keep.has(name)).map((name) => self.caches.delete(name)));
}
