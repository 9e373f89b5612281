/**
 * The comparison of a project's variants as plain text (the command line's `--variants`): one
 * line per figure, one column per option, "*" before the figures that differ between the options;
 * the variants' notes and any problems below. Money is printed without a symbol (the file holds a
 * plain number in the user's currency).
 */
import { formatProblem } from '../../model/errors.ts';
import { sigText } from '../../model/message.ts';
import type { ComparisonRow, VariantComparison } from './compare.ts';

const GROUP_HEADINGS: Record<ComparisonRow['group'], string> = {
  balance: 'Power',
  losses: 'Losses',
  cost: 'Cost',
  battery: 'Battery',
  cables: 'Cables',
  starts: 'Motor starts',
  warnings: 'Warnings',
};

/** One value in the text's units: W, kWh, h, A, %, Ah, years; money to 2 decimals. */
export function comparisonValueText(row: Pick<ComparisonRow, 'quantity'>, v: number | string | null): string {
  if (v === null) return '—';
  if (typeof v === 'string') return v;
  switch (row.quantity) {
    case 'power':
      return `${sigText(v, 4)} W`;
    case 'energy-per-year':
      return `${sigText(v, 4)} kWh`;
    case 'money':
    case 'money-per-year':
      return Math.abs(v) >= 1000 ? Math.round(v).toLocaleString('en-US') : v.toFixed(2);
    case 'current':
      return `${sigText(v, 4)} A`;
    case 'time':
      return `${sigText(v / 3600, 4)} h`;
    case 'capacity':
      return `${sigText(v, 4)} Ah`;
    case 'fraction':
      return `${sigText(v * 100, 4)} %`;
    case 'percent':
      return `${sigText(v, 3)} %`;
    case 'years':
      return `${sigText(v, 3)} year${v === 1 ? '' : 's'}`;
    case 'litres-per-year':
      return `${sigText(v, 4)} L`;
    case 'kg-per-year':
      return `${sigText(v, 4)} kg`;
    default:
      return String(v);
  }
}

/** The comparison as a text table (see the file's top). */
export function formatVariantComparison(c: VariantComparison, project?: { name?: string }): string {
  const projectName = project?.name;
  const header = ['', ...c.columns.map((col) => col.name)];
  const lines: string[][] = [];
  let group: string | undefined;
  for (const r of c.rows) {
    if (r.group !== group) {
      group = r.group;
      lines.push([GROUP_HEADINGS[r.group]]);
    }
    lines.push([`${r.differs ? '* ' : '  '}${r.label}`, ...r.values.map((v, i) => (c.columns[i]!.ok ? comparisonValueText(r, v) : 'not solved'))]);
  }
  const widths = header.map((h, i) => Math.max(h.length, ...lines.map((l) => (l.length > 1 ? (l[i] ?? '').length : 0))));
  const fmt = (cells: string[]) => (cells.length === 1 ? cells[0]! : cells.map((s, i) => s.padEnd(widths[i]!)).join('  ').trimEnd());
  const out = [`Variants side by side${projectName ? `: ${projectName}` : ''} (* marks figures that differ between the options)`, fmt(header), ...lines.map(fmt)];
  if (c.columns.length === 1) out.push('The project has no variants yet: add them to "variants" in the file (or in the page\'s "Compare options").');
  const basis = c.lossesOverProfile ? "worked out over the load profile's day (each load state solved through the chain)" : 'at the solved operating point';
  if (c.cost) out.push(`Losses costed at ${sigText(c.cost.pricePerKWh, 4)} per kWh for ${sigText(c.cost.hoursPerYear, 5)} h a year${c.lossesOverProfile ? `, ${basis}, each stretch at its hours' price` : ''}.`);
  else out.push(`Energy lost a year: the losses ${basis} for ${sigText(c.hoursPerYear, 5)} h a year (no energy price given, so no cost).`);
  if (c.lifetime) out.push(`Lifetime cost over ${c.lifetime.years} year${c.lifetime.years === 1 ? '' : 's'} at a discount rate of ${sigText(c.lifetime.discountRate * 100, 3)} %${c.columns.length > 1 ? '; break-even and payback of each option against the plan as it stands' : ''}.`);
  out.push(...c.methods);
  for (const col of c.columns) {
    if (col.note) out.push(`${col.name}: ${col.note}`);
    for (const p of col.problems) out.push(`${col.name}: not solved: ${formatProblem(p, project)}`);
    for (const s of col.studyProblems) for (const p of s.problems) out.push(`${col.name}: the ${s.study === 'starting' ? 'starting' : s.study === 'battery' ? 'battery backup' : s.study === 'lifetime' ? 'cost over the years' : 'cost'} study cannot run: ${formatProblem(p, project)}`);
  }
  out.push(...c.cautions);
  return out.join('\n');
}
