/**
 * The IEC 60909-0 figures carried in core/data/iec-60909.ts.
 * Source beside each: IEC 60909-0:2016 Table 1 and clause 6.3.3, corroborated by the pandapower
 * documentation (doc/shortcircuit/correction.rst: c_max 1.05 / 1.10 and c_min 0.95 below 1 kV,
 * 1.10 / 1.00 above; branch_elements.rst: K_T = 0.95·c_max/(1 + 0.6·x_T)).
 */
import { describe, expect, it } from 'vitest';
import { IEC_60909_VOLTAGE_FACTORS, KT_NUMERATOR, KT_XT_COEFFICIENT } from '../../core/data/iec-60909.ts';
import { voltageFactor } from '../../core/studies/surge/faults.ts';

describe('IEC 60909-0 voltage factor c (Table 1)', () => {
  it('low voltage, 6 % tolerance: c_max 1.05, c_min 0.95 (IEC 60909-0:2016 Table 1; pandapower docs)', () => {
    const row = IEC_60909_VOLTAGE_FACTORS.find((r) => r.tolerancePercent === 6)!;
    expect([row.cMax, row.cMin]).toEqual([1.05, 0.95]);
    expect(voltageFactor(400, 6)).toBe(1.05);
  });
  it('low voltage, 10 % tolerance: c_max 1.10, c_min 0.95 (IEC 60909-0:2016 Table 1; pandapower docs)', () => {
    const row = IEC_60909_VOLTAGE_FACTORS.find((r) => r.tolerancePercent === 10)!;
    expect([row.cMax, row.cMin]).toEqual([1.1, 0.95]);
    expect(voltageFactor(230, 10)).toBe(1.1);
  });
  it('above 1 kV: c_max 1.10, c_min 1.00 whatever the LV tolerance (IEC 60909-0:2016 Table 1; pandapower docs)', () => {
    expect(voltageFactor(11000, 6)).toBe(1.1);
    expect(IEC_60909_VOLTAGE_FACTORS.at(-1)!.cMin).toBe(1);
  });
  it('K_T constants 0.95 and 0.6 (IEC 60909-0:2016 6.3.3; pandapower branch_elements.rst)', () => {
    expect([KT_NUMERATOR, KT_XT_COEFFICIENT]).toEqual([0.95, 0.6]);
  });
});
