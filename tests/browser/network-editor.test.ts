/**
 * The circuit editor of a load given by its parts (web/components/fields/NetworkField.tsx) in a real
 * browser (Debian's Chromium, driven by playwright-core): a 230 V 50 Hz supply feeding one such load;
 * its circuit rebuilt from the added load's two parts into 12 Ω in series with (40 mH ∥ 100 µF) by
 * the keyboard alone (desktop) and by touch (phone); the power the chain's solve gives the load checked
 * against a hand-worked value; a bad value's message at its part (nothing stored, the results marked out
 * of date); values typed in the de-DE number format; axe clean with the editor open, light and dark,
 * phone and desktop. Screenshots go to tests/.artifacts/ for a person to look at.
 *
 * Hand-worked check (steady-state phasor analysis; Z_L = jωL, Z_C = 1/(jωC), parallel 1/ΣY,
 * S = V·conj(V/Z)): f = 50 Hz, ω = 100π rad/s; X_L = ωL = 4π = 12.5664 Ω; X_C = 1/(ωC) = 100/π =
 * 31.8310 Ω; L ∥ C = j·X_L·X_C/(X_C − X_L) = j·400/19.2646 = j20.7635 Ω (inductive: X_L < X_C);
 * Z = 12 + j20.7635 Ω, |Z|² = 575.121 Ω², |Z| = 23.9817 Ω; the supply is ideal (no source impedance,
 * no cable), so |V| = 230 V across the load and P = |V|²·R/|Z|² = 52 900 × 12 / 575.121 = 1103.77 W,
 * Q = |V|²·X/|Z|² = 1909.84 var (lagging), power factor R/|Z| = 0.5004.
 */
import { join } from 'node:path';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { skipWithout } from '../tools/system-tools.ts';
import { VIEWPORTS, artifacts, chainOp, chooseSetting, seriousAxeViolations, serveBuiltApp, showProjectsView, watchPageErrors, type ServedApp } from './harness.ts';

/** The hand-worked figures above. */
const XL = 100 * Math.PI * 0.04;
const XC = 1 / (100 * Math.PI * 100e-6);
const X = (XL * XC) / (XC - XL);
const Z2 = 12 * 12 + X * X;
const P_HAND = (230 * 230 * 12) / Z2; // 1103.77 W
const PF_HAND = 12 / Math.sqrt(Z2); // 0.5004

