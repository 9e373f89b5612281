/**
 * The typical diesel fuel chart (core/data/diesel-fuel-typical.ts) against the same chart printed in
 * litres by other suppliers (e.g. "Diesel Fuel Consumption Chart (Approximate)", L/h at ¼, ½, ¾ and
 * full load: 20 kW 2.3, 3.4, 4.9, 6.1; 100 kW 9.8, 15.5, 22.0, 28.0; 500 kW 41.6, 70.0, 99.9, 135.1;
 * 2000 kW 162.0, 273.3, 391.7, 537.1), the gallon from NIST SP 811 B.8, and the method the lifetime
 * cost uses on it: linear interpolation between the ¼, ½ and full-load points gives every row's
 * printed ¾-load figure within 4 %.
 */
import { describe, expect, it } from 'vitest';
import { DIESEL_FUEL_CHART, LITRES_PER_US_GALLON } from '../../core/data/diesel-fuel-typical.ts';
import { fuelRate, typicalFuelFigures, TYPICAL_FUEL_NOTE } from '../../core/studies/lifetime.ts';

describe('the typical diesel fuel chart', () => {
  it('the gallon is 3.785412 L (NIST SP 811, B.8)', () => {
    expect(LITRES_PER_US_GALLON).toBeCloseTo(3.785412, 6);
  });
  it('agrees with the chart printed in litres within its 0.1 L rounding', () => {
    // Suppliers' chart in L/h (see the header), rows 20, 100, 500 and 2000 kW.
    const litres: Record<number, number[]> = {
      20: [2.3, 3.4, 4.9, 6.1],
      100: [9.8, 15.5, 22.0, 28.0],
      500: [41.6, 70.0, 99.9, 135.1],
      2000: [162.0, 273.3, 391.7, 537.1],
    };
    for (const [kw, l] of Object.entries(litres)) {
      const row = DIESEL_FUEL_CHART.find((r) => r.kw === Number(kw))!;
      row.gph.forEach((g, i) => expect(Math.abs(g * LITRES_PER_US_GALLON - l[i]!)).toBeLessThanOrEqual(0.1 + 1e-9));
    }
  });
  it('rises with load in every row and with rated power down every column', () => {
    for (const r of DIESEL_FUEL_CHART) for (let i = 1; i < 4; i++) expect(r.gph[i]!).toBeGreaterThan(r.gph[i - 1]!);
    for (let j = 1; j < DIESEL_FUEL_CHART.length; j++) {
      expect(DIESEL_FUEL_CHART[j]!.kw).toBeGreaterThan(DIESEL_FUEL_CHART[j - 1]!.kw);
      for (let i = 0; i < 4; i++) expect(DIESEL_FUEL_CHART[j]!.gph[i]!).toBeGreaterThan(DIESEL_FUEL_CHART[j - 1]!.gph[i]!);
    }
  });
  it('linear interpolation between ¼, ½ and full load gives every row’s printed ¾-load figure within 4 %', () => {
    for (const r of DIESEL_FUEL_CHART) {
      const [q, h, tq, f] = r.gph;
      const at = fuelRate({ quarterLoadLitresPerHour: q, halfLoadLitresPerHour: h, fullLoadLitresPerHour: f }, 0.75)!;
      expect(Math.abs(at / tq - 1), `${r.kw} kW`).toBeLessThan(0.04);
    }
  });
});

describe('typical fuel figures offered for a rated power', () => {
  it('at a row: the row in litres; between rows: interpolated in rated power', () => {
    const t100 = typicalFuelFigures(100_000)!;
    // 100 kW row: 2.6, 4.1, 7.4 gal/h × 3.785411784 = 9.842, 15.520, 28.012 L/h.
    expect(t100.quarterLoadLitresPerHour).toBeCloseTo(2.6 * LITRES_PER_US_GALLON, 9);
    expect(t100.fullLoadLitresPerHour).toBeCloseTo(7.4 * LITRES_PER_US_GALLON, 9);
    // 50 kW, halfway between 40 and 60 kW: ½ load (2.3 + 2.9)/2 = 2.6 gal/h = 9.842 L/h (by hand).
    expect(typicalFuelFigures(50_000)!.halfLoadLitresPerHour).toBeCloseTo(2.6 * LITRES_PER_US_GALLON, 9);
    expect(typicalFuelFigures(20_000)!.halfLoadLitresPerHour).toBeCloseTo(0.9 * LITRES_PER_US_GALLON, 9);
    expect(typicalFuelFigures(2_000_000)!.fullLoadLitresPerHour).toBeCloseTo(141.9 * LITRES_PER_US_GALLON, 9);
    // The words users read with them.
    expect(t100.note).toBe("typical value: use the maker's figure");
    expect(TYPICAL_FUEL_NOTE).toBe(t100.note);
  });
  it('none outside the chart (below 20 kW, above 2 MW, not a number)', () => {
    expect(typicalFuelFigures(5000)).toBeNull();
    expect(typicalFuelFigures(3e6)).toBeNull();
    expect(typicalFuelFigures(Number.NaN)).toBeNull();
  });
});
