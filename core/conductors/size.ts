/**
 * Size one cable link for its design current (core/conductors/design-current.ts): the ampacity, the
 * protective device and the voltage-drop check are each worked by the code's own method, once,
 * before the chain is solved; the solved chain then gives the operating current, the estimated
 * conductor temperature, the exact drop and the heat, shown beside the check.
 *
 * Methods, each named where it is used:
 * - NEC ampacity: Table 310.16 in the insulation column × Table 310.15(B)(1)(1) × Table 310.15(C)(1),
 *   limited by the termination column of 110.14(C)(1) (60 °C for circuits of 100 A or less or
 *   14–1 AWG unless the terminations are marked 75 °C; 75 °C above). Continuous loads, inverter,
 *   charger and DC-DC circuits: 125 % against the termination column before corrections and 100 %
 *   against the corrected ampacity (210.19(A)(1)(a)/(b), 215.2(A)(1), 690.8(B)(1)/(2)). Motor and
 *   drive circuits: the corrected ampacity itself ≥ 125 % (430.22, 430.24, 430.122(A)).
 * - NEC device: the smallest 240.6(A) rating ≥ the design current (210.20(A), 215.3), within the
 *   ampacity (240.4), or the next higher standard rating when the ampacity is not itself a standard
 *   rating, only up to 800 A and not on a multioutlet branch circuit (240.4(B)); 240.4(D) per
 *   conductor. Motor branch circuits: Table 430.52(C)(1) maximum with Exception No. 1 (next higher
 *   standard rating); motor feeders: 430.62(A).
 * - IEC coordination (60364-4-43, 433.1): I_B ≤ I_n ≤ I_z and I₂ ≤ 1.45·I_z, I₂ of the device type
 *   (IEC 60898-1 circuit-breaker 1.45·I_n; IEC 60269 gG fuse 1.6·I_n from 16 A).
 * - Drop check: NEC Chapter 9 Table 9 at 75 °C with effective Z = R·cosθ + X·sinθ (Note 2), Table 8
 *   on DC: ΔV = 2·I·R·L (DC), 2·I·Z_e·L (1φ), √3·I·Z_e·L (3φ); IEC 60364-5-52 Annex G
 *   u = b·(ρ₁·L·cosφ/S + λ·L·sinφ)·I_B with ρ₁ = 1.25·ρ₂₀; at the design basis current before any
 *   125 % factor, as % of the nominal voltage.
 * - Beside it, labelled: the exact drop |V_s| − |V_r| of the solved chain (the two-bus solution of
 *   core/physics/two-bus.ts) with R at the estimated operating temperature (common practice):
 *   T = T_a + (T_max − T_a)·(I/I_z)², R_T = R_ref·(1 + α·(T − T_ref)).
 */
import { type Complex, abs } from '../physics/complex.ts';
import type { CableStage, NecConductorSpec, PortKind } from '../model/project.ts';
import type { ConductorResult, ConductorStep, GoverningRule } from '../model/result.ts';
import { NEC_430_52_C_1 } from '../data/nec-430-52.ts';
import type { DesignCurrent } from './design-current.ts';
import type { Candidate, PreparedConductor } from './prepare.ts';

export const CAUTION =
  'Planning estimate only: terminations, conduit fill, short-circuit withstand and local rules also apply; the final design belongs to a licensed professional under the local code.';

const SQRT3 = Math.sqrt(3);
const EPS = 1e-12;
const phaseCount = (kind: PortKind): number => (kind === 'ac3' ? 3 : 1);
const fmt = (x: number) => (Math.abs(x - Math.round(x)) < 1e-9 ? String(Math.round(x)) : x.toFixed(1));

/** The operating point's power factor angle of the link, for the drop formulas. */
export interface LinkAngle {
  cos: number;
  sin: number;
}

export interface DeviceChoice {
  rating?: number;
  ok: boolean;
  note: string;
  rule: string;
  coordination?: { ib: number; in: number; iz: number; i2: number; ok: boolean };
}

/** A candidate size worked out for the design current. */
export interface Evaluation {
  candidate: Candidate;
  /** NEC: the termination column and why. */
  termination?: { rating: 60 | 75 | 90; rule: string };
  /** NEC: Table 310.16 value in the termination column, per conductor, A. */
  terminationLimit?: number;
  /** Ampacity of one set after every limit, A. */
  ampacity: number;
  /** ampacity × parallel sets, A. */
  izTotal: number;
  ampacityOk: boolean;
  device: DeviceChoice;
  /** The method's drop at the design basis current, V (line-to-line on 3φ) and % of nominal. */
  check: { volts: number; percent: number };
  dropOk: boolean;
}

