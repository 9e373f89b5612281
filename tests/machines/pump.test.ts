import { PROJECT_LEVEL } from '../../core/model/errors.ts';
import { describe, expect, it } from 'vitest';
import { solveProject } from '../../core/solve/index.ts';
import { validateProject } from '../../core/solve/validate.ts';
import { comparePumpControl, type PumpDutyInput } from '../../core/physics/pump-fan.ts';
import { projectPumpDuty, pumpDetails } from '../../core/studies/machines/pump-duty.ts';
import { pumpOperatingPoint } from '../../core/kinds/pump.ts';
import type { Project, PumpLoad } from '../../core/model/project.ts';
import { onSolved } from '../core/solved.ts';

// Invented pump: Q_r = 0.05 m³/s, H_r = 30 m, H0 = 40 m, H_s = 10 m, η = 0.75, water.
const pumpBase = { id: 'pump', kind: 'pump', from: 'motor', ratedFlow: 0.05, ratedHead: 30, shutoffHead: 40, efficiency: 0.75, staticHead: 10, flow: 0.04 } as const;

function project(pump: Record<string, unknown>, opts: { drive?: boolean; driveFrequency?: number; pumpDuty?: unknown } = {}): Record<string, unknown> {
  const elements: Record<string, unknown>[] = [{ id: 'grid', kind: 'grid', phases: 3, voltage: 400, frequency: 50 }];
  if (opts.drive !== false) {
    elements.push({ id: 'drive', kind: 'drive', from: 'grid', outputVoltage: 400, outputFrequency: opts.driveFrequency ?? 42.72, inputPowerFactor: 0.95, standardLoss: { ratedApparentPower: 30000, basis: 'cdm' } });
  }
  elements.push({ id: 'motor', kind: 'motor', from: opts.drive === false ? 'grid' : 'drive', ratedOutput: 22000, efficiencyClass: 'IE3', poles: 4, ratedFrequency: 50 });
  elements.push(pump);
  return { format: 'joulepath-project', version: 2, name: 'pump test', elements, ...(opts.pumpDuty !== undefined ? { pumpDuty: opts.pumpDuty } : {}) };
}

describe('pump element: shaft power ρ·g·Q·H/η at the operating point (constant pump efficiency)', () => {
  it('speed control: on the system curve, H = H_s + k·Q² = 10 + 20·0.8² = 22.8 m; n = √((H_s + (k + a)·Q²)/H0) = √0.73 (affinity laws)', () => {
    const op = pumpOperatingPoint({ ...pumpBase, control: 'speed' } as PumpLoad);
    // By hand: Q/Q_r = 0.8; (10 + 30 × 0.64)/40 = 29.2/40 = 0.73; √0.73 = 0.854400.
    expect(op.head).toBeCloseTo(22.8, 12);
    expect(op.speed).toBeCloseTo(0.8544004, 7);
    // P_h = 1000 × 9.80665 × 0.04 × 22.8 = 8943.66 W; P_shaft = 8943.66 / 0.75 = 11924.89 W.
    expect(op.hydraulicPower).toBeCloseTo(8943.6648, 4);
    expect(op.shaftPower).toBeCloseTo(11924.8864, 4);
    // Design point by hand: 1000 × 9.80665 × 0.05 × 30 / 0.75 = 19613.3 W.
    expect(op.designShaftPower).toBeCloseTo(19613.3, 6);
  });

  it('throttle: full speed on the pump curve, H = H0 − a·Q² = 40 − 10·0.64 = 33.6 m (quadratic pump curve)', () => {
    const op = pumpOperatingPoint({ ...pumpBase, control: 'throttle' } as PumpLoad);
    expect(op.speed).toBe(1);
    expect(op.head).toBeCloseTo(33.6, 12);
    // By hand: 1000 × 9.80665 × 0.04 × 33.6 / 0.75 = 17573.52 W.
    expect(op.shaftPower).toBeCloseTo(17573.5168, 4);
  });

  it('the chain solve carries it: pump pIn = shaft power, motor input = shaft / η_motor(x)', () => {
    const out = solveProject(project({ ...pumpBase, control: 'speed' }));
    if (!out.ok) throw new Error(JSON.stringify(out.problems));
    const pump = out.result.elements.find((e) => e.id === 'pump')!;
    const motor = out.result.elements.find((e) => e.id === 'motor')!;
    expect(pump.pIn).toBeCloseTo(11924.8864, 4);
    expect(pump.loadFraction).toBeCloseTo(11924.8864 / 19613.3, 9);
    expect(motor.pOut).toBeCloseTo(11924.8864, 4);
    expect(motor.pIn).toBeCloseTo(motor.pOut / motor.efficiency, 9);
    expect(motor.pIn).toBeGreaterThan(motor.pOut);
  });

  it('with a constant-efficiency motor (η = 0.93): motor input = 11924.89 / 0.93 = 12822.46 W (definition of efficiency)', () => {
    const p = project({ ...pumpBase, control: 'speed' });
    const els = p['elements'] as Record<string, unknown>[];
    els[2] = { id: 'motor', kind: 'motor', from: 'drive', ratedOutput: 22000, loss: { model: 'constant', efficiency: 0.93 }, powerFactor: { model: 'constant', powerFactor: 0.85 } };
    const out = solveProject(p);
    if (!out.ok) throw new Error(JSON.stringify(out.problems));
    expect(out.result.elements.find((e) => e.id === 'motor')!.pIn).toBeCloseTo(11924.8864 / 0.93, 3);
  });

  it.each([
    [{ shutoffHead: 30 }, 'shutoffHead'],
    [{ staticHead: 30 }, 'staticHead'],
    [{ staticHead: -1 }, 'staticHead'],
    [{ flow: 0.06 }, 'flow'],
    [{ flow: 0 }, 'flow'],
    [{ efficiency: 1.2 }, 'efficiency'],
    [{ control: 'valve' }, 'control'],
  ])('refuses %o naming the field %s', (change, field) => {
    const out = solveProject(project({ ...pumpBase, control: 'speed', ...change }));
    expect(out.ok).toBe(false);
    if (!out.ok) expect(out.problems.some((p) => p.elementId === 'pump' && p.field === field)).toBe(true);
  });
});

