/**
 * Which input moves the runtime most: each input's runtime at the low and at the high end of its
 * tolerance, the others at the project's values (core's one-at-a-time swings), largest first, as bars
 * about the single run's runtime. Each row says its figures in words; the bars are drawn beside them.
 */
import type { SampleFigures, Swing } from '../../../core/studies/index.ts';
import { INPUT_WORDS } from '../../../core/studies/index.ts';
import { formatSignificant } from '../../format/number.ts';

const W = 200;
const H = 16;

export function Sensitivity({ swings, single, locale }: { swings: Swing[]; single: SampleFigures; locale: string | undefined }) {
  const h = (v: number) => `${formatSignificant(v, 3, locale)} h`;
  const ends = swings.flatMap((s) => [s.low?.runtimeH, s.high?.runtimeH]).filter((v): v is number => v !== undefined);
  const lo = Math.min(single.runtimeH, ...ends);
  const hi = Math.max(single.runtimeH, ...ends);
  const span = hi - lo || 1;
  const x = (v: number) => 4 + ((v - lo) / span) * (W - 8);
  return (
    <ol class="spread-sensitivity" data-testid="spread-sensitivity">
      {swings.map((s) => {
        const a = s.low?.runtimeH;
        const b = s.high?.runtimeH;
        return (
          <li key={s.input} data-input={s.input}>
            <span class="spread-sensitivity__name">{INPUT_WORDS[s.input]}</span>
            <svg viewBox={`0 0 ${W} ${H}`} class="spread-sensitivity__bar" aria-hidden="true" focusable="false">
              {a !== undefined && b !== undefined && <rect class="spread-bar" x={Math.min(x(a), x(b))} width={Math.max(1, Math.abs(x(b) - x(a)))} y={3} height={H - 6} />}
              <line class="spread-single" x1={x(single.runtimeH)} x2={x(single.runtimeH)} y1={0} y2={H} />
            </svg>
            <span class="spread-sensitivity__figures">
              {a !== undefined ? h(a) : 'refused'} at the low end, {b !== undefined ? h(b) : 'refused'} at the high end
              {s.runtimeSwingH !== null ? ` (swing ${h(s.runtimeSwingH)})` : ''}
            </span>
          </li>
        );
      })}
    </ol>
  );
}
