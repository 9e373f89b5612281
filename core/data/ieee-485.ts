/**
 * IEEE 485 (IEEE Recommended Practice for Sizing Lead-Acid Batteries for Stationary Applications),
 * Table 1: cell-size temperature correction factor for vented lead-acid cells rated at 25 °C (77 °F).
 *
 * Source: IEEE Std 485, Table 1 (the 1997 edition and its 2010/2020 revisions use the same table,
 * from memory). The range of the table (25 °F / −3.9 °C to 125 °F / 51.7 °C) and the factor 1.00
 * at 77 °F / 25 °C are confirmed against a published vendor note quoting the standard; every other
 * factor below is FROM MEMORY until checked against the printed standard.
 *
 * Units: `fahrenheit` is the lowest expected electrolyte temperature in °F as printed in the
 * standard; `celsius` is the standard's own °C column (rounded to 0.1 °C); `factor` is the
 * dimensionless multiplier on the uncorrected cell size (≥ 1 below 25 °C).
 *
 * Note (IEEE 485, from memory): factors below 1.00 above 25 °C should generally not be used to
 * reduce the cell size — the gain in capacity is offset by a shorter life. The sizing in
 * core/studies/backup/sizing.ts therefore holds 1.00 above 25 °C unless told otherwise.
 */
export interface TemperatureFactorRow {
  readonly fahrenheit: number;
  readonly celsius: number;
  readonly factor: number;
  /** Provenance of this row's factor. */
  readonly mark: 'confirmed' | 'from memory';
}

/** IEEE 485 Table 1, rows in rising temperature. */
export const IEEE_485_TEMPERATURE_FACTORS: readonly TemperatureFactorRow[] = [
  { fahrenheit: 25, celsius: -3.9, factor: 1.52, mark: 'from memory' },
  { fahrenheit: 30, celsius: -1.1, factor: 1.43, mark: 'from memory' },
  { fahrenheit: 35, celsius: 1.7, factor: 1.35, mark: 'from memory' },
  { fahrenheit: 40, celsius: 4.4, factor: 1.3, mark: 'from memory' },
  { fahrenheit: 45, celsius: 7.2, factor: 1.25, mark: 'from memory' },
  { fahrenheit: 50, celsius: 10.0, factor: 1.19, mark: 'from memory' },
  { fahrenheit: 55, celsius: 12.8, factor: 1.15, mark: 'from memory' },
  { fahrenheit: 60, celsius: 15.6, factor: 1.11, mark: 'from memory' },
  { fahrenheit: 65, celsius: 18.3, factor: 1.08, mark: 'from memory' },
  { fahrenheit: 66, celsius: 18.9, factor: 1.072, mark: 'from memory' },
  { fahrenheit: 67, celsius: 19.4, factor: 1.064, mark: 'from memory' },
  { fahrenheit: 68, celsius: 20.0, factor: 1.056, mark: 'from memory' },
  { fahrenheit: 69, celsius: 20.6, factor: 1.048, mark: 'from memory' },
  { fahrenheit: 70, celsius: 21.1, factor: 1.04, mark: 'from memory' },
  { fahrenheit: 71, celsius: 21.7, factor: 1.034, mark: 'from memory' },
  { fahrenheit: 72, celsius: 22.2, factor: 1.029, mark: 'from memory' },
  { fahrenheit: 73, celsius: 22.8, factor: 1.023, mark: 'from memory' },
  { fahrenheit: 74, celsius: 23.3, factor: 1.017, mark: 'from memory' },
  { fahrenheit: 75, celsius: 23.9, factor: 1.011, mark: 'from memory' },
  { fahrenheit: 76, celsius: 24.4, factor: 1.006, mark: 'from memory' },
  { fahrenheit: 77, celsius: 25.0, factor: 1.0, mark: 'confirmed' },
  { fahrenheit: 78, celsius: 25.6, factor: 0.994, mark: 'from memory' },
  { fahrenheit: 79, celsius: 26.1, factor: 0.987, mark: 'from memory' },
  { fahrenheit: 80, celsius: 26.7, factor: 0.98, mark: 'from memory' },
  { fahrenheit: 81, celsius: 27.2, factor: 0.976, mark: 'from memory' },
  { fahrenheit: 82, celsius: 27.8, factor: 0.972, mark: 'from memory' },
  { fahrenheit: 83, celsius: 28.3, factor: 0.968, mark: 'from memory' },
  { fahrenheit: 84, celsius: 28.9, factor: 0.964, mark: 'from memory' },
  { fahrenheit: 85, celsius: 29.4, factor: 0.96, mark: 'from memory' },
  { fahrenheit: 86, celsius: 30.0, factor: 0.956, mark: 'from memory' },
  { fahrenheit: 87, celsius: 30.6, factor: 0.952, mark: 'from memory' },
  { fahrenheit: 88, celsius: 31.1, factor: 0.948, mark: 'from memory' },
  { fahrenheit: 89, celsius: 31.7, factor: 0.944, mark: 'from memory' },
  { fahrenheit: 90, celsius: 32.2, factor: 0.94, mark: 'from memory' },
  { fahrenheit: 95, celsius: 35.0, factor: 0.93, mark: 'from memory' },
  { fahrenheit: 100, celsius: 37.8, factor: 0.91, mark: 'from memory' },
  { fahrenheit: 105, celsius: 40.6, factor: 0.89, mark: 'from memory' },
  { fahrenheit: 110, celsius: 43.3, factor: 0.88, mark: 'from memory' },
  { fahrenheit: 115, celsius: 46.1, factor: 0.87, mark: 'from memory' },
  { fahrenheit: 120, celsius: 48.9, factor: 0.86, mark: 'from memory' },
  { fahrenheit: 125, celsius: 51.7, factor: 0.85, mark: 'from memory' },
];

/**
 * Sizing factors other than temperature (IEEE 485 worksheet lines (13) design margin and (14) aging
 * factor; line numbers from memory, corroborated by a published worksheet layout — see
 * shared/reference/published-values.md §8c).
 * - Aging factor 1.25: the battery is replaced when its capacity falls to 80 % of rated
 *   (1 / 0.80 = 1.25), for cells whose capacity stays flat to end of life. Corroborated: the UPS
 *   battery sizing example of UFC 3-520-01 (Interior Electrical Systems) Appendix E applies
 *   "Aging: 1.25 (corresponding to 80 percent capacity)", and a published UPS battery
 *   specification sheet uses AF = 1.25 for all battery types.
 * - Design margin 1.10 (1.10–1.15 typical) for load growth and less-than-optimum conditions.
 *   Corroborated: the same specification sheet uses a design factor DF = 1.1 (common practice).
 */
export const IEEE_485_DEFAULT_AGING_FACTOR = 1.25;
export const IEEE_485_DEFAULT_DESIGN_MARGIN = 1.1;
