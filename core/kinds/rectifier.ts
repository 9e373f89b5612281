/** Rectifier or battery charger: AC (1φ or 3φ) in, regulated DC out. */
import { z } from 'zod/mini';
import type { RectifierStage } from '../model/project.ts';
import { checkLossModel, defineKind, finiteOrNone, fromField, idField, lossModelSchema, nameField, nominalPort, pfSense, regulatingConverter, unitFraction } from './spec.ts';
import { ranged } from './ranges.ts';

export const rectifierKind = defineKind<RectifierStage>({
  kind: 'rectifier',
  role: 'stage',
  accepts: () => ['ac1', 'ac3'],
  schema: z.strictObject({
    id: idField,
    name: nameField,
    kind: z.literal('rectifier'),
    from: fromField,
    outputVoltage: ranged('voltage'),
    inputPowerFactor: unitFraction('power factor'),
    inputPfSense: pfSense,
    loss: lossModelSchema,
    // Maker's rating, read by conductor sizing only (the solve does not use it).
    ratedOutputCurrent: z.optional(ranged('current')),
  }) as z.ZodMiniType<RectifierStage>,
  check: (e) => checkLossModel(e.loss),
  regulatesVoltage: true,
  nominalOutput: (e) => nominalPort('dc', finiteOrNone(e.outputVoltage)),
  build: (e, input) =>
    regulatingConverter({
      out: { kind: 'dc' },
      outputVoltage: e.outputVoltage,
      inputKind: input!.kind,
      inputPowerFactor: e.inputPowerFactor,
      ...(e.inputPfSense ? { inputPfSense: e.inputPfSense } : {}),
      loss: e.loss,
    }),
});
