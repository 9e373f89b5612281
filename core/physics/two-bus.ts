/**
 * Exact two-bus solution of a series link R + jX carrying a constant-power load.
 *
 * Method: with the receiving voltage Vr taken as reference (real, v) and the receiving power
 * S = P + jQ (per phase), the current is I = (P − jQ)/v and Vs = v + (R + jX)·I, so
 *   |Vs|²·v² = (v² + a)² + b²,  a = R·P + X·Q,  b = X·P − R·Q.
 * With u = v² this is the quadratic u² + (2a − |Vs|²)·u + (a² + b²) = 0. The operating point is the
 * larger root; a negative discriminant means the load is beyond what the link can deliver
 * (past the nose of the P–V curve).
 */
import { type Complex, abs, arg, polar } from './complex.ts';

/** Receiving-end voltage phasor, or null when the load cannot be delivered through the link. */
export function receivingVoltage(vs: Complex, z: Complex, s: Complex): Complex | null {
  const vs2 = vs.re * vs.re + vs.im * vs.im;
  const a = z.re * s.re + z.im * s.im;
  const b = z.im * s.re - z.re * s.im;
  const bigA = vs2 - 2 * a;
  const disc = bigA * bigA - 4 * (a * a + b * b);
  if (bigA <= 0 || disc < 0) return null;
  const u = (bigA + Math.sqrt(disc)) / 2;
  const v = Math.sqrt(u);
  // Vs·v = (u + a) + j·b, so Vs leads Vr by atan2(b, u + a).
  const lead = Math.atan2(b, u + a);
  return polar(v, arg(vs) - lead);
}

/** |I| for a per-phase complex power s at per-phase voltage v. */
export const currentMagnitude = (s: Complex, v: Complex): number => abs(s) / abs(v);
