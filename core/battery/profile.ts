/**
 * Load profiles of the backup study: the schema of the project's `backup` settings, the checks
 * that need the project (load ids), and the timeline — the outage cut into intervals over which
 * every load's power is constant (profile segments and duty switching split it exactly, so the
 * energy of a load is Σ on-time × power with no rounding to the time step).
 */
import { z } from 'zod/mini';
import type { BackupStudy, DutySchedule, Element, LoadSetting, Project } from '../model.ts';
import type { Problem } from '../errors.ts';

const num = () => z.number({ error: 'must be a number' });
const positive = (unit: string) => num().check(z.gt(0, `must be greater than 0 ${unit}`.trim()));
const nonNegative = (unit: string) => num().check(z.gte(0, `must not be negative ${unit}`.trim()));

const loadsField = z.optional(
  z.record(z.string(), z.union([nonNegative(''), z.boolean()], { error: 'must be a power in W (a current in A for a load given by its current), true (on) or false (off)' }), {
    error: 'must map load ids to a power in W (a current in A for a load given by its current), true or false',
  }),
);

const dutySchema = z.strictObject({
  load: z.string({ error: 'must name a load' }).check(z.minLength(1, 'must name a load')),
  periodMinutes: positive('min'),
  onMinutes: nonNegative('min'),
  offsetMinutes: z.optional(nonNegative('min')),
});

const duty = z.optional(z.array(dutySchema, { error: 'must be a list of duty schedules' }));

export const profileSchema = z.discriminatedUnion(
  'kind',
  [
    z.strictObject({ kind: z.literal('constant'), duty }),
    z.strictObject({
      kind: z.literal('segments'),
      segments: z
        .array(z.strictObject({ durationHours: num().check(z.gt(0, 'must be greater than 0 h (a segment cannot run backwards or last no time)')), loads: loadsField }), {
          error: 'must be a list of {durationHours, loads} segments',
        })
        .check(z.minLength(1, 'needs at least one segment')),
      repeat: z.optional(z.boolean({ error: 'must be true or false' })),
      duty,
    }),
    z.strictObject({
      kind: z.literal('daily'),
      segments: z
        .array(
          z.strictObject({
            startHour: num().check(z.gte(0, 'must be 0 or more'), z.lt(24, 'must be below 24')),
            loads: loadsField,
          }),
          { error: 'must be a list of {startHour, loads} segments' },
        )
        .check(z.minLength(1, 'needs at least one segment')),
      startHour: z.optional(num().check(z.gte(0, 'must be 0 or more'), z.lt(24, 'must be below 24'))),
      duty,
    }),
  ],
  { error: 'must be one of "constant", "segments", "daily"' },
);

const fraction = (what: string) => num().check(z.gt(0, `${what} must be greater than 0`), z.lte(1, `${what} must not exceed 1 (enter 0.8 for 80 %)`));

/** Schema of the project's `backup` field (listed in core/solve/validate.ts). */
export const backupSchema = z.strictObject({
  profile: profileSchema,
  timeStepSeconds: z.optional(positive('s')),
  horizonHours: z.optional(positive('h').check(z.lte(24 * 366, 'must not exceed one year (8784 h)'))),
  temperatureC: z.optional(num().check(z.gte(-60, 'must be −60 °C or more'), z.lte(80, 'must be 80 °C or less'))),
  stateOfHealth: z.optional(fraction('state of health')),
  design: z.optional(z.enum(['backup', 'cycling'], { error: 'must be "backup" (discharge to the end voltage) or "cycling" (also stop at the usable depth of discharge)' })),
  targetRuntimeHours: z.optional(positive('h')),
  designMargin: z.optional(num().check(z.gte(1, 'must be at least 1 (1.10 adds 10 %)'))),
  agingFactor: z.optional(num().check(z.gte(1, 'must be at least 1 (1.25 for a bank replaced at 80 % capacity)'))),
  standardCapacitiesAh: z.optional(z.array(positive('Ah'), { error: 'must be a list of capacities in Ah' }).check(z.minLength(1, 'needs at least one capacity'))),
  chargerCurrent: z.optional(positive('A')),
  chargerEfficiency: z.optional(fraction('efficiency')),
  targetRechargeHours: z.optional(positive('h')),
});

export const DEFAULT_TIME_STEP_S = 60;
export const DEFAULT_HORIZON_H = 168;
/** Most integration steps one study may take (keeps a run and its time series bounded). */
export const MAX_STEPS = 1_000_000;

const LOAD_KINDS = new Set<Element['kind']>(['dc-load', 'ac-load', 'ac-va-load', 'dc-current-load', 'ac-current-load', 'shaft-load']);

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
    if (!LOAD_KINDS.has(e.kind)) continue;
    const rated = e.kind === 'ac-va-load' ? e.apparentPower : e.kind === 'dc-current-load' || e.kind === 'ac-current-load' ? e.current : (e as { power: number }).power;
    out.push({ id: e.id, rated });
  }
  return out;
}

