/**
 * NEC Chapter 9 Table 8 (conductor properties) and Table 9 (AC resistance and reactance).
 *
 * ── Table 8: conductor properties, DC resistance at 75 °C (167 °F), uncoated copper, aluminum ──
 * Source: NFPA 70-2023 Chapter 9 Table 8. Resistances confirmed against a published copy of the
 * 2023 table and, for the stranded columns, a second independent copy. The area column
 * (circular mils) is FROM MEMORY (field `provenance.area`); it agrees with the AWG formula within
 * 0.1 %. The NEC rounds areas differently from the theoretical AWG areas (e.g. 1/0: 105,600 here,
 * 105,535 by the formula); this app uses the NEC figures.
 * Columns: `size`, `areaCmil`; `cu` / `al`: DC resistance in Ω per 1000 ft of a stranded or a
 * solid conductor. Solid values differ from stranded by about 2 % (lay length): never mix them.
 * `null` where the table prints no value (solid conductors are listed only up to 8 AWG).
 * Cells: 8 AWG solid (Cu 0.764, Al 1.26) are from memory; Al 10 AWG solid is 2.00 from memory —
 * one published copy shows 1.99, and 17.00 Ω·cmil/ft ÷ 10,380 cmil × 1000 × (1 + 0.00403 × 55)
 * = 2.001 Ω/kft supports 2.00 — check it against the printed code.
 * Table 8 Note 2 (temperature change): R₂ = R₁·[1 + α·(T₂ − 75)] with α referred to 75 °C:
 * α_Cu = 0.00323, α_Al = 0.00330 per °C (NEC_TABLE_8_ALPHA_75). These are NOT the 20 °C
 * coefficients (0.00393 / 0.00403, conductor-materials.ts); applied from 75 °C those would be wrong.
 *
 * ── Table 9: AC resistance and reactance for 600 V cables, 3-phase, 60 Hz, 75 °C (167 °F),
 *    three single conductors in conduit; Ω to neutral per 1000 ft ──
 * Source: NEC Chapter 9 Table 9. Values confirmed against a published copy of the NFPA 70-2008
 * table (14 AWG to 1/0) and a cable maker's copy of all sizes; the values have been the
 * same in the 2011 to 2023 editions (from memory), so this app uses them as the 2023 table.
 * Columns (each by raceway: `pvc`, `aluminum`, `steel` conduit):
 * - `xl`: inductive reactance X_L (the table prints one column for PVC and aluminum conduit).
 * - `rCu`, `rAl`: AC resistance of uncoated copper / aluminum conductors.
 * - `zeCu085`: effective impedance Ze = R·cosθ + X_L·sinθ of copper at power factor 0.85, as
 *   printed. Table 9 Note 2: valid only at 0.85 PF; for another PF, Ze = R × PF + X_L·sin(arccos PF).
 *   Recomputing Ze from the rounded R and X_L misses the printed column by up to about 5 % below
 *   1/0 (the NEC derived it from unrounded R), so the printed column is kept as printed.
 * A cell is `null` where the table prints no value (no aluminum conductor at 14 AWG, from memory),
 * and ABSENT where the table has a value that this file does not carry yet (not copied from a
 * checked copy). Per-cell provenance is in `provenance`.
 * Table 9 Note 1 (from memory): based on UL Type RHH wires with Class B stranding in cradled
 * configuration; conductivity 100 % IACS copper, 61 % IACS aluminum, aluminum conduit 45 % IACS;
 * capacitive reactance ignored; valid at 75 °C and the stated parameters, representative of 600 V
 * wire types at 60 Hz.
 */
import type { ConductorMaterial, Provenance } from './conductor-materials.ts';
import type { NecSize } from './nec-sizes.ts';

/** One material's DC resistance at 75 °C, Ω/1000 ft. */
export interface NecDcResistance {
  readonly stranded: number;
  readonly solid: number | null;
}

export interface NecTable8Row {
  readonly size: NecSize;
  readonly areaCmil: number;
  /** Uncoated copper, Ω/1000 ft at 75 °C. */
  readonly cu: NecDcResistance;
  /** Aluminum, Ω/1000 ft at 75 °C. */
  readonly al: NecDcResistance;
  readonly provenance: {
    readonly area: Provenance;
    readonly cuStranded: Provenance;
    readonly cuSolid: Provenance;
    readonly alStranded: Provenance;
    readonly alSolid: Provenance;
  };
}

const T8_CHECKED = {
  area: 'from memory',
  cuStranded: 'confirmed',
  cuSolid: 'confirmed',
  alStranded: 'confirmed',
  alSolid: 'confirmed',
} as const;

