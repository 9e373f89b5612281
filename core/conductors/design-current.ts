/**
 * The design current of a cable link: the current the code sizes the conductor and its device for,
 * taken from the circuit, not from the sagged operating point of the solve.
 *
 * Bases (each named in the working, chosen automatically unless the user overrides it):
 * - load at nominal voltage: the link's delivered power in the chain solved with every conductor
 *   and source impedance ideal, divided by the NOMINAL voltage of its system (NEC 220.5(A): computations
 *   at the nominal system voltage; IEC 60364 design current I_B), × 1.25 for a continuous load
 *   (NEC 210.19(A)(1)(a) / 215.2(A)(1)(a); on IEC only when the user asks, not an IEC rule);
 * - motor branch circuit: 125 % of the full-load current of NEC Table 430.250 (3φ) / 430.248 (1φ),
 *   never the nameplate or operating current (430.6(A)(1), 430.22); IEC: the motor's rated current;
 * - feeder to several motors: 125 % of the largest motor's full-load current + the others' + the
 *   other loads (430.24);
 * - a drive's input conductors: 125 % of the drive's rated input current (430.122(A));
 * - an inverter's DC input: its rated continuous output at its lowest input voltage (the low-voltage
 *   cut-off) divided by its efficiency there (the stand-alone inverter input current rating of NEC
 *   690.8(A) / 694.12(A)(3) / 706.30), × 1.25 (690.8(B)(1) / 706.30(B));
 * - a charger's output: 125 % of its rated output current (706.30, the equipment's rating);
 * - a DC-DC converter's input: its rated output at its lowest input voltage divided by its
 *   efficiency, × 1.25;
 * - a DC feeder to a bus with converters (a bank to its bus): each converter's rated input current
 *   as above plus the other loads at nominal voltage, × 1.25 (NEC 706.30, 215.2(A)(1));
 * - given: a current the user enters.
 *
 * The equipment's rated currents (a motor's full-load current, a converter's rated input) are worked
 * out in equipment-current.ts.
 *
 * "Stacked" bases (motor, drive: 430.22, 430.24, 430.122) put the 125 % on the conductor's ampacity
 * after corrections; the others check 125 % against the termination column before corrections and
 * 100 % against the corrected ampacity (210.19(A)(1)(a)/(b), 690.8(B)(1)/(2)).
 */
import type { Complex } from '../physics/complex.ts';
import { abs } from '../physics/complex.ts';
import type { ConductorSpec, DcDcStage, Element, InverterStage, MotorStage, PortKind, Project } from '../model/project.ts';
import type { DesignBasisKind } from '../model/result.ts';
import { isPassive } from '../kinds/index.ts';
import { converterInput, iecMotorCurrent, necMotorFlc } from './equipment-current.ts';
import { sigText } from '../model/message.ts';

const SQRT3 = Math.sqrt(3);
const CONTINUOUS = 1.25;

export interface DesignCurrent {
  basis: DesignBasisKind;
  /** Current before any 125 % factor, A (whole link): the drop check uses it. */
  base: number;
  /** 1.25 or 1. */
  factor: number;
  /** base × factor, A (whole link). */
  design: number;
  /** True when the factor applies to the ampacity after corrections (motor and drive rules). */
  stacked: boolean;
  /** The rule in words, with its clause. */
  rule: string;
  /** Why an automatic basis fell back to the load, if it did (the rating to enter). */
  fallback?: string;
  /** Motor circuits: the motors' full-load currents, largest first, for the device rule (NEC 430.52 / 430.62). */
  motors?: { name: string; flc: number }[];
  /** Feeder to several motors: the current of the loads other than motors, A. */
  otherLoads?: number;
}

export type DesignOutcome = { ok: true; design: DesignCurrent } | { ok: false; field: string; value: unknown; message: string };

/** What the basis needs to know about the chain: the project's elements and the link's nominal-solve power. */
export interface DesignContext {
  project: Project;
  /** Children of each element id, in file order. */
  children: ReadonlyMap<string, readonly Element[]>;
  byId: ReadonlyMap<string, Element>;
  /** Complex power into each element in the nominal solve (cables and sources ideal), by id. */
  sIn: ReadonlyMap<string, Complex>;
  /** Nominal voltage of the port feeding each element, V (line-to-line on three-phase), by id. */
  nominal: ReadonlyMap<string, number>;
  /** Port kind feeding each element, by id. */
  portKind: ReadonlyMap<string, PortKind>;
}

