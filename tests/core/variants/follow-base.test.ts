/**
 * A variant follows later edits of the plan (core/solve/project-variant.ts mergeSet, changedFields):
 * each quick variant is added, then the plan is edited (the bank's capacity, a cable's insulation and
 * installation method, a loss figure), and the variant solved from the edited plan must equal the
 * edited plan with only the variant's own change applied, built by hand and solved with solveProject
 * (the file format's promise, core/model/variants.ts: "a variant stores only what differs, so an edit
 * of the base reaches every variant"; common practice (no source)). Then the merge's rules: an object
 * given in another form replaces the plan's whole, null takes a nested field out, a list replaces, and
 * an older file's variant that holds a whole object still solves as before.
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { demoProjects } from '../../../core/demos/index.ts';
import { solveProject } from '../../../core/index.ts';
import { changedFields, mergeSet, solveProjectVariant, variantChangeOf } from '../../../core/solve/project-variant.ts';
import { answerStudies } from '../../../core/studies/answers.ts';
import { nextSizeUpVariant, systemVoltageVariant } from '../../../core/variants/index.ts';
import type { Project } from '../../../core/model/project.ts';
import type { ProjectVariant } from '../../../core/model/variants.ts';
import type { Solved } from '../../../core/solve/solved.ts';
import { solved } from './fixtures.ts';

type Plain = Record<string, unknown>;
const demo = (id: string): Project => structuredClone(demoProjects.find((d) => d.id === id)!.project);
const el = (p: Project, id: string) => p.elements.find((e) => e.id === id) as unknown as Plain;
const at = (o: Plain, key: string) => o[key] as Plain;

/** The variant solved from `plan`, and `expected` (the plan with only the variant's change, by hand) solved as a project. */
function both(plan: Project, variant: ProjectVariant, expected: Project): { variant: Solved; expected: Solved } {
  const v = solveProjectVariant(solved(plan), variant);
  if (!v.ok) throw new Error(JSON.stringify(v.problems));
  return { variant: v, expected: solved(expected) };
}

/** The two solves agree: the same elements as stored, the same result, the same runtime. */
function expectSame(s: { variant: Solved; expected: Solved }) {
  expect(s.variant.project.elements).toEqual(s.expected.project.elements);
  expect(s.variant.result).toEqual(s.expected.result);
  const runtime = (x: Solved) => answerStudies(x, null).banks.map((b) => b.runtimeSeconds);
  expect(runtime(s.variant)).toEqual(runtime(s.expected));
}

