/**
 * One command-line run validates and solves each project once: the run of core/cli/run.ts (what
 * core/cli/cli.ts does once it has read the file), with every study flag, counted by
 * core/solve/count.ts. Before the solved value every study validated and solved again (riverside
 * with --surges --machines: 7 validations, 4 solves; measured on this project before the change).
 * Re-solves of changed chains (motor starts, the capacitor bank, battery bank variants) are
 * counted apart and checked against what each demo holds.
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { parseArgs } from '../../core/cli/args.ts';
import { runParsed, type SolveRequest } from '../../core/cli/run.ts';
import { readSolveCounts, resetSolveCounts } from '../../core/solve/count.ts';
import { projectPumpDuty } from '../../core/studies/machines/pump-duty.ts';
import { solvedOf } from './solved.ts';

/** A CLI run in-process: the arguments as a user types them, the file read as the CLI reads it. */
function counted(argv: string[], flowData?: unknown) {
  const req = parseArgs(argv);
  if (req.kind !== 'solve') throw new Error(`not a solve request: ${req.kind}`);
  const file = req.files[0]!;
  const data: unknown = JSON.parse(readFileSync(file, 'utf8'));
  resetSolveCounts();
  const run = runParsed(file, data, req as SolveRequest, flowData);
  const counts = readSolveCounts();
  return { run, counts };
}

// Per demo: the element whose power factor is corrected (a lagging AC interface), and the changed
// chains its studies solve: one per motor start, one for the capacitor bank; the hillside bank is
// sized and its discharge re-run with the sized bank (one battery variant, built but not solved: no
// cable there has a conductor spec; its bank lasts past the target, so no run with an endless bank).
const DEMOS = [
  { file: 'core/demos/cold-store-dc-bus.json', pf: 'fans:0.98', variantSolves: 1, variants: 1 },
  { file: 'core/demos/hillside-relay-hut.json', pf: 'fridge:0.98', variantSolves: 1, variants: 2 },
  { file: 'core/demos/riverside-pump-station.json', pf: 'panel:0.98', variantSolves: 2, variants: 2 },
];

describe('one validation and one base solve per project and run', () => {
  for (const d of DEMOS) {
    it(`${d.file} with --json --surges --machines --correct-pf ${d.pf}`, () => {
      const { run, counts } = counted(['solve', d.file, '--json', '--surges', '--machines', '--correct-pf', d.pf]);
      expect(run.ok).toBe(true);
      // The point of the solved value: the base case once (before: 4 to 7 validations, 3 or 4 solves).
      expect(counts.validations).toBe(1);
      expect(counts.solves).toBe(1);
      // Changed chains, each through core/solve/variant.ts, counted apart.
      expect(counts.variantSolves).toBe(d.variantSolves);
      expect(counts.variants).toBe(d.variants);
    }, 60_000);

    it(`${d.file} plain: one validation, one solve`, () => {
      const { run, counts } = counted(['solve', d.file]);
      expect(run.ok).toBe(true);
      expect(counts.validations).toBe(1);
      expect(counts.solves).toBe(1);
    }, 60_000);
  }

  it('riverside with a pump study file as well (--pump-duty: the file is the study\u2019s own input, checked by the study)', () => {
    const file = 'core/demos/riverside-pump-station.json';
    // A pump study file as a user would write it: the one the project's own pump duty study builds.
    const own = projectPumpDuty(solvedOf(JSON.parse(readFileSync(file, 'utf8'))));
    if (!own.ok) throw new Error('the demo\u2019s pump duty study must run');
    const { run, counts } = counted(['solve', file, '--json', '--surges', '--machines', '--correct-pf', 'panel:0.98', '--pump-duty', 'study.json'], own.input);
    expect(run.ok).toBe(true);
    expect(counts).toEqual({ validations: 1, solves: 1, variantSolves: 2, variants: 2 });
  }, 60_000);

  it('a refused project is validated once and not solved', () => {
    resetSolveCounts();
    const req = parseArgs(['solve', 'bad.json', '--surges', '--machines']) as SolveRequest;
    const run = runParsed('bad.json', { format: 'joulepath-project', version: 2, name: 'bad', elements: [{ id: 'x', kind: 'grid' }] }, req, undefined);
    expect(run.ok).toBe(false);
    expect(readSolveCounts()).toEqual({ validations: 1, solves: 0, variantSolves: 0, variants: 0 });
  });
});
