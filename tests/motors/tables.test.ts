/**
 * Motor and drive data tables against the published values. Every value names its source; cells
 * not checked against a published copy are marked "from memory".
 */
import { describe, expect, it } from 'vitest';
import { IEC_60034_30_1_4P_50HZ, type IeClass } from '../../core/data/iec-60034-30-1.ts';
import { NEMA_PREMIUM_4P_60HZ_TEFC } from '../../core/data/nema-mg1-12-12.ts';
import { NEC_430_250, type Nec430Voltage } from '../../core/data/nec-430-250.ts';
import { STANDARD_POINTS } from '../../core/data/iec-61800-9-2.ts';
import { MOTOR_PART_LOAD } from '../../core/data/motor-part-load.ts';

const ie = (kW: number, cls: IeClass) => {
  const row = IEC_60034_30_1_4P_50HZ.find((r) => r.kW === kW);
  if (!row) throw new Error(`no row ${kW} kW`);
  return { value: row.efficiency[cls], provenance: row.provenance[cls] };
};

describe('IEC 60034-30-1:2014, 4-pole 50 Hz (Tables 2–5)', () => {
  // [kW, class, %, source]
  const cases: [number, IeClass, number, 'confirmed' | 'from memory'][] = [
    [0.75, 'IE1', 72.1, 'confirmed'], // IEC 60034-30:2008 IE1 row, maker's published copy
    [1.5, 'IE1', 77.2, 'confirmed'], // same
    [4, 'IE1', 83.1, 'confirmed'], // same
    [7.5, 'IE1', 86.0, 'confirmed'], // same
    [11, 'IE1', 87.6, 'confirmed'], // same
    [0.75, 'IE2', 79.6, 'confirmed'], // IEC 60034-30 IE2 row, maker's published copy
    [1.5, 'IE2', 82.8, 'confirmed'], // same
    [4, 'IE2', 86.6, 'confirmed'], // same
    [7.5, 'IE2', 88.7, 'confirmed'], // same
    [11, 'IE2', 89.8, 'confirmed'], // same
    [15, 'IE2', 90.6, 'confirmed'], // maker's published IE2 15 kW example
    [0.75, 'IE3', 82.5, 'confirmed'], // IEC 60034-30 IE3 row, maker's published copy
    [1.5, 'IE3', 85.3, 'confirmed'], // same
    [4, 'IE3', 88.6, 'confirmed'], // same
    [7.5, 'IE3', 90.4, 'confirmed'], // same
    [11, 'IE4', 93.3, 'confirmed'], // published IE4 11 kW 4-pole test plan value
    [11, 'IE3', 91.4, 'from memory'],
    [15, 'IE3', 92.1, 'from memory'],
    [37, 'IE2', 92.7, 'from memory'],
    [37, 'IE3', 93.9, 'from memory'],
    [75, 'IE3', 95.0, 'from memory'],
    [75, 'IE4', 96.0, 'from memory'],
    [0.75, 'IE4', 85.7, 'from memory'],
  ];
  it.each(cases)('%s kW %s = %s %% (%s)', (kW, cls, pct, provenance) => {
    expect(ie(kW, cls)).toEqual({ value: pct, provenance });
  });

  it('classes rise IE1 < IE2 < IE3 < IE4 in every row (the classes are nested by definition, IEC 60034-30-1 clause 6)', () => {
    for (const r of IEC_60034_30_1_4P_50HZ) {
      const vals = (['IE1', 'IE2', 'IE3', 'IE4'] as const).map((c) => r.efficiency[c]).filter((v) => v !== null);
      for (let i = 1; i < vals.length; i++) expect(vals[i]!).toBeGreaterThan(vals[i - 1]!);
    }
  });
});

describe('NEMA MG 1 Table 12-12 (NEMA Premium), 4-pole 60 Hz enclosed — NRCan published table (2015)', () => {
  const cases: [number, number][] = [
    [1, 85.5], [1.5, 86.5], [2, 86.5], [3, 89.5], [5, 89.5], [7.5, 91.7], [10, 91.7], [15, 92.4], [20, 93.0],
    [25, 93.6], [30, 93.6], [40, 94.1], [50, 94.5], [60, 95.0], [75, 95.4], [100, 95.4], [125, 95.4], [150, 95.8], [200, 96.2],
  ];
  it.each(cases)('%s hp = %s %% (confirmed)', (hp, pct) => {
    const row = NEMA_PREMIUM_4P_60HZ_TEFC.find((r) => r.hp === hp);
    expect(row).toEqual({ hp, efficiency: pct, provenance: 'confirmed' });
  });
  it('is not the older EPAct-1992 level (42 USC 6313: 10 hp 4-pole enclosed = 89.5 %)', () => {
    expect(NEMA_PREMIUM_4P_60HZ_TEFC.find((r) => r.hp === 10)!.efficiency).not.toBe(89.5);
  });
});

describe('NEC Table 430.250 (NFPA 70-2023), 3φ induction motors, full-load current', () => {
  const cases: [number, Nec430Voltage, number][] = [
    [1, 230, 4.2], [5, 230, 15.2], [10, 230, 28], [25, 230, 68], [50, 230, 130],
    [1, 460, 2.1], [5, 460, 7.6], [10, 460, 14], [25, 460, 34], [50, 460, 65],
    [1, 200, 4.8], [5, 200, 17.5], [10, 200, 32.2], [25, 200, 78.2], [50, 200, 150],
    [1, 208, 4.6], [5, 208, 16.7], [10, 208, 30.8], [25, 208, 74.8], [50, 208, 143],
    [1, 575, 1.7], [5, 575, 6.1], [10, 575, 11], [25, 575, 27], [50, 575, 52],
  ];
  it.each(cases)('%s hp at %s V = %s A (NFPA 70-2023 Table 430.250, confirmed)', (hp, v, amps) => {
    expect(NEC_430_250.find((r) => r.hp === hp)!.amps[v]).toBe(amps);
  });
});

describe('IEC 61800-9-2 eight operating points (from memory)', () => {
  it('CDM basis tops at 90 % frequency, PDS at 100 % speed', () => {
    const pairs = (b: 'cdm' | 'pds') => STANDARD_POINTS[b].map((p) => [p.speed, p.torque]);
    expect(pairs('cdm')).toEqual([[0, 25], [0, 50], [0, 100], [50, 25], [50, 50], [50, 100], [90, 50], [90, 100]]);
    expect(pairs('pds')).toEqual([[0, 25], [0, 50], [0, 100], [50, 25], [50, 50], [50, 100], [100, 50], [100, 100]]);
  });
});

describe('motor part-load shape (common practice, no source)', () => {
  it('is 1 at full load; efficiency within 2 % of full load from 50 to 100 %; pf falls faster than efficiency below full load', () => {
    const at = (x: number) => MOTOR_PART_LOAD.find((p) => p.loadFraction === x)!;
    expect(at(1)).toMatchObject({ efficiencyRatio: 1, powerFactorRatio: 1 });
    for (const x of [0.5, 0.75]) expect(Math.abs(at(x).efficiencyRatio - 1)).toBeLessThanOrEqual(0.02);
    for (const x of [0.25, 0.5, 0.75]) expect(at(x).powerFactorRatio).toBeLessThan(at(x).efficiencyRatio);
  });
});
