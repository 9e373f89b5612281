/**
 * The cost over the years of a solved chain: what its losses cost a year under a day/night tariff,
 * its lifetime cost, the payback and break-even year between two options, the CO₂ of the losses and
 * a standby generator's fuel. Pure (no clock, no storage); money in the user's own currency.
 *
 * Methods, each named where it is worked:
 * - Tariff: time-weighted mean price, p̄ = (h_day·p_day + (24 − h_day)·p_night) / 24. The chain's
 *   hours at its solved operating point are taken as spread evenly over the day, unless the settings ask
 *   for the backup study's load profile (`dayHoursFromProfile`): then h_day = 24 × the share of the
 *   profile's day energy used in the day-price hours (energy-weighted mean price, core/model/tariff.ts
 *   `profileDayHours`). A pump duty gives hours at each flow but not their time of day: its total
 *   hours (`dutyHoursPerYear`) can stand for the hours a year, spread evenly.
 * - Yearly energy of the losses: constant operating point, E = P_loss × hours per year
 *   (core/studies/economics.ts); its cost E × p̄.
 * - Lifetime cost: net present value of end-of-year costs, NPV = purchase + Σ_{t=1…N} C_t / (1 + r)^t
 *   (present-worth factor 1/(1 + r)^t; purchase at year 0, undiscounted).
 * - Simple payback: extra purchase ÷ yearly saving, undiscounted, in years.
 * - Break-even year: the first whole year t at which the cumulative present value of the option
 *   that costs more to buy is no more than the other's (null when that never happens within the
 *   years given, or when neither costs more to buy).
 * - CO₂ of the losses: E_loss × grid factor (the user's kg/kWh).
 * - Generator fuel: the fuel curve interpolated linearly between the maker's points at ¼, ½ and full
 *   load (piecewise-linear interpolation); below ¼ the ¼–½ line extended towards no load (its value
 *   at no load, never below 0, is the idle burn); above full load refused. Fuel a year = Σ rate ×
 *   hours over the outages (the chain's source power) and the recharges after them (the charger's
 *   mean input power, its energy ÷ its time, for the recharge time, once per outage).
 */
import type { Problem } from '../model/errors.ts';
import { PROJECT_LEVEL } from '../model/errors.ts';
import type { GeneratorFuel, Project } from '../model/project.ts';
import type { Solved } from '../solve/solved.ts';
import { sigText } from '../model/message.ts';
import { elementWords } from '../model/field-labels.ts';
import { HOURS_IN_YEAR, MAX_HOURS_PER_YEAR } from '../solve/running-schema.ts';
import { DEFAULT_DAY_END_HOUR, DEFAULT_DAY_START_HOUR, lossCostPerYear, meanPrice, tariffPrice, type LossCost } from './economics.ts';
import { lossCostOverProfile } from './loss-over-profile.ts';
import { dayNightTariff } from '../model/tariff.ts';
import { breakEven, netPresentValue, type BreakEven, type CostStream } from './lifetime-money.ts';
import { generatorFuelPerYear, type FuelRun, type GeneratorYear, type RechargeRun } from './lifetime-fuel.ts';

// Its parts: money over time (lifetime-money.ts), the generator's fuel (lifetime-fuel.ts), the text (lifetime-text.ts).
export { breakEven, netPresentValue, presentValue, type BreakEven, type CostStream } from './lifetime-money.ts';
export { fuelRate, generatorFuelPerYear, typicalFuelFigures, TYPICAL_FUEL_NOTE, type FuelRun, type GeneratorYear, type RechargeRun } from './lifetime-fuel.ts';
export { formatLifetimeCost } from './lifetime-text.ts';

// The tariff's mean price and default day hours live with the yearly cost (economics.ts), which prices by them too.
export { DEFAULT_DAY_END_HOUR, DEFAULT_DAY_START_HOUR, meanPrice };
/**
 * Rated power factor of a generating set: its real-power rating is its VA rating × 0.8 (ISO 8528-1
 * rates generating sets at a lagging power factor of 0.8; from memory).
 */
export const GENERATOR_RATED_POWER_FACTOR = 0.8;

