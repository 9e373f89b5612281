/**
 * Both modes of a random chain with a bank on a bus keep their energy balance to 1e-9 relative (the
 * issue's tolerance; the solve itself stops at 1e-12), and so does the recharge case; the on-battery
 * mode holds exactly the bus's branch, rooted at the bank. Random chains: supply → (cable) →
 * rectifier → DC bus → (cables) → bank, with DC loads, current loads, DC-DC converters and inverters
 * with AC loads on the bus, sized for a small drop. Fixed seeds; JP_FC_SCALE for a longer hunt.
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { solveProject } from '../../core/index.ts';
import { rechargeChange, solveModes } from '../../core/solve/modes.ts';
import { solveVariant } from '../../core/solve/variant.ts';
import { runModesStudy } from '../../core/studies/modes/study.ts';

const SCALE = Math.max(1, Number(process.env['JP_FC_SCALE'] ?? '1') || 1);
const REL = 1e-9;

const chemistry = fc.constantFrom('flooded-lead-acid', 'vrla-agm', 'gel', 'lifepo4', 'nicd');

const loadArb = fc.oneof(
  fc.record({ kind: fc.constant('dc-load'), power: fc.double({ min: 0, max: 2000, noNaN: true }) }),
  fc.record({ kind: fc.constant('dc-current-load'), current: fc.double({ min: 0, max: 30, noNaN: true }) }),
  fc.record({ kind: fc.constant('dc-dc'), power: fc.double({ min: 1, max: 800, noNaN: true }), efficiency: fc.double({ min: 0.8, max: 0.98, noNaN: true }) }),
  fc.record({ kind: fc.constant('inverter'), power: fc.double({ min: 1, max: 2500, noNaN: true }), efficiency: fc.double({ min: 0.85, max: 0.97, noNaN: true }), pf: fc.double({ min: 0.7, max: 1, noNaN: true }) }),
);

const chainArb = fc.record({
  supplyCable: fc.boolean(),
  rectEff: fc.double({ min: 0.85, max: 0.97, noNaN: true }),
  busLoss: fc.double({ min: 0, max: 30, noNaN: true }),
  bankCables: fc.integer({ min: 0, max: 2 }),
  chemistry,
  strings: fc.integer({ min: 1, max: 3 }),
  capacityAh: fc.double({ min: 50, max: 400, noNaN: true }),
  loads: fc.array(loadArb, { minLength: 1, maxLength: 5 }),
  moduleCurrent: fc.double({ min: 5, max: 100, noNaN: true }),
});

type Chain = typeof chainArb extends fc.Arbitrary<infer T> ? T : never;

/** A 48 V class plant (cells in series for about 48 V of each chemistry). */
function projectOf(c: Chain): unknown {
  const cells: Record<string, { series: number; float: number }> = {
    'flooded-lead-acid': { series: 24, float: 54 },
    'vrla-agm': { series: 24, float: 54.5 },
    gel: { series: 24, float: 54 },
    lifepo4: { series: 16, float: 54 },
    nicd: { series: 38, float: 53.2 },
  };
  const cell = cells[c.chemistry]!;
  const el: Record<string, unknown>[] = [{ id: 'grid', kind: 'grid', phases: 1, voltage: 230, frequency: 50, resistance: 0.05 }];
  let at = 'grid';
  if (c.supplyCable) {
    el.push({ id: 'sc', kind: 'cable', from: at, length: 10, resistancePerKm: 1.2 });
    at = 'sc';
  }
  el.push({ id: 'rect', kind: 'rectifier', from: at, outputVoltage: cell.float, inputPowerFactor: 0.98, loss: { model: 'constant', efficiency: c.rectEff } });
  el.push({ id: 'bus', kind: 'dc-bus', from: 'rect', fixedLoss: c.busLoss });
  at = 'bus';
  for (let k = 0; k < c.bankCables; k++) {
    el.push({ id: `bc${k}`, kind: 'cable', from: at, length: 2, resistancePerKm: 0.4 });
    at = `bc${k}`;
  }
  el.push({ id: 'bank', kind: 'battery', from: at, bank: { chemistry: c.chemistry, series: cell.series, strings: c.strings, capacityAh: c.capacityAh } });
  c.loads.forEach((l, i) => {
    // Loads hang on the bus, or on the first bank cable (a branch the bank's path passes).
    const from = i % 2 === 1 && c.bankCables > 0 ? 'bc0' : 'bus';
    if (l.kind === 'dc-load') el.push({ id: `l${i}`, kind: 'dc-load', from, power: l.power });
    else if (l.kind === 'dc-current-load') el.push({ id: `l${i}`, kind: 'dc-current-load', from, current: l.current });
    else if (l.kind === 'dc-dc') {
      el.push({ id: `c${i}`, kind: 'dc-dc', from, outputVoltage: 12, loss: { model: 'constant', efficiency: l.efficiency } });
      el.push({ id: `l${i}`, kind: 'dc-load', from: `c${i}`, power: l.power });
    } else {
      el.push({ id: `c${i}`, kind: 'inverter', from, phases: 1, outputVoltage: 230, frequency: 50, loss: { model: 'constant', efficiency: l.efficiency } });
      el.push({ id: `l${i}`, kind: 'ac-load', from: `c${i}`, power: l.power, powerFactor: l.pf });
    }
  });
  return { format: 'joulepath-project', version: 2, name: 'random plant', elements: el, standby: { moduleCurrent: c.moduleCurrent } };
}

