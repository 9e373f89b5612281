/**
 * The small "CSV" button beside a results table's heading: downloads the table as CSV
 * (web/format/csv.ts, loaded when pressed). Mount it in one line next to the heading:
 * `<CsvButton name="Cables" />`; it exports the first table after it in its section (or the table
 * whose caption holds it). The figures are those shown, in the user's units, numbers in a
 * machine-readable form; the file is named after the project and the table.
 */
import { lastSolved } from '../../state/editor.ts';
import { catchUpNow } from '../lag.ts';
import { effectiveLocale } from '../../state/prefs.ts';

/** The table the button belongs to: the one whose caption holds it, else the first after it in its section. */
function tableFor(button: HTMLElement): HTMLTableElement | null {
  const own = button.closest('table');
  if (own) return own;
  const scope = button.closest('section, details, article') ?? document.body;
  for (const t of scope.querySelectorAll('table')) {
    if (button.compareDocumentPosition(t) & Node.DOCUMENT_POSITION_FOLLOWING) return t;
  }
  return null;
}

/**
 * A cell's text as read: parts laid out apart (a name and its kind on two lines) are kept apart, a
 * note beside a figure in brackets ("48 V bank (Battery bank)"); decoration hidden from assistive
 * technology and buttons are left out.
 */
function cellText(node: Node): string {
  let out = '';
  for (const child of node.childNodes) {
    if (child.nodeType === Node.TEXT_NODE) out += child.textContent ?? '';
    else if (child instanceof HTMLElement) {
      if (child.getAttribute('aria-hidden') === 'true' || child.tagName === 'BUTTON') continue;
      const text = cellText(child).trim();
      if (!text) continue;
      if (child.matches('.el-name__kind, .cell-note')) out += ` (${text}) `;
      else out += getComputedStyle(child).display === 'inline' ? text : ` ${text} `;
    }
  }
  return out;
}

const rowsOf = (rows: Iterable<HTMLTableRowElement>) =>
  [...rows].map((r) => [...r.cells].map((c) => ({ text: c.dataset['csv'] ?? cellText(c), rowSpan: c.rowSpan, colSpan: c.colSpan })));

export async function downloadTableCsv(button: HTMLElement, name: string): Promise<void> {
  // A table scrolled out of view may still show the figures before the last edit (lag.ts): bring
  // every lagging part up to date, and read the table after the import has let that render.
  catchUpNow();
  const { tableCsv, csvFileName } = await import('../../format/csv.ts');
  const table = tableFor(button);
  if (!table) return;
  const head = table.tHead ? rowsOf(table.tHead.rows) : [];
  const body = [...table.tBodies].flatMap((b) => rowsOf(b.rows));
  // A byte-order mark, so spreadsheet programs read the file as UTF-8 (°C, mm², names in any script).
  const text = `\ufeff${tableCsv(head, body, effectiveLocale())}`;
  const url = URL.createObjectURL(new Blob([text], { type: 'text/csv;charset=utf-8' }));
  const a = document.createElement('a');
  a.href = url;
  a.download = csvFileName(lastSolved.peek()?.project.name ?? '', name);
  document.body.append(a);
  a.click();
  a.remove();
  setTimeout(() => URL.revokeObjectURL(url), 10_000);
}

export function CsvButton({ name }: { name: string }) {
  return (
    <button
      type="button"
      class="csv-button"
      aria-label={`Download “${name}” as CSV`}
      title="Download this table as CSV (opens in a spreadsheet)"
      data-testid="csv-button"
      data-table={name}
      onClick={(e) => void downloadTableCsv(e.currentTarget, name)}
    >
      CSV
    </button>
  );
}