describe('pump tree checks (pumpDetails)', () => {
  const details = (p: Record<string, unknown>) => {
    const v = validateProject(p);
    if (!v.ok) throw new Error(JSON.stringify(v.problems));
    return pumpDetails(v.project)[0]!;
  };
  it('speed control with a drive at the needed speed (42.72/50 = 85.44 %): no warning', () => {
    const d = details(project({ ...pumpBase, control: 'speed' }));
    expect(d.driveId).toBe('drive');
    expect(d.driveSpeed).toBeCloseTo(0.8544, 12);
    expect(d.warnings).toEqual([]);
  });
  it('speed control with no drive upstream of the motor warns', () => {
    const d = details(project({ ...pumpBase, control: 'speed' }, { drive: false }));
    expect(d.warnings.join(' ')).toMatch(/no drive feeds the motor "motor"/);
  });
  it('speed control with the drive at another speed (50/50 = 100 % vs 85.4 %) warns', () => {
    const d = details(project({ ...pumpBase, control: 'speed' }, { driveFrequency: 50 }));
    expect(d.warnings.join(' ')).toMatch(/the drive "drive" runs the motor "motor" at 100.0 %/);
  });
  it('throttle fed through a drive warns; throttle on the grid does not', () => {
    expect(details(project({ ...pumpBase, control: 'throttle' })).warnings.join(' ')).toMatch(/flow control "Throttle valve at full speed" runs at full speed, but the drive "drive"/);
    expect(details(project({ ...pumpBase, control: 'throttle' }, { drive: false })).warnings).toEqual([]);
  });
});

