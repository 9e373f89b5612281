/**
 * Conductor sizing against published worked examples (issue 14, "Proof"): every case in
 * sizing-examples.ts is solved with the engine and its CHOICE is asserted — size, parallel sets,
 * governing rule, design current and its basis, the ampacity column, the device rating and the drop
 * on the method's own resistance — each beside the book's figure (the case's `source` and `book`).
 *
 * The result fields are read by name (`pick`) rather than through the ConductorResult type, so that
 * this file compiles both before and after the design-current interface of the conductor result
 * (designBasis, operatingCurrent, deviceType, terminationRating, ...) lands; a field the engine does
 * not report yet fails the case with its name, never silently.
 */
import { afterAll, describe, expect, it } from 'vitest';
import { SIZING_EXAMPLES } from './sizing-examples.ts';
import { conductorOf, pick } from './conductor-helpers.ts';

function num(cond: Record<string, unknown>, path: string): number {
  const v = pick(cond, path);
  if (typeof v !== 'number') throw new Error(`conductor result has no number at "${path}" (got ${JSON.stringify(v)})`);
  return v;
}

const table: string[] = [];
afterAll(() => {
  if (table.length) console.log(`Published examples, book beside engine:\n${table.join('\n')}`);
});

describe('the cases themselves', () => {
  it('at least 12 published examples, over NEC and IEC, AC and DC', () => {
    expect(SIZING_EXAMPLES.length).toBeGreaterThanOrEqual(12);
    for (const s of ['nec', 'iec'] as const) for (const k of ['ac', 'dc'] as const) expect(SIZING_EXAMPLES.some((c) => c.system === s && c.kind === k)).toBe(true);
  });
  it('every case names its source, the book\'s figures and a working, and expects at least a size', () => {
    const ids = new Set<string>();
    for (const c of SIZING_EXAMPLES) {
      expect(ids.has(c.id), c.id).toBe(false);
      ids.add(c.id);
      for (const k of ['source', 'book', 'working'] as const) expect(c[k].trim().length, `${c.id}.${k}`).toBeGreaterThan(10);
      expect(c.expect.size, `${c.id} asserts a size`).toBeTruthy();
    }
  });
});

describe.each(SIZING_EXAMPLES)('$id ($system $kind) — $source', (c) => {
  it(`${c.book} → ${c.expect.size}${c.differs ? ` (differs: ${c.differs})` : ''}`, () => {
    const cond = conductorOf(c);
    const e = c.expect;
    const got: string[] = [];
    if (e.size !== undefined) {
      expect(cond['size'], 'size').toBe(e.size);
      got.push(String(cond['size']));
    }
    expect(pick(cond, 'parallelSets') ?? 1, 'parallel sets').toBe(e.parallelSets ?? 1);
    if (e.governing !== undefined) expect(cond['governing'], 'governing rule').toBe(e.governing);
    if (e.designCurrent !== undefined) {
      const d = num(cond, 'designCurrent');
      expect(Math.abs(d - e.designCurrent), `design current ${d} A, book ${e.designCurrent} A`).toBeLessThanOrEqual((e.designTolerance ?? 1e-9) * e.designCurrent);
      got.push(`I design ${d.toFixed(2)} A`);
    }
    if (e.designBasis !== undefined) expect(pick(cond, 'designBasis.basis'), 'design basis').toBe(e.designBasis);
    if (e.column !== undefined) expect(String(pick(cond, 'ampacity.column')), 'ampacity column').toContain(e.column);
    if (e.deviceRating !== undefined) {
      expect(pick(cond, 'device.rating'), 'device rating').toBe(e.deviceRating);
      got.push(`device ${e.deviceRating} A`);
    }
    if (e.dropPercent !== undefined) {
      const d = num(cond, 'drop.checkPercent'); // the drop the limit is checked on (the method, at the design current)
      expect(Math.abs(d - e.dropPercent.value), `drop ${d} %, book ${e.dropPercent.value} %`).toBeLessThanOrEqual(e.dropPercent.tolerancePoints);
      got.push(`drop ${d.toFixed(3)} % (book ${e.dropPercent.value} %)`);
    }
    table.push(`  ${c.id}: book "${c.book}" | engine ${got.join(', ')}`);
  });
});
