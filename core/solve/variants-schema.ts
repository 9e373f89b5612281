/**
 * The schema of the project's `variants` (core/model/variants.ts): their shape only. Whether a
 * variant still applies to the chain (its element ids exist, its values pass each kind's checks) is
 * asked when it is solved (core/solve/project-variant.ts), so a project whose variant names an
 * element the user has since deleted still opens, and the comparison says what no longer applies.
 */
import { z } from 'zod/mini';
import { MAX_VARIANTS, VARIANT_NAME_MAX } from '../model/variants.ts';

const variantSchema = z.strictObject({
  name: z.string({ error: 'must be text' }).check(
    z.minLength(1, 'must not be empty (a variant is named in the comparison)'),
    z.maxLength(VARIANT_NAME_MAX, `must be at most ${VARIANT_NAME_MAX} characters (it heads a column of the comparison)`),
  ),
  note: z.optional(z.string({ error: 'must be text' })),
  set: z.optional(
    z.record(
      z.string({ error: 'must be an element id' }),
      z.record(z.string({ error: 'must be a field name' }), z.unknown(), { error: 'must list fields and their values' }),
      { error: 'must list elements by id, each with the fields it sets' },
    ),
  ),
  swap: z.optional(z.array(z.unknown(), { error: 'must be a list of elements' })),
  remove: z.optional(z.array(z.string({ error: 'must be an element id' }), { error: 'must be a list of element ids' })),
});

export const variantsSchema = z
  .array(variantSchema, { error: 'must be a list of variants' })
  .check(
    z.maxLength(MAX_VARIANTS, `must hold at most ${MAX_VARIANTS} variants`),
    z.refine((list) => new Set(list.map((v) => v.name)).size === list.length, { error: 'must give each variant a name of its own (two have the same name)' }),
  );
