/**
 * Sizing is monotone (issue 14, "Proof"), over NEC and IEC, DC, single- and three-phase, with the
 * code's own defaults (unmarked NEC terminations: 110.14(C)(1); IEC circuit-breaker or gG fuse):
 * - a larger load never gets a smaller conductor (area × parallel sets) nor a smaller device;
 * - a longer run never gets a smaller conductor.
 * When the lighter or shorter link is refused (no size fits), so must the heavier or longer one be.
 * Laws: every requirement (ampacity ≥ design current, device between design current and ampacity,
 * drop ≤ limit) a size meets at a larger current or length it also meets at a smaller one, and the
 * standard device ratings are ordered; so the smallest passing size and the smallest fitting device
 * can only grow.
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { solveProject } from '../../core/index.ts';

type Kind = 'dc' | 'ac1' | 'ac3';
interface Case {
  system: 'nec' | 'iec';
  kind: Kind;
  continuous: boolean;
  /** NEC: terminations marked 75 °C, else unmarked; IEC: gG fuse, else circuit-breaker. */
  variant: boolean;
}

const VOLTS: Record<Kind, number> = { dc: 120, ac1: 240, ac3: 400 };

function project(c: Case, length: number, amps: number) {
  const v = VOLTS[c.kind];
  const source = c.kind === 'dc' ? { id: 'src', kind: 'battery', voltage: v } : { id: 'src', kind: 'grid', phases: c.kind === 'ac3' ? 3 : 1, voltage: v, frequency: c.system === 'nec' ? 60 : 50 };
  const conductor =
    c.system === 'nec'
      ? { system: 'nec', material: 'copper', size: 'auto', insulationRating: 90, continuous: c.continuous, ...(c.variant ? { terminationRating: 75 } : {}) }
      : { system: 'iec', material: 'copper', size: 'auto', insulation: 'pvc', installationMethod: 'C', continuous: c.continuous, ...(c.variant ? { deviceType: 'gG-fuse' } : {}) };
  // Constant-power load drawing `amps` at the nominal voltage: P = V·I (DC), V·I·pf (1φ), √3·V·I·pf (3φ).
  const load = c.kind === 'dc' ? { id: 'ld', kind: 'dc-load', from: 'run', power: v * amps } : { id: 'ld', kind: 'ac-load', from: 'run', power: v * amps * 0.9 * (c.kind === 'ac3' ? Math.sqrt(3) : 1), powerFactor: 0.9 };
  return { format: 'joulepath-project', version: 2, name: 'monotone', elements: [source, { id: 'run', kind: 'cable', from: 'src', length, conductor }, load] };
}

interface Sized {
  area: number;
  device: number | undefined;
  size: string;
}

/** The sized conductor, or null when refused for no fitting size; any other refusal fails the test. */
function sized(c: Case, length: number, amps: number): Sized | null {
  const out = solveProject(project(c, length, amps));
  if (!out.ok) {
    for (const p of out.problems) if (p.code !== 'no-size-fits') throw new Error(`${JSON.stringify(c)} ${length} m ${amps} A: ${p.field}: ${p.message}`);
    return null;
  }
  const cond = (out.result.elements.find((e) => e.id === 'run') as unknown as { conductor: { areaMm2: number; parallelSets: number; size: string; device: { rating?: number } } }).conductor;
  return { area: cond.areaMm2 * (cond.parallelSets ?? 1), device: cond.device.rating, size: cond.size };
}

const caseArb: fc.Arbitrary<Case> = fc.record({
  system: fc.constantFrom<'nec' | 'iec'>('nec', 'iec'),
  kind: fc.constantFrom<Kind>('dc', 'ac1', 'ac3'),
  continuous: fc.boolean(),
  variant: fc.boolean(),
});
/** NEC up to 300 A (one set of 500 kcmil carries 380 A at 75 °C); IEC up to 100 A (IEC 60898-1 breakers stop at 125 A). */
const ampsArb = (c: Case) => fc.double({ min: 1, max: c.system === 'nec' ? 300 : 100, noNaN: true });
const lengthArb = fc.double({ min: 1, max: 150, noNaN: true });
const growth = fc.double({ min: 1.001, max: 2.5, noNaN: true });

const desc = (c: Case) => `${c.system} ${c.kind}${c.continuous ? ' continuous' : ''}${c.variant ? (c.system === 'nec' ? ' 75 °C terminations' : ' gG fuse') : ''}`;

describe('sizing is monotone', () => {
  it('a larger load never gets a smaller conductor or a smaller device', () => {
    fc.assert(
      fc.property(caseArb.chain((c) => fc.tuple(fc.constant(c), ampsArb(c), growth, lengthArb)), ([c, amps, k, length]) => {
        const small = sized(c, length, amps);
        const big = sized(c, length, Math.min(amps * k, c.system === 'nec' ? 300 : 100));
        if (small === null) {
          expect(big, `${desc(c)}: ${amps} A refused but ${amps * k} A sized`).toBeNull();
          return;
        }
        if (big === null) return; // more load may need more than the table holds
        expect(big.area, `${desc(c)} ${length.toFixed(1)} m: ${amps.toFixed(2)} A → ${small.size}, ${(amps * k).toFixed(2)} A → ${big.size}`).toBeGreaterThanOrEqual(small.area);
        if (small.device !== undefined && big.device !== undefined) expect(big.device, `${desc(c)}: device ${small.device} A → ${big.device} A`).toBeGreaterThanOrEqual(small.device);
        else expect(small.device === undefined && big.device !== undefined, `${desc(c)}: the lighter load has a device and the heavier has none, or the reverse`).toBe(false);
      }),
      { numRuns: 120 },
    );
  });

  it('a longer run never gets a smaller conductor', () => {
    fc.assert(
      fc.property(caseArb.chain((c) => fc.tuple(fc.constant(c), ampsArb(c), lengthArb, growth)), ([c, amps, length, k]) => {
        const short = sized(c, length, amps);
        const long = sized(c, length * k, amps);
        if (short === null) {
          expect(long, `${desc(c)}: ${length} m refused but ${length * k} m sized`).toBeNull();
          return;
        }
        if (long === null) return;
        expect(long.area, `${desc(c)} ${amps.toFixed(2)} A: ${length.toFixed(1)} m → ${short.size}, ${(length * k).toFixed(1)} m → ${long.size}`).toBeGreaterThanOrEqual(short.area);
      }),
      { numRuns: 120 },
    );
  });

  it('named cases across the 110.14(C) and 240.4(D) steps (NEC 1φ, unmarked terminations): 14 → 100 → 105 → 140 A never shrink', () => {
    const c: Case = { system: 'nec', kind: 'ac1', continuous: false, variant: false };
    // Table 310.16 Cu: 14 A → 14 AWG (15 A at 60 °C); 100 A → 1 AWG (110 A at 60 °C); 105 A → 1 AWG (14–1 AWG stay at 60 °C);
    // 140 A → 1/0 AWG (150 A at 75 °C, 110.14(C)(1)(b)).
    const seq = [14, 100, 105, 140].map((a) => sized(c, 3, a)!);
    for (let i = 1; i < seq.length; i++) expect(seq[i]!.area).toBeGreaterThanOrEqual(seq[i - 1]!.area);
  });
});
