/**
 * Property tests of loads from circuit elements and of power-factor correction.
 *
 * Laws (each true of linear passive networks; steady-state phasor analysis, any circuits textbook):
 * - the network impedance equals the same series/parallel reduction done with complex.js (an
 *   independent complex-number library), relative 1e-9 of the largest branch impedance in play;
 * - a network of resistors only has X = 0: power factor 1;
 * - networks of R and L only are inductive (X ≥ 0, lagging), of R and C only capacitive (X ≤ 0):
 *   the closed quadrant is kept by sums and by 1/Σ(1/Z);
 * - adding a resistor in series (R grows, X kept) or in parallel (G grows, B kept) never raises
 *   |angle of Z|, so never lowers the power factor;
 * - in a solved chain a network load obeys Ohm's law per phase, |V_phase| = |I|·|Z_phase|, and the
 *   energy balance holds (source = Σ loads + Σ losses, each element pIn = pOut + loss) to 1e-9;
 * - power-factor correction on a stiff supply reaches the target exactly; the fixed bank is leading
 *   at a light-load fraction x exactly when x < 1 − tan φ2/tan φ1; upstream kVA and losses fall.
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import Complex from 'complex.js';
import {
  correctPowerFactor,
  describeNetworkLoads,
  networkImpedance,
  parseNetwork,
  solveProject,
  type CircuitNetwork,
  type ParsedNetwork,
  type Project,
  type SolveResult,
} from '../../core/index.ts';
import { circuitNetworkArb, projectWithNetworksArb } from '../core/arbitraries.ts';
import { onSolved } from '../core/solved.ts';

const SCALE = Math.max(1, Number(process.env['JP_FC_SCALE'] ?? '1') || 1);
const runs = (n: number) => ({ numRuns: n * SCALE });
const REL = 1e-9;

function parsed(net: CircuitNetwork): ParsedNetwork {
  const p = parseNetwork(net);
  if (!p.ok) throw new Error(`generated network does not read: ${JSON.stringify(p.issues)}`);
  return p.network;
}

/** The reduction with complex.js; also returns the largest impedance magnitude met (the rounding scale). */
function reference(n: ParsedNetwork, f: number): { z: Complex; scale: number } {
  const w = 2 * Math.PI * f;
  if (!('items' in n)) {
    const z = n.type === 'resistor' ? new Complex(n.value, 0) : n.type === 'inductor' ? new Complex(0, w * n.value) : new Complex(0, -1 / (w * n.value));
    return { z, scale: z.abs() };
  }
  const parts = n.items.map((item) => reference(item, f));
  const scale = Math.max(...parts.map((p) => p.scale));
  if (n.type === 'series') return { z: parts.reduce((s, p) => s.add(p.z), new Complex(0, 0)), scale };
  const y = parts.reduce((s, p) => s.add(new Complex(1, 0).div(p.z)), new Complex(0, 0));
  const z = new Complex(1, 0).div(y);
  return { z, scale: Math.max(scale, z.abs()) };
}

/** Networks built from some of the component kinds only. */
const networkOf = (kinds: readonly ('resistor' | 'inductor' | 'capacitor')[]): fc.Arbitrary<CircuitNetwork> =>
  fc.letrec<{ net: CircuitNetwork }>((tie) => ({
    net: fc.oneof(
      { maxDepth: 3, withCrossShrink: true },
      ...kinds.map((k) =>
        fc.double({ min: k === 'resistor' ? 0.1 : k === 'inductor' ? 1e-4 : 1e-6, max: k === 'resistor' ? 100 : k === 'inductor' ? 0.1 : 1e-3, noNaN: true }).map((v) => ({ [k]: v }) as CircuitNetwork),
      ),
      fc.record({ series: fc.array(tie('net'), { minLength: 1, maxLength: 3 }) }),
      fc.record({ parallel: fc.array(tie('net'), { minLength: 1, maxLength: 3 }) }),
    ),
  })).net;

const freq = fc.double({ min: 1, max: 400, noNaN: true });
const angle = (n: CircuitNetwork, f: number) => {
  const z = networkImpedance(parsed(n), f);
  return Math.abs(Math.atan2(z.im, z.re));
};

