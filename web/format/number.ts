/**
 * Numbers and units for display. The engine works in SI base units (W, var, VA, V, A); this module
 * only chooses a prefix and a number of digits. Locale-aware through Intl.NumberFormat; the locale
 * is a parameter (last, with the runtime's default) so tests can pin it.
 */

/** Narrow no-break space between a number and its unit, so "12.3 kW" never wraps apart. */
export const UNIT_GAP = '\u202f';

/** Display values closer to zero than this (in base units) are shown as zero: solver round-off. */
const ZERO_BELOW = 1e-9;

const formatters = new Map<string, Intl.NumberFormat>();

/** A cached Intl.NumberFormat (building one is slow compared with using it). */
export function numberFormat(locale: string | undefined, options: Intl.NumberFormatOptions): Intl.NumberFormat {
  const key = `${locale ?? ''}|${JSON.stringify(options)}`;
  let nf = formatters.get(key);
  if (!nf) {
    nf = new Intl.NumberFormat(locale, options);
    formatters.set(key, nf);
  }
  return nf;
}

/**
 * The formats used for every figure on the page (significant figures, per cent), found without
 * building a key: a redraw formats a few hundred numbers, and serialising the options for each
 * cost three times the formatting itself.
 */
const quick = new Map<string, Intl.NumberFormat>();
function quickFormat(kind: 'significant' | 'percent', digits: number, locale: string | undefined): Intl.NumberFormat {
  const key = `${kind}${digits}|${locale ?? ''}`;
  let nf = quick.get(key);
  if (!nf) {
    nf = numberFormat(locale, kind === 'percent' ? { style: 'percent', maximumSignificantDigits: digits } : { maximumSignificantDigits: digits });
    quick.set(key, nf);
  }
  return nf;
}

/** A plain number with at most `digits` significant figures (3–4 is the useful range here). */
export function formatSignificant(value: number, digits = 4, locale?: string): string {
  if (!Number.isFinite(value)) return '—';
  const v = Math.abs(value) < ZERO_BELOW ? 0 : value;
  return quickFormat('significant', digits, locale).format(v);
}

const PREFIXES = [
  { factor: 1e9, prefix: 'G' },
  { factor: 1e6, prefix: 'M' },
  { factor: 1e3, prefix: 'k' },
  { factor: 1, prefix: '' },
] as const;

/**
 * A value with a unit symbol, switching to k/M/G at each thousand (1234 W → "1.234 kW").
 * Values below one base unit stay in the base unit (0.25 A → "0.25 A").
 */
export function formatWithPrefix(value: number, unit: string, digits = 4, locale?: string): string {
  if (!Number.isFinite(value)) return '—';
  const magnitude = Math.abs(value);
  // Choose the prefix from the value as it will be rounded, so 999.96 W shows as "1 kW".
  const rounded = Number(magnitude.toPrecision(digits));
  const step = rounded >= 1e9 ? PREFIXES[0] : rounded >= 1e6 ? PREFIXES[1] : rounded >= 1e3 ? PREFIXES[2] : PREFIXES[3];
  return `${formatSignificant(value / step.factor, digits, locale)}${UNIT_GAP}${step.prefix}${unit}`;
}

/** Real power: W, kW, MW. */
export const formatPower = (watts: number, locale?: string) => formatWithPrefix(watts, 'W', 4, locale);
/** Reactive power: var, kvar, Mvar (IEC 60027-1 writes the unit "var"). */
export const formatReactive = (vars: number, locale?: string) => formatWithPrefix(vars, 'var', 4, locale);
/** Apparent power: VA, kVA, MVA. */
export const formatApparent = (va: number, locale?: string) => formatWithPrefix(va, 'VA', 4, locale);
/** Voltage: V, kV. */
export const formatVoltage = (volts: number, locale?: string) => formatWithPrefix(volts, 'V', 4, locale);
/** Current: A, kA. */
export const formatCurrent = (amps: number, locale?: string) => formatWithPrefix(amps, 'A', 4, locale);
/** Frequency: Hz. */
export const formatFrequency = (hz: number, locale?: string) => `${formatSignificant(hz, 4, locale)}${UNIT_GAP}Hz`;
/** Rotational speed: rpm. */
export const formatSpeed = (rpm: number, locale?: string) => `${formatSignificant(rpm, 4, locale)}${UNIT_GAP}rpm`;

/** A ratio (0.9652) as a percentage with up to four significant figures ("96.52 %"). */
export function formatPercent(ratio: number, locale?: string, digits = 4): string {
  if (!Number.isFinite(ratio)) return '—';
  const v = Math.abs(ratio) < ZERO_BELOW ? 0 : ratio;
  return quickFormat('percent', digits, locale).format(v);
}

/** A small ratio such as an energy-balance error, shown to enough decimals to see it is tiny. */
export function formatSmallPercent(ratio: number, locale?: string): string {
  if (!Number.isFinite(ratio)) return '—';
  if (Math.abs(ratio) < 1e-6) return `< ${numberFormat(locale, { style: 'percent', maximumFractionDigits: 4 }).format(1e-6)}`;
  return numberFormat(locale, { style: 'percent', maximumSignificantDigits: 2 }).format(ratio);
}

/** Power factor to three decimals, with its sense: "0.850 lagging", "1.000". */
export function formatPowerFactor(pf: number, sense: 'lagging' | 'leading' | 'unity', locale?: string): string {
  if (!Number.isFinite(pf)) return '—';
  const n = numberFormat(locale, { minimumFractionDigits: 3, maximumFractionDigits: 3 }).format(pf);
  return sense === 'unity' ? n : `${n} ${sense}`;
}

// ---------- durations and energy (battery panel, client report) ----------

/** Energy: Wh, kWh, MWh. */
export const formatEnergy = (wh: number, locale?: string) => formatWithPrefix(wh, 'Wh', 4, locale);

/**
 * A duration as hours and minutes ("27 h 40 min"; "45 min" under an hour; "3 d 4 h" from three
 * days). Rounded to the minute; a duration that rounds to 60 min carries into the hour.
 */
export function formatDuration(seconds: number, locale?: string): string {
  if (!Number.isFinite(seconds) || seconds < 0) return '—';
  const totalMinutes = Math.round(seconds / 60);
  const hours = Math.floor(totalMinutes / 60);
  const minutes = totalMinutes - hours * 60;
  const n = (v: number) => numberFormat(locale, { maximumFractionDigits: 0 }).format(v);
  if (hours >= 72) {
    const days = Math.floor(hours / 24);
    return `${n(days)}${UNIT_GAP}d ${n(hours - days * 24)}${UNIT_GAP}h`;
  }
  if (hours === 0) return `${n(minutes)}${UNIT_GAP}min`;
  return `${n(hours)}${UNIT_GAP}h ${String(minutes).padStart(2, '0')}${UNIT_GAP}min`;
}