/** Resistance at temperature T: R_T = R_ref·(1 + α(T − T_ref)). */
export const resistanceAt = (p: PreparedConductor, cand: Candidate, t: number): number => cand.rRef * (1 + p.alpha * (t - p.tRef));

/** Estimated conductor temperature (common practice): T = T_a + (T_max − T_a)·(I/I_z)². */
export const temperatureAt = (p: PreparedConductor, cand: Candidate, perConductor: number): number =>
  p.ambient + (p.tMax - p.ambient) * (perConductor / cand.corrected) ** 2;

const smallestAtLeast = (list: readonly number[], x: number): number | undefined => list.find((r) => r >= x * (1 - EPS));
const isStandard = (list: readonly number[], x: number): boolean => list.some((r) => Math.abs(r - x) <= 1e-9 * Math.max(1, x));

/** NEC 110.14(C)(1): the Table 310.16 column the terminations allow for this size and circuit. */
function terminationOf(p: PreparedConductor, cand: Candidate, design: number): { rating: 60 | 75 | 90; rule: string } {
  const ins = p.insulation!;
  if (p.terminationGiven !== undefined) {
    const r = Math.min(ins, p.terminationGiven) as 60 | 75 | 90;
    return { rating: r, rule: `terminations marked ${p.terminationGiven} °C by the user (NEC 110.14(C)(1)${p.terminationGiven >= 75 ? '(a)(4)' : '(a)'})${r < p.terminationGiven ? `, limited by the ${ins} °C insulation` : ''}` };
  }
  const circuit = smallestAtLeast(p.deviceRatings, design) ?? Infinity;
  if (circuit <= 100 || cand.smallAwg) {
    const why = circuit <= 100 ? `a circuit of ${fmt(circuit)} A, 100 A or less` : `${cand.size.label}, within 14–1 AWG`;
    return { rating: Math.min(ins, 60) as 60, rule: `NEC 110.14(C)(1)(a): ${why}, so the 60 °C column unless the terminations are marked 75 °C` };
  }
  return { rating: Math.min(ins, 75) as 60 | 75, rule: `NEC 110.14(C)(1)(b): a circuit over 100 A with conductors larger than 1 AWG, so the 75 °C column` };
}

/** The motor branch-circuit device of NEC Table 430.52(C)(1) for a full-load current. */
function motorBranchDevice(spec: NecConductorSpec, ratings: readonly number[], flc: number): { rating: number | undefined; words: string } {
  const row = NEC_430_52_C_1.find((r) => r.device === (spec.motorDevice ?? 'inverse-time-breaker'))!;
  const max = (row.percentOfFlc / 100) * flc;
  const rating = isStandard(ratings, max) ? max : smallestAtLeast(ratings, max);
  return {
    rating,
    words: `${row.words}: at most ${row.percentOfFlc} % of ${fmt(flc)} A = ${max.toFixed(1)} A (NEC Table 430.52(C)(1))${rating !== undefined && !isStandard(ratings, max) ? `, the next higher standard rating ${rating} A (430.52(C)(1) Exception No. 1)` : ''}`,
  };
}

