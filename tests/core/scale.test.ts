/**
 * Big chains (issue 15, point 8): the engine checks and solves chains of thousands of elements,
 * deep or wide, without recursion on depth, and its answers for them are the ones circuit theory
 * gives. Timings are not asserted here (they are in tests/bench/scale.bench.ts); each case must
 * return a clean result or a clean refusal, never throw.
 *
 * Check values, each from a rule of circuit theory (named beside it), not from the tool:
 * - series impedances add (Kirchhoff's voltage law): n cable pieces of 1 m in series carry the same
 *   current and drop the same voltage as one cable of n m, so the load voltage of the deep run equals
 *   that of a three-element chain with one long cable;
 * - constant-power loads on one bus add (Kirchhoff's current law): 1998 loads of 20 W at pf 0.95 side
 *   by side draw what one load of 39.96 kW at pf 0.95 draws;
 * - converters of constant efficiency η in series: P_in = P_load / η^k (definition of efficiency).
 */
import { describe, expect, it } from 'vitest';
import { solveProject, validateProject, type Element, type Project, type SolveResult } from '../../core/index.ts';
import { flowGraph } from '../../core/studies/energy-flow.ts';
import { studySurges } from '../../core/studies/surge/index.ts';
import { deepCables, deepConverters, deepSized, loop, tree, wide } from '../bench/chains.ts';
import { onSolved } from './solved.ts';

/** Generous per-test limit: the machine is shared; this is no timing assertion, only a guard against a hang. */
const LONG = 120_000;

function solved(p: Project): SolveResult {
  const out = solveProject(p);
  if (!out.ok) throw new Error(JSON.stringify(out.problems.slice(0, 3)));
  // The solve's own invariant (README, Solve method): energy balance to 1e-9.
  expect(out.result.totals.balanceError).toBeLessThan(1e-9);
  return out.result;
}

const loadOf = (r: SolveResult, id = 'load') => r.elements.find((e) => e.id === id)!;

/** Agreement to 1e-9 relative: the solve converges to 1e-12 on voltages; sums of thousands of terms round. */
const expectRelative = (a: number, b: number) => expect(Math.abs(a - b)).toBeLessThanOrEqual(1e-9 * Math.abs(b));

describe('deep series chains', () => {
  it.each([2000, 5000])(
    'a run of %i elements (grid → cable … → load) solves to the load voltage of one cable of the summed length',
    (n) => {
      const r = solved(deepCables(n));
      const base = deepCables(3);
      // The same run as one cable of n − 2 metres (series impedances add).
      (base.elements[1] as Element & { length: number }).length = n - 2;
      const one = solved(base);
      expectRelative(loadOf(r).input!.voltage, loadOf(one).input!.voltage);
      expectRelative(r.totals.losses, one.totals.losses);
      // The diagram's graph of it conserves power at every node (core/studies/energy-flow.ts contract).
      expect(flowGraph(r).conservationError).toBeLessThan(1e-9);
    },
    LONG,
  );

  it.each([2000, 5000])(
    'a chain of %i converters (bank → DC-DC … → load) draws P_load / η^k',
    (n) => {
      const r = solved(deepConverters(n));
      // Definition of efficiency, k = n − 2 converters of 99.99 % in series.
      expectRelative(r.elements.find((e) => e.id === 'dcdc1')!.pIn, 100 / 0.9999 ** (n - 2));
    },
    LONG,
  );

  it(
    'a chain of 5000 DC buses ending in a load given by its current solves (the current is handed up through every bus)',
    () => {
      const elements: Element[] = [{ id: 'bank', kind: 'battery', voltage: 48, internalResistance: 0.01 }];
      let from = 'bank';
      for (let i = 1; i <= 4998; i++) {
        elements.push({ id: `b${i}`, kind: 'dc-bus', from, fixedLoss: 0 });
        from = `b${i}`;
      }
      elements.push({ id: 'load', kind: 'dc-current-load', from, current: 10 });
      const r = solved({ format: 'joulepath-project', version: 2, name: 'Deep buses', elements });
      // Ohm's law at the bank: V = E − I·R = 48 − 10 × 0.01 V; P = V·I.
      expect(loadOf(r).input!.voltage).toBeCloseTo(47.9, 9);
      expect(loadOf(r).pIn).toBeCloseTo(479, 9);
    },
    LONG,
  );

  it(
    'a load beyond reach at the end of a 5000-element run is refused on the link, not thrown',
    () => {
      const p = deepCables(5000);
      // 5 MW through 0.5 Ω per phase from 400 V: past V²/(4R) per phase (about 80 kW), infeasible.
      (p.elements[p.elements.length - 1] as Element & { power: number }).power = 5e6;
      const out = solveProject(p);
      expect(out.ok).toBe(false);
      if (!out.ok) expect(out.problems.map((x) => x.code)).toEqual(['infeasible-load']);
    },
    LONG,
  );

  it(
    'a current beyond reach at the end of a 5000-element run is refused at the load\'s current',
    () => {
      const elements: Element[] = [{ id: 'bank', kind: 'battery', voltage: 48, internalResistance: 0.01 }];
      let from = 'bank';
      for (let i = 1; i <= 4998; i++) {
        elements.push({ id: `c${i}`, kind: 'cable', from, length: 1, resistancePerKm: 1 });
        from = `c${i}`;
      }
      // 4998 m go and return of 1 Ω/km: about 10 Ω; 100 A would need 1000 V of drop from 48 V.
      elements.push({ id: 'load', kind: 'dc-current-load', from, current: 100 });
      const out = solveProject({ format: 'joulepath-project', version: 2, name: 'Deep current', elements });
      expect(out.ok).toBe(false);
      if (!out.ok) expect(out.problems.map((x) => [x.code, x.elementId, x.field])).toEqual([['infeasible-load', 'load', 'current']]);
    },
    LONG,
  );

  it(
    'a run of 5000 elements with conductors sized by the method solves, each link sized',
    () => {
      const r = solved(deepSized(5000));
      const sized = r.elements.filter((e) => e.conductor);
      expect(sized).toHaveLength(4998);
      // 300 W at 400 V three-phase: 0.43 A, the smallest IEC size carries it (IEC 60364-5-52 B.52.4).
      expect(new Set(sized.map((e) => e.conductor!.size))).toEqual(new Set(['1.5 mm²']));
      expect(r.voltageDrop).toHaveLength(1);
      expect(r.voltageDrop![0]!.links).toHaveLength(4998);
    },
    LONG,
  );

  it(
    'the fault study walks a 5000-element run from the bank and from the grid',
    () => {
      const dc: Element[] = [{ id: 'bank', kind: 'battery', voltage: 48, internalResistance: 0.01 }];
      let from = 'bank';
      for (let i = 1; i <= 4998; i++) {
        dc.push({ id: `c${i}`, kind: 'cable', from, length: 1, resistancePerKm: 0.1 });
        from = `c${i}`;
      }
      dc.push({ id: 'load', kind: 'dc-load', from, power: 10 });
      const bat = onSolved(studySurges, { format: 'joulepath-project', version: 2, name: 'Deep DC faults', elements: dc });
      expect(bat.ok).toBe(true);
      if (bat.ok) {
        expect(bat.result.batteryFaults.points).toHaveLength(4999);
        // Thévenin: I = E / (R_internal + 2 × 4998 m × 0.1 Ω/km) at the far end.
        expectRelative(bat.result.batteryFaults.points.at(-1)!.current!, 48 / (0.01 + (2 * 4998 * 0.1) / 1000));
      }
      const ac = onSolved(studySurges, deepCables(5000));
      expect(ac.ok).toBe(true);
      if (ac.ok) expect(ac.result.acFaults.points).toHaveLength(4999);
    },
    LONG,
  );
});

