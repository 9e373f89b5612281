/**
 * Boundary tests of issue 14 points 9–11 in the battery area: where a discharge ends (backup or
 * cycling design) and that the runtime and the sizing say the same; design margin, aging factor
 * and whole modules with the runtime of that bank; temperatures beyond the capacity tables.
 */
import { describe, expect, it } from 'vitest';
import { sizeBank, type BankSizing, type SizingInput } from '../../core/studies/backup/sizing.ts';
import { simulateDischarge, type DischargeResult } from '../../core/studies/backup/discharge.ts';
import { runBackupStudy } from '../../core/studies/backup/study.ts';
import { formatBackupStudy } from '../../core/studies/backup/text-report.ts';
import { demoProjects, type BackupStudy, type BatteryBankSpec, type Project } from '../../core/index.ts';
import type { Chemistry } from '../../core/data/battery-chemistries.ts';
import { directLoad } from './helpers.ts';
import { onSolved } from '../core/solved.ts';

function sized(input: SizingInput): BankSizing {
  const r = sizeBank(input);
  if (!r.ok) throw new Error(r.problems.map((p) => `${p.field}: ${p.message}`).join('\n'));
  return r.sizing;
}
function run(project: Project): DischargeResult {
  const r = onSolved(simulateDischarge, project);
  if (!r.ok) throw new Error(JSON.stringify(r.problems));
  return r.result;
}
const step = (s: BankSizing, label: string) => {
  const st = s.steps.find((x) => x.label === label);
  if (st === undefined) throw new Error(`no step "${label}"`);
  return st;
};
const hillside = (): Project => structuredClone(demoProjects.find((d) => d.id === 'hillside-relay-hut')!.project) as Project;

describe('point 9: lead-acid backup discharges to its end voltage, not to the depth-of-discharge limit', () => {
  // 12 V flooded bank (6 cells, 100 Ah C20) carrying 60 W: about 5 A, the C20 rate.
  const bank: BatteryBankSpec = { chemistry: 'flooded-lead-acid', series: 6, capacityAh: 100 };

  it('backup design (the default) runs past the 50 % depth-of-discharge preset to the end voltage; a cycling design stops there (preset DoD 0.5 and 1.75 V/cell: typical values)', () => {
    const backup = run(directLoad(bank, 60));
    expect(backup.design).toBe('backup');
    expect(backup.socLimit).toBe(0);
    expect(['rated-capacity', 'cut-off-voltage']).toContain(backup.endReason);
    expect(backup.endSoc).toBeLessThan(0.5);
    const cycling = run(directLoad(bank, 60, { design: 'cycling' }));
    expect(cycling.endReason).toBe('depth-of-discharge');
    expect(cycling.endSoc).toBeCloseTo(0.5, 12); // 1 − 0.5 DoD (preset, common practice)
    expect(backup.runtimeSeconds).toBeGreaterThan(1.5 * cycling.runtimeSeconds);
  });

  it('a lead-acid bank that starts at 40 % runs in a backup design and is refused in a cycling design (below its 50 % DoD limit, preset typical value)', () => {
    const part = { ...bank, initialSoc: 0.4 };
    expect(run(directLoad(part, 60)).endSoc).toBeLessThan(0.4);
    const refused = onSolved(simulateDischarge, directLoad(part, 60, { design: 'cycling' }));
    expect(refused.ok).toBe(false);
    if (!refused.ok) expect(refused.problems[0]!.field).toBe('bank.initialSoc');
  });

  it('lithium keeps its usable depth of discharge (BMS window) in both designs (preset 0.9, common practice)', () => {
    const li: BatteryBankSpec = { chemistry: 'lifepo4', series: 4, capacityAh: 100 };
    for (const design of ['backup', 'cycling'] as const) {
      const r = run(directLoad(li, 100, { design }));
      expect(r.endReason).toBe('depth-of-discharge');
      expect(r.endSoc).toBeCloseTo(0.1, 12);
    }
  });

  it('the runtime says the end voltage and where it came from: the preset is "typical value: use the maker\u2019s figure", a datasheet figure "as given"', () => {
    const typical = run(directLoad(bank, 60));
    expect(typical.basis).toMatch(/Backup design: .*1\.75 V\/cell under load \(typical value: use the maker\u2019s figure\).*no depth-of-discharge limit/);
    const derate = typical.derates.find((d) => d.label === 'end-of-discharge voltage per cell')!;
    expect(derate.value).toBe(1.75);
    expect(typical.derates.some((d) => d.label === 'usable depth of discharge')).toBe(false);
    const given = run(directLoad({ ...bank, overrides: { endOfDischargeCellVoltage: 1.8 } }, 60));
    expect(given.basis).toMatch(/1\.8 V\/cell under load \(maker\u2019s figure, as given\)/);
    expect(given.cutoffVoltage).toBeCloseTo(10.8, 12); // 6 × 1.8 V
  });

  const chemistries: Chemistry[] = ['flooded-lead-acid', 'vrla-agm', 'gel', 'nicd', 'lifepo4', 'nmc'];
  it.each(chemistries.flatMap((c) => (['backup', 'cycling'] as const).map((d) => [c, d] as const)))(
    'runtime and sizing never contradict each other: %s, %s design (same basis sentence; a depth-of-discharge governed size only in a design that has the limit)',
    (chemistry, design) => {
      const project = hillside();
      const battery = project.elements.find((e) => e.kind === 'battery')!;
      const series = chemistry === 'lifepo4' ? 16 : chemistry === 'nmc' ? 13 : chemistry === 'nicd' ? 40 : 24;
      (battery as { bank: BatteryBankSpec }).bank = { chemistry, series, capacityAh: 100 };
      const backup: BackupStudy = { ...project.backup!, design, targetRuntimeHours: 6, horizonHours: 48 };
      delete backup.targetRechargeHours;
      delete backup.chargerCurrent;
      project.backup = backup;
      const r = onSolved(runBackupStudy, project);
      if (!r.ok) throw new Error(JSON.stringify(r.problems));
      const { discharge, sizing } = r.study;
      expect(sizing!.basis).toBe(discharge.basis);
      const text = [...sizing!.warnings, ...sizing!.cautions, ...discharge.warnings, ...discharge.cautions].join('\n');
      const dodApplies = chemistry === 'lifepo4' || chemistry === 'nmc' || design === 'cycling';
      if (!dodApplies) {
        expect(sizing!.governing.kind).not.toBe('depth-of-discharge');
        expect(text).not.toMatch(/depth of discharge[^\n]*sets the size/);
        expect(discharge.endReason).not.toBe('depth-of-discharge');
      } else {
        expect(text).not.toMatch(/no depth-of-discharge limit/);
      }
      // The CLI says it once.
      const cli = formatBackupStudy(r.study);
      expect(cli.split(discharge.basis).length - 1).toBeGreaterThanOrEqual(1);
      expect(cli).not.toMatch(/from memory|common practice/);
    },
  );
});

