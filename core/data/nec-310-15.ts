/**
 * NEC ambient-temperature correction and more-than-three-conductor adjustment.
 *
 * 1. Table 310.15(B)(1)(1): ambient temperature correction factors based on 30 °C (86 °F).
 *    Source: NFPA 70-2023 Table 310.15(B)(1)(1) (numbered 310.15(B)(1) in the 2020 edition, same
 *    values; confirmed against published copies of both editions). Do not mix with the 40 °C-based
 *    Table 310.15(B)(1)(2), which is a different table.
 *    Columns: `fromC` / `toC` is the ambient band in °C as printed (whole degrees; `fromC` is null
 *    for the open-ended first row "10 or less"); `fromF` / `toF` the printed °F band; `factor` the
 *    multiplier on the Table 310.16 ampacity for conductors rated 60 / 75 / 90 °C, `null` where the
 *    table leaves the cell empty (the ambient is at or above what the insulation can carry).
 *    Reading an ambient between two printed bands (e.g. 15.5 °C) with the next warmer band is
 *    common practice (no source): it is the conservative side.
 *    The factors equal NEC Equation 310.15(B)(1) (2023) / 310.15(B) (2020),
 *    I′ = I·√[(Tc − Ta′)/(Tc − 30)], evaluated at the warm end `toC` of each band and rounded to
 *    2 decimals (a computed cross-check, run in tests/data/nec-310-15.test.ts).
 *
 * 2. Table 310.15(C)(1): adjustment factors for more than three current-carrying conductors in a
 *    raceway or cable. Source: NFPA 70-2023 Table 310.15(C)(1) (confirmed; the 2014/2017 editions
 *    numbered it 310.15(B)(3)(a) with the same values; 2020 the same, from memory).
 *    Columns: `fromCount` / `toCount` the number of current-carrying conductors (`toCount` null for
 *    "41 and above"); `percent` the percent of the ampacity values in the ampacity tables, applied
 *    after the ambient correction. Table footnote (confirmed): the count includes spare conductors
 *    and excludes conductors that cannot be energized at the same time.
 *
 * Units: temperatures in °C (and °F as printed); factors dimensionless; percent in %.
 */
import type { Provenance } from './conductor-materials.ts';
import type { NecTempRating } from './nec-310-16.ts';

export interface NecAmbientRow {
  readonly fromC: number | null;
  readonly toC: number;
  readonly fromF: number | null;
  readonly toF: number;
  readonly factor: Readonly<Record<NecTempRating, number | null>>;
  readonly provenance: Provenance;
}

/** Base ambient of Table 310.16 and of the correction table, °C. */
export const NEC_AMBIENT_BASE_C = 30;

/** NFPA 70-2023 Table 310.15(B)(1)(1), coldest band first. */
export const NEC_310_15_B_1_1: readonly NecAmbientRow[] = [
  { fromC: null, toC: 10, fromF: null, toF: 50, factor: { 60: 1.29, 75: 1.2, 90: 1.15 }, provenance: 'confirmed' },
  { fromC: 11, toC: 15, fromF: 51, toF: 59, factor: { 60: 1.22, 75: 1.15, 90: 1.12 }, provenance: 'confirmed' },
  { fromC: 16, toC: 20, fromF: 60, toF: 68, factor: { 60: 1.15, 75: 1.11, 90: 1.08 }, provenance: 'confirmed' },
  { fromC: 21, toC: 25, fromF: 69, toF: 77, factor: { 60: 1.08, 75: 1.05, 90: 1.04 }, provenance: 'confirmed' },
  { fromC: 26, toC: 30, fromF: 78, toF: 86, factor: { 60: 1.0, 75: 1.0, 90: 1.0 }, provenance: 'confirmed' },
  { fromC: 31, toC: 35, fromF: 87, toF: 95, factor: { 60: 0.91, 75: 0.94, 90: 0.96 }, provenance: 'confirmed' },
  { fromC: 36, toC: 40, fromF: 96, toF: 104, factor: { 60: 0.82, 75: 0.88, 90: 0.91 }, provenance: 'confirmed' },
  { fromC: 41, toC: 45, fromF: 105, toF: 113, factor: { 60: 0.71, 75: 0.82, 90: 0.87 }, provenance: 'confirmed' },
  { fromC: 46, toC: 50, fromF: 114, toF: 122, factor: { 60: 0.58, 75: 0.75, 90: 0.82 }, provenance: 'confirmed' },
  { fromC: 51, toC: 55, fromF: 123, toF: 131, factor: { 60: 0.41, 75: 0.67, 90: 0.76 }, provenance: 'confirmed' },
  { fromC: 56, toC: 60, fromF: 132, toF: 140, factor: { 60: null, 75: 0.58, 90: 0.71 }, provenance: 'confirmed' },
  { fromC: 61, toC: 65, fromF: 141, toF: 149, factor: { 60: null, 75: 0.47, 90: 0.65 }, provenance: 'confirmed' },
  { fromC: 66, toC: 70, fromF: 150, toF: 158, factor: { 60: null, 75: 0.33, 90: 0.58 }, provenance: 'confirmed' },
  { fromC: 71, toC: 75, fromF: 159, toF: 167, factor: { 60: null, 75: null, 90: 0.5 }, provenance: 'confirmed' },
  { fromC: 76, toC: 80, fromF: 168, toF: 176, factor: { 60: null, 75: null, 90: 0.41 }, provenance: 'confirmed' },
  { fromC: 81, toC: 85, fromF: 177, toF: 185, factor: { 60: null, 75: null, 90: 0.29 }, provenance: 'confirmed' },
];

export interface NecConductorCountRow {
  readonly fromCount: number;
  readonly toCount: number | null;
  readonly percent: number;
  readonly provenance: Provenance;
}

/** NFPA 70-2023 Table 310.15(C)(1), fewest conductors first (1–3 conductors need no adjustment). */
export const NEC_310_15_C_1: readonly NecConductorCountRow[] = [
  { fromCount: 4, toCount: 6, percent: 80, provenance: 'confirmed' },
  { fromCount: 7, toCount: 9, percent: 70, provenance: 'confirmed' },
  { fromCount: 10, toCount: 20, percent: 50, provenance: 'confirmed' },
  { fromCount: 21, toCount: 30, percent: 45, provenance: 'confirmed' },
  { fromCount: 31, toCount: 40, percent: 40, provenance: 'confirmed' },
  { fromCount: 41, toCount: null, percent: 35, provenance: 'confirmed' },
];
