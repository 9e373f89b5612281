/**
 * Solve step between validate and report: give every cable with a `conductor` spec its size and
 * impedance, and find the operating point with those conductors in place.
 *
 * Method:
 * 1. Nominal solve: the chain with every conductor link and every source impedance ideal, so each
 *    system sits at its nominal voltage. It gives each link's power; the design current is that
 *    power at the nominal voltage of the link's system, or the equipment rule the link's load calls
 *    for (core/conductors/design-current.ts).
 * 2. Sizing, once per link, from the design current alone: ampacity, protective device and the drop
 *    check by the code's own method (core/conductors/size.ts). Nothing here depends on the solved
 *    operating point, so a size never grows because an earlier pass saw a sagged voltage, and the
 *    governing rule is what the next smaller size fails.
 * 3. Operating solve with the chosen sizes: each conductor's resistance at its estimated temperature,
 *    which depends on the current the solve finds; a short fixed point (the current moves by about the
 *    drop fraction of a change in R, a strong contraction) until no resistance moves by 1e-10
 *    (relative). Sizes do not change in this step.
 */
import type { CableStage, ConductorSpec, Element, Project } from '../model/project.ts';
import type { Problem } from '../model/errors.ts';
import { PROJECT_LEVEL } from '../model/errors.ts';
import type { ConductorResult, ElementResult, PathDrop, SolveResult, SolveWarning } from '../model/result.ts';
import { abs } from '../physics/complex.ts';
import { type ConductorCatalogue, defaultCatalogue } from '../conductors/catalogue.ts';
import { type PreparedConductor, prepareConductor } from '../conductors/prepare.ts';
import { type Choice, type LinkAngle, choose, resistanceAt, temperatureAt } from '../conductors/size.ts';
import { conductorResult } from '../conductors/link-result.ts';
import { type DesignContext, type DesignCurrent, designCurrent } from '../conductors/design-current.ts';
import { type ResolvedLimits, linkLimit, pathDrops, resolveLimits } from '../conductors/path-drop.ts';
import { KINDS, type NominalPort } from '../kinds/index.ts';
import { type Plan, type PlannedElement, plan } from './plan.ts';
import { type OperatingPoint, sweep } from './sweep.ts';
import { sigText } from '../model/message.ts';

/** Relative change of a conductor's resistance between passes below which the solve stops. */
export const R_TOLERANCE = 1e-10;
const MAX_PASSES = 200;
/** Highest conductor temperature the operating estimate is carried to, °C (far past any insulation rating). */
export const T_CAP = 250;

