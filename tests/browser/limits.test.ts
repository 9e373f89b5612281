/**
 * What the app exports, it imports (issue 15, point 4), in real Chromium: a text or a number past a
 * limit of the project file (web/storage/limits.ts) typed into a form is refused at the field and
 * never stored; at 2000 elements adding stops with a message; the exported file of what was edited
 * is one the import accepts. The limits are this format's own rules: common practice (no source).
 * The chains are invented test data; the demo is the project's own.
 */
import { readFileSync } from 'node:fs';
import type { BrowserContext, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { skipWithout } from '../tools/system-tools.ts';
import { IMPORT_LIMITS, parseImportText } from '../../web/storage/file-format.ts';
import { VIEWPORTS, serveBuiltApp, type ServedApp, chainOp } from './harness.ts';
import { newRecordedPage, storedRecords, waitForResults, waitSaved } from './offline-helpers.ts';

/** One bank feeding `count − 1` small DC loads. */
function wide(count: number) {
  const elements: Record<string, unknown>[] = [{ id: 'bank', kind: 'battery', voltage: 48, internalResistance: 0.01 }];
  for (let i = 1; i < count; i++) elements.push({ id: `l${i}`, kind: 'dc-load', from: 'bank', power: 1 });
  return { format: 'joulepath-project', version: 2, name: 'Two thousand loads', elements };
}

describe.skipIf(skipWithout('chromium'))('the project file\'s limits while editing, in Chromium', () => {
  let app: ServedApp | undefined;
  let context: BrowserContext | undefined;
  let page: Page;
  let errors: string[] = [];

  beforeAll(async () => {
    app = await serveBuiltApp('joulepath-limits-');
    context = await app.browser.newContext({ viewport: VIEWPORTS.desktop, locale: 'en-US', acceptDownloads: true });
    ({ page, errors } = await newRecordedPage(context));
  });

  afterAll(async () => {
    await context?.close();
    await app?.close();
  });

  const form = () => page.locator('[data-testid="stage-form"]');
  const field = (path: string) => form().locator(`[data-testid="field-${path}"]`);
  const messageAt = (path: string) => form().locator(`[data-path="${path}"] [data-testid="field-message"]`);

  /** Export the open project and read the file back with the app's own import check. */
  async function exportAndCheck(): Promise<ReturnType<typeof parseImportText>> {
    const [download] = await Promise.all([page.waitForEvent('download'), page.getByTestId('export-project').click()]);
    return parseImportText(readFileSync((await download.path())!, 'utf8'));
  }

  it('a name or a number past the file\'s limits is refused at the field and not stored', async () => {
    await page.goto(`${app!.baseUrl}#demo=cold-store-dc-bus`, { waitUntil: 'load' });
    await waitForResults(page);
    await page.locator('[data-testid="stage-card"][data-card-id="fan-cable"]').click();
    await form().waitFor();
    // A first edit stores a copy of the demo, so there is something to export.
    await field('length').fill('36');
    await waitSaved(page);

    await field('name').fill('x'.repeat(IMPORT_LIMITS.maxStringLength + 1));
    await expect.poll(() => messageAt('name').innerText()).toMatch(/at most 20.000 characters in one text/);
    await field('length').fill('2000000000000000');
    await expect.poll(() => messageAt('length').innerText()).toMatch(/larger than any value in a power chain/);
    await waitSaved(page);
    const stored = (await storedRecords(page))[0]!;
    const cable = (stored.project.elements as { id: string; name?: string; length?: number }[]).find((e) => e.id === 'fan-cable')!;
    expect(cable.length).toBe(36);
    expect((cable.name ?? '').length).toBeLessThanOrEqual(IMPORT_LIMITS.maxStringLength);

    const back = await exportAndCheck();
    expect(back.ok).toBe(true);
    expect(errors).toEqual([]);
  });

  it('at 2000 elements adding stops with a message, and the file still imports', async () => {
    await page.getByTestId('open-file').setInputFiles({ name: 'two-thousand.json', mimeType: 'application/json', buffer: Buffer.from(JSON.stringify(wide(IMPORT_LIMITS.maxElements))) });
    await expect.poll(() => page.locator('#project-heading').innerText(), { timeout: 60_000 }).toBe('Two thousand loads');
    await waitForResults(page);
    await page.locator('[data-testid="stage-card"][data-card-id="bank"]').click();
    await chainOp(page, 'op-add-branch');
    await expect.poll(() => page.getByTestId('editor-status').textContent()).toMatch(/at most 2000 elements/);
    expect(await page.getByTestId('kind-chooser').count()).toBe(0);
    await page.locator('[data-testid="stage-card"][data-card-id="l5"]').click();
    await chainOp(page, 'op-duplicate');
    await expect.poll(() => page.getByTestId('editor-status').textContent()).toMatch(/Not added: a project holds at most 2000 elements/);
    expect(await page.locator('[data-card-id]').count()).toBe(IMPORT_LIMITS.maxElements);
    const back = await exportAndCheck();
    expect(back.ok).toBe(true);
    if (back.ok) expect(back.project.elements).toHaveLength(IMPORT_LIMITS.maxElements);
    expect(errors).toEqual([]);
  });
});
