// The stage-form descriptors (web/editor/fields.ts) checked against the engine itself: every kind has
// a form, every field the engine's schema requires is described, every path described is one the
// schema knows, and an element built from the descriptors' defaults validates — and solves in a
// small chain. Check values are the engine's own verdicts (core/solve) or "common practice (no source)".
import { describe, expect, it } from 'vitest';
import { z } from 'zod/mini';
import { KINDS, solveProject, validateProject, defaultCatalogue } from '../../core/index.ts';
import type { ElementKind } from '../../core/model/project.ts';
import {
  KIND_FORMS,
  PROJECT_FIELDS,
  allFields,
  defaultElement,
  formFor,
  messageForField,
  methodOptions,
  shownFields,
  sizeOptions,
  valueAt,
  type FieldSpec,
  type FormElement,
  type GroupSpec,
} from '../../web/editor/fields.ts';

// The engine's schemas are zod/mini; these helpers read them through zod's core classes and definitions.
type Schema = z.core.$ZodType;

/** The schema under optional and nullable wrappers. */
function unwrap(schema: Schema): Schema {
  let s = schema;
  for (let i = 0; i < 5 && (s instanceof z.core.$ZodOptional || s instanceof z.core.$ZodNullable); i++) s = s._zod.def.innerType;
  return s;
}

/** The object schema under a zod schema (optional wrappers removed). */
function objectShape(schema: Schema): Record<string, Schema> | undefined {
  const s = unwrap(schema);
  return s instanceof z.core.$ZodObject ? (s._zod.def.shape as Record<string, Schema>) : undefined;
}

/** Every variant of a discriminated union or plain object, as shapes. */
function shapesOf(schema: Schema): Record<string, Schema>[] {
  const s = unwrap(schema);
  if (s instanceof z.core.$ZodUnion) return (s._zod.def.options as readonly Schema[]).flatMap(shapesOf);
  const shape = objectShape(s);
  return shape ? [shape] : [];
}

/** Does the engine's schema know this dotted path (array indices and table columns allowed)? */
function schemaKnows(schema: Schema, path: string[]): boolean {
  if (path.length === 0) return true;
  const s = unwrap(schema);
  if (s instanceof z.core.$ZodArray) {
    const element = s._zod.def.element as Schema;
    return /^\d+$/.test(path[0]!) ? schemaKnows(element, path.slice(1)) : schemaKnows(element, path);
  }
  return shapesOf(s).some((shape) => path[0]! in shape && schemaKnows(shape[path[0]!]!, path.slice(1)));
}

/** Top-level keys a form covers: field paths' first segment and the paths of groups. */
function coveredKeys(fields: readonly FieldSpec[]): Set<string> {
  const keys = new Set<string>();
  for (const f of allFields(fields)) {
    if (f.type === 'group') f.paths.forEach((p) => keys.add(p.split('.')[0]!));
    else keys.add(f.path.split('.')[0]!);
  }
  return keys;
}

const kinds = [...KINDS.keys()] as ElementKind[];

