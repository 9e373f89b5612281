/**
 * Motor starting through the chain that feeds the motor. The motor's own starting current
 * (locked-rotor current, current by starting method) is worked out in starting-current.ts; here the
 * chain during the start and the verdict (about 410 lines: studyStart is one walk up the chain
 * whose steps read each other's figures — source impedance, the start's solve, inverter, generator,
 * checks — and reads best whole).
 *
 * Methods (each also written into the result's `method` text):
 * - Locked-rotor current: NEC Table 430.7(B) code letter — S_LR = kVA/hp (the upper end of the
 *   letter's band; 22.4 for V, which has no upper end) × hp, I_LR = S_LR / (√3·V) on three-phase,
 *   S_LR / V on single-phase (NEC 430.7(B) with the usual current-from-kVA relation); or the IEC
 *   ratio I_A/I_N × FLC; or the current entered; else 6 × FLC (common practice).
 * - Starting current by method: direct-on-line I_LR; star-delta I_LR/3 (textbook: the winding
 *   sees 1/√3 of the voltage and the delta-to-line factor √3 goes); soft starter min(limit × FLC,
 *   I_LR); drive 1.5 × FLC (common practice, about 1–1.5 × FLC).
 * - Chain during the start: the motor is replaced by its starting load and the whole project is
 *   solved again by the engine (the other loads keep running). Direct-on-line and star-delta: a
 *   constant impedance Z = V_phase / I_start at the starting power factor (a motor at locked rotor
 *   is an impedance; the engine solves constant-impedance loads exactly, core/kinds/network-load.ts).
 *   Soft starter and drive: a constant apparent power S_start at rated voltage (they regulate the
 *   current; constant power over-states the current a little when the voltage sags — on the safe side).
 *   Each cable's drop is |V_send| − |V_receive| of that solve; the motor terminal voltage is
 *   compared with the threshold.
 * - Generator source: its reactance during the start is X''d (ohms X''d%·U²/S_rated), and the
 *   transient dip is also given by the per-unit divider ΔV = X''d·S_start / (S_gen + X''d·S_start)
 *   (common practice: the generator's EMF behind X''d feeding the locked-rotor impedance).
 * - Inverter source: the apparent power it delivers during the start against its surge rating
 *   and the start time against the surge duration; its DC input voltage during the start (bank
 *   OCV − I·R_internal − cable drops, from the same solve) against its low-voltage cut-off.
 * - Verdict (this app's rule): every check has a utilisation u (value/limit, or limit/value for a
 *   minimum); u > 1 fails ("will not start"); 0.9 < u ≤ 1 is "marginal" (within 10 % of a limit);
 *   the check with the largest u governs.
 */
import type { AcSource, BatterySource, Element, InverterStage, MotorStage, TransformerStage } from '../../model/project.ts';
import type { Problem } from '../../model/errors.ts';
import type { Solved } from '../../solve/index.ts';
import { solveVariant } from '../../solve/variant.ts';
import { batteryEquivalent } from '../../kinds/battery.ts';
import { TYPICAL_VALUE, DEFAULT_MAX_GENERATOR_DIP_PERCENT, DEFAULT_MIN_TERMINAL_VOLTAGE_PERCENT, MARGINAL_FRACTION } from '../../data/motor-starting.ts';
import { METHOD_WORDS, startingFigures } from './starting-current.ts';
import { feederImpedance } from './faults.ts';
import type { CheckStatus, MotorStartResult, SeriesDrop, StartCheck, StartVerdict } from './types.ts';

const SQRT3 = Math.sqrt(3);
/** Beside every default the user reads (the defaults are common practice, no source; see core/data/motor-starting.ts). */
const CP = TYPICAL_VALUE;

const fmt = (x: number, digits = 3): string => (Math.abs(x) >= 1000 ? Math.round(x).toString() : x.toPrecision(digits));

const SERIES_WORDS =
  'every transformer (its u_k and load loss) and every cable (carrying the starting current, with the size and resistance of the running solve: a start lasts seconds) are in the solve';

const REACTANCE_WORDS = { transient: 'transient reactance X′d', subtransient: 'subtransient reactance X″d' } as const;

