/**
 * Pump (or fan) on a motor shaft: a load whose shaft power follows from its flow and head.
 *
 * Methods (the functions are shared with the pump duty study, core/physics/pump-fan.ts):
 * - pump curve at full speed, quadratic (common practice): H(Q) = H0 − a·Q², a = (H0 − H_r)/Q_r²;
 * - system curve with static head: H_sys(Q) = H_s + k·Q², k = (H_r − H_s)/Q_r², meeting the
 *   full-speed pump curve at the rated point;
 * - control "speed" (a drive upstream sets the speed): the pump runs on the system curve, H = H_sys(Q),
 *   at the speed the affinity laws give, n = √((H_s + (k + a)·Q²)/H0);
 * - control "throttle" (full speed, a valve adds head): the pump runs on its own curve, H = H(Q), n = 1;
 * - shaft power P = ρ·g·Q·H / η (g = 9.80665 m/s²), with η CONSTANT: the affinity laws' own
 *   assumption; real pumps lose efficiency away from their best point and at low speed.
 * The operating flow must lie in (0, rated flow]: the system reaches the rated flow at full speed,
 * so a higher flow would need overspeed (speed control) or a point past the design point on the
 * pump curve that this system curve cannot reach (throttling); it is refused.
 * Whether a drive really feeds a speed-controlled pump is a tree check: core/studies/machines/pump-duty.ts
 * (`pumpDetails`) reports it.
 */
import { z } from 'zod/mini';
import type { PumpLoad } from '../model/project.ts';
import type { Problem } from '../model/errors.ts';
import { c } from '../physics/complex.ts';
import { DUTY_FLOW_MESSAGE, affinitySpeed, hydraulicPower, pumpCurveHead, pumpShaftPower, systemCurveHead } from '../physics/pump-fan.ts';
import { constantPowerLoad, defineKind, efficiencyField, fromField, idField, nameField } from './spec.ts';
import { rangeWorded, ranged } from './ranges.ts';
import { q, say, wordedParams } from '../model/message.ts';

/** The pump's operating point. */
export interface PumpOperatingPoint {
  control: 'speed' | 'throttle';
  /** m³/s. */
  flow: number;
  /** Speed as a fraction of full speed (1 for throttling). */
  speed: number;
  /** Pump head at the operating point, m. */
  head: number;
  /** ρ·g·Q·H, W. */
  hydraulicPower: number;
  /** Hydraulic power / pump efficiency, W. */
  shaftPower: number;
  /** Shaft power at the rated (design) point, W. */
  designShaftPower: number;
}

/** Operating point of a validated pump element. */
export function pumpOperatingPoint(e: PumpLoad): PumpOperatingPoint {
  const speed = e.control === 'speed' ? affinitySpeed(e, e.staticHead, e.flow) : 1;
  const head = e.control === 'speed' ? systemCurveHead(e, e.staticHead, e.flow) : pumpCurveHead(e, e.flow);
  return {
    control: e.control,
    flow: e.flow,
    speed,
    head,
    hydraulicPower: hydraulicPower(e, e.flow, head),
    shaftPower: pumpShaftPower(e, e.flow, head),
    designShaftPower: pumpShaftPower(e, e.ratedFlow, e.ratedHead),
  };
}

export const pumpKind = defineKind<PumpLoad>({
  kind: 'pump',
  role: 'load',
  accepts: () => ['shaft'],
  schema: z.strictObject({
    id: idField,
    name: nameField,
    kind: z.literal('pump'),
    from: fromField,
    ratedFlow: ranged('flow'),
    ratedHead: ranged('head'),
    shutoffHead: ranged('head'),
    efficiency: efficiencyField(),
    density: z.optional(ranged('density')),
    staticHead: ranged('head', 'non-negative'),
    flow: ranged('flow'),
    control: z.enum(['speed', 'throttle'], { error: 'must be "speed" (a drive sets the speed) or "throttle" (full speed, a valve)' }),
  }) as z.ZodMiniType<PumpLoad>,
  check(e) {
    const out: Omit<Problem, 'elementId'>[] = [];
    if (!(e.shutoffHead > e.ratedHead)) out.push({ code: 'invalid-value', field: 'shutoffHead', value: e.shutoffHead, ...say`must be above the rated head ${q(e.ratedHead, 'm')} (a pump curve falls with flow)` });
    if (!(e.staticHead < e.ratedHead)) out.push({ code: 'invalid-value', field: 'staticHead', value: e.staticHead, ...say`must be below the rated head ${q(e.ratedHead, 'm')} (the system curve meets the pump curve at the rated point)` });
    if (e.flow > e.ratedFlow * (1 + 1e-9)) {
      out.push({ code: 'invalid-value', field: 'flow', value: e.flow, ...say`is above the rated flow ${q(e.ratedFlow, 'm³/s')}, which the system reaches at full speed; more would need overspeed` });
    }
    return out;
  },
  studies: ['machines', 'pump-duty'],
  build(e) {
    const op = pumpOperatingPoint(e);
    const model = constantPowerLoad(c(op.shaftPower));
    return {
      ...model,
      // Load fraction: shaft power against the shaft power at the rated (design) point.
      report: () => ({ loadFraction: op.shaftPower / op.designShaftPower, warnings: [] }),
    };
  },
});

/** Schema of the project's `pumpDuty` field (single-field ranges; the pump id, flows against its rating and the hours of a year are checked by projectPumpDuty, core/studies/machines/pump-duty.ts). */
export const pumpDutySchema = z.strictObject({
  pump: z.string({ error: 'must be the id of a pump element' }).check(z.minLength(1, 'must be the id of a pump element')),
  duty: z
    .array(
      z.strictObject({
        flow: z.number({ error: 'must be a number' }).check(z.gt(0, DUTY_FLOW_MESSAGE), z.superRefine((v: number, ctx) => {
          const m = rangeWorded('flow', v, 'range');
          if (v > 0 && m !== null) ctx.addIssue({ code: 'custom', message: m.message, input: v, params: wordedParams(m) });
        })),
        hours: z.number({ error: 'must be a number' }).check(z.gte(0, 'must not be negative h')),
      }),
      { error: 'must be a list of {flow, hours} rows' },
    )
    .check(z.minLength(1, 'needs at least one {flow, hours} row')),
});
