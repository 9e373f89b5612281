/**
 * Motor starting and fault currents of a project: each motor's verdict (starts / marginal / will
 * not start) with the governing reason, prospective fault currents against the devices' ratings
 * (the rating a too-weak device needs), the trap warnings and the cautions.
 *
 * Self-contained: give it the solved project (the page's last valid pair); every figure comes from core's studySurges()
 * and this file only formats (web/format/number.ts, in the chosen locale).
 */
import { useMemo } from 'preact/hooks';
import { type DeviceCheck, type FaultPoint, type MotorStartResult, type StartCheck, studySurges } from '../../core/studies/index.ts';
import { elementNames, nonFiniteProblems, type Solved } from '../../core/page.ts';
import { problemLine } from './problem-words.ts';
import { formatApparent, formatCurrent, formatPercent, formatSignificant, formatVoltage, UNIT_GAP } from '../format/number.ts';
import { effectiveLocale } from '../state/prefs.ts';
import './Panels.css';
import { CsvButton } from './report/CsvButton.tsx';

const VERDICT: Record<MotorStartResult['verdict'], string> = { starts: 'Starts', marginal: 'Marginal', 'will-not-start': 'Will not start' };
const DEVICE: Record<DeviceCheck['status'], string> = { adequate: 'Adequate', 'too-weak': 'Too weak', unknown: 'Not known' };

function checkValue(c: StartCheck, locale: string | undefined): string {
  if (c.unit === '%') return formatPercent(c.value / 100, locale, 3);
  if (c.unit === 'VA') return formatApparent(c.value, locale);
  if (c.unit === 'V') return formatVoltage(c.value, locale);
  return `${formatSignificant(c.value, 3, locale)}${UNIT_GAP}${c.unit}`;
}
function checkLimit(c: StartCheck, locale: string | undefined): string {
  return checkValue({ ...c, value: c.limit }, locale);
}

function MotorStart({ s, locale }: { s: MotorStartResult; locale: string | undefined }) {
  return (
    <article class="starting-motor" data-testid={`start-${s.motorId}`} data-element-id={s.motorId} data-verdict={s.verdict}>
      <h4>
        {s.name}: <strong>{VERDICT[s.verdict]}</strong>
      </h4>
      <p>{s.governing}</p>
      <p class="note">
        Starting current {formatCurrent(s.startingCurrent, locale)} ({formatSignificant(s.startingMultiple, 3, locale)} × full-load {formatCurrent(s.fullLoadCurrent, locale)}), {formatApparent(s.startingApparentPower, locale)} at
        power factor {formatSignificant(s.startingPowerFactor, 2, locale)}; locked-rotor {formatCurrent(s.lockedRotorCurrent, locale)} ({s.lockedRotorSource}).
      </p>
      {s.duringStart ? (
        <p class="note" data-testid="start-drops">
          During the start: {formatVoltage(s.duringStart.terminalVoltage, locale)} at the motor ({formatPercent(s.duringStart.terminalVoltagePercent / 100, locale, 3)} of rated); drops{' '}
          {s.duringStart.seriesDrops.map((d) => `${d.name} ${formatPercent(d.dropPercent / 100, locale, 3)}`).join(', ') || 'none'}.
        </p>
      ) : null}
      {s.sourceImpedance ? <p class="note">Source impedance during the start: {s.sourceImpedance.basis}.</p> : null}
      <CsvButton name="Checks during the start" />
      <div class="table-scroll" role="region" aria-label="Checks during the start" tabIndex={0}>
      <table class="data panel-table">
        <caption>Checks during the start</caption>
        <thead>
          <tr>
            <th scope="col">Check</th>
            <th scope="col">Value</th>
            <th scope="col">Limit</th>
            <th scope="col">Result</th>
          </tr>
        </thead>
        <tbody>
          {s.checks.map((c) => (
            <tr key={c.name} data-status={c.status}>
              <th scope="row">{c.label}</th>
              <td>{checkValue(c, locale)}</td>
              <td>
                {c.sense === 'at-least' ? '≥ ' : '≤ '}
                {checkLimit(c, locale)} <span class="note">({c.limitSource})</span>
              </td>
              <td>{c.status}</td>
            </tr>
          ))}
        </tbody>
      </table>
      </div>
      {s.notes.map((n) => (
        <p class="note" key={n}>
          {n}
        </p>
      ))}
      <details>
        <summary>Method</summary>
        <p class="note">{s.methodText}</p>
      </details>
    </article>
  );
}

