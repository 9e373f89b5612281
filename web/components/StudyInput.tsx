/**
 * The labelled number input the study panels use for their settings (battery study inputs, the
 * running-cost preferences): the text as typed or as stored, the unit beside it, and the message at
 * the field. Reading and storing the value is the caller's (each writes somewhere else).
 */
export interface StudyInputProps {
  id: string;
  label: string;
  unit: string;
  /** The text shown: what the user is typing, or the stored value formatted. */
  text: string;
  placeholder?: string | undefined;
  /** One short line under the field: the typical value and why. */
  help?: string | undefined;
  /** The message at the field, when the text cannot be used. */
  message?: string | null | undefined;
  onText: (text: string) => void;
  /** Called when the field loses focus (callers show the stored value again unless it holds an error). */
  onLeave: () => void;
  testId: string;
}

export function StudyInput({ id, label, unit, text, placeholder, help, message, onText, onLeave, testId }: StudyInputProps) {
  const described = [help ? `${id}-help` : '', message ? `${id}-error` : ''].filter(Boolean).join(' ');
  return (
    <div class={message ? 'study-field study-field--error' : 'study-field'}>
      <label for={id} class="study-field__label">
        {label}
      </label>
      <span class="study-field__row">
        <input
          id={id}
          class="study-field__input"
          type="text"
          inputMode="decimal"
          autoComplete="off"
          value={text}
          placeholder={placeholder}
          aria-invalid={message ? 'true' : undefined}
          aria-describedby={described || undefined}
          onInput={(e) => onText((e.currentTarget as HTMLInputElement).value)}
          onBlur={onLeave}
          data-testid={testId}
        />
        <span class="study-field__unit">{unit}</span>
      </span>
      {help && (
        <span id={`${id}-help`} class="study-field__help">
          {help}
        </span>
      )}
      {message && (
        <span id={`${id}-error`} class="study-field__error" role="alert">
          {message}
        </span>
      )}
    </div>
  );
}
