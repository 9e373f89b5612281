/**
 * The answers strip's lines (loaded beside the first results, outside the first load): for a bank the
 * runtime to the end of discharge, the bank that meets the target and the current its cable and fuse
 * must carry (and on what basis), shown first; then the losses split (idle / conversion / cables) and
 * their yearly cost, each sized cable as "size · device · drop" with the rule that set the size, each
 * motor's start verdict, the warnings (count and the first). Each figure opens its working.
 *
 * The solve's answers (core/solve/answers.ts, one pass over the result) are worked out in the edit's
 * frame; the study answers (runtime, bank sizing, starts, cost) come from the panel worker after the
 * paint (`study-answers.ts`): "working…" until they arrive, marked "updating" while a newer one is on
 * its way, never those of another project.
 */
import type { ComponentChildren } from 'preact';
import { useEffect } from 'preact/hooks';
import { DESIGN_BASIS_WORDS, solveAnswers, type Solved, type SolveAnswers } from '../../../core/page.ts';
import type { BankStudyAnswer, StudyAnswers } from '../../../core/studies/index.ts';
import { formatCurrent, formatDuration, formatPower, formatSignificant, UNIT_GAP } from '../../format/number.ts';
import { costInForce, effectiveLocale } from '../../state/prefs.ts';
import { openCount } from '../../state/editor.ts';
import { Fig, type WorkingTarget } from './fig.tsx';
import { ModeAnswers } from './ModeAnswers.tsx';
import { entryState, moneyFormat, needsStudies, NO_STUDIES, requestStudyAnswers, studyAnswers } from './study-answers.ts';

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

/**
 * The bank's lines: runtime, the bank for the target, the current for its cable and fuse. A bank on a
 * bus leads with both modes' answers instead (ModeAnswers.tsx: on supply, then on battery, whose runtime,
 * bank current and bank for the target are these).
 */
function BankLines({ solved, quick, bank, state, loc }: { solved: Solved; quick: SolveAnswers['banks'][number]; bank: BankStudyAnswer | undefined; state: 'current' | 'updating' | 'none'; loc: string | undefined }) {
  const shown = state === 'none' ? undefined : bank;
  const figState = state === 'updating' ? 'updating' : shown ? undefined : 'working';
  const runtime = shown ? `${shown.runtimeIsLowerBound ? 'over ' : ''}${formatDuration(shown.runtimeSeconds, loc)}` : WORKING;
  const target = shown?.targetSeconds;
  const sized = quick.cableCurrent;
  const sizedBank = shown?.sizedBank !== undefined && target !== undefined && (
    <Line label={`Bank for ${hoursWords(target, loc)}`} name="sized-bank">
      <Fig label={`Bank for ${hoursWords(target, loc)}`} to={{ panel: 'battery', elementId: quick.elementId, figure: 'battery-sizing-result' }} state={figState} testId="answer-sized-bank">
        {formatSignificant(shown.sizedCapacityAh ?? 0, 4, loc)}{UNIT_GAP}Ah
      </Fig>
      <span class="answer__note"> {shown.sizedBank.replace(/ \(.*\)$/, '')}</span>
    </Line>
  );
  // The bank for the target rides on the on-battery line (ModeAnswers.tsx), so the strip stays on the first phone screen.
  if (quick.onBus) return <ModeAnswers solved={solved} quick={quick} bank={shown} figState={figState} loc={loc} />;
  return (
    <>
      <Line label="Runtime" name="runtime" tone={shown?.meetsTarget === false ? 'warn' : undefined}
        note={shown ? (target !== undefined ? (shown.meetsTarget ? `meets the ${hoursWords(target, loc)} target` : `short of the ${hoursWords(target, loc)} target`) : 'to the end of discharge') : undefined}>
        <Fig label="Runtime" to={{ panel: 'battery', elementId: quick.elementId, figure: 'battery-runtime' }} state={figState} testId="answer-runtime">
          {runtime}
        </Fig>
      </Line>
      {sizedBank}
      {sized ? (
        <Line label="Bank cable and fuse carry" name="bank-current"
          note={`design current of “${sized.cableName}”: ${DESIGN_BASIS_WORDS[sized.basis]}${sized.factor !== 1 ? ` × ${formatSignificant(sized.factor, 3, loc)}` : ''}${sized.deviceRating !== undefined ? `; device ${formatCurrent(sized.deviceRating, loc)}` : ''}`}>
          <Fig label="Bank cable and fuse carry" to={{ panel: 'conductor', elementId: sized.cableId }} testId="answer-bank-current">
            {formatCurrent(sized.amps, loc)}
          </Fig>
        </Line>
      ) : (
        <Line label="Bank cable and fuse carry" name="bank-current"
          note={
            shown
              ? quick.onBus
                ? 'highest bank current over the outage, on battery, before any ×1.25 the code asks'
                : `highest bank current over the outage, as the voltage falls (${formatCurrent(quick.operatingCurrent, loc)} at full charge), before any ×1.25 the code asks`
              : undefined
          }>
          <Fig label="Bank cable and fuse carry" to={{ panel: 'battery', elementId: quick.elementId, figure: 'battery-peak-current' }} state={figState} testId="answer-bank-current">
            {shown ? formatCurrent(shown.peakCurrent, loc) : WORKING}
          </Fig>
        </Line>
      )}
    </>
  );
}


