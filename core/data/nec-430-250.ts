/**
 * NEC Table 430.250: full-load current, three-phase alternating-current induction motors
 * (squirrel cage and wound rotor), used for conductor and protection sizing instead of the
 * nameplate current (NEC 430.6(A)(1)).
 *
 * Source: NFPA 70-2023, Table 430.250, every row below confirmed cell by cell against a published
 * machine-read copy of the 2023 code; the values are unchanged across recent editions (from memory).
 * Rows ½ to 200 hp are carried (the 200/208/230/460/575 V columns, and the 115 V column where the
 * table prints one: ½ to 2 hp). Not carried: the 250–500 hp rows (the table gives them at 460 and
 * 575 V only), the 2300 V column, and the synchronous unity-power-factor part of the table.
 *
 * Units: `hp` rated output, horsepower; currents in amperes; keys are the table's voltage columns, V.
 * The table's own notes (from memory): the values are for motors running at speeds usual for belted
 * motors and with normal torque characteristics; the listed voltages are rated motor voltages, the
 * currents apply to system voltage ranges of 110–120, 220–240, 440–480 and 550–600 V.
 */
import type { Provenance } from './conductor-materials.ts';

export type Nec430Voltage = 200 | 208 | 230 | 460 | 575;
export const NEC_430_250_VOLTAGES: readonly Nec430Voltage[] = [200, 208, 230, 460, 575];

export interface Nec430Row {
  readonly hp: number;
  /** Every row carries the five columns; the 115 V column only where the table prints it (½–2 hp). */
  readonly amps: Readonly<Record<Nec430Voltage, number>> & { readonly 115?: number };
  readonly provenance: Provenance;
}

export const NEC_430_250: readonly Nec430Row[] = [
  { hp: 0.5, amps: { 115: 4.4, 200: 2.5, 208: 2.4, 230: 2.2, 460: 1.1, 575: 0.9 }, provenance: 'confirmed' },
  { hp: 0.75, amps: { 115: 6.4, 200: 3.7, 208: 3.5, 230: 3.2, 460: 1.6, 575: 1.3 }, provenance: 'confirmed' },
  { hp: 1, amps: { 115: 8.4, 200: 4.8, 208: 4.6, 230: 4.2, 460: 2.1, 575: 1.7 }, provenance: 'confirmed' },
  { hp: 1.5, amps: { 115: 12, 200: 6.9, 208: 6.6, 230: 6, 460: 3, 575: 2.4 }, provenance: 'confirmed' },
  { hp: 2, amps: { 115: 13.6, 200: 7.8, 208: 7.5, 230: 6.8, 460: 3.4, 575: 2.7 }, provenance: 'confirmed' },
  { hp: 3, amps: { 200: 11, 208: 10.6, 230: 9.6, 460: 4.8, 575: 3.9 }, provenance: 'confirmed' },
  { hp: 5, amps: { 200: 17.5, 208: 16.7, 230: 15.2, 460: 7.6, 575: 6.1 }, provenance: 'confirmed' },
  { hp: 7.5, amps: { 200: 25.3, 208: 24.2, 230: 22, 460: 11, 575: 9 }, provenance: 'confirmed' },
  { hp: 10, amps: { 200: 32.2, 208: 30.8, 230: 28, 460: 14, 575: 11 }, provenance: 'confirmed' },
  { hp: 15, amps: { 200: 48.3, 208: 46.2, 230: 42, 460: 21, 575: 17 }, provenance: 'confirmed' },
  { hp: 20, amps: { 200: 62.1, 208: 59.4, 230: 54, 460: 27, 575: 22 }, provenance: 'confirmed' },
  { hp: 25, amps: { 200: 78.2, 208: 74.8, 230: 68, 460: 34, 575: 27 }, provenance: 'confirmed' },
  { hp: 30, amps: { 200: 92, 208: 88, 230: 80, 460: 40, 575: 32 }, provenance: 'confirmed' },
  { hp: 40, amps: { 200: 120, 208: 114, 230: 104, 460: 52, 575: 41 }, provenance: 'confirmed' },
  { hp: 50, amps: { 200: 150, 208: 143, 230: 130, 460: 65, 575: 52 }, provenance: 'confirmed' },
  { hp: 60, amps: { 200: 177, 208: 169, 230: 154, 460: 77, 575: 62 }, provenance: 'confirmed' },
  { hp: 75, amps: { 200: 221, 208: 211, 230: 192, 460: 96, 575: 77 }, provenance: 'confirmed' },
  { hp: 100, amps: { 200: 285, 208: 273, 230: 248, 460: 124, 575: 99 }, provenance: 'confirmed' },
  { hp: 125, amps: { 200: 359, 208: 343, 230: 312, 460: 156, 575: 125 }, provenance: 'confirmed' },
  { hp: 150, amps: { 200: 414, 208: 396, 230: 360, 460: 180, 575: 144 }, provenance: 'confirmed' },
  { hp: 200, amps: { 200: 552, 208: 528, 230: 480, 460: 240, 575: 192 }, provenance: 'confirmed' },
];
