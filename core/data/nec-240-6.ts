/**
 * NEC 240.6(A): standard ampere ratings for fuses and inverse-time circuit breakers.
 *
 * Source: NFPA 70-2023 240.6(A), Table 240.6(A) (list confirmed against a published copy of the
 * 2023 code). NFPA 70-2020 240.6(A): the text "Additional standard ampere ratings for fuses shall
 * be 1, 3, 6, 10, and 601" is confirmed; its list of standard ratings is from memory and is the
 * 2023 list without 10 A. The difference: 10 A became a standard rating (fuses and breakers) in
 * 2023; in 2020 it was only an additional fuse rating. The 2023 additional fuse ratings
 * (1, 3, 6, 601) are from memory. The use of fuses and inverse-time breakers with nonstandard
 * ratings is permitted (240.6(A)).
 *
 * Units: amperes. Columns: `edition`; `standardA` the standard ratings, rising; `additionalFuseA`
 * the further ratings for fuses only; the provenance of each list.
 */
import type { Provenance } from './conductor-materials.ts';

export interface Nec2406AEdition {
  readonly edition: 'NFPA 70-2023' | 'NFPA 70-2020';
  readonly standardA: readonly number[];
  readonly standardProvenance: Provenance;
  readonly additionalFuseA: readonly number[];
  readonly additionalFuseProvenance: Provenance;
}

/** The edition this app uses: NFPA 70-2023. */
export const NEC_240_6_A_2023: Nec2406AEdition = {
  edition: 'NFPA 70-2023',
  standardA: [
    10, 15, 20, 25, 30, 35, 40, 45, 50, 60, 70, 80, 90, 100, 110, 125, 150, 175, 200, 225, 250, 300,
    350, 400, 450, 500, 600, 700, 800, 1000, 1200, 1600, 2000, 2500, 3000, 4000, 5000, 6000,
  ],
  standardProvenance: 'confirmed',
  additionalFuseA: [1, 3, 6, 601],
  additionalFuseProvenance: 'from memory',
};

/** NFPA 70-2020, kept to show the edition difference (10 A). */
export const NEC_240_6_A_2020: Nec2406AEdition = {
  edition: 'NFPA 70-2020',
  standardA: [
    15, 20, 25, 30, 35, 40, 45, 50, 60, 70, 80, 90, 100, 110, 125, 150, 175, 200, 225, 250, 300, 350,
    400, 450, 500, 600, 700, 800, 1000, 1200, 1600, 2000, 2500, 3000, 4000, 5000, 6000,
  ],
  standardProvenance: 'from memory',
  additionalFuseA: [1, 3, 6, 10, 601],
  additionalFuseProvenance: 'confirmed',
};

export const NEC_240_6_A: readonly Nec2406AEdition[] = [NEC_240_6_A_2023, NEC_240_6_A_2020];
