/**
 * The energy-flow diagram's layout (EnergyFlow.tsx draws it): which links are drawn, their paint keys, the
 * columns, d3-sankey's placing of the power that flows on, the loss band under it, and the labels that fit
 * (steps in `layout` and `placeLabels`). Pure functions of the graph core's flowGraph() gives.
 */
import { sankey, type SankeyLink, type SankeyNode } from 'd3-sankey';
import type { FlowGraph, FlowLink, FlowNode } from '../../core/studies/index.ts';
import { formatPercent, formatPower } from '../format/number.ts';
import type { PaintKey } from './flow-palette.ts';

export const FONT = "system-ui, -apple-system, 'Segoe UI', Roboto, 'Noto Sans', sans-serif";
const NODE_WIDTH = 14;
const NODE_PADDING = 40;
/** Width given to one column of the diagram, px (labels sit in the gap to the next column). */
const COLUMN_WIDTH = 150;
/** Room to the right of the last column for the loads' labels, px. */
const RIGHT_LABELS = 150;
export const MARGIN = { top: 30, right: 12, bottom: 16, left: 12 };
/** Space between the lowest feed and the loss band, px (the band's caption sits in it). */
export const BAND_GAP = 44;
/** The drawing's height goes up and down in steps of this, px. */
const HEIGHT_STEP = 40;
/** Height kept for one loss label (name, figures, idle part), px. */
const LOSS_LABEL = 46;
/** A link narrower than this (px) gets no label on it; its figures are on hover, tap and focus. */
const LABEL_MIN_WIDTH = 15;
/** Links carrying less than this share of the source power are not drawn (e.g. a stiff source's 0 W loss). */
export const ZERO_SHARE = 1e-9;
/** Dash pattern of idle-loss branches and swatches: idle loss is told by pattern as well as colour. */
export const IDLE_DASH = '5 3';

export type NodeExtra = FlowNode & { index0: number };
export type LinkExtra = FlowLink & { key: string; value: number };
export type LaidNode = SankeyNode<NodeExtra, LinkExtra>;
export type LaidLink = SankeyLink<NodeExtra, LinkExtra>;

/** Which links are drawn: everything that carries power (zero branches would be invisible slivers). */
function drawnLinks(g: FlowGraph): FlowLink[] {
  const floor = ZERO_SHARE * Math.abs(g.sourcePower);
  return g.links.filter((l) => l.watts > floor);
}

const linkKey = (l: FlowLink) => `${l.source}→${l.target}${l.part ? `:${l.part}` : ''}`;

/** Paint key of a link: feed, idle loss, or conversion loss (cables: line loss). */
export function linkPaint(l: { role: FlowLink['role']; part?: FlowLink['part'] }, sourceKind: FlowNode['kind']): PaintKey {
  if (l.role === 'feed') return 'feed';
  if (l.part === 'idle') return 'idle';
  return sourceKind === 'cable' ? 'lineLoss' : 'conversion';
}

export function nodePaint(n: FlowNode): PaintKey {
  if (n.role === 'loss') return n.kind === 'cable' ? 'lineLoss' : 'conversion';
  if (n.role === 'source') return 'source';
  if (n.role === 'load') return 'load';
  return 'stage';
}

export const figures = (watts: number, percent: number, loc: string | undefined) => `${formatPower(watts, loc)} · ${formatPercent(percent / 100, loc, 3)}`;

function shorten(text: string, max = 24): string {
  return text.length <= max ? text : `${text.slice(0, max - 1)}…`;
}

interface Layout {
  width: number;
  height: number;
  nodes: LaidNode[];
  links: LaidLink[];
  columns: number;
  /** Top of the loss band, px (absent when nothing loses power). */
  bandTop?: number;
}

/**
 * Steps: (1) columns from the chain's depth (loads at the right edge, a loss node one column after
 * its element); (2) d3-sankey lays out the power that flows on; (3) the loss nodes go into the band
 * under it, stacked per column; (4) each loss link leaves the bottom of its element's block (the
 * block's height is its input, so the part below its feed links is exactly its loss) and enters its
 * loss node, idle part above conversion part.
 */
