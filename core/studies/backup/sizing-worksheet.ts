/**
 * Bank sizing, part 5 of 7: the worksheet arithmetic — the sections F_S of the IEEE 485 / IEEE 1115
 * duty-cycle worksheet, the largest sum inside a section's last period, and the depth-of-discharge
 * capacity of a cycling design (the method is described at the top of sizing.ts).
 */
import type { CurrentPeriod, WorksheetRow, WorksheetSection } from './sizing-types.ts';

/**
 * Upper bound of the worksheet sum over period s (0-based) for τ in [minTime, M_s]: K_t rises with
 * time, so F(τ) ≤ Σ_{ΔA>0} ΔA·K(d_P + M_s) + Σ_{ΔA<0} ΔA·K(d_P + minTime) (d_P as in interiorPeak).
 */
export function interiorBound(periods: readonly CurrentPeriod[], s: number, kAt: (timeS: number) => number, minTime: number): number {
  const m = periods[s]!.duration;
  const lo = Math.max(0, minTime);
  if (!(lo < m)) return -Infinity;
  let bound = 0;
  let d = 0;
  for (let p = s; p >= 0; p--) {
    if (p < s) d += periods[p]!.duration;
    const cp = periods[p]!.current - (p > 0 ? periods[p - 1]!.current : 0);
    if (cp > 0) bound += cp * kAt(d + m);
    else if (cp < 0) bound += cp * kAt(d + lo);
  }
  return bound;
}

/** Samples of the worksheet sum inside a period before the best one is refined. */
const PEAK_SAMPLES = 32;

/**
 * The largest worksheet sum inside period s (0-based), F(τ) = Σ_{P≤s} (A_P − A_{P−1})·K_t(d_P + τ)
 * for τ in [minTime, M_s] (d_P the time from the start of period P to the start of period s), when
 * it exceeds `floor`; null otherwise.
 * Method: a bound first — K_t rises with time, so F(τ) ≤ Σ_{ΔA>0} ΔA·K(d + M_s) + Σ_{ΔA<0} ΔA·K(d)
 * over the whole period, and a period whose bound does not pass `floor` is skipped. Otherwise F is
 * sampled at PEAK_SAMPLES points (half spaced geometrically from the start, where the newest
 * term's K_t is steepest, half evenly) and the best sample refined by golden-section search
 * between its neighbours to 1e-10 of the period (F is flat at a maximum, so its value is then
 * exact to rounding).
 */
export function interiorPeak(
  periods: readonly CurrentPeriod[],
  s: number,
  kAt: (timeS: number) => number,
  floor: number,
  minTime: number,
): { time: number; size: number } | null {
  const m = periods[s]!.duration;
  const lo = Math.max(0, minTime);
  if (!(lo < m)) return null;
  const n = s + 1;
  const d = new Float64Array(n);
  const c = new Float64Array(n);
  for (let p = s; p >= 0; p--) {
    d[p] = p === s ? 0 : d[p + 1]! + periods[p]!.duration;
    c[p] = periods[p]!.current - (p > 0 ? periods[p - 1]!.current : 0);
  }
  let bound = 0;
  for (let p = 0; p < n; p++) {
    const cp = c[p]!;
    if (cp > 0) bound += cp * kAt(d[p]! + m);
    else if (cp < 0) bound += cp * kAt(d[p]! + lo);
  }
  if (!(bound > floor)) return null;
  const f = (tau: number) => {
    let sum = 0;
    for (let p = 0; p < n; p++) if (c[p] !== 0) sum += c[p]! * kAt(d[p]! + tau);
    return sum;
  };
  const taus: number[] = [];
  const half = PEAK_SAMPLES / 2;
  const first = lo > 0 ? lo : m * 1e-6;
  for (let i = 0; i < half; i++) taus.push(first * Math.pow(m / first, i / half));
  for (let i = 0; i <= half; i++) taus.push(lo + ((m - lo) * i) / half);
  taus.sort((x, y) => x - y);
  let bi = 0;
  let bv = -Infinity;
  const values = taus.map((t) => f(t));
  values.forEach((v, i) => {
    if (v > bv) {
      bv = v;
      bi = i;
    }
  });
  let best = { time: taus[bi]!, size: bv };
  if (bi > 0 && bi < taus.length - 1) {
    // Golden-section search for the maximum between the best sample's neighbours.
    const g = (Math.sqrt(5) - 1) / 2;
    let x0 = taus[bi - 1]!;
    let x3 = taus[bi + 1]!;
    let x1 = x3 - g * (x3 - x0);
    let x2 = x0 + g * (x3 - x0);
    let f1 = f(x1);
    let f2 = f(x2);
    while (x3 - x0 > 1e-10 * m) {
      if (f1 >= f2) {
        x3 = x2;
        x2 = x1;
        f2 = f1;
        x1 = x3 - g * (x3 - x0);
        f1 = f(x1);
      } else {
        x0 = x1;
        x1 = x2;
        f1 = f2;
        x2 = x0 + g * (x3 - x0);
        f2 = f(x2);
      }
    }
    if (f1 > best.size) best = { time: x1, size: f1 };
    if (f2 > best.size) best = { time: x2, size: f2 };
  }
  const end = f(m);
  if (end >= best.size) return null; // the period's end governs (it is the worksheet's F_S)
  return best.size > floor * (1 + 1e-12) && Number.isFinite(best.size) ? best : null;
}

