/**
 * The engine's error map (core/solve/issue-messages.ts): schema issues that their schema does not word
 * itself get a plain message, and no bad value anywhere in an element or the project settings comes
 * back with zod's own wording ("Invalid input", "expected …, received …") or an empty message.
 * Expected messages are the engine's own wording (no outside source); the rule "a nested group must
 * be an object, a list must be a list" is the project file format of core/model/project.ts.
 */
import { describe, expect, it } from 'vitest';
import { z } from 'zod/mini';
import { KINDS, validateProject, type Problem } from '../../core/index.ts';
import { issueMessage } from '../../core/solve/issue-messages.ts';
import { backupSchema } from '../../core/solve/load-profile.ts';
import { dropLimitsSchema } from '../../core/conductors/path-drop.ts';
import { pumpDutySchema } from '../../core/kinds/pump.ts';

type Json = Record<string, unknown>;

const project = (extra: Json = {}, elements: unknown[] = []) => ({ format: 'joulepath-project', version: 2, name: 'Error map fixture', elements, ...extra });
const problems = (input: unknown): Problem[] => {
  const r = validateProject(input);
  return r.ok ? [] : r.problems;
};
const at = (input: unknown, field: string) => problems(input).find((p) => p.field === field)?.message;

const dcdc = (extra: Json = {}): Json => ({ id: 'conv', kind: 'dc-dc', from: 'bank', outputVoltage: 12, loss: { model: 'constant', efficiency: 0.92 }, ...extra });
const bank: Json = { id: 'bank', kind: 'battery', voltage: 48, internalResistance: 0.01 };

describe('messages for issues a schema does not word itself', () => {
  it('a nested group given something else: "must be an object", saying what was given', () => {
    // The engine's own wording (no source): an inverter's surge rating is a group of fields (core/model/project.ts).
    const inverter = (surge: unknown) => ({ ...dcdc(), id: 'inv', kind: 'inverter', phases: 1, outputVoltage: 230, frequency: 50, surge });
    expect(at(project({}, [bank, inverter(3)]), 'surge')).toBe('must be an object ({ … }), not the number 3');
    expect(at(project({}, [bank, inverter([])]), 'surge')).toBe('must be an object ({ … }), not a list');
    expect(at(project({}, [bank, inverter('big')]), 'surge')).toBe('must be an object ({ … }), not the text "big"');
    expect(at(project({}, [bank, inverter(null)]), 'surge')).toBe('must be an object ({ … }), not null');
    expect(at(project({ dropLimits: true }), 'dropLimits')).toBe('must be an object ({ … }), not true');
  });

  it('a list given something else: "must be a list"', () => {
    // The engine's own wording (no source): a motor power-factor curve is a list of points (core/model/project.ts).
    const motor = {
      id: 'm',
      kind: 'motor',
      from: 'src',
      ratedOutput: 5000,
      loss: { model: 'constant', efficiency: 0.9 },
      powerFactor: { model: 'curve', points: { loadFraction: 1, powerFactor: 0.85 } },
    };
    const grid = { id: 'src', kind: 'grid', phases: 3, voltage: 400, frequency: 50 };
    expect(at(project({}, [grid, motor]), 'powerFactor.points')).toBe('must be a list ([ … ]), not an object');
  });

  it('a missing required group says "is required", as before', () => {
    // The engine's own wording (no source).
    const { loss: _loss, ...noLoss } = dcdc();
    expect(at(project({}, [bank, noLoss]), 'loss')).toBe('is required');
  });

  it('fields that word their own messages keep them', () => {
    // Unchanged wording of core/kinds/spec.ts and core/kinds/starting-fields.ts (no source).
    expect(at(project({}, [bank, dcdc({ outputVoltage: 'x' })]), 'outputVoltage')).toBe('must be a number');
    expect(at(project({}, [bank, dcdc({ outputVoltage: 0 })]), 'outputVoltage')).toBe('must be greater than 0 V');
    expect(at(project({}, [bank, dcdc({ loss: { model: 'constant', efficiency: 1.2 } })]), 'loss.efficiency')).toBe(
      'efficiency must not exceed 1 (enter 0.95 for 95 %)',
    );
    expect(at(project({}, [bank, dcdc({ loss: 3 })]), 'loss')).toBe('must be one of "constant", "curve", "polynomial", "polynomial-fit"');
    expect(at(project({}, [bank, dcdc({ colour: 'red' })]), 'colour')).toBe('unknown field "colour" (check the spelling)');
  });
});

