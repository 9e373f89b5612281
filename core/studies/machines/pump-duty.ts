/**
 * The pump duty study of a project's own pump or fan: `pumpDuty: { pump, duty }` names a `pump`
 * or a `fan` element (a fan enters as the pump model with no static head, core/physics/fan.ts
 * `fanAsPumpCurve`; its fixed-speed method is the outlet damper); the study (comparePumpControl,
 * core/physics/pump-fan.ts) takes
 * - the pump curve, efficiency, density and static head from that element (its own `flow` and
 *   `control` are the chain's present operating point and play no part: the duty replaces them);
 * - the motor feeding it: its rating and efficiency class or nameplate; a motor given by an
 *   explicit loss model enters with the efficiency of that model at rated output as its nameplate
 *   value and the common-practice part-load shape (core/data/motor-part-load.ts) — said in the
 *   result's warnings;
 * - the drive feeding that motor (found up the tree through cables and other stages): its
 *   `standardLoss` (IEC 61800-9-2 points); a drive with another loss model, or no drive at all,
 *   enters as the IE2 class-reference defaults (CDM basis) sized to the motor's rated input
 *   apparent power S = P_rated / (η_FL·pf_FL) — said in the warnings.
 * Also the tree checks of each pump (`pumpDetails`): a speed-controlled pump with no drive
 * upstream of its motor, a drive whose speed (output frequency / motor rated frequency) differs
 * from the speed the pump needs by more than 2 % of full speed (common practice, no source), and
 * a throttled pump fed through a drive.
 */
import type { Problem } from '../../model/errors.ts';
import { PROJECT_LEVEL } from '../../model/errors.ts';
import { q, say, valueText, type Worded } from '../../model/message.ts';
import { kindLabel } from '../../model/field-labels.ts';
import type { DriveStage, DriveStandardLoss, Element, FanLoad, MotorStage, Project, PumpLoad } from '../../model/project.ts';
import { fanAsPumpCurve, fanOperatingPoint, type FanOperatingPoint } from '../../physics/fan.ts';
import type { Solved } from '../../solve/index.ts';
import { motorPowerFactorAt } from '../../kinds/motor.ts';
import { pumpOperatingPoint, type PumpOperatingPoint } from '../../kinds/pump.ts';
import { efficiencyAt, prepareLoss } from '../../physics/loss-model.ts';
import { comparePumpControl, HOURS_PER_YEAR, type PumpControlResult, type PumpDutyInput } from '../../physics/pump-fan.ts';
import { motorRating } from '../../physics/motor-rating.ts';

export { pumpDutySchema } from '../../kinds/pump.ts';

/** Drive speed and needed speed may differ by this fraction of full speed before a warning (common practice, no source). */
const SPEED_TOLERANCE = 0.02;

export interface PumpDetail {
  id: string;
  name: string;
  operatingPoint: PumpOperatingPoint;
  motorId: string;
  /** The drive upstream of the motor, if any. */
  driveId?: string;
  /** The drive's speed: output frequency / motor rated frequency (when the frequencies are known). */
  driveSpeed?: number;
  warnings: string[];
}

const byId = (project: Project): Map<string, Element> => new Map(project.elements.map((e) => [e.id, e]));

/** The nearest drive up the tree from an element (exclusive), or undefined. */
function driveAbove(elements: Map<string, Element>, from: string | undefined): DriveStage | undefined {
  for (let id = from, guard = 0; id !== undefined && guard <= elements.size; guard++) {
    const e = elements.get(id);
    if (!e) return undefined;
    if (e.kind === 'drive') return e;
    id = 'from' in e ? e.from : undefined;
  }
  return undefined;
}

/** Frequency of the AC port feeding an element: the nearest frequency-setting element above it. */
function supplyFrequency(elements: Map<string, Element>, from: string | undefined): number | undefined {
  for (let id = from, guard = 0; id !== undefined && guard <= elements.size; guard++) {
    const e = elements.get(id);
    if (!e) return undefined;
    if (e.kind === 'grid' || e.kind === 'generator' || e.kind === 'inverter') return e.frequency;
    if (e.kind === 'drive') return e.outputFrequency;
    if (e.kind === 'generic') return e.outputFrequency;
    id = 'from' in e ? e.from : undefined;
  }
  return undefined;
}

