/**
 * The machines panel's card of a fan: its operating point (air flow, pressure, speed, shaft power) and
 * the tree checks, from core (`fanDetails`), formatted in the user's units.
 */
import type { FanDetail } from '../../../core/studies/index.ts';
import { formatPercent, formatSignificant, UNIT_GAP } from '../../format/number.ts';
import { inputUnit } from '../../format/parse.ts';
import { formatShaftPower, type UnitSystem } from '../../format/units.ts';
import type { Locale } from './shared.tsx';

const quantity = (kind: 'air-flow' | 'pressure', si: number, units: UnitSystem, locale: Locale) => {
  const unit = inputUnit(kind, units);
  return `${formatSignificant(unit.fromSi(si), 4, locale)}${UNIT_GAP}${unit.symbol}`;
};

export function FanCard({ f, units, locale }: { f: FanDetail; units: UnitSystem; locale: Locale }) {
  const op = f.operatingPoint;
  return (
    <article class="cond-card" aria-labelledby={`fan-${f.id}`} data-testid="fan-card" data-element-id={f.id}>
      <h5 id={`fan-${f.id}`}>{f.name}</h5>
      <dl class="panel-figures">
        <div>
          <dt>Air flow and pressure</dt>
          <dd>
            {quantity('air-flow', op.flow, units, locale)} at {quantity('pressure', op.pressure, units, locale)}
          </dd>
        </div>
        <div>
          <dt>Control</dt>
          <dd>{op.control === 'speed' ? `speed, ${formatPercent(op.speed, locale, 3)} of full speed` : 'outlet damper at full speed'}</dd>
        </div>
        <div>
          <dt>Shaft power</dt>
          <dd>
            {formatShaftPower(op.shaftPower, units, locale)}
            <span class="cell-note">design point {formatShaftPower(op.designShaftPower, units, locale)}</span>
          </dd>
        </div>
      </dl>
      {f.warnings.length > 0 && (
        <ul class="panel-warnings">
          {f.warnings.map((w) => (
            <li key={w}>{w}</li>
          ))}
        </ul>
      )}
    </article>
  );
}
