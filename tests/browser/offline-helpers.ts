/**
 * Helpers shared by the offline, storage and import browser tests: a page that records errors and
 * every request, the IndexedDB contents as JSON (read without creating the database), and an edit
 * made through the chain editor.
 */
import type { BrowserContext, Page, Request } from 'playwright-core';
import { watchPageErrors, chainOp } from './harness.ts';

export interface RecordedPage {
  page: Page;
  errors: string[];
  requests: Request[];
}

/** Record console errors, page errors, failed requests, HTTP errors and every request of a page. */
export function record(page: Page): RecordedPage {
  const errors = watchPageErrors(page);
  const requests: Request[] = [];
  page.on('request', (req) => requests.push(req));
  page.on('response', (res) => {
    if (res.status() >= 400) errors.push(`HTTP ${res.status()}: ${res.url()}`);
  });
  return { page, errors, requests };
}

export async function newRecordedPage(context: BrowserContext): Promise<RecordedPage> {
  return record(await context.newPage());
}

/** Every key and value in the app's object store, as JSON ("[]" when the database does not exist yet). */
export async function dumpStore(page: Page): Promise<string> {
  return page.evaluate(`(async () => {
    const dbs = await indexedDB.databases();
    if (!dbs.some((d) => d.name === 'joulepath')) return '[]';
    return await new Promise((resolve, reject) => {
      const open = indexedDB.open('joulepath');
      open.onerror = () => reject(open.error);
      open.onsuccess = () => {
        const db = open.result;
        if (!db.objectStoreNames.contains('projects')) { db.close(); resolve('[]'); return; }
        const tx = db.transaction('projects', 'readonly');
        const keys = tx.objectStore('projects').getAllKeys();
        const values = tx.objectStore('projects').getAll();
        tx.oncomplete = () => { db.close(); resolve(JSON.stringify(keys.result.map((k, i) => [k, values.result[i]]))); };
        tx.onerror = () => reject(tx.error);
      };
    });
  })()`);
}

/** The stored records (parsed), for checks on names and revisions. */
export async function storedRecords(page: Page): Promise<{ id: string; revision: number; project: { name: string; elements: unknown[] }; deletedAt?: string }[]> {
  const entries = JSON.parse(await dumpStore(page)) as [string, { id: string; revision: number; project: { name: string; elements: unknown[] }; deletedAt?: string }][];
  return entries.map(([, v]) => v);
}

/**
 * Poll an expression in the page until it is true. page.evaluate runs it through the debugging
 * protocol, which the page's content security policy (no eval) does not block, whereas
 * page.waitForFunction with a string would be refused. Works in hooks too (no expect.poll).
 */
export async function pollPage(page: Page, expression: string, what: string, timeoutMs = 10_000): Promise<void> {
  const end = Date.now() + timeoutMs;
  while (Date.now() < end) {
    if ((await page.evaluate(expression)) === true) return;
    await new Promise((r) => setTimeout(r, 50));
  }
  throw new Error(`timed out after ${timeoutMs} ms waiting for ${what}`);
}

/** Wait until the open project's results are shown. */
export async function waitForResults(page: Page): Promise<void> {
  await page.getByTestId('element-table').waitFor({ timeout: 30_000 });
}

/** How many elements the open project has (one card per element in the chain editor). */
export async function cardCount(page: Page): Promise<number> {
  await page.locator('[data-card-id]').first().waitFor({ timeout: 30_000 });
  return page.locator('[data-card-id]').count();
}

/** An edit through the chain editor: select the last stage card and duplicate it. */
export async function duplicateLastStage(page: Page): Promise<void> {
  const before = await cardCount(page);
  await page.locator('[data-card-id]').last().click();
  await chainOp(page, 'op-duplicate');
  await pollPage(page, `document.querySelectorAll('[data-card-id]').length > ${before}`, 'the duplicated stage to appear');
}

/** Wait until the last edit is written (the save line says "saved"). */
export async function waitSaved(page: Page): Promise<void> {
  // A page-side wait (not expect.poll), so it also works in beforeAll hooks.
  await pollPage(page, `document.querySelector('[data-testid="save-line"]')?.dataset.state === 'saved'`, 'the save line to say saved');
}

/** Wait until the service worker controls the page's scope and is active. */
export async function waitForServiceWorker(page: Page): Promise<void> {
  await page.evaluate(`navigator.serviceWorker.ready.then((r) => !!r.active)`);
}

export function median(values: number[]): number {
  const s = [...values].sort((a, b) => a - b);
  const m = Math.floor(s.length / 2);
  return s.length % 2 ? s[m]! : (s[m - 1]! + s[m]!) / 2;
}
