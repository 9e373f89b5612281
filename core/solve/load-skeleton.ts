/**
 * The load timeline's skeleton (core/solve/load-profile.ts, buildTimeline): the outage's cuts at every
 * segment boundary and duty switching instant, and which segment and duty schedules are on in each
 * interval — what the profile's timing alone decides, kept per timing (a runtime spread changes the
 * load levels sample by sample, not the timing).
 */
import type { BackupStudy, DutySchedule } from '../model/project.ts';
import { DEFAULT_HORIZON_H, MAX_LOAD_CHANGES, type Interval } from './load-profile.ts';

const HOUR = 3600;
const DAY = 24 * HOUR;

/** On-intervals of a duty schedule ([start, end), s) that meet [0, end). */
function dutyBreaks(d: DutySchedule, end: number, into: number[]): void {
  const period = d.periodMinutes * 60;
  const on = d.onMinutes * 60;
  const offset = (d.offsetMinutes ?? 0) * 60;
  // t = offset + k·period, not a running sum: a period below the resolution of t still ends the
  // loop (the count is bounded by checkStudy's MAX_LOAD_CHANGES, and here once more).
  for (let k = 0, t = offset; t < end && k <= MAX_LOAD_CHANGES; k++, t = offset + k * period) {
    into.push(t, t + on);
  }
}

function dutyOn(d: DutySchedule, t: number): boolean {
  const offset = (d.offsetMinutes ?? 0) * 60;
  if (t < offset) return false;
  const period = d.periodMinutes * 60;
  const into = (t - offset) % period;
  return into < d.onMinutes * 60;
}

/** Index of the last of the rising `starts` at or before t, −1 when t comes before them all (binary search). */
function lastAtOrBefore(starts: readonly number[], t: number): number {
  let lo = 0;
  let hi = starts.length;
  while (lo < hi) {
    const mid = (lo + hi) >> 1;
    if (starts[mid]! <= t) lo = mid + 1;
    else hi = mid;
  }
  return lo - 1;
}

/**
 * The part of a timeline that the profile's timing alone decides (see buildTimeline): the cuts of the
 * outage and, per raw interval [cuts[i], cuts[i + 1]), its pattern — the base segment in force and the
 * on/off of every duty schedule at the interval's midpoint. The load levels are not in it: a runtime
 * spread scales the levels sample by sample (core/studies/spread/sample.ts) while the timing stays, so
 * the skeleton is built once per timing and kept (Timing, a few kept at a time).
 */
export interface Skeleton {
  /** Rising instants, s, from 0; the last is the end. */
  cuts: number[];
  end: number;
  profileEnds: boolean;
  /** The pattern of each raw interval. */
  pattern: Int32Array;
  /** Per pattern, numbered in order of first appearance: base segment (−1: none) and each duty schedule on. */
  patterns: { segment: number; dutyOn: boolean[]; first: number }[];
  /** The last grouping of the patterns into states (their state numbers) and its joined intervals. */
  grouping?: Int32Array;
  intervals?: readonly Interval[];
}

/**
 * Everything of the settings the skeleton reads, as numbers: the horizon, the profile's kind, its
 * segments' timing (durations, or start hours of a day), repeat, the start hour, and each duty
 * schedule's period, on-time and offset. Compared number by number with the kept ones (no text built:
 * a spread looks its timing up once per sample).
 */
interface Timing {
  horizon: number;
  kind: BackupStudy['profile']['kind'];
  repeat: boolean;
  startHour: number;
  marks: number[];
  duty: number[];
}

function marksOf(p: BackupStudy['profile']): readonly { durationHours?: number; startHour?: number }[] {
  return p.kind === 'constant' ? [] : p.segments;
}

function timingOf(study: BackupStudy): Timing {
  const p = study.profile;
  const marks = marksOf(p).map((s) => (p.kind === 'segments' ? (s.durationHours ?? 0) : (s.startHour ?? 0)));
  const duty = (p.duty ?? []).flatMap((d) => [d.periodMinutes, d.onMinutes, d.offsetMinutes ?? 0]);
  return {
    horizon: study.horizonHours ?? DEFAULT_HORIZON_H,
    kind: p.kind,
    repeat: p.kind === 'segments' && p.repeat === true,
    startHour: p.kind === 'daily' ? (p.startHour ?? 0) : 0,
    marks,
    duty,
  };
}

