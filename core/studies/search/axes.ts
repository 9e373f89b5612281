/**
 * The axes of the option search: each turns the user's candidates (core/model/option-search.ts) into
 * dimensions — one per element it changes — each a list of choices. A choice is a piece of a named
 * variant (`set` fields on an element or `swap` the element whole, core/model/variants.ts) with its
 * words ("2 strings", "Bank cable 10 mm²", "Inverter B") and the price of the element it leaves.
 *
 * Another axis is one entry of SEARCH_AXES. The system voltage (`voltageChoices`) is the first axis
 * but not an entry there: its choices change several elements (the bank re-strung and the voltages
 * that follow the DC system, `systemVoltageVariant(project, volts, { resizeCables: false })`,
 * core/variants/system-voltage.ts) and the strings axis sets the same bank field, so the search takes it
 * as an outer loop: for each voltage, the chain at that voltage, and the other axes' dimensions worked out
 * from it. A cable of a fixed size keeps it at every voltage (the quick variant sizes it again): a larger
 * cable is a candidate of the sizes axis with its price, not free, and the drop and ampacity checks judge
 * the one given.
 */
import type { BatterySource, CableStage, Element } from '../../model/project.ts';
import type { Problem } from '../../model/errors.ts';
import { PROJECT_LEVEL } from '../../model/errors.ts';
import type { OptionSearch } from '../../model/option-search.ts';
import { SEARCH_MAX_CHOICES } from '../../model/option-search.ts';
import type { ValidProject } from '../../solve/validate.ts';
import { defaultCatalogue } from '../../conductors/index.ts';
import { formatProblem } from '../../model/errors.ts';
import { CHEMISTRY_PRESETS } from '../../data/battery-chemistries.ts';
import { seriesForSystem, systemBank, systemVoltageVariant } from '../../variants/system-voltage.ts';
import { restrungResistance } from '../../variants/bank-resistance.ts';
import { sigText } from '../../model/message.ts';
import { variantChangeOf } from '../../solve/project-variant.ts';
import { variantProject } from '../../solve/variant.ts';

/** One choice on one dimension: a piece of a variant, its words and the price of the element it leaves. */
export interface SearchChoice {
  /** The axis's key ("strings", "cable", "inverter"). */
  axis: string;
  /** The element the choice changes. */
  elementId: string;
  /** The choice in the user's words ("2 strings", "Bank cable 10 mm²"). */
  words: string;
  /** Short words for a variant's name ("2 str", "10 mm²"). */
  short: string;
  /** Fields set on the element (the variant's `set` for this element). */
  set?: Record<string, unknown>;
  /** Fields set on several elements (the system voltage: the bank and what follows its voltage); the other choices' `set` win per field. */
  sets?: Record<string, Record<string, unknown>>;
  /** The element put in its place (the variant's `swap`). */
  swap?: Element;
  /** The element's purchase price with this choice, currency units; undefined when not known. */
  price: number | undefined;
}

/** One element's list of choices. */
export interface SearchDimension {
  axis: string;
  elementId: string;
  /** The element's name (its id when it has none). */
  elementName: string;
  choices: SearchChoice[];
}

export interface SearchAxisDef {
  key: string;
  /** What the axis changes, in words (a heading of the page's candidates). */
  label: string;
  /** The axis's dimensions from the search settings (none when the settings do not use it), or the problems of its candidates. */
  dimensions(project: ValidProject, search: OptionSearch): { dimensions: SearchDimension[]; problems: Problem[] };
}

const nameOf = (e: Element) => e.name ?? e.id;
/** A resistance in words, mΩ below 1 Ω. */
const ohms = (r: number) => (r < 1 ? `${sigText(r * 1000, 4)} mΩ` : `${sigText(r, 4)} Ω`);
const bad = (field: string, value: unknown, message: string): Problem => ({ code: 'invalid-value', elementId: PROJECT_LEVEL, field, value, message });

