/**
 * Cable link: passes its interface kind through and drops voltage over its series impedance,
 * solved exactly (two-bus). Per-phase impedance: on DC and single-phase the loop (go and return,
 * 2 × one-way length; X ignored on DC); on three-phase one conductor's length. Parallel sets divide Z.
 */
import { z } from 'zod';
import type { CableStage } from '../model.ts';
import { c } from '../ac/complex.ts';
import { defineKind, fromField, idField, nameField, nonNegative, positive, seriesLink } from './spec.ts';

export const cableKind = defineKind<CableStage>({
  kind: 'cable',
  role: 'stage',
  accepts: () => ['dc', 'ac1', 'ac3'],
  schema: z.strictObject({
    id: idField,
    name: nameField,
    kind: z.literal('cable'),
    from: fromField,
    length: positive('m'),
    resistancePerKm: positive('Ω/km'),
    reactancePerKm: nonNegative('Ω/km').optional(),
    parallelSets: z.number({ error: 'must be a number' }).int('must be a whole number').gte(1, 'must be at least 1').optional(),
  }) as z.ZodType<CableStage>,
  build(e, input) {
    const kind = input!.kind;
    const conductors = kind === 'ac3' ? 1 : 2; // loop length on DC and single-phase
    const km = (e.length * conductors) / 1000 / (e.parallelSets ?? 1);
    const z = c(e.resistancePerKm * km, kind === 'dc' ? 0 : (e.reactancePerKm ?? 0) * km);
    const link = seriesLink(z, kind);
    return {
      out: { ...input! },
      outputVoltage: (vIn, sOut) => link.outputVoltage(vIn, sOut),
      inputPower: (sOut, _vIn, vOut) => link.inputPower(sOut, vOut),
      report: () => ({ warnings: [] }),
    };
  },
});
