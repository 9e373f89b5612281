/**
 * Step 2 of the solve: order the tree from its one source, check that every element is fed from a
 * port of a kind it accepts, and build each element's model.
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

const fromOf = (e: Element): string | undefined => ('from' in e ? e.from : undefined);

/** Depth-first order from the source; children in the order they appear in the file. */
export function plan(project: Project): Plan {
  const problems: Problem[] = [];
  const byId = new Map(project.elements.map((e) => [e.id, e]));
  const sources = project.elements.filter((e) => KINDS.get(e.kind)!.role === 'source');
  if (sources.length === 0) {
    return { ok: false, problems: [{ code: 'missing-source', elementId: 'project', field: 'elements', message: 'needs one source (grid, generator or battery) to feed the chain' }] };
  }
  if (sources.length > 1) {
    for (const s of sources.slice(1)) {
      problems.push({ code: 'several-sources', elementId: s.id, field: 'kind', value: s.kind, message: `a chain has one source; "${sources[0]!.id}" is already the source` });
    }
  }
  const children = new Map<string, Element[]>();
  for (const e of project.elements) {
    const from = fromOf(e);
    if (from === undefined) continue;
    const feeder = byId.get(from);
    if (!feeder) {
      problems.push({ code: 'unknown-feed', elementId: e.id, field: 'from', value: from, message: `no element has the id "${from}"` });
      continue;
    }
    if (KINDS.get(feeder.kind)!.role === 'load') {
      problems.push({ code: 'not-a-feeder', elementId: e.id, field: 'from', value: from, message: `"${from}" is a load and feeds nothing` });
      continue;
    }
    children.set(from, [...(children.get(from) ?? []), e]);
  }
  if (problems.length) return { ok: false, problems };

  const order: PlannedElement[] = [];
  const visit = (e: Element, parent: number, input: PortInfo | null): void => {
    const spec = KINDS.get(e.kind)!;
    if (input) {
      const accepted = spec.accepts(e as never);
      if (!accepted.includes(input.kind)) {
        problems.push({
          code: 'kind-mismatch',
          elementId: e.id,
          field: 'from',
          value: fromOf(e),
          message: `is fed ${KIND_NAMES[input.kind]} but takes ${accepted.map((k) => KIND_NAMES[k]).join(' or ')}`,
        });
        return;
      }
    }
    const model = spec.build(e as never, input);
    const index = order.length;
    order.push({ element: e, spec, model, parent, children: [], input });
    if (parent >= 0) order[parent]!.children.push(index);
    for (const child of children.get(e.id) ?? []) visit(child, index, model.out);
  };
  visit(sources[0]!, -1, null);

  // Anything not reached hangs off a loop of `from` references.
  const reached = new Set(order.map((p) => p.element.id));
  for (const e of project.elements) {
    if (reached.has(e.id)) continue;
    const path = [e.id];
    let cur = fromOf(e);
    while (cur !== undefined && !path.includes(cur)) {
      path.push(cur);
      cur = fromOf(byId.get(cur)!);
    }
    if (cur === e.id) {
      problems.push({ code: 'cycle', elementId: e.id, field: 'from', value: fromOf(e), message: `is part of a loop (${[...path, e.id].join(' → ')}); a chain must be a tree fed from its source` });
    } else if (!problems.some((p) => p.code === 'kind-mismatch')) {
      problems.push({ code: 'cycle', elementId: e.id, field: 'from', value: fromOf(e), message: 'is not connected to the source (it hangs off a loop)' });
    }
  }
  return problems.length ? { ok: false, problems } : { ok: true, order };
}
