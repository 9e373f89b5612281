/**
 * The forms of the loads: power, apparent power, current, shaft, circuit network, pump and fan.
 * Part of the form descriptors; web/editor/fields.ts is their entry (today's exports, callers import it).
 */
import { name, percentOf, pfSense, powerFactor } from './common.ts';
import type { KindForm } from './types.ts';

export const dcLoadForm: KindForm = {
  kind: 'dc-load',
  fields: [name, { type: 'number', path: 'power', label: 'Power drawn', quantity: 'power', required: true, default: 100 }],
};

export const acLoadForm: KindForm = {
  kind: 'ac-load',
  fields: [name, { type: 'number', path: 'power', label: 'Real power drawn', quantity: 'power', required: true, default: 500 }, powerFactor('powerFactor', undefined, true, 0.9), pfSense('pfSense')],
};

export const acVaLoadForm: KindForm = {
  kind: 'ac-va-load',
  fields: [
    name,
    { type: 'number', path: 'apparentPower', label: 'Apparent power drawn', quantity: 'apparent-power', required: true, default: 1000 },
    powerFactor('powerFactor', undefined, true, 0.9),
    pfSense('pfSense'),
  ],
};

/** A load given by its current keeps that current when the voltage sags (constant current). */
const CURRENT_LOAD_HELP = 'The current stays at this value when the voltage sags; the power drawn follows the voltage.';

export const dcCurrentLoadForm: KindForm = {
  kind: 'dc-current-load',
  fields: [name, { type: 'number', path: 'current', label: 'Current drawn', quantity: 'current', required: true, default: 2, help: CURRENT_LOAD_HELP }],
};

export const acCurrentLoadForm: KindForm = {
  kind: 'ac-current-load',
  fields: [
    name,
    { type: 'number', path: 'current', label: 'Line current drawn (rms)', quantity: 'current', required: true, default: 4, help: CURRENT_LOAD_HELP },
    powerFactor('powerFactor', undefined, true, 0.9),
    pfSense('pfSense'),
  ],
};

export const shaftLoadForm: KindForm = {
  kind: 'shaft-load',
  fields: [name, { type: 'number', path: 'power', label: 'Shaft power', quantity: 'shaft-power', required: true, default: 5000 }],
};

export const networkLoadForm: KindForm = {
  kind: 'network-load',
  fields: [
    name,
    {
      type: 'network',
      path: 'network',
      label: 'Circuit',
      required: true,
      default: { series: [{ resistor: '20 Ω' }, { inductor: '30 mH' }] },
      help: 'Values with SI prefixes: "4.7 mH", "220 µF", "1.2 kΩ", "10k".',
    },
    {
      type: 'choice',
      path: 'connection',
      label: 'Three-phase connection',
      required: false,
      help: 'Three-phase only: the circuit is one phase of a star (default) or one branch of a delta.',
      options: [
        { value: 'star', label: 'Star (line to star point)' },
        { value: 'delta', label: 'Delta (line to line)' },
      ],
    },
  ],
};

export const pumpForm: KindForm = {
  kind: 'pump',
  fields: [
    name,
    { type: 'number', path: 'ratedFlow', label: 'Rated flow', quantity: 'flow', required: true, default: 0.01, help: 'At the design point, full speed.' },
    { type: 'number', path: 'ratedHead', label: 'Rated head', quantity: 'head', required: true, default: 20 },
    { type: 'number', path: 'shutoffHead', label: 'Shut-off head (zero flow)', quantity: 'head', required: true, default: 26 },
    { type: 'number', path: 'efficiency', label: percentOf('Pump efficiency'), quantity: 'fraction-percent', required: true, default: 0.7 },
    { type: 'number', path: 'density', label: 'Fluid density', quantity: 'density', required: false, placeholder: () => 1000, help: 'Empty: water, 1000 kg/m³.' },
    { type: 'number', path: 'staticHead', label: 'Static head of the system', quantity: 'head', required: true, default: 5, help: 'Lift with no flow: below the rated head.' },
    { type: 'number', path: 'flow', label: 'Operating flow', quantity: 'flow', required: true, default: 0.008, help: 'Up to the rated flow.' },
    {
      type: 'choice',
      path: 'control',
      label: 'Flow control',
      required: true,
      default: 'throttle',
      options: [
        { value: 'speed', label: 'Speed (a drive upstream)' },
        { value: 'throttle', label: 'Throttle valve at full speed' },
      ],
    },
  ],
};

export const fanForm: KindForm = {
  kind: 'fan',
  fields: [
    name,
    { type: 'number', path: 'ratedFlow', label: 'Rated air flow', quantity: 'air-flow', required: true, default: 2, help: 'At the design point, full speed.' },
    { type: 'number', path: 'ratedPressure', label: 'Rated fan pressure', quantity: 'pressure', required: true, default: 1000, help: 'From the maker\'s curve at standard air, 1.2 kg/m³.' },
    { type: 'number', path: 'shutoffPressure', label: 'Shut-off pressure (zero flow)', quantity: 'pressure', required: true, default: 1300 },
    { type: 'number', path: 'efficiency', label: percentOf('Fan efficiency'), quantity: 'fraction-percent', required: true, default: 0.7 },
    {
      type: 'number',
      path: 'density',
      label: 'Air density at the fan',
      quantity: 'density',
      required: false,
      placeholder: () => 1.2,
      help: 'Empty: standard air, 1.2 kg/m³ (typical value). Pressure and power follow the density.',
    },
    { type: 'number', path: 'flow', label: 'Operating air flow', quantity: 'air-flow', required: true, default: 1.6, help: 'Up to the rated air flow. The duct system has no static pressure: its pressure rises with the square of the flow.' },
    {
      type: 'choice',
      path: 'control',
      label: 'Air flow control',
      required: true,
      default: 'damper',
      options: [
        { value: 'speed', label: 'Speed (a drive upstream)' },
        { value: 'damper', label: 'Outlet damper at full speed' },
      ],
    },
  ],
};
