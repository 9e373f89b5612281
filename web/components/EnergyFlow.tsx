/**
 * The energy-flow diagram: a Sankey of the solved chain, source on the left, loads on the right,
 * and every loss gathered in a band along the bottom ("where the energy goes" at a glance: the
 * top carries what reaches the loads, the bottom what is lost). Each loss branch is split into its
 * idle part (drawn even with nothing connected: dashed, plum) and its conversion part (grows with
 * the load). Loaded on demand (App.tsx imports it with a dynamic import()), so d3-sankey is not part
 * of the first load.
 *
 * Every figure comes from core's flowGraph(); this file lays out, colours and formats.
 *
 * Layout: d3-sankey places the power that flows on (sources, stages, loads and their feed links);
 * the loss nodes are then set in the band under everything, each in the column after its element,
 * so no loss label lands on a feed branch that passes through the column (the crowding a long
 * branch caused when loss nodes shared the columns). Labels that would still overlap another label
 * or a block are left out; their figures stay in the hover/tap/focus details and aria-labels.
 *
 * Phone layout: the diagram keeps its left-to-right reading (the same direction as the chain) and
 * scrolls sideways inside its own box when the columns do not fit; squeezing the columns to 390 px
 * would make the labels unreadable. Every node and link is reachable by Tab and by tap, and the
 * details line under the diagram repeats the figures in full.
 *
 * Colours: the palette of the theme shown (flow-palette.ts), written as attributes with a
 * data-fill/data-stroke key beside each, so that exported SVG/PNG files are repainted with the
 * light palette (a file goes onto white paper) and the printed page gets the light palette from the
 * print rules this component writes.
 */
import { memo } from 'preact/compat';
import { useCallback, useEffect, useLayoutEffect, useMemo, useRef, useState } from 'preact/hooks';
import { sankey, sankeyLinkHorizontal, type SankeyLink, type SankeyNode } from 'd3-sankey';
import { flowGraph, type FlowGraph, type FlowLink, type FlowNode } from '../../core/studies/index.ts';
import type { ElementResult, SolveResult } from '../../core/page.ts';
import { formatPercent, formatPower } from '../format/number.ts';
import { elementKindLabel, fileNameStem } from '../format/labels.ts';
import { deviceDark, effectiveLocale, resolveTheme, themeChoice } from '../state/prefs.ts';
import { openCount } from '../state/editor.ts';
import { FLOW_PALETTES, PAPER_THEME, type FlowPalette, type PaintKey } from './flow-palette.ts';
import { lagOffscreen, useIdleTask, type BoxRef } from './lag.ts';
import { blockLayer, branchLayer, figureLayer, writeBlock, writeBranch, writeFigure, type BlockSpec, type BranchSpec, type FigureSpec, type PartWords, writeBlockWords, writeBranchWords, makeXmlSafe } from './flow-draw.ts';
import './EnergyFlow.css';

export { FLOW_PALETTES } from './flow-palette.ts';

const FONT = "system-ui, -apple-system, 'Segoe UI', Roboto, 'Noto Sans', sans-serif";
const NODE_WIDTH = 14;
const NODE_PADDING = 40;
/** Width given to one column of the diagram, px (labels sit in the gap to the next column). */
const COLUMN_WIDTH = 150;
/** Room to the right of the last column for the loads' labels, px. */
const RIGHT_LABELS = 150;
const MARGIN = { top: 30, right: 12, bottom: 16, left: 12 };
/** Space between the lowest feed and the loss band, px (the band's caption sits in it). */
const BAND_GAP = 44;
/** The drawing's height goes up and down in steps of this, px. */
const HEIGHT_STEP = 40;
/** Height kept for one loss label (name, figures, idle part), px. */
const LOSS_LABEL = 46;
/** A link narrower than this (px) gets no label on it; its figures are on hover, tap and focus. */
const LABEL_MIN_WIDTH = 15;
/** Links carrying less than this share of the source power are not drawn (e.g. a stiff source's 0 W loss). */
const ZERO_SHARE = 1e-9;
/** Dash pattern of idle-loss branches and swatches: idle loss is told by pattern as well as colour. */
const IDLE_DASH = '5 3';

