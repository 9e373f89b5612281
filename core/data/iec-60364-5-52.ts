/**
 * IEC 60364-5-52:2009, Low-voltage electrical installations — Selection and erection of electrical
 * equipment — Wiring systems: current-carrying capacities (Annex B), their ambient-temperature and
 * grouping correction factors, and the voltage-drop limits and formula of Annex G.
 *
 * One file over 400 lines on purpose: it carries one published set, the standard's Annex B capacity
 * tables with the correction factors that apply to them (and Annex G), which the sizing reads
 * together and tests/data checks against the publication together; split, one table's method
 * columns and its correction factors would sit in different files.
 *
 * ── Current-carrying capacities (Annex B), copper, ambient air 30 °C ──
 * Tables: B.52.2 (PVC, 2 loaded conductors), B.52.3 (XLPE/EPR, 2 loaded), B.52.4 (PVC, 3 loaded),
 * B.52.5 (XLPE/EPR, 3 loaded) for methods B1, B2, C; B.52.10 (PVC) and B.52.12 (XLPE/EPR) for
 * method E (multicore cable in free air). PVC: conductor temperature 70 °C; XLPE/EPR: 90 °C.
 * Reference methods carried here (IEC 60364-5-52 Table B.52.1 describes them):
 * - B1: single-core (insulated) conductors in conduit on a wooden or masonry wall;
 * - B2: multicore cable in conduit on a wooden or masonry wall;
 * - C: single- or multicore cable clipped direct on a wooden or masonry wall;
 * - E: multicore cable in free air or on a perforated tray.
 * Methods A1, A2, D1, D2, F and G, and aluminium conductors, are not carried yet: no value from a
 * checked copy was at hand. A combination that is not carried has no row (never a zero).
 * Units: `sizeMm2` nominal area in mm²; `amps` current-carrying capacity in A.
 * Provenance per row (cell):
 * - PVC B1: confirmed (BS 7671 Table 4D1A reference method B, which takes its values from IEC);
 *   PVC B2 3 loaded to 120 mm², B2 2 loaded and C 2 loaded to 16 mm², C 3 loaded to 35 mm²:
 *   confirmed against published copies; the rest corroborated.
 * - PVC E: corroborated, except 70 and 120 mm² with 3 loaded conductors (196 / 276 A): from memory,
 *   one published copy shows 198 / 278.
 * - XLPE B1: confirmed (BS 7671 Table 4E1A method B, two copies); XLPE B2, C, E: corroborated (they
 *   agree with a published copy of NBR 5410 Tabela 37, an adoption of IEC 60364-5-52); XLPE B2 with
 *   2 loaded conductors at 150/185/240 mm²: from memory (NBR 5410 prints 349/395/462 there).
 * Trap: BS 7671 single-core method C columns differ from IEC method C (BS 20 A vs IEC 19.5 A at
 * 1.5 mm² PVC, 2 loaded); these rows are the IEC ones.
 */
import type { ConductorMaterial, Provenance } from './conductor-materials.ts';

export type IecMethod = 'B1' | 'B2' | 'C' | 'E';
export type IecInsulation = 'PVC' | 'XLPE';
export type IecCapacityTable = 'B.52.2' | 'B.52.3' | 'B.52.4' | 'B.52.5' | 'B.52.10' | 'B.52.12';

/** Maximum conductor temperature in normal operation, °C: PVC 70, XLPE/EPR 90. */
export const IEC_INSULATION_MAX_C: Readonly<Record<IecInsulation, number>> = { PVC: 70, XLPE: 90 };

/** Ambient air temperature the Annex B capacities are based on, °C. */
export const IEC_CAPACITY_AMBIENT_C = 30;

export interface IecCapacityRow {
  readonly table: IecCapacityTable;
  readonly insulation: IecInsulation;
  readonly method: IecMethod;
  readonly loadedConductors: 2 | 3;
  readonly material: ConductorMaterial;
  readonly sizeMm2: number;
  readonly amps: number;
  readonly provenance: Provenance;
}

