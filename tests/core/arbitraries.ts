/**
 * Shared fast-check generators: random VALID power-chain projects built from every element kind.
 *
 * A tree is grown top-down from a source of a random kind; each child is drawn from the kinds that
 * accept the feeding port (DC → dc-dc/dc-bus/inverter/cable/generic/transfer-switch/dc-load/dc-current-load; AC →
 * rectifier/transformer/drive/motor/cable/generic/transfer-switch/ac-load/ac-va-load/ac-current-load; shaft →
 * shaft-load). Series links are
 * then SIZED bottom-up from an estimate of the apparent power they carry, the way a designer sizes
 * them: each cable, source impedance and transformer gets a modest voltage drop (a few per cent),
 * so the constant-power loads stay well away from voltage collapse (a few runs may still be
 * infeasible; the tests accept that and say so).
 *
 * Converter loss curves are made from a physical per-unit loss polynomial
 * (p0 + k1·x + k2·x², x = P/P_rated: no-load, linear and resistive terms; common practice, no source),
 * so datasheet-like curves rise steeply at light load and droop slightly near full load.
 */
import { scaledLoad } from '../../core/studies/spread/sample.ts';
import fc from 'fast-check';
import type { Element, LossModel, PortKind, Project } from '../../core/model/project.ts';
import { abs } from '../../core/physics/complex.ts';
import { type CircuitNetwork, networkImpedance, parseNetwork, starEquivalent } from '../../core/physics/network.ts';
import { formatSi } from '../../core/physics/si-prefix.ts';
import { RANGES } from '../../core/kinds/ranges.ts';

type Json = Record<string, unknown>;

/** A port as the generator tracks it: kind and nominal voltage (line-to-line on three-phase). */
interface GenPort {
  kind: PortKind;
  voltage: number;
  frequency?: number;
}

/** Per-unit physical loss: P_loss/P_rated = p0 + k1·x + k2·x² at x = P_out/P_rated. */
interface PuLoss {
  p0: number;
  k1: number;
  k2: number;
}

type LossSpec =
  | { model: 'constant'; efficiency: number; idlePu: number | null; withRated: boolean }
  | { model: 'curve'; pu: PuLoss; fractions: number[]; idlePu: number | null }
  | { model: 'polynomial'; pu: PuLoss; withRated: boolean }
  | { model: 'polynomial-fit'; pu: PuLoss; fractions: number[] };

type Sizing =
  | { type: 'cable'; drop: number; xr: number; length: number; sets: number | null }
  | { type: 'transformer'; loadFraction: number; rPct: number; zOverR: number | null; noLoadPu: number }
  | { type: 'converter'; loadFraction: number; loss: LossSpec; inputPf: number | null }
  | { type: 'motor'; loadFraction: number; loss: LossSpec; pf: { constant: number } | { rated: number; a: number }; nameplate?: { efficiency: number; pf: number } | null }
  /** A drive with IEC 61800-9-2 point losses (per-unit of its rating; null = the IE2 defaults). */
  | { type: 'standard-drive'; loadFraction: number; inputPf: number | null; thd: number | null; pointsPu: number[] | null }
  | { type: 'dc-bus'; fixedLoss: number }
  /** A transfer switch: its contact drop as a share of the voltage (like a cable's) and its control power, W. */
  | { type: 'switch'; drop: number; controlPower: number }
  | { type: 'load' }
  | { type: 'network'; s: number; net: CircuitNetwork; asText: boolean }
  | { type: 'source'; drop: number; xr: number; ratedLoadFraction: number | null };

/** A generated node before sizing: the element's fixed fields, its sizing choices, its children. */
export interface GenNode {
  fields: Json;
  sizing: Sizing;
  /** The port feeding this node (absent on the source). */
  input?: GenPort;
  /** The port this node presents to its children (null for loads). */
  output: GenPort | null;
  children: GenNode[];
}

/** How deep below the source stages may appear; below this only loads are drawn. */
const MAX_DEPTH = 4;

