/**
 * Motor: AC in, shaft power out. Loss from its loss model against shaft output; reactive power from
 * the power factor at the present load fraction: Q = P_in·tan(arccos pf).
 */
import { z } from 'zod';
import type { MotorStage, PowerFactorModel } from '../model.ts';
import { c } from '../ac/complex.ts';
import { prepareLoss, interpolate } from './loss-model.ts';
import { checkLossModel, checkPoints, defineKind, fmtPct, fmtW, fromField, idField, lossModelSchema, lossReport, nameField, positive, reactiveFromPf, unitFraction } from './spec.ts';

const pfModel = z.discriminatedUnion(
  'model',
  [
    z.strictObject({ model: z.literal('constant'), powerFactor: unitFraction('power factor') }),
    z.strictObject({
      model: z.literal('curve'),
      points: z
        .array(z.strictObject({ loadFraction: positive('(a fraction of rated output)'), powerFactor: unitFraction('power factor') }))
        .min(2, 'needs at least two points'),
    }),
  ],
  { error: 'must be "constant" or "curve"' },
);

/** Below this load fraction motor efficiency and power factor fall off steeply (common practice). */
const LIGHT_LOAD = 0.4;

function pfAt(model: PowerFactorModel, x: number): number {
  if (model.model === 'constant') return model.powerFactor;
  const pts = [...model.points].sort((a, b) => a.loadFraction - b.loadFraction).map((p) => ({ x: p.loadFraction, y: p.powerFactor }));
  return interpolate(pts, x).y;
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
    ratedOutput: positive('W'),
    loss: lossModelSchema,
    powerFactor: pfModel,
    ratedSpeed: positive('rpm').optional(),
  }) as z.ZodType<MotorStage>,
  check(e) {
    const problems = checkLossModel(e.loss);
    if (e.powerFactor.model === 'curve') problems.push(...checkPoints(e.powerFactor.points, 'powerFactor.points', 2));
    return problems;
  },
  build(e) {
    const prepared = prepareLoss(e.loss.model === 'constant' && e.loss.ratedPower === undefined ? { ...e.loss, ratedPower: e.ratedOutput } : e.loss);
    return {
      out: { kind: 'shaft', ...(e.ratedSpeed !== undefined ? { speed: e.ratedSpeed } : {}) },
      outputVoltage: () => c(0),
      inputPower(sOut) {
        const pIn = sOut.re + prepared.loss(sOut.re).loss;
        return c(pIn, reactiveFromPf(pIn, pfAt(e.powerFactor, sOut.re / e.ratedOutput)));
      },
      report(sOut) {
        const x = sOut.re / e.ratedOutput;
        const { warnings, fit } = lossReport(prepared, sOut.re);
        const kept = warnings.filter((w) => w.code !== 'rating-exceeded');
        if (x > 1 + 1e-9) kept.push({ code: 'rating-exceeded', message: `shaft load ${fmtW(sOut.re)} exceeds the rated output ${fmtW(e.ratedOutput)}` });
        if (x > 0 && x < LIGHT_LOAD) {
          kept.push({ code: 'light-load', message: `runs at ${fmtPct(x)} of rated output; efficiency and power factor fall off below about 40–50 % load (common practice)` });
        }
        return { loadFraction: x, warnings: kept, ...(fit ? { fit } : {}) };
      },
    };
  },
});
