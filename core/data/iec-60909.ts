/**
 * IEC 60909-0 (short-circuit currents in three-phase a.c. systems), the figures the equivalent
 * voltage source method needs.
 *
 * Source: IEC 60909-0:2016, Table 1 (voltage factor c) and clause 6.3.3 (correction factor K_T
 * of network transformers, K_T = 0.95·c_max / (1 + 0.6·x_T)), and 6.2 (R_Q = 0.1·X_Q,
 * X_Q = 0.995·Z_Q for a network feeder when its R is not known).
 * Provenance: Table 1 low-voltage values and K_T "corroborated" (recalled, and agreeing with the
 * pandapower documentation, doc/shortcircuit/correction.rst and branch_elements.rst); the
 * feeder R/X rule "from memory".
 *
 * Units: dimensionless factors; voltages in V.
 */
import type { Provenance } from './conductor-materials.ts';

export interface VoltageFactorRow {
  /** Upper end of the nominal voltage band, V (line-to-line). */
  readonly maxNominalVoltage: number;
  /** System voltage tolerance this row is for, % (low voltage only; null above 1 kV). */
  readonly tolerancePercent: 6 | 10 | null;
  /** c_max, for the largest short-circuit currents (device breaking capacity). */
  readonly cMax: number;
  /** c_min, for the smallest short-circuit currents (protection pick-up). */
  readonly cMin: number;
  readonly provenance: Provenance;
}

export const IEC_60909_VOLTAGE_FACTORS: readonly VoltageFactorRow[] = [
  { maxNominalVoltage: 1000, tolerancePercent: 6, cMax: 1.05, cMin: 0.95, provenance: 'corroborated' },
  { maxNominalVoltage: 1000, tolerancePercent: 10, cMax: 1.1, cMin: 0.95, provenance: 'corroborated' },
  { maxNominalVoltage: Infinity, tolerancePercent: null, cMax: 1.1, cMin: 1.0, provenance: 'corroborated' },
];

/** K_T = KT_NUMERATOR·c_max / (1 + KT_XT_COEFFICIENT·x_T) (IEC 60909-0:2016 6.3.3, eq. 12a). */
export const KT_NUMERATOR = 0.95;
export const KT_XT_COEFFICIENT = 0.6;

/** Network feeder without a known R: R_Q/X_Q = 0.1 (IEC 60909-0 6.2, from memory). */
export const FEEDER_R_OVER_X = 0.1;
