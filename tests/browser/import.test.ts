/**
 * Project files in real Chromium: bad files of many kinds are each refused with a clear message and
 * leave IndexedDB exactly as it was; an export imports back as a new project, and importing the same
 * export again asks "keep both" (the default) or "replace".
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import type { BrowserContext, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { skipWithout } from '../tools/system-tools.ts';
import { VIEWPORTS, artifacts, serveBuiltApp, type ServedApp } from './harness.ts';
import { dumpStore, duplicateLastStage, newRecordedPage, storedRecords, waitForResults, waitSaved } from './offline-helpers.ts';

const project = { format: 'joulepath-project', version: 2, name: 'Import check', elements: [{ id: 'bank', kind: 'battery', voltage: 48 }, { id: 'lamp', kind: 'dc-load', from: 'bank', power: 40 }] };
const envelope = (p: unknown, extra: object = {}) => JSON.stringify({ format: 'joulepath-export', exportVersion: 1, project: p, ...extra });

/** [label, file bytes, expected message] — bad files of our own making. */
const BAD_FILES: [string, Buffer, RegExp][] = [
  ['not JSON', Buffer.from('bank 48 V, lamp 40 W'), /not a JSON project file/],
  ['an empty file', Buffer.alloc(0), /The file is empty/],
  ['wrong schema (another program\'s JSON)', Buffer.from(JSON.stringify({ nodes: [{ id: 1 }], edges: [] })), /not a Joulepath project: it has no "format" field/],
  ['a newer export version', Buffer.from(envelope(project).replace('"exportVersion":1', '"exportVersion":4')), /newer version of Joulepath \(export format version 4\)/],
  ['a newer project version', Buffer.from(envelope({ ...project, version: 9 })), /project schema version 9/],
  ['a number that overflows', Buffer.from(envelope(project).replace('"power":40', '"power":1e999')), /too large to be read/],
  ['a huge number', Buffer.from(envelope({ ...project, elements: [{ id: 'bank', kind: 'battery', voltage: 4.8e20 }] })), /larger than any value in a power chain/],
  ['a __proto__ key', Buffer.from(envelope(project).replace('"power":40', '"power":40,"__proto__":{"polluted":true}')), /key named "__proto__"/],
  ['a constructor.prototype key', Buffer.from(envelope({ ...project, constructor: { prototype: { polluted: true } } })), /key named "constructor"/],
  ['a 20 MB file', Buffer.alloc(20 * 1024 * 1024, 0x20), /20\.0 MB; project files are limited to 5\.0 MB/],
  ['a project with 0 elements', Buffer.from(envelope({ ...project, elements: [] })), /elements is empty/],
  ['duplicated ids', Buffer.from(envelope({ ...project, elements: [{ id: 'bank', kind: 'battery' }, { id: 'bank', kind: 'dc-load', from: 'bank' }] })), /Two elements share the id "bank"/],
  ['UTF-16 text with a byte-order mark', Buffer.concat([Buffer.from([0xff, 0xfe]), Buffer.from(envelope(project), 'utf16le')]), /UTF-16/],
  ['deep nesting', Buffer.from(`{"format":"joulepath-project","x":${'['.repeat(3000)}${']'.repeat(3000)}}`), /levels deep/],
  ['a key longer than 200 characters', Buffer.from(envelope({ ...project, elements: [{ id: 'bank', kind: 'battery', voltage: 48, ['k'.repeat(201)]: 1 }] })), /keys are at most 200 characters/],
  ['too many elements', Buffer.from(envelope({ ...project, elements: Array.from({ length: 2001 }, (_, i) => ({ id: `e${i}`, kind: 'dc-load', from: 'bank' })) })), /more than 2000 elements/],
];