const nameOf = (e: Element): string => `"${e.name ?? e.id}"`;

/** Per solve: the terminals and the feeder found for each element, so that every walk is done once. */
const walks = new WeakMap<DesignContext, { terminals: Map<string, readonly Element[]>; feeder: Map<string, Element | undefined> }>();

function walksOf(ctx: DesignContext) {
  let w = walks.get(ctx);
  if (!w) {
    w = { terminals: new Map(), feeder: new Map() };
    walks.set(ctx, w);
  }
  return w;
}

/**
 * The equipment a link feeds: the first non-passive elements below it (through the kinds with the
 * `passive` trait: cables and DC buses), in file order. Without recursion, and remembered per
 * element: a run of thousands of cables is walked once, and an element with one passive child
 * shares that child's list.
 */
function terminals(ctx: DesignContext, id: string): readonly Element[] {
  const known = walksOf(ctx).terminals;
  // Post-order over the passive elements below `id`: an element's list is made once its passive
  // children's lists are known.
  const stack: { id: string; expanded: boolean }[] = [{ id, expanded: false }];
  while (stack.length) {
    const top = stack[stack.length - 1]!;
    if (known.has(top.id)) {
      stack.pop();
      continue;
    }
    const children = ctx.children.get(top.id) ?? [];
    if (!top.expanded) {
      top.expanded = true;
      for (let k = children.length - 1; k >= 0; k--) {
        const ch = children[k]!;
        if (isPassive(ch.kind) && !known.has(ch.id)) stack.push({ id: ch.id, expanded: false });
      }
      continue;
    }
    stack.pop();
    const only = children.length === 1 && isPassive(children[0]!.kind) ? known.get(children[0]!.id) : undefined;
    if (only) {
      known.set(top.id, only);
      continue;
    }
    const out: Element[] = [];
    for (const ch of children) {
      if (isPassive(ch.kind)) for (const t of known.get(ch.id) ?? []) out.push(t);
      else out.push(ch);
    }
    known.set(top.id, out);
  }
  return known.get(id) ?? [];
}

/**
 * The equipment whose output a link carries: up through cables only. A DC bus is a branch point,
 * so a cable beyond it is a branch of the bus, not the equipment's output circuit. Remembered
 * along the way, so a long run of cables is walked once.
 */
function feeder(ctx: DesignContext, e: Element): Element | undefined {
  const known = walksOf(ctx).feeder;
  const passed: string[] = [];
  let found: Element | undefined;
  let at: Element | undefined = e;
  while (at && 'from' in at && at.from !== undefined) {
    if (known.has(at.id)) {
      found = known.get(at.id);
      break;
    }
    passed.push(at.id);
    const up = ctx.byId.get(at.from);
    if (!up || up.kind !== 'cable') {
      found = up;
      break;
    }
    at = up;
  }
  for (const id of passed) known.set(id, found);
  return found;
}

/** Current drawn by an element at nominal voltage (the nominal solve's power over the nominal voltage), A. */
function nominalCurrent(ctx: DesignContext, id: string): number {
  const s = ctx.sIn.get(id);
  const v = ctx.nominal.get(id);
  const kind = ctx.portKind.get(id);
  if (!s || !v || v <= 0) return 0;
  return kind === 'ac3' ? abs(s) / (SQRT3 * v) : abs(s) / v;
}

/** A design current from an equipment rating: the rated current × the rule's factor. */
const fromRating = (basis: DesignBasisKind, rated: number, factor: number, stacked: boolean, rule: string): DesignCurrent => ({ basis, base: rated, factor, design: rated * factor, stacked, rule });

type EquipmentBasis = { ok: true; design: DesignCurrent } | { ok: false; missing: string } | null;

