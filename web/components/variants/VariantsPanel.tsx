/**
 * "Compare options" (issue 20 point 1): the project's variants, the quick ways to add one (12 / 24 /
 * 48 V, critical loads only, the next conductor size up, or one number or choice field of one element
 * changed: ChangeField.tsx), each one renamed, noted or deleted; the comparison table with the figures that differ marked (and a CSV
 * of it), and the options' energy-flow diagrams side by side at one scale. The comparison runs in the
 * panel worker (core's compareColumns over solveColumns, panel-worker.ts); every figure is core's.
 * Loaded on demand when its panel is opened (PanelShelf.tsx).
 */
import { useState } from 'preact/hooks';
import { elementWords, type Problem, type ProjectVariant, type Solved } from '../../../core/page.ts';
import { criticalLoadsVariant, nextSizeUpVariant, systemBank, systemVoltageVariant, SYSTEM_VOLTAGES, type QuickVariantOutcome, type VariantComparison } from '../../../core/studies/index.ts';
import { costInForce, effectiveLocale } from '../../state/prefs.ts';
import { lastSolved } from '../../state/editor.ts';
import { useWorkerReply } from '../panel-client.ts';
import { problemLine } from '../problem-words.ts';
import { CsvButton } from '../report/CsvButton.tsx';
import { addVariant, deleteVariant, draftVariants, noteVariant, renameVariant } from './edit.ts';
import { ChangeField } from './ChangeField.tsx';
import { variantValueText } from './values.ts';
import { formatSignificant } from '../../format/number.ts';
import { VariantFlows } from './VariantFlows.tsx';
import '../Panels.css';
import './Variants.css';

type Status = { kind: 'ok' | 'error'; text: string } | null;

/** The comparison's reply from the worker for the solved pair (its project's variants). */
export function useComparison(solved: Solved | null, onlyWithVariants = false) {
  const cost = solved ? costInForce(solved.project) : null;
  const variants = (solved?.project.variants ?? []) as ProjectVariant[];
  return useWorkerReply<'variants'>(() => (solved && (!onlyWithVariants || variants.length > 0) ? { kind: 'variants', solved, variants, cost } : null), [solved, cost?.pricePerKWh, cost?.hoursPerYear]);
}

/**
 * How the cost rows are worked, under the table (the panel and the printed report): the hours the
 * losses' energy is counted for, the lifetime cost's settings, and core's methods of the lifetime
 * cost (with what it leaves out), the simple payback and the break-even year.
 */
export function ComparisonMethods({ comparison }: { comparison: VariantComparison }) {
  const loc = effectiveLocale();
  const n = (v: number, digits = 4) => formatSignificant(v, digits, loc);
  const life = comparison.lifetime;
  return (
    <ul class="note variants-methods" data-testid="variants-methods">
      <li>
        Energy lost a year: {comparison.lossesOverProfile ? 'the losses worked out over the load profile’s day (each load state solved through the chain) for' : 'the losses at the solved operating point ×'} {n(comparison.hoursPerYear, 5)} h a year{comparison.cost ? '.' : ' (no energy price given, so no cost).'}
      </li>
      {life && (
        <li>
          Lifetime cost over {life.years} {life.years === 1 ? 'year' : 'years'} at a discount rate of {n(life.discountRate * 100, 3)} %
          {comparison.columns.length > 1 ? '; break-even and payback of each option against the plan as it stands.' : '.'}
        </li>
      )}
      {comparison.methods.map((m) => (
        <li key={m}>{m}</li>
      ))}
    </ul>
  );
}

