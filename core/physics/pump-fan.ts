/**
 * Flow control of a pump (or fan) at a duty profile: speed control by a drive, throttling, and
 * on-off control compared on yearly energy, motor and drive losses included.
 *
 * Methods (each named where it is used):
 * - pump curve at full speed, quadratic (common practice): H(Q) = H0 − a·Q², a = (H0 − H_r)/Q_r²,
 *   through the shut-off head H0 and the rated point (Q_r, H_r);
 * - system curve with static head: H_sys(Q) = H_s + k·Q², k = (H_r − H_s)/Q_r², so that the
 *   system meets the full-speed pump curve at the rated point (the design point);
 * - affinity laws at constant pump efficiency: Q ∝ n, H ∝ n², P ∝ n³; the pump curve at speed n is
 *   H = n²·H0 − a·Q². Speed control meets the system curve at the asked flow:
 *   n = √((H_s + (k + a)·Q²) / H0);
 * - throttling: the pump runs at full speed and a valve adds the head difference; the pump works at
 *   H(Q) = H0 − a·Q² (its own curve at that flow);
 * - on-off: the pump runs at the design point for the fraction Q/Q_r of the hours (a tank or the
 *   process takes up the difference; starts not counted);
 * - a fan is the same model with no static head (core/physics/fan.ts): speed control by the affinity
 *   laws (n = Q/Q_r, power ∝ n³), its outlet damper is the throttling case (full speed on its own
 *   curve), on-off the same;
 * - hydraulic power P_h = ρ·g·Q·H (g = 9.80665 m/s², standard gravity); shaft power P_h / η_pump;
 * - motor input P_shaft / η_motor(x), x = P_shaft / rated output (core/physics/motor-rating.ts);
 *   on the drive the same part-load curve is used at reduced speed (extra harmonic loss ignored);
 * - drive loss from the IEC 61800-9-2 points at (speed % = 100·n, torque % = 100·(P_shaft/n)/P_rated),
 *   torque from the shaft power and speed (T = P/ω) against the motor's rated torque, the drive being
 *   sized to the motor; interpolated bilinearly (core/physics/drive-loss.ts).
 * Assumption throughout: pump efficiency is constant (the affinity laws' own assumption); real pumps
 * lose efficiency away from their best point and at low speed, which the result does not include.
 * A duty row's flow must be greater than 0, as the pump element's own flow (a study of a pump that
 * stands still is refused; hours it stands still use no energy by any method and are left out).
 */
import type { Problem } from '../model/errors.ts';
import type { DriveStandardLoss, MotorEfficiencyClass, MotorStage, PumpCurve } from '../model/project.ts';
import { MOTOR_CLASSES, motorRating, ratedAt, type MotorRating } from './motor-rating.ts';
import { driveLossAt, driveLossGrid, type DriveLossGrid } from './drive-loss.ts';

/** Standard acceleration of gravity, m/s² (3rd CGPM, 1901). */
export const STANDARD_GRAVITY = 9.80665;
/** Hours in a (non-leap) year. */
export const HOURS_PER_YEAR = 8760;

/** Pump curve at full speed, quadratic (common practice): H(Q) = H0 − a·Q², a = (H0 − H_r)/Q_r². */
export function pumpCurveHead(p: PumpCurve, flow: number): number {
  const a = (p.shutoffHead - p.ratedHead) / (p.ratedFlow * p.ratedFlow);
  return p.shutoffHead - a * flow * flow;
}

/** System curve with static head: H_sys(Q) = H_s + k·Q², k = (H_r − H_s)/Q_r² (meets the pump curve at the rated point). */
export function systemCurveHead(p: PumpCurve, staticHead: number, flow: number): number {
  const k = (p.ratedHead - staticHead) / (p.ratedFlow * p.ratedFlow);
  return staticHead + k * flow * flow;
}

/**
 * Speed fraction at which the pump curve (affinity laws: H = n²·H0 − a·Q²) meets the system curve
 * at the flow Q: n = √((H_s + (k + a)·Q²) / H0).
 */
export function affinitySpeed(p: PumpCurve, staticHead: number, flow: number): number {
  const Q2 = p.ratedFlow * p.ratedFlow;
  const a = (p.shutoffHead - p.ratedHead) / Q2;
  const k = (p.ratedHead - staticHead) / Q2;
  return Math.sqrt((staticHead + (k + a) * flow * flow) / p.shutoffHead);
}

