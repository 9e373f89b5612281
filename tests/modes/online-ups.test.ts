/**
 * An online UPS worked by hand in both its modes: supply → rectifier (216 V, 95 %) → DC bus (10 W)
 * with a VRLA bank on it → inverter (90 %) → 1.8 kW of AC loads. On supply: the standing losses
 * (double conversion, the bus, the float) and their yearly energy; on battery: the same inverter and
 * loads carried by the bank, and the backup study's runtime, which must be the runtime of the outage
 * chain drawn as a project of its own (what a user had to draw before a bank could sit on a bus).
 */
import { describe, expect, it } from 'vitest';
import { solvedOf } from '../core/solved.ts';
import { solveModes } from '../../core/solve/modes.ts';
import { runModesStudy } from '../../core/studies/modes/study.ts';
import { runBackupStudy } from '../../core/studies/backup/study.ts';
import { formatBackupStudy } from '../../core/studies/backup/text-report.ts';
import { demoProjects } from '../../core/demos/index.ts';

const bankSpec = { chemistry: 'vrla-agm', series: 16, cellsPerBlock: 6, capacityAh: 100, floatCurrent: 0.1 };
const backup = { profile: { kind: 'constant' }, timeStepSeconds: 60, horizonHours: 24, temperatureC: 25 };
const below = [
  { id: 'inv', name: 'Inverter', kind: 'inverter', from: 'bus', phases: 1, outputVoltage: 230, frequency: 50, loss: { model: 'constant', efficiency: 0.9 } },
  { id: 'load', name: 'Rooms', kind: 'ac-load', from: 'inv', power: 1800, powerFactor: 1 },
];

const ups = {
  format: 'joulepath-project',
  version: 2,
  name: 'Online UPS',
  elements: [
    { id: 'grid', name: 'Supply', kind: 'grid', phases: 1, voltage: 230, frequency: 50 },
    { id: 'rect', name: 'Rectifier', kind: 'rectifier', from: 'grid', outputVoltage: 216, inputPowerFactor: 1, loss: { model: 'constant', efficiency: 0.95 } },
    { id: 'bus', name: 'DC bus', kind: 'dc-bus', from: 'rect', fixedLoss: 10 },
    { id: 'bank', name: 'Bank', kind: 'battery', from: 'bus', bank: bankSpec },
    ...below,
  ],
  backup,
  standby: { outageHoursPerYear: 20 },
  running: { energyPricePerKWh: 0.25 },
};

/** The outage chain drawn as its own project: the bank at the root. */
const outageOnly = {
  format: 'joulepath-project',
  version: 2,
  name: 'Online UPS',
  elements: [{ id: 'bank', name: 'Bank', kind: 'battery', bank: bankSpec }, { id: 'bus', name: 'DC bus', kind: 'dc-bus', from: 'bank', fixedLoss: 10 }, ...below],
  backup,
};

describe('an online UPS on supply: the cost of standing by', () => {
  it('double conversion, the bus and the float, for the hours the supply is on', () => {
    const s = solvedOf(ups);
    // Inverter in 1800 ÷ 0.9 = 2000 W; float 216 V × 0.1 A = 21.6 W; bus 10 W; rectifier out 2031.6 W,
    // in 2031.6 ÷ 0.95 = 2138.526 W (constant-efficiency converters, hand calculation).
    expect(s.result.totals.sourcePower).toBeCloseTo(2031.6 / 0.95, 8);
    const out = runModesStudy(s)!;
    if (!out || !out.ok) throw new Error('no study');
    const st = out.study.standing;
    // Conversion: rectifier 2138.526 − 2031.6 = 106.926 W + inverter 200 W; idle: the bus's fixed 10 W; float 21.6 W.
    expect(st.conversion).toBeCloseTo(2031.6 / 0.95 - 2031.6 + 200, 8);
    expect(st.idle).toBeCloseTo(10, 9);
    expect(st.bankFloat).toBeCloseTo(21.6, 9);
    expect(st.total).toBeCloseTo(2031.6 / 0.95 - 1800, 8);
    // 8760 − 20 = 8740 h; 338.526 W × 8740 h = 2958.72 kWh; × 0.25 = 739.68 a year (E = P·t).
    expect(st.energyKWh).toBeCloseTo(2958.72, 6);
    expect(st.cost).toBeCloseTo(739.68, 6);
    // Every mode balances to 1e-9 (the solve's identity).
    expect(out.study.supply.balanceError).toBeLessThan(1e-9);
    if ('ok' in out.study.battery) throw new Error('battery mode failed');
    expect(out.study.battery.balanceError).toBeLessThan(1e-9);
  });
});

