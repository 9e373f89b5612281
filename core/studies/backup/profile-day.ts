/**
 * One day of a backup study's load profile, for the profile editor's preview and its figures: the
 * first 24 h of the outage cut by the study's own timeline (core/solve/load-profile.ts
 * `buildTimeline`: segment boundaries and duty switching instants exact, levels as the study sets
 * them), each interval's total load in W, placed on the clock (a daily profile's outage begins at its
 * start hour), and the day's energy, average and peak.
 *
 * Method: the energy is the sum over the intervals of power × duration (a step function
 * integrated exactly; no time step), E = Σ P_i·Δt_i, and the average E ÷ 24 h. The total is the
 * loads' own power, as the loads use it: what the chain (converter and cable losses) adds on the
 * way from the bank is the discharge study's, not this preview's.
 *
 * Watts of a load: a power load's level is W. An apparent-power load's level (VA) times its power
 * factor (P = S·pf, the kind's own model, core/kinds/loads.ts). A load given by its current (A) draws
 * P = V·I·pf at the solved voltage (constant-current model): its W per A is read from a solved
 * result, the load's power over its current there; without one it is listed as not counted.
 */
import type { BackupStudy, LoadProfile, Project } from '../../model/project.ts';
import type { SolveResult } from '../../model/result.ts';
import type { Problem } from '../../model/errors.ts';
import { kindSpec } from '../../kinds/index.ts';
import { validateBackup } from '../../solve/validate.ts';
import { buildTimeline, checkStudy } from '../../solve/load-profile.ts';

const HOUR = 3600;
const DAY_H = 24;

/** A stretch of the clock with one total load: [fromHour, toHour) in hours of the day, 0…24. */
export interface DayInterval {
  fromHour: number;
  toHour: number;
  /** Total power of the loads counted, W. */
  watts: number;
}

export interface ProfileDay {
  /** The day on the clock, in order, covering 0…24 h (a `segments` profile run once may end sooner). */
  intervals: DayInterval[];
  /** Energy the counted loads use over the day, Wh: Σ P·Δt. */
  energyWh: number;
  /** Energy ÷ the hours covered, W. */
  averageW: number;
  peakW: number;
  /** Hour of the day at which the outage begins (0 unless a daily profile says). */
  startHour: number;
  /** Ids of loads whose power cannot be put in W without a solved result (given by their current). */
  uncounted: string[];
}

export type ProfileDayOutcome = { ok: true; day: ProfileDay } | { ok: false; problems: Problem[] };

/** A load a profile can set: its id, its name (the id when unnamed), its rated value and that value's unit. */
export interface ProfileLoadInfo {
  id: string;
  name: string;
  rated: number;
  unit: 'W' | 'VA' | 'A';
}

/** The loads of a project (or a draft of it) a profile can set, in the project's order. */
export function profileLoadList(project: Project): ProfileLoadInfo[] {
  const out: ProfileLoadInfo[] = [];
  for (const e of project.elements) {
    const load = kindSpec(e.kind)?.load;
    if (!load) continue;
    const rated = (e as unknown as Record<string, unknown>)[load.field];
    out.push({ id: e.id, name: typeof e.name === 'string' && e.name ? e.name : e.id, rated: typeof rated === 'number' && Number.isFinite(rated) ? rated : 0, unit: load.unit });
  }
  return out;
}

/** The outage's start on the clock, h: a daily profile's `startHour`, else midnight. */
export const profileStartHour = (p: LoadProfile): number => (p.kind === 'daily' ? (p.startHour ?? 0) : 0);

/**
 * W per unit of each load's level (W: 1; VA: its power factor; A: from the solved result when it
 * holds the load at a non-zero current), or undefined when it cannot be known.
 */
function wattsPerUnit(project: Project, solved: SolveResult | undefined): Map<string, number | undefined> {
  const results = new Map((solved?.elements ?? []).map((r) => [r.id, r]));
  const out = new Map<string, number | undefined>();
  for (const e of project.elements) {
    const load = kindSpec(e.kind)?.load;
    if (!load) continue;
    if (load.unit === 'W') out.set(e.id, 1);
    else if (load.unit === 'VA') {
      const pf = (e as { powerFactor?: unknown }).powerFactor;
      out.set(e.id, typeof pf === 'number' && Number.isFinite(pf) ? pf : undefined);
    } else {
      const r = results.get(e.id);
      const amps = r?.input?.current;
      out.set(e.id, r && typeof amps === 'number' && amps > 0 && Number.isFinite(r.pOut) ? r.pOut / amps : undefined);
    }
  }
  return out;
}

