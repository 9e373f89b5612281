// Axis arithmetic of the page's charts (web/components/charts/scale.ts) and the display helpers the
// panels use (durations, money, AWG words). Tick values follow Heckbert's nice-numbers method
// (Graphics Gems, 1990), worked by hand here; AWG areas from the ASTM B258-18 gauge formula and
// NEC (NFPA 70, 2023) Chapter 9 Table 8.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { linearScale, linePath, niceNumber, niceTicks, sampleEvery, thinIndices, timeTicksHours } from '../../web/components/charts/scale.ts';
import { formatDuration, UNIT_GAP as g } from '../../web/format/number.ts';
import { currencyForLocale, formatMoney } from '../../web/format/panels.ts';

describe('nice ticks (Heckbert, Graphics Gems 1990)', () => {
  it('nice numbers: 1, 2, 5 × 10^n', () => {
    // Hand-worked: 0.37 rounds to 0.5 (f = 3.7 → 5); 37 taken up is 50; 12 rounds to 10; 0.0021 up is 0.005.
    expect(niceNumber(0.37, true)).toBeCloseTo(0.5, 12);
    expect(niceNumber(37, false)).toBe(50);
    expect(niceNumber(12, true)).toBe(10);
    expect(niceNumber(0.0021, false)).toBeCloseTo(0.005, 12);
  });

  it('state of charge 10 %…100 % gets ticks at 0, 0.5, 1 (hand-worked: range 0.9 → 1, step 1/3 → 0.5)', () => {
    expect(niceTicks(0.1, 1, 3).ticks).toEqual([0, 0.5, 1]);
  });

  it('terminal voltage 51.16…53.4 V gets 50, 52, 54 (hand-worked)', () => {
    const t = niceTicks(51.16, 53.4, 4);
    // range 2.24 taken up is 5; 5/3 = 1.67 rounds to 2: ticks 50, 52, 54.
    expect(t.ticks).toEqual([50, 52, 54]);
    expect(t.min).toBeLessThanOrEqual(51.16);
    expect(t.max).toBeGreaterThanOrEqual(53.4);
  });

  it('a flat series still gets an axis around its value', () => {
    const t = niceTicks(48, 48, 4);
    expect(t.min).toBeLessThan(48);
    expect(t.max).toBeGreaterThan(48);
  });

  it('ticks cover the data, rise evenly and carry no round-off (property)', () => {
    fc.assert(
      fc.property(fc.double({ min: -1e6, max: 1e6, noNaN: true }), fc.double({ min: 1e-3, max: 1e6, noNaN: true }), fc.integer({ min: 2, max: 8 }), (lo, span, count) => {
        const t = niceTicks(lo, lo + span, count);
        if (!(t.min <= lo + 1e-9 * Math.abs(lo) + 1e-12 && t.max >= lo + span - 1e-9 * Math.abs(lo + span) - 1e-12)) return false;
        for (let i = 1; i < t.ticks.length; i++) {
          if (Math.abs(t.ticks[i]! - t.ticks[i - 1]! - t.step) > 1e-6 * t.step) return false;
        }
        return t.ticks.every((v) => String(v).length < 20);
      }),
    );
  });
});

describe('time axis in hours', () => {
  it('27 h 40 min at most 6 intervals: 6 h steps to 30 h (hand-worked: 27.67/3 > 6, 27.67/6 ≤ 6)', () => {
    const t = timeTicksHours(27 * 3600 + 40 * 60, 6);
    expect(t.step).toBe(6);
    expect(t.ticks).toEqual([0, 6, 12, 18, 24, 30]);
  });

  it('45 min: quarter hours', () => {
    expect(timeTicksHours(45 * 60, 6).ticks).toEqual([0, 0.25, 0.5, 0.75]);
  });

  it('96 h: 24 h steps', () => {
    expect(timeTicksHours(96 * 3600, 6).ticks).toEqual([0, 24, 48, 72, 96]);
  });
});

describe('scales, paths and thinning', () => {
  it('linear scale maps ends to ends and inverts a y axis', () => {
    const y = linearScale(0, 1, 100, 0);
    expect(y(0)).toBe(100);
    expect(y(1)).toBe(0);
    expect(y(0.25)).toBe(75);
    expect(linearScale(5, 5, 0, 10)(5)).toBe(5);
  });

  it('path: M then L, rounded to 0.1 px', () => {
    expect(linePath([0, 10.04, 20], [5, 6.06, 7])).toBe('M0 5L10 6.1L20 7');
  });

  it('thinning keeps the first, the last and every bucket’s extremes', () => {
    const values = Array.from({ length: 1000 }, (_, i) => (i === 500 ? 99 : i === 700 ? -99 : Math.sin(i / 50)));
    const kept = thinIndices(values, 100);
    expect(kept.length).toBeLessThanOrEqual(100);
    expect(kept[0]).toBe(0);
    expect(kept.at(-1)).toBe(999);
    expect(kept).toContain(500);
    expect(kept).toContain(700);
    expect([...kept].sort((a, b) => a - b)).toEqual(kept);
    expect(thinIndices([1, 2, 3], 100)).toEqual([0, 1, 2]);
  });

  it('table rows every hour, plus the last point', () => {
    const time = Array.from({ length: 181 }, (_, i) => i * 60); // 0…3 h at 1 min
    expect(sampleEvery(time, 3600)).toEqual([0, 60, 120, 180]);
    const uneven = [0, 1000, 3500, 3700, 7300, 7400];
    expect(sampleEvery(uneven, 3600)).toEqual([0, 3, 4, 5]);
  });
});

describe('durations and money for the panels', () => {
  it('durations in hours and minutes', () => {
    expect(formatDuration(27 * 3600 + 40 * 60, 'en-US')).toBe(`27${g}h 40${g}min`);
    expect(formatDuration(45 * 60, 'en-US')).toBe(`45${g}min`);
    expect(formatDuration(3599.9, 'en-US')).toBe(`1${g}h 00${g}min`);
    expect(formatDuration(100 * 3600, 'en-US')).toBe(`4${g}d 4${g}h`);
    expect(formatDuration(Number.NaN, 'en-US')).toBe('—');
  });

  it('money in the locale’s currency, or a plain number', () => {
    expect(currencyForLocale('en-US')).toBe('USD');
    expect(currencyForLocale('de-DE')).toBe('EUR');
    expect(currencyForLocale('pt-BR')).toBe('BRL');
    expect(formatMoney(1234.5, 'en-US')).toBe('$1,234.50');
    expect(formatMoney(1234.5, 'de-DE')).toMatch(/^1\.234,50\s€$/);
    expect(formatMoney(Number.POSITIVE_INFINITY, 'en-US')).toBe('—');
  });

});
