/**
 * The engine's phasor arithmetic (core/physics/complex.ts) and its exact two-bus link solution
 * (core/physics/two-bus.ts), checked against outside references:
 * - complex.js (the npm library, an independent implementation) for every operation, over random
 *   inputs from fast-check, to a relative tolerance of 1e-12 of the result's magnitude;
 * - the closed form of the DC constant-power link quadratic, V_r = (V_s + √(V_s² − 4RP))/2
 *   (Ohm's law V_s = V_r + R·P/V_r, multiplied through by V_r: hand derivation);
 * - the defining equation of the link, V_s = V_r + Z·conj(S/V_r) (Kirchhoff's voltage law with
 *   I = conj(S/V_r)), evaluated with complex.js;
 * - the maximum power transfer limit: on DC nothing above V_s²/(4R) can be delivered (maximum
 *   power transfer theorem; the discriminant of the quadratic above), on AC nothing above
 *   |V_s|²/(4|Z|) when the load angle equals the impedance angle (matched load).
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import Complex from 'complex.js';
import { add, sub, mul, div, conj, abs, arg, polar, type Complex as EngineComplex } from '../../core/physics/complex.ts';
import { receivingVoltage } from '../../core/physics/two-bus.ts';

const REL = 1e-12;
const RUNS = 2000;

/**
 * Finite doubles over a wide but non-overflowing range (products and |b|² stay finite). Parts
 * below 1e-150 in size are flushed to 0: complex.js's own hypot squares small parts without
 * scaling, so it underflows there (its abs of 0 + j·1e-200 is 0, of 1e-160 is 0.99999·1e-160) —
 * a limit of the reference, not of the engine, whose Math.hypot is exact there.
 */
const part = fc
  .double({ min: -1e6, max: 1e6, noNaN: true, noDefaultInfinity: true })
  .map((x) => (Math.abs(x) < 1e-150 ? 0 : x));
const complexArb = fc.record({ re: part, im: part });
const nonZeroComplex = complexArb.filter((z) => Math.hypot(z.re, z.im) > 1e-9);

const lib = (z: EngineComplex): Complex => new Complex(z.re, z.im);

/** |got − want| ≤ rel·scale, with scale the natural size of the result (never below a tiny floor). */
function expectClose(got: EngineComplex, want: Complex, scale: number, rel = REL): void {
  const err = Math.hypot(got.re - want.re, got.im - want.im);
  expect(err, `got ${got.re}+j${got.im}, complex.js ${want.re}+j${want.im}`).toBeLessThanOrEqual(rel * Math.max(scale, 1e-300));
}

