/**
 * The bank model: nominal figures, resistance scaling, OCV and temperature interpolation, the
 * static solve at the initial state of charge, and refusals of bad input naming the field.
 */
import { describe, expect, it } from 'vitest';
import { PROJECT_LEVEL } from '../../core/model/errors.ts';
import { solveProject, type Project } from '../../core/index.ts';
import { capacityFactorAt, ocvAt, resolveBank } from '../../core/physics/bank.ts';
import { CHEMISTRY_PRESETS, CHEMISTRIES } from '../../core/data/battery-chemistries.ts';
import { simulateDischarge } from '../../core/studies/backup/discharge.ts';
import { directLoad, flatBank } from './helpers.ts';
import { onSolved } from '../core/solved.ts';

describe('bank figures', () => {
  it('16 LiFePO4 cells × 1 string × 200 Ah: 51.2 V, 200 Ah, 10 240 Wh, usable 9216 Wh (3.2 V/cell nominal and 90 % DoD, common practice)', () => {
    const b = resolveBank({ chemistry: 'lifepo4', series: 16, capacityAh: 200 });
    expect(b.nominalVoltage).toBeCloseTo(51.2, 12);
    expect(b.capacityAh).toBe(200);
    expect(b.nominalWh).toBeCloseTo(10240, 9);
    expect(b.usableWh).toBeCloseTo(9216, 9);
    expect(b.cutoffVoltage).toBeCloseTo(40, 12); // 2.5 V/cell × 16 (cell makers' cut-off, common practice)
    // R = s·R_cell/p, R_cell = 0.05 Ω·Ah / 200 Ah (preset, from memory): 16 × 0.00025 = 0.004 Ω.
    expect(b.internalResistance).toBeCloseTo(0.004, 15);
  });

  it('4 × 12 V AGM blocks (6 cells each) × 2 strings × 100 Ah: 48 V, 200 Ah, R = 24 × (0.075/100)/2 = 0.009 Ω (Ohm: s in series, p in parallel)', () => {
    const b = resolveBank({ chemistry: 'vrla-agm', series: 4, cellsPerBlock: 6, strings: 2, capacityAh: 100 });
    expect(b.cellsInSeries).toBe(24);
    expect(b.nominalVoltage).toBeCloseTo(48, 12);
    expect(b.capacityAh).toBe(200);
    expect(b.internalResistance).toBeCloseTo(0.009, 15);
    expect(b.ratedCurrent).toBeCloseTo(10, 12); // C20: 200 Ah / 20 h
  });

  it('a datasheet value overrides the preset and is listed as overridden', () => {
    const b = resolveBank({ chemistry: 'lifepo4', series: 16, capacityAh: 280, overrides: { internalResistanceOhmAh: 0.056 } });
    expect(b.overridden).toEqual(['internalResistanceOhmAh']);
    expect(b.internalResistance).toBeCloseTo((16 * 0.056) / 280, 15);
  });
});

