/**
 * An inverter-charger's pass-through worked by hand (core/solve/modes.ts `passThroughChange`): a shore
 * supply → charger (54 V, 90 %) → DC bus with a flooded bank on float → inverter-charger (90 %, 20 W
 * idle, pass-through limit) → 2.3 kW cabin load at unity power factor. On supply the relay passes the
 * supply straight to the cabin: the inverter's conversion losses drop out, its idle draw stays (the
 * study's assumption: it stays on, synchronised); on battery the inverter carries the cabin from the bank.
 */
import { describe, expect, it } from 'vitest';
import { solvedOf } from '../core/solved.ts';
import { solveModes } from '../../core/solve/modes.ts';
import { runModesStudy } from '../../core/studies/modes/study.ts';
import { formatModesStudy } from '../../core/studies/modes/text-report.ts';
import { demoProjects } from '../../core/demos/index.ts';

const boat = (limit: number | undefined, supplyPhases: 1 | 3 = 1) => ({
  format: 'joulepath-project',
  version: 2,
  name: 'Inverter-charger',
  elements: [
    { id: 'grid', name: 'Shore supply', kind: 'grid', phases: supplyPhases, voltage: supplyPhases === 3 ? 400 : 230, frequency: 50 },
    { id: 'rect', name: 'Charger', kind: 'rectifier', from: 'grid', outputVoltage: 54, inputPowerFactor: 1, loss: { model: 'constant', efficiency: 0.9 } },
    { id: 'bus', name: 'DC bus', kind: 'dc-bus', from: 'rect', fixedLoss: 0 },
    // 24 flooded cells, 200 Ah, float current 0.2 A (the maker's figure of this test).
    { id: 'bank', name: 'Bank', kind: 'battery', from: 'bus', bank: { chemistry: 'flooded-lead-acid', series: 24, capacityAh: 200, floatCurrent: 0.2 } },
    { id: 'inv', name: 'Inverter-charger', kind: 'inverter', from: 'bus', phases: 1, outputVoltage: 230, frequency: 50, ...(limit !== undefined ? { passThroughLimit: limit } : {}), loss: { model: 'constant', efficiency: 0.9, idleLoss: 20 } },
    { id: 'load', name: 'Cabin', kind: 'ac-load', from: 'inv', power: 2300, powerFactor: 1 },
  ],
  standby: { targetRechargeHours: 10 },
});

