/**
 * The command-line solver on a project with a battery bank and a backup study: the study's text
 * after the tables, and --json carrying it under `backupStudy`, equal to the study run in-process.
 */
import { execFileSync } from 'node:child_process';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { demoProjects } from '../../core/index.ts';
import { runBackupStudy } from '../../core/studies/backup/study.ts';
import { onSolved } from '../core/solved.ts';

const TSX = join('node_modules', '.bin', 'tsx');
const demo = demoProjects.find((d) => d.id === 'hillside-relay-hut')!;

describe('command-line battery backup study', () => {
  const inProcess = onSolved(runBackupStudy, demo.project);
  if (!inProcess.ok) throw new Error(JSON.stringify(inProcess.problems));
  const study = inProcess.study;

  it('prints runtime, derates, sizing, recharge and the cautions', () => {
    const out = execFileSync(TSX, ['core/cli/cli.ts', 'core/demos/hillside-relay-hut.json'], { encoding: 'utf8' });
    expect(out).toContain('Battery backup');
    const h = Math.floor(study.discharge.runtimeSeconds / 3600);
    expect(out).toContain(`Runtime: ${h} h`);
    expect(out).toContain('Why not simply Wh ÷ W');
    expect(out).toContain('standby draw of 3 kW inverter');
    expect(out).toContain('Bank sizing (energy method)');
    expect(out).toContain(study.sizing!.summary); // e.g. "2 strings × 200 Ah = 400 Ah, 20.5 kWh"
    expect(out).toContain('Runtime of this bank through the chain');
    expect(out).toContain(study.discharge.basis);
    expect(out).not.toMatch(/from memory|common practice/);
    expect(out).toContain('Recharge with a 40.0 A charger');
    expect(out).toContain('as close to the bank as practical');
    expect(out).toContain('must not be charged below 0 °C');
    expect(out).toContain('licensed practice govern');
  }, 30_000);

  it('--json carries the study under "backupStudy", equal to the study run in-process', () => {
    const out = JSON.parse(execFileSync(TSX, ['core/cli/cli.ts', 'core/demos/hillside-relay-hut.json', '--json'], { encoding: 'utf8' }));
    expect(out.backupStudy).toEqual(JSON.parse(JSON.stringify(study)));
    expect(out.elements[0].id).toBe('bank');
  }, 30_000);
});
