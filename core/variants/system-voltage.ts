/**
 * System voltage of a DC system (12, 24 or 48 V): the battery bank's series count changes, the
 * equipment whose voltage follows the DC system's changes in proportion, and the DC system's cables
 * are sized again when the variant is solved (each sized cable's design current follows the new
 * voltage; a cable whose conductor has a fixed size in the plan gets size "auto" in the variant).
 * A cable given by its resistance cannot be sized, and one whose design current is given keeps it:
 * the note names each, to be checked at the new current. The variant stores only what it changes
 * (`bank: { series, strings }`, `conductor: { size: "auto" }`), so later edits of the plan reach it.
 *
 * - Cells (or blocks) in series per string: as many as make 12 V, rounded up from the chemistry's
 *   nominal cell voltage × cells per block, times the system voltage ÷ 12 (common practice (no
 *   source): a 12 V system is 6 lead-acid cells, 4 LiFePO4 cells or 10 NiCd cells; 24 and 48 V
 *   systems are two and four of them in series).
 * - The same cells are kept where they can be: the strings in parallel become cells ÷ new series
 *   when that is a whole number (the bank's stored energy is then the same), else the strings stay
 *   and the note says the energy changes with the voltage.
 * - Voltages that belong to the DC system scale with the bank's nominal voltage, k = n_new / n_old
 *   (same cells): an inverter's low-voltage cut-off and a DC-DC converter's lowest input voltage
 *   on the bus side; the output voltage of the charger or converter that feeds the bus; a voltage
 *   given for the bank itself; a whole-bank internal resistance scales with the series count and
 *   inversely with the strings (R = R_string·n/m).
 * - The DC system: the bank and the cables and DC buses joined to it (the elements that pass its
 *   voltage through); what hangs off it or feeds it is the equipment above.
 * - Cautions in the note (common practice (no source)): the equipment on the DC system is the same
 *   equipment, so each must be made for the new voltage (an inverter's, a charger's, a DC-DC
 *   converter's DC range; a DC load's); more than DEFAULT_MAX_STRINGS (4) strings in parallel share
 *   the current unevenly and makers limit how many may be paralleled.
 */
import { PROJECT_LEVEL, type Problem } from '../model/errors.ts';
import type { Element, Project } from '../model/project.ts';
import { CHEMISTRY_PRESETS } from '../data/battery-chemistries.ts';
import { elementWords } from '../model/field-labels.ts';
import type { QuickVariantOutcome } from './types.ts';
import { restrungResistance } from './bank-resistance.ts';
import { DEFAULT_MAX_STRINGS } from '../studies/backup/sizing-types.ts';

/**
 * What the planner is asked to check of equipment kept the same at another DC voltage (the option
 * search words it so too): after "…the same, now at 24 V DC (names): ".
 */
export const MADE_FOR_VOLTAGE = 'check that each is made for that voltage, or list alternatives with their makers’ figures';

/** The system voltages offered (the usual DC system voltages of small installations). */
export const SYSTEM_VOLTAGES = [12, 24, 48] as const;
export type SystemVoltage = (typeof SYSTEM_VOLTAGES)[number];

/** Kinds that pass the DC system's voltage through (its members). */
const PASSES = new Set(['battery', 'cable', 'dc-bus']);

/** The bank a system voltage variant changes: the chain's source bank, else a bank on a bus. */
export function systemBank(project: Pick<Project, 'elements'>): Extract<Element, { kind: 'battery' }> | undefined {
  const banks = project.elements.filter((e): e is Extract<Element, { kind: 'battery' }> => e.kind === 'battery');
  return banks.find((b) => b.from === undefined) ?? banks[0];
}

/** Blocks in series per string for a system voltage (see the file's top), and the block's nominal voltage. */
export function seriesForSystem(blockVolts: number, volts: number): number {
  // Rounded up with a tolerance so that 12 / 2.0 V stays 6 (not 7 by round-off).
  const per12 = Math.ceil(12 / blockVolts - 1e-9);
  return per12 * Math.round(volts / 12);
}

/** A voltage of the DC system times the ratio of the bank's nominal voltages. */
function scaled(v: number, k: number): number {
  // Rounded to 4 significant digits: a field's value as a planner would write it, not a float's tail.
  return Number((v * k).toPrecision(4));
}

/** How the system voltage variant treats the DC system's cables. */
export interface SystemVoltageOptions {
  /**
   * true (the quick variant's default): a cable with a conductor of a fixed size gets size "auto", so it
   * is sized again for the new current. false: it keeps its size (the option search, whose conductor
   * sizes are an axis of their own, priced); the note then names it to be checked at the new current.
   */
  resizeCables?: boolean;
}

