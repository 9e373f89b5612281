/** The page: header, demo picker, the open project (chain editor and results), and the footer. */
import { DemoPicker } from './DemoPicker.tsx';
import { ProjectList } from './ProjectList.tsx';
import { SaveLine, StorageAlerts, StorageDetails } from './StorageStatus.tsx';
import { Preferences } from './Preferences.tsx';
import { ProblemList } from './ProblemList.tsx';
import { CableTable, ElementTable, EnergyBalance, MethodNote, PortTable, WarningList } from './Results.tsx';
import { PanelDisclosure, PanelShelf } from './PanelShelf.tsx';
import { AnswersStrip } from './answers/AnswersStrip.tsx';
import { lazy, memo, Suspense } from 'preact/compat';
import { useEffect } from 'preact/hooks';
import { fileReadError, openFromAddress, shownTitle } from '../state/app.ts';
import { crashMessage, draft, draftOrigin, draftProblems, lastSolved, openCount, resultsState } from '../state/editor.ts';

/** The energy-flow diagram (and d3-sankey) load only when a solved project is shown. */
const EnergyFlow = lazy(() => import('./EnergyFlow.tsx'));
/** The client report (print-only, with its print button): loads beside the diagram, ready before anyone prints. */
const ClientReport = lazy(() => import('./ClientReport.tsx'));
/** The chain editor (cards, chooser, templates) loads beside the first results, outside the first-load budget. */
// memo: the editor takes no props and follows the editor's signals itself, so the project view
// re-rendering after an edit does not re-render every card and field again.
const ChainEditor = memo(lazy(() => import('./ChainEditor.tsx')));

/** Project-level settings (name, description, voltage-drop limits): loaded when opened. */
/** The read-only notice of a project opened from a share link: loaded only then. */
const SharedBanner = lazy(() => import('./report/SharedBanner.tsx').then((m) => ({ default: m.SharedBanner })));

const ProjectForm = lazy(() => import('./ProjectForm.tsx').then((m) => ({ default: m.ProjectForm })));

/** Says plainly when the results on screen are not those of the inputs on screen. */
function StaleNotice() {
  const state = resultsState.value;
  if (state !== 'stale') return null;
  return (
    <p class="notice notice--stale" role="status" data-testid="results-stale">
      Out of date: these are the last valid results. Fix the inputs marked below to update them.
    </p>
  );
}

function ShownProject() {
  const readError = fileReadError.value;
  if (readError) {
    return (
      <article class="project" aria-labelledby="project-heading" data-testid="project">
        <header class="project__header">
          <h2 id="project-heading">{readError.fileName}</h2>
        </header>
        <section class="notice notice--error" role="alert" data-testid="unreadable">
          <p>{readError.message}</p>
        </section>
      </article>
    );
  }
  if (!draft.value) return <p class="note">No project to show.</p>;
  const origin = draftOrigin.value;
  const description = origin?.kind === 'demo' ? origin.summary : undefined;
  // The last valid solved pair: every results view reads its result, and its project for any input fact.
  const solved = lastSolved.value;
  const result = solved?.result;
  const problems = draftProblems.value;
  const crashed = crashMessage.value;
  const stale = resultsState.value === 'stale';
  const shared = origin?.kind === 'shared';
  return (
    <article class="project" aria-labelledby="project-heading" data-testid="project">
      <header class="project__header">
        <h2 id="project-heading">{shownTitle.value}</h2>
        {description && <p class="project__summary">{description}</p>}
      </header>
      {shared && <Suspense fallback={null}><SharedBanner /></Suspense>}
      {result && <AnswersStrip result={result} stale={stale} />}
      {!shared && <Suspense fallback={<p class="note">Opening the chain editor…</p>}><ChainEditor /></Suspense>}
      {!shared && <PanelDisclosure id="project-settings" title="Project settings" hint="name, client, site, voltage-drop limits">
        {() => <ProjectForm />}
      </PanelDisclosure>}
      {problems.length > 0 && <ProblemList problems={problems} elements={draft.value.elements} />}
      {crashed && (
        <section class="notice notice--error" role="alert" data-testid="unreadable">
          <p>{crashed}</p>
        </section>
      )}
      {result && (
        <div class={stale ? 'results results--stale' : 'results'} data-testid="results" data-state={resultsState.value}>
          <StaleNotice />
          <EnergyBalance result={result} />
          <Suspense fallback={null}><ClientReport solved={solved!} stale={stale} /></Suspense>
          <Suspense fallback={<p class="note">Drawing the energy flow…</p>}><EnergyFlow result={result} /></Suspense>
          <WarningList result={result} />
          <ElementTable result={result} />
          <CableTable result={solved!} />
          <PortTable result={result} />
          <MethodNote result={result} />
          <PanelShelf key={openCount.value} solved={solved!} />
        </div>
      )}
    </article>
  );
}

export function App() {
  useEffect(() => openFromAddress(), []);
  return (
    <div class="page">
      <header class="masthead">
        <p class="masthead__name">Joulepath</p>
        <p class="masthead__tagline">Power, losses and currents at every stage of a power chain</p>
        <Preferences />
      </header>
      <main class="layout">
        <div class="sidebar">
          <ProjectList />
          <SaveLine />
          <DemoPicker />
          <StorageDetails />
        </div>
        <ShownProject />
      </main>
      <footer class="footer">
        <p>
          Results are planning estimates. Local electrical codes and licensed professional practice govern the
          design and installation.
        </p>
        <p>
          Figures are computed in SI units; US customary units are shown by conversion (1 ft = 0.3048 m,
          1 kcmil = 0.506707 mm², 1 hp = 745.7 W, °F = 1.8 × °C + 32).
        </p>
      </footer>
      <StorageAlerts />
    </div>
  );
}