describe('issueMessage on each kind of issue', () => {
  // The engine's own wording (no source); the issues are those zod/mini raises for each check.
  const first = (schema: z.ZodMiniType, value: unknown) => {
    const r = schema.safeParse(value, { error: issueMessage });
    return r.success ? undefined : r.error.issues[0]?.message;
  };
  it.each([
    [z.number(), 'x', 'must be a number, not the text "x"'],
    [z.int(), 1.5, 'must be a whole number, not the number 1.5'],
    [z.string(), 4, 'must be text, not the number 4'],
    [z.boolean(), 'yes', 'must be true or false, not the text "yes"'],
    [z.literal('dol'), 'dot', 'must be "dol"'],
    [z.enum(['pvc', 'xlpe']), 'pe', 'must be one of "pvc", "xlpe"'],
    [z.number().check(z.gte(2)), 1, 'must be at least 2'],
    [z.number().check(z.gt(0)), 0, 'must be greater than 0'],
    [z.number().check(z.lte(100)), 101, 'must not exceed 100'],
    [z.number().check(z.lt(24)), 24, 'must be below 24'],
    [z.array(z.number()).check(z.minLength(2)), [1], 'needs at least 2 entries'],
    [z.array(z.number()).check(z.minLength(1)), [], 'needs at least 1 entry'],
    [z.array(z.number()).check(z.maxLength(8)), [1, 2, 3, 4, 5, 6, 7, 8, 9], 'must have at most 8 entries'],
    [z.string().check(z.minLength(1)), '', 'must not be empty'],
    [z.strictObject({ a: z.number() }), { a: 1, b: 2 }, 'unknown field "b" (check the spelling)'],
    [z.union([z.literal(1), z.literal(3)]), 2, 'does not match any of the accepted forms'],
    [z.number().check(z.multipleOf(5)), 7, 'must be a multiple of 5'],
    [z.number().check(z.refine((n) => n !== 13)), 13, 'is not valid'],
  ] as const)('%#: %j → %s', (schema, value, message) => {
    expect(first(schema as z.ZodMiniType, value)).toBe(message);
  });
});

describe('no zod wording reaches the user', () => {
  const BAD: unknown[] = ['x', '', -1, 0, 0.5, 1.5, 1e9, true, null, {}, [], [1], ['x'], [{}], { zz: 1 }];
  const zodWording = /Invalid input|expected \w+, received|Too (small|big)|Unrecognized key/;

  /** Top-level and one level of nested fields of an object schema (through optional wrappers and unions). */
  function fieldsOf(schema: z.core.$ZodType, depth = 0): string[][] {
    let s = schema;
    while (s instanceof z.core.$ZodOptional) s = s._zod.def.innerType;
    const shapes = s instanceof z.core.$ZodUnion ? (s._zod.def.options as z.core.$ZodType[]) : [s];
    const out: string[][] = [];
    for (const o of shapes) {
      if (!(o instanceof z.core.$ZodObject)) continue;
      for (const [key, inner] of Object.entries(o._zod.def.shape as Record<string, z.core.$ZodType>)) {
        out.push([key]);
        if (depth === 0) for (const sub of fieldsOf(inner, 1)) out.push([key, ...sub]);
      }
    }
    return out;
  }

  const setAt = (obj: Json, path: string[], value: unknown): Json => {
    const copy = structuredClone(obj);
    let o: Json = copy;
    for (const key of path.slice(0, -1)) {
      if (typeof o[key] !== 'object' || o[key] === null) o[key] = {};
      o = o[key] as Json;
    }
    o[path[path.length - 1]!] = value;
    return copy;
  };

  it.each([...KINDS.keys()])('%s: every field and sub-field set to bad values', (kind) => {
    const spec = KINDS.get(kind)!;
    const element: Json = { id: 'e', kind, ...(spec.role === 'source' ? {} : { from: 'e0' }) };
    const seen: string[] = [];
    for (const path of fieldsOf(spec.schema)) {
      if (path[0] === 'kind') continue;
      for (const bad of BAD) {
        for (const p of problems(project({}, [setAt(element, path, bad)]))) {
          expect(p.message, `${kind}.${path.join('.')} = ${JSON.stringify(bad)}`).not.toMatch(zodWording);
          expect(p.message.trim(), `${kind}.${path.join('.')} = ${JSON.stringify(bad)}`).not.toBe('');
          seen.push(p.message);
        }
      }
    }
    expect(seen.length).toBeGreaterThan(0);
  });

  it.each([
    ['backup', backupSchema],
    ['dropLimits', dropLimitsSchema],
    ['pumpDuty', pumpDutySchema],
  ] as const)('project %s: every field and sub-field set to bad values', (name, schema) => {
    let count = 0;
    for (const path of [[], ...fieldsOf(schema)]) {
      for (const bad of BAD) {
        const input = path.length === 0 ? project({ [name]: bad }) : project(setAt({ [name]: {} }, [name, ...path], bad));
        for (const p of problems(input)) {
          expect(p.message, `${name}.${path.join('.')} = ${JSON.stringify(bad)}`).not.toMatch(zodWording);
          count++;
        }
      }
    }
    expect(count).toBeGreaterThan(0);
  });
});
