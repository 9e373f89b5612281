/**
 * The client report: a one- or two-page summary for the printed page (the browser's "Save as PDF").
 *
 * Rendered with the results (not mounted on demand: window.print() lays the page out at once, so
 * everything it prints must already be in the document). On screen only the "Print / save as PDF"
 * and "Share read-only" buttons show; web/print.css hides the rest of the page in print and shows, in
 * this order, the report's head (project, date, client, site, prepared by, the answers, the chain,
 * the share link's QR code), the report's tail (warnings, cautions), the energy-flow diagram, and
 * on a page of its own the engineer's page (assumptions, the method and the engine's working: the
 * figures at each element's input and output). The client's pages use the trade's words only; the
 * solver's vocabulary stays on the engineer's page. Every page carries "page n of m", the project
 * and the date in its margin (CSS paged media, @page margin boxes).
 *
 * Every figure comes from core (the solve result, the answers of core/solve/answers.ts, the engine's cautions);
 * the page only formats. The date is the page's (core has no clock).
 *
 * It prints one solved pair (web/state/solution.ts `lastSolved`): the result and the project it came
 * from, never a result beside a draft it did not come from. While the draft is invalid it prints the
 * last valid pair, its names and figures together, and says at the top that it is out of date (what
 * an engineer printing mid-edit expects: the last consistent design, plainly marked, rather than
 * nothing); with no valid pair yet the page shows no results and so no report.
 */
import { ReportAnswers } from './answers/ReportAnswers.tsx';
import { memo } from 'preact/compat';
import { useEffect, useMemo, useState } from 'preact/hooks';
import { bankCautions } from '../../core/studies/index.ts';
import { type BatterySource, type Chemistry, CONDUCTOR_CAUTION, type ElementResult, type Project, type Solved, type SolveResult } from '../../core/page.ts';
import { formatCurrent, formatPower, formatSmallPercent, formatVoltage } from '../format/number.ts';
import { elementKindLabel } from '../format/labels.ts';
import { effectiveLocale, unitSystem } from '../state/prefs.ts';
import { catchUpNow, useOffscreenLag, type BoxRef } from './lag.ts';
import type { DraftProject } from '../state/draft.ts';
import { ReportQr } from './report/ReportQr.tsx';
import { ShareLink } from './report/ShareLink.tsx';
import { ReportModes, ReportModesCautions, ReportModesMethod } from './report/ReportModes.tsx';
import { hasBankOnBus } from './modes/mode-state.ts';
import { ReportVariants } from './report/ReportVariants.tsx';
import { ReportLifetime } from './report/ReportLifetime.tsx';

/** The caution every report carries (results are planning estimates). */
export const REPORT_CAUTION =
  'These results are planning estimates. Local electrical codes and licensed professional practice govern the design and installation.';

/** Depth of each element in the chain (source 0). */
function depths(elements: readonly ElementResult[]): Map<string, number> {
  const out = new Map<string, number>();
  for (const e of elements) out.set(e.id, e.from === undefined ? 0 : (out.get(e.from) ?? 0) + 1);
  return out;
}

function batterySource(project: Project): BatterySource | undefined {
  const root = project.elements.find((e) => e.kind === 'battery');
  return root?.kind === 'battery' ? root : undefined;
}

function useDate(): Date {
  const [now, setNow] = useState(() => new Date());
  useEffect(() => {
    // A page left open overnight prints today's date.
    const refresh = () => setNow(new Date());
    window.addEventListener('beforeprint', refresh);
    return () => window.removeEventListener('beforeprint', refresh);
  }, []);
  return now;
}

/** What the printed report shows: the result and the few inputs it reads besides. */
interface ReportInputs {
  result: SolveResult;
  stale: boolean;
  /** The project asks for a backup runtime. */
  backup: boolean;
  /** Chemistry of the battery source's bank, when it has one. */
  chemistry: string | undefined;
  locale: string | undefined;
  units: 'si' | 'us';
  /** The solved pair's project: its client, site, prepared-by and description lines, and the share link. */
  project: Project;
  /** The same pair whole, for the answers (ReportAnswers.tsx). */
  solved: Solved;
}

