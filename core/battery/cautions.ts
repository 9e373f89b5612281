/**
 * The cautions that go with every battery result (runtime, sizing, recharge), kept in one place
 * so that a report showing several results lists each caution once.
 */
import type { Chemistry } from '../data/battery-chemistries.ts';

export const PLANNING_CAUTION =
  'Planning estimate only: the bank, cell and charger makers\u2019 data, local codes and licensed practice govern the final design.';
export const FUSE_CAUTION =
  'Fit a fuse or breaker as close to the bank as practical, rated to interrupt the bank\u2019s prospective short-circuit current (lithium banks can deliver many kA).';
export const LITHIUM_CAUTION =
  'Lithium cells need a battery management system that disconnects on over-/under-voltage, over-current and temperature, and must not be charged below 0 °C (or the maker\u2019s lower limit).';
export const VENTED_CAUTION =
  'Vented cells give off hydrogen on charge: the battery room or enclosure needs ventilation sized for it.';
export const CHARGE_VOLTAGE_CAUTION =
  'Set the charge and float voltages from the cell maker\u2019s data (lead-acid: compensated for temperature).';

/** Lithium chemistries: need a BMS, no charging below 0 °C, energy-method sizing. */
export const isLithium = (c: Chemistry): boolean => c === 'lifepo4' || c === 'nmc';
const isVented = (c: Chemistry): boolean => c === 'flooded-lead-acid' || c === 'nicd';

/** Cautions of a bank of this chemistry, for a result that discharges or sizes it. */
export function bankCautions(chemistry: Chemistry): string[] {
  return [PLANNING_CAUTION, FUSE_CAUTION, ...(isLithium(chemistry) ? [LITHIUM_CAUTION] : []), ...(isVented(chemistry) ? [VENTED_CAUTION] : [])];
}

/** Cautions of a recharge of a bank of this chemistry. */
export function rechargeCautions(chemistry: Chemistry): string[] {
  return [PLANNING_CAUTION, CHARGE_VOLTAGE_CAUTION, ...(isLithium(chemistry) ? [LITHIUM_CAUTION] : []), ...(isVented(chemistry) ? [VENTED_CAUTION] : [])];
}