describe('OCV and temperature tables', () => {
  it('OCV is interpolated linearly: LiFePO4 at soc 0.4 = (3.27 + 3.29)/2 = 3.28 V (preset, from memory)', () => {
    expect(ocvAt(CHEMISTRY_PRESETS.lifepo4.ocvCurve, 0.4)).toBeCloseTo(3.28, 12);
  });

  it('flooded lead-acid at soc 0.55 = (12.10 + 12.24)/2/6 = 2.02833 V/cell (rested 12 V block table, common practice)', () => {
    expect(ocvAt(CHEMISTRY_PRESETS['flooded-lead-acid'].ocvCurve, 0.55)).toBeCloseTo(12.17 / 6, 12);
  });

  it('OCV holds at the ends outside 0…1', () => {
    expect(ocvAt(CHEMISTRY_PRESETS.nmc.ocvCurve, -0.2)).toBe(3.0);
    expect(ocvAt(CHEMISTRY_PRESETS.nmc.ocvCurve, 1.3)).toBe(4.15);
  });

  it('lead-acid capacity at 10 °C = 1/1.19 (IEEE 485 Table 1, 50 °F row, from memory)', () => {
    const r = capacityFactorAt(CHEMISTRY_PRESETS['flooded-lead-acid'].capacityVsTemperature, 10);
    expect(r.factor).toBeCloseTo(1 / 1.19, 12);
    expect(r.extrapolated).toBe(false);
  });

  it('lead-acid capacity at 25 °C = 1.00 (IEEE 485 Table 1, confirmed) and held at 1.00 above (IEEE 485 note, from memory)', () => {
    const t = CHEMISTRY_PRESETS['flooded-lead-acid'].capacityVsTemperature;
    expect(capacityFactorAt(t, 25).factor).toBe(1);
    expect(capacityFactorAt(t, 40).factor).toBe(1);
  });

  it('between rows the factor is interpolated: 17 °C lies between 15.6 °C (1/1.11) and 18.3 °C (1/1.08) (IEEE 485 Table 1, from memory)', () => {
    const f = capacityFactorAt(CHEMISTRY_PRESETS['vrla-agm'].capacityVsTemperature, 17).factor;
    const expected = 1 / 1.11 + ((1 / 1.08 - 1 / 1.11) * (17 - 15.6)) / (18.3 - 15.6);
    expect(f).toBeCloseTo(expected, 12);
  });

  it('below the table the capacity is extrapolated linearly from the two coldest points: LiFePO4 at −30 °C → 0.65 − 10 × 0.015 = 0.50 (preset rows −20 °C 0.65, −10 °C 0.80, from memory; method in bank.ts)', () => {
    const r = capacityFactorAt(CHEMISTRY_PRESETS.lifepo4.capacityVsTemperature, -30);
    expect(r.factor).toBeCloseTo(0.5, 12); // hand working in the title
    expect(r.extrapolated).toBe(true);
    expect(r.refused).toBeUndefined();
    // Never the end value held: colder is always less (boundary just below the table).
    expect(capacityFactorAt(CHEMISTRY_PRESETS.lifepo4.capacityVsTemperature, -20.5).factor).toBeLessThan(0.65);
  });

  it('lead-acid below IEEE 485 Table 1: −10 °C → 1/1.52 − 6.1 × (1/1.43 − 1/1.52)/2.8 (Table 1 rows −3.9 °C and −1.1 °C, from memory; linear, method in bank.ts)', () => {
    const a = 1 / 1.52;
    const b = 1 / 1.43;
    const expected = a + ((a - b) / (-3.9 - -1.1)) * (-10 - -3.9);
    expect(capacityFactorAt(CHEMISTRY_PRESETS['flooded-lead-acid'].capacityVsTemperature, -10).factor).toBeCloseTo(expected, 12);
    expect(expected).toBeLessThan(a);
  });

  it('refuses more than 20 °C beyond the table, or where the extrapolated capacity reaches 0 (our planning limit, common practice (no source))', () => {
    const t = CHEMISTRY_PRESETS.lifepo4.capacityVsTemperature;
    expect(capacityFactorAt(t, -40).refused).toBeUndefined(); // exactly 20 °C below −20 °C
    expect(capacityFactorAt(t, -40.01).refused).toMatch(/more than 20 °C below/);
    // A steep invented table: 0.5 at 0 °C, 1 at 10 °C → zero at −10 °C, refused there.
    const steep = [
      { temperatureC: 0, capacityFactor: 0.5 },
      { temperatureC: 10, capacityFactor: 1 },
    ];
    expect(capacityFactorAt(steep, -5).factor).toBeCloseTo(0.25, 12); // linear, hand working
    expect(capacityFactorAt(steep, -10).refused).toMatch(/no capacity/);
    expect(capacityFactorAt([{ temperatureC: 25, capacityFactor: 1 }], 20).refused).toMatch(/one-point/);
  });

  it('above the table a falling trend is extrapolated, a rising one never flatters (capped at the end value) (method in bank.ts; invented tables)', () => {
    const falling = [
      { temperatureC: 25, capacityFactor: 1 },
      { temperatureC: 45, capacityFactor: 0.9 },
    ];
    expect(capacityFactorAt(falling, 55).factor).toBeCloseTo(0.85, 12); // 0.9 − 10 × 0.005
    const rising = [
      { temperatureC: 0, capacityFactor: 0.9 },
      { temperatureC: 25, capacityFactor: 1 },
    ];
    expect(capacityFactorAt(rising, 35).factor).toBe(1);
  });

  it('every preset is consistent: cut-off below nominal, OCV rising from soc 0 to 1, float ≤ charge, every value has a provenance', () => {
    for (const c of CHEMISTRIES) {
      const p = CHEMISTRY_PRESETS[c];
      expect(p.endOfDischargeCellVoltage).toBeLessThan(p.nominalCellVoltage);
      expect(p.ocvCurve[0]!.soc).toBe(0);
      expect(p.ocvCurve.at(-1)!.soc).toBe(1);
      for (let i = 1; i < p.ocvCurve.length; i++) expect(p.ocvCurve[i]!.voltage).toBeGreaterThan(p.ocvCurve[i - 1]!.voltage);
      expect(p.floatCellVoltage).toBeLessThanOrEqual(p.chargeCellVoltage);
      for (const [k, v] of Object.entries(p.provenance)) expect(v, `${c}.${k}`).not.toBe('');
    }
  });

  it('Peukert exponents lie in the published ranges (bdbatteries.com: flooded 1.2–1.6; AGM 1.05–1.15; gel 1.10–1.25; offgridcells.com: LiFePO4 1.0–1.05)', () => {
    expect(CHEMISTRY_PRESETS['flooded-lead-acid'].peukertExponent).toBeGreaterThanOrEqual(1.2);
    expect(CHEMISTRY_PRESETS['flooded-lead-acid'].peukertExponent).toBeLessThanOrEqual(1.6);
    expect(CHEMISTRY_PRESETS['vrla-agm'].peukertExponent).toBeGreaterThanOrEqual(1.05);
    expect(CHEMISTRY_PRESETS['vrla-agm'].peukertExponent).toBeLessThanOrEqual(1.15);
    expect(CHEMISTRY_PRESETS.gel.peukertExponent).toBeGreaterThanOrEqual(1.1);
    expect(CHEMISTRY_PRESETS.gel.peukertExponent).toBeLessThanOrEqual(1.25);
    expect(CHEMISTRY_PRESETS.lifepo4.peukertExponent).toBeGreaterThanOrEqual(1.0);
    expect(CHEMISTRY_PRESETS.lifepo4.peukertExponent).toBeLessThanOrEqual(1.05);
  });
});

