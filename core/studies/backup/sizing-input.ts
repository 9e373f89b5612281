/**
 * Bank sizing, part 4 of 7: the input checks — the chemistry preset with its overrides (also used by
 * recharge.ts), and every field of the sizing input, each refusal naming its field.
 */
import { MAX_TEMPERATURE_EXTRAPOLATION_C, capacityFactorAt as extrapolatedCapacityFactor } from '../../physics/bank.ts';
import { CHEMISTRIES, CHEMISTRY_PRESETS, type Chemistry, type ChemistryPreset, type ChemistryValues } from '../../data/battery-chemistries.ts';
import { IEEE_485_TEMPERATURE_FACTORS } from '../../data/ieee-485.ts';
import type { Problem, ProblemCode } from '../../model/errors.ts';
import { PROJECT_LEVEL } from '../../model/errors.ts';
import { isLeadAcid, leadAcidTemperatureFactor } from './sizing-factors.ts';
import { MAX_REPEATED_PERIODS, repeatedPeriods } from './sizing-periods.ts';
import {
  DEFAULT_FIELDS,
  DEFAULT_MAX_STRINGS,
  RATED_TEMPERATURE,
  sizingFactors,
  type Checked,
  type DutyCycle,
  type SizingFieldPaths,
  type SizingInput,
} from './sizing-types.ts';

/** Builds a problem; `value` is kept only when JSON can carry it. */
export function problem(
  code: ProblemCode,
  elementId: string,
  field: string,
  value: unknown,
  message: string,
): Problem {
  return { code, elementId, field, value, message };
}

const isFiniteNumber = (x: unknown): x is number => typeof x === 'number' && Number.isFinite(x);

/**
 * The chemistry preset with datasheet overrides applied, or problems naming the field.
 * Only the values these modules use are checked here; the bank model checks the rest.
 */
export function resolvePreset(
  chemistry: string,
  overrides: Partial<ChemistryValues> | undefined,
  elementId: string,
  chemistryField: string,
  overridesField: string,
): { ok: true; preset: ChemistryPreset } | { ok: false; problems: Problem[] } {
  if (!(CHEMISTRIES as readonly string[]).includes(chemistry)) {
    return {
      ok: false,
      problems: [
        problem(
          'unknown-chemistry',
          elementId,
          chemistryField,
          chemistry,
          `unknown chemistry "${String(chemistry)}": use one of ${CHEMISTRIES.join(', ')}`,
        ),
      ],
    };
  }
  const preset: ChemistryPreset = { ...CHEMISTRY_PRESETS[chemistry as Chemistry], ...(overrides ?? {}) };
  const problems: Problem[] = [];
  const f = (name: keyof ChemistryValues) => `${overridesField}.${name}`;
  const positiveFields: (keyof ChemistryValues)[] = [
    'nominalCellVoltage',
    'endOfDischargeCellVoltage',
    'ratedHours',
    'maxDischargeCRate',
    'maxChargeCRate',
    'chargeCellVoltage',
  ];
  for (const name of positiveFields) {
    const v = preset[name];
    if (!isFiniteNumber(v) || v <= 0) problems.push(problem('invalid-value', elementId, f(name), v, 'must be a number greater than 0'));
  }
  if (!isFiniteNumber(preset.peukertExponent) || preset.peukertExponent < 1 || preset.peukertExponent > 2) {
    problems.push(problem('invalid-value', elementId, f('peukertExponent'), preset.peukertExponent, 'Peukert exponent must be between 1 and 2'));
  }
  const dod = preset.usableDepthOfDischarge;
  if (!isFiniteNumber(dod) || dod <= 0 || dod > 1) {
    problems.push(problem('invalid-value', elementId, f('usableDepthOfDischarge'), dod, 'usable depth of discharge must be greater than 0 and at most 1'));
  }
  if (
    isFiniteNumber(preset.endOfDischargeCellVoltage) &&
    isFiniteNumber(preset.nominalCellVoltage) &&
    preset.endOfDischargeCellVoltage >= preset.nominalCellVoltage
  ) {
    problems.push(
      problem('invalid-value', elementId, f('endOfDischargeCellVoltage'), preset.endOfDischargeCellVoltage, `cut-off voltage must be below the nominal cell voltage (${preset.nominalCellVoltage} V)`),
    );
  }
  const table = preset.capacityVsTemperature;
  if (
    !Array.isArray(table) ||
    table.length === 0 ||
    table.some((p, i) => !isFiniteNumber(p.temperatureC) || !isFiniteNumber(p.capacityFactor) || p.capacityFactor <= 0 || (i > 0 && p.temperatureC <= table[i - 1]!.temperatureC))
  ) {
    problems.push(
      problem('invalid-value', elementId, f('capacityVsTemperature'), table, 'capacity vs temperature must list rising temperatures with capacity factors greater than 0'),
    );
  }
  return problems.length > 0 ? { ok: false, problems } : { ok: true, preset };
}

