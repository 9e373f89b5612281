/**
 * One system in both its modes: a battery bank on a DC bus inside a chain fed from the supply (a DC
 * plant: supply → rectifier → DC bus with the bank → loads; an online UPS: supply → rectifier → DC bus
 * with the bank → inverter → AC loads).
 *
 * - On supply: the project as drawn, its base solve. The bank is a DC load on its bus drawing its
 *   float current (core/kinds/battery.ts); `rechargeChange` puts the recharge current in its place.
 * - On battery: the supply branch is cut and the bank is the root. Built by `onBatteryChange`, a
 *   variant of the solved project (core/solve/variant.ts, whole elements replaced and removed; no
 *   second validation of the file): the bank loses its `from` and becomes the source; the cables
 *   between it and its bus are turned round (each fed from the element that was below it), the bus
 *   is fed from them; every element outside the bus's branch drops out (the rectifier and everything
 *   between it and the supply, and the supply's other branches, which an outage leaves dark).
 *
 * - An inverter-charger's pass-through (an inverter on the bank's bus with a `passThroughLimit`): on
 *   supply its transfer relay passes the supply straight to its loads. The on-supply mode is then a
 *   variant (`passThroughChange`): a relay (a `transfer-switch` of no contact resistance and no control
 *   power: the maker's relay losses are not given) fed from the supply side of the bus's charger (the
 *   element feeding it) carries the inverter's loads; the inverter stays on the bus with nothing to
 *   feed, so its conversion losses drop out and it draws its idle loss (its loss model at zero output).
 *   Assumption, named in the study's working: the inverter stays on, synchronised to the supply and
 *   ready to take the loads (the usual setting for a short transfer); a maker whose unit switches its
 *   inverter off in pass-through gives an idle loss of 0.
 *
 * The same loads, converters and cables below the bus are solved in both modes. Each mode sizes the
 * cables it carries for its own currents (conductor specs set to "auto"); the modes study
 * (core/studies/modes/cables.ts) gives each cable the largest size its cases need.
 */
import type { BatterySource, Element, InverterStage, Project } from '../model/project.ts';
import type { SolveResult } from '../model/result.ts';
import type { Problem } from '../model/errors.ts';
import { isPassive } from '../kinds/index.ts';
import type { Solved, SolveOutcome } from './solved.ts';
import { solveVariant, type VariantChange } from './variant.ts';
import { bankOnBus, type BankPlace } from './bank-place.ts';

export { bankOnBus, unusedPassThrough, type BankPlace } from './bank-place.ts';

/** Ids of the element and everything below it. */
function branchOf(project: Project, rootId: string): Set<string> {
  const children = new Map<string, string[]>();
  for (const e of project.elements) {
    if (!('from' in e) || e.from === undefined) continue;
    const list = children.get(e.from);
    if (list) list.push(e.id);
    else children.set(e.from, [e.id]);
  }
  const out = new Set<string>();
  const stack = [rootId];
  while (stack.length) {
    const id = stack.pop()!;
    if (out.has(id)) continue;
    out.add(id);
    stack.push(...(children.get(id) ?? []));
  }
  return out;
}

/**
 * The change that cuts the supply branch and makes the bank the root (see the header): the bank
 * without `from`, the path to its bus turned round, everything outside the bus's branch removed, the
 * pump duty dropped when its pump is among them.
 */
export function onBatteryChange(project: Project, place: BankPlace): VariantChange {
  const byId = new Map(project.elements.map((e) => [e.id, e]));
  const keep = branchOf(project, place.busId);
  const remove = new Set(project.elements.filter((e) => !keep.has(e.id)).map((e) => e.id));
  const { from: _from, ...bank } = byId.get(place.bankId) as BatterySource;
  const replace: Element[] = [bank as Element];
  place.path.forEach((id, k) => {
    const e = byId.get(id)!;
    replace.push({ ...e, from: k === 0 ? place.bankId : place.path[k - 1]! } as Element);
  });
  return {
    replace,
    remove,
    ...(project.pumpDuty !== undefined && remove.has(project.pumpDuty.pump) ? { pumpDuty: null } : {}),
  };
}

/**
 * The change that puts the bank's recharge current in place of its float current on supply: the
 * bank drawn as a constant-current DC load of `current` A (a `dc-current-load` of the same id and
 * name, fed as the bank is).
 */
export function rechargeChange(project: Project, place: BankPlace, current: number): VariantChange {
  const bank = project.elements.find((e) => e.id === place.bankId) as BatterySource;
  return { replace: [{ id: bank.id, ...(bank.name !== undefined ? { name: bank.name } : {}), kind: 'dc-current-load', from: bank.from!, current }] };
}

/** An inverter-charger on the bank's bus passing the supply through to its loads on supply. */
export interface PassThroughPlace {
  /** The inverter (on the bank's bus, directly or through cables) with its pass-through limit, A. */
  inverterId: string;
  limit: number;
  /** The charger (the converter feeding the bus) and the element feeding it: the relay's feed. */
  chargerId: string;
  feedId: string;
  /** The relay's id in the on-supply variant (a transfer-switch). */
  relayId: string;
  /** The elements the inverter feeds: fed from the relay on supply. */
  loadIds: string[];
}

/** The first element above the bus that is not passive (the rectifier or charger feeding it), or null. */
export function chargerOf(elements: readonly Element[], busId: string): Element | null {
  const byId = new Map(elements.map((e) => [e.id, e]));
  let at = byId.get(busId);
  const seen = new Set<string>();
  while (at && 'from' in at && at.from !== undefined && !seen.has(at.id)) {
    seen.add(at.id);
    at = byId.get(at.from);
    if (at && !isPassive(at.kind)) return at;
  }
  return null;
}

