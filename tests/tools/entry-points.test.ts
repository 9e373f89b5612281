// The page imports the engine through its entry points, and study code stays lazy (rules in entry-points.ts).
import { readFileSync } from 'node:fs';
import { join, relative } from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { sourceFiles } from './source-files.ts';
import { ENTRY_POINTS, STUDIES, checkEntryImports, importsOf, notReexports, staticClosure } from './entry-points.ts';

const repoRoot = fileURLToPath(new URL('../..', import.meta.url));

const rel = (p: string) => relative(repoRoot, p).split('\\').join('/');

describe('the page reads the engine through its entry points', () => {
  it('no file of web/ or service-worker/ imports a core/ file that is not an entry point', () => {
    const files = [...sourceFiles(join(repoRoot, 'web')), ...sourceFiles(join(repoRoot, 'service-worker'))].map(rel);
    expect(files.length).toBeGreaterThan(50);
    const report = files
      .flatMap((file) => checkEntryImports(file, readFileSync(join(repoRoot, file), 'utf8')))
      .map((v) => `${v.file}:${v.line} imports ${v.imports}; use ${ENTRY_POINTS.join(' or ')}`)
      .join('\n');
    expect(report, 'imports of core/ internals').toBe('');
  });

  it.each(ENTRY_POINTS)('%s holds re-exports only', (entry) => {
    expect(notReexports(readFileSync(join(repoRoot, entry), 'utf8'))).toBe('');
  });

  it('nothing the page loads at start reaches study code; its lazy parts do', () => {
    const atStart = [...staticClosure(repoRoot, 'web/main.tsx')];
    // The walk works: the first screen solves, so the solve is reached through the page's entry.
    expect(atStart).toContain('core/page.ts');
    expect(atStart).toContain('core/solve/index.ts');
    expect(atStart.filter((f) => f.startsWith(STUDIES))).toEqual([]);
    // Following import() as well reaches the studies: the check above can fail.
    const withLazy = [...staticClosure(repoRoot, 'web/main.tsx', true)];
    expect(withLazy).toContain('core/studies/index.ts');
    expect(withLazy.filter((f) => f.startsWith(STUDIES)).length).toBeGreaterThan(5);
  });
});

// The checker itself, on made-up snippets (cases written for this test; no external source).
describe('the entry-point checker', () => {
  const imports = (file: string, src: string) => checkEntryImports(file, src).map((v) => v.imports);

  it.each([
    ['web/components/X.tsx', "import { flowGraph } from '../../core/studies/energy-flow.ts';", 'core/studies/energy-flow.ts'],
    ['web/components/X.tsx', "import type { Problem } from '../../core/model/errors.ts';", 'core/model/errors.ts'],
    ['web/state/x.ts', "const m = await import('../../core/solve/index.ts');", 'core/solve/index.ts'],
    ['web/state/x.ts', "export { KINDS } from '../../core/kinds/index.ts';", 'core/kinds/index.ts'],
    ['web/state/x.ts', "import '../../core/index.ts';", 'core/index.ts'],
    ['service-worker/sw.ts', "import { demoProjects } from '../core/demos/index.ts';", 'core/demos/index.ts'],
    ['web/state/x.ts', "import {\n  solveProject,\n} from '../../core/solve/index.ts';", 'core/solve/index.ts'],
  ])('%s: flags %s', (file, src, target) => {
    expect(imports(file, src)).toEqual([target]);
  });

  it.each([
    ['web/components/X.tsx', "import { solveProject, type Problem } from '../../core/page.ts';"],
    ['web/components/X.tsx', "import { flowGraph } from '../../core/studies/index.ts';"],
    ['web/components/X.tsx', "// import { x } from '../../core/solve/sweep.ts';"],
    ['web/components/X.tsx', "const note = 'see ../../core/solve/sweep.ts';"],
    ['web/components/X.tsx', "import { signal } from '@preact/signals';"],
    ['web/components/X.tsx', "import { formatPower } from '../format/number.ts';"],
  ])('%s: accepts %s', (file, src) => {
    expect(imports(file, src)).toEqual([]);
  });

  it('tells static, type-only and on-demand imports apart', () => {
    const src = [
      "import { a } from './a.ts';",
      "import type { B } from './b.ts';",
      "export type { C } from './c.ts';",
      "export { d } from './d.ts';",
      "import './e.css';",
      "const F = lazy(() => import('./f.tsx'));",
      "import { type G, h } from './g.ts';",
    ].join('\n');
    expect(importsOf(src).map((r) => `${r.spec} ${r.kind}`)).toEqual([
      './a.ts static',
      './b.ts type',
      './c.ts type',
      './d.ts static',
      './e.css static',
      './f.tsx dynamic',
      './g.ts static',
    ]);
  });

  it('an entry file with anything but re-exports is refused', () => {
    expect(notReexports("export { a } from './a.ts';\nexport type * from './b.ts';\n// note\n")).toBe('');
    expect(notReexports("export { a } from './a.ts';\nexport const b = 1;")).toContain('export const b');
    expect(notReexports("import { a } from './a.ts';\nexport { a };")).not.toBe('');
  });
});
