/**
 * The duty editor of the machines panel in a real browser (Debian's Chromium, playwright-core) against a
 * production build: from a project with a pump and no duty study, three duty points typed in give the
 * three-way comparison (drive, throttle valve, on-off) the engine gives for the same file; a fan added in
 * the page gives its own (drive, outlet dampers, on-off); a flow above the rated flow gets its message at
 * the row while the last valid comparison stays, marked out of date; a curve fitted from the maker's
 * points is written to the fan. axe finds nothing serious with the editor open, phone and desktop.
 * Screenshots go to tests/.artifacts/.
 */
import { join } from 'node:path';
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { skipWithout } from '../tools/system-tools.ts';
import { VIEWPORTS, artifacts, chainOp, chooseSetting, fullPageScreenshot, openDemo, seriousAxeViolations, serveBuiltApp, type ServedApp } from './harness.ts';
import { formatPumpDuty, projectPumpDuty } from '../../core/index.ts';
import { formatEnergy } from '../../web/format/number.ts';
import { onSolved } from '../core/solved.ts';

/** Spaces of every kind as one ASCII space (the page joins numbers and units with a narrow no-break space). */
const plain = (s: string | null | undefined) => (s ?? '').replace(/[\s\u202f\u00a0]+/g, ' ').trim();

// Invented plant room: a process pump on a drive, and a drive and motor waiting for a fan.
const PLANT = {
  format: 'joulepath-project',
  version: 2,
  name: 'Plant room',
  elements: [
    { id: 'mains', name: 'Mains', kind: 'grid', phases: 3, voltage: 400, frequency: 50 },
    { id: 'pump-drive', name: 'Pump drive', kind: 'drive', from: 'mains', outputVoltage: 400, outputFrequency: 45, inputPowerFactor: 0.95, standardLoss: { ratedApparentPower: 30000, basis: 'cdm' } },
    { id: 'pump-motor', name: 'Pump motor', kind: 'motor', from: 'pump-drive', ratedOutput: 22000, efficiencyClass: 'IE3', poles: 4, ratedFrequency: 50 },
    { id: 'pump', name: 'Process pump', kind: 'pump', from: 'pump-motor', ratedFlow: 0.05, ratedHead: 30, shutoffHead: 40, efficiency: 0.75, staticHead: 10, flow: 0.04, control: 'speed' },
    { id: 'fan-drive', name: 'Fan drive', kind: 'drive', from: 'mains', outputVoltage: 400, outputFrequency: 40, inputPowerFactor: 0.95, standardLoss: { ratedApparentPower: 11000, basis: 'cdm' } },
    { id: 'fan-motor', name: 'Fan motor', kind: 'motor', from: 'fan-drive', ratedOutput: 7500, efficiencyClass: 'IE3', poles: 4, ratedFrequency: 50 },
  ],
};

// Typed in m³/h (the form's unit in SI): 180, 144 and 90 m³/h are 0.05, 0.04 and 0.025 m³/s (÷ 3600).
const PUMP_DUTY = [
  { typed: '180', flow: 0.05, hours: 1000 },
  { typed: '144', flow: 0.04, hours: 3000 },
  { typed: '90', flow: 0.025, hours: 2000 },
];
// The fan: 7200, 5400 and 3600 m³/h are 2, 1.5 and 1 m³/s.
const FAN_DUTY = [
  { typed: '7200', flow: 2, hours: 1000 },
  { typed: '5400', flow: 1.5, hours: 3000 },
  { typed: '3600', flow: 1, hours: 2000 },
];
/** The fan the page's template puts after a 7.5 kW motor (web/editor/templates.ts: the largest listed rated flow within 80 % of the motor). */
const FAN_TEMPLATE = { id: 'fan', name: 'Fan', kind: 'fan', from: 'fan-motor', ratedPressure: 1000, shutoffPressure: 1300, efficiency: 0.7, ratedFlow: 2, flow: 1.6, control: 'damper' };

