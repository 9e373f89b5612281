/**
 * Reading what a user types into a number field: the locale's decimal separator and digit grouping,
 * and the unit shown beside the field (SI or US customary), converted to the SI value the project
 * stores. The display-only conversions of results live in `units.ts`; the factors are shared with it
 * and each names its source there.
 *
 * Rules:
 * - A number is read in the chosen locale only: in de-DE "1.234,5" is 1234.5 and "1.5" is refused
 *   (it is neither a grouped integer nor a decimal there), never silently taken as 1.5 or 15.
 * - Grouping is optional; when present it must be the locale's (groups of three, or the
 *   Indian 2-2-3 pattern where the locale uses it). Locales that group with a space accept any of
 *   space, no-break space, narrow no-break space and thin space.
 * - Conversions to SI are the defining factors (exact by definition); the product is rounded to 15
 *   significant digits so that 100 ft is stored as 30.48 m, not 30.480000000000004 m.
 */
import {
  FAHRENHEIT_OFFSET,
  FAHRENHEIT_PER_CELSIUS,
  KILOGRAMS_PER_POUND,
  LITRES_PER_US_GALLON,
  METRES_PER_FOOT,
  WATTS_PER_HORSEPOWER,
  type UnitSystem,
} from './units.ts';
import { numberFormat } from './number.ts';

// ---------- locale numbers ----------

export interface LocaleSeparators {
  decimal: string;
  /** The grouping character the locale prints ('' when it prints none). */
  group: string;
  /** Digits per group left of the last group of three: 3, or 2 (en-IN: 12,34,567). */
  secondaryGroup: number;
}

const separatorCache = new Map<string, LocaleSeparators>();

/** The decimal and grouping characters of a locale, read from Intl itself. */
export function localeSeparators(locale?: string): LocaleSeparators {
  const key = locale ?? '';
  const cached = separatorCache.get(key);
  if (cached) return cached;
  const parts = new Intl.NumberFormat(locale, { useGrouping: true }).formatToParts(123456789.5);
  const decimal = parts.find((p) => p.type === 'decimal')?.value ?? '.';
  const group = parts.find((p) => p.type === 'group')?.value ?? '';
  const integers = parts.filter((p) => p.type === 'integer').map((p) => p.value.length);
  const secondaryGroup = integers.length >= 3 ? integers[integers.length - 2]! : 3;
  const found = { decimal, group, secondaryGroup };
  separatorCache.set(key, found);
  return found;
}

const SPACES = ' \u00a0\u202f\u2009';
const isSpaceGroup = (group: string) => group !== '' && SPACES.includes(group);
const escape = (s: string) => s.replace(/[.*+?^${}()|[\]\\]/g, '\\$&');

export type ParsedNumber =
  | { kind: 'empty' }
  | { kind: 'number'; value: number }
  /** `problem` completes "'<text>' …", e.g. "is not a number". */
  | { kind: 'invalid'; problem: string };

const patternCache = new Map<string, { groupChars: string; pattern: RegExp; groupSplit: RegExp }>();

/** The pattern of a number typed in a locale, built once per locale (every keystroke reads one). */
function numberPattern(locale?: string): { groupChars: string; pattern: RegExp; groupSplit: RegExp } {
  const key = locale ?? '';
  const cached = patternCache.get(key);
  if (cached) return cached;
  const { decimal, group } = localeSeparators(locale);
  const groupChars = isSpaceGroup(group) ? SPACES : group;
  const g = groupChars ? `[${escape(groupChars)}]` : '(?!)';
  const pattern = new RegExp(`^([+-])?(\\d(?:\\d|${g})*)?(?:${escape(decimal)}(\\d*))?(?:[eE]([+-]?\\d+))?$`);
  const found = { groupChars, pattern, groupSplit: new RegExp(g) };
  patternCache.set(key, found);
  return found;
}

