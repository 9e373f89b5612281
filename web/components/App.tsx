/** The page: header, demo picker, the shown project's results or problems, and the footer. */
import { DemoPicker } from './DemoPicker.tsx';
import { Preferences } from './Preferences.tsx';
import { ProblemList } from './ProblemList.tsx';
import { ElementTable, EnergyBalance, MethodNote, PortTable, WarningList } from './Results.tsx';
import { lazy, Suspense } from 'preact/compat';
import { openedFile, selectedDemo, shownTitle, solution } from '../state/app.ts';

/** The energy-flow diagram (and d3-sankey) load only when a solved project is shown. */
const EnergyFlow = lazy(() => import('./EnergyFlow.tsx'));

function ShownProject() {
  const s = solution.value;
  if (!s) return <p class="note">No project to show.</p>;
  const description = openedFile.value ? undefined : selectedDemo.value?.summary;
  return (
    <article class="project" aria-labelledby="project-heading" data-testid="project">
      <header class="project__header">
        <h2 id="project-heading">{s.state === 'solved' ? s.result.projectName || shownTitle.value : shownTitle.value}</h2>
        {description && <p class="project__summary">{description}</p>}
      </header>
      {s.state === 'solved' && (
        <>
          <EnergyBalance result={s.result} />
          <Suspense fallback={<p class="note">Drawing the energy flow…</p>}><EnergyFlow result={s.result} /></Suspense>
          <WarningList result={s.result} />
          <ElementTable result={s.result} />
          <PortTable result={s.result} />
          <MethodNote result={s.result} />
        </>
      )}
      {s.state === 'problems' && <ProblemList problems={s.problems} />}
      {s.state === 'unreadable' && (
        <section class="notice notice--error" role="alert" data-testid="unreadable">
          <p>{s.message}</p>
        </section>
      )}
    </article>
  );
}

export function App() {
  return (
    <div class="page">
      <header class="masthead">
        <p class="masthead__name">Joulepath</p>
        <p class="masthead__tagline">Power, losses and currents at every stage of a power chain</p>
        <Preferences />
      </header>
      <main class="layout">
        <DemoPicker />
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
    </div>
  );
}
