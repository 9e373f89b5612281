/**
 * The conductor panel: for every cable given a `conductor` spec, the size the engine chose and why,
 * the design current and its basis beside the operating current, the ampacity after corrections,
 * the protective device and its rule, the drop by the method's check (and the solved estimate), the loss
 * as heat, the conductor temperature, the working step by step and the caution; then the whole-path
 * drops against their limits. Loaded on demand. The cables table of the results (Results.tsx) keeps
 * the one-line summary of every cable; this panel holds the detail, once.
 *
 * Every figure comes from the engine's result (ConductorResult, PathDrop); this file only formats.
 */
import type { ConductorResult, ConductorStep, ElementResult, GoverningRule, PathDrop, SolveResult } from '../../core/page.ts';
import { formatCurrent, formatPercent, formatPower, formatSignificant, formatVoltage, UNIT_GAP } from '../format/number.ts';
import { formatArea, formatConductorSize, formatLength, formatTemperature, type UnitSystem } from '../format/units.ts';
import { awgWords, formatResistancePerLength } from '../format/panels.ts';
import { effectiveLocale, unitSystem } from '../state/prefs.ts';
import { resultsState } from '../state/editor.ts';
import type { Solved } from '../../core/page.ts';
import { cableLengths } from './Results.tsx';
import './Panels.css';
import { CsvButton } from './report/CsvButton.tsx';

/** The rule that set the size, in a sentence. */
const GOVERNING_SENTENCE: Record<GoverningRule, string> = {
  ampacity: 'Ampacity governs: the smallest size that carries the design current after corrections.',
  'voltage-drop': 'Voltage drop governs: the next smaller size carries the design current but drops more than allowed.',
  protection: 'The protective device governs: the next smaller size carries the design current, but no device rule lets it be protected.',
  'smallest-size': 'The smallest size allowed for this use governs.',
  fixed: 'Size as given in the project; the checks below say whether it passes.',
};

/** Short words for the governing rule (the panel's headline; "voltage drop" is what a user looks for). */
const GOVERNING_SHORT: Record<GoverningRule, string> = {
  ampacity: 'ampacity',
  'voltage-drop': 'voltage drop',
  protection: 'protective device',
  'smallest-size': 'smallest size allowed',
  fixed: 'size as given',
};

const MATERIAL = { copper: 'copper', aluminium: 'aluminium' } as const;

/** The size as chosen, with its cross-section and, in US units, its place among AWG gauges. */
function sizeWords(c: ConductorResult, units: UnitSystem, locale: string | undefined): { size: string; extra: string } {
  const size = `${c.parallelSets > 1 ? `${c.parallelSets} × ` : ''}${formatConductorSize(c.size, c.areaMm2, units, locale)}`;
  if (units !== 'us' || /AWG|kcmil/.test(c.size)) return { size, extra: '' };
  const awg = awgWords(c.areaMm2);
  return { size, extra: awg ? `${awg} by cross-section (${formatArea(c.areaMm2, 'si', locale)})` : '' };
}

function stepValue(step: ConductorStep, units: UnitSystem, locale: string | undefined): string {
  if (typeof step.value === 'string') return step.value;
  switch (step.unit) {
    case '°C':
      return formatTemperature(step.value, units, locale);
    case 'Ω/km':
      return formatResistancePerLength(step.value, units, locale);
    case '':
      return formatSignificant(step.value, 4, locale);
    default:
      return `${formatSignificant(step.value, 4, locale)}${UNIT_GAP}${step.unit}`;
  }
}