/** Read a number typed in the given locale (see the rules at the top of this file). */
export function parseLocaleNumber(text: string, locale?: string): ParsedNumber {
  // U+2212 MINUS SIGN is what several locales print; a user may paste it back.
  const s = text.trim().replace(/\u2212/g, '-');
  if (s === '') return { kind: 'empty' };
  const { decimal, group, secondaryGroup } = localeSeparators(locale);
  const { groupChars, pattern, groupSplit } = numberPattern(locale);
  const m = pattern.exec(s);
  const decimalName = decimal === ',' ? 'a comma' : decimal === '.' ? 'a point' : `"${decimal}"`;
  if (!m || (m[2] === undefined && (m[3] === undefined || m[3] === ''))) {
    const other = decimal === ',' ? '.' : ',';
    const hint = /^[+-]?\d+[.,]\d+$/.test(s) && s.includes(other) && !groupChars.includes(other)
      ? ` in this number format (decimals take ${decimalName})`
      : '';
    return { kind: 'invalid', problem: `is not a number${hint}` };
  }
  const [, sign = '', intPart = '', frac, exponent] = m;
  const groups = intPart.split(groupSplit);
  if (groups.length > 1) {
    const last = groups[groups.length - 1]!;
    const first = groups[0]!;
    const middleOk = groups.slice(1, -1).every((x) => x.length === secondaryGroup);
    if (last.length !== 3 || first.length === 0 || first.length > Math.max(3, secondaryGroup) || !middleOk) {
      return { kind: 'invalid', problem: `is not a number in this number format (digit groups of three; decimals take ${decimalName})` };
    }
  }
  const canonical = `${sign}${groups.join('') || '0'}${frac ? `.${frac}` : ''}${exponent !== undefined ? `e${exponent}` : ''}`;
  const value = Number(canonical);
  if (!Number.isFinite(value)) return { kind: 'invalid', problem: 'is too large' };
  return { kind: 'number', value: Object.is(value, -0) ? 0 : value };
}

/**
 * A stored number as the text of an input: the locale's decimal separator, no grouping (it gets in
 * the way while editing), up to 12 significant digits (enough to show any value a person typed).
 */
export function formatForInput(value: number, locale?: string): string {
  if (!Number.isFinite(value)) return '';
  return numberFormat(locale, { maximumSignificantDigits: 12, useGrouping: false }).format(value).replace(/\u2212/g, '-');
}

// ---------- units of input fields ----------

/** The physical quantity of a form field; it decides the unit shown beside the input. */
export type Quantity =
  | 'voltage'
  | 'current'
  | 'power'
  | 'power-rating'
  | 'shaft-power'
  | 'apparent-power'
  | 'apparent-rating'
  | 'frequency'
  | 'length'
  | 'head'
  | 'resistance'
  | 'resistance-per-length'
  | 'temperature'
  | 'temperature-difference'
  | 'fraction-percent'
  | 'percent'
  | 'ratio'
  | 'per-watt'
  | 'flow'
  | 'air-flow'
  | 'pressure'
  | 'density'
  | 'speed'
  | 'capacity'
  | 'time'
  | 'seconds'
  | 'count'
  | 'ohm-ah'
  | 'c-rate';

export interface InputUnit {
  /** Shown beside the input ('' for plain numbers). */
  symbol: string;
  /** Spoken name for screen readers and messages. */
  name: string;
  /** Value typed in this unit → the SI value stored. */
  toSi(value: number): number;
  /** The SI value stored → the value shown in this unit. */
  fromSi(value: number): number;
}

/** Rounds off the last-bit noise of a conversion product (15 significant digits, below double precision's 15.95). */
export const clean = (x: number): number => (Number.isFinite(x) && x !== 0 ? Number(x.toPrecision(15)) : x);

const same = (symbol: string, name: string): InputUnit => ({ symbol, name, toSi: (x) => x, fromSi: (x) => x });
const scaled = (symbol: string, name: string, factor: number): InputUnit => ({
  symbol,
  name,
  toSi: (x) => clean(x * factor),
  fromSi: (x) => clean(x / factor),
});

