/**
 * Step 4 of the solve: turn the operating point into the plain result (ports, per-element
 * powers, totals, balance check, warnings).
 */
import { type Complex, abs, conj, div, scale } from '../physics/complex.ts';
import type { PortKind } from '../model/project.ts';
import type { Problem } from '../model/errors.ts';
import type { ElementResult, PortResult, SolveResult, SolveWarning } from '../model/result.ts';
import type { PortInfo } from '../kinds/index.ts';
import { phaseCount } from '../kinds/spec.ts';
import type { PlannedElement } from './plan.ts';
import { TOLERANCE, type OperatingPoint } from './sweep.ts';
import { idleDraw, idlePart } from './idle.ts';

/** Q within this fraction of S counts as unity power factor. */
const UNITY_BAND = 1e-9;

/** V, I, P, Q, S, pf and phasors at a port carrying total power s at per-phase voltage v. */
export function portResult(port: PortInfo, v: Complex, s: Complex): PortResult {
  const kind: PortKind = port.kind;
  // (Literals with and without the optional field rather than a spread: the same fields in the same order.)
  if (kind === 'shaft') {
    return port.speed !== undefined
      ? { kind, voltage: 0, current: 0, p: s.re, q: 0, s: Math.abs(s.re), powerFactor: 1, pfSense: 'unity', speed: port.speed }
      : { kind, voltage: 0, current: 0, p: s.re, q: 0, s: Math.abs(s.re), powerFactor: 1, pfSense: 'unity' };
  }
  const vPhase = abs(v);
  if (kind === 'dc') {
    return { kind, voltage: vPhase, current: vPhase > 0 ? s.re / vPhase : 0, p: s.re, q: 0, s: Math.abs(s.re), powerFactor: 1, pfSense: 'unity' };
  }
  const m = phaseCount(kind);
  const sMag = abs(s);
  const iPhasor = vPhase > 0 ? conj(div(scale(s, 1 / m), v)) : { re: 0, im: 0 };
  const voltage = kind === 'ac3' ? vPhase * Math.sqrt(3) : vPhase;
  const current = abs(iPhasor);
  const powerFactor = sMag > 0 ? Math.abs(s.re) / sMag : 1;
  const pfSense = Math.abs(s.im) <= UNITY_BAND * sMag ? 'unity' : s.im > 0 ? 'lagging' : 'leading';
  const phasor = { voltage: { re: v.re, im: v.im }, current: { re: iPhasor.re, im: iPhasor.im } };
  return port.frequency !== undefined
    ? { kind, voltage, frequency: port.frequency, current, p: s.re, q: s.im, s: sMag, powerFactor, pfSense, phasor }
    : { kind, voltage, current, p: s.re, q: s.im, s: sMag, powerFactor, pfSense, phasor };
}

/** The elements node `i` feeds, looked through pass-through stages (cables, buses) to what they feed. */
function fedThrough(order: readonly PlannedElement[], i: number): PlannedElement['element'][] {
  // An explicit stack, not recursion: a chain may hold thousands of cables in a row.
  const out: PlannedElement['element'][] = [];
  const stack = [...order[i]!.children].reverse();
  while (stack.length) {
    const k = stack.pop()!;
    if (order[k]!.spec.passive) stack.push(...[...order[k]!.children].reverse());
    else out.push(order[k]!.element);
  }
  return out;
}

export function buildResult(
  projectName: string,
  order: readonly PlannedElement[],
  point: OperatingPoint,
): { ok: true; result: SolveResult } | { ok: false; problems: Problem[] } {
  const { vOut, sIn, sOut } = point;
  const warnings: SolveWarning[] = [];
  const problems: Problem[] = [];
  const elements: ElementResult[] = order.map((node, i) => {
    const e = node.element;
    const role = node.role;
    const parent = node.parent;
    const pIn = sIn[i]!.re;
    const pOut = role === 'load' ? pIn : sOut[i]!.re;
    const loss = pIn - pOut;
    if (loss < -1e-9 * Math.max(Math.abs(pIn), 1)) {
      problems.push({ code: 'invalid-value', elementId: e.id, field: 'loss', value: loss, message: 'the loss model gives a negative loss (efficiency above 100 %) at this operating point' });
    }
    const vIn = parent < 0 ? vOut[i]! : vOut[parent]!;
    const rep = node.model.report(sOut[i]!, sIn[i]!, vIn);
    // (Index loops, and the lists read only when there are any: this runs for every element of every solve.)
    const own = rep.warnings;
    for (let k = 0; k < own.length; k++) warnings.push({ ...own[k]!, elementId: e.id });
    if (node.spec.fedWarnings !== undefined) for (const w of node.spec.fedWarnings(e, fedThrough(order, i))) warnings.push({ ...w, elementId: e.id });
    if (rep.problems !== undefined) for (const p of rep.problems) problems.push({ ...p, elementId: e.id });
    const children = node.children;
    const feeds: string[] = [];
    for (let k = 0; k < children.length; k++) feeds.push(order[children[k]!]!.element.id);
    const id = e.id;
    const name = e.name ?? e.id;
    const kind = e.kind;
    const efficiency = pIn !== 0 ? pOut / pIn : 1;
    // One literal per case (fed and feeding, fed only, feeding only), with the fields in the order
    // the result always had them (id … efficiency, from, input, output): no fields added one by one.
    const out = node.model.out;
    let r: ElementResult;
    if (parent >= 0) {
      const from = order[parent]!.element.id;
      const input = portResult(node.input!, vOut[parent]!, sIn[i]!);
      r = out
        ? { id, name, kind, role, feeds, pIn, pOut, loss, efficiency, from, input, output: portResult(out, vOut[i]!, sOut[i]!) }
        : { id, name, kind, role, feeds, pIn, pOut, loss, efficiency, from, input };
    } else {
      r = out
        ? { id, name, kind, role, feeds, pIn, pOut, loss, efficiency, output: portResult(out, vOut[i]!, sOut[i]!) }
        : { id, name, kind, role, feeds, pIn, pOut, loss, efficiency };
    }
    if (rep.loadFraction !== undefined) r.loadFraction = rep.loadFraction;
    if (rep.weighted) r.weighted = rep.weighted;
    if (rep.fit) r.fit = rep.fit;
    if (role !== 'load') {
      // Idle (zero-output) part of the loss at the solved voltages; the rest is conversion loss.
      const idle = idlePart(idleDraw(node.model, vIn, vOut[i]!), loss);
      if (idle > 0) r.idleLoss = idle;
    }
    return r;
  });
  if (problems.length) return { ok: false, problems };

  const sourcePower = elements[0]!.pIn;
  let loadPower = 0;
  let losses = 0;
  for (const r of elements) {
    if (r.role === 'load') loadPower += r.pIn;
    else losses += r.loss;
  }
  const balanceError = sourcePower !== 0 ? Math.abs(sourcePower - loadPower - losses) / Math.abs(sourcePower) : 0;
  return {
    ok: true,
    result: {
      projectName,
      method: { name: 'fixed-point over exact two-bus link solutions', tolerance: TOLERANCE, iterations: point.iterations, residual: point.residual },
      elements,
      // Σ loads and the source are summed in different orders, so the ratio can pass 1 by an ulp.
      totals: { sourcePower, loadPower, losses, balanceError, efficiency: sourcePower !== 0 ? Math.min(1, loadPower / sourcePower) : 1 },
      warnings,
    },
  };
}

