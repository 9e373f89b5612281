/** NEC 240.6(A) standard ampere ratings, 2023 and 2020 editions. */
import { describe, expect, it } from 'vitest';
import { NEC_240_6_A, NEC_240_6_A_2020, NEC_240_6_A_2023 } from '../../core/data/nec-240-6.ts';

describe('NEC 240.6(A) standard ampere ratings', () => {
  it.each([
    [10, 'NEC 2023 Table 240.6(A): 10 A added in 2023'],
    [15, 'NEC 2023 Table 240.6(A)'],
    [35, 'NEC 2023 Table 240.6(A)'],
    [110, 'NEC 2023 Table 240.6(A)'],
    [175, 'NEC 2023 Table 240.6(A)'],
    [450, 'NEC 2023 Table 240.6(A)'],
    [1000, 'NEC 2023 Table 240.6(A)'],
    [6000, 'NEC 2023 Table 240.6(A), largest rating'],
  ])('2023 lists %d A (%s)', (amps) => {
    expect(NEC_240_6_A_2023.standardA).toContain(amps);
  });

  it.each([
    [55, 'NEC 2023 Table 240.6(A): not a standard rating'],
    [65, 'NEC 2023 Table 240.6(A): not a standard rating'],
    [900, 'NEC 2023 Table 240.6(A): not a standard rating'],
  ])('2023 does not list %d A (%s)', (amps) => {
    expect(NEC_240_6_A_2023.standardA).not.toContain(amps);
  });

  it('has 38 ratings from 10 A to 6000 A in 2023 (NEC 2023 Table 240.6(A))', () => {
    expect(NEC_240_6_A_2023.standardA).toHaveLength(38);
    expect(NEC_240_6_A_2023.standardA[0]).toBe(10);
    expect(NEC_240_6_A_2023.standardA.at(-1)).toBe(6000);
    expect(NEC_240_6_A_2023.standardProvenance).toBe('confirmed');
  });

  it('every list is sorted and unique', () => {
    for (const e of NEC_240_6_A) {
      for (const list of [e.standardA, e.additionalFuseA]) {
        for (let i = 1; i < list.length; i++) expect(list[i]!, e.edition).toBeGreaterThan(list[i - 1]!);
      }
    }
  });

  it('edition difference: 10 A is standard in 2023, only an additional fuse rating in 2020', () => {
    // NEC 2020 240.6(A) text (confirmed): "Additional standard ampere ratings for fuses shall be 1, 3, 6, 10, and 601".
    expect(NEC_240_6_A_2020.additionalFuseA).toEqual([1, 3, 6, 10, 601]);
    expect(NEC_240_6_A_2020.additionalFuseProvenance).toBe('confirmed');
    expect(NEC_240_6_A_2020.standardA).not.toContain(10);
    // The 2020 standard list is from memory: the 2023 list without 10 A.
    expect(NEC_240_6_A_2020.standardProvenance).toBe('from memory');
    expect([10, ...NEC_240_6_A_2020.standardA]).toEqual([...NEC_240_6_A_2023.standardA]);
    // 2023 additional fuse ratings: from memory (1, 3, 6, 601).
    expect(NEC_240_6_A_2023.additionalFuseA).toEqual([1, 3, 6, 601]);
    expect(NEC_240_6_A_2023.additionalFuseProvenance).toBe('from memory');
  });
});
