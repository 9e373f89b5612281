/**
 * One config for the app (Vite) and the tests (Vitest).
 *
 * The app lives in web/ and builds to dist/. The tests run in Node from the repository root as
 * projects: `unit` (engine, page formatting, tools), `reference` (cases from outside sources),
 * `properties` (fast-check invariants) and `browser` (real Chromium against a production build),
 * which gets long timeouts because it builds the app and starts a browser; `npm test` runs these in
 * one `vitest run`, then `timing` (edit-to-paint in Chromium) alone.
 */
import { fileURLToPath } from 'node:url';
import { defineConfig } from 'vitest/config';
import preact from '@preact/preset-vite';
import { VitePWA } from 'vite-plugin-pwa';
import { readFileSync } from 'node:fs';

const repoRoot = fileURLToPath(new URL('.', import.meta.url));
/** The engine's entry files for the page: re-exports only, so free of side effects (see build below). */
const ENGINE_ENTRY = /[\\/]core[\\/](page|studies[\\/]index)\.ts$/;
const webRoot = fileURLToPath(new URL('./web', import.meta.url));
/** The version the page shows and the service worker's precache follows (package.json). */
const appVersion = (JSON.parse(readFileSync(new URL('./package.json', import.meta.url), 'utf8')) as { version: string }).version;

export default defineConfig({
  root: webRoot,
  // Assets resolve relative to the page so the build also works from a sub-path.
  base: './',
  plugins: [
    // The preset's prerender step is not used: the page is rendered in the browser.
    preact(),
    // Offline use (issue 7): service-worker/sw.ts is built with the list of every built file injected
    // (injectManifest). The page registers it itself (web/sw-register.ts) and ships its own
    // web/public/manifest.webmanifest, so the plugin adds nothing to index.html.
    VitePWA({
      strategies: 'injectManifest',
      srcDir: '../service-worker',
      filename: 'sw.ts',
      injectRegister: false,
      manifest: false,
      injectManifest: {
        // The whole shell, lazy chunks included; nothing is fetched at run time.
        globPatterns: ['**/*.{js,css,html,svg,png,webmanifest}'],
      },
      devOptions: { enabled: false },
    }),
  ],
  define: {
    __JOULEPATH_VERSION__: JSON.stringify(appVersion),
  },
  build: {
    outDir: fileURLToPath(new URL('./dist/', import.meta.url)),
    emptyOutDir: true,
    target: 'es2022',
    rollupOptions: {
      // The engine's entry files for the page (core/page.ts, core/studies/index.ts) are re-exports only
      // (tests/tools/entry-points.test.ts checks it), so importing one runs nothing of its own: without
      // this the bundler would keep every module behind an entry that has a top-level call (a study
      // the importing chunk never uses) and a lazy chunk would load other studies' code.
      treeshake: { moduleSideEffects: (id: string) => !ENGINE_ENTRY.test(id) },
    },
  },
  // The panel worker is bundled on its own: the same rule for the engine's entry files there.
  worker: {
    rollupOptions: { treeshake: { moduleSideEffects: (id: string) => !ENGINE_ENTRY.test(id) } },
  },
  server: {
    host: '127.0.0.1',
    port: 5173,
    // Let the dev server read core/ (outside the app root).
    fs: { allow: [repoRoot] },
  },
  preview: {
    host: '127.0.0.1',
  },
  test: {
    root: repoRoot,
    environment: 'node',
    projects: [
      {
        extends: true,
        test: {
          name: 'unit',
          include: ['tests/**/*.test.ts'],
          // The page's engine loads on demand (web/state/engine.ts); the page-state tests have it loaded.
          setupFiles: ['tests/web/engine.setup.ts'],
          // Benchmarks belong to this project only, so `vitest bench` runs each of them once.
          benchmark: { include: ['tests/**/*.bench.ts'] },
          exclude: ['tests/browser/**', 'tests/reference/**', 'tests/properties/**', '**/node_modules/**'],
          // Several unit tests start a process (the CLI, tsc on the schema, a packed install): under load on a
          // shared 2-core machine one took over Vitest's default 5 s. A hang is still caught at 30 s.
          testTimeout: 30_000,
        },
      },
      {
        extends: true,
        test: { name: 'reference', include: ['tests/reference/**/*.test.ts'], benchmark: { include: [] } },
      },
      {
        extends: true,
        // Properties run hundreds of cases each; on a loaded CI machine one that takes 0.7 s alone took
        // over Vitest's default 5 s. A hang is still caught (the hostile-input property also times each case).
        test: {
          name: 'properties',
          include: ['tests/properties/**/*.test.ts'],
          setupFiles: ['tests/web/engine.setup.ts'],
          testTimeout: 30_000,
          benchmark: { include: [] },
        },
      },
      {
        extends: true,
        test: {
          name: 'browser',
          include: ['tests/browser/**/*.test.ts'],
          // The edit-to-paint timings run alone, after everything else (the `timing` project).
          exclude: ['tests/browser/timing.test.ts', '**/node_modules/**'],
          benchmark: { include: [] },
          // Builds the app and drives a real browser: minutes, not seconds, on a slow machine.
          testTimeout: 180_000,
          hookTimeout: 240_000,
          // A shared 2-core machine under load: give expect.poll more than its 1 s default.
          expect: { poll: { timeout: 10_000 } },
        },
      },
      {
        // Edit-to-paint timings in Chromium: `npm test` runs this project on its own after the others,
        // so the figures are not taken while other test files load the machine's two cores.
        extends: true,
        test: {
          name: 'timing',
          include: ['tests/browser/timing.test.ts'],
          benchmark: { include: [] },
          testTimeout: 180_000,
          hookTimeout: 240_000,
        },
      },
    ],
  },
});
