/**
 * The client report in real Chromium (playwright-core), against a production build: for each demo
 * the printed page (print media emulated, and a real PDF from headless Chromium's page.pdf at A4)
 * holds at most two pages, the project's name, the key figures the engine computes (source power,
 * delivered power, losses with their idle and conversion parts, the largest loss) and the cautions;
 * editor controls and buttons are not printed; in the dark theme the printed page is still dark ink
 * on white, diagram included. Screenshots of the print layout go to tests/.artifacts/ to look at.
 */
import { writeFileSync } from 'node:fs';
import { join } from 'node:path';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { skipWithout } from '../tools/system-tools.ts';
import { VIEWPORTS, artifacts, serveBuiltApp, watchPageErrors, seriousAxeViolations, type ServedApp, fullPageScreenshot, pickDemo } from './harness.ts';
import { bankCautions, demoProjects, flowGraph, solveProject, CONDUCTOR_CAUTION } from '../../core/index.ts';
import { formatPercent, formatPower } from '../../web/format/number.ts';


/** The caution every report carries (web/components/ClientReport.tsx, REPORT_CAUTION). */
const PLANNING = 'These results are planning estimates. Local electrical codes and licensed professional practice govern the design and installation.';

/** Pages of a PDF: its page objects, `/Type /Page` (not `/Pages`, the page tree) (PDF 1.7, ISO 32000-1, 7.7.3.3). */
export function pdfPageCount(pdf: Buffer): number {
  return (pdf.toString('latin1').match(/\/Type\s*\/Page(?![a-zA-Z])/g) ?? []).length;
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

  it.each(['light', 'dark'] as const)('prints each demo on at most two A4 pages with its figures and cautions (%s theme)', async (theme) => {
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
        const pages = pdfPageCount(pdf);
        expect(pages, `${demo.id}: pages of the printed report`).toBeGreaterThanOrEqual(1);
        expect(pages, `${demo.id}: pages of the printed report`).toBeLessThanOrEqual(2);
      }
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
