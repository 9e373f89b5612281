/**
 * Bank sizing, part 1 of 7: the types of the sizing's input and result, its defaults, and the
 * context the method steps share (sizing.ts holds the method and the entry `sizeBank`).
 */
import type { BankDesign } from './cautions.ts';
import type { Chemistry, ChemistryPreset, ChemistryValues } from '../../data/battery-chemistries.ts';
import { IEEE_485_DEFAULT_AGING_FACTOR, IEEE_485_DEFAULT_DESIGN_MARGIN } from '../../data/ieee-485.ts';
import type { Problem } from '../../model/errors.ts';

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
  /** Element id used in problems: the battery's id, or PROJECT_LEVEL (default: the project as a whole). */
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
  /**
   * false: the energy method (lithium) lists no periods (`periods` empty), the figures are the same;
   * the runtime spread reads the bank alone (a long run gives some thousand periods per sample). The
   * worksheet (lead-acid, NiCd) sizes from its periods and always lists them. Default true.
   */
  keepPeriods?: boolean;
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

/** The design margin and aging factor a sizing takes: those given, else the defaults (the aging factor per chemistry). */
export function sizingFactors(given: { designMargin?: number | undefined; agingFactor?: number | undefined }, chemistry: Chemistry): { designMargin: number; agingFactor: number } {
  return { designMargin: given.designMargin ?? DEFAULT_DESIGN_MARGIN, agingFactor: given.agingFactor ?? DEFAULT_AGING_FACTOR[chemistry] };
}

/** Parallel strings considered at most, common practice (no source): more strings share poorly. */
export const DEFAULT_MAX_STRINGS = 4;

/** Above this many periods only the governing section keeps its rows (the table would be n²/2 rows). */
export const MAX_PERIODS_WITH_ROWS = 60;

/** Long profiles: neighbouring worksheet periods within this fraction are joined (see sizeBank). */
export const NEAR_CURRENT = 0.005;

/** Reference temperature of rated capacity, °C. */
export const RATED_TEMPERATURE = 25;

export const DEFAULT_FIELDS: SizingFieldPaths = {
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

/** The checked input: what `checkInput` resolved, shared by the method steps. */
export interface Checked {
  elementId: string;
  preset: ChemistryPreset;
  fields: SizingFieldPaths;
  designMargin: number;
  agingFactor: number;
  temperature: number;
  maxStrings: number;
  cellsPerBlock: number;
}

/** What the steps before the method (series count, duty cycle) hand to the worksheet or the energy method. */
export interface MethodContext extends Checked {
  input: SizingInput;
  /** Records one line of the working. */
  step: (label: string, value: number, unit: string, note: string) => void;
  warnings: string[];
  /** Where a preset value came from, in the user's words. */
  userSource: (k: keyof ChemistryValues) => string;
  seriesCells: number;
  nominalVoltage: number;
  /** The duty cycle as currents at the bank terminals (fitted to the runtime, equal neighbours joined). */
  periods: CurrentPeriod[];
  /** The power duty cycle fitted to the runtime (power basis, for a worksheet on a constant-power table only; else null). */
  powerPeriods: PowerPeriod[] | null;
  /** Energy of the duty cycle at the bank terminals, Wh. */
  energyWh: number;
  randomCurrent: number;
  peakCurrent: number;
  /** Lead-acid and NiCd: also size for the usable depth of discharge. */
  limitDoD: boolean;
  /** The maker's constant-power table, when the worksheet runs on watts per cell. */
  powerTable: readonly PowerFactorPoint[] | undefined;
}

/** What a method (worksheet or energy) found: the capacity it requires and what set it. */
export type MethodOutcome =
  | {
      ok: true;
      method: SizingMethod;
      required: number;
      governing: GoverningLimit;
      sections: WorksheetSection[];
      worksheetPeriods: CurrentPeriod[];
    }
  | { ok: false; problems: Problem[] };

/** Rounds for messages and notes only (never for results). */
export function round(x: number): number {
  return Number(x.toPrecision(4));
}
