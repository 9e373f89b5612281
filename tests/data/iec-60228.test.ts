/** IEC 60228 class 2 conductor resistances against the published table, with physics cross-checks. */
import { describe, expect, it } from 'vitest';
import { IEC_60228_ALPHA20_PER_K, IEC_60228_CLASS2, IEC_60228_KT } from '../../core/data/iec-60228.ts';
import { CONDUCTOR_MATERIALS, IEC_60889_AL_RHO20_OHM_MM2_PER_M } from '../../core/data/conductor-materials.ts';

const row = (size: number) => {
  const r = IEC_60228_CLASS2.find((x) => x.sizeMm2 === size);
  if (!r) throw new Error(`no IEC 60228 row for ${size} mm²`);
  return r;
};

describe('IEC 60228:2004 class 2 spot checks (Ω/km at 20 °C)', () => {
  it.each([
    [1.5, 'cuPlain', 12.1, 'IEC 60228:2004 class 2, 1.5 mm² plain Cu'],
    [2.5, 'cuPlain', 7.41, 'IEC 60228:2004 class 2, 2.5 mm² plain Cu'],
    [2.5, 'cuCoated', 7.56, 'IEC 60228:2004 class 2, 2.5 mm² tinned Cu'],
    [6, 'cuPlain', 3.08, 'IEC 60228:2004 class 2, 6 mm² plain Cu'],
    [10, 'al', 3.08, 'IEC 60228:2004 class 2, 10 mm² Al'],
    [16, 'cuPlain', 1.15, 'IEC 60228:2004 class 2, 16 mm² plain Cu'],
    [35, 'al', 0.868, 'IEC 60228:2004 class 2, 35 mm² Al'],
    [50, 'cuPlain', 0.387, 'IEC 60228:2004 class 2, 50 mm² plain Cu'],
    [95, 'cuPlain', 0.193, 'IEC 60228:2004 class 2, 95 mm² plain Cu'],
    [150, 'al', 0.206, 'IEC 60228:2004 class 2, 150 mm² Al'],
    [185, 'cuPlain', 0.0991, 'IEC 60228:2004 class 2, 185 mm² plain Cu'],
    [240, 'cuPlain', 0.0754, 'IEC 60228:2004 class 2, 240 mm² plain Cu'],
    [240, 'al', 0.125, 'IEC 60228:2004 class 2, 240 mm² Al'],
  ] as const)('%d mm² %s = %d (%s)', (size, column, ohms, _source) => {
    expect(row(size)[column]).toBe(ohms);
  });

  it('class 1 (solid) values do not appear at 185 and 240 mm² (trap: class 1 is 0.101 / 0.0775)', () => {
    // IEC 60228:2004 class 1 (Table 1): 185 mm² 0.101, 240 mm² 0.0775; class 2: 0.0991, 0.0754.
    expect(row(185).cuPlain).not.toBe(0.101);
    expect(row(240).cuPlain).not.toBe(0.0775);
  });

  it('aluminium class 2 starts at 10 mm² (IEC 60228:2004: no Al values for 1.5–6 mm²)', () => {
    expect(IEC_60228_CLASS2.filter((r) => r.al === null).map((r) => r.sizeMm2)).toEqual([1.5, 2.5, 4, 6]);
  });
});

