// The traits each kind declares in its own file (core/kinds/spec.ts: regulatesVoltage, passive,
// load, nominalOutput, ideal, studies) agree with what the kind's model does in a solve, and a kind
// defined only in a test (tests/core/made-up-kinds.ts, registered through the registry's test hook)
// is validated, solved, sized, given its path drops and taken by the battery study's repeated solve
// from its traits alone.
//
// Check values: the fixtures' figures are invented; each check compares the solve with the kind's
// own declaration (its set point, its rated field), or one solve with another, so the source of
// every expected value is named beside it ("the kind's own definition", "the same chain with a
// DC-DC converter").
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { solveProject, validateProject, type ElementResult, type PortResult, type Project, type SolveResult } from '../../core/index.ts';
import { KINDS, studiesOf, type KindSpec, type NominalPort } from '../../core/kinds/index.ts';
import type { Element, ElementKind } from '../../core/model/project.ts';
import { profileLoads } from '../../core/solve/load-profile.ts';
import { prepareRepeat } from '../../core/solve/repeat.ts';
import { registerKind } from '../../core/kinds/index.ts';
import { madeUpRegulator, registerMadeUpKinds } from './made-up-kinds.ts';

type Json = Record<string, unknown>;
const project = (elements: Json[], extra: Json = {}) => ({ format: 'joulepath-project', version: 2, name: 'kind traits', elements, ...extra });
const demo = (id: string): Json => JSON.parse(readFileSync(`core/demos/${id}.json`, 'utf8'));
const DEMOS = ['cold-store-dc-bus', 'hillside-relay-hut', 'riverside-pump-station'];

function solved(elements: Json[]): SolveResult {
  const out = solveProject(project(elements));
  if (!out.ok) throw new Error(JSON.stringify(out.problems));
  return out.result;
}
const byId = (r: SolveResult, id: string): ElementResult => r.elements.find((e) => e.id === id)!;
const constant = (efficiency: number) => ({ model: 'constant', efficiency });

// Sources behind an impedance, so that what they feed sees its input voltage move with the load
// (invented values).
const GRID3 = { id: 'src', kind: 'grid', phases: 3, voltage: 400, frequency: 50, resistance: 0.5, reactance: 0.2 };
const GRID1 = { id: 'src', kind: 'grid', phases: 1, voltage: 230, frequency: 50, resistance: 0.5, reactance: 0.2 };
const BATTERY = { id: 'src', kind: 'battery', voltage: 48, internalResistance: 0.05 };

/**
 * One chain per kind (invented values): the source, the element `x` of the kind, and what it feeds
 * (`load`, a load whose level is `level`, in W, VA or A). For a source kind `x` is the source.
 */
