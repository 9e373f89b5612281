/**
 * What every form field shares: its element id and path, the message shown at it (text not taken
 * in, a value the engine refused, or a problem the engine reports for the draft), and the ids that
 * tie the label, the help line and the message to the control.
 */
import type { ComponentChildren } from 'preact';
import { PROJECT_LEVEL } from '../../../core/page.ts';
import { draft, draftProblems, edit, elementName, fieldErrors, fieldError, setFieldError, type DraftProject } from '../../state/editor.ts';
import { messageForField, type FormElement } from '../../editor/fields.ts';
import type { Quantity } from '../../format/parse.ts';
import { messageText } from '../problem-words.ts';
import { effectiveLocale, unitSystem } from '../../state/prefs.ts';

/** Which object a field belongs to: an element id, or PROJECT_LEVEL for project-level fields. */
export interface FieldOwner {
  id: string;
  /** The element's (or project's) data as it stands in the draft. */
  data: FormElement;
}

/** An id safe for HTML from the owner and the path. */
export function fieldId(owner: string, path: string, suffix = ''): string {
  return `sf-${owner}-${path}${suffix}`.replace(/[^A-Za-z0-9_-]/g, '_');
}

/** The engine's problems of the draft that name this field exactly. */
export function engineProblems(owner: string, path: string): string[] {
  // The message's numbers in the user's units and number format (web/components/problem-words.ts).
  return draftProblems.value.filter((p) => p.elementId === owner && p.field === path).map((p) => messageText(p, unitSystem.value, effectiveLocale()));
}

/**
 * The message shown at a field: what was typed and not taken in (or refused by the engine) first,
 * else the draft's own problems for this field (e.g. a file opened with a bad value).
 */
export function useFieldMessage(owner: string, path: string, spec: { label: string; quantity?: Quantity }): string | undefined {
  const own = fieldError(owner, path);
  if (own) return messageForField(spec, own);
  const engine = engineProblems(owner, path);
  return engine.length ? messageForField(spec, engine.join('; ')) : undefined;
}

/** Remove the messages of fields whose path starts with `prefix` (a part of the form replaced). */
export function clearFieldErrors(owner: string, prefix: string): void {
  for (const key of fieldErrors.value.keys()) {
    const [id, path] = key.split('\u0000');
    if (id === owner && path !== undefined && (path === prefix || path.startsWith(`${prefix}.`))) setFieldError(owner, path, null);
  }
}

/** The name used in undo labels. */
export function ownerName(owner: string): string {
  const p = draft.value;
  if (owner === PROJECT_LEVEL || !p) return 'Project';
  return elementName(p, owner);
}

/**
 * Change the owner's data in one undoable step (variant switches, table rows, dependent choices).
 * Returns why the change was not taken in (a limit of the project file), or null.
 */
export function editOwner(owner: string, label: string, change: (data: FormElement) => void): string | null {
  return edit(`${ownerName(owner)}: ${label}`, (p: DraftProject) => {
    const target = owner === PROJECT_LEVEL ? (p as FormElement) : p.elements.find((e) => e.id === owner);
    if (target) change(target as FormElement);
  });
}

/** The line under a control: help text and the message, each with its own id for aria-describedby. */
export function FieldNotes({ helpId, help, messageId, message }: { helpId: string; help?: string | undefined; messageId: string; message?: string | undefined }) {
  return (
    <>
      {help && (
        <p class="sf-help" id={helpId}>
          {help}
        </p>
      )}
      {message && (
        <p class="sf-message" id={messageId} role="alert" data-testid="field-message">
          {message}
        </p>
      )}
    </>
  );
}

/** ids for aria-describedby: the help line and the message, when shown. */
export function describedBy(helpId: string, help: string | undefined, messageId: string, message: string | undefined): string | undefined {
  const ids = [help ? helpId : '', message ? messageId : ''].filter(Boolean).join(' ');
  return ids || undefined;
}

export function FieldRow({ children, invalid, path }: { children: ComponentChildren; invalid: boolean; path: string }) {
  return (
    <div class={invalid ? 'sf-field sf-field--invalid' : 'sf-field'} data-path={path}>
      {children}
    </div>
  );
}
