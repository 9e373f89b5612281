/**
 * Motor efficiency classes IE1–IE4: nominal full-load efficiency limits, 4-pole, 50 Hz.
 *
 * Source: IEC 60034-30-1:2014, Table 2 (IE1), Table 3 (IE2), Table 4 (IE3), Table 5 (IE4).
 * The IE1–IE3 values at 0.75–11 kW are confirmed against a published maker's copy of the table of
 * IEC 60034-30:2008, whose values were carried unchanged into 60034-30-1:2014; IE4 at 11 kW is
 * confirmed; IE2 at 15 kW is confirmed against a maker's published example; every other cell is
 * from memory (check against the printed standard before relying on it). IE1 is carried only
 * where it was confirmed (0.75–11 kW).
 * Only 4-pole 50 Hz rows are carried; the 60 Hz limits differ (IE3 at 60 Hz equals NEMA Premium,
 * from memory).
 *
 * Units: `kW` rated output, kW; efficiencies in per cent. `null` = not carried here.
 * Columns: rated output; IE1, IE2, IE3, IE4 limits; the provenance of each cell.
 */
import type { Provenance } from './conductor-materials.ts';

export type IeClass = 'IE1' | 'IE2' | 'IE3' | 'IE4';
export const IE_CLASSES: readonly IeClass[] = ['IE1', 'IE2', 'IE3', 'IE4'];

export interface IeRow {
  readonly kW: number;
  readonly efficiency: Readonly<Record<IeClass, number | null>>;
  readonly provenance: Readonly<Record<IeClass, Provenance | null>>;
}

const C: Provenance = 'confirmed';
const M: Provenance = 'from memory';

/** 4-pole, 50 Hz. Edition used: IEC 60034-30-1:2014. */
export const IEC_60034_30_1_4P_50HZ: readonly IeRow[] = [
  { kW: 0.75, efficiency: { IE1: 72.1, IE2: 79.6, IE3: 82.5, IE4: 85.7 }, provenance: { IE1: C, IE2: C, IE3: C, IE4: M } },
  { kW: 1.5, efficiency: { IE1: 77.2, IE2: 82.8, IE3: 85.3, IE4: 88.2 }, provenance: { IE1: C, IE2: C, IE3: C, IE4: M } },
  { kW: 4, efficiency: { IE1: 83.1, IE2: 86.6, IE3: 88.6, IE4: 91.1 }, provenance: { IE1: C, IE2: C, IE3: C, IE4: M } },
  { kW: 7.5, efficiency: { IE1: 86.0, IE2: 88.7, IE3: 90.4, IE4: 92.6 }, provenance: { IE1: C, IE2: C, IE3: C, IE4: M } },
  { kW: 11, efficiency: { IE1: 87.6, IE2: 89.8, IE3: 91.4, IE4: 93.3 }, provenance: { IE1: C, IE2: C, IE3: M, IE4: C } },
  { kW: 15, efficiency: { IE1: null, IE2: 90.6, IE3: 92.1, IE4: 93.9 }, provenance: { IE1: null, IE2: C, IE3: M, IE4: M } },
  { kW: 37, efficiency: { IE1: null, IE2: 92.7, IE3: 93.9, IE4: 95.2 }, provenance: { IE1: null, IE2: M, IE3: M, IE4: M } },
  { kW: 75, efficiency: { IE1: null, IE2: 94.0, IE3: 95.0, IE4: 96.0 }, provenance: { IE1: null, IE2: M, IE3: M, IE4: M } },
];
