/**
 * The electrical models the kinds share: per-phase helpers, the exact series link, the regulating
 * converter, the constant-power and constant-current loads, and the loss report. Split from
 * spec.ts (the kind contract and the shared schema parts); spec.ts re-exports them, so a kind
 * imports everything it needs from one place.
 *
 * Conventions of the solve: voltages are per-phase phasors (phase-to-neutral on three-phase, the
 * line voltage on single-phase, a real number on DC); powers are TOTAL complex powers S = P + jQ
 * (all phases), Q > 0 lagging.
 */
import type { z } from 'zod/mini';
import type { PfSense, PortKind } from '../model/project.ts';
import { figure, q, say, valueText } from '../model/message.ts';
import { type Complex, ZERO, abs, add, arg, c, conj, div, mul, polar, scale, sub } from '../physics/complex.ts';
import { receivingVoltage } from '../physics/two-bus.ts';
import { type PreparedLoss, prepareLoss, weightedEfficiency } from '../physics/loss-model.ts';
import type { DirectLoads, ElementModel, ElementReport, KindWarning, PortInfo, lossModelSchema } from './spec.ts';
import type { WeightedEfficiency } from '../model/result.ts';

export const phaseCount = (kind: PortKind): number => (kind === 'ac3' ? 3 : 1);

/** Per-phase voltage magnitude from the rated voltage (line-to-line on three-phase). */
export const perPhase = (kind: PortKind, voltage: number): number => (kind === 'ac3' ? voltage / Math.sqrt(3) : voltage);

/** Q drawn at a given P and power factor: Q = P·tan(arccos pf), negative when leading. */
export function reactiveFromPf(p: number, pf: number, sense: PfSense = 'lagging'): number {
  const q = Math.abs(p) * Math.tan(Math.acos(pf));
  return sense === 'leading' ? -q : q;
}

/**
 * Models that keep nothing between calls (no state: each function's answer follows from its
 * arguments and the element alone), which the plan may therefore build once per element and use in
 * every solve of it (core/solve/plan.ts). A model is marked by a field holding the model itself, so
 * only the very object a helper below or a kind gave to `pureModel` counts: a copy
 * (`{ ...model, report }`) carries the original's mark, which is not itself, so a wrapper that keeps
 * state is never shared by mistake. A series link keeps the highest sending voltage it has seen
 * (`seriesLink`): its models are built afresh for every plan.
 */
const PURE = Symbol('keeps nothing between calls');

/** Mark a model as keeping nothing between calls (see PURE). */
export function pureModel(model: ElementModel): ElementModel {
  (model as { [PURE]?: ElementModel })[PURE] = model;
  return model;
}

/** Whether the plan may use this model in more than one solve (see PURE). */
export const isPureModel = (model: ElementModel): boolean => (model as { [PURE]?: ElementModel })[PURE] === model;

/**
 * A series impedance link solved exactly per phase (cables, transformer windings, source
 * impedance). `z` is the per-phase impedance: the loop impedance on DC and single-phase.
 */
