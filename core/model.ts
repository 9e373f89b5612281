/**
 * The project model: plain, JSON-serialisable data describing a power chain as a tree.
 *
 * Units inside `core/` are SI throughout: volts, amperes, watts, var, volt-amperes, hertz,
 * metres, ohms, kelvin differences in °C. Display units are converted in `web/format/` only.
 */

/** The kind of electrical (or mechanical) connection between two elements. */
export type PortKind = 'dc' | 'ac1' | 'ac3' | 'shaft';

/** Power-factor sense of an AC quantity: lagging = inductive (Q > 0), leading = capacitive (Q < 0). */
export type PfSense = 'lagging' | 'leading';

/** One datasheet point: efficiency at a fraction of the rated output power. */
export interface EfficiencyPoint {
  /** Output power as a fraction of rated output (0.1 = 10 %). */
  loadFraction: number;
  /** Efficiency at that point, 0 < η ≤ 1. */
  efficiency: number;
}

/**
 * How a converting stage loses power. Every model is expressed against OUTPUT real power P_out.
 * - `constant`: P_loss = P_out·(1/η − 1).
 * - `curve`: η interpolated linearly in load fraction between datasheet points; held at the
 *   end value (with a warning) outside the given range.
 * - `polynomial`: the converter loss polynomial P_loss = P0 + k1·P_out + k2·P_out².
 * - `polynomial-fit`: the same polynomial fitted by least squares to datasheet points.
 * `idleLoss` (standby / no-load draw, W) is added to any model except the polynomials, whose P0
 * already is the no-load loss.
 */
export type LossModel =
  | { model: 'constant'; efficiency: number; idleLoss?: number; ratedPower?: number }
  | { model: 'curve'; ratedPower: number; points: EfficiencyPoint[]; idleLoss?: number }
  | { model: 'polynomial'; p0: number; k1: number; k2: number; ratedPower?: number }
  | { model: 'polynomial-fit'; ratedPower: number; points: EfficiencyPoint[] };

/** Power factor that may vary with load fraction (motors). */
export type PowerFactorModel =
  | { model: 'constant'; powerFactor: number }
  | { model: 'curve'; points: { loadFraction: number; powerFactor: number }[] };

interface ElementBase {
  /** Unique id within the project; used in every message about this element. */
  id: string;
  /** A name the user gives (optional; the id is shown when absent). */
  name?: string;
}

interface FedElement extends ElementBase {
  /** Id of the element whose output feeds this one. */
  from: string;
}

// ---------- Sources (the root of the tree; exactly one per project) ----------

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
}

/** Battery bank as a DC source: open-circuit voltage behind an internal resistance. */
export interface BatterySource extends ElementBase {
  kind: 'battery';
  /** Open-circuit voltage of the bank, V. */
  voltage: number;
  /** Internal resistance of the whole bank, Ω (optional; 0 = stiff). */
  internalResistance?: number;
}

export type Source = AcSource | BatterySource;

// ---------- Stages ----------

/** AC → DC: rectifier or battery charger, regulating its DC output. */
export interface RectifierStage extends FedElement {
  kind: 'rectifier';
  outputVoltage: number;
  /** Input power factor (displacement or true, as the datasheet gives it). */
  inputPowerFactor: number;
  inputPfSense?: PfSense;
  loss: LossModel;
}

/** DC → DC converter, regulating its output. */
export interface DcDcStage extends FedElement {
  kind: 'dcdc';
  outputVoltage: number;
  loss: LossModel;
}

/** A DC bus or distribution board: passes voltage through, with its own fixed loss. */
export interface DcBusStage extends FedElement {
  kind: 'dcbus';
  /** Fixed loss of the bus itself (monitoring, fans, contactor coils), W. */
  fixedLoss: number;
}

/** DC → AC inverter, single- or three-phase, regulating its output voltage and frequency. */
export interface InverterStage extends FedElement {
  kind: 'inverter';
  phases: 1 | 3;
  outputVoltage: number;
  frequency: number;
  loss: LossModel;
}

