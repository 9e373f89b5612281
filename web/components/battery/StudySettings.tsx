/**
 * The battery panel's study settings: every factor of the working a user might change, each a labelled
 * input in the user's units with its typical value and why in one short line under it (SettingField),
 * written through the engine-checked setField; the backup or cycling design; the standard capacities
 * to pick from. The cut-off voltage per cell is the battery element's own field (the bank's datasheet
 * value, `bank.overrides.endOfDischargeCellVoltage`), offered here too because the study turns on it.
 */
import { useState } from 'preact/hooks';
import type { UnitSystem } from '../../format/units.ts';
import { formatForInput, parseLocaleNumber, type Quantity } from '../../format/parse.ts';
import { numberFormat } from '../../format/number.ts';
import { fieldError, getAt, setField, setFieldError, type DraftProject } from '../../state/editor.ts';
import { CHEMISTRY_PRESETS, PROJECT_LEVEL, type Chemistry } from '../../../core/page.ts';
import { SettingField } from '../SettingField.tsx';
import { ChoiceField } from '../ChoiceField.tsx';
import { StudyInput } from '../StudyInput.tsx';

/** Backup or cycling design: where a lead-acid or NiCd discharge ends, and what sizes the bank. */
function DesignChoice({ project }: { project: DraftProject }) {
  const stored = getAt(project, 'backup.design');
  return (
    <ChoiceField
      path="backup.design"
      label="Design"
      value={stored === 'cycling' ? 'cycling' : 'backup'}
      options={[
        { value: 'backup', label: 'Backup (to the end voltage)' },
        { value: 'cycling', label: 'Cycling (depth-of-discharge limit)' },
      ]}
      help="Backup: a standby bank discharged to its end voltage (IEEE 485, IEEE 1115). Cycling: daily use, the depth of discharge also ends it."
      undoLabel="Backup study: design"
      testId="battery-design"
    />
  );
}

const LABEL = 'Standard capacities';

/**
 * The capacities the sizing may pick from (Ah, one string), typed as a list separated by ";" (a comma
 * is a decimal mark in many number formats). Each is read in the user's number format; the list is
 * written whole through setField, so the engine's message lands here.
 */
function StandardCapacities({ project, locale }: { project: DraftProject; locale: string | undefined }) {
  const path = 'backup.standardCapacitiesAh';
  const [text, setText] = useState<string | null>(null);
  const stored = getAt(project, path);
  const shown = Array.isArray(stored) ? stored.map((v) => (typeof v === 'number' ? formatForInput(v, locale) : '')).join('; ') : '';
  const commit = (value: string) => {
    setText(value);
    const parts = value.split(';').map((s) => s.trim()).filter((s) => s !== '');
    if (parts.length === 0) {
      setField(PROJECT_LEVEL, path, undefined, `Backup study: ${LABEL.toLowerCase()}`);
      return;
    }
    const values: number[] = [];
    for (const part of parts) {
      const parsed = parseLocaleNumber(part, locale);
      if (parsed.kind !== 'number') {
        setFieldError(PROJECT_LEVEL, path, `${LABEL}: '${part}' ${parsed.kind === 'invalid' ? parsed.problem : 'is empty'} (separate the capacities with ";")`);
        return;
      }
      values.push(parsed.value);
    }
    setField(PROJECT_LEVEL, path, values, `Backup study: ${LABEL.toLowerCase()}`);
  };
  return (
    <StudyInput
      id="study-backup-standardCapacitiesAh"
      label={LABEL}
      unit="Ah"
      text={text ?? shown}
      placeholder="any"
      help="The string capacities you can buy, separated by “;” (e.g. 100; 150; 200). Empty: any capacity in whole modules of the bank."
      message={fieldError(PROJECT_LEVEL, path)}
      onText={commit}
      onLeave={() => {
        if (!fieldError(PROJECT_LEVEL, path)) setText(null);
      }}
      testId="battery-standard-capacities"
    />
  );
}

const LEAD_ACID = new Set<Chemistry>(['flooded-lead-acid', 'vrla-agm', 'gel']);
const LITHIUM = new Set<Chemistry>(['lifepo4', 'nmc']);

