/**
 * The engine's heavy part (validation, the solve, conductor sizing and its tables: `engine-lazy.ts`)
 * is not in the first load: `loadEngine()` fetches it, and `web/main.tsx` calls it at start, so it
 * arrives in parallel with the storage read and the first paint. Until it has arrived `engine` is
 * null: the draft's outcome is not computed yet (no results are shown, never wrong ones), and the
 * solution (`solution.ts`) follows the signal, so the results appear when it arrives.
 */
import { signal } from '@preact/signals';

export type Engine = typeof import('./engine-lazy.ts');

/** The loaded engine, or null while it is on its way. */
export const engine = signal<Engine | null>(null);

/**
 * Why the engine could not be loaded (its files could not be fetched: offline before the app was
 * ever stored for offline use, or a new version replaced them), or null. The solution shows it in
 * place of results; the next `loadEngine()` tries again.
 */
export const engineFailure = signal<string | null>(null);

let loading: Promise<Engine> | undefined;

/** Fetch the engine once (later calls share the first); the signal is set when it arrives. */
export function loadEngine(): Promise<Engine> {
  loading ??= import('./engine-lazy.ts').then(
    (m) => {
      engineFailure.value = null;
      engine.value = m;
      return m;
    },
    (error: unknown) => {
      loading = undefined;
      engineFailure.value = 'The calculation could not be loaded. Check the connection and reload the page.';
      throw error;
    },
  );
  return loading;
}

/** The studies the kinds of these elements offer (empty until the engine has arrived). */
export function studiesOf(elements: readonly { kind: string }[]): ReturnType<Engine['studiesOf']> {
  const e = engine.value;
  return e ? e.studiesOf(elements) : new Set();
}
