/**
 * A message's numbers in the user's unit system and number format, in the unit the form works in
 * for that quantity (m³/h or gpm for a pump's flow, ft for a length in US units, °F): the engine
 * keeps them as quantities (`template`, `values`; core/model/message.ts). Display only.
 */
import { fillTemplate, type MessageUnit, type MessageValue } from '../../core/page.ts';
import { UNIT_GAP, formatSignificant, formatWithPrefix } from './number.ts';
import { inputUnit, type Quantity } from './parse.ts';
import type { UnitSystem } from './units.ts';

/** Units the forms show in a unit of their own (converted, or in another system's unit). */
const FORM_QUANTITY: Partial<Record<MessageUnit, Quantity>> = {
  'm³/s': 'flow',
  m: 'length',
  '°C': 'temperature',
  'kg/m³': 'density',
  Pa: 'pressure',
  'Ω/km': 'resistance-per-length',
};

/** Units written with k/M/G at each thousand, as the results tables write them. */
const PREFIXED: ReadonlySet<MessageUnit> = new Set(['V', 'A', 'W', 'VA', 'var', 'Hz', 'Ω']);

/** One value of a message in the user's units and number format, 3 significant digits. */
export function messageValueText(v: MessageValue, units: UnitSystem, locale?: string): string {
  // A fan's flow in the fan form's unit (m³/h or cfm), not a pump's (m³/h or gpm).
  const q = v.air && v.unit === 'm³/s' ? 'air-flow' : FORM_QUANTITY[v.unit];
  if (q) {
    const unit = inputUnit(q, units);
    return `${formatSignificant(unit.fromSi(v.si), 3, locale)}${unit.symbol ? `${UNIT_GAP}${unit.symbol}` : ''}`;
  }
  if (PREFIXED.has(v.unit)) return formatWithPrefix(v.si, v.unit, 3, locale);
  return `${formatSignificant(v.si, 3, locale)}${v.unit ? `${UNIT_GAP}${v.unit}` : ''}`;
}

/** A message in the user's units: its template filled with the page's formatting, else its text as the engine wrote it. */
export function messageText(m: { message: string; template?: string; values?: readonly MessageValue[] }, units: UnitSystem, locale?: string): string {
  if (!m.template || !m.values) return m.message;
  return fillTemplate(m.template, m.values.map((v) => messageValueText(v, units, locale)));
}