describe('a quick variant follows later edits of the plan', () => {
  it('24 V system on the hillside hut, then the plan’s bank 200 → 100 Ah: the 24 V option runs 8 × 2 of the 100 Ah cells', () => {
    const plan = demo('hillside-relay-hut');
    const v = systemVoltageVariant(plan, 24);
    if (!v.ok) throw new Error('refused');
    const before = solveProjectVariant(solved(plan), v.variant);
    if (!before.ok) throw new Error('refused');
    at(el(plan, 'bank'), 'bank')['capacityAh'] = 100; // the edit of the plan
    // By hand: the edited plan with the variant's own change: 8 in series × 2 strings, cut-off 44 V × 8/16 = 22 V.
    const expected = structuredClone(plan);
    Object.assign(at(el(expected, 'bank'), 'bank'), { series: 8, strings: 2 });
    el(expected, 'inverter')['lowVoltageCutoff'] = 22;
    const s = both(plan, v.variant, expected);
    expectSame(s);
    expect(at(el(s.variant.project, 'bank'), 'bank')['capacityAh']).toBe(100);
    // Half the capacity: the runtime falls to about half (same loads; common practice (no source)), not the 200 Ah figure it kept before.
    const runtime = (x: Solved) => answerStudies(x, null).banks[0]!.runtimeSeconds;
    expect(runtime(s.variant) / runtime(before)).toBeLessThan(0.6);
  });

  it('next size up on the cold store’s controls run, then the plan’s insulation PVC → XLPE and method C → E: the 16 mm² option is XLPE in free air', () => {
    const plan = demo('cold-store-dc-bus');
    const v = nextSizeUpVariant(solved(plan), 'ctl-cable');
    if (!v.ok) throw new Error(JSON.stringify(v.problems));
    Object.assign(at(el(plan, 'ctl-cable'), 'conductor'), { insulation: 'xlpe', installationMethod: 'E' });
    const expected = structuredClone(plan);
    at(el(expected, 'ctl-cable'), 'conductor')['size'] = '16 mm²'; // IEC 60228 class 2: the size after 10 mm²
    const s = both(plan, v.variant, expected);
    expectSame(s);
    expect(s.variant.result.elements.find((e) => e.id === 'ctl-cable')!.conductor!.size).toBe('16 mm²');
  });

  it('next size up on every cable follows the plan’s edits too (the harbour clinic’s supply cable, method C → B1)', () => {
    const plan = demo('harbour-clinic-ups');
    const v = nextSizeUpVariant(solved(plan), null);
    if (!v.ok) throw new Error(JSON.stringify(v.problems));
    const size = (v.variant.set?.['supply-cable']?.['conductor'] as { size: string }).size;
    at(el(plan, 'supply-cable'), 'conductor')['installationMethod'] = 'B1';
    const expected = structuredClone(plan);
    at(el(expected, 'supply-cable'), 'conductor')['size'] = size;
    expectSame(both(plan, v.variant, expected));
  });

  it('12 V system on the harbour clinic, then the plan’s blocks 100 → 150 Ah and the charger’s no-load draw 35 → 40 W: both reach the option', () => {
    const plan = demo('harbour-clinic-ups');
    const v = systemVoltageVariant(plan, 12);
    if (!v.ok) throw new Error('refused');
    at(el(plan, 'bank'), 'bank')['capacityAh'] = 150;
    at(el(plan, 'rectifier'), 'loss')['idleLoss'] = 40; // the charger's no-load draw, 35 → 40 W
    const expected = structuredClone(plan);
    for (const [id, fields] of Object.entries(v.variant.set ?? {})) {
      const e = el(expected, id);
      for (const [k, value] of Object.entries(fields)) e[k] = typeof value === 'object' ? { ...at(e, k), ...(value as Plain) } : value;
    }
    expectSame(both(plan, v.variant, expected));
  });

  it('"Change a field" (a loss figure of the hillside inverter: its no-load draw 25 → 15 W), then the plan’s curve point at 50 % 93 → 94 %: the option has both', () => {
    const plan = demo('hillside-relay-hut');
    const inverter = el(plan, 'inverter');
    const copy = structuredClone(inverter);
    at(copy, 'loss')['idleLoss'] = 15;
    const set = changedFields(inverter, copy); // as the page's fieldChange stores it (web/components/variants/edit.ts)
    expect(set).toEqual({ loss: { idleLoss: 15 } });
    const variant: ProjectVariant = { name: 'Low-idle inverter', set: { inverter: set } };
    ((at(inverter, 'loss')['points'] as Plain[])[2]!)['efficiency'] = 0.94; // the edit of the plan
    const expected = structuredClone(plan);
    at(el(expected, 'inverter'), 'loss')['idleLoss'] = 15;
    expectSame(both(plan, variant, expected));
  });
});

