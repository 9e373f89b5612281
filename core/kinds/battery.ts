/**
 * Battery bank as the chain's DC source: open-circuit voltage behind an internal resistance
 * (Thévenin model). A constant-power chain draws more current as the terminal voltage sags; the
 * internal I²R is the bank's own loss. With a `bank` spec the open-circuit voltage is the
 * chemistry's OCV at the initial state of charge × cells in series and the resistance is scaled
 * from the preset (core/physics/bank.ts). State of charge over time belongs to core/studies/backup/.
 *
 * A bank on a bus (a `from` naming a DC bus, directly or through cables; core/solve/modes.ts): on
 * supply it is a constant-current DC load drawing its float current (the charger holds the bus at
 * the float voltage and the bank takes what keeps it full: P = V_bus·I_float); on battery the modes
 * re-root the chain at it and it is the source again.
 */
import { z } from 'zod/mini';
import type { BatteryBankSpec, BatterySource } from '../model/project.ts';
import { c } from '../physics/complex.ts';
import { CHEMISTRIES, CHEMISTRY_PRESETS } from '../data/battery-chemistries.ts';
import { checkBank, resolveBank } from '../physics/bank.ts';
import { protectiveDeviceSchema } from './starting-fields.ts';
import { constantCurrentLoad, defineKind, finiteOrNone, fromField, idField, nameField, nominalPort, sourceOhms } from './spec.ts';
import { STANDBY_CHARGE } from '../data/standby-charge.ts';
import { seriesLink } from './spec.ts';
import { outOfRange, ranged, rangedCount } from './ranges.ts';

const num = () => z.number({ error: 'must be a number' });
const fraction = (what: string) => num().check(z.gt(0, `${what} must be greater than 0`), z.lte(1, `${what} must not exceed 1 (enter 0.9 for 90 %)`));


const overridesSchema = z.partial(
  z.strictObject({
    nominalCellVoltage: ranged('cellVoltage'),
    ocvCurve: z
      .array(z.strictObject({ soc: num().check(z.gte(0, 'must be 0 or more'), z.lte(1, 'must not exceed 1')), voltage: ranged('cellVoltage') }), {
        error: 'must be a list of {soc, voltage} points',
      })
      .check(z.minLength(2, 'needs at least two points')),
    endOfDischargeCellVoltage: ranged('cellVoltage'),
    peukertExponent: num().check(z.gte(1, 'must be at least 1 (1 = no rate effect)'), z.lte(2, 'must not exceed 2 (published exponents are 1.0–1.6)')),
    usableDepthOfDischarge: fraction('depth of discharge'),
    internalResistanceOhmAh: ranged('resistanceAh', 'non-negative'),
    capacityVsTemperature: z
      .array(z.strictObject({ temperatureC: ranged('temperature', 'range'), capacityFactor: ranged('capacityFactor') }), { error: 'must be a list of {temperatureC, capacityFactor} points' })
      .check(z.minLength(1, 'needs at least one point')),
    roundTripEfficiency: fraction('efficiency'),
    ratedHours: ranged('hours'),
    chargeCellVoltage: ranged('cellVoltage'),
    floatCellVoltage: ranged('cellVoltage'),
    maxChargeCRate: ranged('cRate'),
    maxDischargeCRate: ranged('cRate'),
    minChargeTemperatureC: ranged('temperature', 'range'),
  }),
);

export const bankSchema = z.strictObject({
  chemistry: z.enum(CHEMISTRIES as [string, ...string[]], { error: `must be one of ${CHEMISTRIES.join(', ')}` }),
  series: rangedCount('cellCount'),
  strings: z.optional(rangedCount('cellCount')),
  cellsPerBlock: z.optional(rangedCount('cellsPerBlock')),
  capacityAh: ranged('capacity'),
  initialSoc: z.optional(fraction('state of charge')),
  overrides: z.optional(overridesSchema),
  floatCurrent: z.optional(ranged('current', 'non-negative')),
});

/** Agreement asked between a `voltage` given beside a `bank` and the bank's own open-circuit voltage. */
const VOLTAGE_AGREEMENT = 0.01;

