/**
 * Battery bank as the chain's DC source: open-circuit voltage behind an internal resistance
 * (Thévenin model). A constant-power chain draws more current as the terminal voltage sags; the
 * internal I²R is the bank's own loss. State of charge and runtime belong to core/battery/.
 */
import { z } from 'zod';
import type { BatterySource } from '../model.ts';
import { c } from '../ac/complex.ts';
import { defineKind, idField, nameField, nonNegative, positive, seriesLink } from './spec.ts';

export const batteryKind = defineKind<BatterySource>({
  kind: 'battery',
  role: 'source',
  accepts: () => [],
  schema: z.strictObject({
    id: idField,
    name: nameField,
    kind: z.literal('battery'),
    voltage: positive('V'),
    internalResistance: nonNegative('Ω').optional(),
  }) as z.ZodType<BatterySource>,
  build(e) {
    const emf = c(e.voltage);
    const link = seriesLink(c(e.internalResistance ?? 0), 'dc');
    return {
      out: { kind: 'dc' },
      outputVoltage: (_vIn, sOut) => link.outputVoltage(emf, sOut),
      inputPower: (sOut, _vIn, vOut) => link.inputPower(sOut, vOut),
      report: () => ({ warnings: [] }),
    };
  },
});
