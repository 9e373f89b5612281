// Display conversions SI ↔ US customary (web/format/units.ts). Each factor and check value names its
// source: NIST SP 811 (2008 ed.) Appendix B.8/B.9 for the foot, the degree Fahrenheit and the
// horsepower; ASTM B258-18 and NEC (NFPA 70, 2023) Chapter 9 Table 8 for kcmil and AWG areas.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { UNIT_GAP } from '../../web/format/number.ts';
import {
  METRES_PER_FOOT,
  MM2_PER_KCMIL,
  WATTS_PER_HORSEPOWER,
  celsiusToFahrenheit,
  fahrenheitToCelsius,
  feetToMetres,
  formatArea,
  formatConductorSize,
  formatLength,
  formatShaftPower,
  formatTemperature,
  horsepowerToWatts,
  isUsSizeLabel,
  kcmilToMm2,
  metresToFeet,
  mm2ToKcmil,
  wattsToHorsepower,
} from '../../web/format/units.ts';

const g = UNIT_GAP;

describe('length, m ↔ ft', () => {
  it('1 ft = 0.3048 m exactly (NIST SP 811, B.8, "foot")', () => {
    expect(METRES_PER_FOOT).toBe(0.3048);
    expect(feetToMetres(1)).toBe(0.3048);
    expect(feetToMetres(100)).toBeCloseTo(30.48, 12);
  });

  it('1 mile = 5280 ft = 1609.344 m exactly (NIST SP 811, B.8, "mile")', () => {
    expect(metresToFeet(1609.344)).toBeCloseTo(5280, 9);
  });

  it('formats in the chosen system and locale', () => {
    expect(formatLength(30.48, 'si', 'en-US')).toBe(`30.48${g}m`);
    expect(formatLength(30.48, 'us', 'en-US')).toBe(`100${g}ft`);
    // 1234.5 ft: grouping per CLDR, en-US "1,235" with four significant figures, de-DE "1.235".
    expect(formatLength(feetToMetres(1234.5), 'us', 'en-US')).toBe(`1,235${g}ft`);
    expect(formatLength(feetToMetres(1234.5), 'us', 'de-DE')).toBe(`1.235${g}ft`);
    expect(formatLength(2.5, 'si', 'de-DE')).toBe(`2,5${g}m`);
    expect(formatLength(Number.NaN, 'us', 'en-US')).toBe('—');
  });
});

describe('temperature, °C ↔ °F', () => {
  it('°F = 1.8 °C + 32 (NIST SP 811, B.9 and 4.2.1.1): freezing, boiling, −40 and 90 °C', () => {
    expect(celsiusToFahrenheit(0)).toBe(32);
    expect(celsiusToFahrenheit(100)).toBe(212);
    expect(celsiusToFahrenheit(-40)).toBe(-40);
    // 90 °C is the THHN/XHHW rating column of NEC Table 310.16, printed there as 194 °F.
    expect(celsiusToFahrenheit(90)).toBeCloseTo(194, 12);
    expect(fahrenheitToCelsius(167)).toBeCloseTo(75, 12); // 75 °C / 167 °F column, NEC Table 310.16
  });

  it('formats with three significant figures', () => {
    expect(formatTemperature(75, 'si', 'en-US')).toBe(`75${g}°C`);
    expect(formatTemperature(75, 'us', 'en-US')).toBe(`167${g}°F`);
    expect(formatTemperature(42.37, 'si', 'de-DE')).toBe(`42,4${g}°C`);
  });
});

