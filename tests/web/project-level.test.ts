// The page tells the project from an element called "project" (web/state/editor.ts setField, the
// problem words): project-level fields are written with PROJECT_LEVEL (core/model/errors.ts).
// Behaviour checks on an invented chain: common practice (no source).
import { beforeEach, describe, expect, it } from 'vitest';
import { PROJECT_LEVEL, type Problem } from '../../core/model/errors.ts';
import { draft, draftProblems, fieldError, loadProject, setField, undo, undoLabel, type DraftProject } from '../../web/state/editor.ts';
import { problemLine } from '../../web/components/problem-words.ts';

const loss = { model: 'constant', efficiency: 0.9 };
/** bank → "project" (a DC-DC converter called "project") → lamp; a backup study on the project. */
function chain(): DraftProject {
  return {
    format: 'joulepath-project',
    version: 2,
    name: 'Relay shed',
    elements: [
      { id: 'bank', kind: 'battery', voltage: 48 },
      { id: 'project', kind: 'dc-dc', from: 'bank', outputVoltage: 12, loss, name: 'Step-down' },
      { id: 'lamp', kind: 'dc-load', from: 'project', power: 40 },
    ],
    backup: { profile: { kind: 'segments', segments: [{ durationHours: 2 }] } },
  };
}

const element = (id: string) => draft.value!.elements.find((e) => e.id === id)!;

beforeEach(() => {
  loadProject(chain(), { kind: 'new', title: 'test' });
});

describe('an element called "project" beside the project', () => {
  it('renaming the project changes the project, not the element', () => {
    const before = element('project');
    expect(setField(PROJECT_LEVEL, 'name', 'Renamed shed')).toBeNull();
    expect(draft.value!.name).toBe('Renamed shed');
    expect(element('project')).toBe(before);
    expect(element('project')['name']).toBe('Step-down');
    expect(undoLabel.value).toBe('project: Project name'); // the field by its form label (core/model/field-labels.ts)
  });

  it('a backup study setting lands on the project', () => {
    expect(setField(PROJECT_LEVEL, 'backup.designMargin', 1.2)).toBeNull();
    expect((draft.value!['backup'] as Record<string, unknown>)['designMargin']).toBe(1.2);
    expect(element('project')['backup']).toBeUndefined();
  });

  it('an edit of the element "project" lands on the element, not on the project', () => {
    expect(setField('project', 'name', 'Converter')).toBeNull();
    expect(element('project')['name']).toBe('Converter');
    expect(draft.value!.name).toBe('Relay shed');
    expect(setField('project', 'outputVoltage', 24)).toBeNull();
    expect(element('project')['outputVoltage']).toBe(24);
    expect((draft.value as Record<string, unknown>)['outputVoltage']).toBeUndefined();
    undo();
    expect(element('project')['outputVoltage']).toBe(12);
  });

  it("the element's refused value stays at the element's field; the project's at the project's", () => {
    const message = setField('project', 'outputVoltage', -12);
    expect(message).toBeTruthy();
    expect(fieldError('project', 'outputVoltage')).toBe(message);
    expect(fieldError(PROJECT_LEVEL, 'outputVoltage')).toBeUndefined();
    const margin = setField(PROJECT_LEVEL, 'backup.designMargin', 0.5);
    expect(margin).toBeTruthy();
    expect(fieldError(PROJECT_LEVEL, 'backup.designMargin')).toBe(margin);
    expect(fieldError('project', 'backup.designMargin')).toBeUndefined();
    expect(element('project')['outputVoltage']).toBe(12);
  });

  it('a problem of the element "project" in the draft names the element; one of the project names no element', () => {
    loadProject({ ...chain(), elements: chain().elements.map((e) => (e.id === 'project' ? { ...e, outputVoltage: -1 } : e)) }, { kind: 'new', title: 'test' });
    const own = draftProblems.value.filter((p) => p.field === 'outputVoltage');
    expect(own.map((p) => p.elementId)).toEqual(['project']);
    expect(problemLine(own[0]!, draft.value)).toMatch(/^Step-down \(/);
    const projectLevel: Problem = { code: 'invalid-value', elementId: PROJECT_LEVEL, field: 'name', message: 'must be text' };
    expect(problemLine(projectLevel, draft.value)).not.toMatch(/Step-down/);
  });
});
