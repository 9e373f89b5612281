/**
 * Which mode the results show for a project with a battery bank on a DC bus (issue 19): on supply (the
 * page's own solve) or on battery (core's solveModes, run in the panel worker by ModeResults.tsx). Light
 * on purpose: App.tsx reads it in the first load; the figures come with the lazy ModeResults.
 */
import { signal } from '@preact/signals';
import type { Solved, SolveResult } from '../../../core/page.ts';
import type { ModesReply } from '../panel-worker.ts';

export type ShownMode = 'supply' | 'battery';

/** The mode the user chose (on supply until they switch). */
export const shownMode = signal<ShownMode>('supply');

/**
 * The worker's last modes reply and the solved pair it was asked for (a reply for another pair is not
 * shown as current), the project opening it belongs to (the editor's openCount) and, when the bank can
 * carry the bus, the on-battery solved pair (the re-rooted project and its result, as the worker gave
 * them: one object per reply, so the tables that lag on it keep one identity).
 */
export const modesReply = signal<{ for: Solved; open?: number; outcome: ModesReply['outcome']; batteryPair?: Solved; supplyPair?: Solved } | null>(null);

/** The worker's crash for the modes request of a solved pair (the standing-by panel shares the mode switch's request). */
export const modesCrash = signal<{ for: Solved; message: string } | null>(null);

/**
 * Whether a project has a bank on a bus: a battery fed from another element (core/solve/modes.ts
 * `bankOnBus`, which the validation has checked; this is only its cheap test, without the engine).
 */
export function hasBankOnBus(project: { elements: readonly unknown[] }): boolean {
  return project.elements.some((e) => {
    const el = e as { kind?: unknown; from?: unknown };
    return el.kind === 'battery' && typeof el.from === 'string';
  });
}

/** The on-battery result for this solved pair, when the worker has given it. */
export function batteryResultFor(solved: Solved): SolveResult | null {
  const r = modesReply.value;
  if (!r || r.for !== solved || !r.outcome.ok || !r.outcome.battery.ok) return null;
  return r.outcome.battery.result;
}

/** The on-supply solved pair when it is not the page's own solve (an inverter-charger's pass-through), when the worker has given it. */
export function supplyPairFor(solved: Solved): Solved | null {
  const r = modesReply.value;
  return r && r.for === solved ? (r.supplyPair ?? null) : null;
}

/** The on-battery solved pair (its project and result) for this solved pair, when the worker has given it. */
export function batteryPairFor(solved: Solved): Solved | null {
  const r = modesReply.value;
  return r && r.for === solved ? (r.batteryPair ?? null) : null;
}

/**
 * Which mode a result shows, read from the result itself (on battery the bank is the chain's root),
 * so a table that lags while off screen names the mode of the figures it shows, not the switch's.
 */
export function modeOfResult(result: SolveResult): ShownMode {
  return result.elements[0]?.kind === 'battery' ? 'battery' : 'supply';
}

export const MODE_WORDS: Record<ShownMode, string> = { supply: 'On supply', battery: 'On battery' };