/** A feeder chain for each kind (common practice (no source): ordinary port kinds each accepts). */
function chainFor(kind: ElementKind): FormElement[] {
  const grid1 = { id: 'src', kind: 'grid', phases: 1, voltage: 230, frequency: 50 };
  const grid3 = { id: 'src', kind: 'grid', phases: 3, voltage: 400, frequency: 50 };
  const dc = { id: 'src', kind: 'battery', voltage: 48, internalResistance: 0.01 };
  const me = (from?: string) => defaultElement(kind, 'me', from);
  switch (kind) {
    case 'grid':
    case 'generator':
      return [me(), { id: 'load', kind: 'ac-load', from: 'me', power: 500, powerFactor: 0.9 }];
    case 'battery':
      return [me(), { id: 'load', kind: 'dc-load', from: 'me', power: 500 }];
    case 'rectifier':
      return [grid1, me('src'), { id: 'load', kind: 'dc-load', from: 'me', power: 300 }];
    case 'dc-dc':
    case 'dc-bus':
      return [dc, me('src'), { id: 'load', kind: 'dc-load', from: 'me', power: 300 }];
    case 'inverter':
      return [dc, me('src'), { id: 'load', kind: 'ac-load', from: 'me', power: 300, powerFactor: 0.9 }];
    case 'transformer':
      return [{ ...grid1, voltage: 400 }, me('src'), { id: 'load', kind: 'ac-load', from: 'me', power: 3000, powerFactor: 0.9 }];
    case 'drive':
      return [grid3, me('src'), { id: 'mot', kind: 'motor', from: 'me', ratedOutput: 7500, efficiencyClass: 'IE3', poles: 4, ratedFrequency: 50 }, { id: 'load', kind: 'shaft-load', from: 'mot', power: 3000 }];
    case 'motor':
      return [grid3, me('src'), { id: 'load', kind: 'shaft-load', from: 'me', power: 5000 }];
    case 'cable':
    case 'transfer-switch':
      return [grid1, me('src'), { id: 'load', kind: 'ac-load', from: 'me', power: 2000, powerFactor: 0.9 }];
    case 'generic':
      return [dc, me('src'), { id: 'load', kind: 'dc-load', from: 'me', power: 200 }];
    case 'dc-load':
    case 'dc-current-load':
      return [dc, me('src')];
    case 'ac-load':
    case 'ac-va-load':
    case 'ac-current-load':
    case 'network-load':
      return [grid1, me('src')];
    case 'shaft-load':
    case 'pump':
    case 'fan':
      return [grid3, { id: 'mot', kind: 'motor', from: 'src', ratedOutput: 7500, efficiencyClass: 'IE3', poles: 4, ratedFrequency: 50 }, { ...me('mot') }];
  }
}

const project = (elements: FormElement[]) => ({ format: 'joulepath-project', version: 2, name: 'form defaults', elements });

describe('a form for every kind the engine knows', () => {
  it.each(kinds)('%s has a form', (kind) => {
    expect(formFor(kind)?.kind).toBe(kind);
  });

  it('has no form for kinds the engine does not know', () => {
    expect(formFor('flux-capacitor')).toBeUndefined();
    expect(Object.keys(KIND_FORMS).sort()).toEqual([...kinds].sort());
  });

  it.each(kinds)('%s: every field the engine’s schema has is described, and every path described is the engine’s', (kind) => {
    const shape = objectShape(KINDS.get(kind)!.schema)!;
    expect(shape).toBeDefined();
    const covered = coveredKeys(KIND_FORMS[kind].fields);
    for (const key of Object.keys(shape)) {
      if (key === 'id' || key === 'kind' || key === 'from') continue; // the chain editor's
      expect.soft(covered.has(key), `${kind}.${key} is not described`).toBe(true);
    }
    for (const f of allFields(KIND_FORMS[kind].fields)) {
      if (f.type === 'group') continue;
      // The element base's purchase price is every kind's, checked once for all in core/solve/validate.ts (priceSchema).
      if (f.path === 'price') continue;
      expect.soft(schemaKnows(KINDS.get(kind)!.schema, f.path.split('.')), `${kind}: "${f.path}" is not a field of the engine`).toBe(true);
    }
  });

  it.each(kinds)('%s: an element from the descriptors’ defaults validates and solves', (kind) => {
    const elements = chainFor(kind);
    const checked = validateProject(project(elements));
    expect(checked.ok ? [] : checked.problems).toEqual([]);
    const solved = solveProject(project(elements));
    expect(solved.ok ? [] : solved.problems).toEqual([]);
  });

  it.each(kinds)('%s: every variant of every group validates when chosen from the defaults', (kind) => {
    const walk = (fields: readonly FieldSpec[], e: FormElement, trail: string) => {
      for (const g of fields.filter((f): f is GroupSpec => f.type === 'group')) {
        for (const v of g.variants) {
          const copy = structuredClone(e);
          v.apply(copy);
          expect(g.current(copy), `${trail} ${g.key} → ${v.id}`).toBe(v.id);
          const elements = chainFor(kind).map((x) => (x['id'] === 'me' ? copy : x));
          const checked = validateProject(project(elements));
          expect(checked.ok ? [] : checked.problems, `${kind}: ${trail}${g.key} → ${v.id}`).toEqual([]);
          walk(v.fields, copy, `${trail}${g.key}=${v.id} `);
        }
      }
    };
    walk(KIND_FORMS[kind].fields, defaultElement(kind, 'me', kind === 'grid' || kind === 'generator' || kind === 'battery' ? undefined : 'src'), '');
  });

  it('shows only the chosen variant’s fields', () => {
    const cable = { id: 'c', kind: 'cable', from: 's', length: 10, resistancePerKm: 7.41 };
    const paths = shownFields(KIND_FORMS.cable.fields, cable).map((f) => ('path' in f ? f.path : f.key));
    expect(paths).toContain('resistancePerKm');
    expect(paths).not.toContain('conductor.size');
    const generic = defaultElement('generic', 'g', 's');
    expect(shownFields(KIND_FORMS.generic.fields, generic).map((f) => ('path' in f ? f.path : ''))).not.toContain('outputFrequency');
    expect(shownFields(KIND_FORMS.generic.fields, { ...generic, outputKind: 'ac1' }).map((f) => ('path' in f ? f.path : ''))).toContain('outputFrequency');
  });
});

