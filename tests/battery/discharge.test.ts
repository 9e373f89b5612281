/**
 * Discharge through the chain: profiles with duty cycling (energy by hand), agreement of the
 * repeated solve with the full engine, the end conditions, and the demo study.
 */
import { describe, expect, it } from 'vitest';
import { demoProjects, solveProject, type Element, type Project } from '../../core/index.ts';
import { simulateDischarge, type DischargeResult } from '../../core/studies/backup/discharge.ts';
import { bankOcv, resolveBank } from '../../core/physics/bank.ts';
import { buildTimeline } from '../../core/solve/load-profile.ts';
import { directLoad, flatBank } from './helpers.ts';
import { batteryBenchProject } from './fixtures.ts';
import { onSolved } from '../core/solved.ts';

const ok = (p: unknown): DischargeResult => {
  const out = onSolved(simulateDischarge, p);
  if (!out.ok) throw new Error(JSON.stringify(out.problems));
  return out.result;
};

describe('profiles and duty cycling', () => {
  it('energy = Σ on-time × power: 50 W steady + 100 W for 10 min of every hour over a 5 h profile = 250 + 83.33 Wh (by hand)', () => {
    const p = directLoad(flatBank(1000, 20, 1), 50, {
      profile: { kind: 'segments', segments: [{ durationHours: 5 }], duty: [{ load: 'pump', periodMinutes: 60, onMinutes: 10 }] },
    }, [{ id: 'pump', kind: 'dc-load', from: 'bank', power: 100 }]);
    const r = ok(p);
    expect(r.endReason).toBe('profile-complete');
    expect(r.runtimeIsLowerBound).toBe(true);
    expect(r.runtimeSeconds).toBe(5 * 3600);
    expect(r.loadWh).toBeCloseTo(250 + (5 * 10 * 100) / 60, 9);
  });

  it('switching off the time step is exact: a 7-minute step gives the same energy (duty edges split the steps)', () => {
    const make = (step: number) =>
      directLoad(flatBank(1000, 20, 1), 50, {
        timeStepSeconds: step,
        profile: { kind: 'segments', segments: [{ durationHours: 5 }], duty: [{ load: 'pump', periodMinutes: 60, onMinutes: 10, offsetMinutes: 3 }] },
      }, [{ id: 'pump', kind: 'dc-load', from: 'bank', power: 100 }]);
    expect(ok(make(420)).loadWh).toBeCloseTo(ok(make(60)).loadWh, 9);
    expect(ok(make(420)).loadWh).toBeCloseTo(250 + (5 * 10 * 100) / 60, 9);
  });

  it('segments set loads by power, on or off: 2 h at 30 W, 1 h off, 1 h at the element power 80 W = 140 Wh (by hand)', () => {
    const r = ok(directLoad(flatBank(1000, 20, 1), 80, { profile: { kind: 'segments', segments: [{ durationHours: 2, loads: { load: 30 } }, { durationHours: 1, loads: { load: false } }, { durationHours: 1, loads: { load: true } }] } }));
    expect(r.loadWh).toBeCloseTo(60 + 0 + 80, 9);
  });

  it('a daily profile starting at 18:00 uses the evening segment first and repeats every 24 h', () => {
    const project = demoProjects.find((d) => d.id === 'hillside-relay-hut')!.project;
    const tl = buildTimeline(project, { ...project.backup!, profile: { ...project.backup!.profile, duty: [] } });
    const lightsAt = (hours: number) => {
      const i = tl.intervals.find((x) => x.start <= hours * 3600 && hours * 3600 < x.end)!;
      return tl.states[i.state]![tl.loads.findIndex((l) => l.id === 'lights')]!;
    };
    expect(lightsAt(0.5)).toBe(220); // 18:30: evening segment (starts 18:00)
    expect(lightsAt(6)).toBe(40); // 00:00: night segment (starts 23:00)
    expect(lightsAt(13)).toBe(80); // 07:00: day segment (starts 06:00)
    expect(lightsAt(24.5)).toBe(220); // next evening
  });
});

describe('loads given by their current', () => {
  /** The flat 12 V bank feeding one constant-current load (and optionally a cable to it). */
  const currentLoad = (current: number, study: Parameters<typeof directLoad>[2] = {}, resistancePerKm?: number): Project => {
    const p = directLoad(flatBank(100, 20, 1), 0, study);
    const load = { id: 'load', kind: 'dc-current-load', from: resistancePerKm === undefined ? 'bank' : 'run', current } as Element;
    const run = { id: 'run', kind: 'cable', from: 'bank', length: 10, resistancePerKm } as Element;
    p.elements = [p.elements[0]!, ...(resistancePerKm === undefined ? [] : [run]), load];
    return p;
  };

  it('5 A from a flat, ideal 100 Ah bank with no Peukert effect runs 100 Ah / 5 A = 20 h, at 12 V × 5 A = 60 W (by hand)', () => {
    const r = ok(currentLoad(5));
    expect(r.runtimeIsLowerBound).toBe(false);
    expect(r.runtimeSeconds / 3600).toBeCloseTo(20, 6);
    expect(r.deliveredAh).toBeCloseTo(100, 6);
    expect(r.loadWh).toBeCloseTo(12 * 100, 4);
  });

  it('a profile sets a current load in amperes: 2 h at 4 A, then 1 h at its own 10 A = 18 Ah, 216 Wh at 12 V (by hand)', () => {
    const r = ok(currentLoad(10, { profile: { kind: 'segments', segments: [{ durationHours: 2, loads: { load: 4 } }, { durationHours: 1, loads: { load: true } }] } }));
    expect(r.endReason).toBe('profile-complete');
    expect(r.deliveredAh).toBeCloseTo(18, 9);
    expect(r.loadWh).toBeCloseTo(216, 9);
  });

  it('behind a cable the current stays and the load gets V − I·R: 10 A through 0.1 Ω for 2 h = 20 Ah, (12 − 1) V × 10 A × 2 h = 220 Wh (Ohm’s law)', () => {
    // Loop R = 2 × 10 m × 5 Ω/km = 0.1 Ω.
    const r = ok(currentLoad(10, { profile: { kind: 'segments', segments: [{ durationHours: 2 }] } }, 5));
    expect(r.deliveredAh).toBeCloseTo(20, 9);
    expect(r.loadWh).toBeCloseTo(220, 9);
    expect(r.chainLossWh).toBeCloseTo(10 * 10 * 0.1 * 2, 9); // I²R × t
  });
});

