/**
 * Recharge, part 1 of 3: the types of the recharge input and result, the charge profile per
 * chemistry and the defaults (recharge.ts holds the model and the entries).
 */
import type { Chemistry, ChemistryPreset, ChemistryValues } from '../../data/battery-chemistries.ts';
import type { Problem } from '../../model/errors.ts';
import { sigText } from '../../model/message.ts';

/** How a chemistry charges (common practice, no single source; override from the charger maker). */
export interface ChargeProfile {
  /** State of charge at which the CC stage hands over to CV when charged at `referenceCRate`, 0…1. */
  cvTransitionSoc: number;
  /** Charge rate at which `cvTransitionSoc` holds, C-rate (1/h). */
  referenceCRate: number;
  /** Bank current at which the CV stage ends, C-rate (1/h). */
  terminationCRate: number;
  /** Coulombic charge efficiency (Ah stored ÷ Ah put in), 0…1. */
  chargeEfficiency: number;
}

/**
 * Defaults per chemistry — common practice (no source):
 * lead-acid reaches its absorption voltage at about 80 % when charged at C/10 and is treated as
 * charged when the absorption current falls to 2 % of C; LiFePO4 holds CC to about 95 % at 0.5C
 * and terminates at 0.05C; NMC hands over near 80 % at 0.5C; vented NiCd about 80 % at 0.2C.
 * Coulombic efficiency: flooded 0.85, VRLA 0.90, lithium 0.99, NiCd 0.75 (NiCd makers ask for
 * 120–140 % charge input).
 */
export const CHARGE_PROFILES: Readonly<Record<Chemistry, ChargeProfile>> = {
  'flooded-lead-acid': { cvTransitionSoc: 0.8, referenceCRate: 0.1, terminationCRate: 0.02, chargeEfficiency: 0.85 },
  'vrla-agm': { cvTransitionSoc: 0.8, referenceCRate: 0.1, terminationCRate: 0.02, chargeEfficiency: 0.9 },
  gel: { cvTransitionSoc: 0.8, referenceCRate: 0.1, terminationCRate: 0.02, chargeEfficiency: 0.9 },
  lifepo4: { cvTransitionSoc: 0.95, referenceCRate: 0.5, terminationCRate: 0.05, chargeEfficiency: 0.99 },
  nmc: { cvTransitionSoc: 0.8, referenceCRate: 0.5, terminationCRate: 0.05, chargeEfficiency: 0.99 },
  nicd: { cvTransitionSoc: 0.8, referenceCRate: 0.2, terminationCRate: 0.02, chargeEfficiency: 0.75 },
};

/** Charger AC→DC efficiency when none is given: common practice (switch-mode chargers 0.85–0.95). */
export const DEFAULT_CHARGER_EFFICIENCY = 0.9;

/** The standing load during the recharge, at the bank: a current, or a power (W). */
export type StandingLoad = { current: number } | { power: number };

/**
 * Where each input lives in the project, for problem messages. Defaults follow the project model
 * (`bank.*` of the battery element, `backup.*` of the study); pass a map to change them.
 */
export interface RechargeFieldPaths {
  chemistry: string;
  overrides: string;
  capacity: string;
  seriesCells: string;
  startSoc: string;
  targetSoc: string;
  chargerCurrent: string;
  chargerEfficiency: string;
  chargeProfile: string;
  standingLoad: string;
  temperature: string;
  targetTime: string;
}

export interface RechargeBase {
  /** Element id used in problems: the battery's id, or PROJECT_LEVEL (default: the project as a whole). */
  elementId?: string;
  chemistry: string;
  overrides?: Partial<ChemistryValues>;
  /** Bank rated capacity (all strings), Ah. */
  capacity: number;
  /** Cells in series (for voltages and a load given in W). */
  seriesCells: number;
  /** State of charge at the start of the recharge (the end of the outage), 0…1. */
  startSoc: number;
  /** State of charge to recharge to; default the state at which the CV stage terminates. */
  targetSoc?: number;
  /** Charger AC→DC efficiency, 0…1 (default 0.9, common practice). */
  chargerEfficiency?: number;
  /** Chemistry charge behaviour, overriding CHARGE_PROFILES. */
  chargeProfile?: Partial<ChargeProfile>;
  /** Load carried by the charger while it recharges; default none. */
  standingLoad?: StandingLoad;
  /** Cell temperature during the recharge, °C (default 25). */
  temperature?: number;
  fields?: Partial<RechargeFieldPaths>;
}