/** A CSS string literal (CSS Syntax 3, 4.3.5): quotes and backslashes escaped, line breaks as escapes. */
function cssString(text: string): string {
  return `"${text.replace(/[\\"]/g, (c) => `\\${c}`).replace(/[\n\r\f]/g, ' ')}"`;
}

/**
 * The report is hidden on screen (print only), so after an edit it is brought up to date when the
 * page is next idle after the frame is painted (lag.ts), not in the edit's own frame: the numbers
 * and the diagram on screen are painted first. Before printing (beforeprint, or the print media
 * query turning on) it is brought up to date at once.
 */
export default function ClientReport({ solved, stale }: { solved: Solved; stale: boolean }) {
  // The inputs the report reads besides the result come from the project the result came from.
  const { project, result } = solved;
  const backup = Boolean(project.backup);
  const chemistry = batterySource(project)?.bank?.chemistry;
  const locale = effectiveLocale();
  const units = unitSystem.value;
  const latest = useMemo<ReportInputs>(
    () => ({ result, stale, backup, chemistry, locale, units, project, solved }),
    [result, stale, backup, chemistry, locale, units, project, solved],
  );
  // Hidden on screen, so it always lags (and shows another project at once).
  const { box, shown } = useOffscreenLag(latest);
  return (
    <>
      <div class="report-bar" data-testid="report-bar">
        <button type="button" class="report-bar__button" onClick={() => { catchUpNow(); window.print(); }} data-testid="print-report">
          Print / save as PDF
        </button>
        <ShareLink project={project as unknown as DraftProject} />
        <span class="report-bar__hint">
          A short report for your client: the answers, the chain, the energy flow and cautions, with a last page of working for the engineer.
        </span>
      </div>
      <ReportBody {...shown} box={box} />
    </>
  );
}

