// Conductor-size words for US readers and resistance per length (web/format/panels.ts), as the
// conductor panel shows them. AWG areas from the ASTM B258-18 gauge formula, checked against NEC
// (NFPA 70, 2023) Chapter 9 Table 8; the foot from NIST SP 811 (2008), Appendix B.8.
import { describe, expect, it } from 'vitest';
import { UNIT_GAP as g } from '../../web/format/number.ts';
import { awgAreaMm2, awgBracket, awgLabel, awgWords, formatResistancePerLength } from '../../web/format/panels.ts';

describe('AWG equivalents of metric sizes', () => {
  it('AWG areas from the ASTM B258 formula agree with NEC Chapter 9 Table 8', () => {
    // NEC (NFPA 70, 2023) Chapter 9 Table 8: 10 AWG 10 380 cmil = 5.26 mm², 4 AWG 41 740 cmil = 21.15 mm²,
    // 4/0 AWG 211 600 cmil = 107.2 mm² (1 cmil = 5.067075e-4 mm², ASTM B258-18).
    expect(awgAreaMm2(10)).toBeCloseTo(5.26, 2);
    expect(awgAreaMm2(4)).toBeCloseTo(21.15, 1);
    expect(awgAreaMm2(-3)).toBeCloseTo(107.2, 0);
  });

  it('a metric size in AWG words', () => {
    // 6 mm² lies between 10 AWG (5.26 mm²) and 9 AWG (6.63 mm²); 21.15 mm² is 4 AWG (NEC Ch. 9 Table 8).
    expect(awgWords(6)).toBe('between 10 AWG and 9 AWG');
    expect(awgBracket(21.15)).toEqual({ equal: '4 AWG' });
    expect(awgWords(95)).toBe('between 3/0 AWG and 4/0 AWG');
    expect(awgWords(240)).toBe('');
  });

  it('resistance per length in Ω/km or Ω/1000 ft', () => {
    // 3.08 Ω/km × 0.3048 km per 1000 ft = 0.9388 Ω/1000 ft (NIST SP 811 foot).
    expect(formatResistancePerLength(3.08, 'us', 'en-US')).toBe(`0.9388${g}Ω/1000${g}ft`);
    expect(formatResistancePerLength(3.08, 'si', 'en-US')).toBe(`3.08${g}Ω/km`);
  });

  it('gauge labels as the trade writes them', () => {
    expect(awgLabel(12)).toBe('12 AWG');
    expect(awgLabel(0)).toBe('1/0 AWG');
    expect(awgLabel(-3)).toBe('4/0 AWG');
  });
});
