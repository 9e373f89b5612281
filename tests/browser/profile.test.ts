/**
 * The battery panel's load profile editor in a real browser (Debian's Chromium, playwright-core,
 * against a production build): from a project with a bank, a fridge and lights and an empty
 * (constant) backup study, the fridge-and-lights profile is built with the keyboard alone (desktop)
 * and with touch (phone), and the runtime the panel shows is the command-line solver's for the same
 * project (core's CLI entry run in-process on the exported file, and on the same JSON built here).
 * The preview's figures are checked against a day worked by hand; axe finds nothing serious with
 * the editor open. Screenshots go to tests/.artifacts/.
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import type { BrowserContext, Locator, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { skipWithout } from '../tools/system-tools.ts';
import { VIEWPORTS, artifacts, openDemo, seriousAxeViolations, serveBuiltApp, showProjectsView, type ServedApp } from './harness.ts';
import { demoProjects } from '../../core/index.ts';
import { runParsed, type SolveRequest } from '../../core/cli/run.ts';
import { parseArgs } from '../../core/cli/args.ts';
import { formatCurrent, formatDuration } from '../../web/format/number.ts';
import { runBackupStudy } from '../../core/index.ts';
import { onSolved } from '../core/solved.ts';

type Json = Record<string, any>; // the project files as plain data

/** The hillside hut's bank and chain with two loads: the 150 W vaccine fridge and 220 W of lights (the radios left out). */
function fridgeAndLightsProject(profile: Json): Json {
  const hut = structuredClone(demoProjects.find((d) => d.id === 'hillside-relay-hut')!.project) as unknown as Json;
  hut['elements'] = (hut['elements'] as Json[]).filter((e) => e['id'] !== 'radios' && e['id'] !== 'radio-psu');
  hut['name'] = 'Fridge and lights';
  // The panel's new study (web/components/BatteryPanel.tsx NEW_BACKUP_STUDY): every load on, 24 h at 25 °C.
  hut['backup'] = { profile, targetRuntimeHours: 24, temperatureC: 25 };
  return hut;
}

/** The profile both tests build: the fridge 12 min in every 30, the lights at 40 W from 18:00 to 06:00 and off by day, the outage at 18:00. */
const FRIDGE_AND_LIGHTS = {
  kind: 'daily',
  startHour: 18,
  segments: [
    { startHour: 6, loads: { lights: false } },
    { startHour: 18, loads: { lights: 40 } },
  ],
  duty: [{ load: 'fridge', periodMinutes: 30, onMinutes: 12 }],
};

/**
 * The command-line solver's runtime for a project, core's CLI entry run in-process: its text
 * ("Runtime: 75 h 36 min — …") and, from its --json output, the runtime in seconds as the page
 * writes it (formatDuration: "3 d 3 h").
 */
function cliRuntime(project: Json): { text: string; seconds: number; page: string } {
  const run = runParsed('fridge-and-lights.json', project, parseArgs(['fridge-and-lights.json']) as SolveRequest, undefined);
  const json = runParsed('fridge-and-lights.json', project, parseArgs(['fridge-and-lights.json', '--json']) as SolveRequest, undefined);
  if (!run.ok || !json.ok) throw new Error(run.ok ? 'the CLI refused the JSON output' : run.lines.join('\n'));
  const text = /Runtime: (.+?) —/.exec(run.text)?.[1];
  if (!text) throw new Error('the CLI printed no runtime');
  const seconds = (JSON.parse(json.text) as { backupStudy: { discharge: { runtimeSeconds: number } } }).backupStudy.discharge.runtimeSeconds;
  // The CLI's text and its JSON say the same runtime (whole hours and minutes).
  const hm = /^(\d+) h(?: (\d+) min)?$/.exec(text);
  if (hm) expect(Math.abs(Number(hm[1]) * 3600 + Number(hm[2] ?? 0) * 60 - seconds)).toBeLessThan(60);
  return { text, seconds, page: formatDuration(seconds, 'en-US') };
}

/** Spaces of every kind as one ASCII space (the page joins numbers and units with a narrow no-break space). */
const plain = (s: string | null | undefined) => (s ?? '').replace(/[\s\u202f\u00a0]+/g, ' ').trim();

