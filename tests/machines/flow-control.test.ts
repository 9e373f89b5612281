/**
 * comparePumpControl: affinity-law cases, drive vs throttle vs on-off worked by hand on a two-point
 * duty profile, the static-head effect, and refusals naming the field.
 */
import { describe, expect, it } from 'vitest';
import { comparePumpControl, STANDARD_GRAVITY, type PumpDutyInput } from '../../core/studies/machines/index.ts';

const G = STANDARD_GRAVITY; // 9.80665 m/s², standard gravity (3rd CGPM 1901)
// Design point: 0.1 m³/s at 20 m, pump efficiency 0.8 → shaft = ρgQH/η = 1000·g·0.1·20/0.8.
const P_DESIGN = (1000 * G * 0.1 * 20) / 0.8;

const study = (over: Partial<PumpDutyInput> = {}): PumpDutyInput => ({
  id: 'pumpset',
  pump: { ratedFlow: 0.1, ratedHead: 20, shutoffHead: 25, efficiency: 0.8 },
  staticHead: 0,
  duty: [
    { flow: 0.1, hours: 1000 },
    { flow: 0.05, hours: 3000 },
  ],
  motor: { ratedOutput: P_DESIGN, nameplate: { efficiency: 0.9 } },
  drive: { ratedApparentPower: 30000, basis: 'cdm' },
  ...over,
});

const ok = (s: PumpDutyInput) => {
  const r = comparePumpControl(s);
  if (!r.ok) throw new Error(JSON.stringify(r.problems));
  return r.result;
};

describe('affinity laws (Q ∝ n, H ∝ n², P ∝ n³ at constant efficiency), no static head', () => {
  it('80 % flow → 80 % speed, 64 % head, 51.2 % shaft power (affinity laws, worked by hand)', () => {
    const r = ok(study({ duty: [{ flow: 0.08, hours: 1 }] }));
    const p = r.points[0]!;
    expect(p.speedControl.speed).toBeCloseTo(0.8, 12);
    expect(p.speedControl.head).toBeCloseTo(0.64 * 20, 12);
    expect(p.speedControl.shaftPower / P_DESIGN).toBeCloseTo(0.512, 12);
    expect(p.cubeLawShaftPower).toBeCloseTo(0.512 * P_DESIGN, 9);
  });
  it('50 % flow → 12.5 % shaft power (0.5³)', () => {
    const r = ok(study({ duty: [{ flow: 0.05, hours: 1 }] }));
    expect(r.points[0]!.speedControl.shaftPower / P_DESIGN).toBeCloseTo(0.125, 12);
  });
});

describe('two-point duty worked by hand (1000 h at 0.1 m³/s, 3000 h at 0.05 m³/s, H_s = 0)', () => {
  const r = ok(study());
  // Pump curve H = 25 − 500·Q² (a = (25 − 20)/0.1²); system H = 2000·Q² (k = 20/0.1²).
  // Motor: nameplate η 0.9 at full load; part-load shape (common practice): ratio 0.945 below 25 %,
  // 0.99 + 0.013·(x − 0.5)/0.25 between 50 and 75 %.
  // Drive: IE2 defaults on 30 kVA (common practice): (50, 25) → 1.0 % = 300 W; (90, 100) → 2.4 % = 720 W
  // (100 % speed is clamped to the CDM's 90 % point).
  const fullIn = P_DESIGN / 0.9;
  // Speed control at 0.05: n = √(2500·0.05²/25) = 0.5, H = 5 m, shaft = P_design/8, x = 0.125 → η = 0.9·0.945;
  // torque = (shaft/n)/P_rated = 25 %.
  const halfShaft = P_DESIGN / 8;
  const halfMotorIn = halfShaft / (0.9 * 0.945);
  const driveWh = 1000 * (fullIn + 720) + 3000 * (halfMotorIn + 300);
  // Throttle at 0.05: H = 25 − 500·0.0025 = 23.75 m; shaft = 1000·g·0.05·23.75/0.8; x = shaft/P_design = 0.59375.
  const thrShaft = (1000 * G * 0.05 * 23.75) / 0.8;
  const thrEta = 0.9 * (0.99 + 0.013 * ((0.59375 - 0.5) / 0.25));
  const throttleWh = 1000 * fullIn + 3000 * (thrShaft / thrEta);
  // On-off at 0.05: runs half of the 3000 h at the design point.
  const onOffWh = 1000 * fullIn + 1500 * fullIn;

  it('speed control: Σ h·(P_shaft/η_motor + drive loss)', () => {
    expect(r.points[1]!.speedControl.speed).toBeCloseTo(0.5, 12);
    expect(r.points[1]!.speedControl.driveTorquePercent).toBeCloseTo(25, 9);
    expect(r.points[0]!.speedControl.driveClamped).toBe(true);
    expect(r.speedControl.energyWh).toBeCloseTo(driveWh, 6);
    expect(r.speedControl.driveLossWh).toBeCloseTo(1000 * 720 + 3000 * 300, 6);
  });
  it('throttling: full speed, head from the pump curve', () => {
    expect(r.points[1]!.throttle.head).toBeCloseTo(23.75, 12);
    expect(r.throttle.energyWh).toBeCloseTo(throttleWh, 6);
  });
  it('on-off: full flow for Q/Q_r of the hours', () => {
    expect(r.points[1]!.onOffRunFraction).toBeCloseTo(0.5, 12);
    expect(r.onOff.energyWh).toBeCloseTo(onOffWh, 6);
  });
  it('the differences are the energy differences', () => {
    expect(r.savingVsThrottleWh).toBeCloseTo(throttleWh - driveWh, 6);
    expect(r.savingVsOnOffWh).toBeCloseTo(onOffWh - driveWh, 6);
    expect(r.savingVsThrottleFraction).toBeCloseTo((throttleWh - driveWh) / throttleWh, 12);
    expect(r.totalHours).toBe(4000);
  });
});

