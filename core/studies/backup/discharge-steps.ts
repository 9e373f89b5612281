/**
 * The discharge's time loop (the method is stated in discharge-run.ts): explicit integration, the
 * chain solved at each step with the bank at its open-circuit voltage behind its internal
 * resistance, the current held over the step, Peukert-equivalent charge in its rated-capacity form,
 * the depth-of-discharge limit found exactly inside a step and the cut-off voltage by linear
 * interpolation of the terminal voltage over the last step.
 *
 * A module-level function of its own, so that the engine optimises it apart from the result's
 * assembly, which runs once per study. Per step it allocates nothing but the series' growth: the
 * accumulators are two Float64Arrays whose roles swap (now, and before the last step to undo it at the
 * cut-off), the
 * operating points two StepPoint objects the solver writes in place (`RepeatSolver.solveInto`), and
 * the open-circuit voltage of the end of a step is kept as the next step's start (same state of
 * charge, so the same number). Every figure is the same arithmetic, in the same order, as the loop
 * it replaces; the solver is called with the same arguments in the same order (its warm start
 * depends on that order).
 */
import type { Bank } from '../../physics/bank.ts';
import { emptyPoint, type RepeatSolver, type StepPoint } from '../../solve/repeat.ts';
import type { Interval } from '../../solve/load-profile.ts';
import type { DischargeSeries, EndReason } from './discharge-types.ts';

/** Indices of the accumulators (A·s, J, s, V, A) in a Float64Array of ACC_SIZE. */
export const T = 0;
export const SOC = 1;
export const CHARGE = 2;
export const EQUIVALENT = 3;
export const TERMINAL = 4;
export const DRAWN = 5;
export const LOAD = 6;
export const CHAIN = 7;
export const INTERNAL = 8;
export const PEAK = 9;
export const MIN_V = 10;
const ACC_SIZE = 11;
/** The most samples a series is presized for (beyond it, it grows as it fills). */
const MAX_PRESIZE = 1 << 16;

export interface StepsInput {
  solver: RepeatSolver;
  bank: Bank;
  intervals: readonly Interval[];
  /** The solver's state of each of the timeline's load states. */
  stateIds: readonly number[];
  /** Time step, s. */
  step: number;
  /** Internal resistance of the bank, Ω. */
  resistance: number;
  /** Cut-off voltage of the bank, V. */
  cutoff: number;
  /** Capacity available, A·s. */
  availableAs: number;
  /** Peukert exponent. */
  k: number;
  /** Rated current (C/H), A. */
  iRated: number;
  /** State of charge where the discharge stops (0 when no depth-of-discharge limit applies). */
  socLimit: number;
  dodApplies: boolean;
  /** False: the series keeps only time and terminal power. */
  plotSeries: boolean;
  /** The end when nothing else ends the run first ('profile-complete' or 'horizon'). */
  noEnd: EndReason;
}

export type StepsOutcome =
  | { ok: true; acc: Float64Array; endReason: EndReason; series: DischargeSeries }
  /** The chain cannot be carried at the start of the outage: why, in words. */
  | { ok: false; why: string };

/**
 * The accumulators `from` advanced by dt at the operating point p with the bank at open-circuit
 * voltage emf, written into `to` (every entry); `rate` is the Peukert-equivalent charge rate at p's
 * current. `from` stays as it was: the accumulators before the step, kept without a copy.
 */
function advance(to: Float64Array, from: Float64Array, p: StepPoint, emf: number, dt: number, rate: number, availableAs: number): void {
  const i = p.current;
  to[T] = from[T]! + dt;
  to[SOC] = from[SOC]! - (rate * dt) / availableAs;
  to[CHARGE] = from[CHARGE]! + i * dt;
  to[EQUIVALENT] = from[EQUIVALENT]! + rate * dt;
  to[TERMINAL] = from[TERMINAL]! + p.terminalPower * dt;
  to[DRAWN] = from[DRAWN]! + emf * i * dt;
  to[LOAD] = from[LOAD]! + p.loadPower * dt;
  to[CHAIN] = from[CHAIN]! + p.chainLoss * dt;
  to[INTERNAL] = from[INTERNAL]! + p.internalLoss * dt;
  to[PEAK] = Math.max(from[PEAK]!, i);
  to[MIN_V] = Math.min(from[MIN_V]!, p.voltage);
}