describe('wide and branching chains', () => {
  it(
    '1998 loads on one cable draw what one load of their summed power draws',
    () => {
      const r = solved(wide(2000));
      const one = wide(3);
      (one.elements[2] as Element & { power: number }).power = 1998 * 20;
      const single = solved(one);
      const v = r.elements.find((e) => e.id === 'l1')!.input!.voltage;
      expectRelative(v, single.elements.find((e) => e.id === 'l1')!.input!.voltage);
      expectRelative(r.totals.sourcePower, single.totals.sourcePower);
    },
    LONG,
  );

  it(
    'a binary tree of 2000 elements solves; the source delivers the loads plus the losses',
    () => {
      const r = solved(tree(2000));
      expect(r.elements).toHaveLength(2000);
      // One whole-path drop per load, each summing the cables on its way up (path-drop.ts contract).
      const loads = r.elements.filter((e) => e.role === 'load');
      expect(r.voltageDrop!.map((d) => d.loadId)).toEqual(loads.map((e) => e.id));
    },
    LONG,
  );
});

describe('tree checks on big files', () => {
  it(
    'a loop of 1998 cables is one problem, on its first element, naming a few and how many more',
    () => {
      const v = validateProject(loop(2000));
      expect(v.ok).toBe(false);
      if (v.ok) return;
      expect(v.problems).toHaveLength(1);
      const p = v.problems[0]!;
      expect(p).toMatchObject({ code: 'cycle', elementId: 'r0', field: 'from' });
      expect(p.message).toBe('is part of a loop of 1998 elements ("r0" → "r1997" → "r1996" → "r1995" → … 1994 more → "r0"); a chain must be a tree fed from its source');
    },
    LONG,
  );

  it('two separate loops are two problems, each on its own first element', () => {
    const p = deepCables(4);
    p.elements.push(
      { id: 'a', kind: 'dc-bus', from: 'b', fixedLoss: 0 },
      { id: 'x', kind: 'dc-bus', from: 'x', fixedLoss: 0 },
      { id: 'b', kind: 'dc-bus', from: 'a', fixedLoss: 0 },
      // Hangs off the loop a ↔ b: not on it, so not named as its member.
      { id: 'tail', kind: 'dc-bus', from: 'b', fixedLoss: 0 },
    );
    const v = validateProject(p);
    expect(v.ok).toBe(false);
    if (!v.ok) {
      expect(v.problems.map((x) => [x.code, x.elementId])).toEqual([
        ['cycle', 'a'],
        ['cycle', 'x'],
      ]);
      expect(v.problems[1]!.message).toMatch(/fed from itself/);
    }
  });

  it('an id used twice, the second fed from the first, is refused as a duplicate without overflowing the stack', () => {
    const p = deepCables(3);
    p.elements.splice(2, 0, { id: 'c1', kind: 'cable', from: 'c1', length: 1, resistancePerKm: 0.1 });
    const out = solveProject(p);
    expect(out.ok).toBe(false);
    if (!out.ok) expect(out.problems.map((x) => [x.code, x.elementId, x.field])).toEqual([['duplicate-id', 'c1', 'id']]);
  });

  it(
    'a loop of 5000 elements beside a 5000-deep chain is refused cleanly',
    () => {
      const p = deepCables(5000);
      p.elements.push(...loop(5002).elements.slice(2));
      const out = solveProject(p);
      expect(out.ok).toBe(false);
      if (!out.ok) expect(out.problems.map((x) => x.code)).toEqual(['cycle']);
    },
    LONG,
  );
});
