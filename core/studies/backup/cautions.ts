/**
 * The cautions that go with every battery result (runtime, sizing, recharge), kept in one place
 * so that a report showing several results lists each caution once.
 */
import type { Chemistry } from '../../data/battery-chemistries.ts';

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

/**
 * A cut-off above the voltage the capacities are rated to. A lead-acid or NiCd cell delivers less
 * capacity to a higher end voltage (IEEE 485 reads its capacity rating factor Kt from the maker's
 * table for the chosen end voltage — from memory, IEEE 485-2010 clause 6.3); the presets' capacity
 * and Peukert exponent hold for their own end voltage only, so the figures cannot take that loss
 * into account. Lithium's usable window is set by the BMS, not by a rating end voltage: no caution.
 */
export function endVoltageCaution(chemistry: Chemistry, givenCellVoltage: number, ratedCellVoltage: number): string | null {
  if (isLithium(chemistry) || !(givenCellVoltage > ratedCellVoltage + 1e-9)) return null;
  return `The cut-off ${givenCellVoltage} V/cell is above the ${ratedCellVoltage} V/cell that the capacities here are rated to. A lead-acid or NiCd cell gives less capacity to a higher end voltage, and these figures do not count that loss: give the string capacity and Peukert exponent the maker rates to ${givenCellVoltage} V/cell, or size from the maker\u2019s table for that end voltage.`;
}

/** What the bank is designed for (BackupStudy.design). */
export type BankDesign = 'backup' | 'cycling';

/** User words for a value taken from a preset rather than the maker's data. */
export const TYPICAL_VALUE = 'typical value: use the maker\u2019s figure';

/**
 * Whether the usable depth of discharge ends the discharge and bounds the size: always for
 * lithium (the battery management system's window), for lead-acid and NiCd only in a cycling
 * design (a standby bank is discharged to its end voltage, IEEE 485 / IEEE 1115).
 */
export const depthOfDischargeApplies = (chemistry: Chemistry, design: BankDesign): boolean => isLithium(chemistry) || design === 'cycling';

/**
 * The one sentence that says where a discharge ends and what sized the bank, shared by the runtime
 * study and the sizing so the two never say different things. `endSource` and `dodSource` are
 * user words ("typical value: use the maker's figure" or "maker's figure, as given").
 */
export function designBasis(
  chemistry: Chemistry,
  design: BankDesign,
  endCellVoltage: number,
  endSource: string,
  dod: number,
  dodSource: string,
): string {
  const end = `${endCellVoltage} V/cell under load (${endSource})`;
  const pct = `${Math.round(dod * 100)} %`;
  if (isLithium(chemistry)) {
    return `The discharge ends at the usable depth of discharge, ${pct} (the battery management system\u2019s window; ${dodSource}), or at the end-of-discharge voltage ${end}, whichever comes first; the bank is sized for the usable share.`;
  }
  if (design === 'backup') {
    const std = chemistry === 'nicd' ? 'IEEE 1115' : 'IEEE 485';
    return `Backup design: the bank is discharged to its end-of-discharge voltage, ${end}, with no depth-of-discharge limit, and sized so (${std} standby sizing). For a bank that is cycled daily, choose the cycling design.`;
  }
  return `Cycling design: the discharge ends at the usable depth of discharge, ${pct} (${dodSource}), or at the end-of-discharge voltage ${end}, whichever comes first; the bank is sized for both.`;
}
