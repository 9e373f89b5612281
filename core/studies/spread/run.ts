/**
 * The runtime with its spread: Monte Carlo over the tolerances (sample.ts), each sample a changed
 * project solved through core/solve/variant.ts and run through the battery backup study
 * (runBackupStudy: the runtime, the bank for the target runtime), and priced by the yearly cost of
 * its losses (economics.ts). Chunked, so a worker can report progress and stop between chunks:
 *   const plan = spreadPlan(solved, opts);                       // checks, the single run
 *   spreadRun(solved, plan, { from, count }) … for each chunk    // the samples
 *   spreadSummary(plan, chunks, spreadSensitivity(solved, plan)) // merged
 * `runSpread` does all three. Pure; never throws on bad input.
 */
import type { SpreadSettings } from '../../model/spread.ts';
import { formatProblem, PROJECT_LEVEL, type Problem } from '../../model/errors.ts';
import type { Solved } from '../../solve/index.ts';
import { variantProject } from '../../solve/variant.ts';
import { solveValid } from '../../solve/solved.ts';
import { runBackupStudy } from '../backup/study.ts';
import { costSettingsOf, type CostSettings } from '../economics.ts';
import { lossCostOfSolved } from '../loss-over-profile.ts';
import { DEFAULT_SPREAD_SAMPLES, DEFAULT_SPREAD_SEED, SPREAD_INPUTS, tolerancesOf, type SpreadInput, type Tolerances } from './tolerances.ts';
import { changeOf, drawSamples, isEmptyChange, NOMINAL_DRAW, type Draw } from './sample.ts';
import { histogram, percentiles, type HistogramBin, type Percentiles } from './stats.ts';

export interface SpreadOptions {
  /** The settings (default: the project's `spread`). */
  settings?: SpreadSettings;
  /** The price of the losses (default: the project's `running` settings; none: no cost figures). */
  cost?: CostSettings | null;
}

/** What every chunk and the summary share: resolved settings and the single run. */
export interface SpreadPlan {
  samples: number;
  seed: number;
  tolerances: Tolerances;
  cost: CostSettings | null;
  /** The project as given, run once. */
  single: SampleFigures;
  /** Solved output power per element (a loss polynomial without a rating is shifted there). */
  outputW: ReadonlyMap<string, number>;
  /** Target runtime of the backup settings, h (the bank figures are for it). */
  targetHours?: number;
}

/** One run's figures. */
export interface SampleFigures {
  /** Runtime, h. */
  runtimeH: number;
  /** True when the run reached the study's horizon or the profile's end: the runtime is "longer than". */
  lowerBound: boolean;
  /** The bank for the target runtime (all strings), Ah; null without a target. */
  bankAh: number | null;
  /** The capacity the target needs before it is rounded to whole strings (the sizing's required capacity), Ah; null without a target. */
  requiredAh: number | null;
  /** Yearly cost of the losses at the solved operating point; null without a price. */
  costPerYear: number | null;
}

export interface SpreadChunk {
  from: number;
  count: number;
  /** One per sample, in order; NaN where a sample failed. */
  runtimeH: number[];
  lowerBound: boolean[];
  bankAh: (number | null)[];
  requiredAh: (number | null)[];
  costPerYear: (number | null)[];
  /** Samples the solve or the study refused, with the first reason. */
  failures: { index: number; message: string }[];
}

/** One input's swing: the figures with it at its low and at its high end, the others at the project's values. */
export interface Swing {
  input: SpreadInput;
  low: SampleFigures | null;
  high: SampleFigures | null;
  /** |runtime(high) − runtime(low)|, h: the ranking's key; null when an end could not be run. */
  runtimeSwingH: number | null;
  /** |cost(high) − cost(low)| of the yearly cost of the losses: the cost ranking's key; null without a price or when an end could not be run. */
  costSwing: number | null;
}

export interface SpreadResult {
  samples: number;
  seed: number;
  method: string;
  tolerances: Tolerances;
  single: SampleFigures;
  targetHours?: number;
  runtimeH: Percentiles | null;
  histogram: HistogramBin[];
  /** Samples whose runtime is a lower bound (the run reached the horizon). */
  lowerBoundCount: number;
  bankAh: Percentiles | null;
  /** The capacity the target needs before rounding to whole strings, Ah (the bank moves in whole strings, this does not); null without a target. */
  requiredAh: Percentiles | null;
  /** That capacity in equal bins (Rice rule), Ah; null without a target. */
  requiredHistogram: HistogramBin[] | null;
  costPerYear: Percentiles | null;
  /** The yearly cost of the losses in equal bins (Rice rule); null without a price. */
  costHistogram: HistogramBin[] | null;
  /** One-at-a-time swings, largest runtime swing first (the sensitivity ranking). */
  sensitivity: Swing[];
  sensitivityMethod: string;
  /** The same swings, largest swing in the yearly cost first; null without a price. */
  costSensitivity: Swing[] | null;
  costSensitivityMethod: string;
  failed: number;
  failures: { index: number; message: string }[];
}

