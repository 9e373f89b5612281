import { describe, expect, it } from 'vitest';
import { demoProjects } from '../../../core/demos/index.ts';
import { solveProjectVariant } from '../../../core/solve/project-variant.ts';
import { solveAnswers } from '../../../core/solve/answers.ts';
import { answerStudies } from '../../../core/studies/answers.ts';
import { costSettingsOf } from '../../../core/studies/economics.ts';
import { compareLifetime, lifetimeCost, type LifetimeSettings } from '../../../core/studies/lifetime.ts';
import { backupWithout, compareVariants, type VariantComparison } from '../../../core/studies/variants/compare.ts';
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
});
