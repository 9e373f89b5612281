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
import { type Complex, ZERO, abs, add, scale, sub } from '../ac/complex.ts';
import type { Problem } from '../errors.ts';
import type { PlannedElement } from './plan.ts';

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

/**
 * Returns the index of the first element whose output cannot be delivered, or −1. With `recover`,
 * such an element's voltage is halved instead and the sweep goes on (see `sweep`).
 */
function forward(order: readonly PlannedElement[], sIn: readonly Complex[], sOut: readonly Complex[], vOut: Complex[], recover = false): number {
  let bad = -1;
  for (let i = 0; i < order.length; i++) {
    const node = order[i]!;
    // Constant-impedance loads fed directly from this output go to the link as their admittance
    // (solved exactly); the rest of the output as the power they drew in the backward sweep.
    let y: Complex | undefined;
    let sConst = sOut[i]!;
    for (const child of node.children) {
      const a = order[child]!.model.admittance;
      if (a === undefined) continue;
      if (y === undefined) {
        y = ZERO;
        sConst = node.children.reduce((sum, ch) => (order[ch]!.model.admittance === undefined ? add(sum, sIn[ch]!) : sum), ZERO);
      }
      y = add(y, a);
    }
    const v = node.model.outputVoltage(vInOf(order, vOut, i), sConst, y);
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

function infeasible(order: readonly PlannedElement[], i: number, sIn: readonly Complex[]): Problem {
  const e = order[i]!.element;
  const kw = loadBelow(order, sIn, i) / 1000;
  return {
    code: 'infeasible-load',
    elementId: e.id,
    field: '',
    value: kw * 1000,
    message: `cannot carry the ${kw.toPrecision(3)} kW of load beyond it (plus the losses on the way): the voltage would collapse, past the most power this link can transfer. Use a larger conductor, a shorter run, a higher voltage or less load`,
  };
}

const finite = (z: Complex): boolean => Number.isFinite(z.re) && Number.isFinite(z.im);

/** The first element (in tree order) whose output voltage or input power is not a finite number. */
function nonFiniteAt(order: readonly PlannedElement[], vOut: readonly Complex[], sIn: readonly Complex[]): Problem | undefined {
  const i = order.findIndex((_, k) => !finite(vOut[k]!) || !finite(sIn[k]!));
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
  forward(order, sIn, sOut, vOut); // no-load voltages (and the impedance loads directly on links) as the starting point
  // A constant-impedance load draws its power at the previous sweep's voltage: starting from the
  // no-load voltage it asks for more than it will take, and a heavy one can ask a link for more
  // than it can transfer although the circuit has a solution. Then the overshooting link's voltage
  // is halved (its loads then draw a quarter) and the sweeps go on; only a link that stays past its
  // maximum transfer for RECOVERY_SWEEPS sweeps in a row is infeasible. Chains of constant-power
  // loads only approach their solution from above and need no recovery: infeasible at once.
  const recover = order.some((node) => node.model.admittance !== undefined);
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
