/**
 * Why a project could not be solved: a banner that says how many fields are marked and where
 * ("2 fields to fix: Inverter › Efficiency (%); Battery bank › Cut-off cell voltage"), each a link
 * that opens the element's form and focuses the field, then one entry per problem, naming the
 * element by the name the user gave it and the field by its form label (the engine's table,
 * core/model/field-labels.ts), with the message's numbers in the user's units (problem-words.ts).
 */
import { PROJECT_LEVEL, type Problem } from '../../core/page.ts';
import { selectedId } from '../state/editor.ts';
import { fieldDomId } from '../state/field-errors.ts';
import { effectiveLocale, unitSystem } from '../state/prefs.ts';
import { messageText, messageValueText, problemPlace } from './problem-words.ts';
import { formatSignificant } from '../format/number.ts';
import type { UnitSystem } from '../format/units.ts';

/**
 * The value given, as users read it: a number in the unit of the message's own quantities (the field's
 * bounds or rated figure share its unit: a flow in m³/h), else with 4 significant digits; other values as written.
 */
function valueText(p: Problem, units: UnitSystem, locale: string | undefined): string | undefined {
  const value = p.value;
  if (value === undefined) return undefined;
  if (typeof value === 'number' && Number.isFinite(value)) {
    const unit = p.values?.[0]?.unit;
    return unit !== undefined && p.values!.every((v) => v.unit === unit) ? messageValueText({ si: value, unit }, units, locale) : formatSignificant(value, 4, locale);
  }
  try {
    const text = JSON.stringify(value);
    return text.length > 80 ? `${text.slice(0, 77)}…` : text;
  } catch {
    return String(value);
  }
}

/** A field the engine marks: a problem at a form field of an element or of the project (not a result's figure). */
interface Marked {
  owner: string;
  path: string;
  element: string;
  field: string;
}

function markedFields(problems: readonly Problem[], project: unknown): Marked[] {
  const seen = new Set<string>();
  const out: Marked[] = [];
  for (const p of problems) {
    if (!p.field || p.code === 'non-finite') continue;
    const key = `${p.elementId}\u0000${p.field}`;
    if (seen.has(key)) continue;
    seen.add(key);
    const { element, field } = problemPlace(p, project);
    out.push({ owner: p.elementId, path: p.field, element, field });
  }
  return out;
}

/** The control of a field once its form is shown: its own id, else the first control in its row or group. */
function fieldControl(owner: string, path: string): HTMLElement | null {
  const byId = document.getElementById(fieldDomId(owner, path));
  if (byId) return byId;
  const form = owner === PROJECT_LEVEL ? document : document.querySelector(`[data-testid="stage-form"][data-element-id="${CSS.escape(owner)}"]`);
  const row = form?.querySelector(`[data-path="${CSS.escape(path)}"]`) ?? null;
  return (row?.querySelector('input, select, textarea, button') as HTMLElement | null) ?? (row as HTMLElement | null);
}

/** Open the element's form (select its card), then scroll to and focus the field once it is drawn. */
export function goToField(owner: string, path: string): void {
  if (owner !== PROJECT_LEVEL) selectedId.value = owner;
  let frames = 0;
  const attempt = () => {
    const control = fieldControl(owner, path);
    if (control) {
      control.scrollIntoView({ block: 'center' });
      control.focus({ preventScroll: true });
      return;
    }
    // The form mounts after the selection's render (and may load lazily): try for about a second.
    if (++frames < 60) requestAnimationFrame(attempt);
  };
  requestAnimationFrame(attempt);
}

export function ProblemList({ problems, elements }: { problems: readonly Problem[]; elements?: readonly unknown[] }) {
  const project = { elements: elements ?? [] };
  const units = unitSystem.value;
  const locale = effectiveLocale();
  const marked = markedFields(problems, project);
  return (
    <section class="notice notice--error" role="alert" aria-labelledby="problems-heading" data-testid="problems">
      <h3 id="problems-heading">
        This project cannot be solved yet ({problems.length} {problems.length === 1 ? 'problem' : 'problems'})
      </h3>
      {marked.length > 0 && (
        <p class="problems__marked" data-testid="problems-marked">
          {marked.length} {marked.length === 1 ? 'field' : 'fields'} to fix:{' '}
          {marked.map((m, i) => (
            <span key={`${m.owner}\u0000${m.path}`}>
              {i > 0 && '; '}
              <a
                href={`#${fieldDomId(m.owner, m.path)}`}
                class="problems__link"
                data-testid="problem-link"
                data-element-id={m.owner}
                data-field={m.path}
                onClick={(e) => {
                  e.preventDefault();
                  goToField(m.owner, m.path);
                }}
              >
                {m.element} › {m.field}
              </a>
            </span>
          ))}
        </p>
      )}
      <ul class="problems">
        {problems.map((p, i) => {
          const value = valueText(p, units, locale);
          const { element, field } = problemPlace(p, project);
          return (
            <li key={`${p.elementId}-${p.field}-${i}`} class="problem" data-problem-code={p.code} data-element-id={p.elementId} data-field={p.field}>
              <p class="problem__where">
                {p.elementId === PROJECT_LEVEL ? 'Project' : <>Element <strong>{element}</strong></>}
                {field && (
                  <>
                    {' · '}
                    <em>{field}</em>
                  </>
                )}
              </p>
              <p class="problem__message">{messageText(p, units, locale)}</p>
              {value !== undefined && (
                <p class="problem__value">
                  Given: <code>{value}</code>
                </p>
              )}
            </li>
          );
        })}
      </ul>
    </section>
  );
}
