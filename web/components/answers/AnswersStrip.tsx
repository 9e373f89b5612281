/**
 * The answers strip: the figures a user opened the project for, at the top of the project, recomputed
 * on every edit. Each figure is a button that opens its working (`web/state/working.ts`).
 * First version: the source power, the chain efficiency and the losses, from the solve's totals.
 */
import type { SolveResult } from '../../../core/page.ts';
import { formatPercent, formatPower } from '../../format/number.ts';
import { effectiveLocale } from '../../state/prefs.ts';

export function AnswersStrip({ result, stale }: { result: SolveResult; stale: boolean }) {
  const t = result.totals;
  const loc = effectiveLocale();
  return (
    <section class={stale ? 'answers answers--stale' : 'answers'} aria-labelledby="answers-heading" data-testid="answers">
      <h3 id="answers-heading" class="visually-hidden">Answers</h3>
      <dl class="answers__figures balance__figures">
        <div>
          <dt>Source delivers</dt>
          <dd>{formatPower(t.sourcePower, loc)}</dd>
        </div>
        <div>
          <dt>Chain efficiency</dt>
          <dd>{formatPercent(t.efficiency, loc)}</dd>
        </div>
        <div>
          <dt>Losses</dt>
          <dd>{formatPower(t.losses, loc)}</dd>
        </div>
      </dl>
    </section>
  );
}
