/**
 * The energy-flow diagram as the screen shows it: drawn on a <canvas> from the same parts the SVG
 * is written from (flow-draw.ts's BranchSpec and BlockSpec: the layout of flow-layout.ts in the
 * palette of the theme shown, with the selection), device-pixel-ratio aware.
 *
 * Why a canvas: after an edit nearly every label of the diagram changes (every share of the source
 * power does), and in an SVG each changed label is laid out again as text and the drawing is
 * painted with the page around it. A canvas is one replaced element: its drawing is a few
 * script calls, and changing it lays out nothing and leaves the rest of the page's paint alone.
 * The SVG stays (EnergyFlow.tsx): laid over the canvas, transparent, it carries the parts'
 * accessible names, keyboard focus, hover and tap (each part is an element of its own), and it is
 * what the SVG/PNG downloads and the printed page are made from (flow-export.ts).
 */
import type { BlockSpec, BranchSpec } from './flow-draw.ts';
import { FONT, IDLE_DASH, LINE } from './flow-layout.ts';

/** What one drawing of the diagram holds. */
export interface CanvasScene {
  /** The drawing's own size, CSS px at full size. */
  width: number;
  height: number;
  background: string;
  branches: readonly BranchSpec[];
  blocks: readonly BlockSpec[];
  /** The shown zoom (1: full size). */
  zoom: number;
}

/** The most pixels the canvas holds, and on a side (a browser's canvas has limits, and memory). */
const MAX_PIXELS = 16e6;
const MAX_SIDE = 16384;

/** The device pixel ratio (1 where none is known). */
export const pixelRatio = (): number => (typeof devicePixelRatio === 'number' && devicePixelRatio > 0 ? devicePixelRatio : 1);

/**
 * Whether a drawing of this size (CSS px at full size) fits a canvas at this zoom and pixel ratio.
 * One that does not (a chain of hundreds of elements, or a large one zoomed in on a dense screen)
 * is shown by its SVG itself, which has no such limit (EnergyFlow.tsx).
 */
export function fitsCanvas(width: number, height: number, zoom: number, dpr: number): boolean {
  const s = zoom * dpr;
  return width * s <= MAX_SIDE && height * s <= MAX_SIDE && width * height * s * s <= MAX_PIXELS;
}

const DASH = IDLE_DASH.split(' ').map(Number);

/** Path2D of a branch's SVG path, kept while its path text stays the same. */
const paths = new Map<string, Path2D>();
function pathOf(d: string): Path2D {
  let p = paths.get(d);
  if (!p) {
    if (paths.size > 4000) paths.clear();
    p = new Path2D(d);
    paths.set(d, p);
  }
  return p;
}

/**
 * Draws `scene` on `canvas`: sets its CSS size (the drawing's size at the zoom) and its pixel size
 * (times the device pixel ratio), then the background, branches, blocks and labels in the SVG's
 * order (branches under blocks, each label over its block with a halo in the background colour).
 */
export function drawCanvas(canvas: HTMLCanvasElement, scene: CanvasScene): void {
  const cssW = scene.width * scene.zoom;
  const cssH = scene.height * scene.zoom;
  const dpr = pixelRatio();
  // At most the canvas's limits (EnergyFlow.tsx shows the SVG instead where the drawing does not fit at full density).
  const scale = Math.min(dpr * scene.zoom, Math.sqrt(MAX_PIXELS / Math.max(1, scene.width * scene.height)), MAX_SIDE / Math.max(1, scene.width, scene.height));
  const pxW = Math.max(1, Math.round(scene.width * scale));
  const pxH = Math.max(1, Math.round(scene.height * scale));
  // Sizes only when they change: a new pixel size clears and reallocates the canvas, a new CSS size lays out the page.
  if (canvas.width !== pxW) canvas.width = pxW;
  if (canvas.height !== pxH) canvas.height = pxH;
  const w = `${cssW}px`;
  const h = `${cssH}px`;
  if (canvas.style.width !== w) canvas.style.width = w;
  if (canvas.style.height !== h) canvas.style.height = h;
  const ctx = canvas.getContext('2d');
  if (!ctx) return;
  ctx.setTransform(pxW / scene.width, 0, 0, pxH / scene.height, 0, 0);
  ctx.globalAlpha = 1;
  ctx.fillStyle = scene.background;
  ctx.fillRect(0, 0, scene.width, scene.height);

  // Branches: a feed branch is a filled ribbon, a loss branch a stroked line as wide as its power (flow-draw.ts's writeBranch).
  for (const b of scene.branches) {
    const p = pathOf(b.d);
    if (b.ribbon) {
      ctx.globalAlpha = b.opacity;
      ctx.fillStyle = b.colour;
      ctx.fill(p);
      // The selected ribbon shows an outline (the SVG's focus outline is drawn here, the SVG being transparent).
      if (b.selected) {
        ctx.globalAlpha = 1;
        ctx.strokeStyle = b.colour;
        ctx.lineWidth = 3;
        ctx.setLineDash([]);
        ctx.stroke(p);
      }
    } else {
      ctx.globalAlpha = b.opacity;
      ctx.strokeStyle = b.colour;
      ctx.lineWidth = b.width;
      ctx.lineCap = 'butt';
      ctx.setLineDash(b.dash ? DASH : []);
      ctx.stroke(p);
    }
  }
  ctx.globalAlpha = 1;
  ctx.setLineDash([]);

  // Blocks and their marks.
  for (const s of scene.blocks) {
    const c = s.colours;
    const r = s.rect;
    ctx.globalAlpha = s.opacity?.value ?? 1;
    ctx.fillStyle = c.fill;
    ctx.fillRect(r.x, r.y, r.w, r.h);
    ctx.globalAlpha = 1;
    if (s.top) {
      ctx.fillStyle = c.top;
      ctx.fillRect(s.top.x, s.top.y, s.top.w, s.top.h);
    }
    if (s.selected) {
      ctx.strokeStyle = c.selected;
      ctx.lineWidth = 3;
      ctx.strokeRect(r.x, r.y, r.w, r.h);
    }
  }

  // The labels over them, names (bold, ink) in one pass and figures (muted) in another: setting
  // the font or a colour parses it, so each is set once per pass rather than once per line. Labels
  // never overlap (flow-layout.ts), so the order between them does not show.
  ctx.textBaseline = 'alphabetic';
  ctx.lineJoin = 'round';
  ctx.lineWidth = 3;
  for (const bold of [true, false]) {
    ctx.font = `${bold ? '600 ' : ''}12px ${FONT}`;
    let fill = '';
    let halo = '';
    let align = '';
    for (const s of scene.blocks) {
      const t = s.text;
      if (!t) continue;
      const c = s.colours;
      const ink = bold ? c.ink : c.inkMuted;
      if (ink !== fill) ctx.fillStyle = fill = ink;
      if (c.background !== halo) ctx.strokeStyle = halo = c.background;
      const a = t.anchor === 'middle' ? 'center' : 'left';
      if (a !== align) ctx.textAlign = align = a;
      for (let i = 0; i < t.lines.length; i++) {
        const l = t.lines[i]!;
        if (l.bold !== bold) continue;
        const y = t.y + LINE * i;
        // The halo first, then the text over it (the SVG's paint-order: stroke).
        ctx.strokeText(l.text, t.x, y);
        ctx.fillText(l.text, t.x, y);
      }
    }
  }
}