interface Link {
  element: CableStage;
  spec: ConductorSpec;
  prepared: PreparedConductor;
  limitPercent: number;
  design: DesignCurrent;
  nominal: number;
  angle: LinkAngle;
  choice: Extract<Choice, { ok: true }>;
  /** Per-metre resistance and reactance of one conductor put into the solve. */
  r: number;
  x: number;
  temperature: number;
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

/**
 * The project with conductor links ideal and every source stiff (its kind's `ideal` trait): each
 * system at its nominal voltage.
 */
function nominalProject(project: Project, specs: readonly CableStage[]): Project {
  const base = resolve(project, new Map(specs.map((e) => [e.id, { r: 0, x: 0 }])));
  return {
    ...base,
    elements: base.elements.map((e): Element => KINDS.get(e.kind)?.ideal?.(e) ?? e),
  };
}

/**
 * Nominal voltage of each element's output, V (line-to-line on three-phase), walking down the plan:
 * each kind's `nominalOutput` trait (its set-point or rating; a cable or bus passes on what feeds
 * it; a battery bank gives cells in series × the chemistry's nominal cell voltage, NEC 480.2), 0
 * where there is none (loads, a motor's shaft).
 */
function nominalVoltages(order: readonly PlannedElement[]): number[] {
  const ports: (NominalPort | null)[] = [];
  return order.map((n, i) => {
    const input = n.parent >= 0 ? ports[n.parent]! : null;
    ports[i] = n.spec.nominalOutput?.(n.element, input) ?? null;
    return ports[i]?.voltage ?? 0;
  });
}

/** Place of each element in a plan, by id (one Map per plan: a lookup per link stays constant-time). */
const indexById = (order: readonly PlannedElement[]): Map<string, number> => new Map(order.map((n, i) => [n.element.id, i]));

/** Size the conductor links and solve the chain with them in place (`reuseModels`: see `plan`). */
export function sizeConductors(project: Project, catalogue: ConductorCatalogue = defaultCatalogue, reuseModels = false): Sized {
  const limits = resolveLimits(project.dropLimits);
  // (A list of the links to size is made only when there is one: most chains give every cable's impedance.)
  const specs = project.elements.some(hasConductor) ? project.elements.filter(hasConductor) : [];
  if (specs.length === 0) {
    const planned = plan(project, reuseModels);
    if (!planned.ok) return planned;
    const swept = sweep(planned.order);
    return swept.ok ? { ok: true, order: planned.order, point: swept.point, links: new Map(), passes: 0, limits } : swept;
  }
  // 1. Nominal solve: conductor links and sources ideal.
  const nominalPlan: Plan = plan(nominalProject(project, specs), reuseModels);
  if (!nominalPlan.ok) return nominalPlan;
  const nominalSwept = sweep(nominalPlan.order);
  if (!nominalSwept.ok) return nominalSwept;
  const order0 = nominalPlan.order;
  const vNom = nominalVoltages(order0);
  const children = new Map<string, Element[]>();
  for (const e of project.elements) {
    if (!('from' in e) || e.from === undefined) continue;
    const siblings = children.get(e.from);
    if (siblings) siblings.push(e);
    else children.set(e.from, [e]);
  }
  const ctx: DesignContext = {
    project,
    children,
    byId: new Map(project.elements.map((e) => [e.id, e])),
    sIn: new Map(order0.map((n, i) => [n.element.id, nominalSwept.point.sIn[i]!])),
    nominal: new Map(order0.filter((n) => n.parent >= 0).map((n) => [n.element.id, vNom[n.parent]!])),
    portKind: new Map(order0.filter((n) => n.input).map((n) => [n.element.id, n.input!.kind])),
  };

  // 2. Sizing from the design current, once.
  const links = new Map<string, Link>();
  const problems: Problem[] = [];
  const at0 = indexById(order0);
  for (const e of specs) {
    const i = at0.get(e.id) ?? -1;
    const node = order0[i];
    if (!node?.input) continue; // not reached from the source: plan has reported why
    const kind = node.input.kind;
    const prepared = prepareConductor(e, e.conductor, kind, catalogue);
    if (!prepared.ok) {
      problems.push(...prepared.problems);
      continue;
    }
    const dc = designCurrent(ctx, e, e.conductor, kind);
    if (!dc.ok) {
      problems.push({ code: 'invalid-value', elementId: e.id, field: dc.field, value: dc.value, message: dc.message });
      continue;
    }
    const s = nominalSwept.point.sIn[i]!;
    const sMag = abs(s);
    const angle: LinkAngle = sMag > 0 ? { cos: s.re / sMag, sin: s.im / sMag } : { cos: 1, sin: 0 };
    const nominal = vNom[node.parent]!;
    const limitPercent = linkLimit(e.conductor.maxDropPercent, limits);
    const choice = choose(prepared.prepared, e, dc.design, limitPercent, nominal, angle);
    if (!choice.ok) {
      problems.push({ code: 'no-size-fits', elementId: e.id, field: choice.field, value: choice.value, message: choice.message });
      continue;
    }
    const cand = choice.chosen.candidate;
    const p = prepared.prepared;
    // Start the operating solve at the temperature the design current would give.
    const t0 = temperatureAt(p, cand, Math.min(dc.design.base, cand.corrected * p.parallelSets) / p.parallelSets);
    links.set(e.id, {
      element: e,
      spec: e.conductor,
      prepared: p,
      limitPercent,
      design: dc.design,
      nominal,
      angle,
      choice,
      r: resistanceAt(p, cand, t0),
      x: kind === 'dc' ? 0 : cand.x,
      temperature: t0,
    });
  }
  if (problems.length) return { ok: false, problems };

  // 3. Operating solve: resistance at the estimated temperature, sizes fixed.
  for (let pass = 1; pass <= MAX_PASSES; pass++) {
    const planned = plan(resolve(project, links), reuseModels);
    if (!planned.ok) return planned;
    const order = planned.order;
    const swept = sweep(order);
    if (!swept.ok) return swept;
    const point = swept.point;
    const at = indexById(order);
    let changed = false;
    for (const link of links.values()) {
      const i = at.get(link.element.id)!;
      const m = link.prepared.kind === 'ac3' ? 3 : 1;
      const vr = abs(point.vOut[i]!);
      const current = vr > 0 ? abs(point.sOut[i]!) / m / vr : 0;
      const cand = link.choice.chosen.candidate;
      // An overloaded conductor's estimate runs away (more heat, more R, more current under a
      // constant-power load): the estimate is held at T_CAP, where the insulation has long failed,
      // and the overload is flagged by the ampacity checks anyway.
      const t = Math.min(temperatureAt(link.prepared, cand, current / link.prepared.parallelSets), T_CAP);
      const r = resistanceAt(link.prepared, cand, t);
      if (Math.abs(r - link.r) > R_TOLERANCE * r) changed = true;
      link.r = r;
      link.temperature = t;
    }
    if (!changed) {
      const outcomes = new Map([...links.values()].map((l) => [l.element.id, { link: l, index: at.get(l.element.id)! }]));
      return { ok: true, order, point, links: outcomes, passes: pass, limits };
    }
  }
  return {
    ok: false,
    problems: [{ code: 'no-convergence', elementId: PROJECT_LEVEL, field: '', message: `the conductor temperatures did not settle within ${MAX_PASSES} passes of the chain solve` }],
  };
}

const NO_FIGURES: ReadonlyMap<string, number> = new Map();

/** Add each conductor link's sizing and the whole-path drops to a built result. */
export function attachConductors(result: SolveResult, sized: Extract<Sized, { ok: true }>): SolveResult {
  const limits = sized.limits;
  // No link sized: the elements and warnings stand as built, only the whole-path drops are added.
  // (The plan gives each element's feeder and kind traits: the result's elements are the plan's, in its order.)
  const order = sized.order;
  const planned = { feeders: order.map((node) => node.parent), regulates: order.map((node) => node.spec.regulatesVoltage === true) };
  if (sized.links.size === 0) return withDrops(result, result.elements, result.warnings, pathDrops(result.elements, limits, NO_FIGURES, NO_FIGURES, planned));
  const warnings: SolveWarning[] = [...result.warnings];
  const own = new Map<string, number>();
  const checked = new Map<string, number>();
  const elements = result.elements.map((r) => {
    const outcome = sized.links.get(r.id);
    if (!outcome) return r;
    const { link, index } = outcome;
    own.set(r.id, link.limitPercent);
    const node = sized.order[index]!;
    const p = sized.point;
    const conductor: ConductorResult = conductorResult(link.prepared, link.element, link.choice, link.design, link.limitPercent, link.nominal, link.angle, {
      vIn: p.vOut[node.parent]!,
      vOut: p.vOut[index]!,
      sOut: p.sOut[index]!,
      rUsed: link.r,
      temperature: link.temperature,
      loss: r.loss,
    });
    checked.set(r.id, conductor.drop.checkPercent);
    const ev = link.choice.chosen;
    const name = r.name ?? r.id;
    if (!link.prepared.auto) {
      const fails: string[] = [];
      if (!ev.ampacityOk) fails.push(`its ampacity of ${conductor.ampacity.total.toFixed(1)} A does not meet the design current of ${conductor.designCurrent.toFixed(1)} A by ${conductor.designBasis.rule}`);
      if (!ev.device.ok) fails.push(ev.device.note);
      if (!ev.dropOk) fails.push(`drops ${conductor.drop.checkPercent.toFixed(2)} % by the method's check, above the allowed ${sigText(link.limitPercent, 3)} %`);
      if (fails.length) warnings.push({ code: 'conductor-check', elementId: r.id, message: `cable "${name}", ${conductor.size} ${conductor.material}: ${fails.join('; ')}` });
    }
    // A current the user entered can be wrong: flag it when the solved chain carries more than the
    // link's ampacity. (On the other bases the operating current differs from the design basis only
    // by the voltage sag, which the code's nominal-voltage rule leaves out on purpose.)
    if (link.design.basis === 'given' && conductor.operatingCurrent > conductor.ampacity.total * (1 + 1e-9)) {
      warnings.push({
        code: 'conductor-check',
        elementId: r.id,
        message: `cable "${name}" carries ${conductor.operatingCurrent.toFixed(1)} A in the solved chain, above its ampacity of ${conductor.ampacity.total.toFixed(1)} A: check the design current entered`,
      });
    }
    return { ...r, conductor };
  });
  return withDrops(result, elements, warnings, pathDrops(elements, limits, own, checked, planned));
}

/** The result with these elements, warnings and drops: the fields of `{ ...result, elements, warnings, voltageDrop }`, in its order, named. */
const withDrops = (result: SolveResult, elements: ElementResult[], warnings: SolveWarning[], voltageDrop: PathDrop[]): SolveResult => ({
  projectName: result.projectName,
  method: result.method,
  elements,
  totals: result.totals,
  warnings,
  voltageDrop,
});