/** The cost settings of the lifetime cost, read from the project's `running` (lifetimeSettingsOf). */
export interface LifetimeSettings {
  /** Day price (the only price without a night price), currency units per kWh. */
  dayPricePerKWh: number;
  nightPricePerKWh?: number;
  dayStartHour: number;
  dayEndHour: number;
  /** Split the day and night prices as the backup study's load profile uses its day (default: evenly). */
  dayHoursFromProfile?: boolean;
  hoursPerYear: number;
  years: number;
  /** Fraction per year (0.05 = 5 %). */
  discountRate: number;
  gridCo2KgPerKWh?: number;
  generator?: GeneratorFuel;
}

/**
 * The lifetime settings of a project: null without an energy price or without years of service
 * (nothing to count over the years). Defaults: all year (8760 h), day price 07:00–23:00, discount 0.
 */
export function lifetimeSettingsOf(project: Pick<Project, 'running'>): LifetimeSettings | null {
  const r = project.running;
  if (r?.energyPricePerKWh === undefined || r.years === undefined) return null;
  return {
    dayPricePerKWh: r.energyPricePerKWh,
    ...(r.nightPricePerKWh !== undefined ? { nightPricePerKWh: r.nightPricePerKWh } : {}),
    dayStartHour: r.dayStartHour ?? DEFAULT_DAY_START_HOUR,
    dayEndHour: r.dayEndHour ?? DEFAULT_DAY_END_HOUR,
    ...(r.dayHoursFromProfile ? { dayHoursFromProfile: true } : {}),
    hoursPerYear: r.hoursPerYear ?? HOURS_IN_YEAR,
    years: r.years,
    discountRate: r.discountRate ?? 0,
    ...(r.gridCo2KgPerKWh !== undefined ? { gridCo2KgPerKWh: r.gridCo2KgPerKWh } : {}),
    ...(r.generator !== undefined ? { generator: r.generator } : {}),
  };
}

const bad = (field: string, value: unknown, message: string): Problem => ({ code: 'invalid-value', elementId: PROJECT_LEVEL, field, value, message });
const finite = (v: unknown): v is number => typeof v === 'number' && Number.isFinite(v);

/**
 * Problems of the lifetime settings (the project's `running.*` fields): the single-field limits of
 * core/solve/running-schema.ts again (a caller may build settings by hand) and the cross-field
 * rules the schema cannot state: the day ends after it starts, fuel rises with load.
 */
export function checkLifetimeSettings(s: LifetimeSettings): Problem[] {
  const out: Problem[] = [];
  const nonNegative = (field: string, v: unknown, what: string) => {
    if (!finite(v) || v < 0) out.push(bad(field, v, `must be a number of at least 0 (${what})`));
  };
  nonNegative('running.energyPricePerKWh', s.dayPricePerKWh, 'a price per kWh');
  if (s.nightPricePerKWh !== undefined) nonNegative('running.nightPricePerKWh', s.nightPricePerKWh, 'a price per kWh');
  if (!finite(s.hoursPerYear) || s.hoursPerYear < 0 || s.hoursPerYear > MAX_HOURS_PER_YEAR) out.push(bad('running.hoursPerYear', s.hoursPerYear, 'must be between 0 and 8784 h'));
  if (!Number.isInteger(s.years) || s.years < 1 || s.years > 100) out.push(bad('running.years', s.years, 'must be a whole number of years from 1 to 100'));
  if (!finite(s.discountRate) || s.discountRate < 0 || s.discountRate > 1) out.push(bad('running.discountRate', s.discountRate, 'must be between 0 and 100 %'));
  if (s.gridCo2KgPerKWh !== undefined) nonNegative('running.gridCo2KgPerKWh', s.gridCo2KgPerKWh, 'kg per kWh');
  const hour = (v: unknown) => finite(v) && v >= 0 && v <= 24;
  if (!hour(s.dayStartHour)) out.push(bad('running.dayStartHour', s.dayStartHour, 'must be an hour of the day, 0 to 24'));
  if (!hour(s.dayEndHour)) out.push(bad('running.dayEndHour', s.dayEndHour, 'must be an hour of the day, 0 to 24'));
  else if (hour(s.dayStartHour) && s.dayEndHour <= s.dayStartHour) out.push(bad('running.dayEndHour', s.dayEndHour, 'must be later than the hour the day price starts'));
  if (s.generator) out.push(...checkFuelCurve(s.generator));
  return out;
}

