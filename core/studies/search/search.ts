/**
 * The search for the option that meets a target (issue 20 point 4): every combination of the user's
 * candidates (one choice per dimension, core/studies/search/axes.ts), each a named variant solved by
 * solveProjectVariant and checked against the target (evaluate.ts); out: the Pareto list of the
 * options that meet it (purchase cost against losses, pareto.ts), cheapest or lowest-loss first, and
 * the rejected with their reasons, grouped and counted. At most SEARCH_MAX_COMBINATIONS are tried:
 * beyond, the first ones in the order of the axes are, and the result says so.
 *
 * The system voltage is an outer loop (axes.ts `voltageChoices`): for each voltage, the other axes'
 * dimensions from the chain at that voltage, and each option's variant is the voltage's fields
 * overlaid by the other choices' (evaluate.ts variantOf); the combinations are the sum over the
 * voltages of the product of their dimensions.
 *
 * The target: the runtime (the settings' own, or the battery backup study's target) when the chain
 * has a bank with a study; every drop within its limit; every motor start "starts"; the losses below
 * the optional limit. Figures are planning estimates: local codes and licensed practice govern.
 */
import type { Problem } from '../../model/errors.ts';
import type { BatterySource } from '../../model/project.ts';
import { sizingFactors } from '../backup/sizing-types.ts';
import { PROJECT_LEVEL } from '../../model/errors.ts';
import type { OptionSearch } from '../../model/option-search.ts';
import { SEARCH_MAX_COMBINATIONS } from '../../model/option-search.ts';
import type { Solved } from '../../solve/solved.ts';
import { solveProjectVariant } from '../../solve/project-variant.ts';
import { costSettingsOfSolved } from '../economics.ts';
import { sigText } from '../../model/message.ts';
import type { ValidProject } from '../../solve/validate.ts';
import { SEARCH_AXES, voltageChoices, type SearchChoice, type SearchDimension } from './axes.ts';
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

/** One voltage's part of the search (or the whole search without system voltages): its first choice, its dimensions. */
export interface SearchGroup {
  /** The system voltage's choice (absent when the settings try no system voltages). */
  voltage?: SearchChoice;
  dimensions: SearchDimension[];
  /** Combinations of this group: the product of its dimensions' choices. */
  combinations: number;
}

/** The other axes' dimensions on one chain, or their problems. */
function axesDimensions(project: ValidProject, search: OptionSearch): { dimensions: SearchDimension[]; problems: Problem[] } {
  const dimensions: SearchDimension[] = [];
  const problems: Problem[] = [];
  for (const axis of SEARCH_AXES) {
    const d = axis.dimensions(project, search);
    dimensions.push(...d.dimensions);
    problems.push(...d.problems);
  }
  const seen = new Set<string>();
  for (const d of dimensions) {
    const key = `${d.axis}:${d.elementId}`;
    if (seen.has(key)) problems.push({ code: 'invalid-value', elementId: PROJECT_LEVEL, field: 'optionSearch', value: d.elementName, message: `lists ${d.elementName} twice on one axis: give its candidates once` });
    seen.add(key);
  }
  return { dimensions, problems };
}

const noCandidates: Problem = { code: 'invalid-value', elementId: PROJECT_LEVEL, field: 'optionSearch', message: 'lists no candidates: tick system voltages, strings, conductor sizes or inverters to try' };

/** The dimensions of a search's settings on the chain as it is (the system voltages aside), or their problems. */
export function searchDimensions(solved: Solved, search: OptionSearch): { ok: true; dimensions: SearchDimension[] } | { ok: false; problems: Problem[] } {
  const { dimensions, problems } = axesDimensions(solved.project, search);
  if (problems.length) return { ok: false, problems };
  if (dimensions.length === 0) return { ok: false, problems: [noCandidates] };
  return { ok: true, dimensions };
}

/**
 * The groups of a search: one per system voltage (its chain's dimensions; a price per string given
 * at the chain's own voltage scaled by the cells in series, linear in cells, common practice (no
 * source)), or one group on the chain as it is when no voltage is tried.
 */
