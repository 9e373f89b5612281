/**
 * What every element kind provides to the solver, and the helpers the kinds share.
 *
 * Conventions of the solve: voltages are per-phase phasors (phase-to-neutral on three-phase, the
 * line voltage on single-phase, a real number on DC); powers are TOTAL complex powers S = P + jQ
 * (all phases), Q > 0 lagging.
 */
import { z } from 'zod/mini';
import type { Element, ElementKind, PfSense, PortKind } from '../model/project.ts';
import type { Problem } from '../model/errors.ts';
import type { LossFitReport, WarningCode, WeightedEfficiency } from '../model/result.ts';
import { type Complex, ZERO, abs, add, arg, c, conj, div, mul, polar, scale, sub } from '../physics/complex.ts';
import { receivingVoltage } from '../physics/two-bus.ts';
import { type PreparedLoss, fitConditioning, prepareLoss, weightedEfficiency } from '../physics/loss-model.ts';
import { RANGES, rangeText, ranged } from './ranges.ts';

/** The port an element's output presents to the elements it feeds. */
export interface PortInfo {
  kind: PortKind;
  /** Hz, AC only. */
  frequency?: number;
  /** Shaft speed, rpm, when known. */
  speed?: number;
}

export interface KindWarning {
  code: WarningCode;
  message: string;
}

/**
 * What the loads fed directly from a series link draw besides constant power: the per-phase
 * admittance Y of its constant-impedance loads (re, im; zero when none) and, when it has
 * constant-current loads, `current`: the sum of their per-phase current phasors relative to the
 * link's output voltage, with `along`: the direction (unit phasor) of that voltage as the sweep
 * last found it.
 */
export interface DirectLoads extends Complex {
  readonly current?: Complex;
  readonly along?: Complex;
}

/** Details reported after the solve. */
export interface ElementReport {
  loadFraction?: number;
  weighted?: WeightedEfficiency;
  fit?: LossFitReport;
  warnings: KindWarning[];
  /**
   * Refusals that only the operating point reveals (a motor loaded beyond its service factor): the
   * solve then returns these problems and no result.
   */
  problems?: Omit<Problem, 'elementId'>[];
}

/** An element made ready for the solve (constants precomputed). Pure functions of their arguments. */
export interface ElementModel {
  /** Output port, null for loads. */
  readonly out: PortInfo | null;
  /**
   * Forward sweep: the output voltage phasor from the input voltage (null for a source) and the
   * output power. Returns null when the output power cannot be delivered (infeasible).
   * `y` is the per-phase admittance of constant-impedance loads fed directly from this output,
   * and `y.current` the per-phase current phasor of constant-current loads fed directly from it;
   * the power of both is then NOT in `sOut`. Only elements whose output voltage depends on the load
   * (series links) use it.
   */
  outputVoltage(vIn: Complex, sOut: Complex, y?: DirectLoads): Complex | null;
  /**
   * Per-phase admittance Y of a constant-impedance load (its input power is m·|V|²·conj(Y)), given
   * so that the link feeding it can solve it exactly (see seriesLink) rather than at the previous
   * sweep's voltage.
   */
  readonly admittance?: Complex;
  /**
   * Per-phase current of a constant-current load as a phasor relative to its own voltage
   * (I·(pf − j·sin φ) lagging, I on DC): its input power is m·|V|·conj(current). Given so that the
   * link feeding it can take it as a current (see seriesLink) rather than as the power it drew at
   * the previous sweep's voltage.
   */
  readonly current?: Complex;
  /**
   * True when the output voltage is the input voltage whatever the load (a DC bus): constant-current
   * loads behind it are handed to the link feeding it like its own (see the sweep's forward pass).
   */
  readonly passesVoltage?: boolean;
  /** Backward sweep: total input complex power from the total output power and the voltages. */
  inputPower(sOut: Complex, vIn: Complex, vOut: Complex): Complex;
  /** Details once the operating point is known. */
  report(sOut: Complex, sIn: Complex, vIn: Complex): ElementReport;
  /**
   * Refusals that need the feeding port to decide (a circuit whose impedance at the port's
   * frequency is next to nothing): the plan returns them and nothing is solved.
   */
  readonly problems?: Omit<Problem, 'elementId'>[];
}

export interface KindSpec<E extends Element = Element> {
  readonly kind: E['kind'];
  readonly role: 'source' | 'stage' | 'load';
  /** Port kinds this element can be fed from (empty for sources). */
  accepts(e: E): readonly PortKind[];
  /** Parameter schema: field types and single-field ranges. */
  readonly schema: z.ZodMiniType<E>;
  /** Checks across fields, run after the schema passed. */
  check?(e: E): Omit<Problem, 'elementId'>[];
  /** Prepare the element, given the port that feeds it (null for a source). */
  build(e: E, input: PortInfo | null): ElementModel;
}

