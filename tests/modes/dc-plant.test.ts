/**
 * One system in both its modes, worked by hand: a 48 V DC plant (supply → rectifier → DC bus with the
 * bank on it → loads). On supply the rectifier carries the loads and the bank's float current; on
 * battery the bank carries the same bus; the rectifier is sized for the loads plus the recharge
 * current (IEEE Std 946: A = L + k·C/H) in modules with N+1.
 */
import { describe, expect, it } from 'vitest';
import { solvedOf } from '../core/solved.ts';
import { solveProject } from '../../core/solve/index.ts';
import { bankOnBus, solveModes } from '../../core/solve/modes.ts';
import { runModesStudy } from '../../core/studies/modes/study.ts';
import { dcPlant } from './dc-plant-fixture.ts';

// The plant (dc-plant-fixture.ts) with the modes' settings of this file: 25 A modules with N+1, 10 outage hours a year, 0.30 per kWh.
const plant = (extra: Record<string, unknown> = {}) =>
  dcPlant({ standby: { targetRechargeHours: 8, moduleCurrent: 25, redundancy: 'n+1', outageHoursPerYear: 10 }, running: { energyPricePerKWh: 0.3 }, ...extra });

describe('a bank on a bus: the file and its two modes', () => {
  it('is valid, the supply is the source and the bank a load on the bus', () => {
    const s = solvedOf(plant());
    expect(s.result.elements[0]!.id).toBe('grid');
    const bank = s.result.elements.find((e) => e.id === 'bank')!;
    expect(bank.role).toBe('load');
    // P = V_bus · I_float = 54 V × 0.2 A = 10.8 W (hand calculation, constant-current load).
    expect(bank.pIn).toBeCloseTo(10.8, 9);
    // Rectifier output 54 × 30.2 = 1630.8 W; input ÷ 0.9 = 1812 W (constant-efficiency loss model).
    expect(s.result.totals.sourcePower).toBeCloseTo(1812, 6);
    expect(bankOnBus(s.project)).toEqual({ bankId: 'bank', busId: 'bus', path: ['bus'] });
  });

  it('on battery the bank is the root and carries the same load', () => {
    const s = solvedOf(plant());
    const m = solveModes(s)!;
    expect(m.battery.ok).toBe(true);
    if (!m.battery.ok) return;
    const r = m.battery.result;
    expect(r.elements.map((e) => e.id)).toEqual(['bank', 'bus', 'radio']);
    // OCV 24 × 12.7/6 V = 50.8 V (flooded preset at full charge, common practice table), R = 24 × 0.1 Ω·Ah ÷ 200 Ah
    // = 0.012 Ω (preset, from memory); V = 50.8 − 30 × 0.012 = 50.44 V (hand calculation, Thévenin).
    expect(r.elements.find((e) => e.id === 'bus')!.output!.voltage).toBeCloseTo(50.44, 9);
    expect(r.elements[0]!.output!.current).toBeCloseTo(30, 9);
  });

  it('refuses a bank on something that is not a DC bus, and a bank on a bus without its bank data', () => {
    const bad = plant();
    (bad.elements[3] as Record<string, unknown>)['from'] = 'rect';
    const out = solveProject(bad);
    expect(out.ok).toBe(false);
    if (!out.ok) expect(out.problems.map((p) => [p.code, p.elementId, p.field])).toContainEqual(['not-on-bus', 'bank', 'from']);
    const noBank = plant();
    noBank.elements[3] = { id: 'bank', kind: 'battery', from: 'bus', voltage: 52 } as never;
    const out2 = solveProject(noBank);
    expect(out2.ok).toBe(false);
    if (!out2.ok) expect(out2.problems.map((p) => [p.elementId, p.field])).toContainEqual(['bank', 'bank']);
  });

  it('refuses a second bank on a bus, naming it and the first', () => {
    const p = plant();
    p.elements.push({ id: 'bank2', name: 'Second bank', kind: 'battery', from: 'bus', bank: { chemistry: 'vrla-agm', series: 24, capacityAh: 100 } } as never);
    const out = solveProject(p);
    expect(out.ok).toBe(false);
    if (!out.ok) {
      const p2 = out.problems.find((x) => x.elementId === 'bank2')!;
      expect([p2.code, p2.field]).toEqual(['several-sources', 'from']);
      expect(p2.message).toBe('a project holds one bank on a bus; "Bank" is already on one');
    }
  });

  it('a bank reached through a cable: the cable is turned round on battery', () => {
    const p = plant();
    p.elements.splice(3, 1, { id: 'bcable', name: 'Bank cable', kind: 'cable', from: 'bus', length: 5, resistancePerKm: 2, reactancePerKm: 0 } as never, {
      id: 'bank', name: 'Bank', kind: 'battery', from: 'bcable', bank: { chemistry: 'flooded-lead-acid', series: 24, capacityAh: 200, floatCurrent: 0.2 },
    } as never);
    const s = solvedOf(p);
    const m = solveModes(s)!;
    expect(m.place.path).toEqual(['bcable', 'bus']);
    expect(m.battery.ok).toBe(true);
    if (!m.battery.ok) return;
    const r = m.battery.result;
    expect(r.elements.map((e) => e.id)).toEqual(['bank', 'bcable', 'bus', 'radio']);
    // Loop resistance 2 × 5 m × 2 Ω/km = 0.02 Ω (the cable's model: out and back); V_bus = 50.8 − 30 × (0.012 + 0.02) = 49.84 V.
    expect(r.elements.find((e) => e.id === 'bus')!.output!.voltage).toBeCloseTo(49.84, 9);
  });
});

