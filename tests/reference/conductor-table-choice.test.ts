/**
 * The chosen auto size against the published table, independently of core/data (issue 14, "Proof":
 * "a separate test that the chosen size matches the table for the design current").
 *
 * For many design currents (fast-check, plus every table value itself, where a size must just
 * pass), a short DC run from a stiff 240 V bank to a constant-power load that draws exactly that
 * current at the nominal voltage (so voltage drop never governs; 30 °C; 2 current-carrying
 * conductors, so no adjustment) must be sized to the smallest size whose PUBLISHED Table 310.16
 * value, in the column the code means, carries the design current:
 * - unmarked terminations (NEC 110.14(C)(1)): the 60 °C column for circuits of 100 A or less and for
 *   14–1 AWG ((a)); the 75 °C column above 100 A for larger sizes ((b));
 * - terminations marked 75 °C ((a)(3)): the 75 °C column throughout.
 * 90 °C insulation, so the termination column is the one that limits.
 *
 * Copper columns copied from NFPA 70-2023 Table 310.16 (unchanged from the 2014 edition for these
 * sizes); 240.4(D) never binds in the 60 °C column (15/20/30 A are the 14/12/10 AWG values
 * themselves) and, in the 75 °C column, decides 14–10 AWG as its limits say.
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { solveProject } from '../../core/index.ts';

// NFPA 70-2023 Table 310.16, copper, 30 °C, ≤ 3 current-carrying conductors: [size, 60 °C, 75 °C].
const T310_16_CU: readonly [string, number, number][] = [
  ['14 AWG', 15, 20],
  ['12 AWG', 20, 25],
  ['10 AWG', 30, 35],
  ['8 AWG', 40, 50],
  ['6 AWG', 55, 65],
  ['4 AWG', 70, 85],
  ['3 AWG', 85, 100],
  ['2 AWG', 95, 115],
  ['1 AWG', 110, 130],
  ['1/0 AWG', 125, 150],
  ['2/0 AWG', 145, 175],
  ['3/0 AWG', 165, 200],
  ['4/0 AWG', 195, 230],
  ['250 kcmil', 215, 255],
  ['300 kcmil', 240, 285],
  ['350 kcmil', 260, 310],
  ['400 kcmil', 280, 335],
  ['500 kcmil', 320, 380],
];
const UP_TO_1_AWG = 9; // rows 0..8 are 14–1 AWG
// NEC 240.4(D)(3)/(5)/(7): 14, 12, 10 AWG copper at most 15, 20, 30 A (from memory; the Table 310.16 note pointing here is confirmed).
const LIMIT_240_4_D: Record<string, number> = { '14 AWG': 15, '12 AWG': 20, '10 AWG': 30 };
// NEC 240.6(A) (2023) standard ratings up to 400 A.
const STANDARD = [10, 15, 20, 25, 30, 35, 40, 45, 50, 60, 70, 80, 90, 100, 110, 125, 150, 175, 200, 225, 250, 300, 350, 400];

/** The size the code gives for `amps`, from the published columns above. */
function expected(amps: number, marked75: boolean): string {
  const device = STANDARD.find((r) => r >= amps)!;
  for (let i = 0; i < T310_16_CU.length; i++) {
    const [size, c60, c75] = T310_16_CU[i]!;
    const col = marked75 ? c75 : amps <= 100 || i < UP_TO_1_AWG ? c60 : c75; // 110.14(C)(1)(a)/(b)
    if (col < amps) continue;
    const limit = LIMIT_240_4_D[size];
    if (limit !== undefined && device > limit) continue; // 240.4(D)
    return size;
  }
  throw new Error(`no size for ${amps} A`);
}

function chosen(amps: number, marked75: boolean): { size: string; designCurrent: number } {
  const out = solveProject({
    format: 'joulepath-project',
    version: 2,
    name: 'table choice',
    elements: [
      { id: 'bat', kind: 'battery', voltage: 240 },
      { id: 'run', kind: 'cable', from: 'bat', length: 1, conductor: { system: 'nec', material: 'copper', size: 'auto', insulationRating: 90, ...(marked75 ? { terminationRating: 75 } : {}) } },
      { id: 'ld', kind: 'dc-load', from: 'run', power: 240 * amps },
    ],
  });
  if (!out.ok) throw new Error(`${amps} A refused: ${out.problems.map((p) => p.message).join('; ')}`);
  return (out.result.elements.find((e) => e.id === 'run') as unknown as { conductor: { size: string; designCurrent: number } }).conductor;
}

/** Size first (the choice), then the design current: the load's current at the nominal bank voltage (NEC 220.5(A)), exactly `amps`. */
function check(amps: number, marked75: boolean): void {
  const c = chosen(amps, marked75);
  expect(c.size, `${amps} A`).toBe(expected(amps, marked75));
  expect(Math.abs(c.designCurrent - amps), `design current ${c.designCurrent} A for ${amps} A`).toBeLessThanOrEqual(1e-9 * amps);
}

describe('auto size = smallest published Table 310.16 size carrying the design current', () => {
  it('the published column copy is ordered (a typo would break the order)', () => {
    for (let i = 1; i < T310_16_CU.length; i++) {
      expect(T310_16_CU[i]![1]).toBeGreaterThan(T310_16_CU[i - 1]![1]);
      expect(T310_16_CU[i]![2]).toBeGreaterThan(T310_16_CU[i - 1]![2]);
    }
  });

  for (const marked75 of [false, true]) {
    const what = marked75 ? 'terminations marked 75 °C' : 'terminations not marked';
    const top = 380; // 500 kcmil at 75 °C carries the most a single set can
    it(`${what}: at every table value (the size just passes)`, () => {
      const values = [...new Set(T310_16_CU.flatMap(([, a, b]) => [a, b]))].filter((v) => v <= top);
      for (const v of values) check(v, marked75);
    });
    it(`${what}: random design currents 1–${top} A`, () => {
      fc.assert(
        fc.property(fc.double({ min: 1, max: top, noNaN: true }), (amps) => {
          check(amps, marked75);
        }),
        { numRuns: 150 },
      );
    });
  }
});
