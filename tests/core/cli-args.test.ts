/**
 * The command line's parser and words (core/cli/args.ts, core/cli/summary.ts), in-process: which
 * output each argument list asks for, which lists are usage errors (exit code 2), the help text
 * naming the exit codes and CSV columns, and the summary line and CSV row carrying the engine's own
 * figures. The same commands run as a user runs them in tests/tools/cli-package.test.ts.
 */
import { describe, expect, it } from 'vitest';
import { EXIT_REFUSED, EXIT_SOLVED, EXIT_USAGE, HELP, parseArgs } from '../../core/cli/args.ts';
import { CSV_COLUMNS, csvField, csvHeader, csvRow, summaryLine } from '../../core/cli/summary.ts';
import { demoProjects, solveProject } from '../../core/index.ts';

describe('joulepath command line: arguments', () => {
  it('reads `solve <files…>` with each output, and without the word solve as before', () => {
    // Expected values: the brief of issue 16 point 6 (one file: tables; several: one line each; --csv).
    expect(parseArgs(['solve', 'a.json'])).toMatchObject({ kind: 'solve', files: ['a.json'], output: 'tables' });
    expect(parseArgs(['a.json'])).toMatchObject({ kind: 'solve', files: ['a.json'], output: 'tables' });
    expect(parseArgs(['solve', 'a.json', '--json'])).toMatchObject({ output: 'json' });
    expect(parseArgs(['solve', 'a.json', 'b.json'])).toMatchObject({ files: ['a.json', 'b.json'], output: 'summary' });
    expect(parseArgs(['solve', 'a.json', '--summary'])).toMatchObject({ files: ['a.json'], output: 'summary' });
    expect(parseArgs(['solve', '--csv', 'a.json', 'b.json'])).toMatchObject({ files: ['a.json', 'b.json'], output: 'csv' });
    expect(parseArgs(['solve', 'a.json', '--surges', '--machines'])).toMatchObject({ surges: true, machines: true });
    expect(parseArgs(['solve', 'a.json', '--correct-pf', 'feeder:0.95'])).toMatchObject({ correctPf: { at: 'feeder', targetPowerFactor: 0.95 } });
    expect(parseArgs(['solve', 'a.json', '--pump-duty', 's.json'])).toMatchObject({ pumpDutyFile: 's.json' });
    // The spelling before format 2 is still read (common practice (no source): keep old scripts running).
    expect(parseArgs(['solve', 'a.json', '--flow', 's.json'])).toMatchObject({ pumpDutyFile: 's.json' });
    // `--` ends the flags: a file whose name starts with a dash.
    expect(parseArgs(['solve', '--csv', '--', '-odd.json'])).toMatchObject({ files: ['-odd.json'], output: 'csv' });
  });

  it('asks for the help with --help, -h or help, wherever it stands', () => {
    for (const argv of [['--help'], ['-h'], ['help'], ['solve', '--help'], ['solve', 'a.json', '-h'], []]) {
      const r = parseArgs(argv);
      // No arguments at all is a usage error, not the help (the usage line says what to give).
      expect(r.kind).toBe(argv.length === 0 ? 'usage' : 'help');
    }
  });

  it('asks for the version with --version', () => {
    expect(parseArgs(['--version'])).toEqual({ kind: 'version' });
    expect(parseArgs(['solve', 'a.json', '--version'])).toEqual({ kind: 'version' });
  });

  it.each([
    [['solve'], /no project file given/],
    [['solve', 'a.json', '--frobnicate'], /unknown flag --frobnicate/],
    [['solv', 'a.json'], /unknown command "solv"/],
    [['solve', 'a.json', '--json', '--csv'], /--json and --csv do not go together/],
    [['solve', 'a.json', 'b.json', '--json'], /--json prints one project/],
    [['solve', 'a.json', 'b.json', '--correct-pf', 'x:0.9'], /--correct-pf names an element of one project/],
    [['solve', 'a.json', 'b.json', '--pump-duty', 's.json'], /--pump-duty runs with one project file/],
    [['solve', 'a.json', '--pump-duty'], /--pump-duty needs the pump study file/],
    [['solve', 'a.json', '--correct-pf'], /--correct-pf needs <elementId>:<target power factor>/],
    [['solve', 'a.json', '--correct-pf', 'x:high'], /the target power factor "high" is not a number/],
  ])('%j is a usage error naming the problem', (argv, message) => {
    const r = parseArgs(argv);
    expect(r.kind).toBe('usage');
    if (r.kind === 'usage') expect(r.message).toMatch(message);
  });

  it('documents the exit codes and every CSV column in the help', () => {
    // Exit codes as issue 16 point 6 sets them: 0 solved, 1 input refused, 2 usage.
    expect([EXIT_SOLVED, EXIT_REFUSED, EXIT_USAGE]).toEqual([0, 1, 2]);
    expect(HELP).toMatch(/Exit codes: 0 every project solved; 1 a project or a file it names was refused/);
    expect(HELP).toMatch(/2 wrong command\s+line/);
    expect(HELP).toContain(`CSV columns: ${CSV_COLUMNS.join(',')}`);
    for (const flag of ['--json', '--summary', '--csv', '--surges', '--correct-pf', '--machines', '--pump-duty', '--help', '--version']) expect(HELP).toContain(flag);
    expect(HELP).toContain('licensed professionals');
  });
});

