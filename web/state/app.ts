/**
 * What is open: a demo (chosen in one tap, named in the address as #demo=<id>), a stored project
 * (#project=<id>, web/storage/), a project file the user imported, or a new project. Whatever is
 * open is loaded into the editor (state/editor.ts),
 * which holds the draft, its history and its solution. The page never computes engineering values.
 */
import { computed, signal } from '@preact/signals';
import { demoProjects } from '../../core/page.ts';
import { draft, draftOrigin, loadProject, type DraftProject } from './editor.ts';
import { importFile, openLatestStored, openStored, storageNotice, storedIdFromHash } from '../storage/session.ts';
import { addressProblem, demoIdFromHash, hashForDemo, isShareHash } from './address.ts';

// The hash parsing is pure (address.ts); re-exported for the page's modules that read it from here.
export { addressProblem, demoIdFromHash, hashForDemo } from './address.ts';

/** Set when an opened file could not be read as a project at all (nothing to edit). */
export const fileReadError = signal<{ fileName: string; message: string } | null>(null);

/** The demo that is open, if a demo is open. */
export const selectedDemoId = computed(() => (draftOrigin.value?.kind === 'demo' ? draftOrigin.value.demoId : undefined));

/** Title of what is shown. */
export const shownTitle = computed(() => {
  if (fileReadError.value) return fileReadError.value.fileName;
  const d = draft.value;
  return (d && typeof d.name === 'string' && d.name) || draftOrigin.value?.title || '';
});

/** Open a demo in the editor (a copy: the demo itself never changes). */
export function chooseDemo(id: string, options: { updateAddress?: boolean } = {}): void {
  const demo = demoProjects.find((d) => d.id === id);
  if (!demo) return;
  fileReadError.value = null;
  loadProject(demo.project as unknown as DraftProject, { kind: 'demo', title: demo.title, summary: demo.summary, demoId: id });
  const hash = hashForDemo(id);
  if (options.updateAddress !== false && globalThis.location && globalThis.location.hash !== hash) {
    globalThis.history.pushState(null, '', hash);
  }
}

/**
 * Import a project file from the device (web/storage/session.ts): the file is checked without
 * trust, stored as a new project and opened. A refused file gets a message and changes nothing.
 */
export async function openProjectFile(file: File): Promise<void> {
  const outcome = await importFile(file);
  if (outcome.ok) fileReadError.value = null;
  else if (!outcome.cancelled) fileReadError.value = { fileName: file.name, message: outcome.message };
}

/** Open a project stored in this browser (the project list, #project=<id>). */
export async function openStoredProject(id: string, options: { updateAddress?: boolean } = {}): Promise<boolean> {
  const opened = await openStored(id, options);
  if (opened) fileReadError.value = null;
  return opened;
}

function openFirstDemo(): void {
  if (!draft.value && demoProjects[0]) chooseDemo(demoProjects[0].id, { updateAddress: false });
}

/** Open what the address names, or the first demo when nothing is open yet. */
export function openFromAddress(): void {
  const hash = globalThis.location?.hash ?? '';
  // A damaged address opens the app with a message, never a blank page.
  const problem = addressProblem(hash);
  if (problem) {
    storageNotice.value = problem;
    if (!draft.value) void openLatestStored().then((ok) => ok || openFirstDemo());
    return;
  }
  // A read-only share link (#share=…): decoded on demand (web/state/share-open.ts); a bad one opens as without an address.
  if (isShareHash(hash)) {
    void import('./share-open.ts').then(async (m) => {
      if (!(await m.openShared(hash)) && !draft.value) openFirstDemo();
    });
    return;
  }
  // A stored project (#project=<id>); with nothing named, the project saved last, else the first demo.
  const storedId = storedIdFromHash(hash);
  if (storedId) {
    if (storedId !== draftOrigin.value?.storedKey) void openStoredProject(storedId, { updateAddress: false }).then((ok) => ok || openFirstDemo());
    return;
  }
  const id = demoIdFromHash(hash);
  if (id && id !== selectedDemoId.value) chooseDemo(id, { updateAddress: false });
  else if (!draft.value && !id) void openLatestStored().then((ok) => ok || openFirstDemo());
}

// Follow the address when the user navigates back and forth between demos.
globalThis.addEventListener?.('hashchange', openFromAddress);
globalThis.addEventListener?.('popstate', openFromAddress);
