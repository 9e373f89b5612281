/**
 * Hostile input (issue 15, proof): the demo projects and small random trees with hostile numbers
 * (zero, −0, negative, subnormal, huge up to the double maximum; NaN and ±Infinity cannot come from
 * JSON), hostile ids (reserved object keys, empty, very long, control characters, duplicates, an
 * element fed from itself) and hostile shapes (a field removed, null, a list, an object, text,
 * true/false in its place) applied to any field. Every outcome of the solve, and of the battery
 * backup study, the surge and fault study and the pump duty study where the project has them, is
 * either
 * - a clean refusal: every problem names an element of the project (its id, or "#n" for the n-th
 *   element when it has no readable id, or PROJECT_LEVEL, the project as a whole) and a field where it is about one field,
 *   with a message in words (no NaN, Infinity, undefined, [object Object]); or
 * - a result whose every number is finite and whose energy balance holds to 1e-9.
 * No case throws, and no case takes longer than CASE_BUDGET_MS (a hang is a failure, not a wait).
 *
 * Reproducible: fixed seeds, fixed run counts (JP_FC_SCALE multiplies the runs for a longer hunt).
 *
 * Left out (another area owns the fault; issue 15 point 7, the battery study's profile steps):
 * hostile numbers in the backup study's own settings (`backup`: profile segment hours, duty periods,
 * time step, horizon), which today can ask for billions of steps ("Set maximum size exceeded", or
 * an exhausted heap at 1e-7 h segments). The element fields of a project with a backup study are
 * mutated like any other; the study's settings stay as the demo has them.
 */
