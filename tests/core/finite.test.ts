/**
 * Numbers that cannot be trusted are refused (issue 14, point 15): a result is finite everywhere or
 * the solve is refused, naming the element and the field; the CLI then exits non-zero.
 *
 * The three inputs below each gave a table of NaN (or of nonsense) with exit status 0 before:
 * an efficiency of 1e-300, a loss fit through three almost equal points, a 1e-300 Ω resistor.
 * Thresholds are our own (common practice, no source): efficiency ≥ 1 %, fit condition number ≤ 1e10,
 * circuit impedance ≥ 1 µΩ per phase.
 */
import { spawnSync } from 'node:child_process';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { PROJECT_LEVEL } from '../../core/model/errors.ts';
import { solveProject } from '../../core/solve/index.ts';
import { validateProject } from '../../core/solve/validate.ts';
import { plan } from '../../core/solve/plan.ts';
import { sweep } from '../../core/solve/sweep.ts';
import { c } from '../../core/physics/complex.ts';
import { elementNames, fieldWords, findNonFinite, nonFiniteProblems } from '../../core/solve/finite.ts';
import { fitConditioning, fitLossPolynomial } from '../../core/physics/loss-model.ts';
import { MAX_FIT_CONDITION } from '../../core/kinds/spec.ts';

const TSX = join('node_modules', '.bin', 'tsx');
const scratch = mkdtempSync(join(tmpdir(), 'joulepath-finite-'));

const supply = { id: 'src', name: 'Supply', kind: 'grid', phases: 1, voltage: 230, frequency: 50 };
const rectifier = (loss: unknown) => ({ id: 'rect', name: 'Rectifier', kind: 'rectifier', from: 'src', outputVoltage: 48, inputPowerFactor: 0.99, loss });
const dcLoad = { id: 'ld', name: 'Load', kind: 'dc-load', from: 'rect', power: 100 };
const project = (...elements: unknown[]) => ({ format: 'joulepath-project', version: 2, name: 'Finite', elements });

const tinyEfficiency = project(supply, rectifier({ model: 'constant', efficiency: 1e-300 }), dcLoad);
const bunchedFit = (d: number) =>
  project(
    supply,
    rectifier({
      model: 'polynomial-fit',
      ratedPower: 1000,
      points: [
        { loadFraction: 0.5, efficiency: 0.95 },
        { loadFraction: 0.5 + d, efficiency: 0.95 },
        { loadFraction: 0.5 + 2 * d, efficiency: 0.951 },
      ],
    }),
    dcLoad,
  );
const tinyResistor = project(supply, { id: 'heater', name: 'Heater', kind: 'network-load', from: 'src', network: { series: [{ resistor: '1e-300 Ω' }] } });

function refusal(input: unknown) {
  const o = solveProject(input);
  if (o.ok) throw new Error('solved, expected a refusal');
  return o.problems;
}

