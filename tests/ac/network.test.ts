/**
 * Loads from circuit elements (core/physics/network.ts, core/kinds/network-load.ts).
 *
 * Sources of the check values:
 * - impedances worked by hand from Z_R = R, Z_L = jωL, Z_C = 1/(jωC), series Σ Z, parallel
 *   1/Σ(1/Z) (steady-state phasor analysis; any circuits textbook);
 * - the delta–star transformation for equal branches, Z_Y = Z_Δ/3 (any circuits textbook);
 * - a constant impedance behind a series impedance is a voltage divider: I = V_s/(Z_link + Z_load),
 *   V_load = I·Z_load (Kirchhoff's voltage law), solved by hand per phase.
 */
import { describe, expect, it } from 'vitest';
import { describeNetworkLoads, networkImpedance, parseNetwork, solveProject, type Project, type SolveResult } from '../../core/index.ts';

const project = (elements: unknown[]): Project => ({ format: 'joulepath-project', version: 2, name: 'network test', elements }) as Project;

function solved(p: Project): SolveResult {
  const out = solveProject(p);
  if (!out.ok) throw new Error(JSON.stringify(out.problems));
  return out.result;
}

const rel = (a: number, b: number) => Math.abs(a - b) / Math.abs(b);

describe('network impedance worked by hand', () => {
  it('12 Ω in series with (40 mH ∥ 100 µF) at 50 Hz', () => {
    const parsed = parseNetwork({ series: [{ resistor: '12 Ω' }, { parallel: [{ inductor: '40 mH' }, { capacitor: '100 µF' }] }] });
    if (!parsed.ok) throw new Error('does not read');
    const z = networkImpedance(parsed.network, 50);
    // By hand: ω = 314.159265 rad/s; X_L = ωL = 12.566371 Ω; X_C = 1/(ωC) = 31.830989 Ω;
    // jX_L ∥ −jX_C = −j·X_L·X_C/(X_L − X_C) = −j·400/(−19.264618) = j20.763453 Ω (X_L·X_C = L/C = 400).
    expect(z.re).toBeCloseTo(12, 12);
    expect(rel(z.im, 20.763453)).toBeLessThan(1e-7);
    // |Z| = √(144 + 431.12080) = 23.981681 Ω; angle = atan(20.763453/12) = 59.9747° (hand, calculator).
    const onSupply = project([
      { id: 'g', kind: 'grid', phases: 1, voltage: 230, frequency: 50 },
      { id: 'n', kind: 'network-load', from: 'g', network: { series: [{ resistor: '12 Ω' }, { parallel: [{ inductor: '40 mH' }, { capacitor: '100 µF' }] }] } },
    ]);
    const [fig] = describeNetworkLoads(onSupply, solved(onSupply));
    expect(rel(fig!.impedance.magnitude, 23.981681)).toBeLessThan(1e-7);
    expect(fig!.impedance.angleDeg).toBeCloseTo(59.9747, 3);
    // On a stiff 230 V supply: I = 230/23.981681 = 9.590654 A; P = I²R = 1103.768 W; Q = I²X = 1909.836 var (hand).
    expect(rel(fig!.lineCurrent, 9.590654)).toBeLessThan(1e-6);
    expect(rel(fig!.p, 1103.768)).toBeLessThan(1e-6);
    expect(rel(fig!.q, 1909.836)).toBeLessThan(1e-6);
    expect(fig!.pfSense).toBe('lagging');
    // pf = R/|Z| = 12/23.981681 = 0.500382 (hand).
    expect(fig!.powerFactor).toBeCloseTo(0.500382, 6);
  });

  it('capacitor alone: 220 µF at 60 Hz is −j12.0572 Ω; parallel resistors 10 Ω ∥ 15 Ω = 6 Ω', () => {
    const c = parseNetwork({ capacitor: '220 uF' });
    const r = parseNetwork({ parallel: [{ resistor: 10 }, { resistor: '15' }] });
    if (!c.ok || !r.ok) throw new Error('does not read');
    // By hand: 1/(2π·60·220e-6) = 1/0.0829380 = 12.057190 Ω.
    const zc = networkImpedance(c.network, 60);
    expect(zc.re).toBe(0);
    expect(rel(-zc.im, 12.05719)).toBeLessThan(1e-6);
    // 10·15/(10 + 15) = 6 Ω (product over sum).
    const zr = networkImpedance(r.network, 60);
    expect(zr.re).toBeCloseTo(6, 12);
    expect(zr.im).toBeCloseTo(0, 12);
  });
});

