/**
 * The solved result: plain data, JSON-serialisable, documented in README.md ("Result shape").
 */
import type { ElementKind, PfSense, PortKind } from './project.ts';
import type { MessageValue } from './message.ts';

/** A complex number as plain data. */
export interface ComplexData {
  re: number;
  im: number;
}

/**
 * The electrical state at one port (the input or output of an element).
 * AC phasors are per phase: voltage is phase-to-neutral for three-phase, the current is the line
 * current; angles are referred to the voltage of the nearest upstream source or regulating converter
 * output (each of those starts its own reference at 0°).
 */
export interface PortResult {
  kind: PortKind;
  /** V: DC voltage, AC rms (line-to-line for three-phase); 0 for shaft ports. */
  voltage: number;
  /** Hz for AC ports. */
  frequency?: number;
  /** A: DC current or rms line current; 0 for shaft ports. */
  current: number;
  /** Real power P, W. */
  p: number;
  /** Reactive power Q, var (positive = lagging/inductive). */
  q: number;
  /** Apparent power S, VA. */
  s: number;
  /** Power factor |P|/S, 1 when S = 0. */
  powerFactor: number;
  pfSense: PfSense | 'unity';
  /** Per-phase voltage and current phasors (AC only). */
  phasor?: { voltage: ComplexData; current: ComplexData };
  /** Shaft speed, rpm, when known. */
  speed?: number;
}

export type WarningCode =
  | 'curve-extrapolated'
  | 'rating-exceeded'
  | 'fit-error'
  | 'light-load'
  | 'voltage-mismatch'
  | 'check-derating'
  /** A user-fixed conductor size fails its ampacity, protection or voltage-drop check. */
  | 'conductor-check'
  /** An inverter's pass-through limit in a project with no battery bank on a DC bus: it does nothing (core/solve/project-warnings.ts). */
  | 'pass-through-unused'
  // Traps the surge and fault study points out (core/studies/surge/traps.ts): each says why and what to check.
  /** A bank's capacity looks like the Ah of its series blocks added up (Ah do not add in series). */
  | 'ah-added-in-series'
  /** A DC link's drop fails its limit, though a check with the one-way length would pass it. */
  | 'dc-drop-one-way'
  /** An inverter far larger than its load: its idle loss is a large part of what it delivers. */
  | 'inverter-oversized'
  /** A drive fed single-phase without a single-phase (derated) rating. */
  | 'drive-single-phase'
  /** A lithium bank set to charge below 0 °C (or the chemistry's lower limit). */
  | 'lithium-charge-cold';

export interface SolveWarning {
  code: WarningCode;
  elementId: string;
  message: string;
  /** The message with its numbers as quantities (core/model/message.ts); the page renders it in the user's units. */
  template?: string;
  values?: MessageValue[];
}

/** Weighted efficiencies of a converter (needs a rated power). */
export interface WeightedEfficiency {
  /** European weighted efficiency η_EURO. */
  euro: number;
  /** California Energy Commission weighted efficiency η_CEC. */
  cec: number;
}

/** Least-squares fit quality for a `polynomial-fit` loss model. */
export interface LossFitReport {
  p0: number;
  k1: number;
  k2: number;
  /** Root-mean-square residual of the loss at the datasheet points, W. */
  rmsLossError: number;
  /** Largest absolute efficiency error at the datasheet points (0.001 = 0.1 percentage point). */
  maxEfficiencyError: number;
}

export interface ElementResult {
  id: string;
  name: string;
  kind: ElementKind;
  role: 'source' | 'stage' | 'load';
  /** Id of the feeding element, absent for the source. */
  from?: string;
  /** Ids of the elements fed by this one. */
  feeds: string[];
  /** What the element takes in (absent for the source). */
  input?: PortResult;
  /** What the element gives out (absent for loads). For a source this is what it delivers. */
  output?: PortResult;
  /** Real power in, W (for the source: the power it delivers including its internal loss). */
  pIn: number;
  /** Real power out, W (for a load: the power it uses). */
  pOut: number;
  /** pIn − pOut, W. */
  loss: number;
  /**
   * The part of `loss` drawn even at zero output (standby or no-load loss: a converter's idleLoss or
   * P0, a DC bus's fixed loss, a transformer's core loss, a drive's lowest grid loss), W: the
   * element's input power at zero output at the solved voltages, limited to 0…loss
   * (core/solve/idle.ts). Absent when the element has none (sources, cables, loads). The rest,
   * loss − idleLoss, is conversion (load-dependent) loss.
   */
  idleLoss?: number;
  /** pOut / pIn, or 1 when pIn = 0. */
  efficiency: number;
  /** Load fraction of a stage with a rated power (P_out / rated). */
  loadFraction?: number;
  weighted?: WeightedEfficiency;
  fit?: LossFitReport;
  /** Conductor sizing, for a cable given a `conductor` spec. */
  conductor?: ConductorResult;
}

/** One step of the conductor working, in words a user can check. */
export interface ConductorStep {
  label: string;
  value: number | string;
  unit: string;
  note: string;
}

/** Which requirement fixed the size. */
export type GoverningRule = 'ampacity' | 'voltage-drop' | 'protection' | 'smallest-size' | 'fixed';

/** What a link's design current was taken from (core/conductors/design-current.ts). */
export type DesignBasisKind = 'load-nominal' | 'motor-branch' | 'motor-feeder' | 'drive-input' | 'inverter-input' | 'charger-output' | 'dc-dc-input' | 'dc-feeder' | 'given';