type NodeExtra = FlowNode & { index0: number };
type LinkExtra = FlowLink & { key: string; value: number };
type LaidNode = SankeyNode<NodeExtra, LinkExtra>;
type LaidLink = SankeyLink<NodeExtra, LinkExtra>;

/** The diagram's drawn layers (flow-draw.ts), kept between redraws. */
interface Drawn {
  branches: ReturnType<typeof branchLayer>;
  blocks: ReturnType<typeof blockLayer>;
  figures: ReturnType<typeof figureLayer>;
}

/** The file name stem for downloads: the project's name in lower case, words joined by dashes. */
export function fileStem(projectName: string): string {
  return `${fileNameStem(projectName) || 'joulepath-project'}-energy-flow`;
}

/** Which links are drawn: everything that carries power (zero branches would be invisible slivers). */
function drawnLinks(g: FlowGraph): FlowLink[] {
  const floor = ZERO_SHARE * Math.abs(g.sourcePower);
  return g.links.filter((l) => l.watts > floor);
}

const linkKey = (l: FlowLink) => `${l.source}→${l.target}${l.part ? `:${l.part}` : ''}`;

/** Paint key of a link: feed, idle loss, or conversion loss (cables: line loss). */
function linkPaint(l: { role: FlowLink['role']; part?: FlowLink['part'] }, sourceKind: FlowNode['kind']): PaintKey {
  if (l.role === 'feed') return 'feed';
  if (l.part === 'idle') return 'idle';
  return sourceKind === 'cable' ? 'lineLoss' : 'conversion';
}

function nodePaint(n: FlowNode): PaintKey {
  if (n.role === 'loss') return n.kind === 'cable' ? 'lineLoss' : 'conversion';
  if (n.role === 'source') return 'source';
  if (n.role === 'load') return 'load';
  return 'stage';
}

