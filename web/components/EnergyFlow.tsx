/**
 * The energy-flow diagram: a Sankey of the solved chain, source on the left, loads on the right,
 * and every loss hanging under the stage that loses it ("where the energy goes" at a glance: the
 * flow carries what reaches the loads, the branches down what is lost). Each loss branch is split into its
 * idle part (drawn even with nothing connected: dashed, plum) and its conversion part (grows with
 * the load). Loaded on demand (App.tsx imports it with a dynamic import()), so it is not part of the
 * first load.
 *
 * Every figure comes from core's flowGraph(); this file draws the diagram and answers hover, tap and
 * focus. Its parts: flow-layout.ts (columns, pipes, losses, wrapped labels), flow-canvas.ts (the
 * drawing on screen: a canvas, drawn in the edit's frame), flow-draw.ts (one SVG element per part,
 * written only where it changed: transparent over the canvas, it carries the parts' names, focus,
 * hover and tap, and it is what the downloads and the printed page show; written when the page is
 * idle after an edit), flow-export.ts (download name, SVG and PNG files, print rules),
 * flow-legend.tsx (legend), flow-palette.ts (colours per theme).
 *
 * Layout (flow-layout.ts): one column per depth of the chain, feed branches only in the gaps between
 * columns; each source, stage and load is a straight piece of flow in its column with its label (full
 * name, wrapped, never cut) above it and its loss hanging straight down under it, loss label centred
 * under the stage. So no loss branch crosses a main flow or a label, and the losses take only the
 * height they need. Nothing is left unlabelled.
 *
 * Figures on demand: pointing at or focusing a branch or block puts its figures in the details line
 * under the diagram; tapping or clicking it, or Enter or Space on it, opens a card of its element's
 * figures (power, share of the source, loss, efficiency, current where known) right next to it,
 * scrolled into view; Escape or its Close button closes it.
 *
 * Phone: the diagram keeps its left-to-right reading (the same direction as the chain) at full size
 * (12 px labels) and pans inside its own box, at most three quarters of the screen tall (swipe, or
 * the arrow keys once the box has focus); the
 * zoom buttons shrink it to the box's width to see the whole chain, and back. A top-to-bottom layout
 * was not chosen: it helps a long series run but a board with many branches side by side would then
 * need a sideways pan anyway, and the labels would have to share a row's width; pan and zoom work
 * for deep and wide chains alike, and the card shows a tapped part's figures in full.
 *
 * Colours: the palette of the theme shown (flow-palette.ts), written as attributes with a
 * data-fill/data-stroke key beside each, so that exported SVG/PNG files are repainted with the
 * light palette (a file goes onto white paper) and the printed page gets the light palette from the
 * print rules this component writes.
 */
import { useCallback, useEffect, useLayoutEffect, useMemo, useRef, useState } from 'preact/hooks';
import { flowGraph } from '../../core/studies/index.ts';
import type { ElementResult, SolveResult } from '../../core/page.ts';
import { formatCurrent, formatPercent, formatPower, formatVoltage } from '../format/number.ts';
import { elementKindLabel } from '../format/labels.ts';
import { deviceDark, effectiveLocale, resolveTheme, themeChoice } from '../state/prefs.ts';
import { openCount } from '../state/editor.ts';
import { FLOW_PALETTES } from './flow-palette.ts';
import { lagOffscreen, useIdleTask, type BoxRef } from './lag.ts';
import { drawCanvas, fitsCanvas, pixelRatio } from './flow-canvas.ts';
import { blockLayer, branchLayer, writeBlock, writeBranch, type BlockSpec, type BranchSpec, type PartWords, writeBlockWords, writeBranchWords } from './flow-draw.ts';
import { download, fileStem, pngBlob, PRINT_RULES, svgText } from './flow-export.ts';
import { figures, FONT, IDLE_DASH, type LaidLink, type LaidNode, layout, linkPaint, linkPath, MARK, type Measure, nodePaint, roughMeasure, ZERO_SHARE } from './flow-layout.ts';
import { Legend } from './flow-legend.tsx';
import './EnergyFlow.css';
export { FLOW_PALETTES } from './flow-palette.ts';

