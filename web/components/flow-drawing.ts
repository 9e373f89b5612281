/**
 * How the energy-flow diagram reaches the screen (EnergyFlow.tsx lays it out and calls this hook): the
 * canvas (flow-canvas.ts), drawn before the frame is painted, watched while scrolled out of view and drawn
 * again at a new pixel density; and the transparent SVG over it (flow-draw.ts: its parts' names, focus,
 * hover and tap, the downloads), written when the page is next idle, only where it changed.
 */
import { useCallback, useEffect, useLayoutEffect, useRef, useState } from 'preact/hooks';
import type { ElementResult } from '../../core/page.ts';
import { openCount } from '../state/editor.ts';
import type { FlowPalette } from './flow-palette.ts';
import { useIdleTask } from './lag.ts';
import { drawCanvas, fitsCanvas, pixelRatio } from './flow-canvas.ts';
import { blockLayer, branchLayer, writeBlock, writeBranch, type BlockSpec, type BranchSpec, type PartWords, writeBlockWords, writeBranchWords } from './flow-draw.ts';
import { IDLE_DASH, type Layout, linkPaint, linkPath, MARK, nodePaint } from './flow-layout.ts';
import { linkText, nodeText, type Selection } from './flow-text.ts';

/** The diagram's drawn layers (flow-draw.ts), kept between redraws. */
interface Drawn {
  branches: ReturnType<typeof branchLayer>;
  blocks: ReturnType<typeof blockLayer>;
}

export interface FlowDrawingInput {
  laid: Layout | null;
  nodeLabels: Map<string, Layout['labels'][number]>;
  selected: Selection;
  palette: FlowPalette;
  loc: string | undefined;
  elements: Map<string, ElementResult>;
  shownZoom: number;
}

/**
 * Draws the laid-out diagram; returns the refs of the SVG's two layers, the canvas's ref callback, whether
 * the canvas shows the drawing (else the SVG does) and `svgNow`, which brings the SVG up to date at once.
 */
export function useFlowDrawing({ laid, nodeLabels, selected, palette, loc, elements, shownZoom }: FlowDrawingInput) {
  const c = palette.colours;
  const canvasRef = useRef<HTMLCanvasElement | null>(null);
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

  return { branchesRef, blocksRef, canvasBox, onCanvas, svgNow };
}
