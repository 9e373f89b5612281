/**
 * Speed of conductor sizing inside the chain solve: the cold-store demo (one auto-sized DC link
 * behind a converter) and a 3φ feeder feeding a DC bus with two auto-sized branches (the outer loop
 * re-solves the chain until sizes and resistances settle). Run with `npm run bench`; medians are
 * reported in issue notes, never asserted.
 */
import { bench, describe } from 'vitest';
import { demoProjects, solveProject } from '../../core/index.ts';

const coldStore = demoProjects.find((d) => d.id === 'cold-store-dc-bus')!.project;
const nec = { system: 'nec', material: 'copper', size: 'auto', insulationRating: 75 };
const feeder = {
  format: 'joulepath-project',
  version: 2,
  name: 'bench: three sized links',
  elements: [
    { id: 'g', kind: 'grid', phases: 3, voltage: 480, frequency: 60 },
    { id: 'f', kind: 'cable', from: 'g', length: 60, conductor: { ...nec, raceway: 'steel' } },
    { id: 'rect', kind: 'rectifier', from: 'f', outputVoltage: 48, inputPowerFactor: 0.95, loss: { model: 'constant', efficiency: 0.95 } },
    { id: 'b1', kind: 'cable', from: 'rect', length: 25, conductor: nec },
    { id: 'l1', kind: 'dc-load', from: 'b1', power: 3000 },
    { id: 'b2', kind: 'cable', from: 'rect', length: 40, conductor: { ...nec, continuous: true } },
    { id: 'l2', kind: 'dc-load', from: 'b2', power: 1500 },
  ],
};
for (const p of [coldStore, feeder]) {
  const check = solveProject(p);
  if (!check.ok) throw new Error(`bench project does not solve: ${JSON.stringify(check.problems)}`);
}

describe('conductor sizing', () => {
  bench('cold-store demo (one auto-sized link)', () => {
    solveProject(coldStore);
  });
  bench('3φ feeder + rectifier + two auto-sized DC branches', () => {
    solveProject(feeder);
  });
});
