/**
 * A comparison figure (core/studies/variants/compare.ts, SI inside) in the user's units and number
 * format, for the panel's table, its CSV and the printed report. Formatting only: every figure is core's.
 */
import type { ComparisonRow } from '../../../core/studies/index.ts';
import { formatCurrent, formatDuration, formatEnergy, formatPercent, formatPower, formatSignificant, UNIT_GAP } from '../../format/number.ts';
import { formatMoney } from '../../format/panels.ts';

export function variantValueText(row: Pick<ComparisonRow, 'quantity'>, v: number | string | null, locale: string | undefined): string {
  if (v === null) return '—';
  if (typeof v === 'string') return v;
  switch (row.quantity) {
    case 'power':
      return formatPower(v, locale);
    case 'energy-per-year':
      return `${formatEnergy(v * 1000, locale)} a year`;
    case 'money':
      return formatMoney(v, locale);
    case 'money-per-year':
      return `${formatMoney(v, locale)} a year`;
    case 'current':
      return formatCurrent(v, locale);
    case 'time':
      return formatDuration(v, locale);
    case 'capacity':
      return `${formatSignificant(v, 4, locale)}${UNIT_GAP}Ah`;
    case 'fraction':
      return formatPercent(v, locale, 4);
    case 'percent':
      return formatPercent(v / 100, locale, 3);
    case 'years':
      return `${formatSignificant(v, 3, locale)} year${v === 1 ? '' : 's'}`;
    case 'litres-per-year':
      return `${formatSignificant(v, 4, locale)}${UNIT_GAP}L a year`;
    case 'kg-per-year':
      return `${formatSignificant(v, 4, locale)}${UNIT_GAP}kg a year`;
    default:
      return String(v);
  }
}
