import { describe, expect, it } from 'vitest';
import { parseArgs } from '../../../core/cli/args.ts';
import { runParsed, type SolveRequest } from '../../../core/cli/run.ts';
import { searchBase, searchSettings } from './fixture.ts';
import { solveProject } from '../../../core/index.ts';
import { formatSearch, searchOptions } from '../../../core/studies/search/index.ts';
import type { Solved } from '../../../core/solve/solved.ts';

const request = (...argv: string[]) => {
  const r = parseArgs(['p.json', ...argv]);
  if (r.kind !== 'solve') throw new Error(JSON.stringify(r));
  return r as SolveRequest;
};

describe('--search on the command line', () => {
  const project = { ...searchBase, optionSearch: searchSettings };
  it('prints the list, cheapest first, and the rejected with their reasons', () => {
    const run = runParsed('p.json', project, request('--search'), undefined);
    expect(run.ok).toBe(true);
    if (!run.ok) return;
    // The hand-worked cheapest option of tests/core/search/search.test.ts: 2 × 1000 + 600 + 110.
    expect(run.text).toMatch(/  1\. 2 strings · Inverter A · 10 mm²: cost 2,710, losses /);
    // 1 string × 2 inverters × 10 and 25 mm², by hand (the 4 mm² ones fail the drop first, their runtime not checked).
    expect(run.text).toMatch(/  Runtime below the target: 4\n/);
    expect(run.text).toMatch(/Drop on Bank cable above its limit: 6/); // 4 mm² × 3 strings × 2 inverters, by hand
    // Every rejected option with its reasons (10 of them, at most 50: all listed), the skipped checks said.
    expect(run.text).toMatch(/Each rejected option, with its reasons:\n/);
    expect(run.text).toMatch(/\n  1 string · Inverter A · 10 mm²: runtime as new 3 h \d+ min below 4 h; installed 100 Ah below the 200 Ah the sizing needs for 4 h with the design margin 1\.1 and aging 1\.25 \(2 strings × 100 Ah = 200 Ah\)\n/);
    expect(run.text).toMatch(/\n  1 string · Inverter A · 4 mm²: drop on Bank cable 5\.\d+ % above 5 % \(not checked after that: runtime\)\n/);
    const listed = run.text.split('\n').filter((l) => /^  \d+ strings? · Inverter [AB] · \d+ mm²: /.test(l));
    expect(listed.length).toBe(10); // 18 combinations − 8 met (search.test.ts)
  });
  it('past 50 rejected options, the first 50 and how many more (--json has all)', () => {
    const out = searchOptions(solveProject(searchBase) as Solved, searchSettings);
    if (!out.ok) throw new Error('refused');
    const many = { ...out.search, rejected: Array.from({ length: 60 }, (_, i) => ({ ...out.search.rejected[0]!, name: `Option ${i + 1}` })) };
    const text = formatSearch(many);
    expect(text).toMatch(/The first 50 rejected options, with their reasons:\n/);
    expect(text).toMatch(/\n  Option 50: /);
    expect(text).not.toMatch(/Option 51:/);
    expect(text).toMatch(/  … and 10 more: --json lists every one with its reasons\./); // 60 − 50
  });
  it('--json gives the search under "search"', () => {
    const run = runParsed('p.json', project, request('--search', '--json'), undefined);
    if (!run.ok) throw new Error('refused');
    const json = JSON.parse(run.text) as { search: { options: { name: string; cost: number }[]; rejectedGroups: unknown[] } };
    expect(json.search.options[0]).toMatchObject({ name: '2 strings · Inverter A · 10 mm²', cost: 2710 }); // by hand, as above
    expect(json.search.rejectedGroups.length).toBeGreaterThan(0);
  });
  it('refuses a project without search settings, and several files', () => {
    const run = runParsed('p.json', searchBase, request('--search'), undefined);
    expect(run.ok).toBe(false);
    if (!run.ok) expect(run.lines[0]).toMatch(/lists no candidates to try/);
    expect(parseArgs(['a.json', 'b.json', '--search']).kind).toBe('usage');
  });
});
