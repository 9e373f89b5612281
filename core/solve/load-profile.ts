/**
 * Load profiles of the backup study: the checks of the project's `backup` settings that need the
 * project (load ids: the loads a profile sets are the kinds with the `load` trait), and the timeline — the outage cut into intervals over which
 * every load's power is constant (profile segments and duty switching split it exactly, so the
 * energy of a load is Σ on-time × power with no rounding to the time step).
 */
import type { BackupStudy, Element, LoadSetting, Project } from '../model/project.ts';
import type { Problem } from '../model/errors.ts';
import { PROJECT_LEVEL } from '../model/errors.ts';
import { q, say } from '../model/message.ts';
import { RESERVED_IDS } from './structure.ts';
import { kindSpec } from '../kinds/index.ts';
import { skeletonFor } from './load-skeleton.ts';

// The schema of the `backup` settings lives in backup-schema.ts (re-exported here for its readers).
export { MAX_HORIZON_H, backupSchema, profileSchema } from './backup-schema.ts';

export const DEFAULT_TIME_STEP_S = 60;
export const DEFAULT_HORIZON_H = 168;
/**
 * Most integration steps one study may take at its time step (horizon ÷ step): keeps a run and its
 * time series bounded (a year at 1-minute steps is 527 040; a week at 1-second steps 604 800).
 */
export const MAX_STEPS = 1_000_000;
/**
 * Most load changes one study's timeline may hold: segment boundaries and duty switching instants
 * over the horizon (each ends a step early, so a run takes at most MAX_STEPS + MAX_LOAD_CHANGES
 * steps). A daily profile of 24 segments over a year is 8 808; a compressor on a 10-minute duty
 * cycle for a week 2 016.
 */
export const MAX_LOAD_CHANGES = 100_000;
/**
 * Most element solves one study may spend when every step must sweep the whole chain (a current
 * load or a converter of a kind the fast path cannot hold right next to the bank:
 * core/solve/repeat.ts): steps × elements. About 0.5 µs each on a 2-core laptop, so the bound keeps
 * such a run to a few seconds; the fast path re-solves only the cables and buses next to the bank
 * and is bounded by MAX_STEPS alone.
 */
export const MAX_WHOLE_CHAIN_WORK = 20_000_000;
/**
 * Most distinct combinations of load levels (load states) one study may meet: each is one solve of
 * the whole chain before the run, and its levels are kept for the run. A day of 24 segments with
 * three loads cycling on their own duty schedules meets at most 24 × 2³ = 192.
 */
export const MAX_LOAD_STATES = 1_000;

/** The rated field of a load a profile can set (its kind's `load` trait), or undefined for any other element. */
const loadField = (e: Element) => kindSpec(e.kind)?.load?.field;

/**
 * A load of the project and its rated value: W; VA for an apparent-power load; A for a load given by
 * its current (a profile's number for it is a current too: the load stays constant-current).
 */
export interface ProfileLoad {
  id: string;
  rated: number;
}

export function profileLoads(project: Project): ProfileLoad[] {
  const out: ProfileLoad[] = [];
  for (const e of project.elements) {
    const field = loadField(e);
    if (field === undefined) continue;
    out.push({ id: e.id, rated: (e as unknown as Record<typeof field, number>)[field] });
  }
  return out;
}

const bad = (field: string, value: unknown, message: string): Problem => ({ code: 'invalid-value', elementId: PROJECT_LEVEL, field, value, message });

/**
 * Where a profile names an element by id that is not a load it can set: the words, or null when
 * `id` is a load of the project. Looked up in a Map: an id such as "toString" names nothing.
 */
function notALoad(id: string, byId: ReadonlyMap<string, Element>): string | null {
  const e = byId.get(id);
  if (!e) return `no element has the id "${id}"`;
  if (loadField(e) === undefined) return `"${e.name ?? e.id}" is not a load: a profile sets the level of loads only`;
  return null;
}

