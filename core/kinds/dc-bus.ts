/** DC bus or distribution board: voltage passes through unchanged; a fixed loss of its own. */
import { z } from 'zod/mini';
import type { DcBusStage } from '../model/project.ts';
import { c } from '../physics/complex.ts';
import { defineKind, fromField, idField, nameField, nominalPort, pureModel } from './spec.ts';
import { ranged } from './ranges.ts';

export const dcBusKind = defineKind<DcBusStage>({
  kind: 'dc-bus',
  role: 'stage',
  accepts: () => ['dc'],
  schema: z.strictObject({
    id: idField,
    name: nameField,
    kind: z.literal('dc-bus'),
    from: fromField,
    fixedLoss: ranged('power', 'non-negative'),
  }) as z.ZodMiniType<DcBusStage>,
  passive: true,
  // The voltage it is fed at.
  nominalOutput: (_e, input) => (input && input.kind === 'dc' ? input : nominalPort('dc')),
  dcEquivalent: (e) => ({ resistance: 0, fixedLoss: e.fixedLoss }),
  build: (e) =>
    pureModel({
      out: { kind: 'dc' },
      passesVoltage: true,
      outputVoltage: (vIn) => vIn,
      inputPower: (sOut) => c(sOut.re + e.fixedLoss),
      report: () => ({ warnings: [] }),
    }),
});