/** IEC 60364-5-52:2009 Annex B capacities, one row per printed cell; grouped by column. */
export const IEC_60364_5_52_CAPACITIES: readonly IecCapacityRow[] = [
  // Table B.52.2: PVC (70 °C), method B1, 2 loaded conductors, copper.
  { table: 'B.52.2', insulation: 'PVC', method: 'B1', loadedConductors: 2, material: 'Cu', sizeMm2: 1.5, amps: 17.5, provenance: 'confirmed' },
  { table: 'B.52.2', insulation: 'PVC', method: 'B1', loadedConductors: 2, material: 'Cu', sizeMm2: 2.5, amps: 24, provenance: 'confirmed' },
  { table: 'B.52.2', insulation: 'PVC', method: 'B1', loadedConductors: 2, material: 'Cu', sizeMm2: 4, amps: 32, provenance: 'confirmed' },
  { table: 'B.52.2', insulation: 'PVC', method: 'B1', loadedConductors: 2, material: 'Cu', sizeMm2: 6, amps: 41, provenance: 'confirmed' },
  { table: 'B.52.2', insulation: 'PVC', method: 'B1', loadedConductors: 2, material: 'Cu', sizeMm2: 10, amps: 57, provenance: 'confirmed' },
  { table: 'B.52.2', insulation: 'PVC', method: 'B1', loadedConductors: 2, material: 'Cu', sizeMm2: 16, amps: 76, provenance: 'confirmed' },
  { table: 'B.52.2', insulation: 'PVC', method: 'B1', loadedConductors: 2, material: 'Cu', sizeMm2: 25, amps: 101, provenance: 'confirmed' },
  { table: 'B.52.2', insulation: 'PVC', method: 'B1', loadedConductors: 2, material: 'Cu', sizeMm2: 35, amps: 125, provenance: 'confirmed' },
  { table: 'B.52.2', insulation: 'PVC', method: 'B1', loadedConductors: 2, material: 'Cu', sizeMm2: 50, amps: 151, provenance: 'confirmed' },
  { table: 'B.52.2', insulation: 'PVC', method: 'B1', loadedConductors: 2, material: 'Cu', sizeMm2: 70, amps: 192, provenance: 'confirmed' },
  { table: 'B.52.2', insulation: 'PVC', method: 'B1', loadedConductors: 2, material: 'Cu', sizeMm2: 95, amps: 232, provenance: 'confirmed' },
  { table: 'B.52.2', insulation: 'PVC', method: 'B1', loadedConductors: 2, material: 'Cu', sizeMm2: 120, amps: 269, provenance: 'confirmed' },
  { table: 'B.52.2', insulation: 'PVC', method: 'B1', loadedConductors: 2, material: 'Cu', sizeMm2: 150, amps: 300, provenance: 'confirmed' },
  { table: 'B.52.2', insulation: 'PVC', method: 'B1', loadedConductors: 2, material: 'Cu', sizeMm2: 185, amps: 341, provenance: 'confirmed' },
  { table: 'B.52.2', insulation: 'PVC', method: 'B1', loadedConductors: 2, material: 'Cu', sizeMm2: 240, amps: 400, provenance: 'confirmed' },
  // Table B.52.4: PVC (70 °C), method B1, 3 loaded conductors, copper.
  { table: 'B.52.4', insulation: 'PVC', method: 'B1', loadedConductors: 3, material: 'Cu', sizeMm2: 1.5, amps: 15.5, provenance: 'confirmed' },
  { table: 'B.52.4', insulation: 'PVC', method: 'B1', loadedConductors: 3, material: 'Cu', sizeMm2: 2.5, amps: 21, provenance: 'confirmed' },
  { table: 'B.52.4', insulation: 'PVC', method: 'B1', loadedConductors: 3, material: 'Cu', sizeMm2: 4, amps: 28, provenance: 'confirmed' },
  { table: 'B.52.4', insulation: 'PVC', method: 'B1', loadedConductors: 3, material: 'Cu', sizeMm2: 6, amps: 36, provenance: 'confirmed' },
  { table: 'B.52.4', insulation: 'PVC', method: 'B1', loadedConductors: 3, material: 'Cu', sizeMm2: 10, amps: 50, provenance: 'confirmed' },
  { table: 'B.52.4', insulation: 'PVC', method: 'B1', loadedConductors: 3, material: 'Cu', sizeMm2: 16, amps: 68, provenance: 'confirmed' },
  { table: 'B.52.4', insulation: 'PVC', method: 'B1', loadedConductors: 3, material: 'Cu', sizeMm2: 25, amps: 89, provenance: 'confirmed' },
  { table: 'B.52.4', insulation: 'PVC', method: 'B1', loadedConductors: 3, material: 'Cu', sizeMm2: 35, amps: 110, provenance: 'confirmed' },
  { table: 'B.52.4', insulation: 'PVC', method: 'B1', loadedConductors: 3, material: 'Cu', sizeMm2: 50, amps: 134, provenance: 'confirmed' },
  { table: 'B.52.4', insulation: 'PVC', method: 'B1', loadedConductors: 3, material: 'Cu', sizeMm2: 70, amps: 171, provenance: 'confirmed' },
  { table: 'B.52.4', insulation: 'PVC', method: 'B1', loadedConductors: 3, material: 'Cu', sizeMm2: 95, amps: 207, provenance: 'confirmed' },
  { table: 'B.52.4', insulation: 'PVC', method: 'B1', loadedConductors: 3, material: 'Cu', sizeMm2: 120, amps: 239, provenance: 'confirmed' },
  { table: 'B.52.4', insulation: 'PVC', method: 'B1', loadedConductors: 3, material: 'Cu', sizeMm2: 150, amps: 262, provenance: 'confirmed' },
  { table: 'B.52.4', insulation: 'PVC', method: 'B1', loadedConductors: 3, material: 'Cu', sizeMm2: 185, amps: 296, provenance: 'confirmed' },
  { table: 'B.52.4', insulation: 'PVC', method: 'B1', loadedConductors: 3, material: 'Cu', sizeMm2: 240, amps: 346, provenance: 'confirmed' },
  // Table B.52.2: PVC (70 °C), method B2, 2 loaded conductors, copper.
  { table: 'B.52.2', insulation: 'PVC', method: 'B2', loadedConductors: 2, material: 'Cu', sizeMm2: 1.5, amps: 16.5, provenance: 'confirmed' },
  { table: 'B.52.2', insulation: 'PVC', method: 'B2', loadedConductors: 2, material: 'Cu', sizeMm2: 2.5, amps: 23, provenance: 'confirmed' },
  { table: 'B.52.2', insulation: 'PVC', method: 'B2', loadedConductors: 2, material: 'Cu', sizeMm2: 4, amps: 30, provenance: 'confirmed' },
  { table: 'B.52.2', insulation: 'PVC', method: 'B2', loadedConductors: 2, material: 'Cu', sizeMm2: 6, amps: 38, provenance: 'confirmed' },
  { table: 'B.52.2', insulation: 'PVC', method: 'B2', loadedConductors: 2, material: 'Cu', sizeMm2: 10, amps: 52, provenance: 'confirmed' },
  { table: 'B.52.2', insulation: 'PVC', method: 'B2', loadedConductors: 2, material: 'Cu', sizeMm2: 16, amps: 69, provenance: 'confirmed' },
  { table: 'B.52.2', insulation: 'PVC', method: 'B2', loadedConductors: 2, material: 'Cu', sizeMm2: 25, amps: 90, provenance: 'corroborated' },
  { table: 'B.52.2', insulation: 'PVC', method: 'B2', loadedConductors: 2, material: 'Cu', sizeMm2: 35, amps: 111, provenance: 'corroborated' },
  { table: 'B.52.2', insulation: 'PVC', method: 'B2', loadedConductors: 2, material: 'Cu', sizeMm2: 50, amps: 133, provenance: 'corroborated' },
  { table: 'B.52.2', insulation: 'PVC', method: 'B2', loadedConductors: 2, material: 'Cu', sizeMm2: 70, amps: 168, provenance: 'corroborated' },
  { table: 'B.52.2', insulation: 'PVC', method: 'B2', loadedConductors: 2, material: 'Cu', sizeMm2: 95, amps: 201, provenance: 'corroborated' },
  { table: 'B.52.2', insulation: 'PVC', method: 'B2', loadedConductors: 2, material: 'Cu', sizeMm2: 120, amps: 232, provenance: 'corroborated' },
  { table: 'B.52.2', insulation: 'PVC', method: 'B2', loadedConductors: 2, material: 'Cu', sizeMm2: 150, amps: 258, provenance: 'corroborated' },
  { table: 'B.52.2', insulation: 'PVC', method: 'B2', loadedConductors: 2, material: 'Cu', sizeMm2: 185, amps: 294, provenance: 'corroborated' },
  { table: 'B.52.2', insulation: 'PVC', method: 'B2', loadedConductors: 2, material: 'Cu', sizeMm2: 240, amps: 344, provenance: 'corroborated' },
  // Table B.52.4: PVC (70 °C), method B2, 3 loaded conductors, copper.
  { table: 'B.52.4', insulation: 'PVC', method: 'B2', loadedConductors: 3, material: 'Cu', sizeMm2: 1.5, amps: 15, provenance: 'confirmed' },
  { table: 'B.52.4', insulation: 'PVC', method: 'B2', loadedConductors: 3, material: 'Cu', sizeMm2: 2.5, amps: 20, provenance: 'confirmed' },
  { table: 'B.52.4', insulation: 'PVC', method: 'B2', loadedConductors: 3, material: 'Cu', sizeMm2: 4, amps: 27, provenance: 'confirmed' },
  { table: 'B.52.4', insulation: 'PVC', method: 'B2', loadedConductors: 3, material: 'Cu', sizeMm2: 6, amps: 34, provenance: 'confirmed' },
  { table: 'B.52.4', insulation: 'PVC', method: 'B2', loadedConductors: 3, material: 'Cu', sizeMm2: 10, amps: 46, provenance: 'confirmed' },
  { table: 'B.52.4', insulation: 'PVC', method: 'B2', loadedConductors: 3, material: 'Cu', sizeMm2: 16, amps: 62, provenance: 'confirmed' },
  { table: 'B.52.4', insulation: 'PVC', method: 'B2', loadedConductors: 3, material: 'Cu', sizeMm2: 25, amps: 80, provenance: 'confirmed' },
  { table: 'B.52.4', insulation: 'PVC', method: 'B2', loadedConductors: 3, material: 'Cu', sizeMm2: 35, amps: 99, provenance: 'confirmed' },
  { table: 'B.52.4', insulation: 'PVC', method: 'B2', loadedConductors: 3, material: 'Cu', sizeMm2: 50, amps: 118, provenance: 'confirmed' },
  { table: 'B.52.4', insulation: 'PVC', method: 'B2', loadedConductors: 3, material: 'Cu', sizeMm2: 70, amps: 149, provenance: 'confirmed' },
  { table: 'B.52.4', insulation: 'PVC', method: 'B2', loadedConductors: 3, material: 'Cu', sizeMm2: 95, amps: 179, provenance: 'confirmed' },
  { table: 'B.52.4', insulation: 'PVC', method: 'B2', loadedConductors: 3, material: 'Cu', sizeMm2: 120, amps: 206, provenance: 'confirmed' },
  { table: 'B.52.4', insulation: 'PVC', method: 'B2', loadedConductors: 3, material: 'Cu', sizeMm2: 150, amps: 225, provenance: 'corroborated' },
  { table: 'B.52.4', insulation: 'PVC', method: 'B2', loadedConductors: 3, material: 'Cu', sizeMm2: 185, amps: 255, provenance: 'corroborated' },
  { table: 'B.52.4', insulation: 'PVC', method: 'B2', loadedConductors: 3, material: 'Cu', sizeMm2: 240, amps: 297, provenance: 'corroborated' },
  // Table B.52.2: PVC (70 °C), method C, 2 loaded conductors, copper.
  { table: 'B.52.2', insulation: 'PVC', method: 'C', loadedConductors: 2, material: 'Cu', sizeMm2: 1.5, amps: 19.5, provenance: 'confirmed' },
  { table: 'B.52.2', insulation: 'PVC', method: 'C', loadedConductors: 2, material: 'Cu', sizeMm2: 2.5, amps: 27, provenance: 'confirmed' },
  { table: 'B.52.2', insulation: 'PVC', method: 'C', loadedConductors: 2, material: 'Cu', sizeMm2: 4, amps: 36, provenance: 'confirmed' },
  { table: 'B.52.2', insulation: 'PVC', method: 'C', loadedConductors: 2, material: 'Cu', sizeMm2: 6, amps: 46, provenance: 'confirmed' },
  { table: 'B.52.2', insulation: 'PVC', method: 'C', loadedConductors: 2, material: 'Cu', sizeMm2: 10, amps: 63, provenance: 'confirmed' },
  { table: 'B.52.2', insulation: 'PVC', method: 'C', loadedConductors: 2, material: 'Cu', sizeMm2: 16, amps: 85, provenance: 'confirmed' },
  { table: 'B.52.2', insulation: 'PVC', method: 'C', loadedConductors: 2, material: 'Cu', sizeMm2: 25, amps: 112, provenance: 'corroborated' },
  { table: 'B.52.2', insulation: 'PVC', method: 'C', loadedConductors: 2, material: 'Cu', sizeMm2: 35, amps: 138, provenance: 'corroborated' },
  { table: 'B.52.2', insulation: 'PVC', method: 'C', loadedConductors: 2, material: 'Cu', sizeMm2: 50, amps: 168, provenance: 'corroborated' },
  { table: 'B.52.2', insulation: 'PVC', method: 'C', loadedConductors: 2, material: 'Cu', sizeMm2: 70, amps: 213, provenance: 'corroborated' },
  { table: 'B.52.2', insulation: 'PVC', method: 'C', loadedConductors: 2, material: 'Cu', sizeMm2: 95, amps: 258, provenance: 'corroborated' },
  { table: 'B.52.2', insulation: 'PVC', method: 'C', loadedConductors: 2, material: 'Cu', sizeMm2: 120, amps: 299, provenance: 'corroborated' },
  { table: 'B.52.2', insulation: 'PVC', method: 'C', loadedConductors: 2, material: 'Cu', sizeMm2: 150, amps: 344, provenance: 'corroborated' },
  { table: 'B.52.2', insulation: 'PVC', method: 'C', loadedConductors: 2, material: 'Cu', sizeMm2: 185, amps: 392, provenance: 'corroborated' },
  { table: 'B.52.2', insulation: 'PVC', method: 'C', loadedConductors: 2, material: 'Cu', sizeMm2: 240, amps: 461, provenance: 'corroborated' },
  // Table B.52.4: PVC (70 °C), method C, 3 loaded conductors, copper.
  { table: 'B.52.4', insulation: 'PVC', method: 'C', loadedConductors: 3, material: 'Cu', sizeMm2: 1.5, amps: 17.5, provenance: 'confirmed' },
  { table: 'B.52.4', insulation: 'PVC', method: 'C', loadedConductors: 3, material: 'Cu', sizeMm2: 2.5, amps: 24, provenance: 'confirmed' },
  { table: 'B.52.4', insulation: 'PVC', method: 'C', loadedConductors: 3, material: 'Cu', sizeMm2: 4, amps: 32, provenance: 'confirmed' },
  { table: 'B.52.4', insulation: 'PVC', method: 'C', loadedConductors: 3, material: 'Cu', sizeMm2: 6, amps: 41, provenance: 'confirmed' },
  { table: 'B.52.4', insulation: 'PVC', method: 'C', loadedConductors: 3, material: 'Cu', sizeMm2: 10, amps: 57, provenance: 'confirmed' },
  { table: 'B.52.4', insulation: 'PVC', method: 'C', loadedConductors: 3, material: 'Cu', sizeMm2: 16, amps: 76, provenance: 'confirmed' },
  { table: 'B.52.4', insulation: 'PVC', method: 'C', loadedConductors: 3, material: 'Cu', sizeMm2: 25, amps: 96, provenance: 'confirmed' },
  { table: 'B.52.4', insulation: 'PVC', method: 'C', loadedConductors: 3, material: 'Cu', sizeMm2: 35, amps: 119, provenance: 'confirmed' },
  { table: 'B.52.4', insulation: 'PVC', method: 'C', loadedConductors: 3, material: 'Cu', sizeMm2: 50, amps: 144, provenance: 'corroborated' },
  { table: 'B.52.4', insulation: 'PVC', method: 'C', loadedConductors: 3, material: 'Cu', sizeMm2: 70, amps: 184, provenance: 'corroborated' },
  { table: 'B.52.4', insulation: 'PVC', method: 'C', loadedConductors: 3, material: 'Cu', sizeMm2: 95, amps: 223, provenance: 'corroborated' },
  { table: 'B.52.4', insulation: 'PVC', method: 'C', loadedConductors: 3, material: 'Cu', sizeMm2: 120, amps: 259, provenance: 'corroborated' },
  { table: 'B.52.4', insulation: 'PVC', method: 'C', loadedConductors: 3, material: 'Cu', sizeMm2: 150, amps: 299, provenance: 'corroborated' },
  { table: 'B.52.4', insulation: 'PVC', method: 'C', loadedConductors: 3, material: 'Cu', sizeMm2: 185, amps: 341, provenance: 'corroborated' },
  { table: 'B.52.4', insulation: 'PVC', method: 'C', loadedConductors: 3, material: 'Cu', sizeMm2: 240, amps: 403, provenance: 'corroborated' },
  // Table B.52.10: PVC (70 °C), method E, 2 loaded conductors, copper.
  { table: 'B.52.10', insulation: 'PVC', method: 'E', loadedConductors: 2, material: 'Cu', sizeMm2: 1.5, amps: 22, provenance: 'corroborated' },
  { table: 'B.52.10', insulation: 'PVC', method: 'E', loadedConductors: 2, material: 'Cu', sizeMm2: 2.5, amps: 30, provenance: 'corroborated' },
  { table: 'B.52.10', insulation: 'PVC', method: 'E', loadedConductors: 2, material: 'Cu', sizeMm2: 4, amps: 40, provenance: 'corroborated' },
  { table: 'B.52.10', insulation: 'PVC', method: 'E', loadedConductors: 2, material: 'Cu', sizeMm2: 6, amps: 51, provenance: 'corroborated' },
  { table: 'B.52.10', insulation: 'PVC', method: 'E', loadedConductors: 2, material: 'Cu', sizeMm2: 10, amps: 70, provenance: 'corroborated' },
  { table: 'B.52.10', insulation: 'PVC', method: 'E', loadedConductors: 2, material: 'Cu', sizeMm2: 16, amps: 94, provenance: 'corroborated' },
  { table: 'B.52.10', insulation: 'PVC', method: 'E', loadedConductors: 2, material: 'Cu', sizeMm2: 25, amps: 119, provenance: 'corroborated' },
  { table: 'B.52.10', insulation: 'PVC', method: 'E', loadedConductors: 2, material: 'Cu', sizeMm2: 35, amps: 148, provenance: 'corroborated' },
  { table: 'B.52.10', insulation: 'PVC', method: 'E', loadedConductors: 2, material: 'Cu', sizeMm2: 50, amps: 180, provenance: 'corroborated' },
  { table: 'B.52.10', insulation: 'PVC', method: 'E', loadedConductors: 2, material: 'Cu', sizeMm2: 70, amps: 232, provenance: 'corroborated' },
  { table: 'B.52.10', insulation: 'PVC', method: 'E', loadedConductors: 2, material: 'Cu', sizeMm2: 95, amps: 282, provenance: 'corroborated' },
  { table: 'B.52.10', insulation: 'PVC', method: 'E', loadedConductors: 2, material: 'Cu', sizeMm2: 120, amps: 328, provenance: 'corroborated' },
  { table: 'B.52.10', insulation: 'PVC', method: 'E', loadedConductors: 2, material: 'Cu', sizeMm2: 150, amps: 379, provenance: 'corroborated' },
  { table: 'B.52.10', insulation: 'PVC', method: 'E', loadedConductors: 2, material: 'Cu', sizeMm2: 185, amps: 434, provenance: 'corroborated' },
  { table: 'B.52.10', insulation: 'PVC', method: 'E', loadedConductors: 2, material: 'Cu', sizeMm2: 240, amps: 514, provenance: 'corroborated' },
  // Table B.52.10: PVC (70 °C), method E, 3 loaded conductors, copper.
  { table: 'B.52.10', insulation: 'PVC', method: 'E', loadedConductors: 3, material: 'Cu', sizeMm2: 1.5, amps: 18.5, provenance: 'corroborated' },
  { table: 'B.52.10', insulation: 'PVC', method: 'E', loadedConductors: 3, material: 'Cu', sizeMm2: 2.5, amps: 25, provenance: 'corroborated' },
  { table: 'B.52.10', insulation: 'PVC', method: 'E', loadedConductors: 3, material: 'Cu', sizeMm2: 4, amps: 34, provenance: 'corroborated' },
  { table: 'B.52.10', insulation: 'PVC', method: 'E', loadedConductors: 3, material: 'Cu', sizeMm2: 6, amps: 43, provenance: 'corroborated' },
  { table: 'B.52.10', insulation: 'PVC', method: 'E', loadedConductors: 3, material: 'Cu', sizeMm2: 10, amps: 60, provenance: 'corroborated' },
  { table: 'B.52.10', insulation: 'PVC', method: 'E', loadedConductors: 3, material: 'Cu', sizeMm2: 16, amps: 80, provenance: 'corroborated' },
  { table: 'B.52.10', insulation: 'PVC', method: 'E', loadedConductors: 3, material: 'Cu', sizeMm2: 25, amps: 101, provenance: 'corroborated' },
  { table: 'B.52.10', insulation: 'PVC', method: 'E', loadedConductors: 3, material: 'Cu', sizeMm2: 35, amps: 126, provenance: 'corroborated' },
  { table: 'B.52.10', insulation: 'PVC', method: 'E', loadedConductors: 3, material: 'Cu', sizeMm2: 50, amps: 153, provenance: 'corroborated' },
  { table: 'B.52.10', insulation: 'PVC', method: 'E', loadedConductors: 3, material: 'Cu', sizeMm2: 70, amps: 196, provenance: 'from memory' }, // one published copy shows 198; check against the printed standard
  { table: 'B.52.10', insulation: 'PVC', method: 'E', loadedConductors: 3, material: 'Cu', sizeMm2: 95, amps: 238, provenance: 'corroborated' },
  { table: 'B.52.10', insulation: 'PVC', method: 'E', loadedConductors: 3, material: 'Cu', sizeMm2: 120, amps: 276, provenance: 'from memory' }, // one published copy shows 278; check against the printed standard
  { table: 'B.52.10', insulation: 'PVC', method: 'E', loadedConductors: 3, material: 'Cu', sizeMm2: 150, amps: 319, provenance: 'corroborated' },
  { table: 'B.52.10', insulation: 'PVC', method: 'E', loadedConductors: 3, material: 'Cu', sizeMm2: 185, amps: 364, provenance: 'corroborated' },
  { table: 'B.52.10', insulation: 'PVC', method: 'E', loadedConductors: 3, material: 'Cu', sizeMm2: 240, amps: 430, provenance: 'corroborated' },
  // Table B.52.3: XLPE (90 °C), method B1, 2 loaded conductors, copper.
  { table: 'B.52.3', insulation: 'XLPE', method: 'B1', loadedConductors: 2, material: 'Cu', sizeMm2: 1.5, amps: 23, provenance: 'confirmed' },
  { table: 'B.52.3', insulation: 'XLPE', method: 'B1', loadedConductors: 2, material: 'Cu', sizeMm2: 2.5, amps: 31, provenance: 'confirmed' },
  { table: 'B.52.3', insulation: 'XLPE', method: 'B1', loadedConductors: 2, material: 'Cu', sizeMm2: 4, amps: 42, provenance: 'confirmed' },
  { table: 'B.52.3', insulation: 'XLPE', method: 'B1', loadedConductors: 2, material: 'Cu', sizeMm2: 6, amps: 54, provenance: 'confirmed' },
  { table: 'B.52.3', insulation: 'XLPE', method: 'B1', loadedConductors: 2, material: 'Cu', sizeMm2: 10, amps: 75, provenance: 'confirmed' },
  { table: 'B.52.3', insulation: 'XLPE', method: 'B1', loadedConductors: 2, material: 'Cu', sizeMm2: 16, amps: 100, provenance: 'confirmed' },
  { table: 'B.52.3', insulation: 'XLPE', method: 'B1', loadedConductors: 2, material: 'Cu', sizeMm2: 25, amps: 133, provenance: 'confirmed' },
  { table: 'B.52.3', insulation: 'XLPE', method: 'B1', loadedConductors: 2, material: 'Cu', sizeMm2: 35, amps: 164, provenance: 'confirmed' },
  { table: 'B.52.3', insulation: 'XLPE', method: 'B1', loadedConductors: 2, material: 'Cu', sizeMm2: 50, amps: 198, provenance: 'confirmed' },
  { table: 'B.52.3', insulation: 'XLPE', method: 'B1', loadedConductors: 2, material: 'Cu', sizeMm2: 70, amps: 253, provenance: 'confirmed' },
  { table: 'B.52.3', insulation: 'XLPE', method: 'B1', loadedConductors: 2, material: 'Cu', sizeMm2: 95, amps: 306, provenance: 'confirmed' },
  { table: 'B.52.3', insulation: 'XLPE', method: 'B1', loadedConductors: 2, material: 'Cu', sizeMm2: 120, amps: 354, provenance: 'confirmed' },
  { table: 'B.52.3', insulation: 'XLPE', method: 'B1', loadedConductors: 2, material: 'Cu', sizeMm2: 150, amps: 393, provenance: 'confirmed' },
  { table: 'B.52.3', insulation: 'XLPE', method: 'B1', loadedConductors: 2, material: 'Cu', sizeMm2: 185, amps: 449, provenance: 'confirmed' },
  { table: 'B.52.3', insulation: 'XLPE', method: 'B1', loadedConductors: 2, material: 'Cu', sizeMm2: 240, amps: 528, provenance: 'confirmed' },
  // Table B.52.5: XLPE (90 °C), method B1, 3 loaded conductors, copper.
  { table: 'B.52.5', insulation: 'XLPE', method: 'B1', loadedConductors: 3, material: 'Cu', sizeMm2: 1.5, amps: 20, provenance: 'confirmed' },
  { table: 'B.52.5', insulation: 'XLPE', method: 'B1', loadedConductors: 3, material: 'Cu', sizeMm2: 2.5, amps: 28, provenance: 'confirmed' },
  { table: 'B.52.5', insulation: 'XLPE', method: 'B1', loadedConductors: 3, material: 'Cu', sizeMm2: 4, amps: 37, provenance: 'confirmed' },
  { table: 'B.52.5', insulation: 'XLPE', method: 'B1', loadedConductors: 3, material: 'Cu', sizeMm2: 6, amps: 48, provenance: 'confirmed' },
  { table: 'B.52.5', insulation: 'XLPE', method: 'B1', loadedConductors: 3, material: 'Cu', sizeMm2: 10, amps: 66, provenance: 'confirmed' },
  { table: 'B.52.5', insulation: 'XLPE', method: 'B1', loadedConductors: 3, material: 'Cu', sizeMm2: 16, amps: 88, provenance: 'confirmed' },
  { table: 'B.52.5', insulation: 'XLPE', method: 'B1', loadedConductors: 3, material: 'Cu', sizeMm2: 25, amps: 117, provenance: 'confirmed' },
  { table: 'B.52.5', insulation: 'XLPE', method: 'B1', loadedConductors: 3, material: 'Cu', sizeMm2: 35, amps: 144, provenance: 'confirmed' },
  { table: 'B.52.5', insulation: 'XLPE', method: 'B1', loadedConductors: 3, material: 'Cu', sizeMm2: 50, amps: 175, provenance: 'confirmed' },
  { table: 'B.52.5', insulation: 'XLPE', method: 'B1', loadedConductors: 3, material: 'Cu', sizeMm2: 70, amps: 222, provenance: 'confirmed' },
  { table: 'B.52.5', insulation: 'XLPE', method: 'B1', loadedConductors: 3, material: 'Cu', sizeMm2: 95, amps: 269, provenance: 'confirmed' },
  { table: 'B.52.5', insulation: 'XLPE', method: 'B1', loadedConductors: 3, material: 'Cu', sizeMm2: 120, amps: 312, provenance: 'confirmed' },
  { table: 'B.52.5', insulation: 'XLPE', method: 'B1', loadedConductors: 3, material: 'Cu', sizeMm2: 150, amps: 342, provenance: 'confirmed' },
  { table: 'B.52.5', insulation: 'XLPE', method: 'B1', loadedConductors: 3, material: 'Cu', sizeMm2: 185, amps: 384, provenance: 'confirmed' },
  { table: 'B.52.5', insulation: 'XLPE', method: 'B1', loadedConductors: 3, material: 'Cu', sizeMm2: 240, amps: 450, provenance: 'confirmed' },
  // Table B.52.3: XLPE (90 °C), method B2, 2 loaded conductors, copper.
  { table: 'B.52.3', insulation: 'XLPE', method: 'B2', loadedConductors: 2, material: 'Cu', sizeMm2: 1.5, amps: 22, provenance: 'corroborated' },
  { table: 'B.52.3', insulation: 'XLPE', method: 'B2', loadedConductors: 2, material: 'Cu', sizeMm2: 2.5, amps: 30, provenance: 'corroborated' },
  { table: 'B.52.3', insulation: 'XLPE', method: 'B2', loadedConductors: 2, material: 'Cu', sizeMm2: 4, amps: 40, provenance: 'corroborated' },
  { table: 'B.52.3', insulation: 'XLPE', method: 'B2', loadedConductors: 2, material: 'Cu', sizeMm2: 6, amps: 51, provenance: 'corroborated' },
  { table: 'B.52.3', insulation: 'XLPE', method: 'B2', loadedConductors: 2, material: 'Cu', sizeMm2: 10, amps: 69, provenance: 'corroborated' },
  { table: 'B.52.3', insulation: 'XLPE', method: 'B2', loadedConductors: 2, material: 'Cu', sizeMm2: 16, amps: 91, provenance: 'corroborated' },
  { table: 'B.52.3', insulation: 'XLPE', method: 'B2', loadedConductors: 2, material: 'Cu', sizeMm2: 25, amps: 119, provenance: 'corroborated' },
  { table: 'B.52.3', insulation: 'XLPE', method: 'B2', loadedConductors: 2, material: 'Cu', sizeMm2: 35, amps: 146, provenance: 'corroborated' },
  { table: 'B.52.3', insulation: 'XLPE', method: 'B2', loadedConductors: 2, material: 'Cu', sizeMm2: 50, amps: 175, provenance: 'corroborated' },
  { table: 'B.52.3', insulation: 'XLPE', method: 'B2', loadedConductors: 2, material: 'Cu', sizeMm2: 70, amps: 221, provenance: 'corroborated' },
  { table: 'B.52.3', insulation: 'XLPE', method: 'B2', loadedConductors: 2, material: 'Cu', sizeMm2: 95, amps: 265, provenance: 'corroborated' },
  { table: 'B.52.3', insulation: 'XLPE', method: 'B2', loadedConductors: 2, material: 'Cu', sizeMm2: 120, amps: 305, provenance: 'corroborated' },
  { table: 'B.52.3', insulation: 'XLPE', method: 'B2', loadedConductors: 2, material: 'Cu', sizeMm2: 150, amps: 334, provenance: 'from memory' }, // one published copy agrees, a national adoption (NBR 5410) prints 349; check against the printed standard
  { table: 'B.52.3', insulation: 'XLPE', method: 'B2', loadedConductors: 2, material: 'Cu', sizeMm2: 185, amps: 384, provenance: 'from memory' }, // one published copy agrees, a national adoption (NBR 5410) prints 395; check against the printed standard
  { table: 'B.52.3', insulation: 'XLPE', method: 'B2', loadedConductors: 2, material: 'Cu', sizeMm2: 240, amps: 459, provenance: 'from memory' }, // one published copy agrees, a national adoption (NBR 5410) prints 462; check against the printed standard
  // Table B.52.5: XLPE (90 °C), method B2, 3 loaded conductors, copper.
  { table: 'B.52.5', insulation: 'XLPE', method: 'B2', loadedConductors: 3, material: 'Cu', sizeMm2: 1.5, amps: 19.5, provenance: 'corroborated' },
  { table: 'B.52.5', insulation: 'XLPE', method: 'B2', loadedConductors: 3, material: 'Cu', sizeMm2: 2.5, amps: 26, provenance: 'corroborated' },
  { table: 'B.52.5', insulation: 'XLPE', method: 'B2', loadedConductors: 3, material: 'Cu', sizeMm2: 4, amps: 35, provenance: 'corroborated' },
  { table: 'B.52.5', insulation: 'XLPE', method: 'B2', loadedConductors: 3, material: 'Cu', sizeMm2: 6, amps: 44, provenance: 'corroborated' },
  { table: 'B.52.5', insulation: 'XLPE', method: 'B2', loadedConductors: 3, material: 'Cu', sizeMm2: 10, amps: 60, provenance: 'corroborated' },
  { table: 'B.52.5', insulation: 'XLPE', method: 'B2', loadedConductors: 3, material: 'Cu', sizeMm2: 16, amps: 80, provenance: 'corroborated' },
  { table: 'B.52.5', insulation: 'XLPE', method: 'B2', loadedConductors: 3, material: 'Cu', sizeMm2: 25, amps: 105, provenance: 'corroborated' },
  { table: 'B.52.5', insulation: 'XLPE', method: 'B2', loadedConductors: 3, material: 'Cu', sizeMm2: 35, amps: 128, provenance: 'corroborated' },
  { table: 'B.52.5', insulation: 'XLPE', method: 'B2', loadedConductors: 3, material: 'Cu', sizeMm2: 50, amps: 154, provenance: 'corroborated' },
  { table: 'B.52.5', insulation: 'XLPE', method: 'B2', loadedConductors: 3, material: 'Cu', sizeMm2: 70, amps: 194, provenance: 'corroborated' },
  { table: 'B.52.5', insulation: 'XLPE', method: 'B2', loadedConductors: 3, material: 'Cu', sizeMm2: 95, amps: 233, provenance: 'corroborated' },
  { table: 'B.52.5', insulation: 'XLPE', method: 'B2', loadedConductors: 3, material: 'Cu', sizeMm2: 120, amps: 268, provenance: 'corroborated' },
  { table: 'B.52.5', insulation: 'XLPE', method: 'B2', loadedConductors: 3, material: 'Cu', sizeMm2: 150, amps: 300, provenance: 'corroborated' },
  { table: 'B.52.5', insulation: 'XLPE', method: 'B2', loadedConductors: 3, material: 'Cu', sizeMm2: 185, amps: 340, provenance: 'corroborated' },
  { table: 'B.52.5', insulation: 'XLPE', method: 'B2', loadedConductors: 3, material: 'Cu', sizeMm2: 240, amps: 398, provenance: 'corroborated' },
  // Table B.52.3: XLPE (90 °C), method C, 2 loaded conductors, copper.
  { table: 'B.52.3', insulation: 'XLPE', method: 'C', loadedConductors: 2, material: 'Cu', sizeMm2: 1.5, amps: 24, provenance: 'corroborated' },
  { table: 'B.52.3', insulation: 'XLPE', method: 'C', loadedConductors: 2, material: 'Cu', sizeMm2: 2.5, amps: 33, provenance: 'corroborated' },
  { table: 'B.52.3', insulation: 'XLPE', method: 'C', loadedConductors: 2, material: 'Cu', sizeMm2: 4, amps: 45, provenance: 'corroborated' },
  { table: 'B.52.3', insulation: 'XLPE', method: 'C', loadedConductors: 2, material: 'Cu', sizeMm2: 6, amps: 58, provenance: 'corroborated' },
  { table: 'B.52.3', insulation: 'XLPE', method: 'C', loadedConductors: 2, material: 'Cu', sizeMm2: 10, amps: 80, provenance: 'corroborated' },
  { table: 'B.52.3', insulation: 'XLPE', method: 'C', loadedConductors: 2, material: 'Cu', sizeMm2: 16, amps: 107, provenance: 'corroborated' },
  { table: 'B.52.3', insulation: 'XLPE', method: 'C', loadedConductors: 2, material: 'Cu', sizeMm2: 25, amps: 138, provenance: 'corroborated' },
  { table: 'B.52.3', insulation: 'XLPE', method: 'C', loadedConductors: 2, material: 'Cu', sizeMm2: 35, amps: 171, provenance: 'corroborated' },
  { table: 'B.52.3', insulation: 'XLPE', method: 'C', loadedConductors: 2, material: 'Cu', sizeMm2: 50, amps: 209, provenance: 'corroborated' },
  { table: 'B.52.3', insulation: 'XLPE', method: 'C', loadedConductors: 2, material: 'Cu', sizeMm2: 70, amps: 269, provenance: 'corroborated' },
  { table: 'B.52.3', insulation: 'XLPE', method: 'C', loadedConductors: 2, material: 'Cu', sizeMm2: 95, amps: 328, provenance: 'corroborated' },
  { table: 'B.52.3', insulation: 'XLPE', method: 'C', loadedConductors: 2, material: 'Cu', sizeMm2: 120, amps: 382, provenance: 'corroborated' },
  { table: 'B.52.3', insulation: 'XLPE', method: 'C', loadedConductors: 2, material: 'Cu', sizeMm2: 150, amps: 441, provenance: 'corroborated' },
  { table: 'B.52.3', insulation: 'XLPE', method: 'C', loadedConductors: 2, material: 'Cu', sizeMm2: 185, amps: 506, provenance: 'corroborated' },
  { table: 'B.52.3', insulation: 'XLPE', method: 'C', loadedConductors: 2, material: 'Cu', sizeMm2: 240, amps: 599, provenance: 'corroborated' },
  // Table B.52.5: XLPE (90 °C), method C, 3 loaded conductors, copper.
  { table: 'B.52.5', insulation: 'XLPE', method: 'C', loadedConductors: 3, material: 'Cu', sizeMm2: 1.5, amps: 22, provenance: 'corroborated' },
  { table: 'B.52.5', insulation: 'XLPE', method: 'C', loadedConductors: 3, material: 'Cu', sizeMm2: 2.5, amps: 30, provenance: 'corroborated' },
  { table: 'B.52.5', insulation: 'XLPE', method: 'C', loadedConductors: 3, material: 'Cu', sizeMm2: 4, amps: 40, provenance: 'corroborated' },
  { table: 'B.52.5', insulation: 'XLPE', method: 'C', loadedConductors: 3, material: 'Cu', sizeMm2: 6, amps: 52, provenance: 'corroborated' },
  { table: 'B.52.5', insulation: 'XLPE', method: 'C', loadedConductors: 3, material: 'Cu', sizeMm2: 10, amps: 71, provenance: 'corroborated' },
  { table: 'B.52.5', insulation: 'XLPE', method: 'C', loadedConductors: 3, material: 'Cu', sizeMm2: 16, amps: 96, provenance: 'corroborated' },
  { table: 'B.52.5', insulation: 'XLPE', method: 'C', loadedConductors: 3, material: 'Cu', sizeMm2: 25, amps: 119, provenance: 'corroborated' },
  { table: 'B.52.5', insulation: 'XLPE', method: 'C', loadedConductors: 3, material: 'Cu', sizeMm2: 35, amps: 147, provenance: 'corroborated' },
  { table: 'B.52.5', insulation: 'XLPE', method: 'C', loadedConductors: 3, material: 'Cu', sizeMm2: 50, amps: 179, provenance: 'corroborated' },
  { table: 'B.52.5', insulation: 'XLPE', method: 'C', loadedConductors: 3, material: 'Cu', sizeMm2: 70, amps: 229, provenance: 'corroborated' },
  { table: 'B.52.5', insulation: 'XLPE', method: 'C', loadedConductors: 3, material: 'Cu', sizeMm2: 95, amps: 278, provenance: 'corroborated' },
  { table: 'B.52.5', insulation: 'XLPE', method: 'C', loadedConductors: 3, material: 'Cu', sizeMm2: 120, amps: 322, provenance: 'corroborated' },
  { table: 'B.52.5', insulation: 'XLPE', method: 'C', loadedConductors: 3, material: 'Cu', sizeMm2: 150, amps: 371, provenance: 'corroborated' },
  { table: 'B.52.5', insulation: 'XLPE', method: 'C', loadedConductors: 3, material: 'Cu', sizeMm2: 185, amps: 424, provenance: 'corroborated' },
  { table: 'B.52.5', insulation: 'XLPE', method: 'C', loadedConductors: 3, material: 'Cu', sizeMm2: 240, amps: 500, provenance: 'corroborated' },
  // Table B.52.12: XLPE (90 °C), method E, 2 loaded conductors, copper.
  { table: 'B.52.12', insulation: 'XLPE', method: 'E', loadedConductors: 2, material: 'Cu', sizeMm2: 1.5, amps: 26, provenance: 'corroborated' },
  { table: 'B.52.12', insulation: 'XLPE', method: 'E', loadedConductors: 2, material: 'Cu', sizeMm2: 2.5, amps: 36, provenance: 'corroborated' },
  { table: 'B.52.12', insulation: 'XLPE', method: 'E', loadedConductors: 2, material: 'Cu', sizeMm2: 4, amps: 49, provenance: 'corroborated' },
  { table: 'B.52.12', insulation: 'XLPE', method: 'E', loadedConductors: 2, material: 'Cu', sizeMm2: 6, amps: 63, provenance: 'corroborated' },
  { table: 'B.52.12', insulation: 'XLPE', method: 'E', loadedConductors: 2, material: 'Cu', sizeMm2: 10, amps: 86, provenance: 'corroborated' },
  { table: 'B.52.12', insulation: 'XLPE', method: 'E', loadedConductors: 2, material: 'Cu', sizeMm2: 16, amps: 115, provenance: 'corroborated' },
  { table: 'B.52.12', insulation: 'XLPE', method: 'E', loadedConductors: 2, material: 'Cu', sizeMm2: 25, amps: 149, provenance: 'corroborated' },
  { table: 'B.52.12', insulation: 'XLPE', method: 'E', loadedConductors: 2, material: 'Cu', sizeMm2: 35, amps: 185, provenance: 'corroborated' },
  { table: 'B.52.12', insulation: 'XLPE', method: 'E', loadedConductors: 2, material: 'Cu', sizeMm2: 50, amps: 225, provenance: 'corroborated' },
  { table: 'B.52.12', insulation: 'XLPE', method: 'E', loadedConductors: 2, material: 'Cu', sizeMm2: 70, amps: 289, provenance: 'corroborated' },
  { table: 'B.52.12', insulation: 'XLPE', method: 'E', loadedConductors: 2, material: 'Cu', sizeMm2: 95, amps: 352, provenance: 'corroborated' },
  { table: 'B.52.12', insulation: 'XLPE', method: 'E', loadedConductors: 2, material: 'Cu', sizeMm2: 120, amps: 410, provenance: 'corroborated' },
  { table: 'B.52.12', insulation: 'XLPE', method: 'E', loadedConductors: 2, material: 'Cu', sizeMm2: 150, amps: 473, provenance: 'corroborated' },
  { table: 'B.52.12', insulation: 'XLPE', method: 'E', loadedConductors: 2, material: 'Cu', sizeMm2: 185, amps: 542, provenance: 'corroborated' },
  { table: 'B.52.12', insulation: 'XLPE', method: 'E', loadedConductors: 2, material: 'Cu', sizeMm2: 240, amps: 641, provenance: 'corroborated' },
  // Table B.52.12: XLPE (90 °C), method E, 3 loaded conductors, copper.
  { table: 'B.52.12', insulation: 'XLPE', method: 'E', loadedConductors: 3, material: 'Cu', sizeMm2: 1.5, amps: 23, provenance: 'corroborated' },
  { table: 'B.52.12', insulation: 'XLPE', method: 'E', loadedConductors: 3, material: 'Cu', sizeMm2: 2.5, amps: 32, provenance: 'corroborated' },
  { table: 'B.52.12', insulation: 'XLPE', method: 'E', loadedConductors: 3, material: 'Cu', sizeMm2: 4, amps: 42, provenance: 'corroborated' },
  { table: 'B.52.12', insulation: 'XLPE', method: 'E', loadedConductors: 3, material: 'Cu', sizeMm2: 6, amps: 54, provenance: 'corroborated' },
  { table: 'B.52.12', insulation: 'XLPE', method: 'E', loadedConductors: 3, material: 'Cu', sizeMm2: 10, amps: 75, provenance: 'corroborated' },
  { table: 'B.52.12', insulation: 'XLPE', method: 'E', loadedConductors: 3, material: 'Cu', sizeMm2: 16, amps: 100, provenance: 'corroborated' },
  { table: 'B.52.12', insulation: 'XLPE', method: 'E', loadedConductors: 3, material: 'Cu', sizeMm2: 25, amps: 127, provenance: 'corroborated' },
  { table: 'B.52.12', insulation: 'XLPE', method: 'E', loadedConductors: 3, material: 'Cu', sizeMm2: 35, amps: 158, provenance: 'corroborated' },
  { table: 'B.52.12', insulation: 'XLPE', method: 'E', loadedConductors: 3, material: 'Cu', sizeMm2: 50, amps: 192, provenance: 'corroborated' },
  { table: 'B.52.12', insulation: 'XLPE', method: 'E', loadedConductors: 3, material: 'Cu', sizeMm2: 70, amps: 246, provenance: 'corroborated' },
  { table: 'B.52.12', insulation: 'XLPE', method: 'E', loadedConductors: 3, material: 'Cu', sizeMm2: 95, amps: 298, provenance: 'corroborated' },
  { table: 'B.52.12', insulation: 'XLPE', method: 'E', loadedConductors: 3, material: 'Cu', sizeMm2: 120, amps: 346, provenance: 'corroborated' },
  { table: 'B.52.12', insulation: 'XLPE', method: 'E', loadedConductors: 3, material: 'Cu', sizeMm2: 150, amps: 399, provenance: 'corroborated' },
  { table: 'B.52.12', insulation: 'XLPE', method: 'E', loadedConductors: 3, material: 'Cu', sizeMm2: 185, amps: 456, provenance: 'corroborated' },
  { table: 'B.52.12', insulation: 'XLPE', method: 'E', loadedConductors: 3, material: 'Cu', sizeMm2: 240, amps: 538, provenance: 'corroborated' },
];

