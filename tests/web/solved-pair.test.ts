/**
 * The page keeps one solved pair (web/state/solution.ts `lastSolved`): the validated project and its
 * result together, never a result beside a draft it did not come from. Checked on the hillside demo
 * (invented data) through the editor's own operations; the panel worker is given that pair and
 * neither validates nor solves the base case again (core/solve/count.ts counts it). Behaviour checks,
 * no engineering values: common practice (no source).
 */
import { beforeEach, describe, expect, it } from 'vitest';
import { demoProjects } from '../../core/demos/index.ts';
import { readSolveCounts, resetSolveCounts } from '../../core/solve/count.ts';
import { draft, edit, lastSolved, loadProject, outcome, resultsState, setField, type DraftProject } from '../../web/state/editor.ts';
import { cableLengths } from '../../web/components/Results.tsx';

const hut = demoProjects.find((d) => d.id === 'hillside-relay-hut')!.project as DraftProject;

/** Every element of the pair's result is an element of the pair's project, under the same name. */
function consistent(): void {
  const pair = lastSolved.value!;
  const names = new Map(pair.project.elements.map((e) => [e.id, e.name ?? e.id]));
  expect(pair.result.projectName).toBe(pair.project.name);
  for (const e of pair.result.elements) expect(names.get(e.id)).toBe(e.name);
  expect(pair.result.elements).toHaveLength(pair.project.elements.length);
}

beforeEach(() => {
  loadProject(hut, { kind: 'demo', title: hut.name, demoId: 'hillside-relay-hut' });
});

describe('the last valid solved pair', () => {
  it('is the draft\u2019s own solved value when the draft solves', () => {
    expect(resultsState.value).toBe('current');
    const o = outcome.value;
    expect(o?.ok).toBe(true);
    expect(lastSolved.value).toBe(o);
    consistent();
  });

  it('follows a valid edit: the new name is in the project and the result together', () => {
    expect(setField('fridge', 'name', 'Cold box')).toBeNull();
    consistent();
    expect(lastSolved.value!.project.elements.find((e) => e.id === 'fridge')!.name).toBe('Cold box');
    expect(lastSolved.value!.result.elements.find((e) => e.id === 'fridge')!.name).toBe('Cold box');
  });

  it('stays whole while the draft is invalid: the draft\u2019s new names and lengths are not in it', () => {
    const before = lastSolved.value;
    const lengthBefore = cableLengths(before!.project).get('hut-cable');
    expect(lengthBefore).toBe(25); // the demo's 25 m run
    edit('rename and break', (p) => {
      const fridge = p.elements.find((e) => e.id === 'fridge')!;
      fridge.name = 'Renamed in the invalid draft';
      p.elements.find((e) => e.id === 'hut-cable')!['length'] = 40;
      p.elements.find((e) => e.id === 'radios')!.from = 'inverter'; // a DC load on an AC port: refused
    });
    expect(outcome.value?.ok).toBe(false);
    expect(resultsState.value).toBe('stale');
    // The same pair object, untouched: old names with old figures, old lengths.
    expect(lastSolved.value).toBe(before);
    consistent();
    expect(lastSolved.value!.result.elements.find((e) => e.id === 'fridge')!.name).toBe('Vaccine fridge');
    expect(cableLengths(lastSolved.value!.project).get('hut-cable')).toBe(25);
    // The draft does hold the new values: they are simply not shown beside the old figures.
    expect(draft.value!.elements.find((e) => e.id === 'hut-cable')!['length']).toBe(40);
  });

  it('starts afresh for another project (never the previous project\u2019s pair)', () => {
    const other = demoProjects.find((d) => d.id === 'riverside-pump-station')!.project as DraftProject;
    loadProject(other, { kind: 'demo', title: other.name, demoId: 'riverside-pump-station' });
    expect(lastSolved.value!.project.name).toBe(other.name);
    consistent();
  });
});

describe('the panel worker takes the pair', () => {
  type Reply = { id: number; reply: { kind: string; outcome: { ok: boolean } } };
  const scope = globalThis as unknown as { onmessage: ((e: { data: unknown }) => void) | null; postMessage: (m: Reply) => void };

  it('runs the battery and machines studies without validating or solving the base case again', async () => {
    const replies: Reply[] = [];
    scope.postMessage = (m) => replies.push(m);
    await import('../../web/components/panel-worker.ts');
    const solved = lastSolved.value!;
    resetSolveCounts();
    scope.onmessage!({ data: { id: 1, request: { kind: 'battery', solved } } });
    scope.onmessage!({ data: { id: 2, request: { kind: 'machines', solved, cost: { pricePerKWh: 0.2, hoursPerYear: 8760 } } } });
    scope.onmessage!({ data: { id: 3, request: { kind: 'pfc', solved, at: 'fridge', targetPowerFactor: 0.98 } } });
    expect(replies.map((r) => [r.reply.kind, r.reply.outcome.ok])).toEqual([
      ['battery', true],
      ['machines', true],
      ['pfc', true],
    ]);
    const counts = readSolveCounts();
    expect(counts.validations).toBe(0);
    expect(counts.solves).toBe(0);
    // The capacitor bank is one changed chain, solved from the pair; the sized bank one more, built only.
    expect(counts.variantSolves).toBe(1);
  });
});