/** Helper to keep each kind's spec typed to its element. */
export const defineKind = <E extends Element>(spec: KindSpec<E>): KindSpec<E> => spec;

// ---------- shared schema fragments ----------

const num = () => z.number({ error: 'must be a number' });
export const positive = (unit: string) => num().check(z.gt(0, `must be greater than 0 ${unit}`.trim()));
export const nonNegative = (unit: string) => num().check(z.gte(0, `must not be negative ${unit}`.trim()));
/** Power factor in (0, 1], at least 0.001 (the range table's power factor). */
export const unitFraction = (what: string) =>
  num().check(
    z.gt(0, `${what} must be greater than 0`),
    z.lte(1, `${what} must not exceed 1 (enter 0.95 for 95 %)`),
    z.superRefine((v: number, ctx) => {
      if (v > 0 && v < RANGES.powerFactor.min) ctx.addIssue({ code: 'custom', message: `${what} must be at least ${RANGES.powerFactor.min}: the plausible range of a power factor is ${rangeText('powerFactor')}`, input: v });
    }),
  );
/**
 * A converter's, motor's or pump's efficiency: the loss is P_out·(1/η − 1), so η near zero makes it
 * huge (1e-300 overflows every figure after it). Below 1 % no real machine is built: refused.
 */
export const MIN_EFFICIENCY = 0.01;
export const efficiencyField = () =>
  num().check(
    z.gte(MIN_EFFICIENCY, 'efficiency must be at least 1 %: below that the loss would be over 99 times the output (enter 0.95 for 95 %)'),
    z.lte(1, 'efficiency must not exceed 1 (enter 0.95 for 95 %)'),
  );
/**
 * A source's own resistance or reactance, Ω: 0 is an ideal source; anything else must be at least
 * 1 pΩ, since V/R (the short-circuit current) and I²·R overflow the doubles for the subnormal values
 * a slip can give (1.4e-322 Ω). No real source comes near 1 pΩ.
 */
export const MIN_SOURCE_OHMS = 1e-12;
export const sourceOhms = () =>
  ranged('sourceOhms', 'non-negative', 'Ω').check(z.refine((v) => v <= 0 || v >= MIN_SOURCE_OHMS, { message: 'must be 0 (an ideal source) or at least 1e-12 Ω: a smaller value makes the short-circuit current overflow' }));
/** Reserved ids (`__proto__`, `toString` …) are refused by the tree checks (core/solve/structure.ts). */
export const idField = z.string({ error: 'must be text' }).check(z.minLength(1, 'must not be empty'));
export const nameField = z.optional(z.string({ error: 'must be text' }));
export const fromField = z.string({ error: 'must name the feeding element' }).check(z.minLength(1, 'must name the feeding element'));
export const pfSense = z.optional(z.enum(['lagging', 'leading'], { error: 'must be "lagging" or "leading"' }));
export const phases = z.union([z.literal(1), z.literal(3)], { error: 'must be 1 or 3' });

const efficiencyPoints = z
  .array(
    z.strictObject({
      loadFraction: ranged('loadFraction', 'positive', '(a fraction of rated output, 0.1 = 10 %)'),
      efficiency: efficiencyField(),
    }),
    { error: 'must be a list of {loadFraction, efficiency} points' },
  )
  .check(z.minLength(2, 'needs at least two datasheet points'));

export const lossModelSchema = z.discriminatedUnion(
  'model',
  [
    z.strictObject({
      model: z.literal('constant'),
      efficiency: efficiencyField(),
      idleLoss: z.optional(ranged('power', 'non-negative')),
      ratedPower: z.optional(ranged('ratedPower')),
    }),
    z.strictObject({
      model: z.literal('curve'),
      ratedPower: ranged('ratedPower'),
      points: efficiencyPoints,
      idleLoss: z.optional(ranged('power', 'non-negative')),
    }),
    z.strictObject({
      model: z.literal('polynomial'),
      p0: ranged('power', 'non-negative'),
      k1: ranged('lossK1', 'non-negative'),
      k2: ranged('lossK2', 'non-negative'),
      ratedPower: z.optional(ranged('ratedPower')),
    }),
    z.strictObject({
      model: z.literal('polynomial-fit'),
      ratedPower: ranged('ratedPower'),
      points: efficiencyPoints.check(z.minLength(3, 'needs at least three datasheet points for a three-term fit')),
    }),
  ],
  { error: 'must be one of "constant", "curve", "polynomial", "polynomial-fit"' },
);

/** Checks on datasheet points that a schema cannot express: distinct load fractions. */
export function checkPoints(
  points: readonly { loadFraction: number }[],
  field: string,
  minDistinct: number,
): Omit<Problem, 'elementId'>[] {
  const distinct = new Set(points.map((p) => p.loadFraction)).size;
  if (distinct < points.length) {
    return [{ code: 'invalid-value', field, value: points.map((p) => p.loadFraction), message: 'two datasheet points have the same load fraction' }];
  }
  if (distinct < minDistinct) {
    return [{ code: 'invalid-value', field, message: `needs at least ${minDistinct} different load fractions` }];
  }
  return [];
}