describe('inputs whose use cannot be finite are refused by validation, naming the field', () => {
  it('an efficiency of 1e-300 (1/η overflows)', () => {
    const [p, ...rest] = refusal(tinyEfficiency);
    expect(rest).toEqual([]);
    expect(p).toMatchObject({ code: 'invalid-value', elementId: 'rect', field: 'loss.efficiency' });
    expect(p!.message).toMatch(/at least 1 %/);
  });

  it('a loss fit through three almost equal load fractions (normal equations singular or nearly so)', () => {
    for (const d of [1e-15, 1e-13, 1e-6]) {
      const [p, ...rest] = refusal(bunchedFit(d));
      expect(rest).toEqual([]);
      expect(p).toMatchObject({ code: 'invalid-value', elementId: 'rect', field: 'loss.points' });
      expect(p!.message).toMatch(/too close together/);
    }
    // Before: at d = 1e-15 the fit's coefficients were NaN (Gaussian elimination divides by 0).
    const pts = (d: number) => [0.5, 0.5 + d, 0.5 + 2 * d].map((x) => ({ loadFraction: x, efficiency: 0.95 }));
    expect(Number.isNaN(fitLossPolynomial(1000, pts(1e-15)).p0)).toBe(true);
  });

  it('datasheet points spread as datasheets give them still fit (the threshold leaves room)', () => {
    // 10/50/100 % and 20/25/30 %: condition numbers about 6e2 and 1.5e6 (computed here), far below 1e10.
    expect(fitConditioning([0.1, 0.5, 1])).toBeLessThan(1e3);
    expect(fitConditioning([0.2, 0.25, 0.3])).toBeLessThan(1e7);
    expect(fitConditioning([0.5, 0.51, 0.52])).toBeLessThan(MAX_FIT_CONDITION); // points 1 % apart
    expect(fitConditioning([0.5, 0.5, 0.5])).toBe(Infinity);
    const spread = [[0.1, 0.92], [0.5, 0.955], [1, 0.95]].map(([x, eta]) => ({ loadFraction: x, efficiency: eta })); // invented datasheet
    const o = solveProject(project(supply, rectifier({ model: 'polynomial-fit', ratedPower: 1000, points: spread }), dcLoad));
    expect(o.ok ? [] : o.problems).toEqual([]);
  });

  it('a 1e-300 Ω resistor as a load (a short circuit: m·V²/|Z| overflows)', () => {
    const [p, ...rest] = refusal(tinyResistor);
    expect(rest).toEqual([]);
    expect(p).toMatchObject({ code: 'invalid-value', elementId: 'heater', field: 'network' });
    expect(p!.message).toMatch(/under 1 µΩ/);
    // A series L–C at resonance is the same short circuit: 1/(2π·50·√(L·C)) = 50 Hz for L = 1/(4π²·50²·C).
    const c = 1e-3;
    const l = 1 / (4 * Math.PI ** 2 * 50 ** 2 * c);
    const resonant = project(supply, { id: 'lc', name: 'Tuned', kind: 'network-load', from: 'src', network: { series: [{ inductor: l }, { capacitor: c }] } });
    const o = solveProject(resonant);
    expect(o.ok).toBe(false);
    if (!o.ok) expect(o.problems.map((q) => [q.elementId, q.field])).toEqual([['lc', 'network']]);
  });
});

describe('source resistances so small the short-circuit current overflows are refused', () => {
  // 48 V / 1.4e-322 Ω = Infinity (IEEE 754): the surge study then printed an infinite fault current.
  const bank = (r: number) => project({ id: 'bank', name: 'Bank', kind: 'battery', voltage: 48, internalResistance: r }, { id: 'ld', name: 'Load', kind: 'dc-load', from: 'bank', power: 100 });
  const grid = (r: number, x: number) => project({ ...supply, resistance: r, reactance: x }, { id: 'ld', name: 'Load', kind: 'ac-load', from: 'src', power: 100, powerFactor: 1 });

  it('a battery of 1.4e-322 Ω and a grid of 1e-300 Ω name the field', () => {
    expect(refusal(bank(1.4e-322)).map((p) => [p.elementId, p.field])).toEqual([['bank', 'internalResistance']]);
    expect(refusal(grid(1e-300, 0.1)).map((p) => [p.elementId, p.field])).toEqual([['src', 'resistance']]);
    expect(refusal(grid(0.1, 1e-13)).map((p) => [p.elementId, p.field])).toEqual([['src', 'reactance']]);
    expect(refusal(grid(0.1, 1e-13))[0]!.message).toMatch(/0 \(an ideal source\) or at least 1e-12 Ω/);
  });

  it('0 (an ideal source) and 1 pΩ are accepted; a negative value gets one message', () => {
    for (const p of [bank(0), bank(1e-12), grid(0, 0), grid(1e-12, 1e-12)]) {
      const o = solveProject(p);
      expect(o.ok ? [] : o.problems).toEqual([]);
    }
    expect(refusal(bank(-1)).map((p) => p.message)).toEqual(['must not be negative Ω']);
  });
});

