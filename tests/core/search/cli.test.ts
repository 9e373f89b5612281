import { describe, expect, it } from 'vitest';
import { parseArgs } from '../../../core/cli/args.ts';
import { runParsed, type SolveRequest } from '../../../core/cli/run.ts';
import { searchBase, searchSettings } from './fixture.ts';

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
    expect(run.text).toMatch(/Runtime below the target: \d+\n    1 string · Inverter A · 10 mm²: runtime as new 3 h \d+ min below 4 h/);
    // The sizing's bank for 4 h: 2 strings of 100 Ah (tests/core/search/search.test.ts, by hand).
    expect(run.text).toMatch(/1 string · Inverter A · 10 mm²: installed 100 Ah below the 200 Ah the sizing needs for 4 h with the design margin 1\.1 and aging 1\.25/);
    expect(run.text).toMatch(/Drop on Bank cable above its limit: 6/); // 4 mm² × 3 strings × 2 inverters, by hand
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
