/**
 * The file format, part 1: what every element shares — port kinds, power-factor sense, the loss and
 * power-factor models of converting elements, an element's id and name, the `from` of a fed element,
 * a protective device. SI units throughout (see project.ts).
 */

/** The kind of electrical (or mechanical) connection between two elements. */
export type PortKind = 'dc' | 'ac1' | 'ac3' | 'shaft';

/** Power-factor sense of an AC quantity: lagging = inductive (Q > 0), leading = capacitive (Q < 0). */
export type PfSense = 'lagging' | 'leading';

/** One datasheet point: efficiency at a fraction of the rated output power. */
export interface EfficiencyPoint {
  /** Output power as a fraction of rated output (0.1 = 10 %). */
  loadFraction: number;
  /** Efficiency at that point, 0.01 ≤ η ≤ 1 (below 1 % refused: the loss P_out·(1/η − 1) would swamp every figure). */
  efficiency: number;
}

/**
 * How a converting stage loses power. Every model is expressed against OUTPUT real power P_out.
 * - `constant`: P_loss = P_out·(1/η − 1).
 * - `curve`: η interpolated linearly in load fraction between datasheet points; held at the
 *   end value (with a warning) outside the given range.
 * - `polynomial`: the converter loss polynomial P_loss = P0 + k1·P_out + k2·P_out².
 * - `polynomial-fit`: the same polynomial fitted by least squares to datasheet points.
 * `idleLoss` (standby / no-load draw, W) is added to any model except the polynomials, whose P0
 * already is the no-load loss.
 */
export type LossModel =
  | { model: 'constant'; efficiency: number; idleLoss?: number; ratedPower?: number }
  | { model: 'curve'; ratedPower: number; points: EfficiencyPoint[]; idleLoss?: number }
  | { model: 'polynomial'; p0: number; k1: number; k2: number; ratedPower?: number }
  | { model: 'polynomial-fit'; ratedPower: number; points: EfficiencyPoint[] };

/** Power factor that may vary with load fraction (motors). */
export type PowerFactorModel =
  | { model: 'constant'; powerFactor: number }
  | { model: 'curve'; points: { loadFraction: number; powerFactor: number }[] };

export interface ElementBase {
  /** Unique id within the project; used in every message about this element. */
  id: string;
  /** A name the user gives (optional; the id is shown when absent). */
  name?: string;
  /**
   * Purchase price of the element, currency units (≥ 0; optional): the outlay the lifetime cost
   * counts at year 0 (core/studies/lifetime.ts). The currency is the user's own, as the running
   * settings' energy price (the file holds a plain number).
   */
  price?: number;
}

export interface FedElement extends ElementBase {
  /** Id of the element whose output feeds this one. */
  from: string;
}

/** A protective device (fuse or breaker) and its interrupting rating (breaking capacity), A. */
export interface ProtectiveDevice {
  /** Highest prospective current the device can interrupt, A (DC rating on a DC circuit). */
  interruptingRating: number;
}
