/**
 * Converter loss models: weighted efficiencies against their published definitions, the
 * least-squares loss-polynomial fit against an independent solver, curve interpolation and end-hold,
 * idle loss, and the polynomial's no-load loss.
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { efficiencyAt, fitLossPolynomial, prepareLoss, solveProject, weightedEfficiency, type EfficiencyPoint, type LossModel, type Project } from '../../core/index.ts';
import { CEC_WEIGHTING, EURO_WEIGHTING } from '../../core/data/efficiency-weighting.ts';

const rel = (a: number, b: number) => Math.abs(a - b) / Math.max(Math.abs(b), 1e-300);

/** A battery → DC-DC → DC load chain whose converter uses `loss`, delivering `load` W. */
function converterProject(loss: LossModel, load: number): Project {
  return {
    format: 'joulepath-project',
    version: 2,
    name: 'Loss model check',
    elements: [
      { id: 'bank', kind: 'battery', voltage: 48 },
      { id: 'conv', kind: 'dc-dc', from: 'bank', outputVoltage: 24, loss },
      { id: 'load', kind: 'dc-load', from: 'conv', power: load },
    ],
  };
}

function solved(project: Project) {
  const outcome = solveProject(project);
  if (!outcome.ok) throw new Error(JSON.stringify(outcome.problems));
  return outcome.result;
}

