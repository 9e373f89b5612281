/**
 * Battery bank sizing — the inverse of the runtime study: for a duty cycle (and optionally a target
 * runtime), the smallest bank. Pure: no clock, no storage; inputs are never mutated.
 *
 * Methods (each step is returned as data so a user can check it by hand):
 *
 * 1. Series count from the bus voltage: n = round(V_bus / (V_cell,nominal × cells per block)).
 *
 * 2. Lead-acid (flooded, AGM, gel) — the IEEE 485 duty-cycle worksheet; NiCd — the same worksheet
 *    as IEEE 1115 uses it (from memory: the two standards share the method).
 *    Section S covers periods 1…S. Its size is
 *        F_S = Σ_{P=1..S} (A_P − A_{P−1}) · K_t,   t = Σ_{j=P..S} M_j  (time from the start of
 *    period P to the end of section S), with A_0 = 0. K_t is the capacity rating factor: rated Ah
 *    ÷ the current the cell can deliver for t to its end voltage. The uncorrected size is
 *    max_S F_S (+ a random load × its K_t, worksheet line 10); the cell size is that × temperature
 *    correction × design margin × aging factor (the 1997 edition's single temperature factor after
 *    the uncorrected size; the 2010 edition's per-row T_t gives the same result when one
 *    temperature governs the whole duty cycle).
 *    K_t comes from a datasheet table when one is given (log–log interpolation between its points,
 *    refused outside them), otherwise from Peukert's law in the rated-capacity form
 *    t = H·(C/(I·H))^k  ⇒  K_t = C/I = H·(t/H)^(1/k)  (hours of rated capacity per ampere),
 *    with H the chemistry's rated hours and k its Peukert exponent. Peukert's law far from H
 *    overstates what a cell delivers for minutes, so with Peukert K_t the chemistry's maximum
 *    continuous discharge C-rate also bounds the size (a datasheet K_t table is trusted instead,
 *    and a rate above the C-rate is only flagged).
 *    Design (`design`, default 'backup'): a backup design sizes to the end-of-discharge voltage
 *    only, as IEEE 485 / IEEE 1115 size standby cells (K_t is rated to that end voltage), and the
 *    runtime study then discharges to it. A cycling design adds the depth-of-discharge limit
 *    (not part of IEEE 485): the smallest C whose usable share DoD·C ÷ (temperature × design margin ×
 *    aging) covers the Peukert-equivalent charge of the duty cycle as the runtime study counts it,
 *    Σ I·max(1, I·H/C)^(k−1)·t with I_rated = C/H of the bank itself — so a bank sized here also
 *    passes the runtime study.
 *    Temperature correction: lead-acid from IEEE 485 Table 1 (core/data/ieee-485.ts), held at
 *    1.00 above 25 °C unless credit is asked for; NiCd: IEEE 1115 takes the derating from the
 *    maker (from memory), here 1 / capacity factor of the chemistry's capacity-vs-temperature table.
 *
 * 3. Lithium (LiFePO4, NMC) — energy method (common practice):
 *        E = Σ P_P·M_P (energy at the bank terminals over the duty cycle; for a current duty
 *            cycle P_P = A_P × nominal bank voltage),
 *        Wh = E ÷ (usable DoD × capacity factor at temperature) × design margin × aging factor,
 *        Ah = Wh ÷ nominal bank voltage,
 *    then the peak current is checked against the maximum continuous discharge C-rate: the bank
 *    must have at least I_peak ÷ C-rate Ah (more capacity or more strings when it fails).
 *    Peukert effects are neglected for lithium (k ≈ 1.0–1.05).
 *
 * 4. Strings: in the user's module (`moduleAh`, the block or cell of the bank as given), whole
 *    strings n = ⌈required Ah ÷ module Ah⌉ in parallel, each of the series blocks; with a list of
 *    standard ratings instead, the fewest strings (up to `maxStrings`) for which a rating covers
 *    required Ah ÷ strings, then the smallest such rating; continuous otherwise.
 *
 * Constant-power worksheet: with a maker's constant-power table (`powerFactors`: watts per cell per
 * rated Ah to the end voltage for t), the worksheet runs on watts per cell in place of amperes,
 * F_S = Σ (P_P − P_{P−1})/cells · K_t^W, K_t^W = 1 ÷ (W per cell per Ah) — the same section
 * arithmetic (it is linear in the load), as makers size constant-power (UPS) duty from their
 * W/cell tables.
 *
 * Temperature outside the tables: below IEEE 485 Table 1 (−3.9 °C) the capacity (1 ÷ factor) is
 * extrapolated linearly from the two coldest rows (never below the coldest factor), as the runtime
 * study extrapolates the chemistry's capacity table (core/physics/bank.ts capacityFactorAt);
 * refused farther than 20 °C out.
 *
 * Constant-power duty cycles are converted to current at a stated voltage: by default the minimum
 * bank voltage (end-of-discharge cell voltage × cells), the conservative choice — the current of a
 * constant-power load is highest there.
 */