/** The comparison table: one row per figure, one column per option, the differing rows marked. */
export function ComparisonTable({ comparison, rows, caption }: { comparison: VariantComparison; rows?: VariantComparison['rows']; caption?: string }) {
  const loc = effectiveLocale();
  const shown = rows ?? comparison.rows;
  return (
    <div class="table-scroll" role="region" aria-label={caption ?? 'Options side by side'} tabIndex={0}>
      <table class="data variants-table" data-testid="variants-table">
        {caption && <caption>{caption}</caption>}
        <thead>
          <tr>
            <th scope="col">Figure</th>
            {comparison.columns.map((c, i) => (
              <th scope="col" key={i}>
                {c.name}
              </th>
            ))}
          </tr>
        </thead>
        <tbody>
          {shown.map((r) => (
            <tr key={r.key} class={r.differs ? 'variants-row--differs' : undefined} data-key={r.key} data-differs={r.differs ? 'true' : 'false'}>
              <th scope="row">
                {r.label}
                {r.differs && <span class="cell-note variants-differs">differs</span>}
              </th>
              {r.values.map((v, i) => (
                <td key={i} class={typeof v === 'number' ? 'num' : undefined}>
                  {comparison.columns[i]!.ok ? variantValueText(r, v, loc) : 'does not apply'}
                </td>
              ))}
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}

function Problems({ problems, project }: { problems: readonly Problem[]; project: unknown }) {
  return (
    <ul class="panel-warnings">
      {problems.map((p, i) => (
        <li key={i}>{problemLine(p, project)}</li>
      ))}
    </ul>
  );
}

/** The buttons that add the usual variants, each one tap; critical loads and a cable are picked first. */
function QuickAdd({ solved, onDone }: { solved: Solved; onDone: (s: Status) => void }) {
  const project = solved.project;
  const { names } = elementWords(project);
  const loads = solved.result.elements.filter((e) => e.role === 'load');
  const cables = project.elements.filter((e) => e.kind === 'cable' && e.conductor !== undefined);
  const [notCritical, setNotCritical] = useState<string[]>([]);
  const [cable, setCable] = useState<string>('');
  const take = (o: QuickVariantOutcome) => {
    if (!o.ok) return onDone({ kind: 'error', text: o.problems.map((p) => problemLine(p, project)).join('; ') });
    const refused = addVariant(o.variant);
    onDone(refused ? { kind: 'error', text: refused } : { kind: 'ok', text: `Added "${draftVariants().at(-1)?.name ?? o.variant.name}".` });
  };
  const bank = systemBank(project);
  return (
    <div class="variants-quick" data-testid="variants-quick">
      <h3>Add an option</h3>
      {bank && (
        <div class="variants-quick__row" role="group" aria-label="System voltage">
          <span class="variants-quick__label">System voltage</span>
          {SYSTEM_VOLTAGES.map((v) => {
            // The bank's own voltage is no option: its button says so and cannot be pressed.
            const o = systemVoltageVariant(project, v);
            const planned = !o.ok && o.problems[0]?.field === 'bank.series';
            return (
              <button type="button" key={v} class="panel-button" data-testid={`variant-add-${v}v`} disabled={planned} onClick={() => take(o)}>
                {planned ? `${v} V (as planned)` : `${v} V`}
              </button>
            );
          })}
        </div>
      )}
      {loads.length > 1 && (
        <fieldset class="variants-quick__loads">
          <legend>Critical loads only: tick the loads that are not critical</legend>
          {loads.map((l) => (
            <label key={l.id} class="variants-check">
              <input
                type="checkbox"
                checked={notCritical.includes(l.id)}
                onChange={(e) => setNotCritical((cur) => ((e.currentTarget as HTMLInputElement).checked ? [...cur, l.id] : cur.filter((x) => x !== l.id)))}
              />
              {names.get(l.id) ?? l.id}
            </label>
          ))}
          <button type="button" class="panel-button" data-testid="variant-add-critical" disabled={notCritical.length === 0} onClick={() => take(criticalLoadsVariant(project, notCritical))}>
            Add “critical loads only”
          </button>
        </fieldset>
      )}
      {cables.length > 0 && (
        <div class="variants-quick__row">
          <label class="variants-quick__label" for="variant-cable">
            Next conductor size up
          </label>
          <select id="variant-cable" value={cable} onChange={(e) => setCable((e.currentTarget as HTMLSelectElement).value)}>
            <option value="">All cables</option>
            {cables.map((c) => (
              <option key={c.id} value={c.id}>
                {names.get(c.id) ?? c.id}
              </option>
            ))}
          </select>
          <button type="button" class="panel-button" data-testid="variant-add-next-size" onClick={() => take(nextSizeUpVariant(solved, cable === '' ? null : cable))}>
            Add next size up
          </button>
        </div>
      )}
      <ChangeField solved={solved} onDone={onDone} />
    </div>
  );
}

/** The stored variants: name, note, delete; a variant that no longer applies shows why. */
function VariantList({ variants, comparison, project, onDone }: { variants: readonly ProjectVariant[]; comparison: VariantComparison | null; project: unknown; onDone: (s: Status) => void }) {
  if (variants.length === 0) return <p class="note">No options yet: add one above. Each is kept with the project, exported and printed with it.</p>;
  const done = (refused: string | null) => onDone(refused ? { kind: 'error', text: refused } : null);
  return (
    <ol class="variants-list" data-testid="variants-list">
      {variants.map((v, i) => {
        const column = comparison?.columns[i + 1];
        return (
          <li key={i} class="variants-item" data-testid="variant-item">
            <label>
              Name
              <input type="text" value={v.name} maxLength={80} onChange={(e) => done(renameVariant(i, (e.currentTarget as HTMLInputElement).value))} />
            </label>
            <label>
              Note
              <textarea rows={2} value={v.note ?? ''} onChange={(e) => done(noteVariant(i, (e.currentTarget as HTMLTextAreaElement).value))} />
            </label>
            <button type="button" class="panel-button" onClick={() => done(deleteVariant(i))} data-testid="variant-delete">
              Delete “{v.name}”
            </button>
            {column && !column.ok && (
              <div role="note">
                <p class="note">No longer applies to the chain as it stands:</p>
                <Problems problems={column.problems} project={project} />
              </div>
            )}
          </li>
        );
      })}
    </ol>
  );
}

export default function VariantsPanel() {
  const solved = lastSolved.value;
  const [status, setStatus] = useState<Status>(null);
  // The list shown is the draft's (what the user edits; reading it follows the draft signal); the comparison the solved pair's.
  const variants = draftVariants();
  const { reply, pending } = useComparison(solved);
  if (!solved) return <p class="note">The options are compared once the project's figures are worked out.</p>;
  const comparison = reply?.kind === 'variants' && reply.outcome.ok ? reply.outcome.comparison : null;
  return (
    <div class="panel-body variants-panel" data-testid="variants-panel">
      <p class="note">
        Each option is the project with a few changes, worked out by the same method; the table marks the figures that differ. Planning estimates: local codes and licensed practice govern the final design.
      </p>
      <QuickAdd solved={solved} onDone={setStatus} />
      <p role="status" class={status?.kind === 'error' ? 'variants-status variants-status--error' : 'variants-status'} data-testid="variants-status">
        {status?.text ?? ''}
      </p>
      <h3>Options kept with the project</h3>
      <VariantList variants={variants} comparison={comparison} project={solved.project} onDone={setStatus} />
      <section class="variants-compare" aria-label="Options side by side">
        <h3>
          Side by side <CsvButton name="Options side by side" />
        </h3>
        {pending && !comparison && <p class="note">Comparing…</p>}
        {reply?.kind === 'crash' && <p class="note">{reply.message}</p>}
        {reply?.kind === 'variants' && !reply.outcome.ok && <Problems problems={reply.outcome.problems} project={solved.project} />}
        {comparison && (
          <>
            <ComparisonTable comparison={comparison} />
            <ComparisonMethods comparison={comparison} />
            {comparison.columns.some((c) => c.studyProblems.length > 0) && (
              <ul class="panel-warnings" data-testid="variants-study-problems">
                {comparison.columns.flatMap((c) =>
                  c.studyProblems.flatMap((s) => s.problems.map((p, j) => <li key={`${c.name}-${s.study}-${j}`}>{`${c.name}: ${problemLine(p, solved.project)}`}</li>)),
                )}
              </ul>
            )}
            <h3>Energy flow of each option</h3>
            {reply?.kind === 'variants' && reply.outcome.ok && <VariantFlows names={comparison.columns.map((c) => c.name)} flows={reply.outcome.flows} />}
            <div class="panel-cautions">
              <ul>
                {comparison.cautions.map((c) => (
                  <li key={c}>{c}</li>
                ))}
              </ul>
            </div>
          </>
        )}
      </section>
    </div>
  );
}
