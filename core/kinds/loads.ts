/**
 * Loads (leaves of the tree). Most are constant-power: their current rises as their voltage sags.
 * The two given by their current (`dc-current-load`, `ac-current-load`) are constant-CURRENT: the
 * current and its angle to the voltage stay as given, so they draw P = V·I (DC) and S = V·I* per
 * phase (S = V·I single-phase, √3·V_LL·I three-phase) at the solved voltage (constantCurrentLoad).
 */
import { z } from 'zod/mini';
import type { AcApparentLoad, AcCurrentLoad, AcPowerLoad, DcCurrentLoad, DcLoad, ShaftLoad } from '../model/project.ts';
import { c } from '../physics/complex.ts';
import { constantCurrentLoad, constantPowerLoad, defineKind, fromField, idField, nameField, pfSense, reactiveFromPf, unitFraction } from './spec.ts';
import { ranged } from './ranges.ts';

const base = { id: idField, name: nameField, from: fromField };

export const dcLoadKind = defineKind<DcLoad>({
  kind: 'dc-load',
  role: 'load',
  load: { field: 'power', unit: 'W' },
  accepts: () => ['dc'],
  schema: z.strictObject({ ...base, kind: z.literal('dc-load'), power: ranged('power', 'non-negative') }) as z.ZodMiniType<DcLoad>,
  build: (e) => constantPowerLoad(c(e.power)),
});

export const acLoadKind = defineKind<AcPowerLoad>({
  kind: 'ac-load',
  role: 'load',
  load: { field: 'power', unit: 'W' },
  accepts: () => ['ac1', 'ac3'],
  schema: z.strictObject({
    ...base,
    kind: z.literal('ac-load'),
    power: ranged('power', 'non-negative'),
    powerFactor: unitFraction('power factor'),
    pfSense,
  }) as z.ZodMiniType<AcPowerLoad>,
  build: (e) => constantPowerLoad(c(e.power, reactiveFromPf(e.power, e.powerFactor, e.pfSense))),
});

export const acVaLoadKind = defineKind<AcApparentLoad>({
  kind: 'ac-va-load',
  role: 'load',
  load: { field: 'apparentPower', unit: 'VA' },
  accepts: () => ['ac1', 'ac3'],
  schema: z.strictObject({
    ...base,
    kind: z.literal('ac-va-load'),
    apparentPower: ranged('apparentPower', 'non-negative'),
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
  load: { field: 'power', unit: 'W' },
  accepts: () => ['shaft'],
  schema: z.strictObject({ ...base, kind: z.literal('shaft-load'), power: ranged('power', 'non-negative') }) as z.ZodMiniType<ShaftLoad>,
  build: (e) => constantPowerLoad(c(e.power)),
});

export const dcCurrentLoadKind = defineKind<DcCurrentLoad>({
  kind: 'dc-current-load',
  role: 'load',
  load: { field: 'current', unit: 'A' },
  accepts: () => ['dc'],
  schema: z.strictObject({ ...base, kind: z.literal('dc-current-load'), current: ranged('current', 'non-negative') }) as z.ZodMiniType<DcCurrentLoad>,
  build: (e) => constantCurrentLoad(c(e.current), 'dc'),
});

export const acCurrentLoadKind = defineKind<AcCurrentLoad>({
  kind: 'ac-current-load',
  role: 'load',
  load: { field: 'current', unit: 'A' },
  accepts: () => ['ac1', 'ac3'],
  schema: z.strictObject({
    ...base,
    kind: z.literal('ac-current-load'),
    current: ranged('current', 'non-negative'),
    powerFactor: unitFraction('power factor'),
    pfSense,
  }) as z.ZodMiniType<AcCurrentLoad>,
  build(e, input) {
    // The current phasor relative to the voltage: I·(cos φ − j·sin φ), lagging behind it (Q > 0) or
    // leading (Q < 0), so that S = V·I* = |V|·I·(cos φ ± j·sin φ) per phase.
    const sin = Math.sqrt(Math.max(0, 1 - e.powerFactor * e.powerFactor));
    const im = e.pfSense === 'leading' ? sin : -sin;
    return constantCurrentLoad(c(e.current * e.powerFactor, e.current * im), input!.kind);
  },
});
