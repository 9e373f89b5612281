/**
 * The rated currents of the equipment a cable link feeds, which the design-current rules of
 * design-current.ts take instead of the solved load:
 * - a motor's full-load current by NEC 430.6(A)(1): Table 430.250 (3φ) / 430.248 (1φ) at its
 *   horsepower row and voltage column; by IEC, its rated (nameplate) current;
 * - an inverter's or DC-DC converter's rated DC input current: rated output / (η · lowest input
 *   voltage) (the stand-alone inverter input rating of NEC 690.8(A) / 694.12(A)(3) / 706.30).
 */
import type { DcDcStage, Element, InverterStage, MotorStage } from '../model/project.ts';
import { NEC_430_250 } from '../data/nec-430-250.ts';
import { NEC_430_248 } from '../data/nec-430-248.ts';
import { WATTS_PER_HP } from '../data/nema-mg1-12-12.ts';
import { prepareLoss } from '../physics/loss-model.ts';
import { motorRating } from '../physics/motor-rating.ts';

const SQRT3 = Math.sqrt(3);
const nameOf = (e: Element): string => `"${e.name ?? e.id}"`;

/** The voltage column of Table 430.250 / 430.248 for a motor rated at `v` (the table's note on voltage ranges). */
function necColumn(v: number, phases: 1 | 3): number | undefined {
  // Table 430.250 note: the listed currents apply to system voltage ranges 110–120, 220–240,
  // 440–480 and 550–600 V; 200 and 208 V are their own columns.
  if (Math.abs(v - 200) < 0.5) return 200;
  if (Math.abs(v - 208) < 0.5) return 208;
  if (v >= 110 && v <= 120) return 115;
  if (v >= 220 && v <= 240) return 230;
  if (v >= 440 && v <= 480 && phases === 3) return 460;
  if (v >= 550 && v <= 600 && phases === 3) return 575;
  return undefined;
}

type Rows = readonly { hp: number; amps: Readonly<Partial<Record<number, number>>> }[];
const THREE_PHASE_ROWS: Rows = NEC_430_250;
const SINGLE_PHASE_ROWS: Rows = NEC_430_248;

/**
 * NEC full-load current of a motor by 430.6(A)(1): Table 430.250 (3φ) or 430.248 (1φ) at the
 * motor's horsepower row and voltage column. A motor rated between rows (a kW rating) takes the
 * next larger row, which gives the larger current.
 */
export function necMotorFlc(m: MotorStage, phases: 1 | 3, nominal: number): { amps: number; words: string } | { reason: string } {
  const v = m.ratedVoltage ?? nominal;
  const col = necColumn(v, phases);
  const table = phases === 3 ? 'Table 430.250' : 'Table 430.248';
  const rows = phases === 3 ? THREE_PHASE_ROWS : SINGLE_PHASE_ROWS;
  if (col === undefined) return { reason: `a motor rated ${v} V matches no voltage column of NEC ${table}` };
  const hp = m.ratedOutput / WATTS_PER_HP;
  const row = rows.find((r) => r.hp >= hp * (1 - 0.005) && r.amps[col] !== undefined);
  if (!row) {
    return {
      reason: rows.length
        ? `${hp.toPrecision(3)} hp is above the rows of NEC ${table} carried here (${rows.map((r) => r.hp).join(', ')} hp)`
        : `NEC ${table} is not carried`,
    };
  }
  const exact = Math.abs(row.hp - hp) <= 0.005 * row.hp;
  return {
    amps: row.amps[col]!,
    words: `NEC ${table}, ${row.hp} hp at ${col} V: ${row.amps[col]} A${exact ? '' : ` (the motor's ${hp.toPrecision(3)} hp lies between rows: the next larger row)`}`,
  };
}

/** IEC rated current of a motor: the nameplate current, else rated output / (√3·U·η·cosφ) at full load. */
export function iecMotorCurrent(m: MotorStage, phases: 1 | 3, nominal: number): { amps: number; words: string } | { reason: string } {
  if (m.nameplate?.current !== undefined) return { amps: m.nameplate.current, words: `nameplate rated current ${m.nameplate.current} A` };
  const rated = motorRating(m);
  if (!rated.ok || rated.rating === undefined) return { reason: 'give the nameplate current (or an efficiency class) to take the motor\'s rated current' };
  const v = m.ratedVoltage ?? nominal;
  const { efficiency, powerFactor } = { efficiency: rated.rating.fullLoad.efficiency, powerFactor: rated.rating.powerFactor };
  const amps = m.ratedOutput / ((phases === 3 ? SQRT3 : 1) * v * efficiency * powerFactor);
  return { amps, words: `rated output / (${phases === 3 ? '√3·' : ''}U·η·cosφ) = ${m.ratedOutput} W / (${phases === 3 ? '√3·' : ''}${v} V × ${efficiency.toFixed(3)} × ${powerFactor.toFixed(2)})` };
}

/** A converter's efficiency at a given output from its loss model: η = P / (P + loss(P)). */
function efficiencyAtRated(loss: Parameters<typeof prepareLoss>[0], p: number): number {
  const l = prepareLoss(loss).loss(p).loss;
  return p / (p + l);
}

/**
 * A converter's rated DC input current: its rated continuous output over its efficiency at that
 * output and its lowest input voltage (an inverter's low-voltage cut-off; a DC-DC converter's lowest
 * input voltage), I = P / (η·V_min).
 */
export function converterInput(e: InverterStage | DcDcStage): { amps: number; words: string } | { missing: string[] } {
  const inv = e.kind === 'inverter';
  const p = e.ratedOutputPower ?? e.loss.ratedPower;
  const vMin = e.kind === 'inverter' ? e.lowVoltageCutoff : e.minInputVoltage;
  const what = inv ? 'inverter' : 'DC-DC converter';
  const missing: string[] = [];
  if (p === undefined) missing.push(`${what} ${nameOf(e)}: enter its rated continuous output`);
  if (vMin === undefined) missing.push(`${what} ${nameOf(e)}: enter its ${inv ? 'low-voltage cut-off' : 'lowest input voltage'}`);
  if (p === undefined || vMin === undefined) return { missing };
  const eta = efficiencyAtRated(e.loss, p);
  return { amps: p / (eta * vMin), words: `the ${what}'s rated output at its lowest input voltage: ${p} W / (η ${eta.toFixed(3)} × ${vMin} V)` };
}
