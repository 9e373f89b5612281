/**
 * The battery bank: chemistry preset + datasheet overrides, cells in series × strings in parallel.
 * Pure functions of plain data; SI units (V, A, Ah as the trade unit of charge, Ω, °C).
 */
import type { BatteryBankSpec } from '../model/project.ts';
import type { Problem } from '../model/errors.ts';
import {
  CHEMISTRY_PRESETS,
  type CapacityTemperaturePoint,
  type Chemistry,
  type ChemistryValues,
  type OcvPoint,
} from '../data/battery-chemistries.ts';
import { sigText } from '../model/message.ts';

/** A bank resolved from its spec: every figure the discharge and the sizing need. */
export interface Bank {
  chemistry: Chemistry;
  label: string;
  /** Preset values after the datasheet overrides (per cell). */
  values: ChemistryValues;
  /** Fields taken from the datasheet rather than the preset. */
  overridden: (keyof ChemistryValues)[];
  /** Cells in series per string (series × cells per block). */
  cellsInSeries: number;
  strings: number;
  /** Rated capacity of the bank (all strings), Ah, at `ratedHours`. */
  capacityAh: number;
  ratedHours: number;
  /** Current at which the rated capacity is given, C/H, A. */
  ratedCurrent: number;
  /** Nominal voltage: nominal cell voltage × cells in series, V. */
  nominalVoltage: number;
  /** Nominal energy: nominal voltage × Ah, Wh. */
  nominalWh: number;
  /** Usable energy: nominal Wh × usable depth of discharge, Wh. */
  usableWh: number;
  /** Cut-off at the terminals under load: end-of-discharge cell voltage × cells in series, V. */
  cutoffVoltage: number;
  /**
   * Internal resistance of the bank, Ω: R_cell·s/p with R_cell = (Ω·Ah per cell) / (Ah per string)
   * (preset scaling, see core/data/battery-chemistries.ts), unless the element gives its own.
   */
  internalResistance: number;
  /** State of charge at the start, 0…1. */
  initialSoc: number;
  /** Open-circuit voltage of the bank at the initial state of charge, V. */
  initialOcv: number;
  /** Largest continuous discharge current the chemistry allows, A (max C-rate × Ah). */
  maxDischargeCurrent: number;
}

/** Linear interpolation of the OCV curve, held at its ends (soc clamped to 0…1). */
export function ocvAt(curve: readonly OcvPoint[], soc: number): number {
  const s = soc < 0 ? 0 : soc > 1 ? 1 : soc;
  const first = curve[0]!;
  if (s <= first.soc) return first.voltage;
  for (let i = 1; i < curve.length; i++) {
    const b = curve[i]!;
    if (s <= b.soc) {
      const a = curve[i - 1]!;
      return a.voltage + ((b.voltage - a.voltage) * (s - a.soc)) / (b.soc - a.soc);
    }
  }
  return curve[curve.length - 1]!.voltage;
}

/**
 * How far beyond the ends of a capacity-vs-temperature table the trend of its last two points is
 * trusted, °C (our planning limit, common practice (no source)): farther out the temperature is
 * refused and the maker's figure asked for.
 */
export const MAX_TEMPERATURE_EXTRAPOLATION_C = 20;

/** Capacity factor at a temperature, or why none is given. */
export interface CapacityAtTemperature {
  /** Available capacity ÷ capacity at 25 °C (0 when refused). */
  factor: number;
  /** True outside the table: the factor was extrapolated (method in `capacityFactorAt`). */
  extrapolated: boolean;
  /** Set when the temperature is refused: the message says why (the factor is then not to be used). */
  refused?: string;
}

/**
 * Capacity factor at a temperature: linear interpolation in the chemistry's table. Outside it,
 * conservative linear extrapolation from the two end points on that side, never above the end
 * value (so cold below the table lowers the capacity along the table's own slope, and heat above it
 * never flatters it); never the end value held where the trend falls. Refused more than
 * MAX_TEMPERATURE_EXTRAPOLATION_C beyond the table, or where the extrapolated capacity reaches 0.
 */
