#!/usr/bin/env node
/**
 * JavaScript shipped on first load, gzipped (issue 6 target: under 80 kB).
 *
 * First load = the page's module script plus every `<link rel="modulepreload">` in the built
 * index.html (the chunks the entry imports statically). Chunks loaded on demand (panels, the
 * diagram) and the service worker are not counted. Sizes are gzip at zlib's default level 6, the
 * level most servers use for on-the-fly compression; kB = 1000 bytes.
 *
 * Usage (npm run size -- [options]):
 *   node tests/tools/first-load.mjs                 build into a temporary folder, measure, delete it
 *   node tests/tools/first-load.mjs --out DIR       build into DIR and keep it (add --sourcemap for maps)
 *   node tests/tools/first-load.mjs --dist DIR      measure an existing build, no build
 *   --json                                          print the figures as JSON
 *
 * Figures only: nothing here passes or fails on the size.
 */
import { execFileSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { gzipSync } from 'node:zlib';

const repoRoot = fileURLToPath(new URL('../..', import.meta.url));
const args = process.argv.slice(2);
const option = (name) => {
  const i = args.indexOf(name);
  if (i < 0) return undefined;
  const value = args[i + 1];
  if (!value || value.startsWith('--')) throw new Error(`${name} needs a folder.`);
  return resolve(value);
};
const json = args.includes('--json');
const sourcemap = args.includes('--sourcemap');
const dist = option('--dist');
const out = option('--out');

let dir = dist ?? out;
let temporary = false;
if (!dist) {
  if (!dir) {
    dir = mkdtempSync(join(tmpdir(), 'joulepath-size-'));
    temporary = true;
  }
  const viteArgs = ['vite', 'build', '--outDir', dir, '--emptyOutDir', '--logLevel', 'warn'];
  if (sourcemap) viteArgs.push('--sourcemap');
  execFileSync('npx', viteArgs, { cwd: repoRoot, stdio: ['ignore', 'ignore', 'inherit'] });
}

try {
  const html = readFileSync(join(dir, 'index.html'), 'utf8');
  const attr = (tag, name) => new RegExp(`\\b${name}\\s*=\\s*["']([^"']+)["']`).exec(tag)?.[1];
  const files = [];
  for (const [tag] of html.matchAll(/<script\b[^>]*>/g)) {
    if (attr(tag, 'type') === 'module' && attr(tag, 'src')) files.push({ file: attr(tag, 'src'), role: 'entry' });
  }
  for (const [tag] of html.matchAll(/<link\b[^>]*>/g)) {
    if (attr(tag, 'rel') === 'modulepreload' && attr(tag, 'href')) files.push({ file: attr(tag, 'href'), role: 'modulepreload' });
  }
  if (!files.some((f) => f.role === 'entry')) throw new Error(`No module script in ${join(dir, 'index.html')}.`);

  const rows = files.map(({ file, role }) => {
    const bytes = readFileSync(join(dir, file.replace(/^\.?\//, '')));
    return { file: file.replace(/^\.?\//, ''), role, raw: bytes.length, gzip: gzipSync(bytes).length };
  });
  const total = { raw: rows.reduce((s, r) => s + r.raw, 0), gzip: rows.reduce((s, r) => s + r.gzip, 0) };

  if (json) {
    console.log(JSON.stringify({ total, files: rows }, null, 2));
  } else {
    const kB = (n) => (n / 1000).toFixed(2).padStart(8);
    console.log('First-load JavaScript (gzip level 6, kB = 1000 B)');
    console.log(`${'gzip kB'.padStart(8)} ${'raw kB'.padStart(8)}  file`);
    for (const r of rows) console.log(`${kB(r.gzip)} ${kB(r.raw)}  ${r.file}${r.role === 'entry' ? '  (entry)' : ''}`);
    console.log(`${kB(total.gzip)} ${kB(total.raw)}  total, ${rows.length} files`);
    if (out) console.log(`Build kept in ${dir}`);
  }
} finally {
  if (temporary) rmSync(dir, { recursive: true, force: true });
}
