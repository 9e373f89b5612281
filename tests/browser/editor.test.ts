/**
 * The chain editor in a real browser (Debian's Chromium, driven by playwright-core): a chain built
 * from scratch (new chain → battery bank → inverter → cable → AC load) by tapping and by keyboard
 * alone, the results appearing and changing as it grows; remove, duplicate, undo and redo; a demo's
 * branches on a phone and on a desktop. Screenshots go to tests/.artifacts/ for a person to look at.
 * The figures checked are the engine's own (the page only shows them); the expected words are the
 * page's. Behaviour checks, common practice (no source).
 */
import { join } from 'node:path';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { skipWithout } from '../tools/system-tools.ts';
import { VIEWPORTS, artifacts, serveBuiltApp, watchPageErrors, type ServedApp, fullPageScreenshot, chainOp, pickDemo, showProjectsView } from './harness.ts';

describe.skipIf(skipWithout('chromium'))('the chain editor in Chromium', () => {
  let app: ServedApp | undefined;
  let browser: Browser | undefined;
  let baseUrl = '';

  beforeAll(async () => {
    app = await serveBuiltApp('joulepath-editor-');
    ({ browser, baseUrl } = app);
  });

  afterAll(async () => {
    await app?.close();
  });

  async function openPage(viewport: { width: number; height: number }): Promise<{ context: BrowserContext; page: Page; errors: string[] }> {
    const context = await browser!.newContext({ viewport, deviceScaleFactor: 1, locale: 'en-US' });
    const page = await context.newPage();
    const errors = watchPageErrors(page);
    await page.goto(baseUrl, { waitUntil: 'load' });
    await page.getByTestId('chain-editor').waitFor();
    return { context, page, errors };
  }

  const cards = (page: Page) => page.getByTestId('stage-card');
  const balance = async (page: Page) => (await page.getByTestId('energy-balance').innerText()).replace(/\s+/g, ' ');
  const tableRows = (page: Page) => page.locator('[data-testid="element-table"] tbody tr');

  // Page expressions are strings: the Node tsconfig has no DOM library.
  const focusedMatches = (page: Page, selector: string) =>
    page.evaluate(`document.activeElement ? document.activeElement.matches(${JSON.stringify(selector)}) : false`) as Promise<boolean>;
  /** Press Tab (or Shift+Tab) until the focused element matches `selector`. */
  async function tabTo(page: Page, selector: string, back = false): Promise<void> {
    for (let i = 0; i < 40; i++) {
      if (await focusedMatches(page, selector)) return;
      await page.keyboard.press(back ? 'Shift+Tab' : 'Tab');
    }
    throw new Error(`Tab never reached ${selector}`);
  }

  it('builds a chain by tapping: battery → inverter → cable → AC load; duplicate, remove, undo, redo (phone)', async () => {
    const { context, page, errors } = await openPage(VIEWPORTS.phone);
    try {
      await showProjectsView(page);
      await page.getByTestId('new-chain').click();
      await page.locator('button[data-source="battery-48"]').click();
      await expect.poll(() => cards(page).count()).toBe(1);
      await expect.poll(() => page.locator('#project-heading').innerText()).toBe('New chain');
      await expect.poll(() => cards(page).first().getAttribute('aria-pressed')).toBe('true');
      await page.getByTestId('energy-balance').waitFor();
      const empty = await balance(page);

      const addAfter = async (kind: string) => {
        await chainOp(page, 'op-add-after');
        await page.getByTestId('kind-chooser').waitFor();
        await page.locator(`.kind-option[data-kind="${kind}"]`).click();
      };
      await addAfter('inverter');
      await expect.poll(() => cards(page).count()).toBe(2);
      await expect.poll(() => tableRows(page).count()).toBe(2);
      const withInverter = await balance(page);
      await addAfter('cable');
      await expect.poll(() => cards(page).count()).toBe(3);
      await addAfter('ac-load');
      await expect.poll(() => cards(page).count()).toBe(4);
      await expect.poll(() => tableRows(page).count()).toBe(4);
      // The load's 500 W now shows in the balance (the engine's figure) and on its card.
      await expect.poll(() => balance(page)).toMatch(/Loads use 500 W/);
      const withLoad = await balance(page);
      // An inverter with nothing to feed draws nothing (constant-efficiency template, no idle loss).
      expect(withInverter).toBe(empty);
      expect(withLoad).not.toBe(empty);
      await expect.poll(() => cards(page).nth(3).innerText()).toMatch(/uses 500\sW/);
      expect(await page.getByTestId('editor-status').innerText()).toMatch(/Inserted AC load/);
      await fullPageScreenshot(page, join(artifacts, 'editor-phone-built.png'));
      await page.getByTestId('chain-editor').evaluate((el) => el.scrollIntoView());
      await page.screenshot({ path: join(artifacts, 'editor-phone-built-view.png') });

      // Duplicate the load: a second branch from the cable.
      await chainOp(page, 'op-duplicate');
      await expect.poll(() => cards(page).count()).toBe(5);
      await expect.poll(() => balance(page)).toMatch(/Loads use 1 kW/);
      // Undo and redo the duplicate.
      await page.getByTestId('undo').click();
      await expect.poll(() => cards(page).count()).toBe(4);
      await expect.poll(() => balance(page)).toMatch(/Loads use 500 W/);
      expect(await page.getByTestId('redo').getAttribute('title')).toMatch(/Duplicated AC load/);
      await page.getByTestId('redo').click();
      await expect.poll(() => cards(page).count()).toBe(5);
      await fullPageScreenshot(page, join(artifacts, 'editor-phone-branches.png'));
      // Remove the copy; the balance follows.
      await chainOp(page, 'op-remove');
      await expect.poll(() => cards(page).count()).toBe(4);
      await expect.poll(() => balance(page)).toMatch(/Loads use 500 W/);
      // The source's tools offer no Remove (a project keeps its source); the Delete key is refused
      // politely and changes nothing.
      await cards(page).first().click();
      await expect.poll(() => page.getByTestId('card-tools').count()).toBe(1);
      expect(await page.getByTestId('op-remove').count()).toBe(0);
      await cards(page).first().focus();
      await page.keyboard.press('Delete');
      await expect.poll(() => page.getByTestId('editor-status').innerText()).toMatch(/source feeds the whole chain/);
      expect(await cards(page).count()).toBe(4);
      // Every control in the editor is a 44 px touch target at least.
      const small = (await page.evaluate(`[...document.querySelectorAll('[data-testid="chain-editor"] button')]
          .map((b) => ({ t: b.innerText.trim() || b.getAttribute('aria-label') || '', r: b.getBoundingClientRect() }))
          .filter((x) => x.r.width > 0 && (x.r.width < 44 || x.r.height < 44))
          .map((x) => x.t + ' ' + x.r.width + '×' + x.r.height)`)) as string[];
      expect(small).toEqual([]);
      const overflow = await page.evaluate('document.documentElement.scrollWidth - window.innerWidth');
      expect(overflow).toBeLessThanOrEqual(0);
      expect(errors).toEqual([]);
    } finally {
      await context.close();
    }
  });

  it('builds the same chain by keyboard alone, moves along it with arrows, removes with Delete and undoes with Ctrl+Z (desktop)', async () => {
    const { context, page, errors } = await openPage(VIEWPORTS.desktop);
    try {
      // The projects column follows the project in reading order: start from the demo picker's first
      // link, then keys alone.
      await page.locator('a[data-demo-id]').first().focus();
      await tabTo(page, '[data-testid="new-chain"]');
      await page.keyboard.press('Enter');
      // The chooser opens on the next render: wait for it before tabbing, or a loaded machine tabs past it.
      await page.locator('button[data-source="battery-48"]').waitFor();
      await tabTo(page, 'button[data-source="battery-48"]');
      await page.keyboard.press('Enter');
      await expect.poll(() => cards(page).count()).toBe(1);
      // Focus lands on the new source's card.
      await expect.poll(() => focusedMatches(page, '[data-card-id="bank"]')).toBe(true);

      const addAfterByKeys = async (kind: string) => {
        // The selected card's tools come right after the cards.
        await tabTo(page, '[data-testid="op-add-after"]');
        await page.keyboard.press('Enter');
        await expect.poll(() => focusedMatches(page, '.kind-option')).toBe(true);
        await tabTo(page, `.kind-option[data-kind="${kind}"]`);
        await page.keyboard.press('Enter');
        // Focus goes to the new card.
        await expect.poll(() => focusedMatches(page, `[data-card-id^="${kind === 'ac-load' ? 'load' : kind}"]`)).toBe(true);
      };
      await addAfterByKeys('inverter');
      await addAfterByKeys('cable');
      await addAfterByKeys('ac-load');
      await expect.poll(() => cards(page).count()).toBe(4);
      await expect.poll(() => balance(page)).toMatch(/Loads use 500 W/);

      // Arrows: Home to the source, Right downstream, Left upstream.
      await page.keyboard.press('Home');
      await expect.poll(() => focusedMatches(page, '[data-card-id="bank"]')).toBe(true);
      await page.keyboard.press('ArrowRight');
      await expect.poll(() => focusedMatches(page, '[data-card-id="inverter"]')).toBe(true);
      await page.keyboard.press('ArrowRight');
      await page.keyboard.press('ArrowRight');
      await expect.poll(() => focusedMatches(page, '[data-card-id="load"]')).toBe(true);
      await page.keyboard.press('ArrowLeft');
      await expect.poll(() => focusedMatches(page, '[data-card-id="cable"]')).toBe(true);
      // Only one card is in the tab order (roving tabindex).
      expect(await page.locator('[data-testid="stage-card"][tabindex="0"]').count()).toBe(1);
      // Enter selects the card.
      await page.keyboard.press('Enter');
      await expect.poll(() => page.locator('[data-card-id="cable"]').getAttribute('aria-pressed')).toBe('true');

      // Delete removes the focused card (the cable: its ends are joined), Ctrl+Z brings it back.
      await page.locator('[data-card-id="cable"]').focus();
      await page.keyboard.press('Delete');
      await expect.poll(() => cards(page).count()).toBe(3);
      await expect.poll(() => page.getByTestId('editor-status').innerText()).toMatch(/Removed Cable.*Undo/);
      await page.keyboard.press('Control+z');
      await expect.poll(() => cards(page).count()).toBe(4);
      await page.keyboard.press('Control+Shift+z');
      await expect.poll(() => cards(page).count()).toBe(3);
      await page.keyboard.press('Control+y');
      await expect.poll(() => cards(page).count()).toBe(3); // nothing left to redo
      await page.keyboard.press('Control+z');
      await expect.poll(() => cards(page).count()).toBe(4);
      await fullPageScreenshot(page, join(artifacts, 'editor-desktop-built.png'));
      expect(errors).toEqual([]);
    } finally {
      await context.close();
    }
  });

  it('a motor added after a 480 V 60 Hz service is named "Motor" and its form shows the rated voltage 460 V (desktop)', async () => {
    const { context, page, errors } = await openPage(VIEWPORTS.desktop);
    try {
      await page.getByTestId('new-chain').click();
      await page.locator('button[data-source="grid-3-480-60"]').click();
      await expect.poll(() => cards(page).count()).toBe(1);
      await chainOp(page, 'op-add-after');
      await page.getByTestId('kind-chooser').waitFor();
      await page.locator('.kind-option[data-kind="motor"]').click();
      await expect.poll(() => cards(page).count()).toBe(2);
      // The new card is selected and its form shows the rated voltage taken from the chain:
      // NEC Table 430.250 / NEMA MG 1: a motor on a 480 V system is rated 460 V.
      const form = page.locator('[data-testid="stage-form"][data-element-id="motor"]');
      await form.waitFor();
      await expect.poll(() => form.getByTestId('field-ratedVoltage').inputValue()).toBe('460');
      await expect.poll(() => form.getByTestId('field-name').inputValue()).toBe('Motor');
      expect(await form.innerText()).toMatch(/typical value[^.]*use the maker's figure/i);
      expect(await page.getByTestId('editor-status').innerText()).toMatch(/Inserted Motor after 480 V service/);
      await page.screenshot({ path: join(artifacts, 'editor-desktop-motor-defaults.png') });
      expect(errors).toEqual([]);
    } finally {
      await context.close();
    }
  });

  it('draws a demo with branches, moves between and reorders them, and marks the element the engine refuses', async () => {
    for (const [label, viewport] of Object.entries(VIEWPORTS)) {
      const { context, page, errors } = await openPage(viewport);
      try {
        await pickDemo(page, 'hillside-relay-hut');
        await expect.poll(() => cards(page).count()).toBe(9);
        // The fridge and the lights are sibling branches of the inverter's cable.
        await page.locator('[data-card-id="fridge"]').click();
        await page.locator('[data-card-id="fridge"]').focus();
        await page.keyboard.press('ArrowDown');
        await expect.poll(() => focusedMatches(page, '[data-card-id="lights"]')).toBe(true);
        // Cards carry the engine's results.
        expect(await page.locator('[data-card-id="fridge"]').innerText()).toMatch(/uses 150\sW/);
        // Branch up: the lights come before the fridge.
        await page.locator('[data-card-id="lights"]').click();
        await chainOp(page, 'op-branch-up');
        await expect
          .poll(async () => {
            const texts = await cards(page).allInnerTexts();
            return texts.findIndex((t) => t.includes('Lights')) < texts.findIndex((t) => t.includes('Vaccine'));
          })
          .toBe(true);
        const shot = join(artifacts, `editor-${label}-hillside.png`);
        if (label === 'phone') await fullPageScreenshot(page, shot);
        else await page.screenshot({ path: shot });
        await page.getByTestId('chain-editor').evaluate((el) => el.scrollIntoView());
        await page.screenshot({ path: join(artifacts, `editor-${label}-hillside-view.png`) });
        const overflow = await page.evaluate('document.documentElement.scrollWidth - window.innerWidth');
        expect(overflow).toBeLessThanOrEqual(0);

        // A project the engine refuses: the card of the element at fault carries a mark in words.
        const broken = {
          format: 'joulepath-project',
          version: 2,
          name: 'Broken on purpose',
          elements: [
            { id: 'supply', kind: 'battery', voltage: 48 },
            { id: 'heater', kind: 'dc-load', from: 'supply', power: -5 },
          ],
        };
        await page.getByTestId('open-file').setInputFiles({ name: 'broken.json', mimeType: 'application/json', buffer: Buffer.from(JSON.stringify(broken)) });
        await expect.poll(() => page.locator('[data-card-id="heater"] [data-testid="stage-card-problem"]').innerText()).toMatch(/1 problem/);
        expect(await page.locator('[data-card-id="supply"] [data-testid="stage-card-problem"]').count()).toBe(0);
        expect(errors).toEqual([]);
      } finally {
        await context.close();
      }
    }
  });
});
