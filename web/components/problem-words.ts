/**
 * A refusal as users read it: the element by the name they gave it (the id only when it has none),
 * the field in words (form labels need the editor's field list: see ProblemList), then the message.
 */
import { PROJECT_LEVEL, elementNames, fieldWords, type Problem } from '../../core/page.ts';

export function problemLine(p: Problem, project: unknown): string {
  const where = p.elementId === PROJECT_LEVEL ? '' : (elementNames(project).get(p.elementId) ?? p.elementId);
  const field = p.field ? fieldWords(p.field.split('.')) : '';
  const head = [where, field && (where ? `(${field})` : field)].filter(Boolean).join(' ');
  return head ? `${head}: ${p.message}` : p.message;
}
