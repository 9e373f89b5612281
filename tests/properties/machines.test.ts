/**
 * Invariants of the flow-control comparison and the drive-loss interpolation (fast-check).
 * - With no static head the drive's shaft energy never exceeds throttling's (the system curve lies
 *   below the pump curve below the design flow; affinity laws). The electrical energy also includes
 *   the drive's own loss (about 2 % of its rating), so at flows near 100 % the drive can use more;
 *   the electrical property is checked for duty flows of 10–80 % of rated (near zero flow the
 *   constant-efficiency model lets the throttled pump's power go to zero while the drive keeps its
 *   no-load loss, so the comparison there says nothing about real pumps).
 * - Savings shrink (never grow) as the static head rises, pump and duty held.
 * - Interpolated drive loss is monotone in torque at fixed speed when the eight points are.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { comparePumpControl, driveLossAt, driveLossGrid, type PumpDutyInput } from '../../core/studies/machines/index.ts';

const uniform = (lo: number, hi: number) => fc.double({ min: lo, max: hi, noNaN: true });

const studyArb = (maxFlowFraction: number, minFlowFraction = 0) =>
  fc
    .record({
      ratedFlow: uniform(0.005, 0.5),
      ratedHead: uniform(5, 80),
      shutoffRatio: uniform(1.05, 1.6),
      pumpEff: uniform(0.4, 0.9),
      // Up to 0.99: throttled below the design flow a steep pump needs up to ~0.6 % more shaft power
      // than at its design point (shut-off head 1.6 × rated; quadratic curve), which a motor loaded to
      // exactly 1.0 at the design point then refuses (beyond its service factor 1.0).
      motorLoad: uniform(0.5, 0.99),
      motorEff: uniform(0.8, 0.96),
      driveSize: uniform(1.0, 1.5),
      // A duty flow is above 0 (zero is refused, as the pump element's own flow): from 0.1 % of rated.
      duty: fc.array(fc.record({ f: uniform(Math.max(minFlowFraction, 0.001), maxFlowFraction), hours: uniform(0, 2000) }), { minLength: 1, maxLength: 4 }),
    })
    .map((g) => {
      const pDesign = (1000 * 9.80665 * g.ratedFlow * g.ratedHead) / g.pumpEff;
      const rated = pDesign / g.motorLoad;
      return (staticHead: number): PumpDutyInput => ({
        pump: { ratedFlow: g.ratedFlow, ratedHead: g.ratedHead, shutoffHead: g.ratedHead * g.shutoffRatio, efficiency: g.pumpEff },
        staticHead: staticHead * g.ratedHead,
        duty: g.duty.map((d) => ({ flow: d.f * g.ratedFlow, hours: d.hours })),
        motor: { ratedOutput: rated, nameplate: { efficiency: g.motorEff } },
        drive: { ratedApparentPower: rated * g.driveSize, basis: 'cdm' },
      });
    });

const run = (s: PumpDutyInput) => {
  const r = comparePumpControl(s);
  if (!r.ok) throw new Error(JSON.stringify(r.problems));
  return r.result;
};

describe('flow-control invariants', () => {
  it('no static head: drive shaft energy ≤ throttling shaft energy at any duty', () => {
    fc.assert(
      fc.property(studyArb(1), (make) => {
        const r = run(make(0));
        const throttleShaft = r.points.reduce((a, p) => a + p.throttle.shaftPower * p.hours, 0);
        expect(r.speedControlShaftEnergyWh).toBeLessThanOrEqual(throttleShaft * (1 + 1e-12) + 1e-9);
      }),
      { numRuns: 200 },
    );
  });

  it('no static head, flows 10–80 %: drive electrical energy (motor and drive losses in) ≤ throttling', () => {
    fc.assert(
      fc.property(studyArb(0.8, 0.1), (make) => {
        const r = run(make(0));
        expect(r.speedControl.energyWh).toBeLessThanOrEqual(r.throttle.energyWh * (1 + 1e-12) + 1e-9);
      }),
      { numRuns: 200 },
    );
  });

  it('savings against throttling shrink as the static head rises (IE2 default drive losses)', () => {
    fc.assert(
      fc.property(studyArb(1), uniform(0, 0.95), uniform(0, 0.95), (make, h1, h2) => {
        const [lo, hi] = h1 <= h2 ? [h1, h2] : [h2, h1];
        const a = run(make(lo));
        const b = run(make(hi));
        expect(b.savingVsThrottleWh).toBeLessThanOrEqual(a.savingVsThrottleWh + 1e-9 * Math.max(1, Math.abs(a.throttle.energyWh)));
      }),
      { numRuns: 200 },
    );
  });
});

describe('drive-loss interpolation', () => {
  // Eight points, each speed row non-decreasing in torque (25 → 50 → 100 %).
  const monotoneEight = fc
    .array(fc.tuple(uniform(0, 500), uniform(0, 500), uniform(0, 500)), { minLength: 3, maxLength: 3 })
    .map((rows) => rows.map(([a, b, c]) => [a, a + b, a + b + c] as const))
    .map(([r0, r50, rTop]) => [r0![0], r0![1], r0![2], r50![0], r50![1], r50![2], rTop![1], rTop![2]]);

  it('is monotone in torque at fixed speed when the points are', () => {
    fc.assert(
      fc.property(monotoneEight, fc.constantFrom<'cdm' | 'pds'>('cdm', 'pds'), uniform(0, 100), uniform(0, 100), uniform(0, 100), (points, basis, s, t1, t2) => {
        const g = driveLossGrid({ ratedApparentPower: 1000, basis, points });
        if (!g.ok) throw new Error('grid');
        const [lo, hi] = t1 <= t2 ? [t1, t2] : [t2, t1];
        expect(driveLossAt(g.grid, s, lo).loss).toBeLessThanOrEqual(driveLossAt(g.grid, s, hi).loss + 1e-9);
      }),
      { numRuns: 500 },
    );
  });
});
