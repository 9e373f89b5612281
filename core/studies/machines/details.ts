/**
 * Motor and drive details of a solved project, and the service-factor refusal.
 *
 * Methods:
 * - motor line current: from the solve (rms line current of the fundamental at the motor's
 *   terminals); its full-load current estimate I_FL = P_rated / (√3·V·η_FL·pf_FL) (3φ) or
 *   P_rated / (V·η_FL·pf_FL) (1φ) for a preset or nameplate motor;
 * - NEC Table 430.250: the table full-load current for a 3φ induction motor of a listed hp and
 *   voltage. NEC sizes conductors and protection from the table current, not the nameplate
 *   (430.6(A)(1), from memory);
 * - drive input: true power factor = displacement pf / √(1 + THD_i²) and rms input current =
 *   fundamental current · √(1 + THD_i²), both assuming an undistorted supply voltage (the
 *   distortion power then comes from the current harmonics alone).
 */
import type { Problem } from '../../model/errors.ts';
import type { DriveStage, Element, MotorStage, Project } from '../../model/project.ts';
import type { SolveResult } from '../../model/result.ts';
import type { Solved } from '../../solve/index.ts';
import { driveOperatingPoint } from '../../kinds/drive.ts';
import { motorRating, necFullLoadCurrent } from '../../physics/motor-rating.ts';
import { driveLossAt, driveLossGrid, truePowerFactor } from '../../physics/drive-loss.ts';

export const NEC_TABLE_CURRENT_NOTE =
  'NEC sizes motor conductors and protection from the Table 430.250 current, not the nameplate current (NEC 430.6(A)(1)); planning estimate only — local codes and licensed practice govern.';

export interface MotorDetail {
  id: string;
  name: string;
  loadFraction: number;
  /** Shaft power / electrical input at the operating point. */
  efficiency: number;
  powerFactor: number;
  /** Line current from the solve, A. */
  lineCurrent: number;
  /** Full-load current estimated from the rating (preset or nameplate), A. */
  estimatedFullLoadCurrent?: number;
  nameplateCurrent?: number;
  /** Where the full-load efficiency came from. */
  efficiencySource: string;
  powerFactorSource: string;
  nec?: { amps: number; hp: number; voltage: number; note: string };
  /** Why no NEC table current applies. */
  necNotApplicable?: string;
  serviceFactor: number;
}

export interface DriveDetail {
  id: string;
  name: string;
  /** Operating point used for the loss, % (after clamping), and the one computed. */
  speedPercent?: number;
  torquePercent?: number;
  clamped?: boolean;
  basis?: 'cdm' | 'pds';
  loss: number;
  displacementPowerFactor: number;
  currentThd?: number;
  truePowerFactor?: number;
  /** Fundamental input current from the solve, A. */
  inputCurrentFundamental: number;
  /** rms input current with the stated distortion, A. */
  inputCurrentRms?: number;
  lossSource: string;
}

export interface MachineDetails {
  motors: MotorDetail[];
  drives: DriveDetail[];
}


function motorDetail(e: MotorStage, result: SolveResult): MotorDetail | undefined {
  const r = result.elements.find((x) => x.id === e.id);
  if (!r?.input) return undefined;
  const rating = motorRating(e);
  const rated = rating.ok ? rating.rating : undefined;
  const detail: MotorDetail = {
    id: e.id,
    name: e.name ?? e.id,
    loadFraction: r.pOut / e.ratedOutput,
    efficiency: r.pIn > 0 ? r.pOut / r.pIn : 0,
    powerFactor: r.input.powerFactor,
    lineCurrent: r.input.current,
    efficiencySource: rated ? rated.fullLoad.source : 'the motor\'s own loss model',
    powerFactorSource: rated ? rated.powerFactorSource : 'the motor\'s own power-factor model',
    serviceFactor: e.serviceFactor ?? 1,
  };
  const v = e.ratedVoltage ?? r.input.voltage;
  if (rated) {
    const phases = r.input.kind === 'ac3' ? Math.sqrt(3) : 1;
    detail.estimatedFullLoadCurrent = e.ratedOutput / (phases * v * rated.fullLoad.efficiency * rated.powerFactor);
  }
  if (e.nameplate?.current !== undefined) detail.nameplateCurrent = e.nameplate.current;
  if (r.input.kind !== 'ac3') detail.necNotApplicable = 'Table 430.250 covers three-phase motors only';
  else {
    const nec = necFullLoadCurrent(e.ratedOutput, e.ratedVoltage);
    if ('amps' in nec) detail.nec = { ...nec, note: NEC_TABLE_CURRENT_NOTE };
    else detail.necNotApplicable = nec.reason;
  }
  return detail;
}

function driveDetail(e: DriveStage, result: SolveResult, project: Project): DriveDetail | undefined {
  const r = result.elements.find((x) => x.id === e.id);
  if (!r?.input) return undefined;
  const detail: DriveDetail = {
    id: e.id,
    name: e.name ?? e.id,
    loss: r.loss,
    displacementPowerFactor: e.inputPowerFactor,
    inputCurrentFundamental: r.input.current,
    lossSource: 'the drive\'s own loss model',
  };
  if (e.standardLoss) {
    const g = driveLossGrid(e.standardLoss);
    if (g.ok) {
      const feeder = project.elements.find((x) => x.id === e.from);
      const supplyHz = r.input.frequency ?? (feeder && 'frequency' in feeder ? feeder.frequency : undefined);
      const motorHz = e.motorRatedFrequency ?? supplyHz;
      const phi = motorHz !== undefined ? e.outputFrequency / motorHz : 1;
      const op = driveOperatingPoint(e, phi, r.pOut);
      const at = driveLossAt(g.grid, op.speed, op.torque);
      detail.speedPercent = op.speed;
      detail.torquePercent = op.torque;
      detail.clamped = at.clamped;
      detail.basis = e.standardLoss.basis;
      detail.lossSource = g.grid.source;
    }
  }
  if (e.currentThd !== undefined) {
    detail.currentThd = e.currentThd;
    detail.truePowerFactor = truePowerFactor(e.inputPowerFactor, e.currentThd);
    detail.inputCurrentRms = r.input.current * Math.sqrt(1 + e.currentThd * e.currentThd);
  }
  return detail;
}

/** Details of every motor and drive of a solved project. */
export function machineDetails(solved: Solved): MachineDetails {
  const { project, result } = solved;
  const motors: MotorDetail[] = [];
  const drives: DriveDetail[] = [];
  for (const e of project.elements as Element[]) {
    if (e.kind === 'motor') {
      const d = motorDetail(e, result);
      if (d) motors.push(d);
    } else if (e.kind === 'drive') {
      const d = driveDetail(e, result, project);
      if (d) drives.push(d);
    }
  }
  return { motors, drives };
}

export type MachineSolveOutcome = { ok: true; result: SolveResult; machines: MachineDetails } | { ok: false; problems: Problem[] };

/**
 * A solved project's result with its motor and drive details. A motor loaded beyond its service
 * factor has already refused the solve itself (core/kinds/motor.ts), so this never fails; the
 * outcome keeps its shape for callers that check it.
 */
export function solveWithMachines(solved: Solved): MachineSolveOutcome {
  return { ok: true, result: solved.result, machines: machineDetails(solved) };
}
