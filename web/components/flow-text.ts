/**
 * The energy-flow diagram's words (EnergyFlow.tsx shows them): a branch's and a block's description with
 * its figures (the details line and each SVG part's accessible name), the figures of a tapped part's
 * card, and the widths of label lines in the page's own font for the layout. Words only: every figure
 * is core's flowGraph() and the solved result.
 */
import type { ElementResult } from '../../core/page.ts';
import { formatCurrent, formatPercent, formatPower, formatVoltage } from '../format/number.ts';
import { elementKindLabel } from '../format/labels.ts';
import { figures, FONT, type LaidLink, type LaidNode, type Measure, roughMeasure } from './flow-layout.ts';

/** What is picked in the diagram: a block (node) or a branch (link). */
export type Selection = { type: 'node'; id: string } | { type: 'link'; key: string } | null;

export function linkText(l: LaidLink, loc: string | undefined): string {
  const from = l.sourceNode;
  const to = l.targetNode;
  if (l.role === 'loss') {
    if (l.part === 'idle') return `Idle loss in ${from.name} (drawn even with no load): ${figures(l.watts, l.percent, loc)} of the source power`;
    return `${from.kind === 'cable' ? 'Loss' : 'Conversion loss'} in ${from.name} (grows with the load): ${figures(l.watts, l.percent, loc)} of the source power`;
  }
  return `${from.name} to ${to.name}: ${figures(l.watts, l.percent, loc)} of the source power`;
}

export function nodeText(n: LaidNode, element: ElementResult | undefined, loc: string | undefined): string {
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
export function cardContent(sel: NonNullable<Selection>, laid: { nodes: LaidNode[]; links: LaidLink[] }, elements: Map<string, ElementResult>, sourcePower: number, loc: string | undefined) {
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
export function pageMeasure(): Measure {
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
