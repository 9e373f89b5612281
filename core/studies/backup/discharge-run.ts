/**
 * The discharge run itself: the battery bank through the chain, over the load profile of the project's
 * `backup` study.
 *
 * Method: explicit time integration. At each step the chain is solved with the bank as its source
 * at the present open-circuit voltage OCV(SoC)·cells behind its internal resistance
 * (core/solve/repeat.ts: exact, the same sweep as the static solve), so a constant-power chain
 * draws more current as the terminal voltage sags with state of charge and I·R. The current is
 * held over the step (the step ends early at every load change, so switching is exact).
 *
 * Rate-dependent capacity, Peukert's law in its rated-capacity form t = H·(C/(I·H))^k (C rated Ah
 * at the H-hour rate, k the exponent), integrated as a Peukert-equivalent charge
 *   dQ_eq = I·max(1, I/I_rated)^(k−1)·dt,  I_rated = C/H,
 * so a constant current above I_rated empties the bank in exactly H·(C/(I·H))^k. Below the rated
 * current the rated capacity is taken (no credit for light loads: conservative, common practice).
 * Available capacity C_avail = C × temperature factor × state of health; SoC = SoC_0 − Q_eq/C_avail.
 *
 * End of discharge, whichever comes first:
 * - depth of discharge: SoC reaches 1 − usable DoD (found exactly inside the step) — lithium, and
 *   lead-acid / NiCd in a cycling design only; a backup design (the default) discharges lead-acid
 *   and NiCd to the end voltage as IEEE 485 / IEEE 1115 size standby cells, so there the SoC limit
 *   is 0: the rated capacity at the Peukert rate is the charge the cells give to their end voltage
 *   (end reason 'rated-capacity');
 * - cut-off voltage: the terminal voltage under load falls below end-of-discharge V/cell × cells in
 *   series (found between two steps by linear interpolation of the terminal voltage);
 * - the chain cannot be carried any more (voltage collapse on a link);
 * - the profile ends (a `segments` profile run once) or the horizon is reached: the runtime is
 *   then "longer than" that time, never Infinity.
 * The time loop itself is discharge-steps.ts; this file sets it up and assembles the result.
 */
import { TYPICAL_VALUE, bankCautions, depthOfDischargeApplies, designBasis, endVoltageCaution, type BankDesign } from './cautions.ts';
import { CHEMISTRY_PRESETS } from '../../data/battery-chemistries.ts';
import type { BackupStudy, BatterySource, Element, Project } from '../../model/project.ts';
import type { ElementResult, SolveResult } from '../../model/result.ts';
import { PROJECT_LEVEL, type Problem } from '../../model/errors.ts';
import { prepareRepeat } from '../../solve/repeat.ts';
import type { PlannedElement } from '../../solve/plan.ts';
import { idleDraw } from '../../solve/idle.ts';
import { type Bank, capacityFactorAt, resolveBank } from '../../physics/bank.ts';
import { DEFAULT_HORIZON_H, DEFAULT_TIME_STEP_S, MAX_WHOLE_CHAIN_WORK, buildTimeline, count } from '../../solve/load-profile.ts';
import { END_TEXT, type DischargeOutcome, type Derate, type IdleDraw } from './discharge-types.ts';
import { CHAIN, CHARGE, DRAWN, EQUIVALENT, INTERNAL, LOAD, MIN_V, PEAK, SOC, T, TERMINAL, integrateSteps } from './discharge-steps.ts';
import { figure, sigText } from '../../model/message.ts';

const H = 3600;

/**
 * What each stage draws with nothing connected to its output: its input power at zero output,
 * from its own model (a converter's standby loss, a bus's fixed loss, a transformer's core loss,
 * whatever loss model or preset it was given). Reads the chain as the discharge planned it.
 */
function noLoadDraws(order: readonly PlannedElement[]): Omit<IdleDraw, 'energyWh'>[] {
  // No current flows at zero output: any non-zero voltage gives the same answer (idleDraw's default).
  return order
    .filter((n) => n.role === 'stage')
    .map((n) => ({ id: n.element.id, name: n.element.name ?? n.element.id, watts: idleDraw(n.model) }))
    .filter((d) => d.watts > 0);
}

/**
 * Cables given a conductor spec: hold the size, parallel sets and resistance the nominal solve chose
 * (start of the outage) fixed during the discharge, as an explicit impedance.
 */
