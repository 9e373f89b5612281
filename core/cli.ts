/**
 * Command-line solver: `npm run solve -- <project.json> [--json]`.
 * The only Node-specific file of core/. Prints per-element and per-interface tables (or the full
 * result as JSON with --json). Exit code 1 with one line per problem on bad input.
 * A project fed by a battery `bank` with a `backup` study also gets the study: runtime with every
 * derate, bank sizing and recharge (text after the tables; with --json under the key
 * `backupStudy`, shaped as BackupStudyResult in core/battery/study.ts).
 * `--correct-pf <id>:<target>` adds the capacitor bank that raises that element's interface to the
 * target power factor and the before/after comparison (with --json under `pfCorrection`).
 * `--surges` (automatic when the project has starting data, surge ratings, protective devices or
 * fault data) adds the surge and fault study: motor starting verdicts, battery and AC fault
 * currents, device checks, trap warnings and cautions (with --json under `surgeStudy`, shaped as
 * SurgeStudyResult in core/surge/types.ts).
 * A result or study holding a figure that is not a finite number is refused (exit code 1, one line
 * per element naming it and the field; core/solve/finite.ts): never a table of NaN.
 * Input files are read as the page's import reads them (web/storage/file-format.ts): refused at
 * once, before any byte is read, when they are not a regular file (a directory, /dev/zero, a FIFO)
 * or larger than MAX_INPUT_BYTES; UTF-8 with an optional byte-order mark; UTF-16 and text that is not
 * UTF-8 are refused.
 */
import { closeSync, fstatSync, openSync, readSync, statSync, constants as fsConstants } from 'node:fs';
import { formatProblem, type Problem } from './errors.ts';
import { formatResult } from './text-report.ts';
import { solveProject } from './solve/index.ts';
import { elementNames, nonFiniteProblems } from './solve/finite.ts';
import { runBackupStudy, type BackupStudyResult } from './battery/study.ts';
import { formatBackupStudy } from './battery/text-report.ts';
import { correctPowerFactor, type PfCorrection } from './ac/pf-correction.ts';
import { formatPfCorrection, parseCorrectPfFlag, pfCorrectionJson } from './ac/text-report.ts';
import { MACHINE_USAGE, hasPumpSections, machineSections, takeMachineFlags } from './machines/cli-flags.ts';
import { formatSurgeStudy, hasSurgeInputs, studySurges, type SurgeStudyResult } from './surge/index.ts';

/**
 * Largest input file read at all, bytes: 5 MiB, the same figure as the page's import
 * (IMPORT_LIMITS.maxBytes in web/storage/file-format.ts; keep the two equal). A 200-stage project
 * is about 100 kB.
 */
const MAX_INPUT_BYTES = 5 * 1024 * 1024;

const MB = (bytes: number): string => `${(bytes / (1024 * 1024)).toFixed(1)} MB`;

/**
 * Read an input file's text, or a one-line reason it is refused. Stat first: a directory, a device
 * (/dev/zero never ends) or a FIFO (opening it waits for a writer) is refused before it is opened;
 * the read itself stops one byte past the limit, should the file grow after the check.
 */
function readInput(file: string, what: string): { ok: true; text: string } | { ok: false; message: string } {
  let size: number;
  try {
    const st = statSync(file);
    if (!st.isFile()) return { ok: false, message: `cannot read ${what} ${file}: it is not a regular file (${st.isDirectory() ? 'a directory' : st.isFIFO() ? 'a named pipe' : st.isCharacterDevice() || st.isBlockDevice() ? 'a device' : 'a special file'})` };
    size = st.size;
  } catch (err) {
    return { ok: false, message: `cannot read ${what} ${file}: ${(err as Error).message}` };
  }
  if (size > MAX_INPUT_BYTES) return { ok: false, message: `cannot read ${what} ${file}: it is ${MB(size)} (${size} bytes); project files are limited to ${MB(MAX_INPUT_BYTES)} (${MAX_INPUT_BYTES} bytes), as on the page` };
  let bytes: Buffer;
  try {
    // O_NONBLOCK: should the path have become a FIFO since the check, opening it does not wait.
    const fd = openSync(file, fsConstants.O_RDONLY | (fsConstants.O_NONBLOCK ?? 0));
    try {
      if (!fstatSync(fd).isFile()) return { ok: false, message: `cannot read ${what} ${file}: it is not a regular file` };
      const buf = Buffer.alloc(MAX_INPUT_BYTES + 1);
      let n = 0;
      for (let got = -1; got !== 0 && n < buf.length; n += got) got = readSync(fd, buf, n, buf.length - n, null);
      if (n > MAX_INPUT_BYTES) return { ok: false, message: `cannot read ${what} ${file}: it is over ${MB(MAX_INPUT_BYTES)} (${MAX_INPUT_BYTES} bytes), the limit of project files` };
      bytes = buf.subarray(0, n);
    } finally {
      closeSync(fd);
    }
  } catch (err) {
    return { ok: false, message: `cannot read ${what} ${file}: ${(err as Error).message}` };
  }
  // As the import decodes (decodeText in web/storage/file-format.ts): UTF-8, a leading byte-order mark allowed.
  if ((bytes[0] === 0xff && bytes[1] === 0xfe) || (bytes[0] === 0xfe && bytes[1] === 0xff)) {
    return { ok: false, message: `cannot read ${what} ${file}: it is UTF-16 text; project files are UTF-8 (save it again as UTF-8)` };
  }
  const start = bytes[0] === 0xef && bytes[1] === 0xbb && bytes[2] === 0xbf ? 3 : 0;
  try {
    return { ok: true, text: new TextDecoder('utf-8', { fatal: true }).decode(bytes.subarray(start)) };
  } catch {
    return { ok: false, message: `cannot read ${what} ${file}: it is not UTF-8 text (it may be a binary file or another encoding)` };
  }
}

