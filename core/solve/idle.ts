/**
 * Idle (no-load) draw of an element: what it takes in with nothing taken from its output.
 *
 * Method: the element's own backward-sweep function evaluated at zero output power,
 * P_idle = Re S_in(S_out = 0, V_in, V_out) — a converter's standby loss or the P0 term of its loss
 * polynomial, a DC bus's fixed loss, a transformer's no-load (core) loss, a drive's loss at the
 * lowest point of its loss grid, whatever model or preset the element was given. Series links
 * (cables, source impedance) carry no current at zero output and give 0.
 *
 * One function for the solve's result (`ElementResult.idleLoss`, at the solved voltages) and the
 * battery study (`IdleDraw`, the draw that runs all night).
 */
import { type Complex, ZERO, abs, c } from '../physics/complex.ts';
import type { ElementModel } from '../kinds/spec.ts';

const UNIT = c(1);

/**
 * Input real power of an element at zero output, W, at the given input and output voltages
 * (per-phase phasors, as in the solve). With no current at zero output the voltages only need to be
 * non-zero; a port without a voltage (a motor's shaft, an unsolved port) is taken at 1 V.
 */
export function idleDraw(model: ElementModel, vIn: Complex = UNIT, vOut: Complex = UNIT): number {
  const vi = abs(vIn) > 0 ? vIn : UNIT;
  const vo = abs(vOut) > 0 ? vOut : UNIT;
  return model.inputPower(ZERO, vi, vo).re;
}

/**
 * The part of an element's loss at its operating point that is idle loss, W: the idle draw limited
 * to 0…loss. The limit only acts on models whose loss falls below their zero-output value as the
 * output rises (a least-squares fit with a negative term, a drive loss grid typed falling with
 * torque): the figure stays a part of the loss, so idle + conversion = loss holds exactly.
 */
export function idlePart(idle: number, loss: number): number {
  if (!(idle > 0) || !(loss > 0)) return 0;
  return Math.min(idle, loss);
}
