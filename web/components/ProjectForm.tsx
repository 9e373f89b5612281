/**
 * The project's own settings: name, description and the voltage-drop limits the whole-path check
 * flags against. Written with setField(PROJECT_LEVEL, path, value), checked by the engine like any field.
 */
import './StageForm.css';
import { draft } from '../state/editor.ts';
import { PROJECT_LEVEL } from '../../core/page.ts';
import { PROJECT_FIELDS, type FormElement } from '../editor/fields.ts';
import { FieldList } from './fields/FieldList.tsx';

export function ProjectForm() {
  const project = draft.value;
  if (!project) return null;
  return (
    <form class="sform sform--project" aria-labelledby="sf-project-heading" data-testid="project-form" onSubmit={(e) => e.preventDefault()} noValidate>
      <h3 id="sf-project-heading" class="sform__title">
        Project settings
      </h3>
      <FieldList owner={{ id: PROJECT_LEVEL, data: project as FormElement }} fields={PROJECT_FIELDS} />
    </form>
  );
}
