/**
 * NEC Table 310.16: allowable ampacities of insulated conductors rated up to and including
 * 2000 volts, 60 °C through 90 °C, not more than three current-carrying conductors in a raceway,
 * cable or earth (directly buried), based on an ambient temperature of 30 °C (86 °F).
 *
 * Source: NFPA 70, National Electrical Code, 2023 edition, Table 310.16 (values checked against a
 * published copy of the 2023 table; the 2014 and 2017 editions, which numbered it 310.15(B)(16),
 * print the same values for 14 AWG to 500 kcmil, and so does the 2020 edition as far as known).
 * Editions before 2014 printed different values for some cells (for example 150 A for 1 AWG copper
 * at 90 °C, now 145 A); this table is the 2014-and-later one.
 *
 * Units: ampacities in amperes. Columns:
 * - `size`: conductor size key (see nec-sizes.ts); `areaCmil`: its area in circular mils from
 *   Chapter 9 Table 8 (area from memory, see nec-chapter9.ts).
 * - `cu`: copper, by insulation temperature rating 60 / 75 / 90 °C (the table's column heads list
 *   the insulation types; examples from memory: TW, UF at 60 °C; THWN, XHHW at 75 °C; THHN,
 *   XHHW-2 at 90 °C).
 * - `al`: aluminum or copper-clad aluminum, same three ratings.
 * - `null` marks a cell the table leaves empty (no aluminum ampacity at 14 AWG).
 *
 * Table note (confirmed): the sizes marked with an asterisk (14, 12, 10 AWG) refer to 240.4(D)
 * for conductor overcurrent protection limitations; those limits are NEC_240_4_D below.
 */
import type { Provenance } from './conductor-materials.ts';
import type { NecSize } from './nec-sizes.ts';

/** Insulation temperature rating, °C: the three column groups of Table 310.16. */
export type NecTempRating = 60 | 75 | 90;

/** One material's three ampacity cells, by temperature rating; `null` where the table is empty. */
export type NecAmpacityCells = Readonly<Record<NecTempRating, number | null>>;

export interface Nec31016Row {
  readonly size: NecSize;
  readonly areaCmil: number;
  /** Copper, A. */
  readonly cu: NecAmpacityCells;
  /** Aluminum or copper-clad aluminum, A. */
  readonly al: NecAmpacityCells;
  /** True for the sizes the table marks with an asterisk (see 240.4(D)). */
  readonly smallConductorRule: boolean;
  readonly provenance: Provenance;
}