describe('the final guard walks the whole result', () => {
  const good = solveProject(project(supply, rectifier({ model: 'constant', efficiency: 0.9 }), dcLoad));
  if (!good.ok) throw new Error('the base project must solve');

  it('finds every non-finite number and the element it belongs to', () => {
    expect(findNonFinite(good.result)).toEqual([]);
    const broken = structuredClone(good.result);
    broken.elements[1]!.input!.current = Number.NaN;
    broken.elements[2]!.pIn = Number.POSITIVE_INFINITY;
    broken.totals.losses = Number.NEGATIVE_INFINITY;
    expect(findNonFinite(broken)).toEqual([
      { elementId: 'rect', elementName: 'Rectifier', path: ['input', 'current'], value: Number.NaN },
      { elementId: 'ld', elementName: 'Load', path: ['pIn'], value: Number.POSITIVE_INFINITY },
      { elementId: PROJECT_LEVEL, path: ['totals', 'losses'], value: Number.NEGATIVE_INFINITY },
    ]);
    const problems = nonFiniteProblems('The solve', broken, new Map([['rect', 'Front rectifier']]));
    expect(problems.map((p) => [p.code, p.elementId, p.field])).toEqual([
      ['non-finite', 'rect', 'input.current'],
      ['non-finite', 'ld', 'pIn'],
      ['non-finite', PROJECT_LEVEL, 'totals.losses'],
    ]);
    // Users read the element's name and the field in words, not ids or file-format names.
    expect(problems[0]!.message).toContain('"Front rectifier"');
    expect(problems[0]!.message).toContain('input current (not a number)');
    expect(problems[1]!.message).toContain('"Load"');
    expect(problems[1]!.message).toContain('power in (infinite)');
    expect(problems[2]!.message).toContain('totals losses (minus infinite)');
  });

  it('a study result is checked the same way (elementId objects, nested lists)', () => {
    const study = { steps: [{ t: 0, soc: 1 }, { t: 60, soc: Number.NaN }], devices: [{ elementId: 'brk', name: 'Main breaker', faultCurrent: Infinity }] };
    const problems = nonFiniteProblems('The study', study);
    expect(problems.map((p) => [p.elementId, p.field])).toEqual([
      [PROJECT_LEVEL, 'steps.1.soc'],
      ['brk', 'faultCurrent'],
    ]);
    expect(problems[0]!.message).toContain('steps item 2 soc');
    expect(problems[1]!.message).toContain('"Main breaker"');
    expect(fieldWords(['shortCircuitPower'])).toBe('short circuit power');
  });

  it('the walk has no recursion limit: a value nested 100 000 deep is walked, its figure found with its path (issue 15, point 8)', () => {
    let nested: unknown = { elementId: 'deep', name: 'Deep', value: Number.NaN };
    for (let i = 0; i < 100_000; i++) nested = { next: nested };
    const found = findNonFinite(nested);
    expect(found).toHaveLength(1);
    expect(found[0]).toMatchObject({ elementId: 'deep', elementName: 'Deep', path: ['value'] });
  });

  it('the quick read before the full walk changes no answer: loops, shared parts, deep sound values, inherited figures (issue 20, point 5)', () => {
    // A value holding itself, a figure in it: the quick read gives up, the full walk finds it once.
    const loop: Record<string, unknown> = { elementId: 'lp', name: 'Loop', value: Number.NaN };
    loop['self'] = loop;
    expect(findNonFinite(loop)).toEqual([{ elementId: 'lp', elementName: 'Loop', path: ['value'], value: Number.NaN }]);
    // A sound loop and a sound part shared many times: nothing reported.
    const soundLoop: Record<string, unknown> = { a: 1 };
    soundLoop['self'] = soundLoop;
    expect(findNonFinite(soundLoop)).toEqual([]);
    const shared = { x: 1, y: [2, 3] };
    expect(findNonFinite({ list: Array.from({ length: 1000 }, () => shared) })).toEqual([]);
    // A sound value deeper than the quick read goes: the full walk says it is sound.
    let deep: unknown = { value: 1 };
    for (let i = 0; i < 1000; i++) deep = { next: deep };
    expect(findNonFinite(deep)).toEqual([]);
    // A figure the value only inherits is no part of it (the full walk reads own fields).
    const inherited = Object.create({ hidden: Number.NaN }) as Record<string, unknown>;
    inherited['shown'] = 2;
    expect(findNonFinite(inherited)).toEqual([]);
    // A sound solved result passes; one NaN anywhere in it is found.
    expect(findNonFinite(good.result)).toEqual([]);
    const one = structuredClone(good.result);
    one.elements[2]!.output = { ...one.elements[1]!.output!, voltage: Number.NaN };
    expect(findNonFinite(one).map((f) => [f.elementId, f.path.join('.')])).toEqual([['ld', 'output.voltage']]);
  });

  it('a load of 1e308 W is refused at its field with the plausible range (core/kinds/ranges.ts), before any sweep', () => {
    const o = solveProject(project(supply, { id: 'ld', name: 'Furnace', kind: 'ac-load', from: 'src', power: 1e308, powerFactor: 0.5 }));
    if (o.ok) throw new Error('solved, expected a refusal');
    expect(o.problems.map((p) => [p.code, p.elementId, p.field])).toEqual([['invalid-value', 'ld', 'power']]);
    // 1 GW: the table's largest plausible power (common practice, no source).
    expect(o.problems[0]!.message).toMatch(/must not exceed 1 GW/);
  });

  it('the sweep refuses a chain whose figures overflow (names the first element that left the doubles)', () => {
    // No field in its plausible range overflows any more, so the load's model is replaced after the
    // plan by one drawing 1e308 W: the ideal supply's I²·Z term, (1e308/230)² · 0, is NaN (IEEE 754:
    // the double maximum is about 1.8e308, and Infinity · 0 is NaN). The sweep stops at the first
    // element whose voltage or power leaves the doubles; nothing is shown.
    const valid = validateProject(project(supply, { id: 'ld', name: 'Furnace', kind: 'ac-load', from: 'src', power: 1000, powerFactor: 0.5 }));
    if (!valid.ok) throw new Error(JSON.stringify(valid.problems));
    const planned = plan(valid.project);
    if (!planned.ok) throw new Error(JSON.stringify(planned.problems));
    const load = planned.order[1]!;
    load.model = { ...load.model, inputPower: () => c(1e308, 1e308) };
    const o = sweep(planned.order);
    if (o.ok) throw new Error('solved, expected a refusal');
    expect(o.problems.map((p) => [p.code, p.elementId, p.field])).toEqual([['non-finite', 'src', 'input.p']]);
    expect(o.problems[0]!.message).toContain('input power of "Supply"');
    expect(o.problems[0]!.message).not.toMatch(/NaN|Infinity/);
    expect(elementNames(tinyEfficiency).get('rect')).toBe('Rectifier');
  });
});

