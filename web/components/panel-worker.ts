/**
 * The studies behind the battery and machines panels, run in a worker: the battery study solves
 * the chain at every step of an outage (milliseconds to tens of milliseconds), and the machines
 * figures re-solve the chain for a capacitor bank. Off the page's thread, typing stays fluid; and
 * the worker is its own bundle, so these parts of core never weigh on the page's first load (the
 * page itself uses only the plain solve).
 *
 * Each request carries the page's last valid solved value (core/solve's `Solved`: the validated
 * project and its result, web/state/solution.ts `lastSolved`): the worker never validates or solves
 * the base case again; a capacitor bank or a battery variant is solved from it (core/solve/variant.ts).
 *
 * Requests and replies are plain data (structured clone). Every figure comes from core. A study
 * whose figures are not all finite numbers comes back refused, naming the element and the field
 * (core/solve/finite.ts), never as a panel of NaN.
 */
import { answerStudies, type BackupStudyResult, bankCautions, correctPowerFactor, type CostSettings, type DriveDetail, type LossCost, lossCostOfSolved, machineDetails, type MethodCosts, type MotorDetail, type PfCorrection, projectPumpDuty, type PumpControlResult, type PumpDetail, pumpDetails, fanDetails, type FanDetail, pumpDutyCosts, rechargeCautions, runBackupStudy, projectLifetimeCost, lifetimeSettingsOf, type LifetimeOutcome, runModesStudy, solveModes, type ModesStudyResult, type StudyAnswers } from '../../core/studies/index.ts';
import { elementNames, nonFiniteProblems, type Problem, type Solved, type SolveResult } from '../../core/page.ts';
import { compareColumns, flowGraph, solveColumns, type FlowGraph, type VariantComparison } from '../../core/studies/index.ts';
import type { ProjectVariant } from '../../core/page.ts';

export type PanelRequest =
  | { kind: 'battery'; solved: Solved }
  | { kind: 'machines'; solved: Solved; cost: CostSettings | null }
  | { kind: 'pfc'; solved: Solved; at: string; targetPowerFactor: number }
  /** The answers strip's study figures (runtime, bank for the target, start verdicts, cost of losses). */
  | { kind: 'answers'; solved: Solved; cost: CostSettings | null }
  /** A bank on a bus: the on-battery solve and the modes study (web/components/modes/). */
  | { kind: 'modes'; solved: Solved }
  /** The project's variants side by side (web/components/variants/): the comparison and each column's energy flow. */
  | { kind: 'variants'; solved: Solved; variants: ProjectVariant[]; cost: CostSettings | null }
  /** The cost over the years alone (the client report's table, web/components/report/ReportLifetime.tsx). */
  | { kind: 'lifetime'; solved: Solved };

/** The comparison of the variants, and each column's energy-flow graph (null where the column was not solved). */
export interface VariantsReply {
  kind: 'variants';
  outcome: { ok: true; comparison: VariantComparison; flows: (FlowGraph | null)[] } | { ok: false; problems: Problem[] };
}

/** Both modes of a project with a bank on a bus: the on-battery result (the on-supply one is the page's own solve) and the modes study. */
export interface ModesReply {
  kind: 'modes';
  outcome:
    | { ok: true; battery: { ok: true; result: SolveResult; project: Solved['project'] } | { ok: false; problems: Problem[] }; supply?: { result: SolveResult; project: Solved['project'] }; flows?: { supply: FlowGraph | null; battery: FlowGraph | null }; study: { ok: true; study: ModesStudyResult } | { ok: false; problems: Problem[] } }
    | { ok: false; problems: Problem[] };
}

export interface LifetimeReply {
  kind: 'lifetime';
  outcome: LifetimeOutcome;
}

export interface AnswersReply {
  kind: 'answers';
  outcome: { ok: true; answers: StudyAnswers } | { ok: false; problems: Problem[] };
}

export interface BatteryReply {
  kind: 'battery';
  outcome: { ok: true; study: BackupStudyResult; cautions: string[] } | { ok: false; problems: Problem[] };
}