/** Operating point and tree checks of every pump of a VALIDATED project. */
export function pumpDetails(project: Project): PumpDetail[] {
  const elements = byId(project);
  const out: PumpDetail[] = [];
  for (const e of project.elements) {
    if (e.kind !== 'pump') continue;
    const op = pumpOperatingPoint(e);
    const motor = elements.get(e.from) as MotorStage;
    const drive = driveAbove(elements, motor.from);
    const warnings: string[] = [];
    let driveSpeed: number | undefined;
    if (drive) {
      const rated = drive.motorRatedFrequency ?? motor.ratedFrequency ?? supplyFrequency(elements, drive.from);
      if (rated !== undefined) driveSpeed = drive.outputFrequency / rated;
    }
    const pct = (x: number) => `${(100 * x).toFixed(1)} %`;
    const flow = valueText(q(e.flow, 'm³/s'));
    const motorName = `"${motor.name ?? motor.id}"`;
    // The flow control's choices as the form words them (web/editor/fields/loads.ts).
    if (e.control === 'speed' && !drive) {
      warnings.push(`flow control "Speed (a drive upstream)" needs ${pct(op.speed)} speed for ${flow}, but no drive feeds the motor ${motorName}; on a fixed-frequency supply the pump runs at full speed (choose "Throttle valve at full speed")`);
    } else if (e.control === 'speed' && driveSpeed !== undefined && Math.abs(driveSpeed - op.speed) > SPEED_TOLERANCE) {
      warnings.push(`needs ${pct(op.speed)} speed for ${flow}, but the drive "${drive!.name ?? drive!.id}" runs the motor ${motorName} at ${pct(driveSpeed)} (output frequency / motor rated frequency); the shaft power is computed at the needed speed`);
    }
    if (e.control === 'throttle' && drive) {
      warnings.push(`flow control "Throttle valve at full speed" runs at full speed, but the drive "${drive.name ?? drive.id}" feeds the motor ${motorName}; with a drive, speed control saves the valve's loss (choose "Speed (a drive upstream)")`);
    }
    out.push({ id: e.id, name: e.name ?? e.id, operatingPoint: op, motorId: motor.id, ...(drive ? { driveId: drive.id } : {}), ...(driveSpeed !== undefined ? { driveSpeed } : {}), warnings });
  }
  return out;
}

export interface FanDetail {
  id: string;
  name: string;
  operatingPoint: FanOperatingPoint;
  motorId: string;
  /** The drive upstream of the motor, if any. */
  driveId?: string;
  warnings: string[];
}

/** Operating point and tree checks (speed control with no drive, a damper behind a drive) of every fan of a VALIDATED project. */
export function fanDetails(project: Project): FanDetail[] {
  const elements = byId(project);
  const out: FanDetail[] = [];
  for (const e of project.elements) {
    if (e.kind !== 'fan') continue;
    const motor = elements.get(e.from) as MotorStage;
    const drive = driveAbove(elements, motor.from);
    out.push({ id: e.id, name: e.name ?? e.id, operatingPoint: fanOperatingPoint(e), motorId: motor.id, ...(drive ? { driveId: drive.id } : {}), warnings: fanTreeWarnings(elements, e, motor) });
  }
  return out;
}

export type PumpDutyOutcome = { ok: true; result: PumpControlResult; input: PumpDutyInput } | { ok: false; problems: Problem[] };

const STUDY = 'pumpDuty';

/**
 * A problem of the project's pump duty study: it belongs to the project (no element has the id
 * "pumpDuty"), at the field's path as the validation writes it, e.g. "pumpDuty.duty.1.flow".
 */
const studyProblem = (field: string, value: unknown, message: string | Worded): Problem => ({
  code: 'invalid-value',
  elementId: PROJECT_LEVEL,
  field: `${STUDY}${field ? `.${field.replace(/\[(\d+)\]/g, '.$1')}` : ''}`,
  value,
  ...(typeof message === 'string' ? { message } : message),
});

