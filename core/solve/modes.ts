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
 * The same loads, converters and cables below the bus are solved in both modes. Each mode sizes the
 * cables it carries for its own currents (conductor specs set to "auto"); the modes study
 * (core/studies/modes/) lists both and the larger governs.
 */
import type { BatterySource, Element, Project } from '../model/project.ts';
import type { Problem } from '../model/errors.ts';
import { KINDS } from '../kinds/index.ts';
import type { Solved, SolveOutcome } from './solved.ts';
import { solveVariant, type VariantChange } from './variant.ts';

/** Where a project's bank on a bus sits. */
export interface BankPlace {
  /** The bank (a battery element with a `from`). */
  bankId: string;
  /** The DC bus it hangs on. */
  busId: string;
  /** Ids from the bank's feed up to the bus, in that order (cables, then the bus; the bus alone when the bank hangs on it directly). */
  path: string[];
}

/** The bank on a bus of a valid project and its path to the bus, or null when the project has none. */
export function bankOnBus(project: Project): BankPlace | null {
  // A source kind with the `fedRole` trait, fed: the bank on a bus (the battery kind).
  const bank = project.elements.find((e): e is BatterySource => 'from' in e && e.from !== undefined && KINDS.get(e.kind)?.fedRole !== undefined);
  if (!bank) return null;
  const byId = new Map(project.elements.map((e) => [e.id, e]));
  const path: string[] = [];
  let at = byId.get(bank.from!);
  // Validation has checked the path: cables, then a DC bus (core/solve/structure.ts).
  while (at !== undefined) {
    path.push(at.id);
    if (at.kind === 'dc-bus') return { bankId: bank.id, busId: at.id, path };
    at = 'from' in at && at.from !== undefined ? byId.get(at.from) : undefined;
  }
  return null;
}

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

/** Both modes of a project with a bank on a bus. */
export interface Modes {
  place: BankPlace;
  /** On supply: the base solve (the bank on float). */
  supply: Solved;
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
  return { place, supply: solved, battery: solveVariant(solved, onBatteryChange(solved.project, place)) };
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
