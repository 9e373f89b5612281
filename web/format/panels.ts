/**
 * Formatting used only by the study panels (battery, conductors, machines): money in the locale's
 * currency, AWG words for metric sizes and resistance per length. Kept apart
 * from number.ts and units.ts so it loads with the panels, not with the page.
 */
import { UNIT_GAP, formatSignificant, numberFormat } from './number.ts';
import { METRES_PER_FOOT, type UnitSystem } from './units.ts';

// ---------- money ----------

/**
 * The currency of a locale's region, for showing a price (ISO 4217 codes). Only regions whose
 * currency is certain are listed; anything else shows a plain number (the user knows their money).
 */
const REGION_CURRENCY: Readonly<Record<string, string>> = {
  US: 'USD', GB: 'GBP', IE: 'EUR', DE: 'EUR', FR: 'EUR', ES: 'EUR', IT: 'EUR', NL: 'EUR', BE: 'EUR', AT: 'EUR', PT: 'EUR',
  FI: 'EUR', GR: 'EUR', BR: 'BRL', IN: 'INR', CA: 'CAD', AU: 'AUD', NZ: 'NZD', ZA: 'ZAR', CH: 'CHF', SE: 'SEK',
  NO: 'NOK', DK: 'DKK', PL: 'PLN', MX: 'MXN', JP: 'JPY', CN: 'CNY', KE: 'KES', NG: 'NGN',
};

/** ISO 4217 code for the locale's region (its likely region when the tag names none), or undefined. */
export function currencyForLocale(locale: string | undefined): string | undefined {
  if (!locale) return undefined;
  try {
    const region = new Intl.Locale(locale).maximize().region;
    return region ? REGION_CURRENCY[region] : undefined;
  } catch {
    return undefined;
  }
}

/**
 * An amount of money in the locale's currency ("$1,234.56", "1.234,56 €"); a plain number with two
 * decimals when the locale's currency is not known.
 */
export function formatMoney(amount: number, locale?: string): string {
  if (!Number.isFinite(amount)) return '—';
  const currency = currencyForLocale(locale);
  const v = Math.abs(amount) < 0.005 ? 0 : amount;
  if (!currency) return numberFormat(locale, { minimumFractionDigits: 2, maximumFractionDigits: 2 }).format(v);
  return numberFormat(locale, { style: 'currency', currency }).format(v);
}

/** The symbol the locale writes its currency with ("$", "€", "R$"), or "" when not known. */
export function currencySymbol(locale?: string): string {
  const currency = currencyForLocale(locale);
  if (!currency) return '';
  const part = numberFormat(locale, { style: 'currency', currency }).formatToParts(1).find((p) => p.type === 'currency');
  return part?.value ?? currency;
}

// ---------- AWG equivalents and resistance per length (conductor panel) ----------

/**
 * Cross-section of an AWG gauge, mm²: d = 0.005 in × 92^((36 − n)/39) (ASTM B258-18, the gauge's
 * defining formula; n = 0, −1, −2, −3 for 1/0…4/0), area = π/4 · d². Rounded as printed in NEC
 * Chapter 9 Table 8 it gives e.g. 10 AWG 10 380 cmil = 5.26 mm², 4 AWG 41 740 cmil = 21.15 mm².
 */
export function awgAreaMm2(gauge: number): number {
  const dMm = 0.127 * 92 ** ((36 - gauge) / 39);
  return (Math.PI / 4) * dMm * dMm;
}

/** An AWG gauge number as the trade writes it (0 → "1/0", −3 → "4/0"). */
export function awgLabel(gauge: number): string {
  return gauge <= 0 ? `${1 - gauge}/0 AWG` : `${gauge} AWG`;
}

/** Gauges in common use, smallest conductor first (18 AWG … 4/0 AWG). */
const AWG_GAUGES = Array.from({ length: 22 }, (_, i) => 18 - i);

/**
 * Where a metric cross-section falls among AWG gauges, for a US reader: the gauge it equals (within
 * 2 %), or the gauges just smaller and just larger. Above 4/0 the trade uses kcmil (formatArea).
 */
export function awgBracket(mm2: number): { equal?: string; smaller?: string; larger?: string } {
  if (!Number.isFinite(mm2) || mm2 <= 0) return {};
  const equal = AWG_GAUGES.find((g) => Math.abs(awgAreaMm2(g) / mm2 - 1) <= 0.02);
  if (equal !== undefined) return { equal: awgLabel(equal) };
  const smaller = [...AWG_GAUGES].reverse().find((g) => awgAreaMm2(g) < mm2);
  const larger = AWG_GAUGES.find((g) => awgAreaMm2(g) > mm2);
  return { ...(smaller !== undefined ? { smaller: awgLabel(smaller) } : {}), ...(larger !== undefined ? { larger: awgLabel(larger) } : {}) };
}

/**
 * A metric size in AWG words for US units: "≈ 10 AWG", "between 10 AWG and 9 AWG", or "" (above
 * 4/0 or below 18 AWG, where kcmil or the metric size says it).
 */
export function awgWords(mm2: number): string {
  const b = awgBracket(mm2);
  if (b.equal) return `≈ ${b.equal}`;
  if (b.smaller && b.larger) return `between ${b.smaller} and ${b.larger}`;
  return '';
}

/** Resistance per length given in Ω/km, shown in Ω/km or Ω/1000 ft (1000 ft = 0.3048 km, NIST SP 811). */
export function formatResistancePerLength(ohmPerKm: number, units: UnitSystem, locale?: string): string {
  if (!Number.isFinite(ohmPerKm)) return '—';
  return units === 'us'
    ? `${formatSignificant(ohmPerKm * METRES_PER_FOOT, 4, locale)}${UNIT_GAP}Ω/1000${UNIT_GAP}ft`
    : `${formatSignificant(ohmPerKm, 4, locale)}${UNIT_GAP}Ω/km`;
}
