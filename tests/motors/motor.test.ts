/**
 * Motors given by class presets or nameplate: full-load efficiency from the tables, the
 * common-practice part-load shape, line current against NEC Table 430.250, service factor, and
 * refusals naming the field. Hand values name their source beside them.
 */
import { describe, expect, it } from 'vitest';
import { solveProject } from '../../core/index.ts';
import { classEfficiency, machineDetails, necFullLoadCurrent, partLoadRatios, solveWithMachines } from '../../core/studies/machines/index.ts';
import type { Project } from '../../core/model/project.ts';
import { onSolved } from '../core/solved.ts';

const SQRT3 = Math.sqrt(3);

const project = (motor: Record<string, unknown>, shaftPower: number, grid: Record<string, unknown> = { voltage: 460, frequency: 60 }): Project =>
  ({
    format: 'joulepath-project',
    version: 2,
    name: 'motor test',
    elements: [
      { id: 'mains', kind: 'grid', phases: 3, ...grid },
      { id: 'm', kind: 'motor', from: 'mains', ...motor },
      { id: 'load', kind: 'shaft-load', from: 'm', power: shaftPower },
    ],
  }) as Project;

const nema10 = { ratedOutput: 7457, efficiencyClass: 'NEMA-premium', poles: 4, ratedFrequency: 60, ratedVoltage: 460 };

describe('class presets', () => {
  it('NEMA Premium 10 hp 4-pole 60 Hz = 91.7 % (NEMA MG 1 Table 12-12, NRCan published table, confirmed)', () => {
    const r = classEfficiency('NEMA-premium', 7457, 4, 60);
    expect(r).toMatchObject({ provenance: 'confirmed' });
    expect((r as { efficiency: number }).efficiency).toBeCloseTo(0.917, 12);
  });

  it('IE3 4 kW 4-pole 50 Hz = 88.6 % (IEC 60034-30-1 Table 4, confirmed via the 60034-30:2008 copy)', () => {
    const r = classEfficiency('IE3', 4000, 4, 50);
    expect(r).toMatchObject({ provenance: 'confirmed' });
    expect((r as { efficiency: number }).efficiency).toBeCloseTo(0.886, 12);
  });

  it('IE4 37 kW is carried from memory and says so', () => {
    const r = classEfficiency('IE4', 37000, 4, 50);
    expect(r).toMatchObject({ provenance: 'from memory' });
    expect((r as { efficiency: number }).efficiency).toBeCloseTo(0.952, 12);
  });

  it('IE2 5.5 kW: interpolated in log(kW) between 4 and 7.5 kW, flagged; lands within 0.1 point of the printed 87.7 % (IEC 60034-30-1 Table 3, from memory)', () => {
    const r = classEfficiency('IE2', 5500, 4, 50);
    if ('code' in r) throw new Error(r.message);
    // Hand: t = log(5.5/4)/log(7.5/4); η = 86.6 + t·(88.7 − 86.6).
    const t = Math.log(5.5 / 4) / Math.log(7.5 / 4);
    expect(r.efficiency).toBeCloseTo((86.6 + t * 2.1) / 100, 12);
    expect(r.provenance).toBe('interpolated');
    expect(Math.abs(r.efficiency * 100 - 87.7)).toBeLessThan(0.1);
  });

  it('IE1 is not carried above 11 kW: refused naming ratedOutput', () => {
    expect(classEfficiency('IE1', 15000, 4, 50)).toMatchObject({ code: 'outside-table', field: 'ratedOutput' });
  });

  it('a preset asked for the wrong poles or frequency is refused naming that field', () => {
    expect(classEfficiency('IE3', 4000, 2, 50)).toMatchObject({ code: 'outside-table', field: 'poles' });
    expect(classEfficiency('NEMA-premium', 7457, 4, 50)).toMatchObject({ code: 'outside-table', field: 'ratedFrequency' });
  });
});

describe('part-load shape (core/data/motor-part-load.ts, common practice, no source)', () => {
  it('between points it interpolates linearly: at 62.5 % load η ratio = (0.99 + 1.003)/2, pf ratio = (0.80 + 0.94)/2', () => {
    const r = partLoadRatios(0.625);
    expect(r.efficiency).toBeCloseTo((0.99 + 1.003) / 2, 12);
    expect(r.powerFactor).toBeCloseTo((0.8 + 0.94) / 2, 12);
    expect(r.extrapolated).toBe(false);
  });
  it('below 25 % it holds the end value and flags it', () => {
    expect(partLoadRatios(0.1)).toEqual({ efficiency: 0.945, powerFactor: 0.55, extrapolated: true });
  });
});

describe('a NEMA Premium 10 hp motor at 75 % load on a stiff 460 V supply', () => {
  const shaft = 0.75 * 7457;
  const outcome = solveProject(project(nema10, shaft));
  if (!outcome.ok) throw new Error(JSON.stringify(outcome.problems));
  const m = outcome.result.elements.find((e) => e.id === 'm')!;
  // Hand: η = 0.917 × 1.003 (shape at 75 %); pf = 0.82 (typical ≤ 7.5 kW) × 0.94; P_in = P/η; I = P_in/(√3·460·pf).
  const eta = 0.917 * 1.003;
  const pf = 0.82 * 0.94;
  const pIn = shaft / eta;

  it('P_in = P_shaft / (η_FL · r_η(0.75)) (efficiency definition)', () => {
    expect(m.pIn).toBeCloseTo(pIn, 9);
  });
  it('input power factor = pf_FL · r_pf(0.75), line current = P/(√3·V·pf)', () => {
    expect(m.input!.powerFactor).toBeCloseTo(pf, 12);
    expect(m.input!.current).toBeCloseTo(pIn / (SQRT3 * 460 * pf), 9);
  });
  it('reports the NEC Table 430.250 current 14 A (10 hp, 460 V; NFPA 70-2023) with the 430.6(A)(1) note, and the rating estimate', () => {
    const d = machineDetails(outcome).motors[0]!;
    expect(d.nec).toMatchObject({ amps: 14, hp: 10, voltage: 460 });
    expect(d.nec!.note).toContain('430.6(A)(1)');
    expect(d.nec!.note).toContain('licensed practice');
    // I_FL = P_rated/(√3·V·η_FL·pf_FL) (three-phase power).
    expect(d.estimatedFullLoadCurrent).toBeCloseTo(7457 / (SQRT3 * 460 * 0.917 * 0.82), 9);
    expect(d.lineCurrent).toBeCloseTo(m.input!.current, 12);
  });
  it('gives no warning at 75 % load', () => {
    expect(outcome.result.warnings).toEqual([]);
  });
});