/**
 * The lines of one part of the strip: "first" (the banks' lines, above the strip's four figures; it
 * also asks the worker for the study answers of the pair on screen) or "rest" (below them).
 */
export function AnswersLines({ solved, part }: { solved: Solved; part: 'first' | 'rest' }) {
  const a = solveAnswers(solved);
  const loc = effectiveLocale();
  const open = openCount.value;
  // The project's price and hours (or, for a project without them, this device's earlier setting).
  const cost = costInForce(solved.project);
  const price = cost?.pricePerKWh ?? null;
  const hours = cost?.hoursPerYear ?? 0;
  // After the paint: ask the worker for the study answers of the pair on screen (once, from the first part).
  useEffect(() => {
    if (part === 'first') requestStudyAnswers(solved, open, cost);
  }, [part, solved, open, price, hours]);
  const nothingToStudy = !needsStudies(solved, cost);
  const entry = nothingToStudy ? null : studyAnswers.value;
  const state = nothingToStudy ? 'current' : entryState(entry, solved, open);
  const studies: StudyAnswers | undefined = nothingToStudy ? NO_STUDIES : state !== 'none' && entry?.outcome.ok ? entry.outcome.answers : undefined;
  const figState = state === 'updating' ? 'updating' : studies ? undefined : 'working';
  if (part === 'first') {
    if (a.banks.length === 0) return null;
    return (
      <ul class="answers__list">
        {a.banks.map((b) => (
          <BankLines key={b.elementId} solved={solved} quick={b} bank={studies?.banks.find((x) => x.elementId === b.elementId)} state={studies ? state : 'none'} loc={loc} />
        ))}
      </ul>
    );
  }
  const l = a.losses;
  const money = moneyFormat.value;
  const costAnswer = studies?.cost;
  const firstWarning = a.warnings[0];
  return (
    <ul class="answers__list">
      <Line label="Losses" name="loss-split" note={l.source > 0 ? `; the source’s own ${formatPower(l.source, loc)}` : undefined}>
        <span data-testid="answer-loss-split">
          idle {formatPower(l.idle, loc)} · conversion {formatPower(l.conversion, loc)} · cables {formatPower(l.cables, loc)}
        </span>
      </Line>
      <Line
        label="Losses cost"
        name="loss-cost"
        note={costAnswer?.ok ? `a year at ${formatSignificant(costAnswer.hoursPerYear, 4, loc)} h${costAnswer.overProfile ? ', over the load profile’s day' : ''}` : costAnswer ? (costAnswer.reason === 'no energy price given' ? 'give an energy price' : costAnswer.reason) : undefined}
      >
        <Fig label="Losses cost" to={{ panel: 'machines', figure: 'loss-cost' }} state={costAnswer ? figState : 'working'} testId="answer-loss-cost">
          {costAnswer?.ok ? (money ? money(costAnswer.cost, loc) : formatSignificant(costAnswer.cost, 4, loc)) : costAnswer ? 'no price' : WORKING}
        </Fig>
      </Line>
      {a.cables.map((c) => (
        <Line key={c.elementId} label={c.name} name="cable" note={c.governingWords}>
          <Fig label={c.name} to={{ panel: 'conductor', elementId: c.elementId }} testId={`answer-cable-${c.elementId}`}>
            {c.parallelSets > 1 ? `${c.parallelSets} × ` : ''}
            {c.size}
            {c.deviceRating !== undefined ? ` · ${formatCurrent(c.deviceRating, loc)} device` : ' · no device fits'} · {formatSignificant(c.dropPercent, 2, loc)}
            {UNIT_GAP}% drop
          </Fig>
        </Line>
      ))}
      {solved.project.elements
        .filter((e) => e.kind === 'motor')
        .map((m) => {
          const s = studies?.starts.find((x) => x.elementId === m.id);
          return (
            <Line key={m.id} label={m.name ?? m.id} name="start" tone={s && s.verdict !== 'starts' ? 'warn' : undefined}>
              <Fig label={m.name ?? m.id} to={{ panel: 'starting', elementId: m.id }} state={s ? figState : 'working'} testId={`answer-start-${m.id}`}>
                {s ? (s.verdict === 'starts' ? 'starts' : s.verdict === 'marginal' ? 'start is marginal' : 'will not start') : WORKING}
              </Fig>
            </Line>
          );
        })}
      {studies?.bankProblems && (
        <Line label="Battery study" name="study-problem" tone="warn">
          <Fig label="Battery study" to={{ panel: 'battery' }}>
            {studies.bankProblems[0]?.message ?? 'could not run'}
          </Fig>
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
  );
}

export default AnswersLines;
