/**
 * Load from circuit elements: a network of R, L and C (core/physics/network.ts) at the frequency of the
 * interface feeding it. Unlike the constant-power loads it is a constant-IMPEDANCE load:
 * S = m·|V_phase|²/conj(Z_phase) (complex power of an impedance, S = V·conj(V/Z)), with m phases
 * and Z_phase the per-phase star equivalent (the network itself on single-phase and in star, a
 * third of it in delta: Z_Y = Z_Δ/3). The backward sweep evaluates it at the input voltage of the
 * previous forward sweep, so the fixed-point iteration of the solve settles it like any other load.
 */
import { z } from 'zod/mini';
import type { NetworkLoad } from '../model/project.ts';
import { type Complex, ZERO, abs, c, conj, div, scale } from '../physics/complex.ts';
import { networkImpedance, parseNetwork, starEquivalent } from '../physics/network.ts';
import { defineKind, fromField, idField, nameField, phaseCount } from './spec.ts';

/** The network is checked entry by entry; each problem carries its own path (e.g. network.series.1.capacitor). */
const networkSchema = z.unknown().check(
  z.superRefine((raw, ctx) => {
    if (raw === undefined) {
      ctx.addIssue({ code: 'custom', message: 'is required: the circuit elements, e.g. {"series": [{"resistor": "12 Ω"}, {"inductor": "40 mH"}]}' });
      return;
    }
    const parsed = parseNetwork(raw);
    if (!parsed.ok) for (const issue of parsed.issues) ctx.addIssue({ code: 'custom', message: issue.message, path: issue.path, input: issue.value });
  }),
);

/** Smallest per-phase impedance accepted, Ω (below it the load is a short circuit). */
const MIN_IMPEDANCE = 1e-6;

export const networkLoadKind = defineKind<NetworkLoad>({
  kind: 'network-load',
  role: 'load',
  // A connection says the load is three-phase; without one it sits across a single-phase supply,
  // or is taken as star on three-phase.
  accepts: (e) => (e.connection === undefined ? ['ac1', 'ac3'] : ['ac3']),
  schema: z.strictObject({
    id: idField,
    name: nameField,
    from: fromField,
    kind: z.literal('network-load'),
    network: networkSchema,
    connection: z.optional(z.enum(['star', 'delta'], { error: 'must be "star" or "delta" (three-phase only)' })),
  }) as z.ZodMiniType<NetworkLoad>,
  build(e, input) {
    const kind = input!.kind;
    const parsed = parseNetwork(e.network);
    // The schema passed, so the network reads; a frequency is always present on an AC port.
    if (!parsed.ok) throw new Error(`load "${e.name ?? e.id}" (R, L, C) reached the solve unvalidated`);
    const zNet = networkImpedance(parsed.network, input!.frequency ?? 0);
    const zPhase = starEquivalent(zNet, kind === 'ac3' ? (e.connection ?? 'star') : 'single-phase');
    const m = phaseCount(kind);
    // A near-zero impedance (a 1e-300 Ω resistor, a series L–C at resonance) is a short circuit:
    // its power m·V²/|Z| overflows every figure after it. Refused below 1 µΩ per phase, which at
    // 230 V would already draw some 50 GW.
    const zAbs = abs(zPhase);
    const problems =
      zAbs < MIN_IMPEDANCE
        ? [{
            code: 'invalid-value' as const,
            field: 'network',
            value: e.network,
            message: `the circuit's impedance${input!.frequency ? ` at ${input!.frequency} Hz` : ''} is ${zAbs === 0 ? '0' : zAbs.toExponential(1)} Ω per phase, under 1 µΩ: a short circuit, which no supply can feed. Check the values and their units`,
          }]
        : [];
    // conj(Y) = 1/conj(Z); an open network (ideal parallel resonance, |Z| infinite) draws nothing.
    const conjY: Complex = Number.isFinite(abs(zPhase)) ? div(c(1), conj(zPhase)) : ZERO;
    return {
      out: null,
      admittance: conj(conjY),
      outputVoltage: () => ZERO,
      inputPower: (_sOut, vIn) => {
        const v = abs(vIn);
        return scale(conjY, m * v * v);
      },
      report: () => ({ warnings: [] }),
      ...(problems.length ? { problems } : {}),
    };
  },
});