function holdConductors(project: Project, elements: readonly ElementResult[]): Project {
  const chosen = new Map(elements.filter((e) => e.conductor).map((e) => [e.id, e.conductor!]));
  if (chosen.size === 0) return project;
  return {
    ...project,
    elements: project.elements.map((e): Element => {
      const cond = chosen.get(e.id);
      if (!cond || e.kind !== 'cable') return e;
      const { conductor: _spec, ...rest } = e;
      return { ...rest, resistancePerKm: cond.resistance.perKm, reactancePerKm: cond.reactancePerKm, parallelSets: cond.parallelSets };
    }),
  };
}

export const hasConductorSpecs = (project: Project): boolean => project.elements.some((e) => e.kind === 'cable' && e.conductor);

/** What a run keeps beyond its figures (default all). */
export interface DischargeKeep {
  /**
   * false: the series keeps only time and terminal power (what the sizing reads, terminalPowerPeriods);
   * soc, voltage and current stay empty. The runtime spread keeps no plot of a sample.
   */
  plotSeries?: boolean;
}

/** One run of the discharge (see the header); `nominal` is the solve whose conductor sizes are held. */
export function runDischarge(project: Project, study: BackupStudy, source: BatterySource, nominal: SolveResult | undefined, keep: DischargeKeep = {}): DischargeOutcome {
  // Cables with a conductor spec take their size and resistance from the nominal solve (the solved
  // value's result, or the variant's own solve).
  const fixed = hasConductorSpecs(project) && nominal ? holdConductors(project, nominal.elements) : project;
  const prepared = prepareRepeat(fixed);
  if (!prepared.ok) return { ok: false, problems: prepared.problems.map((p) => startProblem(p, source.id)) };
  const solver = prepared.solver;
  const bank = resolveBank(source.bank!, source.internalResistance);
  const v = bank.values;
  const timeline = buildTimeline(project, study);
  if (timeline.refused) return { ok: false, problems: [timeline.refused] };
  // Load values in the solver's order for each state of the timeline.
  const pos = new Map(timeline.loads.map((l, i) => [l.id, i]));
  const stateIds: number[] = [];
  for (const values of timeline.states) {
    const ordered = solver.loadIds.map((id) => values[pos.get(id)!]!);
    const r = solver.prepare(ordered);
    if (!r.ok) return { ok: false, problems: r.problems.map((p) => startProblem(p, source.id)) };
    stateIds.push(r.state);
  }

  const step = study.timeStepSeconds ?? DEFAULT_TIME_STEP_S;
  if (!solver.fast) {
    // Every step sweeps the whole chain: bound steps × elements (MAX_WHOLE_CHAIN_WORK).
    const steps = Math.ceil(((study.horizonHours ?? DEFAULT_HORIZON_H) * 3600) / step);
    const work = steps * fixed.elements.length;
    if (work > MAX_WHOLE_CHAIN_WORK) {
      const longest = Math.ceil(((study.horizonHours ?? DEFAULT_HORIZON_H) * 3600 * fixed.elements.length) / MAX_WHOLE_CHAIN_WORK);
      return {
        ok: false,
        problems: [
          {
            code: 'invalid-value',
            elementId: PROJECT_LEVEL,
            field: 'backup.timeStepSeconds',
            value: step,
            message: `this chain must be solved whole at every step (a load whose draw follows the bank voltage, given by its current or as a circuit, sits on the cables next to the bank), and ${count(steps)} steps × ${fixed.elements.length} elements passes the study's limit of ${count(MAX_WHOLE_CHAIN_WORK)} element solves: use a time step of at least ${longest} s or a shorter horizon`,
          },
        ],
      };
    }
  }
  const temperatureC = study.temperatureC ?? 25;
  const temp = capacityFactorAt(v.capacityVsTemperature, temperatureC);
  if (temp.refused !== undefined) {
    return { ok: false, problems: [{ code: 'outside-table', elementId: PROJECT_LEVEL, field: 'backup.temperatureC', value: temperatureC, message: temp.refused }] };
  }
  const design: BankDesign = study.design ?? 'backup';
  const dodApplies = depthOfDischargeApplies(bank.chemistry, design);
  const soh = study.stateOfHealth ?? 1;
  const availableAs = bank.capacityAh * temp.factor * soh * H; // A·s
  const k = v.peukertExponent;
  const iRated = bank.ratedCurrent;
  const socLimit = dodApplies ? 1 - v.usableDepthOfDischarge : 0;
  if (bank.initialSoc <= socLimit) {
    return {
      ok: false,
      problems: [
        {
          code: 'invalid-value',
          elementId: source.id,
          field: 'bank.initialSoc',
          value: bank.initialSoc,
          message: `starts at or below the usable depth-of-discharge limit of this ${design} design (state of charge ${socLimit.toFixed(2)}); nothing could be drawn`,
        },
      ],
    };
  }
  const R = bank.internalResistance;
  const cutoff = bank.cutoffVoltage;

  // The time loop (discharge-steps.ts), then its totals read once for the result.
  const steps = integrateSteps({
    solver,
    bank,
    intervals: timeline.intervals,
    stateIds,
    step,
    resistance: R,
    cutoff,
    availableAs,
    k,
    iRated,
    socLimit,
    dodApplies,
    plotSeries: keep.plotSeries !== false,
    noEnd: timeline.profileEnds ? 'profile-complete' : 'horizon',
  });
  if (!steps.ok) return { ok: false, problems: [cannotCarry(source.id, bank, steps.why)] };
  const { endReason, series } = steps;
  const a = steps.acc;
  const acc = {
    t: a[T]!,
    soc: a[SOC]!,
    charge: a[CHARGE]!,
    equivalent: a[EQUIVALENT]!,
    terminal: a[TERMINAL]!,
    drawn: a[DRAWN]!,
    load: a[LOAD]!,
    chain: a[CHAIN]!,
    internal: a[INTERNAL]!,
    peak: a[PEAK]!,
    minV: a[MIN_V]!,
  };

  const runtime = acc.t;
  const peukertFactor = acc.charge > 0 ? acc.equivalent / acc.charge : 1;
  if (acc.peak > bank.maxDischargeCurrent * (1 + 1e-9)) {
    return {
      ok: false,
      problems: [
        {
          code: 'invalid-value',
          elementId: source.id,
          field: source.bank!.strings === undefined ? 'bank.capacityAh' : 'bank.strings',
          value: acc.peak,
          message: `the peak current ${acc.peak.toFixed(1)} A is above the ${bank.label} limit of ${v.maxDischargeCRate} C = ${bank.maxDischargeCurrent.toFixed(1)} A (${bank.overridden.includes('maxDischargeCRate') ? 'maker\u2019s figure, as given' : TYPICAL_VALUE}) for this bank (${bank.capacityAh} Ah); add strings or a larger capacity, or give the maker\u2019s maximum discharge rate`,
        },
      ],
    };
  }
  const idle: IdleDraw[] = noLoadDraws(solver.order).map((d) => ({ ...d, energyWh: (d.watts * runtime) / H }));
  const averageLoadW = runtime > 0 ? acc.load / runtime : 0;
  const warnings: string[] = [];
  if (temp.extrapolated) {
    const t = v.capacityVsTemperature;
    warnings.push(
      `${sigText(temperatureC, 3)} °C is outside the capacity-vs-temperature table (${t[0]!.temperatureC} to ${t[t.length - 1]!.temperatureC} °C): the capacity factor ${temp.factor.toFixed(3)} is extrapolated linearly along the table\u2019s end slope, never above its end value; use the maker\u2019s figure for this temperature`,
    );
  }
  if (!solver.fast) warnings.push('an element between the bank and the first converter is neither a cable nor a DC bus: the whole chain was re-solved at every step');
  const from = (k: keyof typeof v) => (bank.overridden.includes(k) ? 'maker\u2019s figure, as given' : TYPICAL_VALUE);
  const leadAcid = bank.chemistry === 'flooded-lead-acid' || bank.chemistry === 'vrla-agm' || bank.chemistry === 'gel';
  const temperatureSource = bank.overridden.includes('capacityVsTemperature')
    ? 'maker\u2019s figure, as given'
    : leadAcid
      ? '1 ÷ the IEEE 485 Table 1 factor, 1.00 above 25 °C as the note to Table 1 advises'
      : TYPICAL_VALUE;
  const basis = designBasis(bank.chemistry, design, v.endOfDischargeCellVoltage, from('endOfDischargeCellVoltage'), v.usableDepthOfDischarge, from('usableDepthOfDischarge'));
  const endCaution = endVoltageCaution(bank.chemistry, v.endOfDischargeCellVoltage, CHEMISTRY_PRESETS[bank.chemistry].endOfDischargeCellVoltage);
  const cautions = [...bankCautions(bank.chemistry), basis, ...(endCaution ? [endCaution] : [])];
  if (v.minChargeTemperatureC >= 0 && temperatureC < v.minChargeTemperatureC) {
    cautions.push(`At ${sigText(temperatureC, 3)} °C this ${bank.label} bank must not be charged (minimum ${v.minChargeTemperatureC} °C); warm it first.`);
  }
  const loadW = averageLoadW;
  const derates: Derate[] = [
    { label: 'nameplate energy', value: bank.nominalWh, unit: 'Wh', note: `${bank.nominalVoltage.toFixed(1)} V nominal × ${bank.capacityAh} Ah (C${v.ratedHours})` },
    { label: 'simple estimate Wh ÷ W', value: loadW > 0 ? bank.nominalWh / loadW : 0, unit: 'h', note: `nameplate Wh ÷ average load ${figure(loadW, 1)} W` },
    dodApplies
      ? { label: 'usable depth of discharge', value: v.usableDepthOfDischarge, unit: '', note: `the discharge stops at ${(socLimit * 100).toFixed(0)} % state of charge (${from('usableDepthOfDischarge')})` }
      : { label: 'end-of-discharge voltage per cell', value: v.endOfDischargeCellVoltage, unit: 'V', note: `backup design: discharged to the end voltage, no depth-of-discharge limit (${from('endOfDischargeCellVoltage')})` },
    { label: 'temperature', value: temp.factor, unit: '', note: `capacity at ${sigText(temperatureC, 3)} °C vs 25 °C (${temperatureSource})${temp.extrapolated ? '; outside the table: extrapolated along its end slope, never above its end value' : ''}` },
    { label: 'aging (state of health)', value: soh, unit: '', note: 'capacity left after aging' },
    {
      label: 'Peukert at the actual rate',
      value: 1 / peukertFactor,
      unit: '',
      note: `k = ${k} (${from('peukertExponent')}), rated current ${figure(iRated, 1)} A (C/${v.ratedHours}), average current ${figure(runtime > 0 ? acc.charge / runtime : 0, 1)} A`,
    },
    { label: 'chain losses (cables, bus, converters)', value: acc.chain / H, unit: 'Wh', note: 'drawn from the bank but not used by the loads' },
    { label: 'bank internal I²R', value: acc.internal / H, unit: 'Wh', note: `internal resistance ${(R * 1000).toFixed(2)} mΩ (${source.internalResistance !== undefined ? 'as given' : from('internalResistanceOhmAh')})` },
    ...idle.map((d): Derate => ({ label: `standby draw of ${d.name}`, value: d.energyWh, unit: 'Wh', note: `${d.watts.toFixed(1)} W over the runtime (part of the chain losses)` })),
  ];
  return {
    ok: true,
    result: {
      batteryId: source.id,
      bank,
      runtimeSeconds: runtime,
      runtimeIsLowerBound: endReason === 'horizon' || endReason === 'profile-complete',
      endReason,
      endText: END_TEXT[endReason],
      deliveredAh: acc.charge / H,
      deliveredWh: acc.terminal / H,
      drawnWh: acc.drawn / H,
      loadWh: acc.load / H,
      chainLossWh: acc.chain / H,
      internalLossWh: acc.internal / H,
      equivalentAh: acc.equivalent / H,
      startSoc: bank.initialSoc,
      endSoc: acc.soc,
      peakCurrent: acc.peak,
      minVoltage: Number.isFinite(acc.minV) ? acc.minV : bank.initialOcv,
      cutoffVoltage: cutoff,
      socLimit,
      design,
      basis,
      temperatureC,
      temperatureFactor: temp.factor,
      temperatureExtrapolated: temp.extrapolated,
      stateOfHealth: soh,
      availableAh: availableAs / H,
      peukertFactor,
      averageLoadW,
      idle,
      derates,
      series,
      timeStepSeconds: step,
      fastPath: solver.fast,
      warnings,
      cautions,
    },
  };
}

function cannotCarry(batteryId: string, bank: Bank, why: string): Problem {
  return {
    code: 'infeasible-load',
    elementId: batteryId,
    field: 'bank',
    value: bank.capacityAh,
    message: `${why}; the bank (${bank.cellsInSeries} cells in series × ${bank.strings} string(s), ${bank.capacityAh} Ah) cannot deliver the peak current — add strings, a larger capacity or a higher voltage`,
  };
}

/** A problem of the nominal (start-of-outage) solve, restated for the bank when the chain collapses. */
export function startProblem(p: Problem, batteryId: string): Problem {
  if (p.code !== 'infeasible-load' || p.elementId !== batteryId) return p;
  return { ...p, field: 'bank', message: `${p.message} (the bank cannot deliver the peak current: add strings or a larger capacity)` };
}