export function checkLossModel(loss: z.infer<typeof lossModelSchema>): Omit<Problem, 'elementId'>[] {
  if (loss.model === 'curve') return checkPoints(loss.points, 'loss.points', 2);
  if (loss.model === 'polynomial-fit') {
    const points = checkPoints(loss.points, 'loss.points', 3);
    if (points.length) return points;
    // The fit solves normal equations; points bunched together make them nearly singular and the
    // coefficients meaningless (or NaN): refuse above a condition number that leaves ~6 digits.
    const cond = fitConditioning(loss.points.map((p) => p.loadFraction));
    if (!(cond <= MAX_FIT_CONDITION)) {
      return [{
        code: 'invalid-value',
        field: 'loss.points',
        value: loss.points.map((p) => p.loadFraction),
        message: `the load fractions are too close together for a three-term loss fit (the condition number of its equations is ${Number.isFinite(cond) ? cond.toExponential(1) : 'infinite'}; at most 1e10 is accepted): take datasheet points spread over the load range, e.g. 10 %, 50 % and 100 %`,
      }];
    }
  }
  return [];
}

/** Condition number (1-norm) above which a loss fit is refused: the coefficients keep about 6 significant digits. */
export const MAX_FIT_CONDITION = 1e10;

// ---------- shared electrical helpers ----------

export const phaseCount = (kind: PortKind): number => (kind === 'ac3' ? 3 : 1);

/** Per-phase voltage magnitude from the rated voltage (line-to-line on three-phase). */
export const perPhase = (kind: PortKind, voltage: number): number => (kind === 'ac3' ? voltage / Math.sqrt(3) : voltage);

/** Q drawn at a given P and power factor: Q = P·tan(arccos pf), negative when leading. */
export function reactiveFromPf(p: number, pf: number, sense: PfSense = 'lagging'): number {
  const q = Math.abs(p) * Math.tan(Math.acos(pf));
  return sense === 'leading' ? -q : q;
}

/**
 * A series impedance link solved exactly per phase (cables, transformer windings, source
 * impedance). `z` is the per-phase impedance: the loop impedance on DC and single-phase.
 */
export function seriesLink(z: Complex, kind: PortKind) {
  const m = phaseCount(kind);
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
        const atMaxTransfer = highestSend / (2 * abs(z));
        if (i > atMaxTransfer && receivingVoltage(vSend, z, scale(sOut, 1 / m)) === null) i = atMaxTransfer;
      }
      return add(sOut, scale(z, m * i * i));
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
  return {
    out: opts.out,
    outputVoltage: () => vOut,
    inputPower: (sOut) => {
      const pIn = sOut.re + prepared.loss(sOut.re).loss;
      return c(pIn, pf === 1 ? 0 : reactiveFromPf(pIn, pf, opts.inputPfSense));
    },
    report: (sOut) => lossReport(prepared, sOut.re),
  };
}

/** Load fraction, weighted efficiencies, fit and warnings of a loss model at an operating point. */
export function lossReport(prepared: PreparedLoss, pOut: number): ElementReport {
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
    warnings.push({ code: 'rating-exceeded', message: `output ${fmtW(pOut)} exceeds the rated ${fmtW(rated)}` });
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
  const weighted = weightedEfficiency(prepared);
  if (weighted) report.weighted = weighted;
  if (prepared.fit) report.fit = prepared.fit;
  return report;
}

export const fmtW = (w: number): string => (Math.abs(w) >= 1000 ? `${(w / 1000).toPrecision(4)} kW` : `${w.toPrecision(4)} W`);
export const fmtPct = (x: number): string => `${(x * 100).toFixed(1)} %`;

/** A load: constant complex power regardless of voltage. */
export function constantPowerLoad(s: Complex): ElementModel {
  return {
    out: null,
    outputVoltage: () => ZERO,
    inputPower: () => s,
    report: () => ({ warnings: [] }),
  };
}

/**
 * A load drawing a constant current (magnitude and angle to its voltage): S = m·|V|·conj(J) with J
 * the per-phase current phasor relative to the voltage (complex power S = V·I* per phase, the
 * current held whatever the voltage). The link feeding it takes J as a current (seriesLink).
 */
export function constantCurrentLoad(j: Complex, kind: PortKind): ElementModel {
  const m = phaseCount(kind);
  const sPerVolt = scale(conj(j), m);
  return {
    out: null,
    current: j,
    outputVoltage: () => ZERO,
    inputPower: (_sOut, vIn) => scale(sPerVolt, abs(vIn)),
    report: () => ({ warnings: [] }),
  };
}

export type { ElementKind };
