/**
 * Battery chemistry presets: per-cell defaults for the bank model in core/studies/backup/.
 *
 * One file over 400 lines on purpose: it is one table (one preset per chemistry, the same fields
 * each, every field with its provenance mark), read and checked against its sources as a whole.
 *
 * Every value can be overridden from the cell or block maker's datasheet, which always takes
 * precedence; these are planning defaults only.
 *
 * Sources and provenance marks (each preset carries a `provenance` entry per field):
 * - "IEEE 485 Table 1": lead-acid capacity vs temperature is the reciprocal of the cell-size
 *   temperature correction factor of IEEE Std 485-2020 (same table in 1997/2010), Table 1. Only
 *   the 1.00 point at 25 °C is confirmed; the other factors are from memory. Above 25 °C the
 *   capacity is held at 1.00, following the note to that table that factors below 1.00 should not
 *   be used to take credit for higher temperatures (from memory).
 * - Peukert exponents: typical ranges published by battery makers' application notes
 *   (flooded 1.2–1.6, AGM 1.05–1.15, gel 1.10–1.25, LiFePO4 ≈1.0–1.05); the single value chosen
 *   inside each range is common practice. NMC and NiCd exponents are from memory.
 * - "common practice": typical values used by installers and in makers' literature, no single
 *   source. "from memory": recalled, not checked against a printed source.
 * - End-of-discharge voltage 1.75 V/cell for lead-acid: common practice, corroborated by a
 *   published UPS battery specification (its table of cell end-of-discharge voltages: lead-acid
 *   1.75 V general applications, 1.85 V PV; NiCd 1.10 V / 1.15 V) and by the capacity definition
 *   example "100 Ah @ C10 to 1.75 V/cell" of the IEEE 485 introduction on myelectrical.com (S16 in
 *   published-values.md). Makers rate UPS blocks to other end voltages too (a VRLA maker's
 *   constant-power example uses 1.70 V/cell): the user sees "typical value: use the maker's figure".
 *
 * Units (SI except where the unit is in the field name):
 * - voltages in V per cell; state of charge as a fraction 0…1; depth of discharge as a fraction;
 * - `internalResistanceOhmAh`: DC internal resistance of ONE cell times its rated capacity, Ω·Ah.
 *   A cell of capacity C (Ah) has R_cell = internalResistanceOhmAh / C. A bank of s cells in series
 *   and p strings in parallel has R_bank = s·R_cell / p (internal resistance scales inversely with
 *   capacity: a larger plate area lowers it in proportion, common practice);
 * - temperatures in °C; `capacityFactor` is available capacity / capacity at 25 °C;
 * - `ratedHours` is the discharge time of the rated capacity (the H of "C_H", e.g. 20 for C20), h;
 * - C-rates are in 1/h (current / rated Ah).
 */

export type Chemistry = 'flooded-lead-acid' | 'vrla-agm' | 'gel' | 'lifepo4' | 'nmc' | 'nicd';

export const CHEMISTRIES: readonly Chemistry[] = [
  'flooded-lead-acid',
  'vrla-agm',
  'gel',
  'lifepo4',
  'nmc',
  'nicd',
];

/** Open-circuit (rested) cell voltage at a state of charge. */
export interface OcvPoint {
  /** State of charge, 0…1. */
  readonly soc: number;
  /** Rested open-circuit voltage of one cell, V. */
  readonly voltage: number;
}

/** Available capacity at a cell temperature, relative to 25 °C. */
export interface CapacityTemperaturePoint {
  /** Cell (electrolyte) temperature, °C. */
  readonly temperatureC: number;
  /** Available capacity / capacity at 25 °C. */
  readonly capacityFactor: number;
}