describe('IEC 60228 structure and physics', () => {
  it('covers 1.5 to 240 mm² in order; resistance falls with size; tinned ≥ plain; Al > Cu', () => {
    expect(IEC_60228_CLASS2.map((r) => r.sizeMm2)).toEqual([1.5, 2.5, 4, 6, 10, 16, 25, 35, 50, 70, 95, 120, 150, 185, 240]);
    for (let i = 1; i < IEC_60228_CLASS2.length; i++) {
      const a = IEC_60228_CLASS2[i - 1]!;
      const b = IEC_60228_CLASS2[i]!;
      expect(b.cuPlain).toBeLessThan(a.cuPlain);
      expect(b.cuCoated).toBeLessThan(a.cuCoated);
      if (a.al !== null && b.al !== null) expect(b.al).toBeLessThan(a.al);
    }
    for (const r of IEC_60228_CLASS2) {
      expect(r.cuCoated).toBeGreaterThanOrEqual(r.cuPlain);
      if (r.al !== null) expect(r.al).toBeGreaterThan(r.cuPlain);
    }
  });

  it('R·A stays between 1.00 and 1.13 × ρ20 of standard copper (computed; the maxima allow for stranding and area tolerance)', () => {
    // ρ20 = 1/58 Ω·mm²/m (IEC 60028). R [Ω/km] × A [mm²] / 1000 = Ω·mm²/m. Observed spread 1.050–1.122.
    const rho = CONDUCTOR_MATERIALS.find((m) => m.material === 'Cu')!.rho20OhmMm2PerM;
    for (const r of IEC_60228_CLASS2) {
      const ratio = (r.cuPlain * r.sizeMm2) / 1000 / rho;
      expect(ratio, `${r.sizeMm2} mm²`).toBeGreaterThanOrEqual(1.0);
      expect(ratio, `${r.sizeMm2} mm²`).toBeLessThan(1.13);
    }
  });

  it('aluminium R·A stays between 1.00 and 1.14 × ρ20 = 0.028264 Ω·mm²/m (IEC 60889, from memory) (computed)', () => {
    for (const r of IEC_60228_CLASS2) {
      if (r.al === null) continue;
      const ratio = (r.al * r.sizeMm2) / 1000 / IEC_60889_AL_RHO20_OHM_MM2_PER_M;
      expect(ratio, `${r.sizeMm2} mm²`).toBeGreaterThanOrEqual(1.0);
      expect(ratio, `${r.sizeMm2} mm²`).toBeLessThan(1.14);
    }
  });
});

describe('IEC 60228 temperature correction basis', () => {
  it.each([
    [30, 0.962, 'IEC 60228 k_t, 30 °C (published copy)'],
    [70, 0.833, 'IEC 60228 k_t, 70 °C (published copy)'],
    [90, 0.781, 'IEC 60228 k_t, 90 °C (published copy)'],
  ] as const)('k_t(%d °C) = %d (%s) = 250/(230 + t) rounded to 3 decimals', (t, kt, _source) => {
    const r = IEC_60228_KT.find((x) => x.temperatureC === t)!;
    expect(r.kt).toBe(kt);
    expect(Math.round((250 / (230 + t)) * 1000) / 1000).toBe(kt); // computed: k_t = 250/(230 + t)
  });

  it('k_t = 1/(1 + α20·(t − 20)) with α20 = 0.004 /K (computed from the published k_t)', () => {
    expect(IEC_60228_ALPHA20_PER_K).toBe(0.004);
    for (const r of IEC_60228_KT) {
      expect(1 / (1 + IEC_60228_ALPHA20_PER_K * (r.temperatureC - 20))).toBeCloseTo(r.kt, 3);
    }
  });
});

describe('IEC 60228:2004 class 2, every cell as printed', () => {
  // IEC 60228:2004 class 2: mm², plain Cu, tinned Cu, Al ('-' = none) in Ω/km at 20 °C.
  const PRINTED = `
    1.5  12.1   12.2   -
    2.5  7.41   7.56   -
    4    4.61   4.70   -
    6    3.08   3.11   -
    10   1.83   1.84   3.08
    16   1.15   1.16   1.91
    25   0.727  0.734  1.20
    35   0.524  0.529  0.868
    50   0.387  0.391  0.641
    70   0.268  0.270  0.443
    95   0.193  0.195  0.320
    120  0.153  0.154  0.253
    150  0.124  0.126  0.206
    185  0.0991 0.100  0.164
    240  0.0754 0.0762 0.125`;
  const rows = PRINTED.trim().split('\n').map((line) => line.trim().split(/\s+/).map((s) => (s === '-' ? null : Number(s))));

  it.each(rows.map((cells) => [cells[0]!, cells.slice(1)] as const))('%d mm²', (size, cells) => {
    const r = row(size);
    expect([r.cuPlain, r.cuCoated, r.al]).toEqual(cells);
  });
});