import { TYPICAL_VALUE, bankCautions, depthOfDischargeApplies, designBasis, endVoltageCaution, type BankDesign } from './cautions.ts';
import { CHEMISTRY_PRESETS, type ChemistryValues } from '../../data/battery-chemistries.ts';
import { sizeByEnergy } from './sizing-by-energy.ts';
import { sizeByWorksheet } from './sizing-by-worksheet.ts';
import { isLeadAcid } from './sizing-factors.ts';
import { checkInput, problem } from './sizing-input.ts';
import { fitToRuntime, forEachFitted, mergeEqualPeriods } from './sizing-periods.ts';
import {
  DEFAULT_MAX_STRINGS,
  round,
  type CurrentPeriod,
  type MethodContext,
  type PowerPeriod,
  type SizingInput,
  type SizingOutcome,
  type SizingStep,
} from './sizing-types.ts';

// The sizing's parts (types and defaults, factors, periods, input checks, worksheet arithmetic, the
// two methods) live in sizing-*.ts; this file keeps the entry and re-exports what it exported when
// it was one file, so importers need not change.
export {
  DEFAULT_AGING_FACTOR,
  DEFAULT_DESIGN_MARGIN,
  DEFAULT_MAX_STRINGS,
  type BankSizing,
  type CapacityFactorPoint,
  type CurrentPeriod,
  type DutyCycle,
  type GoverningLimit,
  type PowerFactorPoint,
  type PowerPeriod,
  type RandomLoad,
  type SizingFieldPaths,
  type SizingInput,
  type SizingMethod,
  type SizingOutcome,
  type SizingStep,
  type WorksheetRow,
  type WorksheetSection,
} from './sizing-types.ts';
export * from './sizing-factors.ts';
export * from './sizing-periods.ts';
export { problem, resolvePreset } from './sizing-input.ts';
export * from './sizing-worksheet.ts';

/** Picks strings × rating per string for a required capacity (see header, step 4). */
function chooseStrings(
  required: number,
  ratings: readonly number[] | undefined,
  maxStrings: number,
): { strings: number; perString: number } | null {
  if (ratings === undefined) return { strings: 1, perString: required };
  const sorted = [...ratings].sort((a, b) => a - b);
  for (let n = 1; n <= maxStrings; n++) {
    // Tolerance for a required size equal to a rating up to rounding.
    const need = (required / n) * (1 - 1e-12);
    const r = sorted.find((x) => x >= need);
    if (r !== undefined) return { strings: n, perString: r };
  }
  return null;
}

/**
 * Sizes the smallest bank for a duty cycle. Returns every step, worksheet section and factor, or
 * problems naming the field (nothing is computed from bad input).
 */