describe('joulepath command line: summary line and CSV row', () => {
  const [hillside, riverside] = demoProjects;
  const solved = (p: unknown) => {
    const o = solveProject(p);
    if (!o.ok) throw new Error('demo does not solve');
    return o.result;
  };

  it('a solved project: the engine\'s totals to 0.1 W, efficiency in %, warnings, backup runtime', () => {
    const result = solved(riverside!.project); // the engine called in-process
    const t = result.totals;
    const line = summaryLine({ file: 'site.json', ok: true, result });
    expect(line).toBe(
      `site.json: solved: ${result.projectName}: source ${t.sourcePower.toFixed(1)} W, loads ${t.loadPower.toFixed(1)} W, losses ${t.losses.toFixed(1)} W, efficiency ${(100 * t.efficiency).toFixed(2)} %, ${result.warnings.length} warnings`,
    );
    const hut = solved(hillside!.project);
    // 27.6667 h = 27 h 40 min, the runtime the tables print for this demo (core/studies/backup/text-report.ts, run in tests/battery/cli.test.ts).
    expect(summaryLine({ file: 'hut.json', ok: true, result: hut, backupRuntimeHours: 27 + 40 / 60 })).toMatch(/, backup runtime 27\.67 h$/);
    expect(summaryLine({ file: 'hut.json', ok: true, result: hut, backupRuntimeHours: 48, backupRuntimeIsLowerBound: true })).toMatch(/, backup runtime over 48\.00 h$/);
  });

  it('a refused project: its first reason and how many more', () => {
    expect(summaryLine({ file: 'bad.json', ok: false, reasons: ['the project cannot be solved: "Supply", Open-circuit voltage: must be above 0'] })).toBe(
      'bad.json: refused: the project cannot be solved: "Supply", Open-circuit voltage: must be above 0',
    );
    expect(summaryLine({ file: 'bad.json', ok: false, reasons: ['first', 'second', 'third'] })).toBe('bad.json: refused: first (and 2 more)');
  });

  it('CSV: header, one row per project, fields quoted per RFC 4180 and formulas disarmed', () => {
    expect(csvHeader()).toBe('file,status,project,source_power_W,load_power_W,losses_W,efficiency_percent,warnings,backup_runtime_h,backup_runtime_lower_bound,reason');
    const result = solved(riverside!.project);
    const t = result.totals;
    const row = csvRow({ file: 'sites/a.json', ok: true, result });
    expect(row).toBe(`sites/a.json,solved,${result.projectName},${t.sourcePower.toFixed(1)},${t.loadPower.toFixed(1)},${t.losses.toFixed(1)},${(100 * t.efficiency).toFixed(2)},${result.warnings.length},,,`);
    expect(row.split(',')).toHaveLength(CSV_COLUMNS.length);
    const refused = csvRow({ file: 'b.json', ok: false, projectName: 'Pump, "north"', reasons: ['cannot read the project b.json: no such file'] });
    // RFC 4180 section 2: a field holding a comma or a quote is quoted, its quotes doubled.
    expect(refused).toBe('b.json,refused,"Pump, ""north""",,,,,,,,cannot read the project b.json: no such file');
    // A text starting with = + - @ is prefixed with ' (OWASP "CSV injection", common practice, no standard).
    expect(csvField('=SUM(A1)')).toBe("'=SUM(A1)");
    expect(csvField('-12')).toBe("'-12");
    expect(csvField('line\nbreak')).toBe('"line\nbreak"');
  });
});
