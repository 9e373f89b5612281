/**
 * Every row of the comparison of variants, column by column, against the single solve of that
 * variant (issue 20: "each comparison figure equals the single solve of that variant").
 *
 * Source of every check value: the single solve is the reference — `solveProjectVariant` of the
 * variant (for a variant that takes out loads the battery study's profile names, the same with that
 * profile trimmed, as the comparison works it: compare.ts header), then the study functions the
 * command line runs for one project (core/cli/run.ts): `solveAnswers`, `answerStudies`,
 * `lossCostPerYear` at `withProfilePrice(costSettingsOf(project))`, `runBackupStudy` and `lifetimeCost`
 * with that study's recharge, `compareLifetime` against the plan's. Nothing here is worked by hand;
 * the rows' words (yes/no, the start verdicts, the basis of the bank cable's current, break-even in
 * words) are the comparison's own mapping of those figures, checked by hand in compare.test.ts.
 */
import { describe, expect, it } from 'vitest';
import { demoProjects } from '../../../core/demos/index.ts';
import { solveProjectVariant } from '../../../core/solve/project-variant.ts';
import { solveAnswers } from '../../../core/solve/answers.ts';
import { answerStudies } from '../../../core/studies/answers.ts';
import { runBackupStudy } from '../../../core/studies/backup/study.ts';
import { costSettingsOf, HOURS_IN_YEAR, lossCostPerYear, withProfilePrice } from '../../../core/studies/economics.ts';
import { compareLifetime, lifetimeCost, lifetimeSettingsOf, type LifetimeCost } from '../../../core/studies/lifetime.ts';
import { backupWithout, breakEvenValues, cableCurrentBasis, compareVariants } from '../../../core/studies/variants/compare.ts';
import { criticalLoadsVariant, nextSizeUpVariant, systemVoltageVariant } from '../../../core/variants/index.ts';
import { parseArgs } from '../../../core/cli/args.ts';
import { runParsed, type SolveRequest } from '../../../core/cli/run.ts';
import type { ProjectVariant } from '../../../core/model/variants.ts';
import type { Project } from '../../../core/model/project.ts';
import type { Solved } from '../../../core/solve/solved.ts';
import { solved } from './fixtures.ts';

const demo = (id: string): Project => structuredClone(demoProjects.find((d) => d.id === id)!.project);
const START_WORDS = { starts: 'starts', marginal: 'marginal', 'will-not-start': 'will not start' } as const;
type Value = number | string | null;

/** The single solve of one column: the base as it stands, or the variant solved on its own. */
function singleSolve(base: Solved, v: ProjectVariant | undefined): Solved {
  if (!v) return base;
  const trimmed = backupWithout(base.project.backup, new Set(v.remove ?? []));
  const from = trimmed ? solved({ ...base.project, backup: trimmed } as Project) : base;
  const s = solveProjectVariant(from, v);
  if (!s.ok) throw new Error(`variant "${v.name}" refused: ${JSON.stringify(s.problems)}`);
  return s;
}

