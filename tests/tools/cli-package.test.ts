/**
 * The command-line tool as it ships: `npm pack` (whose `prepack` script builds dist-cli/joulepath.mjs
 * with vite.cli.config.ts) into a temporary folder, the tarball extracted there, and its `bin` run
 * with plain `node`, away from this repository's node_modules and without a TypeScript runner: no
 * network is needed. Checks the help, exit codes 0/1/2, one summary line per project and CSV with
 * several files (one refused among them) and a folder, that the bundle's figures are the engine's own
 * (computed in-process here) and that `npm run solve` (the source) prints the same. Prints the start-up time of a demo (from start to printed result; the
 * target of issue 16 is 0.3 s; not asserted: timings are figures, not tests).
 */
import { execFileSync, spawnSync } from 'node:child_process';
import { copyFileSync, existsSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { demoProjects, solveProject } from '../../core/index.ts';
import { CSV_COLUMNS } from '../../core/cli/summary.ts';

const work = mkdtempSync(join(tmpdir(), 'joulepath-pack-'));
let pkgDir = '';
let bin = '';
const run = (...args: string[]) => spawnSync(process.execPath, [bin, ...args], { cwd: work, encoding: 'utf8', timeout: 30_000 });

beforeAll(() => {
  // `npm pack` runs `prepack` (npm run build:cli) and writes the tarball; --json names it.
  const packed = JSON.parse(execFileSync('npm', ['pack', '--json', '--pack-destination', work], { encoding: 'utf8', stdio: ['ignore', 'pipe', 'pipe'] })) as { filename: string; files: { path: string }[] }[];
  const tarball = join(work, packed[0]!.filename);
  execFileSync('tar', ['-xzf', tarball, '-C', work]);
  pkgDir = join(work, 'package');
  const manifest = JSON.parse(readFileSync(join(pkgDir, 'package.json'), 'utf8')) as { bin: Record<string, string> };
  bin = join(pkgDir, manifest.bin.joulepath!);
  // The demos as a contractor's folder of sites, plus one project the engine refuses.
  for (const d of demoProjects) copyFileSync(join(pkgDir, 'core', 'demos', `${d.id}.json`), join(work, `${d.id}.json`));
  writeFileSync(
    join(work, 'zero-volt.json'),
    JSON.stringify({ format: 'joulepath-project', version: 2, name: 'Zero volt site', elements: [{ id: 'g', name: 'Grid', kind: 'grid', voltage: 0, frequency: 50, phases: 3 }] }),
  );
}, 240_000);

afterAll(() => rmSync(work, { recursive: true, force: true }));

describe('the packed command-line tool', () => {
  it('ships one bundled file with a node shebang as its bin, and the demos', () => {
    const manifest = JSON.parse(readFileSync(join(pkgDir, 'package.json'), 'utf8')) as { bin: Record<string, string> };
    expect(manifest.bin).toEqual({ joulepath: 'dist-cli/joulepath.mjs' });
    const text = readFileSync(bin, 'utf8');
    expect(text.startsWith('#!/usr/bin/env node\n')).toBe(true);
    // Self-contained: the only imports are Node's own modules (no zod, no .ts files, no node_modules).
    const specs = [...text.matchAll(/\bimport\s*(?:\{[^}]*\}|[\w$*]+(?:\s+as\s+[\w$]+)?)?\s*(?:from\s*)?["']([^"']+)["']/g)].map((m) => m[1]);
    expect(specs).toContain('node:fs');
    expect(specs.filter((s) => !s!.startsWith('node:'))).toEqual([]);
    expect(text).not.toMatch(/\bimport\(|\brequire\(/);
    expect(existsSync(join(pkgDir, 'node_modules'))).toBe(false);
    for (const d of demoProjects) expect(existsSync(join(pkgDir, 'core', 'demos', `${d.id}.json`))).toBe(true);
  });

  it('--help exits 0 and names the exit codes and the CSV columns', () => {
    const r = run('--help');
    expect(r.status).toBe(0);
    expect(r.stdout).toContain('usage: joulepath solve <project.json>…');
    expect(r.stdout).toContain('Exit codes: 0 every project solved');
    expect(r.stdout).toContain(CSV_COLUMNS.join(','));
  });

  it('--version prints the version of package.json', () => {
    const { version } = JSON.parse(readFileSync('package.json', 'utf8')) as { version: string };
    const r = run('--version');
    expect(r.status).toBe(0);
    expect(r.stdout).toBe(`joulepath ${version}\n`);
  });

  it('solve on one demo prints the tables (exit 0); --json is the engine\'s own result', () => {
    const r = run('solve', 'cold-store-dc-bus.json');
    expect(r.status).toBe(0);
    const demo = demoProjects.find((d) => d.id === 'cold-store-dc-bus')!;
    const outcome = solveProject(demo.project); // the engine called in-process
    if (!outcome.ok) throw new Error('demo does not solve');
    expect(r.stdout).toContain(`Project: ${demo.title}`);
    expect(r.stdout).toContain(`Source ${outcome.result.totals.sourcePower.toFixed(1)} W`);
    const j = run('solve', 'cold-store-dc-bus.json', '--json');
    expect(j.status).toBe(0);
    expect(JSON.parse(j.stdout)).toEqual(JSON.parse(JSON.stringify(outcome.result)));
  });

  it('several files: one line each, the refused one says why, the others still run, exit 1', () => {
    const files = [...demoProjects.map((d) => `${d.id}.json`), 'zero-volt.json', 'missing.json'];
    const r = run('solve', ...files);
    expect(r.status).toBe(1);
    const lines = r.stdout.trimEnd().split('\n');
    expect(lines).toHaveLength(files.length);
    for (const [i, d] of demoProjects.entries()) {
      const outcome = solveProject(d.project); // the engine called in-process
      if (!outcome.ok) throw new Error('demo does not solve');
      expect(lines[i]).toContain(`${d.id}.json: solved: ${outcome.result.projectName}: source ${outcome.result.totals.sourcePower.toFixed(1)} W`);
    }
    // The hillside demo has a backup study: its runtime, 27 h 40 min in the tables (tests/battery/cli.test.ts).
    expect(lines[0]).toMatch(/backup runtime 27\.67 h$/);
    const n = demoProjects.length;
    expect(lines[n]).toMatch(/^zero-volt\.json: refused: the project cannot be solved: "Grid", Open-circuit voltage: /);
    expect(lines[n + 1]).toMatch(/^missing\.json: refused: cannot read the project missing\.json/);
    // Every reason on standard error, under the file's name.
    expect(r.stderr).toMatch(/^zero-volt\.json: the project cannot be solved:\n {2}"Grid", Open-circuit voltage: /m);
    // All solved: exit 0.
    expect(run('solve', ...demoProjects.map((d) => `${d.id}.json`)).status).toBe(0);
  });

  it('a folder stands for its *.json files in name order; --json with a folder is a usage error', () => {
    const r = run('solve', '.');
    expect(r.status).toBe(1); // zero-volt.json is refused
    const names = r.stdout.trimEnd().split('\n').map((l) => l.slice(0, l.indexOf(': ')));
    // The demos (cold-store, harbour clinic, hillside, riverside) and zero-volt.json, sorted by name; not the tarball, not package/.
    expect(names).toEqual(['cold-store-dc-bus.json', 'harbour-clinic-ups.json', 'hillside-relay-hut.json', 'riverside-pump-station.json', 'zero-volt.json']);
    expect(r.stdout).toContain('zero-volt.json: refused: the project cannot be solved:');
    const j = run('solve', '.', '--json');
    expect(j.status).toBe(2);
    expect(j.stderr).toContain('--json runs with one project file, not a folder');
  });

  it('--csv: a header with the documented columns and one row per project', () => {
    const r = run('solve', '--csv', 'riverside-pump-station.json', 'zero-volt.json');
    expect(r.status).toBe(1);
    const [header, solved, refused, ...rest] = r.stdout.trimEnd().split('\n');
    expect(rest).toEqual([]);
    expect(header).toBe(CSV_COLUMNS.join(','));
    const demo = demoProjects.find((d) => d.id === 'riverside-pump-station')!;
    const outcome = solveProject(demo.project); // the engine called in-process
    if (!outcome.ok) throw new Error('demo does not solve');
    const t = outcome.result.totals;
    expect(solved).toBe(`riverside-pump-station.json,solved,${outcome.result.projectName},${t.sourcePower.toFixed(1)},${t.loadPower.toFixed(1)},${t.losses.toFixed(1)},${(100 * t.efficiency).toFixed(2)},${outcome.result.warnings.length},,,`);
    // The reason holds commas and quotes: quoted, quotes doubled (RFC 4180 section 2).
    expect(refused).toMatch(/^zero-volt\.json,refused,Zero volt site,,,,,,,,"the project cannot be solved: ""Grid"", Open-circuit voltage: must be greater than 0 V"$/);
  });

  it('wrong command lines exit 2 with the usage line', () => {
    for (const args of [[], ['solve'], ['solve', 'a.json', '--nope'], ['frobnicate'], ['solve', 'a.json', 'b.json', '--json']]) {
      const r = run(...args);
      expect(r.status).toBe(2);
      expect(r.stdout).toBe('');
      expect(r.stderr).toContain('usage: joulepath solve');
    }
  });

  it('`npm run solve` (the source through tsx) keeps working and prints what the bundle prints', () => {
    const demos = demoProjects.map((d) => `core/demos/${d.id}.json`);
    const fromSource = spawnSync('npm', ['run', '--silent', 'solve', '--', ...demos, '--csv'], { encoding: 'utf8', timeout: 60_000 });
    const fromBundle = spawnSync(process.execPath, [bin, 'solve', ...demos, '--csv'], { encoding: 'utf8', timeout: 30_000 });
    expect(fromSource.status).toBe(0);
    expect(fromBundle.status).toBe(0);
    expect(fromSource.stdout.trimEnd().split('\n')).toHaveLength(1 + demos.length);
    expect(fromBundle.stdout).toBe(fromSource.stdout);
    const t0 = process.hrtime.bigint();
    const tables = spawnSync('npm', ['run', '--silent', 'solve', '--', 'core/demos/hillside-relay-hut.json'], { encoding: 'utf8', timeout: 60_000 });
    console.log(`npm run solve -- core/demos/hillside-relay-hut.json (source, tsx): ${(Number(process.hrtime.bigint() - t0) / 1e6).toFixed(0)} ms, one run, for comparison`);
    expect(tables.status).toBe(0);
    expect(spawnSync(process.execPath, [bin, 'core/demos/hillside-relay-hut.json'], { encoding: 'utf8' }).stdout).toBe(tables.stdout);
  }, 120_000);

  it('prints the start-up time of a demo, from start to printed result (target 0.3 s, not asserted)', () => {
    const times: number[] = [];
    for (let i = 0; i < 5; i++) {
      const t0 = process.hrtime.bigint();
      const r = run('solve', 'riverside-pump-station.json');
      times.push(Number(process.hrtime.bigint() - t0) / 1e6);
      expect(r.status).toBe(0);
    }
    times.sort((a, b) => a - b);
    console.log(`joulepath solve riverside-pump-station.json (bundle, node): median ${times[2]!.toFixed(0)} ms, min ${times[0]!.toFixed(0)} ms, max ${times[4]!.toFixed(0)} ms over 5 runs`);
   }, 60_000); // five process starts: seconds each on a loaded machine
});
