/**
 * Boundary tests of the NEC rules that pick a conductor and its device, each against the published
 * tables (issue 14 points 3–5):
 * - 240.4(B): the next standard rating above the ampacity only when the ampacity is not itself a
 *   standard rating, only up to 800 A (240.4(C) above), never on a multioutlet branch (240.4(B)(1));
 * - 240.4(D): 14/12/10 AWG Cu at 15/20/30 A, 12/10 AWG Al at 15/25 A, per conductor;
 * - 110.14(C)(1)(a)/(b): the 60 °C column for circuits of 100 A or less, and for 14–1 AWG, unless the
 *   terminations are marked 75 °C; the 75 °C column above 100 A for larger sizes (as the conductor
 *   interface of issue 14 reads (a): terminals for 14–1 AWG are taken as marked for those sizes);
 * - 310.10(G): parallel sets only at 1/0 AWG and larger, each set counted toward Table 310.15(C)(1)
 *   (IEC: toward the grouped circuits of Table B.52.17).
 *
 * Published values used (NFPA 70-2023; the same in 2020):
 * - Table 310.16, Cu 60/75/90 °C: 14 AWG 15/20/25, 12 AWG 20/25/30, 10 AWG 30/35/40, 8 AWG 40/50/55,
 *   6 AWG 55/65/75, 4 AWG 70/85/95, 3 AWG 85/100/115, 2 AWG 95/115/130, 1 AWG 110/130/145,
 *   1/0 125/150/170, 2/0 145/175/195, 500 kcmil 320/380/430; Al 75/90 °C: 12 AWG 20/25, 10 AWG 30/35,
 *   8 AWG 40/45.
 * - Table 310.15(C)(1): 4–6 current-carrying conductors 80 %, 7–9 70 %.
 * - 240.6(A) standard ratings: … 15, 20, 25, 30, 35, 40, 45, 50, 60, 70, 80, 90, 100, 110, 125, 150,
 *   175, 200, …, 700, 800, 1000, 1200 ….
 * - 240.4(D) limits (from memory; the Table 310.16 asterisk note pointing to 240.4(D) is confirmed).
 * - Table 430.248 (1φ motors): 2 hp at 230 V = 12 A (confirmed; core/data/nec-430-248.ts).
 * IEC: 60364-5-52:2009 Table B.52.4 method C PVC, 3 loaded: 10 mm² 57 A, 16 mm² 76 A; Table B.52.17
 * bunched, 2 circuits 0.80; IEC 60898-1 rated currents … 63, 80, 100, 125 A.
 */
import { describe, expect, it } from 'vitest';
import { solveProject } from '../../core/index.ts';
import { pick } from './conductor-helpers.ts';

type Conductor = Record<string, unknown>;

/** A single cable from a stiff grid to a resistive load drawing `amps` at the nominal voltage. */
function sized(conductor: Record<string, unknown>, amps: number, opts: { phases?: 1 | 3; parallelSets?: number; length?: number } = {}): { cond: Conductor; warnings: { elementId?: string; code: string }[] } {
  const phases = opts.phases ?? 1;
  const volts = phases === 3 ? 480 : 240;
  const power = phases === 3 ? Math.sqrt(3) * volts * amps : volts * amps; // P = √3·V·I or V·I at pf 1
  const out = solveProject({
    format: 'joulepath-project',
    version: 2,
    name: 'boundary',
    elements: [
      { id: 'g', kind: 'grid', phases, voltage: volts, frequency: 60 },
      { id: 'c', kind: 'cable', from: 'g', length: opts.length ?? 3, ...(opts.parallelSets ? { parallelSets: opts.parallelSets } : {}), conductor },
      { id: 'ld', kind: 'ac-load', from: 'c', power, powerFactor: 1 },
    ],
  });
  if (!out.ok) throw new Error(`refused: ${out.problems.map((p) => `${p.field}: ${p.message}`).join('; ')}`);
  const el = out.result.elements.find((e) => e.id === 'c') as unknown as { conductor: Conductor };
  return { cond: el.conductor, warnings: out.result.warnings as unknown as { elementId?: string; code: string }[] };
}

