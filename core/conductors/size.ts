/**
 * Size one cable link at a known operating point: the sending voltage phasor V_s (per phase) and the
 * total complex power S delivered by the link (from the chain solve).
 *
 * Methods, each named where it is used:
 * - Exact drop: the two-bus solution of `../ac/two-bus.ts` for the candidate's R + jX, so the drop
 *   is |V_s| − |V_r| with the load's P and Q, the same equations the chain solve uses.
 * - Approximate drop: ΔV ≈ I·(R·cosθ + X·sinθ)·L × 2 (DC and single-phase loop) or × √3 (three-phase,
 *   line-to-line), the effective-impedance method of NEC Chapter 9 Table 9 Note 2 and UFC 3-520-01
 *   App. B-2.1; θ is the load's power-factor angle at the receiving end.
 * - Conductor temperature (common practice, no source): T = T_a + (T_max − T_a)·(I/I_z)², with I_z
 *   the corrected ampacity at which the conductor reaches T_max (losses ∝ I², temperature rise ∝ losses).
 * - Resistance at temperature: R_T = R_ref·(1 + α·(T − T_ref)) (NEC Chapter 9 Table 8 Note 2 with α
 *   referred to 75 °C; IEC 60228 values at 20 °C with α₂₀).
 * - Protective device: the smallest listed rating ≥ the design current, which must not exceed the
 *   ampacity of the link (NEC 240.4; IEC 60364-4-43 433.1 I_B ≤ I_n ≤ I_z). NEC 240.4(B) (next
 *   higher standard rating up to 800 A when the ampacity matches no standard rating) and 240.4(D)
 *   (small-conductor limits) are applied.
 */
import { type Complex, abs, c, scale } from '../ac/complex.ts';
import { receivingVoltage } from '../ac/two-bus.ts';
import type { CableStage, PortKind } from '../model.ts';
import type { ConductorResult, ConductorStep, GoverningRule } from '../result.ts';
import type { Candidate, PreparedConductor } from './prepare.ts';

export const CAUTION =
  'Planning estimate only: terminations, conduit fill, short-circuit withstand and local rules also apply; the final design belongs to a licensed professional under the local code.';

const SQRT3 = Math.sqrt(3);
const phaseCount = (kind: PortKind): number => (kind === 'ac3' ? 3 : 1);
/** Conductors in the per-phase impedance: loop (go and return) on DC and single-phase. */
const loopFactor = (kind: PortKind): number => (kind === 'ac3' ? 1 : 2);

/** A candidate size worked out at the operating point. */
export interface Evaluation {
  candidate: Candidate;
  /** Line (DC) current of the whole link, A (with this candidate in place). */
  current: number;
  designCurrent: number;
  temperature: number;
  /** Resistance of one conductor at temperature, Ω/m. */
  r: number;
  /** |V_s| − |V_r| in line terms (line-to-line on 3φ), V; NaN-free: null when the link would collapse. */
  exactVolts: number | null;
  exactPercent: number | null;
  sendingVolts: number;
  ampacityOk: boolean;
  device: { rating?: number; ok: boolean; note: string };
  dropOk: boolean;
}

/** Resistance at temperature T: R_T = R_ref·(1 + α(T − T_ref)). */
export const resistanceAt = (p: PreparedConductor, cand: Candidate, t: number): number => cand.rRef * (1 + p.alpha * (t - p.tRef));

/** Estimated conductor temperature (common practice): T = T_a + (T_max − T_a)·(I/I_z)². */
export const temperatureAt = (p: PreparedConductor, cand: Candidate, perConductor: number): number =>
  p.ambient + (p.tMax - p.ambient) * (perConductor / cand.corrected) ** 2;

/** Per-phase series impedance of the link for a conductor of r, x Ω/m. */
export function linkImpedance(kind: PortKind, length: number, sets: number, r: number, x: number): Complex {
  const metres = (length * loopFactor(kind)) / sets;
  return c(r * metres, kind === 'dc' ? 0 : x * metres);
}

const deviceWords = (p: PreparedConductor) => (p.spec.system === 'nec' ? 'NEC 240.6(A)' : 'IEC 60898-1');

