/**
 * Repeated solves of one planned chain whose battery source changes (open-circuit voltage and
 * internal resistance) while its loads take a few distinct states — the inner loop of the
 * discharge simulation in core/studies/backup/discharge.ts.
 *
 * Method (exact, not an approximation): a regulating converter's input power depends only on its
 * output power (P_in = P_out + loss(P_out), with the input power factor fixed), and a constant-power
 * load's on nothing, so neither depends on the bank voltage (a constant-current load does: P = V·I;
 * next to the bank it sends the solve to the whole-chain sweep below). For each distinct load state the
 * whole chain is swept once (core/solve/sweep.ts); the input power of every "frontier" element —
 * the converters and loads nearest the bank — is then held. Each step re-solves only the passive
 * elements between the bank and that frontier (cables and DC buses) by the same backward/forward
 * fixed-point sweep, with the same tolerance, warm-started from the previous step's voltages (in
 * real arithmetic, extrapolated linearly from the last two steps of the same load state: `startReal`).
 * Where an element of another kind sits between the bank and the frontier, the whole chain is
 * swept at every step instead (slower, same answer).
 */
import { type Complex, c } from '../physics/complex.ts';
import { receivingVoltage } from '../physics/two-bus.ts';
import type { Element, Project } from '../model/project.ts';
import type { Problem } from '../model/errors.ts';
import type { ElementModel } from '../kinds/index.ts';
import { plan, type PlannedElement } from './plan.ts';
import { MAX_SWEEPS, TOLERANCE, sweep } from './sweep.ts';

// The kinds' traits (core/kinds/spec.ts) decide the top: `passive` kinds (their input power depends
// on their input voltage; they pass DC on) are re-solved per step; `regulatesVoltage` kinds (their
// input power depends on their output power only) and constant-power loads hold the frontier.

/** Operating point of one step, at the bank. */
export interface StepPoint {
  /** Terminal voltage, V. */
  voltage: number;
  /** Bank current, A. */
  current: number;
  /** Power out of the terminals, W. */
  terminalPower: number;
  /** Internal I²R of the bank, W. */
  internalLoss: number;
  /** Σ losses of every stage of the chain (passive elements and converters), W. */
  chainLoss: number;
  /** Σ load power, W. */
  loadPower: number;
}

/** One load state prepared for repeated solves. */
interface PreparedState {
  /** Fixed power drawn by frontier children of each top node (index as in `top`), W. */
  fixed: Float64Array;
  /** Σ losses of the elements below the frontier (converters and what they feed), W. */
  belowLoss: number;
  loadPower: number;
  /**
   * The loads' elements and models in this state, in `loadIdx` order, for the whole-chain fallback
   * only (the fast path needs none: a study's states then hold a few numbers each, not a chain).
   */
  loads?: { element: Element; model: ElementModel }[];
}

export interface RepeatSolver {
  /** The chain as planned once for every step (its elements' models as built from the project given). */
  readonly order: readonly PlannedElement[];
  /** Ids of the loads, in the order load values are given to `prepare`. */
  readonly loadIds: readonly string[];
  /** True when each step re-solves only the passive elements next to the bank. */
  readonly fast: boolean;
  /** Sweep the chain once for a load state (values in `loadIds` order: W, VA for apparent-power loads, A for current loads). */
  prepare(values: readonly number[]): { ok: true; state: number } | { ok: false; problems: Problem[] };
  /** Operating point with the bank at open-circuit voltage `emf` behind `resistance`; null when the chain cannot be carried. */
  solve(state: number, emf: number, resistance: number): StepPoint | null;
  /**
   * The same solve, written into `out` (no object per step, for the discharge's time loop): false,
   * and `out` left as it was, when the chain cannot be carried.
   */
  solveInto(state: number, emf: number, resistance: number, out: StepPoint): boolean;
}

