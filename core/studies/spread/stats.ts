/**
 * Summaries of a sample: percentiles and a histogram. Pure.
 */

/** P10, P50, P90 of the finite values; null when there are none. */
export interface Percentiles {
  p10: number;
  p50: number;
  p90: number;
  min: number;
  max: number;
  /** Values summarised (finite ones). */
  count: number;
}

/**
 * The p-quantile of sorted values by linear interpolation between order statistics, h = (n − 1)·p
 * (Hyndman & Fan 1996, definition 7: the default of R and NumPy).
 */
export function quantileSorted(sorted: readonly number[], p: number): number {
  const n = sorted.length;
  if (n === 1) return sorted[0]!;
  const h = (n - 1) * p;
  const lo = Math.floor(h);
  const hi = Math.min(lo + 1, n - 1);
  return sorted[lo]! + (h - lo) * (sorted[hi]! - sorted[lo]!);
}

export function percentiles(values: readonly number[]): Percentiles | null {
  const sorted = values.filter((v) => Number.isFinite(v)).sort((a, b) => a - b);
  if (sorted.length === 0) return null;
  return {
    p10: quantileSorted(sorted, 0.1),
    p50: quantileSorted(sorted, 0.5),
    p90: quantileSorted(sorted, 0.9),
    min: sorted[0]!,
    max: sorted[sorted.length - 1]!,
    count: sorted.length,
  };
}

export interface HistogramBin {
  /** Lower and upper edge (the last bin includes its upper edge). */
  from: number;
  to: number;
  count: number;
}

/**
 * Equal-width bins over [min, max]; their number by the Rice rule, ⌈2·n^(1/3)⌉, between 5 and 40
 * (one bin when every value is the same).
 */
export function histogram(values: readonly number[]): HistogramBin[] {
  const v = values.filter((x) => Number.isFinite(x));
  if (v.length === 0) return [];
  let min = Infinity;
  let max = -Infinity;
  for (const x of v) {
    if (x < min) min = x;
    if (x > max) max = x;
  }
  if (!(max > min)) return [{ from: min, to: max, count: v.length }];
  const bins = Math.min(40, Math.max(5, Math.ceil(2 * Math.cbrt(v.length))));
  const width = (max - min) / bins;
  const out: HistogramBin[] = Array.from({ length: bins }, (_, i) => ({ from: min + i * width, to: i === bins - 1 ? max : min + (i + 1) * width, count: 0 }));
  for (const x of v) out[Math.min(bins - 1, Math.floor((x - min) / width))]!.count++;
  return out;
}
