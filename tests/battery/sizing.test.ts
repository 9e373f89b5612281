/**
 * Bank sizing (core/studies/backup/sizing.ts): IEEE 485 Table 1 temperature factors, the IEEE 485 duty-cycle
 * worksheet worked by hand (K_t from a datasheet-style table and from Peukert's law), the lithium
 * energy method worked by hand, string selection, and refusals of bad input.
 *
 * The duty cycles and datasheet tables below are invented scenarios; every expected figure names
 * its source beside it.
 */
import { describe, expect, it } from 'vitest';
import {
  ieee485TemperatureFactor,
  peukertCapacityFactor,
  sizeBank,
  depthOfDischargeCapacity,
  tableCapacityFactor,
  worksheetSections,
  type BankSizing,
  type SizingInput,
} from '../../core/studies/backup/sizing.ts';
import { IEEE_485_TEMPERATURE_FACTORS } from '../../core/data/ieee-485.ts';
import { runBackupStudy } from '../../core/studies/backup/study.ts';
import { simulateDischarge } from '../../core/studies/backup/discharge.ts';
import { demoProjects, type BatterySource, type Project } from '../../core/index.ts';
import { onSolved } from '../core/solved.ts';

function sized(input: SizingInput): BankSizing {
  const r = sizeBank(input);
  if (!r.ok) throw new Error(r.problems.map((p) => `${p.field}: ${p.message}`).join('\n'));
  return r.sizing;
}
function problemsOf(input: SizingInput) {
  const r = sizeBank(input);
  expect(r.ok).toBe(false);
  return r.ok ? [] : r.problems;
}
const stepValue = (s: BankSizing, label: string) => {
  const st = s.steps.find((x) => x.label === label);
  if (st === undefined) throw new Error(`no step "${label}"`);
  return st.value;
};

describe('IEEE 485 Table 1 temperature correction factors', () => {
  // [°F, °C, factor] as printed in IEEE 485 Table 1 (vented lead-acid, rated at 25 °C).
  // Range and the 1.00 point at 77 °F / 25 °C: confirmed (published vendor note quoting the
  // standard). Every other factor: from memory, to be checked against the printed standard.
  const published: [number, number, number][] = [
    [25, -3.9, 1.52], [30, -1.1, 1.43], [35, 1.7, 1.35], [40, 4.4, 1.3], [45, 7.2, 1.25],
    [50, 10.0, 1.19], [55, 12.8, 1.15], [60, 15.6, 1.11], [65, 18.3, 1.08], [66, 18.9, 1.072],
    [67, 19.4, 1.064], [68, 20.0, 1.056], [69, 20.6, 1.048], [70, 21.1, 1.04], [71, 21.7, 1.034],
    [72, 22.2, 1.029], [73, 22.8, 1.023], [74, 23.3, 1.017], [75, 23.9, 1.011], [76, 24.4, 1.006],
    [77, 25.0, 1.0], [78, 25.6, 0.994], [79, 26.1, 0.987], [80, 26.7, 0.98], [81, 27.2, 0.976],
    [82, 27.8, 0.972], [83, 28.3, 0.968], [84, 28.9, 0.964], [85, 29.4, 0.96], [86, 30.0, 0.956],
    [87, 30.6, 0.952], [88, 31.1, 0.948], [89, 31.7, 0.944], [90, 32.2, 0.94], [95, 35.0, 0.93],
    [100, 37.8, 0.91], [105, 40.6, 0.89], [110, 43.3, 0.88], [115, 46.1, 0.87], [120, 48.9, 0.86],
    [125, 51.7, 0.85],
  ];

  it('the table holds every printed row (IEEE 485 Table 1; from memory except the 25 °C row)', () => {
    expect(IEEE_485_TEMPERATURE_FACTORS.map((r) => [r.fahrenheit, r.celsius, r.factor])).toEqual(published);
    // Only the 25 °C / 1.00 row is marked confirmed (published vendor note quoting the standard).
    expect(IEEE_485_TEMPERATURE_FACTORS.filter((r) => r.mark === 'confirmed').map((r) => r.celsius)).toEqual([25]);
  });

  it.each(published)('%s °F (%s °C) gives %s at the printed row (IEEE 485 Table 1)', (_f, c, factor) => {
    expect(ieee485TemperatureFactor(c)).toBeCloseTo(factor, 12);
  });

  it('the °C column is the °F column converted and rounded to 0.1 °C (IEEE 485 Table 1 layout)', () => {
    for (const [f, c] of published) expect(Math.abs(((f - 32) * 5) / 9 - c)).toBeLessThanOrEqual(0.05 + 1e-9);
  });

  it('interpolates linearly between rows (method stated in sizing.ts; values computed by hand)', () => {
    // Halfway between 10.0 °C (1.19) and 12.8 °C (1.15): 1.17.
    expect(ieee485TemperatureFactor(11.4)).toBeCloseTo(1.17, 12);
    // A quarter of the way from 1.7 °C (1.35) to 4.4 °C (1.30): 1.35 − 0.25·0.05 = 1.3375.
    expect(ieee485TemperatureFactor(1.7 + 0.25 * 2.7)).toBeCloseTo(1.3375, 12);
  });

  it('refuses temperatures outside the table: −3.9 °C to 51.7 °C (IEEE 485 Table 1 range, confirmed)', () => {
    expect(ieee485TemperatureFactor(-4)).toBeNull();
    expect(ieee485TemperatureFactor(51.8)).toBeNull();
    expect(ieee485TemperatureFactor(-3.9)).toBe(1.52);
    expect(ieee485TemperatureFactor(51.7)).toBe(0.85);
  });
});

