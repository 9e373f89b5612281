/**
 * One combination of the option search: its choices as a named variant (core/model/variants.ts),
 * solved by solveProjectVariant, then checked against the target, cheapest check first:
 *   1. the solve itself (a variant the engine refuses fails with its problems);
 *   2. from the solved result, at no further cost: the losses against their limit, each cable's drop
 *      by the method's check against its limit (ConductorResult.drop), each path's drop against the
 *      project's limits (PathDrop: a path of one cable with a conductor check is that check; a cable
 *      given by its resistance has none, so its path and its per-link drop are checked here), each
 *      sized cable's ampacity against its design current;
 *   3. the motor starts (the starting study, core/studies/surge/): every verdict must be "starts";
 *   4. the runtime target: the installed bank at least the bank the option's own backup study sizes for
 *      the target runtime (runBackupStudy, core/studies/backup/study.ts: its design margin, aging
 *      factor and temperature, as the project's sizing), and the bank as new lasting to the target
 *      (the discharge through the chain); the runtime as new is kept as information.
 * Every check is a requirement on its own, so once one fails the option is out whatever the later
 * ones say: they are skipped (sound), unless every reason is asked for.
 * Purchase cost: Σ price of the elements the search changes (the others are the same in every option,
 * so they do not change the order); yearly cost of the losses: E = P_loss × hours, × price
 * (core/studies/economics.ts), with the project's running settings.
 */
import type { Element } from '../../model/project.ts';
import type { ProjectVariant } from '../../model/variants.ts';
import { VARIANT_NAME_MAX } from '../../model/variants.ts';
import { sigText } from '../../model/message.ts';
import { formatProblem } from '../../model/errors.ts';
import type { Solved } from '../../solve/solved.ts';
import { solveProjectVariant } from '../../solve/project-variant.ts';
import { outageSolve } from '../../solve/modes.ts';
import { simulateDischarge, type DischargeOutcome, type DischargeResult } from '../backup/discharge.ts';
import { runBackupStudy } from '../backup/study.ts';
import { bankCapacityAh } from '../../physics/bank.ts';
import type { BankSizing } from '../backup/sizing.ts';
import type { BatterySource } from '../../model/project.ts';
import { PROJECT_LEVEL, type Problem } from '../../model/errors.ts';
import { DEFAULT_HORIZON_H } from '../../solve/load-profile.ts';
import { studySurges } from '../surge/index.ts';
import type { CostSettings } from '../economics.ts';
import { lossCostOfSolved } from '../loss-over-profile.ts';
import type { SearchChoice } from './axes.ts';

/** Why an option fails the target: its group ("Runtime below the target") and its words with figures. */
export interface SearchReason {
  group: string;
  text: string;
}

/** The target, resolved from the settings and the project. */
export interface SearchTarget {
  /** Runtime the bank must reach, s (undefined: no runtime target). */
  runtimeSeconds?: number;
  /** Highest losses, W. */
  maxLossW?: number;
  /** Check the motor starts (the chain has motors). */
  starts: boolean;
}

export interface EvaluatedOption {
  /** The option's name, made from its choices ("2 strings · Inverter B · 10 mm²"). */
  name: string;
  choices: { axis: string; elementId: string; words: string }[];
  /** The named variant that is this option (kept as a variant by the page). */
  variant: ProjectVariant;
  meets: boolean;
  reasons: SearchReason[];
  /** Checks left out once the option had failed (their names). */
  skipped: string[];
  /** Purchase cost of the changed elements, currency units (a lower bound when prices are missing). */
  cost: number;
  /** Names of changed elements without a price for their choice. */
  missingPrices: string[];
  /** Total losses of the solved chain, W (undefined when it did not solve). */
  lossW?: number;
  /** Yearly cost of the losses, currency units (with a running price). */
  yearlyLossCost?: number;
  /** Runtime through the chain with the bank as new (information), s, when checked; a lower bound when `runtimeIsLowerBound`. */
  runtimeSeconds?: number;
  runtimeIsLowerBound?: boolean;
  /** The option's installed bank, Ah (strings × capacity per string), when the runtime target is checked. */
  installedAh?: number;
  /**
   * The bank the option's own backup study sizes for the target runtime (its design margin, aging
   * factor and temperature; runBackupStudy, core/studies/backup/study.ts), when checked: what it needs
   * (`requiredAh`) and the bank it gives in whole strings of the option's module or standard ratings.
   */
  sizing?: { requiredAh: number; bankAh: number; summary: string; designMargin?: number; agingFactor?: number };
  /** Largest ratio of a cable's checked drop to its limit (1 = at the limit), when a cable has a conductor. */
  worstDropRatio?: number;
}

