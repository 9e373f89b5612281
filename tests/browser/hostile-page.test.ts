/**
 * The page against hostile surroundings in real Chromium (issue 15, point 12): another origin's page
 * that frames the app gets a message and no app; a damaged address hash opens the app with a message,
 * not a blank page; names holding control characters export as an SVG file the browser's XML parser
 * reads (XML 1.0 §2.2 Char). The hostile page, the file and its names are our own invention.
 */
import { readFileSync } from 'node:fs';
import { createServer, type Server } from 'node:http';
import type { BrowserContext, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { skipWithout } from '../tools/system-tools.ts';
import { VIEWPORTS, freePort, serveBuiltApp, type ServedApp } from './harness.ts';
import { newRecordedPage, waitForResults } from './offline-helpers.ts';

/** A project whose names hold characters XML 1.0 forbids (NUL, BEL, backspace, ESC, U+FFFE, an unpaired surrogate). */
const controlNames = {
  format: 'joulepath-project',
  version: 2,
  name: 'Site\u0007 plan\uFFFE',
  elements: [
    { id: 'bank', kind: 'battery', voltage: 48, internalResistance: 0.01, name: 'Bank\u0000 A' },
    { id: 'lamp', kind: 'dc-load', from: 'bank', power: 40, name: 'Pump\u0001 room\u0008 light\u001B\uD800' },
  ],
};

describe.skipIf(skipWithout('chromium'))('hostile surroundings in Chromium', () => {
  let app: ServedApp | undefined;
  let context: BrowserContext | undefined;
  let framing: Server | undefined;
  let framingUrl = '';

  beforeAll(async () => {
    app = await serveBuiltApp('joulepath-hostile-');
    const appUrl = app.baseUrl;
    framing = createServer((_req, res) => {
      res.writeHead(200, { 'content-type': 'text/html; charset=utf-8' });
      res.end(`<!doctype html><title>Another site</title><iframe id="f" src="${appUrl}" width="900" height="600"></iframe>`);
    });
    const port = await freePort();
    await new Promise<void>((resolve) => framing!.listen(port, '127.0.0.1', resolve));
    framingUrl = `http://127.0.0.1:${port}/`;
    context = await app.browser.newContext({ viewport: VIEWPORTS.desktop, locale: 'en-US', acceptDownloads: true });
  });

  afterAll(async () => {
    await new Promise((resolve) => (framing ? framing.close(resolve) : resolve(undefined)));
    await context?.close();
    await app?.close();
  });

  it('will not run inside another origin\'s frame: a message and a link, no app, no storage', async () => {
    const { page, errors } = await newRecordedPage(context!);
    try {
      // Another origin's page framing the app: a server of the test's own on another port of this
      // machine (another origin: scheme, host and port), so Chromium's local-network rules let the
      // frame load as they would for a real site on the same network.
      await page.goto(framingUrl, { waitUntil: 'load' });
      const frame = page.frameLocator('#f');
      await frame.getByTestId('framed-notice').waitFor({ timeout: 30_000 });
      expect(await frame.getByTestId('framed-notice').innerText()).toMatch(/does not run inside another site.s page/);
      expect(await frame.getByRole('link', { name: 'Open Joulepath in its own tab' }).getAttribute('target')).toBe('_blank');
      expect(await frame.getByTestId('project').count()).toBe(0);
      expect(await frame.getByTestId('chain-editor').count()).toBe(0);
      // Nothing started: no service worker registered for the app from inside the frame.
      const appFrame = page.frames().find((f) => f.url().startsWith(app!.baseUrl))!;
      expect(await appFrame.evaluate('navigator.serviceWorker.getRegistrations().then((r) => r.length)')).toBe(0);
      expect(errors).toEqual([]);
    } finally {
      await page.close();
    }
  });

  it('runs in its own tab as usual (the check does not stop a page that is not framed)', async () => {
    const { page, errors } = await newRecordedPage(context!);
    try {
      await page.goto(app!.baseUrl, { waitUntil: 'load' });
      await waitForResults(page);
      expect(await page.getByTestId('framed-notice').count()).toBe(0);
      // The build ships the hosts' headers file beside the page (web/public/_headers → dist/_headers).
      const headers = await (await page.request.get(new URL('_headers', app!.baseUrl).href)).text();
      expect(headers).toContain("frame-ancestors 'none'");
      expect(headers).toContain('X-Frame-Options: DENY');
      expect(errors).toEqual([]);
    } finally {
      await page.close();
    }
  });

  it.each(['#project=%E0%A4%A', '#demo=%', '#demo=%E0%A4%A'])('a damaged address %s opens the app with a message', async (hash) => {
    const { page, errors } = await newRecordedPage(context!);
    try {
      await page.goto(`${app!.baseUrl}${hash}`, { waitUntil: 'load' });
      await waitForResults(page);
      await expect.poll(() => page.getByTestId('storage-notice').innerText()).toMatch(/cannot read .*opened without it/);
      expect(await page.locator('#project-heading').innerText()).not.toBe('');
      // The same damage arriving while the app runs (a pasted link): the open project stays.
      const heading = await page.locator('#project-heading').innerText();
      await page.evaluate(`location.hash = '#project=%E0%A4%A'`);
      await expect.poll(() => page.evaluate('location.hash')).toBe('#project=%E0%A4%A');
      await page.waitForTimeout(300);
      expect(await page.locator('#project-heading').innerText()).toBe(heading);
      expect(errors).toEqual([]);
    } finally {
      await page.close();
    }
  });

  it('names holding control characters export as SVG the browser\'s XML parser reads', async () => {
    const { page, errors } = await newRecordedPage(context!);
    try {
      await page.goto(app!.baseUrl, { waitUntil: 'load' });
      await waitForResults(page);
      await page.getByTestId('open-file').setInputFiles({ name: 'control-names.json', mimeType: 'application/json', buffer: Buffer.from(JSON.stringify(controlNames)) });
      await expect.poll(() => page.locator('#project-heading').innerText()).toContain('plan');
      await waitForResults(page);
      await page.getByTestId('flow-export-svg').scrollIntoViewIfNeeded();
      await expect.poll(() => page.getByTestId('flow-export-svg').isEnabled()).toBe(true);
      const [download] = await Promise.all([page.waitForEvent('download'), page.getByTestId('flow-export-svg').click()]);
      const svgText = readFileSync((await download.path())!, 'utf8');
      const parsed = (await page.evaluate(`(() => {
        const doc = new DOMParser().parseFromString(${JSON.stringify(svgText)}, 'image/svg+xml');
        return { errors: doc.getElementsByTagName('parsererror').length, root: doc.documentElement.localName, text: doc.documentElement.textContent };
      })()`)) as { errors: number; root: string; text: string };
      expect(parsed.errors).toBe(0);
      expect(parsed.root).toBe('svg');
      // The names are there, without the forbidden characters.
      expect(parsed.text).toContain('Site plan');
      expect(parsed.text).toContain('Pump room light');
      expect(svgText).not.toMatch(/[\u0000-\u0008\u000B\u000C\u000E-\u001F\uFFFE\uFFFF]/);
      expect(errors).toEqual([]);
    } finally {
      await page.close();
    }
  });
});
