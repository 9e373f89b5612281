// Reading typed numbers (web/format/parse.ts): locale separators and the input units' conversions to SI.
// Locale separators are those of Unicode CLDR (en: decimal ".", group ","; de: decimal ",", group ".";
// fr: decimal ",", group U+202F NARROW NO-BREAK SPACE since CLDR 34; en-IN: 2-digit secondary groups).
// Conversion factors: NIST SP 811 (2008 ed.) Appendix B.8 (foot, gallon [U.S.], pound, horsepower
// 550 ft·lbf/s = 745.7 W as NEMA MG 1 rates motors) and B.9 (°F); the hour is 3600 s (SI Brochure, 9th ed., Table 8).
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  CUBIC_METRES_PER_SECOND_PER_GPM,
  KG_PER_M3_PER_LB_PER_FT3,
  formatForInput,
  fromSi,
  inputText,
  inputUnit,
  localeSeparators,
  parseLocaleNumber,
  readNumberField,
  toSi,
} from '../../web/format/parse.ts';

const num = (text: string, locale: string) => {
  const r = parseLocaleNumber(text, locale);
  return r.kind === 'number' ? r.value : r.kind;
};

describe('numbers in the user’s locale', () => {
  it('reads the separators from Intl (CLDR)', () => {
    expect(localeSeparators('en-US')).toEqual({ decimal: '.', group: ',', secondaryGroup: 3 }); // CLDR en
    expect(localeSeparators('de-DE')).toEqual({ decimal: ',', group: '.', secondaryGroup: 3 }); // CLDR de
    expect(localeSeparators('fr-FR')).toEqual({ decimal: ',', group: '\u202f', secondaryGroup: 3 }); // CLDR fr (≥ 34)
    expect(localeSeparators('en-IN').secondaryGroup).toBe(2); // CLDR en-IN: #,##,##0.###
  });

  it('en-US: point decimals, comma groups (CLDR en)', () => {
    expect(num('1,234.5', 'en-US')).toBe(1234.5);
    expect(num('1234.5', 'en-US')).toBe(1234.5);
    expect(num('0.95', 'en-US')).toBe(0.95);
    expect(num('.5', 'en-US')).toBe(0.5);
    expect(num('-12', 'en-US')).toBe(-12);
    expect(num('\u221212.5', 'en-US')).toBe(-12.5); // U+2212 MINUS SIGN as some locales print it
    expect(num('1e-3', 'en-US')).toBe(0.001);
    expect(num('  230  ', 'en-US')).toBe(230);
    expect(num('12,34', 'en-US')).toBe('invalid'); // not a group of three
    expect(num('1,234,5', 'en-US')).toBe('invalid');
  });

  it('de-DE: comma decimals, point groups (CLDR de)', () => {
    expect(num('1.234,5', 'de-DE')).toBe(1234.5);
    expect(num('0,95', 'de-DE')).toBe(0.95);
    expect(num('1234', 'de-DE')).toBe(1234);
    expect(num('1.234', 'de-DE')).toBe(1234);
    // "1.5" is neither a decimal nor a grouped integer here: refused, never guessed.
    const r = parseLocaleNumber('1.5', 'de-DE');
    expect(r).toEqual({ kind: 'invalid', problem: expect.stringContaining('decimals take a comma') });
  });

  it('fr-FR: comma decimals, narrow no-break space groups (CLDR fr)', () => {
    expect(num('1\u202f234,5', 'fr-FR')).toBe(1234.5);
    expect(num('1 234,5', 'fr-FR')).toBe(1234.5); // a plain space typed on a keyboard
    expect(num('1\u00a0234\u00a0567,25', 'fr-FR')).toBe(1234567.25); // no-break space (older CLDR)
    expect(num('0,5', 'fr-FR')).toBe(0.5);
    const r = parseLocaleNumber('0.5', 'fr-FR');
    expect(r.kind).toBe('invalid');
  });

  it('en-IN: lakh grouping 12,34,567 (CLDR en-IN)', () => {
    expect(num('12,34,567.5', 'en-IN')).toBe(1234567.5);
    expect(num('1,234', 'en-IN')).toBe(1234);
  });

  it('refuses what is not a number and says empty when empty', () => {
    for (const bad of ['abc', '23o', '1..2', '--1', 'e5', '1e', '12 V', ',', '.']) expect(num(bad, 'en-US')).toBe('invalid');
    expect(num('', 'en-US')).toBe('empty');
    expect(num('   ', 'de-DE')).toBe('empty');
    expect(num('1e400', 'en-US')).toBe('invalid'); // beyond double range: never Infinity
  });

  it('round-trips every finite double through the input text (property)', () => {
    for (const locale of ['en-US', 'de-DE', 'fr-FR', 'en-IN']) {
      fc.assert(
        fc.property(fc.double({ noNaN: true, noDefaultInfinity: true, min: -1e12, max: 1e12 }), (x) => {
          const text = formatForInput(x, locale);
          const back = parseLocaleNumber(text, locale);
          expect(back.kind).toBe('number');
          const v = (back as { value: number }).value;
          // 12 significant digits shown (web/format/parse.ts formatForInput).
          expect(Math.abs(v - x)).toBeLessThanOrEqual(Math.abs(x) * 1e-11 + 1e-300);
        }),
      );
    }
  });
});

