/**
 * The page's side of the spread worker (spread-worker.ts): the worker starts on the first run and is
 * kept; one run at a time, its replies handed to the listener of that run. Cancel sends the worker a
 * message it reads between chunks; a worker that fails is dropped and started afresh on the next run.
 */
import type { SpreadReply, SpreadRequest } from './spread-worker.ts';
import { PROJECT_LEVEL } from '../../../core/page.ts';

let worker: Worker | null = null;
let nextId = 1;
let listener: { id: number; on: (reply: SpreadReply) => void } | null = null;

function start(): Worker {
  const w = new Worker(new URL('./spread-worker.ts', import.meta.url), { type: 'module' });
  w.onmessage = (event: MessageEvent<SpreadReply>) => {
    const l = listener;
    if (!l || event.data.id !== l.id) return;
    // A run's last reply: the next run may start.
    if (event.data.kind === 'done' || event.data.kind === 'refused' || event.data.kind === 'cancelled') listener = null;
    l.on(event.data);
  };
  w.onerror = (event) => {
    const l = listener;
    worker?.terminate();
    worker = null;
    listener = null;
    l?.on({ kind: 'refused', id: l.id, problems: [{ code: 'invalid-value', elementId: PROJECT_LEVEL, field: '', message: `The spread worker stopped: ${event.message || 'unknown error'}` }] });
  };
  return w;
}

/** Start a run (a run still going is cancelled first); returns its id. */
export function startSpread(request: Omit<Extract<SpreadRequest, { kind: 'run' }>, 'id' | 'kind'>, on: (reply: SpreadReply) => void): number {
  if (listener) cancelSpread(listener.id);
  const id = nextId++;
  listener = { id, on };
  try {
    worker ??= start();
    worker.postMessage({ kind: 'run', id, ...request } satisfies SpreadRequest);
  } catch (error) {
    listener = null;
    on({ kind: 'refused', id, problems: [{ code: 'invalid-value', elementId: PROJECT_LEVEL, field: '', message: `The spread worker could not start: ${String(error)}` }] });
  }
  return id;
}

/** Ask the worker to stop the run after its current chunk (it answers `cancelled`). */
export function cancelSpread(id: number): void {
  worker?.postMessage({ kind: 'cancel', id } satisfies SpreadRequest);
}

/** Stop listening (the panel closed): the run is cancelled. */
export function dropSpread(id: number): void {
  if (listener?.id !== id) return;
  cancelSpread(id);
  listener = null;
}
