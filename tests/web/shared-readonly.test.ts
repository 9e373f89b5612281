// A project opened from a share link is read-only (web/state/draft.ts `commit`): field edits,
// chain operations and the project's own fields leave the draft as it was and say why; a project
// opened any other way is editable as before. Behaviour of this app: common practice (no source).
import { describe, expect, it } from 'vitest';
import { PROJECT_LEVEL } from '../../core/model/errors.ts';
import { demoProjects } from '../../core/demos/index.ts';
import { draft, draftRevision, edit, lastChange, loadProject, removeElement, setField, type DraftProject } from '../../web/state/editor.ts';

const project = demoProjects[0]!.project as unknown as DraftProject;

describe('a shared project', () => {
  it('takes no edit: fields, the project’s own fields and chain operations leave the draft as it was', () => {
    loadProject(project, { kind: 'shared', title: project.name });
    const before = draft.value;
    const revision = draftRevision.value;
    const loadId = project.elements.find((e) => e.kind.endsWith('load'))!.id;
    setField(loadId, 'name', 'Changed');
    setField(PROJECT_LEVEL, 'client', 'Someone');
    edit('rename', (p) => ({ ...p, name: 'Other' }));
    removeElement(loadId);
    expect(draft.value).toBe(before);
    expect(draftRevision.value).toBe(revision);
    expect(lastChange.value).toMatch(/read-only/);
  });

  it('a project opened from a file is editable as before', () => {
    loadProject(project, { kind: 'file', title: 'x.json', fileName: 'x.json' });
    expect(setField(PROJECT_LEVEL, 'client', 'Someone')).toBeNull();
    expect(draft.value?.['client']).toBe('Someone');
  });
});
