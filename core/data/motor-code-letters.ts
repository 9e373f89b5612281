/**
 * NEC Table 430.7(B): locked-rotor indicating code letters — the band of kilovolt-amperes per
 * horsepower with locked rotor that the nameplate code letter stands for (NEC 430.7(A)(9)).
 *
 * Source: NFPA 70-2023, Table 430.7(B) (the table is the same in recent editions, from memory).
 * Provenance: "corroborated" — recalled, and agreeing with several public reproductions of the
 * table; not yet checked against the printed code. Letters I, O and Q are not used.
 *
 * Units: `minKvaPerHp`, `maxKvaPerHp` in kVA per hp (the table's own unit; 1 hp = 745.7 W);
 * `maxKvaPerHp` is `null` for letter V ("22.4 and up": the table prints no upper bound).
 * The table's bands are "from … up to but not including …"; the upper values printed here are the
 * table's, e.g. 6.29 for G (5.6 to 6.29).
 */
import type { Provenance } from './conductor-materials.ts';

export type CodeLetter = 'A' | 'B' | 'C' | 'D' | 'E' | 'F' | 'G' | 'H' | 'J' | 'K' | 'L' | 'M' | 'N' | 'P' | 'R' | 'S' | 'T' | 'U' | 'V';

export interface CodeLetterRow {
  readonly letter: CodeLetter;
  readonly minKvaPerHp: number;
  readonly maxKvaPerHp: number | null;
  readonly provenance: Provenance;
}

const C: Provenance = 'corroborated';

export const NEC_430_7_B: readonly CodeLetterRow[] = [
  { letter: 'A', minKvaPerHp: 0, maxKvaPerHp: 3.14, provenance: C },
  { letter: 'B', minKvaPerHp: 3.15, maxKvaPerHp: 3.54, provenance: C },
  { letter: 'C', minKvaPerHp: 3.55, maxKvaPerHp: 3.99, provenance: C },
  { letter: 'D', minKvaPerHp: 4.0, maxKvaPerHp: 4.49, provenance: C },
  { letter: 'E', minKvaPerHp: 4.5, maxKvaPerHp: 4.99, provenance: C },
  { letter: 'F', minKvaPerHp: 5.0, maxKvaPerHp: 5.59, provenance: C },
  { letter: 'G', minKvaPerHp: 5.6, maxKvaPerHp: 6.29, provenance: C },
  { letter: 'H', minKvaPerHp: 6.3, maxKvaPerHp: 7.09, provenance: C },
  { letter: 'J', minKvaPerHp: 7.1, maxKvaPerHp: 7.99, provenance: C },
  { letter: 'K', minKvaPerHp: 8.0, maxKvaPerHp: 8.99, provenance: C },
  { letter: 'L', minKvaPerHp: 9.0, maxKvaPerHp: 9.99, provenance: C },
  { letter: 'M', minKvaPerHp: 10.0, maxKvaPerHp: 11.19, provenance: C },
  { letter: 'N', minKvaPerHp: 11.2, maxKvaPerHp: 12.49, provenance: C },
  { letter: 'P', minKvaPerHp: 12.5, maxKvaPerHp: 13.99, provenance: C },
  { letter: 'R', minKvaPerHp: 14.0, maxKvaPerHp: 15.99, provenance: C },
  { letter: 'S', minKvaPerHp: 16.0, maxKvaPerHp: 17.99, provenance: C },
  { letter: 'T', minKvaPerHp: 18.0, maxKvaPerHp: 19.99, provenance: C },
  { letter: 'U', minKvaPerHp: 20.0, maxKvaPerHp: 22.39, provenance: C },
  { letter: 'V', minKvaPerHp: 22.4, maxKvaPerHp: null, provenance: C },
];

export const CODE_LETTERS: readonly CodeLetter[] = NEC_430_7_B.map((r) => r.letter);

/** Watts per horsepower (1 hp = 745.7 W, the mechanical horsepower as NEC motor tables use it). */
export const WATTS_PER_HP = 745.7;
