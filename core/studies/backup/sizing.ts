/**
 * Battery bank sizing — the inverse of the runtime study: for a duty cycle (and optionally a target
 * runtime), the smallest bank. Pure: no clock, no storage; inputs are never mutated.
 *
 * Methods (each step is returned as data so a user can check it by hand):
 *
 * 1. Series count from the bus voltage: n = round(V_bus / (V_cell,nominal × cells per block)).
 *
 * 2. Lead-acid (flooded, AGM, gel) — the IEEE 485 duty-cycle worksheet; NiCd — the same worksheet
 *    as IEEE 1115 uses it (from memory: the two standards share the method).
 *    Section S covers periods 1…S. Its size is
 *        F_S = Σ_{P=1..S} (A_P − A_{P−1}) · K_t,   t = Σ_{j=P..S} M_j  (time from the start of
 *    period P to the end of section S), with A_0 = 0. K_t is the capacity rating factor: rated Ah
 *    ÷ the current the cell can deliver for t to its end voltage. The uncorrected size is
 *    max_S F_S (+ a random load × its K_t, worksheet line 10); the cell size is that × temperature
 *    correction × design margin × aging factor (the 1997 edition's single temperature factor after
 *    the uncorrected size; the 2010 edition's per-row T_t gives the same result when one
 *    temperature governs the whole duty cycle).
 *    K_t comes from a datasheet table when one is given (log–log interpolation between its points,
 *    refused outside them), otherwise from Peukert's law in the rated-capacity form
 *    t = H·(C/(I·H))^k  ⇒  K_t = C/I = H·(t/H)^(1/k)  (hours of rated capacity per ampere),
 *    with H the chemistry's rated hours and k its Peukert exponent. Peukert's law far from H
 *    overstates what a cell delivers for minutes, so with Peukert K_t the chemistry's maximum
 *    continuous discharge C-rate also bounds the size (a datasheet K_t table is trusted instead,
 *    and a rate above the C-rate is only flagged).
 *    Design (`design`, default 'backup'): a backup design sizes to the end-of-discharge voltage
 *    only, as IEEE 485 / IEEE 1115 size standby cells (K_t is rated to that end voltage), and the
 *    runtime study then discharges to it. A cycling design adds the depth-of-discharge limit
 *    (not part of IEEE 485): the smallest C whose usable share DoD·C ÷ (temperature × design margin ×
 *    aging) covers the Peukert-equivalent charge of the duty cycle as the runtime study counts it,
 *    Σ I·max(1, I·H/C)^(k−1)·t with I_rated = C/H of the bank itself — so a bank sized here also
 *    passes the runtime study.
 *    Temperature correction: lead-acid from IEEE 485 Table 1 (core/data/ieee-485.ts), held at
 *    1.00 above 25 °C unless credit is asked for; NiCd: IEEE 1115 takes the derating from the
 *    maker (from memory), here 1 / capacity factor of the chemistry's capacity-vs-temperature table.
 *
 * 3. Lithium (LiFePO4, NMC) — energy method (common practice):
 *        E = Σ P_P·M_P (energy at the bank terminals over the duty cycle; for a current duty
 *            cycle P_P = A_P × nominal bank voltage),
 *        Wh = E ÷ (usable DoD × capacity factor at temperature) × design margin × aging factor,
 *        Ah = Wh ÷ nominal bank voltage,
 *    then the peak current is checked against the maximum continuous discharge C-rate: the bank
 *    must have at least I_peak ÷ C-rate Ah (more capacity or more strings when it fails).
 *    Peukert effects are neglected for lithium (k ≈ 1.0–1.05).
 *
 * 4. Strings: in the user's module (`moduleAh`, the block or cell of the bank as given), whole
 *    strings n = ⌈required Ah ÷ module Ah⌉ in parallel, each of the series blocks; with a list of
 *    standard ratings instead, the fewest strings (up to `maxStrings`) for which a rating covers
 *    required Ah ÷ strings, then the smallest such rating; continuous otherwise.
 *
 * Constant-power worksheet: with a maker's constant-power table (`powerFactors`: watts per cell per
 * rated Ah to the end voltage for t), the worksheet runs on watts per cell in place of amperes,
 * F_S = Σ (P_P − P_{P−1})/cells · K_t^W, K_t^W = 1 ÷ (W per cell per Ah) — the same section
 * arithmetic (it is linear in the load), as makers size constant-power (UPS) duty from their
 * W/cell tables.
 *
 * Temperature outside the tables: below IEEE 485 Table 1 (−3.9 °C) the capacity (1 ÷ factor) is
 * extrapolated linearly from the two coldest rows (never below the coldest factor), as the runtime
 * study extrapolates the chemistry's capacity table (core/physics/bank.ts capacityFactorAt);
 * refused farther than 20 °C out.
 *
 * Constant-power duty cycles are converted to current at a stated voltage: by default the minimum
 * bank voltage (end-of-discharge cell voltage × cells), the conservative choice — the current of a
 * constant-power load is highest there.
 */
import { TYPICAL_VALUE, bankCautions, depthOfDischargeApplies, designBasis, isLithium, type BankDesign } from './cautions.ts';
import { MAX_TEMPERATURE_EXTRAPOLATION_C, capacityFactorAt as extrapolatedCapacityFactor } from '../../physics/bank.ts';
import {
  CHEMISTRIES,
  CHEMISTRY_PRESETS,
  type CapacityTemperaturePoint,
  type Chemistry,
  type ChemistryPreset,
  type ChemistryValues,
} from '../../data/battery-chemistries.ts';
import {
  IEEE_485_DEFAULT_AGING_FACTOR,
  IEEE_485_DEFAULT_DESIGN_MARGIN,
  IEEE_485_TEMPERATURE_FACTORS,
} from '../../data/ieee-485.ts';
import type { Problem, ProblemCode } from '../../model/errors.ts';

// ---------------------------------------------------------------------------------------------
// Types
// ---------------------------------------------------------------------------------------------

/** One period of constant current at the bank terminals. Duration in s, current in A. */
export interface CurrentPeriod {
  duration: number;
  current: number;
}

/** One period of constant power at the bank terminals. Duration in s, power in W. */
export interface PowerPeriod {
  duration: number;
  power: number;
}

/**
 * The duty cycle at the bank terminals, first period first.
 * - `current`: currents as given.
 * - `power`: converted to current at `voltage` (V); default the minimum bank voltage
 *   (end-of-discharge cell voltage × cells in series), the conservative choice.
 */
export type DutyCycle =
  | { basis: 'current'; periods: readonly CurrentPeriod[] }
  | { basis: 'power'; periods: readonly PowerPeriod[]; voltage?: number };

/** A random (non-continuous) load of the worksheet: its current or power and its duration (s). */
export type RandomLoad = { duration: number; current: number } | { duration: number; power: number };

/**
 * One point of a maker's constant-power table: the watts one cell gives per rated Ah for `time`
 * (s) to the end voltage (W/cell/Ah).
 */
export interface PowerFactorPoint {
  time: number;
  wattsPerCellPerAh: number;
}

/** One point of a datasheet capacity-rating-factor table: K_t (h = rated Ah per A) at time t (s). */
export interface CapacityFactorPoint {
  time: number;
  factor: number;
}

/**
 * Where each input lives in the project, for problem messages. Defaults follow the project model
 * (`bank.*` of the battery element, `backup.*` of the study); pass a map to change them.
 */
export interface SizingFieldPaths {
  chemistry: string;
  overrides: string;
  busVoltage: string;
  dutyCycle: string;
  targetRuntime: string;
  designMargin: string;
  agingFactor: string;
  temperature: string;
  ratings: string;
  capacityFactors: string;
  cellsPerBlock: string;
  seriesBlocks: string;
  maxStrings: string;
  randomLoad: string;
  design: string;
  moduleAh: string;
  powerFactors: string;
}

export interface SizingInput {
  /** Element id used in problems: the battery's id, or "project" (default). */
  elementId?: string;
  /** Chemistry preset name (see core/data/battery-chemistries.ts). */
  chemistry: string;
  /** Datasheet values overriding the preset. */
  overrides?: Partial<ChemistryValues>;
  /** Nominal system (bus) voltage, V. */
  busVoltage: number;
  dutyCycle: DutyCycle;
  /**
   * Target runtime, s (optional). When given, the duty cycle is taken over exactly this time:
   * repeated from its start when shorter, cut when longer.
   */
  targetRuntime?: number;
  /** Design margin, ≥ 1 (default 1.10, IEEE 485 common practice). */
  designMargin?: number;
  /** Aging factor, ≥ 1 (default per chemistry: 1.25, see DEFAULT_AGING_FACTOR). */
  agingFactor?: number;
  /** Lowest expected electrolyte / cell temperature, °C (default 25). */
  temperature?: number;
  /**
   * Lead-acid only: take credit for capacity above 25 °C (IEEE 485 Table 1 factors below 1.00).
   * Default false, as the note to that table advises.
   */
  creditAbove25C?: boolean;
  /**
   * What the bank is for (default 'backup'): lead-acid and NiCd are sized to the end voltage only
   * (IEEE 485 / IEEE 1115 standby sizing) in a backup design, and also for the usable depth of
   * discharge in a cycling design. Lithium is sized for its usable depth of discharge in both.
   */
  design?: BankDesign;
  /**
   * Lead-acid and NiCd: overrides what `design` implies (true: also size for the usable depth of
   * discharge, as a cycling design does; false: the end voltage only, as a backup design does).
   */
  limitDepthOfDischarge?: boolean;
  /**
   * Capacity of the user's module (the block or cell of one string, Ah at the rated hours): the
   * bank comes in whole strings of it, n = ⌈required ÷ module⌉. Ignored when `ratings` are given.
   */
  moduleAh?: number;
  /** A maker's constant-power table (W per cell per Ah at t) for a power duty cycle (see header). */
  powerFactors?: readonly PowerFactorPoint[];
  /** Standard capacity ratings per string, Ah (rated at the chemistry's rated hours). Omitted: continuous. */
  ratings?: readonly number[];
  /** Datasheet K_t table for the worksheet (lead-acid, NiCd); default Peukert's law. */
  capacityFactors?: readonly CapacityFactorPoint[];
  /** Cells per block (e.g. 6 for a 12 V lead-acid block); default 1 (single cells). */
  cellsPerBlock?: number;
  /** Blocks in series, when the user fixes it; default from the bus voltage. */
  seriesBlocks?: number;
  /** Largest number of parallel strings considered (default 4, common practice). */
  maxStrings?: number;
  /** Random load added at its own K_t (worksheet line 10) or energy (lithium). */
  randomLoad?: RandomLoad;
  /** Field paths for problems. */
  fields?: Partial<SizingFieldPaths>;
}