describe('capacity rating factor K_t', () => {
  it('Peukert form returns the rated hours at the rated time (t = H ⇒ K = H; rated-capacity form of Peukert\u2019s law)', () => {
    expect(peukertCapacityFactor(20, 20, 1.25)).toBeCloseTo(20, 12);
    expect(peukertCapacityFactor(5, 5, 1.1)).toBeCloseTo(5, 12);
  });

  it('inverts the Peukert worked example: 100 Ah at 20 h, k = 1.2, 10 A runs 8.706 h, so K at 8.706 h is 100/10 = 10 h', () => {
    // Worked example: t = 20·(100/(10·20))^1.2 = 20 × 0.43528 = 8.706 h (computed from the
    // rated-capacity form t = H·(C/(I·H))^k, as battery makers' application notes state it).
    const t = 20 * Math.pow(100 / (10 * 20), 1.2);
    expect(t).toBeCloseTo(8.706, 3);
    expect(peukertCapacityFactor(t, 20, 1.2)).toBeCloseTo(10, 10);
  });

  it('datasheet tables interpolate log–log and refuse times outside them (method stated in sizing.ts)', () => {
    const table = [{ time: 60, factor: 0.5 }, { time: 6000, factor: 5 }];
    // Geometric middle of the times (600 s) gives the geometric middle of the factors: √(0.5·5).
    expect(tableCapacityFactor(table, 600)).toBeCloseTo(Math.sqrt(2.5), 12);
    expect(tableCapacityFactor(table, 59)).toBeNull();
    expect(tableCapacityFactor(table, 6001)).toBeNull();
  });
});

