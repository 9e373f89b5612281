/**
 * Display conversions between SI and US customary units. The engine and the stored project stay in
 * SI; these functions only change what is shown. Each factor names its source.
 */
import { UNIT_GAP, formatSignificant, formatWithPrefix } from './number.ts';

/** Which units the page shows. */
export type UnitSystem = 'si' | 'us';

export const UNIT_SYSTEMS: readonly UnitSystem[] = ['si', 'us'];

/** 1 ft = 0.3048 m exactly (NIST SP 811, 2008 ed., Appendix B.8, "foot"). */
export const METRES_PER_FOOT = 0.3048;

/**
 * 1 kcmil = 0.506707 mm² (ASTM B258-18, circular-mil definition: 1 cmil = π/4 × (0.0254 mm)²
 * = 5.067075e-4 mm²; the same factor is used in NEC Chapter 9 Table 8). Six significant figures.
 */
export const MM2_PER_KCMIL = 0.506707;

/** °F = °C × 1.8 + 32 (NIST SP 811, 2008 ed., Appendix B.9 and clause 4.2.1.1). */
export const FAHRENHEIT_PER_CELSIUS = 1.8;
export const FAHRENHEIT_OFFSET = 32;

/**
 * 1 hp = 745.7 W: the mechanical horsepower (550 ft·lbf/s), NIST SP 811, 2008 ed., Appendix B.8,
 * 7.456999E+02 W, rounded to four figures as motor catalogues use it. (The "electric horsepower"
 * of the same appendix is 746 W exactly; it is not used here.)
 */
export const WATTS_PER_HORSEPOWER = 745.7;

/**
 * 1 US gallon = 231 in³ = 3.785411784 L exactly (NIST SP 811, 2008 ed., Appendix B.8, "gallon
 * [U.S.]"), so 1 US gpm = 3.785411784 L/min. Used for pump flow in US customary units.
 */
export const LITRES_PER_US_GALLON = 3.785411784;

/** 1 lb = 0.45359237 kg exactly (NIST SP 811, 2008 ed., Appendix B.8, "pound (avoirdupois)"). */
export const KILOGRAMS_PER_POUND = 0.45359237;

export const metresToFeet = (m: number): number => m / METRES_PER_FOOT;
export const feetToMetres = (ft: number): number => ft * METRES_PER_FOOT;
export const mm2ToKcmil = (mm2: number): number => mm2 / MM2_PER_KCMIL;
export const kcmilToMm2 = (kcmil: number): number => kcmil * MM2_PER_KCMIL;
export const celsiusToFahrenheit = (c: number): number => c * FAHRENHEIT_PER_CELSIUS + FAHRENHEIT_OFFSET;
export const fahrenheitToCelsius = (f: number): number => (f - FAHRENHEIT_OFFSET) / FAHRENHEIT_PER_CELSIUS;
export const wattsToHorsepower = (w: number): number => w / WATTS_PER_HORSEPOWER;
export const horsepowerToWatts = (hp: number): number => hp * WATTS_PER_HORSEPOWER;

/** A length given in metres, shown in m or ft (three or four significant figures). */
export function formatLength(metres: number, units: UnitSystem, locale?: string): string {
  if (!Number.isFinite(metres)) return '—';
  return units === 'us'
    ? `${formatSignificant(metresToFeet(metres), 4, locale)}${UNIT_GAP}ft`
    : `${formatSignificant(metres, 4, locale)}${UNIT_GAP}m`;
}

/** A temperature given in °C, shown in °C or °F. */
export function formatTemperature(celsius: number, units: UnitSystem, locale?: string): string {
  if (!Number.isFinite(celsius)) return '—';
  return units === 'us'
    ? `${formatSignificant(celsiusToFahrenheit(celsius), 3, locale)}${UNIT_GAP}°F`
    : `${formatSignificant(celsius, 3, locale)}${UNIT_GAP}°C`;
}

/** A cross-section given in mm², shown in mm² or kcmil. */
export function formatArea(mm2: number, units: UnitSystem, locale?: string): string {
  if (!Number.isFinite(mm2)) return '—';
  return units === 'us'
    ? `${formatSignificant(mm2ToKcmil(mm2), 4, locale)}${UNIT_GAP}kcmil`
    : `${formatSignificant(mm2, 4, locale)}${UNIT_GAP}mm²`;
}

/** True when a table size label is an NEC (AWG or kcmil) size rather than a metric one. */
export function isUsSizeLabel(label: string): boolean {
  return /\b(AWG|kcmil)\b/.test(label);
}

/**
 * A conductor size: the table label the engine chose, always shown as chosen, with its
 * cross-section beside it in the other system's unit when the label is not already in the chosen
 * one ("4 AWG (21.15 mm²)" in SI, "16 mm² (31.58 kcmil)" in US units).
 */
export function formatConductorSize(label: string, areaMm2: number, units: UnitSystem, locale?: string): string {
  const labelIsUs = isUsSizeLabel(label);
  if ((units === 'us') === labelIsUs || !Number.isFinite(areaMm2)) return label;
  return `${label} (${formatArea(areaMm2, units, locale)})`;
}

/**
 * Shaft power: kW as in SI, with horsepower beside it in US units ("7.5 kW · 10.06 hp").
 */
export function formatShaftPower(watts: number, units: UnitSystem, locale?: string): string {
  const si = formatWithPrefix(watts, 'W', 4, locale);
  if (units !== 'us' || !Number.isFinite(watts)) return si;
  return `${si} · ${formatSignificant(wattsToHorsepower(watts), 4, locale)}${UNIT_GAP}hp`;
}
