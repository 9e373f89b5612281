/**
 * The cable's form: conductor system and material, size choices from the engine's catalogue, installation, impedance.
 * Part of the form descriptors; web/editor/fields.ts is their entry (today's exports, callers import it).
 */
import { defaultCatalogue, type IecInstallationMethod } from '../../../core/page.ts';
import { formatConductorSize } from '../../format/units.ts';
import { deviceBlock, name, obj, remove, valueAt } from './common.ts';
import type { ChoiceOption, FieldSpec, FormContext, FormElement, KindForm } from './types.ts';

const NEC_COLUMNS: readonly ChoiceOption[] = [
  { value: 60, label: '60 °C (140 °F) column' },
  { value: 75, label: '75 °C (167 °F) column' },
  { value: 90, label: '90 °C (194 °F) column' },
];

const IEC_METHODS: readonly IecInstallationMethod[] = ['A1', 'A2', 'B1', 'B2', 'C', 'D1', 'D2', 'E', 'F', 'G'];
const IEC_METHOD_WORDS: Record<IecInstallationMethod, string> = {
  A1: 'A1 — in conduit in an insulated wall',
  A2: 'A2 — multi-core in conduit in an insulated wall',
  B1: 'B1 — in conduit on a wall',
  B2: 'B2 — multi-core in conduit on a wall',
  C: 'C — clipped direct to a wall',
  D1: 'D1 — in ducts in the ground',
  D2: 'D2 — direct in the ground',
  E: 'E — multi-core in free air',
  F: 'F — single-core touching, in free air',
  G: 'G — single-core spaced, in free air',
};

type Material = 'copper' | 'aluminium';
const materialOf = (e: FormElement): Material => (valueAt(e, 'conductor.material') === 'aluminium' ? 'aluminium' : 'copper');
const systemOf = (e: FormElement): 'nec' | 'iec' => (valueAt(e, 'conductor.system') === 'iec' ? 'iec' : 'nec');

/** Conductor sizes of the system's table for the material, "auto" first (core's catalogue). */
export function sizeOptions(e: FormElement, ctx: FormContext): ChoiceOption[] {
  const sizes = defaultCatalogue[systemOf(e)].sizes(materialOf(e));
  return [
    { value: 'auto', label: 'Auto: smallest that meets ampacity, protection and drop' },
    ...sizes.map((s) => ({ value: s.label, label: formatConductorSize(s.label, s.areaMm2, ctx.units, ctx.locale) })),
  ];
}

/** Installation methods: those without capacities carried by the engine are shown disabled, with the reason. */
export function methodOptions(e: FormElement): ChoiceOption[] {
  const insulation = valueAt(e, 'conductor.insulation') === 'xlpe' ? 'xlpe' : 'pvc';
  const carried = new Set(defaultCatalogue.iec.methods(materialOf(e), insulation));
  return IEC_METHODS.map((m) => ({
    value: m,
    label: IEC_METHOD_WORDS[m],
    ...(carried.has(m) ? {} : { disabled: `no current-carrying capacities for ${materialOf(e)} ${insulation.toUpperCase()} are carried for this method` }),
  }));
}

/** A size missing from the new material's (or system's) table goes back to "auto". */
const keepSize = (e: FormElement) => {
  const c = obj(e['conductor']);
  const size = c['size'];
  if (size === 'auto') return;
  const listed = defaultCatalogue[systemOf(e)].sizes(materialOf(e)).some((s) => s.label === size);
  if (!listed) c['size'] = 'auto';
};

