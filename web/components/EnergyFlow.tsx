/**
 * The energy-flow diagram: a Sankey of the solved chain, source on the left, loads on the right,
 * a loss branch leaving the source and every stage. Loaded on demand (App.tsx imports it with a
 * dynamic import()), so d3-sankey is not part of the first load.
 *
 * Every figure comes from core's flowGraph(); this file lays out, colours and formats.
 *
 * Phone layout: the diagram keeps its left-to-right reading (the same direction as the chain) and
 * scrolls sideways inside its own box when the columns do not fit; squeezing the columns to 390 px
 * would make the labels unreadable, and a vertical Sankey would read against the rest of the app.
 * Every node and link is also reachable by Tab and by tap, and the details line under the diagram
 * repeats the figures in full, so nothing depends on seeing a small label.
 *
 * Colours are written as attributes (not CSS) so an exported SVG or PNG looks exactly as on screen.
 */
import { useEffect, useMemo, useRef, useState } from 'preact/hooks';
import { sankey, sankeyLinkHorizontal, type SankeyLink, type SankeyNode } from 'd3-sankey';
import { flowGraph, type FlowGraph, type FlowLink, type FlowNode } from '../../core/flow.ts';
import type { ElementResult, SolveResult } from '../../core/result.ts';
import { formatPercent, formatPower } from '../format/number.ts';
import { elementKindLabel } from '../format/labels.ts';
import { effectiveLocale } from '../state/prefs.ts';
import './EnergyFlow.css';

/** Our palette: deep teal for power that flows on, vermilion for converter/source loss, ochre for line loss. */
export const FLOW_COLOURS = {
  background: '#ffffff',
  ink: '#17201d',
  inkMuted: '#45524c',
  feed: '#2a7f8f',
  stageLoss: '#d2452b',
  lineLoss: '#b27a00',
  source: '#12433b',
  stage: '#3c5a66',
  load: '#2f6b2a',
  selected: '#1f6feb',
} as const;

const FONT = "system-ui, -apple-system, 'Segoe UI', Roboto, 'Noto Sans', sans-serif";
const NODE_WIDTH = 14;
const NODE_PADDING = 40;
/** Width given to one column of the diagram, px (labels sit in the gap to the next column). */
const COLUMN_WIDTH = 150;
/** Room to the right of the last column for the loads' labels, px. */
const RIGHT_LABELS = 150;
const MARGIN = { top: 30, right: 12, bottom: 16, left: 12 };
/** A link narrower than this (px) gets no label on it; its figures are on hover, tap and focus. */
const LABEL_MIN_WIDTH = 15;
/** Links carrying less than this share of the source power are not drawn (e.g. a stiff source's 0 W loss). */
const ZERO_SHARE = 1e-9;

type NodeExtra = FlowNode & { index0: number };
type LinkExtra = FlowLink & { key: string; value: number };
type LaidNode = SankeyNode<NodeExtra, LinkExtra>;
type LaidLink = SankeyLink<NodeExtra, LinkExtra>;

/** The file name stem for downloads: the project's name in lower case, words joined by dashes. */
export function fileStem(projectName: string): string {
  const stem = projectName
    .normalize('NFKD')
    .replace(/[\u0300-\u036f]/g, '')
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, '-')
    .replace(/^-+|-+$/g, '')
    .slice(0, 60);
  return `${stem || 'joulepath-project'}-energy-flow`;
}

/** Which links are drawn: everything that carries power (zero branches would be invisible slivers). */
function drawnLinks(g: FlowGraph): FlowLink[] {
  const floor = ZERO_SHARE * Math.abs(g.sourcePower);
  return g.links.filter((l) => l.watts > floor);
}

function lossColour(kind: FlowNode['kind']): string {
  return kind === 'cable' ? FLOW_COLOURS.lineLoss : FLOW_COLOURS.stageLoss;
}

function nodeColour(n: FlowNode): string {
  if (n.role === 'loss') return lossColour(n.kind);
  if (n.role === 'source') return FLOW_COLOURS.source;
  if (n.role === 'load') return FLOW_COLOURS.load;
  return FLOW_COLOURS.stage;
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
}