describe('an online UPS on battery: the outage', () => {
  it('the bank carries the same inverter and loads: V = (E + √(E² − 4RP))/2', () => {
    const s = solvedOf(ups);
    const m = solveModes(s)!;
    if (!m.battery.ok) throw new Error('battery mode failed');
    // E = 96 × 12.85/6 = 205.6 V (preset OCV at full charge, from memory), R = 96 × 0.075 Ω·Ah ÷ 100 Ah = 0.072 Ω
    // (preset, from memory); P = 2000 + 10 = 2010 W at the terminals (hand calculation, Thévenin with a constant-power load).
    const E = 205.6;
    const R = 0.072;
    const V = (E + Math.sqrt(E * E - 4 * R * 2010)) / 2;
    const bank = m.battery.result.elements[0]!;
    expect(bank.id).toBe('bank');
    expect(bank.output!.voltage).toBeCloseTo(V, 8);
    expect(bank.output!.p).toBeCloseTo(2010, 8);
  });

  it('the backup study runs on battery, says so, and gives the runtime of the outage chain drawn alone', () => {
    const onBus = runBackupStudy(solvedOf(ups));
    const alone = runBackupStudy(solvedOf(outageOnly));
    if (!onBus.ok || !alone.ok) throw new Error('study refused');
    expect(onBus.study.mode).toBe('battery');
    expect(alone.study.mode).toBeUndefined();
    expect(formatBackupStudy(onBus.study)).toContain('Mode: on battery');
    // The same chain, the same bank: the same runtime to the second.
    expect(onBus.study.discharge.runtimeSeconds).toBe(alone.study.discharge.runtimeSeconds);
    // Hand estimate, Peukert at constant current (IEEE 485 / makers' notes): about 2010 W ÷ 200 V ≈ 10 A from a
    // 100 Ah C20 block, k = 1.1: t = 20 h × (100/(10 × 20))^1.1 = 9.33 h; the current rises as the voltage falls
    // and the end voltage comes first, so the runtime is below it, within 15 % of it (the study gives 9.04 h).
    const h = onBus.study.discharge.runtimeSeconds / 3600;
    expect(h).toBeLessThan(9.33);
    expect(h).toBeGreaterThan(0.85 * 9.33);
  });
});

describe('the online UPS demo: the supply cable is sized for the recharge case', () => {
  it('2.5 mm² carries the float case, the recharge case needs 4 mm²', () => {
    const demo = demoProjects.find((d) => d.id === 'harbour-clinic-ups')!;
    const out = runModesStudy(solvedOf(demo.project))!;
    if (!out || !out.ok) throw new Error('no study');
    const c = out.study.charger;
    // C: the demo's backup study runs its bank out (4 h 40 min of its 8 h horizon): about 87.5 Ah drawn, the
    // charge to put back. L ≈ 16.9 A on the bus + k·C/H = 1.1 × 87.5 Ah ÷ 8 h ≈ 12.0 A (IEEE Std 946, k from
    // memory) → about 28.9 A.
    expect(c.rechargeAhFrom).toBe('backup study');
    expect(c.rechargeAh).toBeGreaterThan(85);
    expect(c.rechargeAh).toBeLessThan(90);
    expect(c.rechargeCurrent).toBeCloseTo((1.1 * c.rechargeAh) / 8, 9);
    expect(c.requiredCurrent).toBeGreaterThan(28);
    expect(c.requiredCurrent).toBeLessThan(30);
    // 28.9 A ÷ 10 A modules → 3, with N+1 → 4 (hand calculation).
    expect(c.modules).toMatchObject({ needed: 3, installed: 4 });
    // IEC 60364-5-52:2009 Table B.52.2 (PVC, 2 loaded conductors), method C, copper: 2.5 mm² 27 A, 4 mm² 36 A;
    // the recharge case's design current is over 27 A, so 4 mm² (and a 32 A breaker, IEC 60898-1 preferred
    // ratings, I_B ≤ I_n ≤ I_z). On float the supply cable carries about 18 A: 2.5 mm² (20 A breaker).
    expect(out.study.cableSizes).toEqual([{ id: 'supply-cable', name: 'Board to UPS', float: '2.5 mm²', recharge: '4 mm²', use: '4 mm²' }]);
    if (!c.rechargeCase.ok) throw new Error('recharge case');
    expect(c.rechargeCase.cables[0]!.designCurrent!).toBeGreaterThan(27);
    expect(c.rechargeCase.cables[0]!.designCurrent!).toBeLessThanOrEqual(36);
  });
});
