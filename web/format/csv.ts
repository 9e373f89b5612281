/**
 * A results table as CSV (RFC 4180): what the "CSV" button beside a table's heading downloads.
 *
 * The table is read as it is shown (the figures the page formatted in the user's locale and unit
 * system), so every table exports the same way with no second copy of its columns. A column whose
 * every figure reads as a number with a unit of one kind becomes a numeric column: the unit (base
 * unit, no prefix, in the unit system shown: W, V, A, m or ft, °C or °F …) goes into the header
 * ("Power (W)") and the cells hold plain numbers, dot decimals, no digit grouping ("1234.5"), so a
 * spreadsheet or a script reads them in any locale. Any other column is kept as text.
 *
 * RFC 4180: fields separated by commas, records by CRLF; a field holding a comma, a double quote,
 * CR or LF is enclosed in double quotes, with each double quote doubled (§2, rules 4–7). A text
 * field that would start a spreadsheet formula (=, +, -, @) is prefixed with an apostrophe
 * (OWASP "CSV Injection" advice); numbers never are.
 */
import { parseLocaleNumber } from './parse.ts';

/** One cell of a table as laid out: its text and how many rows and columns it spans. */
export interface GridCell {
  text: string;
  rowSpan?: number;
  colSpan?: number;
}

/** Prefixes the page prints before a unit (web/format/number.ts formatWithPrefix: k, M, G; m and µ elsewhere). */
const PREFIX: Record<string, number> = { G: 1e9, M: 1e6, k: 1e3, m: 1e-3, µ: 1e-6, '\u03bc': 1e-6 };

/** Units the page prints after a figure: a column of one of these becomes numeric. */
const UNITS = new Set(['W', 'var', 'VA', 'V', 'A', 'Hz', 'rpm', 'Wh', 'Ah', 'm', 'ft', '°C', '°F', 'K', 'mm²', 'kcmil', 'hp', 'Ω', 'h', 's', 'min', 'kg', 'lb', 'm³/h', 'gpm']);

/** A figure read back from the page: the value in the unit's base (no prefix) and that unit. */
export interface Figure {
  value: number;
  unit: string;
}

const SPACES = /[\s\u00a0\u202f\u2009]+/g;

/** Split a shown figure ("1.234 kW", "12,5 %", "−3 A", "230") into value and base unit; null when it is not one figure. */
export function readFigure(text: string, locale?: string): Figure | null {
  const s = text.replace(SPACES, ' ').trim().replace(/\u2212/g, '-');
  if (s === '') return null;
  // Per cent (Intl puts the sign after, with or without a space, in most locales).
  const pct = /^(.*?) ?%$/.exec(s);
  if (pct) {
    const n = parseLocaleNumber(pct[1]!, locale);
    return n.kind === 'number' ? { value: n.value, unit: '%' } : null;
  }
  // The unit is the last word when it does not start with a digit ("1 234,5 kW": a locale may group with spaces).
  const m = /^(.*\d)\s?([\p{L}°][^\s]*)$/u.exec(s);
  const n = parseLocaleNumber(m ? m[1]! : s, locale);
  if (n.kind !== 'number') return null;
  const unit = m?.[2];
  if (unit === undefined) return { value: n.value, unit: '' };
  if (UNITS.has(unit)) return { value: n.value, unit };
  const factor = PREFIX[unit[0]!];
  const base = unit.slice(1);
  if (factor !== undefined && UNITS.has(base)) return { value: clean(n.value * factor), unit: base };
  return null;
}

/** 15 significant digits: 1.234 kW is 1234 W, not 1233.9999999999998. */
const clean = (x: number): number => (x === 0 ? 0 : Number(x.toPrecision(15)));

/** A number as CSV writes it: dot decimals, no grouping, no exponent for everyday magnitudes. */
export function csvNumber(value: number): string {
  return String(clean(value));
}

