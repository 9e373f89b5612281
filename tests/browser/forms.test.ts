/**
 * The stage forms in a real browser (Debian's Chromium, driven by playwright-core): a value changed
 * in a form changes the figures; bad input ("abc", an efficiency of 120 %) shows the message at the
 * field, marks the results out of date and keeps the last valid numbers; fixing it clears the mark;
 * US units show the cable length in feet with the stored value unchanged; a field edited with the
 * keyboard alone; a pass-through limit that does nothing (the hillside inverter: the bank is the
 * source) is named in the warnings and goes when the field is cleared. Screenshots of a form with an error at phone and desktop size go to
 * tests/.artifacts/ for a person to look at.
 *
 * Expected figures: the engine's own (the page only shows them); 35 m = 114.829… ft by
 * 1 ft = 0.3048 m (NIST SP 811, 2008 ed., B.8); behaviour checks are common practice (no source).
 */
import { join } from 'node:path';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { skipWithout } from '../tools/system-tools.ts';
import { VIEWPORTS, artifacts, serveBuiltApp, watchPageErrors, seriousAxeViolations, type ServedApp, chooseSetting } from './harness.ts';


/** Serious and critical axe-core violations inside the stage form. */
async function formViolations(page: Page): Promise<string[]> {
  const violations = await seriousAxeViolations(page, `'[data-testid="stage-form"]'`);
  return violations.map((v) => `${v.impact} ${v.id}: ${JSON.stringify(v.nodes.map((n) => n.target))}`);
}

