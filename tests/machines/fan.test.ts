/**
 * The fan element and its duty study, and the least-squares curve fit the duty editor offers.
 * Every check value is worked by hand beside it from the named method (affinity laws, the fan's
 * quadratic curve, least squares of a straight line in Q²).
 */
import { spawnSync } from 'node:child_process';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { PROJECT_LEVEL } from '../../core/model/errors.ts';
import type { FanLoad } from '../../core/model/project.ts';
import { fanOperatingPoint } from '../../core/physics/fan.ts';
import { curveAt, fitFallingQuadratic } from '../../core/physics/curve-fit.ts';
import { fanDetails, projectPumpDuty } from '../../core/studies/machines/pump-duty.ts';
import { curveFromPoints, dutyCurves, dutyFlowAtSpeed, dutySpeedAtFlow } from '../../core/studies/machines/duty-curves.ts';
import type { PumpLoad } from '../../core/model/project.ts';
import { solveProject } from '../../core/solve/index.ts';
import { validateProject } from '../../core/solve/validate.ts';
import { onSolved } from '../core/solved.ts';

// Invented fan: Q_r = 2 m³/s, p_r = 1000 Pa, p0 = 1300 Pa, η = 0.7, standard air.
const fanBase = { id: 'fan', name: 'Supply fan', kind: 'fan', from: 'motor', ratedFlow: 2, ratedPressure: 1000, shutoffPressure: 1300, efficiency: 0.7, flow: 1 } as const;

function project(fan: Record<string, unknown>, opts: { drive?: boolean; pumpDuty?: unknown } = {}): Record<string, unknown> {
  const elements: Record<string, unknown>[] = [{ id: 'grid', kind: 'grid', phases: 3, voltage: 400, frequency: 50 }];
  if (opts.drive !== false) {
    elements.push({ id: 'drive', kind: 'drive', from: 'grid', outputVoltage: 400, outputFrequency: 25, inputPowerFactor: 0.95, standardLoss: { ratedApparentPower: 5000, basis: 'cdm' } });
  }
  elements.push({ id: 'motor', kind: 'motor', from: opts.drive === false ? 'grid' : 'drive', ratedOutput: 4000, efficiencyClass: 'IE3', poles: 4, ratedFrequency: 50 });
  elements.push(fan);
  return { format: 'joulepath-project', version: 2, name: 'fan test', elements, ...(opts.pumpDuty !== undefined ? { pumpDuty: opts.pumpDuty } : {}) };
}

describe('fan element: shaft power Q·Δp/η (constant fan efficiency)', () => {
  it('speed control at 50 % flow uses 1/8 of the full-flow shaft power (affinity laws, no static head)', () => {
    const op = fanOperatingPoint({ ...fanBase, control: 'speed' } as FanLoad);
    // By hand: n = Q/Q_r = 0.5; Δp = p_r·n² = 1000 × 0.25 = 250 Pa; P = 1 × 250 / 0.7 = 357.142857 W.
    expect(op.speed).toBeCloseTo(0.5, 12);
    expect(op.pressure).toBeCloseTo(250, 9);
    expect(op.shaftPower).toBeCloseTo(357.142857, 5);
    // Full flow: 2 × 1000 / 0.7 = 2857.142857 W; the ratio is 0.5³ = 1/8 (affinity laws: P ∝ n³).
    expect(op.designShaftPower).toBeCloseTo(2857.142857, 5);
    expect(op.shaftPower / op.designShaftPower).toBeCloseTo(1 / 8, 12);
  });

  it('outlet damper at 50 % flow: full speed on the fan curve, Δp = p0 − a·Q² = 1300 − 75 × 1 = 1225 Pa (quadratic fan curve)', () => {
    const op = fanOperatingPoint({ ...fanBase, control: 'damper' } as FanLoad);
    // By hand: a = (1300 − 1000)/2² = 75 Pa/(m³/s)²; P = 1 × 1225 / 0.7 = 1750 W.
    expect(op.speed).toBe(1);
    expect(op.pressure).toBeCloseTo(1225, 9);
    expect(op.shaftPower).toBeCloseTo(1750, 6);
  });

  it('air of 1.0 kg/m³: pressure and power scale by 1.0/1.2 (fan laws)', () => {
    const op = fanOperatingPoint({ ...fanBase, density: 1.0, control: 'damper' } as FanLoad);
    // By hand: 1225 × 1/1.2 = 1020.833 Pa; 1750 / 1.2 = 1458.333 W.
    expect(op.pressure).toBeCloseTo(1020.833333, 5);
    expect(op.shaftPower).toBeCloseTo(1458.333333, 5);
  });

  it('the chain solve carries it: the fan draws its shaft power from the motor', () => {
    const out = solveProject(project({ ...fanBase, control: 'speed' }));
    if (!out.ok) throw new Error(JSON.stringify(out.problems));
    const fan = out.result.elements.find((e) => e.id === 'fan')!;
    expect(fan.pIn).toBeCloseTo(357.142857, 5);
    expect(fan.loadFraction).toBeCloseTo(1 / 8, 9);
  });

  it('refuses a shut-off pressure not above the rated pressure and a flow above rated, at their fields', () => {
    const a = validateProject(project({ ...fanBase, shutoffPressure: 900, control: 'speed' }));
    expect(a.ok).toBe(false);
    if (!a.ok) expect(a.problems).toMatchObject([{ elementId: 'fan', field: 'shutoffPressure' }]);
    const b = validateProject(project({ ...fanBase, flow: 2.5, control: 'speed' }));
    if (!b.ok) expect(b.problems).toMatchObject([{ elementId: 'fan', field: 'flow' }]);
    expect(b.ok).toBe(false);
  });
});

