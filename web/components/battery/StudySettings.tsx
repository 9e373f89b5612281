/**
 * The battery panel's study settings: each a labelled input in the user's units, written through the
 * engine-checked setField, and the backup or cycling design.
 */
import { StudyInput } from '../StudyInput.tsx';
import { useState } from 'preact/hooks';
import type { UnitSystem } from '../../format/units.ts';
import { inputText, inputUnit, readNumberField, type Quantity } from '../../format/parse.ts';
import { fieldError, getAt, setField, setFieldError, type DraftProject } from '../../state/editor.ts';
import { PROJECT_LEVEL } from '../../../core/page.ts';

interface FieldProps {
  project: DraftProject;
  path: string;
  label: string;
  quantity: Quantity;
  /** Shown when the field is empty (what the engine does without it). */
  hint?: string;
  units: UnitSystem;
  locale: string | undefined;
  testId: string;
}

/**
 * One study setting: a labelled input in the user's units and number format, writing the SI value
 * through the engine-checked setField; its message shows at the field and nothing is stored from it.
 */
function StudyField({ project, path, label, quantity, hint, units, locale, testId }: FieldProps) {
  const [text, setText] = useState<string | null>(null);
  const stored = getAt(project, path);
  const error = fieldError(PROJECT_LEVEL, path);
  const id = `study-${path.replace(/\W+/g, '-')}`;
  const unit = inputUnit(quantity, units).symbol;
  const commit = (value: string) => {
    setText(value);
    const read = readNumberField(value, { label, quantity, required: false }, units, locale);
    if (!read.ok) {
      setFieldError(PROJECT_LEVEL, path, read.message);
      return;
    }
    setField(PROJECT_LEVEL, path, read.value, `Backup study: ${label.toLowerCase()}`);
  };
  return (
    <StudyInput
      id={id}
      label={label}
      unit={unit}
      text={text ?? inputText(stored, quantity, units, locale)}
      placeholder={hint}
      message={error}
      onText={commit}
      onLeave={() => {
        if (!fieldError(PROJECT_LEVEL, path)) setText(null);
      }}
      testId={testId}
    />
  );
}

/** Backup or cycling design: where a lead-acid or NiCd discharge ends, and what sizes the bank. */
function DesignChoice({ project }: { project: DraftProject }) {
  const stored = getAt(project, 'backup.design');
  const value = stored === 'cycling' ? 'cycling' : 'backup';
  return (
    <div class="study-field">
      <label for="study-backup-design" class="study-field__label">
        Design
      </label>
      <select
        id="study-backup-design"
        class="study-field__input"
        value={value}
        onChange={(e) => setField(PROJECT_LEVEL, 'backup.design', (e.currentTarget as HTMLSelectElement).value, 'Backup study: design')}
        data-testid="battery-design"
      >
        <option value="backup">Backup (to the end voltage)</option>
        <option value="cycling">Cycling (depth-of-discharge limit)</option>
      </select>
    </div>
  );
}

export function StudySettings({ project, units, locale }: { project: DraftProject; units: UnitSystem; locale: string | undefined }) {
  const common = { project, units, locale };
  return (
    <fieldset class="study-settings" data-testid="battery-settings">
      <legend>Study settings</legend>
      <DesignChoice project={project} />
      <StudyField {...common} path="backup.targetRuntimeHours" label="Target runtime" quantity="time" hint="none" testId="battery-target-runtime" />
      <StudyField {...common} path="backup.designMargin" label="Design margin" quantity="ratio" hint="1.10" testId="battery-design-margin" />
      <StudyField {...common} path="backup.agingFactor" label="Aging factor" quantity="ratio" hint="1.25" testId="battery-aging-factor" />
      <StudyField {...common} path="backup.temperatureC" label="Cell temperature" quantity="temperature" hint={units === 'us' ? '77' : '25'} testId="battery-temperature" />
      <StudyField {...common} path="backup.stateOfHealth" label="State of health" quantity="fraction-percent" hint="100" testId="battery-soh" />
      <StudyField {...common} path="backup.chargerCurrent" label="Charger current" quantity="current" hint="none" testId="battery-charger" />
      <StudyField {...common} path="backup.targetRechargeHours" label="Target recharge time" quantity="time" hint="none" testId="battery-target-recharge" />
    </fieldset>
  );
}
