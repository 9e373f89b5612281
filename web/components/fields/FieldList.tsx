/**
 * Renders a list of field descriptors (web/editor/fields.ts) for one element or the project, choice
 * groups included: a group is a set of radio buttons, one per way of giving that part, followed by
 * the chosen way's own fields. Switching replaces that part with the way's defaults in one
 * undoable step.
 */
import { draftProblems } from '../../state/editor.ts';
import type { FieldSpec, GroupSpec } from '../../editor/fields.ts';
import { BooleanField } from './BooleanField.tsx';
import { ChoiceField } from './ChoiceField.tsx';
import { NetworkField } from './NetworkField.tsx';
import { NumberField } from './NumberField.tsx';
import { PointsField } from './PointsField.tsx';
import { TextField } from './TextField.tsx';
import { clearFieldErrors, editOwner, fieldId, type FieldOwner } from './common.tsx';

export function FieldList({ owner, fields }: { owner: FieldOwner; fields: readonly FieldSpec[] }) {
  return (
    <>
      {fields.map((spec) => {
        if (spec.when && !spec.when(owner.data)) return null;
        switch (spec.type) {
          case 'number':
            return <NumberField key={spec.path} owner={owner} spec={spec} />;
          case 'choice':
            return <ChoiceField key={spec.path} owner={owner} spec={spec} />;
          case 'text':
            return <TextField key={spec.path} owner={owner} spec={spec} />;
          case 'boolean':
            return <BooleanField key={spec.path} owner={owner} spec={spec} />;
          case 'points':
            return <PointsField key={spec.path} owner={owner} spec={spec} />;
          case 'network':
            return <NetworkField key={spec.path} owner={owner} spec={spec} />;
          case 'group':
            return <GroupField key={spec.key} owner={owner} spec={spec} />;
        }
      })}
    </>
  );
}

function GroupField({ owner, spec }: { owner: FieldOwner; spec: GroupSpec }) {
  const current = spec.current(owner.data);
  const chosen = spec.variants.find((v) => v.id === current);
  const name = fieldId(owner.id, `group.${spec.key}`);
  // The engine reports "give exactly one of …" problems under the group's own paths.
  const problems = draftProblems.value.filter((p) => p.elementId === owner.id && spec.paths.includes(p.field) && /exactly one|is required/.test(p.message));
  const messageId = `${name}-msg`;
  const choose = (id: string) => {
    const variant = spec.variants.find((v) => v.id === id);
    if (!variant || id === current) return;
    for (const path of spec.paths) clearFieldErrors(owner.id, path);
    editOwner(owner.id, `${spec.label}: ${variant.label}`, (data) => variant.apply(data));
  };
  return (
    <fieldset class="sf-group" data-testid={`group-${spec.key}`} aria-describedby={problems.length ? messageId : undefined}>
      <legend class="sf-legend">{spec.label}</legend>
      {spec.help && <p class="sf-help">{spec.help}</p>}
      <div class="sf-choices">
        {spec.variants.map((v) => (
          <label class={v.id === current ? 'sf-choice sf-choice--on' : 'sf-choice'} key={v.id}>
            <input type="radio" name={name} value={v.id} checked={v.id === current} onChange={() => choose(v.id)} data-testid={`variant-${spec.key}-${v.id}`} />
            <span>{v.label}</span>
          </label>
        ))}
      </div>
      {chosen?.help && <p class="sf-help">{chosen.help}</p>}
      {problems.length > 0 && (
        <p class="sf-message" id={messageId} role="alert" data-testid="field-message">
          {spec.label}: {problems.map((p) => p.message).join('; ')}
        </p>
      )}
      {chosen && chosen.fields.length > 0 && (
        <div class="sf-variant">
          <FieldList owner={owner} fields={chosen.fields} />
        </div>
      )}
    </fieldset>
  );
}