const nec = (extra: Record<string, unknown>) => ({ system: 'nec', material: 'copper', size: 'auto', insulationRating: 90, ...extra });
const rating = (c: Conductor) => pick(c, 'device.rating');
const total = (c: Conductor) => pick(c, 'ampacity.total') as number;

describe('NEC 240.4(B): the next higher standard rating', () => {
  it('ampacity itself a standard rating (60 A) → no next-higher device: 6 AWG 90 °C × 80 % = 60 A cannot take the 70 A a 52 A continuous load needs; 4 AWG (76 A) can', () => {
    // Continuous 52 A: 210.19(A)(1) needs 65 A in the 75 °C termination column before adjustment (6 AWG: 65 ✓)
    // and 52 A after adjustment (6 AWG: 75 × 0.80 = 60 ✓), but the device ≥ 65 A is 70 A (240.6(A)) and
    // 60 A is a standard rating, so 240.4(B) does not allow 70 A on it. 4 AWG: 95 × 0.80 = 76 A ≥ 70 A.
    const { cond } = sized(nec({ terminationRating: 75, currentCarryingConductors: 6, continuous: true }), 52);
    expect(cond['size']).toBe('4 AWG');
    expect(rating(cond)).toBe(70);
    expect(cond['governing']).toBe('protection');
  });

  it('ampacity between standard ratings (130 A) → the next higher (150 A) is allowed: 128 A on 1 AWG', () => {
    // Terminations marked 75 °C: 2 AWG 115 A < 128 A; 1 AWG 130 A ≥ 128 A;
    // smallest standard ≥ 128 A is 150 A; 130 A is not a standard rating → 240.4(B) allows 150 A.
    const { cond } = sized(nec({ terminationRating: 75 }), 128, { phases: 3 });
    expect(cond['size']).toBe('1 AWG');
    expect(rating(cond)).toBe(150);
    expect(total(cond)).toBe(130);
    expect(cond['governing']).toBe('ampacity');
  });

  it('an ampacity of 100 A (3 AWG at 75 °C, a standard rating) carries a 100 A device, never 110 A', () => {
    const { cond } = sized({ system: 'nec', material: 'copper', size: '3 AWG', insulationRating: 75, terminationRating: 75 }, 99, { phases: 3 });
    expect(total(cond)).toBe(100); // Table 310.16, 3 AWG Cu 75 °C
    expect(rating(cond)).toBe(100);
  });

  it('not on a multioutlet branch (240.4(B)(1)): 8 AWG 90 °C × 80 % = 44 A takes 45 A on an ordinary branch, not on a multioutlet one', () => {
    // 42 A load; 75 °C terminations (limit 50 A); 8 AWG: min(55 × 0.80, 50) = 44 A ≥ 42 A; device ≥ 42 A = 45 A.
    const base = { terminationRating: 75, currentCarryingConductors: 4 };
    const ordinary = sized(nec(base), 42).cond;
    expect(ordinary['size']).toBe('8 AWG');
    expect(rating(ordinary)).toBe(45);
    const multi = sized(nec({ ...base, multioutletBranch: true }), 42).cond;
    // 6 AWG: min(75 × 0.80, 65) = 60 A ≥ 45 A.
    expect(multi['size']).toBe('6 AWG');
    expect(rating(multi)).toBe(45);
    expect(multi['governing']).toBe('protection');
  });

  it('only up to 800 A (240.4(C) above): 3 sets of 500 kcmil 90 °C at 70 % = 903 A never take a 1000 A device', () => {
    // 3 sets × 3 phases = 9 current-carrying conductors → 70 % (Table 310.15(C)(1)); 430 × 0.70 = 301 A per set
    // (below the 75 °C termination limit 380 A); 3 × 301 = 903 A, not a standard rating; the next standard
    // rating (1000 A) is above 800 A, where 240.4(C) wants the device ≤ the ampacity.
    const spec = { system: 'nec', material: 'copper', size: '500 kcmil', insulationRating: 90, terminationRating: 75 };
    const low = sized(spec, 780, { phases: 3, parallelSets: 3 });
    expect(total(low.cond)).toBeCloseTo(903, 6);
    expect(rating(low.cond)).toBe(800);
    const high = sized(spec, 880, { phases: 3, parallelSets: 3 });
    const r = rating(high.cond);
    expect(r === undefined || (r as number) <= 903, `device ${String(r)} A above 903 A over 800 A`).toBe(true);
    expect(high.warnings.some((w) => w.elementId === 'c' && w.code === 'conductor-check')).toBe(true);
  });
});