describe('core/physics/complex.ts against complex.js (fast-check, relative tolerance 1e-12)', () => {
  it('add', () => {
    fc.assert(
      fc.property(complexArb, complexArb, (a, b) => {
        // Reference: complex.js Complex#add. Scale: |a| + |b| (rounding of a sum is relative to the addends).
        expectClose(add(a, b), lib(a).add(lib(b)), abs(a) + abs(b));
      }),
      { numRuns: RUNS },
    );
  });

  it('sub', () => {
    fc.assert(
      fc.property(complexArb, complexArb, (a, b) => {
        // Reference: complex.js Complex#sub.
        expectClose(sub(a, b), lib(a).sub(lib(b)), abs(a) + abs(b));
      }),
      { numRuns: RUNS },
    );
  });

  it('mul', () => {
    fc.assert(
      fc.property(complexArb, complexArb, (a, b) => {
        // Reference: complex.js Complex#mul. Scale |a|·|b| = |ab|.
        expectClose(mul(a, b), lib(a).mul(lib(b)), abs(a) * abs(b));
      }),
      { numRuns: RUNS },
    );
  });

  it('div', () => {
    fc.assert(
      fc.property(complexArb, nonZeroComplex, (a, b) => {
        // Reference: complex.js Complex#div (Smith's algorithm, a different formula). Scale |a|/|b| = |a/b|.
        expectClose(div(a, b), lib(a).div(lib(b)), abs(a) / abs(b));
      }),
      { numRuns: RUNS },
    );
  });

  it('conj', () => {
    fc.assert(
      fc.property(complexArb, (a) => {
        // Reference: complex.js Complex#conjugate.
        expectClose(conj(a), lib(a).conjugate(), abs(a));
      }),
      { numRuns: RUNS },
    );
  });

  it('abs', () => {
    fc.assert(
      fc.property(complexArb, (a) => {
        // Reference: complex.js Complex#abs (its own overflow-safe hypot).
        const want = lib(a).abs();
        expect(Math.abs(abs(a) - want)).toBeLessThanOrEqual(REL * want);
      }),
      { numRuns: RUNS },
    );
  });

  it('arg', () => {
    fc.assert(
      fc.property(nonZeroComplex, (a) => {
        // Reference: complex.js Complex#arg, in (−π, π]. Absolute tolerance on an angle: 1e-12 rad × π.
        const want = lib(a).arg();
        expect(Math.abs(arg(a) - want)).toBeLessThanOrEqual(REL * Math.PI);
      }),
      { numRuns: RUNS },
    );
  });

  it('polar', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0, max: 1e6, noNaN: true }),
        fc.double({ min: -2 * Math.PI, max: 2 * Math.PI, noNaN: true }),
        (r, theta) => {
          // Reference: complex.js constructed from {abs, arg}.
          expectClose(polar(r, theta), new Complex({ abs: r, arg: theta }), r);
        },
      ),
      { numRuns: RUNS },
    );
  });

  it('round trip: polar(abs z, arg z) returns z (complex.js for the comparison)', () => {
    fc.assert(
      fc.property(nonZeroComplex, (a) => {
        expectClose(polar(abs(a), arg(a)), lib(a), abs(a), 1e-12);
      }),
      { numRuns: RUNS },
    );
  });
});

