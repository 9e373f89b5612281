/**
 * Messages between the page (web/sw-register.ts) and the service worker. Shared by both sides so the
 * shape cannot drift. No DOM or worker types here: both type-check this file.
 */
/** The message workbox-window's `messageSkipWaiting()` posts to the waiting worker. */
export const SKIP_WAITING = 'SKIP_WAITING' as const;

export interface SkipWaitingMessage {
  type: typeof SKIP_WAITING;
}

export function isSkipWaitingMessage(data: unknown): data is SkipWaitingMessage {
  return typeof data === 'object' && data !== null && (data as { type?: unknown }).type === SKIP_WAITING;
}
