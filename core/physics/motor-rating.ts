/**
 * Motor ratings from presets: full-load efficiency from IEC 60034-30-1 or NEMA MG 1 Table 12-12,
 * or from the nameplate; part-load efficiency and power factor by the common-practice shape of
 * core/data/motor-part-load.ts; the NEC Table 430.250 full-load current where it applies.
 *
 * Methods:
 * - table lookup: a listed rated output takes the table value; between two carried rows the
 *   efficiency is interpolated linearly in log10(rated output) (our interpolation, not a table
 *   value — flagged); outside the carried rows the preset is refused.
 * - part load: η(x) = η_FL·r_η(x), pf(x) = pf_FL·r_pf(x), r interpolated linearly in the load
 *   fraction x between the shape's points and held at its ends.
 */
import type { Problem } from '../model/errors.ts';
import type { MotorEfficiencyClass, MotorStage } from '../model/project.ts';
import type { Provenance } from '../data/conductor-materials.ts';
import { IEC_60034_30_1_4P_50HZ } from '../data/iec-60034-30-1.ts';
import { NEMA_PREMIUM_4P_60HZ_TEFC, WATTS_PER_HP } from '../data/nema-mg1-12-12.ts';
import { NEC_430_250, NEC_430_250_VOLTAGES, type Nec430Voltage } from '../data/nec-430-250.ts';
import { MOTOR_PART_LOAD, TYPICAL_FULL_LOAD_PF } from '../data/motor-part-load.ts';

export const MOTOR_CLASSES: readonly MotorEfficiencyClass[] = ['IE1', 'IE2', 'IE3', 'IE4', 'NEMA-premium'];

/** A full-load efficiency with where it came from. */
export interface FullLoadEfficiency {
  /** 0…1. */
  efficiency: number;
  source: string;
  provenance: Provenance | 'nameplate' | 'interpolated';
}

type Issue = Omit<Problem, 'elementId'>;

/** Relative tolerance for "this rated output is a listed row". */
const ROW_MATCH = 0.005;

function lookupLog(rows: readonly { size: number; eff: number | null; prov: Provenance | null }[], size: number, unit: string, what: string, field: string): FullLoadEfficiency | Issue {
  const carried = rows.filter((r) => r.eff !== null);
  const first = carried[0]!;
  const last = carried[carried.length - 1]!;
  if (size < first.size * (1 - ROW_MATCH) || size > last.size * (1 + ROW_MATCH)) {
    return { code: 'outside-table', field, value: size, message: `${what}: values are carried for ${first.size}–${last.size} ${unit} only; give the nameplate efficiency instead` };
  }
  for (const r of carried) {
    if (Math.abs(size - r.size) <= ROW_MATCH * r.size) return { efficiency: r.eff! / 100, source: `${what}, ${r.size} ${unit}`, provenance: r.prov! };
  }
  let i = 1;
  while (carried[i]!.size < size) i++;
  const a = carried[i - 1]!;
  const b = carried[i]!;
  const t = (Math.log10(size) - Math.log10(a.size)) / (Math.log10(b.size) - Math.log10(a.size));
  const eff = a.eff! + t * (b.eff! - a.eff!);
  return { efficiency: eff / 100, source: `${what}, interpolated in log(size) between ${a.size} and ${b.size} ${unit}`, provenance: 'interpolated' };
}

const isIssue = (x: FullLoadEfficiency | Issue): x is Issue => 'code' in x;

/** Full-load efficiency of a class preset at a rated output (W), or the problem that prevents it. */
export function classEfficiency(cls: MotorEfficiencyClass, ratedOutput: number, poles: number | undefined, frequency: number | undefined): FullLoadEfficiency | Issue {
  if (cls === 'NEMA-premium') {
    if (poles !== 4 || frequency !== 60) {
      return { code: 'outside-table', field: poles !== 4 ? 'poles' : 'ratedFrequency', value: poles !== 4 ? poles : frequency, message: 'the NEMA Premium values carried (MG 1 Table 12-12) are for 4-pole 60 Hz motors: give 4 poles and a rated frequency of 60 Hz, or the nameplate efficiency' };
    }
    const rows = NEMA_PREMIUM_4P_60HZ_TEFC.map((r) => ({ size: r.hp, eff: r.efficiency, prov: r.provenance }));
    return lookupLog(rows, ratedOutput / WATTS_PER_HP, 'hp', 'NEMA MG 1 Table 12-12 (NEMA Premium, 4-pole, 60 Hz, enclosed)', 'ratedOutput');
  }
  if (poles !== 4 || frequency !== 50) {
    return { code: 'outside-table', field: poles !== 4 ? 'poles' : 'ratedFrequency', value: poles !== 4 ? poles : frequency, message: 'the IEC 60034-30-1 values carried are for 4-pole 50 Hz motors: give 4 poles and a rated frequency of 50 Hz, or the nameplate efficiency' };
  }
  const rows = IEC_60034_30_1_4P_50HZ.map((r) => ({ size: r.kW, eff: r.efficiency[cls], prov: r.provenance[cls] }));
  return lookupLog(rows, ratedOutput / 1000, 'kW', `IEC 60034-30-1:2014 ${cls} (4-pole, 50 Hz)`, 'ratedOutput');
}