/**
 * Strings in parallel of a bank: the bank's `strings` set, and a whole-bank `internalResistance` with it
 * (× strings before ÷ strings after, said in the choice's words); price per string × strings (given, or
 * the bank's own price scaled).
 */
const stringsAxis: SearchAxisDef = {
  key: 'strings',
  label: 'Strings in the bank',
  dimensions(project, search) {
    const s = search.strings;
    if (!s) return { dimensions: [], problems: [] };
    const bank = project.elements.find((e): e is BatterySource => e.id === s.bank && e.kind === 'battery');
    if (!bank || !bank.bank) return { dimensions: [], problems: [bad('optionSearch.strings.bank', s.bank, 'must name a battery bank of the chain (with its cells and strings)')] };
    const counts = [...new Set(s.counts)].sort((a, b) => a - b);
    if (counts.length === 0) return { dimensions: [], problems: [bad('optionSearch.strings.counts', s.counts, 'must list at least one number of strings')] };
    if (counts.some((n) => !Number.isInteger(n) || n < 1 || n > 64)) return { dimensions: [], problems: [bad('optionSearch.strings.counts', s.counts, 'must be whole numbers of strings from 1 to 64')] };
    const baseStrings = bank.bank.strings ?? 1;
    // Price of one string: given, or the bank's own price shared over its strings (linear in strings, common practice (no source)).
    const perString = s.pricePerString ?? (bank.price !== undefined ? bank.price / baseStrings : undefined);
    const spec = bank.bank;
    const given = bank.internalResistance;
    const choices = counts.map((n): SearchChoice => {
      const price = perString !== undefined ? perString * n : undefined;
      const strung = `${n} ${n === 1 ? 'string' : 'strings'} in ${nameOf(bank)}`;
      // A resistance given for the whole bank is divided by the strings in parallel (R_bank = R_string·n/m,
      // core/variants/bank-resistance.ts); one worked out from the cell's figure follows the strings by itself.
      const r = given !== undefined && given > 0 && n !== baseStrings ? restrungResistance(given, spec, { series: spec.series, strings: n }) : undefined;
      return {
        axis: 'strings',
        elementId: bank.id,
        words: r !== undefined ? `${strung} (its internal resistance, given for the whole bank, ${ohms(given!)} → ${ohms(r)}: ${baseStrings} → ${n} strings in parallel)` : strung,
        short: `${n} ${n === 1 ? 'string' : 'strings'}`,
        set: { bank: { ...spec, strings: n }, ...(r !== undefined ? { internalResistance: r } : {}), ...(price !== undefined ? { price } : {}) },
        price,
      };
    });
    return { dimensions: [{ axis: 'strings', elementId: bank.id, elementName: nameOf(bank), choices }], problems: [] };
  },
};

/** The sizes a cable's conductor table lists (its system and material), smallest first. */
export function listedSizes(cable: CableStage): readonly string[] {
  const c = cable.conductor;
  if (!c) return [];
  const table = c.system === 'nec' ? defaultCatalogue.nec : defaultCatalogue.iec;
  return table.sizes(c.material).map((s) => s.label);
}

