/**
 * An element called "project" beside the project, in a real browser (Debian's Chromium, driven by
 * playwright-core): renaming the project in its settings changes the project's title, not the
 * element; editing the element "project" in its form changes the element, not the project
 * (project-level fields are written with PROJECT_LEVEL, core/model/errors.ts). The chain is invented
 * test data; behaviour checks, common practice (no source).
 */
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { skipWithout } from '../tools/system-tools.ts';
import { VIEWPORTS, serveBuiltApp, watchPageErrors, type ServedApp } from './harness.ts';

const chain = {
  format: 'joulepath-project',
  version: 2,
  name: 'Relay shed',
  elements: [
    { id: 'bank', kind: 'battery', voltage: 48 },
    { id: 'project', kind: 'dc-load', from: 'bank', power: 40 },
  ],
};

describe.skipIf(skipWithout('chromium'))('an element called "project" in Chromium', () => {
  let app: ServedApp | undefined;
  let browser: Browser | undefined;
  let baseUrl = '';

  beforeAll(async () => {
    app = await serveBuiltApp('joulepath-project-level-');
    ({ browser, baseUrl } = app);
  });

  afterAll(async () => {
    await app?.close();
  });

  const title = (page: Page) => page.locator('#project-heading').innerText();
  const card = (page: Page) => page.locator('[data-testid="stage-card"][data-card-id="project"]');

  it('the project is renamed in its settings and the element "project" edited in its form, each on its own', async () => {
    const context = await browser!.newContext({ viewport: VIEWPORTS.desktop, deviceScaleFactor: 1, locale: 'en-US' });
    const page = await context.newPage();
    const errors = watchPageErrors(page);
    try {
      await page.goto(baseUrl, { waitUntil: 'load' });
      await page.getByTestId('chain-editor').waitFor();
      await page.getByTestId('open-file').setInputFiles({ name: 'shed.json', mimeType: 'application/json', buffer: Buffer.from(JSON.stringify(chain)) });
      await expect.poll(() => title(page)).toBe('Relay shed');
      await expect.poll(() => card(page).innerText()).toMatch(/uses 40\sW/);

      // The project's own name, in "Project settings".
      await page.locator('[data-testid="panel-project-settings"] summary').click();
      const name = page.locator('[data-testid="project-form"] [data-testid="field-name"]');
      await name.fill('Renamed shed');
      await expect.poll(() => title(page)).toBe('Renamed shed');
      expect(await card(page).innerText()).toMatch(/uses 40\sW/);

      // The element called "project": its own form, its own field.
      await card(page).click();
      const form = page.locator('[data-testid="stage-form"][data-element-id="project"]');
      await form.waitFor();
      await form.locator('[data-testid="field-power"]').fill('55');
      await expect.poll(() => card(page).innerText()).toMatch(/uses 55\sW/);
      expect(await title(page)).toBe('Renamed shed');
      expect(await name.inputValue()).toBe('Renamed shed');
      expect(errors).toEqual([]);
    } finally {
      await context.close();
    }
  });
});
