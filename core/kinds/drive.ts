/**
 * Variable-frequency drive: AC (1φ or 3φ) in, three-phase AC out at its own voltage and frequency.
 * Input real power = output + drive loss; input reactive power from the input DISPLACEMENT power
 * factor (the fundamental): Q = P_in·tan(arccos pf_disp).
 *
 * Loss: either a converter loss model (`loss`) against output power, or the eight IEC 61800-9-2
 * points (`standardLoss`) interpolated bilinearly at the operating point (core/physics/drive-loss.ts):
 * - speed % = 100 · outputFrequency / motorRatedFrequency (default: the supply frequency);
 * - torque % = relative torque-producing current ≈ 100 · P_out / (S_rated · speed fraction): the
 *   active output current P/(√3·V) with the voltage following the frequency (V/f), against the
 *   rated current S_rated/(√3·V_rated). This is the drive's own measure (the CDM axis of the
 *   standard); it sees the motor's input power, so motor losses are inside it.
 * True input power factor with a stated current distortion THD_i (voltage undistorted):
 * pf = pf_disp / √(1 + THD_i²) — reported by core/studies/machines/details.ts.
 */
import { z } from 'zod/mini';
import type { DriveStage, Element, MotorStage } from '../model/project.ts';
import { c } from '../physics/complex.ts';
import { checkLossModel, defineKind, finiteOrNone, fmtPct, fmtW, fromField, idField, lossModelSchema, nameField, nominalPort, regulatingConverter, unitFraction, type ElementModel, type KindWarning, type PortInfo } from './spec.ts';
import { driveLossAt, driveLossGrid } from '../physics/drive-loss.ts';
import { ranged } from './ranges.ts';
import { q, say } from '../model/message.ts';

const standardLossSchema = z.strictObject({
  ratedApparentPower: ranged('ratedApparentPower'),
  basis: z.enum(['cdm', 'pds'], { error: 'must be "cdm" (drive module: top point 90 % frequency) or "pds" (drive + motor: top point 100 % speed)' }),
  points: z.optional(z.array(ranged('power', 'non-negative'), { error: 'must be a list of eight losses, W' })),
});

/** Speed fraction of the driven motor: drive output frequency / motor rated frequency. */
export function driveSpeedFraction(e: DriveStage, input: PortInfo | null): number | undefined {
  const rated = e.motorRatedFrequency ?? input?.frequency;
  return rated === undefined ? undefined : e.outputFrequency / rated;
}

/** Operating point (speed %, torque %) of a drive with standard losses at output power pOut. */
export function driveOperatingPoint(e: DriveStage, speedFraction: number, pOut: number): { speed: number; torque: number } {
  const rated = e.standardLoss!.ratedApparentPower;
  return { speed: 100 * speedFraction, torque: (100 * pOut) / (rated * speedFraction) };
}

const singlePhaseWarning: KindWarning = {
  code: 'check-derating',
  message: 'three-phase drive fed single-phase: most drives must then be derated (often to about half); check the maker’s single-phase rating',
};

/** The drive's rated power, W: its loss model's rated power, or its IEC 61800-9-2 rated apparent power (VA); undefined when neither is given. */
export function driveRatedPower(e: DriveStage): number | undefined {
  return e.loss?.ratedPower ?? e.standardLoss?.ratedApparentPower;
}

/**
 * An undersized drive: the motors it feeds (through cables) are rated above the drive, whatever load
 * they run now. Common practice (no source): a drive is chosen at least as large as its motor's rated
 * output (the maker's motor-current rating governs). The message names the drive and the motors.
 */
export function undersizedDriveWarnings(e: DriveStage, fed: readonly Element[]): KindWarning[] {
  const rated = driveRatedPower(e);
  const motors = fed.filter((x): x is MotorStage => x.kind === 'motor');
  if (rated === undefined || motors.length === 0) return [];
  const total = motors.reduce((sum, m) => sum + m.ratedOutput, 0);
  if (total <= rated * (1 + 1e-9)) return [];
  const names = motors.map((m) => `"${m.name ?? m.id}"`).join(', ');
  const unit = e.loss?.ratedPower !== undefined ? 'W' : 'VA';
  return [
    {
      code: 'rating-exceeded',
      ...say`drive "${e.name ?? e.id}" is rated ${q(rated, unit)}, below the ${q(total, 'W')} rated output of motor${motors.length > 1 ? 's' : ''} ${names} it feeds; choose a drive rated at least for the motor (the maker's rating governs)`,
    },
  ];
}

