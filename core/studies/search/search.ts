/**
 * The search for the option that meets a target (issue 20 point 4): every combination of the user's
 * candidates (one choice per dimension, core/studies/search/axes.ts), each a named variant solved by
 * solveProjectVariant and checked against the target (evaluate.ts); out: the Pareto list of the
 * options that meet it (purchase cost against losses, pareto.ts), cheapest or lowest-loss first, and
 * the rejected with their reasons, grouped and counted. At most SEARCH_MAX_COMBINATIONS are tried:
 * beyond, the first ones in the order of the axes are, and the result says so.
 *
 * The target: the runtime (the settings' own, or the battery backup study's target) when the chain
 * has a bank with a study; every drop within its limit; every motor start "starts"; the losses below
 * the optional limit. Figures are planning estimates: local codes and licensed practice govern.
 */
import type { Problem } from '../../model/errors.ts';
import { PROJECT_LEVEL } from '../../model/errors.ts';
import type { OptionSearch } from '../../model/option-search.ts';
import { SEARCH_MAX_COMBINATIONS } from '../../model/option-search.ts';
import type { Solved } from '../../solve/solved.ts';
import { solveProjectVariant } from '../../solve/project-variant.ts';
import { costSettingsOf } from '../economics.ts';
import { sigText } from '../../model/message.ts';
import { SEARCH_AXES, type SearchChoice, type SearchDimension } from './axes.ts';
import { durationWords, evaluateOption, runtimeOf, type EvaluatedOption, type SearchReason, type SearchTarget } from './evaluate.ts';
import { paretoFront } from './pareto.ts';

export const SEARCH_CAUTION =
  'The options are planning estimates from the figures entered: check the chosen option against the makers’ data; local codes and licensed practice govern conductor sizes, protection and batteries.';

export interface MetOption extends EvaluatedOption {
  lossW: number;
}

export interface RejectedGroup {
  /** The reason in words, without the option's figures ("Runtime below the target"). */
  group: string;
  count: number;
  /** A few options that failed for it, each with its reason's words and figures. */
  examples: { name: string; text: string }[];
}

export interface SearchResult {
  order: 'cost' | 'losses';
  /** The target in words, one line per requirement. */
  target: string[];
  /** Combinations of the candidates, and how many were tried. */
  combinations: number;
  tried: number;
  /** Set when the combinations exceeded the cap. */
  capMessage?: string;
  /** True when the search was stopped before it had tried them all. */
  stopped?: boolean;
  /** How many met the target. */
  metCount: number;
  /** The Pareto list of the options that meet the target. */
  options: MetOption[];
  /** Every option that failed, with all reasons found. */
  rejected: EvaluatedOption[];
  /** The failed options grouped by reason (an option with two reasons counts in both), most first. */
  rejectedGroups: RejectedGroup[];
  /** Notes on the figures (prices missing, what the cost counts). */
  notes: string[];
  caution: string;
}

export type SearchOutcome = { ok: true; search: SearchResult } | { ok: false; problems: Problem[] };

export interface SearchRun {
  /** Called every few options with how many are done of how many. */
  onProgress?: (done: number, total: number) => void;
  /** Checked between options: true stops the search (the result holds what was tried). */
  shouldStop?: () => boolean;
  /** Give every reason of a failed option (no check skipped). */
  allReasons?: boolean;
  /** Called with each option once it is evaluated (met or not). */
  onOption?: (option: EvaluatedOption) => void;
  /** A lower cap on the combinations (tests). */
  maxCombinations?: number;
}

/** The dimensions of a search's settings, or their problems. */
export function searchDimensions(solved: Solved, search: OptionSearch): { ok: true; dimensions: SearchDimension[] } | { ok: false; problems: Problem[] } {
  const dimensions: SearchDimension[] = [];
  const problems: Problem[] = [];
  for (const axis of SEARCH_AXES) {
    const d = axis.dimensions(solved.project, search);
    dimensions.push(...d.dimensions);
    problems.push(...d.problems);
  }
  if (problems.length) return { ok: false, problems };
  if (dimensions.length === 0) return { ok: false, problems: [{ code: 'invalid-value', elementId: PROJECT_LEVEL, field: 'optionSearch', message: 'lists no candidates: tick strings, conductor sizes or inverters to try' }] };
  const seen = new Set<string>();
  for (const d of dimensions) {
    const key = `${d.axis}:${d.elementId}`;
    if (seen.has(key)) problems.push({ code: 'invalid-value', elementId: PROJECT_LEVEL, field: 'optionSearch', value: d.elementName, message: `lists ${d.elementName} twice on one axis: give its candidates once` });
    seen.add(key);
  }
  return problems.length ? { ok: false, problems } : { ok: true, dimensions };
}