/** Conductor sizes of a cable: the conductor's `size` set (a fixed size, checked as the user's own). */
const cableAxis: SearchAxisDef = {
  key: 'cable',
  label: 'Conductor sizes',
  dimensions(project, search) {
    const dimensions: SearchDimension[] = [];
    const problems: Problem[] = [];
    (search.cables ?? []).forEach((c, i) => {
      const at = `optionSearch.cables.${i}`;
      const cable = project.elements.find((e): e is CableStage => e.id === c.cable && e.kind === 'cable');
      if (!cable || !cable.conductor) {
        problems.push(bad(`${at}.cable`, c.cable, 'must name a cable of the chain that has a conductor (NEC or IEC table)'));
        return;
      }
      const listed = listedSizes(cable);
      let sizes: string[];
      if (c.sizes && c.sizes.length) {
        const unknown = c.sizes.filter((s) => !listed.includes(s));
        if (unknown.length) {
          problems.push(bad(`${at}.sizes`, unknown, `names sizes the table of ${nameOf(cable)} does not list: ${unknown.join(', ')}`));
          return;
        }
        sizes = listed.filter((s) => c.sizes!.includes(s));
      } else if (c.fromSize !== undefined || c.toSize !== undefined) {
        const from = c.fromSize !== undefined ? listed.indexOf(c.fromSize) : 0;
        const to = c.toSize !== undefined ? listed.indexOf(c.toSize) : listed.length - 1;
        if (from < 0 || to < 0) {
          problems.push(bad(`${at}.${from < 0 ? 'fromSize' : 'toSize'}`, from < 0 ? c.fromSize : c.toSize, `must be a size the table of ${nameOf(cable)} lists`));
          return;
        }
        if (to < from) {
          problems.push(bad(`${at}.toSize`, c.toSize, 'must be the same size as the first one or larger'));
          return;
        }
        sizes = listed.slice(from, to + 1);
      } else {
        problems.push(bad(`${at}.sizes`, undefined, `must list sizes to try on ${nameOf(cable)}, or a first and last size`));
        return;
      }
      if (sizes.length > SEARCH_MAX_CHOICES) {
        problems.push(bad(`${at}.sizes`, sizes.length, `must hold at most ${SEARCH_MAX_CHOICES} sizes for one cable`));
        return;
      }
      const priceOf = new Map((c.prices ?? []).map((p) => [p.size, p.price]));
      const conductor = cable.conductor;
      const choices = sizes.map((size): SearchChoice => {
        // The cable's own price stands for its own size; another size has the price the search lists, or none.
        const price = priceOf.get(size) ?? (size === conductor.size ? cable.price : undefined);
        return {
          axis: 'cable',
          elementId: cable.id,
          words: `${nameOf(cable)} ${size}`,
          short: size,
          set: { conductor: { ...conductor, size }, price: price ?? null },
          price,
        };
      });
      dimensions.push({ axis: 'cable', elementId: cable.id, elementName: nameOf(cable), choices });
    });
    return { dimensions, problems };
  },
};

/** Whole alternative elements (another inverter): each swapped in with the replaced element's id and feed. */
const swapAxis: SearchAxisDef = {
  key: 'inverter',
  label: 'Inverters',
  dimensions(project, search) {
    const dimensions: SearchDimension[] = [];
    const problems: Problem[] = [];
    (search.inverters ?? []).forEach((s, i) => {
      const at = `optionSearch.inverters.${i}`;
      const current = project.elements.find((e) => e.id === s.element);
      if (!current) {
        problems.push(bad(`${at}.element`, s.element, 'must name an element of the chain'));
        return;
      }
      if (s.alternatives.length + 1 > SEARCH_MAX_CHOICES) {
        problems.push(bad(`${at}.alternatives`, s.alternatives.length, `must hold at most ${SEARCH_MAX_CHOICES - 1} alternatives`));
        return;
      }
      const choices: SearchChoice[] = [];
      if (s.keepCurrent !== false) choices.push({ axis: 'inverter', elementId: current.id, words: `${nameOf(current)} as it is`, short: nameOf(current), price: current.price });
      s.alternatives.forEach((alt) => {
        // The alternative takes the place of the current element: its id and feed (a name of its own, or the maker's model in its name).
        const placed = { ...alt, id: current.id, ...('from' in current && current.from !== undefined ? { from: current.from } : {}) } as Element;
        const name = alt.name ?? alt.id;
        choices.push({ axis: 'inverter', elementId: current.id, words: `${name} in place of ${nameOf(current)}`, short: name, swap: placed, price: alt.price });
      });
      if (choices.length === 0) {
        problems.push(bad(`${at}.alternatives`, s.alternatives.length, 'must list at least one alternative'));
        return;
      }
      dimensions.push({ axis: 'inverter', elementId: current.id, elementName: nameOf(current), choices });
    });
    return { dimensions, problems };
  },
};

