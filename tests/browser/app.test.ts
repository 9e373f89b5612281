/**
 * The built page in a real browser (Debian's Chromium, driven by playwright-core): every demo opens
 * and shows its tables, a broken project shows its problems, nothing is logged as an error, and the
 * page fits a phone. Screenshots go to tests/.artifacts/ for a person to look at.
 *
 * One browser and one production build for the whole file keep it fast.
 */
import { join } from 'node:path';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { skipWithout } from '../tools/system-tools.ts';
import { VIEWPORTS, artifacts, serveBuiltApp, watchPageErrors, type ServedApp, fullPageScreenshot, pickDemo, showProjectsView } from './harness.ts';


describe.skipIf(skipWithout('chromium'))('the page in Chromium', () => {
  let app: ServedApp | undefined;
  let browser: Browser | undefined;
  let baseUrl = '';
  const timings: string[] = [];

  beforeAll(async () => {
    app = await serveBuiltApp('joulepath-build-');
    ({ browser, baseUrl } = app);
    timings.push(`build ${app.buildSeconds.toFixed(1)} s`, `preview+launch ${app.launchSeconds.toFixed(1)} s`);
  });

  afterAll(async () => {
    await app?.close();
    if (timings.length) console.log(`browser test: ${timings.join(', ')}`);
  });

  /** A new page that records every console error, page error and failed request. */
  async function openPage(viewport: { width: number; height: number }): Promise<{ context: BrowserContext; page: Page; errors: string[] }> {
    const context = await browser!.newContext({ viewport, deviceScaleFactor: 1, locale: 'en-US' });
    const page = await context.newPage();
    const errors = watchPageErrors(page);
    page.on('requestfailed', (req) => errors.push(`request failed: ${req.url()} ${req.failure()?.errorText ?? ''}`));
    page.on('response', (res) => {
      if (res.status() >= 400) errors.push(`HTTP ${res.status()}: ${res.url()}`);
    });
    await page.goto(baseUrl, { waitUntil: 'load' });
    return { context, page, errors };
  }

  async function expectTablesShown(page: Page): Promise<void> {
    await page.getByTestId('element-table').waitFor();
    const totalsRow = page.getByTestId('totals-row');
    await expect.poll(() => totalsRow.count()).toBe(1);
    const efficiency = ((await page.getByTestId('totals-efficiency').textContent()) ?? '').trim();
    expect(efficiency).toMatch(/^\d{1,3}(\.\d+)?\s?%$/);
    // Every element row has a non-empty efficiency cell (a dash for loads).
    const cells = await page.locator('[data-testid="element-table"] tbody tr td:last-child').allTextContents();
    expect(cells.length).toBeGreaterThan(1);
    for (const c of cells) expect(c.trim()).not.toBe('');
    const portRows = await page.locator('[data-testid="port-table"] tbody tr').count();
    expect(portRows).toBeGreaterThan(cells.length);
    await expect.poll(async () => (await page.getByTestId('balance-line').innerText()).trim()).toMatch(/^Energy balance: source /);
    // No stray NaN/undefined leaks into the tables.
    const text = (await page.getByTestId('project').textContent()) ?? '';
    expect(text).not.toMatch(/NaN|undefined|Infinity/);
  }

  it.each(Object.entries(VIEWPORTS))('opens each demo and shows its tables (%s)', async (label, viewport) => {
    const { context, page, errors } = await openPage(viewport);
    try {
      await expect.poll(() => page.title()).toBe('Joulepath');
      await expect.poll(async () => (await page.locator('.footer').innerText()).includes('planning estimates')).toBe(true);
      const links = page.locator('a[data-demo-id]');
      const ids = await links.evaluateAll((els) => els.map((el) => el.getAttribute('data-demo-id') ?? ''));
      expect(ids).toHaveLength(4);
      // The first demo is open before any tap.
      await expectTablesShown(page);
      for (const id of ids) {
        await pickDemo(page, id);
        await expect.poll(() => page.locator(`a[data-demo-id="${id}"]`).getAttribute('aria-current')).toBe('page');
        expect(page.url()).toContain(`#demo=${id}`);
        await expectTablesShown(page);
        // The page itself never scrolls sideways; wide tables scroll inside their own box.
        const overflow = await page.evaluate('document.documentElement.scrollWidth - window.innerWidth');
        expect(overflow, `page wider than the ${label} viewport on ${id}`).toBeLessThanOrEqual(0);
        await fullPageScreenshot(page, join(artifacts, `${label}-${id}.png`));
      }
      // A reload with the address of the last demo opens that demo again.
      await page.reload({ waitUntil: 'load' });
      await expect.poll(() => page.locator(`a[data-demo-id="${ids[ids.length - 1]}"]`).getAttribute('aria-current')).toBe('page');
      expect(errors).toEqual([]);
    } finally {
      await context.close();
    }
  });

  it('shows what is wrong with a project that cannot be solved, element and field named', async () => {
    const { context, page, errors } = await openPage(VIEWPORTS.phone);
    try {
      await page.getByTestId('element-table').waitFor();
      // A load with a negative power: a made-up broken project for this test (one fault only, so
      // the check does not depend on the order in which the engine validates).
      const broken = {
        format: 'joulepath-project',
        version: 2,
        name: 'Broken on purpose',
        elements: [
          { id: 'supply', kind: 'battery', voltage: 48 },
          { id: 'heater', kind: 'dc-load', from: 'supply', power: -5 },
        ],
      };
      await page.getByTestId('open-file').setInputFiles({
        name: 'broken.json',
        mimeType: 'application/json',
        buffer: Buffer.from(JSON.stringify(broken)),
      });
      const problems = page.getByTestId('problems');
      await problems.waitFor();
      const text = await problems.innerText();
      expect(text).toContain('heater'); // no name given: the id stands for it
      // The field by its form label (web/editor/fields.ts, dc-load "power"), not the file's field name.
      await expect.poll(() => problems.innerText()).toContain('Power drawn');
      await fullPageScreenshot(page, join(artifacts, 'phone-problems.png'));

      // A file that is not JSON at all says so instead of failing silently.
      await page.getByTestId('open-file').setInputFiles({ name: 'notes.txt', mimeType: 'text/plain', buffer: Buffer.from('not json') });
      await expect.poll(async () => (await page.getByTestId('unreadable').innerText()).includes('not a JSON project file')).toBe(true);

      // Tapping a demo again (in the projects view) leaves the file and shows the demo.
      await showProjectsView(page);
      await page.locator('a[data-demo-id]').first().click();
      await expectTablesShown(page);
      expect(errors).toEqual([]);
    } finally {
      await context.close();
    }
  });
});