export function capacityFactorAt(table: readonly CapacityTemperaturePoint[], temperatureC: number): CapacityAtTemperature {
  const first = table[0]!;
  const last = table[table.length - 1]!;
  const outside = temperatureC < first.temperatureC ? 'below' : temperatureC > last.temperatureC ? 'above' : null;
  if (outside !== null) {
    const end = outside === 'below' ? first : last;
    const next = outside === 'below' ? table[1] : table[table.length - 2];
    const span = `${first.temperatureC} °C to ${last.temperatureC} °C`;
    if (Math.abs(temperatureC - end.temperatureC) > MAX_TEMPERATURE_EXTRAPOLATION_C) {
      return {
        factor: 0,
        extrapolated: true,
        refused: `${sigText(temperatureC, 3)} °C is more than ${MAX_TEMPERATURE_EXTRAPOLATION_C} °C ${outside} the capacity-vs-temperature table (${span}); give the maker\u2019s capacity at this temperature`,
      };
    }
    if (next === undefined) {
      return {
        factor: 0,
        extrapolated: true,
        refused: `${sigText(temperatureC, 3)} °C is outside the one-point capacity-vs-temperature table (${span}): no trend to extrapolate; give the maker\u2019s capacity at this temperature`,
      };
    }
    // Linear extrapolation through the two end points on this side, capped at the end value.
    const slope = (end.capacityFactor - next.capacityFactor) / (end.temperatureC - next.temperatureC);
    const factor = Math.min(end.capacityFactor, end.capacityFactor + slope * (temperatureC - end.temperatureC));
    if (!(factor > 0)) {
      return {
        factor: 0,
        extrapolated: true,
        refused: `at ${sigText(temperatureC, 3)} °C the capacity-vs-temperature table (${span}), extrapolated along its end slope, leaves no capacity; give the maker\u2019s capacity at this temperature`,
      };
    }
    return { factor, extrapolated: true };
  }
  for (let i = 1; i < table.length; i++) {
    const b = table[i]!;
    if (temperatureC <= b.temperatureC) {
      const a = table[i - 1]!;
      const f = a.capacityFactor + ((b.capacityFactor - a.capacityFactor) * (temperatureC - a.temperatureC)) / (b.temperatureC - a.temperatureC);
      return { factor: f, extrapolated: false };
    }
  }
  return { factor: last.capacityFactor, extrapolated: false };
}

type BankProblem = Omit<Problem, 'elementId'>;

const bad = (field: string, value: unknown, message: string): BankProblem => ({ code: 'invalid-value', field, value, message });

/** Preset merged with the overrides (the schema has checked each override's type and range). */
export function bankValues(spec: BatteryBankSpec): { values: ChemistryValues; overridden: (keyof ChemistryValues)[] } {
  const preset = CHEMISTRY_PRESETS[spec.chemistry];
  const o = spec.overrides ?? {};
  const overridden = (Object.keys(o) as (keyof ChemistryValues)[]).filter((k) => o[k] !== undefined);
  const { chemistry: _c, label: _l, provenance: _p, ...base } = preset;
  return { values: { ...base, ...o } as ChemistryValues, overridden };
}

/**
 * Checks across fields of a bank (after the schema): the cut-off must lie below the nominal cell
 * voltage, the OCV curve must rise from soc 0 to 1, tables must be ordered, the start must be
 * above the depth-of-discharge limit. Field paths are relative to the battery element.
 */
