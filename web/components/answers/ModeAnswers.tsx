/**
 * The answers strip's lines for a project with a battery bank on a DC bus (issue 19), shown first:
 *
 * - "On supply": the supply's power with the bank on float (and while it recharges), the rectifier or
 *   charger modules needed with N+1 (or the capacity needed when no module current is given), and the
 *   yearly cost of standing by (its energy when no price is given). These are core's runModesStudy,
 *   run in the panel worker for the mode switch (ModeResults.tsx puts the reply in `modesReply`); each
 *   opens the "Standing by and transfer" panel at its figure.
 * - "On battery": the runtime to the end of discharge and the bank's current, and the bank for the
 *   target when one is set (the backup study, which runs on battery for a bank on a bus:
 *   core/studies/answers.ts through study-answers.ts); each opens the battery panel (or the conductor
 *   panel when the bank's cable is sized).
 *
 * Every figure is core's; this file only formats and arranges them.
 */
import type { ComponentChildren } from 'preact';
import { DESIGN_BASIS_WORDS, type Solved, type SolveAnswers } from '../../../core/page.ts';
import type { BankStudyAnswer } from '../../../core/studies/index.ts';
import { formatCurrent, formatDuration, formatPower, formatSignificant, UNIT_GAP } from '../../format/number.ts';
import { openCount } from '../../state/editor.ts';
import { modesReply } from '../modes/mode-state.ts';
import { Fig } from './fig.tsx';
import { moneyFormat } from './study-answers.ts';

const WORKING = 'working…';

/** A line of the strip (as AnswersLines' own): a label, its figures and a short note. */
function Line({ label, children, note, name, tone }: { label: string; children: ComponentChildren; note?: ComponentChildren; name: string; tone?: 'warn' | undefined }) {
  return (
    <li class={tone ? `answer answer--${tone} answer--mode` : 'answer answer--mode'} data-answer={name}>
      <span class="answer__label">{label}</span> {children}
      {note && <span class="answer__note"> {note}</span>}
    </li>
  );
}

/** A target runtime in short words: whole hours as "24 h", else the duration as the panels write it. */
function targetWords(seconds: number, loc: string | undefined): string {
  const h = seconds / 3600;
  return Number.isInteger(h) ? `${formatSignificant(h, 6, loc)}${UNIT_GAP}h` : formatDuration(seconds, loc);
}

/** The on-supply line: supply power, modules with N+1, the yearly cost of standing by. */
function SupplyLine({ solved, loc }: { solved: Solved; loc: string | undefined }) {
  const r = modesReply.value;
  // Current when it belongs to this pair; the same project's older reply is shown as "updating".
  const state = r && r.for === solved ? 'current' : r && r.open === openCount.value && r.open !== undefined ? 'updating' : 'none';
  const outcome = state === 'none' ? null : r!.outcome;
  const study = outcome?.ok && outcome.study.ok ? outcome.study.study : null;
  const figState = state === 'updating' ? 'updating' : study ? undefined : 'working';
  const refused = state === 'current' && outcome && (!outcome.ok || !outcome.study.ok);
  if (refused) {
    return (
      <Line label="On supply" name="mode-supply" tone="warn">
        <Fig label="On supply" to={{ panel: 'standby' }} testId="answer-mode-supply-problem">
          the standing-by study could not run: see its panel
        </Fig>
      </Line>
    );
  }
  const c = study?.charger;
  const st = study?.standing;
  const money = moneyFormat.value;
  // Short notes: the strip stays on the first phone screen; the panel has the working in full.
  return (
    <Line label="On supply" name="mode-supply">
      <Fig label={`Supply power on supply${study ? ` (from ${study.supply.sourceName})` : ''}`} to={{ panel: 'standby', figure: 'standby-supply-power' }} state={figState} testId="answer-supply-power">
        {study ? formatPower(study.supply.sourcePower, loc) : WORKING}
      </Fig>
      {c && (
        <>
          {' · '}
          {c.modules ? (
            <Fig label={`Rectifier modules: ${c.modules.needed} needed${c.modules.redundancy === 'n+1' ? ' and one spare (N+1)' : ', no spare'}`} to={{ panel: 'standby', figure: 'standby-modules' }} state={figState} testId="answer-modules">
              {c.modules.installed} × {formatCurrent(c.modules.moduleCurrent, loc)}
            </Fig>
          ) : (
            <Fig label="Rectifier capacity needed" to={{ panel: 'standby', figure: 'standby-required-current' }} state={figState} testId="answer-modules">
              {formatCurrent(c.requiredCurrent, loc)}
            </Fig>
          )}
          <span class="answer__note"> {c.modules ? (c.modules.redundancy === 'n+1' ? '(N+1)' : 'modules') : 'rectifier'}</span>
        </>
      )}
      {st && (
        <>
          {' · '}
          <span class="answer__note">standing by </span>
          <Fig label="What standing by costs a year" to={{ panel: 'standby', figure: st.cost !== undefined ? 'standby-cost-year' : 'standby-energy' }} state={figState} testId="answer-standby-cost">
            {st.cost !== undefined ? (money ? money(st.cost, loc) : formatSignificant(st.cost, 4, loc)) : `${formatSignificant(st.energyKWh, 4, loc)}${UNIT_GAP}kWh`}
          </Fig>
          <span class="answer__note"> a year</span>
        </>
      )}
    </Line>
  );
}