/** Conductor sizing result of one cable link (SI units; percentages as % numbers). */
export interface ConductorResult {
  system: 'nec' | 'iec';
  material: 'copper' | 'aluminium';
  /** Size label from the table, e.g. "4 AWG", "250 kcmil", "16 mm²". */
  size: string;
  /** Cross-section of one conductor, mm². */
  areaMm2: number;
  /** True when the size was chosen by the engine ("auto"). */
  auto: boolean;
  governing: GoverningRule;
  parallelSets: number;
  /** Line (or DC) current of the whole link at the solved operating point, A (same as operatingCurrent). */
  current: number;
  /** Line (or DC) current of the whole link at the solved operating point, A: shown beside the design current. */
  operatingCurrent: number;
  /** The current the code sizes the conductor and device for, A (whole link, 125 % included where the rule says). */
  designCurrent: number;
  designBasis: {
    basis: DesignBasisKind;
    /** Current before any 125 % factor, A: the drop check uses it. */
    baseCurrent: number;
    factor: number;
    /** True when the factor applies to the ampacity after corrections (NEC 430.22, 430.24, 430.122). */
    stacked: boolean;
    /** The rule in words, with its clause. */
    rule: string;
    /** Why the automatic basis fell back to the load at nominal voltage (the rating to enter). */
    fallback?: string;
  };
  /** Nominal voltage of the link's system, V (line-to-line on three-phase). */
  nominalVoltage: number;
  ampacity: {
    /** Table value per conductor at the rating column used for corrections, A. */
    table: number;
    /** Which table and column. */
    column: string;
    ambientFactor: number;
    groupingFactor: number;
    /** Table × factors, per conductor, A. */
    corrected: number;
    /** Termination limit per conductor (NEC 110.14(C)), A, when it applies. */
    terminationLimit?: number;
    /** NEC: the Table 310.16 column the terminations limit to, °C, and the rule that set it. */
    terminationColumn?: { rating: 60 | 75 | 90; rule: string };
    /** Ampacity of one conductor after every limit, A. */
    perSet: number;
    /** perSet × parallel sets, A. */
    total: number;
  };
  drop: {
    /** |V_send| − |V_receive| from the exact phasor solve, V (line-to-line on 3φ). */
    exactVolts: number;
    exactPercent: number;
    /** The familiar approximation I·(R·cosθ + X·sinθ) × 2 (DC, 1φ) or × √3 (3φ), V. */
    approxVolts: number;
    approxPercent: number;
    /** approx − exact, V and percentage points. */
    differenceVolts: number;
    differencePercent: number;
    /** The allowed drop on this link, %. */
    limitPercent: number;
    /**
     * The drop the limit is checked on, by the method: NEC Chapter 9 Table 9 (75 °C) effective Z =
     * R·cosθ + X·sinθ (Table 8 on DC), or IEC 60364-5-52 Annex G (ρ₁ = 1.25·ρ₂₀, λ), at the design
     * basis current before any 125 % factor, V and % of the nominal voltage.
     */
    checkVolts: number;
    checkPercent: number;
    /** The method and current of the check, in words. */
    checkMethod: string;
  };
  resistance: {
    /** Table resistance of one conductor at the table's reference temperature, Ω/km. */
    referencePerKm: number;
    referenceTemperature: number;
    /** Estimated conductor temperature at this load, °C. */
    operatingTemperature: number;
    /** Resistance of one conductor at the operating temperature, Ω/km. */
    perKm: number;
    method: string;
  };
  /** Reactance of one conductor, Ω/km (0 on DC). */
  reactancePerKm: number;
  /** I²R loss of the link, W. */
  loss: number;
  device: {
    /** Standard rating chosen, A; absent when none in the list fits. */
    rating?: number;
    list: string;
    note: string;
    /** The rule that set the rating (e.g. "NEC 240.4(B)", "NEC Table 430.52(C)(1)", "IEC 60364-4-43 433.1"). */
    rule?: string;
    /** IEC: the coordination I_B ≤ I_n ≤ I_z and I₂ ≤ 1.45·I_z, A. */
    coordination?: { ib: number; in: number; iz: number; i2: number; ok: boolean };
  };
  steps: ConductorStep[];
  caution: string;
}

/** Cumulative voltage drop from where a path starts to one load. */
export interface PathDrop {
  /** The load at the end of the path, or a regulating converter (the drop at its input). */
  loadId: string;
  /** The source or regulating converter the path starts from (it sets the voltage afresh). */
  startId: string;
  /** Voltage at the start of the path (source terminals or converter output), V. */
  startVoltage: number;
  /** Voltage at the load's terminals, V. */
  loadVoltage: number;
  /** Each link on the path: its drop, % of its own sending voltage. */
  links: { id: string; dropPercent: number; exceedsLimit: boolean }[];
  /** Σ of the links' % drops. */
  totalPercent: number;
  perLinkLimitPercent?: number;
  totalLimitPercent: number;
  /** Where the limits come from. */
  limitBasis: string;
  exceedsLimit: boolean;
}

export interface SolveResult {
  projectName: string;
  /** The solution method and how it converged. */
  method: {
    name: 'fixed-point over exact two-bus link solutions';
    /** Relative voltage change between sweeps below which the solve stops. */
    tolerance: number;
    iterations: number;
    /** The last relative voltage change. */
    residual: number;
  };
  /** Elements in solve order: source first, then depth-first down the tree. */
  elements: ElementResult[];
  totals: {
    /** Real power the source delivers (including its internal loss), W. */
    sourcePower: number;
    /** Σ load power, W. */
    loadPower: number;
    /** Σ losses of source and stages, W. */
    losses: number;
    /** |source − loads − losses| / source (0 when the source delivers nothing). */
    balanceError: number;
    /** loadPower / sourcePower. */
    efficiency: number;
  };
  warnings: SolveWarning[];
  /** Cumulative voltage drop to each load, against the project's limits. */
  voltageDrop?: PathDrop[];
}
