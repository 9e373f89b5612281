/**
 * The command line with a bank on a bus: both modes' tables by default, `--mode supply|battery` for
 * one, the modes study's text, and the JSON keys README.md documents. The figures come from the engine
 * called in-process (no outside source: the CLI must print the engine's own numbers).
 */
import { spawnSync } from 'node:child_process';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { demoProjects, runModesStudy, solveModes, solveProject } from '../../core/index.ts';
import { parseArgs } from '../../core/cli/args.ts';

const TSX = join('node_modules', '.bin', 'tsx');
const run = (...args: string[]) => spawnSync(TSX, ['core/cli/cli.ts', ...args], { encoding: 'utf8' });
const FILE = 'core/demos/harbour-clinic-ups.json';
const demo = demoProjects.find((d) => d.id === 'harbour-clinic-ups')!;

describe('--mode', () => {
  it('parses supply and battery and refuses anything else (exit 2 words)', () => {
    expect(parseArgs([FILE, '--mode', 'battery'])).toMatchObject({ kind: 'solve', mode: 'battery' });
    expect(parseArgs([FILE, '--mode', 'supply'])).toMatchObject({ kind: 'solve', mode: 'supply' });
    expect(parseArgs([FILE])).not.toHaveProperty('mode');
    expect(parseArgs([FILE, '--mode', 'grid'])).toEqual({ kind: 'usage', message: '--mode takes supply or battery, not "grid"' });
    expect(parseArgs([FILE, '--mode'])).toEqual({ kind: 'usage', message: '--mode takes supply or battery' });
    const r = run(FILE, '--mode', 'off');
    expect(r.status).toBe(2);
  });

  it('prints both modes by default, one with --mode, and the modes study', () => {
    const s = solveProject(demo.project);
    if (!s.ok) throw new Error('demo does not solve');
    const m = solveModes(s)!;
    if (!m.battery.ok) throw new Error('battery mode');
    const both = run(FILE);
    expect(both.status).toBe(0);
    expect(both.stdout).toContain('Mode: on supply (the bank on float)');
    expect(both.stdout).toContain('Mode: on battery (the supply cut, the bank carries its bus)');
    expect(both.stdout).toContain(`Source ${s.result.totals.sourcePower.toFixed(1)} W`);
    expect(both.stdout).toContain(`Source ${m.battery.result.totals.sourcePower.toFixed(1)} W`);
    expect(both.stdout).toContain('Charger sizing (IEEE Std 946');
    // The charge drawn in the demo's outage (about 87.5 Ah): A ≈ 28.9 A, 3 modules of 10 A, 4 with N+1 (hand calculation, IEEE Std 946).
    expect(both.stdout).toMatch(/Modules of 10 A: 3 needed, 4 with N\+1 \(40 A installed\)/);
    expect(both.stdout).toContain('Board to UPS: 4 mm², sized for the recharge case (2.5 mm² on float, 4 mm² recharging)');
    expect(both.stdout).toContain('Cost of standing by (on supply)');
    expect(both.stdout).toContain('Transfer (the supply cut)');
    expect(both.stdout).toContain('The studies below run on supply (the file as drawn), except the battery backup study, which runs on battery.');
    expect(both.stdout).toContain('Mode: on battery (the supply cut, the bank on its bus carries the loads)');
    const battery = run(FILE, '--mode', 'battery');
    expect(battery.stdout).not.toContain('Mode: on supply');
    expect(battery.stdout).toContain('Mode: on battery (the supply cut');
    const supply = run(FILE, '--mode', 'supply');
    expect(supply.stdout).toContain('Mode: on supply');
    expect(supply.stdout).not.toContain('Mode: on battery (the supply cut, the bank carries');
  }, 60_000);

  it('--json: the chosen mode at the top, both under modes, the study under modes.study', () => {
    const s = solveProject(demo.project);
    if (!s.ok) throw new Error('demo does not solve');
    const study = runModesStudy(s);
    if (!study || !study.ok) throw new Error('no study');
    const j = JSON.parse(run(FILE, '--json').stdout);
    expect(j.mode).toBe('supply');
    expect(j.totals.sourcePower).toBeCloseTo(s.result.totals.sourcePower, 9);
    expect(Object.keys(j.modes).sort()).toEqual(['battery', 'study', 'supply']);
    expect(j.modes.battery.elements[0].id).toBe('bank');
    expect(j.modes.study.charger.requiredCurrent).toBeCloseTo(study.study.charger.requiredCurrent, 9);
    expect(Object.keys(j.modes.study).sort()).toEqual(['bankName', 'battery', 'busName', 'cableSizes', 'cables', 'cautions', 'charger', 'place', 'standing', 'supply', 'switches', 'transfer', 'warnings']);
    expect(j.backupStudy.mode).toBe('battery');
    const jb = JSON.parse(run(FILE, '--json', '--mode', 'battery').stdout);
    expect(jb.mode).toBe('battery');
    expect(jb.elements[0].id).toBe('bank');
  }, 60_000);
});
