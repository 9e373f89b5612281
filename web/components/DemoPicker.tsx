/** The list of demo projects (one tap opens one) and the button that opens a file instead. */
import { demoProjects } from '../../core/page.ts';
import { chooseDemo, hashForDemo, openProjectFile, fileReadError, selectedDemoId } from '../state/app.ts';
import { useSignal } from '@preact/signals';
import type { SourceTemplate } from '../editor/templates.ts';
import { newProject } from '../state/editor.ts';
import { showProject } from '../state/view.ts';

/** "New chain": name it, pick the source it starts from (web/editor/templates.ts), and it opens in the editor. */
function NewChain() {
  const open = useSignal(false);
  const name = useSignal('New chain');
  // The templates come with the chain editor's chunk (not the first load); it is usually loaded already.
  const sources = useSignal<readonly SourceTemplate[] | null>(null);
  const toggle = () => {
    open.value = !open.value;
    if (open.value && !sources.value) void import('../editor/templates.ts').then((m) => (sources.value = m.SOURCE_TEMPLATES));
  };
  return (
    <div class="new-chain">
      <button type="button" class="new-chain__toggle" aria-expanded={open.value} aria-controls="new-chain-panel" data-testid="new-chain" onClick={toggle}>
        New chain…
      </button>
      {open.value && (
        <div id="new-chain-panel" class="new-chain__panel" role="group" aria-labelledby="new-chain-heading">
          <p id="new-chain-heading" class="new-chain__heading">Start a new chain from its source</p>
          <label class="new-chain__name">
            <span>Name</span>
            <input type="text" value={name.value} onInput={(ev) => (name.value = ev.currentTarget.value)} />
          </label>
          {!sources.value && <p class="note">Loading the sources…</p>}
          <ul class="new-chain__sources">
            {(sources.value ?? []).map((s) => (
              <li key={s.key}>
                <button
                  type="button"
                  class="new-chain__source"
                  data-source={s.key}
                  onClick={() => {
                    fileReadError.value = null;
                    newProject(name.value.trim() || 'New chain', structuredClone(s.element));
                    open.value = false;
                    showProject();
                    // The address no longer names a demo (a reload opens the first demo, not this one).
                    if (globalThis.location?.hash) globalThis.history.replaceState(null, '', globalThis.location.pathname + globalThis.location.search);
                    // Straight to the chain, where the new source is selected.
                    requestAnimationFrame(() => document.querySelector<HTMLElement>('[data-card-id][tabindex="0"]')?.focus());
                  }}
                >
                  {s.label}
                </button>
              </li>
            ))}
          </ul>
        </div>
      )}
    </div>
  );
}

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
                  showProject();
                }}
              >
                <span class="picker__title">{demo.title}</span>
                <span class="picker__summary">{demo.summary}</span>
              </a>
            </li>
          );
        })}
      </ul>
      <NewChain />
      <label class="picker__open">
        <input
          type="file"
          accept=".json,application/json"
          class="visually-hidden"
          data-testid="open-file"
          onChange={(event) => {
            const input = event.currentTarget;
            const file = input.files?.[0];
            if (file) {
              void openProjectFile(file);
              showProject();
            }
            input.value = '';
          }}
        />
        <span>Open a project file…</span>
      </label>
    </nav>
  );
}
