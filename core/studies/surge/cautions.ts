/** The cautions that go with every surge and fault result (kept in one place). */
import type { Project } from '../../model/project.ts';
import { PLANNING_CAUTION, VENTED_CAUTION } from '../backup/cautions.ts';

export const ARC_FLASH_CAUTION =
  'Arc flash: the fault currents shown are the energy source of an arc flash. Before work on or near live AC parts, an arc-flash risk assessment by a qualified person (to the local standard) sets the approach boundary and protective equipment; de-energise wherever possible.';
export const DC_ARC_CAUTION =
  'DC arcs do not pass through a current zero and can be sustained where an AC arc would go out: use fuses and breakers rated for DC at the bank voltage, and never open a DC circuit under load with a device not made for it.';
export const ESTIMATE_CAUTION =
  'Starting and fault figures are planning estimates from typical values where the maker’s data are not given; the motor, inverter, generator and protective-device makers’ data, local codes and licensed practice govern.';

export function surgeCautions(project: Project): string[] {
  const battery = project.elements.find((e) => e.kind === 'battery');
  // The battery planning caution names the bank and charger makers: only where there is a bank.
  const out = battery ? [ESTIMATE_CAUTION, PLANNING_CAUTION] : [ESTIMATE_CAUTION];
  const ac = project.elements.some((e) => e.kind === 'grid' || e.kind === 'generator' || e.kind === 'inverter');
  if (ac) out.push(ARC_FLASH_CAUTION);
  if (battery || project.elements.some((e) => e.kind === 'rectifier' || e.kind === 'dc-bus')) out.push(DC_ARC_CAUTION);
  if (battery?.kind === 'battery' && battery.bank && (battery.bank.chemistry === 'flooded-lead-acid' || battery.bank.chemistry === 'nicd')) out.push(VENTED_CAUTION);
  return out;
}
