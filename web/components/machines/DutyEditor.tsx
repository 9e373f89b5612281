/**
 * The duty editor of the machines panel: which pump or fan the duty study is about, its flow levels
 * with hours per year (added and removed here, in the user's units), the system curve and the
 * machine's curve (the element's own fields, written with setField; the table of both curves from
 * core, `dutyCurves`), and the curve from the maker's points (DutyCurveFit.tsx). Everything is written
 * to the project through the engine-checked setField: `pumpDuty` of the file format, whose `pump`
 * names a pump or a fan (core/model/study-settings.ts). The comparison itself is PumpDutyStudy.tsx.
 */
import { FIELD_LABELS, PROJECT_LEVEL, type FanLoad, type Problem, type PumpLoad, type Solved } from '../../../core/page.ts';
import { useState } from 'preact/hooks';
import { dutyCurves, dutyFlowAtSpeed, dutySpeedAtFlow } from '../../../core/studies/index.ts';
import { formatSignificant, formatPercent, UNIT_GAP } from '../../format/number.ts';
import { inputUnit, type Quantity } from '../../format/parse.ts';
import type { UnitSystem } from '../../format/units.ts';
import { messageText } from '../../format/message-text.ts';
import { draft, fieldError, setField, type DraftElement } from '../../state/editor.ts';
import { fieldDomId } from '../../state/field-errors.ts';
import { DutyInput } from './DutyInput.tsx';
import { DutyCurveFit } from './DutyCurveFit.tsx';
import './Duty.css';

interface Props {
  /** The solved pair the panel shows (the curves' table reads its validated element). */
  solved: Solved;
  /** The duty study's refusals from the panel worker (shown at their rows). */
  problems: readonly Problem[];
  units: UnitSystem;
  locale: string | undefined;
}

const isMachine = (e: DraftElement) => e.kind === 'pump' || e.kind === 'fan';
const nameOf = (e: { id: string; name?: string | undefined }) => (e.name && e.name.trim() !== '' ? e.name : e.id);

/** Hours of a (non-leap) year: the duty's hours may add up to at most this (core/physics/pump-fan.ts HOURS_PER_YEAR). */
const YEAR_HOURS = 8760;