describe('fan duty study: drive speed control against outlet dampers and on-off', () => {
  const duty = [
    { flow: 2, hours: 1000 },
    { flow: 1.5, hours: 3000 },
    { flow: 1, hours: 2000 },
  ];
  it('names a fan in pumpDuty; shaft powers by hand at each point', () => {
    const out = onSolved(projectPumpDuty, project({ ...fanBase, control: 'speed' }, { pumpDuty: { pump: 'fan', duty } }));
    if (!out.ok) throw new Error(JSON.stringify(out.problems));
    const r = out.result;
    expect(r.machine).toBe('fan');
    expect(out.input.staticHead).toBe(0);
    // Design point: 2857.142857 W at the shaft, 1000 Pa.
    expect(r.designPoint.shaftPower).toBeCloseTo(2857.142857, 5);
    expect(r.designPoint.pressure).toBeCloseTo(1000, 9);
    const [full, p75, p50] = r.points;
    // 50 %: speed control 2857.142857/8 = 357.142857 W; damper 1750 W (worked above).
    expect(p50!.speedControl.speed).toBeCloseTo(0.5, 12);
    expect(p50!.speedControl.shaftPower).toBeCloseTo(357.142857, 5);
    expect(p50!.speedControl.pressure).toBeCloseTo(250, 9);
    expect(p50!.throttle.shaftPower).toBeCloseTo(1750, 6);
    expect(p50!.throttle.pressure).toBeCloseTo(1225, 9);
    // 75 %: speed 2857.142857 × 0.75³ = 1205.357143 W; damper Δp = 1300 − 75 × 2.25 = 1131.25 Pa, 1.5 × 1131.25 / 0.7 = 2424.107143 W.
    expect(p75!.speedControl.shaftPower).toBeCloseTo(1205.357143, 5);
    expect(p75!.throttle.shaftPower).toBeCloseTo(2424.107143, 5);
    // Full flow: every method at the design point's shaft power.
    expect(full!.speedControl.shaftPower).toBeCloseTo(2857.142857, 5);
    expect(full!.throttle.shaftPower).toBeCloseTo(2857.142857, 5);
    // On-off runs at the design point for Q/Q_r of the hours: 1, 0.75, 0.5.
    expect(r.points.map((p) => p.onOffRunFraction)).toEqual([1, 0.75, 0.5]);
    // The choice: the drive uses the least energy of the three at this duty.
    expect(r.speedControl.energyWh).toBeLessThan(r.throttle.energyWh);
    expect(r.speedControl.energyWh).toBeLessThan(r.onOff.energyWh);
    expect(r.method).toMatch(/outlet damper/);
  });

  it('fanDetails: the operating point and the tree check of a damper behind a drive', () => {
    const p = project({ ...fanBase, control: 'damper' });
    const v = validateProject(p);
    if (!v.ok) throw new Error(JSON.stringify(v.problems));
    const [d] = fanDetails(v.project);
    expect(d!.operatingPoint.shaftPower).toBeCloseTo(1750, 6);
    expect(d!.driveId).toBe('drive');
    expect(d!.warnings.join(' ')).toMatch(/"Outlet damper at full speed" runs at full speed, but the drive "drive" feeds the motor "motor"/);
  });

  it('a fan on speed control: a drive at 25 Hz of 50 Hz runs it at the 50 % its 1 of 2 m³/s needs (no warning); at 40 Hz it warns', () => {
    // n = Q/Q_r = 0.5 (affinity laws); the fixture's drive runs at 25 Hz / 50 Hz = 50 %; 40 Hz is 80 %, beyond 2 % of full speed.
    const at = (hz: number) => {
      const p = project({ ...fanBase, control: 'speed' });
      (p['elements'] as Record<string, unknown>[])[1]!['outputFrequency'] = hz;
      const v = validateProject(p);
      if (!v.ok) throw new Error(JSON.stringify(v.problems));
      return fanDetails(v.project)[0]!.warnings;
    };
    expect(at(25)).toEqual([]);
    expect(at(40).join(' ')).toMatch(/needs 50\.0 % speed for 1 m³\/s, but the drive "drive" runs the motor "motor" at 80\.0 %/);
  });

  it('a fan on speed control with no drive warns by name; the study names a fan that is not in the project', () => {
    const out = onSolved(projectPumpDuty, project({ ...fanBase, control: 'speed' }, { drive: false, pumpDuty: { pump: 'fan', duty } }));
    if (!out.ok) throw new Error(JSON.stringify(out.problems));
    expect(out.result.warnings.join(' ')).toMatch(/fan "Supply fan": flow control "Speed \(a drive upstream\)" needs a drive/);
    const bad = onSolved(projectPumpDuty, project({ ...fanBase, control: 'speed' }, { pumpDuty: { pump: 'motor', duty } }));
    expect(bad.ok).toBe(false);
    if (!bad.ok) expect(bad.problems[0]).toMatchObject({ elementId: PROJECT_LEVEL, field: 'pumpDuty.pump', message: expect.stringMatching(/not a pump or fan/) });
  });

  it('a duty flow above the fan\'s rated flow is refused at its row', () => {
    const bad = onSolved(projectPumpDuty, project({ ...fanBase, control: 'speed' }, { pumpDuty: { pump: 'fan', duty: [{ flow: 2.2, hours: 10 }] } }));
    expect(bad.ok).toBe(false);
    if (!bad.ok) expect(bad.problems[0]).toMatchObject({ field: 'pumpDuty.duty.0.flow', message: expect.stringMatching(/rated flow .* of the fan "Supply fan"/) });
  });

  it('the command line prints the fan\'s duty study (pressures in Pa, dampers named)', () => {
    const dir = mkdtempSync(join(tmpdir(), 'joulepath-fan-'));
    const file = join(dir, 'fan.json');
    writeFileSync(file, JSON.stringify(project({ ...fanBase, control: 'speed' }, { pumpDuty: { pump: 'fan', duty } })));
    const r = spawnSync(join('node_modules', '.bin', 'tsx'), ['core/cli/cli.ts', file], { encoding: 'utf8' });
    expect(r.status).toBe(0);
    expect(r.stdout).toContain('Fan duty: flow control comparison (energy per year)');
    // Design point: 2 m³/s = 7200 m³/h at 1000 Pa, shaft 2.86 kW.
    expect(r.stdout).toContain('design point: 7200.0 m³/h at 1000 Pa, shaft 2.86 kW');
    expect(r.stdout).toMatch(/outlet dampers: +\d+ kWh/);
    expect(r.stdout).toMatch(/drive saves \d+ kWh \(\d+\.\d %\) against outlet dampers/);
    // The fan's operating point: speed control at 1 m³/s, 250 Pa, 0.36 kW at the shaft (worked above).
    expect(r.stdout).toContain('Supply fan [fan] speed control: 1 m³/s at 250 Pa, speed 50.0 %, shaft 0.36 kW (motor "motor", drive "drive")');
  }, 30_000);

  it('the command line refuses a fan duty above the rated flow, naming the study, the row and the fan', () => {
    const dir = mkdtempSync(join(tmpdir(), 'joulepath-fan-'));
    const file = join(dir, 'fan-bad.json');
    writeFileSync(file, JSON.stringify(project({ ...fanBase, control: 'speed' }, { pumpDuty: { pump: 'fan', duty: [{ flow: 2.5, hours: 100 }] } })));
    const r = spawnSync(join('node_modules', '.bin', 'tsx'), ['core/cli/cli.ts', file], { encoding: 'utf8' });
    expect(r.status).toBe(1);
    expect(r.stderr).toContain('the pump or fan duty study of the project cannot be run:');
    expect(r.stderr).toMatch(/Duty points, item 1 flow: is above the rated flow 2 m³\/s of the fan "Supply fan"/);
  }, 30_000);
});

