/**
 * Field edits checked by the engine: a field writes with `setField(elementId, path, value)`; the
 * candidate is solved once (solution.ts keeps the outcome) and refused, with the message at the
 * field and the draft unchanged, when the engine rejects that field. So nothing is ever stored from
 * an invalid value.
 */
import { PROJECT_LEVEL, fieldLabel, type Problem } from '../../core/page.ts';
import { engine, engineFailure } from './engine.ts';
import { messageText } from '../format/message-text.ts';
import { effectiveLocale, unitSystem } from './prefs.ts';
import { clone, commit, draft, setAt, type DraftProject } from './draft.ts';
import { newLimitIssue } from './draft-limits.ts';
import { fieldKey, setFieldError } from './field-errors.ts';
import { elementName } from './tree.ts';
import { solveOnce } from './solution.ts';

/** Problems the engine's validation reports for one field of one element (or of the project). */
export function problemsForField(project: DraftProject, elementId: string, path: string): Problem[] {
  const e = engine.value;
  if (!e) return [];
  const checked = e.validateProject(project);
  if (checked.ok) return [];
  return checked.problems.filter(
    (p) => p.elementId === elementId && (p.field === path || p.field.startsWith(`${path}.`)) && p.code === 'invalid-value',
  );
}

/**
 * Set one field of one element (or of the project, with elementId PROJECT_LEVEL) — the way every form
 * field writes. The candidate is checked by the engine's validation first: if the engine rejects this
 * field, the draft is left as it was, the message is kept at the field and returned. `undefined`
 * clears an optional field.
 */
export function setField(elementId: string, path: string, value: unknown, label?: string): string | null {
  const current = draft.value;
  if (!current) return 'No project is open.';
  // Nothing enters the draft unchecked: before the engine has arrived (web/state/engine.ts, a
  // moment after the page opens) a field write is refused and the field keeps its text.
  if (!engine.value) return engineFailure.value ?? 'The calculation is still loading: try again in a moment.';
  // A new project object with a copy of the one element (or of the project's own fields) that
  // changes; the other elements are shared with the draft, so a memo'd view of an unchanged stage
  // sees the same object and skips its work.
  let candidate: DraftProject;
  let target: Record<string, unknown>;
  if (elementId === PROJECT_LEVEL) {
    const { elements, ...own } = current;
    candidate = { ...clone(own), elements } as DraftProject;
    target = candidate as Record<string, unknown>;
  } else {
    const at = current.elements.findIndex((e) => e.id === elementId);
    if (at < 0) return `There is no element "${elementId}".`;
    const copy = clone(current.elements[at]!);
    candidate = { ...current, elements: current.elements.map((e, i) => (i === at ? copy : e)) };
    target = copy;
  }
  setAt(target, path, value);
  // What the import would refuse never enters the draft (limits.ts), before anything is solved.
  const limit = newLimitIssue(current, candidate);
  if (limit) {
    const message = limit.words;
    setFieldError(elementId, path, message);
    return message;
  }
  // Solve the candidate once: when it solves, no field of it is invalid (the solve validates it
  // first) and the outcome is kept for `outcome`, so a keystroke validates the project once, not twice.
  const solved = solveOnce(candidate);
  const problems = solved?.ok ? [] : problemsForField(candidate, elementId, path);
  if (problems.length) {
    // The message's numbers in the user's units (web/format/message-text.ts).
    const message = problems.map((p) => messageText(p, unitSystem.value, effectiveLocale())).join('; ');
    setFieldError(elementId, path, message);
    return message;
  }
  setFieldError(elementId, path, null);
  const name = elementId === PROJECT_LEVEL ? 'project' : elementName(current, elementId);
  // The undo label names the field by its form label, not its path in the file.
  const kind = elementId === PROJECT_LEVEL ? 'project' : current.elements.find((e) => e.id === elementId)?.kind;
  commit(current, candidate, label ?? `${name}: ${fieldLabel(typeof kind === 'string' ? kind : undefined, path)}`, { coalesce: fieldKey(elementId, path) });
  return null;
}
