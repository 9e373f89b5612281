/**
 * NEC Table 310.15(B)(1)(1) ambient correction and Table 310.15(C)(1) conductor-count adjustment:
 * published values, a computed cross-check with NEC Equation 310.15(B)(1), band structure, and a
 * published worked example.
 */
import { describe, expect, it } from 'vitest';
import { NEC_310_15_B_1_1, NEC_310_15_C_1, NEC_AMBIENT_BASE_C } from '../../core/data/nec-310-15.ts';
import { NEC_310_16, type NecTempRating } from '../../core/data/nec-310-16.ts';

const RATINGS: readonly NecTempRating[] = [60, 75, 90];

function band(ambientC: number) {
  const r = NEC_310_15_B_1_1.find((b) => ambientC <= b.toC && (b.fromC === null || ambientC >= b.fromC));
  if (!r) throw new Error(`no band for ${ambientC} °C`);
  return r;
}

describe('NEC 2023 Table 310.15(B)(1)(1) spot checks', () => {
  // [ambient °C, rating, factor, source]
  it.each([
    [10, 60, 1.29, 'NEC 2023 Table 310.15(B)(1)(1), 10 °C or less, 60 °C column'],
    [13, 90, 1.12, 'NEC 2023 Table 310.15(B)(1)(1), 11–15 °C, 90 °C column'],
    [23, 75, 1.05, 'NEC 2023 Table 310.15(B)(1)(1), 21–25 °C, 75 °C column'],
    [28, 60, 1.0, 'NEC 2023 Table 310.15(B)(1)(1), 26–30 °C (base)'],
    [33, 60, 0.91, 'NEC 2023 Table 310.15(B)(1)(1), 31–35 °C, 60 °C column'],
    [38, 75, 0.88, 'NEC 2023 Table 310.15(B)(1)(1), 36–40 °C, 75 °C column'],
    [42, 90, 0.87, 'NEC 2023 Table 310.15(B)(1)(1), 41–45 °C, 90 °C column'],
    [48, 75, 0.75, 'NEC 2023 Table 310.15(B)(1)(1), 46–50 °C, 75 °C column'],
    [53, 60, 0.41, 'NEC 2023 Table 310.15(B)(1)(1), 51–55 °C, 60 °C column'],
    [63, 75, 0.47, 'NEC 2023 Table 310.15(B)(1)(1), 61–65 °C, 75 °C column'],
    [68, 90, 0.58, 'NEC 2023 Table 310.15(B)(1)(1), 66–70 °C, 90 °C column'],
    [85, 90, 0.29, 'NEC 2023 Table 310.15(B)(1)(1), 81–85 °C, 90 °C column'],
  ] as const)('%d °C, %i °C insulation → %d (%s)', (ambient, rating, factor, _source) => {
    expect(band(ambient).factor[rating]).toBe(factor);
  });

  it('leaves the cells empty where the ambient reaches the insulation rating (NEC 2023 Table 310.15(B)(1)(1))', () => {
    expect(band(58).factor[60]).toBeNull(); // 56–60 °C, 60 °C column: no value printed
    expect(band(73).factor[75]).toBeNull(); // 71–75 °C, 75 °C column: no value printed
    expect(band(83).factor[90]).not.toBeNull(); // 81–85 °C, 90 °C column: 0.29
  });

  it('keeps the 2008-era band merge out: 61–65 °C has its own row at 75 °C (0.47), not 0.33 (old 61–70 band, from memory)', () => {
    // NEC 2023 Table 310.15(B)(1)(1): 61–65 °C → 0.47; the old 61–70 °C band printed 0.33.
    expect(band(62).factor[75]).toBe(0.47);
  });
});

describe('ambient factors against NEC Equation 310.15(B)(1)', () => {
  // Computed cross-check: I′/I = √[(Tc − Ta)/(Tc − 30)] (NEC 2023 Equation 310.15(B)(1)) evaluated at
  // the warm end of each printed band and rounded to 2 decimals reproduces every printed cell; where
  // Tc − Ta ≤ 0 at the warm end the table prints nothing.
  it('reproduces every cell at the warm end of its band', () => {
    let checked = 0;
    for (const b of NEC_310_15_B_1_1) {
      for (const tc of RATINGS) {
        const printed = b.factor[tc];
        const margin = tc - b.toC;
        if (margin <= 0) {
          expect(printed, `${b.toC} °C / ${tc}`).toBeNull();
          continue;
        }
        const computed = Math.round(Math.sqrt(margin / (tc - NEC_AMBIENT_BASE_C)) * 100) / 100;
        expect(printed, `${b.toC} °C / ${tc}`).toBe(computed);
        checked++;
      }
    }
    expect(checked).toBe(16 + 13 + 10); // 90 °C: 16 bands; 75 °C: 13; 60 °C: 10 (published table)
  });
});

