// The engine's layers read one way (rules in layers.ts; the order is the project's own design).
import { readFileSync } from 'node:fs';
import { join, relative } from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { sourceFiles } from './source-files.ts';
import { LAYERS, checkLayers, layerOf } from './layers.ts';

const repoRoot = fileURLToPath(new URL('../..', import.meta.url));

describe('the engine layers read one way', () => {
  it('no file of core/ imports from a layer above its own', () => {
    const files = sourceFiles(join(repoRoot, 'core')).map((p) => relative(repoRoot, p).split('\\').join('/'));
    expect(files.length).toBeGreaterThan(100);
    const report = files
      .flatMap((file) => checkLayers(file, readFileSync(join(repoRoot, file), 'utf8')))
      .map((v) => `${v.file}:${v.line} ${v.rule}${v.imports ? `: ${v.imports}` : ''}`)
      .join('\n');
    expect(report, 'upward imports in core/').toBe('');
  });

  it('every layer holds at least one file', () => {
    const files = sourceFiles(join(repoRoot, 'core')).map((p) => relative(repoRoot, p).split('\\').join('/'));
    const counts = LAYERS.map((_, i) => files.filter((f) => layerOf(f) === i).length);
    expect(counts.every((n) => n > 0), `files per layer: ${counts.join(', ')}`).toBe(true);
  });
});

// The checker itself, on made-up snippets (cases written for this test; no external source).
describe('the layer checker', () => {
  const rules = (file: string, src: string) => checkLayers(file, src).map((v) => v.rule);

  it.each([
    ['core/kinds/motor.ts', "import { x } from '../studies/machines/details.ts';", 'element kinds imports from studies, a higher layer'],
    ['core/physics/bank.ts', "import type { Stage } from '../kinds/spec.ts';", 'physics imports from element kinds, a higher layer'],
    ['core/solve/validate.ts', "import { profile } from '../studies/backup/profile.ts';", 'solve imports from studies, a higher layer'],
    ['core/model/project.ts', "export type { Bank } from '../physics/bank.ts';", 'model imports from physics, a higher layer'],
    ['core/data/x.ts', "const m = await import('../solve/index.ts');", 'data imports from solve, a higher layer'],
    ['core/studies/pf/correction.ts', "import { run } from '../../cli/cli.ts';", 'studies imports from command line and public API, a higher layer'],
    ['core/solve/x.ts', "import { y } from '../stages/old.ts';", 'imports a file no layer claims'],
    ['core/loose.ts', 'const a = 1;', 'file belongs to no layer'],
  ])('%s: flags %s', (file, src, rule) => {
    expect(rules(file, src)).toContain(rule);
  });

  it.each([
    ['core/kinds/motor.ts', "import { motorRating } from '../physics/motor-rating.ts';"],
    ['core/studies/surge/faults.ts', "import { bankCautions } from '../backup/cautions.ts';"],
    ['core/solve/plan.ts', "import { KINDS } from '../kinds/index.ts';"],
    ['core/index.ts', "export { solveProject } from './solve/index.ts';"],
    ['core/kinds/cable.ts', "import { z } from 'zod/mini';"],
    ['core/kinds/cable.ts', "// import { x } from '../studies/y.ts';"],
  ])('%s: accepts %s', (file, src) => {
    expect(rules(file, src)).toEqual([]);
  });
});
