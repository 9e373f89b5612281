/**
 * The engine as the app ships it: core/index.ts bundled into one ES module by Vite (library mode),
 * then imported. Benchmarks of the bundle measure the code the page runs; benchmarks through
 * Vitest's own module runner add a per-call cost to every cross-module function (live bindings),
 * which matters for small functions called in hot loops. Both figures are reported.
 */
import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { pathToFileURL, fileURLToPath } from 'node:url';
import { build } from 'vite';

type Core = typeof import('../../core/index.ts');

export async function bundledCore(): Promise<Core> {
  const outDir = mkdtempSync(join(tmpdir(), 'joulepath-core-bundle-'));
  await build({
    configFile: false,
    logLevel: 'silent',
    build: {
      outDir,
      emptyOutDir: true,
      minify: false,
      target: 'es2022',
      lib: { entry: fileURLToPath(new URL('../../core/index.ts', import.meta.url)), formats: ['es'], fileName: () => 'core.js' },
    },
  });
  return (await import(pathToFileURL(join(outDir, 'core.js')).href)) as Core;
}
