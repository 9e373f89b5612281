/**
 * What the losses of a chain cost per year, and what a year of energy costs.
 *
 * Method: energy at a constant operating point, E = P × t (the solved loss held for the hours of
 * operation per year), cost = E in kWh × price per kWh. The operating point is the one the chain
 * was solved at; a chain that runs at several load levels needs one figure per level (the flow
 * study gives them for a pump). Pure: no clock, no storage; the price is in whatever currency the
 * user thinks in (the page shows the symbol of their locale).
 */
import type { Problem } from '../model/errors.ts';
import { PROJECT_LEVEL } from '../model/errors.ts';
import type { ElementKind, Project } from '../model/project.ts';
import type { SolveResult } from '../model/result.ts';
import { HOURS_IN_YEAR, MAX_HOURS_PER_YEAR } from '../solve/running-schema.ts';
import { sigText } from '../model/message.ts';

// Hours in a leap year (the most a year can hold) and in a common year (all year round, the default).
export { HOURS_IN_YEAR, MAX_HOURS_PER_YEAR };

/** Where the price and hours live in the project file (problems name them so; the forms mark those fields). */
export const PRICE_FIELD = 'running.energyPricePerKWh';
export const HOURS_FIELD = 'running.hoursPerYear';

/** Losses smaller than this (W) are solver round-off, not a stage that loses power. */
const ROUND_OFF_W = 1e-9;

import { DEFAULT_DAY_END_HOUR, DEFAULT_DAY_START_HOUR, dayNightTariff, meanPrice, profileDayHours, tariffOfRunning, type DayNightTariff } from '../model/tariff.ts';
import type { Solved } from '../solve/solved.ts';
import { profileDay } from './backup/profile-day.ts';

export { DEFAULT_DAY_END_HOUR, DEFAULT_DAY_START_HOUR, meanPrice };

export interface CostSettings {
  /** Price of energy, currency units per kWh (≥ 0). */
  pricePerKWh: number;
  /** Hours per year the chain runs at the solved operating point (0 … 8784). */
  hoursPerYear: number;
  /** Set when the price is the day and night prices' mean weighted by the load profile's day (`withProfilePrice`): the share of its energy used while the day price runs. */
  profileDayShare?: number;
  /** The project's day/night tariff the price is the mean of (`costSettingsOf`, with a night price): the losses worked out over the load profile pay each stretch at its hours' price. */
  tariff?: DayNightTariff;
}

export interface LossCostRow {
  id: string;
  name: string;
  kind: ElementKind;
  /** Loss at the solved operating point, W. */
  lossW: number;
  /** Energy lost per year, kWh. */
  energyKWh: number;
  /** Cost of that energy per year, currency units. */
  cost: number;
}

/** How the losses were worked out over the backup study's load profile (core/studies/loss-over-profile.ts). */
export interface LossOverProfile {
  /** Load states of the day, each solved through the chain. */
  states: number;
  /** Hours of the day the profile covers (24 unless a one-run profile ends sooner). */
  hoursCovered: number;
  /** The method in words (named in the working). */
  method: string;
}

export interface LossCost {
  /** The price the losses pay: the one in force, or over the profile the mean Σ cost ÷ Σ E. */
  pricePerKWh: number;
  hoursPerYear: number;
  /** Set when the losses were worked out over the load profile's day (`lossCostOfSolved`): each row's `lossW` is then its mean over the day. */
  overProfile?: LossOverProfile;
  /** Set when the price is weighted by the load profile's day (CostSettings.profileDayShare): the share of its energy in the day-price hours. */
  profileDayShare?: number;
  /** One row per source or stage that loses power, in the result's order. */
  rows: LossCostRow[];
  totalLossW: number;
  totalEnergyKWh: number;
  totalCost: number;
}

export type LossCostOutcome = { ok: true; cost: LossCost } | { ok: false; problems: Problem[] };

/**
 * The cost settings a project carries (`running`): its price per kWh and hours per year (default
 * HOURS_IN_YEAR, all year). Null without a price: nothing to cost. The command line reads them so;
 * the page too, falling back to the user's earlier setting on that device for a project that has no
 * `running` yet (web/state/prefs.ts).
 */
export function costSettingsOf(project: Pick<Project, 'running'>): CostSettings | null {
  const r = project.running;
  if (r?.energyPricePerKWh === undefined) return null;
  // With a night price the losses are priced at the day's mean (meanPrice), the hours spread evenly over the
  // day; a solved chain whose project splits them by its load profile takes `withProfilePrice`.
  const t = tariffOfRunning({ ...r, energyPricePerKWh: r.energyPricePerKWh });
  const hoursPerYear = r.hoursPerYear ?? HOURS_IN_YEAR;
  const tariff = dayNightTariff(t);
  return { pricePerKWh: meanPrice(t).pricePerKWh, hoursPerYear, ...(tariff ? { tariff } : {}) };
}