describe('IEEE 485 worksheet, worked by hand', () => {
  it('three periods with a datasheet K_t table: 100 A 1 min, 40 A 119 min, 80 A 1 min, flooded cells at 10 °C', () => {
    // Invented scenario: a 48 V substation DC system; breaker tripping (100 A, 1 min), standing
    // load (40 A, 119 min), breaker closing at the end (80 A, 1 min). Datasheet-style K_t table
    // (invented, typical shape of a stationary flooded cell): K(1 min) = 0.60, K(119 min) = 2.37,
    // K(120 min) = 2.38, K(121 min) = 2.39 h.
    //
    // Hand working, IEEE 485 method (F_S = Σ (A_P − A_{P−1})·K_t, t from the start of P to the
    // end of section S):
    //   S1: (100 − 0)·K(1)                        = 100 × 0.60           =  60.0 Ah
    //   S2: 100·K(120) + (40 − 100)·K(119)       = 238.0 − 142.2        =  95.8 Ah
    //   S3: 100·K(121) − 60·K(120) + 40·K(1)     = 239.0 − 142.8 + 24.0 = 120.2 Ah  ← max
    //   S2 need not be evaluated (A_3 = 80 > A_2 = 40).
    //   Uncorrected 120.2 Ah × 1.19 (IEEE 485 Table 1 at 10 °C) × 1.10 (design margin) × 1.25
    //   (aging) = 196.677 Ah → next standard rating 200 Ah, one string.
    //   Cells: 48 V ÷ 2.0 V = 24; bank 200 Ah × 48 V = 9600 Wh.
    const s = sized({
      chemistry: 'flooded-lead-acid',
      busVoltage: 48,
      temperature: 10,
      limitDepthOfDischarge: false, // IEEE 485 as written: sized to the end voltage
      ratings: [100, 150, 200, 250, 300],
      dutyCycle: {
        basis: 'current',
        periods: [
          { duration: 60, current: 100 },
          { duration: 7140, current: 40 },
          { duration: 60, current: 80 },
        ],
      },
      capacityFactors: [
        { time: 60, factor: 0.6 },
        { time: 7140, factor: 2.37 },
        { time: 7200, factor: 2.38 },
        { time: 7260, factor: 2.39 },
      ],
    });
    expect(s.method).toBe('ieee-485-worksheet');
    expect(s.sections.map((x) => x.total)).toEqual([
      expect.closeTo(60.0, 10), // hand working above, S1
      expect.closeTo(95.8, 10), // S2
      expect.closeTo(120.2, 10), // S3
    ]);
    expect(s.sections.map((x) => x.needed)).toEqual([true, false, true]); // worksheet prompt "if A_{S+1} > A_S go to S+1"
    // Every row of S3, as in the hand working.
    expect(s.sections[2]!.rows.map((r) => [r.period, r.change, r.timeToEnd, r.capacityFactor])).toEqual([
      [1, 100, 7260, expect.closeTo(2.39, 12)],
      [2, -60, 7200, expect.closeTo(2.38, 12)],
      [3, 40, 60, expect.closeTo(0.6, 12)],
    ]);
    expect(s.sections[2]!.positive).toBeCloseTo(263.0, 10); // 239.0 + 24.0, hand working
    expect(s.sections[2]!.negative).toBeCloseTo(-142.8, 10); // hand working
    expect(s.governing).toEqual({ kind: 'section', section: 3 });
    expect(stepValue(s, 'Temperature correction factor')).toBe(1.19); // IEEE 485 Table 1, 50 °F (from memory)
    expect(s.requiredCapacity).toBeCloseTo(196.67725, 9); // hand working above
    expect(s.capacityPerString).toBe(200);
    expect(s.strings).toBe(1);
    expect(s.seriesCells).toBe(24);
    expect(s.bankEnergyWh).toBeCloseTo(9600, 9);
    expect(s.cautions.join(' ')).toMatch(/ventilation/);
    expect(s.cautions.join(' ')).toMatch(/local codes and licensed practice/);
    expect(s.cautions.join(' ')).toMatch(/fuse .* close to the bank/);
  });

  it('three periods with K_t from Peukert\u2019s law: AGM 12 V blocks on a 24 V bus at 25 °C', () => {
    // Invented scenario: a radio site, 30 A for 60 min, 10 A for 120 min, 25 A for 60 min.
    // AGM preset: H = 20 h, k = 1.10. K_t = H·(t/H)^(1/k), t in h (Peukert's law, rated form):
    //   K(1 h) = 20·0.05^(1/1.1)   = 20·e^(−2.995732/1.1)  = 20 × 0.0656516 = 1.313032 h
    //   K(2 h) = 20·0.10^(1/1.1)   = 20·e^(−2.302585/1.1)  = 2.465693 h
    //   K(3 h) = 20·0.15^(1/1.1)   = 20·e^(−1.897120/1.1)  = 3.564692 h
    //   K(4 h) = 20·0.20^(1/1.1)   = 20·e^(−1.609438/1.1)  = 4.630232 h
    // Sections:
    //   S1: 30·K(1)                        = 39.39097 Ah
    //   S2: 30·K(3) − 20·K(2)              = 106.94077 − 49.31387 = 57.62690 Ah
    //   S3: 30·K(4) − 20·K(3) + 15·K(1)    = 138.90695 − 71.29385 + 19.69549 = 87.30859 Ah ← max
    // × 1.00 (25 °C) × 1.10 × 1.25 = 120.0493 Ah. Rate limit: 30 A ÷ 1 C = 30 Ah (not governing).
    // Blocks: round(24 V ÷ 12 V) = 2 blocks of 6 cells = 12 cells; ratings → 125 Ah.
    const s = sized({
      chemistry: 'vrla-agm',
      busVoltage: 24,
      cellsPerBlock: 6,
      limitDepthOfDischarge: false,
      ratings: [100, 110, 125, 150],
      dutyCycle: {
        basis: 'current',
        periods: [
          { duration: 3600, current: 30 },
          { duration: 7200, current: 10 },
          { duration: 3600, current: 25 },
        ],
      },
    });
    expect(s.sections.map((x) => x.total)).toEqual([
      expect.closeTo(39.39097, 4), // hand working above
      expect.closeTo(57.6269, 4),
      expect.closeTo(87.30859, 4),
    ]);
    expect(s.sections[2]!.rows.map((r) => r.capacityFactor)).toEqual([
      expect.closeTo(4.630232, 5), // K(4 h), hand working
      expect.closeTo(3.564692, 5), // K(3 h)
      expect.closeTo(1.313032, 5), // K(1 h)
    ]);
    expect(s.requiredCapacity).toBeCloseTo(120.0493, 3); // hand working
    expect(stepValue(s, 'Size for the discharge-rate limit')).toBeCloseTo(30, 12); // 30 A ÷ 1 C
    expect(s.governing).toEqual({ kind: 'section', section: 3 });
    expect([s.seriesBlocks, s.seriesCells, s.capacityPerString, s.strings]).toEqual([2, 12, 125, 1]);
  });

  it('with Peukert K_t, a short heavy period is bounded by the discharge-rate limit (method stated in sizing.ts)', () => {
    // 200 A for 1 min, 5 A for 59 min, flooded (max 1 C, common practice preset): the worksheet
    // with Peukert K_t gives far less than 200 Ah, so 200 A ÷ 1 C = 200 Ah governs.
    const s = sized({
      chemistry: 'flooded-lead-acid',
      busVoltage: 12,
      designMargin: 1,
      agingFactor: 1,
      dutyCycle: { basis: 'current', periods: [{ duration: 60, current: 200 }, { duration: 3540, current: 5 }] },
    });
    expect(s.governing).toEqual({ kind: 'discharge-rate' });
    expect(s.requiredCapacity).toBeCloseTo(200, 12); // 200 A ÷ 1 C
    expect(s.warnings.join(' ')).toMatch(/Peukert/);
  });

  it('the depth-of-discharge limit, worked by hand: flooded, 50 A for 2 h, DoD 0.5 (Peukert-equivalent charge)', () => {
    // Factors all 1 here. Every current above I_rated = C/H, so C = (H^(k−1)·I^k·t / DoD)^(1/k),
    // H = 20 h, k = 1.25:
    //   20^0.25 = 2.114743; 50^1.25 = 132.9574; × 2 h ÷ 0.5 = 1124.683; ^0.8 → 275.946 Ah
    //   check: I_rated = 275.946 ÷ 20 = 13.8 A < 50 A. The worksheet alone: 50·K(2 h) =
    //   50 × 20 × 0.1^0.8 = 158.49 Ah (Peukert K_t), the same formula with DoD = 1.
    const s = sized({
      chemistry: 'flooded-lead-acid',
      busVoltage: 12,
      designMargin: 1,
      agingFactor: 1,
      design: 'cycling',
      dutyCycle: { basis: 'current', periods: [{ duration: 7200, current: 50 }] },
    });
    expect(s.sections[0]!.total).toBeCloseTo(158.489, 3); // hand working above
    expect(stepValue(s, 'Size for the depth-of-discharge limit')).toBeCloseTo(275.946, 3); // hand working
    expect(s.governing).toEqual({ kind: 'depth-of-discharge' });
    expect(s.warnings.join(' ')).toMatch(/depth of discharge/);
    // With DoD 1 the limit equals the worksheet for a single period (same Peukert form).
    const full = sized({
      chemistry: 'flooded-lead-acid',
      busVoltage: 12,
      designMargin: 1,
      agingFactor: 1,
      overrides: { usableDepthOfDischarge: 1 },
      design: 'cycling',
      dutyCycle: { basis: 'current', periods: [{ duration: 7200, current: 50 }] },
    });
    expect(stepValue(full, 'Size for the depth-of-discharge limit')).toBeCloseTo(full.sections[0]!.total, 9);
  });

  it('below the rated current no Peukert credit is taken: AGM, 2 A for 10 h, DoD 0.5 → 20 Ah ÷ 0.5 = 40 Ah', () => {
    // 40 Ah has I_rated = 40/20 = 2 A, so max(1, I/I_rated) = 1 and C = Ah ÷ DoD (hand working).
    // Worksheet alone: 2 × 20 × 0.5^(1/1.1) = 21.30 Ah (Peukert K_t).
    const s = sized({
      chemistry: 'vrla-agm',
      busVoltage: 12,
      designMargin: 1,
      agingFactor: 1,
      design: 'cycling',
      dutyCycle: { basis: 'current', periods: [{ duration: 36000, current: 2 }] },
    });
    expect(s.sections[0]!.total).toBeCloseTo(21.3008, 4);
    expect(s.requiredCapacity).toBeCloseTo(40, 9);
    expect(s.governing).toEqual({ kind: 'depth-of-discharge' });
  });

  it('the depth-of-discharge size solves DoD·C = Σ I·max(1, I·H/C)^(k−1)·t (defining equation, mixed rates)', () => {
    const periods = [{ duration: 3600, current: 40 }, { duration: 5 * 3600, current: 3 }, { duration: 600, current: 90 }];
    const c = depthOfDischargeCapacity(periods, 20, 1.25, 0.6);
    const q = periods.reduce((a, p) => a + p.current * Math.max(1, (p.current * 20) / c) ** 0.25 * (p.duration / 3600), 0);
    expect(0.6 * c).toBeCloseTo(q, 9);
    expect(3 * 20).toBeLessThan(c); // the 3 A period is below I_rated: no credit, no penalty
  });

  it('holds 1.00 above 25 °C unless credit is asked for (IEEE 485 Table 1 note, from memory)', () => {
    const base: SizingInput = {
      chemistry: 'flooded-lead-acid',
      busVoltage: 24,
      temperature: 35,
      dutyCycle: { basis: 'current', periods: [{ duration: 8 * 3600, current: 10 }] },
    };
    expect(stepValue(sized(base), 'Temperature correction factor')).toBe(1);
    expect(stepValue(sized({ ...base, creditAbove25C: true }), 'Temperature correction factor')).toBe(0.93); // 95 °F row
  });

  it('NiCd uses the IEEE 1115 worksheet with 1 ÷ the capacity factor at temperature (from memory / preset)', () => {
    const s = sized({
      chemistry: 'nicd',
      busVoltage: 110,
      temperature: 0,
      limitDepthOfDischarge: false,
      dutyCycle: { basis: 'current', periods: [{ duration: 5 * 3600, current: 20 }] },
    });
    expect(s.method).toBe('ieee-1115-worksheet');
    // NiCd preset capacity factor at 0 °C is 0.95 (from memory): derating 1/0.95.
    expect(stepValue(s, 'Temperature derating factor')).toBeCloseTo(1 / 0.95, 12);
    // One period of 5 h at the C5 rate: K = H = 5 h, F = 20 × 5 = 100 Ah (Peukert rated point).
    expect(s.sections[0]!.total).toBeCloseTo(100, 10);
    expect(s.requiredCapacity).toBeCloseTo((100 / 0.95) * 1.1 * 1.25, 9);
    expect(s.seriesCells).toBe(92); // round(110 ÷ 1.2) = round(91.67)
  });

  it('a constant-power duty cycle is converted at the minimum bank voltage by default (conservative)', () => {
    // 24 cells × 1.75 V = 42 V; 4200 W → 100 A (hand).
    const s = sized({
      chemistry: 'flooded-lead-acid',
      busVoltage: 48,
      dutyCycle: { basis: 'power', periods: [{ duration: 3600, power: 4200 }] },
    });
    expect(s.periods[0]!.current).toBeCloseTo(100, 12);
    const t = sized({
      chemistry: 'flooded-lead-acid',
      busVoltage: 48,
      dutyCycle: { basis: 'power', periods: [{ duration: 3600, power: 4200 }], voltage: 50 },
    });
    expect(t.periods[0]!.current).toBeCloseTo(84, 12); // 4200 W ÷ 50 V
  });

  it('a target runtime repeats a shorter duty cycle from its start (method stated in sizing.ts)', () => {
    const once = sized({
      chemistry: 'vrla-agm',
      busVoltage: 12,
      dutyCycle: { basis: 'current', periods: [{ duration: 1800, current: 8 }, { duration: 1800, current: 2 }] },
      targetRuntime: 3 * 3600,
    });
    // 8/2/8/2/8/2 A half-hours (hand).
    expect(once.periods.map((p) => [p.duration, p.current])).toEqual([
      [1800, 8], [1800, 2], [1800, 8], [1800, 2], [1800, 8], [1800, 2],
    ]);
    const cut = sized({
      chemistry: 'vrla-agm',
      busVoltage: 12,
      dutyCycle: { basis: 'current', periods: [{ duration: 3600, current: 8 }, { duration: 3600, current: 2 }] },
      targetRuntime: 5400,
    });
    expect(cut.periods.map((p) => [p.duration, p.current])).toEqual([[3600, 8], [1800, 2]]);
  });

  it('a long minute-by-minute profile keeps every section total and the governing section\u2019s rows', () => {
    const periods = Array.from({ length: 1440 }, (_, i) => ({ duration: 60, current: 5 + (i % 7) }));
    const s = sized({ chemistry: 'flooded-lead-acid', busVoltage: 24, limitDepthOfDischarge: false, dutyCycle: { basis: 'current', periods } });
    expect(s.sections).toHaveLength(1440);
    const gov = s.governing.kind === 'section' ? s.governing.section : -1;
    expect(s.sections[gov - 1]!.rows).toHaveLength(gov);
    expect(s.sections[gov - 1]!.rows.reduce((a, r) => a + r.size, 0)).toBeCloseTo(s.sections[gov - 1]!.total, 6);
    expect(s.warnings.join(' ')).toMatch(/governing section/);
  });
});