describe('ambient band structure', () => {
  it('bands are contiguous whole degrees from "10 or less" to 85 °C, °F bands match', () => {
    const first = NEC_310_15_B_1_1[0]!;
    expect(first.fromC).toBeNull();
    expect(first.fromF).toBeNull();
    expect(NEC_310_15_B_1_1.at(-1)?.toC).toBe(85); // NEC 2023 Table 310.15(B)(1)(1), last row 81–85 °C
    for (let i = 0; i < NEC_310_15_B_1_1.length; i++) {
      const b = NEC_310_15_B_1_1[i]!;
      // The printed °F upper bound is the °C upper bound converted exactly (F = 9/5·C + 32).
      expect(b.toF).toBe((b.toC * 9) / 5 + 32);
      if (i > 0) {
        const prev = NEC_310_15_B_1_1[i - 1]!;
        expect(b.fromC).toBe(prev.toC + 1);
        expect(b.fromF).toBe(prev.toF + 1);
      }
    }
  });

  it('factors never rise with ambient and equal 1.00 in the base band 26–30 °C (NEC 2023 Table 310.15(B)(1)(1))', () => {
    for (const tc of RATINGS) {
      const column = NEC_310_15_B_1_1.map((b) => b.factor[tc]).filter((v): v is number => v !== null);
      for (let i = 1; i < column.length; i++) expect(column[i]!).toBeLessThanOrEqual(column[i - 1]!);
      expect(band(30).factor[tc]).toBe(1);
    }
  });
});

describe('NEC 2023 Table 310.15(C)(1) more than three current-carrying conductors', () => {
  it.each([
    [4, 80, 'NEC 2023 Table 310.15(C)(1), 4–6 conductors'],
    [6, 80, 'NEC 2023 Table 310.15(C)(1), 4–6 conductors'],
    [7, 70, 'NEC 2023 Table 310.15(C)(1), 7–9 conductors'],
    [10, 50, 'NEC 2023 Table 310.15(C)(1), 10–20 conductors'],
    [20, 50, 'NEC 2023 Table 310.15(C)(1), 10–20 conductors'],
    [21, 45, 'NEC 2023 Table 310.15(C)(1), 21–30 conductors'],
    [35, 40, 'NEC 2023 Table 310.15(C)(1), 31–40 conductors'],
    [41, 35, 'NEC 2023 Table 310.15(C)(1), 41 and above'],
    [120, 35, 'NEC 2023 Table 310.15(C)(1), 41 and above'],
  ] as const)('%d conductors → %d %% (%s)', (count, percent, _source) => {
    const r = NEC_310_15_C_1.find((x) => count >= x.fromCount && (x.toCount === null || count <= x.toCount));
    expect(r?.percent).toBe(percent);
  });

  it('rows are contiguous from 4 conductors, open-ended at the top, percent falling', () => {
    expect(NEC_310_15_C_1[0]?.fromCount).toBe(4);
    expect(NEC_310_15_C_1.at(-1)?.toCount).toBeNull();
    for (let i = 1; i < NEC_310_15_C_1.length; i++) {
      const prev = NEC_310_15_C_1[i - 1]!;
      const r = NEC_310_15_C_1[i]!;
      expect(r.fromCount).toBe((prev.toCount ?? Number.NaN) + 1);
      expect(r.percent).toBeLessThan(prev.percent);
    }
  });
});

describe('published worked example', () => {
  it('four 10 AWG THHN at 120 °F: 40 A × 0.82 = 32.8 A; with four current-carrying conductors × 0.80 = 26.24 A', () => {
    // Worked example, Stallcup Education "Applying correction factors" article: 10 AWG THHN (Cu 90 °C)
    // at 120 °F → 40 A × 0.82 = 32.8 A. The page applies the temperature factor only; the 26.24 A
    // figure is a hand calculation adding Table 310.15(C)(1) for 4 current-carrying conductors.
    const ampacity = NEC_310_16.find((r) => r.size === '10 AWG')!.cu[90]!;
    const b = NEC_310_15_B_1_1.find((x) => 120 <= x.toF && (x.fromF === null || 120 >= x.fromF))!;
    const adjust = NEC_310_15_C_1.find((x) => 4 >= x.fromCount && (x.toCount === null || 4 <= x.toCount))!;
    expect(ampacity).toBe(40);
    expect(b.factor[90]).toBe(0.82);
    expect(ampacity * b.factor[90]!).toBeCloseTo(32.8, 10);
    expect((ampacity * b.factor[90]! * adjust.percent) / 100).toBeCloseTo(26.24, 10);
  });
});