/** A day/night tariff as the cost of the losses prices it (the project's `running`, lifetime.ts `LifetimeSettings`). */
export interface Tariff {
  /** Day price (the only price without a night price), currency units per kWh. */
  dayPricePerKWh: number;
  nightPricePerKWh?: number | undefined;
  dayStartHour: number;
  dayEndHour: number;
  /** Split the day and night prices as the backup study's load profile uses its day (else evenly). */
  dayHoursFromProfile?: boolean | undefined;
}

/**
 * The mean price of a tariff for a solved chain, the one both the yearly cost of the losses and the
 * cost over the years take: with a night price and `dayHoursFromProfile`, the energy-weighted mean
 * p̄ = s·p_day + (1 − s)·p_night, s the share of the backup study's load profile's day energy used
 * while the day price runs (core/model/tariff.ts `profileDayHours`; the losses taken to follow the
 * load), given to `meanPrice` as that many day hours of 24; else the time-weighted mean of the
 * tariff's hours (`meanPrice`, the hours spread evenly). `split` is null when the hours are the tariff's
 * (no split asked, no night price, or no profile that uses energy).
 */
export function tariffPrice(solved: Solved, t: Tariff): { pricePerKWh: number; dayHours: number; split: { dayHours: number; dayShare: number } | null } {
  const split = t.dayHoursFromProfile && t.nightPricePerKWh !== undefined ? profileSplit(solved, t) : null;
  const { pricePerKWh, dayHours } = meanPrice(split ? { ...t, dayStartHour: 0, dayEndHour: split.dayHours } : t);
  return { pricePerKWh, dayHours, split };
}

/** The day-price hours as the backup study's load profile uses its day (its day from core/studies/backup/profile-day.ts), or null without a profile that uses energy. */
function profileSplit(solved: Solved, t: Tariff): { dayHours: number; dayShare: number } | null {
  if (solved.project.backup === undefined) return null;
  const day = profileDay(solved.project, solved.project.backup, solved.result);
  if (!day.ok) return null;
  return profileDayHours(day.day.intervals, t.dayStartHour, t.dayEndHour);
}

/**
 * The cost settings of a solved chain's yearly cost of the losses with the project's tariff: `cost`
 * (its hours, and the price in force) with the price the cost over the years takes (`tariffPrice`) when
 * the project splits the day and night prices by its load profile and the profile gives a split;
 * else `cost` as it is (the time-weighted mean of costSettingsOf, or a price without the project's tariff).
 */
export function withProfilePrice(solved: Solved, cost: CostSettings): CostSettings {
  const r = solved.project.running;
  if (!r?.dayHoursFromProfile || r.nightPricePerKWh === undefined || r.energyPricePerKWh === undefined) return cost;
  const t = tariffPrice(solved, { ...tariffOfRunning({ ...r, energyPricePerKWh: r.energyPricePerKWh }), dayHoursFromProfile: true });
  return t.split ? { ...cost, pricePerKWh: t.pricePerKWh, profileDayShare: t.split.dayShare } : cost;
}

/**
 * The cost settings of a solved chain as every study prices its losses: the project's (`costSettingsOf`)
 * with the load profile's mean price when the project splits day and night by it (`withProfilePrice`).
 * Null without a price.
 */
export function costSettingsOfSolved(solved: Solved): CostSettings | null {
  const cost = costSettingsOf(solved.project);
  return cost ? withProfilePrice(solved, cost) : null;
}

/** Problems of the cost settings (PROJECT_LEVEL, the project's fields `running.energyPricePerKWh`, `running.hoursPerYear`). */
export function checkCostSettings(settings: CostSettings): Problem[] {
  const out: Problem[] = [];
  const { pricePerKWh: price, hoursPerYear: hours } = settings;
  if (typeof price !== 'number' || !Number.isFinite(price)) {
    out.push({ code: 'invalid-value', elementId: PROJECT_LEVEL, field: PRICE_FIELD, value: price, message: 'the energy price must be a number (per kWh)' });
  } else if (price < 0) {
    out.push({ code: 'invalid-value', elementId: PROJECT_LEVEL, field: PRICE_FIELD, value: price, message: 'the energy price must not be negative' });
  }
  if (typeof hours !== 'number' || !Number.isFinite(hours)) {
    out.push({ code: 'invalid-value', elementId: PROJECT_LEVEL, field: HOURS_FIELD, value: hours, message: 'the hours per year must be a number' });
  } else if (hours < 0 || hours > MAX_HOURS_PER_YEAR) {
    out.push({
      code: 'invalid-value',
      elementId: PROJECT_LEVEL,
      field: HOURS_FIELD,
      value: hours,
      message: `the hours per year must be between 0 and ${MAX_HOURS_PER_YEAR} (a leap year; 8760 runs all year)`,
    });
  }
  return out;
}

