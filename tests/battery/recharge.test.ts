/**
 * Recharge (core/studies/backup/recharge.ts): CC-CV recharge time worked by hand from the closed forms of
 * the model (constant current: ΔSoC·C ÷ (η·I); exponential taper: τ·ln of the ratio of the charge
 * still lacking), the standing load carried by the charger, the charge-rate cap, the AC input, the
 * charger for a target time, and refusals of bad input.
 *
 * The banks and chargers are invented scenarios. The chemistry charge profiles are common practice
 * (no source), as stated in recharge.ts; the expected figures are computed by hand from the model.
 */
import { describe, expect, it } from 'vitest';
import {
  CHARGE_PROFILES,
  chargerForTargetTime,
  rechargeTime,
  type Recharge,
  type RechargeInput,
} from '../../core/studies/backup/recharge.ts';

function ok(input: RechargeInput): Recharge {
  const r = rechargeTime(input);
  if (!r.ok) throw new Error(r.problems.map((p) => `${p.field}: ${p.message}`).join('\n'));
  return r.recharge;
}
const H = 3600;

// Invented scenario: a 16-cell LiFePO4 bank of 200 Ah at a telecom cabinet, left at 20 % after an
// outage; a 55 A charger that also carries the cabinet's 5 A standing load.
const lfp: RechargeInput = {
  chemistry: 'lifepo4',
  capacity: 200,
  seriesCells: 16,
  startSoc: 0.2,
  chargerCurrent: 55,
  standingLoad: { current: 5 },
};

