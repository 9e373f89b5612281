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
import { type Complex, ZERO, abs, add, c, scale, sub } from '../ac/complex.ts';
import type { Problem } from '../errors.ts';
import type { Element } from '../model.ts';
import type { PlannedElement } from './plan.ts';

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
    let s = ZERO;
    for (const child of node.children) s = add(s, sIn[child]!);
    sOut[i] = s;
    sIn[i] = node.model.inputPower(s, vInOf(order, vOut, i), vOut[i]!);
  }
}

/** Direction (unit phasor) of a voltage: that of `v`, else of `fallback`, else the real axis. */
function direction(v: Complex, fallback: Complex): Complex {
  const m = abs(v);
  if (m > 0) return scale(v, 1 / m);
  const f = abs(fallback);
  return f > 0 ? scale(fallback, 1 / f) : ONE;
}

/**
 * Returns the index of the first element whose output cannot be delivered, or −1. With `recover`,
 * such an element's voltage is halved instead and the sweep goes on (see `sweep`).
 */
function forward(order: readonly PlannedElement[], sIn: readonly Complex[], sOut: readonly Complex[], vOut: Complex[], recover = false, noLoad = false): number {
  let bad = -1;
  for (let i = 0; i < order.length; i++) {
    const node = order[i]!;
    const vIn = vInOf(order, vOut, i);
    // Constant-impedance loads fed directly from this output go to the link as their admittance
    // (solved exactly), constant-current loads as their current phasor relative to their voltage,
    // with the direction of this output's voltage as last found (see seriesLink); the rest of the
    // output as the power it drew in the backward sweep.
    let y: Complex | undefined;
    let j: Complex | undefined;
    let sConst = sOut[i]!;
    for (const child of node.children) {
      const m = order[child]!.model;
      if (m.admittance === undefined && m.current === undefined) continue;
      if (y === undefined) {
        y = ZERO;
        sConst = node.children.reduce((sum, ch) => {
          const cm = order[ch]!.model;
          return cm.admittance === undefined && cm.current === undefined ? add(sum, sIn[ch]!) : sum;
        }, ZERO);
      }
      if (m.admittance !== undefined) y = add(y, m.admittance);
      if (m.current !== undefined && !noLoad) j = add(j ?? ZERO, m.current);
    }
    const direct = j === undefined ? y : { re: y!.re, im: y!.im, current: j, along: direction(vOut[i]!, vIn) };
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

/** Σ of the loads' own power below element i (what the user asked it to carry). */
function loadBelow(order: readonly PlannedElement[], sIn: readonly Complex[], i: number): number {
  const node = order[i]!;
  if (node.spec.role === 'load') return sIn[i]!.re;
  return node.children.reduce((sum, child) => sum + loadBelow(order, sIn, child), 0);
}

/** The constant-current load with the largest current at or below element i, or −1. */
function largestCurrentBelow(order: readonly PlannedElement[], i: number): number {
  const node = order[i]!;
  if (node.model.current !== undefined) return i;
  let best = -1;
  for (const child of node.children) {
    const k = largestCurrentBelow(order, child);
    if (k >= 0 && (best < 0 || abs(order[k]!.model.current!) > abs(order[best]!.model.current!))) best = k;
  }
  return best;
}

function infeasible(order: readonly PlannedElement[], i: number, sIn: readonly Complex[]): Problem {
  const e = order[i]!.element;
  // A current given by the user that the link cannot deliver is refused at that load's current.
  const k = largestCurrentBelow(order, i);
  if (k >= 0) {
    const load = order[k]!.element as Element & { current: number };
    return {
      code: 'infeasible-load',
      elementId: load.id,
      field: 'current',
      value: load.current,
      message: `the ${Number(load.current.toPrecision(4))} A cannot be delivered through "${e.name ?? e.id}" (with the other loads beyond it): the voltage would fall to nothing or collapse on the way. Use a larger conductor, a shorter run, a higher voltage or less current`,
    };
  }
  const kw = loadBelow(order, sIn, i) / 1000;
  return {
    code: 'infeasible-load',
    elementId: e.id,
    field: '',
    value: kw * 1000,
    message: `cannot carry the ${kw.toPrecision(3)} kW of load beyond it (plus the losses on the way): the voltage would collapse, past the most power this link can transfer. Use a larger conductor, a shorter run, a higher voltage or less load`,
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
  forward(order, sIn, sOut, vOut, false, true);
  // A constant-impedance load draws its power at the previous sweep's voltage: starting from the
  // no-load voltage it asks for more than it will take, and a heavy one can ask a link for more
  // than it can transfer although the circuit has a solution. Then the overshooting link's voltage
  // is halved (its loads then draw a quarter) and the sweeps go on; only a link that stays past its
  // maximum transfer for RECOVERY_SWEEPS sweeps in a row is infeasible. Chains of constant-power
  // loads only approach their solution from above and need no recovery: infeasible at once.
  // Constant-current loads behind a bus (not directly on a link) draw their power at the previous
  // sweep's voltage, from above as well: the same recovery and damping serve them.
  const recover = order.some((node) => node.model.admittance !== undefined || node.model.current !== undefined);
  let overshoots = 0;
  let relax = 1;
  let residual = Infinity;
  for (let iter = 1; iter <= MAX_SWEEPS; iter++) {
    backward(order, vOut, sIn, sOut);
    const previous = vOut.slice();
    const bad = forward(order, sIn, sOut, vOut, recover);
    if (bad >= 0) {
      if (!recover || ++overshoots >= RECOVERY_SWEEPS) return { ok: false, problems: [infeasible(order, bad, sIn)] };
      continue;
    }
    overshoots = 0;
    if (recover && relax < 1) {
      // Under-relaxation: V ← V_prev + ω·(V_sweep − V_prev). The fixed point is unchanged.
      for (let i = 0; i < n; i++) vOut[i] = add(previous[i]!, scale(sub(vOut[i]!, previous[i]!), relax));
    }
    const last = residual;
    residual = 0;
    for (let i = 0; i < n; i++) {
      const mag = abs(vOut[i]!);
      if (mag > 0) residual = Math.max(residual, abs(sub(vOut[i]!, previous[i]!)) / mag);
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
        elementId: 'project',
        field: '',
        value: residual,
        message: `the operating point did not settle within ${MAX_SWEEPS} sweeps (last voltage change ${residual.toExponential(2)}); the chain is close to voltage collapse`,
      },
    ],
  };
}
