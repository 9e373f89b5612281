/**
 * The energy-flow diagram's branches, blocks and labels, written straight into the SVG.
 *
 * An edit moves and relabels nearly every part of the diagram (every share of the source power
 * changes), so rendering them as Preact components cost a virtual-DOM comparison of every part
 * for changes that are then written anyway. Here each part is a keyed element that keeps the
 * attributes last written to it: after an edit only the attributes and text that changed are
 * written, and parts that come or go are added or removed in place. EnergyFlow.tsx computes what
 * each part shows (plain strings and numbers) and calls these from a layout effect, so the new
 * diagram is in the same frame as the edit. Focus stays on a part across redraws (same element).
 * What a part says rather than shows (its accessible name, a branch's watts) is written by
 * `describe`, which EnergyFlow.tsx runs when the page is idle after the paint.
 */
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
  source: string;
  target: string;
  selected: boolean;
}

export const branchLayer = () => new PartLayer<Kept>(() => make('path'), (k) => k.el);

export function writeBranch(k: Kept, s: BranchSpec): void {
  write(k, {
    d: s.d,
    stroke: s.colour,
    'data-stroke': s.paint,
    'stroke-opacity': s.opacity,
    'data-opacity': s.opacityKey,
    'stroke-width': s.width,
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

export interface BlockSpec {
  id: string;
  role: string;
  x0: number;
  y0: number;
  width: number;
  h: number;
  /** Height of the idle part drawn on top (0: none). */
  idleH: number;
  paint: string;
  colours: { fill: string; idle: string; selected: string; ink: string; inkMuted: string; background: string };
  /** Name and figure lines beside the block, when there is room for them. */
  text: { x: number; y: number; name: string; lines: readonly string[] } | undefined;
  selected: boolean;
}

interface Block {
  g: Kept;
  rect: Kept;
  idle: Kept | null;
  /** The label, placed by its group's translation (moving it does not lay its text out again). */
  place: Kept | null;
  /**
   * The name and each figure line are <text> elements of their own: a changed figure lays out its
   * own line only (one <text> with a <tspan> per line lays out all its lines again).
   */
  name: Kept | null;
  lines: Kept[];
}

export const blockLayer = () =>
  new PartLayer<Block>(
    () => {
      const b: Block = { g: make('g'), rect: make('rect'), idle: null, place: null, name: null, lines: [] };
      b.g.el.append(b.rect.el);
      return b;
    },
    (b) => b.g.el,
  );

/** Line pitch of a label, px (1.25 em of its 12 px type). */
const LINE = 15;

export function writeBlock(b: Block, s: BlockSpec): void {
  const c = s.colours;
  write(b.g, {
    class: 'flow__node',
    tabindex: 0,
    role: 'img',
    'data-node': s.id,
    'data-role': s.role,
    'data-selected': s.selected ? 'true' : undefined,
  });
  write(b.rect, {
    x: s.x0,
    y: s.y0,
    width: s.width,
    height: s.h,
    fill: c.fill,
    'data-fill': s.paint,
    stroke: s.selected ? c.selected : 'none',
    'data-stroke': s.selected ? 'selected' : undefined,
    'stroke-width': s.selected ? 3 : 0,
  });
  if (s.idleH > 0) {
    if (!b.idle) {
      b.idle = make('rect');
      b.rect.el.after(b.idle.el);
    }
    write(b.idle, { x: s.x0, y: s.y0, width: s.width, height: s.idleH, fill: c.idle, 'data-fill': 'idle' });
  } else if (b.idle) {
    b.idle.el.remove();
    b.idle = null;
  }
  const t = s.text;
  if (!t) {
    if (b.place) b.place.el.remove();
    b.place = b.name = null;
    b.lines = [];
    return;
  }
  if (!b.place || !b.name) {
    b.place = make('g');
    b.name = make('text');
    b.place.el.append(b.name.el);
    b.g.el.append(b.place.el);
    b.lines = [];
  }
  write(b.place, { transform: `translate(${t.x} ${t.y})`, 'font-size': 12, ...halo(c.background) });
  write(b.name, { 'font-weight': 600, fill: c.ink, 'data-fill': 'ink' });
  writeText(b.name, t.name);
  // Lines are kept by place: a changed figure rewrites its line instead of replacing it.
  while (b.lines.length > t.lines.length) b.lines.pop()!.el.remove();
  while (b.lines.length < t.lines.length) {
    const line = make('text');
    b.place.el.append(line.el);
    b.lines.push(line);
  }
  t.lines.forEach((text, i) => {
    const line = b.lines[i]!;
    write(line, { y: LINE * (i + 1), fill: c.inkMuted, 'data-fill': 'inkMuted' });
    writeText(line, text);
  });
}

export function writeBlockWords(b: Block, w: PartWords): void {
  write(b.g, { 'aria-label': w.label });
}

// ---------- figures on the branches ----------

export interface FigureSpec {
  key: string;
  x: number;
  y: number;
  text: string;
  ink: string;
  background: string;
}

interface Figure {
  place: Kept;
  text: Kept;
}

export const figureLayer = () =>
  new PartLayer<Figure>(
    () => {
      const f: Figure = { place: make('g'), text: make('text') };
      f.place.el.append(f.text.el);
      return f;
    },
    (f) => f.place.el,
  );

export function writeFigure(f: Figure, s: FigureSpec): void {
  write(f.place, { transform: `translate(${s.x} ${s.y})`, 'pointer-events': 'none' });
  write(f.text, {
    dy: '0.35em',
    'text-anchor': 'middle',
    'font-size': 12,
    'font-weight': 600,
    fill: s.ink,
    'data-fill': 'ink',
    ...halo(s.background),
    'data-link': s.key,
  });
  writeText(f.text, s.text);
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
