/**
 * Typical motor-starting figures used when the motor's own data are not given. None is a
 * published table: each is common practice (no single source) and every result that uses one
 * says so. The motor maker's data and measured figures take precedence.
 *
 * Units: ratios are multiples of the full-load current (FLC); times in s; power factors 0…1;
 * percentages as % numbers.
 */

/** Locked-rotor current of a cage motor when neither code letter, ratio nor current is given, × FLC (common practice: 6–7 for IE2/IE3 cage motors; 6 used). */
export const DEFAULT_LOCKED_ROTOR_RATIO = 6;

/** Star-delta: line current and torque are 1/3 of direct-on-line (textbook relation: phase voltage ÷ √3 on a delta winding switched to star). */
export const STAR_DELTA_FACTOR = 1 / 3;

/** Soft starter current limit when not given, × FLC (common practice: 3–4 × FLC; 3.5 used). */
export const DEFAULT_SOFT_STARTER_LIMIT = 3.5;

/** Drive start: input current during acceleration, × FLC (common practice: about 1–1.5 × FLC; the upper end used). */
export const DRIVE_START_RATIO = 1.5;

/** Starting (locked-rotor) power factor by rated output (common practice, typical 0.2–0.4; smaller motors higher). */
export const STARTING_POWER_FACTOR: readonly { readonly upToWatts: number; readonly powerFactor: number }[] = [
  { upToWatts: 7500, powerFactor: 0.4 },
  { upToWatts: 75000, powerFactor: 0.3 },
  { upToWatts: Infinity, powerFactor: 0.2 },
];

/** Acceleration time when not given, s, by starting method (common practice, from memory: a centrifugal pump or fan on DOL accelerates in a few seconds). */
export const DEFAULT_START_SECONDS: Readonly<Record<'dol' | 'star-delta' | 'soft-starter' | 'drive', number>> = {
  dol: 3,
  'star-delta': 6,
  'soft-starter': 10,
  drive: 10,
};

/** Lowest motor terminal voltage during the start, % of rated, when not given (common practice: 80 %; torque falls with V², 0.8² = 64 %). */
export const DEFAULT_MIN_TERMINAL_VOLTAGE_PERCENT = 80;

/** Largest generator transient voltage dip, % of rated, when not given (common practice: 15 % for mixed loads). */
export const DEFAULT_MAX_GENERATOR_DIP_PERCENT = 15;

/** A check within this fraction of its limit (but passing) makes the start "marginal" (the rule of this app). */
export const MARGINAL_FRACTION = 0.1;
