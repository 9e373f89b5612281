// The editor state (web/state/editor.ts): chain operations, their refusals, undo/redo round trips,
// coalescing of typing into one field, and field edits the engine rejects. Behaviour checks on
// invented chains, not values from a source: common practice (no source). Powers in the solved
// checks come from the engine itself (no hand values).
import { beforeEach, describe, expect, it } from 'vitest';
import { PROJECT_LEVEL } from '../../core/model/errors.ts';
import {
  addBranch,
  canRedo,
  canUndo,
  draft,
  duplicate,
  edit,
  fieldError,
  insertAfter,
  insertBefore,
  lastChange,
  lastSolved,
  loadProject,
  moveDownstream,
  moveUpstream,
  newProject,
  outcome,
  reattach,
  redo,
  redoLabel,
  removeBranch,
  removeElement,
  reorderBranch,
  resultsState,
  selectedId,
  setField,
  undo,
  undoLabel,
  type DraftElement,
  type DraftProject,
} from '../../web/state/editor.ts';

const loss = { model: 'constant', efficiency: 0.95 };
/** bank → cable → inverter → {fridge, lights}; bank → dc-dc → radio. */
function chain(): DraftProject {
  return {
    format: 'joulepath-project',
    version: 2,
    name: 'test chain',
    elements: [
      { id: 'bank', kind: 'battery', voltage: 51.2, internalResistance: 0.01 },
      { id: 'cab', kind: 'cable', from: 'bank', length: 3, resistancePerKm: 0.5 },
      { id: 'inv', kind: 'inverter', from: 'cab', phases: 1, outputVoltage: 230, frequency: 50, loss },
      { id: 'fridge', kind: 'ac-load', from: 'inv', power: 150, powerFactor: 0.8 },
      { id: 'lights', kind: 'ac-load', from: 'inv', power: 200, powerFactor: 0.95 },
      { id: 'dc-dc', kind: 'dc-dc', from: 'bank', outputVoltage: 12, loss },
      { id: 'radio', kind: 'dc-load', from: 'dc-dc', power: 40 },
    ],
  };
}

const ids = () => draft.value!.elements.map((e) => e.id);
const fromOf = (id: string) => draft.value!.elements.find((e) => e.id === id)?.from;
const solved = () => outcome.value?.ok === true;
const cable: DraftElement = { id: 'cable', kind: 'cable', length: 5, resistancePerKm: 1 };

beforeEach(() => {
  loadProject(chain(), { kind: 'new', title: 'test' });
});