export type Outcome<T> = { ok: true; value: T } | { ok: false; problems: Problem[] };

export const SPREAD_METHOD =
  'Monte Carlo: each input drawn uniformly within its tolerance, independently (pure-rand xoroshiro128plus, seeded); each sample re-solved and run through the runtime study; percentiles by linear interpolation (Hyndman–Fan 7)';
export const SENSITIVITY_METHOD = 'one at a time: each input at the low and the high end of its tolerance, the others at the project’s values; ranked by the swing in runtime';
export const COST_SENSITIVITY_METHOD = 'one at a time, the same runs: ranked by the swing in the yearly cost of the losses';

/** One run of the study on a draw. */
function runDraw(solved: Solved, plan: Pick<SpreadPlan, 'tolerances' | 'cost' | 'outputW'>, d: Readonly<Draw>): Outcome<SampleFigures> {
  const change = changeOf(solved.project, plan.tolerances, d, plan.outputW);
  let s: Solved = solved;
  if (!isEmptyChange(change)) {
    const v = variantProject(solved, change);
    if (!v.ok) return v;
    const o = solveValid(v.project);
    if (!o.ok) return o;
    s = o;
  }
  // The runtime and the sizing only: the spread reads no sized run, no recharge, no plot series and
  // no list of the sizing's periods.
  const study = runBackupStudy(s, { sizedRun: false, recharge: false, plotSeries: false, sizingPeriods: false });
  if (!study.ok) return study;
  const dis = study.study.discharge;
  let costPerYear: number | null = null;
  if (plan.cost) {
    const c = lossCostOfSolved(s, plan.cost);
    if (!c.ok) return c;
    costPerYear = c.cost.totalCost;
  }
  return {
    ok: true,
    value: { runtimeH: dis.runtimeSeconds / 3600, lowerBound: dis.runtimeIsLowerBound, bankAh: study.study.sizing?.bankCapacity ?? null, requiredAh: study.study.sizing?.requiredCapacity ?? null, costPerYear },
  };
}

/** Checks and the single run; refused (naming the field) when the project has no runtime study to spread. */
export function spreadPlan(solved: Solved, opts: SpreadOptions = {}): Outcome<SpreadPlan> {
  const settings = opts.settings ?? solved.project.spread;
  const project = solved.project;
  if (!project.backup || !project.elements.some((e) => e.kind === 'battery' && e.bank)) {
    return { ok: false, problems: [{ code: 'invalid-value', elementId: PROJECT_LEVEL, field: 'backup', value: undefined, message: 'the runtime spread needs a battery bank and the battery backup study settings' }] };
  }
  const tolerances = tolerancesOf(settings);
  const cost = opts.cost === undefined ? costSettingsOf(project) : opts.cost;
  const outputW = new Map(solved.result.elements.map((e) => [e.id, e.pOut] as const));
  const base = { tolerances, cost, outputW };
  const single = runDraw(solved, { ...base, tolerances: { capacity: 0, aging: 0, temperature: 0, efficiency: 0, load: 0, endVoltage: 0 } }, NOMINAL_DRAW);
  if (!single.ok) return single;
  return {
    ok: true,
    value: {
      samples: settings?.samples ?? DEFAULT_SPREAD_SAMPLES,
      seed: settings?.seed ?? DEFAULT_SPREAD_SEED,
      ...base,
      single: single.value,
      ...(project.backup.targetRuntimeHours !== undefined ? { targetHours: project.backup.targetRuntimeHours } : {}),
    },
  };
}