export function StudySettings({ project, units, locale }: { project: DraftProject; units: UnitSystem; locale: string | undefined }) {
  const common = { project, units, locale };
  const study = (path: string, label: string, quantity: Quantity, placeholder: string | undefined, help: string, testId: string) => (
    <SettingField {...common} path={`backup.${path}`} label={label} quantity={quantity} placeholder={placeholder} help={help} undoLabel={`Backup study: ${label.toLowerCase()}`} testId={testId} />
  );
  const battery = project.elements.find((e) => e.kind === 'battery' && typeof e['bank'] === 'object' && e['bank'] !== null);
  const chemistryName = battery ? getAt(battery, 'bank.chemistry') : undefined;
  const chemistry = typeof chemistryName === 'string' && Object.hasOwn(CHEMISTRY_PRESETS, chemistryName) ? (chemistryName as Chemistry) : undefined;
  const preset = chemistry ? CHEMISTRY_PRESETS[chemistry] : undefined;
  const us = units === 'us';
  // Typical values in the user's number format, with the decimals the trade writes them with (1.10, not 1.1).
  const n = (x: number, decimals = 2) => numberFormat(locale, { minimumFractionDigits: decimals, maximumFractionDigits: decimals }).format(x);
  const agingHelp =
    chemistry && LITHIUM.has(chemistry)
      ? `Typical ${n(1.25)}: end of life at 80 % of rated capacity; typical value: use the maker’s figure. Empty: ${n(1.25)}.`
      : `Typical ${n(1.25)} (IEEE 485): the bank is replaced when it falls to 80 % of its rated capacity. Empty: ${n(1.25)}.`;
  const cutoffHelp = preset
    ? `Per cell, under load. Empty: ${formatForInput(preset.endOfDischargeCellVoltage, locale)} V, the ${preset.label} preset${chemistry && LEAD_ACID.has(chemistry) ? ` (${n(1.75)} V is the usual IEEE 485 sizing end voltage)` : ''}; typical value: use the maker’s figure, with capacities rated to the same voltage.`
    : 'Per cell, under load; typical value: use the maker’s figure.';
  return (
    <fieldset class="study-settings" data-testid="battery-settings">
      <legend>Study settings</legend>
      <DesignChoice project={project} />
      {study('targetRuntimeHours', 'Target runtime', 'time', 'none', 'How long the bank must carry the load; the bank is sized for it. Empty: no sizing.', 'battery-target-runtime')}
      {study('designMargin', 'Design margin', 'ratio', n(1.1), `Typical ${n(1.1)}–${n(1.15)} (IEEE 485): room for load growth and less-than-ideal conditions. Empty: ${n(1.1)}.`, 'battery-design-margin')}
      {study('agingFactor', 'Aging factor', 'ratio', n(1.25), agingHelp, 'battery-aging-factor')}
      {study(
        'temperatureC',
        'Cell temperature',
        'temperature',
        us ? '77' : '25',
        `The coldest the cells get in an outage; capacity is rated at ${us ? '77 °F' : '25 °C'} and falls in the cold (IEEE 485 Table 1 for lead-acid). Empty: ${us ? '77 °F' : '25 °C'}.`,
        'battery-temperature',
      )}
      {study('stateOfHealth', 'State of health', 'fraction-percent', '100', '100 % for a new bank; about 80 % near the end of its life, when banks are usually replaced. Empty: 100 %.', 'battery-soh')}
      {battery && (
        <SettingField
          {...common}
          owner={battery.id}
          path="bank.overrides.endOfDischargeCellVoltage"
          label="Cut-off cell voltage"
          quantity="voltage"
          placeholder={preset ? formatForInput(preset.endOfDischargeCellVoltage, locale) : undefined}
          help={cutoffHelp}
          testId="battery-cutoff"
        />
      )}
      {study('chargerCurrent', 'Charger current', 'current', 'none', 'The charger’s DC output; typical value: use the maker’s figure. Empty: no recharge figures.', 'battery-charger')}
      {study('chargerEfficiency', 'Charger efficiency', 'fraction-percent', '90', 'Typical 85–95 % for a switch-mode charger: use the maker’s figure. Empty: 90 %.', 'battery-charger-efficiency')}
      {study('targetRechargeHours', 'Target recharge time', 'time', 'none', 'How soon the bank must be full again; the charger for it is worked out. Empty: none.', 'battery-target-recharge')}
      <StandardCapacities project={project} locale={locale} />
    </fieldset>
  );
}
