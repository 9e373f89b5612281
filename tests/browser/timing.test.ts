/**
 * Edit-to-paint timing in real Chromium, for the notes (figures reported, not asserted: speed is
 * measured, never a pass/fail condition of a unit test).
 *
 * For each demo, a number field of one stage is changed 40 times through its input event; the time
 * runs from just before the event is dispatched to the first moment after the next frame has been
 * painted (a requestAnimationFrame callback followed by a message-channel task, the usual
 * "after paint" probe). Each edit must have changed the energy balance and the diagram, so the
 * figure covers the engine's solve, the tables and the energy-flow diagram.
 * The same probe with no edit gives the floor: the wait for the next frame (one frame, ~16.7 ms at
 * 60 Hz, since each edit starts right after a paint). The medians go to the console and to
 * tests/.artifacts/edit-to-paint.json.
 */
import { writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { skipWithout } from '../tools/system-tools.ts';
import { VIEWPORTS, artifacts, serveBuiltApp, type ServedApp } from './harness.ts';

/** Which field of which stage is edited in each demo, and two values to alternate between. */
const CASES = [
  { demo: 'hillside-relay-hut', element: 'radios', path: 'power', values: ['85', '120'] },
  { demo: 'riverside-pump-station', element: 'panel', path: 'apparentPower', values: ['18', '24'] },
  { demo: 'cold-store-dc-bus', element: 'controls', path: 'power', values: ['240', '300'] },
] as const;

const EDITS = 40;

/** The same probe with nothing to do: the wait for the next frame alone (the floor of the figure). */
const FLOOR = `async (n) => {
  const afterPaint = () => new Promise((resolve) => requestAnimationFrame(() => {
    const ch = new MessageChannel();
    ch.port1.onmessage = () => resolve(performance.now());
    ch.port2.postMessage(0);
  }));
  const times = [];
  for (let i = 0; i < n; i++) {
    await afterPaint();
    const t0 = performance.now();
    document.body.dispatchEvent(new Event('joulepath-nothing'));
    times.push((await afterPaint()) - t0);
  }
  return times;
}`;

/** In-page probe: alternate the field's value, time each edit to the frame after it is painted. */
const PROBE = `async ({ selector, values, edits }) => {
  const input = document.querySelector(selector);
  if (!input) throw new Error('no field ' + selector);
  const balance = document.querySelector('[data-testid="energy-balance"]');
  const diagram = () => document.querySelector('[data-testid="energy-flow"] svg')?.textContent ?? '';
  const afterPaint = () => new Promise((resolve) => requestAnimationFrame(() => {
    const ch = new MessageChannel();
    ch.port1.onmessage = () => resolve(performance.now());
    ch.port2.postMessage(0);
  }));
  const times = [];
  let unchanged = 0;
  for (let i = 0; i < edits; i++) {
    await afterPaint();
    const beforeBalance = balance.textContent;
    const beforeDiagram = diagram();
    input.value = values[i % 2 === 0 ? 1 : 0];
    const t0 = performance.now();
    input.dispatchEvent(new Event('input', { bubbles: true }));
    const t1 = await afterPaint();
    times.push(t1 - t0);
    if (balance.textContent === beforeBalance || diagram() === beforeDiagram) unchanged++;
  }
  return { times, unchanged };
}`;

function quantile(sorted: number[], q: number): number {
  const at = (sorted.length - 1) * q;
  const lo = Math.floor(at);
  const hi = Math.ceil(at);
  return sorted[lo]! + (sorted[hi]! - sorted[lo]!) * (at - lo);
}

describe.skipIf(skipWithout('chromium'))('edit-to-paint timing in Chromium', () => {
  let app: ServedApp | undefined;
  const figures: Record<string, { median: number; p90: number; max: number; edits: number; frameFloorMedian: number }> = {};

  beforeAll(async () => {
    app = await serveBuiltApp('joulepath-timing-');
  });

  afterAll(async () => {
    await app?.close();
    if (Object.keys(figures).length) {
      writeFileSync(join(artifacts, 'edit-to-paint.json'), `${JSON.stringify(figures, null, 2)}\n`);
      console.log(
        `edit-to-paint (ms): ${Object.entries(figures)
          .map(([k, f]) => `${k} median ${f.median.toFixed(2)} p90 ${f.p90.toFixed(2)} max ${f.max.toFixed(1)} (no-op frame floor ${f.frameFloorMedian.toFixed(2)})`)
          .join('; ')}`,
      );
    }
  });

  for (const c of CASES) {
    it(`updates the numbers and the diagram after each edit (${c.demo})`, async () => {
      const context = await app!.browser.newContext({ viewport: VIEWPORTS.desktop, deviceScaleFactor: 1, locale: 'en-US' });
      const page = await context.newPage();
      try {
        await page.goto(`${app!.baseUrl}#demo=${c.demo}`, { waitUntil: 'load' });
        await page.getByTestId('chain-editor').waitFor();
        await page.locator('[data-testid="energy-flow"] svg').waitFor();
        await page.locator(`[data-testid="stage-card"][data-card-id="${c.element}"]`).click();
        const selector = `[data-testid="stage-form"][data-element-id="${c.element}"] [data-testid="field-${c.path}"]`;
        await page.locator(selector).waitFor();
        // Warm up (the first edits compile code paths), then measure.
        await page.evaluate(`(${PROBE})(${JSON.stringify({ selector, values: c.values, edits: 6 })})`);
        const run = (await page.evaluate(`(${PROBE})(${JSON.stringify({ selector, values: c.values, edits: EDITS })})`)) as {
          times: number[];
          unchanged: number;
        };
        expect(run.unchanged, 'every edit changes the balance and the diagram').toBe(0);
        expect(await page.getByTestId('results-stale').count()).toBe(0);
        const sorted = [...run.times].sort((a, b) => a - b);
        const floor = ((await page.evaluate(`(${FLOOR})(${EDITS})`)) as number[]).sort((a, b) => a - b);
        figures[c.demo] = {
          median: quantile(sorted, 0.5),
          p90: quantile(sorted, 0.9),
          max: sorted.at(-1)!,
          edits: sorted.length,
          frameFloorMedian: quantile(floor, 0.5),
        };
      } finally {
        await context.close();
      }
    });
  }
});