export function searchGroups(solved: Solved, search: OptionSearch): { ok: true; groups: SearchGroup[] } | { ok: false; problems: Problem[] } {
  const count = (dimensions: SearchDimension[]) => dimensions.reduce((n, d) => n * d.choices.length, 1);
  if (!search.systemVoltages || search.systemVoltages.length === 0) {
    const d = searchDimensions(solved, search);
    return d.ok ? { ok: true, groups: [{ dimensions: d.dimensions, combinations: count(d.dimensions) }] } : d;
  }
  const v = voltageChoices(solved.project, search);
  if (v.problems.length) return { ok: false, problems: v.problems };
  const groups: SearchGroup[] = [];
  const problems: Problem[] = [];
  for (const c of v.choices) {
    const pps = search.strings?.pricePerString;
    const at = pps !== undefined && search.strings ? { ...search, strings: { ...search.strings, pricePerString: pps * c.seriesRatio } } : search;
    const d = axesDimensions(c.project, at);
    // A problem of the other axes is the same at every voltage: said once.
    for (const p of d.problems) if (!problems.some((q) => q.field === p.field && q.message === p.message)) problems.push(p);
    groups.push({ voltage: c.choice, dimensions: d.dimensions, combinations: count(d.dimensions) });
  }
  if (problems.length) return { ok: false, problems };
  if (groups.length === 0) return { ok: false, problems: [noCandidates] };
  return { ok: true, groups };
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
  const bank = solved.project.elements.find((e): e is BatterySource => e.kind === 'battery' && e.bank !== undefined)?.bank;
  if (t.runtimeSeconds !== undefined && bank) {
    const T = durationWords(t.runtimeSeconds);
    // The factors the project's backup study sizes with (given, or the sizing's defaults).
    const f = sizingFactors(solved.project.backup ?? {}, bank.chemistry);
    out.push(`runtime at least ${T}: the installed bank at least the bank the backup study sizes for ${T} (design margin ${sigText(f.designMargin, 3)}, aging ${sigText(f.agingFactor, 3)}), and the bank as new lasting ${T}`);
  } else if (bank) {
    out.push(solved.project.backup ? 'runtime: no target runtime given (not checked)' : 'runtime: the chain has no battery backup study (not checked)');
  }
  out.push('every voltage drop within its limit, every conductor carrying its design current');
  if (t.starts) out.push('every motor start “starts”');
  if (t.maxLossW !== undefined) out.push(`losses at most ${sigText(t.maxLossW, 3)} W`);
  return out;
}

/** Run the search (see the header). Never throws on bad settings: their problems come back. */
export function searchOptions(solved: Solved, search: OptionSearch, run: SearchRun = {}): SearchOutcome {
  const g = searchGroups(solved, search);
  if (!g.ok) return g;
  const { groups } = g;
  const target = searchTarget(solved, search);
  // The project's price, with the load profile's day/night split when the project asks for it (economics.ts).
  const cost = costSettingsOfSolved(solved);
  const order = search.order ?? 'cost';
  const cap = Math.min(run.maxCombinations ?? SEARCH_MAX_COMBINATIONS, SEARCH_MAX_COMBINATIONS);
  // Σ over the voltages of Π of their dimensions' choices (one group without system voltages).
  const combinations = groups.reduce((n, gr) => n + gr.combinations, 0);
  const total = Math.min(combinations, cap);
  const met: MetOption[] = [];
  const rejected: EvaluatedOption[] = [];
  let tried = 0;
  let stopped = false;
  for (const group of groups) {
    const { dimensions } = group;
    // Odometer over the group's dimensions: the last one turns fastest.
    const index = dimensions.map(() => 0);
    for (let k = 0; k < group.combinations && tried < total; k++, tried++) {
      if (run.shouldStop?.()) {
        stopped = true;
        break;
      }
      const choices: SearchChoice[] = [...(group.voltage ? [group.voltage] : []), ...dimensions.map((d, i) => d.choices[index[i]!]!)];
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
    if (stopped || tried >= total) break;
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
  if (groups.some((gr) => gr.voltage)) notes.push('System voltage: the bank is re-strung and the voltages that follow the DC system (an inverter’s cut-off, a charger’s output) are changed in proportion; the equipment itself is the same, priced as it is: check that each is made for that voltage, or list alternatives with their makers’ figures.');
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