/** The equipment rule for what the link feeds (and what feeds it); null when no rule applies. */
function equipmentBasis(ctx: DesignContext, link: Element, spec: ConductorSpec, kind: PortKind, nominal: number): EquipmentBasis {
  const nec = spec.system === 'nec';
  const f = nec ? CONTINUOUS : 1;
  const found: DesignCurrent[] = [];
  const missing: string[] = [];
  const ends = terminals(ctx, link.id);
  const phases: 1 | 3 = kind === 'ac3' ? 3 : 1;
  const motors = ends.filter((e): e is MotorStage => e.kind === 'motor');
  if (kind !== 'dc' && motors.length > 0) {
    const flcs: { name: string; flc: number; words: string }[] = [];
    for (const m of motors) {
      const r = nec ? necMotorFlc(m, phases, nominal) : iecMotorCurrent(m, phases, nominal);
      if ('reason' in r) missing.push(`motor ${nameOf(m)}: ${r.reason}`);
      else flcs.push({ name: m.name ?? m.id, flc: r.amps, words: r.words });
    }
    if (flcs.length === motors.length) {
      flcs.sort((a, b) => b.flc - a.flc);
      if (ends.length === 1) {
        const m = flcs[0]!;
        found.push(
          nec
            ? { basis: 'motor-branch', base: m.flc, factor: f, design: m.flc * f, stacked: true, rule: `125 % of the motor's full-load current (NEC 430.22; full-load current from ${m.words}, 430.6(A)(1), not the nameplate or operating current)`, motors: flcs }
            : { basis: 'motor-branch', base: m.flc, factor: 1, design: m.flc, stacked: true, rule: `the motor's rated current as I_B (IEC 60364-5-52; ${m.words})`, motors: flcs },
        );
      } else {
        const others = ends.filter((e) => e.kind !== 'motor').reduce((s, e) => s + nominalCurrent(ctx, e.id), 0);
        const sumFlc = flcs.reduce((s, m) => s + m.flc, 0);
        const largest = flcs[0]!;
        const base = sumFlc + others;
        const design = nec ? largest.flc * 1.25 + (sumFlc - largest.flc) + others : base;
        found.push({
          basis: 'motor-feeder',
          base,
          factor: design / base,
          design,
          stacked: true,
          rule: nec
            ? `125 % of the largest motor's full-load current (${largest.name}: ${largest.flc} A) + the other motors' (${(sumFlc - largest.flc).toFixed(1)} A) + the other loads at nominal voltage (${others.toFixed(1)} A) (NEC 430.24; full-load currents from Table 430.250 / 430.248, 430.6(A)(1))`
            : `the motors' rated currents (${flcs.map((m) => `${m.name} ${m.flc.toFixed(1)} A`).join(', ')}) + the other loads at nominal voltage (${others.toFixed(1)} A) as I_B`,
          motors: flcs,
          otherLoads: others,
        });
      }
    }
  }
  if (ends.length === 1) {
    const end = ends[0]!;
    if (end.kind === 'drive') {
      const rated = end.ratedInputCurrent;
      if (rated === undefined) missing.push(`drive ${nameOf(end)}: enter its rated input current`);
      else found.push(fromRating('drive-input', rated, f, true, nec ? `125 % of the drive's rated input current, ${rated} A (NEC 430.122(A))` : `the drive's rated input current, ${rated} A, as I_B`));
    }
    if ((end.kind === 'inverter' || end.kind === 'dc-dc') && kind === 'dc') {
      const r = converterInput(end);
      if ('missing' in r) missing.push(...r.missing);
      else
        found.push({
          basis: end.kind === 'inverter' ? 'inverter-input' : 'dc-dc-input',
          base: r.amps,
          factor: f,
          design: r.amps * f,
          stacked: false,
          rule: `${r.words}${nec ? ' × 1.25 (NEC 690.8(A)/(B), 706.30: the continuous input current rating at rated power and lowest input voltage)' : ' as I_B (the equipment rating)'}`,
        });
    }
  }
  // A DC feeder to a bus with converters on it (a bank to its bus): each converter at its rated
  // input current, the other loads at nominal voltage, summed (the equipment ratings, not today's load).
  const converters = ends.filter((e): e is InverterStage | DcDcStage => e.kind === 'inverter' || e.kind === 'dc-dc');
  if (kind === 'dc' && ends.length > 1 && converters.length > 0) {
    const parts: string[] = [];
    let base = 0;
    let rated = 0;
    for (const e of ends) {
      const r = e.kind === 'inverter' || e.kind === 'dc-dc' ? converterInput(e) : null;
      if (r && !('missing' in r)) {
        base += r.amps;
        rated++;
        parts.push(`${nameOf(e)} ${r.amps.toFixed(1)} A (${r.words})`);
      } else {
        if (r) missing.push(...r.missing);
        const i = nominalCurrent(ctx, e.id);
        base += i;
        parts.push(`${nameOf(e)} ${i.toFixed(1)} A at nominal voltage`);
      }
    }
    if (rated === converters.length) {
      found.push({
        basis: 'dc-feeder',
        base,
        factor: f,
        design: base * f,
        stacked: false,
        rule: `the equipment on the bus at its ratings: ${parts.join(' + ')}${nec ? ', × 1.25 (NEC 706.30, 215.2(A)(1))' : ', as I_B'}`,
      });
    }
  }
  const up = feeder(ctx, link);
  if (up?.kind === 'rectifier' && kind === 'dc') {
    const rated = up.ratedOutputCurrent;
    if (rated === undefined) missing.push(`charger ${nameOf(up)}: enter its rated output current`);
    else found.push(fromRating('charger-output', rated, f, false, nec ? `125 % of the charger's rated output current, ${rated} A (NEC 706.30, the equipment's rating)` : `the charger's rated output current, ${rated} A, as I_B`));
  }
  if (found.length) {
    // Where two equipment rules meet on one link (a charger feeding an inverter), the larger governs.
    found.sort((a, b) => b.design - a.design);
    return { ok: true, design: found[0]! };
  }
  return missing.length ? { ok: false, missing: missing.join('; ') } : null;
}