/** m³/h → m³/s: 1 h = 3600 s (SI Brochure, 9th ed., Table 8). */
const SECONDS_PER_HOUR = 3600;
/** 1 US gpm in m³/s: 3.785411784 L/min ÷ 1000 L/m³ ÷ 60 s/min (NIST SP 811 B.8, "gallon [U.S.]"). */
export const CUBIC_METRES_PER_SECOND_PER_GPM = LITRES_PER_US_GALLON / 1000 / 60;
/** 1 cfm in m³/s: 0.3048³ m³ ÷ 60 s (NIST SP 811, 2008 ed., Appendix B.8, "foot"; exact). */
export const CUBIC_METRES_PER_SECOND_PER_CFM = METRES_PER_FOOT ** 3 / 60;
/** 1 inch of water (60 °F) in Pa: NIST SP 811, 2008 ed., Appendix B.8, 2.4884E+02 Pa (from memory); fan pressures in US practice ("in. w.g."). */
export const PASCALS_PER_INCH_OF_WATER = 248.84;
/** 1 lb/ft³ in kg/m³: 0.45359237 kg ÷ 0.3048³ m³ (NIST SP 811 B.8, "pound", "foot"). */
export const KG_PER_M3_PER_LB_PER_FT3 = KILOGRAMS_PER_POUND / METRES_PER_FOOT ** 3;

/** A unit whose SI value is the typed value divided by `divisor` (avoids rounding 1/divisor first). */
const divided = (symbol: string, name: string, divisor: number): InputUnit => ({
  symbol,
  name,
  toSi: (x) => clean(x / divisor),
  fromSi: (x) => clean(x * divisor),
});

const fahrenheit: InputUnit = {
  symbol: '°F',
  name: 'degrees Fahrenheit',
  // °C = (°F − 32) / 1.8 (NIST SP 811, B.9).
  toSi: (f) => clean((f - FAHRENHEIT_OFFSET) / FAHRENHEIT_PER_CELSIUS),
  fromSi: (c) => clean(c * FAHRENHEIT_PER_CELSIUS + FAHRENHEIT_OFFSET),
};

const percentOfFraction: InputUnit = {
  symbol: '%',
  name: 'per cent',
  // Divide (not × 0.01): 95 / 100 is the double nearest 0.95.
  toSi: (x) => x / 100,
  fromSi: (x) => clean(x * 100),
};

