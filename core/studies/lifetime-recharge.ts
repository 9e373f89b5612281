/**
 * The cost over the years of one solved project as the user reads it, part 5: `lifetimeCost` with
 * the battery backup study's recharge after one outage, so a generator's fuel counts the recharges
 * as well as the outages (core/studies/lifetime.ts names the method). One path for every place that
 * shows the figure: the command line (core/cli/run.ts, from the study it has already run), the page's
 * panel worker and each column of the comparison of variants (core/studies/variants/compare.ts).
 * Kept apart from lifetime.ts so the backup study is not pulled into a bundle that only reads settings.
 */
import type { Solved } from '../solve/solved.ts';
import { runBackupStudy, type BackupStudyResult } from './backup/study.ts';
import { lifetimeCost, lifetimeSettingsOf, type LifetimeOutcome, type LifetimeSettings } from './lifetime.ts';
import type { RechargeRun } from './lifetime-fuel.ts';

/** The recharge after one outage as the fuel count takes it: the charger's AC input energy and the recharge time. */
export function rechargeRunOf(study: Pick<BackupStudyResult, 'recharge'> | undefined): RechargeRun | undefined {
  const rc = study?.recharge;
  return rc ? { energyWh: rc.acInputEnergyWh, timeSeconds: rc.time } : undefined;
}

/**
 * The recharge after one outage of a solved project, when its cost counts outages a year (the
 * generator's `outagesPerYear`) and the chain has a battery bank: the backup study is run for it
 * (or `study`, when the caller has run it). Undefined otherwise, or when the study gives no recharge.
 */
export function projectRechargeRun(solved: Solved, settings?: LifetimeSettings | null, study?: BackupStudyResult): RechargeRun | undefined {
  const s = settings ?? lifetimeSettingsOf(solved.project);
  if (!(s?.generator?.outagesPerYear ?? 0)) return undefined;
  if (study) return rechargeRunOf(study);
  if (!solved.project.elements.some((e) => e.kind === 'battery' && e.bank !== undefined)) return undefined;
  const o = runBackupStudy(solved);
  return o.ok ? rechargeRunOf(o.study) : undefined;
}

/** The cost over the years of a solved project with its recharges (see the header); `settings` default to the project's own. */
export function projectLifetimeCost(solved: Solved, settings?: LifetimeSettings | null, study?: BackupStudyResult): LifetimeOutcome {
  const s = settings ?? lifetimeSettingsOf(solved.project);
  return lifetimeCost(solved, s, s ? projectRechargeRun(solved, s, study) : undefined);
}
