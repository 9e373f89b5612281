/**
 * Drive losses from the eight IEC 61800-9-2 points: exact at each point, bilinear between them
 * (worked by hand), clamped and flagged outside the grid, refused outside 0–100 %; the drive stage
 * in a solved chain; true power factor with current distortion.
 */
import { describe, expect, it } from 'vitest';
import { solveProject } from '../../core/index.ts';
import { driveLossAt, driveLossAtPoint, driveLossGrid, machineDetails, truePowerFactor } from '../../core/studies/machines/index.ts';
import { STANDARD_POINTS } from '../../core/data/iec-61800-9-2.ts';
import type { DriveStandardLoss, Project } from '../../core/model/project.ts';

// Maker-style losses at the eight points, W (invented for the test; CDM basis).
const EIGHT = [90, 110, 170, 100, 130, 200, 150, 240];
const spec: DriveStandardLoss = { ratedApparentPower: 10000, basis: 'cdm', points: EIGHT };
const grid = (() => {
  const g = driveLossGrid(spec);
  if (!g.ok) throw new Error('grid');
  return g.grid;
})();

describe('interpolation over the IEC 61800-9-2 points', () => {
  it.each(STANDARD_POINTS.cdm.map((p, i) => [p.speed, p.torque, EIGHT[i]!]))('returns the given loss exactly at (%s %%, %s %%) = %s W', (s, t, loss) => {
    const r = driveLossAt(grid, s, t);
    expect(r.loss).toBe(loss);
    expect(r.clamped).toBe(false);
  });

  it('PDS basis: the top points sit at 100 % speed', () => {
    const g = driveLossGrid({ ...spec, basis: 'pds' });
    if (!g.ok) throw new Error('grid');
    expect(driveLossAt(g.grid, 100, 100)).toMatchObject({ loss: 240, clamped: false });
    expect(driveLossAt(g.grid, 90, 100).loss).toBeCloseTo(200 + (40 / 50) * 40, 12); // linear in speed, 50→100 %
  });

  it('by hand at (25 %, 75 %): rows 0 % → 110 + ½·60 = 140 W and 50 % → 130 + ½·70 = 165 W; halfway = 152.5 W (bilinear)', () => {
    expect(driveLossAt(grid, 25, 75).loss).toBeCloseTo(152.5, 12);
  });

  it('by hand at (70 %, 37.5 %) uses the completed node L(90,25) = 150 + (100 − 130) = 120 W: mean of 100, 130, 120, 150 = 125 W', () => {
    expect(driveLossAt(grid, 70, 37.5).loss).toBeCloseTo(125, 12);
  });

  it('outside the grid (speed 95 % on the CDM basis, torque 10 %) clamps to the edge and flags it', () => {
    const r = driveLossAt(grid, 95, 10);
    expect(r).toMatchObject({ speed: 90, torque: 25, clamped: true });
    expect(r.loss).toBeCloseTo(120, 12);
  });

  it('IE2 class-reference defaults (common practice, no source): 2.4 % of rated apparent power at (90, 100)', () => {
    const g = driveLossGrid({ ratedApparentPower: 10000, basis: 'cdm' });
    if (!g.ok) throw new Error('grid');
    expect(driveLossAt(g.grid, 90, 100).loss).toBeCloseTo(240, 9);
    expect(g.grid.source).toContain("typical values: use the maker's figures");
  });
});

describe('bad operating points and loss points: refused, naming the field', () => {
  it.each([
    [-5, 50, 'operatingPoint.speed'],
    [110, 50, 'operatingPoint.speed'],
    [50, -1, 'operatingPoint.torque'],
    [50, 120, 'operatingPoint.torque'],
  ])('(%s %%, %s %%) → %s', (speed, torque, field) => {
    const r = driveLossAtPoint(spec, { speed, torque }, 'd1');
    expect(r.ok).toBe(false);
    if (!r.ok) {
      expect(r.problems[0]).toMatchObject({ elementId: 'd1', field });
      expect(r.problems[0]!.message).toContain('0–100 %');
    }
  });
  it('seven loss points instead of eight', () => {
    const r = driveLossAtPoint({ ...spec, points: EIGHT.slice(1) }, { speed: 50, torque: 50 });
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.problems[0]).toMatchObject({ field: 'standardLoss.points' });
  });
  it('PDS basis without points (no defaults exist for drive + motor)', () => {
    expect(driveLossGrid({ ratedApparentPower: 1000, basis: 'pds' }).ok).toBe(false);
  });
});

describe('true power factor (pf = pf_disp/√(1 + THD_i²), undistorted voltage)', () => {
  it('0.98 displacement with 35 % THD_i → 0.98/√1.1225 = 0.924981… (formula worked by hand: √1.1225 = 1.059481)', () => {
    expect(truePowerFactor(0.98, 0.35)).toBeCloseTo(0.98 / Math.sqrt(1.1225), 14);
    expect(truePowerFactor(0.98, 0.35)).toBeCloseTo(0.924981, 6);
  });
});

const chain = (drive: Record<string, unknown>, load = 3750): Project =>
  ({
    format: 'joulepath-project',
    version: 2,
    name: 'drive test',
    elements: [
      { id: 'mains', kind: 'grid', phases: 3, voltage: 480, frequency: 60 },
      { id: 'vfd', kind: 'drive', from: 'mains', outputVoltage: 460, outputFrequency: 45, inputPowerFactor: 0.96, ...drive },
      { id: 'fan', kind: 'ac-load', from: 'vfd', power: load, powerFactor: 0.85 },
    ],
  }) as Project;