/** Plan a validated battery-fed project once for repeated solves. */
export function prepareRepeat(project: Project): { ok: true; solver: RepeatSolver } | { ok: false; problems: Problem[] } {
  const planned = plan(project);
  if (!planned.ok) return planned;
  const order = planned.order;
  const loadIdx: number[] = [];
  order.forEach((n, i) => {
    if (n.role === 'load') loadIdx.push(i);
  });
  // The top: the source and the passive elements reachable from it through passive elements only.
  const inTop = new Array<boolean>(order.length).fill(false);
  inTop[0] = true;
  let fast = true;
  for (let i = 1; i < order.length; i++) {
    const node = order[i]!;
    if (!inTop[node.parent]) continue;
    if (node.spec.passive) inTop[i] = true;
    // A constant-current load next to the bank draws P = V·I at the bank-side voltage, which moves
    // every step: not a fixed frontier power, so the whole chain is swept instead.
    else if (!(node.spec.regulatesVoltage || (node.role === 'load' && node.model.current === undefined))) fast = false;
  }
  const top: number[] = [];
  const topPos = new Map<number, number>();
  order.forEach((_, i) => {
    if (inTop[i]) {
      topPos.set(i, top.length);
      top.push(i);
    }
  });
  const topParent = top.map((i) => (i === 0 ? -1 : topPos.get(order[i]!.parent)!));
  const topParentIdx = Int32Array.from(topParent);
  const topModels: ElementModel[] = top.map((i) => order[i]!.model);
  const nTop = top.length;
  // DC equivalents of the top elements, each checked against the element's own model.
  const dc = top.map((i, j) => (j === 0 ? null : dcEquivalent(order[i]!, topModels[j]!)));
  const realArithmetic = dc.every((d, j) => j === 0 || d !== null);
  const topR = new Float64Array(nTop);
  const topFixedLoss = new Float64Array(nTop);
  dc.forEach((d, j) => {
    if (d) {
      topR[j] = d.resistance;
      topFixedLoss[j] = d.fixedLoss;
    }
  });

  const states: PreparedState[] = [];
  // Warm start of the top voltages (the previous step's solution).
  const v = new Float64Array(nTop);
  const sIn = new Float64Array(nTop);
  const sOut = new Float64Array(nTop);
  let warm = false;
  // The starting point of the real-arithmetic top's next solve (see `startReal`): the converged
  // voltages of the last two solves, their open-circuit voltages and load states.
  const vBefore = new Float64Array(nTop);
  let emfLast = 0;
  let emfBefore = 0;
  let stateLast: PreparedState | null = null;
  let stateBefore: PreparedState | null = null;

  /** The plan with the loads of one state in place (a shallow copy: the other elements are shared). */
  const withLoads = (loads: readonly { element: Element; model: ElementModel }[]): PlannedElement[] => {
    const stateOrder = order.slice();
    loadIdx.forEach((i, k) => {
      stateOrder[i] = { ...order[i]!, ...loads[k]! };
    });
    return stateOrder;
  };

  // Each load's element and model at each level met so far: a level shared by several load states
  // (a load on in one state, the other loads switching) is built once.
  const built = loadIdx.map(() => new Map<number, { element: Element; model: ElementModel }>());
  const prepare: RepeatSolver['prepare'] = (values) => {
    const loads = loadIdx.map((i, k) => {
      const seen = built[k]!.get(values[k]!);
      if (seen) return seen;
      const node = order[i]!;
      // The load's own quantity (its kind's `load` trait); a load a profile cannot set keeps its fields.
      const field = node.spec.load?.field;
      const element = (field ? { ...node.element, [field]: values[k]! } : node.element) as Element;
      const load = { element, model: node.spec.build(element, node.input) };
      built[k]!.set(values[k]!, load);
      return load;
    });
    const swept = sweep(withLoads(loads));
    if (!swept.ok) return swept;
    const { sIn: pin, sOut: pout } = swept.point;
    const fixed = new Float64Array(nTop);
    let belowLoss = 0;
    let loadPower = 0;
    for (let i = 1; i < order.length; i++) {
      const node = order[i]!;
      if (node.role === 'load') loadPower += pin[i]!.re;
      if (inTop[i]) continue;
      if (node.role !== 'load') belowLoss += pin[i]!.re - pout[i]!.re;
      if (inTop[node.parent]) fixed[topPos.get(node.parent)!]! += pin[i]!.re;
    }
    states.push({ fixed, belowLoss, loadPower, ...(fast ? {} : { loads }) });
    return { ok: true, state: states.length - 1 };
  };

  /** Sweep of the top only, DC: real voltages and powers. */
  const solveTop = (st: PreparedState, emf: number, resistance: number, point: StepPoint): boolean => {
    const source = c(emf);
    const rz = c(resistance);
    if (!warm) v.fill(emf);
    const vc = (x: number): Complex => c(x);
    const backward = () => {
      for (let j = nTop - 1; j >= 0; j--) sOut[j] = st.fixed[j]!;
      for (let j = nTop - 1; j >= 1; j--) {
        sIn[j] = topModels[j]!.inputPower(c(sOut[j]!), vc(v[topParent[j]!]!), vc(v[j]!)).re;
        sOut[topParent[j]!]! += sIn[j]!;
      }
    };
    for (let iter = 1; iter <= MAX_SWEEPS; iter++) {
      backward();
      let residual = 0;
      const v0 = receivingVoltage(source, rz, c(sOut[0]!));
      if (v0 === null) return false;
      residual = Math.abs(v0.re - v[0]!) / v0.re;
      v[0] = v0.re;
      for (let j = 1; j < nTop; j++) {
        const out = topModels[j]!.outputVoltage(vc(v[topParent[j]!]!), c(sOut[j]!));
        if (out === null) return false;
        residual = Math.max(residual, Math.abs(out.re - v[j]!) / Math.abs(out.re));
        v[j] = out.re;
      }
      if (residual <= TOLERANCE) {
        backward();
        warm = true;
        const terminalPower = sOut[0]!;
        const current = terminalPower / v[0]!;
        let passiveLoss = 0;
        for (let j = 1; j < nTop; j++) passiveLoss += sIn[j]! - sOut[j]!;
        setPoint(point, v[0]!, current, terminalPower, resistance * current * current, passiveLoss + st.belowLoss, st.loadPower);
        return true;
      }
    }
    return false;
  };

  /**
   * The same sweep in real arithmetic, for a top made of DC links (R) and buses (fixed loss):
   * receiving voltage of a DC link, exact: V_r = (V_s + √(V_s² − 4·R·P_r))/2 (the two-bus solution
   * with X = 0), input power P_r + R·(P_r/V_r)²; a bus passes its voltage and adds its loss.
   */
  /**
   * The starting point of the real-arithmetic sweep: the open-circuit voltage everywhere at first,
   * then the last solve's voltages; when the last two solves were of this load state, the linear
   * (secant) extrapolation of their voltages to this open-circuit voltage,
   * V_start = V₁ + (V₁ − V₀)·(E − E₁)/(E₁ − E₀), which the step's small change in E makes nearly the
   * answer (about 1.5 sweeps a step instead of 2.8 in the bench's 24 h study). The fixed point
   * and its tolerance are unchanged; only the sweep it starts from differs.
   */
  const startReal = (st: PreparedState, emf: number): void => {
    if (!warm) v.fill(emf);
    else {
      const f = stateLast === st && stateBefore === st && emfLast !== emfBefore ? (emf - emfLast) / (emfLast - emfBefore) : 0;
      // Only a modest extrapolation (steps of about equal size); otherwise the last voltages as they are.
      const extrapolate = f !== 0 && Math.abs(f) <= 4;
      for (let j = 0; j < nTop; j++) {
        const last = v[j]!;
        if (extrapolate) v[j] = last + (last - vBefore[j]!) * f;
        vBefore[j] = last;
      }
    }
    emfBefore = emfLast;
    emfLast = emf;
    stateBefore = stateLast;
    stateLast = st;
  };

  const solveTopReal = (st: PreparedState, emf: number, resistance: number, point: StepPoint): boolean => {
    startReal(st, emf);
    const found = sweepTopReal(st, emf, resistance, point);
    // A failed solve leaves no voltages to extrapolate from.
    if (!found) stateLast = null;
    return found;
  };

  const sweepTopReal = (st: PreparedState, emf: number, resistance: number, point: StepPoint): boolean => {
    // The per-step loop reads only typed arrays held in locals (no objects, no Map, no call): the
    // arithmetic, and so every figure, is the sweep's as written in the method above.
    const fixed = st.fixed;
    const n = nTop;
    const volts = v;
    const out = sOut;
    const rs = topR;
    const fixedLoss = topFixedLoss;
    const up = topParentIdx;
    const tolerance = TOLERANCE;
    for (let iter = 1; iter <= MAX_SWEEPS; iter++) {
      // Backward: powers at the present voltages.
      for (let j = 0; j < n; j++) out[j] = fixed[j]!;
      for (let j = n - 1; j >= 1; j--) {
        const r = rs[j]!;
        // A bus (R = 0) adds its fixed loss only: R·I² is 0 there, no division needed.
        if (r === 0) out[up[j]!]! += out[j]! + fixedLoss[j]!;
        else {
          const i = out[j]! / volts[j]!;
          out[up[j]!]! += out[j]! + r * i * i + fixedLoss[j]!;
        }
      }
      // Forward: voltages at the present powers.
      let disc = emf * emf - 4 * resistance * out[0]!;
      if (disc < 0) return false;
      let next = (emf + Math.sqrt(disc)) / 2;
      // The stop test |ΔV| ≤ tolerance·V at every node: the sweep's relative change |ΔV|/V ≤
      // tolerance without a division per node (the voltages here are positive).
      let settled = Math.abs(next - volts[0]!) <= tolerance * next;
      volts[0] = next;
      for (let j = 1; j < n; j++) {
        const vSend = volts[up[j]!]!;
        const r = rs[j]!;
        if (r === 0) next = vSend;
        else {
          disc = vSend * vSend - 4 * r * out[j]!;
          if (disc < 0) return false;
          next = (vSend + Math.sqrt(disc)) / 2;
        }
        if (!(Math.abs(next - volts[j]!) <= tolerance * next)) settled = false;
        volts[j] = next;
      }
      if (settled) {
        for (let j = 0; j < n; j++) out[j] = fixed[j]!;
        let passiveLoss = 0;
        for (let j = n - 1; j >= 1; j--) {
          const r = rs[j]!;
          let loss = fixedLoss[j]!;
          if (r !== 0) {
            const i = out[j]! / volts[j]!;
            loss = r * i * i + loss;
          }
          passiveLoss += loss;
          out[up[j]!]! += out[j]! + loss;
        }
        warm = true;
        const terminalPower = out[0]!;
        const current = terminalPower / volts[0]!;
        setPoint(point, volts[0]!, current, terminalPower, resistance * current * current, passiveLoss + st.belowLoss, st.loadPower);
        return true;
      }
    }
    return false;
  };

  /** Whole-chain sweep with the bank's present state (the fallback). */
  const solveWhole = (st: PreparedState, emf: number, resistance: number, point: StepPoint): boolean => {
    const src = order[0]!;
    const element = { ...src.element, voltage: emf, internalResistance: resistance } as Element;
    delete (element as { bank?: unknown }).bank;
    const stepOrder = withLoads(st.loads!);
    stepOrder[0] = { ...src, element, model: src.spec.build(element, null) };
    const swept = sweep(stepOrder);
    if (!swept.ok) return false;
    const { sIn: pin, sOut: pout, vOut } = swept.point;
    let chainLoss = 0;
    let loadPower = 0;
    for (let i = 1; i < order.length; i++) {
      if (order[i]!.role === 'load') loadPower += pin[i]!.re;
      else chainLoss += pin[i]!.re - pout[i]!.re;
    }
    const terminalPower = pout[0]!.re;
    const current = terminalPower / vOut[0]!.re;
    setPoint(point, vOut[0]!.re, current, terminalPower, resistance * current * current, chainLoss, loadPower);
    return true;
  };

  // Which of the three step solves serves this chain, chosen once (not at every step).
  const stepSolve = fast ? (realArithmetic ? solveTopReal : solveTop) : solveWhole;
  return {
    ok: true,
    solver: {
      order,
      loadIds: loadIdx.map((i) => order[i]!.element.id),
      fast,
      prepare,
      solve: (state, emf, resistance) => {
        const point = emptyPoint();
        return stepSolve(states[state]!, emf, resistance, point) ? point : null;
      },
      solveInto: (state, emf, resistance, out) => stepSolve(states[state]!, emf, resistance, out),
    },
  };
}

