/**
 * Variable-frequency drive: AC (1φ or 3φ) in, three-phase AC out at its own voltage and frequency.
 * Input real power = output + drive loss; input reactive power from the input power factor.
 */
import { z } from 'zod';
import type { DriveStage } from '../model.ts';
import { checkLossModel, defineKind, fromField, idField, lossModelSchema, nameField, positive, regulatingConverter, unitFraction } from './spec.ts';

export const driveKind = defineKind<DriveStage>({
  kind: 'drive',
  role: 'stage',
  accepts: () => ['ac1', 'ac3'],
  schema: z.strictObject({
    id: idField,
    name: nameField,
    kind: z.literal('drive'),
    from: fromField,
    outputVoltage: positive('V'),
    outputFrequency: positive('Hz'),
    inputPowerFactor: unitFraction('power factor'),
    loss: lossModelSchema,
  }) as z.ZodType<DriveStage>,
  check: (e) => checkLossModel(e.loss),
  build(e, input) {
    const model = regulatingConverter({
      out: { kind: 'ac3', frequency: e.outputFrequency },
      outputVoltage: e.outputVoltage,
      inputKind: input!.kind,
      inputPowerFactor: e.inputPowerFactor,
      loss: e.loss,
    });
    if (input!.kind !== 'ac1') return model;
    return {
      ...model,
      report(sOut, sIn, vIn) {
        const r = model.report(sOut, sIn, vIn);
        r.warnings.push({
          code: 'check-derating',
          message: 'three-phase drive fed single-phase: most drives must then be derated (often to about half); check the maker’s single-phase rating',
        });
        return r;
      },
    };
  },
});
