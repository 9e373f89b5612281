/**
 * The losses worked out over the load profile's day (core/studies/loss-over-profile.ts, the project's
 * `running.lossesFromProfile`; issue 20 point 2, "hours or the duty profile"), against hand-worked cases.
 *
 * The chain (invented): a 48 V source with no internal resistance feeds a 48→12 V converter of constant
 * efficiency 0.9 with an idle loss of 2 W, which feeds a 90 W lamp. Its loss is
 * P_loss = P_out·(1/η − 1) + P_idle (core/physics/loss-model.ts, the constant-efficiency model):
 * 90 × (1/0.9 − 1) + 2 = 12 W with the lamp on, 2 W with it off. The lamp is on 18:00–22:00 (a daily
 * profile that starts at 18:00), off the rest of the day.
 */
import { describe, expect, it } from 'vitest';
import { solvedOf } from './solved.ts';
import { lossCostOfSolved, lossCostOverProfile } from '../../core/studies/loss-over-profile.ts';
import { costSettingsOf, formatLossCost, lossCostPerYear } from '../../core/studies/economics.ts';
import { lifetimeCost } from '../../core/studies/lifetime.ts';
import { compareVariants } from '../../core/studies/variants/compare.ts';
import { formatVariantComparison } from '../../core/studies/variants/text-report.ts';
import { answerStudies } from '../../core/studies/answers.ts';
import { solveProjectVariant } from '../../core/solve/project-variant.ts';
import { runSpread } from '../../core/studies/spread/run.ts';
import type { Project } from '../../core/model/project.ts';
import { demoProjects } from '../../core/demos/index.ts';

const lampChain = (running: Record<string, unknown>) =>
  ({
    format: 'joulepath-project',
    version: 2,
    name: 'Evening lamp',
    elements: [
      { id: 'source', name: 'Bank', kind: 'battery', voltage: 48, internalResistance: 0 },
      { id: 'psu', name: 'Lamp converter', kind: 'dc-dc', from: 'source', outputVoltage: 12, loss: { model: 'constant', efficiency: 0.9, idleLoss: 2 } },
      { id: 'lamp', name: 'Lamp', kind: 'dc-load', from: 'psu', power: 90 },
    ],
    backup: {
      profile: { kind: 'daily', startHour: 18, segments: [{ startHour: 18, loads: { lamp: 90 } }, { startHour: 22, loads: { lamp: 0 } }] },
      timeStepSeconds: 60,
      horizonHours: 24,
    },
    running,
  }) as unknown as Project;

const costOf = (p: Project) => {
  const solved = solvedOf(p);
  const cost = costSettingsOf(solved.project)!;
  const o = lossCostOfSolved(solved, cost);
  if (!o.ok) throw new Error(o.problems[0]!.message);
  return o.cost;
};

