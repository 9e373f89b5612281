/**
 * The schema of the project's `spread` settings (core/model/spread.ts): the tolerances of the
 * runtime with its spread, its samples and seed. Single-field types and ranges (core/kinds/ranges.ts);
 * validate.ts lists it. The settings are read by core/studies/spread/.
 */
import { z } from 'zod/mini';
import { ranged, rangedCount } from '../kinds/ranges.ts';

/** Largest seed: the generator takes a 32-bit seed (pure-rand's xoroshiro128plus). */
export const MAX_SPREAD_SEED = 0xffff_ffff;

export const spreadSchema = z.strictObject({
  samples: z.optional(rangedCount('spreadSamples')),
  seed: z.optional(
    z.number({ error: 'must be a number' }).check(
      z.int('must be a whole number'),
      z.gte(0, 'must not be negative'),
      z.lte(MAX_SPREAD_SEED, 'must be below 2³² (the generator takes a 32-bit seed)'),
    ),
  ),
  capacityPercent: z.optional(ranged('tolerancePercent', 'non-negative')),
  agingPercent: z.optional(ranged('tolerancePercent', 'non-negative')),
  temperatureC: z.optional(ranged('temperatureRange', 'non-negative')),
  efficiencyPoints: z.optional(ranged('efficiencyPoints', 'non-negative')),
  loadPercent: z.optional(ranged('tolerancePercent', 'non-negative')),
  endVoltagePerCell: z.optional(ranged('cellVoltageTolerance', 'non-negative')),
});