/** Checks that need the project: load ids, duty on-times, daily start hours, step count, load changes. */
export function checkStudy(study: BackupStudy, project: Project): Problem[] {
  const problems: Problem[] = [];
  const byId = new Map(project.elements.map((e) => [e.id, e]));
  const checkLoads = (settings: Record<string, LoadSetting> | undefined, field: string) => {
    for (const id of Object.keys(settings ?? {})) {
      const why = notALoad(id, byId);
      if (why) problems.push(bad(`${field}.${id}`, id, why));
    }
  };
  const p = study.profile;
  if (p.kind !== 'constant') p.segments.forEach((s, i) => checkLoads(s.loads, `backup.profile.segments.${i}.loads`));
  if (p.kind === 'daily') {
    p.segments.forEach((s, i) => {
      if (i > 0 && s.startHour <= p.segments[i - 1]!.startHour) {
        problems.push(bad(`backup.profile.segments.${i}.startHour`, s.startHour, 'start hours must rise from one segment to the next'));
      }
    });
  }
  (p.duty ?? []).forEach((d, i) => {
    const field = `backup.profile.duty.${i}`;
    const why = notALoad(d.load, byId);
    if (why) problems.push(bad(`${field}.load`, d.load, why));
    if (d.onMinutes > d.periodMinutes) problems.push({ ...bad(`${field}.onMinutes`, d.onMinutes, ''), ...say`must not exceed the period of ${q(d.periodMinutes, 'min')}` });
  });
  const step = study.timeStepSeconds ?? DEFAULT_TIME_STEP_S;
  const horizon = (study.horizonHours ?? DEFAULT_HORIZON_H) * 3600;
  if (horizon / step > MAX_STEPS) {
    problems.push(bad('backup.timeStepSeconds', step, `gives ${count(horizon / step)} steps over the ${hours(horizon)} horizon; at most ${count(MAX_STEPS)}: use a longer step or a shorter horizon`));
  }
  const changes = loadChanges(study);
  if (changes !== null) problems.push(changes);
  return problems;
}

/** A count in words: grouped digits, or "far more than …" past what a double counts exactly. */
export const count = (n: number): string => (Number.isFinite(n) && n < 1e15 ? Math.ceil(n).toLocaleString('en-US').replace(/,/g, ' ') : `far more than ${(1e15).toExponential(0)}`);
/** A duration in s as hours, minutes or seconds, 4 significant digits. */
function hours(seconds: number): string {
  if (seconds >= HOUR) return `${Number((seconds / HOUR).toPrecision(4))} h`;
  if (seconds >= 60) return `${Number((seconds / 60).toPrecision(4))} min`;
  return `${Number(seconds.toPrecision(4))} s`;
}
/** " (N with the profile's other load changes)" when other parts add to this one's. */
const withOthers = (own: number, others: number): string => (others > 0 ? ` (${count(own + others)} with the profile's other load changes)` : '');
/** A duration rounded up to 3 significant digits (a lower bound stays a lower bound). */
const upTo3 = (x: number): number => {
  const scale = 10 ** (Math.floor(Math.log10(x)) - 2);
  return Math.ceil(x / scale) * scale;
};

/**
 * The load changes the timeline would hold (see buildTimeline), counted from the settings alone
 * before anything is built; a problem naming the field to change when they pass MAX_LOAD_CHANGES.
 * Counted as buildTimeline places them: every segment start of every repeat or day that begins
 * before the end, and two instants per duty period.
 */
