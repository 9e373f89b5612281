/**
 * The defaults of the battery study's inputs the page offers (design margin, aging factor, charger
 * efficiency, the end-of-discharge voltage per chemistry), their sources, and that each input given
 * in the file changes what the study gives (the choice, not only the arithmetic).
 *
 * Sources:
 * - IEEE Std 485-2010, 6.2.2 "Design margin": 10 % to 15 % is usual, for load growth and less than
 *   optimum operating conditions (clause number and wording from memory; the 1.10–1.15 range is
 *   corroborated by the published IEEE 1115 sizing principles and a UPS battery specification sheet
 *   using DF = 1.1).
 * - IEEE Std 485-2010, 6.2.3 "Aging factor": a battery is replaced when its capacity falls to 80 % of
 *   rated (IEEE Std 450), so the rated capacity should be 125 % of the load's need: 1.25 (clause
 *   number from memory; the 1.25 for 80 % is corroborated by UFC 3-520-01 Appendix E, "Aging: 1.25
 *   (corresponding to 80 percent capacity)").
 * - End-of-discharge voltage: 1.75 V per lead-acid cell, the usual IEEE 485 sizing end voltage (from
 *   memory); 1.0 V per NiCd cell (IEEE 1115 practice, from memory); LiFePO4 2.5 V, the cell makers'
 *   usual figure (common practice (no source)).
 * - Charger efficiency 0.90: switch-mode chargers 0.85–0.95 (common practice (no source)).
 */
import { describe, expect, it } from 'vitest';
import { CHEMISTRY_PRESETS } from '../../core/data/battery-chemistries.ts';
import { IEEE_485_DEFAULT_AGING_FACTOR, IEEE_485_DEFAULT_DESIGN_MARGIN } from '../../core/data/ieee-485.ts';
import { DEFAULT_AGING_FACTOR, DEFAULT_DESIGN_MARGIN } from '../../core/studies/backup/sizing-types.ts';
import { DEFAULT_CHARGER_EFFICIENCY } from '../../core/studies/backup/recharge-types.ts';
import { runBackupStudy } from '../../core/studies/backup/study.ts';
import { demoProjects } from '../../core/demos/index.ts';
import { onSolved } from './solved.ts';

type Json = Record<string, unknown>;
const hillside = () => structuredClone(demoProjects.find((d) => d.id === 'hillside-relay-hut')!.project) as unknown as Json;
const withBackup = (p: Json, change: Json): Json => ({ ...p, backup: { ...(p['backup'] as Json), ...change } });

function study(p: Json) {
  const o = onSolved(runBackupStudy, p);
  if (!o.ok) throw new Error(JSON.stringify(o.problems));
  return o.study;
}

describe('the defaults of the study inputs, with their sources', () => {
  it('design margin 1.10, inside the IEEE 485 6.2.2 range 1.10–1.15', () => {
    expect(DEFAULT_DESIGN_MARGIN).toBe(1.1);
    expect(IEEE_485_DEFAULT_DESIGN_MARGIN).toBe(1.1);
    expect(DEFAULT_DESIGN_MARGIN).toBeGreaterThanOrEqual(1.1);
    expect(DEFAULT_DESIGN_MARGIN).toBeLessThanOrEqual(1.15);
  });

  it('aging factor 1.25 = 1 ÷ 0.80 (IEEE 485 6.2.3: replaced at 80 % of rated) for every chemistry', () => {
    expect(IEEE_485_DEFAULT_AGING_FACTOR).toBeCloseTo(1 / 0.8, 12);
    for (const c of ['flooded-lead-acid', 'vrla-agm', 'gel', 'nicd', 'lifepo4', 'nmc'] as const) expect(DEFAULT_AGING_FACTOR[c], c).toBe(1.25);
  });

  it('end of discharge per cell: lead-acid 1.75 V (IEEE 485 sizing), NiCd 1.0 V (IEEE 1115), LiFePO4 2.5 V (makers)', () => {
    for (const c of ['flooded-lead-acid', 'vrla-agm', 'gel'] as const) expect(CHEMISTRY_PRESETS[c].endOfDischargeCellVoltage, c).toBe(1.75);
    expect(CHEMISTRY_PRESETS.nicd.endOfDischargeCellVoltage).toBe(1.0);
    expect(CHEMISTRY_PRESETS.lifepo4.endOfDischargeCellVoltage).toBe(2.5);
  });

  it('charger efficiency 0.90 (switch-mode chargers 0.85–0.95)', () => {
    expect(DEFAULT_CHARGER_EFFICIENCY).toBe(0.9);
  });
});

