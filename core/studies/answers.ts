/**
 * The answers that need a study: per battery bank the runtime to the end of discharge, the bank
 * that meets the target runtime and (when no conductor sizing names it) the current its cable and
 * fuse must carry; per motor the start verdict; the yearly cost of the losses. Each figure is the
 * study's own (nothing is recomputed here), with the element it belongs to, the basis in words and
 * the panel that holds the working. The answers the solve gives at once are `core/solve/answers.ts`.
 *
 * The studies are not cheap (the backup study solves the chain at every step of the outage): the
 * page runs `answerStudies` in its panel worker after the paint.
 *
 * The bank's cable and fuse current: the design current of the conductor sizing of the cable that
 * leaves the bank (core/conductors/design-current.ts: the equipment on the bus at its ratings, or
 * the load at nominal voltage, × 1.25 where the rule says so) when that cable has a sizing;
 * otherwise the highest discharge current of the backup study (`peakCurrent`, the highest over the
 * outage's steps): for a constant-power load the current rises as the bank's voltage falls, so it
 * is highest toward the end of discharge, above the solve's operating current (taken at the charged
 * bank's voltage). The
 * highest discharge current carries no continuous-load factor: the answer says so and names the
 * sizing that would apply one.
 */
import type { Problem } from '../model/errors.ts';
import type { Solved } from '../solve/solved.ts';
import { solveAnswers } from '../solve/answers.ts';
import { runBackupStudy, type BackupStudyResult } from './backup/study.ts';
import type { CostSettings, LossCost } from './economics.ts';
import { lossCostOfSolved } from './loss-over-profile.ts';
import { studySurges } from './surge/index.ts';
import type { MotorStartResult, StartVerdict } from './surge/types.ts';

export interface BankStudyAnswer {
  elementId: string;
  name: string;
  /** Runtime to the end of discharge, s (a lower bound when the bank was not exhausted). */
  runtimeSeconds: number;
  runtimeIsLowerBound: boolean;
  /** Why the discharge ended, in words. */
  endText: string;
  /** Highest bank current over the outage, A (toward the end of discharge for a constant-power load). */
  peakCurrent: number;
  /** Lowest terminal voltage over the outage (the end-of-discharge voltage), V. */
  minVoltage: number;
  /** The current the bank's cable and fuse must carry, A, and its basis. */
  cableCurrent: { amps: number; basis: 'conductor-sizing' | 'highest-discharge'; rule: string; cableId?: string };
  /** The target runtime, s, when the study has one. */
  targetSeconds?: number;
  /** True when this bank's runtime reaches the target. */
  meetsTarget?: boolean;
  /** The bank the sizing gives for the target, in words ("2 strings × 200 Ah = 400 Ah, …"). */
  sizedBank?: string;
  /** Its capacity, Ah. */
  sizedCapacityAh?: number;
  /** Its runtime through the chain, s. */
  sizedRuntimeSeconds?: number;
  panel: 'battery';
}

export interface StartAnswer {
  elementId: string;
  name: string;
  verdict: StartVerdict;
  /** The governing reason, in words. */
  governing: string;
  panel: 'starting';
}

export type CostAnswer =
  /** `overProfile`: worked out over the load profile's day (loss-over-profile.ts); the price is then the mean the losses pay. */
  | { ok: true; pricePerKWh: number; hoursPerYear: number; energyKWh: number; cost: number; overProfile?: true; panel: 'machines' }
  | { ok: false; reason: string; panel: 'machines' };

export interface StudyAnswers {
  banks: BankStudyAnswer[];
  /** Problems of a study that could not run (the strip says so and points at its panel). */
  bankProblems?: Problem[];
  starts: StartAnswer[];
  startProblems?: Problem[];
  cost: CostAnswer;
}