const FIXTURES: Record<ElementKind, (level: number) => Json[]> = {
  grid: (l) => [{ ...GRID3, id: 'x' }, { id: 'load', kind: 'ac-load', from: 'x', power: l, powerFactor: 0.9 }],
  generator: (l) => [{ ...GRID3, id: 'x', kind: 'generator', ratedApparentPower: 50000 }, { id: 'load', kind: 'ac-load', from: 'x', power: l, powerFactor: 0.9 }],
  battery: (l) => [{ ...BATTERY, id: 'x' }, { id: 'load', kind: 'dc-load', from: 'x', power: l }],
  rectifier: (l) => [GRID1, { id: 'x', kind: 'rectifier', from: 'src', outputVoltage: 54, inputPowerFactor: 0.95, loss: constant(0.92) }, { id: 'load', kind: 'dc-load', from: 'x', power: l }],
  'dc-dc': (l) => [BATTERY, { id: 'x', kind: 'dc-dc', from: 'src', outputVoltage: 12, loss: constant(0.94) }, { id: 'load', kind: 'dc-load', from: 'x', power: l }],
  'dc-bus': (l) => [BATTERY, { id: 'x', kind: 'dc-bus', from: 'src', fixedLoss: 5 }, { id: 'load', kind: 'dc-load', from: 'x', power: l }],
  inverter: (l) => [BATTERY, { id: 'x', kind: 'inverter', from: 'src', phases: 1, outputVoltage: 230, frequency: 50, loss: constant(0.95) }, { id: 'load', kind: 'ac-load', from: 'x', power: l, powerFactor: 0.9 }],
  transformer: (l) => [
    GRID3,
    { id: 'x', kind: 'transformer', from: 'src', ratedApparentPower: 15000, primaryVoltage: 400, secondaryVoltage: 208, noLoadLoss: 100, loadLoss: 350, impedancePercent: 4 },
    { id: 'load', kind: 'ac-load', from: 'x', power: l, powerFactor: 0.9 },
  ],
  drive: (l) => [GRID3, { id: 'x', kind: 'drive', from: 'src', outputVoltage: 380, outputFrequency: 45, inputPowerFactor: 0.95, loss: constant(0.97) }, { id: 'load', kind: 'ac-load', from: 'x', power: l, powerFactor: 0.9 }],
  motor: (l) => [GRID3, { id: 'x', kind: 'motor', from: 'src', ratedOutput: 7500, efficiencyClass: 'IE3', poles: 4, ratedFrequency: 50 }, { id: 'load', kind: 'shaft-load', from: 'x', power: l }],
  cable: (l) => [GRID3, { id: 'x', kind: 'cable', from: 'src', length: 50, resistancePerKm: 1.15, reactancePerKm: 0.08 }, { id: 'load', kind: 'ac-load', from: 'x', power: l, powerFactor: 0.9 }],
  'transfer-switch': (l) => [GRID3, { id: 'x', kind: 'transfer-switch', from: 'src', contactResistance: 0.0005, controlPower: 15, ratedCurrent: 63, transferTime: 0.004 }, { id: 'load', kind: 'ac-load', from: 'x', power: l, powerFactor: 0.9 }],
  generic: (l) => [BATTERY, { id: 'x', kind: 'generic', from: 'src', inputKind: 'dc', outputKind: 'ac1', outputVoltage: 120, outputFrequency: 60, loss: constant(0.93) }, { id: 'load', kind: 'ac-load', from: 'x', power: l, powerFactor: 1 }],
  'dc-load': (l) => [BATTERY, { id: 'x', kind: 'dc-load', from: 'src', power: l }],
  'ac-load': (l) => [GRID1, { id: 'x', kind: 'ac-load', from: 'src', power: l, powerFactor: 0.8 }],
  'ac-va-load': (l) => [GRID3, { id: 'x', kind: 'ac-va-load', from: 'src', apparentPower: l, powerFactor: 0.8 }],
  'dc-current-load': (l) => [BATTERY, { id: 'x', kind: 'dc-current-load', from: 'src', current: l / 48 }],
  'ac-current-load': (l) => [GRID3, { id: 'x', kind: 'ac-current-load', from: 'src', current: l / 400, powerFactor: 0.85 }],
  'shaft-load': (l) => [GRID3, { id: 'm', kind: 'motor', from: 'src', ratedOutput: 7500, efficiencyClass: 'IE3', poles: 4, ratedFrequency: 50 }, { id: 'x', kind: 'shaft-load', from: 'm', power: Math.min(l, 7000) }],
  'network-load': () => [GRID1, { id: 'x', kind: 'network-load', from: 'src', network: { series: [{ resistor: '50 Ω' }, { inductor: '50 mH' }] } }],
  pump: () => [
    GRID3,
    { id: 'm', kind: 'motor', from: 'src', ratedOutput: 7500, efficiencyClass: 'IE3', poles: 4, ratedFrequency: 50 },
    { id: 'x', kind: 'pump', from: 'm', ratedFlow: 0.01, ratedHead: 30, shutoffHead: 38, efficiency: 0.75, staticHead: 8, flow: 0.009, control: 'throttle' },
  ],
  // A ventilation fan: 2 m³/s at 1000 Pa, 1300 Pa shut-off, 70 % (invented for the fixture).
  fan: () => [
    GRID3,
    { id: 'm', kind: 'motor', from: 'src', ratedOutput: 7500, efficiencyClass: 'IE3', poles: 4, ratedFrequency: 50 },
    { id: 'x', kind: 'fan', from: 'm', ratedFlow: 2, ratedPressure: 1000, shutoffPressure: 1300, efficiency: 0.7, flow: 1.6, control: 'damper' },
  ],
};

