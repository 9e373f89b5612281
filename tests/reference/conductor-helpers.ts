/**
 * Helpers shared by the conductor reference tests: read a conductor result by field name, so the
 * tests compile before and after the design-current interface of issue 14 lands (a field the
 * engine does not report fails the check that reads it, with its name).
 */
import { solveProject } from '../../core/index.ts';
import type { SizingExample } from './sizing-examples.ts';

/** Follow a dotted path into a plain object; `undefined` when any step is missing. */
export function pick(root: unknown, path: string): unknown {
  let cur: unknown = root;
  for (const k of path.split('.')) {
    if (cur === null || typeof cur !== 'object') return undefined;
    cur = (cur as Record<string, unknown>)[k];
  }
  return cur;
}

/** Solve a case and return its cable's conductor result, or throw with the engine's problems. */
export function conductorOf(c: Pick<SizingExample, 'project' | 'cable' | 'id'>): Record<string, unknown> {
  const out = solveProject(c.project);
  if (!out.ok) throw new Error(`${c.id}: the engine refused the project: ${out.problems.map((p) => `${p.elementId ?? ''} ${p.field ?? ''}: ${p.message}`).join('; ')}`);
  const el = out.result.elements.find((e) => e.id === c.cable);
  const cond = (el as unknown as { conductor?: Record<string, unknown> } | undefined)?.conductor;
  if (!cond) throw new Error(`${c.id}: no conductor result on "${c.cable}"`);
  return cond;
}

