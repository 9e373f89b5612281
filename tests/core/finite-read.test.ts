/**
 * The solve's quick read of its result (core/solve/finite.ts, `resultMayHoldNonFinite`, issue 20
 * point 5): it reads the result's figures by name instead of walking its keys, so it must see every
 * figure the result can hold. Each figure of real solved results — the demos, the bench tree, the
 * reference cases, a converter past its rating (a warning with values) — is made NaN, +Infinity and
 * −Infinity in turn, and the read must say "may hold" each time; a sound result passes. And every
 * figure field of RESULT_LAYOUT is met at least once (else these results would not test it).
 * No check value here comes from outside: the rule itself (finite everywhere or refused) is the
 * project's (DEVELOPERS.md).
 */
import { readdirSync, readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { demoProjects, solveProject, type SolveResult } from '../../core/index.ts';
import { RESULT_LAYOUT, resultMayHoldNonFinite } from '../../core/solve/finite.ts';
import { twentyStageTree } from '../bench/trees.ts';

const CASES_DIR = fileURLToPath(new URL('../reference/cases', import.meta.url));

const overRated = {
  format: 'joulepath-project',
  version: 2,
  name: 'Over its rating',
  elements: [
    { id: 'src', kind: 'grid', phases: 1, voltage: 230, frequency: 50 },
    { id: 'rect', kind: 'rectifier', from: 'src', outputVoltage: 48, inputPowerFactor: 0.99, loss: { model: 'curve', ratedPower: 500, points: [{ loadFraction: 0.2, efficiency: 0.9 }, { loadFraction: 1, efficiency: 0.95 }] } },
    { id: 'ld', kind: 'dc-load', from: 'rect', power: 800 },
  ],
};

function results(): [string, SolveResult][] {
  const out: [string, SolveResult][] = [];
  const add = (name: string, project: unknown) => {
    const o = solveProject(project);
    if (o.ok) out.push([name, o.result]);
  };
  for (const d of demoProjects) add(d.id, d.project);
  add('bench tree', twentyStageTree());
  add('over its rating', overRated);
  for (const f of readdirSync(CASES_DIR).filter((x) => x.endsWith('.json'))) {
    add(f, (JSON.parse(readFileSync(join(CASES_DIR, f), 'utf8')) as { project: unknown }).project);
  }
  return out;
}

/** Every numeric leaf of a plain value: its path of keys. */
function figurePaths(value: unknown, path: string[] = [], out: string[][] = []): string[][] {
  if (typeof value === 'number') out.push(path);
  else if (typeof value === 'object' && value !== null) for (const k of Object.keys(value)) figurePaths((value as Record<string, unknown>)[k], [...path, k], out);
  return out;
}

function poisoned(result: SolveResult, path: readonly string[], x: number): SolveResult {
  const copy = structuredClone(result);
  let at = copy as unknown as Record<string, unknown>;
  for (const k of path.slice(0, -1)) at = at[k] as Record<string, unknown>;
  at[path[path.length - 1]!] = x;
  return copy;
}

describe('the quick read of a solve result sees every figure', () => {
  const all = results();

  it('reads sound results as sound', () => {
    expect(all.length).toBeGreaterThan(25);
    for (const [name, r] of all) expect([name, resultMayHoldNonFinite(r)]).toEqual([name, false]);
  });

  it('sees NaN, +Infinity and −Infinity at every figure of every result', () => {
    const missed: string[] = [];
    let count = 0;
    for (const [name, r] of all) {
      for (const path of figurePaths(r)) {
        for (const x of [Number.NaN, Number.POSITIVE_INFINITY, Number.NEGATIVE_INFINITY]) {
          count++;
          if (!resultMayHoldNonFinite(poisoned(r, path, x))) missed.push(`${name}: ${path.join('.')} = ${x}`);
        }
      }
    }
    expect(count).toBeGreaterThan(3000);
    expect(missed).toEqual([]);
  });

  it('these results hold every figure field the read names (so each is tested above)', () => {
    const met = new Set<string>();
    const note = (layout: string, key: string) => met.add(`${layout}.${key}`);
    for (const [, r] of all) {
      for (const k of Object.keys(r.method)) note('method', k);
      for (const k of Object.keys(r.totals)) note('totals', k);
      for (const e of r.elements) {
        for (const k of Object.keys(e)) note('element', k);
        for (const p of [e.input, e.output]) if (p) for (const k of Object.keys(p)) note('port', k);
        if (e.weighted) for (const k of Object.keys(e.weighted)) note('weighted', k);
        if (e.fit) for (const k of Object.keys(e.fit)) note('fit', k);
      }
      for (const w of r.warnings) for (const k of Object.keys(w)) note('warning', k);
      for (const d of r.voltageDrop ?? []) {
        for (const k of Object.keys(d)) note('pathDrop', k);
        for (const l of d.links) for (const k of Object.keys(l)) note('pathLink', k);
      }
    }
    const wanted = Object.entries(RESULT_LAYOUT).flatMap(([layout, fields]) =>
      layout === 'result' ? [] : Object.entries(fields).filter(([, how]) => how !== 'text').map(([k]) => `${layout}.${k}`),
    );
    expect(wanted.filter((w) => !met.has(w))).toEqual([]);
  });
});
