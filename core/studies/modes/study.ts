/**
 * The modes study of a project with a bank on a bus (core/solve/modes.ts): both modes side by side,
 * the rectifier (charger) sizing for the job, the cost of standing by, and the transfer.
 *
 * Methods:
 * - Energy balance per mode: the solve's own (source power = loads + losses, core/solve/report.ts).
 * - Charger sizing, IEEE Std 946 (DC auxiliary power systems) charger output: A = L + k·C/H, with
 *   L the continuous load on the bus (the bus's input current on float less the bank's float current),
 *   C the charge to put back (Ah: `standby.rechargeAh`, else the charge the backup study's outage drew
 *   from the bank when the project has a backup study, else the bank's rated capacity), H the target
 *   recharge time (h, default 8 h: common practice) and k the charge-return factor of the chemistry
 *   (core/data/standby-charge.ts; 1.1 lead-acid from memory). Modules: n = ⌈A ÷ module⌉, plus one for
 *   N+1 redundancy. The recharge case (the bank drawing k·C/H) is solved as a variant; the supply
 *   current and the supply-side cable sizes are that case's (the worst case, not the float case).
 * - Standing losses on supply: every loss of the on-supply solve (conversion, idle, cables, transfer
 *   switches (contact I²R and control power, core/kinds/transfer-switch.ts), the source's own) plus the
 *   bank's float power, held for the hours the supply is on per year
 *   (8760 − outage hours): E = P·t, cost = E in kWh × price (core/studies/economics.ts's method).
 * - On supply with an inverter-charger passing the supply through (core/solve/modes.ts): the on-supply
 *   solve is that variant (its relay feeds the loads from the charger's feed; the inverter stays on the
 *   bus at its idle draw); a warning when the loads' current through the relay exceeds the limit.
 * - Transfer: the bank on float holds the EMF E_f = V_float − I_float·R (its terminal voltage on
 *   supply less the float current's drop in its internal resistance R, Thévenin model); the moment
 *   the supply is cut it carries the bus from that EMF: the on-battery chain solved with a bank of
 *   EMF E_f behind R gives the bank current and the bus voltage at transfer; the current step is
 *   that current plus the float current it was taking. The on-battery mode itself (the bank at its
 *   open-circuit voltage at the initial state of charge) gives the settled figures.
 */
import type { BatterySource, Element } from '../../model/project.ts';
import type { ElementResult, SolveResult } from '../../model/result.ts';
import { formatProblem, type Problem } from '../../model/errors.ts';
import { say, q, sigText, type Worded } from '../../model/message.ts';
import { resolveBank } from '../../physics/bank.ts';
import { STANDBY_CHARGE } from '../../data/standby-charge.ts';
import type { Solved } from '../../solve/solved.ts';
import { solveVariant } from '../../solve/variant.ts';
import { chargerOf, onBatteryChange, rechargeChange, solveModes, unusedPassThrough, type Modes } from '../../solve/modes.ts';
import { HOURS_IN_YEAR, costSettingsOfSolved } from '../economics.ts';
import { PLANNING_CAUTION, TYPICAL_VALUE } from '../backup/cautions.ts';
import { simulateDischarge } from '../backup/discharge.ts';
import { batteryPathWarnings, switchWorking } from './switches.ts';
import { cablesAcrossModes } from './cables.ts';

/** Target recharge time when none is given, h (common practice: 8–12 h for a standby lead-acid plant). */
export const DEFAULT_RECHARGE_HOURS = 8;

export type { ModeName, ModeFigures, RectifierSizing, CableSize, StandingLosses, Transfer, PassThroughWorking, ModesStudyResult, ModesStudyOutcome, ModesStudyOptions } from './types.ts';
import type { ModeName, ModeFigures, RectifierSizing, CableSize, StandingLosses, Transfer, PassThroughWorking, ModesStudyResult, ModesStudyOutcome, ModesStudyOptions } from './types.ts';