describe('core/physics/two-bus.ts receivingVoltage', () => {
  it('(a) DC constant-power link equals the closed form of the quadratic V_r = (V_s + √(V_s² − 4RP))/2', () => {
    // Hand derivation (Ohm's law): V_s = V_r + R·I, I = P/V_r ⇒ V_r² − V_s·V_r + R·P = 0; the larger root
    // is the operating point.
    // A worked figure first: V_s = 48 V, R = 0.1 Ω, P = 1000 W ⇒ V_r = (48 + √(2304 − 400))/2
    // = (48 + 43.634848)/2 = 45.817424 V (hand calculation, 8 significant figures).
    const worked = receivingVoltage({ re: 48, im: 0 }, { re: 0.1, im: 0 }, { re: 1000, im: 0 })!;
    expect(worked).not.toBeNull();
    expect(Math.abs(worked.re - 45.817424) / 45.817424).toBeLessThan(1e-8);
    expect(Math.abs(worked.im)).toBeLessThan(1e-12);

    fc.assert(
      fc.property(
        fc.double({ min: 1, max: 1e5, noNaN: true }),
        fc.double({ min: 1e-6, max: 100, noNaN: true }),
        fc.double({ min: 0, max: 0.999, noNaN: true }),
        (vs, r, k) => {
          const p = (k * vs * vs) / (4 * r);
          const closed = (vs + Math.sqrt(vs * vs - 4 * r * p)) / 2;
          const got = receivingVoltage({ re: vs, im: 0 }, { re: r, im: 0 }, { re: p, im: 0 });
          expect(got).not.toBeNull();
          expect(Math.abs(got!.re - closed) / closed).toBeLessThanOrEqual(REL);
          expect(Math.abs(got!.im)).toBeLessThanOrEqual(REL * closed);
        },
      ),
      { numRuns: RUNS },
    );
  });

  it('(b) V_s = V_r + Z·conj(S/V_r) holds to a residual below 1e-12·|V_s| over random feasible links (complex.js)', () => {
    let worst = 0;
    fc.assert(
      fc.property(
        fc.double({ min: 1, max: 1e5, noNaN: true }), // |V_s|
        fc.double({ min: -Math.PI, max: Math.PI, noNaN: true }), // angle of V_s
        fc.double({ min: 1e-4, max: 100, noNaN: true }), // |Z|
        fc.double({ min: 0, max: Math.PI / 2, noNaN: true }), // angle of Z (R ≥ 0, X ≥ 0)
        fc.double({ min: 0, max: 0.99, noNaN: true }), // |S| as a fraction of |V_s|²/(4|Z|)
        fc.double({ min: -Math.PI / 2, max: Math.PI / 2, noNaN: true }), // load angle (leading to lagging)
        (vsMag, vsAng, zMag, zAng, k, sAng) => {
          // |S| < |V_s|²/(4|Z|) is deliverable at any load angle (the matched angle is the worst case).
          const vs = new Complex({ abs: vsMag, arg: vsAng });
          const z = new Complex({ abs: zMag, arg: zAng });
          const s = new Complex({ abs: (k * vsMag * vsMag) / (4 * zMag), arg: sAng });
          const vr = receivingVoltage({ re: vs.re, im: vs.im }, { re: z.re, im: z.im }, { re: s.re, im: s.im });
          expect(vr).not.toBeNull();
          const vrc = new Complex(vr!.re, vr!.im);
          const rebuilt = vrc.add(z.mul(s.div(vrc).conjugate()));
          const residual = rebuilt.sub(vs).abs() / vsMag;
          worst = Math.max(worst, residual);
          expect(residual).toBeLessThan(1e-12);
          // The operating point is the high-voltage root: |V_r| ≥ |V_s|/2 (the nose is at |V_s|/√2 or below).
          expect(vrc.abs()).toBeGreaterThanOrEqual(vsMag / 2);
        },
      ),
      { numRuns: RUNS },
    );
    expect(worst).toBeLessThan(1e-12);
  });

  it('(c) returns null beyond the maximum transfer: DC P > V²/(4R); AC matched angle |S| > |V|²/(4|Z|)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 1, max: 1e5, noNaN: true }),
        fc.double({ min: 1e-6, max: 100, noNaN: true }),
        fc.double({ min: 1e-9, max: 100, noNaN: true }),
        (vs, r, excess) => {
          // Maximum power transfer theorem: P_max = V_s²/(4R) at V_r = V_s/2.
          const p = ((vs * vs) / (4 * r)) * (1 + excess);
          expect(receivingVoltage({ re: vs, im: 0 }, { re: r, im: 0 }, { re: p, im: 0 })).toBeNull();
        },
      ),
      { numRuns: RUNS },
    );
    fc.assert(
      fc.property(
        fc.double({ min: 1, max: 1e5, noNaN: true }),
        fc.double({ min: 1e-4, max: 100, noNaN: true }),
        fc.double({ min: 0, max: Math.PI / 2 - 1e-3, noNaN: true }),
        fc.double({ min: 1e-6, max: 100, noNaN: true }),
        (vs, zMag, zAng, excess) => {
          // With the load angle equal to the impedance angle, P–V nose at |S| = |V_s|²/(4|Z|)
          // (maximum power transfer, matched load; hand derivation from the quadratic's discriminant).
          const z = new Complex({ abs: zMag, arg: zAng });
          const s = new Complex({ abs: ((vs * vs) / (4 * zMag)) * (1 + excess), arg: zAng });
          expect(receivingVoltage({ re: vs, im: 0 }, { re: z.re, im: z.im }, { re: s.re, im: s.im })).toBeNull();
        },
      ),
      { numRuns: RUNS },
    );
    // Worked figure: 12 V through 2 Ω can deliver at most 144/8 = 18 W (hand calculation).
    expect(receivingVoltage({ re: 12, im: 0 }, { re: 2, im: 0 }, { re: 17.99, im: 0 })).not.toBeNull();
    expect(receivingVoltage({ re: 12, im: 0 }, { re: 2, im: 0 }, { re: 18.01, im: 0 })).toBeNull();
  });
});