/** The variant that runs the DC system at `volts` (12, 24 or 48 V; see the file's top), or why it does not apply. */
export function systemVoltageVariant(project: Pick<Project, 'elements'>, volts: number, options: SystemVoltageOptions = {}): QuickVariantOutcome {
  const resize = options.resizeCables ?? true;
  const refuse = (elementId: string, field: string, message: string): QuickVariantOutcome => ({ ok: false, problems: [{ code: 'invalid-value', elementId, field, value: volts, message } satisfies Problem] });
  if (!(SYSTEM_VOLTAGES as readonly number[]).includes(volts)) return refuse(PROJECT_LEVEL, 'variants', `a system voltage of ${volts} V is not offered: choose 12, 24 or 48 V`);
  const bank = systemBank(project);
  if (!bank) return refuse(PROJECT_LEVEL, 'variants', 'the chain has no DC system with a battery bank: the system voltage changes the bank’s cells in series');
  const { names } = elementWords(project);
  const bankName = names.get(bank.id) ?? bank.id;
  if (!bank.bank) return refuse(bank.id, 'bank', `"${bankName}" is given by its voltage alone: give its cells and strings (the bank) to change the system voltage`);
  const spec = bank.bank;
  const cellVolts = spec.overrides?.nominalCellVoltage ?? CHEMISTRY_PRESETS[spec.chemistry].nominalCellVoltage;
  const blockVolts = cellVolts * (spec.cellsPerBlock ?? 1);
  const series = seriesForSystem(blockVolts, volts);
  if (series === spec.series) return refuse(bank.id, 'bank.series', `"${bankName}" is already a ${volts} V bank (${series} in series)`);
  const strings = spec.strings ?? 1;
  const cells = spec.series * strings;
  const keepsCells = cells % series === 0;
  const newStrings = keepsCells ? cells / series : strings;
  const k = series / spec.series;
  const set: Record<string, Record<string, unknown>> = {};
  // Only what changes: the bank's other fields (capacity, chemistry, state of charge) stay the plan's and follow its edits.
  const bankFields: Record<string, unknown> = { bank: { series, ...(newStrings !== 1 || spec.strings !== undefined ? { strings: newStrings } : {}) } };
  if (bank.voltage !== undefined) bankFields['voltage'] = scaled(bank.voltage, k);
  // Whole-bank resistance: n blocks in series, m strings in parallel, R = R_string·n/m (bank-resistance.ts).
  if (bank.internalResistance !== undefined) bankFields['internalResistance'] = restrungResistance(bank.internalResistance, { series: spec.series, strings }, { series, strings: newStrings });
  set[bank.id] = bankFields;
  // The DC system: the bank's component through the elements that pass its voltage.
  const byId = new Map(project.elements.map((e) => [e.id, e]));
  const children = new Map<string, Element[]>();
  for (const e of project.elements) {
    if ('from' in e && e.from !== undefined) children.set(e.from, [...(children.get(e.from) ?? []), e]);
  }
  const inSystem = new Set<string>([bank.id]);
  const queue: Element[] = [bank];
  const edge: Element[] = [];
  const visit = (e: Element | undefined) => {
    if (!e || inSystem.has(e.id)) return;
    if (PASSES.has(e.kind) && e.kind !== 'battery') {
      inSystem.add(e.id);
      queue.push(e);
    } else if (!edge.includes(e)) edge.push(e);
  };
  while (queue.length) {
    const e = queue.shift()!;
    for (const c of children.get(e.id) ?? []) visit(c);
    if ('from' in e && e.from !== undefined) visit(byId.get(e.from));
  }
  const changed: string[] = [];
  for (const e of edge) {
    const feedsSystem = 'from' in e && e.from !== undefined ? !inSystem.has(e.from) : true; // above the system: it feeds the bus
    const fields: Record<string, unknown> = {};
    if (e.kind === 'inverter' && !feedsSystem && e.lowVoltageCutoff !== undefined) fields['lowVoltageCutoff'] = scaled(e.lowVoltageCutoff, k);
    if (e.kind === 'dc-dc' && !feedsSystem && e.minInputVoltage !== undefined) fields['minInputVoltage'] = scaled(e.minInputVoltage, k);
    if (feedsSystem && (e.kind === 'rectifier' || e.kind === 'dc-dc' || (e.kind === 'generic' && e.outputKind === 'dc'))) fields['outputVoltage'] = scaled(e.outputVoltage, k);
    if (Object.keys(fields).length) {
      set[e.id] = fields;
      changed.push(names.get(e.id) ?? e.id);
    }
  }
  // The DC system's cables: sized again (a fixed size set to "auto"), or named when they cannot be.
  const sized: string[] = [];
  const unsized: string[] = [];
  for (const e of project.elements) {
    if (e.kind !== 'cable' || !inSystem.has(e.id)) continue;
    const name = names.get(e.id) ?? e.id;
    const c = e.conductor;
    if (!c) {
      unsized.push(`${name}: given by its resistance, not sized again: check it at the new current`);
      continue;
    }
    if (c.size !== 'auto' && !resize) {
      unsized.push(`${name}: kept at ${c.size}, not sized again: check it at the new current`);
      continue;
    }
    if (c.size !== 'auto') set[e.id] = { conductor: { size: 'auto' } };
    if (c.designCurrentBasis === 'given') unsized.push(`${name}: its design current is given${c.designCurrent !== undefined ? ` (${c.designCurrent} A)` : ''}, so it is sized again for that current: check it at the new voltage`);
    else sized.push(c.size === 'auto' ? name : `${name} (${c.size} in the plan)`);
  }
  const equipment = edge.map((e) => names.get(e.id) ?? e.id);
  const nominal = series * blockVolts;
  const note = [
    `${bankName}: ${series} in series × ${newStrings} string${newStrings === 1 ? '' : 's'} (${Number(nominal.toPrecision(4))} V nominal)`,
    keepsCells ? 'the same cells, so the same stored energy' : `the strings kept, so the stored energy changes with the voltage (× ${Number(k.toPrecision(3))})`,
    newStrings > DEFAULT_MAX_STRINGS ? `${newStrings} strings in parallel share the current unevenly, and makers limit how many strings may be put in parallel (typical value ${DEFAULT_MAX_STRINGS}: use the maker’s figure)` : '',
    changed.length ? `voltages that follow the DC system changed in proportion: ${changed.join(', ')}` : '',
    sized.length ? `cables sized again for the new currents: ${sized.join(', ')}` : '',
    ...unsized,
    equipment.length ? `the equipment on the DC system is the same, now at ${volts} V DC (${equipment.join(', ')}): ${MADE_FOR_VOLTAGE}` : '',
  ].filter((s) => s !== '');
  return { ok: true, variant: { name: `${volts} V system`, note: note.join('; '), set } };
}