function CableCard({ element, length, warnings, units, locale }: { element: ElementResult; length: number | undefined; warnings: string[]; units: UnitSystem; locale: string | undefined }) {
  const c = element.conductor!;
  const { size, extra } = sizeWords(c, units, locale);
  const a = c.ampacity;
  const dropOk = c.drop.checkPercent <= c.drop.limitPercent + 1e-9;
  const ampOk = a.total >= c.designBasis.baseCurrent - 1e-9;
  return (
    <article class="cond-card" aria-labelledby={`cond-${element.id}`} data-testid="conductor-card" data-element-id={element.id}>
      <h4 id={`cond-${element.id}`}>{element.name || element.id}</h4>
      <p class="panel-headline">
        <strong class="panel-big" data-testid="conductor-size">
          {size}
        </strong>{' '}
        <span>
          {MATERIAL[c.material]}, {c.system === 'nec' ? 'NEC' : 'IEC'} tables{length !== undefined ? `, ${formatLength(length, units, locale)} one way` : ''}
        </span>
        {extra && (
          <span class="cell-note" data-testid="conductor-awg">
            {extra}
          </span>
        )}
      </p>
      <p data-testid="conductor-governing" data-governing={c.governing}>
        <span class="cond-tag">{c.auto ? `Set by ${GOVERNING_SHORT[c.governing]}` : 'Size as given'}</span> {GOVERNING_SENTENCE[c.governing]}
      </p>
      <dl class="panel-figures">
        <div>
          <dt>Design current</dt>
          <dd data-testid="conductor-design-current" data-basis={c.designBasis.basis}>
            {formatCurrent(c.designCurrent, locale)}
            <span class="cell-note">
              {c.designBasis.rule}
              {c.designBasis.fallback ? `; the equipment rule could not be used: ${c.designBasis.fallback}` : ''}
            </span>
          </dd>
        </div>
        <div>
          <dt>Operating current</dt>
          <dd data-testid="conductor-operating-current">
            {formatCurrent(c.operatingCurrent, locale)}
            <span class="cell-note">in the solved chain, beside the design current</span>
          </dd>
        </div>
        <div>
          <dt>Ampacity after corrections</dt>
          <dd data-testid="conductor-ampacity">
            {formatCurrent(a.total, locale)} {ampOk ? '' : '— too small'}
            <span class="cell-note">
              table {formatCurrent(a.table, locale)} × ambient {formatSignificant(a.ambientFactor, 3, locale)} × grouping {formatSignificant(a.groupingFactor, 3, locale)}
              {a.terminationLimit !== undefined && a.terminationColumn ? `; ${a.terminationColumn.rating} °C termination column ${formatCurrent(a.terminationLimit, locale)} (${a.terminationColumn.rule})` : ''}
              {c.parallelSets > 1 ? `; ${formatCurrent(a.perSet, locale)} per set` : ''}
            </span>
          </dd>
        </div>
        <div>
          <dt>Protective device</dt>
          <dd data-testid="conductor-device">
            {c.device.rating !== undefined ? formatCurrent(c.device.rating, locale) : 'none in the list fits'}
            <span class="cell-note">
              {c.device.rule ? `${c.device.rule}; ` : ''}
              {c.device.list}
            </span>
          </dd>
        </div>
        <div>
          <dt>Voltage drop</dt>
          <dd data-testid="conductor-drop">
            {formatVoltage(c.drop.checkVolts, locale)} · {formatPercent(c.drop.checkPercent / 100, locale, 3)} {dropOk ? '' : '— over the limit'}
            <span class="cell-note">
              allowed {formatPercent(c.drop.limitPercent / 100, locale, 3)}; {c.drop.checkMethod}. Estimate at the operating temperature (solved chain):{' '}
              {formatVoltage(c.drop.exactVolts, locale)} · {formatPercent(c.drop.exactPercent / 100, locale, 3)}
            </span>
          </dd>
        </div>
        <div>
          <dt>Loss as heat</dt>
          <dd>{formatPower(c.loss, locale)}</dd>
        </div>
        <div>
          <dt>Conductor temperature (estimate)</dt>
          <dd>
            {formatTemperature(c.resistance.operatingTemperature, units, locale)}
            <span class="cell-note">R {formatResistancePerLength(c.resistance.perKm, units, locale)} per conductor</span>
          </dd>
        </div>
      </dl>
      {warnings.length > 0 && (
        <ul class="panel-warnings" data-testid="conductor-warnings">
          {warnings.map((w) => (
            <li key={w}>{w}</li>
          ))}
        </ul>
      )}
      <details class="panel-steps">
        <summary>The working, step by step</summary>
        <ol class="cond-steps" data-testid="conductor-steps">
          {c.steps.map((s, i) => (
            <li key={i}>
              <strong>{s.label}:</strong> {stepValue(s, units, locale)} — {s.note}
            </li>
          ))}
        </ol>
        <p class="note">{c.resistance.method}</p>
        <p class="note">{c.device.note}</p>
      </details>
      <p class="panel-caution" data-testid="conductor-caution">
        {c.caution}
      </p>
    </article>
  );
}

