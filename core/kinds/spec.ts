/**
 * What every element kind provides to the solver (its model and the traits the rest of the engine
 * reads from the registry), and the schema parts the kinds share. The shared electrical models
 * (series link, regulating converter, loads, loss report) live in models.ts and are re-exported
 * here.
 *
 * Conventions of the solve: voltages are per-phase phasors (phase-to-neutral on three-phase, the
 * line voltage on single-phase, a real number on DC); powers are TOTAL complex powers S = P + jQ
 * (all phases), Q > 0 lagging.
 */
import { z } from 'zod/mini';
import type { Element, ElementKind, PortKind } from '../model/project.ts';
import type { Problem } from '../model/errors.ts';
import type { LossFitReport, WarningCode, WeightedEfficiency } from '../model/result.ts';
import type { Complex } from '../physics/complex.ts';
import { fitConditioning } from '../physics/loss-model.ts';
import { RANGES, rangeText, ranged } from './ranges.ts';
import type { MessageValue } from '../model/message.ts';

export * from './models.ts';

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
  /** The message with its numbers as quantities (core/model/message.ts), when it carries numbers. */
  template?: string;
  values?: MessageValue[];
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

/**
 * A port as it is rated (read from set-points and ratings, not solved): its kind and, when known,
 * its nominal voltage (line-to-line on three-phase) and frequency.
 */
export interface NominalPort {
  kind: PortKind;
  voltage?: number;
  frequency?: number;
}

/**
 * A load's rated quantity: the field a load profile of the battery study sets (and the repeated
 * solve changes per load state) and its SI unit.
 */
export interface LoadQuantity {
  readonly field: 'power' | 'apparentPower' | 'current';
  readonly unit: 'W' | 'VA' | 'A';
}

/**
 * The studies an element of a kind takes part in beyond the plain solve:
 * - `backup`: a battery source with a bank: runtime, bank sizing and recharge (core/studies/backup);
 * - `machines`: motor, drive and pump details (core/studies/machines);
 * - `motor-start`: a motor with starting data (core/studies/surge/starting.ts);
 * - `pump-duty`: the flow-control comparison of a pump (core/studies/machines/pump-duty.ts);
 * - `fault-current`: a source whose prospective fault current the surge study works out
 *   (core/studies/surge/faults.ts).
 */
export type KindStudy = 'backup' | 'machines' | 'motor-start' | 'pump-duty' | 'fault-current';

/** What every element record has, whatever its kind (a made-up kind in a test has it too). */
export interface KindElement {
  id: string;
  name?: string;
  kind: string;
}

export interface KindSpec<E extends KindElement = Element> {
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

  // ---------- traits: facts about the kind, declared here once and read from the registry ----------

  /**
   * A converter that holds its output voltage at its set point whatever its input voltage, drawing
   * P_in = P_out + loss(P_out) (regulatingConverter in models.ts). Read by the whole-path drop (a
   * path starts afresh at its output), the battery study's repeated solve (its input power does not
   * depend on the bank voltage) and the motor-start study (the start's dip stops at it).
   */
  readonly regulatesVoltage?: boolean;
  /**
   * An element that carries its input on without converting it (a cable, a DC bus): the same port
   * kind, a voltage that follows its input's, an input power that depends on that voltage. The
   * conductor rules look through it to the equipment it feeds; the battery study re-solves it at
   * every step.
   */
  readonly passive?: boolean;
  /**
   * Passive kinds on DC: the loop resistance (Ω) and fixed loss (W) the element is, or null when it
   * is not so simple (a cable still to be sized). The battery study's repeated solve then re-solves
   * it in real arithmetic, after checking the equivalent against the model (core/solve/repeat.ts).
   */
  dcEquivalent?(e: E): { resistance: number; fixedLoss: number } | null;
  /** A load whose level a load profile sets: its rated field and unit (absent on other kinds). */
  readonly load?: LoadQuantity;
  /**
   * The output port the element is meant to give when fed at `input` (its nominal port, from its
   * own set-points and ratings; null when it has none or cannot be read). Read by the conductor
   * sizing (the nominal voltage of each system) and by the page's templates, which call it on
   * drafts: it must not throw on a missing or mistyped field (a field that is not a finite number
   * counts as absent). Absent on loads.
   */
  nominalOutput?(e: E, input: NominalPort | null): NominalPort | null;
  /**
   * Warnings that need the elements this one feeds (its model's report sees only powers): `fed`
   * holds them, looked through pass-through stages (cables, buses) to the equipment below. Read by
   * the solve's result (core/solve/report.ts), beside the model's own warnings. Absent on most kinds.
   */
  fedWarnings?(e: E, fed: readonly Element[]): KindWarning[];
  /**
   * Sources: the same element with its own impedance taken out (an ideal source at its EMF), for
   * the nominal solve of the conductor sizing, which puts every system at its nominal voltage.
   */
  ideal?(e: E): E;
  /**
   * A source kind that may also be fed from a bus (a battery bank on a DC bus): what it is in the
   * chain when it has a `from` (it is then built with its feeding port and drawn as a load: the
   * bank's float current on supply). Read by the plan (each element's role), the tree checks (it is
   * not then the chain's source) and core/solve/modes.ts. Absent on other kinds.
   */
  readonly fedRole?: 'load';
  /** The studies an element of this kind takes part in (see KindStudy); absent when none. */
  readonly studies?: readonly KindStudy[];
}

/** Helper to keep each kind's spec typed to its element. */
export const defineKind = <E extends KindElement>(spec: KindSpec<E>): KindSpec<E> => spec;

/** A field read for a nominal port: a finite number, or undefined (drafts may hold anything). */
export const finiteOrNone = (v: unknown): number | undefined => (typeof v === 'number' && Number.isFinite(v) ? v : undefined);

/** A nominal port with the voltage and frequency given, leaving out what is not known. */
export const nominalPort = (kind: PortKind, voltage?: number, frequency?: number): NominalPort => ({
  kind,
  ...(voltage !== undefined ? { voltage } : {}),
  ...(frequency !== undefined ? { frequency } : {}),
});

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

export type { ElementKind };