/** One line of the working: a named quantity, its value and unit, and how it was obtained. */
export interface SizingStep {
  label: string;
  value: number;
  unit: string;
  note: string;
}

/** One row of a worksheet section: period P inside section S. */
export interface WorksheetRow {
  period: number;
  /** A_P, A. */
  current: number;
  /** A_P − A_{P−1}, A. */
  change: number;
  /** M_P, s. */
  duration: number;
  /** Time from the start of period P to the end of the section, s. */
  timeToEnd: number;
  /** K_t at that time, h (rated Ah per A). */
  capacityFactor: number;
  /** (A_P − A_{P−1}) × K_t, Ah. */
  size: number;
}

export interface WorksheetSection {
  section: number;
  rows: WorksheetRow[];
  /** Sum of the positive row sizes, Ah. */
  positive: number;
  /** Sum of the negative row sizes, Ah. */
  negative: number;
  /** F_S, Ah. */
  total: number;
  /**
   * False when A_{S+1} > A_S: the worksheet need not evaluate this section (it cannot govern).
   * It is computed anyway; the maximum is unchanged.
   */
  needed: boolean;
  /**
   * Set when the worksheet size inside the section's last period (before its end) is larger than
   * F_S: time into that period (s) and the size there, Ah. See `interiorPeak`.
   */
  interiorPeak?: { time: number; size: number };
}

export type SizingMethod = 'ieee-485-worksheet' | 'ieee-1115-worksheet' | 'energy';

/** What set the size: a worksheet section, the energy, or the discharge-rate limit. */
export type GoverningLimit =
  | { kind: 'section'; section: number }
  | { kind: 'energy' }
  | { kind: 'discharge-rate' }
  | { kind: 'depth-of-discharge' };

export interface BankSizing {
  method: SizingMethod;
  /** The design sized for (lead-acid and NiCd: 'cycling' when the depth of discharge bounded it). */
  design: BankDesign;
  /** Where the discharge ends and what sized the bank, in words (the runtime study says the same). */
  basis: string;
  /** The bank in the user's words, e.g. "3 strings × 200 Ah = 600 Ah, 30.7 kWh". */
  summary: string;
  /** The worksheet's load column: amperes, or watts per cell with a maker's constant-power table. */
  worksheetBasis: 'current' | 'power-per-cell';
  chemistry: Chemistry;
  /** Cells in series. */
  seriesCells: number;
  cellsPerBlock: number;
  /** Blocks (or cells, when cellsPerBlock = 1) in series. */
  seriesBlocks: number;
  strings: number;
  /** Capacity per string at the chemistry's rated hours, Ah. */
  capacityPerString: number;
  /** Bank capacity = strings × capacity per string, Ah. */
  bankCapacity: number;
  /** Nominal bank energy = nominal voltage × bank Ah, Wh. */
  bankEnergyWh: number;
  /** Usable energy = nominal energy × usable depth of discharge, Wh. */
  usableEnergyWh: number;
  nominalVoltage: number;
  /** End-of-discharge voltage of the bank (cells × cut-off per cell), V. */
  minimumVoltage: number;
  /** Capacity required before rounding to a rating, Ah (whole bank). */
  requiredCapacity: number;
  governing: GoverningLimit;
  /** Peak current of the duty cycle (with any random load), A. */
  peakCurrent: number;
  /**
   * The duty cycle actually sized for, as currents at the bank terminals (for the worksheet, the
   * periods its sections number).
   */
  periods: CurrentPeriod[];
  /** Worksheet sections (lead-acid and NiCd); empty for the energy method. */
  sections: WorksheetSection[];
  steps: SizingStep[];
  /** Things to check (assumptions stretched, limits near). */
  warnings: string[];
  /** Safety and scope cautions that always go with a sizing. */
  cautions: string[];
}

export type SizingOutcome = { ok: true; sizing: BankSizing } | { ok: false; problems: Problem[] };

// ---------------------------------------------------------------------------------------------
// Defaults (common practice unless marked)
// ---------------------------------------------------------------------------------------------

/**
 * Aging factor per chemistry. Lead-acid: IEEE 485 (replace at 80 % of rated capacity, 1/0.8 =
 * 1.25; from memory). NiCd: IEEE 1115 uses the same 1.25 (from memory). Lithium: 1.25 for an end of
 * life at 80 % of rated capacity, common practice (no source) — use the maker's end-of-life figure.
 */
export const DEFAULT_AGING_FACTOR: Readonly<Record<Chemistry, number>> = {
  'flooded-lead-acid': IEEE_485_DEFAULT_AGING_FACTOR,
  'vrla-agm': IEEE_485_DEFAULT_AGING_FACTOR,
  gel: IEEE_485_DEFAULT_AGING_FACTOR,
  nicd: 1.25,
  lifepo4: 1.25,
  nmc: 1.25,
};

/** Design margin, IEEE 485 common practice (1.10–1.15). */
export const DEFAULT_DESIGN_MARGIN = IEEE_485_DEFAULT_DESIGN_MARGIN;

/** Parallel strings considered at most, common practice (no source): more strings share poorly. */
export const DEFAULT_MAX_STRINGS = 4;

/** Above this many periods only the governing section keeps its rows (the table would be n²/2 rows). */
const MAX_PERIODS_WITH_ROWS = 60;

/** Long profiles: neighbouring worksheet periods within this fraction are joined (see sizeBank). */
const NEAR_CURRENT = 0.005;

/** Reference temperature of rated capacity, °C. */
const RATED_TEMPERATURE = 25;

const DEFAULT_FIELDS: SizingFieldPaths = {
  chemistry: 'bank.chemistry',
  overrides: 'bank.overrides',
  busVoltage: 'bank.series',
  dutyCycle: 'backup.profile',
  targetRuntime: 'backup.targetRuntimeHours',
  designMargin: 'backup.designMargin',
  agingFactor: 'backup.agingFactor',
  temperature: 'backup.temperatureC',
  ratings: 'backup.standardCapacitiesAh',
  capacityFactors: 'backup.capacityFactors',
  cellsPerBlock: 'bank.cellsPerBlock',
  seriesBlocks: 'bank.series',
  maxStrings: 'backup.maxStrings',
  randomLoad: 'backup.randomLoad',
  design: 'backup.design',
  moduleAh: 'bank.capacityAh',
  powerFactors: 'backup.powerFactors',
};

// ---------------------------------------------------------------------------------------------
// Shared helpers (also used by recharge.ts)
// ---------------------------------------------------------------------------------------------

const LEAD_ACID: ReadonlySet<Chemistry> = new Set<Chemistry>(['flooded-lead-acid', 'vrla-agm', 'gel']);

export const isLeadAcid = (c: Chemistry): boolean => LEAD_ACID.has(c);

/** Builds a problem; `value` is kept only when JSON can carry it. */
export function problem(
  code: ProblemCode,
  elementId: string,
  field: string,
  value: unknown,
  message: string,
): Problem {
  return { code, elementId, field, value, message };
}

const isFiniteNumber = (x: unknown): x is number => typeof x === 'number' && Number.isFinite(x);

/**
 * The chemistry preset with datasheet overrides applied, or problems naming the field.
 * Only the values these modules use are checked here; the bank model checks the rest.
 */