/** What the single project's studies give (core/cli/run.ts's calls), keyed as the comparison's rows. */
function singleFigures(s: Solved, planLife: LifetimeCost | undefined, isPlan: boolean): { figures: Map<string, Value>; life?: LifetimeCost } {
  const f = new Map<string, Value>();
  const quick = solveAnswers(s);
  f.set('source.power', quick.source.power);
  f.set('source.loads', quick.source.loadPower);
  f.set('source.efficiency', quick.source.efficiency);
  f.set('losses.total', quick.losses.total);
  f.set('losses.conversion', quick.losses.conversion);
  f.set('losses.idle', quick.losses.idle);
  f.set('losses.cables', quick.losses.cables);
  f.set('losses.source', quick.losses.source);
  // The yearly cost of the losses as the command line works it (run.ts: withProfilePrice(costSettingsOf)).
  const cost = costSettingsOf(s.project);
  const lc = lossCostPerYear(s.result, cost ? withProfilePrice(s, cost) : { pricePerKWh: 0, hoursPerYear: s.project.running?.hoursPerYear ?? HOURS_IN_YEAR });
  if (!lc.ok) throw new Error('loss cost refused');
  f.set('cost.energy', lc.cost.totalEnergyKWh);
  if (cost) f.set('cost.yearly', lc.cost.totalCost);
  // The battery study as the command line runs it, and the cost over the years with its recharge (run.ts).
  const hasBank = s.project.backup !== undefined && s.project.elements.some((e) => e.kind === 'battery' && e.bank !== undefined);
  const backup = hasBank ? runBackupStudy(s) : undefined;
  if (backup && !backup.ok) throw new Error('backup study refused');
  const rc = backup?.ok ? backup.study.recharge : undefined;
  let life: LifetimeCost | undefined;
  const settings = lifetimeSettingsOf(s.project);
  if (settings) {
    const l = lifetimeCost(s, settings, rc ? { energyWh: rc.acInputEnergyWh, timeSeconds: rc.time } : undefined);
    if (!l.ok) throw new Error('lifetime refused');
    life = l.cost;
    f.set('cost.purchase', life.purchase);
    if (life.generator) f.set('cost.fuel', life.generator.litresPerYear);
    if (life.co2KgPerYear !== undefined) f.set('cost.co2', life.co2KgPerYear);
    f.set('cost.yearlyCounted', life.yearlyCost);
    f.set('cost.lifetime', life.npv);
    if (!isPlan && planLife) {
      const be = breakEvenValues(compareLifetime(planLife, life), settings.years);
      f.set('cost.breakEven', be.breakEven);
      f.set('cost.payback', be.payback);
    }
  }
  for (const b of quick.banks) f.set(`bank.${b.elementId}.current`, b.operatingCurrent);
  const studies = answerStudies(s, cost);
  for (const b of studies.banks) {
    const at = (w: string) => `bank.${b.elementId}.${w}`;
    f.set(at('peak'), b.peakCurrent);
    f.set(at('runtime'), b.runtimeSeconds);
    // The study's own discharge, the same as the command line's.
    if (backup?.ok) expect(b.runtimeSeconds).toBe(backup.study.discharge.runtimeSeconds);
    if (b.meetsTarget !== undefined) f.set(at('meets'), b.meetsTarget ? 'yes' : 'no');
    if (b.sizedBank !== undefined) f.set(at('sized'), b.sizedBank);
    if (b.sizedCapacityAh !== undefined) {
      f.set(at('sizedAh'), b.sizedCapacityAh);
      const e = s.project.elements.find((x) => x.id === b.elementId);
      if (e?.kind === 'battery' && e.bank) {
        const installed = (e.bank.strings ?? 1) * e.bank.capacityAh;
        f.set(at('installedAh'), installed);
        f.set(at('enough'), installed >= b.sizedCapacityAh ? 'yes' : 'no');
      }
    }
    f.set(at('cableCurrent'), b.cableCurrent.amps);
    f.set(at('cableBasis'), cableCurrentBasis(b, quick.banks.find((q) => q.elementId === b.elementId)));
  }
  for (const e of s.result.elements) if (e.kind === 'cable') f.set(`cable.${e.id}.current`, e.input?.current ?? null);
  for (const c of quick.cables) {
    f.set(`cable.${c.elementId}.size`, c.parallelSets > 1 ? `${c.parallelSets} × ${c.size}` : c.size);
    f.set(`cable.${c.elementId}.device`, c.deviceRating ?? null);
    f.set(`cable.${c.elementId}.drop`, c.dropPercent);
  }
  for (const d of s.result.voltageDrop ?? []) {
    f.set(`drop.${d.loadId}`, d.totalPercent);
    f.set(`drop.${d.loadId}.within`, d.exceedsLimit ? 'no' : 'yes');
  }
  for (const st of studies.starts) f.set(`start.${st.elementId}`, START_WORDS[st.verdict]);
  for (const w of quick.warnings) {
    const key = `warning.${w.elementId}.${w.code}`;
    const prev = f.get(key);
    f.set(key, typeof prev === 'string' ? `${prev}; ${w.message}` : w.message);
  }
  return { figures: f, ...(life ? { life } : {}) };
}