describe('network impedance laws', () => {
  it('(a) equals the series/parallel reduction done with complex.js', () => {
    fc.assert(
      fc.property(circuitNetworkArb, freq, (net, f) => {
        const p = parsed(net);
        const z = networkImpedance(p, f);
        const ref = reference(p, f);
        const err = Math.hypot(z.re - ref.z.re, z.im - ref.z.im);
        expect(err, `engine ${z.re}+j${z.im}, complex.js ${ref.z.re}+j${ref.z.im}`).toBeLessThanOrEqual(REL * ref.scale);
      }),
      runs(1000),
    );
  });

  it('(b) resistors only: X = 0 and the solved load has pf 1', () => {
    fc.assert(
      fc.property(networkOf(['resistor']), freq, (net, f) => {
        const z = networkImpedance(parsed(net), f);
        expect(z.im).toBe(0);
        const out = solveProject({
          format: 'joulepath-project',
          version: 2,
          name: 'R only',
          elements: [
            { id: 'g', kind: 'grid', phases: 1, voltage: 230, frequency: f },
            { id: 'n', kind: 'network-load', from: 'g', network: net },
          ],
        });
        expect(out.ok).toBe(true);
        if (out.ok) {
          expect(out.result.elements[1]!.input!.powerFactor).toBe(1);
          expect(out.result.elements[1]!.input!.pfSense).toBe('unity');
        }
      }),
      runs(200),
    );
  });

  it('(c) R and L only is lagging (X ≥ 0); R and C only is leading (X ≤ 0)', () => {
    fc.assert(
      fc.property(networkOf(['resistor', 'inductor']), networkOf(['resistor', 'capacitor']), freq, (rl, rc, f) => {
        const a = networkImpedance(parsed(rl), f);
        const b = networkImpedance(parsed(rc), f);
        expect(a.re).toBeGreaterThanOrEqual(0);
        expect(a.im).toBeGreaterThanOrEqual(0);
        expect(b.re).toBeGreaterThanOrEqual(0);
        expect(b.im).toBeLessThanOrEqual(0);
      }),
      runs(500),
    );
  });

  it('(d) adding a resistor in series or in parallel never raises |angle of Z| (never lowers the pf)', () => {
    fc.assert(
      fc.property(circuitNetworkArb, fc.double({ min: 0.01, max: 1000, noNaN: true }), freq, (net, r, f) => {
        const base = angle(net, f);
        const slack = 1e-12;
        expect(angle({ series: [net, { resistor: r }] }, f)).toBeLessThanOrEqual(base + slack);
        expect(angle({ parallel: [net, { resistor: r }] }, f)).toBeLessThanOrEqual(base + slack);
      }),
      runs(1000),
    );
  });
});

/** Counts solved runs; most random chains must solve (they are sized for a few per cent drop). */
function tally() {
  let total = 0;
  let solved = 0;
  return {
    note(ok: boolean) {
      total++;
      if (ok) solved++;
    },
    check() {
      expect(total).toBeGreaterThan(0);
      expect(solved / total).toBeGreaterThanOrEqual(0.8);
    },
  };
}

function solveOrInfeasible(p: Project): SolveResult | null {
  const out = solveProject(p);
  if (out.ok) return out.result;
  expect(out.problems.map((x) => x.code)).toEqual(['infeasible-load']);
  return null;
}

describe('random chains with network loads', () => {
  it('(e) energy balance to 1e-9 and Ohm’s law at every network load', () => {
    const t = tally();
    let networks = 0;
    fc.assert(
      fc.property(projectWithNetworksArb, (project) => {
        const r = solveOrInfeasible(project);
        t.note(r !== null);
        if (!r) return;
        const scale = Math.max(Math.abs(r.totals.sourcePower), ...r.elements.map((e) => Math.abs(e.pIn)), 1e-300);
        let loads = 0;
        let losses = 0;
        for (const e of r.elements) {
          expect(Math.abs(e.pIn - e.pOut - e.loss)).toBeLessThanOrEqual(REL * Math.max(Math.abs(e.pIn), Math.abs(e.pOut), 1e-300));
          if (e.role === 'load') loads += e.pIn;
          else losses += e.loss;
        }
        expect(Math.abs(r.elements[0]!.pIn - loads - losses)).toBeLessThanOrEqual(REL * scale);
        expect(r.totals.balanceError).toBeLessThanOrEqual(REL);
        for (const n of describeNetworkLoads(project, r)) {
          networks++;
          const vPhase = n.connection === 'delta' ? n.networkVoltage / Math.sqrt(3) : n.networkVoltage;
          // Ohm's law on the per-phase star equivalent: |V_phase| = |I_line|·|Z_Y|.
          expect(Math.abs(vPhase - n.lineCurrent * n.starEquivalent.magnitude)).toBeLessThanOrEqual(REL * vPhase);
          // P = m·I²·R_Y (Joule), m = 3 on three-phase.
          const m = n.connection === 'single-phase' ? 1 : 3;
          expect(Math.abs(n.p - m * n.lineCurrent ** 2 * n.starEquivalent.r)).toBeLessThanOrEqual(REL * Math.max(n.s, 1e-300));
        }
      }),
      runs(300),
    );
    t.check();
    // The generator must actually draw network loads (otherwise this property tests nothing new).
    expect(networks).toBeGreaterThan(50);
  });
});

