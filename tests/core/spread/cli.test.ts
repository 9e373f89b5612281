/**
 * `--spread N` and `--seed S`: parsed, refused where they do not fit, and the figures printed are the
 * engine's own (no outside source: the CLI must print what core/studies/spread gives for the same
 * seed and samples).
 */
import { describe, expect, it } from 'vitest';
import { parseArgs } from '../../../core/cli/args.ts';
import { runParsed, type SolveRequest } from '../../../core/cli/run.ts';
import { runSpread } from '../../../core/studies/spread/run.ts';
import { solvedOf } from '../solved.ts';
import { smallBankCase } from './cases.ts';

describe('--spread and --seed', () => {
  it('parse, and are refused where they do not fit (exit 2 words)', () => {
    expect(parseArgs(['a.json', '--spread', '200', '--seed', '9'])).toMatchObject({ kind: 'solve', spread: 200, seed: 9 });
    expect(parseArgs(['a.json'])).not.toHaveProperty('spread');
    expect(parseArgs(['a.json', '--spread', '5'])).toEqual({ kind: 'usage', message: '--spread takes a whole number from 10 to 20000, not "5"' });
    expect(parseArgs(['a.json', '--spread', '1e3x'])).toMatchObject({ kind: 'usage' });
    expect(parseArgs(['a.json', '--seed', '3'])).toEqual({ kind: 'usage', message: '--seed goes with --spread <samples>' });
    expect(parseArgs(['a.json', 'b.json', '--spread', '100'])).toMatchObject({ kind: 'usage', message: expect.stringContaining('one project file') });
    expect(parseArgs(['a.json', '--spread', '100', '--csv'])).toMatchObject({ kind: 'usage' });
  });

  it('prints the distribution and gives `spread` in --json, the engine’s own figures for the seed and samples', () => {
    const data = smallBankCase({ spread: { capacityPercent: 8 } });
    const r = runSpread(solvedOf(data), { settings: { capacityPercent: 8, samples: 30, seed: 4 } });
    if (!r.ok) throw new Error('spread refused');
    const text = runParsed('case.json', data, parseArgs(['case.json', '--spread', '30', '--seed', '4']) as SolveRequest, undefined);
    expect(text.ok).toBe(true);
    if (!text.ok) return;
    expect(text.text).toContain('Runtime with its spread: 30 samples, seed 4');
    expect(text.text).toContain('Bank capacity: ± 8 %');
    const json = runParsed('case.json', data, parseArgs(['case.json', '--json', '--spread', '30', '--seed', '4']) as SolveRequest, undefined);
    if (!json.ok) throw new Error('refused');
    const spread = JSON.parse(json.text).spread;
    expect(spread.runtimeH).toEqual(r.value.runtimeH);
    expect(spread.seed).toBe(4);
    expect(spread.sensitivity.map((s: { input: string }) => s.input)).toEqual(r.value.sensitivity.map((s) => s.input));
  });

  it('a project without a backup study is refused with the reason', () => {
    const data = smallBankCase();
    delete (data as { backup?: unknown }).backup;
    const out = runParsed('case.json', data, parseArgs(['case.json', '--spread', '20']) as SolveRequest, undefined);
    expect(out.ok).toBe(false);
    if (!out.ok) expect(out.lines.join('\n')).toContain('needs a battery bank and the battery backup study settings');
  });
});
