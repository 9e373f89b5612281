import { describe, expect, it } from 'vitest';
import { demoProjects } from '../../../core/demos/index.ts';
import { solveProjectVariant } from '../../../core/solve/project-variant.ts';
import { solveAnswers } from '../../../core/solve/answers.ts';
import { answerStudies } from '../../../core/studies/answers.ts';
import { costSettingsOf } from '../../../core/studies/economics.ts';
import { compareLifetime, lifetimeCost, type LifetimeSettings } from '../../../core/studies/lifetime.ts';
import { backupWithout, breakEvenValues, compareVariants, type VariantComparison } from '../../../core/studies/variants/compare.ts';
import { comparisonValueText, formatVariantComparison } from '../../../core/studies/variants/text-report.ts';
import { breakEven } from '../../../core/studies/lifetime-money.ts';
import { solveVariant } from '../../../core/solve/variant.ts';
import { nextSizeUpVariant, systemVoltageVariant } from '../../../core/variants/index.ts';
import type { ProjectVariant } from '../../../core/model/variants.ts';
import type { Project } from '../../../core/model/project.ts';
import { dcProject, solved } from './fixtures.ts';

const demo = (id: string): Project => demoProjects.find((d) => d.id === id)!.project;
const row = (c: VariantComparison, key: string) => {
  const r = c.rows.find((x) => x.key === key);
  if (!r) throw new Error(`no row ${key}: ${c.rows.map((x) => x.key).join(', ')}`);
  return r;
};

