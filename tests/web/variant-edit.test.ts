/**
 * "Change a field" of the compare-options panel with a choice (web/components/variants/ChangeField.tsx):
 * the edit is made on a copy of the element through the form's own descriptors (web/editor/fields.ts: a
 * choice's value and what must follow it, or a group's way of describing a part), and `editedChange`
 * turns it into the variant's `set` — the fields it changed, at any depth, null for those it took out (the
 * file format's rule, core/model/variants.ts; core/solve/project-variant.ts changedFields). Each set is then solved by core's solveProjectVariant.
 */
import { describe, expect, it } from 'vitest';
import { demoProjects, solveProject, solveProjectVariant } from '../../core/index.ts';
import { formFor, shownFields, type ChoiceSpec, type FormElement, type GroupSpec } from '../../web/editor/fields.ts';
import { editedChange, fieldChange, setAtPath, variantElement, variantsChanging } from '../../web/components/variants/edit.ts';

const solvedDemo = (id: string) => {
  const s = solveProject(demoProjects.find((d) => d.id === id)!.project);
  if (!s.ok) throw new Error(`the ${id} demo does not solve`);
  return s;
};
const elementOf = (s: ReturnType<typeof solvedDemo>, id: string) => s.project.elements.find((e) => e.id === id) as unknown as FormElement;
const shown = (e: FormElement) => shownFields(formFor(String(e['kind']))!.fields, e);
const choice = (e: FormElement, label: string) => shown(e).find((f): f is ChoiceSpec => f.type === 'choice' && f.label === label)!;
const group = (e: FormElement, label: string) => shown(e).find((f): f is GroupSpec => f.type === 'group' && f.label === label)!;

describe('a variant that changes a choice', () => {
  it('a top-level choice (the inverter’s phases) sets that field alone, like a number', () => {
    const s = solvedDemo('hillside-relay-hut');
    const inverter = elementOf(s, 'inverter');
    const phases = choice(inverter, 'Phases');
    expect(phases.options).toEqual([
      { value: 1, label: 'Single-phase' },
      { value: 3, label: 'Three-phase' },
    ]); // the form's own choices (web/editor/fields/common.ts phasesField)
    const set = editedChange(inverter, (e) => setAtPath(e, phases.path, 3));
    expect(set).toEqual({ phases: 3 });
    // The same shape a number field gives (fieldChange), and core solves it.
    expect(fieldChange(inverter, 'phases', 3)).toEqual(set);
    const solved = solveProjectVariant(s, { name: 'three-phase', set: { inverter: set } });
    expect(solved.ok).toBe(true);
  });

  it('a choice inside the conductor (insulation) sets that one value of the conductor, so the plan’s other conductor fields still reach it', () => {
    const s = solvedDemo('cold-store-dc-bus');
    const cable = elementOf(s, 'ctl-cable');
    const insulation = choice(cable, 'Insulation');
    const set = editedChange(cable, (e) => setAtPath(e, insulation.path, 'xlpe'));
    expect(set).toEqual({ conductor: { insulation: 'xlpe' } }); // only what the variant changes: common practice (no source)
    const solved = solveProjectVariant(s, { name: 'XLPE', set: { 'ctl-cable': set } });
    expect(solved.ok).toBe(true);
  });

  it('what must follow a choice follows: a size the new material’s table lacks goes back to automatic', () => {
    const s = solvedDemo('cold-store-dc-bus');
    const cable = { ...elementOf(s, 'ctl-cable'), conductor: { ...(elementOf(s, 'ctl-cable')['conductor'] as object), size: '2.5 mm²' } };
    const material = choice(cable, 'Conductor material');
    const set = editedChange(cable, (e) => {
      setAtPath(e, material.path, 'aluminium');
      material.follow!(e, 'aluminium');
    });
    // The form's aluminium list starts at 10 mm² (web/editor/fields/cable.ts sizeOptions, the IEC catalogue): 2.5 mm² goes to auto.
    expect(set['conductor']).toEqual({ material: 'aluminium', size: 'auto' }); // the two values changed, nothing else
  });

  it('a number inside an object sets that one value; one inside a list sets the list whole (fieldChange)', () => {
    const s = solvedDemo('hillside-relay-hut');
    const bank = elementOf(s, 'bank');
    expect(fieldChange(bank, 'bank.capacityAh', 150)).toEqual({ bank: { capacityAh: 150 } }); // only the value changed: common practice (no source)
    const drive = { id: 'd', kind: 'drive', standardLoss: { ratedApparentPower: 10000, basis: 'cdm', points: [1, 2, 3, 4, 5, 6, 7, 8] } };
    expect(fieldChange(drive, 'standardLoss.points.2', 30)).toEqual({ standardLoss: { points: [1, 2, 30, 4, 5, 6, 7, 8] } }); // a list replaces whole: common practice (no source)
  });

  it('another way of describing a part (the motor’s efficiency from its class) takes the old models out with null', () => {
    const s = solvedDemo('riverside-pump-station');
    const motor = elementOf(s, 'motor');
    const from = group(motor, 'Efficiency from');
    expect(from.current(motor)).toBe('explicit');
    const byClass = from.variants.find((v) => v.id === 'class')!;
    const set = editedChange(motor, (e) => byClass.apply(e));
    expect(set['loss']).toBeNull();
    expect(set['powerFactor']).toBeNull();
    expect(set['efficiencyClass']).toBe('IE3'); // the form's default class (web/editor/fields/machines.ts)
    expect(set).not.toHaveProperty('id');
    expect(set).not.toHaveProperty('kind');
    expect(set).not.toHaveProperty('ratedOutput'); // unchanged fields are not set
    const solved = solveProjectVariant(s, { name: 'IE3', set: { motor: set } });
    expect(solved.ok).toBe(true);
    if (solved.ok) {
      const m = solved.project.elements.find((e) => e.id === 'motor') as unknown as FormElement;
      expect(m['loss']).toBeUndefined();
      expect(m['efficiencyClass']).toBe('IE3');
    }
  });
});

