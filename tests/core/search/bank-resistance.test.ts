/**
 * A bank's internal resistance given for the WHOLE bank, re-strung by the option search's strings axis
 * and by the quick system-voltage variant (one helper, core/variants/bank-resistance.ts). Method:
 * series and parallel resistors (Ohm's law), R_bank = R_string·n / m for n blocks in series per string
 * and m strings in parallel; the bank's drop is I·R and its own loss I²·R (Thévenin model of a
 * battery, as core/kinds/battery.ts). Each figure worked by hand beside it.
 */
import { describe, expect, it } from 'vitest';
import { solveProject } from '../../../core/index.ts';
import { solveProjectVariant } from '../../../core/solve/project-variant.ts';
import { searchOptions } from '../../../core/studies/search/index.ts';
import type { EvaluatedOption } from '../../../core/studies/search/evaluate.ts';
import { restrungResistance, systemVoltageVariant } from '../../../core/variants/index.ts';
import type { Project } from '../../../core/model/project.ts';
import type { Solved } from '../../../core/solve/solved.ts';

/** 16 LiFePO4 cells of 100 Ah in one string, 40 mΩ given for the whole bank, feeding a constant 50 A DC load (invented data). */
const chain = (bank: { series: number; strings: number }, resistance: number): Project =>
  ({
    format: 'joulepath-project',
    version: 2,
    name: 'Whole-bank resistance by hand',
    elements: [
      { id: 'bank', name: 'Bank', kind: 'battery', internalResistance: resistance, bank: { chemistry: 'lifepo4', capacityAh: 100, ...bank } },
      { id: 'load', name: 'Load', kind: 'dc-current-load', from: 'bank', current: 50 },
    ],
  }) as unknown as Project;

function solved(p: Project): Solved {
  const s = solveProject(p);
  if (!s.ok) throw new Error(JSON.stringify(s.problems));
  return s;
}

const bankOf = (s: Solved) => s.result.elements.find((e) => e.id === 'bank')!;

describe('the helper: R′ = R · (n′/n) · (m/m′)', () => {
  it('2 strings halve, 3 strings third, twice the series doubles (series and parallel resistors, by hand)', () => {
    expect(restrungResistance(0.04, { series: 16, strings: 1 }, { series: 16, strings: 2 })).toBe(0.02); // 40 mΩ / 2, by hand
    expect(restrungResistance(0.03, { series: 16 }, { series: 16, strings: 3 })).toBe(0.01); // 30 mΩ / 3, by hand
    expect(restrungResistance(0.02, { series: 8, strings: 1 }, { series: 16, strings: 1 })).toBe(0.04); // 20 mΩ × 16/8, by hand
    expect(restrungResistance(0.04, { series: 16, strings: 1 }, { series: 8, strings: 2 })).toBe(0.01); // 40 mΩ × 8/16 ÷ 2, by hand
  });
});

