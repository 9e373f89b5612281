/**
 * The answers strip: the figures a user opened the project for, at the top of the project, recomputed
 * on every edit. Each figure is a button that opens its working (`web/state/working.ts`): the study
 * panel (pointed at the element's row or at the figure) or the results table.
 *
 * What it shows, most important first: for a bank, the runtime to the end of discharge, the bank that
 * meets the target and the current the bank's cable and fuse must carry (and on what basis); the
 * source power, the loads, the losses (split idle / conversion / cables, and their yearly cost) and the
 * chain efficiency; each sized cable as "size · device · drop" with the rule that set the size; each
 * motor's start verdict; the warnings (count and the first); and the energy-balance line.
 *
 * The solve's answers (core/solve/answers.ts) are computed in the edit's frame (one pass over the
 * result); the study answers (runtime, bank sizing, starts, cost) come from the panel worker after
 * the paint (`study-answers.ts`), shown as "working…" until they arrive and marked "updating" while a
 * newer one is on its way. Off screen, the strip keeps what it showed (lag.ts).
 */
import type { ComponentChildren } from 'preact';
import { useEffect } from 'preact/hooks';
import { DESIGN_BASIS_WORDS, solveAnswers, type Solved, type SolveAnswers, type SolveResult } from '../../../core/page.ts';
import type { BankStudyAnswer, StudyAnswers } from '../../../core/studies/index.ts';
import { formatCurrent, formatDuration, formatPercent, formatPower, formatSmallPercent, formatSignificant, UNIT_GAP } from '../../format/number.ts';
import { effectiveLocale, energyPrice, operatingHours } from '../../state/prefs.ts';
import { lastSolved, openCount } from '../../state/editor.ts';
import { showWorking, type PanelId } from '../../state/working.ts';
import { useOffscreenLag } from '../lag.ts';
import { entryState, moneyFormat, requestStudyAnswers, studyAnswers } from './study-answers.ts';

/** Where a figure's working is: a study panel (with the element or figure to point at) or a results part. */
export type WorkingTarget = { panel: PanelId; elementId?: string; figure?: string } | { results: string; elementId?: string };

/** Opens a figure's working. Results parts (the element table, the warnings) are scrolled to and focused. */
export function openWorking(target: WorkingTarget): void {
  if ('panel' in target) {
    showWorking(target.panel, target.elementId, target.figure);
    return;
  }
  const part = document.querySelector<HTMLElement>(`[data-testid="${target.results}"]`);
  if (!part) return;
  const row = target.elementId !== undefined ? part.querySelector<HTMLElement>(`[data-element-id="${CSS.escape(target.elementId)}"]`) : null;
  const at = row ?? part;
  at.scrollIntoView({ block: 'center' });
  if (!at.hasAttribute('tabindex')) at.tabIndex = -1;
  at.focus({ preventScroll: true });
}

/** One figure as a button that opens its working; `label` (the figure's label beside it) is its tooltip's subject. */
function Fig({ label, children, to, state, testId }: { label: string; children: ComponentChildren; to: WorkingTarget; state?: 'updating' | 'working'; testId?: string }) {
  return (
    <button
      type="button"
      class={state ? `answer__fig answer__fig--${state}` : 'answer__fig'}
      onClick={() => openWorking(to)}
      aria-busy={state ? 'true' : undefined}
      data-testid={testId}
      title={`${label}: show the working`}
    >
      {children}
      {state === 'updating' && <span class="visually-hidden"> (updating)</span>}
    </button>
  );
}

/** A line of the strip: a label, its figure(s) and a short note. */
function Line({ label, children, note, name, tone }: { label: string; children: ComponentChildren; note?: ComponentChildren; name: string; tone?: 'warn' }) {
  return (
    <li class={tone ? `answer answer--${tone}` : 'answer'} data-answer={name}>
      <span class="answer__label">{label}</span> {children}
      {note && <span class="answer__note"> {note}</span>}
    </li>
  );
}

const WORKING = 'working…';

/** A target runtime in short words: "24 h" for whole hours, else the duration as the panels write it. */
export function hoursWords(seconds: number, loc: string | undefined): string {
  const h = seconds / 3600;
  return Number.isInteger(h) ? `${formatSignificant(h, 6, loc)}${UNIT_GAP}h` : formatDuration(seconds, loc);
}