export interface MachinesFigures {
  motors: MotorDetail[];
  drives: DriveDetail[];
  pumps: PumpDetail[];
  fans: FanDetail[];
  pumpDuty?: { ok: true; result: PumpControlResult; costs?: MethodCosts } | { ok: false; problems: Problem[] };
  lossCost?: { ok: true; cost: LossCost } | { ok: false; problems: Problem[] };
  /** The cost over the years (core's lifetimeCost), when the project gives the energy price and the years of service. */
  lifetime?: LifetimeOutcome;
}

export interface MachinesReply {
  kind: 'machines';
  outcome: { ok: true; figures: MachinesFigures } | { ok: false; problems: Problem[] };
}

/** The correction without the two full results and the corrected project (not shown; heavy to copy). */
export type PfCorrectionShown = Omit<PfCorrection, 'resultBefore' | 'resultAfter' | 'correctedProject'>;

export interface PfcReply {
  kind: 'pfc';
  outcome: { ok: true; correction: PfCorrectionShown } | { ok: false; problems: Problem[] };
}

export type PanelReply = (BatteryReply | MachinesReply | PfcReply | AnswersReply | ModesReply | VariantsReply | LifetimeReply | { kind: 'crash'; message: string }) & {
  /** Time the work took in the worker, ms. */
  ms: number;
};

function battery(solved: Solved): BatteryReply {
  const o = runBackupStudy(solved);
  if (!o.ok) return { kind: 'battery', outcome: o };
  const s = o.study;
  const chemistry = s.discharge.bank.chemistry;
  const cautions = [
    ...new Set([
      ...s.discharge.cautions,
      ...bankCautions(chemistry),
      ...(s.sizing?.cautions ?? []),
      ...(s.recharge?.cautions ?? []),
      ...(s.recharge || s.charger ? rechargeCautions(chemistry) : []),
    ]),
  ];
  const notFinite = nonFiniteProblems('The battery backup study', s, elementNames(solved.project));
  if (notFinite.length) return { kind: 'battery', outcome: { ok: false, problems: notFinite } };
  return { kind: 'battery', outcome: { ok: true, study: s, cautions } };
}

function machines(solved: Solved, cost: CostSettings | null): MachinesReply {
  const { project, result } = solved;
  const { motors, drives } = machineDetails(solved);
  const figures: MachinesFigures = { motors, drives, pumps: pumpDetails(project), fans: fanDetails(project) };
  if (project.pumpDuty) {
    const f = projectPumpDuty(solved);
    if (f.ok) {
      const costs = cost ? pumpDutyCosts(f.result, cost.pricePerKWh) : undefined;
      figures.pumpDuty = { ok: true, result: f.result, ...(costs?.ok ? { costs: costs.costs } : {}) };
    } else figures.pumpDuty = { ok: false, problems: f.problems };
  }
  // The price the cost over the years takes (the load profile's day when the project splits by it).
  if (cost) figures.lossCost = lossCostOfSolved(solved, cost);
  if (lifetimeSettingsOf(project)) figures.lifetime = projectLifetimeCost(solved);
  const notFinite = nonFiniteProblems('The machines study', figures, elementNames(project));
  if (notFinite.length) return { kind: 'machines', outcome: { ok: false, problems: notFinite } };
  return { kind: 'machines', outcome: { ok: true, figures } };
}

/** The cost over the years of a solved pair (core's projectLifetimeCost: with the backup study's recharge, as the command line and the comparison take it), refused when not all finite. */
function lifetime(solved: Solved): LifetimeReply {
  const o = projectLifetimeCost(solved);
  if (!o.ok) return { kind: 'lifetime', outcome: o };
  const notFinite = nonFiniteProblems('The cost over the years', o.cost, elementNames(solved.project));
  return { kind: 'lifetime', outcome: notFinite.length ? { ok: false, problems: notFinite } : o };
}

function pfc(solved: Solved, at: string, targetPowerFactor: number): PfcReply {
  const o = correctPowerFactor(solved, { at, targetPowerFactor });
  if (!o.ok) return { kind: 'pfc', outcome: o };
  const { resultBefore: _b, resultAfter: _a, correctedProject: _p, ...shown } = o.correction;
  const notFinite = nonFiniteProblems('The power-factor correction', shown, elementNames(solved.project));
  if (notFinite.length) return { kind: 'pfc', outcome: { ok: false, problems: notFinite } };
  return { kind: 'pfc', outcome: { ok: true, correction: shown } };
}