/** The studies' answers from their results (each study run once by the caller). */
export function studyAnswersFrom(
  solved: Solved,
  studies: { backup?: BackupStudyResult; starts?: readonly MotorStartResult[]; lossCost?: LossCost | null },
): Omit<StudyAnswers, 'bankProblems' | 'startProblems'> {
  const quick = solveAnswers(solved);
  const banks: BankStudyAnswer[] = [];
  const b = studies.backup;
  if (b) {
    const d = b.discharge;
    const bank = quick.banks.find((x) => x.elementId === d.batteryId);
    const sized = bank?.cableCurrent;
    const target = solved.project.backup?.targetRuntimeHours;
    banks.push({
      elementId: d.batteryId,
      name: bank?.name ?? d.batteryId,
      runtimeSeconds: d.runtimeSeconds,
      runtimeIsLowerBound: d.runtimeIsLowerBound,
      endText: d.endText,
      peakCurrent: d.peakCurrent,
      minVoltage: d.minVoltage,
      cableCurrent: sized
        ? { amps: sized.amps, basis: 'conductor-sizing', rule: sized.rule, cableId: sized.cableId }
        : {
            amps: d.peakCurrent,
            basis: 'highest-discharge',
            rule: 'the highest discharge current over the outage (a constant-power load draws more current as the bank’s voltage falls, so it is highest toward the end of discharge); no continuous-load factor applied: give the bank’s cable a conductor sizing for the code’s design current',
            ...(bank?.cableId ? { cableId: bank.cableId } : {}),
          },
      ...(target !== undefined ? { targetSeconds: target * 3600, meetsTarget: d.runtimeIsLowerBound || d.runtimeSeconds >= target * 3600 } : {}),
      ...(b.sizing ? { sizedBank: b.sizing.summary, sizedCapacityAh: b.sizing.bankCapacity } : {}),
      ...(b.sizedDischarge ? { sizedRuntimeSeconds: b.sizedDischarge.runtimeSeconds } : {}),
      panel: 'battery',
    });
  }
  const starts: StartAnswer[] = (studies.starts ?? []).map((s) => ({ elementId: s.motorId, name: s.name, verdict: s.verdict, governing: s.governing, panel: 'starting' }));
  const lc = studies.lossCost;
  const cost: CostAnswer = lc
    ? { ok: true, pricePerKWh: lc.pricePerKWh, hoursPerYear: lc.hoursPerYear, energyKWh: lc.totalEnergyKWh, cost: lc.totalCost, ...(lc.overProfile ? { overProfile: true as const } : {}), panel: 'machines' }
    : { ok: false, reason: 'no energy price given', panel: 'machines' };
  return { banks, starts, cost };
}

/**
 * Runs the studies the answers need (the backup study when the source is a bank with a study, the
 * starting study when the chain has motors, the cost when a price is given) and returns their
 * answers. Never throws on bad input: a study that cannot run gives its problems.
 */
export function answerStudies(solved: Solved, cost: CostSettings | null): StudyAnswers {
  const { project, result } = solved;
  const out: StudyAnswers = { banks: [], starts: [], cost: { ok: false, reason: 'no energy price given', panel: 'machines' } };
  let backup: BackupStudyResult | undefined;
  const source = project.elements.find((e) => !('from' in e) || e.from === undefined);
  // The bank is the chain's source, or sits on a bus (the study then runs in the on-battery mode).
  const bankOnBus = project.elements.find((e) => e.kind === 'battery' && e.from !== undefined);
  const bank = source?.kind === 'battery' ? source : bankOnBus?.kind === 'battery' ? bankOnBus : undefined;
  if (bank !== undefined && bank.bank !== undefined && project.backup) {
    const o = runBackupStudy(solved);
    if (o.ok) backup = o.study;
    else out.bankProblems = o.problems;
  }
  let starts: MotorStartResult[] | undefined;
  if (project.elements.some((e) => e.kind === 'motor')) {
    const o = studySurges(solved);
    if (o.ok) starts = o.result.starts;
    else out.startProblems = o.problems;
  }
  let lossCost: LossCost | null = null;
  if (cost) {
    const o = lossCostOfSolved(solved, cost);
    if (o.ok) lossCost = o.cost;
    else out.cost = { ok: false, reason: o.problems.map((p) => p.message).join('; '), panel: 'machines' };
  }
  const answers = studyAnswersFrom(solved, { ...(backup ? { backup } : {}), ...(starts ? { starts } : {}), lossCost });
  return { ...out, banks: answers.banks, starts: answers.starts, cost: lossCost ? answers.cost : out.cost };
}
