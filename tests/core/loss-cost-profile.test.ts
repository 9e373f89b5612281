/**
 * The yearly cost of the losses with the day and night prices split as the load profile uses its day
 * (core/studies/economics.ts `withProfilePrice`, `tariffPrice`): the same mean price as the cost over
 * the years (core/studies/lifetime.ts), worked by hand. Method (common practice (no source)):
 * energy-weighted mean price p̄ = s·p_day + (1 − s)·p_night, s = the share of the profile's day energy
 * used while the day price runs; energy of the losses E = P_loss × hours, cost = E × p̄.
 */
import { describe, expect, it } from 'vitest';
import { solveProject } from '../../core/solve/index.ts';
import { costSettingsOf, costSettingsOfSolved, formatLossCost, lossCostPerYear, tariffPrice, withProfilePrice } from '../../core/studies/economics.ts';
import { lifetimeCost } from '../../core/studies/lifetime.ts';
import { answerStudies } from '../../core/studies/answers.ts';
import type { Solved } from '../../core/solve/solved.ts';
import { compareVariants } from '../../core/studies/variants/compare.ts';
import { lampsChain } from './lamps-chain.ts';

/** The lamps chain (tests/core/lamps-chain.ts). Lamps on 16:00–02:00 (10 h a day): 7 h of them (16–23 h) in the day price's hours (7–23 h), 3 h at night. */
const chain = (running: Record<string, unknown>) =>
  lampsChain('Loss cost by the profile', running, {
    profile: {
      kind: 'daily',
      segments: [
        { startHour: 0, loads: { lamp: true } },
        { startHour: 2, loads: { lamp: false } },
        { startHour: 16, loads: { lamp: true } },
      ],
    },
  });

const RUNNING = { energyPricePerKWh: 0.3, nightPricePerKWh: 0.1, hoursPerYear: 8760, years: 10 };

function solved(running: Record<string, unknown>): Solved {
  const s = solveProject(chain(running));
  if (!s.ok) throw new Error(JSON.stringify(s.problems));
  return s;
}

describe('the yearly cost of the losses under the profile’s day', () => {
  const split = solved({ ...RUNNING, dayHoursFromProfile: true });

  it('70 % of the profile’s energy in the day hours at 0.30, 30 % at 0.10: 0.24 per kWh (by hand)', () => {
    // By hand: s = 7 h / 10 h = 0.7; p̄ = 0.7 × 0.30 + 0.3 × 0.10 = 0.21 + 0.03 = 0.24 per kWh; 24 × 0.7 = 16.8 day hours.
    const t = tariffPrice(split, { dayPricePerKWh: 0.3, nightPricePerKWh: 0.1, dayStartHour: 7, dayEndHour: 23, dayHoursFromProfile: true });
    expect(t.split!.dayShare).toBeCloseTo(0.7, 12);
    expect(t.dayHours).toBeCloseTo(16.8, 12);
    expect(t.pricePerKWh).toBeCloseTo(0.24, 12);
    const cost = withProfilePrice(split, costSettingsOf(split.project)!);
    expect(cost.pricePerKWh).toBeCloseTo(0.24, 12);
    expect(cost.profileDayShare).toBeCloseTo(0.7, 12);
    // 100 W × 8760 h = 876 kWh a year; × 0.24 = 210.24 a year (by hand).
    const lc = lossCostPerYear(split.result, cost);
    if (!lc.ok) throw new Error(JSON.stringify(lc.problems));
    expect(lc.cost.totalEnergyKWh).toBeCloseTo(876, 9);
    expect(lc.cost.totalCost).toBeCloseTo(210.24, 9);
    expect(formatLossCost(lc.cost)).toContain("at 0.24 per kWh, the day and night prices' mean as the load profile's day uses them (70 % of its energy in the day-price hours)");
  });

  it('the two sections agree: the cost over the years and the answers take the same figure', () => {
    const lc = lossCostPerYear(split.result, withProfilePrice(split, costSettingsOf(split.project)!));
    const life = lifetimeCost(split);
    if (!lc.ok || !life.ok) throw new Error('refused');
    expect(life.cost.dayHoursFrom).toBe('load profile');
    expect(life.cost.pricePerKWh).toBe(lc.cost.pricePerKWh);
    expect(life.cost.losses.totalCost).toBe(lc.cost.totalCost);
    const answers = answerStudies(split, costSettingsOf(split.project));
    expect(answers.cost.ok && answers.cost.cost).toBe(lc.cost.totalCost);
  });

  it('every study that costs the losses takes the same price: the comparison of options prints and uses 0.24 per kWh', () => {
    // costSettingsOfSolved is what the option search and the modes study's standing cost read (economics.ts).
    expect(costSettingsOfSolved(split)!.pricePerKWh).toBeCloseTo(0.24, 12); // by hand, above
    const c = compareVariants(split, [{ name: 'Bigger lamps', set: { lamp: { power: 1800 } } }]);
    expect(c.cost!.pricePerKWh).toBeCloseTo(0.24, 12);
    const yearly = c.rows.find((r) => r.key === 'cost.yearly')!;
    // As planned 100 W of losses: 210.24 a year (by hand, above); 1800 W of lamps at 90 %: 200 W, the profile's split unchanged: 420.48.
    expect(yearly.values[0]).toBeCloseTo(210.24, 9);
    expect(yearly.values[1]).toBeCloseTo(420.48, 9);
  });

  it('unticked, the hours stay spread evenly over the day in both: (16 × 0.30 + 8 × 0.10) / 24 per kWh', () => {
    const even = solved(RUNNING);
    const cost = withProfilePrice(even, costSettingsOf(even.project)!);
    expect(cost.profileDayShare).toBeUndefined();
    expect(cost.pricePerKWh).toBeCloseTo(5.6 / 24, 12); // time-weighted mean, by hand
    const life = lifetimeCost(even);
    if (!life.ok) throw new Error('refused');
    expect(life.cost.pricePerKWh).toBe(cost.pricePerKWh);
  });

  it('a price without a night price is left as it is', () => {
    const one = solved({ energyPricePerKWh: 0.3, hoursPerYear: 8760, dayHoursFromProfile: true });
    expect(withProfilePrice(one, costSettingsOf(one.project)!)).toEqual({ pricePerKWh: 0.3, hoursPerYear: 8760 });
  });
});
