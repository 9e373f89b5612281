/**
 * NEMA Premium efficiency: full-load nominal efficiency, 4-pole, 60 Hz, enclosed (TEFC).
 *
 * Source: NEMA MG 1, Table 12-12 (NEMA Premium), as published by Natural Resources Canada,
 * "Electric Motors (1 to 500 HP)" (2015), whose levels equal NEMA Premium; all rows below are
 * confirmed against that published table. Edition: the levels in force from 2016 (10 CFR 431.25
 * refers to them; the earlier EPAct-1992 levels are lower and are NOT these).
 *
 * Units: `hp` rated output, horsepower (1 hp = 745.7 W); `efficiency` in per cent.
 */
import type { Provenance } from './conductor-materials.ts';

export interface NemaRow {
  readonly hp: number;
  readonly efficiency: number;
  readonly provenance: Provenance;
}

/** Watts per horsepower (mechanical horsepower, 550 ft·lbf/s). */
export const WATTS_PER_HP = 745.7;

export const NEMA_PREMIUM_4P_60HZ_TEFC: readonly NemaRow[] = [
  { hp: 1, efficiency: 85.5, provenance: 'confirmed' },
  { hp: 1.5, efficiency: 86.5, provenance: 'confirmed' },
  { hp: 2, efficiency: 86.5, provenance: 'confirmed' },
  { hp: 3, efficiency: 89.5, provenance: 'confirmed' },
  { hp: 5, efficiency: 89.5, provenance: 'confirmed' },
  { hp: 7.5, efficiency: 91.7, provenance: 'confirmed' },
  { hp: 10, efficiency: 91.7, provenance: 'confirmed' },
  { hp: 15, efficiency: 92.4, provenance: 'confirmed' },
  { hp: 20, efficiency: 93.0, provenance: 'confirmed' },
  { hp: 25, efficiency: 93.6, provenance: 'confirmed' },
  { hp: 30, efficiency: 93.6, provenance: 'confirmed' },
  { hp: 40, efficiency: 94.1, provenance: 'confirmed' },
  { hp: 50, efficiency: 94.5, provenance: 'confirmed' },
  { hp: 60, efficiency: 95.0, provenance: 'confirmed' },
  { hp: 75, efficiency: 95.4, provenance: 'confirmed' },
  { hp: 100, efficiency: 95.4, provenance: 'confirmed' },
  { hp: 125, efficiency: 95.4, provenance: 'confirmed' },
  { hp: 150, efficiency: 95.8, provenance: 'confirmed' },
  { hp: 200, efficiency: 96.2, provenance: 'confirmed' },
];
