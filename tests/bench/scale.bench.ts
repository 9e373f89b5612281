/**
 * Scale of the engine (issue 15, point 8): validate + solve (`solveProject`) of chains of 500,
 * 1000 and 2000 elements (2000 is the import's limit), deep and wide, as the app ships the engine
 * (one bundle, tests/bench/bundled-core.ts). The time per element must not grow with size: both
 * checks and the solve are linear in the elements. Run with `npm run bench`; the medians are
 * reported in issue notes, not asserted here. Shapes in tests/bench/chains.ts:
 * - deep cables: grid → cable → … → load (one series run, the deepest chain);
 * - deep converters: bank → DC-DC → … → load;
 * - wide: grid → one cable → n − 2 loads side by side;
 * - tree: grid → a binary tree of cables, a load at every leaf;
 * - deep sized: grid → cables sized by the IEC method → load (the conductor sizing's walks);
 * - comb: a run of cables with a load at the end of each (deep and wide at once). Its result lists,
 *   for every load, every cable above it (whole-path drops): that part grows with the square of the
 *   depth, so its time per element grows too; the checks and the solve itself stay linear.
 * Plus the check alone (`validateProject`, what the editor runs per keystroke) on the deep run.
 */
import { bench, describe } from 'vitest';
import type { Project } from '../../core/index.ts';
import { bundledCore } from './bundled-core.ts';
import { comb, deepCables, deepConverters, deepSized, tree, wide } from './chains.ts';

const core = await bundledCore();
const SIZES = [500, 1000, 2000] as const;
const SHAPES: [string, (n: number) => Project][] = [
  ['deep cables', deepCables],
  ['deep converters', deepConverters],
  ['wide', wide],
  ['tree', tree],
  ['deep sized', deepSized],
  ['comb', comb],
];

for (const [name, make] of SHAPES) {
  describe(`validate + solve, ${name}`, () => {
    for (const n of SIZES) {
      const project = make(n);
      const check = core.solveProject(project);
      if (!check.ok) throw new Error(`${name} ${n} does not solve: ${JSON.stringify(check.problems.slice(0, 2))}`);
      bench(`${name}, ${n} elements`, () => {
        core.solveProject(project);
      }, { time: 1500, iterations: 5, warmupIterations: 2 });
    }
  });
}

describe('validate only, deep cables', () => {
  for (const n of SIZES) {
    const project = deepCables(n);
    bench(`deep cables, ${n} elements`, () => {
      core.validateProject(project);
    }, { time: 1000, iterations: 5, warmupIterations: 2 });
  }
});