function checkFactor(
  out: Problem[],
  elementId: string,
  field: string,
  v: unknown,
  what: string,
): void {
  if (!isFiniteNumber(v)) out.push(problem('invalid-value', elementId, field, v, `${what} must be a number`));
  else if (v < 1) out.push(problem('invalid-value', elementId, field, v, `${what} must be at least 1 (it multiplies the size)`));
}

function checkPeriods(out: Problem[], elementId: string, field: string, duty: DutyCycle): void {
  if (!Array.isArray(duty.periods) || duty.periods.length === 0) {
    out.push(problem('invalid-value', elementId, `${field}.periods`, duty.periods, 'the duty cycle needs at least one period'));
    return;
  }
  const key = duty.basis === 'current' ? 'current' : 'power';
  const unit = duty.basis === 'current' ? 'A' : 'W';
  // The field path is built only for a refused period (a runtime study's run gives some thousands).
  const base = (i: number) => `${field}.periods[${i}]`;
  // A plain loop reading the field by its name (a run gives some thousand periods per study).
  const periods = duty.periods as readonly Record<string, unknown>[];
  const power = key === 'power';
  for (let i = 0; i < periods.length; i++) {
    const p = periods[i]!;
    if (!isFiniteNumber(p['duration']) || p['duration'] <= 0) {
      out.push(problem('invalid-value', elementId, `${base(i)}.duration`, p['duration'], 'period duration must be greater than 0 s'));
    }
    const v = power ? p['power'] : p['current'];
    if (!isFiniteNumber(v) || v < 0) {
      out.push(problem('invalid-value', elementId, `${base(i)}.${key}`, v, `period ${key} must be a number of at least 0 ${unit} (charging periods are not part of a discharge duty cycle)`));
    }
  }
  if (duty.basis === 'power' && duty.voltage !== undefined && (!isFiniteNumber(duty.voltage) || duty.voltage <= 0)) {
    out.push(problem('invalid-value', elementId, `${field}.voltage`, duty.voltage, 'conversion voltage must be greater than 0 V'));
  }
}