const kinds = [...KINDS.entries()];
const stages = kinds.filter(([, s]) => s.role === 'stage');
const close = (a: number, b: number, rel = 1e-12) => Math.abs(a - b) <= rel * Math.max(Math.abs(a), Math.abs(b), 1e-300);
const asNominal = (p: PortResult | undefined): NominalPort | null =>
  p ? { kind: p.kind, ...(p.kind !== 'shaft' ? { voltage: p.voltage } : {}), ...(p.frequency !== undefined ? { frequency: p.frequency } : {}) } : null;

describe('every kind of the registry has a fixture chain here', () => {
  it.each(kinds.map(([k]) => k))('%s', (kind) => {
    // A new kind fails here until its chain is added, so its traits are checked below.
    expect(FIXTURES[kind], kind).toBeDefined();
    expect(() => solved(FIXTURES[kind](1000))).not.toThrow();
  });
});

describe('regulatesVoltage: a stage holds its output voltage exactly when its input voltage moves', () => {
  it.each(stages.map(([k, s]) => [k, s.regulatesVoltage === true] as const))('%s: regulates = %s', (kind, regulates) => {
    // Two load levels move the stage's input voltage (the source has an impedance).
    const light = byId(solved(FIXTURES[kind](500)), 'x');
    const heavy = byId(solved(FIXTURES[kind](5000)), 'x');
    expect(close(light.input!.voltage, heavy.input!.voltage, 1e-6), 'the input voltage moved').toBe(false);
    const held = light.output!.kind !== 'shaft' && close(light.output!.voltage, heavy.output!.voltage);
    expect(held).toBe(regulates);
    if (regulates) {
      // The set point is the kind's own nominal output (its definition).
      const nominal = KINDS.get(kind)!.nominalOutput!(FIXTURES[kind](0)[1] as never, asNominal(light.input));
      expect(light.output!.voltage).toBeCloseTo(nominal!.voltage!, 9);
    }
  });
});

describe('passive: a stage passes its input on unchanged (idle: the same port kind, voltage and frequency)', () => {
  it.each(stages.map(([k, s]) => [k, s.passive === true] as const))('%s: passive = %s', (kind, passive) => {
    const x = byId(solved(FIXTURES[kind](0)), 'x');
    const passes = x.output!.kind === x.input!.kind && close(x.output!.voltage, x.input!.voltage) && x.output!.frequency === x.input!.frequency;
    expect(passes).toBe(passive);
  });
  it('no kind both regulates and passes its input on', () => {
    for (const [kind, s] of kinds) expect(s.regulatesVoltage && s.passive, kind).toBeFalsy();
  });
});

describe('dcEquivalent: on DC the element is its loop resistance and fixed loss', () => {
  // Invented elements; the expected figures follow from the equivalent by Ohm's law:
  // V_r = (V_s + √(V_s² − 4·R·P)) / 2, P_in = P + R·(P/V_r)² + P_fixed.
  const samples: Partial<Record<ElementKind, Json>> = {
    cable: { id: 'x', kind: 'cable', from: 'src', length: 12, resistancePerKm: 1.83, parallelSets: 2 },
    'dc-bus': { id: 'x', kind: 'dc-bus', from: 'src', fixedLoss: 7 },
    'transfer-switch': { id: 'x', kind: 'transfer-switch', from: 'src', contactResistance: 0.0008, controlPower: 12 },
  };
  it.each(kinds.filter(([, s]) => s.dcEquivalent).map(([k]) => k))('%s', (kind) => {
    const spec = KINDS.get(kind)!;
    expect(spec.passive, 'only passive kinds have one').toBe(true);
    const e = samples[kind]!;
    const eq = spec.dcEquivalent!(e as never)!;
    const model = spec.build(e as never, { kind: 'dc' });
    const [vs, p] = [48, 300];
    const vr = (vs + Math.sqrt(vs * vs - 4 * eq.resistance * p)) / 2;
    expect(model.outputVoltage({ re: vs, im: 0 }, { re: p, im: 0 })!.re).toBeCloseTo(vr, 9);
    expect(model.inputPower({ re: p, im: 0 }, { re: vs, im: 0 }, { re: vr, im: 0 }).re).toBeCloseTo(p + eq.resistance * (p / vr) ** 2 + eq.fixedLoss, 9);
  });
  it('a cable still to be sized has none (its impedance comes from the sizing)', () => {
    expect(KINDS.get('cable')!.dcEquivalent!({ id: 'x', kind: 'cable', from: 'src', length: 12, conductor: { system: 'nec', material: 'copper', size: 'auto' } } as never)).toBeNull();
  });
});

