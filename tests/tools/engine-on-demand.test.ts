// The engine's heavy part stays out of the first load (DEVELOPERS.md, "First load"): a module the page loads at
// start takes from core/page.ts only the light parts below; the solve, validation and the kind registry reach it
// through web/state/engine.ts. Checks on this repository's files and on made-up snippets (no external source).
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { staticClosure } from './entry-points.ts';

const repoRoot = fileURLToPath(new URL('../..', import.meta.url));

/** What the first screen may take from core/page.ts at run time (types are free). */
// The message words (field labels, element words, a message's template filled in) are tables and
// string work, no solve: the banner and the undo labels need them on the first screen.
const LIGHT = new Set([
  'PROJECT_LEVEL', 'PROJECT_VERSION', 'migrateProject', 'issueMessage', 'demoProjects', 'fieldWords', 'elementNames', 'nonFiniteProblems',
  'fieldLabel', 'fillTemplate', 'elementWords', 'pathWords', 'KIND_LABELS',
  // core/model/tariff.ts: its formulas, no imports (the price and tariff in force before the engine loads).
  'meanPrice', 'tariffOfRunning', 'dayNightTariff',
]);

/** The run-time names a source imports (or re-exports) from core/page.ts, with `type` ones left out. */
function pageNames(source: string): string[] {
  const names: string[] = [];
  for (const m of source.matchAll(/\b(import|export)\s+(type\s+)?\{([^}]*)\}\s*from\s*['"][./]*core\/page\.ts['"]/g)) {
    if (m[2]) continue;
    for (const part of m[3]!.split(',')) {
      const name = part.trim();
      if (!name || name.startsWith('type ')) continue;
      names.push(name.split(/\s+as\s+/)[0]!.trim());
    }
  }
  return names;
}

describe('the engine loads on demand', () => {
  it('no module the page loads at start takes the solve, validation or the kind registry from core/page.ts', () => {
    const atStart = [...staticClosure(repoRoot, 'web/main.tsx')].filter((f) => f.startsWith('web/') && /\.tsx?$/.test(f));
    expect(atStart).toContain('web/state/engine.ts');
    expect(atStart).not.toContain('web/state/engine-lazy.ts');
    const heavy = atStart.flatMap((file) =>
      pageNames(readFileSync(join(repoRoot, file), 'utf8'))
        .filter((name) => !LIGHT.has(name))
        .map((name) => `${file} imports ${name} from core/page.ts; read it through web/state/engine.ts`),
    );
    expect(heavy.join('\n')).toBe('');
  });

  it('the lazy part holds the solve and validation', () => {
    expect(pageNames(readFileSync(join(repoRoot, 'web/state/engine-lazy.ts'), 'utf8'))).toEqual(
      expect.arrayContaining(['solveProject', 'validateProject', 'studiesOf']),
    );
  });

  it.each([
    ["import { solveProject, type Solved } from '../../core/page.ts';", ['solveProject']],
    ["import type { Solved } from '../../core/page.ts';", []],
    ["import {\n  PROJECT_LEVEL,\n  type Problem,\n  validateProject as check,\n} from '../../core/page.ts';", ['PROJECT_LEVEL', 'validateProject']],
    ["export { studiesOf } from '../../core/page.ts';", ['studiesOf']],
    ["import { signal } from '@preact/signals';", []],
  ])('reads the names of %j', (source, names) => {
    expect(pageNames(source)).toEqual(names);
  });
});