/** The protective device for a design current and the link's ampacity. */
export function chooseDevice(p: PreparedConductor, cand: Candidate, design: number, izTotal: number): { rating?: number; ok: boolean; note: string } {
  const rating = p.deviceRatings.find((r) => r >= design * (1 - 1e-12));
  if (rating === undefined) {
    const top = p.deviceRatings[p.deviceRatings.length - 1]!;
    return {
      ok: true,
      note:
        p.spec.system === 'iec'
          ? `design current ${design.toFixed(1)} A is above the largest IEC 60898-1 rating (${top} A): a circuit-breaker to IEC 60947-2 or fuses with I_B ≤ I_n ≤ I_z are needed (not in these tables)`
          : `design current ${design.toFixed(1)} A is above the largest standard rating (${top} A) in ${p.deviceList}`,
    };
  }
  const sets = p.parallelSets;
  const limit = cand.deviceLimit === undefined ? undefined : cand.deviceLimit * sets;
  if (limit !== undefined && rating > limit) {
    return { rating, ok: false, note: `NEC 240.4(D) limits the device on ${cand.size.label} ${p.spec.material} to ${cand.deviceLimit} A per set, below ${rating} A` };
  }
  if (rating <= izTotal * (1 + 1e-12)) {
    const d = limit !== undefined ? ` and within the NEC 240.4(D) limit of ${limit} A` : '';
    // Ratings are the standard current steps; on DC the device must also be rated for DC at the
    // circuit voltage (breaking a DC arc is harder; common practice, e.g. IEC 60898-2 / UL 489 DC ratings).
    const dc = p.kind === 'dc' ? '; on DC use a fuse or breaker rated for DC at this voltage' : '';
    return { rating, ok: true, note: `smallest ${deviceWords(p)} rating ≥ ${design.toFixed(1)} A; ${rating} A ≤ ampacity ${izTotal.toFixed(1)} A${d}${dc}` };
  }
  if (p.spec.system === 'nec' && rating <= 800) {
    return {
      rating,
      ok: true,
      note: `NEC 240.4(B): the ampacity ${izTotal.toFixed(1)} A matches no standard rating, so the next higher standard rating, ${rating} A, may protect it (≤ 800 A; not for a branch circuit feeding several receptacles for cord-and-plug loads)`,
    };
  }
  return { rating, ok: false, note: `the smallest ${deviceWords(p)} rating ≥ ${design.toFixed(1)} A is ${rating} A, above the ampacity ${izTotal.toFixed(1)} A` };
}

/**
 * Work a candidate out at the operating point. The current depends on the receiving voltage, which
 * depends on R at the temperature the current sets: solved by a short fixed-point iteration (the
 * map contracts strongly: a change in R moves the current by about the drop fraction times as much).
 */
export function evaluate(p: PreparedConductor, cand: Candidate, length: number, limitPercent: number, vIn: Complex, sOut: Complex): Evaluation {
  const kind = p.kind;
  const m = phaseCount(kind);
  const sets = p.parallelSets;
  const sPhase = scale(sOut, 1 / m);
  const vsMag = abs(vIn);
  const sendingVolts = kind === 'ac3' ? vsMag * SQRT3 : vsMag;
  let current = vsMag > 0 ? abs(sPhase) / vsMag : 0;
  let t = temperatureAt(p, cand, current / sets);
  let r = resistanceAt(p, cand, t);
  let vr: Complex | null = null;
  for (let k = 0; k < 60; k++) {
    vr = receivingVoltage(vIn, linkImpedance(kind, length, sets, r, cand.x), sPhase);
    if (vr === null) break;
    const vrMag = abs(vr);
    current = vrMag > 0 ? abs(sPhase) / vrMag : 0;
    const tNext = temperatureAt(p, cand, current / sets);
    const rNext = resistanceAt(p, cand, tNext);
    const done = Math.abs(rNext - r) <= 1e-14 * r;
    t = tNext;
    r = rNext;
    if (done) break;
  }
  const perSet = current / sets;
  const design = current * p.continuousFactor;
  // NEC: corrected insulation-column ampacity ≥ I and termination column ≥ I × continuous factor
  // (210.19(A)(1): the larger of the two conditions, not their product). IEC: I_z ≥ I_B × factor.
  const ampacityOk =
    cand.terminationLimit !== undefined
      ? cand.corrected >= perSet * (1 - 1e-12) && cand.terminationLimit >= perSet * p.continuousFactor * (1 - 1e-12)
      : cand.corrected >= perSet * p.continuousFactor * (1 - 1e-12);
  const izTotal = cand.ampacity * sets;
  const device = chooseDevice(p, cand, design, izTotal);
  let exactVolts: number | null = null;
  let exactPercent: number | null = null;
  if (vr !== null && vsMag > 0) {
    const dv = vsMag - abs(vr);
    exactVolts = kind === 'ac3' ? dv * SQRT3 : dv;
    exactPercent = (100 * dv) / vsMag;
  }
  const dropOk = exactPercent !== null && exactPercent <= limitPercent * (1 + 1e-12);
  return { candidate: cand, current, designCurrent: design, temperature: t, r, exactVolts, exactPercent, sendingVolts, ampacityOk, device, dropOk };
}

