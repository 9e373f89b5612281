/**
 * The command-line flag `--correct-pf <elementId>:<target>` as a user runs it
 * (`tsx core/cli/cli.ts <file> --correct-pf …`): the printed bank and comparison carry the engine's own
 * figures (computed in-process here), --json carries them under `pfCorrection`, and bad values give
 * a message naming the element and field with exit code 1 (2 when the flag itself is malformed).
 */
import { spawnSync } from 'node:child_process';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { correctPowerFactor } from '../../core/index.ts';
import { onSolved } from '../core/solved.ts';

const TSX = join('node_modules', '.bin', 'tsx');
const run = (...args: string[]) => spawnSync(TSX, ['core/cli/cli.ts', ...args], { encoding: 'utf8' });
const scratch = mkdtempSync(join(tmpdir(), 'joulepath-pf-cli-'));

/** An invented workshop: a compressor entered by its elements behind a 90 m feeder. */
const workshop = {
  format: 'joulepath-project',
  version: 2,
  name: 'Workshop compressor feeder',
  elements: [
    { id: 'sup', kind: 'grid', phases: 3, voltage: 400, frequency: 50 },
    { id: 'cab', kind: 'cable', from: 'sup', length: 90, resistancePerKm: 0.727, reactancePerKm: 0.08 },
    { id: 'comp', kind: 'network-load', from: 'cab', connection: 'star', network: { series: [{ resistor: '6.2 Ω' }, { inductor: '22 mH' }] } },
  ],
};
const file = join(scratch, 'workshop.json');
writeFileSync(file, JSON.stringify(workshop));

describe('npm run solve -- <file> --correct-pf <id>:<target>', () => {
  it('prints the bank, the before/after comparison and the caution after the tables', () => {
    const r = run(file, '--correct-pf', 'comp:0.95');
    expect(r.status, r.stderr).toBe(0);
    const c = onSolved(correctPowerFactor, workshop, { at: 'comp', targetPowerFactor: 0.95 });
    if (!c.ok) throw new Error('does not correct');
    expect(r.stdout).toContain('Elements (W)');
    expect(r.stdout).toContain('Power-factor correction at the terminals of comp to 0.95 lagging');
    expect(r.stdout).toContain(`Qc = P·(tan φ1 − tan φ2) = ${(c.correction.bank.reactivePower / 1000).toFixed(2)} kvar`);
    expect(r.stdout).toMatch(/capacitance: .* µF per phase in star, .* µF per phase in delta/);
    expect(r.stdout).toContain(`cab (cable): ${c.correction.upstream[0]!.currentBefore.toFixed(2)} → ${c.correction.upstream[0]!.currentAfter.toFixed(2)} A`);
    expect(r.stdout).toMatch(/warning: at 25 % of the present load/);
    expect(r.stdout).toContain('licensed practice');
  }, 30_000);

  it('--json carries the correction under "pfCorrection", without the two full results', () => {
    const r = run(file, '--json', '--correct-pf', 'comp:0.9');
    expect(r.status, r.stderr).toBe(0);
    const out = JSON.parse(r.stdout) as { pfCorrection: Record<string, unknown>; elements: unknown[] };
    const c = onSolved(correctPowerFactor, workshop, { at: 'comp', targetPowerFactor: 0.9 });
    if (!c.ok) throw new Error('does not correct');
    expect(out.elements).toHaveLength(3);
    expect(out.pfCorrection['bank']).toEqual(JSON.parse(JSON.stringify(c.correction.bank)));
    expect(out.pfCorrection['upstream']).toEqual(JSON.parse(JSON.stringify(c.correction.upstream)));
    expect(out.pfCorrection['resultAfter']).toBeUndefined();
    expect(out.pfCorrection['correctedProject']).toBeUndefined();
  }, 30_000);

  // Exit codes (core/cli/args.ts): 1 the project refuses the request, 2 the flag itself is malformed (usage).
  it.each([
    [['--correct-pf', 'comp:0.5'], /"Load from R, L, C #\d+", target power factor: must be above the present power factor/, 1],
    [['--correct-pf', 'pump:0.95'], /"pump", element to correct: no element "pump"/, 1],
    [['--correct-pf', 'comp:1.5'], /"Load from R, L, C #\d+", target power factor: must not exceed 1/, 1],
    [['--correct-pf', 'comp:high'], /the target power factor "high" is not a number/, 2],
    [['--correct-pf', 'comp'], /write <elementId>:<target power factor>/, 2],
    [['--correct-pf'], /--correct-pf needs <elementId>:<target power factor>/, 2],
  ])('refuses %j with a message matching %s and exit code %i', (args, message, code) => {
    const r = run(file, ...args);
    expect(r.status).toBe(code);
    expect(r.stderr).toMatch(message);
    expect(r.stdout).toBe('');
  }, 30_000);
});
