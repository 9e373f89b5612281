/**
 * The starting current of one motor at rated voltage, before any chain is solved (used by
 * starting.ts, which solves the chain during the start).
 *
 * Methods (each also written into the result's `method` text):
 * - Locked-rotor current: NEC Table 430.7(B) code letter — S_LR = kVA/hp (the upper end of the
 *   letter's band; 22.4 for V, which has no upper end) × hp, I_LR = S_LR / (√3·V) on three-phase,
 *   S_LR / V on single-phase (NEC 430.7(B) with the usual current-from-kVA relation); or the IEC
 *   ratio I_A/I_N × FLC; or the current entered; else 6 × FLC (common practice).
 * - Starting current by method: direct-on-line I_LR; star-delta I_LR/3 (textbook: the winding
 *   sees 1/√3 of the voltage and the delta-to-line factor √3 goes); soft starter min(limit × FLC,
 *   I_LR); drive 1.5 × FLC (common practice, about 1–1.5 × FLC).
 */
import type { MotorStage } from '../../model/project.ts';
import { motorRating } from '../../physics/motor-rating.ts';
import { prepareLoss } from '../../physics/loss-model.ts';
import { motorPowerFactorAt } from '../../kinds/motor.ts';
import { NEC_430_7_B, WATTS_PER_HP } from '../../data/motor-code-letters.ts';
import {
  DEFAULT_LOCKED_ROTOR_RATIO,
  DEFAULT_LOCKED_ROTOR_RATIO_BY_CLASS,
  TYPICAL_VALUE,
  DEFAULT_SOFT_STARTER_LIMIT,
  DEFAULT_START_SECONDS,
  DRIVE_START_RATIO,
  STARTING_POWER_FACTOR,
  STAR_DELTA_FACTOR,
} from '../../data/motor-starting.ts';
import type { StartMethod } from './types.ts';

const SQRT3 = Math.sqrt(3);
/** Beside every default the user reads (the defaults are common practice, no source; see core/data/motor-starting.ts). */
const CP = TYPICAL_VALUE;

const fmt = (x: number, digits = 3): string => (Math.abs(x) >= 1000 ? Math.round(x).toString() : x.toPrecision(digits));

/** Full-load efficiency and power factor of a motor from its own model (class, nameplate or explicit). */
function fullLoad(e: MotorStage): { efficiency: number; powerFactor: number } {
  const r = motorRating(e);
  if (r.ok && r.rating) return { efficiency: r.rating.fullLoad.efficiency, powerFactor: r.rating.powerFactor };
  const loss = e.loss!;
  const prepared = prepareLoss(loss.model === 'constant' && loss.ratedPower === undefined ? { ...loss, ratedPower: e.ratedOutput } : loss);
  const p = e.ratedOutput;
  return { efficiency: p / (p + prepared.loss(p).loss), powerFactor: motorPowerFactorAt(e.powerFactor!, 1) };
}