// ---------------------------------------------------------------------------------------------
describe('weighted efficiencies', () => {
  // η_EURO = 0.03·η5 + 0.06·η10 + 0.13·η20 + 0.10·η30 + 0.48·η50 + 0.20·η100
  //   (source: EN 50530 / EC JRC weighting for central-European irradiance)
  // η_CEC  = 0.04·η10 + 0.05·η20 + 0.12·η30 + 0.21·η50 + 0.53·η75 + 0.05·η100
  //   (source: Sandia, "Performance Test Protocol for Evaluating Inverters Used in Grid-Connected
  //    PV Systems", 2004/2005, as adopted by the California Energy Commission)
  const EURO = [
    [0.05, 0.03],
    [0.1, 0.06],
    [0.2, 0.13],
    [0.3, 0.1],
    [0.5, 0.48],
    [1.0, 0.2],
  ];
  const CEC = [
    [0.1, 0.04],
    [0.2, 0.05],
    [0.3, 0.12],
    [0.5, 0.21],
    [0.75, 0.53],
    [1.0, 0.05],
  ];

  it('the engine tables are the published load points and weights', () => {
    expect(EURO_WEIGHTING.map((p) => [p.loadFraction, p.weight])).toEqual(EURO);
    expect(CEC_WEIGHTING.map((p) => [p.loadFraction, p.weight])).toEqual(CEC);
  });

  it('each set of weights sums to 1', () => {
    // A weighted mean: the weights must sum to 1 (same sources as above).
    expect(EURO_WEIGHTING.reduce((s, p) => s + p.weight, 0)).toBeCloseTo(1, 12);
    expect(CEC_WEIGHTING.reduce((s, p) => s + p.weight, 0)).toBeCloseTo(1, 12);
  });

  // Curve with a datasheet point at every weighting load fraction, so no interpolation is involved.
  const exactCurve: LossModel = {
    model: 'curve',
    ratedPower: 5000,
    points: [
      { loadFraction: 0.05, efficiency: 0.9 },
      { loadFraction: 0.1, efficiency: 0.93 },
      { loadFraction: 0.2, efficiency: 0.95 },
      { loadFraction: 0.3, efficiency: 0.96 },
      { loadFraction: 0.5, efficiency: 0.97 },
      { loadFraction: 0.75, efficiency: 0.968 },
      { loadFraction: 1.0, efficiency: 0.965 },
    ],
  };
  // By hand (definitions above):
  //   EURO = 0.03·0.90 + 0.06·0.93 + 0.13·0.95 + 0.10·0.96 + 0.48·0.97 + 0.20·0.965
  //        = 0.027 + 0.0558 + 0.1235 + 0.096 + 0.4656 + 0.193 = 0.9609
  //   CEC  = 0.04·0.93 + 0.05·0.95 + 0.12·0.96 + 0.21·0.97 + 0.53·0.968 + 0.05·0.965
  //        = 0.0372 + 0.0475 + 0.1152 + 0.2037 + 0.51304 + 0.04825 = 0.96489
  const HAND_EURO = 0.9609;
  const HAND_CEC = 0.96489;

  it('η_EURO and η_CEC of a curve with points at exactly the weighting loads match the hand sums', () => {
    const w = weightedEfficiency(prepareLoss(exactCurve))!;
    expect(Math.abs(w.euro - HAND_EURO)).toBeLessThan(1e-12);
    expect(Math.abs(w.cec - HAND_CEC)).toBeLessThan(1e-12);
  });

  it('the solve reports the same weighted efficiencies on the element', () => {
    const r = solved(converterProject(exactCurve, 2000));
    const conv = r.elements.find((e) => e.id === 'conv')!;
    expect(Math.abs(conv.weighted!.euro - HAND_EURO)).toBeLessThan(1e-12);
    expect(Math.abs(conv.weighted!.cec - HAND_CEC)).toBeLessThan(1e-12);
    expect(conv.loadFraction).toBeCloseTo(2000 / 5000, 14);
  });

  it('with interpolation and end-hold between sparse datasheet points', () => {
    // Points (0.1, 0.90), (0.5, 0.96), (1.0, 0.95). Linear interpolation by hand:
    //   η5 = 0.90 (held below the first point), η10 = 0.90, η20 = 0.90 + 0.06·(0.1/0.4) = 0.915,
    //   η30 = 0.93, η50 = 0.96, η75 = 0.955, η100 = 0.95.
    //   EURO = 0.027 + 0.054 + 0.11895 + 0.093 + 0.4608 + 0.19 = 0.94375
    //   CEC  = 0.036 + 0.04575 + 0.1116 + 0.2016 + 0.50615 + 0.0475 = 0.9486
    const w = weightedEfficiency(
      prepareLoss({
        model: 'curve',
        ratedPower: 3000,
        points: [
          { loadFraction: 1.0, efficiency: 0.95 },
          { loadFraction: 0.1, efficiency: 0.9 },
          { loadFraction: 0.5, efficiency: 0.96 },
        ],
      }),
    )!;
    expect(Math.abs(w.euro - 0.94375)).toBeLessThan(1e-12);
    expect(Math.abs(w.cec - 0.9486)).toBeLessThan(1e-12);
  });

  it('a constant efficiency without idle loss weights to itself', () => {
    // Weights sum to 1, so a flat curve's weighted mean is the flat value (definition).
    const w = weightedEfficiency(prepareLoss({ model: 'constant', efficiency: 0.955, ratedPower: 1000 }))!;
    expect(w.euro).toBeCloseTo(0.955, 12);
    expect(w.cec).toBeCloseTo(0.955, 12);
  });

  it('a constant efficiency with an idle loss: each point is P/(P/η + P_idle)', () => {
    // η = 0.96, P_idle = 20 W, rated 4000 W. By hand at 5 %: P = 200 W, P_in = 200/0.96 + 20
    // = 228.333 W, η5 = 0.875912 (definition of efficiency, P_out/P_in).
    const model: LossModel = { model: 'constant', efficiency: 0.96, idleLoss: 20, ratedPower: 4000 };
    const etaAt = (x: number) => (x * 4000) / ((x * 4000) / 0.96 + 20);
    expect(etaAt(0.05)).toBeCloseTo(0.875912, 6);
    const euro = EURO.reduce((s, [x, wt]) => s + wt! * etaAt(x!), 0);
    const cec = CEC.reduce((s, [x, wt]) => s + wt! * etaAt(x!), 0);
    const w = weightedEfficiency(prepareLoss(model))!;
    expect(rel(w.euro, euro)).toBeLessThan(1e-12);
    expect(rel(w.cec, cec)).toBeLessThan(1e-12);
    expect(w.euro).toBeLessThan(0.96); // idle loss pulls light-load efficiency down
  });

  it('no rated power, no weighted efficiency (there is nothing to take fractions of)', () => {
    expect(weightedEfficiency(prepareLoss({ model: 'constant', efficiency: 0.9 }))).toBeUndefined();
    const r = solved(converterProject({ model: 'constant', efficiency: 0.9 }, 100));
    expect(r.elements.find((e) => e.id === 'conv')!.weighted).toBeUndefined();
  });
});

