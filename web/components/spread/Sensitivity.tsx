/**
 * Which input moves a figure most (the runtime, or the yearly cost of the losses): each input's figure
 * at the low and at the high end of its tolerance, the others at the project's values (core's
 * one-at-a-time swings), in core's ranking for that figure, as bars about the single run's figure.
 * Each row says its figures in words; the bars are drawn beside them.
 */
import type { SampleFigures, Swing } from '../../../core/studies/index.ts';
import { INPUT_WORDS } from '../../../core/studies/index.ts';

const W = 200;
const H = 16;

export interface SensitivityProps {
  /** Ranked as core ranks them for this figure. */
  swings: Swing[];
  single: SampleFigures;
  /** The figure of a run (null: none, e.g. no price). */
  value: (f: SampleFigures) => number | null;
  /** The ranking's key of a swing. */
  swing: (s: Swing) => number | null;
  /** A value in the user's unit or money. */
  format: (v: number) => string;
  testId: string;
}

export function Sensitivity({ swings, single, value, swing, format: h, testId }: SensitivityProps) {
  const at = (f: SampleFigures | null) => (f ? (value(f) ?? undefined) : undefined);
  const mid = value(single) ?? 0;
  const ends = swings.flatMap((s) => [at(s.low), at(s.high)]).filter((v): v is number => v !== undefined);
  const lo = Math.min(mid, ...ends);
  const hi = Math.max(mid, ...ends);
  const span = hi - lo || 1;
  const x = (v: number) => 4 + ((v - lo) / span) * (W - 8);
  return (
    <ol class="spread-sensitivity" data-testid={testId}>
      {swings.map((s) => {
        const a = at(s.low);
        const b = at(s.high);
        const sw = swing(s);
        return (
          <li key={s.input} data-input={s.input}>
            <span class="spread-sensitivity__name">{INPUT_WORDS[s.input]}</span>
            <svg viewBox={`0 0 ${W} ${H}`} class="spread-sensitivity__bar" aria-hidden="true" focusable="false">
              {a !== undefined && b !== undefined && <rect class="spread-bar" x={Math.min(x(a), x(b))} width={Math.max(1, Math.abs(x(b) - x(a)))} y={3} height={H - 6} />}
              <line class="spread-single" x1={x(mid)} x2={x(mid)} y1={0} y2={H} />
            </svg>
            <span class="spread-sensitivity__figures">
              {a !== undefined ? h(a) : 'refused'} at the low end, {b !== undefined ? h(b) : 'refused'} at the high end
              {sw !== null ? (sw === 0 ? ' (does not move it)' : ` (swing ${h(sw)})`) : ''}
            </span>
          </li>
        );
      })}
    </ol>
  );
}