describe('each input given in the file changes what the study gives', () => {
  const base = hillside();
  const first = study(base);

  it('design margin: the sizing says the default and its source when none is given, and the capacity grows by 1.15 / 1.10 at 1.15', () => {
    const { designMargin: _m, ...rest } = base['backup'] as Json;
    const unset = study({ ...base, backup: rest });
    const step = unset.sizing!.steps.find((s) => s.label === 'Design margin')!;
    expect(step.value).toBe(1.1);
    expect(step.note).toMatch(/default 1\.10/);
    const more = study(withBackup(base, { designMargin: 1.15 }));
    // The capacity before rounding is proportional to the margin (IEEE 485 lines 12–15: size × margin × aging).
    expect(more.sizing!.requiredCapacity / unset.sizing!.requiredCapacity).toBeCloseTo(1.15 / 1.1, 9);
  });

  it('aging factor: 1.0 instead of the default 1.25 makes the required capacity 1.25 times smaller', () => {
    const fresh = study(withBackup(base, { agingFactor: 1 }));
    expect(first.sizing!.requiredCapacity / fresh.sizing!.requiredCapacity).toBeCloseTo(1.25, 9);
  });

  it('charger efficiency: the AC energy of the recharge is the DC energy ÷ η (0.9 → 0.8 draws 9/8 as much)', () => {
    const lower = study(withBackup(base, { chargerEfficiency: 0.8 }));
    expect(lower.recharge!.acInputEnergyWh / first.recharge!.acInputEnergyWh).toBeCloseTo(0.9 / 0.8, 9);
  });

  it('target runtime: 48 h asks for a bigger bank than 24 h', () => {
    const longer = study(withBackup(base, { targetRuntimeHours: 48 }));
    expect(longer.sizing!.bankCapacity).toBeGreaterThan(first.sizing!.bankCapacity);
  });

  it('cell temperature: a colder bank gives a shorter runtime (capacity falls with temperature)', () => {
    // 0 °C against the demo's 10 °C (LiFePO4 must not be charged below 0 °C: the study refuses colder with a charger).
    const cold = study(withBackup(base, { temperatureC: 0 }));
    expect(cold.discharge.runtimeSeconds).toBeLessThan(first.discharge.runtimeSeconds);
  });

  it('end-of-discharge voltage: a lead-acid bank given 1.85 V per cell instead of the preset 1.75 V is cut off and sized at it', () => {
    // The demo's bank as 4 × 12 V VRLA blocks (24 cells, 48 V nominal), a backup design: it discharges to the end voltage.
    const leadAcid = (overrides?: Json): Json => {
      const p = hillside();
      const bank = (p['elements'] as Json[]).find((e) => e['kind'] === 'battery')!;
      bank['bank'] = { chemistry: 'vrla-agm', series: 4, cellsPerBlock: 6, strings: 2, capacityAh: 200, ...(overrides ? { overrides } : {}) };
      return p;
    };
    const preset = study(leadAcid());
    // 24 cells × 1.75 V = 42 V (the preset's end voltage).
    expect(preset.discharge.cutoffVoltage).toBeCloseTo(42, 9);
    const high = study(leadAcid({ endOfDischargeCellVoltage: 1.85 }));
    // 24 cells × 1.85 V = 44.4 V.
    expect(high.discharge.cutoffVoltage).toBeCloseTo(44.4, 9);
    // The worksheet's minimum bank voltage (IEEE 485 header: minimum cell voltage × cells) follows it.
    expect(preset.sizing!.minimumVoltage).toBeCloseTo(42, 9);
    expect(high.sizing!.minimumVoltage).toBeCloseTo(44.4, 9);
    // Raising the cut-off never makes the bank smaller: the preset's capacity holds to 1.75 V/cell only
    // (a lead-acid cell gives less to a higher end voltage; IEEE 485 reads Kt for the chosen end voltage,
    // from memory), so the power → current step keeps 24 × 1.75 V = 42 V and the required capacity
    // is the preset's. Before this rule it fell (279 → 264 Ah): a smaller bank for a harder duty.
    const toCurrent = (r: typeof preset) => r.sizing!.steps.find((x) => x.label === 'Voltage for power → current')!;
    expect(toCurrent(high).value).toBeCloseTo(42, 9);
    expect(toCurrent(high).note).toMatch(/1\.75 V\/cell, the end voltage the capacities are rated to/);
    expect(high.sizing!.requiredCapacity).toBeGreaterThanOrEqual(preset.sizing!.requiredCapacity * (1 - 1e-12));
    // And both results say the figures do not count the loss of capacity to the higher end voltage.
    const caution = /cut-off 1\.85 V\/cell is above the 1\.75 V\/cell/;
    expect(high.sizing!.cautions.some((c) => caution.test(c))).toBe(true);
    expect(high.discharge.cautions.some((c) => caution.test(c))).toBe(true);
    expect(preset.discharge.cautions.some((c) => caution.test(c))).toBe(false);
    // Not asserted: the runtime. The lead-acid model ends at the rated capacity at the rate, which the
    // preset takes as delivered down to the end voltage; the caution asks for the maker's table.
  });

  it('standard capacities: the sizing picks the smallest listed capacity that meets the need', () => {
    const listed = study(withBackup(base, { standardCapacitiesAh: [50, 100, 150, 200, 300, 400] }));
    expect([50, 100, 150, 200, 300, 400]).toContain(listed.sizing!.capacityPerString);
    expect(listed.sizing!.bankCapacity).toBeGreaterThanOrEqual(listed.sizing!.requiredCapacity);
  });
});