// ---------------------------------------------------------------------------------------------
/**
 * Independent least-squares solver: Householder QR of the n×3 design matrix [1, x, x²]
 * (x = load fraction), then back substitution of R·c = Qᵀ·y.
 * Source: Householder QR for linear least squares (Golub & Van Loan, "Matrix Computations",
 * ch. 5; from memory). Unlike the engine it never forms the normal equations.
 */
function qrFit(x: readonly number[], y: readonly number[]): [number, number, number] {
  const n = x.length;
  const a = x.map((xi) => [1, xi, xi * xi]);
  const b = y.slice();
  for (let k = 0; k < 3; k++) {
    let norm = 0;
    for (let i = k; i < n; i++) norm += a[i]![k]! ** 2;
    norm = Math.sqrt(norm);
    const alpha = a[k]![k]! > 0 ? -norm : norm;
    const v = new Array<number>(n).fill(0);
    for (let i = k; i < n; i++) v[i] = a[i]![k]!;
    v[k]! -= alpha;
    let vv = 0;
    for (let i = k; i < n; i++) vv += v[i]! ** 2;
    if (vv === 0) continue;
    for (let j = k; j < 3; j++) {
      let dot = 0;
      for (let i = k; i < n; i++) dot += v[i]! * a[i]![j]!;
      for (let i = k; i < n; i++) a[i]![j]! -= (2 * dot * v[i]!) / vv;
    }
    let dot = 0;
    for (let i = k; i < n; i++) dot += v[i]! * b[i]!;
    for (let i = k; i < n; i++) b[i]! -= (2 * dot * v[i]!) / vv;
  }
  const c = [0, 0, 0];
  for (let r = 2; r >= 0; r--) {
    let s = b[r]!;
    for (let k = r + 1; k < 3; k++) s -= a[r]![k]! * c[k]!;
    c[r] = s / a[r]![r]!;
  }
  return [c[0]!, c[1]!, c[2]!];
}

/** Datasheet points from an exact loss polynomial: η = P/(P + P0 + k1·P + k2·P²). */
function pointsFrom(rated: number, p0: number, k1: number, k2: number, fractions: readonly number[]): EfficiencyPoint[] {
  return fractions.map((x) => {
    const p = x * rated;
    return { loadFraction: x, efficiency: p / (p + p0 + k1 * p + k2 * p * p) };
  });
}

