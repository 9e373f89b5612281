/**
 * The cost over the years, part 2: money over time (core/studies/lifetime.ts holds the entry).
 * - Lifetime cost: net present value of end-of-year costs, NPV = purchase + Σ_{t=1…N} C_t / (1 + r)^t
 *   (present-worth factor 1/(1 + r)^t; purchase at year 0, undiscounted).
 * - Simple payback: extra purchase ÷ mean yearly saving, undiscounted, in years.
 * - Break-even year: the first whole year at which the cumulative present value of the option that
 *   costs more to buy is no more than the other's.
 */

/** Present value of end-of-year costs: Σ_{t=1…N} C_t / (1 + r)^t (present-worth factor). A number is the same cost every year for `years`. */
export function presentValue(yearly: number | readonly number[], discountRate: number, years?: number): number {
  const n = typeof yearly === 'number' ? (years ?? 0) : yearly.length;
  let sum = 0;
  for (let t = 1; t <= n; t++) sum += (typeof yearly === 'number' ? yearly : yearly[t - 1]!) / (1 + discountRate) ** t;
  return sum;
}

/** Lifetime cost as net present value: NPV = purchase + Σ_{t=1…N} C_t / (1 + r)^t. */
export function netPresentValue(purchase: number, yearly: number | readonly number[], discountRate: number, years?: number): number {
  return purchase + presentValue(yearly, discountRate, years);
}

/** An option's costs: the purchase at year 0 and the cost of each year of service (year 1 first). */
export interface CostStream {
  purchase: number;
  yearly: readonly number[];
}

export interface BreakEven {
  /** Which option costs more to buy ('a', 'b'), or null when both cost the same. */
  dearerToBuy: 'a' | 'b' | null;
  /** Simple payback of the dearer option, years (extra purchase ÷ mean yearly saving); null without a saving. */
  simplePaybackYears: number | null;
  /** First whole year at which the dearer option's cumulative present value is no more than the other's; null when never within the years given. */
  breakEvenYear: number | null;
  /** Lifetime cost (NPV) of each option over the longer of the two streams. */
  npvA: number;
  npvB: number;
}

/**
 * Payback and break-even between two options given as cost streams (the variants of a project
 * give one each). Simple payback: Δpurchase / mean yearly saving, undiscounted. Break-even year:
 * cumulative present value, Σ purchase + C_t/(1 + r)^t year by year, the first year the dearer
 * option is no longer behind. Years past the end of a shorter stream cost 0.
 */
export function breakEven(a: CostStream, b: CostStream, discountRate: number): BreakEven {
  const n = Math.max(a.yearly.length, b.yearly.length);
  const at = (s: CostStream, t: number) => s.yearly[t - 1] ?? 0;
  const npvA = netPresentValue(a.purchase, Array.from({ length: n }, (_, i) => at(a, i + 1)), discountRate);
  const npvB = netPresentValue(b.purchase, Array.from({ length: n }, (_, i) => at(b, i + 1)), discountRate);
  const dearerToBuy = a.purchase > b.purchase ? 'a' : b.purchase > a.purchase ? 'b' : null;
  if (dearerToBuy === null) return { dearerToBuy, simplePaybackYears: null, breakEvenYear: null, npvA, npvB };
  const [dear, cheap] = dearerToBuy === 'a' ? [a, b] : [b, a];
  const extra = dear.purchase - cheap.purchase;
  let saved = 0;
  for (let t = 1; t <= n; t++) saved += at(cheap, t) - at(dear, t);
  const meanSaving = n > 0 ? saved / n : 0;
  const simplePaybackYears = meanSaving > 0 ? extra / meanSaving : null;
  let gap = extra; // present value by which the dearer option is behind
  let breakEvenYear: number | null = null;
  for (let t = 1; t <= n; t++) {
    gap -= (at(cheap, t) - at(dear, t)) / (1 + discountRate) ** t;
    // A gap within round-off of zero (1e-9 of the sums) counts as caught up.
    if (gap <= 1e-9 * Math.max(1, Math.abs(dear.purchase), Math.abs(cheap.purchase))) {
      breakEvenYear = t;
      break;
    }
  }
  return { dearerToBuy, simplePaybackYears, breakEvenYear, npvA, npvB };
}
