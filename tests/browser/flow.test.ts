/**
 * The energy-flow diagram in a real browser (Debian's Chromium, driven by playwright-core), against
 * a production build: each demo draws its diagram with one loss branch per element that loses power,
 * labels carry the engine's figures, hover and keyboard focus show details, a tap or Enter opens a
 * card of the element's figures inside the phone's screen, the zoom shows the whole chain, the SVG
 * and PNG exports download real files, and the diagram neither widens the page on a phone nor loads
 * with the page. The geometry checks (GEOMETRY below: no loss branch across a main flow or a label,
 * labels inside the drawing and apart, each loss label under its stage, full names, no empty band)
 * run on the three demos and a 30-element chain, phone and desktop, light and dark; on the diagrams
 * before the column layout they failed on every demo (crossings, loss labels one column to the
 * right, cut names, 58–66 px left empty under the band). Screenshots and each case's list of
 * problems go to tests/.artifacts/ for a person to look at.
 */
import { readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { skipWithout } from '../tools/system-tools.ts';
import { VIEWPORTS, artifacts, seriousAxeViolations, serveBuiltApp, watchPageErrors, type ServedApp, pickDemo } from './harness.ts';
import { demoProjects, flowGraph, solveProject, type FlowGraph } from '../../core/index.ts';
import { formatCurrent, formatPercent, formatPower } from '../../web/format/number.ts';
import { thirtyElementChain } from '../bench/flow-chain.ts';



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

/** The engine's flow graph of the 30-element chain (tests/bench/flow-chain.ts). */
function chainGraph(): FlowGraph {
  const outcome = solveProject(thirtyElementChain());
  if (!outcome.ok) throw new Error(JSON.stringify(outcome.problems));
  return flowGraph(outcome.result);
}

/**
 * The diagram's geometry, measured on the page (client pixels), as a list of problems (empty: all
 * good). Page code as a string: this file is type-checked without the DOM library.
 * - no loss branch crosses a main flow: each loss branch's centre line is sampled (getPointAtLength,
 *   48 points), and each feed branch's centre line (a stroked branch) or outline (a filled ribbon,
 *   160 points); every segment of a loss branch is tested against every segment of every feed branch
 *   for a proper crossing; a loss branch's centre also may not lie inside a ribbon, nor come within
 *   its half-width of a ribbon's edge, or within the two half-widths of a stroked feed's centre (a
 *   band laid over another without their centres crossing);
 * - no loss branch runs through a label (its sampled centre inside a label's box, 1 px in);
 * - every label's box lies inside the drawing (0.5 px) and overlaps no other label (1 px);
 * - each loss label's centre lies within its stage's column: the x-range of the stage's block;
 * - every source, stage and load carries its full name (the bold lines of its label, whitespace
 *   removed, equal the name, whitespace removed) and every loss its label;
 * - the drawing is no taller than it needs: below the lowest part drawn at most one height step
 *   (40 px) plus the bottom margin (16 px) is left.
 */
const GEOMETRY = (names: Record<string, string>) => `(() => {
  const names = ${JSON.stringify(names)};
  const svg = document.querySelector('[data-testid="flow-svg"]');
  const sb = svg.getBoundingClientRect();
  const out = [];
  const sample = (p, n) => {
    const L = p.getTotalLength(), m = p.getScreenCTM(), pts = [];
    for (let i = 0; i <= n; i++) { const q = p.getPointAtLength((L * i) / n); const r = new DOMPoint(q.x, q.y).matrixTransform(m); pts.push([r.x, r.y]); }
    return { pts, w: Number(p.getAttribute('stroke-width')) * m.a, key: p.getAttribute('data-link-key') };
  };
  const side = (p, q, r) => Math.sign((q[0] - p[0]) * (r[1] - p[1]) - (q[1] - p[1]) * (r[0] - p[0]));
  const cross = (a, b, c, d) => side(a, b, c) * side(a, b, d) < 0 && side(c, d, a) * side(c, d, b) < 0;
  const segDist = (p, a, b) => {
    const dx = b[0] - a[0], dy = b[1] - a[1], L2 = dx * dx + dy * dy;
    const t = L2 ? Math.max(0, Math.min(1, ((p[0] - a[0]) * dx + (p[1] - a[1]) * dy) / L2)) : 0;
    return Math.hypot(p[0] - a[0] - t * dx, p[1] - a[1] - t * dy);
  };
  // A filled feed branch (a ribbon) is its outline, a polygon; a stroked one its centre line.
  const filled = (p) => (p.getAttribute('fill') || 'none') !== 'none';
  const inside = (pt, poly) => {
    let inn = false;
    for (let i = 0, j = poly.length - 1; i < poly.length; j = i++) {
      const a = poly[i], b = poly[j];
      if ((a[1] > pt[1]) !== (b[1] > pt[1]) && pt[0] < ((b[0] - a[0]) * (pt[1] - a[1])) / (b[1] - a[1]) + a[0]) inn = !inn;
    }
    return inn;
  };
  const losses = [...svg.querySelectorAll('path.flow__link[data-role="loss"]')].map((p) => sample(p, 48));
  const feeds = [...svg.querySelectorAll('path.flow__link[data-role="feed"]')].map((p) => ({ ...sample(p, filled(p) ? 160 : 48), ribbon: filled(p) }));
  for (const l of losses)
    for (const f of feeds) {
      let hit = '';
      for (let i = 0; i + 1 < l.pts.length && !hit; i++)
        for (let j = 0; j + 1 < f.pts.length && !hit; j++) if (cross(l.pts[i], l.pts[i + 1], f.pts[j], f.pts[j + 1])) hit = 'crosses';
      for (let i = 0; i < l.pts.length && !hit; i++) {
        if (f.ribbon && inside(l.pts[i], f.pts)) hit = 'lies over';
        const reach = f.ribbon ? l.w / 2 - 1 : (l.w + f.w) / 2 - 2;
        for (let j = 0; j + 1 < f.pts.length && !hit; j++) if (segDist(l.pts[i], f.pts[j], f.pts[j + 1]) < reach) hit = 'lies over';
      }
      if (hit) out.push('loss branch ' + l.key + ' ' + hit + ' main flow ' + f.key);
    }
  const texts = [...svg.querySelectorAll('text')].filter((t) => (t.textContent || '').trim() !== '');
  const boxes = texts.map((t) => { const b = t.getBoundingClientRect(); return { t: t.textContent, x0: b.left, y0: b.top, x1: b.right, y1: b.bottom }; });
  for (const l of losses) {
    const hit = boxes.find((b) => l.pts.some(([x, y]) => x > b.x0 + 1 && x < b.x1 - 1 && y > b.y0 + 1 && y < b.y1 - 1));
    if (hit) out.push('loss branch ' + l.key + ' runs through the label "' + hit.t + '"');
  }
  for (let i = 0; i < boxes.length; i++) {
    const a = boxes[i];
    if (a.x0 < sb.left - 0.5 || a.x1 > sb.right + 0.5 || a.y0 < sb.top - 0.5 || a.y1 > sb.bottom + 0.5) out.push('label "' + a.t + '" leaves the drawing');
    for (let j = i + 1; j < boxes.length; j++) {
      const b = boxes[j];
      if (a.x0 < b.x1 - 1 && b.x0 < a.x1 - 1 && a.y0 < b.y1 - 1 && b.y0 < a.y1 - 1) out.push('labels overlap: "' + a.t + '" / "' + b.t + '"');
    }
  }
  for (const g of svg.querySelectorAll('g.flow__node[data-role="loss"]')) {
    const id = g.getAttribute('data-node');
    const stage = id.slice(0, -'#loss'.length);
    const ts = [...g.querySelectorAll('text')].map((t) => t.getBoundingClientRect());
    if (ts.length === 0) { out.push('the loss of ' + stage + ' has no label'); continue; }
    const cx = (Math.min(...ts.map((b) => b.left)) + Math.max(...ts.map((b) => b.right))) / 2;
    const block = [...svg.querySelectorAll('g.flow__node')].find((n) => n.getAttribute('data-node') === stage).querySelector('rect').getBoundingClientRect();
    if (cx < block.left - 0.5 || cx > block.right + 0.5) out.push('the loss label of ' + stage + ' (centre ' + cx.toFixed(0) + ') is not under its stage (' + block.left.toFixed(0) + '–' + block.right.toFixed(0) + ')');
  }
  for (const [id, name] of Object.entries(names)) {
    const g = [...svg.querySelectorAll('g.flow__node')].find((n) => n.getAttribute('data-node') === id);
    const shown = g ? [...g.querySelectorAll('text')].filter((t) => t.getAttribute('font-weight') === '600').map((t) => t.textContent).join('') : '';
    // Shown in full, or (a name past its label's lines) shortened with the full name kept for the exported legend.
    const full = g && g.getAttribute('data-full-name') === name;
    if (!full && shown.replace(/\\s+/g, '') !== name.replace(/\\s+/g, '')) out.push('name of ' + id + ' shown as "' + shown + '", not "' + name + '"');
  }
  let lowest = 0;
  for (const el of svg.querySelectorAll('path, text, g.flow__node rect')) { const b = el.getBoundingClientRect(); if (b.height > 0 || b.width > 0) lowest = Math.max(lowest, b.bottom); }
  if (sb.bottom - lowest > 56.5) out.push('the drawing leaves ' + (sb.bottom - lowest).toFixed(0) + ' px empty below its lowest part');
  return out;
})()`;

/** Names the exported SVG shows for each source, stage and load (the bold lines of its label, joined). */
const EXPORTED_NAMES = (svgText: string) => `(() => {
  const doc = new DOMParser().parseFromString(${JSON.stringify(svgText)}, 'image/svg+xml');
  const out = {};
  for (const g of doc.querySelectorAll('g[data-node]')) {
    if (g.getAttribute('data-role') === 'loss') continue;
    out[g.getAttribute('data-node')] = [...g.querySelectorAll('text')].filter((t) => t.getAttribute('font-weight') === '600').map((t) => t.textContent).join('');
  }
  return out;
})()`;

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

        // The widest feed link's element is labelled with the engine's watts and per cent (its label's
        // last line), and the branch carries them in its name.
        const widest = g.links.filter((l) => l.role === 'feed').sort((a, b) => b.watts - a.watts)[0]!;
        const expected = `${formatPower(widest.watts, 'en-US')} · ${formatPercent(widest.percent / 100, 'en-US', 3)}`;
        expect((await svg.locator(`g.flow__node[data-node="${widest.target}"] text:not([font-weight])`).last().textContent())?.trim()).toBe(expected);
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

  // The three demos and the 30-element chain, phone and desktop, light and dark: the geometry checks
  // (GEOMETRY), the names in the exported SVG, and a screenshot of each for a person to look at.
  it.each([
    ['phone', 'light'],
    ['phone', 'dark'],
    ['desktop', 'light'],
    ['desktop', 'dark'],
  ] as const)('reads at a glance: no crossings, labels in place, full names (%s, %s)', async (label, scheme) => {
    const { context, page, errors } = await openPage(VIEWPORTS[label], scheme);
    try {
      const shown: [string, FlowGraph][] = demoProjects.map((d) => [d.id, demoGraph(d.id)]);
      shown.push(['thirty-element-chain', chainGraph()]);
      for (const [id, g] of shown) {
        if (id === 'thirty-element-chain') {
          await page.getByTestId('open-file').setInputFiles({ name: 'thirty.json', mimeType: 'application/json', buffer: Buffer.from(JSON.stringify(thirtyElementChain())) });
          await page.locator('g.flow__node[data-node="fan2"]').waitFor();
        } else {
          await showDemo(page, id);
        }
        const svg = page.getByTestId('flow-svg');
        await expect.poll(() => svg.locator('path.flow__link[data-role="loss"]').count()).toBe(expectedLossBranches(g));
        const names = Object.fromEntries(g.nodes.filter((n) => n.role !== 'loss').map((n) => [n.id, n.name]));
        const problems = (await page.evaluate(GEOMETRY(names))) as string[];
        writeFileSync(join(artifacts, `flow-geometry-${label}-${scheme}-${id}.txt`), problems.join('\n'));
        expect.soft(problems, `${id} (${label}, ${scheme})`).toEqual([]);
        if (scheme === 'light') {
          await page.getByTestId('flow-export-svg').scrollIntoViewIfNeeded();
          const [download] = await Promise.all([page.waitForEvent('download'), page.getByTestId('flow-export-svg').click()]);
          const exported = (await page.evaluate(EXPORTED_NAMES(readFileSync(await download.path(), 'utf8')))) as Record<string, string>;
          const cut = Object.entries(names).filter(([nid, name]) => (exported[nid] ?? '').replace(/\s+/g, '') !== name.replace(/\s+/g, ''));
          writeFileSync(join(artifacts, `flow-export-names-${label}-${id}.txt`), cut.map(([nid, name]) => `${nid}: exported "${exported[nid] ?? ''}" for "${name}"`).join('\n'));
          expect.soft(cut.map(([nid, name]) => `${nid}: exported "${exported[nid] ?? ''}" for "${name}"`), `names in the exported SVG of ${id} (${label})`).toEqual([]);
        }
        await page.getByTestId('energy-flow').screenshot({ path: join(artifacts, `flow-${label}-${scheme}-${id}.png`) });
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
      await page.locator(`g.flow__node[data-node="${load.id}"] rect`).first().click();
      await expect.poll(() => details.innerText()).toContain(`${load.name}`);

      // Keyboard: Tab from the last button above the diagram (the zoom's, when the drawing is wider
      // than its box; else the PNG button) reaches the diagram: first its box, then its first branch or block.
      await ((await page.getByTestId('flow-zoom-fit').count()) ? page.getByTestId('flow-zoom-fit') : page.getByTestId('flow-export-png')).focus();
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

  it('a tapped branch or block shows its element’s figures next to it, in view; the zoom shows the whole chain (phone)', async () => {
    const { context, page, errors } = await openPage(VIEWPORTS.phone);
    try {
      const demo = demoProjects.find((d) => d.id === 'hillside-relay-hut')!;
      await showDemo(page, demo.id);
      const outcome = solveProject(demo.project);
      if (!outcome.ok) throw new Error('demo does not solve');
      // The engine's figures of the inverter (the element whose loss branch is tapped).
      const inv = outcome.result.elements.find((e) => e.id === 'inverter')!;
      const share = inv.pIn / outcome.result.totals.sourcePower;
      const card = page.getByTestId('flow-card');
      const inView = async () => {
        const b = (await card.boundingBox())!;
        return b.x >= 0 && b.y >= 0 && b.x + b.width <= VIEWPORTS.phone.width + 0.5 && b.y + b.height <= VIEWPORTS.phone.height + 0.5;
      };

      // Tap the inverter's conversion-loss branch: its card names the inverter and gives its figures.
      await page.locator('path.flow__link[data-role="loss"][data-source="inverter"][data-part="conversion"]').click({ force: true });
      await card.waitFor();
      const text = await card.innerText();
      expect(text).toContain(inv.name);
      expect(text).toContain(formatPower(inv.pIn, 'en-US'));
      expect(text).toContain(formatPercent(share, 'en-US', 3));
      expect(text).toContain(formatPower(inv.loss, 'en-US'));
      expect(text).toContain(formatPercent(inv.efficiency, 'en-US'));
      expect(text).toContain(formatCurrent(inv.input!.current, 'en-US'));
      expect(await inView(), 'the card lies inside the phone screen').toBe(true);
      await page.screenshot({ path: join(artifacts, 'flow-phone-card.png') });
      const violations = await seriousAxeViolations(page, `{ include: [['[data-testid="energy-flow"]']] }`);
      expect(violations.map((v) => `${v.id}: ${v.nodes.map((n) => n.target.join(' ')).join(', ')}`), 'axe on the diagram with its card open').toEqual([]);

      // A tap on the drawing's background closes it; tapped again, Escape closes it; Enter on a
      // focused block opens the block's card, in view.
      await page.getByTestId('flow-svg').locator('rect[data-fill="background"]').click({ position: { x: 4, y: 4 }, force: true });
      await expect.poll(() => card.count()).toBe(0);
      await page.locator('path.flow__link[data-role="loss"][data-source="inverter"][data-part="conversion"]').click({ force: true });
      await card.waitFor();
      await page.keyboard.press('Escape');
      await expect.poll(() => card.count()).toBe(0);
      const load = outcome.result.elements.find((e) => e.role === 'load')!;
      await page.locator(`g.flow__node[data-node="${load.id}"]`).focus();
      await page.keyboard.press('Enter');
      await card.waitFor();
      expect(await card.innerText()).toContain(load.name);
      expect(await card.innerText()).toContain(formatPower(load.pIn, 'en-US'));
      expect(await inView(), 'the card lies inside the phone screen').toBe(true);
      // Its Close button (reached by Tab, pressed with Enter) closes it and gives the focus back to the block.
      await card.getByRole('button', { name: 'Close the figures' }).focus();
      await page.keyboard.press('Enter');
      await expect.poll(() => card.count()).toBe(0);
      expect(await page.evaluate(`document.activeElement?.getAttribute('data-node')`)).toBe(load.id);

      // Zoom: the whole chain fits the box, then back to full size (12 px labels).
      const svg = page.getByTestId('flow-svg');
      const full = Number(await svg.getAttribute('width'));
      const boxWidth = (await page.evaluate(`document.querySelector('[data-testid="flow-box"]').clientWidth`)) as number;
      expect(full).toBeGreaterThan(boxWidth);
      await page.getByTestId('flow-zoom-fit').click();
      await expect.poll(async () => (await svg.boundingBox())!.width).toBeLessThanOrEqual(boxWidth);
      await page.getByTestId('energy-flow').screenshot({ path: join(artifacts, 'flow-phone-whole-chain.png') });
      await page.getByTestId('flow-zoom-in').click();
      const zoomed = (await svg.boundingBox())!.width;
      expect(zoomed).toBeGreaterThan(boxWidth - 2);
      await page.getByTestId('flow-zoom-fit').click();
      await expect.poll(async () => Math.round((await svg.boundingBox())!.width)).toBe(full);
      expect(errors).toEqual([]);
    } finally {
      await context.close();
    }
  });

  it('the canvas on screen shows what the SVG over it holds, at the screen’s pixel density and in the theme’s palette, after an edit too', async () => {
    // Dark theme at two device pixels per CSS pixel (a phone's or a laptop's high-density screen).
    const context = await browser!.newContext({ viewport: VIEWPORTS.desktop, deviceScaleFactor: 2, locale: 'en-US', colorScheme: 'dark' });
    const page = await context.newPage();
    const errors = watchPageErrors(page);
    try {
      await page.goto(baseUrl, { waitUntil: 'load' });
      await showDemo(page, 'hillside-relay-hut');
      // The canvas's pixels beside the SVG's own rendering (the SVG drawn as an image at the canvas's
      // pixel size): the share of pixels that differ by more than 40 of 255 in a channel (text
      // antialiasing differs a little between the two), its sizes, and its top left pixel (background).
      const COMPARE = `(async () => {
        const canvas = document.querySelector('[data-testid="flow-canvas"]');
        const svg = document.querySelector('[data-testid="flow-svg"]');
        const w = canvas.width, h = canvas.height;
        const a = canvas.getContext('2d').getImageData(0, 0, w, h).data;
        const url = URL.createObjectURL(new Blob([new XMLSerializer().serializeToString(svg)], { type: 'image/svg+xml' }));
        const img = new Image();
        img.src = url;
        await img.decode();
        const copy = document.createElement('canvas');
        copy.width = w;
        copy.height = h;
        const ctx = copy.getContext('2d');
        ctx.drawImage(img, 0, 0, w, h);
        URL.revokeObjectURL(url);
        const b = ctx.getImageData(0, 0, w, h).data;
        let differ = 0;
        let sum = 2166136261;
        for (let i = 0; i < a.length; i++) sum = Math.imul(sum ^ a[i], 16777619);
        for (let i = 0; i < a.length; i += 4) if (Math.max(Math.abs(a[i] - b[i]), Math.abs(a[i + 1] - b[i + 1]), Math.abs(a[i + 2] - b[i + 2])) > 40) differ++;
        return { w, h, cssW: canvas.getBoundingClientRect().width, svgW: Number(svg.getAttribute('width')), svgH: Number(svg.getAttribute('height')), differ: differ / (w * h), sum: sum >>> 0, corner: [...a.slice(0, 3)], label: canvas.getAttribute('aria-label'), role: canvas.getAttribute('role') };
      })()`;
      type Compared = { w: number; h: number; cssW: number; svgW: number; svgH: number; differ: number; sum: number; corner: number[]; label: string; role: string };
      const check = (c: Compared, g: FlowGraph) => {
        // Pixel size: the drawing's CSS size times the device pixel ratio (2); shown at the drawing's size (zoom 100 %).
        expect([c.w, c.h]).toEqual([Math.round(c.svgW * 2), Math.round(c.svgH * 2)]);
        expect(c.cssW).toBeCloseTo(c.svgW, 0);
        // The dark palette's background, #171e1b (flow-palette.ts).
        expect(c.corner).toEqual([0x17, 0x1e, 0x1b]);
        // The same picture: under 1 % of the pixels differ (glyph edges; tests/.artifacts/flow-canvas-vs-svg.txt has the share measured).
        expect(c.differ).toBeLessThan(0.01);
        // The canvas's name sums the flows: the source's power and the loads'.
        expect(c.role).toBe('img');
        const loads = g.nodes.filter((n) => n.role === 'load').reduce((s, n) => s + n.watts, 0);
        expect(c.label).toContain(`the source delivers ${formatPower(g.sourcePower, 'en-US')}, the loads use ${formatPower(loads, 'en-US')}`);
      };
      const before = (await page.evaluate(COMPARE)) as Compared;
      check(before, demoGraph('hillside-relay-hut'));

      // An edit: the canvas shows it in the edit's frame; the SVG over it follows when the page is idle.
      await page.locator('[data-testid="stage-card"][data-card-id="radios"]').click();
      const field = page.locator('[data-testid="stage-form"][data-element-id="radios"] [data-testid="field-power"]');
      await field.fill('120');
      const demo = demoProjects.find((d) => d.id === 'hillside-relay-hut')!.project;
      const edited = solveProject({ ...demo, elements: demo.elements.map((e) => (e.id === 'radios' ? { ...e, power: 120 } : e)) });
      if (!edited.ok) throw new Error('the edited demo does not solve');
      const g = flowGraph(edited.result);
      const radios = g.nodes.find((n) => n.id === 'radios')!;
      await expect
        .poll(() => page.locator('g.flow__node[data-node="radios"] text:not([font-weight])').first().textContent())
        .toBe(`${formatPower(radios.watts, 'en-US')} · ${formatPercent(radios.percent / 100, 'en-US', 3)}`);
      const after = (await page.evaluate(COMPARE)) as Compared;
      check(after, g);
      // (the canvas did change: its pixels' checksum, FNV-1a over the RGBA bytes)
      expect(after.sum).not.toBe(before.sum);
      writeFileSync(join(artifacts, 'flow-canvas-vs-svg.txt'), `share of pixels differing, canvas against the SVG: ${before.differ} before the edit, ${after.differ} after\n`);
      await page.getByTestId('energy-flow').screenshot({ path: join(artifacts, 'flow-desktop-dark-2x-canvas.png') });

      // A drawing too large for a canvas at the screen's density (over 16 M pixels or 16 384 on a side,
      // flow-canvas.ts) is shown by the SVG itself: the 30-element chain at 200 % and two device pixels per px.
      await page.getByTestId('open-file').setInputFiles({ name: 'thirty.json', mimeType: 'application/json', buffer: Buffer.from(JSON.stringify(thirtyElementChain())) });
      await page.locator('g.flow__node[data-node="fan2"]').waitFor();
      const shown = async () =>
        (await page.evaluate(`(() => {
          const svg = document.querySelector('[data-testid="flow-svg"]');
          return { canvas: document.querySelectorAll('[data-testid="flow-canvas"]').length, opacity: getComputedStyle(svg).opacity, w: Number(svg.getAttribute('width')), h: Number(svg.getAttribute('height')) };
        })()`)) as { canvas: number; opacity: string; w: number; h: number };
      const full = await shown();
      expect(full).toMatchObject({ canvas: 1, opacity: '0' });
      // (at 200 %, 4 device pixels per drawing px: past 16 M pixels)
      expect(full.w * 4 * full.h * 4).toBeGreaterThan(16e6);
      await page.getByTestId('flow-zoom-in').click();
      await page.getByTestId('flow-zoom-in').click();
      await expect.poll(() => page.locator('.flow__zoom-level').textContent()).toBe('200%');
      await expect.poll(async () => (await shown()).canvas).toBe(0);
      expect((await shown()).opacity).toBe('1');
      // Its parts are then drawn in the theme's colours and can be pointed at as before.
      await page.locator('g.flow__node[data-node="fan2"] rect').first().click();
      await expect.poll(() => page.getByTestId('flow-details').innerText()).toContain(`${chainGraph().nodes.find((n) => n.id === 'fan2')!.name} (`);
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
      // A name too long for its label (an invented 400-character one) is shortened in the drawing and
      // given in full in the exported file's legend.
      const long = 'Feeder from the main board to the far pump house. '.repeat(8).trim();
      const project = {
        format: 'joulepath-project',
        version: 2,
        name: 'Long name',
        elements: [
          { id: 'grid', kind: 'grid', phases: 3, voltage: 400, frequency: 50, resistance: 0.01, reactance: 0.03 },
          { id: 'run', name: long, kind: 'cable', from: 'grid', length: 50, resistancePerKm: 0.727, reactancePerKm: 0.08 },
          { id: 'pump', name: 'Pump', kind: 'ac-load', from: 'run', power: 5000, powerFactor: 0.85 },
        ],
      };
      await page.getByTestId('open-file').setInputFiles({ name: 'long-name.json', mimeType: 'application/json', buffer: Buffer.from(JSON.stringify(project)) });
      await page.locator('g.flow__node[data-node="run"]').waitFor();
      expect(await page.locator('g.flow__node[data-node="run"]').getAttribute('data-full-name')).toBe(long);
      const [longDownload] = await Promise.all([page.waitForEvent('download'), page.getByTestId('flow-export-svg').click()]);
      const legend = (await page.evaluate(`(() => {
        const doc = new DOMParser().parseFromString(${JSON.stringify(readFileSync(await longDownload.path(), 'utf8'))}, 'image/svg+xml');
        return [...doc.querySelectorAll('text[data-legend-name]')].map((t) => t.textContent).join(' ');
      })()`)) as string;
      expect(legend.replace(/\s+/g, ' ')).toContain(`• ${long}`);
      expect(errors).toEqual([]);
    } finally {
      await context.close();
    }
  });
});
