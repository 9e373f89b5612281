/** The runtime spread as the command line prints it. */
import { sigText } from '../../model/message.ts';
import { INPUT_WORDS, SPREAD_INPUTS, type SpreadInput, type Tolerances } from './tolerances.ts';
import type { SampleFigures, SpreadResult, Swing } from './run.ts';
import type { HistogramBin, Percentiles } from './stats.ts';

const h = (v: number) => `${sigText(v, 3)} h`;
const ah = (v: number) => `${sigText(v, 4)} Ah`;
const money = (v: number) => sigText(v, 4);

/** A tolerance as the user set it. */
export function toleranceText(input: SpreadInput, t: Tolerances): string {
  const v = sigText(t[input], 3);
  switch (input) {
    case 'aging':
      return `up to ${v} % of rated capacity lost`;
    case 'temperature':
      return `± ${v} °C`;
    case 'efficiency':
      return `± ${v} ${t[input] === 1 ? 'point' : 'points'}`;
    case 'endVoltage':
      return `± ${v} V per cell`;
    default:
      return `± ${v} %`;
  }
}

const triple = (p: Percentiles | null, f: (v: number) => string) => (p ? `P10 ${f(p.p10)}, P50 ${f(p.p50)}, P90 ${f(p.p90)}` : 'no figure');

/** A histogram as rows of #, the bin's edges (with the unit after them) and its count. */
function histogramLines(title: string, bins: readonly HistogramBin[], unit: string, digits: number): string[] {
  const lines = [`  ${title}:`];
  const most = Math.max(1, ...bins.map((b) => b.count));
  for (const b of bins) lines.push(`    ${sigText(b.from, digits).padStart(7)}–${sigText(b.to, digits).padEnd(7)}${unit ? ` ${unit}` : ''} ${'#'.repeat(Math.round((30 * b.count) / most)).padEnd(30)} ${b.count}`);
  return lines;
}

/** One ranking: each input's figure at both ends and its swing. */
function swingLines(swings: readonly Swing[], value: (f: SampleFigures) => number | null, swing: (s: Swing) => number | null, f: (v: number) => string): string[] {
  return swings.map((w) => {
    const end = (s: SampleFigures | null) => {
      const v = s ? value(s) : null;
      return v !== null ? f(v) : 'refused';
    };
    const sw = swing(w);
    return `    ${INPUT_WORDS[w.input]}: ${end(w.low)} at the low end, ${end(w.high)} at the high end (swing ${sw !== null ? f(sw) : 'unknown'})`;
  });
}

export function formatSpread(s: SpreadResult): string {
  const lines: string[] = [];
  lines.push(`Runtime with its spread: ${s.samples} samples, seed ${s.seed}`);
  lines.push(`  Method: ${s.method}.`);
  lines.push('  Tolerances:');
  for (const input of SPREAD_INPUTS) lines.push(`    ${INPUT_WORDS[input]}: ${toleranceText(input, s.tolerances)}`);
  lines.push(`  Single run (the project as given): ${s.single.lowerBound ? 'longer than ' : ''}${h(s.single.runtimeH)}`);
  lines.push(`  Runtime: ${triple(s.runtimeH, h)}${s.runtimeH ? ` (from ${h(s.runtimeH.min)} to ${h(s.runtimeH.max)})` : ''}`);
  if (s.lowerBoundCount) lines.push(`    ${s.lowerBoundCount} samples reached the end of the study: their runtime is longer than shown.`);
  if (s.targetHours !== undefined) {
    lines.push(`  Bank for the target runtime of ${h(s.targetHours)} (whole strings): ${triple(s.bankAh, ah)}`);
    lines.push(`  Capacity the target needs, before rounding to whole strings: ${triple(s.requiredAh, ah)}`);
  }
  if (s.costPerYear) lines.push(`  Yearly cost of the losses: ${triple(s.costPerYear, money)}`);
  else lines.push('  Yearly cost of the losses: no energy price per kWh in the project\'s running settings, so no cost figures, histogram or ranking.');
  lines.push(...histogramLines('Runtime histogram', s.histogram, 'h', 3));
  if (s.requiredHistogram && s.requiredHistogram.length > 0) lines.push(...histogramLines('Capacity the target needs histogram (before rounding to whole strings)', s.requiredHistogram, 'Ah', 4));
  if (s.costHistogram && s.costHistogram.length > 0) lines.push(...histogramLines('Yearly cost of the losses histogram (in the price\'s currency)', s.costHistogram, '', 4));
  lines.push(`  Which input moves the runtime most (${s.sensitivityMethod}):`);
  lines.push(...swingLines(s.sensitivity, (f) => f.runtimeH, (w) => w.runtimeSwingH, h));
  if (s.costSensitivity && s.costSensitivity.length > 0) {
    lines.push(`  Which input moves the yearly cost of the losses most (${s.costSensitivityMethod}):`);
    lines.push(...swingLines(s.costSensitivity, (f) => f.costPerYear, (w) => w.costSwing, money));
  }
  if (s.failed) lines.push(`  ${s.failed} samples were refused, e.g. ${s.failures[0]!.message}`);
  lines.push("  Tolerances left unset take a typical value: use the maker's figure.");
  lines.push("  Size the bank from the runtime's P10 (one sample in ten runs shorter) or from the bank row's P90 (one sample in ten needs a bigger bank), not from the middle.");
  lines.push('  Planning estimate: local codes and licensed practice govern the bank and its protection.');
  return lines.join('\n');
}