/** The engine's comparison for the project with this duty (the figures the page must show). */
function expected(elements: unknown[], machine: string, duty: { flow: number; hours: number }[]) {
  const out = onSolved(projectPumpDuty, { ...PLANT, elements, pumpDuty: { pump: machine, duty: duty.map(({ flow, hours }) => ({ flow, hours })) } });
  if (!out.ok) throw new Error(JSON.stringify(out.problems));
  return out.result;
}

describe.skipIf(skipWithout('chromium'))('the duty editor in Chromium', () => {
  let app: ServedApp | undefined;
  let browser: Browser | undefined;
  let baseUrl = '';

  beforeAll(async () => {
    app = await serveBuiltApp('joulepath-duty-build-');
    ({ browser, baseUrl } = app);
  });

  afterAll(async () => {
    await app?.close();
  });

  const energies = async (page: Page) =>
    Promise.all(['drive', 'throttle', 'on-off'].map(async (k) => plain(await page.getByTestId(`pump-duty-energy-${k}`).textContent())));
  const want = (r: ReturnType<typeof expected>) => [r.speedControl.energyWh, r.throttle.energyWh, r.onOff.energyWh].map((wh) => plain(formatEnergy(wh, 'en-US')));

  async function typeDuty(page: Page, rows: { typed: string; hours: number }[], adding: boolean) {
    for (const [i, r] of rows.entries()) {
      if (adding && i > 0) {
        await page.getByTestId('duty-add').click();
        await page.getByTestId(`duty-flow-${i}`).waitFor();
      }
      await page.getByTestId(`duty-flow-${i}`).fill(r.typed);
      await page.getByTestId(`duty-hours-${i}`).fill(String(r.hours));
    }
  }

  for (const [label, viewport, scheme] of [
    ['desktop', VIEWPORTS.desktop, 'light'],
    ['phone', VIEWPORTS.phone, 'dark'],
  ] as const) {
    it(`${label}: a pump duty from empty to the three-way comparison, then a fan added in the page the same`, async () => {
      const { context, page, errors } = await openDemo(browser!, viewport, null, { baseUrl, colorScheme: scheme });
      try {
        await page.getByTestId('open-file').setInputFiles({ name: 'plant.json', mimeType: 'application/json', buffer: Buffer.from(JSON.stringify(PLANT)) });
        await expect.poll(() => page.locator('#project-heading').innerText()).toBe('Plant room');
        await page.getByTestId('results').waitFor();

        // The machines panel: the editor offers the pump; no duty study yet.
        await page.getByTestId('panel-machines').locator('summary').click();
        const editor = page.getByTestId('duty-editor');
        await editor.waitFor();
        expect(await page.getByTestId('pump-duty-study').count()).toBe(0);
        expect(await page.getByTestId('duty-machine').inputValue()).toBe('');
        await page.getByTestId('duty-machine').selectOption('pump');
        await page.getByTestId('duty-flow-0').waitFor();
        // The curve fields are the pump's own (static head 10 m) and the table of both curves is shown.
        expect(await page.getByTestId('duty-staticHead').inputValue()).toBe('10');
        await page.getByTestId('duty-curve-table').waitFor();

        await typeDuty(page, PUMP_DUTY, true);
        expect(await page.getByTestId('duty-row').count()).toBe(3);
        // A fourth point added and taken away again.
        await page.getByTestId('duty-add').click();
        await expect.poll(() => page.getByTestId('duty-row').count()).toBe(4);
        await page.getByTestId('duty-remove-3').click();
        await expect.poll(() => page.getByTestId('duty-row').count()).toBe(3);
        const pump = expected(PLANT.elements, 'pump', PUMP_DUTY);
        await expect.poll(() => energies(page), { timeout: 20_000 }).toEqual(want(pump));
        expect(await page.getByTestId('pump-duty-study').getAttribute('data-machine')).toBe('pump');
        expect(await page.getByTestId('pump-duty-table').textContent()).toContain('Throttle valve');
        // The choice: the drive uses least at this duty (the engine's figures, worked in tests/machines/pump.test.ts).
        expect(pump.speedControl.energyWh).toBeLessThan(Math.min(pump.throttle.energyWh, pump.onOff.energyWh));
        expect(plain(await page.getByTestId('duty-hours-total').textContent())).toMatch(/^6,000 h of the 8,760 h of a year/);
        // The command line gives the same figures for the same file.
        expect(formatPumpDuty(pump)).toContain(`speed control by drive: ${(pump.speedControl.energyWh / 1000).toFixed(0)} kWh`);

        // The same levels as speeds of the drive (affinity laws on the system curve, core): 144 m³/h needs
        // √0.73 = 85.44 % (worked in tests/machines/pump.test.ts); 40 % cannot lift the 10 m static head
        // (the least speed is √(10/40) = 50 %): refused at the field, nothing stored.
        await page.getByTestId('duty-given').selectOption('speed');
        await expect.poll(() => page.getByTestId('duty-speed-1').inputValue()).toMatch(/^85\.4/);
        await page.getByTestId('duty-speed-1').fill('40');
        await expect.poll(async () => plain(await page.locator('#sf--pumpDuty_duty_1_flow-error').textContent())).toMatch(/Speed: must be above 50\.0 %/);
        await page.getByTestId('duty-speed-1').fill('100');
        await page.getByTestId('duty-given').selectOption('flow');
        await expect.poll(() => page.getByTestId('duty-flow-1').inputValue()).toBe('180');
        await page.getByTestId('duty-flow-1').fill('144');
        await expect.poll(() => energies(page), { timeout: 20_000 }).toEqual(want(pump));

        // A flow above the rated 180 m³/h: the study's message at its row; the last comparison stays, out of date.
        await page.getByTestId('duty-flow-2').fill('300');
        const rowError = page.locator('#sf--pumpDuty_duty_2_flow-error');
        await expect.poll(async () => plain(await rowError.textContent()), { timeout: 20_000 }).toMatch(/above the rated flow 180 m³\/h of the pump "Process pump"/);
        await expect.poll(() => page.getByTestId('pump-duty-study').getAttribute('data-state')).toBe('stale');
        expect(await energies(page)).toEqual(want(pump));
        expect(await seriousAxeViolations(page)).toEqual([]);
        await page.getByTestId('duty-flow-2').fill('90');
        await expect.poll(() => page.getByTestId('pump-duty-study').getAttribute('data-state'), { timeout: 20_000 }).toBe('current');
        await expect.poll(() => rowError.count()).toBe(0);
        await editor.scrollIntoViewIfNeeded();
        await page.screenshot({ path: join(artifacts, `duty-pump-${label}.png`) });
        await page.getByTestId('pump-duty-study').screenshot({ path: join(artifacts, `duty-pump-study-${label}.png`) });
        expect(await seriousAxeViolations(page)).toEqual([]);

        // A fan added in the page after the fan motor, from the kind chooser.
        await page.locator('[data-testid="stage-card"][data-card-id="fan-motor"]').click();
        await chainOp(page, 'op-add-after');
        await page.getByTestId('kind-chooser').waitFor();
        await page.locator('.kind-option[data-kind="fan"]').click();
        await expect.poll(() => page.locator('[data-testid="stage-card"][data-card-id="fan"]').count()).toBe(1);
        await expect.poll(() => page.locator('[data-testid="duty-machine"] option[value="fan"]').count(), { timeout: 20_000 }).toBe(1);
        // The fan's card: its operating point from the page's template (1.6 m³/s = 5760 m³/h behind the damper).
        await expect.poll(async () => plain(await page.getByTestId('fan-card').textContent()), { timeout: 20_000 }).toMatch(/5,760 m³\/h at .* Pa.*outlet damper at full speed/);
        await page.getByTestId('duty-machine').selectOption('fan');
        await expect.poll(() => page.locator('label[for="sf--pumpDuty_duty_0_flow"]').textContent()).toBe('Air flow');
        await typeDuty(page, FAN_DUTY, false);
        const withFan = [...PLANT.elements, FAN_TEMPLATE];
        const fan = expected(withFan, 'fan', FAN_DUTY);
        await expect.poll(() => energies(page), { timeout: 20_000 }).toEqual(want(fan));
        expect(await page.getByTestId('pump-duty-study').getAttribute('data-machine')).toBe('fan');
        expect(await page.getByTestId('pump-duty-table').textContent()).toContain('Outlet dampers');
        expect(await page.locator('#pump-duty-heading').textContent()).toBe('Fan duty: flow control over a year');
        expect(fan.speedControl.energyWh).toBeLessThan(Math.min(fan.throttle.energyWh, fan.onOff.energyWh));
        // Each point's drive speed: with no static pressure the affinity laws give speed = flow / rated flow: 100 %, 75 %, 50 %.
        expect(await page.getByTestId('duty-point-speed').allTextContents()).toEqual(['100%', '75%', '50%'].map((t) => t));

        // The fan's curve from three of the maker's points on Δp = 1400 − 75·Q² (Q in m³/s, standard air):
        // 0 → 1400 Pa, 3600 m³/h (1 m³/s) → 1325 Pa, 7200 m³/h (2 m³/s) → 1100 Pa. Least squares gives it back:
        // shut-off 1400 Pa, 1100 Pa at the rated 2 m³/s, residual 0.
        await page.getByTestId('duty-fit').locator('summary').click();
        for (const [i, [q, p]] of [['0', '1400'], ['3600', '1325'], ['7200', '1100']].entries()) {
          await page.getByTestId(`duty-fit-flow-${i}`).fill(q!);
          await page.getByTestId(`duty-fit-value-${i}`).fill(p!);
        }
        await page.getByTestId('duty-fit-run').click();
        expect(plain(await page.getByTestId('duty-fit-result').textContent())).toMatch(/shut-off 1,400 Pa, 1,100 Pa at the rated flow 7,200 m³\/h\. Residual 0 Pa root mean square/);
        expect(await seriousAxeViolations(page)).toEqual([]);
        await page.getByTestId('duty-fit-apply').click();
        await expect.poll(() => page.getByTestId('duty-shutoffPressure').inputValue()).toBe('1400');
        await expect.poll(() => page.getByTestId('duty-ratedPressure').inputValue()).toBe('1100');
        const refit = expected([...PLANT.elements, { ...FAN_TEMPLATE, ratedPressure: 1100, shutoffPressure: 1400 }], 'fan', FAN_DUTY);
        await expect.poll(() => energies(page), { timeout: 20_000 }).toEqual(want(refit));
        await editor.scrollIntoViewIfNeeded();
        await page.screenshot({ path: join(artifacts, `duty-fan-${label}.png`) });
        await fullPageScreenshot(page, join(artifacts, `duty-fan-${label}-full.png`));
        await page.getByTestId('pump-duty-study').screenshot({ path: join(artifacts, `duty-fan-study-${label}.png`) });
        expect(await seriousAxeViolations(page)).toEqual([]);
        expect(await page.evaluate('document.documentElement.scrollWidth - window.innerWidth')).toBeLessThanOrEqual(0);
        // In US units the fan's flows are in cfm and its pressures in inches of water: 2 m³/s = 2 / (0.3048³/60) = 4237.76 cfm
        // (NIST SP 811 B.8, foot); 1100 Pa = 1100 / 248.84 = 4.42 in. w.g. (inch of water at 60 °F).
        await chooseSetting(page, 'units-select', 'us');
        await expect.poll(() => page.locator('[data-testid="duty-row"]').first().locator('.study-field__unit').first().textContent()).toBe('cfm');
        expect(await page.getByTestId('duty-flow-0').inputValue()).toMatch(/^4,?237\.76/);
        expect(await page.getByTestId('duty-ratedPressure').inputValue()).toMatch(/^4\.42/);
        expect(errors).toEqual([]);
      } finally {
        await context.close();
      }
    }, 180_000);
  }
});