/** The fuel figures must be positive and must not fall as the load rises (a maker's table never does). */
function checkFuelCurve(g: GeneratorFuel): Problem[] {
  const out: Problem[] = [];
  const points: [keyof GeneratorFuel, unknown][] = [
    ['quarterLoadLitresPerHour', g.quarterLoadLitresPerHour],
    ['halfLoadLitresPerHour', g.halfLoadLitresPerHour],
    ['fullLoadLitresPerHour', g.fullLoadLitresPerHour],
  ];
  for (const [k, v] of points) if (!finite(v) || v <= 0) out.push(bad(`running.generator.${k}`, v, 'must be greater than 0 L/h'));
  if (out.length) return out;
  if (g.halfLoadLitresPerHour < g.quarterLoadLitresPerHour) out.push(bad('running.generator.halfLoadLitresPerHour', g.halfLoadLitresPerHour, 'must not be less than the fuel at ¼ load (fuel rises with load)'));
  if (g.fullLoadLitresPerHour < g.halfLoadLitresPerHour) out.push(bad('running.generator.fullLoadLitresPerHour', g.fullLoadLitresPerHour, 'must not be less than the fuel at ½ load (fuel rises with load)'));
  if (!finite(g.outageHoursPerYear) || g.outageHoursPerYear < 0 || g.outageHoursPerYear > MAX_HOURS_PER_YEAR) out.push(bad('running.generator.outageHoursPerYear', g.outageHoursPerYear, 'must be between 0 and 8784 h'));
  if (g.ratedPower !== undefined && (!finite(g.ratedPower) || g.ratedPower <= 0)) out.push(bad('running.generator.ratedPower', g.ratedPower, 'must be greater than 0 W'));
  if (g.outagesPerYear !== undefined && (!Number.isInteger(g.outagesPerYear) || g.outagesPerYear < 0)) out.push(bad('running.generator.outagesPerYear', g.outagesPerYear, 'must be a whole number of at least 0'));
  if (g.fuelPricePerLitre !== undefined && (!finite(g.fuelPricePerLitre) || g.fuelPricePerLitre < 0)) out.push(bad('running.generator.fuelPricePerLitre', g.fuelPricePerLitre, 'must be a number of at least 0'));
  return out;
}

/** The cost over the years of one solved chain (`lifetimeCost`). */
export interface LifetimeCost {
  /** Mean price per kWh under the tariff and the day-price hours (24 without a night price). */
  pricePerKWh: number;
  dayHours: number;
  /** Where the day-price hours come from: the tariff's hours (the load spread evenly) or the load profile's energy. */
  dayHoursFrom: 'tariff hours' | 'load profile';
  hoursPerYear: number;
  years: number;
  discountRate: number;
  /** The losses' yearly energy and cost at the mean price, per element (core/studies/economics.ts). */
  losses: LossCost;
  /** Sum of the elements' purchase prices, and the elements without one (by name). */
  purchase: number;
  priced: { id: string; name: string; price: number }[];
  unpriced: { id: string; name: string }[];
  /** Yearly cost counted in the lifetime: the losses' energy, plus the generator's fuel when a fuel price is given. */
  yearlyCost: number;
  /** Net present value: purchase + Σ yearly cost / (1 + r)^t, t = 1…N. */
  npv: number;
  /** The losses' CO₂ a year, kg (with a grid factor). */
  co2KgPerYear?: number;
  generator?: GeneratorYear;
  /** What was assumed, in words (the hours spread over the day, what the generator carries). */
  notes: string[];
}

export type LifetimeOutcome = { ok: true; cost: LifetimeCost } | { ok: false; problems: Problem[] };

/**
 * The cost over the years of a solved chain, the entry the page and the variants call:
 * purchase (Σ element prices), the losses' yearly energy and cost under the tariff, their CO₂,
 * the generator's fuel, and the lifetime cost (NPV). `settings` defaults to the project's own
 * (`lifetimeSettingsOf`); `recharge` is the backup study's recharge after one outage, when known.
 */
