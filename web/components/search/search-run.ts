/**
 * The page's side of the search worker (search-worker.ts): one worker per run, ended when the run is
 * done or stopped (a search cannot be paused half-way through one option, so stopping ends it).
 */
import type { SearchMessage, SearchRequest } from './search-worker.ts';

export type SearchEnd = Extract<SearchMessage, { kind: 'done' | 'crash' }> | { kind: 'stopped' };

export interface SearchRunHandle {
  done: Promise<SearchEnd>;
  stop(): void;
}

export function startSearch(request: SearchRequest, onProgress: (done: number, total: number) => void): SearchRunHandle {
  let finish: (end: SearchEnd) => void = () => {};
  const done = new Promise<SearchEnd>((resolve) => (finish = resolve));
  let worker: Worker | null = null;
  const end = (e: SearchEnd) => {
    worker?.terminate();
    worker = null;
    finish(e);
  };
  try {
    worker = new Worker(new URL('./search-worker.ts', import.meta.url), { type: 'module' });
    worker.onmessage = (event: MessageEvent<SearchMessage>) => {
      const m = event.data;
      if (m.kind === 'progress') onProgress(m.done, m.total);
      else end(m);
    };
    worker.onerror = (event) => end({ kind: 'crash', message: `The search worker stopped: ${event.message || 'unknown error'}` });
    worker.postMessage(request);
  } catch (error) {
    end({ kind: 'crash', message: `The search worker could not start: ${String(error)}` });
  }
  return { done, stop: () => end({ kind: 'stopped' }) };
}
