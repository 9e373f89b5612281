/**
 * Table-driven reference cases: every file in tests/reference/cases/*.json is one project with the
 * figures it must produce, each worked by hand from a named outside source (see README.md here).
 *
 * A case either expects a solved result —
 *   { name, source, tolerance, absTolerance?, working, project, expect: [{ path, value }], expectWarnings? }
 * — or expects the project to be refused —
 *   { name, source, working, project, expectProblems: [{ elementId, field, code }] }.
 * `path` is a small selector into the result: `totals.sourcePower`, `elements[id=cab].loss`,
 * `elements[id=ld].input.phasor.voltage.im`. A value passes when |got − want| ≤ tolerance·|want| + absTolerance.
 */
import { readdirSync, readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { solveProject } from '../../core/index.ts';

const CASES_DIR = fileURLToPath(new URL('./cases', import.meta.url));

interface Expectation {
  path: string;
  value: number;
}
interface ProblemKey {
  elementId: string;
  field: string;
  code: string;
}
interface WarningKey {
  elementId: string;
  code: string;
}
interface Case {
  name: string;
  source: string;
  working: string;
  project: unknown;
  tolerance?: number;
  absTolerance?: number;
  expect?: Expectation[];
  expectWarnings?: WarningKey[];
  expectProblems?: ProblemKey[];
}

/** Check a case file's own shape, so a typo in a case fails loudly instead of testing nothing. */
function readCase(file: string): Case {
  const raw = JSON.parse(readFileSync(join(CASES_DIR, file), 'utf8')) as Record<string, unknown>;
  const known = ['name', 'source', 'working', 'project', 'tolerance', 'absTolerance', 'expect', 'expectWarnings', 'expectProblems'];
  const unknown = Object.keys(raw).filter((k) => !known.includes(k));
  if (unknown.length) throw new Error(`${file}: unknown field(s) ${unknown.join(', ')}`);
  for (const k of ['name', 'source', 'working']) {
    if (typeof raw[k] !== 'string' || (raw[k] as string).trim() === '') throw new Error(`${file}: "${k}" must be non-empty text`);
  }
  if (typeof raw['project'] !== 'object' || raw['project'] === null) throw new Error(`${file}: "project" must be an object`);
  const hasExpect = Array.isArray(raw['expect']);
  const hasProblems = Array.isArray(raw['expectProblems']);
  if (hasExpect === hasProblems) throw new Error(`${file}: give exactly one of "expect" or "expectProblems"`);
  if (hasExpect) {
    if (typeof raw['tolerance'] !== 'number' || !(raw['tolerance'] > 0)) throw new Error(`${file}: "tolerance" must be a positive number`);
    const list = raw['expect'] as unknown[];
    if (list.length === 0) throw new Error(`${file}: "expect" is empty`);
    for (const e of list) {
      const x = e as Record<string, unknown>;
      if (typeof x['path'] !== 'string' || typeof x['value'] !== 'number' || Object.keys(x).length !== 2) {
        throw new Error(`${file}: each expectation is { path: text, value: number }, got ${JSON.stringify(e)}`);
      }
    }
  } else if ((raw['expectProblems'] as unknown[]).length === 0) {
    throw new Error(`${file}: "expectProblems" is empty`);
  }
  return raw as unknown as Case;
}

/** Follow a selector like `elements[id=cab].input.phasor.voltage.im` into a value. */
export function select(root: unknown, path: string): unknown {
  let cur: unknown = root;
  for (const part of path.split('.')) {
    const m = /^([A-Za-z_$][\w$]*)(?:\[(?:(\w+)=([^\]]+)|(\d+))\])?$/.exec(part);
    if (!m) throw new Error(`bad path segment "${part}" in "${path}"`);
    const [, key, field, wanted, index] = m;
    if (cur === null || typeof cur !== 'object') throw new Error(`"${path}": nothing at "${part}"`);
    cur = (cur as Record<string, unknown>)[key!];
    if (field !== undefined) {
      if (!Array.isArray(cur)) throw new Error(`"${path}": "${key}" is not a list`);
      const hits = cur.filter((x) => String((x as Record<string, unknown>)[field]) === wanted);
      if (hits.length !== 1) throw new Error(`"${path}": ${hits.length} entries of "${key}" with ${field}=${wanted}`);
      cur = hits[0];
    } else if (index !== undefined) {
      if (!Array.isArray(cur)) throw new Error(`"${path}": "${key}" is not a list`);
      cur = cur[Number(index)];
    }
  }
  return cur;
}

const key = (p: ProblemKey): string => `${p.elementId} | ${p.field} | ${p.code}`;
const wkey = (w: WarningKey): string => `${w.elementId} | ${w.code}`;

const files = readdirSync(CASES_DIR)
  .filter((f) => f.endsWith('.json'))
  .sort();

describe('reference cases (tests/reference/cases/*.json)', () => {
  it('the case table is not empty and every case file is well formed', () => {
    expect(files.length).toBeGreaterThan(0);
    for (const f of files) readCase(f);
  });

  for (const file of files) {
    const c = readCase(file);
    it(`${file}: ${c.name}`, () => {
      const outcome = solveProject(c.project);
      if (c.expectProblems) {
        // Source of the expected refusal: c.source (in the case file).
        expect(outcome.ok, `${file} should be refused (${c.source})`).toBe(false);
        if (outcome.ok) return;
        const got = outcome.problems.map(key).sort();
        expect(got, `${file}: problems ${JSON.stringify(outcome.problems, null, 1)}`).toEqual(c.expectProblems.map(key).sort());
        for (const p of outcome.problems) expect(p.message.length, `${file}: every problem carries a message`).toBeGreaterThan(0);
        return;
      }
      if (!outcome.ok) throw new Error(`${file}: the engine refused the case: ${JSON.stringify(outcome.problems)}`);
      const result = outcome.result;
      const tol = c.tolerance!;
      const absTol = c.absTolerance ?? 0;
      const failures: string[] = [];
      for (const e of c.expect!) {
        // Source of e.value: c.source, worked in c.working.
        const got = select(result, e.path);
        if (typeof got !== 'number') {
          failures.push(`${e.path}: not a number (${JSON.stringify(got)})`);
          continue;
        }
        const err = Math.abs(got - e.value);
        if (!(err <= tol * Math.abs(e.value) + absTol)) {
          failures.push(`${e.path}: engine ${got}, expected ${e.value} (rel ${(err / Math.abs(e.value)).toExponential(2)}, tolerance ${tol})`);
        }
      }
      expect(failures, `${file} — ${c.name}\nsource: ${c.source}`).toEqual([]);
      if (c.expectWarnings) {
        expect(result.warnings.map(wkey).sort(), `${file}: warnings ${JSON.stringify(result.warnings)}`).toEqual(c.expectWarnings.map(wkey).sort());
      }
      // Conservation of energy over the whole chain (first law): source = loads + losses.
      expect(result.totals.balanceError).toBeLessThan(1e-9);
    });
  }
});
