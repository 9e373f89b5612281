/**
 * NEC Table 430.250: full-load current, three-phase alternating-current induction motors
 * (squirrel cage and wound rotor), used for conductor and protection sizing instead of the
 * nameplate current (NEC 430.6(A)(1), from memory).
 *
 * Source: NFPA 70-2023, Table 430.250, confirmed against a published copy of the 2023 code;
 * the values are unchanged across recent editions (from memory). Only these horsepower rows are
 * carried so far. Synchronous unity-power-factor motors use another part of the table (not
 * carried).
 *
 * Units: `hp` rated output, horsepower; currents in amperes; keys are the table's voltage columns, V.
 */
import type { Provenance } from './conductor-materials.ts';

export type Nec430Voltage = 200 | 208 | 230 | 460 | 575;
export const NEC_430_250_VOLTAGES: readonly Nec430Voltage[] = [200, 208, 230, 460, 575];

export interface Nec430Row {
  readonly hp: number;
  readonly amps: Readonly<Record<Nec430Voltage, number>>;
  readonly provenance: Provenance;
}

export const NEC_430_250: readonly Nec430Row[] = [
  { hp: 1, amps: { 200: 4.8, 208: 4.6, 230: 4.2, 460: 2.1, 575: 1.7 }, provenance: 'confirmed' },
  { hp: 5, amps: { 200: 17.5, 208: 16.7, 230: 15.2, 460: 7.6, 575: 6.1 }, provenance: 'confirmed' },
  { hp: 10, amps: { 200: 32.2, 208: 30.8, 230: 28, 460: 14, 575: 11 }, provenance: 'confirmed' },
  { hp: 25, amps: { 200: 78.2, 208: 74.8, 230: 68, 460: 34, 575: 27 }, provenance: 'confirmed' },
  { hp: 50, amps: { 200: 150, 208: 143, 230: 130, 460: 65, 575: 52 }, provenance: 'confirmed' },
];
