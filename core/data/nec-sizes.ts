/**
 * NEC conductor size keys, smallest to largest, as used by the NEC tables in core/data/
 * (NFPA 70-2023 Table 310.16 and Chapter 9 Tables 8 and 9 cover 14 AWG to 500 kcmil here).
 *
 * Keys are strings exactly as the sizes are printed, with the unit: '14 AWG', '1/0 AWG',
 * '250 kcmil'. Every NEC row also carries its numeric area (`areaCmil`, circular mils, from
 * NEC Chapter 9 Table 8; see nec-chapter9.ts) so rows can be compared by size.
 * One circular mil is the area of a circle one mil (0.001 in) in diameter: π/4 × (25.4 µm)².
 */
export const NEC_SIZES = [
  '14 AWG',
  '12 AWG',
  '10 AWG',
  '8 AWG',
  '6 AWG',
  '4 AWG',
  '3 AWG',
  '2 AWG',
  '1 AWG',
  '1/0 AWG',
  '2/0 AWG',
  '3/0 AWG',
  '4/0 AWG',
  '250 kcmil',
  '300 kcmil',
  '350 kcmil',
  '400 kcmil',
  '500 kcmil',
] as const;

export type NecSize = (typeof NEC_SIZES)[number];

/** Square metres per circular mil: π/4 × (25.4e-6 m)² (definition of the circular mil). */
export const M2_PER_CMIL = (Math.PI / 4) * 25.4e-6 * 25.4e-6;
