/**
 * A fan's flows and pressures in the user's units: cfm and inches of water in US units, m³/h and Pa in
 * SI, in the forms and in the engine's messages about a fan's flow.
 */
import { describe, expect, it } from 'vitest';
import { messageValueText } from '../../web/format/message-text.ts';
import { fromSi, toSi } from '../../web/format/parse.ts';

describe('air flow and fan pressure units', () => {
  it('1 cfm = 0.3048³ m³ / 60 s = 4.719474432e-4 m³/s (NIST SP 811, 2008 ed., B.8, "foot"; exact)', () => {
    expect(toSi('air-flow', 'us', 1)).toBeCloseTo(4.719474432e-4, 15);
    // 2 m³/s = 4237.760007 cfm; 7200 m³/h = 2 m³/s (÷ 3600, SI Brochure Table 8).
    expect(fromSi('air-flow', 'us', 2)).toBeCloseTo(4237.760007, 5);
    expect(toSi('air-flow', 'si', 7200)).toBe(2);
  });

  it('1 in. w.g. (60 °F) = 248.84 Pa (NIST SP 811, 2008 ed., B.8, from memory)', () => {
    expect(toSi('pressure', 'us', 1)).toBeCloseTo(248.84, 9);
    expect(fromSi('pressure', 'si', 1100)).toBe(1100);
  });

  it('a message about a fan\'s flow says cfm in US units, a pump\'s says gpm', () => {
    // 2 m³/s in cfm (above) to 3 significant digits; in gpm: 2 / 6.30901964e-5 = 31701 gpm (NIST SP 811 B.8, gallon [U.S.]).
    expect(messageValueText({ si: 2, unit: 'm³/s', air: true }, 'us', 'en-US')).toBe('4,240\u202fcfm');
    expect(messageValueText({ si: 2, unit: 'm³/s' }, 'us', 'en-US')).toBe('31,700\u202fgpm');
    expect(messageValueText({ si: 2, unit: 'm³/s', air: true }, 'si', 'en-US')).toBe('7,200\u202fm³/h');
    expect(messageValueText({ si: 1100, unit: 'Pa' }, 'us', 'en-US')).toBe('4.42\u202fin. w.g.');
  });
});
