/**
 * Accessibility, themes, units and locale of the built page in real Chromium (playwright-core).
 *
 * - axe-core (pinned in package.json) runs on every demo in the light and the dark theme, at phone
 *   (390×844) and desktop (1366×768) size; any serious or critical violation fails the test.
 * - Every control has a label, the focus ring shows, and touch targets are at least 44 px high
 *   (WCAG 2.2 SC 2.5.8 asks 24 px; 44 px is the project's own target, after SC 2.5.5 AAA).
 * - Switching units and locale changes how the numbers are written, not the numbers: a round trip
 *   back to SI and en-US gives the same text, and a stored choice survives a reload.
 * Screenshots of both themes at both sizes go to tests/.artifacts/ for a person to look at.
 *
 * Same pattern as app.test.ts: one production build, one preview server and one browser per file.
 */
import { demoProjects } from '../../core/demos/index.ts';
import { join } from 'node:path';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { skipWithout } from '../tools/system-tools.ts';
import { VIEWPORTS, artifacts, serveBuiltApp, watchPageErrors, seriousAxeViolations, type AxeViolation, type ServedApp, fullPageScreenshot, chooseSetting, pickDemo } from './harness.ts';



describe.skipIf(skipWithout('chromium'))('accessibility, themes, units and locale in Chromium', () => {
  let app: ServedApp | undefined;
  let browser: Browser | undefined;
  let baseUrl = '';

  beforeAll(async () => {
    app = await serveBuiltApp('joulepath-a11y-');
    ({ browser, baseUrl } = app);
  });

  afterAll(async () => {
    await app?.close();
  });

  async function openPage(
    viewport: { width: number; height: number },
    options: { colorScheme?: 'light' | 'dark'; locale?: string; brokenStorage?: boolean } = {},
  ): Promise<{ context: BrowserContext; page: Page; errors: string[] }> {
    const context = await browser!.newContext({
      viewport,
      deviceScaleFactor: 1,
      locale: options.locale ?? 'en-US',
      colorScheme: options.colorScheme ?? 'light',
    });
    if (options.brokenStorage) {
      // A storage that refuses every write, as a full or locked-down browser does.
      await context.addInitScript({
        content: `Storage.prototype.setItem = () => { throw new DOMException('The quota has been exceeded.', 'QuotaExceededError'); };`,
      });
    }
    const page = await context.newPage();
    const errors = watchPageErrors(page);
    await page.goto(baseUrl, { waitUntil: 'load' });
    await page.getByTestId('element-table').waitFor();
    return { context, page, errors };
  }

  function describeViolations(vs: AxeViolation[]): string {
    return vs
      .map((v) => `${v.impact} ${v.id}: ${v.help}\n  ${v.nodes.map((n) => `${JSON.stringify(n.target)} ${n.failureSummary ?? ''}`).join('\n  ')}`)
      .join('\n');
  }

  it.each(Object.entries(VIEWPORTS))('axe finds no serious or critical violation on any demo, light and dark (%s)', async (label, viewport) => {
    const { context, page, errors } = await openPage(viewport);
    try {
      const ids = await page.locator('a[data-demo-id]').evaluateAll((els) => els.map((el) => el.getAttribute('data-demo-id') ?? ''));
      // The picker offers every demo (core/demos), each checked below.
      expect([...ids].sort()).toEqual(demoProjects.map((d) => d.id).sort());
      const failures: string[] = [];
      for (const theme of ['light', 'dark'] as const) {
        await chooseSetting(page, 'theme-select', theme);
        await expect.poll(() => page.evaluate('document.documentElement.dataset.theme')).toBe(theme);
        for (const id of ids) {
          await pickDemo(page, id);
          await expect.poll(() => page.locator(`a[data-demo-id="${id}"]`).getAttribute('aria-current')).toBe('page');
          await page.getByTestId('element-table').waitFor();
          const found = await seriousAxeViolations(page);
          if (found.length > 0) failures.push(`${theme} theme, ${label}, ${id}:\n${describeViolations(found)}`);
          if (id === ids[0]) {
            await fullPageScreenshot(page, join(artifacts, `theme-${theme}-${label}.png`));
            await page.screenshot({ path: join(artifacts, `theme-${theme}-${label}-top.png`) });
          }
        }
      }
      // All combinations are checked before failing, so one run lists every violation.
      expect(failures.join('\n\n')).toBe('');
      expect(errors).toEqual([]);
    } finally {
      await context.close();
    }
  });

  it.each(Object.entries(VIEWPORTS))('axe finds no serious or critical violation with every study panel, every editor in it and the project settings open, light and dark (%s)', async (label, viewport) => {
    const { context, page, errors } = await openPage(viewport);
    try {
      const failures: string[] = [];
      for (const theme of ['light', 'dark'] as const) {
        await chooseSetting(page, 'theme-select', theme);
        await expect.poll(() => page.evaluate('document.documentElement.dataset.theme')).toBe(theme);
        for (const id of demoProjects.map((d) => d.id)) {
          await pickDemo(page, id);
          await expect.poll(() => page.locator(`a[data-demo-id="${id}"]`).getAttribute('aria-current')).toBe('page');
          await page.getByTestId('element-table').waitFor();
          const panels = page.locator('details.panel');
          const count = await panels.count();
          for (let i = 0; i < count; i++) {
            const panel = panels.nth(i);
            if ((await panel.getAttribute('open')) === null) await panel.locator('> summary').click();
          }
          // Each panel's content has loaded (its module is lazy) before axe looks.
          await expect.poll(() => page.locator('details.panel[open] > :not(summary)').count(), { timeout: 20_000 }).toBeGreaterThanOrEqual(count);
          await expect.poll(() => page.getByText('Opening…').count(), { timeout: 20_000 }).toBe(0);
          // Every editor inside the panels too (the load profile editor, the duty curve fit, the sizing
          // steps: disclosures of their own), so axe sees each editor's controls open.
          const nested = page.locator('details.panel[open] details:not([open]) > summary');
          for (let guard = 0; guard < 20 && (await nested.count()) > 0; guard++) await nested.first().click();
          expect(await page.locator('details.panel[open] details:not([open])').count()).toBe(0);
          // The editors axe must see: the hillside hut's load profile, the pump station's duty.
          if (id === 'hillside-relay-hut') await page.getByTestId('profile-editor').waitFor();
          if (id === 'riverside-pump-station') await page.getByTestId('duty-editor').waitFor();
          const found = await seriousAxeViolations(page);
          if (found.length > 0) failures.push(`${theme} theme, ${id}, panels open:\n${describeViolations(found)}`);
          if (theme === 'dark' && id === 'hillside-relay-hut') await fullPageScreenshot(page, join(artifacts, `panels-open-dark-${label}.png`));
        }
      }
      expect(failures.join('\n\n')).toBe('');
      expect(errors).toEqual([]);
    } finally {
      await context.close();
    }
  });

  it('follows the device colour scheme until a theme is chosen', async () => {
    const { context, page } = await openPage(VIEWPORTS.phone, { colorScheme: 'dark' });
    try {
      await expect.poll(() => page.evaluate('document.documentElement.dataset.theme')).toBe('dark');
      const bg = await page.evaluate('getComputedStyle(document.body).backgroundColor');
      expect(bg).toBe('rgb(15, 20, 18)'); // --bg of the dark theme in web/styles.css
      await chooseSetting(page, 'theme-select', 'light');
      await expect.poll(() => page.evaluate('getComputedStyle(document.body).backgroundColor')).toBe('rgb(244, 245, 242)');
    } finally {
      await context.close();
    }
  });

  it('labels every control, shows a focus ring, and keeps touch targets at least 44 px high', async () => {
    for (const viewport of Object.values(VIEWPORTS)) {
      const { context, page } = await openPage(viewport);
      try {
        const unlabeled = await page.evaluate(`[...document.querySelectorAll('select, input, button, textarea')]
          .filter((el) => !(el.labels && el.labels.length) && !el.getAttribute('aria-label') && !el.getAttribute('aria-labelledby')
            && !(el.tagName === 'BUTTON' && el.textContent.trim() !== ''))
          .map((el) => el.outerHTML.slice(0, 80))`);
        expect(unlabeled).toEqual([]);
        // Every control drawn on screen (those of the other view and of a closed menu are not drawn).
        const small = await page.evaluate(`[...document.querySelectorAll('a[href], select, button, label.picker__open')]
          .filter((el) => el.getClientRects().length > 0)
          .map((el) => ({ el: el.outerHTML.slice(0, 60), h: el.getBoundingClientRect().height, w: el.getBoundingClientRect().width }))
          .filter((t) => t.h < 44 || t.w < 44)`);
        expect(small).toEqual([]);
        // Tab to the first control: its outline is drawn (3 px, web/styles.css :focus-visible).
        await page.keyboard.press('Tab');
        const outline = (await page.evaluate(
          `(() => { const s = getComputedStyle(document.activeElement); return [s.outlineStyle, s.outlineWidth]; })()`,
        )) as [string, string];
        expect(outline).toEqual(['solid', '3px']);
      } finally {
        await context.close();
      }
    }
  });

  it('switches units and locale without changing the figures, and remembers the choice', async () => {
    const { context, page, errors } = await openPage(VIEWPORTS.desktop);
    try {
      await chooseSetting(page, 'locale-select', 'en-US');
      await chooseSetting(page, 'units-select', 'si');
      // The demo with an engine-sized cable: its length and conductor are shown.
      const demo = page.locator('a[data-demo-id="cold-store-dc-bus"]');
      await demo.click();
      const cables = page.getByTestId('cable-table');
      await cables.waitFor();
      const project = page.getByTestId('project');
      // The lazy parts (answers lines, the report's share code, the worker's figures) mount after the tables:
      // read the text once it has stopped changing (two reads 400 ms apart agree).
      let siText = await project.textContent();
      await expect
        .poll(async () => {
          await page.waitForTimeout(400);
          const now = await project.textContent();
          const settled = now === siText;
          siText = now;
          return settled;
        }, { timeout: 20_000 })
        .toBe(true);
      const lengthsSi = await cables.getByTestId('cable-length').allTextContents();
      expect(lengthsSi.every((t) => /^\d[\d,.]*\s?m$/.test(t.trim())), lengthsSi.join(' | ')).toBe(true);

      // US customary: lengths in ft (40 m = 131.2 ft, 1 ft = 0.3048 m exactly, NIST SP 811 B.8).
      await chooseSetting(page, 'units-select', 'us');
      await expect.poll(async () => (await cables.getByTestId('cable-length').allTextContents()).join(' | ')).toMatch(/ft/);
      const lengthsUs = await cables.getByTestId('cable-length').allTextContents();
      expect(lengthsUs.every((t) => /^\d[\d,.]*\s?ft$/.test(t.trim())), lengthsUs.join(' | ')).toBe(true);
      expect(lengthsUs).toContain('131.2\u202fft');
      const sizeText = (await cables.getByTestId('cable-size').allTextContents()).join(' | ');
      expect(sizeText).toMatch(/mm² \([\d.]+\s?kcmil\)/);

      // Shaft power gets horsepower beside kW (1 hp = 745.7 W, NIST SP 811 B.8) on the pump demo.
      await pickDemo(page, 'riverside-pump-station');
      await expect.poll(async () => ((await page.getByTestId('port-table').textContent()) ?? '').includes('hp')).toBe(true);
      await demo.click();
      await cables.waitFor();

      // German number format: decimal comma, full stop for thousands (CLDR de).
      await chooseSetting(page, 'locale-select', 'de-DE');
      await expect.poll(async () => (await cables.getByTestId('cable-length').allTextContents()).join(' | ')).toContain('131,2\u202fft');
      expect(await page.getByTestId('totals-efficiency').textContent()).toMatch(/^\d{1,3}(,\d+)?\s?%$/);

      // Back to SI and en-US: exactly the text first shown (nothing was recomputed or rounded away).
      await chooseSetting(page, 'units-select', 'si');
      await chooseSetting(page, 'locale-select', 'en-US');
      await expect.poll(() => project.textContent()).toBe(siText);

      // The choice survives a reload (localStorage).
      await chooseSetting(page, 'units-select', 'us');
      await chooseSetting(page, 'locale-select', 'de-DE');
      await page.reload({ waitUntil: 'load' });
      await page.getByTestId('cable-table').waitFor();
      await expect.poll(() => page.getByTestId('units-select').inputValue()).toBe('us');
      expect(await page.getByTestId('locale-select').inputValue()).toBe('de-DE');
      expect((await page.getByTestId('cable-length').allTextContents()).join(' | ')).toContain('131,2\u202fft');
      await fullPageScreenshot(page, join(artifacts, 'units-us-de-desktop.png'));
      expect(errors).toEqual([]);
    } finally {
      await context.close();
    }
  });

  it('keeps working when the browser refuses to store the choice', async () => {
    const { context, page, errors } = await openPage(VIEWPORTS.phone, { brokenStorage: true });
    try {
      await chooseSetting(page, 'units-select', 'us');
      await chooseSetting(page, 'locale-select', 'de-DE');
      await pickDemo(page, 'cold-store-dc-bus');
      await expect.poll(async () => (await page.getByTestId('cable-length').allTextContents()).join(' | ')).toContain('131,2\u202fft');
      expect(errors).toEqual([]);
    } finally {
      await context.close();
    }
  });
});