describe('the drive stage in a solved chain', () => {
  // Speed = 45/60 = 75 %; torque = 100·3750/(10000·0.75) = 50 %.
  // Hand: loss at (75, 50) = (1 − 0.625)·130 + 0.625·150 = 142.5 W (bilinear, f_s = 25/40).
  const p = chain({ standardLoss: spec, currentThd: 0.35 });
  const o = solveProject(p);
  if (!o.ok) throw new Error(JSON.stringify(o.problems));
  const vfd = o.result.elements.find((e) => e.id === 'vfd')!;

  it('loss 142.5 W at 75 % speed and 50 % torque (worked by hand)', () => {
    expect(vfd.loss).toBeCloseTo(142.5, 9);
    expect(vfd.pIn).toBeCloseTo(3892.5, 9);
  });
  it('input displacement pf as given; details give the operating point, true pf and rms current', () => {
    expect(vfd.input!.powerFactor).toBeCloseTo(0.96, 12);
    const d = machineDetails(o).drives[0]!;
    expect(d.speedPercent).toBeCloseTo(75, 12);
    expect(d.torquePercent).toBeCloseTo(50, 12);
    expect(d.clamped).toBe(false);
    expect(d.truePowerFactor).toBeCloseTo(0.96 / Math.sqrt(1 + 0.35 ** 2), 14);
    expect(d.inputCurrentRms).toBeCloseTo(vfd.input!.current * Math.sqrt(1 + 0.35 ** 2), 12);
  });
  it('an output frequency above the motor rated frequency (speed above 100 %) is refused naming outputFrequency', () => {
    const bad = solveProject(chain({ standardLoss: spec, motorRatedFrequency: 40 }));
    expect(bad.ok).toBe(false);
    if (!bad.ok) expect(bad.problems[0]).toMatchObject({ elementId: 'vfd', field: 'outputFrequency' });
  });
  it('both loss and standardLoss, or neither, is refused naming loss', () => {
    const both = solveProject(chain({ standardLoss: spec, loss: { model: 'constant', efficiency: 0.97 } }));
    const none = solveProject(chain({}));
    for (const o2 of [both, none]) {
      expect(o2.ok).toBe(false);
      if (!o2.ok) expect(o2.problems[0]).toMatchObject({ elementId: 'vfd', field: 'loss' });
    }
  });
  it('a load beyond the drive rating warns and is flagged as clamped', () => {
    const o2 = solveProject(chain({ standardLoss: spec }, 9000));
    expect(o2.ok).toBe(true);
    if (o2.ok) expect(o2.result.warnings.map((w) => w.code)).toEqual(['rating-exceeded', 'curve-extrapolated']);
  });
});

describe('a drive rated below the motor it feeds', () => {
  const chain = (driveRated: number, motorRated: number, shaft: number, via = false): Project =>
    ({
      format: 'joulepath-project',
      version: 2,
      name: 'undersized drive',
      elements: [
        { id: 'supply', kind: 'grid', phases: 3, voltage: 400, frequency: 50 },
        { id: 'vfd', name: 'Fan drive', kind: 'drive', from: 'supply', outputVoltage: 400, outputFrequency: 50, inputPowerFactor: 0.95, loss: { model: 'constant', efficiency: 0.97, ratedPower: driveRated } },
        ...(via ? [{ id: 'run', kind: 'cable', from: 'vfd', length: 5, resistancePerKm: 0.5 }] : []),
        { id: 'm', name: 'Fan motor', kind: 'motor', from: via ? 'run' : 'vfd', ratedOutput: motorRated, efficiencyClass: 'IE3', poles: 4, ratedFrequency: 50 },
        { id: 'fan', kind: 'shaft-load', from: 'm', power: shaft },
      ],
    }) as Project;
  const warnings = (p: Project) => {
    const o = solveProject(p);
    if (!o.ok) throw new Error(JSON.stringify(o.problems));
    return o.result.warnings.filter((w) => w.elementId === 'vfd');
  };

  it('warns, naming the drive and the motor, when an 11 kW drive feeds a 22 kW motor at light load', () => {
    // Common practice (no source): a drive is rated at least for its motor's rated output. At 5 kW on
    // the shaft the drive's own load check (output above its rating) does not fire; this one does.
    const w = warnings(chain(11000, 22000, 5000));
    expect(w).toHaveLength(1);
    expect(w[0]!.code).toBe('rating-exceeded');
    expect(w[0]!.message).toContain('drive "Fan drive" is rated 11 kW');
    expect(w[0]!.message).toContain('22 kW rated output of motor "Fan motor"');
    expect(w[0]!.message).not.toMatch(/"vfd"|"m"/);
    // Through a cable the same.
    expect(warnings(chain(11000, 22000, 5000, true))).toHaveLength(1);
  });

  it('is quiet when the drive is rated for the motor (22 kW on 22 kW, 30 kW on 22 kW)', () => {
    // Common practice (no source): equal ratings are a matched pair.
    expect(warnings(chain(22000, 22000, 15000))).toEqual([]);
    expect(warnings(chain(30000, 22000, 15000))).toEqual([]);
  });
});
