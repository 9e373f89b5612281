/**
 * Command-line solver: `npm run solve -- <project.json> [--json]`.
 * The only Node-specific file of core/. Prints per-element and per-interface tables (or the full
 * result as JSON with --json). Exit code 1 with one line per problem on bad input.
 * A project fed by a battery `bank` with a `backup` study also gets the study: runtime with every
 * derate, bank sizing and recharge (text after the tables; with --json under the key
 * `backupStudy`, shaped as BackupStudyResult in core/battery/study.ts).
 */
import { readFileSync } from 'node:fs';
import { formatProblem, type Problem } from './errors.ts';
import { formatResult } from './text-report.ts';
import { solveProject } from './solve/index.ts';
import { runBackupStudy, type BackupStudyResult } from './battery/study.ts';
import { formatBackupStudy } from './battery/text-report.ts';

const USAGE = 'usage: npm run solve -- <project.json> [--json]';

function fail(lines: readonly string[]): never {
  for (const l of lines) process.stderr.write(`${l}\n`);
  process.exit(1);
}

function main(argv: readonly string[]): void {
  const json = argv.includes('--json');
  const files = argv.filter((a) => !a.startsWith('--'));
  const unknown = argv.filter((a) => a.startsWith('--') && a !== '--json');
  if (files.length !== 1 || unknown.length) fail([USAGE]);
  const file = files[0]!;
  let text: string;
  try {
    text = readFileSync(file, 'utf8');
  } catch (err) {
    fail([`cannot read ${file}: ${(err as Error).message}`]);
  }
  let data: unknown;
  try {
    data = JSON.parse(text);
  } catch (err) {
    fail([`${file} is not valid JSON: ${(err as Error).message}`]);
  }
  const outcome = solveProject(data);
  if (!outcome.ok) fail([`${file}: the project cannot be solved:`, ...outcome.problems.map((p: Problem) => `  ${formatProblem(p)}`)]);
  let study: BackupStudyResult | undefined;
  if (hasBackupStudy(data)) {
    const s = runBackupStudy(data);
    if (!s.ok) fail([`${file}: the battery backup study cannot be run:`, ...s.problems.map((p: Problem) => `  ${formatProblem(p)}`)]);
    study = s.study;
  }
  if (json) {
    process.stdout.write(`${JSON.stringify(study ? { ...outcome.result, backupStudy: study } : outcome.result, null, 2)}\n`);
  } else {
    process.stdout.write(`${formatResult(outcome.result)}\n${study ? `${formatBackupStudy(study)}\n` : ''}`);
  }
}

/** A study runs when the project has `backup` settings and a battery given as a `bank`. */
function hasBackupStudy(data: unknown): boolean {
  const p = data as { backup?: unknown; elements?: unknown };
  return p.backup !== undefined && Array.isArray(p.elements) && p.elements.some((e: { kind?: unknown; bank?: unknown }) => e?.kind === 'battery' && e.bank !== undefined);
}

main(process.argv.slice(2));
