/**
 * Loads built from circuit elements: a network of resistors, inductors and capacitors in series and
 * parallel, its impedance at a frequency, and the figures reported for it after a solve.
 *
 * Methods: element impedances Z_R = R, Z_L = jωL, Z_C = 1/(jωC) with ω = 2πf (steady-state
 * sinusoidal phasor analysis); series Z = Σ Z_k; parallel Z = 1/Σ(1/Z_k); a balanced delta of
 * branch impedance Z_Δ is replaced by the equivalent star Z_Y = Z_Δ/3 (the delta–star
 * transformation for equal branches). All arithmetic in `complex.ts`.
 */
import { type Complex, ZERO, abs, add, arg, c, div } from './complex.ts';
import { type ElementUnit, parseSiValue } from './si-prefix.ts';
import type { Project } from '../model/project.ts';
import type { SolveResult } from '../model/result.ts';

import type { CircuitNetwork, ComponentValue } from '../model/project.ts';
export type { CircuitNetwork, ComponentValue };

export type ComponentType = 'resistor' | 'inductor' | 'capacitor';

/** A network with every value read into SI units. */
export type ParsedNetwork =
  | { type: ComponentType; value: number }
  | { type: 'series' | 'parallel'; items: ParsedNetwork[] };

/** What is wrong with one entry of a network; `path` is relative to the network. */
export interface NetworkIssue {
  path: (string | number)[];
  value: unknown;
  message: string;
}

export const MAX_NETWORK_DEPTH = 32;
export const MAX_NETWORK_COMPONENTS = 1000;

const UNIT: Readonly<Record<ComponentType, ElementUnit>> = { resistor: 'Ω', inductor: 'H', capacitor: 'F' };
const KEYS = ['resistor', 'inductor', 'capacitor', 'series', 'parallel'] as const;
const SHAPE = 'must be one entry: {"resistor": …}, {"inductor": …}, {"capacitor": …}, {"series": […]} or {"parallel": […]}';

/** Why a value of zero (or below) is refused, per component. */
const NOT_POSITIVE: Readonly<Record<ComponentType, string>> = {
  resistor: 'must be greater than 0 Ω (0 Ω is a short circuit: leave the resistor out of its series branch instead)',
  inductor: 'must be greater than 0 H (0 H is a short circuit: leave the inductor out of its series branch instead)',
  capacitor: 'must be greater than 0 F (0 F is an open circuit: leave the capacitor out of its parallel branch instead)',
};

const isRecord = (v: unknown): v is Record<string, unknown> => typeof v === 'object' && v !== null && !Array.isArray(v);

/** Read and check a network; every problem is listed with its path (nothing is computed from a bad network). */
export function parseNetwork(raw: unknown): { ok: true; network: ParsedNetwork; components: number } | { ok: false; issues: NetworkIssue[] } {
  const issues: NetworkIssue[] = [];
  let components = 0;
  const visit = (node: unknown, path: (string | number)[], depth: number): ParsedNetwork | null => {
    if (!isRecord(node)) {
      issues.push({ path, value: node, message: SHAPE });
      return null;
    }
    const keys = Object.keys(node);
    const unknown = keys.filter((k) => !(KEYS as readonly string[]).includes(k));
    if (unknown.length) {
      issues.push({ path: [...path, unknown[0]!], value: node[unknown[0]!], message: `unknown entry "${unknown[0]}" (expected resistor, inductor, capacitor, series or parallel)` });
      return null;
    }
    if (keys.length !== 1) {
      issues.push({
        path,
        value: node,
        message: keys.length === 0 ? SHAPE : `holds ${keys.map((k) => `"${k}"`).join(' and ')}; give one entry per object and combine them with "series" or "parallel"`,
      });
      return null;
    }
    const key = keys[0] as (typeof KEYS)[number];
    if (key === 'series' || key === 'parallel') {
      const list = node[key];
      if (!Array.isArray(list) || list.length === 0) {
        issues.push({ path: [...path, key], value: list, message: `must be a non-empty list of entries to connect in ${key}` });
        return null;
      }
      if (depth >= MAX_NETWORK_DEPTH) {
        issues.push({ path: [...path, key], value: undefined, message: `nests deeper than ${MAX_NETWORK_DEPTH} levels` });
        return null;
      }
      const items = list.map((item, i) => visit(item, [...path, key, i], depth + 1));
      return items.every((x) => x !== null) ? { type: key, items: items as ParsedNetwork[] } : null;
    }
    components++;
    const parsed = parseSiValue(node[key], UNIT[key]);
    if (!parsed.ok) {
      issues.push({ path: [...path, key], value: node[key], message: parsed.message });
      return null;
    }
    if (!(parsed.value > 0)) {
      issues.push({ path: [...path, key], value: node[key], message: NOT_POSITIVE[key] });
      return null;
    }
    return { type: key, value: parsed.value };
  };
  const network = visit(raw, [], 0);
  if (components > MAX_NETWORK_COMPONENTS) {
    issues.push({ path: [], value: components, message: `holds ${components} components; at most ${MAX_NETWORK_COMPONENTS} are taken` });
  }
  return network && issues.length === 0 ? { ok: true, network, components } : { ok: false, issues };
}

