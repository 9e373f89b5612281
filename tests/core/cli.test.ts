/**
 * The command-line solver as a user runs it: `tsx core/cli/cli.ts <file> [--json]`.
 * Checks exit codes, that the tables and the JSON carry the engine's own figures, and that bad input
 * gives one line per problem naming element and field.
 */
import { execFileSync, spawnSync } from 'node:child_process';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { demoProjects, pumpDetails, projectPumpDuty, solveProject, studySurges, validateProject } from '../../core/index.ts';
import { onSolved } from './solved.ts';

const TSX = join('node_modules', '.bin', 'tsx');
const run = (...args: string[]) => spawnSync(TSX, ['core/cli/cli.ts', ...args], { encoding: 'utf8' });
const scratch = mkdtempSync(join(tmpdir(), 'joulepath-cli-'));

describe('command-line solver', () => {
  for (const demo of demoProjects) {
    it(`prints the tables of demo ${demo.id}`, () => {
      const r = run(`core/demos/${demo.id}.json`);
      expect(r.status).toBe(0);
      expect(r.stdout).toContain(`Project: ${demo.title}`);
      expect(r.stdout).toContain('Elements (W)');
      expect(r.stdout).toContain('Interfaces (V, A, W, var, VA');
      expect(r.stdout).toContain('licensed professional');
      // Source power printed to 0.1 W equals the engine's own figure (engine computed in-process).
      const outcome = solveProject(demo.project);
      if (!outcome.ok) throw new Error('demo does not solve');
      expect(r.stdout).toContain(`Source ${outcome.result.totals.sourcePower.toFixed(1)} W`);
    }, 30_000);
  }

  it('--json prints the full result, identical to the engine called directly (plus the pump and surge sections)', () => {
    const out = execFileSync(TSX, ['core/cli/cli.ts', 'core/demos/riverside-pump-station.json', '--json'], { encoding: 'utf8' });
    const demo = demoProjects[1]!.project;
    const outcome = solveProject(demo);
    expect(outcome.ok).toBe(true);
    if (!outcome.ok) return;
    const { pumps, pumpDuty, surgeStudy, ...result } = JSON.parse(out);
    expect(result).toEqual(JSON.parse(JSON.stringify(outcome.result)));
    // The demo has a pump and a pumpDuty: both sections come from core/studies/machines, run in-process here.
    const study = onSolved(projectPumpDuty, demo);
    expect(study.ok).toBe(true);
    if (study.ok) expect(pumpDuty).toEqual(JSON.parse(JSON.stringify(study.result)));
    const valid = validateProject(demo);
    if (valid.ok) expect(pumps).toEqual(JSON.parse(JSON.stringify(pumpDetails(valid.project))));
    // The demo carries starting and device data: the surge study comes from core/studies/surge, run in-process here.
    const surges = onSolved(studySurges, demo);
    expect(surges.ok).toBe(true);
    if (surges.ok) expect(surgeStudy).toEqual(JSON.parse(JSON.stringify(surges.result)));
  }, 30_000);

  it('exits 1 with one line per problem on bad input', () => {
    const file = join(scratch, 'bad.json');
    writeFileSync(
      file,
      JSON.stringify({
        format: 'joulepath-project',
        version: 2,
        name: 'bad',
        elements: [
          { id: 'mains', kind: 'grid', phases: 1, voltage: 0, frequency: 50 },
          { id: 'heater', kind: 'ac-load', from: 'mains', power: 2000, powerFactor: 1.5 },
        ],
      }),
    );
    const r = run(file);
    expect(r.status).toBe(1);
    expect(r.stdout).toBe('');
    // Unnamed elements are named by their kind and place; fields by their form labels.
    expect(r.stderr).toContain('"Utility supply #1", Open-circuit voltage: must be greater than 0 V');
    expect(r.stderr).toContain('"AC load #2", Power factor (0–1): power factor must not exceed 1');
  }, 30_000);

  it('prints a load given by its current, and refuses a current the cable cannot deliver at that load’s field', () => {
    // Ohm's law: 30 A through the 0.0915 Ω loop (2 × 25 m × 1.83 Ω/km) leaves 48 − 2.745 = 45.255 V;
    // 600 A would need 54.9 V of drop from 48 V.
    const make = (current: number) => ({
      format: 'joulepath-project',
      version: 2,
      name: 'current load',
      elements: [
        { id: 'bank', kind: 'battery', voltage: 48 },
        { id: 'run', kind: 'cable', from: 'bank', length: 25, resistancePerKm: 1.83, name: 'Yard run' },
        { id: 'charger', kind: 'dc-current-load', from: 'run', current, name: 'Charger in current limit' },
      ],
    });
    const good = join(scratch, 'current-good.json');
    writeFileSync(good, JSON.stringify(make(30)));
    const ok = run(good);
    expect(ok.status).toBe(0);
    expect(ok.stdout).toMatch(/Yard run → Charger in current limit\s+DC\s+45\.26\s+30\.00\s+1357\.7/);
    const bad = join(scratch, 'current-bad.json');
    writeFileSync(bad, JSON.stringify(make(600)));
    const refused = run(bad);
    expect(refused.status).toBe(1);
    expect(refused.stderr).toContain('"Charger in current limit", Current drawn: 600 A cannot be delivered through "Yard run"');
  }, 30_000);

  it('exits 1 on a file that is not JSON or a missing file, and 2 on wrong arguments', () => {
    const file = join(scratch, 'not-json.json');
    writeFileSync(file, '{ this is not json');
    const notJson = run(file);
    expect(notJson.status).toBe(1);
    expect(notJson.stderr).toMatch(/is not valid JSON/);
    const missing = run(join(scratch, 'nope.json'));
    expect(missing.status).toBe(1);
    expect(missing.stderr).toMatch(/cannot read/);
    const usage = run();
    expect(usage.status).toBe(2); // usage error (core/cli/args.ts EXIT_USAGE)
    expect(usage.stderr).toMatch(/^joulepath: no project file given\nusage: joulepath solve/);
  }, 30_000);
});
