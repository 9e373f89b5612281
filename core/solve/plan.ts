/**
 * Step 2 of the solve: order the tree from its one source, check that every element is fed from a
 * port of a kind it accepts, and build each element's model. Elements that hang off a bad `from`
 * or a loop are not reached; `validate` reports those, so `plan` may run beside its problems.
 */
import type { Element, Project } from '../model/project.ts';
import type { Problem } from '../model/errors.ts';
import { KINDS, type ElementModel, type KindSpec, type PortInfo } from '../kinds/index.ts';

export interface PlannedElement {
  element: Element;
  spec: KindSpec;
  /** What the element is in this chain: its kind's role, or its `fedRole` when a source kind is fed (a bank on a bus). */
  role: KindSpec['role'];
  model: ElementModel;
  /** Index of the feeding element in the plan, −1 for the source. */
  parent: number;
  children: number[];
  /** The port feeding this element (null for the source). */
  input: PortInfo | null;
}

export type Plan = { ok: true; order: PlannedElement[] } | { ok: false; problems: Problem[] };

const KIND_NAMES: Record<string, string> = { dc: 'DC', ac1: 'single-phase AC', ac3: 'three-phase AC', shaft: 'a motor shaft' };

/** Depth-first order from the source; children in the order they appear in the file. Linear in the elements. */
export function plan(project: Project): Plan {
  const problems: Problem[] = [];
  const children = new Map<string, Element[]>();
  let source: Element | undefined;
  for (const e of project.elements) {
    if (!('from' in e) || e.from === undefined) {
      source ??= e;
      continue;
    }
    const siblings = children.get(e.from);
    if (siblings) siblings.push(e);
    else children.set(e.from, [e]);
  }
  const order: PlannedElement[] = [];
  // Depth-first without recursion (a chain may be thousands of elements deep): a stack of the
  // elements still to visit, children pushed last-first so they come off in file order.
  const stack: { e: Element; parent: number; input: PortInfo | null }[] = source ? [{ e: source, parent: -1, input: null }] : [];
  // Each element is placed once: with duplicate ids (refused by validate, beside which plan may run)
  // an element could otherwise be reached again through its own id.
  const placed = new Set<Element>();
  while (stack.length) {
    const { e, parent, input } = stack.pop()!;
    if (placed.has(e)) continue;
    placed.add(e);
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
        continue; // what hangs below cannot be built without this element's output port
      }
    }
    const model = spec.build(e, input);
    for (const p of model.problems ?? []) problems.push({ ...p, elementId: e.id });
    const index = order.length;
    const role = input !== null && spec.fedRole !== undefined ? spec.fedRole : spec.role;
    order.push({ element: e, spec, role, model, parent, children: [], input });
    if (parent >= 0) order[parent]!.children.push(index);
    // An element with no output (a load) feeds nothing: what names it as its feed is refused by
    // validate ("not-a-feeder") and not built here (it would be built without an input port).
    const below = model.out ? (children.get(e.id) ?? []) : [];
    for (let k = below.length - 1; k >= 0; k--) stack.push({ e: below[k]!, parent: index, input: model.out });
  }
  return problems.length ? { ok: false, problems } : { ok: true, order };
}