export function resolvePreset(
  chemistry: string,
  overrides: Partial<ChemistryValues> | undefined,
  elementId: string,
  chemistryField: string,
  overridesField: string,
): { ok: true; preset: ChemistryPreset } | { ok: false; problems: Problem[] } {
  if (!(CHEMISTRIES as readonly string[]).includes(chemistry)) {
    return {
      ok: false,
      problems: [
        problem(
          'unknown-chemistry',
          elementId,
          chemistryField,
          chemistry,
          `unknown chemistry "${String(chemistry)}": use one of ${CHEMISTRIES.join(', ')}`,
        ),
      ],
    };
  }
  const preset: ChemistryPreset = { ...CHEMISTRY_PRESETS[chemistry as Chemistry], ...(overrides ?? {}) };
  const problems: Problem[] = [];
  const f = (name: keyof ChemistryValues) => `${overridesField}.${name}`;
  const positiveFields: (keyof ChemistryValues)[] = [
    'nominalCellVoltage',
    'endOfDischargeCellVoltage',
    'ratedHours',
    'maxDischargeCRate',
    'maxChargeCRate',
    'chargeCellVoltage',
  ];
  for (const name of positiveFields) {
    const v = preset[name];
    if (!isFiniteNumber(v) || v <= 0) problems.push(problem('invalid-value', elementId, f(name), v, 'must be a number greater than 0'));
  }
  if (!isFiniteNumber(preset.peukertExponent) || preset.peukertExponent < 1 || preset.peukertExponent > 2) {
    problems.push(problem('invalid-value', elementId, f('peukertExponent'), preset.peukertExponent, 'Peukert exponent must be between 1 and 2'));
  }
  const dod = preset.usableDepthOfDischarge;
  if (!isFiniteNumber(dod) || dod <= 0 || dod > 1) {
    problems.push(problem('invalid-value', elementId, f('usableDepthOfDischarge'), dod, 'usable depth of discharge must be greater than 0 and at most 1'));
  }
  if (
    isFiniteNumber(preset.endOfDischargeCellVoltage) &&
    isFiniteNumber(preset.nominalCellVoltage) &&
    preset.endOfDischargeCellVoltage >= preset.nominalCellVoltage
  ) {
    problems.push(
      problem('invalid-value', elementId, f('endOfDischargeCellVoltage'), preset.endOfDischargeCellVoltage, `cut-off voltage must be below the nominal cell voltage (${preset.nominalCellVoltage} V)`),
    );
  }
  const table = preset.capacityVsTemperature;
  if (
    !Array.isArray(table) ||
    table.length === 0 ||
    table.some((p, i) => !isFiniteNumber(p.temperatureC) || !isFiniteNumber(p.capacityFactor) || p.capacityFactor <= 0 || (i > 0 && p.temperatureC <= table[i - 1]!.temperatureC))
  ) {
    problems.push(
      problem('invalid-value', elementId, f('capacityVsTemperature'), table, 'capacity vs temperature must list rising temperatures with capacity factors greater than 0'),
    );
  }
  return problems.length > 0 ? { ok: false, problems } : { ok: true, preset };
}

/** Linear interpolation in a table of rising x; null outside [x_0, x_last]. */
export function interpolate(xs: readonly number[], ys: readonly number[], x: number): number | null {
  const n = xs.length;
  if (n === 0 || x < xs[0]! || x > xs[n - 1]!) return null;
  if (n === 1) return ys[0]!;
  let i = 1;
  while (i < n - 1 && xs[i]! < x) i++;
  const x0 = xs[i - 1]!;
  const x1 = xs[i]!;
  const y0 = ys[i - 1]!;
  const y1 = ys[i]!;
  return x1 === x0 ? y1 : y0 + ((y1 - y0) * (x - x0)) / (x1 - x0);
}

/** Capacity factor at a temperature from the chemistry's table (linear interpolation), null outside. */
export function capacityFactorAt(table: readonly CapacityTemperaturePoint[], temperature: number): number | null {
  return interpolate(
    table.map((p) => p.temperatureC),
    table.map((p) => p.capacityFactor),
    temperature,
  );
}

/**
 * IEEE 485 Table 1 cell-size temperature correction factor at an electrolyte temperature (°C):
 * linear interpolation on the standard's own °C column; null outside −3.9…51.7 °C (see
 * `leadAcidTemperatureFactor` for the sizing's conservative extrapolation below the table).
 */
export function ieee485TemperatureFactor(temperature: number): number | null {
  return interpolate(
    IEEE_485_TEMPERATURE_FACTORS.map((r) => r.celsius),
    IEEE_485_TEMPERATURE_FACTORS.map((r) => r.factor),
    temperature,
  );
}

/**
 * The sizing's lead-acid temperature factor: IEEE 485 Table 1 inside it; below −3.9 °C the capacity
 * (1 ÷ factor) extrapolated linearly from the two coldest rows (−3.9 °C 1.52, −1.1 °C 1.43), as the
 * runtime study extrapolates the same rows of the chemistry's capacity table (bank.ts), so the two
 * agree; never below the coldest factor, up to MAX_TEMPERATURE_EXTRAPOLATION_C below the table; above 51.7 °C 1.00 without
 * credit (the table's note), refused with credit (extrapolating would flatter the capacity).
 * Null when refused.
 */
export function leadAcidTemperatureFactor(temperature: number, credit: boolean): { raw: number; extrapolated: boolean } | null {
  const inside = ieee485TemperatureFactor(temperature);
  if (inside !== null) return { raw: inside, extrapolated: false };
  const rows = IEEE_485_TEMPERATURE_FACTORS;
  const first = rows[0]!;
  const second = rows[1]!;
  if (temperature < first.celsius) {
    if (first.celsius - temperature > MAX_TEMPERATURE_EXTRAPOLATION_C) return null;
    const slope = (1 / second.factor - 1 / first.factor) / (second.celsius - first.celsius);
    const capacity = 1 / first.factor + slope * (temperature - first.celsius);
    if (!(capacity > 0)) return null;
    return { raw: Math.max(first.factor, 1 / capacity), extrapolated: true };
  }
  return credit ? null : { raw: 1, extrapolated: true };
}

/**
 * Capacity rating factor from Peukert's law (rated-capacity form t = H·(C/(I·H))^k):
 * K_t = C/I = H·(t/H)^(1/k), in hours; t and H in hours.
 */
export function peukertCapacityFactor(tHours: number, ratedHours: number, k: number): number {
  return ratedHours * Math.pow(tHours / ratedHours, 1 / k);
}

/** K_t from a datasheet table (times in s, K in h): log–log interpolation; null outside the table. */
export function tableCapacityFactor(table: readonly CapacityFactorPoint[], timeS: number): number | null {
  const v = interpolate(
    table.map((p) => Math.log(p.time)),
    table.map((p) => Math.log(p.factor)),
    Math.log(timeS),
  );
  return v === null ? null : Math.exp(v);
}

// ---------------------------------------------------------------------------------------------
// Input checks
// ---------------------------------------------------------------------------------------------

interface Checked {
  elementId: string;
  preset: ChemistryPreset;
  fields: SizingFieldPaths;
  designMargin: number;
  agingFactor: number;
  temperature: number;
  maxStrings: number;
  cellsPerBlock: number;
}

function checkFactor(
  out: Problem[],
  elementId: string,
  field: string,
  v: unknown,
  what: string,
): void {
  if (!isFiniteNumber(v)) out.push(problem('invalid-value', elementId, field, v, `${what} must be a number`));
  else if (v < 1) out.push(problem('invalid-value', elementId, field, v, `${what} must be at least 1 (it multiplies the size)`));
}

function checkPeriods(out: Problem[], elementId: string, field: string, duty: DutyCycle): void {
  if (!Array.isArray(duty.periods) || duty.periods.length === 0) {
    out.push(problem('invalid-value', elementId, `${field}.periods`, duty.periods, 'the duty cycle needs at least one period'));
    return;
  }
  const key = duty.basis === 'current' ? 'current' : 'power';
  const unit = duty.basis === 'current' ? 'A' : 'W';
  duty.periods.forEach((p, i) => {
    const base = `${field}.periods[${i}]`;
    if (!isFiniteNumber(p.duration) || p.duration <= 0) {
      out.push(problem('invalid-value', elementId, `${base}.duration`, p.duration, 'period duration must be greater than 0 s'));
    }
    const v = (p as unknown as Record<string, unknown>)[key];
    if (!isFiniteNumber(v) || v < 0) {
      out.push(problem('invalid-value', elementId, `${base}.${key}`, v, `period ${key} must be a number of at least 0 ${unit} (charging periods are not part of a discharge duty cycle)`));
    }
  });
  if (duty.basis === 'power' && duty.voltage !== undefined && (!isFiniteNumber(duty.voltage) || duty.voltage <= 0)) {
    out.push(problem('invalid-value', elementId, `${field}.voltage`, duty.voltage, 'conversion voltage must be greater than 0 V'));
  }
}