/**
 * Table B.52.14: correction factors for ambient air temperatures other than 30 °C, applied to the
 * capacities for cables in air. Columns: `ambientC` the printed ambient (°C); `pvc` / `xlpe` the
 * factor (`null` where the table prints none: PVC above 60 °C). Reading an ambient between two
 * printed rows with the next warmer row is common practice (no source): the conservative side.
 * Provenance: XLPE to 60 °C confirmed (NBR 5410 Tabela 40, which mirrors IEC), 65–80 °C
 * corroborated; PVC corroborated. Both columns equal √[(θmax − θa)/(θmax − 30)] rounded to
 * 2 decimals with θmax = 70 (PVC) or 90 (XLPE) °C — a computed cross-check in the tests.
 */
export interface IecAmbientRow {
  readonly ambientC: number;
  readonly pvc: number | null;
  readonly xlpe: number;
  readonly provenance: { readonly pvc: Provenance; readonly xlpe: Provenance };
}

const B52_14_LOW = { pvc: 'corroborated', xlpe: 'confirmed' } as const;
const B52_14_HIGH = { pvc: 'corroborated', xlpe: 'corroborated' } as const;

/** IEC 60364-5-52:2009 Table B.52.14, coldest first. */
export const IEC_B52_14_AMBIENT: readonly IecAmbientRow[] = [
  { ambientC: 10, pvc: 1.22, xlpe: 1.15, provenance: B52_14_LOW },
  { ambientC: 15, pvc: 1.17, xlpe: 1.12, provenance: B52_14_LOW },
  { ambientC: 20, pvc: 1.12, xlpe: 1.08, provenance: B52_14_LOW },
  { ambientC: 25, pvc: 1.06, xlpe: 1.04, provenance: B52_14_LOW },
  { ambientC: 30, pvc: 1.0, xlpe: 1.0, provenance: B52_14_LOW },
  { ambientC: 35, pvc: 0.94, xlpe: 0.96, provenance: B52_14_LOW },
  { ambientC: 40, pvc: 0.87, xlpe: 0.91, provenance: B52_14_LOW },
  { ambientC: 45, pvc: 0.79, xlpe: 0.87, provenance: B52_14_LOW },
  { ambientC: 50, pvc: 0.71, xlpe: 0.82, provenance: B52_14_LOW },
  { ambientC: 55, pvc: 0.61, xlpe: 0.76, provenance: B52_14_LOW },
  { ambientC: 60, pvc: 0.5, xlpe: 0.71, provenance: B52_14_LOW },
  { ambientC: 65, pvc: null, xlpe: 0.65, provenance: B52_14_HIGH },
  { ambientC: 70, pvc: null, xlpe: 0.58, provenance: B52_14_HIGH },
  { ambientC: 75, pvc: null, xlpe: 0.5, provenance: B52_14_HIGH },
  { ambientC: 80, pvc: null, xlpe: 0.41, provenance: B52_14_HIGH },
];

