/**
 * The options' energy-flow diagrams side by side at ONE scale: each laid out by the diagram's own
 * layout (flow-layout.ts) with a shared number of pixels per watt, so a wider branch is more power
 * in every drawing alike; all are shown at one size factor too (as much as lets them stand side by side
 * in the panel's width, at least 70 %: a narrow screen scrolls the row sideways rather than shrinking one
 * drawing more than another). Static pictures: the main diagram holds the details.
 */
import { useLayoutEffect, useRef, useState } from 'preact/hooks';
import type { FlowGraph } from '../../../core/studies/index.ts';
import { COLUMN, IDLE_DASH, LINE, layout, linkPath, linkPaint, nodePaint, roughMeasure, type Layout } from '../flow-layout.ts';
import { FLOW_PALETTES } from '../flow-palette.ts';
import { deviceDark, effectiveLocale, resolveTheme, themeChoice } from '../../state/prefs.ts';
import { formatPower } from '../../format/number.ts';
import './VariantFlows.css';

/** Tallest source pipe of the largest option, px (the diagram's own maximum, flow-layout.ts). */
const MAX_PIPE = 150;

/**
 * The scale all the drawings share, px per W: the one the largest option would take alone (its
 * source's pipe at most MAX_PIPE, its widest loss branch within a column), so every drawing fits.
 */
export function sharedScale(graphs: readonly (FlowGraph | null)[]): number | undefined {
  let k = Infinity;
  for (const g of graphs) {
    if (!g) continue;
    const source = Math.abs(g.sourcePower);
    const loss = Math.max(0, ...g.nodes.filter((n) => n.role === 'loss').map((n) => n.watts));
    if (source > 0) k = Math.min(k, MAX_PIPE / source);
    if (loss > 0) k = Math.min(k, (COLUMN - 24) / loss);
  }
  return Number.isFinite(k) ? k : undefined;
}

function Drawing({ laid, title, theme, scale, zoom }: { laid: Layout; title: string; theme: 'light' | 'dark'; scale: number | undefined; zoom: number }) {
  const p = FLOW_PALETTES[theme];
  const c = p.colours;
  return (
    <svg class="variant-flow__svg" width={Math.round(laid.width * zoom)} height={Math.round(laid.height * zoom)} viewBox={`0 0 ${laid.width} ${laid.height}`} role="img" aria-label={title} data-px-per-watt={scale}>
      <rect x={0} y={0} width={laid.width} height={laid.height} fill={c.background} />
      {laid.links.map((l) => {
        const paint = c[linkPaint(l, l.sourceNode.kind)];
        return l.role === 'loss' ? (
          <path key={l.key} d={linkPath(l)} fill="none" stroke={paint} stroke-opacity={p.lossOpacity} stroke-width={Math.max(1, l.width)} stroke-dasharray={l.part === 'idle' ? IDLE_DASH : undefined} />
        ) : (
          <path key={l.key} d={linkPath(l)} fill={paint} fill-opacity={p.feedOpacity} stroke="none" />
        );
      })}
      {laid.nodes.map((n) => (
        <rect key={n.id} data-node={n.id} data-role={n.role} x={n.x0} y={n.y0} width={Math.max(1, n.x1 - n.x0)} height={Math.max(1, n.y1 - n.y0)} fill={c[nodePaint(n)]} fill-opacity={n.role === 'loss' ? 1 : p.feedOpacity} />
      ))}
      {laid.labels.map((lab) => (
        <g key={lab.id}>
          {lab.lines.map((line, i) => (
            <text key={i} x={lab.x} y={lab.y + i * LINE} text-anchor={lab.anchor} font-size="12" font-weight={line.bold ? 600 : 400} fill={line.bold ? c.ink : c.inkMuted}>
              {line.text}
            </text>
          ))}
        </g>
      ))}
    </svg>
  );
}

export function VariantFlows({ names, flows }: { names: readonly string[]; flows: readonly (FlowGraph | null)[] }) {
  const loc = effectiveLocale();
  const theme = resolveTheme(themeChoice.value, deviceDark.value);
  const k = sharedScale(flows);
  const row = useRef<HTMLDivElement>(null);
  const [room, setRoom] = useState(0);
  useLayoutEffect(() => {
    const el = row.current;
    if (!el) return;
    const measure = () => setRoom(el.clientWidth);
    measure();
    const watch = new ResizeObserver(measure);
    watch.observe(el);
    return () => watch.disconnect();
  }, []);
  const laids = flows.map((g) => (g ? layout(g, 0, loc, roughMeasure, k) : null));
  const total = laids.reduce((sum, l) => sum + (l ? l.width + 20 : 0), 0);
  // One size factor for every drawing, so that one scale stays one scale on screen.
  const zoom = room > 0 && total > 0 ? Math.min(1, Math.max(0.7, room / total)) : 1;
  return (
    <div ref={row} class="variant-flows" data-testid="variant-flows" tabIndex={0} role="group" aria-label="Energy flow of each option, at one scale">
      {flows.map((g, i) => {
        const laid = laids[i] ?? null;
        const name = names[i] ?? '';
        return (
          <figure key={i} class="variant-flow" data-testid="variant-flow">
            <figcaption>
              <strong>{name}</strong>
              {g ? ` · source ${formatPower(g.sourcePower, loc)}` : ''}
            </figcaption>
            {laid ? <Drawing laid={laid} title={`Energy flow of ${name}: source ${g ? formatPower(g.sourcePower, loc) : ''}`} theme={theme} scale={k} zoom={zoom} /> : <p class="note">Does not apply to the chain as it stands: see why above.</p>}
          </figure>
        );
      })}
    </div>
  );
}