describe("an inverter-charger's pass-through on supply", () => {
  it('the supply carries the cabin through the relay; the inverter draws its idle alone (hand calculation)', () => {
    const solved = solvedOf(boat(16));
    // The file as drawn (no pass-through in the base solve): the charger carries the cabin through the inverter,
    // (2300 ÷ 0.9 + 20 + 54 × 0.2) ÷ 0.9 = (2555.556 + 20 + 10.8) ÷ 0.9 = 2873.728 W (constant-efficiency loss model).
    expect(solved.result.totals.sourcePower).toBeCloseTo(2873.7284, 3);
    const modes = solveModes(solved)!;
    expect(modes.supply).not.toBe(solved);
    expect(modes.passThrough).toMatchObject({ places: [{ inverterId: 'inv', limit: 16, chargerId: 'rect', feedId: 'grid', relayId: 'inv-pass-through', loadIds: ['load'] }], refused: [], problems: null });
    const r = modes.supply.result;
    // Pass-through: 2300 W straight from the supply; the bus takes the float 54 × 0.2 = 10.8 W and the inverter's
    // idle 20 W, through the charger at 90 %: 30.8 ÷ 0.9 = 34.222 W; source 2334.222 W (hand calculation).
    expect(r.totals.sourcePower).toBeCloseTo(2334.2222, 3);
    const inv = r.elements.find((e) => e.id === 'inv')!;
    expect(inv.pOut).toBe(0);
    expect(inv.loss).toBeCloseTo(20, 9);
    // The cabin's current through the relay: 2300 W ÷ 230 V = 10 A (ideal supply and relay).
    expect(r.elements.find((e) => e.id === 'inv-pass-through')!.input!.current).toBeCloseTo(10, 9);
    expect(r.totals.balanceError).toBeLessThanOrEqual(1e-9);
    if (!modes.battery.ok) throw new Error('no on-battery mode');
    // On battery the inverter carries the cabin again: 2300 ÷ 0.9 + 20 = 2575.556 W from the bus.
    expect(modes.battery.result.elements.find((e) => e.id === 'inv')!.pIn).toBeCloseTo(2575.5556, 3);
    expect(modes.battery.result.totals.balanceError).toBeLessThanOrEqual(1e-9);

    const study = runModesStudy(solved, modes);
    if (!study?.ok) throw new Error('the modes study failed');
    const st = study.study;
    // Standing losses: charger 34.222 − 30.8 = 3.422 W, the inverter's idle 20 W, the float 10.8 W: 34.222 W.
    expect(st.standing.total).toBeCloseTo(34.2222, 3);
    expect(st.standing.idle).toBeCloseTo(20, 9);
    // IEEE Std 946: L = 20 W ÷ 54 V = 0.37037 A (only the inverter's idle on the bus), k·C/H = 1.1 × 200 ÷ 10 = 22 A.
    expect(st.charger.loadCurrent).toBeCloseTo(0.37037, 5);
    expect(st.charger.requiredCurrent).toBeCloseTo(22.37037, 5);
    // The recharge case passes the cabin through too: 2300 + (22 × 54 + 20) ÷ 0.9 = 3642.222 W.
    expect(st.charger.rechargeCase.ok && st.charger.rechargeCase.supplyPower).toBeCloseTo(3642.2222, 3);
    expect(st.passThrough).toEqual([expect.objectContaining({ inverterId: 'inv', inverterName: 'Inverter-charger', limit: 16, inverterIdle: 20 })]);
    expect(st.passThrough![0]!.current).toBeCloseTo(10, 9);
    expect(st.passThrough![0]!.note).toContain('its idle draw (20 W) stays');
    expect(st.warnings.filter((w) => w.message.includes('pass-through'))).toEqual([]);
    expect(formatModesStudy(st)).toContain('Inverter-charger: the loads take 10 A through its relay (pass-through limit 16 A); inverter idle 20 W');
  });

  it('warns, naming the inverter and both currents, when the loads take more than the limit', () => {
    const study = runModesStudy(solvedOf(boat(8)));
    if (!study?.ok) throw new Error('the modes study failed');
    // 10 A (2300 W ÷ 230 V, hand calculation) against the 8 A limit of this test's inverter-charger.
    const w = study.study.warnings.find((x) => x.message.includes('pass-through limit'));
    expect(w?.message).toBe('on supply the loads of "Inverter-charger" take 10 A through its pass-through relay, above its pass-through limit 8 A');
    expect(w?.values).toEqual([{ si: expect.closeTo(10, 9), unit: 'A' }, { si: 8, unit: 'A' }]);
  });

  it('refuses to pass a three-phase supply through to a single-phase output, and says so', () => {
    const solved = solvedOf(boat(16, 3));
    const modes = solveModes(solved)!;
    expect(modes.supply).toBe(solved);
    expect(modes.passThrough?.refused).toEqual([{ inverterId: 'inv', reason: 'its output is single-phase AC, the supply side of the charger is three-phase AC' }]);
    const study = runModesStudy(solved, modes);
    if (!study?.ok) throw new Error('the modes study failed');
    expect(study.study.warnings.map((w) => w.message)).toContain('"Inverter-charger" cannot pass the supply through to its loads: its output is single-phase AC, the supply side of the charger is three-phase AC; on supply it is taken to carry them itself');
  });

  it('a file without a pass-through limit keeps its on-supply mode: the base solve itself', () => {
    const solved = solvedOf(boat(undefined));
    const modes = solveModes(solved)!;
    expect(modes.supply).toBe(solved);
    expect(modes.passThrough).toBeUndefined();
    const study = runModesStudy(solved, modes);
    if (!study?.ok) throw new Error('the modes study failed');
    expect('passThrough' in study.study).toBe(false);
    for (const d of demoProjects) {
      const s = solvedOf(d.project);
      const m = solveModes(s);
      if (m) expect(m.supply).toBe(s);
    }
  });
});
