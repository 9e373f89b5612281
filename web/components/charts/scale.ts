/**
 * Axis arithmetic for the page's small SVG charts: "nice" tick steps, linear scales, a time axis in
 * hours, and thinning a long series to what a screen can show. Display only: no engineering here.
 */

/**
 * A "nice" number near `x` (1, 2, 5 × 10^n): Heckbert's nice-numbers method ("Nice numbers for
 * graph labels", Graphics Gems, 1990). `round` picks the nearest; otherwise the next at or above.
 */
export function niceNumber(x: number, round: boolean): number {
  if (!(x > 0) || !Number.isFinite(x)) return 1;
  const exp = Math.floor(Math.log10(x));
  const f = x / 10 ** exp;
  let nice: number;
  if (round) nice = f < 1.5 ? 1 : f < 3 ? 2 : f < 7 ? 5 : 10;
  else nice = f <= 1 ? 1 : f <= 2 ? 2 : f <= 5 ? 5 : 10;
  return nice * 10 ** exp;
}

export interface Ticks {
  /** Axis ends: the data range widened to whole steps. */
  min: number;
  max: number;
  step: number;
  ticks: number[];
}

/** Removes binary round-off from a tick (0.30000000000000004 → 0.3) at the step's precision. */
function clean(value: number, step: number): number {
  const decimals = Math.max(0, -Math.floor(Math.log10(step)) + 1);
  return Number(value.toFixed(Math.min(decimals, 12)));
}

/**
 * About `count` ticks covering [min, max] at a nice step (Heckbert's loose labelling). A flat
 * series (min = max) gets a range around its value so it draws as a line in the middle.
 */
export function niceTicks(min: number, max: number, count = 4): Ticks {
  let lo = Number.isFinite(min) ? min : 0;
  let hi = Number.isFinite(max) ? max : lo + 1;
  if (hi < lo) [lo, hi] = [hi, lo];
  if (hi - lo < 1e-12 * Math.max(1, Math.abs(hi))) {
    const pad = Math.abs(lo) > 0 ? Math.abs(lo) * 0.05 : 1;
    lo -= pad;
    hi += pad;
  }
  const range = niceNumber(hi - lo, false);
  const step = niceNumber(range / Math.max(1, count - 1), true);
  const axisMin = Math.floor(lo / step) * step;
  const axisMax = Math.ceil(hi / step) * step;
  const ticks: number[] = [];
  for (let v = axisMin; v <= axisMax + step * 1e-9; v += step) ticks.push(clean(v, step));
  return { min: clean(axisMin, step), max: clean(axisMax, step), step, ticks };
}

/** Steps a time axis uses, h: quarter hours up to a week, as a clock reads them. */
const HOUR_STEPS = [0.25, 0.5, 1, 2, 3, 4, 6, 12, 24, 48, 72, 168, 336, 720];

/**
 * Ticks for a time axis from 0 to `endSeconds`, in hours at a clock-like step (3 h, 6 h, 12 h…)
 * with at most `maxTicks` intervals. The axis ends at the last whole step at or past the end.
 */
export function timeTicksHours(endSeconds: number, maxTicks = 6): Ticks {
  const hours = Number.isFinite(endSeconds) && endSeconds > 0 ? endSeconds / 3600 : 1;
  const step = HOUR_STEPS.find((s) => hours / s <= maxTicks) ?? niceNumber(hours / maxTicks, false);
  const max = Math.ceil(hours / step - 1e-9) * step;
  const ticks: number[] = [];
  for (let v = 0; v <= max + step * 1e-9; v += step) ticks.push(clean(v, step));
  return { min: 0, max: clean(max, step), step, ticks };
}

/** A linear map from [d0, d1] to [r0, r1] (a zero-width domain maps to the middle). */
export function linearScale(d0: number, d1: number, r0: number, r1: number): (v: number) => number {
  const span = d1 - d0;
  if (span === 0) return () => (r0 + r1) / 2;
  const k = (r1 - r0) / span;
  return (v) => r0 + (v - d0) * k;
}

/**
 * Indices of the points to draw from a series of `n` points when at most `maxPoints` fit: the first
 * and last, and per bucket its lowest and highest value (so no peak or dip is lost), in time order.
 */
export function thinIndices(values: readonly number[], maxPoints: number): number[] {
  const n = values.length;
  if (n <= maxPoints || maxPoints < 4) return Array.from({ length: n }, (_, i) => i);
  const buckets = Math.floor((maxPoints - 2) / 2);
  const out: number[] = [0];
  const size = (n - 2) / buckets;
  for (let b = 0; b < buckets; b++) {
    const start = 1 + Math.floor(b * size);
    const end = Math.min(n - 1, 1 + Math.floor((b + 1) * size));
    let lo = start;
    let hi = start;
    for (let i = start; i < end; i++) {
      if (values[i]! < values[lo]!) lo = i;
      if (values[i]! > values[hi]!) hi = i;
    }
    if (lo === hi) out.push(lo);
    else out.push(Math.min(lo, hi), Math.max(lo, hi));
  }
  out.push(n - 1);
  return [...new Set(out)].sort((a, b) => a - b);
}

/** An SVG path through points ("M x y L x y …"), coordinates rounded to 0.1 px. */
export function linePath(xs: readonly number[], ys: readonly number[]): string {
  const r = (v: number) => Math.round(v * 10) / 10;
  let d = '';
  for (let i = 0; i < xs.length; i++) d += `${i === 0 ? 'M' : 'L'}${r(xs[i]!)} ${r(ys[i]!)}`;
  return d;
}

/**
 * Indices of a time series at every `stepSeconds` (the first sample at or after each multiple),
 * plus the last point: rows for a table that reads alongside the chart.
 */
export function sampleEvery(time: readonly number[], stepSeconds: number): number[] {
  const n = time.length;
  if (n === 0) return [];
  if (!(stepSeconds > 0)) return [0, n - 1].filter((v, i, a) => a.indexOf(v) === i);
  const out: number[] = [];
  let next = time[0]!;
  for (let i = 0; i < n; i++) {
    if (time[i]! >= next - 1e-9) {
      out.push(i);
      next = (Math.floor(time[i]! / stepSeconds + 1e-9) + 1) * stepSeconds;
    }
  }
  if (out[out.length - 1] !== n - 1) out.push(n - 1);
  return out;
}
