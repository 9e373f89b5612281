/** Projects for the battery tests and benchmark (invented scenarios). */
import type { BackupStudy, BatteryBankSpec, Element, Project } from '../../core/index.ts';

/**
 * A telecom cabinet on a 48 V LiFePO4 bank: ten stages (cables, a DC bus, an inverter, DC-DC
 * converters, a transformer-less AC board) and five loads, a 24-hour profile run once, a
 * compressor and a pump cycling.
 */
export function batteryBenchProject(): Project {
  const elements: Element[] = [
    { id: 'bank', kind: 'battery', bank: { chemistry: 'lifepo4', series: 16, strings: 2, capacityAh: 280 } },
    { id: 'bank-cable', kind: 'cable', from: 'bank', length: 2, resistancePerKm: 0.39 },
    { id: 'bus', kind: 'dc-bus', from: 'bank-cable', fixedLoss: 8 },
    { id: 'inv-cable', kind: 'cable', from: 'bus', length: 3, resistancePerKm: 0.78 },
    {
      id: 'inverter', kind: 'inverter', from: 'inv-cable', phases: 1, outputVoltage: 230, frequency: 50,
      loss: { model: 'curve', ratedPower: 3000, idleLoss: 20, points: [ { loadFraction: 0.1, efficiency: 0.88 }, { loadFraction: 0.5, efficiency: 0.94 }, { loadFraction: 1, efficiency: 0.93 } ] },
    },
    { id: 'board-cable', kind: 'cable', from: 'inverter', length: 20, resistancePerKm: 4.61, reactancePerKm: 0.1 },
    { id: 'compressor', kind: 'ac-load', from: 'board-cable', power: 400, powerFactor: 0.8 },
    { id: 'lights', kind: 'ac-load', from: 'board-cable', power: 150, powerFactor: 0.95 },
    { id: 'pump', kind: 'ac-va-load', from: 'board-cable', apparentPower: 500, powerFactor: 0.85 },
    { id: 'dcdc-cable', kind: 'cable', from: 'bus', length: 4, resistancePerKm: 1.83 },
    { id: 'dc-dc', kind: 'dc-dc', from: 'dcdc-cable', outputVoltage: 24, loss: { model: 'polynomial', p0: 4, k1: 0.03, k2: 1e-4 } },
    { id: 'radio-cable', kind: 'cable', from: 'dc-dc', length: 10, resistancePerKm: 3.08 },
    { id: 'radios', kind: 'dc-load', from: 'radio-cable', power: 120 },
    { id: 'fan-psu', kind: 'dc-dc', from: 'bus', outputVoltage: 12, loss: { model: 'constant', efficiency: 0.9, idleLoss: 1 } },
    { id: 'fans', kind: 'dc-load', from: 'fan-psu', power: 30 },
  ];
  const backup: BackupStudy = {
    profile: {
      kind: 'segments',
      segments: [
        { durationHours: 6, loads: { lights: 40 } },
        { durationHours: 12, loads: { lights: false } },
        { durationHours: 6, loads: { lights: true } },
      ],
      duty: [
        { load: 'compressor', periodMinutes: 25, onMinutes: 9 },
        { load: 'pump', periodMinutes: 60, onMinutes: 10, offsetMinutes: 5 },
      ],
    },
    timeStepSeconds: 60,
    horizonHours: 48,
    temperatureC: 20,
  };
  return { format: 'joulepath-project', version: 2, name: 'Bench: cabinet on a 48 V bank', elements, backup };
}

/** A bank spec with defaults for tests. */
export const bankSpec = (over: Partial<BatteryBankSpec> = {}): BatteryBankSpec => ({ chemistry: 'lifepo4', series: 16, capacityAh: 100, ...over });
