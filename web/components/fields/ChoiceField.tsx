/**
 * A choice from a list (phases, chemistry, conductor size, installation method…). Options the engine
 * cannot compute with are shown disabled, with the reason under the field. An optional choice has a
 * first entry that leaves the field out (the engine's default applies).
 */
import { setField, setFieldError } from '../../state/editor.ts';
import { effectiveLocale, unitSystem } from '../../state/prefs.ts';
import { valueAt, type ChoiceOption, type ChoiceSpec } from '../../editor/fields.ts';
import { FieldNotes, FieldRow, describedBy, editOwner, fieldId, ownerName, useFieldMessage, type FieldOwner } from './common.tsx';

const NOT_GIVEN = '';

export function ChoiceField({ owner, spec }: { owner: FieldOwner; spec: ChoiceSpec }) {
  const ctx = { units: unitSystem.value, locale: effectiveLocale() };
  const options: readonly ChoiceOption[] = typeof spec.options === 'function' ? spec.options(owner.data, ctx) : spec.options;
  const stored = valueAt(owner.data, spec.path);
  const storedKey = stored === undefined ? NOT_GIVEN : String(stored);
  const known = options.some((o) => String(o.value) === storedKey);
  const message = useFieldMessage(owner.id, spec.path, spec);
  const id = fieldId(owner.id, spec.path);
  const helpId = `${id}-help`;
  const messageId = `${id}-msg`;
  const chosen = options.find((o) => String(o.value) === storedKey);
  const disabledNote = [...new Set(options.filter((o) => o.disabled).map((o) => o.disabled!))];
  const help = [spec.help, chosen?.disabled ? `Not available: ${chosen.disabled}.` : disabledNote.length ? `Greyed out: ${disabledNote.join('; ')}.` : '']
    .filter(Boolean)
    .join(' ');

  const onChange = (event: Event) => {
    const raw = (event.currentTarget as HTMLSelectElement).value;
    const option = options.find((o) => String(o.value) === raw);
    const value = raw === NOT_GIVEN ? undefined : option ? option.value : raw;
    if (spec.follow) {
      // The value and what must follow it change in one undoable step.
      setFieldError(owner.id, spec.path, null);
      editOwner(owner.id, spec.label, (data) => {
        const keys = spec.path.split('.');
        let at = data;
        for (const k of keys.slice(0, -1)) at = (at[k] ??= {}) as typeof data;
        const last = keys[keys.length - 1]!;
        if (value === undefined) delete at[last];
        else at[last] = value;
        spec.follow!(data, value);
      });
      return;
    }
    setField(owner.id, spec.path, value, `${ownerName(owner.id)}: ${spec.label}`);
    // A refusal: setField keeps the engine's message at the field; it is shown through messageForField.
  };

  return (
    <FieldRow invalid={message !== undefined} path={spec.path}>
      <label class="sf-label" for={id}>
        {spec.label}
        {!spec.required && <span class="sf-optional"> (optional)</span>}
      </label>
      <select
        id={id}
        class="sf-select"
        value={storedKey}
        aria-invalid={message ? 'true' : undefined}
        aria-describedby={describedBy(helpId, help, messageId, message)}
        data-testid={`field-${spec.path}`}
        onChange={onChange}
      >
        {(!spec.required || stored === undefined) && <option value={NOT_GIVEN}>{spec.required ? '— choose —' : '— not given (default) —'}</option>}
        {!known && stored !== undefined && <option value={storedKey}>{storedKey} (as in the file)</option>}
        {options.map((o) => (
          <option key={String(o.value)} value={String(o.value)} disabled={o.disabled !== undefined && String(o.value) !== storedKey}>
            {o.disabled ? `${o.label} (no data)` : o.label}
          </option>
        ))}
      </select>
      <FieldNotes helpId={helpId} help={help || undefined} messageId={messageId} message={message} />
    </FieldRow>
  );
}