/** The protective device for a design current and a size. */
export function chooseDevice(p: PreparedConductor, cand: Candidate, dc: DesignCurrent, izTotal: number): DeviceChoice {
  const spec = p.spec;
  const design = dc.design;
  if (spec.system === 'iec') {
    const dev = p.iecDevice!;
    const rating = smallestAtLeast(p.deviceRatings, design);
    if (rating === undefined) {
      const top = p.deviceRatings[p.deviceRatings.length - 1]!;
      return {
        ok: true,
        rule: 'IEC 60364-4-43 433.1',
        note: `design current ${design.toFixed(1)} A is above the largest ${p.deviceList} (${top} A): ${dev.type === 'gG-fuse' ? 'a larger fuse' : 'a circuit-breaker to IEC 60947-2'} with I_B ≤ I_n ≤ I_z and I₂ ≤ 1.45·I_z is needed (not in these tables)`,
      };
    }
    const k = dev.i2Multiple(rating);
    const i2 = k * rating;
    const okIn = rating <= izTotal * (1 + EPS);
    const okI2 = i2 <= 1.45 * izTotal * (1 + EPS);
    const coordination = { ib: design, in: rating, iz: izTotal, i2, ok: okIn && okI2 };
    const steps = `I_B ${design.toFixed(1)} A ≤ I_n ${rating} A ${okIn ? '≤' : '>'} I_z ${izTotal.toFixed(1)} A; I₂ = ${k}·I_n = ${i2.toFixed(1)} A ${okI2 ? '≤' : '>'} 1.45·I_z = ${(1.45 * izTotal).toFixed(1)} A (${dev.i2Cite})`;
    const dcWords = p.kind === 'dc' ? '; on DC use a device rated for DC at this voltage' : '';
    return {
      rating,
      ok: okIn && okI2,
      rule: 'IEC 60364-4-43 433.1',
      coordination,
      note: `${dev.words}, smallest ${p.deviceList} ≥ I_B: ${steps} (IEC 60364-4-43 433.1)${dcWords}`,
    };
  }
  const ratings = p.deviceRatings;
  if (dc.basis === 'motor-branch' && dc.motors?.length) {
    const m = motorBranchDevice(spec, ratings, dc.motors[0]!.flc);
    return {
      ...(m.rating !== undefined ? { rating: m.rating } : {}),
      ok: m.rating !== undefined,
      rule: 'NEC Table 430.52(C)(1)',
      note: `motor branch-circuit short-circuit and ground-fault protection, ${m.words}; the conductor is protected against overload by the motor's overload device (430.32; 240.4(G))`,
    };
  }
  if (dc.basis === 'motor-feeder' && dc.motors?.length) {
    const branch = dc.motors.map((m) => motorBranchDevice(spec, ratings, m.flc).rating ?? 0);
    const largestIdx = branch.indexOf(Math.max(...branch));
    const others = dc.motors.reduce((s, m, i) => (i === largestIdx ? s : s + m.flc), 0) + (dc.otherLoads ?? 0);
    const max = branch[largestIdx]! + others;
    const below = [...ratings].reverse().find((r) => r <= max * (1 + EPS));
    return {
      ...(below !== undefined ? { rating: below } : {}),
      ok: below !== undefined,
      rule: 'NEC 430.62(A)',
      note: `motor feeder: not greater than the largest branch-circuit device (${branch[largestIdx]} A) + the other motors' full-load currents and other loads (${others.toFixed(1)} A) = ${max.toFixed(1)} A (NEC 430.62(A)): ${below ?? '—'} A`,
    };
  }
  const rating = smallestAtLeast(ratings, design);
  if (rating === undefined) {
    return { ok: true, rule: 'NEC 240.6(A)', note: `design current ${design.toFixed(1)} A is above the largest standard rating (${ratings[ratings.length - 1]} A) in ${p.deviceList}` };
  }
  const need = `smallest ${p.deviceList} rating ≥ the design current ${design.toFixed(1)} A (NEC 210.20(A) / 215.3)`;
  // 240.4(D) limits the device per conductor (never multiplied by parallel sets).
  if (cand.deviceLimit !== undefined && rating > cand.deviceLimit) {
    return { rating, ok: false, rule: 'NEC 240.4(D)', note: `${need} is ${rating} A, above the NEC 240.4(D) limit of ${cand.deviceLimit} A on ${cand.size.label} ${spec.material}` };
  }
  const d = cand.deviceLimit !== undefined ? ` and within the NEC 240.4(D) limit of ${cand.deviceLimit} A` : '';
  const dcWords = p.kind === 'dc' ? '; on DC use a fuse or breaker rated for DC at this voltage' : '';
  if (rating <= izTotal * (1 + EPS)) {
    return { rating, ok: true, rule: 'NEC 240.4', note: `${need}: ${rating} A ≤ ampacity ${izTotal.toFixed(1)} A (240.4)${d}${dcWords}` };
  }
  // 240.4(B): all three conditions.
  const nextAbove = ratings.find((r) => r > izTotal * (1 + EPS));
  const why: string[] = [];
  if (spec.multioutletBranch) why.push('the circuit is a multioutlet branch circuit for cord-and-plug loads (240.4(B)(1))');
  if (isStandard(ratings, izTotal)) why.push(`the ampacity ${fmt(izTotal)} A is itself a standard rating (240.4(B)(2))`);
  if (rating !== nextAbove) why.push(`${rating} A is not the next standard rating above the ampacity ${izTotal.toFixed(1)} A, which is ${nextAbove ?? '—'} A (240.4(B)(2))`);
  if (rating > 800) why.push(`${rating} A is above 800 A (240.4(B)(3); 240.4(C) then requires the device within the ampacity)`);
  if (why.length === 0) {
    return {
      rating,
      ok: true,
      rule: 'NEC 240.4(B)',
      note: `${need}: ${rating} A, the next standard rating above the ampacity ${izTotal.toFixed(1)} A, which matches no standard rating (NEC 240.4(B), 800 A or less)${d}${dcWords}`,
    };
  }
  return { rating, ok: false, rule: 'NEC 240.4', note: `${need} is ${rating} A, above the ampacity ${izTotal.toFixed(1)} A: ${why.join('; ')}` };
}

