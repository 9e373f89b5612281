/**
 * The file format, part 2: the sources at the root of the tree (utility or generator, battery bank).
 */
import type { Chemistry, ChemistryValues } from '../data/battery-chemistries.ts';
import type { ElementBase, ProtectiveDevice } from './element-base.ts';

/** Utility supply or generator: a stiff AC source behind an optional series impedance. */
export interface AcSource extends ElementBase {
  kind: 'grid' | 'generator';
  phases: 1 | 3;
  /** Open-circuit voltage, V rms (line-to-line for three-phase). */
  voltage: number;
  frequency: number;
  /** Source series resistance per phase, Ω (optional; 0 = stiff). */
  resistance?: number;
  /** Source series reactance per phase, Ω (optional). */
  reactance?: number;
  /** Rated apparent power, VA (optional; a warning is given when exceeded). */
  ratedApparentPower?: number;
  // Surges and faults (core/studies/surge/); all optional.
  /** Generator subtransient reactance X''d, % on its rating (motor-start dip, fault current). */
  subtransientReactancePercent?: number;
  /** Generator transient reactance X'd, % on its rating (≥ X''d; the motor-start dip uses it when given). */
  transientReactancePercent?: number;
  /** Largest transient voltage dip allowed while a motor starts, % (generator; default 15 %, common practice). */
  maxDipPercent?: number;
  /** Grid: available short-circuit power S''kQ at the supply point, VA (IEC 60909 feeder impedance Z_Q = c·U²/S''kQ). */
  shortCircuitPower?: number;
  /** Grid: R/X of that short-circuit impedance (default 0.1, IEC 60909-0 6.2). */
  shortCircuitRToX?: number;
  /** Voltage tolerance of the low-voltage system, % (6 → c_max 1.05, 10 → c_max 1.10, IEC 60909-0 Table 1; default 10). */
  voltageTolerancePercent?: 6 | 10;
}

/**
 * A battery bank built from a chemistry preset: `series` cells (or blocks of `cellsPerBlock` cells)
 * in series per string × `strings` in parallel. Any preset value can be overridden from a datasheet.
 */
export interface BatteryBankSpec {
  chemistry: Chemistry;
  /** Cells (or blocks) in series per string. */
  series: number;
  /** Strings in parallel (default 1). */
  strings?: number;
  /** Cells per block: 1 for single cells (default), 6 for a 12 V lead-acid block, … */
  cellsPerBlock?: number;
  /** Rated capacity of one string (one cell or block), Ah, at the chemistry's rated hours. */
  capacityAh: number;
  /** State of charge at the start of the outage, 0…1 (default 1: full). */
  initialSoc?: number;
  /** Datasheet values that replace the preset's (per cell, units as in the preset). */
  overrides?: Partial<ChemistryValues>;
  /**
   * Float current of one string at the float voltage, A, the maker's figure (a bank on a bus draws
   * it on supply; default: the chemistry's typical float current per Ah × `capacityAh`,
   * core/data/standby-charge.ts).
   */
  floatCurrent?: number;
}

/**
 * Battery bank as a DC source: open-circuit voltage behind an internal resistance. Either give
 * `voltage` (and optionally `internalResistance`) directly, or a `bank`: the open-circuit voltage
 * is then OCV(initial state of charge) × cells in series, and the internal resistance the preset's
 * per-cell value scaled by series/strings/capacity (`internalResistance`, if given, overrides it).
 * A `voltage` given beside a `bank` must agree with the bank's open-circuit voltage.
 */
export interface BatterySource extends ElementBase {
  kind: 'battery';
  /**
   * A bank on a bus: the DC bus it is connected to (directly, or through cables to that bus). Without
   * it the bank is the chain's source; with it the chain's source is the supply, the bank draws its
   * float current on supply and carries the bus when the supply is cut (core/solve/modes.ts).
   */
  from?: string;
  /** Open-circuit voltage of the bank, V (required without a `bank`). */
  voltage?: number;
  /** Internal resistance of the whole bank, Ω (optional; 0 = stiff without a bank). */
  internalResistance?: number;
  /** Cells, strings and chemistry of the bank. */
  bank?: BatteryBankSpec;
  /** The fuse or breaker at the bank terminals (checked against the bank's prospective short-circuit current). */
  bankFuse?: ProtectiveDevice;
}

export type Source = AcSource | BatterySource;
