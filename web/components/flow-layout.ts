/**
 * The energy-flow diagram's layout (EnergyFlow.tsx draws it): which links are drawn, their paint keys, the
 * columns, the place of every block, branch and label. Pure functions of the graph core's flowGraph() gives
 * (and of a text measure, so that names wrap where the page's font needs it).
 *
 * The drawing is made of columns (one per depth of the chain, source first) and the gaps between them:
 * - in a column, each source, stage and load is a straight piece of the flow (its "pipe", as tall as
 *   the power it takes in), with its label (name, wrapped to the column, never cut — past
 *   MAX_NAME_LINES lines shortened, the full name then in the exported file's legend; then its power
 *   and share of the source) just above it, and its loss right under it: a branch leaving the pipe's bottom
 *   straight down (idle part on the left, conversion part on the right), a small loss block, and the
 *   loss label centred under the stage;
 * - in a gap, only the branches that carry power on (each from its element to an element of the next
 *   column: a chain is a tree, so every feed joins neighbouring columns).
 * Labels and loss branches stay inside their column and feed branches inside their gap, so no loss
 * branch can cross a main flow or a label. A stage's subtree takes the rows its stages, labels and
 * losses need (a tidy tree: children stacked under each other, the first continuing its parent's flow
 * at the same height), so the losses take only the height they need, under their own stage.
 *
 * Who does what: d3-sankey (0.12, `sankey()` run on copies, as it writes into what it is given) lays
 * out the main flows only (sources, stages, loads and the feeds between them): each node's column
 * (its depth), its value, each feed's width and the feeds' order at each node. The code here adds
 * what a Sankey layout does not know: the labels (wrapped names, figures) and the tidy tree that
 * places the pipes with their labels above and losses under them; then `sankey.update` attaches the
 * feeds to the pipes where they now are. The loss branches and blocks (not given to d3-sankey) hang
 * under their stage, placed here.
 */
import { sankey, sankeyLeft, type SankeyLink, type SankeyNode } from 'd3-sankey';
import type { FlowGraph, FlowLink, FlowNode } from '../../core/studies/index.ts';
import { formatPercent, formatPower } from '../format/number.ts';
import type { PaintKey } from './flow-palette.ts';

export const FONT = "system-ui, -apple-system, 'Segoe UI', Roboto, 'Noto Sans', sans-serif";
/** Width of a column (its pipes and labels), px. */
export const COLUMN = 140;
/** Width of the gap between two columns (feed branches only), px. */
export const GAP = 48;
/** Width of the coloured mark at a pipe's start (source, stage, load colour), px. */
export const MARK = 6;
export const MARGIN = { top: 12, right: 12, bottom: 16, left: 12 };
/** The drawing's height goes up and down in steps of this, px. */
const HEIGHT_STEP = 40;
/** Tallest pipe (the source's), px. */
const MAX_PIPE = 150;
/** Length of a loss branch from its pipe to its loss block, px. */
const STUB = 14;
/** Height of a loss block, px. */
const LOSS_BLOCK = 4;
/** Line pitch of a label, px (1.25 em of its 12 px type). */
export const LINE = 15;
/** Room kept under a subtree before the next one, px. */
const PAD = 14;
/** Links carrying less than this share of the source power are not drawn (e.g. a stiff source's 0 W loss). */
export const ZERO_SHARE = 1e-9;
/** Dash pattern of idle-loss branches and swatches: idle loss is told by pattern as well as colour. */
export const IDLE_DASH = '5 3';
/** Room a label line may take in its column, px (a little kept free on each side). */
const TEXT_ROOM = COLUMN - 4;

/** Width of a 12 px label line, px. */
export type Measure = (text: string, bold: boolean) => number;

/**
 * Rough width of a 12 px line when no page measures it (benchmarks, Node): per character, from the
 * advance widths of DejaVu Sans (one of the wider system sans faces: digits 0.64 em, capitals about
 * 0.7 em, lower case about 0.6 em, spaces and stops 0.32 em), bold about 8 % wider. From memory.
 */
export const roughMeasure: Measure = (text, bold) => {
  let em = 0;
  for (const ch of text) {
    if (ch >= '0' && ch <= '9') em += 0.64;
    else if (ch === ' ' || ch === '.' || ch === ',' || ch === ':' || ch === '·' || ch === 'i' || ch === 'l') em += 0.32;
    else if (ch >= 'A' && ch <= 'Z') em += 0.72;
    else em += 0.62;
  }
  return em * 12 * (bold ? 1.08 : 1);
};

