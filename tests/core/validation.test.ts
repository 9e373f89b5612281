/**
 * Validation: every bad value gives a problem naming the element id, the field path and a readable
 * message, and nothing is computed. Each bad value is checked against the rule documented in
 * core/model/project.ts (quoted beside the case) or a plain physical fact (noted beside it).
 */
import { describe, expect, it } from 'vitest';
import { PROJECT_LEVEL } from '../../core/model/errors.ts';
import { formatProblem, solveProject, type Problem, type ProblemCode } from '../../core/index.ts';
import { fieldLabel } from '../../core/model/field-labels.ts';

type Json = Record<string, any>; // test fixtures are deliberately loose: they hold invalid data

/** A small valid chain touching DC, single-phase AC, three-phase AC and a shaft. */
function validProject(): Json {
  return {
    format: 'joulepath-project',
    version: 2,
    name: 'Validation fixture',
    elements: [
      { id: 'bank', kind: 'battery', voltage: 48, internalResistance: 0.01 },
      { id: 'conv', kind: 'dc-dc', from: 'bank', outputVoltage: 12, loss: { model: 'constant', efficiency: 0.92 } },
      { id: 'lamp', kind: 'dc-load', from: 'conv', power: 60 },
      { id: 'inv1', kind: 'inverter', from: 'bank', phases: 1, outputVoltage: 230, frequency: 50, loss: { model: 'constant', efficiency: 0.94 } },
      { id: 'sockets', kind: 'ac-load', from: 'inv1', power: 300, powerFactor: 0.9 },
      { id: 'inv3', kind: 'inverter', from: 'bank', phases: 3, outputVoltage: 400, frequency: 50, loss: { model: 'constant', efficiency: 0.95 } },
      { id: 'feed', kind: 'cable', from: 'inv3', length: 20, resistancePerKm: 3.1, reactancePerKm: 0.09 },
      {
        id: 'xfmr',
        kind: 'transformer',
        from: 'feed',
        ratedApparentPower: 5000,
        primaryVoltage: 400,
        secondaryVoltage: 230,
        noLoadLoss: 40,
        loadLoss: 150,
        impedancePercent: 4,
      },
      { id: 'heater', kind: 'ac-va-load', from: 'xfmr', apparentPower: 800, powerFactor: 1 },
      {
        id: 'motor',
        kind: 'motor',
        from: 'feed',
        ratedOutput: 1500,
        loss: { model: 'constant', efficiency: 0.85 },
        powerFactor: { model: 'constant', powerFactor: 0.8 },
      },
      { id: 'fan', kind: 'shaft-load', from: 'motor', power: 1100 },
      {
        id: 'psu',
        kind: 'generic',
        from: 'inv1',
        inputKind: 'ac1',
        outputKind: 'dc',
        outputVoltage: 24,
        loss: { model: 'curve', ratedPower: 200, points: [{ loadFraction: 0.2, efficiency: 0.85 }, { loadFraction: 1, efficiency: 0.9 }] },
      },
      { id: 'relay', kind: 'dc-load', from: 'psu', power: 40 },
    ],
  };
}

const el = (p: Json, id: string): Json => p.elements.find((e: Json) => e.id === id);

/** Solve and return the problems; fails if the project solved (no result may be produced). */
function problemsOf(input: unknown): Problem[] {
  const outcome = solveProject(input);
  expect(outcome.ok, 'a bad project must not solve').toBe(false);
  if (outcome.ok) throw new Error('solved');
  expect(outcome).not.toHaveProperty('result');
  expect(outcome.problems.length).toBeGreaterThan(0);
  return outcome.problems;
}