export function layout(g: FlowGraph, minWidth: number): Layout | null {
  const links = drawnLinks(g);
  const used = new Set(links.flatMap((l) => [l.source, l.target]));
  for (const n of g.nodes) if (n.role === 'source') used.add(n.id);
  // Copies: d3-sankey writes its layout into the objects it is given.
  const nodes: NodeExtra[] = g.nodes.filter((n) => used.has(n.id)).map((n, index0) => ({ ...n, index0 }));
  if (nodes.length === 0) return null;
  const all: LinkExtra[] = links.map((l) => ({ ...l, key: linkKey(l), value: l.watts }));
  const feedLinks = all.filter((l) => l.role === 'feed');
  const lossLinks = all.filter((l) => l.role === 'loss');

  // (1) Columns.
  const depth = new Map<string, number>();
  for (const n of nodes) if (n.role === 'source') depth.set(n.id, 0);
  for (const l of all) depth.set(l.target, (depth.get(l.source) ?? 0) + 1);
  const columns = Math.max(...depth.values()) + 1;
  const column = (n: FlowNode) => (n.role === 'load' ? columns - 1 : (depth.get(n.id) ?? 0));
  const flowNodes = nodes.filter((n) => n.role !== 'loss');
  const lossNodes = nodes.filter((n) => n.role === 'loss');
  const perColumn = new Map<number, number>();
  for (const n of flowNodes) perColumn.set(column(n), (perColumn.get(column(n)) ?? 0) + 1);
  const busiest = Math.max(...perColumn.values());
  const width = Math.max(minWidth, MARGIN.left + (columns - 1) * COLUMN_WIDTH + NODE_WIDTH + RIGHT_LABELS + MARGIN.right);
  const flowHeight = Math.max(200, busiest * (NODE_PADDING + 22) + 60);

  // (2) The power that flows on.
  const generator = sankey<NodeExtra, LinkExtra>()
    .nodeId((n) => n.id)
    .nodeWidth(NODE_WIDTH)
    .nodePadding(NODE_PADDING)
    .nodeAlign((n, count) => (n.role === 'load' ? count - 1 : (n.depth ?? 0)))
    .nodeSort((a, b) => a.index0 - b.index0)
    .extent([
      [MARGIN.left, MARGIN.top],
      [width - MARGIN.right - RIGHT_LABELS, MARGIN.top + flowHeight],
    ]);
  const laid = generator({ nodes: flowNodes, links: feedLinks });
  // Pixels per watt: a block is as tall as its input (d3-sankey: the larger of in and out).
  const ref = laid.nodes.find((n) => (n.value ?? 0) > 0);
  const ky = ref ? ((ref.y1 ?? 0) - (ref.y0 ?? 0)) / (ref.value ?? 1) : 0;
  const xOf = (c: number) => MARGIN.left + c * COLUMN_WIDTH;
  for (const n of laid.nodes) {
    n.x0 = xOf(column(n));
    n.x1 = n.x0 + NODE_WIDTH;
    // The source's block also carries its own loss, which leaves it below its feeds.
    if (n.role === 'source') n.y1 = (n.y0 ?? 0) + Math.max((n.y1 ?? 0) - (n.y0 ?? 0), n.watts * ky);
  }
  if (lossNodes.length === 0) return { width, height: MARGIN.top + flowHeight + MARGIN.bottom, nodes: laid.nodes, links: laid.links, columns };

  // (3) The loss band.
  const flowBottom = Math.max(...laid.nodes.map((n) => n.y1 ?? 0));
  const bandTop = flowBottom + BAND_GAP;
  const nextY = new Map<number, number>();
  const placedLoss: LaidNode[] = lossNodes.map((n) => {
    const c = Math.min(column(n), columns - 1);
    const y0 = nextY.get(c) ?? bandTop;
    const h = n.watts * ky;
    nextY.set(c, y0 + Math.max(h, LOSS_LABEL) + 10);
    const x0 = xOf(c);
    return { ...n, x0, x1: x0 + NODE_WIDTH, y0, y1: y0 + h, sourceLinks: [], targetLinks: [] } as LaidNode;
  });
  const byId = new Map<string, LaidNode>([...laid.nodes, ...placedLoss].map((n) => [n.id, n]));

  // (4) Loss links: below the feeds at the element, idle above conversion at the loss node.
  const outUsed = new Map<string, number>();
  for (const n of laid.nodes) outUsed.set(n.id, (n.sourceLinks ?? []).reduce((a, l) => a + (l.width ?? 0), 0));
  const inUsed = new Map<string, number>();
  const laidLoss: LaidLink[] = lossLinks.map((l) => {
    const from = byId.get(l.source)!;
    const to = byId.get(l.target)!;
    const w = l.watts * ky;
    const out = outUsed.get(from.id) ?? 0;
    const inn = inUsed.get(to.id) ?? 0;
    outUsed.set(from.id, out + w);
    inUsed.set(to.id, inn + w);
    return { ...l, source: from, target: to, width: w, y0: (from.y0 ?? 0) + out + w / 2, y1: (to.y0 ?? 0) + inn + w / 2 } as LaidLink;
  });
  // In steps: an edit that changes a tall loss block a little keeps the drawing's height, so the
  // page below does not move and the drawing is not laid out again as a whole (a new SVG size does).
  const height = Math.ceil((Math.max(...[...nextY.values()]) + MARGIN.bottom) / HEIGHT_STEP) * HEIGHT_STEP;
  return { width, height, nodes: [...laid.nodes, ...placedLoss], links: [...laid.links, ...laidLoss], columns, bandTop };
}

/** A label's box, px (for keeping labels apart). */
interface Box {
  x0: number;
  y0: number;
  x1: number;
  y1: number;
}

