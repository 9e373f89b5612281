/** Messages at fields whose typed text was not taken in (set by the forms and by setField). */
import { signal } from '@preact/signals';

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
