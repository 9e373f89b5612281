/**
 * The command-line tool as one self-contained ES module: `dist-cli/joulepath.mjs`.
 *
 * An SSR (Node) build of core/cli/cli.ts with every dependency bundled in (zod and the engine), so the file
 * runs with Node 20 alone, without node_modules and without a TypeScript runner: `npm run build:cli`
 * writes it and `npm pack` (the `prepack` script) builds it before packing. The package's `bin`
 * (`joulepath`) points at it. Separate from vite.config.ts, which builds the page and runs the tests.
 */
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { defineConfig } from 'vite';

/** What `joulepath --version` prints (package.json). */
const version = (JSON.parse(readFileSync(new URL('./package.json', import.meta.url), 'utf8')) as { version: string }).version;

export default defineConfig({
  root: fileURLToPath(new URL('.', import.meta.url)),
  // The page's public folder and plugins have nothing to do with the command line.
  publicDir: false,
  logLevel: 'warn',
  define: {
    __JOULEPATH_VERSION__: JSON.stringify(version),
  },
  ssr: {
    // Bundle every import (zod included): the file must not need node_modules at run time.
    noExternal: true,
    target: 'node',
  },
  build: {
    ssr: 'core/cli/cli.ts',
    outDir: 'dist-cli',
    emptyOutDir: true,
    target: 'node20',
    // Smaller to read and parse at start-up; messages and names the user reads are strings, kept as they are.
    minify: true,
    sourcemap: false,
    copyPublicDir: false,
    rolldownOptions: {
      output: {
        format: 'es',
        entryFileNames: 'joulepath.mjs',
        banner: '#!/usr/bin/env node',
      },
    },
  },
});