describe('conductor area, mm² ↔ kcmil and AWG labels', () => {
  it('1 kcmil = 0.506707 mm² (ASTM B258-18: 1 cmil = π/4 × (0.0254 mm)²)', () => {
    expect(MM2_PER_KCMIL).toBe(0.506707);
    expect(MM2_PER_KCMIL).toBeCloseTo((Math.PI / 4) * 0.0254 ** 2 * 1000, 6);
  });

  it('NEC Chapter 9 Table 8 areas: 250 kcmil = 127 mm², 500 kcmil = 253 mm², 4 AWG 41 740 cmil = 21.15 mm²', () => {
    expect(kcmilToMm2(250)).toBeCloseTo(127, 0);
    expect(kcmilToMm2(500)).toBeCloseTo(253, 0);
    expect(kcmilToMm2(41.74)).toBeCloseTo(21.15, 2);
    expect(mm2ToKcmil(kcmilToMm2(350))).toBeCloseTo(350, 10);
  });

  it('formats an area in the chosen unit', () => {
    expect(formatArea(16, 'si', 'en-US')).toBe(`16${g}mm²`);
    expect(formatArea(16, 'us', 'en-US')).toBe(`31.58${g}kcmil`); // 16 / 0.506707 = 31.577
  });

  it('keeps the engine\'s size label and adds the area in the other unit only when it differs', () => {
    expect(isUsSizeLabel('4 AWG')).toBe(true);
    expect(isUsSizeLabel('250 kcmil')).toBe(true);
    expect(isUsSizeLabel('16 mm²')).toBe(false);
    // 4 AWG = 21.15 mm² (NEC Chapter 9 Table 8, 2023).
    expect(formatConductorSize('4 AWG', 21.15, 'si', 'en-US')).toBe(`4 AWG (21.15${g}mm²)`);
    expect(formatConductorSize('4 AWG', 21.15, 'us', 'en-US')).toBe('4 AWG');
    expect(formatConductorSize('16 mm²', 16, 'si', 'en-US')).toBe('16 mm²');
    expect(formatConductorSize('16 mm²', 16, 'us', 'en-US')).toBe(`16 mm² (31.58${g}kcmil)`);
    expect(formatConductorSize('2.5 mm²', 2.5, 'us', 'de-DE')).toBe(`2.5 mm² (4,934${g}kcmil)`);
  });
});

describe('shaft power, kW and hp', () => {
  it('1 hp = 745.7 W (NIST SP 811, B.8, horsepower (550 ft·lbf/s) = 745.6999 W, rounded)', () => {
    expect(WATTS_PER_HORSEPOWER).toBe(745.7);
    // 550 ft·lbf/s with 1 ft = 0.3048 m, 1 lbf = 4.4482216152605 N (NIST SP 811, B.8).
    expect(550 * 0.3048 * 4.4482216152605).toBeCloseTo(WATTS_PER_HORSEPOWER, 1);
    expect(horsepowerToWatts(10)).toBeCloseTo(7457, 9);
    expect(wattsToHorsepower(7457)).toBeCloseTo(10, 12);
  });

  it('shows kW in SI, and kW with hp beside it in US units', () => {
    expect(formatShaftPower(7500, 'si', 'en-US')).toBe(`7.5${g}kW`);
    expect(formatShaftPower(7500, 'us', 'en-US')).toBe(`7.5${g}kW · 10.06${g}hp`); // 7500 / 745.7 = 10.058
    expect(formatShaftPower(7500, 'us', 'de-DE')).toBe(`7,5${g}kW · 10,06${g}hp`);
    expect(formatShaftPower(Number.NaN, 'us', 'en-US')).toBe('—');
  });
});

describe('round trips (property)', () => {
  it('every conversion and its inverse agree to 1e-12 relative', () => {
    const pairs: [(x: number) => number, (x: number) => number][] = [
      [metresToFeet, feetToMetres],
      [mm2ToKcmil, kcmilToMm2],
      [celsiusToFahrenheit, fahrenheitToCelsius],
      [wattsToHorsepower, horsepowerToWatts],
    ];
    fc.assert(
      fc.property(fc.double({ min: -1e7, max: 1e7, noNaN: true }), fc.integer({ min: 0, max: 3 }), (x, i) => {
        const [to, from] = pairs[i]!;
        expect(Math.abs(from(to(x)) - x)).toBeLessThanOrEqual(1e-12 * Math.max(1, Math.abs(x)));
      }),
    );
  });
});
