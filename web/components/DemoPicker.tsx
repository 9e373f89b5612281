/** The list of demo projects (one tap opens one) and the button that opens a file instead. */
import { demoProjects } from '../../core/index.ts';
import { chooseDemo, hashForDemo, openProjectFile, fileReadError, selectedDemoId } from '../state/app.ts';

export function DemoPicker() {
  const showingFile = fileReadError.value !== null;
  return (
    <nav class="picker" aria-labelledby="picker-heading">
      <h2 id="picker-heading" class="picker__heading">Demo projects</h2>
      <ul class="picker__list">
        {demoProjects.map((demo) => {
          const current = !showingFile && demo.id === selectedDemoId.value;
          return (
            <li key={demo.id}>
              <a
                class="picker__item"
                href={hashForDemo(demo.id)}
                aria-current={current ? 'page' : undefined}
                data-demo-id={demo.id}
                onClick={(event) => {
                  event.preventDefault();
                  chooseDemo(demo.id);
                }}
              >
                <span class="picker__title">{demo.title}</span>
                <span class="picker__summary">{demo.summary}</span>
              </a>
            </li>
          );
        })}
      </ul>
      <label class="picker__open">
        <input
          type="file"
          accept=".json,application/json"
          class="visually-hidden"
          data-testid="open-file"
          onChange={(event) => {
            const input = event.currentTarget;
            const file = input.files?.[0];
            if (file) void openProjectFile(file);
            input.value = '';
          }}
        />
        <span>Open a project file…</span>
      </label>
    </nav>
  );
}
