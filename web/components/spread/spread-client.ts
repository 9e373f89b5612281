/**
 * The page's side of the spread workers (spread-worker.ts): one per core the device reports, up to
 * four, started on the first run and kept. A run hands each worker its share of the chunks, counts the
 * samples as chunks come back (the progress), and when every worker has finished merges the chunks and
 * the one-at-a-time runs with core's spreadSummary (a figure that is not finite refuses the whole
 * summary, naming it). Cancel sends every worker a message it reads between chunks. One run at a time;
 * a worker that fails is dropped with the others and they start afresh on the next run.
 */
import type { SpreadRequest, SpreadWorkerReply } from './spread-worker.ts';
import { spreadSummary, type CostSettings, type SpreadChunk, type SpreadPlan, type SpreadResult, type Swing } from '../../../core/studies/index.ts';
import { elementNames, nonFiniteProblems, PROJECT_LEVEL, type Problem, type Solved, type SpreadSettings } from '../../../core/page.ts';

/** What the panel hears of a run. */
export type SpreadReply =
  | { kind: 'started'; id: number; samples: number; seed: number; workers: number }
  | { kind: 'progress'; id: number; done: number; total: number }
  | { kind: 'done'; id: number; result: SpreadResult; ms: number }
  | { kind: 'refused'; id: number; problems: Problem[] }
  | { kind: 'cancelled'; id: number; done: number };

/** Workers per run: the device's cores, at most four (each holds a copy of the project and its own engine). */
const POOL = Math.max(1, Math.min(4, typeof navigator !== 'undefined' && navigator.hardwareConcurrency ? navigator.hardwareConcurrency : 2));

let pool: Worker[] = [];
let nextId = 1;

interface Run {
  id: number;
  on: (reply: SpreadReply) => void;
  t0: number;
  plan: SpreadPlan | null;
  chunks: SpreadChunk[];
  swings: Swing[] | null;
  done: number;
  finished: number;
  over: boolean;
  solved: Solved;
}
let current: Run | null = null;

function end(run: Run, reply: SpreadReply): void {
  if (run.over) return;
  run.over = true;
  if (current === run) current = null;
  run.on(reply);
}

function fail(message: string): void {
  for (const w of pool) w.terminate();
  pool = [];
  const run = current;
  if (run) end(run, { kind: 'refused', id: run.id, problems: [{ code: 'invalid-value', elementId: PROJECT_LEVEL, field: '', message }] });
}

function heard(reply: SpreadWorkerReply): void {
  const run = current;
  if (!run || reply.id !== run.id || run.over) return;
  switch (reply.kind) {
    case 'started':
      if (!run.plan) {
        run.plan = reply.plan;
        run.on({ kind: 'started', id: run.id, samples: reply.plan.samples, seed: reply.plan.seed, workers: pool.length });
      }
      return;
    case 'chunk':
      run.chunks.push(reply.chunk);
      run.done += reply.chunk.count;
      run.on({ kind: 'progress', id: run.id, done: run.done, total: run.plan?.samples ?? run.done });
      return;
    case 'swings':
      run.swings = reply.swings;
      return;
    case 'refused':
      cancelAll(run.id);
      end(run, reply);
      return;
    case 'cancelled':
      end(run, { kind: 'cancelled', id: run.id, done: run.done });
      return;
    case 'finished': {
      run.finished++;
      if (run.finished < pool.length || !run.plan) return;
      const result = spreadSummary(run.plan, run.chunks, run.swings ?? []);
      const bad = nonFiniteProblems('The runtime spread', result, elementNames(run.solved.project));
      end(run, bad.length ? { kind: 'refused', id: run.id, problems: bad } : { kind: 'done', id: run.id, result, ms: performance.now() - run.t0 });
    }
  }
}

function startPool(): Worker[] {
  return Array.from({ length: POOL }, () => {
    const w = new Worker(new URL('./spread-worker.ts', import.meta.url), { type: 'module' });
    w.onmessage = (event: MessageEvent<SpreadWorkerReply>) => heard(event.data);
    w.onerror = (event) => fail(`The spread worker stopped: ${event.message || 'unknown error'}`);
    return w;
  });
}

function cancelAll(id: number): void {
  for (const w of pool) w.postMessage({ kind: 'cancel', id } satisfies SpreadRequest);
}

/** Start a run (a run still going is cancelled first); returns its id. */
export function startSpread(request: { solved: Solved; settings: SpreadSettings; cost: CostSettings | null }, on: (reply: SpreadReply) => void): number {
  if (current) dropSpread(current.id);
  const id = nextId++;
  const run: Run = { id, on, t0: performance.now(), plan: null, chunks: [], swings: null, done: 0, finished: 0, over: false, solved: request.solved };
  current = run;
  try {
    if (pool.length === 0) pool = startPool();
    pool.forEach((w, part) => w.postMessage({ kind: 'run', id, ...request, part, parts: pool.length } satisfies SpreadRequest));
  } catch (error) {
    fail(`The spread worker could not start: ${String(error)}`);
  }
  return id;
}

/** Ask the workers to stop the run after their current chunk (the panel hears `cancelled`). */
export function cancelSpread(id: number): void {
  if (current?.id === id) cancelAll(id);
}

/** Stop listening (the panel closed, or a new run): the run is cancelled and its replies dropped. */
export function dropSpread(id: number): void {
  if (current?.id !== id) return;
  cancelAll(id);
  current.over = true;
  current = null;
}