describe('adding', () => {
  it('addBranch feeds the new element from the target and selects it', () => {
    const r = addBranch('inv', { id: 'load', kind: 'ac-load', power: 100, powerFactor: 1 });
    expect(r).toEqual({ ok: true });
    expect(fromOf('load')).toBe('inv');
    expect(selectedId.value).toBe('load');
    expect(solved()).toBe(true);
    expect(lastSolved.value!.result.totals.loadPower).toBeGreaterThan(390); // 150 + 200 + 40 + 100 W of loads, from the engine
  });

  it('insertAfter puts the element between the target and everything it fed', () => {
    insertAfter('inv', cable);
    expect(fromOf('cable')).toBe('inv');
    expect(fromOf('fridge')).toBe('cable');
    expect(fromOf('lights')).toBe('cable');
    expect(solved()).toBe(true);
  });

  it('insertBefore puts the element between the target and its feeder', () => {
    insertBefore('inv', { id: 'bus', kind: 'dc-bus', fixedLoss: 4 });
    expect(fromOf('bus')).toBe('cab');
    expect(fromOf('inv')).toBe('bus');
    expect(solved()).toBe(true);
  });

  it('gives a fresh id when the template id is taken', () => {
    insertAfter('cab', { id: 'cab', kind: 'cable', length: 2, resistancePerKm: 1 });
    expect(ids()).toContain('cab-2');
    expect(fromOf('inv')).toBe('cab-2');
  });

  it('names a new element in sentence case after its kind, numbered when the name is taken; ids are made as before', () => {
    // The kinds' words of web/format/labels.ts (common practice (no source)).
    addBranch('bank', { id: 'dc-dc', kind: 'dc-dc', outputVoltage: 24, loss });
    const added = draft.value!.elements.at(-1)!;
    expect([added.id, added.name]).toEqual(['dc-dc-2', 'DC–DC converter']);
    addBranch('inv', { id: 'load', kind: 'ac-va-load', apparentPower: 100, powerFactor: 0.9 });
    expect(draft.value!.elements.at(-1)!.name).toBe('AC load'); // the bracketed "(VA)" of the kind's word left out
    expect(lastChange.value).toBe('Added AC load');
    insertBefore('inv', { id: 'motor-bus', kind: 'dc-bus', fixedLoss: 1 });
    expect(draft.value!.elements.find((e) => e.id === 'motor-bus')!.name).toBe('DC bus');
    insertBefore('inv', { id: 'bus', kind: 'dc-bus', fixedLoss: 1 });
    expect(draft.value!.elements.find((e) => e.id === 'bus')!.name).toBe('DC bus 2');
    insertAfter('cab', { id: 'cable', kind: 'cable', length: 2, resistancePerKm: 1 });
    // The older unnamed cable "cab" shows its id; "Cable" is still free.
    expect(draft.value!.elements.find((e) => e.id === 'cable')!.name).toBe('Cable');
    // A name given with the element is kept.
    addBranch('bank', { id: 'x', name: 'Bilge pump feed', kind: 'dc-load', power: 5 });
    expect(draft.value!.elements.at(-1)!.name).toBe('Bilge pump feed');
    expect(solved()).toBe(true);
  });

  it('numbers a name taken by an older element shown by its id, whatever its case', () => {
    addBranch('dc-dc', { id: 'dc-dc', kind: 'dc-dc', outputVoltage: 5, loss });
    addBranch('dc-dc', { id: 'radio', kind: 'dc-load', power: 5 });
    // "radio" has no name: the new load is "DC load"; the next one "DC load 2".
    addBranch('dc-dc', { id: 'radio', kind: 'dc-load', power: 5 });
    const names = draft.value!.elements.filter((e) => e.kind === 'dc-load' && e.id !== 'radio').map((e) => e.name);
    expect(names).toEqual(['DC load', 'DC load 2']);
    // An older unnamed element shown by its id "cable" takes "Cable": a new cable is "Cable 2".
    loadProject({ ...chain(), elements: [...chain().elements, { id: 'cable', kind: 'cable', from: 'dc-dc', length: 1, resistancePerKm: 1 }] }, { kind: 'new', title: 't' });
    insertAfter('bank', { id: 'cable', kind: 'cable', length: 1, resistancePerKm: 1 });
    expect(draft.value!.elements.find((e) => e.id === 'cable-2')!.name).toBe('Cable 2');
  });

  it('refuses to insert before the source', () => {
    const r = insertBefore('bank', cable);
    expect(r.ok).toBe(false);
    expect(ids()).toHaveLength(7);
    expect(canUndo.value).toBe(false);
    expect(lastChange.value).toMatch(/before the source/);
  });
});

describe('removing', () => {
  it('removeElement joins the ends', () => {
    removeElement('cab');
    expect(fromOf('inv')).toBe('bank');
    expect(ids()).not.toContain('cab');
    expect(selectedId.value).toBe('bank');
  });

  it('removeBranch removes everything downstream', () => {
    removeBranch('cab');
    expect(ids().sort()).toEqual(['bank', 'dc-dc', 'radio']);
  });

  it('refuses to remove the source', () => {
    expect(removeElement('bank').ok).toBe(false);
    expect(removeBranch('bank').ok).toBe(false);
    expect(ids()).toHaveLength(7);
  });

  it('refuses to remove the source even when it feeds nothing (a project keeps its one source)', () => {
    newProject('empty', { id: 'g', kind: 'grid', phases: 1, voltage: 230, frequency: 50 });
    expect(removeElement('g').ok).toBe(false);
    expect(ids()).toEqual(['g']);
  });
});