describe('both modes of a random chain with a bank on a bus', () => {
  it('balance to 1e-9 on supply, on battery and in the recharge case; the battery mode is the bus branch', () => {
    let solvedBattery = 0;
    let runs = 0;
    fc.assert(
      fc.property(chainArb, (c) => {
        runs++;
        const p = projectOf(c);
        const s = solveProject(p);
        if (!s.ok) throw new Error(`supply mode refused: ${JSON.stringify(s.problems)}`);
        expect(s.result.totals.balanceError).toBeLessThan(REL);
        const m = solveModes(s)!;
        expect(m).not.toBeNull();
        if (m.battery.ok) {
          solvedBattery++;
          const r = m.battery.result;
          expect(r.totals.balanceError).toBeLessThan(REL);
          expect(r.elements[0]!.id).toBe('bank');
          // Every element but the supply side (grid, supply cable, rectifier) is there, once.
          const ids = new Set(r.elements.map((e) => e.id));
          const expected = s.result.elements.map((e) => e.id).filter((id) => !['grid', 'sc', 'rect'].includes(id));
          expect([...ids].sort()).toEqual([...expected].sort());
          // The same loads use the same power in both modes (their supply is regulated or given as a current on a DC bus
          // whose voltage differs: compare only the loads behind converters).
          for (const e of r.elements.filter((x) => x.role === 'load' && x.input?.kind !== 'dc')) {
            const before = s.result.elements.find((x) => x.id === e.id)!;
            expect(Math.abs(e.pIn - before.pIn)).toBeLessThanOrEqual(REL * Math.max(1, before.pIn));
          }
        } else {
          expect(m.battery.problems.map((x) => x.code)).toEqual(['infeasible-load']);
        }
        const study = runModesStudy(s, m);
        if (!study || !study.ok) throw new Error(`modes study refused: ${JSON.stringify(study)}`);
        const ch = study.study.charger;
        expect(ch.requiredCurrent).toBeCloseTo(ch.loadCurrent + ch.rechargeCurrent, 9);
        // Whole modules: (n − 1)·module < A ≤ n·module, one more for N+1 (the default).
        const mod = ch.modules!;
        expect(mod.needed * mod.moduleCurrent).toBeGreaterThanOrEqual(ch.requiredCurrent * (1 - 1e-12));
        if (mod.needed > 1) expect((mod.needed - 1) * mod.moduleCurrent).toBeLessThan(ch.requiredCurrent);
        expect(mod.installed).toBe(mod.needed + 1);
        // The recharge case balances too.
        const rc = solveVariant(s, rechargeChange(s.project, m.place, ch.rechargeCurrent));
        if (rc.ok) expect(rc.result.totals.balanceError).toBeLessThan(REL);
        else expect(rc.problems.map((x) => x.code)).toEqual(['infeasible-load']);
        return true;
      }),
      { numRuns: 60 * SCALE, seed: 190019 },
    );
    // Most random plants carry their bus on battery (the bank is large against the loads).
    expect(solvedBattery / runs).toBeGreaterThanOrEqual(0.8);
  });
});