describe('input units and exact conversions to SI', () => {
  it('length: 1 ft = 0.3048 m (NIST SP 811, B.8)', () => {
    expect(toSi('length', 'us', 1)).toBe(0.3048);
    expect(toSi('length', 'us', 100)).toBe(30.48);
    expect(toSi('length', 'us', 328)).toBe(99.9744); // 328 × 0.3048
    expect(fromSi('length', 'us', 30.48)).toBe(100);
    expect(toSi('length', 'si', 25)).toBe(25);
    expect(inputUnit('length', 'us').symbol).toBe('ft');
    expect(toSi('head', 'us', 82)).toBe(24.9936); // 82 × 0.3048
  });

  it('temperature: °C = (°F − 32)/1.8 (NIST SP 811, B.9)', () => {
    expect(toSi('temperature', 'us', 86)).toBe(30);
    expect(toSi('temperature', 'us', 32)).toBe(0);
    expect(toSi('temperature', 'us', -40)).toBe(-40);
    expect(toSi('temperature', 'us', 104)).toBe(40);
    expect(fromSi('temperature', 'us', 30)).toBe(86);
  });

  it('shaft power: 1 hp = 745.7 W (NIST SP 811, B.8, 550 ft·lbf/s; NEMA MG 1 ratings); SI in kW', () => {
    expect(toSi('shaft-power', 'us', 1)).toBe(745.7);
    expect(toSi('shaft-power', 'us', 40)).toBe(29828); // 40 × 745.7
    expect(fromSi('shaft-power', 'us', 7457)).toBe(10);
    expect(toSi('shaft-power', 'si', 7.5)).toBe(7500);
    expect(toSi('shaft-power', 'si', 1.1)).toBe(1100); // not 1100.0000000000002
  });

  it('flow: 1 US gpm = 3.785411784 L/min (NIST SP 811, B.8, gallon [U.S.] = 231 in³); m³/h ÷ 3600', () => {
    expect(CUBIC_METRES_PER_SECOND_PER_GPM).toBeCloseTo(6.30901964e-5, 16); // 3.785411784e-3 / 60
    expect(toSi('flow', 'us', 100)).toBe(0.00630901964); // 100 gpm = 378.5411784 L/min
    expect(toSi('flow', 'si', 342)).toBe(0.095); // 342 m³/h ÷ 3600 s/h
    expect(fromSi('flow', 'si', 0.095)).toBe(342);
    expect(inputUnit('flow', 'us').symbol).toBe('gpm');
  });

  it('density: 1 lb/ft³ = 16.018463… kg/m³ (NIST SP 811, B.8, pound and foot)', () => {
    expect(KG_PER_M3_PER_LB_PER_FT3).toBeCloseTo(16.01846337, 8); // NIST SP 811 B.8 lists 1.601846E+01
    expect(toSi('density', 'us', 62.4)).toBeCloseTo(999.55, 2); // fresh water ≈ 62.4 lb/ft³ (common practice)
  });

  it('resistance per length: Ω/km = (Ω per 1000 ft) / 0.3048 (NEC Chapter 9 Table 8 prints Ω/kFT)', () => {
    // 4 AWG uncoated copper: 0.308 Ω/kFT = 1.01 Ω/km (NEC 2023 Chapter 9 Table 8, both columns printed).
    expect(toSi('resistance-per-length', 'us', 0.308)).toBeCloseTo(1.0105, 4);
    expect(toSi('resistance-per-length', 'us', 0.3048)).toBe(1);
  });

  it('fractions typed as per cent are divided exactly by 100', () => {
    expect(toSi('fraction-percent', 'si', 95)).toBe(0.95);
    expect(toSi('fraction-percent', 'us', 96.5)).toBe(0.965);
    expect(fromSi('fraction-percent', 'si', 0.965)).toBe(96.5);
    expect(fromSi('fraction-percent', 'si', 0.07)).toBe(7); // 0.07 × 100 = 7.000000000000001 before rounding
    expect(toSi('percent', 'si', 4.5)).toBe(4.5); // already in per cent (transformer impedance)
  });
});

describe('number fields', () => {
  const voltage = { label: 'Output voltage', quantity: 'voltage' as const, required: true };
  it('names the field and the problem', () => {
    expect(readNumberField('23o', voltage, 'si', 'en-US')).toEqual({ ok: false, message: "Output voltage: '23o' is not a number" });
    expect(readNumberField('', voltage, 'si', 'en-US')).toEqual({ ok: false, message: 'Output voltage: is required' });
    expect(readNumberField('', { ...voltage, required: false }, 'si', 'en-US')).toEqual({ ok: true, value: undefined });
    expect(readNumberField('2.5', { label: 'Cells in series', quantity: 'count', required: true, integer: true }, 'si', 'en-US')).toEqual({
      ok: false,
      message: "Cells in series: '2.5' is not a whole number",
    });
  });

  it('converts the typed value in the shown unit to SI', () => {
    expect(readNumberField('98,4', { label: 'Length', quantity: 'length', required: true }, 'us', 'de-DE')).toEqual({ ok: true, value: 29.99232 }); // 98.4 × 0.3048
    expect(readNumberField('96,5', { label: 'Efficiency', quantity: 'fraction-percent', required: true }, 'si', 'fr-FR')).toEqual({ ok: true, value: 0.965 });
  });

  it('shows stored values in the shown unit and locale', () => {
    expect(inputText(30.48, 'length', 'us', 'en-US')).toBe('100');
    expect(inputText(0.965, 'fraction-percent', 'si', 'de-DE')).toBe('96,5');
    expect(inputText(1234.5, 'power', 'si', 'fr-FR')).toBe('1234,5');
    expect(inputText(undefined, 'power', 'si', 'en-US')).toBe('');
  });
});
