/**
 * The battery backup discharge of a project's `backup` study: the entry points. The method (time
 * integration through the chain, Peukert, temperature, the ends of discharge) is in
 * discharge-run.ts, the result's shape in discharge-types.ts. Both take the solved value of
 * core/solve: the project is never validated or solved again here.
 */
import type { BatterySource, Project } from '../../model/project.ts';
import type { SolveResult } from '../../model/result.ts';
import { PROJECT_LEVEL, type Problem } from '../../model/errors.ts';
import type { Solved } from '../../solve/index.ts';
import { solveVariant, variantProject, type VariantChange } from '../../solve/variant.ts';
import { CHEMISTRY_PRESETS } from '../../data/battery-chemistries.ts';
import { checkStudy } from '../../solve/load-profile.ts';
import { hasConductorSpecs, runDischarge, startProblem, type DischargeKeep } from './discharge-run.ts';
import type { DischargeOutcome } from './discharge-types.ts';

export type { DischargeKeep } from './discharge-run.ts';
export type { EndReason, DischargeSeries, Derate, IdleDraw, DischargeResult, DischargeOutcome } from './discharge-types.ts';

/**
 * The discharge of a solved project's bank over its `backup` profile. Takes the solved value: the
 * project is not validated again, and its result gives the conductor sizes held during the outage.
 */
export function simulateDischarge(solved: Solved, keep: DischargeKeep = {}): DischargeOutcome {
  return dischargeOf(solved.project, solved.result, keep);
}

/**
 * The discharge of a changed copy of a solved project (a larger or sized bank, another horizon:
 * core/studies/backup/study.ts). The copy is built by core/solve/variant.ts, which checks what
 * changed; it is solved again (solveVariant) only when cables with a conductor spec need the sizes of
 * its own start of outage. Never validates the whole project again.
 */
export function dischargeVariant(solved: Solved, change: VariantChange, keep: DischargeKeep = {}): DischargeOutcome {
  const batteryId = solved.project.elements.find((e) => e.kind === 'battery')?.id ?? '';
  if (hasConductorSpecs(solved.project)) {
    const v = solveVariant(solved, change);
    if (!v.ok) return { ok: false, problems: v.problems.map((p) => startProblem(p, batteryId)) };
    return dischargeOf(v.project, v.result, keep);
  }
  const v = variantProject(solved, change);
  if (!v.ok) return v;
  return dischargeOf(v.project, undefined, keep);
}

/** The study's own checks (a backup setting, a battery with a bank), then the discharge. */
function dischargeOf(project: Project, nominal: SolveResult | undefined, keep: DischargeKeep): DischargeOutcome {
  const study = project.backup;
  const source = project.elements.find((e): e is BatterySource => e.kind === 'battery');
  const problems: Problem[] = [];
  if (!study) problems.push({ code: 'invalid-value', elementId: PROJECT_LEVEL, field: 'backup', message: 'is required for a runtime study (profile, time step, temperature …)' });
  if (!source) {
    problems.push({ code: 'invalid-value', elementId: PROJECT_LEVEL, field: 'elements', message: 'a runtime study needs a battery as the chain\u2019s source' });
  } else if (!source.bank) {
    problems.push({ code: 'invalid-value', elementId: source.id, field: 'bank', message: 'is required for a runtime study (chemistry, cells in series, strings, capacity)' });
  }
  if (study) problems.push(...checkStudy(study, project));
  if (problems.length || !study || !source?.bank) return { ok: false, problems };
  return runDischarge(project, study, source, nominal, keep);
}

export { CHEMISTRY_PRESETS };