export const driveKind = defineKind<DriveStage>({
  kind: 'drive',
  role: 'stage',
  accepts: () => ['ac1', 'ac3'],
  schema: z.strictObject({
    id: idField,
    name: nameField,
    kind: z.literal('drive'),
    from: fromField,
    outputVoltage: ranged('voltage'),
    outputFrequency: ranged('frequency'),
    inputPowerFactor: unitFraction('power factor'),
    loss: z.optional(lossModelSchema),
    standardLoss: z.optional(standardLossSchema),
    motorRatedFrequency: z.optional(ranged('frequency')),
    currentThd: z.optional(z.number({ error: 'must be a number' }).check(z.gte(0, 'must not be negative'), z.lte(3, 'must not exceed 3 (enter 0.35 for 35 %)'))),
    singlePhaseRating: z.optional(ranged('ratedApparentPower')),
    // Maker's rating, read by conductor sizing only (the solve does not use it).
    ratedInputCurrent: z.optional(ranged('current')),
  }) as z.ZodMiniType<DriveStage>,
  check(e) {
    if ((e.loss === undefined) === (e.standardLoss === undefined)) {
      return [{ code: 'invalid-value', field: 'loss', message: 'give the drive losses one way: a converter loss model or the IEC 61800-9-2 operating points, not both or neither' }];
    }
    if (e.loss) return checkLossModel(e.loss);
    const g = driveLossGrid(e.standardLoss!);
    const problems = g.ok ? [] : g.problems;
    if (e.motorRatedFrequency !== undefined && e.outputFrequency > e.motorRatedFrequency * (1 + 1e-9)) {
      problems.push({
        code: 'invalid-value',
        field: 'outputFrequency',
        value: e.outputFrequency,
        message: `gives an operating speed of ${fmtPct(e.outputFrequency / e.motorRatedFrequency)}, outside 0–100 % of the motor's rated frequency ${e.motorRatedFrequency} Hz`,
      });
    }
    return problems;
  },
  regulatesVoltage: true,
  // Three-phase at its set output voltage and frequency, whatever it is fed with.
  nominalOutput: (e) => nominalPort('ac3', finiteOrNone(e.outputVoltage), finiteOrNone(e.outputFrequency)),
  studies: ['machines'],
  fedWarnings: undersizedDriveWarnings,
  build(e, input) {
    const inputKind = input!.kind;
    const withPhaseWarning = (model: ElementModel): ElementModel =>
      inputKind !== 'ac1'
        ? model
        : {
            ...model,
            report(sOut, sIn, vIn) {
              const r = model.report(sOut, sIn, vIn);
              r.warnings.push(singlePhaseWarning);
              return r;
            },
          };
    if (e.loss) {
      return withPhaseWarning(
        regulatingConverter({ out: { kind: 'ac3', frequency: e.outputFrequency }, outputVoltage: e.outputVoltage, inputKind, inputPowerFactor: e.inputPowerFactor, loss: e.loss }),
      );
    }
    const g = driveLossGrid(e.standardLoss!);
    if (!g.ok) throw new Error(`drive "${e.name ?? e.id}": its IEC 61800-9-2 operating points were not validated`);
    const grid = g.grid;
    // Without a supply frequency (fed from a source-less test) or a motor frequency the speed is taken as rated.
    const phi = driveSpeedFraction(e, input) ?? 1;
    const rated = e.standardLoss!.ratedApparentPower;
    const lossAt = (pOut: number) => {
      const op = driveOperatingPoint(e, phi, pOut);
      return driveLossAt(grid, op.speed, op.torque);
    };
    const vOut = c(e.outputVoltage / Math.sqrt(3));
    // Q = |P|·tan(arccos pf), lagging (reactiveFromPf), tan(arccos pf) worked once per model.
    const tanPhi = e.inputPowerFactor === 1 ? 0 : Math.tan(Math.acos(e.inputPowerFactor));
    return withPhaseWarning({
      out: { kind: 'ac3', frequency: e.outputFrequency },
      outputVoltage: () => vOut,
      inputPower(sOut) {
        const pIn = sOut.re + lossAt(sOut.re).loss;
        return c(pIn, e.inputPowerFactor === 1 ? 0 : Math.abs(pIn) * tanPhi);
      },
      report(sOut) {
        const warnings: KindWarning[] = [];
        const op = driveOperatingPoint(e, phi, sOut.re);
        const at = lossAt(sOut.re);
        if (op.torque > 100 * (1 + 1e-9)) {
          warnings.push({ code: 'rating-exceeded', ...say`relative torque-producing current ${op.torque.toFixed(1)} % exceeds the drive's rating (${q(rated, 'VA')} at ${fmtPct(phi)} speed)` });
        }
        if (at.clamped) {
          warnings.push({
            code: 'curve-extrapolated',
            message: `operating point (${op.speed.toFixed(1)} % speed, ${op.torque.toFixed(1)} % torque) lies outside the IEC 61800-9-2 grid; the loss at (${at.speed.toFixed(1)} %, ${at.torque.toFixed(1)} %) on its edge is used`,
          });
        }
        return { loadFraction: sOut.re / rated, warnings };
      },
    });
  },
});
