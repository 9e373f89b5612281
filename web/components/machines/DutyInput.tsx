/**
 * One number of the duty editor: a labelled input in the user's units and number format, writing the
 * SI value through the engine-checked setField (a duty point of the project, or a field of the pump or
 * fan element); a refused value keeps its text and shows the message at the field.
 */
import { useState } from 'preact/hooks';
import { PROJECT_LEVEL } from '../../../core/page.ts';
import type { UnitSystem } from '../../format/units.ts';
import { inputText, inputUnit, readNumberField, type Quantity } from '../../format/parse.ts';
import { draft, fieldError, getAt, setField, setFieldError } from '../../state/editor.ts';
import { fieldDomId } from '../../state/field-errors.ts';
import { StudyInput } from '../StudyInput.tsx';

export interface DutyInputProps {
  /** PROJECT_LEVEL for the duty points, else the id of the pump or fan element. */
  owner: string;
  path: string;
  label: string;
  quantity: Quantity;
  units: UnitSystem;
  locale: string | undefined;
  testId: string;
  /** The undo list's words for this edit. */
  undoLabel: string;
  /** A message about the stored value from the study (a flow above the rated flow), shown when the field has none of its own. */
  studyMessage?: string | undefined;
  /**
   * When the field is typed as another quantity than it is stored in (a duty level typed as a speed,
   * stored as a flow): the engine's conversion each way, in SI.
   */
  convert?: { toStored(typed: number): { ok: true; value: number } | { ok: false; message: string }; fromStored(stored: number): number } | undefined;
}

export function DutyInput({ owner, path, label, quantity, units, locale, testId, undoLabel, studyMessage, convert }: DutyInputProps) {
  const [text, setText] = useState<string | null>(null);
  const project = draft.value;
  const target = owner === PROJECT_LEVEL ? project : project?.elements.find((e) => e.id === owner);
  const stored = getAt(target, path);
  const error = fieldError(owner, path) ?? studyMessage;
  // The duty points carry the problem banner's id for their path; an element's field is also in its
  // own form (the same page may show both), so its id here is the editor's own.
  const id = owner === PROJECT_LEVEL ? fieldDomId(owner, path) : `duty-${fieldDomId(owner, path)}`;
  const commit = (value: string) => {
    setText(value);
    const read = readNumberField(value, { label, quantity, required: true }, units, locale);
    if (!read.ok) {
      setFieldError(owner, path, read.message);
      return;
    }
    if (convert && read.value !== undefined) {
      const stored = convert.toStored(read.value);
      if (!stored.ok) {
        setFieldError(owner, path, `${label}: ${stored.message}`);
        return;
      }
      setField(owner, path, stored.value, undoLabel);
      return;
    }
    setField(owner, path, read.value, undoLabel);
  };
  const shown = convert && typeof stored === 'number' ? convert.fromStored(stored) : stored;
  return (
    <StudyInput
      id={id}
      label={label}
      unit={inputUnit(quantity, units).symbol}
      text={text ?? inputText(shown, quantity, units, locale)}
      message={error}
      onText={commit}
      onLeave={() => {
        if (!fieldError(owner, path)) setText(null);
      }}
      testId={testId}
    />
  );
}