describe('NEC 240.4(D): small-conductor limits, per conductor', () => {
  // Loads just above each limit; 90 °C insulation and 75 °C terminations so that the ampacity itself is not what stops the size.
  it.each([
    ['copper', 16, '14 AWG', 15, '12 AWG', 20], // 14 AWG: 75 °C 20 A ≥ 16 A, but 240.4(D)(3) 15 A < 20 A device
    ['copper', 21, '12 AWG', 20, '10 AWG', 25], // 12 AWG: 75 °C 25 A ≥ 21 A, 240.4(D)(5) 20 A < 25 A
    ['copper', 31, '10 AWG', 30, '8 AWG', 35], // 10 AWG: 75 °C 35 A ≥ 31 A, 240.4(D)(7) 30 A < 35 A
    ['aluminium', 16, '12 AWG', 15, '10 AWG', 20], // 12 AWG Al: 75 °C 20 A ≥ 16 A, 240.4(D)(4) 15 A < 20 A
    ['aluminium', 26, '10 AWG', 25, '8 AWG', 30], // 10 AWG Al: 75 °C 30 A ≥ 26 A, 240.4(D)(6) 25 A < 30 A
  ] as const)('%s at %s A: %s is held to %s A, so %s with a %s A device', (material, amps, small, _limit, chosen, device) => {
    const { cond } = sized(nec({ material, terminationRating: 75 }), amps);
    expect(cond['size']).not.toBe(small);
    expect(cond['size']).toBe(chosen);
    expect(rating(cond)).toBe(device);
    expect(cond['governing']).toBe('protection');
  });

  it('a fixed 12 AWG Cu never gets more than 20 A, whatever its 90 °C ampacity (30 A)', () => {
    const { cond } = sized({ system: 'nec', material: 'copper', size: '12 AWG', insulationRating: 90, terminationRating: 90 }, 18);
    expect(rating(cond)).toBe(20);
  });

  it('never multiplied by parallel sets: two sets for 28 A are 1/0 AWG (310.10(G)), never 2 × 14 AWG on 30 A', () => {
    const { cond } = sized(nec({ terminationRating: 75 }), 28, { parallelSets: 2 });
    expect(cond['size']).toBe('1/0 AWG');
    expect(pick(cond, 'parallelSets')).toBe(2);
    expect(rating(cond)).toBe(30);
  });
});

describe('NEC 110.14(C)(1): the termination column', () => {
  it('(a) 100 A or less, terminations not marked → 60 °C column: 50 A on 90 °C wire is 6 AWG (55 A), not 8 AWG (50 A at 75 °C)', () => {
    const { cond } = sized(nec({}), 50);
    expect(cond['size']).toBe('6 AWG');
    expect(String(pick(cond, 'ampacity.column'))).toContain('60');
  });
  it('(a)(3) terminations marked 75 °C → 75 °C column: the same 50 A is 8 AWG', () => {
    const { cond } = sized(nec({ terminationRating: 75 }), 50);
    expect(cond['size']).toBe('8 AWG');
    expect(String(pick(cond, 'ampacity.column'))).toContain('75');
  });
  it('(a) at 95 A (14–1 AWG, ≤ 100 A): 60 °C column 2 AWG (95 A), device 100 A by 240.4(B)', () => {
    const { cond } = sized(nec({}), 95, { phases: 3 });
    expect(cond['size']).toBe('2 AWG');
    expect(rating(cond)).toBe(100);
  });
  it('(a) at exactly 100 A: still the 60 °C column → 1 AWG (110 A), not 3 AWG (100 A at 75 °C)', () => {
    const { cond } = sized(nec({}), 100, { phases: 3 });
    expect(cond['size']).toBe('1 AWG');
    expect(rating(cond)).toBe(100);
  });
  it('(a) 14–1 AWG stay in the 60 °C column even above 100 A: 105 A is 1 AWG (110 A at 60 °C), device 110 A', () => {
    const { cond } = sized(nec({}), 105, { phases: 3 });
    expect(cond['size']).toBe('1 AWG');
    expect(String(pick(cond, 'ampacity.column'))).toContain('60');
    expect(rating(cond)).toBe(110);
  });
  it('(b) above 100 A and larger than 1 AWG → 75 °C column: 140 A is 1/0 AWG (150 A at 75 °C), not 2/0 (the 60 °C answer, 145 A)', () => {
    // 1 AWG at 60 °C (110 A) is too small; 1/0 AWG is past the 14–1 AWG range, so (b) gives it 150 A.
    const { cond } = sized(nec({}), 140, { phases: 3 });
    expect(cond['size']).toBe('1/0 AWG');
    expect(String(pick(cond, 'ampacity.column'))).toContain('75');
    expect(rating(cond)).toBe(150);
  });
});

