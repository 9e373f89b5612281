/**
 * Laws of the cost over the years (core/studies/lifetime.ts), for any costs:
 * - the net present value of positive end-of-year costs falls as the discount rate rises (each
 *   present-worth factor 1/(1 + r)^t falls with r, t ≥ 1);
 * - an option against itself has no break-even year and no payback (neither costs more to buy);
 * - at 0 % with a steady saving the break-even year is the simple payback rounded up (cumulative
 *   saving s·t reaches the extra purchase first at t = ⌈Δ/s⌉), when that falls within the years;
 * - the fuel curve's interpolation meets the maker's points and lies between its neighbours.
 * No outside source: laws of the methods themselves (engineering-economy definitions, from memory).
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { breakEven, fuelRate, netPresentValue } from '../../core/studies/lifetime.ts';

const runs = { numRuns: 300, seed: 20 };
const money = fc.double({ min: 0.01, max: 1e6, noNaN: true, noDefaultInfinity: true });
const rate = fc.double({ min: 0, max: 1, noNaN: true });

describe('net present value', () => {
  it('falls as the discount rate rises, for positive yearly costs', () => {
    fc.assert(
      fc.property(fc.double({ min: 0, max: 1e6, noNaN: true }), fc.array(money, { minLength: 1, maxLength: 40 }), rate, rate, (purchase, yearly, r1, r2) => {
        fc.pre(Math.abs(r1 - r2) > 1e-6);
        const [lo, hi] = r1 < r2 ? [r1, r2] : [r2, r1];
        expect(netPresentValue(purchase, yearly, hi)).toBeLessThan(netPresentValue(purchase, yearly, lo));
      }),
      runs,
    );
  });
});

describe('break-even', () => {
  it('of an option against itself is none', () => {
    fc.assert(
      fc.property(money, fc.array(money, { minLength: 0, maxLength: 40 }), rate, (purchase, yearly, r) => {
        const o = { purchase, yearly };
        expect(breakEven(o, o, r)).toMatchObject({ dearerToBuy: null, breakEvenYear: null, simplePaybackYears: null });
      }),
      runs,
    );
  });
  it('at 0 % with a steady saving is the simple payback rounded up', () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 10_000 }), fc.integer({ min: 1, max: 1000 }), fc.integer({ min: 0, max: 1000 }), fc.integer({ min: 1, max: 50 }), (extra, saving, dearYearly, years) => {
        const cheap = { purchase: 1000, yearly: Array.from({ length: years }, () => dearYearly + saving) };
        const dear = { purchase: 1000 + extra, yearly: Array.from({ length: years }, () => dearYearly) };
        const r = breakEven(cheap, dear, 0);
        expect(r.simplePaybackYears).toBeCloseTo(extra / saving, 9);
        const t = Math.ceil(extra / saving);
        expect(r.breakEvenYear).toBe(t <= years ? t : null);
      }),
      runs,
    );
  });
});

describe('fuel curve', () => {
  it('meets the points and lies between its neighbours', () => {
    const litres = fc.double({ min: 0.1, max: 1000, noNaN: true });
    fc.assert(
      fc.property(litres, litres, litres, fc.double({ min: 0.25, max: 1, noNaN: true }), (a, b, c, x) => {
        const [q, h, f] = [a, b, c].sort((u, v) => u - v) as [number, number, number];
        const g = { quarterLoadLitresPerHour: q, halfLoadLitresPerHour: h, fullLoadLitresPerHour: f };
        expect(fuelRate(g, 0.25)).toBeCloseTo(q, 9);
        expect(fuelRate(g, 0.5)).toBeCloseTo(h, 9);
        expect(fuelRate(g, 1)).toBeCloseTo(f, 9);
        const y = fuelRate(g, x)!;
        expect(y).toBeGreaterThanOrEqual(q * (1 - 1e-12));
        expect(y).toBeLessThanOrEqual(f * (1 + 1e-12));
      }),
      runs,
    );
  });
});
