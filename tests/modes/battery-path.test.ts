/**
 * What the on-battery path can carry (core/studies/modes/switches.ts `batteryPathWarnings`): a 2.3 kW
 * cabin on an inverter fed from a small flooded bank on its bus. On battery the bank's maximum discharge
 * current, the inverter's rating, a transfer switch's rated current and a fixed cable's ampacity are each
 * exceeded; each warning names the element and both figures. The harbour clinic demo exceeds none.
 */
import { describe, expect, it } from 'vitest';
import { solvedOf } from '../core/solved.ts';
import { runModesStudy } from '../../core/studies/modes/study.ts';
import { demoProjects } from '../../core/demos/index.ts';

const cabin = (over: { capacityAh?: number; rated?: number; switchRated?: number; size?: string } = {}) => ({
  format: 'joulepath-project',
  version: 2,
  name: 'Overloaded on battery',
  elements: [
    { id: 'grid', name: 'Shore supply', kind: 'grid', phases: 1, voltage: 230, frequency: 50 },
    { id: 'rect', name: 'Charger', kind: 'rectifier', from: 'grid', outputVoltage: 54, inputPowerFactor: 1, loss: { model: 'constant', efficiency: 0.9 } },
    { id: 'bus', name: 'DC bus', kind: 'dc-bus', from: 'rect', fixedLoss: 0 },
    { id: 'bank', name: 'Bank', kind: 'battery', from: 'bus', bank: { chemistry: 'flooded-lead-acid', series: 24, capacityAh: over.capacityAh ?? 40, floatCurrent: 0.1 } },
    { id: 'dc-run', name: 'Bus to inverter', kind: 'cable', from: 'bus', length: 3, conductor: { system: 'iec', material: 'copper', size: over.size ?? '6 mm²', insulation: 'pvc', installationMethod: 'C' } },
    { id: 'inv', name: 'Inverter', kind: 'inverter', from: 'dc-run', phases: 1, outputVoltage: 230, frequency: 50, ratedOutputPower: over.rated ?? 2000, loss: { model: 'constant', efficiency: 0.9, idleLoss: 20 } },
    { id: 'sw', name: 'Output switch', kind: 'transfer-switch', from: 'inv', contactResistance: 0, controlPower: 0, ratedCurrent: over.switchRated ?? 8 },
    { id: 'load', name: 'Cabin', kind: 'ac-load', from: 'sw', power: 2300, powerFactor: 1 },
  ],
});

const studyOf = (p: unknown) => {
  const s = runModesStudy(solvedOf(p));
  if (!s?.ok) throw new Error('the modes study failed');
  return s.study;
};

describe('a load beyond what the on-battery path can carry', () => {
  it('names the bank, the inverter, the switch and the cable, each with both figures', () => {
    const st = studyOf(cabin());
    if ('ok' in st.battery) throw new Error('no on-battery mode');
    const messages = st.warnings.map((w) => w.message);
    // Bank: 40 Ah × 1 C = 40 A maximum discharge (flooded lead-acid preset, common practice); the cabin takes
    // 2300 ÷ 0.9 + 20 = 2575.6 W at the sagging bank's some 46 V (50.8 V open circuit less the 40 Ah bank's and the
    // cable's drops): about 56 A (hand calculation).
    const bank = st.warnings.find((w) => w.message.startsWith('on battery the loads take'));
    expect(bank?.message).toMatch(/^on battery the loads take 5\d\.\d A from the bank "Bank", above its maximum discharge current 40 A: the on-battery path cannot carry them$/);
    expect(bank?.values?.[1]).toEqual({ si: 40, unit: 'A' });
    // Inverter: 2300 W out against its rated 2000 W (this test's rating).
    expect(messages).toContain('on battery the loads of "Inverter" take 2.3 kW, above its rated output 2 kW: the on-battery path cannot carry them');
    // Switch: 2300 W ÷ 230 V = 10 A through it against its rated 8 A.
    expect(messages).toContain('on battery "Output switch" carries 10 A, above its rated current 8 A: the on-battery path cannot carry its loads');
    // Cable: 6 mm² Cu PVC, method C, 2 loaded conductors: 46 A (IEC 60364-5-52 Table B.52.2, column C);
    // on battery it carries the ~56 A the bank gives.
    const cable = st.warnings.find((w) => w.message.includes('"Bus to inverter"'));
    expect(cable?.message).toMatch(/^on battery "Bus to inverter" carries 5\d\.\d A, above the ampacity 46 A of its 6 mm²: the on-battery path cannot carry its loads$/);
    // The solve's own rating warning of the switch on battery is not repeated beside the named one.
    expect(messages.filter((m) => m.startsWith('on battery: carries'))).toEqual([]);
    // Both modes still balance.
    expect(st.supply.balanceError).toBeLessThanOrEqual(1e-9);
    expect(st.battery.balanceError).toBeLessThanOrEqual(1e-9);
  });

  it('says nothing when the path carries the load (a larger bank, inverter, switch and cable)', () => {
    const st = studyOf(cabin({ capacityAh: 200, rated: 3000, switchRated: 16, size: '16 mm²' }));
    expect(st.warnings.filter((w) => w.message.includes('on-battery path cannot carry'))).toEqual([]);
    const demo = demoProjects.find((d) => d.id === 'harbour-clinic-ups')!;
    expect(studyOf(demo.project).warnings.filter((w) => w.message.includes('on-battery path cannot carry'))).toEqual([]);
  });
});
