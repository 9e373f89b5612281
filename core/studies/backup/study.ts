/**
 * The battery backup study of a project: the discharge through the chain (discharge.ts), then —
 * when the project's `backup` settings ask for them — the bank sizing for the target runtime
 * (sizing.ts) in whole strings of the user's module (the bank's block or cell as given), with the
 * runtime of that bank from a second discharge through the same chain, and the recharge with the given charger and the charger for a target time
 * (recharge.ts). Pure; returns plain data.
 */
import type { BackupStudy, BatterySource } from '../../model/project.ts';
import { PROJECT_LEVEL, type Problem } from '../../model/errors.ts';
import type { Solved } from '../../solve/index.ts';
import type { VariantChange } from '../../solve/variant.ts';
import { outageSolve } from '../../solve/modes.ts';
import { dischargeVariant, simulateDischarge, type DischargeResult } from './discharge.ts';
import { MAX_REPEATED_PERIODS, repeatedPeriods, sizeBank, type BankSizing, type PowerPeriod } from './sizing.ts';
import { MAX_HORIZON_H, count } from '../../solve/load-profile.ts';
import { chargerForTargetTime, rechargeTime, type ChargerSizing, type Recharge } from './recharge.ts';
import { restrungExact } from '../../variants/bank-resistance.ts';

export interface BackupStudyResult {
  /**
   * 'battery' when the bank sits on a bus: the study ran in the on-battery mode (the supply branch
   * cut, the bank the root, core/solve/modes.ts). Absent when the bank is the chain's own source.
   */
  mode?: 'battery';
  discharge: DischargeResult;
  /** Smallest bank for `backup.targetRuntimeHours` over the same terminal power profile. */
  sizing?: BankSizing;
  /**
   * The discharge re-run with the sized bank (same chain, profile, temperature and state of
   * health): the runtime of the bank the sizing gives.
   */
  sizedDischarge?: DischargeResult;
  /** Recharge from the end state with `backup.chargerCurrent`. */
  recharge?: Recharge;
  /** Charger needed to recharge within `backup.targetRechargeHours`. */
  charger?: ChargerSizing;
  /** How the terminal power profile given to the sizing was taken. */
  sizingBasis?: string;
}

export type BackupStudyOutcome = { ok: true; study: BackupStudyResult } | { ok: false; problems: Problem[] };

/**
 * The terminal power over the simulated outage as periods of constant power (each step's power
 * held over the step; equal neighbours merged).
 */
export function terminalPowerPeriods(d: DischargeResult): PowerPeriod[] {
  const { time, power } = d.series;
  const out: PowerPeriod[] = [];
  for (let i = 0; i + 1 < time.length; i++) {
    const duration = time[i + 1]! - time[i]!;
    if (duration <= 0) continue;
    const p = power[i]!;
    const last = out[out.length - 1];
    if (last && Math.abs(last.power - p) <= 1e-9 * Math.max(Math.abs(p), 1)) last.duration += duration;
    else out.push({ duration, power: p });
  }
  return out;
}

/**
 * The change that makes the bank too large to run out within `hours` (same R, same start): a
 * million times its capacity, at least 1e9 Ah, at full health (a bank entered at a state of health
 * near 0 would otherwise still run out at once). Checked and applied by core/solve/variant.ts.
 */
function endlessBank(battery: BatterySource, study: BackupStudy, internalResistance: number, hours: number): VariantChange {
  const { stateOfHealth: _soh, ...backup } = study;
  return {
    backup: { ...backup, horizonHours: hours },
    replace: [{ ...battery, internalResistance, bank: { ...battery.bank!, capacityAh: Math.max(battery.bank!.capacityAh * 1e6, 1e9) } }],
  };
}

