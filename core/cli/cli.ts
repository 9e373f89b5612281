/**
 * Command-line tool: `joulepath solve <project.json>… [flags]` (the package's `bin`, built into one
 * file by vite.cli.config.ts: dist-cli/joulepath.mjs), or `npm run solve -- <project.json> [flags]`
 * from the source. `--help` prints the flags, the summary and CSV columns and the exit codes
 * (core/cli/args.ts): 0 every project solved, 1 a project or a file it names refused, 2 wrong command
 * line. The only Node-specific file of core/: it reads the files and writes the output; each project is
 * validated and solved once and every study asked for takes that solved value (core/cli/run.ts).
 * One file: per-element and per-interface tables (or the full result as JSON with --json); on bad
 * input one line per problem. Several files (or --summary, --csv): one summary line or CSV row per
 * project (core/cli/summary.ts); a refused project's line says why (every reason on standard error)
 * and the others still run.
 * A project fed by a battery `bank` with a `backup` study also gets the study: runtime with every
 * derate, bank sizing and recharge (text after the tables; with --json under the key
 * `backupStudy`, shaped as BackupStudyResult in core/studies/backup/study.ts).
 * `--correct-pf <id>:<target>` adds the capacitor bank that raises that element's interface to the
 * target power factor and the before/after comparison (with --json under `pfCorrection`).
 * `--surges` (automatic when the project has starting data, surge ratings, protective devices or
 * fault data) adds the surge and fault study: motor starting verdicts, battery and AC fault
 * currents, device checks, trap warnings and cautions (with --json under `surgeStudy`, shaped as
 * SurgeStudyResult in core/studies/surge/types.ts).
 * A result or study holding a figure that is not a finite number is refused (exit code 1, one line
 * per element naming it and the field; core/solve/finite.ts): never a table of NaN.
 * Input files are read as the page's import reads them (web/storage/file-format.ts): refused at
 * once, before any byte is read, when they are not a regular file (a directory, /dev/zero, a FIFO)
 * or larger than MAX_INPUT_BYTES; UTF-8 with an optional byte-order mark; UTF-16 and text that is not
 * UTF-8 are refused. A folder given as an argument stands for its *.json files (expandFolders).
 */
import { closeSync, fstatSync, openSync, readSync, readdirSync, statSync, constants as fsConstants } from 'node:fs';
import { join } from 'node:path';
import { EXIT_REFUSED, EXIT_SOLVED, EXIT_USAGE, HELP, USAGE, parseArgs } from './args.ts';
import { csvHeader, csvRow, summaryLine } from './summary.ts';
import { refusedWith, runParsed, type ProjectRun, type SolveRequest } from './run.ts';

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

/** package.json's version, set by the bundle's build (vite.cli.config.ts); absent when run from the source. */
declare const __JOULEPATH_VERSION__: string;
const VERSION = typeof __JOULEPATH_VERSION__ === 'string' ? __JOULEPATH_VERSION__ : 'development (run from the source)';

/** One project to run: a file, or a folder argument that holds none (refused with that message). */
type Entry = { file: string; refusal?: string };

/**
 * A folder given as an argument stands for its `.json` files (not its sub-folders), in name order,
 * so a folder of sites runs where the shell does not expand `*.json`; a folder holding none is one
 * refused entry. Anything else is left to readInput (a device or a pipe is refused there, unread).
 */
function expandFolders(files: readonly string[]): { entries: Entry[]; folders: boolean } {
  const entries: Entry[] = [];
  let folders = false;
  for (const file of files) {
    let isDir = false;
    try {
      isDir = statSync(file).isDirectory();
    } catch {
      // Missing or unreadable: readInput says why.
    }
    if (!isDir) {
      entries.push({ file });
      continue;
    }
    folders = true;
    let names: string[];
    try {
      names = readdirSync(file).filter((n) => n.toLowerCase().endsWith('.json')).sort();
    } catch (err) {
      entries.push({ file, refusal: `cannot read the folder ${file}: ${(err as Error).message}` });
      continue;
    }
    if (names.length === 0) entries.push({ file, refusal: `the folder ${file} holds no project files (*.json)` });
    for (const n of names) entries.push({ file: join(file, n) });
  }
  return { entries, folders };
}

