/**
 * A worker of the runtime spread (issue 20 point 3), started only when the "Runtime spread" panel
 * runs: every sample is a solve and a runtime study (milliseconds each), so a run of a thousand takes
 * seconds, off the page's thread and apart from the panel worker (whose short studies keep answering).
 * The page starts one per core, up to four (spread-client.ts): each runs its share of the chunks.
 *
 * Protocol (plain data): the page sends `run` with the last valid solved pair, the settings, the cost
 * settings and which share of the chunks is this worker's (chunk k when k mod parts = part); the worker
 * answers `started` (the plan), a `chunk` after each chunk of samples, `swings` (the one-at-a-time runs,
 * from the worker of part 0), then `finished`; or `refused` / `cancelled`. A `cancel` is read between
 * chunks: each chunk is its own task (a zero-delay timer), so the message is taken in between. Every
 * figure comes from core (core/studies/spread/); the page merges the chunks with core's spreadSummary.
 */
import { spreadPlan, spreadRun, spreadSensitivity, type CostSettings, type SpreadChunk, type SpreadPlan, type Swing } from '../../../core/studies/index.ts';
import type { Problem, Solved, SpreadSettings } from '../../../core/page.ts';

export type SpreadRequest =
  | { kind: 'run'; id: number; solved: Solved; settings: SpreadSettings; cost: CostSettings | null; part: number; parts: number }
  | { kind: 'cancel'; id: number };

export type SpreadWorkerReply =
  | { kind: 'started'; id: number; plan: SpreadPlan }
  | { kind: 'chunk'; id: number; chunk: SpreadChunk }
  | { kind: 'swings'; id: number; swings: Swing[] }
  | { kind: 'finished'; id: number }
  | { kind: 'refused'; id: number; problems: Problem[] }
  | { kind: 'cancelled'; id: number };

/** Samples per chunk: small enough that progress moves and a cancel is taken within a fraction of a second. */
export const SPREAD_CHUNK = 20;

const cancelled = new Set<number>();
const post = (reply: SpreadWorkerReply) => (self as unknown as Worker).postMessage(reply);
const nextTask = () => new Promise<void>((resolve) => setTimeout(resolve, 0));

async function run(req: Extract<SpreadRequest, { kind: 'run' }>): Promise<void> {
  const { id, solved, part, parts } = req;
  const plan = spreadPlan(solved, { settings: req.settings, cost: req.cost });
  if (!plan.ok) return post({ kind: 'refused', id, problems: plan.problems });
  post({ kind: 'started', id, plan: plan.value });
  const total = plan.value.samples;
  for (let k = part; k * SPREAD_CHUNK < total; k += parts) {
    await nextTask();
    if (cancelled.delete(id)) return post({ kind: 'cancelled', id });
    post({ kind: 'chunk', id, chunk: spreadRun(solved, plan.value, { from: k * SPREAD_CHUNK, count: SPREAD_CHUNK }) });
  }
  if (part === 0) {
    await nextTask();
    if (cancelled.delete(id)) return post({ kind: 'cancelled', id });
    post({ kind: 'swings', id, swings: spreadSensitivity(solved, plan.value) });
  }
  post({ kind: 'finished', id });
}

self.onmessage = (event: MessageEvent<SpreadRequest>) => {
  const req = event.data;
  if (req.kind === 'cancel') cancelled.add(req.id);
  else void run(req);
};