export type Choice =
  | { ok: true; chosen: Evaluation; governing: GoverningRule; rejected: { label: string; why: string }[] }
  | { ok: false; field: string; message: string; value: unknown };

function why(e: Evaluation, p: PreparedConductor, limit: number): string {
  const cand = e.candidate;
  const perSet = e.current / p.parallelSets;
  if (!e.ampacityOk) {
    if (cand.terminationLimit === undefined) return `corrected capacity ${cand.corrected.toFixed(1)} A is below the design current ${(perSet * p.continuousFactor).toFixed(1)} A`;
    if (cand.corrected < perSet) return `corrected ampacity ${cand.corrected.toFixed(1)} A is below the load current ${perSet.toFixed(1)} A`;
    return `its termination-column ampacity ${cand.terminationLimit} A is below ${p.continuousFactor > 1 ? '125 % of ' : ''}the load current, ${(perSet * p.continuousFactor).toFixed(1)} A`;
  }
  if (!e.device.ok) return e.device.note;
  return e.exactPercent === null ? 'the voltage would collapse' : `drop ${e.exactPercent.toFixed(2)} % exceeds ${limit} %`;
}

/**
 * Pick the smallest size, from `startAt` (a position on the ladder; sizes never shrink between
 * passes of the chain solve) upward, that meets ampacity, protection and voltage drop.
 */
export function choose(p: PreparedConductor, e: CableStage, limitPercent: number, vIn: Complex, sOut: Complex, startAt: number): Choice {
  const evals = p.candidates.map((cand) => evaluate(p, cand, e.length, limitPercent, vIn, sOut));
  if (!p.auto) {
    const only = evals[0]!;
    return { ok: true, chosen: only, governing: 'fixed', rejected: [] };
  }
  const firstAmp = evals.findIndex((x) => x.ampacityOk);
  if (firstAmp < 0) {
    const top = evals[evals.length - 1]!;
    return {
      ok: false,
      field: 'parallelSets',
      value: p.parallelSets,
      message: `carries ${top.current.toFixed(1)} A${p.continuousFactor > 1 ? ` (${top.designCurrent.toFixed(1)} A with the 125 % continuous factor)` : ''}, more than the largest listed size, ${top.candidate.size.label} ${p.spec.material}, can carry in ${p.parallelSets} set${p.parallelSets === 1 ? '' : 's'} (${(top.candidate.ampacity * p.parallelSets).toFixed(1)} A after corrections): add parallel sets, raise the voltage or split the load`,
    };
  }
  const firstProt = evals.findIndex((x, i) => i >= firstAmp && x.device.ok);
  const firstAll = evals.findIndex((x, i) => i >= Math.max(startAt, firstAmp) && x.ampacityOk && x.device.ok && x.dropOk);
  if (firstAll < 0) {
    const top = evals[evals.length - 1]!;
    if (firstProt < 0) return { ok: false, field: 'conductor.size', value: 'auto', message: `no listed size can be protected: ${top.device.note}` };
    return {
      ok: false,
      field: 'conductor.maxDropPercent',
      value: limitPercent,
      message: `even the largest listed size, ${top.candidate.size.label} ${p.spec.material} in ${p.parallelSets} set${p.parallelSets === 1 ? '' : 's'}, ${top.exactPercent === null ? 'cannot carry the load without voltage collapse' : `drops ${top.exactPercent.toFixed(2)} %`}, more than the allowed ${limitPercent} %: add parallel sets, shorten the run, raise the voltage or allow more drop`,
    };
  }
  const fresh = evals.findIndex((x) => x.ampacityOk && x.device.ok && x.dropOk);
  let governing: GoverningRule;
  if (fresh === 0) governing = 'smallest-size';
  else if (fresh === firstAmp) governing = 'ampacity';
  else if (fresh === firstProt) governing = 'protection';
  else governing = 'voltage-drop';
  const rejected = evals.slice(0, firstAll).map((x, i) => ({
    label: x.candidate.size.label,
    why: i >= fresh ? 'meets every requirement at the final operating point, but an earlier pass of the chain solve needed a larger size (sizes only grow, so the loop ends)' : why(x, p, limitPercent),
  }));
  return { ok: true, chosen: evals[firstAll]!, governing, rejected };
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
  ampacity: 'ampacity governs: every smaller size is too small for the current',
  'voltage-drop': 'voltage drop governs: smaller sizes carry the current but drop too much',
  protection: 'protection governs: smaller sizes carry the current but no standard device fits between the current and their ampacity',
  'smallest-size': 'the smallest listed size meets every requirement',
  fixed: 'size fixed by the user; checked, not chosen',
};