describe.skipIf(skipWithout('chromium'))('stage forms in Chromium', () => {
  let app: ServedApp | undefined;
  let browser: Browser | undefined;
  let baseUrl = '';

  beforeAll(async () => {
    app = await serveBuiltApp('joulepath-forms-');
    ({ browser, baseUrl } = app);
  });

  afterAll(async () => {
    await app?.close();
  });

  async function openDemo(viewport: { width: number; height: number }, demo: string): Promise<{ context: BrowserContext; page: Page; errors: string[] }> {
    const context = await browser!.newContext({ viewport, deviceScaleFactor: 1, locale: 'en-US' });
    const page = await context.newPage();
    const errors = watchPageErrors(page);
    await page.goto(`${baseUrl}#demo=${demo}`, { waitUntil: 'load' });
    await page.getByTestId('chain-editor').waitFor();
    await page.getByTestId('totals-efficiency').waitFor();
    return { context, page, errors };
  }

  async function select(page: Page, id: string): Promise<void> {
    await page.locator(`[data-testid="stage-card"][data-card-id="${id}"]`).click();
    await page.locator(`[data-testid="stage-form"][data-element-id="${id}"]`).waitFor();
  }

  const field = (page: Page, path: string) => page.locator(`[data-testid="stage-form"] [data-testid="field-${path}"]`);
  const messageAt = (page: Page, path: string) => page.locator(`[data-testid="stage-form"] [data-path="${path}"] [data-testid="field-message"]`);
  const efficiency = async (page: Page) => ((await page.getByTestId('totals-efficiency').textContent()) ?? '').trim();
  const stale = (page: Page) => page.getByTestId('results-stale');

  it('a changed value changes the figures; bad input is marked at the field and the last valid figures stay (desktop)', async () => {
    const { context, page, errors } = await openDemo(VIEWPORTS.desktop, 'cold-store-dc-bus');
    try {
      await select(page, 'fan-inverter');
      const input = field(page, 'loss.efficiency');
      // The demo's fan inverter: constant efficiency 0.965, shown in per cent.
      expect(await input.inputValue()).toBe('96.5');
      await expect.poll(() => page.locator('[data-testid="stage-form"] [data-path="loss.efficiency"] .sf-unit').innerText()).toBe('%');
      const before = await efficiency(page);

      await input.fill('90');
      await expect.poll(() => efficiency(page)).not.toBe(before);
      const valid = await efficiency(page);
      expect(await stale(page).count()).toBe(0);

      // Text that is not a number: message naming the field, nothing written, results out of date.
      await input.fill('abc');
      await expect.poll(() => messageAt(page, 'loss.efficiency').innerText()).toBe("Efficiency (%): 'abc' is not a number");
      expect(await input.getAttribute('aria-invalid')).toBe('true');
      const describedBy = (await input.getAttribute('aria-describedby')) ?? '';
      const messageId = await messageAt(page, 'loss.efficiency').getAttribute('id');
      expect(describedBy.split(' ')).toContain(messageId);
      await stale(page).waitFor();
      expect(await efficiency(page)).toBe(valid);

      // A number the engine refuses: its message, in per cent for a field typed in per cent.
      await input.fill('120');
      await expect.poll(() => messageAt(page, 'loss.efficiency').innerText()).toMatch(/^Efficiency \(%\): .*must not exceed 100 %$/);
      await stale(page).waitFor();
      expect(await efficiency(page)).toBe(valid);
      expect(await input.inputValue()).toBe('120'); // what was typed stays in view

      await page.setViewportSize(VIEWPORTS.desktop);
      await page.locator('[data-testid="stage-form"]').scrollIntoViewIfNeeded();
      await page.screenshot({ path: join(artifacts, 'forms-error-desktop.png') });
      expect(await formViolations(page)).toEqual([]);
      // The other stage kinds of the demo, in the dark theme too (labels, contrast, names).
      for (const theme of ['light', 'dark']) {
        await chooseSetting(page, 'theme-select', theme);
        for (const id of ['rectifier', 'ctl-cable', 'poe', 'bus']) {
          await select(page, id);
          expect(await formViolations(page), `${id} (${theme})`).toEqual([]);
        }
      }
      await select(page, 'fan-inverter');

      // Fixed: the mark goes, the figures follow the new value.
      await input.fill('92');
      await expect.poll(() => stale(page).count()).toBe(0);
      expect(await messageAt(page, 'loss.efficiency').count()).toBe(0);
      // Polled: scrolled out of view, the figures follow when the page is next idle (web/components/lag.ts).
      await expect.poll(() => efficiency(page)).not.toBe(valid);
      expect(errors).toEqual([]);
    } finally {
      await context.close();
    }
  });

  it('a pass-through limit on the inverter of a chain whose bank is the source is named as doing nothing, and goes with the limit (desktop)', async () => {
    // The hillside relay hut: the bank is the chain's source (no bank on a bus), so an inverter-charger's
    // pass-through has no supply to pass (core/solve/project-warnings.ts; common practice (no source)).
    const { context, page, errors } = await openDemo(VIEWPORTS.desktop, 'hillside-relay-hut');
    try {
      const warnings = page.getByTestId('warnings');
      const named = () => warnings.filter({ hasText: 'Pass-through limit (inverter-charger)' }).count();
      expect(await named()).toBe(0);
      await select(page, 'inverter');
      const limit = field(page, 'passThroughLimit');
      await limit.fill('16');
      await expect.poll(named).toBe(1);
      const text = (await warnings.innerText()).replace(/\s+/g, ' ');
      expect(text).toContain(`its "Pass-through limit (inverter-charger)" is used only when a battery bank is on the inverter's DC bus; this chain has no bank on a bus, so the limit does nothing here`);
      await warnings.screenshot({ path: join(artifacts, 'forms-pass-through-unused.png') });
      await limit.fill('');
      await expect.poll(named).toBe(0);
      expect(errors).toEqual([]);
    } finally {
      await context.close();
    }
  });

  it('US units show the cable length in ft; switching back shows the stored metres unchanged (phone)', async () => {
    const { context, page, errors } = await openDemo(VIEWPORTS.phone, 'cold-store-dc-bus');
    try {
      await select(page, 'fan-cable');
      const length = field(page, 'length');
      expect(await length.inputValue()).toBe('35');
      await chooseSetting(page, 'units-select', 'us');
      // 35 m ÷ 0.3048 m/ft (NIST SP 811 B.8), 12 significant digits in the input.
      await expect.poll(() => length.inputValue()).toBe('114.829396325');
      expect(await page.locator('[data-testid="stage-form"] [data-path="length"] .sf-unit').innerText()).toBe('ft');
      expect(await field(page, 'resistancePerKm').inputValue()).toBe('2.65176'); // 8.7 Ω/km × 0.3048 = Ω per 1000 ft
      await chooseSetting(page, 'units-select', 'si');
      await expect.poll(() => length.inputValue()).toBe('35');

      // Typing in feet stores metres: 100 ft = 30.48 m.
      await chooseSetting(page, 'units-select', 'us');
      await length.fill('100');
      await length.blur();
      await chooseSetting(page, 'units-select', 'si');
      await expect.poll(() => length.inputValue()).toBe('30.48');

      // An error on a phone, for a person to look at.
      await chooseSetting(page, 'units-select', 'us');
      await length.fill('12o');
      await expect.poll(() => messageAt(page, 'length').innerText()).toBe("Route length (one way): '12o' is not a number");
      await page.locator('[data-testid="stage-form"] [data-path="length"]').scrollIntoViewIfNeeded();
      await page.screenshot({ path: join(artifacts, 'forms-error-phone.png') });
      expect(errors).toEqual([]);
    } finally {
      await context.close();
    }
  });

  it('edits a field with the keyboard alone: open the stage with Enter, Tab to the field, type, Tab on', async () => {
    const { context, page, errors } = await openDemo(VIEWPORTS.desktop, 'hillside-relay-hut');
    try {
      const card = page.locator('[data-testid="stage-card"][data-card-id="bus"]');
      await card.focus();
      await page.keyboard.press('Enter');
      await page.locator('[data-testid="stage-form"][data-element-id="bus"]').waitFor();
      const before = await efficiency(page);
      for (let i = 0; i < 30; i++) {
        if ((await page.evaluate('document.activeElement?.getAttribute("data-testid")')) === 'field-fixedLoss') break;
        await page.keyboard.press('Tab');
      }
      expect(await page.evaluate('document.activeElement?.getAttribute("data-testid")')).toBe('field-fixedLoss');
      await page.keyboard.press('ControlOrMeta+a');
      await page.keyboard.type('60');
      await page.keyboard.press('Tab');
      await expect.poll(() => efficiency(page)).not.toBe(before);
      expect(await field(page, 'fixedLoss').inputValue()).toBe('60');
      // The focus ring shows on the next control.
      const outline = await page.evaluate('getComputedStyle(document.activeElement).outlineStyle');
      expect(outline).not.toBe('none');

      // A choice group switched by keyboard: the loss model of the 48→12 V converter.
      await page.locator('[data-testid="stage-card"][data-card-id="radio-psu"]').focus();
      await page.keyboard.press('Enter');
      await page.locator('[data-testid="stage-form"][data-element-id="radio-psu"]').waitFor();
      expect(await field(page, 'loss.p0').inputValue()).toBe('3.5');
      await page.locator('[data-testid="variant-loss-polynomial"]').focus();
      await page.keyboard.press('ArrowLeft'); // the previous radio: the efficiency curve
      await expect.poll(() => page.locator('[data-testid="points-loss.points"]').count()).toBe(1);
      expect(await page.locator('[data-testid="points-loss.points"] tbody tr').count()).toBe(4);
      expect(errors).toEqual([]);
    } finally {
      await context.close();
    }
  });
});
