/**
 * The conductor catalogue: what the sizing engine needs from the cited tables of `core/data/`,
 * in one small shape per system. The tables themselves live in `core/data/` (each with its
 * standard, table and edition); this file only maps their rows into lookups, so the engine does
 * not depend on how a table file lays out its rows. Units: Ω per metre, A, °C.
 *
 * A lookup returns `undefined` where the table has no value (a size a material does not come in,
 * an ambient beyond the correction table, a method without published capacities): the engine
 * turns that into a problem naming the field, never into a guess.
 */
import type { IecInstallationMethod, NecRaceway } from '../model/project.ts';
import { NEC_TABLES } from './nec-adapter.ts';
import { IEC_TABLES } from './iec-adapter.ts';

export type Material = 'copper' | 'aluminium';

export interface SizeEntry {
  /** Label as users write it: "4 AWG", "1/0 AWG", "250 kcmil", "2.5 mm²". */
  readonly label: string;
  /** Cross-section of one conductor, mm². */
  readonly areaMm2: number;
}

/** NEC lookups: Table 310.16, Table 310.15(B)(1)(1), Table 310.15(C)(1), Chapter 9 Tables 8 and 9, 240.6(A), 240.4(D). */
export interface NecTables {
  /** Every size of the ampacity table for the material, smallest first. */
  sizes(material: Material): readonly SizeEntry[];
  /** Table 310.16 allowable ampacity, A (30 °C, ≤ 3 current-carrying conductors). */
  ampacity(material: Material, size: string, rating: 60 | 75 | 90): number | undefined;
  /** Table 310.15(B)(1)(1) ambient correction factor; undefined beyond the table. */
  ambientFactor(rating: 60 | 75 | 90, ambient: number): number | undefined;
  /** Highest ambient the correction table covers for the rating, °C. */
  ambientMax(rating: 60 | 75 | 90): number;
  /** Table 310.15(C)(1) adjustment factor for the number of current-carrying conductors (1 up to 3). */
  adjustmentFactor(count: number): number;
  /** Chapter 9 Table 8 DC resistance of one stranded conductor at 75 °C, Ω/m. */
  dcResistance(material: Material, size: string): number | undefined;
  /** Chapter 9 Table 9 AC resistance at 75 °C, Ω/m, for the raceway; undefined where the table has none. */
  acResistance(material: Material, size: string, raceway: NecRaceway): number | undefined;
  /** Chapter 9 Table 9 reactance X_L at 60 Hz, Ω/m, for the raceway. */
  reactance(size: string, raceway: NecRaceway): number | undefined;
  /** Temperature coefficient referred to 75 °C (Chapter 9 Table 8 Note 2), 1/°C. */
  alpha75(material: Material): number;
  /** 240.6(A) standard ratings of fuses and inverse-time breakers, A, ascending. */
  deviceRatings: readonly number[];
  /** 240.4(D) small-conductor limit on the protective device, A, or undefined. */
  smallConductorLimit(material: Material, size: string): number | undefined;
  /** Edition and table names, for the working shown to users. */
  cite: { ampacity: string; ambient: string; adjustment: string; dcResistance: string; acImpedance: string; devices: string; smallConductor: string };
}

/** IEC lookups: IEC 60228, IEC 60364-5-52 Annex B, IEC 60898-1. */
export interface IecTables {
  /** Every size of IEC 60228 class 2 for the material, smallest first. */
  sizes(material: Material): readonly SizeEntry[];
  /** Current-carrying capacity, A (30 °C air), or undefined where the table has none. */
  capacity(material: Material, insulation: 'pvc' | 'xlpe', method: IecInstallationMethod, loaded: 2 | 3, size: string): number | undefined;
  /** Methods with published capacities for the insulation (and material). */
  methods(material: Material, insulation: 'pvc' | 'xlpe'): readonly IecInstallationMethod[];
  /** Table B.52.14 ambient factor (air); undefined beyond the table. Rows between published ones take the next warmer row. */
  ambientFactor(insulation: 'pvc' | 'xlpe', ambient: number): number | undefined;
  ambientMax(insulation: 'pvc' | 'xlpe'): number;
  /** Table B.52.17 grouping factor (bunched), or undefined beyond the table. */
  groupingFactor(circuits: number): number | undefined;
  groupingMax: number;
  /** IEC 60228 class 2 maximum DC resistance at 20 °C, Ω/m. */
  resistance20(material: Material, size: string): number | undefined;
  /** Temperature coefficient at 20 °C, 1/°C. */
  alpha20(material: Material): number;
  /** Reactance per unit length when unknown (IEC 60364-5-52 Annex G, λ = 0.08 mΩ/m), Ω/m. */
  defaultReactance: number;
  /** Maximum conductor temperature of the insulation in normal service, °C (PVC 70, XLPE 90). */
  maxTemperature(insulation: 'pvc' | 'xlpe'): number;
  /** IEC 60898-1 preferred rated currents, A, ascending. */
  deviceRatings: readonly number[];
  /** IEC 60898-1 conventional tripping current I₂ as a multiple of I_n. */
  breakerI2Multiple: number;
  /** IEC 60269 gG fuse-link rated currents, A, ascending. */
  fuseRatings: readonly number[];
  /** IEC 60269-1 gG conventional fusing current as a multiple of I_n, by rating. */
  fuseI2Multiple(rating: number): number;
  /** IEC 60364-5-52 Annex G service resistivity ρ₁ = 1.25·ρ₂₀, Ω·m. */
  rho1(material: Material): number;
  cite: { capacity: string; ambient: string; grouping: string; resistance: string; devices: string; reactance: string; fuses: string; fuseI2: string; breakerI2: string };
}

export interface ConductorCatalogue {
  nec: NecTables;
  iec: IecTables;
}

/** The catalogue built from `core/data/`. */
export const defaultCatalogue: ConductorCatalogue = { nec: NEC_TABLES, iec: IEC_TABLES };

/** Look a size up by its label, forgiving spacing, case and "mm2"/"mm²". */
export function findSize(sizes: readonly SizeEntry[], label: string): number {
  const norm = (s: string) => s.toLowerCase().replace(/mm2$/, 'mm²').replace(/\s+/g, '');
  const want = norm(label);
  return sizes.findIndex((s) => norm(s.label) === want);
}
