/**
 * Problems in the user's words, in Chromium (issue 17, point 3): a broken project's banner says how
 * many fields are marked and where, by element name and form label; each entry is a link that opens
 * the element's form and focuses the field; a message's numbers are in the unit the form works in
 * (a pump's flow in m³/h, or gpm in US units). The chain is invented test data.
 */
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { join } from 'node:path';
import { skipWithout } from '../tools/system-tools.ts';
import { VIEWPORTS, artifacts, fullPageScreenshot, seriousAxeViolations, serveBuiltApp, watchPageErrors, type ServedApp } from './harness.ts';

// Two faults on two named elements: a DC load drawing a negative power, and a pump asked for
// 200 m³/h (0.0556 m³/s) when its rated flow is 150 m³/h (150 / 3600 = 0.0416667 m³/s; SI Brochure,
// 9th ed., Table 8: 1 h = 3600 s).
const broken = {
  format: 'joulepath-project',
  version: 2,
  name: 'Broken on purpose',
  elements: [
    { id: 'svc', name: 'Yard supply', kind: 'grid', phases: 3, voltage: 400, frequency: 50 },
    { id: 'm1', name: 'Well motor', kind: 'motor', from: 'svc', ratedOutput: 15000, ratedVoltage: 400, ratedFrequency: 50, poles: 4, efficiencyClass: 'IE3' },
    { id: 'p1', name: 'Well pump', kind: 'pump', from: 'm1', ratedFlow: 150 / 3600, ratedHead: 30, shutoffHead: 40, staticHead: 10, efficiency: 0.7, flow: 200 / 3600, control: 'throttle' },
    { id: 'rect', name: 'Yard rectifier', kind: 'rectifier', from: 'svc', outputVoltage: 48, inputPowerFactor: 0.95, loss: { model: 'constant', efficiency: 0.95 } },
    { id: 'lamp', name: 'Gate lamp', kind: 'dc-load', from: 'rect', power: -5 },
  ],
};

describe.skipIf(skipWithout('chromium'))('the problem banner in Chromium', () => {
  let app: ServedApp | undefined;
  let browser: Browser | undefined;
  let baseUrl = '';

  beforeAll(async () => {
    app = await serveBuiltApp('joulepath-messages-');
    ({ browser, baseUrl } = app);
  });
  afterAll(async () => {
    await app?.close();
  });

  const open = async (page: Page) => {
    await page.goto(baseUrl, { waitUntil: 'load' });
    await page.getByTestId('chain-editor').waitFor();
    await page.getByTestId('open-file').setInputFiles({ name: 'broken.json', mimeType: 'application/json', buffer: Buffer.from(JSON.stringify(broken)) });
    await page.getByTestId('problems').waitFor();
  };

  for (const [label, viewport] of [['phone', VIEWPORTS.phone], ['desktop', VIEWPORTS.desktop]] as const) {
    it(`says where the marked fields are and takes the user to each (${label})`, async () => {
      const context = await browser!.newContext({ viewport, deviceScaleFactor: 1, locale: 'en-US' });
      const page = await context.newPage();
      const errors = watchPageErrors(page);
      try {
        await open(page);
        const marked = page.getByTestId('problems-marked');
        await expect.poll(() => marked.innerText()).toMatch(/^2 fields to fix: /);
        const text = await marked.innerText();
        expect(text).toContain('Well pump › Operating flow');
        expect(text).toContain('Gate lamp › Power drawn');
        expect(text).not.toMatch(/\bflow\b.*"flow"|p1|lamp\b(?! ›)/);
        // The pump's message in the form's unit: 150 m³/h, not 0.0416666666666667 m³/s.
        const problems = await page.getByTestId('problems').innerText();
        expect(problems).toMatch(/rated flow 150\s?m³\/h/);
        expect(problems).not.toMatch(/0\.04166|0\.0555/);
        expect(problems).toMatch(/Given: 200\s?m³\/h/);

        for (const [owner, path] of [['lamp', 'power'], ['p1', 'flow']] as const) {
          await page.locator(`[data-testid="problem-link"][data-element-id="${owner}"][data-field="${path}"]`).click();
          const id = `sf-${owner}-${path}`;
          await expect.poll(() => page.evaluate(() => document.activeElement?.id ?? '')).toBe(id);
          const box = await page.locator(`#${id}`).boundingBox();
          expect(box, `${id} is laid out`).not.toBeNull();
          expect(box!.y + box!.height).toBeGreaterThan(0);
          expect(box!.y).toBeLessThan(viewport.height);
        }
        await fullPageScreenshot(page, join(artifacts, `messages-banner-${label}.png`));
        expect(await seriousAxeViolations(page, 'document.querySelector(\'[data-testid="problems"]\')')).toEqual([]);
        expect(errors).toEqual([]);
      } finally {
        await context.close();
      }
    }, 120_000);
  }

  it('in US units the flow is in gpm (dark theme, phone)', async () => {
    const context = await browser!.newContext({ viewport: VIEWPORTS.phone, deviceScaleFactor: 1, locale: 'en-US', colorScheme: 'dark' });
    const page = await context.newPage();
    try {
      await page.addInitScript(() => localStorage.setItem('joulepath.display.v1', JSON.stringify({ units: 'us', locale: 'en-US', theme: 'auto' })));
      await open(page);
      // 0.0416667 m³/s ÷ 6.309e-5 m³/s per gpm (NIST SP 811 B.8) = 660 gpm at 3 significant digits.
      await expect.poll(() => page.getByTestId('problems').innerText()).toMatch(/rated flow 660\s?gpm/);
      await page.getByTestId('problems').scrollIntoViewIfNeeded();
      await page.screenshot({ path: join(artifacts, 'messages-banner-us-dark-phone.png') });
      expect(await seriousAxeViolations(page, 'document.querySelector(\'[data-testid="problems"]\')')).toEqual([]);
    } finally {
      await context.close();
    }
  }, 120_000);
});
