/**
 * The day and night prices split as the load profile uses its day (core/model/tariff.ts
 * `profileDayHours`, core/studies/lifetime.ts `dayHoursFromProfile`), and a pump duty's hours a year
 * (`dutyHoursPerYear`): each against a case worked by hand beside it. Method (common practice (no
 * source)): energy-weighted mean price, p̄ = s·p_day + (1 − s)·p_night, s = the day's energy used
 * while the day price runs ÷ the day's energy.
 */
import { describe, expect, it } from 'vitest';
import { meanPrice, profileDayHours } from '../../core/model/tariff.ts';
import { solveProject } from '../../core/solve/index.ts';
import { dutyHoursPerYear, lifetimeCost } from '../../core/studies/lifetime.ts';
import { lampsChain } from './lamps-chain.ts';

/** The hand chain of tests/core/lifetime.test.ts (tests/core/lamps-chain.ts): 230 V supply, rectifier of constant 90 % (loses 100 W at the 900 W load), the load "Lamps". */
const chain = (running: Record<string, unknown>, backup?: unknown) => lampsChain('Profile split by hand', running, backup);

const RUNNING = { energyPricePerKWh: 0.3, nightPricePerKWh: 0.1, hoursPerYear: 8760, years: 10 };

describe('the day-price hours from a profile’s energy', () => {
  it('100 W 0–8 h, 1000 W 8–18 h, 200 W 18–24 h with the day price 7–23 h: 92.5 % by day, 22.2 h of 24', () => {
    // By hand: day energy 100 × 1 + 1000 × 10 + 200 × 5 = 11 100 Wh of 800 + 10 000 + 1200 = 12 000 Wh: s = 0.925; 24 × 0.925 = 22.2 h.
    const split = profileDayHours(
      [
        { fromHour: 0, toHour: 8, watts: 100 },
        { fromHour: 8, toHour: 18, watts: 1000 },
        { fromHour: 18, toHour: 24, watts: 200 },
      ],
      7,
      23,
    )!;
    expect(split.dayShare).toBeCloseTo(0.925, 12);
    expect(split.dayHours).toBeCloseTo(22.2, 12);
    // Mean price 0.925 × 0.30 + 0.075 × 0.10 = 0.2775 + 0.0075 = 0.285 per kWh.
    expect(meanPrice({ dayPricePerKWh: 0.3, nightPricePerKWh: 0.1, dayStartHour: 0, dayEndHour: split.dayHours }).pricePerKWh).toBeCloseTo(0.285, 12);
  });

  it('a profile that uses no energy gives no split', () => {
    expect(profileDayHours([{ fromHour: 0, toHour: 24, watts: 0 }], 7, 23)).toBeNull();
  });

  it('the lifetime cost takes it: lamps on 20:00–06:00 put 3 h of their 10 in the day price (7–23 h)', () => {
    // By hand: s = 3 / 10 = 0.3, 7.2 day hours; mean 0.3 × 0.30 + 0.7 × 0.10 = 0.16 per kWh;
    // 100 W × 8760 h = 876 kWh a year, × 0.16 = 140.16 a year (the losses taken to follow the load).
    const backup = {
      profile: {
        kind: 'daily',
        segments: [
          { startHour: 0, loads: { lamp: true } },
          { startHour: 6, loads: { lamp: false } },
          { startHour: 20, loads: { lamp: true } },
        ],
      },
    };
    const s = solveProject(chain({ ...RUNNING, dayHoursFromProfile: true }, backup));
    if (!s.ok) throw new Error(JSON.stringify(s.problems));
    const c = lifetimeCost(s);
    if (!c.ok) throw new Error(JSON.stringify(c.problems));
    expect(c.cost.dayHoursFrom).toBe('load profile');
    expect(c.cost.dayHours).toBeCloseTo(7.2, 9);
    expect(c.cost.pricePerKWh).toBeCloseTo(0.16, 12);
    expect(c.cost.losses.totalCost).toBeCloseTo(140.16, 6);
    expect(c.cost.notes[0]).toMatch(/load profile's day uses 30 % of its energy while the day price runs/);
    // Without the choice the hours are spread evenly: (16 × 0.30 + 8 × 0.10) / 24 = 0.23333 per kWh.
    const even = solveProject(chain(RUNNING, backup));
    if (!even.ok) throw new Error(JSON.stringify(even.problems));
    const e = lifetimeCost(even);
    if (!e.ok) throw new Error(JSON.stringify(e.problems));
    expect(e.cost.dayHoursFrom).toBe('tariff hours');
    expect(e.cost.pricePerKWh).toBeCloseTo(5.6 / 24, 12);
  });

  it('asked for without a profile, the hours stay spread evenly and the working says so', () => {
    const s = solveProject(chain({ ...RUNNING, dayHoursFromProfile: true }));
    if (!s.ok) throw new Error(JSON.stringify(s.problems));
    const c = lifetimeCost(s);
    if (!c.ok) throw new Error(JSON.stringify(c.problems));
    expect(c.cost.dayHoursFrom).toBe('tariff hours');
    expect(c.cost.pricePerKWh).toBeCloseTo(5.6 / 24, 12);
    expect(c.cost.notes.join(' ')).toMatch(/spread evenly: the project has no load profile/);
  });

  it('a file with a wrong value for the choice is refused at its field', () => {
    const s = solveProject(chain({ ...RUNNING, dayHoursFromProfile: 'yes' }));
    expect(s.ok).toBe(false);
    if (!s.ok) expect(s.problems.map((p) => p.field)).toContain('running.dayHoursFromProfile');
  });
});

describe('a pump duty’s hours a year', () => {
  it('is the sum of its duty points’ hours: 2000 + 3000 + 1000 = 6000 h', () => {
    // By hand: the duty's hours at each flow add up to the hours the pump runs a year.
    expect(dutyHoursPerYear({ pumpDuty: { pump: 'p', duty: [{ flow: 0.01, hours: 2000 }, { flow: 0.02, hours: 3000 }, { flow: 0.03, hours: 1000 }] } })).toBe(6000);
    expect(dutyHoursPerYear({})).toBeNull();
  });
});