describe('load: the rated field a profile sets is what the load draws', () => {
  it.each(kinds.filter(([, s]) => s.role === 'load').map(([k, s]) => [k, s] as const))('%s', (kind, spec) => {
    const element = FIXTURES[kind](1200).find((e) => e['id'] === 'x')!;
    const x = byId(solved(FIXTURES[kind](1200)), 'x');
    if (!spec.load) {
      // A load without the trait has none of the fields a profile could set.
      for (const f of ['power', 'apparentPower', 'current']) expect(element[f], `${kind}.${f}`).toBeUndefined();
      return;
    }
    const rated = element[spec.load.field] as number;
    expect(typeof rated).toBe('number');
    // W: the real power drawn; VA: the apparent power; A: the current (the kind's own definition).
    const drawn = spec.load.unit === 'W' ? x.input!.p : spec.load.unit === 'VA' ? x.input!.s : x.input!.current;
    expect(drawn).toBeCloseTo(rated, 9);
  });
  it('a profile offers exactly the loads with the trait', () => {
    const elements = kinds.filter(([, s]) => s.role === 'load').flatMap(([k]) => FIXTURES[k](100).filter((e) => e['id'] === 'x').map((e) => ({ ...e, id: k })));
    const ids = profileLoads(project(elements) as unknown as Project).map((l) => l.id);
    expect(ids).toEqual(kinds.filter(([, s]) => s.load).map(([k]) => k));
  });
});

describe('nominalOutput: given the port the solve fed it, the kind names the port the solve gives (idle chains)', () => {
  it('every source and stage declares it, no load does', () => {
    for (const [kind, s] of kinds) expect(s.nominalOutput !== undefined, kind).toBe(s.role !== 'load');
  });
  it.each(kinds.filter(([, s]) => s.role !== 'load').map(([k]) => k))('%s', (kind) => {
    // The source made ideal (its `ideal` trait): an idle stage's own no-load loss would sag it.
    const chain = FIXTURES[kind](0).map((e) => (e['from'] === undefined ? (KINDS.get(e['kind'] as ElementKind)!.ideal!(e as never) as unknown as Json) : e));
    const x = byId(solved(chain), 'x');
    const element = chain.find((e) => e['id'] === 'x')!;
    const port = KINDS.get(kind)!.nominalOutput!(element as never, asNominal(x.input))!;
    expect(port.kind).toBe(x.output!.kind);
    if (port.voltage !== undefined) expect(port.voltage).toBeCloseTo(x.output!.voltage, 9);
    else expect(x.output!.kind).toBe('shaft');
    expect(port.frequency).toBe(x.output!.frequency);
  });

  // The demos with every source made ideal (its kind's `ideal` trait), every cable next to lossless
  // and every load a profile can set at 0: the solved ports are the nominal ones, except a battery
  // bank's, whose nominal voltage (cells × nominal cell voltage, NEC 480.2) is not the open-circuit
  // voltage at its initial charge that the solve uses (kind only there).
  it.each(DEMOS)('%s: every element\'s nominal output equals the solved one', (id) => {
    const valid = validateProject(demo(id));
    if (!valid.ok) throw new Error(JSON.stringify(valid.problems));
    const elements = valid.project.elements.map((e): Element => {
      const spec = KINDS.get(e.kind)!;
      if (spec.ideal) return spec.ideal(e);
      if (e.kind === 'cable') {
        const { conductor: _c, ...rest } = e;
        return { ...rest, resistancePerKm: 1e-12, reactancePerKm: 0 };
      }
      return spec.load ? ({ ...e, [spec.load.field]: 0 } as Element) : e;
    });
    const out = solveProject({ ...valid.project, format: 'joulepath-project', elements });
    if (!out.ok) throw new Error(JSON.stringify(out.problems));
    let compared = 0;
    for (const e of elements) {
      const spec = KINDS.get(e.kind)!;
      if (!spec.nominalOutput) continue;
      const r = byId(out.result, e.id);
      const port = spec.nominalOutput(e, asNominal(r.input))!;
      expect(port.kind, e.id).toBe(r.output!.kind);
      expect(port.frequency, e.id).toBe(r.output!.frequency);
      const bank = e.kind === 'battery' && e.bank !== undefined;
      if (port.voltage !== undefined && !bank) {
        expect(port.voltage, e.id).toBeCloseTo(r.output!.voltage, 6);
        compared++;
      }
    }
    expect(compared).toBeGreaterThan(2);
  });
});

