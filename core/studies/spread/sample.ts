/**
 * One sample of the runtime spread: the draws (Monte Carlo, uniform within each tolerance) and the
 * changed project they make, as a change core/solve/variant.ts checks and applies.
 *
 * Sampling: simple Monte Carlo. Sample i takes its draws from pure-rand's xoroshiro128plus seeded
 * with the user's seed, advanced past the draws of samples 0…i−1 (skipN), so a sample is the same
 * whichever chunk runs it. Each input is drawn as z uniform on [−1, 1] (pure-rand's uniformFloat64,
 * 53 bits, scaled): a tolerance band with no preferred value inside it, the usual reading of a
 * maker's ± tolerance (common practice (no source)). The inputs are drawn independently.
 */
import { xoroshiro128plus } from 'pure-rand/generator/xoroshiro128plus';
import { uniformFloat64 } from 'pure-rand/distribution/uniformFloat64';
import { skipN } from 'pure-rand/utils/skipN';
import type { BackupStudy, BatteryBankSpec, BatterySource, Element, LoadSetting, LossModel } from '../../model/project.ts';
import type { ValidProject } from '../../solve/validate.ts';
import type { VariantChange } from '../../solve/variant.ts';
import { resolveBank } from '../../physics/bank.ts';
import { SPREAD_INPUTS, type SpreadInput, type Tolerances } from './tolerances.ts';

/** Each input's draw, z in [−1, 1] (0: the project's own value; aging: −1 none, +1 the whole tolerance). */
export type Draw = Record<SpreadInput, number>;

/** pure-rand's uniformFloat64 takes two 32-bit outputs per value. */
const OUTPUTS_PER_SAMPLE = 2 * SPREAD_INPUTS.length;

/** The draws of samples from … from + count − 1 for a seed. */
export function drawSamples(seed: number, from: number, count: number): Draw[] {
  const rng = xoroshiro128plus(seed);
  skipN(rng, from * OUTPUTS_PER_SAMPLE);
  const out: Draw[] = [];
  for (let i = 0; i < count; i++) {
    const d = {} as Draw;
    for (const input of SPREAD_INPUTS) d[input] = 2 * uniformFloat64(rng) - 1;
    out.push(d);
  }
  return out;
}

/** The project's own values: every z 0 (aging −1: no capacity lost beyond the project's state of health). */
export const NOMINAL_DRAW: Readonly<Draw> = { capacity: 0, aging: -1, temperature: 0, efficiency: 0, load: 0, endVoltage: 0 };

/** Highest efficiency a shifted curve keeps (a converter never loses nothing). */
const MAX_EFFICIENCY = 0.999;
/** Lowest efficiency a shifted curve keeps (the kinds' schema floor). */
const MIN_EFFICIENCY = 0.01;
const clampEff = (e: number) => Math.min(MAX_EFFICIENCY, Math.max(MIN_EFFICIENCY, e));

/**
 * The loss model with its efficiency moved by `delta` (a fraction: 0.01 = one point).
 * Curves, fitted points and a constant efficiency: each efficiency + delta. The loss polynomial
 * p0 + k1·P + k2·P²: every term scaled by f, chosen so that the efficiency at the reference power
 * (the rated power, else the solved output power, else 1 kW) moves by delta:
 * η = P/(P + L), L' = P·(1/(η + delta) − 1), f = L'/L.
 */
export function shiftEfficiency(loss: LossModel, delta: number, outputW: number | undefined): LossModel {
  if (delta === 0) return loss;
  switch (loss.model) {
    case 'constant':
      return { ...loss, efficiency: clampEff(loss.efficiency + delta) };
    case 'curve':
    case 'polynomial-fit':
      return { ...loss, points: loss.points.map((p) => ({ ...p, efficiency: clampEff(p.efficiency + delta) })) };
    case 'polynomial': {
      const p = loss.ratedPower ?? (outputW !== undefined && outputW > 0 ? outputW : 1000);
      const l = loss.p0 + loss.k1 * p + loss.k2 * p * p;
      if (!(l > 0)) return loss;
      const eta = p / (p + l);
      const f = (p * (1 / clampEff(eta + delta) - 1)) / l;
      return { ...loss, p0: loss.p0 * f, k1: loss.k1 * f, k2: loss.k2 * f };
    }
  }
}

/** A load element with its level scaled by `factor` (the kinds whose level is one number), else null. */
export function scaledLoad(e: Element, factor: number): Element | null {
  switch (e.kind) {
    case 'dc-load':
    case 'ac-load':
    case 'shaft-load':
      return { ...e, power: e.power * factor };
    case 'ac-va-load':
      return { ...e, apparentPower: e.apparentPower * factor };
    case 'dc-current-load':
    case 'ac-current-load':
      return { ...e, current: e.current * factor };
    default:
      return null;
  }
}