describe('the losses over the load profile’s day', () => {
  it('one price: E = 365 × (4 h × 12 W + 20 h × 2 W) = 365 × 88 Wh = 32.12 kWh; at 0.25 per kWh, 8.03 a year', () => {
    const c = costOf(lampChain({ energyPricePerKWh: 0.25, lossesFromProfile: true }));
    // Hand-worked above (the constant-efficiency model's loss, the profile's hours).
    expect(c.totalEnergyKWh).toBeCloseTo(32.12, 9);
    expect(c.totalCost).toBeCloseTo(8.03, 9);
    expect(c.pricePerKWh).toBeCloseTo(0.25, 12);
    // The converter's mean loss over the day: 88 Wh ÷ 24 h = 3.6667 W (hand-worked).
    expect(c.rows.find((r) => r.id === 'psu')!.lossW).toBeCloseTo(88 / 24, 9);
    expect(c.overProfile).toMatchObject({ states: 2, hoursCovered: 24 });
    expect(formatLossCost(c)).toContain('losses over the load profile’s day');
  });

  it('a day/night tariff prices each stretch at its hours: 8.468 a year (mean 0.2636 per kWh)', () => {
    // Day price 0.30 from 07:00 to 23:00, night 0.10. Lamp on 18–22 (day): 48 Wh at 0.30. Idle 2 W over
    // 22–18: day hours 07–18 and 22–23 (12 h, 24 Wh at 0.30), night 23–07 (8 h, 16 Wh at 0.10).
    // A day: (48 + 24) × 0.30 + 16 × 0.10 = 23.2 (Wh × price), × 365 ÷ 1000 = 8.468 a year (hand-worked).
    const c = costOf(lampChain({ energyPricePerKWh: 0.3, nightPricePerKWh: 0.1, lossesFromProfile: true }));
    expect(c.totalCost).toBeCloseTo(8.468, 9);
    expect(c.totalEnergyKWh).toBeCloseTo(32.12, 9);
    expect(c.pricePerKWh).toBeCloseTo(8.468 / 32.12, 12);
  });

  it('a stretch across midnight is split at the clock: lamp 22:00–02:00, 6.278 a year', () => {
    // Day price 0.30 from 07:00 to 23:00, night 0.10. Lamp 12 W: 22–23 day (12 Wh), 23–02 night (36 Wh);
    // idle 2 W 02–22: 07–22 day (15 h, 30 Wh), 02–07 night (5 h, 10 Wh). A day: (12 + 30) × 0.30 +
    // (36 + 10) × 0.10 = 17.2, × 365 ÷ 1000 = 6.278 a year (hand-worked).
    const p = lampChain({ energyPricePerKWh: 0.3, nightPricePerKWh: 0.1, lossesFromProfile: true });
    (p.backup as unknown as { profile: unknown }).profile = { kind: 'daily', startHour: 22, segments: [{ startHour: 2, loads: { lamp: 0 } }, { startHour: 22, loads: { lamp: 90 } }] };
    const c = costOf(p);
    expect(c.totalEnergyKWh).toBeCloseTo(32.12, 9);
    expect(c.totalCost).toBeCloseTo(6.278, 9);
  });

  it('a profile with a problem of its own refuses the cost, naming the field (no quiet fall-back to the drawn point)', () => {
    // Bad input gets a message naming the field (common practice (no source)): segments must rise.
    const p = lampChain({ energyPricePerKWh: 0.25, lossesFromProfile: true });
    (p.backup as unknown as { profile: unknown }).profile = { kind: 'daily', startHour: 22, segments: [{ startHour: 22, loads: { lamp: 90 } }, { startHour: 2, loads: { lamp: 0 } }] };
    const solved = solvedOf(p);
    const o = lossCostOfSolved(solved, costSettingsOf(solved.project)!);
    expect(o.ok).toBe(false);
    if (!o.ok) expect(o.problems[0]).toMatchObject({ field: 'backup.profile.segments.1.startHour', message: 'start hours must rise from one segment to the next' });
  });

  it('fewer hours a year scale the day: 4380 h is half of it (16.06 kWh)', () => {
    // (h ÷ 24 h) days' worth: 4380 ÷ 24 = 182.5 days × 88 Wh (hand-worked).
    const c = costOf(lampChain({ energyPricePerKWh: 0.25, hoursPerYear: 4380, lossesFromProfile: true }));
    expect(c.totalEnergyKWh).toBeCloseTo(16.06, 9);
  });

  it('without the setting, the operating point as drawn is held all the hours (12 W × 8760 h = 105.12 kWh)', () => {
    // The lamp at its rated 90 W all year: 12 W × 8760 h (economics.ts, hand-worked).
    const p = lampChain({ energyPricePerKWh: 0.25 });
    const solved = solvedOf(p);
    expect(lossCostOverProfile(solved, costSettingsOf(solved.project)!)).toBeNull();
    const c = costOf(p);
    expect(c.totalEnergyKWh).toBeCloseTo(105.12, 9);
    expect(c.overProfile).toBeUndefined();
    // The same as lossCostPerYear at the solved point (one function, the same figure).
    const direct = lossCostPerYear(solved.result, costSettingsOf(solved.project)!);
    expect(direct.ok && direct.cost.totalCost).toBeCloseTo(c.totalCost, 12);
  });

  it('the cost over the years takes the same yearly figures (NPV of 10 years at 0 %: 10 × 8.468)', () => {
    // NPV at a 0 % discount rate is the sum of the years (core/studies/lifetime-money.ts; hand-worked).
    const solved = solvedOf(lampChain({ energyPricePerKWh: 0.3, nightPricePerKWh: 0.1, lossesFromProfile: true, years: 10 }));
    const life = lifetimeCost(solved);
    if (!life.ok) throw new Error(life.problems[0]!.message);
    expect(life.cost.losses.totalCost).toBeCloseTo(8.468, 9);
    expect(life.cost.npv).toBeCloseTo(84.68, 9);
    expect(life.cost.notes[0]).toContain("the losses worked out over the load profile's day (2 load states");
  });

  it('a variant in the comparison is worked out over its own profile, as its single solve is', () => {
    // Identity (no source needed): the column's yearly cost equals lossCostOfSolved of the variant's solve.
    const p = lampChain({ energyPricePerKWh: 0.25, lossesFromProfile: true });
    const variant = { name: 'Better converter', set: { psu: { loss: { efficiency: 0.95 } } } };
    const withVariant = { ...p, variants: [variant] } as Project;
    const solved = solvedOf(withVariant);
    const table = compareVariants(solved, withVariant.variants);
    const yearly = table.rows.find((r) => r.key === 'cost.yearly')!.values as number[];
    const v = solveProjectVariant(solved, variant);
    if (!v.ok) throw new Error('the variant does not solve');
    const single = lossCostOfSolved(v, costSettingsOf(v.project)!);
    expect(single.ok && yearly[1]).toBeCloseTo(single.ok ? single.cost.totalCost : NaN, 12);
    // Hand-worked: 90 × (1/0.95 − 1) + 2 = 6.7368 W on, 2 W off: 365 × (4 × 6.7368 + 40) Wh = 24.436 kWh × 0.25.
    expect(yearly[1]).toBeCloseTo((365 * (4 * (90 * (1 / 0.95 - 1) + 2) + 40) / 1000) * 0.25, 9);
    expect(yearly[0]).toBeCloseTo(8.03, 9);
    // Its working says how the losses were counted (the CLI under the table; the page reads the same flag).
    expect(table.lossesOverProfile).toBe(true);
    expect(formatVariantComparison(table, withVariant)).toContain("worked out over the load profile's day");
    const drawn = compareVariants(solvedOf(lampChain({ energyPricePerKWh: 0.25 })));
    expect(drawn.lossesOverProfile).toBe(false);
    // The answers strip's cost says so too (core/studies/answers.ts).
    const answers = answerStudies(solved, costSettingsOf(solved.project));
    expect(answers.cost.ok && answers.cost.overProfile).toBe(true);
  });

  it('each spread sample prices its own losses over the profile (zero tolerances: the single figure)', () => {
    // Identity (no source needed): the hillside demo (a bank and a daily profile) with the setting.
    const hill = JSON.parse(JSON.stringify(demoProjects.find((d) => d.id === 'hillside-relay-hut')!.project)) as Project;
    hill.running = { energyPricePerKWh: 0.3, nightPricePerKWh: 0.1, lossesFromProfile: true };
    const solved = solvedOf(hill);
    const single = lossCostOfSolved(solved, costSettingsOf(solved.project)!);
    if (!single.ok) throw new Error(single.problems[0]!.message);
    expect(single.cost.overProfile).toBeDefined();
    const zero = { capacityPercent: 0, agingPercent: 0, temperatureC: 0, efficiencyPoints: 0, loadPercent: 0, endVoltagePerCell: 0 };
    const r = runSpread(solved, { settings: { ...zero, samples: 5 } });
    if (!r.ok) throw new Error(r.problems[0]!.message);
    expect(r.value.costPerYear?.p50).toBeCloseTo(single.cost.totalCost, 12);
    // Over the profile the lights are on part of the day: less than the drawn point held all year.
    const drawn = lossCostPerYear(solved.result, costSettingsOf(solved.project)!);
    expect(drawn.ok && single.cost.totalEnergyKWh < drawn.cost.totalEnergyKWh).toBe(true);
  });
});
