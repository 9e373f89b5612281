/**
 * The forms of the converters and passive stages: rectifier, DC–DC, DC bus, inverter, transformer and the
 * converter of any sort.
 * Part of the form descriptors; web/editor/fields.ts is their entry (today's exports, callers import it).
 */
import { DESIGN_CURRENT_HELP, frequency, LINE_TO_LINE, lossGroup, name, optionalBlock, pfSense, phasesField, powerFactor, ratingField, voltage } from './common.ts';
import type { ChoiceOption, FormElement, KindForm } from './types.ts';

export const rectifierForm: KindForm = {
  kind: 'rectifier',
  fields: [
    name,
    voltage('outputVoltage', 'DC output voltage', 54),
    powerFactor('inputPowerFactor', 'Input power factor (0–1)', true, 0.99),
    pfSense('inputPfSense', 'Input power factor sense'),
    lossGroup(),
    ratingField('ratedOutputCurrent', 'Rated DC output current', 'current', 'From the maker’s datasheet; sets the design current of the cable its output feeds.'),
  ],
};

export const dcDcForm: KindForm = {
  kind: 'dc-dc',
  fields: [
    name,
    voltage('outputVoltage', 'Output voltage', 12),
    lossGroup(),
    ratingField('ratedOutputPower', 'Rated continuous output power', 'power-rating', DESIGN_CURRENT_HELP),
    ratingField('minInputVoltage', 'Lowest input voltage', 'voltage', 'From the maker’s datasheet (the bottom of its input range); with the rated output it sets the design current of the cable feeding it.'),
  ],
};

export const dcBusForm: KindForm = {
  kind: 'dc-bus',
  fields: [
    name,
    {
      type: 'number',
      path: 'fixedLoss',
      label: 'Fixed loss of the bus',
      quantity: 'power',
      required: true,
      default: 0,
      help: 'Monitoring, fans, contactor coils.',
    },
  ],
};

export const inverterForm: KindForm = {
  kind: 'inverter',
  fields: [
    name,
    phasesField,
    voltage('outputVoltage', 'AC output voltage', 230, LINE_TO_LINE),
    frequency('frequency', 'Output frequency'),
    lossGroup(),
    { type: 'number', path: 'lowVoltageCutoff', label: 'Low-voltage cut-off (DC input)', quantity: 'voltage', required: false, help: 'Where it shuts down; checked while a motor starts.' },
    ratingField('ratedOutputPower', 'Rated continuous output power', 'power-rating', 'From the maker’s datasheet; with the low-voltage cut-off it sets the design current of the cable feeding it.'),
    { type: 'number', path: 'passThroughLimit', label: 'Pass-through limit (inverter-charger)', quantity: 'current', required: false, help: 'An inverter-charger on a battery bus: on supply its transfer relay passes the supply straight to its loads, up to this current (from the maker’s datasheet).' },
    optionalBlock(
      'surge',
      'Surge rating',
      'Surge rating given',
      () => ({ apparentPower: 6000, durationSeconds: 5 }),
      [
        { type: 'number', path: 'surge.apparentPower', label: 'Surge apparent power', quantity: 'apparent-power', required: true, default: 6000 },
        { type: 'number', path: 'surge.durationSeconds', label: 'For how long', quantity: 'seconds', required: true, default: 5 },
      ],
      'What it can deliver for a short time: will it start a motor?',
    ),
  ],
};

export const transferSwitchForm: KindForm = {
  kind: 'transfer-switch',
  fields: [
    name,
    { type: 'number', path: 'contactResistance', label: 'Contact resistance per pole', quantity: 'resistance', required: true, default: 0.0005, help: 'I²R in each current-carrying conductor (two on DC and single-phase, three on three-phase). 0.5 mΩ is a typical value: use the maker’s figure.' },
    { type: 'number', path: 'controlPower', label: 'Control power', quantity: 'power', required: true, default: 15, help: 'Coils and control electronics, drawn all the time. 15 W is a typical value: use the maker’s figure.' },
    { type: 'number', path: 'ratedCurrent', label: 'Rated current', quantity: 'current', required: false, help: 'From the maker’s datasheet: a warning when the current through it is higher.' },
    { type: 'number', path: 'transferTime', label: 'Transfer time', quantity: 'seconds', required: false, help: 'The break the loads below it see when it transfers (0.004 s = 4 ms), unless they are on an inverter’s output side. Typical value: use the maker’s figure.' },
  ],
};

export const transformerForm: KindForm = {
  kind: 'transformer',
  fields: [
    name,
    { type: 'number', path: 'ratedApparentPower', label: 'Rating', quantity: 'apparent-rating', required: true, default: 10000 },
    voltage('primaryVoltage', 'Primary voltage', 400, LINE_TO_LINE),
    voltage('secondaryVoltage', 'Secondary voltage', 230, LINE_TO_LINE),
    { type: 'number', path: 'noLoadLoss', label: 'No-load (core) loss', quantity: 'power', required: true, default: 60 },
    { type: 'number', path: 'loadLoss', label: 'Load (copper) loss at rated current', quantity: 'power', required: true, default: 250 },
    { type: 'number', path: 'impedancePercent', label: 'Impedance (%)', quantity: 'percent', required: false, help: 'Nameplate %Z; empty: resistance only.' },
  ],
};

const electricalKinds: readonly ChoiceOption[] = [
  { value: 'dc', label: 'DC' },
  { value: 'ac1', label: 'AC single-phase' },
  { value: 'ac3', label: 'AC three-phase' },
];
const acIn = (e: FormElement) => e['inputKind'] !== 'dc';
const acOut = (e: FormElement) => e['outputKind'] !== 'dc';

export const genericForm: KindForm = {
  kind: 'generic',
  fields: [
    name,
    { type: 'choice', path: 'inputKind', label: 'Input', required: true, default: 'dc', options: electricalKinds },
    { type: 'choice', path: 'outputKind', label: 'Output', required: true, default: 'dc', options: electricalKinds },
    voltage('outputVoltage', 'Output voltage', 24, LINE_TO_LINE),
    { ...frequency('outputFrequency', 'Output frequency', false), help: 'Needed when the output is AC.', when: acOut },
    { ...powerFactor('inputPowerFactor', 'Input power factor (0–1)', false), when: acIn },
    { ...pfSense('inputPfSense', 'Input power factor sense'), when: acIn },
    lossGroup(),
  ],
};