/** Samples from … from + count − 1 (clipped to the plan's samples); the same whichever chunk runs them. */
export function spreadRun(solved: Solved, plan: SpreadPlan, range: { from: number; count: number }): SpreadChunk {
  const from = Math.max(0, Math.floor(range.from));
  const count = Math.max(0, Math.min(Math.floor(range.count), plan.samples - from));
  const chunk: SpreadChunk = { from, count, runtimeH: [], lowerBound: [], bankAh: [], requiredAh: [], costPerYear: [], failures: [] };
  drawSamples(plan.seed, from, count).forEach((d, i) => {
    const r = runDraw(solved, plan, d);
    if (r.ok) {
      chunk.runtimeH.push(r.value.runtimeH);
      chunk.lowerBound.push(r.value.lowerBound);
      chunk.bankAh.push(r.value.bankAh);
      chunk.requiredAh.push(r.value.requiredAh);
      chunk.costPerYear.push(r.value.costPerYear);
    } else {
      chunk.runtimeH.push(NaN);
      chunk.lowerBound.push(false);
      chunk.bankAh.push(null);
      chunk.requiredAh.push(null);
      chunk.costPerYear.push(null);
      chunk.failures.push({ index: from + i, message: r.problems[0] ? formatProblem(r.problems[0], solved.project) : 'refused' });
    }
  });
  return chunk;
}

/** One-at-a-time swings of every input with a tolerance, largest runtime swing first. */
export function spreadSensitivity(solved: Solved, plan: SpreadPlan): Swing[] {
  const out: Swing[] = [];
  for (const input of SPREAD_INPUTS) {
    if (plan.tolerances[input] === 0) continue;
    const at = (z: number) => {
      const r = runDraw(solved, plan, { ...NOMINAL_DRAW, [input]: z });
      return r.ok ? r.value : null;
    };
    const low = at(-1);
    const high = at(1);
    const swing = low && high ? Math.abs(high.runtimeH - low.runtimeH) : null;
    const costSwing = low?.costPerYear != null && high?.costPerYear != null ? Math.abs(high.costPerYear - low.costPerYear) : null;
    out.push({ input, low, high, runtimeSwingH: swing, costSwing });
  }
  // A swing that could not be run sorts last; equal swings keep the inputs' order (a stable sort).
  return out.sort((a, b) => (b.runtimeSwingH ?? -1) - (a.runtimeSwingH ?? -1));
}

/**
 * The swings ranked by their swing in the yearly cost of the losses, largest first (a swing that could
 * not be priced sorts last; equal swings keep the order given: a stable sort). The same runs as the
 * runtime's ranking, in another order.
 */
export function costRanking(sensitivity: readonly Swing[]): Swing[] {
  return [...sensitivity].sort((a, b) => (b.costSwing ?? -1) - (a.costSwing ?? -1));
}

/** The chunks merged (in sample order) and summarised. */
export function spreadSummary(plan: SpreadPlan, chunks: readonly SpreadChunk[], sensitivity: Swing[]): SpreadResult {
  const ordered = [...chunks].sort((a, b) => a.from - b.from);
  const runtime = ordered.flatMap((c) => c.runtimeH);
  const nums = (xs: (number | null)[]) => xs.filter((x): x is number => x !== null);
  const failures = ordered.flatMap((c) => c.failures);
  const bank = nums(ordered.flatMap((c) => c.bankAh));
  const required = nums(ordered.flatMap((c) => c.requiredAh));
  const cost = nums(ordered.flatMap((c) => c.costPerYear));
  return {
    samples: runtime.length,
    seed: plan.seed,
    method: SPREAD_METHOD,
    tolerances: plan.tolerances,
    single: plan.single,
    ...(plan.targetHours !== undefined ? { targetHours: plan.targetHours } : {}),
    runtimeH: percentiles(runtime),
    histogram: histogram(runtime),
    lowerBoundCount: ordered.reduce((n, c) => n + c.lowerBound.filter(Boolean).length, 0),
    bankAh: percentiles(bank),
    requiredAh: plan.targetHours !== undefined ? percentiles(required) : null,
    requiredHistogram: plan.targetHours !== undefined ? histogram(required) : null,
    costPerYear: plan.cost ? percentiles(cost) : null,
    costHistogram: plan.cost ? histogram(cost) : null,
    sensitivity,
    sensitivityMethod: SENSITIVITY_METHOD,
    costSensitivity: plan.cost ? costRanking(sensitivity) : null,
    costSensitivityMethod: COST_SENSITIVITY_METHOD,
    failed: failures.length,
    failures: failures.slice(0, 10),
  };
}

/** The whole spread in one call (the command line, tests). */
export function runSpread(solved: Solved, opts: SpreadOptions = {}): Outcome<SpreadResult> {
  const plan = spreadPlan(solved, opts);
  if (!plan.ok) return plan;
  const chunk = spreadRun(solved, plan.value, { from: 0, count: plan.value.samples });
  return { ok: true, value: spreadSummary(plan.value, [chunk], spreadSensitivity(solved, plan.value)) };
}
