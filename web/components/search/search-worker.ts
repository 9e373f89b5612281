/**
 * The option search in a worker of its own ("Find the option"): hundreds of variants each solved and
 * discharged take a second or more, off the page's thread. It posts its progress every few options
 * and the search at the end; the page stops it by ending the worker. The request carries the page's
 * last valid solved value (never solved again here) and the settings; every figure is core's
 * (searchOptions), checked finite before it goes back (core/solve/finite.ts).
 */
import { searchOptions, type SearchResult } from '../../../core/studies/index.ts';
import { elementNames, nonFiniteProblems, type OptionSearch, type Problem, type Solved } from '../../../core/page.ts';

export interface SearchRequest {
  solved: Solved;
  settings: OptionSearch;
}

export type SearchMessage =
  | { kind: 'progress'; done: number; total: number }
  | { kind: 'done'; outcome: { ok: true; search: SearchResult } | { ok: false; problems: Problem[] }; ms: number }
  | { kind: 'crash'; message: string };

const scope = globalThis as unknown as {
  onmessage: ((event: { data: SearchRequest }) => void) | null;
  postMessage(message: SearchMessage): void;
};

scope.onmessage = (event) => {
  const t0 = performance.now();
  try {
    const { solved, settings } = event.data;
    const o = searchOptions(solved, settings, { onProgress: (done, total) => scope.postMessage({ kind: 'progress', done, total }) });
    if (!o.ok) {
      scope.postMessage({ kind: 'done', outcome: o, ms: performance.now() - t0 });
      return;
    }
    const bad = nonFiniteProblems('The option search', o.search, elementNames(solved.project));
    scope.postMessage({ kind: 'done', outcome: bad.length ? { ok: false, problems: bad } : o, ms: performance.now() - t0 });
  } catch (error) {
    scope.postMessage({ kind: 'crash', message: `The search stopped unexpectedly: ${String(error)}` });
  }
};