/** A screenshot of a part of the panel: parts off screen skip rendering (`skip-offscreen`), so everything is rendered for it. */
async function shot(page: Page, testId: string, file: string): Promise<void> {
  await page.evaluate(`(() => { const s = document.createElement('style'); s.id = 'test-render-all'; s.textContent = '.skip-offscreen { content-visibility: visible !important; }'; document.head.append(s); })()`);
  try {
    await page.getByTestId(testId).scrollIntoViewIfNeeded();
    await page.getByTestId(testId).screenshot({ path: join(artifacts, file) });
  } finally {
    await page.evaluate(`document.getElementById('test-render-all')?.remove()`);
  }
}

describe.skipIf(skipWithout('chromium'))('the load profile editor in Chromium', () => {
  let app: ServedApp | undefined;

  beforeAll(async () => {
    app = await serveBuiltApp('joulepath-profile-build-');
  });

  afterAll(async () => {
    await app?.close();
  });

  /** A fresh page with the empty-study project imported and the battery panel open. */
  async function openEmptyStudy(context: BrowserContext, touch: boolean): Promise<{ page: Page; errors: string[]; body: Locator }> {
    // The context's own viewport and options (the caller made it: touch or not).
    const { page, errors } = await openDemo(app!.browser, VIEWPORTS.desktop, null, { baseUrl: app!.baseUrl, context });
    await showProjectsView(page);
    const file = JSON.stringify(fridgeAndLightsProject({ kind: 'constant' }));
    await page.getByTestId('open-file').setInputFiles({ name: 'fridge-and-lights.json', mimeType: 'application/json', buffer: Buffer.from(file) });
    await expect.poll(() => page.locator('#project-heading').textContent(), { timeout: 20_000 }).toContain('Fridge and lights');
    const summary = page.getByTestId('panel-battery').locator('summary');
    await summary.waitFor();
    if (touch) await summary.tap();
    else {
      await summary.focus();
      await page.keyboard.press('Enter');
    }
    const body = page.getByTestId('battery-panel');
    await body.waitFor();
    await page.getByTestId('profile-editor').waitFor();
    expect(await page.getByTestId('profile-words').textContent()).toBe('Every load at its rating all day.');
    // The editor's controls behind "Change the load profile".
    const open = page.getByTestId('profile-edit-summary');
    if (touch) await open.tap();
    else {
      await open.focus();
      await page.keyboard.press('Enter');
    }
    await page.getByTestId('profile-add-segment').waitFor();
    // The empty study: one segment, every load at its rating, no duty cycle.
    expect(await page.locator('[data-testid^="profile-handle-"]').count()).toBe(1);
    expect(await page.getByTestId('profile-seg-0-mode-1').inputValue()).toBe('rated');
    return { page, errors, body };
  }

  /** The preview's figures for the fridge-and-lights day, worked by hand. */
  async function checkPreview(page: Page): Promise<void> {
    // By hand (E = Σ P·Δt): fridge 150 W × 24 h × 12/30 = 1440 Wh, lights 40 W × 12 h = 480 Wh:
    // 1920 Wh a day, 80 W on average, 190 W at the peak (fridge on with the lights).
    await expect.poll(async () => plain(await page.getByTestId('profile-energy').textContent())).toBe('1.92 kWh');
    expect(plain(await page.getByTestId('profile-average').textContent())).toBe('80 W');
    expect(plain(await page.getByTestId('profile-peak').textContent())).toBe('190 W');
    const d = (await page.getByTestId('profile-chart').locator('path.tchart__line').getAttribute('d')) ?? '';
    // 48 fridge cycles and the lights' two changes: about a hundred steps.
    expect(d.split('H').length).toBeGreaterThan(90);
  }

  /** The runtime the panel shows once the study has run on the profile. */
  async function shownRuntime(page: Page, body: Locator, expected: string): Promise<void> {
    const runtime = page.getByTestId('battery-runtime');
    await expect.poll(async () => plain(await runtime.textContent()), { timeout: 30_000 }).toBe(plain(expected));
    await expect.poll(() => body.getAttribute('data-state')).toBe('current');
  }

  it('builds the fridge-and-lights profile with the keyboard alone; the runtime is the CLI’s for the exported file', async () => {
    const context = await app!.browser.newContext({ viewport: VIEWPORTS.desktop, deviceScaleFactor: 1, locale: 'en-US', acceptDownloads: true });
    try {
      const { page, errors, body } = await openEmptyStudy(context, false);
      const constantRuntime = cliRuntime(fridgeAndLightsProject({ kind: 'constant' }));
      await shownRuntime(page, body, constantRuntime.page);

      const press = async (testId: string, ...keys: string[]) => {
        await page.getByTestId(testId).focus();
        for (const k of keys) await page.keyboard.press(k);
      };
      const type = async (testId: string, text: string) => {
        await press(testId, 'Control+A');
        await page.keyboard.type(text);
      };

      // Every control of the editor is reached by Tab, in the page's order, the strip's handles too.
      const reachable = async () => {
        const wanted = (await page.evaluate(
          `[...document.querySelectorAll('[data-testid="profile-editor"] :is(input, select, button, [tabindex="0"])')].map((e) => e.dataset.testid)`,
        )) as string[];
        await page.getByTestId('profile-start-load').focus();
        const seen = new Set<string>();
        for (let i = 0; i < wanted.length + 5; i++) {
          const id = (await page.evaluate('document.activeElement?.dataset?.testid ?? ""')) as string;
          seen.add(id);
          await page.keyboard.press('Tab');
        }
        return wanted.filter((id) => !seen.has(id));
      };

      // Two segments: the day split at noon, then 06:00 typed and the second handle moved by keys.
      await press('profile-add-segment', 'Enter');
      await expect.poll(() => page.locator('[data-testid^="profile-handle-"]').count()).toBe(2);
      expect(await page.getByTestId('profile-handle-1').getAttribute('aria-valuetext')).toBe('12:00');
      await type('profile-seg-0-start', '06:00');
      await expect.poll(() => page.getByTestId('profile-handle-0').getAttribute('aria-valuetext')).toBe('06:00');
      // A start that does not follow the one before is refused at its field, and nothing is stored.
      await type('profile-seg-1-start', '05:00');
      await expect.poll(() => page.locator('#profile-seg-1-start-error').textContent()).toMatch(/start hours must rise/);
      expect(await page.getByTestId('profile-handle-1').getAttribute('aria-valuetext')).toBe('12:00');
      await type('profile-seg-1-start', '12:00');
      await expect.poll(() => page.locator('#profile-seg-1-start-error').count()).toBe(0);
      // The handle: Page Up moves it an hour, the arrows a quarter hour.
      await press('profile-handle-1', 'PageUp', 'PageUp', 'PageUp', 'PageUp', 'PageUp', 'PageUp', 'ArrowRight', 'ArrowLeft');
      await expect.poll(() => page.getByTestId('profile-handle-1').getAttribute('aria-valuetext')).toBe('18:00');
      expect(await page.getByTestId('profile-seg-1-start').inputValue()).toBe('18:00');

      // The lights (the second load): off by day, 40 W in the evening and night.
      await press('profile-seg-0-mode-1', 'ArrowDown');
      await expect.poll(() => page.getByTestId('profile-seg-0-mode-1').inputValue()).toBe('off');
      await press('profile-seg-1-mode-1', 'ArrowDown', 'ArrowDown');
      await expect.poll(() => page.getByTestId('profile-seg-1-mode-1').inputValue()).toBe('value');
      expect(await page.getByTestId('profile-seg-1-value-1').inputValue()).toBe('220');
      await type('profile-seg-1-value-1', '40');

      // The fridge's compressor: a duty cycle of 12 min in 30.
      await press('profile-add-duty', 'Enter');
      await page.getByTestId('profile-duty-0').waitFor();
      expect(await page.getByTestId('profile-duty-0-load').inputValue()).toBe('fridge');
      await type('profile-duty-0-period', '30');
      // An on-time longer than the period is refused at its field.
      await type('profile-duty-0-on', '45');
      await expect.poll(async () => plain(await page.locator('#profile-duty-0-on-error').textContent())).toMatch(/must not exceed the period of 30 min/);
      await type('profile-duty-0-on', '12');
      await expect.poll(() => page.locator('#profile-duty-0-on-error').count()).toBe(0);

      // The outage begins at 18:00.
      await type('profile-outage-start', '18:00');
      await checkPreview(page);

      expect(await reachable()).toEqual([]);
      expect(await page.getByTestId('profile-words').textContent()).toBe('By the clock: 2 segments a day, the outage beginning at 18:00; cycling on their own: Vaccine fridge.');

      // The runtime shown is the CLI's for the exported file, whose profile is the one intended.
      const expectedRuntime = cliRuntime(fridgeAndLightsProject(FRIDGE_AND_LIGHTS));
      // The profile changes the answer: 75 h 36 min against 20 h 41 min with every load always on (CLI, this project).
      expect(expectedRuntime.seconds).toBeGreaterThan(3 * constantRuntime.seconds);
      await shownRuntime(page, body, expectedRuntime.page);
      await page.getByTestId('export-project').focus();
      const [download] = await Promise.all([page.waitForEvent('download'), page.keyboard.press('Enter')]);
      const exported = JSON.parse(readFileSync((await download.path())!, 'utf8')) as { project: Json };
      expect(exported.project['backup'].profile).toEqual(FRIDGE_AND_LIGHTS);
      expect(cliRuntime(exported.project)).toEqual(expectedRuntime);

      // The plots of state of charge, voltage and current follow the profile: their summary gives the
      // current's range of the study run here on the same project, and that range is wide (the fridge
      // and the lights switching), where every load always on keeps it within about 10 %.
      const inProcess = onSolved(runBackupStudy, fridgeAndLightsProject(FRIDGE_AND_LIGHTS));
      if (!inProcess.ok) throw new Error(JSON.stringify(inProcess.problems));
      const current = inProcess.study.discharge.series.current;
      const low = Math.min(...current);
      const high = inProcess.study.discharge.peakCurrent;
      expect(high / low).toBeGreaterThan(2);
      const plotSummary = plain(await page.getByTestId('battery-plot-summary').textContent());
      expect(plotSummary).toContain(plain(`the bank current varies between ${formatCurrent(low, 'en-US')} and ${formatCurrent(high, 'en-US')}`));
      expect(plotSummary).toContain(plain(`Over ${expectedRuntime.page}`));

      // Undo takes back one field's edit (typing "18:00" was one step), redo puts it back.
      await press('profile-handle-0', 'Control+z');
      await expect.poll(() => page.getByTestId('profile-outage-start').inputValue()).toBe('00:00');
      expect(await page.getByTestId('profile-duty-0-on').inputValue()).toBe('12');
      await press('profile-handle-0', 'Control+Shift+z');
      await expect.poll(() => page.getByTestId('profile-outage-start').inputValue()).toBe('18:00');
      await shownRuntime(page, body, expectedRuntime.page);

      expect(await seriousAxeViolations(page)).toEqual([]);
      await shot(page, 'profile-editor', 'profile-editor-desktop.png');
      await shot(page, 'profile-strip', 'profile-strip-desktop.png');
      expect(errors).toEqual([]);
    } finally {
      await context.close();
    }
  });

  it('builds the same profile with touch on a phone; the runtime is the CLI’s for the same JSON', async () => {
    const context = await app!.browser.newContext({ viewport: VIEWPORTS.phone, deviceScaleFactor: 1, locale: 'en-US', hasTouch: true, isMobile: true });
    try {
      const { page, errors, body } = await openEmptyStudy(context, true);
      const cdp = await context.newCDPSession(page);
      /** A finger on the handle, moved to an hour of the strip, and lifted (touch events through the browser's input pipeline). */
      const drag = async (handle: string, hour: number) => {
        await page.getByTestId(handle).scrollIntoViewIfNeeded();
        const from = (await page.getByTestId(handle).boundingBox())!;
        const bar = (await page.getByTestId('profile-strip').locator('.day-strip__bar').boundingBox())!;
        const x0 = from.x + from.width / 2;
        const y = from.y + from.height / 2;
        // The bar's inner box: its 2 px border each side.
        const x1 = bar.x + 2 + ((bar.width - 4) * hour) / 24;
        await cdp.send('Input.dispatchTouchEvent', { type: 'touchStart', touchPoints: [{ x: x0, y }] });
        for (let k = 1; k <= 8; k++) await cdp.send('Input.dispatchTouchEvent', { type: 'touchMove', touchPoints: [{ x: x0 + ((x1 - x0) * k) / 8, y }] });
        await cdp.send('Input.dispatchTouchEvent', { type: 'touchEnd', touchPoints: [] });
      };

      await page.getByTestId('profile-add-segment').tap();
      await expect.poll(() => page.locator('[data-testid^="profile-handle-"]').count()).toBe(2);
      await drag('profile-handle-1', 18);
      await expect.poll(() => page.getByTestId('profile-handle-1').getAttribute('aria-valuetext')).toBe('18:00');
      await drag('profile-handle-0', 6);
      await expect.poll(() => page.getByTestId('profile-handle-0').getAttribute('aria-valuetext')).toBe('06:00');
      expect(await page.getByTestId('profile-seg-0-start').inputValue()).toBe('06:00');

      // The lights' levels (a phone shows its own list for a select; the choice is made here directly).
      await page.getByTestId('profile-seg-0-mode-1').selectOption('off');
      await page.getByTestId('profile-seg-1-mode-1').selectOption('value');
      await page.getByTestId('profile-seg-1-value-1').tap();
      await page.getByTestId('profile-seg-1-value-1').fill('40');
      // A bad value is refused at its field and not stored.
      await page.getByTestId('profile-seg-1-value-1').fill('4o');
      await expect.poll(() => page.locator('#profile-seg-1-load-1-value-error').textContent()).toMatch(/not a number/);
      await page.getByTestId('profile-seg-1-value-1').fill('40');

      // The fridge from a starting point: a compressor cycling, 12 min in every 30.
      await page.getByTestId('profile-start-load').selectOption('fridge');
      await page.getByTestId('profile-start-compressor').tap();
      await page.getByTestId('profile-duty-0').waitFor();
      expect(await page.getByTestId('profile-duty-0-on').inputValue()).toBe('12');
      expect(await page.getByTestId('profile-duty-0-period').inputValue()).toBe('30');

      await page.getByTestId('profile-outage-start').tap();
      await page.getByTestId('profile-outage-start').fill('18:00');
      await checkPreview(page);

      await shownRuntime(page, body, cliRuntime(fridgeAndLightsProject(FRIDGE_AND_LIGHTS)).page);
      expect(await seriousAxeViolations(page)).toEqual([]);
      expect(await page.evaluate('document.documentElement.scrollWidth - window.innerWidth')).toBeLessThanOrEqual(0);
      await shot(page, 'profile-editor', 'profile-editor-phone.png');
      await shot(page, 'profile-strip', 'profile-strip-phone.png');
      await page.emulateMedia({ colorScheme: 'dark' });
      expect(await seriousAxeViolations(page)).toEqual([]);
      await shot(page, 'profile-editor', 'profile-editor-phone-dark.png');
      expect(errors).toEqual([]);
    } finally {
      await context.close();
    }
  });

  it('shows the hillside demo’s profile and edits it: a level as a share of the rating, a bad value kept at its field', async () => {
    const { context, page, errors } = await openDemo(app!.browser, VIEWPORTS.desktop, 'hillside-relay-hut', { baseUrl: app!.baseUrl, colorScheme: 'dark' });
    try {
      await page.getByTestId('panel-battery').locator('summary').click();
      const body = page.getByTestId('battery-panel');
      await body.waitFor();
      await page.getByTestId('profile-editor').waitFor();
      expect(await page.getByTestId('profile-words').textContent()).toBe('By the clock: 3 segments a day, the outage beginning at 18:00; cycling on their own: Vaccine fridge.');
      await page.getByTestId('profile-edit-summary').click();
      // The demo's profile (core/demos/hillside-relay-hut.json): lights 80 W from 06:00, 220 W from 18:00,
      // 40 W from 23:00; the fridge 12 min in 30; the outage at 18:00; a study of 96 h.
      const handles = page.locator('[data-testid^="profile-handle-"]');
      expect(await handles.count()).toBe(3);
      expect(await Promise.all([0, 1, 2].map((i) => page.getByTestId(`profile-handle-${i}`).getAttribute('aria-valuetext')))).toEqual(['06:00', '18:00', '23:00']);
      // Loads by their names: the fridge is the first load, the lights the second.
      expect(await page.locator('label[for="profile-seg-0-load-1-mode"]').textContent()).toBe('Lights and sockets');
      expect(await Promise.all([0, 1, 2].map((i) => page.getByTestId(`profile-seg-${i}-value-1`).inputValue()))).toEqual(['80', '220', '40']);
      expect(await page.getByTestId('profile-duty-0-load').inputValue()).toBe('fridge');
      expect(await page.getByTestId('profile-duty-0-on').inputValue()).toBe('12');
      expect(await page.getByTestId('profile-outage-start').inputValue()).toBe('18:00');
      expect(await page.getByTestId('profile-horizon').inputValue()).toBe('96');
      // The day by hand (E = Σ P·Δt): fridge 150 W × 24 h × 0.4 = 1440 Wh; lights 80 W × 12 h + 220 W × 5 h
      // + 40 W × 7 h = 2340 Wh; radios 85 W × 24 h = 2040 Wh: 5820 Wh, 242.5 W on average, 455 W at the peak.
      await expect.poll(async () => plain(await page.getByTestId('profile-energy').textContent())).toBe('5.82 kWh');
      expect(plain(await page.getByTestId('profile-average').textContent())).toBe('242.5 W');
      expect(plain(await page.getByTestId('profile-peak').textContent())).toBe('455 W');
      const demo = structuredClone(demoProjects.find((d) => d.id === 'hillside-relay-hut')!.project) as unknown as Json;
      await shownRuntime(page, body, cliRuntime(demo).page);

      // The evening's lights at 50 % of their 220 W rating: 110 W from 18:00 to 23:00.
      await page.getByTestId('profile-seg-1-mode-1').selectOption('percent');
      expect(await page.getByTestId('profile-seg-1-value-1').inputValue()).toBe('100');
      await page.getByTestId('profile-seg-1-value-1').fill('50');
      // By hand: 5820 − (220 − 110) W × 5 h = 5270 Wh.
      await expect.poll(async () => plain(await page.getByTestId('profile-energy').textContent())).toBe('5.27 kWh');
      demo['backup'].profile.segments[1].loads.lights = { percent: 50 };
      await shownRuntime(page, body, cliRuntime(demo).page);

      // Above 100 % of the rating: refused at the field with the engine's words, nothing stored.
      await page.getByTestId('profile-seg-1-value-1').fill('120');
      await expect.poll(async () => plain(await page.locator('#profile-seg-1-load-1-value-error').textContent())).toMatch(/must not exceed 100 % of the load's rating/);
      expect(plain(await page.getByTestId('profile-energy').textContent())).toBe('5.27 kWh');
      await page.getByTestId('profile-seg-1-value-1').fill('50');
      await expect.poll(() => page.locator('#profile-seg-1-load-1-value-error').count()).toBe(0);

      // A study length the study cannot run: the message at the field, the last figures kept.
      await page.getByTestId('profile-horizon').fill('-3');
      await expect.poll(async () => plain(await page.locator('#profile-horizon-error').textContent())).toMatch(/greater than 0/);
      await expect.poll(() => body.getAttribute('data-state')).toBe('stale');
      expect(plain(await page.getByTestId('battery-runtime').textContent())).toBe(plain(cliRuntime(demo).page));
      await page.getByTestId('profile-horizon').fill('96');
      await expect.poll(() => page.locator('#profile-horizon-error').count()).toBe(0);

      // A mouse drags the 23:00 handle to 22:00 (pointer events, as touch): by hand 5270 Wh − (110 − 40) W × 1 h = 5200 Wh.
      const handle = page.getByTestId('profile-handle-2');
      await handle.scrollIntoViewIfNeeded();
      const hb = (await handle.boundingBox())!;
      const bar = (await page.getByTestId('profile-strip').locator('.day-strip__bar').boundingBox())!;
      await page.mouse.move(hb.x + hb.width / 2, hb.y + hb.height / 2);
      await page.mouse.down();
      await page.mouse.move(bar.x + 2 + ((bar.width - 4) * 22) / 24, hb.y + hb.height / 2, { steps: 6 });
      await page.mouse.up();
      await expect.poll(() => handle.getAttribute('aria-valuetext')).toBe('22:00');
      await expect.poll(async () => plain(await page.getByTestId('profile-energy').textContent())).toBe('5.2 kWh');
      demo['backup'].profile.segments[2].startHour = 22;
      await shownRuntime(page, body, cliRuntime(demo).page);

      expect(await seriousAxeViolations(page)).toEqual([]);
      await shot(page, 'profile-editor', 'profile-editor-hillside-desktop-dark.png');
      expect(errors).toEqual([]);
    } finally {
      await context.close();
    }
  });
});