/** One system voltage to try: its choice (first in an option) and the chain at that voltage (the other axes' dimensions come from it). */
export interface VoltageChoice {
  volts: number;
  choice: SearchChoice;
  project: ValidProject;
  /** Ratio of the bank's cells in series, new ÷ the chain's own (1 when the chain already has this voltage). */
  seriesRatio: number;
}

/**
 * The system voltages of the settings (12, 24, 48 V, each once, lowest first): each the chain as it is
 * when its bank already has that voltage, else the variant of systemVoltageVariant applied
 * (variantChangeOf, variantProject: its changed elements checked as a file's). The bank's price
 * follows its cells (same cells, same price; strings kept, price × cells new ÷ cells old: linear in
 * cells, common practice (no source)). A voltage the chain cannot take is a problem at the field.
 */
export function voltageChoices(project: ValidProject, search: OptionSearch): { choices: VoltageChoice[]; problems: Problem[] } {
  const list = search.systemVoltages;
  if (!list || list.length === 0) return { choices: [], problems: [] };
  const field = 'optionSearch.systemVoltages';
  const volts = [...new Set(list)].sort((a, b) => a - b);
  const bank = systemBank(project);
  if (!bank) return { choices: [], problems: [bad(field, list, 'needs a DC system with a battery bank: the system voltage changes the bank’s cells in series, and this chain has no bank')] };
  if (!bank.bank) return { choices: [], problems: [bad(field, list, `needs the cells and strings of ${nameOf(bank)} (it is given by its voltage alone): give the bank to try other system voltages`)] };
  const spec = bank.bank;
  const blockVolts = (spec.overrides?.nominalCellVoltage ?? CHEMISTRY_PRESETS[spec.chemistry].nominalCellVoltage) * (spec.cellsPerBlock ?? 1);
  const cellsBefore = spec.series * (spec.strings ?? 1);
  const choices: VoltageChoice[] = [];
  const problems: Problem[] = [];
  for (const v of volts) {
    const words = `${v} V system`;
    if (seriesForSystem(blockVolts, v) === spec.series) {
      choices.push({ volts: v, choice: { axis: 'voltage', elementId: bank.id, words: `${words} (as it is)`, short: words, price: bank.price }, project, seriesRatio: 1 });
      continue;
    }
    const out = systemVoltageVariant(project, v, { resizeCables: false });
    if (!out.ok) {
      problems.push(bad(field, v, `${v} V: ${out.problems.map((p) => p.message).join('; ')}`));
      continue;
    }
    const sets: Record<string, Record<string, unknown>> = { ...(out.variant.set ?? {}) };
    const newBank = sets[bank.id]?.['bank'] as { series: number; strings?: number } | undefined;
    const cellsAfter = newBank ? newBank.series * (newBank.strings ?? 1) : cellsBefore;
    const price = bank.price !== undefined ? Number(((bank.price * cellsAfter) / cellsBefore).toPrecision(6)) : undefined;
    if (price !== undefined) sets[bank.id] = { ...sets[bank.id], price };
    const change = variantChangeOf(project, { name: words, set: sets });
    const changed = change.ok ? variantProject(project, change.change) : change;
    if (!changed.ok) {
      const first = changed.problems[0];
      problems.push(bad(field, v, `${v} V: the chain at this voltage is refused: ${first ? formatProblem(first, project) : 'refused'}`));
      continue;
    }
    choices.push({
      volts: v,
      choice: { axis: 'voltage', elementId: bank.id, words, short: words, sets, price },
      project: changed.project,
      seriesRatio: (newBank?.series ?? spec.series) / spec.series,
    });
  }
  return problems.length ? { choices: [], problems } : { choices, problems };
}

/**
 * Every axis, in the order its choices appear in an option's name. One entry adds an axis; the
 * system voltage comes before them all (`voltageChoices`, an outer loop: see the header).
 */
export const SEARCH_AXES: readonly SearchAxisDef[] = [
  stringsAxis,
  swapAxis,
  cableAxis,
];
