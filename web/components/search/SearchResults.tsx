/**
 * The results of "Find the option" (SearchPanel.tsx): how many options were tried and met the target,
 * the short list (none cheaper with lower losses) with "Keep as a variant" per option (the project's
 * `variants`, through setField), the rejected grouped by their reason, and every rejected option with
 * its reasons behind a disclosure (built when it is opened). Every figure is core's
 * searchOptions; this file only formats.
 */
import { useState } from 'preact/hooks';
import { PROJECT_LEVEL, type ProjectVariant } from '../../../core/page.ts';
import type { EvaluatedOption, SearchResult } from '../../../core/studies/index.ts';
import { formatDuration, formatPower, formatSignificant } from '../../format/number.ts';
import { formatMoney } from '../../format/panels.ts';
import { draft, setField } from '../../state/editor.ts';
import type { Locale } from './SearchNumberInput.tsx';

/** The project keeps at most this many variants (core/model/variants.ts MAX_VARIANTS). */
const MAX_VARIANTS = 12;

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
      <td>
        {o.installedAh !== undefined && o.sizing ? (
          <>
            {formatSignificant(o.installedAh, 4, locale)} Ah
            <span class="search-option-words">the sizing for the target: {formatSignificant(o.sizing.bankAh, 4, locale)} Ah (needs {formatSignificant(o.sizing.requiredAh, 3, locale)} Ah)</span>
          </>
        ) : '—'}
      </td>
      <td>{o.runtimeSeconds !== undefined ? `${o.runtimeIsLowerBound ? 'at least ' : ''}${formatDuration(o.runtimeSeconds, locale)}` : '—'}</td>
    </tr>
  );
}

export function Results({ search, locale, variants }: { search: SearchResult; locale: Locale; variants: readonly ProjectVariant[] }) {
  const [message, setMessage] = useState('');
  // The list of every rejected option is built when its disclosure is opened (up to 2000 of them).
  const [everyOpen, setEveryOpen] = useState(false);
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
                <th scope="col">Bank</th>
                <th scope="col">Runtime as new</th>
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
          <details class="search-rejected-all" data-testid="search-rejected-all" onToggle={(e) => setEveryOpen((e.currentTarget as HTMLDetailsElement).open)}>
            <summary>Every rejected option, with its reasons ({search.rejected.length})</summary>
            {everyOpen && (
              <ul class="search-rejected">
                {search.rejected.map((o, i) => (
                  <li key={i} data-testid="search-rejected-option">
                    <strong>{o.name}</strong>: {o.reasons.map((r) => r.text).join('; ')}
                    {o.skipped.length > 0 && <span class="search-option-words">not checked after that: {o.skipped.join(', ')}</span>}
                  </li>
                ))}
              </ul>
            )}
          </details>
        </div>
      )}
      {search.notes.map((n) => <p class="note" key={n}>{n}</p>)}
    </div>
  );
}

