/**
 * The pump or fan curve from the maker's points: three or more (flow, head or pressure) points typed
 * in the user's units, fitted in core (least squares of y = y0 − a·Q², core/physics/curve-fit.ts), the
 * fit's residual shown, and the fitted curve written to the element's shut-off and rated fields
 * through the engine-checked setField. The points are not kept in the project (the file keeps the
 * curve as its two fields: core/studies/machines/duty-curves.ts).
 */
import { StudyInput } from '../StudyInput.tsx';
import { useState } from 'preact/hooks';
import type { FanLoad, PumpLoad } from '../../../core/page.ts';
import { curveFromPoints, type CurveFromPoints } from '../../../core/studies/index.ts';
import { formatSignificant, UNIT_GAP } from '../../format/number.ts';
import { inputUnit, readNumberField, type Quantity } from '../../format/parse.ts';
import type { UnitSystem } from '../../format/units.ts';
import { setField } from '../../state/editor.ts';

interface Props {
  element: PumpLoad | FanLoad;
  units: UnitSystem;
  locale: string | undefined;
}

type Row = { flow: string; value: string };

const EMPTY: Row = { flow: '', value: '' };

export function DutyCurveFit({ element, units, locale }: Props) {
  const fan = element.kind === 'fan';
  const flowQ: Quantity = fan ? 'air-flow' : 'flow';
  const valueQ: Quantity = fan ? 'pressure' : 'head';
  const flowUnit = inputUnit(flowQ, units);
  const valueUnit = inputUnit(valueQ, units);
  const valueLabel = fan ? 'Pressure at standard air' : 'Head';
  const [rows, setRows] = useState<Row[]>([EMPTY, EMPTY, EMPTY]);
  const [errors, setErrors] = useState<Map<string, string>>(new Map());
  const [fit, setFit] = useState<CurveFromPoints | null>(null);
  const [applied, setApplied] = useState<string | null>(null);
  const set = (i: number, key: keyof Row, text: string) => {
    setRows(rows.map((r, j) => (j === i ? { ...r, [key]: text } : r)));
    setFit(null);
    setApplied(null);
  };
  const show = (si: number, unit: typeof flowUnit) => `${formatSignificant(unit.fromSi(si), 3, locale)}${unit.symbol ? `${UNIT_GAP}${unit.symbol}` : ''}`;

  const runFit = () => {
    const found = new Map<string, string>();
    const points: { flow: number; value: number }[] = [];
    rows.forEach((r, i) => {
      const f = readNumberField(r.flow, { label: `Flow, point ${i + 1}`, quantity: flowQ, required: true }, units, locale);
      const v = readNumberField(r.value, { label: `${valueLabel}, point ${i + 1}`, quantity: valueQ, required: true }, units, locale);
      if (!f.ok) found.set(`${i}-flow`, f.message);
      if (!v.ok) found.set(`${i}-value`, v.message);
      if (f.ok && v.ok) points.push({ flow: f.value!, value: v.value! });
    });
    setErrors(found);
    setApplied(null);
    if (found.size) {
      setFit(null);
      return;
    }
    const out = curveFromPoints(element, points);
    if (!out.ok && out.index !== undefined && out.field !== undefined) {
      found.set(`${out.index}-${out.field}`, `${out.field === 'flow' ? 'Flow' : valueLabel}, point ${out.index + 1}: ${out.message}`);
      setErrors(new Map(found));
    }
    setFit(out);
  };

  const apply = () => {
    if (!fit?.ok) return;
    for (const w of fit.writes) {
      const refused = setField(element.id, w.path, w.value, `${element.name ?? element.id}: curve from the maker's points`);
      if (refused) {
        setApplied(`Not written: ${refused}`);
        return;
      }
    }
    setApplied('Written to the shut-off and rated fields.');
  };

  const cell = (i: number, key: keyof Row, label: string, unit: string) => {
    const id = `duty-fit-${key}-${i}`;
    const message = errors.get(`${i}-${key}`);
    return (
      <StudyInput
        id={id}
        label={label}
        unit={unit}
        text={rows[i]![key]}
        message={message}
        onText={(text) => set(i, key, text)}
        onLeave={() => {}}
        testId={`duty-fit-${key}-${i}`}
      />
    );
  };

  return (
    <details class="duty-fit" data-testid="duty-fit">
      <summary>Curve from the maker's points</summary>
      <p class="note">
        Three or more points read off the maker's curve at full speed{fan ? ', at standard air (1.2 kg/m³)' : ''}. The curve is fitted by least squares
        and written as the shut-off and rated {fan ? 'pressure' : 'head'} at the rated flow; the points are not kept in the project.
      </p>
      <ol class="duty-rows">
        {rows.map((_, i) => (
          <li key={i} class="duty-row" aria-label={`Curve point ${i + 1}`}>
            {cell(i, 'flow', 'Flow', flowUnit.symbol)}
            {cell(i, 'value', valueLabel, valueUnit.symbol)}
            {rows.length > 3 && (
              <button
                type="button"
                class="panel-button duty-row__remove"
                onClick={() => {
                  setRows(rows.filter((__, j) => j !== i));
                  setFit(null);
                }}
                aria-label={`Remove curve point ${i + 1}`}
              >
                Remove
              </button>
            )}
          </li>
        ))}
      </ol>
      <div class="duty-actions">
        <button type="button" class="panel-button" onClick={() => setRows([...rows, EMPTY])} data-testid="duty-fit-add">
          Add a point
        </button>
        <button type="button" class="panel-button panel-button--primary" onClick={runFit} data-testid="duty-fit-run">
          Fit the curve
        </button>
      </div>
      {fit && !fit.ok && fit.index === undefined && (
        <p class="study-field__error" role="alert" data-testid="duty-fit-error">
          The points: {fit.message}
        </p>
      )}
      {fit?.ok && (
        <div class="duty-fit__result" data-testid="duty-fit-result">
          <p>
            Fitted ({fit.fit.method}): shut-off {show(fit.shutoff, valueUnit)}, {show(fit.rated, valueUnit)} at the rated flow {show(element.ratedFlow, flowUnit)}.
            Residual {show(fit.fit.rmsResidual, valueUnit)} root mean square, largest {show(fit.fit.maxResidual, valueUnit)}.
          </p>
          <button type="button" class="panel-button panel-button--primary" onClick={apply} data-testid="duty-fit-apply">
            Use this curve
          </button>
        </div>
      )}
      {applied && (
        <p class="note" role="status" data-testid="duty-fit-applied">
          {applied}
        </p>
      )}
    </details>
  );
}
