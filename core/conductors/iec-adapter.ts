/**
 * Maps the IEC tables of `core/data/` into the lookups of `IecTables` (catalogue.ts). No values
 * here: every number comes from the cited table files.
 */
import type { IecInstallationMethod } from '../model/project.ts';
import type { IecTables, Material, SizeEntry } from './catalogue.ts';
import { IEC_60228_ALPHA20_PER_K, IEC_60228_CLASS2 } from '../data/iec-60228.ts';
import { IEC_60364_5_52_CAPACITIES, IEC_ANNEX_G, IEC_B52_14_AMBIENT, IEC_B52_17_GROUPING, IEC_INSULATION_MAX_C } from '../data/iec-60364-5-52.ts';
import { IEC_60898_1_CONVENTIONAL_TRIPPING, IEC_60898_1_RATED_CURRENTS } from '../data/iec-60898-1.ts';
import { IEC_60269_GG_CONVENTIONAL, IEC_60269_GG_RATED_CURRENTS } from '../data/iec-60269.ts';

const label = (mm2: number) => `${mm2} mm²`;
const rOf = (m: Material, row: (typeof IEC_60228_CLASS2)[number]) => (m === 'copper' ? row.cuPlain : row.al);
const sizesOf = (m: Material): readonly SizeEntry[] => IEC_60228_CLASS2.filter((r) => rOf(m, r) !== null).map((r) => ({ label: label(r.sizeMm2), areaMm2: r.sizeMm2 }));
const SIZES = { copper: sizesOf('copper'), aluminium: sizesOf('aluminium') };
const mat = (m: Material) => (m === 'copper' ? 'Cu' : 'Al');
const ins = (i: 'pvc' | 'xlpe') => (i === 'pvc' ? 'PVC' : 'XLPE');
/** Table B.52.17 item 1: bunched in air, on a surface, embedded or enclosed. */
const BUNCHED = IEC_B52_17_GROUPING.find((r) => r.item === 1)!;

export const IEC_TABLES: IecTables = {
  sizes: (m) => SIZES[m],
  capacity: (m, insulation, method, loaded, size) =>
    IEC_60364_5_52_CAPACITIES.find(
      (r) => r.material === mat(m) && r.insulation === ins(insulation) && r.method === method && r.loadedConductors === loaded && label(r.sizeMm2) === size,
    )?.amps,
  methods: (m, insulation) =>
    [...new Set(IEC_60364_5_52_CAPACITIES.filter((r) => r.material === mat(m) && r.insulation === ins(insulation)).map((r) => r.method as IecInstallationMethod))],
  ambientFactor(insulation, ambient) {
    // Between printed rows: the next warmer row; below the coldest row (10 °C): that row, which
    // understates the capacity (both conservative; common practice).
    const row = IEC_B52_14_AMBIENT.find((r) => ambient <= r.ambientC);
    const f = row?.[insulation];
    return f === null || f === undefined ? undefined : f;
  },
  ambientMax: (insulation) => Math.max(...IEC_B52_14_AMBIENT.filter((r) => r[insulation] !== null).map((r) => r.ambientC)),
  groupingFactor: (circuits) => BUNCHED.factors.find((c) => circuits <= c.circuits)?.factor,
  groupingMax: Math.max(...BUNCHED.factors.map((c) => c.circuits)),
  resistance20: (m, size) => {
    const row = IEC_60228_CLASS2.find((r) => label(r.sizeMm2) === size);
    const v = row ? rOf(m, row) : null;
    return v === null ? undefined : v / 1000;
  },
  alpha20: () => IEC_60228_ALPHA20_PER_K,
  defaultReactance: IEC_ANNEX_G.lambdaOhmPerM,
  maxTemperature: (insulation) => IEC_INSULATION_MAX_C[ins(insulation)],
  deviceRatings: IEC_60898_1_RATED_CURRENTS.map((r) => r.ratedCurrentA),
  breakerI2Multiple: IEC_60898_1_CONVENTIONAL_TRIPPING.multiple,
  fuseRatings: IEC_60269_GG_RATED_CURRENTS,
  fuseI2Multiple: (rating) => IEC_60269_GG_CONVENTIONAL.find((r) => rating > r.fromA && rating <= r.toA)!.fusingMultiple,
  rho1: (m) => IEC_ANNEX_G.rho1OhmM[mat(m)],
  cite: {
    fuses: 'IEC 60269-1 gG fuse-link rated currents',
    fuseI2: 'IEC 60269-1 Table 2, gG conventional fusing current',
    breakerI2: 'IEC 60898-1 conventional tripping current 1.45·I_n',
    capacity: 'IEC 60364-5-52:2009 Annex B',
    ambient: 'IEC 60364-5-52:2009 Table B.52.14',
    grouping: 'IEC 60364-5-52:2009 Table B.52.17 item 1',
    resistance: 'IEC 60228:2004 class 2 at 20 °C, k_t convention α₂₀ = 0.004',
    devices: 'IEC 60898-1 preferred rated currents',
    reactance: 'IEC 60364-5-52 Annex G λ = 0.08 mΩ/m (value used when not otherwise known)',
  },
};
