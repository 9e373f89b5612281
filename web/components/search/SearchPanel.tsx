/**
 * "Find the option" (issue 20 point 4): the target (runtime, drops within their limits, starts, an
 * optional loss limit) and the candidates the user ticks — the system voltage (12 / 24 / 48 V, when the
 * chain has a DC system bank with its cells), strings in the bank (1–4), conductor sizes
 * of each sized cable (the cable's own table), inverters (the editor's template at typical
 * efficiencies) — kept in the project (`optionSearch`, through setField), searched in a worker of its
 * own with progress and a stop button, then the short list of options that meet the target (none
 * cheaper with lower losses), the rejected grouped with their reasons, and "Keep as a variant" per
 * option (the project's `variants`). Every figure is core's (searchOptions); this file only formats.
 * Loaded on demand when its panel is opened (PanelShelf.tsx). Its parts: SearchCandidates.tsx (the
 * candidates form), SearchResults.tsx (the list, the rejected, "Keep as a variant"), SearchNumberInput.tsx.
 */
import { useEffect, useRef, useState } from 'preact/hooks';
import { PROJECT_LEVEL, type OptionSearch, type Problem, type ProjectVariant, type Solved } from '../../../core/page.ts';
import { SEARCH_CAUTION, type SearchResult } from '../../../core/studies/index.ts';
import { formatSignificant } from '../../format/number.ts';
import { effectiveLocale } from '../../state/prefs.ts';
import { draft, setField } from '../../state/editor.ts';
import { problemLine } from '../problem-words.ts';
import { startSearch, type SearchRunHandle } from './search-run.ts';
import { Candidates } from './SearchCandidates.tsx';
import { NumberInput } from './SearchNumberInput.tsx';
import { Results } from './SearchResults.tsx';
import '../Panels.css';
import './Search.css';

/** The settings the panel starts from: the project's own, or the bank's 1–2 strings and nothing else ticked. */
function startingSettings(saved: OptionSearch | undefined): OptionSearch {
  return saved ? structuredClone(saved) : {};
}

function withoutEmpty(s: OptionSearch): OptionSearch {
  const out: OptionSearch = { ...s };
  if (out.systemVoltages && out.systemVoltages.length === 0) delete out.systemVoltages;
  if (out.strings && out.strings.counts.length === 0) delete out.strings;
  if (out.cables) {
    out.cables = out.cables.filter((c) => (c.sizes ?? []).length > 0);
    if (out.cables.length === 0) delete out.cables;
  }
  if (out.inverters) {
    out.inverters = out.inverters.filter((i) => i.alternatives.length > 0);
    if (out.inverters.length === 0) delete out.inverters;
  }
  return out;
}

function combinationsOf(s: OptionSearch): number {
  // Σ over the system voltages of the other axes' product (the same lists at every voltage): voltages × product.
  let n = s.systemVoltages && s.systemVoltages.length ? s.systemVoltages.length : 1;
  if (s.strings && s.strings.counts.length) n *= s.strings.counts.length;
  for (const c of s.cables ?? []) if ((c.sizes ?? []).length) n *= c.sizes!.length;
  for (const i of s.inverters ?? []) if (i.alternatives.length) n *= i.alternatives.length + (i.keepCurrent === false ? 0 : 1);
  return n;
}

type RunState =
  | { kind: 'idle' }
  | { kind: 'running'; done: number; total: number }
  | { kind: 'done'; search: SearchResult; ms: number }
  | { kind: 'problems'; problems: Problem[] }
  | { kind: 'failed'; message: string };

