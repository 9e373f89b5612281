/**
 * The energy-flow diagram in a real browser (Debian's Chromium, driven by playwright-core), against
 * a production build: each demo draws its diagram with one loss branch per element that loses power,
 * labels carry the engine's figures, hover and keyboard focus show details, the SVG and PNG exports
 * download real files, and the diagram neither widens the page on a phone nor loads with the page.
 * Screenshots go to tests/.artifacts/ for a person to look at.
 */
import { readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { skipWithout } from '../tools/system-tools.ts';
import { VIEWPORTS, artifacts, serveBuiltApp, watchPageErrors, type ServedApp, pickDemo } from './harness.ts';
import { demoProjects, flowGraph, solveProject, type FlowGraph } from '../../core/index.ts';
import { formatPercent, formatPower } from '../../web/format/number.ts';



/** PNG file signature (ISO/IEC 15948 / PNG specification, section 5.2). */
const PNG_SIGNATURE = [0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a];


/** The engine's flow graph of a demo (the figures the page must show). */
function demoGraph(id: string): FlowGraph {
  const demo = demoProjects.find((d) => d.id === id);
  if (!demo) throw new Error(`no demo ${id}`);
  const outcome = solveProject(demo.project);
  if (!outcome.ok) throw new Error(JSON.stringify(outcome.problems));
  return flowGraph(outcome.result);
}

/** Loss branches the page should draw: those carrying power (a stiff source loses nothing). */
const expectedLossBranches = (g: FlowGraph) => g.links.filter((l) => l.role === 'loss' && l.watts > 1e-9 * g.sourcePower).length;

describe.skipIf(skipWithout('chromium'))('the energy-flow diagram in Chromium', () => {
  let app: ServedApp | undefined;
  let browser: Browser | undefined;
  let baseUrl = '';

  beforeAll(async () => {
    app = await serveBuiltApp('joulepath-flow-build-');
    ({ browser, baseUrl } = app);
  });

  afterAll(async () => {
    await app?.close();
  });

  async function openPage(viewport: { width: number; height: number }, colorScheme: 'light' | 'dark' = 'light'): Promise<{ context: BrowserContext; page: Page; errors: string[]; scripts: string[] }> {
    const context = await browser!.newContext({ viewport, deviceScaleFactor: 1, locale: 'en-US', acceptDownloads: true, colorScheme });
    const page = await context.newPage();
    const errors = watchPageErrors(page);
    const scripts: string[] = [];
    page.on('requestfailed', (req) => errors.push(`request failed: ${req.url()}`));
    page.on('request', (req) => {
      if (req.resourceType() === 'script') scripts.push(req.url());
    });
    await page.goto(baseUrl, { waitUntil: 'load' });
    return { context, page, errors, scripts };
  }

  async function showDemo(page: Page, id: string): Promise<void> {
    await pickDemo(page, id);
    await expect.poll(() => page.locator(`a[data-demo-id="${id}"]`).getAttribute('aria-current')).toBe('page');
    await page.getByTestId('flow-svg').waitFor();
  }

  it.each(Object.entries(VIEWPORTS))('draws each demo with its loss branches and the engine’s figures (%s)', async (label, viewport) => {
    const { context, page, errors, scripts } = await openPage(viewport);
    try {
      await page.getByTestId('flow-svg').waitFor();
      // The diagram comes in a chunk of its own, after the page's entry script.
      expect(scripts.length, 'the entry script and the diagram chunk').toBeGreaterThanOrEqual(2);
      for (const demo of demoProjects) {
        const g = demoGraph(demo.id);
        await showDemo(page, demo.id);
        const svg = page.getByTestId('flow-svg');
        const lossBranches = svg.locator('path.flow__link[data-role="loss"]');
        await expect.poll(() => lossBranches.count()).toBe(expectedLossBranches(g));
        expect(await svg.locator('path.flow__link[data-role="feed"]').count()).toBe(g.links.filter((l) => l.role === 'feed' && l.watts > 1e-9 * g.sourcePower).length);

        // The widest feed link is labelled with the engine's watts and per cent.
        const widest = g.links.filter((l) => l.role === 'feed').sort((a, b) => b.watts - a.watts)[0]!;
        const key = `${widest.source}→${widest.target}`;
        const expected = `${formatPower(widest.watts, 'en-US')} · ${formatPercent(widest.percent / 100, 'en-US', 3)}`;
        expect((await svg.locator(`text[data-link="${key}"]`).textContent())?.trim()).toBe(expected);
        const path = svg.locator(`path.flow__link[data-source="${widest.source}"][data-target="${widest.target}"]`);
        expect(Number(await path.getAttribute('data-watts'))).toBe(widest.watts);
        expect(await path.getAttribute('aria-label')).toContain(expected);

        // Idle and conversion parts: one dashed idle branch per element with idle loss, beside its conversion branch.
        const idleLinks = g.links.filter((l) => l.part === 'idle' && l.watts > 1e-9 * g.sourcePower);
        expect(await svg.locator('path.flow__link[data-part="idle"]').count()).toBe(idleLinks.length);
        for (const l of idleLinks) {
          expect(Number(await svg.locator(`path.flow__link[data-part="idle"][data-source="${l.source}"]`).getAttribute('data-watts'))).toBe(l.watts);
        }
        // No two labels drawn overlap each other (labels that do not fit are left out; their figures stay in the details).
        const overlaps = (await page.evaluate(`(() => {
          // On the page, not getBBox(): a label is placed by its group's translation.
          const boxes = [...document.querySelectorAll('[data-testid="flow-svg"] text')].map((t) => {
            const b = t.getBoundingClientRect();
            return { t: t.textContent, x0: b.left, y0: b.top, x1: b.right, y1: b.bottom };
          });
          const out = [];
          for (let i = 0; i < boxes.length; i++)
            for (let j = i + 1; j < boxes.length; j++) {
              const a = boxes[i], b = boxes[j];
              if (a.x0 < b.x1 - 1 && b.x0 < a.x1 - 1 && a.y0 < b.y1 - 1 && b.y0 < a.y1 - 1) out.push(a.t + ' / ' + b.t);
            }
          return out;
        })()`)) as string[];
        expect(overlaps, `overlapping labels on ${demo.id} (${label})`).toEqual([]);

        const text = await page.getByTestId('energy-flow').innerText();
        expect(text).not.toMatch(/NaN|undefined|Infinity/);
        const overflow = await page.evaluate('document.documentElement.scrollWidth - window.innerWidth');
        expect(overflow, `page wider than the ${label} viewport on ${demo.id}`).toBeLessThanOrEqual(0);
        await page.getByTestId('energy-flow').screenshot({ path: join(artifacts, `flow-${label}-${demo.id}.png`) });
      }
      expect(errors).toEqual([]);
    } finally {
      await context.close();
    }
  });

  it('shows details on hover, on tap and on keyboard focus', async () => {
    // In the dark theme (the device's setting), so its screenshot can be looked at too.
    const { context, page, errors } = await openPage(VIEWPORTS.desktop, 'dark');
    try {
      const details = page.getByTestId('flow-details');
      const g = demoGraph(demoProjects[0]!.id);
      await page.getByTestId('flow-svg').waitFor();
      const before = await details.innerText();

      // Hover a loss branch: the details line names the element and its loss.
      const loss = g.links.filter((l) => l.role === 'loss').sort((a, b) => b.watts - a.watts)[0]!;
      const lossName = g.nodes.find((n) => n.id === loss.source)!.name;
      await page.locator(`path.flow__link[data-role="loss"][data-source="${loss.source}"][data-part="${loss.part}"]`).hover({ force: true });
      // The details name the part (idle, conversion, or a cable's loss), the element and the watts of that part.
      const partWords = loss.part === 'idle' ? 'Idle loss' : g.nodes.find((n) => n.id === loss.source)!.kind === 'cable' ? 'Loss' : 'Conversion loss';
      await expect.poll(() => details.innerText()).toContain(`${partWords} in ${lossName} (`);
      expect(await details.innerText()).toContain(`: ${formatPower(loss.watts, 'en-US')} · `);

      // Tap (click) a load block.
      const load = g.nodes.find((n) => n.role === 'load')!;
      await page.locator(`g.flow__node[data-node="${load.id}"] rect`).click();
      await expect.poll(() => details.innerText()).toContain(`${load.name}`);

      // Keyboard: Tab from the PNG button reaches the diagram, and the focused branch is described.
      // Tab from the PNG button: first the diagram's scroll box, then its first branch or block.
      await page.getByTestId('flow-export-png').focus();
      await page.keyboard.press('Tab');
      expect(await page.evaluate(`document.activeElement?.getAttribute('data-testid')`)).toBe('flow-box');
      await page.keyboard.press('Tab');
      // (Page code as a string: this file is type-checked without the DOM library.)
      const focused = (await page.evaluate(
        `(() => { const el = document.activeElement; return { cls: el?.getAttribute('class') ?? '', label: el?.getAttribute('aria-label') ?? '' }; })()`,
      )) as { cls: string; label: string };
      expect(focused.cls).toMatch(/flow__(link|node)/);
      expect(focused.label).toMatch(/\d.*W/);
      await expect.poll(() => details.innerText()).toBe(focused.label);
      expect(focused.label).not.toBe(before);
      await page.getByTestId('energy-flow').screenshot({ path: join(artifacts, 'flow-desktop-dark-focus.png') });
      expect(errors).toEqual([]);
    } finally {
      await context.close();
    }
  });

  it('exports the diagram as an SVG file and a PNG file named after the project', async () => {
    const { context, page, errors } = await openPage(VIEWPORTS.phone);
    try {
      const demo = demoProjects[1]!;
      await showDemo(page, demo.id);
      const g = demoGraph(demo.id);

      const [svgDownload] = await Promise.all([page.waitForEvent('download'), page.getByTestId('flow-export-svg').click()]);
      expect(svgDownload.suggestedFilename()).toMatch(/-energy-flow\.svg$/);
      const svgPath = await svgDownload.path();
      const svgText = readFileSync(svgPath, 'utf8');
      // Parse it as SVG in the browser's own XML parser: no parser error, an <svg> root in the SVG namespace.
      const parsed = await page.evaluate(`(() => {
        const doc = new DOMParser().parseFromString(${JSON.stringify(svgText)}, 'image/svg+xml');
        const root = doc.documentElement;
        return {
          error: doc.getElementsByTagName('parsererror').length,
          root: root.localName,
          ns: root.namespaceURI,
          lossPaths: root.querySelectorAll('path[data-role="loss"]').length,
          focusable: root.querySelectorAll('[tabindex]').length,
        };
      })()`);
      expect(parsed).toEqual({ error: 0, root: 'svg', ns: 'http://www.w3.org/2000/svg', lossPaths: expectedLossBranches(g), focusable: 0 });

      const [pngDownload] = await Promise.all([page.waitForEvent('download'), page.getByTestId('flow-export-png').click()]);
      expect(pngDownload.suggestedFilename()).toBe(svgDownload.suggestedFilename().replace(/\.svg$/, '.png'));
      const png = readFileSync(await pngDownload.path());
      expect([...png.subarray(0, 8)]).toEqual(PNG_SIGNATURE);
      writeFileSync(join(artifacts, 'flow-export.png'), png);
      // IHDR width (bytes 16–19, big-endian): twice the diagram's width.
      const svgWidth = Number(await page.getByTestId('flow-svg').getAttribute('width'));
      expect(png.readUInt32BE(16)).toBe(Math.round(svgWidth * 2));
      expect(errors).toEqual([]);
    } finally {
      await context.close();
    }
  });
});