/** Typical full-load pf by rated output (common practice). */
export function typicalPowerFactor(ratedOutput: number): number {
  return TYPICAL_FULL_LOAD_PF.find((r) => ratedOutput <= r.upToW)!.powerFactor;
}

/** Part-load ratios at a load fraction (linear between the shape's points, held at its ends). */
export function partLoadRatios(x: number): { efficiency: number; powerFactor: number; extrapolated: boolean } {
  const pts = MOTOR_PART_LOAD;
  const first = pts[0]!;
  const last = pts[pts.length - 1]!;
  if (x <= first.loadFraction) return { efficiency: first.efficiencyRatio, powerFactor: first.powerFactorRatio, extrapolated: x < first.loadFraction };
  if (x >= last.loadFraction) return { efficiency: last.efficiencyRatio, powerFactor: last.powerFactorRatio, extrapolated: x > last.loadFraction };
  let i = 1;
  while (pts[i]!.loadFraction < x) i++;
  const a = pts[i - 1]!;
  const b = pts[i]!;
  const t = (x - a.loadFraction) / (b.loadFraction - a.loadFraction);
  return {
    efficiency: a.efficiencyRatio + t * (b.efficiencyRatio - a.efficiencyRatio),
    powerFactor: a.powerFactorRatio + t * (b.powerFactorRatio - a.powerFactorRatio),
    extrapolated: false,
  };
}

/** A motor's full-load figures when it is given by a preset or nameplate (undefined for explicit models). */
export interface MotorRating {
  fullLoad: FullLoadEfficiency;
  /** Full-load power factor and where it came from. */
  powerFactor: number;
  powerFactorSource: string;
}

/** Resolve a preset or nameplate motor; problems name the field. Explicit models give `undefined`. */
export function motorRating(e: MotorStage): { ok: true; rating: MotorRating | undefined } | { ok: false; problems: Issue[] } {
  if (e.efficiencyClass === undefined && e.nameplate === undefined) return { ok: true, rating: undefined };
  let fullLoad: FullLoadEfficiency;
  if (e.nameplate !== undefined) {
    fullLoad = { efficiency: e.nameplate.efficiency, source: 'nameplate', provenance: 'nameplate' };
  } else {
    const r = classEfficiency(e.efficiencyClass!, e.ratedOutput, e.poles, e.ratedFrequency);
    if (isIssue(r)) return { ok: false, problems: [r] };
    fullLoad = r;
  }
  const given = e.nameplate?.powerFactor ?? e.ratedPowerFactor;
  const powerFactor = given ?? typicalPowerFactor(e.ratedOutput);
  const powerFactorSource = given !== undefined ? (e.nameplate?.powerFactor !== undefined ? 'nameplate' : 'rated power factor') : `typical full-load power factor by size (typical value: use the maker's figure)`;
  return { ok: true, rating: { fullLoad, powerFactor, powerFactorSource } };
}

/** Efficiency and pf of a rated motor at load fraction x (part-load shape; pf capped at 1). */
export function ratedAt(rating: MotorRating, x: number): { efficiency: number; powerFactor: number; extrapolated: boolean } {
  const r = partLoadRatios(x);
  return { efficiency: Math.min(rating.fullLoad.efficiency * r.efficiency, 0.999), powerFactor: Math.min(rating.powerFactor * r.powerFactor, 1), extrapolated: r.extrapolated };
}

/** NEC Table 430.250 full-load current for a 3φ induction motor, when a row and column apply. */
export function necFullLoadCurrent(ratedOutput: number, voltage: number | undefined): { amps: number; hp: number; voltage: Nec430Voltage } | { reason: string } {
  if (voltage === undefined) return { reason: 'no rated voltage given' };
  const col = NEC_430_250_VOLTAGES.find((v) => v === voltage);
  if (col === undefined) return { reason: `${voltage} V is not a column of Table 430.250 (${NEC_430_250_VOLTAGES.join(', ')} V)` };
  const hp = ratedOutput / WATTS_PER_HP;
  const row = NEC_430_250.find((r) => Math.abs(r.hp - hp) <= ROW_MATCH * r.hp);
  if (!row) return { reason: `${hp.toPrecision(3)} hp is not a row carried from Table 430.250 (${NEC_430_250.map((r) => r.hp).join(', ')} hp)` };
  return { amps: row.amps[col], hp: row.hp, voltage: col };
}
