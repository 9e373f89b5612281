/**
 * The charge to put back after an outage (IEEE Std 946's C in A = L + k·C/H, core/studies/modes/study.ts):
 * the user's `standby.rechargeAh`; else, when the project has a battery backup study, the charge its outage
 * drew from the bank (the on-battery discharge's Ah out of the terminals); else the bank's rated capacity.
 * The working says which.
 */
import { describe, expect, it } from 'vitest';
import { solvedOf } from '../core/solved.ts';
import { runModesStudy } from '../../core/studies/modes/study.ts';
import { runBackupStudy } from '../../core/studies/backup/study.ts';
import { formatModesStudy } from '../../core/studies/modes/text-report.ts';
import { dcPlant } from './dc-plant-fixture.ts';

// The plant (dc-plant-fixture.ts), recharged in 8 h.
const plant = (extra: Record<string, unknown> = {}) => dcPlant({ standby: { targetRechargeHours: 8 }, ...extra });

const chargerOf = (p: unknown) => {
  const s = runModesStudy(solvedOf(p));
  if (!s?.ok) throw new Error('the modes study failed');
  return s.study.charger;
};

describe('the charge to put back', () => {
  it('without a backup study: the bank’s rated capacity', () => {
    const c = chargerOf(plant());
    expect(c.rechargeAhFrom).toBe('bank capacity');
    // C = 200 Ah (the bank's rating); k·C/H = 1.15 × 200 ÷ 8 = 28.75 A (flooded lead-acid k, core/data/standby-charge.ts).
    expect(c.rechargeAh).toBe(200);
    expect(c.rechargeCurrent).toBeCloseTo((c.chargeReturnFactor * 200) / 8, 9);
  });

  it('with a backup study: the charge its outage drew from the bank, said in the working', () => {
    // A 2-hour outage of the 30 A radio at 60 s steps: the bank gives 30 A the whole time (a constant-current
    // load), so it gives 30 A × 2 h = 60 Ah (hand calculation, Ah = ∫I dt).
    const p = plant({ backup: { profile: { kind: 'constant' }, timeStepSeconds: 60, horizonHours: 2, temperatureC: 25 } });
    const solved = solvedOf(p);
    const backup = runBackupStudy(solved);
    if (!backup.ok) throw new Error('the backup study failed');
    expect(backup.study.mode).toBe('battery');
    expect(backup.study.discharge.deliveredAh).toBeCloseTo(60, 6);
    const s = runModesStudy(solved);
    if (!s?.ok) throw new Error('the modes study failed');
    const c = s.study.charger;
    expect(c.rechargeAhFrom).toBe('backup study');
    expect(c.rechargeAh).toBe(backup.study.discharge.deliveredAh);
    // k·C/H = k × 60 Ah ÷ 8 h; A = L (30 A of radio) + that (IEEE Std 946).
    expect(c.rechargeCurrent).toBeCloseTo((c.chargeReturnFactor * 60) / 8, 6);
    expect(c.requiredCurrent).toBeCloseTo(30 + (c.chargeReturnFactor * 60) / 8, 6);
    expect(formatModesStudy(s.study)).toContain('C = 60 Ah (drawn from the bank in the backup study’s outage)');
    // A caller that has run the backup study hands its figure on: the same sizing.
    const handed = runModesStudy(solved, undefined, { dischargeAh: backup.study.discharge.deliveredAh });
    if (!handed?.ok) throw new Error('the modes study failed');
    expect(handed.study.charger).toEqual(c);
    // The recharge case balances as the modes do.
    expect(s.study.supply.balanceError).toBeLessThanOrEqual(1e-9);
  });

  it('the user’s figure wins over both', () => {
    const c = chargerOf(plant({ standby: { targetRechargeHours: 8, rechargeAh: 50 }, backup: { profile: { kind: 'constant' }, timeStepSeconds: 60, horizonHours: 2, temperatureC: 25 } }));
    expect(c.rechargeAhFrom).toBe('given');
    expect(c.rechargeAh).toBe(50);
  });
});