export interface LaidNode extends FlowNode {
  index0: number;
  /** Column (0: the source). */
  column: number;
  /** The block: a pipe for a source, stage or load; the small loss block for a loss node. */
  x0: number;
  y0: number;
  x1: number;
  y1: number;
  /** Loss nodes: width of the idle part at the block's left, px. */
  idleWidth: number;
}

export interface LaidLink extends FlowLink {
  key: string;
  /** Drawn width, px (to scale with the power). */
  width: number;
  /** Centre line: from (sx, sy) to (tx, ty): a feed branch bends across its gap, a loss branch runs straight down. */
  sx: number;
  sy: number;
  tx: number;
  ty: number;
  sourceNode: LaidNode;
  targetNode: LaidNode;
}

/** A label: lines from (x, y) down (y is the first line's baseline), left-aligned or centred on x. */
export interface NodeLabel {
  id: string;
  x: number;
  y: number;
  anchor: 'start' | 'middle';
  lines: readonly { text: string; bold: boolean }[];
  /** The full name, when the label had to shorten it (more than MAX_NAME_LINES lines). */
  fullName?: string;
}

export interface Layout {
  width: number;
  height: number;
  nodes: LaidNode[];
  links: LaidLink[];
  labels: NodeLabel[];
  columns: number;
}

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

/**
 * Words into lines of at most `room` px: pieces joined by `sep` while they fit; a piece wider than
 * a line on its own is broken between characters (nothing is ever cut off).
 */
export function wrap(pieces: readonly string[], sep: string, room: number, bold: boolean, measure: Measure): string[] {
  const lines: string[] = [];
  let line = '';
  for (let piece of pieces) {
    if (piece === '') continue;
    const joined = line === '' ? piece : line + sep + piece;
    if (measure(joined, bold) <= room) {
      line = joined;
      continue;
    }
    if (line !== '') lines.push(line);
    line = '';
    while (measure(piece, bold) > room && piece.length > 1) {
      // The longest head that fits (a binary search: a pasted name may be thousands of characters).
      let lo = 1;
      let hi = piece.length - 1;
      while (lo < hi) {
        const mid = Math.ceil((lo + hi) / 2);
        if (measure(piece.slice(0, mid), bold) <= room) lo = mid;
        else hi = mid - 1;
      }
      lines.push(piece.slice(0, lo));
      piece = piece.slice(lo);
    }
    line = piece;
  }
  if (line !== '') lines.push(line);
  return lines;
}

/** Lines a name may take in the drawing; a longer one is shortened there, with its full name in the exported file's legend. */
export const MAX_NAME_LINES = 6;

/**
 * The lines of a source's, stage's or load's label: its name (bold, wrapped), then its power and
 * share; and whether the name had to be shortened (only past MAX_NAME_LINES lines).
 */
function nodeLines(n: FlowNode, loc: string | undefined, measure: Measure): { lines: { text: string; bold: boolean }[]; shortened: boolean } {
  let name = wrap(n.name.split(/\s+/), ' ', TEXT_ROOM, true, measure);
  const shortened = name.length > MAX_NAME_LINES;
  if (shortened) {
    name = name.slice(0, MAX_NAME_LINES);
    let last = name[MAX_NAME_LINES - 1]!;
    while (last.length > 1 && measure(`${last}…`, true) > TEXT_ROOM) last = last.slice(0, -1);
    name[MAX_NAME_LINES - 1] = `${last}…`;
  }
  // A line that ends where the name has a space keeps that space (SVG does not draw it), so that the
  // file's text, read as a whole (copied, searched, read aloud), holds the name with its spaces.
  const full = n.name.split(/\s+/).join(' ');
  let at = 0;
  name = name.map((line) => {
    at += line.length;
    if (full[at] !== ' ') return line;
    at++;
    return `${line} `;
  });
  const figs = wrap([formatPower(n.watts, loc), formatPercent(n.percent / 100, loc, 3)], ' · ', TEXT_ROOM, false, measure);
  return { lines: [...name.map((text) => ({ text, bold: true })), ...figs.map((text) => ({ text, bold: false }))], shortened };
}

