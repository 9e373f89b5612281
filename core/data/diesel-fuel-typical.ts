/**
 * Typical fuel burnt by diesel generating sets at ¼, ½, ¾ and full load, by rated power: the
 * approximate diesel fuel consumption chart generator suppliers publish (e.g. BigRentz, "Diesel
 * generator fuel consumption chart"; the same figures in litres on other suppliers' pages), in US
 * gallons per hour as printed. Common practice (no standard): a supplier's estimate across makes,
 * which the maker's own fuel table always replaces; the page and the CLI call these figures
 * "typical value: use the maker's figure".
 *
 * Units: `kw` the set's rated power, kW (the chart's column); `gph` US gal/h at ¼, ½, ¾ and full
 * load. 1 US gal = 3.785411784 L (NIST SP 811, B.8), applied where the figures are used
 * (`LITRES_PER_US_GALLON`). The 75 kW row is left out: suppliers print its full-load figure as
 * 6.1 and as 6.4 gal/h.
 */

/** Litres per US gallon (NIST SP 811 Appendix B.8: 1 gal (US) = 3.785 412 E−03 m³). */
export const LITRES_PER_US_GALLON = 3.785411784;

export interface FuelChartRow {
  kw: number;
  /** US gal/h at ¼, ½, ¾ and full load. */
  gph: readonly [number, number, number, number];
}

/** Rows in rising rated power (common practice: suppliers' chart, gal/h). */
export const DIESEL_FUEL_CHART: readonly FuelChartRow[] = [
  { kw: 20, gph: [0.6, 0.9, 1.3, 1.6] },
  { kw: 30, gph: [1.3, 1.8, 2.4, 2.9] },
  { kw: 40, gph: [1.6, 2.3, 3.2, 4.0] },
  { kw: 60, gph: [1.8, 2.9, 3.8, 4.8] },
  { kw: 100, gph: [2.6, 4.1, 5.8, 7.4] },
  { kw: 125, gph: [3.1, 5.0, 7.1, 9.1] },
  { kw: 150, gph: [3.6, 5.9, 8.4, 10.9] },
  { kw: 200, gph: [4.7, 7.7, 11.0, 14.4] },
  { kw: 250, gph: [5.7, 9.5, 13.6, 18.0] },
  { kw: 300, gph: [6.8, 11.3, 16.1, 21.5] },
  { kw: 400, gph: [8.9, 14.9, 21.3, 28.6] },
  { kw: 500, gph: [11.0, 18.5, 26.4, 35.7] },
  { kw: 750, gph: [16.3, 27.4, 39.3, 53.4] },
  { kw: 1000, gph: [21.6, 36.4, 52.1, 71.1] },
  { kw: 1500, gph: [32.2, 54.3, 77.8, 106.5] },
  { kw: 2000, gph: [42.8, 72.2, 103.5, 141.9] },
];
