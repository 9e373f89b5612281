/**
 * Stored projects in real Chromium: the project list (open, rename, duplicate, delete with undo),
 * a refused write (the browser's quota) that says "Not saved" and keeps the work on the page, two
 * tabs editing one project (the conflict question and its answers), and the time to save a
 * 200-stage project (printed for the report, never asserted).
 */
import { join } from 'node:path';
import type { BrowserContext, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { skipWithout } from '../tools/system-tools.ts';
import { VIEWPORTS, artifacts, serveBuiltApp, type ServedApp } from './harness.ts';
import { cardCount, duplicateLastStage, median, newRecordedPage, storedRecords, waitForResults, waitSaved } from './offline-helpers.ts';

/** A battery feeding 199 loads: 200 stages (an invented test project). */
function bigProject(): object {
  return {
    format: 'joulepath-project',
    version: 2,
    name: 'Two hundred stages',
    elements: [
      { id: 'bank', kind: 'battery', voltage: 48, name: 'Bank' },
      ...Array.from({ length: 199 }, (_, i) => ({ id: `load-${i + 1}`, kind: 'dc-load', from: 'bank', power: 10 + i, name: `Load ${i + 1}` })),
    ],
  };
}

async function importJson(page: Page, name: string, data: unknown): Promise<void> {
  await page.getByTestId('open-file').setInputFiles({ name, mimeType: 'application/json', buffer: Buffer.from(JSON.stringify(data)) });
}

describe.skipIf(skipWithout('chromium'))('stored projects in Chromium', () => {
  let app: ServedApp | undefined;
  const figures: string[] = [];

  beforeAll(async () => {
    app = await serveBuiltApp('joulepath-storage-');
  });

  afterAll(async () => {
    await app?.close();
    if (figures.length) console.log(`storage: ${figures.join('; ')}`);
  });

  async function fresh(viewport: { width: number; height: number } = VIEWPORTS.desktop): Promise<{ context: BrowserContext; page: Page; errors: string[] }> {
    const context = await app!.browser.newContext({ viewport, locale: 'en-US' });
    const { page, errors } = await newRecordedPage(context);
    await page.goto(app!.baseUrl, { waitUntil: 'load' });
    await waitForResults(page);
    return { context, page, errors };
  }

  it('lists projects newest first; rename, duplicate, delete and undo the delete', async () => {
    const { context, page, errors } = await fresh();
    try {
      await duplicateLastStage(page);
      await waitSaved(page);
      const list = page.getByTestId('project-list');
      await expect.poll(() => list.locator('li[data-project-id]').count()).toBe(1);
      const copyName = (await list.locator('.picker__title').first().innerText()).trim();
      expect(copyName).toMatch(/\(my copy\)$/);
      expect(await list.locator('.stored__when').first().innerText()).toMatch(/^Saved /);

      // Rename the open project.
      await list.getByRole('button', { name: `Rename “${copyName}”` }).click();
      const field = list.getByLabel(`New name for “${copyName}”`);
      await field.fill('Pump station, north bank');
      await list.getByRole('button', { name: 'Save name' }).click();
      await expect.poll(() => page.locator('#project-heading').innerText()).toBe('Pump station, north bank');
      await expect.poll(async () => (await storedRecords(page)).map((r) => r.project.name)).toEqual(['Pump station, north bank']);

      // Duplicate: a second record, listed first (saved last).
      await list.getByRole('button', { name: 'Duplicate “Pump station, north bank”' }).click();
      await expect.poll(() => list.locator('.picker__title').allInnerTexts()).toEqual(['Pump station, north bank (copy)', 'Pump station, north bank']);

      // Delete the copy, then undo: it comes back; delete again and let the undo period pass.
      await list.getByRole('button', { name: 'Delete “Pump station, north bank (copy)”' }).click();
      const undo = page.getByTestId('undo-delete');
      await undo.waitFor();
      expect(await undo.innerText()).toContain('Deleted “Pump station, north bank (copy)”');
      await expect.poll(() => list.locator('li[data-project-id]').count()).toBe(1);
      expect(await storedRecords(page)).toHaveLength(2); // kept during the undo period
      await page.screenshot({ path: join(artifacts, 'storage-undo-desktop.png') });
      await undo.getByRole('button', { name: 'Undo' }).click();
      await expect.poll(() => list.locator('li[data-project-id]').count()).toBe(2);
      await list.getByRole('button', { name: 'Delete “Pump station, north bank (copy)”' }).click();
      await expect.poll(() => page.getByTestId('undo-delete').count(), { timeout: 15_000 }).toBe(0);
      await expect.poll(async () => (await storedRecords(page)).map((r) => r.project.name)).toEqual(['Pump station, north bank']);

      // Deleting the open project shows a demo; the record is gone after the undo period.
      await list.getByRole('button', { name: 'Delete “Pump station, north bank”' }).click();
      await expect.poll(() => page.locator('a[data-demo-id][aria-current="page"]').count()).toBe(1);
      await expect.poll(async () => (await storedRecords(page)).length, { timeout: 15_000 }).toBe(0);
      expect(errors).toEqual([]);
    } finally {
      await context.close();
    }
  });

  it('says "Not saved" when the browser refuses the write, keeps the work, and saves at the next edit', async () => {
    const { context, page, errors } = await fresh(VIEWPORTS.phone);
    try {
      await duplicateLastStage(page);
      await waitSaved(page);
      const cards = await cardCount(page);
      // Make every IndexedDB write fail as a full disk does.
      await page.evaluate(`(() => {
        const put = IDBObjectStore.prototype.put;
        window.__restorePut = () => { IDBObjectStore.prototype.put = put; };
        IDBObjectStore.prototype.put = function () { throw new DOMException('The quota has been exceeded.', 'QuotaExceededError'); };
      })()`);
      const storedBefore = await storedRecords(page);
      await duplicateLastStage(page);
      const alert = page.getByTestId('save-failed');
      await alert.waitFor();
      expect(await alert.innerText()).toMatch(/Not saved\..*NOT stored: the browser has no more storage space for this site \(quota exceeded\)/s);
      await page.screenshot({ path: join(artifacts, 'storage-not-saved-phone.png') });
      expect(await cardCount(page)).toBe(cards + 1); // the work stays on the page
      expect(await storedRecords(page)).toEqual(storedBefore);
      await page.evaluate('window.__restorePut()');
      await duplicateLastStage(page);
      await waitSaved(page);
      await expect.poll(() => page.getByTestId('save-failed').count()).toBe(0);
      await page.reload({ waitUntil: 'load' });
      await waitForResults(page);
      expect(await cardCount(page)).toBe(cards + 2);
      // The refused write is reported by the page, not as a script error.
      expect(errors).toEqual([]);
    } finally {
      await context.close();
    }
  });

  it('asks which version to keep when another tab saved the same project', async () => {
    const { context, page: a, errors } = await fresh();
    try {
      await duplicateLastStage(a);
      await waitSaved(a);
      const address = a.url();
      const { page: b, errors: errorsB } = await newRecordedPage(context);
      await b.goto(address, { waitUntil: 'load' });
      await waitForResults(b);
      const start = await cardCount(b);

      // A saves again: B is told at once and must choose.
      await duplicateLastStage(a);
      await waitSaved(a);
      const question = b.getByTestId('conflict');
      await question.waitFor({ timeout: 10_000 });
      expect(await question.innerText()).toContain('This project was changed in another tab');
      await b.screenshot({ path: join(artifacts, 'storage-conflict-desktop.png') });
      await question.getByRole('button', { name: 'Load that version' }).click();
      await expect.poll(() => cardCount(b)).toBe(start + 1);

      // Both edit; B keeps its own version (written over A's), and A is asked in turn.
      await duplicateLastStage(b);
      await waitSaved(b);
      await a.getByTestId('conflict').waitFor({ timeout: 10_000 });
      await duplicateLastStage(a); // an edit while the question is open is not written
      await a.waitForTimeout(800);
      expect((await storedRecords(a))[0]!.project.elements).toHaveLength(start + 2);
      await a.getByTestId('conflict').getByRole('button', { name: 'Save mine as a copy' }).click();
      await expect.poll(async () => (await storedRecords(a)).length).toBe(2);
      const names = (await storedRecords(a)).map((r) => r.project.name).sort();
      // The copy of "X (my copy)" is "X (copy)": marks never pile up (web/storage/record.ts copyName).
      expect(names[1]).toMatch(/ \(my copy\)$/);
      expect(names[0]).toBe(names[1]!.replace(/ \(my copy\)$/, ' (copy)'));
      await expect.poll(() => a.locator('#project-heading').innerText()).toMatch(/\(copy\)$/);
      // B was not asked about A's copy (another project).
      expect(await b.getByTestId('conflict').count()).toBe(0);
      expect([...errors, ...errorsB]).toEqual([]);
    } finally {
      await context.close();
    }
  });

  it('saves a 200-stage project (timed for the report)', async () => {
    const { context, page, errors } = await fresh();
    try {
      await importJson(page, 'two-hundred.json', bigProject());
      await expect.poll(() => page.locator('#project-heading').innerText()).toBe('Two hundred stages');
      await waitSaved(page);
      const times: number[] = [];
      for (let i = 0; i < 7; i++) {
        await duplicateLastStage(page);
        await waitSaved(page);
        times.push(Number(await page.getByTestId('save-line').getAttribute('data-write-ms')));
      }
      const bytes = JSON.stringify((await storedRecords(page))[0]).length;
      figures.push(`save of a 200-stage project to IndexedDB: median ${median(times).toFixed(1)} ms (${times.map((t) => t.toFixed(1)).join(', ')}; record ${(bytes / 1024).toFixed(0)} kB)`);
      expect(times.every((t) => Number.isFinite(t) && t > 0)).toBe(true);
      expect(errors).toEqual([]);
    } finally {
      await context.close();
    }
  });
});