const bad = (field: string, value: unknown, message: string): Problem => ({ code: 'invalid-value', elementId: 'project', field, value, message });

/** Checks that need the project: load ids, duty on-times, daily start hours, step count. */
export function checkStudy(study: BackupStudy, project: Project): Problem[] {
  const problems: Problem[] = [];
  const loads = new Set(profileLoads(project).map((l) => l.id));
  const checkLoads = (settings: Record<string, LoadSetting> | undefined, field: string) => {
    for (const id of Object.keys(settings ?? {})) {
      if (!loads.has(id)) problems.push(bad(`${field}.${id}`, id, `no load has the id "${id}" (a profile sets loads only)`));
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
    if (!loads.has(d.load)) problems.push(bad(`${field}.load`, d.load, `no load has the id "${d.load}"`));
    if (d.onMinutes > d.periodMinutes) problems.push(bad(`${field}.onMinutes`, d.onMinutes, `must not exceed the period of ${d.periodMinutes} min`));
  });
  const step = study.timeStepSeconds ?? DEFAULT_TIME_STEP_S;
  const horizon = (study.horizonHours ?? DEFAULT_HORIZON_H) * 3600;
  if (horizon / step > MAX_STEPS) {
    problems.push(bad('backup.timeStepSeconds', step, `gives ${Math.ceil(horizon / step)} steps over the ${horizon / 3600} h horizon; at most ${MAX_STEPS} — use a longer step or a shorter horizon`));
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
}

const HOUR = 3600;
const DAY = 24 * HOUR;

/** Setting of one load during a base segment. */
const settingValue = (rated: number, s: LoadSetting | undefined): number =>
  s === undefined || s === true ? rated : s === false ? 0 : s;

/** On-intervals of a duty schedule ([start, end), s) that meet [0, end). */
function dutyBreaks(d: DutySchedule, end: number, into: number[]): void {
  const period = d.periodMinutes * 60;
  const on = d.onMinutes * 60;
  for (let t = (d.offsetMinutes ?? 0) * 60; t < end; t += period) {
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

/**
 * Cut the outage [0, horizon) into intervals of constant load. Breakpoints: segment boundaries
 * and every duty switching instant; each interval's state is taken at its midpoint.
 */
export function buildTimeline(project: Project, study: BackupStudy): Timeline {
  const loads = profileLoads(project);
  const horizon = (study.horizonHours ?? DEFAULT_HORIZON_H) * HOUR;
  const p = study.profile;
  const breaks: number[] = [0];
  let end = horizon;
  let profileEnds = false;
  // base(t): the settings of the base profile at time t.
  let base: (t: number) => Record<string, LoadSetting> | undefined;
  if (p.kind === 'constant') {
    base = () => undefined;
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
    for (let cycle = 0; cycle * total < end; cycle++) for (const s of starts) breaks.push(cycle * total + s);
    base = (t) => {
      const local = t % total;
      let i = starts.length - 1;
      while (i > 0 && starts[i]! > local) i--;
      return p.segments[i]!.loads;
    };
  } else {
    const offset = (p.startHour ?? 0) * HOUR;
    const starts = p.segments.map((s) => s.startHour * HOUR);
    for (let day = -1; day * DAY < end + offset; day++) for (const s of starts) breaks.push(day * DAY + s - offset);
    base = (t) => {
      const local = (t + offset) % DAY;
      // The segment in force is the last one starting at or before `local`; before the first start, the last of the day.
      let i = starts.length - 1;
      while (i >= 0 && starts[i]! > local) i--;
      return p.segments[i < 0 ? starts.length - 1 : i]!.loads;
    };
  }
  const duty = p.duty ?? [];
  for (const d of duty) dutyBreaks(d, end, breaks);
  const cuts = [...new Set(breaks.filter((t) => t >= 0 && t < end))].sort((a, b) => a - b);
  cuts.push(end);
  const dutyByLoad = new Map<string, DutySchedule[]>();
  for (const d of duty) dutyByLoad.set(d.load, [...(dutyByLoad.get(d.load) ?? []), d]);

  const states: number[][] = [];
  const keys = new Map<string, number>();
  const intervals: Interval[] = [];
  for (let i = 0; i + 1 < cuts.length; i++) {
    const start = cuts[i]!;
    const stop = cuts[i + 1]!;
    const mid = (start + stop) / 2;
    const settings = base(mid);
    const values = loads.map((l) => {
      const schedules = dutyByLoad.get(l.id);
      if (schedules && !schedules.every((d) => dutyOn(d, mid))) return 0;
      return settingValue(l.rated, settings?.[l.id]);
    });
    const key = values.join(',');
    let state = keys.get(key);
    if (state === undefined) {
      state = states.length;
      states.push(values);
      keys.set(key, state);
    }
    const last = intervals[intervals.length - 1];
    if (last && last.state === state) last.end = stop;
    else intervals.push({ start, end: stop, state });
  }
  return { loads, states, intervals, end, profileEnds };
}
