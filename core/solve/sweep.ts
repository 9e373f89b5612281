/**
 * Step 3 of the solve: backward/forward sweep to a self-consistent operating point.
 *
 * Method: fixed-point iteration over the tree. The backward sweep (loads → source) sums complex
 * power and adds each stage's losses at the present voltages; the forward sweep (source → loads)
 * sets each output voltage from its input voltage and its output power — regulating converters
 * hold their set point, series links (cables, transformer windings, source impedance) use the
 * exact two-bus solution. It stops when no voltage phasor moves by more than TOLERANCE relative
 * between sweeps, then runs one last backward sweep so that every power matches the reported
 * voltages. Energy balance is exact by construction: each P_in is P_out + loss of the same sweep.
 */
import { type Complex, ZERO, abs, add, c, scale, sub } from '../physics/complex.ts';
import type { Problem } from '../model/errors.ts';
import { PROJECT_LEVEL } from '../model/errors.ts';
import { q, say } from '../model/message.ts';
import type { Element } from '../model/project.ts';
import type { PlannedElement } from './plan.ts';
import type { DirectLoads } from '../kinds/spec.ts';

const ONE: Complex = c(1);

/** Relative voltage change between sweeps at which the solve is taken as converged. */
export const TOLERANCE = 1e-12;
/** Sweeps after which the solve gives up (reported as no convergence). */
export const MAX_SWEEPS = 200;

export interface OperatingPoint {
  /** Per-phase output voltage phasor of each element (ZERO for loads and shafts). */
  vOut: Complex[];
  /** Total complex power into each element. */
  sIn: Complex[];
  /** Total complex power out of each element (Σ of its children's input). */
  sOut: Complex[];
  iterations: number;
  residual: number;
}

export type SweepOutcome = { ok: true; point: OperatingPoint } | { ok: false; problems: Problem[] };

const vInOf = (order: readonly PlannedElement[], vOut: readonly Complex[], i: number): Complex => {
  const parent = order[i]!.parent;
  return parent < 0 ? ZERO : vOut[parent]!;
};

function backward(order: readonly PlannedElement[], vOut: readonly Complex[], sIn: Complex[], sOut: Complex[]): void {
  for (let i = order.length - 1; i >= 0; i--) {
    const node = order[i]!;
    // Σ of the children's input power, summed in their order from 0 (as `add` would, one object).
    const children = node.children;
    let re = 0;
    let im = 0;
    for (let k = 0; k < children.length; k++) {
      const x = sIn[children[k]!]!;
      re += x.re;
      im += x.im;
    }
    const s: Complex = children.length === 0 ? ZERO : { re, im };
    sOut[i] = s;
    sIn[i] = node.model.inputPower(s, vInOf(order, vOut, i), vOut[i]!);
  }
}

/** |a − b| as `abs(sub(a, b))` gives it, without the intermediate object. */
function distance(a: Complex, b: Complex): number {
  const re = a.re - b.re;
  const im = a.im - b.im;
  const s = re * re + im * im;
  return s > 1e-290 && s < 1e290 ? Math.sqrt(s) : Math.hypot(re, im);
}

/** Direction (unit phasor) of a voltage: that of `v`, else of `fallback`, else the real axis. */
function direction(v: Complex, fallback: Complex): Complex {
  const m = abs(v);
  if (m > 0) return scale(v, 1 / m);
  const f = abs(fallback);
  return f > 0 ? scale(fallback, 1 / f) : ONE;
}

/**
 * What the constant-current loads and other loads behind a bus hand on to the link above it: for
 * every bus that passes its voltage on and carries such loads (`behindBus`), the power of its own
 * loss and of its loads that are not given by their current, and the sum of the currents of those
 * that are, through nested buses. Worked bottom-up once per sweep (children come after their
 * parent in `order`), so each element is visited once whatever the depth.
 */
function behindBusLoads(
  order: readonly PlannedElement[],
  sIn: readonly Complex[],
  sOut: readonly Complex[],
  behindBus: readonly boolean[],
  noLoad: boolean,
): { s: Complex; j: Complex | undefined }[] {
  const out = new Array<{ s: Complex; j: Complex | undefined }>(order.length);
  for (let n = order.length - 1; n >= 0; n--) {
    if (!behindBus[n]) continue;
    let s = ZERO;
    let j: Complex | undefined;
    for (const child of order[n]!.children) {
      const m = order[child]!.model;
      if (m.current !== undefined) {
        if (!noLoad) j = add(j ?? ZERO, m.current);
      } else if (behindBus[child]) {
        const deep = out[child]!;
        s = add(add(s, sub(sIn[child]!, sOut[child]!)), deep.s);
        if (deep.j !== undefined) j = add(j ?? ZERO, deep.j);
      } else s = add(s, sIn[child]!);
    }
    out[n] = { s, j };
  }
  return out;
}