export default function SearchPanel({ solved }: { solved: Solved }) {
  const locale = effectiveLocale();
  const project = solved.project;
  const [settings, setSettings] = useState<OptionSearch>(() => startingSettings(project.optionSearch));
  const [run, setRun] = useState<RunState>({ kind: 'idle' });
  const [saveMessage, setSaveMessage] = useState('');
  const handle = useRef<SearchRunHandle | null>(null);
  useEffect(() => () => handle.current?.stop(), []);
  const hasBank = project.elements.some((e) => e.kind === 'battery' && e.bank !== undefined);
  const runtimeTarget = settings.targetRuntimeHours ?? project.backup?.targetRuntimeHours;
  const ready = withoutEmpty(settings);
  const count = combinationsOf(ready);
  const anyTicked = ready.systemVoltages !== undefined || ready.strings !== undefined || ready.cables !== undefined || ready.inverters !== undefined;

  const start = () => {
    // The settings are kept in the project first (checked by the engine's validation like any field).
    const refused = setField(PROJECT_LEVEL, 'optionSearch', ready, 'Find the option: target and candidates');
    if (refused) {
      setSaveMessage(`Not kept: ${refused}`);
      return;
    }
    setSaveMessage('');
    setRun({ kind: 'running', done: 0, total: Math.min(count, 2000) });
    const h = startSearch({ solved, settings: ready }, (done, total) => setRun({ kind: 'running', done, total }));
    handle.current = h;
    void h.done.then((end) => {
      if (handle.current !== h) return;
      handle.current = null;
      if (end.kind === 'stopped') setRun({ kind: 'idle' });
      else if (end.kind === 'crash') setRun({ kind: 'failed', message: end.message });
      else if (end.outcome.ok) setRun({ kind: 'done', search: end.outcome.search, ms: end.ms });
      else setRun({ kind: 'problems', problems: end.outcome.problems });
    });
  };
  const stop = () => handle.current?.stop();
  const variants = (draft.value?.['variants'] as ProjectVariant[] | undefined) ?? [];

  return (
    <div class="panel__body search-panel" data-testid="search-panel">
      <p>
        Tick the candidates to try; every combination is solved as a variant of this chain and checked against the target. The list keeps the options that meet it and that no other beats on both purchase cost and losses.
      </p>
      <fieldset class="search-axis">
        <legend>Target</legend>
        {hasBank && (
          <NumberInput
            id="search-runtime"
            label="Runtime to reach"
            unit="h"
            value={settings.targetRuntimeHours}
            locale={locale}
            testId="search-runtime"
            help={project.backup?.targetRuntimeHours !== undefined ? `Empty: the backup study’s target, ${formatSignificant(project.backup.targetRuntimeHours, 3, locale)} h.` : project.backup ? 'Empty: no runtime target.' : 'The chain has no battery backup study: the runtime is not checked.'}
            onValue={(v) => {
              const { targetRuntimeHours: _t, ...rest } = settings;
              setSettings(v !== undefined && v > 0 ? { ...rest, targetRuntimeHours: v } : rest);
            }}
          />
        )}
        <NumberInput
          id="search-max-loss"
          label="Highest losses"
          unit="W"
          value={settings.maxLossW}
          locale={locale}
          testId="search-max-loss"
          help="Optional. Every option must also keep each voltage drop within its limit and start every motor."
          onValue={(v) => {
            const { maxLossW: _m, ...rest } = settings;
            setSettings(v !== undefined && v > 0 ? { ...rest, maxLossW: v } : rest);
          }}
        />
        <div class="study-field">
          <label for="search-order" class="study-field__label">List first</label>
          <select id="search-order" class="study-field__input" value={settings.order ?? 'cost'} data-testid="search-order" onChange={(e) => setSettings({ ...settings, order: (e.currentTarget as HTMLSelectElement).value === 'losses' ? 'losses' : 'cost' })}>
            <option value="cost">the cheapest</option>
            <option value="losses">the lowest losses</option>
          </select>
        </div>
        {hasBank && runtimeTarget === undefined && <p class="note">No runtime target: the runtime is not checked.</p>}
      </fieldset>
      <Candidates solved={solved} settings={settings} update={setSettings} locale={locale} />
      <div class="search-actions">
        <button type="button" class="panel-button panel-button--primary" disabled={!anyTicked || run.kind === 'running'} onClick={start} data-testid="search-run">
          Find the option{anyTicked ? ` (${count} ${count === 1 ? 'option' : 'options'})` : ''}
        </button>
        {run.kind === 'running' && (
          <button type="button" class="panel-button" onClick={stop} data-testid="search-stop">
            Stop
          </button>
        )}
      </div>
      {!anyTicked && <p class="note">Tick at least one candidate.</p>}
      {count > 2000 && <p class="note">{count} combinations: only the first 2000 are tried. Tick fewer.</p>}
      {saveMessage && <p role="alert" class="study-field__error">{saveMessage}</p>}
      {run.kind === 'running' && (
        <div class="search-progress" data-testid="search-progress">
          <label for="search-progress-bar">Tried {run.done} of {run.total}</label>
          <progress id="search-progress-bar" max={run.total} value={run.done} />
        </div>
      )}
      {run.kind === 'failed' && <p role="alert">{run.message}</p>}
      {run.kind === 'problems' && (
        <div role="alert">
          <ul class="panel-warnings">
            {run.problems.map((p, i) => <li key={i}>{problemLine(p, project)}</li>)}
          </ul>
        </div>
      )}
      {run.kind === 'done' && <Results search={run.search} locale={locale} variants={variants} />}
      <p class="panel-caution" data-testid="search-caution">
        {SEARCH_CAUTION}
      </p>
    </div>
  );
}
