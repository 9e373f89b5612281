// Yearly cost of losses (core/studies/economics.ts): E = P × t, cost = E (kWh) × price. Check values are
// hand-worked below each case (common practice (no source): the definition of the kWh, 1 kWh =
// 1000 W × 1 h, and of a tariff per kWh).
import { describe, expect, it } from 'vitest';
import { PROJECT_LEVEL } from '../../core/model/errors.ts';
import fc from 'fast-check';
import {
  checkCostSettings,
  energyCost,
  pumpDutyCosts,
  HOURS_IN_YEAR,
  lossCostPerYear,
  MAX_HOURS_PER_YEAR,
} from '../../core/studies/economics.ts';
import { demoProjects, solveProject } from '../../core/index.ts';
import type { ElementResult, SolveResult } from '../../core/model/result.ts';

function element(id: string, role: ElementResult['role'], kind: ElementResult['kind'], pIn: number, pOut: number): ElementResult {
  return { id, name: id.toUpperCase(), kind, role, feeds: [], pIn, pOut, loss: pIn - pOut, efficiency: pIn > 0 ? pOut / pIn : 1 };
}

/** A hand-made chain: source losing 0 W, inverter losing 120 W, cable losing 25 W, load using 2000 W. */
const handChain: SolveResult = {
  projectName: 'hand-worked',
  method: { name: 'fixed-point over exact two-bus link solutions', tolerance: 1e-12, iterations: 1, residual: 0 },
  elements: [
    element('grid', 'source', 'grid', 2145, 2145),
    element('inv', 'stage', 'inverter', 2145, 2025),
    element('cab', 'stage', 'cable', 2025, 2000),
    element('load', 'load', 'ac-load', 2000, 2000),
  ],
  totals: { sourcePower: 2145, loadPower: 2000, losses: 145, balanceError: 0, efficiency: 2000 / 2145 },
  warnings: [],
};

