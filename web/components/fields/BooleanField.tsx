/** A yes/no setting as a checkbox; unticked leaves an optional field out (the engine's default: no). */
import { setField } from '../../state/editor.ts';
import { valueAt, type BooleanSpec } from '../../editor/fields.ts';
import { FieldNotes, describedBy, fieldId, ownerName, useFieldMessage, type FieldOwner } from './common.tsx';

export function BooleanField({ owner, spec }: { owner: FieldOwner; spec: BooleanSpec }) {
  const checked = valueAt(owner.data, spec.path) === true;
  const message = useFieldMessage(owner.id, spec.path, spec);
  const id = fieldId(owner.id, spec.path);
  const helpId = `${id}-help`;
  const messageId = `${id}-msg`;
  const onChange = (event: Event) => {
    const on = (event.currentTarget as HTMLInputElement).checked;
    const value = on ? true : spec.required ? false : undefined;
    setField(owner.id, spec.path, value, `${ownerName(owner.id)}: ${spec.label}`);
    // A refusal: setField keeps the engine's message at the field; it is shown through messageForField.
  };
  return (
    <div class={message ? 'sf-field sf-field--check sf-field--invalid' : 'sf-field sf-field--check'} data-path={spec.path}>
      <label class="sf-check" for={id}>
        <input
          id={id}
          type="checkbox"
          checked={checked}
          aria-invalid={message ? 'true' : undefined}
          aria-describedby={describedBy(helpId, spec.help, messageId, message)}
          data-testid={`field-${spec.path}`}
          onChange={onChange}
        />
        <span>{spec.label}</span>
      </label>
      <FieldNotes helpId={helpId} help={spec.help} messageId={messageId} message={message} />
    </div>
  );
}
