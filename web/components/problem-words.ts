/**
 * A refusal or warning as users read it: the element by the name they gave it (its kind and place
 * when unnamed), the field by its form label (core/model/field-labels.ts, the table the forms show),
 * and the numbers of the message in the user's unit system and number format, in the unit the form
 * works in for that quantity (m³/h or gpm for a pump's flow, ft for a length in US units): the
 * engine keeps them as quantities (`template`, `values`; core/model/message.ts).
 */
import { PROJECT_LEVEL, elementWords, fieldLabel, pathWords, type Problem } from '../../core/page.ts';
import { messageText } from '../format/message-text.ts';
import type { UnitSystem } from '../format/units.ts';

export { messageText, messageValueText } from '../format/message-text.ts';
import { effectiveLocale, unitSystem } from '../state/prefs.ts';

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