/** Every row of every column equals the single solve's figure; every figure of the single solve has its row. */
function expectEveryRow(project: Project, variants: ProjectVariant[]) {
  const base = solved(project);
  const c = compareVariants(base, variants);
  expect(c.columns.map((x) => x.ok)).toEqual(c.columns.map(() => true));
  const plan = singleFigures(base, undefined, true);
  c.columns.forEach((_, i) => {
    const s = singleSolve(base, variants[i - 1]);
    const { figures } = i === 0 ? plan : singleFigures(s, plan.life, false);
    const got = new Map(c.rows.map((r) => [r.key, r.values[i] ?? null]));
    for (const [key, value] of figures) {
      // A path's "within its limit" row is shown only where some column is over it (compare.ts).
      if (key.endsWith('.within') && value === 'yes' && !got.has(key)) continue;
      expect(got.has(key), `column ${i} lacks row ${key}`).toBe(true);
      expect(got.get(key), `column ${i}, row ${key}`).toEqual(value);
    }
    for (const [key, value] of got) if (!figures.has(key)) expect(value, `column ${i}, row ${key} not in the single solve`).toBeNull();
  });
  return c;
}

const quick = (o: ReturnType<typeof systemVoltageVariant>): ProjectVariant[] => (o.ok ? [o.variant] : []);

