/**
 * The system voltage axis of the option search (issue 20 point 4): a hand-built 24 V chain whose bank
 * cable is too thin for 24 V but fine at 48 V (invented data, built on the search fixture).
 */
import { describe, expect, it } from 'vitest';
import { solveProject } from '../../../core/index.ts';
import { searchOptions } from '../../../core/studies/search/index.ts';
import { validateProject } from '../../../core/solve/validate.ts';
import type { Project } from '../../../core/model/project.ts';
import { searchBase } from './fixture.ts';

/**
 * The fixture's chain at 24 V: 8 LiFePO4 cells in series (8 × 3.2 V = 25.6 V nominal) × 4 strings of
 * 100 Ah (the same 32 cells as 16 × 2 at 48 V), the inverter's cut-off at 22 V, the bank cable 10 mm².
 */
export const base24: Project = {
  ...searchBase,
  elements: searchBase.elements.map((e) => {
    if (e.id === 'bank') return { ...e, price: 2000, bank: { chemistry: 'lifepo4', series: 8, strings: 4, capacityAh: 100 } };
    if (e.id === 'inverter') return { ...e, lowVoltageCutoff: 22 };
    return e;
  }),
} as Project;

function solved(p: Project) {
  const s = solveProject(p);
  if (!s.ok) throw new Error(JSON.stringify(s.problems));
  return s;
}

