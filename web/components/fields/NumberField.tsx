/**
 * A number with its unit beside it, in the user's unit system and locale. Every keystroke is read
 * (web/format/parse.ts) and, when it is a number, converted to SI and written through the engine-
 * checked setField; text that is not a number, or a value the engine refuses, leaves the project as
 * it was and shows the message at the field. While the field has focus (or holds refused text) it
 * shows what was typed; otherwise it shows the stored value in the chosen units.
 */
import { useEffect, useRef, useState } from 'preact/hooks';
import { setField, setFieldError, fieldError } from '../../state/editor.ts';
import { effectiveLocale, unitSystem } from '../../state/prefs.ts';
import { inputText, inputUnit, readNumberField } from '../../format/parse.ts';
import { valueAt, type NumberSpec } from '../../editor/fields.ts';
import { FieldNotes, FieldRow, describedBy, fieldId, ownerName, useFieldMessage, type FieldOwner } from './common.tsx';

export function NumberField({ owner, spec, compact = false }: { owner: FieldOwner; spec: NumberSpec; compact?: boolean }) {
  const units = unitSystem.value;
  const locale = effectiveLocale();
  const unit = inputUnit(spec.quantity, units);
  const stored = valueAt(owner.data, spec.path);
  const [typed, setTyped] = useState<string | null>(null);
  const [focused, setFocused] = useState(false);
  const ownError = fieldError(owner.id, spec.path);
  const message = useFieldMessage(owner.id, spec.path, spec);
  const id = fieldId(owner.id, spec.path);
  const helpId = `${id}-help`;
  const messageId = `${id}-msg`;
  const storedText = inputText(stored, spec.quantity, units, locale);
  const shown = typed !== null && (focused || ownError !== undefined) ? typed : storedText;
  const placeholderValue = spec.placeholder?.(owner.data);
  const placeholder = placeholderValue !== undefined ? inputText(placeholderValue, spec.quantity, units, locale) : undefined;

  // Text that was never taken in does not outlive its field: the draft is as it was, so the
  // results need not stay marked out of date once the form is closed.
  const pending = useRef({ owner: owner.id, path: spec.path });
  pending.current = { owner: owner.id, path: spec.path };
  useEffect(() => () => setFieldError(pending.current.owner, pending.current.path, null), []);

  const onInput = (event: Event) => {
    const text = (event.currentTarget as HTMLInputElement).value;
    setTyped(text);
    const reading = readNumberField(text, spec, units, locale);
    if (!reading.ok) {
      setFieldError(owner.id, spec.path, reading.message);
      return;
    }
    if (reading.value === stored) {
      setFieldError(owner.id, spec.path, null);
      return;
    }
    setField(owner.id, spec.path, reading.value, `${ownerName(owner.id)}: ${spec.label}`);
    // A refusal: setField keeps the engine's message at the field; it is shown through messageForField.
  };

  const help = spec.help;
  const label = (
    <label class={compact ? 'visually-hidden' : 'sf-label'} for={id}>
      {spec.label}
      {unit.name && <span class="visually-hidden">, in {unit.name}</span>}
      {!spec.required && !compact && <span class="sf-optional"> (optional)</span>}
    </label>
  );
  const control = (
    <span class="sf-input-unit">
      <input
        id={id}
        class="sf-input"
        type="text"
        inputMode={spec.quantity === 'temperature' || spec.quantity === 'per-watt' ? 'text' : 'decimal'}
        autoComplete="off"
        spellcheck={false}
        value={shown}
        placeholder={placeholder}
        aria-invalid={message ? 'true' : undefined}
        aria-describedby={compact ? (message ? messageId : undefined) : describedBy(helpId, help, messageId, message)}
        aria-required={spec.required ? 'true' : undefined}
        data-testid={`field-${spec.path}`}
        onFocus={() => {
          setFocused(true);
          if (ownError === undefined) setTyped(storedText);
        }}
        onBlur={() => {
          setFocused(false);
          if (fieldError(owner.id, spec.path) === undefined) setTyped(null);
        }}
        onInput={onInput}
      />
      {(spec.unitText?.(locale) ?? unit.symbol) && (
        <span class="sf-unit" aria-hidden="true">
          {spec.unitText?.(locale) ?? unit.symbol}
        </span>
      )}
    </span>
  );
  if (compact) {
    return (
      <div class={message ? 'sf-cell sf-field--invalid' : 'sf-cell'}>
        {label}
        {control}
        {message && (
          <p class="sf-message" id={messageId} role="alert" data-testid="field-message">
            {message}
          </p>
        )}
      </div>
    );
  }
  return (
    <FieldRow invalid={message !== undefined} path={spec.path}>
      {label}
      {control}
      <FieldNotes helpId={helpId} help={help} messageId={messageId} message={message} />
    </FieldRow>
  );
}
