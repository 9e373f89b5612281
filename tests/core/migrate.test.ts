/**
 * File format 1 → 2 (core/model/migrate.ts): kinds `dcbus`/`dcdc` become `dc-bus`/`dc-dc`, the NEC
 * raceway `aluminum` becomes `aluminium`, the pump study `flowStudy` becomes `pumpDuty`. Every reader
 * brings a format-1 file up to date: the engine's validation (so the CLI and every study), the page's
 * import, a stored record and a rescue copy. Check values: each demo written back in format 1 by hand
 * (the renames above, applied in reverse) must read as the demo itself and solve to the same figures
 * (the project's own definition of the migration; no outside source).
 */
import { spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { OLDEST_PROJECT_VERSION, PROJECT_VERSION, migrateProject } from '../../core/model/migrate.ts';
import { solveProject, validateProject } from '../../core/solve/index.ts';
import { demoProjects } from '../../core/demos/index.ts';
import { parseImportText } from '../../web/storage/file-format.ts';
import { readRecord } from '../../web/storage/record.ts';
import { readRescue } from '../../web/storage/record.ts';

type Json = Record<string, unknown>;
const clone = <T>(v: T): T => JSON.parse(JSON.stringify(v)) as T;

/** A format-2 project written as format 1 (the reverse renames). */
function asFormat1(project: unknown): Json {
  const p = clone(project) as Json;
  p['version'] = 1;
  delete p['$schema'];
  p['elements'] = (p['elements'] as Json[]).map((e) => {
    const out: Json = { ...e };
    if (e['kind'] === 'dc-bus') out['kind'] = 'dcbus';
    if (e['kind'] === 'dc-dc') out['kind'] = 'dcdc';
    const conductor = e['conductor'] as Json | undefined;
    if (conductor?.['raceway'] === 'aluminium') out['conductor'] = { ...conductor, raceway: 'aluminum' };
    return out;
  });
  if ('pumpDuty' in p) {
    p['flowStudy'] = p['pumpDuty'];
    delete p['pumpDuty'];
  }
  return p;
}

const demos = demoProjects.map((d) => [d.id, d.project as unknown] as const);

describe('file format 1 → 2', () => {
  it('this build writes format 2 and reads format 1', () => {
    expect(PROJECT_VERSION).toBe(2);
    expect(OLDEST_PROJECT_VERSION).toBe(1);
  });

  it('renames the two kinds, the raceway and the pump study, and nothing else; the input is untouched', () => {
    const v1 = {
      format: 'joulepath-project',
      version: 1,
      name: 'Format one',
      elements: [
        { id: 'bank', kind: 'battery', chemistry: 'lfp', cellsInSeries: 16, capacityAh: 100 },
        { id: 'bus', kind: 'dcbus', from: 'bank' },
        { id: 'conv', kind: 'dcdc', from: 'bus', outputVoltage: 12 },
        { id: 'feed', kind: 'cable', from: 'conv', conductor: { system: 'nec', raceway: 'aluminum', material: 'aluminium' } },
      ],
      flowStudy: { pump: 'p', duty: [] },
    };
    const frozen = clone(v1);
    const out = migrateProject(v1);
    expect(out.from).toBe(1);
    expect(v1).toEqual(frozen);
    const v2 = out.value as Json;
    expect(v2['version']).toBe(2);
    expect((v2['elements'] as Json[]).map((e) => e['kind'])).toEqual(['battery', 'dc-bus', 'dc-dc', 'cable']);
    expect((v2['elements'] as Json[])[3]!['conductor']).toEqual({ system: 'nec', raceway: 'aluminium', material: 'aluminium' });
    expect(v2['pumpDuty']).toEqual({ pump: 'p', duty: [] });
    expect('flowStudy' in v2).toBe(false);
    expect(Object.keys(v2)).toEqual(['format', 'version', 'name', 'elements', 'pumpDuty']);
  });

  it('leaves format 2, unknown versions and things that are not projects as they are', () => {
    for (const v of [null, 3, 'x', [], { format: 'other', version: 1 }, { format: 'joulepath-project', version: 2, elements: [{ kind: 'dcbus' }] }, { format: 'joulepath-project', version: 7 }]) {
      const out = migrateProject(v);
      expect(out.value).toBe(v);
      expect(out.from).toBeUndefined();
    }
  });

  it('a format-1 file whose version-2 field is also present keeps both, and validation names the old one', () => {
    const v1 = { ...asFormat1(demos.find(([id]) => id === 'riverside-pump-station')![1]), pumpDuty: { pump: 'x', duty: [] } };
    const valid = validateProject(v1);
    expect(valid.ok).toBe(false);
    if (!valid.ok) expect(valid.problems.map((p) => p.message).join(' ')).toMatch(/flowStudy/);
  });

  it.each(demos)('%s in format 1 validates as the demo and solves to the same figures', (_id, project) => {
    const v1 = asFormat1(project);
    const now = validateProject(project);
    const then = validateProject(v1);
    expect(then.ok && now.ok).toBe(true);
    if (then.ok && now.ok) expect(then.project).toEqual(now.project);
    const a = solveProject(project);
    const b = solveProject(v1);
    expect(a.ok && b.ok).toBe(true);
    if (a.ok && b.ok) expect(b.result).toEqual(a.result);
  });

  it.each(demos)('%s in format 1 is imported by the page as the demo, bare and in an export envelope', (_id, project) => {
    const v1 = asFormat1(project);
    const { $schema: _drop, ...bare } = clone(project) as Json;
    for (const text of [JSON.stringify(v1), JSON.stringify({ format: 'joulepath-export', exportVersion: 1, project: v1 })]) {
      const read = parseImportText(text);
      expect(read.ok).toBe(true);
      if (read.ok) expect(read.project).toEqual(bare);
    }
  });

  it('a stored record of layout 1 (format-1 project) reads as layout 2 with its project brought up to date', () => {
    const [, project] = demos.find(([id]) => id === 'cold-store-dc-bus')!;
    const { $schema: _drop, ...bare } = clone(project) as Json;
    const raw = { storageVersion: 1, id: 'r', createdAt: '2026-01-01T00:00:00.000Z', savedAt: '2026-01-02T00:00:00.000Z', revision: 4, tabId: 't', project: asFormat1(project) };
    const read = readRecord('r', raw);
    expect(read.ok).toBe(true);
    if (read.ok) {
      expect(read.migratedFrom).toBe(1);
      expect(read.record.storageVersion).toBe(2);
      expect(read.record.revision).toBe(4);
      expect(read.record.project).toEqual(bare);
    }
  });

  it('a rescue copy holding a format-1 project is read in format 2', () => {
    const [, project] = demos.find(([id]) => id === 'riverside-pump-station')!;
    const rescue = readRescue({ rescueVersion: 1, tabId: 't', savedAt: '2026-01-01T00:00:00.000Z', baseRevision: null, project: asFormat1(project) });
    expect(rescue?.project['version']).toBe(2);
    expect('pumpDuty' in (rescue?.project ?? {})).toBe(true);
  });

  it('the command line reads a format-1 file as it reads the demo (riverside, --json)', () => {
    const dir = mkdtempSync(join(tmpdir(), 'joulepath-migrate-'));
    const demo = 'core/demos/riverside-pump-station.json';
    const old = join(dir, 'riverside-v1.json');
    writeFileSync(old, JSON.stringify(asFormat1(JSON.parse(readFileSync(demo, 'utf8')))));
    const tsx = join('node_modules', '.bin', 'tsx');
    const a = spawnSync(tsx, ['core/cli/cli.ts', 'solve', demo, '--json', '--machines'], { encoding: 'utf8', timeout: 60_000 });
    const b = spawnSync(tsx, ['core/cli/cli.ts', 'solve', old, '--json', '--machines'], { encoding: 'utf8', timeout: 60_000 });
    expect(b.status, b.stderr).toBe(0);
    expect(JSON.parse(b.stdout)).toEqual(JSON.parse(a.stdout));
  });
});
