/**
 * Counterexamples the hostile-input property (tests/properties/hostile.test.ts) found, kept as tests.
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { solveProject } from '../../core/solve/index.ts';
import { findNonFinite } from '../../core/solve/finite.ts';
import { studySurges } from '../../core/studies/surge/index.ts';
import { runBackupStudy } from '../../core/studies/backup/study.ts';
import { onSolved } from './solved.ts';

type Json = Record<string, unknown>;
const project = (elements: unknown[]) => ({ format: 'joulepath-project', version: 2, name: 'hostile', elements });

describe('hostile-input counterexamples', () => {
  it('a load that takes the id of the element feeding others is refused as a duplicate id, not a TypeError in the plan', () => {
    // Shrunk from the property: the second "src" is a load; the plan used to hang the source's
    // children under it as well and build a stage fed by a load's missing port.
    const p = project([
      { id: 'src', kind: 'grid', phases: 3, voltage: 400, frequency: 50 },
      { id: 'conv', kind: 'generic', from: 'src', inputKind: 'ac3', outputKind: 'ac3', outputVoltage: 400, outputFrequency: 50, loss: { model: 'constant', efficiency: 0.95 } },
      { id: 'src', kind: 'ac-load', from: 'conv', power: 100, powerFactor: 0.9 },
    ]);
    const o = solveProject(p);
    expect(o.ok).toBe(false);
    if (!o.ok) expect(o.problems.map((x) => x.code)).toContain('duplicate-id');
  });

  it('a stage that takes the id of its own ancestor is refused, not walked without end', () => {
    const p = project([
      { id: 'src', kind: 'grid', phases: 1, voltage: 230, frequency: 50 },
      { id: 'run', kind: 'cable', from: 'src', length: 10, resistancePerKm: 1 },
      { id: 'src', kind: 'cable', from: 'run', length: 10, resistancePerKm: 1 },
      { id: 'load', kind: 'ac-load', from: 'src', power: 100, powerFactor: 1 },
    ]);
    const o = solveProject(p);
    expect(o.ok).toBe(false);
    if (!o.ok) expect(o.problems.map((x) => x.code)).toContain('duplicate-id');
  });

  it('an element with no kind says the kind is required (never "unknown kind undefined")', () => {
    const o = solveProject(project([{ id: 'src', kind: 'grid', phases: 1, voltage: 230, frequency: 50 }, { id: 'x', from: 'src', power: 5 }]));
    expect(o.ok).toBe(false);
    if (!o.ok) {
      const p = o.problems.find((x) => x.elementId === 'x')!;
      expect(p).toMatchObject({ code: 'unknown-kind', field: 'kind' });
      expect(p.message).toMatch(/^is required: one of grid, generator, battery/);
      expect(p.message).not.toMatch(/undefined/);
    }
    const o2 = solveProject(project([{ id: 'src', kind: 'grid', phases: 1, voltage: 230, frequency: 50 }, { id: 'x', kind: 7, from: 'src' }]));
    if (!o2.ok) expect(o2.problems.find((x) => x.elementId === 'x')!.message).toMatch(/^unknown kind: the number 7; expected one of/);
  });

  it('a motor power-factor point of 5e-324 is refused at that point (the surge study gave a NaN full-load current)', () => {
    const demo = JSON.parse(readFileSync('core/demos/riverside-pump-station.json', 'utf8')) as Json;
    const motor = (demo['elements'] as Json[]).find((e) => e['id'] === 'motor')!;
    (motor['powerFactor'] as { points: { powerFactor: number }[] }).points[3]!.powerFactor = 5e-324;
    const o = solveProject(demo);
    expect(o.ok).toBe(false);
    // 0.001: the range table's smallest power factor (core/kinds/ranges.ts; common practice, no source).
    if (!o.ok) expect(o.problems).toMatchObject([{ elementId: 'motor', field: 'powerFactor.points.3.powerFactor', message: expect.stringContaining('must be at least 0.001') }]);
    (motor['powerFactor'] as { points: { powerFactor: number }[] }).points[3]!.powerFactor = 0.001;
    const surges = onSolved(studySurges, demo);
    if (surges.ok) expect(findNonFinite(surges.result)).toEqual([]);
  });

  it('a charge rate of 5e-324 C is refused at its field (the recharge refusal printed "Infinity h")', () => {
    const demo = JSON.parse(readFileSync('core/demos/hillside-relay-hut.json', 'utf8')) as Json;
    const bank = (demo['elements'] as Json[]).find((e) => e['kind'] === 'battery')!['bank'] as Json;
    bank['overrides'] = { maxChargeCRate: 5e-324 };
    const o = onSolved(runBackupStudy, demo);
    expect(o.ok).toBe(false);
    // C/1000: the range table's slowest rate (core/kinds/ranges.ts; common practice, no source).
    if (!o.ok) expect(o.problems).toMatchObject([{ elementId: 'bank', field: 'bank.overrides.maxChargeCRate', message: expect.stringContaining('must be at least 0.001 per hour') }]);
  });

  it('a rated discharge time of 5e-324 h is refused at its field (the backup study gave an infinite rated current)', () => {
    const demo = JSON.parse(readFileSync('core/demos/hillside-relay-hut.json', 'utf8')) as Json;
    const bank = (demo['elements'] as Json[]).find((e) => e['kind'] === 'battery')!['bank'] as Json;
    bank['overrides'] = { ratedHours: 5e-324 };
    const o = onSolved(runBackupStudy, demo);
    expect(o.ok).toBe(false);
    if (!o.ok) expect(o.problems).toMatchObject([{ elementId: 'bank', field: 'bank.overrides.ratedHours', message: expect.stringContaining('must be at least 0.01 h') }]);
  });
});

describe('reserved ids (issue 15, point 5, on the engine side)', () => {
  // Object.prototype's own keys (ECMAScript 2024, 20.1.3) and "__proto__": a plain-object lookup finds them on every object.
  for (const id of ['__proto__', 'toString', 'constructor', 'hasOwnProperty', 'valueOf']) {
    it(`a load with the id "${id}" is refused at its id (the backup study reported a voltage collapse at the bank)`, () => {
      const text = readFileSync('core/demos/hillside-relay-hut.json', 'utf8').replaceAll('"fridge"', JSON.stringify(id));
      const demo = JSON.parse(text) as Json;
      const solved = solveProject(demo);
      expect(solved.ok).toBe(false);
      if (!solved.ok) expect(solved.problems).toMatchObject([{ elementId: id, field: 'id', message: expect.stringContaining('reserved name') }]);
      const study = onSolved(runBackupStudy, demo);
      expect(study.ok).toBe(false);
      if (!study.ok) expect(study.problems.map((p) => [p.elementId, p.field])).toContainEqual([id, 'id']);
    });
  }
  it('an ordinary id that merely contains such a word is accepted', () => {
    const text = readFileSync('core/demos/hillside-relay-hut.json', 'utf8').replaceAll('"fridge"', '"constructor-fridge"');
    expect(solveProject(JSON.parse(text)).ok).toBe(true);
  });
});
