/**
 * The yearly energy and cost of the losses over the backup study's load profile (the project's
 * `running.lossesFromProfile`), instead of the operating point as drawn held all the hours.
 *
 * Method: the profile's first day is cut into intervals of constant load as the battery study cuts it
 * (core/solve/load-profile.ts `buildTimeline`: segment boundaries and duty switching instants exact);
 * each distinct load state is solved through the whole chain from the solved project (`solveVariant`,
 * every profiled load at its level: W, VA or A as the load is given), and each element's loss counted
 * for the time its state lasts (a step function integrated exactly, no time step):
 *   E_e = (h ÷ 24 h) · Σ_i P_loss,e(state_i) · Δt_i,
 * h the hours per year (8760: the day repeated all year; fewer: that many hours of such days).
 * With a day/night tariff each interval is priced by the share of it that falls in the day-price hours
 * on the clock (the profile's start hour places the day): p_i = f_i · p_day + (1 − f_i) · p_night, and
 *   cost_e = (h ÷ 24 h) · Σ_i P_loss,e(state_i) · Δt_i · p_i.
 * The price shown is the mean the losses pay, Σ cost ÷ Σ E. A profile of one run that ends before 24 h
 * (`segments` without repeat) counts the hours it covers, scaled to the day (its loads are taken to
 * repeat that way). Loads lose nothing by definition; the source's own loss counts, as in economics.ts.
 */
import type { Element } from '../model/project.ts';
import type { Problem } from '../model/errors.ts';
import { PROJECT_LEVEL } from '../model/errors.ts';
import { kindSpec } from '../kinds/index.ts';
import { buildTimeline, checkStudy } from '../solve/load-profile.ts';
import { solveVariant } from '../solve/variant.ts';
import type { Solved } from '../solve/solved.ts';
import { validateBackup } from '../solve/validate.ts';
import { checkCostSettings, lossCostPerYear, withProfilePrice, type CostSettings, type LossCost, type LossCostOutcome, type LossCostRow, type LossOverProfile } from './economics.ts';
import { profileStartHour } from './backup/profile-day.ts';

const HOUR = 3600;
const DAY_H = 24;
/** Below this a loss is the solve's round-off, not a loss (as economics.ts). */
const ROUND_OFF_W = 1e-9;

export const LOSS_OVER_PROFILE_METHOD =
  'losses over the load profile’s day: each load state solved through the chain, each element’s loss counted for the time its state lasts, E = (h ÷ 24 h) · Σ P_loss · Δt; with a day/night tariff each stretch at the price of its hours';

/** A day's share of the day-price hours [start, end) inside [from, to) on the clock (hours, 0 … 48 before wrapping). */
function dayShareOf(from: number, to: number, start: number, end: number): number {
  // The stretch may cross midnight: count it in two pieces on the 0–24 clock.
  let inDay = 0;
  for (const [a, b] of from < DAY_H && to > DAY_H ? [[from, DAY_H], [0, to - DAY_H]] : from >= DAY_H ? [[from - DAY_H, to - DAY_H]] : [[from, to]]) {
    const overlap = Math.min(b!, end) - Math.max(a!, start);
    if (overlap > 0) inDay += overlap;
  }
  return to > from ? inDay / (to - from) : 0;
}

/**
 * The losses' yearly energy and cost over the load profile (see the header), or null when the project
 * does not ask for it or has no backup study (the caller then costs the operating point as drawn).
 * Refused, the problem named, when the profile has problems of its own (as the battery study names
 * them) or a load state cannot be solved.
 */
