/**
 * One cable size across the modes (core/studies/modes/cables.ts): each sized cable gets the largest size
 * its cases need (on supply at float, on battery, on supply recharging), with the case that set it named.
 * The harbour clinic demo's supply cable: 2.5 mm² carries the float case, the recharge case needs 4 mm².
 */
import { describe, expect, it } from 'vitest';
import { solvedOf } from '../core/solved.ts';
import { runModesStudy } from '../../core/studies/modes/study.ts';
import { solveModes } from '../../core/solve/modes.ts';
import { formatModesStudy } from '../../core/studies/modes/text-report.ts';
import { demoProjects } from '../../core/demos/index.ts';
import { dcPlant } from './dc-plant-fixture.ts';

const studyOf = (p: unknown) => {
  const s = runModesStudy(solvedOf(p));
  if (!s?.ok) throw new Error('the modes study failed');
  return s.study;
};

describe('one cable size across the modes', () => {
  it("the harbour clinic's supply cable: 2.5 mm² on float, 4 mm² recharging: 4 mm², sized for the recharge case", () => {
    const demo = demoProjects.find((d) => d.id === 'harbour-clinic-ups')!;
    const solved = solvedOf(demo.project);
    const st = studyOf(demo.project);
    const cable = st.cables.find((c) => c.elementId === 'supply-cable')!;
    expect(cable).toEqual({ elementId: 'supply-cable', name: 'Board to UPS', sizes: { supply: '2.5 mm²', battery: null, recharge: '4 mm²' }, governing: '4 mm²', governingCase: 'recharge' });
    // Why, by the table: copper, PVC, method C, two loaded conductors, IEC 60364-5-52 Table B.52.2 column C:
    // 2.5 mm² 27 A, 4 mm² 36 A. On float the design current (the load at 230 V) is within 27 A; recharging,
    // the supply current of the recharge case is above 27 A and within 36 A.
    const float = solved.result.elements.find((e) => e.id === 'supply-cable')!.conductor!;
    expect(float.designCurrent).toBeLessThanOrEqual(27);
    expect(float.ampacity.table).toBe(27);
    if (!st.charger.rechargeCase.ok) throw new Error('no recharge case');
    const rc = st.charger.rechargeCase.cables.find((c) => c.id === 'supply-cable')!;
    expect(rc.designCurrent!).toBeGreaterThan(27);
    expect(rc.designCurrent!).toBeLessThanOrEqual(36);
    expect(formatModesStudy(st)).toContain('  Board to UPS: 4 mm², sized for the recharge case (2.5 mm² on float, 4 mm² recharging)');
    // Every case the sizes come from balances.
    expect(st.supply.balanceError).toBeLessThanOrEqual(1e-9);
    if ('ok' in st.battery) throw new Error('no on-battery mode');
    expect(st.battery.balanceError).toBeLessThanOrEqual(1e-9);
  });

  it('a DC feeder below the bus: the on-battery case needs the larger size (its nominal voltage is lower)', () => {
    // The hand-worked 48 V plant (dc-plant-fixture.ts) with the radio, now 10 A, on a 5 m feeder below the bus.
    const plant = dcPlant({ name: 'Radio feeder' });
    const project = {
      ...plant,
      elements: [
        ...plant.elements.filter((e) => e.id !== 'radio'),
        { id: 'feeder', name: 'Radio feeder', kind: 'cable', from: 'bus', length: 5, conductor: { system: 'iec', material: 'copper', size: 'auto', insulation: 'pvc', installationMethod: 'C' } },
        { id: 'radio', name: 'Radio', kind: 'dc-current-load', from: 'feeder', current: 10 },
      ],
    };
    const st = studyOf(project);
    const c = st.cables.find((x) => x.elementId === 'feeder')!;
    expect(c).toEqual({ elementId: 'feeder', name: 'Radio feeder', sizes: { supply: '1.5 mm²', battery: '2.5 mm²', recharge: '1.5 mm²' }, governing: '2.5 mm²', governingCase: 'battery' });
    // Why: IEC 60364-5-52 Annex G drop u = b·ρ₁·L·I_B / S with b = 2 (DC loop), ρ₁ = 1.25·ρ₂₀ = 0.0225 Ω·mm²/m, L = 5 m.
    // On supply (54 V nominal, I_B = 10 A): 1.5 mm² drops 2 × 0.0225 × 5 × 10 / 1.5 = 1.5 V = 2.78 %. On battery the
    // bank's 48 V nominal (24 × 2 V) and the load's design current there, 10.58 A: 1.5 mm² drops 1.588 V = 3.31 %,
    // 2.5 mm² 0.953 V = 1.98 % (hand calculation); the link's limit lies between (3 % here).
    const solved = solvedOf(project);
    const onSupply = solved.result.elements.find((e) => e.id === 'feeder')!.conductor!;
    expect(onSupply.drop.checkPercent).toBeCloseTo(2.7778, 3);
    expect(onSupply.drop.limitPercent).toBe(3);
    const modes = solveModes(solved)!;
    if (!modes.battery.ok) throw new Error('no on-battery mode');
    const onBattery = modes.battery.result.elements.find((e) => e.id === 'feeder')!.conductor!;
    expect(onBattery.nominalVoltage).toBe(48);
    expect(onBattery.designCurrent).toBeCloseTo(10.583, 3);
    expect(onBattery.drop.checkPercent).toBeCloseTo(1.9844, 3);
    expect(st.warnings).toEqual([]);
    expect(formatModesStudy(st)).toContain('  Radio feeder: 2.5 mm², sized for the on-battery case (1.5 mm² on float, 1.5 mm² recharging, 2.5 mm² on battery)');
  });
});