function sameTiming(study: BackupStudy, t: Timing): boolean {
  const p = study.profile;
  if ((study.horizonHours ?? DEFAULT_HORIZON_H) !== t.horizon || p.kind !== t.kind) return false;
  if ((p.kind === 'segments' && p.repeat === true) !== t.repeat || (p.kind === 'daily' ? (p.startHour ?? 0) : 0) !== t.startHour) return false;
  const segments = marksOf(p);
  if (segments.length !== t.marks.length) return false;
  for (let i = 0; i < segments.length; i++) {
    const s = segments[i]!;
    if ((p.kind === 'segments' ? (s.durationHours ?? 0) : (s.startHour ?? 0)) !== t.marks[i]) return false;
  }
  const duty = p.duty ?? [];
  if (3 * duty.length !== t.duty.length) return false;
  for (let j = 0; j < duty.length; j++) {
    const d = duty[j]!;
    if (d.periodMinutes !== t.duty[3 * j] || d.onMinutes !== t.duty[3 * j + 1] || (d.offsetMinutes ?? 0) !== t.duty[3 * j + 2]) return false;
  }
  return true;
}

/** Skeletons kept with their timing (the oldest dropped past SKELETONS_KEPT: a spread meets two or three). */
const skeletons: { timing: Timing; skeleton: Skeleton }[] = [];
const SKELETONS_KEPT = 8;
/**
 * Larger skeletons are built per call and not kept, so the kept ones stay within some MB: a day of
 * 24 segments with a 30-minute duty schedule over a year is about 44 000 cuts; each pattern keeps one
 * on/off per duty schedule.
 */
const KEPT_CUTS_AT_MOST = 100_000;
const KEPT_PATTERNS_AT_MOST = 4_096;

export function skeletonFor(study: BackupStudy): Skeleton {
  const kept = skeletons.find((k) => sameTiming(study, k.timing));
  if (kept) return kept.skeleton;
  const built = buildSkeleton(study);
  if (built.cuts.length > KEPT_CUTS_AT_MOST || built.patterns.length > KEPT_PATTERNS_AT_MOST) return built;
  if (skeletons.length >= SKELETONS_KEPT) skeletons.shift();
  skeletons.push({ timing: timingOf(study), skeleton: built });
  return built;
}

/** The cuts and patterns (see Skeleton). Breakpoints: segment boundaries and every duty switching instant. */
function buildSkeleton(study: BackupStudy): Skeleton {
  const horizon = (study.horizonHours ?? DEFAULT_HORIZON_H) * HOUR;
  const p = study.profile;
  const breaks: number[] = [0];
  let end = horizon;
  let profileEnds = false;
  // segmentAt(t): the index of the base profile's segment in force at time t (−1: a constant profile).
  let segmentAt: (t: number) => number;
  if (p.kind === 'constant') {
    segmentAt = () => -1;
  } else if (p.kind === 'segments') {
    const starts: number[] = [];
    let total = 0;
    for (const s of p.segments) {
      starts.push(total);
      total += s.durationHours * HOUR;
    }
    if (!p.repeat && total < horizon) {
      end = total;
      profileEnds = true;
    }
    for (let cycle = 0; cycle * total < end && breaks.length <= MAX_LOAD_CHANGES * 2; cycle++) for (const s of starts) breaks.push(cycle * total + s);
    segmentAt = (t) => Math.max(lastAtOrBefore(starts, t % total), 0);
  } else {
    const offset = (p.startHour ?? 0) * HOUR;
    const starts = p.segments.map((s) => s.startHour * HOUR);
    for (let day = -1; day * DAY < end + offset; day++) for (const s of starts) breaks.push(day * DAY + s - offset);
    segmentAt = (t) => {
      // The segment in force is the last one starting at or before the time of day; before the first start, the last of the day.
      const i = lastAtOrBefore(starts, (t + offset) % DAY);
      return i < 0 ? starts.length - 1 : i;
    };
  }
  const duty = p.duty ?? [];
  for (const d of duty) dutyBreaks(d, end, breaks);
  const cuts = [...new Set(breaks.filter((t) => t >= 0 && t < end))].sort((a, b) => a - b);
  cuts.push(end);
  const pattern = new Int32Array(Math.max(cuts.length - 1, 0));
  const patterns: Skeleton['patterns'] = [];
  const keys = new Map<string, number>();
  for (let i = 0; i + 1 < cuts.length; i++) {
    const mid = (cuts[i]! + cuts[i + 1]!) / 2;
    const segment = segmentAt(mid);
    const on = duty.map((d) => dutyOn(d, mid));
    const key = `${segment}:${on.map((x) => (x ? 1 : 0)).join('')}`;
    let k = keys.get(key);
    if (k === undefined) {
      k = patterns.length;
      patterns.push({ segment, dutyOn: on, first: i });
      keys.set(key, k);
    }
    pattern[i] = k;
  }
  return { cuts, end, profileEnds, pattern, patterns };
}