/** The change that puts the sized bank in place of the given one (same module, the sized strings). */
function sizedBank(battery: BatterySource, study: BackupStudy, sizing: BankSizing, target: number): VariantChange {
  // A bank resistance given for the whole bank follows the re-stringing: × series, ÷ strings (series and
  // parallel resistors; core/variants/bank-resistance.ts, shared with the search and the quick variants).
  const r = battery.internalResistance === undefined
    ? {}
    : { internalResistance: restrungExact(battery.internalResistance, battery.bank!, { series: sizing.seriesBlocks, strings: sizing.strings }) };
  return {
    // Long enough to see the sized bank run out (it is sized with margins beyond the target), within
    // the year a study runs at most.
    backup: { ...study, horizonHours: Math.min(Math.max(study.horizonHours ?? 0, 4 * target), MAX_HORIZON_H) },
    replace: [{ ...battery, ...r, bank: { ...battery.bank!, series: sizing.seriesBlocks, strings: sizing.strings, capacityAh: sizing.capacityPerString } }],
  };
}

/**
 * The run the sizing reads is far shorter than the target runtime (or holds no time at all), so
 * repeated to the target it would pass MAX_REPEATED_PERIODS: refused at the setting that cut it short.
 */
function tooShortForTarget(run: DischargeResult, study: BackupStudy): Problem {
  const lasted = `the outage the study simulates lasts ${Number((run.runtimeSeconds / 3600).toPrecision(3))} h`;
  // (a run of no time at all gives no periods to repeat: the same refusal)
  const repeat = `repeated to the target runtime of ${study.targetRuntimeHours} h it would give more than ${count(MAX_REPEATED_PERIODS)} periods`;
  const at = (field: string, value: unknown, what: string, fix: string): Problem => ({ code: 'invalid-value', elementId: PROJECT_LEVEL, field, value, message: `${lasted} (${what}); ${repeat}: ${fix}` });
  if (run.endReason === 'horizon') return at('backup.horizonHours', study.horizonHours, 'the horizon', 'give a horizon at least as long as the target runtime');
  if (run.endReason === 'profile-complete') return at('backup.profile', study.profile.kind, 'the profile, run once', 'give a profile as long as the target runtime, or let it repeat');
  return at('backup.targetRuntimeHours', study.targetRuntimeHours, run.endText, 'check the bank and the chain, or give a shorter target runtime');
}

/**
 * Which parts of the study run (default all): the runtime spread (core/studies/spread/) reads only
 * the runtime and the sizing of each sample, so it leaves out the run of the sized bank and the recharge.
 */
export interface StudyParts {
  /** The discharge again with the sized bank (`sizedDischarge`). */
  sizedRun?: boolean;
  /** The recharge and the charger for the target recharge time. */
  recharge?: boolean;
  /**
   * false: the discharges keep only the series the sizing reads (time and terminal power; soc,
   * voltage and current empty): no plot. The figures are the same.
   */
  plotSeries?: boolean;
  /**
   * false: the sizing lists no periods (`sizing.periods` empty for the energy method: lithium; the
   * worksheet sizes from its periods and keeps them). The figures are the same.
   */
  sizingPeriods?: boolean;
}

/**
 * Run the whole study on a solved project (never validated or solved again; the larger and the sized
 * bank are variants of it, core/solve/variant.ts). Never throws on bad input.
 */