/** Build the study input from the chain (pump, its motor, the drive above) and run comparePumpControl. */
export function projectPumpDuty(solved: Solved): PumpDutyOutcome {
  const project = solved.project;
  const study = project.pumpDuty;
  if (study === undefined) return { ok: false, problems: [{ code: 'invalid-value', elementId: PROJECT_LEVEL, field: STUDY, message: 'is required for a pump duty study ({ pump, duty })' }] };
  const elements = byId(project);
  const pump = elements.get(study.pump);
  if (!pump) return { ok: false, problems: [studyProblem('pump', study.pump, `names no element of the project (give the id of a pump or fan element)`)] };
  if (pump.kind !== 'pump' && pump.kind !== 'fan') return { ok: false, problems: [studyProblem('pump', study.pump, `names ${JSON.stringify(pump.name ?? pump.id)}, a ${kindLabel(pump.kind).toLowerCase()}, not a pump or fan`)] };
  const fan = pump.kind === 'fan';
  const machineWord = fan ? 'fan' : 'pump';
  const problems: Problem[] = [];
  let total = 0;
  study.duty.forEach((d, i) => {
    if (d.flow > pump.ratedFlow * (1 + 1e-9)) problems.push(studyProblem(`duty[${i}].flow`, d.flow, say`is above the rated flow ${fan ? { ...q(pump.ratedFlow, 'm³/s'), air: true as const } : q(pump.ratedFlow, 'm³/s')} of the ${machineWord} "${pump.name ?? pump.id}", which the system reaches at full speed`));
    total += d.hours;
  });
  if (total > HOURS_PER_YEAR * (1 + 1e-12)) problems.push(studyProblem('duty', total, say`the hours add up to ${q(total, 'h')}, more than the ${q(HOURS_PER_YEAR, 'h')} of a year`));
  if (problems.length) return { ok: false, problems };

  const motor = elements.get(pump.from) as MotorStage;
  const warnings: string[] = [];
  const m = studyMotor(motor, warnings);
  const rating = motorRating({ ...motor, ...m, loss: undefined, powerFactor: undefined } as MotorStage);
  if (!rating.ok) return { ok: false, problems: rating.problems.map((p) => ({ ...p, elementId: motor.id })) };
  const drive = driveAbove(elements, motor.from);
  let driveLoss: DriveStandardLoss;
  if (drive?.standardLoss) driveLoss = drive.standardLoss;
  else {
    const full = rating.rating!.fullLoad.efficiency * rating.rating!.powerFactor;
    driveLoss = { ratedApparentPower: motor.ratedOutput / full, basis: 'cdm' };
    warnings.push(
      `${drive ? `drive "${drive.name ?? drive.id}" has no IEC 61800-9-2 operating points` : `no drive feeds motor "${motor.name ?? motor.id}"`}: the speed-control figures use the IE2 class-reference drive losses (typical values: use the maker's figures) for a drive sized to the motor, ${(driveLoss.ratedApparentPower / 1000).toPrecision(3)} kVA = P_rated / (η_FL·pf_FL)`,
    );
  }
  const pumpDutyInput: PumpDutyInput = {
    id: STUDY,
    ...(fan ? { machine: 'fan' as const } : {}),
    pump: fan
      ? fanAsPumpCurve(pump)
      : { ratedFlow: pump.ratedFlow, ratedHead: pump.ratedHead, shutoffHead: pump.shutoffHead, efficiency: pump.efficiency, ...(pump.density !== undefined ? { density: pump.density } : {}) },
    // A fan's duct system has no static head (core/physics/fan.ts).
    staticHead: fan ? 0 : pump.staticHead,
    duty: study.duty.map((d) => ({ flow: d.flow, hours: d.hours })),
    motor: m,
    drive: driveLoss,
  };
  const r = comparePumpControl(pumpDutyInput);
  if (!r.ok) return { ok: false, problems: r.problems.map((p) => renameProblem(p, pump, motor, drive)) };
  const tree = fan ? fanTreeWarnings(elements, pump, motor) : pumpDetails(project).find((d) => d.id === pump.id)!.warnings;
  r.result.warnings.unshift(...warnings, ...tree.map((w) => `${machineWord} "${pump.name ?? pump.id}": ${w}`));
  return { ok: true, result: r.result, input: pumpDutyInput };
}

