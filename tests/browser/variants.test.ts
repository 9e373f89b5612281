/**
 * "Compare options" in the page (issue 20 point 1): on the hillside demo (a 48 V bank) one tap adds the
 * 24 V option (the 48 V button is the plan itself, shown so and not pressable); the comparison table then
 * equals core's compareVariants for that project, cell by cell and in which rows are marked as differing;
 * the two energy-flow drawings share one scale; the printed report carries the options. "Change a field"
 * offers the element's choice fields with the form's own labels and choices (the inverter's phases), and
 * that option's column equals core's solveProjectVariant of the same change. Phone 390×844 and
 * desktop; axe clean. Screenshots go to tests/.artifacts/. The expected figures are core's (checked by
 * hand-worked cases in tests/core/variants/).
 */
import { join } from 'node:path';
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { skipWithout } from '../tools/system-tools.ts';
import { VIEWPORTS, artifacts, seriousAxeViolations, serveBuiltApp, watchPageErrors, type ServedApp } from './harness.ts';
import { compareVariants, demoProjects, solveProjectVariant, systemVoltageVariant } from '../../core/index.ts';
import type { Project } from '../../core/model/project.ts';
import { variantValueText } from '../../web/components/variants/values.ts';
import { solvedOf } from '../core/solved.ts';

const plain = (s: string | null | undefined) => (s ?? '').replace(/[\s\u202f\u00a0]+/g, ' ').trim();

const hillside = demoProjects.find((d) => d.id === 'hillside-relay-hut')!.project;
const v24 = systemVoltageVariant(hillside, 24);
if (!v24.ok) throw new Error('the 24 V option of the hillside demo is refused');
const withVariant = { ...hillside, variants: [v24.variant] } as Project;
// Core's comparison for the project as the page will hold it (no energy price in the demo or the fresh browser).
const expected = compareVariants(solvedOf(withVariant), withVariant.variants);

