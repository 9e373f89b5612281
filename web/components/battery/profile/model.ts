/**
 * The profile editor's pure part: the study's load profile seen as a day by the clock (a constant
 * profile is one segment from midnight), the edits the editor makes (segments added, removed, moved;
 * a load's level; duty cycles), the starting points in plain words, and hours of the day as typed
 * and shown. No engineering here: what a profile does to the loads is core's (core/solve/load-profile.ts).
 */
import type { DailySegment, DutySchedule, LoadProfile, LoadSetting } from '../../../../core/page.ts';
import { parseLocaleNumber } from '../../../format/parse.ts';

export type DailyProfile = Extract<LoadProfile, { kind: 'daily' }>;

/** Step of the strip's handles and of their arrow keys, h (a quarter hour). */
export const HOUR_STEP = 0.25;

/**
 * The profile as a day: a daily profile as it is, a constant one as one segment from midnight with
 * its duty cycles; a profile of periods from the outage's start (`segments`) has no day (null).
 */
export function asDaily(p: LoadProfile | undefined): DailyProfile | null {
  if (!p || p.kind === 'constant') return { kind: 'daily', startHour: 0, segments: [{ startHour: 0 }], ...(p?.duty?.length ? { duty: structuredClone(p.duty) } : {}) };
  if (p.kind === 'daily') return structuredClone(p);
  return null;
}

/** Where each segment ends on the clock: the next one's start, the last the first's a day later. */
export function segmentEnd(segments: readonly DailySegment[], i: number): number {
  return i + 1 < segments.length ? segments[i + 1]!.startHour : segments[0]!.startHour + 24;
}

/**
 * A segment added by splitting the longest one at its middle (on a whole hour when it is at least
 * two hours long, else a quarter hour), the new one starting there with the same levels.
 */
export function addSegment(p: DailyProfile): DailyProfile {
  const segs = p.segments;
  let longest = 0;
  segs.forEach((_, i) => {
    if (segmentEnd(segs, i) - segs[i]!.startHour > segmentEnd(segs, longest) - segs[longest]!.startHour + 1e-9) longest = i;
  });
  const from = segs[longest]!.startHour;
  const length = segmentEnd(segs, longest) - from;
  if (length < 2 * HOUR_STEP) return p;
  const step = length >= 2 ? 1 : HOUR_STEP;
  const at = (from + Math.round(length / 2 / step) * step) % 24;
  const added: DailySegment = { startHour: at, ...(segs[longest]!.loads ? { loads: structuredClone(segs[longest]!.loads) } : {}) };
  const segments = [...segs, added].sort((a, b) => a.startHour - b.startHour);
  return { ...p, segments };
}

/** The profile without segment i (the one before it runs on in its place); the last segment stays. */
export function removeSegment(p: DailyProfile, i: number): DailyProfile {
  if (p.segments.length <= 1) return p;
  return { ...p, segments: p.segments.filter((_, k) => k !== i) };
}

/** The start hours segment i may move between on the strip (keeping the order), h. */
export function handleRange(segments: readonly DailySegment[], i: number): [number, number] {
  const lo = i > 0 ? segments[i - 1]!.startHour + HOUR_STEP : 0;
  const hi = i + 1 < segments.length ? segments[i + 1]!.startHour - HOUR_STEP : 24 - HOUR_STEP;
  return [lo, Math.max(lo, hi)];
}

/** An hour snapped to the strip's step and kept in range. */
export function snapHour(hour: number, range: readonly [number, number]): number {
  const snapped = Math.round(hour / HOUR_STEP) * HOUR_STEP;
  return Math.min(range[1], Math.max(range[0], snapped));
}

export function withStartHour(p: DailyProfile, i: number, hour: number): DailyProfile {
  return { ...p, segments: p.segments.map((s, k) => (k === i ? { ...s, startHour: hour } : s)) };
}

/** The profile with one load's level in segment i (undefined: at its rating, the default). */
export function withLevel(p: DailyProfile, i: number, loadId: string, setting: LoadSetting | undefined): DailyProfile {
  return {
    ...p,
    segments: p.segments.map((s, k) => {
      if (k !== i) return s;
      const loads = { ...(s.loads ?? {}) };
      if (setting === undefined) delete loads[loadId];
      else loads[loadId] = setting;
      const { loads: _old, ...rest } = s;
      return Object.keys(loads).length ? { ...rest, loads } : rest;
    }),
  };
}

