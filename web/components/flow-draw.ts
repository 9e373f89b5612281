/**
 * The energy-flow diagram's branches, blocks and labels, written straight into the SVG.
 *
 * An edit moves and relabels nearly every part of the diagram (every share of the source power
 * changes), so rendering them as Preact components cost a virtual-DOM comparison of every part
 * for changes that are then written anyway. Here each part is a keyed element that keeps the
 * attributes last written to it: after an edit only the attributes and text that changed are
 * written, and parts that come or go are added or removed in place. EnergyFlow.tsx computes what
 * each part shows (plain strings and numbers), draws it on the canvas a person sees
 * (flow-canvas.ts) in the edit's frame, and writes the SVG with these when the page is idle after
 * the paint (at once when a part comes or goes or another project opens, and before a download or
 * printing): the SVG lies transparent over the canvas, for the parts' accessible names, focus, hover
 * and tap, and it is what the downloads and the printed page show. Focus stays on a part across
 * redraws (same element). What a part says rather than shows (its accessible name, a branch's
 * watts) is written by `describe`, in the same idle task.
 */
import { LINE } from './flow-layout.ts';
import { xmlSafeText } from './xml-text.ts';

const NS = 'http://www.w3.org/2000/svg';

/** An attribute's value; undefined removes it. */
type Attrs = Record<string, string | number | undefined>;

/** An element and what was last written to it. */
interface Kept {
  el: Element;
  attrs: Map<string, string>;
  text?: string;
}

function make(name: string): Kept {
  return { el: document.createElementNS(NS, name), attrs: new Map() };
}

function write(k: Kept, attrs: Attrs): void {
  for (const name in attrs) {
    const v = attrs[name];
    if (v === undefined) {
      if (k.attrs.delete(name)) k.el.removeAttribute(name);
      continue;
    }
    const s = typeof v === 'number' ? String(v) : v;
    if (k.attrs.get(name) !== s) {
      k.el.setAttribute(name, s);
      k.attrs.set(name, s);
    }
  }
}

/** Sets an element's text, changing its text node in place when it has one. */
function writeText(k: Kept, text: string): void {
  if (k.text === text) return;
  const first = k.el.firstChild;
  if (first && first.nodeType === 3 && first === k.el.lastChild) (first as Text).data = text;
  else k.el.textContent = text;
  k.text = text;
}

/** Puts `els` into `layer` in this order, removing any other child. */
function arrange(layer: Element, els: readonly Element[]): void {
  let at = layer.firstChild;
  for (const el of els) {
    if (at === el) {
      at = at.nextSibling;
      continue;
    }
    layer.insertBefore(el, at);
  }
  while (at) {
    const next = at.nextSibling;
    layer.removeChild(at);
    at = next;
  }
}

/** Keyed parts of one layer, kept between redraws. */
export class PartLayer<Part> {
  private readonly parts = new Map<string, Part>();
  constructor(
    private readonly create: () => Part,
    private readonly root: (part: Part) => Element,
  ) {}

  /** Draws `specs` in order (keyed by `key`), with `update` writing each part. Returns how many parts are new. */
  draw<Spec>(layer: Element, specs: readonly Spec[], key: (s: Spec) => string, update: (part: Part, spec: Spec) => void): number {
    let created = 0;
    const seen = new Set<string>();
    const els: Element[] = [];
    for (const spec of specs) {
      const k = key(spec);
      seen.add(k);
      let part = this.parts.get(k);
      if (!part) {
        part = this.create();
        this.parts.set(k, part);
        created++;
      }
      update(part, spec);
      els.push(this.root(part));
    }
    for (const k of [...this.parts.keys()]) if (!seen.has(k)) this.parts.delete(k);
    arrange(layer, els);
    return created;
  }

  /** Writes to the parts drawn with these keys (parts no longer drawn are skipped). */
  describe<Words>(words: readonly Words[], key: (w: Words) => string, update: (part: Part, w: Words) => void): void {
    for (const w of words) {
      const part = this.parts.get(key(w));
      if (part) update(part, w);
    }
  }
}

/**
 * What a part says rather than shows: its accessible name, and (branches) its power for tests and
 * tools. Written apart from the drawing, so that it can wait until the page is idle after the paint.
 */
export interface PartWords {
  key: string;
  label: string;
  watts?: number;
}

/** The light outline around a label, so it reads over a branch. */
const halo = (background: string): Attrs => ({
  stroke: background,
  'data-stroke': 'background',
  'stroke-width': 3,
  'stroke-linejoin': 'round',
  'paint-order': 'stroke',
});

// ---------- branches ----------

export interface BranchSpec {
  key: string;
  d: string;
  /** Palette key written beside the colour (exports and print repaint by it). */
  paint: string;
  colour: string;
  opacityKey: 'loss' | 'feed';
  opacity: number;
  width: number;
  dash: string | undefined;
  role: string;
  part: string | undefined;
  /** A filled ribbon (feed branches: `width` is then its stroke's, none) rather than a stroked line. */
  ribbon: boolean;
  source: string;
  target: string;
  selected: boolean;
}

export const branchLayer = () => new PartLayer<Kept>(() => make('path'), (k) => k.el);

