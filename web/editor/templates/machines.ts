/**
 * Defaults of the machine family: a motor's rated voltage from the port that feeds it, the listed drive
 * and motor ratings, a drive rated for the motors it feeds, and the shaft loads, pumps and fans a motor
 * carries comfortably (their flows chosen with the engine's own shaft-power function,
 * core/physics/pump-fan.ts). Demo defaults, common practice (no source) unless marked otherwise.
 * Part of the templates; web/editor/templates.ts is their entry.
 */
import { type DriveStage, driveRatedPower, type ElementKind, fanAsPumpCurve, KINDS, pumpShaftPower, WATTS_PER_HP } from '../../../core/page.ts';
import type { DraftElement, DraftProject } from '../../state/editor.ts';
import { num, type FeedingPort } from './ports.ts';

/**
 * A motor's rated voltage on a port of nominal (system) voltage `system`. North American motors are
 * rated at the utilization voltage, a little below the system's nominal voltage: the voltages of
 * NEC Table 430.250 (3φ) and 430.248 (1φ) and NEMA MG 1 (motors on a 480 V system are rated 460 V,
 * on 208 V 200 V, on 240 V 230 V, on 600 V 575 V, on 120 V 115 V). IEC motors are rated at the
 * system voltage (IEC 60038: 230/400 V). Voltages outside the map are kept as they are.
 */
const NEC_MOTOR_VOLTAGE: ReadonlyMap<number, number> = new Map([
  [120, 115],
  [208, 200],
  [240, 230],
  [480, 460],
  [600, 575],
]);

/** The rated voltage a motor fed at `port` is given (undefined when the port's voltage is not known). */
export function motorRatedVoltage(port: FeedingPort, us: boolean): number | undefined {
  if (port.voltage === undefined) return undefined;
  return us ? (NEC_MOTOR_VOLTAGE.get(port.voltage) ?? port.voltage) : port.voltage;
}

/**
 * Common drive (and motor) ratings, W: the IEC motor rating series 0.37 … 355 kW that drive makers
 * list their frames by (common practice (no source)).
 */
export const DRIVE_RATINGS: readonly number[] = [
  370, 550, 750, 1100, 1500, 2200, 3000, 4000, 5500, 7500, 11000, 15000, 18500, 22000, 30000, 37000, 45000, 55000, 75000, 90000, 110000, 132000,
  160000, 200000, 250000, 315000, 355000,
];

/** NEMA MG 1 standard motor ratings, hp (1 … 300 hp), for 60 Hz motors (from memory: MG 1 Part 10 rating series). */
const NEMA_HP: readonly number[] = [1, 1.5, 2, 3, 5, 7.5, 10, 15, 20, 25, 30, 40, 50, 60, 75, 100, 125, 150, 200, 250, 300];

/** The largest standard motor rating, W, at or below `power` W: NEMA hp on 60 Hz, the IEC kW series otherwise. */
export function motorRatingWithin(power: number, f: 50 | 60): number {
  const series = f === 60 ? NEMA_HP.map((hp) => Number((hp * WATTS_PER_HP).toFixed(1))) : DRIVE_RATINGS;
  return [...series].reverse().find((r) => r <= power * (1 + 1e-9)) ?? power;
}

/** The smallest listed drive rating at or above `power` W; above the list, `power` itself rounded up to a kilowatt. */
export function driveRatingFor(power: number): number {
  return DRIVE_RATINGS.find((r) => r >= power * (1 - 1e-9)) ?? Math.ceil(power / 1000) * 1000;
}

/**
 * The rated power of a drive element, if given: the drive kind's own reading (its loss model's rated
 * power, or its IEC 61800-9-2 rated apparent power; core/kinds/drive.ts), the one the engine's
 * undersized-drive warning uses, kept only when the draft holds a finite number there.
 */
export function driveRating(e: DraftElement | undefined): number | undefined {
  if (e?.kind !== 'drive') return undefined;
  return num(driveRatedPower(e as unknown as DriveStage));
}