function answers(solved: Solved, cost: CostSettings | null): AnswersReply {
  const a = answerStudies(solved, cost);
  const notFinite = nonFiniteProblems('The answers', a, elementNames(solved.project));
  if (notFinite.length) return { kind: 'answers', outcome: { ok: false, problems: notFinite } };
  return { kind: 'answers', outcome: { ok: true, answers: a } };
}

function modes(solved: Solved): ModesReply {
  const m = solveModes(solved);
  if (!m) return { kind: 'modes', outcome: { ok: false, problems: [] } };
  const names = elementNames(solved.project);
  let battery: { ok: true; result: SolveResult; project: Solved['project'] } | { ok: false; problems: Problem[] } = m.battery.ok ? { ok: true, result: m.battery.result, project: m.battery.project } : { ok: false, problems: m.battery.problems };
  if (battery.ok) {
    const notFinite = nonFiniteProblems('The on-battery mode', battery.result, elementNames(m.battery.ok ? m.battery.project : solved.project));
    if (notFinite.length) battery = { ok: false, problems: notFinite };
  }
  const o = runModesStudy(solved, m);
  let study: { ok: true; study: ModesStudyResult } | { ok: false; problems: Problem[] } = o ?? { ok: false, problems: [] };
  if (study.ok) {
    const notFinite = nonFiniteProblems('The standing-by and transfer study', study.study, names);
    if (notFinite.length) study = { ok: false, problems: notFinite };
  }
  // An inverter-charger's pass-through: the on-supply mode is a variant of its own (core/solve/modes.ts), not the page's solve.
  const supply = m.supply !== solved && m.supply.ok ? { result: m.supply.result, project: m.supply.project } : undefined;
  // Both modes' energy flow, drawn side by side at one scale (web/components/variants/VariantFlows.tsx).
  const flows = { supply: flowGraph((supply ?? solved).result), battery: battery.ok ? flowGraph(battery.result) : null };
  return { kind: 'modes', outcome: { ok: true, battery, study, flows, ...(supply ? { supply } : {}) } };
}

function variants(solved: Solved, list: ProjectVariant[], cost: CostSettings | null): VariantsReply {
  const columns = solveColumns(solved, list);
  // The cost at the price in force on the page (the project's, else the user's earlier one); the lifetime rows from the project's own settings.
  const comparison = compareColumns(solved, list, columns, { cost });
  const flows = columns.map((c) => (c.ok ? flowGraph(c.solved.result) : null));
  const notFinite = nonFiniteProblems('The comparison of the variants', { comparison, flows }, elementNames(solved.project));
  if (notFinite.length) return { kind: 'variants', outcome: { ok: false, problems: notFinite } };
  return { kind: 'variants', outcome: { ok: true, comparison, flows } };
}

/** The worker's side of the messages (typed here so the page's tsconfig needs no worker library). */
const scope = globalThis as unknown as {
  onmessage: ((event: { data: { id: number; request: PanelRequest } }) => void) | null;
  postMessage(message: { id: number; reply: PanelReply }): void;
};

scope.onmessage = (event) => {
  const { id, request } = event.data;
  const t0 = performance.now();
  let reply: BatteryReply | MachinesReply | PfcReply | AnswersReply | ModesReply | VariantsReply | LifetimeReply | { kind: 'crash'; message: string };
  try {
    switch (request.kind) {
      case 'battery':
        reply = battery(request.solved);
        break;
      case 'machines':
        reply = machines(request.solved, request.cost);
        break;
      case 'pfc':
        reply = pfc(request.solved, request.at, request.targetPowerFactor);
        break;
      case 'answers':
        reply = answers(request.solved, request.cost);
        break;
      case 'modes':
        reply = modes(request.solved);
        break;
      case 'variants':
        reply = variants(request.solved, request.variants, request.cost);
        break;
      case 'lifetime':
        reply = lifetime(request.solved);
        break;
    }
  } catch (error) {
    // An engine fault must not leave the panel waiting: say so, so it can be reported.
    reply = { kind: 'crash', message: `The calculation stopped unexpectedly: ${String(error)}` };
  }
  scope.postMessage({ id, reply: { ...reply, ms: performance.now() - t0 } });
};
