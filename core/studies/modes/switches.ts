/**
 * Transfer switches in the two modes (core/kinds/transfer-switch.ts), and what the on-battery path can
 * carry: parts of the modes study (study.ts).
 *
 * - A switch's transfer working: its loss on supply and on battery (the solves' own figures: contact
 *   I²R per current-carrying conductor plus its control power), its transfer time, and the break its
 *   loads see when the supply is cut. Rule (common practice, no source): loads on the output side of a
 *   converter that the bank keeps feeding (an online UPS's inverter) see no break, the inverter carries
 *   on from the bank; anywhere else the loads below a switch see a break of its transfer time (a switch
 *   on the supply side of the bank's bus says that the loads on the bus see none: the bank holds it).
 * - The on-battery path's limits: the bank's maximum discharge current (chemistry C-rate × Ah), each
 *   inverter's rating (its rated continuous output power, else its loss model's rated power) and each
 *   transfer switch's rated current, each against what the on-battery chain asks of it; each cable's
 *   ampacity (its conductor sizing's, at the size the on-battery solve carries) against its operating
 *   current on battery (the bank's voltage sags below the nominal the design current was taken at).
 *   Each warning names the element and both figures.
 */
import type { Element, InverterStage } from '../../model/project.ts';
import type { ElementResult, SolveResult } from '../../model/result.ts';
import { say, q, sigText, type Worded } from '../../model/message.ts';
import { isPassive } from '../../kinds/index.ts';
import type { BankPlace } from '../../solve/modes.ts';

/** One transfer switch's working in the two modes. */
export interface SwitchTransfer {
  id: string;
  name: string;
  /** Transfer time, s (null when none is given). */
  transferTime: number | null;
  /** True when it sits on the output side of a converter fed from the bank's bus (an online UPS's inverter). */
  onInverterOutput: boolean;
  /** The converter it sits behind when `onInverterOutput`. */
  inverterName: string | null;
  /** The break its loads see when the supply is cut, s: 0 on an inverter's output side, else its transfer time (null when not given). */
  breakTime: number | null;
  /** Its loss on supply and on battery (null when it is not in the on-battery chain), W. */
  lossOnSupply: number;
  lossOnBattery: number | null;
  /** The working in words. */
  note: string;
}

const ms = (s: number): string => `${sigText(s * 1000, 3)} ms`;

/** The first non-passive element above `id` before the bus, or null when it is fed from the bus through passive elements only or lies outside the bus's branch. */
function converterBetween(elements: readonly Element[], id: string, busId: string): { inBranch: boolean; converter: Element | null } {
  const byId = new Map(elements.map((e) => [e.id, e]));
  let converter: Element | null = null;
  const seen = new Set<string>();
  let at = byId.get(id);
  while (at && 'from' in at && at.from !== undefined && !seen.has(at.id)) {
    seen.add(at.id);
    if (at.from === busId) return { inBranch: true, converter };
    at = byId.get(at.from);
    if (at && converter === null && !isPassive(at.kind) && at.id !== busId) converter = at;
  }
  return { inBranch: false, converter: null };
}

/** Is the bus below the element (the switch feeds the bus, on its supply side)? */
function feedsBus(elements: readonly Element[], id: string, busId: string): boolean {
  const byId = new Map(elements.map((e) => [e.id, e]));
  const seen = new Set<string>();
  let at = byId.get(busId);
  while (at && 'from' in at && at.from !== undefined && !seen.has(at.id)) {
    seen.add(at.id);
    if (at.from === id) return true;
    at = byId.get(at.from);
  }
  return false;
}

const busName = (elements: readonly Element[], busId: string): string => {
  const bus = elements.find((e) => e.id === busId);
  return bus?.name ?? busId;
};

