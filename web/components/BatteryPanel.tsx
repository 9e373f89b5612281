/**
 * The battery panel: runtime of the bank through the chain, why it is less than Wh ÷ W, the bank
 * for the target runtime, the recharge, a plot of state of charge, voltage and current, and the
 * study's common settings. Loaded on demand (App.tsx imports it when the panel is opened).
 *
 * Every figure comes from core's runBackupStudy() on the last valid solved pair (web/state/solution.ts); this file only formats. The study
 * takes several milliseconds (it solves the chain at every step of the outage), so it runs in the
 * panel worker (panel-worker.ts), off the page's thread, and only the latest draft's reply is
 * shown. When the draft does not give a study the last good figures stay, marked out of date, with
 * the engine's messages.
 */
import { StudyInput } from './StudyInput.tsx';
import { useRef, useState } from 'preact/hooks';
import type { BackupStudyResult } from '../../core/studies/backup/study.ts';
import type { Derate } from '../../core/studies/backup/discharge.ts';
import type { Problem } from '../../core/model/errors.ts';
import { useWorkerReply } from './panel-client.ts';
import {
  formatCurrent,
  formatDuration,
  formatEnergy,
  formatPercent,
  formatPower,
  formatSignificant,
  formatVoltage,
  UNIT_GAP,
} from '../format/number.ts';
import { formatTemperature, type UnitSystem } from '../format/units.ts';
import { inputText, inputUnit, readNumberField, type Quantity } from '../format/parse.ts';
import { effectiveLocale, unitSystem } from '../state/prefs.ts';
import { draft, edit, fieldError, getAt, lastSolved, resultsState, setField, setFieldError, type DraftProject } from '../state/editor.ts';
import { TimeChart, type ChartSeries } from './charts/TimeChart.tsx';
import { problemLine } from './problem-words.ts';
import './Panels.css';

/** Defaults of a new backup study: every load on at its rated power, one day wanted (common practice, no source). */
export const NEW_BACKUP_STUDY = { profile: { kind: 'constant' }, targetRuntimeHours: 24, temperatureC: 25 } as const;

export function addBackupStudy(): void {
  edit('Added a backup study', (p) => {
    p.backup = structuredClone(NEW_BACKUP_STUDY) as unknown as Record<string, unknown>;
  });
}

// ---------- the study settings ----------

interface FieldProps {
  project: DraftProject;
  path: string;
  label: string;
  quantity: Quantity;
  /** Shown when the field is empty (what the engine does without it). */
  hint?: string;
  units: UnitSystem;
  locale: string | undefined;
  testId: string;
}

/**
 * One study setting: a labelled input in the user's units and number format, writing the SI value
 * through the engine-checked setField; its message shows at the field and nothing is stored from it.
 */
function StudyField({ project, path, label, quantity, hint, units, locale, testId }: FieldProps) {
  const [text, setText] = useState<string | null>(null);
  const stored = getAt(project, path);
  const error = fieldError('project', path);
  const id = `study-${path.replace(/\W+/g, '-')}`;
  const unit = inputUnit(quantity, units).symbol;
  const commit = (value: string) => {
    setText(value);
    const read = readNumberField(value, { label, quantity, required: false }, units, locale);
    if (!read.ok) {
      setFieldError('project', path, read.message);
      return;
    }
    setField('project', path, read.value, `Backup study: ${label.toLowerCase()}`);
  };
  return (
    <StudyInput
      id={id}
      label={label}
      unit={unit}
      text={text ?? inputText(stored, quantity, units, locale)}
      placeholder={hint}
      message={error}
      onText={commit}
      onLeave={() => {
        if (!fieldError('project', path)) setText(null);
      }}
      testId={testId}
    />
  );
}

/** Backup or cycling design: where a lead-acid or NiCd discharge ends, and what sizes the bank. */
function DesignChoice({ project }: { project: DraftProject }) {
  const stored = getAt(project, 'backup.design');
  const value = stored === 'cycling' ? 'cycling' : 'backup';
  return (
    <div class="study-field">
      <label for="study-backup-design" class="study-field__label">
        Design
      </label>
      <select
        id="study-backup-design"
        class="study-field__input"
        value={value}
        onChange={(e) => setField('project', 'backup.design', (e.currentTarget as HTMLSelectElement).value, 'Backup study: design')}
        data-testid="battery-design"
      >
        <option value="backup">Backup (to the end voltage)</option>
        <option value="cycling">Cycling (depth-of-discharge limit)</option>
      </select>
    </div>
  );
}

