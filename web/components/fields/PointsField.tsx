/**
 * A small table of datasheet points (load and efficiency, or load and power factor): each cell is a
 * number field of its own (written on input, checked by the engine); rows are added and removed in
 * one undoable step each, never below the number the loss model needs.
 */
import { valueAt, type PointsSpec } from '../../editor/fields.ts';
import { NumberField } from './NumberField.tsx';
import { setFieldError } from '../../state/editor.ts';
import { FieldNotes, clearFieldErrors, editOwner, fieldId, useFieldMessage, type FieldOwner } from './common.tsx';

export function PointsField({ owner, spec }: { owner: FieldOwner; spec: PointsSpec }) {
  const raw = valueAt(owner.data, spec.path);
  const rows = Array.isArray(raw) ? (raw as Record<string, number>[]) : [];
  const message = useFieldMessage(owner.id, spec.path, spec);
  const id = fieldId(owner.id, spec.path);
  const atMinimum = rows.length <= spec.minRows;

  const setRows = (label: string, next: Record<string, unknown>[]) => {
    clearFieldErrors(owner.id, spec.path);
    const refused = editOwner(owner.id, label, (data) => {
      const keys = spec.path.split('.');
      let at = data;
      for (const k of keys.slice(0, -1)) at = (at[k] ??= {}) as typeof data;
      at[keys[keys.length - 1]!] = next;
    });
    // Past a limit of the project file (limits.ts): the rows stay as they were, the reason at the table.
    if (refused) setFieldError(owner.id, spec.path, refused);
  };

  return (
    <div class={message ? 'sf-field sf-points sf-field--invalid' : 'sf-field sf-points'} data-path={spec.path} data-testid={`points-${spec.path}`}>
      <table class="sf-table" aria-labelledby={`${id}-caption`}>
        <caption id={`${id}-caption`} class="sf-label">
          {spec.label}
        </caption>
        <thead>
          <tr>
            <th scope="col">#</th>
            {spec.columns.map((c) => (
              <th scope="col" key={c.key}>
                {c.label}
              </th>
            ))}
            <th scope="col">
              <span class="visually-hidden">Remove</span>
            </th>
          </tr>
        </thead>
        <tbody>
          {rows.map((_row, i) => (
            <tr key={i}>
              <th scope="row">{i + 1}</th>
              {spec.columns.map((c) => (
                <td key={c.key}>
                  <NumberField
                    owner={owner}
                    compact
                    spec={{ type: 'number', path: `${spec.path}.${i}.${c.key}`, label: `${c.label}, point ${i + 1}`, quantity: c.quantity, required: true }}
                  />
                </td>
              ))}
              <td>
                <button
                  type="button"
                  class="sf-button sf-button--quiet"
                  disabled={atMinimum}
                  title={atMinimum ? `At least ${spec.minRows} points are needed` : undefined}
                  aria-label={`Remove point ${i + 1}`}
                  onClick={() => setRows(`removed point ${i + 1} of ${spec.label.toLowerCase()}`, rows.filter((_r, j) => j !== i))}
                >
                  ✕
                </button>
              </td>
            </tr>
          ))}
        </tbody>
      </table>
      <button type="button" class="sf-button" onClick={() => setRows(`added a point to ${spec.label.toLowerCase()}`, [...rows, spec.newRow(rows)])}>
        Add a point
      </button>
      <FieldNotes helpId={`${id}-help`} help={atMinimum ? `${spec.help ?? ''} At least ${spec.minRows} points are needed.`.trim() : spec.help} messageId={`${id}-msg`} message={message} />
    </div>
  );
}