const USAGE = `usage: npm run solve -- <project.json> [--json] [--correct-pf <elementId>:<target power factor>] [--surges] ${MACHINE_USAGE}`;

function fail(lines: readonly string[]): never {
  for (const l of lines) process.stderr.write(`${l}\n`);
  process.exit(1);
}

function main(args: readonly string[]): void {
  // --machines, --flow <pump-study.json> (motors, drives and driven machines; core/machines/cli-flags.ts).
  const mach = takeMachineFlags(args);
  if (!mach.ok) fail([mach.message, USAGE]);
  args = mach.rest;
  // --correct-pf <id>:<target> (power-factor correction at that element's interface; core/ac/pf-correction.ts).
  const pfAt = args.indexOf('--correct-pf');
  const pfFlag = pfAt >= 0 ? parseCorrectPfFlag(args[pfAt + 1]) : undefined;
  if (pfFlag && !pfFlag.ok) fail([pfFlag.message, USAGE]);
  const argv = pfAt >= 0 ? args.filter((_, i) => i !== pfAt && i !== pfAt + 1) : args;
  const json = argv.includes('--json');
  const surgesFlag = argv.includes('--surges');
  const files = argv.filter((a) => !a.startsWith('--'));
  const unknown = argv.filter((a) => a.startsWith('--') && a !== '--json' && a !== '--surges');
  if (files.length !== 1 || unknown.length) fail([USAGE]);
  const file = files[0]!;
  const input = readInput(file, 'the project');
  if (!input.ok) fail([input.message]);
  let data: unknown;
  try {
    data = JSON.parse(input.text);
  } catch (err) {
    fail([`${file} is not valid JSON: ${(err as Error).message}`]);
  }
  // The pump study file is checked and read before anything is computed.
  let flowData: unknown;
  if (mach.flowFile !== undefined) {
    const flowInput = readInput(mach.flowFile, 'the pump study');
    if (!flowInput.ok) fail([flowInput.message]);
    try {
      flowData = JSON.parse(flowInput.text);
    } catch (err) {
      fail([`the pump study ${mach.flowFile} is not valid JSON: ${(err as Error).message}`]);
    }
  }
  // Every study's figures must be finite numbers, or the study is refused (core/solve/finite.ts);
  // the solve checks its own result.
  const names = elementNames(data);
  const refuseNonFinite = (heading: string, what: string, value: unknown): void => {
    const bad = nonFiniteProblems(what, value, names);
    if (bad.length) fail([`${file}: ${heading}`, ...bad.map((p: Problem) => `  ${formatProblem(p)}`)]);
  };
  const outcome = solveProject(data);
  if (!outcome.ok) fail([`${file}: the project cannot be solved:`, ...outcome.problems.map((p: Problem) => `  ${formatProblem(p)}`)]);
  let study: BackupStudyResult | undefined;
  if (hasBackupStudy(data)) {
    const s = runBackupStudy(data);
    if (!s.ok) fail([`${file}: the battery backup study cannot be run:`, ...s.problems.map((p: Problem) => `  ${formatProblem(p)}`)]);
    study = s.study;
    refuseNonFinite('the battery backup study cannot be shown:', 'The battery backup study', study);
  }
  let pfc: PfCorrection | undefined;
  if (pfFlag?.ok) {
    const c = correctPowerFactor(data, pfFlag.request);
    if (!c.ok) fail([`${file}: the power-factor correction cannot be worked out:`, ...c.problems.map((p: Problem) => `  ${formatProblem(p)}`)]);
    pfc = c.correction;
    refuseNonFinite('the power-factor correction cannot be shown:', 'The power-factor correction', pfc);
  }
  const machines = mach.machines || mach.flowFile !== undefined || hasPumpSections(data) ? machineSections(data, mach.machines, flowData) : undefined;
  if (machines && !machines.ok) fail([`${file}: ${machines.heading}`, ...machines.problems.map((p: Problem) => `  ${formatProblem(p)}`)]);
  if (machines?.ok) refuseNonFinite('the machines study cannot be shown:', 'The machines study', machines.json);
  let surges: SurgeStudyResult | undefined;
  if (surgesFlag || hasSurgeInputs(data)) {
    const s = studySurges(data);
    if (!s.ok) fail([`${file}: the surge and fault study cannot be run:`, ...s.problems.map((p: Problem) => `  ${formatProblem(p)}`)]);
    surges = s.result;
    refuseNonFinite('the surge and fault study cannot be shown:', 'The surge and fault study', surges);
  }
  if (json) {
    const extra = { ...(study ? { backupStudy: study } : {}), ...(pfc ? { pfCorrection: pfCorrectionJson(pfc) } : {}), ...(machines?.ok ? machines.json : {}), ...(surges ? { surgeStudy: surges } : {}) };
    process.stdout.write(`${JSON.stringify({ ...outcome.result, ...extra }, null, 2)}\n`);
  } else {
    process.stdout.write(`${formatResult(outcome.result)}\n${study ? `${formatBackupStudy(study)}\n` : ''}${pfc ? `\n${formatPfCorrection(pfc)}\n` : ''}${machines?.ok ? machines.text : ''}${surges ? formatSurgeStudy(surges) : ''}`);
  }
}

/** A study runs when the project has `backup` settings and a battery given as a `bank`. */
function hasBackupStudy(data: unknown): boolean {
  const p = data as { backup?: unknown; elements?: unknown };
  return p.backup !== undefined && Array.isArray(p.elements) && p.elements.some((e: { kind?: unknown; bank?: unknown }) => e?.kind === 'battery' && e.bank !== undefined);
}

main(process.argv.slice(2));
