/**
 * Command-line solver: `npm run solve -- <project.json> [--json]`.
 * The only Node-specific file of core/. Prints per-element and per-interface tables (or the full
 * result as JSON with --json). Exit code 1 with one line per problem on bad input.
 */
import { readFileSync } from 'node:fs';
import { formatProblem, type Problem } from './errors.ts';
import { formatResult } from './text-report.ts';
import { solveProject } from './solve/index.ts';

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
  process.stdout.write(json ? `${JSON.stringify(outcome.result, null, 2)}\n` : `${formatResult(outcome.result)}\n`);
}

main(process.argv.slice(2));
