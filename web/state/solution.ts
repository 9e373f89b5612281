/**
 * The solution of the draft and the last valid solved pair. `outcome` is the engine's outcome for
 * the draft as it stands; `lastSolved` is the last solved value (core/solve: the validated project
 * and its result together) of a valid draft of this project, kept while later drafts are invalid.
 * Every view, the panel worker and the client report read that pair, never a result beside a draft
 * it did not come from; `resultsState` says whether it is the draft's own ("current") or an older
 * one ("stale").
 */
import { computed, effect, signal } from '@preact/signals';
import type { Problem, Solved, SolveOutcome } from '../../core/page.ts';
import { engine, engineFailure } from './engine.ts';
import { draft, openCount, type DraftProject } from './draft.ts';
import { fieldErrors } from './field-errors.ts';

/** Outcomes solved by setField for the candidate it took in (the draft object itself is the key). */
const solvedDrafts = new WeakMap<DraftProject, SolveOutcome>();

/**
 * Solve a candidate draft and keep its outcome for `outcome`; undefined when the engine threw
 * (`outcome` reports it) or has not arrived yet (`web/state/engine.ts`).
 */
export function solveOnce(candidate: DraftProject): SolveOutcome | undefined {
  const e = engine.value;
  if (!e) return undefined;
  try {
    const o = e.solveProject(candidate);
    solvedDrafts.set(candidate, o);
    return o;
  } catch {
    return undefined;
  }
}

/** The engine's outcome for the draft as it stands (null while the engine is on its way: nothing to show yet). */
export const outcome = computed<SolveOutcome | { ok: false; crashed: string } | null>(() => {
  const p = draft.value;
  if (!p) return null;
  const known = solvedDrafts.get(p);
  if (known) return known;
  const e = engine.value;
  if (!e) {
    const failure = engineFailure.value;
    return failure ? { ok: false, crashed: failure } : null;
  }
  try {
    return e.solveProject(p);
  } catch (error) {
    // An engine fault must not blank the page; show it so it can be reported.
    return { ok: false, crashed: `The calculation stopped unexpectedly: ${String(error)}` };
  }
});

/**
 * The last solved value of a valid draft of this project: the validated project and its result, one
 * pair (kept while later drafts are invalid). Views, the panel worker and the client report read
 * this pair, so a figure never stands beside names or inputs of a draft it did not come from.
 */
export const lastSolved = signal<Solved | null>(null);
effect(() => {
  const o = outcome.value;
  if (o?.ok) lastSolved.value = o;
});
// A different project starts without old results.
effect(() => {
  void openCount.value;
  const o = outcome.peek();
  lastSolved.value = o?.ok ? o : null;
});

/** One empty list, so that an edit that solves does not hand every reader a new (empty) array. */
const NO_PROBLEMS = Object.freeze([]) as unknown as Problem[];

/** Problems of the draft as it stands (empty when it solves). */
export const draftProblems = computed<Problem[]>(() => {
  const o = outcome.value;
  return o && !o.ok && 'problems' in o ? o.problems : NO_PROBLEMS;
});

/** A crash message, when the engine stopped unexpectedly. */
export const crashMessage = computed(() => {
  const o = outcome.value;
  return o && !o.ok && 'crashed' in o ? o.crashed : null;
});

/**
 * Whether the results shown are those of the inputs on screen: "current", or "stale" (the draft
 * does not solve, or a field holds text that was not taken in), or "none" (no valid result yet).
 */
export const resultsState = computed<'current' | 'stale' | 'none'>(() => {
  if (!lastSolved.value) return 'none';
  return outcome.value?.ok && fieldErrors.value.size === 0 ? 'current' : 'stale';
});
