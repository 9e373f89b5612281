/**
 * IEC 60228 Ed. 3 (2004), Conductors of insulated cables: maximum DC resistance at 20 °C of
 * class 2 (stranded) conductors.
 *
 * Source: IEC 60228:2004 Table 2 (class 2 stranded conductors; table number from memory), values
 * confirmed against three independent published copies of the table. Aluminium class 2 conductors start at 10 mm²; the
 * standard gives no aluminium values for 1.5–6 mm² (`null`). Class 1 (solid) copper differs at
 * large sizes (185 mm²: 0.101, 240 mm²: 0.0775 Ω/km); do not mix the classes.
 *
 * Units: `sizeMm2` nominal cross-sectional area in mm²; resistances in Ω/km at 20 °C, maxima.
 * Columns: `cuPlain` annealed plain copper; `cuCoated` metal-coated (tinned) annealed copper;
 * `al` aluminium or aluminium alloy.
 *
 * Temperature correction (IEC 60228 annex convention): R₂₀ = R_t·k_t with k_t = 250/(230 + t),
 * i.e. R_t = R₂₀·(230 + t)/250, equivalent to α₂₀ = 0.004 /K. The k_t values at 30 / 70 / 90 °C
 * are confirmed in a published copy (IEC_60228_KT); the formula form is computed from them.
 */
import type { Provenance } from './conductor-materials.ts';

export interface Iec60228Row {
  readonly sizeMm2: number;
  readonly cuPlain: number;
  readonly cuCoated: number;
  readonly al: number | null;
  readonly provenance: Provenance;
}

/** IEC 60228:2004 class 2, 1.5 to 240 mm², smallest first. */
export const IEC_60228_CLASS2: readonly Iec60228Row[] = [
  { sizeMm2: 1.5, cuPlain: 12.1, cuCoated: 12.2, al: null, provenance: 'confirmed' },
  { sizeMm2: 2.5, cuPlain: 7.41, cuCoated: 7.56, al: null, provenance: 'confirmed' },
  { sizeMm2: 4, cuPlain: 4.61, cuCoated: 4.7, al: null, provenance: 'confirmed' },
  { sizeMm2: 6, cuPlain: 3.08, cuCoated: 3.11, al: null, provenance: 'confirmed' },
  { sizeMm2: 10, cuPlain: 1.83, cuCoated: 1.84, al: 3.08, provenance: 'confirmed' },
  { sizeMm2: 16, cuPlain: 1.15, cuCoated: 1.16, al: 1.91, provenance: 'confirmed' },
  { sizeMm2: 25, cuPlain: 0.727, cuCoated: 0.734, al: 1.2, provenance: 'confirmed' },
  { sizeMm2: 35, cuPlain: 0.524, cuCoated: 0.529, al: 0.868, provenance: 'confirmed' },
  { sizeMm2: 50, cuPlain: 0.387, cuCoated: 0.391, al: 0.641, provenance: 'confirmed' },
  { sizeMm2: 70, cuPlain: 0.268, cuCoated: 0.27, al: 0.443, provenance: 'confirmed' },
  { sizeMm2: 95, cuPlain: 0.193, cuCoated: 0.195, al: 0.32, provenance: 'confirmed' },
  { sizeMm2: 120, cuPlain: 0.153, cuCoated: 0.154, al: 0.253, provenance: 'confirmed' },
  { sizeMm2: 150, cuPlain: 0.124, cuCoated: 0.126, al: 0.206, provenance: 'confirmed' },
  { sizeMm2: 185, cuPlain: 0.0991, cuCoated: 0.1, al: 0.164, provenance: 'confirmed' },
  { sizeMm2: 240, cuPlain: 0.0754, cuCoated: 0.0762, al: 0.125, provenance: 'confirmed' },
];

/** Reference temperature of the IEC 60228 resistances, °C. */
export const IEC_60228_REFERENCE_C = 20;

/** α₂₀ implied by the k_t convention, 1/K (k_t = 250/(230 + t) ⇔ 1 + 0.004·(t − 20) = (230 + t)/250). */
export const IEC_60228_ALPHA20_PER_K = 0.004;

export interface Iec60228KtRow {
  /** Conductor temperature, °C. */
  readonly temperatureC: number;
  /** Factor that converts a resistance measured at `temperatureC` to 20 °C (R₂₀ = R_t·k_t). */
  readonly kt: number;
  readonly provenance: Provenance;
}

/** Published k_t values (3 decimals) under the IEC 60228 convention. */
export const IEC_60228_KT: readonly Iec60228KtRow[] = [
  { temperatureC: 30, kt: 0.962, provenance: 'confirmed' },
  { temperatureC: 70, kt: 0.833, provenance: 'confirmed' },
  { temperatureC: 90, kt: 0.781, provenance: 'confirmed' },
];