/** The method's voltage drop at the design basis current (see the file header), V and % of nominal. */
export function methodDrop(p: PreparedConductor, cand: Candidate, current: number, length: number, nominal: number, angle: LinkAngle): { volts: number; percent: number } {
  const perSet = current / p.parallelSets;
  const ze = p.kind === 'dc' ? cand.rMethod : cand.rMethod * angle.cos + cand.x * angle.sin;
  const k = p.kind === 'ac3' ? SQRT3 : 2;
  const volts = k * perSet * ze * length;
  return { volts, percent: nominal > 0 ? (100 * volts) / nominal : Infinity };
}

/** Work a candidate out for the design current. */
export function evaluate(p: PreparedConductor, cand: Candidate, dc: DesignCurrent, length: number, limitPercent: number, nominal: number, angle: LinkAngle): Evaluation {
  const sets = p.parallelSets;
  const designPer = dc.design / sets;
  const basePer = dc.base / sets;
  let termination: Evaluation['termination'];
  let terminationLimit: number | undefined;
  let ampacity: number;
  let ampacityOk: boolean;
  if (p.spec.system === 'nec') {
    termination = terminationOf(p, cand, dc.design);
    terminationLimit = cand.columns[termination.rating] ?? cand.table;
    ampacity = Math.min(cand.corrected, terminationLimit);
    ampacityOk = dc.stacked
      ? ampacity >= designPer * (1 - EPS)
      : terminationLimit >= designPer * (1 - EPS) && cand.corrected >= basePer * (1 - EPS);
  } else {
    ampacity = cand.corrected;
    ampacityOk = cand.corrected >= designPer * (1 - EPS);
  }
  const izTotal = ampacity * sets;
  const device = chooseDevice(p, cand, dc, izTotal);
  const check = methodDrop(p, cand, dc.base, length, nominal, angle);
  const dropOk = check.percent <= limitPercent * (1 + EPS);
  return { candidate: cand, ...(termination ? { termination } : {}), ...(terminationLimit !== undefined ? { terminationLimit } : {}), ampacity, izTotal, ampacityOk, device, check, dropOk };
}

export type Choice =
  | { ok: true; chosen: Evaluation; governing: GoverningRule; rejected: { label: string; why: string }[] }
  | { ok: false; field: string; message: string; value: unknown };

/** Why a size fails, in the order the checks are made (ampacity, device, drop). */
function why(e: Evaluation, p: PreparedConductor, dc: DesignCurrent, limit: number): string {
  const sets = p.parallelSets;
  const cand = e.candidate;
  if (!e.ampacityOk) {
    const designPer = dc.design / sets;
    if (p.spec.system === 'iec') return `corrected capacity ${cand.corrected.toFixed(1)} A is below the design current ${designPer.toFixed(1)} A`;
    if (dc.stacked) return `ampacity ${e.ampacity.toFixed(1)} A (after corrections and the ${e.termination!.rating} °C termination column) is below ${designPer.toFixed(1)} A`;
    if (e.terminationLimit! < designPer * (1 - EPS)) return `${e.termination!.rating} °C column ${e.terminationLimit} A is below the design current ${designPer.toFixed(1)} A`;
    return `corrected ampacity ${cand.corrected.toFixed(1)} A is below the load current ${(dc.base / sets).toFixed(1)} A`;
  }
  if (!e.device.ok) return e.device.note;
  return `drop ${e.check.percent.toFixed(2)} % exceeds ${limit} %`;
}