/**
 * The full result of a link from the final operating point. `vOut` is the receiving voltage the
 * chain solve found with this conductor in place; `rUsed` the resistance per metre the solve used.
 */
export function conductorResult(
  p: PreparedConductor,
  e: CableStage,
  choice: Extract<Choice, { ok: true }>,
  limitPercent: number,
  vIn: Complex,
  vOut: Complex,
  sOut: Complex,
  rUsed: number,
  loss: number,
): ConductorResult {
  const ev = choice.chosen;
  const cand = ev.candidate;
  const kind = p.kind;
  const sets = p.parallelSets;
  const m = phaseCount(kind);
  const vsMag = abs(vIn);
  const vrMag = abs(vOut);
  const current = vrMag > 0 ? abs(sOut) / m / vrMag : 0;
  const lineFactor = kind === 'ac3' ? SQRT3 : 1;
  const sending = vsMag * lineFactor;
  const exactVolts = (vsMag - vrMag) * lineFactor;
  const exactPercent = sending > 0 ? (100 * exactVolts) / sending : 0;
  const approxVolts = approximateDrop(kind, current, sets, e.length, rUsed, cand.x, sOut);
  const approxPercent = sending > 0 ? (100 * approxVolts) / sending : 0;
  const design = current * p.continuousFactor;
  const izTotal = cand.ampacity * sets;
  const device = chooseDevice(p, cand, design, izTotal);
  const t = ev.temperature;
  const nec = p.spec.system === 'nec';
  const kindWords = kind === 'dc' ? 'DC current' : 'line current';
  const steps: ConductorStep[] = [];
  const step = (label: string, value: number | string, unit: string, note: string) => steps.push({ label, value, unit, note });
  step('Load current', current, 'A', `${kindWords} through the link, from the chain solve with this conductor in place`);
  if (sets > 1) step('Current per set', current / sets, 'A', `${sets} identical sets in parallel share it equally`);
  step(
    'Design current',
    design,
    'A',
    p.continuousFactor > 1
      ? nec
        ? '125 % of the continuous load (NEC 210.19(A)(1) / 215.2(A)(1)), checked against the termination column before corrections'
        : '125 % continuous factor chosen by the user (not an IEC 60364 rule), applied to the design current'
      : 'no continuous-load factor',
  );
  step('Table ampacity', cand.table, 'A', `${cand.size.label}: ${p.column}`);
  step('Ambient factor', p.ambientFactor, '', `${p.ambient} °C ambient`);
  step(nec ? 'Adjustment factor' : 'Grouping factor', p.groupingFactor, '', p.groupingNote);
  step('Corrected ampacity', cand.corrected, 'A', `${cand.table} A × ${p.ambientFactor} × ${p.groupingFactor} per conductor`);
  if (cand.terminationLimit !== undefined) {
    step('Termination limit', cand.terminationLimit, 'A', `Table value in the termination column (NEC 110.14(C)); the conductor's ampacity is the lower of this and the corrected value`);
  }
  step('Ampacity of the link', izTotal, 'A', `${cand.ampacity.toFixed(1)} A per set × ${sets} set${sets === 1 ? '' : 's'}; must be at least the load current${nec && p.continuousFactor > 1 ? ' (and the termination column at least the design current)' : p.continuousFactor > 1 ? ' × 1.25' : ''}${ev.ampacityOk ? ' ✓' : ' ✗ (exceeded)'}`);
  step('Protective device', device.rating ?? '—', device.rating === undefined ? '' : 'A', `${device.note} (${p.deviceList})`);
  step(
    'Conductor temperature',
    t,
    '°C',
    `estimated T = T_a + (T_max − T_a)·(I/I_z)² = ${p.ambient} + (${p.tMax} − ${p.ambient})·(${(current / sets).toFixed(2)}/${cand.corrected.toFixed(1)})² (common practice, no source)`,
  );
  step(
    'Resistance at temperature',
    rUsed * 1000,
    'Ω/km',
    `R_T = R_${p.tRef}·(1 + α(T − ${p.tRef})) = ${(cand.rRef * 1000).toPrecision(4)} Ω/km × (1 + ${p.alpha}·(${t.toFixed(1)} − ${p.tRef})), one conductor (${p.resistanceCite})`,
  );
  if (kind !== 'dc') step('Reactance', cand.x * 1000, 'Ω/km', `one conductor (${p.reactanceCite})`);
  step('Voltage drop, exact', exactVolts, 'V', `|V_send| − |V_receive| from the phasor solve: ${exactPercent.toFixed(3)} % of ${sending.toFixed(1)} V${kind === 'ac3' ? ' line-to-line' : ''}; allowed ${limitPercent} %`);
  const formula =
    kind === 'dc'
      ? `2 × ${e.length} m × ${(rUsed * 1000).toPrecision(4)} Ω/km × ${(current / sets).toFixed(2)} A (DC loop)`
      : `${kind === 'ac3' ? '√3' : '2'} × I·(R·cosθ + X·sinθ)·L, cosθ = ${(abs(sOut) > 0 ? sOut.re / abs(sOut) : 1).toFixed(3)} (NEC Chapter 9 Table 9 Note 2 / UFC 3-520-01 App. B-2.1)`;
  step('Voltage drop, approximate', approxVolts, 'V', `${formula}: ${approxPercent.toFixed(3)} %`);
  step('Difference', approxVolts - exactVolts, 'V', `approximation − exact: ${(approxPercent - exactPercent).toFixed(4)} percentage points`);
  step('Loss', loss, 'W', `I²R of the ${kind === 'ac3' ? 'three phase conductors' : 'go and return conductors'}${sets > 1 ? `, all ${sets} sets` : ''}`);
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
    designCurrent: design,
    ampacity: {
      table: cand.table,
      column: p.column,
      ambientFactor: p.ambientFactor,
      groupingFactor: p.groupingFactor,
      corrected: cand.corrected,
      ...(cand.terminationLimit !== undefined ? { terminationLimit: cand.terminationLimit } : {}),
      perSet: cand.ampacity,
      total: izTotal,
    },
    drop: {
      exactVolts,
      exactPercent,
      approxVolts,
      approxPercent,
      differenceVolts: approxVolts - exactVolts,
      differencePercent: approxPercent - exactPercent,
      limitPercent,
    },
    resistance: {
      referencePerKm: cand.rRef * 1000,
      referenceTemperature: p.tRef,
      operatingTemperature: t,
      perKm: rUsed * 1000,
      method: `R_T = R_ref·(1 + α(T − T_ref)), α = ${p.alpha}/°C referred to ${p.tRef} °C; T = T_a + (T_max − T_a)·(I/I_z)² (common practice)`,
    },
    reactancePerKm: kind === 'dc' ? 0 : cand.x * 1000,
    loss,
    device: { ...(device.rating !== undefined ? { rating: device.rating } : {}), list: p.deviceList, note: device.note },
    steps,
    caution: CAUTION,
  };
}
