// Editor invariants (web/state/editor.ts) under random sequences of chain operations on the demo
// projects: every operation keeps exactly one source, unique ids, no `from` naming a missing
// element and no loop; as many undos as accepted operations give back the original project, and
// as many redos give back the final one. Structural invariants, common practice (no source).
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { demoProjects } from '../../core/index.ts';
import {
  addBranch,
  canRedo,
  canUndo,
  draft,
  duplicate,
  insertAfter,
  insertBefore,
  loadProject,
  moveDownstream,
  moveUpstream,
  redo,
  reattach,
  removeBranch,
  removeElement,
  reorderBranch,
  undo,
  type DraftElement,
  type DraftProject,
  type OperationOutcome,
} from '../../web/state/editor.ts';

const stage: DraftElement = { id: 'link', kind: 'cable', length: 2, resistancePerKm: 1 };

type Op = { name: string; a: number; b: number };
const opNames = ['addBranch', 'insertAfter', 'insertBefore', 'removeElement', 'removeBranch', 'duplicate', 'moveUpstream', 'moveDownstream', 'reorderUp', 'reorderDown', 'reattach'] as const;
const opArb: fc.Arbitrary<Op> = fc.record({ name: fc.constantFrom(...opNames), a: fc.nat(), b: fc.nat() });

function apply(op: Op): OperationOutcome {
  const els = draft.value!.elements;
  const id = els[op.a % els.length]!.id;
  const other = els[op.b % els.length]!.id;
  switch (op.name) {
    case 'addBranch':
      return addBranch(id, stage);
    case 'insertAfter':
      return insertAfter(id, stage);
    case 'insertBefore':
      return insertBefore(id, stage);
    case 'removeElement':
      return removeElement(id);
    case 'removeBranch':
      return removeBranch(id);
    case 'duplicate':
      return duplicate(id);
    case 'moveUpstream':
      return moveUpstream(id);
    case 'moveDownstream':
      return moveDownstream(id);
    case 'reorderUp':
      return reorderBranch(id, -1);
    case 'reorderDown':
      return reorderBranch(id, 1);
    default:
      return reattach(id, other);
  }
}

/** One source, unique ids, every `from` names an element, and following `from` always ends at the source. */
function checkShape(p: DraftProject): void {
  const byId = new Map(p.elements.map((e) => [e.id, e]));
  expect(byId.size).toBe(p.elements.length);
  const roots = p.elements.filter((e) => e.from === undefined);
  expect(roots).toHaveLength(1);
  expect(['grid', 'generator', 'battery']).toContain(roots[0]!.kind);
  for (const e of p.elements) {
    if (e.from !== undefined) expect(byId.has(e.from), `${e.id}.from = ${e.from}`).toBe(true);
    let at: DraftElement | undefined = e;
    let steps = 0;
    while (at && at.from !== undefined && steps <= p.elements.length) {
      at = byId.get(at.from);
      steps++;
    }
    expect(at?.from, `${e.id} reaches the source`).toBeUndefined();
    expect(steps).toBeLessThanOrEqual(p.elements.length);
  }
}

describe('chain operations on the demos', () => {
  it.each(demoProjects.map((d) => [d.id, d] as const))('%s: shape kept by every operation; undo all gives back the original, redo all the final', (_id, demo) => {
    fc.assert(
      fc.property(fc.array(opArb, { minLength: 1, maxLength: 25 }), (ops) => {
        loadProject(demo.project as unknown as DraftProject, { kind: 'demo', title: demo.title });
        const original = structuredClone(draft.value);
        let accepted = 0;
        for (const op of ops) {
          const before = structuredClone(draft.value);
          const r = apply(op);
          if (r.ok) accepted++;
          else expect(draft.value).toEqual(before); // a refusal changes nothing
          checkShape(draft.value!);
        }
        const final = structuredClone(draft.value);
        for (let i = 0; i < accepted; i++) undo();
        expect(canUndo.value).toBe(false);
        expect(draft.value).toEqual(original);
        for (let i = 0; i < accepted; i++) redo();
        expect(canRedo.value).toBe(false);
        expect(draft.value).toEqual(final);
      }),
      { numRuns: 40 },
    );
    // Every accepted operation re-solves the draft (the editor's results follow it): seconds, not milliseconds.
  }, 60_000);
});
