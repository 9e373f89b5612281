/**
 * Every factor of the battery study and the running cost as an input, in real Chromium against a
 * production build: each input typed (US units and SI; de-DE number format for one run), its typical
 * value and why under the field, its effect on a shown figure (checked against core run here on the
 * same inputs), a bad value's message at its field with the last good study kept and marked out of
 * date, the device's earlier price filling a project without its own, and axe clean with the settings
 * open, phone and desktop. Screenshots go to tests/.artifacts/.
 *
 * Check values: core's own study on the same inputs (the engine is checked against its sources in
 * tests/core/study-defaults.test.ts and tests/core/running-cost.test.ts); 32 °F = 0 °C (NIST SP 811
 * B.9, °C = (°F − 32) / 1.8); the cost as losses × hours × price (tests/core/running-cost.test.ts).
 */
import { join } from 'node:path';
import type { Browser, Locator, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { skipWithout } from '../tools/system-tools.ts';
import { VIEWPORTS, answersSettled, artifacts, chooseSetting, openDemo as openDemoIn, seriousAxeViolations, serveBuiltApp, type ServedApp } from './harness.ts';
import { demoProjects, runBackupStudy, solveProject } from '../../core/index.ts';
import { lossCostPerYear } from '../../core/studies/economics.ts';
import { formatDuration, formatEnergy, formatSignificant, formatVoltage } from '../../web/format/number.ts';
import { formatMoney } from '../../web/format/panels.ts';
import { onSolved } from '../core/solved.ts';

type Json = Record<string, unknown>;
const demo = (id: string): Json => structuredClone(demoProjects.find((x) => x.id === id)!.project) as unknown as Json;

/** Spaces of every kind as one ASCII space (the page joins numbers and units with a narrow no-break space). */
const plain = (s: string | null | undefined) => (s ?? '').replace(/[\s\u202f\u00a0]+/g, ' ').trim();

/** The hillside demo with backup settings changed, and the battery's overrides. */
function hillside(backup: Json, overrides?: Json): Json {
  const p = demo('hillside-relay-hut');
  p['backup'] = { ...(p['backup'] as Json), ...backup };
  if (overrides) {
    const bank = (p['elements'] as Json[]).find((e) => e['kind'] === 'battery')!;
    bank['bank'] = { ...(bank['bank'] as Json), overrides };
  }
  return p;
}

function studyOf(p: Json) {
  const o = onSolved(runBackupStudy, p);
  if (!o.ok) throw new Error(JSON.stringify(o.problems));
  return o.study;
}

describe.skipIf(skipWithout('chromium'))('study inputs in Chromium', () => {
  let app: ServedApp | undefined;
  let browser: Browser | undefined;
  let baseUrl = '';

  beforeAll(async () => {
    app = await serveBuiltApp('joulepath-study-inputs-build-');
    ({ browser, baseUrl } = app);
  });

  afterAll(async () => {
    await app?.close();
  });

  const openDemo = (id: string, viewport: { width: number; height: number }, opts: { colorScheme?: 'light' | 'dark'; devicePrice?: { pricePerKWh: number; hoursPerYear: number } } = {}) =>
    openDemoIn(browser!, viewport, id, {
      baseUrl,
      colorScheme: opts.colorScheme ?? 'light',
      // The price and hours as the page kept them on the device before they moved into the project.
      ...(opts.devicePrice ? { initScript: `localStorage.setItem('joulepath.cost.v1', ${JSON.stringify(JSON.stringify(opts.devicePrice))})` } : {}),
    });

  async function openPanel(page: Page, id: 'battery' | 'machines'): Promise<Locator> {
    const panel = page.getByTestId(`panel-${id}`);
    await panel.locator('summary').click();
    const body = page.getByTestId(`${id}-panel`);
    await body.waitFor();
    return body;
  }

  const noOverflow = (page: Page) => page.evaluate('document.documentElement.scrollWidth - window.innerWidth');

  it('battery, desktop, US units: each input typed changes its figure; a bad value is marked at its field, the last study kept out of date', async () => {
    const { context, page, errors } = await openDemo('hillside-relay-hut', VIEWPORTS.desktop);
    try {
      await chooseSetting(page, 'units-select', 'us');
      const body = await openPanel(page, 'battery');
      await page.getByTestId('battery-runtime').waitFor();
      const settings = page.getByTestId('battery-settings');
      // The typical value and why, one line under each field.
      const settingsText = plain(await settings.textContent());
      expect(settingsText).toContain('Typical 1.10–1.15 (IEEE 485): room for load growth');
      expect(settingsText).toContain('Typical 1.25: end of life at 80 % of rated capacity; typical value: use the maker’s figure');
      expect(settingsText).toContain('Empty: 2.5 V, the Lithium iron phosphate (LiFePO4) preset');
      expect(settingsText).toContain('Typical 85–95 % for a switch-mode charger');
      expect(settingsText).not.toMatch(/from memory|no source/);
      // Each help line is the field's description for screen readers.
      expect(await page.getByTestId('battery-design-margin').getAttribute('aria-describedby')).toBe('study-backup-designMargin-help');

      const current = () => expect.poll(() => body.getAttribute('data-state')).toBe('current');
      let inputs: Json = {};
      let overrides: Json | undefined;

      // Charger efficiency 80 %: the recharge's AC energy is the DC energy ÷ 0.8.
      await page.getByTestId('battery-charger-efficiency').fill('80');
      inputs = { ...inputs, chargerEfficiency: 0.8 };
      let expected = studyOf(hillside(inputs));
      await expect.poll(async () => plain(await page.getByTestId('battery-recharge-ac-energy').textContent())).toBe(plain(formatEnergy(expected.recharge!.acInputEnergyWh, 'en-US')));

      // Design margin 1.15 and aging factor 1.0: the sizing's factors and the bank it gives.
      await page.getByTestId('battery-design-margin').fill('1.15');
      await page.getByTestId('battery-aging-factor').fill('1');
      inputs = { ...inputs, designMargin: 1.15, agingFactor: 1 };
      expected = studyOf(hillside(inputs));
      // Polled, not read once: "aging factor ×1" is also a prefix of the earlier "×1.25", so the sizing's
      // words can match before the aging factor's study has come back.
      await expect.poll(async () => plain(await page.getByTestId('battery-sizing-ah').textContent())).toBe(plain(`${formatSignificant(expected.sizing!.bankCapacity, 4, 'en-US')} Ah`));
      await expect.poll(async () => plain(await page.getByTestId('battery-sizing').textContent())).toMatch(/Design margin ×1\.15, aging factor ×1(?!\.?\d)/);

      // Cell temperature in °F: 32 °F = 0 °C; the runtime follows the colder bank.
      await page.getByTestId('battery-temperature').fill('32');
      inputs = { ...inputs, temperatureC: 0 };
      expected = studyOf(hillside(inputs));
      await expect.poll(async () => plain(await page.getByTestId('battery-runtime').textContent())).toBe(plain(formatDuration(expected.discharge.runtimeSeconds, 'en-US')));

      // Cut-off 3.0 V per cell (the battery's own field): 16 cells × 3.0 V = 48 V shown as the cut-off.
      await page.getByTestId('battery-cutoff').fill('3');
      overrides = { endOfDischargeCellVoltage: 3 };
      expected = studyOf(hillside(inputs, overrides));
      expect(expected.discharge.cutoffVoltage).toBeCloseTo(48, 9);
      await expect.poll(async () => plain(await page.getByTestId('battery-cutoff-voltage').textContent())).toBe(plain(`cut-off ${formatVoltage(48, 'en-US')}`));

      // Standard capacities: the bank is built of a listed capacity.
      await page.getByTestId('battery-standard-capacities').fill('150; 300');
      inputs = { ...inputs, standardCapacitiesAh: [150, 300] };
      expected = studyOf(hillside(inputs, overrides));
      expect([150, 300]).toContain(expected.sizing!.capacityPerString);
      await expect.poll(async () => plain(await page.getByTestId('battery-sizing-ah').textContent())).toBe(plain(`${formatSignificant(expected.sizing!.bankCapacity, 4, 'en-US')} Ah`));
      await current();

      // A bad value: the message at its field; the last good figures stay, marked out of date.
      const shownEnergy = plain(await page.getByTestId('battery-recharge-ac-energy').textContent());
      await page.getByTestId('battery-charger-efficiency').fill('0');
      await expect.poll(() => body.getAttribute('data-state')).toBe('stale');
      expect(await page.locator('#study-backup-chargerEfficiency-error').textContent()).toMatch(/efficiency must be greater than 0/);
      expect(await page.getByTestId('battery-charger-efficiency').getAttribute('aria-invalid')).toBe('true');
      expect(plain(await page.getByTestId('battery-recharge-ac-energy').textContent())).toBe(shownEnergy);
      expect(await body.locator('.notice--stale').textContent()).toContain('Out of date');
      // The cut-off above the cell's nominal voltage (3.2 V for LiFePO4): refused at the battery's own field.
      await page.getByTestId('battery-charger-efficiency').fill('80');
      await current();
      await page.getByTestId('battery-cutoff').fill('3.5');
      await expect.poll(async () => page.locator('#study-bank-bank-overrides-endOfDischargeCellVoltage-error').textContent()).toMatch(/not below the nominal 3.2 V\/cell/);
      await expect.poll(() => body.getAttribute('data-state')).toBe('stale');
      expect(plain(await page.getByTestId('battery-cutoff-voltage').textContent())).toBe(plain(`cut-off ${formatVoltage(48, 'en-US')}`));
      await page.getByTestId('battery-cutoff').fill('3');
      await current();

      expect(await seriousAxeViolations(page)).toEqual([]);
      expect(await noOverflow(page)).toBeLessThanOrEqual(0);
      await page.getByTestId('battery-settings').screenshot({ path: join(artifacts, 'study-inputs-battery-desktop-us.png') });
      expect(errors).toEqual([]);
    } finally {
      await context.close();
    }
  });

  it('battery, phone, dark, de-DE number format: a decimal comma typed, the help lines fit, axe clean', async () => {
    const { context, page, errors } = await openDemo('hillside-relay-hut', VIEWPORTS.phone, { colorScheme: 'dark' });
    try {
      await chooseSetting(page, 'locale-select', 'de-DE');
      const body = await openPanel(page, 'battery');
      await page.getByTestId('battery-runtime').waitFor();
      await page.getByTestId('battery-design-margin').fill('1,15');
      const expected = studyOf(hillside({ designMargin: 1.15 }));
      await expect.poll(async () => plain(await page.getByTestId('battery-sizing').textContent())).toContain('Design margin ×1,15');
      expect(plain(await page.getByTestId('battery-sizing-ah').textContent())).toBe(plain(`${formatSignificant(expected.sizing!.bankCapacity, 4, 'de-DE')} Ah`));
      // A dot is a group mark in de-DE, not a decimal: "1.15" is no number there, and says so at the field.
      await page.getByTestId('battery-design-margin').fill('1.15');
      await expect.poll(() => body.getAttribute('data-state')).toBe('stale');
      expect(await page.locator('#study-backup-designMargin-error').textContent()).toMatch(/Design margin/);
      await page.getByTestId('battery-design-margin').fill('1,15');
      await expect.poll(() => body.getAttribute('data-state')).toBe('current');
      expect(await seriousAxeViolations(page)).toEqual([]);
      expect(await noOverflow(page)).toBeLessThanOrEqual(0);
      await page.getByTestId('battery-settings').screenshot({ path: join(artifacts, 'study-inputs-battery-phone-dark-de.png') });
      expect(errors).toEqual([]);
    } finally {
      await context.close();
    }
  });

  it('running cost: the price and hours kept in the project, the answers strip following; a bad value marked at its field, the last cost kept out of date', async () => {
    const project = demo('riverside-pump-station');
    const solved = solveProject(project);
    if (!solved.ok) throw new Error('the demo does not solve');
    for (const [label, viewport] of Object.entries(VIEWPORTS)) {
      const locale = label === 'phone' ? 'de-DE' : 'en-US';
      // The phone in the dark theme, the desktop in the light one.
      const { context, page, errors } = await openDemo('riverside-pump-station', viewport, { colorScheme: label === 'phone' ? 'dark' : 'light' });
      try {
        if (locale === 'de-DE') await chooseSetting(page, 'locale-select', 'de-DE');
        const body = await openPanel(page, 'machines');
        const section = page.getByTestId('loss-cost');
        expect(plain(await section.textContent())).toContain(locale === 'de-DE' ? '8.760 h runs all year' : '8,760 h runs all year');
        await page.getByTestId('cost-price').fill(locale === 'de-DE' ? '0,2' : '0.2');
        await page.getByTestId('cost-hours').fill('6000');
        const cost = lossCostPerYear(solved.result, { pricePerKWh: 0.2, hoursPerYear: 6000 });
        if (!cost.ok) throw new Error('refused');
        const money = plain(formatMoney(cost.cost.totalCost, locale));
        await expect.poll(async () => plain(await page.getByTestId('loss-cost-total').textContent())).toBe(money);
        await expect.poll(() => body.getAttribute('data-state')).toBe('current');
        // The answers strip reads the same price and hours from the project.
        await answersSettled(page);
        await expect.poll(async () => plain(await page.getByTestId('answer-loss-cost').textContent())).toBe(money);

        // Hours past a leap year: the engine's message at the field, the last cost kept and marked out of date.
        await page.getByTestId('cost-hours').fill('9000');
        await expect.poll(async () => page.locator('#study-running-hoursPerYear-error').textContent()).toMatch(/8784/);
        await expect.poll(() => body.getAttribute('data-state')).toBe('stale');
        expect(await page.getByTestId('loss-cost-stale').textContent()).toContain('Out of date');
        expect(plain(await page.getByTestId('loss-cost-total').textContent())).toBe(money);
        expect(await seriousAxeViolations(page)).toEqual([]);
        await section.screenshot({ path: join(artifacts, `study-inputs-cost-${label}.png`) });
        await page.getByTestId('cost-hours').fill('6000');
        await expect.poll(() => body.getAttribute('data-state')).toBe('current');
        expect(await page.getByTestId('loss-cost-stale').count()).toBe(0);
        expect(await noOverflow(page)).toBeLessThanOrEqual(0);
        expect(errors).toEqual([]);
      } finally {
        await context.close();
      }
    }
  });

  it("the device's earlier price fills a project without its own, and says so", async () => {
    const project = demo('riverside-pump-station');
    const solved = solveProject(project);
    if (!solved.ok) throw new Error('the demo does not solve');
    const { context, page, errors } = await openDemo('riverside-pump-station', VIEWPORTS.desktop, { devicePrice: { pricePerKWh: 0.3, hoursPerYear: 5000 } });
    try {
      await openPanel(page, 'machines');
      expect(await page.getByTestId('cost-price').inputValue()).toBe('0.3');
      expect(await page.getByTestId('cost-hours').inputValue()).toBe('5000');
      expect(await page.getByTestId('cost-from-device').textContent()).toContain('this device’s earlier setting');
      const cost = lossCostPerYear(solved.result, { pricePerKWh: 0.3, hoursPerYear: 5000 });
      if (!cost.ok) throw new Error('refused');
      await expect.poll(async () => plain(await page.getByTestId('loss-cost-total').textContent())).toBe(plain(formatMoney(cost.cost.totalCost, 'en-US')));
      // A change keeps both in the project: the note goes.
      await page.getByTestId('cost-hours').fill('5500');
      await expect.poll(() => page.getByTestId('cost-from-device').count()).toBe(0);
      expect(await page.getByTestId('cost-price').inputValue()).toBe('0.3');
      expect(errors).toEqual([]);
    } finally {
      await context.close();
    }
  });
});
