/**
 * Stored projects under faults in real Chromium (issue 15): the page closed inside the autosave
 * window, and (below) two tabs, project switches, a refused write and a page close in one scripted run.
 * Behaviour of our own storage (web/storage/README.md): common practice (no source).
 */
import type { BrowserContext, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { skipWithout } from '../tools/system-tools.ts';
import { VIEWPORTS, serveBuiltApp, type ServedApp } from './harness.ts';
import { cardCount, duplicateLastStage, newRecordedPage, storedRecords, waitForResults, waitSaved } from './offline-helpers.ts';

describe.skipIf(skipWithout('chromium'))('stored projects under faults in Chromium', () => {
  let app: ServedApp | undefined;

  beforeAll(async () => {
    app = await serveBuiltApp('joulepath-storage-faults-');
  });

  afterAll(async () => {
    await app?.close();
  });

  async function open(context: BrowserContext, address = app!.baseUrl): Promise<{ page: Page; errors: string[] }> {
    const { page, errors } = await newRecordedPage(context);
    await page.goto(address, { waitUntil: 'load' });
    await waitForResults(page);
    return { page, errors };
  }

  it('keeps an edit made just before the page is closed (inside the autosave wait)', async () => {
    const context = await app!.browser.newContext({ viewport: VIEWPORTS.desktop, locale: 'en-US' });
    try {
      const { page, errors } = await open(context);
      await duplicateLastStage(page); // the demo's first edit stores a copy
      await waitSaved(page);
      const cards = await cardCount(page);
      await duplicateLastStage(page);
      // Closed at once: well inside the 300 ms autosave wait (session.ts AUTOSAVE_MS).
      await page.close({ runBeforeUnload: false });
      expect(errors).toEqual([]);
      const { page: again, errors: errorsAgain } = await open(context);
      expect(await cardCount(again)).toBe(cards + 1);
      const records = await storedRecords(again);
      expect(records).toHaveLength(1);
      expect(records[0]!.project.elements).toHaveLength(cards + 1);
      expect(errorsAgain).toEqual([]);
    } finally {
      await context.close();
    }
  });
});