/** NFPA 70-2023 Chapter 9 Table 8, 14 AWG to 500 kcmil, smallest first. */
export const NEC_CHAPTER9_TABLE8: readonly NecTable8Row[] = [
  { size: '14 AWG', areaCmil: 4110, cu: { stranded: 3.14, solid: 3.07 }, al: { stranded: 5.17, solid: 5.06 }, provenance: T8_CHECKED },
  { size: '12 AWG', areaCmil: 6530, cu: { stranded: 1.98, solid: 1.93 }, al: { stranded: 3.25, solid: 3.18 }, provenance: T8_CHECKED },
  // Al solid 2.00: from memory (one published copy shows 1.99).
  { size: '10 AWG', areaCmil: 10380, cu: { stranded: 1.24, solid: 1.21 }, al: { stranded: 2.04, solid: 2.0 }, provenance: { ...T8_CHECKED, alSolid: 'from memory' } },
  // Both solid cells from memory.
  { size: '8 AWG', areaCmil: 16510, cu: { stranded: 0.778, solid: 0.764 }, al: { stranded: 1.28, solid: 1.26 }, provenance: { ...T8_CHECKED, cuSolid: 'from memory', alSolid: 'from memory' } },
  { size: '6 AWG', areaCmil: 26240, cu: { stranded: 0.491, solid: null }, al: { stranded: 0.808, solid: null }, provenance: T8_CHECKED },
  { size: '4 AWG', areaCmil: 41740, cu: { stranded: 0.308, solid: null }, al: { stranded: 0.508, solid: null }, provenance: T8_CHECKED },
  { size: '3 AWG', areaCmil: 52620, cu: { stranded: 0.245, solid: null }, al: { stranded: 0.403, solid: null }, provenance: T8_CHECKED },
  { size: '2 AWG', areaCmil: 66360, cu: { stranded: 0.194, solid: null }, al: { stranded: 0.319, solid: null }, provenance: T8_CHECKED },
  { size: '1 AWG', areaCmil: 83690, cu: { stranded: 0.154, solid: null }, al: { stranded: 0.253, solid: null }, provenance: T8_CHECKED },
  { size: '1/0 AWG', areaCmil: 105600, cu: { stranded: 0.122, solid: null }, al: { stranded: 0.201, solid: null }, provenance: T8_CHECKED },
  { size: '2/0 AWG', areaCmil: 133100, cu: { stranded: 0.0967, solid: null }, al: { stranded: 0.159, solid: null }, provenance: T8_CHECKED },
  { size: '3/0 AWG', areaCmil: 167800, cu: { stranded: 0.0766, solid: null }, al: { stranded: 0.126, solid: null }, provenance: T8_CHECKED },
  { size: '4/0 AWG', areaCmil: 211600, cu: { stranded: 0.0608, solid: null }, al: { stranded: 0.1, solid: null }, provenance: T8_CHECKED },
  { size: '250 kcmil', areaCmil: 250000, cu: { stranded: 0.0515, solid: null }, al: { stranded: 0.0847, solid: null }, provenance: T8_CHECKED },
  { size: '300 kcmil', areaCmil: 300000, cu: { stranded: 0.0429, solid: null }, al: { stranded: 0.0707, solid: null }, provenance: T8_CHECKED },
  { size: '350 kcmil', areaCmil: 350000, cu: { stranded: 0.0367, solid: null }, al: { stranded: 0.0605, solid: null }, provenance: T8_CHECKED },
  { size: '400 kcmil', areaCmil: 400000, cu: { stranded: 0.0321, solid: null }, al: { stranded: 0.0529, solid: null }, provenance: T8_CHECKED },
  { size: '500 kcmil', areaCmil: 500000, cu: { stranded: 0.0258, solid: null }, al: { stranded: 0.0424, solid: null }, provenance: T8_CHECKED },
];

/** Reference temperature of Table 8 and Table 9 resistances, °C. */
export const NEC_RESISTANCE_REFERENCE_C = 75;

export interface NecAlphaRow {
  readonly material: ConductorMaterial;
  /** Temperature coefficient of resistance referred to 75 °C, 1/°C. */
  readonly alphaPerK: number;
  readonly referenceC: number;
  readonly provenance: Provenance;
}

/**
 * NEC Chapter 9 Table 8 Note 2: R₂ = R₁·[1 + α·(T₂ − 75)]. The values are confirmed in a published
 * excerpt of the note; the rest of the note's wording is from memory.
 */