describe('lithium energy method, worked by hand', () => {
  it('LiFePO4 on a 48 V bus at 0 °C: 1200 W for 10 h then 3000 W for 30 min', () => {
    // Invented scenario: a farm office backup. Hand working (energy method, common practice):
    //   E = 1200 W × 10 h + 3000 W × 0.5 h = 12 000 + 1 500 = 13 500 Wh
    //   Wh = 13 500 ÷ (0.90 DoD × 0.88 at 0 °C) × 1.10 × 1.25 = 13 500 ÷ 0.792 × 1.375 = 23 437.5 Wh
    //   cells = 48 ÷ 3.2 = 15, nominal 48 V → Ah = 23 437.5 ÷ 48 = 488.28 Ah
    //   peak current at the minimum voltage 15 × 2.5 = 37.5 V: 3000 ÷ 37.5 = 80 A → 80 Ah at 1 C
    //   ratings 100/200/280/304 Ah: one string of 304 is short; 2 × 280 = 560 Ah (488.28/2 = 244.1)
    // Preset values: DoD 0.90 (common practice), capacity 0.88 at 0 °C (from memory), 1 C max.
    const s = sized({
      chemistry: 'lifepo4',
      busVoltage: 48,
      temperature: 0,
      ratings: [100, 200, 280, 304],
      dutyCycle: {
        basis: 'power',
        periods: [
          { duration: 36000, power: 1200 },
          { duration: 1800, power: 3000 },
        ],
      },
    });
    expect(s.method).toBe('energy');
    expect(stepValue(s, 'Energy at the bank terminals')).toBeCloseTo(13500, 9); // hand working
    expect(stepValue(s, 'Required energy')).toBeCloseTo(23437.5, 8); // hand working
    expect(s.requiredCapacity).toBeCloseTo(488.28125, 8); // hand working
    expect(s.peakCurrent).toBeCloseTo(80, 12); // hand working
    expect(s.governing).toEqual({ kind: 'energy' });
    expect([s.seriesCells, s.strings, s.capacityPerString, s.bankCapacity]).toEqual([15, 2, 280, 560]);
    expect(s.bankEnergyWh).toBeCloseTo(26880, 9); // 560 Ah × 48 V
    expect(s.usableEnergyWh).toBeCloseTo(24192, 9); // × 0.90
    expect(s.cautions.join(' ')).toMatch(/must not be charged below 0 °C/); // lithium: common practice (no source)
    expect(s.sections).toEqual([]);
  });

  it('the discharge-rate check governs a short heavy load and is reported (method stated in sizing.ts)', () => {
    // 5000 W for 6 min on 16 LiFePO4 cells (51.2 V nominal, 40 V minimum), max 0.5 C (override):
    //   energy 500 Wh ÷ 0.9 × 1.1 × 1.25 = 763.9 Wh → 14.92 Ah
    //   peak 5000 ÷ 40 = 125 A → 125 ÷ 0.5 = 250 Ah  ← governs (hand working)
    const s = sized({
      chemistry: 'lifepo4',
      busVoltage: 51.2,
      overrides: { maxDischargeCRate: 0.5 },
      dutyCycle: { basis: 'power', periods: [{ duration: 360, power: 5000 }] },
    });
    expect(s.seriesCells).toBe(16);
    expect(stepValue(s, 'Required capacity (energy)')).toBeCloseTo((500 / 0.9) * 1.375 / 51.2, 9);
    expect(s.governing).toEqual({ kind: 'discharge-rate' });
    expect(s.requiredCapacity).toBeCloseTo(250, 9); // hand working
    expect(s.warnings.join(' ')).toMatch(/peak current sets the size/);
  });

  it('a current duty cycle counts energy at the nominal bank voltage (method stated in sizing.ts)', () => {
    // NMC, 14 cells × 3.6 V = 50.4 V; 20 A for 2 h → 2016 Wh; ÷ (0.8 × 1.0) × 1.1 × 1.25 → 3465 Wh
    // → 68.75 Ah (= 40 Ah ÷ 0.8 × 1.375, hand working).
    const s = sized({
      chemistry: 'nmc',
      busVoltage: 50.4,
      dutyCycle: { basis: 'current', periods: [{ duration: 7200, current: 20 }] },
    });
    expect(s.seriesCells).toBe(14);
    expect(stepValue(s, 'Energy at the bank terminals')).toBeCloseTo(2016, 9);
    expect(s.requiredCapacity).toBeCloseTo(68.75, 9);
  });
});