/** The diagram's drawn layers (flow-draw.ts), kept between redraws. */
interface Drawn {
  branches: ReturnType<typeof branchLayer>;
  blocks: ReturnType<typeof blockLayer>;
}

type Selection = { type: 'node'; id: string } | { type: 'link'; key: string } | null;
/** An open card: what it shows, the part it belongs to, and where (px from the diagram section's top left corner). */
type Card = { sel: NonNullable<Selection>; el: Element; x: number; y: number };

/** Zoom steps of the diagram (1: full size, 12 px labels). */
const ZOOMS = [0.25, 0.35, 0.5, 0.75, 1, 1.5, 2];

function linkText(l: LaidLink, loc: string | undefined): string {
  const from = l.sourceNode;
  const to = l.targetNode;
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

/**
 * A card's figures: those of the element the tapped part belongs to (a block's own element, a loss's
 * element, the element a feed branch feeds), named, with what was tapped.
 */
function cardContent(sel: NonNullable<Selection>, laid: { nodes: LaidNode[]; links: LaidLink[] }, elements: Map<string, ElementResult>, sourcePower: number, loc: string | undefined) {
  let element: ElementResult | undefined;
  let what: string;
  if (sel.type === 'link') {
    const l = laid.links.find((x) => x.key === sel.key);
    if (!l) return null;
    if (l.role === 'loss') {
      element = elements.get(l.sourceNode.elementId);
      what = l.part === 'idle' ? `Idle loss branch: ${formatPower(l.watts, loc)}` : `${l.sourceNode.kind === 'cable' ? 'Loss' : 'Conversion loss'} branch: ${formatPower(l.watts, loc)}`;
    } else {
      element = elements.get(l.targetNode.elementId);
      what = `Branch from ${l.sourceNode.name}`;
    }
  } else {
    const n = laid.nodes.find((x) => x.id === sel.id);
    if (!n) return null;
    element = elements.get(n.elementId);
    what = n.role === 'loss' ? 'Its loss' : '';
  }
  if (!element) return null;
  const e = element;
  const rows: [string, string][] = [];
  const share = sourcePower !== 0 ? e.pIn / sourcePower : 0;
  rows.push([e.role === 'source' ? 'Power delivered' : e.role === 'load' ? 'Power used' : 'Power in', formatPower(e.pIn, loc)]);
  rows.push(['Share of the source', formatPercent(share, loc, 3)]);
  if (e.role !== 'load') {
    rows.push(['Power out', formatPower(e.pOut, loc)]);
    rows.push(['Loss', `${formatPower(e.loss, loc)} (${formatPercent(sourcePower !== 0 ? e.loss / sourcePower : 0, loc, 3)} of the source)${e.idleLoss ? `, idle ${formatPower(e.idleLoss, loc)}` : ''}`]);
    rows.push(['Efficiency', formatPercent(e.efficiency, loc)]);
  }
  // The current where the port carries one (a shaft carries none): what a source gives out, what the rest take in.
  const port = e.role === 'source' ? e.output : e.input;
  if (port && port.current > 0 && Number.isFinite(port.current)) {
    rows.push([e.role === 'source' ? 'Current out' : 'Current in', `${formatCurrent(port.current, loc)}${port.voltage > 0 ? ` at ${formatVoltage(port.voltage, loc)}` : ''}`]);
  }
  return { name: e.name || e.id, kind: elementKindLabel(e.kind), what, rows };
}

/** Widths of label lines in the page's own font (canvas text metrics), cached; the rough estimate without a canvas. */
function pageMeasure(): Measure {
  const ctx = typeof document !== 'undefined' ? document.createElement('canvas').getContext('2d') : null;
  if (!ctx) return roughMeasure;
  const cache = new Map<string, number>();
  let boldSet: boolean | undefined;
  return (text, bold) => {
    const key = (bold ? 'b' : 'n') + text;
    let w = cache.get(key);
    if (w === undefined) {
      // Setting the font parses it: only when it changes.
      if (boldSet !== bold) ctx.font = `${bold ? '600 ' : ''}12px ${FONT}`;
      boldSet = bold;
      // A little room kept: another font may stand in for this one in an exported file.
      w = ctx.measureText(text).width * 1.04;
      if (cache.size > 2000) cache.clear();
      cache.set(key, w);
    }
    return w;
  };
}

/** The theme the page shows now (the choice, or the device's setting). */
export function shownTheme(): 'light' | 'dark' {
  return resolveTheme(themeChoice.value, deviceDark.value);
}

function EnergyFlow({ result, box }: { result: SolveResult; box: BoxRef }) {
  const graph = useMemo(() => flowGraph(result), [result]);
  const elements = useMemo(() => new Map(result.elements.map((e) => [e.id, e])), [result]);
  const sectionRef = useRef<HTMLElement | null>(null);
  // One callback for the section: lag.ts watches it as the part's box, the card is placed in it.
  const sectionBox = useCallback(
    (el: Element | null) => {
      sectionRef.current = el as HTMLElement | null;
      box(el);
    },
    [box],
  );
  const boxRef = useRef<HTMLDivElement>(null);
  const svgRef = useRef<SVGSVGElement>(null);
  const canvasRef = useRef<HTMLCanvasElement | null>(null);
  const cardRef = useRef<HTMLDivElement>(null);
  const [boxWidth, setBoxWidth] = useState(0);
  const [selected, setSelected] = useState<Selection>(null);
  const [card, setCard] = useState<Card | null>(null);
  const [zoom, setZoom] = useState(1);
  const [exportError, setExportError] = useState<string | null>(null);
  const measure = useMemo(pageMeasure, []);
  const palette = FLOW_PALETTES[shownTheme()];
  const c = palette.colours;

  useEffect(() => {
    const box = boxRef.current;
    if (!box) return;
    const measureBox = () => setBoxWidth(box.clientWidth);
    measureBox();
    const observer = new ResizeObserver(measureBox);
    observer.observe(box);
    return () => observer.disconnect();
  }, []);
  useEffect(() => {
    setSelected(null);
    setCard(null);
  }, [result]);

  const loc = effectiveLocale();
  const laid = useMemo(() => (boxWidth > 0 ? layout(graph, boxWidth, loc, measure) : null), [graph, boxWidth, loc, measure]);
  const nodeLabels = useMemo(() => new Map((laid?.labels ?? []).map((x) => [x.id, x])), [laid]);
  const zeroLoss = graph.nodes.filter((n) => n.role === 'loss' && !(n.watts > ZERO_SHARE * Math.abs(graph.sourcePower)));
  const stem = useMemo(() => fileStem(result.projectName || 'joulepath-project'), [result.projectName]);
  const ls = graph.losses;
  const summary =
    graph.sourcePower !== 0
      ? `Losses ${figures(ls.total.watts, ls.total.percent, loc)}: idle ${figures(ls.idle.watts, ls.idle.percent, loc)}, conversion ${figures(ls.conversion.watts, ls.conversion.percent, loc)}`
      : null;
  // The zoom that fits the whole drawing in the box (never above full size).
  const fitZoom = laid ? Math.min(1, (boxWidth - 2) / laid.width) : 1;
  const shownZoom = Math.max(zoom, Math.min(fitZoom, 1));

  let details = 'Point at, tap or Tab to a branch or a block to see its figures; tap it or press Enter for all of them.';
  if (laid && selected?.type === 'link') {
    const l = laid.links.find((x) => x.key === selected.key);
    if (l) details = linkText(l, loc);
  } else if (laid && selected?.type === 'node') {
    const n = laid.nodes.find((x) => x.id === selected.id);
    if (n) details = nodeText(n, elements.get(n.elementId), loc);
  }
  const cardShown = card && laid ? cardContent(card.sel, laid, elements, graph.sourcePower, loc) : null;

  async function exportSvg() {
    if (!svgRef.current) return;
    svgNow();
    setExportError(null);
    await download(new Blob([svgText(svgRef.current, title, summary)], { type: 'image/svg+xml' }), `${stem}.svg`);
  }
  async function exportPng() {
    if (!svgRef.current) return;
    svgNow();
    setExportError(null);
    try {
      await download(await pngBlob(svgRef.current, title, summary), `${stem}.png`);
    } catch (error) {
      setExportError(`The PNG could not be made: ${error instanceof Error ? error.message : String(error)}. The SVG download still works.`);
    }
  }

  /** The part (branch or block) an event happened on, and its element. */
  const partOf = (ev: Event): { sel: NonNullable<Selection>; el: Element } | null => {
    const target = ev.target instanceof Element ? ev.target : null;
    const linkEl = target?.closest<SVGElement>('[data-link-key]');
    if (linkEl) return { sel: { type: 'link', key: linkEl.dataset['linkKey']! }, el: linkEl };
    const nodeEl = target?.closest<SVGElement>('[data-node]');
    if (nodeEl) return { sel: { type: 'node', id: nodeEl.dataset['node']! }, el: nodeEl };
    return null;
  };
  /** Hover, tap, click or focus on a branch or a block selects it (its figures go to the details line). */
  const pick = useCallback((ev: Event) => {
    const part = partOf(ev);
    if (!part) return;
    const sel = part.sel;
    // Moving the pointer within one block fires again: keep the same selection (no redraw).
    setSelected((s) => (s && s.type === sel.type && (s.type === 'link' ? s.key === (sel as { key: string }).key : s.id === (sel as { id: string }).id) ? s : sel));
  }, []);
  /** Opens the card of a part next to it: at the tap, or (keyboard) by the part's middle. */
  const openCard = (part: { sel: NonNullable<Selection>; el: Element }, at?: { x: number; y: number }) => {
    const section = sectionRef.current;
    if (!section) return;
    const s = section.getBoundingClientRect();
    const r = part.el.getBoundingClientRect();
    const x = (at ? at.x : r.left + Math.min(r.width, 120) / 2) - s.left;
    const y = (at ? at.y : r.top + Math.min(r.height, 40)) - s.top + 12;
    setSelected(part.sel);
    setCard({ sel: part.sel, el: part.el, x, y });
  };
  /** Closes the card; focus goes back to its part when it was in the card (the part stays the same element across redraws). */
  const closeCard = () => {
    if (card && cardRef.current?.contains(document.activeElement) && card.el.isConnected) (card.el as SVGElement).focus();
    setCard(null);
  };
  const onClick = (ev: MouseEvent) => {
    const part = partOf(ev);
    if (part) openCard(part, { x: ev.clientX, y: ev.clientY });
    // A tap on the drawing's background closes the card.
    else setCard(null);
  };
  const onKeyDown = (ev: KeyboardEvent) => {
    if (ev.key === 'Escape' && card) {
      closeCard();
      return;
    }
    if (ev.key !== 'Enter' && ev.key !== ' ') return;
    const part = partOf(ev);
    if (!part) return;
    ev.preventDefault();
    openCard(part);
  };
  // The card stays inside the section's width and is scrolled into view (a phone shows it whole).
  useLayoutEffect(() => {
    const el = cardRef.current;
    const section = sectionRef.current;
    if (!el || !section || !card) return;
    const left = Math.max(0, Math.min(card.x - el.offsetWidth / 2, section.clientWidth - el.offsetWidth));
    el.style.left = `${left}px`;
    el.style.top = `${card.y}px`;
    el.scrollIntoView({ block: 'nearest', inline: 'nearest' });
  }, [card, cardShown !== null]);

  const title = `Energy flow of ${result.projectName || 'the project'}`;
  // The canvas's name sums the flows; each part's own name is on the SVG's parts.
  const loadsWatts = graph.nodes.reduce((s, n) => (n.role === 'load' ? s + n.watts : s), 0);
  const canvasLabel = `${title}: the source delivers ${formatPower(graph.sourcePower, loc)}, the loads use ${formatPower(loadsWatts, loc)}${summary ? `; ${summary}` : ''}`;

  // After each render, before the frame is painted, the diagram is drawn on the canvas (flow-canvas.ts);
  // the transparent SVG over it (its parts' names, focus, hover and tap, the downloads) follows when
  // the page is next idle (flow-draw.ts: only what changed is written), at once when a part comes or
  // goes, when another project was opened, and before a download or printing. While the canvas is
  // scrolled out of view (the section's heading in view, the drawing below it) the canvas too is drawn
  // when the page is idle, or as soon as it comes into view, unless its size changes.
  const branchesRef = useRef<SVGGElement>(null);
  const blocksRef = useRef<SVGGElement>(null);
  const drawn = useRef<Drawn | null>(null);
  const scheduleSvg = useIdleTask();
  const svgPending = useRef<(() => void) | null>(null);
  /** Brings the SVG up to date now (downloads read it). */
  const svgNow = () => svgPending.current?.();
  const canvasPending = useRef<(() => void) | null>(null);
  /** Whether the canvas is on screen (from an IntersectionObserver; on screen until it reports). */
  const canvasSeen = useRef(true);
  const svgOpened = useRef(-1);
  const svgKeys = useRef('');
  const [dpr, setDpr] = useState(pixelRatio);
  // The canvas shows the drawing where it fits one at the screen's pixel density (flow-canvas.ts); else the SVG does.
  const onCanvas = laid !== null && fitsCanvas(laid.width, laid.height, shownZoom, dpr);
  // A new device pixel ratio (the browser's zoom, another screen) draws the canvas again at its density.
  useEffect(() => {
    if (typeof matchMedia !== 'function') return;
    const query = matchMedia(`(resolution: ${dpr}dppx)`);
    const changed = () => setDpr(pixelRatio());
    query.addEventListener?.('change', changed);
    return () => query.removeEventListener?.('change', changed);
  }, [dpr]);
  // The canvas element, watched while it is there: coming into view, it draws what is waiting.
  const canvasObserver = useRef<IntersectionObserver | null>(null);
  const canvasBox = useCallback((el: HTMLCanvasElement | null) => {
    canvasObserver.current?.disconnect();
    canvasObserver.current = null;
    canvasRef.current = el;
    canvasSeen.current = true;
    if (!el || typeof IntersectionObserver === 'undefined') return;
    const observer = new IntersectionObserver((entries) => {
      const seen = entries[entries.length - 1]!.isIntersecting;
      canvasSeen.current = seen;
      if (seen) canvasPending.current?.();
    });
    observer.observe(el);
    canvasObserver.current = observer;
  }, []);
  useLayoutEffect(() => {
    if (!laid || !branchesRef.current || !blocksRef.current) return;
    const d = (drawn.current ??= { branches: branchLayer(), blocks: blockLayer() });
    const branchesEl = branchesRef.current;
    const blocksEl = blocksRef.current;
    const branches = laid.links.map((l): BranchSpec => {
      const paint = linkPaint(l, l.sourceNode.kind);
      const isSel = selected?.type === 'link' && selected.key === l.key;
      const isLoss = l.role === 'loss';
      return {
        key: l.key,
        d: linkPath(l),
        paint: isSel ? 'selected' : paint,
        colour: isSel ? c.selected : c[paint],
        opacityKey: isLoss ? 'loss' : 'feed',
        opacity: isLoss ? palette.lossOpacity : palette.feedOpacity,
        width: Math.max(1, l.width),
        dash: l.part === 'idle' && l.width >= 2 ? IDLE_DASH : undefined,
        role: l.role,
        part: l.part,
        ribbon: !isLoss,
        source: l.sourceNode.id,
        target: l.targetNode.id,
        selected: isSel,
      };
    });
    const blocks = laid.nodes.map((n): BlockSpec => {
      const paint = nodePaint(n);
      const rect = { x: n.x0, y: n.y0, w: n.x1 - n.x0, h: Math.max(2, n.y1 - n.y0) };
      const isLoss = n.role === 'loss';
      // A pipe carries its role's mark where the flow enters it (a load's where it ends); a loss block its idle part on the left.
      const top = isLoss
        ? n.idleWidth > 0
          ? { x: n.x0, y: n.y0, w: n.idleWidth, h: rect.h, paint: 'idle' }
          : undefined
        : { x: n.role === 'load' ? n.x1 - MARK : n.x0, y: n.y0, w: MARK, h: rect.h, paint };
      return {
        id: n.id,
        role: n.role,
        rect,
        paint: isLoss ? paint : 'feed',
        opacity: isLoss ? undefined : { key: 'feed', value: palette.feedOpacity },
        top,
        colours: { fill: isLoss ? c[paint] : c.feed, top: isLoss ? c.idle : c[paint], selected: c.selected, ink: c.ink, inkMuted: c.inkMuted, background: c.background },
        text: nodeLabels.get(n.id),
        selected: selected?.type === 'node' && selected.id === n.id,
      };
    });
    const canvas = canvasRef.current;
    const scene = { width: laid.width, height: laid.height, background: c.background, branches, blocks, zoom: shownZoom };
    canvasPending.current = null;
    const paint = () => {
      canvasPending.current = null;
      if (canvas?.isConnected) drawCanvas(canvas, scene);
    };

    // The SVG's parts with their accessible names (with their figures) and the branches' watts.
    const svg = () => {
      svgPending.current = null;
      d.branches.draw(branchesEl, branches, (s) => s.key, writeBranch);
      d.blocks.draw(blocksEl, blocks, (s) => s.id, writeBlock);
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
    const keys = laid.links.map((l) => l.key).join('|') + '||' + laid.nodes.map((n) => n.id).join('|');
    const fresh = keys !== svgKeys.current || opened !== svgOpened.current;
    if (canvas) {
      // Drawn at once when on screen, new, or of another size (the page below it moves in this frame, as it always did).
      if (canvasSeen.current || fresh || canvas.style.width !== `${laid.width * shownZoom}px` || canvas.style.height !== `${laid.height * shownZoom}px`) paint();
      else canvasPending.current = paint;
    }
    svgPending.current = svg;
    // Without the canvas (a drawing too large for one) the SVG is what is seen: written at once.
    if (fresh || !canvas) {
      svgKeys.current = keys;
      svgOpened.current = opened;
      svg();
    }
    if (svgPending.current || canvasPending.current)
      scheduleSvg(() => {
        canvasPending.current?.();
        svgPending.current?.();
      });
  }, [laid, nodeLabels, selected, palette, loc, elements, shownZoom, dpr]);

  const zoomStep = (dir: 1 | -1) => {
    const steps = dir > 0 ? ZOOMS.filter((z) => z > shownZoom + 1e-6) : ZOOMS.filter((z) => z < shownZoom - 1e-6).reverse();
    setZoom(steps[0] ?? (dir > 0 ? ZOOMS[ZOOMS.length - 1]! : Math.min(fitZoom, ZOOMS[0]!)));
  };
  const wide = laid !== null && laid.width > boxWidth + 1;
  // The zoom buttons: while the drawing is wider than its box, or shown at another size (so it can be set back).
  const zoomable = laid !== null && (wide || shownZoom !== 1);

  return (
    <section
      class="flow print-keep"
      aria-labelledby="flow-heading"
      data-testid="energy-flow"
      ref={sectionBox}
    >
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
      {zoomable && (
        <div class="flow__zoom flow__screen-only" role="group" aria-label="Diagram size">
          <button type="button" class="flow__button" onClick={() => zoomStep(-1)} disabled={shownZoom <= fitZoom + 1e-6} data-testid="flow-zoom-out" aria-label="Zoom out">
            −
          </button>
          <button type="button" class="flow__button" onClick={() => zoomStep(1)} disabled={shownZoom >= ZOOMS[ZOOMS.length - 1]! - 1e-6} data-testid="flow-zoom-in" aria-label="Zoom in">
            +
          </button>
          <button type="button" class="flow__button" onClick={() => setZoom(shownZoom < 1 ? 1 : fitZoom)} data-testid="flow-zoom-fit">
            {shownZoom < 1 ? 'Full size' : 'Whole chain'}
          </button>
          <span class="flow__zoom-level" aria-live="polite">
            {formatPercent(shownZoom, loc, 2)}
          </span>
        </div>
      )}
      <div
        class="flow__box"
        ref={boxRef}
        data-testid="flow-box"
        style={{ background: c.background }}
        // Focusable so the pan on a narrow screen also works from the keyboard (arrow keys).
        tabIndex={0}
        role="region"
        aria-label="Energy-flow diagram (pans on narrow screens; zoom buttons above)"
        // One set of handlers for every branch and block (they carry their key in data-*), so a
        // redraw after an edit does not hand each of them new functions. On this box, not on the
        // <svg>: Chromium makes an SVG element with a focus listener focusable itself.
        onPointerOver={pick}
        onClick={onClick}
        onKeyDown={onKeyDown}
        onFocusIn={pick}
      >
        {graph.sourcePower === 0 && <p class="note">The source delivers nothing in this project, so there is no flow to draw.</p>}
        {laid && graph.sourcePower !== 0 && onCanvas && (
          // The drawing a person sees (flow-canvas.ts); its size is set where it is drawn.
          <canvas ref={canvasBox} class="flow__canvas" role="img" aria-label={canvasLabel} data-testid="flow-canvas" />
        )}
        {laid && graph.sourcePower !== 0 && (
          <svg
            ref={svgRef}
            xmlns="http://www.w3.org/2000/svg"
            class={onCanvas ? 'flow__svg' : 'flow__svg flow__svg--shown'}
            width={laid.width}
            height={laid.height}
            style={shownZoom !== 1 ? { width: `${laid.width * shownZoom}px`, height: `${laid.height * shownZoom}px` } : undefined}
            viewBox={`0 0 ${laid.width} ${laid.height}`}
            role="group"
            aria-label={title}
            font-family={FONT}
            data-testid="flow-svg"
          >
            <title>{title}</title>
            <rect x="0" y="0" width={laid.width} height={laid.height} fill={c.background} data-fill="background" />
            {/* Branches, blocks and labels: drawn by the layout effect above (flow-draw.ts). */}
            <g fill="none" ref={branchesRef} />
            <g ref={blocksRef} />
          </svg>
        )}
      </div>
      {wide && (
        <p class="note flow__screen-only" data-testid="flow-scroll-hint">
          The whole chain is wider than this screen: swipe the diagram sideways to follow it to the loads, or use “Whole chain” to see all of it.
        </p>
      )}
      <p class="flow__details" aria-live="polite" data-testid="flow-details">
        {details}
      </p>
      {card && cardShown && (
        <div
          class="flow__card flow__screen-only"
          ref={cardRef}
          role="group"
          aria-label={`Figures of ${cardShown.name}`}
          data-testid="flow-card"
          onKeyDown={(ev) => ev.key === 'Escape' && closeCard()}
        >
          <div class="flow__card-head">
            <strong>{cardShown.name}</strong>
            <button type="button" class="flow__card-close" onClick={closeCard} aria-label="Close the figures">
              ×
            </button>
          </div>
          <p class="flow__card-kind">
            {cardShown.kind}
            {cardShown.what ? ` · ${cardShown.what}` : ''}
          </p>
          <dl>
            {cardShown.rows.map(([k, v]) => (
              <div key={k}>
                <dt>{k}</dt>
                <dd>{v}</dd>
              </div>
            ))}
          </dl>
        </div>
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
