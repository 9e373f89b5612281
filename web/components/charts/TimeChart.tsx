/**
 * Small multiples over time: one narrow chart per quantity, stacked, sharing one time axis at the
 * bottom (a practitioner reads each curve against its own scale without a second y axis to decode).
 * Drawn at the width of its box (measured), so text stays at its real size on a phone.
 *
 * Figures come from the caller (the engine's series); this file scales, draws and formats.
 * Colours are theme tokens (CSS custom properties), so both themes work.
 */
import { useLayoutEffect, useRef, useState } from 'preact/hooks';
import type { RefObject } from 'preact';
import { formatSignificant } from '../../format/number.ts';
import { linePath, linearScale, niceTicks, sampleEvery, thinIndices, timeTicksHours } from './scale.ts';

export interface ChartSeries {
  key: string;
  /** Title above the chart, with its unit: "State of charge, %". */
  title: string;
  /** Unit for the table header and ticks' meaning ("%", "V", "A"). */
  unit: string;
  /** Values in display units, one per time point. */
  values: readonly number[];
  /** Fixed axis range; otherwise the data's range (with `fromZero`, from 0). */
  domain?: readonly [number, number];
  fromZero?: boolean;
  /** A dashed reference line (a limit) drawn when it lies inside the axis range. */
  guide?: { value: number; label: string };
  /** Significant digits in the table. */
  digits?: number;
}

interface Props {
  /** Time of each point, s. */
  time: readonly number[];
  series: readonly ChartSeries[];
  locale: string | undefined;
  /** One or two sentences saying what the curves show (the text alternative). */
  summary: string;
  timeTitle: string;
  testId?: string;
}

const PANEL_HEIGHT = 92;
const TITLE_HEIGHT = 22;
const GAP = 14;
const AXIS_HEIGHT = 44;
const MARGIN_LEFT = 52;
const MARGIN_RIGHT = 14;
/** Points drawn per pixel of width at most (the rest are thinned, keeping every peak and dip). */
const POINTS_PER_PX = 1.5;

/** The width of an element, followed as it changes (measured before the first paint; 0 until then). */
export function useWidth(): [RefObject<HTMLDivElement | null>, number] {
  const ref = useRef<HTMLDivElement>(null);
  const [width, setWidth] = useState(0);
  useLayoutEffect(() => {
    const el = ref.current;
    if (!el) return;
    const update = () => setWidth(Math.max(240, Math.floor(el.clientWidth)));
    update();
    if (typeof ResizeObserver === 'undefined') return;
    const ro = new ResizeObserver(update);
    ro.observe(el);
    return () => ro.disconnect();
  }, []);
  return [ref, width];
}

function seriesRange(s: ChartSeries): [number, number] {
  if (s.domain) return [s.domain[0], s.domain[1]];
  let lo = Number.POSITIVE_INFINITY;
  let hi = Number.NEGATIVE_INFINITY;
  for (const v of s.values) {
    if (!Number.isFinite(v)) continue;
    if (v < lo) lo = v;
    if (v > hi) hi = v;
  }
  if (!Number.isFinite(lo)) return [0, 1];
  return s.fromZero ? [Math.min(0, lo), hi] : [lo, hi];
}