describe('the option search’s strings axis with a resistance given for the whole bank', () => {
  const base = solved(chain({ series: 16, strings: 1 }, 0.04));
  const out = searchOptions(base, { strings: { bank: 'bank', counts: [1, 2], pricePerString: 1000 } }, { allReasons: true });
  if (!out.ok) throw new Error(JSON.stringify(out.problems));
  const byName = new Map(out.search.options.map((o) => [o.name, o]));

  it('2 strings: half the resistance, its drop and its loss at the same bank current (by hand)', () => {
    const two = byName.get('2 strings')!;
    expect(two.variant.set?.['bank']?.['internalResistance']).toBe(0.02); // 40 mΩ ÷ 2 strings in parallel, by hand
    const s = solveProjectVariant(base, two.variant);
    if (!s.ok) throw new Error(JSON.stringify(s.problems));
    const b = bankOf(s);
    // By hand: open-circuit voltage 16 × 3.40 V = 54.4 V (LiFePO4 at full charge, the preset's curve in
    // core/data/battery-chemistries.ts, from memory); 50 A × 20 mΩ = 1.0 V drop → 53.4 V; loss 50² × 0.02 = 50 W.
    expect(b.output!.current).toBeCloseTo(50, 9);
    expect(54.4 - b.output!.voltage).toBeCloseTo(1.0, 9);
    expect(b.loss).toBeCloseTo(50, 9);
    expect(two.lossW).toBeCloseTo(50, 9);
    // One string as it is: 50 A × 40 mΩ = 2.0 V drop → 52.4 V, loss 100 W (by hand).
    const one = byName.get('1 string')!;
    expect(one.variant.set?.['bank']?.['internalResistance']).toBeUndefined();
    expect(54.4 - bankOf(base).output!.voltage).toBeCloseTo(2.0, 9);
    expect(one.lossW).toBeCloseTo(100, 9);
  });

  it('says so in the candidate’s working', () => {
    const two = byName.get('2 strings')!;
    expect(two.choices[0]!.words).toBe('2 strings in Bank (its internal resistance, given for the whole bank, 40 mΩ → 20 mΩ: 1 → 2 strings in parallel)');
    expect(byName.get('1 string')!.choices[0]!.words).toBe('1 string in Bank');
  });

  it('a resistance worked out from the cell is not touched: the bank scales it itself', () => {
    const fromCell = solved({ ...chain({ series: 16, strings: 1 }, 0), elements: chain({ series: 16, strings: 1 }, 0).elements.map((e) => (e.id === 'bank' ? { ...e, internalResistance: undefined } : e)) } as Project);
    const o = searchOptions(fromCell, { strings: { bank: 'bank', counts: [1, 2] } }, { allReasons: true });
    if (!o.ok) throw new Error(JSON.stringify(o.problems));
    const two = o.search.options.find((x) => x.name === '2 strings') ?? o.search.rejected.find((x) => x.name === '2 strings')!;
    expect(two.variant.set?.['bank']?.['internalResistance']).toBeUndefined();
    // LiFePO4 preset 0.05 Ω·Ah per cell (core/data/battery-chemistries.ts, from memory): 16 × 0.05/100 = 8 mΩ a string, 4 mΩ for two: 50² × 0.004 = 10 W (by hand).
    expect(two.lossW).toBeCloseTo(10, 9);
  });

  it('with the system voltage: 48 V → 24 V re-strings 16 cells as 8 × 2 (R ÷ 4), then the strings axis at 24 V', () => {
    // Every option evaluated (the Pareto list keeps only the non-dominated ones).
    const all: EvaluatedOption[] = [];
    const o = searchOptions(base, { systemVoltages: [24, 48], strings: { bank: 'bank', counts: [1, 2] } }, { allReasons: true, onOption: (x) => all.push(x) });
    if (!o.ok) throw new Error(JSON.stringify(o.problems));
    expect(all).toHaveLength(4); // 2 voltages × 2 string counts
    const r = (name: string) => {
      const opt = all.find((x) => x.name === name)!;
      const s = solveProjectVariant(base, opt.variant);
      if (!s.ok) throw new Error(JSON.stringify(s.problems));
      return { opt, lossW: bankOf(s).loss };
    };
    // A cell is 40 mΩ / 16 = 2.5 mΩ (by hand): 8 in series, one string 20 mΩ, two strings 10 mΩ; 50 A → 50 W and 25 W.
    expect(r('24 V system · 1 string').lossW).toBeCloseTo(50, 9);
    expect(r('24 V system · 2 strings').lossW).toBeCloseTo(25, 9);
    expect(r('24 V system · 1 string').opt.choices[1]!.words).toMatch(/10 mΩ → 20 mΩ: 2 → 1 strings in parallel/);
    // At 48 V the chain as it is: 40 mΩ and 20 mΩ.
    expect(r('48 V system · 1 string').lossW).toBeCloseTo(100, 9);
    expect(r('48 V system · 2 strings').lossW).toBeCloseTo(50, 9);
  });
});

describe('the quick system-voltage variant with a resistance given for the whole bank (the same helper)', () => {
  it('24 → 48 V, strings kept: 8 → 16 in series doubles it, 20 → 40 mΩ', () => {
    const v = systemVoltageVariant(chain({ series: 8, strings: 1 }, 0.02), 48);
    if (!v.ok) throw new Error(JSON.stringify(v.problems));
    expect(v.variant.set?.['bank']?.['internalResistance']).toBe(0.04); // 20 mΩ × 16/8, by hand
  });

  it('48 → 24 V with the same cells, 16 × 1 → 8 × 2: a quarter, 40 → 10 mΩ', () => {
    const v = systemVoltageVariant(chain({ series: 16, strings: 1 }, 0.04), 24);
    if (!v.ok) throw new Error(JSON.stringify(v.problems));
    expect(v.variant.set?.['bank']?.['bank']).toMatchObject({ series: 8, strings: 2 });
    expect(v.variant.set?.['bank']?.['internalResistance']).toBe(0.01); // 40 mΩ × 8/16 ÷ 2, by hand
  });
});
