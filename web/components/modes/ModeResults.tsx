/**
 * The mode switch at the top of the results of a project with a battery bank on a DC bus (issue 19):
 * "On supply" / "On battery" (native radio buttons, so arrow keys, Tab and a tap work as everywhere),
 * and both modes' energy balance side by side. The on-battery solve and the modes study come from core's
 * solveModes / runModesStudy run in the panel worker (panel-worker.ts, `modes`), never on the page's
 * thread; the reply goes to `modesReply` (mode-state.ts), which App.tsx reads to show the chosen mode's
 * diagram and element table and which the standing-by panel reads (it asks nothing of its own; a crash
 * goes to `modesCrash` for it). Loaded on demand (App.tsx).
 */
import { useEffect } from 'preact/hooks';
import type { Solved } from '../../../core/page.ts';
import type { ModesStudyResult } from '../../../core/studies/index.ts';
import { useWorkerReply } from '../panel-client.ts';
import { formatPercent, formatPower } from '../../format/number.ts';
import { effectiveLocale } from '../../state/prefs.ts';
import { problemLine } from '../problem-words.ts';
import { openCount } from '../../state/editor.ts';
import { MODE_WORDS, modesCrash, modesReply, shownMode, type ShownMode } from './mode-state.ts';
import { VariantFlows } from '../variants/VariantFlows.tsx';

type ModeFigures = ModesStudyResult['supply'];

function ModeSwitch() {
  const mode = shownMode.value;
  return (
    <fieldset class="mode-switch" data-testid="mode-switch">
      <legend>Show the system</legend>
      <div class="mode-switch__options">
        {(['supply', 'battery'] as ShownMode[]).map((m) => (
          <label key={m} class={mode === m ? 'mode-switch__option mode-switch__option--on' : 'mode-switch__option'}>
            <input type="radio" name="shown-mode" value={m} checked={mode === m} data-testid={`mode-${m}`} onChange={() => (shownMode.value = m)} />
            <span>{MODE_WORDS[m]}</span>
          </label>
        ))}
      </div>
    </fieldset>
  );
}

function BalanceColumn({ title, figures, mode, chosen }: { title: string; figures: ModeFigures | null; mode: ShownMode; chosen: boolean }) {
  const loc = effectiveLocale();
  return (
    <div class={chosen ? 'mode-balance__col mode-balance__col--chosen' : 'mode-balance__col'} data-testid={`balance-${mode}`}>
      <h4>{title}</h4>
      {figures ? (
        <dl>
          <dt>From {figures.sourceName}</dt>
          <dd data-testid={`balance-${mode}-source`}>{formatPower(figures.sourcePower, loc)}</dd>
          <dt>{mode === 'supply' ? 'To the loads and the bank’s float' : 'To the loads'}</dt>
          <dd data-testid={`balance-${mode}-loads`}>{formatPower(figures.loadPower, loc)}</dd>
          <dt>Losses</dt>
          <dd data-testid={`balance-${mode}-losses`}>{formatPower(figures.losses, loc)}</dd>
          <dt>Efficiency</dt>
          <dd data-testid={`balance-${mode}-efficiency`}>{formatPercent(figures.efficiency, loc)}</dd>
        </dl>
      ) : (
        <p class="note">Working out this mode…</p>
      )}
    </div>
  );
}

export default function ModeResults({ solved }: { solved: Solved }) {
  const { reply, pending } = useWorkerReply<'modes'>(() => ({ kind: 'modes', solved }), [solved]);
  useEffect(() => {
    if (reply?.kind === 'crash') modesCrash.value = { for: solved, message: reply.message };
    if (!reply || reply.kind !== 'modes') return;
    const o = reply.outcome;
    // The on-battery pair as one object per reply: the tables that show it lag on its identity.
    const batteryPair = o.ok && o.battery.ok ? { ok: true as const, project: o.battery.project, result: o.battery.result } : undefined;
    const supplyPair = o.ok && o.supply ? { ok: true as const, project: o.supply.project, result: o.supply.result } : undefined;
    modesReply.value = { for: solved, open: openCount.value, outcome: o, ...(batteryPair ? { batteryPair } : {}), ...(supplyPair ? { supplyPair } : {}) };
  }, [reply]);
  // Another project opened (App.tsx keys this part by it) starts on supply again.
  useEffect(() => () => void (shownMode.value = 'supply'), []);
  const mode = shownMode.value;
  const outcome = reply?.kind === 'modes' ? reply.outcome : null;
  const study = outcome?.ok && outcome.study.ok ? outcome.study.study : null;
  const battery = study && !('ok' in study.battery) ? study.battery : null;
  const batteryProblems = outcome?.ok && !outcome.battery.ok ? outcome.battery.problems : [];
  return (
    <section class="modes" aria-labelledby="modes-heading" data-testid="modes">
      <h3 id="modes-heading">Two modes: on supply and on battery</h3>
      <p class="note">
        The bank sits on {study ? study.busName : 'a DC bus'}: on supply the supply carries the loads and keeps the bank
        floating; on battery the supply is cut and the bank carries the same loads.
      </p>
      <ModeSwitch />
      <p class="note" role="status" data-testid="mode-shown">
        {mode === 'battery' && !outcome?.ok
          ? 'Working out the on-battery mode…'
          : `The diagram, the warnings and the tables below show the system ${MODE_WORDS[mode].toLowerCase()}.`}
        {pending && outcome ? ' Updating…' : ''}
      </p>
      {reply?.kind === 'crash' && <p class="notice notice--error" role="alert">{reply.message}</p>}
      {batteryProblems.length > 0 && (
        <div class="notice notice--warn" data-testid="battery-mode-refused">
          <p>On battery the bank cannot carry the bus:</p>
          <ul>{batteryProblems.map((p, i) => <li key={i}>{problemLine(p, solved.project)}</li>)}</ul>
        </div>
      )}
      <div class="mode-balance" data-testid="mode-balance">
        <BalanceColumn title="Energy balance on supply" figures={study?.supply ?? null} mode="supply" chosen={mode === 'supply'} />
        <BalanceColumn title="Energy balance on battery" figures={battery} mode="battery" chosen={mode === 'battery'} />
      </div>
      {outcome?.ok && outcome.flows && (
        <details class="mode-flows" data-testid="mode-flows">
          <summary>Both modes’ energy flow side by side, at one scale</summary>
          <VariantFlows names={[MODE_WORDS.supply, MODE_WORDS.battery]} flows={[outcome.flows.supply, outcome.flows.battery]} />
        </details>
      )}
    </section>
  );
}
