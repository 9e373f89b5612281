/**
 * Conductor materials: resistivity at 20 °C and temperature coefficients of resistance, and the
 * provenance marks used by every conductor table in core/data/.
 *
 * Sources (per row, field `source`):
 * - IEC 60028 (1925), "International standard of resistance for copper": annealed copper at 20 °C
 *   has resistivity 1/58 Ω·mm²/m (conductivity 58 MS/m, 100 % IACS).
 * - K. C. Agrawal, *Industrial Power Engineering and Applications Handbook*, p. 970: α₂₀ of copper
 *   (100 % IACS) 0.00393 /K; commercial aluminium for electrical use 61 % IACS, volume conductivity
 *   34.8 m/(Ω·mm²), α₂₀ 0.00403 /K.
 * - IEC 60889 hard-drawn aluminium wire: ρ₂₀ = 0.028264 Ω·mm²/m (from memory).
 * - IEC 60364-5-52:2009 Annex G: service resistivity ρ₁ = 1.25·ρ₂₀ (kept in iec-60364-5-52.ts).
 * - NEC Chapter 9 Table 8 Note 2: α referred to 75 °C (kept in nec-chapter9.ts).
 * - IEC 60228 k_t convention α₂₀ = 0.004 /K (kept in iec-60228.ts).
 *
 * Units: resistivity in Ω·m (SI, field `rho20OhmM`) and, as printed, in Ω·mm²/m (`rho20OhmMm2PerM`);
 * `alpha20PerK` is the temperature coefficient of resistance referred to 20 °C, in 1/K, used as
 * R_T = R₂₀·[1 + α₂₀·(T − 20)] (linear resistance–temperature law);
 * `inferredZeroC` is the temperature (°C, negative) at which that straight line reaches zero
 * resistance, so R₂/R₁ = (|T₀| + T₂)/(|T₀| + T₁) (the "234.5" rule for copper).
 */

/**
 * How far a value has been checked, shared by every conductor table in core/data/:
 * - `confirmed`: seen in a published copy of the standard or handbook named in the file header
 *   (often a public copy; the NEC values come from a machine-read (OCR) copy).
 * - `corroborated`: recalled, and it agrees with one public copy; weaker than confirmed.
 * - `from memory`: recalled, not yet seen in a published copy; check against the printed standard
 *   before relying on it.
 * - `computed`: derived from confirmed inputs with the formula named beside it.
 * - `common practice`: a typical value, not a published one.
 */
export type Provenance = 'confirmed' | 'corroborated' | 'from memory' | 'computed' | 'common practice';

export type ConductorMaterial = 'Cu' | 'Al';

export interface ConductorMaterialRow {
  readonly material: ConductorMaterial;
  /** What grade the row describes. */
  readonly grade: string;
  /** Conductivity in % of the International Annealed Copper Standard. */
  readonly iacsPercent: number;
  /** Resistivity at 20 °C, Ω·m (SI). */
  readonly rho20OhmM: number;
  /** Resistivity at 20 °C, Ω·mm²/m, as printed in the source. */
  readonly rho20OhmMm2PerM: number;
  readonly rho20Provenance: Provenance;
  /** Temperature coefficient of resistance referred to 20 °C, 1/K. */
  readonly alpha20PerK: number;
  readonly alpha20Provenance: Provenance;
  /** Inferred zero-resistance temperature, °C (the "234.5" rule for copper). From memory. */
  readonly inferredZeroC: number;
  readonly inferredZeroProvenance: Provenance;
  readonly source: string;
  /** What to watch for when using the row. */
  readonly note: string;
}

export const CONDUCTOR_MATERIALS: readonly ConductorMaterialRow[] = [
  {
    material: 'Cu',
    grade: 'annealed copper, 100 % IACS (IEC 60028 standard copper)',
    iacsPercent: 100,
    // 1/58 Ω·mm²/m = 1/58 × 1e-6 Ω·m
    rho20OhmM: 1 / 58e6,
    rho20OhmMm2PerM: 1 / 58,
    rho20Provenance: 'confirmed',
    alpha20PerK: 0.00393,
    alpha20Provenance: 'confirmed',
    inferredZeroC: -234.5,
    inferredZeroProvenance: 'from memory',
    source: 'IEC 60028:1925 (resistivity); Agrawal, Industrial Power Engineering and Applications Handbook, p. 970 (α₂₀)',
    note: 'α₂₀/(1 + 55·α₂₀) = 0.00323 /K, the NEC Chapter 9 Table 8 Note 2 coefficient referred to 75 °C.',
  },
  {
    material: 'Al',
    grade: 'commercial electrical aluminium, 61 % IACS',
    iacsPercent: 61,
    // 1/34.8 Ω·mm²/m (volume conductivity 34.8 m/(Ω·mm²))
    rho20OhmM: 1 / 34.8e6,
    rho20OhmMm2PerM: 1 / 34.8,
    rho20Provenance: 'confirmed',
    alpha20PerK: 0.00403,
    alpha20Provenance: 'confirmed',
    inferredZeroC: -228.1,
    inferredZeroProvenance: 'from memory',
    source: 'Agrawal, Industrial Power Engineering and Applications Handbook, p. 970',
    note:
      'The handbook gives both 61 % IACS and 34.8 m/(Ω·mm²); 34.8/58 is 60.0 % IACS, and 61 % of 58 would be ' +
      '35.4 m/(Ω·mm²) (ρ₂₀ = 0.028264 Ω·mm²/m, the IEC 60889 figure). The printed 34.8 is kept; the two differ by 1.7 %.',
  },
];

/** IEC 60889 hard-drawn aluminium wire, ρ₂₀ in Ω·mm²/m (61 % IACS). From memory. */
export const IEC_60889_AL_RHO20_OHM_MM2_PER_M = 0.028264;
export const IEC_60889_AL_RHO20_PROVENANCE: Provenance = 'from memory';