/** The bank's lines: runtime, the bank for the target, the current for its cable and fuse. */
function BankLines({ quick, bank, state, loc }: { quick: SolveAnswers['banks'][number]; bank: BankStudyAnswer | undefined; state: 'current' | 'updating' | 'none'; loc: string | undefined }) {
  const shown = state === 'none' ? undefined : bank;
  const figState = state === 'updating' ? 'updating' : shown ? undefined : 'working';
  const runtime = shown ? `${shown.runtimeIsLowerBound ? 'over ' : ''}${formatDuration(shown.runtimeSeconds, loc)}` : WORKING;
  const target = shown?.targetSeconds;
  const sized = quick.cableCurrent;
  return (
    <>
      <Line label="Runtime" name="runtime" tone={shown?.meetsTarget === false ? 'warn' : undefined}
        note={shown ? (target !== undefined ? (shown.meetsTarget ? `meets the ${hoursWords(target, loc)} target` : `short of the ${hoursWords(target, loc)} target`) : 'to the end of discharge') : undefined}>
        <Fig label="Runtime" to={{ panel: 'battery', elementId: quick.elementId, figure: 'battery-runtime' }} state={figState} testId="answer-runtime">
          {runtime}
        </Fig>
      </Line>
      {shown?.sizedBank !== undefined && target !== undefined && (
        <Line label={`Bank for ${hoursWords(target, loc)}`} name="sized-bank">
          <Fig label={`Bank for ${hoursWords(target, loc)}`} to={{ panel: 'battery', elementId: quick.elementId, figure: 'battery-sizing-result' }} state={figState} testId="answer-sized-bank">
            {formatSignificant(shown.sizedCapacityAh ?? 0, 4, loc)}{UNIT_GAP}Ah
          </Fig>
          <span class="answer__note"> {shown.sizedBank.replace(/ \(.*\)$/, '')}</span>
        </Line>
      )}
      {sized ? (
        <Line label="Bank cable and fuse carry" name="bank-current"
          note={`design current of “${sized.cableName}”: ${DESIGN_BASIS_WORDS[sized.basis]}${sized.factor !== 1 ? ` × ${formatSignificant(sized.factor, 3, loc)}` : ''}${sized.deviceRating !== undefined ? `; device ${formatCurrent(sized.deviceRating, loc)}` : ''}`}>
          <Fig label="Bank cable and fuse carry" to={{ panel: 'conductor', elementId: sized.cableId }} testId="answer-bank-current">
            {formatCurrent(sized.amps, loc)}
          </Fig>
        </Line>
      ) : (
        <Line label="Bank cable and fuse carry" name="bank-current"
          note={shown ? `highest discharge current, at the end of discharge (${formatCurrent(quick.operatingCurrent, loc)} at full charge), before any ×1.25 the code asks` : undefined}>
          <Fig label="Bank cable and fuse carry" to={{ panel: 'battery', elementId: quick.elementId, figure: 'battery-peak-current' }} state={figState} testId="answer-bank-current">
            {shown ? formatCurrent(shown.peakCurrent, loc) : WORKING}
          </Fig>
        </Line>
      )}
    </>
  );
}