describe('temperature and aging in the runtime', () => {
  const run = (study: object, k = 1) => {
    const out = onSolved(simulateDischarge, directLoad(flatBank(100, 20, k), 60, study));
    if (!out.ok) throw new Error(JSON.stringify(out.problems));
    return out.result;
  };

  it('aging: state of health 0.8 gives 0.8 × the runtime at constant current with k = 1 (capacity × SoH)', () => {
    // 100 Ah at 5 A (60 W / 12 V) = 20 h new; 16 h at 80 % (Ah ÷ A).
    expect(run({}).runtimeSeconds / 3600).toBeCloseTo(20, 9);
    expect(run({ stateOfHealth: 0.8 }).runtimeSeconds / 3600).toBeCloseTo(16, 9);
  });

  it('temperature: a flooded bank at 10 °C gives 20 h / 1.19 = 16.81 h (IEEE 485 Table 1 factor, from memory)', () => {
    const out = onSolved(simulateDischarge, 
      directLoad({ ...flatBank(100, 20, 1), overrides: { ...flatBank(100, 20, 1).overrides, capacityVsTemperature: CHEMISTRY_PRESETS['flooded-lead-acid'].capacityVsTemperature } }, 60, {
        temperatureC: 10,
      }),
    );
    if (!out.ok) throw new Error(JSON.stringify(out.problems));
    expect(out.result.runtimeSeconds / 3600).toBeCloseTo(20 / 1.19, 9);
    expect(out.result.derates.find((d) => d.label === 'temperature')!.value).toBeCloseTo(1 / 1.19, 12);
  });
});

describe('static solve with a bank', () => {
  const project = (battery: object): Project => ({
    format: 'joulepath-project',
    version: 2,
    name: 't',
    elements: [{ id: 'bank', kind: 'battery', ...battery } as never, { id: 'load', kind: 'dc-load', from: 'bank', power: 1000 }],
  });

  it('uses OCV at the initial state of charge × cells: LiFePO4 at soc 0.5 → 16 × 3.29 = 52.64 V behind 0.004 Ω (preset, Thévenin)', () => {
    const out = solveProject(project({ bank: { chemistry: 'lifepo4', series: 16, capacityAh: 200, initialSoc: 0.5 } }));
    if (!out.ok) throw new Error(JSON.stringify(out.problems));
    const b = out.result.elements[0]!;
    // Terminal voltage of a Thévenin source feeding P: V = (E + √(E² − 4RP))/2 (exact DC two-bus).
    const e = 16 * 3.29;
    expect(b.output!.voltage).toBeCloseTo((e + Math.sqrt(e * e - 4 * 0.004 * 1000)) / 2, 9);
  });

  it('refuses a voltage that conflicts with the bank, naming "voltage"', () => {
    const out = solveProject(project({ voltage: 48, bank: { chemistry: 'lifepo4', series: 16, capacityAh: 200 } }));
    expect(out.ok).toBe(false);
    if (out.ok) return;
    expect(out.problems[0]).toMatchObject({ elementId: 'bank', field: 'voltage', value: 48 });
    expect(out.problems[0]!.message).toContain('54.40 V');
  });

  it('accepts a voltage that agrees with the bank (within 1 %)', () => {
    expect(solveProject(project({ voltage: 54.4, bank: { chemistry: 'lifepo4', series: 16, capacityAh: 200 } })).ok).toBe(true);
  });

  it('asks for a voltage when there is no bank', () => {
    const out = solveProject(project({}));
    expect(out.ok).toBe(false);
    if (!out.ok) expect(out.problems[0]).toMatchObject({ elementId: 'bank', field: 'voltage' });
  });
});

