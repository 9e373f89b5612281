/**
 * The energy-flow diagram's files and paper: the download name, SVG text and PNG in the paper palette
 * (repainted from the data-fill/data-stroke keys, legend and summary added, text made XML 1.0-safe), and
 * the print rules that give the printed diagram the paper palette whatever the theme on screen.
 */
import { fileNameStem } from '../format/labels.ts';
import { FLOW_PALETTES, PAPER_THEME, type FlowPalette, type PaintKey } from './flow-palette.ts';
import { makeXmlSafe } from './flow-draw.ts';
import { IDLE_DASH, roughMeasure, wrap } from './flow-layout.ts';
import { LEGEND, type LegendItem } from './flow-legend.tsx';

/** The file name stem for downloads: the project's name in lower case, words joined by dashes. */
export function fileStem(projectName: string): string {
  return `${fileNameStem(projectName) || 'joulepath-project'}-energy-flow`;
}

export async function download(blob: Blob, fileName: string): Promise<void> {
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
  // Pipes (the flow through a column) take the feed branches' opacity.
  root.querySelectorAll('[data-fill-opacity]').forEach((el) => el.setAttribute('fill-opacity', String(palette.feedOpacity)));
}

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

/**
 * The legend of names the drawing had to shorten (a name longer than its label's lines, flow-layout.ts):
 * each full name, wrapped to the file's width, under the drawing. Empty when no name was shortened.
 */
function shortenedNames(svg: Element, width: number): string[] {
  const names = [...svg.querySelectorAll('[data-full-name]')].map((el) => el.getAttribute('data-full-name') ?? '');
  if (names.length === 0) return [];
  const lines = ['Names shortened in the drawing, in full:'];
  for (const name of names) lines.push(...wrap(`• ${name}`.split(/\s+/), ' ', width - 24, false, roughMeasure));
  return lines;
}

const exportFooter = (lines: readonly string[]) => (lines.length ? lines.length * EXPORT_ROW + 12 : 0);

const exportHeader = (width: number, summary: string | null) =>
  40 + EXPORT_ROW * (Math.max(...exportLegendRows(width).map((r) => r.row)) + 1) + (summary ? EXPORT_ROW : 0);

/** The diagram as standalone SVG text in the paper palette (focus outlines and page-only attributes removed). */
export function svgText(svg: SVGSVGElement, title: string, summary: string | null): string {
  const NS = 'http://www.w3.org/2000/svg';
  const paper = FLOW_PALETTES[PAPER_THEME];
  const copy = svg.cloneNode(true) as SVGSVGElement;
  copy.querySelectorAll('[tabindex]').forEach((el) => el.removeAttribute('tabindex'));
  copy.querySelectorAll('[data-selected]').forEach((el) => el.removeAttribute('data-selected'));
  repaint(copy, paper);
  copy.removeAttribute('class');
  // The page's zoom is not the file's: the file has the drawing's own size.
  copy.removeAttribute('style');
  copy.setAttribute('xmlns', NS);
  // A file stands alone: a heading, the colour key and the loss split above the diagram.
  const width = Number(svg.getAttribute('width'));
  const header = exportHeader(width, summary);
  const footer = shortenedNames(svg, width);
  const drawingHeight = Number(svg.getAttribute('height'));
  const height = drawingHeight + header + exportFooter(footer);
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
  const foot = el('g', { transform: `translate(0 ${header + drawingHeight})` });
  footer.forEach((line, i) =>
    foot.append(el('text', { x: '12', y: String(EXPORT_ROW * (i + 1)), 'font-size': '11', fill: paper.colours.ink, 'data-legend-name': '' }, line)),
  );
  copy.append(head, body, foot);
  // Names may hold characters XML 1.0 forbids (a control character pasted or imported): left out.
  makeXmlSafe(copy);
  return `<?xml version="1.0" encoding="UTF-8"?>\n${new XMLSerializer().serializeToString(copy)}`;
}

/** The SVG drawn onto a canvas at twice its size, as a PNG. */
export async function pngBlob(svg: SVGSVGElement, title: string, summary: string | null): Promise<Blob> {
  const width = Number(svg.getAttribute('width'));
  const height = Number(svg.getAttribute('height')) + exportHeader(width, summary) + exportFooter(shortenedNames(svg, width));
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
    `.flow__svg [data-fill-opacity] { fill-opacity: ${p.feedOpacity}; }`,
    `.flow__box { background: ${p.colours.background} !important; }`,
    ...LEGEND.map((i) => `.flow__swatch[data-paint="${i.paint}"] { border-top-color: ${p.colours[i.paint]} !important; }`),
    '}',
  ].join('\n');
}

/** Built once: the rules depend only on the paper palette. */
export const PRINT_RULES = printRules();
