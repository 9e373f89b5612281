/**
 * Bank sizing, part 6 of 7: the worksheet method for lead-acid (IEEE 485) and NiCd (IEEE 1115) —
 * K_t from Peukert's law or a datasheet table, the sections, the random load, temperature
 * correction, design margin, aging, the discharge-rate and depth-of-discharge bounds (header of
 * sizing.ts, step 2).
 */
import { capacityFactorAt as extrapolatedCapacityFactor } from '../../physics/bank.ts';
import { sigText } from '../../model/message.ts';
import { isLeadAcid, leadAcidTemperatureFactor, peukertCapacityFactor, tableCapacityFactor } from './sizing-factors.ts';
import { problem } from './sizing-input.ts';
import { mergeEqualPeriods, mergeNearPeriods } from './sizing-periods.ts';
import {
  MAX_PERIODS_WITH_ROWS,
  NEAR_CURRENT,
  round,
  type CapacityFactorPoint,
  type CurrentPeriod,
  type GoverningLimit,
  type MethodContext,
  type MethodOutcome,
  type SizingMethod,
  type WorksheetSection,
} from './sizing-types.ts';
import { depthOfDischargeCapacity, interiorBound, interiorPeak, worksheetSection, worksheetSections } from './sizing-worksheet.ts';

/** Sizes a lead-acid or NiCd bank by the duty-cycle worksheet. */
export function sizeByWorksheet(ctx: MethodContext): MethodOutcome {
  const { input, preset, fields, elementId, periods, powerPeriods, seriesCells, step, userSource, warnings } = ctx;
  const { randomCurrent, peakCurrent, temperature, designMargin, agingFactor, limitDoD, powerTable } = ctx;
  const random = input.randomLoad;
  let sections: WorksheetSection[] = [];
  let worksheetPeriods: CurrentPeriod[] = periods;
  let required: number;
  let governing: GoverningLimit;
  let method: SizingMethod;

  method = preset.chemistry === 'nicd' ? 'ieee-1115-worksheet' : 'ieee-485-worksheet';
  // With a maker's constant-power table, K_t^W = 1 ÷ (W per cell per Ah), in the same log–log form.
  const table: readonly CapacityFactorPoint[] | undefined =
    powerTable !== undefined ? powerTable.map((p) => ({ time: p.time, factor: 1 / p.wattsPerCellPerAh })) : input.capacityFactors;
  const tableField = powerTable !== undefined ? fields.powerFactors : fields.capacityFactors;
  let loadColumn = periods;
  if (powerTable !== undefined && powerPeriods !== null) {
    // The worksheet's load column in watts per cell (the duty cycle's power ÷ cells in series).
    loadColumn = mergeEqualPeriods(powerPeriods.map((p) => ({ duration: p.duration, current: p.power / seriesCells })));
    step('Load per cell', Math.max(...loadColumn.map((p) => p.current)), 'W', `largest period power ÷ ${seriesCells} cells; the worksheet runs on watts per cell`);
  }
  // First time the datasheet table does not cover (NaN while none).
  const missing = { time: Number.NaN };
  const kAt = (timeS: number): number => {
    if (table !== undefined) {
      const k = tableCapacityFactor(table, timeS);
      if (k === null) {
        if (Number.isNaN(missing.time)) missing.time = timeS;
        return Number.NaN;
      }
      return k;
    }
    return peukertCapacityFactor(timeS / 3600, preset.ratedHours, preset.peukertExponent);
  };
  step(
    'Capacity rating factor K_t',
    table !== undefined ? table.length : preset.peukertExponent,
    table !== undefined ? 'points' : '',
    powerTable !== undefined
      ? 'K_t = 1 ÷ (W per cell per Ah) from the maker\u2019s constant-power table given (log–log interpolation)'
      : table !== undefined
        ? 'from the datasheet table given (log–log interpolation)'
        : `Peukert's law: K_t = H·(t/H)^(1/k), H = ${preset.ratedHours} h, k = ${preset.peukertExponent} (${userSource('peukertExponent')})`,
  );
  // A long sampled profile: neighbours within 0.5 % joined at the higher current (conservative:
  // the size never falls when a current rises), so the O(n²) worksheet stays quick.
  const merged = loadColumn.length > MAX_PERIODS_WITH_ROWS ? mergeNearPeriods(loadColumn, NEAR_CURRENT) : loadColumn;
  if (merged.length < loadColumn.length) {
    step(
      'Worksheet periods',
      merged.length,
      '',
      `${loadColumn.length} periods; neighbours within ${NEAR_CURRENT * 100} % joined at the higher current (conservative)`,
    );
  }
  worksheetPeriods = merged;
  sections = worksheetSections(merged, kAt, merged.length <= MAX_PERIODS_WITH_ROWS);
  if (!Number.isNaN(missing.time) && table !== undefined) {
    return {
      ok: false,
      problems: [
        problem(
          'outside-table',
          elementId,
          tableField,
          missing.time,
          `the worksheet needs K_t at ${round(missing.time)} s; the table given spans ${table[0]!.time} s to ${table[table.length - 1]!.time} s — extend it from the datasheet`,
        ),
      ],
    };
  }
  // Inside a period the superposition can rise above both of its ends (a load step down earlier
  // is credited along a concave K_t): a section is also sized at its largest point inside its
  // last period, so the size never falls when the duty cycle is cut later (a longer target).
  const endMax = sections.reduce((m, x) => Math.max(m, x.total), -Infinity);
  const minTime = table === undefined ? 0 : table[0]!.time;
  let floor = endMax;
  // Peukert's K_t is concave with K(0) = 0, so over period i the sum can exceed its end value F_i
  // by at most |ΔA_i|·K(M_i) (a step down at i) + N·(K(M_{i−1} + M_i) − K(M_{i−1})), N the sum of
  // the earlier steps down (each increment K(d + M_i) − K(d) is largest at the smallest d): a
  // cheap test that skips most periods of a long profile before the exact search.
  let stepsDown = 0;
  const candidates: { x: WorksheetSection; bound: number }[] = [];
  for (const x of sections) {
    const i = x.section - 1;
    const m = merged[i]!.duration;
    const change = merged[i]!.current - (i > 0 ? merged[i - 1]!.current : 0);
    const before = stepsDown;
    if (change < 0) stepsDown -= change;
    if (table === undefined) {
      const prev = i > 0 ? merged[i - 1]!.duration : 0;
      const quick = x.total + (change < 0 ? -change * kAt(m) : 0) + (i > 0 ? before * (kAt(prev + m) - kAt(prev)) : 0);
      if (!(quick > floor * (1 + 1e-12))) continue;
    }
    const bound = interiorBound(merged, i, kAt, minTime);
    if (bound > floor * (1 + 1e-12)) candidates.push({ x, bound });
  }
  // Best first: the largest bound is searched first, and the floor it raises prunes the rest.
  candidates.sort((p, q) => q.bound - p.bound);
  for (const { x, bound } of candidates) {
    if (!(bound > floor * (1 + 1e-12))) break;
    const peak = interiorPeak(merged, x.section - 1, kAt, floor, minTime);
    if (peak !== null) {
      x.interiorPeak = peak;
      floor = Math.max(floor, peak.size);
    }
  }
  const sizeOf = (x: WorksheetSection) => Math.max(x.total, x.interiorPeak?.size ?? -Infinity);
  let best = sections[0]!;
  for (const s of sections) if (sizeOf(s) > sizeOf(best)) best = s;
  if (merged.length > MAX_PERIODS_WITH_ROWS) {
    best.rows = worksheetSection(merged, best.section - 1, kAt, true).rows;
    warnings.push(
      `The duty cycle has ${merged.length} periods: every section's total is listed, but the period rows of the governing section S${best.section} only.`,
    );
  }
  if (best.interiorPeak !== undefined && best.interiorPeak.size > best.total) {
    step(
      'Maximum section size',
      best.interiorPeak.size,
      'Ah',
      `section S${best.section} of ${sections.length} at ${round(best.interiorPeak.time / 60)} min into its last period, where the worksheet sum is ${round(best.interiorPeak.size)} Ah, above its ${round(best.total)} Ah at the period end (worksheet line 9, taken at its largest: conservative)`,
    );
  } else {
    step('Maximum section size', best.total, 'Ah', `section S${best.section} of ${sections.length} (worksheet line 9)`);
  }
  let uncorrected = sizeOf(best);
  if (random !== undefined) {
    const kr = kAt(random.duration);
    if (Number.isNaN(kr)) {
      return {
        ok: false,
        problems: [problem('outside-table', elementId, `${fields.randomLoad}.duration`, random.duration, 'the random load\u2019s duration lies outside the K_t table given')],
      };
    }
    const randomLoad = powerTable !== undefined && 'power' in random ? random.power / seriesCells : randomCurrent;
    step('Random-load section size', randomLoad * kr, 'Ah', `${round(randomLoad)} ${powerTable !== undefined ? 'W per cell' : 'A'} × K_t ${round(kr)} at ${random.duration} s (worksheet line 10)`);
    uncorrected += randomLoad * kr;
  }
  step('Uncorrected size', uncorrected, 'Ah', 'worksheet line 11');

  let tempFactor: number;
  if (isLeadAcid(preset.chemistry)) {
    const t = leadAcidTemperatureFactor(temperature, input.creditAbove25C === true)!;
    const raw = t.raw;
    tempFactor = raw < 1 && !input.creditAbove25C ? 1 : raw;
    step(
      'Temperature correction factor',
      tempFactor,
      '',
      t.extrapolated && temperature < 25
        ? `${temperature} °C is below IEEE 485 Table 1: the capacity (1 ÷ factor) extrapolated linearly from its two coldest rows (−3.9 °C 1.52, −1.1 °C 1.43), never below 1.52; use the maker\u2019s figure for this temperature`
        : t.extrapolated
          ? `${temperature} °C is above IEEE 485 Table 1: 1.00, no credit for heat (the note to Table 1)`
          : `IEEE 485 Table 1 at ${sigText(temperature, 3)} °C${raw < 1 && !input.creditAbove25C ? ` (table gives ${sigText(raw, 4)}; held at 1.00 above 25 °C as the note to the table advises)` : ''}`,
    );
    if (t.extrapolated && temperature < 25) warnings.push(`${temperature} °C is below IEEE 485 Table 1 (from −3.9 °C): its temperature factor ${round(tempFactor)} is extrapolated from the two coldest rows; ask the cell maker for the capacity at this temperature.`);
  } else {
    const c = extrapolatedCapacityFactor(preset.capacityVsTemperature, temperature);
    tempFactor = 1 / c.factor;
    step(
      'Temperature derating factor',
      tempFactor,
      '',
      `1 ÷ capacity factor at ${temperature} °C (IEEE 1115 takes it from the maker; ${userSource('capacityVsTemperature')}${c.extrapolated ? '; outside the table: extrapolated along its end slope, never above its end value' : ''})`,
    );
  }
  step('Design margin', designMargin, '', input.designMargin === undefined ? 'default 1.10 (IEEE 485 worksheet line 13; 1.10–1.15 is usual)' : 'as given');
  step('Aging factor', agingFactor, '', input.agingFactor === undefined ? 'default 1.25 (IEEE 485 worksheet line 14: replaced at 80 % of rated capacity, 1 ÷ 0.80)' : 'as given');
  const worksheetSize = uncorrected * tempFactor * designMargin * agingFactor;
  step('Required size (worksheet)', worksheetSize, 'Ah', 'uncorrected × temperature × design margin × aging');
  required = worksheetSize;
  governing = { kind: 'section', section: best.section };

  const rateSize = peakCurrent / preset.maxDischargeCRate;
  if (table === undefined) {
    // Peukert extrapolated to minutes overstates the deliverable current; the C-rate bounds it.
    step(
      'Size for the discharge-rate limit',
      rateSize,
      'Ah',
      `peak ${round(peakCurrent)} A ÷ ${preset.maxDischargeCRate} C maximum continuous discharge (${userSource('maxDischargeCRate')})`,
    );
    if (rateSize > required) {
      required = rateSize;
      governing = { kind: 'discharge-rate' };
      warnings.push(
        'The discharge-rate limit, not the worksheet, sets the size: Peukert\u2019s law is unreliable for short high-current periods. A datasheet K_t table gives a truer size.',
      );
    }
    const shortest = Math.min(...merged.map((p) => p.duration));
    if (shortest < 3600) {
      warnings.push(
        `K_t for periods shorter than an hour is extrapolated with Peukert's law from the ${preset.ratedHours} h rating; use the cell maker's K_t (or amperes-for-t-minutes) table for the final size.`,
      );
    }
  } else if (rateSize > worksheetSize) {
    warnings.push(
      `The peak current ${round(peakCurrent)} A is above the maximum continuous discharge rate (${preset.maxDischargeCRate} C, ${userSource('maxDischargeCRate')}) of this size; the K_t table given is trusted — confirm the rate with the cell maker.`,
    );
  }

  if (limitDoD) {
    const dod = preset.usableDepthOfDischarge;
    const drawn = random === undefined ? periods : [...periods, { duration: random.duration, current: randomCurrent }];
    // The factors shrink the usable share of the rated capacity, and Peukert's rated current is
    // that of the bank itself (C/H), as the runtime study counts them.
    const factors = tempFactor * designMargin * agingFactor;
    const dodSize = depthOfDischargeCapacity(drawn, preset.ratedHours, preset.peukertExponent, dod / factors);
    step(
      'Size for the depth-of-discharge limit',
      dodSize,
      'Ah',
      `smallest C with ${dod} DoD × C ÷ (temperature × design margin × aging = ${round(factors)}) ≥ the Peukert-equivalent charge Σ I·max(1, I·H/C)^(k−1)·t`,
    );
    if (dodSize > required) {
      required = dodSize;
      governing = { kind: 'depth-of-discharge' };
      warnings.push(
        `Cycling design: the usable depth of discharge (${dod}), not the worksheet, sets the size; the runtime study stops the discharge there too.`,
      );
    }
  }
  return { ok: true, method, required, governing, sections, worksheetPeriods };
}
