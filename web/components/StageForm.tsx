/**
 * The form of one element of the chain: every field of its kind (web/editor/fields.ts) with its unit
 * in the user's unit system, written on input through the engine-checked `setField`, with the
 * message at the field when the text is not a number or the engine refuses the value. Problems the
 * engine reports for this element that no shown field carries are listed at the top of the form.
 */
import './StageForm.css';
import { draft, draftProblems } from '../state/editor.ts';
import { elementKindLabel } from '../format/labels.ts';
import { formFor, shownFields, type FormElement } from '../editor/fields.ts';
import { FieldList } from './fields/FieldList.tsx';
import { fieldWords } from '../../core/page.ts';

export function StageForm({ elementId }: { elementId: string }) {
  const project = draft.value;
  const element = project?.elements.find((e) => e.id === elementId);
  if (!project || !element) return null;
  const form = formFor(element.kind);
  const headingId = `sf-heading-${elementId}`.replace(/[^A-Za-z0-9_-]/g, '_');
  const title = typeof element.name === 'string' && element.name ? element.name : element.id;
  if (!form) {
    return (
      <div class="sform" data-testid="stage-form">
        <h3 id={headingId}>{title}</h3>
        <p class="sf-message" role="alert">
          “{element.kind}” is not a kind the calculation knows, so it has no form. Remove it, or put a known kind in its place.
        </p>
      </div>
    );
  }
  const data = element as FormElement;
  const shownPaths = new Set(
    shownFields(form.fields, data).flatMap((f) => (f.type === 'group' ? [...f.paths] : [f.path])),
  );
  const elsewhere = draftProblems.value.filter(
    (p) => p.elementId === elementId && !shownPaths.has(p.field) && ![...shownPaths].some((s) => p.field.startsWith(`${s}.`)),
  );
  return (
    <form class="sform" aria-labelledby={headingId} data-testid="stage-form" data-element-id={elementId} onSubmit={(e) => e.preventDefault()} noValidate>
      <h3 id={headingId} class="sform__title">
        <span class="sform__kind">{elementKindLabel(element.kind)}</span> {title}
      </h3>
      {elsewhere.length > 0 && (
        <ul class="sform__problems" role="alert" data-testid="stage-form-problems">
          {elsewhere.map((p, i) => (
            <li key={i}>
              {p.field ? <em>{fieldWords(p.field.split('.'))}</em> : null} {p.message}
            </li>
          ))}
        </ul>
      )}
      <FieldList owner={{ id: elementId, data }} fields={form.fields} />
    </form>
  );
}
