/** A converting stage with user-chosen input and output kinds (regulated output). */
import { z } from 'zod/mini';
import type { GenericStage } from '../model/project.ts';
import { checkLossModel, defineKind, finiteOrNone, fromField, idField, lossModelSchema, nameField, nominalPort, pfSense, regulatingConverter, unitFraction } from './spec.ts';
import { ranged } from './ranges.ts';

const electrical = z.enum(['dc', 'ac1', 'ac3'], { error: 'must be "dc", "ac1" or "ac3"' });

export const genericKind = defineKind<GenericStage>({
  kind: 'generic',
  role: 'stage',
  accepts: (e) => [e.inputKind],
  schema: z.strictObject({
    id: idField,
    name: nameField,
    kind: z.literal('generic'),
    from: fromField,
    inputKind: electrical,
    outputKind: electrical,
    outputVoltage: ranged('voltage'),
    outputFrequency: z.optional(ranged('frequency')),
    inputPowerFactor: z.optional(unitFraction('power factor')),
    inputPfSense: pfSense,
    loss: lossModelSchema,
  }) as z.ZodMiniType<GenericStage>,
  check(e) {
    const problems = checkLossModel(e.loss);
    if (e.outputKind !== 'dc' && e.outputFrequency === undefined) {
      problems.push({ code: 'invalid-value', field: 'outputFrequency', message: 'is needed when the output is AC' });
    }
    return problems;
  },
  regulatesVoltage: true,
  nominalOutput(e) {
    const k = e.outputKind;
    if (k !== 'dc' && k !== 'ac1' && k !== 'ac3') return null;
    return nominalPort(k, finiteOrNone(e.outputVoltage), k === 'dc' ? undefined : finiteOrNone(e.outputFrequency));
  },
  build: (e, input) =>
    regulatingConverter({
      out: e.outputKind === 'dc' ? { kind: 'dc' } : { kind: e.outputKind, frequency: e.outputFrequency! },
      outputVoltage: e.outputVoltage,
      inputKind: input!.kind,
      ...(e.inputPowerFactor !== undefined ? { inputPowerFactor: e.inputPowerFactor } : {}),
      ...(e.inputPfSense ? { inputPfSense: e.inputPfSense } : {}),
      loss: e.loss,
    }),
});