/**
 * Table B.52.17: reduction factors for groups of more than one circuit or more than one multicore
 * cable, to be used with the capacities above. Columns: `item` the table's item number;
 * `arrangement` (cables touching); `methods` the reference methods it applies to; `factors` the
 * factor for each number of circuits or multicore cables, with its provenance;
 * `noFurtherReductionAbove`: for single-layer arrangements the table states no further reduction
 * beyond 9 circuits, so the 12/16/20 cells repeat the 9-circuit factor (null for bunched cables).
 * Provenance: bunched row 1–6 and 8 circuits confirmed against a published copy, its other cells
 * corroborated; single-layer rows corroborated, except the wooden-ceiling row: from memory.
 */
export interface IecGroupingCell {
  readonly circuits: number;
  readonly factor: number;
  readonly provenance: Provenance;
}

export interface IecGroupingRow {
  readonly item: number;
  readonly arrangement: string;
  readonly methods: readonly string[];
  readonly noFurtherReductionAbove: number | null;
  readonly factors: readonly IecGroupingCell[];
}

/** IEC 60364-5-52:2009 Table B.52.17, items 1–5, cables touching. */
export const IEC_B52_17_GROUPING: readonly IecGroupingRow[] = [
  {
    item: 1,
    arrangement: 'bunched in air, on a surface, embedded or enclosed',
    // Printed as "methods A to F"; buried cables (D1, D2) have their own grouping tables (from memory).
    methods: ['A1', 'A2', 'B1', 'B2', 'C', 'E', 'F'],
    noFurtherReductionAbove: null,
    factors: [
      { circuits: 1, factor: 1, provenance: 'confirmed' },
      { circuits: 2, factor: 0.8, provenance: 'confirmed' },
      { circuits: 3, factor: 0.7, provenance: 'confirmed' },
      { circuits: 4, factor: 0.65, provenance: 'confirmed' },
      { circuits: 5, factor: 0.6, provenance: 'confirmed' },
      { circuits: 6, factor: 0.57, provenance: 'confirmed' },
      { circuits: 7, factor: 0.54, provenance: 'corroborated' },
      { circuits: 8, factor: 0.52, provenance: 'confirmed' },
      { circuits: 9, factor: 0.5, provenance: 'corroborated' },
      { circuits: 12, factor: 0.45, provenance: 'corroborated' },
      { circuits: 16, factor: 0.41, provenance: 'corroborated' },
      { circuits: 20, factor: 0.38, provenance: 'corroborated' },
    ],
  },
  {
    item: 2,
    arrangement: 'single layer on wall, floor or unperforated cable tray',
    methods: ['C'],
    noFurtherReductionAbove: 9,
    factors: [
      { circuits: 1, factor: 1, provenance: 'corroborated' },
      { circuits: 2, factor: 0.85, provenance: 'corroborated' },
      { circuits: 3, factor: 0.79, provenance: 'corroborated' },
      { circuits: 4, factor: 0.75, provenance: 'corroborated' },
      { circuits: 5, factor: 0.73, provenance: 'corroborated' },
      { circuits: 6, factor: 0.72, provenance: 'corroborated' },
      { circuits: 7, factor: 0.72, provenance: 'corroborated' },
      { circuits: 8, factor: 0.71, provenance: 'corroborated' },
      { circuits: 9, factor: 0.7, provenance: 'corroborated' },
      { circuits: 12, factor: 0.7, provenance: 'corroborated' },
      { circuits: 16, factor: 0.7, provenance: 'corroborated' },
      { circuits: 20, factor: 0.7, provenance: 'corroborated' },
    ],
  },
  {
    item: 3,
    arrangement: 'single layer fixed directly under a wooden ceiling',
    methods: ['C'],
    noFurtherReductionAbove: 9,
    factors: [
      { circuits: 1, factor: 0.95, provenance: 'from memory' },
      { circuits: 2, factor: 0.81, provenance: 'from memory' },
      { circuits: 3, factor: 0.72, provenance: 'from memory' },
      { circuits: 4, factor: 0.68, provenance: 'from memory' },
      { circuits: 5, factor: 0.66, provenance: 'from memory' },
      { circuits: 6, factor: 0.64, provenance: 'from memory' },
      { circuits: 7, factor: 0.63, provenance: 'from memory' },
      { circuits: 8, factor: 0.62, provenance: 'from memory' },
      { circuits: 9, factor: 0.61, provenance: 'from memory' },
      { circuits: 12, factor: 0.61, provenance: 'from memory' },
      { circuits: 16, factor: 0.61, provenance: 'from memory' },
      { circuits: 20, factor: 0.61, provenance: 'from memory' },
    ],
  },
  {
    item: 4,
    arrangement: 'single layer on a perforated horizontal or vertical cable tray',
    methods: ['E', 'F'],
    noFurtherReductionAbove: 9,
    factors: [
      { circuits: 1, factor: 1, provenance: 'corroborated' },
      { circuits: 2, factor: 0.88, provenance: 'corroborated' },
      { circuits: 3, factor: 0.82, provenance: 'corroborated' },
      { circuits: 4, factor: 0.77, provenance: 'corroborated' },
      { circuits: 5, factor: 0.75, provenance: 'corroborated' },
      { circuits: 6, factor: 0.73, provenance: 'corroborated' },
      { circuits: 7, factor: 0.73, provenance: 'corroborated' },
      { circuits: 8, factor: 0.72, provenance: 'corroborated' },
      { circuits: 9, factor: 0.72, provenance: 'corroborated' },
      { circuits: 12, factor: 0.72, provenance: 'corroborated' },
      { circuits: 16, factor: 0.72, provenance: 'corroborated' },
      { circuits: 20, factor: 0.72, provenance: 'corroborated' },
    ],
  },
  {
    item: 5,
    arrangement: 'single layer on cable ladder support or cleats',
    methods: ['E', 'F'],
    noFurtherReductionAbove: 9,
    factors: [
      { circuits: 1, factor: 1, provenance: 'corroborated' },
      { circuits: 2, factor: 0.87, provenance: 'corroborated' },
      { circuits: 3, factor: 0.82, provenance: 'corroborated' },
      { circuits: 4, factor: 0.8, provenance: 'corroborated' },
      { circuits: 5, factor: 0.8, provenance: 'corroborated' },
      { circuits: 6, factor: 0.79, provenance: 'corroborated' },
      { circuits: 7, factor: 0.79, provenance: 'corroborated' },
      { circuits: 8, factor: 0.78, provenance: 'corroborated' },
      { circuits: 9, factor: 0.78, provenance: 'corroborated' },
      { circuits: 12, factor: 0.78, provenance: 'corroborated' },
      { circuits: 16, factor: 0.78, provenance: 'corroborated' },
      { circuits: 20, factor: 0.78, provenance: 'corroborated' },
    ],
  },
];