describe('bad input names the field', () => {
  const first = (p: unknown) => {
    const out = onSolved(simulateDischarge, p);
    expect(out.ok).toBe(false);
    return out.ok ? undefined : out.problems;
  };

  it.each([0, -100])('capacity %d Ah → bank.capacityAh', (capacityAh) => {
    const problems = first(directLoad({ chemistry: 'lifepo4', series: 16, capacityAh }, 100));
    expect(problems![0]).toMatchObject({ elementId: 'bank', field: 'bank.capacityAh', value: capacityAh });
  });

  it('a cut-off above the nominal voltage → bank.overrides.endOfDischargeCellVoltage', () => {
    const problems = first(directLoad({ chemistry: 'vrla-agm', series: 6, capacityAh: 100, overrides: { endOfDischargeCellVoltage: 2.1 } }, 100));
    expect(problems![0]).toMatchObject({ elementId: 'bank', field: 'bank.overrides.endOfDischargeCellVoltage', value: 2.1 });
    expect(problems![0]!.message).toContain('not below the nominal');
  });

  it('a negative segment duration → backup.profile.segments.0.durationHours', () => {
    const p = directLoad({ chemistry: 'lifepo4', series: 16, capacityAh: 100 }, 100, { profile: { kind: 'segments', segments: [{ durationHours: -2 }] } });
    expect(first(p)![0]).toMatchObject({ elementId: PROJECT_LEVEL, field: 'backup.profile.segments.0.durationHours', value: -2 });
  });

  it('a peak current beyond the chemistry\u2019s max C-rate → bank.capacityAh (LiFePO4 1 C = 100 A; 6 kW at ≈ 53 V ≈ 113 A)', () => {
    const problems = first(directLoad({ chemistry: 'lifepo4', series: 16, capacityAh: 100 }, 6000));
    expect(problems![0]).toMatchObject({ elementId: 'bank', field: 'bank.capacityAh' });
    expect(problems![0]!.message).toContain('1 C = 100.0 A');
  });

  it('a chain the bank cannot carry (voltage collapse at the start) → infeasible-load on "bank"', () => {
    // The solve itself refuses it (the study takes only a solved project), at the bank.
    const problems = first(directLoad({ chemistry: 'lifepo4', series: 4, capacityAh: 100, overrides: { internalResistanceOhmAh: 100, maxDischargeCRate: 100 } }, 2000));
    expect(problems![0]).toMatchObject({ code: 'infeasible-load', elementId: 'bank' });
  });

  it('a profile naming an unknown load → its field', () => {
    const p = directLoad({ chemistry: 'lifepo4', series: 16, capacityAh: 100 }, 100, { profile: { kind: 'constant', duty: [{ load: 'pump', periodMinutes: 60, onMinutes: 10 }] } });
    expect(first(p)![0]).toMatchObject({ field: 'backup.profile.duty.0.load', value: 'pump' });
  });

  it('a duty on-time longer than its period → backup.profile.duty.0.onMinutes', () => {
    const p = directLoad({ chemistry: 'lifepo4', series: 16, capacityAh: 100 }, 100, { profile: { kind: 'constant', duty: [{ load: 'load', periodMinutes: 10, onMinutes: 20 }] } });
    expect(first(p)![0]).toMatchObject({ field: 'backup.profile.duty.0.onMinutes', value: 20 });
  });

  it('a study without a bank → bank', () => {
    const p: Project = { ...directLoad({ chemistry: 'lifepo4', series: 16, capacityAh: 100 }, 100), elements: [{ id: 'bank', kind: 'battery', voltage: 48 }, { id: 'load', kind: 'dc-load', from: 'bank', power: 100 }] };
    expect(first(p)![0]).toMatchObject({ elementId: 'bank', field: 'bank' });
  });
});