describe('cost of the losses per year', () => {
  it('hand-worked: 120 W and 25 W for 8760 h at 0.30 per kWh', () => {
    const out = lossCostPerYear(handChain, { pricePerKWh: 0.3, hoursPerYear: 8760 });
    if (!out.ok) throw new Error(JSON.stringify(out.problems));
    const { rows, totalCost, totalEnergyKWh, totalLossW } = out.cost;
    // The source loses 0 W and the load is not a loss: only the inverter and the cable are listed.
    expect(rows.map((r) => r.id)).toEqual(['inv', 'cab']);
    // 120 W × 8760 h = 1 051 200 Wh = 1051.2 kWh; × 0.30 = 315.36 (hand-worked).
    expect(rows[0]!.energyKWh).toBeCloseTo(1051.2, 9);
    expect(rows[0]!.cost).toBeCloseTo(315.36, 9);
    // 25 W × 8760 h = 219 kWh; × 0.30 = 65.70 (hand-worked).
    expect(rows[1]!.energyKWh).toBeCloseTo(219, 9);
    expect(rows[1]!.cost).toBeCloseTo(65.7, 9);
    // Totals: 145 W, 1270.2 kWh, 381.06 (hand-worked sums).
    expect(totalLossW).toBeCloseTo(145, 9);
    expect(totalEnergyKWh).toBeCloseTo(1270.2, 9);
    expect(totalCost).toBeCloseTo(381.06, 9);
  });

  it('hand-worked: a working week, 2000 h at 0.12 per kWh', () => {
    const out = lossCostPerYear(handChain, { pricePerKWh: 0.12, hoursPerYear: 2000 });
    if (!out.ok) throw new Error('refused');
    // 145 W × 2000 h = 290 kWh; × 0.12 = 34.80 (hand-worked).
    expect(out.cost.totalEnergyKWh).toBeCloseTo(290, 9);
    expect(out.cost.totalCost).toBeCloseTo(34.8, 9);
  });

  it('on every demo the listed losses add up to the chain’s losses', () => {
    for (const demo of demoProjects) {
      const solved = solveProject(demo.project);
      if (!solved.ok) throw new Error(demo.id);
      const out = lossCostPerYear(solved.result, { pricePerKWh: 0.25, hoursPerYear: HOURS_IN_YEAR });
      if (!out.ok) throw new Error('refused');
      // Conservation: the engine's totals.losses is the sum of the source's and the stages' losses.
      expect(out.cost.totalLossW).toBeCloseTo(solved.result.totals.losses, 6);
      expect(out.cost.totalCost).toBeCloseTo((solved.result.totals.losses * HOURS_IN_YEAR * 0.25) / 1000, 6);
    }
  });

  it('refuses a negative price, hours past a leap year and non-numbers, naming the field', () => {
    const bad = lossCostPerYear(handChain, { pricePerKWh: -0.1, hoursPerYear: 9000 });
    expect(bad.ok).toBe(false);
    if (bad.ok) return;
    expect(bad.problems.map((p) => [p.elementId, p.field])).toEqual([
      [PROJECT_LEVEL, 'running.energyPricePerKWh'],
      [PROJECT_LEVEL, 'running.hoursPerYear'],
    ]);
    expect(checkCostSettings({ pricePerKWh: Number.NaN, hoursPerYear: Number.POSITIVE_INFINITY }).map((p) => p.field)).toEqual(['running.energyPricePerKWh', 'running.hoursPerYear']);
    // 366 × 24 = 8784 h is the longest year (a leap year): accepted; one more hour is not.
    expect(checkCostSettings({ pricePerKWh: 0, hoursPerYear: MAX_HOURS_PER_YEAR })).toEqual([]);
    expect(checkCostSettings({ pricePerKWh: 0, hoursPerYear: MAX_HOURS_PER_YEAR + 1 })).toHaveLength(1);
  });

  it('cost rises with price and with hours (property)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0, max: 10, noNaN: true }),
        fc.double({ min: 0, max: 10, noNaN: true }),
        fc.double({ min: 0, max: MAX_HOURS_PER_YEAR, noNaN: true }),
        fc.double({ min: 0, max: MAX_HOURS_PER_YEAR, noNaN: true }),
        (p1, p2, h1, h2) => {
          const [pLo, pHi] = p1 <= p2 ? [p1, p2] : [p2, p1];
          const [hLo, hHi] = h1 <= h2 ? [h1, h2] : [h2, h1];
          const lo = lossCostPerYear(handChain, { pricePerKWh: pLo, hoursPerYear: hLo });
          const hi = lossCostPerYear(handChain, { pricePerKWh: pHi, hoursPerYear: hHi });
          if (!lo.ok || !hi.ok) return false;
          return lo.cost.totalCost <= hi.cost.totalCost + 1e-9 && lo.cost.totalCost >= 0;
        },
      ),
    );
  });
});

describe('cost of a year of energy', () => {
  it('hand-worked: 1 500 000 Wh at 0.20 per kWh is 300', () => {
    expect(energyCost(1_500_000, 0.2)).toBeCloseTo(300, 9);
  });

  it('flow-control methods: costs and the drive’s savings (hand-worked)', () => {
    const out = pumpDutyCosts({ speedControl: { energyWh: 142e6 }, throttle: { energyWh: 208e6 }, onOff: { energyWh: 190e6 } }, 0.1);
    if (!out.ok) throw new Error('refused');
    // 142 000 kWh × 0.10 = 14 200; 208 000 × 0.10 = 20 800; 190 000 × 0.10 = 19 000 (hand-worked).
    expect(out.costs.speedControl).toBeCloseTo(14200, 6);
    expect(out.costs.throttle).toBeCloseTo(20800, 6);
    expect(out.costs.onOff).toBeCloseTo(19000, 6);
    // Savings: 20 800 − 14 200 = 6600; 19 000 − 14 200 = 4800 (hand-worked).
    expect(out.costs.savingVsThrottle).toBeCloseTo(6600, 6);
    expect(out.costs.savingVsOnOff).toBeCloseTo(4800, 6);
    expect(pumpDutyCosts({ speedControl: { energyWh: 1 }, throttle: { energyWh: 1 }, onOff: { energyWh: 1 } }, -1).ok).toBe(false);
  });
});