/** A duration in words, "3 h 10 min" (whole minutes; "45 min" under an hour). */
export function durationWords(seconds: number): string {
  if (!Number.isFinite(seconds) || seconds < 0) return 'no figure';
  const minutes = Math.floor(seconds / 60 + 1e-9);
  const h = Math.floor(minutes / 60);
  const m = minutes % 60;
  if (h === 0) return `${m} min`;
  return m === 0 ? `${h} h` : `${h} h ${m} min`;
}

/**
 * The variant of a combination: each choice's fields merged per element in order (the system
 * voltage's `sets` first, later choices win per field), each `swap` listed; a swapped element takes
 * no `set` (the alternative is put in whole, as the user gave it).
 */
export function variantOf(choices: readonly SearchChoice[]): ProjectVariant {
  const set: Record<string, Record<string, unknown>> = {};
  const swap: Element[] = [];
  const put = (id: string, fields: Record<string, unknown>) => {
    set[id] = { ...(set[id] ?? {}), ...fields };
  };
  for (const c of choices) {
    if (c.swap) swap.push(c.swap);
    for (const [id, fields] of Object.entries(c.sets ?? {})) put(id, fields);
    if (c.set) put(c.elementId, c.set);
  }
  for (const e of swap) delete set[e.id];
  return { name: optionName(choices), ...(Object.keys(set).length ? { set } : {}), ...(swap.length ? { swap } : {}) };
}

/** An option's name from its choices' short words, cut to the length a variant's name may have. */
export function optionName(choices: readonly SearchChoice[]): string {
  const name = choices.map((c) => c.short).join(' · ') || 'As it is';
  return name.length <= VARIANT_NAME_MAX ? name : `${name.slice(0, VARIANT_NAME_MAX - 1)}…`;
}

const pct = (v: number) => `${sigText(v, 3)} %`;

/**
 * The discharge of a solved option's bank, cut one time step past `upTo` seconds when given: whether
 * the bank lasts to the target needs no step beyond it (the steps before are the same whatever the
 * horizon), so a bank that lasts has "at least" that runtime (a lower bound) and one that does not
 * has its exact runtime. Without `upTo`, the study's own horizon (the listed options' full runtime).
 */
export function runtimeOf(solved: Solved, upTo?: number): DischargeOutcome {
  const outage = outageSolve(solved);
  if (!outage.ok) return outage;
  const study = outage.solved.project.backup;
  if (upTo === undefined || !study) return simulateDischarge(outage.solved);
  const step = study.timeStepSeconds ?? 60;
  const horizonHours = Math.min(study.horizonHours ?? DEFAULT_HORIZON_H, (upTo + step) / 3600);
  const project = { ...outage.solved.project, backup: { ...study, horizonHours } };
  return simulateDischarge({ ...outage.solved, project });
}

/** The bank of a solved chain's backup study (its id, the one the discharge runs), or undefined. */
function studyBank(solved: Solved, id: string): BatterySource | undefined {
  return solved.project.elements.find((e): e is BatterySource => e.id === id && e.kind === 'battery');
}

/** A sizing's own factor, read from its worksheet steps ("Design margin", "Aging factor"). */
const stepValue = (s: BankSizing, label: string) => s.steps.find((x) => x.label === label)?.value;

/**
 * The runtime as new and the bank the option's own backup study sizes for `upTo` seconds: the study
 * itself (runBackupStudy, core/studies/backup/study.ts: the sizing over the terminal power of the
 * simulated run, with the project's design margin, aging factor, temperature, design and module or
 * standard ratings), run with the target runtime `upTo` and its discharge cut one time step past it
 * (the sizing reads the run up to the target only, so the cut changes no figure; see runtimeOf). The
 * sized run and the recharge are left out, as the runtime spread leaves them out.
 */
export function bankForTarget(
  solved: Solved,
  upTo: number,
): { ok: true; discharge: DischargeResult; sizing: BankSizing; installedAh: number } | { ok: false; problems: Problem[] } {
  const study = solved.project.backup;
  if (!study) return { ok: false, problems: [{ code: 'invalid-value', elementId: PROJECT_LEVEL, field: 'backup', message: 'the chain has no battery backup study' }] };
  const step = study.timeStepSeconds ?? 60;
  const horizonHours = Math.min(study.horizonHours ?? DEFAULT_HORIZON_H, (upTo + step) / 3600);
  const cut: Solved = { ...solved, project: { ...solved.project, backup: { ...study, horizonHours, targetRuntimeHours: upTo / 3600 } } };
  const o = runBackupStudy(cut, { sizedRun: false, recharge: false, plotSeries: false, sizingPeriods: false });
  if (!o.ok) return o;
  const { discharge, sizing } = o.study;
  const bank = studyBank(solved, discharge.batteryId)?.bank;
  if (!sizing || !bank) return { ok: false, problems: [{ code: 'invalid-value', elementId: discharge.batteryId, field: 'bank', message: 'the backup study gives no bank for the target' }] };
  return { ok: true, discharge, sizing, installedAh: bankCapacityAh(bank) };
}

