/**
 * A hand-built chain for the option search (invented data): a 48 V LiFePO4 bank (16 cells of
 * 100 Ah per string) → a 10 m IEC copper cable → DC bus → a 2 kW inverter → a 1.2 kW resistive load,
 * a constant load for 12 h, target runtime 4 h. Candidates: 1, 2 or 3 strings (1000 each), the
 * cable at 4, 10 or 25 mm² (60, 110, 220), and inverter A (the base, 600, 90 %) or B (900, 95 %).
 */
import type { Element, Project } from '../../../core/model/project.ts';
import type { OptionSearch } from '../../../core/model/option-search.ts';

export const inverterB = {
  id: 'inv-b',
  name: 'Inverter B',
  kind: 'inverter',
  phases: 1,
  outputVoltage: 230,
  frequency: 50,
  lowVoltageCutoff: 44,
  price: 900,
  loss: { model: 'constant', efficiency: 0.95, ratedPower: 2000 },
} as unknown as Element;

export const searchBase: Project = {
  format: 'joulepath-project',
  version: 2,
  name: 'Search test',
  dropLimits: { basis: 'iec-a-other' },
  backup: { profile: { kind: 'constant' }, timeStepSeconds: 60, horizonHours: 12, temperatureC: 25, targetRuntimeHours: 4 },
  running: { energyPricePerKWh: 0.3, hoursPerYear: 8760 },
  elements: [
    { id: 'bank', name: 'Bank', kind: 'battery', price: 1000, bank: { chemistry: 'lifepo4', series: 16, strings: 1, capacityAh: 100 } },
    {
      id: 'bank-cable',
      name: 'Bank cable',
      kind: 'cable',
      from: 'bank',
      length: 10,
      price: 110,
      conductor: { system: 'iec', material: 'copper', size: '10 mm²', insulation: 'pvc', installationMethod: 'C', designCurrentBasis: 'load' },
    },
    { id: 'bus', name: 'DC bus', kind: 'dc-bus', from: 'bank-cable', fixedLoss: 0 },
    { id: 'inverter', name: 'Inverter A', kind: 'inverter', from: 'bus', phases: 1, outputVoltage: 230, frequency: 50, lowVoltageCutoff: 44, price: 600, loss: { model: 'constant', efficiency: 0.9, ratedPower: 2000 } },
    { id: 'load', name: 'Load', kind: 'ac-load', from: 'inverter', power: 1200, powerFactor: 1 },
  ],
} as unknown as Project;

export const searchSettings: OptionSearch = {
  strings: { bank: 'bank', counts: [1, 2, 3] },
  cables: [{ cable: 'bank-cable', sizes: ['4 mm²', '10 mm²', '25 mm²'], prices: [{ size: '4 mm²', price: 60 }, { size: '10 mm²', price: 110 }, { size: '25 mm²', price: 220 }] }],
  inverters: [{ element: 'inverter', alternatives: [inverterB] }],
};
