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
import { VIEWPORTS, answersSettled, artifacts, chooseSetting, fullPageScreenshot, seriousAxeViolations, serveBuiltApp, watchPageErrors, type AxeViolation, type ServedApp } from './harness.ts';

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
    // The strip's heights are measured whole: with its lazy lines and study figures in.
    await answersSettled(page);
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

  const focusedTestId = (page: Page) => page.evaluate('document.activeElement?.dataset?.testid ?? document.activeElement?.id ?? ""') as Promise<string>;
  const describe = (vs: AxeViolation[]) => vs.map((v) => `${v.impact} ${v.id}: ${v.help} ${v.nodes.map((n) => JSON.stringify(n.target)).join(' ')}`).join('\n');

  it('keeps units, number format and theme in a settings menu: opened by keyboard, closed by Escape with the focus back', async () => {
    const { context, page, errors } = await openDemo('cold-store-dc-bus');
    try {
      // Not on the page until asked for.
      expect(await page.getByTestId('units-select').isVisible()).toBe(false);
      const button = page.getByTestId('settings-button');
      expect(await button.getAttribute('aria-expanded')).toBe('false');
      // The first screen has the header's two buttons on one row, the project's name under them.
      const top = await page.getByTestId('projects-button').boundingBox();
      const settingsBox = await button.boundingBox();
      expect(Math.abs(top!.y - settingsBox!.y)).toBeLessThan(2);
      await button.focus();
      await page.keyboard.press('Enter');
      // At once, not polled: the focus moves into the panel before the paint, so a key pressed as soon as
      // it shows reaches its first setting.
      expect(await focusedTestId(page)).toBe('units-select');
      expect(await button.getAttribute('aria-expanded')).toBe('true');
      // Inside the screen, every control at least 44 px (WCAG 2.2 2.5.8 asks 24 px; 44 px is this page's own target).
      const panel = await page.getByTestId('settings-panel').boundingBox();
      expect(panel!.x).toBeGreaterThanOrEqual(0);
      expect(panel!.x + panel!.width).toBeLessThanOrEqual(VIEWPORTS.phone.width);
      for (const id of ['units-select', 'locale-select', 'theme-select']) expect((await page.getByTestId(id).boundingBox())!.height).toBeGreaterThanOrEqual(44);
      await page.screenshot({ path: join(artifacts, 'phone-settings-open.png') });
      // A choice is kept when the menu closes.
      await page.getByTestId('units-select').selectOption('us');
      await page.keyboard.press('Escape');
      await expect.poll(() => button.getAttribute('aria-expanded')).toBe('false');
      expect(await focusedTestId(page)).toBe('settings-button');
      expect(await page.getByTestId('units-select').inputValue()).toBe('us');
      // A tap outside closes it too.
      await button.click();
      await expect.poll(() => page.getByTestId('settings-panel').isVisible()).toBe(true);
      await page.touchscreen.tap(20, VIEWPORTS.phone.height - 20);
      await expect.poll(() => page.getByTestId('settings-panel').isVisible()).toBe(false);
      await chooseSetting(page, 'theme-select', 'dark');
      await expect.poll(() => page.evaluate('document.documentElement.dataset.theme')).toBe('dark');
      expect(errors).toEqual([]);
    } finally {
      await context.close();
    }
  });

  it('shows the projects in their own view; Back (the button or the browser’s) returns to the project', async () => {
    const { context, page, errors } = await openDemo('hillside-relay-hut');
    try {
      // The description is cut to two lines so the answers stay on the first screen; a tap shows it all.
      const summary = page.locator('#project-summary');
      const cut = (await summary.boundingBox())!.height;
      const toggle = page.getByTestId('summary-toggle');
      expect(await toggle.getAttribute('aria-expanded')).toBe('false');
      await toggle.tap();
      await expect.poll(async () => (await summary.boundingBox())!.height).toBeGreaterThan(cut * 2);
      expect(await toggle.getAttribute('aria-expanded')).toBe('true');
      await toggle.tap();
      await expect.poll(async () => (await summary.boundingBox())!.height).toBe(cut);
      expect(await page.getByTestId('projects-view').isVisible()).toBe(false);
      expect(await page.getByTestId('project').isVisible()).toBe(true);
      await page.getByTestId('projects-button').tap();
      await expect.poll(() => page.getByTestId('projects-view').isVisible()).toBe(true);
      expect(await page.getByTestId('project').isVisible()).toBe(false);
      expect(await focusedTestId(page)).toBe('projects-back');
      expect(await page.getByTestId('projects-back').innerText()).toContain('Back to');
      expect(await page.getByTestId('project-list').isVisible()).toBe(true);
      expect(await page.getByTestId('save-line').count()).toBe(1);
      await page.screenshot({ path: join(artifacts, 'phone-projects-view.png') });
      // The browser's Back returns to the project, at the same address.
      const address = page.url();
      await page.goBack();
      await expect.poll(() => page.getByTestId('project').isVisible()).toBe(true);
      expect(page.url()).toBe(address);
      // The view's own Back button likewise.
      await page.getByTestId('projects-button').click();
      await expect.poll(() => page.getByTestId('projects-view').isVisible()).toBe(true);
      await page.getByTestId('projects-back').click();
      await expect.poll(() => page.getByTestId('project').isVisible()).toBe(true);
      // Opening another demo from the view shows it; Back then returns to the list, and Back again to the first demo.
      await page.getByTestId('projects-button').click();
      await page.locator('a[data-demo-id="riverside-pump-station"]').tap();
      await expect.poll(() => page.locator('#project-heading').innerText()).toContain('pump station');
      expect(await page.getByTestId('project').isVisible()).toBe(true);
      expect(page.url()).toContain('#demo=riverside-pump-station');
      await expect.poll(() => page.evaluate('document.activeElement?.id')).toBe('project-heading');
      await page.goBack();
      await expect.poll(() => page.getByTestId('projects-view').isVisible()).toBe(true);
      await expect.poll(() => page.locator('a[data-demo-id="hillside-relay-hut"]').getAttribute('aria-current')).toBe('page');
      await page.goBack();
      await expect.poll(() => page.getByTestId('project').isVisible()).toBe(true);
      expect(page.url()).toContain('#demo=hillside-relay-hut');
      expect(errors).toEqual([]);
    } finally {
      await context.close();
    }
  });

  it('keeps a side column with the projects on a wide screen, the project’s name and answers first', async () => {
    const { context, page, errors } = await openDemo('hillside-relay-hut', VIEWPORTS.desktop);
    try {
      expect(await page.getByTestId('projects-view').isVisible()).toBe(true);
      expect(await page.getByTestId('projects-button').isVisible()).toBe(false);
      // The description is whole on a wide screen, with no button to show it.
      expect(await page.getByTestId('summary-toggle').count()).toBe(0);
      const answers = await page.getByTestId('answers').boundingBox();
      expect(answers!.y + answers!.height).toBeLessThanOrEqual(VIEWPORTS.desktop.height);
      const side = await page.getByTestId('projects-view').boundingBox();
      expect(side!.x).toBeGreaterThan(answers!.x + answers!.width - 1);
      await page.screenshot({ path: join(artifacts, 'desktop-first-screen.png') });
      expect(errors).toEqual([]);
    } finally {
      await context.close();
    }
  });

  it('shows the chain tools for the selected card only, with only the actions that fit it', async () => {
    const { context, page, errors } = await openDemo('hillside-relay-hut');
    try {
      const tools = page.getByTestId('card-tools');
      const shown = async () => {
        const direct = await tools.locator(':scope > button').evaluateAll((els) => els.map((e) => e.getAttribute('data-testid')));
        const hasMore = (await page.getByTestId('op-more').count()) > 0;
        let more: (string | null)[] = [];
        if (hasMore) {
          await page.getByTestId('op-more').click();
          more = await page.getByTestId('more-menu').locator('[role="menuitem"]').evaluateAll((els) => els.map((e) => e.getAttribute('data-testid')));
          await page.keyboard.press('Escape');
        }
        return { direct, more };
      };
      expect(await tools.count()).toBe(0);
      // A load: nothing to add after it or beside it; remove, and in "More" what moves it.
      const load = page.locator('[data-card-id]').last();
      await load.click();
      await tools.waitFor();
      const atLoad = await shown();
      expect(atLoad.direct).toEqual(['op-remove']);
      expect(atLoad.direct).not.toContain('op-add-after');
      expect(atLoad.direct).not.toContain('op-add-branch');
      expect(atLoad.more).toContain('op-duplicate');
      expect(atLoad.more).not.toContain('op-remove-branch');
      // At most 4 buttons (3 and "More") where there were 10: two rows on a phone.
      const box = await tools.boundingBox();
      expect(box!.height).toBeLessThan(2 * 48 + 24);
      // The source: add after or beside it, nothing to remove or move.
      const source = page.locator('[data-card-id]').first();
      await source.click();
      const atSource = await shown();
      expect(atSource.direct).toEqual(['op-add-after', 'op-add-branch']);
      expect(atSource.more).toEqual([]);
      // Every add button opens a chooser with at least one kind.
      for (const id of atSource.direct) {
        await page.getByTestId(id!).click();
        await expect.poll(() => page.locator('[data-testid="kind-chooser"] .kind-option').count()).toBeGreaterThan(0);
        await page.keyboard.press('Escape');
        await expect.poll(() => page.getByTestId('kind-chooser').count()).toBe(0);
        expect(await focusedTestId(page)).toBe(id);
      }
      await page.screenshot({ path: join(artifacts, 'phone-card-tools.png') });
      expect(errors).toEqual([]);
    } finally {
      await context.close();
    }
  });

  it('works the "More" menu by keyboard (arrows, Escape, focus back) and by tap', async () => {
    const { context, page, errors } = await openDemo('hillside-relay-hut');
    try {
      const cards = page.locator('[data-card-id]');
      const count = await cards.count();
      const last = cards.last();
      await last.click();
      const more = page.getByTestId('op-more');
      await more.focus();
      await page.keyboard.press('Enter');
      const menu = page.getByTestId('more-menu');
      await menu.waitFor();
      expect(await more.getAttribute('aria-expanded')).toBe('true');
      const items = await menu.locator('[role="menuitem"]').evaluateAll((els) => els.map((e) => e.getAttribute('data-testid')));
      expect(items.length).toBeGreaterThan(1);
      await expect.poll(() => focusedTestId(page)).toBe(items[0]);
      await page.keyboard.press('ArrowDown');
      expect(await focusedTestId(page)).toBe(items[1]);
      await page.keyboard.press('End');
      expect(await focusedTestId(page)).toBe(items[items.length - 1]);
      await page.keyboard.press('ArrowDown');
      expect(await focusedTestId(page)).toBe(items[0]);
      await page.keyboard.press('ArrowUp');
      expect(await focusedTestId(page)).toBe(items[items.length - 1]);
      await page.keyboard.press('Escape');
      await expect.poll(() => menu.count()).toBe(0);
      expect(await focusedTestId(page)).toBe('op-more');
      expect(await more.getAttribute('aria-expanded')).toBe('false');
      // Down opens it at the first item; the arrow keys pressed at once (not waiting for the menu to show)
      // reach the menu, since the focus moves into it before the paint; Enter carries the item out.
      const dupAt = items.indexOf('op-duplicate');
      expect(dupAt).toBeGreaterThanOrEqual(0);
      await page.keyboard.press('ArrowDown');
      for (let i = 0; i < dupAt; i++) await page.keyboard.press('ArrowDown');
      expect(await focusedTestId(page)).toBe('op-duplicate');
      await page.keyboard.press('Enter');
      await expect.poll(() => cards.count()).toBe(count + 1);
      expect(await menu.count()).toBe(0);
      // By tap: open, tap outside closes; open, tap "Duplicate".
      await page.getByTestId('op-more').tap();
      await menu.waitFor();
      await page.screenshot({ path: join(artifacts, 'phone-more-menu.png') });
      // Inside the screen.
      const mb = await menu.boundingBox();
      expect(mb!.x).toBeGreaterThanOrEqual(0);
      expect(mb!.x + mb!.width).toBeLessThanOrEqual(VIEWPORTS.phone.width);
      await page.locator('#project-heading').tap();
      await expect.poll(() => menu.count()).toBe(0);
      await page.getByTestId('op-more').tap();
      await menu.getByTestId('op-duplicate').tap();
      await expect.poll(() => cards.count()).toBe(count + 2);
      expect(errors).toEqual([]);
    } finally {
      await context.close();
    }
  });

  it('passes axe with the settings menu and the "More" menu open, phone and desktop, light and dark', async () => {
    const failures: string[] = [];
    for (const [label, viewport] of Object.entries(VIEWPORTS)) {
      for (const scheme of ['light', 'dark'] as const) {
        const { context, page, errors } = await openDemo('riverside-pump-station', viewport, scheme);
        try {
          await page.getByTestId('settings-button').click();
          await page.getByTestId('settings-panel').waitFor();
          let found = await seriousAxeViolations(page);
          if (found.length) failures.push(`${label} ${scheme}, settings open:\n${describe(found)}`);
          await page.keyboard.press('Escape');
          await page.locator('[data-card-id]').last().click();
          await page.getByTestId('op-more').click();
          await page.getByTestId('more-menu').waitFor();
          found = await seriousAxeViolations(page);
          if (found.length) failures.push(`${label} ${scheme}, More open:\n${describe(found)}`);
          await page.screenshot({ path: join(artifacts, `menus-${label}-${scheme}.png`) });
          await page.keyboard.press('Escape');
          if (viewport === VIEWPORTS.phone) {
            await page.getByTestId('projects-button').click();
            await page.getByTestId('projects-view').waitFor();
            found = await seriousAxeViolations(page);
            if (found.length) failures.push(`${label} ${scheme}, projects view:\n${describe(found)}`);
          }
          if (scheme === 'light') await fullPageScreenshot(page, join(artifacts, `phone-first-${label}.png`));
          expect(errors).toEqual([]);
        } finally {
          await context.close();
        }
      }
    }
    expect(failures.join('\n\n')).toBe('');
  });
});
