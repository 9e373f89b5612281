/** Projects for benchmarks (invented: a plant-room chain with a battery-backed branch). */
import type { Element, Project } from '../../core/index.ts';

export function twentyStageTree(): Project {
  const eff = (efficiency: number) => ({ model: 'constant' as const, efficiency });
  const elements: Element[] = [
    { id: 'grid', kind: 'grid', phases: 3, voltage: 400, frequency: 50, resistance: 0.01, reactance: 0.03 },
    { id: 'main-cable', kind: 'cable', from: 'grid', length: 80, resistancePerKm: 0.387, reactancePerKm: 0.08 },
    { id: 'tx', kind: 'transformer', from: 'main-cable', ratedApparentPower: 100e3, primaryVoltage: 400, secondaryVoltage: 400, noLoadLoss: 250, loadLoss: 1200, impedancePercent: 4 },
    { id: 'rect', kind: 'rectifier', from: 'tx', outputVoltage: 400, inputPowerFactor: 0.98,
      loss: { model: 'curve', ratedPower: 20e3, points: [ { loadFraction: 0.1, efficiency: 0.9 }, { loadFraction: 0.5, efficiency: 0.96 }, { loadFraction: 1, efficiency: 0.955 } ] } },
    { id: 'bus', kind: 'dc-bus', from: 'rect', fixedLoss: 20 },
    { id: 'dc-cable', kind: 'cable', from: 'bus', length: 15, resistancePerKm: 1.15 },
    { id: 'dc-dc', kind: 'dc-dc', from: 'dc-cable', outputVoltage: 48, loss: { model: 'polynomial', p0: 5, k1: 0.02, k2: 1e-5 } },
    { id: 'dc-load', kind: 'dc-load', from: 'dc-dc', power: 600 },
    { id: 'inv', kind: 'inverter', from: 'bus', phases: 1, outputVoltage: 230, frequency: 50, loss: { ...eff(0.95), idleLoss: 30 } },
    { id: 'ups-load', kind: 'ac-load', from: 'inv', power: 2500, powerFactor: 0.9 },
    { id: 'drive', kind: 'drive', from: 'tx', outputVoltage: 400, outputFrequency: 45, inputPowerFactor: 0.95,
      loss: { model: 'polynomial-fit', ratedPower: 30e3, points: [ { loadFraction: 0.25, efficiency: 0.936 }, { loadFraction: 0.5, efficiency: 0.961 }, { loadFraction: 1, efficiency: 0.972 } ] } },
    { id: 'motor-cable', kind: 'cable', from: 'drive', length: 40, resistancePerKm: 1.83, reactancePerKm: 0.09 },
    { id: 'motor', kind: 'motor', from: 'motor-cable', ratedOutput: 22e3, loss: eff(0.93), powerFactor: { model: 'constant', powerFactor: 0.84 } },
    { id: 'fan', kind: 'shaft-load', from: 'motor', power: 15e3 },
    { id: 'gen', kind: 'generic', from: 'tx', inputKind: 'ac3', outputKind: 'ac1', outputVoltage: 230, outputFrequency: 60, inputPowerFactor: 0.97, loss: eff(0.94) },
    { id: 'lab', kind: 'ac-va-load', from: 'gen', apparentPower: 3000, powerFactor: 0.8 },
    { id: 'lights', kind: 'ac-load', from: 'tx', power: 4000, powerFactor: 0.95 },
    { id: 'heaters', kind: 'ac-load', from: 'tx', power: 9000, powerFactor: 1 },
    { id: 'caps', kind: 'ac-load', from: 'tx', power: 10, powerFactor: 0.05, pfSense: 'leading' },
    { id: 'sockets', kind: 'ac-va-load', from: 'tx', apparentPower: 5000, powerFactor: 0.9 },
  ];
  return { format: 'joulepath-project', version: 2, name: 'Bench: plant room', elements };
}