/** The target of a search from its settings and the project (see the header). */
export function searchTarget(solved: Solved, search: OptionSearch): SearchTarget {
  const p = solved.project;
  const hasBank = p.elements.some((e) => e.kind === 'battery' && e.bank !== undefined);
  const hours = search.targetRuntimeHours ?? p.backup?.targetRuntimeHours;
  return {
    ...(hasBank && p.backup && hours !== undefined ? { runtimeSeconds: hours * 3600 } : {}),
    ...(search.maxLossW !== undefined ? { maxLossW: search.maxLossW } : {}),
    starts: p.elements.some((e) => e.kind === 'motor'),
  };
}

function targetWords(t: SearchTarget, solved: Solved): string[] {
  const out: string[] = [];
  if (t.runtimeSeconds !== undefined) out.push(`runtime at least ${durationWords(t.runtimeSeconds)}`);
  else if (solved.project.elements.some((e) => e.kind === 'battery' && e.bank !== undefined)) {
    out.push(solved.project.backup ? 'runtime: no target runtime given (not checked)' : 'runtime: the chain has no battery backup study (not checked)');
  }
  out.push('every voltage drop within its limit, every conductor carrying its design current');
  if (t.starts) out.push('every motor start “starts”');
  if (t.maxLossW !== undefined) out.push(`losses at most ${sigText(t.maxLossW, 3)} W`);
  return out;
}

/** Run the search (see the header). Never throws on bad settings: their problems come back. */
export function searchOptions(solved: Solved, search: OptionSearch, run: SearchRun = {}): SearchOutcome {
  const dims = searchDimensions(solved, search);
  if (!dims.ok) return dims;
  const { dimensions } = dims;
  const target = searchTarget(solved, search);
  const cost = costSettingsOf(solved.project);
  const order = search.order ?? 'cost';
  const cap = Math.min(run.maxCombinations ?? SEARCH_MAX_COMBINATIONS, SEARCH_MAX_COMBINATIONS);
  const combinations = dimensions.reduce((n, d) => n * d.choices.length, 1);
  const total = Math.min(combinations, cap);
  const met: MetOption[] = [];
  const rejected: EvaluatedOption[] = [];
  // Odometer over the dimensions: the last one turns fastest.
  const index = dimensions.map(() => 0);
  let tried = 0;
  for (; tried < total; tried++) {
    if (run.shouldStop?.()) break;
    const choices: SearchChoice[] = dimensions.map((d, i) => d.choices[index[i]!]!);
    const option = evaluateOption(solved, choices, target, cost, run.allReasons ?? false);
    run.onOption?.(option);
    if (option.meets && option.lossW !== undefined) met.push(option as MetOption);
    else rejected.push(option);
    for (let i = dimensions.length - 1; i >= 0; i--) {
      index[i]!++;
      if (index[i]! < dimensions[i]!.choices.length) break;
      index[i] = 0;
    }
    if (run.onProgress && (tried % 10 === 9 || tried + 1 === total)) run.onProgress(tried + 1, total);
  }
  const options = paretoFront(met, order);
  // The listed options' full runtime (the search stopped each discharge just past the target).
  if (target.runtimeSeconds !== undefined) {
    for (const o of options) {
      const v = solveProjectVariant(solved, o.variant);
      const d = v.ok ? runtimeOf(v) : v;
      if (d.ok) {
        o.runtimeSeconds = d.result.runtimeSeconds;
        o.runtimeIsLowerBound = d.result.runtimeIsLowerBound;
      }
    }
  }
  const notes: string[] = [];
  const unpriced = new Set(met.flatMap((o) => o.missingPrices));
  notes.push('Purchase cost: the prices of the elements the search changes (the rest of the chain is the same in every option).');
  if (unpriced.size) notes.push(`No price for some choices of ${[...unpriced].join(', ')}: those options’ costs leave them out (give the prices to compare them fairly).`);
  if (rejected.some((o) => o.skipped.length)) notes.push('An option that fails one check is not put through the later ones (the runtime, the motor starts): it is out whatever they say, so its other reasons may be missing.');
  if (!cost) notes.push('Yearly cost of the losses: no energy price given (the running cost settings).');
  return {
    ok: true,
    search: {
      order,
      target: targetWords(target, solved),
      combinations,
      tried,
      ...(tried < total ? { stopped: true } : {}),
      ...(combinations > cap ? { capMessage: `${combinations} combinations: only the first ${cap} were tried. Narrow the candidates to try them all.` } : {}),
      metCount: met.length,
      options,
      rejected,
      rejectedGroups: groupReasons(rejected),
      notes,
      caution: SEARCH_CAUTION,
    },
  };
}

/** The failed options grouped by reason, most first (at most three examples each). */
export function groupReasons(rejected: readonly EvaluatedOption[]): RejectedGroup[] {
  const groups = new Map<string, RejectedGroup>();
  for (const o of rejected) {
    const once = new Map<string, SearchReason>();
    for (const r of o.reasons) if (!once.has(r.group)) once.set(r.group, r);
    for (const r of once.values()) {
      const g = groups.get(r.group) ?? { group: r.group, count: 0, examples: [] };
      g.count++;
      if (g.examples.length < 3) g.examples.push({ name: o.name, text: r.text });
      groups.set(r.group, g);
    }
  }
  return [...groups.values()].sort((a, b) => b.count - a.count);
}