describe.skipIf(skipWithout('chromium'))('compare options in Chromium', () => {
  let app: ServedApp | undefined;
  let browser: Browser | undefined;
  let baseUrl = '';

  beforeAll(async () => {
    app = await serveBuiltApp('joulepath-variants-build-');
    ({ browser, baseUrl } = app);
  });

  afterAll(async () => {
    await app?.close();
  });

  async function tableMatchesCore(page: Page): Promise<void> {
    const table = page.getByTestId('variants-panel').getByTestId('variants-table');
    await expect.poll(async () => (await table.locator('thead th').allTextContents()).map(plain), { timeout: 30_000 }).toEqual(['Figure', ...expected.columns.map((c) => c.name)]);
    for (const row of expected.rows) {
      const tr = table.locator(`tr[data-key="${row.key}"]`);
      expect(await tr.getAttribute('data-differs'), row.key).toBe(row.differs ? 'true' : 'false');
      const cells = (await tr.locator('td').allTextContents()).map(plain);
      expect(cells, row.key).toEqual(row.values.map((v) => plain(variantValueText(row, v, 'en-US'))));
    }
    expect(await table.locator('tbody tr').count()).toBe(expected.rows.length);
    // How the cost rows are worked, under the table (core's hoursPerYear: all year without a price).
    const methods = page.getByTestId('variants-panel').getByTestId('variants-methods');
    expect(plain(await methods.textContent())).toMatch(/Energy lost a year: the losses at the solved operating point × 8,?760 h a year \(no energy price given, so no cost\)\./);
  }

  for (const [label, viewport, touch] of [
    ['desktop', VIEWPORTS.desktop, false],
    ['phone', VIEWPORTS.phone, true],
  ] as const) {
    it(`hillside, ${label}: one tap adds the 24 V option; the table equals core's compareVariants; one scale for both drawings`, async () => {
      const context = await browser!.newContext({ viewport, deviceScaleFactor: 1, locale: 'en-US', hasTouch: touch, isMobile: touch });
      const page = await context.newPage();
      const errors = watchPageErrors(page);
      try {
        await page.goto(`${baseUrl}#demo=hillside-relay-hut`, { waitUntil: 'load' });
        await page.getByTestId('results').waitFor();
        const summary = page.getByTestId('panel-variants').locator('summary');
        await summary.scrollIntoViewIfNeeded();
        if (touch) await summary.tap();
        else await summary.click();
        await page.getByTestId('variants-panel').waitFor();
        // The plan is a 48 V bank: its button says so and cannot be pressed.
        expect(await page.getByTestId('variant-add-48v').isDisabled()).toBe(true);
        expect(plain(await page.getByTestId('variant-add-48v').textContent())).toBe('48 V (as planned)');
        const add = page.getByTestId('variant-add-24v');
        if (touch) await add.tap();
        else await add.click();
        await expect.poll(() => page.getByTestId('variants-status').textContent()).toBe('Added "24 V system".');
        expect(await page.getByTestId('variant-item').count()).toBe(1);
        await tableMatchesCore(page);
        // The rows core marks differ (the bank's current, the cable's current) are marked on the page, the equal loads not.
        expect(expected.rows.find((r) => r.key === 'bank.bank.current')!.differs).toBe(true);
        expect(expected.rows.find((r) => r.key === 'source.loads')!.differs).toBe(false);

        // Both drawings at one scale: the same px per W, and each source pipe as tall as its power at that scale.
        const svgs = page.getByTestId('variant-flow').locator('svg');
        await expect.poll(() => svgs.count()).toBe(2);
        const scales = await svgs.evaluateAll((list) => list.map((s) => Number(s.getAttribute('data-px-per-watt'))));
        expect(scales[0]).toBeGreaterThan(0);
        expect(scales[1]).toBe(scales[0]);
        const heights = await svgs.evaluateAll((list) => list.map((s) => Number(s.querySelector('rect[data-role="source"]')?.getAttribute('height'))));
        const powers = expected.rows.find((r) => r.key === 'source.power')!.values as number[];
        heights.forEach((h, i) => expect(h).toBeCloseTo(powers[i]! * scales[0]!, 6)); // the layout's pipe: value × px per W

        await page.getByTestId('variants-panel').screenshot({ path: join(artifacts, `variants-${label}-panel.png`) });
        await page.getByTestId('variants-panel').getByTestId('variants-table').screenshot({ path: join(artifacts, `variants-${label}-table.png`) });
        await page.getByTestId('variant-flows').screenshot({ path: join(artifacts, `variants-${label}-flows.png`) });
        // The printed report carries the options (a compact table of what differs).
        await expect.poll(async () => plain(await page.getByTestId('report-variants').textContent()), { timeout: 30_000 }).toContain('24 V system');
        // With how its cost rows are worked and the comparison's cautions.
        expect(plain(await page.getByTestId('report-variants').textContent())).toContain(plain(expected.cautions[0]));
        expect(await page.getByTestId('report-variants').getByTestId('variants-methods').count()).toBe(1);
        expect(await page.evaluate('document.documentElement.scrollWidth - window.innerWidth')).toBeLessThanOrEqual(0);
        expect(await seriousAxeViolations(page)).toEqual([]);

        // Delete: the list is empty again and the table holds the plan alone.
        await page.getByTestId('variant-delete').click();
        await expect.poll(() => page.getByTestId('variant-item').count()).toBe(0);
        await expect.poll(async () => (await page.getByTestId('variants-panel').getByTestId('variants-table').locator('thead th').allTextContents()).map(plain)).toEqual(['Figure', 'As planned']);

        // "Change a field" with a choice field: the inverter's phases, offered with the form's own label and
        // choices (web/editor/fields.ts, phasesField), the plan's own choice shown and not pickable.
        await page.getByLabel('Element', { exact: true }).selectOption({ label: '3 kW inverter' });
        await page.getByLabel('Field', { exact: true }).selectOption({ label: 'Phases' });
        const choice = page.getByTestId('variant-change-choice');
        expect((await choice.locator('option').allTextContents()).map(plain)).toEqual(['Single-phase (as planned)', 'Three-phase']);
        expect(await choice.locator('option', { hasText: 'Single-phase' }).isDisabled()).toBe(true);
        await choice.selectOption({ label: 'Three-phase' });
        const addChoice = page.getByTestId('variant-change-add');
        if (touch) await addChoice.tap();
        else await addChoice.click();
        await expect.poll(() => page.getByTestId('variants-status').textContent()).toBe('Added "3 kW inverter: Phases Three-phase".');
        // Stored in the variant's `set` like a number: the same change solved by core gives the column.
        const threePhase = { name: '3 kW inverter: Phases Three-phase', set: { inverter: { phases: 3 } } };
        const alone = solveProjectVariant(solvedOf(hillside as Project), threePhase);
        if (!alone.ok) throw new Error('the three-phase option of the hillside demo is refused');
        const withPhases = { ...hillside, variants: [threePhase] } as Project;
        const core3 = compareVariants(solvedOf(withPhases), withPhases.variants);
        const phasesTable = page.getByTestId('variants-panel').getByTestId('variants-table');
        await expect.poll(async () => (await phasesTable.locator('thead th').allTextContents()).map(plain), { timeout: 30_000 }).toEqual(['Figure', 'As planned', threePhase.name]);
        const hut = alone.result.elements.find((e) => e.id === 'hut-cable')!;
        const fromSolve: Record<string, number> = {
          'source.power': alone.result.totals.sourcePower,
          'losses.total': alone.result.totals.losses,
          'cable.hut-cable.current': hut.input!.current,
        };
        for (const [key, value] of Object.entries(fromSolve)) {
          const row = core3.rows.find((r) => r.key === key)!;
          expect(row.values[1], key).toBeCloseTo(value, 9); // the comparison's column is core's single solve of the variant
          await expect.poll(async () => plain((await phasesTable.locator(`tr[data-key="${key}"] td`).allTextContents())[1])).toBe(plain(variantValueText(row, value, 'en-US')));
        }
        // Three-phase at the same power: the hut cable carries less current (the chosen option differs, marked so).
        expect(core3.rows.find((r) => r.key === 'cable.hut-cable.current')!.differs).toBe(true);
        expect(await phasesTable.locator('tr[data-key="cable.hut-cable.current"]').getAttribute('data-differs')).toBe('true');
        await page.getByTestId('variants-panel').screenshot({ path: join(artifacts, `variants-${label}-choice.png`) });
        expect(await seriousAxeViolations(page)).toEqual([]);
        const del = page.getByTestId('variant-delete');
        if (touch) await del.tap();
        else await del.click();
        await expect.poll(() => page.getByTestId('variant-item').count()).toBe(0);

        if (!touch) {
          // "Change a field" (an element by name, a field by its label, a value in the user's units) and
          // "critical loads only" (the lights ticked as not critical): each column equals core's.
          await page.getByLabel('Element', { exact: true }).selectOption({ label: 'Vaccine fridge' });
          await page.getByLabel('Field', { exact: true }).selectOption({ label: 'Real power drawn' });
          await page.getByTestId('variant-change-value').fill('300');
          await page.getByTestId('variant-change-add').click();
          await expect.poll(() => page.getByTestId('variants-status').textContent()).toBe('Added "Vaccine fridge: Real power drawn 300 W".');
          await page.getByRole('checkbox', { name: 'Lights and sockets' }).check();
          await page.getByTestId('variant-add-critical').click();
          await expect.poll(() => page.getByTestId('variants-status').textContent()).toBe('Added "Critical loads only".');
          const two = { ...hillside, variants: [{ name: 'Vaccine fridge: Real power drawn 300 W', set: { fridge: { power: 300 } } }, { name: 'Critical loads only', note: 'without Lights and sockets (marked not critical)', remove: ['lights'] }] } as Project;
          const core2 = compareVariants(solvedOf(two), two.variants);
          const table = page.getByTestId('variants-panel').getByTestId('variants-table');
          await expect.poll(async () => (await table.locator('thead th').allTextContents()).map(plain), { timeout: 30_000 }).toEqual(['Figure', ...core2.columns.map((c) => c.name)]);
          for (const key of ['source.power', 'bank.bank.runtime', 'bank.bank.sized']) {
            const row = core2.rows.find((r) => r.key === key)!;
            await expect.poll(async () => (await table.locator(`tr[data-key="${key}"] td`).allTextContents()).map(plain)).toEqual(row.values.map((v) => plain(variantValueText(row, v, 'en-US'))));
          }
          // Without the lights the same bank lasts longer (the profile's levels for them go with them).
          const runtime = core2.rows.find((r) => r.key === 'bank.bank.runtime')!.values as number[];
          expect(runtime[2]).toBeGreaterThan(runtime[0]!);
          await page.getByTestId('variants-panel').screenshot({ path: join(artifacts, 'variants-desktop-three.png') });

          // "Add the change to" an option already listed: the inverter made three-phase in the fridge's
          // option joins its change there (one option, two elements changed); the column equals core's.
          await page.getByLabel('Add the change to', { exact: true }).selectOption({ label: 'Vaccine fridge: Real power drawn 300 W' });
          await page.getByLabel('Element', { exact: true }).selectOption({ label: '3 kW inverter' });
          await page.getByLabel('Field', { exact: true }).selectOption({ label: 'Phases' });
          await page.getByTestId('variant-change-choice').selectOption({ label: 'Three-phase' });
          expect(await page.getByTestId('variant-change-add').textContent()).toBe('Add to this option');
          await page.getByTestId('variant-change-add').click();
          await expect.poll(() => page.getByTestId('variants-status').textContent()).toBe('Changed "Vaccine fridge: Real power drawn 300 W": 3 kW inverter, Phases Three-phase.');
          const joined = { ...two, variants: [{ name: 'Vaccine fridge: Real power drawn 300 W', set: { fridge: { power: 300 }, inverter: { phases: 3 } } }, two.variants![1]!] } as Project;
          const coreJ = compareVariants(solvedOf(joined), joined.variants);
          await expect.poll(async () => (await table.locator('thead th').allTextContents()).map(plain), { timeout: 30_000 }).toEqual(['Figure', ...coreJ.columns.map((c) => c.name)]);
          for (const key of ['source.power', 'cable.hut-cable.current', 'bank.bank.runtime']) {
            const row = coreJ.rows.find((r) => r.key === key)!;
            await expect.poll(async () => (await table.locator(`tr[data-key="${key}"] td`).allTextContents()).map(plain), { timeout: 30_000 }).toEqual(row.values.map((v) => plain(variantValueText(row, v, 'en-US'))));
          }
          // Three-phase at the same power: the hut cable's current differs from the plan's in that column.
          const hutRow = coreJ.rows.find((r) => r.key === 'cable.hut-cable.current')!.values as number[];
          expect(hutRow[1]).toBeLessThan(hutRow[0]!);
          await page.getByTestId('variant-change-field').screenshot({ path: join(artifacts, 'variants-desktop-add-to.png') });
          expect(await seriousAxeViolations(page)).toEqual([]);
        }
        expect(errors).toEqual([]);
      } finally {
        await context.close();
      }
    }, 120_000);
  }
});