describe('point 10: design margin and aging factor as inputs; banks in whole modules with that bank\u2019s runtime', () => {
  // LiFePO4, 16 cells (51.2 V), energy method: Ah = E ÷ (DoD 0.9 × capacity factor 1 at 25 °C)
  // × design margin × aging ÷ 51.2 V (method in sizing.ts; preset values: typical).
  const li = (energyWh: number, extra: Partial<SizingInput> = {}) =>
    sized({
      chemistry: 'lifepo4',
      busVoltage: 48,
      seriesBlocks: 16,
      dutyCycle: { basis: 'power', periods: [{ duration: 10 * 3600, power: energyWh / 10 }] },
      designMargin: 1,
      agingFactor: 1,
      temperature: 25,
      moduleAh: 200,
      ...extra,
    });

  it('exactly two modules needed → 2 strings; a little more → 3 (rounded up to whole modules)', () => {
    const exact = li(400 * 0.9 * 51.2); // 400 Ah by hand
    expect(exact.requiredCapacity).toBeCloseTo(400, 9);
    expect(exact.strings).toBe(2);
    expect(exact.bankCapacity).toBe(400);
    const over = li(400 * 0.9 * 51.2 * 1.0001);
    expect(over.strings).toBe(3);
  });

  it('the summary reads "3 strings × 200 Ah = 600 Ah, 30.7 kWh" (600 Ah × 51.2 V = 30 720 Wh, by hand)', () => {
    const s = li(560 * 0.9 * 51.2); // 560 Ah → 3 strings of 200 Ah
    expect(s.summary).toMatch(/^3 strings × 200 Ah = 600 Ah, 30\.7 kWh/);
    expect(s.bankEnergyWh).toBeCloseTo(30720, 9);
  });

  it('design margin and aging factor are inputs shown in the working; the defaults cite the IEEE 485 worksheet lines', () => {
    const given = li(18432, { designMargin: 1.15, agingFactor: 1.3 });
    expect(step(given, 'Design margin').value).toBe(1.15);
    expect(step(given, 'Aging factor').value).toBe(1.3);
    expect(given.requiredCapacity).toBeCloseTo(400 * 1.15 * 1.3, 9); // 400 Ah × 1.15 × 1.3 by hand
    const lead = sized({ chemistry: 'vrla-agm', busVoltage: 12, dutyCycle: { basis: 'current', periods: [{ duration: 8 * 3600, current: 10 }] } });
    expect(step(lead, 'Design margin').value).toBe(1.1); // IEEE 485 usual 1.10–1.15
    expect(step(lead, 'Design margin').note).toMatch(/IEEE 485 worksheet line 13/);
    expect(step(lead, 'Aging factor').value).toBe(1.25); // IEEE 485: 1 ÷ 0.80
    expect(step(lead, 'Aging factor').note).toMatch(/IEEE 485 worksheet line 14/);
  });

  it('the study sizes in the project\u2019s own module and re-runs the discharge with that bank (hillside demo, invented)', () => {
    const r = onSolved(runBackupStudy, hillside());
    if (!r.ok) throw new Error(JSON.stringify(r.problems));
    const s = r.study.sizing!;
    const again = r.study.sizedDischarge!;
    const given = hillside().elements.find((e) => e.kind === 'battery')! as { bank: BatteryBankSpec };
    expect(s.capacityPerString).toBe(given.bank.capacityAh); // the user's module
    expect(Number.isInteger(s.strings)).toBe(true);
    expect(again.bank.strings).toBe(s.strings);
    expect(again.bank.capacityAh).toBe(s.bankCapacity);
    expect(again.runtimeSeconds).toBeGreaterThanOrEqual(24 * 3600); // the demo's 24 h target
    expect(formatBackupStudy(r.study)).toMatch(/Runtime of this bank through the chain: /);
  });
});

