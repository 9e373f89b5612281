/**
 * The client report in real Chromium (playwright-core), against a production build: for each demo
 * the printed page (print media emulated, and a real PDF from headless Chromium's page.pdf at A4,
 * read page by page with unpdf) has "page n of m" and the date on every page, the client's pages
 * first (no solver words), the engineer's page last (the method), no page holding only a line or
 * two, at most three pages in all, the project's name, the key figures the engine computes (source power,
 * delivered power, losses with their idle and conversion parts, the largest loss) and the cautions;
 * editor controls and buttons are not printed; in the dark theme the printed page is still dark ink
 * on white, diagram included. Screenshots of the print layout go to tests/.artifacts/ to look at.
 */
import { writeFileSync } from 'node:fs';
import { join } from 'node:path';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { pdfPageImages, skipWithout } from '../tools/system-tools.ts';
import { VIEWPORTS, artifacts, serveBuiltApp, watchPageErrors, seriousAxeViolations, type ServedApp, fullPageScreenshot, pickDemo } from './harness.ts';
import { bankCautions, demoProjects, flowGraph, solveProject, CONDUCTOR_CAUTION } from '../../core/index.ts';
import { formatPercent, formatPower } from '../../web/format/number.ts';
import { extractText } from 'unpdf';


/** The caution every report carries (web/components/ClientReport.tsx, REPORT_CAUTION). */
const PLANNING = 'These results are planning estimates. Local electrical codes and licensed professional practice govern the design and installation.';

/** Pages of a PDF: its page objects, `/Type /Page` (not `/Pages`, the page tree) (PDF 1.7, ISO 32000-1, 7.7.3.3). */
export function pdfPageCount(pdf: Buffer): number {
  return (pdf.toString('latin1').match(/\/Type\s*\/Page(?![a-zA-Z])/g) ?? []).length;
}

/** The text of each page of a PDF (pdf.js through unpdf), one string per page. */
export async function pdfPageTexts(pdf: Buffer): Promise<string[]> {
  return (await extractText(new Uint8Array(pdf), { mergePages: false })).text;
}

/**
 * The solver's vocabulary, kept off the client's pages (issue 17): whole words only, so "report" and
 * "support" do not count as "port".
 */
export const SOLVER_WORDS = /\b(solve[ds]?|solver|solving|ports?|nodes?|sweeps?|converged|convergence|balance error)\b/i;

/** Lines of a page's text besides its margin (the page number and the "project · date" line). */
const bodyLines = (text: string, date: string) =>
  text
    .split('\n')
    .map((l) => l.trim())
    .filter((l) => l !== '' && !/^page \d+ of \d+$/.test(l) && !l.endsWith(` · ${date}`));

/**
 * Checks every printed report shares: page n of m and the date on each page, the engineer's page
 * last with the method, no solver words before it, and more than a few lines of text on every page
 * (a page with one or two lines is the orphan the print rules avoid).
 */
export async function checkPrintedPages(pdf: Buffer, date: string, label: string): Promise<string[]> {
  const pages = await pdfPageTexts(pdf);
  expect(pages.length, `${label}: pages`).toBe(pdfPageCount(pdf));
  expect(pages.length, `${label}: pages`).toBeGreaterThanOrEqual(2);
  expect(pages.length, `${label}: pages`).toBeLessThanOrEqual(3);
  pages.forEach((text, i) => {
    const flat = text.replace(/\s+/g, ' ');
    expect(flat, `${label}: page ${i + 1}`).toContain(`page ${i + 1} of ${pages.length}`);
    expect(flat, `${label}: page ${i + 1}`).toContain(date);
    expect(bodyLines(text, date).length, `${label}: lines on page ${i + 1}:\n${text}`).toBeGreaterThan(5);
    if (i < pages.length - 1) expect(flat, `${label}: client's page ${i + 1}`).not.toMatch(SOLVER_WORDS);
  });
  const last = pages.at(-1)!.replace(/\s+/g, ' ');
  expect(last).toContain('For the engineer: method and working');
  expect(last).toMatch(/Solved by .+ sweeps?/);
  // The engineer's page holds only the engineer's part: the client's answers are all on the pages before.
  expect(last).not.toContain('The answers');
  return pages;
}

function solved(id: string) {
  const demo = demoProjects.find((d) => d.id === id)!;
  const outcome = solveProject(demo.project);
  if (!outcome.ok) throw new Error(JSON.stringify(outcome.problems));
  return outcome.result;
}