export function DutyEditor({ solved, problems, units, locale }: Props) {
  /** Duty levels typed as flows (as stored) or as speeds (converted to flows by the affinity laws in core). */
  const [given, setGiven] = useState<'flow' | 'speed'>('flow');
  const project = draft.value;
  if (!project) return null;
  const machines = project.elements.filter(isMachine);
  if (machines.length === 0) return null;
  const study = project['pumpDuty'] as { pump?: unknown; duty?: { flow?: unknown; hours?: unknown }[] } | undefined;
  const chosen = typeof study?.pump === 'string' ? machines.find((m) => m.id === study.pump) : undefined;
  const rows = Array.isArray(study?.duty) ? study.duty : [];
  const fan = chosen?.kind === 'fan';
  const flowQ: Quantity = fan ? 'air-flow' : 'flow';
  const messageAt = (field: string) => {
    const found = problems.filter((p) => p.field === field);
    return found.length ? found.map((p) => messageText(p, units, locale)).join('; ') : undefined;
  };

  const choose = (id: string) => {
    if (id === '') {
      setField(PROJECT_LEVEL, 'pumpDuty', undefined, 'Duty study: removed');
      return;
    }
    if (study) {
      setField(PROJECT_LEVEL, 'pumpDuty.pump', id, 'Duty study: pump or fan');
      return;
    }
    // A new study starts with one point: the machine's own operating flow, no hours yet.
    const m = machines.find((x) => x.id === id)!;
    const flow = typeof m['flow'] === 'number' ? m['flow'] : typeof m['ratedFlow'] === 'number' ? m['ratedFlow'] : 0;
    setField(PROJECT_LEVEL, 'pumpDuty', { pump: id, duty: [{ flow, hours: 0 }] }, 'Duty study: pump or fan');
  };
  const addRow = () => {
    const last = rows.at(-1);
    const flow = typeof last?.flow === 'number' ? last.flow : typeof chosen?.['flow'] === 'number' ? chosen['flow'] : 0;
    setField(PROJECT_LEVEL, 'pumpDuty.duty', [...rows, { flow, hours: 0 }], 'Duty study: duty point added');
  };
  const removeRow = (i: number) => setField(PROJECT_LEVEL, 'pumpDuty.duty', rows.filter((_, j) => j !== i), 'Duty study: duty point removed');
  const hours = rows.reduce((s, r) => s + (typeof r.hours === 'number' ? r.hours : 0), 0);
  const selectError = fieldError(PROJECT_LEVEL, 'pumpDuty.pump') ?? fieldError(PROJECT_LEVEL, 'pumpDuty') ?? messageAt('pumpDuty.pump');
  const totalError = fieldError(PROJECT_LEVEL, 'pumpDuty.duty') ?? messageAt('pumpDuty.duty');
  const selectId = fieldDomId(PROJECT_LEVEL, 'pumpDuty.pump');
  // The element as the last valid solve has it (validated), for the table of the two curves.
  const solvedMachine = chosen ? solved.project.elements.find((e) => e.id === chosen.id) : undefined;
  const curveElement = solvedMachine && (solvedMachine.kind === 'pump' || solvedMachine.kind === 'fan') ? solvedMachine : undefined;
  const bySpeed = given === 'speed' && curveElement !== undefined;
  const speedConvert = curveElement
    ? {
        toStored: (speed: number) => {
          const out = dutyFlowAtSpeed(curveElement, speed);
          return out.ok ? { ok: true as const, value: out.flow } : out;
        },
        fromStored: (flow: number) => dutySpeedAtFlow(curveElement, flow),
      }
    : undefined;

  return (
    <section class="panel-section duty-editor" aria-labelledby="duty-editor-heading" data-testid="duty-editor">
      <h4 id="duty-editor-heading">Duty study: flow levels over a year</h4>
      <div class={selectError ? 'study-field study-field--error duty-machine' : 'study-field duty-machine'}>
        <label for={selectId} class="study-field__label">
          {FIELD_LABELS.project['pumpDuty.pump']}
        </label>
        <select
          id={selectId}
          class="study-field__input"
          value={chosen?.id ?? ''}
          onChange={(e) => choose((e.currentTarget as HTMLSelectElement).value)}
          aria-invalid={selectError ? 'true' : undefined}
          aria-describedby={selectError ? `${selectId}-error` : undefined}
          data-testid="duty-machine"
        >
          <option value="">No duty study</option>
          {machines.map((m) => (
            <option key={m.id} value={m.id}>
              {nameOf(m)} ({m.kind === 'fan' ? 'fan' : 'pump'})
            </option>
          ))}
        </select>
        {selectError && (
          <span id={`${selectId}-error`} class="study-field__error" role="alert">
            {selectError}
          </span>
        )}
      </div>
      {chosen && (
        <>
          <h5 class="duty-subheading">Duty points: flow and hours a year</h5>
          {curveElement && (
            <div class="study-field duty-given">
              <label for="duty-given" class="study-field__label">
                Duty levels given as
              </label>
              <select id="duty-given" class="study-field__input" value={given} onChange={(e) => setGiven((e.currentTarget as HTMLSelectElement).value === 'speed' ? 'speed' : 'flow')} data-testid="duty-given">
                <option value="flow">Flow</option>
                <option value="speed">Speed of the drive (% of full speed)</option>
              </select>
            </div>
          )}
          <ol class="duty-rows" data-testid="duty-rows">
            {rows.map((_, i) => (
              <li key={i} class="duty-row" aria-label={`Duty point ${i + 1}`} data-testid="duty-row">
                <DutyInput
                  key={bySpeed ? 'speed' : 'flow'}
                  owner={PROJECT_LEVEL}
                  path={`pumpDuty.duty.${i}.flow`}
                  label={bySpeed ? 'Speed' : fan ? 'Air flow' : 'Flow'}
                  quantity={bySpeed ? 'fraction-percent' : flowQ}
                  units={units}
                  locale={locale}
                  testId={bySpeed ? `duty-speed-${i}` : `duty-flow-${i}`}
                  undoLabel={`Duty point ${i + 1}: ${bySpeed ? 'speed' : 'flow'}`}
                  studyMessage={messageAt(`pumpDuty.duty.${i}.flow`)}
                  convert={bySpeed ? speedConvert : undefined}
                />
                <DutyInput
                  owner={PROJECT_LEVEL}
                  path={`pumpDuty.duty.${i}.hours`}
                  label="Hours a year"
                  quantity="time"
                  units={units}
                  locale={locale}
                  testId={`duty-hours-${i}`}
                  undoLabel={`Duty point ${i + 1}: hours`}
                  studyMessage={messageAt(`pumpDuty.duty.${i}.hours`)}
                />
                {rows.length > 1 && (
                  <button type="button" class="panel-button duty-row__remove" onClick={() => removeRow(i)} aria-label={`Remove duty point ${i + 1}`} data-testid={`duty-remove-${i}`}>
                    Remove
                  </button>
                )}
              </li>
            ))}
          </ol>
          <div class="duty-actions">
            <button type="button" class="panel-button" onClick={addRow} data-testid="duty-add">
              Add a duty point
            </button>
            <span class="note" data-testid="duty-hours-total">
              {formatSignificant(hours, 5, locale)}
              {UNIT_GAP}h of the {formatSignificant(YEAR_HOURS, 5, locale)}
              {UNIT_GAP}h of a year; the rest the {fan ? 'fan' : 'pump'} stands still.
            </span>
          </div>
          {totalError && (
            <p class="study-field__error" role="alert">
              {totalError}
            </p>
          )}
          <MachineCurves element={chosen} units={units} locale={locale} />
          {curveElement && <CurveTable element={curveElement} units={units} locale={locale} />}
          {curveElement && <DutyCurveFit key={curveElement.id} element={curveElement} units={units} locale={locale} />}
        </>
      )}
    </section>
  );
}

