/**
 * The energy-flow diagram: a Sankey of the solved chain, source on the left, loads on the right,
 * and every loss hanging under the stage that loses it ("where the energy goes" at a glance: the
 * flow carries what reaches the loads, the branches down what is lost). Each loss branch is split into its
 * idle part (drawn even with nothing connected: dashed, plum) and its conversion part (grows with
 * the load). Loaded on demand (App.tsx imports it with a dynamic import()), so it is not part of the
 * first load.
 *
 * Every figure comes from core's flowGraph(); this file draws the diagram and answers hover, tap and
 * focus. Its parts: flow-layout.ts (columns, pipes, losses, wrapped labels), flow-text.ts (the parts'
 * descriptions, the card's figures, the labels' widths in the page's font), flow-drawing.ts (the hook
 * that draws: the canvas handling and the idle SVG writing), flow-canvas.ts (the
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
import type { SolveResult } from '../../core/page.ts';
import { formatPercent, formatPower } from '../format/number.ts';
import { deviceDark, effectiveLocale, resolveTheme, themeChoice } from '../state/prefs.ts';
import { FLOW_PALETTES } from './flow-palette.ts';
import { lagOffscreen, type BoxRef } from './lag.ts';
import { useFlowDrawing } from './flow-drawing.ts';
import { download, fileStem, pngBlob, PRINT_RULES, svgText } from './flow-export.ts';
import { figures, FONT, layout, ZERO_SHARE } from './flow-layout.ts';
import { Legend } from './flow-legend.tsx';
import { cardContent, linkText, nodeText, pageMeasure, type Selection } from './flow-text.ts';
import './EnergyFlow.css';
export { FLOW_PALETTES } from './flow-palette.ts';

/** An open card: what it shows, the part it belongs to, and where (px from the diagram section's top left corner). */
type Card = { sel: NonNullable<Selection>; el: Element; x: number; y: number };

/** Zoom steps of the diagram (1: full size, 12 px labels). */
const ZOOMS = [0.25, 0.35, 0.5, 0.75, 1, 1.5, 2];

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

  // Drawn on the canvas before the frame is painted, the SVG over it when the page is idle (flow-drawing.ts).
  const { branchesRef, blocksRef, canvasBox, onCanvas, svgNow } = useFlowDrawing({ laid, nodeLabels, selected, palette, loc, elements, shownZoom });

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