describe('pump or fan curve from the maker\'s points: least squares of y = y0 − a·Q²', () => {
  it('three exact points on a known curve give it back (H = 40 − 4000·Q²)', () => {
    // By hand: Q = 0, 0.03, 0.05 m³/s → 40, 40 − 4000 × 0.0009 = 36.4, 40 − 4000 × 0.0025 = 30 m.
    const out = fitFallingQuadratic([
      { flow: 0, value: 40 },
      { flow: 0.03, value: 36.4 },
      { flow: 0.05, value: 30 },
    ]);
    if (!out.ok) throw new Error(out.message);
    expect(out.fit.shutoff).toBeCloseTo(40, 9);
    expect(out.fit.a).toBeCloseTo(4000, 6);
    expect(out.fit.rmsResidual).toBeLessThan(1e-9);
    expect(curveAt(out.fit, 0.05)).toBeCloseTo(30, 9);
  });

  it('four scattered points: the least-squares line in Q² worked by hand', () => {
    // u = Q² = 0, 1, 2, 3; y = 10, 9, 7, 6. ū = 1.5, ȳ = 8; Σ(u−ū)(y−ȳ) = −7; Σ(u−ū)² = 5; slope −1.4;
    // y0 = 8 + 1.4 × 1.5 = 10.1. Residuals −0.1, 0.3, −0.3, 0.1: rms √(0.2/4) = 0.223607, largest 0.3.
    const out = fitFallingQuadratic([
      { flow: 0, value: 10 },
      { flow: 1, value: 9 },
      { flow: Math.SQRT2, value: 7 },
      { flow: Math.sqrt(3), value: 6 },
    ]);
    if (!out.ok) throw new Error(out.message);
    expect(out.fit.shutoff).toBeCloseTo(10.1, 9);
    expect(out.fit.a).toBeCloseTo(1.4, 9);
    expect(out.fit.rmsResidual).toBeCloseTo(0.223607, 6);
    expect(out.fit.maxResidual).toBeCloseTo(0.3, 9);
  });

  it('refuses fewer than three points, one flow only, and points that rise with flow', () => {
    expect(fitFallingQuadratic([{ flow: 0, value: 40 }, { flow: 0.05, value: 30 }])).toMatchObject({ ok: false, message: expect.stringMatching(/three points/) });
    expect(fitFallingQuadratic([{ flow: 0.05, value: 40 }, { flow: 0.05, value: 30 }, { flow: 0.05, value: 35 }])).toMatchObject({ ok: false, message: expect.stringMatching(/two flows/) });
    expect(fitFallingQuadratic([{ flow: 0, value: 30 }, { flow: 0.03, value: 35 }, { flow: 0.05, value: 40 }])).toMatchObject({ ok: false, message: expect.stringMatching(/do not fall/) });
    expect(fitFallingQuadratic([{ flow: 0, value: 30 }, { flow: -1, value: 35 }, { flow: 0.05, value: 20 }])).toMatchObject({ ok: false, index: 1, field: 'flow' });
  });
});