/**
 * Annex G (informative), Table G.52.1: voltage drop limits in consumers' installations, % of the
 * nominal voltage, from the origin of the installation to the equipment. Confirmed against a
 * published copy of the annex and two secondary copies. Type A: low-voltage installation supplied
 * directly from a public low-voltage distribution system; type B: supplied from a private LV supply.
 * Annex G notes (confirmed): where the main wiring systems are longer than 100 m the limits may be
 * increased by 0.005 % per metre beyond 100 m, the supplement not exceeding 0.5 %; greater drops
 * are accepted during motor starting and for high-inrush equipment; transients and abnormal
 * operation are excluded; for type B it is recommended, as far as possible, that final circuits
 * not exceed the type A values.
 */
export interface IecVoltageDropLimitRow {
  readonly installationType: 'A' | 'B';
  readonly description: string;
  readonly lightingPercent: number;
  readonly otherUsesPercent: number;
  readonly provenance: Provenance;
}

export const IEC_G52_1_VOLTAGE_DROP_LIMITS: readonly IecVoltageDropLimitRow[] = [
  {
    installationType: 'A',
    description: 'low-voltage installation supplied directly from a public low-voltage distribution system',
    lightingPercent: 3,
    otherUsesPercent: 5,
    provenance: 'confirmed',
  },
  {
    installationType: 'B',
    description: 'low-voltage installation supplied from a private LV supply',
    lightingPercent: 6,
    otherUsesPercent: 8,
    provenance: 'confirmed',
  },
];