/** Evaluate one combination against the target (see the header). */
export function evaluateOption(
  base: Solved,
  choices: readonly SearchChoice[],
  target: SearchTarget,
  cost: CostSettings | null,
  allReasons: boolean,
): EvaluatedOption {
  const variant = variantOf(choices);
  const missingPrices: string[] = [];
  let price = 0;
  const names = new Map(base.project.elements.map((e) => [e.id, e.name ?? e.id]));
  // One price per changed element: the last choice on it wins (the strings of a bank after its system voltage).
  const priced = new Map<string, number | undefined>();
  for (const c of choices) priced.set(c.elementId, c.price);
  for (const [id, p] of priced) {
    if (p === undefined) missingPrices.push(names.get(id) ?? id);
    else price += p;
  }
  const option: EvaluatedOption = {
    name: variant.name,
    choices: choices.map((c) => ({ axis: c.axis, elementId: c.elementId, words: c.words })),
    variant,
    meets: false,
    reasons: [],
    skipped: [],
    cost: price,
    missingPrices,
  };
  const reasons = option.reasons;
  const solved = solveProjectVariant(base, variant);
  if (!solved.ok) {
    // The first problem in the CLI's words (element by name, field by its label); the variant's own elements named as swapped in.
    const first = solved.problems[0];
    const named = { elements: [...base.project.elements.filter((e) => !variant.swap?.some((x) => x.id === e.id)), ...(variant.swap ?? [])] };
    reasons.push({ group: 'The chain does not solve', text: `does not solve: ${first ? formatProblem(first, named) : 'refused'}` });
    return option;
  }
  const { result } = solved;
  option.lossW = result.totals.losses;
  if (cost) {
    const c = lossCostOfSolved(solved, cost);
    if (c.ok) option.yearlyLossCost = c.cost.totalCost;
  }
  // 2. From the result: losses, drops, ampacity.
  if (target.maxLossW !== undefined && result.totals.losses > target.maxLossW) {
    reasons.push({ group: 'Losses above the limit', text: `losses ${sigText(result.totals.losses, 3)} W above ${sigText(target.maxLossW, 3)} W` });
  }
  let worst: number | undefined;
  for (const e of result.elements) {
    const c = e.conductor;
    if (!c) continue;
    const ratio = c.drop.limitPercent > 0 ? c.drop.checkPercent / c.drop.limitPercent : 0;
    worst = worst === undefined ? ratio : Math.max(worst, ratio);
    if (c.drop.checkPercent > c.drop.limitPercent * (1 + 1e-9)) {
      reasons.push({ group: `Drop on ${e.name} above its limit`, text: `drop on ${e.name} ${pct(c.drop.checkPercent)} above ${pct(c.drop.limitPercent)}` });
    }
    if (c.ampacity.total < c.designCurrent * (1 - 1e-9)) {
      reasons.push({ group: `${e.name} too small for its current`, text: `${e.name} carries at most ${sigText(c.ampacity.total, 3)} A, below its design current of ${sigText(c.designCurrent, 3)} A` });
    }
  }
  if (worst !== undefined) option.worstDropRatio = worst;
  // Each path's drop against the project's limits (core/conductors/path-drop.ts: Σ of the links' % drops,
  // a link given by its resistance with its solved drop 100·(V_in − V_out)/V_in). A path of one link
  // whose cable has a conductor check is that cable's own drop, checked above against its own limit
  // (which may differ from the project's); a cable given by its resistance has no conductor check, so
  // its path is checked here, and so is a link of it over the per-link limit.
  const solvedNames = new Map(result.elements.map((e) => [e.id, e.name]));
  const conductorChecked = new Set(result.elements.filter((e) => e.conductor).map((e) => e.id));
  const linkOver = new Set<string>();
  for (const path of result.voltageDrop ?? []) {
    if (!path.exceedsLimit) continue;
    const unchecked = path.links.filter((l) => !conductorChecked.has(l.id));
    if (path.perLinkLimitPercent !== undefined) {
      for (const l of unchecked) {
        if (!l.exceedsLimit || linkOver.has(l.id)) continue;
        linkOver.add(l.id);
        const cable = solvedNames.get(l.id) ?? l.id;
        reasons.push({ group: `Drop on ${cable} above its limit`, text: `drop on ${cable} ${pct(l.dropPercent)} above ${pct(path.perLinkLimitPercent)} (given by its resistance)` });
      }
    }
    if (path.links.length === 1 && unchecked.length === 0) continue;
    if (path.totalPercent <= path.totalLimitPercent * (1 + 1e-12)) continue;
    const load = solvedNames.get(path.loadId) ?? path.loadId;
    const via = path.links.map((l) => solvedNames.get(l.id) ?? l.id).join(', ');
    reasons.push({ group: `Drop to ${load} above its limit`, text: `drop to ${load} ${pct(path.totalPercent)} above ${pct(path.totalLimitPercent)} (through ${via})` });
  }
  const stop = (left: string[]) => {
    if (reasons.length && !allReasons) {
      option.skipped = left;
      return true;
    }
    return false;
  };
  const later = [...(target.starts ? ['motor starts'] : []), ...(target.runtimeSeconds !== undefined ? ['runtime'] : [])];
  if (stop(later)) return option;
  // 3. Motor starts.
  if (target.starts) {
    const s = studySurges(solved);
    if (!s.ok) reasons.push({ group: 'The starting study cannot run', text: `starting study: ${s.problems[0] ? formatProblem(s.problems[0], solved.project) : 'refused'}` });
    else
      for (const start of s.result.starts) {
        if (start.verdict === 'starts') continue;
        const words = start.verdict === 'marginal' ? 'starts only marginally' : 'does not start';
        reasons.push({ group: `${start.name} ${words}`, text: `${start.name} ${words} (${start.governing})` });
      }
    if (stop(target.runtimeSeconds !== undefined ? ['runtime'] : [])) return option;
  }
  // 4. Runtime: the installed bank at least the bank the option's own backup study sizes for the
  // target (its design margin and aging included, as the project's sizing), and the bank as new lasting
  // to the target (a bank that runs out before it new cannot meet it, whatever the sizing says).
  if (target.runtimeSeconds !== undefined) {
    const T = target.runtimeSeconds;
    const b = bankForTarget(solved, T);
    // A study refused (the sizing or the run to the target): the runtime as new on its own, and the refusal.
    const d: DischargeOutcome = b.ok ? { ok: true, result: b.discharge } : runtimeOf(solved, T);
    if (!d.ok) reasons.push({ group: 'The runtime cannot be worked out', text: `runtime: ${d.problems[0] ? formatProblem(d.problems[0], solved.project) : 'refused'}` });
    else {
      option.runtimeSeconds = d.result.runtimeSeconds;
      option.runtimeIsLowerBound = d.result.runtimeIsLowerBound;
      if (d.result.runtimeSeconds < T) {
        // A bank not exhausted within the study's time span has at least that runtime: short of the target, it is not known to meet it.
        if (d.result.runtimeIsLowerBound) reasons.push({ group: 'Runtime not known up to the target', text: `runtime as new at least ${durationWords(d.result.runtimeSeconds)}, the study's time span ends before ${durationWords(T)}` });
        else reasons.push({ group: 'Runtime below the target', text: `runtime as new ${durationWords(d.result.runtimeSeconds)} below ${durationWords(T)}` });
      }
      if (!b.ok) reasons.push({ group: 'The bank for the target cannot be sized', text: `bank for ${durationWords(T)}: ${b.problems[0] ? formatProblem(b.problems[0], solved.project) : 'refused'}` });
    }
    if (b.ok) {
      const { sizing, installedAh } = b;
      const margin = stepValue(sizing, 'Design margin');
      const aging = stepValue(sizing, 'Aging factor');
      option.installedAh = installedAh;
      option.sizing = {
        requiredAh: sizing.requiredCapacity,
        bankAh: sizing.bankCapacity,
        summary: sizing.summary,
        ...(margin !== undefined ? { designMargin: margin } : {}),
        ...(aging !== undefined ? { agingFactor: aging } : {}),
      };
      // Whole strings of the option's own module: installed ≥ required exactly when its strings are at
      // least the sized ones (the sized bank, bankAh); with standard ratings, the capacity it needs.
      if (installedAh < sizing.requiredCapacity * (1 - 1e-12)) {
        const needs = solved.project.backup?.standardCapacitiesAh ? sizing.requiredCapacity : sizing.bankCapacity;
        const factors = [margin !== undefined ? `design margin ${sigText(margin, 3)}` : '', aging !== undefined ? `aging ${sigText(aging, 3)}` : ''].filter(Boolean).join(' and ');
        reasons.push({
          group: 'Bank smaller than the sizing for the target',
          text: `installed ${sigText(installedAh, 4)} Ah below the ${sigText(needs, 4)} Ah the sizing needs for ${durationWords(T)}${factors ? ` with the ${factors}` : ''} (${sizing.summary.split(',')[0]})`,
        });
      }
    }
  }
  option.meets = reasons.length === 0;
  return option;
}
