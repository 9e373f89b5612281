/**
 * A ± temperature tolerance (the runtime spread's cell temperature range) in the user's units: a
 * difference converts by 9/5 with no offset, unlike a temperature.
 */
import { describe, expect, it } from 'vitest';
import { fromSi, inputUnit, readNumberField, toSi } from '../../web/format/parse.ts';

describe('temperature differences', () => {
  it('± 5 °C is ± 9 °F; a temperature of 5 °C is 41 °F (NIST SP 811, 2008 ed., B.9: 1 °F = 5/9 K, t_F = 1.8·t_C + 32)', () => {
    expect(fromSi('temperature-difference', 'us', 5)).toBe(9);
    expect(toSi('temperature-difference', 'us', 9)).toBe(5);
    expect(fromSi('temperature', 'us', 5)).toBe(41);
    expect(fromSi('temperature-difference', 'si', 5)).toBe(5);
    expect(inputUnit('temperature-difference', 'us').symbol).toBe('°F');
    expect(inputUnit('temperature-difference', 'si').symbol).toBe('°C');
  });

  it('a typed ± 18 °F is stored as 10 °C of difference', () => {
    // 18 / 1.8 = 10 (NIST SP 811 B.9, as above).
    const r = readNumberField('18', { label: 'Cell temperature range (± °F)', quantity: 'temperature-difference', required: false }, 'us', 'en-US');
    expect(r).toEqual({ ok: true, value: 10 });
  });
});
