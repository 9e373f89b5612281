/**
 * The battery panel's figures: runtime and why it is less than Wh ÷ W, the sizing, the recharge, the plot of
 * state of charge, voltage and current, and the cautions.
 */
import type { BackupStudyResult } from '../../../core/studies/index.ts';
import { formatCurrent, formatDuration, formatEnergy, formatPercent, formatPower, formatSignificant, formatVoltage, UNIT_GAP } from '../../format/number.ts';
import { formatTemperature, type UnitSystem } from '../../format/units.ts';
import { TimeChart, type ChartSeries } from '../charts/TimeChart.tsx';
import { derateValue, Sizing } from './Sizing.tsx';
import { CsvButton } from '../report/CsvButton.tsx';

function RechargeFigures({ study, locale }: { study: BackupStudyResult; locale: string | undefined }) {
  const r = study.recharge;
  const c = study.charger;
  return (
    <section class="panel-section" aria-labelledby="battery-recharge-heading" data-testid="battery-recharge">
      <h4 id="battery-recharge-heading">Recharge</h4>
      {!r && !c && <p class="note">Give a charger current or a target recharge time in the study settings.</p>}
      {r && (
        <>
          <p class="panel-headline">
            With a {formatCurrent(r.chargerCurrent, locale)} charger: <strong data-testid="battery-recharge-time">{formatDuration(r.time, locale)}</strong> from{' '}
            {formatPercent(r.startSoc, locale, 3)} to {formatPercent(r.endSoc, locale, 3)}
          </p>
          <dl class="panel-figures">
            <div>
              <dt>Constant current</dt>
              <dd>{formatDuration(r.constantCurrentTime, locale)}</dd>
            </div>
            <div>
              <dt>Taper (constant voltage)</dt>
              <dd>{formatDuration(r.constantVoltageTime, locale)}</dd>
            </div>
            <div>
              <dt>Into the bank</dt>
              <dd>{formatCurrent(r.bankCurrent, locale)}</dd>
            </div>
            <div>
              <dt>Carrying the loads</dt>
              <dd>{formatCurrent(r.loadCurrent, locale)}</dd>
            </div>
            <div>
              <dt>Charger AC input, up to</dt>
              <dd>{formatPower(r.acInputPower, locale)}</dd>
            </div>
            <div>
              <dt>AC energy for the recharge</dt>
              <dd data-testid="battery-recharge-ac-energy">{formatEnergy(r.acInputEnergyWh, locale)}</dd>
            </div>
          </dl>
          {r.warnings.length > 0 && (
            <ul class="panel-warnings">
              {r.warnings.map((w) => (
                <li key={w}>{w}</li>
              ))}
            </ul>
          )}
        </>
      )}
      {c && (
        <p class="panel-headline" data-testid="battery-charger-for-target">
          Charger for the target recharge time: at least <strong>{formatCurrent(c.chargerCurrent, locale)}</strong> DC (recharge{' '}
          {formatDuration(c.recharge.time, locale)})
        </p>
      )}
    </section>
  );
}

function Plot({ study, locale }: { study: BackupStudyResult; locale: string | undefined }) {
  const d = study.discharge;
  const s = d.series;
  const series: ChartSeries[] = [
    {
      key: 'soc',
      title: 'State of charge, %',
      unit: '%',
      values: s.soc.map((v) => v * 100),
      domain: [0, 100],
      ...(d.socLimit > 0 ? { guide: { value: d.socLimit * 100, label: `usable limit ${formatPercent(d.socLimit, locale, 3)}` } } : {}),
      digits: 3,
    },
    { key: 'voltage', title: 'Terminal voltage, V', unit: 'V', values: s.voltage, guide: { value: d.cutoffVoltage, label: `cut-off ${formatVoltage(d.cutoffVoltage, locale)}` } },
    { key: 'current', title: 'Bank current, A', unit: 'A', values: s.current, fromZero: true, digits: 3 },
  ];
  const first = (a: number[]) => a[0] ?? Number.NaN;
  const last = (a: number[]) => a[a.length - 1] ?? Number.NaN;
  const minCurrent = s.current.reduce((m, v) => Math.min(m, v), Number.POSITIVE_INFINITY);
  const summary =
    `Over ${formatDuration(d.runtimeSeconds, locale)} the state of charge falls from ${formatPercent(first(s.soc), locale, 3)} to ${formatPercent(last(s.soc), locale, 3)}` +
    (d.socLimit > 0 ? ` (the usable limit is ${formatPercent(d.socLimit, locale, 3)})` : ' (backup design: no depth-of-discharge limit)') +
    `; the terminal voltage goes from ${formatVoltage(first(s.voltage), locale)} to ${formatVoltage(last(s.voltage), locale)}` +
    ` (lowest ${formatVoltage(d.minVoltage, locale)}, cut-off ${formatVoltage(d.cutoffVoltage, locale)}); the bank current varies between ${formatCurrent(minCurrent, locale)} and ${formatCurrent(d.peakCurrent, locale)}.`;
  return (
    <section class="panel-section" aria-labelledby="battery-plot-heading">
      <h4 id="battery-plot-heading">Through the outage</h4>
      <TimeChart time={s.time} series={series} locale={locale} summary={summary} timeTitle="Time since the outage began, h" testId="battery-plot" />
    </section>
  );
}

