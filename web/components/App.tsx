/**
 * The page: header (the Projects button, the settings menu), the open project (its name and answers
 * first, then the chain editor and the results) and the projects view (stored projects, save line, demo
 * picker, storage details), and the footer. On a narrow screen one of the two views is shown at a time
 * (web/state/view.ts); on a wide one the projects sit in a side column beside the project.
 */
import { DemoPicker } from './DemoPicker.tsx';
import { ProjectList } from './ProjectList.tsx';
import { SaveLine, StorageAlerts, StorageDetails } from './StorageStatus.tsx';
import { SettingsMenu } from './Preferences.tsx';
import { ProblemList } from './ProblemList.tsx';
import { CableTable, ElementTable, MethodNote, PortTable, WarningList } from './Results.tsx';
import { PanelDisclosure, PanelShelf } from './PanelShelf.tsx';
import { AnswersStrip } from './answers/AnswersStrip.tsx';
import { batteryPairFor, hasBankOnBus, MODE_WORDS, shownMode, supplyPairFor } from './modes/mode-state.ts';
import { lazy, memo, Suspense } from 'preact/compat';
import { useSignal } from '@preact/signals';
import { useEffect, useLayoutEffect, useRef } from 'preact/hooks';
import { fileReadError, openFromAddress, shownTitle } from '../state/app.ts';
import { pageView, showProject, showProjects } from '../state/view.ts';
import { engine, engineFailure } from '../state/engine.ts';
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

/** A bank on a bus: the mode switch and both modes' balance (issue 19), loaded only for such a project. */
const ModeResults = lazy(() => import('./modes/ModeResults.tsx'));

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

/**
 * The project's description: on a phone cut to two lines (styles.css) so the answers stay on the first
 * screen, with a button that shows it all; shown whole where it fits.
 */
function ProjectSummary({ text }: { text: string }) {
  const open = useSignal(false);
  const clipped = useSignal(false);
  const ref = useRef<HTMLParagraphElement>(null);
  useLayoutEffect(() => {
    const el = ref.current;
    if (el && !open.value) clipped.value = el.scrollHeight > el.clientHeight + 1;
  }, [text]);
  return (
    <>
      <p ref={ref} id="project-summary" class={open.value ? 'project__summary project__summary--open' : 'project__summary'}>
        {text}
      </p>
      {clipped.value && (
        <button type="button" class="summary-toggle" aria-expanded={open.value} aria-controls="project-summary" data-testid="summary-toggle" onClick={() => (open.value = !open.value)}>
          {open.value ? 'Show less' : 'Show the whole description'}
        </button>
      )}
    </>
  );
}

function ShownProject() {
  const readError = fileReadError.value;
  if (readError) {
    return (
      <article class="project" aria-labelledby="project-heading" data-testid="project">
        <header class="project__header">
          <h2 id="project-heading" tabIndex={-1}>{readError.fileName}</h2>
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
  // A bank on a bus: the diagram, the warnings and the tables show the chosen mode (the on-battery pair from the worker, web/components/modes/).
  const twoModes = solved !== null && hasBankOnBus(solved.project);
  const batteryPair = twoModes && shownMode.value === 'battery' ? batteryPairFor(solved!) : null;
  const onBattery = batteryPair?.result ?? null;
  // With an inverter-charger's pass-through the on-supply mode is its own solve (the worker's), else the page's.
  const supplyPair = twoModes && !batteryPair ? supplyPairFor(solved!) : null;
  const shownPair = batteryPair ?? supplyPair ?? solved;
  const shownResult = onBattery ?? supplyPair?.result ?? result;
  const modeWords = twoModes ? (onBattery ? MODE_WORDS.battery : MODE_WORDS.supply) : undefined;
  return (
    <article class="project" aria-labelledby="project-heading" data-testid="project">
      <header class="project__header">
        <h2 id="project-heading" tabIndex={-1}>{shownTitle.value}</h2>
        {description && <ProjectSummary key={openCount.value} text={description} />}
      </header>
      {shared && <Suspense fallback={null}><SharedBanner /></Suspense>}
      {result && <AnswersStrip result={result} stale={stale} solved={solved!} />}
      {!result && !engine.value && !engineFailure.value && (
        <p class="note" role="status" data-testid="engine-loading">Working out the figures…</p>
      )}
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
          <Suspense fallback={null}><ClientReport solved={solved!} stale={stale} /></Suspense>
          {twoModes && <Suspense fallback={null}><ModeResults key={openCount.value} solved={solved!} /></Suspense>}
          {modeWords && <p class="mode-tag" data-testid="flow-mode">Energy flow {modeWords.toLowerCase()}</p>}
          <Suspense fallback={<p class="note">Drawing the energy flow…</p>}><EnergyFlow result={shownResult!} /></Suspense>
          <WarningList result={shownResult!} twoModes={twoModes} />
          <ElementTable result={shownResult!} twoModes={twoModes} />
          <CableTable result={shownPair!} twoModes={twoModes} />
          <PortTable result={shownResult!} twoModes={twoModes} />
          <MethodNote result={result} />
          <PanelShelf key={openCount.value} solved={solved!} />
        </div>
      )}
    </article>
  );
}

/** The narrow-screen layout (one view at a time), as in styles.css. */
const NARROW = '(max-width: 959px)';

export function App() {
  useEffect(() => openFromAddress(), []);
  const view = pageView.value;
  const backButton = useRef<HTMLButtonElement>(null);
  const shownView = useRef(view);
  // On a narrow screen a change of view starts at its top, with the focus on its first control (moved
  // before the browser paints, so a key pressed as soon as the view shows reaches it).
  useLayoutEffect(() => {
    if (shownView.current === view) return;
    shownView.current = view;
    if (!globalThis.matchMedia?.(NARROW).matches) return;
    globalThis.scrollTo(0, 0);
    if (view === 'projects') backButton.current?.focus();
    else document.getElementById('project-heading')?.focus({ preventScroll: true });
  }, [view]);
  return (
    <div class="page">
      <header class="masthead">
        <p class="masthead__name">Joulepath</p>
        <p class="masthead__tagline">Power, losses and currents at every stage of a power chain</p>
        <nav class="masthead__tools" aria-label="Views and settings">
          <button
            type="button"
            class="masthead__button masthead__projects"
            aria-controls="projects-view"
            aria-expanded={view === 'projects'}
            data-testid="projects-button"
            onClick={() => (view === 'projects' ? showProject({ viaHistory: true }) : showProjects())}
          >
            <svg class="masthead__icon" viewBox="0 0 20 20" width="20" height="20" aria-hidden="true" focusable="false">
              <path d="M3 4h5l2 2h7v10H3z" fill="none" stroke="currentColor" stroke-width="1.8" stroke-linejoin="round" />
            </svg>
            <span>Projects</span>
          </button>
          <SettingsMenu />
        </nav>
      </header>
      <main class={`layout layout--${view}`} data-view={view}>
        <div class="layout__project" id="project-view">
          <ShownProject />
        </div>
        <div class="sidebar" id="projects-view" data-testid="projects-view">
          <button type="button" class="store-btn sidebar__back" ref={backButton} data-testid="projects-back" onClick={() => showProject({ viaHistory: true })}>
            ← Back to {shownTitle.value || 'the project'}
          </button>
          <ProjectList />
          <SaveLine />
          <DemoPicker />
          <StorageDetails />
        </div>
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
