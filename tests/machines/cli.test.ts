/**
 * The command-line hook of core/studies/machines: `--machines` prints motor and drive details (and refuses a
 * motor beyond its service factor), `--pump-duty <study.json>` the flow-control comparison; with --json
 * they appear under `machines` and `pumpDuty`, equal to the engine called directly.
 */
import { spawnSync } from 'node:child_process';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { comparePumpControl, solveWithMachines, type PumpDutyInput } from '../../core/index.ts';
import { onSolved } from '../core/solved.ts';

const TSX = join('node_modules', '.bin', 'tsx');
const run = (...args: string[]) => spawnSync(TSX, ['core/cli/cli.ts', ...args], { encoding: 'utf8' });
const scratch = mkdtempSync(join(tmpdir(), 'joulepath-machines-'));

// Invented scenario: a 10 hp NEMA Premium pump motor on a drive at 48 Hz.
const project = (shaft: number) => ({
  format: 'joulepath-project',
  version: 2,
  name: 'Well pump',
  elements: [
    { id: 'mains', kind: 'grid', phases: 3, voltage: 460, frequency: 60 },
    { id: 'vfd', kind: 'drive', from: 'mains', outputVoltage: 460, outputFrequency: 48, inputPowerFactor: 0.97, currentThd: 0.4, standardLoss: { ratedApparentPower: 12000, basis: 'cdm' } },
    { id: 'm', kind: 'motor', from: 'vfd', ratedOutput: 7457, efficiencyClass: 'NEMA-premium', poles: 4, ratedFrequency: 60, ratedVoltage: 460, serviceFactor: 1.15 },
    { id: 'pump', kind: 'shaft-load', from: 'm', power: shaft },
  ],
});
const study: PumpDutyInput = {
  id: 'well',
  pump: { ratedFlow: 0.02, ratedHead: 25, shutoffHead: 32, efficiency: 0.7 },
  staticHead: 8,
  duty: [
    { flow: 0.02, hours: 1500 },
    { flow: 0.012, hours: 3000 },
  ],
  motor: { ratedOutput: 7457, efficiencyClass: 'NEMA-premium', poles: 4, ratedFrequency: 60 },
  drive: { ratedApparentPower: 12000, basis: 'cdm' },
};
const write = (name: string, data: unknown) => {
  const f = join(scratch, name);
  writeFileSync(f, JSON.stringify(data));
  return f;
};

describe('CLI --machines and --pump-duty', () => {
  it('prints motor details with the NEC table current and the drive operating point', () => {
    const r = run(write('p.json', project(4000)), '--machines');
    expect(r.status).toBe(0);
    expect(r.stdout).toContain('NEC Table 430.250: 10 hp at 460 V = 14 A');
    expect(r.stdout).toContain('430.6(A)(1)');
    expect(r.stdout).toContain('80.0 % frequency');
    expect(r.stdout).toContain('true pf');
  }, 30_000);

  it('refuses a motor beyond its service factor, naming element and field', () => {
    const r = run(write('over.json', project(1.2 * 7457)), '--machines');
    expect(r.status).toBe(1);
    expect(r.stdout).toBe('');
    expect(r.stderr).toMatch(/"Motor #\d+", Rated shaft output: /);
    expect(r.stderr).toContain('service factor 1.15');
  }, 30_000);

  it('--json carries machines and pumpDuty equal to the engine called directly', () => {
    const r = run(write('p2.json', project(4000)), '--machines', '--pump-duty', write('s.json', study), '--json');
    expect(r.status).toBe(0);
    const out = JSON.parse(r.stdout) as { machines: unknown; pumpDuty: unknown };
    const m = onSolved(solveWithMachines, project(4000));
    const f = comparePumpControl(study);
    if (!m.ok || !f.ok) throw new Error('engine refused');
    expect(out.machines).toEqual(JSON.parse(JSON.stringify(m.machines)));
    expect(out.pumpDuty).toEqual(JSON.parse(JSON.stringify(f.result)));
  }, 30_000);

  it('a bad pump study names the field', () => {
    const r = run(write('p3.json', project(4000)), '--pump-duty', write('bad.json', { ...study, duty: [{ flow: 0.01, hours: 9000 }] }));
    expect(r.status).toBe(1);
    expect(r.stderr).toContain('"well", duty: ');
    expect(r.stderr).toContain('8760');
  }, 30_000);

  it('--pump-duty without a file is a usage error', () => {
    const r = run(write('p4.json', project(4000)), '--pump-duty');
    expect(r.status).toBe(2); // usage error (core/cli/args.ts EXIT_USAGE)
    expect(r.stderr).toContain('--pump-duty needs the pump study file');
  }, 30_000);
});