describe('the CLI exits non-zero on each of them, naming element and field', () => {
  for (const [name, input, field] of [
    // The fields by their form labels (core/model/field-labels.ts): the rectifier's efficiency and datasheet points, the R, L, C load's circuit.
    ['tiny-efficiency', tinyEfficiency, 'Efficiency (%)'],
    ['bunched-fit', bunchedFit(1e-15), 'Datasheet points'],
    ['tiny-resistor', tinyResistor, 'Circuit'],
  ] as const) {
    it(name, () => {
      const file = join(scratch, `${name}.json`);
      writeFileSync(file, JSON.stringify(input));
      const r = spawnSync(TSX, ['core/cli/cli.ts', file], { encoding: 'utf8' });
      expect(r.status).toBe(1);
      expect(r.stdout).toBe('');
      expect(r.stderr).toContain(`, ${field}: `);
      expect(r.stderr).not.toMatch(/NaN|Infinity/);
    }, 30_000);
  }
});

describe('messages never print a figure that left the doubles', () => {
  it('a link that cannot carry an out-of-range load is refused without "NaN kW" (fast-check counterexample, seed -1916471725)', () => {
    const out = solveProject({
      format: 'joulepath-project',
      version: 2,
      name: 'Extreme chain',
      elements: [
        { id: 'src', name: 'Supply', kind: 'grid', phases: 1, voltage: 0.1, frequency: 50, resistance: 1 },
        { id: 'ac-run', name: 'Feeder', kind: 'cable', from: 'src', length: 1e88, resistancePerKm: 0.1 },
        { id: 'rect', name: 'Rectifier', kind: 'rectifier', from: 'ac-run', outputVoltage: 1, inputPowerFactor: 0.95, loss: { model: 'constant', efficiency: 1 } },
        { id: 'dc-run', name: 'DC run', kind: 'cable', from: 'rect', length: 10, resistancePerKm: 0.1 },
        { id: 'dc', name: 'DC load', kind: 'dc-load', from: 'dc-run', power: 4.057428534040044e22 },
        { id: 'side', name: 'Side load', kind: 'network-load', from: 'ac-run', network: { series: [{ resistor: 0.1 }] } },
      ],
    });
    expect(out.ok).toBe(false);
    if (out.ok) return;
    for (const p of out.problems) expect(p.message).not.toMatch(/NaN|Infinity/);
  });
});