/** Every transfer switch of the project with its working in both modes (`battery` the on-battery result, when it solved). */
export function switchWorking(elements: readonly Element[], place: BankPlace, supply: SolveResult, battery: SolveResult | undefined): SwitchTransfer[] {
  const onSupply = new Map(supply.elements.map((e) => [e.id, e]));
  const onBattery = new Map((battery?.elements ?? []).map((e) => [e.id, e]));
  const out: SwitchTransfer[] = [];
  for (const e of elements) {
    if (e.kind !== 'transfer-switch') continue;
    const name = e.name ?? e.id;
    const where = converterBetween(elements, e.id, place.busId);
    const onInverterOutput = where.inBranch && where.converter !== null;
    const inverterName = onInverterOutput ? (where.converter!.name ?? where.converter!.id) : null;
    const t = e.transferTime ?? null;
    const breakTime = onInverterOutput ? 0 : t;
    const note = onInverterOutput
      ? `on the output of "${inverterName}": its loads see no break when the supply is cut (the inverter carries on from the bank)${t !== null ? `; its ${ms(t)} transfer applies when it moves them to a bypass` : ''}`
      : (t !== null ? `its loads see a break of ${ms(t)} when it transfers` : "no transfer time given: its loads see a break of the maker's transfer time when it transfers") +
        (feedsBus(elements, e.id, place.busId) ? ` (those on the bus "${busName(elements, place.busId)}" see none: the bank holds the bus)` : '');
    out.push({
      id: e.id,
      name,
      transferTime: t,
      onInverterOutput,
      inverterName,
      breakTime,
      lossOnSupply: onSupply.get(e.id)?.loss ?? 0,
      lossOnBattery: onBattery.get(e.id)?.loss ?? null,
      note,
    });
  }
  return out;
}

/** Current through an element's input, A (line current on three-phase). */
const currentIn = (r: ElementResult | undefined): number | undefined => r?.input?.current;

/**
 * What the on-battery chain asks beyond what its path can carry (see the header): the bank's maximum
 * discharge current, the inverters' ratings, the switches' rated currents, the cables' ampacity.
 * `battery` is the settled on-battery result; the bank's current at transfer is checked by the study.
 */
export function batteryPathWarnings(elements: readonly Element[], place: BankPlace, bankName: string, maxDischargeCurrent: number, battery: SolveResult): (Worded & { elementId: string })[] {
  const warnings: (Worded & { elementId: string })[] = [];
  const push = (elementId: string, w: Worded): void => {
    warnings.push({ elementId, ...w });
  };
  const r = new Map(battery.elements.map((e) => [e.id, e]));
  const bankCurrent = r.get(place.bankId)?.output?.current;
  if (bankCurrent !== undefined && bankCurrent > maxDischargeCurrent * (1 + 1e-9)) {
    push(place.bankId, say`on battery the loads take ${q(bankCurrent, 'A')} from the bank "${bankName}", above its maximum discharge current ${q(maxDischargeCurrent, 'A')}: the on-battery path cannot carry them`);
  }
  for (const e of elements) {
    const res = r.get(e.id);
    if (!res) continue;
    const name = e.name ?? e.id;
    if (e.kind === 'inverter') {
      const rated = ratingOf(e);
      if (rated !== undefined && res.pOut > rated * (1 + 1e-9)) {
        push(e.id, say`on battery the loads of "${name}" take ${q(res.pOut, 'W')}, above its rated output ${q(rated, 'W')}: the on-battery path cannot carry them`);
      }
    } else if (e.kind === 'transfer-switch' && e.ratedCurrent !== undefined) {
      // The current through its contacts: the output's (its input adds the control power's draw, as the kind's own check leaves out).
      const i = res.output?.current;
      if (i !== undefined && i > e.ratedCurrent * (1 + 1e-9)) {
        push(e.id, say`on battery "${name}" carries ${q(i, 'A')}, above its rated current ${q(e.ratedCurrent, 'A')}: the on-battery path cannot carry its loads`);
      }
    } else if (e.kind === 'cable' && res.conductor) {
      const i = res.conductor.operatingCurrent;
      const ampacity = res.conductor.ampacity.total;
      if (i > ampacity * (1 + 1e-9)) {
        push(e.id, say`on battery "${name}" carries ${q(i, 'A')}, above the ampacity ${q(ampacity, 'A')} of its ${res.conductor.size}: the on-battery path cannot carry its loads`);
      }
    }
  }
  return warnings;
}

/** An inverter's rating: its rated continuous output power, else its loss model's rated power. */
function ratingOf(e: InverterStage): number | undefined {
  return e.ratedOutputPower ?? ('ratedPower' in e.loss ? e.loss.ratedPower : undefined);
}
