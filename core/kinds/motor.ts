/**
 * Motor: AC in, shaft power out. Efficiency and power factor come from exactly one of
 * - explicit models: `loss` (against shaft output) and `powerFactor` (constant or vs load fraction);
 * - an efficiency-class preset (IEC 60034-30-1 IE1–IE4, NEMA MG 1 Table 12-12 Premium) or the
 *   nameplate full-load values, with the common-practice part-load shape
 *   (core/physics/motor-rating.ts, core/data/motor-part-load.ts).
 * Loss: P_loss = P_shaft·(1/η(x) − 1), x = P_shaft / rated output. Reactive power from the power
 * factor at the present load fraction: Q = P_in·tan(arccos pf).
 * Service factor: a load above rated but within SF × rated warns; above SF × rated the element's
 * report returns a problem at `ratedOutput`, so the solve itself refuses the chain.
 * Shaft speed: rated speed × (supply frequency / rated frequency) when both are known (a motor on a
 * drive; slip taken as a constant fraction, common practice).
 */
import { z } from 'zod/mini';
import type { MotorStage, PowerFactorModel } from '../model/project.ts';
import { c } from '../physics/complex.ts';
import { prepareLoss, interpolate } from '../physics/loss-model.ts';
import { checkLossModel, checkPoints, defineKind, efficiencyField, fmtPct, fmtW, fromField, idField, lossModelSchema, lossReport, nameField, pureModel, reactiveFromPf, unitFraction, type ElementReport, type KindWarning, type LossMemo } from './spec.ts';
import { MOTOR_CLASSES, motorRating, ratedAt } from '../physics/motor-rating.ts';
import { checkStarting, startingSchema } from './starting-fields.ts';
import { ranged } from './ranges.ts';

const pfModel = z.discriminatedUnion(
  'model',
  [
    z.strictObject({ model: z.literal('constant'), powerFactor: unitFraction('power factor') }),
    z.strictObject({
      model: z.literal('curve'),
      points: z
        .array(z.strictObject({ loadFraction: ranged('loadFraction', 'positive', '(a fraction of rated output)'), powerFactor: unitFraction('power factor') }))
        .check(z.minLength(2, 'needs at least two points')),
    }),
  ],
  { error: 'must be "constant" or "curve"' },
);

/** Below this load fraction motor efficiency and power factor fall off steeply (common practice). */
const LIGHT_LOAD = 0.4;
/** A shaft output has no voltage: one zero phasor for every call (nothing mutates a solved voltage). */
const SHAFT_VOLTAGE = c(0);

function pfAt(model: PowerFactorModel, x: number): number {
  if (model.model === 'constant') return model.powerFactor;
  const pts = [...model.points].sort((a, b) => a.loadFraction - b.loadFraction).map((p) => ({ x: p.loadFraction, y: p.powerFactor }));
  return interpolate(pts, x).y;
}

/** Shaft load beyond the service factor: the message the refusal and the warning share. */
export function serviceFactorMessage(pShaft: number, rated: number, sf: number): string {
  return `shaft load ${fmtW(pShaft)} (${fmtPct(pShaft / rated)} of rated) exceeds the service factor ${sf} × rated output ${fmtW(rated)}; choose a larger motor or reduce the load`;
}

