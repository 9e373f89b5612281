/**
 * The file format, part 3: the stages between source and loads (converters, transformer, drive,
 * motor, DC bus, generic converter; the cable link's conductor spec is in conductor-specs.ts).
 */
import type { CableStage } from './conductor-specs.ts';
import type { FedElement, LossModel, PfSense, PowerFactorModel } from './element-base.ts';

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
  /**
   * An inverter-charger's pass-through limit, A (the maker's datasheet): on supply its transfer relay
   * passes the supply straight to its loads, up to this current. Read by the modes study
   * (core/solve/modes.ts) when the inverter sits on a bank's bus; changes nothing in the base solve.
   */
  passThroughLimit?: number;
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


/**
 * A transfer switch (an automatic transfer switch, a UPS's static or bypass switch, an inverter-charger's
 * transfer relay): passes its input through unchanged in kind (DC, 1φ or 3φ AC), with its own losses: the
 * contact resistance of each pole (I²R in every current-carrying conductor: two on DC and single-phase,
 * three on three-phase) and a standing control power (coils, electronics).
 */
export interface TransferSwitchStage extends FedElement {
  kind: 'transfer-switch';
  /** Contact resistance of one pole, Ω. */
  contactResistance: number;
  /** Standing control power (coils, control electronics), W. */
  controlPower: number;
  /** Rated current, A (the maker's datasheet): a warning when the current through it exceeds it. */
  ratedCurrent?: number;
  /** Transfer time, s: the break the loads below it see when it transfers (shown in the transfer working). */
  transferTime?: number;
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
  | GenericStage
  | TransferSwitchStage;
