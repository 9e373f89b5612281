// The chain editor offers on the selected card only the operations that fit it (web/components/chain/tools.ts):
// for every element of every demo, an operation is offered exactly when the editor's own operation
// (web/state/chain-ops.ts) carries it out, and an add operation exactly when its chooser would hold at
// least one kind (web/editor/templates.ts); "Remove branch" only where it differs from "Remove". Behaviour checks, not values from a source: common
// practice (no source).
import { describe, expect, it } from 'vitest';
import { demoProjects } from '../../core/index.ts';
import { addBankOnBus, CARD_ACTIONS, fittingActions, PRIMARY_ACTIONS, type CardAction } from '../../web/components/chain/tools.ts';
import { offeredTemplates } from '../../web/editor/templates.ts';
import {
  draft,
  duplicate,
  loadProject,
  moveDownstream,
  moveUpstream,
  removeBranch,
  removeElement,
  reorderBranch,
  type DraftProject,
  type OperationOutcome,
} from '../../web/state/editor.ts';

const RUN: Record<Exclude<CardAction, 'after' | 'branch' | 'before'>, (id: string) => OperationOutcome> = {
  remove: removeElement,
  removeBranch,
  duplicate,
  upstream: moveUpstream,
  downstream: moveDownstream,
  branchUp: (id) => reorderBranch(id, -1),
  branchDown: (id) => reorderBranch(id, 1),
  addBank: (id) => addBankOnBus(draft.value!, id),
};

function open(project: unknown): DraftProject {
  loadProject(structuredClone(project) as DraftProject, { kind: 'new', title: 'test' });
  return draft.value!;
}

describe('the selected card’s tools', () => {
  for (const demo of demoProjects) {
    it(`offers on each element of ${demo.id} exactly the operations that fit it`, () => {
      const ids = demo.project.elements.map((e) => e.id);
      for (const id of ids) {
        const fits = new Set(fittingActions(open(demo.project), id));
        for (const action of CARD_ACTIONS) {
          const p = open(demo.project);
          let done: boolean;
          if (action === 'after' || action === 'branch' || action === 'before') done = offeredTemplates(p, action, id).length > 0;
          // "Remove branch" on a card that feeds nothing would do what "Remove" does: it is not offered twice.
          else if (action === 'removeBranch') done = p.elements.some((e) => e.from === id) && RUN[action](id).ok;
          else done = RUN[action](id).ok;
          expect(fits.has(action), `${demo.id}, ${id}: ${action}`).toBe(done);
        }
      }
    });
  }

  it('offers nothing to add after or beside a load, nothing before or around the source', () => {
    const demo = demoProjects.find((d) => d.id === 'hillside-relay-hut')!;
    const p = open(demo.project);
    const root = p.elements.find((e) => e.from === undefined)!;
    const fedIds = new Set(p.elements.map((e) => e.from));
    const leaves = p.elements.filter((e) => !fedIds.has(e.id));
    expect(leaves.length).toBeGreaterThan(0);
    for (const leaf of leaves.filter((e) => /load/.test(e.kind))) {
      const a = fittingActions(p, leaf.id);
      expect(a).not.toContain('after');
      expect(a).not.toContain('branch');
      expect(a).toContain('remove');
    }
    const atRoot = fittingActions(p, root.id);
    for (const a of ['before', 'remove', 'removeBranch', 'duplicate', 'upstream', 'downstream', 'branchUp', 'branchDown'] as const) expect(atRoot).not.toContain(a);
    expect(PRIMARY_ACTIONS.length).toBeLessThan(CARD_ACTIONS.length);
  });
});

describe('a battery bank on a DC bus (issue 19)', () => {
  // A 48 V DC plant: supply → rectifier holding 54 V → DC bus → 500 W of DC loads (invented for the test).
  const plant = {
    format: 'joulepath-project',
    version: 2,
    name: 'DC plant',
    elements: [
      { id: 'supply', name: 'Supply', kind: 'grid', phases: 1, voltage: 230, frequency: 50 },
      { id: 'rect', name: 'Rectifier', kind: 'rectifier', from: 'supply', outputVoltage: 54, inputPowerFactor: 0.95, loss: { model: 'constant', efficiency: 0.92 } },
      { id: 'bus', name: 'DC bus', kind: 'dc-bus', from: 'rect', fixedLoss: 5 },
      { id: 'load', name: 'Radios', kind: 'dc-load', from: 'bus', power: 500 },
    ],
  };

  it('is offered on the DC bus card only, once, and the chain then solves in both modes', async () => {
    const p = open(plant);
    expect(fittingActions(p, 'bus')).toContain('addBank');
    for (const id of ['supply', 'rect', 'load']) expect(fittingActions(p, id)).not.toContain('addBank');
    expect(addBankOnBus(p, 'bus').ok).toBe(true);
    const withBank = draft.value!;
    const bank = withBank.elements.find((e) => e.kind === 'battery')!;
    expect(bank.from).toBe('bus');
    // 54 V float ÷ (6 cells × 2.27 V per cell, VRLA float at 25 °C: common practice (no source)) = 3.97 → 4 blocks of 12 V (a 48 V plant's 24 cells).
    expect((bank['bank'] as { series: number }).series).toBe(4);
    expect(bank.name).toBe('Battery bank, 4 × 12 V 100 Ah');
    // One bank on a bus per project (core/solve/structure.ts): not offered again.
    expect(fittingActions(withBank, 'bus')).not.toContain('addBank');
    expect(addBankOnBus(withBank, 'bus').ok).toBe(false);
    const { solveProject, solveModes } = await import('../../core/index.ts');
    const solved = solveProject(withBank);
    expect(solved.ok).toBe(true);
    const modes = solved.ok ? solveModes(solved) : null;
    expect(modes?.battery.ok).toBe(true);
    // On battery the bank carries the 500 W of loads (the test's own figure).
    if (modes?.battery.ok) expect(modes.battery.result.totals.loadPower).toBeCloseTo(500, 6);
  });
});