/** Hydraulic power P_h = ρ·g·Q·H, W (g = standard gravity; ρ default 1000 kg/m³). */
export function hydraulicPower(p: PumpCurve, flow: number, head: number): number {
  return (p.density ?? 1000) * STANDARD_GRAVITY * flow * head;
}

/** Shaft power P_h / η_pump, W, at constant pump efficiency (the affinity laws' assumption). */
export function pumpShaftPower(p: PumpCurve, flow: number, head: number): number {
  return hydraulicPower(p, flow, head) / p.efficiency;
}

export interface PumpDutyInput {
  /** Name used in messages (default "pumpDuty"). */
  id?: string;
  /**
   * A pump (default) or a fan. A fan enters as a pump of the same model (core/physics/fan.ts
   * `fanAsPumpCurve`: its pressure as a head of standard air, static head 0); its result also
   * carries the pressures, and its fixed-speed method is the outlet damper.
   */
  machine?: 'pump' | 'fan';
  pump: PumpCurve;

  /** Static head of the system, m (0 ≤ staticHead < ratedHead). */
  staticHead: number;
  /** Flow (m³/s) and hours per year at that flow. */
  duty: { flow: number; hours: number }[];
  motor: {
    ratedOutput: number;
    efficiencyClass?: MotorEfficiencyClass;
    nameplate?: { efficiency: number; powerFactor?: number };
    poles?: number;
    ratedFrequency?: number;
    serviceFactor?: number;
  };
  /** The drive for speed control (IEC 61800-9-2 points or the IE2 defaults). */
  drive: DriveStandardLoss;
}

export interface SpeedControlPoint {
  /** Speed as a fraction of full speed. */
  speed: number;
  /** m. */
  head: number;
  shaftPower: number;
  motorLoss: number;
  driveLoss: number;
  /** Electrical input power, W. */
  inputPower: number;
  /** Fan pressure ρ·g·H, Pa (fans only). */
  pressure?: number;
  /** The drive's operating point, %, and whether it was clamped to the grid. */
  driveSpeedPercent: number;
  driveTorquePercent: number;
  driveClamped: boolean;
}

export interface FixedSpeedPoint {
  head: number;
  /** Fan pressure ρ·g·H, Pa (fans only). */
  pressure?: number;
  shaftPower: number;
  motorLoss: number;
  inputPower: number;
}

export interface DutyPointResult {
  flow: number;
  hours: number;
  speedControl: SpeedControlPoint;
  throttle: FixedSpeedPoint;
  /** Fraction of the hours the pump runs at the design point. */
  onOffRunFraction: number;
  /** Shaft power the bare cube law predicts, P_design·(Q/Q_r)³, W. */
  cubeLawShaftPower: number;
}

export interface MethodEnergy {
  /** Electrical energy per year, Wh. */
  energyWh: number;
  motorLossWh: number;
  driveLossWh: number;
}

export interface PumpControlResult {
  /** What was studied: a pump, or a fan (its fixed-speed method is then the outlet damper, its heads also given as pressures). */
  machine: 'pump' | 'fan';
  designPoint: { flow: number; head: number; pressure?: number; shaftPower: number; inputPower: number; motorLoadFraction: number };
  points: DutyPointResult[];
  speedControl: MethodEnergy;
  throttle: MethodEnergy;
  onOff: MethodEnergy;
  /** Shaft energy the bare cube law predicts (no static head), Wh, beside the system-curve figure. */
  cubeLawShaftEnergyWh: number;
  speedControlShaftEnergyWh: number;
  /** Savings of speed control, Wh per year (positive = the drive uses less). */
  savingVsThrottleWh: number;
  savingVsOnOffWh: number;
  /** Savings as a fraction of the other method's energy. */
  savingVsThrottleFraction: number;
  savingVsOnOffFraction: number;
  totalHours: number;
  motorSource: string;
  driveSource: string;
  warnings: string[];
  method: string;
}

export type PumpControlOutcome = { ok: true; result: PumpControlResult } | { ok: false; problems: Problem[] };

/** A duty row's flow of 0 or less: refused in the pump element's words for its own flow (core/kinds/pump.ts). */
export const DUTY_FLOW_MESSAGE = 'must be greater than 0 m³/s, as the pump\'s own flow (hours the pump stands still use no energy by any method: leave them out)';

