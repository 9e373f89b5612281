/**
 * Converter loss models, all expressed against output real power P_out (W).
 *
 * - constant efficiency:         P_loss = P_out·(1/η − 1) + P_idle
 * - efficiency vs load fraction: η(x) interpolated linearly between datasheet points, x = P_out/P_rated,
 *                                held at the end value outside the range (flagged), + P_idle
 * - converter loss polynomial:   P_loss = P0 + k1·P_out + k2·P_out²  (no-load, linear and
 *                                resistive loss terms)
 * - polynomial fit:              the same polynomial fitted by linear least squares to datasheet
 *                                points (normal equations in the scaled variable x = P/P_rated)
 * Weighted efficiencies (η_EURO, η_CEC) evaluate the model at the published load points.
 */
import type { EfficiencyPoint, LossModel } from '../model/project.ts';
import type { LossFitReport, WeightedEfficiency } from '../model/result.ts';
import { CEC_WEIGHTING, EURO_WEIGHTING, type WeightingPoint } from '../data/efficiency-weighting.ts';

/** A loss model made ready for evaluation. */
export interface PreparedLoss {
  /** Rated output power, W, when the model knows it. */
  readonly ratedPower: number | undefined;
  /** Loss at an output power, W; `extrapolated` when a curve was held past its last point. */
  loss(pOut: number): { loss: number; extrapolated: boolean };
  readonly fit?: LossFitReport;
}

/** Linear interpolation of y over x in sorted points, held at the ends. */
export function interpolate(
  points: readonly { x: number; y: number }[],
  x: number,
): { y: number; extrapolated: boolean } {
  const first = points[0]!;
  const last = points[points.length - 1]!;
  if (x <= first.x) return { y: first.y, extrapolated: x < first.x };
  if (x >= last.x) return { y: last.y, extrapolated: x > last.x };
  let i = 1;
  while (points[i]!.x < x) i++;
  const p0 = points[i - 1]!;
  const p1 = points[i]!;
  return { y: p0.y + ((p1.y - p0.y) * (x - p0.x)) / (p1.x - p0.x), extrapolated: false };
}

const lossAtEfficiency = (pOut: number, eta: number): number => pOut * (1 / eta - 1);

/**
 * Least-squares fit of P_loss = c0 + c1·x + c2·x² to the datasheet points (x = load fraction),
 * solved through the 3×3 normal equations by Gaussian elimination with partial pivoting.
 */
export function fitLossPolynomial(ratedPower: number, points: readonly EfficiencyPoint[]): LossFitReport {
  const rows = points.map((p) => ({ x: p.loadFraction, y: lossAtEfficiency(p.loadFraction * ratedPower, p.efficiency) }));
  const n = [
    [0, 0, 0, 0],
    [0, 0, 0, 0],
    [0, 0, 0, 0],
  ];
  for (const { x, y } of rows) {
    const basis = [1, x, x * x];
    for (let r = 0; r < 3; r++) {
      for (let k = 0; k < 3; k++) n[r]![k]! += basis[r]! * basis[k]!;
      n[r]![3]! += basis[r]! * y;
    }
  }
  const coef = solve3(n);
  const [c0, c1, c2] = coef;
  let sq = 0;
  let maxEtaErr = 0;
  for (let i = 0; i < rows.length; i++) {
    const { x, y } = rows[i]!;
    const fitted = c0 + c1 * x + c2 * x * x;
    sq += (fitted - y) ** 2;
    const pOut = x * ratedPower;
    const etaFit = pOut / (pOut + fitted);
    maxEtaErr = Math.max(maxEtaErr, Math.abs(etaFit - points[i]!.efficiency));
  }
  return {
    p0: c0,
    k1: c1 / ratedPower,
    k2: c2 / (ratedPower * ratedPower),
    rmsLossError: Math.sqrt(sq / rows.length),
    maxEfficiencyError: maxEtaErr,
  };
}

/**
 * Condition number (1-norm, ‖N‖·‖N⁻¹‖) of the normal equations of the loss fit at these load
 * fractions: the fit's coefficients lose about log10 of it in significant digits. Infinite when
 * the equations are singular. The inverse is taken by cofactors (3×3).
 */