describe('power-factor correction laws', () => {
  const case3 = fc.record({
    p: fc.double({ min: 100, max: 500_000, noNaN: true }),
    pf: fc.double({ min: 0.3, max: 0.97, noNaN: true }),
    gain: fc.double({ min: 0.05, max: 1, noNaN: true }),
    x: fc.double({ min: 0.01, max: 0.99, noNaN: true }),
    phases: fc.constantFrom(1 as const, 3 as const),
    v: fc.constantFrom(230, 400, 480),
    f: fc.constantFrom(50, 60),
  });

  it('(f) on a stiff supply the target is reached exactly; leading at light load exactly below 1 − tan φ2/tan φ1', () => {
    fc.assert(
      fc.property(case3, ({ p, pf, gain, x, phases, v, f }) => {
        const target = pf + (1 - pf) * gain; // above the present pf, at most 1
        fc.pre(target - pf > 1e-6);
        const out = onSolved(correctPowerFactor, 
          {
            format: 'joulepath-project',
            version: 2,
            name: 'stiff',
            elements: [
              { id: 'g', kind: 'grid', phases, voltage: v, frequency: f },
              { id: 'ld', kind: 'ac-load', from: 'g', power: p, powerFactor: pf },
            ],
          },
          { at: 'ld', targetPowerFactor: target, lightLoadFraction: x },
        );
        expect(out.ok).toBe(true);
        if (!out.ok) return;
        const c = out.correction;
        expect(Math.abs(c.afterSolved.powerFactor - target)).toBeLessThanOrEqual(1e-9);
        const tan = (k: number) => Math.sqrt(1 - k * k) / k;
        const threshold = 1 - tan(target) / tan(pf);
        expect(Math.abs(c.lightLoad.leadingBelowFraction - threshold)).toBeLessThanOrEqual(1e-9);
        if (Math.abs(x - threshold) > 1e-9) expect(c.lightLoad.pfSense === 'leading').toBe(x < threshold);
        // Qc = P·(tan φ1 − tan φ2).
        expect(Math.abs(c.bank.reactivePower - p * (tan(pf) - tan(target)))).toBeLessThanOrEqual(1e-9 * p * tan(pf));
      }),
      runs(300),
    );
  });

  it('(g) behind a cable, correction lowers the cable current and loss and the source kVA', () => {
    fc.assert(
      fc.property(case3, fc.double({ min: 0.005, max: 0.05, noNaN: true }), ({ p, pf, gain, phases, v, f }, drop) => {
        const target = pf + (1 - pf) * gain;
        fc.pre(target - pf > 1e-6);
        const s = p / pf;
        // Cable resistance for about `drop` of the voltage at this load (per phase on 3φ, loop on 1φ).
        const rLoop = (drop * v * v) / s;
        const perKm = phases === 3 ? rLoop / 0.1 : rLoop / 0.2;
        const out = onSolved(correctPowerFactor, 
          {
            format: 'joulepath-project',
            version: 2,
            name: 'feeder',
            elements: [
              { id: 'g', kind: 'grid', phases, voltage: v, frequency: f },
              { id: 'c', kind: 'cable', from: 'g', length: 100, resistancePerKm: perKm, reactancePerKm: perKm / 4 },
              { id: 'ld', kind: 'ac-load', from: 'c', power: p, powerFactor: pf },
            ],
          },
          { at: 'ld', targetPowerFactor: target },
        );
        expect(out.ok).toBe(true);
        if (!out.ok) return;
        const cable = out.correction.upstream.find((u) => u.id === 'c')!;
        expect(cable.currentAfter).toBeLessThan(cable.currentBefore);
        expect(cable.lossAfter).toBeLessThan(cable.lossBefore);
        expect(out.correction.source.sAfter).toBeLessThan(out.correction.source.sBefore);
        expect(out.correction.lossesAfter).toBeLessThan(out.correction.lossesBefore);
      }),
      runs(300),
    );
  });
});