describe('how a variant’s set is merged', () => {
  it('a loss given as another model replaces the plan’s whole: no curve points or no-load draw left behind (the strict schema would refuse them)', () => {
    const plan = demo('hillside-relay-hut');
    const variant: ProjectVariant = { name: 'Flat 95 %', set: { inverter: { loss: { model: 'constant', efficiency: 0.95 } } } };
    const change = variantChangeOf(solved(plan), variant);
    if (!change.ok) throw new Error('refused');
    expect((change.change.replace![0] as unknown as Plain)['loss']).toEqual({ model: 'constant', efficiency: 0.95 }); // common practice (no source)
    const expected = structuredClone(plan);
    el(expected, 'inverter')['loss'] = { model: 'constant', efficiency: 0.95 };
    expectSame(both(plan, variant, expected));
  });

  it('a conductor from the other table (NEC instead of IEC) replaces the plan’s whole; the same table merges', () => {
    const base = { id: 'c', kind: 'cable', from: 'x', length: 10, conductor: { system: 'iec', material: 'copper', size: 'auto', insulation: 'pvc', installationMethod: 'C', maxDropPercent: 3 } };
    const nec = { system: 'nec', material: 'copper', size: 'auto', insulationRating: 75 };
    expect(mergeSet(base, { conductor: nec })['conductor']).toEqual(nec); // common practice (no source)
    expect(mergeSet(base, { conductor: { system: 'iec', size: '16 mm²' } })['conductor']).toEqual({ ...base.conductor, size: '16 mm²' });
    // changedFields stores the other form whole, and only the changed value within the same form.
    expect(changedFields(base, { ...base, conductor: nec })).toEqual({ conductor: nec });
    expect(changedFields(base, { ...base, conductor: { ...base.conductor, size: '16 mm²' } })).toEqual({ conductor: { size: '16 mm²' } });
  });

  it('a start by another method, a drive loss on another basis, a bank of another chemistry and a network go whole', () => {
    // common practice (no source): a current limit belongs to a soft starter; the other forms' fields do not fit.
    const motor = { id: 'm', kind: 'motor', starting: { method: 'soft-starter', currentLimit: 3.5, codeLetter: 'G' } };
    expect(mergeSet(motor, { starting: { method: 'dol', codeLetter: 'G' } })['starting']).toEqual({ method: 'dol', codeLetter: 'G' });
    expect(mergeSet(motor, { starting: { currentLimit: 3 } })['starting']).toEqual({ method: 'soft-starter', currentLimit: 3, codeLetter: 'G' });
    const drive = { id: 'd', kind: 'drive', standardLoss: { ratedApparentPower: 10000, basis: 'cdm', points: [1, 2, 3, 4, 5, 6, 7, 8] } };
    expect(mergeSet(drive, { standardLoss: { basis: 'pds', ratedApparentPower: 10000 } })['standardLoss']).toEqual({ basis: 'pds', ratedApparentPower: 10000 });
    const bank = { id: 'b', kind: 'battery', bank: { chemistry: 'vrla-agm', series: 4, capacityAh: 100, overrides: { nominalCellVoltage: 2.05 } } };
    expect(mergeSet(bank, { bank: { chemistry: 'lifepo4', series: 4, capacityAh: 100 } })['bank']).toEqual({ chemistry: 'lifepo4', series: 4, capacityAh: 100 });
    const load = { id: 'n', kind: 'network-load', network: { resistor: 10 } };
    expect(mergeSet(load, { network: { series: [{ resistor: 5 }, { inductor: 0.01 }] } })['network']).toEqual({ series: [{ resistor: 5 }, { inductor: 0.01 }] });
  });

  it('null takes a field out at any depth; a list replaces whole; a number replaces', () => {
    // common practice (no source): null = "not given", the element's default applies.
    const cable = { id: 'c', kind: 'cable', from: 'x', length: 10, conductor: { system: 'iec', material: 'copper', size: 'auto', insulation: 'pvc', installationMethod: 'C', maxDropPercent: 3 } };
    expect(at(mergeSet(cable, { conductor: { maxDropPercent: null } }), 'conductor')).not.toHaveProperty('maxDropPercent');
    const bank = { id: 'b', kind: 'battery', bank: { chemistry: 'lifepo4', series: 16, capacityAh: 200, overrides: { nominalCellVoltage: 3.25, internalResistanceOhmAh: 0.1 } } };
    expect(at(at(mergeSet(bank, { bank: { overrides: { internalResistanceOhmAh: null } } }), 'bank'), 'overrides')).toEqual({ nominalCellVoltage: 3.25 });
    const inv = { id: 'i', kind: 'inverter', loss: { model: 'curve', ratedPower: 3000, idleLoss: 25, points: [{ loadFraction: 0.5, efficiency: 0.93 }, { loadFraction: 1, efficiency: 0.9 }] } };
    expect(at(mergeSet(inv, { loss: { points: [{ loadFraction: 1, efficiency: 0.95 }] } }), 'loss')['points']).toEqual([{ loadFraction: 1, efficiency: 0.95 }]);
    // A null inside an object set where the plan has none is no field at all.
    expect(mergeSet({ id: 'x', kind: 'inverter' }, { surge: { apparentPower: 6000, durationSeconds: null } })['surge']).toEqual({ apparentPower: 6000 });
    // The cold store's controls run without its own drop limit: the project's per-link limit applies, as a file without it would.
    const plan = demo('cold-store-dc-bus');
    const expected = structuredClone(plan);
    delete at(el(expected, 'ctl-cable'), 'conductor')['maxDropPercent'];
    expectSame(both(plan, { name: 'Default drop limit', set: { 'ctl-cable': { conductor: { maxDropPercent: null } } } }, expected));
  });

  it('changedFields then mergeSet gives the edited element back (nested values, a value taken out, another form)', () => {
    const before = { id: 'i', kind: 'inverter', phases: 1, loss: { model: 'curve', ratedPower: 3000, idleLoss: 25, points: [{ loadFraction: 1, efficiency: 0.9 }] }, surge: { apparentPower: 6000, durationSeconds: 5 } };
    const edits: Plain[] = [
      { ...before, phases: 3 },
      { ...before, loss: { ...before.loss, idleLoss: 10 } },
      { ...before, loss: { model: 'curve', ratedPower: 3000, points: [{ loadFraction: 1, efficiency: 0.9 }] } },
      { ...before, loss: { model: 'polynomial', p0: 3, k1: 0.02, k2: 0.0001 } },
      { id: 'i', kind: 'inverter', phases: 1, loss: before.loss },
    ];
    for (const after of edits) expect(mergeSet(before, changedFields(before, after))).toEqual(after); // common practice (no source): a round trip
    expect(changedFields(before, edits[2]!)).toEqual({ loss: { idleLoss: null } });
    expect(changedFields(before, edits[4]!)).toEqual({ surge: null });
  });

  it('changedFields then mergeSet gives back any edited element (fast-check, fixed seed; objects nested three deep, form keys among their keys)', () => {
    // common practice (no source): what a variant stores and what it applies are inverse to each other.
    const leaf = fc.oneof(fc.integer({ min: -3, max: 3 }), fc.constantFrom('constant', 'curve', 'iec', 'nec'), fc.array(fc.integer({ min: 0, max: 3 }), { maxLength: 3 }));
    const { node } = fc.letrec((tie) => ({
      node: fc.dictionary(fc.constantFrom('model', 'system', 'method', 'a', 'b'), fc.oneof({ depthSize: 'small', maxDepth: 3 }, leaf, tie('node')), { maxKeys: 4 }),
    }));
    const element = fc.record({ loss: node, conductor: node, bank: node, network: node, surge: node, power: leaf }, { requiredKeys: [] });
    fc.assert(
      fc.property(element, element, (before, after) => {
        const b = { id: 'e', kind: 'generic', ...before };
        const a = { id: 'e', kind: 'generic', ...after };
        expect(mergeSet(b, changedFields(b, a))).toEqual(a);
      }),
      { seed: 20, numRuns: 500 },
    );
  });

  it('an older file’s variant that holds the whole bank solves as before, and keeps overriding what it holds after the plan is edited', () => {
    const plan = demo('hillside-relay-hut');
    const spec = at(el(plan, 'bank'), 'bank');
    // As the 24 V quick variant used to write it: the whole bank with the series and strings changed.
    const old: ProjectVariant = { name: '24 V system', set: { bank: { bank: { ...spec, series: 8, strings: 2 } }, inverter: { lowVoltageCutoff: 22 } } };
    const now = systemVoltageVariant(plan, 24);
    if (!now.ok) throw new Error('refused');
    const a = solveProjectVariant(solved(plan), old);
    const b = solveProjectVariant(solved(plan), now.variant);
    if (!a.ok || !b.ok) throw new Error('refused');
    expect(a.result).toEqual(b.result); // the same chain either way: common practice (no source)
    spec['capacityAh'] = 100; // the plan edited: the old variant holds 200 Ah and keeps it, as it did
    const after = solveProjectVariant(solved(plan), old);
    if (!after.ok) throw new Error('refused');
    expect(at(el(after.project, 'bank'), 'bank')['capacityAh']).toBe(200);
    expect(after.result).toEqual(a.result);
  });
});