function loadChanges(study: BackupStudy): Problem | null {
  const horizon = (study.horizonHours ?? DEFAULT_HORIZON_H) * HOUR;
  const p = study.profile;
  let end = horizon;
  const parts: { changes: number; problem: (others: number) => Problem }[] = [];
  if (p.kind === 'segments') {
    const total = p.segments.reduce((t, s) => t + s.durationHours * HOUR, 0);
    if (!p.repeat && total < horizon) end = total;
    const n = p.segments.length;
    const cycles = p.repeat ? Math.ceil(end / total) : 1;
    let shortest = 0;
    p.segments.forEach((s, i) => {
      if (s.durationHours < p.segments[shortest]!.durationHours) shortest = i;
    });
    parts.push({
      changes: n * cycles,
      problem: (others) => {
        const field = `backup.profile.segments.${shortest}.durationHours`;
        if (!p.repeat) return bad('backup.profile.segments', n, `${count(n)} segments${withOthers(n, others)} are more than the ${count(MAX_LOAD_CHANGES)} load changes a study holds: join segments`);
        // The cycle that keeps these changes within what the others leave: n × horizon ÷ cycle.
        const room = MAX_LOAD_CHANGES - others;
        const cycle = room >= n ? (n * horizon) / (room - n + 1) : Infinity;
        const longer = Number.isFinite(cycle) ? ` make segment ${shortest + 1} at least ${hours(upTo3(p.segments[shortest]!.durationHours * HOUR + cycle - total))} long (the repeating cycle at least ${hours(upTo3(cycle))}), turn repeat off or shorten the horizon` : ' turn repeat off or shorten the horizon';
        return bad(field, p.segments[shortest]!.durationHours, `repeated over the ${hours(horizon)} horizon, a cycle of ${hours(total)} changes the load ${count(n * cycles)} times${withOthers(n * cycles, others)}; a study holds at most ${count(MAX_LOAD_CHANGES)} load changes:${longer}`);
      },
    });
  } else if (p.kind === 'daily') {
    const offset = (p.startHour ?? 0) * HOUR;
    const days = Math.ceil((end + offset) / DAY) + 1;
    const n = p.segments.length;
    parts.push({
      changes: n * days,
      problem: (others) => bad('backup.profile.segments', n, `${n} segments a day over the ${hours(horizon)} horizon change the load ${count(n * days)} times${withOthers(n * days, others)}; a study holds at most ${count(MAX_LOAD_CHANGES)} load changes: use fewer segments or a shorter horizon`),
    });
  }
  (p.duty ?? []).forEach((d, i) => {
    const period = d.periodMinutes * 60;
    const offset = (d.offsetMinutes ?? 0) * 60;
    const periods = offset < end ? Math.ceil((end - offset) / period) : 0;
    parts.push({
      changes: 2 * periods,
      problem: (others) => {
        const room = MAX_LOAD_CHANGES - others;
        const needed = room >= 2 ? (2 * (end - offset)) / room : Infinity;
        const longer = Number.isFinite(needed) ? `make the period at least ${hours(upTo3(needed))} or shorten the horizon` : 'shorten the horizon or remove other schedules';
        return bad(`backup.profile.duty.${i}.periodMinutes`, d.periodMinutes, `switches the load ${count(2 * periods)} times over the ${hours(end)} the study runs${withOthers(2 * periods, others)}; a study holds at most ${count(MAX_LOAD_CHANGES)} load changes: ${longer}`);
      },
    });
  });
  const total = parts.reduce((t, x) => t + x.changes, 0);
  if (!(total > MAX_LOAD_CHANGES)) return null;
  // The part that gives the most changes is named; the room it has is what the others leave.
  const worst = parts.reduce((a, b) => (b.changes > a.changes ? b : a));
  return worst.problem(parts.reduce((t, x) => (x === worst ? t : t + x.changes), 0));
}

/**
 * Keys of the raw `backup` settings (as read from the file, before the schema) that name a load by
 * a reserved id (`__proto__`, `toString` … see core/solve/structure.ts): no element can have one,
 * and a schema may drop `__proto__` without a word, so they are refused here at their field.
 */
export function reservedKeyProblems(rawBackup: unknown): Problem[] {
  const problems: Problem[] = [];
  const own = (o: unknown, key: string): unknown => (typeof o === 'object' && o !== null && Object.hasOwn(o, key) ? (o as Record<string, unknown>)[key] : undefined);
  const profile = own(rawBackup, 'profile');
  const segments = own(profile, 'segments');
  if (Array.isArray(segments)) {
    segments.forEach((segment, i) => {
      const loads = own(segment, 'loads');
      if (typeof loads !== 'object' || loads === null) return;
      for (const id of Object.keys(loads)) {
        if (RESERVED_IDS.has(id)) problems.push(bad(`backup.profile.segments.${i}.loads.${id}`, id, `no element can have the id "${id}" (a reserved name)`));
      }
    });
  }
  return problems;
}

/** Interval of constant load: [start, end) in s, and the index of its load state. */
export interface Interval {
  start: number;
  end: number;
  state: number;
}

export interface Timeline {
  loads: ProfileLoad[];
  /** Distinct load states: the value of every load (in `loads` order), W (VA for apparent-power loads, A for current loads). */
  states: number[][];
  intervals: Interval[];
  /** End of the timeline, s: the horizon, or the end of a `segments` profile run once. */
  end: number;
  /** True when a `segments` profile (no repeat) ends before the horizon. */
  profileEnds: boolean;
  /** Set when the profile meets more than MAX_LOAD_STATES load states: the timeline stops there and the study is refused. */
  refused?: Problem;
}

const HOUR = 3600;
const DAY = 24 * HOUR;

/** Setting of one load during a base segment (a share of the rating: rated × percent ÷ 100). */
export const settingValue = (rated: number, s: LoadSetting | undefined): number =>
  s === undefined || s === true ? rated : s === false ? 0 : typeof s === 'number' ? s : (rated * s.percent) / 100;

