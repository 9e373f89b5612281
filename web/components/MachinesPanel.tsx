/**
 * The machines panel: motors (load, efficiency and power factor at the operating point, the NEC
 * Table 430.250 current), drives (operating point, losses, true power factor), pumps (operating
 * point), the project's pump duty study (energy per year by drive, throttle and on-off), a
 * power-factor correction control for any AC interface, and what the losses cost per year.
 * Loaded on demand.
 *
 * Every figure comes from core (machineDetails, pumpDetails, projectPumpDuty, correctPowerFactor,
 * lossCostPerYear, pumpDutyCosts), run in the panel worker (panel-worker.ts); this file only
 * formats. The energy price and hours per year are the user's own settings (web/state/prefs.ts),
 * not project data.
 */
import { StudyInput } from './StudyInput.tsx';
import { useRef, useState } from 'preact/hooks';
import type { DriveDetail, MotorDetail } from '../../core/studies/machines/details.ts';
import type { PumpDetail } from '../../core/studies/machines/pump-duty.ts';
import type { Problem } from '../../core/model/errors.ts';
import type { Solved } from '../../core/solve/index.ts';
import { DEFAULT_TARGET_POWER_FACTOR, pfCorrectionCandidates } from '../../core/studies/pf/placement.ts';
import type { MachinesFigures, PfCorrectionShown } from './panel-worker.ts';
import { useWorkerReply } from './panel-client.ts';
import {
  formatApparent,
  formatCurrent,
  formatEnergy,
  formatPercent,
  formatPower,
  formatPowerFactor,
  formatReactive,
  formatSignificant,
  formatVoltage,
  UNIT_GAP,
} from '../format/number.ts';
import { formatForInput, fromSi, inputUnit, parseLocaleNumber } from '../format/parse.ts';
import { currencySymbol, formatMoney } from '../format/panels.ts';
import { formatShaftPower, type UnitSystem } from '../format/units.ts';
import { costPrefProblem, effectiveLocale, energyPrice, operatingHours, unitSystem } from '../state/prefs.ts';
import { draft, outcome, resultsState } from '../state/editor.ts';
import { problemLine } from './problem-words.ts';
import './Panels.css';

type Locale = string | undefined;

const quantity = (kind: 'flow' | 'head', si: number, units: UnitSystem, locale: Locale) =>
  `${formatSignificant(fromSi(kind, units, si), 4, locale)}${UNIT_GAP}${inputUnit(kind, units).symbol}`;

// ---------- motors, drives, pumps ----------

function MotorCard({ m, locale }: { m: MotorDetail; locale: Locale }) {
  return (
    <article class="cond-card" aria-labelledby={`motor-${m.id}`} data-testid="motor-card" data-element-id={m.id}>
      <h5 id={`motor-${m.id}`}>{m.name}</h5>
      <dl class="panel-figures">
        <div>
          <dt>Load</dt>
          <dd data-testid="motor-load">{formatPercent(m.loadFraction, locale, 3)} of rated</dd>
        </div>
        <div>
          <dt>Efficiency here</dt>
          <dd>
            {formatPercent(m.efficiency, locale, 3)}
            <span class="cell-note">full load from {m.efficiencySource}</span>
          </dd>
        </div>
        <div>
          <dt>Power factor here</dt>
          <dd>
            {formatSignificant(m.powerFactor, 3, locale)}
            <span class="cell-note">from {m.powerFactorSource}</span>
          </dd>
        </div>
        <div>
          <dt>Line current</dt>
          <dd>
            {formatCurrent(m.lineCurrent, locale)}
            {m.estimatedFullLoadCurrent !== undefined && <span class="cell-note">full load ≈ {formatCurrent(m.estimatedFullLoadCurrent, locale)} from the rating</span>}
            {m.nameplateCurrent !== undefined && <span class="cell-note">nameplate {formatCurrent(m.nameplateCurrent, locale)}</span>}
          </dd>
        </div>
        <div>
          <dt>NEC Table 430.250</dt>
          <dd data-testid="motor-nec">
            {m.nec ? (
              <>
                {formatCurrent(m.nec.amps, locale)}
                <span class="cell-note">
                  {formatSignificant(m.nec.hp, 4, locale)}
                  {UNIT_GAP}hp at {formatVoltage(m.nec.voltage, locale)}
                </span>
              </>
            ) : (
              <span class="cell-note">does not apply: {m.necNotApplicable}</span>
            )}
          </dd>
        </div>
        <div>
          <dt>Service factor</dt>
          <dd>{formatSignificant(m.serviceFactor, 3, locale)}</dd>
        </div>
      </dl>
      {m.loadFraction < 0.5 && (
        <p class="panel-warnings-line">
          Lightly loaded: typical motors are most efficient around 60–85 % load; a smaller motor may run cooler and cheaper.
        </p>
      )}
      {m.nec && <p class="note">{m.nec.note}</p>}
    </article>
  );
}