describe('NEC Table 430.250 applicability', () => {
  it('no column for 400 V, no row for 6 hp (not a horsepower the table lists): says why', () => {
    expect(necFullLoadCurrent(7457, 400)).toMatchObject({ reason: expect.stringContaining('400 V') });
    expect(necFullLoadCurrent(6 * 745.7, 460)).toMatchObject({ reason: expect.stringContaining('6.00 hp') });
  });
  it('7.5 hp at 460 V = 11 A (NFPA 70-2023 Table 430.250)', () => {
    expect(necFullLoadCurrent(7.5 * 745.7, 460)).toMatchObject({ amps: 11, hp: 7.5 });
  });
  it('50 hp at 230 V = 130 A (NFPA 70-2023 Table 430.250)', () => {
    expect(necFullLoadCurrent(50 * 745.7, 230)).toMatchObject({ amps: 130 });
  });
});

describe('nameplate motor', () => {
  it('uses the nameplate full-load efficiency and power factor at full load (x = 1, shape ratio 1)', () => {
    const o = solveProject(project({ ratedOutput: 15000, nameplate: { efficiency: 0.93, powerFactor: 0.86 } }, 15000, { voltage: 400, frequency: 50 }));
    if (!o.ok) throw new Error(JSON.stringify(o.problems));
    const m = o.result.elements.find((e) => e.id === 'm')!;
    expect(m.pIn).toBeCloseTo(15000 / 0.93, 9);
    expect(m.input!.powerFactor).toBeCloseTo(0.86, 12);
  });
});

describe('service factor', () => {
  it('a load between rated and SF × rated solves with a warning', () => {
    const o = onSolved(solveWithMachines, project({ ...nema10, serviceFactor: 1.15 }, 1.1 * 7457));
    expect(o.ok).toBe(true);
    if (o.ok) expect(o.result.warnings.map((w) => w.message).join()).toContain('within the service factor 1.15');
  });
  it('a load beyond SF × rated is refused naming the motor and ratedOutput; nothing is returned', () => {
    const o = onSolved(solveWithMachines, project({ ...nema10, serviceFactor: 1.15 }, 1.2 * 7457));
    expect(o.ok).toBe(false);
    if (!o.ok) {
      expect(o.problems).toHaveLength(1);
      expect(o.problems[0]).toMatchObject({ elementId: 'm', field: 'ratedOutput' });
      expect(o.problems[0]!.message).toContain('service factor 1.15');
      expect(o).not.toHaveProperty('result');
    }
  });
  it('without a stated service factor (1.0) any overload is refused', () => {
    expect(onSolved(solveWithMachines, project(nema10, 1.01 * 7457)).ok).toBe(false);
  });
  it('the plain chain solve refuses it too (the CLI and the app see the same refusal)', () => {
    const o = solveProject(project({ ...nema10, serviceFactor: 1.15 }, 1.2 * 7457));
    expect(o.ok).toBe(false);
    if (!o.ok) expect(o.problems).toEqual([expect.objectContaining({ code: 'invalid-value', elementId: 'm', field: 'ratedOutput' })]);
  });
});

describe('bad motor input: a clear problem naming element and field', () => {
  const problemsOf = (motor: Record<string, unknown>) => {
    const o = solveProject(project(motor, 1000));
    if (o.ok) throw new Error('expected a refusal');
    return o.problems;
  };
  it('an unknown efficiency class', () => {
    const p = problemsOf({ ...nema10, efficiencyClass: 'IE9' });
    expect(p[0]).toMatchObject({ elementId: 'm', field: 'efficiencyClass' });
    expect(p[0]!.message).toContain('IE1, IE2, IE3, IE4, NEMA-premium');
  });
  it('a preset beside an explicit loss model', () => {
    const p = problemsOf({ ...nema10, loss: { model: 'constant', efficiency: 0.9 }, powerFactor: { model: 'constant', powerFactor: 0.8 } });
    expect(p[0]).toMatchObject({ elementId: 'm', field: 'efficiencyClass' });
  });
  it('no efficiency at all', () => {
    expect(problemsOf({ ratedOutput: 7457 })[0]).toMatchObject({ elementId: 'm', field: 'loss' });
  });
  it('a preset outside the carried table', () => {
    expect(problemsOf({ ...nema10, ratedOutput: 400 * 745.7 })[0]).toMatchObject({ elementId: 'm', field: 'ratedOutput', code: 'outside-table' });
  });
  it('a service factor below 1', () => {
    expect(problemsOf({ ...nema10, serviceFactor: 0.9 })[0]).toMatchObject({ elementId: 'm', field: 'serviceFactor' });
  });
});