function StripBody({ solved, stale }: { solved: Solved; stale: boolean }) {
  const a = solveAnswers(solved);
  const loc = effectiveLocale();
  const open = openCount.value;
  const entry = studyAnswers.value;
  const state = entryState(entry, solved, open);
  const studies: StudyAnswers | undefined = state !== 'none' && entry?.outcome.ok ? entry.outcome.answers : undefined;
  const figState = state === 'updating' ? 'updating' : studies ? undefined : 'working';
  const l = a.losses;
  const src = a.source;
  const money = moneyFormat.value;
  const cost = studies?.cost;
  const firstWarning = a.warnings[0];
  const results = (elementId?: string): WorkingTarget => ({ results: 'element-table', ...(elementId !== undefined ? { elementId } : {}) });
  return (
    <>
      <ul class="answers__list">
        {a.banks.map((b) => (
          <BankLines key={b.elementId} quick={b} bank={studies?.banks.find((x) => x.elementId === b.elementId)} state={studies ? state : 'none'} loc={loc} />
        ))}
      </ul>
      <dl class="answers__figures balance__figures" data-testid="energy-balance">
        <div>
          <dt>Source delivers</dt>
          <dd><Fig label="Source delivers" to={results(src.elementId)}>{formatPower(src.power, loc)}</Fig></dd>
        </div>
        <div>
          <dt>Loads use</dt>
          <dd><Fig label="Loads use" to={results()}>{formatPower(src.loadPower, loc)}</Fig></dd>
        </div>
        <div>
          <dt>Losses</dt>
          <dd><Fig label="Losses" to={results()} testId="answer-losses">{formatPower(src.losses, loc)}</Fig></dd>
        </div>
        <div>
          <dt>Chain efficiency</dt>
          <dd data-testid="chain-efficiency"><Fig label="Chain efficiency" to={results()}>{formatPercent(src.efficiency, loc)}</Fig></dd>
        </div>
      </dl>
      <ul class="answers__list">
        <Line label="Losses" name="loss-split"
          note={l.source > 0 ? `; the source’s own ${formatPower(l.source, loc)}` : undefined}>
          <span data-testid="answer-loss-split">
            idle {formatPower(l.idle, loc)} · conversion {formatPower(l.conversion, loc)} · cables {formatPower(l.cables, loc)}
          </span>
        </Line>
        <Line label="Losses cost" name="loss-cost"
          note={cost?.ok ? `a year at ${formatSignificant(cost.hoursPerYear, 4, loc)} h` : cost ? cost.reason === 'no energy price given' ? 'give an energy price' : cost.reason : undefined}>
          <Fig label="Losses cost" to={{ panel: 'machines', figure: 'loss-cost' }} state={cost ? figState : 'working'} testId="answer-loss-cost">
            {cost?.ok ? (money ? money(cost.cost, loc) : formatSignificant(cost.cost, 4, loc)) : cost ? 'no price' : WORKING}
          </Fig>
        </Line>
        {a.cables.map((c) => (
          <Line key={c.elementId} label={c.name} name="cable" note={c.governingWords}>
            <Fig label={c.name} to={{ panel: 'conductor', elementId: c.elementId }} testId={`answer-cable-${c.elementId}`}>
              {c.parallelSets > 1 ? `${c.parallelSets} × ` : ''}
              {c.size}
              {c.deviceRating !== undefined ? ` · ${formatCurrent(c.deviceRating, loc)} device` : ' · no device fits'} · {formatSignificant(c.dropPercent, 2, loc)}{UNIT_GAP}% drop
            </Fig>
          </Line>
        ))}
        {studies
          ? studies.starts.map((s) => (
              <Line key={s.elementId} label={s.name} name="start" tone={s.verdict === 'starts' ? undefined : 'warn'}>
                <Fig label={s.name} to={{ panel: 'starting', elementId: s.elementId }} state={figState} testId={`answer-start-${s.elementId}`}>
                  {s.verdict === 'starts' ? 'starts' : s.verdict === 'marginal' ? 'start is marginal' : 'will not start'}
                </Fig>
              </Line>
            ))
          : solved.project.elements
              .filter((e) => e.kind === 'motor')
              .map((m) => (
                <Line key={m.id} label={m.name ?? m.id} name="start">
                  <Fig label={m.name ?? m.id} to={{ panel: 'starting', elementId: m.id }} state="working" testId={`answer-start-${m.id}`}>
                    {WORKING}
                  </Fig>
                </Line>
              ))}
        {studies?.bankProblems && (
          <Line label="Battery study" name="study-problem" tone="warn">
            <Fig label="Battery study" to={{ panel: 'battery' }}>{studies.bankProblems[0]?.message ?? 'could not run'}</Fig>
          </Line>
        )}
        {entry && state === 'current' && !entry.outcome.ok && (
          <Line label="Studies" name="study-problem" tone="warn">
            <span>{'crash' in entry.outcome ? entry.outcome.crash : entry.outcome.problems[0]?.message}</span>
          </Line>
        )}
        {firstWarning && (
          <Line label={a.warnings.length === 1 ? '1 warning' : `${a.warnings.length} warnings`} name="warnings" tone="warn">
            <Fig label="Warnings" to={{ results: 'warnings', elementId: firstWarning.elementId }} testId="answer-warnings">
              {firstWarning.name}: {firstWarning.message}
            </Fig>
          </Line>
        )}
      </ul>
      <p class="answers__balance" data-testid="balance-line">
        Energy balance: source {formatPower(src.power, loc)} = loads {formatPower(src.loadPower, loc)} + losses {formatPower(src.losses, loc)}; mismatch{' '}
        {formatSmallPercent(src.balanceError, loc)}.
      </p>
      {stale && <p class="visually-hidden">These answers are out of date.</p>}
    </>
  );
}

/**
 * The strip. `result` is the result on screen (App.tsx passes it); the solved pair it belongs to is
 * `lastSolved`, passed as `solved` when the caller has it.
 */
export function AnswersStrip({ result, stale, solved: given }: { result: SolveResult; stale: boolean; solved?: Solved }) {
  const latest = given ?? lastSolved.value;
  const { box, shown } = useOffscreenLag(latest);
  const price = energyPrice.value;
  const hours = operatingHours.value;
  const open = openCount.value;
  // After the paint: ask the worker for the study answers of the pair on screen.
  useEffect(() => {
    if (latest) requestStudyAnswers(latest, open, price !== null ? { pricePerKWh: price, hoursPerYear: hours } : null);
  }, [latest, open, price, hours]);
  // `result` is the same pair's result: the strip reads the pair for the project's facts.
  void result;
  const solved = shown ?? null;
  return (
    <section class={stale ? 'answers answers--stale' : 'answers'} aria-labelledby="answers-heading" data-testid="answers" ref={box}>
      <h3 id="answers-heading" class="visually-hidden">Answers</h3>
      {solved && <StripBody solved={solved} stale={stale} />}
    </section>
  );
}
