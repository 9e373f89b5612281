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

/** Schema of the project's `running` field. */
export const runningSchema = z.strictObject({
  energyPricePerKWh: z.optional(num().check(z.gte(0, 'must not be negative (a price per kWh in your currency)'))),
  hoursPerYear: z.optional(
    num().check(
      z.gte(0, 'must not be negative (0 to 8784 h; 8760 runs all year)'),
      z.lte(MAX_HOURS_PER_YEAR, 'must not exceed 8784 h, a leap year (8760 runs all year)'),
    ),
  ),
});