describe('the duty editor\'s curves and the fitted curve written back as the element\'s fields', () => {
  const pump = { id: 'pump', kind: 'pump', from: 'motor', ratedFlow: 0.05, ratedHead: 30, shutoffHead: 40, efficiency: 0.75, staticHead: 10, flow: 0.04, control: 'speed' } as PumpLoad;
  it('pump at 50 % flow: the system needs 10 + 8000 × 0.025² = 15 m, the pump gives 40 − 4000 × 0.025² = 37.5 m at full speed', () => {
    // k = (30 − 10)/0.05² = 8000 m/(m³/s)², a = (40 − 30)/0.05² = 4000 m/(m³/s)² (system and quadratic pump curves).
    const c = dutyCurves(pump);
    expect(c.unit).toBe('m');
    const half = c.rows.find((r) => r.fraction === 0.5)!;
    expect(half.system).toBeCloseTo(15, 12);
    expect(half.machine).toBeCloseTo(37.5, 12);
    expect(c.rows.at(-1)).toMatchObject({ fraction: 1 });
    expect(c.rows.at(-1)!.system).toBeCloseTo(30, 12);
    expect(c.rows.at(-1)!.machine).toBeCloseTo(30, 12);
  });

  it('fan at 50 % flow: the ducts need 1000 × 0.25 = 250 Pa, the fan gives 1225 Pa at full speed', () => {
    const c = dutyCurves({ ...fanBase, control: 'damper' } as FanLoad);
    expect(c.unit).toBe('Pa');
    const half = c.rows.find((r) => r.fraction === 0.5)!;
    expect(half.system).toBeCloseTo(250, 9);
    expect(half.machine).toBeCloseTo(1225, 9);
  });

  it('points on H = 44 − 5600·Q² give shut-off 44 m and 30 m at the rated 0.05 m³/s; the shut-off is written first (it stays above the old rated head)', () => {
    // By hand: 44 − 5600 × 0.0009 = 38.96 m; 44 − 5600 × 0.0025 = 30 m.
    const out = curveFromPoints(pump, [{ flow: 0, value: 44 }, { flow: 0.03, value: 38.96 }, { flow: 0.05, value: 30 }]);
    if (!out.ok) throw new Error(out.message);
    expect(out.shutoff).toBeCloseTo(44, 9);
    expect(out.rated).toBeCloseTo(30, 9);
    expect(out.writes.map((w) => w.path)).toEqual(['shutoffHead', 'ratedHead']);
  });

  it('a lower curve (shut-off 28 m, below the old rated 30 m) writes the rated head first, so each write stays valid', () => {
    // Points on H = 28 − 3200·Q²: 28, 28 − 3200 × 0.0009 = 25.12, 28 − 3200 × 0.0025 = 20 m.
    const out = curveFromPoints(pump, [{ flow: 0, value: 28 }, { flow: 0.03, value: 25.12 }, { flow: 0.05, value: 20 }]);
    if (!out.ok) throw new Error(out.message);
    expect(out.writes.map((w) => w.path)).toEqual(['ratedHead', 'shutoffHead']);
    expect(out.writes[0]!.value).toBeCloseTo(20, 9);
    expect(out.writes[1]!.value).toBeCloseTo(28, 9);
  });

  it('a fitted curve that would fall below the static head at the rated flow is refused', () => {
    const out = curveFromPoints(pump, [{ flow: 0, value: 12 }, { flow: 0.03, value: 10 }, { flow: 0.05, value: 8 }]);
    expect(out).toMatchObject({ ok: false, message: expect.stringMatching(/static head/) });
  });
});