/** The lines of a loss label (under its own stage, so without the name): the loss, its share, its idle part. */
function lossLines(n: FlowNode, loc: string | undefined, measure: Measure): { text: string; bold: boolean }[] {
  const lines = wrap([`loss ${formatPower(n.watts, loc)}`, formatPercent(n.percent / 100, loc, 3)], ' · ', TEXT_ROOM, false, measure);
  if ((n.idleWatts ?? 0) > 0) lines.push(...wrap([`idle ${formatPower(n.idleWatts!, loc)}`], ' ', TEXT_ROOM, false, measure));
  return lines.map((text) => ({ text, bold: false }));
}

/** Left edge of a column, px. */
export const columnX = (c: number) => MARGIN.left + c * (COLUMN + GAP);

/** A source, stage or load as d3-sankey gets it (a copy: d3-sankey writes its layout into it). */
type FlowIn = FlowNode & { index0: number; fixedValue?: number };
/** A feed as d3-sankey gets it (a copy, with the graph's link beside it). */
type FeedIn = { source: string; target: string; value: number; link: FlowLink };
type SNode = SankeyNode<FlowIn, FeedIn>;
type SLink = SankeyLink<FlowIn, FeedIn>;

/** d3-sankey's node or link end (an object once the layout has run). */
const nodeOf = (x: SLink['source']) => x as SNode;

/**
 * Steps: (1) d3-sankey over the main flows (sources, stages, loads and their feeds; the loss links
 * stay out of it): each node's column (its depth), its value (its feed in; a source's own power,
 * which also carries its own loss), each feed's width (the extent's height is chosen so that its
 * scale is this diagram's: the source's pipe at most MAX_PIPE px tall, the widest loss branch within
 * a column) and the order of the feeds at each node (the graph's, which is the chain's);
 * (2) each label's lines, the height above a pipe its label needs, and the height a subtree's first
 * line of flow needs above it (its "ascent": a first child continues its parent's flow at the same
 * height, so the taller label of the two sets it); (3) the subtrees placed top to bottom, each pipe
 * with its loss under it (this writes the nodes' x0, x1, y0, y1 over d3-sankey's own placing);
 * (4) d3-sankey's `update` attaches the feeds to the pipes where they now are (stacked from a pipe's
 * top in its feeds' order); the loss branches leave the pipe's bottom, idle part left of conversion.
 */
