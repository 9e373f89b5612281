/**
 * Feasibility at the nose of the P–V curve, over random single links.
 *
 * Law (maximum power transfer through a series resistance, a textbook result): a stiff source of
 * voltage V behind a resistance R can deliver at most P_max = V²/(4R) to a constant-power load at
 * unity power factor, and below that the operating point is the upper root
 * V_r = (V + √(V² − 4·R·P))/2 of P = V_r·(V − V_r)/R. Per phase on three-phase: V_ph²/(4R) per
 * phase, so V_LL²/(4R) in total. R here is the loop resistance on DC and single-phase.
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { solveProject, type Project } from '../../core/index.ts';
import { RANGES } from '../../core/kinds/ranges.ts';

/** Loads beyond the plausible ranges (1 GW, 1 MA: core/kinds/ranges.ts) are refused at their own field, before any law applies. */
const plausible = (watts: number, amps = 0) => watts <= RANGES.power.max && amps <= RANGES.current.max;

type Kind = 'dc' | 'ac1' | 'ac3';

function link(kind: Kind, voltage: number, length: number, rPerKm: number, power: number): Project {
  const source =
    kind === 'dc'
      ? { id: 'src', kind: 'battery' as const, voltage }
      : { id: 'src', kind: 'grid' as const, phases: kind === 'ac3' ? (3 as const) : (1 as const), voltage, frequency: 50 };
  const load = kind === 'dc' ? { id: 'load', kind: 'dc-load' as const, from: 'run', power } : { id: 'load', kind: 'ac-load' as const, from: 'run', power, powerFactor: 1 };
  return {
    format: 'joulepath-project',
    version: 2,
    name: 'Nose check',
    elements: [source, { id: 'run', kind: 'cable', from: 'src', length, resistancePerKm: rPerKm }, load],
  };
}

/** Loop resistance on DC/1φ (2 × length), one conductor on 3φ (model.ts, cable). */
const resistance = (kind: Kind, length: number, rPerKm: number) => ((kind === 'ac3' ? 1 : 2) * length * rPerKm) / 1000;
/** P_max = V²/(4R) (V line-to-line and R per phase on 3φ). */
const pMax = (kind: Kind, v: number, r: number) => (v * v) / (4 * r);

const kindArb = fc.constantFrom<Kind>('dc', 'ac1', 'ac3');
const voltageArb = fc.constantFrom(12, 48, 230, 400, 690);
const lengthArb = fc.double({ min: 1, max: 500, noNaN: true });
const rPerKmArb = fc.double({ min: 0.05, max: 20, noNaN: true });

describe('feasibility at the nose of the P–V curve', () => {
  it('below P_max the load is delivered at the upper root V_r = (V + √(V² − 4RP))/2', () => {
    fc.assert(
      fc.property(kindArb, voltageArb, lengthArb, rPerKmArb, fc.double({ min: 0.001, max: 0.99, noNaN: true }), (kind, v, length, rPerKm, k) => {
        const r = resistance(kind, length, rPerKm);
        const p = k * pMax(kind, v, r);
        fc.pre(plausible(p));
        const outcome = solveProject(link(kind, v, length, rPerKm, p));
        if (!outcome.ok) throw new Error(`refused ${p} W below P_max ${pMax(kind, v, r)} W: ${JSON.stringify(outcome.problems)}`);
        const run = outcome.result.elements.find((e) => e.id === 'run')!;
        // Per phase on 3φ: V_ph and P/3 give V_r,ph; the same ratio holds line-to-line.
        const vr = (v + Math.sqrt(v * v - 4 * r * p)) / 2;
        expect(Math.abs(run.output!.voltage - vr)).toBeLessThanOrEqual(1e-9 * v);
        expect(run.output!.voltage).toBeGreaterThanOrEqual(v / 2 - 1e-9 * v); // upper branch
      }),
      { numRuns: 300 },
    );
  });

  it('above P_max the solve refuses with infeasible-load naming the link', () => {
    fc.assert(
      fc.property(kindArb, voltageArb, lengthArb, rPerKmArb, fc.double({ min: 1.001, max: 5, noNaN: true }), (kind, v, length, rPerKm, k) => {
        const r = resistance(kind, length, rPerKm);
        fc.pre(plausible(k * pMax(kind, v, r)));
        const outcome = solveProject(link(kind, v, length, rPerKm, k * pMax(kind, v, r)));
        expect(outcome.ok).toBe(false);
        if (outcome.ok) return;
        expect(outcome.problems.map((p) => [p.code, p.elementId])).toEqual([['infeasible-load', 'run']]);
        expect(outcome.problems[0]!.message.length).toBeGreaterThan(20);
      }),
      { numRuns: 300 },
    );
  });
});

