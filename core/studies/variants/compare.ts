/**
 * The project's variants side by side (issue 20 point 1): the base and each named variant solved
 * (core/solve/project-variant.ts `solveProjectVariant`), one column each, the same studies run on
 * every column, and one row per figure with the columns' values and whether they differ.
 *
 * Nothing here is computed anew: each figure is the solve's or a study's own, read from
 * - the solve's answers (core/solve/answers.ts): source power, loads, losses split idle / conversion
 *   / cables / source (their sum is the solve's total loss), efficiency, each sized cable's size,
 *   parallel sets, protective device and drop, warnings by element name; each cable's current is its
 *   input port's current in the result; each path's total drop and whether it is within its limits
 *   (the solve's `voltageDrop`, cables given by resistance included);
 * - the yearly energy of the losses (core/studies/economics.ts: E = P_loss × hours, the project's
 *   hours or all year, 8760 h, as the single yearly cost takes them), given without a price too; with a
 *   price their cost E × price (the project's `running` price, the day/night mean of core/model/tariff.ts);
 * - the lifetime cost (net present value) of each column by the path the project's own "Cost over the
 *   years" takes (core/studies/lifetime-recharge.ts `projectLifetimeCost`: with the backup study's
 *   recharge after each outage, so a generator's fuel counts the recharges), and the break-even year
 *   and simple payback of each variant against the base (core/studies/lifetime.ts `compareLifetime`),
 *   in words where there is none (no extra purchase, never within the years counted);
 * - the studies' answers (core/studies/answers.ts `answerStudies`): each bank's current at the
 *   operating point and highest over the outage, runtime, the bank for the target, each motor's
 *   start verdict; beside the runtime whether the installed bank is at least the bank the sizing
 *   gives for the target (the sizing's design margin and aging included; the runtime itself is the
 *   bank at the study's state of health, without them), and what the bank's cable current is (the
 *   code's design current of its sizing, or the highest discharge current).
 *
 * A variant that takes loads out (critical loads only) is solved with the project's load profile
 * without those loads (they no longer draw, so the profile's levels and duty cycles for them go with
 * them); otherwise the profile would name loads the chain no longer holds and the battery study could
 * not run. Every other variant is solved exactly as `solveProjectVariant` solves it (the project-level
 * warnings included).
 *
 * A variant that no longer applies (it names elements that are gone, or its changed elements are
 * refused) is not solved: its column carries its problems and its figures are left empty; the other
 * columns are still compared. A study a column cannot run leaves that study's figures empty in that
 * column and lists its problems there.
 */
import { PROJECT_LEVEL, type Problem } from '../../model/errors.ts';
import type { ProjectVariant } from '../../model/variants.ts';
import type { Solved } from '../../solve/solved.ts';
import { variantChangeOf } from '../../solve/project-variant.ts';
import { withProjectWarnings } from '../../solve/project-warnings.ts';
import { solveVariant } from '../../solve/variant.ts';
import type { BackupStudy } from '../../model/project.ts';
import { DESIGN_BASIS_WORDS, solveAnswers, type BankAnswer } from '../../solve/answers.ts';
import { sigText } from '../../model/message.ts';
import { bankCapacityAh } from '../../physics/bank.ts';
import { answerStudies, type BankStudyAnswer } from '../answers.ts';
import { costSettingsOfSolved, HOURS_IN_YEAR, type CostSettings } from '../economics.ts';
import { lossCostOfSolved } from '../loss-over-profile.ts';
import { compareLifetime, lifetimeSettingsOf, type BreakEven, type LifetimeCost, type LifetimeSettings } from '../lifetime.ts';
import { projectLifetimeCost } from '../lifetime-recharge.ts';
import { LIFETIME_METHOD_WORDS } from '../lifetime-text.ts';

/** What a row's numbers are (SI inside; the CLI and the page convert at their edge). */
export type RowQuantity =
  | 'power' // W
  | 'energy-per-year' // kWh a year
  | 'money' // the user's currency
  | 'money-per-year'
  | 'current' // A
  | 'time' // s
  | 'capacity' // Ah
  | 'fraction' // 0…1 (efficiency)
  | 'percent' // % (a drop)
  | 'years' // a number of years, or words where there is none ("no extra purchase", "never within 10 years")
  | 'litres-per-year' // L a year (a generator's fuel)
  | 'kg-per-year' // kg a year (CO₂)
  | 'text';

