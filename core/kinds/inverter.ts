/** Inverter: DC in, regulated single- or three-phase AC out. */
import { z } from 'zod/mini';
import type { InverterStage } from '../model/project.ts';
import { surgeSchema } from './starting-fields.ts';
import { checkLossModel, defineKind, finiteOrNone, fromField, idField, lossModelSchema, nameField, nominalPort, phases, regulatingConverter } from './spec.ts';
import { ranged } from './ranges.ts';

export const inverterKind = defineKind<InverterStage>({
  kind: 'inverter',
  role: 'stage',
  accepts: () => ['dc'],
  schema: z.strictObject({
    id: idField,
    name: nameField,
    kind: z.literal('inverter'),
    from: fromField,
    phases,
    outputVoltage: ranged('voltage'),
    frequency: ranged('frequency'),
    loss: lossModelSchema,
    surge: z.optional(surgeSchema),
    lowVoltageCutoff: z.optional(ranged('voltage')),
    // Maker's rating, read by conductor sizing only (the solve does not use it).
    ratedOutputPower: z.optional(ranged('ratedPower')),
    // An inverter-charger's pass-through limit, read by the modes study only (core/solve/modes.ts).
    passThroughLimit: z.optional(ranged('current')),
  }) as z.ZodMiniType<InverterStage>,
  check: (e) => checkLossModel(e.loss),
  regulatesVoltage: true,
  nominalOutput: (e) => nominalPort(e.phases === 3 ? 'ac3' : 'ac1', finiteOrNone(e.outputVoltage), finiteOrNone(e.frequency)),
  build: (e) =>
    regulatingConverter({
      out: { kind: e.phases === 3 ? 'ac3' : 'ac1', frequency: e.frequency },
      outputVoltage: e.outputVoltage,
      inputKind: 'dc',
      loss: e.loss,
    }),
});
