import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { solvedOf } from '../solved.ts';
import { runBackupStudy } from '../../../core/studies/backup/study.ts';
import { lossCostPerYear } from '../../../core/studies/economics.ts';
import { runSpread, spreadPlan, spreadRun, spreadSensitivity, spreadSummary } from '../../../core/studies/spread/run.ts';
import { changeOf, drawSamples, NOMINAL_DRAW, shiftEfficiency } from '../../../core/studies/spread/sample.ts';
import { TYPICAL_TOLERANCES } from '../../../core/studies/spread/tolerances.ts';
import { CHEMISTRY_PRESETS } from '../../../core/data/battery-chemistries.ts';
import { histogram, percentiles } from '../../../core/studies/spread/stats.ts';
import { ZERO_TOLERANCES } from '../../../core/studies/spread/tolerances.ts';
import { validateProject } from '../../../core/solve/validate.ts';
import { solveVariant } from '../../../core/solve/variant.ts';
import { fieldLabel } from '../../../core/model/field-labels.ts';
import { formatSpread } from '../../../core/studies/spread/text.ts';
import { smallBankCase } from './cases.ts';
import hillside from '../../../core/demos/hillside-relay-hut.json' with { type: 'json' };

const zero = { capacityPercent: 0, agingPercent: 0, temperatureC: 0, efficiencyPoints: 0, loadPercent: 0, endVoltagePerCell: 0 };
const cost = { pricePerKWh: 0.3, hoursPerYear: 8760 };

describe('runtime spread: statistics', () => {
  it('percentiles interpolate between order statistics (Hyndman–Fan definition 7)', () => {
    // Check values by hand from h = (n − 1)·p on 1…10 (definition 7; R quantile(type = 7), NumPy's default).
    const p = percentiles([10, 9, 8, 7, 6, 5, 4, 3, 2, 1])!;
    expect(p.p10).toBeCloseTo(1.9, 12); // h = 0.9: 1 + 0.9·(2 − 1)
    expect(p.p50).toBeCloseTo(5.5, 12); // h = 4.5
    expect(p.p90).toBeCloseTo(9.1, 12); // h = 8.1
    expect(percentiles([])).toBeNull();
  });

  it('the histogram counts every finite value once, in bins by the Rice rule', () => {
    const v = Array.from({ length: 1000 }, (_, i) => i);
    const h = histogram([...v, NaN]);
    // Rice rule ⌈2·n^(1/3)⌉ = 20 bins for n = 1000 (common practice (no source)).
    expect(h).toHaveLength(20);
    expect(h.reduce((n, b) => n + b.count, 0)).toBe(1000);
    expect(histogram([3, 3, 3])).toEqual([{ from: 3, to: 3, count: 3 }]);
  });

  it('a seed gives the same draws whichever chunk runs them', () => {
    const all = drawSamples(7, 0, 30);
    expect([...drawSamples(7, 0, 11), ...drawSamples(7, 11, 19)]).toEqual(all);
    expect(drawSamples(8, 0, 30)).not.toEqual(all);
    for (const d of all) for (const z of Object.values(d)) expect(Math.abs(z)).toBeLessThanOrEqual(1);
  });

  it('an efficiency shift moves a loss polynomial by the points asked at its rated power', () => {
    // Check value by hand: P = 1000 W, L = 10 + 0.02·1000 + 1e-5·1e6 = 40 W, η = 1000/1040 = 0.96154;
    // + 1 point: η' = 0.97154, L' = 1000·(1/η' − 1) = 29.30 W (hand-worked, from η = P/(P + L)).
    const m = shiftEfficiency({ model: 'polynomial', p0: 10, k1: 0.02, k2: 1e-5, ratedPower: 1000 }, 0.01, undefined);
    if (m.model !== 'polynomial') throw new Error('model changed');
    const l = m.p0 + m.k1 * 1000 + m.k2 * 1e6;
    expect(1000 / (1000 + l)).toBeCloseTo(1000 / 1040 + 0.01, 12);
    expect(l).toBeCloseTo(29.3, 2);
  });
});

