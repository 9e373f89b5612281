/**
 * The energy flow of a solved chain as plain data for a Sankey diagram: nodes (the source, every
 * stage, every load, and one loss node per source/stage) and links carrying real power.
 *
 * Method: an energy balance per element taken straight from the solve result (no new physics).
 * - a link from each element to each element it feeds, value = the child's P_in;
 * - from the source and from each stage, its loss (P_in − P_out; for the source its internal loss,
 *   since it delivers P_in including that loss) in up to two links to its own loss node: the idle
 *   part (`ElementResult.idleLoss`: drawn even at zero output — standby, no-load, core, fixed loss)
 *   and the conversion part (loss − idle: grows with the load — I²R, switching, copper loss).
 *   The conversion link is always there (0 W when all the loss is idle); the idle link only when
 *   the element has idle loss. Idle + conversion = loss exactly (the idle part is limited to 0…loss
 *   by the solve), so the widths stay to scale and the loss node's input equals the element's loss.
 * At every element the solve makes P_out = Σ children's P_in, so input = outputs + loss holds to the
 * solve's round-off; `flowGraph` reports the largest relative mismatch it finds (`conservationError`).
 */
import type { ElementKind } from '../model/project.ts';
import type { ElementResult, SolveResult } from '../model/result.ts';

export type FlowNodeRole = 'source' | 'stage' | 'load' | 'loss';

export interface FlowNode {
  /** Unique within the graph: the element id, or `<element id>#loss` for a loss node. */
  id: string;
  role: FlowNodeRole;
  /** The element this node stands for (for a loss node: the element that loses the power). */
  elementId: string;
  /** The element's name (or id when unnamed); for a loss node, the name of the element. */
  name: string;
  kind: ElementKind;
  /** Real power through the node, W: P_in of an element (the source: what it delivers), the loss of a loss node. */
  watts: number;
  /** watts as a percentage of the source power (0 when the source delivers nothing). */
  percent: number;
  /** Loss nodes: the idle part of `watts`, W (0 when the element has none); the rest is conversion loss. */
  idleWatts?: number;
}

/** Which part of an element's loss a loss link carries. */
export type LossPart = 'idle' | 'conversion';

export interface FlowLink {
  /** Id of the node the power leaves. */
  source: string;
  /** Id of the node the power reaches. */
  target: string;
  /** 'feed': to a fed element (value = its P_in); 'loss': to the element's loss node. */
  role: 'feed' | 'loss';
  /**
   * Loss links only: 'idle' — drawn even with nothing connected (standby, no-load, core, fixed
   * loss); 'conversion' — the rest, which grows with the load (I²R, switching, copper loss).
   */
  part?: LossPart;
  /** Real power, W. */
  watts: number;
  /** watts as a percentage of the source power (0 when the source delivers nothing). */
  percent: number;
}

export interface FlowGraph {
  projectName: string;
  /** Real power the source delivers, W (totals.sourcePower). */
  sourcePower: number;
  /** Nodes in the result's order (source first, depth-first), each loss node right after its element. */
  nodes: FlowNode[];
  links: FlowLink[];
  /** Largest |P_in − Σ out-links| / source power over the source and stages (0 for an empty source). */
  conservationError: number;
  /** Losses of the whole chain, split into idle and conversion parts, in W and % of the source power. */
  losses: LossSummary;
}

/** A power and its share of the source power. */
export interface Share {
  /** W. */
  watts: number;
  /** % of the source power (0 when the source delivers nothing). */
  percent: number;
}

export interface LossSummary {
  /** Σ losses of the source and stages (= totals.losses). */
  total: Share;
  /** Σ idle parts: drawn even with nothing connected. */
  idle: Share;
  /** Σ conversion parts: grow with the load. */
  conversion: Share;
  /** The element losing the most (absent when nothing loses power). */
  largest?: Share & { elementId: string; name: string; idleWatts: number };
}

/** Suffix of a loss node's id. */
export const LOSS_SUFFIX = '#loss';

export function lossNodeId(elementId: string): string {
  return `${elementId}${LOSS_SUFFIX}`;
}

/**
 * An element's loss split into its idle part (drawn at zero output) and its conversion part
 * (loss − idle), W. Elements without `idleLoss` have all their loss as conversion loss.
 */
export function lossParts(e: Pick<ElementResult, 'loss' | 'idleLoss'>): { idle: number; conversion: number } {
  const idle = e.idleLoss ?? 0;
  return { idle, conversion: e.loss - idle };
}

/** The Sankey graph of a solved chain (pure; the result is not modified). */
export function flowGraph(result: SolveResult): FlowGraph {
  const sourcePower = result.totals.sourcePower;
  const pct = (w: number) => (sourcePower !== 0 ? (100 * w) / sourcePower : 0);
  const byId = new Map(result.elements.map((e) => [e.id, e]));
  const nodes: FlowNode[] = [];
  const links: FlowLink[] = [];
  let conservationError = 0;
  let idleSum = 0;
  let conversionSum = 0;
  let largest: FlowNode | undefined;

  for (const e of result.elements) {
    const name = e.name || e.id;
    nodes.push({ id: e.id, role: e.role, elementId: e.id, name, kind: e.kind, watts: e.pIn, percent: pct(e.pIn) });
    if (e.role === 'load') continue;
    const { idle, conversion } = lossParts(e);
    nodes.push({ id: lossNodeId(e.id), role: 'loss', elementId: e.id, name, kind: e.kind, watts: e.loss, percent: pct(e.loss), idleWatts: idle });
    idleSum += idle;
    conversionSum += conversion;
    if (e.loss > 0 && (!largest || e.loss > largest.watts)) largest = nodes[nodes.length - 1]!;
    let out = idle + conversion;
    for (const childId of e.feeds) {
      const child = byId.get(childId);
      if (!child) continue;
      links.push({ source: e.id, target: child.id, role: 'feed', watts: child.pIn, percent: pct(child.pIn) });
      out += child.pIn;
    }
    if (idle > 0) links.push({ source: e.id, target: lossNodeId(e.id), role: 'loss', part: 'idle', watts: idle, percent: pct(idle) });
    links.push({ source: e.id, target: lossNodeId(e.id), role: 'loss', part: 'conversion', watts: conversion, percent: pct(conversion) });
    if (sourcePower !== 0) conservationError = Math.max(conservationError, Math.abs(e.pIn - out) / Math.abs(sourcePower));
  }

  const share = (watts: number): Share => ({ watts, percent: pct(watts) });
  const losses: LossSummary = {
    total: share(result.totals.losses),
    idle: share(idleSum),
    conversion: share(conversionSum),
    ...(largest ? { largest: { ...share(largest.watts), elementId: largest.elementId, name: largest.name, idleWatts: largest.idleWatts ?? 0 } } : {}),
  };
  return { projectName: result.projectName, sourcePower, nodes, links, conservationError, losses };
}
