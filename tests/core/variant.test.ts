/**
 * Changed chains from a solved project (core/solve/variant.ts): what a study changes is checked as the
 * file's validation would check it, so no invalid element gets into a solve; what it leaves is not
 * validated again (core/solve/count.ts). Behaviour checks on an invented chain: common practice (no
 * source); the figures compared come from the engine itself.
 */
import { describe, expect, it } from 'vitest';
import { solveProject, type Solved } from '../../core/solve/index.ts';
import { solveVariant, variantProject } from '../../core/solve/variant.ts';
import { readSolveCounts, resetSolveCounts } from '../../core/solve/count.ts';
import type { Element } from '../../core/model/project.ts';
import { PROJECT_LEVEL } from '../../core/model/errors.ts';

const base = {
  format: 'joulepath-project',
  version: 2,
  name: 'variant chain',
  elements: [
    { id: 'grid', kind: 'grid', voltage: 400, frequency: 50, phases: 3 },
    { id: 'run', kind: 'cable', from: 'grid', length: 50, resistancePerKm: 1.2, reactancePerKm: 0.08 },
    { id: 'heater', kind: 'ac-load', from: 'run', power: 9000, powerFactor: 1 },
    { id: 'pump', kind: 'ac-load', from: 'run', power: 4000, powerFactor: 0.8 },
  ],
};

function solved(): Solved {
  const s = solveProject(base);
  if (!s.ok) throw new Error(JSON.stringify(s.problems));
  return s;
}

const el = (s: Solved, id: string) => s.project.elements.find((e) => e.id === id)! as Element & Record<string, unknown>;

describe('solveVariant', () => {
  it('solves a changed load without validating the project again, counted apart from the base solve', () => {
    const s = solved();
    resetSolveCounts();
    const v = solveVariant(s, { replace: [{ ...el(s, 'heater'), power: 12000 } as Element] });
    expect(v.ok).toBe(true);
    expect(readSolveCounts()).toEqual({ validations: 0, solves: 0, variantSolves: 1, variants: 1 });
    if (!v.ok) return;
    // The same chain given whole to the solve gives the same result (the variant's figures are the engine's).
    const whole = solveProject({ ...base, elements: base.elements.map((e) => (e.id === 'heater' ? { ...e, power: 12000 } : e)) });
    expect(whole.ok && whole.result).toEqual(v.result);
    // The base is untouched.
    expect(el(s, 'heater')['power']).toBe(9000);
  });

  it('refuses a changed element its kind refuses, naming the field, and solves nothing', () => {
    const s = solved();
    resetSolveCounts();
    const v = solveVariant(s, { replace: [{ ...el(s, 'run'), length: -5 } as Element] });
    expect(v.ok).toBe(false);
    if (v.ok) return;
    expect(v.problems[0]).toMatchObject({ code: 'invalid-value', elementId: 'run', field: 'length', value: -5 });
    expect(readSolveCounts().variantSolves).toBe(0);
  });

  it('refuses an added element with an id the project holds, and one fed from an element that is not there', () => {
    const s = solved();
    const dup = solveVariant(s, { add: [{ id: 'pump', kind: 'ac-load', from: 'run', power: 10, powerFactor: 1 } as Element] });
    expect(dup.ok).toBe(false);
    if (!dup.ok) expect(dup.problems.map((p) => p.code)).toContain('duplicate-id');
    const orphan = solveVariant(s, { add: [{ id: 'extra', kind: 'ac-load', from: 'nowhere', power: 10, powerFactor: 1 } as Element] });
    expect(orphan.ok).toBe(false);
    if (!orphan.ok) expect(orphan.problems.some((p) => p.elementId === 'extra' && p.field === 'from')).toBe(true);
  });

  it('refuses taking out an element whose branch stays, and a replacement of an element the project does not hold', () => {
    const s = solved();
    const cut = solveVariant(s, { remove: new Set(['run']) });
    expect(cut.ok).toBe(false);
    const ghost = solveVariant(s, { replace: [{ id: 'ghost', kind: 'ac-load', from: 'run', power: 10, powerFactor: 1 } as Element] });
    expect(ghost.ok).toBe(false);
    if (!ghost.ok) expect(ghost.problems[0]).toMatchObject({ code: 'unknown-element', elementId: 'ghost' });
  });

  it('takes out a whole branch and drops the studies that may name it', () => {
    const s = solved();
    const v = variantProject(s, { remove: new Set(['pump']), pumpDuty: null, backup: null });
    expect(v.ok).toBe(true);
    if (v.ok) expect(v.project.elements.map((e) => e.id)).toEqual(['grid', 'run', 'heater']);
  });

  it('checks new backup settings by their schema, at backup.<field>', () => {
    const s = solved();
    const v = variantProject(s, { backup: { profile: { kind: 'constant' }, horizonHours: -1 } as never });
    expect(v.ok).toBe(false);
    if (!v.ok) expect(v.problems.some((p) => p.elementId === PROJECT_LEVEL && p.field === 'backup.horizonHours')).toBe(true);
  });
});