function StudySettings({ project, units, locale }: { project: DraftProject; units: UnitSystem; locale: string | undefined }) {
  const common = { project, units, locale };
  return (
    <fieldset class="study-settings" data-testid="battery-settings">
      <legend>Study settings</legend>
      <DesignChoice project={project} />
      <StudyField {...common} path="backup.targetRuntimeHours" label="Target runtime" quantity="time" hint="none" testId="battery-target-runtime" />
      <StudyField {...common} path="backup.designMargin" label="Design margin" quantity="ratio" hint="1.10" testId="battery-design-margin" />
      <StudyField {...common} path="backup.agingFactor" label="Aging factor" quantity="ratio" hint="1.25" testId="battery-aging-factor" />
      <StudyField {...common} path="backup.temperatureC" label="Cell temperature" quantity="temperature" hint={units === 'us' ? '77' : '25'} testId="battery-temperature" />
      <StudyField {...common} path="backup.stateOfHealth" label="State of health" quantity="fraction-percent" hint="100" testId="battery-soh" />
      <StudyField {...common} path="backup.chargerCurrent" label="Charger current" quantity="current" hint="none" testId="battery-charger" />
      <StudyField {...common} path="backup.targetRechargeHours" label="Target recharge time" quantity="time" hint="none" testId="battery-target-recharge" />
    </fieldset>
  );
}

// ---------- the figures ----------

/** A derate's value in words: a share, a factor, an energy, a time. */
function derateValue(d: Derate, locale: string | undefined, units: UnitSystem): string {
  switch (d.unit) {
    case '':
      return d.label.includes('depth of discharge') ? formatPercent(d.value, locale, 3) : `×${UNIT_GAP}${formatSignificant(d.value, 3, locale)}`;
    case 'Wh':
      return formatEnergy(d.value, locale);
    case 'W':
      return formatPower(d.value, locale);
    case 'h':
      return formatDuration(d.value * 3600, locale);
    case 'A':
      return formatCurrent(d.value, locale);
    case 'V':
      return formatVoltage(d.value, locale);
    case '°C':
      return formatTemperature(d.value, units, locale);
    default:
      return `${formatSignificant(d.value, 4, locale)}${UNIT_GAP}${d.unit}`;
  }
}

const METHOD_WORDS = {
  energy: 'lithium energy method',
  'ieee-485-worksheet': 'IEEE 485 duty-cycle worksheet',
  'ieee-1115-worksheet': 'IEEE 1115 duty-cycle worksheet',
} as const;

function governingWords(g: NonNullable<BackupStudyResult['sizing']>['governing']): string {
  switch (g.kind) {
    case 'section':
      return `worksheet section ${g.section}`;
    case 'energy':
      return 'the energy over the target runtime';
    case 'discharge-rate':
      return 'the maximum discharge rate';
    case 'depth-of-discharge':
      return 'the usable depth of discharge';
  }
}

/** The value of a named step of the working (NaN when the sizing has none). */
function stepOf(s: NonNullable<BackupStudyResult['sizing']>, label: string): number {
  return s.steps.find((x) => x.label === label)?.value ?? Number.NaN;
}

function stepValue(value: number, unit: string, locale: string | undefined): string {
  const n = Number.isInteger(value) ? formatSignificant(value, 12, locale) : formatSignificant(value, 4, locale);
  return unit ? `${n}${UNIT_GAP}${unit}` : n;
}