function checkInput(input: SizingInput): { ok: true; c: Checked } | { ok: false; problems: Problem[] } {
  const elementId = input.elementId ?? 'project';
  const fields: SizingFieldPaths = { ...DEFAULT_FIELDS, ...(input.fields ?? {}) };
  const resolved = resolvePreset(input.chemistry, input.overrides, elementId, fields.chemistry, fields.overrides);
  if (!resolved.ok) return resolved;
  const preset = resolved.preset;
  const out: Problem[] = [];

  if (!isFiniteNumber(input.busVoltage) || input.busVoltage <= 0) {
    out.push(problem('invalid-value', elementId, fields.busVoltage, input.busVoltage, 'bus voltage must be greater than 0 V'));
  }
  if (input.dutyCycle === null || typeof input.dutyCycle !== 'object' || (input.dutyCycle.basis !== 'current' && input.dutyCycle.basis !== 'power')) {
    out.push(problem('invalid-value', elementId, fields.dutyCycle, input.dutyCycle, 'duty cycle must be a list of current or power periods'));
  } else {
    checkPeriods(out, elementId, fields.dutyCycle, input.dutyCycle);
  }
  if (input.targetRuntime !== undefined && (!isFiniteNumber(input.targetRuntime) || input.targetRuntime <= 0)) {
    out.push(problem('invalid-value', elementId, fields.targetRuntime, input.targetRuntime, 'target runtime must be greater than 0'));
  } else if (input.targetRuntime !== undefined && Array.isArray(input.dutyCycle?.periods)) {
    const repeated = repeatedPeriods(input.dutyCycle.periods, input.targetRuntime);
    if (repeated > MAX_REPEATED_PERIODS) {
      out.push(
        problem(
          'invalid-value',
          elementId,
          fields.targetRuntime,
          input.targetRuntime,
          `the duty cycle would have to repeat into ${repeated > 1e15 ? 'far more than 10^15' : Math.ceil(repeated)} periods to fill the target runtime; at most ${MAX_REPEATED_PERIODS}: give a duty cycle closer to the target runtime`,
        ),
      );
    }
  }
  const designMargin = input.designMargin ?? DEFAULT_DESIGN_MARGIN;
  checkFactor(out, elementId, fields.designMargin, designMargin, 'design margin');
  const agingFactor = input.agingFactor ?? DEFAULT_AGING_FACTOR[preset.chemistry];
  checkFactor(out, elementId, fields.agingFactor, agingFactor, 'aging factor');

  const temperature = input.temperature ?? RATED_TEMPERATURE;
  if (!isFiniteNumber(temperature)) {
    out.push(problem('invalid-value', elementId, fields.temperature, temperature, 'temperature must be a number (°C)'));
  } else if (isLeadAcid(preset.chemistry)) {
    if (leadAcidTemperatureFactor(temperature, input.creditAbove25C === true) === null) {
      const rows = IEEE_485_TEMPERATURE_FACTORS;
      out.push(
        problem(
          'outside-table',
          elementId,
          fields.temperature,
          temperature,
          temperature < rows[0]!.celsius
            ? `electrolyte temperature ${temperature} °C is more than ${MAX_TEMPERATURE_EXTRAPOLATION_C} °C below IEEE 485 Table 1 (${rows[0]!.celsius} °C to ${rows[rows.length - 1]!.celsius} °C); give the maker\u2019s capacity at this temperature`
            : `electrolyte temperature ${temperature} °C is above IEEE 485 Table 1 (up to ${rows[rows.length - 1]!.celsius} °C): no credit for heat can be taken there`,
        ),
      );
    }
  } else {
    const c = extrapolatedCapacityFactor(preset.capacityVsTemperature, temperature);
    if (c.refused !== undefined) out.push(problem('outside-table', elementId, fields.temperature, temperature, `cell temperature: ${c.refused}`));
  }

  if (input.ratings !== undefined) {
    if (!Array.isArray(input.ratings) || input.ratings.length === 0) {
      out.push(problem('invalid-value', elementId, fields.ratings, input.ratings, 'give at least one standard rating, or leave the list out for a continuous size'));
    } else {
      input.ratings.forEach((r, i) => {
        if (!isFiniteNumber(r) || r <= 0) out.push(problem('invalid-value', elementId, `${fields.ratings}[${i}]`, r, 'a capacity rating must be greater than 0 Ah'));
      });
    }
  }
  if (input.capacityFactors !== undefined) {
    const t = input.capacityFactors;
    // One point is a maker's figure for a single time (a one-period duty cycle of that length).
    if (!Array.isArray(t) || t.length < 1) {
      out.push(problem('invalid-value', elementId, fields.capacityFactors, t, 'a K_t table needs at least one point'));
    } else {
      t.forEach((p, i) => {
        const base = `${fields.capacityFactors}[${i}]`;
        if (!isFiniteNumber(p.time) || p.time <= 0) out.push(problem('invalid-value', elementId, `${base}.time`, p.time, 'time must be greater than 0 s'));
        else if (i > 0 && isFiniteNumber(t[i - 1]!.time) && p.time <= t[i - 1]!.time) out.push(problem('invalid-value', elementId, `${base}.time`, p.time, 'times must rise from one point to the next'));
        if (!isFiniteNumber(p.factor) || p.factor <= 0) out.push(problem('invalid-value', elementId, `${base}.factor`, p.factor, 'K_t must be greater than 0 h'));
      });
    }
    if (!isLeadAcid(preset.chemistry) && preset.chemistry !== 'nicd') {
      out.push(problem('invalid-value', elementId, fields.capacityFactors, t, 'a K_t table applies to the lead-acid and NiCd worksheet only; lithium is sized by energy'));
    }
  }
  if (input.moduleAh !== undefined && (!isFiniteNumber(input.moduleAh) || input.moduleAh <= 0)) {
    out.push(problem('invalid-value', elementId, fields.moduleAh, input.moduleAh, 'the module capacity must be greater than 0 Ah'));
  }
  if (input.design !== undefined && input.design !== 'backup' && input.design !== 'cycling') {
    out.push(problem('invalid-value', elementId, fields.design, input.design, 'design must be "backup" or "cycling"'));
  }
  if (input.powerFactors !== undefined) {
    const t = input.powerFactors;
    if (!Array.isArray(t) || t.length < 1) {
      out.push(problem('invalid-value', elementId, fields.powerFactors, t, 'a constant-power table needs at least one point'));
    } else {
      t.forEach((p, i) => {
        const base = `${fields.powerFactors}[${i}]`;
        if (!isFiniteNumber(p.time) || p.time <= 0) out.push(problem('invalid-value', elementId, `${base}.time`, p.time, 'time must be greater than 0 s'));
        else if (i > 0 && isFiniteNumber(t[i - 1]!.time) && p.time <= t[i - 1]!.time) out.push(problem('invalid-value', elementId, `${base}.time`, p.time, 'times must rise from one point to the next'));
        if (!isFiniteNumber(p.wattsPerCellPerAh) || p.wattsPerCellPerAh <= 0) out.push(problem('invalid-value', elementId, `${base}.wattsPerCellPerAh`, p.wattsPerCellPerAh, 'W per cell per Ah must be greater than 0'));
      });
    }
    if (!isLeadAcid(preset.chemistry) && preset.chemistry !== 'nicd') {
      out.push(problem('invalid-value', elementId, fields.powerFactors, t, 'a constant-power table applies to the lead-acid and NiCd worksheet only; lithium is sized by energy'));
    }
    if (input.capacityFactors !== undefined) out.push(problem('invalid-value', elementId, fields.powerFactors, t, 'give either a K_t table (amperes) or a constant-power table (watts per cell), not both'));
    if (input.dutyCycle?.basis !== 'power') out.push(problem('invalid-value', elementId, fields.powerFactors, t, 'a constant-power table needs a duty cycle given in watts'));
    if (input.randomLoad !== undefined && 'current' in input.randomLoad) out.push(problem('invalid-value', elementId, `${fields.randomLoad}.current`, input.randomLoad.current, 'with a constant-power table give the random load in watts'));
  }
  const cellsPerBlock = input.cellsPerBlock ?? 1;
  if (!Number.isInteger(cellsPerBlock) || cellsPerBlock < 1) {
    out.push(problem('invalid-value', elementId, fields.cellsPerBlock, cellsPerBlock, 'cells per block must be a whole number of at least 1'));
  }
  if (input.seriesBlocks !== undefined && (!Number.isInteger(input.seriesBlocks) || input.seriesBlocks < 1)) {
    out.push(problem('invalid-value', elementId, fields.seriesBlocks, input.seriesBlocks, 'blocks in series must be a whole number of at least 1'));
  }
  const maxStrings = input.maxStrings ?? DEFAULT_MAX_STRINGS;
  if (!Number.isInteger(maxStrings) || maxStrings < 1) {
    out.push(problem('invalid-value', elementId, fields.maxStrings, maxStrings, 'maximum strings must be a whole number of at least 1'));
  }
  if (input.randomLoad !== undefined) {
    const r = input.randomLoad;
    if (!isFiniteNumber(r.duration) || r.duration <= 0) out.push(problem('invalid-value', elementId, `${fields.randomLoad}.duration`, r.duration, 'random-load duration must be greater than 0 s'));
    const v = 'current' in r ? r.current : r.power;
    if (!isFiniteNumber(v) || v < 0) out.push(problem('invalid-value', elementId, `${fields.randomLoad}.${'current' in r ? 'current' : 'power'}`, v, 'random load must be a number of at least 0'));
  }
  if (out.length > 0) return { ok: false, problems: out };
  return { ok: true, c: { elementId, preset, fields, designMargin, agingFactor, temperature, maxStrings, cellsPerBlock } };
}

// ---------------------------------------------------------------------------------------------
// Steps of the sizing
// ---------------------------------------------------------------------------------------------

/** The duty cycle over exactly `target` seconds: repeated from its start, or cut. */
/**
 * Most periods a duty cycle may be repeated or cut into to fill the target runtime (the run of a
 * study holds at most about as many steps: core/solve/load-profile.ts, MAX_STEPS + MAX_LOAD_CHANGES).
 */
export const MAX_REPEATED_PERIODS = 1_100_000;

/** How many periods `fitToRuntime` would give: the cycle's periods × the repeats it takes (an upper bound). */
export function repeatedPeriods(periods: readonly { duration: number }[], target: number): number {
  const total = periods.reduce((s, p) => s + (Number.isFinite(p.duration) && p.duration > 0 ? p.duration : 0), 0);
  if (!(total > 0)) return 0;
  return periods.length * Math.ceil(target / total);
}

export function fitToRuntime<T extends { duration: number }>(periods: readonly T[], target: number): T[] {
  const out: T[] = [];
  let left = target;
  const total = periods.reduce((s, p) => s + p.duration, 0);
  // Relative slack so a duty cycle that matches the target to rounding is not cut into a sliver.
  const eps = 1e-9 * target;
  while (left > eps && total > 0) {
    for (const p of periods) {
      if (left <= eps) break;
      const d = Math.min(p.duration, left);
      out.push({ ...p, duration: d });
      left -= d;
    }
  }
  return out;
}