function PathDrops({ result, locale }: { result: SolveResult; locale: string | undefined }) {
  const paths = (result.voltageDrop ?? []).filter((p) => p.links.length > 0);
  if (paths.length === 0) return null;
  const names = new Map(result.elements.map((e) => [e.id, e.name || e.id]));
  const name = (id: string) => names.get(id) ?? id;
  const bases = [...new Set(paths.map((p) => p.limitBasis))];
  const limit = (p: PathDrop) =>
    `${p.perLinkLimitPercent !== undefined ? `${formatPercent(p.perLinkLimitPercent / 100, locale, 3)} per link, ` : ''}${formatPercent(p.totalLimitPercent / 100, locale, 3)} total`;
  return (
    <section class="panel-section" aria-labelledby="path-drops-heading">
      <h4 id="path-drops-heading">Voltage drop along each path</h4>
      <CsvButton name="Voltage drop along each path" />
      <div class="table-scroll" role="region" aria-labelledby="path-drops-heading" tabIndex={0}>
        <table class="data panel-table" data-testid="path-drops">
          <thead>
            <tr>
              <th scope="col">To</th>
              <th scope="col">From</th>
              <th scope="col">Cables</th>
              <th scope="col" class="num">Total drop</th>
              <th scope="col">Limit</th>
              <th scope="col">Status</th>
            </tr>
          </thead>
          <tbody>
            {paths.map((p) => (
              <tr key={`${p.startId}-${p.loadId}`} data-load-id={p.loadId}>
                <th scope="row">{name(p.loadId)}</th>
                <td>{name(p.startId)}</td>
                <td>
                  {p.links.map((l) => `${name(l.id)} ${formatPercent(l.dropPercent / 100, locale, 3)}${l.exceedsLimit ? ' (over)' : ''}`).join('; ')}
                </td>
                <td class="num">{formatPercent(p.totalPercent / 100, locale, 3)}</td>
                <td>{limit(p)}</td>
                <td>{p.exceedsLimit ? <strong class="cond-over">over the limit</strong> : 'within'}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      <p class="note">
        A path starts at the source or at the nearest converter that regulates its output (it sets the voltage afresh). Limits: {bases.join('; ')}.
      </p>
    </section>
  );
}

/** The conductor cards of the last valid solved pair: sizes from its result, lengths from its project. */
export default function ConductorPanel({ solved }: { solved: Solved }) {
  const units = unitSystem.value;
  const locale = effectiveLocale();
  const stale = resultsState.value === 'stale';
  const result = solved.result;
  const lengths = cableLengths(solved.project);
  const cables = result.elements.filter((e) => e.kind === 'cable' && e.conductor);
  const warningsOf = (id: string) => result.warnings.filter((w) => w.elementId === id).map((w) => w.message);
  return (
    <div class={stale ? 'panel-body panel-body--stale' : 'panel-body'} data-testid="conductor-panel" data-state={stale ? 'stale' : 'current'}>
      {stale && (
        <p class="notice notice--stale" role="status">
          Out of date: these are the sizes of the last valid inputs.
        </p>
      )}
      {cables.length === 0 && <p class="note">No cable in this project has a conductor to size (give a cable a conductor to see it here).</p>}
      <div class="cond-cards">
        {cables.map((e) => (
          <CableCard key={e.id} element={e} length={lengths.get(e.id)} warnings={warningsOf(e.id)} units={units} locale={locale} />
        ))}
      </div>
      <PathDrops result={result} locale={locale} />
    </div>
  );
}
