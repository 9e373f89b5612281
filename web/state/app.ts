/**
 * Page state as signals: which project is shown (a demo, or a file the user opened) and its
 * solution. The solution is computed by core/ only; the page never computes engineering values.
 */
import { computed, signal } from '@preact/signals';
import { demoProjects, solveProject } from '../../core/index.ts';
import type { Problem } from '../../core/errors.ts';
import type { SolveResult } from '../../core/result.ts';

/** A project file the user opened from the device. */
export interface OpenedFile {
  fileName: string;
  /** Parsed JSON, not yet validated (the engine validates it). */
  data: unknown;
}

export type Solution =
  | { state: 'solved'; result: SolveResult }
  | { state: 'problems'; problems: Problem[] }
  | { state: 'unreadable'; message: string };

const HASH_PREFIX = '#demo=';

/** The demo named by the address (#demo=<id>), or the first demo. */
export function demoIdFromHash(hash: string): string | undefined {
  const fromHash = hash.startsWith(HASH_PREFIX) ? decodeURIComponent(hash.slice(HASH_PREFIX.length)) : '';
  if (demoProjects.some((d) => d.id === fromHash)) return fromHash;
  return demoProjects[0]?.id;
}

export function hashForDemo(id: string): string {
  return `${HASH_PREFIX}${encodeURIComponent(id)}`;
}

export const selectedDemoId = signal<string | undefined>(demoIdFromHash(globalThis.location?.hash ?? ''));
export const openedFile = signal<OpenedFile | null>(null);
/** Set when an opened file is not JSON at all (nothing for the engine to check). */
export const fileReadError = signal<{ fileName: string; message: string } | null>(null);

export const selectedDemo = computed(() => demoProjects.find((d) => d.id === selectedDemoId.value));

/** Title of what is shown. */
export const shownTitle = computed(() => {
  if (fileReadError.value) return fileReadError.value.fileName;
  if (openedFile.value) return openedFile.value.fileName;
  return selectedDemo.value?.title ?? '';
});

/** The project as entered (unvalidated data) that is shown: the opened file's, else the demo's. */
export const shownProjectInput = computed<unknown>(() =>
  fileReadError.value ? undefined : openedFile.value ? openedFile.value.data : selectedDemo.value?.project,
);

export const solution = computed<Solution | null>(() => {
  const readError = fileReadError.value;
  if (readError) return { state: 'unreadable', message: readError.message };
  const input = openedFile.value ? openedFile.value.data : selectedDemo.value?.project;
  if (input === undefined) return null;
  try {
    const outcome = solveProject(input);
    return outcome.ok ? { state: 'solved', result: outcome.result } : { state: 'problems', problems: [...outcome.problems] };
  } catch (error) {
    // An engine fault must not blank the page; show it so it can be reported.
    return { state: 'unreadable', message: `The calculation stopped unexpectedly: ${String(error)}` };
  }
});

export function chooseDemo(id: string): void {
  openedFile.value = null;
  fileReadError.value = null;
  selectedDemoId.value = id;
  const hash = hashForDemo(id);
  if (globalThis.location && globalThis.location.hash !== hash) globalThis.history.pushState(null, '', hash);
}

export async function openProjectFile(file: File): Promise<void> {
  const text = await file.text();
  try {
    const data: unknown = JSON.parse(text);
    fileReadError.value = null;
    openedFile.value = { fileName: file.name, data };
  } catch (error) {
    openedFile.value = null;
    fileReadError.value = {
      fileName: file.name,
      message: `This file is not a JSON project file (${error instanceof Error ? error.message : String(error)}).`,
    };
  }
}

// Follow the address when the user navigates back and forth between demos.
function followAddress(): void {
  const id = demoIdFromHash(globalThis.location.hash);
  if (id && id !== selectedDemoId.value) {
    openedFile.value = null;
    fileReadError.value = null;
    selectedDemoId.value = id;
  }
}
globalThis.addEventListener?.('hashchange', followAddress);
globalThis.addEventListener?.('popstate', followAddress);