export const NEC_TABLE_8_ALPHA_75: readonly NecAlphaRow[] = [
  { material: 'Cu', alphaPerK: 0.00323, referenceC: 75, provenance: 'confirmed' },
  { material: 'Al', alphaPerK: 0.0033, referenceC: 75, provenance: 'confirmed' },
];

/** Raceway (conduit) types of Table 9. */
export type NecRaceway = 'pvc' | 'aluminium' | 'steel';

/** Ω to neutral per 1000 ft by raceway; `null` = the table prints none; absent = not carried here. */
export type NecRacewayCells = Readonly<Partial<Record<NecRaceway, number | null>>>;

export interface NecTable9Row {
  readonly size: NecSize;
  readonly areaCmil: number;
  /** Inductive reactance X_L, Ω/1000 ft (PVC and aluminum conduit share one printed column). */
  readonly xl: Readonly<Record<NecRaceway, number>>;
  /** AC resistance, uncoated copper, Ω/1000 ft at 75 °C. */
  readonly rCu: NecRacewayCells;
  /** AC resistance, aluminum, Ω/1000 ft at 75 °C. */
  readonly rAl: NecRacewayCells;
  /** Effective Z of copper at 0.85 power factor, Ω/1000 ft, as printed. */
  readonly zeCu085: NecRacewayCells;
  readonly provenance: {
    readonly xl: Provenance;
    readonly rCu: Provenance;
    readonly rAl: Provenance;
    readonly zeCu085Pvc: Provenance;
    readonly zeCu085Steel: Provenance;
  };
}

const T9_CHECKED = { xl: 'confirmed', rCu: 'confirmed', rAl: 'confirmed', zeCu085Pvc: 'confirmed', zeCu085Steel: 'confirmed' } as const;
// 2/0 to 500 kcmil: the printed PVC Ze cells come from a single web copy; they agree with
// Ze recomputed from R and X_L at 0.85 PF.
const T9_ZE_PVC_ONE_COPY = { ...T9_CHECKED, zeCu085Pvc: 'corroborated' } as const;

