/**
 * The machines panel's pump or fan duty study: energy per year by drive, throttle (outlet dampers for a
 * fan) and on-off, and what each costs. When the study's inputs cannot be used, their problems are
 * listed and the last valid comparison stays on screen, marked out of date.
 */
import { useRef } from 'preact/hooks';
import type { MachinesFigures } from '../panel-worker.ts';
import { formatEnergy, formatPercent, formatPower, formatSignificant, UNIT_GAP } from '../../format/number.ts';
import { inputUnit } from '../../format/parse.ts';
import type { UnitSystem } from '../../format/units.ts';
import { formatMoney } from '../../format/panels.ts';
import { type Locale, ProblemLines, ScrollTable } from './shared.tsx';
import { CsvButton } from '../report/CsvButton.tsx';

type Shown = Extract<NonNullable<MachinesFigures['pumpDuty']>, { ok: true }>;

export function PumpDuty({ duty, locale, units }: { duty: NonNullable<MachinesFigures['pumpDuty']>; locale: Locale; units: UnitSystem }) {
  /** The last valid comparison, kept on screen (out of date) while the inputs cannot be used. */
  const last = useRef<Shown | null>(null);
  if (duty.ok) last.current = duty;
  const shown = duty.ok ? duty : last.current;
  if (!shown) {
    return (
      <section class="panel-section" aria-labelledby="pump-duty-heading" data-testid="pump-duty-study" data-state="refused">
        <h4 id="pump-duty-heading">Duty study: flow control over a year</h4>
        <ProblemLines problems={duty.ok ? [] : duty.problems} />
      </section>
    );
  }
  const f = shown.result;
  const c = shown.costs ?? null;
  const fan = f.machine === 'fan';
  const rows: { key: string; label: string; energy: number; cost?: number }[] = [
    { key: 'drive', label: 'Drive (speed control)', energy: f.speedControl.energyWh, cost: c?.speedControl },
    { key: 'throttle', label: fan ? 'Outlet dampers' : 'Throttle valve', energy: f.throttle.energyWh, cost: c?.throttle },
    { key: 'on-off', label: 'On-off at the design point', energy: f.onOff.energyWh, cost: c?.onOff },
  ];
  const fixed = fan ? 'outlet dampers' : 'throttling';
  return (
    <section
      class={duty.ok ? 'panel-section' : 'panel-section duty-study--stale'}
      aria-labelledby="pump-duty-heading"
      data-testid="pump-duty-study"
      data-state={duty.ok ? 'current' : 'stale'}
      data-machine={f.machine}
    >
      <h4 id="pump-duty-heading">{fan ? 'Fan duty: flow control over a year' : 'Pump duty: flow control over a year'}</h4>
      {!duty.ok && (
        <>
          <ProblemLines problems={duty.problems} />
          <p class="notice notice--stale" role="status">
            Out of date: this is the comparison of the last valid duty.
          </p>
        </>
      )}
      <CsvButton name={fan ? 'Fan duty' : 'Pump duty'} />
      <p class="note">
        {formatSignificant(f.totalHours, 5, locale)}
        {UNIT_GAP}h a year over {f.points.length} duty points. Method: {f.method}.
      </p>
      <ScrollTable labelledBy="pump-duty-heading">
        <table class="data panel-table" data-testid="pump-duty-table">
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
                <td class="num" data-testid={`pump-duty-energy-${r.key}`}>
                  {formatEnergy(r.energy, locale)}
                </td>
                {c && <td class="num">{formatMoney(r.cost ?? Number.NaN, locale)}</td>}
              </tr>
            ))}
          </tbody>
        </table>
      </ScrollTable>
      <PointsTable points={f.points} fan={fan} units={units} locale={locale} />
      <p class="panel-headline" data-testid="pump-duty-savings">
        The drive saves {formatEnergy(f.savingVsThrottleWh, locale)} a year against {fixed} ({formatPercent(f.savingVsThrottleFraction, locale, 3)})
        {c ? `, ${formatMoney(c.savingVsThrottle, locale)}` : ''}, and {formatEnergy(f.savingVsOnOffWh, locale)} against on-off ({formatPercent(f.savingVsOnOffFraction, locale, 3)})
        {c ? `, ${formatMoney(c.savingVsOnOff, locale)}` : ''}.
      </p>
      {fan ? (
        <p class="note">
          With no static pressure the drive's shaft power follows the cube of the speed: {formatEnergy(f.speedControlShaftEnergyWh, locale)} of shaft energy a year.
        </p>
      ) : (
        <p class="note">
          Shaft energy with the drive on the system curve: {formatEnergy(f.speedControlShaftEnergyWh, locale)}; the bare cube law would say{' '}
          {formatEnergy(f.cubeLawShaftEnergyWh, locale)} — static head keeps the real figure above it, so the cube law oversells the savings.
        </p>
      )}
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

/** Each duty point: the drive's speed and the electrical input of each method there (core's figures). */
function PointsTable({ points, fan, units, locale }: { points: Shown['result']['points']; fan: boolean; units: UnitSystem; locale: Locale }) {
  const flowUnit = inputUnit(fan ? 'air-flow' : 'flow', units);
  return (
    <ScrollTable labelledBy="duty-points-caption" caption="At each duty point: the drive's speed and the input power of each method.">
        <table class="data panel-table" data-testid="duty-points-table">
          <thead>
            <tr>
              <th scope="col">Flow</th>
              <th scope="col" class="num">Hours a year</th>
              <th scope="col" class="num">Drive speed</th>
              <th scope="col" class="num">Drive input</th>
              <th scope="col" class="num">{fan ? 'Dampers input' : 'Throttle input'}</th>
              <th scope="col" class="num">On-off runs</th>
            </tr>
          </thead>
          <tbody>
            {points.map((p, i) => (
              <tr key={i}>
                <th scope="row">
                  {formatSignificant(flowUnit.fromSi(p.flow), 4, locale)}
                  {UNIT_GAP}
                  {flowUnit.symbol}
                </th>
                <td class="num">
                  {formatSignificant(p.hours, 5, locale)}
                  {UNIT_GAP}h
                </td>
                <td class="num" data-testid="duty-point-speed">
                  {formatPercent(p.speedControl.speed, locale, 3)}
                </td>
                <td class="num">{formatPower(p.speedControl.inputPower, locale)}</td>
                <td class="num">{formatPower(p.throttle.inputPower, locale)}</td>
                <td class="num">{formatPercent(p.onOffRunFraction, locale, 3)} of the time</td>
              </tr>
            ))}
          </tbody>
        </table>
    </ScrollTable>
  );
}
