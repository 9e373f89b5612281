/**
 * What every browser test file needs: one production build, one preview server on a free local
 * port, and one headless Chromium (Debian's, driven by playwright-core) — started once per file.
 */
import { mkdirSync, mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { createRequire } from 'node:module';
import { createServer } from 'node:net';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { chromium, type Browser, type BrowserContext, type BrowserContextOptions, type Page } from 'playwright-core';
import { build, preview } from 'vite';
import { requireTool } from '../tools/system-tools.ts';

export const repoRoot = fileURLToPath(new URL('../..', import.meta.url));
export const configFile = join(repoRoot, 'vite.config.ts');
/** Screenshots and downloads for a person to look at (git-ignored). */
export const artifacts = join(repoRoot, 'tests', '.artifacts');

export const VIEWPORTS = {
  phone: { width: 390, height: 844 },
  desktop: { width: 1366, height: 768 },
} as const;

/** Flags for Chromium as root on a machine without a GPU or network (machine facts of this project). */
export const CHROMIUM_ARGS = [
  '--no-sandbox',
  '--disable-gpu',
  '--disable-background-networking',
  '--disable-component-update',
  '--disable-sync',
  '--no-first-run',
  '--disable-quic',
];

/** A TCP port that is free right now on 127.0.0.1. */
export function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const srv = createServer();
    srv.unref();
    srv.on('error', reject);
    srv.listen(0, '127.0.0.1', () => {
      const address = srv.address();
      const port = typeof address === 'object' && address ? address.port : 0;
      srv.close(() => resolve(port));
    });
  });
}

export interface ServedApp {
  /** http://127.0.0.1:<port>/ */
  baseUrl: string;
  browser: Browser;
  /** Seconds spent building, and starting the server and the browser. */
  buildSeconds: number;
  launchSeconds: number;
  /**
   * Build the app again (with `define` overrides, e.g. another version) and serve the new build at
   * the same address, as a site update would (the offline tests use it for the update prompt).
   */
  redeploy(overrides?: { define?: Record<string, string> }): Promise<void>;
  /** Close the browser and the server and remove the build. */
  close(): Promise<void>;
}

/** Build the app into a fresh temporary folder, serve it and start a browser. */
export async function serveBuiltApp(prefix: string): Promise<ServedApp> {
  const t0 = performance.now();
  let outDir = mkdtempSync(join(tmpdir(), prefix));
  await build({ configFile, logLevel: 'warn', build: { outDir, emptyOutDir: true } });
  const t1 = performance.now();
  const port = await freePort();
  const serve = (dir: string) =>
    preview({
      configFile,
      logLevel: 'warn',
      build: { outDir: dir },
      preview: { host: '127.0.0.1', port, strictPort: true, open: false },
    });
  let server = await serve(outDir);
  const baseUrl = server.resolvedUrls?.local[0] ?? '';
  if (!/^http:\/\/127\.0\.0\.1:\d+\/$/.test(baseUrl)) throw new Error(`the preview server reported no local address (${baseUrl})`);
  // launch() gives each run a fresh temporary profile (user-data-dir) and removes it on close.
  const browser = await chromium.launch({ executablePath: requireTool('chromium'), headless: true, args: CHROMIUM_ARGS });
  const t2 = performance.now();
  mkdirSync(artifacts, { recursive: true });
  return {
    baseUrl,
    browser,
    buildSeconds: (t1 - t0) / 1000,
    launchSeconds: (t2 - t1) / 1000,
    async redeploy(overrides = {}) {
      const next = mkdtempSync(join(tmpdir(), prefix));
      await build({ configFile, logLevel: 'warn', build: { outDir: next, emptyOutDir: true }, ...(overrides.define ? { define: overrides.define } : {}) });
      await server.close();
      rmSync(outDir, { recursive: true, force: true });
      outDir = next;
      server = await serve(outDir);
    },
    async close() {
      await browser.close();
      await server.close();
      rmSync(outDir, { recursive: true, force: true });
    },
  };
}

/** Collects the page's console errors and uncaught errors, as lines a test can expect to be empty. */
export function watchPageErrors(page: Page): string[] {
  const errors: string[] = [];
  page.on('console', (msg) => {
    if (msg.type() === 'error') errors.push(`console: ${msg.text()}`);
  });
  page.on('pageerror', (err) => errors.push(`page error: ${err.message}`));
  return errors;
}

/** One axe-core finding (axe-core, pinned in package.json). */
/**
 * A screenshot of the whole page, for a person to look at. Parts of the page skip rendering while
 * off screen (`skip-offscreen`, content-visibility: auto, web/styles.css) and a full-page capture
 * does not bring them on screen, so they are rendered for the capture and left as before after it.
 */