/** The smallest size that meets ampacity, protection and the drop check, or why none does. */
export function choose(p: PreparedConductor, e: CableStage, dc: DesignCurrent, limitPercent: number, nominal: number, angle: LinkAngle): Choice {
  const evals = p.candidates.map((cand) => evaluate(p, cand, dc, e.length, limitPercent, nominal, angle));
  if (!p.auto) return { ok: true, chosen: evals[0]!, governing: 'fixed', rejected: [] };
  const firstAmp = evals.findIndex((x) => x.ampacityOk);
  const sets = p.parallelSets;
  const setWords = `${sets} set${sets === 1 ? '' : 's'}`;
  if (firstAmp < 0) {
    const top = evals[evals.length - 1]!;
    return {
      ok: false,
      field: 'parallelSets',
      value: sets,
      message: `needs ${dc.design.toFixed(1)} A (${dc.rule}), more than the largest listed size, ${top.candidate.size.label} ${p.spec.material}, can carry in ${setWords} (${top.izTotal.toFixed(1)} A after corrections): add parallel sets, raise the voltage or split the load`,
    };
  }
  const chosenAt = evals.findIndex((x) => x.ampacityOk && x.device.ok && x.dropOk);
  if (chosenAt < 0) {
    const top = evals[evals.length - 1]!;
    if (!evals.some((x) => x.ampacityOk && x.device.ok)) return { ok: false, field: 'conductor.size', value: 'auto', message: `no listed size can be protected: ${top.device.note}` };
    return {
      ok: false,
      field: 'conductor.maxDropPercent',
      value: limitPercent,
      message: `even the largest listed size, ${top.candidate.size.label} ${p.spec.material} in ${setWords}, drops ${top.check.percent.toFixed(2)} % at ${dc.base.toFixed(1)} A, more than the allowed ${limitPercent} %: add parallel sets, shorten the run, raise the voltage or allow more drop`,
    };
  }
  // The rule that governs is the one the next smaller size fails: the working names it beside
  // every smaller size's own reason, so the two can never disagree.
  const below = chosenAt > 0 ? evals[chosenAt - 1]! : undefined;
  const governing: GoverningRule = !below ? 'smallest-size' : !below.ampacityOk ? 'ampacity' : !below.device.ok ? 'protection' : 'voltage-drop';
  const rejected = evals.slice(0, chosenAt).map((x) => ({ label: x.candidate.size.label, why: why(x, p, dc, limitPercent) }));
  return { ok: true, chosen: evals[chosenAt]!, governing, rejected };
}

/** The voltage-drop approximation I·(R·cosθ + X·sinθ)·L × 2 (DC, 1φ) or × √3 (3φ), V. */
export function approximateDrop(kind: PortKind, current: number, sets: number, length: number, r: number, x: number, sOut: Complex): number {
  const sMag = abs(sOut);
  const cos = sMag > 0 ? sOut.re / sMag : 1;
  const sin = sMag > 0 ? sOut.im / sMag : 0;
  const perSet = current / sets;
  if (kind === 'dc') return 2 * perSet * r * length;
  const k = kind === 'ac3' ? SQRT3 : 2;
  return k * perSet * length * (r * cos + x * sin);
}

const GOVERNING_WORDS: Record<GoverningRule, string> = {
  ampacity: 'ampacity governs: the next smaller size cannot carry the design current',
  'voltage-drop': 'voltage drop governs: the next smaller size carries the design current but drops too much',
  protection: 'protection governs: the next smaller size carries the design current but no device rule lets it be protected',
  'smallest-size': 'the smallest listed size meets every requirement',
  fixed: 'size fixed by the user; checked, not chosen',
};

/** What the operating point gives a link: from the chain solved with the chosen sizes. */
export interface Operating {
  vIn: Complex;
  vOut: Complex;
  sOut: Complex;
  /** Resistance per metre the solve used (at the estimated operating temperature). */
  rUsed: number;
  temperature: number;
  loss: number;
}

