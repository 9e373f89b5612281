/**
 * Reserved ids (issue 15, point 5): an element may not take a name every plain JavaScript object
 * already answers to (`__proto__`, `toString`, `constructor`, `hasOwnProperty` … every own property
 * of Object.prototype: ECMAScript, "Properties of the Object Prototype Object"). Such an id is
 * refused at the element's id field; ids are otherwise looked up in Maps, so an id that is not an
 * element's names nothing.
 */
import { describe, expect, it } from 'vitest';
import { demoProjects, solveProject, validateProject, type Element, type Project } from '../../core/index.ts';
import { simulateDischarge } from '../../core/studies/backup/discharge.ts';
import { RESERVED_IDS } from '../../core/solve/structure.ts';
import { fieldWords } from '../../core/solve/finite.ts';
import { onSolved } from './solved.ts';

const chain = (loadId: string): Project => ({
  format: 'joulepath-project',
  version: 2,
  name: 'reserved ids',
  elements: [
    { id: 'grid', kind: 'grid', phases: 1, voltage: 230, frequency: 50 },
    { id: loadId, kind: 'ac-load', from: 'grid', power: 100, powerFactor: 1 },
  ],
});

// ECMAScript 2024, 20.1.3 "Properties of the Object Prototype Object" and B.2.2 (the legacy accessors).
const STANDARD = ['__proto__', '__defineGetter__', '__defineSetter__', '__lookupGetter__', '__lookupSetter__', 'constructor', 'hasOwnProperty', 'isPrototypeOf', 'propertyIsEnumerable', 'toLocaleString', 'toString', 'valueOf'];

describe('reserved ids', () => {
  it('the list holds every name of Object.prototype in this engine and in the standard', () => {
    for (const name of [...STANDARD, ...Object.getOwnPropertyNames(Object.prototype)]) expect(RESERVED_IDS.has(name), name).toBe(true);
  });

  it.each([...new Set([...STANDARD, ...Object.getOwnPropertyNames(Object.prototype)])])('an element with the id "%s" is refused at its id', (id) => {
    const out = solveProject(chain(id));
    expect(out.ok).toBe(false);
    if (out.ok) return;
    expect(out.problems.map((p) => [p.code, p.elementId, p.field])).toEqual([['invalid-value', id, 'id']]);
    expect(out.problems[0]!.message).toMatch(/reserved name .*choose another id/);
  });

  it('a feed naming "toString" names no element (the ids are looked up in a Map)', () => {
    const p = chain('lamp');
    (p.elements[1] as Element & { from: string }).from = 'toString';
    const v = validateProject(p);
    expect(v.ok).toBe(false);
    if (!v.ok) expect(v.problems.map((x) => [x.code, x.elementId, x.field])).toEqual([['unknown-feed', 'lamp', 'from']]);
  });

  it('words for a result field are looked up by own keys: "constructor" is spelled out, not the text of a function', () => {
    expect(fieldWords(['constructor', 'toString', 'pIn'])).toBe('constructor to string power in');
  });

  it('ids that only look like them are accepted: "proto", "toString2", "Constructor"', () => {
    for (const id of ['proto', 'toString2', 'Constructor']) expect(solveProject(chain(id)).ok, id).toBe(true);
  });

  it('the battery study with a load called "toString" is refused at that id, not run into a voltage collapse', () => {
    const demo = structuredClone(demoProjects.find((d) => d.id === 'hillside-relay-hut')!.project);
    // The demo's fridge (on a duty schedule, named by no segment) renamed.
    const p = JSON.parse(JSON.stringify(demo).replaceAll('"fridge"', '"toString"'));
    const out = onSolved(simulateDischarge, p);
    expect(out.ok).toBe(false);
    if (!out.ok) expect(out.problems.map((x) => [x.elementId, x.field])).toEqual([['toString', 'id']]);
  });
});