export function seriesLink(z: Complex, kind: PortKind) {
  const m = phaseCount(kind);
  /** |Z|, worked once (the same figure each call would give). */
  const absZ = abs(z);
  /** The highest sending voltage magnitude seen by `inputPower` (see there). */
  let highestSend = 0;
  return {
    /**
     * With constant-impedance loads Y (per phase) beside the constant power S_p:
     * V_s = K·V_r + Z·conj(S_p/V_r), K = 1 + Z·Y. With W = K·V_r this is the two-bus equation
     * V_s = W + Z·conj(K)·conj(S_p/W), solved exactly; then V_r = W/K.
     * Constant-current loads drawing J (per phase, held relative to V_r) add their drop Z·J
     * (Ohm's law). Alone on the link (no S_p, no Y) they are solved exactly: with V_r = r·e^{jθ},
     * V_s = e^{jθ}·(r + Z·J), so r = −Re(Z·J) + √(|V_s|² − Im(Z·J)²) and θ = arg V_s − arg(r + Z·J);
     * no real r > 0 (the square root of a negative number, or r ≤ 0; on DC: I·R ≥ V_s) is a current
     * the link cannot deliver. Beside other loads, J is set along the last V_r (`along`) and
     * V_s − Z·J = K·V_r + Z·conj(S_p/V_r) solved as above: exact on DC, a fixed point in the angle
     * on AC; a V_r that comes out against `along` is a current the link cannot deliver.
     */
    outputVoltage: (vIn: Complex, sOut: Complex, y?: DirectLoads): Complex | null => {
      if (y?.current !== undefined) {
        const zj = mul(z, y.current);
        if (sOut.re === 0 && sOut.im === 0 && y.re === 0 && y.im === 0) {
          const disc = vIn.re * vIn.re + vIn.im * vIn.im - zj.im * zj.im;
          if (disc < 0) return null;
          const r = Math.sqrt(disc) - zj.re;
          if (!(r > 0)) return null;
          return polar(r, arg(vIn) - arg(add(c(r), zj)));
        }
        const along = y.along ?? c(1);
        const vs = sub(vIn, mul(zj, along));
        const k = add(c(1), mul(z, y));
        const w = receivingVoltage(vs, mul(z, conj(k)), scale(sOut, 1 / m));
        const v = w === null ? null : div(w, k);
        return v !== null && v.re * along.re + v.im * along.im > 0 ? v : null;
      }
      if (y === undefined || (y.re === 0 && y.im === 0)) return receivingVoltage(vIn, z, scale(sOut, 1 / m));
      const k = add(c(1), mul(z, y));
      const w = receivingVoltage(vIn, mul(z, conj(k)), scale(sOut, 1 / m));
      return w === null ? null : div(w, k);
    },
    /**
     * S_in = S_out + m·|I|²·Z with |I| = |S_out/m| / |V_out|.
     * Given the sending voltage V_s: while the link cannot deliver S_out from V_s at all (no
     * two-bus solution, past the nose of its P–V curve) it has no operating point, and the loss at
     * the last receiving voltage is fictitious and can be enormous (a 100 km run of thin wire
     * starting from the no-load voltage: megawatts). Passed upstream, it drives the source or a
     * feeder past its own limit first, and the refusal would land there. So, only then, |I| is
     * counted at most at |V_s|/(2|Z|), the current at the link's maximum transfer (a resistive
     * link): the forward sweep reaches this link and names it. Where the link can deliver S_out
     * the figure is exact, so a converged operating point is unchanged.
     * |V_s| here is the highest sending voltage the link has seen (at first the no-load voltage),
     * not the last one: deep in a chain that is collapsing as a whole, the last V_s falls towards
     * zero, and a cap that fell with it would hide the demand from the links above and keep the
     * sweeps from settling on the refusal.
     */
    inputPower: (sOut: Complex, vOut: Complex, vSend?: Complex): Complex => {
      let i = abs(sOut) / m / abs(vOut);
      if (vSend !== undefined) {
        highestSend = Math.max(highestSend, abs(vSend));
        const atMaxTransfer = highestSend / (2 * absZ);
        if (i > atMaxTransfer && receivingVoltage(vSend, z, scale(sOut, 1 / m)) === null) i = atMaxTransfer;
      }
      // add(sOut, scale(z, k)) in one object: the same products and sums.
      const k = m * i * i;
      return { re: sOut.re + z.re * k, im: sOut.im + z.im * k };
    },
  };
}

/**
 * A regulating converter: sets its output voltage (and frequency), draws P_in = P_out + P_loss and,
 * on an AC input, Q_in from its input power factor. Reactive power on its output is supplied by the
 * converter and does not pass upstream.
 */
export function regulatingConverter(opts: {
  out: PortInfo;
  outputVoltage: number;
  inputKind: PortKind;
  inputPowerFactor?: number;
  inputPfSense?: PfSense;
  loss: z.infer<typeof lossModelSchema>;
  /** Name of the rated quantity for messages, e.g. "rated output". */
}): ElementModel {
  const prepared: PreparedLoss = prepareLoss(opts.loss);
  const vOut = c(perPhase(opts.out.kind, opts.outputVoltage));
  const pf = opts.inputKind === 'dc' ? 1 : (opts.inputPowerFactor ?? 1);
  const memo: LossMemo = {};
  // Q = |P|·tan(arccos pf) (reactiveFromPf), with tan(arccos pf) and the sign worked once per model:
  // the same product of the same two numbers as a call per sweep gives.
  const tanPhi = pf === 1 ? 0 : Math.tan(Math.acos(pf));
  const leading = opts.inputPfSense === 'leading';
  return pureModel({
    out: opts.out,
    outputVoltage: () => vOut,
    inputPower: (sOut) => {
      const pIn = sOut.re + prepared.loss(sOut.re).loss;
      if (pf === 1) return c(pIn, 0);
      const q = Math.abs(pIn) * tanPhi;
      return c(pIn, leading ? -q : q);
    },
    report: (sOut) => lossReport(prepared, sOut.re, memo),
  });
}

