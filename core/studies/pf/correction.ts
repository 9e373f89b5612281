/**
 * Power-factor correction: the capacitor bank that raises a lagging interface to a target power
 * factor, and what it changes upstream.
 *
 * Methods (each the textbook relation; e.g. IEEE Std 1036 "Guide for the Application of Shunt
 * Power Capacitors", and any power-systems handbook):
 * - bank rating Qc = P·(tan φ1 − tan φ2), φ1 = arccos(present pf), φ2 = arccos(target pf)
 *   (here tan φ1 = Q/P from the solved interface itself);
 * - capacitance per phase from Q = V²·ωC per capacitor: star C = Qc/(3·ω·V_phase²), delta
 *   C = Qc/(3·ω·V_LL²), single-phase C = Qc/(ω·V²), ω = 2πf, at the solved interface voltage;
 * - line current after correction I = S/(√3·V_LL) (three-phase) or S/V, S = √(P² + (Q − Qc)²);
 * - light load: with the load scaled at constant power factor to x·P, x·Q, the fixed bank leaves
 *   x·Q − Qc, leading when x < Qc/Q = 1 − tan φ2/tan φ1;
 * - upstream: the chain is solved again with the bank added as a capacitor network load at the
 *   interface (a constant impedance, so its var follow the voltage it finds there), and currents,
 *   losses, conductor sizes and the source's kW and kVA are compared before and after.
 *
 * Where the bank goes: a load, or a stage whose output is not AC (motor, rectifier), is corrected
 * at its own input terminals (its own P and Q; the bank hangs beside it); a source or a stage with
 * an AC output at that output (all it delivers). Where it does not belong (core/studies/pf/placement.ts):
 * a drive's output bus (the drive itself, or a motor or load it feeds through cables or transformers)
 * is refused with the reason; an inverter's output bus is computed with a warning; a bus that feeds a
 * drive gets a warning about its rectifier. Pure: no clock, no storage.
 */
import type { Element, NetworkLoad, Project } from '../../model/project.ts';
import type { Problem } from '../../model/errors.ts';
import { PROJECT_LEVEL } from '../../model/errors.ts';
import type { ElementResult, PortResult, SolveResult } from '../../model/result.ts';
import type { Solved } from '../../solve/index.ts';
import { solveVariant } from '../../solve/variant.ts';
import type { NetworkConnection } from '../../physics/network.ts';
import { DRIVE_INPUT_REASON, DRIVE_OUTPUT_REASON, INVERTER_OUTPUT_REASON, converterOutputAt, drivesOnBus } from './placement.ts';

/** Default light-load check: a quarter of the present real power (common practice, no source). */
export const DEFAULT_LIGHT_LOAD_FRACTION = 0.25;

export const PF_CORRECTION_CAUTION =
  'Planning estimate. Capacitor ratings, switching and protection, discharge devices, harmonic resonance with the supply and ' +
  'drives, and motor self-excitation are for the manufacturer, local codes and licensed practice to settle.';

export interface PfCorrectionRequest {
  /** Id of the element whose interface is corrected (see the module header for where the bank goes). */
  at: string;
  /** Power factor to reach, lagging, 0 < target ≤ 1, above the present one. */
  targetPowerFactor: number;
  /** Fraction of the present real power at which the light-load check is made (default 0.25). */
  lightLoadFraction?: number;
  /** Three-phase bank connection the re-solve uses (default "delta", common practice for LV banks). */
  connection?: 'star' | 'delta';
}

/** P, Q, S, pf and current at an interface. */
export interface InterfaceState {
  /** V: line-to-line on three-phase. */
  voltage: number;
  current: number;
  p: number;
  q: number;
  s: number;
  powerFactor: number;
  pfSense: 'lagging' | 'leading' | 'unity';
}