describe('CC-CV recharge worked by hand', () => {
  it('LiFePO4, 200 Ah, from 20 %, 55 A charger carrying a 5 A load', () => {
    // Profile (common practice): CV at 95 % when charged at 0.5 C, termination 0.05 C, η = 0.99.
    //   τ = (1 − 0.95) ÷ (0.99 × 0.5) = 0.1010101 h = 363.636 s
    //   bank current I = 55 − 5 = 50 A (below the 0.5 C = 100 A cap)
    //   s_cv = 1 − η·I·τ/C = 1 − 0.99 × 50 × 0.1010101 ÷ 200 = 1 − 0.025 = 0.975
    //   T_cc = (0.975 − 0.20) × 200 ÷ (0.99 × 50) = 155 ÷ 49.5 = 3.131313 h = 11 272.73 s
    //   s_end = 1 − (1 − 0.95) × 0.05/0.5 = 0.995
    //   T_cv = τ·ln((1 − 0.975)/(1 − 0.995)) = 0.1010101 × ln 5 = 0.162570 h = 585.25 s
    //   total 3.293883 h = 11 857.98 s
    //   bank current at the end: (1 − 0.995) × 200 ÷ (0.99 × 0.1010101) = 10 A = 0.05 C
    //   charge in = 50 × 3.131313 + τ × (50 − 10) = 156.5657 + 4.0404 = 160.6061 Ah
    //   AC: charge voltage 16 × 3.55 = 56.8 V; peak 56.8 × 55 ÷ 0.9 = 3471.11 W;
    //       energy 56.8 × (160.6061 + 5 × 3.293883) ÷ 0.9 = 11 175.43 Wh
    const r = ok(lfp);
    expect(r.timeConstant).toBeCloseTo(363.636, 2);
    expect(r.bankCurrent).toBe(50);
    expect(r.transitionSoc).toBeCloseTo(0.975, 12);
    expect(r.constantCurrentTime).toBeCloseTo(11272.73, 1);
    expect(r.endSoc).toBeCloseTo(0.995, 12);
    expect(r.constantVoltageTime).toBeCloseTo(585.25, 1);
    expect(r.time).toBeCloseTo(3.293883 * H, 0);
    expect(r.endCurrent).toBeCloseTo(10, 9);
    expect(r.chargeIn).toBeCloseTo(160.6061, 3);
    expect(r.acInputPower).toBeCloseTo(3471.11, 1);
    expect(r.acInputEnergyWh).toBeCloseTo(11175.43, 1);
    expect(r.warnings).toEqual([]);
    expect(r.cautions.join(' ')).toMatch(/local codes and licensed practice/);
    expect(r.cautions.join(' ')).toMatch(/below 0 °C/);
  });

  it('flooded lead-acid, charger above the maximum charge rate, load given in W', () => {
    // 24 cells (48 V nominal), 400 Ah, from 50 %; 120 A charger; 1200 W load ÷ 48 V = 25 A.
    // Profile (common practice): CV at 80 % at 0.1 C, termination 0.02 C, η = 0.85.
    //   charger − load = 95 A, capped at 0.2 C × 400 = 80 A (preset maximum charge rate)
    //   τ = 0.2 ÷ (0.85 × 0.1) = 2.352941 h
    //   s_cv = 1 − 0.85 × 80 × 2.352941 ÷ 400 = 1 − 0.4 = 0.6
    //   T_cc = (0.6 − 0.5) × 400 ÷ (0.85 × 80) = 40 ÷ 68 = 0.588235 h
    //   s_end = 1 − 0.2 × 0.02/0.1 = 0.96
    //   T_cv = 2.352941 × ln(0.4/0.04) = 2.352941 × 2.302585 = 5.417847 h
    //   total 6.006082 h
    const r = ok({
      chemistry: 'flooded-lead-acid',
      capacity: 400,
      seriesCells: 24,
      startSoc: 0.5,
      chargerCurrent: 120,
      standingLoad: { power: 1200 },
    });
    expect(r.loadCurrent).toBeCloseTo(25, 12);
    expect(r.bankCurrent).toBeCloseTo(80, 12);
    expect(r.transitionSoc).toBeCloseTo(0.6, 12);
    expect(r.constantCurrentTime / H).toBeCloseTo(0.588235, 5);
    expect(r.constantVoltageTime / H).toBeCloseTo(5.417847, 5);
    expect(r.time / H).toBeCloseTo(6.006082, 5);
    expect(r.endSoc).toBeCloseTo(0.96, 12);
    expect(r.warnings.join(' ')).toMatch(/maximum charge rate/);
  });

  it('a bank above its transition state of charge tapers only: T = τ·ln 2 from 99 % to 99.5 % (LiFePO4)', () => {
    // Acceptance at 99 %: (1 − 0.99) × 200 ÷ (0.99 × 0.1010101) = 20 A < 50 A: CV from the start.
    const r = ok({ ...lfp, startSoc: 0.99 });
    expect(r.constantCurrentTime).toBe(0);
    expect(r.constantVoltageTime).toBeCloseTo(363.636 * Math.log(2), 1);
  });

  it('a target inside the CC stage: 20 % → 80 % at 50 A is 0.6 × 200 ÷ (0.99 × 50) = 2.424242 h', () => {
    const r = ok({ ...lfp, targetSoc: 0.8 });
    expect(r.constantVoltageTime).toBe(0);
    expect(r.time / H).toBeCloseTo(2.424242, 5);
    expect(r.endSoc).toBe(0.8);
  });

  it('a target between the transition and termination: CV stops at τ·ln((1 − 0.975)/(1 − 0.99)) = τ·ln 2.5', () => {
    const r = ok({ ...lfp, targetSoc: 0.99 });
    expect(r.constantVoltageTime).toBeCloseTo(363.636 * Math.log(2.5), 1);
  });

  it('a bank already charged needs no time and says so', () => {
    const r = ok({ ...lfp, startSoc: 1 });
    expect(r.time).toBe(0);
    expect(r.warnings.join(' ')).toMatch(/no recharge is needed/);
  });

  it('every chemistry has a complete charge profile (common practice, no source)', () => {
    for (const p of Object.values(CHARGE_PROFILES)) {
      expect(p.terminationCRate).toBeLessThan(p.referenceCRate);
      expect(p.cvTransitionSoc).toBeGreaterThan(0);
      expect(p.cvTransitionSoc).toBeLessThan(1);
      expect(p.chargeEfficiency).toBeGreaterThan(0);
      expect(p.chargeEfficiency).toBeLessThanOrEqual(1);
    }
  });
});

