/**
 * Solve step between validate and report: give every cable with a `conductor` spec its impedance
 * (and, for size "auto", its size) and find the operating point with those conductors in place.
 *
 * Method (outer fixed point around the chain solve, plan.ts + sweep.ts unchanged):
 * 1. Solve the chain with the auto-sized links ideal (R = X = 0): the lowest current they can carry.
 * 2. For each conductor link, at that operating point, pick the smallest size meeting ampacity,
 *    protection and voltage drop (core/conductors/size.ts; the drop from the exact two-bus solution
 *    at the link's sending voltage and delivered power), never smaller than the size of the
 *    previous pass; its resistance at the temperature the current sets.
 * 3. Put those R and X into the chain and solve again. A link's drop raises the current it and the
 *    links upstream carry (constant-power loads), which may call for a larger size.
 * 4. Stop when no size changed and no resistance moved by more than 1e-10 (relative) since the
 *    previous pass: the result is then self-consistent (the sizes were checked at the very
 *    operating point reported). Sizes only grow and the ladder is finite, so the sizes settle
 *    within Σ(ladder lengths) passes; after that only the temperature estimate moves, a strong
 *    contraction (the current moves by about the drop fraction of a change in R). The pass count
 *    is capped anyway (no-convergence).
 */
import type { CableStage, ConductorSpec, Element, Project } from '../model.ts';
import type { Problem } from '../errors.ts';
import type { ConductorResult, SolveResult, SolveWarning } from '../result.ts';
import { type ConductorCatalogue, defaultCatalogue } from '../conductors/catalogue.ts';
import { type PreparedConductor, prepareConductor } from '../conductors/prepare.ts';
import { type Choice, choose, conductorResult } from '../conductors/size.ts';
import { type ResolvedLimits, linkLimit, pathDrops, resolveLimits } from '../conductors/path-drop.ts';
import { type Plan, type PlannedElement, plan } from './plan.ts';
import { type OperatingPoint, sweep } from './sweep.ts';

/** Relative change of a conductor's resistance between passes below which the sizing stops. */
export const R_TOLERANCE = 1e-10;

interface Link {
  element: CableStage;
  spec: ConductorSpec;
  prepared: PreparedConductor;
  limitPercent: number;
  /** Position on the prepared ladder, −1 before the first choice. */
  position: number;
  /** Per-metre resistance and reactance of one conductor put into the solve. */
  r: number;
  x: number;
  choice?: Extract<Choice, { ok: true }>;
}

export type Sized =
  | { ok: true; order: PlannedElement[]; point: OperatingPoint; links: ReadonlyMap<string, LinkOutcome>; passes: number; limits: ResolvedLimits }
  | { ok: false; problems: Problem[] };

export interface LinkOutcome {
  link: Link;
  index: number;
}

const hasConductor = (e: Element): e is CableStage & { conductor: ConductorSpec } => e.kind === 'cable' && e.conductor !== undefined;

/** The project with each conductor link's spec replaced by the explicit impedance of its chosen size. */
function resolve(project: Project, links: ReadonlyMap<string, { r: number; x: number }>): Project {
  return {
    ...project,
    elements: project.elements.map((e) => {
      const link = links.get(e.id);
      if (!link || e.kind !== 'cable') return e;
      const { conductor: _spec, ...rest } = e;
      return { ...rest, resistancePerKm: link.r * 1000, reactancePerKm: link.x * 1000 };
    }),
  };
}

const indexOf = (order: readonly PlannedElement[], id: string): number => order.findIndex((n) => n.element.id === id);

