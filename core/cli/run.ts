/**
 * One project of a command-line run, from its parsed JSON to the text and summary line (pure: no
 * file or process access; core/cli/cli.ts reads the files and writes the output). The project is
 * validated and solved once (solveProject); every study asked for takes that solved value
 * (tests/core/solve-count.test.ts counts the validations and solves of a run).
 */
import { formatProblem, PROJECT_LEVEL, type Problem } from '../model/errors.ts';
import { formatResult } from './text-report.ts';
import { solveProject, type Solved } from '../solve/index.ts';
import { elementNames, nonFiniteProblems } from '../solve/finite.ts';
import { runBackupStudy, type BackupStudyResult } from '../studies/backup/study.ts';
import { formatBackupStudy } from '../studies/backup/text-report.ts';
import { formatProfileDay, profileDay } from '../studies/backup/profile-day.ts';
import { correctPowerFactor, type PfCorrection } from '../studies/pf/correction.ts';
import { formatPfCorrection, pfCorrectionJson } from '../studies/pf/text-report.ts';
import { hasPumpSections, machineSections } from './machines-flags.ts';
import { formatSurgeStudy, hasSurgeInputs, studySurges, type SurgeStudyResult } from '../studies/surge/index.ts';
import { costSettingsOf, formatLossCost, pumpDutyCosts, type LossCost, type MethodCosts } from '../studies/economics.ts';
import { lossCostOfSolved } from '../studies/loss-over-profile.ts';
import { runModesStudy, type ModesStudyResult } from '../studies/modes/study.ts';
import { formatModesStudy } from '../studies/modes/text-report.ts';
import { solveModes } from '../solve/modes.ts';
import type { SolveResult } from '../model/result.ts';
import { formatLifetimeCost, lifetimeSettingsOf, type LifetimeCost } from '../studies/lifetime.ts';
import { projectLifetimeCost } from '../studies/lifetime-recharge.ts';
import { formatSpread, runSpread, type SpreadResult } from '../studies/spread/index.ts';
import { compareVariants, type VariantComparison } from '../studies/variants/compare.ts';
import { formatVariantComparison } from '../studies/variants/text-report.ts';
import { formatSearch, searchOptions, type SearchResult } from '../studies/search/index.ts';
import type { CliRequest } from './args.ts';
import type { ProjectLine } from './summary.ts';

export type SolveRequest = Extract<CliRequest, { kind: 'solve' }>;

/** One project's outcome: the text to print (tables or JSON, when asked for) and its summary, or why it was refused. */
export type ProjectRun = { ok: true; text: string; line: ProjectLine } | { ok: false; lines: string[]; line: ProjectLine };

/** Refused: `<file>: <heading>` and one indented line per problem; the summary keeps the heading with each problem. */
export function refused(file: string, heading: string, problems: readonly Problem[], projectName?: string, project?: unknown): ProjectRun {
  const reasons = problems.map((p) => `${heading} ${formatProblem(p, project)}`);
  return {
    ok: false,
    lines: [`${file}: ${heading}`, ...problems.map((p) => `  ${formatProblem(p, project)}`)],
    line: { file, ok: false, reasons: reasons.length ? reasons : [heading], ...(projectName !== undefined ? { projectName } : {}) },
  };
}

/** Refused with one message (a file that cannot be read or parsed). */
export const refusedWith = (file: string, message: string): ProjectRun => ({ ok: false, lines: [message], line: { file, ok: false, reasons: [message] } });

