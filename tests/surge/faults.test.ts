/**
 * Prospective fault currents: the battery bank worked by hand (Thévenin: V_oc / ΣR), the AC case
 * worked by hand step by step from the IEC 60909-0 equations, device checks, and the refusals of
 * bad input (nothing computed from it).
 */
import { describe, expect, it } from 'vitest';
import { studySurges, type SurgeStudyResult } from '../../core/index.ts';
import { gridTransformerCable, project, pumpOnInverter } from './fixtures.ts';
import { onSolved } from '../core/solved.ts';

function study(p: unknown): SurgeStudyResult {
  const o = onSolved(studySurges, p);
  if (!o.ok) throw new Error(JSON.stringify(o.problems));
  return o.result;
}

describe('battery prospective short-circuit current (worked by hand)', () => {
  const r = study(pumpOnInverter());
  const at = (id: string) => r.batteryFaults.points.find((p) => p.elementId === id)!;

  it('bank terminals: 51.2 V / 0.004 Ω = 12 800 A (I = V_oc / R_internal)', () => {
    expect(at('bank').current).toBeCloseTo(12800, 9);
  });

  it('far end of the 2 m bank cable: R = 2 × 2 m × 0.34 Ω/km = 1.36 mΩ; 51.2 / 5.36 mΩ = 9552.2 A', () => {
    expect(at('bank-cable').impedance).toBeCloseTo(0.00536, 12);
    expect(at('bank-cable').current).toBeCloseTo(51.2 / 0.00536, 6);
  });

  it('a bank spec: R = s × (Ω·Ah ÷ Ah) ÷ p = 16 × (0.5 Ω·Ah ÷ 100 Ah) ÷ 2 = 40 mΩ (datasheet override), I = OCV / R', () => {
    const res = study(
      project('bank spec', [
        { id: 'b', kind: 'battery', bank: { chemistry: 'lifepo4', series: 16, strings: 2, capacityAh: 100, overrides: { internalResistanceOhmAh: 0.5 } } },
        { id: 'l', kind: 'dc-load', from: 'b', power: 100 },
      ]),
    );
    const p = res.batteryFaults.points[0]!;
    expect(p.impedance).toBeCloseTo(0.04, 12);
    expect(p.current).toBeCloseTo(p.voltage / 0.04, 9);
  });

  it('worked at the worst-case voltage, not the backup study’s state of charge: 16 × 3.55 V charge voltage = 56.8 V above the full OCV 16 × 3.40 V = 54.4 V, so 56.8 V / 40 mΩ = 1420 A (preset values, common practice; IEC 61660-1 takes the battery fully charged)', () => {
    const res = study(
      project('bank half charged', [
        { id: 'b', kind: 'battery', bank: { chemistry: 'lifepo4', series: 16, strings: 2, capacityAh: 100, initialSoc: 0.5, overrides: { internalResistanceOhmAh: 0.5 } } },
        { id: 'l', kind: 'dc-load', from: 'b', power: 100 },
      ]),
    );
    const p = res.batteryFaults.points[0]!;
    expect(p.voltage).toBeCloseTo(56.8, 9);
    expect(p.current).toBeCloseTo(1420, 6);
    expect(res.batteryFaults.voltageBasis).toMatch(/the charge voltage 56\.80 V .* above the fully charged open-circuit voltage 54\.40 V \(IEC 61660-1/);
  });

  it('a charge voltage at or below the full OCV: the fully charged open-circuit voltage 54.4 V (IEC 61660-1), 1360 A', () => {
    const res = study(
      project('bank low charge setting', [
        { id: 'b', kind: 'battery', bank: { chemistry: 'lifepo4', series: 16, strings: 2, capacityAh: 100, overrides: { internalResistanceOhmAh: 0.5, chargeCellVoltage: 3.35, floatCellVoltage: 3.35 } } },
        { id: 'l', kind: 'dc-load', from: 'b', power: 100 },
      ]),
    );
    expect(res.batteryFaults.points[0]!.current).toBeCloseTo(54.4 / 0.04, 6);
    expect(res.batteryFaults.voltageBasis).toMatch(/^the fully charged open-circuit voltage 54\.40 V \(IEC 61660-1, battery clause: the battery fully charged\)/);
  });

  it('a battery given by its voltage alone: that voltage, and the result says so', () => {
    expect(r.batteryFaults.voltageBasis).toMatch(/bank voltage as entered, 51\.2 V/);
  });

  it('the bank fuse rated 20 kA covers 12.8 kA; the 10 kA cable breaker at the bank is too weak and needs at least 12.8 kA', () => {
    const fuse = r.devices.find((d) => d.elementId === 'bank')!;
    expect(fuse.status).toBe('adequate');
    const brk = r.devices.find((d) => d.elementId === 'bank-cable')!;
    expect(brk.status).toBe('too-weak');
    expect(brk.requiredRating).toBeCloseTo(12800, 9);
    expect(brk.message).toContain('12.8 kA DC');
  });
});

describe('AC available fault current, IEC 60909-0 (worked by hand)', () => {
  // Working (IEC 60909-0:2016 eqs. for the feeder, the transformer with K_T, and I″k = c·U_n/(√3·|Z_k|)):
  //  feeder:  c = 1.1 (U_n > 1 kV, Table 1); Z_Q = 1.1 × 11 000² / 250 MVA = 0.5324 Ω; X_Q = Z_Q/√1.01 = 0.529758 Ω;
  //           R_Q = 0.1·X_Q = 0.0529758 Ω; referred to 400 V (× (400/11 000)²): R = 7.00506e-5 Ω, X = 7.00506e-4 Ω
  //  transformer: Z_b = 400²/500 kVA = 0.32 Ω; Z_T = 5 % → 0.016 Ω; R_T = 5 kW/500 kVA × 0.32 = 0.0032 Ω;
  //           X_T = √(0.016² − 0.0032²) = 0.0156767 Ω; x_T = 0.0489898; K_T = 0.95 × 1.1/(1 + 0.6 × 0.0489898) = 1.0151605
  //  Z_k (secondary) = 0.00331856 + j0.0166149 Ω, |Z_k| = 0.0169431 Ω
  //  I″k = 1.1 × 400 / (√3 × 0.0169431) = 14 993.4 A
  //  far end of 30 m (0.193 + j0.08 Ω/km): Z_k = 0.00910856 + j0.0190149 Ω → I″k = 12 048.7 A
  const r = study(gridTransformerCable());
  const at = (id: string) => r.acFaults.points.find((p) => p.elementId === id)!;

  it('voltage factor c_max 1.10 for a 10 % tolerance LV system (IEC 60909-0 Table 1)', () => {
    expect(r.acFaults.voltageFactor).toBe(1.1);
  });

  it('transformer secondary: Z_k = 3.31856 + j16.6149 mΩ, I″k = 14.993 kA (hand, above)', () => {
    expect(at('tx').r).toBeCloseTo(0.00331856, 7);
    expect(at('tx').x).toBeCloseTo(0.0166149, 6);
    expect(at('tx').current! / 14993.38).toBeCloseTo(1, 5);
  });

  it('far end of the 30 m cable: I″k = 12.049 kA (hand, above; the 5 m board tail adds 0.5 µΩ)', () => {
    expect(at('sub').current! / 12048.7).toBeCloseTo(1, 4);
  });

  it('the board breaker (25 kA) is adequate; the sub-feeder breaker (10 kA) is too weak and must interrupt 15.0 kA', () => {
    const board = r.devices.find((d) => d.elementId === 'board-feed')!;
    expect(board.status).toBe('adequate');
    const sub = r.devices.find((d) => d.elementId === 'sub')!;
    expect(sub.status).toBe('too-weak');
    expect(sub.requiredRating! / 14993.38).toBeCloseTo(1, 4);
  });

  it('a 6 % tolerance system takes c_max 1.05 at 400 V (IEC 60909-0 Table 1): the secondary current scales by 1.05/1.10 in c and through K_T', () => {
    const p = gridTransformerCable();
    (p.elements[0] as Record<string, unknown>).voltageTolerancePercent = 6;
    const r6 = study(p);
    // c_max 1.05 on the LV side: K_T = 0.95 × 1.05/(1 + 0.6 x_T) = 0.9690141; the 11 kV feeder keeps c = 1.1.
    const kT = (0.95 * 1.05) / (1 + 0.6 * 0.0489898);
    const R = 7.00506e-5 + kT * 0.0032;
    const X = 7.00506e-4 + kT * 0.0156767;
    expect(r6.acFaults.points.find((q) => q.elementId === 'tx')!.current! / ((1.05 * 400) / (Math.sqrt(3) * Math.hypot(R, X)))).toBeCloseTo(1, 5);
  });

  it('a transformer without impedancePercent: the points behind it are not computed, with the reason', () => {
    const p = gridTransformerCable();
    delete (p.elements[1] as Record<string, unknown>).impedancePercent;
    const rr = study(p);
    expect(rr.acFaults.points.find((q) => q.elementId === 'tx')!.current).toBeNull();
    expect(rr.acFaults.points.find((q) => q.elementId === 'sub')!.note).toContain('has no impedance (u_k %)');
    expect(rr.devices.find((d) => d.elementId === 'sub')!.status).toBe('unknown');
  });

  it('a stiff grid with no impedance and nothing in between: not computed (never Infinity)', () => {
    const rr = study(project('stiff', [{ id: 'g', kind: 'grid', phases: 1, voltage: 230, frequency: 50 }, { id: 'l', kind: 'ac-load', from: 'g', power: 100, powerFactor: 1 }]));
    expect(rr.acFaults.points[0]!.current).toBeNull();
    expect(rr.acFaults.points[0]!.note).toContain('short-circuit power');
  });
});

describe('bad input: a clear problem naming element and field, nothing computed', () => {
  const problemsOf = (p: unknown) => {
    const o = onSolved(studySurges, p);
    expect(o.ok).toBe(false);
    return o.ok ? [] : o.problems;
  };

  it('a code letter that does not exist (I)', () => {
    const p = pumpOnInverter();
    (p.elements[4] as { starting: Record<string, unknown> }).starting = { method: 'dol', codeLetter: 'I' };
    const [prob] = problemsOf(p);
    expect(prob).toMatchObject({ elementId: 'pump-motor', field: 'starting.codeLetter' });
    expect(prob!.message).toContain('I, O and Q are not used');
  });

  it('a surge duration of zero', () => {
    const [prob] = problemsOf(pumpOnInverter({ surgeSeconds: 0 }));
    expect(prob).toMatchObject({ elementId: 'inv', field: 'surge.durationSeconds' });
    expect(prob!.message).toContain('greater than 0 s');
  });

  it('an internal resistance of zero (infinite fault current)', () => {
    const p = pumpOnInverter();
    (p.elements[0] as Record<string, unknown>).internalResistance = 0;
    const [prob] = problemsOf(p);
    expect(prob).toMatchObject({ elementId: 'bank', field: 'internalResistance', value: 0 });
    expect(prob!.message).toContain('infinite');
  });

  it('a bank whose datasheet internal resistance is zero', () => {
    const [prob] = problemsOf(project('zero R bank', [{ id: 'b', kind: 'battery', bank: { chemistry: 'vrla-agm', series: 4, cellsPerBlock: 6, capacityAh: 100, overrides: { internalResistanceOhmAh: 0 } } }, { id: 'l', kind: 'dc-load', from: 'b', power: 50 }]));
    expect(prob).toMatchObject({ elementId: 'b', field: 'bank.overrides.internalResistanceOhmAh' });
  });

  it('a transformer impedance of 0 %', () => {
    const p = gridTransformerCable();
    (p.elements[1] as Record<string, unknown>).impedancePercent = 0;
    const [prob] = problemsOf(p);
    expect(prob).toMatchObject({ elementId: 'tx', field: 'impedancePercent' });
  });

  it('two sources of the locked-rotor current at once', () => {
    const p = pumpOnInverter();
    (p.elements[4] as { starting: Record<string, unknown> }).starting = { method: 'dol', codeLetter: 'G', startingCurrentRatio: 6 };
    expect(problemsOf(p)[0]).toMatchObject({ elementId: 'pump-motor', field: 'starting.startingCurrentRatio' });
  });
});
