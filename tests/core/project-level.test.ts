// The element id "project" is an element like any other: its problems name it, and problems of the
// project as a whole carry PROJECT_LEVEL (core/model/errors.ts), which no element id can take.
// Behaviour checks on invented chains: common practice (no source).
import { describe, expect, it } from 'vitest';
import { PROJECT_LEVEL, formatProblem, type Problem } from '../../core/model/errors.ts';
import { solveProject } from '../../core/solve/index.ts';
import { validateProject } from '../../core/solve/validate.ts';

/** bank → "project" (a DC load called "project"). */
function withProjectElement(extra: Record<string, unknown> = {}, power: unknown = 40) {
  return {
    format: 'joulepath-project',
    version: 2,
    name: 'Shed',
    elements: [
      { id: 'bank', kind: 'battery', voltage: 12 },
      { id: 'project', kind: 'dc-load', from: 'bank', power, name: 'Project lamp' },
    ],
    ...extra,
  };
}

const problemsOf = (file: unknown): Problem[] => {
  const checked = validateProject(file);
  return checked.ok ? [] : checked.problems;
};

describe('PROJECT_LEVEL', () => {
  it('is a value no element id can take (an empty id is refused, an unreadable one named by its place)', () => {
    expect(PROJECT_LEVEL).toBe('');
    const problems = problemsOf({ ...withProjectElement(), elements: [{ id: '', kind: 'battery', voltage: 12 }] });
    const idProblem = problems.find((p) => p.field === 'id');
    expect(idProblem).toMatchObject({ elementId: '#1', message: 'must not be empty' });
  });

  it('a project with an element called "project" solves, and the element keeps its id in the result', () => {
    const outcome = solveProject(withProjectElement());
    expect(outcome.ok).toBe(true);
    if (outcome.ok) expect(outcome.result.elements.map((e) => e.id)).toContain('project');
  });

  it('a field error of the element "project" lands on that element, not on the project', () => {
    const problems = problemsOf(withProjectElement({}, -5));
    expect(problems).toHaveLength(1);
    expect(problems[0]).toMatchObject({ elementId: 'project', field: 'power' });
    // Without the project the line names the element by its id and the field in words; with it, by
    // its name and the field by its form label.
    expect(formatProblem(problems[0]!)).toMatch(/^"project", power: /);
    expect(formatProblem(problems[0]!, withProjectElement({}, -5))).toMatch(/^"Project lamp", Power drawn: /);
  });

  it('a project-level setting refused (a backup study design margin below 1) lands on the project', () => {
    const backup = { profile: { kind: 'segments', segments: [{ durationHours: 1 }] }, designMargin: 0.5 };
    const problems = problemsOf(withProjectElement({ backup }));
    expect(problems.length).toBeGreaterThan(0);
    for (const p of problems) expect(p.elementId).toBe(PROJECT_LEVEL);
    expect(problems.some((p) => p.field === 'backup.designMargin')).toBe(true);
    // Users read "project" in words, never the empty id.
    expect(formatProblem(problems[0]!)).toMatch(/^Project, Design margin: /);
  });

  it('a project without a source is refused at the project, beside an element called "project"', () => {
    const file = { ...withProjectElement(), elements: [{ id: 'project', kind: 'dc-load', from: 'bank', power: 40 }] };
    const problems = problemsOf(file);
    const missing = problems.find((p) => p.code === 'missing-source');
    expect(missing?.elementId).toBe(PROJECT_LEVEL);
    // The element's own problem (its feed is missing) names the element.
    expect(problems.filter((p) => p.code === 'unknown-feed').every((p) => p.elementId === 'project')).toBe(true);
  });
});