describe('point 11: temperatures beyond the capacity tables', () => {
  const good: SizingInput = { chemistry: 'flooded-lead-acid', busVoltage: 12, dutyCycle: { basis: 'current', periods: [{ duration: 8 * 3600, current: 10 }] } };

  it('lead-acid below IEEE 485 Table 1: −10 °C → 1 ÷ (1/1.52 − 6.1 × (1/1.43 − 1/1.52) ÷ 2.8) = 1.7615, the capacity linear from the −3.9 °C 1.52 and −1.1 °C 1.43 rows (from memory; method in sizing.ts), the same as the runtime study', () => {
    const s = sized({ ...good, temperature: -10 });
    const capacity = 1 / 1.52 - (6.1 * (1 / 1.43 - 1 / 1.52)) / 2.8;
    expect(step(s, 'Temperature correction factor').value).toBeCloseTo(1 / capacity, 12);
    expect(1 / capacity).toBeCloseTo(1.7615, 4); // hand working in the title
    // The runtime study counts the same capacity at −10 °C (chemistry table: the same two rows).
    const d = run(directLoad({ chemistry: 'flooded-lead-acid', series: 6, capacityAh: 100 }, 60, { temperatureC: -10 }));
    expect(d.temperatureFactor).toBeCloseTo(capacity, 12);
    expect(s.warnings.join(' ')).toMatch(/below IEEE 485 Table 1/);
    // Boundary: the coldest row itself is the table's value, not extrapolated.
    expect(step(sized({ ...good, temperature: -3.9 }), 'Temperature correction factor').value).toBeCloseTo(1.52, 12);
    expect(sizeBank({ ...good, temperature: -23.9 }).ok).toBe(true); // 20 °C below −3.9 °C
    expect(sizeBank({ ...good, temperature: -24 }).ok).toBe(false);
  });

  it('above the table no credit is taken (1.00) and with credit asked the heat is refused (IEEE 485 Table 1 note, from memory)', () => {
    expect(step(sized({ ...good, temperature: 55 }), 'Temperature correction factor').value).toBe(1);
    expect(sizeBank({ ...good, temperature: 55, creditAbove25C: true }).ok).toBe(false);
  });

  it('the runtime study extrapolates the cold (LiFePO4 −30 °C → 0.50, preset rows −20 °C 0.65 and −10 °C 0.80, from memory) and refuses far beyond, naming the temperature field', () => {
    const li: BatteryBankSpec = { chemistry: 'lifepo4', series: 4, capacityAh: 100 };
    const cold = run(directLoad(li, 100, { temperatureC: -30 }));
    expect(cold.temperatureFactor).toBeCloseTo(0.5, 12);
    expect(cold.warnings.join(' ')).toMatch(/extrapolated linearly/);
    const colder = run(directLoad(li, 100, { temperatureC: -35 }));
    expect(colder.runtimeSeconds).toBeLessThan(cold.runtimeSeconds); // never the end value held
    const refused = onSolved(simulateDischarge, directLoad(li, 100, { temperatureC: -45 }));
    expect(refused.ok).toBe(false);
    if (!refused.ok) {
      expect(refused.problems[0]!.field).toBe('backup.temperatureC');
      expect(refused.problems[0]!.message).toMatch(/more than 20 °C below/);
    }
    const lead = onSolved(simulateDischarge, directLoad({ chemistry: 'vrla-agm', series: 6, capacityAh: 100 }, 60, { temperatureC: -60 }));
    expect(lead.ok).toBe(false);
  });
});
