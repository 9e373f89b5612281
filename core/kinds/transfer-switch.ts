/**
 * Transfer switch (an automatic transfer switch, a UPS's static or bypass switch, an inverter-charger's
 * transfer relay): passes its input on unchanged in kind (DC, 1φ or 3φ AC) with its own losses.
 *
 * Methods:
 * - Contact loss, Joule's law per pole: P = n·I²·R with R the contact resistance of one pole and n the
 *   current-carrying conductors of the port (DC 2, single-phase 2, three-phase 3). Solved as a series
 *   link (exact two-bus solution, `seriesLink`) of per-phase resistance 2R on DC and single-phase (the
 *   go and return poles in the loop, as a cable's loop) and R per phase on three-phase, whose loss
 *   m·|I|²·Re Z is exactly n·I²·R.
 * - Control power: a constant draw at its input (coils, control electronics), like a DC bus's fixed
 *   loss; at zero output it is the switch's idle draw (core/solve/idle.ts).
 * - Rated current: the current through the poles, |S_in − P_control| ÷ (m·|V_in|) per phase (the link's
 *   current is the same at both ends), against the maker's rating: a warning when exceeded.
 * The transfer time changes nothing in the solve; the modes study shows it in the transfer working.
 */
import { z } from 'zod/mini';
import type { TransferSwitchStage } from '../model/project.ts';
import { q, say } from '../model/message.ts';
import { abs, add, c, sub } from '../physics/complex.ts';
import { defineKind, fromField, idField, nameField, phaseCount, seriesLink } from './spec.ts';
import { ranged } from './ranges.ts';

/** Current-carrying conductors through the switch per port kind: DC and single-phase 2 (go and return), three-phase 3. */
export const polesCarrying = (kind: 'dc' | 'ac1' | 'ac3'): number => (kind === 'ac3' ? 3 : 2);

export const transferSwitchKind = defineKind<TransferSwitchStage>({
  kind: 'transfer-switch',
  role: 'stage',
  accepts: () => ['dc', 'ac1', 'ac3'],
  schema: z.strictObject({
    id: idField,
    name: nameField,
    kind: z.literal('transfer-switch'),
    from: fromField,
    contactResistance: ranged('contactResistance', 'non-negative'),
    controlPower: ranged('power', 'non-negative'),
    ratedCurrent: z.optional(ranged('current')),
    transferTime: z.optional(ranged('seconds', 'non-negative')),
  }) as z.ZodMiniType<TransferSwitchStage>,
  passive: true,
  // The port it is fed at (a switch carries no shaft).
  nominalOutput: (_e, input) => (input && input.kind !== 'shaft' ? input : null),
  // On DC: the two poles in the loop (2R, Ohm's law) and the control power as a fixed loss.
  dcEquivalent: (e) => ({ resistance: 2 * e.contactResistance, fixedLoss: e.controlPower }),
  build(e, input) {
    const kind = input!.kind === 'shaft' ? 'dc' : input!.kind;
    // Per-phase impedance: the loop's two poles on DC and single-phase, one pole per phase on three-phase.
    const link = seriesLink(c(kind === 'ac3' ? e.contactResistance : 2 * e.contactResistance), kind);
    const m = phaseCount(kind);
    const control = c(e.controlPower);
    return {
      out: { ...input! },
      outputVoltage: (vIn, sOut, y) => link.outputVoltage(vIn, sOut, y),
      inputPower: (sOut, vIn, vOut) => add(link.inputPower(sOut, vOut, vIn), control),
      report(_sOut, sIn, vIn) {
        const v = abs(vIn);
        const current = v > 0 ? abs(sub(sIn, control)) / (m * v) : 0;
        if (e.ratedCurrent !== undefined && current > e.ratedCurrent * (1 + 1e-9)) {
          return { warnings: [{ code: 'rating-exceeded', ...say`carries ${q(current, 'A')}, above its rated current ${q(e.ratedCurrent, 'A')}` }] };
        }
        return { warnings: [] };
      },
    };
  },
});