const logUniform = (lo: number, hi: number): fc.Arbitrary<number> =>
  fc.double({ min: Math.log(lo), max: Math.log(hi), noNaN: true }).map((v) => Math.exp(v));
const uniform = (lo: number, hi: number): fc.Arbitrary<number> => fc.double({ min: lo, max: hi, noNaN: true });

const puLoss: fc.Arbitrary<PuLoss> = fc.record({
  p0: uniform(0.002, 0.02),
  k1: uniform(0, 0.03),
  k2: uniform(0, 0.04),
});

/** Datasheet-style load fractions (a random subset, at least `min` of them). */
const fractions = (min: number): fc.Arbitrary<number[]> =>
  fc.subarray([0.05, 0.1, 0.2, 0.25, 0.3, 0.5, 0.75, 1.0, 1.1], { minLength: min }).chain((xs) => fc.shuffledSubarray(xs, { minLength: xs.length, maxLength: xs.length }));

const lossSpec: fc.Arbitrary<LossSpec> = fc.oneof(
  fc.record({
    model: fc.constant('constant' as const),
    efficiency: uniform(0.85, 0.995),
    idlePu: fc.option(uniform(0, 0.01), { nil: null }),
    withRated: fc.boolean(),
  }),
  fc.record({ model: fc.constant('curve' as const), pu: puLoss, fractions: fractions(2), idlePu: fc.option(uniform(0, 0.005), { nil: null }) }),
  fc.record({ model: fc.constant('polynomial' as const), pu: puLoss, withRated: fc.boolean() }),
  fc.record({ model: fc.constant('polynomial-fit' as const), pu: puLoss, fractions: fractions(3) }),
);

/** Efficiency of the per-unit physical loss at load fraction x. */
export const puEfficiency = (pu: PuLoss, x: number): number => x / (x + pu.p0 + pu.k1 * x + pu.k2 * x * x);

function buildLoss(spec: LossSpec, rated: number): LossModel {
  switch (spec.model) {
    case 'constant':
      return {
        model: 'constant',
        efficiency: spec.efficiency,
        ...(spec.idlePu !== null ? { idleLoss: spec.idlePu * rated } : {}),
        ...(spec.withRated ? { ratedPower: rated } : {}),
      };
    case 'curve':
      return {
        model: 'curve',
        ratedPower: rated,
        points: spec.fractions.map((x) => ({ loadFraction: x, efficiency: puEfficiency(spec.pu, x) })),
        ...(spec.idlePu !== null ? { idleLoss: spec.idlePu * rated } : {}),
      };
    case 'polynomial':
      return {
        model: 'polynomial',
        p0: spec.pu.p0 * rated,
        k1: spec.pu.k1,
        k2: spec.pu.k2 / rated,
        ...(spec.withRated ? { ratedPower: rated } : {}),
      };
    case 'polynomial-fit':
      return {
        model: 'polynomial-fit',
        ratedPower: rated,
        points: spec.fractions.map((x) => ({ loadFraction: x, efficiency: puEfficiency(spec.pu, x) })),
      };
  }
}

/** A rough, deliberately pessimistic input power of a converter (for sizing only). */
function lossEstimate(spec: LossSpec, pOut: number, rated: number): number {
  const x = pOut / rated;
  switch (spec.model) {
    case 'constant':
      return pOut * (1 / spec.efficiency - 1) + (spec.idlePu ?? 0) * rated;
    default:
      return rated * (spec.pu.p0 + spec.pu.k1 * x + spec.pu.k2 * x * x) * 1.5 + pOut * 0.05;
  }
}

const pfSense = fc.option(fc.constantFrom('lagging' as const, 'leading' as const), { nil: undefined });
const optionalName = fc.option(fc.constantFrom('Board A', 'Pump', 'Feeder', 'Spare way'), { nil: undefined });
const withOpt = (o: Json): Json => Object.fromEntries(Object.entries(o).filter(([, v]) => v !== undefined));

const dcVoltage = fc.constantFrom(12, 24, 48, 54, 110, 380, 800);
const ac1Voltage = fc.constantFrom(120, 230, 240);
const ac3Voltage = fc.constantFrom(208, 400, 480, 690);
const frequency = fc.constantFrom(50, 60);