/** NFPA 70-2023 Table 310.16, 14 AWG to 500 kcmil, smallest first. */
export const NEC_310_16: readonly Nec31016Row[] = [
  { size: '14 AWG', areaCmil: 4110, cu: { 60: 15, 75: 20, 90: 25 }, al: { 60: null, 75: null, 90: null }, smallConductorRule: true, provenance: 'confirmed' },
  { size: '12 AWG', areaCmil: 6530, cu: { 60: 20, 75: 25, 90: 30 }, al: { 60: 15, 75: 20, 90: 25 }, smallConductorRule: true, provenance: 'confirmed' },
  { size: '10 AWG', areaCmil: 10380, cu: { 60: 30, 75: 35, 90: 40 }, al: { 60: 25, 75: 30, 90: 35 }, smallConductorRule: true, provenance: 'confirmed' },
  { size: '8 AWG', areaCmil: 16510, cu: { 60: 40, 75: 50, 90: 55 }, al: { 60: 35, 75: 40, 90: 45 }, smallConductorRule: false, provenance: 'confirmed' },
  { size: '6 AWG', areaCmil: 26240, cu: { 60: 55, 75: 65, 90: 75 }, al: { 60: 40, 75: 50, 90: 55 }, smallConductorRule: false, provenance: 'confirmed' },
  { size: '4 AWG', areaCmil: 41740, cu: { 60: 70, 75: 85, 90: 95 }, al: { 60: 55, 75: 65, 90: 75 }, smallConductorRule: false, provenance: 'confirmed' },
  { size: '3 AWG', areaCmil: 52620, cu: { 60: 85, 75: 100, 90: 115 }, al: { 60: 65, 75: 75, 90: 85 }, smallConductorRule: false, provenance: 'confirmed' },
  { size: '2 AWG', areaCmil: 66360, cu: { 60: 95, 75: 115, 90: 130 }, al: { 60: 75, 75: 90, 90: 100 }, smallConductorRule: false, provenance: 'confirmed' },
  { size: '1 AWG', areaCmil: 83690, cu: { 60: 110, 75: 130, 90: 145 }, al: { 60: 85, 75: 100, 90: 115 }, smallConductorRule: false, provenance: 'confirmed' },
  { size: '1/0 AWG', areaCmil: 105600, cu: { 60: 125, 75: 150, 90: 170 }, al: { 60: 100, 75: 120, 90: 135 }, smallConductorRule: false, provenance: 'confirmed' },
  { size: '2/0 AWG', areaCmil: 133100, cu: { 60: 145, 75: 175, 90: 195 }, al: { 60: 115, 75: 135, 90: 150 }, smallConductorRule: false, provenance: 'confirmed' },
  { size: '3/0 AWG', areaCmil: 167800, cu: { 60: 165, 75: 200, 90: 225 }, al: { 60: 130, 75: 155, 90: 175 }, smallConductorRule: false, provenance: 'confirmed' },
  { size: '4/0 AWG', areaCmil: 211600, cu: { 60: 195, 75: 230, 90: 260 }, al: { 60: 150, 75: 180, 90: 205 }, smallConductorRule: false, provenance: 'confirmed' },
  { size: '250 kcmil', areaCmil: 250000, cu: { 60: 215, 75: 255, 90: 290 }, al: { 60: 170, 75: 205, 90: 230 }, smallConductorRule: false, provenance: 'confirmed' },
  { size: '300 kcmil', areaCmil: 300000, cu: { 60: 240, 75: 285, 90: 320 }, al: { 60: 195, 75: 230, 90: 260 }, smallConductorRule: false, provenance: 'confirmed' },
  { size: '350 kcmil', areaCmil: 350000, cu: { 60: 260, 75: 310, 90: 350 }, al: { 60: 210, 75: 250, 90: 280 }, smallConductorRule: false, provenance: 'confirmed' },
  { size: '400 kcmil', areaCmil: 400000, cu: { 60: 280, 75: 335, 90: 380 }, al: { 60: 225, 75: 270, 90: 305 }, smallConductorRule: false, provenance: 'confirmed' },
  { size: '500 kcmil', areaCmil: 500000, cu: { 60: 320, 75: 380, 90: 430 }, al: { 60: 260, 75: 310, 90: 350 }, smallConductorRule: false, provenance: 'confirmed' },
];

/**
 * NEC 240.4(D) small conductors: the largest overcurrent protection allowed for 14, 12 and 10 AWG
 * after any correction or adjustment factors, unless 240.4(E) or (G) permits otherwise.
 * Source: NFPA 70-2023 240.4(D)(3)–(7). The limits are FROM MEMORY (only the Table 310.16 note
 * pointing to 240.4(D) is confirmed); check against the printed code.
 * Units: `maxOcpdA` in amperes.
 */
export interface Nec2404DRow {
  readonly material: 'Cu' | 'Al';
  readonly size: NecSize;
  readonly maxOcpdA: number;
  readonly provenance: Provenance;
}

export const NEC_240_4_D: readonly Nec2404DRow[] = [
  { material: 'Cu', size: '14 AWG', maxOcpdA: 15, provenance: 'from memory' },
  { material: 'Cu', size: '12 AWG', maxOcpdA: 20, provenance: 'from memory' },
  { material: 'Cu', size: '10 AWG', maxOcpdA: 30, provenance: 'from memory' },
  // Aluminum and copper-clad aluminum.
  { material: 'Al', size: '12 AWG', maxOcpdA: 15, provenance: 'from memory' },
  { material: 'Al', size: '10 AWG', maxOcpdA: 25, provenance: 'from memory' },
];
