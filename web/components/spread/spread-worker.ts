/**
 * The runtime spread's own worker (issue 20 point 3), started only when the "Runtime spread" panel
 * runs: every sample is a solve and a runtime study (milliseconds each), so a run of a thousand takes
 * seconds, off the page's thread and apart from the panel worker (whose short studies keep answering).
 *
 * Protocol (plain data): the page sends `run` with the last valid solved pair, the settings and the
 * cost settings; the worker answers `started` (samples, seed), `progress` after each chunk, then
 * `done` with the summary, or `refused` / `cancelled`. A `cancel` is read between chunks: each chunk
 * is its own task (a zero-delay timer), so the message is taken in between. Every figure comes from
 * core (core/studies/spread/); a summary with a figure that is not finite is refused, naming it.
 */
import { spreadPlan, spreadRun, spreadSensitivity, spreadSummary, type CostSettings, type SpreadChunk, type SpreadResult } from '../../../core/studies/index.ts';
import { elementNames, nonFiniteProblems, type Problem, type Solved, type SpreadSettings } from '../../../core/page.ts';

export type SpreadRequest = { kind: 'run'; id: number; solved: Solved; settings: SpreadSettings; cost: CostSettings | null } | { kind: 'cancel'; id: number };

export type SpreadReply =
  | { kind: 'started'; id: number; samples: number; seed: number }
  | { kind: 'progress'; id: number; done: number; total: number }
  | { kind: 'done'; id: number; result: SpreadResult; ms: number }
  | { kind: 'refused'; id: number; problems: Problem[] }
  | { kind: 'cancelled'; id: number; done: number };

/** Samples per chunk: small enough that progress moves and a cancel is taken within a fraction of a second. */
const CHUNK = 20;

const cancelled = new Set<number>();
const post = (reply: SpreadReply) => (self as unknown as Worker).postMessage(reply);
const nextTask = () => new Promise<void>((resolve) => setTimeout(resolve, 0));

async function run(req: Extract<SpreadRequest, { kind: 'run' }>): Promise<void> {
  const t0 = performance.now();
  const { id, solved } = req;
  const plan = spreadPlan(solved, { settings: req.settings, cost: req.cost });
  if (!plan.ok) return post({ kind: 'refused', id, problems: plan.problems });
  const total = plan.value.samples;
  post({ kind: 'started', id, samples: total, seed: plan.value.seed });
  const chunks: SpreadChunk[] = [];
  for (let from = 0; from < total; from += CHUNK) {
    await nextTask();
    if (cancelled.has(id)) {
      cancelled.delete(id);
      return post({ kind: 'cancelled', id, done: from });
    }
    chunks.push(spreadRun(solved, plan.value, { from, count: CHUNK }));
    post({ kind: 'progress', id, done: Math.min(total, from + CHUNK), total });
  }
  await nextTask();
  if (cancelled.delete(id)) return post({ kind: 'cancelled', id, done: total });
  const result = spreadSummary(plan.value, chunks, spreadSensitivity(solved, plan.value));
  const bad = nonFiniteProblems('The runtime spread', result, elementNames(solved.project));
  if (bad.length) return post({ kind: 'refused', id, problems: bad });
  post({ kind: 'done', id, result, ms: performance.now() - t0 });
}

self.onmessage = (event: MessageEvent<SpreadRequest>) => {
  const req = event.data;
  if (req.kind === 'cancel') cancelled.add(req.id);
  else void run(req);
};
