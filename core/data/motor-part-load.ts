/**
 * Induction-motor part-load shape: efficiency and power factor at a load fraction, relative to
 * their full-load values; and typical full-load power factors by rated output.
 *
 * Source: common practice (no source). The shape follows the usual catalogue behaviour of
 * three-phase cage induction motors: efficiency nearly flat from 50 % to 100 % load (peaking
 * around 75 %) and falling below that; power factor falling much more steeply with load.
 * Use the maker's curves (the motor's `loss` and `powerFactor` models) where known.
 *
 * Units: loadFraction = shaft output / rated output; ratios are dimensionless.
 */
import type { Provenance } from './conductor-materials.ts';

export interface PartLoadPoint {
  readonly loadFraction: number;
  /** η(x) / η(1). */
  readonly efficiencyRatio: number;
  /** pf(x) / pf(1). */
  readonly powerFactorRatio: number;
}

export const MOTOR_PART_LOAD: readonly PartLoadPoint[] = [
  { loadFraction: 0.25, efficiencyRatio: 0.945, powerFactorRatio: 0.55 },
  { loadFraction: 0.5, efficiencyRatio: 0.99, powerFactorRatio: 0.8 },
  { loadFraction: 0.75, efficiencyRatio: 1.003, powerFactorRatio: 0.94 },
  { loadFraction: 1.0, efficiencyRatio: 1.0, powerFactorRatio: 1.0 },
  { loadFraction: 1.25, efficiencyRatio: 0.99, powerFactorRatio: 1.01 },
];
export const PART_LOAD_PROVENANCE: Provenance = 'common practice';

/** Typical full-load power factor of a 4-pole cage motor up to `upToW` rated output (common practice, no source). */
export const TYPICAL_FULL_LOAD_PF: readonly { readonly upToW: number; readonly powerFactor: number }[] = [
  { upToW: 1500, powerFactor: 0.76 },
  { upToW: 7500, powerFactor: 0.82 },
  { upToW: 37000, powerFactor: 0.85 },
  { upToW: Infinity, powerFactor: 0.87 },
];