const figuresOf = (mode: ModeName, r: SolveResult): ModeFigures => {
  const src = r.elements[0]!;
  return { mode, sourceId: src.id, sourceName: src.name, sourcePower: r.totals.sourcePower, loadPower: r.totals.loadPower, losses: r.totals.losses, balanceError: r.totals.balanceError, efficiency: r.totals.efficiency };
};

const byId = (r: SolveResult): Map<string, ElementResult> => new Map(r.elements.map((e) => [e.id, e]));

/** Hours in a common year, less the outage hours (the supply is on the rest). */
const hoursOnSupply = (outage: number): number => Math.max(0, HOURS_IN_YEAR - outage);


/**
 * The modes study of a solved project: null when the project has no bank on a bus. Never validates or
 * solves the base case again; the on-battery, recharge and transfer chains are variants.
 */
export function runModesStudy(solved: Solved, modes: Modes | null = solveModes(solved), options: ModesStudyOptions = {}): ModesStudyOutcome {
  if (!modes) return null;
  const { place } = modes;
  const project = solved.project;
  const settings = project.standby ?? {};
  // The price the cost of the losses uses (a night price gives the day's mean, weighted by the load
  // profile's day when the project splits them so: economics.ts costSettingsOfSolved).
  const price = costSettingsOfSolved(solved)?.pricePerKWh;
  // On supply: the file as drawn, or the variant in which an inverter-charger passes the supply through.
  const supply = modes.supply.result;
  const el = byId(supply);
  const bankEl = project.elements.find((e): e is BatterySource => e.id === place.bankId && e.kind === 'battery')!;
  const spec = bankEl.bank!;
  const bank = resolveBank(spec, bankEl.internalResistance);
  const warnings: Worded[] = [];
  const problems: Problem[] = [];

  // ---- charger sizing (IEEE 946: A = L + k·C/H) ----
  const bankRes = el.get(place.bankId)!;
  const busRes = el.get(place.busId)!;
  const floatCurrent = bankRes.input!.current;
  const loadCurrent = Math.max(0, busRes.input!.current - floatCurrent);
  const chemistry = STANDBY_CHARGE[spec.chemistry];
  const k = settings.chargeReturnFactor ?? chemistry.chargeReturnFactor;
  // C: the user's figure; else the charge the outage of the backup study drew from the bank (its
  // discharge on battery: Ah out of the terminals over the study), when the project has one; else the
  // bank's rated capacity (a full discharge).
  let drawnAh = options.dischargeAh;
  if (settings.rechargeAh === undefined && drawnAh === undefined && project.backup !== undefined && modes.battery.ok) {
    const d = simulateDischarge(modes.battery);
    if (d.ok) drawnAh = d.result.deliveredAh;
  }
  const rechargeAhFrom: RectifierSizing['rechargeAhFrom'] = settings.rechargeAh !== undefined ? 'given' : drawnAh !== undefined && project.backup !== undefined ? 'backup study' : 'bank capacity';
  const rechargeAh = rechargeAhFrom === 'given' ? settings.rechargeAh! : rechargeAhFrom === 'backup study' ? drawnAh! : bank.capacityAh;
  const H = settings.targetRechargeHours ?? DEFAULT_RECHARGE_HOURS;
  const rechargeCurrent = (k * rechargeAh) / H;
  const required = loadCurrent + rechargeCurrent;
  const charger = chargerOf(project.elements, place.busId);
  const redundancy = settings.redundancy ?? 'n+1';
  let modules: RectifierSizing['modules'];
  if (settings.moduleCurrent !== undefined && settings.moduleCurrent > 0) {
    const needed = Math.max(1, Math.ceil(required / settings.moduleCurrent - 1e-9));
    const installed = needed + (redundancy === 'n+1' ? 1 : 0);
    modules = { moduleCurrent: settings.moduleCurrent, needed, installed, redundancy, installedCurrent: installed * settings.moduleCurrent };
  }
  if (charger?.kind === 'rectifier' && charger.ratedOutputCurrent !== undefined && charger.ratedOutputCurrent < required) {
    warnings.push(say`the rated output current ${q(charger.ratedOutputCurrent, 'A')} of "${charger.name ?? charger.id}" is below the ${q(required, 'A')} it must give to carry the bus and recharge the bank in ${q(H, 'h')}`);
  }
  const recharge = solveVariant(modes.supply, rechargeChange(modes.supply.project, place, rechargeCurrent));
  const rechargeResult = recharge.ok ? recharge.result : undefined;
  let rechargeCase: RectifierSizing['rechargeCase'];
  if (recharge.ok) {
    const rr = byId(recharge.result);
    const root = recharge.result.elements[0]!;
    const supplySide = charger ? ancestorsAndSelf(project.elements, charger.id) : [];
    // The cables from the supply to the charger, and from the charger to the bus.
    const pathToBus = charger ? pathBetween(project.elements, charger.id, place.busId) : [];
    const cables = [...supplySide, ...pathToBus]
      .map((id) => rr.get(id))
      .filter((e): e is ElementResult => e !== undefined && e.kind === 'cable')
      .map((e) => cableSize(e));
    rechargeCase = { ok: true, supplyCurrent: root.output?.current ?? 0, supplyPower: root.pIn, rectifierOutputCurrent: charger ? (rr.get(charger.id)?.output?.current ?? null) : null, cables };
  } else {
    rechargeCase = { ok: false, problems: recharge.problems };
  }
  const chargerSizing: RectifierSizing = {
    method: 'IEEE Std 946 charger sizing: A = L + k·C/H (continuous load plus the recharge current)',
    chargerId: charger?.id ?? null,
    chargerName: charger ? (charger.name ?? charger.id) : null,
    loadCurrent,
    rechargeAh,
    rechargeAhFrom,
    rechargeHours: H,
    chargeReturnFactor: k,
    chargeReturnFactorFrom: settings.chargeReturnFactor !== undefined ? 'given' : 'typical',
    rechargeCurrent,
    requiredCurrent: required,
    ...(modules ? { modules } : {}),
    rechargeCase,
  };

  // ---- an inverter-charger's pass-through (core/solve/modes.ts) ----
  const passThrough: PassThroughWorking[] = [];
  // A pass-through limit on an inverter off the bank's bus does nothing: said, naming the inverter and the field.
  for (const u of unusedPassThrough(project, place)) warnings.push({ message: u.message });
  if (modes.passThrough) {
    const pt = modes.passThrough;
    const nameOf = (id: string): string => {
      const e = project.elements.find((x) => x.id === id);
      return e?.name ?? id;
    };
    for (const r of pt.refused) warnings.push({ message: `"${nameOf(r.inverterId)}" cannot pass the supply through to its loads: ${r.reason}; on supply it is taken to carry them itself` });
    if (pt.problems) {
      warnings.push({ message: `the supply cannot be passed through to the loads of ${pt.places.map((p) => `"${nameOf(p.inverterId)}"`).join(', ')}: ${pt.problems[0] ? formatProblem(pt.problems[0], project) : 'the chain has no solution'}; on supply the inverter is taken to carry them itself` });
    } else {
      for (const p of pt.places) {
        const name = nameOf(p.inverterId);
        const current = el.get(p.relayId)?.input?.current ?? 0;
        const idleKept = el.get(p.inverterId)?.loss ?? 0;
        passThrough.push({
          inverterId: p.inverterId,
          inverterName: name,
          limit: p.limit,
          current,
          inverterIdle: idleKept,
          note: `on supply the transfer relay of "${name}" passes the supply straight to its loads: its conversion losses drop out; its idle draw (${sigText(idleKept, 4)} W) stays, taken to stay on, synchronised and ready to take the loads (a unit that switches its inverter off while passing through draws none: use the maker's figure); when the supply is cut the relay moves the loads onto the inverter: they see a break of the maker's transfer time`,
        });
        if (current > p.limit * (1 + 1e-9)) {
          warnings.push(say`on supply the loads of "${name}" take ${q(current, 'A')} through its pass-through relay, above its pass-through limit ${q(p.limit, 'A')}`);
        }
      }
    }
  }

  // ---- standing losses on supply ----
  let conversion = 0;
  let idle = 0;
  let cables = 0;
  let switches = 0;
  let source = 0;
  for (const e of supply.elements) {
    if (e.role === 'load') continue;
    if (e.role === 'source') source += e.loss;
    else if (e.kind === 'cable') cables += e.loss;
    else if (e.kind === 'transfer-switch') switches += e.loss;
    else {
      idle += e.idleLoss ?? 0;
      conversion += e.loss - (e.idleLoss ?? 0);
    }
  }
  const bankFloat = bankRes.pIn;
  const total = conversion + idle + cables + switches + source + bankFloat;
  const outage = settings.outageHoursPerYear ?? 0;
  const onHours = hoursOnSupply(outage);
  const energyKWh = (total * onHours) / 1000;
  const standing: StandingLosses = {
    conversion,
    idle,
    cables,
    switches,
    source,
    bankFloat,
    total,
    hoursOnSupply: onHours,
    outageHoursPerYear: outage,
    energyKWh,
    // The project's one energy price (its `running` settings), as the cost of the losses uses.
    ...(price !== undefined ? { pricePerKWh: price, cost: energyKWh * price } : {}),
  };

  // ---- the on-battery mode and the transfer ----
  const battery = modes.battery.ok ? figuresOf('battery', modes.battery.result) : { ok: false as const, problems: modes.battery.problems };
  if (!modes.battery.ok) warnings.push(say`the bank "${bankEl.name ?? bankEl.id}" cannot carry the bus "${busRes.name}" when the supply is cut: ${modes.battery.problems[0]?.message ?? 'the chain has no solution'}`);
  let transfer: Transfer | null = null;
  const R = bank.internalResistance;
  const vFloat = bankRes.input!.voltage;
  const floatEmf = vFloat - floatCurrent * R;
  const onBattery = onBatteryChange(project, place);
  const { bank: _b, from: _f, ...plain } = bankEl;
  // The bank at its float EMF: a battery given by its voltage and resistance (no bank spec: the spec would set the open-circuit voltage).
  const atFloat = { ...plain, voltage: floatEmf, internalResistance: R } as Element;
  const instant = solveVariant(solved, { ...onBattery, replace: [atFloat, ...(onBattery.replace ?? []).filter((e) => e.id !== place.bankId)] });
  if (instant.ok) {
    const ir = byId(instant.result);
    const current = ir.get(place.bankId)!.output!.current;
    transfer = {
      floatCurrent,
      floatCurrentNote: spec.floatCurrent !== undefined ? "the maker's figure" : TYPICAL_VALUE,
      floatEmf,
      internalResistance: R,
      currentAtTransfer: current,
      currentStep: current + floatCurrent,
      busVoltageOnSupply: busRes.output!.voltage,
      busVoltageAtTransfer: ir.get(place.busId)!.output!.voltage,
      busVoltageSettled: modes.battery.ok ? (byId(modes.battery.result).get(place.busId)?.output?.voltage ?? null) : null,
      maxDischargeCurrent: bank.maxDischargeCurrent,
    };
    if (current > bank.maxDischargeCurrent) {
      warnings.push(say`the bus load takes ${q(current, 'A')} from the bank "${bankEl.name ?? bankEl.id}" at transfer, above its maximum discharge current ${q(bank.maxDischargeCurrent, 'A')}: the on-battery path cannot carry it`);
    }
  } else if (modes.battery.ok) {
    problems.push(...instant.problems);
  }
  // Converters on the bus that stop below an input voltage (an inverter's low-voltage cut-off, a DC-DC
  // converter's lowest input): the on-battery path cannot carry their loads below it.
  const onBatteryResults = [instant.ok ? instant.result : undefined, modes.battery.ok ? modes.battery.result : undefined].filter((r) => r !== undefined);
  for (const e of project.elements) {
    const limit = e.kind === 'inverter' ? e.lowVoltageCutoff : e.kind === 'dc-dc' ? e.minInputVoltage : undefined;
    if (limit === undefined) continue;
    const lowest = Math.min(...onBatteryResults.map((r) => byId(r).get(e.id)?.input?.voltage ?? Infinity));
    if (Number.isFinite(lowest) && lowest < limit) {
      warnings.push(say`on battery "${e.name ?? e.id}" is fed ${q(lowest, 'V')}, below the ${q(limit, 'V')} it stops at: the on-battery path cannot carry its loads`);
    }
  }
  if (modes.battery.ok) {
    // What the on-battery path cannot carry, each named with both figures (switches.ts); the solve's own
    // rating warnings of those elements are then left out (the named one says it).
    const path = batteryPathWarnings(project.elements, place, bankEl.name ?? bankEl.id, bank.maxDischargeCurrent, modes.battery.result);
    const named = new Set(path.map((w) => w.elementId));
    for (const { elementId: _id, ...w } of path) warnings.push(w);
    for (const w of modes.battery.result.warnings) {
      if (w.code === 'rating-exceeded' && named.has(w.elementId)) continue;
      warnings.push({ message: `on battery: ${w.message}`, ...(w.template ? { template: `on battery: ${w.template}`, values: w.values ?? [] } : {}) });
    }
  }
  if (problems.length) return { ok: false, problems };

  // ---- cables sized differently in the cases (float, recharge, on battery): the largest governs ----
  const cableSizes: ModesStudyResult['cableSizes'] = [];
  const cases = { recharge: rechargeResult ? byId(rechargeResult) : undefined, battery: modes.battery.ok ? byId(modes.battery.result) : undefined };
  for (const e of supply.elements) {
    if (e.kind !== 'cable' || !e.conductor) continue;
    const sizes = [e.conductor, cases.recharge?.get(e.id)?.conductor, cases.battery?.get(e.id)?.conductor];
    const known = sizes.filter((c) => c !== undefined);
    if (known.every((c) => c.size === e.conductor!.size)) continue;
    const largest = known.reduce((a, b) => (b.areaMm2 * b.parallelSets > a.areaMm2 * a.parallelSets ? b : a));
    cableSizes.push({
      id: e.id,
      name: e.name,
      float: e.conductor.size,
      ...(sizes[1] ? { recharge: sizes[1].size } : {}),
      ...(sizes[2] ? { battery: sizes[2].size } : {}),
      use: largest.parallelSets > 1 ? `${largest.parallelSets} × ${largest.size}` : largest.size,
    });
  }
  return {
    ok: true,
    study: {
      place,
      bankName: bankEl.name ?? bankEl.id,
      busName: busRes.name,
      supply: figuresOf('supply', supply),
      battery,
      charger: chargerSizing,
      standing,
      transfer,
      ...(modes.passThrough ? { passThrough } : {}),
      switches: switchWorking(project.elements, place, supply, modes.battery.ok ? modes.battery.result : undefined),
      cables: cablesAcrossModes({ supply, battery: modes.battery.ok ? modes.battery.result : undefined, recharge: rechargeResult }),
      cableSizes,
      warnings,
      cautions: [
        PLANNING_CAUTION,
        'Size each cable for the larger of its currents in the two modes, and the charger for the recharge case; set the float and charge voltages from the cell maker\u2019s data.',
      ],
    },
  };
}

/** Ids from the root down to the element (inclusive). */
function ancestorsAndSelf(elements: readonly Element[], id: string): string[] {
  const byIdMap = new Map(elements.map((e) => [e.id, e]));
  const out: string[] = [];
  let at = byIdMap.get(id);
  while (at && !out.includes(at.id)) {
    out.unshift(at.id);
    at = 'from' in at && at.from !== undefined ? byIdMap.get(at.from) : undefined;
  }
  return out;
}

/** Ids strictly between `upper` and `lower` (lower's ancestors below upper). */
function pathBetween(elements: readonly Element[], upper: string, lower: string): string[] {
  const chain = ancestorsAndSelf(elements, lower);
  const k = chain.indexOf(upper);
  return k < 0 ? [] : chain.slice(k + 1, -1);
}

function cableSize(e: ElementResult): CableSize {
  const current = e.input?.current ?? 0;
  return { id: e.id, name: e.name, current, ...(e.conductor ? { size: e.conductor.size, designCurrent: e.conductor.designCurrent } : {}) };
}
