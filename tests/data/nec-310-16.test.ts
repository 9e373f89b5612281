/**
 * NEC Table 310.16 ampacities and the 240.4(D) small-conductor limits against the published
 * values, the pre-2014 trap cells, and the table's structure.
 */
import { describe, expect, it } from 'vitest';
import { NEC_310_16, NEC_240_4_D, type NecTempRating } from '../../core/data/nec-310-16.ts';
import { NEC_SIZES, type NecSize } from '../../core/data/nec-sizes.ts';
import { NEC_CHAPTER9_TABLE8 } from '../../core/data/nec-chapter9.ts';
import { NEC_240_6_A_2023 } from '../../core/data/nec-240-6.ts';

function row(size: NecSize) {
  const r = NEC_310_16.find((x) => x.size === size);
  if (!r) throw new Error(`no Table 310.16 row for ${size}`);
  return r;
}

const RATINGS: readonly NecTempRating[] = [60, 75, 90];

describe('NEC 2023 Table 310.16 spot checks', () => {
  // [size, material, rating, amperes, source]
  it.each([
    ['14 AWG', 'cu', 60, 15, 'NEC 2023 Table 310.16, 14 AWG Cu 60 °C'],
    ['14 AWG', 'cu', 90, 25, 'NEC 2023 Table 310.16, 14 AWG Cu 90 °C'],
    ['12 AWG', 'cu', 75, 25, 'NEC 2023 Table 310.16, 12 AWG Cu 75 °C'],
    ['12 AWG', 'al', 60, 15, 'NEC 2023 Table 310.16, 12 AWG Al 60 °C'],
    ['10 AWG', 'cu', 90, 40, 'NEC 2023 Table 310.16, 10 AWG Cu 90 °C'],
    ['8 AWG', 'al', 60, 35, 'NEC 2023 Table 310.16, 8 AWG Al 60 °C'],
    ['6 AWG', 'cu', 75, 65, 'NEC 2023 Table 310.16, 6 AWG Cu 75 °C'],
    ['6 AWG', 'al', 90, 55, 'NEC 2023 Table 310.16, 6 AWG Al 90 °C'],
    ['3 AWG', 'cu', 90, 115, 'NEC 2023 Table 310.16, 3 AWG Cu 90 °C'],
    ['1 AWG', 'cu', 90, 145, 'NEC 2023 Table 310.16, 1 AWG Cu 90 °C'],
    ['1/0 AWG', 'cu', 75, 150, 'NEC 2023 Table 310.16, 1/0 AWG Cu 75 °C'],
    ['2/0 AWG', 'al', 75, 135, 'NEC 2023 Table 310.16, 2/0 AWG Al 75 °C'],
    ['4/0 AWG', 'cu', 60, 195, 'NEC 2023 Table 310.16, 4/0 AWG Cu 60 °C'],
    ['250 kcmil', 'cu', 75, 255, 'NEC 2023 Table 310.16, 250 kcmil Cu 75 °C'],
    ['300 kcmil', 'al', 60, 195, 'NEC 2023 Table 310.16, 300 kcmil Al 60 °C'],
    ['300 kcmil', 'al', 90, 260, 'NEC 2023 Table 310.16, 300 kcmil Al 90 °C'],
    ['350 kcmil', 'al', 75, 250, 'NEC 2023 Table 310.16, 350 kcmil Al 75 °C'],
    ['400 kcmil', 'cu', 90, 380, 'NEC 2023 Table 310.16, 400 kcmil Cu 90 °C'],
    ['500 kcmil', 'cu', 90, 430, 'NEC 2023 Table 310.16, 500 kcmil Cu 90 °C'],
    ['500 kcmil', 'al', 75, 310, 'NEC 2023 Table 310.16, 500 kcmil Al 75 °C'],
  ] as const)('%s %s %i °C = %d A (%s)', (size, material, rating, amps, _source) => {
    expect(row(size)[material][rating]).toBe(amps);
  });

  it('has no aluminum ampacity at 14 AWG (NEC 2023 Table 310.16 leaves the cells empty)', () => {
    expect(row('14 AWG').al).toEqual({ 60: null, 75: null, 90: null });
  });

  it('marks the asterisked sizes 14, 12, 10 AWG that refer to 240.4(D) (NEC 2023 Table 310.16 note)', () => {
    const marked = NEC_310_16.filter((r) => r.smallConductorRule).map((r) => r.size);
    expect(marked).toEqual(['14 AWG', '12 AWG', '10 AWG']);
  });
});

describe('pre-2014 Table 310-16 values do not appear (trap)', () => {
  // [size, material, rating, current value, old value]
  // Current values: NEC 2023 Table 310.16. Old values: published copies of pre-2014 Table 310-16.
  it.each([
    ['14 AWG', 'cu', 60, 15, 20],
    ['12 AWG', 'cu', 60, 20, 25],
    ['12 AWG', 'al', 60, 15, 20],
    ['8 AWG', 'al', 60, 35, 30],
    ['6 AWG', 'al', 90, 55, 60],
    ['3 AWG', 'cu', 90, 115, 110],
    ['1 AWG', 'cu', 90, 145, 150],
    ['300 kcmil', 'al', 60, 195, 190],
    ['300 kcmil', 'al', 90, 260, 255],
  ] as const)('%s %s %i °C is %d A, not the old %d A', (size, material, rating, current, old) => {
    const value = row(size)[material][rating];
    expect(value).toBe(current);
    expect(value).not.toBe(old);
  });
});