describe('the modes study: charger sizing, standing losses, transfer', () => {
  it('sizes the rectifier for the load plus the recharge current, in modules with N+1', () => {
    const s = solvedOf(plant());
    const out = runModesStudy(s)!;
    expect(out.ok).toBe(true);
    if (!out.ok) return;
    const c = out.study.charger;
    expect(c.chargerId).toBe('rect');
    // L = 30 A; C = 200 Ah; H = 8 h; k = 1.1 (IEEE Std 946, from memory): k·C/H = 27.5 A; A = 57.5 A.
    expect(c.loadCurrent).toBeCloseTo(30, 9);
    expect(c.rechargeCurrent).toBeCloseTo(27.5, 9);
    expect(c.requiredCurrent).toBeCloseTo(57.5, 9);
    // 57.5 A ÷ 25 A modules = 2.3 → 3 modules, N+1 → 4 modules, 100 A installed (hand calculation).
    expect(c.modules).toEqual({ moduleCurrent: 25, needed: 3, installed: 4, redundancy: 'n+1', installedCurrent: 100 });
    // The recharge case: 57.5 A at 54 V = 3105 W out, ÷ 0.9 = 3450 W from the supply, 3450 / 230 = 15 A (hand calculation).
    expect(c.rechargeCase.ok).toBe(true);
    if (c.rechargeCase.ok) {
      expect(c.rechargeCase.supplyPower).toBeCloseTo(3450, 6);
      expect(c.rechargeCase.supplyCurrent).toBeCloseTo(15, 6);
      expect(c.rechargeCase.rectifierOutputCurrent).toBeCloseTo(57.5, 9);
    }
  });

  it('without redundancy the modules are those the load needs', () => {
    const out = runModesStudy(solvedOf(plant({ standby: { moduleCurrent: 20, redundancy: 'none' } })))!;
    if (!out || !out.ok) throw new Error('no study');
    // 57.5 A ÷ 20 A = 2.875 → 3 modules (hand calculation).
    expect(out.study.charger.modules?.installed).toBe(3);
  });

  it('standing losses on supply: the rectifier loss and the float, a year less the outage hours', () => {
    const out = runModesStudy(solvedOf(plant()))!;
    if (!out || !out.ok) throw new Error('no study');
    const st = out.study.standing;
    // Rectifier loss 1812 − 1630.8 = 181.2 W; float 10.8 W; total 192 W (hand calculation).
    expect(st.conversion).toBeCloseTo(181.2, 6);
    expect(st.bankFloat).toBeCloseTo(10.8, 9);
    expect(st.total).toBeCloseTo(192, 6);
    // 8760 − 10 = 8750 h on supply; 192 W × 8750 h = 1680 kWh; × 0.3 = 504 per year (E = P·t).
    expect(st.hoursOnSupply).toBe(8750);
    expect(st.energyKWh).toBeCloseTo(1680, 6);
    expect(st.cost).toBeCloseTo(504, 6);
  });

  it('transfer: the bank picks up the bus from float through its internal resistance', () => {
    const out = runModesStudy(solvedOf(plant()))!;
    if (!out || !out.ok) throw new Error('no study');
    const t = out.study.transfer!;
    // E_f = 54 − 0.2 × 0.012 = 53.9976 V; I = 30 A (constant-current load); V_bus = 53.9976 − 0.36 = 53.6376 V;
    // step 30 + 0.2 = 30.2 A (hand calculation, Thévenin model).
    expect(t.floatEmf).toBeCloseTo(53.9976, 9);
    expect(t.currentAtTransfer).toBeCloseTo(30, 9);
    expect(t.currentStep).toBeCloseTo(30.2, 9);
    expect(t.busVoltageOnSupply).toBeCloseTo(54, 9);
    expect(t.busVoltageAtTransfer).toBeCloseTo(53.6376, 9);
    expect(t.busVoltageSettled).toBeCloseTo(50.44, 9);
    expect(out.study.warnings).toEqual([]);
  });

  it('warns when the bus load is beyond what the bank can give', () => {
    const p = plant();
    // 30 A from a 20 Ah bank at a maximum of 1 C (flooded preset, common practice) = 20 A: beyond it.
    (p.elements[3] as { bank: { capacityAh: number } }).bank.capacityAh = 20;
    const out = runModesStudy(solvedOf(p))!;
    if (!out || !out.ok) throw new Error('no study');
    expect(out.study.warnings.map((w) => w.message).join('\n')).toMatch(/above its maximum discharge current 20 A/);
  });

  it('warns when a converter on the bus stops above the on-battery bus voltage', () => {
    const p = plant();
    // A DC-DC converter that needs 52 V at its input: 50.44 V settled on battery (above) is below it.
    p.elements.push({ id: 'dcdc', name: 'Radio converter', kind: 'dc-dc', from: 'bus', outputVoltage: 12, minInputVoltage: 52, loss: { model: 'constant', efficiency: 0.9 } } as never);
    p.elements.push({ id: 'radios', kind: 'dc-load', from: 'dcdc', power: 100 } as never);
    const out = runModesStudy(solvedOf(p))!;
    if (!out || !out.ok) throw new Error('no study');
    expect(out.study.warnings.map((w) => w.message).join('\n')).toMatch(/on battery "Radio converter" is fed .* below the 52 V it stops at/);
  });

  it('a project with the bank as its source has one mode', () => {
    const p = { format: 'joulepath-project', version: 2, name: 'x', elements: [{ id: 'b', kind: 'battery', voltage: 12 }, { id: 'l', kind: 'dc-load', from: 'b', power: 10 }] };
    expect(runModesStudy(solvedOf(p))).toBeNull();
  });
});