import { readFileSync } from 'node:fs';
import { afterAll, describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { solveProject } from '../../core/solve/index.ts';
import { findNonFinite } from '../../core/solve/finite.ts';
import { runBackupStudy } from '../../core/studies/backup/study.ts';
import { hasSurgeInputs, studySurges } from '../../core/studies/surge/index.ts';
import { projectPumpDuty } from '../../core/studies/machines/pump-duty.ts';
import type { Problem } from '../../core/model/errors.ts';
import { PROJECT_LEVEL } from '../../core/model/errors.ts';
import { projectArb, projectWithNetworksArb } from '../core/arbitraries.ts';
import { RANGES } from '../../core/kinds/ranges.ts';
import { onSolved } from '../core/solved.ts';

/** Multiply every numRuns by JP_FC_SCALE (default 1) for a longer hunt, e.g. JP_FC_SCALE=20. */
const SCALE = Math.max(1, Number(process.env['JP_FC_SCALE'] ?? '1') || 1);
/** JP_FC_SEED=<n> hunts with other seeds (the default ones are fixed, so CI runs the same cases each time). */
const SEED = Number(process.env['JP_FC_SEED'] ?? '0') || 0;
/** Longest a single case (solve and studies) may take, ms: a hang or a runaway study fails here. */
const CASE_BUDGET_MS = 2000;

type Json = Record<string, unknown>;
const demo = (id: string): Json => JSON.parse(readFileSync(`core/demos/${id}.json`, 'utf8')) as Json;

/**
 * The hillside demo with the bank's datasheet figures given (LiFePO4 figures of the kind a maker
 * prints; invented here), so that the mutations reach every override the backup study reads.
 */
function hillsideWithOverrides(): Json {
  const p = demo('hillside-relay-hut');
  const bank = (p['elements'] as Json[]).find((e) => e['kind'] === 'battery')!['bank'] as Json;
  bank['initialSoc'] = 0.95;
  bank['overrides'] = {
    nominalCellVoltage: 3.2,
    ocvCurve: [{ soc: 0, voltage: 2.8 }, { soc: 0.5, voltage: 3.28 }, { soc: 1, voltage: 3.4 }],
    endOfDischargeCellVoltage: 2.8,
    peukertExponent: 1.05,
    usableDepthOfDischarge: 0.9,
    internalResistanceOhmAh: 0.1,
    capacityVsTemperature: [{ temperatureC: -10, capacityFactor: 0.8 }, { temperatureC: 25, capacityFactor: 1 }, { temperatureC: 45, capacityFactor: 1.02 }],
    roundTripEfficiency: 0.95,
    ratedHours: 1,
    chargeCellVoltage: 3.55,
    floatCellVoltage: 3.4,
    maxChargeCRate: 0.5,
    maxDischargeCRate: 1,
    minChargeTemperatureC: 0,
  };
  return p;
}

const DEMOS: readonly Json[] = [demo('cold-store-dc-bus'), demo('hillside-relay-hut'), demo('riverside-pump-station'), hillsideWithOverrides()];

// ---------- hostile values ----------

/** Numbers JSON can carry that no field should take on trust. */
const hostileNumber: fc.Arbitrary<number> = fc.oneof(
  fc.constantFrom(0, -0, -1, 1, 2, 3, 0.5, -1e-300, 5e-324, 2.2250738585072014e-308, 1e-300, 1e-12, 1e-6, 1e6, 1e9, 1e12, 1e15, 1e20, 1e300, 1e308, 1.7976931348623157e308, -1.7976931348623157e308, Number.MAX_SAFE_INTEGER, 1 + Number.EPSILON, 1 - Number.EPSILON / 2, -273.15, -300),
  // Log-uniform over the whole range of doubles, either sign.
  fc.tuple(fc.double({ min: 1, max: 9.99, noNaN: true }), fc.integer({ min: -323, max: 307 }), fc.boolean()).map(([m, e, neg]) => (neg ? -1 : 1) * m * 10 ** e),
  fc.double({ noNaN: true, noDefaultInfinity: true }),
);

/**
 * Numbers at the edges of the plausible ranges (core/kinds/ranges.ts): they pass the field checks,
 * so they reach the solve and the studies (a 1 MV source, a 1 GW load, a 100 km run, 0.1 Hz …).
 */
const edgeNumber: fc.Arbitrary<number> = fc
  .tuple(fc.constantFrom(...Object.values(RANGES).flatMap((r) => [r.min, r.max]).filter((v) => v !== 0)), fc.constantFrom(1, 1 - 1e-12, 0.5, 1e-3))
  .map(([v, f]) => v * f);

/** Ids that are object keys of every object, placeholders the engine uses, or otherwise awkward. */
const hostileId: fc.Arbitrary<string> = fc.oneof(
  fc.constantFrom('__proto__', 'toString', 'constructor', 'prototype', 'hasOwnProperty', 'valueOf', 'project', 'pumpDuty', '#1', '', ' ', '\u0000', '\u202e', 'a'.repeat(5000), '💥', 'e1'),
  fc.string({ maxLength: 12 }),
);

/** A value of another shape put where a field was. */
const hostileShape: fc.Arbitrary<unknown> = fc.constantFrom(null, [], {}, 'text', '', true, false, [1, 2], { model: 'constant' }, '12 V', '5e-324');

type Mutation =
  | { type: 'number'; pick: number; value: number }
  | { type: 'id'; pick: number; value: string; alsoFeeds: boolean }
  | { type: 'shape'; pick: number; value: unknown }
  | { type: 'remove'; pick: number };

const mutationArb: fc.Arbitrary<Mutation> = fc.oneof(
  { weight: 4, arbitrary: fc.record({ type: fc.constant('number' as const), pick: fc.nat(), value: hostileNumber }) },
  { weight: 4, arbitrary: fc.record({ type: fc.constant('number' as const), pick: fc.nat(), value: edgeNumber }) },
  { weight: 2, arbitrary: fc.record({ type: fc.constant('id' as const), pick: fc.nat(), value: hostileId, alsoFeeds: fc.boolean() }) },
  { weight: 2, arbitrary: fc.record({ type: fc.constant('shape' as const), pick: fc.nat(), value: hostileShape }) },
  { weight: 1, arbitrary: fc.record({ type: fc.constant('remove' as const), pick: fc.nat() }) },
);

/** Every place in the project a mutation may reach: [path], with the value there. */
function leaves(value: unknown, path: (string | number)[] = [], out: { path: (string | number)[]; value: unknown }[] = []): { path: (string | number)[]; value: unknown }[] {
  // The backup study's own settings stay as given (see the header: issue 15 point 7, another area).
  if (path.length === 1 && path[0] === 'backup') return out;
  if (path.length) out.push({ path, value });
  if (Array.isArray(value)) value.forEach((v, i) => leaves(v, [...path, i], out));
  else if (typeof value === 'object' && value !== null) for (const [k, v] of Object.entries(value)) leaves(v, [...path, k], out);
  return out;
}

function setAt(root: unknown, path: readonly (string | number)[], value: unknown, remove = false): void {
  let at = root as Record<string | number, unknown>;
  for (const key of path.slice(0, -1)) at = at[key] as Record<string | number, unknown>;
  const last = path[path.length - 1]!;
  if (remove && Array.isArray(at) && typeof last === 'number') at.splice(last, 1);
  else if (remove) delete at[last];
  else at[last] = value;
}

/** The project with the mutations applied in turn (each on the result of the last). */
function mutate(project: unknown, mutations: readonly Mutation[]): Json {
  const p = structuredClone(project) as Json;
  for (const m of mutations) {
    if (m.type === 'id') {
      const elements = p['elements'];
      if (!Array.isArray(elements) || elements.length === 0) continue;
      const e = elements[m.pick % elements.length] as Json;
      if (typeof e !== 'object' || e === null) continue;
      const old = e['id'];
      // Defined with defineProperty so that "__proto__" becomes an own key, as JSON.parse makes it.
      Object.defineProperty(e, 'id', { value: m.value, enumerable: true, writable: true, configurable: true });
      if (m.alsoFeeds) for (const x of elements as Json[]) if (x && typeof x === 'object' && x['from'] === old) x['from'] = m.value;
      continue;
    }
    const all = leaves(p);
    const candidates = m.type === 'number' ? all.filter((l) => typeof l.value === 'number') : all;
    if (!candidates.length) continue;
    const { path } = candidates[m.pick % candidates.length]!;
    if (m.type === 'remove') setAt(p, path, undefined, true);
    else setAt(p, path, structuredClone(m.value));
  }
  return p;
}

// ---------- what every outcome must be ----------

/** Ids a problem may name: each element's id, "#n" for the n-th element, and PROJECT_LEVEL. */
function namable(project: Json): Set<string> {
  const ids = new Set([PROJECT_LEVEL]);
  const elements = isRecord(project) ? project['elements'] : undefined;
  if (Array.isArray(elements)) {
    elements.forEach((e, i) => {
      ids.add(`#${i + 1}`);
      if (e && typeof e === 'object' && typeof (e as Json)['id'] === 'string') ids.add((e as Json)['id'] as string);
    });
  }
  return ids;
}

const isRecord = (v: unknown): boolean => typeof v === 'object' && v !== null && !Array.isArray(v);

/** What a problem is about: the project, the n-th element ("#n") or the element of that id. */
function subjectOf(project: Json, elementId: string): unknown {
  if (elementId === PROJECT_LEVEL) return project;
  const elements = isRecord(project) && Array.isArray(project['elements']) ? (project['elements'] as unknown[]) : [];
  const n = /^#(\d+)$/.exec(elementId);
  if (n) return elements[Number(n[1]) - 1];
  return elements.find((e) => isRecord(e) && (e as Json)['id'] === elementId);
}

const BAD_WORDS = /NaN|Infinity|undefined|\[object Object\]/;
/** Codes about one field of an element: they must name it. Others (a link that cannot carry its load, a loop) are about the element. */
const FIELD_CODES = new Set<Problem['code']>(['invalid-value', 'non-finite', 'unknown-kind', 'kind-mismatch', 'unknown-feed']);

function expectCleanRefusal(what: string, problems: readonly Problem[], project: Json): void {
  expect(problems.length, what).toBeGreaterThan(0);
  const ids = namable(project);
  for (const p of problems) {
    expect(ids.has(p.elementId), `${what}: problem names "${p.elementId}", no element of the project`).toBe(true);
    expect(typeof p.field, what).toBe('string');
    // A problem about one field names it; only an element (or project) that is not an object at all has no field to name.
    if (FIELD_CODES.has(p.code) && isRecord(subjectOf(project, p.elementId))) expect(p.field, `${what}: ${p.code} names no field (${p.message})`).not.toBe('');
    expect(p.message.length, what).toBeGreaterThan(0);
    expect(p.message, what).not.toMatch(BAD_WORDS);
  }
}

const stats = { solved: 0, refused: 0, studies: 0, slowest: 0 };

/** Solve (and the studies the project has); the outcome is clean and within the time budget. */
function checkProject(project: Json): void {
  const t0 = performance.now();
  const solved = solveProject(project);
  if (solved.ok) {
    stats.solved++;
    expect(findNonFinite(solved.result)).toEqual([]);
    expect(solved.result.totals.balanceError).toBeLessThanOrEqual(1e-9);
  } else {
    stats.refused++;
    expectCleanRefusal('solve', solved.problems, project);
  }
  if (project['backup'] !== undefined) {
    const study = onSolved(runBackupStudy, project);
    stats.studies++;
    if (study.ok) expect(findNonFinite(study.study)).toEqual([]);
    else expectCleanRefusal('backup study', study.problems, project);
  }
  if (project['pumpDuty'] !== undefined) {
    const flow = onSolved(projectPumpDuty, project);
    stats.studies++;
    if (flow.ok) expect(findNonFinite(flow.result)).toEqual([]);
    else expectCleanRefusal('pump duty study', flow.problems, project);
  }
  if (solved.ok && hasSurgeInputs(solved)) {
    const surges = onSolved(studySurges, project);
    stats.studies++;
    if (surges.ok) expect(findNonFinite(surges.result)).toEqual([]);
    else expectCleanRefusal('surge study', surges.problems, project);
  }
  const ms = performance.now() - t0;
  stats.slowest = Math.max(stats.slowest, ms);
  expect(ms, `one case took ${ms.toFixed(0)} ms`).toBeLessThanOrEqual(CASE_BUDGET_MS);
}

describe('hostile input: a clean refusal or a finite, balanced result; no throw, no hang', () => {
  afterAll(() => {
    // A figure for the closing note, not an assertion.
    console.log(`hostile input: ${stats.solved} solved, ${stats.refused} refused, ${stats.studies} studies run; slowest case ${stats.slowest.toFixed(0)} ms`);
  });
  it('the demo projects with 1–3 hostile numbers, ids or shapes', () => {
    fc.assert(
      fc.property(fc.nat({ max: DEMOS.length - 1 }), fc.array(mutationArb, { minLength: 1, maxLength: 3 }), (d, mutations) => {
        checkProject(mutate(DEMOS[d], mutations));
      }),
      { numRuns: 1000 * SCALE, seed: 15_009 + SEED, endOnFailure: true },
    );
    // Not a bound on the outcome: a sign that both outcomes were reached.
    expect(stats.refused).toBeGreaterThan(0);
  }, 120_000 * SCALE);

  it('the demo projects with one hostile number in each element field in turn (every field reached)', () => {
    for (const [d, demo] of DEMOS.entries()) {
      const numbers = leaves(demo).filter((l) => typeof l.value === 'number');
      for (const [i] of numbers.entries()) {
        for (const value of [0, -1, 5e-324, 1e-12, 1e15, 1e300, 1.7976931348623157e308]) checkProject(mutate(DEMOS[d], [{ type: 'number', pick: i, value }]));
      }
    }
  }, 120_000 * SCALE);

  it('small random trees of every kind (circuit loads too) with 1–3 hostile numbers, ids or shapes', () => {
    fc.assert(
      fc.property(fc.oneof(projectArb, projectWithNetworksArb), fc.array(mutationArb, { minLength: 1, maxLength: 3 }), (project, mutations) => {
        checkProject(mutate(project, mutations));
      }),
      { numRuns: 1500 * SCALE, seed: 15_010 + SEED, endOnFailure: true },
    );
    expect(stats.solved).toBeGreaterThan(0);
  }, 120_000 * SCALE);

  it('the whole project replaced by something else', () => {
    for (const input of [null, 0, 'text', [], {}, { format: 'joulepath-project' }, { format: 'joulepath-project', version: 2, name: 'x', elements: {} }, { format: 'joulepath-project', version: 2, name: 'x', elements: [null, 1, 'a', []] }]) {
      const solved = solveProject(input);
      expect(solved.ok).toBe(false);
      if (!solved.ok) expectCleanRefusal('solve', solved.problems, input as Json);
    }
  });
});