/**
 * The worksheet sections S = 1…n: F_S = Σ_{P≤S} (A_P − A_{P−1})·K_t(t_P), t_P = Σ_{j=P..S} M_j.
 * O(n²) rows in all; with `keepRows` each row is kept so the user can check it.
 */
export function worksheetSections(
  periods: readonly CurrentPeriod[],
  kAt: (timeS: number) => number,
  keepRows = true,
): WorksheetSection[] {
  if (!keepRows) return sectionTotals(periods, kAt);
  // K_t depends on the time only; a profile of equal steps repeats the same times in every section.
  const k = memoByTime(kAt);
  const sections: WorksheetSection[] = [];
  for (let s = 0; s < periods.length; s++) sections.push(worksheetSection(periods, s, k, true));
  return sections;
}

/** Above this many durations off the common step, section totals fall back to a plain memo. */
const MAX_ODD_PERIODS = 16;

/**
 * Section totals without rows, for long sampled profiles (hundreds to thousands of periods).
 * Each duration is written as c·q + r with q the most common duration (c whole, r = 0 for the
 * steps of a sampled profile and their merges); a time to the end of a section is then C·q + R,
 * and K_t is looked up by the whole count C in one array per distinct R (R changes only at the
 * few "odd" periods, such as a run's partial last step). Same sums as the row-by-row worksheet,
 * to rounding of the times (C·q + R instead of a running sum).
 */
function sectionTotals(periods: readonly CurrentPeriod[], kAt: (timeS: number) => number): WorksheetSection[] {
  const n = periods.length;
  const seen = new Map<number, number>();
  let q = 0;
  let best = 0;
  for (const p of periods) {
    const c = (seen.get(p.duration) ?? 0) + 1;
    seen.set(p.duration, c);
    if (c > best) {
      best = c;
      q = p.duration;
    }
  }
  const whole = new Float64Array(n);
  const rest = new Float64Array(n);
  let odd = 0;
  let totalCount = 0;
  for (let i = 0; i < n; i++) {
    const d = periods[i]!.duration;
    const m = Math.round(d / q);
    if (m >= 1 && Math.abs(d - m * q) <= 1e-9 * d) {
      whole[i] = m;
    } else {
      whole[i] = Math.floor(d / q);
      rest[i] = d - whole[i]! * q;
      odd++;
    }
    totalCount += whole[i]!;
  }
  const change = periods.map((p, i) => p.current - (i > 0 ? periods[i - 1]!.current : 0));
  let lookup: (C: number, R: number, Rkey: Float64Array) => number;
  if (odd <= MAX_ODD_PERIODS && totalCount <= 50_000_000) {
    const tables = new Map<number, Float64Array>();
    lookup = (C, R, tab) => {
      let v = tab[C]!;
      if (v !== v) {
        v = kAt(C * q + R);
        tab[C] = v;
      }
      return v;
    };
    const tableFor = (R: number) => {
      let t = tables.get(R);
      if (t === undefined) {
        t = new Float64Array(totalCount + 1).fill(Number.NaN);
        tables.set(R, t);
      }
      return t;
    };
    const base = tableFor(0);
    const sections: WorksheetSection[] = [];
    for (let s = 0; s < n; s++) {
      let C = 0;
      let R = 0;
      let tab = base;
      let positive = 0;
      let negative = 0;
      for (let p = s; p >= 0; p--) {
        C += whole[p]!;
        if (rest[p] !== 0) {
          R += rest[p]!;
          tab = tableFor(R);
        }
        const size = change[p]! * lookup(C, R, tab);
        if (size >= 0) positive += size;
        else negative += size;
      }
      sections.push(totalsSection(periods, s, positive, negative));
    }
    return sections;
  }
  // Many irregular durations: a plain memo by time.
  const k = memoByTime(kAt);
  const sections: WorksheetSection[] = [];
  for (let s = 0; s < n; s++) sections.push(worksheetSection(periods, s, k, false));
  return sections;
}