/** Picks strings × rating per string for a required capacity (see header, step 4). */
function chooseStrings(
  required: number,
  ratings: readonly number[] | undefined,
  maxStrings: number,
): { strings: number; perString: number } | null {
  if (ratings === undefined) return { strings: 1, perString: required };
  const sorted = [...ratings].sort((a, b) => a - b);
  for (let n = 1; n <= maxStrings; n++) {
    // Tolerance for a required size equal to a rating up to rounding.
    const need = (required / n) * (1 - 1e-12);
    const r = sorted.find((x) => x >= need);
    if (r !== undefined) return { strings: n, perString: r };
  }
  return null;
}

/**
 * Sizes the smallest bank for a duty cycle. Returns every step, worksheet section and factor, or
 * problems naming the field (nothing is computed from bad input).
 */
export function sizeBank(input: SizingInput): SizingOutcome {
  const checked = checkInput(input);
  if (!checked.ok) return checked;
  const { elementId, preset, fields, designMargin, agingFactor, temperature, maxStrings, cellsPerBlock } = checked.c;
  const steps: SizingStep[] = [];
  const warnings: string[] = [];
  const step = (label: string, value: number, unit: string, note: string) => steps.push({ label, value, unit, note });
  // Where a preset value came from, in the user's words (the provenance marks stay in the data file).
  const userSource = (k: keyof ChemistryValues) => (input.overrides?.[k] !== undefined ? 'maker\u2019s figure, as given' : TYPICAL_VALUE);

  // 1. Series count from the bus voltage.
  const blockVoltage = preset.nominalCellVoltage * cellsPerBlock;
  const seriesBlocks = input.seriesBlocks ?? Math.max(1, Math.round(input.busVoltage / blockVoltage));
  const seriesCells = seriesBlocks * cellsPerBlock;
  const nominalVoltage = seriesCells * preset.nominalCellVoltage;
  const minimumVoltage = seriesCells * preset.endOfDischargeCellVoltage;
  step('Nominal cell voltage', preset.nominalCellVoltage, 'V', `${preset.label} (${userSource('nominalCellVoltage')})`);
  step(
    cellsPerBlock > 1 ? 'Blocks in series' : 'Cells in series',
    seriesBlocks,
    '',
    input.seriesBlocks !== undefined ? 'as given' : `round(${input.busVoltage} V ÷ ${round(blockVoltage)} V)`,
  );
  step('Nominal bank voltage', nominalVoltage, 'V', `${seriesCells} cells × ${preset.nominalCellVoltage} V`);
  step('Minimum bank voltage', minimumVoltage, 'V', `${seriesCells} cells × ${preset.endOfDischargeCellVoltage} V/cell end of discharge (${userSource('endOfDischargeCellVoltage')})`);
  if (Math.abs(nominalVoltage - input.busVoltage) > 0.05 * input.busVoltage) {
    warnings.push(
      `The nominal bank voltage ${round(nominalVoltage)} V differs from the bus voltage ${input.busVoltage} V by more than 5 %: check the equipment's input range.`,
    );
  }

  // 2. Duty cycle as currents at the bank terminals.
  const duty = input.dutyCycle;
  let voltageBasis = minimumVoltage;
  let periods: CurrentPeriod[];
  if (duty.basis === 'current') {
    periods = duty.periods.map((p) => ({ duration: p.duration, current: p.current }));
  } else {
    voltageBasis = duty.voltage ?? minimumVoltage;
    step(
      'Voltage for power → current',
      voltageBasis,
      'V',
      duty.voltage !== undefined ? 'as given' : 'minimum bank voltage (conservative: a constant-power load draws most current there)',
    );
    periods = duty.periods.map((p) => ({ duration: p.duration, current: p.power / voltageBasis }));
  }
  if (input.targetRuntime !== undefined) {
    const total = periods.reduce((s, p) => s + p.duration, 0);
    periods = fitToRuntime(periods, input.targetRuntime);
    step(
      'Duty cycle length',
      input.targetRuntime,
      's',
      Math.abs(total - input.targetRuntime) <= 1e-9 * input.targetRuntime
        ? 'equals the target runtime'
        : total < input.targetRuntime
          ? `the ${round(total)} s duty cycle repeated from its start to the target runtime`
          : `the ${round(total)} s duty cycle cut at the target runtime`,
    );
  }
  // Neighbouring equal periods joined: the worksheet and the energy are unchanged by it.
  periods = mergeEqualPeriods(periods);
  const powerPeriods: PowerPeriod[] | null =
    duty.basis === 'power'
      ? input.targetRuntime !== undefined
        ? fitToRuntime(duty.periods, input.targetRuntime)
        : duty.periods.map((p) => ({ duration: p.duration, power: p.power }))
      : null;
  let energyWh =
    powerPeriods !== null
      ? powerPeriods.reduce((s, p) => s + (p.power * p.duration) / 3600, 0)
      : periods.reduce((s, p) => s + (p.current * nominalVoltage * p.duration) / 3600, 0);
  const random = input.randomLoad;
  const randomCurrent = random === undefined ? 0 : 'current' in random ? random.current : random.power / voltageBasis;
  const peakCurrent = Math.max(...periods.map((p) => p.current)) + randomCurrent;
  if (!(peakCurrent > 0)) {
    return {
      ok: false,
      problems: [problem('invalid-value', elementId, fields.dutyCycle, input.dutyCycle, 'the duty cycle draws no current: there is nothing to size')],
    };
  }
  step('Peak current', peakCurrent, 'A', random !== undefined ? 'largest period current + random load' : 'largest period current');

  const worksheet = isLeadAcid(preset.chemistry) || preset.chemistry === 'nicd';
  // The design: a backup design sizes lead-acid and NiCd to the end voltage only; an explicit
  // limitDepthOfDischarge decides it (and the basis then says the design it amounts to).
  const limitDoD = worksheet ? (input.limitDepthOfDischarge ?? depthOfDischargeApplies(preset.chemistry, input.design ?? 'backup')) : true;
  const design: BankDesign = worksheet ? (limitDoD ? 'cycling' : 'backup') : (input.design ?? 'backup');
  const powerTable = worksheet ? input.powerFactors : undefined;
  let sections: WorksheetSection[] = [];
  let worksheetPeriods: CurrentPeriod[] = periods;
  let required: number;
  let governing: GoverningLimit;
  let method: SizingMethod;

  if (worksheet) {
    method = preset.chemistry === 'nicd' ? 'ieee-1115-worksheet' : 'ieee-485-worksheet';
    // With a maker's constant-power table, K_t^W = 1 ÷ (W per cell per Ah), in the same log–log form.
    const table: readonly CapacityFactorPoint[] | undefined =
      powerTable !== undefined ? powerTable.map((p) => ({ time: p.time, factor: 1 / p.wattsPerCellPerAh })) : input.capacityFactors;
    const tableField = powerTable !== undefined ? fields.powerFactors : fields.capacityFactors;
    let loadColumn = periods;
    if (powerTable !== undefined && powerPeriods !== null) {
      // The worksheet's load column in watts per cell (the duty cycle's power ÷ cells in series).
      loadColumn = mergeEqualPeriods(powerPeriods.map((p) => ({ duration: p.duration, current: p.power / seriesCells })));
      step('Load per cell', Math.max(...loadColumn.map((p) => p.current)), 'W', `largest period power ÷ ${seriesCells} cells; the worksheet runs on watts per cell`);
    }
    // First time the datasheet table does not cover (NaN while none).
    const missing = { time: Number.NaN };
    const kAt = (timeS: number): number => {
      if (table !== undefined) {
        const k = tableCapacityFactor(table, timeS);
        if (k === null) {
          if (Number.isNaN(missing.time)) missing.time = timeS;
          return Number.NaN;
        }
        return k;
      }
      return peukertCapacityFactor(timeS / 3600, preset.ratedHours, preset.peukertExponent);
    };
    step(
      'Capacity rating factor K_t',
      table !== undefined ? table.length : preset.peukertExponent,
      table !== undefined ? 'points' : '',
      powerTable !== undefined
        ? 'K_t = 1 ÷ (W per cell per Ah) from the maker\u2019s constant-power table given (log–log interpolation)'
        : table !== undefined
          ? 'from the datasheet table given (log–log interpolation)'
          : `Peukert's law: K_t = H·(t/H)^(1/k), H = ${preset.ratedHours} h, k = ${preset.peukertExponent} (${userSource('peukertExponent')})`,
    );
    // A long sampled profile: neighbours within 0.5 % joined at the higher current (conservative:
    // the size never falls when a current rises), so the O(n²) worksheet stays quick.
    const merged = loadColumn.length > MAX_PERIODS_WITH_ROWS ? mergeNearPeriods(loadColumn, NEAR_CURRENT) : loadColumn;
    if (merged.length < loadColumn.length) {
      step(
        'Worksheet periods',
        merged.length,
        '',
        `${loadColumn.length} periods; neighbours within ${NEAR_CURRENT * 100} % joined at the higher current (conservative)`,
      );
    }
    worksheetPeriods = merged;
    sections = worksheetSections(merged, kAt, merged.length <= MAX_PERIODS_WITH_ROWS);
    if (!Number.isNaN(missing.time) && table !== undefined) {
      return {
        ok: false,
        problems: [
          problem(
            'outside-table',
            elementId,
            tableField,
            missing.time,
            `the worksheet needs K_t at ${round(missing.time)} s; the table given spans ${table[0]!.time} s to ${table[table.length - 1]!.time} s — extend it from the datasheet`,
          ),
        ],
      };
    }
    // Inside a period the superposition can rise above both of its ends (a load step down earlier
    // is credited along a concave K_t): a section is also sized at its largest point inside its
    // last period, so the size never falls when the duty cycle is cut later (a longer target).
    const endMax = sections.reduce((m, x) => Math.max(m, x.total), -Infinity);
    const minTime = table === undefined ? 0 : table[0]!.time;
    let floor = endMax;
    // Peukert's K_t is concave with K(0) = 0, so over period i the sum can exceed its end value F_i
    // by at most |ΔA_i|·K(M_i) (a step down at i) + N·(K(M_{i−1} + M_i) − K(M_{i−1})), N the sum of
    // the earlier steps down (each increment K(d + M_i) − K(d) is largest at the smallest d): a
    // cheap test that skips most periods of a long profile before the exact search.
    let stepsDown = 0;
    const candidates: { x: WorksheetSection; bound: number }[] = [];
    for (const x of sections) {
      const i = x.section - 1;
      const m = merged[i]!.duration;
      const change = merged[i]!.current - (i > 0 ? merged[i - 1]!.current : 0);
      const before = stepsDown;
      if (change < 0) stepsDown -= change;
      if (table === undefined) {
        const prev = i > 0 ? merged[i - 1]!.duration : 0;
        const quick = x.total + (change < 0 ? -change * kAt(m) : 0) + (i > 0 ? before * (kAt(prev + m) - kAt(prev)) : 0);
        if (!(quick > floor * (1 + 1e-12))) continue;
      }
      const bound = interiorBound(merged, i, kAt, minTime);
      if (bound > floor * (1 + 1e-12)) candidates.push({ x, bound });
    }
    // Best first: the largest bound is searched first, and the floor it raises prunes the rest.
    candidates.sort((p, q) => q.bound - p.bound);
    for (const { x, bound } of candidates) {
      if (!(bound > floor * (1 + 1e-12))) break;
      const peak = interiorPeak(merged, x.section - 1, kAt, floor, minTime);
      if (peak !== null) {
        x.interiorPeak = peak;
        floor = Math.max(floor, peak.size);
      }
    }
    const sizeOf = (x: WorksheetSection) => Math.max(x.total, x.interiorPeak?.size ?? -Infinity);
    let best = sections[0]!;
    for (const s of sections) if (sizeOf(s) > sizeOf(best)) best = s;
    if (merged.length > MAX_PERIODS_WITH_ROWS) {
      best.rows = worksheetSection(merged, best.section - 1, kAt, true).rows;
      warnings.push(
        `The duty cycle has ${merged.length} periods: every section's total is listed, but the period rows of the governing section S${best.section} only.`,
      );
    }
    if (best.interiorPeak !== undefined && best.interiorPeak.size > best.total) {
      step(
        'Maximum section size',
        best.interiorPeak.size,
        'Ah',
        `section S${best.section} of ${sections.length} at ${round(best.interiorPeak.time / 60)} min into its last period, where the worksheet sum is ${round(best.interiorPeak.size)} Ah, above its ${round(best.total)} Ah at the period end (worksheet line 9, taken at its largest: conservative)`,
      );
    } else {
      step('Maximum section size', best.total, 'Ah', `section S${best.section} of ${sections.length} (worksheet line 9)`);
    }
    let uncorrected = sizeOf(best);
    if (random !== undefined) {
      const kr = kAt(random.duration);
      if (Number.isNaN(kr)) {
        return {
          ok: false,
          problems: [problem('outside-table', elementId, `${fields.randomLoad}.duration`, random.duration, 'the random load\u2019s duration lies outside the K_t table given')],
        };
      }
      const randomLoad = powerTable !== undefined && 'power' in random ? random.power / seriesCells : randomCurrent;
      step('Random-load section size', randomLoad * kr, 'Ah', `${round(randomLoad)} ${powerTable !== undefined ? 'W per cell' : 'A'} × K_t ${round(kr)} at ${random.duration} s (worksheet line 10)`);
      uncorrected += randomLoad * kr;
    }
    step('Uncorrected size', uncorrected, 'Ah', 'worksheet line 11');

    let tempFactor: number;
    if (isLeadAcid(preset.chemistry)) {
      const t = leadAcidTemperatureFactor(temperature, input.creditAbove25C === true)!;
      const raw = t.raw;
      tempFactor = raw < 1 && !input.creditAbove25C ? 1 : raw;
      step(
        'Temperature correction factor',
        tempFactor,
        '',
        t.extrapolated && temperature < 25
          ? `${temperature} °C is below IEEE 485 Table 1: the capacity (1 ÷ factor) extrapolated linearly from its two coldest rows (−3.9 °C 1.52, −1.1 °C 1.43), never below 1.52; use the maker\u2019s figure for this temperature`
          : t.extrapolated
            ? `${temperature} °C is above IEEE 485 Table 1: 1.00, no credit for heat (the note to Table 1)`
            : `IEEE 485 Table 1 at ${temperature} °C${raw < 1 && !input.creditAbove25C ? ` (table gives ${raw}; held at 1.00 above 25 °C as the note to the table advises)` : ''}`,
      );
      if (t.extrapolated && temperature < 25) warnings.push(`${temperature} °C is below IEEE 485 Table 1 (from −3.9 °C): its temperature factor ${round(tempFactor)} is extrapolated from the two coldest rows; ask the cell maker for the capacity at this temperature.`);
    } else {
      const c = extrapolatedCapacityFactor(preset.capacityVsTemperature, temperature);
      tempFactor = 1 / c.factor;
      step(
        'Temperature derating factor',
        tempFactor,
        '',
        `1 ÷ capacity factor at ${temperature} °C (IEEE 1115 takes it from the maker; ${userSource('capacityVsTemperature')}${c.extrapolated ? '; outside the table: extrapolated along its end slope, never above its end value' : ''})`,
      );
    }
    step('Design margin', designMargin, '', input.designMargin === undefined ? 'default 1.10 (IEEE 485 worksheet line 13; 1.10–1.15 is usual)' : 'as given');
    step('Aging factor', agingFactor, '', input.agingFactor === undefined ? 'default 1.25 (IEEE 485 worksheet line 14: replaced at 80 % of rated capacity, 1 ÷ 0.80)' : 'as given');
    const worksheetSize = uncorrected * tempFactor * designMargin * agingFactor;
    step('Required size (worksheet)', worksheetSize, 'Ah', 'uncorrected × temperature × design margin × aging');
    required = worksheetSize;
    governing = { kind: 'section', section: best.section };

    const rateSize = peakCurrent / preset.maxDischargeCRate;
    if (table === undefined) {
      // Peukert extrapolated to minutes overstates the deliverable current; the C-rate bounds it.
      step(
        'Size for the discharge-rate limit',
        rateSize,
        'Ah',
        `peak ${round(peakCurrent)} A ÷ ${preset.maxDischargeCRate} C maximum continuous discharge (${userSource('maxDischargeCRate')})`,
      );
      if (rateSize > required) {
        required = rateSize;
        governing = { kind: 'discharge-rate' };
        warnings.push(
          'The discharge-rate limit, not the worksheet, sets the size: Peukert\u2019s law is unreliable for short high-current periods. A datasheet K_t table gives a truer size.',
        );
      }
      const shortest = Math.min(...merged.map((p) => p.duration));
      if (shortest < 3600) {
        warnings.push(
          `K_t for periods shorter than an hour is extrapolated with Peukert's law from the ${preset.ratedHours} h rating; use the cell maker's K_t (or amperes-for-t-minutes) table for the final size.`,
        );
      }
    } else if (rateSize > worksheetSize) {
      warnings.push(
        `The peak current ${round(peakCurrent)} A is above the maximum continuous discharge rate (${preset.maxDischargeCRate} C, ${userSource('maxDischargeCRate')}) of this size; the K_t table given is trusted — confirm the rate with the cell maker.`,
      );
    }

    if (limitDoD) {
      const dod = preset.usableDepthOfDischarge;
      const drawn = random === undefined ? periods : [...periods, { duration: random.duration, current: randomCurrent }];
      // The factors shrink the usable share of the rated capacity, and Peukert's rated current is
      // that of the bank itself (C/H), as the runtime study counts them.
      const factors = tempFactor * designMargin * agingFactor;
      const dodSize = depthOfDischargeCapacity(drawn, preset.ratedHours, preset.peukertExponent, dod / factors);
      step(
        'Size for the depth-of-discharge limit',
        dodSize,
        'Ah',
        `smallest C with ${dod} DoD × C ÷ (temperature × design margin × aging = ${round(factors)}) ≥ the Peukert-equivalent charge Σ I·max(1, I·H/C)^(k−1)·t`,
      );
      if (dodSize > required) {
        required = dodSize;
        governing = { kind: 'depth-of-discharge' };
        warnings.push(
          `Cycling design: the usable depth of discharge (${dod}), not the worksheet, sets the size; the runtime study stops the discharge there too.`,
        );
      }
    }
  } else {
    // Lithium: energy method.
    method = 'energy';
    step(
      'Energy at the bank terminals',
      energyWh,
      'Wh',
      duty.basis === 'power' ? 'Σ power × duration' : `Σ current × duration × ${round(nominalVoltage)} V nominal`,
    );
    if (random !== undefined) {
      const er = 'current' in random ? (random.current * nominalVoltage * random.duration) / 3600 : (random.power * random.duration) / 3600;
      step('Random-load energy', er, 'Wh', 'added once');
      energyWh += er;
    }
    const dod = preset.usableDepthOfDischarge;
    const cap = extrapolatedCapacityFactor(preset.capacityVsTemperature, temperature);
    const capFactor = cap.factor;
    step('Usable depth of discharge', dod, '', userSource('usableDepthOfDischarge'));
    step('Capacity factor at temperature', capFactor, '', `${temperature} °C (${userSource('capacityVsTemperature')}${cap.extrapolated ? '; outside the table: extrapolated along its end slope, never above its end value' : ''})`);
    step('Design margin', designMargin, '', input.designMargin === undefined ? `default 1.10 (the IEEE 485 design margin applied to lithium; ${TYPICAL_VALUE})` : 'as given');
    step('Aging factor', agingFactor, '', input.agingFactor === undefined ? `default 1.25 (end of life at 80 % of rated; ${TYPICAL_VALUE})` : 'as given');
    const wh = (energyWh / (dod * capFactor)) * designMargin * agingFactor;
    step('Required energy', wh, 'Wh', 'energy ÷ (DoD × capacity factor) × design margin × aging');
    const energyAh = wh / nominalVoltage;
    step('Required capacity (energy)', energyAh, 'Ah', `${round(wh)} Wh ÷ ${round(nominalVoltage)} V nominal`);
    const rateAh = peakCurrent / preset.maxDischargeCRate;
    step(
      'Required capacity (discharge rate)',
      rateAh,
      'Ah',
      `peak ${round(peakCurrent)} A ÷ ${preset.maxDischargeCRate} C maximum continuous discharge (${userSource('maxDischargeCRate')})`,
    );
    if (rateAh > energyAh) {
      required = rateAh;
      governing = { kind: 'discharge-rate' };
      warnings.push(
        `The peak current sets the size: ${round(peakCurrent)} A needs at least ${round(rateAh)} Ah at ${preset.maxDischargeCRate} C, more than the energy needs (${round(energyAh)} Ah).`,
      );
    } else {
      required = energyAh;
      governing = { kind: 'energy' };
    }
  }

  // 4. Strings: whole modules of the user's block, or a standard rating, or continuous.
  const byModule = input.ratings === undefined && input.moduleAh !== undefined;
  const choice = byModule
    ? { strings: Math.max(1, Math.ceil((required / input.moduleAh!) * (1 - 1e-12))), perString: input.moduleAh! }
    : chooseStrings(required, input.ratings, maxStrings);
  if (choice === null) {
    const largest = Math.max(...input.ratings!);
    return {
      ok: false,
      problems: [
        problem(
          'no-feasible-bank',
          elementId,
          fields.ratings,
          input.ratings,
          `the bank needs ${round(required)} Ah, more than ${maxStrings} string(s) of the largest rating (${largest} Ah) give: add a larger rating or allow more strings`,
        ),
      ],
    };
  }
  step(
    'Strings in parallel',
    choice.strings,
    '',
    byModule
      ? `⌈${round(required)} Ah ÷ ${round(choice.perString)} Ah per module⌉: whole strings of your module`
      : input.ratings === undefined
        ? 'continuous size: one string'
        : `fewest strings (of at most ${maxStrings}) a standard rating can serve`,
  );
  step(
    'Capacity per string',
    choice.perString,
    'Ah',
    byModule ? 'your module, as given' : input.ratings === undefined ? 'continuous (not rounded)' : `next standard rating ≥ ${round(required / choice.strings)} Ah`,
  );
  if (byModule && choice.strings > DEFAULT_MAX_STRINGS) {
    warnings.push(`${choice.strings} strings in parallel share the current unevenly; a larger module (block or cell) needs fewer.`);
  }
  const bankCapacity = choice.strings * choice.perString;
  const bankEnergyWh = bankCapacity * nominalVoltage;
  step('Bank capacity', bankCapacity, 'Ah', `${choice.strings} × ${round(choice.perString)} Ah, rated at ${preset.ratedHours} h`);
  step('Bank energy (nominal)', bankEnergyWh, 'Wh', `${round(bankCapacity)} Ah × ${round(nominalVoltage)} V`);

  // One sentence says what sized the bank; the runtime study gives the same one (designBasis).
  const basis = designBasis(
    preset.chemistry,
    design,
    preset.endOfDischargeCellVoltage,
    userSource('endOfDischargeCellVoltage'),
    preset.usableDepthOfDischarge,
    userSource('usableDepthOfDischarge'),
  );
  const cautions = [...bankCautions(preset.chemistry), basis];
  const blockVolts = round(preset.nominalCellVoltage * cellsPerBlock);
  const summary =
    `${choice.strings} string${choice.strings > 1 ? 's' : ''} × ${round(choice.perString)} Ah = ${round(bankCapacity)} Ah, ${Number((bankEnergyWh / 1000).toPrecision(3))} kWh` +
    ` (each string ${seriesBlocks} × ${blockVolts} V ${cellsPerBlock > 1 ? 'blocks' : 'cells'} in series, ${round(nominalVoltage)} V)`;

  return {
    ok: true,
    sizing: {
      method,
      design,
      basis,
      summary,
      worksheetBasis: powerTable !== undefined ? 'power-per-cell' : 'current',
      chemistry: preset.chemistry,
      seriesCells,
      cellsPerBlock,
      seriesBlocks,
      strings: choice.strings,
      capacityPerString: choice.perString,
      bankCapacity,
      bankEnergyWh,
      usableEnergyWh: bankEnergyWh * preset.usableDepthOfDischarge,
      nominalVoltage,
      minimumVoltage,
      requiredCapacity: required,
      governing,
      peakCurrent,
      periods: worksheetPeriods,
      sections,
      steps,
      warnings,
      cautions,
    },
  };
}

