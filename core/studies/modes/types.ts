/**
 * The modes study's result shape (core/studies/modes/study.ts computes it; its JSON keys are documented
 * in README.md, "A bank on a bus: two modes"). Split from study.ts, which re-exports these types.
 */
import type { Problem } from '../../model/errors.ts';
import type { Worded } from '../../model/message.ts';
import type { BankPlace } from '../../solve/modes.ts';
import type { SwitchTransfer } from './switches.ts';
import type { CableAcrossModes } from './cables.ts';

export type ModeName = 'supply' | 'battery';

/** One mode's balance and losses. */
export interface ModeFigures {
  mode: ModeName;
  /** The element at the root in this mode (the supply, or the bank). */
  sourceId: string;
  sourceName: string;
  sourcePower: number;
  loadPower: number;
  losses: number;
  /** |source − loads − losses| ÷ source (the solve's balance error). */
  balanceError: number;
  efficiency: number;
}

export interface RectifierSizing {
  method: string;
  /** The converter that feeds the bus (the rectifier or charger). */
  chargerId: string | null;
  chargerName: string | null;
  /** Continuous load on the bus L, A. */
  loadCurrent: number;
  /**
   * Charge to put back C, Ah, and where it came from: the user's `standby.rechargeAh`, else the charge
   * the backup study's outage drew from the bank (on battery), else the bank's rated capacity.
   */
  rechargeAh: number;
  rechargeAhFrom: 'given' | 'backup study' | 'bank capacity';
  /** Target recharge time H, h. */
  rechargeHours: number;
  /** Charge-return factor k (the user's, else the chemistry's typical value) and where it came from. */
  chargeReturnFactor: number;
  chargeReturnFactorFrom: 'given' | 'typical';
  /** Recharge current k·C/H, A. */
  rechargeCurrent: number;
  /** Charger capacity A = L + k·C/H, A. */
  requiredCurrent: number;
  /** Modules (when a module size is given). */
  modules?: { moduleCurrent: number; needed: number; installed: number; redundancy: 'none' | 'n+1'; installedCurrent: number };
  /** The recharge case: the supply's current and power, and the supply-side cables sized for it. */
  rechargeCase: { ok: true; supplyCurrent: number; supplyPower: number; rectifierOutputCurrent: number | null; cables: CableSize[] } | { ok: false; problems: Problem[] };
}

export interface CableSize {
  id: string;
  name: string;
  /** Current in this case, A. */
  current: number;
  /** Size the conductor sizing chose or checked (absent on a cable given by its resistance). */
  size?: string;
  designCurrent?: number;
}

export interface StandingLosses {
  /** W, on supply. */
  conversion: number;
  idle: number;
  cables: number;
  /** Transfer switches (contact I²R and control power), W. */
  switches: number;
  source: number;
  bankFloat: number;
  total: number;
  hoursOnSupply: number;
  outageHoursPerYear: number;
  energyKWh: number;
  pricePerKWh?: number;
  cost?: number;
}

export interface Transfer {
  /** Bank current on float, A (into the bank). */
  floatCurrent: number;
  floatCurrentNote: string;
  /** EMF the bank holds on float, V. */
  floatEmf: number;
  internalResistance: number;
  /** Bank current out just after the supply is cut, A, and the step from float. */
  currentAtTransfer: number;
  currentStep: number;
  /** Bus voltage on supply, at the moment of transfer, and settled (bank at its open-circuit voltage). */
  busVoltageOnSupply: number;
  busVoltageAtTransfer: number;
  busVoltageSettled: number | null;
  /** The bank's maximum discharge current (chemistry C-rate × Ah), A. */
  maxDischargeCurrent: number;
}

/** An inverter-charger passing the supply through on supply (core/solve/modes.ts, `passThroughChange`). */
export interface PassThroughWorking {
  inverterId: string;
  inverterName: string;
  /** Its pass-through limit and the current its loads take through the relay on supply, A. */
  limit: number;
  current: number;
  /** The inverter's idle draw, kept on the bus while it passes the supply through, W. */
  inverterIdle: number;
  note: string;
}

export interface ModesStudyResult {
  place: BankPlace;
  bankName: string;
  busName: string;
  supply: ModeFigures;
  /** On battery, or why the bank cannot carry the bus. */
  battery: ModeFigures | { ok: false; problems: Problem[] };
  charger: RectifierSizing;
  standing: StandingLosses;
  transfer: Transfer | null;
  /** Inverter-chargers passing the supply through on supply (absent when none has a pass-through limit). */
  passThrough?: PassThroughWorking[];
  /** The transfer switches: their losses in both modes, transfer time and the break their loads see. */
  switches: SwitchTransfer[];
  /**
   * Every sized cable's one size across the modes: its size in each case (on supply at float, on
   * battery, on supply recharging; null where the case does not carry it), the largest (`governing`)
   * and the case that set it (cables.ts).
   */
  cables: CableAcrossModes[];
  /**
   * The older view of the same: cables whose size differs between the cases (each case sizes the cables it carries for its own
   * current: on supply at float, on supply recharging, on battery); `use` is the largest (by area).
   */
  cableSizes: { id: string; name: string; float?: string; recharge?: string; battery?: string; use: string }[];
  warnings: Worded[];
  cautions: string[];
}

export type ModesStudyOutcome = { ok: true; study: ModesStudyResult } | { ok: false; problems: Problem[] } | null;

/** What a caller that has run the battery backup study may hand on (so the outage is not simulated twice). */
export interface ModesStudyOptions {
  /** The charge the backup study's outage drew from the bank, Ah (its discharge's `deliveredAh`). */
  dischargeAh?: number;
}
