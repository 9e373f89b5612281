/**
 * Joulepath's service worker: listeners and the precache list only (caching rules are in routes.ts).
 *
 * The build (vite-plugin-pwa, injectManifest) replaces `self.__WB_MANIFEST` with every file of the
 * built app — HTML, JS (the lazy chunks too), CSS, icons and the web app manifest — each with a
 * revision, so a new build is a new precache and the old one is removed once the new worker takes over.
 * A new worker waits until the page asks it to take over (the user's "Reload" in the update prompt):
 * it never replaces the running app by itself.
 */
/// <reference lib="webworker" />
import { precacheAndRoute } from 'workbox-precaching';
import type { PrecacheEntry } from 'workbox-precaching';
import { deleteOwnUnusedCaches, routeNavigationsToShell, SHELL_CACHE_DETAILS } from './routes.ts';
import { isSkipWaitingMessage } from './messages.ts';

declare const self: ServiceWorkerGlobalScope & { __WB_MANIFEST: (string | PrecacheEntry)[] };

SHELL_CACHE_DETAILS.apply();
precacheAndRoute(self.__WB_MANIFEST);
routeNavigationsToShell();

self.addEventListener('activate', (event) => {
  event.waitUntil(deleteOwnUnusedCaches());
});

self.addEventListener('message', (event) => {
  if (isSkipWaitingMessage(event.data)) void self.skipWaiting();
});