export function TimeChart({ time, series, locale, summary, timeTitle, testId }: Props) {
  const [boxRef, measured] = useWidth();
  const width = measured || 320;
  const [showTable, setShowTable] = useState(false);
  const end = time.length ? time[time.length - 1]! : 0;
  const tAxis = timeTicksHours(end, width < 480 ? 4 : 6);
  const plotW = width - MARGIN_LEFT - MARGIN_RIGHT;
  const x = linearScale(0, tAxis.max * 3600, MARGIN_LEFT, MARGIN_LEFT + plotW);
  const height = series.length * (TITLE_HEIGHT + PANEL_HEIGHT + GAP) + AXIS_HEIGHT;
  const keep = thinIndices(time as number[], Math.max(50, Math.floor(plotW * POINTS_PER_PX)));
  const fmt = (v: number, digits = 4) => formatSignificant(v, digits, locale);
  const titleId = `${testId ?? 'chart'}-summary`;

  const rows = showTable ? sampleEvery(time, (tAxis.step * 3600) / (tAxis.step >= 2 ? 2 : 1)) : [];

  return (
    <figure class="tchart" data-testid={testId}>
      <div class="tchart__box" ref={boxRef}>
        {measured > 0 && (
        <svg
          class="tchart__svg"
          width={width}
          height={height}
          viewBox={`0 0 ${width} ${height}`}
          role="img"
          aria-labelledby={titleId}
          data-testid={testId ? `${testId}-svg` : undefined}
        >
          {series.map((s, k) => {
            const top = k * (TITLE_HEIGHT + PANEL_HEIGHT + GAP) + TITLE_HEIGHT;
            const [lo, hi] = seriesRange(s);
            const yt = niceTicks(lo, hi, 3);
            const y = linearScale(yt.min, yt.max, top + PANEL_HEIGHT, top);
            const xs = keep.map((i) => x(time[i]!));
            const ys = keep.map((i) => y(s.values[i]!));
            const guideInside = s.guide && s.guide.value >= yt.min && s.guide.value <= yt.max;
            return (
              <g key={s.key} class={`tchart__panel tchart__panel--${s.key}`} data-series={s.key}>
                <text class="tchart__title" x={MARGIN_LEFT} y={top - 7}>
                  {s.title}
                </text>
                <rect class="tchart__frame" x={MARGIN_LEFT} y={top} width={plotW} height={PANEL_HEIGHT} />
                {tAxis.ticks.map((t) => (
                  <line key={`v${t}`} class="tchart__grid" x1={x(t * 3600)} x2={x(t * 3600)} y1={top} y2={top + PANEL_HEIGHT} />
                ))}
                {yt.ticks.map((v) => (
                  <g key={`h${v}`}>
                    <line class="tchart__grid" x1={MARGIN_LEFT} x2={MARGIN_LEFT + plotW} y1={y(v)} y2={y(v)} />
                    <text class="tchart__tick" x={MARGIN_LEFT - 6} y={y(v)} dy="0.32em" text-anchor="end">
                      {fmt(v)}
                    </text>
                  </g>
                ))}
                {guideInside && (
                  <g class="tchart__guide">
                    <line x1={MARGIN_LEFT} x2={MARGIN_LEFT + plotW} y1={y(s.guide!.value)} y2={y(s.guide!.value)} />
                    <text x={MARGIN_LEFT + plotW - 4} y={y(s.guide!.value) - 4} text-anchor="end">
                      {s.guide!.label}
                    </text>
                  </g>
                )}
                <path class="tchart__line" d={linePath(xs, ys)} data-points={keep.length} />
              </g>
            );
          })}
          <g class="tchart__axis" data-testid={testId ? `${testId}-time-axis` : undefined}>
            {tAxis.ticks.map((t) => {
              const axisTop = series.length * (TITLE_HEIGHT + PANEL_HEIGHT + GAP) - GAP;
              return (
                <g key={`t${t}`}>
                  <line class="tchart__tickmark" x1={x(t * 3600)} x2={x(t * 3600)} y1={axisTop} y2={axisTop + 5} />
                  <text class="tchart__tick" x={x(t * 3600)} y={axisTop + 18} text-anchor="middle">
                    {fmt(t)}
                  </text>
                </g>
              );
            })}
            <text class="tchart__axis-title" x={MARGIN_LEFT + plotW / 2} y={height - 6} text-anchor="middle">
              {timeTitle}
            </text>
          </g>
        </svg>
        )}
      </div>
      <figcaption class="tchart__caption">
        <p id={titleId} class="tchart__summary" data-testid={testId ? `${testId}-summary` : undefined}>
          {summary}
        </p>
        <button
          type="button"
          class="panel-button"
          aria-expanded={showTable}
          aria-controls={`${titleId}-table`}
          onClick={() => setShowTable(!showTable)}
          data-testid={testId ? `${testId}-table-toggle` : undefined}
        >
          {showTable ? 'Hide the table' : 'Show as table'}
        </button>
      </figcaption>
      {showTable && (
        <div class="table-scroll" role="region" aria-label="The curves as a table" tabIndex={0} id={`${titleId}-table`}>
          <table class="data tchart__table" data-testid={testId ? `${testId}-table` : undefined}>
            <thead>
              <tr>
                <th scope="col" class="num">Time, h</th>
                {series.map((s) => (
                  <th scope="col" class="num" key={s.key}>
                    {s.title}
                  </th>
                ))}
              </tr>
            </thead>
            <tbody>
              {rows.map((i) => (
                <tr key={i}>
                  <td class="num">{formatSignificant(time[i]! / 3600, 4, locale)}</td>
                  {series.map((s) => (
                    <td class="num" key={s.key}>
                      {fmt(s.values[i]!, s.digits ?? 4)}
                    </td>
                  ))}
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      )}
    </figure>
  );
}