export async function fullPageScreenshot(page: Page, path: string): Promise<void> {
  await page.evaluate(
    `(() => { const s = document.createElement('style'); s.id = 'test-render-all'; s.textContent = '.skip-offscreen { content-visibility: visible !important; }'; document.head.append(s); })()`,
  );
  try {
    await page.screenshot({ path, fullPage: true });
  } finally {
    await page.evaluate(`document.getElementById('test-render-all')?.remove()`);
  }
}

export interface AxeViolation {
  id: string;
  impact: string | null;
  help: string;
  nodes: { target: unknown[]; failureSummary?: string }[];
}

const axeSource = readFileSync(createRequire(import.meta.url).resolve('axe-core/axe.min.js'), 'utf8');

/**
 * Serious and critical axe-core violations in `scope` (a JavaScript expression for an axe context:
 * 'document', a quoted selector, or an { include } object). axe is evaluated from the test rather
 * than added as a script tag: the page's content security policy refuses inline scripts, and
 * DevTools evaluation is not subject to it.
 */
export async function seriousAxeViolations(page: Page, scope = 'document'): Promise<AxeViolation[]> {
  if (!(await page.evaluate('typeof window.axe === "object"'))) await page.evaluate(axeSource);
  const violations = (await page.evaluate(`window.axe.run(${scope}, { resultTypes: ['violations'] }).then((r) => r.violations)`)) as AxeViolation[];
  return violations.filter((v) => v.impact === 'serious' || v.impact === 'critical');
}

export interface OpenDemoOptions {
  /** The preview server's address (`ServedApp.baseUrl`). */
  baseUrl: string;
  colorScheme?: 'light' | 'dark';
  /** The browser's locale (default en-US, the number format most checks are written in). */
  locale?: string;
  /** More options of the new browser context (touch, a phone's user agent, downloads). */
  contextOptions?: BrowserContextOptions;
  /** Script run in the page before its own (e.g. a setting this device kept in localStorage). */
  initScript?: string;
  /** Open the page in this context instead of a new one (the caller closes it). */
  context?: BrowserContext;
}

/**
 * What most page tests start with: a browser context at `viewport` (deviceScaleFactor 1), a page whose
 * errors are collected, the app opened at a demo (`#demo=<id>`; null: the app's own start), and the
 * results shown. The caller closes the context.
 */
export async function openDemo(
  browser: Browser,
  viewport: { width: number; height: number },
  demo: string | null,
  options: OpenDemoOptions,
): Promise<{ context: BrowserContext; page: Page; errors: string[] }> {
  const context =
    options.context ?? (await browser.newContext({ viewport, deviceScaleFactor: 1, locale: options.locale ?? 'en-US', colorScheme: options.colorScheme ?? 'light', ...options.contextOptions }));
  if (options.initScript) await context.addInitScript(options.initScript);
  const page = await context.newPage();
  const errors = watchPageErrors(page);
  await page.goto(demo === null ? options.baseUrl : `${options.baseUrl}#demo=${demo}`, { waitUntil: 'load' });
  await page.getByTestId('results').waitFor();
  return { context, page, errors };
}

/** Open a demo from the demo picker; on a narrow screen the picker is in the projects view, opened first. */
export async function pickDemo(page: Page, id: string): Promise<void> {
  await showProjectsView(page);
  await page.locator(`a[data-demo-id="${id}"]`).click();
}

/** Show the projects view (stored projects, demo picker) when it is not on screen (a narrow screen). */
export async function showProjectsView(page: Page): Promise<void> {
  if (!(await page.getByTestId('projects-view').isVisible())) await page.getByTestId('projects-button').click();
}

/** Choose a display setting (units, number format, theme) in the header's settings menu, then close it. */
export async function chooseSetting(page: Page, testId: 'units-select' | 'locale-select' | 'theme-select', value: string): Promise<void> {
  const button = page.getByTestId('settings-button');
  if ((await button.getAttribute('aria-expanded')) !== 'true') await button.click();
  await page.getByTestId(testId).selectOption(value);
  await page.getByTestId('settings-panel').getByRole('button', { name: 'Done' }).click();
}

/** Carry out a chain operation on the selected card: from its toolbar, or else from its "More" menu. */
export async function chainOp(page: Page, testId: string): Promise<void> {
  const direct = page.locator(`[data-testid="card-tools"] > [data-testid="${testId}"]`);
  if ((await direct.count()) > 0) return direct.click();
  await page.getByTestId('op-more').click();
  await page.getByTestId('more-menu').getByTestId(testId).click();
}

/**
 * Wait until the answers strip is whole: its lines (loaded beside the first results, lazily) have
 * mounted and no figure in it is still working or updating. Before the lines mount the strip holds no
 * study figure at all, so a check that "none says working…" would hold vacuously.
 */
export async function answersSettled(page: Page, timeout = 20_000): Promise<void> {
  await page.waitForFunction(
    () => {
      const strip = document.querySelector('[data-testid="answers"]');
      return !!strip && !!strip.querySelector('[data-testid="answer-loss-split"]') && !strip.querySelector('[aria-busy="true"]');
    },
    undefined,
    { timeout },
  );
}