/** A message a user can act on: a sentence, not empty, no leaked internals. */
function expectReadable(p: Problem) {
  expect(typeof p.message).toBe('string');
  expect(p.message.length).toBeGreaterThanOrEqual(8);
  expect(p.message).not.toMatch(/undefined|\[object|NaN|ZodError|^\s*$/);
  // The one-line form names the element and the field: without the project by the element's id and
  // the field's path in words; never the file-format path itself when it is a camelCase key.
  const line = formatProblem(p);
  if (p.elementId !== PROJECT_LEVEL) expect(line).toContain(`"${p.elementId}"`);
  else expect(line).toMatch(/^Project[,:]/);
  if (p.field) expect(line).toContain(`, ${fieldLabel(undefined, p.field)}: `);
  expect(line).not.toMatch(/^[^:]*field "/);
}

/** Exactly one problem with this element, field and code, and a message matching `says`. */
function expectOnly(input: unknown, code: ProblemCode, elementId: string, field: string, says: RegExp): Problem {
  const problems = problemsOf(input);
  expect(problems, JSON.stringify(problems)).toHaveLength(1);
  const p = problems[0]!;
  expect(p).toMatchObject({ code, elementId, field });
  expect(p.message).toMatch(says);
  expectReadable(p);
  return p;
}

describe('the fixture', () => {
  it('is valid and solves (so every failure below is caused by the one change made)', () => {
    const outcome = solveProject(validProject());
    expect(outcome.ok ? [] : outcome.problems).toEqual([]);
    expect(outcome.ok).toBe(true);
  });
});

describe('bad field values', () => {
  // model.ts: "Efficiency at that point, 0.01 ≤ η ≤ 1": below 1 % refused (core/kinds/spec.ts
  // MIN_EFFICIENCY: the loss P_out·(1/η − 1) overflows at 1e-300; common practice, no source).
  it.each([
    [0, /at least 1 %/],
    [1.2, /not exceed 1/],
    [-0.5, /at least 1 %/],
    [1e-300, /at least 1 %/],
    [0.0099, /at least 1 %/],
  ])('efficiency %s', (value, says) => {
    const p = validProject();
    el(p, 'conv').loss.efficiency = value;
    expect(expectOnly(p, 'invalid-value', 'conv', 'loss.efficiency', says).value).toBe(value);
  });

  it('efficiency inside a curve point names the point', () => {
    const p = validProject();
    el(p, 'psu').loss.points[1].efficiency = 1.05; // η ≤ 1 (model.ts)
    expectOnly(p, 'invalid-value', 'psu', 'loss.points.1.efficiency', /not exceed 1/);
  });

  // A voltage is a positive magnitude (model.ts: open-circuit / set-point voltages, V).
  it.each([
    ['bank', 'voltage', 0],
    ['bank', 'voltage', -48],
    ['conv', 'outputVoltage', 0],
    ['inv3', 'outputVoltage', -400],
    ['xfmr', 'secondaryVoltage', 0],
  ])('voltage: %s.%s = %s', (id, field, value) => {
    const p = validProject();
    el(p, id)[field] = value;
    expect(expectOnly(p, 'invalid-value', id, field, /greater than 0/).value).toBe(value);
  });

  // Power factor = P/S lies in (0, 1] (definition; model.ts unitFraction).
  it.each([
    ['sockets', 0, /greater than 0/],
    ['sockets', 1.1, /not exceed 1/],
    ['heater', 0, /greater than 0/],
    ['heater', 1.1, /not exceed 1/],
  ])('powerFactor: %s = %s', (id, value, says) => {
    const p = validProject();
    el(p, id).powerFactor = value;
    expectOnly(p, 'invalid-value', id, 'powerFactor', says);
  });

  it('motor power factor 1.1 names the nested field', () => {
    const p = validProject();
    el(p, 'motor').powerFactor.powerFactor = 1.1;
    expectOnly(p, 'invalid-value', 'motor', 'powerFactor.powerFactor', /not exceed 1/);
  });

  it('a number that is not finite (NaN) is refused', () => {
    const p = validProject();
    el(p, 'lamp').power = Number.NaN;
    expectOnly(p, 'invalid-value', 'lamp', 'power', /number/);
  });

  it('a number given as text is refused', () => {
    const p = validProject();
    el(p, 'lamp').power = '60';
    expectOnly(p, 'invalid-value', 'lamp', 'power', /number/);
  });

  it('a negative load power is refused', () => {
    const p = validProject();
    el(p, 'lamp').power = -1; // loads draw power (model.ts: constant-power load, W ≥ 0)
    expectOnly(p, 'invalid-value', 'lamp', 'power', /negative/);
  });
});

describe('element kinds and fields', () => {
  it('unknown kind', () => {
    const p = validProject();
    // A format-1 spelling in a format-2 file is not brought up to date: only a version-1 file is.
    el(p, 'conv').kind = 'dcdc';
    const prob = expectOnly(p, 'unknown-kind', 'conv', 'kind', /unknown kind "dcdc"/);
    expect(prob.message).toContain('dc-dc'); // it lists the kinds that exist
  });

  it('unknown field (a typo) on an element', () => {
    const p = validProject();
    const cable = el(p, 'feed');
    cable.lenght = cable.length;
    delete cable.length;
    const problems = problemsOf(p);
    // The typo is named; the field it should have been is missing, and that is named too.
    expect(problems.map((x) => [x.elementId, x.field]).sort()).toEqual([
      ['feed', 'lenght'],
      ['feed', 'length'],
    ]);
    expect(problems.find((x) => x.field === 'lenght')!.message).toMatch(/unknown field "lenght"/);
    expect(problems.find((x) => x.field === 'length')!.message).toMatch(/required/);
    problems.forEach(expectReadable);
  });

  it('an extra field alone is refused (not silently ignored)', () => {
    const p = validProject();
    el(p, 'lamp').powr = 60;
    expectOnly(p, 'invalid-value', 'lamp', 'powr', /unknown field "powr"/);
  });

  it('missing required field', () => {
    const p = validProject();
    delete el(p, 'inv1').frequency;
    expectOnly(p, 'invalid-value', 'inv1', 'frequency', /required/);
  });

  it('missing loss model', () => {
    const p = validProject();
    delete el(p, 'conv').loss;
    expectOnly(p, 'invalid-value', 'conv', 'loss', /required/);
  });

  it('unknown loss model name', () => {
    const p = validProject();
    el(p, 'conv').loss = { model: 'linear', efficiency: 0.9 };
    expectOnly(p, 'invalid-value', 'conv', 'loss.model', /constant.*curve.*polynomial/);
  });

  it('a generic AC output needs its frequency', () => {
    const p = validProject();
    Object.assign(el(p, 'psu'), { outputKind: 'ac1' });
    el(p, 'relay').kind = 'ac-load';
    el(p, 'relay').powerFactor = 1;
    expectOnly(p, 'invalid-value', 'psu', 'outputFrequency', /needed/);
  });

  it('an element that is not an object is named by its position', () => {
    const p = validProject();
    p.elements.push(7);
    expectOnly(p, 'invalid-value', `#${p.elements.length}`, '', /object/);
  });
});

describe('tree structure', () => {
  it('duplicate ids', () => {
    const p = validProject();
    el(p, 'relay').id = 'lamp';
    expectOnly(p, 'duplicate-id', 'lamp', 'id', /more than one/);
  });

  it('no source', () => {
    const p = validProject();
    p.elements = p.elements.filter((e: Json) => e.id !== 'bank');
    // The three elements that were fed from the removed bank now name a missing feeder as well.
    expect(problemsOf(p).map((x) => `${x.code}:${x.elementId}:${x.field}`).sort()).toEqual([
      `missing-source:${PROJECT_LEVEL}:elements`,
      'unknown-feed:conv:from',
      'unknown-feed:inv1:from',
      'unknown-feed:inv3:from',
    ]);
  });

  it('no elements at all', () => {
    const p = validProject();
    p.elements = [];
    expectOnly(p, 'missing-source', PROJECT_LEVEL, 'elements', /source/);
  });

  it('two sources', () => {
    const p = validProject();
    p.elements.push({ id: 'mains', kind: 'grid', phases: 1, voltage: 230, frequency: 50 });
    const prob = expectOnly(p, 'several-sources', 'mains', 'kind', /one source/);
    expect(prob.message).toContain('bank'); // says which element already is the source
  });

  it('`from` naming a missing element', () => {
    const p = validProject();
    el(p, 'lamp').from = 'cnv';
    expect(expectOnly(p, 'unknown-feed', 'lamp', 'from', /"cnv"/).value).toBe('cnv');
  });

  it('`from` naming a load', () => {
    const p = validProject();
    p.elements.push({ id: 'lamp2', kind: 'dc-load', from: 'lamp', power: 10 });
    expectOnly(p, 'not-a-feeder', 'lamp2', 'from', /load/);
  });

  it('a cable fed from a load is refused, not built without an input port (fast-check counterexample, issue 15: it threw a TypeError)', () => {
    const p = validProject();
    p.elements.push({ id: 'after-lamp', kind: 'cable', from: 'lamp', length: 1, resistancePerKm: 0.1 });
    expectOnly(p, 'not-a-feeder', 'after-lamp', 'from', /load/);
  });

  it('a cycle a → b → a beside a proper source', () => {
    const p = validProject();
    p.elements.push({ id: 'a', kind: 'dc-bus', from: 'b', fixedLoss: 1 }, { id: 'b', kind: 'dc-bus', from: 'a', fixedLoss: 1 });
    // One loop, one problem: on its first element in file order, naming both (issue 15, point 8).
    const problems = problemsOf(p);
    expect(problems.map((x) => [x.code, x.elementId, x.field])).toEqual([['cycle', 'a', 'from']]);
    expect(problems[0]!.message).toMatch(/loop of 2 elements \("a" → "b" → "a"\)/);
    problems.forEach(expectReadable);
  });

  it('an element fed from itself', () => {
    const p = validProject();
    p.elements.push({ id: 'selfish', kind: 'dc-bus', from: 'selfish', fixedLoss: 1 });
    expectOnly(p, 'cycle', 'selfish', 'from', /loop/);
  });

  it('a DC load fed from an AC port', () => {
    const p = validProject();
    el(p, 'lamp').from = 'inv1';
    const prob = expectOnly(p, 'kind-mismatch', 'lamp', 'from', /single-phase AC/);
    expect(prob.message).toMatch(/DC/);
  });

  it('an AC load on a motor shaft', () => {
    const p = validProject();
    el(p, 'sockets').from = 'motor';
    expectOnly(p, 'kind-mismatch', 'sockets', 'from', /shaft/);
  });

  it('a motor fed from DC', () => {
    const p = validProject();
    el(p, 'motor').from = 'bank';
    expectOnly(p, 'kind-mismatch', 'motor', 'from', /DC/);
  });

  it('a generic stage whose declared inputKind does not match its feed', () => {
    const p = validProject();
    el(p, 'psu').from = 'conv'; // a DC port, but the stage declares inputKind "ac1"
    const prob = expectOnly(p, 'kind-mismatch', 'psu', 'from', /DC/);
    expect(prob.message).toMatch(/single-phase AC/);
  });
});

describe('cross-field and model checks', () => {
  it('transformer impedancePercent below its resistance percent', () => {
    // Z% ≥ R% because Z² = R² + X² (impedance triangle). R% = 100·P_load,rated/S_rated
    // = 100·150/5000 = 3 % (per-unit copper loss, common practice).
    const p = validProject();
    el(p, 'xfmr').impedancePercent = 2.5;
    const prob = expectOnly(p, 'invalid-value', 'xfmr', 'impedancePercent', /resistance percent/);
    expect(prob.message).toContain('3.00 %');
    expect(prob.value).toBe(2.5);
  });

  it('transformer impedancePercent exactly equal to its resistance percent is valid (X = 0)', () => {
    const p = validProject();
    el(p, 'xfmr').impedancePercent = 3; // = R% (see above)
    expect(solveProject(p).ok).toBe(true);
  });

  it('curve points with duplicate load fractions', () => {
    const p = validProject();
    el(p, 'psu').loss.points = [
      { loadFraction: 0.5, efficiency: 0.88 },
      { loadFraction: 0.5, efficiency: 0.89 },
      { loadFraction: 1, efficiency: 0.9 },
    ];
    expectOnly(p, 'invalid-value', 'psu', 'loss.points', /same load fraction/);
  });

  it('motor power-factor curve with duplicate load fractions', () => {
    const p = validProject();
    el(p, 'motor').powerFactor = { model: 'curve', points: [{ loadFraction: 0.75, powerFactor: 0.8 }, { loadFraction: 0.75, powerFactor: 0.82 }] };
    expectOnly(p, 'invalid-value', 'motor', 'powerFactor.points', /same load fraction/);
  });

  it('a curve with a single point', () => {
    const p = validProject();
    el(p, 'psu').loss.points = [{ loadFraction: 0.5, efficiency: 0.88 }]; // a line needs two points
    expectOnly(p, 'invalid-value', 'psu', 'loss.points', /two/);
  });

  it('polynomial-fit with 2 points (three coefficients need at least three points)', () => {
    const p = validProject();
    el(p, 'conv').loss = { model: 'polynomial-fit', ratedPower: 100, points: [{ loadFraction: 0.5, efficiency: 0.9 }, { loadFraction: 1, efficiency: 0.92 }] };
    expectOnly(p, 'invalid-value', 'conv', 'loss.points', /three/);
  });

  it('polynomial-fit with 3 points of which two share a load fraction', () => {
    const p = validProject();
    el(p, 'conv').loss = {
      model: 'polynomial-fit',
      ratedPower: 100,
      points: [{ loadFraction: 0.5, efficiency: 0.9 }, { loadFraction: 0.5, efficiency: 0.91 }, { loadFraction: 1, efficiency: 0.92 }],
    };
    expectOnly(p, 'invalid-value', 'conv', 'loss.points', /same load fraction/);
  });

  it('a curve point at load fraction 0', () => {
    const p = validProject();
    el(p, 'psu').loss.points[0].loadFraction = 0; // η = P_out/P_in is undefined at no output
    expectOnly(p, 'invalid-value', 'psu', 'loss.points.0.loadFraction', /greater than 0/);
  });

  it.each([
    [1.5, /whole number/],
    [0, /at least 1/],
  ])('cable parallelSets %s', (value, says) => {
    const p = validProject();
    el(p, 'feed').parallelSets = value; // a count of conductor sets (model.ts)
    expectOnly(p, 'invalid-value', 'feed', 'parallelSets', says);
  });

  it('source phases other than 1 or 3', () => {
    const p = validProject();
    p.elements[0] = { id: 'mains', kind: 'grid', phases: 2, voltage: 230, frequency: 50 };
    for (const e of p.elements) if (e.from === 'bank') e.from = 'mains';
    expectOnly(p, 'invalid-value', 'mains', 'phases', /1 or 3/);
  });
});

describe('the project file', () => {
  it.each([
    ['a number', 42],
    ['null', null],
    ['a list', []],
    ['text', 'joulepath-project'],
  ])('not an object: %s', (_label, input) => {
    const problems = problemsOf(input);
    expect(problems).toHaveLength(1);
    expect(problems[0]).toMatchObject({ code: 'invalid-value', elementId: PROJECT_LEVEL, field: '' });
    expect(problems[0]!.message).toMatch(/object/);
    expectReadable(problems[0]!);
  });

  it('undefined (nothing given) does not throw and is refused', () => {
    expect(problemsOf(undefined)[0]).toMatchObject({ elementId: PROJECT_LEVEL });
  });

  it('wrong format', () => {
    const p = validProject();
    p.format = 'powerchain';
    expectOnly(p, 'invalid-value', PROJECT_LEVEL, 'format', /joulepath-project/);
  });

  it('wrong version', () => {
    const p = validProject();
    p.version = 0;
    expectOnly(p, 'invalid-value', PROJECT_LEVEL, 'version', /must be 2 \(files of format 1 are brought up to date/);
    p.version = 3;
    expectOnly(p, 'invalid-value', PROJECT_LEVEL, 'version', /is 3: the file was written by a newer version of Joulepath/);
  });

  it('elements not a list', () => {
    const p = validProject();
    p.elements = { bank: {} };
    expectOnly(p, 'invalid-value', PROJECT_LEVEL, 'elements', /list/);
  });

  it('unknown top-level field', () => {
    const p = validProject();
    p.author = 'someone';
    expectOnly(p, 'invalid-value', PROJECT_LEVEL, 'author', /unknown field/);
  });
});

describe('several problems at once', () => {
  it('field problems in several elements are all reported together', () => {
    const p = validProject();
    el(p, 'conv').loss.efficiency = 1.2;
    el(p, 'conv').outputVoltage = 0;
    el(p, 'lamp').power = -5;
    el(p, 'sockets').powerFactor = 0;
    delete el(p, 'feed').length;
    const problems = problemsOf(p);
    expect(problems.map((x) => `${x.elementId}:${x.field}`).sort()).toEqual([
      'conv:loss.efficiency',
      'conv:outputVoltage',
      'feed:length',
      'lamp:power',
      'sockets:powerFactor',
    ]);
    problems.forEach(expectReadable);
  });

  it('wrong format and wrong version are both reported', () => {
    const p = validProject();
    p.format = 'x';
    p.version = 3;
    expect(problemsOf(p).map((x) => x.field).sort()).toEqual(['format', 'version']);
  });

  it('structural problems in different branches are all reported together', () => {
    const p = validProject();
    p.elements.push({ id: 'orphan', kind: 'dc-load', from: 'nowhere', power: 1 });
    p.elements.push({ id: 'lamp2', kind: 'dc-load', from: 'lamp', power: 1 });
    p.elements.push({ id: 'mains', kind: 'grid', phases: 1, voltage: 230, frequency: 50 });
    const problems = problemsOf(p);
    expect(problems.map((x) => `${x.code}:${x.elementId}`).sort()).toEqual(['not-a-feeder:lamp2', 'several-sources:mains', 'unknown-feed:orphan']);
  });

  it('two port-kind mismatches are both reported', () => {
    const p = validProject();
    el(p, 'lamp').from = 'inv1';
    el(p, 'fan').from = 'conv';
    expect(problemsOf(p).map((x) => `${x.code}:${x.elementId}`).sort()).toEqual(['kind-mismatch:fan', 'kind-mismatch:lamp']);
  });

  // The three cases below mix problems found by different checks (fields, tree shape, port kinds):
  // all of them must come back together.
  it('a port-kind mismatch is reported alongside a `from` naming a load', () => {
    const p = validProject();
    el(p, 'lamp').from = 'inv1'; // kind-mismatch: DC load on a single-phase AC port
    p.elements.push({ id: 'lamp2', kind: 'dc-load', from: 'sockets', power: 1 }); // not-a-feeder
    expect(problemsOf(p).map((x) => `${x.code}:${x.elementId}`).sort()).toEqual(['kind-mismatch:lamp', 'not-a-feeder:lamp2']);
  });

  it('a duplicate id is reported even when one of the duplicates also has a bad field', () => {
    const p = validProject();
    el(p, 'relay').id = 'lamp'; // duplicate of "lamp"
    el(p, 'lamp').power = -1; // and a bad value on the first "lamp"
    expect(problemsOf(p).map((x) => `${x.code}:${x.elementId}:${x.field}`).sort()).toEqual(['duplicate-id:lamp:id', 'invalid-value:lamp:power']);
  });

  it('a bad field value and a `from` naming a missing element are reported together', () => {
    const p = validProject();
    el(p, 'conv').loss.efficiency = 1.2;
    el(p, 'sockets').from = 'inv2';
    expect(problemsOf(p).map((x) => `${x.code}:${x.elementId}:${x.field}`).sort()).toEqual([
      'invalid-value:conv:loss.efficiency',
      'unknown-feed:sockets:from',
    ]);
  });
});

describe('loads given by their current', () => {
  /** The fixture with a DC and an AC load given by their current. */
  function withCurrentLoads(): Json {
    const p = validProject();
    p.elements.push({ id: 'charger', kind: 'dc-current-load', from: 'bank', current: 5 });
    p.elements.push({ id: 'heat-trace', kind: 'ac-current-load', from: 'feed', current: 2, powerFactor: 0.95 });
    return p;
  }

  it('the fixture with them solves', () => {
    const outcome = solveProject(withCurrentLoads());
    expect(outcome.ok ? [] : outcome.problems).toEqual([]);
  });

  // model.ts: a load given by its current draws a current, A ≥ 0 (as every load draws, never gives).
  it.each([
    ['charger', -1, /negative/],
    ['heat-trace', -0.5, /negative/],
    ['charger', '5 A', /number/],
    ['heat-trace', Number.NaN, /number/],
    ['charger', Number.POSITIVE_INFINITY, /number/],
  ])('current: %s = %s', (id, value, says) => {
    const p = withCurrentLoads();
    el(p, id).current = value;
    expectOnly(p, 'invalid-value', id, 'current', says);
  });

  it('a missing current is named', () => {
    const p = withCurrentLoads();
    delete el(p, 'charger').current;
    expectOnly(p, 'invalid-value', 'charger', 'current', /required/);
  });

  // Power factor = P/S lies in (0, 1] (definition; model.ts unitFraction).
  it.each([
    [0, /greater than 0/],
    [1.2, /not exceed 1/],
  ])('AC current load power factor %s', (value, says) => {
    const p = withCurrentLoads();
    el(p, 'heat-trace').powerFactor = value;
    expectOnly(p, 'invalid-value', 'heat-trace', 'powerFactor', says);
  });

  it('a DC current load on an AC port, and an AC one on DC, are refused at "from"', () => {
    const p = withCurrentLoads();
    el(p, 'charger').from = 'inv1';
    el(p, 'heat-trace').from = 'conv';
    expect(problemsOf(p).map((x) => `${x.code}:${x.elementId}:${x.field}`).sort()).toEqual(['kind-mismatch:charger:from', 'kind-mismatch:heat-trace:from']);
  });

  it('a current the cable cannot deliver is refused at the load’s current, naming the cable', () => {
    // Ohm's law: 1 Ω of loop resistance cannot pass 60 A from a 48 V bank (60 V of drop).
    const p = withCurrentLoads();
    p.elements.push({ id: 'run', kind: 'cable', from: 'bank', length: 50, resistancePerKm: 10, name: 'Yard run' });
    p.elements.push({ id: 'winch', kind: 'dc-current-load', from: 'run', current: 60 });
    const prob = expectOnly(p, 'infeasible-load', 'winch', 'current', /60 A cannot be delivered through "Yard run"/);
    expect(prob.value).toBe(60);
  });

  it('behind a bus the load’s current is refused too, and beside a power load the cable is named with both demands', () => {
    // Ohm's law: 1 Ω cannot pass 60 A (60 V of drop) from 48 V, whatever else shares the run.
    const p = withCurrentLoads();
    p.elements.push({ id: 'run', kind: 'cable', from: 'bank', length: 50, resistancePerKm: 10, name: 'Yard run' });
    p.elements.push({ id: 'board', kind: 'dc-bus', from: 'run', fixedLoss: 2 });
    p.elements.push({ id: 'winch', kind: 'dc-current-load', from: 'board', current: 60 });
    p.elements.push({ id: 'lamp2', kind: 'dc-current-load', from: 'board', current: 1 });
    expectOnly(p, 'infeasible-load', 'winch', 'current', /60 A cannot be delivered through "Yard run" \(with the other load given by its current/);
    el(p, 'lamp2').kind = 'dc-load';
    el(p, 'lamp2').power = 20;
    delete el(p, 'lamp2').current;
    expectOnly(p, 'infeasible-load', 'run', '', /the 20 W of load beyond it and the 60 A of loads given by their current/);
  });
});

describe('equipment ratings (read by conductor sizing; the solve ignores them)', () => {
  const grid3 = { id: 'sup', kind: 'grid', phases: 3, voltage: 400, frequency: 50 };
  /** A project holding each rated kind once. */
  function rated(): Json {
    return {
      format: 'joulepath-project',
      version: 2,
      name: 'Ratings fixture',
      elements: [
        grid3,
        { id: 'vfd', kind: 'drive', from: 'sup', outputVoltage: 400, outputFrequency: 50, inputPowerFactor: 0.95, loss: { model: 'constant', efficiency: 0.97 } },
        { id: 'mot', kind: 'motor', from: 'vfd', ratedOutput: 7500, efficiencyClass: 'IE3', poles: 4, ratedFrequency: 50 },
        { id: 'fan', kind: 'shaft-load', from: 'mot', power: 5000 },
        { id: 'chg', kind: 'rectifier', from: 'sup', outputVoltage: 54, inputPowerFactor: 0.99, loss: { model: 'constant', efficiency: 0.92 } },
        { id: 'conv', kind: 'dc-dc', from: 'chg', outputVoltage: 12, loss: { model: 'constant', efficiency: 0.94 } },
        { id: 'lamp', kind: 'dc-load', from: 'conv', power: 60 },
        { id: 'inv', kind: 'inverter', from: 'chg', phases: 1, outputVoltage: 230, frequency: 50, loss: { model: 'constant', efficiency: 0.95 } },
        { id: 'sockets', kind: 'ac-load', from: 'inv', power: 300, powerFactor: 0.9 },
      ],
    };
  }
  const RATINGS: [string, string, number][] = [
    ['vfd', 'ratedInputCurrent', 14.9],
    ['inv', 'ratedOutputPower', 3000],
    ['chg', 'ratedOutputCurrent', 40],
    ['conv', 'ratedOutputPower', 240],
    ['conv', 'minInputVoltage', 40],
  ];

  it('given, they change nothing in the solve', () => {
    const plain = solveProject(rated());
    const p = rated();
    for (const [id, field, value] of RATINGS) el(p, id)[field] = value;
    const withRatings = solveProject(p);
    expect(plain.ok).toBe(true);
    // The results are equal; the solved projects differ by the ratings given.
    expect(withRatings.ok && withRatings.result).toStrictEqual(plain.ok && plain.result);
  });

  // Ratings are positive, finite amounts (model.ts).
  it.each(RATINGS.flatMap(([id, field]) => [[id, field, 0, /greater than 0/] as const, [id, field, -3, /greater than 0/] as const, [id, field, Number.POSITIVE_INFINITY, /number/] as const]))(
    '%s.%s = %s is refused',
    (id, field, value, says) => {
      const p = rated();
      el(p, id)[field] = value;
      expectOnly(p, 'invalid-value', id, field, says);
    },
  );
});
