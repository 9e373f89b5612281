/**
 * Step 2 of the solve: order the tree from its one source, check that every element is fed from a
 * port of a kind it accepts, and build each element's model. Elements that hang off a bad `from`
 * or a loop are not reached; `validate` reports those, so `plan` may run beside its problems.
 */
import type { Element, Project } from '../model/project.ts';
import type { Problem } from '../model/errors.ts';
import { KINDS, type ElementModel, type KindSpec, type PortInfo } from '../kinds/index.ts';
import { isPureModel } from '../kinds/models.ts';

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

/**
 * The models built for elements, by element object, when they keep nothing between calls
 * (`isPureModel`, core/kinds/models.ts): a variant keeps the objects of the elements it does not
 * change, so a study's samples and candidates build only the models of what they change. An entry
 * serves only the same kind spec fed the same port (kind, frequency, speed: all a build reads of it).
 * The engine never mutates an element (its inputs are never mutated), so a model stays true to it.
 */
const builtModels = new WeakMap<Element, { spec: KindSpec; input: PortInfo | null; model: ElementModel }>();

const samePort = (a: PortInfo | null, b: PortInfo | null): boolean =>
  a === b || (a !== null && b !== null && a.kind === b.kind && a.frequency === b.frequency && a.speed === b.speed);

/** The model kept for `e` when it may serve this spec fed this port (see `builtModels`), else undefined. */
function keptModel(spec: KindSpec, e: Element, input: PortInfo | null): ElementModel | undefined {
  const hit = builtModels.get(e);
  return hit !== undefined && hit.spec === spec && samePort(hit.input, input) ? hit.model : undefined;
}

function buildModel(spec: KindSpec, e: Element, input: PortInfo | null, reuse: boolean): ElementModel {
  const model = spec.build(e, input);
  if (reuse && isPureModel(model)) builtModels.set(e, { spec, input, model });
  return model;
}

/**
 * Depth-first order from the source; children in the order they appear in the file. Linear in the
 * elements. With `reuseModels`, the models of elements planned before are reused (see
 * `builtModels`): worth it for the elements of a solved project that variants solve again, not for
 * a file's elements fresh from validation, which are solved once.
 */
export function plan(project: Project, reuseModels = false): Plan {
  const problems: Problem[] = [];
  const elements = project.elements;
  const n = elements.length;
  // The elements each id feeds, as places in `elements` (in file order), and the source's place.
  const children = new Map<string, number[]>();
  let source = -1;
  for (let i = 0; i < n; i++) {
    const from = (elements[i] as { from?: string }).from;
    if (from === undefined) {
      if (source < 0) source = i;
      continue;
    }
    const siblings = children.get(from);
    if (siblings) siblings.push(i);
    else children.set(from, [i]);
  }
  const order: PlannedElement[] = [];
  // Depth-first without recursion (a chain may be thousands of elements deep): a stack of the
  // elements still to visit (their places, feeders' indices in the plan and input ports, in three
  // arrays), children pushed last-first so they come off in file order.
  const stack: number[] = [];
  const stackParent: number[] = [];
  const stackInput: (PortInfo | null)[] = [];
  if (source >= 0) {
    stack.push(source);
    stackParent.push(-1);
    stackInput.push(null);
  }
  // Each element is placed once: with duplicate ids (refused by validate, beside which plan may run)
  // an element could otherwise be reached again through its own id.
  const placed: boolean[] = new Array<boolean>(n).fill(false);
  while (stack.length) {
    const at = stack.pop()!;
    const parent = stackParent.pop()!;
    const input = stackInput.pop()!;
    if (placed[at]) continue;
    placed[at] = true;
    const e = elements[at]!;
    const spec = KINDS.get(e.kind)!;
    // A kept model was built for this element object, kind spec and input port, which the ports
    // check below passed then and would pass again (`accepts` reads only the element): no check.
    const kept = reuseModels ? keptModel(spec, e, input) : undefined;
    if (kept === undefined && input) {
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
    const model = kept ?? buildModel(spec, e, input, reuseModels);
    if (model.problems !== undefined) for (const p of model.problems) problems.push({ ...p, elementId: e.id });
    const index = order.length;
    const role = input !== null && spec.fedRole !== undefined ? spec.fedRole : spec.role;
    order.push({ element: e, spec, role, model, parent, children: [], input });
    if (parent >= 0) order[parent]!.children.push(index);
    // An element with no output (a load) feeds nothing: what names it as its feed is refused by
    // validate ("not-a-feeder") and not built here (it would be built without an input port).
    const below = model.out ? children.get(e.id) : undefined;
    if (below !== undefined) {
      for (let k = below.length - 1; k >= 0; k--) {
        stack.push(below[k]!);
        stackParent.push(index);
        stackInput.push(model.out);
      }
    }
  }
  return problems.length ? { ok: false, problems } : { ok: true, order };
}
