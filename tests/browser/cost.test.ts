/**
 * The cost over the years in a real browser (Debian's Chromium, playwright-core) against a production
 * build, on the riverside demo (a 480 V service, a pump on a drive with a pump duty, a lighting panel):
 * prices, years, discount rate and CO₂ factor typed in; a generator counted from typical figures; the
 * pump duty's hours taken; a purchase price typed in an element's form. Every figure shown must equal
 * core's lifetimeCost on the same project (run here, written with the page's own row words and number
 * format); a bad value is refused at its field with nothing stored. Phone 390 × 844 and desktop, axe
 * clean; screenshots in tests/.artifacts/ (cost-*.png) to look at.
 */
import { join } from 'node:path';
import type { Browser, Locator, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { skipWithout } from '../tools/system-tools.ts';
import { VIEWPORTS, artifacts, openDemo, seriousAxeViolations, serveBuiltApp, type ServedApp } from './harness.ts';
import { demoProjects, solveProject } from '../../core/index.ts';
import { lifetimeCost, typicalFuelFigures } from '../../core/studies/lifetime.ts';
import { lossCostOfSolved } from '../../core/studies/loss-over-profile.ts';
import { costSettingsOf } from '../../core/studies/economics.ts';
import { lifetimeRows, rowText } from '../../web/components/cost/lifetime-rows.ts';
import { formatMoney } from '../../web/format/panels.ts';

const plain = (s: string | null | undefined) => (s ?? '').replace(/[\s\u202f\u00a0]+/g, ' ').trim();
const demoCopy = (id: string) => structuredClone(demoProjects.find((d) => d.id === id)!.project) as unknown as Record<string, unknown> & { elements: Record<string, unknown>[] };
const riverside = () => structuredClone(demoProjects.find((d) => d.id === 'riverside-pump-station')!.project) as unknown as Record<string, unknown> & { elements: Record<string, unknown>[] };

/** Core's rows for the demo with these settings (and element prices), as the page words them in en-US. */
function expectedRows(running: Record<string, unknown>, prices: Record<string, number> = {}): Map<string, string> {
  const p = riverside();
  p['running'] = running;
  p.elements = p.elements.map((e) => (prices[e['id'] as string] !== undefined ? { ...e, price: prices[e['id'] as string] } : e));
  const s = solveProject(p);
  if (!s.ok) throw new Error(JSON.stringify(s.problems));
  const c = lifetimeCost(s);
  if (!c.ok) throw new Error(JSON.stringify(c.problems));
  return new Map(lifetimeRows(c.cost).map((r) => [r.key, plain(rowText(r, 'en-US'))]));
}

describe.skipIf(skipWithout('chromium'))('the cost over the years in Chromium', () => {
  let app: ServedApp | undefined;
  let browser: Browser | undefined;
  let baseUrl = '';

  beforeAll(async () => {
    app = await serveBuiltApp('joulepath-cost-build-');
    ({ browser, baseUrl } = app);
  });

  afterAll(async () => {
    await app?.close();
  });

  async function openSection(page: Page): Promise<Locator> {
    await page.getByTestId('panel-machines').locator('summary').click();
    await page.getByTestId('machines-panel').waitFor();
    const section = page.getByTestId('lifetime-cost');
    await section.waitFor();
    return section;
  }

  /** Every figure of the section, by its row key, as shown. */
  async function shownRows(section: Locator): Promise<Map<string, string>> {
    const cells = section.locator('[data-testid^="lifetime-"][data-testid]:is(td)');
    const out = new Map<string, string>();
    for (const cell of await cells.all()) out.set((await cell.getAttribute('data-testid'))!.slice('lifetime-'.length), plain(await cell.textContent()));
    return out;
  }

  const matches = async (section: Locator, want: Map<string, string>) => {
    await expect.poll(async () => Object.fromEntries(await shownRows(section)), { timeout: 20_000 }).toEqual(Object.fromEntries(want));
  };

  /** The section opened with a day price of 0.30, a night price of 0.10 and 10 years typed in (the hillside tests' tariff). */
  async function withTariff(page: Page): Promise<Locator> {
    const section = await openSection(page);
    await page.getByTestId('cost-price').fill('0.30');
    await section.getByTestId('lifetime-night-price').fill('0.10');
    await section.getByTestId('lifetime-years').fill('10');
    return section;
  }

  it('desktop: the hillside demo’s load profile splits the day and night prices; the mean price and the cost are core’s', async () => {
    const { context, page, errors } = await openDemo(browser!, VIEWPORTS.desktop, 'hillside-relay-hut', { baseUrl });
    try {
      const section = await withTariff(page);
      const split = section.getByTestId('lifetime-split-profile');
      await expect.poll(() => split.isDisabled()).toBe(false);
      await split.check();
      const p = demoCopy('hillside-relay-hut');
      p['running'] = { hoursPerYear: 8760, energyPricePerKWh: 0.3, nightPricePerKWh: 0.1, years: 10, dayHoursFromProfile: true };
      const s = solveProject(p);
      if (!s.ok) throw new Error(JSON.stringify(s.problems));
      const c = lifetimeCost(s);
      if (!c.ok) throw new Error(JSON.stringify(c.problems));
      expect(c.cost.dayHoursFrom).toBe('load profile');
      const want = new Map(lifetimeRows(c.cost).map((r) => [r.key, plain(rowText(r, 'en-US'))]));
      await matches(section, want);
      await expect.poll(() => section.getByTestId('lifetime-split-note').isVisible()).toBe(true);
      // "What the losses cost per year" takes the same mean price: its total is the lifetime cost's yearly losses (core's, above).
      await expect.poll(async () => plain(await page.getByTestId('loss-cost-total').textContent())).toBe(plain(formatMoney(c.cost.losses.totalCost, 'en-US')));
      await expect.poll(() => page.getByTestId('loss-cost-profile-price').isVisible()).toBe(true);
      await expect.poll(() => section.getByTestId('lifetime-table').textContent()).toContain("energy-weighted mean price: the load profile's day uses the day price for");
      expect(await seriousAxeViolations(page, '\'[data-testid="lifetime-cost"]\'')).toEqual([]);
      await section.getByTestId('lifetime-duty').screenshot({ path: join(artifacts, 'cost-profile-split.png') });
      expect(errors).toEqual([]);
    } finally {
      await context.close();
    }
  }, 300_000);

  it('desktop: the losses worked out over the hillside’s load profile; the yearly cost and the lifetime cost are core’s', async () => {
    const { context, page, errors } = await openDemo(browser!, VIEWPORTS.desktop, 'hillside-relay-hut', { baseUrl });
    try {
      const section = await withTariff(page);
      // Before: the operating point as drawn held all year (core's lossCostPerYear at the mean price).
      const before = plain(await page.getByTestId('loss-cost-total').textContent());
      await section.getByTestId('lifetime-losses-profile').check();
      const p = demoCopy('hillside-relay-hut');
      p['running'] = { hoursPerYear: 8760, energyPricePerKWh: 0.3, nightPricePerKWh: 0.1, years: 10, lossesFromProfile: true };
      const s = solveProject(p);
      if (!s.ok) throw new Error(JSON.stringify(s.problems));
      const yearly = lossCostOfSolved(s, costSettingsOf(s.project)!);
      if (!yearly.ok) throw new Error(JSON.stringify(yearly.problems));
      const c = lifetimeCost(s);
      if (!c.ok) throw new Error(JSON.stringify(c.problems));
      // The same yearly figure in both places (core's, worked over the profile's day: loss-over-profile.ts).
      expect(c.cost.losses.totalCost).toBeCloseTo(yearly.cost.totalCost, 9);
      await expect.poll(async () => plain(await page.getByTestId('loss-cost-total').textContent())).toBe(plain(formatMoney(yearly.cost.totalCost, 'en-US')));
      expect(plain(await page.getByTestId('loss-cost-total').textContent())).not.toBe(before);
      await expect.poll(() => page.getByTestId('loss-cost-over-profile').textContent()).toContain('Worked out over the load profile’s day');
      // The answers strip says how its yearly cost was counted.
      await expect.poll(() => page.locator('[data-answer="loss-cost"]').first().textContent()).toContain('over the load profile’s day');
      const want = new Map(lifetimeRows(c.cost).map((r) => [r.key, plain(rowText(r, 'en-US'))]));
      await matches(section, want);
      // The split by the profile's energy is then part of it: its box cannot be ticked.
      expect(await section.getByTestId('lifetime-split-profile').isDisabled()).toBe(true);
      expect(await seriousAxeViolations(page, '\'[data-testid="lifetime-cost"]\'')).toEqual([]);
      await section.getByTestId('lifetime-duty').screenshot({ path: join(artifacts, 'cost-over-profile.png') });
      expect(errors).toEqual([]);
    } finally {
      await context.close();
    }
  }, 300_000);

  for (const [label, viewport] of Object.entries(VIEWPORTS)) {
    it(`${label}: prices, years and CO₂ typed in give core's lifetime cost; a generator and the pump duty's hours too; a bad value stays at its field`, async () => {
      const { context, page, errors } = await openDemo(browser!, viewport, 'riverside-pump-station', { baseUrl });
      try {
        const section = await openSection(page);
        await expect.poll(() => section.getByTestId('lifetime-missing').textContent()).toContain('the years of service');

        // Prices, years, discount rate and the grid's CO₂ factor (invented figures for the demo).
        await page.getByTestId('cost-price').fill('0.30');
        await section.getByTestId('lifetime-night-price').fill('0.12');
        await section.getByTestId('lifetime-years').fill('15');
        await section.getByTestId('lifetime-discount').fill('6');
        await section.getByTestId('lifetime-co2').fill('0.35');
        const running = { hoursPerYear: 8760, energyPricePerKWh: 0.3, nightPricePerKWh: 0.12, years: 15, discountRate: 0.06, gridCo2KgPerKWh: 0.35 };
        await matches(section, expectedRows(running));
        // The formula is named beside the lifetime cost.
        await expect.poll(() => section.getByTestId('lifetime-table').textContent()).toContain('net present value at 6 % a year: purchase + Σ yearly cost ÷ (1 + r)^t, t = 1…15');

        // A bad value: refused at its field, nothing stored, the figures as they were.
        await section.getByTestId('lifetime-years').fill('0');
        const years = section.getByTestId('lifetime-years');
        await expect.poll(() => years.getAttribute('aria-invalid')).toBe('true');
        await expect.poll(() => section.locator('#study-running-years-error').textContent()).toContain('at least 1 year');
        await matches(section, expectedRows(running));
        await years.fill('15');
        await expect.poll(() => years.getAttribute('aria-invalid')).toBeNull();

        // A generator from typical figures (the chain's load, at least 20 kW: core's typical table), then its outage hours.
        const s = solveProject(riverside());
        if (!s.ok) throw new Error('riverside does not solve');
        const sourceW = s.result.elements.find((e) => e.role === 'source')!.pOut;
        const rated = Math.max(20_000, Math.ceil(sourceW / 1000) * 1000);
        // The page fills core's typical figures at three significant digits (GeneratorFuel.tsx).
        const t = typicalFuelFigures(rated)!;
        const r3 = (v: number) => Number(v.toPrecision(3));
        const typical = { quarterLoadLitresPerHour: r3(t.quarterLoadLitresPerHour), halfLoadLitresPerHour: r3(t.halfLoadLitresPerHour), fullLoadLitresPerHour: r3(t.fullLoadLitresPerHour) };
        await section.getByTestId('lifetime-generator-add').click();
        await section.getByTestId('lifetime-outage-hours').fill('40');
        const generator = {
          quarterLoadLitresPerHour: typical.quarterLoadLitresPerHour,
          halfLoadLitresPerHour: typical.halfLoadLitresPerHour,
          fullLoadLitresPerHour: typical.fullLoadLitresPerHour,
          outageHoursPerYear: 40,
          ratedPower: rated,
        };
        await matches(section, expectedRows({ ...running, generator }));
        // Typical figures are marked so under their fields.
        await expect.poll(() => section.getByTestId('lifetime-generator').textContent()).toContain('Typical value: use the maker’s figure.');
        // Fuel that falls with load is refused at the field typed, nothing stored.
        await section.getByTestId('lifetime-fuel-half').fill('0.1');
        await expect.poll(() => section.getByTestId('lifetime-fuel-half').getAttribute('aria-invalid')).toBe('true');
        await expect.poll(() => section.locator('#study-running-generator-halfLoadLitresPerHour-error').textContent()).toContain('fuel rises with load');
        await matches(section, expectedRows({ ...running, generator }));
        await section.getByTestId('lifetime-fuel-typical').click();
        await expect.poll(() => section.getByTestId('lifetime-fuel-half').getAttribute('aria-invalid')).toBeNull();

        // The pump duty's hours a year (800 + 3200 + 2600 + 1400 = 8000 h, the demo's duty).
        await section.getByTestId('lifetime-duty-hours').click();
        await matches(section, expectedRows({ ...running, hoursPerYear: 8000, generator }));
        await expect.poll(() => section.getByTestId('lifetime-notes').textContent()).toContain("the pump duty's; it says how long at each flow, not when in the day");

        expect(await page.evaluate('document.documentElement.scrollWidth - window.innerWidth')).toBeLessThanOrEqual(0);
        expect(await seriousAxeViolations(page, '\'[data-testid="machines-panel"]\'')).toEqual([]);
        await section.scrollIntoViewIfNeeded();
        await section.screenshot({ path: join(artifacts, `cost-${label}.png`) });

        // The client report (printed; rendered hidden on screen) carries the same lifetime cost and CO₂.
        const final = expectedRows({ ...running, hoursPerYear: 8000, generator });
        await expect.poll(() => page.getByTestId('report-lifetime-npv').textContent().then(plain), { timeout: 20_000 }).toBe(final.get('npv'));
        await expect.poll(() => page.getByTestId('report-lifetime-co2-years').textContent().then(plain)).toBe(final.get('co2-years'));
        await expect.poll(() => page.getByTestId('report-lifetime-yearly').textContent().then(plain)).toBe(final.get('yearly'));

        if (label === 'desktop') {
          await page.emulateMedia({ media: 'print' });
          await page.getByTestId('report-lifetime').screenshot({ path: join(artifacts, 'cost-report.png') });
          await page.emulateMedia({ media: 'screen' });
          // A purchase price in the pump's form: the sum of purchases and the lifetime cost follow.
          await page.locator('[data-testid="stage-card"][data-card-id="pump"]').click();
          const form = page.locator('[data-testid="stage-form"][data-element-id="pump"]');
          await form.waitFor();
          const price = form.locator('[data-testid="field-price"]');
          await price.fill('12500');
          await expect.poll(() => form.locator('.sf-unit').last().textContent()).toBe('$');
          await matches(section, expectedRows({ ...running, hoursPerYear: 8000, generator }, { pump: 12_500 }));
          await expect.poll(() => section.getByTestId('lifetime-purchase').textContent()).toBe('$12,500.00');
          await form.screenshot({ path: join(artifacts, 'cost-price-field.png') });
        }
        expect(errors).toEqual([]);
      } finally {
        await context.close();
      }
    }, 300_000);
  }
});