function layout(g: FlowGraph, minWidth: number): Layout | null {
  const links = drawnLinks(g);
  const used = new Set(links.flatMap((l) => [l.source, l.target]));
  // Copies: d3-sankey writes its layout into the objects it is given.
  const nodes: NodeExtra[] = g.nodes.filter((n) => used.has(n.id)).map((n, index0) => ({ ...n, index0 }));
  if (nodes.length === 0) return null;
  const linkCopies: LinkExtra[] = links.map((l) => ({ ...l, key: `${l.source}→${l.target}`, value: l.watts }));

  // Columns and rows before the real layout: the column count sets the width, the busiest column the height.
  const depth = new Map<string, number>();
  for (const n of nodes) if (n.role === 'source') depth.set(n.id, 0);
  for (const l of linkCopies) depth.set(l.target, (depth.get(l.source) ?? 0) + 1);
  const columns = Math.max(...depth.values()) + 1;
  const perColumn = new Map<number, number>();
  for (const n of nodes) {
    const c = n.role === 'load' ? columns - 1 : (depth.get(n.id) ?? 0);
    perColumn.set(c, (perColumn.get(c) ?? 0) + 1);
  }
  const busiest = Math.max(...perColumn.values());
  const width = Math.max(minWidth, MARGIN.left + (columns - 1) * COLUMN_WIDTH + NODE_WIDTH + RIGHT_LABELS + MARGIN.right);
  const height = Math.max(280, busiest * (NODE_PADDING + 22) + 120);

  const generator = sankey<NodeExtra, LinkExtra>()
    .nodeId((n) => n.id)
    .nodeWidth(NODE_WIDTH)
    .nodePadding(NODE_PADDING)
    // Loads at the right edge; a loss node in the column after the element that loses the power.
    .nodeAlign((n, count) => (n.role === 'load' ? count - 1 : (n.depth ?? 0)))
    // Within a column: the chain's own order, loss nodes below the power that flows on.
    .nodeSort((a, b) => Number(a.role === 'loss') - Number(b.role === 'loss') || a.index0 - b.index0)
    .extent([
      [MARGIN.left, MARGIN.top],
      [width - MARGIN.right - RIGHT_LABELS, height - MARGIN.bottom],
    ]);
  const laid = generator({ nodes, links: linkCopies });
  return { width, height, nodes: laid.nodes, links: laid.links, columns };
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

interface NodeLabel {
  id: string;
  x: number;
  y: number;
  anchor: 'start' | 'end';
  name: string;
  /** Figures line (sinks only: a stage's figures are on the link that feeds it). */
  figures?: string;
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
 * a load or loss block gets its name and figures beside it. Link labels go on links wide enough to
 * hold the text, at the first point along the link (middle first) where they hit no other label;
 * a link with no such point keeps its figures for hover, tap and focus.
 */
function placeLabels(l: Layout, loc: string | undefined): { nodes: NodeLabel[]; links: LinkLabel[] } {
  const nodes: NodeLabel[] = l.nodes.map((n) => {
    const x0 = n.x0 ?? 0;
    const x1 = n.x1 ?? 0;
    const y0 = n.y0 ?? 0;
    const y1 = n.y1 ?? 0;
    if (n.role === 'source' || n.role === 'stage') {
      const name = shorten(n.name, 19);
      const y = y0 - 7;
      return { id: n.id, x: x0, y, anchor: 'start', name, box: { x0, y0: y - 12, x1: x0 + textWidth(name, true), y1: y + 3 } };
    }
    // Every sink is labelled to its right: in the gap before the next column, or in the room kept after the last.
    const x = x1 + 6;
    const y = (y0 + y1) / 2;
    const name = n.role === 'loss' ? `Loss: ${shorten(n.name, 14)}` : shorten(n.name, 19);
    const fig = figures(n.watts, n.percent, loc);
    const w = Math.max(textWidth(name, true), textWidth(fig));
    return { id: n.id, x, y, anchor: 'start', name, figures: fig, box: { x0: x, y0: y - 16, x1: x + w, y1: y + 14 } };
  });
  const placed: Box[] = [...nodes.map((n) => n.box), ...l.nodes.map((n) => ({ x0: n.x0 ?? 0, y0: n.y0 ?? 0, x1: n.x1 ?? 0, y1: n.y1 ?? 0 }))];
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
  return { nodes, links };
}

type Selection = { type: 'node'; id: string } | { type: 'link'; key: string } | null;

function nodeOf(x: LaidLink['source']): LaidNode {
  return x as LaidNode;
}

function linkText(l: LaidLink, loc: string | undefined): string {
  const from = nodeOf(l.source);
  const to = nodeOf(l.target);
  if (l.role === 'loss') return `Loss in ${from.name}: ${figures(l.watts, l.percent, loc)} of the source power`;
  return `${from.name} to ${to.name}: ${figures(l.watts, l.percent, loc)} of the source power`;
}

function nodeText(n: LaidNode, element: ElementResult | undefined, loc: string | undefined): string {
  if (n.role === 'loss') return `Loss in ${n.name}: ${figures(n.watts, n.percent, loc)} of the source power`;
  if (!element) return `${n.name}: ${figures(n.watts, n.percent, loc)}`;
  const kind = elementKindLabel(element.kind);
  if (n.role === 'load') return `${n.name} (${kind}, load): uses ${figures(element.pIn, n.percent, loc)} of the source power`;
  const what = n.role === 'source' ? 'delivers' : 'takes in';
  return (
    `${n.name} (${kind}): ${what} ${figures(element.pIn, n.percent, loc)} of the source power, gives out ${formatPower(element.pOut, loc)}, ` +
    `loses ${formatPower(element.loss, loc)}, efficiency ${formatPercent(element.efficiency, loc)}`
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

/** The diagram as standalone SVG text (focus outlines and page-only attributes removed). */
const EXPORT_HEADER = 52;

function svgText(svg: SVGSVGElement, title: string): string {
  const NS = 'http://www.w3.org/2000/svg';
  const copy = svg.cloneNode(true) as SVGSVGElement;
  copy.querySelectorAll('[tabindex]').forEach((el) => el.removeAttribute('tabindex'));
  copy.querySelectorAll('[data-selected]').forEach((el) => el.removeAttribute('data-selected'));
  copy.removeAttribute('class');
  copy.setAttribute('xmlns', NS);
  // A file stands alone: a heading and the colour key above the diagram.
  const width = Number(svg.getAttribute('width'));
  const height = Number(svg.getAttribute('height')) + EXPORT_HEADER;
  copy.setAttribute('height', String(height));
  copy.setAttribute('viewBox', `0 0 ${width} ${height}`);
  const body = copy.ownerDocument.createElementNS(NS, 'g');
  body.setAttribute('transform', `translate(0 ${EXPORT_HEADER})`);
  for (const child of [...copy.childNodes]) if ((child as Element).localName !== 'title') body.append(child);
  const head = copy.ownerDocument.createElementNS(NS, 'g');
  const bg = copy.ownerDocument.createElementNS(NS, 'rect');
  Object.entries({ x: '0', y: '0', width: String(width), height: String(height), fill: FLOW_COLOURS.background }).forEach(([k, v]) => bg.setAttribute(k, v));
  const heading = copy.ownerDocument.createElementNS(NS, 'text');
  Object.entries({ x: '12', y: '22', 'font-size': '15', 'font-weight': '700', fill: FLOW_COLOURS.ink }).forEach(([k, v]) => heading.setAttribute(k, v));
  heading.textContent = title;
  head.append(bg, heading);
  let x = 12;
  for (const item of LEGEND) {
    const sw = copy.ownerDocument.createElementNS(NS, 'rect');
    Object.entries({ x: String(x), y: '33', width: '18', height: '9', rx: '2', fill: item.colour }).forEach(([k, v]) => sw.setAttribute(k, v));
    const t = copy.ownerDocument.createElementNS(NS, 'text');
    Object.entries({ x: String(x + 24), y: '42', 'font-size': '11', fill: FLOW_COLOURS.inkMuted }).forEach(([k, v]) => t.setAttribute(k, v));
    t.textContent = item.label;
    head.append(sw, t);
    x += 24 + item.label.length * 6.2 + 18;
  }
  copy.append(head, body);
  return `<?xml version="1.0" encoding="UTF-8"?>\n${new XMLSerializer().serializeToString(copy)}`;
}

/** The SVG drawn onto a canvas at twice its size, as a PNG. */
async function pngBlob(svg: SVGSVGElement, title: string): Promise<Blob> {
  const width = Number(svg.getAttribute('width'));
  const height = Number(svg.getAttribute('height')) + EXPORT_HEADER;
  const url = URL.createObjectURL(new Blob([svgText(svg, title)], { type: 'image/svg+xml' }));
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
    ctx.fillStyle = FLOW_COLOURS.background;
    ctx.fillRect(0, 0, canvas.width, canvas.height);
    ctx.drawImage(img, 0, 0, canvas.width, canvas.height);
    return await new Promise<Blob>((resolve, reject) =>
      canvas.toBlob((b) => (b ? resolve(b) : reject(new Error('the canvas gave no PNG'))), 'image/png'),
    );
  } finally {
    URL.revokeObjectURL(url);
  }
}

const LEGEND = [
  { colour: FLOW_COLOURS.feed, label: 'Power passed on' },
  { colour: FLOW_COLOURS.stageLoss, label: 'Loss in the source or a converter' },
  { colour: FLOW_COLOURS.lineLoss, label: 'Loss in a cable' },
] as const;

function Legend() {
  const items = LEGEND;
  return (
    <ul class="flow__legend">
      {items.map((i) => (
        <li key={i.label}>
          <span class="flow__swatch" style={{ background: i.colour }} aria-hidden="true" />
          {i.label}
        </li>
      ))}
    </ul>
  );
}

export default function EnergyFlow({ result }: { result: SolveResult }) {
  const graph = useMemo(() => flowGraph(result), [result]);
  const elements = useMemo(() => new Map(result.elements.map((e) => [e.id, e])), [result]);
  const boxRef = useRef<HTMLDivElement>(null);
  const svgRef = useRef<SVGSVGElement>(null);
  const [boxWidth, setBoxWidth] = useState(0);
  const [selected, setSelected] = useState<Selection>(null);
  const [exportError, setExportError] = useState<string | null>(null);

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
  const zeroLoss = graph.nodes.filter((n) => n.role === 'loss' && !(n.watts > ZERO_SHARE * Math.abs(graph.sourcePower)));
  const stem = fileStem(result.projectName || 'joulepath-project');

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
    await download(new Blob([svgText(svgRef.current, title)], { type: 'image/svg+xml' }), `${stem}.svg`);
  }
  async function exportPng() {
    if (!svgRef.current) return;
    setExportError(null);
    try {
      await download(await pngBlob(svgRef.current, title), `${stem}.png`);
    } catch (error) {
      setExportError(`The PNG could not be made: ${error instanceof Error ? error.message : String(error)}. The SVG download still works.`);
    }
  }

  const path = sankeyLinkHorizontal<NodeExtra, LinkExtra>();
  const title = `Energy flow of ${result.projectName || 'the project'}`;

  return (
    <section class="flow" aria-labelledby="flow-heading" data-testid="energy-flow">
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
      <Legend />
      <div
        class="flow__box"
        ref={boxRef}
        data-testid="flow-box"
        // Focusable so the sideways scroll on a narrow screen also works from the keyboard.
        tabIndex={0}
        role="region"
        aria-label="Energy-flow diagram (scrolls sideways on narrow screens)"
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
          >
            <title>{title}</title>
            <rect x="0" y="0" width={laid.width} height={laid.height} fill={FLOW_COLOURS.background} />
            <g fill="none">
              {laid.links.map((l) => {
                const colour = l.role === 'loss' ? lossColour(nodeOf(l.source).kind) : FLOW_COLOURS.feed;
                const isSel = selected?.type === 'link' && selected.key === l.key;
                const text = linkText(l, loc);
                return (
                  <path
                    key={l.key}
                    d={path(l) ?? ''}
                    stroke={isSel ? FLOW_COLOURS.selected : colour}
                    stroke-opacity={isSel ? 0.75 : 0.5}
                    stroke-width={Math.max(1, l.width ?? 1)}
                    class="flow__link"
                    tabIndex={0}
                    role="img"
                    aria-label={text}
                    data-role={l.role}
                    data-source={nodeOf(l.source).id}
                    data-target={nodeOf(l.target).id}
                    data-watts={String(l.watts)}
                    data-selected={isSel ? 'true' : undefined}
                    onPointerEnter={() => setSelected({ type: 'link', key: l.key })}
                    onClick={() => setSelected({ type: 'link', key: l.key })}
                    onFocus={() => setSelected({ type: 'link', key: l.key })}
                  />
                );
              })}
            </g>
            <g>
              {laid.nodes.map((n) => {
                const x0 = n.x0 ?? 0;
                const x1 = n.x1 ?? 0;
                const y0 = n.y0 ?? 0;
                const y1 = n.y1 ?? 0;
                const isSel = selected?.type === 'node' && selected.id === n.id;
                const label = labels?.nodes.find((x) => x.id === n.id);
                const text = nodeText(n, elements.get(n.elementId), loc);
                return (
                  <g
                    key={n.id}
                    class="flow__node"
                    tabIndex={0}
                    role="img"
                    aria-label={text}
                    data-node={n.id}
                    data-role={n.role}
                    data-selected={isSel ? 'true' : undefined}
                    onPointerEnter={() => setSelected({ type: 'node', id: n.id })}
                    onClick={() => setSelected({ type: 'node', id: n.id })}
                    onFocus={() => setSelected({ type: 'node', id: n.id })}
                  >
                    <rect
                      x={x0}
                      y={y0}
                      width={x1 - x0}
                      height={Math.max(2, y1 - y0)}
                      fill={nodeColour(n)}
                      stroke={isSel ? FLOW_COLOURS.selected : 'none'}
                      stroke-width={isSel ? 3 : 0}
                    />
                    {label && (
                      <text
                        x={label.x}
                        y={label.y}
                        text-anchor={label.anchor}
                        font-size="12"
                        fill={FLOW_COLOURS.ink}
                        stroke={FLOW_COLOURS.background}
                        stroke-width="3"
                        stroke-linejoin="round"
                        paint-order="stroke"
                      >
                        <tspan x={label.x} dy={label.figures ? '-0.2em' : '0'} font-weight="600">
                          {label.name}
                        </tspan>
                        {label.figures && (
                          <tspan x={label.x} dy="1.2em" fill={FLOW_COLOURS.inkMuted}>
                            {label.figures}
                          </tspan>
                        )}
                      </text>
                    )}
                  </g>
                );
              })}
            </g>
            <g>
              {labels?.links.map((t) => (
                <text
                  key={`label-${t.key}`}
                  x={t.x}
                  y={t.y}
                  dy="0.35em"
                  text-anchor="middle"
                  font-size="12"
                  font-weight="600"
                  fill={FLOW_COLOURS.ink}
                  stroke={FLOW_COLOURS.background}
                  stroke-width="3"
                  stroke-linejoin="round"
                  paint-order="stroke"
                  pointer-events="none"
                  data-link={t.key}
                >
                  {t.text}
                </text>
              ))}
            </g>
          </svg>
        )}
      </div>
      {laid && laid.width > boxWidth + 1 && (
        <p class="note" data-testid="flow-scroll-hint">
          The whole chain is wider than this screen: swipe the diagram sideways to follow it to the loads.
        </p>
      )}
      <p class="flow__details" aria-live="polite" data-testid="flow-details">
        {details}
      </p>
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
        Branch widths are to scale with real power; per cent figures are shares of the power the source delivers.
      </p>
    </section>
  );
}