export function checkBank(spec: BatteryBankSpec): BankProblem[] {
  const out: BankProblem[] = [];
  const { values: v, overridden } = bankValues(spec);
  const where = (k: keyof ChemistryValues) => (overridden.includes(k) ? `bank.overrides.${k}` : 'bank.chemistry');
  if (v.endOfDischargeCellVoltage >= v.nominalCellVoltage) {
    out.push(
      bad(
        overridden.includes('endOfDischargeCellVoltage') ? 'bank.overrides.endOfDischargeCellVoltage' : where('nominalCellVoltage'),
        v.endOfDischargeCellVoltage,
        `the cut-off (end-of-discharge) voltage ${v.endOfDischargeCellVoltage} V/cell is not below the nominal ${v.nominalCellVoltage} V/cell; the bank would count as empty at once`,
      ),
    );
  }
  const curve = v.ocvCurve;
  const curveOk =
    curve.length >= 2 &&
    curve[0]!.soc === 0 &&
    curve[curve.length - 1]!.soc === 1 &&
    curve.every((p, i) => i === 0 || (p.soc > curve[i - 1]!.soc && p.voltage >= curve[i - 1]!.voltage));
  if (!curveOk) {
    out.push(bad(where('ocvCurve'), curve.map((p) => [p.soc, p.voltage]), 'the OCV curve must run from soc 0 to soc 1 with soc rising and voltage never falling'));
  }
  const temps = v.capacityVsTemperature;
  if (temps.length < 1 || !temps.every((p, i) => i === 0 || p.temperatureC > temps[i - 1]!.temperatureC)) {
    out.push(bad(where('capacityVsTemperature'), temps.map((p) => p.temperatureC), 'the capacity-vs-temperature table needs at least one point, in rising temperature'));
  }
  if (v.floatCellVoltage > v.chargeCellVoltage) {
    out.push(bad(where('floatCellVoltage'), v.floatCellVoltage, `the float voltage must not exceed the charge voltage ${v.chargeCellVoltage} V/cell`));
  }
  const soc0 = spec.initialSoc ?? 1;
  // Lithium always stops at its usable depth of discharge (the BMS window); lead-acid and NiCd only
  // in a cycling design, which the discharge checks (a backup design runs to the end voltage).
  const lithium = spec.chemistry === 'lifepo4' || spec.chemistry === 'nmc';
  if (lithium && soc0 <= 1 - v.usableDepthOfDischarge) {
    out.push(
      bad('bank.initialSoc', soc0, `starts at or below the usable depth-of-discharge limit (state of charge ${(1 - v.usableDepthOfDischarge).toFixed(2)}); nothing could be drawn`),
    );
  }
  return out;
}

/** A bank's rated capacity, all strings, Ah: one string's capacity × the strings in parallel (default 1). */
export function bankCapacityAh(spec: Pick<BatteryBankSpec, 'capacityAh' | 'strings'>): number {
  return spec.capacityAh * (spec.strings ?? 1);
}

/** Resolve a checked bank spec (call checkBank first; the figures assume it passed). */
export function resolveBank(spec: BatteryBankSpec, internalResistanceOverride?: number): Bank {
  const { values, overridden } = bankValues(spec);
  const preset = CHEMISTRY_PRESETS[spec.chemistry];
  const cellsInSeries = spec.series * (spec.cellsPerBlock ?? 1);
  const strings = spec.strings ?? 1;
  const capacityAh = bankCapacityAh(spec);
  const nominalVoltage = values.nominalCellVoltage * cellsInSeries;
  const nominalWh = nominalVoltage * capacityAh;
  // Ohm's law for s equal cells in series and p equal strings in parallel: R = s·R_cell / p.
  const rCell = values.internalResistanceOhmAh / spec.capacityAh;
  const initialSoc = spec.initialSoc ?? 1;
  return {
    chemistry: spec.chemistry,
    label: preset.label,
    values,
    overridden,
    cellsInSeries,
    strings,
    capacityAh,
    ratedHours: values.ratedHours,
    ratedCurrent: capacityAh / values.ratedHours,
    nominalVoltage,
    nominalWh,
    usableWh: nominalWh * values.usableDepthOfDischarge,
    cutoffVoltage: values.endOfDischargeCellVoltage * cellsInSeries,
    internalResistance: internalResistanceOverride ?? (cellsInSeries * rCell) / strings,
    initialSoc,
    initialOcv: ocvAt(values.ocvCurve, initialSoc) * cellsInSeries,
    maxDischargeCurrent: values.maxDischargeCRate * capacityAh,
  };
}

/** Open-circuit voltage of the bank at a state of charge, V. */
export const bankOcv = (bank: Bank, soc: number): number => ocvAt(bank.values.ocvCurve, soc) * bank.cellsInSeries;