/**
 * What the study would refuse in these `backup` settings before it runs: the file's checks of the
 * settings (types, ranges) and the study's checks that need the project (load ids, start hours rising,
 * duty on-times within their period, step and load-change counts). The profile editor checks an edit
 * with it before storing it, so a refused value keeps its message at its field.
 */
export function backupSettingsProblems(project: Project, study: unknown): Problem[] {
  const checked = validateBackup(study);
  if (!checked.ok) return checked.problems;
  return checkStudy(checked.backup, project);
}

/**
 * The day of the profile in `study` (the project's `backup` settings, checked here as the file's
 * validation and the study check them), on the clock. `solved` is a solved result of the project (or
 * of an earlier draft of it), read only for the W per A of loads given by their current.
 */
export function profileDay(project: Project, study: unknown, solved?: SolveResult): ProfileDayOutcome {
  const checked = validateBackup(study);
  if (!checked.ok) return { ok: false, problems: checked.problems };
  // The first day of the outage: its own horizon, whatever the study's.
  const day: BackupStudy = { ...checked.backup, horizonHours: DAY_H };
  const problems = checkStudy(day, project);
  if (problems.length) return { ok: false, problems };
  const timeline = buildTimeline(project, day);
  if (timeline.refused) return { ok: false, problems: [timeline.refused] };
  const perUnit = wattsPerUnit(project, solved);
  const uncounted = timeline.loads.filter((l) => perUnit.get(l.id) === undefined).map((l) => l.id);
  const totals = timeline.states.map((levels) =>
    levels.reduce((sum, level, k) => {
      const w = perUnit.get(timeline.loads[k]!.id);
      return w === undefined || !Number.isFinite(level) ? sum : sum + level * w;
    }, 0),
  );
  const start = profileStartHour(day.profile);
  const intervals: DayInterval[] = [];
  let energyWh = 0;
  let peakW = 0;
  for (const iv of timeline.intervals) {
    const watts = totals[iv.state]!;
    energyWh += (watts * (iv.end - iv.start)) / HOUR;
    if (watts > peakW) peakW = watts;
    // On the clock: hours since the outage began + its start hour, wrapped at midnight.
    let from = start + iv.start / HOUR;
    const to = start + iv.end / HOUR;
    const pieces: [number, number][] = [];
    if (from < DAY_H && to > DAY_H) {
      pieces.push([from, DAY_H]);
      from = DAY_H;
    }
    pieces.push([from, to]);
    for (const [a, b] of pieces) {
      const shift = a >= DAY_H ? DAY_H : 0;
      intervals.push({ fromHour: a - shift, toHour: b - shift, watts });
    }
  }
  intervals.sort((a, b) => a.fromHour - b.fromHour);
  const covered = timeline.end / HOUR;
  return { ok: true, day: { intervals, energyWh, averageW: covered > 0 ? energyWh / covered : 0, peakW, startHour: start, uncounted } };
}

/** An hour of the day as a clock shows it: 18.5 → "18:30". */
const clock = (hour: number): string => {
  const minutes = Math.round(hour * 60);
  return `${String(Math.floor(minutes / 60)).padStart(2, '0')}:${String(minutes % 60).padStart(2, '0')}`;
};

/** The day of the profile as the command-line solver prints it, under the battery backup study. */
export function formatProfileDay(day: ProfileDay): string {
  const lines = [
    '',
    'Load profile',
    `  First day of the outage, from ${clock(day.startHour)} (the loads alone; the chain's losses come on top): ${(day.energyWh / 1000).toFixed(2)} kWh, average ${day.averageW.toFixed(1)} W, peak ${day.peakW.toFixed(1)} W`,
  ];
  if (day.uncounted.length) lines.push(`  (not counted in that figure: ${day.uncounted.length} load(s) given by current)`);
  return lines.join('\n');
}