export function StudyFigures({ study, cautions, locale, units }: { study: BackupStudyResult; cautions: string[]; locale: string | undefined; units: UnitSystem }) {
  const d = study.discharge;
  const b = d.bank;
  return (
    <>
      <section class="panel-section" aria-labelledby="battery-runtime-heading">
        <h4 id="battery-runtime-heading">Runtime</h4>
        <p class="panel-headline">
          <strong class="panel-big" data-testid="battery-runtime">
            {d.runtimeIsLowerBound ? 'longer than ' : ''}
            {formatDuration(d.runtimeSeconds, locale)}
          </strong>{' '}
          <span data-testid="battery-end-reason">— {d.endText}</span>
        </p>
        <p class="note" data-testid="battery-basis">
          {d.basis}
        </p>
        <p class="note">
          {b.label}: {b.cellsInSeries} cells in series × {b.strings} string{b.strings > 1 ? 's' : ''}, {formatSignificant(b.capacityAh, 4, locale)}
          {UNIT_GAP}Ah — {formatVoltage(b.nominalVoltage, locale)} nominal, {formatEnergy(b.nominalWh, locale)}, usable {formatEnergy(b.usableWh, locale)}; at{' '}
          {formatTemperature(d.temperatureC, units, locale)}.
        </p>
        <dl class="panel-figures">
          <div>
            <dt>Delivered at the terminals</dt>
            <dd data-testid="battery-delivered">
              {formatSignificant(d.deliveredAh, 4, locale)}
              {UNIT_GAP}Ah · {formatEnergy(d.deliveredWh, locale)}
            </dd>
          </div>
          <div>
            <dt>Used by the loads</dt>
            <dd>{formatEnergy(d.loadWh, locale)}</dd>
          </div>
          <div>
            <dt>End state of charge</dt>
            <dd data-testid="battery-end-soc">{formatPercent(d.endSoc, locale, 3)}</dd>
          </div>
          <div>
            <dt>Highest current over the outage (the bank’s cable and fuse carry at least this)</dt>
            <dd data-testid="battery-peak-current">
              {formatCurrent(d.peakCurrent, locale)} <span class="cell-note">limit {formatCurrent(b.maxDischargeCurrent, locale)}</span>
            </dd>
          </div>
          <div>
            <dt>Lowest terminal voltage</dt>
            <dd>
              {formatVoltage(d.minVoltage, locale)} <span class="cell-note" data-testid="battery-cutoff-voltage">cut-off {formatVoltage(d.cutoffVoltage, locale)}</span>
            </dd>
          </div>
          <div>
            <dt>Average load</dt>
            <dd>{formatPower(d.averageLoadW, locale)}</dd>
          </div>
        </dl>
        {d.warnings.length > 0 && (
          <ul class="panel-warnings">
            {d.warnings.map((w) => (
              <li key={w}>{w}</li>
            ))}
          </ul>
        )}
      </section>
      <section class="panel-section" aria-labelledby="battery-derates-heading">
        <h4 id="battery-derates-heading">Why not simply Wh ÷ W</h4>
        <CsvButton name="Battery derates" />
        <div class="table-scroll" role="region" aria-labelledby="battery-derates-heading" tabIndex={0}>
          <table class="data panel-table" data-testid="battery-derates">
            <thead>
              <tr>
                <th scope="col">What</th>
                <th scope="col" class="num">Value</th>
                <th scope="col">Why</th>
              </tr>
            </thead>
            <tbody>
              {d.derates.map((x, i) => (
                <tr key={i}>
                  <th scope="row">{x.label}</th>
                  <td class="num">{derateValue(x, locale, units)}</td>
                  <td>{x.note}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      </section>
      <Plot study={study} locale={locale} />
      <Sizing study={study} locale={locale} />
      <RechargeFigures study={study} locale={locale} />
      <section class="panel-section panel-cautions" aria-labelledby="battery-cautions-heading" data-testid="battery-cautions">
        <h4 id="battery-cautions-heading">Cautions</h4>
        <ul>
          {/* The basis sentence is shown with the runtime and the sizing above. */}
          {cautions
            .filter((c) => c !== d.basis)
            .map((c) => (
              <li key={c}>{c}</li>
            ))}
        </ul>
      </section>
    </>
  );
}
