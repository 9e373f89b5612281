/**
 * `--variants` on the command line: the comparison's text with the differences marked, and the JSON
 * key `variants` (README "Command-line tool"). The figures come from the engine called in-process
 * (no outside source: the CLI must print the engine's own comparison).
 */
import { describe, expect, it } from 'vitest';
import { parseArgs } from '../../../core/cli/args.ts';
import { runParsed, type SolveRequest } from '../../../core/cli/run.ts';
import { compareVariants, demoProjects, solveProject, systemVoltageVariant } from '../../../core/index.ts';
import type { Project } from '../../../core/model/project.ts';

const hillside = demoProjects.find((d) => d.id === 'hillside-relay-hut')!.project;
const v24 = systemVoltageVariant(hillside, 24);
if (!v24.ok) throw new Error('refused');
const project: Project = { ...hillside, variants: [v24.variant, { name: 'Stale', set: { gone: { power: 1 } } }] };

describe('--variants', () => {
  it('parses the flag', () => {
    expect(parseArgs(['a.json', '--variants'])).toMatchObject({ kind: 'solve', variants: true });
    expect(parseArgs(['a.json'])).not.toHaveProperty('variants');
  });
  it('prints the table with "*" on the figures that differ, the stale variant\'s problem, and the cautions', () => {
    const req = parseArgs(['x.json', '--variants']) as SolveRequest;
    const out = runParsed('x.json', project, req, undefined);
    expect(out.ok).toBe(true);
    if (!out.ok) return;
    expect(out.text).toMatch(/Variants side by side: Hillside relay hut/);
    expect(out.text).toMatch(/\n\* Source power +550\.9 W +552 W +not solved/);
    expect(out.text).toMatch(/\n {2}Power to the loads +455 W +455 W/); // the same loads: not marked
    expect(out.text).toMatch(/Stale: not solved: "gone", id: names no element/);
    expect(out.text).toMatch(/local codes and licensed practice govern/);
  });
  it('--json gives the comparison under "variants", equal to compareVariants', () => {
    const req = parseArgs(['x.json', '--variants', '--json']) as SolveRequest;
    const out = runParsed('x.json', project, req, undefined);
    if (!out.ok) throw new Error('refused');
    const json = JSON.parse(out.text) as { variants: unknown };
    const s = solveProject(project);
    if (!s.ok) throw new Error('refused');
    expect(json.variants).toEqual(JSON.parse(JSON.stringify(compareVariants(s, project.variants))));
  });
});