describe('choices from the engine’s tables', () => {
  it('conductor sizes come from the catalogue of the chosen system and material, auto first', () => {
    const nec = { conductor: { system: 'nec', material: 'copper' } };
    const opts = sizeOptions(nec, { units: 'us' }).map((o) => o.value);
    expect(opts[0]).toBe('auto');
    expect(opts.slice(1)).toEqual(defaultCatalogue.nec.sizes('copper').map((s) => s.label));
    // In SI units the NEC size shows its area beside it (ASTM B258 / NEC Chapter 9 Table 8: 4 AWG = 21.15 mm²).
    expect(sizeOptions(nec, { units: 'si', locale: 'en-US' }).find((o) => o.value === '4 AWG')?.label).toBe('4 AWG (21.15\u202fmm²)');
    const iec = { conductor: { system: 'iec', material: 'aluminium' } };
    expect(sizeOptions(iec, { units: 'si' }).slice(1).map((o) => o.value)).toEqual(defaultCatalogue.iec.sizes('aluminium').map((s) => s.label));
  });

  it('IEC methods the engine carries no capacities for are disabled with the reason', () => {
    const copper = methodOptions({ conductor: { system: 'iec', material: 'copper', insulation: 'pvc' } });
    const enabled = copper.filter((o) => !o.disabled).map((o) => o.value);
    expect(enabled).toEqual(defaultCatalogue.iec.methods('copper', 'pvc'));
    expect(copper.find((o) => o.value === 'A1')?.disabled).toMatch(/no current-carrying capacities/);
  });

  it('switching the material resets a size the new table lacks to auto', () => {
    const materialField = allFields(KIND_FORMS.cable.fields).find((f) => f.type === 'choice' && f.path === 'conductor.material');
    expect(materialField?.type).toBe('choice');
    // 14 AWG is in the NEC copper list but not the aluminum one (NEC Table 310.16 starts Al at 12 AWG).
    const e: FormElement = { conductor: { system: 'nec', material: 'aluminium', size: '14 AWG' } };
    if (materialField?.type === 'choice') materialField.follow?.(e, 'aluminium');
    expect(valueAt(e, 'conductor.size')).toBe('auto');
  });

  it('battery overrides show the chemistry preset’s value as placeholder', () => {
    const soc = allFields(KIND_FORMS.battery.fields).find((f) => f.type === 'number' && f.path === 'bank.overrides.usableDepthOfDischarge');
    expect(soc?.type).toBe('number');
    if (soc?.type === 'number') {
      // core/data/battery-chemistries.ts presets: LiFePO4 0.9, flooded lead-acid 0.5 (common practice).
      expect(soc.placeholder?.({ bank: { chemistry: 'lifepo4' } })).toBe(0.9);
      expect(soc.placeholder?.({ bank: { chemistry: 'flooded-lead-acid' } })).toBe(0.5);
    }
  });
});