describe('pdfPageCount', () => {
  it('counts page objects, not the page tree', () => {
    const text = '1 0 obj << /Type /Pages /Kids [2 0 R 3 0 R] /Count 2 >> 2 0 obj << /Type /Page >> 3 0 obj <</Type/Page/Parent 1 0 R>>';
    expect(pdfPageCount(Buffer.from(text, 'latin1'))).toBe(2);
  });
});

describe.skipIf(skipWithout('chromium'))('the client report in Chromium', () => {
  let app: ServedApp | undefined;
  let browser: Browser | undefined;
  let baseUrl = '';

  beforeAll(async () => {
    app = await serveBuiltApp('joulepath-report-build-');
    ({ browser, baseUrl } = app);
  });

  afterAll(async () => {
    await app?.close();
  });

  async function openPage(colorScheme: 'light' | 'dark'): Promise<{ context: BrowserContext; page: Page; errors: string[] }> {
    const context = await browser!.newContext({ viewport: VIEWPORTS.desktop, deviceScaleFactor: 1, locale: 'en-US', colorScheme });
    // window.print() opens a dialog headless Chromium cannot show: record the call instead.
    await context.addInitScript({ content: 'window.print = () => { window.__printed = (window.__printed ?? 0) + 1; };' });
    const page = await context.newPage();
    const errors = watchPageErrors(page);
    await page.goto(baseUrl, { waitUntil: 'load' });
    return { context, page, errors };
  }

  async function showDemo(page: Page, id: string): Promise<void> {
    await page.emulateMedia({ media: 'screen' });
    await pickDemo(page, id);
    await expect.poll(() => page.locator(`a[data-demo-id="${id}"]`).getAttribute('aria-current')).toBe('page');
    await page.getByTestId('flow-svg').waitFor();
    await page.getByTestId('report-head').waitFor({ state: 'attached' });
  }

  it.each(Object.entries(VIEWPORTS))('the diagram and the print button pass axe-core in the dark theme on every demo (%s)', async (label, viewport) => {
    const { context, page, errors } = await openPage('dark');
    try {
      await page.setViewportSize(viewport);
      for (const demo of demoProjects) {
        await showDemo(page, demo.id);
        const violations = await seriousAxeViolations(page, `{ include: [['[data-testid="energy-flow"]'], ['[data-testid="report-bar"]']] }`);
        expect(
          violations.map((v) => `${v.id}: ${v.nodes.map((n) => n.target.join(' ')).join(', ')}`),
          `${demo.id} (${label})`,
        ).toEqual([]);
        await page.getByTestId('energy-flow').screenshot({ path: join(artifacts, `flow-dark-${label}-${demo.id}.png`) });
      }
      expect(errors).toEqual([]);
    } finally {
      await context.close();
    }
  });

  it.each(['light', 'dark'] as const)('prints each demo on two or three A4 pages (the engineer\'s last) with its figures and cautions (%s theme)', async (theme) => {
    const { context, page, errors } = await openPage(theme);
    try {
      for (const demo of demoProjects) {
        await showDemo(page, demo.id);
        const result = solved(demo.id);
        const g = flowGraph(result);
        const t = result.totals;

        // On screen the report is hidden; its print button shows and calls window.print().
        expect(await page.getByTestId('report-head').isVisible()).toBe(false);
        await page.getByTestId('print-report').click();
        expect(await page.evaluate('window.__printed')).toBeGreaterThanOrEqual(1);

        await page.emulateMedia({ media: 'print' });
        const text = (await page.evaluate('document.body.innerText')) as string;
        expect(text).toContain(result.projectName);
        expect(text).toContain(formatPower(t.sourcePower, 'en-US'));
        expect(text).toContain(formatPower(t.loadPower, 'en-US'));
        expect(text).toContain(`${formatPower(g.losses.total.watts, 'en-US')} · ${formatPercent(g.losses.total.percent / 100, 'en-US', 3)}`);
        expect(text).toContain(formatPower(g.losses.idle.watts, 'en-US'));
        expect(text).toContain(formatPower(g.losses.conversion.watts, 'en-US'));
        expect(text).toContain(`${g.losses.largest!.name}: ${formatPower(g.losses.largest!.watts, 'en-US')}`);
        expect(text).toContain(PLANNING);
        if (result.elements.some((e) => e.conductor)) expect(text).toContain(CONDUCTOR_CAUTION);
        expect(text).toContain('Where the energy goes');
        expect(text).not.toMatch(/NaN|undefined|Infinity/);
        // The page's controls are not printed: no buttons, no form fields, no demo picker.
        expect(await page.locator('button:visible, input:visible, select:visible').count()).toBe(0);
        expect(await page.locator(`a[data-demo-id="${demo.id}"]`).isVisible()).toBe(false);
        expect(await page.getByTestId('flow-svg').isVisible()).toBe(true);

        // Dark ink on white paper in either theme, the diagram's own background included.
        const colours = (await page.evaluate(`(() => {
          const css = (el) => getComputedStyle(el);
          const svgBg = document.querySelector('[data-testid="flow-svg"] rect[data-fill="background"]');
          return {
            body: css(document.body).backgroundColor,
            ink: css(document.querySelector('.report h1')).color,
            svg: css(svgBg).fill,
            feed: css(document.querySelector('path.flow__link[data-role="feed"]')).stroke,
          };
        })()`)) as Record<string, string>;
        expect(colours).toEqual({ body: 'rgb(255, 255, 255)', ink: 'rgb(23, 32, 29)', svg: 'rgb(255, 255, 255)', feed: 'rgb(31, 111, 126)' });

        await fullPageScreenshot(page, join(artifacts, `report-${theme}-${demo.id}.png`));
        const pdf = await page.pdf({ format: 'A4', printBackground: true });
        writeFileSync(join(artifacts, `report-${theme}-${demo.id}.pdf`), pdf);
        const date = await page.getByTestId('report-date').innerText();
        const texts = await checkPrintedPages(pdf, date, `${demo.id} (${theme})`);
        // The answers come first: on the first page, before the chain.
        const first = texts[0]!.replace(/\s+/g, ' ');
        expect(first).toContain('The answers');
        expect(first.indexOf('The answers')).toBeLessThan(first.indexOf('The chain'));
        // Each page as an image, to look at (poppler's pdftoppm: a missing one fails under CI, is named elsewhere).
        pdfPageImages(join(artifacts, `report-${theme}-${demo.id}.pdf`), join(artifacts, `report-${theme}-${demo.id}-page`));
      }
      expect(errors).toEqual([]);
    } finally {
      await context.close();
    }
  });

  it('client, site and prepared-by typed in the project settings print on the first page; a text past 200 characters is refused at its field', async () => {
    const { context, page, errors } = await openPage('light');
    try {
      await showDemo(page, 'cold-store-dc-bus');
      await page.getByTestId('panel-project-settings').locator('summary').click();
      const form = page.getByTestId('project-form');
      await form.waitFor();
      const entries = [
        ['client', 'Ridge Farm Co-op'],
        ['site', '12 Quarry Lane, cold store 2'],
        ['preparedBy', 'A. Volt, licence 4471'],
      ] as const;
      for (const [path, text] of entries) {
        await form.getByTestId(`field-${path}`).fill(text);
        await form.getByTestId(`field-${path}`).blur();
      }
      // The limit (core/solve/validate.ts, REPORT_TEXT_MAX): the engine's message at the field, nothing stored.
      await form.getByTestId('field-client').fill('x'.repeat(201));
      await form.getByTestId('field-client').blur();
      await expect.poll(() => form.getByTestId('field-message').first().innerText()).toMatch(/at most 200 characters/);
      await form.getByTestId('field-client').fill('Ridge Farm Co-op');
      await form.getByTestId('field-client').blur();
      await expect.poll(() => form.getByTestId('field-message').count()).toBe(0);

      await page.emulateMedia({ media: 'print' });
      await expect.poll(() => page.getByTestId('report-parties').innerText()).toContain('Ridge Farm Co-op');
      const parties = await page.getByTestId('report-parties').innerText();
      for (const [, text] of entries) expect(parties).toContain(text);
      const pdf = await page.pdf({ format: 'A4', printBackground: true });
      writeFileSync(join(artifacts, 'report-client-fields.pdf'), pdf);
      const pages = await checkPrintedPages(pdf, await page.getByTestId('report-date').innerText(), 'client fields');
      const first = pages[0]!.replace(/\s+/g, ' ');
      for (const [, text] of entries) expect(first).toContain(text);
      for (const label of ['Client', 'Site', 'Prepared by']) expect(first).toContain(label);
      expect(errors).toEqual([]);
    } finally {
      await context.close();
    }
  });

  it('after an edit that makes the draft invalid, prints the last valid pair marked out of date, never the new names beside old figures', async () => {
    const { context, page, errors } = await openPage('light');
    try {
      await showDemo(page, 'cold-store-dc-bus');
      const result = solved('cold-store-dc-bus');
      const select = async (id: string) => {
        await page.locator(`[data-testid="stage-card"][data-card-id="${id}"]`).click();
        await page.locator(`[data-testid="stage-form"][data-element-id="${id}"]`).waitFor();
      };
      const field = (path: string) => page.locator(`[data-testid="stage-form"] [data-testid="field-${path}"]`);
      // 400 kW of fans on the 35 m, 2.5 mm² run: past what the link can transfer, so the engine
      // refuses the whole chain (infeasible load; taken into the draft, as a structural refusal is).
      await select('fans');
      const unit = await page.locator('[data-testid="stage-form"] [data-path="power"] .sf-unit').innerText();
      await field('power').fill(unit === 'kW' ? '400' : '400000');
      await field('power').blur();
      await page.getByTestId('results-stale').waitFor();
      // Then a new name, in the invalid draft only.
      await field('name').fill('Renamed in the draft');
      await field('name').blur();
      await expect.poll(() => page.locator('[data-card-id="fans"]').innerText()).toContain('Renamed in the draft');

      await page.emulateMedia({ media: 'print' });
      await expect.poll(() => page.getByTestId('report-stale').isVisible()).toBe(true);
      expect(await page.getByTestId('report-stale').innerText()).toMatch(/Out of date/);
      const chain = await page.getByTestId('report-chain').innerText();
      // The last valid pair: its own name for the fans, with its own figures.
      expect(chain).toContain('Evaporator fans');
      expect(chain).not.toContain('Renamed in the draft');
      const text = (await page.evaluate('document.body.innerText')) as string;
      expect(text).not.toContain('Renamed in the draft');
      expect(text).toContain(formatPower(result.totals.sourcePower, 'en-US'));
      expect(text).toContain(formatPower(result.totals.loadPower, 'en-US'));
      await fullPageScreenshot(page, join(artifacts, 'report-stale-cold-store.png'));
      expect(errors).toEqual([]);
    } finally {
      await context.close();
    }
  });

  it('the cautions of an out-of-date report are those of the pair’s own bank, not of a chemistry typed since into the invalid draft', async () => {
    const { context, page, errors } = await openPage('light');
    try {
      await showDemo(page, 'hillside-relay-hut');
      const select = async (id: string) => {
        await page.locator(`[data-testid="stage-card"][data-card-id="${id}"]`).click();
        await page.locator(`[data-testid="stage-form"][data-element-id="${id}"]`).waitFor();
      };
      const field = (path: string) => page.locator(`[data-testid="stage-form"] [data-testid="field-${path}"]`);
      // 400 kW through the hut's 25 m, 2.5 mm² run: the engine refuses the chain (infeasible load).
      await select('fridge');
      const unit = await page.locator('[data-testid="stage-form"] [data-path="power"] .sf-unit').innerText();
      await field('power').fill(unit === 'kW' ? '400' : '400000');
      await field('power').blur();
      await page.getByTestId('results-stale').waitFor();
      // The bank's chemistry changed in the invalid draft: LiFePO4 → flooded lead-acid (vented: another caution).
      await select('bank');
      await field('bank.chemistry').selectOption('flooded-lead-acid');
      await expect.poll(() => field('bank.chemistry').inputValue()).toBe('flooded-lead-acid');

      await page.emulateMedia({ media: 'print' });
      await expect.poll(() => page.getByTestId('report-stale').isVisible()).toBe(true);
      const cautions = await page.getByTestId('report-cautions').innerText();
      const own = bankCautions('lifepo4').filter((c) => !c.startsWith('Planning estimate only'));
      const typed = bankCautions('flooded-lead-acid').filter((c) => !c.startsWith('Planning estimate only') && !own.includes(c));
      expect(own.length).toBeGreaterThan(0);
      expect(typed.length).toBeGreaterThan(0);
      for (const c of own) expect(cautions).toContain(c);
      for (const c of typed) expect(cautions).not.toContain(c);
      expect(errors).toEqual([]);
    } finally {
      await context.close();
    }
  });
});
