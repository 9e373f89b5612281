// Keeps core/ free of DOM, storage, network, clock and web/ imports (rules in core-purity.ts).
import { readFileSync } from 'node:fs';
import { join, relative } from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { sourceFiles } from './source-files.ts';
import { checkCoreFile, type PurityViolation } from './core-purity.ts';

const repoRoot = fileURLToPath(new URL('../..', import.meta.url));

describe('core/ stays a pure engine', () => {
  it('no file in core/ uses the DOM, storage, network, clock or web/', () => {
    const files = sourceFiles(join(repoRoot, 'core'));
    expect(files.length).toBeGreaterThan(0);
    const violations: PurityViolation[] = files.flatMap((path) =>
      checkCoreFile(relative(repoRoot, path).split('\\').join('/'), readFileSync(path, 'utf8')),
    );
    const report = violations.map((v) => `${v.file}:${v.line} ${v.rule}: ${v.text}`).join('\n');
    expect(report, 'core/ must stay free of these').toBe('');
  });
});

// The checker itself, on made-up snippets (cases written for this test; no external source).
describe('the purity checker', () => {
  const rules = (file: string, src: string) => checkCoreFile(file, src).map((v) => v.rule);

  it.each([
    ['const t = document.title;', 'browser global (DOM)'],
    ['window.addEventListener("x", f);', 'browser global (DOM)'],
    ['localStorage.setItem("a", "b");', 'browser storage'],
    ['const db = indexedDB.open("x");', 'browser storage'],
    ['await fetch("/data.json");', 'network (fetch)'],
    ['const t0 = Date.now();', 'clock (Date.now)'],
    ['const d = new Date();', 'clock (new Date())'],
    ["import { view } from '../web/view.ts';", 'imports from web/'],
    ["import { readFileSync } from 'node:fs';", 'Node built-in module outside cli.ts'],
    ["const x = await import('../../web/format/number.ts');", 'imports from web/'],
  ])('flags %s', (src, rule) => {
    expect(rules('core/solve/x.ts', src)).toContain(rule);
  });

  it.each([
    ['// the result is documented in the window of the README; fetch( later', 'comment'],
    ['/** Date.now() is never called here; see document.title */ const a = 1;', 'block comment'],
    ["const m = 'open the window and call fetch(x) with Date.now';", 'string'],
    ['const m = `window.${name} and document.title`;', 'template text'],
    ['const documentCount = 3; const windowed = documentCount + 1;', 'longer identifiers'],
    ['const r = result.window.length; obj.fetch(1);', 'property names'],
    ["import type { Project } from './model.ts';", 'relative import'],
  ])('accepts %s (%s)', (src) => {
    expect(rules('core/solve/x.ts', src)).toEqual([]);
  });

  it('lets core/cli/cli.ts use Node but not the DOM', () => {
    const cli = "import { readFileSync } from 'node:fs';\nconsole.log(process.argv);\nconst d = new Date();";
    expect(rules('core/cli/cli.ts', cli)).toEqual([]);
    expect(rules('core/cli/cli.ts', 'document.write(1);')).toContain('browser global (DOM)');
  });

  it('still sees code inside template expressions', () => {
    expect(rules('core/x.ts', 'const s = `t=${Date.now()}`;')).toContain('clock (Date.now)');
  });
});