const finite = (v: unknown): v is number => typeof v === 'number' && Number.isFinite(v);

const isObject = (v: unknown): v is Record<string, unknown> => typeof v === 'object' && v !== null && !Array.isArray(v);

/** The study's parts must be objects (and the duty a list) before their fields can be read (input may be parsed JSON). */
function checkShape(input: unknown): Problem[] {
  if (!isObject(input)) return [{ code: 'invalid-value', elementId: 'pumpDuty', field: '', value: input, message: 'must be an object with the pump, the static head, the duty points, the motor and the drive' }];
  const id = typeof input['id'] === 'string' ? input['id'] : 'pumpDuty';
  const out: Problem[] = [];
  for (const part of ['pump', 'motor', 'drive'] as const) {
    if (!isObject(input[part])) out.push({ code: 'invalid-value', elementId: id, field: part, value: input[part], message: input[part] === undefined ? 'is required' : 'must be an object' });
  }
  if (!Array.isArray(input['duty'])) out.push({ code: 'invalid-value', elementId: id, field: 'duty', value: input['duty'], message: 'must be a list of {flow, hours} rows' });
  else (input['duty'] as unknown[]).forEach((d, i) => {
    if (!isObject(d)) out.push({ code: 'invalid-value', elementId: id, field: `duty[${i}]`, value: d, message: 'must be a {flow, hours} row' });
  });
  return out;
}

/** Field checks; every problem names the study and the field. */
function checkInput(s: PumpDutyInput, id: string): Problem[] {
  const out: Problem[] = [];
  const bad = (field: string, value: unknown, message: string) => out.push({ code: 'invalid-value', elementId: id, field, value, message });
  const p = s.pump;
  if (!finite(p.ratedFlow) || p.ratedFlow <= 0) bad('pump.ratedFlow', p.ratedFlow, 'must be greater than 0 m³/s');
  if (!finite(p.ratedHead) || p.ratedHead <= 0) bad('pump.ratedHead', p.ratedHead, 'must be greater than 0 m');
  if (!finite(p.shutoffHead) || !(p.shutoffHead > p.ratedHead)) bad('pump.shutoffHead', p.shutoffHead, 'must be a number above the rated head (a pump curve falls with flow)');
  if (!finite(p.efficiency) || p.efficiency <= 0 || p.efficiency > 1) bad('pump.efficiency', p.efficiency, 'must be greater than 0 and at most 1 (enter 0.75 for 75 %)');
  if (p.density !== undefined && (!finite(p.density) || p.density <= 0)) bad('pump.density', p.density, 'must be greater than 0 kg/m³');
  if (!finite(s.staticHead) || s.staticHead < 0 || !(s.staticHead < p.ratedHead)) bad('staticHead', s.staticHead, 'must be at least 0 m and below the rated head');
  if (!Array.isArray(s.duty) || s.duty.length === 0) bad('duty', s.duty, 'needs at least one {flow, hours} row');
  else {
    let total = 0;
    s.duty.forEach((d, i) => {
      if (!finite(d.flow) || d.flow <= 0) bad(`duty[${i}].flow`, d.flow, DUTY_FLOW_MESSAGE);
      else if (finite(p.ratedFlow) && d.flow > p.ratedFlow * (1 + 1e-9)) bad(`duty[${i}].flow`, d.flow, `is above the rated flow ${p.ratedFlow} m³/s, which the system reaches at full speed (the design point)`);
      if (!finite(d.hours) || d.hours < 0) bad(`duty[${i}].hours`, d.hours, 'must not be negative h');
      else total += d.hours;
    });
    if (total > HOURS_PER_YEAR * (1 + 1e-12)) bad('duty', total, `the hours add up to ${total} h, more than the ${HOURS_PER_YEAR} h of a year`);
  }
  const m = s.motor;
  if (!finite(m.ratedOutput) || m.ratedOutput <= 0) bad('motor.ratedOutput', m.ratedOutput, 'must be greater than 0 W');
  if (m.serviceFactor !== undefined && (!finite(m.serviceFactor) || m.serviceFactor < 1)) bad('motor.serviceFactor', m.serviceFactor, 'must be at least 1');
  if (m.efficiencyClass === undefined && m.nameplate === undefined) bad('motor', m, 'give efficiencyClass or nameplate');
  const d = s.drive;
  if (!finite(d.ratedApparentPower) || d.ratedApparentPower <= 0) bad('drive.ratedApparentPower', d.ratedApparentPower, 'must be greater than 0 VA');
  if (d.basis !== 'cdm' && d.basis !== 'pds') bad('drive.basis', d.basis, 'must be "cdm" or "pds"');
  if (d.points !== undefined && (!Array.isArray(d.points) || d.points.some((v) => !finite(v) || v < 0))) bad('drive.points', d.points, 'must be eight losses, W, none negative');
  return out;
}