describe('bad input gets a problem naming the field, and nothing is computed', () => {
  const good: SizingInput = {
    elementId: 'bank1',
    chemistry: 'flooded-lead-acid',
    busVoltage: 48,
    dutyCycle: { basis: 'current', periods: [{ duration: 3600, current: 10 }] },
  };
  const one = (input: SizingInput) => {
    const ps = problemsOf(input);
    expect(ps.length).toBeGreaterThan(0);
    for (const p of ps) expect(p.elementId).toBe('bank1');
    return ps;
  };

  it.each([
    ['zero runtime', { targetRuntime: 0 }, 'backup.targetRuntimeHours', /greater than 0/],
    ['negative runtime', { targetRuntime: -3600 }, 'backup.targetRuntimeHours', /greater than 0/],
    ['margin below 1', { designMargin: 0.9 }, 'backup.designMargin', /at least 1/],
    ['aging factor below 1', { agingFactor: 0.8 }, 'backup.agingFactor', /at least 1/],
    // −3.9 °C is the coldest row of IEEE 485 Table 1; extrapolation reaches 20 °C below it (our limit).
    ['temperature far below IEEE 485 Table 1', { temperature: -24 }, 'backup.temperatureC', /more than 20 °C below IEEE 485 Table 1/],
    ['heat above IEEE 485 Table 1 with credit asked for', { temperature: 55, creditAbove25C: true }, 'backup.temperatureC', /above IEEE 485 Table 1/],
    ['zero bus voltage', { busVoltage: 0 }, 'bank.series', /greater than 0 V/],
    ['a zero rating', { ratings: [100, 0] }, 'backup.standardCapacitiesAh[1]', /greater than 0 Ah/],
    ['a fractional block count', { cellsPerBlock: 2.5 }, 'bank.cellsPerBlock', /whole number/],
  ] as [string, Partial<SizingInput>, string, RegExp][])('%s', (_name, change, field, message) => {
    const ps = one({ ...good, ...change });
    const p = ps.find((x) => x.field === field);
    expect(p, JSON.stringify(ps)).toBeDefined();
    expect(p!.message).toMatch(message);
  });

  it('negative durations and currents name the period', () => {
    const ps = one({
      ...good,
      dutyCycle: { basis: 'current', periods: [{ duration: -60, current: 10 }, { duration: 60, current: -5 }] },
    });
    expect(ps.map((p) => p.field)).toEqual(['backup.profile.periods[0].duration', 'backup.profile.periods[1].current']);
  });

  it('a duty cycle that draws nothing is refused', () => {
    const ps = one({ ...good, dutyCycle: { basis: 'current', periods: [{ duration: 60, current: 0 }] } });
    expect(ps[0]!.message).toMatch(/draws no current/);
  });

  it('unknown chemistry', () => {
    const ps = one({ ...good, chemistry: 'zinc-air' });
    expect(ps[0]!.code).toBe('unknown-chemistry');
    expect(ps[0]!.field).toBe('bank.chemistry');
    expect(ps[0]!.message).toMatch(/lifepo4/);
  });

  it('a lithium temperature outside the chemistry\u2019s table', () => {
    // The LiFePO4 preset table starts at −20 °C; 20 °C of extrapolation reach −40 °C (our limit).
    const ps = one({ ...good, chemistry: 'lifepo4', temperature: -45 });
    expect(ps[0]!.code).toBe('outside-table');
  });

  it('a K_t table that does not reach the duty cycle\u2019s times', () => {
    const ps = one({ ...good, capacityFactors: [{ time: 60, factor: 0.6 }, { time: 1800, factor: 1.4 }] });
    expect(ps[0]!.code).toBe('outside-table');
    expect(ps[0]!.field).toBe('backup.capacityFactors');
    expect(ps[0]!.message).toMatch(/3600 s/);
  });

  it('ratings too small for the strings allowed', () => {
    const ps = one({ ...good, ratings: [10], maxStrings: 2 });
    expect(ps[0]!.code).toBe('no-feasible-bank');
  });

  it('a datasheet override that makes no sense (cut-off above nominal)', () => {
    const ps = one({ ...good, overrides: { endOfDischargeCellVoltage: 2.1 } });
    expect(ps[0]!.field).toBe('bank.overrides.endOfDischargeCellVoltage');
  });

  it('field paths follow the caller\u2019s map', () => {
    const ps = one({ ...good, designMargin: 0.5, fields: { designMargin: 'backup.sizing.margin' } });
    expect(ps[0]!.field).toBe('backup.sizing.margin');
  });

  it('no result ever holds Infinity or NaN (checked over the cases above that solve)', () => {
    const s = sized({ ...good, ratings: [50, 100, 200] });
    expect(JSON.stringify(s)).not.toMatch(/null|Infinity|NaN/);
  });
});