export function fitConditioning(fractions: readonly number[]): number {
  const n = [
    [0, 0, 0],
    [0, 0, 0],
    [0, 0, 0],
  ];
  for (const x of fractions) {
    const basis = [1, x, x * x];
    for (let r = 0; r < 3; r++) for (let k = 0; k < 3; k++) n[r]![k]! += basis[r]! * basis[k]!;
  }
  const [[a, b, c], [d, e, f], [g, h, i]] = n as [[number, number, number], [number, number, number], [number, number, number]];
  const cof = [
    [e * i - f * h, -(b * i - c * h), b * f - c * e],
    [-(d * i - f * g), a * i - c * g, -(a * f - c * d)],
    [d * h - e * g, -(a * h - b * g), a * e - b * d],
  ];
  const det = a * cof[0]![0]! + b * cof[1]![0]! + c * cof[2]![0]!;
  if (det === 0 || !Number.isFinite(det)) return Infinity;
  const norm1 = (m: number[][]): number => Math.max(...[0, 1, 2].map((k) => m.reduce((sum, row) => sum + Math.abs(row[k]!), 0)));
  return (norm1(n) * norm1(cof)) / Math.abs(det);
}

function solve3(m: number[][]): [number, number, number] {
  const a = m.map((r) => r.slice());
  for (let col = 0; col < 3; col++) {
    let piv = col;
    for (let r = col + 1; r < 3; r++) if (Math.abs(a[r]![col]!) > Math.abs(a[piv]![col]!)) piv = r;
    [a[col], a[piv]] = [a[piv]!, a[col]!];
    for (let r = col + 1; r < 3; r++) {
      const f = a[r]![col]! / a[col]![col]!;
      for (let k = col; k < 4; k++) a[r]![k]! -= f * a[col]![k]!;
    }
  }
  const x = [0, 0, 0];
  for (let r = 2; r >= 0; r--) {
    let s = a[r]![3]!;
    for (let k = r + 1; k < 3; k++) s -= a[r]![k]! * x[k]!;
    x[r] = s / a[r]![r]!;
  }
  return [x[0]!, x[1]!, x[2]!];
}

/** Make a loss model ready: sort curve points, fit polynomials. Input must already be valid. */
export function prepareLoss(model: LossModel): PreparedLoss {
  switch (model.model) {
    case 'constant': {
      const idle = model.idleLoss ?? 0;
      return {
        ratedPower: model.ratedPower,
        loss: (p) => ({ loss: lossAtEfficiency(p, model.efficiency) + idle, extrapolated: false }),
      };
    }
    case 'curve': {
      const idle = model.idleLoss ?? 0;
      const pts = [...model.points]
        .sort((a, b) => a.loadFraction - b.loadFraction)
        .map((p) => ({ x: p.loadFraction, y: p.efficiency }));
      const rated = model.ratedPower;
      return {
        ratedPower: rated,
        loss: (p) => {
          if (p === 0) return { loss: idle, extrapolated: false };
          const { y, extrapolated } = interpolate(pts, p / rated);
          return { loss: lossAtEfficiency(p, y) + idle, extrapolated };
        },
      };
    }
    case 'polynomial': {
      const { p0, k1, k2 } = model;
      return { ratedPower: model.ratedPower, loss: (p) => ({ loss: p0 + k1 * p + k2 * p * p, extrapolated: false }) };
    }
    case 'polynomial-fit': {
      const fit = fitLossPolynomial(model.ratedPower, model.points);
      const { p0, k1, k2 } = fit;
      const xs = model.points.map((p) => p.loadFraction);
      const lo = Math.min(...xs) * model.ratedPower;
      const hi = Math.max(...xs) * model.ratedPower;
      return {
        ratedPower: model.ratedPower,
        fit,
        loss: (p) => ({ loss: p0 + k1 * p + k2 * p * p, extrapolated: p > 0 && (p < lo || p > hi) }),
      };
    }
  }
}

/** Efficiency at an output power: P_out / (P_out + P_loss). */
export function efficiencyAt(prepared: PreparedLoss, pOut: number): number {
  return pOut / (pOut + prepared.loss(pOut).loss);
}

const weighted = (prepared: PreparedLoss, rated: number, table: readonly WeightingPoint[]): number =>
  table.reduce((sum, pt) => sum + pt.weight * efficiencyAt(prepared, pt.loadFraction * rated), 0);

/** η_EURO and η_CEC of a model with a rated power (undefined without one). */
export function weightedEfficiency(prepared: PreparedLoss): WeightedEfficiency | undefined {
  const rated = prepared.ratedPower;
  if (rated === undefined) return undefined;
  return { euro: weighted(prepared, rated, EURO_WEIGHTING), cec: weighted(prepared, rated, CEC_WEIGHTING) };
}