function DriveCard({ d, locale }: { d: DriveDetail; locale: Locale }) {
  return (
    <article class="cond-card" aria-labelledby={`drive-${d.id}`} data-testid="drive-card" data-element-id={d.id}>
      <h5 id={`drive-${d.id}`}>{d.name}</h5>
      <dl class="panel-figures">
        {d.speedPercent !== undefined && (
          <div>
            <dt>Operating point</dt>
            <dd>
              {formatSignificant(d.speedPercent, 3, locale)}
              {UNIT_GAP}% speed, {formatSignificant(d.torquePercent ?? Number.NaN, 3, locale)}
              {UNIT_GAP}% torque{d.clamped ? ' (outside the loss grid: its edge is used)' : ''}
            </dd>
          </div>
        )}
        <div>
          <dt>Loss</dt>
          <dd>
            {formatPower(d.loss, locale)}
            <span class="cell-note">from {d.lossSource}</span>
          </dd>
        </div>
        <div>
          <dt>Input power factor</dt>
          <dd>
            {formatSignificant(d.displacementPowerFactor, 3, locale)} displacement
            {d.truePowerFactor !== undefined && <span class="cell-note">true {formatSignificant(d.truePowerFactor, 3, locale)} with {formatPercent(d.currentThd ?? 0, locale, 3)} current THD</span>}
          </dd>
        </div>
        <div>
          <dt>Input current</dt>
          <dd>
            {formatCurrent(d.inputCurrentFundamental, locale)} fundamental
            {d.inputCurrentRms !== undefined && <span class="cell-note">{formatCurrent(d.inputCurrentRms, locale)} rms with harmonics</span>}
          </dd>
        </div>
      </dl>
    </article>
  );
}

function PumpCard({ p, units, locale }: { p: PumpDetail; units: UnitSystem; locale: Locale }) {
  const op = p.operatingPoint;
  return (
    <article class="cond-card" aria-labelledby={`pump-${p.id}`} data-testid="pump-card" data-element-id={p.id}>
      <h5 id={`pump-${p.id}`}>{p.name}</h5>
      <dl class="panel-figures">
        <div>
          <dt>Flow and head</dt>
          <dd>
            {quantity('flow', op.flow, units, locale)} at {quantity('head', op.head, units, locale)}
          </dd>
        </div>
        <div>
          <dt>Control</dt>
          <dd>{op.control === 'speed' ? `speed, ${formatPercent(op.speed, locale, 3)} of full speed` : 'throttle valve at full speed'}</dd>
        </div>
        <div>
          <dt>Hydraulic · shaft power</dt>
          <dd>
            {formatPower(op.hydraulicPower, locale)} · {formatShaftPower(op.shaftPower, units, locale)}
            <span class="cell-note">design point {formatShaftPower(op.designShaftPower, units, locale)}</span>
          </dd>
        </div>
      </dl>
      {p.warnings.length > 0 && (
        <ul class="panel-warnings">
          {p.warnings.map((w) => (
            <li key={w}>{w}</li>
          ))}
        </ul>
      )}
    </article>
  );
}