describe('every row of the comparison equals the single solve of its variant', () => {
  it('hillside relay hut: 24 V, 12 V, critical loads only (no price: the energy lost a year alone)', () => {
    const p = demo('hillside-relay-hut');
    // A pass-through limit on an off-grid inverter: the project-level warning solveProjectVariant adds (core/solve/project-warnings.ts).
    const passThrough: ProjectVariant = { name: 'Pass-through limit', set: { inverter: { passThroughLimit: 16 } } };
    // 12 V with the bank cable (given by its resistance, 0.59 Ω/km) 60 m long: its path drop is far over the project's limits.
    const v12 = systemVoltageVariant(p, 12);
    if (!v12.ok) throw new Error('refused');
    const longCable: ProjectVariant = { ...v12.variant, name: '12 V, long bank cable', set: { ...v12.variant.set, 'bank-cable': { length: 60 } } };
    const c = expectEveryRow(p, [...quick(systemVoltageVariant(p, 24)), v12.variant, ...quick(criticalLoadsVariant(p, ['lights'])), passThrough, longCable]);
    expect(c.columns).toHaveLength(6);
    expect(c.rows.find((r) => r.key === 'warning.inverter.pass-through-unused')!.values[4]).toMatch(/./);
    // The path drop row of a cable given by resistance; the "within" row shown because one option is over (NEC 215.2(A) IN No. 2: 5 % in all, the demo's limits).
    const within = c.rows.find((r) => r.key === 'drop.inverter.within')!;
    expect(within.label).toBe('Drop to 3 kW inverter: within its limit (3 % a link, 5 % in all)');
    expect(within.values).toEqual(['yes', 'yes', 'yes', 'yes', 'yes', 'no']);
    expect(c.rows.find((r) => r.key === 'drop.inverter')!.values[5]).toBeGreaterThan(5);
    expect(c.rows.some((r) => r.key === 'drop.fridge.within')).toBe(false); // within its limit in every option: no row
    expect(c.rows.some((r) => r.key === 'cost.yearly')).toBe(false);
    expect(c.hoursPerYear).toBe(8760); // all year, the default of core/solve/running-schema.ts HOURS_IN_YEAR
  });

  it('hillside with a generator recharging after 6 outages, fuel price, day/night tariff split by the profile, CO₂ and a dearer bank', () => {
    const p = demo('hillside-relay-hut');
    const bank = p.elements.find((e) => e.id === 'bank')!;
    p.elements = p.elements.map((e) => (e.id === 'bank' ? { ...e, price: 4000 } : e));
    p.running = {
      energyPricePerKWh: 0.3,
      nightPricePerKWh: 0.12,
      dayHoursFromProfile: true,
      years: 10,
      discountRate: 0.05,
      gridCo2KgPerKWh: 0.4,
      generator: { quarterLoadLitresPerHour: 0.9, halfLoadLitresPerHour: 1.3, fullLoadLitresPerHour: 2.2, outageHoursPerYear: 0, ratedPower: 5000, outagesPerYear: 6, fuelPricePerLitre: 1.6 },
    } as Project['running'];
    const twoStrings: ProjectVariant = { name: 'Two strings', set: { bank: { bank: { ...(bank as { bank: object }).bank, strings: 2 }, price: 8000 } } };
    const c = expectEveryRow(p, [...quick(systemVoltageVariant(p, 24)), ...quick(criticalLoadsVariant(p, ['lights'])), twoStrings]);
    expect(c.columns).toHaveLength(4);
    const lifetime = c.rows.find((r) => r.key === 'cost.lifetime')!;
    // The recharge fuel is counted in every column: the project's own "Cost over the years" on the command line gives the same.
    const fuel = c.rows.find((r) => r.key === 'cost.fuel')!;
    expect(fuel.values.every((v) => typeof v === 'number' && v > 0)).toBe(true);
    const req = parseArgs(['x.json', '--json']) as SolveRequest;
    const base = solved(p);
    [undefined, ...c.columns.slice(1).map((_, i) => [...quick(systemVoltageVariant(p, 24)), ...quick(criticalLoadsVariant(p, ['lights'])), twoStrings][i])].forEach((v, i) => {
      // The variant saved as its own project file and run through the command line (core/cli/run.ts), the reference of the issue.
      const { variants: _drop, ...file } = singleSolve(base, v).project as Project;
      const out = runParsed('x.json', file, req, undefined);
      if (!out.ok) throw new Error('CLI refused');
      const npv = JSON.parse(out.text).lifetimeCost.npv as number;
      expect(Math.abs((lifetime.values[i] as number) - npv)).toBeLessThanOrEqual(1e-9 * npv); // solved afresh: within round-off
    });
    // The dearer bank never pays back: its losses are the same or more (words, not an empty cell).
    expect(c.rows.find((r) => r.key === 'cost.breakEven')!.values[3]).toMatch(/^never within 10 years$|^\d+$/);
  });

  it('harbour clinic UPS: next size up, 24 V, 12 V, with its energy price and 15 years', () => {
    const p = demo('harbour-clinic-ups');
    p.running = { ...p.running, years: 15, discountRate: 0.03 } as Project['running'];
    const next = nextSizeUpVariant(solved(p), null);
    const c = expectEveryRow(p, [...(next.ok ? [next.variant] : []), ...quick(systemVoltageVariant(p, 24)), ...quick(systemVoltageVariant(p, 12))]);
    expect(c.columns.map((x) => x.name)).toEqual(['As planned', 'Next size up, all cables', '24 V system', '12 V system']);
  });

  it('cold-store DC bus: next size up (priced) and a longer fan cable, with a price and years', () => {
    const p = demo('cold-store-dc-bus');
    p.running = { energyPricePerKWh: 0.25, hoursPerYear: 6000, years: 12, discountRate: 0.04 } as Project['running'];
    const next = nextSizeUpVariant(solved(p), null);
    if (!next.ok) throw new Error('refused');
    const priced: ProjectVariant = { ...next.variant, set: { ...next.variant.set, 'ctl-cable': { ...next.variant.set!['ctl-cable'], price: 40 } } };
    const c = expectEveryRow(p, [priced, { name: 'Longer fan cable', set: { 'fan-cable': { length: 60 } } }]);
    // The bigger conductor costs more to buy: a payback in years; the longer cable costs nothing more to buy.
    expect(typeof c.rows.find((r) => r.key === 'cost.payback')!.values[1]).toBe('number');
    expect(c.rows.find((r) => r.key === 'cost.payback')!.values[2]).toBe('no extra purchase');
  });

  it('riverside pump station: a longer feeder and a smaller panel load (motor start verdicts)', () => {
    const p = demo('riverside-pump-station');
    const c = expectEveryRow(p, [
      { name: 'Longer feeder', set: { feeder: { length: 80 } } },
      { name: 'Smaller panel load', set: { panel: { apparentPower: 5000 } } },
    ]);
    expect(c.rows.some((r) => r.key === 'start.motor')).toBe(true);
  });
});