/** The section of the table a row belongs to. */
export type RowGroup = 'balance' | 'losses' | 'cost' | 'battery' | 'cables' | 'starts' | 'warnings';

/** One figure across the columns. */
export interface ComparisonRow {
  /** Stable key: `source.power`, `cable.<elementId>.size`, `bank.<elementId>.runtime`, … */
  key: string;
  group: RowGroup;
  /** The row's words: the figure, and the element's name when it is one element's. */
  label: string;
  quantity: RowQuantity;
  /** One per column (base first); null where the figure does not apply or the column was not worked out. */
  values: (number | string | null)[];
  /** True when the values of the columns worked out differ (numbers beyond round-off, 1e-9 relative). */
  differs: boolean;
}

/** One column: the base or a variant. */
export interface ComparisonColumn {
  name: string;
  note?: string;
  /** True for the project as it stands (the first column). */
  base: boolean;
  /** False when the variant no longer applies: `problems` says why, its figures are empty. */
  ok: boolean;
  problems: Problem[];
  /** Problems of a study that could not run on this column (its figures are empty). */
  studyProblems: { study: 'battery' | 'starting' | 'cost' | 'lifetime'; problems: Problem[] }[];
}

export interface VariantComparison {
  columns: ComparisonColumn[];
  rows: ComparisonRow[];
  /** The hours a year the losses' energy is counted for (the project's, or all year). */
  hoursPerYear: number;
  /** True when the losses are worked out over the load profile's day (loss-over-profile.ts), not the operating point held all those hours. */
  lossesOverProfile: boolean;
  /** The price and hours the losses are costed at (absent without an energy price), and the lifetime settings' years and rate. */
  cost?: { pricePerKWh: number; hoursPerYear: number };
  lifetime?: { years: number; discountRate: number };
  /** The methods of the lifetime cost, the break-even year and the simple payback, in words (with the lifetime rows). */
  methods: string[];
  /** The usual cautions: what the figures are and who governs. */
  cautions: string[];
}

export interface CompareOptions {
  /** Price and hours for the yearly cost (default: the project's `running`; null: no money rows, the energy lost a year still given). */
  cost?: CostSettings | null;
  /** Settings of the lifetime cost (default: the project's `running`; null: no lifetime rows). */
  lifetime?: LifetimeSettings | null;
}

/** Each column's solve: the base as given, each variant through solveProjectVariant. */
export type ColumnSolve = { ok: true; solved: Solved } | { ok: false; problems: Problem[] };

/** The backup settings without the loads taken out (null: the profile names none of them, nothing to change). */
export function backupWithout(backup: BackupStudy | undefined, removed: ReadonlySet<string> | undefined): BackupStudy | null {
  if (!backup || !removed || removed.size === 0) return null;
  const p = backup.profile;
  const names = (loads: Record<string, unknown> | undefined) => Object.keys(loads ?? {}).some((id) => removed.has(id));
  const named = (p.duty ?? []).some((d) => removed.has(d.load)) || (p.kind !== 'constant' && p.segments.some((seg) => names(seg.loads)));
  if (!named) return null;
  const keep = <T,>(loads: Record<string, T> | undefined) => (loads ? Object.fromEntries(Object.entries(loads).filter(([id]) => !removed.has(id))) : undefined);
  const duty = p.duty?.filter((d) => !removed.has(d.load));
  const profile = p.kind === 'constant'
    ? { ...p, ...(duty ? { duty } : {}) }
    : { ...p, segments: p.segments.map((seg) => ({ ...seg, ...(seg.loads ? { loads: keep(seg.loads)! } : {}) })), ...(duty ? { duty } : {}) };
  return { ...backup, profile: profile as BackupStudy['profile'] };
}

/** The base and every variant solved, in column order (the page's worker keeps them for the diagrams). */
export function solveColumns(solved: Solved, variants: readonly ProjectVariant[] = []): ColumnSolve[] {
  return [{ ok: true, solved }, ...variants.map((v): ColumnSolve => {
    // solveProjectVariant's own two steps, with the profile following the loads taken out (see the file's top).
    const change = variantChangeOf(solved, v);
    if (!change.ok) return { ok: false, problems: change.problems };
    const backup = backupWithout(solved.project.backup, change.change.remove);
    const o = solveVariant(solved, backup ? { ...change.change, backup } : change.change);
    // A named variant gets the project-level warnings, as solveProjectVariant gives them.
    return o.ok ? { ok: true, solved: withProjectWarnings(o) } : { ok: false, problems: o.problems };
  })];
}