describe('ideal: a source without its own impedance holds its nominal voltage under load', () => {
  it.each(kinds.filter(([, s]) => s.role === 'source').map(([k]) => k))('%s', (kind) => {
    const spec = KINDS.get(kind)!;
    expect(spec.ideal, kind).toBeDefined();
    const [source, load] = FIXTURES[kind](3000) as [Json, Json];
    const stiff = spec.ideal!(source as never) as unknown as Json;
    const x = byId(solved([stiff, load]), 'x');
    // The source's own rated voltage (its definition); with its impedance it sags (checked beside).
    expect(x.output!.voltage).toBeCloseTo(source['voltage'] as number, 9);
    expect(byId(solved([source, load]), 'x').output!.voltage).toBeLessThan((source['voltage'] as number) * (1 - 1e-4));
  });
});

describe('studies: what each kind declares matches the fields the studies read', () => {
  const fields = (s: KindSpec) => Object.keys((s.schema as unknown as { _zod: { def: { shape?: Record<string, unknown> } } })._zod.def.shape ?? {});
  it.each(kinds.map(([k]) => k))('%s', (kind) => {
    const s = KINDS.get(kind)!;
    const studies = new Set(s.studies ?? []);
    // The backup study needs a battery bank, the motor-start study a motor's starting data
    // (core/studies/backup, core/studies/surge/starting.ts); fault currents start at a source.
    expect(studies.has('backup'), 'backup').toBe(fields(s).includes('bank'));
    expect(studies.has('motor-start'), 'motor-start').toBe(fields(s).includes('starting'));
    // The pump duty study compares the flow control of a pump or fan: the kinds with a curve's shut-off point.
    expect(studies.has('fault-current'), 'fault-current').toBe(s.role === 'source');
    // The pump duty study compares the flow control of a pump: the kind with a pump curve.
    expect(studies.has('pump-duty'), 'pump-duty').toBe(fields(s).includes('shutoffHead') || fields(s).includes('shutoffPressure'));
    if (studies.has('pump-duty') || studies.has('motor-start')) expect(studies.has('machines')).toBe(true);
  });
  it('the demos: a bank, a pump and a drive each bring their studies', () => {
    const of = (id: string) => studiesOf((demo(id)['elements'] as { kind: string }[]));
    expect([...of('hillside-relay-hut')].sort()).toEqual(['backup', 'fault-current']);
    expect([...of('riverside-pump-station')].sort()).toEqual(['fault-current', 'machines', 'motor-start', 'pump-duty']);
    expect([...of('cold-store-dc-bus')]).toEqual(['fault-current']);
  });
});

