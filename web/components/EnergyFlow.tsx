/**
 * The energy-flow diagram: a Sankey of the solved chain, source on the left, loads on the right,
 * and every loss gathered in a band along the bottom ("where the energy goes" at a glance: the
 * top carries what reaches the loads, the bottom what is lost). Each loss branch is split into its
 * idle part (drawn even with nothing connected: dashed, plum) and its conversion part (grows with
 * the load). Loaded on demand (App.tsx imports it with a dynamic import()), so d3-sankey is not part
 * of the first load.
 *
 * Every figure comes from core's flowGraph(); this file draws the diagram and answers hover, tap and
 * focus. Its parts: flow-layout.ts (columns, loss band, labels that fit), flow-draw.ts (one SVG element
 * per part, written only where it changed), flow-export.ts (download name, SVG and PNG files, print
 * rules), flow-legend.tsx (legend), flow-palette.ts (colours per theme).
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
import { useCallback, useEffect, useLayoutEffect, useMemo, useRef, useState } from 'preact/hooks';
import { sankeyLinkHorizontal } from 'd3-sankey';
import { flowGraph } from '../../core/studies/index.ts';
import type { ElementResult, SolveResult } from '../../core/page.ts';
import { formatPercent, formatPower } from '../format/number.ts';
import { elementKindLabel } from '../format/labels.ts';
import { deviceDark, effectiveLocale, resolveTheme, themeChoice } from '../state/prefs.ts';
import { openCount } from '../state/editor.ts';
import { FLOW_PALETTES } from './flow-palette.ts';
import { lagOffscreen, useIdleTask, type BoxRef } from './lag.ts';
import { blockLayer, branchLayer, figureLayer, writeBlock, writeBranch, writeFigure, type BlockSpec, type BranchSpec, type FigureSpec, type PartWords, writeBlockWords, writeBranchWords } from './flow-draw.ts';
import { download, fileStem, pngBlob, PRINT_RULES, svgText } from './flow-export.ts';
import { BAND_GAP, figures, FONT, IDLE_DASH, type LaidLink, type LaidNode, layout, type LinkExtra, linkPaint, MARGIN, type NodeExtra, nodeOf, nodePaint, placeLabels, ZERO_SHARE } from './flow-layout.ts';
import { Legend } from './flow-legend.tsx';
import './EnergyFlow.css';
export { FLOW_PALETTES } from './flow-palette.ts';

/** The diagram's drawn layers (flow-draw.ts), kept between redraws. */
interface Drawn {
  branches: ReturnType<typeof branchLayer>;
  blocks: ReturnType<typeof blockLayer>;
  figures: ReturnType<typeof figureLayer>;
}

type Selection = { type: 'node'; id: string } | { type: 'link'; key: string } | null;

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
