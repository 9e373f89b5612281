/**
 * Fan curves and the fan's operating point, on the pump model of pump-fan.ts.
 *
 * Methods:
 * - fan curve at full speed, quadratic (common practice), as the maker prints it at standard air
 *   (ρ₀ = 1.2 kg/m³, common practice): Δp(Q) = p0 − a·Q², a = (p0 − p_r)/Q_r², through the
 *   shut-off pressure p0 and the rated point (Q_r, p_r);
 * - system curve with no static head (a duct system): Δp_sys(Q) = k·Q², k = p_r/Q_r²;
 * - fan laws for the air's density: at one speed and flow, pressure and power scale with ρ/ρ₀;
 * - the fan as a pump of the same model: the pressure as the head of a column of standard air,
 *   H = Δp/(ρ₀·g), gives ρ·g·Q·H = Q·Δp·ρ/ρ₀, the shaft power Q·Δp/η at the air's density. With no
 *   static head the affinity laws put the speed at n = Q/Q_r (pump-fan.ts `affinitySpeed` with
 *   H_s = 0: n = √((k + a)·Q²/H0) and k + a = H0/Q_r²), so the shaft power on speed control is
 *   P_r·(Q/Q_r)³ (power ∝ speed³);
 * - outlet damper: the fan runs at full speed on its own curve, Δp = p0 − a·Q², the damper takes
 *   up the difference to the system curve (the pump model's throttling); fan efficiency constant.
 * Assumption, as for pumps: fan efficiency is constant over the range (the affinity laws' own
 * assumption); real fans lose efficiency away from their best point, at a closed damper too.
 */
import type { FanLoad, PumpCurve } from '../model/project.ts';
import { STANDARD_GRAVITY, affinitySpeed, pumpCurveHead, pumpShaftPower, systemCurveHead } from './pump-fan.ts';

/** Standard air, kg/m³: the density fan curves are printed at (common practice, no source). */
export const STANDARD_AIR_DENSITY = 1.2;

/** The fan's curve as a pump curve in metres of standard air (H = Δp/(ρ₀·g)), at the air's own density. */
export function fanAsPumpCurve(f: Pick<FanLoad, 'ratedFlow' | 'ratedPressure' | 'shutoffPressure' | 'efficiency' | 'density'>): PumpCurve {
  const perMetre = STANDARD_AIR_DENSITY * STANDARD_GRAVITY;
  return {
    ratedFlow: f.ratedFlow,
    ratedHead: f.ratedPressure / perMetre,
    shutoffHead: f.shutoffPressure / perMetre,
    efficiency: f.efficiency,
    density: f.density ?? STANDARD_AIR_DENSITY,
  };
}

/** A head of the equivalent pump curve back to the fan's pressure at the air's density, Pa: Δp = ρ·g·H. */
export const fanPressureOfHead = (f: Pick<FanLoad, 'density'>, head: number): number => (f.density ?? STANDARD_AIR_DENSITY) * STANDARD_GRAVITY * head;

/** The fan's operating point. */
export interface FanOperatingPoint {
  control: 'speed' | 'damper';
  /** m³/s. */
  flow: number;
  /** Speed as a fraction of full speed (1 with the damper). */
  speed: number;
  /** Fan pressure at the operating point, at the air's density, Pa. */
  pressure: number;
  /** Q·Δp / η, W. */
  shaftPower: number;
  /** Shaft power at the rated (design) point, W. */
  designShaftPower: number;
}

/** Operating point of a validated fan element: speed control on the system curve, or the damper on the fan curve. */
export function fanOperatingPoint(e: FanLoad): FanOperatingPoint {
  const curve = fanAsPumpCurve(e);
  // Affinity laws with no static head (n = Q/Q_r), or full speed on the fan curve behind the damper.
  const speed = e.control === 'speed' ? affinitySpeed(curve, 0, e.flow) : 1;
  const head = e.control === 'speed' ? systemCurveHead(curve, 0, e.flow) : pumpCurveHead(curve, e.flow);
  return {
    control: e.control,
    flow: e.flow,
    speed,
    pressure: fanPressureOfHead(e, head),
    shaftPower: pumpShaftPower(curve, e.flow, head),
    designShaftPower: pumpShaftPower(curve, e.ratedFlow, curve.ratedHead),
  };
}