const node = (fields: Json, sizing: Sizing, output: GenPort | null, children: GenNode[]): GenNode => ({ fields, sizing, output, children });

/** Optional kinds the generator may draw (off in `projectArb`, whose tests expect constant-power loads). */
export interface GenOptions {
  /** Loads from circuit elements (constant impedance) on AC ports. */
  networkLoads?: boolean;
  /** Transfer switches (core/kinds/transfer-switch.ts) among the stages, on every electrical port. */
  transferSwitches?: boolean;
}
const DEFAULT_GEN: GenOptions = {};

/** A random R/L/C network of up to three levels, values of order one (scaled to a power when sized). */
export const circuitNetworkArb: fc.Arbitrary<CircuitNetwork> = fc.letrec<{ net: CircuitNetwork }>((tie) => ({
  net: fc.oneof(
    { maxDepth: 3, withCrossShrink: true },
    fc.record({ resistor: logUniform(0.1, 100) }),
    fc.record({ inductor: logUniform(1e-4, 0.1) }),
    fc.record({ capacitor: logUniform(1e-6, 1e-3) }),
    fc.record({ series: fc.array(tie('net'), { minLength: 1, maxLength: 3 }) }),
    fc.record({ parallel: fc.array(tie('net'), { minLength: 1, maxLength: 3 }) }),
  ),
})).net;

/** A network load of random shape, later scaled to draw `s` VA at the port's nominal voltage. */
const networkLoadArb = (port: GenPort): fc.Arbitrary<GenNode> =>
  fc
    .record({
      s: logUniform(5, 40_000),
      net: circuitNetworkArb,
      asText: fc.boolean(),
      connection: port.kind === 'ac3' ? fc.constantFrom('star' as const, 'delta' as const, undefined) : fc.constant(undefined),
      name: optionalName,
    })
    .map(({ s, net, asText, connection, name }) => node(withOpt({ kind: 'network-load', connection, name }), { type: 'network', s, net, asText }, null, []));

/**
 * Scale every impedance of the network by k (R·k, L·k, C/k) so that it draws |S| = s at the port's
 * nominal voltage: |S| = m·V_phase²/|Z_phase|. Values are written as numbers or as SI-prefixed text.
 */
function sizedNetwork(sz: { s: number; net: CircuitNetwork; asText: boolean }, port: GenPort, threePhase: 'star' | 'delta'): CircuitNetwork {
  const parsed = parseNetwork(sz.net);
  if (!parsed.ok) throw new Error('generated network does not read');
  const connection = port.kind === 'ac3' ? threePhase : 'single-phase';
  const zPhase = abs(starEquivalent(networkImpedance(parsed.network, port.frequency ?? 50), connection));
  const m = port.kind === 'ac3' ? 3 : 1;
  const vPhase = port.kind === 'ac3' ? port.voltage / Math.sqrt(3) : port.voltage;
  const k = (m * vPhase * vPhase) / (sz.s * zPhase);
  const write = (v: number, unit: string): number | string => (sz.asText ? formatSi(v, unit, 6) : v);
  const scale = (n: CircuitNetwork): CircuitNetwork => {
    if ('resistor' in n) return { resistor: write(Number(n.resistor) * k, 'Ω') };
    if ('inductor' in n) return { inductor: write(Number(n.inductor) * k, 'H') };
    if ('capacitor' in n) return { capacitor: write(Number(n.capacitor) / k, 'F') };
    if ('series' in n) return { series: n.series.map(scale) };
    return { parallel: n.parallel.map(scale) };
  };
  return scale(sz.net);
}

/** Children of a port: 1–3 subtrees (shaft: 1–2 shaft loads). */
function childrenOf(port: GenPort, depth: number, opts: GenOptions = DEFAULT_GEN): fc.Arbitrary<GenNode[]> {
  return fc.array(nodeArb(port, depth, opts), { minLength: 1, maxLength: port.kind === 'shaft' ? 2 : 3 });
}

