/**
 * One system in both its modes in the page (issue 19): the harbour clinic demo (an online UPS, a bank
 * on its DC bus) shows a mode switch at the top of the results; switching it by keyboard and by tap
 * shows the on-battery diagram and element table, whose figures equal core's solveModes / runModesStudy
 * run here on the same project (the expected values are core's, checked by hand-worked cases in
 * tests/modes/); the warnings, the cable and the port tables follow the switch and say which mode they
 * show; the answers strip leads with both modes' answers on the first phone screen, each opening its
 * working; the printed report carries the modes section (its method on the engineer's page); the charge
 * to put back and the charge-return factor are edited in the standing-by panel as core sizes the charger;
 * phone 390×844 and desktop; axe clean. Screenshots go to tests/.artifacts/.
 */
import { writeFileSync } from 'node:fs';
import { join } from 'node:path';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { pdfPageImages, skipWithout } from '../tools/system-tools.ts';
import { VIEWPORTS, answersSettled, artifacts, chainOp, seriousAxeViolations, serveBuiltApp, showProjectsView, watchPageErrors, type ServedApp } from './harness.ts';
import { demoProjects, runModesStudy, solveModes } from '../../core/index.ts';
import { answerStudies } from '../../core/studies/index.ts';
import { formatCurrent, formatDuration, formatPercent, formatPower, formatSignificant, formatVoltage } from '../../web/format/number.ts';
import { shareHash } from '../../web/state/share.ts';
import type { DraftProject } from '../../web/state/draft.ts';
import { extractText } from 'unpdf';
import { formatMoney } from '../../web/format/panels.ts';
import { solvedOf } from '../core/solved.ts';

const demo = (id: string) => {
  const d = demoProjects.find((x) => x.id === id);
  if (!d) throw new Error(`no demo ${id}`);
  return d.project as unknown as Record<string, unknown>;
};

/** Spaces of every kind as one ASCII space (the page joins numbers and units with a narrow no-break space). */
const plain = (s: string | null | undefined) => (s ?? '').replace(/[\s\u202f\u00a0]+/g, ' ').trim();
const fmt = (w: number) => plain(formatPower(w, 'en-US'));