export interface CapacitorBank {
  /** Bank reactive power Qc at the interface voltage, var. */
  reactivePower: number;
  /** Qc in kvar. */
  kvar: number;
  /** Capacitance per phase, F: a single-phase bank gives `single`; three-phase gives `star` and `delta`. */
  capacitance: { single?: number; star?: number; delta?: number };
  /** Voltage the capacitance is worked at, V (line-to-line on three-phase), and the frequency, Hz. */
  voltage: number;
  frequency: number;
  /** The connection used in the re-solve. */
  connection: NetworkConnection;
}

/** One element between the bank and the source, before and after. */
export interface UpstreamChange {
  id: string;
  name: string;
  kind: Element['kind'];
  /** Line (or DC) current through the element: its input, or for the source what it delivers, A. */
  currentBefore: number;
  currentAfter: number;
  lossBefore: number;
  lossAfter: number;
  /** Conductor size before and after (cables given a conductor spec; "auto" sizes may shrink). */
  sizeBefore?: string;
  sizeAfter?: string;
}

export interface PfCorrection {
  at: string;
  /** Where the bank sits: "input" terminals of `at`, or its "output". */
  side: 'input' | 'output';
  /** Id of the element the bank is fed from in the re-solve. */
  bankFrom: string;
  kind: 'ac1' | 'ac3';
  targetPowerFactor: number;
  before: InterfaceState;
  bank: CapacitorBank;
  /** The interface after correction by the formulas (same voltage, same load). */
  afterEstimate: InterfaceState;
  /** The interface after correction in the re-solved chain. */
  afterSolved: InterfaceState;
  lightLoad: {
    fraction: number;
    powerFactor: number;
    pfSense: 'lagging' | 'leading' | 'unity';
    /** Below this fraction of the present load (scaled at constant pf) the fixed bank makes the pf leading. */
    leadingBelowFraction: number;
  };
  /** Every element from the bank's feeder up to the source. */
  upstream: UpstreamChange[];
  source: { pBefore: number; pAfter: number; qBefore: number; qAfter: number; sBefore: number; sAfter: number };
  lossesBefore: number;
  lossesAfter: number;
  /** The bank as a project element, and the project with it added. */
  bankElement: NetworkLoad;
  correctedProject: Project;
  /** The full results before and after. */
  resultBefore: SolveResult;
  resultAfter: SolveResult;
  warnings: string[];
  caution: string;
}

export type PfCorrectionOutcome = { ok: true; correction: PfCorrection } | { ok: false; problems: Problem[] };

// ---------- the formulas ----------

/** Qc = P·(tan φ1 − tan φ2), var (IEEE Std 1036; any power-systems handbook). */
export function requiredReactivePower(p: number, presentPowerFactor: number, targetPowerFactor: number): number {
  const tan = (pf: number) => Math.sqrt(1 - pf * pf) / pf;
  return p * (tan(presentPowerFactor) - tan(targetPowerFactor));
}

/**
 * Capacitance per phase for a bank of Qc var: Q = V²·ωC per capacitor, so star C = Qc/(3ωV_phase²),
 * delta C = Qc/(3ωV_LL²), single-phase C = Qc/(ωV²). `voltage` is line-to-line on three-phase.
 */
export function bankCapacitance(qc: number, connection: NetworkConnection, voltage: number, frequency: number): number {
  const omega = 2 * Math.PI * frequency;
  if (connection === 'single-phase') return qc / (omega * voltage * voltage);
  const vAcross = connection === 'star' ? voltage / Math.sqrt(3) : voltage;
  return qc / (3 * omega * vAcross * vAcross);
}

/** Fraction of the present load (scaled at constant pf) below which a fixed bank of Qc makes it leading: Qc/Q. */
export const leadingBelowFraction = (q: number, qc: number): number => qc / q;

const sense = (p: number, q: number, s: number): 'lagging' | 'leading' | 'unity' =>
  Math.abs(q) <= 1e-9 * s ? 'unity' : q > 0 ? 'lagging' : 'leading';

