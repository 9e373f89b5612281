/**
 * How the cost over the years writes a setting: the whole `running` object with the one value changed,
 * through the engine-checked setField, so a rule between fields (the day price ends after it starts,
 * fuel rises with load) refuses the value typed, whichever field the engine names. The message is moved
 * to the field typed in; nothing is stored from a refused value. A project without `running` yet takes
 * it through LossCost's `writeRunning` (the device's price and hours carried over).
 */
import { PROJECT_LEVEL } from '../../../core/page.ts';
import { setField, setFieldError, type DraftProject } from '../../state/editor.ts';
import { writeRunning } from '../machines/LossCost.tsx';

export const UNDO_WORDS = 'Cost over the years';

const isRecord = (v: unknown): v is Record<string, unknown> => typeof v === 'object' && v !== null && !Array.isArray(v);

/** Write `running.<key>` (`key` may be `generator.<field>`); `undefined` clears it. Returns the engine's message or null. */
export function writeLifetime(project: DraftProject, key: string, value: unknown, label: string): string | null {
  const own = project['running'];
  const path = `running.${key}`;
  if (!isRecord(own)) return writeRunning(project, key as Parameters<typeof writeRunning>[1], value, label, UNDO_WORDS);
  const next: Record<string, unknown> = { ...own };
  const [head, sub] = key.split('.') as [string, string | undefined];
  if (sub === undefined) {
    if (value === undefined) delete next[head];
    else next[head] = value;
  } else {
    const inner: Record<string, unknown> = { ...(isRecord(own[head]) ? own[head] : {}) };
    if (value === undefined) delete inner[sub];
    else inner[sub] = value;
    next[head] = inner;
  }
  const message = setField(PROJECT_LEVEL, 'running', next, `${UNDO_WORDS}: ${label.toLowerCase()}`);
  setFieldError(PROJECT_LEVEL, 'running', null);
  setFieldError(PROJECT_LEVEL, path, message);
  return message;
}
