// The file format's JSON Schema (schema/*.schema.json, generated from the engine's zod schemas by
// `npm run schema`): up to date, and read by a general-purpose validator (Ajv, draft-07) the way the
// engine reads the files — every demo and an export pass, broken projects fail at the field the
// engine names. `$schema` is accepted by the engine, the page's import and the command-line solver.
// The bounds checked are the table of core/kinds/ranges.ts (common practice, no source) and the
// file format's own rules (our format: no outside source).
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { spawnSync } from 'node:child_process';
import { describe, expect, it } from 'vitest';
import { PROJECT_LEVEL } from '../../core/model/errors.ts';
import { Ajv, type ValidateFunction } from 'ajv';
import { demoProjects, solveProject, validateProject } from '../../core/index.ts';
import { KINDS } from '../../core/kinds/index.ts';
import type { DraftProject } from '../../web/state/editor.ts';
import { EXPORT_SCHEMA, buildExport, exportText, parseImportText } from '../../web/storage/file-format.ts';
import { schemaFiles } from './json-schema-files.ts';

const ROOT = join(import.meta.dirname, '..', '..');
const committed = (name: string) => readFileSync(join(ROOT, 'schema', name), 'utf8');
const DEMO_FILES = ['hillside-relay-hut', 'riverside-pump-station', 'cold-store-dc-bus'];
const demoText = (id: string) => readFileSync(join(ROOT, 'core', 'demos', `${id}.json`), 'utf8');

// Strict mode: a keyword Ajv does not know, or a type the schema leaves ambiguous, fails the compile.
const ajv = new Ajv({ allErrors: true, strict: true, strictTypes: true, strictRequired: false, allowUnionTypes: true });
const projectSchema = JSON.parse(committed('joulepath-project.schema.json')) as object;
const exportSchema = JSON.parse(committed(EXPORT_SCHEMA)) as object;
const checkProject: ValidateFunction = ajv.compile(projectSchema);
const checkExport: ValidateFunction = ajv.compile(exportSchema);

const errorsOf = (fn: ValidateFunction, value: unknown) => (fn(value) ? [] : (fn.errors ?? []).map((e) => `${e.instancePath} ${e.message}`));
const clone = <T>(v: T): T => structuredClone(v);
const demo = (id: string) => JSON.parse(demoText(id)) as DraftProject;

describe('the published JSON Schema', () => {
  it('is what the engine\'s schemas generate (run `npm run schema` after changing a schema)', () => {
    for (const [name, text] of Object.entries(schemaFiles())) expect(committed(name), `schema/${name} is stale`).toBe(text);
  });

  it('describes every element kind of the registry, each by its own kind', () => {
    const defs = (projectSchema as { definitions: Record<string, { properties: { kind: { const: string } } }> }).definitions;
    for (const kind of KINDS.keys()) expect(defs[kind]?.properties.kind.const).toBe(kind);
  });

  it('accepts every demo file as it is stored (with its $schema line)', () => {
    for (const id of DEMO_FILES) {
      const project = demo(id);
      expect(project.$schema).toBe('../../schema/joulepath-project.schema.json');
      expect(errorsOf(checkProject, project), id).toEqual([]);
    }
  });

  it('accepts the export the page writes of every demo, which names the export schema', () => {
    for (const id of DEMO_FILES) {
      const text = exportText(buildExport(demo(id), { exportedAt: new Date(Date.UTC(2025, 5, 1)), appVersion: '0.1.0', projectId: 'abc-123' }));
      const file = JSON.parse(text) as { $schema: string; project: Record<string, unknown> };
      expect(file.$schema).toBe('joulepath-export.schema.json');
      expect('$schema' in file.project).toBe(false);
      expect(errorsOf(checkExport, file), id).toEqual([]);
      // The project inside is a project file in its own right.
      expect(errorsOf(checkProject, file.project), id).toEqual([]);
    }
  });

  it('refuses what the engine refuses at a single field: unknown kind, missing field, unknown field, a range, an enum', () => {
    const base = demo('hillside-relay-hut');
    const cases: [string, (p: DraftProject) => void, RegExp][] = [
      ['an unknown kind', (p) => void (p.elements[1]!.kind = 'flux-capacitor'), /\/elements\/1/],
      ['an element without its kind', (p) => void delete (p.elements[1] as Record<string, unknown>)['kind'], /\/elements\/1 must have required property 'kind'/],
      ['a load without its power', (p) => void delete p.elements[8]!['power'], /\/elements\/8/],
      ['a project without a name', (p) => void delete (p as Partial<DraftProject>).name, / must have required property 'name'/],
      ['an unknown top-level field', (p) => void (p['colour'] = 'red'), / must NOT have additional properties/],
      ['an unknown element field', (p) => void (p.elements[0]!['voltge'] = 48), /\/elements\/0/],
      // ranges.ts: a voltage is 0.1 V to 1 MV (common practice, no source).
      ['a DC-DC output of 1e300 V', (p) => void (p.elements[7]!['outputVoltage'] = 1e300), /\/elements\/7\/outputVoltage must be <= 1000000/],
      ['a wrong format', (p) => void ((p as Record<string, unknown>)['format'] = 'something-else'), /\/format must be equal to constant/],
      ['a version other than 2', (p) => void ((p as Record<string, unknown>)['version'] = 0), /\/version must be equal to constant/],
    ];
    for (const [what, spoil, where] of cases) {
      const p = clone(base);
      spoil(p);
      const errors = errorsOf(checkProject, p);
      expect(errors.length, what).toBeGreaterThan(0);
      expect(errors.join('\n'), what).toMatch(where);
      // The engine refuses it too (the schema is never looser than the engine on these).
      expect(validateProject(p).ok, what).toBe(false);
    }
  });

  it('states the plausible ranges and enums of the engine', () => {
    const defs = (projectSchema as { definitions: Record<string, { properties: Record<string, Record<string, unknown>> }> }).definitions;
    // ranges.ts: voltage 0.1 V to 1 MV; a cable length over 0 m up to 100 km (common practice, no source).
    expect(defs['battery']!.properties['voltage']).toMatchObject({ type: 'number', minimum: 0.1, maximum: 1e6 });
    expect(defs['cable']!.properties['length']).toMatchObject({ type: 'number', exclusiveMinimum: 0, maximum: 1e5 });
    const errors = (v: number) => errorsOf(checkProject, { format: 'joulepath-project', version: 2, name: 'x', elements: [{ id: 'b', kind: 'battery', voltage: v }] });
    expect(errors(0.1)).toEqual([]);
    expect(errors(0.09).join()).toMatch(/voltage must be >= 0.1/);
    expect(errors(1e6)).toEqual([]);
    expect(errors(1.01e6).join()).toMatch(/voltage must be <= 1000000/);
  });
});