/**
 * The total rated output of the motors `e` feeds, looking through pass-through stages (cables, buses)
 * to the first motors below: what a drive put in front of `e` must carry. Undefined when none.
 */
export function motorsFed(project: DraftProject, fed: readonly DraftElement[]): number | undefined {
  let total: number | undefined;
  const seen = new Set<string>();
  const walk = (e: DraftElement) => {
    if (seen.has(e.id)) return;
    seen.add(e.id);
    if (e.kind === 'motor') {
      const r = num(e['ratedOutput']);
      if (r !== undefined) total = (total ?? 0) + r;
      return;
    }
    if (!KINDS.get(e.kind as ElementKind)?.passive) return;
    for (const child of project.elements) if (child.from === e.id) walk(child);
  };
  for (const e of fed) walk(e);
  return total;
}

/** A drive template rated for motors of `motors` W in all: the next listed rating up, never smaller than the motors. */
export function driveSizedFor(element: DraftElement, motors: number): DraftElement {
  const rated = driveRatingFor(motors);
  const loss = element['loss'] as Record<string, unknown> | undefined;
  if (!loss || (num(loss['ratedPower']) ?? 0) >= rated) return element;
  return { ...element, loss: { ...loss, ratedPower: rated } };
}

/** Round to a tidy number of watts for a default (two significant figures). */
const tidy = (w: number) => Number(w.toPrecision(2));

/** The rated output of a motor feeding a shaft port, if it can be read. */
function motorRating(feeder: DraftElement | undefined): number | undefined {
  return feeder?.kind === 'motor' ? num(feeder['ratedOutput']) : undefined;
}

/** A shaft load that a motor of this rating carries comfortably: 70 % of rated, at most 5 kW. */
export function shaftPowerFor(feeder: DraftElement | undefined): number {
  const rated = motorRating(feeder);
  return rated === undefined ? 5000 : tidy(Math.min(5000, 0.7 * rated));
}

/** Pump curve defaults: 30 m rated head, 38 m shut-off, 75 % efficiency, 8 m static head (common practice (no source)). */
const PUMP = { ratedHead: 30, shutoffHead: 38, efficiency: 0.75, staticHead: 8 } as const;
const PUMP_FLOWS = [0.001, 0.002, 0.005, 0.01, 0.02, 0.05, 0.1] as const;

export function pumpTemplate(feeder: DraftElement | undefined): DraftElement {
  const budget = motorRating(feeder) === undefined ? 5000 : 0.8 * motorRating(feeder)!;
  // The largest listed rated flow whose shaft power at the rated point fits the motor (engine's formula).
  const ratedFlow =
    [...PUMP_FLOWS].reverse().find((q) => pumpShaftPower({ ...PUMP, ratedFlow: q }, q, PUMP.ratedHead) <= budget) ?? PUMP_FLOWS[0];
  return { id: 'pump', kind: 'pump', ...PUMP, ratedFlow, flow: Number((0.9 * ratedFlow).toPrecision(3)), control: 'throttle' };
}

/** Fan curve defaults: 1000 Pa rated, 1300 Pa shut-off, 70 % efficiency (common practice (no source)). */
const FAN = { ratedPressure: 1000, shutoffPressure: 1300, efficiency: 0.7 } as const;
const FAN_FLOWS = [0.1, 0.2, 0.5, 1, 2, 5, 10, 20] as const;

export function fanTemplate(feeder: DraftElement | undefined): DraftElement {
  const budget = motorRating(feeder) === undefined ? 5000 : 0.8 * motorRating(feeder)!;
  // The largest listed rated flow whose shaft power at the rated point fits the motor (engine's formula).
  const fits = (q: number) => {
    const curve = fanAsPumpCurve({ ...FAN, ratedFlow: q });
    return pumpShaftPower(curve, q, curve.ratedHead) <= budget;
  };
  const ratedFlow = [...FAN_FLOWS].reverse().find(fits) ?? FAN_FLOWS[0];
  return { id: 'fan', kind: 'fan', ...FAN, ratedFlow, flow: Number((0.8 * ratedFlow).toPrecision(3)), control: 'damper' };
}

