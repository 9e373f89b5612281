/**
 * The command line's words: the help text, the usage line and the argument parser of
 * `joulepath solve <project.json>… [flags]` (pure; core/cli/cli.ts reads the files and prints).
 *
 * Exit codes (documented in the help and README "Command-line tool"): 0 every project solved,
 * 1 a project (or a file it names) was refused, 2 the command line itself is wrong (unknown flag or
 * command, a flag without its value, no file, flags that do not go together).
 */
import type { PfCorrectionRequest } from '../studies/pf/correction.ts';
import { parseCorrectPfFlag } from '../studies/pf/text-report.ts';
import { MACHINE_USAGE, takeMachineFlags } from './machines-flags.ts';
import { CSV_COLUMNS } from './summary.ts';
import { MAX_SPREAD_SAMPLES } from '../model/spread.ts';
import { MAX_SPREAD_SEED } from '../solve/spread-schema.ts';

import { RANGES } from '../kinds/ranges.ts';

/** Fewest samples --spread takes (the file's own range). */
const MIN_SPREAD_SAMPLES = RANGES.spreadSamples.min;

export const EXIT_SOLVED = 0;
export const EXIT_REFUSED = 1;
export const EXIT_USAGE = 2;

export const USAGE = `usage: joulepath solve <project.json>… [--json | --summary | --csv] [--surges] [--variants] [--search] [--mode supply|battery] [--correct-pf <elementId>:<target power factor>] [--spread <samples> [--seed <n>]] ${MACHINE_USAGE}`;

/** What `joulepath --help` prints. */
export const HELP = `joulepath: plan an electrical power chain from a project file: power, losses, currents and
voltages at every stage, and the studies the project asks for.

${USAGE}
       joulepath --help | --version

  <project.json>…   one or more project files (as the page exports them), or folders: a folder
                    stands for its *.json files, in name order. With one file the tables are
                    printed; with several (or a folder), one summary line per project.
  --json            the full result of one project as JSON (one file only)
  --summary         one summary line per project, also for a single file
  --csv             one CSV row per project, with a header row (columns below)
  --surges          add the motor starting and fault study (runs by itself when the project
                    has starting, surge, protection or fault data)
  --variants        the project's variants side by side with it ("variants" in the file):
                    power, losses, cost, battery, cables, starts and warnings, "*" marking the
                    figures that differ (with --json: under "variants")
  --search          the options that meet the project's search target (its "optionSearch":
                    candidates and target) as a short list, cheapest first, and the rejected
                    with their reasons (one file only; with --json under "search")
  --mode supply|battery
                    a project with a bank on a bus has two modes: the tables of both are
                    printed by default; this prints one (with --json, its result at the top)
  --correct-pf <elementId>:<target power factor>
                    size the capacitor bank for that element's interface (one file only)
  --machines        motor and drive details
  --spread <samples>
                    the runtime with its spread: that many Monte Carlo samples (10 to 20000) of
                    the battery backup study over the tolerances of the project's "spread"
                    settings (typical values where it gives none); one file only
  --seed <n>        the seed of the spread's samples (a whole number, default the file's or 1)
  --pump-duty <pump-study.json>
                    the flow-control comparison of a pump study file (one project file only)
  --help, -h        this text
  --version         the version of the tool

A project file with "running": { "energyPricePerKWh": …, "hoursPerYear": … } also gets the yearly
cost of its losses (and of its pump duty methods); the file is the way in, there is no flag.
With "years" (and optionally "discountRate", "nightPricePerKWh", "gridCo2KgPerKWh", "generator")
in "running" it also prints the cost over the years: purchase prices, losses, CO₂, generator fuel
and the lifetime cost as a net present value.

Summary line: "<file>: solved: <project name>: source … W, loads … W, losses … W, efficiency … %,
<n> warnings[, backup runtime … h]", or "<file>: refused: <the first reason>" (every reason
follows on standard error). Several files: one project refused does not stop the others.

CSV columns: ${CSV_COLUMNS.join(',')}
  (watts in W, efficiency in %, the backup runtime in hours when the project has a backup study,
  "yes" in backup_runtime_lower_bound when the bank outlasted the simulated outage; reason is
  empty for a solved project)

Exit codes: 0 every project solved; 1 a project or a file it names was refused (the others still
run); 2 wrong command line (unknown flag, a flag without its value, no project file).

Results are planning estimates; local codes and licensed professionals govern the final design.`;

export type CliOutput = 'tables' | 'json' | 'summary' | 'csv';

export type CliRequest =
  | { kind: 'help' }
  | { kind: 'version' }
  | { kind: 'usage'; message: string }
  | {
      kind: 'solve';
      files: string[];
      output: CliOutput;
      surges: boolean;
      machines: boolean;
      /** Compare the project's variants (--variants). */
      variants?: true;
      /** Run the option search of the project's `optionSearch`. */
      search?: boolean;
      /** The one mode of a project with a bank on a bus whose tables are printed (both when absent). */
      mode?: 'supply' | 'battery';
      pumpDutyFile?: string;
      correctPf?: PfCorrectionRequest;
      /** The runtime spread's samples (--spread) and seed (--seed). */
      spread?: number;
      seed?: number;
    };

