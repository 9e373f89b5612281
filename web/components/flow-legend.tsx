/**
 * The energy-flow diagram's legend: its items (also drawn into exported files and the print rules) and the
 * legend shown under the diagram.
 */
import { memo } from 'preact/compat';
import type { FlowPalette, PaintKey } from './flow-palette.ts';

export interface LegendItem {
  paint: PaintKey;
  label: string;
  dashed?: boolean;
}

export const LEGEND: readonly LegendItem[] = [
  { paint: 'feed', label: 'Power passed on' },
  { paint: 'idle', label: 'Idle loss: drawn even with no load', dashed: true },
  { paint: 'conversion', label: 'Conversion loss: grows with the load' },
  { paint: 'lineLoss', label: 'Loss in a cable' },
];

export const Legend = memo(function Legend({ palette }: { palette: FlowPalette }) {
  return (
    <ul class="flow__legend">
      {LEGEND.map((i) => (
        <li key={i.label}>
          <span
            class={i.dashed ? 'flow__swatch flow__swatch--dashed' : 'flow__swatch'}
            data-paint={i.paint}
            style={{ borderTopColor: palette.colours[i.paint] }}
            aria-hidden="true"
          />
          {i.label}
        </li>
      ))}
    </ul>
  );
});
