/**
 * Cable link: passes its interface kind through and drops voltage over its series impedance,
 * solved exactly (two-bus). Per-phase impedance: on DC and single-phase the loop (go and return,
 * 2 × one-way length; X ignored on DC); on three-phase one conductor's length. Parallel sets divide Z.
 * The impedance is given explicitly or taken from a conductor spec (NEC or IEC tables; sized by
 * core/conductors/ through core/solve/size-conductors.ts).
 */
import { z } from 'zod/mini';
import type { CableStage } from '../model/project.ts';
import { c } from '../physics/complex.ts';
import { protectiveDeviceSchema } from './starting-fields.ts';
import { defineKind, fromField, idField, nameField, positive, seriesLink } from './spec.ts';
import { ranged, rangedCount } from './ranges.ts';

const rating = z.union([z.literal(60), z.literal(75), z.literal(90)], { error: 'must be 60, 75 or 90 (°C)' });
const common = {
  material: z.enum(['copper', 'aluminium'], { error: 'must be "copper" or "aluminium"' }),
  size: z.string({ error: 'must be a size from the table (e.g. "4 AWG", "2.5 mm²") or "auto"' }).check(z.minLength(1, 'must not be empty')),
  ambient: z.optional(ranged('temperature', 'range')),
  continuous: z.optional(z.boolean({ error: 'must be true or false' })),
  maxDropPercent: z.optional(positive('%').check(z.lte(100, 'must not exceed 100 %'))),
  designCurrentBasis: z.optional(
    z.enum(['auto', 'load', 'equipment', 'given'], { error: 'must be "auto", "load", "equipment" or "given"' }),
  ),
  designCurrent: z.optional(ranged('current')),
};

/**
 * The conductor spec: NEC (Table 310.16 columns by temperature rating, Table 9 raceway) or IEC
 * (60364-5-52 insulation and installation method). Which methods have data is checked when sizing.
 */
const conductorSchema = z.discriminatedUnion(
  'system',
  [
    z.strictObject({
      system: z.literal('nec'),
      ...common,
      insulationRating: rating,
      terminationRating: z.optional(rating),
      raceway: z.optional(z.enum(['pvc', 'aluminium', 'steel'], { error: 'must be "pvc", "aluminium" or "steel" (NEC Chapter 9 Table 9 raceway)' })),
      currentCarryingConductors: z.optional(rangedCount('conductorCount')),
      multioutletBranch: z.optional(z.boolean({ error: 'must be true or false' })),
      motorDevice: z.optional(
        z.enum(['inverse-time-breaker', 'time-delay-fuse', 'non-time-delay-fuse'], { error: 'must be "inverse-time-breaker", "time-delay-fuse" or "non-time-delay-fuse"' }),
      ),
    }),
    z.strictObject({
      system: z.literal('iec'),
      ...common,
      insulation: z.enum(['pvc', 'xlpe'], { error: 'must be "pvc" or "xlpe"' }),
      installationMethod: z.enum(['A1', 'A2', 'B1', 'B2', 'C', 'D1', 'D2', 'E', 'F', 'G'], {
        error: 'must be an IEC 60364-5-52 reference method: A1, A2, B1, B2, C, D1, D2, E, F or G',
      }),
      loadedConductors: z.optional(z.union([z.literal(2), z.literal(3)], { error: 'must be 2 or 3' })),
      groupedCircuits: z.optional(rangedCount('conductorCount')),
      deviceType: z.optional(z.enum(['circuit-breaker', 'gG-fuse'], { error: 'must be "circuit-breaker" or "gG-fuse"' })),
    }),
  ],
  { error: 'must say system "nec" or "iec"' },
);

export const cableKind = defineKind<CableStage>({
  kind: 'cable',
  role: 'stage',
  accepts: () => ['dc', 'ac1', 'ac3'],
  schema: z.strictObject({
    id: idField,
    name: nameField,
    kind: z.literal('cable'),
    from: fromField,
    length: ranged('length'),
    resistancePerKm: z.optional(ranged('resistancePerKm')),
    reactancePerKm: z.optional(ranged('reactancePerKm', 'non-negative')),
    conductor: z.optional(conductorSchema),
    parallelSets: z.optional(rangedCount('conductorCount')),
    protection: z.optional(protectiveDeviceSchema),
  }) as z.ZodMiniType<CableStage>,
  check(e) {
    // Exactly one way of giving the impedance.
    if (e.conductor && (e.resistancePerKm !== undefined || e.reactancePerKm !== undefined)) {
      return [
        {
          code: 'invalid-value',
          field: e.resistancePerKm !== undefined ? 'resistancePerKm' : 'reactancePerKm',
          value: e.resistancePerKm ?? e.reactancePerKm,
          message: 'give either the impedance (resistance and reactance per km) or a conductor, not both',
        },
      ];
    }
    if (!e.conductor && e.resistancePerKm === undefined) {
      return [{ code: 'invalid-value', field: 'resistancePerKm', message: 'is required (or give a conductor to take it from the tables)' }];
    }
    return [];
  },
  passive: true,
  // The port it is fed at (a cable carries no shaft).
  nominalOutput: (_e, input) => (input && input.kind !== 'shaft' ? input : null),
  // On DC: resistance per km × 2 × length ÷ parallel sets (the go and return conductors, Ohm's law).
  dcEquivalent: (e) =>
    e.resistancePerKm === undefined || e.conductor ? null : { resistance: (e.resistancePerKm * 2 * e.length) / 1000 / (e.parallelSets ?? 1), fixedLoss: 0 },
  build(e, input) {
    const kind = input!.kind;
    const conductors = kind === 'ac3' ? 1 : 2; // loop length on DC and single-phase
    const km = (e.length * conductors) / 1000 / (e.parallelSets ?? 1);
    // A link with a conductor spec reaches the solve with the impedance of its chosen size
    // (core/solve/size-conductors.ts); before that (a plan run only to check port kinds) it is ideal.
    const z = c((e.resistancePerKm ?? 0) * km, kind === 'dc' ? 0 : (e.reactancePerKm ?? 0) * km);
    const link = seriesLink(z, kind);
    return {
      out: { ...input! },
      outputVoltage: link.outputVoltage,
      inputPower: (sOut, vIn, vOut) => link.inputPower(sOut, vOut, vIn),
      report: () => ({ warnings: [] }),
    };
  },
});