function FaultTable({ title, points, locale, names, basis }: { title: string; points: FaultPoint[]; locale: string | undefined; names: ReadonlyMap<string, string>; basis?: string | undefined }) {
  if (!points.length) return null;
  return (
    <>
    <CsvButton name={title} />
    <div class="table-scroll" role="region" aria-label={title} tabIndex={0}>
    <table class="data panel-table">
      <caption>
        {title}
        {basis ? <span class="cell-note">Worked at {basis}.</span> : null}
      </caption>
      <thead>
        <tr>
          <th scope="col">Where</th>
          <th scope="col">Voltage</th>
          <th scope="col">Prospective current</th>
        </tr>
      </thead>
      <tbody>
        {points.map((p) => (
          <tr key={`${p.elementId}-${p.location}`}>
            <th scope="row">
              {names.get(p.elementId) ?? p.elementId}, {p.location}
            </th>
            <td>{formatVoltage(p.voltage, locale)}</td>
            <td>{p.current === null ? <span title={p.note}>not computed — {p.note}</span> : formatCurrent(p.current, locale)}</td>
          </tr>
        ))}
      </tbody>
    </table>
    </div>
    </>
  );
}

/** The starting and fault panel for one solved project (the page's last valid pair). */
export function StartingPanel({ solved }: { solved: Solved }) {
  const locale = effectiveLocale();
  const outcome = useMemo(() => {
    const o = studySurges(solved);
    // Figures that are not finite numbers refuse the study (core/solve/finite.ts), never a table of NaN.
    const notFinite = o.ok ? nonFiniteProblems('The surge and fault study', o.result, elementNames(solved.project)) : [];
    return notFinite.length ? { ok: false as const, problems: notFinite } : o;
  }, [solved]);
  if (!outcome.ok) {
    return (
      <section class="panel-body" data-testid="starting-panel" aria-label="Motor starting and fault currents">
        <p>The starting and fault study cannot be run on this project:</p>
        <ul class="panel-warnings">
          {outcome.problems.map((p) => (
            <li class="panel-warnings-line" key={`${p.elementId}-${p.field}-${p.code}`}>
              {problemLine(p, solved.project)}
            </li>
          ))}
        </ul>
      </section>
    );
  }
  const r = outcome.result;
  const names = new Map<string, string>();
  for (const e of solved.project.elements) names.set(e.id, e.name !== undefined && e.name !== '' ? e.name : e.id);
  return (
    <section class="panel-body" data-testid="starting-panel" aria-label="Motor starting and fault currents">
      {r.starts.length ? (
        r.starts.map((s) => <MotorStart s={s} locale={locale} key={s.motorId} />)
      ) : (
        <p class="note">No motor has starting data: give a motor its starting method (and code letter or locked-rotor current) to check its start.</p>
      )}
      <FaultTable title="Battery prospective short-circuit current" points={r.batteryFaults.points} locale={locale} names={names} basis={r.batteryFaults.voltageBasis} />
      <FaultTable title={`AC available fault current (IEC 60909, c = ${r.acFaults.voltageFactor ?? '—'})`} points={r.acFaults.points} locale={locale} names={names} />
      {r.devices.length ? <CsvButton name="Protective devices" /> : null}
      {r.devices.length ? (
        <div class="table-scroll" role="region" aria-label="Protective devices" tabIndex={0}>
        <table class="data panel-table" data-testid="device-checks">
          <caption>Protective devices</caption>
          <thead>
            <tr>
              <th scope="col">Device</th>
              <th scope="col">Interrupting rating</th>
              <th scope="col">Prospective current</th>
              <th scope="col">Result</th>
            </tr>
          </thead>
          <tbody>
            {r.devices.map((d) => (
              <tr key={`${d.elementId}-${d.field}`} data-status={d.status}>
                <th scope="row">
                  {names.get(d.elementId) ?? d.elementId}: {d.label} ({d.location})
                </th>
                <td>{formatCurrent(d.interruptingRating, locale)}</td>
                <td>{d.prospectiveCurrent === null ? '—' : formatCurrent(d.prospectiveCurrent, locale)}</td>
                <td>
                  {DEVICE[d.status]}
                  {d.requiredRating !== undefined ? `: needs at least ${formatCurrent(d.requiredRating, locale)}` : ''}
                  {d.status === 'unknown' ? ` — ${d.message}` : ''}
                </td>
              </tr>
            ))}
          </tbody>
        </table>
        </div>
      ) : null}
      {r.warnings.length ? (
        <ul class="panel-warnings" aria-label="Warnings">
          {r.warnings.map((w) => (
            <li class="panel-warnings-line" key={`${w.code}-${w.elementId}`}>
              <strong>{w.elementId}</strong>: {w.message}
            </li>
          ))}
        </ul>
      ) : null}
      <ul class="note" aria-label="Cautions">
        {r.cautions.map((c) => (
          <li key={c}>{c}</li>
        ))}
      </ul>
    </section>
  );
}

export default StartingPanel;