/**
 * The inverter-chargers of a project with a bank on a bus that pass the supply through on supply:
 * inverters with a `passThroughLimit` fed from the bank's bus (directly or through cables and other
 * passive elements), when the bus has a charger with a feed whose port (from the solved result) is the
 * inverter's output port kind. `refused` lists those whose supply side cannot carry their loads, with why.
 */
export function passThroughPlaces(project: Project, place: BankPlace, result: SolveResult): { places: PassThroughPlace[]; refused: { inverterId: string; reason: string }[] } {
  const places: PassThroughPlace[] = [];
  const refused: { inverterId: string; reason: string }[] = [];
  const inverters = project.elements.filter((e): e is InverterStage => e.kind === 'inverter' && e.passThroughLimit !== undefined);
  if (!inverters.length) return { places, refused };
  const byId = new Map(project.elements.map((e) => [e.id, e]));
  const ports = new Map(result.elements.map((e) => [e.id, e]));
  const charger = chargerOf(project.elements, place.busId);
  const feedId = charger && 'from' in charger ? charger.from : undefined;
  const taken = new Set(project.elements.map((e) => e.id));
  for (const inv of inverters) {
    // On the bank's bus: up through passive elements only, to the bus.
    let at: Element | undefined = byId.get(inv.from);
    while (at && at.id !== place.busId && isPassive(at.kind) && 'from' in at && at.from !== undefined) at = byId.get(at.from);
    if (!at || at.id !== place.busId) continue;
    if (!charger || feedId === undefined) {
      refused.push({ inverterId: inv.id, reason: 'no charger feeds its bus, so there is no supply to pass through' });
      continue;
    }
    const supplyPort = ports.get(feedId)?.output?.kind;
    const outPort = inv.phases === 3 ? 'ac3' : 'ac1';
    if (supplyPort !== outPort) {
      refused.push({ inverterId: inv.id, reason: `its output is ${outPort === 'ac3' ? 'three-phase' : 'single-phase'} AC, the supply side of the charger is ${supplyPort === 'ac3' ? 'three-phase AC' : supplyPort === 'ac1' ? 'single-phase AC' : 'not AC'}` });
      continue;
    }
    let relayId = `${inv.id}-pass-through`;
    for (let k = 2; taken.has(relayId); k++) relayId = `${inv.id}-pass-through-${k}`;
    taken.add(relayId);
    const loadIds = project.elements.filter((e) => 'from' in e && e.from === inv.id).map((e) => e.id);
    places.push({ inverterId: inv.id, limit: inv.passThroughLimit!, chargerId: charger.id, feedId, relayId, loadIds });
  }
  return { places, refused };
}

/**
 * The on-supply change of inverter-chargers passing the supply through (see the header): per inverter
 * a relay fed from the charger's feed, the inverter's loads fed from it; the inverter stays on the bus.
 */
export function passThroughChange(project: Project, places: readonly PassThroughPlace[]): VariantChange {
  const byId = new Map(project.elements.map((e) => [e.id, e]));
  const add: Element[] = [];
  const replace: Element[] = [];
  for (const p of places) {
    const inv = byId.get(p.inverterId)!;
    add.push({ id: p.relayId, name: `${inv.name ?? inv.id}: pass-through relay`, kind: 'transfer-switch', from: p.feedId, contactResistance: 0, controlPower: 0 });
    for (const id of p.loadIds) replace.push({ ...byId.get(id)!, from: p.relayId } as Element);
  }
  return { add, replace };
}

/** The on-supply mode's pass-through: where, and whether its variant solved (null) or why not. */
export interface PassThroughMode {
  places: PassThroughPlace[];
  refused: { inverterId: string; reason: string }[];
  /** The variant's problems when it could not be solved (the on-supply mode is then the file as drawn). */
  problems: Problem[] | null;
}

/** Both modes of a project with a bank on a bus. */
export interface Modes {
  place: BankPlace;
  /**
   * On supply: the base solve (the bank on float), or, with an inverter-charger passing the supply
   * through, that variant (`passThrough`).
   */
  supply: Solved;
  /** Present when an inverter on the bank's bus has a pass-through limit. */
  passThrough?: PassThroughMode;
  /** On battery: the chain re-rooted at the bank, solved (or why it cannot be: the bank cannot carry the bus). */
  battery: SolveOutcome;
}

/**
 * Both modes' solved values (the page and the CLI call this with the solved project): null when the
 * project has no bank on a bus (it has one mode, its base solve).
 */
export function solveModes(solved: Solved): Modes | null {
  const place = bankOnBus(solved.project);
  if (!place) return null;
  const battery = solveVariant(solved, onBatteryChange(solved.project, place));
  const pt = passThroughPlaces(solved.project, place, solved.result);
  if (!pt.places.length && !pt.refused.length) return { place, supply: solved, battery };
  const variant = pt.places.length ? solveVariant(solved, passThroughChange(solved.project, pt.places)) : null;
  return {
    place,
    supply: variant?.ok ? variant : solved,
    battery,
    passThrough: { places: pt.places, refused: pt.refused, problems: variant && !variant.ok ? variant.problems : null },
  };
}

/**
 * The solved value a study of the outage runs on (the battery backup study): the base solve when the
 * bank is the chain's source, the on-battery mode when it sits on a bus. `onBattery` says which.
 */
export function outageSolve(solved: Solved): { ok: true; solved: Solved; onBattery: boolean } | { ok: false; problems: Problem[] } {
  const place = bankOnBus(solved.project);
  if (!place) return { ok: true, solved, onBattery: false };
  const battery = solveVariant(solved, onBatteryChange(solved.project, place));
  return battery.ok ? { ok: true, solved: battery, onBattery: true } : battery;
}
