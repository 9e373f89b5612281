/**
 * Offline use in real Chromium against a production build: after the first visit the app starts with
 * no network, demos solve and stored projects open; an edit of a demo is stored as a copy and is
 * there after a reload (online and offline); every request is a same-origin GET for the app's own
 * files; a new build served at the same address brings the polite update prompt, and the stored
 * projects are intact after the user reloads into it. Timings (warm offline start) are printed for
 * the report, never asserted.
 */
import { join } from 'node:path';
import type { BrowserContext, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { skipWithout } from '../tools/system-tools.ts';
import { VIEWPORTS, artifacts, serveBuiltApp, type ServedApp, fullPageScreenshot, showProjectsView } from './harness.ts';
import { cardCount, dumpStore, duplicateLastStage, median, newRecordedPage, storedRecords, waitForResults, waitForServiceWorker, waitSaved } from './offline-helpers.ts';

/** Records, in the page, when the results table first appears (ms after navigation start), one frame later. */
const PAINT_PROBE = `
  new MutationObserver((_, observer) => {
    if (document.querySelector('[data-testid="element-table"]')) {
      observer.disconnect();
      requestAnimationFrame(() => { window.__resultsPaintedAt = performance.now(); });
    }
  }).observe(document, { childList: true, subtree: true });
`;

describe.skipIf(skipWithout('chromium'))('offline use (service worker, stored projects, updates)', () => {
  let app: ServedApp | undefined;
  let context: BrowserContext | undefined;
  let page: Page;
  let errors: string[] = [];
  const requests: { url: string; method: string }[] = [];
  const figures: string[] = [];

  beforeAll(async () => {
    app = await serveBuiltApp('joulepath-offline-');
    context = await app.browser.newContext({ viewport: VIEWPORTS.phone, locale: 'en-US' });
    await context.addInitScript(PAINT_PROBE);
    // Every request of every page and of the service worker.
    context.on('request', (req) => requests.push({ url: req.url(), method: req.method() }));
    const rec = await newRecordedPage(context);
    ({ page, errors } = rec);
    const t = performance.now();
    await page.goto(app.baseUrl, { waitUntil: 'load' });
    await waitForResults(page);
    await waitForServiceWorker(page);
    figures.push(`first visit to an active service worker: ${((performance.now() - t) / 1000).toFixed(1)} s`);
  });

  afterAll(async () => {
    await context?.close();
    await app?.close();
    if (figures.length) console.log(`offline: ${figures.join('; ')}`);
  });

  it('serves the manifest and a content security policy without inline scripts or eval', async () => {
    const csp = await page.locator('meta[http-equiv="Content-Security-Policy"]').getAttribute('content');
    expect(csp).toContain("script-src 'self'");
    expect(csp).not.toMatch(/unsafe-eval|script-src[^;]*unsafe-inline/);
    expect(csp).toContain("connect-src 'self'");
    // No inline script in the built page.
    expect(await page.locator('script:not([src])').count()).toBe(0);
    const manifest = (await (await page.request.get(new URL('manifest.webmanifest', app!.baseUrl).href)).json()) as { name: string; icons: { purpose: string; sizes: string }[] };
    expect(manifest.name).toBe('Joulepath');
    expect(manifest.icons.some((i) => i.purpose === 'maskable')).toBe(true);
    expect(manifest.icons.map((i) => i.sizes)).toEqual(expect.arrayContaining(['192x192', '512x512']));
    await showProjectsView(page);
    await page.getByText('Storage and offline use').click();
    await expect.poll(async () => page.getByTestId('offline-ready').innerText()).toMatch(/Works offline/);
    await page.getByTestId('projects-back').click();
    await page.getByTestId('project').waitFor();
  });

  it('stores the first edit of a demo as a copy, which a reload opens again', async () => {
    const demoTitle = (await page.locator('#project-heading').innerText()).trim();
    await duplicateLastStage(page);
    await waitSaved(page);
    await expect.poll(() => page.url()).toMatch(/#project=[A-Za-z0-9-]+$/);
    expect((await page.locator('#project-heading').innerText()).trim()).toBe(`${demoTitle} (my copy)`);
    const cards = await cardCount(page);
    const records = await storedRecords(page);
    expect(records).toHaveLength(1);
    expect(records[0]!.project.name).toBe(`${demoTitle} (my copy)`);
    expect(records[0]!.project.elements).toHaveLength(cards);
    await page.reload({ waitUntil: 'load' });
    await waitForResults(page);
    expect(await cardCount(page)).toBe(cards);
    expect((await page.locator('#project-heading').innerText()).trim()).toBe(`${demoTitle} (my copy)`);
    // A start without an address opens the project saved last.
    await page.goto(app!.baseUrl, { waitUntil: 'load' });
    await waitForResults(page);
    expect((await page.locator('#project-heading').innerText()).trim()).toBe(`${demoTitle} (my copy)`);
  });

  it('starts and works with no network: demos solve, the stored project opens, edits survive a reload', async () => {
    await context!.setOffline(true);
    try {
      const before = await cardCount(page);
      const times: number[] = [];
      for (let i = 0; i < 5; i++) {
        await page.reload({ waitUntil: 'load' });
        await waitForResults(page);
        await expect.poll(() => page.evaluate('window.__resultsPaintedAt ?? null')).not.toBeNull();
        times.push((await page.evaluate('window.__resultsPaintedAt')) as number);
      }
      figures.push(`warm offline start to first results painted: median ${median(times).toFixed(0)} ms (${times.map((t) => t.toFixed(0)).join(', ')})`);
      expect(await page.evaluate('navigator.onLine')).toBe(false);
      expect(await cardCount(page)).toBe(before);
      // A demo solves offline.
      const demo = page.locator('a[data-demo-id]').nth(1);
      await showProjectsView(page);
      await demo.click();
      await waitForResults(page);
      await expect.poll(() => demo.getAttribute('aria-current')).toBe('page');
      // The stored project opens from the list, and an edit made offline survives a reload.
      await showProjectsView(page);
      await page.getByTestId('project-list').locator('a.picker__item').first().click();
      await expect.poll(() => cardCount(page)).toBe(before);
      await duplicateLastStage(page);
      await waitSaved(page);
      await page.reload({ waitUntil: 'load' });
      await waitForResults(page);
      expect(await cardCount(page)).toBe(before + 1);
      await fullPageScreenshot(page, join(artifacts, 'offline-phone.png'));
    } finally {
      await context!.setOffline(false);
    }
  });

  it('sent nothing anywhere: every request was a same-origin GET for the app', () => {
    const origin = new URL(app!.baseUrl).origin;
    expect(requests.length).toBeGreaterThan(0);
    const foreign = requests.filter((r) => new URL(r.url).origin !== origin && !r.url.startsWith('blob:') && !r.url.startsWith('data:'));
    expect(foreign).toEqual([]);
    expect(requests.filter((r) => r.method !== 'GET')).toEqual([]);
  });

  it('shows the update prompt for a new build, keeps the data, and reloads only when asked', async () => {
    const storedBefore = await dumpStore(page);
    expect(storedBefore).not.toBe('[]');
    // Another app on the same origin keeps its offline copy when our new worker takes over; an old
    // cache of ours goes (issue 15, point 11).
    // (Page code as a string: this file is type-checked without the DOM library.)
    await page.evaluate(`(async () => {
      await (await caches.open('other-app-v1')).put('/other-app/index.html', new Response('other app'));
      await (await caches.open('joulepath-shell-v0-old-layout')).put('/old.html', new Response('old shell'));
    })()`);
    await app!.redeploy({ define: { __JOULEPATH_VERSION__: JSON.stringify('0.1.0-next') } });
    // The browser checks for a new service worker on navigation.
    await page.reload({ waitUntil: 'load' });
    await waitForResults(page);
    const prompt = page.getByTestId('update-prompt');
    await prompt.waitFor({ timeout: 60_000 });
    expect(await prompt.innerText()).toContain('A new version is ready — reload when you are ready');
    await page.screenshot({ path: join(artifacts, 'update-prompt-phone.png') });
    // Nothing reloads by itself: the old version stays until the user taps.
    await page.waitForTimeout(1500);
    await showProjectsView(page);
    await page.getByText('Storage and offline use').click();
    expect(await page.getByTestId('storage-details').innerText()).toContain('version 0.1.0.');
    expect(await dumpStore(page)).toBe(storedBefore);
    // Back to the project (the projects view is a history entry a reload would keep).
    await page.getByTestId('projects-back').click();
    await page.getByTestId('project').waitFor();
    await Promise.all([page.waitForEvent('load', { timeout: 60_000 }), prompt.getByRole('button', { name: 'Reload now' }).click()]);
    await waitForResults(page);
    await showProjectsView(page);
    await page.getByText('Storage and offline use').click();
    await expect.poll(() => page.getByTestId('storage-details').innerText()).toContain('version 0.1.0-next');
    expect(await page.getByTestId('update-prompt').count()).toBe(0);
    expect(await dumpStore(page)).toBe(storedBefore);
    // The new worker has activated (it deleted our old cache) and left the other app's alone.
    const cacheKeys = async () => (await page.evaluate('caches.keys()')) as string[];
    await expect.poll(cacheKeys).not.toContain('joulepath-shell-v0-old-layout');
    const keys = await cacheKeys();
    expect(keys).toContain('other-app-v1');
    expect(await page.evaluate(`caches.open('other-app-v1').then((c) => c.match('/other-app/index.html')).then((r) => r?.text())`)).toBe('other app');
    expect(keys.some((k) => k.startsWith('joulepath-shell-v1-'))).toBe(true);
    expect(errors).toEqual([]);
  });
});