describe.skipIf(skipWithout('chromium'))('importing project files in Chromium', () => {
  let app: ServedApp | undefined;
  let context: BrowserContext | undefined;
  let page: Page;
  let errors: string[] = [];

  beforeAll(async () => {
    app = await serveBuiltApp('joulepath-import-');
    context = await app.browser.newContext({ viewport: VIEWPORTS.desktop, locale: 'en-US', acceptDownloads: true });
    ({ page, errors } = await newRecordedPage(context));
    await page.goto(app.baseUrl, { waitUntil: 'load' });
    await waitForResults(page);
    // Something stored first, so "nothing changes" is checked against real data.
    await duplicateLastStage(page);
    await waitSaved(page);
  });

  afterAll(async () => {
    await context?.close();
    await app?.close();
  });

  it.each(BAD_FILES)('refuses %s with a message, changing nothing stored', async (label, bytes, message) => {
    const before = await dumpStore(page);
    expect(before).not.toBe('[]');
    await page.getByTestId('open-file').setInputFiles({ name: `bad-${label.replace(/\W+/g, '-')}.json`, mimeType: 'application/json', buffer: bytes });
    const shown = page.getByTestId('unreadable');
    await expect.poll(async () => ((await shown.count()) ? shown.innerText() : ''), { timeout: 20_000 }).toMatch(message);
    expect(await dumpStore(page)).toBe(before);
    expect(await page.evaluate('({}).polluted === undefined && Object.prototype.polluted === undefined')).toBe(true);
    if (label === 'a 20 MB file') await page.screenshot({ path: join(artifacts, 'import-refused-desktop.png') });
  });

  it('exports the open project and imports it back: keep both by default, or replace', async () => {
    await page.getByTestId('project-list').locator('a.picker__item').first().click();
    await waitForResults(page);
    const [download] = await Promise.all([page.waitForEvent('download'), page.getByTestId('export-project').click()]);
    expect(download.suggestedFilename()).toMatch(/^[a-z0-9-]+\.joulepath\.json$/);
    const file = readFileSync((await download.path())!, 'utf8');
    const parsed = JSON.parse(file) as { format: string; exportVersion: number; projectId: string; project: { name: string } };
    expect(parsed).toMatchObject({ format: 'joulepath-export', exportVersion: 1 });
    const before = await storedRecords(page);
    expect(before.map((r) => r.id)).toContain(parsed.projectId);

    const importIt = () => page.getByTestId('open-file').setInputFiles({ name: download.suggestedFilename(), mimeType: 'application/json', buffer: Buffer.from(file) });
    await importIt();
    const question = page.getByTestId('import-question');
    await question.waitFor();
    expect(await question.innerText()).toContain('already stored here');
    // Keep both is the default (focused) answer.
    await expect.poll(() => page.evaluate('document.activeElement?.textContent')).toBe('Keep both');
    await page.keyboard.press('Enter');
    await expect.poll(async () => (await storedRecords(page)).length).toBe(before.length + 1);

    await importIt();
    await question.waitFor();
    await question.getByRole('button', { name: 'Replace the stored one' }).click();
    await expect.poll(async () => (await storedRecords(page)).find((r) => r.id === parsed.projectId)?.revision).toBeGreaterThan(before.find((r) => r.id === parsed.projectId)!.revision);
    expect((await storedRecords(page)).length).toBe(before.length + 1);

    await importIt();
    await question.waitFor();
    const snapshot = await dumpStore(page);
    await question.getByRole('button', { name: 'Cancel' }).click();
    await expect.poll(() => question.count()).toBe(0);
    expect(await dumpStore(page)).toBe(snapshot);
    expect(errors).toEqual([]);
  });

  it('imports a bare project whose fields the engine rejects, so it can be fixed', async () => {
    const count = (await storedRecords(page)).length;
    const broken = { ...project, name: 'Needs fixing', elements: [{ id: 'bank', kind: 'battery', voltage: 48 }, { id: 'lamp', kind: 'dc-load', from: 'bank', power: -40 }] };
    await page.getByTestId('open-file').setInputFiles({ name: 'needs-fixing.json', mimeType: 'application/json', buffer: Buffer.from(JSON.stringify(broken)) });
    await page.getByTestId('problems').waitFor();
    expect(await page.getByTestId('problems').innerText()).toContain('lamp');
    await expect.poll(async () => (await storedRecords(page)).length).toBe(count + 1);
    expect(errors).toEqual([]);
  });
});
