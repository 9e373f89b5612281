/**
 * The machines panel: motors (load, efficiency and power factor at the operating point, the NEC
 * Table 430.250 current), drives (operating point, losses, true power factor), pumps (operating
 * point), the project's pump duty study (energy per year by drive, throttle and on-off), a
 * power-factor correction control for any AC interface, what the losses cost per year, and the cost
 * over the years (web/components/cost/: lifetime cost, CO₂, generator fuel).
 * Loaded on demand.
 *
 * Every figure comes from core (machineDetails, pumpDetails, projectPumpDuty, correctPowerFactor,
 * lossCostPerYear, pumpDutyCosts), run in the panel worker (panel-worker.ts); the panel only
 * formats. The energy price and hours per year are the project's `running` settings (a project
 * without them starts from this device's earlier setting, web/state/prefs.ts `costInForce`). This file asks the worker and lays the panel out; its sections are in
 * web/components/machines/: MachineCards.tsx, PumpDutyStudy.tsx, PfCorrection.tsx, LossCost.tsx.
 */
import { useRef } from 'preact/hooks';
import type { Solved } from '../../core/page.ts';
import type { MachinesFigures } from './panel-worker.ts';
import { useWorkerReply } from './panel-client.ts';
import { costInForce, effectiveLocale, unitSystem } from '../state/prefs.ts';
import { draft, outcome, resultsState } from '../state/editor.ts';
import { LossCost } from './machines/LossCost.tsx';
import { CostOverYears } from './cost/CostOverYears.tsx';
import { DriveCard, MotorCard, PumpCard } from './machines/MachineCards.tsx';
import { PfCorrectionControl } from './machines/PfCorrection.tsx';
import { PumpDuty } from './machines/PumpDutyStudy.tsx';
import { DutyEditor } from './machines/DutyEditor.tsx';
import { FanCard } from './machines/FanCard.tsx';
import './Panels.css';

export default function MachinesPanel() {
  const o = outcome.value;
  const units = unitSystem.value;
  const locale = effectiveLocale();
  // The draft's own solved pair (project and result), handed whole to the worker.
  const solved = o?.ok ? o : null;
  // The price and hours of the solved project (a value the engine refused never enters it).
  const cost = costInForce(solved?.project ?? null);
  const price = cost?.pricePerKWh ?? null;
  const hours = cost?.hoursPerYear ?? 0;
  const result = solved?.result ?? null;
  /** The solved pair the latest request was built from (the reply that is shown is always the latest's). */
  const sent = useRef<Solved | null>(null);
  const { reply, pending } = useWorkerReply<'machines'>(() => {
    if (!solved) return null;
    sent.current = solved;
    return { kind: 'machines', solved, cost };
  }, [solved, price, hours]);
  /** The last figures of a valid draft, with the solved pair they belong to (kept while later drafts do not solve). */
  const last = useRef<{ figures: MachinesFigures; solved: Solved } | null>(null);
  if (!pending && reply?.kind === 'machines' && reply.outcome.ok && sent.current) last.current = { figures: reply.outcome.figures, solved: sent.current };
  const shown = last.current;
  const problems = reply?.kind === 'machines' && !reply.outcome.ok ? reply.outcome.problems : [];
  const crash = reply?.kind === 'crash' ? reply.message : null;
  const stale = !result || resultsState.value === 'stale' || problems.length > 0;
  if (!shown) return <p class="note" data-testid="machines-panel" data-state={pending ? 'pending' : 'none'}>{crash ?? 'Working out the figures…'}</p>;
  const { motors, drives, pumps, fans, pumpDuty, lossCost, lifetime } = shown.figures;
  return (
    <div class={stale ? 'panel-body panel-body--stale' : 'panel-body'} data-testid="machines-panel" data-state={pending ? 'pending' : stale ? 'stale' : 'current'} data-study-ms={reply ? reply.ms.toFixed(2) : ''}>
      {stale && (
        <p class="notice notice--stale" role="status">
          Out of date: these are the figures of the last valid inputs.
        </p>
      )}
      {crash && <p class="notice notice--error" role="alert">{crash}</p>}
      {(motors.length > 0 || drives.length > 0 || pumps.length > 0 || fans.length > 0) && (
        <section class="panel-section" aria-labelledby="machines-heading">
          <h4 id="machines-heading">{fans.length > 0 ? 'Motors, drives, pumps and fans at the operating point' : 'Motors, drives and pumps at the operating point'}</h4>
          <div class="cond-cards">
            {motors.map((m) => (
              <MotorCard key={m.id} m={m} locale={locale} />
            ))}
            {drives.map((d) => (
              <DriveCard key={d.id} d={d} locale={locale} />
            ))}
            {pumps.map((p) => (
              <PumpCard key={p.id} p={p} units={units} locale={locale} />
            ))}
            {fans.map((f) => (
              <FanCard key={f.id} f={f} units={units} locale={locale} />
            ))}
          </div>
        </section>
      )}
      <DutyEditor solved={shown.solved} problems={pumpDuty && !pumpDuty.ok ? pumpDuty.problems : []} units={units} locale={locale} />
      {pumpDuty && <PumpDuty duty={pumpDuty} locale={locale} units={units} />}
      <PfCorrectionControl solved={shown.solved} locale={locale} />
      {draft.value && <LossCost lossCost={lossCost} project={draft.value} units={units} locale={locale} />}
      {draft.value && <CostOverYears lifetime={lifetime} project={draft.value} solved={shown.solved} units={units} locale={locale} />}
    </div>
  );
}