describe('a change added to an option already listed ("Add the change to")', () => {
  it('made on the element as the option has it: the option keeps its other changes of that element, and core solves both', () => {
    const s = solvedDemo('hillside-relay-hut');
    const inverter = elementOf(s, 'inverter');
    const option = { name: 'Inverter B', set: { inverter: { phases: 3 } } };
    // The element as the option has it: the plan's with the option's fields set (core's mergeSet).
    const asOption = variantElement(inverter, option) as FormElement;
    expect(asOption['phases']).toBe(3);
    expect(asOption['outputVoltage']).toBe(inverter['outputVoltage']);
    // A second field changed from there: the set holds both, and only what differs from the plan (common practice (no source)).
    const both = fieldChange(inverter, 'outputVoltage', 240, asOption);
    expect(both).toEqual({ phases: 3, outputVoltage: 240 });
    // The same through a choice edit made on the option's element.
    expect(editedChange(inverter, (e) => setAtPath(e, 'outputVoltage', 240), asOption)).toEqual(both);
    // Back to the plan's value: that field leaves the set, the other stays.
    const asBoth = variantElement(inverter, { name: 'Inverter B', set: { inverter: both } });
    expect(fieldChange(inverter, 'phases', inverter['phases'], asBoth)).toEqual({ outputVoltage: 240 });
    const solved = solveProjectVariant(s, { ...option, set: { inverter: both } });
    if (!solved.ok) throw new Error(JSON.stringify(solved.problems));
    expect(solved.result.elements.find((e) => e.id === 'inverter')!.output!.voltage).toBeCloseTo(240, 9); // the option's own output voltage, solved by core
  });

  it('an option that swaps the element whole is not offered for it (a swap and a change of one element are refused)', () => {
    const s = solvedDemo('hillside-relay-hut');
    const inverter = s.project.elements.find((e) => e.id === 'inverter')!;
    const list = [{ name: 'A', set: { fridge: { power: 300 } } }, { name: 'B', swap: [inverter] }, { name: 'C', remove: ['lights'] }];
    expect(variantsChanging('inverter', list)).toEqual([0, 2]);
    expect(variantsChanging('fridge', list)).toEqual([0, 1, 2]);
  });
});
