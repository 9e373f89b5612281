/**
 * Transformer (AC → AC, the phase count of its feed). Model: ideal ratio V_sec/V_pri, then a series
 * impedance referred to the secondary, plus a constant no-load (core) loss.
 *   Base impedance Z_b = V_sec,LL² / S_rated (three-phase) or V_sec² / S_rated (single-phase).
 *   R = (P_load,rated / S_rated)·Z_b, so the copper loss is P_load,rated·(I/I_rated)²
 *   (= P_load,rated·(S/S_rated)² at rated voltage).
 *   X = √(Z%² − R%²)·Z_b/100 when the percent impedance is given, else 0.
 * Regulation then follows from the exact two-bus solution on the secondary side.
 */
import { z } from 'zod/mini';
import type { TransformerStage } from '../model/project.ts';
import { abs, c, scale } from '../physics/complex.ts';
import { defineKind, finiteOrNone, fmtPct, fmtW, fromField, idField, nameField, nominalPort, perPhase, seriesLink } from './spec.ts';
import { ranged } from './ranges.ts';
import { q, say } from '../model/message.ts';

export const transformerKind = defineKind<TransformerStage>({
  kind: 'transformer',
  role: 'stage',
  accepts: () => ['ac1', 'ac3'],
  schema: z.strictObject({
    id: idField,
    name: nameField,
    kind: z.literal('transformer'),
    from: fromField,
    ratedApparentPower: ranged('ratedApparentPower'),
    primaryVoltage: ranged('voltage'),
    secondaryVoltage: ranged('voltage'),
    noLoadLoss: ranged('power', 'non-negative'),
    loadLoss: ranged('power', 'non-negative'),
    impedancePercent: z.optional(ranged('impedancePercent')),
  }) as z.ZodMiniType<TransformerStage>,
  check(e) {
    const rPct = (100 * e.loadLoss) / e.ratedApparentPower;
    // A %Z typed equal to %R may differ from the recomputed %R in the last bit: allow for it.
    if (e.impedancePercent !== undefined && e.impedancePercent < rPct * (1 - 1e-12)) {
      return [
        {
          code: 'invalid-value',
          field: 'impedancePercent',
          value: e.impedancePercent,
          message: `must be at least the resistance percent implied by the load loss (${rPct.toPrecision(3)} %)`,
        },
      ];
    }
    return [];
  },
  // Its rated secondary voltage, at the phase count and frequency it is fed at.
  nominalOutput: (e, input) =>
    input && (input.kind === 'ac1' || input.kind === 'ac3') ? nominalPort(input.kind, finiteOrNone(e.secondaryVoltage), input.frequency) : null,
  build(e, input) {
    const kind = input!.kind;
    const zBase = (e.secondaryVoltage * e.secondaryVoltage) / e.ratedApparentPower;
    const rPct = (100 * e.loadLoss) / e.ratedApparentPower;
    const xPct = e.impedancePercent === undefined ? 0 : Math.sqrt(Math.max(0, e.impedancePercent ** 2 - rPct ** 2));
    // Single-phase: the winding impedance is the whole loop; three-phase: per phase (star equivalent).
    const link = seriesLink(c((rPct / 100) * zBase, (xPct / 100) * zBase), kind);
    const ratio = e.secondaryVoltage / e.primaryVoltage;
    return {
      out: { kind, ...(input!.frequency !== undefined ? { frequency: input!.frequency } : {}) },
      outputVoltage: (vIn, sOut, y) => link.outputVoltage(scale(vIn, ratio), sOut, y),
      // S_in = S_link + P_0 (no-load loss): `add(s, c(P_0))` written out, the same sums (im + 0 kept) in one object.
      inputPower: (sOut, vIn, vOut) => {
        const s = link.inputPower(sOut, vOut, scale(vIn, ratio));
        return { re: s.re + e.noLoadLoss, im: s.im + 0 };
      },
      report(sOut, _sIn, vIn) {
        const s = abs(sOut);
        const warnings = [];
        if (s > e.ratedApparentPower * (1 + 1e-9)) {
          warnings.push({ code: 'rating-exceeded' as const, ...say`carries ${q(s, 'VA')}, above its rating of ${q(e.ratedApparentPower, 'VA')}` });
        }
        const vRated = perPhase(kind, e.primaryVoltage);
        const dev = abs(vIn) / vRated - 1;
        if (Math.abs(dev) > 0.05) {
          warnings.push({ code: 'voltage-mismatch' as const, ...say`fed at ${q(100 * (1 + dev), '%')} of its rated primary voltage` });
        }
        return { loadFraction: s / e.ratedApparentPower, warnings };
      },
    };
  },
});
