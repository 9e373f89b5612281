/**
 * "Find the option" (issue 20 point 4): the target (runtime, drops within their limits, starts, an
 * optional loss limit) and the candidates the user ticks — the system voltage (12 / 24 / 48 V, when the
 * chain has a DC system bank with its cells), strings in the bank (1–4), conductor sizes
 * of each sized cable (the cable's own table), inverters (the editor's template at typical
 * efficiencies) — kept in the project (`optionSearch`, through setField), searched in a worker of its
 * own with progress and a stop button, then the short list of options that meet the target (none
 * cheaper with lower losses), the rejected grouped with their reasons, and "Keep as a variant" per
 * option (the project's `variants`). Every figure is core's (searchOptions); this file only formats.
 * Loaded on demand when its panel is opened (PanelShelf.tsx).
 */
import { useEffect, useRef, useState } from 'preact/hooks';
import { PROJECT_LEVEL, type CableStage, type Element, type OptionSearch, type Problem, type ProjectVariant, type Solved } from '../../../core/page.ts';
import { listedSizes, SEARCH_CAUTION, SYSTEM_VOLTAGES, systemBank, type EvaluatedOption, type SearchResult } from '../../../core/studies/index.ts';
import { formatDuration, formatPower, formatSignificant } from '../../format/number.ts';
import { formatMoney } from '../../format/panels.ts';
import { formatForInput, parseLocaleNumber } from '../../format/parse.ts';
import { effectiveLocale } from '../../state/prefs.ts';
import { draft, setField, type DraftElement } from '../../state/editor.ts';
import { problemLine } from '../problem-words.ts';
import { StudyInput } from '../StudyInput.tsx';
import { startSearch, type SearchRunHandle } from './search-run.ts';
import { inverterPreset, PRESET_EFFICIENCIES } from './inverter-presets.ts';
import '../Panels.css';
import './Search.css';

type Locale = string | undefined;
const STRINGS = [1, 2, 3, 4] as const;
/** The project keeps at most this many variants (core/model/variants.ts MAX_VARIANTS). */
const MAX_VARIANTS = 12;

const nameOf = (e: { id: string; name?: string }) => e.name ?? e.id;

/** A number typed in the user's format, or undefined when empty; null when it is not a number. */
function readNumber(text: string, locale: Locale): number | undefined | null {
  const p = parseLocaleNumber(text, locale);
  if (p.kind === 'empty') return undefined;
  return p.kind === 'number' ? p.value : null;
}

/** A number input (the panels' StudyInput) that writes when what is typed reads as a number of at least 0, or is emptied. */
function NumberInput({ id, label, unit, value, onValue, locale, help, testId }: { id: string; label: string; unit: string; value: number | undefined; onValue: (v: number | undefined) => void; locale: Locale; help?: string; testId: string }) {
  const [text, setText] = useState<string | null>(null);
  const [bad, setBad] = useState<string | null>(null);
  return (
    <StudyInput
      id={id}
      label={label}
      unit={unit}
      text={text ?? (value === undefined ? '' : formatForInput(value, locale))}
      help={help}
      message={bad}
      testId={testId}
      onText={(t) => {
        setText(t);
        const v = readNumber(t, locale);
        const wrong = v === null ? 'is not a number' : v !== undefined && v < 0 ? 'must not be negative' : null;
        setBad(wrong);
        if (!wrong) onValue(v ?? undefined);
      }}
      onLeave={() => {
        if (!bad) setText(null);
      }}
    />
  );
}

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