/**
 * Law (Ohm's law with the load current held, a textbook result): a constant-current load I behind a
 * loop resistance R from a stiff DC source E sits at V_r = E − I·R, with no nose: any I·R < E is
 * delivered, any I·R ≥ E is not (the voltage would reach zero). On AC at unity power factor the
 * same holds per phase (the current in phase with V_r): V_r,ph = V_ph − I·R.
 */
describe('constant-current loads through one link', () => {
  const currentLink = (kind: Kind, voltage: number, length: number, rPerKm: number, current: number): Project => {
    const p = link(kind, voltage, length, rPerKm, 0);
    const load = kind === 'dc' ? { id: 'load', kind: 'dc-current-load' as const, from: 'run', current } : { id: 'load', kind: 'ac-current-load' as const, from: 'run', current, powerFactor: 1 };
    return { ...p, elements: [p.elements[0]!, p.elements[1]!, load] };
  };
  const perPhase = (kind: Kind, v: number) => (kind === 'ac3' ? v / Math.sqrt(3) : v);

  it('below I·R = V the load sits at V_r = V − I·R (per phase), drawing P = V_r·I per phase', () => {
    fc.assert(
      fc.property(kindArb, voltageArb, lengthArb, rPerKmArb, fc.double({ min: 0.001, max: 0.999, noNaN: true }), (kind, v, length, rPerKm, k) => {
        const r = resistance(kind, length, rPerKm);
        const vPh = perPhase(kind, v);
        const current = (k * vPh) / r;
        fc.pre(plausible(0, current));
        const outcome = solveProject(currentLink(kind, v, length, rPerKm, current));
        if (!outcome.ok) throw new Error(`refused ${current} A below V/R: ${JSON.stringify(outcome.problems)}`);
        const load = outcome.result.elements.find((e) => e.id === 'load')!;
        const vr = vPh - current * r;
        const m = kind === 'ac3' ? 3 : 1;
        expect(Math.abs(load.input!.voltage / (kind === 'ac3' ? Math.sqrt(3) : 1) - vr)).toBeLessThanOrEqual(1e-9 * vPh);
        expect(Math.abs(load.input!.current - current)).toBeLessThanOrEqual(1e-9 * current);
        expect(Math.abs(load.pIn - m * vr * current)).toBeLessThanOrEqual(1e-9 * m * vPh * current);
      }),
      { numRuns: 300 },
    );
  });

  it('at or above I·R = V the solve refuses the load’s current', () => {
    fc.assert(
      fc.property(kindArb, voltageArb, lengthArb, rPerKmArb, fc.double({ min: 1.001, max: 5, noNaN: true }), (kind, v, length, rPerKm, k) => {
        const r = resistance(kind, length, rPerKm);
        fc.pre(plausible(0, (k * perPhase(kind, v)) / r));
        const outcome = solveProject(currentLink(kind, v, length, rPerKm, (k * perPhase(kind, v)) / r));
        expect(outcome.ok).toBe(false);
        if (outcome.ok) return;
        expect(outcome.problems.map((p) => [p.code, p.elementId, p.field])).toEqual([['infeasible-load', 'load', 'current']]);
      }),
      { numRuns: 300 },
    );
  });
});

/**
 * Law (phasor form of Ohm's law, the current held in magnitude and angle to V_r): with V_r = r as
 * reference and the per-phase current I·(cos φ ∓ j·sin φ), V_s = r + Z·I, so
 * r = −Re(Z·I) + √(|V_s|² − Im(Z·I)²); no real r > 0 means the link cannot deliver the current.
 */
