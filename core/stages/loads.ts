/** Loads (leaves of the tree), all constant-power: their current rises as their voltage sags. */
import { z } from 'zod/mini';
import type { AcApparentLoad, AcPowerLoad, DcLoad, ShaftLoad } from '../model.ts';
import { c } from '../ac/complex.ts';
import { constantPowerLoad, defineKind, fromField, idField, nameField, nonNegative, pfSense, reactiveFromPf, unitFraction } from './spec.ts';

const base = { id: idField, name: nameField, from: fromField };

export const dcLoadKind = defineKind<DcLoad>({
  kind: 'dc-load',
  role: 'load',
  accepts: () => ['dc'],
  schema: z.strictObject({ ...base, kind: z.literal('dc-load'), power: nonNegative('W') }) as z.ZodMiniType<DcLoad>,
  build: (e) => constantPowerLoad(c(e.power)),
});

export const acLoadKind = defineKind<AcPowerLoad>({
  kind: 'ac-load',
  role: 'load',
  accepts: () => ['ac1', 'ac3'],
  schema: z.strictObject({
    ...base,
    kind: z.literal('ac-load'),
    power: nonNegative('W'),
    powerFactor: unitFraction('power factor'),
    pfSense,
  }) as z.ZodMiniType<AcPowerLoad>,
  build: (e) => constantPowerLoad(c(e.power, reactiveFromPf(e.power, e.powerFactor, e.pfSense))),
});

export const acVaLoadKind = defineKind<AcApparentLoad>({
  kind: 'ac-va-load',
  role: 'load',
  accepts: () => ['ac1', 'ac3'],
  schema: z.strictObject({
    ...base,
    kind: z.literal('ac-va-load'),
    apparentPower: nonNegative('VA'),
    powerFactor: unitFraction('power factor'),
    pfSense,
  }) as z.ZodMiniType<AcApparentLoad>,
  build(e) {
    const p = e.apparentPower * e.powerFactor;
    return constantPowerLoad(c(p, reactiveFromPf(p, e.powerFactor, e.pfSense)));
  },
});

export const shaftLoadKind = defineKind<ShaftLoad>({
  kind: 'shaft-load',
  role: 'load',
  accepts: () => ['shaft'],
  schema: z.strictObject({ ...base, kind: z.literal('shaft-load'), power: nonNegative('W') }) as z.ZodMiniType<ShaftLoad>,
  build: (e) => constantPowerLoad(c(e.power)),
});