export function lossCostOverProfile(solved: Solved, cost: CostSettings): LossCostOutcome | null {
  const { project } = solved;
  if (!project.running?.lossesFromProfile || project.backup === undefined) return null;
  const problems = checkCostSettings(cost);
  if (problems.length) return { ok: false, problems };
  // The profile's own problems refuse the cost (asked to follow the profile, it does not fall back unseen).
  const checked = validateBackup(project.backup);
  if (!checked.ok) return { ok: false, problems: checked.problems };
  const day = { ...checked.backup, horizonHours: DAY_H };
  const studyProblems = checkStudy(day, project);
  if (studyProblems.length) return { ok: false, problems: studyProblems };
  const timeline = buildTimeline(project, day);
  if (timeline.refused) return { ok: false, problems: [timeline.refused] };
  const covered = timeline.end / HOUR;
  if (!(covered > 0)) return null;

  // Each load state solved through the chain: every profiled load at its level.
  const byId = new Map(project.elements.map((e) => [e.id, e]));
  const losses: Map<string, number>[] = [];
  for (let s = 0; s < timeline.states.length; s++) {
    const levels = timeline.states[s]!;
    const replace: Element[] = [];
    timeline.loads.forEach((l, k) => {
      const e = byId.get(l.id)!;
      const field = kindSpec(e.kind)?.load?.field;
      const level = levels[k]!;
      if (field !== undefined && (e as unknown as Record<string, number>)[field] !== level) replace.push({ ...e, [field]: level } as Element);
    });
    const v = replace.length ? solveVariant(solved, { replace }) : solved;
    if (!v.ok) {
      const first: Problem = v.problems[0] ?? { code: 'invalid-value', elementId: PROJECT_LEVEL, field: 'backup.profile', message: 'a load state of the profile has no solution' };
      return { ok: false, problems: [{ ...first, message: `a load state of the profile's day (the losses worked out over it): ${first.message}` }] };
    }
    losses.push(new Map(v.result.elements.filter((e) => e.role !== 'load').map((e) => [e.id, e.loss])));
  }

  // The prices of the day: with the project's day/night tariff, each stretch at its hours' price (placed on
  // the clock); else the one price given.
  const t = cost.tariff;
  const startHour = profileStartHour(day.profile);
  const priceOf = (fromS: number, toS: number): number => {
    if (!t) return cost.pricePerKWh;
    const f = dayShareOf(startHour + fromS / HOUR, startHour + toS / HOUR, t.dayStartHour, t.dayEndHour);
    return f * t.dayPricePerKWh + (1 - f) * t.nightPricePerKWh;
  };

  // Σ P·Δt (Wh) and Σ P·Δt·p (Wh × price per kWh) per element over the day covered.
  const energyWh = new Map<string, number>();
  const costWh = new Map<string, number>();
  for (const iv of timeline.intervals) {
    const hours = (iv.end - iv.start) / HOUR;
    const p = priceOf(iv.start, iv.end);
    for (const [id, loss] of losses[iv.state]!) {
      energyWh.set(id, (energyWh.get(id) ?? 0) + loss * hours);
      costWh.set(id, (costWh.get(id) ?? 0) + loss * hours * p);
    }
  }
  // Scaled to the year: (h ÷ hours covered) days' worth (h ÷ 24 for a whole day).
  const scale = cost.hoursPerYear / covered;
  const rows: LossCostRow[] = solved.result.elements
    .filter((e) => e.role !== 'load' && (energyWh.get(e.id) ?? 0) / covered > ROUND_OFF_W)
    .map((e) => {
      const energyKWh = ((energyWh.get(e.id) ?? 0) * scale) / 1000;
      // The mean loss over the day covered, W (what the row's "loss" stands for here).
      return { id: e.id, name: e.name, kind: e.kind, lossW: (energyWh.get(e.id) ?? 0) / covered, energyKWh, cost: ((costWh.get(e.id) ?? 0) * scale) / 1000 };
    });
  const totalLossW = rows.reduce((s, x) => s + x.lossW, 0);
  const totalEnergyKWh = rows.reduce((s, x) => s + x.energyKWh, 0);
  const totalCost = rows.reduce((s, x) => s + x.cost, 0);
  const out: LossCost = {
    pricePerKWh: totalEnergyKWh > 0 ? totalCost / totalEnergyKWh : cost.pricePerKWh,
    hoursPerYear: cost.hoursPerYear,
    rows,
    totalLossW,
    totalEnergyKWh,
    totalCost,
    overProfile: { states: timeline.states.length, hoursCovered: covered, method: LOSS_OVER_PROFILE_METHOD } satisfies LossOverProfile,
  };
  return { ok: true, cost: out };
}

/**
 * The yearly cost of a solved chain's losses as every study prices them: over the load profile's day
 * when the project asks for it and has a profile to read (`lossCostOverProfile`), else the operating
 * point as drawn held all the hours at the price in force (economics.ts `lossCostPerYear`, with the
 * profile's day/night split when the project asks for that: `withProfilePrice`).
 */
export function lossCostOfSolved(solved: Solved, cost: CostSettings): LossCostOutcome {
  return lossCostOverProfile(solved, cost) ?? lossCostPerYear(solved.result, withProfilePrice(solved, cost));
}
