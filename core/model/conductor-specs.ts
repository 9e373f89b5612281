/**
 * The file format, part 4: the cable link and the conductor spec it is sized or checked by (NEC or
 * IEC 60364-5-52 tables, raceway, installation method, design-current basis).
 */
import type { FedElement, ProtectiveDevice } from './element-base.ts';

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