describe('a made-up kind: its own file and the registry only', () => {
  let off: () => void = () => {};
  beforeAll(() => {
    off = registerMadeUpKinds();
  });
  afterAll(() => off());

  const nec = { system: 'nec', material: 'copper', size: 'auto', insulationRating: 75 };
  // A bank, its feeder, a made-up regulator at 48 V (η 0.9), its output cable, a made-up 960 W heater.
  const chain = (regulator: Json, heater: Json, feed: Json = { conductor: nec }): Json[] => [
    { id: 'bank', kind: 'battery', voltage: 52, internalResistance: 0.01 },
    { id: 'feed', kind: 'cable', from: 'bank', length: 10, ...feed },
    { id: 'reg', from: 'feed', ...regulator },
    { id: 'out', kind: 'cable', from: 'reg', length: 5, ...feed },
    { id: 'heater', from: 'out', ...heater },
  ];
  const madeUp = chain({ kind: 'test-regulator', outputVoltage: 48, efficiency: 0.9 }, { kind: 'test-heater', power: 960 });
  // The same chain with kinds of the app that share the made-up kinds' traits and model.
  const listed = chain({ kind: 'dc-dc', outputVoltage: 48, loss: constant(0.9) }, { kind: 'dc-load', power: 960 });

  it('is validated and solved: it holds its set point and draws P_out / η', () => {
    const r = solved(madeUp);
    const reg = byId(r, 'reg');
    expect(reg.output!.voltage).toBe(48); // its set point (the made-up kind's own definition)
    expect(reg.pIn).toBeCloseTo(reg.pOut / 0.9, 9); // its efficiency (its own definition)
    expect(byId(r, 'heater').pOut).toBeCloseTo(960, 9);
  });

  it('is sized like the DC-DC converter that shares its traits: the same sizes, currents and voltages', () => {
    const a = solved(madeUp);
    const b = solved(listed);
    for (const id of ['bank', 'feed', 'reg', 'out', 'heater']) {
      const x = byId(a, id);
      const y = byId(b, id);
      expect(x.output?.voltage, id).toBe(y.output?.voltage);
      expect(x.input?.current, id).toBe(y.input?.current);
      expect(x.loss, id).toBe(y.loss);
    }
    const out = byId(a, 'out').conductor!;
    expect(out.size).toBe(byId(b, 'out').conductor!.size);
    // The output cable's design current: the load at the nominal voltage of its system, which is
    // the made-up regulator's set point (its nominalOutput): 960 W / 48 V = 20 A.
    expect(out.designBasis.basis).toBe('load-nominal');
    expect(out.designCurrent).toBeCloseTo(20, 9);
    expect(out.designBasis.rule).toContain('48 V DC');
    expect(byId(a, 'feed').conductor!.size).toBe(byId(b, 'feed').conductor!.size);
  });

  it('starts the path drop to its load afresh (regulatesVoltage), and ends one at its own input', () => {
    const drops = solved(madeUp).voltageDrop!;
    expect(drops.find((d) => d.loadId === 'heater')!.startId).toBe('reg');
    expect(drops.find((d) => d.loadId === 'heater')!.links.map((l) => l.id)).toEqual(['out']);
    expect(drops.find((d) => d.loadId === 'reg')!.startId).toBe('bank');
  });

  it('is a profile load and the frontier of the battery study\'s repeated solve', () => {
    // The cables given by their impedance (the battery study takes the sized chain; invented values).
    const feed = { resistancePerKm: 3.3, reactancePerKm: 0 };
    const valid = validateProject(project(chain({ kind: 'test-regulator', outputVoltage: 48, efficiency: 0.9 }, { kind: 'test-heater', power: 960 }, feed)));
    if (!valid.ok) throw new Error(JSON.stringify(valid.problems));
    expect(profileLoads(valid.project)).toEqual([{ id: 'heater', rated: 960 }]); // its `load` trait and its own power
    const repeat = prepareRepeat(valid.project);
    if (!repeat.ok) throw new Error(JSON.stringify(repeat.problems));
    expect(repeat.solver.fast).toBe(true); // bank → cable → the regulator: only the cable is re-solved per step
    const state = repeat.solver.prepare([480]);
    if (!state.ok) throw new Error(JSON.stringify(state.problems));
    const step = repeat.solver.solve(state.state, 52, 0.01)!;
    expect(step.loadPower).toBeCloseTo(480, 9); // the level set through the `power` field
    // The same chain solved whole at that level gives the same bank power.
    const whole = solved(chain({ kind: 'test-regulator', outputVoltage: 48, efficiency: 0.9 }, { kind: 'test-heater', power: 480 }, feed));
    expect(step.terminalPower).toBeCloseTo(byId(whole, 'bank').pOut, 6);
  });

  it('without the regulatesVoltage trait the repeated solve cannot hold it as a frontier', () => {
    const unoff = registerKind(madeUpRegulator('test-unregulated', false));
    try {
      const valid = validateProject(project(chain({ kind: 'test-unregulated', outputVoltage: 48, efficiency: 0.9 }, { kind: 'test-heater', power: 960 })));
      if (!valid.ok) throw new Error(JSON.stringify(valid.problems));
      const repeat = prepareRepeat(valid.project);
      expect(repeat.ok && repeat.solver.fast).toBe(false);
    } finally {
      unoff();
    }
  });

  it('leaves the registry as it was when taken out', () => {
    off();
    const v = validateProject(project(madeUp));
    expect(v.ok).toBe(false);
    expect(!v.ok && v.problems.map((p) => p.code)).toContain('unknown-kind');
    off = registerMadeUpKinds();
  });
});