describe('parallel sets: each set counts toward the adjustment', () => {
  it('NEC: 2 sets on 3φ = 6 current-carrying conductors → 80 %: 300 A needs 2 × 2/0 (2 × 156 A), not 2 × 1/0 (2 × 150 A unadjusted)', () => {
    // 1/0 90 °C 170 × 0.80 = 136 A < 150 A per set; 2/0 195 × 0.80 = 156 A (75 °C limit 175 A) → 312 A ≥ 300 A; device 300 A.
    const { cond } = sized(nec({ terminationRating: 75 }), 300, { phases: 3, parallelSets: 2 });
    expect(cond['size']).toBe('2/0 AWG');
    expect(pick(cond, 'parallelSets')).toBe(2);
    expect(total(cond)).toBeCloseTo(312, 6);
    expect(rating(cond)).toBe(300);
  });
  it('IEC: 2 sets count as 2 grouped circuits (B.52.17 bunched 0.80): 100 A needs 2 × 16 mm² (2 × 60.8 A), not 2 × 10 mm² (2 × 57 A ungrouped)', () => {
    const { cond } = sized({ system: 'iec', material: 'copper', size: 'auto', insulation: 'pvc', installationMethod: 'C', loadedConductors: 3 }, 100, { phases: 3, parallelSets: 2 });
    expect(cond['size']).toBe('16 mm²');
    expect(total(cond)).toBeCloseTo(2 * 76 * 0.8, 6);
    expect(rating(cond)).toBe(100);
  });
});

describe('motor branch design current from the NEC tables, not the operating current (430.6(A)(1), 430.22)', () => {
  it('a 2 hp 230 V single-phase motor at half load: Table 430.248 12 A × 1.25 = 15 A, basis motor-branch; 75 °C terminations → 14 AWG (20 A)', () => {
    const out = solveProject({
      format: 'joulepath-project',
      version: 2,
      name: '1φ motor branch',
      elements: [
        { id: 'g', kind: 'grid', phases: 1, voltage: 240, frequency: 60 },
        { id: 'c', kind: 'cable', from: 'g', length: 10, conductor: { system: 'nec', material: 'copper', size: 'auto', insulationRating: 75, terminationRating: 75 } },
        { id: 'm', kind: 'motor', from: 'c', ratedOutput: 2 * 745.7, ratedVoltage: 230, ratedFrequency: 60, poles: 4, nameplate: { efficiency: 0.8, powerFactor: 0.8 } },
        { id: 'sh', kind: 'shaft-load', from: 'm', power: 745.7 },
      ],
    });
    if (!out.ok) throw new Error(`refused: ${out.problems.map((p) => `${p.field}: ${p.message}`).join('; ')}`);
    const cond = (out.result.elements.find((e) => e.id === 'c') as unknown as { conductor: Conductor }).conductor;
    expect(pick(cond, 'designCurrent')).toBeCloseTo(15, 9); // NFPA 70-2023 Table 430.248: 2 hp, 230 V = 12 A
    expect(pick(cond, 'designBasis.basis')).toBe('motor-branch');
    expect(cond['size']).toBe('14 AWG'); // Table 310.16 Cu 75 °C 20 A ≥ 15 A
    expect(pick(cond, 'operatingCurrent') as number).toBeLessThan(15); // half load draws less than the design current
  });
});
