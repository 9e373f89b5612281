/** Messages at fields whose typed text was not taken in (set by the forms and by setField). */
import { signal } from '@preact/signals';

/**
 * The DOM id of a field's control: the forms give each input this id (web/components/fields/common.tsx
 * `fieldId`, the same formula; tests/web/field-focus.test.ts checks they agree), so the problem
 * banner can focus the field it names without loading the forms.
 */
export function fieldDomId(owner: string, path: string): string {
  return `sf-${owner}-${path}`.replace(/[^A-Za-z0-9_-]/g, '_');
}

export function fieldKey(elementId: string, path: string): string {
  return `${elementId}\u0000${path}`;
}

/** Messages of fields whose typed text was not taken in (key: element id + path). */
export const fieldErrors = signal<ReadonlyMap<string, string>>(new Map());

export function fieldError(elementId: string, path: string): string | undefined {
  return fieldErrors.value.get(fieldKey(elementId, path));
}

/** Set (or clear, with null) the message shown at a field. */
export function setFieldError(elementId: string, path: string, message: string | null): void {
  const key = fieldKey(elementId, path);
  const had = fieldErrors.value.get(key);
  if (message === null ? had === undefined : had === message) return;
  const next = new Map(fieldErrors.value);
  if (message === null) next.delete(key);
  else next.set(key, message);
  fieldErrors.value = next;
}
