/** Speed of the flow-control comparison and of one drive-loss lookup (vitest bench; never asserted). */
import { bench, describe } from 'vitest';
import { comparePumpControl, driveLossAt, driveLossGrid, type PumpDutyInput } from '../../core/studies/machines/index.ts';

// Invented scenario: a 22 kW river-intake pump over a year of twelve flow bands.
const study: PumpDutyInput = {
  pump: { ratedFlow: 0.05, ratedHead: 30, shutoffHead: 40, efficiency: 0.75 },
  staticHead: 10,
  duty: Array.from({ length: 12 }, (_, i) => ({ flow: 0.05 * (0.3 + (0.7 * i) / 11), hours: 700 })),
  motor: { ratedOutput: 22000, efficiencyClass: 'IE3', poles: 4, ratedFrequency: 50 },
  drive: { ratedApparentPower: 30000, basis: 'cdm' },
};
const g = driveLossGrid({ ratedApparentPower: 30000, basis: 'cdm' });
if (!g.ok) throw new Error('grid');
const grid = g.grid;

describe('machines', () => {
  bench('comparePumpControl, 12-band duty', () => {
    comparePumpControl(study);
  });
  bench('driveLossAt, one point', () => {
    driveLossAt(grid, 63, 41);
  });
});