/** Numeric fields of a preset (those a datasheet can override). */
export interface ChemistryValues {
  /** Nominal cell voltage, V. */
  readonly nominalCellVoltage: number;
  /** Open-circuit voltage vs state of charge, one cell, rising soc from 0 to 1. */
  readonly ocvCurve: readonly OcvPoint[];
  /** End-of-discharge (cut-off) voltage of one cell, measured under load, V. */
  readonly endOfDischargeCellVoltage: number;
  /** Peukert exponent k (dimensionless, ≥ 1). */
  readonly peukertExponent: number;
  /** Usable depth of discharge, fraction of the (derated) capacity, 0…1. */
  readonly usableDepthOfDischarge: number;
  /** Internal resistance of one cell × its rated capacity, Ω·Ah (see header). */
  readonly internalResistanceOhmAh: number;
  /** Capacity vs temperature, rising temperature. */
  readonly capacityVsTemperature: readonly CapacityTemperaturePoint[];
  /** Round-trip (Wh out / Wh in) efficiency, 0…1. */
  readonly roundTripEfficiency: number;
  /** Discharge time at which the nominal capacity is rated (C_H), h. */
  readonly ratedHours: number;
  /** Charge (CV / absorption) voltage of one cell, V. */
  readonly chargeCellVoltage: number;
  /** Float (standby) voltage of one cell, V. */
  readonly floatCellVoltage: number;
  /** Maximum continuous charge current, C-rate (1/h). */
  readonly maxChargeCRate: number;
  /** Maximum continuous discharge current, C-rate (1/h). */
  readonly maxDischargeCRate: number;
  /** Lowest cell temperature at which charging is allowed, °C. */
  readonly minChargeTemperatureC: number;
}

export type ChemistryField = keyof ChemistryValues;

export interface ChemistryPreset extends ChemistryValues {
  readonly chemistry: Chemistry;
  readonly label: string;
  /** Where each value comes from: a standard and table, "common practice" or "from memory". */
  readonly provenance: Readonly<Record<ChemistryField, string>>;
}

const CP = 'common practice';
const FM = 'from memory';
const CP_FM = 'common practice (from memory)';

/**
 * Lead-acid capacity vs temperature: 1 / (IEEE 485 Table 1 cell-size factor) at a subset of the
 * table's rows; held at 1.00 above 25 °C (see header).
 */
const LEAD_ACID_TEMPERATURE: readonly CapacityTemperaturePoint[] = [
  { temperatureC: -3.9, capacityFactor: 1 / 1.52 },
  { temperatureC: -1.1, capacityFactor: 1 / 1.43 },
  { temperatureC: 1.7, capacityFactor: 1 / 1.35 },
  { temperatureC: 4.4, capacityFactor: 1 / 1.3 },
  { temperatureC: 7.2, capacityFactor: 1 / 1.25 },
  { temperatureC: 10.0, capacityFactor: 1 / 1.19 },
  { temperatureC: 12.8, capacityFactor: 1 / 1.15 },
  { temperatureC: 15.6, capacityFactor: 1 / 1.11 },
  { temperatureC: 18.3, capacityFactor: 1 / 1.08 },
  { temperatureC: 20.0, capacityFactor: 1 / 1.056 },
  { temperatureC: 22.2, capacityFactor: 1 / 1.029 },
  { temperatureC: 25.0, capacityFactor: 1 },
  { temperatureC: 51.7, capacityFactor: 1 },
];
const LEAD_ACID_TEMPERATURE_SOURCE =
  'IEEE 485-2020 Table 1 (reciprocal; 1.00 at 25 °C confirmed, other rows from memory; held at 1.00 above 25 °C)';

