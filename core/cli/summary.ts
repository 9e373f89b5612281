/**
 * One line (or one CSV row) per project for `joulepath solve` on several files (pure; no Node APIs).
 * A solved project gives its source, load and loss power, efficiency, number of warnings and, when
 * the project has a backup study, the runtime; a refused one gives the first reason (core/cli/cli.ts
 * prints every reason on standard error).
 */
import type { SolveResult } from '../model/result.ts';

/** What one project gave: its figures, or the reasons it was refused. */
export type ProjectLine =
  | { file: string; ok: true; result: SolveResult; backupRuntimeHours?: number; backupRuntimeIsLowerBound?: boolean }
  | { file: string; ok: false; projectName?: string; reasons: readonly string[] };

/** The CSV header, in order (also printed by `--help`). */
export const CSV_COLUMNS = [
  'file',
  'status',
  'project',
  'source_power_W',
  'load_power_W',
  'losses_W',
  'efficiency_percent',
  'warnings',
  'backup_runtime_h',
  'backup_runtime_lower_bound',
  'reason',
] as const;

/** Fixed decimals, but never more than 6 significant digits (as the tables, core/cli/text-report.ts). */
function figure(x: number, digits: number): string {
  const fixed = x.toFixed(digits);
  return fixed.replace(/^-|\./g, '').replace(/^0+/, '').length > 6 && Math.abs(x) < 1e21 ? String(Number(x.toPrecision(6))) : fixed;
}

const hours = (h: number): string => figure(h, 2);

/** The first reason, and how many more there are. */
function firstReason(reasons: readonly string[]): string {
  const first = reasons[0] ?? 'refused';
  return reasons.length > 1 ? `${first} (and ${reasons.length - 1} more)` : first;
}

/** `<file>: solved: <name>: source … W, …` or `<file>: refused: <first reason>`. */
export function summaryLine(p: ProjectLine): string {
  if (!p.ok) return `${p.file}: refused: ${firstReason(p.reasons)}`;
  const t = p.result.totals;
  const n = p.result.warnings.length;
  const backup = p.backupRuntimeHours === undefined ? '' : `, backup runtime ${p.backupRuntimeIsLowerBound ? 'over ' : ''}${hours(p.backupRuntimeHours)} h`;
  return `${p.file}: solved: ${p.result.projectName}: source ${figure(t.sourcePower, 1)} W, loads ${figure(t.loadPower, 1)} W, losses ${figure(t.losses, 1)} W, efficiency ${(100 * t.efficiency).toFixed(2)} %, ${n} warning${n === 1 ? '' : 's'}${backup}`;
}

/**
 * One CSV field (RFC 4180: quoted when it holds a comma, quote or line break; quotes doubled). A
 * text starting with =, +, -, @ or a tab is prefixed with ' so a spreadsheet does not run it as a
 * formula (common practice for CSV meant for spreadsheets, no source); numbers are written as they are.
 */
export function csvField(value: string | number | undefined, text = true): string {
  if (value === undefined) return '';
  let s = String(value);
  if (text && /^[=+\-@\t\r]/.test(s)) s = `'${s}`;
  return /[",\r\n]/.test(s) ? `"${s.replace(/"/g, '""')}"` : s;
}

/** The header row. */
export const csvHeader = (): string => CSV_COLUMNS.join(',');

/** One CSV row in the order of CSV_COLUMNS. */
export function csvRow(p: ProjectLine): string {
  if (!p.ok) return [csvField(p.file), 'refused', csvField(p.projectName), '', '', '', '', '', '', '', csvField(firstReason(p.reasons))].join(',');
  const t = p.result.totals;
  return [
    csvField(p.file),
    'solved',
    csvField(p.result.projectName),
    figure(t.sourcePower, 1),
    figure(t.loadPower, 1),
    figure(t.losses, 1),
    (100 * t.efficiency).toFixed(2),
    String(p.result.warnings.length),
    p.backupRuntimeHours === undefined ? '' : hours(p.backupRuntimeHours),
    p.backupRuntimeHours === undefined ? '' : p.backupRuntimeIsLowerBound ? 'yes' : 'no',
    '',
  ].join(',');
}