describe('charger for a target time', () => {
  it('round-trips: the charger found for the hand case\u2019s time is the 55 A of the hand case', () => {
    const c = chargerForTargetTime({ ...lfp, targetTime: 3.293883 * H });
    expect(c.ok).toBe(true);
    if (!c.ok) return;
    expect(c.charger.chargerCurrent).toBeCloseTo(55, 3); // hand case above
    expect(c.charger.recharge.time).toBeLessThanOrEqual(3.293883 * H * (1 + 1e-9));
  });

  it('4 h for the same bank: the recharge with the charger found takes 4 h', () => {
    const c = chargerForTargetTime({ ...lfp, targetTime: 4 * H });
    if (!c.ok) throw new Error('no charger');
    expect(c.charger.recharge.time / H).toBeCloseTo(4, 6);
    // The hand formula at that charger: T = (s_cv − 0.2)·200/(0.99·I) + τ·ln((1 − s_cv)/0.005).
    const I = c.charger.chargerCurrent - 5;
    const tau = 0.05 / (0.99 * 0.5);
    const sCv = 1 - (0.99 * I * tau) / 200;
    expect(((sCv - 0.2) * 200) / (0.99 * I) + tau * Math.log((1 - sCv) / 0.005)).toBeCloseTo(4, 6);
  });

  it('says when no charger can make it (bank limited by its maximum charge rate)', () => {
    // Fastest: 100 A (0.5 C): s_cv = 0.95; T = 0.75 × 200 ÷ 99 + τ·ln(0.05/0.005) = 1.515152 + 0.232583 h.
    const c = chargerForTargetTime({ ...lfp, targetTime: 1 * H });
    expect(c.ok).toBe(false);
    if (c.ok) return;
    expect(c.problems[0]!.code).toBe('not-achievable');
    expect(c.problems[0]!.field).toBe('backup.targetRechargeHours');
    expect(c.problems[0]!.message).toMatch(/1\.748 h/);
  });
});

describe('bad input gets a problem naming the field', () => {
  const expectProblem = (input: RechargeInput, field: string, code: string, message: RegExp) => {
    const r = rechargeTime({ elementId: 'bank1', ...input });
    expect(r.ok).toBe(false);
    if (r.ok) return;
    const p = r.problems.find((x) => x.field === field);
    expect(p, JSON.stringify(r.problems)).toBeDefined();
    expect(p!.code).toBe(code);
    expect(p!.elementId).toBe('bank1');
    expect(p!.message).toMatch(message);
  };

  it('a charger that cannot carry the standing load', () => {
    expectProblem({ ...lfp, chargerCurrent: 5 }, 'backup.chargerCurrent', 'charger-too-small', /cannot even carry the standing load/);
    expectProblem({ ...lfp, chargerCurrent: 4 }, 'backup.chargerCurrent', 'charger-too-small', /above 5 A is needed/);
  });
  it('zero charger current', () => expectProblem({ ...lfp, chargerCurrent: 0 }, 'backup.chargerCurrent', 'invalid-value', /greater than 0 A/));
  it('lithium below its minimum charge temperature (0 °C, cell makers; common practice)', () => {
    expectProblem({ ...lfp, temperature: -1 }, 'backup.temperatureC', 'charge-too-cold', /must not be charged below 0 °C/);
    expectProblem({ ...lfp, chemistry: 'nmc', temperature: -5 }, 'backup.temperatureC', 'charge-too-cold', /below 0 °C/);
  });
  it('lead-acid may be charged at −10 °C (preset minimum −20 °C, common practice)', () => {
    expect(rechargeTime({ ...lfp, chemistry: 'vrla-agm', temperature: -10 }).ok).toBe(true);
  });
  it('start state of charge above 1', () => expectProblem({ ...lfp, startSoc: 1.2 }, 'backup.startSoc', 'invalid-value', /between 0 and 1/));
  it('zero capacity', () => expectProblem({ ...lfp, capacity: 0 }, 'bank.capacityAh', 'invalid-value', /greater than 0 Ah/));
  it('charger efficiency above 1', () => expectProblem({ ...lfp, chargerEfficiency: 1.1 }, 'backup.chargerEfficiency', 'invalid-value', /at most 1/));
  it('termination current above the reference rate', () =>
    expectProblem({ ...lfp, chargeProfile: { terminationCRate: 0.6 } }, 'backup.chargeProfile.terminationCRate', 'invalid-value', /below the reference/));
  it('a target above the termination state of charge', () =>
    expectProblem({ ...lfp, targetSoc: 0.999 }, 'backup.targetSoc', 'not-achievable', /terminates at 99\.5 %/));
  it('negative standing load', () => expectProblem({ ...lfp, standingLoad: { power: -10 } }, 'backup.profile', 'invalid-value', /at least 0 W/));
  it('unknown chemistry', () => expectProblem({ ...lfp, chemistry: 'lead-carbon' }, 'bank.chemistry', 'unknown-chemistry', /unknown chemistry/));
  it('zero or negative target time for the charger', () => {
    const r = chargerForTargetTime({ ...lfp, targetTime: -1 });
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.problems[0]!.field).toBe('backup.targetRechargeHours');
  });
});
