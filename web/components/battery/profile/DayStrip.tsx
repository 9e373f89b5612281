/**
 * The 24-hour strip of a daily profile: each segment a band from its start to the next one's (the
 * last runs on past midnight to the first), each start a handle to drag (pointer events: mouse, pen
 * and touch alike) or to move with the arrow keys (a quarter hour; Page Up / Page Down an hour; Home /
 * End to the ends of its room). A drag is stored once, when the handle is let go.
 */
import { useRef, useState } from 'preact/hooks';
import type { DailySegment } from '../../../../core/page.ts';
import { HOUR_STEP, clockText, handleRange, snapHour } from './model.ts';

interface Props {
  segments: readonly DailySegment[];
  /** Called with the segment and its new start hour, once per move (a drag when let go). */
  onMove: (index: number, hour: number) => void;
  /** The hour of the day the outage begins (a mark on the strip). */
  outageHour: number;
}

const pct = (hour: number) => `${(hour / 24) * 100}%`;

export function DayStrip({ segments, onMove, outageHour }: Props) {
  const bar = useRef<HTMLDivElement>(null);
  const [drag, setDrag] = useState<{ index: number; hour: number } | null>(null);
  const starts = segments.map((s, i) => (drag && drag.index === i ? drag.hour : s.startHour));
  const n = segments.length;

  const hourAt = (clientX: number): number => {
    const box = bar.current?.getBoundingClientRect();
    if (!box || box.width <= 0) return 0;
    return ((clientX - box.left) / box.width) * 24;
  };

  // Bands: segment i from its start to the next start; the last wraps past midnight to the first.
  const bands: { index: number; from: number; to: number }[] = [];
  starts.forEach((from, i) => {
    const to = i + 1 < n ? starts[i + 1]! : starts[0]! + 24;
    if (to <= 24) bands.push({ index: i, from, to });
    else {
      bands.push({ index: i, from, to: 24 });
      if (to - 24 > 0) bands.push({ index: i, from: 0, to: to - 24 });
    }
  });

  const key = (i: number) => (e: KeyboardEvent) => {
    const range = handleRange(segments, i);
    const now = segments[i]!.startHour;
    const next =
      e.key === 'ArrowLeft' || e.key === 'ArrowDown' ? now - HOUR_STEP
      : e.key === 'ArrowRight' || e.key === 'ArrowUp' ? now + HOUR_STEP
      : e.key === 'PageDown' ? now - 1
      : e.key === 'PageUp' ? now + 1
      : e.key === 'Home' ? range[0]
      : e.key === 'End' ? range[1]
      : null;
    if (next === null) return;
    e.preventDefault();
    const hour = snapHour(next, range);
    if (hour !== now) onMove(i, hour);
  };

  return (
    <div class="day-strip" data-testid="profile-strip">
      <div class="day-strip__bar" ref={bar}>
        {bands.map((b) => (
          <div
            key={`${b.index}-${b.from}`}
            class={`day-strip__band day-strip__band--${b.index % 2 ? 'odd' : 'even'}`}
            style={{ left: pct(b.from), width: pct(b.to - b.from) }}
            aria-hidden="true"
          >
            {b.to - b.from >= 1.5 ? b.index + 1 : ''}
          </div>
        ))}
        <div class="day-strip__outage" style={{ left: pct(outageHour) }} aria-hidden="true" title="The outage begins" />
        {starts.map((hour, i) => {
          const range = handleRange(segments, i);
          return (
            <div
              key={i}
              class={drag?.index === i ? 'day-strip__handle day-strip__handle--dragging' : 'day-strip__handle'}
              style={{ left: pct(hour) }}
              role="slider"
              tabIndex={0}
              aria-label={`Start of segment ${i + 1}`}
              aria-valuemin={range[0]}
              aria-valuemax={range[1]}
              aria-valuenow={hour}
              aria-valuetext={clockText(hour)}
              data-testid={`profile-handle-${i}`}
              onKeyDown={key(i)}
              onPointerDown={(e) => {
                if (e.button !== 0) return;
                e.preventDefault();
                (e.currentTarget as HTMLElement).setPointerCapture(e.pointerId);
                (e.currentTarget as HTMLElement).focus();
                setDrag({ index: i, hour: segments[i]!.startHour });
              }}
              onPointerMove={(e) => {
                if (!drag || drag.index !== i) return;
                setDrag({ index: i, hour: snapHour(hourAt(e.clientX), range) });
              }}
              onPointerUp={(e) => {
                if (!drag || drag.index !== i) return;
                const hour = snapHour(hourAt(e.clientX), range);
                setDrag(null);
                if (hour !== segments[i]!.startHour) onMove(i, hour);
              }}
              onPointerCancel={() => setDrag(null)}
            >
              <span class="day-strip__grip" aria-hidden="true" />
            </div>
          );
        })}
      </div>
      <div class="day-strip__ticks" aria-hidden="true">
        {[0, 6, 12, 18, 24].map((h) => (
          <span key={h} style={{ left: pct(h) }}>
            {clockText(h)}
          </span>
        ))}
      </div>
    </div>
  );
}
