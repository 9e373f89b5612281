/**
 * A 30-element chain for the energy-flow diagram's layout (invented: no real installation): a grid, a
 * feeder cable, a transformer and a rectifier onto a DC bus with branches of cables, inverters and
 * DC-DC converters to their loads, and from the transformer two cable → drive → motor → fan branches
 * and two plain loads. Several names are long on purpose (the diagram wraps names, never cuts them).
 * Used by tests/bench/flow.bench.ts (layout time) and tests/browser/flow.test.ts (geometry checks).
 */
import type { Element, Project } from '../../core/index.ts';

export function thirtyElementChain(): Project {
  const eff = (efficiency: number) => ({ model: 'constant' as const, efficiency });
  const cable = (id: string, from: string, name: string, length: number): Element => ({ id, name, kind: 'cable', from, length, resistancePerKm: 0.727, reactancePerKm: 0.08 });
  const elements: Element[] = [
    { id: 'grid', name: 'Site supply, 400 V', kind: 'grid', phases: 3, voltage: 400, frequency: 50, resistance: 0.01, reactance: 0.03 },
    { id: 'feeder', name: 'Incoming feeder, 95 mm² aluminium', kind: 'cable', from: 'grid', length: 60, resistancePerKm: 0.32, reactancePerKm: 0.08 },
    { id: 'tx', name: 'Isolating transformer', kind: 'transformer', from: 'feeder', ratedApparentPower: 100e3, primaryVoltage: 400, secondaryVoltage: 400, noLoadLoss: 250, loadLoss: 1200, impedancePercent: 4 },
    { id: 'rect', name: 'Rectifier', kind: 'rectifier', from: 'tx', outputVoltage: 400, inputPowerFactor: 0.98, loss: eff(0.96) },
    { id: 'bus', name: 'DC bus', kind: 'dc-bus', from: 'rect', fixedLoss: 20 },
  ];
  // Three inverter branches and two DC-DC branches on the bus.
  for (let i = 1; i <= 3; i++) {
    elements.push(cable(`ic${i}`, 'bus', `Cable to inverter ${i}`, 12 + 4 * i));
    elements.push({ id: `inv${i}`, name: i === 2 ? 'Inverter for the cold-room controls and lighting, bay 2' : `Inverter ${i}`, kind: 'inverter', from: `ic${i}`, phases: 1, outputVoltage: 230, frequency: 50, loss: { ...eff(0.95), idleLoss: 25 } });
    elements.push({ id: `il${i}`, name: `Bay ${i} sockets`, kind: 'ac-load', from: `inv${i}`, power: 1500 + 500 * i, powerFactor: 0.9 });
  }
  for (let i = 1; i <= 2; i++) {
    elements.push(cable(`dc${i}`, 'bus', `Cable to converter ${i}`, 8));
    elements.push({ id: `conv${i}`, name: `400→48 V converter ${i}`, kind: 'dc-dc', from: `dc${i}`, outputVoltage: 48, loss: { model: 'polynomial', p0: 5, k1: 0.02, k2: 1e-5 } });
    elements.push({ id: `dl${i}`, name: i === 1 ? 'Telemetry, radios and controls cabinet' : 'Door heaters', kind: 'dc-load', from: `conv${i}`, power: 400 * i });
  }
  // Two drive branches from the transformer.
  for (let i = 1; i <= 2; i++) {
    elements.push(cable(`mc${i}`, 'tx', `Drive cable ${i}`, 30));
    elements.push({ id: `drive${i}`, name: `Fan drive ${i}`, kind: 'drive', from: `mc${i}`, outputVoltage: 400, outputFrequency: 45, inputPowerFactor: 0.95, loss: eff(0.97) });
    elements.push({ id: `motor${i}`, name: `Condenser fan motor ${i}, 7.5 kW`, kind: 'motor', from: `drive${i}`, ratedOutput: 7500, loss: eff(0.91), powerFactor: { model: 'constant', powerFactor: 0.84 } });
    elements.push({ id: `fan${i}`, name: `Condenser fan ${i}`, kind: 'shaft-load', from: `motor${i}`, power: 5000 + 1000 * i });
  }
  elements.push({ id: 'lights', name: 'Yard lighting', kind: 'ac-load', from: 'tx', power: 2000, powerFactor: 0.95 });
  elements.push({ id: 'heaters', name: 'Frost heaters', kind: 'ac-load', from: 'tx', power: 3000, powerFactor: 1 });
  return { format: 'joulepath-project', version: 2, name: 'Thirty-element chain', elements };
}