const conductorCommon = (system: 'nec' | 'iec'): FieldSpec[] => [
  {
    type: 'choice',
    path: 'conductor.material',
    label: 'Conductor material',
    required: true,
    default: 'copper',
    options: [
      { value: 'copper', label: 'Copper' },
      { value: 'aluminium', label: system === 'nec' ? 'Aluminum' : 'Aluminium' },
    ],
    follow: (e) => keepSize(e),
  },
  {
    type: 'choice',
    path: 'conductor.size',
    label: system === 'nec' ? 'Size (AWG / kcmil)' : 'Size (mm²)',
    required: true,
    default: 'auto',
    options: sizeOptions,
  },
  {
    type: 'number',
    path: 'conductor.ambient',
    label: 'Ambient temperature',
    quantity: 'temperature',
    required: false,
    placeholder: () => 30,
    help: 'Around the run; the tables’ base is 30 °C (86 °F).',
  },
  {
    type: 'choice',
    path: 'conductor.designCurrentBasis',
    label: 'Design current from',
    required: false,
    help:
      system === 'nec'
        ? 'Empty: automatic. A motor: 125 % of the Table 430.250 / 430.248 full-load current (430.22, 430.24); a drive: 125 % of its rated input current (430.122(A)); an inverter or DC-DC input: its rated output at its lowest input voltage × 1.25; a charger output: 125 % of its rated current; otherwise the load at the nominal voltage (220.5(A)).'
        : 'Empty: automatic. A motor: its rated current; a drive, inverter, DC-DC converter or charger: its rating; otherwise the load at the nominal voltage (design current I_B).',
    options: [
      { value: 'auto', label: 'Automatic (by what the cable feeds)' },
      { value: 'load', label: 'The load at nominal voltage' },
      { value: 'equipment', label: 'The equipment rating (required)' },
      { value: 'given', label: 'A current I enter' },
    ],
  },
  { type: 'number', path: 'conductor.designCurrent', label: 'Design current (entered)', quantity: 'current', required: false, help: 'Only with “A current I enter”; before any 125 % factor.' },
  { type: 'boolean', path: 'conductor.continuous', label: 'Continuous load (size at 125 %)', required: false, help: 'NEC 210.19(A)(1) / 215.2(A)(1); a load on for 3 h or more.' },
  { type: 'number', path: 'conductor.maxDropPercent', label: 'Allowed voltage drop (%)', quantity: 'percent', required: false, help: 'Empty: the project’s per-link limit.' },
];

