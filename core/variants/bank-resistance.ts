/**
 * A bank's internal resistance given for the WHOLE bank (`internalResistance` of a battery element),
 * carried over when the bank is re-strung. Blocks in series add their resistances and strings in
 * parallel share the current (series and parallel resistors, Ohm's law): R_bank = R_string·n / m for
 * n blocks in series per string and m strings, so with the same blocks
 *   R' = R · (n' / n) · (m / m').
 * A resistance worked out from the cell's figure (`bank.overrides.internalResistanceOhmAh` or the
 * chemistry's) is per cell and needs nothing: core/physics/bank.ts scales it from the bank itself.
 * Shared by the quick system-voltage variant (core/variants/system-voltage.ts) and the option
 * search's strings axis (core/studies/search/axes.ts).
 */

/** The bank's series count and strings in parallel (strings default 1, as the bank spec's). */
export interface Stringing {
  series: number;
  strings?: number | undefined;
}

/**
 * The whole-bank resistance of a bank re-strung from `from` to `to` (see the file's top), rounded to 4
 * significant digits: a field's value as a planner would write it, not a float's tail.
 */
export function restrungResistance(resistance: number, from: Stringing, to: Stringing): number {
  return Number(restrungExact(resistance, from, to).toPrecision(4));
}

/**
 * The same, not rounded: R' = (R · (n'/n) · m) / m' (the backup study's sized bank, core/studies/backup/study.ts,
 * which is worked out, not written into a field; with the series count kept, n'/n = 1 exactly).
 */
export function restrungExact(resistance: number, from: Stringing, to: Stringing): number {
  return (resistance * (to.series / from.series) * (from.strings ?? 1)) / (to.strings ?? 1);
}
