/**
 * The motor-starting and fault-current panel in a real browser (Debian's Chromium, driven by
 * playwright-core) against a production build: it opens on demand, shows the engine's verdict for
 * the riverside pump motor and the IEC 60909 fault currents (the figures of core/studies/surge run here, the
 * page only formats them), flags a protective device whose interrupting rating is too low after an
 * edit in the cable's form with the rating it needs, passes axe-core, and fits a phone.
 *
 * Expected figures: the engine's own (core/studies/surge/index.ts studySurges on the same demo);
 * behaviour checks are common practice (no source).
 */
import { join } from 'node:path';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { demoProjects } from '../../core/demos/index.ts';
import { studySurges } from '../../core/studies/surge/index.ts';
import { formatCurrent } from '../../web/format/number.ts';
import { skipWithout } from '../tools/system-tools.ts';
import { VIEWPORTS, artifacts, serveBuiltApp, watchPageErrors, seriousAxeViolations, type ServedApp } from './harness.ts';
import { onSolved } from '../core/solved.ts';


/** Spaces of every kind as one ASCII space (numbers and units are joined by a narrow no-break space). */
const plain = (s: string | null | undefined) => (s ?? '').replace(/[\s\u202f\u00a0]+/g, ' ').trim();

describe.skipIf(skipWithout('chromium'))('the motor-starting and fault panel in Chromium', () => {
  let app: ServedApp | undefined;
  let browser: Browser | undefined;

  beforeAll(async () => {
    app = await serveBuiltApp('joulepath-starting-');
    browser = app.browser;
  });

  afterAll(async () => {
    await app?.close();
  });

  async function openPanel(viewport: { width: number; height: number }): Promise<{ context: BrowserContext; page: Page; errors: string[] }> {
    const context = await browser!.newContext({ viewport, deviceScaleFactor: 1, locale: 'en-US' });
    const page = await context.newPage();
    const errors = watchPageErrors(page);
    await page.goto(`${app!.baseUrl}#demo=riverside-pump-station`, { waitUntil: 'load' });
    await page.getByTestId('results').waitFor();
    await page.locator('[data-testid="panel-starting"] > summary').click();
    await page.getByTestId('starting-panel').waitFor();
    return { context, page, errors };
  }

  it('shows the start verdict, the fault currents and the device check the engine gives', async () => {
    const demo = demoProjects.find((d) => d.id === 'riverside-pump-station')!.project;
    const study = onSolved(studySurges, demo);
    expect(study.ok).toBe(true);
    if (!study.ok) return;
    const { context, page, errors } = await openPanel(VIEWPORTS.desktop);
    try {
      const start = page.getByTestId('start-motor');
      expect(await start.getAttribute('data-verdict')).toBe(study.result.starts[0]!.verdict);
      expect(plain(await start.innerText())).toContain(plain(study.result.starts[0]!.governing));
      const panelText = plain(await page.getByTestId('starting-panel').innerText());
      for (const point of study.result.acFaults.points) {
        if (point.current !== null) expect(panelText).toContain(plain(formatCurrent(point.current, 'en-US')));
      }
      const device = page.locator('[data-testid="device-checks"] tbody tr').first();
      expect(await device.getAttribute('data-status')).toBe('adequate');

      // Lower the feeder device's interrupting rating in its form: the panel flags it and names the rating needed.
      await page.locator('[data-testid="stage-card"][data-card-id="feeder"]').click();
      const rating = page.locator('[data-testid="stage-form"][data-element-id="feeder"] [data-testid="field-protection.interruptingRating"]');
      await rating.fill('10');
      await expect.poll(() => device.getAttribute('data-status')).toBe('too-weak');
      // (textContent: the panel is off screen now, behind the form, and skips rendering there.)
      expect(plain((await device.textContent()) ?? '')).toContain('needs at least');

      const violations = await seriousAxeViolations(page, `'[data-testid="starting-panel"]'`);
      expect(violations.map((v) => v.id)).toEqual([]);
      await page.getByTestId('starting-panel').screenshot({ path: join(artifacts, 'panel-starting-desktop.png') });
      expect(errors).toEqual([]);
    } finally {
      await context.close();
    }
  });

  it('fits a phone without a sideways page', async () => {
    const { context, page, errors } = await openPanel(VIEWPORTS.phone);
    try {
      await page.getByTestId('start-motor').waitFor();
      const overflow = (await page.evaluate('document.documentElement.scrollWidth - document.documentElement.clientWidth')) as number;
      expect(overflow).toBeLessThanOrEqual(0);
      await page.getByTestId('starting-panel').screenshot({ path: join(artifacts, 'panel-starting-phone.png') });
      expect(errors).toEqual([]);
    } finally {
      await context.close();
    }
  });
  it('the capacitor control on a project whose power factor is already above 0.95: "no correction needed", never an error', async () => {
    // An invented project: a heater at pf 1 and a pump load at pf 0.97 lagging on a stiff 400 V supply.
    const good = {
      format: 'joulepath-project',
      version: 2,
      name: 'Good power factor',
      elements: [
        { id: 'sup', name: 'Supply', kind: 'grid', phases: 3, voltage: 400, frequency: 50 },
        { id: 'heater', name: 'Heater', kind: 'ac-load', from: 'sup', power: 20000, powerFactor: 1 },
        { id: 'pump', name: 'Pump', kind: 'ac-load', from: 'sup', power: 10000, powerFactor: 0.97 },
      ],
    };
    const context = await browser!.newContext({ viewport: VIEWPORTS.desktop, deviceScaleFactor: 1, locale: 'en-US' });
    const page = await context.newPage();
    const errors = watchPageErrors(page);
    try {
      await page.goto(`${app!.baseUrl}#demo=riverside-pump-station`, { waitUntil: 'load' });
      await page.getByTestId('results').waitFor();
      await page.getByTestId('open-file').setInputFiles({ name: 'good-pf.json', mimeType: 'application/json', buffer: Buffer.from(JSON.stringify(good)) });
      await expect.poll(async () => plain(await page.getByTestId('results').textContent())).toContain('Heater');
      await page.locator('[data-testid="panel-machines"] > summary').click();
      const notNeeded = page.getByTestId('pfc-not-needed');
      await notNeeded.waitFor();
      expect(plain(await notNeeded.textContent())).toMatch(/^No correction needed anywhere a bank belongs: Supply is at pf 0\.9\d+ lagging, at or above the target 0\.95\.$/);
      expect(await page.locator('[data-testid="pfc"] [role="alert"]').count()).toBe(0);
      expect(await page.getByTestId('pfc-result').count()).toBe(0);
      expect(errors).toEqual([]);
    } finally {
      await context.close();
    }
  });
});