describe('worksheet sections of a sampled profile', () => {
  it('equal steps give the same section totals as the row-by-row worksheet (bitwise, same additions)', () => {
    const periods = Array.from({ length: 50 }, (_, i) => ({ duration: 60, current: 3 + ((i * 7) % 11) }));
    const k = (t: number) => peukertCapacityFactor(t / 3600, 20, 1.25);
    const fast = worksheetSections(periods, k, false);
    const full = worksheetSections(periods, k, true);
    expect(fast.map((s) => s.total)).toEqual(full.map((s) => s.total));
    expect(fast.map((s) => s.needed)).toEqual(full.map((s) => s.needed));
    // Each full section's rows add up to its total (worksheet line 8 summed; method identity).
    for (const s of full) expect(s.rows.reduce((a, r) => a + r.size, 0)).toBeCloseTo(s.total, 9);
  });
});

describe('long sampled profiles', () => {
  it('joining near-equal neighbours at the higher current overstates the worksheet by at most 0.5 % (method stated in sizing.ts)', () => {
    // A lead-acid bank sagging under a constant-power load: the current creeps up each minute, with
    // a compressor switching 12 min in 30 on top (invented profile).
    const periods = Array.from({ length: 600 }, (_, i) => ({ duration: 60, current: 20 * (1 + 0.0002 * i) + ((i % 30) < 12 ? 6 : 0) }));
    const s = sized({ chemistry: 'flooded-lead-acid', busVoltage: 24, limitDepthOfDischarge: false, designMargin: 1, agingFactor: 1, dutyCycle: { basis: 'current', periods } });
    expect(s.periods.length).toBeLessThan(periods.length);
    const k = (t: number) => peukertCapacityFactor(t / 3600, 20, 1.25);
    const exact = Math.max(...worksheetSections(periods, k, false).map((x) => x.total));
    const joined = Math.max(...s.sections.map((x) => x.total));
    expect(joined).toBeGreaterThanOrEqual(exact * (1 - 1e-12));
    expect(joined).toBeLessThanOrEqual(exact * 1.005);
  });
});