/** Cost of an energy in Wh at a price per kWh: E/1000 × price. */
export function energyCost(energyWh: number, pricePerKWh: number): number {
  return (energyWh / 1000) * pricePerKWh;
}

/**
 * The yearly energy and cost of each stage's loss at the solved operating point
 * (E = P_loss × hours, cost = E × price). Loads lose nothing by definition (what they use is the
 * purpose of the chain); the source's own loss (a generator, a bank's internal resistance) counts.
 */
export function lossCostPerYear(result: SolveResult, settings: CostSettings): LossCostOutcome {
  const problems = checkCostSettings(settings);
  if (problems.length) return { ok: false, problems };
  const { pricePerKWh, hoursPerYear } = settings;
  const rows: LossCostRow[] = result.elements
    .filter((e) => e.role !== 'load' && e.loss > ROUND_OFF_W)
    .map((e) => {
      const energyKWh = (e.loss * hoursPerYear) / 1000;
      return { id: e.id, name: e.name, kind: e.kind, lossW: e.loss, energyKWh, cost: energyKWh * pricePerKWh };
    });
  const totalLossW = rows.reduce((s, r) => s + r.lossW, 0);
  const totalEnergyKWh = rows.reduce((s, r) => s + r.energyKWh, 0);
  const totalCost = rows.reduce((s, r) => s + r.cost, 0);
  return { ok: true, cost: { pricePerKWh, hoursPerYear, ...(settings.profileDayShare !== undefined ? { profileDayShare: settings.profileDayShare } : {}), rows, totalLossW, totalEnergyKWh, totalCost } };
}

/** Yearly energy of each flow-control method (Wh, as the pump duty study gives it). */
export interface MethodEnergies {
  speedControl: { energyWh: number };
  throttle: { energyWh: number };
  onOff: { energyWh: number };
}

export interface MethodCosts {
  speedControl: number;
  throttle: number;
  onOff: number;
  /** Throttle cost − drive cost (positive: the drive costs less). */
  savingVsThrottle: number;
  savingVsOnOff: number;
}

/** The yearly energy cost of each flow-control method and the drive's savings (cost = E × price). */
export function pumpDutyCosts(energies: MethodEnergies, pricePerKWh: number): { ok: true; costs: MethodCosts } | { ok: false; problems: Problem[] } {
  const problems = checkCostSettings({ pricePerKWh, hoursPerYear: 0 });
  if (problems.length) return { ok: false, problems };
  const speedControl = energyCost(energies.speedControl.energyWh, pricePerKWh);
  const throttle = energyCost(energies.throttle.energyWh, pricePerKWh);
  const onOff = energyCost(energies.onOff.energyWh, pricePerKWh);
  return { ok: true, costs: { speedControl, throttle, onOff, savingVsThrottle: throttle - speedControl, savingVsOnOff: onOff - speedControl } };
}

/** The yearly cost of the losses as plain text (the command line; money without a currency symbol, the file holds none). */
export function formatLossCost(c: LossCost): string {
  const money = (v: number) => (Math.abs(v) >= 1000 ? Math.round(v).toLocaleString('en-US') : v.toFixed(2));
  const over = c.overProfile;
  const lines = [
    over
      ? `What the losses cost per year (${over.method}; ${over.states} load ${over.states === 1 ? 'state' : 'states'} over ${sigText(over.hoursCovered, 3)} h of the day, h = ${sigText(c.hoursPerYear, 5)} h a year; on average ${sigText(c.pricePerKWh, 4)} per kWh):`
      : `What the losses cost per year (E = loss × ${sigText(c.hoursPerYear, 5)} h, at ${sigText(c.pricePerKWh, 4)} per kWh${c.profileDayShare !== undefined ? `, the day and night prices' mean as the load profile's day uses them (${sigText(c.profileDayShare * 100, 3)} % of its energy in the day-price hours)` : ''}; the operating point held all those hours):`,
  ];
  const width = Math.max(5, ...c.rows.map((r) => r.name.length));
  const lossWidth = over ? 11 : 10;
  lines.push(`  ${'Where'.padEnd(width)}  ${(over ? 'Mean loss W' : 'Loss W').padStart(lossWidth)}  ${'kWh/year'.padStart(10)}  ${'Cost/year'.padStart(10)}`);
  for (const r of c.rows) lines.push(`  ${r.name.padEnd(width)}  ${sigText(r.lossW, 4).padStart(lossWidth)}  ${sigText(r.energyKWh, 4).padStart(10)}  ${money(r.cost).padStart(10)}`);
  lines.push(`  ${'All losses'.padEnd(width)}  ${sigText(c.totalLossW, 4).padStart(lossWidth)}  ${sigText(c.totalEnergyKWh, 4).padStart(10)}  ${money(c.totalCost).padStart(10)}`);
  return lines.join('\n');
}
