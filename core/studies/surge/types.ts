/**
 * The surge and fault study's result: plain data, JSON-serialisable, SI units (V, A, VA, Ω, s);
 * percentages as % numbers. Shaped for the CLI (`--json` key `surgeStudy`) and the page.
 */
import type { Problem } from '../../model/errors.ts';
import type { SolveWarning } from '../../model/result.ts';

export type StartMethod = 'dol' | 'star-delta' | 'soft-starter' | 'drive';
export type StartVerdict = 'starts' | 'marginal' | 'will-not-start';
export type CheckStatus = 'pass' | 'marginal' | 'fail';

/** The drop across one series impedance during a start, referred to its own sending side. */
export interface SeriesDrop {
  id: string;
  name: string;
  kind: 'cable' | 'transformer' | 'grid' | 'generator';
  /** Sending minus receiving magnitude, V (a transformer's sending side is its ratio times its input; a source's its EMF). */
  dropVolts: number;
  dropPercent: number;
}

/** One limit a start is checked against. */
export interface StartCheck {
  name: 'terminal-voltage' | 'inverter-surge' | 'surge-duration' | 'inverter-cutoff' | 'generator-dip';
  /** Element the limit belongs to (the motor, the inverter, the generator). */
  elementId: string;
  label: string;
  value: number;
  limit: number;
  unit: string;
  /** "at-least" (value must not fall below the limit) or "at-most". */
  sense: 'at-least' | 'at-most';
  /** value/limit (at-most) or limit/value (at-least): above 1 fails, above 1 − 10 % is marginal. */
  utilisation: number;
  status: CheckStatus;
  /** Where the limit comes from (entered, or the common-practice default). */
  limitSource: string;
}

export interface MotorStartResult {
  motorId: string;
  name: string;
  method: StartMethod;
  /** Rated voltage the starting figures are referred to, V (line-to-line on three-phase). */
  ratedVoltage: number;
  ratedVoltageSource: string;
  phases: 1 | 3;
  fullLoadCurrent: number;
  fullLoadCurrentSource: string;
  /** Direct-on-line locked-rotor current at rated voltage, A, and where it comes from. */
  lockedRotorCurrent: number;
  lockedRotorSource: string;
  /** Line current the chosen method draws at rated voltage, A, and as a multiple of FLC. */
  startingCurrent: number;
  startingMultiple: number;
  startingPowerFactor: number;
  startingPowerFactorSource: string;
  /** Starting apparent power at rated voltage, VA. */
  startingApparentPower: number;
  startSeconds: number;
  startSecondsSource: string;
  /** The source's series impedance during the start and where it comes from (absent: a stiff source). */
  sourceImpedance?: { elementId: string; r: number; x: number; basis: string };
  /** Solved chain during the start (null when the chain cannot deliver the starting power). */
  duringStart: {
    /** Every series impedance from the motor up to the source or the first converter, nearest first. */
    seriesDrops: SeriesDrop[];
    terminalVoltage: number;
    terminalVoltagePercent: number;
    /** Line current drawn at the motor terminals during the start, A. */
    terminalCurrent: number;
    /** Each cable from the nearest source or converter down to the motor: drop at starting current and pf. */
    cableDrops: { id: string; dropVolts: number; dropPercent: number }[];
    cableDropTotalPercent: number;
  } | null;
  inverter?: {
    id: string;
    /** Apparent power the inverter delivers during the start (the other loads running), VA. */
    apparentPower: number;
    surgeRating?: number;
    surgeSeconds?: number;
    continuousRating?: number;
    /** DC voltage at its input during the start, V. */
    inputVoltage?: number;
    lowVoltageCutoff?: number;
    battery?: { id: string; current: number; internalResistance: number; dipVolts: number; terminalVoltage: number; openCircuitVoltage: number };
  };
  generator?: {
    id: string;
    /** Starting kVA of the motor at rated voltage against the generator's rating. */
    startingApparentPower: number;
    ratedApparentPower?: number;
    startingToRating?: number;
    subtransientReactancePercent?: number;
    transientReactancePercent?: number;
    /** Which reactance the checked dip (and the start's solve) used: X'd when given, else X''d. */
    reactanceUsed?: 'transient' | 'subtransient';
    /** Dip by the per-unit divider ΔV = X·S_start / (S_gen + X·S_start) with the reactance used, %. */
    dipPercent?: number;
    /** The same divider with X''d (the first cycles) and with X'd, when each is given, %. */
    subtransientDipPercent?: number;
    transientDipPercent?: number;
    maxDipPercent: number;
  };
  checks: StartCheck[];
  verdict: StartVerdict;
  /** The governing reason, in words. */
  governing: string;
  /** The methods used, in words (with their sources or "common practice"). */
  methodText: string;
  notes: string[];
}

/** Prospective short-circuit current at one point. */
export interface FaultPoint {
  /** The element whose terminals (source) or far end (cable) or secondary (transformer) this is. */
  elementId: string;
  location: 'source terminals' | 'bank terminals' | 'far end' | 'secondary terminals';
  portKind: 'dc' | 'ac1' | 'ac3';
  /** Nominal voltage used (DC: open-circuit voltage), V. */
  voltage: number;
  /** Resistance (DC) or |impedance| (AC, per phase or loop) from the source to the point, Ω. */
  impedance: number;
  /** R and X of that impedance (AC), Ω. */
  r: number;
  x: number;
  /** Prospective current, A; null when it cannot be computed (reason in `note`). */
  current: number | null;
  note?: string;
}

export interface DeviceCheck {
  elementId: string;
  /** The file-format path of the rating (for the form), never shown. */
  field: string;
  /** The device in words ("bank fuse", "protective device at the sending end"). */
  label: string;
  /** Where the device sits and which fault it must interrupt. */
  location: string;
  interruptingRating: number;
  prospectiveCurrent: number | null;
  status: 'adequate' | 'too-weak' | 'unknown';
  /** The interrupting rating needed (at least the prospective current), A, when too weak. */
  requiredRating?: number;
  message: string;
}

export interface SurgeStudyResult {
  starts: MotorStartResult[];
  /** `voltageBasis`: the voltage the bank's fault is worked at and why (IEC 61660-1 worst case or the charge voltage). */
  batteryFaults: { method: string; voltageBasis?: string; points: FaultPoint[] };
  acFaults: { method: string; voltageFactor: number | null; points: FaultPoint[] };
  devices: DeviceCheck[];
  warnings: SolveWarning[];
  cautions: string[];
}

export type SurgeOutcome = { ok: true; result: SurgeStudyResult } | { ok: false; problems: Problem[] };