/** The element's own curve fields, written to the element (the same fields as its form). */
function MachineCurves({ element, units, locale }: { element: DraftElement; units: UnitSystem; locale: string | undefined }) {
  const fan = element.kind === 'fan';
  const labels = FIELD_LABELS[fan ? 'fan' : 'pump'];
  const common = { owner: element.id, units, locale };
  const name = nameOf(element);
  const field = (path: string, quantity: Quantity) => (
    <DutyInput {...common} path={path} label={labels[path]!} quantity={quantity} testId={`duty-${path}`} undoLabel={`${name}: ${labels[path]!.toLowerCase()}`} />
  );
  return (
    <fieldset class="study-settings duty-curve-fields" data-testid="duty-curve-fields">
      <legend>{fan ? 'Fan and duct system' : 'Pump and system curve'}</legend>
      {fan ? (
        <>
          {field('ratedFlow', 'air-flow')}
          {field('ratedPressure', 'pressure')}
          {field('shutoffPressure', 'pressure')}
          <p class="note duty-curve-note">No static pressure: the ducts need a pressure that rises with the square of the flow, through the rated point.</p>
        </>
      ) : (
        <>
          {field('staticHead', 'head')}
          {field('ratedFlow', 'flow')}
          {field('ratedHead', 'head')}
          {field('shutoffHead', 'head')}
          <p class="note duty-curve-note">System curve: the static head plus a part that rises with the square of the flow, through the rated point.</p>
        </>
      )}
    </fieldset>
  );
}

/** Both curves at 0–100 % of the rated flow, from core (`dutyCurves`), in the user's units. */
function CurveTable({ element, units, locale }: { element: PumpLoad | FanLoad; units: UnitSystem; locale: string | undefined }) {
  const c = dutyCurves(element);
  const fan = c.machine === 'fan';
  const flowUnit = inputUnit(fan ? 'air-flow' : 'flow', units);
  const valueUnit = inputUnit(fan ? 'pressure' : 'head', units);
  const show = (si: number, unit: typeof flowUnit) => `${formatSignificant(unit.fromSi(si), 3, locale)}${UNIT_GAP}${unit.symbol}`;
  return (
    <div class="table-scroll" role="region" aria-labelledby="duty-curves-caption" tabIndex={0}>
      <table class="data panel-table" data-testid="duty-curve-table">
        <caption id="duty-curves-caption">{fan ? 'Pressure the ducts need and the fan gives at full speed' : 'Head the system needs and the pump gives at full speed'}</caption>
        <thead>
          <tr>
            <th scope="col">Flow</th>
            <th scope="col" class="num">{fan ? 'Ducts need' : 'System needs'}</th>
            <th scope="col" class="num">{fan ? 'Fan at full speed' : 'Pump at full speed'}</th>
          </tr>
        </thead>
        <tbody>
          {c.rows.map((r) => (
            <tr key={r.fraction}>
              <th scope="row">
                {show(r.flow, flowUnit)} ({formatPercent(r.fraction, locale, 3)})
              </th>
              <td class="num">{show(r.system, valueUnit)}</td>
              <td class="num">{show(r.machine, valueUnit)}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