/**
 * The same random plants with a transfer switch on the supply side and one on each inverter's output
 * (contact resistance and control power drawn at random), and each inverter an inverter-charger with a
 * pass-through limit: on supply the variant passing the supply through, on battery, and the recharge
 * case from the on-supply mode all balance to 1e-9.
 */
function withSwitches(p: { elements: Record<string, unknown>[] }, r: number, control: number, limit: number): unknown {
  const el: Record<string, unknown>[] = [];
  for (const e of p.elements) {
    if (e['kind'] === 'rectifier') {
      el.push({ id: 'ats', kind: 'transfer-switch', from: e['from'], contactResistance: r, controlPower: control, transferTime: 0.1 });
      el.push({ ...e, from: 'ats' });
    } else if (e['kind'] === 'inverter') {
      el.push({ ...e, passThroughLimit: limit });
      el.push({ id: `${String(e['id'])}-sw`, kind: 'transfer-switch', from: e['id'], contactResistance: r, controlPower: control });
    } else if (e['kind'] === 'ac-load') {
      el.push({ ...e, from: `${String(e['from'])}-sw` });
    } else el.push(e);
  }
  return { ...p, elements: el };
}

describe('both modes of a random chain with transfer switches and inverter-chargers passing the supply through', () => {
  it('balance to 1e-9 on supply (passing through), on battery and in the recharge case', () => {
    fc.assert(
      fc.property(chainArb, fc.double({ min: 0, max: 0.005, noNaN: true }), fc.double({ min: 0, max: 40, noNaN: true }), fc.double({ min: 1, max: 40, noNaN: true }), (c, r, control, limit) => {
        const p = withSwitches(projectOf(c) as { elements: Record<string, unknown>[] }, r, control, limit);
        const s = solveProject(p);
        if (!s.ok) throw new Error(`supply mode refused: ${JSON.stringify(s.problems)}`);
        expect(s.result.totals.balanceError).toBeLessThan(REL);
        const m = solveModes(s)!;
        const inverters = s.project.elements.filter((e) => e.kind === 'inverter').length;
        if (inverters > 0) {
          expect(m.passThrough?.problems).toBeNull();
          expect(m.passThrough?.places.length).toBe(inverters);
        }
        expect(m.supply.result.totals.balanceError).toBeLessThan(REL);
        if (m.battery.ok) expect(m.battery.result.totals.balanceError).toBeLessThan(REL);
        const study = runModesStudy(s, m);
        if (!study || !study.ok) throw new Error(`modes study refused: ${JSON.stringify(study)}`);
        const rc = solveVariant(m.supply, rechargeChange(m.supply.project, m.place, study.study.charger.rechargeCurrent));
        if (rc.ok) expect(rc.result.totals.balanceError).toBeLessThan(REL);
        else expect(rc.problems.map((x) => x.code)).toEqual(['infeasible-load']);
        // Every switch's loss is in the standing losses.
        const switches = m.supply.result.elements.filter((e) => e.kind === 'transfer-switch').reduce((a, e) => a + e.loss, 0);
        expect(study.study.standing.switches).toBeCloseTo(switches, 9);
        return true;
      }),
      { numRuns: 40 * SCALE, seed: 190025 },
    );
  });
});
