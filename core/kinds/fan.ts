/**
 * Fan on a motor shaft: a load whose shaft power follows from its flow and pressure.
 *
 * Methods (the functions are in core/physics/fan.ts, on the pump model of core/physics/pump-fan.ts):
 * - fan curve at full speed, quadratic (common practice): Δp(Q) = p0 − a·Q², a = (p0 − p_r)/Q_r²,
 *   at standard air (1.2 kg/m³, common practice); pressure and power scale with ρ/1.2 (fan laws);
 * - system curve with no static head: Δp_sys(Q) = k·Q², k = p_r/Q_r² (through the rated point);
 * - control "speed" (a drive upstream sets the speed): affinity laws on the system curve,
 *   n = Q/Q_r, Δp = p_r·n², shaft power ∝ n³;
 * - control "damper" (full speed, an outlet damper takes up the difference): the fan rides its own
 *   curve, Δp = p0 − a·Q², n = 1;
 * - shaft power P = Q·Δp / η with η CONSTANT (the affinity laws' own assumption).
 * The operating flow must lie in (0, rated flow]: more would need overspeed; it is refused.
 */
import { z } from 'zod/mini';
import type { FanLoad } from '../model/project.ts';
import type { Problem } from '../model/errors.ts';
import { c } from '../physics/complex.ts';
import { fanOperatingPoint } from '../physics/fan.ts';
import { constantPowerLoad, defineKind, efficiencyField, fromField, idField, nameField } from './spec.ts';
import { ranged } from './ranges.ts';
import { q, say } from '../model/message.ts';

export const fanKind = defineKind<FanLoad>({
  kind: 'fan',
  role: 'load',
  accepts: () => ['shaft'],
  schema: z.strictObject({
    id: idField,
    name: nameField,
    kind: z.literal('fan'),
    from: fromField,
    ratedFlow: ranged('airFlow'),
    ratedPressure: ranged('pressure'),
    shutoffPressure: ranged('pressure'),
    efficiency: efficiencyField(),
    density: z.optional(ranged('density')),
    flow: ranged('airFlow'),
    control: z.enum(['speed', 'damper'], { error: 'must be "speed" (a drive sets the speed) or "damper" (full speed, an outlet damper)' }),
  }) as z.ZodMiniType<FanLoad>,
  check(e) {
    const out: Omit<Problem, 'elementId'>[] = [];
    if (!(e.shutoffPressure > e.ratedPressure)) out.push({ code: 'invalid-value', field: 'shutoffPressure', value: e.shutoffPressure, ...say`must be above the rated pressure ${q(e.ratedPressure, 'Pa')} (a fan curve falls with flow)` });
    if (e.flow > e.ratedFlow * (1 + 1e-9)) {
      out.push({ code: 'invalid-value', field: 'flow', value: e.flow, ...say`is above the rated flow ${{ ...q(e.ratedFlow, 'm³/s'), air: true }}, which the system reaches at full speed; more would need overspeed` });
    }
    return out;
  },
  studies: ['machines', 'pump-duty'],
  build(e) {
    const op = fanOperatingPoint(e);
    const model = constantPowerLoad(c(op.shaftPower));
    return {
      ...model,
      // Load fraction: shaft power against the shaft power at the rated (design) point.
      report: () => ({ loadFraction: op.shaftPower / op.designShaftPower, warnings: [] }),
    };
  },
});
