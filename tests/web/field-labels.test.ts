/**
 * One source for each label: the engine's messages name fields by the labels of
 * core/model/field-labels.ts, the forms (web/editor/fields/) show theirs; every form field's label
 * must be the table's, so a label changed in one place and not the other fails here. And the
 * problem banner focuses a field by the id the forms give its control (fieldDomId = fieldId).
 * No outside source: the checks compare the page with itself.
 */
import { describe, expect, it } from 'vitest';
import { FIELD_LABELS, fieldLabel } from '../../core/model/field-labels.ts';
import { KIND_FORMS, PROJECT_FIELDS, allFields, type FieldSpec } from '../../web/editor/fields.ts';
import { fieldDomId } from '../../web/state/field-errors.ts';
import { fieldId } from '../../web/components/fields/common.tsx';
import { messageValueText, messageText } from '../../web/components/problem-words.ts';
import { say, q } from '../../core/model/message.ts';

/** Labels that name the unit system they show (the conductor size: mm² or AWG / kcmil); the table has the word for both. */
const PER_SYSTEM: Readonly<Record<string, RegExp>> = { 'conductor.size': /^Size \((mm²|AWG \/ kcmil)\)$/ };

function checkForm(kind: string, fields: readonly FieldSpec[]): string[] {
  const table = FIELD_LABELS[kind as keyof typeof FIELD_LABELS];
  const wrong: string[] = [];
  for (const f of allFields(fields)) {
    if (f.type === 'group') {
      // A path that several nested groups list (a drive's losses, inside them its loss model) takes one of their labels.
      for (const p of f.paths) {
        const listing = allFields(fields).filter((g) => g.type === 'group' && g.paths.includes(p)).map((g) => g.label);
        if (table[p] !== undefined && !allFields(fields).some((g) => g.type !== 'group' && g.path === p) && !listing.includes(table[p]!)) wrong.push(`${kind} group ${p}: form "${listing.join('" / "')}", table "${table[p]}"`);
      }
      continue;
    }
    if (PER_SYSTEM[f.path]) {
      if (!PER_SYSTEM[f.path]!.test(f.label)) wrong.push(`${kind}.${f.path}: form "${f.label}"`);
      continue;
    }
    // The element base's fields (the purchase price) are every kind's: the table words them once (fieldLabel).
    if (kind !== 'project' && f.path === 'price' && table[f.path] === undefined) {
      if (fieldLabel(kind, f.path) !== f.label) wrong.push(`${kind}.${f.path}: form "${f.label}", table "${fieldLabel(kind, f.path)}"`);
      continue;
    }
    if (table[f.path] !== f.label) wrong.push(`${kind}.${f.path}: form "${f.label}", table "${table[f.path] ?? '(none)'}"`);
  }
  return wrong;
}

describe('field labels have one source', () => {
  it('every form field of every kind shows the label the engine words it with', () => {
    const wrong = Object.entries(KIND_FORMS).flatMap(([kind, form]) => checkForm(kind, form.fields));
    expect(wrong).toEqual([]);
  });
  it("the project's own fields too", () => {
    expect(checkForm('project', PROJECT_FIELDS)).toEqual([]);
  });
  it('a path below a labelled field is worded after its label', () => {
    expect(fieldLabel('rectifier', 'loss.efficiency')).toBe('Efficiency (%)');
    expect(fieldLabel('rectifier', 'loss.points.1.loadFraction')).toBe('Datasheet points, item 2 load fraction');
    expect(fieldLabel(undefined, 'outputVoltage')).toBe('output voltage');
  });
});

describe('the problem banner reaches the field', () => {
  it('focuses the id the forms give the control', () => {
    for (const [owner, path] of [['inv', 'loss.efficiency'], ['', 'name'], ['a b', 'bank.overrides.maxChargeCRate']] as const) {
      expect(fieldDomId(owner, path)).toBe(fieldId(owner, path));
    }
  });
});

describe('a message in the user units', () => {
  // 150 m³/h = 150 / 3600 m³/s (SI Brochure, 9th ed., Table 8: 1 h = 3600 s); 1 US gpm = 6.309e-5 m³/s
  // (NIST SP 811 B.8): 0.0416667 m³/s = 660 gpm (3 significant digits).
  const w = say`is above the rated flow ${q(150 / 3600, 'm³/s')} of the pump "Intake pump"`;
  it('the engine writes SI with 3 significant digits', () => {
    expect(w.message).toBe('is above the rated flow 0.0417 m³/s of the pump "Intake pump"');
    expect(w.template).toBe('is above the rated flow {0} of the pump "Intake pump"');
  });
  it('the page writes the unit the form works in, in the user system', () => {
    expect(messageText(w, 'si', 'en')).toBe('is above the rated flow 150\u202fm³/h of the pump "Intake pump"');
    expect(messageText(w, 'us', 'en')).toBe('is above the rated flow 660\u202fgpm of the pump "Intake pump"');
    // A length of 100 km is 328 084 ft (0.3048 m per ft, NIST SP 811 B.8): 328,000 at 3 significant digits.
    expect(messageValueText(q(1e5, 'm'), 'us', 'en')).toBe('328,000\u202fft');
    expect(messageValueText(q(1e6, 'V'), 'si', 'de')).toBe('1\u202fMV');
  });
});
