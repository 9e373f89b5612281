/**
 * A number field of the "Find the option" panel (the panels' StudyInput): what is typed is read in the
 * user's number format and written when it reads as a number of at least 0, or is emptied.
 */
import { useState } from 'preact/hooks';
import { formatForInput, parseLocaleNumber } from '../../format/parse.ts';
import { StudyInput } from '../StudyInput.tsx';

export type Locale = string | undefined;

/** A number typed in the user's format, or undefined when empty; null when it is not a number. */
function readNumber(text: string, locale: Locale): number | undefined | null {
  const p = parseLocaleNumber(text, locale);
  if (p.kind === 'empty') return undefined;
  return p.kind === 'number' ? p.value : null;
}

/** A number input (the panels' StudyInput) that writes when what is typed reads as a number of at least 0, or is emptied. */
export function NumberInput({ id, label, unit, value, onValue, locale, help, testId }: { id: string; label: string; unit: string; value: number | undefined; onValue: (v: number | undefined) => void; locale: Locale; help?: string; testId: string }) {
  const [text, setText] = useState<string | null>(null);
  const [bad, setBad] = useState<string | null>(null);
  return (
    <StudyInput
      id={id}
      label={label}
      unit={unit}
      text={text ?? (value === undefined ? '' : formatForInput(value, locale))}
      help={help}
      message={bad}
      testId={testId}
      onText={(t) => {
        setText(t);
        const v = readNumber(t, locale);
        const wrong = v === null ? 'is not a number' : v !== undefined && v < 0 ? 'must not be negative' : null;
        setBad(wrong);
        if (!wrong) onValue(v ?? undefined);
      }}
      onLeave={() => {
        if (!bad) setText(null);
      }}
    />
  );
}