const figures = (watts: number, percent: number, loc: string | undefined) => `${formatPower(watts, loc)} · ${formatPercent(percent / 100, loc, 3)}`;

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
function layout(g: FlowGraph, minWidth: number): Layout | null {
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
function placeLabels(l: Layout, loc: string | undefined): { nodes: NodeLabel[]; links: LinkLabel[]; hidden: number } {
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

type Selection = { type: 'node'; id: string } | { type: 'link'; key: string } | null;

function nodeOf(x: LaidLink['source']): LaidNode {
  return x as LaidNode;
}

function linkText(l: LaidLink, loc: string | undefined): string {
  const from = nodeOf(l.source);
  const to = nodeOf(l.target);
  if (l.role === 'loss') {
    if (l.part === 'idle') return `Idle loss in ${from.name} (drawn even with no load): ${figures(l.watts, l.percent, loc)} of the source power`;
    return `${from.kind === 'cable' ? 'Loss' : 'Conversion loss'} in ${from.name} (grows with the load): ${figures(l.watts, l.percent, loc)} of the source power`;
  }
  return `${from.name} to ${to.name}: ${figures(l.watts, l.percent, loc)} of the source power`;
}

function nodeText(n: LaidNode, element: ElementResult | undefined, loc: string | undefined): string {
  if (n.role === 'loss') {
    const idle = n.idleWatts ?? 0;
    const split = idle > 0 ? ` (idle ${formatPower(idle, loc)}, conversion ${formatPower(n.watts - idle, loc)})` : '';
    return `Loss in ${n.name}: ${figures(n.watts, n.percent, loc)} of the source power${split}`;
  }
  if (!element) return `${n.name}: ${figures(n.watts, n.percent, loc)}`;
  const kind = elementKindLabel(element.kind);
  if (n.role === 'load') return `${n.name} (${kind}, load): uses ${figures(element.pIn, n.percent, loc)} of the source power`;
  const what = n.role === 'source' ? 'delivers' : 'takes in';
  const idle = element.idleLoss ? ` (${formatPower(element.idleLoss, loc)} of it idle)` : '';
  return (
    `${n.name} (${kind}): ${what} ${figures(element.pIn, n.percent, loc)} of the source power, gives out ${formatPower(element.pOut, loc)}, ` +
    `loses ${formatPower(element.loss, loc)}${idle}, efficiency ${formatPercent(element.efficiency, loc)}`
  );
}

async function download(blob: Blob, fileName: string): Promise<void> {
  const url = URL.createObjectURL(blob);
  const a = document.createElement('a');
  a.href = url;
  a.download = fileName;
  a.hidden = true;
  document.body.append(a);
  a.click();
  a.remove();
  // Give the browser time to start the download before the address is released.
  setTimeout(() => URL.revokeObjectURL(url), 10_000);
}

/** Paint every element that carries a palette key with the given palette. */
function repaint(root: Element, palette: FlowPalette): void {
  root.querySelectorAll('[data-fill]').forEach((el) => el.setAttribute('fill', palette.colours[el.getAttribute('data-fill') as PaintKey]));
  root.querySelectorAll('[data-stroke]').forEach((el) => el.setAttribute('stroke', palette.colours[el.getAttribute('data-stroke') as PaintKey]));
  root.querySelectorAll('[data-opacity]').forEach((el) =>
    el.setAttribute('stroke-opacity', String(el.getAttribute('data-opacity') === 'feed' ? palette.feedOpacity : palette.lossOpacity)),
  );
}

interface LegendItem {
  paint: PaintKey;
  label: string;
  dashed?: boolean;
}

const LEGEND: readonly LegendItem[] = [
  { paint: 'feed', label: 'Power passed on' },
  { paint: 'idle', label: 'Idle loss: drawn even with no load', dashed: true },
  { paint: 'conversion', label: 'Conversion loss: grows with the load' },
  { paint: 'lineLoss', label: 'Loss in a cable' },
];

const EXPORT_ROW = 16;

/** Legend rows of an exported file, wrapped to its width. */
function exportLegendRows(width: number): { item: LegendItem; x: number; row: number }[] {
  const out: { item: LegendItem; x: number; row: number }[] = [];
  let x = 12;
  let row = 0;
  for (const item of LEGEND) {
    const w = 24 + item.label.length * 6.2 + 18;
    if (x > 12 && x + w > width) {
      x = 12;
      row++;
    }
    out.push({ item, x, row });
    x += w;
  }
  return out;
}

const exportHeader = (width: number, summary: string | null) =>
  40 + EXPORT_ROW * (Math.max(...exportLegendRows(width).map((r) => r.row)) + 1) + (summary ? EXPORT_ROW : 0);

/** The diagram as standalone SVG text in the paper palette (focus outlines and page-only attributes removed). */
function svgText(svg: SVGSVGElement, title: string, summary: string | null): string {
  const NS = 'http://www.w3.org/2000/svg';
  const paper = FLOW_PALETTES[PAPER_THEME];
  const copy = svg.cloneNode(true) as SVGSVGElement;
  copy.querySelectorAll('[tabindex]').forEach((el) => el.removeAttribute('tabindex'));
  copy.querySelectorAll('[data-selected]').forEach((el) => el.removeAttribute('data-selected'));
  repaint(copy, paper);
  copy.removeAttribute('class');
  copy.setAttribute('xmlns', NS);
  // A file stands alone: a heading, the colour key and the loss split above the diagram.
  const width = Number(svg.getAttribute('width'));
  const header = exportHeader(width, summary);
  const height = Number(svg.getAttribute('height')) + header;
  copy.setAttribute('height', String(height));
  copy.setAttribute('viewBox', `0 0 ${width} ${height}`);
  const doc = copy.ownerDocument;
  const el = (name: string, attrs: Record<string, string>, text?: string) => {
    const e = doc.createElementNS(NS, name);
    for (const [k, v] of Object.entries(attrs)) e.setAttribute(k, v);
    if (text !== undefined) e.textContent = text;
    return e;
  };
  const body = el('g', { transform: `translate(0 ${header})` });
  for (const child of [...copy.childNodes]) if ((child as Element).localName !== 'title') body.append(child);
  const head = el('g', {});
  head.append(el('rect', { x: '0', y: '0', width: String(width), height: String(height), fill: paper.colours.background }));
  head.append(el('text', { x: '12', y: '22', 'font-size': '15', 'font-weight': '700', fill: paper.colours.ink }, title));
  for (const { item, x, row } of exportLegendRows(width)) {
    const y = 33 + row * EXPORT_ROW;
    head.append(
      el('line', {
        x1: String(x),
        x2: String(x + 18),
        y1: String(y + 4.5),
        y2: String(y + 4.5),
        stroke: paper.colours[item.paint],
        'stroke-width': '9',
        ...(item.dashed ? { 'stroke-dasharray': IDLE_DASH } : {}),
      }),
    );
    head.append(el('text', { x: String(x + 24), y: String(y + 9), 'font-size': '11', fill: paper.colours.inkMuted }, item.label));
  }
  if (summary) {
    const rows = Math.max(...exportLegendRows(width).map((r) => r.row)) + 1;
    head.append(el('text', { x: '12', y: String(42 + rows * EXPORT_ROW), 'font-size': '11', fill: paper.colours.ink }, summary));
  }
  copy.append(head, body);
  // Names may hold characters XML 1.0 forbids (a control character pasted or imported): left out.
  makeXmlSafe(copy);
  return `<?xml version="1.0" encoding="UTF-8"?>\n${new XMLSerializer().serializeToString(copy)}`;
}

/** The SVG drawn onto a canvas at twice its size, as a PNG. */
async function pngBlob(svg: SVGSVGElement, title: string, summary: string | null): Promise<Blob> {
  const width = Number(svg.getAttribute('width'));
  const height = Number(svg.getAttribute('height')) + exportHeader(width, summary);
  const url = URL.createObjectURL(new Blob([svgText(svg, title, summary)], { type: 'image/svg+xml' }));
  try {
    const img = new Image();
    img.src = url;
    await img.decode();
    const scale = 2;
    const canvas = document.createElement('canvas');
    canvas.width = Math.round(width * scale);
    canvas.height = Math.round(height * scale);
    const ctx = canvas.getContext('2d');
    if (!ctx) throw new Error('this browser gives no 2D canvas');
    ctx.fillStyle = FLOW_PALETTES[PAPER_THEME].colours.background;
    ctx.fillRect(0, 0, canvas.width, canvas.height);
    ctx.drawImage(img, 0, 0, canvas.width, canvas.height);
    return await new Promise<Blob>((resolve, reject) =>
      canvas.toBlob((b) => (b ? resolve(b) : reject(new Error('the canvas gave no PNG'))), 'image/png'),
    );
  } finally {
    URL.revokeObjectURL(url);
  }
}

/**
 * Print rules: the printed diagram takes the paper palette whatever the theme on screen (CSS
 * declarations override the SVG's presentation attributes), fills the page width, and loses its
 * scroll box, buttons and selection.
 */
function printRules(): string {
  const p = FLOW_PALETTES[PAPER_THEME];
  const keys = Object.keys(p.colours) as PaintKey[];
  return [
    '@media print {',
    ...keys.map((k) => `.flow__svg [data-fill="${k}"] { fill: ${p.colours[k]}; }`),
    ...keys.map((k) => `.flow__svg [data-stroke="${k}"] { stroke: ${p.colours[k]}; }`),
    `.flow__svg [data-opacity="feed"] { stroke-opacity: ${p.feedOpacity}; }`,
    `.flow__svg [data-opacity="loss"] { stroke-opacity: ${p.lossOpacity}; }`,
    `.flow__box { background: ${p.colours.background} !important; }`,
    ...LEGEND.map((i) => `.flow__swatch[data-paint="${i.paint}"] { border-top-color: ${p.colours[i.paint]} !important; }`),
    '}',
  ].join('\n');
}

/** Built once: the rules depend only on the paper palette. */
const PRINT_RULES = printRules();

const Legend = memo(function Legend({ palette }: { palette: FlowPalette }) {
  return (
    <ul class="flow__legend">
      {LEGEND.map((i) => (
        <li key={i.label}>
          <span
            class={i.dashed ? 'flow__swatch flow__swatch--dashed' : 'flow__swatch'}
            data-paint={i.paint}
            style={{ borderTopColor: palette.colours[i.paint] }}
            aria-hidden="true"
          />
          {i.label}
        </li>
      ))}
    </ul>
  );
});

/** The theme the page shows now (the choice, or the device's setting). */
export function shownTheme(): 'light' | 'dark' {
  return resolveTheme(themeChoice.value, deviceDark.value);
}

function EnergyFlow({ result, box }: { result: SolveResult; box: BoxRef }) {
  const graph = useMemo(() => flowGraph(result), [result]);
  const elements = useMemo(() => new Map(result.elements.map((e) => [e.id, e])), [result]);
  const boxRef = useRef<HTMLDivElement>(null);
  const svgRef = useRef<SVGSVGElement>(null);
  const [boxWidth, setBoxWidth] = useState(0);
  const [selected, setSelected] = useState<Selection>(null);
  const [exportError, setExportError] = useState<string | null>(null);
  const palette = FLOW_PALETTES[shownTheme()];
  const c = palette.colours;

  useEffect(() => {
    const box = boxRef.current;
    if (!box) return;
    const measure = () => setBoxWidth(box.clientWidth);
    measure();
    const observer = new ResizeObserver(measure);
    observer.observe(box);
    return () => observer.disconnect();
  }, []);
  useEffect(() => setSelected(null), [result]);

  const laid = useMemo(() => (boxWidth > 0 ? layout(graph, boxWidth) : null), [graph, boxWidth]);
  const loc = effectiveLocale();
  const labels = useMemo(() => (laid ? placeLabels(laid, loc) : null), [laid, loc]);
  const nodeLabels = useMemo(() => new Map((labels?.nodes ?? []).map((x) => [x.id, x])), [labels]);
  const zeroLoss = graph.nodes.filter((n) => n.role === 'loss' && !(n.watts > ZERO_SHARE * Math.abs(graph.sourcePower)));
  const stem = fileStem(result.projectName || 'joulepath-project');
  const ls = graph.losses;
  const summary =
    graph.sourcePower !== 0
      ? `Losses ${figures(ls.total.watts, ls.total.percent, loc)}: idle ${figures(ls.idle.watts, ls.idle.percent, loc)}, conversion ${figures(ls.conversion.watts, ls.conversion.percent, loc)}`
      : null;

  let details = 'Point at, tap or Tab to a branch or a block to see its figures.';
  if (laid && selected?.type === 'link') {
    const l = laid.links.find((x) => x.key === selected.key);
    if (l) details = linkText(l, loc);
  } else if (laid && selected?.type === 'node') {
    const n = laid.nodes.find((x) => x.id === selected.id);
    if (n) details = nodeText(n, elements.get(n.elementId), loc);
  }

  async function exportSvg() {
    if (!svgRef.current) return;
    setExportError(null);
    await download(new Blob([svgText(svgRef.current, title, summary)], { type: 'image/svg+xml' }), `${stem}.svg`);
  }
  async function exportPng() {
    if (!svgRef.current) return;
    setExportError(null);
    try {
      await download(await pngBlob(svgRef.current, title, summary), `${stem}.png`);
    } catch (error) {
      setExportError(`The PNG could not be made: ${error instanceof Error ? error.message : String(error)}. The SVG download still works.`);
    }
  }

  /** Hover, tap, click or focus on a branch or a block selects it (its figures go to the details line). */
  const pick = useCallback((ev: Event) => {
    const target = ev.target instanceof Element ? ev.target : null;
    const link = target?.closest<SVGElement>('[data-link-key]')?.dataset['linkKey'];
    const node = link === undefined ? target?.closest<SVGElement>('[data-node]')?.dataset['node'] : undefined;
    // Moving the pointer within one block fires again: keep the same selection (no redraw).
    if (link !== undefined) setSelected((s) => (s?.type === 'link' && s.key === link ? s : { type: 'link', key: link }));
    else if (node !== undefined) setSelected((s) => (s?.type === 'node' && s.id === node ? s : { type: 'node', id: node }));
  }, []);
  const title = `Energy flow of ${result.projectName || 'the project'}`;

  // The branches, blocks and labels are written into their layers after each render, before the
  // frame is painted (flow-draw.ts: only what changed is written).
  const branchesRef = useRef<SVGGElement>(null);
  const blocksRef = useRef<SVGGElement>(null);
  const figuresRef = useRef<SVGGElement>(null);
  const drawn = useRef<Drawn | null>(null);
  const scheduleWords = useIdleTask();
  const wordsOpened = useRef(-1);
  useLayoutEffect(() => {
    if (!laid || !branchesRef.current || !blocksRef.current || !figuresRef.current) return;
    const d = (drawn.current ??= { branches: branchLayer(), blocks: blockLayer(), figures: figureLayer() });
    const path = sankeyLinkHorizontal<NodeExtra, LinkExtra>();
    const branches = laid.links.map((l): BranchSpec => {
      const paint = linkPaint(l, nodeOf(l.source).kind);
      const isSel = selected?.type === 'link' && selected.key === l.key;
      const isLoss = l.role === 'loss';
      return {
        key: l.key,
        d: path(l) ?? '',
        paint: isSel ? 'selected' : paint,
        colour: isSel ? c.selected : c[paint],
        opacityKey: isLoss ? 'loss' : 'feed',
        opacity: isLoss ? palette.lossOpacity : palette.feedOpacity,
        width: Math.max(1, l.width ?? 1),
        dash: l.part === 'idle' && (l.width ?? 0) >= 2 ? IDLE_DASH : undefined,
        role: l.role,
        part: l.part,
        source: nodeOf(l.source).id,
        target: nodeOf(l.target).id,
        selected: isSel,
      };
    });
    const blocks = laid.nodes.map((n): BlockSpec => {
      const y0 = n.y0 ?? 0;
      const h = Math.max(2, (n.y1 ?? 0) - y0);
      const paint = nodePaint(n);
      return {
        id: n.id,
        role: n.role,
        x0: n.x0 ?? 0,
        y0,
        width: (n.x1 ?? 0) - (n.x0 ?? 0),
        h,
        // A loss block shows its idle part on top, as its branches arrive.
        idleH: n.role === 'loss' && n.watts > 0 ? (h * (n.idleWatts ?? 0)) / n.watts : 0,
        paint,
        colours: { fill: c[paint], idle: c.idle, selected: c.selected, ink: c.ink, inkMuted: c.inkMuted, background: c.background },
        text: nodeLabels.get(n.id),
        selected: selected?.type === 'node' && selected.id === n.id,
      };
    });
    const onLinks = (labels?.links ?? []).map((t): FigureSpec => ({ key: t.key, x: t.x, y: t.y, text: t.text, ink: c.ink, background: c.background }));
    const created =
      d.branches.draw(branchesRef.current, branches, (s) => s.key, writeBranch) + d.blocks.draw(blocksRef.current, blocks, (s) => s.id, writeBlock);
    d.figures.draw(figuresRef.current, onLinks, (s) => s.key, writeFigure);

    // The parts' accessible names (with their figures) and the branches' watts are not drawn: they
    // are written when the page is next idle after the paint (lag.ts); at once when a part is new or
    // another project was opened, so no part is ever without its name or with another project's.
    const words = () => {
      d.branches.describe(
        laid.links.map((l): PartWords => ({ key: l.key, label: linkText(l, loc), watts: l.watts })),
        (w) => w.key,
        writeBranchWords,
      );
      d.blocks.describe(
        laid.nodes.map((n): PartWords => ({ key: n.id, label: nodeText(n, elements.get(n.elementId), loc) })),
        (w) => w.key,
        writeBlockWords,
      );
    };
    const opened = openCount.peek();
    if (created > 0 || opened !== wordsOpened.current) {
      wordsOpened.current = opened;
      words();
    } else {
      scheduleWords(words);
    }
  }, [laid, labels, nodeLabels, selected, palette, loc, elements]);

  return (
    <section class="flow print-keep" aria-labelledby="flow-heading" data-testid="energy-flow" ref={box}>
      <style>{PRINT_RULES}</style>
      <div class="flow__head">
        <h3 id="flow-heading">Where the energy goes</h3>
        <div class="flow__actions">
          <button type="button" class="flow__button" onClick={exportSvg} disabled={!laid} data-testid="flow-export-svg">
            Download SVG
          </button>
          <button type="button" class="flow__button" onClick={exportPng} disabled={!laid} data-testid="flow-export-png">
            Download PNG
          </button>
        </div>
      </div>
      <Legend palette={palette} />
      {summary && (
        <p class="flow__summary" data-testid="flow-loss-split">
          {summary}
        </p>
      )}
      <div
        class="flow__box"
        ref={boxRef}
        data-testid="flow-box"
        style={{ background: c.background }}
        // Focusable so the sideways scroll on a narrow screen also works from the keyboard.
        tabIndex={0}
        role="region"
        aria-label="Energy-flow diagram (scrolls sideways on narrow screens)"
        // One set of handlers for every branch and block (they carry their key in data-*), so a
        // redraw after an edit does not hand each of them three new functions. On this box, not on
        // the <svg>: Chromium makes an SVG element with a focus listener focusable itself.
        onPointerOver={pick}
        onClick={pick}
        onFocusIn={pick}
      >
        {graph.sourcePower === 0 && <p class="note">The source delivers nothing in this project, so there is no flow to draw.</p>}
        {laid && graph.sourcePower !== 0 && (
          <svg
            ref={svgRef}
            xmlns="http://www.w3.org/2000/svg"
            class="flow__svg"
            width={laid.width}
            height={laid.height}
            viewBox={`0 0 ${laid.width} ${laid.height}`}
            role="group"
            aria-label={title}
            font-family={FONT}
            data-testid="flow-svg"
            data-hidden-labels={String(labels?.hidden ?? 0)}
          >
            <title>{title}</title>
            <rect x="0" y="0" width={laid.width} height={laid.height} fill={c.background} data-fill="background" />
            {laid.bandTop !== undefined && (
              <g>
                <rect x="0" y={laid.bandTop - BAND_GAP / 2} width={laid.width} height={laid.height - laid.bandTop + BAND_GAP / 2} fill={c.band} data-fill="band" />
                <text x={MARGIN.left} y={laid.bandTop - BAND_GAP / 2 + 17} font-size="12" font-weight="700" fill={c.inkMuted} data-fill="inkMuted">
                  Losses
                </text>
              </g>
            )}
            {/* Branches, blocks and labels: drawn by the layout effect above (flow-draw.ts). */}
            <g fill="none" ref={branchesRef} />
            <g ref={blocksRef} />
            <g ref={figuresRef} />
          </svg>
        )}
      </div>
      {laid && laid.width > boxWidth + 1 && (
        <p class="note flow__screen-only" data-testid="flow-scroll-hint">
          The whole chain is wider than this screen: swipe the diagram sideways to follow it to the loads.
        </p>
      )}
      <p class="flow__details" aria-live="polite" data-testid="flow-details">
        {details}
      </p>
      {(labels?.hidden ?? 0) > 0 && (
        <p class="note flow__screen-only" data-testid="flow-hidden-labels">
          Some small blocks have no label where there is no room for one: point at, tap or Tab to them for their figures.
        </p>
      )}
      {zeroLoss.length > 0 && (
        <p class="note" data-testid="flow-no-loss">
          No loss branch drawn for {zeroLoss.map((n) => n.name).join(', ')}: {zeroLoss.length === 1 ? 'it loses' : 'they lose'} nothing in this
          model.
        </p>
      )}
      {exportError && (
        <p class="notice notice--error" role="alert">
          {exportError}
        </p>
      )}
      <p class="note">
        Branch widths are to scale with real power; per cent figures are shares of the power the source delivers. Idle loss is what a stage
        draws at zero output (standby, no-load or fixed loss); conversion loss is the rest, which grows with the load.
      </p>
    </section>
  );
}

/** Scrolled out of view, the diagram follows the edits when the page is idle (lag.ts). */
export default lagOffscreen(EnergyFlow);