// ---------- pump duty study ----------

function PumpDuty({ flow, locale }: { flow: NonNullable<MachinesFigures['flow']>; locale: Locale }) {
  if (!flow.ok) {
    return (
      <section class="panel-section" aria-labelledby="flow-study-heading">
        <h4 id="flow-study-heading">Flow control over a year</h4>
        <ProblemLines problems={flow.problems} />
      </section>
    );
  }
  const f = flow.result;
  const c = flow.costs ?? null;
  const rows: { key: string; label: string; energy: number; cost?: number }[] = [
    { key: 'drive', label: 'Drive (speed control)', energy: f.speedControl.energyWh, cost: c?.speedControl },
    { key: 'throttle', label: 'Throttle valve', energy: f.throttle.energyWh, cost: c?.throttle },
    { key: 'on-off', label: 'On-off at the design point', energy: f.onOff.energyWh, cost: c?.onOff },
  ];
  return (
    <section class="panel-section" aria-labelledby="flow-study-heading" data-testid="flow-study">
      <h4 id="flow-study-heading">Flow control over a year</h4>
      <p class="note">
        {formatSignificant(f.totalHours, 5, locale)}
        {UNIT_GAP}h a year over {f.points.length} duty points. Method: {f.method}.
      </p>
      <div class="table-scroll" role="region" aria-labelledby="flow-study-heading" tabIndex={0}>
        <table class="data panel-table" data-testid="flow-study-table">
          <thead>
            <tr>
              <th scope="col">Method</th>
              <th scope="col" class="num">Energy per year</th>
              {c && <th scope="col" class="num">Cost per year</th>}
            </tr>
          </thead>
          <tbody>
            {rows.map((r) => (
              <tr key={r.key} data-method={r.key}>
                <th scope="row">{r.label}</th>
                <td class="num" data-testid={`flow-energy-${r.key}`}>
                  {formatEnergy(r.energy, locale)}
                </td>
                {c && <td class="num">{formatMoney(r.cost ?? Number.NaN, locale)}</td>}
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      <p class="panel-headline" data-testid="flow-savings">
        The drive saves {formatEnergy(f.savingVsThrottleWh, locale)} a year against throttling ({formatPercent(f.savingVsThrottleFraction, locale, 3)})
        {c ? `, ${formatMoney(c.savingVsThrottle, locale)}` : ''}, and {formatEnergy(f.savingVsOnOffWh, locale)} against on-off ({formatPercent(f.savingVsOnOffFraction, locale, 3)})
        {c ? `, ${formatMoney(c.savingVsOnOff, locale)}` : ''}.
      </p>
      <p class="note">
        Shaft energy with the drive on the system curve: {formatEnergy(f.speedControlShaftEnergyWh, locale)}; the bare cube law would say{' '}
        {formatEnergy(f.cubeLawShaftEnergyWh, locale)} — static head keeps the real figure above it, so the cube law oversells the savings.
      </p>
      <p class="note">
        Motor: {f.motorSource}. Drive: {f.driveSource}.
      </p>
      {f.warnings.length > 0 && (
        <ul class="panel-warnings">
          {f.warnings.map((w) => (
            <li key={w}>{w}</li>
          ))}
        </ul>
      )}
    </section>
  );
}

function ProblemLines({ problems }: { problems: Problem[] }) {
  return (
    <ul class="panel-warnings" role="alert">
      {problems.map((p, i) => (
        <li key={i}>
          {problemLine(p, draft.value)}
        </li>
      ))}
    </ul>
  );
}

// ---------- power-factor correction ----------

function PfCorrectionControl({ solved, locale }: { solved: Solved; locale: Locale }) {
  const result = solved.result;
  const [at, setAt] = useState<string | null>(null);
  const [targetText, setTargetText] = useState(() => formatForInput(DEFAULT_TARGET_POWER_FACTOR, locale));
  const parsed = parseLocaleNumber(targetText, locale);
  const target = parsed.kind === 'number' ? parsed.value : Number.NaN;
  // Where a bank belongs and where one is needed (at the default target, so the choice does not
  // jump while a target is typed) come from core: never a drive or inverter output.
  const all = pfCorrectionCandidates(result, DEFAULT_TARGET_POWER_FACTOR);
  const candidates = all.filter((c) => c.offered);
  const kindOf = new Map(result.elements.map((e) => [e.id, e.kind]));
  const preferred =
    candidates.find((c) => c.needed && kindOf.get(c.id) === 'motor') ?? candidates.find((c) => c.needed) ?? candidates[0];
  const chosenCandidate = (at !== null ? candidates.find((c) => c.id === at) : undefined) ?? preferred;
  const chosen = chosenCandidate?.id;
  // A place not lagging, or already at or above the default target, needs no bank: say so and ask the
  // worker nothing (the panel never opens in an error). A target typed below the present pf still gets
  // the engine's own message at the field.
  const notNeeded = !!chosenCandidate && !chosenCandidate.needed && (chosenCandidate.pfSense !== 'lagging' || target === DEFAULT_TARGET_POWER_FACTOR);
  const { reply, pending } = useWorkerReply<'pfc'>(
    () => (chosen && Number.isFinite(target) && !notNeeded ? { kind: 'pfc', solved, at: chosen, targetPowerFactor: target } : null),
    [solved, chosen, target, notNeeded],
  );
  if (candidates.length === 0) return null;
  const noneNeeded = !candidates.some((c) => c.needed);
  const excludedByReason = new Map<string, string[]>();
  for (const c of all) if (!c.offered && c.reason) excludedByReason.set(c.reason, [...(excludedByReason.get(c.reason) ?? []), c.name]);
  const excluded = [...excludedByReason];
  const outcome = reply?.kind === 'pfc' ? reply.outcome : null;
  const crash = reply?.kind === 'crash' ? reply.message : null;
  const inputError = parsed.kind === 'invalid' ? `Target power factor: '${targetText.trim()}' ${parsed.problem}` : parsed.kind === 'empty' ? 'Target power factor: give a value such as 0.95' : null;
  const targetProblem = !notNeeded && outcome && !outcome.ok ? outcome.problems.find((p) => p.field === 'targetPowerFactor') : undefined;
  const fieldMessage = inputError ?? (targetProblem ? `Target power factor: ${targetProblem.message}` : null);
  return (
    <section class="panel-section" aria-labelledby="pfc-heading" data-testid="pfc" data-state={pending ? 'pending' : 'current'}>
      <h4 id="pfc-heading">Correct the power factor</h4>
      <div class="study-settings study-settings--inline">
        <div class="study-field">
          <label for="pfc-at" class="study-field__label">
            Capacitor bank at
          </label>
          <select id="pfc-at" class="study-field__input" value={chosen} onChange={(e) => setAt((e.currentTarget as HTMLSelectElement).value)} data-testid="pfc-at">
            {candidates.map((c) => (
              <option key={c.id} value={c.id}>
                {c.name || c.id} — pf {formatPowerFactor(c.powerFactor, c.pfSense, locale)}
              </option>
            ))}
          </select>
        </div>
        <div class={fieldMessage ? 'study-field study-field--error' : 'study-field'}>
          <label for="pfc-target" class="study-field__label">
            Target power factor
          </label>
          <span class="study-field__row">
            <input
              id="pfc-target"
              class="study-field__input"
              type="text"
              inputMode="decimal"
              autoComplete="off"
              value={targetText}
              aria-invalid={fieldMessage ? 'true' : undefined}
              aria-describedby={fieldMessage ? 'pfc-target-error' : undefined}
              onInput={(e) => setTargetText((e.currentTarget as HTMLInputElement).value)}
              data-testid="pfc-target"
            />
            <span class="study-field__unit">lagging</span>
          </span>
          {fieldMessage && (
            <span id="pfc-target-error" class="study-field__error" role="alert">
              {fieldMessage}
            </span>
          )}
        </div>
      </div>
      {!inputError && notNeeded && chosenCandidate && (
        <p class="panel-headline" data-testid="pfc-not-needed">
          No correction needed{noneNeeded ? ' anywhere a bank belongs' : ''}: {chosenCandidate.name} is at pf {formatPowerFactor(chosenCandidate.powerFactor, chosenCandidate.pfSense, locale)}
          {chosenCandidate.pfSense === 'lagging' ? `, at or above the target ${formatSignificant(target, 3, locale)}` : ', not lagging'}.
        </p>
      )}
      {excluded.map(([reason, names]) => (
        <p class="cell-note" data-testid="pfc-excluded" key={reason}>
          Not offered: {names.join(', ')} — {reason}.
        </p>
      ))}
      {crash && !notNeeded && <p class="notice notice--error" role="alert">{crash}</p>}
      {!inputError && !notNeeded && outcome && !outcome.ok && !targetProblem && <ProblemLines problems={outcome.problems} />}
      {!inputError && !notNeeded && outcome?.ok && <PfResult c={outcome.correction} locale={locale} />}
    </section>
  );
}

function PfResult({ c, locale }: { c: PfCorrectionShown; locale: Locale }) {
  const cap = c.bank.capacitance;
  const uF = (f: number | undefined) => (f === undefined ? '—' : `${formatSignificant(f * 1e6, 4, locale)}${UNIT_GAP}µF`);
  return (
    <div data-testid="pfc-result">
      <p class="panel-headline">
        A bank of <strong data-testid="pfc-kvar">{formatReactive(c.bank.reactivePower, locale)}</strong> at {formatVoltage(c.bank.voltage, locale)},{' '}
        {formatSignificant(c.bank.frequency, 4, locale)}
        {UNIT_GAP}Hz ({c.side === 'input' ? 'beside the element, at its terminals' : 'at its output'})
      </p>
      <dl class="panel-figures">
        <div>
          <dt>Capacitance per phase</dt>
          <dd data-testid="pfc-capacitance">
            {cap.single !== undefined ? uF(cap.single) : `${uF(cap.delta)} in delta · ${uF(cap.star)} in star`}
          </dd>
        </div>
        <div>
          <dt>Power factor</dt>
          <dd>
            {formatPowerFactor(c.before.powerFactor, c.before.pfSense, locale)} → {formatPowerFactor(c.afterSolved.powerFactor, c.afterSolved.pfSense, locale)}
          </dd>
        </div>
        <div>
          <dt>Line current here</dt>
          <dd data-testid="pfc-current">
            {formatCurrent(c.before.current, locale)} → {formatCurrent(c.afterSolved.current, locale)}
          </dd>
        </div>
        <div>
          <dt>Source apparent power</dt>
          <dd>
            {formatApparent(c.source.sBefore, locale)} → {formatApparent(c.source.sAfter, locale)}
          </dd>
        </div>
        <div>
          <dt>Chain losses</dt>
          <dd>
            {formatPower(c.lossesBefore, locale)} → {formatPower(c.lossesAfter, locale)}
          </dd>
        </div>
        <div>
          <dt>At {formatPercent(c.lightLoad.fraction, locale, 2)} load</dt>
          <dd>
            pf {formatPowerFactor(c.lightLoad.powerFactor, c.lightLoad.pfSense, locale)}
            <span class="cell-note">leading below {formatPercent(c.lightLoad.leadingBelowFraction, locale, 3)} load</span>
          </dd>
        </div>
      </dl>
      {c.upstream.length > 0 && (
        <div class="table-scroll" role="region" aria-label="Upstream of the bank, before and after" tabIndex={0}>
          <table class="data panel-table" data-testid="pfc-upstream">
            <thead>
              <tr>
                <th scope="col">Upstream</th>
                <th scope="col" class="num">Current before → after</th>
                <th scope="col" class="num">Loss before → after</th>
              </tr>
            </thead>
            <tbody>
              {c.upstream.map((u) => (
                <tr key={u.id}>
                  <th scope="row">
                    {u.name}
                    {u.sizeBefore && u.sizeAfter && u.sizeBefore !== u.sizeAfter ? <span class="cell-note">{`${u.sizeBefore} → ${u.sizeAfter}`}</span> : null}
                  </th>
                  <td class="num">
                    {formatCurrent(u.currentBefore, locale)} → {formatCurrent(u.currentAfter, locale)}
                  </td>
                  <td class="num">
                    {formatPower(u.lossBefore, locale)} → {formatPower(u.lossAfter, locale)}
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      )}
      {c.warnings.length > 0 && (
        <ul class="panel-warnings">
          {c.warnings.map((w) => (
            <li key={w}>{w}</li>
          ))}
        </ul>
      )}
      <p class="panel-caution">{c.caution}</p>
    </div>
  );
}

// ---------- running cost of the losses ----------

/** A number setting kept in the user's preferences (typed in their number format, checked by core). */
function PrefNumber({
  id,
  label,
  unit,
  value,
  onValue,
  check,
  locale,
  placeholder,
  testId,
}: {
  id: string;
  label: string;
  unit: string;
  value: number | null;
  onValue: (v: number | null) => void;
  check: (v: number) => string | null;
  locale: Locale;
  placeholder?: string;
  testId: string;
}) {
  const [text, setText] = useState<string | null>(null);
  const [message, setMessage] = useState<string | null>(null);
  const commit = (t: string) => {
    setText(t);
    const parsed = parseLocaleNumber(t, locale);
    if (parsed.kind === 'invalid') return setMessage(`${label}: '${t.trim()}' ${parsed.problem}`);
    if (parsed.kind === 'empty') {
      setMessage(null);
      return onValue(null);
    }
    const problem = check(parsed.value);
    if (problem) return setMessage(`${label}: ${problem}`);
    setMessage(null);
    onValue(parsed.value);
  };
  return (
    <StudyInput
      id={id}
      label={label}
      unit={unit}
      text={text ?? (value === null ? '' : formatForInput(value, locale))}
      placeholder={placeholder}
      message={message}
      onText={commit}
      onLeave={() => {
        if (!message) setText(null);
      }}
      testId={testId}
    />
  );
}

function LossCost({ lossCost, locale }: { lossCost: MachinesFigures['lossCost']; locale: Locale }) {
  const price = energyPrice.value;
  const hours = operatingHours.value;
  const symbol = currencySymbol(locale);
  const cost = price !== null ? lossCost ?? null : null;
  return (
    <section class="panel-section" aria-labelledby="loss-cost-heading" data-testid="loss-cost">
      <h4 id="loss-cost-heading">What the losses cost per year</h4>
      <div class="study-settings study-settings--inline">
        <PrefNumber
          id="cost-price"
          label={`Energy price${symbol ? `, ${symbol}` : ''} per kWh`}
          unit={symbol ? `${symbol}/kWh` : 'per kWh'}
          value={price}
          onValue={(v) => (energyPrice.value = v)}
          check={(v) => costPrefProblem('pricePerKWh', v)}
          locale={locale}
          placeholder="e.g. 0.25"
          testId="cost-price"
        />
        <PrefNumber
          id="cost-hours"
          label="Hours per year at this load"
          unit="h"
          value={hours}
          onValue={(v) => (operatingHours.value = v ?? 8760)}
          check={(v) => costPrefProblem('hoursPerYear', v)}
          locale={locale}
          placeholder="8760"
          testId="cost-hours"
        />
      </div>
      {!cost && <p class="note">Give your energy price to see what each stage’s loss costs a year (kept on this device, not in the project).</p>}
      {cost && !cost.ok && <ProblemLines problems={cost.problems} />}
      {cost?.ok && (
        <>
          <div class="table-scroll" role="region" aria-labelledby="loss-cost-heading" tabIndex={0}>
            <table class="data panel-table" data-testid="loss-cost-table">
              <thead>
                <tr>
                  <th scope="col">Where</th>
                  <th scope="col" class="num">Loss</th>
                  <th scope="col" class="num">Per year</th>
                  <th scope="col" class="num">Cost per year</th>
                </tr>
              </thead>
              <tbody>
                {cost.cost.rows.map((r) => (
                  <tr key={r.id}>
                    <th scope="row">{r.name}</th>
                    <td class="num">{formatPower(r.lossW, locale)}</td>
                    <td class="num">{formatEnergy(r.energyKWh * 1000, locale)}</td>
                    <td class="num">{formatMoney(r.cost, locale)}</td>
                  </tr>
                ))}
              </tbody>
              <tfoot>
                <tr>
                  <th scope="row">All losses</th>
                  <td class="num">{formatPower(cost.cost.totalLossW, locale)}</td>
                  <td class="num">{formatEnergy(cost.cost.totalEnergyKWh * 1000, locale)}</td>
                  <td class="num" data-testid="loss-cost-total">
                    {formatMoney(cost.cost.totalCost, locale)}
                  </td>
                </tr>
              </tfoot>
            </table>
          </div>
          <p class="note">At the operating point shown, held for {formatSignificant(hours, 5, locale)} h a year; a chain that runs at several loads costs what each load level costs for its hours.</p>
        </>
      )}
    </section>
  );
}

export default function MachinesPanel() {
  const o = outcome.value;
  const units = unitSystem.value;
  const locale = effectiveLocale();
  const price = energyPrice.value;
  const hours = operatingHours.value;
  // The draft's own solved pair (project and result), handed whole to the worker.
  const solved = o?.ok ? o : null;
  const result = solved?.result ?? null;
  /** The solved pair the latest request was built from (the reply that is shown is always the latest's). */
  const sent = useRef<Solved | null>(null);
  const { reply, pending } = useWorkerReply<'machines'>(() => {
    if (!solved) return null;
    sent.current = solved;
    return { kind: 'machines', solved, cost: price !== null ? { pricePerKWh: price, hoursPerYear: hours } : null };
  }, [solved, price, hours]);
  /** The last figures of a valid draft, with the solved pair they belong to (kept while later drafts do not solve). */
  const last = useRef<{ figures: MachinesFigures; solved: Solved } | null>(null);
  if (!pending && reply?.kind === 'machines' && reply.outcome.ok && sent.current) last.current = { figures: reply.outcome.figures, solved: sent.current };
  const shown = last.current;
  const problems = reply?.kind === 'machines' && !reply.outcome.ok ? reply.outcome.problems : [];
  const crash = reply?.kind === 'crash' ? reply.message : null;
  const stale = !result || resultsState.value === 'stale' || problems.length > 0;
  if (!shown) return <p class="note" data-testid="machines-panel" data-state={pending ? 'pending' : 'none'}>{crash ?? 'Working out the figures…'}</p>;
  const { motors, drives, pumps, flow, lossCost } = shown.figures;
  return (
    <div class={stale ? 'panel-body panel-body--stale' : 'panel-body'} data-testid="machines-panel" data-state={pending ? 'pending' : stale ? 'stale' : 'current'} data-study-ms={reply ? reply.ms.toFixed(2) : ''}>
      {stale && (
        <p class="notice notice--stale" role="status">
          Out of date: these are the figures of the last valid inputs.
        </p>
      )}
      {crash && <p class="notice notice--error" role="alert">{crash}</p>}
      {(motors.length > 0 || drives.length > 0 || pumps.length > 0) && (
        <section class="panel-section" aria-labelledby="machines-heading">
          <h4 id="machines-heading">Motors, drives and pumps at the operating point</h4>
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
          </div>
        </section>
      )}
      {flow && <PumpDuty flow={flow} locale={locale} />}
      <PfCorrectionControl solved={shown.solved} locale={locale} />
      <LossCost lossCost={lossCost} locale={locale} />
    </div>
  );
}
