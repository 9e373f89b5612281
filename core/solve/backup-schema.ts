/**
 * The schema of the project's `backup` settings (the battery study: its load profile, time step,
 * horizon, bank design and recharge inputs): single-field types and ranges. The checks that need
 * the project and the timeline are in load-profile.ts; validate.ts lists the schema.
 */
import { z } from 'zod/mini';

/** Longest horizon (and target runtime) of a study: one leap year, h. */
export const MAX_HORIZON_H = 24 * 366;

const num = () => z.number({ error: 'must be a number' });
const positive = (unit: string) => num().check(z.gt(0, `must be greater than 0 ${unit}`.trim()));
const nonNegative = (unit: string) => num().check(z.gte(0, `must not be negative ${unit}`.trim()));

/**
 * A load's level as a share of its rating, 0…100 % (core/model/study-settings.ts LoadPercent: the
 * element's value is its full draw, so a level above it is set in the element).
 */
const percentSetting = z.strictObject(
  { percent: num().check(z.gte(0, 'must not be negative %'), z.lte(100, 'must not exceed 100 % of the load\'s rating (raise the load\'s own power for more)')) },
  { error: 'must be a share of the rating in %' },
);

const loadsField = z.optional(
  z.record(z.string(), z.union([nonNegative(''), z.boolean(), percentSetting], { error: 'must be a power in W (a current in A for a load given by its current), a share of its rating in %, true (on) or false (off)' }), {
    error: 'must map load ids to a power in W (a current in A for a load given by its current), a share of its rating in %, true or false',
  }),
);

const dutySchema = z.strictObject({
  load: z.string({ error: 'must name a load' }).check(z.minLength(1, 'must name a load')),
  periodMinutes: positive('min'),
  onMinutes: nonNegative('min'),
  offsetMinutes: z.optional(nonNegative('min')),
});

const duty = z.optional(z.array(dutySchema, { error: 'must be a list of duty schedules' }));

export const profileSchema = z.discriminatedUnion(
  'kind',
  [
    z.strictObject({ kind: z.literal('constant'), duty }),
    z.strictObject({
      kind: z.literal('segments'),
      segments: z
        .array(z.strictObject({ durationHours: num().check(z.gt(0, 'must be greater than 0 h (a segment cannot run backwards or last no time)')), loads: loadsField }), {
          error: 'must be a list of {durationHours, loads} segments',
        })
        .check(z.minLength(1, 'needs at least one segment')),
      repeat: z.optional(z.boolean({ error: 'must be true or false' })),
      duty,
    }),
    z.strictObject({
      kind: z.literal('daily'),
      segments: z
        .array(
          z.strictObject({
            startHour: num().check(z.gte(0, 'must be 0 or more'), z.lt(24, 'must be below 24')),
            loads: loadsField,
          }),
          { error: 'must be a list of {startHour, loads} segments' },
        )
        .check(z.minLength(1, 'needs at least one segment')),
      startHour: z.optional(num().check(z.gte(0, 'must be 0 or more'), z.lt(24, 'must be below 24'))),
      duty,
    }),
  ],
  { error: 'must be one of "constant", "segments", "daily"' },
);

const fraction = (what: string) => num().check(z.gt(0, `${what} must be greater than 0`), z.lte(1, `${what} must not exceed 1 (enter 0.8 for 80 %)`));

/** Schema of the project's `backup` field (listed in core/solve/validate.ts). */
export const backupSchema = z.strictObject({
  profile: profileSchema,
  timeStepSeconds: z.optional(positive('s')),
  horizonHours: z.optional(positive('h').check(z.lte(MAX_HORIZON_H, 'must not exceed one year (8784 h)'))),
  temperatureC: z.optional(num().check(z.gte(-60, 'must be −60 °C or more'), z.lte(80, 'must be 80 °C or less'))),
  stateOfHealth: z.optional(fraction('state of health')),
  design: z.optional(z.enum(['backup', 'cycling'], { error: 'must be "backup" (discharge to the end voltage) or "cycling" (also stop at the usable depth of discharge)' })),
  // The study runs the chain out to the target runtime: no longer than its longest horizon.
  targetRuntimeHours: z.optional(positive('h').check(z.lte(MAX_HORIZON_H, 'must not exceed one year (8784 h), the longest a study runs'))),
  designMargin: z.optional(num().check(z.gte(1, 'must be at least 1 (1.10 adds 10 %)'))),
  agingFactor: z.optional(num().check(z.gte(1, 'must be at least 1 (1.25 for a bank replaced at 80 % capacity)'))),
  standardCapacitiesAh: z.optional(z.array(positive('Ah'), { error: 'must be a list of capacities in Ah' }).check(z.minLength(1, 'needs at least one capacity'))),
  chargerCurrent: z.optional(positive('A')),
  // At least 1 %, as every efficiency the solve takes (core/kinds/spec.ts MIN_EFFICIENCY): the AC
  // input is the DC energy ÷ η, which overflows as η nears 0.
  chargerEfficiency: z.optional(fraction('efficiency').check(z.gte(0.01, 'efficiency must be at least 1 % (enter 0.9 for 90 %)'))),
  targetRechargeHours: z.optional(positive('h')),
});
