/**
 * The cost over the years in the client report: a compact table (the yearly cost, the lifetime cost,
 * the CO₂ of the losses, the generator's fuel) under the answers, when the project gives the energy
 * price and the years of service. The figures are core's lifetimeCost, worked in the panel worker
 * (`lifetime` request) for the solved pair the report prints; the rows and their words are the
 * machines panel's (web/components/cost/lifetime-rows.ts), so the report and the panel say the same.
 */
import type { Solved } from '../../../core/page.ts';
import { lifetimeSettingsOf } from '../../../core/studies/index.ts';
import { useWorkerReply } from '../panel-client.ts';
import { lifetimeRows, rowText, type LifetimeRow } from '../cost/lifetime-rows.ts';
import './ReportLifetime.css';

/** The rows the client reads (the working stays in the panel): a year's cost, the purchase, the lifetime cost, CO₂, fuel. */
const CLIENT_ROWS: readonly LifetimeRow['key'][] = ['loss-cost', 'fuel', 'yearly', 'purchase', 'npv', 'co2-year', 'co2-years'];

export function ReportLifetime({ solved, locale }: { solved: Solved; locale: string | undefined }) {
  const wanted = lifetimeSettingsOf(solved.project) !== null;
  const { reply, pending } = useWorkerReply<'lifetime'>(() => (wanted ? { kind: 'lifetime', solved } : null), [solved, wanted]);
  if (!wanted) return null;
  const outcome = reply?.kind === 'lifetime' ? reply.outcome : null;
  const cost = outcome?.ok ? outcome.cost : null;
  return (
    <section class="report-lifetime" aria-labelledby="report-lifetime-heading" data-testid="report-lifetime">
      <h3 id="report-lifetime-heading">Cost over the years</h3>
      {!cost || pending ? (
        <p data-testid="report-lifetime-pending">{outcome && !outcome.ok && !pending ? 'Not worked out: the cost settings need attention in the running cost section.' : 'Being calculated.'}</p>
      ) : (
        <>
          <table class="report__lifetime" data-testid="report-lifetime-table">
            <tbody>
              {lifetimeRows(cost)
                .filter((r) => CLIENT_ROWS.includes(r.key))
                .map((r) => (
                  <tr key={r.key}>
                    <th scope="row">{r.label}</th>
                    <td data-testid={`report-lifetime-${r.key}`}>{rowText(r, locale)}</td>
                  </tr>
                ))}
            </tbody>
          </table>
          <p class="report-lifetime__basis">
            The lifetime cost is the purchase plus each year’s cost counted in today’s money at {Number((cost.discountRate * 100).toPrecision(3))} % a year (net present value), over {cost.years}{' '}
            {cost.years === 1 ? 'year' : 'years'}.
          </p>
        </>
      )}
    </section>
  );
}
