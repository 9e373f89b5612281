/**
 * Conductor sizing invariants over random single links (fast-check):
 * - monotonicity: a longer run never picks a smaller conductor; more load never picks a smaller
 *   conductor (and when the shorter / lighter link is refused, so is the longer / heavier one);
 * - every auto-sized result meets what it claims: ampacity ≥ the design basis current (the
 *   termination column ≥ the design current), the method's drop check ≤ its limit, device rating ≥
 *   design current, and the operating current and exact drop shown are the chain solve's own.
 * Laws: drop and current grow with length and load for a given conductor (Ohm's law, constant-power
 * load), and each requirement passed by a size at a higher current is passed at a lower one.
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { solveProject, type ConductorResult, type ElementResult } from '../../core/index.ts';

type Kind = 'dc' | 'ac1' | 'ac3';
interface Case {
  kind: Kind;
  voltage: number;
  system: 'nec' | 'iec';
  continuous: boolean;
}

function link(c: Case, length: number, power: number) {
  const source =
    c.kind === 'dc'
      ? { id: 'src', kind: 'battery', voltage: c.voltage }
      : { id: 'src', kind: 'grid', phases: c.kind === 'ac3' ? 3 : 1, voltage: c.voltage, frequency: c.system === 'nec' ? 60 : 50 };
  const conductor =
    c.system === 'nec'
      ? { system: 'nec', material: 'copper', size: 'auto', insulationRating: 75, continuous: c.continuous }
      : { system: 'iec', material: 'copper', size: 'auto', insulation: 'xlpe', installationMethod: 'C', continuous: c.continuous };
  const load = c.kind === 'dc' ? { id: 'ld', kind: 'dc-load', from: 'run', power } : { id: 'ld', kind: 'ac-load', from: 'run', power, powerFactor: 0.9 };
  return { format: 'joulepath-project', version: 2, name: 'sizing property', elements: [source, { id: 'run', kind: 'cable', from: 'src', length, conductor }, load] };
}

/** The sized conductor, or null when refused (no size fits, or the link collapses). */
function sized(c: Case, length: number, power: number): { cond: ConductorResult; run: ElementResult } | null {
  const out = solveProject(link(c, length, power));
  if (!out.ok) {
    for (const p of out.problems) if (p.code !== 'no-size-fits' && p.code !== 'infeasible-load') throw new Error(JSON.stringify(p));
    return null;
  }
  const run = out.result.elements.find((e) => e.id === 'run')!;
  return { cond: run.conductor!, run };
}

const caseArb: fc.Arbitrary<Case> = fc.record({
  kind: fc.constantFrom<Kind>('dc', 'ac1', 'ac3'),
  voltage: fc.constantFrom(12, 24, 48, 120, 230, 400, 480),
  system: fc.constantFrom<'nec' | 'iec'>('nec', 'iec'),
  continuous: fc.boolean(),
});
const lengthArb = fc.double({ min: 1, max: 300, noNaN: true });
/** Load as a current scale: P ≈ V·I for I from 1 to 400 A, so every voltage gets realistic loads. */
const ampsArb = fc.double({ min: 1, max: 400, noNaN: true });
const factorArb = fc.double({ min: 1.0001, max: 3, noNaN: true });
const powerOf = (c: Case, amps: number) => c.voltage * amps * (c.kind === 'ac3' ? Math.sqrt(3) : 1) * (c.kind === 'dc' ? 1 : 0.9);

describe('conductor sizing properties', () => {
  it('a longer run never picks a smaller conductor', () => {
    fc.assert(
      fc.property(caseArb, lengthArb, factorArb, ampsArb, (c, length, k, amps) => {
        const p = powerOf(c, amps);
        const short = sized(c, length, p);
        const long = sized(c, length * k, p);
        if (short === null) expect(long).toBeNull();
        else if (long !== null) expect(long.cond.areaMm2).toBeGreaterThanOrEqual(short.cond.areaMm2);
      }),
      { numRuns: 150 },
    );
  });

  it('more load current never picks a smaller conductor', () => {
    fc.assert(
      fc.property(caseArb, lengthArb, factorArb, ampsArb, (c, length, k, amps) => {
        const light = sized(c, length, powerOf(c, amps));
        const heavy = sized(c, length, powerOf(c, amps) * k);
        if (light === null) expect(heavy).toBeNull();
        else if (heavy !== null) expect(heavy.cond.areaMm2).toBeGreaterThanOrEqual(light.cond.areaMm2);
      }),
      { numRuns: 150 },
    );
  });

  it('an auto-sized link meets what it claims and is the solve’s own operating point', () => {
    fc.assert(
      fc.property(caseArb, lengthArb, ampsArb, (c, length, amps) => {
        const s = sized(c, length, powerOf(c, amps));
        if (s === null) return;
        const { cond, run } = s;
        const rel = 1e-9;
        expect(cond.current).toBeCloseTo(run.input!.current, 9);
        expect(Math.abs(cond.drop.exactPercent - (100 * (run.input!.voltage - run.output!.voltage)) / run.input!.voltage)).toBeLessThan(1e-9);
        // The limit is checked on the method's drop (NEC Ch. 9 Table 9 / IEC Annex G) at the design basis current.
        expect(cond.drop.checkPercent).toBeLessThanOrEqual(cond.drop.limitPercent * (1 + rel));
        // The ampacity carries the design basis current (and the termination column its 125 %).
        expect(cond.ampacity.total).toBeGreaterThanOrEqual(cond.designBasis.baseCurrent * (1 - rel));
        if (cond.ampacity.terminationLimit !== undefined) expect(cond.ampacity.terminationLimit * cond.parallelSets).toBeGreaterThanOrEqual(cond.designCurrent * (1 - rel));
        if (cond.device.rating !== undefined) expect(cond.device.rating).toBeGreaterThanOrEqual(cond.designCurrent * (1 - rel));
        for (const x of [cond.loss, cond.drop.approxVolts, cond.resistance.perKm, cond.resistance.operatingTemperature]) expect(Number.isFinite(x)).toBe(true);
      }),
      { numRuns: 200 },
    );
  });
});