export function checkInput(input: SizingInput): { ok: true; c: Checked } | { ok: false; problems: Problem[] } {
  const elementId = input.elementId ?? PROJECT_LEVEL;
  const fields: SizingFieldPaths = { ...DEFAULT_FIELDS, ...(input.fields ?? {}) };
  const resolved = resolvePreset(input.chemistry, input.overrides, elementId, fields.chemistry, fields.overrides);
  if (!resolved.ok) return resolved;
  const preset = resolved.preset;
  const out: Problem[] = [];

  if (!isFiniteNumber(input.busVoltage) || input.busVoltage <= 0) {
    out.push(problem('invalid-value', elementId, fields.busVoltage, input.busVoltage, 'bus voltage must be greater than 0 V'));
  }
  if (input.dutyCycle === null || typeof input.dutyCycle !== 'object' || (input.dutyCycle.basis !== 'current' && input.dutyCycle.basis !== 'power')) {
    out.push(problem('invalid-value', elementId, fields.dutyCycle, input.dutyCycle, 'duty cycle must be a list of current or power periods'));
  } else {
    checkPeriods(out, elementId, fields.dutyCycle, input.dutyCycle);
  }
  if (input.targetRuntime !== undefined && (!isFiniteNumber(input.targetRuntime) || input.targetRuntime <= 0)) {
    out.push(problem('invalid-value', elementId, fields.targetRuntime, input.targetRuntime, 'target runtime must be greater than 0'));
  } else if (input.targetRuntime !== undefined && Array.isArray(input.dutyCycle?.periods)) {
    const repeated = repeatedPeriods(input.dutyCycle.periods, input.targetRuntime);
    if (repeated > MAX_REPEATED_PERIODS) {
      out.push(
        problem(
          'invalid-value',
          elementId,
          fields.targetRuntime,
          input.targetRuntime,
          `the duty cycle would have to repeat into ${repeated > 1e15 ? 'far more than 10^15' : Math.ceil(repeated)} periods to fill the target runtime; at most ${MAX_REPEATED_PERIODS}: give a duty cycle closer to the target runtime`,
        ),
      );
    }
  }
  const { designMargin, agingFactor } = sizingFactors(input, preset.chemistry);
  checkFactor(out, elementId, fields.designMargin, designMargin, 'design margin');
  checkFactor(out, elementId, fields.agingFactor, agingFactor, 'aging factor');

  const temperature = input.temperature ?? RATED_TEMPERATURE;
  if (!isFiniteNumber(temperature)) {
    out.push(problem('invalid-value', elementId, fields.temperature, temperature, 'temperature must be a number (°C)'));
  } else if (isLeadAcid(preset.chemistry)) {
    if (leadAcidTemperatureFactor(temperature, input.creditAbove25C === true) === null) {
      const rows = IEEE_485_TEMPERATURE_FACTORS;
      out.push(
        problem(
          'outside-table',
          elementId,
          fields.temperature,
          temperature,
          temperature < rows[0]!.celsius
            ? `electrolyte temperature ${temperature} °C is more than ${MAX_TEMPERATURE_EXTRAPOLATION_C} °C below IEEE 485 Table 1 (${rows[0]!.celsius} °C to ${rows[rows.length - 1]!.celsius} °C); give the maker\u2019s capacity at this temperature`
            : `electrolyte temperature ${temperature} °C is above IEEE 485 Table 1 (up to ${rows[rows.length - 1]!.celsius} °C): no credit for heat can be taken there`,
        ),
      );
    }
  } else {
    const c = extrapolatedCapacityFactor(preset.capacityVsTemperature, temperature);
    if (c.refused !== undefined) out.push(problem('outside-table', elementId, fields.temperature, temperature, `cell temperature: ${c.refused}`));
  }

  if (input.ratings !== undefined) {
    if (!Array.isArray(input.ratings) || input.ratings.length === 0) {
      out.push(problem('invalid-value', elementId, fields.ratings, input.ratings, 'give at least one standard rating, or leave the list out for a continuous size'));
    } else {
      input.ratings.forEach((r, i) => {
        if (!isFiniteNumber(r) || r <= 0) out.push(problem('invalid-value', elementId, `${fields.ratings}[${i}]`, r, 'a capacity rating must be greater than 0 Ah'));
      });
    }
  }
  if (input.capacityFactors !== undefined) {
    const t = input.capacityFactors;
    // One point is a maker's figure for a single time (a one-period duty cycle of that length).
    if (!Array.isArray(t) || t.length < 1) {
      out.push(problem('invalid-value', elementId, fields.capacityFactors, t, 'a K_t table needs at least one point'));
    } else {
      t.forEach((p, i) => {
        const base = `${fields.capacityFactors}[${i}]`;
        if (!isFiniteNumber(p.time) || p.time <= 0) out.push(problem('invalid-value', elementId, `${base}.time`, p.time, 'time must be greater than 0 s'));
        else if (i > 0 && isFiniteNumber(t[i - 1]!.time) && p.time <= t[i - 1]!.time) out.push(problem('invalid-value', elementId, `${base}.time`, p.time, 'times must rise from one point to the next'));
        if (!isFiniteNumber(p.factor) || p.factor <= 0) out.push(problem('invalid-value', elementId, `${base}.factor`, p.factor, 'K_t must be greater than 0 h'));
      });
    }
    if (!isLeadAcid(preset.chemistry) && preset.chemistry !== 'nicd') {
      out.push(problem('invalid-value', elementId, fields.capacityFactors, t, 'a K_t table applies to the lead-acid and NiCd worksheet only; lithium is sized by energy'));
    }
  }
  if (input.moduleAh !== undefined && (!isFiniteNumber(input.moduleAh) || input.moduleAh <= 0)) {
    out.push(problem('invalid-value', elementId, fields.moduleAh, input.moduleAh, 'the module capacity must be greater than 0 Ah'));
  }
  if (input.design !== undefined && input.design !== 'backup' && input.design !== 'cycling') {
    out.push(problem('invalid-value', elementId, fields.design, input.design, 'design must be "backup" or "cycling"'));
  }
  if (input.powerFactors !== undefined) {
    const t = input.powerFactors;
    if (!Array.isArray(t) || t.length < 1) {
      out.push(problem('invalid-value', elementId, fields.powerFactors, t, 'a constant-power table needs at least one point'));
    } else {
      t.forEach((p, i) => {
        const base = `${fields.powerFactors}[${i}]`;
        if (!isFiniteNumber(p.time) || p.time <= 0) out.push(problem('invalid-value', elementId, `${base}.time`, p.time, 'time must be greater than 0 s'));
        else if (i > 0 && isFiniteNumber(t[i - 1]!.time) && p.time <= t[i - 1]!.time) out.push(problem('invalid-value', elementId, `${base}.time`, p.time, 'times must rise from one point to the next'));
        if (!isFiniteNumber(p.wattsPerCellPerAh) || p.wattsPerCellPerAh <= 0) out.push(problem('invalid-value', elementId, `${base}.wattsPerCellPerAh`, p.wattsPerCellPerAh, 'W per cell per Ah must be greater than 0'));
      });
    }
    if (!isLeadAcid(preset.chemistry) && preset.chemistry !== 'nicd') {
      out.push(problem('invalid-value', elementId, fields.powerFactors, t, 'a constant-power table applies to the lead-acid and NiCd worksheet only; lithium is sized by energy'));
    }
    if (input.capacityFactors !== undefined) out.push(problem('invalid-value', elementId, fields.powerFactors, t, 'give either a K_t table (amperes) or a constant-power table (watts per cell), not both'));
    if (input.dutyCycle?.basis !== 'power') out.push(problem('invalid-value', elementId, fields.powerFactors, t, 'a constant-power table needs a duty cycle given in watts'));
    if (input.randomLoad !== undefined && 'current' in input.randomLoad) out.push(problem('invalid-value', elementId, `${fields.randomLoad}.current`, input.randomLoad.current, 'with a constant-power table give the random load in watts'));
  }
  const cellsPerBlock = input.cellsPerBlock ?? 1;
  if (!Number.isInteger(cellsPerBlock) || cellsPerBlock < 1) {
    out.push(problem('invalid-value', elementId, fields.cellsPerBlock, cellsPerBlock, 'cells per block must be a whole number of at least 1'));
  }
  if (input.seriesBlocks !== undefined && (!Number.isInteger(input.seriesBlocks) || input.seriesBlocks < 1)) {
    out.push(problem('invalid-value', elementId, fields.seriesBlocks, input.seriesBlocks, 'blocks in series must be a whole number of at least 1'));
  }
  const maxStrings = input.maxStrings ?? DEFAULT_MAX_STRINGS;
  if (!Number.isInteger(maxStrings) || maxStrings < 1) {
    out.push(problem('invalid-value', elementId, fields.maxStrings, maxStrings, 'maximum strings must be a whole number of at least 1'));
  }
  if (input.randomLoad !== undefined) {
    const r = input.randomLoad;
    if (!isFiniteNumber(r.duration) || r.duration <= 0) out.push(problem('invalid-value', elementId, `${fields.randomLoad}.duration`, r.duration, 'random-load duration must be greater than 0 s'));
    const v = 'current' in r ? r.current : r.power;
    if (!isFiniteNumber(v) || v < 0) out.push(problem('invalid-value', elementId, `${fields.randomLoad}.${'current' in r ? 'current' : 'power'}`, v, 'random load must be a number of at least 0'));
  }
  if (out.length > 0) return { ok: false, problems: out };
  return { ok: true, c: { elementId, preset, fields, designMargin, agingFactor, temperature, maxStrings, cellsPerBlock } };
}
