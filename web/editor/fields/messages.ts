/**
 * The engine's messages as shown at a field.
 * Part of the form descriptors; web/editor/fields.ts is their entry (today's exports, callers import it).
 */
import type { Quantity } from '../../format/parse.ts';

/**
 * The engine's message as shown at a field: fractions typed in per cent get their limits in per cent
 * ("must not exceed 1 (enter 0.95 for 95 %)" → "must not exceed 100 %").
 */
export function messageForField(spec: { label: string; quantity?: Quantity }, message: string): string {
  let text = message;
  if (spec.quantity === 'fraction-percent') {
    text = text
      .replace(/\s*\(enter [^)]*\)/g, '')
      .replace(/\b(exceed|below|above|at least|greater than|less than) (\d+(?:\.\d+)?)(?![\d.]| ?%)/g, (_m, word: string, n: string) => `${word} ${Number((Number(n) * 100).toPrecision(12))} %`);
  }
  return text.startsWith(`${spec.label}:`) ? text : `${spec.label}: ${text}`;
}
