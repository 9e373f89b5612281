/**
 * Bank sizing, part 3 of 7: the duty cycle's periods — fitted to a target runtime (repeated or cut),
 * equal neighbours joined, near neighbours joined at the higher current for a long profile.
 */
import type { CurrentPeriod } from './sizing-types.ts';

/**
 * Most periods a duty cycle may be repeated or cut into to fill the target runtime (the run of a
 * study holds at most about as many steps: core/solve/load-profile.ts, MAX_STEPS + MAX_LOAD_CHANGES).
 */
export const MAX_REPEATED_PERIODS = 1_100_000;

/** How many periods `fitToRuntime` would give: the cycle's periods × the repeats it takes (an upper bound). */
export function repeatedPeriods(periods: readonly { duration: number }[], target: number): number {
  const total = periods.reduce((s, p) => s + (Number.isFinite(p.duration) && p.duration > 0 ? p.duration : 0), 0);
  if (!(total > 0)) return 0;
  return periods.length * Math.ceil(target / total);
}

/**
 * The duty cycle over exactly `target` seconds: repeated from its start, or cut. A period kept whole
 * is the input's own object (a repeated one appears once per repeat); only the cut one is a copy, so
 * callers read the periods and never change them (mergeEqualPeriods and mergeNearPeriods copy).
 */
export function fitToRuntime<T extends { duration: number }>(periods: readonly T[], target: number): T[] {
  const out: T[] = [];
  forEachFitted(periods, target, (p, d) => out.push(d === p.duration ? p : { ...p, duration: d }));
  return out;
}

/**
 * Visits the periods `fitToRuntime` would give, in order, without building them: each period and the
 * duration it keeps there (its own, or the cut one's). Same loop, same arithmetic.
 */
export function forEachFitted<T extends { duration: number }>(periods: readonly T[], target: number, visit: (p: T, duration: number) => void): void {
  let left = target;
  const total = periods.reduce((s, p) => s + p.duration, 0);
  // Relative slack so a duty cycle that matches the target to rounding is not cut into a sliver.
  const eps = 1e-9 * target;
  while (left > eps && total > 0) {
    for (const p of periods) {
      if (left <= eps) break;
      const d = Math.min(p.duration, left);
      visit(p, d);
      left -= d;
    }
  }
}

/**
 * Joins neighbouring periods whose currents lie within `rel` of the joined period's current, at the
 * higher current: never lowers a current, so never lowers the worksheet size (each section grows
 * with every current, see the property tests), and overstates it by at most `rel`.
 */
export function mergeNearPeriods(periods: readonly CurrentPeriod[], rel: number): CurrentPeriod[] {
  const out: CurrentPeriod[] = [];
  for (const p of periods) {
    const last = out[out.length - 1];
    if (last !== undefined && Math.abs(last.current - p.current) <= rel * Math.max(last.current, p.current)) {
      last.duration += p.duration;
      last.current = Math.max(last.current, p.current);
    } else {
      out.push({ duration: p.duration, current: p.current });
    }
  }
  return out;
}

/**
 * Joins neighbouring periods of equal current: the worksheet result is unchanged (the joint adds a
 * row of zero change), and a profile sampled every minute shrinks to its real steps.
 */
export function mergeEqualPeriods(periods: readonly CurrentPeriod[]): CurrentPeriod[] {
  const out: CurrentPeriod[] = [];
  for (const p of periods) {
    const last = out[out.length - 1];
    if (last !== undefined && last.current === p.current) last.duration += p.duration;
    else out.push({ duration: p.duration, current: p.current });
  }
  return out;
}
