/**
 * A histogram of a spread (the runtime, the bank for the target, the yearly cost of the losses): an
 * SVG of our own (bars of equal width, P10/P50/P90 marked), labelled, with its text alternative (a
 * caption in words and the bins as a table). The figure's name and format come from the panel.
 */
import type { HistogramBin, Percentiles } from '../../../core/studies/index.ts';

const W = 360;
const H = 170;
const PAD = { left: 34, right: 10, top: 14, bottom: 36 };
/** Room a mark's label ("P90") takes beside its line, px of the viewBox (10 px text). */
const LABEL_W = 21;

export interface HistogramProps {
  bins: HistogramBin[];
  /** The same samples' percentiles (marked, and said in the caption). */
  p: Percentiles;
  /** A value in the user's unit or money ("25.6 h", "398 Ah", "$1,816.00"). */
  format: (v: number) => string;
  /** The figure, as the axis and the caption name it ("Runtime"). */
  name: string;
  testId: string;
}

export function Histogram({ bins, p, format: h, name, testId }: HistogramProps) {
  if (bins.length === 0) return null;
  const captionId = `${testId}-caption`;
  const lo = bins[0]!.from;
  const hi = bins[bins.length - 1]!.to;
  const span = hi - lo || 1;
  const most = Math.max(...bins.map((b) => b.count));
  const x = (v: number) => PAD.left + ((v - lo) / span) * (W - PAD.left - PAD.right);
  const y = (c: number) => H - PAD.bottom - (c / most) * (H - PAD.top - PAD.bottom);
  const single = bins.length === 1;
  const barW = single ? 24 : (W - PAD.left - PAD.right) / bins.length;
  const marks: [string, number][] = [
    ['P10', p.p10],
    ['P50', p.p50],
    ['P90', p.p90],
  ];
  // P10's label to the left of its line and P90's to the right, unless it would run off the plot
  // (a figure whose samples crowd one end): then on the other side.
  const side = (i: number, v: number) => {
    if (i === 1) return 0;
    if (i === 0) return x(v) - LABEL_W < PAD.left ? 1 : -1;
    return x(v) + LABEL_W > W - PAD.right / 2 ? -1 : 1;
  };
  const caption = `${name} of ${p.count} samples from ${h(p.min)} to ${h(p.max)}: P10 ${h(p.p10)}, P50 ${h(p.p50)}, P90 ${h(p.p90)}.`;
  return (
    <figure class="spread-figure" data-testid={testId}>
      <svg viewBox={`0 0 ${W} ${H}`} role="img" aria-labelledby={captionId} class="spread-chart">
        <line x1={PAD.left} x2={W - PAD.right} y1={H - PAD.bottom} y2={H - PAD.bottom} class="spread-axis" />
        <line x1={PAD.left} x2={PAD.left} y1={PAD.top} y2={H - PAD.bottom} class="spread-axis" />
        {bins.map((b, i) => (
          <rect key={i} class="spread-bar" x={single ? x(b.from) - barW / 2 : PAD.left + i * barW + 0.5} width={Math.max(1, barW - 1)} y={y(b.count)} height={H - PAD.bottom - y(b.count)} />
        ))}
        {!single &&
          marks.map(([label, v], i) => (
            <g key={label} class="spread-mark">
              <line x1={x(v)} x2={x(v)} y1={PAD.top - 4} y2={H - PAD.bottom} />
              <text x={x(v) + side(i, v) * 3} y={i === 1 ? PAD.top - 5 : PAD.top + 8} text-anchor={side(i, v) < 0 ? 'end' : side(i, v) > 0 ? 'start' : 'middle'}>
                {label}
              </text>
            </g>
          ))}
        <text x={PAD.left} y={H - PAD.bottom + 14} text-anchor="start" class="spread-tick">
          {h(lo)}
        </text>
        <text x={W - PAD.right} y={H - PAD.bottom + 14} text-anchor="end" class="spread-tick">
          {h(hi)}
        </text>
        <text x={(PAD.left + W - PAD.right) / 2} y={H - 4} text-anchor="middle" class="spread-tick">
          {name}
        </text>
        <text x={PAD.left - 4} y={PAD.top + 4} text-anchor="end" class="spread-tick">
          {most}
        </text>
        <text x={PAD.left - 4} y={H - PAD.bottom} text-anchor="end" class="spread-tick">
          0
        </text>
        <text x={12} y={(PAD.top + H - PAD.bottom) / 2} text-anchor="middle" class="spread-tick" transform={`rotate(-90 12 ${(PAD.top + H - PAD.bottom) / 2})`}>
          Samples
        </text>
      </svg>
      <figcaption id={captionId}>{caption}</figcaption>
      <details class="spread-table">
        <summary>The histogram as a table</summary>
        <table class="data">
          <thead>
            <tr>
              <th scope="col">{name} from</th>
              <th scope="col">to</th>
              <th scope="col">Samples</th>
            </tr>
          </thead>
          <tbody>
            {bins.map((b, i) => (
              <tr key={i}>
                <td>{h(b.from)}</td>
                <td>{h(b.to)}</td>
                <td>{b.count}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </details>
    </figure>
  );
}
