/**
 * The schema of the project's `standby` settings (core/model/standby.ts): the charger sizing, the
 * modules and the cost of standing by of a project with a bank on a bus. Single-field types and
 * ranges; validate.ts lists it. The settings are read by the modes study (core/studies/modes/).
 */
import { z } from 'zod/mini';
import { ranged } from '../kinds/ranges.ts';
import { MAX_HORIZON_H } from './backup-schema.ts';

const num = () => z.number({ error: 'must be a number' });

export const standbySchema = z.strictObject({
  targetRechargeHours: z.optional(ranged('hours')),
  rechargeAh: z.optional(ranged('capacity')),
  chargeReturnFactor: z.optional(num().check(z.gte(1, 'must be at least 1 (the charge taken out is put back at least once)'), z.lte(2, 'must not exceed 2 (published factors are 1.05–1.4)'))),
  moduleCurrent: z.optional(num().check(z.gt(0, 'must be greater than 0 A'), z.lte(1e6, 'must not exceed 1000000 A'))),
  redundancy: z.optional(z.enum(['none', 'n+1'], { error: 'must be "none" or "n+1"' })),
  outageHoursPerYear: z.optional(num().check(z.gte(0, 'must not be negative'), z.lte(MAX_HORIZON_H, `must not exceed ${MAX_HORIZON_H} h (a year)`))),
});