/** Starting figures of one motor at rated voltage (no chain yet). */
export function startingFigures(e: MotorStage, phases: 1 | 3, ratedVoltage: number) {
  const s = e.starting!;
  const fl = fullLoad(e);
  const perVolt = phases === 3 ? SQRT3 * ratedVoltage : ratedVoltage;
  const flcFromRating = e.ratedOutput / (fl.efficiency * fl.powerFactor) / perVolt;
  const fullLoadCurrent = e.nameplate?.current ?? flcFromRating;
  const fullLoadCurrentSource =
    e.nameplate?.current !== undefined
      ? 'nameplate current'
      : `rated output / (η ${fmt(fl.efficiency)} × pf ${fmt(fl.powerFactor)}) / (${phases === 3 ? '√3 × ' : ''}${fmt(ratedVoltage)} V)`;
  let lockedRotorCurrent: number;
  let lockedRotorSource: string;
  if (s.codeLetter !== undefined) {
    const row = NEC_430_7_B.find((r) => r.letter === s.codeLetter)!;
    const kvaPerHp = row.maxKvaPerHp ?? row.minKvaPerHp;
    const hp = e.ratedOutput / WATTS_PER_HP;
    lockedRotorCurrent = (kvaPerHp * 1000 * hp) / perVolt;
    lockedRotorSource = `code letter ${s.codeLetter}: ${kvaPerHp} kVA/hp (${row.maxKvaPerHp === null ? 'lower end; the letter has no upper end' : 'upper end of the band'}, NEC Table 430.7(B)) × ${fmt(hp)} hp`;
  } else if (s.startingCurrentRatio !== undefined) {
    lockedRotorCurrent = s.startingCurrentRatio * fullLoadCurrent;
    lockedRotorSource = `I_A/I_N ${s.startingCurrentRatio} × full-load current (motor data)`;
  } else if (s.lockedRotorCurrent !== undefined) {
    lockedRotorCurrent = s.lockedRotorCurrent;
    lockedRotorSource = 'entered';
  } else {
    const cls = e.efficiencyClass;
    const k = cls !== undefined ? DEFAULT_LOCKED_ROTOR_RATIO_BY_CLASS[cls] : DEFAULT_LOCKED_ROTOR_RATIO;
    const clsWords = cls === undefined ? '' : ` for ${cls === 'NEMA-premium' ? 'a NEMA Premium' : `an ${cls}`} motor${cls === 'IE3' || cls === 'IE4' || cls === 'NEMA-premium' ? ', premium-efficiency motors drawing more' : ''}`;
    lockedRotorCurrent = k * fullLoadCurrent;
    lockedRotorSource = `not given: ${k} × full-load current assumed${clsWords} (${CP}); enter the code letter, I_A/I_N or the locked-rotor current`;
  }
  let startingCurrent: number;
  let how: string;
  switch (s.method) {
    case 'dol':
      startingCurrent = lockedRotorCurrent;
      how = 'direct-on-line: the locked-rotor current';
      break;
    case 'star-delta':
      startingCurrent = lockedRotorCurrent * STAR_DELTA_FACTOR;
      how = 'star-delta: ⅓ of the direct-on-line current and torque (textbook relation)';
      break;
    case 'soft-starter': {
      const k = s.currentLimit ?? DEFAULT_SOFT_STARTER_LIMIT;
      startingCurrent = Math.min(k * fullLoadCurrent, lockedRotorCurrent);
      how = `soft starter: current limit ${k} × FLC${s.currentLimit === undefined ? ` (not given; ${CP})` : ''}${k * fullLoadCurrent > lockedRotorCurrent ? ', above the locked-rotor current, so the locked-rotor current' : ''}`;
      break;
    }
    case 'drive':
      startingCurrent = DRIVE_START_RATIO * fullLoadCurrent;
      how = `drive: about ${DRIVE_START_RATIO} × FLC while accelerating (${CP})`;
      break;
  }
  const pfRow = STARTING_POWER_FACTOR.find((r) => e.ratedOutput <= r.upToWatts)!;
  const startingPowerFactor = s.method === 'drive' ? fl.powerFactor : (s.startingPowerFactor ?? pfRow.powerFactor);
  const startingPowerFactorSource =
    s.method === 'drive' ? 'the motor’s full-load power factor (a drive starts at rated flux)' : s.startingPowerFactor !== undefined ? 'entered' : `${pfRow.powerFactor} by size (${CP})`;
  return {
    fullLoadCurrent,
    fullLoadCurrentSource,
    ratedPowerFactor: fl.powerFactor,
    lockedRotorCurrent,
    lockedRotorSource,
    startingCurrent,
    how,
    startingPowerFactor,
    startingPowerFactorSource,
    startingApparentPower: perVolt * startingCurrent,
    startSeconds: s.startSeconds ?? DEFAULT_START_SECONDS[s.method],
    startSecondsSource: s.startSeconds !== undefined ? 'entered' : `${DEFAULT_START_SECONDS[s.method]} s for ${METHOD_WORDS[s.method]} (${CP})`,
  };
}

export const METHOD_WORDS: Record<StartMethod, string> = {
  dol: 'direct on line',
  'star-delta': 'star-delta',
  'soft-starter': 'a soft starter',
  drive: 'a drive',
};