/** The full result of a link: the sizing for its design current and the operating figures beside it. */
export function conductorResult(
  p: PreparedConductor,
  e: CableStage,
  choice: Extract<Choice, { ok: true }>,
  dc: DesignCurrent,
  limitPercent: number,
  nominal: number,
  angle: LinkAngle,
  op: Operating,
): ConductorResult {
  const ev = choice.chosen;
  const cand = ev.candidate;
  const kind = p.kind;
  const sets = p.parallelSets;
  const m = phaseCount(kind);
  const vsMag = abs(op.vIn);
  const vrMag = abs(op.vOut);
  const current = vrMag > 0 ? abs(op.sOut) / m / vrMag : 0;
  const lineFactor = kind === 'ac3' ? SQRT3 : 1;
  const sending = vsMag * lineFactor;
  const exactVolts = (vsMag - vrMag) * lineFactor;
  const exactPercent = sending > 0 ? (100 * exactVolts) / sending : 0;
  const approxVolts = approximateDrop(kind, current, sets, e.length, op.rUsed, cand.x, op.sOut);
  const approxPercent = sending > 0 ? (100 * approxVolts) / sending : 0;
  const nec = p.spec.system === 'nec';
  const kindWords = kind === 'dc' ? 'DC current' : 'line current';
  const nominalWords = `${fmt(nominal)} V${kind === 'ac3' ? ' line-to-line' : ''}`;
  const steps: ConductorStep[] = [];
  const step = (label: string, value: number | string, unit: string, note: string) => steps.push({ label, value, unit, note });
  step('Design current', dc.design, 'A', dc.rule + (dc.fallback ? `; the equipment rule could not be used: ${dc.fallback}` : ''));
  step('Operating current', current, 'A', `${kindWords} through the link in the solved chain (for the heat and the exact drop; not the sizing basis)`);
  if (sets > 1) step('Design current per set', dc.design / sets, 'A', `${sets} identical sets in parallel share it equally${p.excluded ? `; ${p.excluded}` : ''}`);
  step('Table ampacity', cand.table, 'A', `${cand.size.label}: ${p.column}`);
  step('Ambient factor', p.ambientFactor, '', `${p.ambient} °C ambient`);
  step(nec ? 'Adjustment factor' : 'Grouping factor', p.groupingFactor, '', p.groupingNote);
  step('Corrected ampacity', cand.corrected, 'A', `${cand.table} A × ${p.ambientFactor} × ${p.groupingFactor} per conductor`);
  if (ev.termination && ev.terminationLimit !== undefined) {
    step('Termination column', ev.terminationLimit, 'A', `${cand.size.label} in the ${ev.termination.rating} °C column: ${ev.termination.rule}`);
  }
  const ampRule = !nec
    ? `must be at least the design current${ev.ampacityOk ? ' ✓' : ' ✗'}`
    : dc.stacked
      ? `after corrections and the termination column, must be at least the design current (${dc.basis === 'drive-input' ? 'NEC 430.122(A)' : dc.basis === 'motor-feeder' ? 'NEC 430.24' : 'NEC 430.22'})${ev.ampacityOk ? ' ✓' : ' ✗'}`
      : `the termination column must carry the design current before corrections and the corrected ampacity the load current (NEC 210.19(A)(1)(a)/(b), 215.2(A)(1))${ev.ampacityOk ? ' ✓' : ' ✗'}`;
  step('Ampacity of the link', ev.izTotal, 'A', `${ev.ampacity.toFixed(1)} A per set × ${sets} set${sets === 1 ? '' : 's'}; ${ampRule}`);
  const shownRating = ev.device.ok ? ev.device.rating : undefined;
  step('Protective device', shownRating ?? '—', shownRating === undefined ? '' : 'A', `${ev.device.note} (${p.deviceList})`);
  step(
    'Voltage drop, check',
    ev.check.volts,
    'V',
    `${p.methodCite}, at ${dc.base.toFixed(1)} A${kind === 'dc' ? '' : `, cosθ = ${angle.cos.toFixed(3)}`}: ${ev.check.percent.toFixed(3)} % of ${nominalWords}; allowed ${limitPercent} % ${ev.dropOk ? '✓' : '✗'}`,
  );
  step(
    'Conductor temperature (estimate)',
    op.temperature,
    '°C',
    `T = T_a + (T_max − T_a)·(I/I_z)² = ${p.ambient} + (${p.tMax} − ${p.ambient})·(${(current / sets).toFixed(2)}/${cand.corrected.toFixed(1)})², at the operating current (typical estimate)`,
  );
  step(
    'Resistance at that temperature',
    op.rUsed * 1000,
    'Ω/km',
    `R_T = R_${p.tRef}·(1 + α(T − ${p.tRef})) = ${(cand.rRef * 1000).toPrecision(4)} Ω/km × (1 + ${p.alpha}·(${op.temperature.toFixed(1)} − ${p.tRef})), one conductor (${p.resistanceCite})`,
  );
  if (kind !== 'dc') step('Reactance', cand.x * 1000, 'Ω/km', `one conductor (${p.reactanceCite})`);
  step('Voltage drop, solved chain', exactVolts, 'V', `estimate at the operating temperature: |V_send| − |V_receive| from the phasor solve, ${exactPercent.toFixed(3)} % of ${sending.toFixed(1)} V${kind === 'ac3' ? ' line-to-line' : ''}`);
  const formula =
    kind === 'dc'
      ? `2 × ${e.length} m × ${(op.rUsed * 1000).toPrecision(4)} Ω/km × ${(current / sets).toFixed(2)} A (DC loop)`
      : `${kind === 'ac3' ? '√3' : '2'} × I·(R·cosθ + X·sinθ)·L at the operating current and temperature`;
  step('Voltage drop, approximate', approxVolts, 'V', `${formula}: ${approxPercent.toFixed(3)} %`);
  step('Loss', op.loss, 'W', `I²R of the ${kind === 'ac3' ? 'three phase conductors' : 'go and return conductors'}${sets > 1 ? `, all ${sets} sets` : ''}, at the operating current`);
  const rejectedWords = choice.rejected.length ? `; ${choice.rejected.slice(-2).map((r) => `${r.label}: ${r.why}`).join('; ')}` : '';
  step('Size', cand.size.label, '', `${GOVERNING_WORDS[choice.governing]}${rejectedWords}`);
  return {
    system: p.spec.system,
    material: p.spec.material,
    size: cand.size.label,
    areaMm2: cand.size.areaMm2,
    auto: p.auto,
    governing: choice.governing,
    parallelSets: sets,
    current,
    operatingCurrent: current,
    designCurrent: dc.design,
    designBasis: { basis: dc.basis, baseCurrent: dc.base, factor: dc.factor, stacked: dc.stacked, rule: dc.rule, ...(dc.fallback ? { fallback: dc.fallback } : {}) },
    nominalVoltage: nominal,
    ampacity: {
      table: cand.table,
      column: p.column + (ev.termination ? `, limited by the ${ev.termination.rating} °C termination column` : ''),
      ambientFactor: p.ambientFactor,
      groupingFactor: p.groupingFactor,
      corrected: cand.corrected,
      ...(ev.terminationLimit !== undefined ? { terminationLimit: ev.terminationLimit } : {}),
      ...(ev.termination ? { terminationColumn: ev.termination } : {}),
      perSet: ev.ampacity,
      total: ev.izTotal,
    },
    drop: {
      exactVolts,
      exactPercent,
      approxVolts,
      approxPercent,
      differenceVolts: approxVolts - exactVolts,
      differencePercent: approxPercent - exactPercent,
      limitPercent,
      checkVolts: ev.check.volts,
      checkPercent: ev.check.percent,
      checkMethod: `${p.methodCite}, at ${dc.base.toFixed(1)} A, % of ${nominalWords}`,
    },
    resistance: {
      referencePerKm: cand.rRef * 1000,
      referenceTemperature: p.tRef,
      operatingTemperature: op.temperature,
      perKm: op.rUsed * 1000,
      method: `R_T = R_ref·(1 + α(T − T_ref)), α = ${p.alpha}/°C referred to ${p.tRef} °C; T = T_a + (T_max − T_a)·(I/I_z)² (typical estimate)`,
    },
    reactancePerKm: kind === 'dc' ? 0 : cand.x * 1000,
    loss: op.loss,
    device: {
      // A device the rules do not allow on this size (a fixed size) is not shown as a rating.
      ...(ev.device.rating !== undefined && ev.device.ok ? { rating: ev.device.rating } : {}),
      list: p.deviceList,
      note: ev.device.note,
      rule: ev.device.rule,
      ...(ev.device.coordination ? { coordination: ev.device.coordination } : {}),
    },
    steps,
    caution: CAUTION,
  };
}
