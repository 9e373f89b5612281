/**
 * The battery discharge's result: what core/studies/backup/discharge-run.ts gives for a run (the
 * contract the study, the CLI text, the panel and the report read), and the words for each end.
 */
import type { Problem } from '../../model/errors.ts';
import type { Bank } from '../../physics/bank.ts';
import type { BankDesign } from './cautions.ts';

export type EndReason = 'depth-of-discharge' | 'rated-capacity' | 'cut-off-voltage' | 'chain-collapse' | 'profile-complete' | 'horizon';

/** Time series for plotting: one entry per step boundary (struct of arrays). */
export interface DischargeSeries {
  /** Time since the outage began, s. */
  time: number[];
  /** State of charge, 0…1. */
  soc: number[];
  /** Terminal voltage under load, V. */
  voltage: number[];
  /** Bank current, A. */
  current: number[];
  /** Power out of the terminals, W. */
  power: number[];
}

/** One item of the explanation "why did the bank run out sooner than Wh ÷ W?". */
export interface Derate {
  label: string;
  /** A factor on capacity (≤ 1 reduces it) or an energy, as `unit` says. */
  value: number;
  unit: '' | 'Wh' | 'W' | 'h' | 'Ah' | 'A' | '°C' | 'V';
  note: string;
}

export interface IdleDraw {
  id: string;
  name: string;
  /** Input power of the stage at zero output (standby / no-load draw), W. */
  watts: number;
  /** watts × runtime, Wh. */
  energyWh: number;
}

export interface DischargeResult {
  batteryId: string;
  bank: Bank;
  /** Runtime, s (the time the discharge ended, or the horizon / profile length). */
  runtimeSeconds: number;
  /** True when the bank was not exhausted: the runtime is "longer than" runtimeSeconds. */
  runtimeIsLowerBound: boolean;
  endReason: EndReason;
  /** Words for the end reason. */
  endText: string;
  /** Charge out of the terminals, Ah. */
  deliveredAh: number;
  /** Energy out of the terminals, Wh. */
  deliveredWh: number;
  /** Energy drawn from the cells: ∫ OCV·I dt, Wh (= terminal energy + internal I²R). */
  drawnWh: number;
  /** Energy used by the loads, Wh. */
  loadWh: number;
  /** Losses of every stage of the chain, Wh. */
  chainLossWh: number;
  /** Internal I²R of the bank, Wh. */
  internalLossWh: number;
  /** Peukert-equivalent charge taken, Ah. */
  equivalentAh: number;
  startSoc: number;
  endSoc: number;
  /** Highest bank current over the run, A. */
  peakCurrent: number;
  /** Lowest terminal voltage over the run, V. */
  minVoltage: number;
  cutoffVoltage: number;
  /** State of charge at the depth-of-discharge limit (0 in a lead-acid or NiCd backup design). */
  socLimit: number;
  /** What the bank is designed for (the study's `design`, default 'backup'). */
  design: BankDesign;
  /** Where the discharge ends, in words (the same sentence the sizing gives). */
  basis: string;
  temperatureC: number;
  temperatureFactor: number;
  temperatureExtrapolated: boolean;
  stateOfHealth: number;
  /** Capacity available at this temperature and state of health, Ah. */
  availableAh: number;
  /** Peukert factor at the actual rate: equivalent Ah ÷ Ah taken (≥ 1). */
  peukertFactor: number;
  averageLoadW: number;
  idle: IdleDraw[];
  derates: Derate[];
  series: DischargeSeries;
  timeStepSeconds: number;
  /** True when each step re-solved only the passive elements next to the bank (see core/solve/repeat.ts). */
  fastPath: boolean;
  warnings: string[];
  cautions: string[];
}

export type DischargeOutcome = { ok: true; result: DischargeResult } | { ok: false; problems: Problem[] };

export const END_TEXT: Record<EndReason, string> = {
  'depth-of-discharge': 'the usable depth of discharge was reached',
  'rated-capacity': 'the rated capacity at this rate was used: the cells are at their end-of-discharge voltage',
  'cut-off-voltage': 'the terminal voltage under load fell to the cut-off',
  'chain-collapse': 'the chain could no longer be carried (voltage collapse on a link)',
  'profile-complete': 'the bank carried the whole profile',
  horizon: 'the bank was still above its limits at the end of the simulated horizon',
};
