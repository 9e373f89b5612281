/**
 * "Change a field" in the compare-options panel: an element by name, one of the fields its form shows
 * for it now (web/editor/fields.ts, the form's own descriptors: number fields, choice fields such as a
 * cable's insulation or installation method or the phases, and the form's choice of how a part is
 * described, such as the loss model), by the form's label; then the new value, a number in the user's
 * units or one of the form's own choices. Stored in the variant's `set` as only the values it changes
 * (edit.ts: `{ conductor: { insulation: "xlpe" } }`, a part described another way whole), so a later edit
 * of the plan's other fields reaches the variant. "Add the change to" takes a new option (the default) or
 * one already listed: then the element's fields are shown as that option has them, and the change joins
 * its other changes (several fields of one inverter — its efficiency, idle draw and rating — make "this
 * inverter or that one"; an option that swaps the element whole is not offered).
 */
import { useState } from 'preact/hooks';
import { elementWords, type Solved } from '../../../core/page.ts';
import { formFor, shownFields, valueAt, type ChoiceSpec, type FormContext, type FormElement, type GroupSpec, type NumberSpec } from '../../editor/fields.ts';
import { inputUnit, readNumberField } from '../../format/parse.ts';
import { effectiveLocale, unitSystem } from '../../state/prefs.ts';
import { addVariant, changeInVariant, draftVariants, editedChange, fieldChange, setAtPath, variantElement, variantsChanging } from './edit.ts';

type Status = { kind: 'ok' | 'error'; text: string } | null;

/** A field the panel can change: a number, a choice, or the form's choice of a way of describing a part. */
type Changeable = NumberSpec | ChoiceSpec | GroupSpec;

const keyOf = (f: Changeable) => (f.type === 'group' ? `group:${f.key}` : f.path);

/** One value a choice can take, as the form words it, and the edit that puts it on the element's copy. */
interface Choice {
  value: string;
  label: string;
  disabled: boolean;
  /** The element has it now (the plan's own value). */
  planned: boolean;
  apply: (copy: FormElement) => void;
}

/** The choices of a choice field (its options, with what must follow each) or of a group (its ways). */
function choicesOf(f: ChoiceSpec | GroupSpec, element: FormElement, ctx: FormContext): Choice[] {
  if (f.type === 'group') {
    const current = f.current(element);
    return f.variants.map((v) => ({ value: v.id, label: v.label, disabled: false, planned: v.id === current, apply: (e) => v.apply(e) }));
  }
  const options = typeof f.options === 'function' ? f.options(element, ctx) : f.options;
  const stored = valueAt(element, f.path);
  const set = (e: FormElement, value: string | number | undefined) => {
    setAtPath(e, f.path, value);
    f.follow?.(e, value);
  };
  const out: Choice[] = options.map((o) => ({
    value: String(o.value),
    label: o.disabled ? `${o.label} (no data)` : o.label,
    disabled: o.disabled !== undefined,
    planned: stored !== undefined && String(stored) === String(o.value),
    apply: (e) => set(e, o.value),
  }));
  // An optional choice that is given can also be left out (the engine's default then applies): last, so the
  // value shown first is another of the form's choices.
  if (!f.required && stored !== undefined) out.push({ value: '', label: 'Not given (default)', disabled: false, planned: false, apply: (e) => set(e, undefined) });
  return out;
}

