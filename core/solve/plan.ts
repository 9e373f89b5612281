/**
 * Step 2 of the solve: order the tree from its one source, check that every element is fed from a
 * port of a kind it accepts, and build each element's model. Elements that hang off a bad `from`
 * or a loop are not reached; `validate` reports those, so `plan` may run beside its problems.
 */
import type { Element, Project } from '../model.ts';
import type { Problem } from '../errors.ts';
import { KINDS, type ElementModel, type KindSpec, type PortInfo } from '../stages/index.ts';

export interface PlannedElement {
  element: Element;
  spec: KindSpec;
  model: ElementModel;
  /** Index of the feeding element in the plan, −1 for the source. */
  parent: number;
  children: number[];
  /** The port feeding this element (null for the source). */
  input: PortInfo | null;
}

export type Plan = { ok: true; order: PlannedElement[] } | { ok: false; problems: Problem[] };

const KIND_NAMES: Record<string, string> = { dc: 'DC', ac1: 'single-phase AC', ac3: 'three-phase AC', shaft: 'a motor shaft' };

/** Depth-first order from the source; children in the order they appear in the file. */
export function plan(project: Project): Plan {
  const problems: Problem[] = [];
  const children = new Map<string, Element[]>();
  let source: Element | undefined;
  for (const e of project.elements) {
    if (!('from' in e)) {
      source ??= e;
      continue;
    }
    const siblings = children.get(e.from);
    if (siblings) siblings.push(e);
    else children.set(e.from, [e]);
  }
  const order: PlannedElement[] = [];
  const visit = (e: Element, parent: number, input: PortInfo | null): void => {
    const spec = KINDS.get(e.kind)!;
    if (input) {
      const accepted = spec.accepts(e);
      if (!accepted.includes(input.kind)) {
        problems.push({
          code: 'kind-mismatch',
          elementId: e.id,
          field: 'from',
          value: 'from' in e ? e.from : undefined,
          message: `is fed ${KIND_NAMES[input.kind]} but takes ${accepted.map((k) => KIND_NAMES[k]).join(' or ')}`,
        });
        return; // what hangs below cannot be built without this element's output port
      }
    }
    const model = spec.build(e, input);
    for (const p of model.problems ?? []) problems.push({ ...p, elementId: e.id });
    const index = order.length;
    order.push({ element: e, spec, model, parent, children: [], input });
    if (parent >= 0) order[parent]!.children.push(index);
    for (const child of children.get(e.id) ?? []) visit(child, index, model.out);
  };
  if (source) visit(source, -1, null);
  return problems.length ? { ok: false, problems } : { ok: true, order };
}