/** The report itself; re-rendered only when what it shows has changed. */
const ReportBody = memo(function ReportBody({
  result,
  stale,
  backup,
  chemistry,
  locale: loc,
  units,
  project,
  solved,
  box,
}: ReportInputs & { box: BoxRef }) {
  const now = useDate();
  const t = result.totals;
  const depth = depths(result.elements);
  const cautions = [
    REPORT_CAUTION,
    ...(result.elements.some((e) => e.conductor) ? [CONDUCTOR_CAUTION] : []),
    ...(chemistry ? bankCautions(chemistry as Chemistry).filter((c) => !c.startsWith('Planning estimate only')) : []),
  ];
  const date = new Intl.DateTimeFormat(loc, { dateStyle: 'long' }).format(now);
  const title = result.projectName || 'Untitled project';
  const parties = [
    ['Client', project.client],
    ['Site', project.site],
    ['Prepared by', project.preparedBy],
  ].filter((p): p is [string, string] => typeof p[1] === 'string' && p[1].trim() !== '');
  // Page numbers, project and date in every page's margin (CSS Paged Media 3, page-margin boxes).
  const pageCss = `@media print { @page { @bottom-left { content: ${cssString(`${title} · ${date}`)}; } } }`;

  return (
    <>
      <section class="report report--head print-keep" aria-label="Client report" data-testid="report-head" ref={box}>
        <header class="report__title">
          <p class="report__brand">Joulepath · energy report</p>
          <h1>{title}</h1>
          <p class="report__date" data-testid="report-date">
            {date}
          </p>
        </header>
        <style>{pageCss}</style>
        {parties.length > 0 && (
          <dl class="report__parties" data-testid="report-parties">
            {parties.map(([label, text]) => (
              <div key={label}>
                <dt>{label}</dt>
                <dd>{text}</dd>
              </div>
            ))}
          </dl>
        )}
        {project.description && <p class="report__description">{project.description}</p>}
        {stale && (
          <p class="report__stale" data-testid="report-stale">
            Out of date: the inputs hold an error, so these are the last valid results, not those of the inputs as they stand.
          </p>
        )}
        {/* The answers first, in the client's words (web/components/answers/ReportAnswers.tsx). */}
        <ReportAnswers solved={solved} />
        <ReportVariants solved={solved} />
        <ReportLifetime solved={solved} locale={loc} />
        <div class="report__columns">
          <section>
            <h2>The chain</h2>
            <ol class="report__chain" data-testid="report-chain">
              {result.elements.map((e) => (
                <li key={e.id} style={{ paddingLeft: `${(depth.get(e.id) ?? 0) * 0.9}em` }}>
                  <span class="report__el">{e.name}</span> <span class="report__kind">{elementKindLabel(e.kind)}</span>
                  {e.role === 'load' ? ` · uses ${formatPower(e.pIn, loc)}` : e.loss > 0 ? ` · loses ${formatPower(e.loss, loc)}` : ''}
                  {e.idleLoss ? ` (${formatPower(e.idleLoss, loc)} idle)` : ''}
                </li>
              ))}
            </ol>
          </section>
          <ReportQr project={project as unknown as DraftProject} />
        </div>
        {/* A bank on a bus: both modes, the charger, standing by and the transfer (report/ReportModes.tsx). */}
        {hasBankOnBus(project) && <ReportModes solved={solved} locale={loc} />}
      </section>

      <section class="report report--tail print-keep" aria-label="Warnings and cautions" data-testid="report-tail">
        {result.warnings.length > 0 && (
          <>
            <h2>Check these</h2>
            <ul class="report__list" data-testid="report-warnings">
              {result.warnings.map((w, i) => (
                <li key={i}>
                  {result.elements.find((e) => e.id === w.elementId)?.name ?? w.elementId}: {w.message}
                </li>
              ))}
            </ul>
          </>
        )}
        <h2>Cautions</h2>
        <ul class="report__list report__cautions" data-testid="report-cautions">
          {cautions.map((c) => (
            <li key={c}>{c}</li>
          ))}
          {hasBankOnBus(project) && <ReportModesCautions solved={solved} />}
        </ul>
      </section>

      <section class="report report--engineer print-keep" aria-label="For the engineer: method and working" data-testid="report-engineer">
        <h2>For the engineer: method and working</h2>
        <ul class="report__list">
          <li>
            Real power in watts; per cent figures are shares of the power the source delivers. Computed in SI units, shown in{' '}
            {units === 'us' ? 'US customary units where they apply' : 'SI units'}.
          </li>
          <li>
            Idle loss is what a stage draws at zero output (standby, no-load, core or fixed loss, from its loss model); conversion loss is the
            rest, which grows with the load.
          </li>
          <li data-testid="report-method">
            Solved by {result.method.name}: {result.method.iterations} {result.method.iterations === 1 ? 'sweep' : 'sweeps'}, stopping below a
            relative voltage change of {result.method.tolerance.toExponential(0)}; energy balance mismatch{' '}
            {formatSmallPercent(t.balanceError, loc)}.
          </li>
          <li>AC voltages are line-to-line for three-phase, currents are line currents; P is real power at the port.</li>
          {hasBankOnBus(project) && <ReportModesMethod solved={solved} locale={loc} />}
        </ul>
        <table class="report__working" data-testid="report-working">
          <caption>The engine's working: each element's input and output port</caption>
          <thead>
            <tr>
              <th scope="col">Element</th>
              <th scope="col">In: V</th>
              <th scope="col">In: I</th>
              <th scope="col">In: P</th>
              <th scope="col">Out: V</th>
              <th scope="col">Out: I</th>
              <th scope="col">Out: P</th>
              <th scope="col">Loss</th>
            </tr>
          </thead>
          <tbody>
            {result.elements.map((e) => (
              <tr key={e.id}>
                <th scope="row">{e.name}</th>
                <td>{e.input ? formatVoltage(e.input.voltage, loc) : ''}</td>
                <td>{e.input ? formatCurrent(e.input.current, loc) : ''}</td>
                <td>{e.input ? formatPower(e.input.p, loc) : ''}</td>
                <td>{e.output ? formatVoltage(e.output.voltage, loc) : ''}</td>
                <td>{e.output ? formatCurrent(e.output.current, loc) : ''}</td>
                <td>{e.output ? formatPower(e.output.p, loc) : ''}</td>
                <td>{formatPower(e.loss, loc)}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </section>
    </>
  );
});
