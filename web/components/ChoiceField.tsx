/**
 * One choice setting of a study, kept in the project file (the sibling of SettingField.tsx for a
 * value picked from a few): a labelled native select, the typical choice and why in one short line
 * under it, written through the engine-checked setField (web/state/field-edit.ts) at owner/path with
 * the undo step's words, and the engine's message at the field when the value cannot be used.
 * Used by the battery panel's design (backup or cycling) and the standing-by panel's redundant modules.
 */
import { fieldError, setField } from '../state/editor.ts';
import { PROJECT_LEVEL } from '../../core/page.ts';

export interface ChoiceFieldProps {
  /** The element the field belongs to (PROJECT_LEVEL for the project's own settings). */
  owner?: string;
  path: string;
  label: string;
  /** The value shown (the stored one, or what the engine takes without one). */
  value: string;
  options: readonly { value: string; label: string }[];
  /** The typical choice and why, one short line under the field. */
  help: string;
  /** The undo step's words (default: the label). */
  undoLabel?: string;
  testId: string;
}

export function ChoiceField({ owner = PROJECT_LEVEL, path, label, value, options, help, undoLabel, testId }: ChoiceFieldProps) {
  const id = `study-${owner ? `${owner.replace(/\W+/g, '-')}-` : ''}${path.replace(/\W+/g, '-')}`;
  const error = fieldError(owner, path);
  return (
    <div class={error ? 'study-field study-field--error' : 'study-field'}>
      <label for={id} class="study-field__label">
        {label}
      </label>
      <select
        id={id}
        class="study-field__input"
        value={value}
        aria-describedby={`${id}-help${error ? ` ${id}-error` : ''}`}
        aria-invalid={error ? 'true' : undefined}
        data-testid={testId}
        onChange={(e) => setField(owner, path, (e.currentTarget as HTMLSelectElement).value, undoLabel ?? label)}
      >
        {options.map((o) => (
          <option key={o.value} value={o.value}>
            {o.label}
          </option>
        ))}
      </select>
      <span id={`${id}-help`} class="study-field__help">
        {help}
      </span>
      {error && (
        <span id={`${id}-error`} class="study-field__error" role="alert">
          {error}
        </span>
      )}
    </div>
  );
}