export interface RechargeInput extends RechargeBase {
  /** Charger DC output current rating, A. */
  chargerCurrent: number;
}

export interface ChargerForTimeInput extends RechargeBase {
  /** Time to recharge within, s. */
  targetTime: number;
}

export interface RechargeStep {
  label: string;
  value: number;
  unit: string;
  note: string;
}

export interface Recharge {
  /** Total time, s. */
  time: number;
  /** Constant-current stage, s. */
  constantCurrentTime: number;
  /** Constant-voltage (taper) stage, s. */
  constantVoltageTime: number;
  startSoc: number;
  /** State of charge at which CC hands over to CV for this charger (≤ start when none). */
  transitionSoc: number;
  /** State of charge reached. */
  endSoc: number;
  chargerCurrent: number;
  /** Standing-load current carried by the charger, A. */
  loadCurrent: number;
  /** Current into the bank during the CC stage, A. */
  bankCurrent: number;
  /** Bank current at the end of the CV stage, A. */
  endCurrent: number;
  /** CV time constant τ, s. */
  timeConstant: number;
  /** Charge put into the bank, Ah (before the coulombic loss). */
  chargeIn: number;
  /** Largest AC input power of the charger (CC stage, at the charge voltage), W. */
  acInputPower: number;
  /** AC energy drawn by the charger over the recharge (upper bound), Wh. */
  acInputEnergyWh: number;
  steps: RechargeStep[];
  warnings: string[];
  cautions: string[];
}

export type RechargeOutcome = { ok: true; recharge: Recharge } | { ok: false; problems: Problem[] };

export interface ChargerSizing {
  /** Smallest charger DC current that recharges within the target time, A. */
  chargerCurrent: number;
  /** The recharge with that charger. */
  recharge: Recharge;
  steps: RechargeStep[];
}

export type ChargerOutcome = { ok: true; charger: ChargerSizing } | { ok: false; problems: Problem[] };

export const DEFAULT_FIELDS: RechargeFieldPaths = {
  chemistry: 'bank.chemistry',
  overrides: 'bank.overrides',
  capacity: 'bank.capacityAh',
  seriesCells: 'bank.series',
  startSoc: 'backup.startSoc',
  targetSoc: 'backup.targetSoc',
  chargerCurrent: 'backup.chargerCurrent',
  chargerEfficiency: 'backup.chargerEfficiency',
  chargeProfile: 'backup.chargeProfile',
  standingLoad: 'backup.profile',
  temperature: 'backup.temperatureC',
  targetTime: 'backup.targetRechargeHours',
};

/** The checked model constants (hours and Ah inside; results converted to s). */
export interface Model {
  preset: ChemistryPreset;
  /** The maximum charge rate in the user's words: the maker's figure as given, or a typical value. */
  chargeRateSource: string;
  profile: ChargeProfile;
  fields: RechargeFieldPaths;
  elementId: string;
  capacity: number;
  startSoc: number;
  chargerEfficiency: number;
  loadCurrent: number;
  /** τ, h. */
  tau: number;
  /** Bank current ceiling from the maximum charge C-rate, A. */
  maxBankCurrent: number;
  terminationCurrent: number;
  /** State of charge the recharge ends at. */
  endSoc: number;
  /** Charge voltage of the bank, V. */
  chargeVoltage: number;
  nominalVoltage: number;
}

/** For messages only. */
export function fmt(x: number): string {
  return sigText(x, 4);
}
export function pct(x: number): string {
  return `${fmt(100 * x)} %`;
}
