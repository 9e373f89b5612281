/**
 * Speed of loads from circuit elements and of power-factor correction (`npm run bench`; figures are
 * reported in issue notes, never asserted).
 */
import { bench, describe } from 'vitest';
import { correctPowerFactor, networkImpedance, parseNetwork, solveProject, type CircuitNetwork } from '../../core/index.ts';
import { onSolved } from '../core/solved.ts';

/** An invented plant room: 20 motors-as-networks (R + L with a small parallel C) on 20 cables off one board. */
const elements: unknown[] = [
  { id: 'sup', kind: 'grid', phases: 3, voltage: 400, frequency: 50, resistance: 0.005, reactance: 0.02 },
  { id: 'main', kind: 'cable', from: 'sup', length: 40, resistancePerKm: 0.0754, reactancePerKm: 0.07 },
];
for (let k = 1; k <= 20; k++) {
  elements.push({ id: `c${k}`, kind: 'cable', from: 'main', length: 20 + 5 * k, resistancePerKm: 1.15, reactancePerKm: 0.09 });
  elements.push({
    id: `m${k}`,
    kind: 'network-load',
    from: `c${k}`,
    connection: k % 2 ? 'star' : 'delta',
    network: { parallel: [{ series: [{ resistor: `${40 + k} Ω` }, { inductor: `${90 + 2 * k} mH` }] }, { capacitor: '4.7 µF' }] },
  });
}
const plant = { format: 'joulepath-project', version: 2, name: 'Plant room', elements };

/** 100 components: 25 groups in series, each R + L in parallel with C and a further R. */
const ladder: CircuitNetwork = {
  series: Array.from({ length: 25 }, (_, k) => ({
    parallel: [{ series: [{ resistor: `${k + 1} Ω` }, { inductor: '10 mH' }] }, { capacitor: '47 µF' }, { resistor: '1.2 kΩ' }],
  })),
};
const parsedLadder = parseNetwork(ladder);
if (!parsedLadder.ok) throw new Error('ladder does not read');

describe('network loads', () => {
  bench('solve a board with 20 cable-fed network loads (42 elements)', () => {
    solveProject(plant);
  });
  bench('power-factor correction at the main cable output (two solves)', () => {
    onSolved(correctPowerFactor, plant, { at: 'main', targetPowerFactor: 0.95 });
  });
  bench('read a 100-component network (text values)', () => {
    parseNetwork(ladder);
  });
  bench('impedance of a 100-component network', () => {
    networkImpedance(parsedLadder.network, 50);
  });
});
