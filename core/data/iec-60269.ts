/**
 * IEC 60269-1 / 60269-2: low-voltage fuses, gG (general-purpose, full-range) fuse-links.
 *
 * Source: IEC 60269-1:2006 (+AMD1:2009, AMD2:2014), clause 5.3.1 rated currents of fuse-links and
 * Table 2 (conventional time and current for gG fuse-links). Every value here is FROM MEMORY of
 * those clauses (they are widely reproduced in installation handbooks, which use I₂ = 1.6 I_n for
 * gG fuses of 16 A and above when checking IEC 60364-4-43 433.1); check them against the standard.
 *
 * Units: amperes; conventional fusing current as a multiple of the rated current I_n.
 */
import type { Provenance } from './conductor-materials.ts';

/** Rated currents of gG fuse-links, A, rising (IEC 60269-1 clause 5.3.1). */
export const IEC_60269_GG_RATED_CURRENTS: readonly number[] = [
  2, 4, 6, 8, 10, 12, 16, 20, 25, 32, 40, 50, 63, 80, 100, 125, 160, 200, 250, 315, 400, 500, 630, 800, 1000, 1250,
];
export const IEC_60269_GG_RATED_CURRENTS_PROVENANCE: Provenance = 'from memory';

export interface Iec60269ConventionalRow {
  /** Band of rated current: fromA < I_n ≤ toA (toA inclusive), A. */
  readonly fromA: number;
  readonly toA: number;
  /** Conventional fusing current I_f (= I₂ of IEC 60364-4-43), × I_n. */
  readonly fusingMultiple: number;
  readonly provenance: Provenance;
}

/** IEC 60269-1 Table 2, gG: conventional fusing current by rated current band. */
export const IEC_60269_GG_CONVENTIONAL: readonly Iec60269ConventionalRow[] = [
  { fromA: 0, toA: 4, fusingMultiple: 2.1, provenance: 'from memory' },
  { fromA: 4, toA: 15.999, fusingMultiple: 1.9, provenance: 'from memory' },
  { fromA: 15.999, toA: Number.MAX_VALUE, fusingMultiple: 1.6, provenance: 'from memory' },
];
