/**
 * Utility supply or generator: an AC source (EMF) behind an optional series impedance R + jX per
 * phase. The terminal voltage follows from the exact two-bus solution; the internal I²R is the
 * source's own loss.
 */
import { z } from 'zod/mini';
import type { AcSource } from '../model/project.ts';
import { c } from '../physics/complex.ts';
import { sourceFaultFields } from './starting-fields.ts';
import { defineKind, finiteOrNone, fmtW, idField, nameField, nominalPort, perPhase, phases, seriesLink, sourceOhms } from './spec.ts';
import { ranged } from './ranges.ts';
import { q, say } from '../model/message.ts';

const schema = z.strictObject({
  id: idField,
  name: nameField,
  kind: z.enum(['grid', 'generator']),
  phases,
  voltage: ranged('voltage'),
  frequency: ranged('frequency'),
  resistance: z.optional(sourceOhms()),
  reactance: z.optional(sourceOhms()),
  ratedApparentPower: z.optional(ranged('ratedApparentPower')),
  ...sourceFaultFields,
});

const spec = (kind: 'grid' | 'generator') =>
  defineKind<AcSource>({
    kind,
    role: 'source',
    accepts: () => [],
    schema: schema as z.ZodMiniType<AcSource>,
    // Its rated voltage and frequency, single- or three-phase.
    nominalOutput: (e) => nominalPort(e.phases === 3 ? 'ac3' : 'ac1', finiteOrNone(e.voltage), finiteOrNone(e.frequency)),
    ideal: ({ resistance: _r, reactance: _x, ...rest }) => rest,
    studies: ['fault-current'],
    build(e) {
      const portKind = e.phases === 3 ? 'ac3' : 'ac1';
      const emf = c(perPhase(portKind, e.voltage));
      const link = seriesLink(c(e.resistance ?? 0, e.reactance ?? 0), portKind);
      return {
        out: { kind: portKind, frequency: e.frequency },
        outputVoltage: (_vIn, sOut, y) => link.outputVoltage(emf, sOut, y),
        inputPower: (sOut, _vIn, vOut) => link.inputPower(sOut, vOut, emf),
        report(sOut) {
          const s = Math.hypot(sOut.re, sOut.im);
          const rated = e.ratedApparentPower;
          if (rated === undefined) return { warnings: [] };
          const warnings =
            s > rated * (1 + 1e-9)
              ? [{ code: 'rating-exceeded' as const, ...say`delivers ${q(s, 'VA')}, above its rating of ${q(rated, 'VA')}` }]
              : [];
          return { loadFraction: s / rated, warnings };
        },
      };
    },
  });

export const gridKind = spec('grid');
export const generatorKind = spec('generator');
