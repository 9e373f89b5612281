/** The option search as plain text (the CLI's `--search`). */
import { sigText } from '../../model/message.ts';
import { durationWords } from './evaluate.ts';
import type { EvaluatedOption } from './evaluate.ts';
import type { SearchResult } from './search.ts';

/** The text lists every rejected option up to this many; past it, how many more (`--json` has all). */
export const TEXT_REJECTED_MAX = 50;

/** One rejected option in words: its name, its reasons, and the checks it was not put through. */
export function rejectedLine(o: EvaluatedOption): string {
  const skipped = o.skipped.length ? ` (not checked after that: ${o.skipped.join(', ')})` : '';
  return `${o.name}: ${o.reasons.map((r) => r.text).join('; ')}${skipped}`;
}

/** Money without a symbol (the file holds none): whole units from 1000 up, else two decimals. */
const money = (v: number) => (Math.abs(v) >= 1000 ? Math.round(v).toLocaleString('en-US') : v.toFixed(2));

export function formatSearch(s: SearchResult): string {
  const lines: string[] = [];
  lines.push(`Find the option: ${s.target.join('; ')}`);
  lines.push(`${s.tried} of ${s.combinations} combinations tried, ${s.metCount} met the target; ${s.options.length} on the list (none cheaper with lower losses), ${s.order === 'cost' ? 'cheapest' : 'lowest losses'} first`);
  if (s.capMessage) lines.push(s.capMessage);
  if (s.stopped) lines.push('The search was stopped before it had tried them all.');
  s.options.forEach((o, i) => {
    const parts = [`cost ${money(o.cost)}${o.missingPrices.length ? ` (no price for ${o.missingPrices.join(', ')})` : ''}`, `losses ${sigText(o.lossW, 3)} W`];
    if (o.yearlyLossCost !== undefined) parts.push(`${money(o.yearlyLossCost)} a year`);
    if (o.installedAh !== undefined && o.sizing) parts.push(`bank ${sigText(o.installedAh, 4)} Ah (the sizing for the target: ${sigText(o.sizing.bankAh, 4)} Ah, needs ${sigText(o.sizing.requiredAh, 3)} Ah)`);
    if (o.runtimeSeconds !== undefined) parts.push(`runtime as new ${o.runtimeIsLowerBound ? 'at least ' : ''}${durationWords(o.runtimeSeconds)}`);
    lines.push(`  ${i + 1}. ${o.name}: ${parts.join(', ')}`);
    lines.push(`     ${o.choices.map((c) => c.words).join('; ')}`);
  });
  if (s.options.length === 0) lines.push('  No option meets the target.');
  lines.push(`Rejected: ${s.rejected.length}`);
  for (const g of s.rejectedGroups) lines.push(`  ${g.group}: ${g.count}`);
  if (s.rejected.length) {
    const shown = s.rejected.slice(0, TEXT_REJECTED_MAX);
    lines.push(shown.length === s.rejected.length ? 'Each rejected option, with its reasons:' : `The first ${shown.length} rejected options, with their reasons:`);
    for (const o of shown) lines.push(`  ${rejectedLine(o)}`);
    const more = s.rejected.length - shown.length;
    if (more > 0) lines.push(`  … and ${more} more: --json lists every one with its reasons.`);
  }
  for (const n of s.notes) lines.push(n);
  lines.push(s.caution);
  return lines.join('\n');
}