describe('least-squares loss polynomial fit', () => {
  it('recovers an exact polynomial: coefficients back to 1e-9, rms error ≈ 0', () => {
    // Invented converter: 5 kW, P0 = 40 W, k1 = 0.012, k2 = 2e-6 /W (loss at rated: 40 + 60 + 50 = 150 W).
    const fit = fitLossPolynomial(5000, pointsFrom(5000, 40, 0.012, 2e-6, [0.1, 0.25, 0.5, 0.75, 1.0]));
    expect(rel(fit.p0, 40)).toBeLessThan(1e-9);
    expect(rel(fit.k1, 0.012)).toBeLessThan(1e-9);
    expect(rel(fit.k2, 2e-6)).toBeLessThan(1e-9);
    expect(fit.rmsLossError).toBeLessThan(1e-9 * 150);
    expect(fit.maxEfficiencyError).toBeLessThan(1e-12);
  });

  it('recovers random exact polynomials from 3–9 datasheet points (property)', () => {
    // Law: least squares reproduces any data that lies exactly in the model space.
    const fractions = fc
      .subarray([0.05, 0.1, 0.2, 0.25, 0.3, 0.5, 0.75, 1.0, 1.1], { minLength: 3 })
      .chain((xs) => fc.shuffledSubarray(xs, { minLength: xs.length, maxLength: xs.length }));
    fc.assert(
      fc.property(
        fc.double({ min: 100, max: 1e6, noNaN: true }),
        fc.double({ min: 0.001, max: 0.03, noNaN: true }),
        fc.double({ min: 0, max: 0.03, noNaN: true }),
        fc.double({ min: 0, max: 0.05, noNaN: true }),
        fractions,
        (rated, p0pu, k1, k2pu, xs) => {
          const p0 = p0pu * rated;
          const k2 = k2pu / rated;
          const fit = fitLossPolynomial(rated, pointsFrom(rated, p0, k1, k2, xs));
          // Scale: the loss at rated output; each term compared at rated output.
          const lossRated = p0 + k1 * rated + k2 * rated * rated;
          expect(Math.abs(fit.p0 - p0)).toBeLessThanOrEqual(1e-9 * lossRated);
          expect(Math.abs(fit.k1 - k1) * rated).toBeLessThanOrEqual(1e-9 * lossRated);
          expect(Math.abs(fit.k2 - k2) * rated * rated).toBeLessThanOrEqual(1e-9 * lossRated);
          expect(fit.rmsLossError).toBeLessThanOrEqual(1e-9 * lossRated);
        },
      ),
      { numRuns: 300 },
    );
  });

  /** The fit report computed independently: QR coefficients, rms of the loss residual, max |Δη|. */
  function independentReport(rated: number, points: readonly EfficiencyPoint[]) {
    const xs = points.map((p) => p.loadFraction);
    const ys = points.map((p) => p.loadFraction * rated * (1 / p.efficiency - 1));
    const [c0, c1, c2] = qrFit(xs, ys);
    let sq = 0;
    let maxEta = 0;
    points.forEach((p, i) => {
      const fitted = c0 + c1 * xs[i]! + c2 * xs[i]! ** 2;
      sq += (fitted - ys[i]!) ** 2;
      const pOut = xs[i]! * rated;
      maxEta = Math.max(maxEta, Math.abs(pOut / (pOut + fitted) - p.efficiency));
    });
    return { p0: c0, k1: c1 / rated, k2: c2 / rated ** 2, rms: Math.sqrt(sq / points.length), maxEta, lossRated: c0 + c1 + c2 };
  }

  it('on a real-looking (noisy) datasheet matches an independent QR least-squares fit', () => {
    // The pump-drive datasheet of the riverside demo: 30 kW, η = 93.6/96.1/96.9/97.2 % at 25/50/75/100 %.
    const points = [
      { loadFraction: 0.25, efficiency: 0.936 },
      { loadFraction: 0.5, efficiency: 0.961 },
      { loadFraction: 0.75, efficiency: 0.969 },
      { loadFraction: 1.0, efficiency: 0.972 },
    ];
    const fit = fitLossPolynomial(30000, points);
    const ref = independentReport(30000, points);
    expect(Math.abs(fit.p0 - ref.p0)).toBeLessThan(1e-9 * ref.lossRated);
    expect(Math.abs(fit.k1 - ref.k1) * 30000).toBeLessThan(1e-9 * ref.lossRated);
    expect(Math.abs(fit.k2 - ref.k2) * 30000 ** 2).toBeLessThan(1e-9 * ref.lossRated);
    expect(rel(fit.rmsLossError, ref.rms)).toBeLessThan(1e-6);
    expect(rel(fit.maxEfficiencyError, ref.maxEta)).toBeLessThan(1e-6);
    expect(fit.rmsLossError).toBeGreaterThan(1); // four points, three terms: a real residual, W
  });

  it('on random noisy datasheets matches the independent QR fit (property)', () => {
    // Law: the least-squares minimiser is unique when ≥ 3 distinct abscissae; two correct solvers agree.
    fc.assert(
      fc.property(
        fc.double({ min: 100, max: 1e6, noNaN: true }),
        fc.uniqueArray(fc.double({ min: 0.05, max: 1.2, noNaN: true }), { minLength: 3, maxLength: 10, comparator: (a, b) => Math.abs(a - b) < 0.02 }),
        fc.array(fc.double({ min: 0.8, max: 0.99, noNaN: true }), { minLength: 10, maxLength: 10 }),
        (rated, xs, etas) => {
          const points = xs.map((x, i) => ({ loadFraction: x, efficiency: etas[i]! }));
          const fit = fitLossPolynomial(rated, points);
          const ref = independentReport(rated, points);
          const scale = Math.max(Math.abs(ref.p0), Math.abs(ref.k1 * rated), Math.abs(ref.k2 * rated * rated), ...points.map((p) => p.loadFraction * rated * (1 / p.efficiency - 1)));
          // Normal equations square the condition number (≤ ~1e4 here for x spaced ≥ 0.02 in [0.05, 1.2]).
          expect(Math.abs(fit.p0 - ref.p0)).toBeLessThanOrEqual(1e-9 * scale);
          expect(Math.abs(fit.k1 - ref.k1) * rated).toBeLessThanOrEqual(1e-9 * scale);
          expect(Math.abs(fit.k2 - ref.k2) * rated * rated).toBeLessThanOrEqual(1e-9 * scale);
          expect(Math.abs(fit.rmsLossError - ref.rms)).toBeLessThanOrEqual(1e-9 * scale);
        },
      ),
      { numRuns: 300 },
    );
  });

  it('the fitted model is used in the solve: loss = P0 + k1·P + k2·P² with the reported coefficients', () => {
    const loss: LossModel = { model: 'polynomial-fit', ratedPower: 5000, points: pointsFrom(5000, 40, 0.012, 2e-6, [0.1, 0.5, 1.0]) };
    const r = solved(converterProject(loss, 3000));
    const conv = r.elements.find((e) => e.id === 'conv')!;
    // By hand from the generating polynomial: 40 + 0.012·3000 + 2e-6·3000² = 40 + 36 + 18 = 94 W.
    expect(conv.loss).toBeCloseTo(94, 6);
    expect(rel(conv.fit!.p0, 40)).toBeLessThan(1e-9);
    expect(r.warnings).toEqual([]);
  });

  it('polynomial-fit: outside the datasheet range the loss is flagged as extrapolated (not at zero output)', () => {
    const prepared = prepareLoss({ model: 'polynomial-fit', ratedPower: 1000, points: pointsFrom(1000, 10, 0.01, 1e-5, [0.2, 0.5, 0.8]) });
    expect(prepared.loss(100).extrapolated).toBe(true); // 10 % < 20 %
    expect(prepared.loss(500).extrapolated).toBe(false);
    expect(prepared.loss(900).extrapolated).toBe(true); // 90 % > 80 %
    expect(prepared.loss(0).extrapolated).toBe(false);
    expect(prepared.loss(0).loss).toBeCloseTo(10, 9); // the fitted P0 = the generating P0
  });
});

