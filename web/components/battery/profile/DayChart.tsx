/**
 * The preview of a profile: the loads' total power over the day on the clock, a step line (the load
 * is constant between switchings), drawn with the charts' scale helpers and the time charts' styles.
 * Figures come from core (profileDay); this file scales and draws. The figures beside it (energy,
 * average, peak) are its text alternative.
 */
import { useWidth } from '../../charts/TimeChart.tsx';
import type { DayInterval } from '../../../../core/studies/index.ts';
import { formatSignificant } from '../../../format/number.ts';
import { linearScale, niceTicks } from '../../charts/scale.ts';
import { clockText } from './model.ts';

const HEIGHT = 150;
const TOP = 10;
const BOTTOM = 36;
const LEFT = 52;
const RIGHT = 22;

export function DayChart({ intervals, locale, labelledBy }: { intervals: readonly DayInterval[]; locale: string | undefined; labelledBy: string }) {
  const [box, width] = useWidth();
  const peak = intervals.reduce((m, iv) => Math.max(m, iv.watts), 0);
  const yt = niceTicks(0, peak > 0 ? peak : 1, 3);
  const plotW = Math.max(10, width - LEFT - RIGHT);
  const x = linearScale(0, 24, LEFT, LEFT + plotW);
  const y = linearScale(yt.min, yt.max, HEIGHT - BOTTOM, TOP);
  const hours = width < 480 ? [0, 6, 12, 18, 24] : [0, 3, 6, 9, 12, 15, 18, 21, 24];
  const r = (v: number) => Math.round(v * 10) / 10;
  let d = '';
  intervals.forEach((iv, i) => {
    d += `${i === 0 ? 'M' : 'L'}${r(x(iv.fromHour))} ${r(y(iv.watts))}H${r(x(iv.toHour))}`;
  });
  return (
    <div class="tchart__box" ref={box}>
      {width > 0 && (
        <svg class="tchart__svg day-chart" width={width} height={HEIGHT} viewBox={`0 0 ${width} ${HEIGHT}`} role="img" aria-labelledby={labelledBy} data-testid="profile-chart">
          <rect class="tchart__frame" x={LEFT} y={TOP} width={plotW} height={HEIGHT - TOP - BOTTOM} />
          {hours.map((h) => (
            <g key={`t${h}`}>
              <line class="tchart__grid" x1={x(h)} x2={x(h)} y1={TOP} y2={HEIGHT - BOTTOM} />
              <text class="tchart__tick" x={x(h)} y={HEIGHT - BOTTOM + 16} text-anchor="middle">
                {clockText(h)}
              </text>
            </g>
          ))}
          {yt.ticks.map((v) => (
            <g key={`w${v}`}>
              <line class="tchart__grid" x1={LEFT} x2={LEFT + plotW} y1={y(v)} y2={y(v)} />
              <text class="tchart__tick" x={LEFT - 6} y={y(v)} dy="0.32em" text-anchor="end">
                {formatSignificant(v, 4, locale)}
              </text>
            </g>
          ))}
          <text class="tchart__axis-title" x={LEFT - 46} y={TOP + 2} dy="0.7em">
            W
          </text>
          <path class="tchart__line" d={d} data-points={intervals.length} />
        </svg>
      )}
    </div>
  );
}
