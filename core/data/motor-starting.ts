/**
 * Typical motor-starting figures used when the motor's own data are not given. None is a
 * published table: each is common practice (no single source) and every result that uses one
 * says so. The motor maker's data and measured figures take precedence.
 *
 * Units: ratios are multiples of the full-load current (FLC); times in s; power factors 0…1;
 * percentages as % numbers.
 */

/** Locked-rotor current of a cage motor when neither code letter, ratio nor current is given, × FLC (common practice: 6–7 for IE1/IE2 cage motors; 6 used). */
export const DEFAULT_LOCKED_ROTOR_RATIO = 6;

/**
 * The same default by efficiency class, × FLC. Premium-efficiency motors draw more: lower-resistance
 * rotor cages give a higher locked-rotor current. IEC 60034-12:2016 added the designs NE and HE
 * ("E": extended efficiency, for IE3/IE4 motors) with a higher locked-rotor apparent power allowed
 * than designs N and H (clause 5, design letters; the printed limits not checked: from memory);
 * NEMA MG 1 design B caps the locked-rotor current, design A does not, and premium-efficiency
 * designs reach the upper code letters (from memory). Values common practice, from memory: IE1/IE2
 * 6, IE3 7, IE4 8, NEMA Premium 8 (the upper end of the usual 6–8 band). The user sees "typical
 * value: use the maker's figure".
 */
export const DEFAULT_LOCKED_ROTOR_RATIO_BY_CLASS: Readonly<Record<'IE1' | 'IE2' | 'IE3' | 'IE4' | 'NEMA-premium', number>> = {
  IE1: 6,
  IE2: 6,
  IE3: 7,
  IE4: 8,
  'NEMA-premium': 8,
};

/** What a user reads beside every typical value this app assumes (issue 14, point 16). */
export const TYPICAL_VALUE = 'typical value: use the maker’s figure';

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