// ---------------------------------------------------------------------------------------------
describe('curve interpolation, end-hold and idle loss', () => {
  // Datasheet points given out of order on purpose: (0.6, 0.95) and (0.2, 0.90); rated 1000 W.
  // Loss at an output P with η interpolated linearly in load fraction: P·(1/η − 1) (model.ts).
  const curve = (idleLoss?: number): LossModel => ({
    model: 'curve',
    ratedPower: 1000,
    points: [
      { loadFraction: 0.6, efficiency: 0.95 },
      { loadFraction: 0.2, efficiency: 0.9 },
    ],
    ...(idleLoss !== undefined ? { idleLoss } : {}),
  });

  // By hand:
  //   P = 400 W, x = 0.4: η = 0.90 + 0.05·(0.2/0.4) = 0.925; loss = 400·(1/0.925 − 1) = 32.432432 W
  //   P = 200 W (first point): η = 0.90; loss = 22.222222 W, not extrapolated
  //   P = 600 W (last point):  η = 0.95; loss = 31.578947 W, not extrapolated
  //   P = 100 W, x = 0.1: held at η = 0.90; loss = 11.111111 W, extrapolated
  //   P = 900 W, x = 0.9: held at η = 0.95; loss = 47.368421 W, extrapolated
  const cases: [number, number, boolean][] = [
    [400, 32.432432, false],
    [200, 22.222222, false],
    [600, 31.578947, false],
    [100, 11.111111, true],
    [900, 47.368421, true],
  ];

  it.each(cases)('at %s W: loss %s W, extrapolated %s', (p, loss, extrapolated) => {
    const r = prepareLoss(curve()).loss(p);
    expect(r.loss).toBeCloseTo(loss, 5);
    expect(r.extrapolated).toBe(extrapolated);
  });

  it.each(cases)('with a 7 W idle loss at %s W: loss %s W + 7 W', (p, loss) => {
    expect(prepareLoss(curve(7)).loss(p).loss).toBeCloseTo(loss + 7, 5);
  });

  it('at zero output the loss is the idle loss alone, not flagged', () => {
    expect(prepareLoss(curve(7)).loss(0)).toEqual({ loss: 7, extrapolated: false });
    expect(prepareLoss(curve()).loss(0)).toEqual({ loss: 0, extrapolated: false });
  });

  it('efficiencyAt = P/(P + loss)', () => {
    expect(efficiencyAt(prepareLoss(curve()), 400)).toBeCloseTo(0.925, 12);
    // With idle: 400/(400 + 32.432432 + 7) = 400/439.432432 = 0.910265 (by hand)
    expect(efficiencyAt(prepareLoss(curve(7)), 400)).toBeCloseTo(0.910265, 6);
  });

  it('the solve flags a converter run outside its curve, and only then', () => {
    const low = solved(converterProject(curve(), 100));
    expect(low.warnings.map((w) => [w.code, w.elementId])).toEqual([['curve-extrapolated', 'conv']]);
    expect(low.elements.find((e) => e.id === 'conv')!.loss).toBeCloseTo(11.111111, 5);
    const inside = solved(converterProject(curve(), 400));
    expect(inside.warnings).toEqual([]);
    expect(inside.elements.find((e) => e.id === 'conv')!.loss).toBeCloseTo(32.432432, 5);
  });

  it('above rated output the curve is held and the rating warning is given too', () => {
    const over = solved(converterProject(curve(), 1200));
    expect(over.warnings.map((w) => w.code).sort()).toEqual(['curve-extrapolated', 'rating-exceeded']);
    // Held at η = 0.95: 1200·(1/0.95 − 1) = 63.157895 W (by hand).
    expect(over.elements.find((e) => e.id === 'conv')!.loss).toBeCloseTo(63.157895, 5);
  });

  it('constant efficiency: loss = P·(1/η − 1) + P_idle', () => {
    // η = 0.9, idle 5 W at 450 W: 450·(1/0.9 − 1) + 5 = 50 + 5 = 55 W (by hand).
    expect(prepareLoss({ model: 'constant', efficiency: 0.9, idleLoss: 5 }).loss(450).loss).toBeCloseTo(55, 10);
  });
});

describe('loss polynomial', () => {
  const poly: LossModel = { model: 'polynomial', p0: 3.5, k1: 0.03, k2: 0.00012 };

  it('at zero output the loss is P0', () => {
    expect(prepareLoss(poly).loss(0)).toEqual({ loss: 3.5, extrapolated: false });
  });

  it('at 85 W: 3.5 + 0.03·85 + 0.00012·85² = 6.917 W (by hand)', () => {
    expect(prepareLoss(poly).loss(85).loss).toBeCloseTo(6.917, 10);
  });

  it('in the solve, a converter with nothing drawn still loses P0 (efficiency 0)', () => {
    const r = solved(converterProject(poly, 0));
    const conv = r.elements.find((e) => e.id === 'conv')!;
    expect(conv.pOut).toBe(0);
    expect(conv.loss).toBeCloseTo(3.5, 12);
    expect(conv.efficiency).toBe(0);
    expect(r.totals.sourcePower).toBeCloseTo(3.5, 12);
  });
});
