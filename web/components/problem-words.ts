/**
 * A refusal or warning as users read it: the element by the name they gave it (its kind and place
 * when unnamed), the field by its form label (core/model/field-labels.ts, the table the forms show),
 * and the numbers of the message in the user's unit system and number format, in the unit the form
 * works in for that quantity (m³/h or gpm for a pump's flow, ft for a length in US units): the
 * engine keeps them as quantities (`template`, `values`; core/model/message.ts).
 */
import { PROJECT_LEVEL, elementWords, fieldLabel, fillTemplate, pathWords, type MessageUnit, type MessageValue, type Problem } from '../../core/page.ts';
import { UNIT_GAP, formatSignificant, formatWithPrefix } from '../format/number.ts';
import { inputUnit, type Quantity } from '../format/parse.ts';
import type { UnitSystem } from '../format/units.ts';
import { effectiveLocale, unitSystem } from '../state/prefs.ts';

/** Units the forms show in a unit of their own (converted, or in another system's unit). */
const FORM_QUANTITY: Partial<Record<MessageUnit, Quantity>> = {
  'm³/s': 'flow',
  m: 'length',
  '°C': 'temperature',
  'kg/m³': 'density',
  'Ω/km': 'resistance-per-length',
};

/** Units written with k/M/G at each thousand, as the results tables write them. */
const PREFIXED: ReadonlySet<MessageUnit> = new Set(['V', 'A', 'W', 'VA', 'var', 'Hz', 'Ω']);

/** One value of a message in the user's units and number format, 3 significant digits. */
export function messageValueText(v: MessageValue, units: UnitSystem, locale?: string): string {
  const q = FORM_QUANTITY[v.unit];
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

function isNamed(project: unknown, id: string): boolean {
  const elements = (project as { elements?: unknown } | null)?.elements;
  if (!Array.isArray(elements)) return false;
  const e = elements.find((x: unknown) => typeof x === 'object' && x !== null && (x as { id?: unknown }).id === id) as { name?: unknown } | undefined;
  return typeof e?.name === 'string' && e.name.trim() !== '';
}

/** Where a problem is, in words: "“Pump drive” › Output frequency", "Project › Design margin". */
export function problemPlace(p: Problem, project: unknown): { element: string; field: string } {
  const words = elementWords(project);
  // An unnamed element is called what its card calls it, its id (web/state/tree.ts elementName); the
  // CLI, which shows no cards, calls it by its kind and place ("DC load #2", formatProblem).
  const named = isNamed(project, p.elementId);
  const element = p.elementId === PROJECT_LEVEL ? 'Project' : named ? (words.names.get(p.elementId) ?? p.elementId) : p.elementId;
  const kind = p.elementId === PROJECT_LEVEL ? 'project' : words.kinds.get(p.elementId);
  // A figure that is not finite is a result's field, not one of the form's.
  const field = !p.field ? '' : p.code === 'non-finite' ? pathWords(p.field.split('.')) : fieldLabel(kind, p.field);
  return { element, field };
}

/** The problem in one line; the numbers in the user's display settings unless told otherwise. */
export function problemLine(p: Problem, project: unknown, units: UnitSystem = unitSystem.value, locale: string | undefined = effectiveLocale()): string {
  const { element, field } = problemPlace(p, project);
  const where = p.elementId === PROJECT_LEVEL ? '' : element;
  const head = [where, field && (where ? `(${field})` : field)].filter(Boolean).join(' ');
  const message = messageText(p, units, locale);
  return head ? `${head}: ${message}` : message;
}
