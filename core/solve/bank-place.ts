/**
 * Where a project's battery bank on a DC bus sits (`bankOnBus`), and the inverters whose pass-through
 * limit does nothing for want of one (`unusedPassThrough`). Apart from modes.ts, which builds the
 * modes from them, so that the base solve (core/solve/project-warnings.ts) names an unused limit
 * without carrying the variant machinery into the page's first load.
 */
import type { BatterySource, Element, InverterStage, Project } from '../model/project.ts';
import { KINDS, isPassive } from '../kinds/index.ts';
import { elementWords, fieldLabel } from '../model/field-labels.ts';

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

/**
 * Inverters with a `passThroughLimit` that the modes do not use: not on the DC bus of a battery bank
 * (`place`, null when the project has no bank on a bus), so the field does nothing. One warning each,
 * naming the inverter (its name, or its kind and place) and the field by its form label: `message`
 * with the inverter's name first (a study's list), `reason` without it (an element's warning, shown
 * after the element's name).
 */
export function unusedPassThrough(project: Project, place: BankPlace | null): { inverterId: string; message: string; reason: string }[] {
  const inverters = project.elements.filter((e): e is InverterStage => e.kind === 'inverter' && e.passThroughLimit !== undefined);
  if (!inverters.length) return [];
  const byId = new Map(project.elements.map((e) => [e.id, e]));
  const { names } = elementWords(project);
  const label = fieldLabel('inverter', 'passThroughLimit');
  const out: { inverterId: string; message: string; reason: string }[] = [];
  for (const inv of inverters) {
    if (place) {
      // On the bank's bus: up through passive elements only, to the bus (as passThroughPlaces reads it).
      let at: Element | undefined = byId.get(inv.from);
      while (at && at.id !== place.busId && isPassive(at.kind) && 'from' in at && at.from !== undefined) at = byId.get(at.from);
      if (at?.id === place.busId) continue;
    }
    const reason = `its "${label}" is used only when a battery bank is on the inverter's DC bus; ${place ? 'the bank of this chain is on another bus' : 'this chain has no bank on a bus'}, so the limit does nothing here`;
    out.push({ inverterId: inv.id, message: `"${names.get(inv.id) ?? inv.id}": ${reason}`, reason });
  }
  return out;
}
