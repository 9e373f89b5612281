/**
 * The answers strip: the figures a user opened the project for, at the top of the project, recomputed
 * on every edit. Each figure is a button that opens its working (`fig.tsx`, `web/state/working.ts`):
 * the study panel (pointed at the element's row or at the figure) or the results table.
 *
 * In the first load: the four figures of the energy balance (source, loads, losses, chain efficiency;
 * the solve's totals) and the balance line "source = loads + losses; mismatch" (how the engineer checks
 * the energy balance). Loaded beside the first results (`AnswersLines.tsx`, lazy): for a bank its
 * runtime, the bank for the target and its cable-and-fuse current, above the four figures; below them
 * the losses split and their yearly cost, the cables' size · device · drop, the motors' start
 * verdicts and the warnings. Off screen, the strip keeps what it showed (lag.ts).
 */
import { lazy, memo, Suspense } from 'preact/compat';
import type { Solved, SolveResult } from '../../../core/page.ts';
import { formatPercent, formatPower, formatSmallPercent } from '../../format/number.ts';
import { effectiveLocale } from '../../state/prefs.ts';
import { lastSolved } from '../../state/editor.ts';
import { useOffscreenLag, type BoxRef } from '../lag.ts';
import { Fig, type WorkingTarget } from './fig.tsx';

/** The strip's lines (banks, losses split and cost, cables, starts, warnings) load outside the first load. */
const AnswersLines = lazy(() => import('./AnswersLines.tsx'));

const results = (elementId?: string): WorkingTarget => ({ results: 'element-table', ...(elementId !== undefined ? { elementId } : {}) });

/**
 * The strip. `result` is the result on screen (App.tsx passes it); the solved pair it belongs to is
 * `lastSolved`, or `solved` when the caller passes it.
 */
export function AnswersStrip({ result: given, stale, solved: pair }: { result: SolveResult; stale: boolean; solved?: Solved }) {
  const latest = pair ?? lastSolved.value;
  const { box, shown } = useOffscreenLag(latest);
  // While the strip is off screen `shown` stays the same object, so the memo'd body is not even
  // compared again: an edit made with the strip scrolled away costs it nothing in the edit's frame.
  return <StripBody solved={shown ?? null} given={shown ? undefined : given} stale={stale} box={box} />;
}

const StripBody = memo(function StripBody({
  solved,
  given,
  stale,
  box,
}: {
  solved: Solved | null;
  given: SolveResult | undefined;
  stale: boolean;
  box: BoxRef;
}) {
  const result = solved?.result ?? given!;
  const t = result.totals;
  const loc = effectiveLocale();
  // Elements are in solve order: the source first.
  const sourceId = result.elements[0]?.id;
  return (
    <section class={stale ? 'answers answers--stale' : 'answers'} aria-labelledby="answers-heading" data-testid="answers" ref={box}>
      <h3 id="answers-heading" class="visually-hidden">
        Answers{stale ? ' (out of date)' : ''}
      </h3>
      {solved && (
        <Suspense fallback={null}>
          <AnswersLines solved={solved} part="first" />
        </Suspense>
      )}
      <dl class="answers__figures balance__figures" data-testid="energy-balance">
        <div>
          <dt>Source delivers</dt>
          <dd>
            <Fig label="Source delivers" to={results(sourceId)}>
              {formatPower(t.sourcePower, loc)}
            </Fig>
          </dd>
        </div>
        <div>
          <dt>Loads use</dt>
          <dd>
            <Fig label="Loads use" to={results()}>
              {formatPower(t.loadPower, loc)}
            </Fig>
          </dd>
        </div>
        <div>
          <dt>Losses</dt>
          <dd>
            <Fig label="Losses" to={results()} testId="answer-losses">
              {formatPower(t.losses, loc)}
            </Fig>
          </dd>
        </div>
        <div>
          <dt>Chain efficiency</dt>
          <dd data-testid="chain-efficiency">
            <Fig label="Chain efficiency" to={results()}>
              {formatPercent(t.efficiency, loc)}
            </Fig>
          </dd>
        </div>
      </dl>
      {solved && (
        <Suspense fallback={null}>
          <AnswersLines solved={solved} part="rest" />
        </Suspense>
      )}
      <p class="answers__balance" data-testid="balance-line">
        Energy balance: source {formatPower(t.sourcePower, loc)} = loads {formatPower(t.loadPower, loc)} + losses {formatPower(t.losses, loc)}; mismatch{' '}
        {formatSmallPercent(t.balanceError, loc)}.
      </p>
    </section>
  );
});
