import { describe, expect, it } from 'vitest';
import { solveProject } from '../../../core/index.ts';
import { solveProjectVariant, variantChangeOf } from '../../../core/solve/project-variant.ts';
import { validateProject } from '../../../core/solve/validate.ts';
import type { Project } from '../../../core/model/project.ts';

// A 230 V grid feeding a 2 kW resistive load through an inverter-free chain: figures by hand
// (P = V·I at unity power factor, common practice (no source)).
const base: Project = {
  format: 'joulepath-project',
  version: 2,
  name: 'Variant test',
  elements: [
    { id: 'grid', kind: 'grid', name: 'Grid', voltage: 230, frequency: 50, phases: 1, resistance: 0, reactance: 0 },
    { id: 'heater', kind: 'ac-load', name: 'Heater', from: 'grid', power: 2000, powerFactor: 1 },
    { id: 'lamp', kind: 'ac-load', name: 'Lamp', from: 'grid', power: 100, powerFactor: 1 },
  ],
} as unknown as Project;

function solvedBase() {
  const s = solveProject(base);
  if (!s.ok) throw new Error(JSON.stringify(s.problems));
  return s;
}

describe('a named variant of a project', () => {
  it('sets a field and solves: the source power follows the changed load (P = Σ loads, hand-worked)', () => {
    const out = solveProjectVariant(solvedBase(), { name: 'Bigger heater', set: { heater: { power: 3000 } } });
    expect(out.ok).toBe(true);
    if (!out.ok) return;
    expect(out.result.totals.sourcePower).toBeCloseTo(3100, 9); // 3000 + 100 W, by hand
  });
  it('removes a branch: critical loads only (hand-worked: only the 100 W lamp is left)', () => {
    const out = solveProjectVariant(solvedBase(), { name: 'Lamp only', remove: ['heater'] });
    expect(out.ok).toBe(true);
    if (out.ok) expect(out.result.totals.sourcePower).toBeCloseTo(100, 9); // common practice (no source): Σ loads
  });
  it('names a missing element instead of solving, and refuses changing the id or kind', () => {
    const missing = variantChangeOf(solvedBase(), { name: 'Old', set: { gone: { power: 1 } } });
    expect(missing.ok).toBe(false);
    if (!missing.ok) expect(missing.problems[0]!.message).toMatch(/names no element.*"Old"/);
    const kind = variantChangeOf(solvedBase(), { name: 'Kind', set: { heater: { kind: 'motor' } } });
    expect(kind.ok).toBe(false);
  });
  it('a set value the kind refuses is refused as a file holding it would be', () => {
    const out = solveProjectVariant(solvedBase(), { name: 'Negative', set: { heater: { power: -5 } } });
    expect(out.ok).toBe(false);
    if (!out.ok) expect(out.problems[0]!.elementId).toBe('heater');
  });
  it('the file keeps variants; two with one name are refused', () => {
    expect(validateProject({ ...base, variants: [{ name: 'A', set: { heater: { power: 1000 } } }] }).ok).toBe(true);
    const twice = validateProject({ ...base, variants: [{ name: 'A' }, { name: 'A' }] });
    expect(twice.ok).toBe(false);
  });
});
