/**
 * Why a project could not be solved: one entry per problem, naming the element by the name the
 * user gave it and the field by its form label (web/editor/fields.ts, loaded with the editor;
 * until then, and for result figures, the field's path in plain words).
 */
import { useEffect, useState } from 'preact/hooks';
import { PROJECT_LEVEL, fieldWords, type Problem } from '../../core/page.ts';

type FieldsModule = typeof import('../editor/fields.ts');

function valueText(value: unknown): string | undefined {
  if (value === undefined) return undefined;
  try {
    const text = JSON.stringify(value);
    return text.length > 80 ? `${text.slice(0, 77)}…` : text;
  } catch {
    return String(value);
  }
}

interface ElementInfo {
  name: string;
  kind?: string;
}

/** id → what the problem list shows for it (the user's name, else the id) and its kind. */
function elementInfo(elements: readonly unknown[] | undefined): Map<string, ElementInfo> {
  const out = new Map<string, ElementInfo>();
  for (const e of elements ?? []) {
    if (typeof e !== 'object' || e === null) continue;
    const r = e as Record<string, unknown>;
    if (typeof r['id'] !== 'string') continue;
    out.set(r['id'], { name: typeof r['name'] === 'string' && r['name'] !== '' ? r['name'] : r['id'], ...(typeof r['kind'] === 'string' ? { kind: r['kind'] } : {}) });
  }
  return out;
}

/** The form label of the longest path of the element's form that the field starts with, then the rest in words. */
function fieldLabel(fields: FieldsModule | undefined, kind: string | undefined, elementId: string, field: string): string {
  const parts = field.split('.');
  const specs = fields ? (elementId === PROJECT_LEVEL ? fields.allFields(fields.PROJECT_FIELDS) : kind ? fields.allFields(fields.formFor(kind)?.fields ?? []) : []) : [];
  for (let n = parts.length; n > 0; n--) {
    const path = parts.slice(0, n).join('.');
    const spec = specs.find((f) => f.type !== 'group' && f.path === path);
    if (spec) return n === parts.length ? spec.label : `${spec.label}, ${fieldWords(parts.slice(n))}`;
  }
  return fieldWords(parts);
}

export function ProblemList({ problems, elements }: { problems: readonly Problem[]; elements?: readonly unknown[] }) {
  const [fields, setFields] = useState<FieldsModule | undefined>(undefined);
  useEffect(() => {
    let live = true;
    // The editor loads the same module; here it only turns field paths into form labels.
    void import('../editor/fields.ts').then((m) => live && setFields(m));
    return () => {
      live = false;
    };
  }, []);
  const info = elementInfo(elements);
  return (
    <section class="notice notice--error" role="alert" aria-labelledby="problems-heading" data-testid="problems">
      <h3 id="problems-heading">
        This project cannot be solved yet ({problems.length} {problems.length === 1 ? 'problem' : 'problems'})
      </h3>
      <ul class="problems">
        {problems.map((p, i) => {
          const value = valueText(p.value);
          const el = info.get(p.elementId);
          return (
            <li key={`${p.elementId}-${p.field}-${i}`} class="problem" data-problem-code={p.code} data-element-id={p.elementId} data-field={p.field}>
              <p class="problem__where">
                {p.elementId === PROJECT_LEVEL ? 'Project' : <>Element <strong>{el?.name ?? p.elementId}</strong></>}
                {p.field && (
                  <>
                    {' · '}
                    {/* A figure that is not finite is a result field, not one of the form's. */}
                    <em>{p.code === 'non-finite' ? fieldWords(p.field.split('.')) : fieldLabel(fields, el?.kind, p.elementId, p.field)}</em>
                  </>
                )}
              </p>
              <p class="problem__message">{p.message}</p>
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