function totalsSection(periods: readonly CurrentPeriod[], s: number, positive: number, negative: number): WorksheetSection {
  const next = periods[s + 1];
  return {
    section: s + 1,
    rows: [],
    positive,
    negative,
    total: positive + negative,
    needed: next === undefined || next.current <= periods[s]!.current,
  };
}

/** Section s + 1 of the worksheet (periods 1…s + 1). */
export function worksheetSection(
  periods: readonly CurrentPeriod[],
  s: number,
  kAt: (timeS: number) => number,
  keepRows: boolean,
): WorksheetSection {
  const rows: WorksheetRow[] = [];
  let positive = 0;
  let negative = 0;
  // Time from the start of period p to the end of the section, accumulated backwards from s.
  let timeToEnd = 0;
  for (let p = s; p >= 0; p--) {
    const duration = periods[p]!.duration;
    timeToEnd += duration;
    const current = periods[p]!.current;
    const change = current - (p > 0 ? periods[p - 1]!.current : 0);
    const capacityFactor = kAt(timeToEnd);
    const size = change * capacityFactor;
    if (size >= 0) positive += size;
    else negative += size;
    if (keepRows) rows.push({ period: p + 1, current, change, duration, timeToEnd, capacityFactor, size });
  }
  rows.reverse();
  const next = periods[s + 1];
  return {
    section: s + 1,
    rows,
    positive,
    negative,
    total: positive + negative,
    needed: next === undefined || next.current <= periods[s]!.current,
  };
}

/**
 * Smallest rated capacity C (Ah) whose usable part DoD·C covers the Peukert-equivalent charge of
 * the duty cycle, counted as the runtime study counts it (rated-capacity form of Peukert's law):
 *   Q(C) = Σ I·max(1, I/I_rated)^(k−1)·t,  I_rated = C/H   (t in h),
 * i.e. the root of DoD·C = Q(C). Q never rises with C, so the root is unique: C = Ah/DoD when every
 * current is at or below the rated current of that size; otherwise bisection between Ah/DoD and
 * H·I_max (where the max() no longer bites), to 1e-12 relative. When every current exceeds I_rated
 * the root has the closed form C = (H^(k−1)·Σ I^k·t / DoD)^(1/k).
 */
export function depthOfDischargeCapacity(
  periods: readonly CurrentPeriod[],
  ratedHours: number,
  k: number,
  dod: number,
): number {
  const q = (c: number) => {
    let sum = 0;
    for (const p of periods) {
      const ratio = (p.current * ratedHours) / c;
      sum += p.current * (ratio > 1 ? Math.pow(ratio, k - 1) : 1) * (p.duration / 3600);
    }
    return sum;
  };
  const ah = periods.reduce((a, p) => a + (p.current * p.duration) / 3600, 0);
  let lo = ah / dod;
  const iMax = Math.max(...periods.map((p) => p.current));
  if (lo >= ratedHours * iMax || k === 1) return lo;
  let hi = Math.max(lo, q(lo) / dod);
  // DoD·C − Q(C) rises with C: negative at lo (unless lo is the root), ≥ 0 at hi since Q(hi) ≤ Q(lo).
  for (let i = 0; i < 200 && hi - lo > 1e-12 * hi; i++) {
    const mid = 0.5 * (lo + hi);
    if (dod * mid >= q(mid)) hi = mid;
    else lo = mid;
  }
  return hi;
}

/** K_t by time, each time worked out once (a worksheet asks for the same times again and again). */
function memoByTime(kAt: (timeS: number) => number): (timeS: number) => number {
  const memo = new Map<number, number>();
  return (t) => {
    let v = memo.get(t);
    if (v === undefined) {
      v = kAt(t);
      memo.set(t, v);
    }
    return v;
  };
}