describe('the system voltage axis', () => {
  const base = solved(base24);
  const out = searchOptions(base, { systemVoltages: [48, 24] }, { allReasons: true });
  if (!out.ok) throw new Error(JSON.stringify(out.problems));
  const r = out.search;

  it('lists 48 V first and says why 24 V fails: the drop on the bank cable', () => {
    // By hand: the 1.2 kW load through the 90 % inverter draws P = 1.2 / 0.9 = 1.33 kW from the DC
    // side; I = P / V (P = V·I) = 1333 / 25.6 ≈ 52 A at 24 V, 1333 / 51.2 ≈ 26 A at 48 V. The 10 m
    // run of 10 mm² copper is a 20 m loop of 1.83 Ω/km (IEC 60228 class 2) × 1.25 at the conductor's
    // operating temperature (IEC 60364-5-52 Annex G, ρ₁ = 1.25·ρ₂₀): R ≈ 0.02 × 1.83 × 1.25 = 0.0458 Ω.
    // 24 V: ΔU ≈ 52 × 0.0458 ≈ 2.4 V ≈ 9.3 % of 25.6 V, above the 5 % limit for other uses
    // (IEC 60364-5-52 Table G.52.1); 48 V: ΔU ≈ 26 × 0.0458 ≈ 1.2 V ≈ 2.3 % of 51.2 V, within it.
    // Runtime at 48 V: 32 cells × 3.2 V × 100 Ah = 10.24 kWh over 1.33 kW ≈ 7.7 h ≥ 4 h.
    expect(r.combinations).toBe(2); // two voltages, no other axis: 1 + 1
    expect(r.options.map((o) => o.name)).toEqual(['48 V system']);
    expect(r.options[0]!.choices[0]!.words).toBe('48 V system');
    expect(r.options[0]!.runtimeSeconds!).toBeGreaterThan(4 * 3600);
    // 48 V: the drop about 2.3 % of the 5 % limit, a ratio near 0.46 (by hand, above).
    expect(r.options[0]!.worstDropRatio!).toBeGreaterThan(0.4);
    expect(r.options[0]!.worstDropRatio!).toBeLessThan(0.5);
    const at24 = r.rejected.find((o) => o.name === '24 V system')!;
    expect(at24.choices[0]!.words).toBe('24 V system (as it is)');
    expect(at24.reasons.map((x) => x.text)).toEqual([expect.stringMatching(/^drop on Bank cable 9\.\d+ % above 5 %$/)]);
    // The same cells: the same bank price at both voltages (2000, the bank's own).
    expect(r.options[0]!.cost).toBe(2000);
    // The 48 V variant: 16 in series × 2 strings, the inverter's cut-off doubled (22 V × 2 = 44 V).
    const set = r.options[0]!.variant.set!;
    expect(set['bank']!['bank']).toMatchObject({ series: 16, strings: 2 });
    expect(set['inverter']!['lowVoltageCutoff']).toBe(44);
    expect(r.notes.some((n) => n.startsWith('System voltage: the bank is re-strung'))).toBe(true);
  });

  it('counts the other axes at each voltage: strings of 8 cells at 24 V, of 16 at 48 V', () => {
    // 2 voltages × 2 string counts = 4 combinations (Σ over the voltages of 2). By hand: 24 V fails the
    // drop whatever the strings (above); at 48 V one string of 16 × 3.2 V × 100 Ah = 5.12 kWh lasts
    // under 5.12 / 1.33 = 3.84 h < 4 h, two strings ≈ 7.7 h: only "48 V system · 2 strings" meets it.
    const s = searchOptions(base, { systemVoltages: [24, 48], strings: { bank: 'bank', counts: [1, 2], pricePerString: 500 } }, { allReasons: true });
    if (!s.ok) throw new Error(JSON.stringify(s.problems));
    expect(s.search.combinations).toBe(4);
    expect(s.search.tried).toBe(4);
    expect(s.search.options.map((o) => o.name)).toEqual(['48 V system · 2 strings']);
    const o = s.search.options[0]!;
    expect(o.variant.set!['bank']!['bank']).toMatchObject({ series: 16, strings: 2 });
    // Price per string given at 24 V (8 cells): a 16-cell string is 2 × 500; two of them 2000, counted once.
    expect(o.cost).toBe(2000);
    const one48 = s.search.rejected.find((x) => x.name === '48 V system · 1 string')!;
    // One string runs out as new before 4 h, and is below the two strings the sizing gives (search.test.ts).
    expect(one48.reasons.map((x) => x.group)).toEqual(['Runtime below the target', 'Bank smaller than the sizing for the target']);
    // The cap and progress over the sum.
    const seen: number[] = [];
    const capped = searchOptions(base, { systemVoltages: [24, 48], strings: { bank: 'bank', counts: [1, 2] } }, { maxCombinations: 3, onProgress: (d, t) => seen.push(d, t) });
    if (!capped.ok) throw new Error('refused');
    expect(capped.search.tried).toBe(3);
    expect(capped.search.capMessage).toMatch(/^4 combinations: only the first 3 were tried/);
    expect(seen.slice(-2)).toEqual([3, 3]);
  });

  it('the file takes 12, 24 or 48 V only (the usual DC system voltages, common practice (no source))', () => {
    const v = validateProject({ ...base24, optionSearch: { systemVoltages: [36] } });
    expect(v.ok).toBe(false);
    if (!v.ok) expect(v.problems.some((p) => p.field.startsWith('optionSearch.systemVoltages') && /12, 24 or 48 V/.test(p.message))).toBe(true);
    expect(validateProject({ ...base24, optionSearch: { systemVoltages: [12, 48] } }).ok).toBe(true);
  });

  it('refuses a voltage the chain cannot take, at the field, in words', () => {
    const noBank = validateProject({
      ...searchBase,
      backup: undefined,
      elements: [
        { id: 'grid', name: 'Grid', kind: 'grid', voltage: 230, phases: 1, frequency: 50 },
        { id: 'load', name: 'Load', kind: 'ac-load', from: 'grid', power: 1200, powerFactor: 1 },
      ],
    });
    if (!noBank.ok) throw new Error(JSON.stringify(noBank.problems));
    const s = solved(noBank.project as unknown as Project);
    const o = searchOptions(s, { systemVoltages: [48] });
    expect(o.ok).toBe(false);
    if (!o.ok) {
      expect(o.problems[0]!.field).toBe('optionSearch.systemVoltages');
      expect(o.problems[0]!.message).toMatch(/no bank/);
    }
  });
});