describe('duplicate, move, reorder, reattach', () => {
  it('duplicate copies the element with its downstream branch as a new branch of the same feeder', () => {
    duplicate('inv');
    const copies = draft.value!.elements.filter((e) => !chain().elements.some((o) => o.id === e.id));
    expect(copies.map((e) => e.kind).sort()).toEqual(['ac-load', 'ac-load', 'inverter']);
    const invCopy = copies.find((e) => e.kind === 'inverter')!;
    expect(invCopy.from).toBe('cab');
    for (const c of copies.filter((e) => e.kind === 'ac-load')) expect(c.from).toBe(invCopy.id);
    expect(selectedId.value).toBe(invCopy.id);
    expect(solved()).toBe(true);
  });

  it('refuses to duplicate the source', () => {
    expect(duplicate('bank').ok).toBe(false);
  });

  it('moveUpstream swaps with a feeder that feeds only this element', () => {
    insertAfter('inv', { id: 'ac-cable', kind: 'cable', length: 10, resistancePerKm: 2 });
    // inv → ac-cable → loads; move the inverter's feeder cable below it is not allowed (a kind
    // change), but swapping two pass-through stages is: put a bus after the DC cable first.
    insertAfter('cab', { id: 'bus', kind: 'dc-bus', fixedLoss: 2 });
    expect(fromOf('bus')).toBe('cab');
    expect(moveUpstream('bus').ok).toBe(true);
    expect(fromOf('bus')).toBe('bank');
    expect(fromOf('cab')).toBe('bus');
    expect(fromOf('inv')).toBe('cab');
    expect(solved()).toBe(true);
  });

  it('moveDownstream is the same swap seen from the other side', () => {
    insertAfter('cab', { id: 'bus', kind: 'dc-bus', fixedLoss: 2 });
    expect(moveDownstream('cab').ok).toBe(true);
    expect(fromOf('bus')).toBe('bank');
    expect(fromOf('cab')).toBe('bus');
  });

  it('refuses a swap when the feeder has other branches, next to the source, or past a fork', () => {
    // bank feeds cab and dc-dc: cab is next to the source.
    expect(moveUpstream('cab').ok).toBe(false);
    // inv feeds two loads: moving a load upstream would move the other too.
    const r = moveUpstream('fridge');
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.message).toMatch(/other branches/);
    expect(moveDownstream('inv').ok).toBe(false);
    expect(moveDownstream('fridge').ok).toBe(false);
    expect(canUndo.value).toBe(false);
  });

  it('reorderBranch swaps display order among siblings and refuses past the ends', () => {
    expect(reorderBranch('lights', -1).ok).toBe(true);
    expect(ids().indexOf('lights')).toBeLessThan(ids().indexOf('fridge'));
    expect(reorderBranch('lights', -1).ok).toBe(false);
    expect(reorderBranch('bank', 1).ok).toBe(false);
  });

  it('reattach moves a branch and refuses a loop', () => {
    expect(reattach('dc-dc', 'cab').ok).toBe(true);
    expect(fromOf('dc-dc')).toBe('cab');
    expect(reattach('cab', 'inv').ok).toBe(false);
    expect(reattach('cab', 'cab').ok).toBe(false);
    expect(reattach('bank', 'cab').ok).toBe(false);
  });
});

describe('undo and redo', () => {
  it('round-trips every operation', () => {
    const original = structuredClone(draft.value);
    const steps: (() => unknown)[] = [
      () => addBranch('inv', { id: 'x', kind: 'ac-load', power: 10, powerFactor: 1 }),
      () => insertAfter('cab', { id: 'bus', kind: 'dc-bus', fixedLoss: 1 }),
      () => insertBefore('radio', { id: 'rc', kind: 'cable', length: 1, resistancePerKm: 1 }),
      () => duplicate('dc-dc'),
      () => moveUpstream('bus'),
      () => reorderBranch('lights', -1),
      () => reattach('dc-dc', 'bus'),
      () => removeElement('cab'),
      () => removeBranch('inv'),
    ];
    const states: unknown[] = [structuredClone(draft.value)];
    for (const s of steps) {
      s();
      states.push(structuredClone(draft.value));
    }
    expect(canUndo.value).toBe(true);
    for (let i = steps.length - 1; i >= 0; i--) {
      undo();
      expect(draft.value).toEqual(states[i]);
    }
    expect(draft.value).toEqual(original);
    expect(canUndo.value).toBe(false);
    for (let i = 1; i <= steps.length; i++) {
      redo();
      expect(draft.value).toEqual(states[i]);
    }
    expect(canRedo.value).toBe(false);
  });

  it('labels say what would be undone and redone', () => {
    removeElement('cab');
    expect(undoLabel.value).toMatch(/Removed cab/);
    undo();
    expect(redoLabel.value).toMatch(/Removed cab/);
    expect(lastChange.value).toMatch(/^Undone: Removed cab/);
    redo();
    expect(lastChange.value).toMatch(/^Redone: Removed cab/);
  });

  it('a new change after an undo drops the redo history', () => {
    removeElement('cab');
    undo();
    expect(canRedo.value).toBe(true);
    duplicate('dc-dc');
    expect(canRedo.value).toBe(false);
  });

  it('undo restores the selection of the time', () => {
    selectedId.value = 'lights';
    removeElement('lights');
    expect(selectedId.value).toBe('inv');
    undo();
    expect(selectedId.value).toBe('lights');
  });
});

