/**
 * The command-line solver reports the surge and fault study: starting verdicts (starts, marginal,
 * will not start), fault currents, device checks, warnings and cautions; --json carries it under
 * `surgeStudy`, equal to the study run in-process.
 */
import { execFileSync } from 'node:child_process';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { studySurges } from '../../core/index.ts';
import { dolOnCable, gridTransformerCable, pumpOnInverter } from './fixtures.ts';
import { onSolved } from '../core/solved.ts';

const TSX = join('node_modules', '.bin', 'tsx');
const dir = mkdtempSync(join(tmpdir(), 'joulepath-surge-'));
const write = (name: string, data: unknown): string => {
  const f = join(dir, name);
  writeFileSync(f, JSON.stringify(data));
  return f;
};
const run = (args: string[]): string => execFileSync(TSX, ['core/cli/cli.ts', ...args], { encoding: 'utf8' });

describe('command-line surge and fault study', () => {
  it('prints each verdict with its reason: starts, marginal, will not start', () => {
    expect(run([write('ok.json', dolOnCable(40))])).toMatch(/m, dol: STARTS — motor terminal voltage/);
    expect(run([write('marginal.json', dolOnCable(120))])).toMatch(/MARGINAL — motor terminal voltage .* within 10 % of it/);
    expect(run([write('fail.json', dolOnCable(200))])).toMatch(/WILL NOT START — motor terminal voltage/);
  }, 60_000);

  it('prints battery and AC fault currents, the device checks, the warnings and the cautions', () => {
    const inv = run([write('inv.json', pumpOnInverter())]);
    expect(inv).toContain('Battery prospective short-circuit current');
    expect(inv).toContain('12.8 kA');
    expect(inv).toContain('TOO-WEAK');
    expect(inv).toContain('DC arcs do not pass through a current zero');
    const ac = run([write('ac.json', gridTransformerCable())]);
    expect(ac).toContain('AC available fault current (c = 1.1)');
    expect(ac).toContain('15.0 kA');
    expect(ac).toContain('Arc flash');
    expect(ac).toContain('licensed practice govern');
  }, 60_000);

  it('--json carries the study under "surgeStudy", equal to the study run in-process', () => {
    const p = pumpOnInverter({ surge: 6000 });
    const o = onSolved(studySurges, p);
    if (!o.ok) throw new Error('study failed');
    const out = JSON.parse(run([write('inv-json.json', p), '--json']));
    expect(out.surgeStudy).toEqual(JSON.parse(JSON.stringify(o.result)));
    expect(out.surgeStudy.starts[0].verdict).toBe('will-not-start');
  }, 60_000);

  it('bad input: exit code 1 and one line naming element and field', () => {
    let err = '';
    try {
      run([write('bad.json', pumpOnInverter({ surgeSeconds: 0 }))]);
    } catch (e) {
      err = String((e as { stderr: string }).stderr);
    }
    expect(err).toContain('"Inverter #3", For how long: ');
  }, 60_000);
});
