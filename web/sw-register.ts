/**
 * Registers the service worker (service-worker/sw.ts, built to sw.js beside index.html) through
 * workbox-window and tells the page when a new version is waiting. The page never reloads by itself:
 * the update prompt (components/UpdatePrompt.tsx) asks, and only the user's tap activates the new
 * version — after the open project has been written to storage.
 */
import { signal } from '@preact/signals';
import type { Workbox } from 'workbox-window';

declare const __JOULEPATH_VERSION__: string;

/** The app's version (package.json), shown beside the storage status. */
export const appVersion: string = typeof __JOULEPATH_VERSION__ === 'string' ? __JOULEPATH_VERSION__ : 'development';

/** 'none' until the service worker is active; 'ready' when the app can start offline. */
export const offlineReady = signal<'none' | 'installing' | 'ready' | 'unsupported' | 'failed'>('none');
/** True while a new version is installed and waiting for the user to choose when to reload. */
export const updateWaiting = signal(false);

let workbox: Workbox | undefined;
let reloadRequested = false;
/** Work to finish before the page reloads into a new version (the storage flush registers here). */
const beforeReload: (() => Promise<void>)[] = [];

export function onBeforeUpdateReload(task: () => Promise<void>): void {
  beforeReload.push(task);
}

/**
 * Register the service worker (built pages only: the dev server serves sources, not a shell). The
 * dev server is told apart by its hot-update client rather than by the mode, because a build made
 * under a test runner (NODE_ENV=test) is not marked as production yet ships the same shell.
 */
export async function registerServiceWorker(): Promise<void> {
  if (import.meta.hot) return;
  if (!('serviceWorker' in navigator)) {
    offlineReady.value = 'unsupported';
    return;
  }
  // workbox-window comes in its own chunk after the first paint (it is precached like the rest).
  const { Workbox } = await import('workbox-window');
  const wb = new Workbox(new URL('./sw.js', document.baseURI).href, { scope: './' });
  workbox = wb;
  offlineReady.value = 'installing';
  wb.addEventListener('activated', () => {
    offlineReady.value = 'ready';
  });
  wb.addEventListener('waiting', () => {
    updateWaiting.value = true;
  });
  // Only a reload the user asked for: another tab may have activated the new version meanwhile.
  wb.addEventListener('controlling', () => {
    if (reloadRequested) window.location.reload();
  });
  wb.register()
    .then((registration) => {
      if (registration?.active && !registration.installing && !registration.waiting) offlineReady.value = 'ready';
    })
    .catch(() => {
      offlineReady.value = 'failed';
    });
}

/** The user chose to load the new version: save what is open, then activate it and reload. */
export async function activateUpdate(): Promise<void> {
  if (!workbox) return;
  for (const task of beforeReload) {
    try {
      await task();
    } catch {
      // A failed write is shown by the storage status; the draft also stays in this tab's memory.
    }
  }
  reloadRequested = true;
  // Posts { type: 'SKIP_WAITING' } to the waiting worker (service-worker/messages.ts).
  workbox.messageSkipWaiting();
}