/** A step point to be written by a solve (every field a double — NaN, not a small integer — from the start: one shape throughout). */
export const emptyPoint = (): StepPoint => ({ voltage: NaN, current: NaN, terminalPower: NaN, internalLoss: NaN, chainLoss: NaN, loadPower: NaN });

/** Write a solve's operating point into `p` (in place: no object per step). */
function setPoint(p: StepPoint, voltage: number, current: number, terminalPower: number, internalLoss: number, chainLoss: number, loadPower: number): void {
  p.voltage = voltage;
  p.current = current;
  p.terminalPower = terminalPower;
  p.internalLoss = internalLoss;
  p.chainLoss = chainLoss;
  p.loadPower = loadPower;
}

/** Relative agreement asked of a DC equivalent against the element's own model. */
const PROBE_TOLERANCE = 1e-12;

/**
 * The DC equivalent of a passive element — a loop resistance and a fixed loss, its kind's
 * `dcEquivalent` trait (a cable: resistance per km × 2 × length ÷ parallel sets; a bus: its fixed
 * loss) — when its model behaves exactly so at two probe points; null otherwise (then the element's
 * model is used as it is).
 */
function dcEquivalent(node: PlannedElement, model: ElementModel): { resistance: number; fixedLoss: number } | null {
  const eq = node.spec.dcEquivalent?.(node.element) ?? null;
  if (eq === null) return null;
  const { resistance, fixedLoss } = eq;
  const close = (a: number, b: number) => Math.abs(a - b) <= PROBE_TOLERANCE * Math.max(Math.abs(a), Math.abs(b), 1);
  for (const [vs, p] of [
    [50, 400],
    [400, 2500],
  ] as const) {
    const vr = resistance === 0 ? vs : (vs + Math.sqrt(vs * vs - 4 * resistance * p)) / 2;
    const out = model.outputVoltage(c(vs), c(p));
    if (out === null || !close(out.re, vr) || out.im !== 0) return null;
    const pin = model.inputPower(c(p), c(vs), c(vr));
    if (!close(pin.re, p + resistance * (p / vr) ** 2 + fixedLoss)) return null;
  }
  return { resistance, fixedLoss };
}