const usage = (message: string): CliRequest => ({ kind: 'usage', message });

/**
 * Read the arguments (after `node joulepath.mjs`). The subcommand `solve` may be left out (as
 * `npm run solve -- file.json` always worked); a first word that is neither `solve`, `help` nor a
 * path (no `.` or `/` in it) is an unknown command. `--` ends the flags (a file named `-x.json`).
 */
export function parseArgs(argv: readonly string[]): CliRequest {
  let args = [...argv];
  const dashes = args.indexOf('--');
  const afterDashes = dashes >= 0 ? args.slice(dashes + 1) : [];
  if (dashes >= 0) args = args.slice(0, dashes);
  const first = args[0];
  if (first === 'help' || args.includes('--help') || args.includes('-h')) return { kind: 'help' };
  if (args.includes('--version')) return { kind: 'version' };
  if (first === 'solve') args = args.slice(1);
  else if (first !== undefined && !first.startsWith('-') && !/[./\\]/.test(first)) {
    return usage(`unknown command "${first}" (the command is "solve"; write ./${first} for a file of that name)`);
  }
  // --machines, --pump-duty <pump-study.json> (core/cli/machines-flags.ts).
  const mach = takeMachineFlags(args);
  if (!mach.ok) return usage(mach.message);
  args = mach.rest;
  let correctPf: PfCorrectionRequest | undefined;
  const files: string[] = [];
  const outputs: CliOutput[] = [];
  let surges = false;
  let variants = false;
  let search = false;
  let mode: 'supply' | 'battery' | undefined;
  let spread: number | undefined;
  let seed: number | undefined;
  for (let i = 0; i < args.length; i++) {
    const a = args[i]!;
    if (a === '--mode') {
      const m = args[i + 1];
      if (m !== 'supply' && m !== 'battery') return usage(`--mode takes supply or battery${m === undefined ? '' : `, not "${m}"`}`);
      mode = m;
      i++;
    } else if (a === '--spread' || a === '--seed') {
      const v = args[i + 1];
      const n = v === undefined || v.trim() === '' ? NaN : Number(v);
      const [lo, hi] = a === '--spread' ? [MIN_SPREAD_SAMPLES, MAX_SPREAD_SAMPLES] : [0, MAX_SPREAD_SEED];
      if (!Number.isInteger(n) || n < lo || n > hi) return usage(`${a} takes a whole number from ${lo} to ${hi}${v === undefined ? '' : `, not "${v}"`}`);
      if (a === '--spread') spread = n;
      else seed = n;
      i++;
    } else if (a === '--json') outputs.push('json');
    else if (a === '--csv') outputs.push('csv');
    else if (a === '--summary') outputs.push('summary');
    else if (a === '--surges') surges = true;
    else if (a === '--variants') variants = true;
    else if (a === '--search') search = true;
    else if (a === '--correct-pf') {
      const pf = parseCorrectPfFlag(args[i + 1]);
      if (!pf.ok) return usage(pf.message);
      correctPf = pf.request;
      i++;
    } else if (a.startsWith('-') && a !== '-') return usage(`unknown flag ${a}`);
    else files.push(a);
  }
  files.push(...afterDashes);
  const distinct = [...new Set(outputs)];
  if (distinct.length > 1) return usage(`${distinct.map((o) => `--${o}`).join(' and ')} do not go together: choose one`);
  if (files.length === 0) return usage('no project file given');
  const several = files.length > 1;
  if (several && distinct[0] === 'json') return usage('--json prints one project: give one file (--csv or --summary for several)');
  if (several && search) return usage('--search lists the options of one project: give one file');
  if (several && correctPf) return usage('--correct-pf names an element of one project: give one file');
  if (seed !== undefined && spread === undefined) return usage('--seed goes with --spread <samples>');
  if (several && spread !== undefined) return usage('--spread runs with one project file: give one file');
  if (spread !== undefined && (distinct[0] === 'csv' || distinct[0] === 'summary')) return usage(`--spread prints its figures with the tables or --json, not with --${distinct[0]}`);
  if (several && mach.pumpDutyFile !== undefined) return usage('--pump-duty runs with one project file: give one file');
  const output: CliOutput = distinct[0] ?? (several ? 'summary' : 'tables');
  return {
    kind: 'solve',
    files,
    output,
    surges,
    machines: mach.machines,
    ...(variants ? { variants: true as const } : {}),
    ...(search ? { search } : {}),
    ...(mode !== undefined ? { mode } : {}),
    ...(mach.pumpDutyFile !== undefined ? { pumpDutyFile: mach.pumpDutyFile } : {}),
    ...(correctPf ? { correctPf } : {}),
    ...(spread !== undefined ? { spread } : {}),
    ...(seed !== undefined ? { seed } : {}),
  };
}