function state(kind: 'ac1' | 'ac3', voltage: number, p: number, q: number): InterfaceState {
  const s = Math.hypot(p, q);
  const current = kind === 'ac3' ? s / (Math.sqrt(3) * voltage) : s / voltage;
  return { voltage, current, p, q, s, powerFactor: s > 0 ? Math.abs(p) / s : 1, pfSense: sense(p, q, s) };
}

const fromPort = (port: PortResult): InterfaceState => ({
  voltage: port.voltage,
  current: port.current,
  p: port.p,
  q: port.q,
  s: port.s,
  powerFactor: port.powerFactor,
  pfSense: port.pfSense,
});

// ---------- the request ----------

const problem = (code: Problem['code'], elementId: string, field: string, value: unknown, message: string): Problem => ({ code, elementId, field, value, message });

function checkRequest(r: PfCorrectionRequest): Problem[] {
  const id = typeof r.at === 'string' && r.at !== '' ? r.at : PROJECT_LEVEL;
  const out: Problem[] = [];
  if (typeof r.at !== 'string' || r.at === '') out.push(problem('invalid-value', PROJECT_LEVEL, 'at', r.at, 'must name the element whose interface is corrected'));
  const t = r.targetPowerFactor;
  if (typeof t !== 'number' || !Number.isFinite(t)) out.push(problem('invalid-value', id, 'targetPowerFactor', t, 'must be a number'));
  else if (t <= 0) out.push(problem('invalid-value', id, 'targetPowerFactor', t, 'must be greater than 0'));
  else if (t > 1) out.push(problem('invalid-value', id, 'targetPowerFactor', t, 'must not exceed 1 (enter 0.95 for 95 %)'));
  const x = r.lightLoadFraction;
  if (x !== undefined && (typeof x !== 'number' || !Number.isFinite(x) || x <= 0 || x >= 1)) {
    out.push(problem('invalid-value', id, 'lightLoadFraction', x, 'must be a fraction of the present load between 0 and 1 (0.25 = 25 %)'));
  }
  if (r.connection !== undefined && r.connection !== 'star' && r.connection !== 'delta') {
    out.push(problem('invalid-value', id, 'connection', r.connection, 'must be "star" or "delta"'));
  }
  return out;
}

/** Which port of the element is corrected, and where the bank hangs. */
function placeBank(e: ElementResult): { side: 'input' | 'output'; port: PortResult | undefined; bankFrom: string | undefined } {
  const acOut = e.output && (e.output.kind === 'ac1' || e.output.kind === 'ac3');
  if (e.role === 'source' || (e.role === 'stage' && acOut)) return { side: 'output', port: e.output, bankFrom: e.id };
  return { side: 'input', port: e.input, bankFrom: e.from };
}

const KIND_WORDS: Record<string, string> = { dc: 'DC', shaft: 'a mechanical shaft' };

/**
 * Size the capacitor bank that raises the interface of `request.at` to the target power factor,
 * and re-solve the chain with it (a variant of the solved project, core/solve/variant.ts). The
 * project is not validated or solved again; the request, which is not part of it, is checked here
 * (problems naming the field); nothing is computed from a bad one.
 */