/**
 * Upper bound of the worksheet sum over period s (0-based) for τ in [minTime, M_s]: K_t rises with
 * time, so F(τ) ≤ Σ_{ΔA>0} ΔA·K(d_P + M_s) + Σ_{ΔA<0} ΔA·K(d_P + minTime) (d_P as in interiorPeak).
 */
export function interiorBound(periods: readonly CurrentPeriod[], s: number, kAt: (timeS: number) => number, minTime: number): number {
  const m = periods[s]!.duration;
  const lo = Math.max(0, minTime);
  if (!(lo < m)) return -Infinity;
  let bound = 0;
  let d = 0;
  for (let p = s; p >= 0; p--) {
    if (p < s) d += periods[p]!.duration;
    const cp = periods[p]!.current - (p > 0 ? periods[p - 1]!.current : 0);
    if (cp > 0) bound += cp * kAt(d + m);
    else if (cp < 0) bound += cp * kAt(d + lo);
  }
  return bound;
}

/** Samples of the worksheet sum inside a period before the best one is refined. */
const PEAK_SAMPLES = 32;

/**
 * The largest worksheet sum inside period s (0-based), F(τ) = Σ_{P≤s} (A_P − A_{P−1})·K_t(d_P + τ)
 * for τ in [minTime, M_s] (d_P the time from the start of period P to the start of period s), when
 * it exceeds `floor`; null otherwise.
 * Method: a bound first — K_t rises with time, so F(τ) ≤ Σ_{ΔA>0} ΔA·K(d + M_s) + Σ_{ΔA<0} ΔA·K(d)
 * over the whole period, and a period whose bound does not pass `floor` is skipped. Otherwise F is
 * sampled at PEAK_SAMPLES points (half spaced geometrically from the start, where the newest
 * term's K_t is steepest, half evenly) and the best sample refined by golden-section search
 * between its neighbours to 1e-10 of the period (F is flat at a maximum, so its value is then
 * exact to rounding).
 */
