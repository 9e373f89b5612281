/**
 * NEC Table 430.7(B) as carried in core/data/motor-code-letters.ts, against the published table.
 * Source of every value below: NFPA 70-2023 Table 430.7(B), "Locked-Rotor Indicating Code Letters"
 * (corroborated: recalled, and agreeing with public reproductions of the table; not yet checked
 * against the printed code).
 */
import { describe, expect, it } from 'vitest';
import { NEC_430_7_B, CODE_LETTERS } from '../../core/data/motor-code-letters.ts';

// letter, kVA/hp from, kVA/hp to (NFPA 70-2023 Table 430.7(B), corroborated)
const PUBLISHED: [string, number, number | null][] = [
  ['A', 0, 3.14],
  ['B', 3.15, 3.54],
  ['C', 3.55, 3.99],
  ['D', 4.0, 4.49],
  ['E', 4.5, 4.99],
  ['F', 5.0, 5.59],
  ['G', 5.6, 6.29],
  ['H', 6.3, 7.09],
  ['J', 7.1, 7.99],
  ['K', 8.0, 8.99],
  ['L', 9.0, 9.99],
  ['M', 10.0, 11.19],
  ['N', 11.2, 12.49],
  ['P', 12.5, 13.99],
  ['R', 14.0, 15.99],
  ['S', 16.0, 17.99],
  ['T', 18.0, 19.99],
  ['U', 20.0, 22.39],
  ['V', 22.4, null], // "22.4 and up"
];

describe('NEC Table 430.7(B) code letters', () => {
  it('carries every letter of the table and no other (I, O and Q are not used)', () => {
    expect(CODE_LETTERS).toEqual(PUBLISHED.map((r) => r[0]));
    for (const unused of ['I', 'O', 'Q', 'W']) expect(CODE_LETTERS).not.toContain(unused);
  });

  it.each(PUBLISHED)('%s: %s to %s kVA/hp (NFPA 70-2023 Table 430.7(B), corroborated)', (letter, lo, hi) => {
    const row = NEC_430_7_B.find((r) => r.letter === letter)!;
    expect(row.minKvaPerHp).toBe(lo);
    expect(row.maxKvaPerHp).toBe(hi);
    expect(row.provenance).toBe('corroborated');
  });

  it('bands follow on without gaps wider than the table’s 0.01 step', () => {
    for (let i = 1; i < NEC_430_7_B.length; i++) {
      const gap = NEC_430_7_B[i]!.minKvaPerHp - NEC_430_7_B[i - 1]!.maxKvaPerHp!;
      expect(gap).toBeGreaterThan(0);
      expect(gap).toBeLessThanOrEqual(0.0100001);
    }
  });
});
