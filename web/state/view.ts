/**
 * Which view the page shows on a narrow screen: the open project (the main view) or the projects view
 * (the stored projects, the save line, the demo picker, the storage details). On a wide screen the
 * projects sit in a side column beside the project and both are shown whatever this says (styles.css).
 *
 * The projects view is a history entry of its own at the same address (its `history.state` says so),
 * so the browser's Back returns from it to the project, and Back after opening a project from it
 * returns to it. A reload keeps the view the entry names. The address itself (#demo=…, #project=…)
 * stays what app.ts and address.ts make of it.
 */
import { signal } from '@preact/signals';

export type PageView = 'project' | 'projects';

/** The key in `history.state` that marks the projects view's entry. */
const VIEW_KEY = 'joulepathView';

function viewOfState(state: unknown): PageView {
  return state !== null && typeof state === 'object' && (state as Record<string, unknown>)[VIEW_KEY] === 'projects' ? 'projects' : 'project';
}

export const pageView = signal<PageView>(viewOfState(globalThis.history?.state));

/** Open the projects view (a new history entry, so Back returns to the project). */
export function showProjects(): void {
  if (pageView.value === 'projects') return;
  pageView.value = 'projects';
  if (globalThis.history && viewOfState(globalThis.history.state) !== 'projects') globalThis.history.pushState({ [VIEW_KEY]: 'projects' }, '');
}

/**
 * Back to the open project. `viaHistory` (the view's own Back button) steps back over the projects
 * view's entry when it is the current one, as the browser's Back would; opening a project from the
 * list only switches the view (the opening itself adds the project's address).
 */
export function showProject(options: { viaHistory?: boolean } = {}): void {
  if (options.viaHistory && globalThis.history && viewOfState(globalThis.history.state) === 'projects') {
    globalThis.history.back();
    return;
  }
  pageView.value = 'project';
}

// Back and forward between the project and the projects view.
globalThis.addEventListener?.('popstate', (event: PopStateEvent) => {
  pageView.value = viewOfState(event.state);
});