export const cableForm: KindForm = {
  kind: 'cable',
  fields: [
    name,
    { type: 'number', path: 'length', label: 'Route length (one way)', quantity: 'length', required: true, default: 10, help: 'The loop (go and return) is counted for DC and single-phase.' },
    { type: 'number', path: 'parallelSets', label: 'Sets in parallel', quantity: 'count', integer: true, required: false, placeholder: () => 1 },
    {
      type: 'group',
      key: 'cable-impedance',
      paths: ['resistancePerKm', 'reactancePerKm', 'conductor'],
      label: 'Conductor',
      current: (e) => (e['conductor'] !== undefined ? systemOf(e) : e['resistancePerKm'] !== undefined ? 'explicit' : undefined),
      variants: [
        {
          id: 'nec',
          label: 'From NEC tables',
          help: 'NEC Table 310.16 ampacity, Chapter 9 Tables 8 and 9 impedance.',
          apply: (e) => {
            remove(e, 'resistancePerKm', 'reactancePerKm');
            e['conductor'] = { system: 'nec', material: 'copper', size: 'auto', insulationRating: 75 };
          },
          fields: [
            ...conductorCommon('nec'),
            { type: 'choice', path: 'conductor.insulationRating', label: 'Insulation rating (Table 310.16 column)', required: true, default: 75, options: NEC_COLUMNS },
            {
              type: 'choice',
              path: 'conductor.terminationRating',
              label: 'Termination rating',
              required: false,
              help: 'NEC 110.14(C)(1); empty: 60 °C for circuits of 100 A or less or 14–1 AWG, 75 °C above. Choose 75 °C only for terminations listed and marked for it.',
              options: NEC_COLUMNS.map((o) => ({ ...o, label: String(o.label).replace(' column', '') })),
            },
            {
              type: 'choice',
              path: 'conductor.raceway',
              label: 'Raceway (Chapter 9 Table 9)',
              required: false,
              help: 'Empty: PVC.',
              options: [
                { value: 'pvc', label: 'PVC conduit' },
                { value: 'aluminium', label: 'Aluminum conduit' },
                { value: 'steel', label: 'Steel conduit' },
              ],
            },
            {
              type: 'number',
              path: 'conductor.currentCarryingConductors',
              label: 'Current-carrying conductors in the raceway',
              quantity: 'count',
              integer: true,
              required: false,
              help: 'With one set of this cable. Empty: 2 on DC and single-phase, 3 on three-phase; each further parallel set adds its own.',
            },
            {
              type: 'boolean',
              path: 'conductor.multioutletBranch',
              label: 'Branch circuit with several receptacles',
              required: false,
              help: 'Cord-and-plug loads on more than one receptacle: NEC 240.4(B)(1) then forbids the next higher device rating.',
            },
            {
              type: 'choice',
              path: 'conductor.motorDevice',
              label: 'Motor branch device',
              required: false,
              help: 'For a motor branch circuit: the maximum rating of NEC Table 430.52(C)(1). Empty: inverse time breaker.',
              options: [
                { value: 'inverse-time-breaker', label: 'Inverse time breaker (250 %)' },
                { value: 'time-delay-fuse', label: 'Dual-element (time-delay) fuse (175 %)' },
                { value: 'non-time-delay-fuse', label: 'Nontime-delay fuse (300 %)' },
              ],
            },
          ],
        },
        {
          id: 'iec',
          label: 'From IEC tables',
          help: 'IEC 60364-5-52 capacities, IEC 60228 resistance.',
          apply: (e) => {
            remove(e, 'resistancePerKm', 'reactancePerKm');
            e['conductor'] = { system: 'iec', material: 'copper', size: 'auto', insulation: 'pvc', installationMethod: 'C' };
          },
          fields: [
            ...conductorCommon('iec'),
            {
              type: 'choice',
              path: 'conductor.insulation',
              label: 'Insulation',
              required: true,
              default: 'pvc',
              options: [
                { value: 'pvc', label: 'PVC (70 °C)' },
                { value: 'xlpe', label: 'XLPE or EPR (90 °C)' },
              ],
            },
            { type: 'choice', path: 'conductor.installationMethod', label: 'Installation method', required: true, default: 'C', options: methodOptions },
            {
              type: 'choice',
              path: 'conductor.loadedConductors',
              label: 'Loaded conductors',
              required: false,
              help: 'Empty: 2 on DC and single-phase, 3 on three-phase.',
              options: [
                { value: 2, label: '2' },
                { value: 3, label: '3' },
              ],
            },
            { type: 'number', path: 'conductor.groupedCircuits', label: 'Circuits grouped together', quantity: 'count', integer: true, required: false, placeholder: () => 1, help: 'Each further parallel set of this cable counts as one more.' },
            {
              type: 'choice',
              path: 'conductor.deviceType',
              label: 'Overload device',
              required: false,
              help: 'IEC 60364-4-43 433.1: I_B ≤ I_n ≤ I_z and I₂ ≤ 1.45·I_z. Empty: circuit-breaker.',
              options: [
                { value: 'circuit-breaker', label: 'Circuit-breaker (IEC 60898-1)' },
                { value: 'gG-fuse', label: 'gG fuse (IEC 60269)' },
              ],
            },
          ],
        },
        {
          id: 'explicit',
          label: 'Resistance and reactance given',
          help: 'Per conductor, at its operating temperature.',
          apply: (e) => {
            remove(e, 'conductor');
            // 2.5 mm² plain copper, IEC 60228 class 2 maximum at 20 °C: 7.41 Ω/km; reactance 0.08 Ω/km
            // (IEC 60364-5-52 Annex G, λ = 0.08 mΩ/m when unknown). Examples to replace.
            e['resistancePerKm'] = 7.41;
            e['reactancePerKm'] = 0.08;
          },
          fields: [
            { type: 'number', path: 'resistancePerKm', label: 'Resistance per conductor', quantity: 'resistance-per-length', required: true, default: 7.41 },
            { type: 'number', path: 'reactancePerKm', label: 'Reactance per conductor', quantity: 'resistance-per-length', required: false, help: 'Ignored on DC.' },
          ],
        },
      ],
    },
    deviceBlock('protection', 'Fuse or breaker at the sending end', 'Its interrupting rating is checked against the prospective fault current there.'),
  ],
};
