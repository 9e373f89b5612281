/** The surge and fault study on the small fixtures (each study solves the project once per motor start plus once). */
import { bench, describe } from 'vitest';
import { studySurges } from '../../core/index.ts';
import { dolOnCable, gridTransformerCable, pumpOnInverter } from './fixtures.ts';
import { onSolved } from '../core/solved.ts';

const inverter = pumpOnInverter();
const cable = dolOnCable(120);
const grid = gridTransformerCable();

describe('studySurges', () => {
  bench('pump on an inverter (one start, battery faults, two devices)', () => void onSolved(studySurges, inverter));
  bench('DOL motor on a cable (one start, AC faults)', () => void onSolved(studySurges, cable));
  bench('grid, transformer, cables (AC faults, two devices)', () => void onSolved(studySurges, grid));
});
