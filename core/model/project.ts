/**
 * The project model: plain, JSON-serialisable data describing a power chain as a tree.
 *
 * Units inside `core/` are SI throughout: volts, amperes, watts, var, volt-amperes, hertz,
 * metres, ohms, kelvin differences in °C. Display units are converted in `web/format/` only.
 */

import type { Chemistry, ChemistryValues } from '../data/battery-chemistries.ts';

/** The kind of electrical (or mechanical) connection between two elements. */
export type PortKind = 'dc' | 'ac1' | 'ac3' | 'shaft';

/** Power-factor sense of an AC quantity: lagging = inductive (Q > 0), leading = capacitive (Q < 0). */
export type PfSense = 'lagging' | 'leading';

/** One datasheet point: efficiency at a fraction of the rated output power. */
export interface EfficiencyPoint {
  /** Output power as a fraction of rated output (0.1 = 10 %). */
  loadFraction: number;
  /** Efficiency at that point, 0.01 ≤ η ≤ 1 (below 1 % refused: the loss P_out·(1/η − 1) would swamp every figure). */
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

/** A protective device (fuse or breaker) and its interrupting rating (breaking capacity), A. */
export interface ProtectiveDevice {
  /** Highest prospective current the device can interrupt, A (DC rating on a DC circuit). */
  interruptingRating: number;
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

// ---------- Stages ----------

/** AC → DC: rectifier or battery charger, regulating its DC output. */
export interface RectifierStage extends FedElement {
  kind: 'rectifier';
  outputVoltage: number;
  /** Input power factor (displacement or true, as the datasheet gives it). */
  inputPowerFactor: number;
  inputPfSense?: PfSense;
  loss: LossModel;
  /**
   * Rated DC output current, A (the maker's datasheet). Changes nothing in the solve; sets the design
   * current of the cable its output feeds (conductor sizing, charger output at 125 %).
   */
  ratedOutputCurrent?: number;
}

/** DC → DC converter, regulating its output. */
export interface DcDcStage extends FedElement {
  kind: 'dc-dc';
  outputVoltage: number;
  loss: LossModel;
  /**
   * Rated continuous output power, W, and the lowest input voltage it runs at, V (the maker's
   * datasheet). Change nothing in the solve; together they set the design current of the cable
   * feeding it (rated output ÷ (efficiency × lowest input voltage), conductor sizing).
   */
  ratedOutputPower?: number;
  minInputVoltage?: number;
}

/** A DC bus or distribution board: passes voltage through, with its own fixed loss. */
export interface DcBusStage extends FedElement {
  kind: 'dc-bus';
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
  /** Surge rating: apparent power the inverter can deliver for a short time, VA, and for how long, s. */
  surge?: { apparentPower: number; durationSeconds: number };
  /** DC input voltage at which the inverter shuts down, V (checked during a motor start). */
  lowVoltageCutoff?: number;
  /**
   * Rated continuous AC output power, W (the maker's datasheet). Changes nothing in the solve; with
   * `lowVoltageCutoff` it sets the design current of the DC cable feeding the inverter (rated output ÷
   * (efficiency × cut-off voltage), conductor sizing).
   */
  ratedOutputPower?: number;
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

/**
 * Drive losses from the eight standard operating points of IEC 61800-9-2, interpolated bilinearly
 * in speed and torque (core/physics/drive-loss.ts). `basis` says which points the values are for:
 * "cdm" (drive module alone: relative motor-stator frequency 0/50/90 %, relative torque-producing
 * current 25/50/100 %) or "pds" (drive + motor: speed 0/50/100 %, torque 25/50/100 %).
 */
export interface DriveStandardLoss {
  /** Rated apparent output power of the drive, VA. */
  ratedApparentPower: number;
  basis: 'cdm' | 'pds';
  /**
   * Losses at the eight points, W, in the standard's order (0,25) (0,50) (0,100) (50,25) (50,50)
   * (50,100) (90|100,50) (90|100,100). Absent: the IE2 class-reference defaults (CDM basis only).
   */
  points?: number[];
}

/** Variable-frequency drive: AC in (1φ or 3φ), three-phase AC out at its own voltage and frequency. */
export interface DriveStage extends FedElement {
  kind: 'drive';
  outputVoltage: number;
  outputFrequency: number;
  /** Input displacement power factor (fundamental); sets the reactive power drawn. */
  inputPowerFactor: number;
  /** Give exactly one of `loss` (a converter loss model) and `standardLoss` (IEC 61800-9-2 points). */
  loss?: LossModel;
  standardLoss?: DriveStandardLoss;
  /** Rated frequency of the driven motor, Hz (default: the supply frequency): speed % = outputFrequency / this. */
  motorRatedFrequency?: number;
  /** Input current total harmonic distortion THD_i, a fraction (0.35 = 35 %): true pf = displacement/√(1+THD²). */
  currentThd?: number;
  /** Output rating the maker allows on a single-phase supply, VA (a three-phase drive fed single-phase is derated). */
  singlePhaseRating?: number;
  /**
   * Rated input current, A rms (the maker's datasheet). Changes nothing in the solve; sets the design
   * current of the cable feeding the drive (125 %, NEC 430.122(A); conductor sizing).
   */
  ratedInputCurrent?: number;
}

/** Efficiency-class presets: IEC 60034-30-1 (4-pole 50 Hz) or NEMA Premium (MG 1 Table 12-12, 4-pole 60 Hz). */
export type MotorEfficiencyClass = 'IE1' | 'IE2' | 'IE3' | 'IE4' | 'NEMA-premium';

/**
 * Motor: AC in, shaft power out. Its efficiency and power factor come from exactly one of:
 * `loss` + `powerFactor` (explicit models), `efficiencyClass` (a table preset with the common-practice
 * part-load shape) or `nameplate` (full-load values with the same shape).
 */
export interface MotorStage extends FedElement {
  kind: 'motor';
  /** Rated shaft output, W. Used for the load fraction of curves. */
  ratedOutput: number;
  loss?: LossModel;
  powerFactor?: PowerFactorModel;
  /** Rated speed, rpm (optional, reported on the shaft). */
  ratedSpeed?: number;
  /** Rated voltage, V (line-to-line on three-phase); used for the NEC Table 430.250 comparison. */
  ratedVoltage?: number;
  /** Number of poles (2, 4, 6, 8). */
  poles?: number;
  /** Rated frequency, Hz. */
  ratedFrequency?: number;
  efficiencyClass?: MotorEfficiencyClass;
  /** Full-load nameplate values. */
  nameplate?: { efficiency: number; powerFactor?: number; current?: number };
  /** Full-load power factor for a class preset (default: a typical value by size, common practice). */
  ratedPowerFactor?: number;
  /** Service factor, ≥ 1 (default 1.0): loads above rated warn, loads above SF × rated are refused. */
  serviceFactor?: number;
  /** How the motor starts (core/studies/surge/): starting current, method and the voltage it needs. */
  starting?: MotorStarting;
}

/**
 * Motor starting data. The locked-rotor current comes from at most one of `codeLetter` (NEC Table
 * 430.7(B), kVA per hp), `startingCurrentRatio` (IEC I_A/I_N) or `lockedRotorCurrent`; with none, a
 * common-practice 6 × full-load current is assumed (and said so).
 */
export interface MotorStarting {
  /** direct-on-line, star-delta (⅓ current and torque), soft starter (current limit), drive (about 1.5 × FLC). */
  method: 'dol' | 'star-delta' | 'soft-starter' | 'drive';
  /** NEC locked-rotor indicating code letter A–V (no I, O, Q). */
  codeLetter?: string;
  /** Locked-rotor current / rated current, I_A/I_N (IEC motor data). */
  startingCurrentRatio?: number;
  /** Locked-rotor current at rated voltage, A. */
  lockedRotorCurrent?: number;
  /** Soft starter current limit, × full-load current (default 3.5, common practice). */
  currentLimit?: number;
  /** Power factor at locked rotor (default by size, 0.2–0.4, common practice). */
  startingPowerFactor?: number;
  /** Time to reach speed, s (default by method, common practice). */
  startSeconds?: number;
  /** Lowest voltage at the motor terminals during the start, % of rated (default 80 %, common practice). */
  minTerminalVoltagePercent?: number;
}

/** NEC raceway type, for the reactance (and AC resistance) columns of NEC Chapter 9 Table 9. */
export type NecRaceway = 'pvc' | 'aluminium' | 'steel';

/** IEC 60364-5-52 reference installation methods (Table B.52.1). */
export type IecInstallationMethod = 'A1' | 'A2' | 'B1' | 'B2' | 'C' | 'D1' | 'D2' | 'E' | 'F' | 'G';

interface ConductorSpecBase {
  material: 'copper' | 'aluminium';
  /**
   * A size label from the system's table ("4 AWG", "1/0 AWG", "250 kcmil"; "2.5 mm²"), or "auto"
   * to pick the smallest size that meets ampacity, protection and voltage drop.
   */
  size: string;
  /** Ambient temperature around the run, °C (default 30, the tables' base). */
  ambient?: number;
  /** Apply 125 % to the load current (continuous load, NEC 210.19(A)(1) / 215.2(A)(1)); default false. */
  continuous?: boolean;
  /** Allowed voltage drop on this link, % of its nominal voltage (default: the project's per-link limit). */
  maxDropPercent?: number;
  /**
   * What the design current is taken from (core/conductors/design-current.ts; default "auto"):
   * - "auto": from the equipment the link feeds where the code names a rule for it (a motor: NEC
   *   430.22 / 430.24 on the Table 430.250 / 430.248 full-load current; a drive's input: 430.122(A);
   *   an inverter's DC input: its rated output at its low-voltage cut-off; a charger's output; a DC-DC
   *   converter's input), else the load at the nominal voltage (NEC 220.5(A); IEC 60364 I_B);
   * - "load": the load's current at the nominal voltage of its system, whatever it feeds;
   * - "equipment": as "auto", but a missing equipment rating is refused instead of falling back;
   * - "given": `designCurrent`, entered by the user.
   */
  designCurrentBasis?: 'auto' | 'load' | 'equipment' | 'given';
  /** Design current entered by the user, A (whole link, before any 125 % factor); only with basis "given". */
  designCurrent?: number;
}

/** Conductor chosen from NEC tables (310.16, 310.15, Chapter 9 Tables 8 and 9, 240.6(A)). */
export interface NecConductorSpec extends ConductorSpecBase {
  system: 'nec';
  /** Insulation temperature rating, °C: the Table 310.16 column that corrections apply to. */
  insulationRating: 60 | 75 | 90;
  /**
   * Termination temperature rating, °C. Absent: NEC 110.14(C)(1) — the 60 °C column for circuits of
   * 100 A or less or 14–1 AWG conductors ((a)), the 75 °C column above ((b)). 75 marks terminations
   * listed and identified for 75 °C ((a)(4)).
   */
  terminationRating?: 60 | 75 | 90;
  /** A branch circuit supplying more than one receptacle for cord-and-plug loads: NEC 240.4(B)(1) then forbids the next higher device rating. */
  multioutletBranch?: boolean;
  /** Protective device for the motor branch circuit rule of NEC Table 430.52(C)(1) (default inverse-time breaker). */
  motorDevice?: 'inverse-time-breaker' | 'time-delay-fuse' | 'non-time-delay-fuse';
  /** Raceway for Table 9 (default "pvc"). */
  raceway?: NecRaceway;
  /**
   * Current-carrying conductors in the raceway or cable with one set of this link (default 2 on DC
   * and 1φ, 3 on 3φ); each further parallel set adds its own (NEC 310.15(C)(1)).
   */
  currentCarryingConductors?: number;
}

/** Conductor chosen from IEC tables (60228, 60364-5-52, 60898-1). */
export interface IecConductorSpec extends ConductorSpecBase {
  system: 'iec';
  insulation: 'pvc' | 'xlpe';
  installationMethod: IecInstallationMethod;
  /** Loaded conductors per circuit, 2 or 3 (default 2 on DC and 1φ, 3 on 3φ). */
  loadedConductors?: 2 | 3;
  /** Circuits grouped together (Table B.52.17, bunched; default 1). Each extra parallel set counts as one more. */
  groupedCircuits?: number;
  /** Overload device: an IEC 60898-1 circuit-breaker (I₂ = 1.45 I_n) or an IEC 60269 gG fuse (I₂ = 1.6 I_n from 16 A); default circuit-breaker. */
  deviceType?: 'circuit-breaker' | 'gG-fuse';
}

export type ConductorSpec = NecConductorSpec | IecConductorSpec;

/**
 * A cable link: passes the interface kind through, drops voltage over its series impedance.
 * DC and single-phase use the loop (go and return) length; three-phase is solved per phase.
 * Give exactly one of an explicit impedance (`resistancePerKm`, optional `reactancePerKm`) or a
 * `conductor` spec, from which the impedance is taken (and, with size "auto", the size chosen).
 */
export interface CableStage extends FedElement {
  kind: 'cable';
  /** One-way route length, m. */
  length: number;
  /** Conductor resistance at operating temperature, Ω per km of one conductor. */
  resistancePerKm?: number;
  /** Conductor reactance, Ω per km of one conductor (ignored on DC). */
  reactancePerKm?: number;
  /** A conductor from the NEC or IEC tables, instead of an explicit impedance. */
  conductor?: ConductorSpec;
  /** Number of identical conductor sets in parallel (default 1). */
  parallelSets?: number;
  /**
   * The fuse or breaker at the sending end of this link (the device conductor sizing rates in
   * `ConductorResult.device`): its interrupting rating is checked against the prospective fault current there.
   */
  protection?: ProtectiveDevice;
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

/**
 * Constant-CURRENT DC load, A: its current stays as given when the voltage sags, so it draws
 * P = V·I at whatever voltage the solve finds (a battery charger in current limit, an LED driver,
 * a heater element behind a current regulator, a load given on its label by its current).
 */
export interface DcCurrentLoad extends FedElement {
  kind: 'dc-current-load';
  /** Current drawn, A. */
  current: number;
}

/**
 * Constant-CURRENT AC load given by its rms line current and power factor: the current (and its
 * angle to the voltage) stays as given when the voltage sags, so it draws S = V·I* per phase
 * (S = V·I on single-phase, √3·V_LL·I on three-phase) at the solved voltage.
 */
export interface AcCurrentLoad extends FedElement {
  kind: 'ac-current-load';
  /** Rms line current, A. */
  current: number;
  powerFactor: number;
  pfSense?: PfSense;
}

/** Mechanical load on a motor shaft, W. */
export interface ShaftLoad extends FedElement {
  kind: 'shaft-load';
  power: number;
}

/**
 * AC load given by its circuit elements: a network of resistors, inductors and capacitors in series
 * and parallel (`CircuitNetwork` below, read by core/physics/network.ts; values in Ω, H, F as numbers, or text with
 * an SI prefix such as "4.7 mH", "220 µF", "1.2 kΩ", "10k"), evaluated at the frequency of the
 * interface feeding it. A constant-IMPEDANCE load: its power follows the square of its voltage.
 * Example: `{ "kind": "network-load", "from": "cab", "connection": "delta",
 *   "network": { "series": [ { "resistor": "12 Ω" }, { "inductor": "40 mH" } ] } }`.
 */
export interface NetworkLoad extends FedElement {
  kind: 'network-load';
  network: CircuitNetwork;
  /**
   * Three-phase only: the network is one phase of a balanced star (between line and star point;
   * the default) or one branch of a balanced delta (between two lines). Not given on single-phase,
   * where the network sits across the supply.
   */
  connection?: 'star' | 'delta';
}

/**
 * A centrifugal pump (or fan) on a motor shaft (core/kinds/pump.ts). Quadratic pump curve through
 * the shut-off head and the rated point; system curve H_s + k·Q² through the rated point; constant
 * pump efficiency (the affinity laws' assumption). Shaft power ρ·g·Q·H/η at the operating point:
 * - "speed": a drive upstream sets the speed; the pump runs on the system curve (affinity laws);
 * - "throttle": full speed, a valve takes up the difference; the pump runs on its own curve.
 */
/** A pump's curve at full speed and its efficiency (the quadratic curve through shut-off and rated point). */
export interface PumpCurve {
  /** Flow at the rated (design) point at full speed, m³/s. */
  ratedFlow: number;
  /** Head at the rated point, m. */
  ratedHead: number;
  /** Head at zero flow at full speed, m (above ratedHead). */
  shutoffHead: number;
  /** Pump efficiency, 0…1, constant over the operating range (the affinity laws' assumption). */
  efficiency: number;
  /** Fluid density, kg/m³ (default 1000, water). */
  density?: number;
}

export interface PumpLoad extends FedElement, PumpCurve {
  kind: 'pump';
  /** Static head of the system, m (0 ≤ staticHead < ratedHead). */
  staticHead: number;
  /** Operating flow, m³/s (0 < flow ≤ ratedFlow; above rated would need overspeed and is refused). */
  flow: number;
  control: 'speed' | 'throttle';
}

export type Load = DcLoad | AcPowerLoad | AcApparentLoad | DcCurrentLoad | AcCurrentLoad | ShaftLoad | NetworkLoad | PumpLoad;

export type Element = Source | Stage | Load;
export type ElementKind = Element['kind'];

/** A whole project as stored and exchanged (schema-versioned). */
export interface Project {
  format: 'joulepath-project';
  version: 2;
  name: string;
  description?: string;
  /** Every element of the tree; the single source has no `from`. Order does not matter. */
  elements: Element[];
  /** Battery backup study (runtime, sizing, recharge) for a project fed by a battery `bank`. */
  backup?: BackupStudy;
  /** Voltage-drop limits the whole-path check flags against (default: 3 % per link, 5 % total). */
  dropLimits?: DropLimits;
  /** Flow-control comparison at a duty profile for a `pump` element (core/studies/machines/pump-duty.ts). */
  pumpDuty?: PumpDutyStudy;
}

/** The pump element to study and its duty: flow (m³/s) and hours per year at that flow. */
export interface PumpDutyStudy {
  pump: string;
  duty: { flow: number; hours: number }[];
}

/**
 * Voltage-drop limits, % of the voltage where the path starts. `basis` picks a published set;
 * `perLinkPercent` / `totalPercent` override it.
 * - "nec-informational": 3 % per link, 5 % total (NEC 210.19(A) IN No. 3, 215.2(A) IN No. 2;
 *   informational notes, not enforceable on their own).
 * - "iec-a-lighting" 3 %, "iec-a-other" 5 %, "iec-b-lighting" 6 %, "iec-b-other" 8 % total
 *   (IEC 60364-5-52:2009 Annex G, Table G.52.1, informative; A = supplied from a public LV network,
 *   B = from a private supply).
 */
export interface DropLimits {
  basis?: 'nec-informational' | 'iec-a-lighting' | 'iec-a-other' | 'iec-b-lighting' | 'iec-b-other';
  perLinkPercent?: number;
  totalPercent?: number;
}

// ---------- Battery backup study ----------

/**
 * How one load is set during a profile segment: a number is its power (W; VA for an
 * apparent-power load; A for a load given by its current, `dc-current-load` and `ac-current-load`,
 * which stays a constant-current load), `true` its value as given in the element, `false` off.
 */
export type LoadSetting = number | boolean;

/** One segment of a profile; loads not listed run at their element's power. */
export interface ProfileSegment {
  /** Length of the segment, h. */
  durationHours: number;
  loads?: Record<string, LoadSetting>;
}

/** One segment of a repeating 24-hour profile: lasts from `startHour` to the next segment's start. */
export interface DailySegment {
  /** Hour of the day at which this segment starts, 0 ≤ startHour < 24. */
  startHour: number;
  loads?: Record<string, LoadSetting>;
}

/** A load that switches on and off on its own (compressor, pump): on for `onMinutes` of every `periodMinutes`. */
export interface DutySchedule {
  /** Id of the load element. */
  load: string;
  periodMinutes: number;
  onMinutes: number;
  /** Minutes into the outage at which the first on-period starts (default 0). */
  offsetMinutes?: number;
}

/**
 * The load over time during the outage.
 * - `constant`: every load at its element's power.
 * - `segments`: the segments in turn, once (or over and over with `repeat`).
 * - `daily`: a 24-hour profile repeating, the outage starting at `startHour` of the day.
 * `duty` schedules apply on top of any of them (a load is on only when both say so).
 */
export type LoadProfile =
  | { kind: 'constant'; duty?: DutySchedule[] }
  | { kind: 'segments'; segments: ProfileSegment[]; repeat?: boolean; duty?: DutySchedule[] }
  | { kind: 'daily'; segments: DailySegment[]; startHour?: number; duty?: DutySchedule[] };

/** Settings of the battery backup study. Times carry their unit in the field name. */
export interface BackupStudy {
  profile: LoadProfile;
  /** Integration time step, s (default 60). */
  timeStepSeconds?: number;
  /** Longest outage simulated, h (default 168 = one week). */
  horizonHours?: number;
  /** Cell temperature during the outage, °C (default 25). */
  temperatureC?: number;
  /** Capacity left after aging, fraction of rated (default 1: a new bank; 0.8 at end of life). */
  stateOfHealth?: number;
  /**
   * What the bank is for (default 'backup'). 'backup': lead-acid and NiCd discharge to the maker's
   * end-of-discharge voltage per cell with no depth-of-discharge limit, and are sized so (IEEE 485,
   * IEEE 1115 standby sizing). 'cycling': the usable depth of discharge also ends the discharge and
   * bounds the size. Lithium keeps its usable depth of discharge (the BMS window) in both.
   */
  design?: 'backup' | 'cycling';
  // Settings of the sizing and recharge (core/studies/backup/sizing.ts, recharge.ts):
  /** Runtime the bank must give through the profile, h. */
  targetRuntimeHours?: number;
  /** Design margin on the sizing, ≥ 1 (default 1.10). */
  designMargin?: number;
  /** Aging factor on the sizing, ≥ 1 (default per chemistry). */
  agingFactor?: number;
  /** Standard capacities to pick from, Ah (default: continuous). */
  standardCapacitiesAh?: number[];
  /** Charger DC output current, A. */
  chargerCurrent?: number;
  /** Charger efficiency (DC out / AC in), 0…1. */
  chargerEfficiency?: number;
  /** Time in which the bank must be recharged, h. */
  targetRechargeHours?: number;
}

// ---------- Circuit networks (read by core/physics/network.ts) ----------

/** A component value: a number in the base unit (Ω, H, F) or text with an SI prefix ("4.7 mH", "220 µF", "10k"). */
export type ComponentValue = number | string;

/**
 * A circuit network as entered in a project: each entry is exactly one of
 * `{ "resistor": value }` (Ω), `{ "inductor": value }` (H), `{ "capacitor": value }` (F),
 * `{ "series": [entries…] }` or `{ "parallel": [entries…] }`, nested as deep as needed
 * (up to MAX_NETWORK_DEPTH levels, MAX_NETWORK_COMPONENTS components).
 * Example, a 12 Ω resistor in series with 40 mH parallel 100 µF:
 * `{ "series": [ { "resistor": "12 Ω" }, { "parallel": [ { "inductor": "40 mH" }, { "capacitor": "100 µF" } ] } ] }`.
 */
export type CircuitNetwork =
  | { resistor: ComponentValue }
  | { inductor: ComponentValue }
  | { capacitor: ComponentValue }
  | { series: CircuitNetwork[] }
  | { parallel: CircuitNetwork[] };
