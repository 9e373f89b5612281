/**
 * How many times the engine validated a whole project, solved a base case and re-solved a changed
 * chain (a variant) since the last reset. Plain numbers (no clock, no DOM): `validateProject`,
 * `solveProject` and `solveVariant` add to them; tests/core/solve-count.test.ts reads and resets
 * them to check that one command-line run validates and solves each project once.
 */
export interface SolveCounts {
  /** validateProject calls (the whole file checked). */
  validations: number;
  /** Base solves: solveProject past its validation. */
  solves: number;
  /** Re-solves of a changed chain from a solved project (solveVariant): motor starts, capacitor banks, battery variants. */
  variantSolves: number;
  /** Changed chains built from a solved project (variantProject; solveVariant builds one before it solves it, and a battery variant stepped by core/solve/repeat.ts is built only). */
  variants: number;
}

const counts: SolveCounts = { validations: 0, solves: 0, variantSolves: 0, variants: 0 };

/** Add one to a count (called by the engine only). */
export function countSolveStep(what: keyof SolveCounts): void {
  counts[what]++;
}

/** The counts since the last reset (a copy). */
export function readSolveCounts(): SolveCounts {
  return { ...counts };
}

/** Set every count back to 0. */
export function resetSolveCounts(): void {
  counts.validations = 0;
  counts.solves = 0;
  counts.variantSolves = 0;
  counts.variants = 0;
}