describe('projectPumpDuty: the chain\'s own pump, motor and drive', () => {
  const duty = [
    { flow: 0.05, hours: 1000 },
    { flow: 0.04, hours: 3000 },
    { flow: 0.025, hours: 2000 },
  ];
  it('equals comparePumpControl run by hand on the same inputs', () => {
    const out = onSolved(projectPumpDuty, project({ ...pumpBase, control: 'speed' }, { pumpDuty: { pump: 'pump', duty } }));
    if (!out.ok) throw new Error(JSON.stringify(out.problems));
    const byHand: PumpDutyInput = {
      id: 'pumpDuty',
      pump: { ratedFlow: 0.05, ratedHead: 30, shutoffHead: 40, efficiency: 0.75 },
      staticHead: 10,
      duty,
      motor: { ratedOutput: 22000, efficiencyClass: 'IE3', poles: 4, ratedFrequency: 50 },
      drive: { ratedApparentPower: 30000, basis: 'cdm' },
    };
    const ref = comparePumpControl(byHand);
    if (!ref.ok) throw new Error(JSON.stringify(ref.problems));
    expect(out.input).toEqual(byHand);
    expect(out.result.speedControl).toEqual(ref.result.speedControl);
    expect(out.result.throttle).toEqual(ref.result.throttle);
    expect(out.result.onOff).toEqual(ref.result.onOff);
    expect(out.result.points).toEqual(ref.result.points);
    // The speed-control point at 0.04 m³/s is the element's own operating point (same helpers).
    expect(out.result.points[1]!.speedControl.shaftPower).toBeCloseTo(11924.8864, 4);
  });

  it('a drive with a loss model (not standardLoss) enters as IE2 defaults sized to the motor, said in a warning', () => {
    const p = project({ ...pumpBase, control: 'speed' }, { pumpDuty: { pump: 'pump', duty } });
    const els = p['elements'] as Record<string, unknown>[];
    els[1] = { id: 'drive', kind: 'drive', from: 'grid', outputVoltage: 400, outputFrequency: 42.72, inputPowerFactor: 0.95, loss: { model: 'constant', efficiency: 0.97 } };
    const out = onSolved(projectPumpDuty, p);
    if (!out.ok) throw new Error(JSON.stringify(out.problems));
    expect(out.input.drive.basis).toBe('cdm');
    expect(out.input.drive.points).toBeUndefined();
    expect(out.result.warnings.join(' ')).toMatch(/drive "drive" has no IEC 61800-9-2 operating points/);
  });

  const bad = (pumpDuty: unknown) => {
    const p = project({ ...pumpBase, control: 'speed' }, { pumpDuty });
    const out = onSolved(projectPumpDuty, p);
    expect(out.ok).toBe(false);
    return out.ok ? [] : out.problems;
  };
  it('unknown pump id', () => {
    // The study belongs to the project: its problems name the project and the study's field (no element is "pumpDuty").
    expect(bad({ pump: 'nope', duty })).toMatchObject([{ elementId: PROJECT_LEVEL, field: 'pumpDuty.pump', value: 'nope' }]);
  });
  it('an element that is not a pump', () => {
    expect(bad({ pump: 'motor', duty })[0]!.message).toMatch(/names "motor", a motor, not a pump/);
  });
  it('negative flow and negative hours name the duty row', () => {
    const problems = bad({ pump: 'pump', duty: [{ flow: -0.01, hours: 10 }, { flow: 0.01, hours: -5 }] });
    expect(problems.map((p) => p.field).sort()).toEqual(['pumpDuty.duty.0.flow', 'pumpDuty.duty.1.hours']);
  });
  it('hours over 8760 in total (5000 + 4000 = 9000 h)', () => {
    expect(bad({ pump: 'pump', duty: [{ flow: 0.03, hours: 5000 }, { flow: 0.02, hours: 4000 }] })).toMatchObject([{ elementId: PROJECT_LEVEL, field: 'pumpDuty.duty', value: 9000 }]);
  });
  it('a flow above the pump\'s rated flow', () => {
    expect(bad({ pump: 'pump', duty: [{ flow: 0.051, hours: 10 }] })).toMatchObject([{ elementId: PROJECT_LEVEL, field: 'pumpDuty.duty.0.flow', value: 0.051 }]);
  });
  it('no pumpDuty at all', () => {
    expect(bad(undefined)).toMatchObject([{ elementId: PROJECT_LEVEL, field: 'pumpDuty' }]);
  });
  it('a motor too small for the throttled peak is refused on the motor element', () => {
    const p = project({ ...pumpBase, control: 'speed' }, { pumpDuty: { pump: 'pump', duty } });
    const els = p['elements'] as Record<string, unknown>[];
    els[2] = { ...els[2], ratedOutput: 18500 };
    const out = onSolved(projectPumpDuty, p);
    expect(out.ok).toBe(false);
    if (!out.ok) expect(out.problems[0]).toMatchObject({ elementId: 'motor', field: 'ratedOutput' });
  });
});

describe('riverside demo carries its pump duty study', () => {
  it('runs on the demo file', async () => {
    const demo = (await import('../../core/demos/riverside-pump-station.json', { with: { type: 'json' } })).default as unknown as Project;
    const out = onSolved(projectPumpDuty, demo);
    if (!out.ok) throw new Error(JSON.stringify(out.problems));
    expect(out.result.totalHours).toBe(8000);
    expect(out.result.savingVsThrottleWh).toBeGreaterThan(0);
  });
});