function Candidates({ solved, settings, update, locale }: { solved: Solved; settings: OptionSearch; update: (s: OptionSearch) => void; locale: Locale }) {
  const project = solved.project;
  const bank = project.elements.find((e) => e.kind === 'battery' && e.bank !== undefined);
  const cables = project.elements.filter((e): e is CableStage => e.kind === 'cable' && e.conductor !== undefined);
  const inverters = project.elements.filter((e) => e.kind === 'inverter');
  const counts = settings.strings?.counts ?? [];
  // The system voltage changes the DC system's bank (its cells in series): offered only when the chain has one with its cells.
  const dcBank = systemBank(project);
  const volts = settings.systemVoltages ?? [];
  const toggleVolts = (v: number, on: boolean) => {
    const next = on ? [...volts, v].sort((a, b) => a - b) : volts.filter((x) => x !== v);
    update({ ...settings, systemVoltages: next });
  };
  const toggleCount = (n: number, on: boolean) => {
    const next = on ? [...counts, n].sort((a, b) => a - b) : counts.filter((x) => x !== n);
    update({ ...settings, strings: { ...(settings.strings ?? {}), bank: bank!.id, counts: next } });
  };
  const cableSettings = (id: string) => settings.cables?.find((c) => c.cable === id);
  const setCable = (id: string, change: (c: NonNullable<OptionSearch['cables']>[number]) => NonNullable<OptionSearch['cables']>[number]) => {
    const list = settings.cables ?? [];
    const current = list.find((c) => c.cable === id) ?? { cable: id, sizes: [] };
    const next = change(current);
    update({ ...settings, cables: [...list.filter((c) => c.cable !== id), next] });
  };
  const invSettings = (id: string) => settings.inverters?.find((i) => i.element === id);
  const setInv = (id: string, change: (i: NonNullable<OptionSearch['inverters']>[number]) => NonNullable<OptionSearch['inverters']>[number]) => {
    const list = settings.inverters ?? [];
    const current = list.find((i) => i.element === id) ?? { element: id, alternatives: [] };
    update({ ...settings, inverters: [...list.filter((i) => i.element !== id), change(current)] });
  };
  return (
    <div class="search-candidates" data-testid="search-candidates">
      {dcBank?.bank && (
        <fieldset class="search-axis" data-testid="search-voltages">
          <legend>System voltage of {nameOf(dcBank)}</legend>
          <div class="search-ticks">
            {SYSTEM_VOLTAGES.map((v) => (
              <label key={v} class="search-tick">
                <input type="checkbox" checked={volts.includes(v)} data-testid={`search-volts-${v}`} onChange={(e) => toggleVolts(v, (e.currentTarget as HTMLInputElement).checked)} />
                {v} V
              </label>
            ))}
          </div>
          <p class="note">The bank is re-strung for each voltage (the same cells where they divide) and the other candidates are tried at it; the strings count at that voltage.</p>
        </fieldset>
      )}
      {bank && (
        <fieldset class="search-axis">
          <legend>Strings in {nameOf(bank)}</legend>
          <div class="search-ticks">
            {STRINGS.map((n) => (
              <label key={n} class="search-tick">
                <input type="checkbox" checked={counts.includes(n)} data-testid={`search-strings-${n}`} onChange={(e) => toggleCount(n, (e.currentTarget as HTMLInputElement).checked)} />
                {n} {n === 1 ? 'string' : 'strings'}
              </label>
            ))}
          </div>
          <NumberInput
            id="search-string-price"
            label="Price of one string"
            unit=""
            value={settings.strings?.pricePerString}
            locale={locale}
            testId="search-string-price"
            help={bank.price !== undefined ? 'Empty: the bank’s purchase price shared over its strings.' : 'Without it the strings count as unpriced.'}
            onValue={(v) => {
              const { pricePerString: _p, ...rest } = settings.strings ?? { bank: bank.id, counts: [] };
              update({ ...settings, strings: { ...rest, bank: bank.id, counts: rest.counts ?? [], ...(v !== undefined ? { pricePerString: v } : {}) } });
            }}
          />
        </fieldset>
      )}
      {inverters.map((inv) => {
        const s = invSettings(inv.id);
        return (
          <fieldset class="search-axis" key={inv.id}>
            <legend>Inverters in place of {nameOf(inv)}</legend>
            <p class="note">Typical values: use the maker’s figure for each efficiency and its price.</p>
            {PRESET_EFFICIENCIES.map((eff) => {
              const preset = inverterPreset(inv as unknown as DraftElement, eff);
              const chosen = s?.alternatives.find((a) => a.id === preset.id);
              return (
                <div class="search-choice" key={eff}>
                  <label class="search-tick">
                    <input
                      type="checkbox"
                      checked={chosen !== undefined}
                      data-testid={`search-inverter-${inv.id}-${Math.round(eff * 100)}`}
                      onChange={(e) => {
                        const on = (e.currentTarget as HTMLInputElement).checked;
                        setInv(inv.id, (i) => ({ ...i, alternatives: on ? [...i.alternatives, preset as unknown as Element] : i.alternatives.filter((a) => a.id !== preset.id) }));
                      }}
                    />
                    {preset.name}
                  </label>
                  {chosen && (
                    <NumberInput
                      id={`search-price-${preset.id}`}
                      label={`Price of ${preset.name}`}
                      unit=""
                      value={chosen.price}
                      locale={locale}
                      testId={`search-inverter-price-${inv.id}-${Math.round(eff * 100)}`}
                      onValue={(v) =>
                        setInv(inv.id, (i) => ({
                          ...i,
                          alternatives: i.alternatives.map((a) => {
                            if (a.id !== preset.id) return a;
                            const { price: _p, ...rest } = a;
                            return (v !== undefined ? { ...rest, price: v } : rest) as Element;
                          }),
                        }))
                      }
                    />
                  )}
                </div>
              );
            })}
          </fieldset>
        );
      })}
      {cables.map((cable) => {
        const s = cableSettings(cable.id);
        const sizes = s?.sizes ?? [];
        const priceOf = (size: string) => s?.prices?.find((p) => p.size === size)?.price;
        return (
          <fieldset class="search-axis" key={cable.id}>
            <legend>Sizes of {nameOf(cable)}</legend>
            <div class="search-ticks">
              {listedSizes(cable).map((size) => (
                <label key={size} class="search-tick">
                  <input
                    type="checkbox"
                    checked={sizes.includes(size)}
                    data-testid={`search-size-${cable.id}-${size}`}
                    onChange={(e) => {
                      const on = (e.currentTarget as HTMLInputElement).checked;
                      const listed = listedSizes(cable);
                      setCable(cable.id, (c) => ({ ...c, sizes: listed.filter((x) => (x === size ? on : (c.sizes ?? []).includes(x))) }));
                    }}
                  />
                  {size}
                </label>
              ))}
            </div>
            {sizes.map((size) => (
              <NumberInput
                key={size}
                id={`search-price-${cable.id}-${size}`}
                label={`Price of ${nameOf(cable)} at ${size}`}
                unit=""
                value={priceOf(size)}
                locale={locale}
                testId={`search-size-price-${cable.id}-${size}`}
                onValue={(v) =>
                  setCable(cable.id, (c) => ({
                    ...c,
                    prices: [...(c.prices ?? []).filter((p) => p.size !== size), ...(v !== undefined ? [{ size, price: v }] : [])],
                  }))
                }
              />
            ))}
          </fieldset>
        );
      })}
    </div>
  );
}

