/**
 * The machines panel's cards: each motor (load, efficiency and power factor at the operating point, the NEC
 * Table 430.250 current), drive (operating point, losses, true power factor) and pump (operating point).
 */
import type { DriveDetail, MotorDetail, PumpDetail } from '../../../core/studies/index.ts';
import { formatCurrent, formatPercent, formatPower, formatSignificant, formatVoltage, UNIT_GAP } from '../../format/number.ts';
import { fromSi, inputUnit } from '../../format/parse.ts';
import { formatShaftPower, type UnitSystem } from '../../format/units.ts';
import type { Locale } from './shared.tsx';

const quantity = (kind: 'flow' | 'head', si: number, units: UnitSystem, locale: Locale) =>
  `${formatSignificant(fromSi(kind, units, si), 4, locale)}${UNIT_GAP}${inputUnit(kind, units).symbol}`;

export function MotorCard({ m, locale }: { m: MotorDetail; locale: Locale }) {
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

export function DriveCard({ d, locale }: { d: DriveDetail; locale: Locale }) {
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

export function PumpCard({ p, units, locale }: { p: PumpDetail; units: UnitSystem; locale: Locale }) {
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
