/**
 * Reading component values as people write them: a plain number in the base unit (Ω, H, F), or
 * text such as "4.7 mH", "220 µF", "220 uF", "1.2 kΩ", "10k", "47n", "0.5 ohm".
 *
 * Syntax: a decimal number (optional exponent "e-3"), optional spaces, an optional SI prefix
 * (BIPM SI Brochure, 9th edition, Table 7: f p n µ m k M G; "u" and the Greek "μ" are read as µ),
 * then optionally the unit symbol. The symbol must fit the component ("mF" is refused for an
 * inductor). Prefixes are case-sensitive as in the SI ("m" milli, "M" mega); the one allowance is
 * a lower-case unit letter after a prefix ("100 uf", "4.7 mh"), which cannot be misread.
 * Nothing else is guessed: "4k7", "meg" and unknown letters are refused with a message.
 */
import { SI_PREFIX_STEPS } from '../model/message.ts';

/** The base units of the three circuit elements. */
export type ElementUnit = 'Ω' | 'H' | 'F';

export type ParsedValue = { ok: true; value: number } | { ok: false; message: string };

/** SI prefixes and their powers of ten (SI Brochure, Table 7). */
const PREFIXES: Readonly<Record<string, number>> = {
  f: 1e-15,
  p: 1e-12,
  n: 1e-9,
  u: 1e-6,
  µ: 1e-6, // U+00B5 MICRO SIGN
  μ: 1e-6, // U+03BC GREEK SMALL LETTER MU
  m: 1e-3,
  k: 1e3,
  M: 1e6,
  G: 1e9,
};

/** Unit spellings accepted per base unit (exact case). */
const UNIT_SPELLINGS: Readonly<Record<ElementUnit, readonly string[]>> = {
  // U+03A9 GREEK CAPITAL OMEGA and U+2126 OHM SIGN look the same; both are accepted.
  'Ω': ['Ω', 'Ω', 'ohms', 'ohm', 'Ohms', 'Ohm'],
  H: ['H'],
  F: ['F'],
};

const OTHER_UNITS: Readonly<Record<ElementUnit, readonly ElementUnit[]>> = { 'Ω': ['H', 'F'], H: ['Ω', 'F'], F: ['Ω', 'H'] };

const UNIT_NAME: Readonly<Record<ElementUnit, string>> = { 'Ω': 'ohms (Ω)', H: 'henries (H)', F: 'farads (F)' };

const NUMBER = /^([+-]?(?:\d+(?:\.\d*)?|\.\d+)(?:[eE][+-]?\d+)?)\s*(.*)$/u;

const PREFIX_LIST = 'f, p, n, µ (or u), m, k, M, G';

/**
 * Read a value in `unit`. Numbers are taken as already in the base unit. The sign and size are not
 * judged here (a negative or zero value parses; the caller says what range it needs).
 */
export function parseSiValue(input: unknown, unit: ElementUnit): ParsedValue {
  if (typeof input === 'number') {
    return Number.isFinite(input) ? { ok: true, value: input } : { ok: false, message: `must be a finite number of ${UNIT_NAME[unit]}` };
  }
  if (typeof input !== 'string') {
    return { ok: false, message: `must be a number of ${UNIT_NAME[unit]} or text such as ${example(unit)}` };
  }
  const text = input.trim();
  const m = NUMBER.exec(text);
  if (!m) return { ok: false, message: `"${input}" does not start with a number; write e.g. ${example(unit)}` };
  const number = Number(m[1]);
  const rest = m[2]!.trim();
  const prefix = stripUnit(rest, unit);
  if (prefix === null) {
    const other = OTHER_UNITS[unit].find((u) => stripUnit(rest, u) !== null);
    if (other) return { ok: false, message: `"${input}" is in ${UNIT_NAME[other]}; this value is in ${UNIT_NAME[unit]}` };
    return { ok: false, message: `"${input}": unknown prefix or unit "${rest}"; use one of the prefixes ${PREFIX_LIST}, then ${unit} if you like (e.g. ${example(unit)})` };
  }
  if (prefix !== '' && PREFIXES[prefix] === undefined) {
    return { ok: false, message: `"${input}": unknown prefix "${prefix}"; use one of ${PREFIX_LIST}` };
  }
  const value = number * (prefix === '' ? 1 : PREFIXES[prefix]!);
  if (!Number.isFinite(value)) return { ok: false, message: `"${input}" is too large` };
  return { ok: true, value };
}

/**
 * The prefix part of `rest` once the unit symbol (if any) is taken off, or null when `rest` is not
 * "prefix? unit?" for this unit.
 */
function stripUnit(rest: string, unit: ElementUnit): string | null {
  if (rest === '') return '';
  for (const spelling of UNIT_SPELLINGS[unit]) {
    if (rest.endsWith(spelling)) {
      const p = rest.slice(0, -spelling.length).trim();
      return p.length <= 1 ? p : null;
    }
  }
  // A lower-case unit letter after a prefix: "100 uf", "4.7 mh" (not "1 f", which is femto).
  if (unit !== 'Ω' && rest.length === 2 && rest[1] === unit.toLowerCase() && PREFIXES[rest[0]!] !== undefined) return rest[0]!;
  // A bare prefix ("10k", "47n").
  return rest.length === 1 && PREFIXES[rest] !== undefined ? rest : null;
}

function example(unit: ElementUnit): string {
  return unit === 'Ω' ? '"1.2 kΩ" or "10k"' : unit === 'H' ? '"4.7 mH"' : '"220 µF" or "220 uF"';
}

/** A value in engineering notation with an SI prefix, e.g. 4.7e-3 H → "4.7 mH" (for messages and reports). */
export function formatSi(value: number, unit: string, digits = 4): string {
  if (value === 0 || !Number.isFinite(value)) return `${value} ${unit}`;
  const steps = SI_PREFIX_STEPS;
  const a = Math.abs(value);
  const [factor, prefix] = steps.find(([f]) => a >= f * (1 - 1e-12)) ?? steps[steps.length - 1]!;
  return `${Number((value / factor).toPrecision(digits))} ${prefix}${unit}`;
}
