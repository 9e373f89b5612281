/**
 * Motor starting: starting current from each source of data and each method, worked by hand from
 * the stated formulas; the start through a cable against the voltage-divider hand calculation;
 * a start that succeeds, one marginal and one that fails; the inverter and generator checks.
 */
import { describe, expect, it } from 'vitest';
import { studySurges, type MotorStartResult } from '../../core/index.ts';
import { startingFigures } from '../../core/surge/starting.ts';
import type { MotorStage } from '../../core/model.ts';
import { dolOnCable, project, pumpOnInverter } from './fixtures.ts';

const SQRT3 = Math.sqrt(3);

function start(p: unknown, id: string): MotorStartResult {
  const o = studySurges(p);
  if (!o.ok) throw new Error(JSON.stringify(o.problems));
  return o.result.starts.find((s) => s.motorId === id)!;
}

const motor = (starting: MotorStage['starting'], extra: Partial<MotorStage> = {}): MotorStage => ({
  id: 'm',
  kind: 'motor',
  from: 'x',
  ratedOutput: 7457, // 10 hp × 745.7 W
  ratedVoltage: 460,
  nameplate: { efficiency: 0.9, powerFactor: 0.85, current: 13 },
  starting,
  ...extra,
});

describe('starting current (hand calculations from the stated methods)', () => {
  it('code letter G, 10 hp, 460 V 3φ: 6.29 kVA/hp × 10 hp / (√3 × 460 V) = 78.95 A (NEC Table 430.7(B) upper end of G; I = S/(√3·V))', () => {
    const f = startingFigures(motor({ method: 'dol', codeLetter: 'G' }), 3, 460);
    expect(f.lockedRotorCurrent).toBeCloseTo(62900 / (SQRT3 * 460), 9); // = 78.946 A
    expect(f.lockedRotorCurrent).toBeCloseTo(78.95, 2);
    expect(f.startingCurrent).toBe(f.lockedRotorCurrent);
  });

  it('code letter V has no upper end: its lower end 22.4 kVA/hp is used (NEC Table 430.7(B) "22.4 and up")', () => {
    const f = startingFigures(motor({ method: 'dol', codeLetter: 'V' }), 3, 460);
    expect(f.lockedRotorCurrent).toBeCloseTo(224000 / (SQRT3 * 460), 9);
  });

  it('single-phase code letter: I = S/V (10 hp letter F: 55.9 kVA / 230 V = 243.0 A)', () => {
    const f = startingFigures(motor({ method: 'dol', codeLetter: 'F' }, { ratedVoltage: 230 }), 1, 230);
    expect(f.lockedRotorCurrent).toBeCloseTo(55900 / 230, 9);
  });

  it('I_A/I_N 7 × nameplate 13 A = 91 A; star-delta draws a third, 30.33 A (textbook star-delta relation)', () => {
    expect(startingFigures(motor({ method: 'dol', startingCurrentRatio: 7 }), 3, 460).startingCurrent).toBeCloseTo(91, 9);
    const sd = startingFigures(motor({ method: 'star-delta', startingCurrentRatio: 7 }), 3, 460);
    expect(sd.startingCurrent).toBeCloseTo(91 / 3, 9);
    expect(sd.startingApparentPower).toBeCloseTo(SQRT3 * 460 * (91 / 3), 6);
  });

  it('soft starter: the current limit 3 × 13 A = 39 A; a limit above the locked-rotor current gives the locked-rotor current', () => {
    expect(startingFigures(motor({ method: 'soft-starter', lockedRotorCurrent: 80, currentLimit: 3 }), 3, 460).startingCurrent).toBe(39);
    expect(startingFigures(motor({ method: 'soft-starter', lockedRotorCurrent: 30, currentLimit: 3 }), 3, 460).startingCurrent).toBe(30);
  });

  it('drive: 1.5 × FLC = 19.5 A (common practice, no source); nothing given: 6 × FLC assumed and said so', () => {
    expect(startingFigures(motor({ method: 'drive' }), 3, 460).startingCurrent).toBeCloseTo(19.5, 12);
    const f = startingFigures(motor({ method: 'dol' }), 3, 460);
    expect(f.lockedRotorCurrent).toBeCloseTo(78, 12);
    expect(f.lockedRotorSource).toContain('not given');
  });

  it('full-load current from the rating when no nameplate current: P/(η·pf)/(√3·V) = 7457/(0.9·0.85)/(√3·460) = 12.23 A', () => {
    const f = startingFigures(motor({ method: 'dol', startingCurrentRatio: 6 }, { nameplate: { efficiency: 0.9, powerFactor: 0.85 } }), 3, 460);
    expect(f.fullLoadCurrent).toBeCloseTo(7457 / (0.9 * 0.85) / (SQRT3 * 460), 9);
  });
});

/** Voltage divider of the stiff 400 V source across the cable and the locked-rotor impedance (hand calculation). */
function dividerPercent(length: number): number {
  const zm = 400 / SQRT3 / 200; // |Z| = V_phase / I_LR
  const pf = 0.35;
  const zmr = zm * pf;
  const zmx = zm * Math.sqrt(1 - pf * pf);
  const zcr = (3.08 * length) / 1000;
  const zcx = (0.09 * length) / 1000;
  return (100 * zm) / Math.hypot(zmr + zcr, zmx + zcx);
}