describe('variants side by side', () => {
  it('each column equals the single solve of its variant, and its studies run directly on that solve (hillside, 24 and 12 V)', () => {
    const base = solved(demo('hillside-relay-hut'));
    const variants = [24, 12].map((v) => {
      const o = systemVoltageVariant(base.project, v);
      if (!o.ok) throw new Error('refused');
      return o.variant;
    });
    const c = compareVariants(base, variants);
    expect(c.columns.map((x) => [x.name, x.ok])).toEqual([['As planned', true], ['24 V system', true], ['12 V system', true]]);
    [base, ...variants.map((v) => {
      const s = solveProjectVariant(base, v);
      if (!s.ok) throw new Error('refused');
      return s;
    })].forEach((s, i) => {
      const quick = solveAnswers(s);
      const studies = answerStudies(s, costSettingsOf(s.project));
      // The single solve's own figures (core/solve/answers.ts, core/studies/answers.ts): nothing recomputed by the comparison.
      expect(row(c, 'source.power').values[i]).toBe(quick.source.power);
      expect(row(c, 'losses.conversion').values[i]).toBe(quick.losses.conversion);
      expect(row(c, 'losses.idle').values[i]).toBe(quick.losses.idle);
      expect(row(c, 'losses.cables').values[i]).toBe(quick.losses.cables);
      expect(row(c, 'bank.bank.current').values[i]).toBe(quick.banks[0]!.operatingCurrent);
      expect(row(c, 'bank.bank.runtime').values[i]).toBe(studies.banks[0]!.runtimeSeconds);
      expect(row(c, 'bank.bank.peak').values[i]).toBe(studies.banks[0]!.peakCurrent);
      expect(row(c, 'bank.bank.sized').values[i]).toBe(studies.banks[0]!.sizedBank);
      expect(row(c, 'cable.bank-cable.current').values[i]).toBe(s.result.elements.find((e) => e.id === 'bank-cable')!.input!.current);
    });
    // Differences flagged right: the loads are the same in every column; the bank's current doubles and quadruples.
    expect(row(c, 'source.loads').differs).toBe(false); // 455 W in each: the same loads
    expect(row(c, 'losses.idle').differs).toBe(false); // idle losses do not depend on the bank voltage here
    expect(row(c, 'bank.bank.current').differs).toBe(true);
    const [i48, i24, i12] = row(c, 'bank.bank.current').values as number[];
    // P = V·I at nearly the same power: 24 V draws about twice the 48 V current, 12 V four times (within the losses' change, 2 %).
    expect(i24! / i48!).toBeGreaterThan(1.96);
    expect(i24! / i48!).toBeLessThan(2.04);
    expect(i12! / i48!).toBeGreaterThan(3.92);
    expect(i12! / i48!).toBeLessThan(4.16);
  });

  it('yearly cost at the project\'s price, lifetime cost and the break-even year against the plan (lifetime.ts, hand-worked)', () => {
    const p = dcProject({ cable: true });
    const base = solved({ ...p, running: { energyPricePerKWh: 0.3, hoursPerYear: 8760, years: 10, discountRate: 0 } } as Project);
    const v = nextSizeUpVariant(base, 'feed');
    if (!v.ok) throw new Error('refused');
    // The bigger conductor costs 50 (its price) and loses less.
    const priced: ProjectVariant = { ...v.variant, set: { feed: { ...v.variant.set!['feed'], price: 50 } } };
    const c = compareVariants(base, [priced]);
    const s16 = solveProjectVariant(base, priced);
    if (!s16.ok) throw new Error('refused');
    const settings = { dayPricePerKWh: 0.3, dayStartHour: 7, dayEndHour: 23, hoursPerYear: 8760, years: 10, discountRate: 0 } satisfies LifetimeSettings;
    const la = lifetimeCost(base, settings);
    const lb = lifetimeCost(s16, settings);
    if (!la.ok || !lb.ok) throw new Error('refused');
    // E = P_loss × h (economics.ts): the base's losses (W) × 8760 h / 1000 in kWh; cost = E × 0.3 per kWh.
    expect(row(c, 'cost.energy').values[0]).toBeCloseTo((base.result.totals.losses * 8760) / 1000, 9); // E = P·t
    expect(row(c, 'cost.yearly').values[0]).toBeCloseTo(((base.result.totals.losses * 8760) / 1000) * 0.3, 9); // E × price
    expect(row(c, 'cost.lifetime').values).toEqual([la.cost.npv, lb.cost.npv]);
    const be = compareLifetime(la.cost, lb.cost);
    expect(row(c, 'cost.breakEven').values).toEqual([null, be.breakEvenYear]);
    // Hand-worked, undiscounted: payback = 50 / (yearly saving) years.
    const saving = la.cost.yearlyCost - lb.cost.yearlyCost;
    expect(saving).toBeGreaterThan(0);
    expect(row(c, 'cost.payback').values[1]).toBeCloseTo(50 / saving, 9);
    // Undiscounted, the same saving each year: the break-even year is the payback rounded up.
    expect(50 / saving).toBeLessThan(10);
    expect(row(c, 'cost.breakEven').values[1]).toBe(Math.ceil(50 / saving));
    expect(row(c, 'cost.purchase').values).toEqual([0, 50]);
    expect(row(c, 'cable.feed.size').values).toEqual(['10 mm²', '16 mm²']); // IEC 60364-5-52 Table B.52.2 (see quick-variants.test.ts), IEC 60228 next size
    expect(row(c, 'cable.feed.size').differs).toBe(true);
  });

  it('a variant that no longer applies carries its problems; the others are still compared', () => {
    const base = solved(demo('cold-store-dc-bus'));
    const next = nextSizeUpVariant(base, null);
    if (!next.ok) throw new Error('refused');
    const stale: ProjectVariant = { name: 'Old fan', set: { 'gone-fan': { power: 10 } } };
    const c = compareVariants(base, [stale, next.variant]);
    expect(c.columns[1]).toMatchObject({ name: 'Old fan', ok: false });
    expect(c.columns[1]!.problems[0]!.message).toMatch(/names no element.*"Old fan"/);
    const size = row(c, 'cable.ctl-cable.size');
    expect(size.values).toEqual(['10 mm²', null, '16 mm²']); // IEC 60228 size series
    expect(size.differs).toBe(true);
    // Only the columns worked out count: equal figures in them are no difference.
    expect(row(c, 'losses.idle').values[1]).toBeNull();
    expect(row(c, 'losses.idle').differs).toBe(false);
  });

  it('critical loads only: the load profile drops the loads taken out, and the bank then lasts longer (hillside without its lights)', () => {
    const base = solved(demo('hillside-relay-hut'));
    const v: ProjectVariant = { name: 'No lights', remove: ['lights'] };
    const c = compareVariants(base, [v]);
    expect(c.columns[1]!.ok).toBe(true);
    expect(c.columns[1]!.studyProblems).toEqual([]);
    // The same as solving the variant with the profile's "lights" levels taken out (its duty cycle of the fridge kept).
    const backup = backupWithout(base.project.backup, new Set(['lights']))!;
    expect(backup.profile.kind === 'daily' && backup.profile.segments.every((seg) => !('lights' in (seg.loads ?? {})))).toBe(true);
    expect(backup.profile.duty).toEqual([{ load: 'fridge', periodMinutes: 30, onMinutes: 12 }]);
    const s = solveVariant(base, { remove: new Set(['lights']), backup });
    if (!s.ok) throw new Error('refused');
    const study = answerStudies(s, null);
    expect(row(c, 'bank.bank.runtime').values[1]).toBe(study.banks[0]!.runtimeSeconds);
    // Less load, the same bank: it lasts longer (common practice (no source): runtime falls as the load rises).
    expect(row(c, 'bank.bank.runtime').values[1]).toBeGreaterThan(row(c, 'bank.bank.runtime').values[0] as number);
    expect(row(c, 'source.power').values[1]).toBeLessThan(row(c, 'source.power').values[0] as number); // 220 W less load
    // A variant that takes out no load of the profile is solved exactly as solveProjectVariant solves it.
    expect(backupWithout(base.project.backup, new Set(['radios']))).toBeNull();
  });

  it('motor start verdicts per column (riverside: the drive-fed pump starts)', () => {
    const base = solved(demo('riverside-pump-station'));
    const c = compareVariants(base, [{ name: 'Longer feeder', set: { feeder: { length: 80 } } }]);
    expect(row(c, 'start.motor').values).toEqual(['starts', 'starts']);
    expect(row(c, 'start.motor').differs).toBe(false);
    expect(row(c, 'cable.feeder.current').differs).toBe(true);
  });
  it('the energy lost a year without a price: E = P_loss × 8760 h (economics.ts, all year by default); no money rows', () => {
    const base = solved(demo('hillside-relay-hut'));
    const c = compareVariants(base, []);
    // E = P·t: 95.91 W of losses (the hillside CLI's balance) × 8760 h / 1000.
    expect(row(c, 'cost.energy').values[0]).toBeCloseTo((base.result.totals.losses * 8760) / 1000, 9);
    expect(row(c, 'cost.energy').values[0]).toBeCloseTo(840.2, 1); // the hillside CLI's "What the losses cost per year", 840.2 kWh at 8760 h
    expect(c.rows.some((r) => r.key === 'cost.yearly' || r.key === 'cost.lifetime')).toBe(false);
    expect(formatVariantComparison(c)).toMatch(/Energy lost a year: the losses at the solved operating point for 8760 h a year \(no energy price given, so no cost\)/);
  });

  it('the runtime verdict is the bank as new without margin or aging; beside it whether the installed bank is the bank the sizing gives (hillside: 200 Ah against 400 Ah)', () => {
    const c = compareVariants(solved(demo('hillside-relay-hut')), []);
    // The hillside CLI's backup study: runtime 27 h 40 min against the 24 h target, as new (aging × 1.000);
    // its sizing with design margin 1.1 and aging 1.25: "2 strings × 200 Ah = 400 Ah" against the one 200 Ah string installed.
    expect(row(c, 'bank.bank.meets')).toMatchObject({ label: '48 V LiFePO4 bank: runtime reaches the target (as new, no margin or aging)', values: ['yes'] });
    expect(row(c, 'bank.bank.installedAh').values).toEqual([200]);
    expect(row(c, 'bank.bank.sizedAh').values).toEqual([400]);
    expect(row(c, 'bank.bank.enough')).toMatchObject({ label: '48 V LiFePO4 bank: installed bank ≥ bank for the target (with margin and aging)', values: ['no'] });
    // No sizing on the bank's cable: the current is the highest discharge current, and the row says so.
    expect(row(c, 'bank.bank.cableCurrent').values).toEqual(row(c, 'bank.bank.peak').values);
    expect(row(c, 'bank.bank.cableBasis').values).toEqual(['highest discharge current over the outage; no continuous-load factor']);
  });

  it('a sized bank cable: the current is the design current of its conductor sizing, and the row names it (1200 W at 25.6 V nominal = 46.875 A, IEC I_B)', () => {
    const p = { ...dcProject({ cable: true }), backup: { timeStepSeconds: 60, horizonHours: 4, targetRuntimeHours: 2, profile: { kind: 'constant' } } } as unknown as Project;
    const c = compareVariants(solved(p), []);
    // I_B = P / U_nominal = 1200 / (8 × 3.2 V) (IEC 60364-5-52 design current of the load at nominal voltage; design-current.ts).
    expect(row(c, 'bank.bank.cableCurrent').values[0]).toBeCloseTo(1200 / 25.6, 9);
    expect(row(c, 'bank.bank.cableBasis').values).toEqual(['design current of “Bank feed”: the load at nominal voltage']);
  });

  it('break-even and payback in words where there is none (lifetime-money.ts breakEven, hand-worked at 0 %)', () => {
    const stream = (purchase: number, yearly: number) => ({ purchase, yearly: Array.from({ length: 10 }, () => yearly) });
    // The same purchase: nothing to pay back.
    expect(breakEvenValues(breakEven(stream(100, 50), stream(100, 40), 0), 10)).toEqual({ breakEven: 'no extra purchase', payback: 'no extra purchase' });
    // Dearer by 500, saving 10 a year: payback 500 / 10 = 50 years, never caught up within the 10 years.
    expect(breakEvenValues(breakEven(stream(0, 100), stream(500, 90), 0), 10)).toEqual({ breakEven: 'never within 10 years', payback: 50 });
    // Dearer by 500, no saving at all.
    expect(breakEvenValues(breakEven(stream(0, 100), stream(500, 100), 0), 10)).toEqual({ breakEven: 'never within 10 years', payback: 'never (no yearly saving)' });
    // Dearer by 100, saving 100 a year: paid back in 1 year, caught up in year 1; printed "1 year", not "1 years".
    const one = breakEvenValues(breakEven(stream(0, 200), stream(100, 100), 0), 10);
    expect(one).toEqual({ breakEven: 1, payback: 1 });
    expect(comparisonValueText({ quantity: 'years' }, one.payback)).toBe('1 year');
    expect(comparisonValueText({ quantity: 'years' }, 2.5)).toBe('2.5 years');
    // The variant cheaper to buy (by 100) and dearer to run (by 20 a year): the plan's extra pays back in 100 / 20 = 5 years, caught up in year 5.
    expect(breakEvenValues(breakEven(stream(100, 50), stream(0, 70), 0), 10)).toEqual({ breakEven: 'costs less to buy; the plan catches up in year 5', payback: 'costs less to buy; the plan\'s extra purchase pays back in 5 years' });
    // Cheaper to buy and no dearer to run.
    expect(breakEvenValues(breakEven(stream(100, 50), stream(0, 50), 0), 1)).toEqual({ breakEven: 'costs less to buy; the plan does not catch up within 1 year', payback: 'costs less to buy, no more to run' });
  });

  it('the text names the methods of the lifetime cost, payback and break-even, and what the lifetime cost leaves out', () => {
    const p = dcProject({ cable: true });
    const base = solved({ ...p, running: { energyPricePerKWh: 0.3, years: 1, discountRate: 0 } } as Project);
    const v = nextSizeUpVariant(base, 'feed');
    if (!v.ok) throw new Error('refused');
    const text = formatVariantComparison(compareVariants(base, [v.variant]));
    expect(text).toMatch(/Lifetime cost over 1 year at a discount rate of 0 %; break-even and payback of each option against the plan as it stands\./);
    expect(text).toMatch(/Simple payback: the extra purchase ÷ the mean yearly saving, not discounted\./);
    expect(text).toMatch(/Break-even year: the first whole year in which the dearer option’s purchase plus its yearly costs so far, each discounted by 1 ÷ \(1 \+ r\)\^t, is no more than the other’s\./);
    expect(text).toMatch(/Not counted: replacing parts that wear out within those years \(a battery bank, for one\), maintenance, and rises in the energy or fuel price\./);
    // No price difference: "no extra purchase", not an empty cell.
    expect(text).toMatch(/Break-even year against the plan +— +no extra purchase/);
  });
});
