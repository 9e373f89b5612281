/**
 * Size one cable link for its design current (core/conductors/design-current.ts): the ampacity, the
 * protective device and the voltage-drop check are each worked by the code's own method, once,
 * before the chain is solved; the solved chain then gives the operating current, the estimated
 * conductor temperature, the exact drop and the heat, shown beside the check (the link's result
 * and its working: link-result.ts).
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
import type { CableStage, NecConductorSpec } from '../model/project.ts';
import type { GoverningRule } from '../model/result.ts';
import { NEC_430_52_C_1 } from '../data/nec-430-52.ts';
import type { DesignCurrent } from './design-current.ts';
import type { Candidate, PreparedConductor } from './prepare.ts';
import { sigText } from '../model/message.ts';

export const CAUTION =
  'Planning estimate only: terminations, conduit fill, short-circuit withstand and local rules also apply; the final design belongs to a licensed professional under the local code.';

const SQRT3 = Math.sqrt(3);
const EPS = 1e-12;
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
  return `drop ${e.check.percent.toFixed(2)} % exceeds ${sigText(limit, 3)} %`;
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
      message: `even the largest listed size, ${top.candidate.size.label} ${p.spec.material} in ${setWords}, drops ${top.check.percent.toFixed(2)} % at ${dc.base.toFixed(1)} A, more than the allowed ${sigText(limitPercent, 3)} %: add parallel sets, shorten the run, raise the voltage or allow more drop`,
    };
  }
  // The rule that governs is the one the next smaller size fails: the working names it beside
  // every smaller size's own reason, so the two can never disagree.
  const below = chosenAt > 0 ? evals[chosenAt - 1]! : undefined;
  const governing: GoverningRule = !below ? 'smallest-size' : !below.ampacityOk ? 'ampacity' : !below.device.ok ? 'protection' : 'voltage-drop';
  const rejected = evals.slice(0, chosenAt).map((x) => ({ label: x.candidate.size.label, why: why(x, p, dc, limitPercent) }));
  return { ok: true, chosen: evals[chosenAt]!, governing, rejected };
}