const UNITS: Readonly<Record<Quantity, { si: InputUnit; us: InputUnit }>> = {
  voltage: { si: same('V', 'volts'), us: same('V', 'volts') },
  current: { si: same('A', 'amperes'), us: same('A', 'amperes') },
  power: { si: same('W', 'watts'), us: same('W', 'watts') },
  'power-rating': { si: scaled('kW', 'kilowatts', 1000), us: scaled('kW', 'kilowatts', 1000) },
  // Motor and shaft ratings: the trade in the US rates them in horsepower (NEMA MG 1; 745.7 W, NIST SP 811 B.8).
  'shaft-power': { si: scaled('kW', 'kilowatts', 1000), us: scaled('hp', 'horsepower', WATTS_PER_HORSEPOWER) },
  'apparent-power': { si: same('VA', 'volt-amperes'), us: same('VA', 'volt-amperes') },
  'apparent-rating': { si: scaled('kVA', 'kilovolt-amperes', 1000), us: scaled('kVA', 'kilovolt-amperes', 1000) },
  frequency: { si: same('Hz', 'hertz'), us: same('Hz', 'hertz') },
  length: { si: same('m', 'metres'), us: scaled('ft', 'feet', METRES_PER_FOOT) },
  head: { si: same('m', 'metres of head'), us: scaled('ft', 'feet of head', METRES_PER_FOOT) },
  resistance: { si: same('Ω', 'ohms'), us: same('Ω', 'ohms') },
  // Stored in Ω/km; NEC Chapter 9 Tables 8 and 9 print Ω per 1000 ft: Ω/km = (Ω/kft) / 0.3048.
  'resistance-per-length': { si: same('Ω/km', 'ohms per kilometre'), us: divided('Ω/kft', 'ohms per thousand feet', METRES_PER_FOOT) },
  temperature: { si: same('°C', 'degrees Celsius'), us: fahrenheit },
  // A temperature span or ± tolerance: 1 °C of difference is 1.8 °F, no offset (NIST SP 811, B.9).
  'temperature-difference': { si: same('°C', 'degrees Celsius'), us: divided('°F', 'degrees Fahrenheit', FAHRENHEIT_PER_CELSIUS) },
  'fraction-percent': { si: percentOfFraction, us: percentOfFraction },
  percent: { si: same('%', 'per cent'), us: same('%', 'per cent') },
  ratio: { si: same('', ''), us: same('', '') },
  'per-watt': { si: same('1/W', 'per watt'), us: same('1/W', 'per watt') },
  flow: {
    si: divided('m³/h', 'cubic metres per hour', SECONDS_PER_HOUR),
    us: scaled('gpm', 'US gallons per minute', CUBIC_METRES_PER_SECOND_PER_GPM),
  },
  // Air flow of fans: m³/h, or cubic feet per minute in US practice.
  'air-flow': { si: divided('m³/h', 'cubic metres per hour', SECONDS_PER_HOUR), us: scaled('cfm', 'cubic feet per minute', CUBIC_METRES_PER_SECOND_PER_CFM) },
  // Fan pressure: Pa, or inches of water gauge in US practice.
  pressure: { si: same('Pa', 'pascals'), us: scaled('in. w.g.', 'inches of water', PASCALS_PER_INCH_OF_WATER) },
  density: { si: same('kg/m³', 'kilograms per cubic metre'), us: scaled('lb/ft³', 'pounds per cubic foot', KG_PER_M3_PER_LB_PER_FT3) },
  speed: { si: same('rpm', 'revolutions per minute'), us: same('rpm', 'revolutions per minute') },
  capacity: { si: same('Ah', 'ampere-hours'), us: same('Ah', 'ampere-hours') },
  time: { si: same('h', 'hours'), us: same('h', 'hours') },
  seconds: { si: same('s', 'seconds'), us: same('s', 'seconds') },
  count: { si: same('', ''), us: same('', '') },
  'ohm-ah': { si: same('Ω·Ah', 'ohm ampere-hours'), us: same('Ω·Ah', 'ohm ampere-hours') },
  'c-rate': { si: same('C', 'times the rated capacity per hour'), us: same('C', 'times the rated capacity per hour') },
};

/** The unit an input of this quantity shows in the chosen system. */
export function inputUnit(quantity: Quantity, units: UnitSystem): InputUnit {
  return UNITS[quantity][units];
}

/** A typed value in the shown unit → SI. */
export const toSi = (quantity: Quantity, units: UnitSystem, value: number): number => inputUnit(quantity, units).toSi(value);
/** A stored SI value → the shown unit. */
export const fromSi = (quantity: Quantity, units: UnitSystem, value: number): number => inputUnit(quantity, units).fromSi(value);

export type FieldReading =
  | { ok: true; value: number | undefined }
  | { ok: false; message: string };

/**
 * What a number field holds: the SI value to store, `undefined` for an empty optional field, or a
 * message naming the field and the problem ("Output voltage: '23o' is not a number").
 */
export function readNumberField(
  text: string,
  field: { label: string; quantity: Quantity; required: boolean; integer?: boolean },
  units: UnitSystem,
  locale?: string,
): FieldReading {
  const parsed = parseLocaleNumber(text, locale);
  if (parsed.kind === 'empty') {
    return field.required ? { ok: false, message: `${field.label}: is required` } : { ok: true, value: undefined };
  }
  if (parsed.kind === 'invalid') return { ok: false, message: `${field.label}: '${text.trim()}' ${parsed.problem}` };
  if (field.integer && !Number.isInteger(parsed.value)) return { ok: false, message: `${field.label}: '${text.trim()}' is not a whole number` };
  return { ok: true, value: toSi(field.quantity, units, parsed.value) };
}

/** The text an input shows for a stored SI value (empty for an absent value). */
export function inputText(value: unknown, quantity: Quantity, units: UnitSystem, locale?: string): string {
  return typeof value === 'number' ? formatForInput(fromSi(quantity, units, value), locale) : '';
}
