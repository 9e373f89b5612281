/**
 * The report's exports in real Chromium, against a production build: every results table downloads
 * as CSV (the file read back: RFC 4180, numbers plain, units in the header, in the user's unit
 * system); "Share read-only" makes a link that opens the project read-only in a fresh browser (no
 * editor, edits refused, nothing stored) and leaves the projects stored in this browser exactly as
 * they were, and "Save a copy" stores it as a new project; a damaged link says so and changes
 * nothing; the printed report carries the link as a QR code that decodes (jsQR) to the link itself.
 */
import { readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import jsQR from 'jsqr';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { skipWithout } from '../tools/system-tools.ts';
import { VIEWPORTS, artifacts, serveBuiltApp, watchPageErrors, seriousAxeViolations, type ServedApp, fullPageScreenshot, chooseSetting } from './harness.ts';
import { demoProjects, solveProject } from '../../core/index.ts';
import { csvFileName } from '../../web/format/csv.ts';
import { decodeShare } from '../../web/state/share.ts';
import { elementKindLabel } from '../../web/format/labels.ts';

/** RFC 4180 records (quoted fields, doubled quotes, CRLF), read strictly: anything else throws. */
function parseCsv(text: string): string[][] {
  const rows: string[][] = [];
  let row: string[] = [];
  let i = 0;
  while (i < text.length) {
    let field = '';
    if (text[i] === '"') {
      i++;
      for (;;) {
        if (i >= text.length) throw new Error('unterminated quoted field');
        if (text[i] === '"' && text[i + 1] === '"') {
          field += '"';
          i += 2;
        } else if (text[i] === '"') {
          i++;
          break;
        } else field += text[i++];
      }
    } else {
      while (i < text.length && text[i] !== ',' && text[i] !== '\r' && text[i] !== '\n') {
        if (text[i] === '"') throw new Error(`a quote inside an unquoted field at ${i}`);
        field += text[i++];
      }
    }
    row.push(field);
    if (text[i] === ',') i++;
    else if (text.startsWith('\r\n', i)) {
      rows.push(row);
      row = [];
      i += 2;
    } else throw new Error(`expected , or CRLF at ${i}`);
  }
  if (row.length) throw new Error('last record not ended by CRLF');
  return rows;
}

/** Everything IndexedDB holds for this origin, as JSON (what "nothing stored was touched" compares). */
const STORED = `(async () => {
  const out = {};
  for (const info of await indexedDB.databases()) {
    const db = await new Promise((ok, no) => { const r = indexedDB.open(info.name); r.onsuccess = () => ok(r.result); r.onerror = () => no(r.error); });
    for (const name of db.objectStoreNames) {
      const all = await new Promise((ok, no) => { const r = db.transaction(name).objectStore(name).getAll(); r.onsuccess = () => ok(r.result); r.onerror = () => no(r.error); });
      out[info.name + '/' + name] = all;
    }
    db.close();
  }
  return JSON.stringify(out);
})()`;

const NUMBER = /^-?\d+(\.\d+)?(e[-+]\d+)?$/;

describe.skipIf(skipWithout('chromium'))('CSV, share link and QR in Chromium', () => {
  let app: ServedApp | undefined;
  let browser: Browser | undefined;
  let baseUrl = '';

  beforeAll(async () => {
    app = await serveBuiltApp('joulepath-share-build-');
    ({ browser, baseUrl } = app);
  });

  afterAll(async () => {
    await app?.close();
  });

  async function newContext(): Promise<BrowserContext> {
    const context = await browser!.newContext({ viewport: VIEWPORTS.desktop, deviceScaleFactor: 1, locale: 'en-US', acceptDownloads: true });
    // An energy price kept on this device: a project without its own price (every demo) starts from it,
    // so the yearly cost table shows without editing the demo (an edit would save it as "my copy").
    await context.addInitScript(`localStorage.setItem('joulepath.cost.v1', '{"pricePerKWh":0.25,"hoursPerYear":8760}')`);
    return context;
  }

  async function openDemo(page: Page, id: string): Promise<void> {
    await page.goto(`${baseUrl}#demo=${id}`, { waitUntil: 'load' });
    await page.getByTestId('results').waitFor();
  }

  /** Open every study panel and wait until its tables are drawn (a panel without a table gives up quietly). */
  async function openPanels(page: Page, demoId?: string): Promise<void> {
    for (const id of ['battery', 'conductor', 'machines', 'starting']) {
      const panel = page.getByTestId(`panel-${id}`);
      if ((await panel.count()) === 0) continue;
      await panel.locator('summary').first().click();
      try {
        await expect.poll(() => panel.locator('table').count(), { timeout: 15_000 }).toBeGreaterThan(0);
      } catch {
        // This demo gives that panel no table.
      }
      // The yearly cost of losses needs an energy price: the demo's own (`running`), or else this device's
      // (newContext), which a demo without one starts from.
      const price = panel.locator('input[data-testid="cost-price"]');
      if ((await price.count()) > 0) {
        const own = (demoProjects.find((d) => d.id === demoId)?.project as { running?: { energyPricePerKWh?: number } } | undefined)?.running?.energyPricePerKWh;
        expect(await price.inputValue()).toBe(own !== undefined ? String(own) : '0.25');
        await panel.getByTestId('loss-cost-table').waitFor();
      }
      // Steps tucked in a disclosure inside a panel (the sizing's working) are opened too.
      for (const d of await panel.locator('details.panel-steps:not([open]) > summary').all()) await d.click();
    }
  }

  async function downloadCsv(page: Page, button: ReturnType<Page['locator']>): Promise<{ name: string; text: string }> {
    await button.scrollIntoViewIfNeeded();
    const table = await button.getAttribute('data-table');
    const [download] = await Promise.all([
      page.waitForEvent('download', { timeout: 10_000 }).catch((e: unknown) => {
        throw new Error(`no download for "${table}": ${String(e)}`);
      }),
      button.click(),
    ]);
    const text = readFileSync((await download.path())!, 'utf8');
    return { name: download.suggestedFilename(), text };
  }

  it('every results table downloads as CSV: RFC 4180, plain numbers with the unit in the header, named after project and table', async () => {
    const context = await newContext();
    const page = await context.newPage();
    const errors = watchPageErrors(page);
    const seen = new Set<string>();
    try {
      for (const demo of demoProjects) {
        await openDemo(page, demo.id);
        await openPanels(page, demo.id);
        const outcome = solveProject(demo.project);
        if (!outcome.ok) throw new Error('demo does not solve');
        await page.locator('[data-testid="csv-button"][data-table="Power at each element"]').scrollIntoViewIfNeeded();
        // The tables skip rendering off screen (content-visibility) and catch up when idle: let them paint.
        await expect.poll(() => page.getByTestId('element-table').evaluate((t) => (t as HTMLElement).innerText.length)).toBeGreaterThan(0);
        await page.screenshot({ path: join(artifacts, `csv-button-${demo.id}.png`) });
        const buttons = await page.getByTestId('csv-button').all();
        expect(buttons.length, demo.id).toBeGreaterThanOrEqual(3);
        for (const button of buttons) {
          const table = (await button.getAttribute('data-table'))!;
          const { name, text } = await downloadCsv(page, button);
          seen.add(table);
          expect(name, table).toBe(csvFileName(demo.project.name, table));
          // A byte-order mark (so spreadsheets read UTF-8), then RFC 4180 records.
          expect(text.startsWith('\ufeff'), table).toBe(true);
          const rows = parseCsv(text.slice(1));
          expect(rows.length, `${demo.id}: ${table}`).toBeGreaterThanOrEqual(2);
          const width = rows[0]!.length;
          for (const r of rows) expect(r.length, `${demo.id}: ${table}: ${r.join('|')}`).toBe(width);
          rows[0]!.forEach((head, c) => {
            if (!/\([^)]+\)$/.test(head)) return;
            for (const r of rows.slice(1)) expect(r[c]!, `${demo.id}: ${table}: ${head}`).toMatch(r[c] === '' ? /^$/ : NUMBER);
          });
          writeFileSync(join(artifacts, name), text);
          if (table === 'Power at each element') {
            // The name and its kind stay apart: "48 V LiFePO4 bank (Battery bank)", never glued together.
            const source = outcome.result.elements.find((e) => e.from === undefined)!;
            expect(rows.map((r) => r[0]), `${demo.id}: element names`).toContain(`${source.name} (${elementKindLabel(source.kind)})`);
            const p = rows[0]!.indexOf('P in (W)');
            expect(p, rows[0]!.join('|')).toBeGreaterThan(0);
          }
          if (table === 'Voltage, current and power at each port') {
            // The source's output port power as the engine computes it, to the 4 significant figures shown.
            const p = rows[0]!.indexOf('P (W)');
            expect(p, rows[0]!.join('|')).toBeGreaterThan(0);
            const source = outcome.result.elements.find((e) => e.from === undefined)!;
            const own = rows.filter((r) => r[0] === (source.name || source.id)).map((r) => Number(r[p]));
            expect(own, `${demo.id}: source row`).toContain(Number(source.output!.p.toPrecision(4)));
          }
        }
      }
      // Every table the brief names: the element, port and cable tables, and one or more in each study panel.
      for (const t of ['Power at each element', 'Voltage, current and power at each port', 'Cables', 'Battery derates', 'Battery sizing steps', 'Voltage drop along each path']) {
        expect([...seen], t).toContain(t);
      }
      expect([...seen].some((t) => ['Pump duty', 'Yearly cost of losses', 'Upstream of the bank'].includes(t)), [...seen].join(' | ')).toBe(true);
      expect([...seen].some((t) => ['Checks during the start', 'Protective devices'].includes(t) || /fault current/.test(t)), [...seen].join(' | ')).toBe(true);

      // In US units the header names feet, and the figure is the metres converted (1 ft = 0.3048 m, exact).
      await openDemo(page, 'hillside-relay-hut');
      await chooseSetting(page, 'units-select', 'us');
      const cables = await downloadCsv(page, page.locator('[data-testid="csv-button"][data-table="Cables"]'));
      const rows = parseCsv(cables.text.slice(1));
      const col = rows[0]!.indexOf('Length (ft)');
      expect(col, rows[0]!.join('|')).toBeGreaterThan(0);
      const cable = demoProjects.find((d) => d.id === 'hillside-relay-hut')!.project.elements.find((e) => e.kind === 'cable') as { length: number; name?: string };
      expect(Number(rows.find((r) => r[0] === cable.name)![col])).toBe(Number((cable.length / 0.3048).toPrecision(4)));
      expect(errors).toEqual([]);
    } finally {
      await context.close();
    }
  });

  it('a share link opens the project read-only in a fresh browser, and leaves what another browser stored untouched', async () => {
    // The sender: a stored project (a demo changed once is stored as a copy), then a share link.
    const sender = await newContext();
    const page = await sender.newPage();
    const errors = watchPageErrors(page);
    try {
      await openDemo(page, 'cold-store-dc-bus');
      await page.locator('[data-testid="stage-card"][data-card-id="fans"]').click();
      const name = page.locator('[data-testid="stage-form"] [data-testid="field-name"]');
      await name.fill('Evaporator fans, north');
      await name.blur();
      await expect.poll(() => page.getByTestId('save-line').getAttribute('data-state'), { timeout: 10_000 }).toBe('saved');
      const before = (await page.evaluate(STORED)) as string;
      expect(before).toContain('Evaporator fans, north');

      await page.getByTestId('share-button').click();
      const url = await page.getByTestId('share-url').inputValue();
      expect(url.startsWith(`${baseUrl}#share=`)).toBe(true);
      await page.getByTestId('share').scrollIntoViewIfNeeded();
      await page.screenshot({ path: join(artifacts, 'share-link-made.png') });
      const decoded = await decodeShare(new URL(url).hash);
      expect(decoded.ok).toBe(true);
      if (decoded.ok) expect(decoded.project.elements.find((e) => e.id === 'fans')?.name).toBe('Evaporator fans, north');

      // The link opened in the same browser: read-only, and the stored projects stay exactly as they were.
      const same = await sender.newPage();
      const sameErrors = watchPageErrors(same);
      await same.goto(url, { waitUntil: 'load' });
      await same.getByTestId('shared-banner').waitFor();
      await same.getByTestId('results').waitFor();
      expect(await same.getByTestId('chain-editor').count()).toBe(0);
      expect(await same.getByTestId('panel-project-settings').count()).toBe(0);
      // An edit through a study's own settings is refused too (the draft stays as shared).
      await same.waitForTimeout(500);
      expect((await same.evaluate(STORED)) as string).toBe(before);
      await fullPageScreenshot(same, join(artifacts, 'share-read-only-desktop.png'));
      expect(await seriousAxeViolations(same, `{ include: [['[data-testid="shared-banner"]']] }`)).toEqual([]);
      expect(sameErrors).toEqual([]);

      // A fresh browser (nothing stored): the project, read-only; nothing is stored by opening it.
      const fresh = await newContext();
      try {
        const phone = await fresh.newPage();
        await phone.setViewportSize(VIEWPORTS.phone);
        const phoneErrors = watchPageErrors(phone);
        await phone.goto(url, { waitUntil: 'load' });
        await phone.getByTestId('shared-banner').waitFor();
        expect(await phone.locator('#project-heading').innerText()).toBe(await page.locator('#project-heading').innerText());
        await expect.poll(() => phone.getByTestId('element-table').textContent()).toContain('Evaporator fans, north');
        expect(await phone.getByTestId('chain-editor').count()).toBe(0);
        await phone.waitForTimeout(500);
        expect((await phone.evaluate(STORED)) as string).not.toContain('Evaporator fans, north');
        await fullPageScreenshot(phone, join(artifacts, 'share-read-only-phone.png'));
        await phone.getByTestId('shared-banner').scrollIntoViewIfNeeded();
        await phone.screenshot({ path: join(artifacts, 'share-read-only-phone-banner.png') });

        // "Save a copy to my projects" stores it as a new project and opens that copy, editable.
        await phone.getByTestId('save-shared-copy').click();
        await phone.getByTestId('chain-editor').waitFor();
        await expect.poll(async () => (await phone.evaluate(STORED)) as string).toContain('Evaporator fans, north');
        expect(await phone.getByTestId('shared-banner').count()).toBe(0);
        expect(phoneErrors).toEqual([]);
      } finally {
        await fresh.close();
      }
      expect(errors).toEqual([]);
    } finally {
      await sender.close();
    }
  });

  it('a damaged or over-long link says so plainly and changes nothing stored', async () => {
    const context = await newContext();
    const page = await context.newPage();
    const errors = watchPageErrors(page);
    try {
      await openDemo(page, 'hillside-relay-hut');
      await page.locator('[data-testid="stage-card"][data-card-id="fridge"]').click();
      const name = page.locator('[data-testid="stage-form"] [data-testid="field-name"]');
      await name.fill('Fridge, kept');
      await name.blur();
      await expect.poll(() => page.getByTestId('save-line').getAttribute('data-state'), { timeout: 10_000 }).toBe('saved');
      const before = (await page.evaluate(STORED)) as string;
      await page.getByTestId('share-button').click();
      const url = await page.getByTestId('share-url').inputValue();

      for (const [label, bad] of [
        ['cut short', url.slice(0, url.length - 40)],
        ['a character changed', url.slice(0, -10) + (url.at(-10) === 'A' ? 'B' : 'A') + url.slice(-9)],
        ['over-long', `${baseUrl}#share=${'A'.repeat(40_000)}`],
      ] as const) {
        const other = await context.newPage();
        const otherErrors = watchPageErrors(other);
        await other.goto(bad, { waitUntil: 'load' });
        await expect.poll(() => other.getByTestId('storage-notice').textContent(), { timeout: 10_000 }).toMatch(/share link .*(damaged|longer than any).*Nothing stored in this browser was changed/);
        expect(await other.getByTestId('shared-banner').count(), label).toBe(0);
        await other.waitForTimeout(300);
        expect((await other.evaluate(STORED)) as string, label).toBe(before);
        expect(otherErrors, label).toEqual([]);
        await other.close();
      }
      expect(errors).toEqual([]);
    } finally {
      await context.close();
    }
  });

  it('the printed report carries the link as a QR code that decodes to the link', async () => {
    const context = await newContext();
    const page = await context.newPage();
    const errors = watchPageErrors(page);
    try {
      for (const demo of demoProjects) {
        await openDemo(page, demo.id);
        const qr = page.getByTestId('report-qr');
        await qr.waitFor({ state: 'attached' });
        const link = (await qr.getAttribute('data-link'))!;
        expect(link.startsWith(`${baseUrl}#share=`)).toBe(true);
        expect(link.length).toBeLessThanOrEqual(2000);
        // The link opens this very project.
        const decoded = await decodeShare(new URL(link).hash);
        // The solved pair's project: the file's "$schema" pointer is no part of a validated project.
        const { $schema: _schema, ...own } = demo.project as typeof demo.project & { $schema?: string };
        expect(decoded).toEqual({ ok: true, project: own });

        // Drawn on a canvas from the printed SVG, 4 px per module, and read back by a QR decoder (jsQR).
        const size = (Number(await qr.getAttribute('data-size')) + 8) * 4;
        const pixels = (await page.evaluate(`(async () => {
          const svg = document.querySelector('[data-testid="report-qr"] svg').cloneNode(true);
          svg.setAttribute('width', '${size}'); svg.setAttribute('height', '${size}');
          svg.setAttribute('xmlns', 'http://www.w3.org/2000/svg');
          const url = URL.createObjectURL(new Blob([svg.outerHTML], { type: 'image/svg+xml' }));
          const img = new Image();
          await new Promise((ok, no) => { img.onload = ok; img.onerror = no; img.src = url; });
          const canvas = document.createElement('canvas');
          canvas.width = ${size}; canvas.height = ${size};
          const g = canvas.getContext('2d');
          g.imageSmoothingEnabled = false;
          g.drawImage(img, 0, 0, ${size}, ${size});
          URL.revokeObjectURL(url);
          // One character per pixel, '1' dark: a short answer to carry back from the page.
          const d = g.getImageData(0, 0, ${size}, ${size}).data;
          let out = '';
          for (let i = 0; i < d.length; i += 4) out += d[i] < 128 ? '1' : '0';
          return out;
        })()`)) as string;
        const rgba = new Uint8ClampedArray(size * size * 4);
        for (let i = 0; i < size * size; i++) {
          rgba.fill(pixels[i] === '1' ? 0 : 255, i * 4, i * 4 + 3);
          rgba[i * 4 + 3] = 255;
        }
        const read = jsQR(rgba, size, size);
        expect(read?.data, demo.id).toBe(link);

        // On paper: shown on the first page, beside the chain.
        await page.emulateMedia({ media: 'print' });
        expect(await qr.isVisible()).toBe(true);
        const box = (await qr.locator('svg').boundingBox())!;
        // 42 mm wide at 96 px per inch (CSS Values 4: 1 in = 96 px = 25.4 mm).
        expect(box.width).toBeCloseTo((42 / 25.4) * 96, 0);
        await page.emulateMedia({ media: 'screen' });
      }
      expect(errors).toEqual([]);
    } finally {
      await context.close();
    }
  });
});