function Sizing({ study, locale }: { study: BackupStudyResult; locale: string | undefined }) {
  const again = study.sizedDischarge;
  const s = study.sizing;
  if (!s) {
    return (
      <section class="panel-section" aria-labelledby="battery-sizing-heading">
        <h4 id="battery-sizing-heading">Bank for the target runtime</h4>
        <p class="note">Give a target runtime in the study settings to size a bank for it.</p>
      </section>
    );
  }
  const governingSection = s.governing.kind === 'section' ? s.sections.find((x) => x.section === (s.governing as { section: number }).section) : undefined;
  return (
    <section class="panel-section" aria-labelledby="battery-sizing-heading" data-testid="battery-sizing">
      <h4 id="battery-sizing-heading">Bank for the target runtime</h4>
      <p class="panel-headline" data-testid="battery-sizing-result">
        {s.strings} string{s.strings > 1 ? 's' : ''} × {formatSignificant(s.capacityPerString, 4, locale)}
        {UNIT_GAP}Ah = <strong data-testid="battery-sizing-ah">{formatSignificant(s.bankCapacity, 4, locale)}{UNIT_GAP}Ah</strong>, {formatEnergy(s.bankEnergyWh, locale)}
      </p>
      <p class="note">
        Each string: {s.seriesBlocks} {s.cellsPerBlock > 1 ? `${s.cellsPerBlock}-cell blocks` : 'cells'} in series, {formatVoltage(s.nominalVoltage, locale)} nominal.
      </p>
      {again && (
        <p class="panel-headline" data-testid="battery-sized-runtime">
          Runtime of this bank through the chain:{' '}
          <strong>
            {again.runtimeIsLowerBound ? 'longer than ' : ''}
            {formatDuration(again.runtimeSeconds, locale)}
          </strong>{' '}
          — {again.endText}
        </p>
      )}
      <p class="note">
        By the {METHOD_WORDS[s.method]}; the size is set by {governingWords(s.governing)}. Design margin ×{formatSignificant(stepOf(s, 'Design margin'), 3, locale)}, aging factor ×
        {formatSignificant(stepOf(s, 'Aging factor'), 3, locale)}. Duty cycle: {study.sizingBasis}.
      </p>
      <p class="note" data-testid="battery-sizing-basis">
        {s.basis}
      </p>
      <details class="panel-steps">
        <summary>The working, step by step</summary>
        <div class="table-scroll" role="region" aria-label="Sizing steps" tabIndex={0}>
          <table class="data panel-table">
            <thead>
              <tr>
                <th scope="col">Step</th>
                <th scope="col" class="num">Value</th>
                <th scope="col">How</th>
              </tr>
            </thead>
            <tbody>
              {s.steps.map((st, i) => (
                <tr key={i}>
                  <th scope="row">{st.label}</th>
                  <td class="num">{stepValue(st.value, st.unit, locale)}</td>
                  <td>{st.note}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
        {governingSection && (
          <p class="note">
            Worksheet: {s.sections.length} sections; section {governingSection.section} governs with F = {formatSignificant(governingSection.total, 4, locale)}
            {UNIT_GAP}Ah before the temperature, design-margin and aging factors.
          </p>
        )}
      </details>
      {s.warnings.length > 0 && (
        <ul class="panel-warnings">
          {s.warnings.map((w) => (
            <li key={w}>{w}</li>
          ))}
        </ul>
      )}
    </section>
  );
}

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
              <dd>{formatEnergy(r.acInputEnergyWh, locale)}</dd>
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

function StudyFigures({ study, cautions, locale, units }: { study: BackupStudyResult; cautions: string[]; locale: string | undefined; units: UnitSystem }) {
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
            <dt>Peak current</dt>
            <dd>
              {formatCurrent(d.peakCurrent, locale)} <span class="cell-note">limit {formatCurrent(b.maxDischargeCurrent, locale)}</span>
            </dd>
          </div>
          <div>
            <dt>Lowest terminal voltage</dt>
            <dd>
              {formatVoltage(d.minVoltage, locale)} <span class="cell-note">cut-off {formatVoltage(d.cutoffVoltage, locale)}</span>
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

export default function BatteryPanel() {
  const project = draft.value;
  const units = unitSystem.value;
  const locale = effectiveLocale();
  const hasStudy = project !== null && typeof project.backup === 'object' && project.backup !== null;
  // The study runs on the last valid solved pair (the worker never validates or solves it again).
  const solved = lastSolved.value;
  const { reply, pending } = useWorkerReply<'battery'>(() => (solved?.project.backup ? { kind: 'battery', solved } : null), [solved]);
  /** The last study that ran, kept while later drafts give none. */
  const last = useRef<{ study: BackupStudyResult; cautions: string[] } | null>(null);
  if (reply?.kind === 'battery' && reply.outcome.ok) last.current = { study: reply.outcome.study, cautions: reply.outcome.cautions };
  const problems: Problem[] =
    reply?.kind === 'battery' && !reply.outcome.ok
      ? reply.outcome.problems
      : reply?.kind === 'crash'
        ? [{ code: 'invalid-value', elementId: 'project', field: '', message: reply.message }]
        : [];

  if (!project) return null;
  if (!hasStudy) {
    return (
      <div class="panel-body" data-testid="battery-panel" data-state="no-study">
        <p>This project is fed by a battery bank but has no backup study yet: the study gives the runtime through the chain, the bank for a target runtime and the recharge.</p>
        <button type="button" class="panel-button panel-button--primary" onClick={addBackupStudy} data-testid="battery-add-study">
          Add a backup study
        </button>
        <p class="note">It starts with every load on at its rated power, a target of 24 h at 25 °C; change the settings after.</p>
      </div>
    );
  }

  const failed = !pending && problems.length > 0;
  const stale = failed || resultsState.value === 'stale';
  const state = pending ? 'pending' : stale ? 'stale' : 'current';
  const shown = last.current;
  const study = shown?.study ?? null;
  return (
    <div class={stale ? 'panel-body panel-body--stale' : 'panel-body'} data-testid="battery-panel" data-state={state} data-study-ms={reply ? reply.ms.toFixed(2) : ''}>
      <StudySettings project={project} units={units} locale={locale} />
      {failed && (
        <section class="notice notice--error" role="alert" data-testid="battery-problems">
          <p>The study cannot run with these inputs{study ? '; the figures below are the last good ones, out of date' : ''}:</p>
          <ul>
            {problems.map((p, i) => (
              <li key={i}>
                {problemLine(p, project)}
              </li>
            ))}
          </ul>
        </section>
      )}
      {stale && !failed && study && (
        <p class="notice notice--stale" role="status">
          Out of date: the last good study. Fix the inputs marked above to update it.
        </p>
      )}
      {shown ? <StudyFigures study={shown.study} cautions={shown.cautions} locale={locale} units={units} /> : !failed && <p class="note">Working out the discharge…</p>}
    </div>
  );
}
