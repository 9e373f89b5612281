/**
 * Phone first: each demo's page height in phone screens (390 × 844), the answers strip on the first
 * screen, the settings menu, the projects view, and the chain tools of the selected card (only the
 * actions that fit it, the rest in a "More" menu used by keyboard and by tap).
 *
 * The page heights are written to tests/.artifacts/page-heights.json under the label in
 * JP_HEIGHTS_LABEL ("after" unless told), so a run before a layout change and one after sit side by side.
 */
import { existsSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { skipWithout } from '../tools/system-tools.ts';
import { VIEWPORTS, artifacts, serveBuiltApp, watchPageErrors, type ServedApp } from './harness.ts';

const DEMOS = ['hillside-relay-hut', 'riverside-pump-station', 'cold-store-dc-bus'] as const;

describe.skipIf(skipWithout('chromium'))('phone first', () => {
  let app: ServedApp | undefined;
  let browser: Browser | undefined;
  let baseUrl = '';

  beforeAll(async () => {
    app = await serveBuiltApp('joulepath-phone-');
    ({ browser, baseUrl } = app);
  });

  afterAll(async () => {
    await app?.close();
  });

  async function openDemo(id: string, viewport: { width: number; height: number } = VIEWPORTS.phone, colorScheme: 'light' | 'dark' = 'light'): Promise<{ context: BrowserContext; page: Page; errors: string[] }> {
    const context = await browser!.newContext({ viewport, deviceScaleFactor: 1, locale: 'en-US', colorScheme, hasTouch: viewport === VIEWPORTS.phone });
    const page = await context.newPage();
    const errors = watchPageErrors(page);
    await page.goto(`${baseUrl}#demo=${id}`, { waitUntil: 'load' });
    await page.getByTestId('element-table').waitFor();
    await page.getByTestId('chain-editor').waitFor();
    await expect.poll(() => page.getByText('Drawing the energy flow…').count(), { timeout: 20_000 }).toBe(0);
    return { context, page, errors };
  }

  it('measures each demo’s page height in phone screens and keeps every answer on the first screen', async () => {
    const label = process.env['JP_HEIGHTS_LABEL'] ?? 'after';
    const file = join(artifacts, 'page-heights.json');
    const all = (existsSync(file) ? JSON.parse(readFileSync(file, 'utf8')) : {}) as Record<string, Record<string, unknown>>;
    const heights: Record<string, { px: number; screens: number; answersBottom: number | null }> = {};
    for (const id of DEMOS) {
      const { context, page, errors } = await openDemo(id);
      try {
        // The page's full height once every part has drawn (heights in CSS px at 390 × 844). Parts off
        // screen skip rendering (content-visibility: auto, with a guessed height): they are rendered for
        // the measure, as a person scrolling down would see them.
        await page.evaluate(
          `(() => { const s = document.createElement('style'); s.id = 'test-render-all'; s.textContent = '.skip-offscreen { content-visibility: visible !important; }'; document.head.append(s); })()`,
        );
        const px = (await page.evaluate('document.documentElement.scrollHeight')) as number;
        await page.evaluate(`document.getElementById('test-render-all')?.remove()`);
        const answersBottom = (await page.evaluate(
          `(() => { window.scrollTo(0, 0); const s = document.querySelector('[data-testid="answers"]'); return s ? s.getBoundingClientRect().bottom : null; })()`,
        )) as number | null;
        heights[id] = { px, screens: Math.round((px / VIEWPORTS.phone.height) * 100) / 100, answersBottom };
        if (label !== 'before') {
          // Every answer in the strip is on the first phone screen, at scroll 0.
          expect(answersBottom, `${id}: the answers strip`).not.toBeNull();
          expect(answersBottom!, `${id}: the answers strip ends below the first screen`).toBeLessThanOrEqual(VIEWPORTS.phone.height);
          const cards = (await page.evaluate(
            `[...document.querySelectorAll('[data-testid="answers"] dd, [data-testid="answers"] button')].map((e) => e.getBoundingClientRect().bottom)`,
          )) as number[];
          expect(cards.length).toBeGreaterThan(0);
          for (const b of cards) expect(b).toBeLessThanOrEqual(VIEWPORTS.phone.height);
        }
        expect(errors).toEqual([]);
      } finally {
        await context.close();
      }
    }
    all[label] = { viewport: VIEWPORTS.phone, measured: new Date().toISOString(), heights };
    writeFileSync(file, `${JSON.stringify(all, null, 2)}\n`);
    console.log(`page heights (${label}, 390 × 844): ${DEMOS.map((id) => `${id} ${heights[id]!.px} px = ${heights[id]!.screens} screens, answers end at ${heights[id]!.answersBottom?.toFixed(0)} px`).join('; ')}`);
  });
});