export function lifetimeCost(solved: Solved, settings?: LifetimeSettings | null, recharge?: RechargeRun): LifetimeOutcome {
  const s = settings ?? lifetimeSettingsOf(solved.project);
  if (!s) return { ok: false, problems: [bad('running.years', undefined, 'are needed, with the energy price, for the cost over the years')] };
  const problems = checkLifetimeSettings(s);
  if (problems.length) return { ok: false, problems };
  // The mean price, the profile's split when asked for: the same function as the yearly cost of the losses (economics.ts).
  const { pricePerKWh, dayHours, split } = tariffPrice(solved, s);
  // Over the load profile's day when the project asks (loss-over-profile.ts): each stretch at its hours' price.
  const tariff = dayNightTariff(s);
  const lc = lossCostOverProfile(solved, { pricePerKWh, hoursPerYear: s.hoursPerYear, ...(tariff ? { tariff } : {}) }) ?? lossCostPerYear(solved.result, { pricePerKWh, hoursPerYear: s.hoursPerYear });
  if (!lc.ok) return lc;
  const over = lc.cost.overProfile;
  // Elements named as messages name them: their name, or the kind's label and place ("Utility supply #1").
  const { names } = elementWords(solved.project);
  const priced: { id: string; name: string; price: number }[] = [];
  const unpriced: { id: string; name: string }[] = [];
  for (const e of solved.project.elements) {
    const name = names.get(e.id) ?? e.id;
    if (e.price !== undefined) priced.push({ id: e.id, name, price: e.price });
    else unpriced.push({ id: e.id, name });
  }
  const purchase = priced.reduce((sum, p) => sum + p.price, 0);
  const notes = [
    over
      ? `the losses worked out over the load profile's day (${over.states} load ${over.states === 1 ? 'state' : 'states'}, each solved through the chain; ${over.method}): they pay ${sigText(lc.cost.pricePerKWh, 4)} per kWh on average`
      : split
      ? `mean price ${sigText(pricePerKWh, 4)} per kWh: the load profile's day uses ${sigText(split.dayShare * 100, 3)} % of its energy while the day price runs (${sigText(s.dayStartHour, 3)} to ${sigText(s.dayEndHour, 3)} h), so the day price counts for ${sigText(dayHours, 3)} h of 24 (the mean weighted by the profile's energy)`
      : s.nightPricePerKWh !== undefined
      ? `mean price ${sigText(pricePerKWh, 4)} per kWh: the day price for ${sigText(dayHours, 3)} h, the night price for ${sigText(24 - dayHours, 3)} h, the ${sigText(s.hoursPerYear, 5)} h a year spread evenly over the day`
      : `one price, ${sigText(pricePerKWh, 4)} per kWh, for the ${sigText(s.hoursPerYear, 5)} h a year at this load`,
  ];
  // The hours are at the solved operating point: a load profile or pump duty in the project is not read here (its own study prices it).
  if (!over && s.dayHoursFromProfile && s.nightPricePerKWh !== undefined && !split) {
    notes.push('the day and night hours are spread evenly: the project has no load profile that uses energy (the battery backup study\'s day)');
  }
  const dutyHours = dutyHoursPerYear(solved.project);
  if (dutyHours !== null && Math.abs(dutyHours - s.hoursPerYear) <= 1e-9 * dutyHours) {
    notes.push(`the ${sigText(dutyHours, 5)} h a year are the pump duty's; it says how long at each flow, not when in the day, so they are spread evenly over the day`);
  } else if (!over && split === null && (solved.project.backup !== undefined || solved.project.pumpDuty !== undefined)) {
    notes.push(`the losses are those of the solved operating point for ${sigText(s.hoursPerYear, 5)} h a year; the project's ${solved.project.pumpDuty !== undefined ? 'pump duty' : 'load profile'} is not read here`);
  }
  let generator: GeneratorYear | undefined;
  if (s.generator) {
    const g = s.generator;
    const root = solved.project.elements.find((e) => !('from' in e) || e.from === undefined);
    const rootResult = solved.result.elements.find((e) => e.role === 'source');
    const ratedFromGen = root?.kind === 'generator' && root.ratedApparentPower !== undefined ? root.ratedApparentPower * GENERATOR_RATED_POWER_FACTOR : undefined;
    const ratedPowerW = g.ratedPower ?? ratedFromGen;
    if (ratedPowerW === undefined) return { ok: false, problems: [bad('running.generator.ratedPower', undefined, 'is needed: the chain\'s source is not a generator with a rating to take it from')] };
    const runs: { what: FuelRun['what']; powerW: number; hoursPerYear: number }[] = [];
    // The generator carries the chain through the outages when it feeds the chain (its source is the supply or the generator itself).
    if ((root?.kind === 'grid' || root?.kind === 'generator') && rootResult) {
      runs.push({ what: 'outages', powerW: rootResult.pOut, hoursPerYear: g.outageHoursPerYear });
      if (root.kind === 'grid' && g.outageHoursPerYear > 0) notes.push('the losses are priced at the energy price for all their hours, outages included (the generator\'s fuel is counted beside them)');
    } else notes.push('the bank carries the outages; the generator runs only the recharges');
    const outages = g.outagesPerYear ?? 0;
    if (recharge && outages > 0 && recharge.timeSeconds > 0) {
      const hours = recharge.timeSeconds / 3600;
      runs.push({ what: 'recharges', powerW: recharge.energyWh / hours, hoursPerYear: hours * outages });
    } else if (outages > 0) notes.push('no recharge counted: the battery backup study gives none (it needs a charger current)');
    const fuel = generatorFuelPerYear(g, ratedPowerW, runs);
    if (!fuel.ok) return fuel;
    generator = { ...fuel.fuel, ratedPowerFrom: g.ratedPower !== undefined ? 'settings' : 'generator rating' };
    // Below ¼ load the table is extended, not read; and long light running is what generator makers warn against (common practice (no source)).
    for (const r of fuel.fuel.runs) {
      if (r.hoursPerYear > 0 && r.loadFraction < 0.25) {
        notes.push(`the generator runs at ${sigText(r.loadFraction * 100, 3)} % of its rating through the ${r.what}: below ¼ load its fuel is the ¼–½ line of the table extended towards no load (an estimate), and makers give a minimum load for long runs (light running leaves unburnt fuel in the engine and exhaust); use the maker's figure`);
      }
    }
    if (g.ratedPower === undefined) notes.push(`generator rated power ${sigText(ratedPowerW / 1000, 4)} kW: its rating in kVA × 0.8, the rated power factor of generating sets`);
  }
  const yearlyCost = lc.cost.totalCost + (generator?.fuelCostPerYear ?? 0);
  const npv = netPresentValue(purchase, yearlyCost, s.discountRate, s.years);
  return {
    ok: true,
    cost: {
      // Over the profile: the mean the losses pay (Σ cost ÷ Σ E), each stretch at its hours' price.
      pricePerKWh: over ? lc.cost.pricePerKWh : pricePerKWh,
      dayHours,
      dayHoursFrom: split || over ? 'load profile' : 'tariff hours',
      hoursPerYear: s.hoursPerYear,
      years: s.years,
      discountRate: s.discountRate,
      losses: lc.cost,
      purchase,
      priced,
      unpriced,
      yearlyCost,
      npv,
      ...(s.gridCo2KgPerKWh !== undefined ? { co2KgPerYear: lc.cost.totalEnergyKWh * s.gridCo2KgPerKWh } : {}),
      ...(generator ? { generator } : {}),
      notes,
    },
  };
}