function tooManyStates(at: number): Problem {
  return bad(
    'backup.profile',
    MAX_LOAD_STATES,
    `gives more than ${count(MAX_LOAD_STATES)} different combinations of load levels (the first past that at ${hours(at)} into the outage), each solved through the whole chain: use fewer segments or duty schedules, or give duty schedules periods that fit into each other`,
  );
}

/**
 * Cut the outage [0, horizon) into intervals of constant load. Breakpoints: segment boundaries
 * and every duty switching instant; each interval's state is taken at its midpoint. The cuts and
 * each interval's segment and duty on/off come from the skeleton of the profile's timing (built once
 * per timing, see Skeleton); the levels are read here, from the project's loads and the profile's
 * settings, per call. The intervals are shared between calls with the same timing and the same
 * grouping of intervals into states: frozen, read only.
 */
export function buildTimeline(project: Project, study: BackupStudy): Timeline {
  const loads = profileLoads(project);
  const p = study.profile;
  const sk = skeletonFor(study);
  const { cuts, end, profileEnds } = sk;
  const duty = p.duty ?? [];
  // Each load's duty schedules, as indices into the profile's list (the skeleton's on/off order).
  const dutyByLoad = new Map<string, number[]>();
  duty.forEach((d, j) => {
    const list = dutyByLoad.get(d.load);
    if (list) list.push(j);
    else dutyByLoad.set(d.load, [j]);
  });
  // Only the loads the profile names can change; the others stay at their rating throughout, so each
  // interval looks at the named ones alone.
  const named = new Set<string>(dutyByLoad.keys());
  if (p.kind !== 'constant') for (const seg of p.segments) for (const id of Object.keys(seg.loads ?? {})) named.add(id);
  const varying = loads.flatMap((l, k) => (named.has(l.id) ? [k] : []));
  const steady = loads.map((l) => l.rated);

  // The state of each pattern; patterns come in order of first appearance, so the states are numbered
  // in order of first appearance along the outage, as interval by interval.
  const states: number[][] = [];
  const keys = new Map<string, number>();
  const stateOf = new Int32Array(sk.patterns.length);
  let refusedFrom = -1;
  for (let k = 0; k < sk.patterns.length; k++) {
    const pat = sk.patterns[k]!;
    const settings = pat.segment < 0 || p.kind === 'constant' ? undefined : p.segments[pat.segment]!.loads;
    const values = varying.map((i) => {
      const l = loads[i]!;
      const schedules = dutyByLoad.get(l.id);
      if (schedules && !schedules.every((j) => pat.dutyOn[j])) return 0;
      // Own keys only: a settings object answers to names it does not hold ("constructor" …).
      return settingValue(l.rated, settings && Object.hasOwn(settings, l.id) ? settings[l.id] : undefined);
    });
    const key = values.join(',');
    let state = keys.get(key);
    if (state === undefined) {
      if (states.length >= MAX_LOAD_STATES) {
        refusedFrom = k;
        break;
      }
      state = states.length;
      const all = steady.slice();
      varying.forEach((i, j) => (all[i] = values[j]!));
      states.push(all);
      keys.set(key, state);
    }
    stateOf[k] = state;
  }
  if (refusedFrom >= 0) {
    // The intervals before the first one of the refused pattern (every later pattern comes after it).
    const at = sk.patterns[refusedFrom]!.first;
    return { loads, states, intervals: mergeIntervals(cuts, sk.pattern, stateOf, at), end, profileEnds, refused: tooManyStates(cuts[at]!) };
  }
  if (!sameStates(sk.grouping, stateOf)) {
    sk.grouping = stateOf;
    sk.intervals = Object.freeze(mergeIntervals(cuts, sk.pattern, stateOf, sk.pattern.length).map((iv) => Object.freeze(iv)));
  }
  return { loads, states, intervals: sk.intervals as Interval[], end, profileEnds };
}

const sameStates = (a: Int32Array | undefined, b: Int32Array): boolean => {
  if (a === undefined || a.length !== b.length) return false;
  for (let i = 0; i < a.length; i++) if (a[i] !== b[i]) return false;
  return true;
}

/** Raw intervals 0 … count − 1 with their states, neighbours of one state joined. */
function mergeIntervals(cuts: readonly number[], pattern: Int32Array, stateOf: Int32Array, count: number): Interval[] {
  const intervals: Interval[] = [];
  for (let i = 0; i < count; i++) {
    const state = stateOf[pattern[i]!]!;
    const last = intervals[intervals.length - 1];
    if (last && last.state === state) last.end = cuts[i + 1]!;
    else intervals.push({ start: cuts[i]!, end: cuts[i + 1]!, state });
  }
  return intervals;
}
