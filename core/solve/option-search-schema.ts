/**
 * The schema of the project's `optionSearch` (core/model/option-search.ts): the search settings'
 * shape, single-field types and ranges; validate.ts lists it. Whether the candidates still fit the
 * chain (the bank, cables and elements they name exist, the sizes are in the cable's table, the
 * alternatives pass their kind's checks) is asked when the search runs (core/studies/search/), so a
 * project whose search names an element the user has since deleted still opens.
 */
import { z } from 'zod/mini';
import { ranged } from '../kinds/ranges.ts';
import { SEARCH_MAX_CHOICES } from '../model/option-search.ts';
import { priceSchema } from './running-schema.ts';

const id = (what: string) => z.string({ error: `must be the id of ${what}` }).check(z.minLength(1, `must name ${what}`));
const size = z.string({ error: 'must be a size as the table labels it ("10 mm²", "4 AWG")' });
const list = <T extends z.core.SomeType>(item: T, what: string) =>
  z.array(item, { error: `must be a list of ${what}` }).check(z.maxLength(SEARCH_MAX_CHOICES, `must hold at most ${SEARCH_MAX_CHOICES} ${what}`));

export const optionSearchSchema = z.strictObject({
  targetRuntimeHours: z.optional(ranged('hours')),
  maxLossW: z.optional(ranged('power')),
  order: z.optional(z.enum(['cost', 'losses'], { error: 'must be "cost" or "losses"' })),
  systemVoltages: z.optional(
    list(
      z.literal([12, 24, 48], { error: 'must be 12, 24 or 48 V' }),
      'system voltages',
    ),
  ),
  strings: z.optional(
    z.strictObject({
      bank: id('a battery bank'),
      counts: list(z.number({ error: 'must be a number' }).check(z.int('must be a whole number of strings'), z.gte(1, 'must be at least 1 string'), z.lte(64, 'must not exceed 64 strings')), 'numbers of strings'),
      pricePerString: z.optional(priceSchema),
    }),
  ),
  cables: z.optional(
    list(
      z.strictObject({
        cable: id('a cable'),
        sizes: z.optional(list(size, 'sizes')),
        fromSize: z.optional(size),
        toSize: z.optional(size),
        prices: z.optional(list(z.strictObject({ size, price: priceSchema }), 'prices')),
      }),
      'cables',
    ),
  ),
  inverters: z.optional(
    list(
      z.strictObject({
        element: id('an element'),
        alternatives: list(z.unknown(), 'alternatives'),
        keepCurrent: z.optional(z.boolean({ error: 'must be true or false' })),
      }),
      'elements to swap',
    ),
  ),
});
