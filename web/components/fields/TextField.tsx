/** Free text (a name, a description). An empty optional field is left out of the project. */
import { setField } from '../../state/editor.ts';
import { valueAt, type TextSpec } from '../../editor/fields.ts';
import { FieldNotes, FieldRow, describedBy, fieldId, ownerName, useFieldMessage, type FieldOwner } from './common.tsx';

export function TextField({ owner, spec }: { owner: FieldOwner; spec: TextSpec }) {
  const stored = valueAt(owner.data, spec.path);
  const text = typeof stored === 'string' ? stored : '';
  const message = useFieldMessage(owner.id, spec.path, spec);
  const id = fieldId(owner.id, spec.path);
  const helpId = `${id}-help`;
  const messageId = `${id}-msg`;
  const onInput = (event: Event) => {
    const value = (event.currentTarget as HTMLInputElement | HTMLTextAreaElement).value;
    setField(owner.id, spec.path, value === '' && !spec.required ? undefined : value, `${ownerName(owner.id)}: ${spec.label}`);
    // A refusal: setField keeps the engine's message at the field; it is shown through messageForField.
  };
  const common = {
    id,
    value: text,
    'aria-invalid': message ? ('true' as const) : undefined,
    'aria-describedby': describedBy(helpId, spec.help, messageId, message),
    'data-testid': `field-${spec.path}`,
    onInput,
  };
  return (
    <FieldRow invalid={message !== undefined} path={spec.path}>
      <label class="sf-label" for={id}>
        {spec.label}
        {!spec.required && <span class="sf-optional"> (optional)</span>}
      </label>
      {spec.multiline ? <textarea class="sf-textarea" rows={3} {...common} /> : <input class="sf-input sf-input--text" type="text" autoComplete="off" {...common} />}
      <FieldNotes helpId={helpId} help={spec.help} messageId={messageId} message={message} />
    </FieldRow>
  );
}