/**
 * Returns the index of the first element whose output cannot be delivered, or −1. With `recover`,
 * such an element's voltage is halved instead and the sweep goes on (see `sweep`).
 */
function forward(
  order: readonly PlannedElement[],
  sIn: readonly Complex[],
  sOut: readonly Complex[],
  vOut: Complex[],
  handover: readonly boolean[],
  anyHandover: boolean,
  behindBus: readonly boolean[],
  recover = false,
  noLoad = false,
): number {
  let bad = -1;
  // The powers and currents behind buses depend only on the backward sweep: worked once here
  // (only when some output hands loads over; the flag is the caller's, found once per solve).
  const deep = anyHandover ? behindBusLoads(order, sIn, sOut, behindBus, noLoad) : [];
  for (let i = 0; i < order.length; i++) {
    const node = order[i]!;
    const vIn = vInOf(order, vOut, i);
    // Constant-impedance loads fed directly from this output go to the link as their admittance
    // (solved exactly), constant-current loads (directly, or behind buses that pass the voltage on)
    // as their current phasor relative to their voltage, with the direction of this output's
    // voltage as last found (see seriesLink); the rest of the output as the power it drew in the
    // backward sweep (a bus: its own loss and its other loads).
    let sConst = sOut[i]!;
    let direct: DirectLoads | undefined;
    if (handover[i]) {
      let y = ZERO;
      let j: Complex | undefined;
      let s = ZERO;
      for (const child of node.children) {
        const m = order[child]!.model;
        if (m.admittance !== undefined) y = add(y, m.admittance);
        else if (m.current !== undefined) {
          if (!noLoad) j = add(j ?? ZERO, m.current);
        } else if (behindBus[child]) {
          const below = deep[child]!;
          s = add(add(s, sub(sIn[child]!, sOut[child]!)), below.s);
          if (below.j !== undefined) j = add(j ?? ZERO, below.j);
        } else s = add(s, sIn[child]!);
      }
      sConst = s;
      direct = j === undefined ? y : { re: y.re, im: y.im, current: j, along: direction(vOut[i]!, vIn) };
    }
    const v = node.model.outputVoltage(vIn, sConst, direct);
    if (v === null) {
      if (!recover) return i;
      if (bad < 0) bad = i;
      vOut[i] = scale(vOut[i]!, 0.5);
    } else {
      vOut[i] = v;
    }
  }
  return bad;
}

/**
 * What the user asked element i to carry: Σ power of the loads below it, W (constant-current loads
 * not counted: their power follows the voltage), and Σ current of the constant-current loads, A.
 */
function loadBelow(order: readonly PlannedElement[], sIn: readonly Complex[], i: number): { watts: number; amps: number } {
  // Bottom-up over the subtree of i, no recursion: the same sums, child by child in order. In the
  // depth-first order the subtree is the run of indices after i whose feeder lies at i or after it.
  let end = i + 1;
  while (end < order.length && order[end]!.parent >= i) end++;
  const watts = new Float64Array(end - i);
  const ampsBelow = new Float64Array(end - i);
  for (let k = end - 1; k >= i; k--) {
    const node = order[k]!;
    if (node.model.current !== undefined) {
      watts[k - i] = 0;
      ampsBelow[k - i] = abs(node.model.current);
    } else if (node.role === 'load') {
      watts[k - i] = sIn[k]!.re;
    } else {
      let w = 0;
      let a = 0;
      for (const child of node.children) {
        w += watts[child - i]!;
        a += ampsBelow[child - i]!;
      }
      watts[k - i] = w;
      ampsBelow[k - i] = a;
    }
  }
  return { watts: watts[0]!, amps: ampsBelow[0]! };
}

/** Elements that pass a load's current on (scaled by a ratio at most): a current beyond them is still a current. */
const PASS_THROUGH = new Set<Element['kind']>(['cable', 'dc-bus', 'transformer']);

/**
 * The constant-current loads below element i when everything the link carries is such loads
 * (through cables, buses and transformers only), or null: beside power loads or converters the
 * link itself is named.
 */