export const motorKind = defineKind<MotorStage>({
  kind: 'motor',
  role: 'stage',
  accepts: () => ['ac1', 'ac3'],
  schema: z.strictObject({
    id: idField,
    name: nameField,
    kind: z.literal('motor'),
    from: fromField,
    ratedOutput: ranged('ratedPower'),
    loss: z.optional(lossModelSchema),
    powerFactor: z.optional(pfModel),
    ratedSpeed: z.optional(ranged('speed')),
    ratedVoltage: z.optional(ranged('voltage')),
    poles: z.optional(z.union([z.literal(2), z.literal(4), z.literal(6), z.literal(8)], { error: 'must be 2, 4, 6 or 8' })),
    ratedFrequency: z.optional(ranged('frequency')),
    efficiencyClass: z.optional(z.enum(MOTOR_CLASSES as [string, ...string[]], { error: `unknown efficiency class; expected one of ${MOTOR_CLASSES.join(', ')}` })),
    nameplate: z.optional(
      z.strictObject({
        efficiency: efficiencyField().check(z.lt(1, 'efficiency must be below 1 (enter 0.93 for 93 %)')),
        powerFactor: z.optional(unitFraction('power factor')),
        current: z.optional(ranged('current')),
      }),
    ),
    ratedPowerFactor: z.optional(unitFraction('power factor')),
    serviceFactor: z.optional(z.number({ error: 'must be a number' }).check(z.gte(1, 'must be at least 1 (1.15 is common on NEMA motors)'), z.lte(2, 'must not exceed 2'))),
    starting: z.optional(startingSchema),
  }) as z.ZodMiniType<MotorStage>,
  check(e) {
    const given = [e.loss !== undefined || e.powerFactor !== undefined, e.efficiencyClass !== undefined, e.nameplate !== undefined].filter(Boolean).length;
    if (given !== 1) {
      return [{ code: 'invalid-value', field: given === 0 ? 'loss' : 'efficiencyClass', message: 'give the motor one way: a loss model with its power factor, an efficiency class, or the nameplate figures' }];
    }
    if (e.loss !== undefined || e.powerFactor !== undefined) {
      if (e.loss === undefined) return [{ code: 'invalid-value', field: 'loss', message: 'is required beside the power factor' }];
      if (e.powerFactor === undefined) return [{ code: 'invalid-value', field: 'powerFactor', message: 'is required beside loss' }];
      const problems = checkLossModel(e.loss);
      if (e.powerFactor.model === 'curve') problems.push(...checkPoints(e.powerFactor.points, 'powerFactor.points', 2));
      return problems;
    }
    const r = motorRating(e);
    return [...(r.ok ? [] : r.problems), ...checkStarting(e.starting)];
  },
  nominalOutput: () => ({ kind: 'shaft' }),
  studies: ['machines', 'motor-start'],
  build(e, input) {
    const sf = e.serviceFactor ?? 1;
    const speed = e.ratedSpeed !== undefined && e.ratedFrequency !== undefined && input?.frequency !== undefined ? (e.ratedSpeed * input.frequency) / e.ratedFrequency : e.ratedSpeed;
    const out = { kind: 'shaft' as const, ...(speed !== undefined ? { speed } : {}) };
    /** Beyond the service factor the load is refused (the field to change is the rating); up to it, a warning. */
    const overload = (x: number, pShaft: number): ElementReport['problems'] =>
      x > sf * (1 + 1e-9) ? [{ code: 'invalid-value', field: 'ratedOutput', value: pShaft, message: serviceFactorMessage(pShaft, e.ratedOutput, sf) }] : [];
    const loadWarnings = (x: number, pShaft: number): KindWarning[] => {
      const w: KindWarning[] = [];
      if (x > 1 + 1e-9 && x <= sf * (1 + 1e-9)) w.push({ code: 'rating-exceeded', message: `shaft load ${fmtW(pShaft)} exceeds the rated output ${fmtW(e.ratedOutput)} (within the service factor ${sf}; expect more heating and shorter insulation life)` });
      if (x > 0 && x < LIGHT_LOAD) {
        w.push({ code: 'light-load', message: `runs at ${fmtPct(x)} of rated output; efficiency and power factor fall off below about 40–50 % load on typical motors (the maker's part-load figures govern)` });
      }
      return w;
    };
    const r = motorRating(e);
    const rating = r.ok ? r.rating : undefined;
    // Both models keep nothing between calls (pureModel: the plan may reuse them).
    if (rating) {
      return pureModel({
        out,
        outputVoltage: () => SHAFT_VOLTAGE,
        inputPower(sOut) {
          const p = sOut.re;
          const at = ratedAt(rating, p / e.ratedOutput);
          const pIn = p / at.efficiency;
          return c(pIn, reactiveFromPf(pIn, at.powerFactor));
        },
        report(sOut) {
          const x = sOut.re / e.ratedOutput;
          const warnings = loadWarnings(x, sOut.re);
          if (ratedAt(rating, x).extrapolated) {
            warnings.push({ code: 'curve-extrapolated', message: `operating at ${fmtPct(x)} of rated output, outside the part-load shape (25–125 %); its end value is used` });
          }
          return { loadFraction: x, warnings, problems: overload(x, sOut.re) };
        },
      });
    }
    const loss = e.loss!;
    const pfModelOf = e.powerFactor!;
    const prepared = prepareLoss(loss.model === 'constant' && loss.ratedPower === undefined ? { ...loss, ratedPower: e.ratedOutput } : loss);
    const memo: LossMemo = {};
    return pureModel({
      out,
      outputVoltage: () => SHAFT_VOLTAGE,
      inputPower(sOut) {
        const pIn = sOut.re + prepared.loss(sOut.re).loss;
        return c(pIn, reactiveFromPf(pIn, pfAt(pfModelOf, sOut.re / e.ratedOutput)));
      },
      report(sOut) {
        const x = sOut.re / e.ratedOutput;
        const { warnings, fit } = lossReport(prepared, sOut.re, memo);
        const kept = warnings.filter((w) => w.code !== 'rating-exceeded');
        kept.push(...loadWarnings(x, sOut.re));
        return { loadFraction: x, warnings: kept, problems: overload(x, sOut.re), ...(fit ? { fit } : {}) };
      },
    });
  },
});

export { pfAt as motorPowerFactorAt };