export function interiorPeak(
  periods: readonly CurrentPeriod[],
  s: number,
  kAt: (timeS: number) => number,
  floor: number,
  minTime: number,
): { time: number; size: number } | null {
  const m = periods[s]!.duration;
  const lo = Math.max(0, minTime);
  if (!(lo < m)) return null;
  const n = s + 1;
  const d = new Float64Array(n);
  const c = new Float64Array(n);
  for (let p = s; p >= 0; p--) {
    d[p] = p === s ? 0 : d[p + 1]! + periods[p]!.duration;
    c[p] = periods[p]!.current - (p > 0 ? periods[p - 1]!.current : 0);
  }
  let bound = 0;
  for (let p = 0; p < n; p++) {
    const cp = c[p]!;
    if (cp > 0) bound += cp * kAt(d[p]! + m);
    else if (cp < 0) bound += cp * kAt(d[p]! + lo);
  }
  if (!(bound > floor)) return null;
  const f = (tau: number) => {
    let sum = 0;
    for (let p = 0; p < n; p++) if (c[p] !== 0) sum += c[p]! * kAt(d[p]! + tau);
    return sum;
  };
  const taus: number[] = [];
  const half = PEAK_SAMPLES / 2;
  const first = lo > 0 ? lo : m * 1e-6;
  for (let i = 0; i < half; i++) taus.push(first * Math.pow(m / first, i / half));
  for (let i = 0; i <= half; i++) taus.push(lo + ((m - lo) * i) / half);
  taus.sort((x, y) => x - y);
  let bi = 0;
  let bv = -Infinity;
  const values = taus.map((t) => f(t));
  values.forEach((v, i) => {
    if (v > bv) {
      bv = v;
      bi = i;
    }
  });
  let best = { time: taus[bi]!, size: bv };
  if (bi > 0 && bi < taus.length - 1) {
    // Golden-section search for the maximum between the best sample's neighbours.
    const g = (Math.sqrt(5) - 1) / 2;
    let x0 = taus[bi - 1]!;
    let x3 = taus[bi + 1]!;
    let x1 = x3 - g * (x3 - x0);
    let x2 = x0 + g * (x3 - x0);
    let f1 = f(x1);
    let f2 = f(x2);
    while (x3 - x0 > 1e-10 * m) {
      if (f1 >= f2) {
        x3 = x2;
        x2 = x1;
        f2 = f1;
        x1 = x3 - g * (x3 - x0);
        f1 = f(x1);
      } else {
        x0 = x1;
        x1 = x2;
        f1 = f2;
        x2 = x0 + g * (x3 - x0);
        f2 = f(x2);
      }
    }
    if (f1 > best.size) best = { time: x1, size: f1 };
    if (f2 > best.size) best = { time: x2, size: f2 };
  }
  const end = f(m);
  if (end >= best.size) return null; // the period's end governs (it is the worksheet's F_S)
  return best.size > floor * (1 + 1e-12) && Number.isFinite(best.size) ? best : null;
}