/** The link's design current by the basis its spec asks for. */
export function designCurrent(ctx: DesignContext, link: Element, spec: ConductorSpec, kind: PortKind): DesignOutcome {
  const nominal = ctx.nominal.get(link.id) ?? 0;
  const basis = spec.designCurrentBasis ?? 'auto';
  const cont = spec.continuous ? CONTINUOUS : 1;
  const contWords = spec.continuous
    ? spec.system === 'nec'
      ? ' × 1.25 for a continuous load (NEC 210.19(A)(1)(a) / 215.2(A)(1)(a))'
      : ' × 1.25 (continuous factor chosen by the user; not an IEC 60364 rule)'
    : '';
  if (basis === 'given') {
    if (spec.designCurrent === undefined) return { ok: false, field: 'conductor.designCurrent', value: undefined, message: 'enter the design current (A) for the basis "given"' };
    const base = spec.designCurrent;
    return { ok: true, design: { basis: 'given', base, factor: cont, design: base * cont, stacked: false, rule: `design current entered by the user, ${base} A${contWords}` } };
  }
  if (spec.designCurrent !== undefined) {
    return { ok: false, field: 'conductor.designCurrent', value: spec.designCurrent, message: 'a design current is only used with the basis "given"; choose that basis or clear the current' };
  }
  let fallback: string | undefined;
  if (basis === 'auto' || basis === 'equipment') {
    const eq = equipmentBasis(ctx, link, spec, kind, nominal);
    if (eq?.ok) return { ok: true, design: eq.design };
    if (basis === 'equipment') {
      return {
        ok: false,
        field: 'conductor.designCurrentBasis',
        value: basis,
        message: eq ? `the equipment rating is missing: ${eq.missing}` : 'this link feeds no motor, drive, inverter, DC-DC converter or charger whose rating sets the design current',
      };
    }
    if (eq) fallback = eq.missing;
  }
  const base = nominalCurrent(ctx, link.id);
  const sys = `${sigText(nominal, 4)} V ${kind === 'ac3' ? 'three-phase' : kind === 'ac1' ? 'single-phase' : 'DC'}`;
  return {
    ok: true,
    design: {
      basis: 'load-nominal',
      base,
      factor: cont,
      design: base * cont,
      stacked: false,
      rule: `the load at the nominal voltage of its system, ${sys} (NEC 220.5(A); IEC 60364 design current I_B)${contWords}`,
      ...(fallback ? { fallback } : {}),
    },
  };
}
