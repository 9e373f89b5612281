/**
 * The "Runtime spread" panel (issue 20 point 3): the tolerances of the inputs that matter, each with
 * its typical value and why (kept in the project's `spread` settings, written through the
 * engine-checked setField), samples and seed, Run and Cancel, a progress bar, then runtime, the bank
 * for the target and the yearly cost of the losses as P10/P50/P90, the runtime histogram and which
 * input moves the runtime most. Every figure comes from core (core/studies/spread/) run in the
 * spread's own workers (spread-worker.ts, one per core up to four, spread-client.ts) on the last valid
 * solved pair; this file only lays out. With an energy price the yearly cost of the losses gets the same
 * as the runtime (histogram, which input moves it most); the bank for the target gets a histogram.
 *
 * A panel of its own (not inside the battery panel): a run takes seconds and is asked for, not run on
 * every edit as the battery study is, and its settings are many; kept apart, the battery panel stays
 * as light as it was and the spread's code loads only when this panel opens.
 */
import { useEffect, useRef, useState } from 'preact/hooks';
import { DEFAULT_SPREAD_SAMPLES, DEFAULT_SPREAD_SEED, SPREAD_INPUTS, TOLERANCE_FIELD, TYPICAL_TOLERANCES, TYPICAL_WHY, type Percentiles, type SpreadInput, type SpreadResult } from '../../../core/studies/index.ts';
import type { Problem, Solved, SpreadSettings } from '../../../core/page.ts';
import { draft, lastSolved } from '../../state/editor.ts';
import { costInForce, effectiveLocale, unitSystem } from '../../state/prefs.ts';
import { formatSignificant } from '../../format/number.ts';
import { formatMoney } from '../../format/panels.ts';
import { fromSi, inputUnit, type Quantity } from '../../format/parse.ts';
import type { UnitSystem } from '../../format/units.ts';
import { SettingField } from '../SettingField.tsx';
import { problemLine } from '../problem-words.ts';
import { cancelSpread, dropSpread, startSpread } from './spread-client.ts';
import { Histogram } from './Histogram.tsx';
import { Sensitivity } from './Sensitivity.tsx';
import '../Panels.css';
import './spread.css';

/**
 * Each tolerance's form: label (core/model/field-labels.ts words), quantity, unit shown, typical
 * value and why. The temperature's ± is a difference: in US units °F by × 9/5, no offset.
 */
function fieldsOf(units: UnitSystem, locale: string | undefined): Record<SpreadInput, { label: string; quantity: Quantity; unit: string; placeholder: string; why: string }> {
  const deg = inputUnit('temperature-difference', units).symbol;
  const typicalT = formatSignificant(fromSi('temperature-difference', units, TYPICAL_TOLERANCES.temperature), 3, locale);
  const f = (label: string, quantity: Quantity, unit: string, input: SpreadInput) => ({ label, quantity, unit, placeholder: String(TYPICAL_TOLERANCES[input]), why: TYPICAL_WHY[input] });
  return {
    capacity: f('Capacity tolerance (± %)', 'percent', '± %', 'capacity'),
    aging: f('Capacity lost to aging (up to %)', 'percent', '%', 'aging'),
    temperature: {
      label: `Cell temperature range (± ${deg})`,
      quantity: 'temperature-difference',
      unit: `± ${deg}`,
      placeholder: typicalT,
      why: units === 'us' ? `± ${typicalT} °F typical value: the room's swing over the outages; use your site's figure.` : TYPICAL_WHY.temperature,
    },
    efficiency: f('Converter efficiency (± points)', 'ratio', '± points', 'efficiency'),
    load: f('Load levels (± %)', 'percent', '± %', 'load'),
    endVoltage: f('End voltage per cell (± V)', 'voltage', '± V', 'endVoltage'),
  };
}

