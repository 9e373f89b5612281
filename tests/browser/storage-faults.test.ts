/**
 * Stored projects under faults in real Chromium (issue 15): the page closed inside the autosave
 * window, and (below) two tabs, project switches, a refused write and a page close in one scripted run.
 * Behaviour of our own storage (web/storage/README.md): common practice (no source).
 */
import type { BrowserContext, Dialog, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { skipWithout } from '../tools/system-tools.ts';
import { VIEWPORTS, serveBuiltApp, type ServedApp } from './harness.ts';
import { cardCount, dumpStore, duplicateLastStage, newRecordedPage, pollPage, storedRecords, waitForResults, waitSaved } from './offline-helpers.ts';

/**
 * Makes this page's IndexedDB writes fail the way a full disk does while `window.__refuseWrites` is
 * set (an init script: it runs before the app's own scripts, outside the page's content policy).
 */
const REFUSE_WRITES = `(() => {
  const put = IDBObjectStore.prototype.put;
  IDBObjectStore.prototype.put = function (...args) {
    if (window.__refuseWrites) throw new DOMException('The quota has been exceeded.', 'QuotaExceededError');
    return put.apply(this, args);
  };
})()`;

type Stored = Awaited<ReturnType<typeof storedRecords>>[number] & { tabId?: string; savedAt?: string };

/** The stored records by project name (names are unique in these tests). */
async function byName(page: Page): Promise<Map<string, Stored>> {
  // Project records only (rescue copies, "rescue:…" keys, carry no storageVersion).
  const records = (await storedRecords(page)).filter((r) => (r as { storageVersion?: number }).storageVersion !== undefined);
  return new Map(records.map((r) => [r.project.name, r as Stored]));
}

/** The element ids the open project shows, in order (one card per element). */
async function cardIds(page: Page): Promise<string[]> {
  await page.locator('[data-card-id]').first().waitFor({ timeout: 30_000 });
  return page.locator('[data-card-id]').evaluateAll((cards) => cards.map((c) => c.getAttribute('data-card-id') ?? ''));
}

function elementIds(record: Stored | undefined): string[] {
  return (record?.project.elements ?? []).map((e) => (e as { id: string }).id);
}

async function heading(page: Page): Promise<string> {
  return (await page.locator('#project-heading').innerText()).trim();
}

/** Open a stored project from the project list by its name. */
async function openFromList(page: Page, name: string): Promise<void> {
  await page.getByTestId('project-list').locator('.picker__item', { hasText: name }).first().click();
  await expect.poll(() => heading(page)).toBe(name);
  await waitForResults(page);
}

/** Open a demo from the demo picker (index in the list) and make its first edit: a stored copy. */
async function copyOfDemo(page: Page, index: number): Promise<string> {
  await page.locator('a[data-demo-id]').nth(index).click();
  await waitForResults(page);
  await duplicateLastStage(page);
  await waitSaved(page);
  await expect.poll(() => heading(page)).toMatch(/\(my copy\)$/);
  return heading(page);
}

/** Whether closing the page asks first (beforeunload); the page stays open either way. */
async function closeAsks(page: Page): Promise<boolean> {
  let asked = false;
  const onDialog = (dialog: Dialog) => {
    if (dialog.type() === 'beforeunload') asked = true;
    void dialog.dismiss(); // stay on the page
  };
  page.on('dialog', onDialog);
  try {
    await page.close({ runBeforeUnload: true });
    // Closing goes on without a question; with one, the page stays (dismissed).
    await pollPage(page, 'true', 'the page to answer').catch(() => undefined);
    await new Promise((r) => setTimeout(r, 300));
    return asked;
  } finally {
    page.off('dialog', onDialog);
  }
}

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

  /** A fresh browser profile (its tabs share IndexedDB and BroadcastChannel), closed after `body`. */
  async function inContext(body: (context: BrowserContext) => Promise<void>): Promise<void> {
    const context = await app!.browser.newContext({ viewport: VIEWPORTS.desktop, locale: 'en-US' });
    try {
      await body(context);
    } finally {
      await context.close();
    }
  }

  /** Tab A with stored copies X and Y of the first two demos and X open; tab B opened on X's address. */
  async function twoTabsOnX(context: BrowserContext) {
    const { page: a, errors } = await open(context);
    const x = await copyOfDemo(a, 0);
    const y = await copyOfDemo(a, 1);
    await openFromList(a, x);
    const { page: b, errors: errorsB } = await open(context, a.url());
    return { a, b, x, y, errors, errorsB };
  }

  it('asks before the page is left while a save waits, failed or waits for an answer, and not when all is saved', async () => {
    await inContext(async (context) => {
      const { page } = await newRecordedPage(context);
      await page.addInitScript(REFUSE_WRITES);
      await page.goto(app!.baseUrl, { waitUntil: 'load' });
      await waitForResults(page);
      await duplicateLastStage(page);
      await waitSaved(page);
      // Waiting inside the autosave window.
      await duplicateLastStage(page);
      expect(await closeAsks(page)).toBe(true);
      expect(page.isClosed()).toBe(false);
      await waitSaved(page);
      // Refused (quota).
      await page.evaluate('window.__refuseWrites = true');
      await duplicateLastStage(page);
      await page.getByTestId('save-failed').waitFor();
      expect(await closeAsks(page)).toBe(true);
      await page.evaluate('window.__refuseWrites = false');
      await duplicateLastStage(page);
      await waitSaved(page);
      await expect.poll(() => page.getByTestId('save-failed').count()).toBe(0);
      // Another tab saves: the question waits for an answer.
      const { page: other } = await open(context, page.url());
      await duplicateLastStage(other);
      await waitSaved(other);
      await page.getByTestId('conflict').waitFor({ timeout: 10_000 });
      expect(await closeAsks(page)).toBe(true);
      await page.getByTestId('conflict').getByRole('button', { name: 'Load that version' }).click();
      await expect.poll(() => page.getByTestId('conflict').count()).toBe(0);
      // The other tab's version is read and opened after the question goes: wait for it.
      await page.getByText('Loaded the version saved in the other tab.').waitFor();
      await waitSaved(page);
      // All saved: closing does not ask.
      expect(await closeAsks(page)).toBe(false);
      expect(page.isClosed()).toBe(true);
    });
  });

  it('keeps an edit made just before the page is closed (inside the autosave wait)', async () => {
    await inContext(async (context) => {
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
      // The edit reached its record (by the page-hide flush or the rescue copy, which the next start
      // applies and then removes, a moment after the page shows): one record, holding the edit.
      await expect.poll(async () => (await storedRecords(again)).map((r) => r.project.elements.length), { timeout: 10_000 }).toEqual([cards + 1]);
      expect(errorsAgain).toEqual([]);
    });
  });

  it('answers a conflict with its own project\'s version after another project was opened and edited (two tabs)', async () => {
    await inContext(async (context) => {
      const { a, b, x, y, errors, errorsB } = await twoTabsOnX(context);
      const xCardsA = await cardCount(a);
      expect(await heading(b)).toBe(x);
      // B saves X; A edits X and is asked.
      await duplicateLastStage(b);
      await waitSaved(b);
      const question = a.getByTestId('conflict');
      await question.waitFor({ timeout: 10_000 });
      await duplicateLastStage(a); // A's own version of X: one stage more than it had
      const xIdsA = await cardIds(a);
      // A opens Y without answering and edits it.
      await openFromList(a, y);
      const yCards = await cardCount(a);
      await duplicateLastStage(a);
      await waitSaved(a);
      // The question is still there, naming X.
      await expect.poll(() => question.innerText()).toContain(`“${x}” (not the open project`);
      await question.getByRole('button', { name: 'Keep mine (save over it)' }).click();
      await expect.poll(() => a.getByTestId('conflict').count()).toBe(0);
      const stored = await byName(a);
      expect([...stored.keys()].sort()).toEqual([x, y].sort());
      expect(stored.get(x)!.project.elements).toHaveLength(xCardsA + 1); // A's X, not Y's content
      expect(elementIds(stored.get(x))).toEqual(xIdsA);
      expect(elementIds(stored.get(y))).toEqual(await cardIds(a));
      expect(stored.get(y)!.project.elements).toHaveLength(yCards + 1);
      expect(await heading(a)).toBe(y); // Y stays open
      expect([...errors, ...errorsB]).toEqual([]);
    });
  });

  it('refuses to save, rename or delete over a record of a newer layout, which stays byte-identical', async () => {
    await inContext(async (context) => {
      const { page, errors } = await open(context);
      await copyOfDemo(page, 0);
      const [record] = await storedRecords(page);
      // A newer version of the app (another tab, after an update) rewrites the open project's record.
      await page.evaluate(`new Promise((resolve, reject) => {
        const o = indexedDB.open('joulepath');
        o.onsuccess = () => {
          const tx = o.result.transaction('projects', 'readwrite');
          tx.objectStore('projects').put({ ...${JSON.stringify(record)}, storageVersion: 3, revision: 40, wiring: { sheets: 3 } }, 'project:${record!.id}');
          tx.oncomplete = () => { o.result.close(); resolve(true); };
          tx.onerror = () => reject(tx.error);
        };
      })`);
      const rawOf = async (id: string) => JSON.stringify((JSON.parse(await dumpStore(page)) as [string, unknown][]).find(([k]) => k === `project:${id}`));
      const before = await dumpStore(page);
      const newerBefore = await rawOf(record!.id);
      await duplicateLastStage(page);
      const edited = await cardIds(page);
      const alert = page.getByTestId('save-failed');
      await alert.waitFor();
      expect(await alert.innerText()).toMatch(/newer version of Joulepath \(storage layout 3\).*update the app/s);
      await page.waitForTimeout(500);
      expect(await dumpStore(page)).toBe(before);
      // The list shows it as unreadable, with the same advice; nothing is offered that would write.
      await page.reload({ waitUntil: 'load' });
      await waitForResults(page);
      const listed = page.getByTestId('project-list').locator(`li[data-project-id="${record!.id}"]`);
      await expect.poll(() => listed.innerText()).toMatch(/newer version of Joulepath.*update the app/);
      expect(await listed.getByRole('button').count()).toBe(0);
      expect(await rawOf(record!.id)).toBe(newerBefore);
      // The edit the newer record refused was not lost: the page's rescue copy is kept as a copy beside it.
      // The rescue copy is written after the reload, as the page starts: polled, not read once.
      const copyName = `${record!.project.name.replace(/ \(my copy\)$/, '')} (copy)`;
      await expect.poll(async () => elementIds((await byName(page)).get(copyName))).toEqual(edited);
      expect(errors).toEqual([]);
    });
  });

  it('a demo copy whose first saves are refused keeps one " (my copy)"; a copy of a copy is "(copy 2)"', async () => {
    await inContext(async (context) => {
      const { page, errors } = await newRecordedPage(context);
      await page.addInitScript(REFUSE_WRITES);
      await page.goto(app!.baseUrl, { waitUntil: 'load' });
      await waitForResults(page);
      const demo = await heading(page);
      await page.evaluate('window.__refuseWrites = true');
      for (let i = 0; i < 3; i++) {
        await duplicateLastStage(page);
        await page.getByTestId('save-failed').waitFor();
        await page.waitForTimeout(400);
        expect(await heading(page)).toBe(demo);
      }
      expect(await storedRecords(page)).toEqual([]);
      await page.evaluate('window.__refuseWrites = false');
      await duplicateLastStage(page);
      await waitSaved(page);
      expect(await heading(page)).toBe(`${demo} (my copy)`);
      const list = page.getByTestId('project-list');
      await list.getByRole('button', { name: `Duplicate “${demo} (my copy)”` }).click();
      await expect.poll(async () => (await storedRecords(page)).length).toBe(2);
      await list.getByRole('button', { name: `Duplicate “${demo} (copy)”` }).click();
      await expect.poll(async () => (await storedRecords(page)).map((r) => r.project.name).sort()).toEqual(
        [`${demo} (copy 2)`, `${demo} (copy)`, `${demo} (my copy)`].sort(),
      );
      expect(errors).toEqual([]);
    });
  });

  it('a delete in one tab and a save in the other: the save is refused and asked, the deleting tab is told (both orders)', async () => {
    await inContext(async (context) => {
      const { a, b, x, y, errors, errorsB } = await twoTabsOnX(context);
      await openFromList(a, y);
      const cardsB = await cardCount(b);

      // Order 1: A deletes X (undo pending); B has X open: asked at once, and its next edit is not written.
      await a.getByTestId('project-list').getByRole('button', { name: `Delete “${x}”` }).click();
      await a.getByTestId('undo-delete').waitFor();
      const question = b.getByTestId('conflict');
      await question.waitFor({ timeout: 10_000 });
      expect(await question.innerText()).toContain('This project was deleted in another tab');
      await duplicateLastStage(b);
      await b.waitForTimeout(600);
      expect((await byName(b)).get(x)!.deletedAt).toBeTruthy(); // not silently brought back
      await question.getByRole('button', { name: 'Restore it with my version' }).click();
      await expect.poll(() => b.getByTestId('conflict').count()).toBe(0);
      // A is told, its undo offer is gone, and X is back with B's version.
      await expect.poll(() => a.getByTestId('storage-notice').innerText()).toContain(`“${x}” was not deleted: another tab kept its version of it.`);
      expect(await a.getByTestId('undo-delete').count()).toBe(0);
      await a.waitForTimeout(8_500); // past A's undo period: nothing removes X
      const afterRestore = await byName(a);
      expect(afterRestore.get(x)!.deletedAt).toBeUndefined();
      expect(afterRestore.get(x)!.project.elements).toHaveLength(cardsB + 1);

      // Order 2: B saves X first, then A deletes it: B is asked; "save mine as a copy" keeps B's
      // work, the delete stands and is removed after A's undo period.
      await duplicateLastStage(b);
      await waitSaved(b);
      await a.getByTestId('project-list').getByRole('button', { name: `Delete “${x}”` }).click();
      await question.waitFor({ timeout: 10_000 });
      await question.getByRole('button', { name: 'Save mine as a copy' }).click();
      await expect.poll(() => b.getByTestId('conflict').count()).toBe(0);
      await expect.poll(() => heading(b)).toBe(x.replace(/ \(my copy\)$/, ' (copy)'));
      await expect.poll(async () => [...(await byName(a)).keys()].sort(), { timeout: 15_000 }).toEqual([y, x.replace(/ \(my copy\)$/, ' (copy)')].sort());
      expect((await byName(a)).get(x.replace(/ \(my copy\)$/, ' (copy)'))!.project.elements).toHaveLength(cardsB + 2);
      expect([...errors, ...errorsB]).toEqual([]);
    });
  });

  it('one scripted run: two tabs, project switches, a quota refusal and a page close lose and alter nothing', async () => {
    await inContext(async (context) => {
      const { page: a, errors } = await newRecordedPage(context);
      await a.addInitScript(REFUSE_WRITES);
      await a.goto(app!.baseUrl, { waitUntil: 'load' });
      await waitForResults(a);
      const x = await copyOfDemo(a, 0);
      const y = await copyOfDemo(a, 1);
      const z = await copyOfDemo(a, 2); // a bystander: never opened again, must stay byte-identical
      const zId = (await byName(a)).get(z)!.id;
      const rawOf = async (page: Page, id: string) => (JSON.parse(await dumpStore(page)) as [string, unknown][]).find(([k]) => k === `project:${id}`)?.[1];
      const zBefore = JSON.stringify(await rawOf(a, zId));
      const countBefore = (await storedRecords(a)).length;
      expect(countBefore).toBe(3);

      // Tab B works on X.
      await openFromList(a, x);
      const { page: b, errors: errorsB } = await open(context, a.url());
      // A, on Y, cannot write (quota): two edits, then a switch to X and an edit there.
      await openFromList(a, y);
      await a.evaluate('window.__refuseWrites = true');
      await duplicateLastStage(a);
      await a.getByTestId('save-failed').waitFor();
      await duplicateLastStage(a);
      const yIdsUnsaved = await cardIds(a);
      await openFromList(a, x);
      await duplicateLastStage(a);
      const xIdsA = await cardIds(a);
      // B saves X meanwhile: A is asked about X.
      await duplicateLastStage(b);
      await waitSaved(b);
      const xIdsB = await cardIds(b);
      await a.getByTestId('conflict').waitFor({ timeout: 10_000 });
      // A goes back to Y: it opens with the changes that were refused, not the older stored version.
      await openFromList(a, y);
      expect(await cardIds(a)).toEqual(yIdsUnsaved);
      // Writes work again; the next edit stores Y with all its changes.
      await a.evaluate('window.__refuseWrites = false');
      await duplicateLastStage(a);
      await waitSaved(a);
      await expect.poll(() => a.getByTestId('save-failed').count()).toBe(0);
      // The parked question about X: A keeps its version as a copy; B's X stays.
      const question = a.getByTestId('conflict');
      await expect.poll(() => question.innerText()).toContain(`“${x}” (not the open project`);
      await question.getByRole('button', { name: 'Save mine as a copy' }).click();
      await expect.poll(() => a.getByTestId('conflict').count()).toBe(0);
      // One more edit of Y, and A's page is closed inside the autosave wait.
      await duplicateLastStage(a);
      const yIdsFinal = await cardIds(a);
      await a.close({ runBeforeUnload: false });

      const { page: c, errors: errorsC } = await open(context);
      const stored = await byName(c);
      const xCopy = x.replace(/ \(my copy\)$/, ' (copy)');
      expect([...stored.keys()].sort()).toEqual([x, xCopy, y, z].sort());
      expect(stored.size).toBe(countBefore + 1); // the copy, and nothing else, was added
      expect(elementIds(stored.get(x))).toEqual(xIdsB); // B's version of X
      expect(elementIds(stored.get(xCopy))).toEqual(xIdsA); // A's version of X
      expect(elementIds(stored.get(y))).toEqual(yIdsFinal); // every change to Y, refused ones included
      expect(JSON.stringify(await rawOf(c, zId))).toBe(zBefore);
      expect([...stored.values()].every((r) => !r.deletedAt)).toBe(true);
      expect([...errors, ...errorsB, ...errorsC]).toEqual([]);
    });
  });
});