export function correctPowerFactor(solved: Solved, request: PfCorrectionRequest): PfCorrectionOutcome {
  const requestProblems = checkRequest(request);
  if (requestProblems.length) return { ok: false, problems: requestProblems };
  const project = solved.project;
  const before = solved.result;
  const at = request.at;
  const target = request.targetPowerFactor;

  const element = before.elements.find((e) => e.id === at);
  if (!element) {
    return { ok: false, problems: [problem('unknown-element', at, 'at', at, `no element "${at}" in the project (ids: ${before.elements.map((e) => e.id).join(', ')})`)] };
  }
  const { side, port, bankFrom } = placeBank(element);
  if (!port || bankFrom === undefined || (port.kind !== 'ac1' && port.kind !== 'ac3')) {
    const what = port ? KIND_WORDS[port.kind] ?? port.kind : 'nothing';
    return { ok: false, problems: [problem('not-correctable', at, 'at', at, `its ${side} is ${what}: there is no reactive power to correct (name an element on the AC side)`)] };
  }
  const byIdSolved = new Map(before.elements.map((e) => [e.id, e]));
  const converter = converterOutputAt(byIdSolved, element, side);
  if (converter?.kind === 'drive') {
    const where = converter.id === element.id ? 'is a variable-frequency drive' : `is on the output of the drive ${converter.name}`;
    return {
      ok: false,
      problems: [problem('not-correctable', at, 'at', at, `${where}: no capacitor bank on a drive output — ${DRIVE_OUTPUT_REASON}; correct at the drive input instead, e.g. at the cable feeding it`)],
    };
  }
  const kind = port.kind;
  const frequency = port.frequency;
  if (frequency === undefined || !(port.voltage > 0)) {
    return { ok: false, problems: [problem('not-correctable', at, 'at', at, 'has no voltage at this operating point')] };
  }
  const { p, q } = port;
  if (!(p > 0)) {
    return { ok: false, problems: [problem('not-correctable', at, 'at', p, `draws no real power at its ${side} (P = ${p.toPrecision(4)} W): nothing to correct`)] };
  }
  if (port.pfSense !== 'lagging') {
    return {
      ok: false,
      problems: [
        problem('not-correctable', at, 'at', port.powerFactor, `its ${side} is ${port.pfSense === 'unity' ? 'at unity power factor' : `leading already (pf ${port.powerFactor.toFixed(3)} leading)`}: a capacitor bank would only make it more leading`),
      ],
    };
  }
  if (target <= port.powerFactor) {
    return {
      ok: false,
      problems: [problem('invalid-value', at, 'targetPowerFactor', target, `must be above the present power factor ${port.powerFactor.toFixed(4)} lagging at its ${side}; a lower target needs no capacitors`)],
    };
  }

  // Qc = P·(tan φ1 − tan φ2) with tan φ1 = Q/P of the solved interface.
  const tan2 = Math.sqrt(1 - target * target) / target;
  const qc = q - p * tan2;
  const connection: NetworkConnection = kind === 'ac1' ? 'single-phase' : (request.connection ?? 'delta');
  const capacitance =
    kind === 'ac1'
      ? { single: bankCapacitance(qc, 'single-phase', port.voltage, frequency) }
      : { star: bankCapacitance(qc, 'star', port.voltage, frequency), delta: bankCapacitance(qc, 'delta', port.voltage, frequency) };
  const bank: CapacitorBank = { reactivePower: qc, kvar: qc / 1000, capacitance, voltage: port.voltage, frequency, connection };
  const afterEstimate = state(kind, port.voltage, p, q - qc);

  const x = request.lightLoadFraction ?? DEFAULT_LIGHT_LOAD_FRACTION;
  const light = state(kind, port.voltage, x * p, x * q - qc);
  const leadingBelow = leadingBelowFraction(q, qc);

  // The bank as a capacitor network load beside the corrected interface.
  const ids = new Set(project.elements.map((e) => e.id));
  let bankId = `${at}-pf-bank`;
  for (let k = 2; ids.has(bankId); k++) bankId = `${at}-pf-bank-${k}`;
  const farads = kind === 'ac1' ? capacitance.single! : connection === 'star' ? capacitance.star! : capacitance.delta!;
  const bankElement: NetworkLoad = {
    id: bankId,
    name: `Power-factor correction bank at ${element.name}`,
    kind: 'network-load',
    from: bankFrom,
    network: { capacitor: farads },
    ...(kind === 'ac3' ? { connection: connection as 'star' | 'delta' } : {}),
  };
  const resolved = solveVariant(solved, { add: [bankElement] });
  if (!resolved.ok) return resolved;
  const correctedProject: Project = resolved.project;
  const after = resolved.result;
  const byIdAfter = new Map(after.elements.map((e) => [e.id, e]));
  const atAfter = byIdAfter.get(at)!;
  const bankAfter = byIdAfter.get(bankId)!;
  const portAfter = side === 'output' ? atAfter.output! : atAfter.input!;
  // At a load's terminals the corrected interface is the load and its bank together.
  const pAfter = portAfter.p + (side === 'input' ? bankAfter.input!.p : 0);
  const qAfter = portAfter.q + (side === 'input' ? bankAfter.input!.q : 0);
  const afterSolved = side === 'output' ? fromPort(portAfter) : state(kind, portAfter.voltage, pAfter, qAfter);

  const upstream: UpstreamChange[] = [];
  const byIdBefore = new Map(before.elements.map((e) => [e.id, e]));
  for (let id: string | undefined = bankFrom; id !== undefined; id = byIdBefore.get(id)!.from) {
    const b = byIdBefore.get(id)!;
    const a = byIdAfter.get(id)!;
    const current = (e: ElementResult) => (e.role === 'source' ? e.output!.current : e.input!.current);
    const change: UpstreamChange = { id, name: b.name, kind: b.kind, currentBefore: current(b), currentAfter: current(a), lossBefore: b.loss, lossAfter: a.loss };
    if (b.conductor) change.sizeBefore = b.conductor.size;
    if (a.conductor) change.sizeAfter = a.conductor.size;
    upstream.push(change);
  }
  const srcB = before.elements[0]!.output!;
  const srcA = after.elements[0]!.output!;

  const warnings: string[] = [];
  if (x < leadingBelow) {
    warnings.push(
      `at ${(x * 100).toFixed(0)} % of the present load the fixed ${(qc / 1000).toPrecision(3)} kvar bank overshoots: pf ${light.powerFactor.toFixed(3)} ${light.pfSense}; ` +
        `it turns leading below ${(leadingBelow * 100).toFixed(1)} % load. Switch the bank in steps with the load (an automatic controller), or choose a lower target`,
    );
  }
  if (element.kind === 'motor') {
    warnings.push(
      'a bank switched with the motor should not exceed the motor’s no-load reactive power, or the motor can self-excite when switched off (common practice); check with the motor maker',
    );
  }
  if (converter?.kind === 'inverter') {
    warnings.push(`a bank here is on the output of the inverter ${converter.name}, where this app does not propose one: ${INVERTER_OUTPUT_REASON}`);
  } else if (side === 'output' && element.kind === 'generic') {
    warnings.push(`${element.name} regulates its output and supplies its reactive power itself: the bank lowers its output current, not the power drawn upstream of it`);
  }
  const fedDrives = drivesOnBus(byIdSolved, bankFrom);
  if (fedDrives.length) {
    warnings.push(`this bus feeds the drive${fedDrives.length > 1 ? 's' : ''} ${fedDrives.map((d) => d.name).join(', ')}: ${DRIVE_INPUT_REASON}`);
  }
  const miss = Math.abs(afterSolved.powerFactor - target);
  if (miss > 0.005 && afterSolved.pfSense === 'lagging') {
    warnings.push(`in the re-solved chain the bank reaches pf ${afterSolved.powerFactor.toFixed(3)} (its var follow the square of the voltage it finds there)`);
  }

  return {
    ok: true,
    correction: {
      at,
      side,
      bankFrom,
      kind,
      targetPowerFactor: target,
      before: fromPort(port),
      bank,
      afterEstimate,
      afterSolved,
      lightLoad: { fraction: x, powerFactor: light.powerFactor, pfSense: light.pfSense, leadingBelowFraction: leadingBelow },
      upstream,
      source: { pBefore: srcB.p, pAfter: srcA.p, qBefore: srcB.q, qAfter: srcA.q, sBefore: srcB.s, sAfter: srcA.s },
      lossesBefore: before.totals.losses,
      lossesAfter: after.totals.losses,
      bankElement,
      correctedProject,
      resultBefore: before,
      resultAfter: after,
      warnings,
      caution: PF_CORRECTION_CAUTION,
    },
  };
}