/** Run the time loop over the timeline's intervals. */
export function integrateSteps(input: StepsInput): StepsOutcome {
  const { solver, bank, intervals, stateIds, step, resistance: R, cutoff, availableAs, k, iRated, socLimit } = input;
  // The series presized from the step count (each interval's steps, plus one sample at each load
  // change): written by index and cut to the samples written at the end, so they do not grow by
  // copies as they fill (a longer run than the estimate just extends them).
  let expected = 0;
  for (let n = 0; n < intervals.length; n++) expected += Math.ceil((intervals[n]!.end - intervals[n]!.start) / step) + 1;
  if (!(expected <= MAX_PRESIZE)) expected = MAX_PRESIZE;
  const plot = input.plotSeries;
  const time: number[] = new Array(expected);
  const power: number[] = new Array(expected);
  const socs: number[] = plot ? new Array(expected) : [];
  const voltage: number[] = plot ? new Array(expected) : [];
  const current: number[] = plot ? new Array(expected) : [];
  let samples = 0;
  const record = (t: number, soc: number, v: number, i: number, pw: number): void => {
    time[samples] = t;
    power[samples] = pw;
    if (plot) {
      socs[samples] = soc;
      voltage[samples] = v;
      current[samples] = i;
    }
    samples++;
  };
  const dropLastSample = (): void => {
    samples--;
  };
  // Open-circuit voltage of the bank: the OCV curve's linear interpolation, held at its ends, the
  // same arithmetic as ocvAt (core/physics/bank.ts) — the first point at or above the state of
  // charge closes the segment — found from the last segment used (the state of charge only falls).
  const curve = bank.values.ocvCurve;
  const nCurve = curve.length;
  const curveSoc = new Float64Array(nCurve);
  const curveV = new Float64Array(nCurve);
  for (let j = 0; j < nCurve; j++) {
    curveSoc[j] = curve[j]!.soc;
    curveV[j] = curve[j]!.voltage;
  }
  const cells = bank.cellsInSeries;
  let segment = nCurve - 1;
  const ocv = (soc: number): number => {
    const s = soc < 0 ? 0 : soc > 1 ? 1 : soc;
    if (s <= curveSoc[0]!) return curveV[0]! * cells;
    let i = segment;
    while (i > 1 && s <= curveSoc[i - 1]!) i--;
    while (i < nCurve && !(s <= curveSoc[i]!)) i++;
    if (i === nCurve) return curveV[nCurve - 1]! * cells;
    segment = i;
    const aSoc = curveSoc[i - 1]!;
    const aV = curveV[i - 1]!;
    return (aV + ((curveV[i]! - aV) * (s - aSoc)) / (curveSoc[i]! - aSoc)) * cells;
  };
  // Peukert-equivalent charge rate (rated-capacity form of Peukert's law, see discharge-run.ts).
  const rateOf = (i: number): number => i * (i > iRated ? Math.pow(i / iRated, k - 1) : 1);

  // The accumulators now and before the last step (to undo it at the cut-off): two arrays whose
  // roles swap at each step.
  let acc = new Float64Array(ACC_SIZE);
  acc[SOC] = bank.initialSoc;
  acc[MIN_V] = Infinity;
  let before = new Float64Array(ACC_SIZE);
  // Two operating points written in place: the step's start (`p`) and the end of the step (the other).
  const points = [emptyPoint(), emptyPoint()] as const;
  let endReason: EndReason = input.noEnd;
  // The last step (its point, bank voltage and length; the accumulators before it are `before`).
  let lastP: StepPoint | null = null;
  let lastEmf = 0;
  let lastDt = 0;
  // The point solved at the end of the previous step (same load state): the next step starts there.
  let carried = -1;
  let carriedState = -1;
  // Open-circuit voltage at the present state of charge (kept from the end of the last step).
  let emf = ocv(acc[SOC]!);
  outer: for (let n = 0; n < intervals.length; n++) {
    const interval = intervals[n]!;
    const state = stateIds[interval.state]!;
    // Slack against a sliver step from rounding, relative to the interval or the step, whichever is
    // shorter (a step longer than the whole outage must not swallow it).
    const slack = 1e-9 * Math.min(step, interval.end - interval.start);
    while (acc[T]! < interval.end - slack) {
      const reuse = carried >= 0 && carriedState === state;
      const at = reuse ? carried : carried === 0 ? 1 : 0;
      const p = points[at];
      if (!reuse && !solver.solveInto(state, emf, R, p)) {
        if (acc[T] === 0) return { ok: false, why: 'the chain cannot be carried at the start of the outage: the bank voltage would collapse' };
        endReason = 'chain-collapse';
        break outer;
      }
      if (p.voltage < cutoff) {
        if (acc[T] === 0) {
          return { ok: false, why: `the terminal voltage under the starting load, ${p.voltage.toFixed(2)} V, is already below the cut-off ${cutoff.toFixed(2)} V` };
        }
        if (reuse && lastP && lastP.voltage > p.voltage) {
          // Linear interpolation of the terminal voltage over the last step (same load throughout).
          const f = (lastP.voltage - cutoff) / (lastP.voltage - p.voltage);
          advance(acc, before, lastP, lastEmf, lastDt * f, rateOf(lastP.current), availableAs);
          dropLastSample();
          record(acc[T]!, acc[SOC]!, cutoff, lastP.current, lastP.terminalPower);
          acc[MIN_V] = Math.min(acc[MIN_V]!, cutoff);
        } else {
          // The load stepped up at this instant and the voltage fell below the cut-off at once.
          record(acc[T]!, acc[SOC]!, p.voltage, p.current, p.terminalPower);
          acc[MIN_V] = Math.min(acc[MIN_V]!, p.voltage);
        }
        endReason = 'cut-off-voltage';
        break outer;
      }
      if (!reuse) record(acc[T]!, acc[SOC]!, p.voltage, p.current, p.terminalPower);
      let dt = Math.min(step, interval.end - acc[T]!);
      // Depth-of-discharge limit inside the step: the current is held, so SoC falls linearly.
      const rate = rateOf(p.current);
      const toLimit = rate > 0 ? ((acc[SOC]! - socLimit) * availableAs) / rate : Infinity;
      const hitsLimit = toLimit <= dt;
      if (hitsLimit) dt = Math.max(0, toLimit);
      const now = before;
      before = acc;
      acc = now;
      advance(acc, before, p, emf, dt, rate, availableAs);
      if (hitsLimit) acc[SOC] = socLimit;
      lastP = p;
      lastEmf = emf;
      lastDt = dt;
      // The point at the end of the step (same load, new state of charge): plotted, and the next step's start.
      emf = ocv(acc[SOC]!);
      const next = at === 0 ? 1 : 0;
      const after = points[next];
      const solved = solver.solveInto(state, emf, R, after);
      carried = solved ? next : -1;
      carriedState = state;
      const q = solved ? after : p;
      record(acc[T]!, acc[SOC]!, q.voltage, q.current, q.terminalPower);
      if (hitsLimit) {
        endReason = input.dodApplies ? 'depth-of-discharge' : 'rated-capacity';
        break outer;
      }
    }
  }
  time.length = samples;
  power.length = samples;
  if (plot) {
    socs.length = samples;
    voltage.length = samples;
    current.length = samples;
  }
  return { ok: true, acc, endReason, series: { time, soc: socs, voltage, current, power } };
}