export const batteryKind = defineKind<BatterySource>({
  kind: 'battery',
  role: 'source',
  fedRole: 'load',
  // A bank on a bus is fed DC; as the chain's source it has no `from` and is fed nothing.
  accepts: () => ['dc'],
  schema: z.strictObject({
    id: idField,
    name: nameField,
    kind: z.literal('battery'),
    from: z.optional(fromField),
    voltage: z.optional(ranged('voltage')),
    internalResistance: z.optional(sourceOhms()),
    bank: z.optional(bankSchema),
    bankFuse: z.optional(protectiveDeviceSchema),
  }) as z.ZodMiniType<BatterySource>,
  check(e) {
    if (e.from !== undefined && !e.bank) {
      return [{ code: 'invalid-value', field: 'bank', message: 'is required for a bank on a bus (chemistry, cells in series and capacity: its float current and its discharge come from them)' }];
    }
    if (!e.bank) {
      return e.voltage === undefined
        ? [{ code: 'invalid-value', field: 'voltage', message: 'is required (or give a `bank` with chemistry, series and capacity)' }]
        : [];
    }
    const problems = checkBank(e.bank);
    if (problems.length === 0) {
      // Each field is in its range, but cells × blocks × cell voltage may still give a bank no chain has.
      const ocv = resolveBank(e.bank).initialOcv;
      const wrong = outOfRange('voltage', ocv);
      if (wrong !== null) {
        problems.push({ code: 'invalid-value', field: 'bank.series', value: e.bank.series, message: `gives a bank open-circuit voltage of ${Number(ocv.toPrecision(4))} V; the bank's voltage ${wrong}` });
        return problems;
      }
    }
    if (problems.length === 0 && e.voltage !== undefined) {
      const ocv = resolveBank(e.bank).initialOcv;
      if (Math.abs(e.voltage - ocv) > VOLTAGE_AGREEMENT * ocv) {
        problems.push({
          code: 'invalid-value',
          field: 'voltage',
          value: e.voltage,
          message: `conflicts with the bank: its open-circuit voltage at the initial state of charge is ${ocv.toFixed(2)} V; leave "voltage" out when a "bank" is given`,
        });
      }
    }
    return problems;
  },
  nominalOutput: (e) => nominalPort('dc', bankNominalVoltage(e.bank) ?? finiteOrNone(e.voltage)),
  ideal: (e) => ({ ...e, internalResistance: 0 }),
  studies: ['backup', 'fault-current'],
  build(e, input) {
    // On a bus, on supply: the float current at the bus voltage (constant current, DC).
    if (input !== null) return constantCurrentLoad(c(bankFloatCurrent(e.bank!)), 'dc');
    const { emf, resistance } = batteryEquivalent(e);
    const link = seriesLink(c(resistance), 'dc');
    const source = c(emf);
    return {
      out: { kind: 'dc' },
      outputVoltage: (_vIn, sOut, y) => link.outputVoltage(source, sOut, y),
      inputPower: (sOut, _vIn, vOut) => link.inputPower(sOut, vOut, source),
      report: () => ({ warnings: [] }),
    };
  },
});

/**
 * A bank's nominal voltage: cells in series × the chemistry's nominal cell voltage (NEC 480.2
 * "nominal voltage (battery or cell)"), or undefined when the bank cannot be read (a draft's
 * half-typed bank).
 */
function bankNominalVoltage(bank: unknown): number | undefined {
  if (typeof bank !== 'object' || bank === null) return undefined;
  const b = bank as BatteryBankSpec;
  try {
    if (!Object.hasOwn(CHEMISTRY_PRESETS, b.chemistry) || checkBank(b).length) return undefined;
    return finiteOrNone(b.series * (b.cellsPerBlock ?? 1) * (b.overrides?.nominalCellVoltage ?? CHEMISTRY_PRESETS[b.chemistry].nominalCellVoltage));
  } catch {
    return undefined;
  }
}

/** Open-circuit voltage and internal resistance the static solve uses (bank at its initial state of charge). */
export function batteryEquivalent(e: BatterySource): { emf: number; resistance: number } {
  if (e.bank) {
    const bank = resolveBank(e.bank as BatteryBankSpec, e.internalResistance);
    return { emf: bank.initialOcv, resistance: bank.internalResistance };
  }
  return { emf: e.voltage!, resistance: e.internalResistance ?? 0 };
}

/**
 * The float current of a whole bank, A: the string's float current (the maker's `floatCurrent`, else
 * the chemistry's typical float current per Ah × the string's Ah, core/data/standby-charge.ts) × strings.
 */
export function bankFloatCurrent(bank: BatteryBankSpec): number {
  const perString = bank.floatCurrent ?? STANDBY_CHARGE[bank.chemistry].floatCurrentPerAh * bank.capacityAh;
  return perString * (bank.strings ?? 1);
}
