/**
 * Maps the NEC tables of `core/data/` into the lookups of `NecTables` (catalogue.ts). No values
 * here: every number comes from the cited table files.
 */
import type { NecRaceway } from '../model/project.ts';
import type { Material, NecTables, SizeEntry } from './catalogue.ts';
import { M2_PER_CMIL } from '../data/nec-sizes.ts';
import { NEC_240_4_D, NEC_310_16, type NecTempRating } from '../data/nec-310-16.ts';
import { NEC_310_15_B_1_1, NEC_310_15_C_1 } from '../data/nec-310-15.ts';
import { NEC_CHAPTER9_TABLE8, NEC_CHAPTER9_TABLE9, NEC_TABLE_8_ALPHA_75 } from '../data/nec-chapter9.ts';
import { NEC_240_6_A_2023 } from '../data/nec-240-6.ts';

const PER_KFT_TO_PER_M = 1 / 304.8; // Ω per 1000 ft → Ω per m (1000 ft = 304.8 m)
const code = (m: Material) => (m === 'copper' ? 'cu' : 'al');

const sizesOf = (m: Material): readonly SizeEntry[] =>
  NEC_310_16.filter((row) => row[code(m)][75] !== null).map((row) => ({ label: row.size, areaMm2: row.areaCmil * M2_PER_CMIL * 1e6 }));
const SIZES = { copper: sizesOf('copper'), aluminium: sizesOf('aluminium') };

const row16 = (size: string) => NEC_310_16.find((r) => r.size === size);
const row8 = (size: string) => NEC_CHAPTER9_TABLE8.find((r) => r.size === size);
const row9 = (size: string) => NEC_CHAPTER9_TABLE9.find((r) => r.size === size);
const orUndefined = (x: number | null | undefined): number | undefined => (x === null || x === undefined ? undefined : x);

export const NEC_TABLES: NecTables = {
  sizes: (m) => SIZES[m],
  ampacity: (m, size, rating) => orUndefined(row16(size)?.[code(m)][rating]),
  ambientFactor(rating: NecTempRating, ambient: number) {
    // An ambient between printed bands takes the next warmer band (conservative; common practice).
    const band = NEC_310_15_B_1_1.find((r) => ambient <= r.toC);
    return orUndefined(band?.factor[rating]);
  },
  ambientMax: (rating) => Math.max(...NEC_310_15_B_1_1.filter((r) => r.factor[rating] !== null).map((r) => r.toC)),
  adjustmentFactor(count: number) {
    if (count <= 3) return 1;
    const band = NEC_310_15_C_1.find((r) => r.toCount === null || count <= r.toCount);
    return band!.percent / 100;
  },
  dcResistance: (m, size) => {
    const r = row8(size);
    return r ? r[code(m)].stranded * PER_KFT_TO_PER_M : undefined;
  },
  acResistance: (m, size, raceway: NecRaceway) => {
    const r = row9(size);
    const v = orUndefined((m === 'copper' ? r?.rCu : r?.rAl)?.[raceway]);
    return v === undefined ? undefined : v * PER_KFT_TO_PER_M;
  },
  reactance: (size, raceway) => {
    const r = row9(size);
    return r ? r.xl[raceway] * PER_KFT_TO_PER_M : undefined;
  },
  alpha75: (m) => NEC_TABLE_8_ALPHA_75.find((r) => r.material === (m === 'copper' ? 'Cu' : 'Al'))!.alphaPerK,
  deviceRatings: NEC_240_6_A_2023.standardA,
  smallConductorLimit: (m, size) => NEC_240_4_D.find((r) => r.size === size && r.material === (m === 'copper' ? 'Cu' : 'Al'))?.maxOcpdA,
  cite: {
    ampacity: 'NEC 2023 Table 310.16',
    ambient: 'NEC 2023 Table 310.15(B)(1)(1)',
    adjustment: 'NEC 2023 Table 310.15(C)(1)',
    dcResistance: 'NEC 2023 Chapter 9 Table 8, stranded, 75 °C',
    acImpedance: 'NEC Chapter 9 Table 9, 75 °C, 60 Hz',
    devices: 'NEC 2023 240.6(A)',
    // The 240.4(D) limits are carried from memory (core/data/nec-310-16.ts); users read the clause.
    smallConductor: 'NEC 2023 240.4(D)',
  },
};