/**
 * Annex G long-run supplement: beyond `fromLengthM` of main wiring the limits may rise by
 * `percentPerM` per metre, the supplement capped at `capPercent`. Confirmed.
 */
export const IEC_G52_LONG_RUN_SUPPLEMENT = { fromLengthM: 100, percentPerM: 0.005, capPercent: 0.5 } as const;

/**
 * Annex G formula constants (confirmed): u = b·(ρ₁·L·cosφ/S + λ·L·sinφ)·I_B, relative drop
 * Δu = 100·u/U₀ with U₀ the line-to-neutral voltage.
 * - b: 1 for three-phase circuits, 2 for single-phase (a three-phase circuit with a completely
 *   unbalanced neutral counts as single-phase);
 * - ρ₁: resistivity in normal service, 1.25 × the resistivity at 20 °C: 0.0225 Ω·mm²/m copper,
 *   0.036 Ω·mm²/m aluminium as printed (the annex's round figures: 1.25 × 0.018 and 1.25 × 0.0288);
 * - λ: reactance per unit length, 0.08 mΩ/m when not otherwise known;
 * - cosφ: 0.8 when not otherwise known (sinφ = 0.6).
 * Units: ρ₁ in Ω·mm²/m as printed and in Ω·m (SI); λ in mΩ/m as printed and in Ω/m (SI).
 */
export const IEC_ANNEX_G = {
  bThreePhase: 1,
  bSinglePhase: 2,
  rho1OverRho20: 1.25,
  rho1OhmMm2PerM: { Cu: 0.0225, Al: 0.036 },
  rho1OhmM: { Cu: 0.0225e-6, Al: 0.036e-6 },
  lambdaMilliOhmPerM: 0.08,
  lambdaOhmPerM: 0.08e-3,
  defaultCosPhi: 0.8,
  provenance: 'confirmed',
} as const satisfies {
  readonly rho1OhmMm2PerM: Readonly<Record<ConductorMaterial, number>>;
  readonly rho1OhmM: Readonly<Record<ConductorMaterial, number>>;
  readonly provenance: Provenance;
  readonly [k: string]: unknown;
};