/** The study's motor description from a chain motor (explicit loss models enter by their rated-output efficiency). */
function studyMotor(motor: MotorStage, warnings: string[]): PumpDutyInput['motor'] {
  const common = {
    ratedOutput: motor.ratedOutput,
    ...(motor.poles !== undefined ? { poles: motor.poles } : {}),
    ...(motor.ratedFrequency !== undefined ? { ratedFrequency: motor.ratedFrequency } : {}),
    ...(motor.serviceFactor !== undefined ? { serviceFactor: motor.serviceFactor } : {}),
  };
  if (motor.efficiencyClass !== undefined) return { ...common, efficiencyClass: motor.efficiencyClass };
  if (motor.nameplate !== undefined) return { ...common, nameplate: { efficiency: motor.nameplate.efficiency, ...(motor.nameplate.powerFactor !== undefined ? { powerFactor: motor.nameplate.powerFactor } : {}) } };
  // Explicit loss + power-factor models (validated together by the motor kind).
  const loss = motor.loss!;
  const prepared = prepareLoss(loss.model === 'constant' && loss.ratedPower === undefined ? { ...loss, ratedPower: motor.ratedOutput } : loss);
  const efficiency = efficiencyAt(prepared, motor.ratedOutput);
  const powerFactor = motorPowerFactorAt(motor.powerFactor!, 1);
  warnings.push(
    `motor "${motor.name ?? motor.id}" is given by a loss model: its efficiency at rated output, ${(100 * efficiency).toFixed(1)} %, is taken as the nameplate value with a typical part-load shape (typical values: use the maker's figures)`,
  );
  return { ...common, nameplate: { efficiency, powerFactor } };
}

/** A fan's tree checks: speed control with no drive above its motor, a damper behind a drive. */
function fanTreeWarnings(elements: Map<string, Element>, fan: FanLoad, motor: MotorStage): string[] {
  const drive = driveAbove(elements, motor.from);
  const motorName = `"${motor.name ?? motor.id}"`;
  // The air flow control's choices as the form words them (web/editor/fields/loads.ts).
  if (fan.control === 'speed' && !drive) return [`flow control "Speed (a drive upstream)" needs a drive, but none feeds the motor ${motorName}; on a fixed-frequency supply the fan runs at full speed (choose "Outlet damper at full speed")`];
  if (fan.control === 'damper' && drive) return [`flow control "Outlet damper at full speed" runs at full speed, but the drive "${drive.name ?? drive.id}" feeds the motor ${motorName}; with a drive, speed control saves the damper's loss`];
  if (fan.control === 'speed' && drive) {
    // The drive's speed (output frequency / motor rated frequency) against the speed the affinity laws need (n = Q/Q_r).
    const rated = drive.motorRatedFrequency ?? motor.ratedFrequency ?? supplyFrequency(elements, drive.from);
    const needed = fanOperatingPoint(fan).speed;
    if (rated !== undefined && Math.abs(drive.outputFrequency / rated - needed) > SPEED_TOLERANCE) {
      const pct = (x: number) => `${(100 * x).toFixed(1)} %`;
      return [`needs ${pct(needed)} speed for ${valueText(q(fan.flow, 'm³/s'))}, but the drive "${drive.name ?? drive.id}" runs the motor ${motorName} at ${pct(drive.outputFrequency / rated)} (output frequency / motor rated frequency); the shaft power is computed at the needed speed`];
    }
  }
  return [];
}

/** The fan's own field for a field of its pump-model curve. */
const FAN_FIELDS: Readonly<Record<string, string>> = { ratedFlow: 'ratedFlow', ratedHead: 'ratedPressure', shutoffHead: 'shutoffPressure', efficiency: 'efficiency', density: 'density' };

/** Problems of the study input renamed to the chain's elements (pump.*, staticHead → pump or fan; motor.* → motor; drive.* → drive). */
function renameProblem(p: Problem, pump: PumpLoad | FanLoad, motor: MotorStage, drive: DriveStage | undefined): Problem {
  const f = p.field;
  if (f.startsWith('pump.')) return { ...p, elementId: pump.id, field: pump.kind === 'fan' ? FAN_FIELDS[f.slice(5)] ?? f.slice(5) : f.slice(5) };
  if (f === 'staticHead') return { ...p, elementId: pump.id };
  if (f === 'motor' || f.startsWith('motor.')) return { ...p, elementId: motor.id, field: f === 'motor' ? '' : f.slice(6) };
  if (f.startsWith('drive.') && drive) return { ...p, elementId: drive.id, field: `standardLoss.${f.slice(6)}` };
  return p.elementId === STUDY ? { ...studyProblem(f, p.value, p.message), code: p.code } : p;
}