export function writeBranch(k: Kept, s: BranchSpec): void {
  write(k, {
    d: s.d,
    // A ribbon is filled; its stroke keeps the colour (print rules and exports repaint it) at no width.
    fill: s.ribbon ? s.colour : undefined,
    'data-fill': s.ribbon ? s.paint : undefined,
    'fill-opacity': s.ribbon ? s.opacity : undefined,
    'data-fill-opacity': s.ribbon ? s.opacityKey : undefined,
    stroke: s.colour,
    'data-stroke': s.paint,
    'stroke-opacity': s.opacity,
    'data-opacity': s.opacityKey,
    'stroke-width': s.ribbon ? 0 : s.width,
    'stroke-dasharray': s.dash,
    class: 'flow__link',
    // Lower case: on an SVG element the attribute name is taken as written, and only "tabindex" counts.
    tabindex: 0,
    role: 'img',
    'data-role': s.role,
    'data-part': s.part,
    'data-source': s.source,
    'data-target': s.target,
    'data-selected': s.selected ? 'true' : undefined,
    'data-link-key': s.key,
  });
}

export function writeBranchWords(k: Kept, w: PartWords): void {
  write(k, { 'aria-label': w.label, 'data-watts': w.watts === undefined ? undefined : String(w.watts) });
}

// ---------- blocks and their labels ----------

/** A rectangle, px. */
export interface RectSpec {
  x: number;
  y: number;
  w: number;
  h: number;
}

export interface BlockSpec {
  id: string;
  role: string;
  /** The block: a source's, stage's or load's pipe (the flow through its column), or a loss block. */
  rect: RectSpec;
  /** Palette key of the block's fill. */
  paint: string;
  /** Fill opacity (pipes take their branches' opacity), and its key for the exports; none: opaque. */
  opacity: { key: 'feed'; value: number } | undefined;
  /**
   * A second rectangle on top: a pipe's mark in its role's colour (source, stage, load), or a loss
   * block's idle part; with its palette key.
   */
  top: (RectSpec & { paint: string }) | undefined;
  colours: { fill: string; top: string; selected: string; ink: string; inkMuted: string; background: string };
  /** The label's lines (names bold), from (x, y) down; centred on x or starting there. */
  text: { x: number; y: number; anchor: 'start' | 'middle'; lines: readonly { text: string; bold: boolean }[]; fullName?: string } | undefined;
  selected: boolean;
}

interface Block {
  g: Kept;
  rect: Kept;
  top: Kept | null;
  /** The label, placed by its group's translation (moving it does not lay its text out again). */
  place: Kept | null;
  /**
   * Each line is a <text> element of its own: a changed figure lays out its own line only (one
   * <text> with a <tspan> per line lays out all its lines again).
   */
  lines: Kept[];
}

export const blockLayer = () =>
  new PartLayer<Block>(
    () => {
      const b: Block = { g: make('g'), rect: make('rect'), top: null, place: null, lines: [] };
      b.g.el.append(b.rect.el);
      return b;
    },
    (b) => b.g.el,
  );

export function writeBlock(b: Block, s: BlockSpec): void {
  const c = s.colours;
  write(b.g, {
    class: 'flow__node',
    tabindex: 0,
    role: 'img',
    'data-node': s.id,
    'data-role': s.role,
    'data-selected': s.selected ? 'true' : undefined,
    // A name shortened in the drawing: the exported file lists it in full (flow-export.ts).
    'data-full-name': s.text?.fullName,
  });
  write(b.rect, {
    x: s.rect.x,
    y: s.rect.y,
    width: s.rect.w,
    height: s.rect.h,
    fill: c.fill,
    'data-fill': s.paint,
    'fill-opacity': s.opacity?.value,
    'data-fill-opacity': s.opacity?.key,
    stroke: s.selected ? c.selected : 'none',
    'data-stroke': s.selected ? 'selected' : undefined,
    'stroke-width': s.selected ? 3 : 0,
  });
  if (s.top) {
    if (!b.top) {
      b.top = make('rect');
      b.rect.el.after(b.top.el);
    }
    write(b.top, { x: s.top.x, y: s.top.y, width: s.top.w, height: s.top.h, fill: c.top, 'data-fill': s.top.paint });
  } else if (b.top) {
    b.top.el.remove();
    b.top = null;
  }
  const t = s.text;
  if (!t) {
    if (b.place) b.place.el.remove();
    b.place = null;
    b.lines = [];
    return;
  }
  if (!b.place) {
    b.place = make('g');
    b.g.el.append(b.place.el);
    b.lines = [];
  }
  write(b.place, { transform: `translate(${t.x} ${t.y})`, 'font-size': 12, 'text-anchor': t.anchor, ...halo(c.background) });
  // Lines are kept by place: a changed figure rewrites its line instead of replacing it.
  while (b.lines.length > t.lines.length) b.lines.pop()!.el.remove();
  while (b.lines.length < t.lines.length) {
    const line = make('text');
    b.place.el.append(line.el);
    b.lines.push(line);
  }
  t.lines.forEach((l, i) => {
    const line = b.lines[i]!;
    write(line, {
      y: LINE * i,
      'font-weight': l.bold ? 600 : undefined,
      fill: l.bold ? c.ink : c.inkMuted,
      'data-fill': l.bold ? 'ink' : 'inkMuted',
    });
    writeText(line, l.text);
  });
}

export function writeBlockWords(b: Block, w: PartWords): void {
  write(b.g, { 'aria-label': w.label });
}

/** Make every text and attribute value under `root` fit for an XML 1.0 file (xml-text.ts), in place. */
export function makeXmlSafe(root: Element): void {
  const visit = (node: Node) => {
    if (node.nodeType === 3 /* text */ || node.nodeType === 4 /* CDATA */) {
      const safe = xmlSafeText(node.nodeValue ?? '');
      if (safe !== node.nodeValue) node.nodeValue = safe;
      return;
    }
    if (node.nodeType === 1 /* element */) {
      const el = node as Element;
      for (const attr of [...el.attributes]) {
        const safe = xmlSafeText(attr.value);
        if (safe !== attr.value) el.setAttribute(attr.name, safe);
      }
    }
    for (const child of [...node.childNodes]) visit(child);
  };
  visit(root);
}
