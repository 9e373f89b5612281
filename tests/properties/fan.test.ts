/**
 * Invariants of the fan and of speed control (fast-check): at the same flow, speed control by a
 * drive never needs more shaft power than outlet dampers (fan) or a throttle valve (pump). The
 * system curve lies below the machine's full-speed curve below the design flow (it meets it at the
 * rated point; affinity laws), at any static head from 0 up to the rated head.
 * Also: a fan on speed control follows the cube law exactly (no static head: P = P_r·(Q/Q_r)³).
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import type { FanLoad, PumpLoad } from '../../core/model/project.ts';
import { fanOperatingPoint } from '../../core/physics/fan.ts';
import { pumpOperatingPoint } from '../../core/kinds/pump.ts';
import { solveProject } from '../../core/solve/index.ts';

const uniform = (lo: number, hi: number) => fc.double({ min: lo, max: hi, noNaN: true });

const fanArb = fc.record({
  ratedFlow: uniform(0.05, 500),
  ratedPressure: uniform(50, 20_000),
  shutoffRatio: uniform(1.01, 2),
  efficiency: uniform(0.3, 0.9),
  density: uniform(0.5, 1.5),
  fraction: uniform(0.001, 1),
});

const fan = (g: { ratedFlow: number; ratedPressure: number; shutoffRatio: number; efficiency: number; density: number; fraction: number }, control: 'speed' | 'damper'): FanLoad => ({
  id: 'f',
  kind: 'fan',
  from: 'm',
  ratedFlow: g.ratedFlow,
  ratedPressure: g.ratedPressure,
  shutoffPressure: g.ratedPressure * g.shutoffRatio,
  efficiency: g.efficiency,
  density: g.density,
  flow: g.fraction * g.ratedFlow,
  control,
});

describe('speed control never uses more than fixed speed at the same flow', () => {
  it('fan: speed-control shaft power ≤ outlet-damper shaft power, and it is P_r·(Q/Q_r)³', () => {
    fc.assert(
      fc.property(fanArb, (g) => {
        const speed = fanOperatingPoint(fan(g, 'speed'));
        const damper = fanOperatingPoint(fan(g, 'damper'));
        expect(speed.shaftPower).toBeLessThanOrEqual(damper.shaftPower * (1 + 1e-12));
        expect(Math.abs(speed.shaftPower - speed.designShaftPower * g.fraction ** 3)).toBeLessThanOrEqual(1e-9 * speed.designShaftPower);
        expect(Number.isFinite(damper.shaftPower) && damper.shaftPower > 0).toBe(true);
      }),
      { numRuns: 300 },
    );
  });

  it('pump: speed-control shaft power ≤ throttled shaft power at any static head below the rated head', () => {
    fc.assert(
      fc.property(
        fc.record({ ratedFlow: uniform(0.001, 10), ratedHead: uniform(1, 500), shutoffRatio: uniform(1.01, 2), efficiency: uniform(0.3, 0.9), staticFraction: uniform(0, 0.99), fraction: uniform(0.001, 1) }),
        (g) => {
          const base = { id: 'p', kind: 'pump', from: 'm', ratedFlow: g.ratedFlow, ratedHead: g.ratedHead, shutoffHead: g.ratedHead * g.shutoffRatio, efficiency: g.efficiency, staticHead: g.staticFraction * g.ratedHead, flow: g.fraction * g.ratedFlow } as const;
          const speed = pumpOperatingPoint({ ...base, control: 'speed' } as PumpLoad);
          const throttle = pumpOperatingPoint({ ...base, control: 'throttle' } as PumpLoad);
          expect(speed.shaftPower).toBeLessThanOrEqual(throttle.shaftPower * (1 + 1e-12));
        },
      ),
      { numRuns: 300 },
    );
  });
});

/** Numbers a slip or a hostile file may hold (fixed list plus random doubles of every size). */
const hostile = fc.oneof(
  fc.constantFrom(0, -1, 1e-300, 5e-324, 1e-9, 1e9, 1e300, Number.MAX_VALUE, -0, 0.5, 1, 2, 1000),
  fc.double({ noNaN: true, noDefaultInfinity: true }),
);

/** A plausible value four times in five, else a hostile one: so that some fans are whole and solve. */
const or = (plausible: fc.Arbitrary<number>) => fc.oneof({ weight: 4, arbitrary: plausible }, { weight: 1, arbitrary: hostile });

describe('a fan with hostile numbers: refused at one of its fields, or solved with every figure finite', () => {
  it('validate and solve', () => {
    let solved = 0;
    fc.assert(
      fc.property(
        fc.record({
          ratedFlow: or(uniform(0.1, 10)),
          ratedPressure: or(uniform(100, 3000)),
          shutoffPressure: or(uniform(3000, 5000)),
          efficiency: or(uniform(0.3, 0.9)),
          density: or(uniform(0.5, 1.5)),
          flow: or(uniform(0.01, 0.1)),
          control: fc.constantFrom('speed', 'damper'),
        }),
        (f) => {
          const project = {
            format: 'joulepath-project',
            version: 2,
            name: 'hostile fan',
            elements: [
              { id: 'grid', kind: 'grid', phases: 3, voltage: 400, frequency: 50 },
              { id: 'motor', kind: 'motor', from: 'grid', ratedOutput: 1e6, nameplate: { efficiency: 0.95, powerFactor: 0.85 }, serviceFactor: 2 },
              { id: 'fan', kind: 'fan', from: 'motor', ...f },
            ],
          };
          const out = solveProject(project);
          if (out.ok) {
            solved++;
            for (const e of out.result.elements) expect(Number.isFinite(e.pIn) && Number.isFinite(e.loss), e.id).toBe(true);
          } else {
            expect(out.problems.length).toBeGreaterThan(0);
            for (const p of out.problems) expect(typeof p.message === 'string' && p.message.length > 0).toBe(true);
          }
        },
      ),
      { numRuns: 300 },
    );
    // Not a vacuous check: about a quarter of the fans have every field plausible and solve.
    expect(solved).toBeGreaterThan(0);
  });
});