/**
 * A prepared loss model's weighted efficiencies, worked once per model that reports them (`memo`, held
 * by the model: a model the plan reuses, core/solve/plan.ts, works them once for all a study's
 * samples); a fresh object each call (results share no parts). Only a cache of what the prepared
 * model gives: the model still keeps nothing that changes an answer.
 */
function weightedOf(prepared: PreparedLoss, memo: LossMemo | undefined): WeightedEfficiency | undefined {
  let w = memo?.weighted;
  if (w === undefined) {
    w = weightedEfficiency(prepared) ?? null;
    if (memo !== undefined) memo.weighted = w;
  }
  return w === null ? undefined : { euro: w.euro, cec: w.cec };
}

/** What a model keeps of its loss report's constant parts (see `weightedOf`). */
export interface LossMemo {
  weighted?: WeightedEfficiency | null;
}

/** Load fraction, weighted efficiencies, fit and warnings of a loss model at an operating point. */
export function lossReport(prepared: PreparedLoss, pOut: number, memo?: LossMemo): ElementReport {
  const warnings: KindWarning[] = [];
  const rated = prepared.ratedPower;
  const { extrapolated } = prepared.loss(pOut);
  if (extrapolated) {
    warnings.push({
      code: 'curve-extrapolated',
      message: `operating at ${fmtPct(pOut / (rated ?? 1))} of rated output, outside the datasheet points; the end value is used`,
    });
  }
  if (rated !== undefined && pOut > rated * (1 + 1e-9)) {
    warnings.push({ code: 'rating-exceeded', ...say`output ${q(pOut, 'W')} exceeds the rated ${q(rated, 'W')}` });
  }
  if (prepared.fit) {
    const f = prepared.fit;
    if (f.p0 < 0 || f.k1 < 0 || f.k2 < 0) {
      warnings.push({
        code: 'fit-error',
        message: 'the fitted loss polynomial has a negative term; check the datasheet points (the fit may not hold outside them)',
      });
    }
  }
  const report: ElementReport = { warnings };
  if (rated !== undefined) report.loadFraction = pOut / rated;
  const weighted = weightedOf(prepared, memo);
  if (weighted) report.weighted = weighted;
  if (prepared.fit) report.fit = { ...prepared.fit };
  return report;
}

export const fmtW = (w: number): string => (Math.abs(w) >= 1e6 || !Number.isFinite(w) ? valueText(q(w, 'W')) : Math.abs(w) >= 1000 ? `${(w / 1000).toPrecision(4)} kW` : `${w.toPrecision(4)} W`);
export const fmtPct = (x: number): string => `${figure(x * 100, 1)} %`;

/** A load: constant complex power regardless of voltage. */
export function constantPowerLoad(s: Complex): ElementModel {
  return pureModel({
    out: null,
    outputVoltage: () => ZERO,
    inputPower: () => s,
    report: () => ({ warnings: [] }),
  });
}

/**
 * A load drawing a constant current (magnitude and angle to its voltage): S = m·|V|·conj(J) with J
 * the per-phase current phasor relative to the voltage (complex power S = V·I* per phase, the
 * current held whatever the voltage). The link feeding it takes J as a current (seriesLink).
 */
export function constantCurrentLoad(j: Complex, kind: PortKind): ElementModel {
  const m = phaseCount(kind);
  const sPerVolt = scale(conj(j), m);
  return pureModel({
    out: null,
    current: j,
    outputVoltage: () => ZERO,
    inputPower: (_sOut, vIn) => scale(sPerVolt, abs(vIn)),
    report: () => ({ warnings: [] }),
  });
}