describe('start through a cable: succeeds, marginal, fails', () => {
  it('40 m: terminal voltage 95.70 % by the divider (hand), starts', () => {
    const s = start(dolOnCable(40), 'm');
    expect(dividerPercent(40)).toBeCloseTo(95.698, 2);
    expect(s.duringStart!.terminalVoltagePercent).toBeCloseTo(dividerPercent(40), 6);
    expect(s.duringStart!.cableDrops).toHaveLength(1);
    expect(s.verdict).toBe('starts');
  });

  it('120 m: 86.25 % (hand), within 10 % of the 80 % limit (80/86.25 = 0.93): marginal', () => {
    const s = start(dolOnCable(120), 'm');
    expect(s.duringStart!.terminalVoltagePercent).toBeCloseTo(dividerPercent(120), 6);
    expect(s.verdict).toBe('marginal');
    expect(s.governing).toContain('motor terminal voltage');
  });

  it('200 m: below 80 %: will not start, and the reason names the terminal voltage', () => {
    const s = start(dolOnCable(200), 'm');
    expect(dividerPercent(200)).toBeLessThan(80);
    expect(s.duringStart!.terminalVoltagePercent).toBeCloseTo(dividerPercent(200), 6);
    expect(s.verdict).toBe('will-not-start');
    expect(s.governing).toMatch(/below the limit 80/);
  });

  it('a user threshold of 70 % makes the 200 m start pass the voltage check', () => {
    const s = start(dolOnCable(200, { minTerminalVoltagePercent: 70 }), 'm');
    expect(s.checks[0]!.limit).toBe(70);
    expect(s.verdict).not.toBe('will-not-start');
  });

  it('the cable drop at starting current: |V_s| − |V_r| equals the divider drop (hand)', () => {
    const s = start(dolOnCable(120), 'm');
    expect(s.duringStart!.cableDrops[0]!.dropPercent).toBeCloseTo(100 - dividerPercent(120), 6);
  });
});

describe('inverter source', () => {
  it('within surge rating, start time and cut-off: starts; battery dip = I × R_internal', () => {
    const s = start(pumpOnInverter(), 'pump-motor');
    expect(s.verdict).toBe('starts');
    const b = s.inverter!.battery!;
    expect(b.dipVolts).toBeCloseTo(b.current * 0.004, 12);
    expect(b.openCircuitVoltage - b.terminalVoltage).toBeCloseTo(b.dipVolts, 9);
    expect(s.checks.map((c) => c.name)).toEqual(['terminal-voltage', 'inverter-surge', 'surge-duration', 'inverter-cutoff']);
  });

  it('a surge rating below the starting VA: will not start, governed by the inverter surge', () => {
    const s = start(pumpOnInverter({ surge: 6000 }), 'pump-motor');
    expect(s.verdict).toBe('will-not-start');
    expect(s.governing).toContain('inverter apparent power');
  });

  it('a surge that lasts 2 s against a 3 s start: will not start (start time against surge duration)', () => {
    const s = start(pumpOnInverter({ surgeSeconds: 2 }), 'pump-motor');
    expect(s.verdict).toBe('will-not-start');
    expect(s.governing).toContain('surge duration');
  });

  it('a cut-off just under the DC input voltage during the start: marginal', () => {
    const s = start(pumpOnInverter({ cutoff: 50 }), 'pump-motor');
    expect(s.verdict).toBe('marginal');
    expect(s.governing).toContain('DC input voltage');
  });
});

describe('generator source', () => {
  const gen = (xd: number, lra: number) =>
    project('pump on a generator', [
      { id: 'gen', kind: 'generator', phases: 3, voltage: 400, frequency: 50, ratedApparentPower: 60000, subtransientReactancePercent: xd },
      { id: 'm', kind: 'motor', from: 'gen', ratedOutput: 11000, ratedVoltage: 400, nameplate: { efficiency: 0.9, powerFactor: 0.85, current: 21 }, starting: { method: 'dol', lockedRotorCurrent: lra, startingPowerFactor: 0.3 } },
      { id: 'load', kind: 'shaft-load', from: 'm', power: 9000 },
    ]);

  it('dip = X″d·S/(S_gen + X″d·S): 0.2 × 103.9 kVA / (60 + 0.2 × 103.9) kVA = 25.73 % (per-unit divider, hand); above 15 %: will not start', () => {
    const s = start(gen(20, 150), 'm');
    const sStart = SQRT3 * 400 * 150; // 103 923 VA
    expect(s.generator!.dipPercent).toBeCloseTo((100 * 0.2 * sStart) / (60000 + 0.2 * sStart), 9);
    expect(s.generator!.dipPercent).toBeCloseTo(25.73, 2);
    expect(s.generator!.startingToRating).toBeCloseTo(sStart / 60000, 9);
    expect(s.verdict).toBe('will-not-start');
    expect(s.governing).toContain('generator transient voltage dip');
  });

  it('the terminal voltage during the start behind X″d agrees with the same divider when the motor is the only load (purely: |Z_m| / |Z_m + jX″d|)', () => {
    const s = start(gen(20, 150), 'm');
    const zm = 400 / SQRT3 / 150;
    const xd = (0.2 * 400 * 400) / 60000;
    const expected = (100 * zm) / Math.hypot(zm * 0.3, zm * Math.sqrt(1 - 0.09) + xd);
    expect(s.duringStart!.terminalVoltagePercent).toBeCloseTo(expected, 6);
  });
});
