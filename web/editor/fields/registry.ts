/**
 * The kinds' forms in one registry, and what the form code reads from it: the fields shown now and a new element
 * filled from the defaults.
 * Part of the form descriptors; web/editor/fields.ts is their entry (today's exports, callers import it).
 */
import { type ElementKind, KINDS } from '../../../core/page.ts';
import { cableForm } from './cable.ts';
import { purchasePrice, valueAt } from './common.ts';
import { dcBusForm, dcDcForm, genericForm, inverterForm, rectifierForm, transferSwitchForm, transformerForm } from './converters.ts';
import { acCurrentLoadForm, acLoadForm, acVaLoadForm, dcCurrentLoadForm, dcLoadForm, fanForm, networkLoadForm, pumpForm, shaftLoadForm } from './loads.ts';
import { driveForm, motorForm } from './machines.ts';
import { acSource, batteryForm } from './sources.ts';
import type { FieldSpec, FormElement, KindForm } from './types.ts';

const OWN_FORMS: Readonly<Record<ElementKind, KindForm>> = {
  grid: acSource('grid'),
  generator: acSource('generator'),
  battery: batteryForm,
  rectifier: rectifierForm,
  'dc-dc': dcDcForm,
  'dc-bus': dcBusForm,
  inverter: inverterForm,
  transformer: transformerForm,
  drive: driveForm,
  motor: motorForm,
  cable: cableForm,
  generic: genericForm,
  'transfer-switch': transferSwitchForm,
  'dc-load': dcLoadForm,
  'ac-load': acLoadForm,
  'ac-va-load': acVaLoadForm,
  'dc-current-load': dcCurrentLoadForm,
  'ac-current-load': acCurrentLoadForm,
  'shaft-load': shaftLoadForm,
  'network-load': networkLoadForm,
  pump: pumpForm,
  fan: fanForm,
};

/** Every kind's form: its own fields, then the element base's purchase price (the less-used end of the form). */
export const KIND_FORMS: Readonly<Record<ElementKind, KindForm>> = Object.fromEntries(
  Object.entries(OWN_FORMS).map(([kind, form]) => [kind, { ...form, fields: [...form.fields, purchasePrice] }]),
) as unknown as Record<ElementKind, KindForm>;

/** The form of a kind, or undefined for a kind the engine does not know. */
export function formFor(kind: string): KindForm | undefined {
  return KINDS.has(kind as ElementKind) ? KIND_FORMS[kind as ElementKind] : undefined;
}

/** Every field of a form, group variants included (depth-first). */
export function allFields(fields: readonly FieldSpec[]): FieldSpec[] {
  const out: FieldSpec[] = [];
  for (const f of fields) {
    out.push(f);
    if (f.type === 'group') for (const v of f.variants) out.push(...allFields(v.fields));
  }
  return out;
}

/** The fields shown for this element now: groups' chosen variants only, `when` respected. */
export function shownFields(fields: readonly FieldSpec[], e: FormElement): FieldSpec[] {
  const out: FieldSpec[] = [];
  for (const f of fields) {
    if (f.when && !f.when(e)) continue;
    out.push(f);
    if (f.type === 'group') {
      const v = f.variants.find((x) => x.id === f.current(e));
      if (v) out.push(...shownFields(v.fields, e));
    }
  }
  return out;
}

function fillDefaults(fields: readonly FieldSpec[], e: FormElement): void {
  for (const f of fields) {
    if (f.when && !f.when(e)) continue;
    if (f.type === 'group') {
      if (f.current(e) === undefined) f.variants[0]!.apply(e);
      const v = f.variants.find((x) => x.id === f.current(e));
      if (v) fillDefaults(v.fields, e);
      continue;
    }
    if (!f.required || valueAt(e, f.path) !== undefined) continue;
    const d = 'default' in f ? f.default : undefined;
    if (d === undefined) continue;
    setPath(e, f.path, structuredClone(d));
  }
}

function setPath(e: FormElement, path: string, value: unknown): void {
  const keys = path.split('.');
  let at: FormElement = e;
  for (const k of keys.slice(0, -1)) {
    if (typeof at[k] !== 'object' || at[k] === null) at[k] = {};
    at = at[k] as FormElement;
  }
  at[keys[keys.length - 1]!] = value;
}

/** A new element of a kind from the descriptors' defaults (first variant of every group). */
export function defaultElement(kind: ElementKind, id: string, from?: string): FormElement {
  const e: FormElement = { id, kind, ...(from !== undefined ? { from } : {}) };
  fillDefaults(KIND_FORMS[kind].fields, e);
  return e;
}
