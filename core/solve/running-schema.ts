/**
 * The schema of the project's `running` settings (the energy price and the hours a year at the
 * solved operating point; what the losses cost, core/studies/economics.ts): single-field types and
 * ranges, listed in validate.ts. The same limits as the economics study's own check
 * (`checkCostSettings`), so a file the validation takes is a cost the study can work out.
 */
import { z } from 'zod/mini';

/** Hours in a leap year (366 × 24): the most a year can hold. */
export const MAX_HOURS_PER_YEAR = 8784;
/** Hours in a common year (365 × 24): running all year round; the default. */
export const HOURS_IN_YEAR = 8760;

const num = () => z.number({ error: 'must be a number' });


// The cost over the years (core/studies/lifetime.ts): the same limits as its own check (`checkLifetimeSettings`).
/** The longest service life the lifetime cost counts, years. */
export const MAX_SERVICE_YEARS = 100;
/** The largest purchase price or price per unit the file takes (currency units): past it a typing slip, not a price. */
export const MAX_PRICE = 1e12;

const price = (what: string) =>
  num().check(z.gte(0, `must not be negative (${what})`), z.lte(MAX_PRICE, `must not exceed 10¹² (${what})`));
const hourOfDay = (what: string) => num().check(z.gte(0, `must not be negative (${what})`), z.lte(24, `must not exceed 24 (${what})`));
const litresPerHour = () => num().check(z.gt(0, 'must be greater than 0 L/h (the maker\'s fuel table)'), z.lte(1e5, 'must not exceed 100 000 L/h'));

/** Schema of the running settings' `generator` (its fuel figures and its year of running). */
export const generatorFuelSchema = z.strictObject({
  quarterLoadLitresPerHour: litresPerHour(),
  halfLoadLitresPerHour: litresPerHour(),
  fullLoadLitresPerHour: litresPerHour(),
  ratedPower: z.optional(num().check(z.gt(0, 'must be greater than 0 W'), z.lte(1e9, 'must not exceed 1 GW'))),
  outageHoursPerYear: num().check(
    z.gte(0, 'must not be negative (0 to 8784 h)'),
    z.lte(MAX_HOURS_PER_YEAR, 'must not exceed 8784 h, a leap year'),
  ),
  outagesPerYear: z.optional(num().check(z.int('must be a whole number'), z.gte(0, 'must not be negative'), z.lte(MAX_HOURS_PER_YEAR, 'must not exceed 8784 (one an hour)'))),
  fuelPricePerLitre: z.optional(price('a price per litre in your currency')),
}).check(
  // Fuel rises with load in every maker's table: a falling figure is a typing slip.
  z.superRefine((g, ctx) => {
    if (g.halfLoadLitresPerHour < g.quarterLoadLitresPerHour) ctx.addIssue({ code: 'custom', message: 'must not be less than the fuel at ¼ load (fuel rises with load)', path: ['halfLoadLitresPerHour'], input: g.halfLoadLitresPerHour });
    if (g.fullLoadLitresPerHour < g.halfLoadLitresPerHour) ctx.addIssue({ code: 'custom', message: 'must not be less than the fuel at ½ load (fuel rises with load)', path: ['fullLoadLitresPerHour'], input: g.fullLoadLitresPerHour });
  }),
);

/** Schema of the lifetime settings that sit beside the price and hours in `running`. */
export const lifetimeSchemaShape = {
  nightPricePerKWh: z.optional(price('a price per kWh in your currency')),
  dayStartHour: z.optional(hourOfDay('an hour of the day, 0 to 24')),
  dayEndHour: z.optional(hourOfDay('an hour of the day, 0 to 24')),
  dayHoursFromProfile: z.optional(z.boolean({ error: 'must be true or false' })),
  lossesFromProfile: z.optional(z.boolean({ error: 'must be true or false' })),
  years: z.optional(num().check(z.int('must be a whole number of years'), z.gte(1, 'must be at least 1 year'), z.lte(MAX_SERVICE_YEARS, 'must not exceed 100 years'))),
  discountRate: z.optional(num().check(z.gte(0, 'must not be negative (0 % keeps money at its value)'), z.lte(1, 'must not exceed 100 %'))),
  gridCo2KgPerKWh: z.optional(num().check(z.gte(0, 'must not be negative'), z.lte(10, 'must not exceed 10 kg/kWh (grids emit about 0 to 1.2)'))),
  generator: z.optional(generatorFuelSchema),
};

/** Schema of an element's purchase price (the element base's `price`, checked for every kind in validate.ts). */
export const priceSchema = price('a purchase price in your currency');

/** Schema of the project's `running` field. */
export const runningSchema = z.strictObject({
  energyPricePerKWh: z.optional(num().check(z.gte(0, 'must not be negative (a price per kWh in your currency)'))),
  hoursPerYear: z.optional(
    num().check(
      z.gte(0, 'must not be negative (0 to 8784 h; 8760 runs all year)'),
      z.lte(MAX_HOURS_PER_YEAR, 'must not exceed 8784 h, a leap year (8760 runs all year)'),
    ),
  ),
  ...lifetimeSchemaShape,
}).check(
  // The day price runs from its start to its end hour within one day (default 7 to 23).
  z.superRefine((r, ctx) => {
    if ((r.dayEndHour ?? 23) > (r.dayStartHour ?? 7)) return;
    if (r.dayEndHour === undefined) ctx.addIssue({ code: 'custom', message: 'must be earlier than the hour the day price ends (23 when not given)', path: ['dayStartHour'], input: r.dayStartHour });
    else ctx.addIssue({ code: 'custom', message: 'must be later than the hour the day price starts (7 when not given)', path: ['dayEndHour'], input: r.dayEndHour });
  }),
);