describe.skipIf(skipWithout('chromium'))('both modes of a bank on a bus in Chromium', () => {
  let app: ServedApp | undefined;
  let browser: Browser | undefined;
  let baseUrl = '';

  beforeAll(async () => {
    app = await serveBuiltApp('joulepath-modes-build-');
    ({ browser, baseUrl } = app);
  });

  afterAll(async () => {
    await app?.close();
  });

  async function open(url: string, viewport: { width: number; height: number }, touch = false): Promise<{ context: BrowserContext; page: Page; errors: string[] }> {
    const context = await browser!.newContext({ viewport, deviceScaleFactor: 1, locale: 'en-US', hasTouch: touch, isMobile: touch });
    const page = await context.newPage();
    const errors = watchPageErrors(page);
    await page.goto(`${baseUrl}${url}`, { waitUntil: 'load' });
    await page.getByTestId('results').waitFor();
    return { context, page, errors };
  }

  /** The P in cell of an element's row in the element table. */
  const pIn = (page: Page, id: string) => page.getByTestId('element-table').locator(`tr[data-element-id="${id}"] td`).first();
  /** The loss cell of a cable's row in the cable table. */
  const cableLoss = (page: Page, id: string) => page.getByTestId('cable-table').locator(`tr[data-element-id="${id}"] td[data-label="Loss"]`);
  /** The current cell of an element's port row in the port table. */
  const portCurrent = (page: Page, id: string, side: 'in' | 'out') => page.getByTestId('port-table').locator(`tr[data-element-id="${id}"][data-port="${side}"] td[data-label="I"]`);
  const elementOf = (r: { elements: readonly { id: string }[] }, id: string) => {
    const e = r.elements.find((x) => x.id === id);
    if (!e) throw new Error(`no element ${id}`);
    return e as (typeof solved.result.elements)[number];
  };
  const amps = (a: number) => plain(formatCurrent(a, 'en-US'));

  // Core's figures for the harbour clinic: the on-supply base solve, the on-battery variant and the modes study.
  const solved = solvedOf(demo('harbour-clinic-ups'));
  const modes = solveModes(solved)!;
  const study = runModesStudy(solved, modes);
  if (!modes.battery.ok || !study?.ok || 'ok' in study.study.battery) throw new Error('the harbour clinic demo has no on-battery mode');
  const onBattery = modes.battery.result;
  const batteryFigures = study.study.battery;
  const supplyFigures = study.study.supply;

  for (const [label, viewport, touch] of [
    ['desktop', VIEWPORTS.desktop, false],
    ['phone', VIEWPORTS.phone, true],
  ] as const) {
    it(`harbour clinic, ${label}: the switch shows each mode's diagram, table and balance, equal to core's`, async () => {
      const { context, page, errors } = await open('#demo=harbour-clinic-ups', viewport, touch);
      try {
        const sw = page.getByTestId('mode-switch');
        await sw.waitFor();
        // A radio group with its name, on supply at first.
        expect(await page.getByRole('radio', { name: 'On supply' }).isChecked()).toBe(true);
        expect(await page.getByRole('radio', { name: 'On battery' }).isChecked()).toBe(false);
        await expect.poll(() => page.getByTestId('element-table-mode').textContent()).toBe('On supply');
        // On supply the bank is a load on its bus drawing its float current; the supply's P in is the base solve's.
        await expect.poll(async () => plain(await pIn(page, 'inverter').textContent())).toBe(fmt(solved.result.elements.find((e) => e.id === 'inverter')!.pIn));
        // Both balances side by side, each equal to core's modes study.
        await expect.poll(async () => plain(await page.getByTestId('balance-supply-source').textContent())).toBe(fmt(supplyFigures.sourcePower));
        await expect.poll(async () => plain(await page.getByTestId('balance-battery-source').textContent())).toBe(fmt(batteryFigures.sourcePower));
        expect(plain(await page.getByTestId('balance-battery-losses').textContent())).toBe(fmt(batteryFigures.losses));
        expect(plain(await page.getByTestId('balance-battery-efficiency').textContent())).toBe(plain(formatPercent(batteryFigures.efficiency, 'en-US')));
        expect(plain(await page.getByTestId('balance-supply-loads').textContent())).toBe(fmt(supplyFigures.loadPower));
        // On battery the bank carries the rooms' 2400 W and the imaging's 900 W (the demo's own loads, core/demos/harbour-clinic-ups.json);
        // on supply the bank's float is a load on the bus besides them.
        expect(batteryFigures.loadPower).toBeCloseTo(3300, 6);
        expect(supplyFigures.loadPower).toBeGreaterThan(3300);
        if (label === 'desktop') {
          // Side by side on a wide screen.
          const a = await page.getByTestId('balance-supply').boundingBox();
          const b = await page.getByTestId('balance-battery').boundingBox();
          expect(Math.abs(a!.y - b!.y)).toBeLessThan(2);
          expect(b!.x).toBeGreaterThan(a!.x + a!.width - 1);
        }
        // Both modes' energy flow side by side at one scale (one px per W in both drawings), each captioned
        // with its source power: core's on-supply and on-battery solves (solveModes).
        await page.getByTestId('mode-flows').locator('summary').click();
        const drawings = page.getByTestId('mode-flows').locator('svg.variant-flow__svg');
        await expect.poll(() => drawings.count(), { timeout: 20_000 }).toBe(2);
        const scales = await drawings.evaluateAll((svgs) => svgs.map((s) => s.getAttribute('data-px-per-watt')));
        expect(scales[0]).not.toBeNull();
        expect(scales[1]).toBe(scales[0]);
        const captions = page.getByTestId('mode-flows').locator('figcaption');
        expect(plain(await captions.nth(0).textContent())).toContain(fmt(supplyFigures.sourcePower));
        expect(plain(await captions.nth(1).textContent())).toContain(fmt(batteryFigures.sourcePower));
        await page.getByTestId('modes').screenshot({ path: join(artifacts, `modes-${label}-supply.png`) });
        await page.getByTestId('mode-flows').locator('summary').click();
        // The cable and port tables say which mode they show, and on supply carry the base solve's figures
        // (the supply's cable is there; the bank's cable carries the float current, 0.1 A: core's solve of the demo).
        await expect.poll(() => page.getByTestId('cable-table-mode').textContent()).toBe('On supply');
        await expect.poll(() => page.getByTestId('port-table-mode').textContent()).toBe('On supply');
        await expect.poll(() => page.getByTestId('cable-table').locator('tr[data-element-id="supply-cable"]').count()).toBe(1);
        await expect.poll(async () => plain(await cableLoss(page, 'bank-cable').textContent())).toBe(fmt(elementOf(solved.result, 'bank-cable').loss));
        await expect.poll(async () => plain(await portCurrent(page, 'bank-cable', 'out').textContent())).toBe(amps(elementOf(solved.result, 'bank-cable').output!.current));

        // Switch: by keyboard on the desktop (focus the checked radio, arrow to the next), by tap on the phone.
        if (touch) await page.getByTestId('mode-switch').getByText('On battery', { exact: true }).tap();
        else {
          await page.getByRole('radio', { name: 'On supply' }).focus();
          await page.keyboard.press('ArrowRight');
        }
        expect(await page.getByRole('radio', { name: 'On battery' }).isChecked()).toBe(true);
        await expect.poll(() => page.getByTestId('element-table-mode').textContent()).toBe('On battery');
        await expect.poll(() => page.getByTestId('flow-mode').textContent()).toBe('Energy flow on battery');
        // The bank is the root: its row's power is the on-battery source power; the supply and rectifier are gone.
        const bankRow = onBattery.elements.find((e) => e.id === 'bank')!;
        expect(onBattery.elements[0]!.id).toBe('bank');
        await expect.poll(async () => plain(await pIn(page, 'inverter').textContent())).toBe(fmt(onBattery.elements.find((e) => e.id === 'inverter')!.pIn));
        await expect.poll(() => page.getByTestId('element-table').locator('tr[data-element-id="rectifier"]').count()).toBe(0);
        expect(await page.getByTestId('element-table').locator('tr[data-element-id="supply"]').count()).toBe(0);
        expect(plain(await pIn(page, 'bank').textContent())).toBe(fmt(bankRow.pIn));
        // The cable and port tables follow: the on-battery chain's cables and ports, each equal to core's on-battery solve.
        await expect.poll(() => page.getByTestId('cable-table-mode').textContent()).toBe('On battery');
        await expect.poll(() => page.getByTestId('port-table-mode').textContent()).toBe('On battery');
        await expect.poll(() => page.getByTestId('cable-table').locator('tr[data-element-id="supply-cable"]').count()).toBe(0);
        await expect.poll(async () => plain(await cableLoss(page, 'bank-cable').textContent())).toBe(fmt(elementOf(onBattery, 'bank-cable').loss));
        await expect.poll(async () => plain(await portCurrent(page, 'bank', 'out').textContent())).toBe(amps(elementOf(onBattery, 'bank').output!.current));
        await expect.poll(async () => plain(await portCurrent(page, 'inverter', 'in').textContent())).toBe(amps(elementOf(onBattery, 'inverter').input!.current));
        expect(await page.getByTestId('port-table').locator('tr[data-element-id="rectifier"]').count()).toBe(0);
        await page.getByTestId('cable-panel').scrollIntoViewIfNeeded();
        await page.getByTestId('cable-panel').screenshot({ path: join(artifacts, `modes-${label}-battery-cables.png`) });
        // The on-battery chain's totals row equals core's on-battery source power.
        expect(plain(await page.getByTestId('totals-row').locator('td').first().textContent())).toBe(fmt(onBattery.totals.sourcePower));
        // The diagram is of the on-battery chain: it names the bank, not the rectifier.
        await page.getByTestId('energy-flow').scrollIntoViewIfNeeded();
        await expect.poll(async () => (await page.getByTestId('energy-flow').textContent()) ?? '', { timeout: 15_000 }).toContain('VRLA bank');
        expect(await page.getByTestId('energy-flow').textContent()).not.toContain('UPS rectifier');
        await page.getByTestId('modes').scrollIntoViewIfNeeded();
        await page.getByTestId('modes').screenshot({ path: join(artifacts, `modes-${label}-battery.png`) });
        await page.screenshot({ path: join(artifacts, `modes-${label}-battery-page.png`), fullPage: false });

        // Back to on supply (keyboard on the phone too: arrows move within the group).
        await page.getByRole('radio', { name: 'On battery' }).focus();
        await page.keyboard.press('ArrowLeft');
        await expect.poll(() => page.getByTestId('element-table-mode').textContent()).toBe('On supply');
        await expect.poll(() => page.getByTestId('element-table').locator('tr[data-element-id="rectifier"]').count()).toBe(1);
        await expect.poll(() => page.getByTestId('cable-table-mode').textContent()).toBe('On supply');
        await expect.poll(() => page.getByTestId('port-table').locator('tr[data-element-id="rectifier"]').count()).toBe(2);

        expect(await page.evaluate('document.documentElement.scrollWidth - window.innerWidth')).toBeLessThanOrEqual(0);
        expect(await seriousAxeViolations(page)).toEqual([]);
        expect(errors).toEqual([]);
      } finally {
        await context.close();
      }
    }, 90_000);
  }

  it('harbour clinic: the standing-by panel shows core\'s charger sizing with N+1, the cost of standing by and the transfer; a setting edits the study', async () => {
    const s = study.study;
    const c = s.charger;
    // IEEE Std 946: A = L + k·C/H; with the demo's 10 A modules and N+1 (core/demos/harbour-clinic-ups.json `standby`),
    // modules = ⌈A ÷ 10⌉ + 1 (hand-checked in tests/modes/online-ups.test.ts).
    expect(c.modules!.needed).toBe(Math.ceil(c.requiredCurrent / 10));
    expect(c.modules!.installed).toBe(c.modules!.needed + 1);
    const { context, page, errors } = await open('#demo=harbour-clinic-ups', VIEWPORTS.phone, true);
    try {
      await page.getByTestId('panel-standby').locator('summary').tap();
      const panel = page.getByTestId('standby-panel');
      await panel.waitFor();
      await expect.poll(() => panel.getAttribute('data-state'), { timeout: 15_000 }).toBe('ready');
      expect(plain(await page.getByTestId('standby-required-current').textContent())).toBe(plain(formatCurrent(c.requiredCurrent, 'en-US')));
      expect(plain(await page.getByTestId('standby-recharge-current').textContent())).toBe(plain(formatCurrent(c.rechargeCurrent, 'en-US')));
      expect(plain(await page.getByTestId('standby-modules').textContent())).toBe(`${c.modules!.needed} needed, ${c.modules!.installed} with N+1`);
      expect(plain(await page.getByTestId('standby-charger').textContent())).toContain('IEEE');
      expect(plain(await page.getByTestId('standby-losses').textContent())).toBe(fmt(s.standing.total));
      expect(plain(await page.getByTestId('standby-energy').textContent())).toBe(`${plain(formatSignificant(s.standing.energyKWh, 4, 'en-US'))} kWh`);
      // Priced at the demo's 0.28 per kWh (its `running` settings).
      expect(plain(await page.getByTestId('standby-cost-year').textContent())).toBe(plain(formatMoney(s.standing.cost!, 'en-US')));
      expect(plain(await page.getByTestId('standby-bus-transfer').textContent())).toBe(plain(formatVoltage(s.transfer!.busVoltageAtTransfer, 'en-US')));
      expect(plain(await page.getByTestId('standby-current-step').textContent())).toBe(plain(formatCurrent(s.transfer!.currentStep, 'en-US')));
      expect(await page.getByTestId('standby-which-mode').textContent()).toContain('battery backup study: on battery');
      expect(await page.getByTestId('standby-cautions').textContent()).toContain('Local electrical codes');
      await panel.screenshot({ path: join(artifacts, 'modes-phone-standby-panel.png') });

      // Redundancy "None": the installed modules fall to those needed (core's own rule, run here on the changed project).
      await page.getByTestId('standby-redundancy').selectOption('none');
      const changed = structuredClone(demo('harbour-clinic-ups')) as { standby: Record<string, unknown> };
      changed.standby['redundancy'] = 'none';
      const again = runModesStudy(solvedOf(changed));
      if (!again?.ok) throw new Error('the changed demo does not solve');
      await expect.poll(async () => plain(await page.getByTestId('standby-modules').textContent())).toBe(`${again.study.charger.modules!.needed} needed`);
      expect(again.study.charger.modules!.installed).toBe(again.study.charger.modules!.needed);

      // The module current typed in: the count follows (core on the changed project).
      const input = page.getByTestId('standby-module-current');
      await input.fill('25');
      await input.blur();
      changed.standby['moduleCurrent'] = 25;
      const third = runModesStudy(solvedOf(changed));
      if (!third?.ok) throw new Error('the changed demo does not solve');
      await expect.poll(async () => plain(await page.getByTestId('standby-modules').textContent())).toBe(`${third.study.charger.modules!.needed} needed`);
      expect(await seriousAxeViolations(page)).toEqual([]);
      expect(errors).toEqual([]);
    } finally {
      await context.close();
    }
  }, 90_000);

  for (const [label, viewport, touch] of [
    ['desktop', VIEWPORTS.desktop, false],
    ['phone', VIEWPORTS.phone, true],
  ] as const) {
    it(`a DC plant built in the page, ${label}: "Add a battery bank on this bus" on the bus card, then both modes`, async () => {
      const context = await browser!.newContext({ viewport, deviceScaleFactor: 1, locale: 'en-US', hasTouch: touch, isMobile: touch });
      const page = await context.newPage();
      const errors = watchPageErrors(page);
      try {
        await page.goto(baseUrl, { waitUntil: 'load' });
        await showProjectsView(page);
        await page.getByTestId('new-chain').click();
        await page.locator('button[data-source="grid-1-230"]').click();
        const cards = page.getByTestId('stage-card');
        await expect.poll(() => cards.count()).toBe(1);
        const add = async (op: string, kind: string) => {
          await chainOp(page, op);
          await page.getByTestId('kind-chooser').waitFor();
          await page.locator(`.kind-option[data-kind="${kind}"]`).click();
        };
        // Supply → rectifier (its 48 V template) → DC bus → a DC load on the bus.
        await add('op-add-after', 'rectifier');
        await expect.poll(() => cards.count()).toBe(2);
        await add('op-add-after', 'dc-bus');
        await expect.poll(() => cards.count()).toBe(3);
        await add('op-add-branch', 'dc-load');
        await expect.poll(() => cards.count()).toBe(4);
        // One mode only so far: no switch.
        expect(await page.getByTestId('mode-switch').count()).toBe(0);
        // The bus card offers the bank; the load card does not.
        await cards.nth(3).click();
        await expect.poll(() => page.getByTestId('card-tools').count()).toBe(1);
        expect(await page.locator('[data-testid="op-add-bank"]').count()).toBe(0);
        await cards.nth(2).click();
        await chainOp(page, 'op-add-bank');
        await expect.poll(() => cards.count()).toBe(5);
        // 48 V ÷ (6 cells × 2.27 V per cell, VRLA float: common practice (no source)) = 3.5 → 4 blocks of 12 V.
        await expect.poll(() => page.getByTestId('chain-editor').innerText()).toContain('Battery bank, 4 × 12 V 100 Ah');
        // Both modes now: the switch, and on battery the bank at the root of the element table.
        await page.getByTestId('mode-switch').waitFor({ timeout: 15_000 });
        await expect.poll(async () => plain(await page.getByTestId('balance-battery-loads').textContent()), { timeout: 15_000 }).toBe(fmt(100));
        if (touch) await page.getByTestId('mode-switch').getByText('On battery', { exact: true }).tap();
        else await page.getByRole('radio', { name: 'On battery' }).check();
        await expect.poll(() => page.getByTestId('element-table-mode').textContent()).toBe('On battery');
        await expect.poll(() => page.getByTestId('element-table').locator('tbody tr').first().getAttribute('data-element-id')).toBe('bank');
        // The rectifier template's id is "charger" (web/editor/templates.ts): cut from the on-battery chain.
        await expect.poll(() => page.getByTestId('element-table').locator('tr[data-element-id="charger"]').count()).toBe(0);
        // The card's tools no longer offer a second bank (one bank on a bus per project).
        await cards.nth(2).click();
        await expect.poll(() => page.getByTestId('card-tools').count()).toBe(1);
        expect(await page.locator('[data-testid="op-add-bank"]').count()).toBe(0);
        await page.getByTestId('modes').scrollIntoViewIfNeeded();
        await page.screenshot({ path: join(artifacts, `modes-${label}-built-plant.png`) });
        expect(await page.evaluate('document.documentElement.scrollWidth - window.innerWidth')).toBeLessThanOrEqual(0);
        expect(await seriousAxeViolations(page)).toEqual([]);
        expect(errors).toEqual([]);
      } finally {
        await context.close();
      }
    }, 90_000);
  }
  // The study answers of the demo (core/studies/answers.ts: the backup study runs on battery for a bank on a bus).
  const bankAnswer = answerStudies(solved, null).banks.find((b) => b.elementId === 'bank')!;

  for (const [label, viewport, touch] of [
    ['phone', VIEWPORTS.phone, true],
    ['desktop', VIEWPORTS.desktop, false],
  ] as const) {
    it(`harbour clinic, ${label}: the answers strip leads with both modes' answers, on the first screen, each opening its working`, async () => {
      const { context, page, errors } = await open('#demo=harbour-clinic-ups', viewport, touch);
      try {
        const s = study.study;
        const supplyLine = page.locator('[data-answer="mode-supply"]');
        const batteryLine = page.locator('[data-answer="mode-battery"]');
        // On supply: the supply's power with the bank on float (core's modes study: 4.04 kW), the modules with N+1
        // (A = L + k·C/H = 28.9 A in 10 A modules, C the charge the outage drew: 3 needed + 1 spare, IEEE Std 946;
        // hand-checked in tests/modes/online-ups.test.ts)
        // and the yearly cost of standing by (at the demo's 0.28 per kWh).
        await expect.poll(async () => plain(await page.getByTestId('answer-supply-power').textContent()), { timeout: 20_000 }).toBe(fmt(s.supply.sourcePower));
        expect(plain(await page.getByTestId('answer-modules').textContent())).toBe(`${s.charger.modules!.installed} × ${amps(10)}`);
        expect(s.charger.modules!.installed).toBe(4);
        expect(plain(await supplyLine.textContent())).toContain(`${amps(10)} (N+1) · standing by`);
        await expect.poll(async () => plain(await page.getByTestId('answer-standby-cost').textContent())).toBe(plain(formatMoney(s.standing.cost!, 'en-US')));
        // On battery: the runtime to the end of discharge and the bank's current (core's backup study of the on-battery mode).
        await expect.poll(async () => plain(await page.getByTestId('answer-runtime').textContent()), { timeout: 20_000 }).toBe(plain(formatDuration(bankAnswer.runtimeSeconds, 'en-US')));
        expect(plain(await page.getByTestId('answer-bank-current').textContent())).toBe(amps(bankAnswer.peakCurrent));
        expect(plain(await batteryLine.textContent())).toContain('meets the 30 min target');
        expect(await page.getByTestId('answer-runtime').getAttribute('title')).toContain('to the end of discharge');
        // The bank for the 30 min target rides on the same line: 100 Ah (core's sizing of the demo, IEEE 485 in core/studies/backup).
        expect(plain(await page.getByTestId('answer-sized-bank').textContent())).toBe(`${plain(formatSignificant(bankAnswer.sizedCapacityAh!, 4, 'en-US'))} Ah`);
        expect(plain(await batteryLine.textContent())).toContain('bank for 30 min');
        // The modes' lines come first in the strip, above the four balance figures.
        const first = await supplyLine.boundingBox();
        const second = await batteryLine.boundingBox();
        const figures = await page.getByTestId('energy-balance').boundingBox();
        expect(first!.y).toBeLessThan(second!.y);
        expect(second!.y).toBeLessThan(figures!.y);
        if (label === 'phone') {
          // On the first phone screen (844 px high) without scrolling.
          expect(await page.evaluate('window.scrollY')).toBe(0);
          expect(second!.y + second!.height).toBeLessThanOrEqual(844);
          // The whole strip within 70 % of the screen (tests/browser/answers.test.ts's guard against bloat) and, from the
          // project's name, on one screen.
          await answersSettled(page);
          await page.screenshot({ path: join(artifacts, 'modes-phone-answers.png'), fullPage: false });
          const strip = (await page.getByTestId('answers').boundingBox())!;
          const heading = (await page.locator('#project-heading').boundingBox())!;
          console.log(`harbour clinic phone: strip ${strip.y.toFixed(0)}–${(strip.y + strip.height).toFixed(0)} px (${strip.height.toFixed(0)} px high)`);
          expect(strip.height).toBeLessThan(0.7 * 844);
          expect(strip.y + strip.height - heading.y).toBeLessThan(844);
        } else {
          await page.getByTestId('answers').screenshot({ path: join(artifacts, 'modes-desktop-answers.png') });
        }
        expect(await seriousAxeViolations(page)).toEqual([]);

        // Each figure opens its working: the modules the standing-by panel at its module count, the runtime the battery panel.
        if (touch) await page.getByTestId('answer-modules').tap();
        else await page.getByTestId('answer-modules').click();
        await expect.poll(() => page.getByTestId('panel-standby').getAttribute('open')).not.toBeNull();
        await expect.poll(() => page.evaluate('document.activeElement?.getAttribute("data-testid")'), { timeout: 15_000 }).toBe('standby-modules');
        await page.getByTestId('answer-supply-power').scrollIntoViewIfNeeded();
        await page.getByTestId('answer-supply-power').click();
        await expect.poll(() => page.evaluate('document.activeElement?.getAttribute("data-testid")'), { timeout: 15_000 }).toBe('standby-supply-power');
        expect(plain(await page.getByTestId('standby-supply-power').textContent())).toBe(fmt(s.supply.sourcePower));
        await page.getByTestId('answer-runtime').scrollIntoViewIfNeeded();
        await page.getByTestId('answer-runtime').click();
        await expect.poll(() => page.getByTestId('panel-battery').getAttribute('open')).not.toBeNull();
        await expect.poll(() => page.evaluate('document.activeElement?.getAttribute("data-testid")'), { timeout: 20_000 }).toBe('battery-runtime');
        expect(errors).toEqual([]);
      } finally {
        await context.close();
      }
    }, 120_000);
  }

  it('harbour clinic: the printed report carries the modes section on the client\'s pages and its method on the engineer\'s page', async () => {
    const { context, page, errors } = await open('#demo=harbour-clinic-ups', VIEWPORTS.desktop);
    try {
      const s = study.study;
      const section = page.getByTestId('report-modes');
      // The report is print only: read its text (hidden on screen) once the worker's figures are in.
      await expect.poll(() => section.getByTestId('report-modes-supply').count(), { timeout: 20_000 }).toBe(1);
      const text = plain(await section.textContent());
      // Both balances (core's modes study), the charger with N+1, the standing cost a year, the transfer, the cautions.
      expect(plain(await section.getByTestId('report-modes-supply').textContent())).toContain(fmt(s.supply.sourcePower));
      expect(plain(await section.getByTestId('report-modes-battery').textContent())).toContain(fmt(s.battery && 'sourcePower' in s.battery ? s.battery.sourcePower : NaN));
      expect(plain(await section.getByTestId('report-modes-modules').textContent())).toBe(`4 modules of ${amps(10)}: 3 needed and one spare (N+1), ${amps(40)} installed.`); // IEEE Std 946, A = 28.9 A (tests/modes/online-ups.test.ts)
      expect(plain(await section.getByTestId('report-modes-cost').textContent())).toBe(plain(formatMoney(s.standing.cost!, 'en-US')));
      expect(text).toContain(plain(formatVoltage(s.transfer!.busVoltageAtTransfer, 'en-US')));
      expect(text).toContain(amps(s.transfer!.currentStep));
      // The modes study's cautions join the report's own list (its planning caution is the list's first already).
      const modeCautions = s.cautions.filter((c) => !c.startsWith('Planning estimate only'));
      expect(modeCautions.length).toBeGreaterThan(0);
      expect((await page.getByTestId('report-cautions').getByTestId('report-modes-caution').allTextContents()).map(plain)).toEqual(modeCautions.map(plain));
      expect(plain(await page.getByTestId('report-modes-method').textContent())).toContain('IEEE Std 946');

      // Printed: the modes section on a client's page (not the last), no calculation words there; its method on the last page.
      await page.emulateMedia({ media: 'print' });
      const pdf = await page.pdf({ format: 'A4', printBackground: true });
      writeFileSync(join(artifacts, 'modes-report.pdf'), pdf);
      const pages = (await extractText(new Uint8Array(pdf), { mergePages: false })).text.map((t) => t.replace(/\s+/g, ' '));
      const at = pages.findIndex((t) => t.includes('On supply and on battery'));
      const engineer = pages.findIndex((t) => t.includes('For the engineer'));
      expect(at).toBeGreaterThanOrEqual(0);
      expect(engineer).toBeGreaterThan(at);
      // The words the client's pages never carry (the list of tests/browser/report.test.ts, SOLVER_WORDS).
      for (const t of pages.slice(0, engineer)) expect(t).not.toMatch(/\b(solve[ds]?|solver|solving|ports?|nodes?|sweeps?|converged|convergence|balance error)\b/i);
      expect(pages.slice(engineer).join(' ')).toContain('A = L + k·C/H');
      pdfPageImages(join(artifacts, 'modes-report.pdf'), join(artifacts, 'modes-report-page'));
      expect(errors).toEqual([]);
    } finally {
      await context.close();
    }
  }, 120_000);

  it('harbour clinic, phone: the charge to put back and the charge-return factor are editable; the charger sizing follows core; bad values stay at the field', async () => {
    const { context, page, errors } = await open('#demo=harbour-clinic-ups', VIEWPORTS.phone, true);
    try {
      await page.getByTestId('panel-standby').locator('summary').tap();
      const panel = page.getByTestId('standby-panel');
      await expect.poll(() => panel.getAttribute('data-state'), { timeout: 15_000 }).toBe('ready');
      // Empty at first: the field's help says what core takes (its working: C = 100 Ah, the bank's rated capacity here).
      const c0 = study.study.charger;
      expect(await page.getByTestId('standby-recharge-ah').inputValue()).toBe('');
      await expect.poll(async () => plain(await page.locator('#study-standby-rechargeAh-help').textContent())).toContain(`Empty: ${plain(formatSignificant(c0.rechargeAh, 4, 'en-US'))} Ah`);
      expect(plain(await page.locator('#study-standby-chargeReturnFactor-help').textContent())).toMatch(/1\.05 to 1\.4 \(IEEE Std 946/);

      // 60 Ah to put back: core's charger sizing of the changed project (A = L + k·C/H with C = 60 Ah).
      const changed = structuredClone(demo('harbour-clinic-ups')) as { standby: Record<string, unknown> };
      changed.standby['rechargeAh'] = 60;
      const withAh = runModesStudy(solvedOf(changed));
      if (!withAh?.ok) throw new Error('the changed demo does not solve');
      const input = page.getByTestId('standby-recharge-ah');
      await input.fill('60');
      await input.blur();
      await expect.poll(async () => plain(await page.getByTestId('standby-recharge-current').textContent())).toBe(amps(withAh.study.charger.rechargeCurrent));
      expect(plain(await page.getByTestId('standby-required-current').textContent())).toBe(amps(withAh.study.charger.requiredCurrent));
      expect(plain(await page.getByTestId('standby-recharge-ah-used').textContent())).toBe('60 Ah');
      // 1.1 × 60 Ah ÷ 8 h = 8.25 A (IEEE Std 946's k·C/H, k = 1.1 lead-acid, from memory): the modules fall from 4 + 1 to 3 + 1.
      expect(withAh.study.charger.rechargeCurrent).toBeCloseTo(8.25, 9);
      await expect.poll(async () => plain(await page.getByTestId('standby-modules').textContent())).toBe(`${withAh.study.charger.modules!.needed} needed, ${withAh.study.charger.modules!.installed} with N+1`);
      expect(withAh.study.charger.modules!.needed).toBe(3);

      // The charge-return factor 1.2: core again.
      changed.standby['chargeReturnFactor'] = 1.2;
      const withK = runModesStudy(solvedOf(changed));
      if (!withK?.ok) throw new Error('the changed demo does not solve');
      const k = page.getByTestId('standby-charge-return');
      await k.fill('1.2');
      await k.blur();
      await expect.poll(async () => plain(await page.getByTestId('standby-recharge-current').textContent())).toBe(amps(withK.study.charger.rechargeCurrent));
      expect(withK.study.charger.rechargeCurrent).toBeCloseTo((1.2 * 60) / 8, 9);

      // A bad factor (below 1: the schema's own bound): the message at the field, nothing stored, the figures stay.
      await k.fill('0.8');
      await expect.poll(async () => plain(await page.locator('#study-standby-chargeReturnFactor-error').textContent())).toMatch(/at least 1/);
      expect(await k.getAttribute('aria-invalid')).toBe('true');
      expect(plain(await page.getByTestId('standby-charge-return-used').textContent())).toBe('1.2');
      expect(plain(await page.getByTestId('standby-recharge-current').textContent())).toBe(amps(withK.study.charger.rechargeCurrent));
      // A charge that is not a number: the message at the field.
      await input.fill('sixty');
      await expect.poll(async () => (await page.locator('#study-standby-rechargeAh-error').count())).toBe(1);
      expect(plain(await page.getByTestId('standby-recharge-ah-used').textContent())).toBe('60 Ah');
      await panel.screenshot({ path: join(artifacts, 'modes-phone-standby-edit.png') });
      expect(await seriousAxeViolations(page)).toEqual([]);
      expect(errors).toEqual([]);
    } finally {
      await context.close();
    }
  }, 120_000);

  it('a rectifier run past its rating (a shared copy of the harbour clinic): the warnings follow the mode and say which', async () => {
    // The rectifier's loss model rated 3.5 kW: on supply it gives 218 V × 16.9 A ≈ 3.68 kW, over its rating (core/kinds/models.ts
    // lossReport, "exceeds the rated"); on battery the rectifier is cut, so that warning goes (core's solveModes on the same project).
    const changed = structuredClone(demo('harbour-clinic-ups')) as { elements: Record<string, unknown>[] };
    const rectifier = changed.elements.find((e) => e['id'] === 'rectifier')!;
    rectifier['loss'] = { ...(rectifier['loss'] as object), ratedPower: 3500 };
    const pair = solvedOf(changed);
    const both = solveModes(pair)!;
    if (!both.battery.ok) throw new Error('the changed demo has no on-battery mode');
    expect(pair.result.warnings.map((w) => w.elementId)).toEqual(['rectifier']);
    expect(both.battery.result.warnings).toEqual([]);
    const hash = await shareHash(changed as unknown as DraftProject);
    if (!hash.ok) throw new Error(hash.message);
    const { context, page, errors } = await open(hash.hash, VIEWPORTS.desktop);
    try {
      const warnings = page.getByTestId('warnings');
      await expect.poll(() => page.getByTestId('warnings-mode').textContent(), { timeout: 15_000 }).toBe('On supply');
      expect(plain(await warnings.textContent())).toContain('UPS rectifier:');
      expect(plain(await warnings.textContent())).toContain('exceeds the rated');
      await page.getByTestId('mode-switch').waitFor();
      await page.getByRole('radio', { name: 'On battery' }).check();
      await expect.poll(() => page.getByTestId('element-table-mode').textContent()).toBe('On battery');
      // Core gives no warning on battery: no list.
      await expect.poll(() => warnings.count()).toBe(0);
      await page.getByRole('radio', { name: 'On supply' }).check();
      await expect.poll(() => page.getByTestId('warnings-mode').textContent()).toBe('On supply');
      expect(errors).toEqual([]);
    } finally {
      await context.close();
    }
  }, 90_000);
});