/**
 * Compare speed control by a drive with throttling and on-off control at the same duty profile:
 * yearly electrical energy of each (motor and drive losses included) and the differences.
 * Bad input gives problems naming the field; nothing is computed from it.
 */
export function comparePumpControl(input: PumpDutyInput): PumpControlOutcome {
  const shape = checkShape(input);
  if (shape.length) return { ok: false, problems: shape };
  const id = input.id ?? 'pumpDuty';
  const problems = checkInput(input, id);
  if (problems.length) return { ok: false, problems };
  const motorElement = { id, kind: 'motor', from: '', ...input.motor } as MotorStage;
  if (input.motor.efficiencyClass !== undefined && !(MOTOR_CLASSES as readonly string[]).includes(input.motor.efficiencyClass)) {
    return { ok: false, problems: [{ code: 'invalid-value', elementId: id, field: 'motor.efficiencyClass', value: input.motor.efficiencyClass, message: 'unknown efficiency class; expected one of IE1, IE2, IE3, IE4, NEMA-premium' }] };
  }
  const r = motorRating(motorElement);
  if (!r.ok) return { ok: false, problems: r.problems.map((p) => ({ ...p, elementId: id, field: `motor.${p.field}` })) };
  const rating = r.rating as MotorRating;
  const g = driveLossGrid(input.drive);
  if (!g.ok) return { ok: false, problems: g.problems.map((p) => ({ ...p, elementId: id, field: p.field.replace('standardLoss', 'drive') })) };
  const result = compute(input, rating, g.grid);
  const sf = input.motor.serviceFactor ?? 1;
  const peak = Math.max(result.designPoint.shaftPower, ...result.points.map((p) => p.throttle.shaftPower));
  if (peak > sf * input.motor.ratedOutput * (1 + 1e-9)) {
    return {
      ok: false,
      problems: [
        {
          code: 'invalid-value',
          elementId: id,
          field: 'motor.ratedOutput',
          value: input.motor.ratedOutput,
          message: `the ${input.machine ?? 'pump'} needs up to ${(peak / 1000).toPrecision(3)} kW at the shaft, beyond the service factor ${sf} × rated output ${(input.motor.ratedOutput / 1000).toPrecision(3)} kW; choose a larger motor`,
        },
      ],
    };
  }
  return { ok: true, result };
}