function currentLoadsBehind(order: readonly PlannedElement[], i: number): number[] | null {
  const found: number[] = [];
  // Depth-first in file order without recursion: children pushed last-first.
  const stack = [...order[i]!.children].reverse();
  while (stack.length) {
    const child = stack.pop()!;
    const node = order[child]!;
    if (node.model.current !== undefined) found.push(child);
    else if (PASS_THROUGH.has(node.element.kind)) {
      for (let k = node.children.length - 1; k >= 0; k--) stack.push(node.children[k]!);
    } else return null;
  }
  return found;
}

function infeasible(order: readonly PlannedElement[], i: number, sIn: readonly Complex[]): Problem {
  const e = order[i]!.element;
  const link = `"${e.name ?? e.id}"`;
  // A current given by the user that the link cannot deliver is refused at that load's current
  // (the largest, when several share the link).
  const loads = currentLoadsBehind(order, i);
  if (loads !== null && loads.length > 0) {
    const k = loads.reduce((best, x) => (abs(order[x]!.model.current!) > abs(order[best]!.model.current!) ? x : best));
    const load = order[k]!.element as Element & { current: number };
    const others = loads.length === 1 ? '' : loads.length === 2 ? ' (with the other load given by its current beyond it)' : ` (with the other ${loads.length - 1} loads given by their current beyond it)`;
    return {
      code: 'infeasible-load',
      elementId: load.id,
      field: 'current',
      value: load.current,
      ...say`${q(load.current, 'A')} cannot be delivered through ${link}${others}: the voltage at the load would fall to nothing or collapse. Use a larger conductor, a shorter run, a higher voltage or less current`,
    };
  }
  const below = loadBelow(order, sIn, i);
  const current = below.amps > 0 ? say` and the ${q(below.amps, 'A')} of loads given by their current` : '';
  // The load below may itself be out of range (a power drawn at a voltage that left the doubles):
  // then the message names no figure rather than print "NaN".
  const what = !Number.isFinite(below.watts) || !Number.isFinite(below.amps)
    ? 'the load beyond it'
    : below.watts === 0 && below.amps > 0
      ? say`the ${q(below.amps, 'A')} of loads given by their current beyond it`
      : say`the ${q(below.watts, 'W')} of load beyond it${current}`;
  return {
    code: 'infeasible-load',
    elementId: e.id,
    field: '',
    value: Number.isFinite(below.watts) ? below.watts : null,
    ...say`cannot carry ${what} (plus the losses on the way): the voltage would collapse, past the most power this link can transfer. Use a larger conductor, a shorter run, a higher voltage or less load`,
  };
}

const finite = (z: Complex): boolean => Number.isFinite(z.re) && Number.isFinite(z.im);

/** The first element (in tree order) whose output voltage or input power is not a finite number. */
function nonFiniteAt(order: readonly PlannedElement[], vOut: readonly Complex[], sIn: readonly Complex[]): Problem | undefined {
  // First whether any figure is not finite (x·0 is 0 for a finite x, NaN for NaN and ±Infinity, and a
  // NaN stays in the sum), then, only then, which element is the first.
  let sum = 0;
  for (let k = 0; k < order.length; k++) {
    const v = vOut[k]!;
    const s = sIn[k]!;
    sum += v.re * 0 + v.im * 0 + s.re * 0 + s.im * 0;
  }
  if (sum === 0) return undefined;
  let i = -1;
  for (let k = 0; k < order.length; k++) {
    if (!finite(vOut[k]!) || !finite(sIn[k]!)) {
      i = k;
      break;
    }
  }
  if (i < 0) return undefined;
  const e = order[i]!.element;
  const voltage = !finite(vOut[i]!);
  return {
    code: 'non-finite',
    elementId: e.id,
    field: voltage ? 'output.voltage' : 'input.p',
    message: `the ${voltage ? 'output voltage' : 'input power'} of "${e.name ?? e.id}" is not a finite number during the solve: nothing computed is shown. A value of this element or of one it feeds is out of range (near zero or huge, or a unit slip): check them`,
  };
}

/**
 * Sweeps in a row that may overshoot past a link's maximum transfer before the load is declared
 * infeasible, when the chain has constant-impedance loads.
 */
const RECOVERY_SWEEPS = 30;
/** Smallest under-relaxation factor for chains with constant-impedance loads. */
const MIN_RELAX = 1 / 1024;