describe('repeated solve agrees with the full engine', () => {
  /** Re-solve the chain with the bank replaced by its Thévenin equivalent at a state of charge, all loads on. */
  function engineAt(project: Project, soc: number) {
    const bankEl = project.elements[0] as Extract<Element, { kind: 'battery' }>;
    const bank = resolveBank(bankEl.bank!);
    const elements = project.elements.map((e, i) => (i === 0 ? ({ id: e.id, kind: 'battery', voltage: bankOcv(bank, soc), internalResistance: bank.internalResistance } as Element) : e));
    const out = solveProject({ ...project, elements, backup: undefined });
    if (!out.ok) throw new Error(JSON.stringify(out.problems));
    return out.result.elements[0]!.output!;
  }

  it.each([
    ['real-arithmetic path (short cables)', 2],
    ['model path (a link too resistive for the DC probe)', 400],
  ])('%s: terminal current and voltage over a constant-load run match solveProject to 1e-9', (_label, length) => {
    const project = batteryBenchProject();
    project.elements = project.elements.map((e) => (e.id === 'dcdc-cable' ? { ...e, length } : e));
    project.backup = { profile: { kind: 'constant' }, horizonHours: 30, temperatureC: 25 };
    const r = ok(project);
    for (const k of [0, 300, 900, r.series.time.length - 2]) {
      const ref = engineAt(project, r.series.soc[k]!);
      expect(Math.abs(r.series.current[k]! - ref.current) / ref.current).toBeLessThan(1e-9);
      expect(Math.abs(r.series.voltage[k]! - ref.voltage) / ref.voltage).toBeLessThan(1e-9);
    }
  });
});

describe('end of discharge', () => {
  it('cut-off voltage first: a resistive lead-acid bank ends at 1.75 V/cell × 6 = 10.5 V under load before its DoD limit', () => {
    const r = ok(directLoad({ chemistry: 'flooded-lead-acid', series: 6, capacityAh: 50, overrides: { internalResistanceOhmAh: 0.6, usableDepthOfDischarge: 0.9 } }, 200, { timeStepSeconds: 30 }));
    expect(r.endReason).toBe('cut-off-voltage');
    expect(r.series.voltage.at(-1)).toBeCloseTo(10.5, 9);
    expect(r.minVoltage).toBeCloseTo(10.5, 9);
    expect(r.endSoc).toBeGreaterThan(r.socLimit);
  });

  it('a light load: runtime "longer than" the horizon, finite, flagged as a lower bound', () => {
    const r = ok(directLoad({ chemistry: 'lifepo4', series: 16, capacityAh: 200 }, 5, { horizonHours: 48 }));
    expect(r.endReason).toBe('horizon');
    expect(r.runtimeIsLowerBound).toBe(true);
    expect(r.runtimeSeconds).toBe(48 * 3600);
    expect(Number.isFinite(r.endSoc)).toBe(true);
  });

  it('energy drawn from the cells = loads + chain losses + internal I²R (demo, to 1e-9 relative)', () => {
    const r = ok(demoProjects.find((d) => d.id === 'hillside-relay-hut')!.project);
    expect(Math.abs(r.drawnWh - r.loadWh - r.chainLossWh - r.internalLossWh) / r.drawnWh).toBeLessThan(1e-9);
    // Terminal energy = drawn − internal I²R (Thévenin source).
    expect(r.deliveredWh).toBeCloseTo(r.drawnWh - r.internalLossWh, 6);
  });
});

describe('demo: hillside relay hut', () => {
  const r = ok(demoProjects.find((d) => d.id === 'hillside-relay-hut')!.project);

  it('ends at the LiFePO4 usable DoD (90 %, common practice): Ah taken = 200 × 0.95 (10 °C, preset) × 0.9 with k = 1.03 below the rated current', () => {
    expect(r.endReason).toBe('depth-of-discharge');
    // Every current stays below C/2 = 100 A, so the Peukert-equivalent charge is the charge itself.
    expect(r.peukertFactor).toBe(1);
    expect(r.deliveredAh).toBeCloseTo(200 * 0.95 * 0.9, 9);
  });

  it('runtime between the bounds given by the extreme currents: 171 Ah ÷ peak A ≤ t ≤ 171 Ah ÷ least A', () => {
    const hours = r.runtimeSeconds / 3600;
    expect(hours).toBeGreaterThanOrEqual(171 / r.peakCurrent);
    expect(hours).toBeLessThanOrEqual(171 / Math.min(...r.series.current));
  });

  it('the inverter standby draw counts: 25 W × runtime (its idleLoss)', () => {
    expect(r.idle.find((d) => d.id === 'inverter')!.energyWh).toBeCloseTo((25 * r.runtimeSeconds) / 3600, 9);
  });
});