export function layout(g: FlowGraph, minWidth: number, loc: string | undefined, measure: Measure = roughMeasure, pxPerWatt?: number): Layout | null {
  const links = drawnLinks(g);
  const used = new Set(links.flatMap((l) => [l.source, l.target]));
  for (const n of g.nodes) if (n.role === 'source') used.add(n.id);
  const all = g.nodes.filter((n) => used.has(n.id));
  if (all.length === 0) return null;
  const byId = new Map<string, FlowNode>(all.map((n) => [n.id, n]));
  const index0 = new Map(all.map((n, i) => [n.id, i]));
  const lossOf = new Map<string, FlowNode>();
  for (const l of links) if (l.role === 'loss' && !lossOf.has(l.source) && byId.has(l.target)) lossOf.set(l.source, byId.get(l.target)!);

  // (1) d3-sankey over copies of the main flows.
  const flowIn: FlowIn[] = all
    .filter((n) => n.role !== 'loss')
    .map((n) => ({ ...n, index0: index0.get(n.id)!, ...(n.role === 'source' && n.watts > 0 ? { fixedValue: n.watts } : {}) }));
  const feedIn: FeedIn[] = links.filter((l) => l.role === 'feed' && byId.has(l.source) && byId.has(l.target)).map((l) => ({ source: l.source, target: l.target, value: l.watts, link: l }));
  // Scale, px per W: the source's pipe at most MAX_PIPE px, the widest loss branch within its column.
  const sources = flowIn.filter((n) => n.role === 'source');
  const flowMax = Math.max(...sources.map((n) => Math.abs(n.watts)), 0);
  const lossMax = Math.max(...[...lossOf.values()].map((n) => n.watts), 0);
  // `pxPerWatt` given: diagrams drawn side by side share one scale (web/components/variants/).
  const kyWanted = pxPerWatt ?? Math.min(flowMax > 0 ? MAX_PIPE / flowMax : 0, lossMax > 0 ? (COLUMN - 24) / lossMax : Infinity);
  // d3-sankey's scale is the extent's height over the busiest column's value (no padding between nodes):
  // the sources' column, since every node passes on at most what it takes in.
  const sourceTotal = sources.reduce((a, n) => a + (n.fixedValue ?? 0), 0);
  // nodeAlign(sankeyLeft): a node's column is its depth. No relaxation (iterations 0): it only moves
  // nodes up and down, and step (3) places them. The extent's width is one column: d3-sankey would
  // spread the columns over it, while here each column is COLUMN wide with a GAP after it however many
  // there are, so a node's x comes from its column (columnX(node.depth)).
  const generator = sankey<FlowIn, FeedIn>()
    .nodeId((n) => n.id)
    .nodeAlign(sankeyLeft)
    .nodeSort((a, b) => a.index0 - b.index0)
    .linkSort(null)
    .nodeWidth(COLUMN)
    .nodePadding(0)
    .iterations(0)
    .extent([
      [MARGIN.left, MARGIN.top],
      [MARGIN.left + COLUMN, MARGIN.top + Math.max(1, kyWanted * sourceTotal)],
    ]);
  const graph = generator({ nodes: flowIn, links: feedIn });
  // d3-sankey's scale, px per W (a feed's width over its value), for the pipes and the loss branches.
  const first = graph.links.find((l) => l.value > 0 && Number.isFinite(l.width));
  const ky = first ? first.width! / first.value : kyWanted;
  const pipeH = (n: SNode) => Math.max(2, (n.value ?? 0) * ky);
  const roots = graph.nodes.filter((n) => n.targetLinks!.length === 0);
  // A chain is a tree: a node's children are the targets of its feeds, in d3-sankey's order.
  const children = (n: SNode): SNode[] => n.sourceLinks!.map((l) => nodeOf(l.target)).filter((t) => nodeOf(t.targetLinks![0]!.source) === n);

  // (2) Labels and heights.
  const labelLines = new Map<string, { text: string; bold: boolean }[]>();
  const shortened = new Set<string>();
  const head = new Map<string, number>();
  const below = new Map<string, number>();
  for (const n of graph.nodes) {
    const { lines, shortened: cut } = nodeLines(n, loc, measure);
    if (cut) shortened.add(n.id);
    labelLines.set(n.id, lines);
    head.set(n.id, lines.length * LINE + 4);
    const loss = lossOf.get(n.id);
    let d = pipeH(n);
    if (loss) {
      const ll = lossLines(loss, loc, measure);
      labelLines.set(loss.id, ll);
      d += STUB + LOSS_BLOCK + 4 + ll.length * LINE;
    }
    below.set(n.id, d + PAD);
  }
  // Deepest column first, so a child's ascent is known before its parent's.
  const ascent = new Map<string, number>();
  for (const n of [...graph.nodes].sort((a, b) => b.depth! - a.depth!)) {
    const kid = children(n)[0];
    ascent.set(n.id, Math.max(head.get(n.id)!, kid ? ascent.get(kid.id)! : 0));
  }

  // (3) Subtrees top to bottom: a node's pipe sits its ascent below its subtree's top.
  // What EnergyFlow draws: a copy of each graph node with its place (d3-sankey's node objects stay its own).
  const laid = new Map<string, LaidNode>();
  const labels: NodeLabel[] = [];
  let bottom = MARGIN.top;
  // Explicit stack (a chain may hold thousands of elements in a row): each frame holds its subtree's
  // top and where its next child goes (`cursor`).
  const subtreeBottom = new Map<string, number>();
  for (const r of roots) {
    const top = bottom;
    const stack: { n: SNode; kids: SNode[]; top: number; next: number; cursor: number }[] = [];
    const enter = (n: SNode, top: number) => {
      const c = n.depth!;
      n.x0 = columnX(c);
      n.x1 = n.x0 + COLUMN;
      n.y0 = top + ascent.get(n.id)!;
      n.y1 = n.y0 + pipeH(n);
      const src = byId.get(n.id)!;
      laid.set(n.id, { ...src, index0: n.index0, column: c, x0: n.x0, y0: n.y0, x1: n.x1, y1: n.y1, idleWidth: 0 });
      const lines = labelLines.get(n.id)!;
      labels.push({ id: n.id, x: n.x0, y: n.y0 - lines.length * LINE - 4 + 11, anchor: 'start', lines, ...(shortened.has(n.id) ? { fullName: src.name } : {}) });
      const loss = lossOf.get(n.id);
      if (loss) {
        // The block at least 1 px wide; its idle part to scale.
        const w = Math.max(1, loss.watts * ky);
        const cx = n.x0 + COLUMN / 2;
        const ly0 = n.y1 + STUB;
        laid.set(loss.id, { ...loss, index0: index0.get(loss.id)!, column: c, x0: cx - w / 2, x1: cx + w / 2, y0: ly0, y1: ly0 + LOSS_BLOCK, idleWidth: (loss.idleWatts ?? 0) * ky });
        labels.push({ id: loss.id, x: cx, y: ly0 + LOSS_BLOCK + 4 + 11, anchor: 'middle', lines: labelLines.get(loss.id)! });
      }
      subtreeBottom.set(n.id, n.y0 + below.get(n.id)!);
      stack.push({ n, kids: children(n), top, next: 0, cursor: top });
    };
    enter(r, top);
    while (stack.length) {
      const f = stack[stack.length - 1]!;
      if (f.next < f.kids.length) {
        const kid = f.kids[f.next]!;
        // The first child continues its parent's flow at the same height; the others stack under it.
        const kidTop = f.next === 0 ? f.top + ascent.get(f.n.id)! - ascent.get(kid.id)! : f.cursor;
        f.next++;
        enter(kid, kidTop);
        continue;
      }
      stack.pop();
      const parent = stack[stack.length - 1];
      if (parent) {
        parent.cursor = subtreeBottom.get(f.n.id)!;
        subtreeBottom.set(parent.n.id, Math.max(subtreeBottom.get(parent.n.id)!, parent.cursor));
      }
    }
    bottom = subtreeBottom.get(r.id)!;
  }

  // (4) Branches: d3-sankey attaches the feeds to the pipes where they now are.
  generator.update(graph);
  const feedOf = new Map<FlowLink, SLink>(graph.links.map((l) => [l.link, l]));
  const laidLinks: LaidLink[] = [];
  const lossUsed = new Map<string, number>();
  for (const l of links) {
    const from = laid.get(l.source);
    const to = laid.get(l.target);
    if (!from || !to) continue;
    const key = linkKey(l);
    if (l.role === 'feed') {
      const f = feedOf.get(l)!;
      laidLinks.push({ ...l, key, width: f.width!, sx: from.x1, sy: f.y0!, tx: to.x0, ty: f.y1!, sourceNode: from, targetNode: to });
    } else {
      // Idle first (left), then conversion, side by side, centred on the loss block.
      const width = l.watts * ky;
      const left = lossUsed.get(to.id) ?? 0;
      lossUsed.set(to.id, left + width);
      const x = (to.x0 + to.x1) / 2 - (to.watts * ky) / 2 + left + width / 2;
      laidLinks.push({ ...l, key, width, sx: x, sy: from.y1, tx: x, ty: to.y0, sourceNode: from, targetNode: to });
    }
  }

  const columns = Math.max(...graph.nodes.map((n) => n.depth!)) + 1;
  const width = Math.max(minWidth, columnX(columns - 1) + COLUMN + MARGIN.right);
  // In steps: an edit that changes a tall block a little keeps the drawing's height, so the page
  // below does not move and the drawing is not laid out again as a whole (a new SVG size does).
  const height = Math.ceil((bottom - PAD + MARGIN.bottom) / HEIGHT_STEP) * HEIGHT_STEP;
  const nodes = all.map((n) => laid.get(n.id)).filter((n): n is LaidNode => n !== undefined);
  return { width, height, nodes, links: laidLinks, labels, columns };
}

/**
 * The SVG path of a branch. A loss branch: its centre line, straight down (drawn with a stroke as wide
 * as the branch). A feed branch: a ribbon filled between two curves (each a cubic Bézier with both
 * control points at mid x), as tall as the branch all along, so that a steep branch stays inside its
 * gap (a wide stroke along a steep curve would bulge over the columns beside it).
 */
export function linkPath(l: LaidLink): string {
  if (l.role === 'loss') return `M${l.sx},${l.sy}V${l.ty}`;
  const xm = (l.sx + l.tx) / 2;
  const h = Math.max(1, l.width) / 2;
  const [s0, s1, t0, t1] = [l.sy - h, l.sy + h, l.ty - h, l.ty + h];
  return `M${l.sx},${s0}C${xm},${s0},${xm},${t0},${l.tx},${t0}L${l.tx},${t1}C${xm},${t1},${xm},${s1},${l.sx},${s1}Z`;
}