/** Size the conductor links and solve the chain with them in place. */
export function sizeConductors(project: Project, catalogue: ConductorCatalogue = defaultCatalogue): Sized {
  const specs = project.elements.filter(hasConductor);
  const limits = resolveLimits(project.dropLimits);
  if (specs.length === 0) {
    const planned = plan(project);
    if (!planned.ok) return planned;
    const swept = sweep(planned.order);
    return swept.ok ? { ok: true, order: planned.order, point: swept.point, links: new Map(), passes: 0, limits } : swept;
  }
  // Pass 0: conductor links ideal, to learn their port kinds and the lowest currents.
  const planned: Plan = plan(resolve(project, new Map(specs.map((e) => [e.id, { r: 0, x: 0 }]))));
  if (!planned.ok) return planned;
  const links = new Map<string, Link>();
  const problems: Problem[] = [];
  for (const e of specs) {
    const node = planned.order[indexOf(planned.order, e.id)];
    if (!node?.input) continue; // not reached from the source: plan has reported why
    const prepared = prepareConductor(e, e.conductor, node.input.kind, catalogue);
    if (!prepared.ok) problems.push(...prepared.problems);
    else links.set(e.id, { element: e, spec: e.conductor, prepared: prepared.prepared, limitPercent: linkLimit(e.conductor.maxDropPercent, limits), position: -1, r: 0, x: 0 });
  }
  if (problems.length) return { ok: false, problems };

  const maxPasses = [...links.values()].reduce((n, l) => n + l.prepared.candidates.length, 0) + 100;
  let order = planned.order;
  for (let pass = 1; pass <= maxPasses; pass++) {
    const swept = sweep(order);
    if (!swept.ok) return swept;
    const point = swept.point;
    let changed = false;
    for (const link of links.values()) {
      const i = indexOf(order, link.element.id);
      const node = order[i]!;
      const vIn = point.vOut[node.parent]!;
      const choice = choose(link.prepared, link.element, link.limitPercent, vIn, point.sOut[i]!, Math.max(link.position, 0));
      if (!choice.ok) {
        problems.push({ code: 'no-size-fits', elementId: link.element.id, field: choice.field, value: choice.value, message: choice.message });
        continue;
      }
      const position = link.prepared.candidates.indexOf(choice.chosen.candidate);
      const r = choice.chosen.r;
      const x = link.prepared.kind === 'dc' ? 0 : choice.chosen.candidate.x;
      link.choice = choice;
      if (position !== link.position || Math.abs(r - link.r) > R_TOLERANCE * r || x !== link.x) {
        changed = true;
        link.position = position;
        link.r = r;
        link.x = x;
      }
    }
    if (problems.length) return { ok: false, problems };
    if (!changed) {
      const outcomes = new Map([...links.values()].map((l) => [l.element.id, { link: l, index: indexOf(order, l.element.id) }]));
      return { ok: true, order, point, links: outcomes, passes: pass, limits };
    }
    const replanned = plan(resolve(project, links));
    if (!replanned.ok) return replanned;
    order = replanned.order;
  }
  return {
    ok: false,
    problems: [
      { code: 'no-convergence', elementId: 'project', field: '', message: `the conductor sizes did not settle within ${maxPasses} passes of the chain solve` },
    ],
  };
}

/** Add each conductor link's sizing and the whole-path drops to a built result. */
export function attachConductors(result: SolveResult, sized: Extract<Sized, { ok: true }>): SolveResult {
  const warnings: SolveWarning[] = [...result.warnings];
  const limits = sized.limits;
  const own = new Map<string, number>();
  const elements = result.elements.map((r) => {
    const outcome = sized.links.get(r.id);
    if (!outcome) return r;
    const { link, index } = outcome;
    own.set(r.id, link.limitPercent);
    const node = sized.order[index]!;
    const p = sized.point;
    const conductor: ConductorResult = conductorResult(link.prepared, link.element, link.choice!, link.limitPercent, p.vOut[node.parent]!, p.vOut[index]!, p.sOut[index]!, link.r, r.loss);
    if (!link.prepared.auto) {
      const ev = link.choice!.chosen;
      const fails: string[] = [];
      if (!ev.ampacityOk) fails.push(`carries ${conductor.current.toFixed(1)} A, above its ampacity of ${conductor.ampacity.total.toFixed(1)} A`);
      if (!ev.device.ok) fails.push(ev.device.note);
      if (conductor.drop.exactPercent > link.limitPercent * (1 + 1e-12)) fails.push(`drops ${conductor.drop.exactPercent.toFixed(2)} %, above the allowed ${link.limitPercent} %`);
      if (fails.length) warnings.push({ code: 'conductor-check', elementId: r.id, message: `${conductor.size} ${conductor.material}: ${fails.join('; ')}` });
    }
    return { ...r, conductor };
  });
  return { ...result, elements, warnings, voltageDrop: pathDrops(elements, limits, own) };
}
