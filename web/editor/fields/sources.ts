/**
 * The forms of the sources: grid, generator and battery bank.
 * Part of the form descriptors; web/editor/fields.ts is their entry (today's exports, callers import it).
 */
import { CHEMISTRIES, type Chemistry, CHEMISTRY_PRESETS, type ChemistryValues } from '../../../core/page.ts';
import type { Quantity } from '../../format/parse.ts';
import { deviceBlock, frequency, LINE_TO_LINE, name, percentOf, phasesField, remove, sourceFaultFields, valueAt, voltage } from './common.ts';
import type { FormElement, KindForm, NumberSpec } from './types.ts';

export const acSource = (kind: 'grid' | 'generator'): KindForm => ({
  kind,
  fields: [
    name,
    phasesField,
    voltage('voltage', 'Open-circuit voltage', 230, LINE_TO_LINE),
    frequency('frequency', 'Frequency'),
    { type: 'number', path: 'resistance', label: 'Source resistance per phase', quantity: 'resistance', required: false, help: 'Empty: a stiff supply.' },
    { type: 'number', path: 'reactance', label: 'Source reactance per phase', quantity: 'resistance', required: false },
    {
      type: 'number',
      path: 'ratedApparentPower',
      label: kind === 'generator' ? 'Generator rating' : 'Supply rating',
      quantity: 'apparent-rating',
      required: false,
      help: 'Optional: a warning is given when the chain draws more.',
    },
    ...sourceFaultFields(kind),
  ],
});

/** Preset value of one chemistry field, for an override's placeholder. */
function presetValue(e: FormElement, key: keyof ChemistryValues): number | undefined {
  const chemistry = valueAt(e, 'bank.chemistry');
  const preset = typeof chemistry === 'string' ? CHEMISTRY_PRESETS[chemistry as Chemistry] : undefined;
  const v = preset?.[key];
  return typeof v === 'number' ? v : undefined;
}

const override = (key: keyof ChemistryValues, label: string, quantity: Quantity, help?: string): NumberSpec => ({
  type: 'number',
  path: `bank.overrides.${String(key)}`,
  label,
  quantity,
  required: false,
  placeholder: (e) => presetValue(e, key),
  help: help ?? 'Empty: the chemistry preset’s value (shown greyed), a typical value: use the maker’s figure.',
});

export const batteryForm: KindForm = {
  kind: 'battery',
  fields: [
    name,
    {
      type: 'group',
      key: 'battery',
      paths: ['voltage', 'bank'],
      label: 'Battery given as',
      current: (e) => (e['bank'] !== undefined ? 'bank' : e['voltage'] !== undefined ? 'voltage' : undefined),
      variants: [
        {
          id: 'bank',
          label: 'Cells from a chemistry preset',
          help: 'Voltage and resistance follow from the cells; the runtime study needs this.',
          apply: (e) => {
            remove(e, 'voltage');
            e['bank'] = { chemistry: 'lifepo4', series: 16, strings: 1, capacityAh: 100 };
          },
          fields: [
            {
              type: 'choice',
              path: 'bank.chemistry',
              label: 'Chemistry',
              required: true,
              default: 'lifepo4',
              help: 'Fills the values below that you leave empty.',
              options: CHEMISTRIES.map((c) => ({ value: c, label: CHEMISTRY_PRESETS[c].label })),
            },
            { type: 'number', path: 'bank.series', label: 'Cells (or blocks) in series', quantity: 'count', integer: true, required: true, default: 16 },
            { type: 'number', path: 'bank.strings', label: 'Strings in parallel', quantity: 'count', integer: true, required: false, placeholder: () => 1 },
            {
              type: 'number',
              path: 'bank.cellsPerBlock',
              label: 'Cells per block',
              quantity: 'count',
              integer: true,
              required: false,
              placeholder: () => 1,
              help: '6 for a 12 V lead-acid block; empty for single cells.',
            },
            { type: 'number', path: 'bank.capacityAh', label: 'Capacity of one string', quantity: 'capacity', required: true, default: 100, help: 'At the chemistry’s rated hours (e.g. C20).' },
            { type: 'number', path: 'bank.initialSoc', label: percentOf('State of charge at the start'), quantity: 'fraction-percent', required: false, placeholder: () => 1 },
            override('nominalCellVoltage', 'Nominal cell voltage', 'voltage'),
            override(
              'endOfDischargeCellVoltage',
              'Cut-off cell voltage',
              'voltage',
              'End-of-discharge voltage per cell under load; a backup design discharges to it. Empty: the preset’s (lead-acid 1.75 V), a typical value: use the maker’s figure.',
            ),
            override('usableDepthOfDischarge', percentOf('Usable depth of discharge'), 'fraction-percent'),
            override('peukertExponent', 'Peukert exponent', 'ratio', 'Empty: the preset’s, a typical value: use the maker’s figure; 1 = no rate effect.'),
            override('internalResistanceOhmAh', 'Cell resistance × capacity', 'ohm-ah'),
            override('roundTripEfficiency', percentOf('Round-trip efficiency'), 'fraction-percent'),
            override('ratedHours', 'Capacity rated at (hours)', 'time'),
            override('chargeCellVoltage', 'Charge (absorption) cell voltage', 'voltage'),
            override('floatCellVoltage', 'Float cell voltage', 'voltage'),
            override('maxChargeCRate', 'Maximum charge rate', 'c-rate'),
            override('maxDischargeCRate', 'Maximum discharge rate', 'c-rate'),
            override('minChargeTemperatureC', 'Lowest charging temperature', 'temperature'),
          ],
        },
        {
          id: 'voltage',
          label: 'Fixed voltage',
          help: 'A stiff DC source; no runtime study.',
          apply: (e) => {
            remove(e, 'bank');
            e['voltage'] = 48;
          },
          fields: [voltage('voltage', 'Open-circuit voltage', 48)],
        },
      ],
    },
    {
      type: 'number',
      path: 'internalResistance',
      label: 'Internal resistance of the bank',
      quantity: 'resistance',
      required: false,
      help: 'Empty: from the cells (or 0, a stiff source, for a fixed voltage).',
    },
    deviceBlock('bankFuse', 'Fuse or breaker at the bank', 'Checked against the bank’s prospective short-circuit current; lithium banks can give many kA.'),
  ],
};
