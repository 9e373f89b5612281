// The running-cost settings the machines panel keeps in the user's preferences (web/state/prefs.ts):
// stored values read back and bad stored data falls back (typed values are checked by the engine, setField).
// Limits: 8784 h is a leap year (366 × 24); a price per kWh is never negative (common practice (no source)).
import { describe, expect, it } from 'vitest';
import { DEFAULT_COST_PREFS, parseCostPrefs } from '../../web/state/prefs.ts';

describe('running-cost preferences', () => {
  it('reads a valid record and falls back per field on bad data', () => {
    expect(parseCostPrefs(JSON.stringify({ pricePerKWh: 0.31, hoursPerYear: 4000 }))).toEqual({ pricePerKWh: 0.31, hoursPerYear: 4000 });
    expect(parseCostPrefs(null)).toEqual(DEFAULT_COST_PREFS);
    expect(parseCostPrefs('{nope')).toEqual(DEFAULT_COST_PREFS);
    expect(parseCostPrefs(JSON.stringify({ pricePerKWh: -1, hoursPerYear: 9000 }))).toEqual(DEFAULT_COST_PREFS);
    expect(parseCostPrefs(JSON.stringify({ pricePerKWh: '0.2', hoursPerYear: 8784 }))).toEqual({ pricePerKWh: null, hoursPerYear: 8784 });
  });

});