const check = (c: Omit<StartCheck, 'utilisation' | 'status'>): StartCheck => {
  const u = c.sense === 'at-most' ? c.value / c.limit : c.value > 0 ? c.limit / c.value : Infinity;
  const status: CheckStatus = u > 1 ? 'fail' : u > 1 - MARGINAL_FRACTION ? 'marginal' : 'pass';
  return { ...c, utilisation: Number.isFinite(u) ? u : 1e9, status };
};

/** The elements from `id` up to the root, nearest first (excluding `id`). */
function ancestors(byId: ReadonlyMap<string, Element>, id: string): Element[] {
  const out: Element[] = [];
  let at = byId.get(id);
  while (at && 'from' in at && at.from !== undefined) {
    const parent = byId.get(at.from);
    if (!parent) break;
    out.push(parent);
    at = parent;
  }
  return out;
}

/** Elements fed (directly or further down) by `id`. */
function descendants(elements: readonly Element[], id: string): Set<string> {
  // One pass builds the children lists; a stack walks them (linear, no recursion on depth).
  const children = new Map<string, string[]>();
  for (const e of elements) {
    if (!('from' in e) || e.from === undefined) continue;
    const list = children.get(e.from);
    if (list) list.push(e.id);
    else children.set(e.from, [e.id]);
  }
  const out = new Set<string>();
  const stack = [id];
  while (stack.length) {
    for (const k of children.get(stack.pop()!) ?? []) {
      if (out.has(k)) continue;
      out.add(k);
      stack.push(k);
    }
  }
  return out;
}

