/**
 * Reading component values with SI prefixes (core/physics/si-prefix.ts).
 * Expected values: the prefix factors of the BIPM SI Brochure, 9th edition (2019), Table 7
 * (f 1e-15, p 1e-12, n 1e-9, µ 1e-6, m 1e-3, k 1e3, M 1e6, G 1e9), applied by hand.
 */
import { describe, expect, it } from 'vitest';
import { formatSi, parseSiValue, type ElementUnit } from '../../core/physics/si-prefix.ts';

const REL = 1e-15;

describe('parseSiValue: accepted spellings (SI Brochure Table 7 factors)', () => {
  const cases: [unknown, ElementUnit, number][] = [
    [12, 'Ω', 12], // a number is already in the base unit
    [4.7e-3, 'H', 4.7e-3],
    ['12 Ω', 'Ω', 12], // U+03A9
    ['12 Ω', 'Ω', 12], // U+2126 OHM SIGN
    ['12Ω', 'Ω', 12],
    ['1.2 kΩ', 'Ω', 1200],
    ['10k', 'Ω', 10_000],
    ['2.2M', 'Ω', 2.2e6],
    ['470 mΩ', 'Ω', 0.47],
    ['0.5 ohm', 'Ω', 0.5],
    ['3 ohms', 'Ω', 3],
    ['1 kohm', 'Ω', 1000],
    ['4.7 mH', 'H', 4.7e-3],
    ['4.7mH', 'H', 4.7e-3],
    ['4.7 mh', 'H', 4.7e-3], // lower-case unit after a prefix
    ['250 µH', 'H', 250e-6], // U+00B5 MICRO SIGN
    ['250 μH', 'H', 250e-6], // U+03BC GREEK SMALL LETTER MU
    ['250 uH', 'H', 250e-6],
    ['2 H', 'H', 2],
    ['220 µF', 'F', 220e-6],
    ['220 uF', 'F', 220e-6],
    ['220 uf', 'F', 220e-6],
    ['47n', 'F', 47e-9],
    ['47 nF', 'F', 47e-9],
    ['100 pF', 'F', 100e-12],
    ['3.3e-6', 'F', 3.3e-6],
    ['1e3 µF', 'F', 1e-3],
    ['.5 F', 'F', 0.5],
    ['1 fF', 'F', 1e-15],
    ['  68 kΩ  ', 'Ω', 68_000],
    ['1 GΩ', 'Ω', 1e9],
  ];
  it.each(cases)('%j as %s → %d', (input, unit, want) => {
    const r = parseSiValue(input, unit);
    expect(r.ok, JSON.stringify(r)).toBe(true);
    if (r.ok) expect(Math.abs(r.value - want)).toBeLessThanOrEqual(REL * want);
  });

  it('zero and negative values parse (the network, not the parser, says what range it needs)', () => {
    expect(parseSiValue('0 F', 'F')).toEqual({ ok: true, value: 0 });
    expect(parseSiValue('-5 mH', 'H')).toEqual({ ok: true, value: -5e-3 });
  });
});

describe('parseSiValue: refused with a message', () => {
  const cases: [unknown, ElementUnit, RegExp][] = [
    ['4.7 xH', 'H', /unknown prefix "x"/],
    ['5 mH', 'F', /is in henries \(H\); this value is in farads/],
    ['5 µF', 'H', /is in farads \(F\); this value is in henries/],
    ['1 kΩ', 'F', /is in ohms/],
    ['4k7', 'Ω', /unknown prefix or unit "k7"/],
    ['10 meg', 'Ω', /unknown prefix or unit "meg"/],
    ['ten ohms', 'Ω', /does not start with a number/],
    ['', 'F', /does not start with a number/],
    [NaN, 'F', /finite number of farads/],
    [Infinity, 'H', /finite number of henries/],
    [null, 'Ω', /must be a number of ohms/],
    [true, 'F', /must be a number of farads/],
    [{ value: 3 }, 'F', /must be a number of farads/],
    ['1e400 F', 'F', /too large/],
    ['2 h', 'H', /unknown prefix or unit "h"/], // "h" alone is neither a prefix nor the unit H
  ];
  it.each(cases)('%j as %s', (input, unit, message) => {
    const r = parseSiValue(input, unit);
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.message).toMatch(message);
  });
});

describe('formatSi', () => {
  it('writes engineering notation that parses back to the same value', () => {
    // Worked by hand: 4.7e-3 → 4.7 m, 220e-6 → 220 µ, 1200 → 1.2 k, 0 → 0.
    expect(formatSi(4.7e-3, 'H')).toBe('4.7 mH');
    expect(formatSi(220e-6, 'F')).toBe('220 µF');
    expect(formatSi(1200, 'Ω')).toBe('1.2 kΩ');
    expect(formatSi(0, 'F')).toBe('0 F');
    for (const [v, u] of [
      [3.3e-9, 'F'],
      [0.0155, 'H'],
      [47_000, 'Ω'],
      [1.5e-13, 'F'],
    ] as const) {
      const back = parseSiValue(formatSi(v, u, 12), u);
      expect(back.ok && Math.abs(back.value - v) <= 1e-12 * v).toBe(true);
    }
  });
});
