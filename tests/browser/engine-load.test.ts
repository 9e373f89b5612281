/**
 * The engine loads on demand (web/state/engine.ts): the page paints its first screen without it, the
 * results follow when it arrives, and when its files cannot be fetched the page says so in place of
 * the results (and never shows wrong ones). The engine's files are held back or refused through
 * playwright's request routing; the service worker is blocked so that every request reaches the route.
 * Behaviour checks: common practice (no source).
 */
import type { Route } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { skipWithout } from '../tools/system-tools.ts';
import { VIEWPORTS, serveBuiltApp, type ServedApp } from './harness.ts';

/** The engine's own chunk (web/state/engine-lazy.ts). */
const ENGINE_CHUNK = /\/assets\/engine-lazy-[^/]+\.js$/;

describe.skipIf(skipWithout('chromium'))('the engine on demand, in Chromium', () => {
  let app: ServedApp | undefined;

  beforeAll(async () => {
    app = await serveBuiltApp('joulepath-engine-');
  });

  afterAll(async () => {
    await app?.close();
  });

  it('paints the project before the engine arrives, then shows its results', async () => {
    const context = await app!.browser.newContext({ viewport: VIEWPORTS.phone, locale: 'en-US', serviceWorkers: 'block' });
    const page = await context.newPage();
    let release: () => void = () => {};
    const held = new Promise<void>((resolve) => (release = resolve));
    await page.route(ENGINE_CHUNK, async (route: Route) => {
      await held;
      await route.continue();
    });
    try {
      await page.goto(`${app!.baseUrl}#demo=hillside-relay-hut`, { waitUntil: 'load' });
      await expect.poll(() => page.getByTestId('project').count()).toBe(1);
      // The first screen stands without the engine: the project's name, no results, no problems.
      await expect.poll(() => page.locator('#project-heading').textContent()).toContain('Hillside');
      expect(await page.getByTestId('results').count()).toBe(0);
      expect(await page.getByTestId('unreadable').count()).toBe(0);
      release();
      await page.getByTestId('energy-balance').waitFor();
      expect(await page.getByTestId('results').getAttribute('data-state')).toBe('current');
    } finally {
      release();
      await context.close();
    }
  });

  it('says so in place of the results when the engine cannot be fetched', async () => {
    const context = await app!.browser.newContext({ viewport: VIEWPORTS.desktop, locale: 'en-US', serviceWorkers: 'block' });
    const page = await context.newPage();
    await page.route(ENGINE_CHUNK, (route: Route) => route.abort('internetdisconnected'));
    try {
      await page.goto(`${app!.baseUrl}#demo=hillside-relay-hut`, { waitUntil: 'load' });
      const alert = page.getByTestId('unreadable');
      await alert.waitFor();
      expect(await alert.textContent()).toContain('The calculation could not be loaded');
      expect(await page.getByTestId('results').count()).toBe(0);
    } finally {
      await context.close();
    }
  });
});
