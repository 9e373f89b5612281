/**
 * One number setting of a study, kept in the project file: a labelled input in the user's units and
 * number format (StudyInput), the typical value and why in one short line under it, and the engine's
 * message at the field when the value cannot be used. The value is written through the engine-checked
 * setField (web/state/field-edit.ts): a value the engine refuses never enters the project, the field
 * keeps the text and the message, and the results shown stay those of the last valid inputs, marked
 * out of date (resultsState).
 */
import { useState } from 'preact/hooks';
import { StudyInput } from './StudyInput.tsx';
import type { UnitSystem } from '../format/units.ts';
import { inputText, inputUnit, readNumberField, type Quantity } from '../format/parse.ts';
import { fieldError, getAt, setField, setFieldError, type DraftProject } from '../state/editor.ts';
import { PROJECT_LEVEL } from '../../core/page.ts';

export interface SettingFieldProps {
  project: DraftProject;
  /** The element the field belongs to (PROJECT_LEVEL for the project's own settings). */
  owner?: string;
  path: string;
  label: string;
  quantity: Quantity;
  /** Shown greyed when the field is empty: what the engine takes without it. */
  placeholder?: string | undefined;
  /** The typical value and why, one short line under the field. */
  help?: string | undefined;
  /** The unit beside the input, when not the quantity's own (a currency per kWh). */
  unit?: string;
  /** The value shown when the project holds none (a setting carried over from this device). */
  fallback?: number | null | undefined;
  /** Writes a value the user typed (default: setField at owner/path); returns the engine's message or null. */
  write?: (value: number | undefined) => string | null;
  /** The undo step's words (default: the label). */
  undoLabel?: string;
  units: UnitSystem;
  locale: string | undefined;
  testId: string;
}

export function SettingField({ project, owner = PROJECT_LEVEL, path, label, quantity, placeholder, help, unit, fallback, write, undoLabel, units, locale, testId }: SettingFieldProps) {
  const [text, setText] = useState<string | null>(null);
  const stored = owner === PROJECT_LEVEL ? getAt(project, path) : getAt(project.elements.find((e) => e.id === owner), path);
  const error = fieldError(owner, path);
  // The study panels' own ids (the element's form shows an element's field under another id).
  const id = `study-${owner ? `${owner.replace(/\W+/g, '-')}-` : ''}${path.replace(/\W+/g, '-')}`;
  const commit = (value: string) => {
    setText(value);
    const read = readNumberField(value, { label, quantity, required: false }, units, locale);
    if (!read.ok) {
      setFieldError(owner, path, read.message);
      return;
    }
    if (write) write(read.value);
    else setField(owner, path, read.value, undoLabel ?? label);
  };
  const shown = typeof stored === 'number' ? stored : (fallback ?? undefined);
  return (
    <StudyInput
      id={id}
      label={label}
      unit={unit ?? inputUnit(quantity, units).symbol}
      text={text ?? inputText(shown, quantity, units, locale)}
      placeholder={placeholder}
      help={help}
      message={error}
      onText={commit}
      onLeave={() => {
        if (!fieldError(owner, path)) setText(null);
      }}
      testId={testId}
    />
  );
}
