/**
 * Weighted converter efficiency: load points and weights.
 *
 * Sources:
 * - European weighted efficiency (η_EURO), as used in EN 50530; weighting from the EC Joint Research
 *   Centre for a central-European irradiance distribution (origin from memory).
 * - CEC weighted efficiency: Sandia National Laboratories, "Performance Test Protocol for Evaluating
 *   Inverters Used in Grid-Connected Photovoltaic Systems" (2004/2005), adopted by the California
 *   Energy Commission. The protocol also averages over three DC input voltages (from memory); this
 *   table gives the load-point weighting only.
 * Units: loadFraction is output power / rated output power; weights are dimensionless and sum to 1.
 */
export interface WeightingPoint {
  readonly loadFraction: number;
  readonly weight: number;
}

export const EURO_WEIGHTING: readonly WeightingPoint[] = [
  { loadFraction: 0.05, weight: 0.03 },
  { loadFraction: 0.1, weight: 0.06 },
  { loadFraction: 0.2, weight: 0.13 },
  { loadFraction: 0.3, weight: 0.1 },
  { loadFraction: 0.5, weight: 0.48 },
  { loadFraction: 1.0, weight: 0.2 },
];

export const CEC_WEIGHTING: readonly WeightingPoint[] = [
  { loadFraction: 0.1, weight: 0.04 },
  { loadFraction: 0.2, weight: 0.05 },
  { loadFraction: 0.3, weight: 0.12 },
  { loadFraction: 0.5, weight: 0.21 },
  { loadFraction: 0.75, weight: 0.53 },
  { loadFraction: 1.0, weight: 0.05 },
];