describe('the circuit network of a network-load', () => {
  // Networks of our own invention; parseNetwork (core/physics/network.ts) is the engine's reading.
  const withNetwork = (network: unknown) => ({
    format: 'joulepath-project',
    version: 2,
    name: 'x',
    elements: [
      { id: 'g', kind: 'grid', phases: 1, voltage: 230, frequency: 50 },
      { id: 'n', kind: 'network-load', from: 'g', network },
    ],
  });
  const cases: [string, unknown, boolean][] = [
    ['a resistor', { resistor: 12 }, true],
    ['text with a prefix', { inductor: '40 mH' }, true],
    ['nested series and parallel', { series: [{ resistor: '12 Ω' }, { parallel: [{ inductor: '40 mH' }, { capacitor: '100 µF' }] }] }, true],
    ['two entries in one object', { resistor: 1, inductor: 1 }, false],
    ['an unknown entry', { diode: 1 }, false],
    ['an empty series', { series: [] }, false],
    ['a resistor of 0 Ω', { resistor: 0 }, false],
    ['a list instead of an entry', [{ resistor: 1 }], false],
    ['no network', undefined, false],
  ];
  it('is accepted and refused as the engine reads it', () => {
    for (const [what, network, ok] of cases) {
      const p = withNetwork(network);
      expect(errorsOf(checkProject, p).length === 0, what).toBe(ok);
      const engine = validateProject(p);
      expect(engine.ok, what).toBe(ok);
      if (!engine.ok) expect(engine.problems.every((x) => x.elementId === 'n' && x.field.startsWith('network')), what).toBe(true);
    }
  });
});

describe('$schema in a project file', () => {
  it('is accepted by the engine, left out of the validated project, and the solve is the same with or without it', () => {
    for (const { id, project } of demoProjects) {
      const checked = validateProject(project);
      expect(checked.ok, id).toBe(true);
      if (checked.ok) expect('$schema' in checked.project).toBe(false);
      const { $schema: _s, ...without } = project as unknown as Record<string, unknown>;
      expect(JSON.stringify(solveProject(project)), id).toBe(JSON.stringify(solveProject(without)));
    }
    const bad = validateProject({ ...demoProjects[0]!.project, $schema: 7 });
    expect(bad.ok).toBe(false);
    if (!bad.ok) expect(bad.problems[0]).toMatchObject({ elementId: PROJECT_LEVEL, field: '$schema' });
  });

  it('is accepted by the page\'s import, bare and on an envelope', () => {
    for (const id of DEMO_FILES) {
      const bare = parseImportText(demoText(id));
      expect(bare.ok, id).toBe(true);
      const exported = parseImportText(exportText(buildExport(demo(id), { exportedAt: new Date(Date.UTC(2025, 5, 1)), appVersion: '0.1.0' })));
      expect(exported.ok && exported.envelope, id).toBe(true);
    }
  });

  it('is accepted by the command-line solver', () => {
    const run = spawnSync(join('node_modules', '.bin', 'tsx'), ['core/cli/cli.ts', 'core/demos/hillside-relay-hut.json'], { encoding: 'utf8', cwd: ROOT });
    expect(run.stderr).toBe('');
    expect(run.status).toBe(0);
  }, 30_000); // one tsx process start: seconds on a loaded machine
});
