/**
 * The machines panel's power-factor correction: the control for any AC interface and the bank it gives.
 */
import { useState } from 'preact/hooks';
import { DEFAULT_TARGET_POWER_FACTOR, pfCorrectionCandidates } from '../../../core/studies/index.ts';
import type { Solved } from '../../../core/page.ts';
import type { PfCorrectionShown } from '../panel-worker.ts';
import { useWorkerReply } from '../panel-client.ts';
import { formatApparent, formatCurrent, formatPercent, formatPower, formatPowerFactor, formatReactive, formatSignificant, formatVoltage, UNIT_GAP } from '../../format/number.ts';
import { formatForInput, parseLocaleNumber } from '../../format/parse.ts';
import { type Locale, ProblemLines } from './shared.tsx';
import { CsvButton } from '../report/CsvButton.tsx';

export function PfCorrectionControl({ solved, locale }: { solved: Solved; locale: Locale }) {
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
      {c.upstream.length > 0 && <CsvButton name="Upstream of the bank" />}
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