describe('Table 310.16 structure', () => {
  it('lists every size from 14 AWG to 500 kcmil once, in order (NEC 2023 Table 310.16 rows)', () => {
    expect(NEC_310_16.map((r) => r.size)).toEqual([...NEC_SIZES]);
  });

  it('carries the Chapter 9 Table 8 area for each size (cross-check between the two files)', () => {
    for (const r of NEC_310_16) {
      expect(NEC_CHAPTER9_TABLE8.find((t) => t.size === r.size)?.areaCmil, r.size).toBe(r.areaCmil);
    }
  });

  it('ampacity rises strictly with size within every column (structural check of the table)', () => {
    for (const material of ['cu', 'al'] as const) {
      for (const rating of RATINGS) {
        const column = NEC_310_16.map((r) => r[material][rating]).filter((v): v is number => v !== null);
        expect(column.length, `${material} ${rating}`).toBeGreaterThanOrEqual(17);
        for (let i = 1; i < column.length; i++) expect(column[i], `${material} ${rating} row ${i}`).toBeGreaterThan(column[i - 1]!);
      }
    }
  });

  it('a higher insulation rating never carries less, and aluminum carries less than copper (physics of the table)', () => {
    for (const r of NEC_310_16) {
      for (const material of ['cu', 'al'] as const) {
        const [a, b, c] = RATINGS.map((t) => r[material][t]);
        if (a === null || b === null || c === null) continue;
        expect(a, r.size).toBeLessThanOrEqual(b);
        expect(b, r.size).toBeLessThanOrEqual(c);
      }
      for (const t of RATINGS) {
        const al = r.al[t];
        if (al !== null) expect(al, `${r.size} ${t}`).toBeLessThan(r.cu[t]!);
      }
    }
  });

  it('every cell is a positive number or null, never zero', () => {
    for (const r of NEC_310_16) {
      for (const t of RATINGS) {
        for (const v of [r.cu[t], r.al[t]]) if (v !== null) expect(v).toBeGreaterThan(0);
        expect(r.cu[t]).not.toBeNull();
      }
    }
  });
});

describe('NEC 240.4(D) small-conductor limits (from memory until checked)', () => {
  // All five limits are from memory of NEC 2023 240.4(D)(3)–(7).
  it.each([
    ['Cu', '14 AWG', 15],
    ['Cu', '12 AWG', 20],
    ['Cu', '10 AWG', 30],
    ['Al', '12 AWG', 15],
    ['Al', '10 AWG', 25],
  ] as const)('%s %s: at most %d A (from memory, NEC 2023 240.4(D))', (material, size, amps) => {
    const r = NEC_240_4_D.find((x) => x.material === material && x.size === size);
    expect(r?.maxOcpdA).toBe(amps);
    expect(r?.provenance).toBe('from memory');
  });

  it('each limit is a standard rating (NEC 2023 240.6(A)) and within the 60 °C ampacity (Table 310.16)', () => {
    for (const r of NEC_240_4_D) {
      expect(NEC_240_6_A_2023.standardA).toContain(r.maxOcpdA);
      const amp = row(r.size)[r.material === 'Cu' ? 'cu' : 'al'][60];
      expect(amp).not.toBeNull();
      expect(r.maxOcpdA).toBeLessThanOrEqual(amp!);
    }
  });
});

describe('NEC 2023 Table 310.16, every cell as printed', () => {
  // NEC 2023 Table 310.16, rows as printed: size, Cu 60/75/90 °C, Al/CCA 60/75/90 °C ('-' = empty cell).
  const PRINTED = `
    14 AWG     15  20  25   -   -   -
    12 AWG     20  25  30  15  20  25
    10 AWG     30  35  40  25  30  35
    8 AWG      40  50  55  35  40  45
    6 AWG      55  65  75  40  50  55
    4 AWG      70  85  95  55  65  75
    3 AWG      85 100 115  65  75  85
    2 AWG      95 115 130  75  90 100
    1 AWG     110 130 145  85 100 115
    1/0 AWG   125 150 170 100 120 135
    2/0 AWG   145 175 195 115 135 150
    3/0 AWG   165 200 225 130 155 175
    4/0 AWG   195 230 260 150 180 205
    250 kcmil 215 255 290 170 205 230
    300 kcmil 240 285 320 195 230 260
    350 kcmil 260 310 350 210 250 280
    400 kcmil 280 335 380 225 270 305
    500 kcmil 320 380 430 260 310 350`;
  const rows = PRINTED.trim().split('\n').map((line) => line.trim().split(/\s+/));

  it.each(rows.map((cells) => [`${cells[0]} ${cells[1]}`, cells.slice(2)] as const))('%s', (size, cells) => {
    const r = row(size as NecSize);
    const value = (s: string) => (s === '-' ? null : Number(s));
    expect([r.cu[60], r.cu[75], r.cu[90], r.al[60], r.al[75], r.al[90]]).toEqual(cells.map(value));
  });
});
