/** The page: header, demo picker, the shown project's results or problems, and the footer. */
import { DemoPicker } from './DemoPicker.tsx';
import { ProblemList } from './ProblemList.tsx';
import { ElementTable, EnergyBalance, MethodNote, PortTable, WarningList } from './Results.tsx';
import { openedFile, selectedDemo, shownTitle, solution } from '../state/app.ts';

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
      </footer>
    </div>
  );
}