/** The kinds whose level the load tolerance scales (the others, circuits and machines, keep theirs). */
export const SCALED_LOAD_KINDS: ReadonlySet<string> = new Set(['dc-load', 'ac-load', 'shaft-load', 'ac-va-load', 'dc-current-load', 'ac-current-load']);

const scaleSetting = (s: LoadSetting, factor: number): LoadSetting => (typeof s === 'number' ? s * factor : s);
const scaleLoads = (loads: Record<string, LoadSetting> | undefined, factor: number) =>
  loads === undefined ? undefined : Object.fromEntries(Object.entries(loads).map(([k, v]) => [k, scaleSetting(v, factor)]));

/** The profile's levels given in W, VA or A scaled with their loads (a share of the rating follows the element). */
function scaledBackup(b: BackupStudy, factor: number): BackupStudy {
  const p = b.profile;
  if (p.kind === 'constant') return b;
  if (p.kind === 'segments') return { ...b, profile: { ...p, segments: p.segments.map((s) => ({ ...s, ...(s.loads ? { loads: scaleLoads(s.loads, factor)! } : {}) })) } };
  return { ...b, profile: { ...p, segments: p.segments.map((s) => ({ ...s, ...(s.loads ? { loads: scaleLoads(s.loads, factor)! } : {}) })) } };
}

/**
 * The bank's end-of-discharge cell voltage (its override, else the chemistry's), kept per bank object:
 * every sample of a spread starts from the same solved project, so from the same bank.
 */
const endVoltages = new WeakMap<BatteryBankSpec, number>();
function endVoltageOf(bank: BatteryBankSpec): number {
  let v = endVoltages.get(bank);
  if (v === undefined) {
    v = resolveBank(bank).values.endOfDischargeCellVoltage;
    endVoltages.set(bank, v);
  }
  return v;
}

/**
 * The change one draw makes (checked and applied by core/solve/variant.ts): each input with a
 * tolerance of 0, or drawn at its project value, changes nothing. `outputW`: each element's solved
 * output power (a loss polynomial without a rating is shifted at it).
 */
export function changeOf(project: ValidProject, tol: Tolerances, d: Draw, outputW: ReadonlyMap<string, number>): VariantChange {
  const replace = new Map<string, Element>();
  const current = (e: Element) => replace.get(e.id) ?? e;
  const capF = 1 + (tol.capacity / 100) * d.capacity;
  const endDv = tol.endVoltage * d.endVoltage;
  const effD = (tol.efficiency / 100) * d.efficiency;
  const loadF = 1 + (tol.load / 100) * d.load;
  for (const e0 of project.elements) {
    let e = current(e0);
    if (e.kind === 'battery' && e.bank && (capF !== 1 || endDv !== 0)) {
      const b: BatterySource = e;
      const bank = { ...b.bank! };
      if (capF !== 1) bank.capacityAh = bank.capacityAh * capF;
      if (endDv !== 0) {
        const end = endVoltageOf(b.bank!);
        bank.overrides = { ...bank.overrides, endOfDischargeCellVoltage: end + endDv };
      }
      e = { ...b, bank };
      replace.set(e.id, e);
    }
    if (effD !== 0 && 'loss' in e && e.loss && typeof e.loss === 'object' && 'model' in e.loss && e.kind !== 'motor') {
      const shifted = shiftEfficiency(e.loss as LossModel, effD, outputW.get(e.id));
      if (shifted !== e.loss) {
        e = { ...e, loss: shifted } as Element;
        replace.set(e.id, e);
      }
    }
    if (loadF !== 1) {
      const s = scaledLoad(e, loadF);
      if (s) replace.set(e.id, s);
    }
  }
  const change: VariantChange = {};
  if (replace.size) change.replace = [...replace.values()];
  const b = project.backup;
  if (b) {
    let next: BackupStudy = b;
    const temperature = tol.temperature * d.temperature;
    if (temperature !== 0) next = { ...next, temperatureC: (b.temperatureC ?? 25) + temperature };
    // Aging: the state of health lower by up to the tolerance, in points of rated capacity.
    const lost = (tol.aging / 100) * ((d.aging + 1) / 2);
    if (lost !== 0) next = { ...next, stateOfHealth: Math.max(0.01, (b.stateOfHealth ?? 1) - lost) };
    if (loadF !== 1) next = scaledBackup(next, loadF);
    if (next !== b) change.backup = next;
  }
  return change;
}

export const isEmptyChange = (c: VariantChange) => c.replace === undefined && c.backup === undefined && c.add === undefined && c.remove === undefined;
