/**
 * What the duty editor shows of a pump's or fan's curves, and the curve fitted from the maker's
 * points, written back as the element's own two curve fields.
 *
 * Methods: the machine's full-speed curve is the quadratic through shut-off and rated point
 * (core/physics/pump-fan.ts `pumpCurveHead`; a fan's pressure through core/physics/fan.ts); the
 * system curve H_s + k·Q² through the rated point (a fan: no static head, k·Q²); the fit is least
 * squares of y = y0 − a·Q² (core/physics/curve-fit.ts). The file keeps the curve as shut-off and
 * rated head (or pressure): the fitted curve is written as y0 and y0 − a·Q_r² at the element's own
 * rated flow, so the model, the form and every file written before read it unchanged; the points
 * themselves are not stored.
 */
import type { FanLoad, PumpLoad } from '../../model/project.ts';
import { fitFallingQuadratic, curveAt, type CurveFit, type CurvePoint } from '../../physics/curve-fit.ts';
import { fanAsPumpCurve, fanPressureOfHead } from '../../physics/fan.ts';
import { affinitySpeed, pumpCurveHead, systemCurveHead } from '../../physics/pump-fan.ts';

/** One row of the curve table: at this flow, what the system needs and what the machine gives at full speed (m or Pa). */
export interface CurveRow {
  /** Fraction of the rated flow. */
  fraction: number;
  /** m³/s. */
  flow: number;
  /** Head (m) or pressure (Pa) the system needs at this flow. */
  system: number;
  /** Head (m) or pressure (Pa) of the machine at full speed at this flow. */
  machine: number;
}

export interface DutyCurves {
  machine: 'pump' | 'fan';
  /** 'm' of head for a pump, 'Pa' for a fan. */
  unit: 'm' | 'Pa';
  /** Static head (m) or 0 for a fan. */
  staticValue: number;
  rows: CurveRow[];
}

const FRACTIONS = [0, 0.25, 0.5, 0.75, 1] as const;

/** The system and full-speed curves of a validated pump or fan at 0, 25, 50, 75 and 100 % of its rated flow. */
export function dutyCurves(e: PumpLoad | FanLoad): DutyCurves {
  if (e.kind === 'fan') {
    const curve = fanAsPumpCurve(e);
    return {
      machine: 'fan',
      unit: 'Pa',
      staticValue: 0,
      rows: FRACTIONS.map((f) => {
        const Q = f * e.ratedFlow;
        return { fraction: f, flow: Q, system: fanPressureOfHead(e, systemCurveHead(curve, 0, Q)), machine: fanPressureOfHead(e, pumpCurveHead(curve, Q)) };
      }),
    };
  }
  return {
    machine: 'pump',
    unit: 'm',
    staticValue: e.staticHead,
    rows: FRACTIONS.map((f) => {
      const Q = f * e.ratedFlow;
      return { fraction: f, flow: Q, system: systemCurveHead(e, e.staticHead, Q), machine: pumpCurveHead(e, Q) };
    }),
  };
}

/** The element's fields the fitted curve sets, in an order that keeps every step valid (see `curveFromPoints`). */
export type CurveFieldWrite = { path: 'shutoffHead' | 'ratedHead' | 'shutoffPressure' | 'ratedPressure'; value: number }[];

export type CurveFromPoints =
  | { ok: true; fit: CurveFit; shutoff: number; rated: number; writes: CurveFieldWrite }
  | { ok: false; index?: number; field?: 'flow' | 'value'; message: string };

/**
 * Fit the maker's points (flow m³/s, head m or pressure Pa at the catalogue's standard air) and say
 * which fields to write: shut-off = y0, rated = y0 − a·Q_r² at the element's rated flow. Refused when
 * the fit cannot be a curve of this element (the rated value must stay above a pump's static head).
 */
export function curveFromPoints(e: PumpLoad | FanLoad, points: readonly CurvePoint[]): CurveFromPoints {
  const out = fitFallingQuadratic(points);
  if (!out.ok) return out;
  const shutoff = out.fit.shutoff;
  const rated = curveAt(out.fit, e.ratedFlow);
  if (!(rated > 0)) return { ok: false, message: 'the fitted curve falls to zero before the rated flow: check the points and the rated flow' };
  const fan = e.kind === 'fan';
  if (!fan && !(rated > e.staticHead)) return { ok: false, message: 'the fitted curve at the rated flow is not above the static head of the system' };
  const shutoffPath = fan ? 'shutoffPressure' : 'shutoffHead';
  const ratedPath = fan ? 'ratedPressure' : 'ratedHead';
  const oldRated = fan ? e.ratedPressure : e.ratedHead;
  // Each write must leave shut-off above rated: raise the shut-off first when it stays above the old
  // rated value, else lower the rated value first.
  const writes: CurveFieldWrite =
    shutoff > oldRated
      ? [{ path: shutoffPath, value: shutoff }, { path: ratedPath, value: rated }]
      : [{ path: ratedPath, value: rated }, { path: shutoffPath, value: shutoff }];
  return { ok: true, fit: out.fit, shutoff, rated, writes };
}

/** The machine's curve for the affinity laws: a pump's own, a fan's as a pump of standard air with no static head. */
const affinityCurve = (e: PumpLoad | FanLoad) => (e.kind === 'fan' ? { curve: fanAsPumpCurve(e), staticHead: 0 } : { curve: e, staticHead: e.staticHead });

/** The speed (fraction of full speed) at which the machine gives this flow on its system curve (affinity laws, pump-fan.ts `affinitySpeed`). */
export function dutySpeedAtFlow(e: PumpLoad | FanLoad, flow: number): number {
  const { curve, staticHead } = affinityCurve(e);
  return affinitySpeed(curve, staticHead, flow);
}

export type FlowAtSpeed = { ok: true; flow: number } | { ok: false; message: string };

/**
 * The flow a duty level given as a speed gives on the system curve: the inverse of the affinity laws'
 * n = √((H_s + (k + a)·Q²)/H0), Q = √((n²·H0 − H_s)/(k + a)) (with no static head, Q = n·Q_r). A speed
 * at which the machine cannot lift the static head gives no flow and is refused, as is one above full
 * speed (the rated flow is the most the system takes at full speed).
 */
export function dutyFlowAtSpeed(e: PumpLoad | FanLoad, speed: number): FlowAtSpeed {
  const { curve, staticHead } = affinityCurve(e);
  if (!Number.isFinite(speed) || speed > 1 + 1e-12) return { ok: false, message: 'must be at most 100 % (full speed gives the rated flow)' };
  const Q2 = curve.ratedFlow * curve.ratedFlow;
  const a = (curve.shutoffHead - curve.ratedHead) / Q2;
  const k = (curve.ratedHead - staticHead) / Q2;
  const lift = speed * speed * curve.shutoffHead - staticHead;
  if (!(lift > 0)) {
    const least = Math.sqrt(staticHead / curve.shutoffHead);
    return { ok: false, message: `must be above ${(100 * least).toPrecision(3)} %: below it the pump does not lift the static head and gives no flow` };
  }
  return { ok: true, flow: Math.min(curve.ratedFlow, Math.sqrt(lift / (k + a))) };
}
