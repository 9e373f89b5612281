/**
 * NEC Table 430.248: full-load current, single-phase alternating-current motors, used for conductor
 * and protection sizing instead of the nameplate current (NEC 430.6(A)(1)).
 *
 * Source: NFPA 70-2023, Table 430.248, every row confirmed cell by cell against a published
 * machine-read copy of the 2023 code; unchanged across recent editions (from memory). All rows of
 * the table are carried: ⅙ to 10 hp at 115, 200, 208 and 230 V.
 *
 * Units: `hp` rated output, horsepower (fractions as exact quotients: ⅙ = 1/6); currents in amperes;
 * keys are the table's voltage columns, V. The table's note (from memory): the listed voltages are
 * rated motor voltages; the currents apply to system voltage ranges of 110–120 and 220–240 V.
 */
import type { Provenance } from './conductor-materials.ts';

export type Nec430_248Voltage = 115 | 200 | 208 | 230;
export const NEC_430_248_VOLTAGES: readonly Nec430_248Voltage[] = [115, 200, 208, 230];

export interface Nec430_248Row {
  readonly hp: number;
  readonly amps: Readonly<Record<Nec430_248Voltage, number>>;
  readonly provenance: Provenance;
}

export const NEC_430_248: readonly Nec430_248Row[] = [
  { hp: 1 / 6, amps: { 115: 4.4, 200: 2.5, 208: 2.4, 230: 2.2 }, provenance: 'confirmed' },
  { hp: 1 / 4, amps: { 115: 5.8, 200: 3.3, 208: 3.2, 230: 2.9 }, provenance: 'confirmed' },
  { hp: 1 / 3, amps: { 115: 7.2, 200: 4.1, 208: 4, 230: 3.6 }, provenance: 'confirmed' },
  { hp: 0.5, amps: { 115: 9.8, 200: 5.6, 208: 5.4, 230: 4.9 }, provenance: 'confirmed' },
  { hp: 0.75, amps: { 115: 13.8, 200: 7.9, 208: 7.6, 230: 6.9 }, provenance: 'confirmed' },
  { hp: 1, amps: { 115: 16, 200: 9.2, 208: 8.8, 230: 8 }, provenance: 'confirmed' },
  { hp: 1.5, amps: { 115: 20, 200: 11.5, 208: 11, 230: 10 }, provenance: 'confirmed' },
  { hp: 2, amps: { 115: 24, 200: 13.8, 208: 13.2, 230: 12 }, provenance: 'confirmed' },
  { hp: 3, amps: { 115: 34, 200: 19.6, 208: 18.7, 230: 17 }, provenance: 'confirmed' },
  { hp: 5, amps: { 115: 56, 200: 32.2, 208: 30.8, 230: 28 }, provenance: 'confirmed' },
  { hp: 7.5, amps: { 115: 80, 200: 46, 208: 44, 230: 40 }, provenance: 'confirmed' },
  { hp: 10, amps: { 115: 100, 200: 57.5, 208: 55, 230: 50 }, provenance: 'confirmed' },
];