describe('field edits', () => {
  it('typing into one field coalesces into one undo step', () => {
    setField('fridge', 'power', 1);
    setField('fridge', 'power', 15);
    setField('fridge', 'power', 150);
    setField('fridge', 'power', 1500);
    expect(draft.value!.elements.find((e) => e.id === 'fridge')!['power']).toBe(1500);
    undo();
    expect(draft.value!.elements.find((e) => e.id === 'fridge')!['power']).toBe(150);
    expect(canUndo.value).toBe(false);
  });

  it('a field edit copies only the element it changes and never changes an earlier draft', () => {
    const before = draft.value!;
    const snapshot = structuredClone(before);
    setField('fridge', 'power', 120);
    setField(PROJECT_LEVEL, 'name', 'renamed');
    const after = draft.value!;
    expect(after).not.toBe(before);
    // Unchanged stages are the same objects (memo'd views skip them); the edited one is new.
    for (const e of after.elements) {
      const old = before.elements.find((x) => x.id === e.id)!;
      if (e.id === 'fridge') expect(e).not.toBe(old);
      else expect(e).toBe(old);
    }
    // The draft the edits started from (kept for undo) is exactly as it was.
    expect(before).toEqual(snapshot);
    undo();
    undo();
    expect(draft.value).toEqual(snapshot);
  });

  it('a different field, or an operation in between, starts a new step', () => {
    setField('fridge', 'power', 100);
    setField('fridge', 'powerFactor', 0.9);
    setField('fridge', 'power', 120);
    undo();
    expect(draft.value!.elements.find((e) => e.id === 'fridge')!['power']).toBe(100);
    undo();
    undo();
    expect(draft.value).toEqual(chain());
  });

  it('a value the engine rejects never enters the draft; the message stays at the field', () => {
    const before = structuredClone(draft.value);
    const message = setField('fridge', 'powerFactor', 1.5);
    expect(message).toBeTruthy();
    expect(draft.value).toEqual(before);
    expect(fieldError('fridge', 'powerFactor')).toBe(message);
    expect(resultsState.value).toBe('stale');
    expect(canUndo.value).toBe(false);
    // A good value clears the message.
    expect(setField('fridge', 'powerFactor', 0.7)).toBeNull();
    expect(fieldError('fridge', 'powerFactor')).toBeUndefined();
    expect(resultsState.value).toBe('current');
  });

  it('text where a number goes is refused the same way', () => {
    const message = setField('inv', 'outputVoltage', 'two hundred');
    expect(message).toMatch(/number/);
    expect(draft.value!.elements.find((e) => e.id === 'inv')!['outputVoltage']).toBe(230);
  });

  it('edit() with a structural change the engine refuses keeps the last valid result, marked stale', () => {
    const good = lastSolved.value;
    edit('break the chain', (p) => {
      p.elements.find((e) => e.id === 'radio')!.from = 'inv'; // a DC load on an AC port
    });
    expect(outcome.value?.ok).toBe(false);
    expect(lastSolved.value).toBe(good);
    expect(resultsState.value).toBe('stale');
    undo();
    expect(resultsState.value).toBe('current');
  });
});

describe('new project', () => {
  it('starts with its source alone, selected, with no history', () => {
    newProject('Shed', { id: 'bank', kind: 'battery', voltage: 25.6, from: 'x' } as DraftElement);
    expect(draft.value!.name).toBe('Shed');
    expect(draft.value!.elements).toEqual([{ id: 'bank', kind: 'battery', voltage: 25.6 }]);
    expect(selectedId.value).toBe('bank');
    expect(canUndo.value).toBe(false);
    expect(solved()).toBe(true);
  });
});