/** Impedance of one component at angular frequency ω (rad/s): R, jωL or 1/(jωC) = −j/(ωC). */
export function componentImpedance(type: ComponentType, value: number, omega: number): Complex {
  switch (type) {
    case 'resistor':
      return c(value);
    case 'inductor':
      return c(0, omega * value);
    case 'capacitor':
      return c(0, -1 / (omega * value));
  }
}

/**
 * Impedance of a network at frequency f, Hz (f > 0). Series: Σ Z; parallel: 1/Σ(1/Z). A parallel
 * group holding a branch of exactly zero impedance (series resonance to the last bit) is zero.
 * For positive values the result is finite except at exact (to the last bit) parallel resonance,
 * where it is infinite, and zero only at exact series resonance.
 */
export function networkImpedance(network: ParsedNetwork, frequency: number): Complex {
  const omega = 2 * Math.PI * frequency;
  const z = (n: ParsedNetwork): Complex => {
    if (!('items' in n)) return componentImpedance(n.type, n.value, omega);
    if (n.type === 'series') return n.items.reduce((sum, item) => add(sum, z(item)), ZERO);
    let y = ZERO;
    for (const item of n.items) {
      const zi = z(item);
      if (zi.re === 0 && zi.im === 0) return ZERO;
      y = add(y, div(c(1), zi));
    }
    // Σ 1/Z of exactly zero: ideal parallel resonance, an open circuit (|Z| infinite; the load
    // model then draws nothing) rather than a division by zero.
    return y.re === 0 && y.im === 0 ? c(Infinity) : div(c(1), y);
  };
  return z(network);
}

/** How a network load is connected. */
export type NetworkConnection = 'single-phase' | 'star' | 'delta';

/** Impedance figures: R + jX, |Z| and its angle. */
export interface ImpedanceFigures {
  /** Resistance R, Ω. */
  r: number;
  /** Reactance X, Ω (positive inductive, negative capacitive). */
  x: number;
  /** |Z|, Ω. */
  magnitude: number;
  /** Angle of Z, degrees (positive: the current lags). */
  angleDeg: number;
}

export const impedanceFigures = (z: Complex): ImpedanceFigures => ({ r: z.re, x: z.im, magnitude: abs(z), angleDeg: (arg(z) * 180) / Math.PI });

/**
 * The per-phase star-equivalent impedance the solve uses: the network itself on single-phase and
 * in star; a third of it for a balanced delta (Z_Y = Z_Δ/3).
 */
export const starEquivalent = (z: Complex, connection: NetworkConnection): Complex => (connection === 'delta' ? div(z, c(3)) : z);

/** What a solved network load does: its impedance and its electrical figures. */
export interface NetworkLoadFigures {
  id: string;
  name: string;
  connection: NetworkConnection;
  /** Frequency of the interface, Hz. */
  frequency: number;
  /** Components in the network. */
  components: number;
  /** Impedance of the network as entered: across the supply (1φ), one star phase, or one delta branch. */
  impedance: ImpedanceFigures;
  /** Per-phase star-equivalent impedance (equal to `impedance` except in delta, where it is a third). */
  starEquivalent: ImpedanceFigures;
  /** Voltage across the network, V: the supply (1φ), phase-to-neutral (star) or line-to-line (delta). */
  networkVoltage: number;
  /** Current through the network, A: the line current (1φ, star) or the branch current, line/√3 (delta). */
  networkCurrent: number;
  /** Line current, A. */
  lineCurrent: number;
  /** Total real power, W; reactive power, var (positive lagging); apparent power, VA. */
  p: number;
  q: number;
  s: number;
  powerFactor: number;
  pfSense: 'lagging' | 'leading' | 'unity';
}

/**
 * The figures of every network load of a solved project (the solve's ports give V, I, P, Q, S and
 * pf; the impedance is worked here from the network at the interface frequency).
 */
export function describeNetworkLoads(project: Project, result: SolveResult): NetworkLoadFigures[] {
  const out: NetworkLoadFigures[] = [];
  for (const e of project.elements) {
    if (e.kind !== 'network-load') continue;
    const solved = result.elements.find((r) => r.id === e.id);
    const port = solved?.input;
    const parsed = parseNetwork(e.network);
    if (!solved || !port || port.frequency === undefined || !parsed.ok) continue;
    const connection: NetworkConnection = port.kind === 'ac3' ? (e.connection ?? 'star') : 'single-phase';
    const z = networkImpedance(parsed.network, port.frequency);
    const phaseVoltage = port.kind === 'ac3' ? port.voltage / Math.sqrt(3) : port.voltage;
    out.push({
      id: e.id,
      name: solved.name,
      connection,
      frequency: port.frequency,
      components: parsed.components,
      impedance: impedanceFigures(z),
      starEquivalent: impedanceFigures(starEquivalent(z, connection)),
      networkVoltage: connection === 'delta' ? port.voltage : phaseVoltage,
      networkCurrent: connection === 'delta' ? port.current / Math.sqrt(3) : port.current,
      lineCurrent: port.current,
      p: port.p,
      q: port.q,
      s: port.s,
      powerFactor: port.powerFactor,
      pfSense: port.pfSense,
    });
  }
  return out;
}