const loadPower = fc.oneof({ weight: 1, arbitrary: fc.constant(0) }, { weight: 12, arbitrary: logUniform(5, 40_000) });

/** A random element (and subtree) fed from `port`, at `depth` below the source. */
export function nodeArb(port: GenPort, depth: number, opts: GenOptions = DEFAULT_GEN): fc.Arbitrary<GenNode> {
  const load = { type: 'load' as const };
  const loads: fc.Arbitrary<GenNode>[] = [];
  const stages: fc.Arbitrary<GenNode>[] = [];
  const converterSizing = (inputAc: boolean): fc.Arbitrary<Sizing> =>
    fc.record({
      type: fc.constant('converter' as const),
      loadFraction: uniform(0.1, 1.2),
      loss: lossSpec,
      inputPf: inputAc ? fc.option(uniform(0.8, 1), { nil: null }) : fc.constant(null),
    });
  const cable = fc
    .record({
      name: optionalName,
      sizing: fc.record({
        type: fc.constant('cable' as const),
        drop: uniform(0.001, 0.03),
        xr: port.kind === 'dc' ? fc.constant(0) : uniform(0, 1),
        length: uniform(1, 300),
        sets: fc.option(fc.integer({ min: 1, max: 4 }), { nil: null }),
      }),
    })
    .chain(({ name, sizing }) => childrenOf(port, depth + 1, opts).map((ch) => node(withOpt({ kind: 'cable', name }), sizing, { ...port }, ch)));
  // A transfer switch passes its port on: contact resistance for a small drop, a control power of a few watts.
  const transferSwitch = fc
    .record({ name: optionalName, sizing: fc.record({ type: fc.constant('switch' as const), drop: uniform(0, 0.005), controlPower: uniform(0, 40) }) })
    .chain(({ name, sizing }) => childrenOf(port, depth + 1, opts).map((ch) => node(withOpt({ kind: 'transfer-switch', name }), sizing, { ...port }, ch)));
  const generic = fc
    .record({
      outputKind: fc.constantFrom('dc' as const, 'ac1' as const, 'ac3' as const),
      dcV: dcVoltage,
      ac1V: ac1Voltage,
      ac3V: ac3Voltage,
      f: frequency,
      sense: pfSense,
      sizing: converterSizing(port.kind !== 'dc'),
    })
    .chain(({ outputKind, dcV, ac1V, ac3V, f, sense, sizing }) => {
      const v = outputKind === 'dc' ? dcV : outputKind === 'ac1' ? ac1V : ac3V;
      const out: GenPort = outputKind === 'dc' ? { kind: 'dc', voltage: v } : { kind: outputKind, voltage: v, frequency: f };
      const fields = withOpt({
        kind: 'generic',
        inputKind: port.kind,
        outputKind,
        outputVoltage: v,
        outputFrequency: outputKind === 'dc' ? undefined : f,
        inputPfSense: port.kind === 'dc' ? undefined : sense,
      });
      return childrenOf(out, depth + 1, opts).map((ch) => node(fields, sizing, out, ch));
    });

  if (port.kind === 'shaft') {
    return fc.record({ power: loadPower, name: optionalName }).map(({ power, name }) => node(withOpt({ kind: 'shaft-load', power, name }), load, null, []));
  }
  if (port.kind === 'dc') {
    loads.push(fc.record({ power: loadPower, name: optionalName }).map(({ power, name }) => node(withOpt({ kind: 'dc-load', power, name }), load, null, [])));
    // A load given by its current: the current that draws about the same power at the nominal voltage.
    loads.push(fc.record({ power: loadPower, name: optionalName }).map(({ power, name }) => node(withOpt({ kind: 'dc-current-load', current: power / port.voltage, name }), load, null, [])));
    stages.push(
      fc.record({ v: dcVoltage, sizing: converterSizing(false) }).chain(({ v, sizing }) => {
        const out: GenPort = { kind: 'dc', voltage: v };
        return childrenOf(out, depth + 1, opts).map((ch) => node({ kind: 'dc-dc', outputVoltage: v }, sizing, out, ch));
      }),
      fc.record({ fixedLoss: uniform(0, 50) }).chain(({ fixedLoss }) =>
        childrenOf(port, depth + 1, opts).map((ch) => node({ kind: 'dc-bus' }, { type: 'dc-bus', fixedLoss }, { ...port }, ch)),
      ),
      fc.record({ phases: fc.constantFrom(1 as const, 3 as const), v1: ac1Voltage, v3: ac3Voltage, f: frequency, sizing: converterSizing(false) }).chain(({ phases, v1, v3, f, sizing }) => {
        const out: GenPort = { kind: phases === 3 ? 'ac3' : 'ac1', voltage: phases === 3 ? v3 : v1, frequency: f };
        return childrenOf(out, depth + 1, opts).map((ch) => node({ kind: 'inverter', phases, outputVoltage: out.voltage, frequency: f }, sizing, out, ch));
      }),
      cable,
      generic,
      ...(opts.transferSwitches ? [transferSwitch] : []),
    );
  } else {
    const acLoad = fc
      .record({ power: loadPower, pf: uniform(0.6, 1), sense: pfSense, name: optionalName })
      .map(({ power, pf, sense, name }) => node(withOpt({ kind: 'ac-load', power, powerFactor: pf, pfSense: sense, name }), load, null, []));
    const acVaLoad = fc
      .record({ s: loadPower, pf: uniform(0.6, 1), sense: pfSense })
      .map(({ s, pf, sense }) => node(withOpt({ kind: 'ac-va-load', apparentPower: s, powerFactor: pf, pfSense: sense }), load, null, []));
    // S = V·I (1φ) or √3·V_LL·I (3φ) at the nominal voltage sets a current of about the same demand.
    const lineCurrent = (s: number) => s / (port.kind === 'ac3' ? Math.sqrt(3) * port.voltage : port.voltage);
    const acCurrentLoad = fc
      .record({ s: loadPower, pf: uniform(0.6, 1), sense: pfSense, name: optionalName })
      .map(({ s, pf, sense, name }) => node(withOpt({ kind: 'ac-current-load', current: lineCurrent(s), powerFactor: pf, pfSense: sense, name }), load, null, []));
    loads.push(acLoad, acVaLoad, acCurrentLoad);
    if (opts.networkLoads) loads.push(networkLoadArb(port));
    stages.push(
      fc.record({ v: dcVoltage, sense: pfSense, sizing: converterSizing(true) }).chain(({ v, sense, sizing }) => {
        const out: GenPort = { kind: 'dc', voltage: v };
        return childrenOf(out, depth + 1, opts).map((ch) => node(withOpt({ kind: 'rectifier', outputVoltage: v, inputPfSense: sense }), sizing, out, ch));
      }),
      fc
        .record({
          v: port.kind === 'ac3' ? fc.constantFrom(208, 400, 415, 480, 690, 11_000) : fc.constantFrom(110, 120, 230, 240),
          sizing: fc.record({
            type: fc.constant('transformer' as const),
            loadFraction: uniform(0.2, 1.1),
            rPct: uniform(0.5, 3),
            zOverR: fc.option(uniform(1.05, 4), { nil: null }), // Z% > R% (impedance triangle)
            noLoadPu: uniform(0.001, 0.01),
          }),
        })
        .chain(({ v, sizing }) => {
          const out: GenPort = { kind: port.kind, voltage: v, ...(port.frequency !== undefined ? { frequency: port.frequency } : {}) };
          return childrenOf(out, depth + 1, opts).map((ch) => node({ kind: 'transformer', primaryVoltage: port.voltage, secondaryVoltage: v }, sizing, out, ch));
        }),
      fc.record({ v: ac3Voltage, f: uniform(10, 70), sizing: converterSizing(true) }).chain(({ v, f, sizing }) => {
        const out: GenPort = { kind: 'ac3', voltage: v, frequency: f };
        return childrenOf(out, depth + 1, opts).map((ch) => node({ kind: 'drive', outputVoltage: v, outputFrequency: f }, sizing, out, ch));
      }),
      fc
        .record({
          v: ac3Voltage,
          f: uniform(10, 70),
          sizing: fc.record({
            type: fc.constant('standard-drive' as const),
            loadFraction: uniform(0.1, 1.2),
            inputPf: fc.option(uniform(0.8, 1), { nil: null }),
            thd: fc.option(uniform(0, 1.2), { nil: null }),
            pointsPu: fc.option(fc.array(uniform(0.002, 0.04), { minLength: 8, maxLength: 8 }), { nil: null }),
          }),
        })
        .chain(({ v, f, sizing }) => {
          const out: GenPort = { kind: 'ac3', voltage: v, frequency: f };
          return childrenOf(out, depth + 1, opts).map((ch) => node({ kind: 'drive', outputVoltage: v, outputFrequency: f }, sizing, out, ch));
        }),
      fc
        .record({
          speed: fc.option(fc.constantFrom(960, 1450, 1780, 2900), { nil: undefined }),
          sizing: fc.record({
            type: fc.constant('motor' as const),
            loadFraction: uniform(0.3, 1.1),
            loss: lossSpec,
            pf: fc.oneof(fc.record({ constant: uniform(0.75, 0.92) }), fc.record({ rated: uniform(0.8, 0.9), a: uniform(0.05, 0.3) })),
            nameplate: fc.option(fc.record({ efficiency: uniform(0.8, 0.96), pf: uniform(0.75, 0.9) }), { nil: null }),
          }),
        })
        .chain(({ speed, sizing }) => {
          const out: GenPort = { kind: 'shaft', voltage: 0 };
          return childrenOf(out, depth + 1, opts).map((ch) => node(withOpt({ kind: 'motor', ratedSpeed: speed }), sizing, out, ch));
        }),
      cable,
      generic,
      ...(opts.transferSwitches ? [transferSwitch] : []),
    );
  }
  if (depth >= MAX_DEPTH) return fc.oneof(...loads);
  // Loads get likelier with depth, so trees stay a readable size.
  return fc.oneof(
    ...loads.map((arbitrary) => ({ weight: 2 + depth * 3, arbitrary })),
    ...stages.map((arbitrary) => ({ weight: 2, arbitrary })),
  );
}

