/** Why a project could not be solved: one entry per problem, naming the element and the field. */
import type { Problem } from '../../core/errors.ts';

function valueText(value: unknown): string | undefined {
  if (value === undefined) return undefined;
  try {
    const text = JSON.stringify(value);
    return text.length > 80 ? `${text.slice(0, 77)}…` : text;
  } catch {
    return String(value);
  }
}

export function ProblemList({ problems }: { problems: readonly Problem[] }) {
  return (
    <section class="notice notice--error" role="alert" aria-labelledby="problems-heading" data-testid="problems">
      <h3 id="problems-heading">
        This project cannot be solved yet ({problems.length} {problems.length === 1 ? 'problem' : 'problems'})
      </h3>
      <ul class="problems">
        {problems.map((p, i) => {
          const value = valueText(p.value);
          return (
            <li key={`${p.elementId}-${p.field}-${i}`} class="problem" data-problem-code={p.code}>
              <p class="problem__where">
                {p.elementId === 'project' ? 'Project' : <>Element <code>{p.elementId}</code></>}
                {p.field && (
                  <>
                    {' · field '}
                    <code>{p.field}</code>
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