export function sweep(order: readonly PlannedElement[]): SweepOutcome {
  const n = order.length;
  const vOut: Complex[] = new Array<Complex>(n).fill(ZERO);
  const sIn: Complex[] = new Array<Complex>(n).fill(ZERO);
  const sOut: Complex[] = new Array<Complex>(n).fill(ZERO);
  // No-load voltages (and the impedance loads directly on links) as the starting point; the
  // constant-current loads join from the first sweep on.
  // Which outputs hand loads to their link: admittances and currents of their own loads, and the
  // currents behind buses that pass the voltage on (children come after their parent in `order`).
  const behindBus = new Array<boolean>(n).fill(false);
  const handover = new Array<boolean>(n).fill(false);
  // (Loops rather than callbacks: this runs once per solve, and a sample or candidate is one solve.)
  let anyHandover = false;
  let recover = false;
  for (let i = n - 1; i >= 0; i--) {
    const node = order[i]!;
    const children = node.children;
    let carries = false;
    let admits = false;
    for (let k = 0; k < children.length; k++) {
      const ch = children[k]!;
      const m = order[ch]!.model;
      if (m.current !== undefined || behindBus[ch]!) carries = true;
      if (m.admittance !== undefined) admits = true;
    }
    behindBus[i] = node.model.passesVoltage === true && carries;
    handover[i] = carries || admits;
    if (handover[i]) anyHandover = true;
    if (node.model.admittance !== undefined || node.model.current !== undefined) recover = true;
  }
  forward(order, sIn, sOut, vOut, handover, anyHandover, behindBus, false, true);
  // A constant-impedance load draws its power at the previous sweep's voltage: starting from the
  // no-load voltage it asks for more than it will take, and a heavy one can ask a link for more
  // than it can transfer although the circuit has a solution. Then the overshooting link's voltage
  // is halved (its loads then draw a quarter) and the sweeps go on; only a link that stays past its
  // maximum transfer for RECOVERY_SWEEPS sweeps in a row is infeasible. Chains of constant-power
  // loads only approach their solution from above and need no recovery: infeasible at once.
  // Constant-current loads behind a bus (not directly on a link) draw their power at the previous
  // sweep's voltage, from above as well: the same recovery and damping serve them.
  // (`recover`: the chain holds such loads, found in the loop above.)
  let overshoots = 0;
  let firstBad = -1;
  let relax = 1;
  let residual = Infinity;
  // The voltages of the sweep before (one array for the whole solve, refilled each sweep).
  const previous: Complex[] = new Array<Complex>(n);
  for (let iter = 1; iter <= MAX_SWEEPS; iter++) {
    backward(order, vOut, sIn, sOut);
    for (let i = 0; i < n; i++) previous[i] = vOut[i]!;
    const bad = forward(order, sIn, sOut, vOut, handover, anyHandover, behindBus, recover);
    if (bad >= 0) {
      // The element that failed first in this run of overshoots is named: the halving that follows
      // can push the links upstream of it past their limit too (its input current grows as its
      // voltage falls), which says nothing about them.
      if (overshoots === 0) firstBad = bad;
      if (!recover || ++overshoots >= RECOVERY_SWEEPS) return { ok: false, problems: [infeasible(order, firstBad, sIn)] };
      continue;
    }
    // Figures past the range of doubles (a 1e78 V output from 0.1 V, a 1e300 W load) never settle:
    // refuse at once, naming the first element whose voltage or power left it.
    const lost = nonFiniteAt(order, vOut, sIn);
    if (lost) return { ok: false, problems: [lost] };
    overshoots = 0;
    if (recover && relax < 1) {
      // Under-relaxation: V ← V_prev + ω·(V_sweep − V_prev). The fixed point is unchanged.
      for (let i = 0; i < n; i++) vOut[i] = add(previous[i]!, scale(sub(vOut[i]!, previous[i]!), relax));
    }
    const last = residual;
    residual = 0;
    for (let i = 0; i < n; i++) {
      const v = vOut[i]!;
      const mag = abs(v);
      if (mag > 0) residual = Math.max(residual, distance(v, previous[i]!) / mag);
    }
    // A heavy constant-impedance load makes the plain sweep overshoot and oscillate (each sweep
    // multiplies the error by about −Z_link/Z_load): damp harder whenever the change stops shrinking.
    if (recover && residual >= last && relax > MIN_RELAX) relax /= 2;
    if (residual <= TOLERANCE) {
      backward(order, vOut, sIn, sOut);
      return { ok: true, point: { vOut, sIn, sOut, iterations: iter, residual } };
    }
  }
  return {
    ok: false,
    problems: [
      {
        code: 'no-convergence',
        elementId: PROJECT_LEVEL,
        field: '',
        value: residual,
        message: `the operating point did not settle within ${MAX_SWEEPS} sweeps (last voltage change ${residual.toExponential(2)}); the chain is close to voltage collapse`,
      },
    ],
  };
}