/** One field, quoted as RFC 4180 §2 asks. */
export function csvField(text: string, numeric = false): string {
  let t = text;
  if (!numeric && /^[=+\-@\t\r]/.test(t)) t = `'${t}`;
  return /[",\r\n]/.test(t) ? `"${t.replace(/"/g, '""')}"` : t;
}

/** Records as CSV text: fields joined by commas, records ended by CRLF (RFC 4180 §2 rules 1–2). */
export function toCsv(rows: readonly (readonly { text: string; numeric?: boolean }[])[]): string {
  return rows.map((r) => r.map((f) => csvField(f.text, f.numeric)).join(',')).join('\r\n') + '\r\n';
}

/** Rows of spanning cells laid out on a grid: a cell spanning rows or columns repeats its text in each. */
export function layGrid(rows: readonly (readonly GridCell[])[]): string[][] {
  const grid: string[][] = [];
  rows.forEach((row, r) => {
    grid[r] ??= [];
    let c = 0;
    for (const cell of row) {
      while (grid[r]![c] !== undefined) c++;
      const rs = Math.max(1, cell.rowSpan ?? 1);
      const cs = Math.max(1, cell.colSpan ?? 1);
      for (let i = 0; i < rs && r + i < rows.length; i++) {
        grid[r + i] ??= [];
        for (let j = 0; j < cs; j++) grid[r + i]![c + j] = cell.text;
      }
      c += cs;
    }
  });
  const width = Math.max(0, ...grid.map((g) => g.length));
  return grid.map((g) => Array.from({ length: width }, (_, i) => g[i] ?? ''));
}

const tidy = (s: string) => s.replace(SPACES, ' ').trim();
/** Cells that say "no figure here". */
const EMPTY = new Set(['', '—', '–', '-', 'n/a']);

/**
 * The table's CSV: header rows (joined into one header per column), body rows; numeric columns as
 * described at the top of this file.
 */
export function tableCsv(head: readonly (readonly GridCell[])[], body: readonly (readonly GridCell[])[], locale?: string): string {
  const headGrid = layGrid(head.map((r) => r.map((c) => ({ ...c, text: tidy(c.text) }))));
  const bodyGrid = layGrid(body.map((r) => r.map((c) => ({ ...c, text: tidy(c.text) }))));
  const width = Math.max(headGrid[0]?.length ?? 0, bodyGrid[0]?.length ?? 0);
  const headers = Array.from({ length: width }, (_, i) => {
    const parts: string[] = [];
    for (const row of headGrid) if (row[i] && !parts.includes(row[i]!)) parts.push(row[i]!);
    return parts.join(' ');
  });
  // Which columns are numeric, and in which unit.
  const units = headers.map((_, i) => {
    let unit: string | undefined;
    let any = false;
    for (const row of bodyGrid) {
      const t = row[i] ?? '';
      if (EMPTY.has(t)) continue;
      const f = readFigure(t, locale);
      if (!f || (unit !== undefined && f.unit !== unit)) return null;
      unit = f.unit;
      any = true;
    }
    return any ? (unit ?? '') : null;
  });
  const headRow = headers.map((h, i) => {
    const u = units[i];
    return { text: u ? `${h} (${u})` : h };
  });
  const bodyRows = bodyGrid.map((row) =>
    row.map((t, i) => {
      if (units[i] === null || units[i] === undefined) return { text: t };
      if (EMPTY.has(t)) return { text: '', numeric: true };
      return { text: csvNumber(readFigure(t, locale)!.value), numeric: true };
    }),
  );
  return toCsv(headers.length ? [headRow, ...bodyRows] : bodyRows);
}

/** A file name from the project's name and the table's: letters and digits kept, the rest one dash. */
export function csvFileName(project: string, table: string): string {
  const slug = (s: string) =>
    s
      .normalize('NFKC')
      .replace(/[^\p{L}\p{N}]+/gu, '-')
      .replace(/^-+|-+$/g, '')
      .toLowerCase()
      .slice(0, 60)
      .replace(/-+$/, '');
  return `${[slug(project) || 'project', slug(table) || 'table'].join('-')}.csv`;
}