describe('messages at the field', () => {
  it('names the field and puts per-cent limits in per cent for fields typed in %', () => {
    // The engine's own message for η = 1.2 (core/kinds/spec.ts unitFraction).
    expect(messageForField({ label: 'Efficiency (%)', quantity: 'fraction-percent' }, 'efficiency must not exceed 1 (enter 0.95 for 95 %)')).toBe(
      'Efficiency (%): efficiency must not exceed 100 %',
    );
    // η below 1 % (core/kinds/spec.ts efficiencyField): the limit is already in per cent.
    expect(messageForField({ label: 'Efficiency (%)', quantity: 'fraction-percent' }, 'efficiency must be at least 1 %: below that the loss would be over 99 times the output (enter 0.95 for 95 %)')).toBe(
      'Efficiency (%): efficiency must be at least 1 %: below that the loss would be over 99 times the output',
    );
    expect(messageForField({ label: 'Output voltage', quantity: 'voltage' }, 'must be greater than 0 V')).toBe('Output voltage: must be greater than 0 V');
    expect(messageForField({ label: 'Output voltage' }, "Output voltage: '23o' is not a number")).toBe("Output voltage: '23o' is not a number");
  });
});

describe('the project form', () => {
  it('writes only fields the engine knows at project level', () => {
    const base = { format: 'joulepath-project', version: 2, name: 'x', elements: [{ id: 'b', kind: 'battery', voltage: 12 }] };
    const sample: Record<string, unknown> = { name: 'Pump house', description: 'text', 'dropLimits.basis': 'iec-a-other', 'dropLimits.perLinkPercent': 2, 'dropLimits.totalPercent': 4 };
    for (const f of PROJECT_FIELDS) {
      if (f.type === 'group') continue;
      const p = structuredClone(base) as Record<string, unknown>;
      const keys = f.path.split('.');
      let at = p;
      for (const k of keys.slice(0, -1)) at = (at[k] ??= {}) as Record<string, unknown>;
      at[keys[keys.length - 1]!] = sample[f.path];
      const checked = validateProject(p);
      expect(checked.ok ? [] : checked.problems, f.path).toEqual([]);
    }
  });
});

describe('equipment ratings and loads given by their current', () => {
  // The ratings conductor sizing reads (issue 14): optional, in the trade's units, with help that says
  // where the figure comes from and what it sets (common practice (no source): wording of the brief).
  it.each([
    ['drive', 'ratedInputCurrent', 'current'],
    ['inverter', 'ratedOutputPower', 'power-rating'],
    ['rectifier', 'ratedOutputCurrent', 'current'],
    ['dc-dc', 'ratedOutputPower', 'power-rating'],
    ['dc-dc', 'minInputVoltage', 'voltage'],
  ] as const)('%s.%s is an optional %s field from the maker’s datasheet that sets a cable’s design current', (kind, path, quantity) => {
    const f = allFields(KIND_FORMS[kind].fields).find((x) => x.type !== 'group' && x.path === path);
    expect(f).toMatchObject({ type: 'number', quantity, required: false });
    expect(f!.help).toMatch(/maker’s datasheet/);
    expect(f!.help).toMatch(/design current of the cable/);
  });

  it.each(['dc-current-load', 'ac-current-load'] as const)('%s asks for a current in amperes', (kind) => {
    const f = allFields(KIND_FORMS[kind].fields).find((x) => x.type !== 'group' && x.path === 'current');
    expect(f).toMatchObject({ type: 'number', quantity: 'current', required: true });
  });
});