function compute(s: PumpDutyInput, rating: MotorRating, grid: DriveLossGrid): PumpControlResult {
  const { ratedFlow: Qr, ratedHead: Hr } = s.pump;
  const Hs = s.staticHead;
  const Prated = s.motor.ratedOutput;
  const sf = s.motor.serviceFactor ?? 1;
  const warnings: string[] = [];
  const shaft = (Q: number, H: number): number => pumpShaftPower(s.pump, Q, H);
  const motorInput = (pShaft: number): number => (pShaft > 0 ? pShaft / ratedAt(rating, pShaft / Prated).efficiency : 0);
  const fan = s.machine === 'fan';
  // A fan's pressure from its head of air: Δp = ρ·g·H (core/physics/fan.ts).
  const pressure = (H: number) => (fan ? { pressure: (s.pump.density ?? 1000) * STANDARD_GRAVITY * H } : {});
  const fixedSpeed = (Q: number, H: number): FixedSpeedPoint => {
    const pShaft = Q > 0 ? shaft(Q, H) : 0;
    const pIn = motorInput(pShaft);
    return { head: H, ...pressure(H), shaftPower: pShaft, motorLoss: pIn - pShaft, inputPower: pIn };
  };
  const design = fixedSpeed(Qr, Hr);

  const points: DutyPointResult[] = s.duty.map((d) => {
    const Q = d.flow;
    // Speed control: the pump curve at speed n meets the system curve at Q (affinity laws).
    const n = affinitySpeed(s.pump, Hs, Q);
    const Hsys = systemCurveHead(s.pump, Hs, Q);
    const pShaft = Q > 0 ? shaft(Q, Hsys) : 0;
    const pMotorIn = motorInput(pShaft);
    const speedPct = 100 * n;
    // A flow so small that neither speed nor shaft power is distinguishable from zero counts as stopped.
    const running = Q > 0 && n > 0 && pShaft > 0;
    const torquePct = running ? (100 * (pShaft / n)) / Prated : 0;
    const at = running ? driveLossAt(grid, speedPct, torquePct) : { loss: 0, clamped: false, speed: 0, torque: 0 };
    const throttle = fixedSpeed(Q, pumpCurveHead(s.pump, Q));
    return {
      flow: Q,
      hours: d.hours,
      speedControl: {
        speed: n,
        head: Hsys,
        ...pressure(Hsys),
        shaftPower: pShaft,
        motorLoss: pMotorIn - pShaft,
        driveLoss: at.loss,
        inputPower: pMotorIn + at.loss,
        driveSpeedPercent: speedPct,
        driveTorquePercent: torquePct,
        driveClamped: at.clamped,
      },
      throttle,
      onOffRunFraction: Q / Qr,
      cubeLawShaftPower: design.shaftPower * (Q / Qr) ** 3,
    };
  });

  const sum = (f: (p: DutyPointResult) => number) => points.reduce((acc, p) => acc + f(p) * p.hours, 0);
  const speedControl: MethodEnergy = {
    energyWh: sum((p) => p.speedControl.inputPower),
    motorLossWh: sum((p) => p.speedControl.motorLoss),
    driveLossWh: sum((p) => p.speedControl.driveLoss),
  };
  const throttle: MethodEnergy = { energyWh: sum((p) => p.throttle.inputPower), motorLossWh: sum((p) => p.throttle.motorLoss), driveLossWh: 0 };
  const onOff: MethodEnergy = {
    energyWh: sum((p) => p.onOffRunFraction * design.inputPower),
    motorLossWh: sum((p) => p.onOffRunFraction * design.motorLoss),
    driveLossWh: 0,
  };
  if (design.shaftPower > Prated * (1 + 1e-9)) {
    warnings.push(`the design point needs ${(design.shaftPower / 1000).toPrecision(3)} kW at the shaft, above the rated ${(Prated / 1000).toPrecision(3)} kW (within the service factor ${sf})`);
  }
  if (points.some((p) => p.speedControl.driveClamped)) {
    warnings.push('some duty points fall outside the IEC 61800-9-2 loss grid (below 25 % torque or above the top speed point); the loss on the grid edge is used');
  }
  if (points.some((p) => p.flow > 0 && p.flow < 0.3 * Qr) && Hs > 0) {
    warnings.push('at low flow the pump curve flattens against the static head: real pump efficiency falls there, which the constant-efficiency affinity laws do not show');
  }
  const totalHours = points.reduce((acc, p) => acc + p.hours, 0);
  return {
    machine: fan ? 'fan' : 'pump',
    designPoint: { flow: Qr, head: Hr, ...pressure(Hr), shaftPower: design.shaftPower, inputPower: design.inputPower, motorLoadFraction: design.shaftPower / Prated },
    points,
    speedControl,
    throttle,
    onOff,
    cubeLawShaftEnergyWh: sum((p) => p.cubeLawShaftPower),
    speedControlShaftEnergyWh: sum((p) => p.speedControl.shaftPower),
    savingVsThrottleWh: throttle.energyWh - speedControl.energyWh,
    savingVsOnOffWh: onOff.energyWh - speedControl.energyWh,
    savingVsThrottleFraction: throttle.energyWh > 0 ? (throttle.energyWh - speedControl.energyWh) / throttle.energyWh : 0,
    savingVsOnOffFraction: onOff.energyWh > 0 ? (onOff.energyWh - speedControl.energyWh) / onOff.energyWh : 0,
    totalHours,
    motorSource: `${rating.fullLoad.source}; typical part-load shape (typical values: use the maker's figures)`,
    driveSource: grid.source,
    warnings,
    method: fan
      ? 'affinity laws at constant fan efficiency (no static head: power ∝ speed³); quadratic fan curve; system pressure k·Q²; outlet damper: full speed on the fan curve; IEC 61800-9-2 bilinear drive loss'
      : 'affinity laws at constant pump efficiency; quadratic pump curve; system curve H = H_s + k·Q²; IEC 61800-9-2 bilinear drive loss',
  };
}


