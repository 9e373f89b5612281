/**
 * What a bank on a bus draws from the charger while the supply is on, per chemistry, and the
 * charge-return factor the charger sizing uses.
 *
 * Units: `floatCurrentPerAh` in A per Ah of rated capacity (A/Ah, i.e. mA/Ah ÷ 1000) at the
 * chemistry's float voltage and 25 °C; `chargeReturnFactor` dimensionless (Ah put in per Ah taken out).
 *
 * Sources and provenance marks:
 * - Float current: VRLA and gel makers' datasheets give about 1 mA/Ah at float on a fully charged
 *   block at 25 °C (common practice; it roughly doubles for every 10 °C warmer); flooded lead-calcium
 *   cells somewhat less (from memory); NiCd about 1–2 mA/Ah (from memory). Lithium cells are not
 *   floated: the figure is the self-discharge (about 3 % a month) the charger or BMS tops up,
 *   0.03 ÷ 730 h ≈ 0.04 mA/Ah (common practice). Users see "typical value: use the maker's figure".
 * - Charge-return factor: IEEE Std 946 (DC auxiliary power systems for stationary applications),
 *   charger sizing A = L + k·C/H with k = 1.1 for lead-acid (from memory, corroborated by charger
 *   sizing guides that name a 10 % IEEE 946 margin, and by a published UPS charger-sizing guide whose
 *   recharge factor is 1.1–1.15: 100 Ah × 1.15 ÷ 8 h + 16.7 A = 31 A, tests/modes/charger-reference.test.ts); NiCd 1.4 (from memory, the value sizing guides
 *   give for NiCd's lower charge efficiency); lithium 1.05 (common practice: coulombic efficiency
 *   near 99 %, a margin kept).
 */
import type { Chemistry } from './battery-chemistries.ts';

export interface StandbyChargeValues {
  /** Float current, A per Ah of rated capacity (at float voltage, 25 °C). */
  readonly floatCurrentPerAh: number;
  /** Charge put back per charge taken out, for the charger sizing (IEEE 946's k). */
  readonly chargeReturnFactor: number;
  readonly provenance: { readonly floatCurrentPerAh: string; readonly chargeReturnFactor: string };
}

const LEAD_K = 'from memory (IEEE Std 946 charger sizing, k = 1.1 for lead-acid)';

export const STANDBY_CHARGE: Readonly<Record<Chemistry, StandbyChargeValues>> = {
  'flooded-lead-acid': { floatCurrentPerAh: 0.0007, chargeReturnFactor: 1.1, provenance: { floatCurrentPerAh: 'from memory (lead-calcium cells at float, 25 °C)', chargeReturnFactor: LEAD_K } },
  'vrla-agm': { floatCurrentPerAh: 0.001, chargeReturnFactor: 1.1, provenance: { floatCurrentPerAh: 'common practice (about 1 mA/Ah at float, 25 °C, in VRLA datasheets)', chargeReturnFactor: LEAD_K } },
  gel: { floatCurrentPerAh: 0.001, chargeReturnFactor: 1.1, provenance: { floatCurrentPerAh: 'common practice (about 1 mA/Ah at float, 25 °C, in gel datasheets)', chargeReturnFactor: LEAD_K } },
  lifepo4: { floatCurrentPerAh: 0.00004, chargeReturnFactor: 1.05, provenance: { floatCurrentPerAh: 'common practice (self-discharge about 3 % a month topped up)', chargeReturnFactor: 'common practice (coulombic efficiency near 99 %)' } },
  nmc: { floatCurrentPerAh: 0.00004, chargeReturnFactor: 1.05, provenance: { floatCurrentPerAh: 'common practice (self-discharge about 3 % a month topped up)', chargeReturnFactor: 'common practice (coulombic efficiency near 99 %)' } },
  nicd: { floatCurrentPerAh: 0.0015, chargeReturnFactor: 1.4, provenance: { floatCurrentPerAh: 'from memory (1–2 mA/Ah at float)', chargeReturnFactor: 'from memory (NiCd charge-return factor in charger sizing guides)' } },
};