/** A source of a random kind with its subtree (`opts`: which optional kinds to draw as well). */
export const sourceArbWith = (opts: GenOptions): fc.Arbitrary<GenNode> => fc
  .record({
    kind: fc.constantFrom('grid' as const, 'generator' as const, 'battery' as const),
    phases: fc.constantFrom(1 as const, 3 as const),
    v1: ac1Voltage,
    v3: ac3Voltage,
    vb: fc.constantFrom(12, 24, 48, 51.2, 400, 800),
    f: frequency,
    sizing: fc.record({
      type: fc.constant('source' as const),
      drop: fc.oneof(fc.constant(0), uniform(0, 0.03)),
      xr: uniform(0, 5),
      ratedLoadFraction: fc.option(uniform(0.3, 1.2), { nil: null }),
    }),
  })
  .chain(({ kind, phases, v1, v3, vb, f, sizing }) => {
    const out: GenPort =
      kind === 'battery' ? { kind: 'dc', voltage: vb } : { kind: phases === 3 ? 'ac3' : 'ac1', voltage: phases === 3 ? v3 : v1, frequency: f };
    const fields: Json = kind === 'battery' ? { kind, voltage: vb } : { kind, phases, voltage: out.voltage, frequency: f };
    return childrenOf(out, 1, opts).map((ch) => node(fields, sizing, out, ch));
  });

