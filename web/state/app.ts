/**
 * What is open: a demo (chosen in one tap, named in the address as #demo=<id>), a project file the
 * user opened, or a new project. Whatever is open is loaded into the editor (state/editor.ts),
 * which holds the draft, its history and its solution. The page never computes engineering values.
 */
import { computed, signal } from '@preact/signals';
import { demoProjects } from '../../core/index.ts';
import { draft, draftOrigin, isEditable, loadProject, type DraftProject } from './editor.ts';

const HASH_PREFIX = '#demo=';

/** The demo named by the address (#demo=<id>), or undefined. */
export function demoIdFromHash(hash: string): string | undefined {
  const fromHash = hash.startsWith(HASH_PREFIX) ? decodeURIComponent(hash.slice(HASH_PREFIX.length)) : '';
  return demoProjects.some((d) => d.id === fromHash) ? fromHash : undefined;
}

export function hashForDemo(id: string): string {
  return `${HASH_PREFIX}${encodeURIComponent(id)}`;
}

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

/** The project as entered (unvalidated data) that is shown. */
export const shownProjectInput = computed<unknown>(() => (fileReadError.value ? undefined : draft.value));

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

/** Read a project file from the device into the editor. Files that are not projects get a message. */
export async function openProjectFile(file: File): Promise<void> {
  const text = await file.text();
  let data: unknown;
  try {
    data = JSON.parse(text);
  } catch (error) {
    fileReadError.value = {
      fileName: file.name,
      message: `This file is not a JSON project file (${error instanceof Error ? error.message : String(error)}).`,
    };
    return;
  }
  if (!isEditable(data)) {
    fileReadError.value = {
      fileName: file.name,
      message: 'This file is JSON but not a project: it needs an "elements" list whose entries each have an "id" and a "kind".',
    };
    return;
  }
  fileReadError.value = null;
  loadProject(data, { kind: 'file', title: file.name, fileName: file.name });
}

/** Open what the address names, or the first demo when nothing is open yet. */
export function openFromAddress(): void {
  const id = demoIdFromHash(globalThis.location?.hash ?? '');
  if (id && id !== selectedDemoId.value) chooseDemo(id, { updateAddress: false });
  else if (!draft.value && !id && demoProjects[0]) chooseDemo(demoProjects[0].id, { updateAddress: false });
}

// Follow the address when the user navigates back and forth between demos.
globalThis.addEventListener?.('hashchange', openFromAddress);
globalThis.addEventListener?.('popstate', openFromAddress);