export const CHEMISTRY_PRESETS: Readonly<Record<Chemistry, ChemistryPreset>> = {
  'flooded-lead-acid': {
    chemistry: 'flooded-lead-acid',
    label: 'Flooded (vented) lead-acid',
    nominalCellVoltage: 2.0,
    // Rested 12 V block table (12.70 V full … 11.50 V empty) divided by 6 cells.
    ocvCurve: [
      { soc: 0, voltage: 11.5 / 6 },
      { soc: 0.1, voltage: 11.64 / 6 },
      { soc: 0.2, voltage: 11.76 / 6 },
      { soc: 0.3, voltage: 11.88 / 6 },
      { soc: 0.4, voltage: 11.98 / 6 },
      { soc: 0.5, voltage: 12.1 / 6 },
      { soc: 0.6, voltage: 12.24 / 6 },
      { soc: 0.7, voltage: 12.36 / 6 },
      { soc: 0.8, voltage: 12.46 / 6 },
      { soc: 0.9, voltage: 12.58 / 6 },
      { soc: 1, voltage: 12.7 / 6 },
    ],
    endOfDischargeCellVoltage: 1.75,
    peukertExponent: 1.25,
    usableDepthOfDischarge: 0.5,
    internalResistanceOhmAh: 0.1,
    capacityVsTemperature: LEAD_ACID_TEMPERATURE,
    roundTripEfficiency: 0.8,
    ratedHours: 20,
    chargeCellVoltage: 2.45,
    floatCellVoltage: 2.25,
    maxChargeCRate: 0.2,
    maxDischargeCRate: 1,
    minChargeTemperatureC: -20,
    provenance: {
      nominalCellVoltage: CP,
      ocvCurve: 'common practice (rested 12 V block table ÷ 6, from memory)',
      endOfDischargeCellVoltage: 'common practice (1.75 V/cell, the usual IEEE 485 sizing end voltage)',
      peukertExponent: 'makers\u2019 application notes give 1.2–1.6; 1.25 common practice for deep-cycle',
      usableDepthOfDischarge: CP,
      internalResistanceOhmAh: FM,
      capacityVsTemperature: LEAD_ACID_TEMPERATURE_SOURCE,
      roundTripEfficiency: CP,
      ratedHours: 'common practice (C20 for deep-cycle blocks)',
      chargeCellVoltage: CP,
      floatCellVoltage: CP,
      maxChargeCRate: CP,
      maxDischargeCRate: CP_FM,
      minChargeTemperatureC: CP_FM,
    },
  },
  'vrla-agm': {
    chemistry: 'vrla-agm',
    label: 'VRLA, absorbed glass mat (AGM)',
    nominalCellVoltage: 2.0,
    // Rested 12 V block: 12.85 V full, 12.2 V half, 11.8 V empty (÷ 6).
    ocvCurve: [
      { soc: 0, voltage: 11.8 / 6 },
      { soc: 0.25, voltage: 12.0 / 6 },
      { soc: 0.5, voltage: 12.2 / 6 },
      { soc: 0.75, voltage: 12.5 / 6 },
      { soc: 1, voltage: 12.85 / 6 },
    ],
    endOfDischargeCellVoltage: 1.75,
    peukertExponent: 1.1,
    usableDepthOfDischarge: 0.5,
    internalResistanceOhmAh: 0.075,
    capacityVsTemperature: LEAD_ACID_TEMPERATURE,
    roundTripEfficiency: 0.85,
    ratedHours: 20,
    chargeCellVoltage: 2.4,
    floatCellVoltage: 2.27,
    maxChargeCRate: 0.3,
    maxDischargeCRate: 1,
    minChargeTemperatureC: -20,
    provenance: {
      nominalCellVoltage: CP,
      ocvCurve: 'common practice (rested 12 V block table ÷ 6, from memory)',
      endOfDischargeCellVoltage: CP,
      peukertExponent: 'makers\u2019 application notes give 1.05–1.15; 1.10 typical',
      usableDepthOfDischarge: CP,
      internalResistanceOhmAh: FM,
      capacityVsTemperature: `${LEAD_ACID_TEMPERATURE_SOURCE}; vented-cell table applied to VRLA (common practice)`,
      roundTripEfficiency: CP,
      ratedHours: 'common practice (C20)',
      chargeCellVoltage: CP,
      floatCellVoltage: CP,
      maxChargeCRate: CP_FM,
      maxDischargeCRate: CP_FM,
      minChargeTemperatureC: CP_FM,
    },
  },
  gel: {
    chemistry: 'gel',
    label: 'VRLA, gel',
    nominalCellVoltage: 2.0,
    ocvCurve: [
      { soc: 0, voltage: 11.8 / 6 },
      { soc: 0.25, voltage: 12.0 / 6 },
      { soc: 0.5, voltage: 12.3 / 6 },
      { soc: 0.75, voltage: 12.55 / 6 },
      { soc: 1, voltage: 12.85 / 6 },
    ],
    endOfDischargeCellVoltage: 1.75,
    peukertExponent: 1.15,
    usableDepthOfDischarge: 0.6,
    internalResistanceOhmAh: 0.12,
    capacityVsTemperature: LEAD_ACID_TEMPERATURE,
    roundTripEfficiency: 0.85,
    ratedHours: 20,
    chargeCellVoltage: 2.35,
    floatCellVoltage: 2.25,
    maxChargeCRate: 0.2,
    maxDischargeCRate: 0.5,
    minChargeTemperatureC: -20,
    provenance: {
      nominalCellVoltage: CP,
      ocvCurve: 'common practice (rested 12 V block table ÷ 6, from memory)',
      endOfDischargeCellVoltage: CP,
      peukertExponent: 'makers\u2019 application notes give 1.10–1.25; 1.15 common practice',
      usableDepthOfDischarge: CP,
      internalResistanceOhmAh: FM,
      capacityVsTemperature: `${LEAD_ACID_TEMPERATURE_SOURCE}; vented-cell table applied to gel (common practice)`,
      roundTripEfficiency: CP,
      ratedHours: 'common practice (C20)',
      chargeCellVoltage: CP,
      floatCellVoltage: CP,
      maxChargeCRate: CP_FM,
      maxDischargeCRate: CP_FM,
      minChargeTemperatureC: CP_FM,
    },
  },
  lifepo4: {
    chemistry: 'lifepo4',
    label: 'Lithium iron phosphate (LiFePO4)',
    nominalCellVoltage: 3.2,
    ocvCurve: [
      { soc: 0, voltage: 2.8 },
      { soc: 0.05, voltage: 3.0 },
      { soc: 0.1, voltage: 3.2 },
      { soc: 0.2, voltage: 3.25 },
      { soc: 0.3, voltage: 3.27 },
      { soc: 0.5, voltage: 3.29 },
      { soc: 0.7, voltage: 3.31 },
      { soc: 0.9, voltage: 3.33 },
      { soc: 1, voltage: 3.4 },
    ],
    endOfDischargeCellVoltage: 2.5,
    peukertExponent: 1.03,
    usableDepthOfDischarge: 0.9,
    internalResistanceOhmAh: 0.05,
    capacityVsTemperature: [
      { temperatureC: -20, capacityFactor: 0.65 },
      { temperatureC: -10, capacityFactor: 0.8 },
      { temperatureC: 0, capacityFactor: 0.88 },
      { temperatureC: 10, capacityFactor: 0.95 },
      { temperatureC: 25, capacityFactor: 1 },
      { temperatureC: 45, capacityFactor: 1 },
      { temperatureC: 60, capacityFactor: 1 },
    ],
    roundTripEfficiency: 0.95,
    ratedHours: 2,
    chargeCellVoltage: 3.55,
    floatCellVoltage: 3.375,
    maxChargeCRate: 0.5,
    maxDischargeCRate: 1,
    minChargeTemperatureC: 0,
    provenance: {
      nominalCellVoltage: CP,
      ocvCurve: FM,
      endOfDischargeCellVoltage: 'common practice (cell makers give 2.5 V)',
      peukertExponent: 'makers\u2019 application notes give ≈1.0–1.05; 1.03 common practice',
      usableDepthOfDischarge: CP,
      internalResistanceOhmAh: FM,
      capacityVsTemperature: FM,
      roundTripEfficiency: CP,
      ratedHours: 'common practice (cells rated at 0.5C)',
      chargeCellVoltage: CP,
      floatCellVoltage: CP,
      maxChargeCRate: CP_FM,
      maxDischargeCRate: CP_FM,
      minChargeTemperatureC: 'common practice (cell makers forbid charging below 0 °C: lithium plating)',
    },
  },
  nmc: {
    chemistry: 'nmc',
    label: 'Lithium nickel manganese cobalt oxide (NMC)',
    nominalCellVoltage: 3.6,
    ocvCurve: [
      { soc: 0, voltage: 3.0 },
      { soc: 0.1, voltage: 3.45 },
      { soc: 0.2, voltage: 3.55 },
      { soc: 0.3, voltage: 3.62 },
      { soc: 0.4, voltage: 3.67 },
      { soc: 0.5, voltage: 3.72 },
      { soc: 0.6, voltage: 3.78 },
      { soc: 0.7, voltage: 3.85 },
      { soc: 0.8, voltage: 3.93 },
      { soc: 0.9, voltage: 4.03 },
      { soc: 1, voltage: 4.15 },
    ],
    endOfDischargeCellVoltage: 3.0,
    peukertExponent: 1.05,
    usableDepthOfDischarge: 0.8,
    internalResistanceOhmAh: 0.06,
    capacityVsTemperature: [
      { temperatureC: -20, capacityFactor: 0.7 },
      { temperatureC: -10, capacityFactor: 0.8 },
      { temperatureC: 0, capacityFactor: 0.9 },
      { temperatureC: 25, capacityFactor: 1 },
      { temperatureC: 45, capacityFactor: 1 },
      { temperatureC: 60, capacityFactor: 1 },
    ],
    roundTripEfficiency: 0.95,
    ratedHours: 5,
    chargeCellVoltage: 4.15,
    floatCellVoltage: 4.05,
    maxChargeCRate: 0.7,
    maxDischargeCRate: 2,
    minChargeTemperatureC: 0,
    provenance: {
      nominalCellVoltage: CP,
      ocvCurve: FM,
      endOfDischargeCellVoltage: CP,
      peukertExponent: FM,
      usableDepthOfDischarge: CP,
      internalResistanceOhmAh: FM,
      capacityVsTemperature: FM,
      roundTripEfficiency: CP,
      ratedHours: 'common practice (cells rated at 0.2C)',
      chargeCellVoltage: 'common practice (held a little below the 4.2 V maximum for life)',
      floatCellVoltage: 'common practice (lithium has no true float; standby held below full)',
      maxChargeCRate: CP_FM,
      maxDischargeCRate: CP_FM,
      minChargeTemperatureC: 'common practice (cell makers forbid charging below 0 °C: lithium plating)',
    },
  },
  nicd: {
    chemistry: 'nicd',
    label: 'Nickel-cadmium (pocket plate, vented)',
    nominalCellVoltage: 1.2,
    ocvCurve: [
      { soc: 0, voltage: 1.15 },
      { soc: 0.1, voltage: 1.22 },
      { soc: 0.3, voltage: 1.25 },
      { soc: 0.5, voltage: 1.27 },
      { soc: 0.7, voltage: 1.29 },
      { soc: 0.9, voltage: 1.31 },
      { soc: 1, voltage: 1.35 },
    ],
    endOfDischargeCellVoltage: 1.0,
    peukertExponent: 1.1,
    usableDepthOfDischarge: 0.8,
    internalResistanceOhmAh: 0.1,
    capacityVsTemperature: [
      { temperatureC: -30, capacityFactor: 0.65 },
      { temperatureC: -20, capacityFactor: 0.8 },
      { temperatureC: 0, capacityFactor: 0.95 },
      { temperatureC: 25, capacityFactor: 1 },
      { temperatureC: 45, capacityFactor: 1 },
    ],
    roundTripEfficiency: 0.7,
    ratedHours: 5,
    chargeCellVoltage: 1.45,
    floatCellVoltage: 1.4,
    maxChargeCRate: 0.2,
    maxDischargeCRate: 1,
    minChargeTemperatureC: -20,
    provenance: {
      nominalCellVoltage: CP,
      ocvCurve: FM,
      endOfDischargeCellVoltage: 'common practice (1.0 V/cell; 1.10–1.14 V/cell for short-duty sizing)',
      peukertExponent: FM,
      usableDepthOfDischarge: CP,
      internalResistanceOhmAh: FM,
      capacityVsTemperature: FM,
      roundTripEfficiency: CP,
      ratedHours: 'common practice (C5, as IEC 60623 rates vented NiCd; from memory)',
      chargeCellVoltage: CP_FM,
      floatCellVoltage: CP_FM,
      maxChargeCRate: CP_FM,
      maxDischargeCRate: CP_FM,
      minChargeTemperatureC: FM,
    },
  },
};