/** How a level is set: at the rating, off, in the load's own unit, or as a share of its rating. */
export type LevelMode = 'rated' | 'off' | 'value' | 'percent';

export function levelMode(s: LoadSetting | undefined): LevelMode {
  if (s === undefined || s === true) return 'rated';
  if (s === false) return 'off';
  return typeof s === 'number' ? 'value' : 'percent';
}

/** A level of the given mode: a value mode keeps the number it had, or starts at the rating (or 100 %). */
export function levelOfMode(mode: LevelMode, was: LoadSetting | undefined, rated: number): LoadSetting | undefined {
  if (mode === 'rated') return undefined;
  if (mode === 'off') return false;
  if (mode === 'value') return typeof was === 'number' ? was : typeof was === 'object' ? (rated * was.percent) / 100 : rated;
  return typeof was === 'object' ? was : typeof was === 'number' && rated > 0 ? { percent: Math.min(100, (was / rated) * 100) } : { percent: 100 };
}

export function withDuty(p: LoadProfile, duty: DutySchedule[]): LoadProfile {
  const { duty: _old, ...rest } = p;
  return (duty.length ? { ...rest, duty } : rest) as LoadProfile;
}

/** A duty cycle added for a load (the first without one), on 15 min in every 30 to begin with. */
export function addDuty(p: LoadProfile, loadIds: readonly string[]): LoadProfile {
  const taken = new Set((p.duty ?? []).map((d) => d.load));
  const load = loadIds.find((id) => !taken.has(id)) ?? loadIds[0];
  if (load === undefined) return p;
  return withDuty(p, [...(p.duty ?? []), { load, periodMinutes: 30, onMinutes: 15 }]);
}

// ---------- starting points ----------

/** Every load at its rating all day, no duty cycles (the outage's start hour kept). */
export function alwaysOn(p: LoadProfile | undefined): DailyProfile {
  return { kind: 'daily', startHour: p?.kind === 'daily' ? (p.startHour ?? 0) : 0, segments: [{ startHour: 0 }] };
}

/** Evening and night: a load on at its rating from 18:00 to 06:00 and off by day; the rest kept. */
export function eveningAndNight(p: LoadProfile | undefined, loadId: string): DailyProfile {
  const day = asDaily(p) ?? alwaysOn(p);
  return { ...day, segments: [{ startHour: 6, loads: { [loadId]: false } }, { startHour: 18, loads: { [loadId]: true } }] };
}

/** A compressor cycling: a load on 12 min in every 30 (a fridge's typical duty), the rest kept. */
export function compressorCycling(p: LoadProfile | undefined, loadId: string): LoadProfile {
  const base: LoadProfile = p && p.kind !== 'segments' ? p : (asDaily(p) ?? alwaysOn(p));
  const others = (base.duty ?? []).filter((d) => d.load !== loadId);
  return withDuty(base, [...others, { load: loadId, periodMinutes: 30, onMinutes: 12 }]);
}

// ---------- hours of the day ----------

/** An hour of the day as a clock shows it: 18.5 → "18:30". */
export function clockText(hour: number): string {
  const minutes = Math.round(hour * 60);
  const h = Math.floor(minutes / 60);
  const m = minutes - h * 60;
  return `${String(h).padStart(2, '0')}:${String(m).padStart(2, '0')}`;
}

/**
 * An hour of the day as typed: "18:30" (hours and minutes) or a number of hours in the user's number
 * format ("18", "18.5", "18,5"); a message saying what is wrong otherwise. The range is the engine's.
 */
export function readClock(text: string, locale: string | undefined): { ok: true; hour: number } | { ok: false; message: string } {
  const t = text.trim();
  if (t === '') return { ok: false, message: 'is required (an hour of the day, such as 18:00)' };
  const hm = /^(\d{1,2}):(\d{2})$/.exec(t);
  if (hm) {
    const minutes = Number(hm[2]);
    if (minutes >= 60) return { ok: false, message: `'${t}': minutes must be below 60` };
    return { ok: true, hour: Number(hm[1]) + minutes / 60 };
  }
  const n = parseLocaleNumber(t, locale);
  if (n.kind !== 'number') return { ok: false, message: `'${t}' is not an hour of the day (such as 18:00 or 18)` };
  return { ok: true, hour: n.value };
}
