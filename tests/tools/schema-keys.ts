/**
 * Every camelCase key of the file format's schemas (the zod mini definitions of every kind, the backup
 * study, the drop limits, the pump duty and the running cost, walked), and a pattern that finds one standing as a word:
 * what must never reach users as a field's name (tests/core/messages.test.ts, tests/tools/user-words.test.ts).
 */
import { KINDS } from '../../core/kinds/index.ts';
import { backupSchema } from '../../core/solve/load-profile.ts';
import { dropLimitsSchema } from '../../core/conductors/path-drop.ts';
import { pumpDutySchema } from '../../core/kinds/pump.ts';
import { runningSchema } from '../../core/solve/running-schema.ts';

export function schemaKeys(): string[] {
  const keys = new Set<string>();
  const seen = new Set<unknown>();
  const walk = (s: unknown): void => {
    if (typeof s !== 'object' || s === null || seen.has(s)) return;
    seen.add(s);
    const def = (s as { _zod?: { def?: Record<string, unknown> } })._zod?.def;
    if (!def) return;
    const shape = def['shape'];
    if (shape && typeof shape === 'object') {
      for (const [k, v] of Object.entries(shape)) {
        keys.add(k);
        walk(v);
      }
    }
    for (const v of Object.values(def)) {
      if (Array.isArray(v)) v.forEach(walk);
      else walk(v);
    }
  };
  for (const spec of KINDS.values()) walk(spec.schema);
  [backupSchema, dropLimitsSchema, pumpDutySchema, runningSchema].forEach(walk);
  return [...keys].filter((k) => /[a-z][A-Z]/.test(k)).sort();
}

export const CAMEL_KEYS = schemaKeys();
export const CAMEL_RE = new RegExp(`(?<![\\w.-])(${CAMEL_KEYS.join('|')})(?![\\w-])`);