/** Solve one parsed project once and run on it every study the request asks for. */
export function runParsed(file: string, data: unknown, req: SolveRequest, flowData: unknown): ProjectRun {
  const rawName = (data as { name?: unknown } | null)?.name;
  const projectName = typeof rawName === 'string' ? rawName : undefined;
  // Validated and solved once: every study below takes this solved value.
  const outcome = solveProject(data);
  if (!outcome.ok) return refused(file, 'the project cannot be solved:', outcome.problems, projectName, data);
  // Every study's figures must be finite numbers, or the study is refused (core/solve/finite.ts);
  // the solve checks its own result. Elements are named as in the solved project.
  const names = elementNames(outcome.project);
  const nonFinite = (heading: string, what: string, value: unknown): ProjectRun | undefined => {
    const bad = nonFiniteProblems(what, value, names);
    return bad.length ? refused(file, heading, bad, projectName, data) : undefined;
  };
  let study: BackupStudyResult | undefined;
  if (hasBackupStudy(outcome)) {
    const s = runBackupStudy(outcome);
    if (!s.ok) return refused(file, 'the battery backup study cannot be run:', s.problems, projectName, data);
    study = s.study;
    const bad = nonFinite('the battery backup study cannot be shown:', 'The battery backup study', study);
    if (bad) return bad;
  }
  // The runtime with its spread (--spread N, --seed S): the file's tolerances, the samples and seed of the flags.
  let spread: SpreadResult | undefined;
  if (req.spread !== undefined) {
    if (!study) return refused(file, 'the runtime spread cannot be run:', [{ code: 'invalid-value', elementId: PROJECT_LEVEL, field: 'backup', value: undefined, message: 'the runtime spread needs a battery bank and the battery backup study settings' }], projectName, data);
    const settings = { ...outcome.project.spread, samples: req.spread, ...(req.seed !== undefined ? { seed: req.seed } : {}) };
    const s = runSpread(outcome, { settings });
    if (!s.ok) return refused(file, 'the runtime spread cannot be run:', s.problems, projectName, data);
    spread = s.value;
    const bad = nonFinite('the runtime spread cannot be shown:', 'The runtime spread', spread);
    if (bad) return bad;
  }
  let pfc: PfCorrection | undefined;
  if (req.correctPf) {
    const c = correctPowerFactor(outcome, req.correctPf);
    if (!c.ok) return refused(file, 'the power-factor correction cannot be worked out:', c.problems, projectName, data);
    pfc = c.correction;
    const bad = nonFinite('the power-factor correction cannot be shown:', 'The power-factor correction', pfc);
    if (bad) return bad;
  }
  const machines = req.machines || req.pumpDutyFile !== undefined || hasPumpSections(outcome) ? machineSections(outcome, req.machines, flowData) : undefined;
  if (machines && !machines.ok) return refused(file, machines.heading, machines.problems, projectName, data);
  if (machines?.ok) {
    const bad = nonFinite('the machines study cannot be shown:', 'The machines study', machines.json);
    if (bad) return bad;
  }
  let surges: SurgeStudyResult | undefined;
  if (req.surges || hasSurgeInputs(outcome)) {
    const s = studySurges(outcome);
    if (!s.ok) return refused(file, 'the surge and fault study cannot be run:', s.problems, projectName, data);
    surges = s.result;
    const bad = nonFinite('the surge and fault study cannot be shown:', 'The surge and fault study', surges);
    if (bad) return bad;
  }
  // What the losses cost a year, when the project gives an energy price (its `running` settings).
  let lossCost: LossCost | undefined;
  let pumpDutyCost: MethodCosts | undefined;
  const cost = costSettingsOf(outcome.project);
  if (cost) {
    // The load profile's day prices the losses when the project splits the day and night prices by it, or
    // works the losses out over it (as the cost over the years: core/studies/loss-over-profile.ts).
    const c = lossCostOfSolved(outcome, cost);
    if (!c.ok) return refused(file, 'the yearly cost of the losses cannot be worked out:', c.problems, projectName, data);
    lossCost = c.cost;
    const duty = machines?.ok ? machines.json.pumpDuty : undefined;
    if (duty) {
      const d = pumpDutyCosts(duty, cost.pricePerKWh);
      if (d.ok) pumpDutyCost = d.costs;
    }
    const bad = nonFinite('the yearly cost of the losses cannot be shown:', 'The yearly cost of the losses', { lossCost, pumpDutyCost });
    if (bad) return bad;
  }
  // A bank on a bus: both modes (core/solve/modes.ts) and the modes study.
  const modes = solveModes(outcome);
  let modesStudy: ModesStudyResult | undefined;
  if (modes) {
    // The charge to put back: the backup study's outage drew it (the same on-battery discharge), handed on.
    const m = runModesStudy(outcome, modes, study ? { dischargeAh: study.discharge.deliveredAh } : {});
    if (m && !m.ok) return refused(file, 'the two modes cannot be worked out:', m.problems, projectName, data);
    if (m) modesStudy = m.study;
    const bad = nonFinite('the two modes cannot be shown:', 'The two modes', { study: modesStudy, battery: modes.battery.ok ? modes.battery.result : undefined, ...(modes.supply !== outcome ? { supply: modes.supply.result } : {}) });
    if (bad) return bad;
  }
  const batteryResult: SolveResult | undefined = modes?.battery.ok ? modes.battery.result : undefined;
  // On supply: the file as drawn, or its variant with an inverter-charger passing the supply through (core/solve/modes.ts).
  const supplyResult: SolveResult = modes ? modes.supply.result : outcome.result;
  // The cost over the years, when the project gives the years of service beside the price (core/studies/lifetime.ts).
  let lifetime: LifetimeCost | undefined;
  const lifeSettings = lifetimeSettingsOf(outcome.project);
  if (lifeSettings) {
    // With the backup study's recharge after each outage (the same path as the page and the comparison of variants).
    const l = projectLifetimeCost(outcome, lifeSettings, study);
    if (!l.ok) return refused(file, 'the cost over the years cannot be worked out:', l.problems, projectName, data);
    lifetime = l.cost;
    const bad = nonFinite('the cost over the years cannot be shown:', 'The cost over the years', lifetime);
    if (bad) return bad;
  }
  // The project's variants side by side (--variants): each solved from the base, the same studies on each.
  let variants: VariantComparison | undefined;
  if (req.variants) {
    variants = compareVariants(outcome, outcome.project.variants ?? []);
    const bad = nonFinite('the comparison of the variants cannot be shown:', 'The comparison of the variants', variants);
    if (bad) return bad;
  }
  // The option search, when asked for (core/studies/search/): the project's own settings.
  let search: SearchResult | undefined;
  if (req.search) {
    const settings = outcome.project.optionSearch;
    if (!settings) return refusedWith(file, `${file}: the option search cannot be run: the project lists no candidates to try (the page's "Find the option" keeps them in the project)`);
    const o = searchOptions(outcome, settings);
    if (!o.ok) return refused(file, 'the option search cannot be run:', o.problems, projectName, data);
    search = o.search;
    const bad = nonFinite('the option search cannot be shown:', 'The option search', search);
    if (bad) return bad;
  }
  const run = study?.discharge;
  const line: ProjectLine = {
    file,
    ok: true,
    result: outcome.result,
    ...(run ? { backupRuntimeHours: run.runtimeSeconds / 3600, backupRuntimeIsLowerBound: run.runtimeIsLowerBound } : {}),
  };
  let text = '';
  // The profile's first day (the editor's preview), beside the study: `profileDay` in the JSON.
  const day = study && req.output !== 'summary' && req.output !== 'csv' ? profileDay(outcome.project, outcome.project.backup, outcome.result) : undefined;
  if (req.output === 'json') {
    const top = req.mode === 'battery' && batteryResult ? batteryResult : supplyResult;
    const modesJson = modes ? { mode: top === batteryResult ? 'battery' : 'supply', modes: { supply: supplyResult, battery: modes.battery.ok ? modes.battery.result : { problems: modes.battery.problems }, study: modesStudy } } : {};
    const extra = { ...modesJson, ...(study ? { backupStudy: study } : {}), ...(spread ? { spread } : {}), ...(day?.ok ? { profileDay: day.day } : {}), ...(pfc ? { pfCorrection: pfCorrectionJson(pfc) } : {}), ...(machines?.ok ? machines.json : {}), ...(surges ? { surgeStudy: surges } : {}), ...(lossCost ? { lossCost } : {}), ...(pumpDutyCost ? { pumpDutyCost } : {}), ...(lifetime ? { lifetimeCost: lifetime } : {}), ...(variants ? { variants } : {}), ...(search ? { search } : {}) };
    text = `${JSON.stringify({ ...top, ...extra }, null, 2)}\n`;
  } else if (req.output === 'tables') {
    text = `${modes ? modeTables(supplyResult, batteryResult, modes.battery.ok ? undefined : modes.battery.problems[0]?.message, req.mode, modes.supply !== outcome) : formatResult(outcome.result)}\n${modesStudy ? `${formatModesStudy(modesStudy)}\n` : ''}${day?.ok ? `${formatProfileDay(day.day)}\n` : ''}${study ? `${formatBackupStudy(study)}\n` : ''}${spread ? `\n${formatSpread(spread)}\n` : ''}${pfc ? `\n${formatPfCorrection(pfc)}\n` : ''}${machines?.ok ? machines.text : ''}${surges ? formatSurgeStudy(surges) : ''}${lossCost ? `\n${formatLossCost(lossCost)}\n` : ''}${pumpDutyCost ? `${formatPumpDutyCost(pumpDutyCost)}\n` : ''}${lifetime ? `\n${formatLifetimeCost(lifetime)}\n` : ''}${variants ? `\n${formatVariantComparison(variants, outcome.project)}\n` : ''}${search ? `\n${formatSearch(search)}\n` : ''}`;
  }
  return { ok: true, text, line };
}

