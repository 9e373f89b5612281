/**
 * Properties of the battery discharge (fast-check): runtime never increases with load and never
 * decreases with capacity; the energy drawn from the cells (∫ OCV·I dt) equals the energy used by
 * the loads plus every loss (chain stages and the bank's internal I²R) to 1e-9 relative.
 * Chains: a bank of any chemistry → cable → DC bus → {inverter → AC load, DC-DC → DC load}.
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import type { Project } from '../../core/index.ts';
import type { Chemistry } from '../../core/data/battery-chemistries.ts';
import { CHEMISTRIES } from '../../core/data/battery-chemistries.ts';
import { simulateDischarge, type DischargeResult } from '../../core/studies/backup/discharge.ts';
import { onSolved } from '../core/solved.ts';

const RUNS = Number(process.env['JP_FC_RUNS'] ?? 40);

interface Case {
  chemistry: Chemistry;
  series: number;
  capacityAh: number;
  acLoad: number;
  dcLoad: number;
  cableR: number;
  duty: boolean;
}

const caseArb = fc.record({
  chemistry: fc.constantFrom(...CHEMISTRIES),
  series: fc.integer({ min: 8, max: 30 }),
  capacityAh: fc.double({ min: 50, max: 600, noNaN: true }),
  acLoad: fc.double({ min: 0, max: 800, noNaN: true }),
  dcLoad: fc.double({ min: 1, max: 300, noNaN: true }),
  cableR: fc.double({ min: 0.05, max: 2, noNaN: true }),
  duty: fc.boolean(),
});

function project(c: Case): Project {
  return {
    format: 'joulepath-project',
    version: 2,
    name: 'property chain',
    elements: [
      { id: 'bank', kind: 'battery', bank: { chemistry: c.chemistry, series: c.series, capacityAh: c.capacityAh, overrides: { maxDischargeCRate: 10 } } },
      { id: 'cable', kind: 'cable', from: 'bank', length: 3, resistancePerKm: c.cableR },
      { id: 'bus', kind: 'dc-bus', from: 'cable', fixedLoss: 3 },
      { id: 'inv', kind: 'inverter', from: 'bus', phases: 1, outputVoltage: 230, frequency: 50, loss: { model: 'constant', efficiency: 0.93, idleLoss: 15 } },
      { id: 'ac', kind: 'ac-load', from: 'inv', power: c.acLoad, powerFactor: 0.9 },
      { id: 'conv', kind: 'dc-dc', from: 'bus', outputVoltage: 12, loss: { model: 'polynomial', p0: 2, k1: 0.03, k2: 1e-4 } },
      { id: 'dc', kind: 'dc-load', from: 'conv', power: c.dcLoad },
    ],
    backup: {
      profile: c.duty ? { kind: 'constant', duty: [{ load: 'ac', periodMinutes: 30, onMinutes: 11 }] } : { kind: 'constant' },
      timeStepSeconds: 120,
      horizonHours: 200,
    },
  };
}

function run(p: Project): DischargeResult | null {
  const out = onSolved(simulateDischarge, p);
  return out.ok ? out.result : null;
}

describe('battery discharge properties', () => {
  it('runtime never increases with load (every load × 1.2)', () => {
    fc.assert(
      fc.property(caseArb, (c) => {
        const a = run(project(c));
        const b = run(project({ ...c, acLoad: c.acLoad * 1.2, dcLoad: c.dcLoad * 1.2 }));
        if (!a || !b) return; // a chain the bank cannot carry is refused, not a counterexample
        expect(b.runtimeSeconds).toBeLessThanOrEqual(a.runtimeSeconds * (1 + 1e-9));
      }),
      { numRuns: RUNS },
    );
  });

  it('runtime never decreases with capacity (Ah × 1.3)', () => {
    fc.assert(
      fc.property(caseArb, (c) => {
        const a = run(project(c));
        const b = run(project({ ...c, capacityAh: c.capacityAh * 1.3 }));
        if (!a) return;
        expect(b).not.toBeNull(); // more capacity: lower resistance and a higher current limit
        expect(b!.runtimeSeconds).toBeGreaterThanOrEqual(a.runtimeSeconds * (1 - 1e-9));
      }),
      { numRuns: RUNS },
    );
  });

  it('energy drawn from the cells = loads + chain losses + internal I²R, to 1e-9 relative', () => {
    fc.assert(
      fc.property(caseArb, (c) => {
        const r = run(project(c));
        if (!r) return;
        const rest = r.loadWh + r.chainLossWh + r.internalLossWh;
        expect(Math.abs(r.drawnWh - rest)).toBeLessThanOrEqual(1e-9 * r.drawnWh);
        expect(Number.isFinite(r.runtimeSeconds)).toBe(true);
      }),
      { numRuns: RUNS },
    );
  });

  it('most cases run (the generator is not mostly refused)', () => {
    const cases = fc.sample(caseArb, { numRuns: 30, seed: 7 });
    const okCount = cases.filter((c) => run(project(c)) !== null).length;
    expect(okCount).toBeGreaterThanOrEqual(20);
  });
});