/**
 * AC → AC transformer, same phase count on both sides. Losses: no-load (core) loss, constant; load
 * (copper) loss = loadLoss·(I/I_rated)², which equals loadLoss·(S/S_rated)² at rated voltage.
 * Its series impedance (from the load loss and the optional percent impedance) sets the regulation.
 */
export interface TransformerStage extends FedElement {
  kind: 'transformer';
  ratedApparentPower: number;
  primaryVoltage: number;
  secondaryVoltage: number;
  noLoadLoss: number;
  /** Load (copper) loss at rated current, W. */
  loadLoss: number;
  /** Short-circuit impedance, % (optional; when absent the impedance is the resistance alone). */
  impedancePercent?: number;
}

/** Variable-frequency drive: AC in (1φ or 3φ), three-phase AC out at its own voltage and frequency. */
export interface DriveStage extends FedElement {
  kind: 'drive';
  outputVoltage: number;
  outputFrequency: number;
  inputPowerFactor: number;
  loss: LossModel;
}

/** Motor: AC in, shaft power out. */
export interface MotorStage extends FedElement {
  kind: 'motor';
  /** Rated shaft output, W. Used for the load fraction of curves. */
  ratedOutput: number;
  loss: LossModel;
  powerFactor: PowerFactorModel;
  /** Rated speed, rpm (optional, reported on the shaft). */
  ratedSpeed?: number;
}

/**
 * A cable link: passes the interface kind through, drops voltage over its series impedance.
 * DC and single-phase use the loop (go and return) length; three-phase is solved per phase.
 */
export interface CableStage extends FedElement {
  kind: 'cable';
  /** One-way route length, m. */
  length: number;
  /** Conductor resistance at operating temperature, Ω per km of one conductor. */
  resistancePerKm: number;
  /** Conductor reactance, Ω per km of one conductor (ignored on DC). */
  reactancePerKm?: number;
  /** Number of identical conductor sets in parallel (default 1). */
  parallelSets?: number;
}

/** A stage with user-chosen input and output kinds (a regulating converter of any sort). */
export interface GenericStage extends FedElement {
  kind: 'generic';
  inputKind: 'dc' | 'ac1' | 'ac3';
  outputKind: 'dc' | 'ac1' | 'ac3';
  outputVoltage: number;
  /** Output frequency, Hz, when the output is AC. */
  outputFrequency?: number;
  /** Input power factor when the input is AC (default 1). */
  inputPowerFactor?: number;
  inputPfSense?: PfSense;
  loss: LossModel;
}

export type Stage =
  | RectifierStage
  | DcDcStage
  | DcBusStage
  | InverterStage
  | TransformerStage
  | DriveStage
  | MotorStage
  | CableStage
  | GenericStage;

// ---------- Loads (the leaves) ----------

/** Constant-power DC load, W. */
export interface DcLoad extends FedElement {
  kind: 'dc-load';
  power: number;
}

/** Constant-power AC load given by real power and power factor. */
export interface AcPowerLoad extends FedElement {
  kind: 'ac-load';
  power: number;
  powerFactor: number;
  pfSense?: PfSense;
}

/** Constant-power AC load given by apparent power and power factor. */
export interface AcApparentLoad extends FedElement {
  kind: 'ac-va-load';
  apparentPower: number;
  powerFactor: number;
  pfSense?: PfSense;
}

/** Mechanical load on a motor shaft, W. */
export interface ShaftLoad extends FedElement {
  kind: 'shaft-load';
  power: number;
}

export type Load = DcLoad | AcPowerLoad | AcApparentLoad | ShaftLoad;

export type Element = Source | Stage | Load;
export type ElementKind = Element['kind'];

/** A whole project as stored and exchanged (schema-versioned). */
export interface Project {
  format: 'joulepath-project';
  version: 1;
  name: string;
  description?: string;
  /** Every element of the tree; the single source has no `from`. Order does not matter. */
  elements: Element[];
}
