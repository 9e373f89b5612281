/**
 * IEC 60898-1: circuit-breakers for overcurrent protection for household and similar
 * installations (AC, rated voltage ≤ 440 V, rated current ≤ 125 A, rated short-circuit capacity
 * ≤ 25 000 A).
 *
 * Source: IEC 60898-1:2015 (+AMD1:2019), clause 5.3.2 preferred values of rated current, and
 * clause 5.3.5 standard ranges of instantaneous tripping (clause numbers from memory). The list
 * of preferred rated currents without 8 A and the scope are confirmed against a published copy;
 * 8 A is FROM MEMORY of clause 5.3.2 — check it. The instantaneous-trip ranges (types B, C, D) are
 * confirmed.
 *
 * Units: amperes; trip ranges as multiples of the rated current In.
 */
import type { Provenance } from './conductor-materials.ts';

export interface Iec60898RatingRow {
  readonly ratedCurrentA: number;
  readonly provenance: Provenance;
}

/** IEC 60898-1 preferred rated currents In, rising. */
export const IEC_60898_1_RATED_CURRENTS: readonly Iec60898RatingRow[] = [
  { ratedCurrentA: 6, provenance: 'confirmed' },
  { ratedCurrentA: 8, provenance: 'from memory' },
  { ratedCurrentA: 10, provenance: 'confirmed' },
  { ratedCurrentA: 13, provenance: 'confirmed' },
  { ratedCurrentA: 16, provenance: 'confirmed' },
  { ratedCurrentA: 20, provenance: 'confirmed' },
  { ratedCurrentA: 25, provenance: 'confirmed' },
  { ratedCurrentA: 32, provenance: 'confirmed' },
  { ratedCurrentA: 40, provenance: 'confirmed' },
  { ratedCurrentA: 50, provenance: 'confirmed' },
  { ratedCurrentA: 63, provenance: 'confirmed' },
  { ratedCurrentA: 80, provenance: 'confirmed' },
  { ratedCurrentA: 100, provenance: 'confirmed' },
  { ratedCurrentA: 125, provenance: 'confirmed' },
];

/** Upper limit of the IEC 60898-1 scope, A. */
export const IEC_60898_1_MAX_RATED_CURRENT_A = 125;

export interface Iec60898TripRow {
  readonly type: 'B' | 'C' | 'D';
  /** Instantaneous-trip range, lower bound, × In. */
  readonly fromMultiple: number;
  /** Instantaneous-trip range, upper bound, × In. */
  readonly toMultiple: number;
  readonly provenance: Provenance;
}

/** IEC 60898-1 instantaneous-tripping ranges. */
export const IEC_60898_1_INSTANTANEOUS_TRIP: readonly Iec60898TripRow[] = [
  { type: 'B', fromMultiple: 3, toMultiple: 5, provenance: 'confirmed' },
  { type: 'C', fromMultiple: 5, toMultiple: 10, provenance: 'confirmed' },
  { type: 'D', fromMultiple: 10, toMultiple: 20, provenance: 'confirmed' },
];

/**
 * IEC 60898-1 conventional tripping current I₂ = 1.45 × In (clause 8.6.2, time-current
 * characteristic, from memory; the same 1.45 that IEC 60364-4-43 433.1 puts on I_z, which is why a
 * breaker to this standard meets I₂ ≤ 1.45 I_z whenever I_n ≤ I_z).
 */
export const IEC_60898_1_CONVENTIONAL_TRIPPING = { multiple: 1.45, provenance: 'from memory' as Provenance } as const;