describe('network load in the solve: a constant impedance', () => {
  it('single-phase behind a long cable equals the voltage divider worked by hand (15 % drop, solved exactly by the link)', () => {
    // Cable: 700 m one way at 1.83 Ω/km, 0.08 Ω/km → loop 2.562 + j0.112 Ω. Load 8.2 Ω + 25 mH at 50 Hz
    // (X = 7.853982 Ω). Divider: Z_total = 10.762 + j7.965982 Ω.
    const r = solved(
      project([
        { id: 'g', kind: 'grid', phases: 1, voltage: 230, frequency: 50 },
        { id: 'c', kind: 'cable', from: 'g', length: 700, resistancePerKm: 1.83, reactancePerKm: 0.08 },
        { id: 'n', kind: 'network-load', from: 'c', network: { series: [{ resistor: '8.2' }, { inductor: '25 mH' }] } },
      ]),
    );
    const zl = { re: 8.2, im: 2 * Math.PI * 50 * 0.025 };
    const zt = { re: 8.2 + 2.562, im: zl.im + 0.112 };
    const zt2 = zt.re * zt.re + zt.im * zt.im;
    const i = { re: (230 * zt.re) / zt2, im: (-230 * zt.im) / zt2 }; // I = 230/Z_total
    const iMag = Math.hypot(i.re, i.im);
    const vl = { re: i.re * zl.re - i.im * zl.im, im: i.re * zl.im + i.im * zl.re };
    const ld = r.elements.find((e) => e.id === 'n')!;
    expect(rel(ld.input!.current, iMag)).toBeLessThan(1e-9);
    expect(rel(ld.input!.voltage, Math.hypot(vl.re, vl.im))).toBeLessThan(1e-9);
    expect(ld.input!.voltage / 230).toBeLessThan(0.86); // a real drop, not a stiff case
    expect(rel(ld.input!.phasor!.voltage.re, vl.re)).toBeLessThan(1e-9);
    expect(rel(ld.input!.phasor!.voltage.im, vl.im)).toBeLessThan(1e-9);
    expect(rel(ld.pIn, iMag * iMag * 8.2)).toBeLessThan(1e-9); // P = I²R
    expect(rel(ld.input!.q, iMag * iMag * zl.im)).toBeLessThan(1e-9); // Q = I²X
    expect(rel(r.elements.find((e) => e.id === 'c')!.loss, iMag * iMag * 2.562)).toBeLessThan(1e-9);
    // The cable solves the impedance it feeds exactly (V_s = K·V_r + …, K = 1 + Z·Y): no iterating.
    expect(r.method.iterations).toBeLessThanOrEqual(2);
    expect(r.totals.balanceError).toBeLessThanOrEqual(1e-12);
  });

  it('power follows the square of the voltage (unlike the constant-power loads)', () => {
    const at = (v: number) =>
      solved(
        project([
          { id: 'g', kind: 'grid', phases: 3, voltage: v, frequency: 60 },
          { id: 'n', kind: 'network-load', from: 'g', connection: 'star', network: { series: [{ resistor: '5' }, { capacitor: '470 µF' }] } },
        ]),
      ).elements[1]!.input!;
    const a = at(480);
    const b = at(240);
    expect(rel(a.p, 4 * b.p)).toBeLessThan(1e-12); // (480/240)² = 4
    expect(rel(a.q, 4 * b.q)).toBeLessThan(1e-12);
    expect(a.pfSense).toBe('leading');
  });

  it('delta is three times the power of the same network in star (Z_Y = Z_Δ/3)', () => {
    const net = { series: [{ resistor: '20 Ω' }, { inductor: '0.1 H' }] };
    const one = (connection: string) =>
      solved(
        project([
          { id: 'g', kind: 'grid', phases: 3, voltage: 400, frequency: 50 },
          { id: 'n', kind: 'network-load', from: 'g', connection, network: net },
        ]),
      );
    const star = one('star').elements[1]!.input!;
    const deltaResult = one('delta');
    const delta = deltaResult.elements[1]!.input!;
    expect(rel(delta.p, 3 * star.p)).toBeLessThan(1e-12);
    expect(rel(delta.current, 3 * star.current)).toBeLessThan(1e-12);
    // Delta by hand: branch Z = 20 + j31.415927 Ω, |Z| = 37.241918 Ω; branch current 400/|Z| = 10.740585 A;
    // line current √3 × that = 18.603240 A; P = 3·I_branch²·R = 6921.61 W.
    const [fig] = describeNetworkLoads(
      project([
        { id: 'g', kind: 'grid', phases: 3, voltage: 400, frequency: 50 },
        { id: 'n', kind: 'network-load', from: 'g', connection: 'delta', network: net },
      ]),
      deltaResult,
    );
    expect(fig!.connection).toBe('delta');
    expect(rel(fig!.networkCurrent, 400 / Math.hypot(20, 10 * Math.PI))).toBeLessThan(1e-12);
    expect(rel(fig!.lineCurrent, 18.60324)).toBeLessThan(1e-6);
    expect(rel(fig!.p, 6921.61)).toBeLessThan(1e-6);
    expect(rel(fig!.p, 3 * (400 / Math.hypot(20, 10 * Math.PI)) ** 2 * 20)).toBeLessThan(1e-12);
    expect(rel(fig!.starEquivalent.r, 20 / 3)).toBeLessThan(1e-12);
    expect(fig!.networkVoltage).toBeCloseTo(400, 9);
  });

  it('three-phase without a connection is taken as star', () => {
    const base = [{ id: 'g', kind: 'grid', phases: 3, voltage: 400, frequency: 50 }];
    const net = { resistor: '16' };
    const a = solved(project([...base, { id: 'n', kind: 'network-load', from: 'g', network: net }]));
    const b = solved(project([...base, { id: 'n', kind: 'network-load', from: 'g', connection: 'star', network: net }]));
    // Star: P = 3·(400/√3)²/16 = 400²/16 = 10 000 W (hand).
    expect(rel(a.elements[1]!.pIn, 10_000)).toBeLessThan(1e-12);
    expect(a.elements[1]!.pIn).toBe(b.elements[1]!.pIn);
  });
});

