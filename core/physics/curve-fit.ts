/**
 * A pump or fan curve from the maker's measured points: least-squares fit of the quadratic the
 * model uses, y = y0 − a·Q² (head or pressure y against flow Q; pump-fan.ts, fan.ts).
 *
 * Method: ordinary linear least squares in (y0, a) with the regressor u = Q² (normal equations of
 * a straight line y = y0 + m·u, m = −a): m = Σ(u − ū)(y − ȳ) / Σ(u − ū)², y0 = ȳ − m·ū. The form has
 * no linear term, as the model's curve through the shut-off and rated points; three points on such
 * a curve give it back exactly. The fit's residual is given as its root mean square and its largest
 * deviation, in the unit of y.
 */

export interface CurvePoint {
  /** m³/s. */
  flow: number;
  /** Head (m) or pressure (Pa) at that flow. */
  value: number;
}

export interface CurveFit {
  /** y at zero flow (shut-off head or pressure). */
  shutoff: number;
  /** The curve's fall: y = shutoff − a·Q². */
  a: number;
  /** Root-mean-square deviation of the points from the fitted curve, in the unit of y. */
  rmsResidual: number;
  /** Largest deviation of a point from the fitted curve, in the unit of y. */
  maxResidual: number;
  method: string;
}

export type CurveFitOutcome = { ok: true; fit: CurveFit } | { ok: false; index?: number; field?: 'flow' | 'value'; message: string };

export const CURVE_FIT_METHOD = 'least squares of y = y0 − a·Q² (regressor Q²)';

/** Least-squares fit of the quadratic y = y0 − a·Q² through three or more points; refused with the reason when it cannot give a falling curve. */
export function fitFallingQuadratic(points: readonly CurvePoint[]): CurveFitOutcome {
  if (points.length < 3) return { ok: false, message: 'needs at least three points from the maker\'s curve' };
  for (const [i, p] of points.entries()) {
    if (!Number.isFinite(p.flow) || p.flow < 0) return { ok: false, index: i, field: 'flow', message: 'must be a flow of 0 or more' };
    if (!Number.isFinite(p.value) || p.value <= 0) return { ok: false, index: i, field: 'value', message: 'must be greater than 0' };
  }
  const n = points.length;
  const u = points.map((p) => p.flow * p.flow);
  const ub = u.reduce((s, x) => s + x, 0) / n;
  const yb = points.reduce((s, p) => s + p.value, 0) / n;
  let sxx = 0;
  let sxy = 0;
  points.forEach((p, i) => {
    sxx += (u[i]! - ub) ** 2;
    sxy += (u[i]! - ub) * (p.value - yb);
  });
  if (!(sxx > 0) || !Number.isFinite(sxx)) return { ok: false, message: 'needs points at two flows at least' };
  const m = sxy / sxx;
  const shutoff = yb - m * ub;
  const a = -m;
  if (!(a > 0) || !Number.isFinite(a)) return { ok: false, message: 'the points do not fall with flow: a pump or fan curve falls from its shut-off value' };
  if (!(shutoff > 0) || !Number.isFinite(shutoff)) return { ok: false, message: 'the fitted curve has no positive shut-off value' };
  let ss = 0;
  let max = 0;
  points.forEach((p, i) => {
    const r = p.value - (shutoff - a * u[i]!);
    ss += r * r;
    max = Math.max(max, Math.abs(r));
  });
  return { ok: true, fit: { shutoff, a, rmsResidual: Math.sqrt(ss / n), maxResidual: max, method: CURVE_FIT_METHOD } };
}

/** The fitted curve's value at a flow: y0 − a·Q². */
export const curveAt = (fit: Pick<CurveFit, 'shutoff' | 'a'>, flow: number): number => fit.shutoff - fit.a * flow * flow;