describe('a bank sized here passes the runtime study (core/studies/backup/discharge.ts)', () => {
  // The hillside demo (invented scenario) with the bank replaced by the sized one: the simulated
  // runtime through the same daily profile must reach the target, also at end of life (capacity
  // down to 1/aging factor). Sizing inputs come from the study itself (terminal power of the
  // profile, continued to the target when the 150 Ah bank runs out first).
  const variants: [string, { chemistry: 'lifepo4' | 'flooded-lead-acid' | 'vrla-agm'; series: number; cellsPerBlock?: number }][] = [
    ['LiFePO4, 16 cells', { chemistry: 'lifepo4', series: 16 }],
    ['flooded lead-acid, 24 cells', { chemistry: 'flooded-lead-acid', series: 24 }],
    ['AGM, 4 × 12 V blocks', { chemistry: 'vrla-agm', series: 4, cellsPerBlock: 6 }],
  ];
  it.each(variants.flatMap(([name, bank]) => (['backup', 'cycling'] as const).map((design) => [name, bank, design] as const)))('%s, 30 h target at 10 °C, %s design', (_name, bank, design) => {
    const project = structuredClone(demoProjects.find((d) => d.id === 'hillside-relay-hut')!.project) as Project;
    const battery = project.elements.find((e) => e.kind === 'battery')! as BatterySource;
    battery.bank = { ...bank, strings: 1, capacityAh: 150 };
    // No recharge target: a backup design discharges lead-acid to its end voltage, deeper than the demo's charger is meant for.
    project.backup = { ...project.backup!, design, targetRuntimeHours: 30, horizonHours: 40 };
    delete project.backup.targetRechargeHours;
    const study = onSolved(runBackupStudy, project);
    if (!study.ok) throw new Error(JSON.stringify(study.problems));
    const s = study.study.sizing!;
    battery.bank = { ...bank, strings: s.strings, capacityAh: s.capacityPerString };
    const run = onSolved(simulateDischarge, project);
    if (!run.ok) throw new Error(JSON.stringify(run.problems));
    // The target (30 h) is reached: the run ends later, or not at all within the 40 h horizon.
    expect(run.result.runtimeSeconds).toBeGreaterThanOrEqual(30 * 3600);
    // At end of life: state of health 1/1.25, the default aging factor (IEEE 485 common practice).
    project.backup = { ...project.backup!, stateOfHealth: 1 / 1.25 };
    const old = onSolved(simulateDischarge, project);
    if (!old.ok) throw new Error(JSON.stringify(old.problems));
    expect(old.result.runtimeSeconds).toBeGreaterThanOrEqual(30 * 3600);
  });
});