/** NEC Chapter 9 Table 9 (values as in NFPA 70-2008 to 2023), 14 AWG to 500 kcmil, smallest first. */
export const NEC_CHAPTER9_TABLE9: readonly NecTable9Row[] = [
  // 14 AWG aluminium: the table prints no value (from memory).
  { size: '14 AWG', areaCmil: 4110, xl: { pvc: 0.058, aluminium: 0.058, steel: 0.073 }, rCu: { pvc: 3.1, aluminium: 3.1, steel: 3.1 }, rAl: { pvc: null, aluminium: null, steel: null }, zeCu085: { pvc: 2.7, steel: 2.7 }, provenance: { ...T9_CHECKED, rAl: 'from memory' } },
  { size: '12 AWG', areaCmil: 6530, xl: { pvc: 0.054, aluminium: 0.054, steel: 0.068 }, rCu: { pvc: 2.0, steel: 2.0 }, rAl: { pvc: 3.2 }, zeCu085: { pvc: 1.7, steel: 1.7 }, provenance: T9_CHECKED },
  { size: '10 AWG', areaCmil: 10380, xl: { pvc: 0.05, aluminium: 0.05, steel: 0.063 }, rCu: { pvc: 1.2, steel: 1.2 }, rAl: { pvc: 2.0 }, zeCu085: { pvc: 1.1, steel: 1.1 }, provenance: T9_CHECKED },
  { size: '8 AWG', areaCmil: 16510, xl: { pvc: 0.052, aluminium: 0.052, steel: 0.065 }, rCu: { pvc: 0.78, steel: 0.78 }, rAl: { pvc: 1.3 }, zeCu085: { pvc: 0.69, steel: 0.7 }, provenance: T9_CHECKED },
  { size: '6 AWG', areaCmil: 26240, xl: { pvc: 0.051, aluminium: 0.051, steel: 0.064 }, rCu: { pvc: 0.49, steel: 0.49 }, rAl: { pvc: 0.81 }, zeCu085: { pvc: 0.44, steel: 0.45 }, provenance: T9_CHECKED },
  { size: '4 AWG', areaCmil: 41740, xl: { pvc: 0.048, aluminium: 0.048, steel: 0.06 }, rCu: { pvc: 0.31, steel: 0.31 }, rAl: { pvc: 0.51 }, zeCu085: { pvc: 0.29, steel: 0.3 }, provenance: T9_CHECKED },
  { size: '3 AWG', areaCmil: 52620, xl: { pvc: 0.047, aluminium: 0.047, steel: 0.059 }, rCu: { pvc: 0.25, steel: 0.25 }, rAl: { pvc: 0.4 }, zeCu085: { pvc: 0.23, steel: 0.24 }, provenance: T9_CHECKED },
  { size: '2 AWG', areaCmil: 66360, xl: { pvc: 0.045, aluminium: 0.045, steel: 0.057 }, rCu: { pvc: 0.19, aluminium: 0.2, steel: 0.2 }, rAl: { pvc: 0.32 }, zeCu085: { pvc: 0.19, steel: 0.2 }, provenance: T9_CHECKED },
  { size: '1 AWG', areaCmil: 83690, xl: { pvc: 0.046, aluminium: 0.046, steel: 0.057 }, rCu: { pvc: 0.15, aluminium: 0.16, steel: 0.16 }, rAl: { pvc: 0.25 }, zeCu085: { pvc: 0.16, steel: 0.16 }, provenance: T9_CHECKED },
  { size: '1/0 AWG', areaCmil: 105600, xl: { pvc: 0.044, aluminium: 0.044, steel: 0.055 }, rCu: { pvc: 0.12, aluminium: 0.13, steel: 0.12 }, rAl: { pvc: 0.2 }, zeCu085: { pvc: 0.13, steel: 0.13 }, provenance: T9_CHECKED },
  { size: '2/0 AWG', areaCmil: 133100, xl: { pvc: 0.043, aluminium: 0.043, steel: 0.054 }, rCu: { pvc: 0.1, steel: 0.1 }, rAl: { pvc: 0.16 }, zeCu085: { pvc: 0.11, steel: 0.11 }, provenance: T9_ZE_PVC_ONE_COPY },
  { size: '3/0 AWG', areaCmil: 167800, xl: { pvc: 0.042, aluminium: 0.042, steel: 0.052 }, rCu: { pvc: 0.077, aluminium: 0.082, steel: 0.079 }, rAl: { pvc: 0.13 }, zeCu085: { pvc: 0.088, steel: 0.094 }, provenance: T9_ZE_PVC_ONE_COPY },
  { size: '4/0 AWG', areaCmil: 211600, xl: { pvc: 0.041, aluminium: 0.041, steel: 0.051 }, rCu: { pvc: 0.062, aluminium: 0.067, steel: 0.063 }, rAl: { pvc: 0.1 }, zeCu085: { pvc: 0.074, steel: 0.08 }, provenance: T9_ZE_PVC_ONE_COPY },
  { size: '250 kcmil', areaCmil: 250000, xl: { pvc: 0.041, aluminium: 0.041, steel: 0.052 }, rCu: { pvc: 0.052, aluminium: 0.057, steel: 0.054 }, rAl: { pvc: 0.085, steel: 0.086 }, zeCu085: { pvc: 0.066, steel: 0.073 }, provenance: T9_ZE_PVC_ONE_COPY },
  { size: '300 kcmil', areaCmil: 300000, xl: { pvc: 0.041, aluminium: 0.041, steel: 0.051 }, rCu: { pvc: 0.044, steel: 0.045 }, rAl: { pvc: 0.071 }, zeCu085: { pvc: 0.059, steel: 0.065 }, provenance: T9_ZE_PVC_ONE_COPY },
  { size: '350 kcmil', areaCmil: 350000, xl: { pvc: 0.04, aluminium: 0.04, steel: 0.05 }, rCu: { pvc: 0.038, steel: 0.039 }, rAl: { pvc: 0.061 }, zeCu085: { pvc: 0.053, steel: 0.06 }, provenance: T9_ZE_PVC_ONE_COPY },
  { size: '400 kcmil', areaCmil: 400000, xl: { pvc: 0.04, aluminium: 0.04, steel: 0.049 }, rCu: { pvc: 0.033, steel: 0.035 }, rAl: { pvc: 0.054 }, zeCu085: { pvc: 0.049, steel: 0.056 }, provenance: T9_ZE_PVC_ONE_COPY },
  { size: '500 kcmil', areaCmil: 500000, xl: { pvc: 0.039, aluminium: 0.039, steel: 0.048 }, rCu: { pvc: 0.027, aluminium: 0.032, steel: 0.029 }, rAl: { pvc: 0.043, steel: 0.045 }, zeCu085: { pvc: 0.043, steel: 0.05 }, provenance: T9_ZE_PVC_ONE_COPY },
];

/** Power factor at which Table 9 prints its effective-Z columns. */
export const NEC_TABLE_9_ZE_POWER_FACTOR = 0.85;
