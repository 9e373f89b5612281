/**
 * The options compared, for the printed client report (ClientReport.tsx mounts it): when the project
 * keeps variants, a compact table of the figures that differ between them (and the source power and
 * losses, always), how the cost rows are worked and the comparison's cautions, each option's note under it. The comparison is the panel worker's (core's
 * compareColumns), the same the "Compare options" panel shows; nothing when the project has none.
 */
import type { Solved } from '../../../core/page.ts';
import { ComparisonMethods, ComparisonTable, useComparison } from '../variants/VariantsPanel.tsx';

const ALWAYS = new Set(['source.power', 'losses.total']);

export function ReportVariants({ solved }: { solved: Solved }) {
  const { reply } = useComparison(solved, true);
  if (!(solved.project.variants?.length)) return null;
  const comparison = reply?.kind === 'variants' && reply.outcome.ok ? reply.outcome.comparison : null;
  return (
    <section class="report__variants" data-testid="report-variants">
      <h2>Options compared</h2>
      {comparison ? (
        <>
          <ComparisonTable comparison={comparison} rows={comparison.rows.filter((r) => r.differs || ALWAYS.has(r.key))} />
          <ComparisonMethods comparison={comparison} />
          <ul class="report__list" data-testid="report-variants-cautions">
            {comparison.cautions.map((c) => (
              <li key={c}>{c}</li>
            ))}
          </ul>
          <ul class="report__list">
            {comparison.columns
              .filter((c) => c.note || !c.ok)
              .map((c) => (
                <li key={c.name}>
                  {c.name}: {c.ok ? c.note : 'no longer applies to the chain as it stands'}
                </li>
              ))}
          </ul>
        </>
      ) : (
        <p>Being calculated.</p>
      )}
    </section>
  );
}