/**
 * The worksheet sections S = 1…n: F_S = Σ_{P≤S} (A_P − A_{P−1})·K_t(t_P), t_P = Σ_{j=P..S} M_j.
 * O(n²) rows in all; with `keepRows` each row is kept so the user can check it.
 */
export function worksheetSections(
  periods: readonly CurrentPeriod[],
  kAt: (timeS: number) => number,
  keepRows = true,
): WorksheetSection[] {
  if (!keepRows) return sectionTotals(periods, kAt);
  // K_t depends on the time only; a profile of equal steps repeats the same times in every section.
  const memo = new Map<number, number>();
  const k = (t: number) => {
    let v = memo.get(t);
    if (v === undefined) {
      v = kAt(t);
      memo.set(t, v);
    }
    return v;
  };
  const sections: WorksheetSection[] = [];
  for (let s = 0; s < periods.length; s++) sections.push(worksheetSection(periods, s, k, true));
  return sections;
}

/** Above this many durations off the common step, section totals fall back to a plain memo. */
const MAX_ODD_PERIODS = 16;

/**
 * Section totals without rows, for long sampled profiles (hundreds to thousands of periods).
 * Each duration is written as c·q + r with q the most common duration (c whole, r = 0 for the
 * steps of a sampled profile and their merges); a time to the end of a section is then C·q + R,
 * and K_t is looked up by the whole count C in one array per distinct R (R changes only at the
 * few "odd" periods, such as a run's partial last step). Same sums as the row-by-row worksheet,
 * to rounding of the times (C·q + R instead of a running sum).
 */
function sectionTotals(periods: readonly CurrentPeriod[], kAt: (timeS: number) => number): WorksheetSection[] {
  const n = periods.length;
  const seen = new Map<number, number>();
  let q = 0;
  let best = 0;
  for (const p of periods) {
    const c = (seen.get(p.duration) ?? 0) + 1;
    seen.set(p.duration, c);
    if (c > best) {
      best = c;
      q = p.duration;
    }
  }
  const whole = new Float64Array(n);
  const rest = new Float64Array(n);
  let odd = 0;
  let totalCount = 0;
  for (let i = 0; i < n; i++) {
    const d = periods[i]!.duration;
    const m = Math.round(d / q);
    if (m >= 1 && Math.abs(d - m * q) <= 1e-9 * d) {
      whole[i] = m;
    } else {
      whole[i] = Math.floor(d / q);
      rest[i] = d - whole[i]! * q;
      odd++;
    }
    totalCount += whole[i]!;
  }
  const change = periods.map((p, i) => p.current - (i > 0 ? periods[i - 1]!.current : 0));
  let lookup: (C: number, R: number, Rkey: Float64Array) => number;
  if (odd <= MAX_ODD_PERIODS && totalCount <= 50_000_000) {
    const tables = new Map<number, Float64Array>();
    lookup = (C, R, tab) => {
      let v = tab[C]!;
      if (v !== v) {
        v = kAt(C * q + R);
        tab[C] = v;
      }
      return v;
    };
    const tableFor = (R: number) => {
      let t = tables.get(R);
      if (t === undefined) {
        t = new Float64Array(totalCount + 1).fill(Number.NaN);
        tables.set(R, t);
      }
      return t;
    };
    const base = tableFor(0);
    const sections: WorksheetSection[] = [];
    for (let s = 0; s < n; s++) {
      let C = 0;
      let R = 0;
      let tab = base;
      let positive = 0;
      let negative = 0;
      for (let p = s; p >= 0; p--) {
        C += whole[p]!;
        if (rest[p] !== 0) {
          R += rest[p]!;
          tab = tableFor(R);
        }
        const size = change[p]! * lookup(C, R, tab);
        if (size >= 0) positive += size;
        else negative += size;
      }
      sections.push(totalsSection(periods, s, positive, negative));
    }
    return sections;
  }
  // Many irregular durations: a plain memo by time.
  const memo = new Map<number, number>();
  const k = (t: number) => {
    let v = memo.get(t);
    if (v === undefined) {
      v = kAt(t);
      memo.set(t, v);
    }
    return v;
  };
  const sections: WorksheetSection[] = [];
  for (let s = 0; s < n; s++) sections.push(worksheetSection(periods, s, k, false));
  return sections;
}

function totalsSection(periods: readonly CurrentPeriod[], s: number, positive: number, negative: number): WorksheetSection {
  const next = periods[s + 1];
  return {
    section: s + 1,
    rows: [],
    positive,
    negative,
    total: positive + negative,
    needed: next === undefined || next.current <= periods[s]!.current,
  };
}

/** Section s + 1 of the worksheet (periods 1…s + 1). */
export function worksheetSection(
  periods: readonly CurrentPeriod[],
  s: number,
  kAt: (timeS: number) => number,
  keepRows: boolean,
): WorksheetSection {
  const rows: WorksheetRow[] = [];
  let positive = 0;
  let negative = 0;
  // Time from the start of period p to the end of the section, accumulated backwards from s.
  let timeToEnd = 0;
  for (let p = s; p >= 0; p--) {
    const duration = periods[p]!.duration;
    timeToEnd += duration;
    const current = periods[p]!.current;
    const change = current - (p > 0 ? periods[p - 1]!.current : 0);
    const capacityFactor = kAt(timeToEnd);
    const size = change * capacityFactor;
    if (size >= 0) positive += size;
    else negative += size;
    if (keepRows) rows.push({ period: p + 1, current, change, duration, timeToEnd, capacityFactor, size });
  }
  rows.reverse();
  const next = periods[s + 1];
  return {
    section: s + 1,
    rows,
    positive,
    negative,
    total: positive + negative,
    needed: next === undefined || next.current <= periods[s]!.current,
  };
}

/**
 * Smallest rated capacity C (Ah) whose usable part DoD·C covers the Peukert-equivalent charge of
 * the duty cycle, counted as the runtime study counts it (rated-capacity form of Peukert's law):
 *   Q(C) = Σ I·max(1, I/I_rated)^(k−1)·t,  I_rated = C/H   (t in h),
 * i.e. the root of DoD·C = Q(C). Q never rises with C, so the root is unique: C = Ah/DoD when every
 * current is at or below the rated current of that size; otherwise bisection between Ah/DoD and
 * H·I_max (where the max() no longer bites), to 1e-12 relative. When every current exceeds I_rated
 * the root has the closed form C = (H^(k−1)·Σ I^k·t / DoD)^(1/k).
 */
export function depthOfDischargeCapacity(
  periods: readonly CurrentPeriod[],
  ratedHours: number,
  k: number,
  dod: number,
): number {
  const q = (c: number) => {
    let sum = 0;
    for (const p of periods) {
      const ratio = (p.current * ratedHours) / c;
      sum += p.current * (ratio > 1 ? Math.pow(ratio, k - 1) : 1) * (p.duration / 3600);
    }
    return sum;
  };
  const ah = periods.reduce((a, p) => a + (p.current * p.duration) / 3600, 0);
  let lo = ah / dod;
  const iMax = Math.max(...periods.map((p) => p.current));
  if (lo >= ratedHours * iMax || k === 1) return lo;
  let hi = Math.max(lo, q(lo) / dod);
  // DoD·C − Q(C) rises with C: negative at lo (unless lo is the root), ≥ 0 at hi since Q(hi) ≤ Q(lo).
  for (let i = 0; i < 200 && hi - lo > 1e-12 * hi; i++) {
    const mid = 0.5 * (lo + hi);
    if (dod * mid >= q(mid)) hi = mid;
    else lo = mid;
  }
  return hi;
}

/**
 * Joins neighbouring periods whose currents lie within `rel` of the joined period's current, at the
 * higher current: never lowers a current, so never lowers the worksheet size (each section grows
 * with every current, see the property tests), and overstates it by at most `rel`.
 */
export function mergeNearPeriods(periods: readonly CurrentPeriod[], rel: number): CurrentPeriod[] {
  const out: CurrentPeriod[] = [];
  for (const p of periods) {
    const last = out[out.length - 1];
    if (last !== undefined && Math.abs(last.current - p.current) <= rel * Math.max(last.current, p.current)) {
      last.duration += p.duration;
      last.current = Math.max(last.current, p.current);
    } else {
      out.push({ duration: p.duration, current: p.current });
    }
  }
  return out;
}

/**
 * Joins neighbouring periods of equal current: the worksheet result is unchanged (the joint adds a
 * row of zero change), and a profile sampled every minute shrinks to its real steps.
 */
export function mergeEqualPeriods(periods: readonly CurrentPeriod[]): CurrentPeriod[] {
  const out: CurrentPeriod[] = [];
  for (const p of periods) {
    const last = out[out.length - 1];
    if (last !== undefined && last.current === p.current) last.duration += p.duration;
    else out.push({ duration: p.duration, current: p.current });
  }
  return out;
}

/** Rounds for messages and notes only (never for results). */
function round(x: number): number {
  return Number(x.toPrecision(4));
}
