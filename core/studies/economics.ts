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
import type { ElementKind } from '../model/project.ts';
import type { SolveResult } from '../model/result.ts';

/** Hours in a leap year (366 × 24): the most a year can hold. */
export const MAX_HOURS_PER_YEAR = 8784;
/** Hours in a common year (365 × 24): running all year round. */
export const HOURS_IN_YEAR = 8760;

/** Losses smaller than this (W) are solver round-off, not a stage that loses power. */
const ROUND_OFF_W = 1e-9;

export interface CostSettings {
  /** Price of energy, currency units per kWh (≥ 0). */
  pricePerKWh: number;
  /** Hours per year the chain runs at the solved operating point (0 … 8784). */
  hoursPerYear: number;
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

export interface LossCost {
  pricePerKWh: number;
  hoursPerYear: number;
  /** One row per source or stage that loses power, in the result's order. */
  rows: LossCostRow[];
  totalLossW: number;
  totalEnergyKWh: number;
  totalCost: number;
}

export type LossCostOutcome = { ok: true; cost: LossCost } | { ok: false; problems: Problem[] };

/** Problems of the cost settings (PROJECT_LEVEL, fields `pricePerKWh`, `hoursPerYear`). */
export function checkCostSettings(settings: CostSettings): Problem[] {
  const out: Problem[] = [];
  const { pricePerKWh: price, hoursPerYear: hours } = settings;
  if (typeof price !== 'number' || !Number.isFinite(price)) {
    out.push({ code: 'invalid-value', elementId: PROJECT_LEVEL, field: 'pricePerKWh', value: price, message: 'the energy price must be a number (per kWh)' });
  } else if (price < 0) {
    out.push({ code: 'invalid-value', elementId: PROJECT_LEVEL, field: 'pricePerKWh', value: price, message: 'the energy price must not be negative' });
  }
  if (typeof hours !== 'number' || !Number.isFinite(hours)) {
    out.push({ code: 'invalid-value', elementId: PROJECT_LEVEL, field: 'hoursPerYear', value: hours, message: 'the hours per year must be a number' });
  } else if (hours < 0 || hours > MAX_HOURS_PER_YEAR) {
    out.push({
      code: 'invalid-value',
      elementId: PROJECT_LEVEL,
      field: 'hoursPerYear',
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
  return { ok: true, cost: { pricePerKWh, hoursPerYear, rows, totalLossW, totalEnergyKWh, totalCost } };
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
