/**
 * What the runtime spread leaves out of each sample's backup study (runBackupStudy's parts): the
 * sizing's list of periods (`sizingPeriods: false`). The figures must be the study's own: checked
 * against the default run of the same study on the same solved project.
 */
import { describe, expect, it } from 'vitest';
import { solvedOf } from '../solved.ts';
import { runBackupStudy } from '../../../core/studies/backup/study.ts';
import { runSpread } from '../../../core/studies/spread/run.ts';
import { drawSamples } from '../../../core/studies/spread/sample.ts';
import hillside from '../../../core/demos/hillside-relay-hut.json' with { type: 'json' };

const spreadParts = { sizedRun: false, recharge: false, plotSeries: false, sizingPeriods: false } as const;

describe('the backup study without the sizing periods', () => {
  it('lithium (energy method): the same bank, energy and peak; no periods listed', () => {
    const solved = solvedOf(hillside);
    const full = runBackupStudy(solved);
    const lean = runBackupStudy(solved, spreadParts);
    if (!full.ok || !lean.ok) throw new Error('the hillside study must run');
    const a = full.study.sizing!;
    const b = lean.study.sizing!;
    // Check values: the default run of the same study (the full output the CLI and the page show).
    expect(b.bankCapacity).toBe(a.bankCapacity);
    expect(b.requiredCapacity).toBe(a.requiredCapacity);
    expect(b.peakCurrent).toBe(a.peakCurrent);
    expect(b.steps).toEqual(a.steps);
    expect(lean.study.discharge.runtimeSeconds).toBe(full.study.discharge.runtimeSeconds);
    // The hillside run gives some thousand periods (1-minute steps over the 24 h target, by hand: ≤ 1440 + load changes).
    expect(a.periods.length).toBeGreaterThan(1000);
    expect(b.periods).toEqual([]);
  });

  it('lead-acid (the worksheet sizes from its periods): the periods are kept', () => {
    const agm = {
      ...hillside,
      elements: hillside.elements.map((e) => (e.kind === 'battery' ? { ...e, bank: { ...e.bank, chemistry: 'vrla-agm', series: 24 } } : e)),
    };
    const solved = solvedOf(agm);
    const full = runBackupStudy(solved);
    const lean = runBackupStudy(solved, spreadParts);
    if (!full.ok || !lean.ok) throw new Error('the AGM variant must run');
    // Check values: the default run of the same study.
    expect(lean.study.sizing!.bankCapacity).toBe(full.study.sizing!.bankCapacity);
    expect(lean.study.sizing!.method).toBe(full.study.sizing!.method);
    expect(lean.study.sizing!.periods).toEqual(full.study.sizing!.periods);
    expect(lean.study.sizing!.periods.length).toBeGreaterThan(0);
  });
});

describe('a drawn value out of its range', () => {
  it('is refused in that sample with the settings check\'s own message; the others run', () => {
    // The cell temperature at 55 °C ± 30 °C: a draw above 80 °C passes the backup settings' range
    // (core/solve/backup-schema.ts: "must be 80 °C or less").
    const project = { ...hillside, backup: { ...hillside.backup, temperatureC: 55 } };
    const only = { capacityPercent: 0, agingPercent: 0, efficiencyPoints: 0, loadPercent: 0, endVoltagePerCell: 0 };
    const r = runSpread(solvedOf(project), { settings: { samples: 40, seed: 3, temperatureC: 30, ...only } });
    if (!r.ok) throw new Error('the spread must run');
    // Check value: the draws of seed 3 themselves (55 + 30·z > 80 ⇔ z > 5/6), counted here.
    const over = drawSamples(3, 0, 40).flatMap((d, i) => (55 + 30 * d.temperature > 80 ? [i] : []));
    expect(over.length).toBeGreaterThan(0);
    expect(r.value.failed).toBe(over.length);
    expect(r.value.failures.map((f) => f.index)).toEqual(over.slice(0, 10));
    // The schema's message behind the field's form label (core/model/field-labels.ts "Cell temperature").
    for (const f of r.value.failures) expect(f.message).toBe('Project, Cell temperature: must be 80 °C or less');
    expect(r.value.samples).toBe(40);
  });
});