/** The on-battery line: the runtime to the end of discharge and the bank's current. */
function BatteryLine({ quick, bank, figState, loc }: { quick: SolveAnswers['banks'][number]; bank: BankStudyAnswer | undefined; figState: 'updating' | 'working' | undefined; loc: string | undefined }) {
  const target = bank?.targetSeconds;
  const sized = quick.cableCurrent;
  return (
    <Line label="On battery" name="mode-battery" tone={bank?.meetsTarget === false ? 'warn' : undefined}>
      <Fig label="Runtime on battery, to the end of discharge" to={{ panel: 'battery', elementId: quick.elementId, figure: 'battery-runtime' }} state={figState} testId="answer-runtime">
        {bank ? `${bank.runtimeIsLowerBound ? 'over ' : ''}${formatDuration(bank.runtimeSeconds, loc)}` : WORKING}
      </Fig>
      {bank && (
        <span class="answer__note">
          {' '}
          {target !== undefined ? (bank.meetsTarget ? `meets the ${targetWords(target, loc)} target` : `short of the ${targetWords(target, loc)} target`) : 'to the end of discharge'}
        </span>
      )}
      {' · '}
      {sized ? (
        <>
          <Fig label={`Bank current: the design current of “${sized.cableName}”, ${DESIGN_BASIS_WORDS[sized.basis]}`} to={{ panel: 'conductor', elementId: sized.cableId }} testId="answer-bank-current">
            {formatCurrent(sized.amps, loc)}
          </Fig>
          <span class="answer__note"> from the bank</span>
        </>
      ) : (
        <>
          <Fig label="Bank current, the highest over the outage" to={{ panel: 'battery', elementId: quick.elementId, figure: 'battery-peak-current' }} state={figState} testId="answer-bank-current">
            {bank ? formatCurrent(bank.peakCurrent, loc) : WORKING}
          </Fig>
          <span class="answer__note"> from the bank</span>
        </>
      )}
      {bank?.sizedBank !== undefined && target !== undefined && (
        <>
          {' · '}
          <Fig label={`Bank for ${targetWords(target, loc)}: ${bank.sizedBank}`} to={{ panel: 'battery', elementId: quick.elementId, figure: 'battery-sizing-result' }} state={figState} testId="answer-sized-bank">
            {formatSignificant(bank.sizedCapacityAh ?? 0, 4, loc)}{UNIT_GAP}Ah
          </Fig>
          <span class="answer__note"> bank for {targetWords(target, loc)}</span>
        </>
      )}
    </Line>
  );
}

/** Both modes' key answers of a bank on a bus: on supply, then on battery. */
export function ModeAnswers({ solved, quick, bank, figState, loc }: { solved: Solved; quick: SolveAnswers['banks'][number]; bank: BankStudyAnswer | undefined; figState: 'updating' | 'working' | undefined; loc: string | undefined }) {
  return (
    <>
      <SupplyLine solved={solved} loc={loc} />
      <BatteryLine quick={quick} bank={bank} figState={figState} loc={loc} />
    </>
  );
}
