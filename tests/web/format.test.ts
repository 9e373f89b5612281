// Display formatting of numbers and units (web/format/). Locales are pinned so results do not
// depend on the machine. Expected strings: SI prefixes k/M per the SI Brochure (BIPM, 9th ed.,
// Table 7); the unit "var" per IEC 60027-1; digits and separators per the locale's CLDR data as
// shipped with Node's ICU; the choice of four significant figures is common practice (no source).
import { describe, expect, it } from 'vitest';
import {
  UNIT_GAP,
  formatApparent,
  formatCurrent,
  formatPercent,
  formatPower,
  formatPowerFactor,
  formatReactive,
  formatSignificant,
  formatSmallPercent,
  formatVoltage,
} from '../../web/format/number.ts';

const g = UNIT_GAP;

describe('formatPower switches W / kW / MW', () => {
  it.each([
    [0, `0${g}W`],
    [5e-12, `0${g}W`], // solver round-off shown as zero: common practice (no source)
    [12.3456, `12.35${g}W`],
    [999.4, `999.4${g}W`],
    [999.96, `1${g}kW`], // rounds up to the next prefix, not "1000 W"
    [1234.5, `1.235${g}kW`], // Intl rounds half-expand: ECMA-402 default rounding
    [48_000, `48${g}kW`],
    [2_500_000, `2.5${g}MW`],
    [-1500, `-1.5${g}kW`],
  ])('%d W → %s (en-US)', (w, text) => {
    expect(formatPower(w, 'en-US')).toBe(text);
  });

  it('uses the locale decimal separator (de-DE writes a decimal comma, CLDR)', () => {
    expect(formatPower(1234.5, 'de-DE')).toBe(`1,235${g}kW`);
  });
});

describe('other units', () => {
  it('reactive, apparent, voltage and current', () => {
    expect(formatReactive(-3200, 'en-US')).toBe(`-3.2${g}kvar`);
    expect(formatApparent(15_000, 'en-US')).toBe(`15${g}kVA`);
    expect(formatVoltage(400, 'en-US')).toBe(`400${g}V`);
    expect(formatVoltage(11_000, 'en-US')).toBe(`11${g}kV`);
    expect(formatCurrent(0.25, 'en-US')).toBe(`0.25${g}A`);
    expect(formatCurrent(72.168, 'en-US')).toBe(`72.17${g}A`);
  });

  it('non-finite values show a dash rather than NaN', () => {
    expect(formatPower(Number.NaN, 'en-US')).toBe('—');
    expect(formatSignificant(Number.POSITIVE_INFINITY, 4, 'en-US')).toBe('—');
  });
});

describe('ratios', () => {
  it('efficiency as a percentage with four significant figures', () => {
    expect(formatPercent(0.96523, 'en-US')).toBe('96.52%');
    expect(formatPercent(1, 'en-US')).toBe('100%');
    // CLDR fr puts a no-break space before % (U+00A0 or U+202F depending on the ICU version).
    expect(formatPercent(0.96523, 'fr-FR')).toMatch(/^96,52[\u00a0\u202f]%$/);
  });

  it('a tiny balance error is shown as below one part per million', () => {
    expect(formatSmallPercent(1e-12, 'en-US')).toBe('< 0.0001%');
    expect(formatSmallPercent(0.0123, 'en-US')).toBe('1.2%');
  });

  it('power factor keeps three decimals and states its sense', () => {
    expect(formatPowerFactor(0.85, 'lagging', 'en-US')).toBe('0.850 lagging');
    expect(formatPowerFactor(0.9, 'leading', 'en-US')).toBe('0.900 leading');
    expect(formatPowerFactor(1, 'unity', 'en-US')).toBe('1.000');
  });
});
