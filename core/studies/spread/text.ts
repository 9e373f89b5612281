/** The runtime spread as the command line prints it. */
import { sigText } from '../../model/message.ts';
import { INPUT_WORDS, SPREAD_INPUTS, type SpreadInput, type Tolerances } from './tolerances.ts';
import type { SpreadResult } from './run.ts';
import type { Percentiles } from './stats.ts';

const h = (v: number) => `${sigText(v, 3)} h`;

/** A tolerance as the user set it. */
export function toleranceText(input: SpreadInput, t: Tolerances): string {
  const v = sigText(t[input], 3);
  switch (input) {
    case 'aging':
      return `up to ${v} % of rated capacity lost`;
    case 'temperature':
      return `± ${v} °C`;
    case 'efficiency':
      return `± ${v} points`;
    case 'endVoltage':
      return `± ${v} V per cell`;
    default:
      return `± ${v} %`;
  }
}

const triple = (p: Percentiles | null, f: (v: number) => string) => (p ? `P10 ${f(p.p10)}, P50 ${f(p.p50)}, P90 ${f(p.p90)}` : 'no figure');

export function formatSpread(s: SpreadResult): string {
  const lines: string[] = [];
  lines.push(`Runtime with its spread: ${s.samples} samples, seed ${s.seed}`);
  lines.push(`  Method: ${s.method}.`);
  lines.push('  Tolerances:');
  for (const input of SPREAD_INPUTS) lines.push(`    ${INPUT_WORDS[input]}: ${toleranceText(input, s.tolerances)}`);
  lines.push(`  Single run (the project as given): ${s.single.lowerBound ? 'longer than ' : ''}${h(s.single.runtimeH)}`);
  lines.push(`  Runtime: ${triple(s.runtimeH, h)}${s.runtimeH ? ` (from ${h(s.runtimeH.min)} to ${h(s.runtimeH.max)})` : ''}`);
  if (s.lowerBoundCount) lines.push(`    ${s.lowerBoundCount} samples reached the end of the study: their runtime is longer than shown.`);
  if (s.targetHours !== undefined) lines.push(`  Bank for the target runtime of ${h(s.targetHours)}: ${triple(s.bankAh, (v) => `${sigText(v, 4)} Ah`)}`);
  if (s.costPerYear) lines.push(`  Yearly cost of the losses: ${triple(s.costPerYear, (v) => sigText(v, 4))}`);
  lines.push('  Runtime histogram:');
  const most = Math.max(1, ...s.histogram.map((b) => b.count));
  for (const b of s.histogram) lines.push(`    ${sigText(b.from, 3).padStart(7)}–${sigText(b.to, 3).padEnd(7)} h ${'#'.repeat(Math.round((30 * b.count) / most)).padEnd(30)} ${b.count}`);
  lines.push(`  Which input moves the runtime most (${s.sensitivityMethod}):`);
  for (const w of s.sensitivity) {
    const lo = w.low ? h(w.low.runtimeH) : 'refused';
    const hi = w.high ? h(w.high.runtimeH) : 'refused';
    lines.push(`    ${INPUT_WORDS[w.input]}: ${lo} at the low end, ${hi} at the high end (swing ${w.runtimeSwingH !== null ? h(w.runtimeSwingH) : 'unknown'})`);
  }
  if (s.failed) lines.push(`  ${s.failed} samples were refused, e.g. ${s.failures[0]!.message}`);
  lines.push("  Tolerances left unset take a typical value: use the maker's figure.");
  lines.push('  Planning estimate: local codes and licensed practice govern the bank and its protection.');
  return lines.join('\n');
}
