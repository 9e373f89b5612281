/** DC-DC converter: DC in, regulated DC out. */
import { z } from 'zod/mini';
import type { DcDcStage } from '../model/project.ts';
import { checkLossModel, defineKind, finiteOrNone, fromField, idField, lossModelSchema, nameField, nominalPort, regulatingConverter } from './spec.ts';
import { ranged } from './ranges.ts';

export const dcDcKind = defineKind<DcDcStage>({
  kind: 'dc-dc',
  role: 'stage',
  accepts: () => ['dc'],
  schema: z.strictObject({
    id: idField,
    name: nameField,
    kind: z.literal('dc-dc'),
    from: fromField,
    outputVoltage: ranged('voltage'),
    loss: lossModelSchema,
    // Maker's ratings, read by conductor sizing only (the solve does not use them).
    ratedOutputPower: z.optional(ranged('ratedPower')),
    minInputVoltage: z.optional(ranged('voltage')),
  }) as z.ZodMiniType<DcDcStage>,
  check: (e) => checkLossModel(e.loss),
  regulatesVoltage: true,
  nominalOutput: (e) => nominalPort('dc', finiteOrNone(e.outputVoltage)),
  build: (e) => regulatingConverter({ out: { kind: 'dc' }, outputVoltage: e.outputVoltage, inputKind: 'dc', loss: e.loss }),
});