export const sourceArb: fc.Arbitrary<GenNode> = sourceArbWith(DEFAULT_GEN);

/** Series resistance for a drop fraction at an apparent power: per phase on 3φ, loop on DC/1φ. */
const resistanceFor = (drop: number, voltage: number, s: number): number => (drop * voltage * voltage) / s;

/** Turn a generated tree into elements (ids e1, e2, … in depth-first order), sizing as it goes. */
export function toProject(root: GenNode, name = 'Random chain'): Project {
  const elements: Element[] = [];
  let counter = 0;
  // Returns the estimated apparent power drawn at the node's input, VA.
  const visit = (n: GenNode, from: string | undefined, input: GenPort | undefined): number => {
    const id = `e${++counter}`;
    const el: Json = { id, ...(from !== undefined ? { from } : {}), ...n.fields };
    elements.push(el as unknown as Element);
    let sum = 0;
    for (const ch of n.children) sum += visit(ch, id, n.output!);
    const sOut = Math.max(sum, 1);
    const sz = n.sizing;
    switch (sz.type) {
      case 'network':
        el['network'] = sizedNetwork(sz, input!, el['connection'] === 'delta' ? 'delta' : 'star');
        return sz.s;
      case 'load':
        if (el['kind'] === 'ac-load') return (el['power'] as number) / (el['powerFactor'] as number);
        if (el['kind'] === 'ac-va-load') return el['apparentPower'] as number;
        // A load given by its current: its apparent power at the nominal voltage of its port.
        if (el['kind'] === 'dc-current-load') return (el['current'] as number) * input!.voltage;
        if (el['kind'] === 'ac-current-load') return (el['current'] as number) * input!.voltage * (input!.kind === 'ac3' ? Math.sqrt(3) : 1);
        return el['power'] as number;
      case 'dc-bus':
        el['fixedLoss'] = sz.fixedLoss;
        return sum + sz.fixedLoss;
      case 'switch': {
        // Per pole: the loop's two poles on DC and single-phase, one per phase on three-phase (core/kinds/transfer-switch.ts),
        // drawn at the plausible bound when the drop would ask for more (core/kinds/ranges.ts).
        const r = resistanceFor(sz.drop, input!.voltage, sOut);
        el['contactResistance'] = Math.min(input!.kind === 'ac3' ? r : r / 2, RANGES.contactResistance.max);
        el['controlPower'] = sz.controlPower;
        return sum * (1 + 2 * sz.drop) + sz.controlPower;
      }
      case 'cable': {
        const port = input!;
        const r = resistanceFor(sz.drop, port.voltage, sOut);
        const perKmOf = (ohms: number) => (port.kind === 'ac3' ? ohms / (sz.length / 1000) : ohms / ((2 * sz.length) / 1000)) * (sz.sets ?? 1);
        el['length'] = sz.length;
        // A few watts at 11 kV would "need" hundreds of MΩ/km for a few per cent of drop: such runs
        // are drawn at the plausible bound instead (core/kinds/ranges.ts), which only lowers the drop.
        el['resistancePerKm'] = Math.min(perKmOf(r), RANGES.resistancePerKm.max);
        if (port.kind !== 'dc' && sz.xr > 0) el['reactancePerKm'] = Math.min(perKmOf(r * sz.xr), RANGES.reactancePerKm.max);
        if (sz.sets !== null) el['parallelSets'] = sz.sets;
        return sum * (1 + 2 * sz.drop);
      }
      case 'transformer': {
        const rated = sOut / sz.loadFraction;
        el['ratedApparentPower'] = rated;
        el['noLoadLoss'] = sz.noLoadPu * rated;
        el['loadLoss'] = (sz.rPct / 100) * rated;
        if (sz.zOverR !== null) el['impedancePercent'] = sz.rPct * sz.zOverR;
        return sum * (1 + (sz.rPct * (sz.zOverR ?? 1)) / 50) + sz.noLoadPu * rated;
      }
      case 'converter': {
        const rated = sOut / sz.loadFraction;
        el['loss'] = buildLoss(sz.loss, rated);
        if (sz.inputPf !== null) el['inputPowerFactor'] = sz.inputPf;
        else if (el['kind'] === 'rectifier' || el['kind'] === 'drive') el['inputPowerFactor'] = 0.95;
        return (sum + lossEstimate(sz.loss, sum, rated)) / (sz.inputPf ?? 0.95);
      }
      case 'standard-drive': {
        const rated = sOut / sz.loadFraction;
        el['standardLoss'] = { ratedApparentPower: rated, basis: 'cdm', ...(sz.pointsPu ? { points: sz.pointsPu.map((pu) => pu * rated) } : {}) };
        el['inputPowerFactor'] = sz.inputPf ?? 0.95;
        if (sz.thd !== null) el['currentThd'] = sz.thd;
        return (sum + 0.04 * rated) / (sz.inputPf ?? 0.95);
      }
      case 'motor': {
        const rated = sOut / sz.loadFraction;
        el['ratedOutput'] = rated;
        // Loads above rated need a service factor, else the solve refuses them (1.15: a common NEMA value).
        if (sz.loadFraction > 1) el['serviceFactor'] = 1.15;
        if (sz.nameplate) {
          // Preset path: nameplate full-load values with the common-practice part-load shape (lowest ratios 0.945, 0.55).
          el['nameplate'] = { efficiency: sz.nameplate.efficiency, powerFactor: sz.nameplate.pf };
          return sum / (sz.nameplate.efficiency * 0.945) / (sz.nameplate.pf * 0.55);
        }
        el['loss'] = buildLoss(sz.loss, rated);
        let pfMin: number;
        if ('constant' in sz.pf) {
          el['powerFactor'] = { model: 'constant', powerFactor: sz.pf.constant };
          pfMin = sz.pf.constant;
        } else {
          const { rated: pfR, a } = sz.pf;
          const points = [0.25, 0.5, 0.75, 1.0].map((x) => ({ loadFraction: x, powerFactor: (pfR * x * (1 + a)) / (x + a) }));
          el['powerFactor'] = { model: 'curve', points };
          pfMin = points[0]!.powerFactor;
        }
        return (sum + lossEstimate(sz.loss, sum, rated)) / pfMin;
      }
      case 'source': {
        const port = n.output!;
        const r = resistanceFor(sz.drop, port.voltage, sOut) / Math.sqrt(1 + sz.xr * sz.xr);
        // A source's R or X under 1 pΩ is refused (core/kinds/spec.ts sourceOhms): such a drop
        // (fast-check reaches subnormal doubles) is an ideal source instead.
        const ohms = (v: number) => v >= 1e-12;
        if (el['kind'] === 'battery') {
          if (sz.drop > 0 && ohms(r)) el['internalResistance'] = r;
        } else {
          if (sz.drop > 0 && ohms(r)) {
            el['resistance'] = r;
            if (ohms(r * sz.xr)) el['reactance'] = r * sz.xr;
          }
          if (sz.ratedLoadFraction !== null) el['ratedApparentPower'] = sOut / sz.ratedLoadFraction;
        }
        return sum;
      }
    }
  };
  visit(root, undefined, undefined);
  return { format: 'joulepath-project', version: 2, name, elements };
}

/** Random valid projects. */
export const projectArb: fc.Arbitrary<Project> = sourceArb.map((root) => toProject(root));

/** Random valid projects that also hold loads from circuit elements (network-load). */
export const projectWithNetworksArb: fc.Arbitrary<Project> = sourceArbWith({ networkLoads: true }).map((root) => toProject(root));

/** Random valid projects whose stages may also be transfer switches. */
export const projectWithSwitchesArb: fc.Arbitrary<Project> = sourceArbWith({ transferSwitches: true }).map((root) => toProject(root));

/** Scale every load's demand (power, apparent power or current) by `factor` (the spread's own scaling). Returns a new project. */
export function scaleLoads(project: Project, factor: number): Project {
  return { ...project, elements: project.elements.map((e) => scaledLoad(e, factor) ?? e) };
}

/** Recursively freeze plain data (so any mutation by the code under test throws in strict mode). */
export function deepFreeze<T>(value: T): T {
  if (typeof value === 'object' && value !== null && !Object.isFrozen(value)) {
    Object.freeze(value);
    for (const v of Object.values(value as object)) deepFreeze(v);
  }
  return value;
}