export function sizeBank(input: SizingInput): SizingOutcome {
  const checked = checkInput(input);
  if (!checked.ok) return checked;
  const { elementId, preset, fields, maxStrings, cellsPerBlock } = checked.c;
  const steps: SizingStep[] = [];
  const warnings: string[] = [];
  const step = (label: string, value: number, unit: string, note: string) => steps.push({ label, value, unit, note });
  // Where a preset value came from, in the user's words (the provenance marks stay in the data file).
  const userSource = (k: keyof ChemistryValues) => (input.overrides?.[k] !== undefined ? 'maker\u2019s figure, as given' : TYPICAL_VALUE);

  // 1. Series count from the bus voltage.
  const blockVoltage = preset.nominalCellVoltage * cellsPerBlock;
  const seriesBlocks = input.seriesBlocks ?? Math.max(1, Math.round(input.busVoltage / blockVoltage));
  const seriesCells = seriesBlocks * cellsPerBlock;
  const nominalVoltage = seriesCells * preset.nominalCellVoltage;
  const minimumVoltage = seriesCells * preset.endOfDischargeCellVoltage;
  step('Nominal cell voltage', preset.nominalCellVoltage, 'V', `${preset.label} (${userSource('nominalCellVoltage')})`);
  step(
    cellsPerBlock > 1 ? 'Blocks in series' : 'Cells in series',
    seriesBlocks,
    '',
    input.seriesBlocks !== undefined ? 'as given' : `round(${input.busVoltage} V ÷ ${round(blockVoltage)} V)`,
  );
  step('Nominal bank voltage', nominalVoltage, 'V', `${seriesCells} cells × ${preset.nominalCellVoltage} V`);
  step('Minimum bank voltage', minimumVoltage, 'V', `${seriesCells} cells × ${preset.endOfDischargeCellVoltage} V/cell end of discharge (${userSource('endOfDischargeCellVoltage')})`);
  if (Math.abs(nominalVoltage - input.busVoltage) > 0.05 * input.busVoltage) {
    warnings.push(
      `The nominal bank voltage ${round(nominalVoltage)} V differs from the bus voltage ${input.busVoltage} V by more than 5 %: check the equipment's input range.`,
    );
  }

  // 2. Duty cycle as currents at the bank terminals.
  const duty = input.dutyCycle;
  let voltageBasis = minimumVoltage;
  let periods: CurrentPeriod[];
  let energyWh: number;
  // The largest period current (Math.max one at a time: a run of some thousand periods as arguments costs a copy).
  let largest = -Infinity;
  // The power duty cycle fitted to the runtime: read only by a worksheet on a maker's constant-power table.
  let powerPeriods: PowerPeriod[] | null = null;
  const lengthStep = (total: number, target: number) =>
    step(
      'Duty cycle length',
      target,
      's',
      Math.abs(total - target) <= 1e-9 * target
        ? 'equals the target runtime'
        : total < target
          ? `the ${round(total)} s duty cycle repeated from its start to the target runtime`
          : `the ${round(total)} s duty cycle cut at the target runtime`,
    );
  if (duty.basis === 'current') {
    periods = duty.periods.map((p) => ({ duration: p.duration, current: p.current }));
    if (input.targetRuntime !== undefined) {
      const total = periods.reduce((s, p) => s + p.duration, 0);
      periods = fitToRuntime(periods, input.targetRuntime);
      lengthStep(total, input.targetRuntime);
    }
    // Neighbouring equal periods joined: the worksheet and the energy are unchanged by it.
    periods = mergeEqualPeriods(periods);
    energyWh = periods.reduce((s, p) => s + (p.current * nominalVoltage * p.duration) / 3600, 0);
    for (const p of periods) largest = Math.max(largest, p.current);
  } else {
    // A cut-off above the preset's rated end voltage gives no credit (a smaller current): the preset's
    // capacity and Peukert exponent hold to its own end voltage only, and the file cannot say that a
    // string capacity is rated to another (cautions.ts, endVoltageCaution). So raising the cut-off
    // never makes the bank smaller; the caution asks for the maker's table.
    const ratedEnd = CHEMISTRY_PRESETS[preset.chemistry].endOfDischargeCellVoltage;
    const noCredit = endVoltageCaution(preset.chemistry, preset.endOfDischargeCellVoltage, ratedEnd) !== null;
    const basis = duty.voltage ?? (noCredit ? seriesCells * ratedEnd : minimumVoltage);
    voltageBasis = basis;
    step(
      'Voltage for power → current',
      voltageBasis,
      'V',
      duty.voltage !== undefined
        ? 'as given'
        : noCredit
          ? `${seriesCells} cells × ${ratedEnd} V/cell, the end voltage the capacities are rated to, not the higher cut-off (no credit for the higher cut-off: see the caution)`
          : 'minimum bank voltage (conservative: a constant-power load draws most current there)',
    );
    // One pass over the periods fitted to the runtime (forEachFitted visits what fitToRuntime gives,
    // a run of some thousand periods built no more): each one's current P ÷ V, neighbours of equal
    // current joined (the worksheet and the energy are unchanged by it), and the energy Σ P·t in the
    // periods' order.
    // Without the list (keepPeriods false, the energy method) only the energy and the largest current.
    const list = input.keepPeriods !== false || isLeadAcid(preset.chemistry) || preset.chemistry === 'nicd';
    const joined: CurrentPeriod[] = [];
    let wh = 0;
    const visit = (p: PowerPeriod, d: number) => {
      const current = p.power / basis;
      largest = Math.max(largest, current);
      if (list) {
        const last = joined[joined.length - 1];
        if (last !== undefined && last.current === current) last.duration += d;
        else joined.push({ duration: d, current });
      }
      wh += (p.power * d) / 3600;
    };
    if (input.targetRuntime !== undefined) {
      const total = duty.periods.reduce((s, p) => s + p.duration, 0);
      forEachFitted(duty.periods, input.targetRuntime, visit);
      lengthStep(total, input.targetRuntime);
    } else {
      for (const p of duty.periods) visit(p, p.duration);
    }
    periods = joined;
    energyWh = wh;
    if ((isLeadAcid(preset.chemistry) || preset.chemistry === 'nicd') && input.powerFactors !== undefined) {
      powerPeriods = input.targetRuntime !== undefined ? fitToRuntime(duty.periods, input.targetRuntime) : duty.periods.map((p) => ({ duration: p.duration, power: p.power }));
    }
  }
  const random = input.randomLoad;
  const randomCurrent = random === undefined ? 0 : 'current' in random ? random.current : random.power / voltageBasis;
  const peakCurrent = largest + randomCurrent;
  if (!(peakCurrent > 0)) {
    return {
      ok: false,
      problems: [problem('invalid-value', elementId, fields.dutyCycle, input.dutyCycle, 'the duty cycle draws no current: there is nothing to size')],
    };
  }
  step('Peak current', peakCurrent, 'A', random !== undefined ? 'largest period current + random load' : 'largest period current');

  const worksheet = isLeadAcid(preset.chemistry) || preset.chemistry === 'nicd';
  // The design: a backup design sizes lead-acid and NiCd to the end voltage only; an explicit
  // limitDepthOfDischarge decides it (and the basis then says the design it amounts to).
  const limitDoD = worksheet ? (input.limitDepthOfDischarge ?? depthOfDischargeApplies(preset.chemistry, input.design ?? 'backup')) : true;
  const design: BankDesign = worksheet ? (limitDoD ? 'cycling' : 'backup') : (input.design ?? 'backup');
  const powerTable = worksheet ? input.powerFactors : undefined;

  // 3. The method: the worksheet (lead-acid, NiCd) or the energy (lithium).
  const context: MethodContext = {
    ...checked.c,
    input,
    step,
    warnings,
    userSource,
    seriesCells,
    nominalVoltage,
    periods,
    powerPeriods,
    energyWh,
    randomCurrent,
    peakCurrent,
    limitDoD,
    powerTable,
  };
  const byMethod = worksheet ? sizeByWorksheet(context) : sizeByEnergy(context);
  if (!byMethod.ok) return byMethod;
  const { method, required, governing, sections, worksheetPeriods } = byMethod;

  // 4. Strings: whole modules of the user's block, or a standard rating, or continuous.
  const byModule = input.ratings === undefined && input.moduleAh !== undefined;
  const choice = byModule
    ? { strings: Math.max(1, Math.ceil((required / input.moduleAh!) * (1 - 1e-12))), perString: input.moduleAh! }
    : chooseStrings(required, input.ratings, maxStrings);
  if (choice === null) {
    const largest = Math.max(...input.ratings!);
    return {
      ok: false,
      problems: [
        problem(
          'no-feasible-bank',
          elementId,
          fields.ratings,
          input.ratings,
          `the bank needs ${round(required)} Ah, more than ${maxStrings} string(s) of the largest rating (${largest} Ah) give: add a larger rating or allow more strings`,
        ),
      ],
    };
  }
  step(
    'Strings in parallel',
    choice.strings,
    '',
    byModule
      ? `⌈${round(required)} Ah ÷ ${round(choice.perString)} Ah per module⌉: whole strings of your module`
      : input.ratings === undefined
        ? 'continuous size: one string'
        : `fewest strings (of at most ${maxStrings}) a standard rating can serve`,
  );
  step(
    'Capacity per string',
    choice.perString,
    'Ah',
    byModule ? 'your module, as given' : input.ratings === undefined ? 'continuous (not rounded)' : `next standard rating ≥ ${round(required / choice.strings)} Ah`,
  );
  if (byModule && choice.strings > DEFAULT_MAX_STRINGS) {
    warnings.push(`${choice.strings} strings in parallel share the current unevenly; a larger module (block or cell) needs fewer.`);
  }
  const bankCapacity = choice.strings * choice.perString;
  const bankEnergyWh = bankCapacity * nominalVoltage;
  step('Bank capacity', bankCapacity, 'Ah', `${choice.strings} × ${round(choice.perString)} Ah, rated at ${preset.ratedHours} h`);
  step('Bank energy (nominal)', bankEnergyWh, 'Wh', `${round(bankCapacity)} Ah × ${round(nominalVoltage)} V`);

  // One sentence says what sized the bank; the runtime study gives the same one (designBasis).
  const basis = designBasis(
    preset.chemistry,
    design,
    preset.endOfDischargeCellVoltage,
    userSource('endOfDischargeCellVoltage'),
    preset.usableDepthOfDischarge,
    userSource('usableDepthOfDischarge'),
  );
  const endCaution = endVoltageCaution(preset.chemistry, preset.endOfDischargeCellVoltage, CHEMISTRY_PRESETS[preset.chemistry].endOfDischargeCellVoltage);
  const cautions = [...bankCautions(preset.chemistry), basis, ...(endCaution ? [endCaution] : [])];
  const blockVolts = round(preset.nominalCellVoltage * cellsPerBlock);
  const summary =
    `${choice.strings} string${choice.strings > 1 ? 's' : ''} × ${round(choice.perString)} Ah = ${round(bankCapacity)} Ah, ${Number((bankEnergyWh / 1000).toPrecision(3))} kWh` +
    ` (each string ${seriesBlocks} × ${blockVolts} V ${cellsPerBlock > 1 ? 'blocks' : 'cells'} in series, ${round(nominalVoltage)} V)`;

  return {
    ok: true,
    sizing: {
      method,
      design,
      basis,
      summary,
      worksheetBasis: powerTable !== undefined ? 'power-per-cell' : 'current',
      chemistry: preset.chemistry,
      seriesCells,
      cellsPerBlock,
      seriesBlocks,
      strings: choice.strings,
      capacityPerString: choice.perString,
      bankCapacity,
      bankEnergyWh,
      usableEnergyWh: bankEnergyWh * preset.usableDepthOfDischarge,
      nominalVoltage,
      minimumVoltage,
      requiredCapacity: required,
      governing,
      peakCurrent,
      periods: worksheetPeriods,
      sections,
      steps,
      warnings,
      cautions,
    },
  };
}
