/**
 * The command-line solver on hostile input files (issue 15, point 9): what the page's import
 * accepts it accepts (a UTF-8 byte-order mark), what the import refuses before reading (a file over
 * 5 MB, something that is not a regular file) it refuses at once in one line, a value outside its
 * physical range is refused at its field with the plausible range (never "did not settle" or NaN),
 * and a pump duty study with zero flow is refused as the pump element refuses it.
 */
import { spawnSync } from 'node:child_process';
import { closeSync, mkdirSync, mkdtempSync, openSync, readFileSync, writeFileSync, ftruncateSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';

const TSX = join('node_modules', '.bin', 'tsx');
/** Every run has a time limit: a CLI that reads /dev/zero or waits on a FIFO is a failure, not a hang. */
const run = (...args: string[]) => spawnSync(TSX, ['core/cli/cli.ts', ...args], { encoding: 'utf8', timeout: 20_000 });
const scratch = mkdtempSync(join(tmpdir(), 'joulepath-cli-input-'));

const project = (elements: unknown[], extra: Record<string, unknown> = {}) => ({ format: 'joulepath-project', version: 2, name: 'hostile', elements, ...extra });
const mains = { id: 'mains', name: 'Mains', kind: 'grid', phases: 1, voltage: 230, frequency: 50 };
const heater = { id: 'heater', name: 'Heater', kind: 'ac-load', from: 'mains', power: 2000, powerFactor: 1 };
const write = (name: string, data: unknown): string => {
  const f = join(scratch, name);
  writeFileSync(f, typeof data === 'string' ? data : JSON.stringify(data));
  return f;
};
/** The refusal is one line on stderr (besides the file name heading of engine refusals), exit code 1, nothing on stdout. */
const refused = (r: ReturnType<typeof run>) => {
  expect(r.error).toBeUndefined(); // not killed by the time limit
  expect(r.status).toBe(1);
  expect(r.stdout).toBe('');
  return r.stderr;
};

describe('CLI input files', () => {
  it('accepts a UTF-8 byte-order mark, as the page import does (web/storage/file-format.ts decodeText)', () => {
    const f = write('bom.json', `\uFEFF${JSON.stringify(project([mains, heater]))}`);
    const r = run(f);
    expect(r.stderr).toBe('');
    expect(r.status).toBe(0);
    // 2000 W resistive load on an ideal source: the source gives 2000 W (energy balance, no loss).
    expect(r.stdout).toContain('Source 2000.0 W');
  }, 30_000);

  it('refuses UTF-16 and text that is not UTF-8, as the import does', () => {
    const utf16 = join(scratch, 'utf16.json');
    writeFileSync(utf16, Buffer.concat([Buffer.from([0xff, 0xfe]), Buffer.from(JSON.stringify(project([mains, heater])), 'utf16le')]));
    const e1 = refused(run(utf16));
    expect(e1.trim().split('\n')).toHaveLength(1);
    expect(e1).toMatch(/UTF-16/);
    const latin1 = join(scratch, 'latin1.json');
    writeFileSync(latin1, Buffer.from([0x7b, 0x22, 0x6e, 0xe9, 0x22, 0x3a, 0x31, 0x7d])); // {"né":1} in Latin-1
    const e2 = refused(run(latin1));
    expect(e2).toMatch(/not UTF-8/);
  }, 30_000);

  it('refuses a file over the import limit (5 MB) at once, without reading it', () => {
    const f = join(scratch, 'huge.json');
    const fd = openSync(f, 'w');
    // A sparse file of 5 MiB + 1 byte: the page import refuses anything over 5 × 1024 × 1024 bytes.
    ftruncateSync(fd, 5 * 1024 * 1024 + 1);
    closeSync(fd);
    const err = refused(run(f));
    expect(err.trim().split('\n')).toHaveLength(1);
    expect(err).toMatch(/5242881 bytes\); project files are limited to 5\.0 MB \(5242880 bytes\)/);
    // Exactly at the limit is not refused for its size (it is refused as not JSON: zero bytes).
    const at = join(scratch, 'at-limit.json');
    const fd2 = openSync(at, 'w');
    ftruncateSync(fd2, 5 * 1024 * 1024);
    closeSync(fd2);
    expect(refused(run(at))).not.toMatch(/MB/);
  }, 30_000);

  it('refuses a directory, /dev/zero and a FIFO at once, in one line', () => {
    // A folder stands for its *.json files (joulepath solve <folder>, core/cli/cli.ts expandFolders): one
    // holding none is refused in one line, on its summary line and on stderr; a folder named *.json
    // inside it is not a regular file.
    const dir = join(scratch, 'a-directory.json');
    mkdirSync(dir);
    const r1 = run(dir);
    expect(r1.error).toBeUndefined();
    expect(r1.status).toBe(1);
    expect(r1.stdout).toBe(`${dir}: refused: the folder ${dir} holds no project files (*.json)\n`);
    expect(r1.stderr.trim().split('\n')).toHaveLength(1);
    mkdirSync(join(dir, 'inner.json'));
    const r1b = run(dir);
    expect(r1b.status).toBe(1);
    expect(r1b.stdout).toMatch(/inner\.json: refused: cannot read the project .*inner\.json: it is not a regular file \(a directory\)\n$/);
    const e2 = refused(run('/dev/zero'));
    expect(e2.trim().split('\n')).toHaveLength(1);
    expect(e2).toMatch(/not a regular file/);
    const fifo = join(scratch, 'pipe.json');
    const mk = spawnSync('mkfifo', [fifo]);
    expect(mk.status).toBe(0);
    const e3 = refused(run(fifo));
    expect(e3).toMatch(/not a regular file/);
    // The pump study file of --flow is read the same way.
    const e4 = refused(run(write('ok.json', project([mains, heater])), '--flow', '/dev/zero'));
    expect(e4).toMatch(/not a regular file/);
  }, 60_000);

  it('refuses an ambient of −300 °C at the cable\'s field with the plausible range, not "did not settle"', () => {
    const cable = {
      id: 'run',
      name: 'Feeder',
      kind: 'cable',
      from: 'mains',
      length: 20,
      conductor: { system: 'iec', material: 'copper', size: 'auto', ambient: -300, insulation: 'pvc', installationMethod: 'C' },
    };
    const err = refused(run(write('cold.json', project([mains, cable, { ...heater, from: 'run' }]))));
    expect(err).not.toMatch(/settle|NaN/);
    // Absolute zero is −273.15 °C (ISO 80000-5); the plausible range is the table's (core/kinds/ranges.ts).
    expect(err).toMatch(/"Feeder", Ambient temperature: .*°C/);
    expect(err).toMatch(/−80 °C/);
  }, 30_000);

  it('refuses a source of 1e300 V at its voltage, naming the plausible range with the unit', () => {
    const err = refused(run(write('1e300.json', project([{ ...mains, voltage: 1e300 }, heater]))));
    expect(err).not.toMatch(/not a finite number|NaN/);
    expect(err).toMatch(/"Mains", Open-circuit voltage: .*1 MV/);
  }, 30_000);

  it('refuses a pump duty study with zero flow at that row, as the pump element refuses a zero flow', () => {
    const demo = JSON.parse(readFileSync('core/demos/riverside-pump-station.json', 'utf8'));
    demo.pumpDuty.duty[1].flow = 0;
    const err = refused(run(write('zero-flow.json', demo)));
    // The pump element's own words for flow 0 (core/kinds/pump.ts): "must be greater than 0 m³/s".
    expect(err).toMatch(/Project, Duty points, item 2 flow: must be greater than 0 m³\/s/);
  }, 30_000);

  it('refuses a --pump duty study file with zero flow the same way', () => {
    const study = {
      id: 'well',
      pump: { ratedFlow: 0.02, ratedHead: 25, shutoffHead: 32, efficiency: 0.7 },
      staticHead: 8,
      duty: [{ flow: 0, hours: 1500 }],
      motor: { ratedOutput: 7457, efficiencyClass: 'NEMA-premium', poles: 4, ratedFrequency: 60 },
      drive: { ratedApparentPower: 12000, basis: 'cdm' },
    };
    const err = refused(run(write('ok2.json', project([mains, heater])), '--flow', write('study.json', study)));
    expect(err).toMatch(/"well", duty\[0\] flow: must be greater than 0 m³\/s/);
  }, 30_000);
});