describe('runtime spread: what a draw changes', () => {
  const solved = solvedOf(hillside);
  const out = new Map(solved.result.elements.map((e) => [e.id, e.pOut]));
  const el = (c: ReturnType<typeof changeOf>, id: string) => c.replace?.find((e) => e.id === id) as Record<string, unknown> | undefined;

  it('the project’s own values change nothing', () => {
    expect(changeOf(solved.project, TYPICAL_TOLERANCES, NOMINAL_DRAW, out)).toEqual({});
  });

  it('each input moves its own fields by its tolerance', () => {
    const t = TYPICAL_TOLERANCES;
    const hi = (input: keyof typeof NOMINAL_DRAW) => changeOf(solved.project, t, { ...NOMINAL_DRAW, [input]: 1 }, out);
    // Capacity + 5 % of the demo's 200 Ah (hand-worked: 200 × 1.05 = 210).
    expect((el(hi('capacity'), 'bank')!['bank'] as { capacityAh: number }).capacityAh).toBeCloseTo(210, 9);
    // Aging at its high end: the state of health 1 − 0.20 (the whole typical tolerance).
    expect(hi('aging').backup!.stateOfHealth).toBeCloseTo(0.8, 12);
    // Temperature + 5 °C about the demo's 10 °C.
    expect(hi('temperature').backup!.temperatureC).toBe(15);
    // End voltage + 0.05 V on the LiFePO4 preset's end voltage per cell.
    const end = (el(hi('endVoltage'), 'bank')!['bank'] as { overrides: { endOfDischargeCellVoltage: number } }).overrides.endOfDischargeCellVoltage;
    expect(end).toBeCloseTo(CHEMISTRY_PRESETS.lifepo4.endOfDischargeCellVoltage + 0.05, 12);
    // Efficiency + 1 point on every point of the inverter's curve (its 0.86 at 10 % load → 0.87).
    const inv = el(hi('efficiency'), 'inverter')!['loss'] as { points: { efficiency: number }[] };
    expect(inv.points[0]!.efficiency).toBeCloseTo(0.87, 12);
    expect(el(hi('efficiency'), 'radio-psu')).toBeDefined();
    // Loads + 10 %: the elements and the profile's levels in W (lights 80 W → 88 W); the fridge's level is its element's.
    const load = hi('load');
    expect(el(load, 'radios')!['power']).toBeCloseTo(93.5, 9);
    expect(el(load, 'fridge')!['power']).toBeCloseTo(165, 9);
    const segs = (load.backup!.profile as { segments: { loads?: Record<string, unknown> }[] }).segments;
    expect(segs[0]!.loads!['lights']).toBeCloseTo(88, 9);
    // The other inputs stay as given.
    expect(load.backup!.stateOfHealth).toBeUndefined();
    expect(el(load, 'bank')).toBeUndefined();
  });
});