const overlaps = (a: Box, b: Box) => a.x0 < b.x1 && b.x0 < a.x1 && a.y0 < b.y1 && b.y0 < a.y1;
/** Rough width of a 12 px label (system sans: about 0.58 em per character, bold a little wider). */
const textWidth = (text: string, bold = false) => text.length * (bold ? 7.2 : 6.8);
/** Characters of a bold name that fit in the gap between two columns. */
const GAP_CHARS = Math.floor((COLUMN_WIDTH - NODE_WIDTH - 10) / 7.2);

interface NodeLabel {
  id: string;
  x: number;
  y: number;
  name: string;
  /** Further lines (sinks only: a stage's figures are on the link that feeds it). */
  lines: string[];
  box: Box;
}

interface LinkLabel {
  key: string;
  x: number;
  y: number;
  text: string;
}

/**
 * Labels: a source or stage is named just above its block (its figures are on the link into it);
 * a load or loss block gets its name and figures beside it (a loss also its idle part). Node labels
 * are placed in order of importance (loads, then the source and stages, then losses by size) and
 * one that would overlap a label already placed or a block is left out. Link labels go on links
 * wide enough to hold the text, at the first point along the link (middle first) where they hit no
 * other label; a label left out keeps its figures for hover, tap and focus.
 */
export function placeLabels(l: Layout, loc: string | undefined): { nodes: NodeLabel[]; links: LinkLabel[]; hidden: number } {
  const blocks: Box[] = l.nodes.map((n) => ({ x0: n.x0 ?? 0, y0: n.y0 ?? 0, x1: n.x1 ?? 0, y1: n.y1 ?? 0 }));
  const candidates: (NodeLabel & { rank: number; ownBlock: number })[] = l.nodes.map((n, i) => {
    const x0 = n.x0 ?? 0;
    const x1 = n.x1 ?? 0;
    const y0 = n.y0 ?? 0;
    const y1 = n.y1 ?? 0;
    if (n.role === 'source' || n.role === 'stage') {
      const name = shorten(n.name, 19);
      const y = y0 - 7;
      return { id: n.id, x: x0, y, name, lines: [], box: { x0, y0: y - 12, x1: x0 + textWidth(name, true), y1: y + 3 }, rank: 1, ownBlock: i };
    }
    // Every sink is labelled to its right: in the gap before the next column, or in the room kept after the last.
    const x = x1 + 6;
    const lines = [figures(n.watts, n.percent, loc)];
    let name: string;
    let y: number;
    if (n.role === 'loss') {
      name = shorten(n.name, GAP_CHARS);
      if ((n.idleWatts ?? 0) > 0) lines.push(`idle ${formatPower(n.idleWatts!, loc)}`);
      y = y0 + 11; // the band: labels read down from the block's top
    } else {
      name = shorten(n.name, 19);
      y = (y0 + y1) / 2 - 7;
    }
    const w = Math.max(textWidth(name, true), ...lines.map((t) => textWidth(t)));
    const box = { x0: x, y0: y - 12, x1: x + w, y1: y + 3 + 15 * lines.length };
    return { id: n.id, x, y, name, lines, box, rank: n.role === 'load' ? 0 : 2 + 1 / (1 + n.watts), ownBlock: i };
  });
  const placed: Box[] = [];
  const nodes: NodeLabel[] = [];
  let hidden = 0;
  for (const c of [...candidates].sort((a, b) => a.rank - b.rank)) {
    const hitsBlock = blocks.some((b, i) => i !== c.ownBlock && overlaps(b, c.box));
    if (hitsBlock || placed.some((b) => overlaps(b, c.box)) || c.box.x1 > l.width) {
      hidden++;
      continue;
    }
    placed.push(c.box);
    nodes.push({ id: c.id, x: c.x, y: c.y, name: c.name, lines: c.lines, box: c.box });
  }
  placed.push(...blocks);
  const links: LinkLabel[] = [];
  for (const link of [...l.links].sort((a, b) => (b.width ?? 0) - (a.width ?? 0))) {
    if ((link.width ?? 0) < LABEL_MIN_WIDTH) continue;
    const sx = nodeOf(link.source).x1 ?? 0;
    const tx = nodeOf(link.target).x0 ?? 0;
    const ya = link.y0 ?? 0;
    const yb = link.y1 ?? 0;
    const text = figures(link.watts, link.percent, loc);
    const w = textWidth(text, true) + 6;
    for (const u of [0.5, 0.35, 0.65, 0.2, 0.8]) {
      // The link's centre line is a cubic Bézier with both control points at mid x (d3-sankey's horizontal link).
      const xm = (sx + tx) / 2;
      const x = (1 - u) ** 3 * sx + 3 * (1 - u) * u * xm + u ** 3 * tx;
      const y = ya + (yb - ya) * (3 * u * u - 2 * u * u * u);
      const box = { x0: x - w / 2, y0: y - 8, x1: x + w / 2, y1: y + 8 };
      if (box.x0 < sx || box.x1 > tx) continue;
      if (placed.some((b) => overlaps(b, box))) continue;
      placed.push(box);
      links.push({ key: link.key, x, y, text });
      break;
    }
  }
  return { nodes, links, hidden };
}

export function nodeOf(x: LaidLink['source']): LaidNode {
  return x as LaidNode;
}