/** The hours a year of a project's pump duty (Σ hours over its duty points), or null without one. */
export function dutyHoursPerYear(project: Pick<Project, 'pumpDuty'>): number | null {
  const duty = project.pumpDuty?.duty;
  if (!duty || duty.length === 0) return null;
  return duty.reduce((sum, d) => sum + d.hours, 0);
}

/** An option's cost stream from its lifetime cost: the purchase and the same yearly cost for each year of service. */
export function costStream(c: LifetimeCost): CostStream {
  return { purchase: c.purchase, yearly: Array.from({ length: c.years }, () => c.yearlyCost) };
}

/** Payback and break-even between two solved options under one set of settings (the variants call it). */
export function compareLifetime(a: LifetimeCost, b: LifetimeCost): BreakEven {
  return breakEven(costStream(a), costStream(b), a.discountRate);
}

/**
 * Payback and break-even between two solved options (two variants of a project): each one's
 * lifetime cost under the same settings (default: the first option's project's own), then
 * `compareLifetime`. Refused with the first refusal's problems.
 */
export function compareSolved(a: Solved, b: Solved, settings?: LifetimeSettings | null): { ok: true; a: LifetimeCost; b: LifetimeCost; comparison: BreakEven } | { ok: false; problems: Problem[] } {
  const s = settings ?? lifetimeSettingsOf(a.project);
  const la = lifetimeCost(a, s);
  if (!la.ok) return la;
  const lb = lifetimeCost(b, s);
  if (!lb.ok) return lb;
  return { ok: true, a: la.cost, b: lb.cost, comparison: compareLifetime(la.cost, lb.cost) };
}