export function runBackupStudy(input: Solved, parts: StudyParts = {}): BackupStudyOutcome {
  // A bank on a bus: the outage is the on-battery mode, a variant of the solved project.
  const outage = outageSolve(input);
  if (!outage.ok) return outage;
  const solved = outage.solved;
  const keep = parts.plotSeries === false ? { plotSeries: false } : {};
  const simulated = simulateDischarge(solved, keep);
  if (!simulated.ok) return simulated;
  const d = simulated.result;
  // simulateDischarge has checked that the project has a study and a battery bank.
  const study = solved.project.backup!;
  const battery = solved.project.elements.find((e): e is BatterySource => e.id === d.batteryId && e.kind === 'battery')!;
  const spec = battery.bank!;
  const result: BackupStudyResult = { ...(outage.onBattery ? { mode: 'battery' as const } : {}), discharge: d };
  const problems: Problem[] = [];

  if (study.targetRuntimeHours !== undefined) {
    const target = study.targetRuntimeHours * 3600;
    let periods = terminalPowerPeriods(d);
    let run = d;
    result.sizingBasis = 'terminal power of the simulated outage, step by step, cut at the target runtime';
    if (d.runtimeSeconds < target && !d.runtimeIsLowerBound) {
      // The bank ran out before the target: the profile must go on to the target for the sizing. Run
      // it again from a bank too large to run out (same internal resistance, same starting charge),
      // so a daily profile carries on through its next hours instead of restarting.
      const extended = dischargeVariant(solved, endlessBank(battery, study, d.bank.internalResistance, study.targetRuntimeHours), keep);
      if (!extended.ok) return extended;
      periods = terminalPowerPeriods(extended.result);
      run = extended.result;
      result.sizingBasis =
        'terminal power of the profile over the whole target runtime, from a run with a bank too large to run out (its voltage stays near full charge, so cable losses late in a real discharge are slightly understated)';
    }
    // The run is cut or repeated to the target runtime for the sizing: a run far shorter than the
    // target (a horizon of seconds) would repeat into more periods than any run holds.
    if (periods.length === 0 || repeatedPeriods(periods, target) > MAX_REPEATED_PERIODS) return { ok: false, problems: [tooShortForTarget(run, study)] };
    const sized = sizeBank({
      elementId: d.batteryId,
      chemistry: spec.chemistry,
      ...(spec.overrides ? { overrides: spec.overrides } : {}),
      busVoltage: d.bank.nominalVoltage,
      dutyCycle: { basis: 'power', periods },
      design: study.design ?? 'backup',
      // Whole strings of the user's module, unless standard capacities are listed to pick from.
      ...(study.standardCapacitiesAh ? {} : { moduleAh: spec.capacityAh }),
      targetRuntime: study.targetRuntimeHours * 3600,
      ...(study.designMargin !== undefined ? { designMargin: study.designMargin } : {}),
      ...(study.agingFactor !== undefined ? { agingFactor: study.agingFactor } : {}),
      temperature: d.temperatureC,
      ...(study.standardCapacitiesAh ? { ratings: study.standardCapacitiesAh } : {}),
      ...(spec.cellsPerBlock !== undefined ? { cellsPerBlock: spec.cellsPerBlock } : {}),
      seriesBlocks: spec.series,
      ...(parts.sizingPeriods === false ? { keepPeriods: false } : {}),
      fields: { designMargin: 'backup.designMargin', agingFactor: 'backup.agingFactor', targetRuntime: 'backup.targetRuntimeHours', ratings: 'backup.standardCapacitiesAh', temperature: 'backup.temperatureC', design: 'backup.design' },
    });
    if (sized.ok) {
      result.sizing = sized.sizing;
      if (parts.sizedRun !== false) {
        const again = dischargeVariant(solved, sizedBank(battery, study, sized.sizing, study.targetRuntimeHours));
        if (again.ok) result.sizedDischarge = again.result;
        else problems.push(...again.problems);
      }
    } else problems.push(...sized.problems);
  }

  if (parts.recharge === false) return problems.length ? { ok: false, problems } : { ok: true, study: result };
  // The loads go on while the bank recharges: the charger carries them (average terminal power of the outage).
  const standing = d.runtimeSeconds > 0 ? d.deliveredWh / (d.runtimeSeconds / 3600) : 0;
  const base = {
    elementId: d.batteryId,
    chemistry: spec.chemistry,
    ...(spec.overrides ? { overrides: spec.overrides } : {}),
    capacity: d.bank.capacityAh,
    seriesCells: d.bank.cellsInSeries,
    startSoc: d.endSoc,
    ...(study.chargerEfficiency !== undefined ? { chargerEfficiency: study.chargerEfficiency } : {}),
    standingLoad: { power: standing },
    temperature: d.temperatureC,
    fields: { chargerCurrent: 'backup.chargerCurrent', chargerEfficiency: 'backup.chargerEfficiency', targetTime: 'backup.targetRechargeHours', temperature: 'backup.temperatureC' },
  };
  if (study.chargerCurrent !== undefined) {
    const r = rechargeTime({ ...base, chargerCurrent: study.chargerCurrent });
    if (r.ok) result.recharge = r.recharge;
    else problems.push(...r.problems);
  }
  if (study.targetRechargeHours !== undefined) {
    const r = chargerForTargetTime({ ...base, targetTime: study.targetRechargeHours * 3600 });
    if (r.ok) result.charger = r.charger;
    else problems.push(...r.problems);
  }
  return problems.length ? { ok: false, problems } : { ok: true, study: result };
}