describe('bad network input: a problem naming element and field, nothing computed', () => {
  const withNetwork = (network: unknown, extra: object = {}, phases = 1) =>
    solveProject(
      project([
        { id: 'g', kind: 'grid', phases, voltage: 230, frequency: 50 },
        { id: 'pump', kind: 'network-load', from: 'g', network, ...extra },
      ]),
    );
  const cases: [string, unknown, string, RegExp][] = [
    ['a capacitor of zero farads', { capacitor: 0 }, 'network.capacitor', /greater than 0 F .*open circuit/],
    ['a capacitor of "0 µF"', { series: [{ resistor: 5 }, { capacitor: '0 µF' }] }, 'network.series.1.capacitor', /greater than 0 F/],
    ['a negative capacitor', { capacitor: -1e-6 }, 'network.capacitor', /greater than 0 F/],
    ['a capacitor that is not a number', { capacitor: 'lots' }, 'network.capacitor', /does not start with a number/],
    ['a capacitor with an unknown prefix', { capacitor: '10 qF' }, 'network.capacitor', /unknown prefix "q"/],
    ['a capacitor given in henries', { capacitor: '10 mH' }, 'network.capacitor', /in henries/],
    ['an inductor of 0 H', { parallel: [{ resistor: 5 }, { inductor: '0 H' }] }, 'network.parallel.1.inductor', /greater than 0 H .*short circuit/],
    ['a resistor of 0 Ω', { resistor: 0 }, 'network.resistor', /greater than 0 Ω/],
    ['a resistor of NaN', { resistor: Number.NaN }, 'network.resistor', /finite number of ohms/],
    ['an empty series', { series: [] }, 'network.series', /non-empty list/],
    ['two components in one entry', { resistor: 1, capacitor: 1e-6 }, 'network', /one entry per object/],
    ['an unknown entry', { series: [{ resistance: 4 }] }, 'network.series.0.resistance', /unknown entry "resistance"/],
    ['a bare number', 12, 'network', /must be one entry/],
    ['no network', undefined, 'network', /is required/],
  ];
  it.each(cases)('%s', (_what, network, field, message) => {
    const out = withNetwork(network);
    expect(out.ok).toBe(false);
    if (out.ok) return;
    const p = out.problems.find((x) => x.field === field);
    expect(p, JSON.stringify(out.problems)).toBeDefined();
    expect(p!.elementId).toBe('pump');
    expect(p!.code).toBe('invalid-value');
    expect(p!.message).toMatch(message);
  });

  it('every bad entry of one network is listed', () => {
    const out = withNetwork({ series: [{ capacitor: 0 }, { inductor: '0 H' }, { resistor: '3 xΩ' }] });
    expect(out.ok).toBe(false);
    if (!out.ok) expect(out.problems.map((p) => p.field)).toEqual(['network.series.0.capacitor', 'network.series.1.inductor', 'network.series.2.resistor']);
  });

  it('an unknown connection, and a connection on a single-phase feed', () => {
    const a = withNetwork({ resistor: 5 }, { connection: 'wye' }, 3);
    expect(a.ok).toBe(false);
    if (!a.ok) expect(a.problems[0]).toMatchObject({ elementId: 'pump', field: 'connection', message: expect.stringMatching(/"star" or "delta"/) });
    const b = withNetwork({ resistor: 5 }, { connection: 'delta' }, 1);
    expect(b.ok).toBe(false);
    if (!b.ok) expect(b.problems[0]).toMatchObject({ elementId: 'pump', code: 'kind-mismatch', message: expect.stringMatching(/three-phase/) });
  });

  it('a network load on DC is refused (a capacitor passes no direct current)', () => {
    const out = solveProject(
      project([
        { id: 'b', kind: 'battery', voltage: 48 },
        { id: 'pump', kind: 'network-load', from: 'b', network: { resistor: 5 } },
      ]),
    );
    expect(out.ok).toBe(false);
    if (!out.ok) expect(out.problems[0]).toMatchObject({ code: 'kind-mismatch', elementId: 'pump', field: 'from' });
  });
});