export const COMPARISON_CAUTIONS = [
  'Planning estimates: each option is worked out by the same method as the project itself; local codes and licensed practice govern the final design.',
  'Conductor sizes, protective devices and battery banks must be checked against the local wiring code and the makers’ data before anything is bought or installed.',
];

/** Values equal within round-off (numbers 1e-9 relative), texts and nulls exactly. */
function same(a: number | string | null, b: number | string | null): boolean {
  if (typeof a === 'number' && typeof b === 'number') return Math.abs(a - b) <= 1e-9 * Math.max(1, Math.abs(a), Math.abs(b));
  return a === b;
}

/** Per column: the figures read, keyed by row key (a missing key is null in that column). */
type Figures = Map<string, number | string | null>;

interface RowMeta {
  group: RowGroup;
  label: string;
  quantity: RowQuantity;
}

const YES = 'yes';
const NO = 'no';
const START_WORDS = { starts: 'starts', marginal: 'marginal', 'will-not-start': 'will not start' } as const;
const yearWords = (n: number) => `${n} year${n === 1 ? '' : 's'}`;

/**
 * A variant's break-even year and simple payback against the plan (`compareLifetime(plan, variant)`),
 * years where there is one, words where there is none: the same purchase (nothing to pay back), the
 * dearer option never catching up within the years counted, no yearly saving, or the variant the
 * cheaper to buy (the plan is then the dearer one: its break-even year is when the plan catches up).
 */
export function breakEvenValues(be: BreakEven, years: number): { breakEven: number | string; payback: number | string } {
  if (be.dearerToBuy === null) return { breakEven: 'no extra purchase', payback: 'no extra purchase' };
  if (be.dearerToBuy === 'b') {
    return {
      breakEven: be.breakEvenYear ?? `never within ${yearWords(years)}`,
      payback: be.simplePaybackYears ?? 'never (no yearly saving)',
    };
  }
  // The variant costs less to buy: the plan is the dearer option, the one that would have to pay back.
  return {
    breakEven: be.breakEvenYear !== null ? `costs less to buy; the plan catches up in year ${be.breakEvenYear}` : `costs less to buy; the plan does not catch up within ${yearWords(years)}`,
    payback: be.simplePaybackYears === null ? 'costs less to buy, no more to run' : `costs less to buy; the plan's extra purchase pays back in ${sigText(be.simplePaybackYears, 3)} year${be.simplePaybackYears === 1 ? '' : 's'}`,
  };
}

/** The bank's cable and fuse current in words: the code's design current of its cable's sizing, or the highest discharge current. */
export function cableCurrentBasis(study: Pick<BankStudyAnswer, 'cableCurrent'>, quick: Pick<BankAnswer, 'cableCurrent'> | undefined): string {
  const sized = quick?.cableCurrent;
  if (study.cableCurrent.basis === 'conductor-sizing' && sized) {
    return `design current of “${sized.cableName}”: ${DESIGN_BASIS_WORDS[sized.basis]}${sized.factor !== 1 ? ` × ${sigText(sized.factor, 3)}` : ''}`;
  }
  return 'highest discharge current over the outage; no continuous-load factor';
}

/** The installed bank's rated capacity, Ah (strings × one string's capacity), of the element the study names. */
function installedAh(solved: Solved, bankId: string): number | undefined {
  const e = solved.project.elements.find((x) => x.id === bankId);
  return e?.kind === 'battery' && e.bank ? bankCapacityAh(e.bank) : undefined;
}

/** The state of health the backup study discharges the bank at, in the row's words. */
function asInstalledWords(solved: Solved): string {
  const soh = solved.project.backup?.stateOfHealth ?? 1;
  return soh === 1 ? 'as new' : `at ${sigText(soh * 100, 3)} % state of health`;
}

/** The methods the lifetime rows are worked by, in words (the CLI prints them under the table, the page under its table). */
export const BREAK_EVEN_METHODS = [
  'Simple payback: the extra purchase ÷ the mean yearly saving, not discounted.',
  'Break-even year: the first whole year in which the dearer option’s purchase plus its yearly costs so far, each discounted by 1 ÷ (1 + r)^t, is no more than the other’s.',
];