/** Read, solve and study one project file as the request asks. */
function runProject(file: string, req: SolveRequest, flowData: unknown): ProjectRun {
  const input = readInput(file, 'the project');
  if (!input.ok) return refusedWith(file, input.message);
  let data: unknown;
  try {
    data = JSON.parse(input.text);
  } catch (err) {
    return refusedWith(file, `${file} is not valid JSON: ${(err as Error).message}`);
  }
  return runParsed(file, data, req, flowData);
}

/**
 * runProject for one of several projects: should the engine throw on one (a fault in the engine, not
 * in the file), that project's line says so, its stack goes to standard error, and the others still run.
 */
function runGuarded(file: string, req: SolveRequest, flowData: unknown): ProjectRun {
  try {
    return runProject(file, req, flowData);
  } catch (err) {
    const message = `the engine failed on this project (a fault in Joulepath, not in the file; please report it): ${(err as Error)?.message ?? String(err)}`;
    return { ok: false, lines: [`${file}: ${message}`, String((err as Error)?.stack ?? err)], line: { file, ok: false, reasons: [message] } };
  }
}

const writeErr = (lines: readonly string[]): void => {
  for (const l of lines) process.stderr.write(`${l}\n`);
};

/** Runs the command line; returns the exit code. */
function main(argv: readonly string[]): number {
  const req = parseArgs(argv);
  if (req.kind === 'help') {
    process.stdout.write(`${HELP}\n`);
    return EXIT_SOLVED;
  }
  if (req.kind === 'version') {
    process.stdout.write(`joulepath ${VERSION}\n`);
    return EXIT_SOLVED;
  }
  if (req.kind === 'usage') {
    writeErr([`joulepath: ${req.message}`, USAGE, 'joulepath --help lists the flags and exit codes']);
    return EXIT_USAGE;
  }
  // The pump study file is checked and read before anything is computed.
  let flowData: unknown;
  if (req.pumpDutyFile !== undefined) {
    const pumpDutyInput = readInput(req.pumpDutyFile, 'the pump study');
    if (!pumpDutyInput.ok) {
      writeErr([pumpDutyInput.message]);
      return EXIT_REFUSED;
    }
    try {
      flowData = JSON.parse(pumpDutyInput.text);
    } catch (err) {
      writeErr([`the pump study ${req.pumpDutyFile} is not valid JSON: ${(err as Error).message}`]);
      return EXIT_REFUSED;
    }
  }
  const { entries, folders } = expandFolders(req.files);
  // A folder asks for one line per project, as several files do (--json and --correct-pf, --pump-duty: one file).
  if (folders && (req.output === 'json' || req.correctPf || req.pumpDutyFile !== undefined)) {
    writeErr([`joulepath: ${req.output === 'json' ? '--json' : req.correctPf ? '--correct-pf' : '--pump-duty'} runs with one project file, not a folder`, USAGE, 'joulepath --help lists the flags and exit codes']);
    return EXIT_USAGE;
  }
  const output = folders && req.output === 'tables' ? 'summary' : req.output;
  const asked: SolveRequest = { ...req, output };
  if (output === 'tables' || output === 'json') {
    // parseArgs allows these with one file only.
    const r = runProject(req.files[0]!, asked, flowData);
    if (!r.ok) {
      writeErr(r.lines);
      return EXIT_REFUSED;
    }
    process.stdout.write(r.text);
    return EXIT_SOLVED;
  }
  // Several projects: one line (or CSV row) each, in the order given; a refused one does not stop the rest.
  let code = EXIT_SOLVED;
  if (output === 'csv') process.stdout.write(`${csvHeader()}\n`);
  for (const { file, refusal } of entries) {
    const r = refusal !== undefined ? refusedWith(file, refusal) : runGuarded(file, asked, flowData);
    process.stdout.write(`${output === 'csv' ? csvRow(r.line) : summaryLine(r.line)}\n`);
    if (!r.ok) {
      writeErr(r.lines);
      code = EXIT_REFUSED;
    }
  }
  return code;
}

// Output piped into a reader that stops early (`| head`): stop quietly, as other command-line tools do.
process.stdout.on('error', (err: NodeJS.ErrnoException) => {
  if (err.code === 'EPIPE') process.exit(process.exitCode ?? EXIT_SOLVED);
  throw err;
});

process.exitCode = main(process.argv.slice(2));
