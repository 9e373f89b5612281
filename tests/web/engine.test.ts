/**
 * The page loads the engine on demand (web/state/engine.ts): until it has arrived no outcome is shown
 * (never a wrong one) and no field write enters the draft unchecked; when it arrives the draft solves
 * without another edit. Checked on the hillside demo (invented data). Behaviour checks, no engineering
 * values: common practice (no source).
 */
import { afterEach, describe, expect, it } from 'vitest';
import { demoProjects } from '../../core/demos/index.ts';
import { engine, engineFailure, loadEngine } from '../../web/state/engine.ts';
import { crashMessage, draft, lastSolved, loadProject, outcome, resultsState, setField, type DraftProject } from '../../web/state/editor.ts';

const hut = demoProjects.find((d) => d.id === 'hillside-relay-hut')!.project as DraftProject;

afterEach(async () => {
  engine.value = await loadEngine();
});

describe('the engine on demand', () => {
  it('before it arrives: no outcome, no results, and a field write is refused with the draft unchanged', () => {
    engine.value = null;
    loadProject(hut, { kind: 'demo', title: hut.name, demoId: 'hillside-relay-hut' });
    expect(outcome.value).toBeNull();
    expect(lastSolved.value).toBeNull();
    expect(resultsState.value).toBe('none');
    const before = draft.value;
    expect(setField('fridge', 'name', 'Cold box')).toMatch(/still loading/);
    expect(draft.value).toBe(before);
  });

  it('when it arrives the draft solves and its results show, without another edit', async () => {
    engine.value = null;
    loadProject(hut, { kind: 'demo', title: hut.name, demoId: 'hillside-relay-hut' });
    expect(outcome.value).toBeNull();
    engine.value = await loadEngine();
    expect(outcome.value?.ok).toBe(true);
    expect(lastSolved.value).toBe(outcome.value);
    expect(resultsState.value).toBe('current');
    expect(setField('fridge', 'name', 'Cold box')).toBeNull();
    expect(lastSolved.value?.project.elements.find((e) => e.id === 'fridge')?.name).toBe('Cold box');
  });

  it('is fetched once: later calls share the first load', async () => {
    expect(await loadEngine()).toBe(await loadEngine());
  });
});

describe('the engine that cannot be loaded', () => {
  afterEach(() => {
    engineFailure.value = null;
  });

  it('shows why in place of results, and field writes say so; its arrival clears it', async () => {
    engine.value = null;
    engineFailure.value = 'The calculation could not be loaded. Check the connection and reload the page.';
    loadProject(hut, { kind: 'demo', title: hut.name, demoId: 'hillside-relay-hut' });
    expect(crashMessage.value).toMatch(/could not be loaded/);
    expect(lastSolved.value).toBeNull();
    expect(setField('fridge', 'name', 'Cold box')).toMatch(/could not be loaded/);
    engine.value = await loadEngine();
    expect(crashMessage.value).toBeNull();
    expect(outcome.value?.ok).toBe(true);
  });
});