describe('heavy constant-impedance loads (drop far beyond 20 %)', () => {
  // Voltage divider worked by hand (Ohm's law): 230 V, cable loop 1.0 Ω (100 m one way at 5 Ω/km),
  // resistive load R_L → V_L = 230·R_L/(R_L + 1.0).
  it.each([3, 1, 0.6, 0.3])('directly on a cable, R_L = %s Ω, equals the divider', (rl) => {
    const r = solved(
      project([
        { id: 'g', kind: 'grid', phases: 1, voltage: 230, frequency: 50 },
        { id: 'c', kind: 'cable', from: 'g', length: 100, resistancePerKm: 5 },
        { id: 'n', kind: 'network-load', from: 'c', network: { resistor: rl } },
      ]),
    );
    const ld = r.elements.find((e) => e.id === 'n')!;
    expect(rel(ld.input!.voltage, (230 * rl) / (rl + 1))).toBeLessThan(1e-9); // divider above
  });

  it('behind a cable and a transformer (not directly on a link) it still settles, with energy balance', () => {
    // Three-phase: source impedance, cable, 400/400 V transformer, delta R–L load drawing a 40 %
    // drop, plus a constant-power load on the cable. Law checked: Ohm's law at the load,
    // |V_phase| = |I_line|·|Z_star| with Z_star = Z_delta/3, and the energy balance.
    const r = solved(
      project([
        { id: 'g', kind: 'grid', phases: 3, voltage: 400, frequency: 50, resistance: 0.05, reactance: 0.1 },
        { id: 'c', kind: 'cable', from: 'g', length: 100, resistancePerKm: 5, reactancePerKm: 0.1 },
        { id: 't', kind: 'transformer', from: 'c', ratedApparentPower: 50000, primaryVoltage: 400, secondaryVoltage: 400, noLoadLoss: 100, loadLoss: 800, impedancePercent: 5 },
        { id: 'n', kind: 'network-load', from: 't', connection: 'delta', network: { series: [{ resistor: 3 }, { inductor: '5 mH' }] } },
        { id: 'l2', kind: 'ac-load', from: 'c', power: 3000, powerFactor: 0.9 },
      ]),
    );
    const ld = r.elements.find((e) => e.id === 'n')!;
    const zStar = Math.hypot(3, 2 * Math.PI * 50 * 0.005) / 3;
    expect(rel(ld.input!.voltage / Math.sqrt(3), ld.input!.current * zStar)).toBeLessThan(1e-9);
    expect(ld.input!.voltage / 400).toBeLessThan(0.7); // a heavy drop indeed
    expect(r.totals.balanceError).toBeLessThanOrEqual(1e-12);
  });
});