describe('runtime spread: the study', () => {
  it('zero tolerances give the single runtime exactly, in every sample', () => {
    const solved = solvedOf(smallBankCase());
    const single = runBackupStudy(solved);
    if (!single.ok) throw new Error('study refused');
    const r = runSpread(solved, { settings: { ...zero, samples: 20 }, cost });
    if (!r.ok) throw new Error(r.problems[0]!.message);
    const t = single.study.discharge.runtimeSeconds / 3600;
    // The same study on the same project (no source needed: identity).
    expect(r.value.runtimeH).toMatchObject({ p10: t, p50: t, p90: t, min: t, max: t, count: 20 });
    expect(r.value.bankAh!.p50).toBe(single.study.sizing!.bankCapacity);
    expect(r.value.requiredAh!.p50).toBe(single.study.sizing!.requiredCapacity);
    const c = lossCostPerYear(solved.result, cost);
    expect(c.ok && r.value.costPerYear!.p50).toBe(c.ok ? c.cost.totalCost : NaN);
    expect(r.value.sensitivity).toEqual([]);
  });

  it('each sample gives the runtime and the bank runBackupStudy gives (all parts) on the same changed project', () => {
    // Identity (no source needed): the spread's lean run (no sized run, recharge or plot series) must
    // not change a figure. The hillside demo at the typical tolerances, samples of three seeds.
    const solved = solvedOf(hillside);
    const outputW = new Map(solved.result.elements.map((e) => [e.id, e.pOut] as const));
    let shortOfTarget = 0;
    for (const seed of [1, 7, 20261203]) {
      const plan = spreadPlan(solved, { settings: { samples: 4, seed }, cost: null });
      if (!plan.ok) throw new Error(plan.problems[0]!.message);
      expect(plan.value.tolerances).toEqual(TYPICAL_TOLERANCES);
      const chunk = spreadRun(solved, plan.value, { from: 0, count: 4 });
      expect(chunk.failures).toEqual([]);
      drawSamples(seed, 0, 4).forEach((d, i) => {
        const changed = solveVariant(solved, changeOf(solved.project, plan.value.tolerances, d, outputW));
        if (!changed.ok) throw new Error(changed.problems[0]!.message);
        const full = runBackupStudy(changed);
        if (!full.ok) throw new Error(full.problems[0]!.message);
        expect(chunk.runtimeH[i]).toBe(full.study.discharge.runtimeSeconds / 3600);
        expect(chunk.lowerBound[i]).toBe(full.study.discharge.runtimeIsLowerBound);
        expect(chunk.bankAh[i]).toBe(full.study.sizing!.bankCapacity);
        expect(chunk.requiredAh[i]).toBe(full.study.sizing!.requiredCapacity);
        if (full.study.discharge.runtimeSeconds < 24 * 3600) shortOfTarget++;
      });
    }
    // Some samples run out before the 24 h target: their sizing reads the run with the endless bank too.
    expect(shortOfTarget).toBeGreaterThan(0);
  });

  it('P50 of the runtime, the bank for the target, the capacity it needs and the yearly cost agree within 1 % between two seeds at 2000 samples', () => {
    // Convergence of the estimator, issue 20's criterion; common practice (no source).
    const solved = solvedOf(smallBankCase());
    const p50 = (seed: number) => {
      const r = runSpread(solved, { settings: { samples: 2000, seed }, cost });
      if (!r.ok) throw new Error(r.problems[0]!.message);
      expect(r.value.failed).toBe(0);
      expect(r.value.bankAh!.count).toBe(2000);
      expect(r.value.costPerYear!.count).toBe(2000);
      expect(r.value.requiredAh!.count).toBe(2000);
      return { runtime: r.value.runtimeH!.p50, bank: r.value.bankAh!.p50, required: r.value.requiredAh!.p50, cost: r.value.costPerYear!.p50 };
    };
    const a = p50(1);
    const b = p50(2);
    expect(Math.abs(a.runtime - b.runtime) / a.runtime).toBeLessThan(0.01);
    expect(Math.abs(a.bank - b.bank) / a.bank).toBeLessThan(0.01);
    expect(Math.abs(a.required - b.required) / a.required).toBeLessThan(0.01);
    expect(Math.abs(a.cost - b.cost) / a.cost).toBeLessThan(0.01);
  }, 120_000);

  it('the histograms of the runtime, the capacity the target needs and the yearly cost count every sample once (Rice rule)', () => {
    // Counting identity (no source needed); the bin count by the Rice rule ⌈2·n^(1/3)⌉ = 8 for n = 60
    // (common practice (no source)).
    const solved = solvedOf(smallBankCase());
    const r = runSpread(solved, { settings: { samples: 60, seed: 9 }, cost });
    if (!r.ok) throw new Error(r.problems[0]!.message);
    const s = r.value;
    expect(s.failed).toBe(0);
    for (const [bins, p] of [
      [s.histogram, s.runtimeH],
      [s.requiredHistogram!, s.requiredAh],
      [s.costHistogram!, s.costPerYear],
    ] as const) {
      expect(bins).toHaveLength(8);
      expect(bins.reduce((n, b) => n + b.count, 0)).toBe(60);
      expect(bins[0]!.from).toBe(p!.min);
      expect(bins[bins.length - 1]!.to).toBe(p!.max);
    }
    // Without a price: no cost figures, histogram or ranking; without a target: no bank histogram.
    const free = runSpread(solved, { settings: { samples: 10 }, cost: null });
    if (!free.ok) throw new Error('refused');
    expect(free.value).toMatchObject({ costPerYear: null, costHistogram: null, costSensitivity: null });
    expect(free.value.requiredHistogram).not.toBeNull();
    const noTarget = smallBankCase();
    delete (noTarget.backup as { targetRuntimeHours?: number }).targetRuntimeHours;
    const nt = runSpread(solvedOf(noTarget), { settings: { samples: 10 }, cost: null });
    if (!nt.ok) throw new Error('refused');
    expect(nt.value.requiredHistogram).toBeNull();
    expect(nt.value.requiredAh).toBeNull();
  });

  it('each ranking is the swings sorted by |high − low| of its own figure', () => {
    // Definition of the one-at-a-time ranking (no source needed).
    const solved = solvedOf(hillside);
    const r = runSpread(solved, { settings: { samples: 10, seed: 2 }, cost });
    if (!r.ok) throw new Error(r.problems[0]!.message);
    const s = r.value;
    const by = (f: (w: (typeof s.sensitivity)[number]) => number) => [...s.sensitivity].sort((a, b) => f(b) - f(a)).map((w) => w.input);
    expect(s.sensitivity.map((w) => w.input)).toEqual(by((w) => Math.abs(w.high!.runtimeH - w.low!.runtimeH)));
    expect(s.costSensitivity!.map((w) => w.input)).toEqual(by((w) => Math.abs(w.high!.costPerYear! - w.low!.costPerYear!)));
    for (const w of s.costSensitivity!) expect(w.costSwing).toBe(Math.abs(w.high!.costPerYear! - w.low!.costPerYear!));
    // The same runs, in another order.
    expect([...s.costSensitivity!].sort((a, b) => a.input.localeCompare(b.input))).toEqual([...s.sensitivity].sort((a, b) => a.input.localeCompare(b.input)));
  });

  it('a case where only the converter efficiency moves the yearly cost puts it first in the cost ranking', () => {
    // Hand-built: loads and capacity held (0 %); aging, cell temperature and end voltage change the
    // battery study only, not the solved operating point the losses are priced at, so their cost
    // swing is 0. Efficiency ± 1 point: the converter's loss at 500 W out is 500·(1/η − 1), lower at
    // the high end (from η = P/(P + L)).
    const solved = solvedOf(smallBankCase());
    const r = runSpread(solved, { settings: { capacityPercent: 0, agingPercent: 20, temperatureC: 10, efficiencyPoints: 1, loadPercent: 0, endVoltagePerCell: 0.1, samples: 10 }, cost });
    if (!r.ok) throw new Error(r.problems[0]!.message);
    const [first, ...rest] = r.value.costSensitivity!;
    expect(first!.input).toBe('efficiency');
    expect(first!.costSwing).toBeGreaterThan(0);
    expect(first!.high!.costPerYear).toBeLessThan(first!.low!.costPerYear!);
    for (const w of rest) expect(w.costSwing).toBe(0);
    // The runtime's ranking leads with another input (aging): the two rankings are not the same.
    expect(r.value.sensitivity[0]!.input).not.toBe('efficiency');
  });

  it('the sensitivity names capacity first on a case built for it', () => {
    // Capacity ± 30 %, the others a tenth of their typical values or less: runtime ∝ capacity at a
    // constant load (Peukert-equivalent charge, k near 1 for lithium), so capacity must lead.
    const solved = solvedOf(smallBankCase());
    const r = runSpread(solved, { settings: { capacityPercent: 30, agingPercent: 1, temperatureC: 0.5, efficiencyPoints: 0.1, loadPercent: 1, endVoltagePerCell: 0.005, samples: 10 }, cost: null });
    if (!r.ok) throw new Error(r.problems[0]!.message);
    expect(r.value.sensitivity[0]!.input).toBe('capacity');
    expect(r.value.sensitivity[0]!.low!.runtimeH).toBeLessThan(r.value.single.runtimeH);
    expect(r.value.sensitivity[0]!.high!.runtimeH).toBeGreaterThan(r.value.single.runtimeH);
    // and more load shortens the runtime, a hotter cell does not (common practice (no source): a
    // battery's capacity falls with cold).
    const load = r.value.sensitivity.find((s) => s.input === 'load')!;
    expect(load.high!.runtimeH).toBeLessThan(load.low!.runtimeH);
  });

  it('the chunks merged equal one run, and the summary orders P10 ≤ P50 ≤ P90', () => {
    const solved = solvedOf(smallBankCase());
    const plan = spreadPlan(solved, { settings: { samples: 40, seed: 5 }, cost });
    if (!plan.ok) throw new Error('plan refused');
    const whole = spreadRun(solved, plan.value, { from: 0, count: 40 });
    const parts = [spreadRun(solved, plan.value, { from: 25, count: 100 }), spreadRun(solved, plan.value, { from: 0, count: 25 })];
    expect(parts[0]!.count).toBe(15);
    const sens = spreadSensitivity(solved, plan.value);
    expect(spreadSummary(plan.value, parts, sens)).toEqual(spreadSummary(plan.value, [whole], sens));
    const s = spreadSummary(plan.value, [whole], sens);
    for (const p of [s.runtimeH!, s.bankAh!, s.costPerYear!]) {
      expect(p.p10).toBeLessThanOrEqual(p.p50);
      expect(p.p50).toBeLessThanOrEqual(p.p90);
    }
  });

  it('property: a wider capacity tolerance never narrows the P10–P90 band of the runtime on a fixed seed', () => {
    // Runtime rises with capacity; sample i's capacity is C·(1 + t·z_i) with z_i fixed by the seed, so
    // P90 (z > 0) moves up and P10 (z < 0) down as t grows (order statistics of a monotone map).
    const solved = solvedOf(smallBankCase());
    const band = (t: number) => {
      const r = runSpread(solved, { settings: { ...zero, capacityPercent: t, samples: 30, seed: 11 }, cost: null });
      if (!r.ok) throw new Error(r.problems[0]!.message);
      return r.value.runtimeH!.p90 - r.value.runtimeH!.p10;
    };
    fc.assert(
      fc.property(fc.double({ min: 0, max: 40, noNaN: true }), fc.double({ min: 0, max: 40, noNaN: true }), (a, b) => {
        const [lo, hi] = a <= b ? [a, b] : [b, a];
        expect(band(hi)).toBeGreaterThanOrEqual(band(lo) - 1e-9);
      }),
      { numRuns: 8, seed: 42 },
    );
  }, 60_000);

  it('property: the chunks may be cut anywhere, the summary is the same', () => {
    const solved = solvedOf(smallBankCase());
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 30 }), fc.integer({ min: 0, max: 1000 }), (cut, seed) => {
        const plan = spreadPlan(solved, { settings: { samples: 30, seed }, cost });
        if (!plan.ok) throw new Error('plan refused');
        const one = spreadSummary(plan.value, [spreadRun(solved, plan.value, { from: 0, count: 30 })], []);
        const two = spreadSummary(plan.value, [spreadRun(solved, plan.value, { from: cut, count: 30 }), spreadRun(solved, plan.value, { from: 0, count: cut })], []);
        expect(two).toEqual(one);
      }),
      { numRuns: 5, seed: 7 },
    );
  }, 60_000);

  it('a project without a battery study is refused at its backup settings', () => {
    const p = smallBankCase();
    delete (p as { backup?: unknown }).backup;
    const r = spreadPlan(solvedOf(p));
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.problems[0]).toMatchObject({ field: 'backup' });
  });

  it('the spread settings are part of the file: checked by the validation, with their field named', () => {
    expect(validateProject(smallBankCase({ spread: { samples: 500, seed: 3, capacityPercent: 5 } })).ok).toBe(true);
    const bad = validateProject(smallBankCase({ spread: { capacityPercent: -1, samples: 2.5 } }));
    expect(bad.ok).toBe(false);
    if (!bad.ok) expect(bad.problems.map((p) => p.field).sort()).toEqual(['spread.capacityPercent', 'spread.samples']);
  });

  it('every broken spread setting is refused at its field, in the user\'s words', () => {
    // The walk of tests/core/messages.test.ts, for the spread settings: no file-format key in the
    // message, no number past 4 significant digits (common practice (no source): the message rules of DEVELOPERS.md).
    const fields = ['samples', 'seed', 'capacityPercent', 'agingPercent', 'temperatureC', 'efficiencyPoints', 'loadPercent', 'endVoltagePerCell'];
    for (const f of fields) {
      for (const broken of [-1, 1e12, 2.5e-7, 'x', null]) {
        if (broken === 2.5e-7 && f !== 'samples' && f !== 'seed') continue; // a tiny tolerance is valid
        const v = validateProject(smallBankCase({ spread: { [f]: broken } }));
        expect(v.ok, `${f} = ${String(broken)}`).toBe(false);
        if (v.ok) continue;
        expect(v.problems.map((p) => p.field)).toEqual([`spread.${f}`]);
        const m = v.problems[0]!.message;
        expect(m).not.toMatch(/[a-z]+[A-Z][a-zA-Z]*/);
        for (const n of m.match(/\d[\d.]*/g) ?? []) expect(n.replace(/\./g, '').replace(/^0+/, '').replace(/0+$/, '').length, `${f}: ${m}`).toBeLessThanOrEqual(4);
      }
      expect(fieldLabel('project', `spread.${f}`)).not.toBe(f);
    }
  });

  it('hillside demo: a short spread runs, its text names the seed and the typical-value wording', () => {
    const solved = solvedOf(hillside);
    const r = runSpread(solved, { settings: { samples: 12, seed: 3 }, cost });
    if (!r.ok) throw new Error(r.problems[0]!.message);
    expect(r.value.failed).toBe(0);
    const text = formatSpread(r.value);
    expect(text).toContain('12 samples, seed 3');
    expect(text).toContain("typical value: use the maker's figure");
    // The cost's histogram and ranking are printed with a price; the caution names the safe end of each row.
    expect(text).toContain('Yearly cost of the losses histogram');
    expect(text).toContain('Which input moves the yearly cost of the losses most');
    expect(text).toContain('Capacity the target needs, before rounding to whole strings:');
    expect(text).toContain('Capacity the target needs histogram (before rounding to whole strings)');
    expect(text).toContain("from the runtime's P10");
    expect(text).toContain("the bank row's P90");
    expect(text).toContain('Converter efficiency: ± 1 point\n');
    expect(formatSpread({ ...r.value, tolerances: { ...r.value.tolerances, efficiency: 2 } })).toContain('Converter efficiency: ± 2 points\n');
    const free = runSpread(solved, { settings: { samples: 12, seed: 3 }, cost: null });
    if (!free.ok) throw new Error('refused');
    expect(formatSpread(free.value)).toContain('no energy price per kWh');
    expect(formatSpread(free.value)).not.toContain('Yearly cost of the losses histogram');
    // The single run is the battery study's own runtime of the same project (identity, no source needed).
    const single = runBackupStudy(solved);
    expect(single.ok && single.study.discharge.runtimeSeconds / 3600).toBe(r.value.single.runtimeH);
    expect(ZERO_TOLERANCES.capacity).toBe(0);
  });
});