describe('constant-current AC loads through a link with reactance', () => {
  const args = [
    fc.constantFrom<'ac1' | 'ac3'>('ac1', 'ac3'),
    fc.constantFrom(120, 230, 400, 690),
    fc.double({ min: 0.01, max: 2, noNaN: true }), // loop or phase R, Ω
    fc.double({ min: 0, max: 8, noNaN: true }), // X/R
    fc.double({ min: 0.05, max: 1, noNaN: true }), // power factor
    fc.constantFrom<'lagging' | 'leading'>('lagging', 'leading'),
    fc.double({ min: 0.01, max: 3, noNaN: true }), // I·|Z| / V_ph
  ] as const;

  it('the load voltage is the closed form where r > 0 exists, and the current is refused where it does not', () => {
    fc.assert(
      fc.property(...args, (kind, v, r, xr, pf, sense, k) => {
        const length = 100;
        const km = ((kind === 'ac3' ? 1 : 2) * length) / 1000;
        const vPh = kind === 'ac3' ? v / Math.sqrt(3) : v;
        const x = r * xr;
        const current = (k * vPh) / Math.hypot(r, x);
        const sin = Math.sqrt(1 - pf * pf) * (sense === 'leading' ? 1 : -1);
        // Z·I with I = current·(pf + j·sin) relative to V_r.
        const zr = r * current * pf - x * current * sin;
        const zi = r * current * sin + x * current * pf;
        const disc = vPh * vPh - zi * zi;
        const vr = disc >= 0 ? Math.sqrt(disc) - zr : Number.NaN;
        const project: Project = {
          format: 'joulepath-project',
          version: 2,
          name: 'Current load with reactance',
          elements: [
            { id: 'src', kind: 'grid', phases: kind === 'ac3' ? 3 : 1, voltage: v, frequency: 50 },
            { id: 'run', kind: 'cable', from: 'src', length, resistancePerKm: r / km, ...(x > 0 ? { reactancePerKm: x / km } : {}) },
            { id: 'load', kind: 'ac-current-load', from: 'run', current, powerFactor: pf, pfSense: sense },
          ],
        };
        const outcome = solveProject(project);
        // Leave a margin around the boundary r = 0, where rounding may fall either way.
        if (vr > 1e-6 * vPh) {
          if (!outcome.ok) throw new Error(`refused where r = ${vr} V exists: ${JSON.stringify(outcome.problems)}`);
          const load = outcome.result.elements.find((e) => e.id === 'load')!;
          const got = load.input!.voltage / (kind === 'ac3' ? Math.sqrt(3) : 1);
          expect(Math.abs(got - vr)).toBeLessThanOrEqual(1e-9 * vPh);
          expect(Math.abs(load.input!.current - current)).toBeLessThanOrEqual(1e-9 * current);
          expect(outcome.result.totals.balanceError).toBeLessThanOrEqual(1e-9);
        } else if (!(vr > -1e-6 * vPh)) {
          expect(outcome.ok).toBe(false);
          if (!outcome.ok) expect(outcome.problems.map((p) => [p.code, p.elementId, p.field])).toEqual([['infeasible-load', 'load', 'current']]);
        }
      }),
      { numRuns: 400 },
    );
  });
});

/**
 * Law (Kirchhoff's current law at the bus, Ohm's law on the cable): a constant-current load I behind
 * a DC bus of fixed loss P_b, fed through a loop resistance R from a stiff source E, sits at the
 * larger root of V² − (E − R·I)·V + R·P_b = 0 (the cable carries I + P_b/V); with no real root above
 * zero the current cannot be delivered.
 */
describe('a constant-current load behind a DC bus', () => {
  it('sits at the larger root of V² − (E − R·I)·V + R·P_b = 0, or is refused at its current when there is none', () => {
    fc.assert(
      fc.property(
        fc.constantFrom(12, 24, 48, 110),
        fc.double({ min: 0.001, max: 2, noNaN: true }), // R, Ω
        fc.double({ min: 0, max: 500, noNaN: true }), // P_b, W
        fc.double({ min: 0.01, max: 1.5, noNaN: true }), // I·R / E
        (e, r, pBus, k) => {
          const current = (k * e) / r;
          const a = e - r * current;
          const disc = a * a - 4 * r * pBus;
          const v = a > 0 && disc >= 0 ? (a + Math.sqrt(disc)) / 2 : Number.NaN;
          const project: Project = {
            format: 'joulepath-project',
            version: 2,
            name: 'Current load behind a bus',
            elements: [
              { id: 'src', kind: 'battery', voltage: e },
              { id: 'run', kind: 'cable', from: 'src', length: 100, resistancePerKm: r / 0.2 },
              { id: 'bus', kind: 'dc-bus', from: 'run', fixedLoss: pBus },
              { id: 'load', kind: 'dc-current-load', from: 'bus', current },
            ],
          };
          const outcome = solveProject(project);
          // A margin around the boundary (disc = 0 or V = 0), where rounding may fall either way.
          if (a > 1e-6 * e && disc > 1e-6 * a * a) {
            if (!outcome.ok) throw new Error(`refused where V = ${v} V exists: ${JSON.stringify(outcome.problems)}`);
            const load = outcome.result.elements.find((x) => x.id === 'load')!;
            expect(Math.abs(load.input!.voltage - v)).toBeLessThanOrEqual(1e-9 * e);
            expect(Math.abs(load.pIn - v * current)).toBeLessThanOrEqual(1e-9 * e * current);
          } else if (a < -1e-6 * e || disc < -1e-6 * a * a) {
            expect(outcome.ok).toBe(false);
            if (!outcome.ok) expect(outcome.problems.map((p) => [p.code, p.elementId, p.field])).toEqual([['infeasible-load', 'load', 'current']]);
          }
        },
      ),
      { numRuns: 400 },
    );
  });
});