type RunState =
  | { kind: 'idle' }
  | { kind: 'running'; id: number; done: number; total: number; seed: number | null; workers: number | null }
  | { kind: 'done'; result: SpreadResult; ms: number; solved: Solved }
  | { kind: 'cancelled'; done: number; total: number }
  | { kind: 'refused'; problems: Problem[] };

function Triple({ label, p, format, testId }: { label: string; p: Percentiles | null; format: (v: number) => string; testId: string }) {
  return (
    <tr data-testid={testId}>
      <th scope="row">{label}</th>
      {p ? (
        <>
          <td data-value={p.p10}>{format(p.p10)}</td>
          <td data-value={p.p50} data-testid={`${testId}-p50`}>
            {format(p.p50)}
          </td>
          <td data-value={p.p90}>{format(p.p90)}</td>
        </>
      ) : (
        <td colSpan={3}>no figure</td>
      )}
    </tr>
  );
}

export default function SpreadPanel() {
  const project = draft.value;
  const solved = lastSolved.value;
  const units = unitSystem.value;
  const locale = effectiveLocale();
  const [state, setState] = useState<RunState>({ kind: 'idle' });
  const running = useRef<number | null>(null);
  // The panel closed while a run goes on: stop it.
  useEffect(() => () => {
    if (running.current !== null) dropSpread(running.current);
  }, []);
  if (!project || !solved) return null;
  const settings: SpreadSettings = solved.project.spread ?? {};
  const h = (v: number) => `${formatSignificant(v, 3, locale)} h`;
  const ah = (v: number) => `${formatSignificant(v, 4, locale)} Ah`;
  const money = (v: number) => formatMoney(v, locale);
  const FIELDS = fieldsOf(units, locale);

  const run = () => {
    const cost = costInForce(solved.project);
    const id = startSpread({ solved, settings, cost }, (reply) => {
      if (reply.kind === 'started') setState((s) => ({ kind: 'running', id: reply.id, done: s.kind === 'running' ? s.done : 0, total: reply.samples, seed: reply.seed, workers: reply.workers }));
      else if (reply.kind === 'progress') setState((s) => (s.kind === 'running' ? { ...s, done: reply.done, total: reply.total } : s));
      else {
        running.current = null;
        if (reply.kind === 'done') setState({ kind: 'done', result: reply.result, ms: reply.ms, solved });
        else if (reply.kind === 'cancelled') setState((s) => ({ kind: 'cancelled', done: reply.done, total: s.kind === 'running' ? s.total : reply.done }));
        else setState({ kind: 'refused', problems: reply.problems });
      }
    });
    running.current = id;
    setState({ kind: 'running', id, done: 0, total: settings.samples ?? DEFAULT_SPREAD_SAMPLES, seed: settings.seed ?? DEFAULT_SPREAD_SEED, workers: null });
  };
  const common = { project, units, locale };
  const result = state.kind === 'done' ? state.result : null;
  const outOfDate = state.kind === 'done' && state.solved !== solved;
  return (
    <div class="panel-body spread-panel" data-testid="spread-panel" data-state={state.kind}>
      <p class="note">
        How sure is the runtime? Each sample changes the inputs below within their tolerances, solves the chain again and runs the battery study; the spread of the
        answers shows what the single figure hides.
      </p>
      <fieldset class="study-settings" data-testid="spread-settings">
        <legend>Tolerances</legend>
        {SPREAD_INPUTS.map((input) => (
          <SettingField
            key={input}
            {...common}
            path={`spread.${TOLERANCE_FIELD[input]}`}
            label={FIELDS[input].label}
            quantity={FIELDS[input].quantity}
            unit={FIELDS[input].unit}
            placeholder={FIELDS[input].placeholder}
            help={`${FIELDS[input].why} 0 holds it at the project's value.`}
            undoLabel={`Runtime spread: ${FIELDS[input].label.toLowerCase()}`}
            testId={`spread-${input}`}
          />
        ))}
        <SettingField {...common} path="spread.samples" label="Samples" quantity="count" placeholder={String(DEFAULT_SPREAD_SAMPLES)} help="More samples, steadier percentiles; 1000 is usual. Empty: 1000." undoLabel="Runtime spread: samples" testId="spread-samples" />
        <SettingField {...common} path="spread.seed" label="Seed" quantity="count" placeholder={String(DEFAULT_SPREAD_SEED)} help="The same seed and samples give the same figures; change it to draw other samples. Empty: 1." undoLabel="Runtime spread: seed" testId="spread-seed" />
      </fieldset>
      <div class="spread-actions">
        <button type="button" class="panel-button panel-button--primary" onClick={run} disabled={state.kind === 'running'} data-testid="spread-run">
          Run
        </button>
        <button type="button" class="panel-button" onClick={() => state.kind === 'running' && cancelSpread(state.id)} disabled={state.kind !== 'running'} data-testid="spread-cancel">
          Cancel
        </button>
      </div>
      {state.kind === 'running' && (
        <div class="spread-progress" data-testid="spread-progress">
          <div
            class="spread-progress__bar"
            role="progressbar"
            aria-label="Samples run"
            aria-valuemin={0}
            aria-valuemax={state.total}
            aria-valuenow={state.done}
            aria-valuetext={`${state.done} of ${state.total} samples`}
          >
            <div class="spread-progress__fill" style={{ width: `${(100 * state.done) / Math.max(1, state.total)}%` }} />
          </div>
          <p class="note" role="status">
            {state.done} of {state.total} samples{state.seed !== null ? `, seed ${state.seed}` : ''}{state.workers !== null && state.workers > 1 ? ` (${state.workers} workers at once)` : ''}
          </p>
        </div>
      )}
      {state.kind === 'cancelled' && (
        <p class="notice notice--stale" role="status" data-testid="spread-cancelled">
          Cancelled after {state.done} of {state.total} samples: no figures. Run again for the whole spread.
        </p>
      )}
      {state.kind === 'refused' && (
        <section class="notice notice--error" role="alert" data-testid="spread-problems">
          <p>The spread cannot run with these inputs:</p>
          <ul>
            {state.problems.map((p, i) => (
              <li key={i}>{problemLine(p, project)}</li>
            ))}
          </ul>
        </section>
      )}
      {result && (
        <section class="panel-section" aria-labelledby="spread-result-heading" data-testid="spread-result" data-ms={state.kind === 'done' ? state.ms.toFixed(0) : ''}>
          <h4 id="spread-result-heading">
            {result.samples} samples, seed <span data-testid="spread-seed-shown">{result.seed}</span>
          </h4>
          {outOfDate && (
            <p class="notice notice--stale" role="status">
              Out of date: the project changed since this run. Run again to update it.
            </p>
          )}
          <p class="panel-headline">
            Single run (the project as given): <strong>{result.single.lowerBound ? `longer than ${h(result.single.runtimeH)}` : h(result.single.runtimeH)}</strong>
          </p>
          <div class="table-scroll">
            <table class="data" data-testid="spread-table">
              <thead>
                <tr>
                  <th scope="col">Figure</th>
                  <th scope="col">P10</th>
                  <th scope="col">P50</th>
                  <th scope="col">P90</th>
                </tr>
              </thead>
              <tbody>
                <Triple label="Runtime" p={result.runtimeH} format={h} testId="spread-runtime" />
                {result.targetHours !== undefined && <Triple label={`Bank for ${h(result.targetHours)} (whole strings)`} p={result.bankAh} format={ah} testId="spread-bank" />}
                {result.targetHours !== undefined && <Triple label={`Capacity ${h(result.targetHours)} needs (before whole strings)`} p={result.requiredAh} format={ah} testId="spread-required" />}
                {result.costPerYear && <Triple label="Yearly cost of the losses" p={result.costPerYear} format={money} testId="spread-cost" />}
              </tbody>
            </table>
          </div>
          <p class="note">
            Runtime: P10, one sample in ten runs shorter; P90, one in ten runs longer.{result.targetHours !== undefined ? ' Bank and capacity needed: P90, one sample in ten needs more.' : ''}{result.costPerYear ? ' Cost: P90, one sample in ten costs more a year.' : ''}
          </p>
          {!result.costPerYear && (
            <p class="note" data-testid="spread-no-cost">
              No cost figures or cost charts: this project has no energy price per kWh. Give one in the running cost panel for the yearly cost of the losses, its histogram and which input moves it most.
            </p>
          )}
          {result.lowerBoundCount > 0 && <p class="note">{result.lowerBoundCount} samples outlasted the study length: their runtime is longer than counted.</p>}
          {result.failed > 0 && (
            <p class="notice notice--stale">
              {result.failed === 1 ? 'One sample could not be run and is left out' : `${result.failed} samples could not be run and are left out`}, e.g. {result.failures[0]!.message}
            </p>
          )}
          {result.runtimeH && (
            <>
              <h4>How the runtime spreads</h4>
              <Histogram bins={result.histogram} p={result.runtimeH} format={h} name="Runtime" testId="spread-histogram" />
            </>
          )}
          {result.targetHours !== undefined && result.requiredAh && result.requiredHistogram && (
            <>
              <h4>How the capacity {h(result.targetHours)} needs spreads</h4>
              <Histogram bins={result.requiredHistogram} p={result.requiredAh} format={ah} name="Capacity needed" testId="spread-required-histogram" />
              <p class="note">The capacity the battery study works out for the target, before it is rounded up to whole strings (each string the bank's capacity in that sample, or a standard rating when the study lists them): the bank row above is that rounding, so it moves in steps.</p>
            </>
          )}
          {result.sensitivity.length > 0 && (
            <>
              <h4>Which input moves the runtime most</h4>
              <p class="note">Each input at the low and the high end of its tolerance, the others as given; the line is the single run.</p>
              <Sensitivity swings={result.sensitivity} single={result.single} value={(f) => f.runtimeH} swing={(w) => w.runtimeSwingH} format={h} testId="spread-sensitivity" />
            </>
          )}
          {result.costPerYear && result.costHistogram && (
            <>
              <h4>How the yearly cost of the losses spreads</h4>
              <Histogram bins={result.costHistogram} p={result.costPerYear} format={money} name="Yearly cost" testId="spread-cost-histogram" />
            </>
          )}
          {result.costSensitivity && result.costSensitivity.length > 0 && (
            <>
              <h4>Which input moves the yearly cost most</h4>
              <p class="note">The same runs, ranked by the swing in the yearly cost of the losses; the line is the single run.</p>
              <Sensitivity swings={result.costSensitivity} single={result.single} value={(f) => f.costPerYear} swing={(w) => w.costSwing} format={money} testId="spread-cost-sensitivity" />
            </>
          )}
          <p class="note">
            Method: Monte Carlo, each input drawn evenly within its tolerance; percentiles between ranked samples. Worked out in {formatSignificant(state.kind === 'done' ? state.ms / 1000 : 0, 2, locale)} s.
          </p>
        </section>
      )}
      <section class="panel-section panel-cautions" aria-labelledby="spread-cautions-heading">
        <h4 id="spread-cautions-heading">Cautions</h4>
        <ul>
          <li>Planning estimates: the spread comes from the tolerances entered, not from tests of your bank. Tolerances left empty take a typical value: use the maker's figure.</li>
          <li>Size the bank from the runtime's P10 or from the bank row's P90 (the bigger bank), not from the middle; a bank's capacity falls with age and cold.</li>
          <li>Local codes and licensed practice govern the bank, its protection (a fuse close to the bank for its fault current) and its ventilation.</li>
        </ul>
      </section>
    </div>
  );
}
