/**
 * The option search's bench case (invented data): the search test's chain (tests/core/search/fixture.ts)
 * with 500 candidates — 1 to 5 strings × 10 IEC copper sizes (1.5 to 70 mm²) × the inverter as it
 * is and 9 alternatives (efficiency 90.5 to 97 %, prices 650 to 1450).
 */
import type { Element } from '../../core/model/project.ts';
import type { OptionSearch } from '../../core/model/option-search.ts';
import { searchBase } from '../core/search/fixture.ts';

export const benchSearchProject = searchBase;

const alternatives: Element[] = Array.from({ length: 9 }, (_, i) => ({
  id: `alt-${i + 1}`,
  name: `Inverter ${String.fromCharCode(66 + i)}`,
  kind: 'inverter',
  phases: 1,
  outputVoltage: 230,
  frequency: 50,
  lowVoltageCutoff: 44,
  price: 650 + 100 * i,
  loss: { model: 'constant', efficiency: 0.905 + 0.0075 * i, ratedPower: 2000, idleLoss: 10 },
}) as unknown as Element);

export const benchSearchSettings: OptionSearch = {
  strings: { bank: 'bank', counts: [1, 2, 3, 4, 5] },
  cables: [{ cable: 'bank-cable', fromSize: '1.5 mm²', toSize: '70 mm²' }],
  inverters: [{ element: 'inverter', alternatives }],
};