/** Compare the project's variants (see the file's top). `variants` defaults to none: the base alone. */
export function compareVariants(solved: Solved, variants: readonly ProjectVariant[] = [], options: CompareOptions = {}): VariantComparison {
  return compareColumns(solved, variants, solveColumns(solved, variants), options);
}

/** The comparison from columns already solved (`solveColumns`), so a caller that also draws them solves once. */
export function compareColumns(solved: Solved, variants: readonly ProjectVariant[], solves: readonly ColumnSolve[], options: CompareOptions = {}): VariantComparison {
  // The base's price (with its profile's day/night split when asked); each column's own cost figures take
  // its own profile's split, or its losses over its own profile's day (answers.ts, loss-over-profile.ts lossCostOfSolved).
  const costSettings = options.cost !== undefined ? options.cost : costSettingsOfSolved(solved);
  // The hours the losses' energy is counted for: the price's, else the project's, else all year (as costSettingsOf takes them).
  const hoursPerYear = costSettings?.hoursPerYear ?? solved.project.running?.hoursPerYear ?? HOURS_IN_YEAR;
  const lifeSettings = options.lifetime !== undefined ? options.lifetime : lifetimeSettingsOf(solved.project);
  const meta = new Map<string, RowMeta>();
  const order: string[] = [];
  const put = (figures: Figures, key: string, m: RowMeta, value: number | string | null) => {
    if (!meta.has(key)) {
      meta.set(key, m);
      order.push(key);
    }
    figures.set(key, value);
  };
  const columns: ComparisonColumn[] = [];
  const figuresOf: (Figures | null)[] = [];
  let baseLife: LifetimeCost | undefined;
  solves.forEach((s, i) => {
    const v = i === 0 ? undefined : variants[i - 1];
    const column: ComparisonColumn = {
      name: v ? v.name : 'As planned',
      ...(v?.note !== undefined ? { note: v.note } : {}),
      base: i === 0,
      ok: s.ok,
      problems: s.ok ? [] : s.problems,
      studyProblems: [],
    };
    columns.push(column);
    if (!s.ok) {
      figuresOf.push(null);
      return;
    }
    const f: Figures = new Map();
    figuresOf.push(f);
    const sv = s.solved;
    const quick = solveAnswers(sv);
    // Balance and losses: the solve's totals and the split of core/solve/answers.ts.
    put(f, 'source.power', { group: 'balance', label: 'Source power', quantity: 'power' }, quick.source.power);
    put(f, 'source.loads', { group: 'balance', label: 'Power to the loads', quantity: 'power' }, quick.source.loadPower);
    put(f, 'source.efficiency', { group: 'balance', label: 'Chain efficiency', quantity: 'fraction' }, quick.source.efficiency);
    put(f, 'losses.total', { group: 'losses', label: 'Losses, all', quantity: 'power' }, quick.losses.total);
    put(f, 'losses.conversion', { group: 'losses', label: 'Losses in conversion', quantity: 'power' }, quick.losses.conversion);
    put(f, 'losses.idle', { group: 'losses', label: 'Losses at idle', quantity: 'power' }, quick.losses.idle);
    put(f, 'losses.cables', { group: 'losses', label: 'Losses in cables', quantity: 'power' }, quick.losses.cables);
    put(f, 'losses.source', { group: 'losses', label: 'Loss in the source', quantity: 'power' }, quick.losses.source);
    // Studies: each bank's runtime and sizing, the start verdicts, the yearly cost (one run per column).
    const studies = answerStudies(sv, costSettings);
    const energyRow = { group: 'cost', label: 'Energy lost a year', quantity: 'energy-per-year' } as const;
    if (costSettings) {
      if (studies.cost.ok) {
        put(f, 'cost.energy', energyRow, studies.cost.energyKWh);
        put(f, 'cost.yearly', { group: 'cost', label: 'Cost of the losses a year', quantity: 'money-per-year' }, studies.cost.cost);
      } else column.studyProblems.push({ study: 'cost', problems: [{ code: 'invalid-value', elementId: PROJECT_LEVEL, field: 'running.energyPricePerKWh', value: costSettings.pricePerKWh, message: studies.cost.reason }] });
    } else {
      // No price: the energy alone, E = P_loss × hours (economics.ts; its price 0 costs nothing).
      const e = lossCostOfSolved(sv, { pricePerKWh: 0, hoursPerYear });
      if (e.ok) put(f, 'cost.energy', energyRow, e.cost.totalEnergyKWh);
      else column.studyProblems.push({ study: 'cost', problems: e.problems });
    }
    if (lifeSettings) {
      // The project's own "Cost over the years": with the backup study's recharge after each outage.
      const life = projectLifetimeCost(sv, lifeSettings);
      if (life.ok) {
        if (i === 0) baseLife = life.cost;
        put(f, 'cost.purchase', { group: 'cost', label: 'Purchase (priced elements)', quantity: 'money' }, life.cost.purchase);
        if (life.cost.generator) {
          put(f, 'cost.fuel', { group: 'cost', label: 'Generator fuel a year', quantity: 'litres-per-year' }, life.cost.generator.litresPerYear);
        }
        if (life.cost.co2KgPerYear !== undefined) put(f, 'cost.co2', { group: 'cost', label: 'CO₂ of the losses a year', quantity: 'kg-per-year' }, life.cost.co2KgPerYear);
        put(f, 'cost.yearlyCounted', { group: 'cost', label: 'Yearly cost counted (losses and fuel)', quantity: 'money-per-year' }, life.cost.yearlyCost);
        put(f, 'cost.lifetime', { group: 'cost', label: 'Lifetime cost (net present value)', quantity: 'money' }, life.cost.npv);
        if (i > 0 && baseLife) {
          // Break-even and payback against the base (core/studies/lifetime-money.ts `breakEven`), in words where there is none.
          const be = breakEvenValues(compareLifetime(baseLife, life.cost), lifeSettings.years);
          put(f, 'cost.breakEven', { group: 'cost', label: 'Break-even year against the plan', quantity: 'years' }, be.breakEven);
          put(f, 'cost.payback', { group: 'cost', label: 'Simple payback against the plan', quantity: 'years' }, be.payback);
        }
      } else column.studyProblems.push({ study: 'lifetime', problems: life.problems });
    }
    for (const bank of quick.banks) {
      put(f, `bank.${bank.elementId}.current`, { group: 'battery', label: `${bank.name}: current at this load`, quantity: 'current' }, bank.operatingCurrent);
    }
    for (const b of studies.banks) {
      const at = (what: string) => `bank.${b.elementId}.${what}`;
      put(f, at('peak'), { group: 'battery', label: `${b.name}: highest current over the outage`, quantity: 'current' }, b.peakCurrent);
      put(f, at('runtime'), { group: 'battery', label: `${b.name}: runtime`, quantity: 'time' }, b.runtimeSeconds);
      // The runtime's verdict is the discharge's (the bank at the study's state of health); the sizing adds its design margin and aging.
      if (b.meetsTarget !== undefined) put(f, at('meets'), { group: 'battery', label: `${b.name}: runtime reaches the target (${asInstalledWords(sv)}, no margin or aging)`, quantity: 'text' }, b.meetsTarget ? YES : NO);
      if (b.sizedBank !== undefined) put(f, at('sized'), { group: 'battery', label: `${b.name}: bank for the target`, quantity: 'text' }, b.sizedBank);
      if (b.sizedCapacityAh !== undefined) {
        put(f, at('sizedAh'), { group: 'battery', label: `${b.name}: capacity for the target`, quantity: 'capacity' }, b.sizedCapacityAh);
        const installed = installedAh(sv, b.elementId);
        if (installed !== undefined) {
          put(f, at('installedAh'), { group: 'battery', label: `${b.name}: capacity installed`, quantity: 'capacity' }, installed);
          // The same cells in series and the same string module as the sizing (backup/study.ts), so the capacities compare directly.
          put(f, at('enough'), { group: 'battery', label: `${b.name}: installed bank ≥ bank for the target (with margin and aging)`, quantity: 'text' }, installed >= b.sizedCapacityAh * (1 - 1e-9) ? YES : NO);
        }
      }
      put(f, at('cableCurrent'), { group: 'battery', label: `${b.name}: current for its cable and fuse`, quantity: 'current' }, b.cableCurrent.amps);
      put(f, at('cableBasis'), { group: 'battery', label: `${b.name}: that current is`, quantity: 'text' }, cableCurrentBasis(b, quick.banks.find((q) => q.elementId === b.elementId)));
    }
    if (studies.bankProblems) column.studyProblems.push({ study: 'battery', problems: studies.bankProblems });
    // Cables: the current each carries (its input port), and for a sized cable its size, device and drop.
    for (const e of sv.result.elements) {
      if (e.kind !== 'cable') continue;
      put(f, `cable.${e.id}.current`, { group: 'cables', label: `${e.name}: current`, quantity: 'current' }, e.input?.current ?? null);
    }
    for (const c of quick.cables) {
      put(f, `cable.${c.elementId}.size`, { group: 'cables', label: `${c.name}: conductor size`, quantity: 'text' }, c.parallelSets > 1 ? `${c.parallelSets} × ${c.size}` : c.size);
      put(f, `cable.${c.elementId}.device`, { group: 'cables', label: `${c.name}: protective device`, quantity: 'current' }, c.deviceRating ?? null);
      put(f, `cable.${c.elementId}.drop`, { group: 'cables', label: `${c.name}: voltage drop`, quantity: 'percent' }, c.dropPercent);
    }
    // Each path's total drop from its source or regulating converter (the solve's path drops), given by resistance or sized.
    const names = new Map(sv.result.elements.map((e) => [e.id, e.name]));
    for (const d of sv.result.voltageDrop ?? []) {
      const to = names.get(d.loadId) ?? d.loadId;
      put(f, `drop.${d.loadId}`, { group: 'cables', label: `Drop to ${to}: path total`, quantity: 'percent' }, d.totalPercent);
      const limits = `${d.perLinkLimitPercent !== undefined ? `${sigText(d.perLinkLimitPercent, 3)} % a link, ` : ''}${sigText(d.totalLimitPercent, 3)} % in all`;
      // Shown only where some column is over its limit (the rows are filtered below): a "yes" on every path would bury the table.
      put(f, `drop.${d.loadId}.within`, { group: 'cables', label: `Drop to ${to}: within its limit (${limits})`, quantity: 'text' }, d.exceedsLimit ? NO : YES);
    }
    for (const st of studies.starts) {
      put(f, `start.${st.elementId}`, { group: 'starts', label: `${st.name}: start`, quantity: 'text' }, START_WORDS[st.verdict]);
    }
    if (studies.startProblems) column.studyProblems.push({ study: 'starting', problems: studies.startProblems });
    // Warnings in words, one row per element and kind of warning.
    for (const w of quick.warnings) {
      const key = `warning.${w.elementId}.${w.code}`;
      const prev = f.get(key);
      put(f, key, { group: 'warnings', label: `${w.name}: warning`, quantity: 'text' }, typeof prev === 'string' ? `${prev}; ${w.message}` : w.message);
    }
  });
  const GROUPS: RowGroup[] = ['balance', 'losses', 'cost', 'battery', 'cables', 'starts', 'warnings'];
  const rows: ComparisonRow[] = order.filter((key) => !(key.startsWith('drop.') && key.endsWith('.within') && figuresOf.every((f) => !f || (f.get(key) ?? YES) === YES))).map((key) => {
    const m = meta.get(key)!;
    const values = figuresOf.map((f) => (f ? (f.get(key) ?? null) : null));
    // Only the columns worked out are compared; the base's empty break-even (it is the reference) is no difference.
    const compared = values.filter((_, i) => figuresOf[i] !== null && !(i === 0 && (key === 'cost.breakEven' || key === 'cost.payback')));
    const differs = compared.some((x) => !same(x, compared[0] ?? null));
    return { key, ...m, values, differs };
  });
  rows.sort((a, b) => GROUPS.indexOf(a.group) - GROUPS.indexOf(b.group));
  return {
    columns,
    rows,
    hoursPerYear,
    lossesOverProfile: solved.project.running?.lossesFromProfile === true && solved.project.backup !== undefined,
    ...(costSettings ? { cost: { pricePerKWh: costSettings.pricePerKWh, hoursPerYear: costSettings.hoursPerYear } } : {}),
    ...(lifeSettings ? { lifetime: { years: lifeSettings.years, discountRate: lifeSettings.discountRate } } : {}),
    methods: lifeSettings ? [LIFETIME_METHOD_WORDS, ...(columns.length > 1 ? BREAK_EVEN_METHODS : [])] : [],
    cautions: COMPARISON_CAUTIONS,
  };
}