describe.skipIf(skipWithout('chromium'))('the circuit editor in Chromium', () => {
  let app: ServedApp | undefined;
  let browser: Browser | undefined;
  let baseUrl = '';

  beforeAll(async () => {
    app = await serveBuiltApp('joulepath-network-');
    ({ browser, baseUrl } = app);
  });

  afterAll(async () => {
    await app?.close();
  });

  it('hand-worked values are what the comments say', () => {
    expect(X).toBeCloseTo(20.7635, 4);
    expect(P_HAND).toBeCloseTo(1103.77, 2);
    expect(PF_HAND).toBeCloseTo(0.5004, 4);
  });

  /** A new chain: a 230 V 50 Hz supply and a load given by its parts after it, its form open. */
  async function supplyWithCircuitLoad(viewport: { width: number; height: number }, touch: boolean): Promise<{ context: BrowserContext; page: Page; errors: string[] }> {
    const context = await browser!.newContext({ viewport, deviceScaleFactor: 1, locale: 'en-US', hasTouch: touch });
    const page = await context.newPage();
    const errors = watchPageErrors(page);
    await page.goto(baseUrl, { waitUntil: 'load' });
    await page.getByTestId('chain-editor').waitFor();
    await showProjectsView(page);
    const press = (selector: string) => (touch ? page.locator(selector).tap() : page.locator(selector).click());
    await press('[data-testid="new-chain"]');
    await press('button[data-source="grid-1-230"]');
    await expect.poll(() => page.getByTestId('stage-card').count()).toBe(1);
    await chainOp(page, 'op-add-after');
    await page.getByTestId('kind-chooser').waitFor();
    await press('.kind-option[data-kind="network-load"]');
    await expect.poll(() => page.getByTestId('stage-card').count()).toBe(2);
    await form(page).waitFor();
    await field(page).waitFor();
    return { context, page, errors };
  }

  const form = (page: Page) => page.locator('[data-testid="stage-form"][data-element-id="rl-load"]');
  const field = (page: Page) => form(page).getByTestId('network-field');
  const parts = (page: Page) => field(page).getByTestId('circuit-part');
  const watts = async (page: Page) => Number(await field(page).getByTestId('circuit-power').getAttribute('data-watts'));
  const stale = (page: Page) => page.getByTestId('results-stale');
  // Page expressions are strings: the Node tsconfig has no DOM library.
  const focusedName = (page: Page) =>
    page.evaluate(`(() => { const el = document.activeElement; if (!el) return ''; return (el.getAttribute('aria-label') || (el.labels && el.labels[0] ? el.labels[0].textContent : '') || '').trim(); })()`) as Promise<string>;
  /** Press Tab until the focused control's accessible name is `name`. */
  async function tabTo(page: Page, name: string | RegExp): Promise<void> {
    for (let i = 0; i < 60; i++) {
      const now = await focusedName(page);
      if (typeof name === 'string' ? now === name : name.test(now)) return;
      await page.keyboard.press('Tab');
    }
    throw new Error(`Tab never reached ${String(name)}`);
  }
  /** The parts as "place kind value" lines, in order. */
  const partLines = (page: Page) =>
    parts(page).evaluateAll((els) =>
      els.map((el) => `${el.getAttribute('data-place')} ${el.getAttribute('data-kind')} ${(el.querySelector('[data-testid="circuit-value"]') as unknown as { value: string }).value}`),
    );

  /** The checks once the circuit is 12 Ω + (40 mH ∥ 100 µF): structure, figures, the card's power. */
  async function checkBuilt(page: Page): Promise<void> {
    await expect.poll(() => partLines(page)).toEqual(['1 resistor 12 Ω', '2.1 inductor 40 mH', '2.2 capacitor 100 µF']);
    await expect.poll(() => field(page).getByTestId('circuit-group').evaluateAll((els) => els.map((e) => e.getAttribute('data-place')))).toEqual(['', '2']);
    await expect.poll(() => field(page).locator('[data-testid="circuit-group"][data-place="2"] [data-testid="circuit-join"]').first().inputValue()).toBe('parallel');
    // The load's power from the solve against the hand-worked value.
    await expect.poll(() => watts(page)).toBeCloseTo(P_HAND, 6);
    expect(await field(page).getByTestId('circuit-z').innerText()).toBe('12 + j20.76\u202fΩ');
    expect(await field(page).getByTestId('circuit-magnitude').innerText()).toBe('23.98\u202fΩ');
    expect(await field(page).getByTestId('circuit-pf').innerText()).toBe(`${PF_HAND.toFixed(3)} lagging`);
    expect(await field(page).getByTestId('circuit-frequency').innerText()).toBe('50\u202fHz');
    // The chain's own figures agree: the load's card.
    await expect.poll(async () => (await page.locator('[data-testid="stage-card"][data-card-id="rl-load"]').textContent()) ?? '').toMatch(/uses 1\.104\skW/);
    expect(await stale(page).count()).toBe(0);
  }

  /** Serious and critical axe findings in the open form. */
  const formViolations = async (page: Page) =>
    (await seriousAxeViolations(page, `'[data-testid="stage-form"]'`)).map((v) => `${v.impact} ${v.id}: ${JSON.stringify(v.nodes.map((n) => n.target))}`);

  it('builds R in series with (L ∥ C) by the keyboard alone; a bad value is refused at its part; de-DE values (desktop)', async () => {
    const { context, page, errors } = await supplyWithCircuitLoad(VIEWPORTS.desktop, false);
    try {
      expect(await partLines(page)).toEqual(['1 resistor 50 Ω', '2 inductor 50 mH']);
      // From the form's first field on, keys only.
      await form(page).getByTestId('field-name').focus();
      await tabTo(page, 'Remove Inductor 2 of the circuit');
      await page.keyboard.press('Enter');
      await expect.poll(() => parts(page).count()).toBe(1);
      // Focus stays in the circuit: on the part that is left.
      await expect.poll(() => focusedName(page)).toBe('Resistor 1 of the circuit: kind of part');
      await tabTo(page, /^Resistor 1 of the circuit: value/);
      await page.keyboard.press('Control+a');
      await page.keyboard.type('12 Ω');
      await tabTo(page, 'Add group to the circuit');
      await page.keyboard.press('Enter');
      // The new group is parallel (inside a series circuit) and takes the focus at its connection.
      await expect.poll(() => focusedName(page)).toBe('Parallel group 2: connected in');
      await tabTo(page, 'Resistor 1 of parallel group 2: kind of part');
      await page.keyboard.press('ArrowDown'); // Resistor → Inductor
      await expect.poll(() => focusedName(page)).toBe('Inductor 1 of parallel group 2: kind of part');
      await tabTo(page, /^Inductor 1 of parallel group 2: value/);
      await page.keyboard.press('Control+a');
      await page.keyboard.type('40 mH');
      await tabTo(page, 'Add part to parallel group 2');
      await page.keyboard.press('Enter');
      await expect.poll(() => focusedName(page)).toBe('Resistor 2 of parallel group 2: kind of part');
      await page.keyboard.press('ArrowDown');
      await page.keyboard.press('ArrowDown'); // → Capacitor, which starts at 100 µF
      await expect.poll(() => focusedName(page)).toBe('Capacitor 2 of parallel group 2: kind of part');
      await tabTo(page, /^Capacitor 2 of parallel group 2: value/);
      await page.keyboard.press('Control+a');
      await page.keyboard.type('100 µF');
      await page.keyboard.press('Tab');
      await checkBuilt(page);
      const good = await watts(page);

      // Move the capacitor up and back down by keys: the circuit is the same, so is the power.
      await tabTo(page, 'Move Capacitor 2 of parallel group 2 up');
      await page.keyboard.press('Enter');
      await expect.poll(() => partLines(page)).toEqual(['1 resistor 12 Ω', '2.1 capacitor 100 µF', '2.2 inductor 40 mH']);
      // Focus follows the moved part (its "up" is now disabled, so its "down").
      await expect.poll(() => focusedName(page)).toBe('Move Capacitor 1 of parallel group 2 down');
      await page.keyboard.press('Enter');
      await checkBuilt(page);

      // Bad values: a message at the part naming it, nothing stored, the figures out of date.
      const resistor = parts(page).first().getByTestId('circuit-value');
      const message = parts(page).first().getByTestId('field-message');
      for (const [typed, words] of [
        ['4.7 mQ', /^Circuit, resistor 1 of the circuit: "4\.7 mQ": unknown prefix or unit "mQ"/],
        ['', /^Circuit, resistor 1 of the circuit: is empty: enter a value, e\.g\. 1\.2 kΩ$/],
        ['-12 Ω', /^Circuit, resistor 1 of the circuit: must be greater than 0 Ω/],
      ] as const) {
        // One input event (as a paste): typed key by key, "4.7 m" on the way would be a good value and stored.
        await resistor.focus();
        await page.keyboard.press('Control+a');
        if (typed) await page.keyboard.insertText(typed);
        else await page.keyboard.press('Backspace');
        await expect.poll(() => message.innerText()).toMatch(words);
        expect(await resistor.getAttribute('aria-invalid')).toBe('true');
        expect((await resistor.getAttribute('aria-describedby')) ?? '').toBe(await message.getAttribute('id'));
        await stale(page).waitFor();
        expect(await watts(page)).toBe(good);
        expect(await field(page).getByTestId('circuit-check').getAttribute('data-stale')).toBe('true');
      }
      await form(page).scrollIntoViewIfNeeded();
      await field(page).screenshot({ path: join(artifacts, 'network-editor-desktop-bad-value.png') });
      expect(await formViolations(page)).toEqual([]);
      // Fixed: the message goes, the figures are current again.
      await page.keyboard.press('Control+a');
      await page.keyboard.type('12 Ω');
      await expect.poll(() => stale(page).count()).toBe(0);
      expect(await message.count()).toBe(0);
      await checkBuilt(page);

      // In de-DE the values show with a decimal comma and are typed so: 0,04 H is the same 40 mH.
      await chooseSetting(page, 'locale-select', 'de-DE');
      const inductor = parts(page).nth(1).getByTestId('circuit-value');
      await inductor.focus();
      await page.keyboard.press('Control+a');
      await page.keyboard.type('0,04 H');
      await page.keyboard.press('Tab');
      await expect.poll(() => inductor.inputValue()).toBe('0,04 H');
      await expect.poll(() => watts(page)).toBeCloseTo(P_HAND, 6);
      expect(await field(page).getByTestId('circuit-z').innerText()).toBe('12 + j20,76\u202fΩ');
      expect(await field(page).locator('.sf-help').last().innerText()).toContain('"4,7 mH"');
      // A point is not a decimal there: refused at the part, in the user's terms.
      await inductor.focus();
      await page.keyboard.press('Control+a');
      await page.keyboard.type('4.7 mH');
      await expect.poll(() => parts(page).nth(1).getByTestId('field-message').innerText()).toMatch(/^Circuit, inductor 1 of parallel group 2: "4\.7" is not a number in this number format/);
      await page.keyboard.press('Control+a');
      await page.keyboard.type('40 mH');
      await expect.poll(() => stale(page).count()).toBe(0);

      // Axe with the editor open, light and dark; screenshots to look at.
      for (const theme of ['light', 'dark']) {
        await chooseSetting(page, 'theme-select', theme);
        expect(await formViolations(page), theme).toEqual([]);
        await field(page).scrollIntoViewIfNeeded();
        await field(page).screenshot({ path: join(artifacts, `network-editor-desktop-${theme}.png`) });
      }
      expect(errors).toEqual([]);
    } finally {
      await context.close();
    }
  });

  it('builds the same circuit by touch, every control a touch target, nothing wider than the screen (phone)', async () => {
    const { context, page, errors } = await supplyWithCircuitLoad(VIEWPORTS.phone, true);
    try {
      const value = (place: string) => field(page).locator(`[data-testid="circuit-part"][data-place="${place}"] [data-testid="circuit-value"]`);
      const kind = (place: string) => field(page).locator(`[data-testid="circuit-part"][data-place="${place}"] [data-testid="circuit-kind"]`);
      await field(page).getByRole('button', { name: 'Remove Inductor 2 of the circuit' }).tap();
      await expect.poll(() => parts(page).count()).toBe(1);
      // On a phone the text box takes the on-screen keyboard's text; fill() is that.
      await value('1').tap();
      await value('1').fill('12 Ω');
      await field(page).getByRole('button', { name: 'Add group to the circuit' }).tap();
      await expect.poll(() => parts(page).count()).toBe(2);
      // A select opens the phone's own picker; selectOption is choosing in it.
      await kind('2.1').selectOption('inductor');
      await value('2.1').tap();
      await value('2.1').fill('40 mH');
      await field(page).getByRole('button', { name: 'Add part to parallel group 2' }).tap();
      await expect.poll(() => parts(page).count()).toBe(3);
      await kind('2.2').selectOption('capacitor');
      await checkBuilt(page);

      // A bad value by touch: the message at its part.
      await value('2.2').tap();
      await value('2.2').fill('-100 µF');
      await expect.poll(() => field(page).locator('[data-place="2.2"] [data-testid="field-message"]').innerText()).toMatch(/^Circuit, capacitor 2 of parallel group 2: must be greater than 0 F/);
      await stale(page).waitFor();
      await field(page).scrollIntoViewIfNeeded();
      await field(page).screenshot({ path: join(artifacts, 'network-editor-phone-bad-value.png') });
      expect(await formViolations(page)).toEqual([]);
      await value('2.2').fill('100 µF');
      await checkBuilt(page);

      // Every button of the circuit is a 44 px touch target at least; nothing wider than the screen.
      const small = (await page.evaluate(`[...document.querySelectorAll('[data-testid="network-field"] button, [data-testid="network-field"] select, [data-testid="network-field"] input')]
          .map((b) => ({ t: b.getAttribute('aria-label') || b.id, r: b.getBoundingClientRect() }))
          .filter((x) => x.r.width > 0 && (x.r.width < 44 || x.r.height < 44))
          .map((x) => x.t + ' ' + x.r.width + '×' + x.r.height)`)) as string[];
      expect(small).toEqual([]);
      expect(await page.evaluate('document.documentElement.scrollWidth - window.innerWidth')).toBeLessThanOrEqual(0);

      // "Edit as text" shows the network the file holds; the tree comes back.
      await field(page).getByTestId('circuit-as-text').tap();
      expect(JSON.parse(await field(page).getByTestId('circuit-text').inputValue())).toEqual({
        series: [{ resistor: '12 Ω' }, { parallel: [{ inductor: '40 mH' }, { capacitor: '100 µF' }] }],
      });
      // Pasted text is checked by the same engine: a bad value in it is refused, nothing stored.
      const text = field(page).getByTestId('circuit-text');
      await text.fill(JSON.stringify({ series: [{ resistor: '12 Ω' }, { resistor: '4.7 mQ' }] }));
      await expect.poll(() => field(page).locator(':scope > [data-testid="field-message"]').innerText()).toMatch(/^Circuit: "4\.7 mQ": unknown prefix or unit "mQ"/);
      await stale(page).waitFor();
      await text.fill(JSON.stringify({ series: [{ resistor: '12 Ω' }, { parallel: [{ inductor: '40 mH' }, { capacitor: '100 µF' }] }] }));
      await expect.poll(() => stale(page).count()).toBe(0);
      await field(page).getByTestId('circuit-as-text').tap();
      await expect.poll(() => parts(page).count()).toBe(3);

      for (const theme of ['light', 'dark']) {
        await chooseSetting(page, 'theme-select', theme);
        expect(await formViolations(page), theme).toEqual([]);
        await field(page).scrollIntoViewIfNeeded();
        await field(page).screenshot({ path: join(artifacts, `network-editor-phone-${theme}.png`) });
      }
      expect(errors).toEqual([]);
    } finally {
      await context.close();
    }
  });
});