function OptionRow({ o, locale, keep, kept }: { o: EvaluatedOption; locale: Locale; keep: (o: EvaluatedOption) => void; kept: boolean }) {
  const words = kept ? 'Kept' : 'Keep as a variant';
  return (
    <tr data-testid="search-option">
      <th scope="row">
        <span class="search-option-name">{o.name}</span>
        <span class="search-option-words">{o.choices.map((c) => c.words).join('; ')}</span>
        <button type="button" class="panel-button search-keep" disabled={kept} onClick={() => keep(o)} data-testid="search-keep" aria-label={`${words}: ${o.name}`}>
          {words}
        </button>
      </th>
      <td>
        {formatMoney(o.cost, locale)}
        {o.missingPrices.length > 0 && <span class="search-option-words">no price for {o.missingPrices.join(', ')}</span>}
      </td>
      <td>{o.lossW !== undefined ? formatPower(o.lossW, locale) : '—'}</td>
      <td>{o.yearlyLossCost !== undefined ? formatMoney(o.yearlyLossCost, locale) : '—'}</td>
      <td>{o.runtimeSeconds !== undefined ? `${o.runtimeIsLowerBound ? 'at least ' : ''}${formatDuration(o.runtimeSeconds, locale)}` : '—'}</td>
    </tr>
  );
}

function Results({ search, locale, variants }: { search: SearchResult; locale: Locale; variants: readonly ProjectVariant[] }) {
  const [message, setMessage] = useState('');
  const keep = (o: EvaluatedOption) => {
    const current = (draft.value?.['variants'] as ProjectVariant[] | undefined) ?? [];
    if (current.some((v) => v.name === o.variant.name)) return setMessage(`“${o.name}” is kept already.`);
    if (current.length >= MAX_VARIANTS) return setMessage(`The project keeps at most ${MAX_VARIANTS} variants: remove one first.`);
    const refused = setField(PROJECT_LEVEL, 'variants', [...current, o.variant], `Keep as a variant: ${o.name}`);
    setMessage(refused ? `Not kept: ${refused}` : `Kept “${o.name}” as a variant of the project.`);
  };
  return (
    <div class="search-results" data-testid="search-results">
      <p data-testid="search-summary">
        {search.tried} of {search.combinations} options tried; {search.metCount} meet the target. {search.options.length === 0 ? 'None meets it.' : `${search.options.length} on the list (no other is cheaper with lower losses), ${search.order === 'cost' ? 'cheapest' : 'lowest losses'} first.`}
      </p>
      {search.capMessage && <p class="note">{search.capMessage}</p>}
      <p class="note">Target: {search.target.join('; ')}.</p>
      {search.options.length > 0 && (
        <div class="table-scroll">
          <table class="data search-table" data-testid="search-options">
            <caption class="visually-hidden">Options that meet the target</caption>
            <thead>
              <tr>
                <th scope="col">Option</th>
                <th scope="col">Purchase cost</th>
                <th scope="col">Losses</th>
                <th scope="col">Losses a year</th>
                <th scope="col">Runtime</th>
              </tr>
            </thead>
            <tbody>
              {search.options.map((o) => (
                <OptionRow key={o.name} o={o} locale={locale} keep={keep} kept={variants.some((v) => v.name === o.variant.name)} />
              ))}
            </tbody>
          </table>
        </div>
      )}
      <p role="status" class="note" data-testid="search-keep-message">{message}</p>
      {search.rejectedGroups.length > 0 && (
        <div data-testid="search-rejected">
          <h4>Rejected: {search.rejected.length}</h4>
          <ul class="search-rejected">
            {search.rejectedGroups.map((g) => (
              <li key={g.group} data-testid="search-rejected-group">
                <strong>{g.group}</strong>: {g.count} {g.count === 1 ? 'option' : 'options'}
                <ul>
                  {g.examples.map((e) => (
                    <li key={e.name}>{e.name}: {e.text}</li>
                  ))}
                </ul>
              </li>
            ))}
          </ul>
        </div>
      )}
      {search.notes.map((n) => <p class="note" key={n}>{n}</p>)}
    </div>
  );
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
