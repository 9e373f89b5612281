/**
 * Schemas of the optional surge and fault fields on existing element kinds (motor `starting`,
 * inverter `surge`, source fault data, protective devices). Kept here so each kind's file gains
 * one line; the kinds' own schemas stay strict.
 */
import { z } from 'zod/mini';
import type { MotorStarting } from '../model/project.ts';
import type { Problem } from '../model/errors.ts';
import { CODE_LETTERS } from '../data/motor-code-letters.ts';
import { RANGES, rangeText, ranged } from './ranges.ts';

const num = () => z.number({ error: 'must be a number' });
const positive = (unit: string) => num().check(z.gt(0, `must be greater than 0 ${unit}`.trim()));

export const protectiveDeviceSchema = z.strictObject({
  interruptingRating: ranged('interruptingCurrent', 'positive', 'A (the interrupting rating, or breaking capacity, from the device maker)'),
});

export const surgeSchema = z.strictObject({
  apparentPower: ranged('ratedApparentPower'),
  durationSeconds: ranged('seconds', 'positive', 's (how long the inverter holds its surge rating)'),
});

export const startingSchema = z.strictObject({
  method: z.enum(['dol', 'star-delta', 'soft-starter', 'drive'], { error: 'must be "dol", "star-delta", "soft-starter" or "drive"' }),
  codeLetter: z.optional(
    z.string({ error: 'must be a code letter' }).check(
      z.refine((s) => (CODE_LETTERS as readonly string[]).includes(s), {
        message: `is not a locked-rotor code letter of NEC Table 430.7(B); expected one of ${CODE_LETTERS.join(', ')} (I, O and Q are not used)`,
      }),
    ),
  ),
  startingCurrentRatio: z.optional(num().check(z.gt(1, 'must be above 1 (locked-rotor current / rated current; typical value 5–8: use the maker’s figure)'), z.lte(20, 'must not exceed 20'))),
  lockedRotorCurrent: z.optional(ranged('current')),
  currentLimit: z.optional(num().check(z.gt(1, 'must be above 1 (a multiple of full-load current; typical value 3–4: use the maker’s figure)'), z.lte(10, 'must not exceed 10'))),
  startingPowerFactor: z.optional(
    num().check(
      z.gt(0, 'must be greater than 0'),
      z.lt(1, 'must be below 1 (at locked rotor; typical value 0.2–0.4: use the maker’s figure)'),
      z.superRefine((v: number, ctx) => {
        if (v > 0 && v < RANGES.powerFactor.min) ctx.addIssue({ code: 'custom', message: `must be at least ${RANGES.powerFactor.min}: the plausible range of a power factor is ${rangeText('powerFactor')}`, input: v });
      }),
    ),
  ),
  startSeconds: z.optional(ranged('seconds')),
  minTerminalVoltagePercent: z.optional(num().check(z.gt(0, 'must be greater than 0 %'), z.lt(100, 'must be below 100 %'))),
});

/** At most one source of the locked-rotor current; a current limit belongs to a soft starter. */
export function checkStarting(s: MotorStarting | undefined): Omit<Problem, 'elementId'>[] {
  if (!s) return [];
  const given = (['codeLetter', 'startingCurrentRatio', 'lockedRotorCurrent'] as const).filter((k) => s[k] !== undefined);
  if (given.length > 1) {
    return [{ code: 'invalid-value', field: `starting.${given[1]}`, value: s[given[1]!], message: `give only one of starting.codeLetter, starting.startingCurrentRatio and starting.lockedRotorCurrent (both ${given.join(' and ')} are given)` }];
  }
  if (s.currentLimit !== undefined && s.method !== 'soft-starter') {
    return [{ code: 'invalid-value', field: 'starting.currentLimit', value: s.currentLimit, message: `a current limit belongs to a soft starter; this motor starts by "${s.method}"` }];
  }
  return [];
}

/** Fault and dip fields shared by the grid and generator kinds. */
export const sourceFaultFields = {
  subtransientReactancePercent: z.optional(positive('% (X\u2033d on the generator rating; typical value 10–25 %: use the maker’s figure)').check(z.lte(100, 'must not exceed 100 %'))),
  transientReactancePercent: z.optional(positive('% (X\u2032d on the generator rating; typical value 15–35 %: use the maker’s figure)').check(z.lte(200, 'must not exceed 200 %'))),
  maxDipPercent: z.optional(positive('%').check(z.lt(100, 'must be below 100 %'))),
  shortCircuitPower: z.optional(ranged('shortCircuitPower')),
  shortCircuitRToX: z.optional(num().check(z.gte(0, 'must not be negative'), z.lte(10, 'must not exceed 10'))),
  voltageTolerancePercent: z.optional(z.union([z.literal(6), z.literal(10)], { error: 'must be 6 or 10 (% tolerance of the low-voltage system, IEC 60909-0 Table 1)' })),
};
