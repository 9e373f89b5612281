/**
 * The page's side of the panel worker (panel-worker.ts): one worker, started on the first request
 * and kept; each request gets its reply by id. A worker that fails to start or dies is dropped and
 * started afresh on the next request; the waiting requests get a crash reply with the reason.
 */
import { useEffect, useRef, useState } from 'preact/hooks';
import type { PanelReply, PanelRequest } from './panel-worker.ts';

let worker: Worker | null = null;
let nextId = 1;
const waiting = new Map<number, (reply: PanelReply) => void>();

function failAll(message: string): void {
  for (const resolve of waiting.values()) resolve({ kind: 'crash', message, ms: 0 });
  waiting.clear();
  worker?.terminate();
  worker = null;
}

function start(): Worker {
  const w = new Worker(new URL('./panel-worker.ts', import.meta.url), { type: 'module' });
  w.onmessage = (event: MessageEvent<{ id: number; reply: PanelReply }>) => {
    const resolve = waiting.get(event.data.id);
    waiting.delete(event.data.id);
    resolve?.(event.data.reply);
  };
  w.onerror = (event) => failAll(`The study worker stopped: ${event.message || 'unknown error'}`);
  return w;
}

/** Send a request to the panel worker; resolves with its reply (never rejects). */
export function askPanelWorker(request: PanelRequest): Promise<PanelReply> {
  return new Promise((resolve) => {
    try {
      worker ??= start();
      const id = nextId++;
      waiting.set(id, resolve);
      worker.postMessage({ id, request });
    } catch (error) {
      resolve({ kind: 'crash', message: `The study worker could not start: ${String(error)}`, ms: 0 });
    }
  });
}

/**
 * The worker's reply to the latest request built from `deps` (older replies are ignored), and
 * whether a newer request is still on its way. `request` returning null sends nothing.
 */
export function useWorkerReply<K extends PanelReply['kind']>(
  request: () => PanelRequest | null,
  deps: readonly unknown[],
): { reply: Extract<PanelReply, { kind: K | 'crash' }> | null; pending: boolean } {
  const [state, setState] = useState<{ reply: PanelReply | null; pending: boolean }>({ reply: null, pending: false });
  const latest = useRef(0);
  useEffect(() => {
    const r = request();
    if (!r) return;
    const ticket = ++latest.current;
    setState((s) => ({ ...s, pending: true }));
    void askPanelWorker(r).then((reply) => {
      if (ticket === latest.current) setState({ reply, pending: false });
    });
    // The caller names what the request depends on (deps), as with useEffect itself.
  }, deps);
  return state as { reply: Extract<PanelReply, { kind: K | 'crash' }> | null; pending: boolean };
}