describe('static head', () => {
  it('with H_s = 15 m of 20 m, 50 % flow needs n = √((15 + (5/0.01 + 500)·0.0025)/25) and H = 15 + 500·0.0025 (system curve)', () => {
    const r = ok(study({ staticHead: 15, duty: [{ flow: 0.05, hours: 1000 }] }));
    const p = r.points[0]!;
    expect(p.speedControl.speed).toBeCloseTo(Math.sqrt((15 + 1000 * 0.0025) / 25), 12);
    expect(p.speedControl.head).toBeCloseTo(16.25, 12);
    // The cube law would claim P_design/8; the system curve needs much more.
    expect(p.speedControl.shaftPower).toBeCloseTo((1000 * G * 0.05 * 16.25) / 0.8, 9);
    expect(r.speedControlShaftEnergyWh).toBeGreaterThan(2 * r.cubeLawShaftEnergyWh);
  });
});

describe('service factor', () => {
  it('a design point between rated and SF × rated is computed with a warning', () => {
    const r = ok(study({ motor: { ratedOutput: P_DESIGN / 1.1, nameplate: { efficiency: 0.9 }, serviceFactor: 1.15 } }));
    expect(r.warnings.join()).toContain('within the service factor 1.15');
  });
});

describe('bad input: refused naming the field, nothing computed', () => {
  const problem = (s: unknown) => {
    const r = comparePumpControl(s as PumpDutyInput);
    expect(r.ok).toBe(false);
    if (r.ok) throw new Error('expected a refusal');
    expect(r).not.toHaveProperty('result');
    return r.problems;
  };
  it('a negative flow', () => {
    expect(problem(study({ duty: [{ flow: -0.01, hours: 100 }] }))[0]).toMatchObject({ elementId: 'pumpset', field: 'duty[0].flow' });
  });
  it('negative hours', () => {
    expect(problem(study({ duty: [{ flow: 0.05, hours: -1 }] }))[0]).toMatchObject({ field: 'duty[0].hours' });
  });
  it('duty hours over 8760', () => {
    const p = problem(study({ duty: [{ flow: 0.05, hours: 5000 }, { flow: 0.08, hours: 4000 }] }))[0]!;
    expect(p).toMatchObject({ field: 'duty', value: 9000 });
    expect(p.message).toContain('8760');
  });
  it('a flow above the rated flow', () => {
    expect(problem(study({ duty: [{ flow: 0.12, hours: 10 }] }))[0]).toMatchObject({ field: 'duty[0].flow' });
  });
  it('an unknown efficiency class', () => {
    const p = problem(study({ motor: { ratedOutput: 30000, efficiencyClass: 'IE7' as 'IE1', poles: 4, ratedFrequency: 50 } }))[0]!;
    expect(p).toMatchObject({ field: 'motor.efficiencyClass' });
    expect(p.message).toContain('IE1, IE2, IE3, IE4, NEMA-premium');
  });
  it('a motor overloaded beyond its service factor (the design point needs 1.2 × rated, SF 1.15)', () => {
    const p = problem(study({ motor: { ratedOutput: P_DESIGN / 1.2, nameplate: { efficiency: 0.9 }, serviceFactor: 1.15 } }))[0]!;
    expect(p).toMatchObject({ elementId: 'pumpset', field: 'motor.ratedOutput' });
    expect(p.message).toContain('service factor');
  });
  it('static head at or above the rated head, and missing parts', () => {
    expect(problem(study({ staticHead: 20 }))[0]).toMatchObject({ field: 'staticHead' });
    expect(problem({ pump: {}, duty: [] }).map((x) => x.field)).toEqual(['motor', 'drive']);
  });
});