describe('duty levels given as a speed: the flow on the system curve (inverse of the affinity laws)', () => {
  const pump = { id: 'pump', kind: 'pump', from: 'motor', ratedFlow: 0.05, ratedHead: 30, shutoffHead: 40, efficiency: 0.75, staticHead: 10, flow: 0.04, control: 'speed' } as PumpLoad;
  it('pump: n = √0.73 gives 0.04 m³/s (n² = (H_s + (k + a)·Q²)/H0 = (10 + 12000 × 0.0016)/40 = 0.73), and back', () => {
    const out = dutyFlowAtSpeed(pump, Math.sqrt(0.73));
    if (!out.ok) throw new Error(out.message);
    expect(out.flow).toBeCloseTo(0.04, 12);
    expect(dutySpeedAtFlow(pump, 0.04)).toBeCloseTo(Math.sqrt(0.73), 12);
    expect(dutyFlowAtSpeed(pump, 1)).toEqual({ ok: true, flow: 0.05 });
  });

  it('pump: at or below √(H_s/H0) = √(10/40) = 50 % speed it lifts no water: refused, naming the least speed', () => {
    expect(dutyFlowAtSpeed(pump, 0.5)).toMatchObject({ ok: false, message: expect.stringMatching(/above 50.0 %/) });
    expect(dutyFlowAtSpeed(pump, 1.2)).toMatchObject({ ok: false, message: expect.stringMatching(/at most 100 %/) });
  });

  it('fan: no static pressure, so flow = speed × rated flow (affinity laws): 50 % gives 1 m³/s of 2', () => {
    const fan = { ...fanBase, control: 'speed' } as FanLoad;
    const out = dutyFlowAtSpeed(fan, 0.5);
    if (!out.ok) throw new Error(out.message);
    expect(out.flow).toBeCloseTo(1, 12);
    expect(dutySpeedAtFlow(fan, 1.5)).toBeCloseTo(0.75, 12);
  });
});
