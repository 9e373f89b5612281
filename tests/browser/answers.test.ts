/**
 * The answers strip in real Chromium (playwright-core) against a production build: on every demo at
 * 390×844 the strip is on the first screen; its figures are the engine's (checked against core run
 * here); tapping the runtime opens the battery panel with the runtime in view; a cable answer opens
 * the conductor panel at that cable; an edit updates the strip; axe finds nothing serious; the cards
 * show their key figure. Screenshots (phone and desktop, light and dark) go to tests/.artifacts/.
 */
import { join } from 'node:path';
import type { Browser, BrowserContext, Locator, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { skipWithout } from '../tools/system-tools.ts';
import { VIEWPORTS, answersSettled, artifacts, serveBuiltApp, seriousAxeViolations, watchPageErrors, type ServedApp } from './harness.ts';
import { demoProjects } from '../../core/index.ts';
import { answerStudies } from '../../core/studies/answers.ts';
import { solveAnswers } from '../../core/solve/answers.ts';
import { formatCurrent, formatDuration, formatPower } from '../../web/format/number.ts';
import { solvedOf } from '../core/solved.ts';

const plain = (s: string | null | undefined) => (s ?? '').replace(/[\s\u202f\u00a0]+/g, ' ').trim();

const demo = (id: string) => {
  const d = demoProjects.find((x) => x.id === id);
  if (!d) throw new Error(`no demo ${id}`);
  return d.project as unknown as Record<string, unknown>;
};

/** Whether the box of `loc` lies within the viewport (top and bottom). */
async function inView(page: Page, loc: Locator): Promise<boolean> {
  const box = await loc.boundingBox();
  const vp = page.viewportSize()!;
  return !!box && box.y >= 0 && box.y + Math.min(box.height, 40) <= vp.height;
}

describe.skipIf(skipWithout('chromium'))('the answers strip in Chromium', () => {
  let app: ServedApp | undefined;
  let browser: Browser | undefined;
  let baseUrl = '';

  beforeAll(async () => {
    app = await serveBuiltApp('joulepath-answers-');
    ({ browser, baseUrl } = app);
  });

  afterAll(async () => {
    await app?.close();
  });

  async function openDemo(id: string, viewport: { width: number; height: number }, colorScheme: 'light' | 'dark' = 'light'): Promise<{ context: BrowserContext; page: Page; errors: string[] }> {
    const context = await browser!.newContext({ viewport, deviceScaleFactor: 1, locale: 'en-US', colorScheme });
    const page = await context.newPage();
    const errors = watchPageErrors(page);
    await page.goto(`${baseUrl}#demo=${id}`, { waitUntil: 'load' });
    await page.getByTestId('answers').waitFor();
    // The strip's lines load lazily: until they mount, "no figure says working…" would hold vacuously.
    await page.getByTestId('answer-loss-split').waitFor();
    return { context, page, errors };
  }

  it.each(demoProjects.map((d) => d.id))('shows the answers of %s on the first phone screen, as core gives them; axe clean; screenshots', async (id) => {
    const solved = solvedOf(demo(id));
    const quick = solveAnswers(solved);
    const studies = answerStudies(solved, null);
    for (const scheme of ['light', 'dark'] as const) {
      for (const [label, viewport] of Object.entries(VIEWPORTS)) {
        const { context, page, errors } = await openDemo(id, viewport, scheme);
        try {
          const strip = page.getByTestId('answers');
          // The study answers arrive from the worker: none stays "working…".
          await answersSettled(page);
          expect(plain(await strip.innerText())).not.toContain('working…');
          await strip.screenshot({ path: join(artifacts, `answers-${id}-${label}-${scheme}.png`) });
          if (label === 'phone') await page.screenshot({ path: join(artifacts, `answers-${id}-phone-${scheme}-first-screen.png`) });
          const text = plain(await strip.innerText());
          expect(text).toContain(plain(formatPower(quick.source.power, 'en-US')));
          for (const b of studies.banks) {
            expect(plain(await page.getByTestId('answer-runtime').innerText())).toContain(plain(formatDuration(b.runtimeSeconds, 'en-US')));
            expect(plain(await page.getByTestId('answer-bank-current').innerText())).toContain(plain(formatCurrent(b.cableCurrent.amps, 'en-US')));
          }
          for (const c of quick.cables) expect(plain(await page.getByTestId(`answer-cable-${c.elementId}`).innerText())).toContain(c.size);
          for (const s of studies.starts) expect(plain(await page.getByTestId(`answer-start-${s.elementId}`).innerText())).toContain(s.verdict === 'starts' ? 'starts' : 'start');
          if (label === 'phone') {
            // The strip sits right under the project's name and, with the name, fits one phone screen.
            // (Where the project itself starts on a phone is the page layout's part: logged here.)
            await page.evaluate('window.scrollTo(0, 0)');
            const box = (await strip.boundingBox())!;
            const heading = (await page.locator('#project-heading').boundingBox())!;
            console.log(`${id} ${scheme} phone: project name at ${heading.y.toFixed(0)} px of the page, strip ${box.y.toFixed(0)}–${(box.y + box.height).toFixed(0)} px (${box.height.toFixed(0)} px high)`);
            // The strip itself takes at most 70 % of the screen, leaving room for the name above it (a
            // guard against bloat: the harbour clinic, with a bank, a sized supply cable and a price,
            // takes 66 %), and scrolled to the project's name the whole strip is on that screen.
            expect(box.height).toBeLessThan(0.7 * viewport.height);
            expect(box.y + box.height - heading.y).toBeLessThan(viewport.height);
          }
          expect(await seriousAxeViolations(page, `'[data-testid="answers"]'`)).toEqual([]);
          expect(errors).toEqual([]);
        } finally {
          await context.close();
        }
      }
    }
  });

  it('opens the battery panel at the runtime, and the bank card shows its runtime and current', async () => {
    const { context, page, errors } = await openDemo('hillside-relay-hut', VIEWPORTS.phone);
    try {
      const fig = page.getByTestId('answer-runtime');
      await expect.poll(async () => plain(await fig.innerText())).not.toContain('working');
      const shown = plain(await fig.innerText());
      await fig.click();
      const runtime = page.getByTestId('battery-runtime');
      await runtime.waitFor();
      await expect.poll(() => inView(page, runtime)).toBe(true);
      expect(plain(await runtime.innerText())).toBe(shown);
      // The bank's card carries its runtime and cable current (from the same study answers).
      const card = page.locator('[data-testid="stage-card"][data-card-id="bank"] [data-testid="stage-card-figure"]');
      await expect.poll(async () => plain(await card.textContent())).toContain(shown);
      await page.locator('[data-testid="stage-card"][data-card-id="bank"]').scrollIntoViewIfNeeded();
      await page.locator('#chain-cards').screenshot({ path: join(artifacts, 'answers-cards-hillside-phone.png') });
      // The bank current answer opens the peak current the study gives (the bank's cable has no sizing).
      await page.getByTestId('answer-bank-current').click();
      await expect.poll(() => inView(page, page.getByTestId('battery-peak-current'))).toBe(true);
      expect(errors).toEqual([]);
    } finally {
      await context.close();
    }
  });

  it('opens the conductor panel at the cable a cable answer names', async () => {
    const { context, page, errors } = await openDemo('cold-store-dc-bus', VIEWPORTS.phone);
    try {
      const fig = page.getByTestId('answer-cable-ctl-cable');
      expect(plain(await fig.innerText())).toMatch(/10 mm² · 6 A device · 1\.9 % drop/);
      await fig.click();
      const card = page.locator('[data-testid="conductor-card"][data-element-id="ctl-cable"]');
      await card.waitFor();
      await expect.poll(() => inView(page, card)).toBe(true);
      await expect.poll(() => page.evaluate('document.activeElement?.getAttribute("data-element-id")')).toBe('ctl-cable');
      // The cable's card shows its size and device.
      const cardResult = page.locator('[data-testid="stage-card"][data-card-id="ctl-cable"] [data-testid="stage-card-result"]');
      expect(plain(await cardResult.textContent())).toMatch(/10 mm² · 6 A device/);
      expect(errors).toEqual([]);
    } finally {
      await context.close();
    }
  });

  it('follows an edit: a larger load lowers the runtime and raises the loads', async () => {
    const { context, page, errors } = await openDemo('hillside-relay-hut', VIEWPORTS.desktop);
    try {
      const project = demo('hillside-relay-hut');
      const edited = { ...project, elements: (project['elements'] as Record<string, unknown>[]).map((e) => (e['id'] === 'radios' ? { ...e, power: 200 } : e)) };
      const after = answerStudies(solvedOf(edited), null).banks[0]!;
      const fig = page.getByTestId('answer-runtime');
      await expect.poll(async () => plain(await fig.innerText())).not.toContain('working');
      const before = plain(await fig.innerText());
      await page.locator('[data-testid="stage-card"][data-card-id="radios"]').click();
      const field = page.locator('[data-testid="stage-form"] [data-testid="field-power"]');
      await field.fill('200');
      await expect.poll(async () => plain(await fig.innerText())).toBe(plain(formatDuration(after.runtimeSeconds, 'en-US')));
      expect(plain(await fig.innerText())).not.toBe(before);
      await expect.poll(async () => plain(await page.getByTestId('energy-balance').innerText())).toMatch(/Loads use 570 W/);
      expect(errors).toEqual([]);
    } finally {
      await context.close();
    }
  });
});