/** A study runs when the project has `backup` settings and a battery given as a `bank`. */
function hasBackupStudy({ project }: Solved): boolean {
  return project.backup !== undefined && project.elements.some((e) => e.kind === 'battery' && e.bank !== undefined);
}


/** The pump duty methods' yearly energy cost at the project's price (money without a symbol: the file holds none). */
function formatPumpDutyCost(c: MethodCosts): string {
  const m = (v: number) => (Math.abs(v) >= 1000 ? Math.round(v).toLocaleString('en-US') : v.toFixed(2));
  return `Pump duty energy cost per year: drive speed control ${m(c.speedControl)}, throttling ${m(c.throttle)}, on-off ${m(c.onOff)}; the drive saves ${m(c.savingVsThrottle)} against throttling, ${m(c.savingVsOnOff)} against on-off`;
}

/** The element tables of a project with a bank on a bus: both modes by default, or the one asked for. */
function modeTables(supply: SolveResult, battery: SolveResult | undefined, batteryRefusal: string | undefined, mode: 'supply' | 'battery' | undefined, passingThrough = false): string {
  const parts: string[] = [];
  if (mode !== 'battery') parts.push(`Mode: on supply (the bank on float${passingThrough ? '; the inverter-charger passes the supply through to its loads' : ''})\n${formatResult(supply)}`);
  if (mode !== 'supply') parts.push(battery ? `Mode: on battery (the supply cut, the bank carries its bus)\n${formatResult(battery)}` : `Mode: on battery: cannot be solved: ${batteryRefusal ?? 'no solution'}`);
  return parts.join('\n\n');
}
