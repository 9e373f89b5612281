/**
 * Edit-to-paint timing in real Chromium, for the notes (figures reported, not asserted: speed is
 * measured, never a pass/fail condition of a unit test).
 *
 * For each demo, a number field of one stage is changed 40 times through its input event, and each
 * time the probe waits for the first moment after the next frame has been painted (a
 * requestAnimationFrame callback followed by a message-channel task, the usual "after paint"
 * probe). What is asserted is correctness: every results part on screen already shows new figures
 * in that first paint (so the figure covers the engine's solve, what is on screen of the tables and
 * the energy-flow diagram), and the parts off screen, which catch up when the page is next idle
 * (web/components/lag.ts), all show them a few frames later; that time is reported as well.
 *
 * Two views, as a person works: the diagram in view (scrolled to the middle of the window: what a
 * client is shown while a figure is changed), and the stage's form in view (the field typed in the
 * middle of the window: typing, the diagram below the fold). Two timings of the edit within the frame:
 * - random phase (the reported figure): the edit comes at a random moment of the frame, as a key
 *   press does (a seeded random wait of 0–16.7 ms after a paint); the same probe with no edit gives
 *   its floor (the wait for the next frame, about half a frame on average);
 * - worst phase: the edit comes right after a paint, so one whole frame of waiting is in every
 *   figure (its floor is one frame, ~16.7 ms at 60 Hz).
 * The medians go to the console and to tests/.artifacts/edit-to-paint.json.
 *
 * Where the time goes: one more run per view is traced (Chromium's timeline through a CDP session)
 * and each edit's frame is split into the main thread's parts: the script of the edit's own task
 * after the edit (input handler, solve, signals, Preact's render), other script before the paint
 * (animation-frame callbacks), style and layout, and paint (pre-paint, paint, layerize, commit),
 * each a median over the edits (`breakdown` in the artifact). Tracing adds a little to every part,
 * so these are read as shares, not as the figures above.
 */
import { writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { loadavg } from 'node:os';
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

/**
 * The parts of the page that show results, each with the element whose box says whether it is on
 * screen and the text that must change after an edit. Parts off screen catch up when the page is
 * next idle (web/components/lag.ts), so an edit's own frame paints only the parts on screen.
 */
const PARTS = {
  balance: { box: '[data-testid="energy-balance"]', text: '[data-testid="energy-balance"]' },
  // The diagram a person sees is a canvas (flow-canvas.ts): what it shows is read as a checksum of its pixels.
  diagram: { box: '[data-testid="flow-canvas"]', text: '[data-testid="flow-canvas"]', pixels: true },
  cards: { box: '#chain-cards', text: '#chain-cards [data-testid="stage-card-result"]' },
  elements: { box: '[data-testid="element-table"]', text: '[data-testid="element-table"]' },
  cables: { box: '[data-testid="cable-table"]', text: '[data-testid="cable-table"]' },
  ports: { box: '[data-testid="port-table"]', text: '[data-testid="port-table"]' },
} as const;

/**
 * In-page probe. `edit` false: a no-op event (the floor). `phase` 'random': wait a seeded random
 * 0–16.7 ms after a paint before the edit; 'worst': edit right after the paint.
 *
 * After each edit it takes the time at the first paint, then checks that every part on screen
 * (its box meets the window) already shows new figures in that paint, and that at least one part
 * is on screen. Then it waits, frame by frame, until every part has new figures (the off-screen
 * ones catch up when the page is idle) and takes that time too.
 */
const PROBE = `async ({ selector, values, edits, edit, phase, seed, parts }) => {
  const input = document.querySelector(selector);
  if (!input) throw new Error('no field ' + selector);
  // A canvas's "text" is a checksum of its pixels (FNV-1a over the RGBA words): new figures drawn change it.
  const pixels = (canvas) => {
    const data = new Uint32Array(canvas.getContext('2d').getImageData(0, 0, canvas.width, canvas.height).data.buffer);
    let h = 2166136261;
    for (let i = 0; i < data.length; i++) h = Math.imul(h ^ data[i], 16777619);
    return canvas.width + 'x' + canvas.height + ':' + (h >>> 0);
  };
  const texts = () => Object.fromEntries(Object.entries(parts).map(([k, p]) =>
    [k, [...document.querySelectorAll(p.text)].map((e) => (p.pixels ? pixels(e) : e.textContent)).join('|')]));
  const onScreen = (k) => {
    const box = document.querySelector(parts[k].box);
    if (!box) return false;
    const r = box.getBoundingClientRect();
    return r.bottom > 0 && r.top < innerHeight && r.height > 0;
  };
  const settle = async (value) => {
    input.value = value;
    input.dispatchEvent(new Event('input', { bubbles: true }));
    await new Promise((r) => setTimeout(r, 400));
    return texts();
  };
  // The parts whose figures differ between the two values (a part the edited field does not
  // reach, such as a cable on another branch, keeps its text).
  const a = await settle(values[0]);
  const b = await settle(values[1]);
  const present = Object.keys(parts).filter((k) => document.querySelector(parts[k].box) && a[k] !== b[k]);
  if (!present.includes('diagram')) throw new Error('the edit does not change the diagram');
  const afterPaint = () => new Promise((resolve) => requestAnimationFrame(() => {
    const ch = new MessageChannel();
    ch.port1.onmessage = () => resolve(performance.now());
    ch.port2.postMessage(0);
  }));
  let state = seed >>> 0;
  const random = () => ((state = (Math.imul(state, 1664525) + 1013904223) >>> 0) / 4294967296);
  const times = [];
  const whole = [];
  const problems = [];
  let shownParts = [];
  // The field holds values[1]: the first edit sets values[0], the next values[1], and so on.
  for (let i = 0; i < edits; i++) {
    await afterPaint();
    if (phase === 'random') await new Promise((r) => setTimeout(r, random() * 16.7));
    const before = edit ? texts() : null;
    if (edit) input.value = values[i % 2];
    const t0 = performance.now();
    if (edit) performance.mark('joulepath-edit');
    if (edit) input.dispatchEvent(new Event('input', { bubbles: true }));
    else document.body.dispatchEvent(new Event('joulepath-nothing'));
    const t1 = await afterPaint();
    times.push(t1 - t0);
    if (!edit) continue;
    const first = texts();
    shownParts = present.filter(onScreen);
    if (shownParts.length === 0) problems.push('edit ' + i + ': no results part on screen');
    for (const k of shownParts) if (first[k] === before[k]) problems.push('edit ' + i + ': ' + k + ' (on screen) not new in the first paint');
    let now = first;
    let t2 = t1;
    for (let f = 0; f < 60 && present.some((k) => now[k] === before[k]); f++) {
      t2 = await afterPaint();
      now = texts();
    }
    for (const k of present) if (now[k] === before[k]) problems.push('edit ' + i + ': ' + k + ' never caught up');
    whole.push(t2 - t0);
  }
  return { times, whole, problems, shownParts };
}`;

/**
 * Where the window is while editing: the diagram in the middle of it, or the stage's form with the
 * field being typed in the middle (the card row above it in view; a tall form centred whole would
 * push the cards above the window).
 */
const VIEWS: Record<'diagram' | 'form', (field: string) => string> = {
  diagram: () => `document.querySelector('[data-testid="energy-flow"]').scrollIntoView({ block: 'center' })`,
  form: (field) => `document.querySelector(${JSON.stringify(field)}).scrollIntoView({ block: 'center' })`,
};

function quantile(sorted: number[], q: number): number {
  const at = (sorted.length - 1) * q;
  const lo = Math.floor(at);
  const hi = Math.ceil(at);
  return sorted[lo]! + (sorted[hi]! - sorted[lo]!) * (at - lo);
}

interface Figures {
  /** From the edit to the first paint: the parts on screen show the new figures. */
  median: number;
  p90: number;
  max: number;
  edits: number;
  /** The same probe with no edit: the wait for the frame alone. */
  floorMedian: number;
  /** Parts on screen (all new in the first paint). */
  onScreen: string[];
  /** From the edit until every part, on screen or not, shows the new figures (median). */
  wholePageMedian: number;
  /** Where the time of the edit's frame goes, from a traced run (random phase only). */
  breakdown?: Breakdown;
}

/** One edit's frame on the main thread (ms), from the trace: see `frameParts`. */
interface Breakdown {
  /** The edit's own task from the edit on: input handler, solve, signals, Preact's render. */
  editScript: number;
  /** Other script before the paint (animation-frame callbacks, timers). */
  otherScript: number;
  /** Style recalculation and layout. */
  styleLayout: number;
  /** Pre-paint, paint, layerize and commit. */
  paint: number;
  /** From the edit to the end of the frame's commit. */
  frame: number;
}

interface TraceEvent {
  name: string;
  ph: string;
  ts: number;
  dur?: number;
  pid: number;
  tid: number;
  args?: { data?: { type?: string } };
}

/**
 * Splits each edit's frame (from the 'joulepath-edit' mark to the end of the first commit after it,
 * on the renderer's main thread) into the parts of `Breakdown`, and returns their medians.
 */
function frameParts(events: TraceEvent[]): Breakdown & { edits: number } {
  const marks = events.filter((e) => e.name === 'joulepath-edit');
  const input = events.find((e) => e.name === 'EventDispatch' && e.args?.data?.type === 'input');
  if (!input || marks.length === 0) throw new Error('the trace holds no edit');
  const main = events.filter((e) => e.pid === input.pid && e.tid === input.tid && e.ph === 'X' && e.dur !== undefined);
  const end = (e: TraceEvent) => e.ts + (e.dur ?? 0);
  const commits = main.filter((e) => e.name === 'Commit').map(end).sort((a, b) => a - b);
  const tasks = main.filter((e) => e.name === 'RunTask');
  const parts = { editScript: [] as number[], otherScript: [] as number[], styleLayout: [] as number[], paint: [] as number[], frame: [] as number[] };
  const sum = (list: TraceEvent[], names: string[]) => list.filter((e) => names.includes(e.name)).reduce((s, e) => s + (e.dur ?? 0), 0) / 1000;
  for (const mark of marks) {
    const stop = commits.find((c) => c > mark.ts);
    if (stop === undefined) continue;
    const own = tasks.find((t) => t.ts <= mark.ts && end(t) >= mark.ts);
    const ownEnd = own ? end(own) : mark.ts;
    const inFrame = main.filter((e) => e.ts >= ownEnd && e.ts < stop);
    parts.editScript.push((ownEnd - mark.ts) / 1000);
    parts.otherScript.push(sum(inFrame, ['FunctionCall', 'TimerFire']));
    parts.styleLayout.push(sum(inFrame, ['UpdateLayoutTree', 'Layout']));
    parts.paint.push(sum(inFrame, ['PrePaint', 'Paint', 'Layerize', 'Commit']) - sum(inFrame.filter((e) => e.name === 'Paint' && inFrame.some((o) => o !== e && o.name === 'Paint' && o.ts <= e.ts && end(o) >= end(e))), ['Paint']));
    parts.frame.push((stop - mark.ts) / 1000);
  }
  const median = (a: number[]) => quantile([...a].sort((x, y) => x - y), 0.5);
  return {
    editScript: median(parts.editScript),
    otherScript: median(parts.otherScript),
    styleLayout: median(parts.styleLayout),
    paint: median(parts.paint),
    frame: median(parts.frame),
    edits: parts.frame.length,
  };
}

describe.skipIf(skipWithout('chromium'))('edit-to-paint timing in Chromium', () => {
  let app: ServedApp | undefined;
  const figures: Record<string, Record<string, Figures>> = {};

  /** The machine's load (1-minute average) before and after: figures on a busy machine run slower. */
  const load: number[] = [];

  beforeAll(async () => {
    app = await serveBuiltApp('joulepath-timing-');
    load.push(loadavg()[0]!);
  });

  afterAll(async () => {
    load.push(loadavg()[0]!);
    await app?.close();
    if (Object.keys(figures).length) {
      const loadNote = `machine load (1-minute average) ${load.map((l) => l.toFixed(2)).join(' before, ')} after`;
      writeFileSync(join(artifacts, 'edit-to-paint.json'), `${JSON.stringify({ load: loadNote, ...figures }, null, 2)}\n`);
      const lines = Object.entries(figures).flatMap(([demo, runs]) =>
        Object.entries(runs).map(
          ([run, f]) =>
            `${demo} ${run}: median ${f.median.toFixed(1)} p90 ${f.p90.toFixed(1)} max ${f.max.toFixed(1)} (no-edit floor ${f.floorMedian.toFixed(1)}; on screen: ${f.onScreen.join(', ')}; whole page ${f.wholePageMedian.toFixed(1)})` +
            (f.breakdown
              ? `\n    traced frame ${f.breakdown.frame.toFixed(1)}: edit's script ${f.breakdown.editScript.toFixed(1)}, other script ${f.breakdown.otherScript.toFixed(1)}, style+layout ${f.breakdown.styleLayout.toFixed(1)}, paint ${f.breakdown.paint.toFixed(1)}`
              : ''),
        ),
      );
      console.log(`edit-to-paint (ms), ${loadNote}:\n  ${lines.join('\n  ')}`);
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
        const probe = async (options: { edit: boolean; phase: 'random' | 'worst'; edits: number; seed: number }) =>
          (await page.evaluate(`(${PROBE})(${JSON.stringify({ selector, values: c.values, parts: PARTS, ...options })})`)) as {
            times: number[];
            whole: number[];
            problems: string[];
            shownParts: string[];
          };
        const runs: Record<string, Figures> = {};
        for (const [view, scroll] of Object.entries(VIEWS)) {
          await page.evaluate(scroll(selector));
          // Warm up (the first edits compile code paths and render what came into view), then measure.
          await probe({ edit: true, phase: 'worst', edits: 6, seed: 1 });
          for (const phase of ['random', 'worst'] as const) {
            if (view === 'form' && phase === 'worst') continue;
            const run = await probe({ edit: true, phase, edits: EDITS, seed: 20261202 });
            expect(run.problems, 'parts on screen are new in the first paint; the rest catch up').toEqual([]);
            const floor = (await probe({ edit: false, phase, edits: EDITS, seed: 20261202 })).times.sort((a, b) => a - b);
            const sorted = [...run.times].sort((a, b) => a - b);
            let breakdown: Breakdown | undefined;
            if (phase === 'random') {
              // A traced run of its own, so tracing never touches the figures above.
              const cdp = await context.newCDPSession(page);
              const events: TraceEvent[] = [];
              cdp.on('Tracing.dataCollected', (e) => void events.push(...(e.value as unknown as TraceEvent[])));
              await cdp.send('Tracing.start', {
                categories: 'devtools.timeline,disabled-by-default-devtools.timeline,blink.user_timing',
                transferMode: 'ReportEvents',
              });
              const traced = await probe({ edit: true, phase, edits: 20, seed: 20261203 });
              const complete = new Promise((resolve) => cdp.once('Tracing.tracingComplete', resolve));
              await cdp.send('Tracing.end');
              await complete;
              await cdp.detach();
              expect(traced.problems).toEqual([]);
              const { edits: tracedEdits, ...parts } = frameParts(events);
              expect(tracedEdits).toBeGreaterThan(15);
              breakdown = parts;
            }
            runs[`${view} in view, ${phase} phase`] = {
              median: quantile(sorted, 0.5),
              p90: quantile(sorted, 0.9),
              max: sorted.at(-1)!,
              edits: sorted.length,
              floorMedian: quantile(floor, 0.5),
              onScreen: run.shownParts,
              wholePageMedian: quantile([...run.whole].sort((a, b) => a - b), 0.5),
              ...(breakdown ? { breakdown } : {}),
            };
          }
        }
        expect(await page.getByTestId('results-stale').count()).toBe(0);
        figures[c.demo] = runs;
      } finally {
        await context.close();
      }
    });
  }
});