export function ChangeField({ solved, onDone }: { solved: Solved; onDone: (s: Status) => void }) {
  const project = solved.project;
  const { names } = elementWords(project);
  const units = unitSystem.value;
  const loc = effectiveLocale();
  const [elementId, setElementId] = useState(project.elements[0]?.id ?? '');
  const planned = project.elements.find((e) => e.id === elementId) as unknown as FormElement | undefined;
  // Where the change goes: a new option (''), or one already listed that may change this element, by its
  // name (names are unique in the list, and stay with their option when another is deleted).
  const list = draftVariants();
  const open = planned ? variantsChanging(String(planned['id']), list) : [];
  const [target, setTarget] = useState('');
  const found = list.findIndex((v) => v.name === target);
  const into = found >= 0 && open.includes(found) ? found : null;
  // The element as it is where the change goes: the plan's, or as that option has it.
  const element = planned && into !== null ? (variantElement(planned, list[into]!) as FormElement) : planned;
  // The fields the element's form shows for it now (a group's chosen way only), as the form labels them.
  const fields = element
    ? shownFields(formFor(String(element['kind']))?.fields ?? [], element).filter((f): f is Changeable => f.type === 'number' || f.type === 'choice' || (f.type === 'group' && f.variants.length > 1))
    : [];
  const [key, setKey] = useState('');
  const field = fields.find((f) => keyOf(f) === key) ?? fields[0];
  const [text, setText] = useState('');
  const [picked, setPicked] = useState<string | null>(null);
  const choices = element && field && field.type !== 'number' ? choicesOf(field, element, { units, locale: loc }) : [];
  // The value shown: the one picked, else the first the element does not have already.
  const choice = choices.find((c) => c.value === picked && !c.planned && !c.disabled) ?? choices.find((c) => !c.planned && !c.disabled);
  const unit = field?.type === 'number' ? inputUnit(field.quantity, units).symbol : '';
  const name = element ? (names.get(String(element['id'])) ?? String(element['id'])) : '';
  const done = (refused: string | null, text: string) => onDone(refused ? { kind: 'error', text: refused } : { kind: 'ok', text });
  const add = () => {
    if (!planned || !element || !field) return;
    const id = String(planned['id']);
    // What the change sets (only what differs from the plan's element, made on the element where it goes)
    // and the words that name it.
    let fields: Record<string, unknown>;
    let words: string;
    if (field.type === 'number') {
      const read = readNumberField(text, { ...field, required: true }, units, loc);
      if (!read.ok) return onDone({ kind: 'error', text: read.message });
      fields = fieldChange(planned, field.path, read.value, element);
      words = `${field.label} ${text.trim()}${unit ? ` ${unit}` : ''}`;
    } else {
      if (!choice) return;
      fields = editedChange(planned, choice.apply, element);
      words = `${field.label} ${choice.label}`;
    }
    if (into === null) {
      const refused = addVariant({ name: `${name}: ${words}`, set: { [id]: fields } });
      return done(refused, `Added "${draftVariants().at(-1)?.name ?? name}".`);
    }
    const option = list[into]!.name;
    done(changeInVariant(into, id, fields), `Changed "${option}": ${name}, ${words}.`);
  };
  const reset = () => (setKey(''), setText(''), setPicked(null));
  return (
    <fieldset class="variants-quick__change" data-testid="variant-change-field">
      <legend>Change a field</legend>
      {open.length > 0 && (
        <div class="variants-field">
          <label for="variant-change-target">Add the change to</label>
          <select id="variant-change-target" value={into === null ? '' : list[into]!.name} onChange={(e) => (setTarget((e.currentTarget as HTMLSelectElement).value), reset())} data-testid="variant-change-target">
            <option value="">A new option</option>
            {open.map((i) => (
              <option key={list[i]!.name} value={list[i]!.name}>
                {list[i]!.name}
              </option>
            ))}
          </select>
        </div>
      )}
      <div class="variants-field">
        <label for="variant-change-element">Element</label>
        <select id="variant-change-element" value={elementId} onChange={(e) => (setElementId((e.currentTarget as HTMLSelectElement).value), reset())}>
          {project.elements.map((e) => (
            <option key={e.id} value={e.id}>
              {names.get(e.id) ?? e.id}
            </option>
          ))}
        </select>
      </div>
      <div class="variants-field">
        <label for="variant-change-field">Field</label>
        <select id="variant-change-field" value={field ? keyOf(field) : ''} onChange={(e) => (setKey((e.currentTarget as HTMLSelectElement).value), setPicked(null))} disabled={fields.length === 0}>
          {fields.map((f) => (
            <option key={keyOf(f)} value={keyOf(f)}>
              {f.label}
            </option>
          ))}
        </select>
      </div>
      {field?.type === 'number' || !field ? (
        <div class="variants-field">
          <label for="variant-change-value">Value{unit ? ` (${unit})` : ''}</label>
          <input id="variant-change-value" type="text" inputMode="decimal" value={text} onInput={(e) => setText((e.currentTarget as HTMLInputElement).value)} data-testid="variant-change-value" />
        </div>
      ) : (
        <div class="variants-field">
          <label for="variant-change-choice">Value</label>
          <select id="variant-change-choice" value={choice?.value ?? ''} onChange={(e) => setPicked((e.currentTarget as HTMLSelectElement).value)} data-testid="variant-change-choice">
            {choices.map((c) => (
              // The element's own value is no option: it says so and cannot be picked.
              <option key={c.value} value={c.value} disabled={c.planned || c.disabled}>
                {c.planned ? `${c.label} (${into === null ? 'as planned' : 'as this option has it'})` : c.label}
              </option>
            ))}
          </select>
        </div>
      )}
      <button type="button" class="panel-button" onClick={add} disabled={!field || (field.type === 'number' ? text.trim() === '' : !choice)} data-testid="variant-change-add">
        {into === null ? 'Add this option' : 'Add to this option'}
      </button>
    </fieldset>
  );
}