/** Study the start of one motor with `starting` data, from the solved project (its result is the running state). */
export function studyStart(solved: Solved, motor: MotorStage): { ok: true; start: MotorStartResult } | { ok: false; problems: Problem[] } {
  const project = solved.project;
  const running = solved.result;
  const s = motor.starting!;
  const byId = new Map(project.elements.map((e) => [e.id, e]));
  const res = new Map(running.elements.map((e) => [e.id, e]));
  const mr = res.get(motor.id)!;
  const phases: 1 | 3 = mr.input!.kind === 'ac3' ? 3 : 1;
  const ratedVoltage = motor.ratedVoltage ?? mr.input!.voltage;
  const ratedVoltageSource = motor.ratedVoltage !== undefined ? 'rated voltage' : 'not given: the running voltage at its terminals';
  const f = startingFigures(motor, phases, ratedVoltage);
  const up = ancestors(byId, motor.id);
  const root = up[up.length - 1] ?? motor;
  const notes: string[] = [];
  const problems: Problem[] = [];

  // The project during the start: the motor (and what it drives) replaced by its starting load.
  const below = descendants(project.elements, motor.id);
  const frequency = mr.input!.frequency ?? 50;
  let startLoad: Element;
  if (s.method === 'dol' || s.method === 'star-delta') {
    const vPhase = phases === 3 ? ratedVoltage / SQRT3 : ratedVoltage;
    const zMag = vPhase / f.startingCurrent;
    const r = zMag * f.startingPowerFactor;
    const x = zMag * Math.sqrt(1 - f.startingPowerFactor ** 2);
    startLoad = {
      id: motor.id,
      ...(motor.name !== undefined ? { name: motor.name } : {}),
      kind: 'network-load',
      from: motor.from,
      network: { series: [{ resistor: r }, { inductor: x / (2 * Math.PI * frequency) }] },
    };
  } else {
    startLoad = { id: motor.id, kind: 'ac-va-load', from: motor.from, apparentPower: f.startingApparentPower, powerFactor: f.startingPowerFactor };
  }
  const drives = up.filter((e) => e.kind === 'drive');
  if (s.method === 'drive' && drives.length === 0) notes.push('the starting method is a drive but no drive feeds this motor: the start is modelled at the motor as a drive would draw it');
  if (s.method !== 'drive' && up[0]?.kind === 'drive') notes.push(`the motor is fed by the drive "${up[0].name ?? up[0].id}" but starts by ${METHOD_WORDS[s.method]}: check the starting method`);

  // Every series impedance between the source and the motor counts during the start. The engine's
  // solve reads a source's resistance and reactance only; the fault data (a grid's short-circuit
  // power, a generator's X'd / X''d) are turned into that impedance here, for the start's solve.
  const acRoot = root.kind === 'grid' || root.kind === 'generator' ? (root as AcSource) : undefined;
  const gen = acRoot?.kind === 'generator' ? acRoot : undefined;
  let sourceImpedance: MotorStartResult['sourceImpedance'];
  let startRoot: AcSource | undefined;
  let genReactance: { percent: number; kind: 'transient' | 'subtransient' } | undefined;
  if (gen) {
    const xdd = gen.subtransientReactancePercent;
    const xd = gen.transientReactancePercent;
    if ((xdd !== undefined || xd !== undefined) && gen.ratedApparentPower === undefined) {
      problems.push({ code: 'invalid-value', elementId: gen.id, field: 'ratedApparentPower', message: `is needed beside the ${xd !== undefined ? 'transient reactance X′d' : 'subtransient reactance X″d'} (the generator’s reactances are given on its rating)` });
    }
    if (xd !== undefined && xdd !== undefined && xd < xdd) {
      problems.push({ code: 'invalid-value', elementId: gen.id, field: 'transientReactancePercent', value: xd, message: `must not be below the subtransient reactance X″d ${xdd} % (a synchronous machine’s X′d is always at least its X″d)` });
    }
    if (problems.length === 0 && (xd !== undefined || xdd !== undefined)) {
      genReactance = xd !== undefined ? { percent: xd, kind: 'transient' } : { percent: xdd!, kind: 'subtransient' };
      const ohms = (genReactance.percent / 100) * (gen.voltage * gen.voltage) / gen.ratedApparentPower!;
      startRoot = { ...gen, reactance: ohms };
      sourceImpedance = {
        elementId: gen.id,
        r: gen.resistance ?? 0,
        x: ohms,
        basis: `generator ${REACTANCE_WORDS[genReactance.kind]} ${genReactance.percent} % on its ${fmt(gen.ratedApparentPower! / 1000)} kVA rating = ${fmt(ohms)} Ω per phase${gen.resistance !== undefined ? `, with the resistance entered (${fmt(gen.resistance)} Ω)` : ''}`,
      };
      if (genReactance.kind === 'subtransient') {
        notes.push(`generator "${gen.name ?? gen.id}": only the subtransient reactance X″d is given, so the dip is the first cycles’ figure; the transient reactance X′d (larger) gives the deeper dip the motor sees while it accelerates, before the voltage regulator acts: enter it from the generator data`);
      }
    }
  } else if (acRoot) {
    const q = feederImpedance(acRoot);
    if (q) {
      startRoot = { ...acRoot, resistance: q.r, reactance: q.x };
      sourceImpedance = {
        elementId: acRoot.id,
        r: q.r,
        x: q.x,
        basis: `feeder impedance Z_Q = c·U²/S″kQ = ${q.c} × (${fmt(acRoot.voltage)} V)² / ${fmt(acRoot.shortCircuitPower! / 1000)} kVA = ${fmt(q.z * 1000)} mΩ, R/X ${q.rToX} (IEC 60909-0:2016 6.2; c = c_max, Table 1)`,
      };
      if (acRoot.resistance !== undefined || acRoot.reactance !== undefined) {
        notes.push(`supply "${acRoot.name ?? acRoot.id}": during the start its short-circuit power sets its impedance; the resistance and reactance entered are not used for the start`);
      }
    }
  }
  if (acRoot && !sourceImpedance) {
    if ((acRoot.resistance ?? 0) > 0 || (acRoot.reactance ?? 0) > 0) {
      sourceImpedance = { elementId: acRoot.id, r: acRoot.resistance ?? 0, x: acRoot.reactance ?? 0, basis: 'the source resistance and reactance as entered' };
    } else {
      notes.push(
        acRoot.kind === 'grid'
          ? `supply "${acRoot.name ?? acRoot.id}" has no short-circuit power (nor resistance or reactance): it is taken as infinitely stiff, so only the cables and transformers dip the voltage; ask the network operator for the short-circuit power at the supply point`
          : `generator "${acRoot.name ?? acRoot.id}": give its transient reactance X′d (or subtransient X″d) and rating to check the dip; without them it is taken as infinitely stiff`,
      );
    }
  }
  for (const a of up) {
    if (a.kind === 'transformer' && (a as TransformerStage).impedancePercent === undefined) {
      notes.push(`transformer "${a.name ?? a.id}" has no impedance (u_k %): only its winding resistance is counted during the start, which understates the dip; enter u_k from its nameplate`);
    }
  }
  if (problems.length) return { ok: false, problems };
  // A cable given by a conductor from the tables keeps, during the start, the size and resistance the
  // running solve gave it: a start lasts seconds, so the conductor neither heats up to the starting
  // current nor is sized for it (the engine would size an "auto" conductor afresh for the starting
  // current, and take its resistance at the temperature that current would reach if it lasted).
  const atRunning = (e: Element): Element => {
    if (e.kind !== 'cable' || !e.conductor) return e;
    const c = res.get(e.id)?.conductor;
    if (!c) return e;
    const { conductor: _c, ...cable } = e;
    return { ...cable, resistancePerKm: c.resistance.perKm, reactancePerKm: c.reactancePerKm, parallelSets: c.parallelSets };
  };
  // The start is a variant of the solved project (core/solve/variant.ts checks every element it
  // changes): the branch below the motor goes, the motor becomes its starting load, the source takes
  // its impedance for the start, cables keep their running sizes; the backup and pump duty studies,
  // which may name what is gone, are dropped.
  const replace: Element[] = [startLoad];
  for (const e of project.elements) {
    if (below.has(e.id) || e.id === motor.id) continue;
    const during = startRoot && e.id === startRoot.id ? startRoot : atRunning(e);
    if (during !== e) replace.push(during);
  }
  const starting = solveVariant(solved, { remove: below, replace, backup: null, pumpDuty: null });

  const checks: StartCheck[] = [];
  const minV = s.minTerminalVoltagePercent ?? DEFAULT_MIN_TERMINAL_VOLTAGE_PERCENT;
  const minVSource = s.minTerminalVoltagePercent !== undefined ? 'entered (lowest terminal voltage while starting)' : `${DEFAULT_MIN_TERMINAL_VOLTAGE_PERCENT} %, ${CP}`;
  let duringStart: MotorStartResult['duringStart'] = null;
  let inverterOut: MotorStartResult['inverter'];
  let generatorOut: MotorStartResult['generator'];
  let collapse: string | undefined;

  if (!starting.ok) {
    collapse = starting.problems.map((p) => p.message).join('; ');
  } else {
    const sr = new Map(starting.result.elements.map((e) => [e.id, e]));
    const m = sr.get(motor.id)!;
    const vT = m.input!.voltage;
    const drops: { id: string; dropVolts: number; dropPercent: number }[] = [];
    for (const a of up) {
      if (a.kind === 'cable') {
        const c = sr.get(a.id)!;
        const dv = c.input!.voltage - c.output!.voltage;
        drops.push({ id: a.id, dropVolts: dv, dropPercent: (100 * dv) / c.input!.voltage });
      }
      if (a.kind !== 'cable' && a.kind !== 'transformer') break;
    }
    const seriesDrops: SeriesDrop[] = [];
    for (const a of up) {
      const r = sr.get(a.id)!;
      let sending: number;
      let receiving: number;
      if (a.kind === 'cable') {
        sending = r.input!.voltage;
        receiving = r.output!.voltage;
      } else if (a.kind === 'transformer') {
        // Referred to the secondary: the ideal ratio's output less what the winding impedance drops.
        sending = r.input!.voltage * (a.secondaryVoltage / a.primaryVoltage);
        receiving = r.output!.voltage;
      } else if (a.kind === 'grid' || a.kind === 'generator') {
        sending = a.voltage;
        receiving = r.output!.voltage;
      } else break;
      seriesDrops.push({ id: a.id, name: a.name ?? a.id, kind: a.kind, dropVolts: sending - receiving, dropPercent: (100 * (sending - receiving)) / sending });
    }
    duringStart = {
      seriesDrops,
      terminalVoltage: vT,
      terminalVoltagePercent: (100 * vT) / ratedVoltage,
      terminalCurrent: m.input!.current,
      cableDrops: drops,
      cableDropTotalPercent: drops.reduce((t, d) => t + d.dropPercent, 0),
    };
    checks.push(check({ name: 'terminal-voltage', elementId: motor.id, label: 'motor terminal voltage during the start', value: duringStart.terminalVoltagePercent, limit: minV, unit: '%', sense: 'at-least', limitSource: minVSource }));

    const inv = up.find((e) => e.kind === 'inverter') as InverterStage | undefined;
    if (inv) {
      const ir = sr.get(inv.id)!;
      const sInv = ir.output!.s;
      const continuous = inv.loss.ratedPower;
      inverterOut = {
        id: inv.id,
        apparentPower: sInv,
        ...(inv.surge ? { surgeRating: inv.surge.apparentPower, surgeSeconds: inv.surge.durationSeconds } : {}),
        ...(continuous !== undefined ? { continuousRating: continuous } : {}),
        inputVoltage: ir.input!.voltage,
        ...(inv.lowVoltageCutoff !== undefined ? { lowVoltageCutoff: inv.lowVoltageCutoff } : {}),
      };
      if (inv.surge) {
        checks.push(check({ name: 'inverter-surge', elementId: inv.id, label: 'inverter apparent power during the start', value: sInv, limit: inv.surge.apparentPower, unit: 'VA', sense: 'at-most', limitSource: 'its surge apparent power' }));
        if (continuous === undefined || sInv > continuous) {
          checks.push(check({ name: 'surge-duration', elementId: inv.id, label: 'start time against the surge duration', value: f.startSeconds, limit: inv.surge.durationSeconds, unit: 's', sense: 'at-most', limitSource: 'how long it holds its surge' }));
        }
      } else if (continuous !== undefined) {
        checks.push(check({ name: 'inverter-surge', elementId: inv.id, label: 'inverter apparent power during the start (no surge rating given: against its continuous rating)', value: sInv, limit: continuous, unit: 'VA', sense: 'at-most', limitSource: 'its rated power, taken as VA (no surge rating given)' }));
      } else {
        notes.push(`inverter "${inv.name ?? inv.id}" has no surge rating and no rated power: its surge capability is not checked`);
      }
      if (inv.lowVoltageCutoff !== undefined) {
        checks.push(check({ name: 'inverter-cutoff', elementId: inv.id, label: 'inverter DC input voltage during the start', value: ir.input!.voltage, limit: inv.lowVoltageCutoff, unit: 'V', sense: 'at-least', limitSource: 'its low-voltage cut-off' }));
      }
      if (root.kind === 'battery') {
        const b = sr.get(root.id)!;
        const eq = batteryEquivalent(root as BatterySource);
        inverterOut.battery = {
          id: root.id,
          current: b.output!.current,
          internalResistance: eq.resistance,
          dipVolts: b.output!.current * eq.resistance,
          terminalVoltage: b.output!.voltage,
          openCircuitVoltage: eq.emf,
        };
      }
    }
  }
  if (gen) {
    const maxDip = gen.maxDipPercent ?? DEFAULT_MAX_GENERATOR_DIP_PERCENT;
    generatorOut = { id: gen.id, startingApparentPower: f.startingApparentPower, maxDipPercent: maxDip };
    if (gen.ratedApparentPower !== undefined) {
      generatorOut.ratedApparentPower = gen.ratedApparentPower;
      generatorOut.startingToRating = f.startingApparentPower / gen.ratedApparentPower;
    }
    if (genReactance) {
      // Per-unit divider: the EMF behind the generator's reactance feeding the starting impedance (common practice).
      const rated = gen.ratedApparentPower!;
      const dipAt = (percent: number) => {
        const x = percent / 100;
        return (100 * x * f.startingApparentPower) / (rated + x * f.startingApparentPower);
      };
      const dip = dipAt(genReactance.percent);
      if (gen.subtransientReactancePercent !== undefined) {
        generatorOut.subtransientReactancePercent = gen.subtransientReactancePercent;
        generatorOut.subtransientDipPercent = dipAt(gen.subtransientReactancePercent);
      }
      if (gen.transientReactancePercent !== undefined) {
        generatorOut.transientReactancePercent = gen.transientReactancePercent;
        generatorOut.transientDipPercent = dipAt(gen.transientReactancePercent);
      }
      generatorOut.reactanceUsed = genReactance.kind;
      generatorOut.dipPercent = dip;
      checks.push(
        check({
          name: 'generator-dip',
          elementId: gen.id,
          label: `generator voltage dip behind its ${REACTANCE_WORDS[genReactance.kind]}`,
          value: dip,
          limit: maxDip,
          unit: '%',
          sense: 'at-most',
          limitSource: gen.maxDipPercent !== undefined ? 'entered (largest dip allowed)' : `${DEFAULT_MAX_GENERATOR_DIP_PERCENT} %, ${CP}`,
        }),
      );
    } else if (!notes.some((n) => n.startsWith(`generator "${gen.name ?? gen.id}"`))) {
      notes.push(`generator "${gen.name ?? gen.id}": give its transient reactance X′d (or subtransient X″d) and rating to check the dip`);
    }
  }

  let verdict: StartVerdict;
  let governing: string;
  if (collapse !== undefined) {
    verdict = 'will-not-start';
    governing = `the chain cannot deliver the starting power (the solve during the start fails: ${collapse})`;
  } else {
    const worst = checks.reduce((a, b) => (b.utilisation > a.utilisation ? b : a));
    verdict = worst.status === 'fail' ? 'will-not-start' : worst.status === 'marginal' ? 'marginal' : 'starts';
    const rel = worst.sense === 'at-least' ? (worst.status === 'fail' ? 'below' : 'above') : worst.status === 'fail' ? 'above' : 'within';
    governing = `${worst.label}: ${fmt(worst.value)} ${worst.unit} ${rel} the limit ${fmt(worst.limit)} ${worst.unit} (${worst.limitSource})${worst.status === 'marginal' ? ' — within 10 % of it' : ''}`;
  }
  const methodText = [
    `Locked-rotor current: ${f.lockedRotorSource}.`,
    `Starting current: ${f.how}.`,
    `Starting power factor: ${f.startingPowerFactorSource}.`,
    s.method === 'dol' || s.method === 'star-delta'
      ? 'Chain: the engine’s solve with the motor as a constant impedance at locked rotor (Z = V_phase / I_start at the starting power factor); cable drops |V_send| − |V_receive| at that operating point.'
      : 'Chain: the engine’s solve with the motor as a constant apparent power at rated voltage (the starter or drive regulates the current); cable drops |V_send| − |V_receive|.',
    sourceImpedance
      ? `Source during the start: ${sourceImpedance.basis}; it, ${SERIES_WORDS}.`
      : `Source during the start: no impedance given, taken as stiff; ${SERIES_WORDS}.`,
    ...(genReactance
      ? [`Generator dip by the per-unit divider ΔV = X·S_start / (S_gen + X·S_start) with X its ${REACTANCE_WORDS[genReactance.kind]} (${genReactance.kind === 'transient' ? 'the dip while the motor accelerates, before the voltage regulator acts' : 'the first cycles; X′d gives the deeper dip that follows'}; common practice).`]
      : []),
    'Verdict: a limit exceeded → will not start; within 10 % of a limit → marginal (this app’s rule).',
  ].join(' ');
  return {
    ok: true,
    start: {
      motorId: motor.id,
      name: motor.name ?? motor.id,
      method: s.method,
      ratedVoltage,
      ratedVoltageSource,
      phases,
      fullLoadCurrent: f.fullLoadCurrent,
      fullLoadCurrentSource: f.fullLoadCurrentSource,
      lockedRotorCurrent: f.lockedRotorCurrent,
      lockedRotorSource: f.lockedRotorSource,
      startingCurrent: f.startingCurrent,
      startingMultiple: f.startingCurrent / f.fullLoadCurrent,
      startingPowerFactor: f.startingPowerFactor,
      startingPowerFactorSource: f.startingPowerFactorSource,
      startingApparentPower: f.startingApparentPower,
      startSeconds: f.startSeconds,
      startSecondsSource: f.startSecondsSource,
      duringStart,
      ...(sourceImpedance ? { sourceImpedance } : {}),
      ...(inverterOut ? { inverter: inverterOut } : {}),
      ...(generatorOut ? { generator: generatorOut } : {}),
      checks,
      verdict,
      governing,
      methodText,
      notes,
    },
  };
}

export { startingFigures } from './starting-current.ts';
