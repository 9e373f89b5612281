/**
 * Warnings about the user's project as a whole, added to the solves the user asks for: the project
 * (solveProject) and each of its named variants (solveProjectVariant). Not added to the changed
 * chains a study builds for itself (solveVariant: a motor start, the on-battery mode, a spread
 * sample): the on-battery mode of a DC plant has the layout of an off-grid chain, and a warning about
 * the project's design does not belong to it.
 *
 * - An inverter's pass-through limit in a project with no battery bank on a DC bus (an off-grid chain
 *   whose bank is the source, or a chain with no bank): the limit does nothing, and the modes study
 *   that names an inverter off the bank's bus (core/studies/modes/study.ts) does not run for such a
 *   project, so the solve names it (code `pass-through-unused`).
 */
import type { InverterStage } from '../model/project.ts';
import type { SolveWarning } from '../model/result.ts';
import { bankOnBus, unusedPassThrough } from './bank-place.ts';
import type { Solved } from './solved.ts';

/** The solved value with the project-level warnings (see the header) after the solve's own. */
export function withProjectWarnings(solved: Solved): Solved {
  const { project } = solved;
  if (!project.elements.some((e) => e.kind === 'inverter' && (e as InverterStage).passThroughLimit !== undefined)) return solved;
  if (bankOnBus(project) !== null) return solved;
  const added: SolveWarning[] = unusedPassThrough(project, null).map((u) => ({ code: 'pass-through-unused', elementId: u.inverterId, message: u.reason }));
  if (!added.length) return solved;
  return { ...solved, result: { ...solved.result, warnings: [...solved.result.warnings, ...added] } };
}
