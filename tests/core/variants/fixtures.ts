/** Small hand-built chains for the variants' tests (invented). */
import type { Project } from '../../../core/model/project.ts';
import { solveProject } from '../../../core/index.ts';
import type { Solved } from '../../../core/solve/solved.ts';

/**
 * A 24 V LiFePO4 bank (8 cells × 200 Ah, internal resistance 0 so the terminal voltage is the
 * open-circuit voltage) feeding a DC bus (no loss) and a 1200 W DC load; with `cable` an IEC cable
 * (copper, PVC, method C, size "auto") of 2 m between bank and bus.
 */
export function dcProject(opts: { cable?: boolean; withInverter?: boolean } = {}): Project {
  const elements: unknown[] = [
    { id: 'bank', name: 'House bank', kind: 'battery', internalResistance: 0, bank: { chemistry: 'lifepo4', series: 8, strings: 1, capacityAh: 200 } },
  ];
  if (opts.cable) elements.push({ id: 'feed', name: 'Bank feed', kind: 'cable', from: 'bank', length: 2, conductor: { system: 'iec', material: 'copper', size: 'auto', insulation: 'pvc', installationMethod: 'C' } });
  elements.push({ id: 'bus', name: 'DC board', kind: 'dc-bus', from: opts.cable ? 'feed' : 'bank', fixedLoss: 0 });
  elements.push({ id: 'load', name: 'Pumps', kind: 'dc-load', from: 'bus', power: 1200 });
  if (opts.withInverter) {
    elements.push({ id: 'inv', name: 'Small inverter', kind: 'inverter', from: 'bus', phases: 1, outputVoltage: 230, frequency: 50, lowVoltageCutoff: 21, loss: { model: 'constant', efficiency: 0.9 } });
    elements.push({ id: 'tv', name: 'Screens', kind: 'ac-load', from: 'inv', power: 100, powerFactor: 1 });
  }
  return { format: 'joulepath-project', version: 2, name: 'DC test chain', elements } as unknown as Project;
}

export function solved(project: Project): Solved {
  const s = solveProject(project);
  if (!s.ok) throw new Error(JSON.stringify(s.problems));
  return s;
}
