/**
 * Helpers shared by the kinds' forms: paths in an element, the loss-model group, voltage, frequency and power-factor fields,
 * optional blocks, protective devices, a source's fault data and an equipment rating.
 * Part of the form descriptors; web/editor/fields.ts is their entry (today's exports, callers import it).
 */
import type { Quantity } from '../../format/parse.ts';
import { currencySymbol } from '../../format/panels.ts';
import type { ChoiceSpec, FieldSpec, FormElement, GroupSpec, NumberSpec, PointsColumn, PointsSpec, TextSpec } from './types.ts';

/** The value at a dotted path. */
export function valueAt(e: unknown, path: string): unknown {
  let at: unknown = e;
  for (const key of path.split('.')) {
    if (typeof at !== 'object' || at === null) return undefined;
    at = (at as Record<string, unknown>)[key];
  }
  return at;
}

export const obj = (v: unknown): FormElement => (typeof v === 'object' && v !== null && !Array.isArray(v) ? (v as FormElement) : {});
const num = (v: unknown): number | undefined => (typeof v === 'number' && Number.isFinite(v) ? v : undefined);
export const remove = (e: FormElement, ...keys: string[]) => keys.forEach((k) => delete e[k]);

export const name: TextSpec = { type: 'text', path: 'name', label: 'Name', required: false, help: 'What you call it on site, e.g. "Inverter to hut board".' };

/**
 * The element base's purchase price (every kind's form, last: a field few fill in): in the user's own
 * currency, the symbol their number format writes (as the energy price); the cost over the years sums it.
 */
export const purchasePrice: NumberSpec = {
  type: 'number',
  path: 'price',
  label: 'Purchase price',
  quantity: 'ratio',
  required: false,
  help: 'What it costs to buy, in your currency: the cost over the years adds it to the lifetime cost.',
  unitText: (locale) => currencySymbol(locale),
};

export const percentOf = (what: string) => `${what} (%)`;

/** Example datasheet points of a converter (common practice shape, for the user to replace). */
const EXAMPLE_POINTS = [
  { loadFraction: 0.1, efficiency: 0.9 },
  { loadFraction: 0.25, efficiency: 0.94 },
  { loadFraction: 0.5, efficiency: 0.955 },
  { loadFraction: 1, efficiency: 0.95 },
];

const efficiencyColumns: readonly PointsColumn[] = [
  { key: 'loadFraction', label: 'Load (% of rated output)', quantity: 'fraction-percent' },
  { key: 'efficiency', label: 'Efficiency (%)', quantity: 'fraction-percent' },
];

/** The next point of a table: a quarter of rated output further on, the last value repeated. */
export function nextPoint(rows: readonly Record<string, number>[], valueKey: string, fallback: number): Record<string, number> {
  const last = rows[rows.length - 1];
  const x = last?.['loadFraction'] ?? 0;
  return { loadFraction: Math.round((x + 0.25) * 100) / 100, [valueKey]: last?.[valueKey] ?? fallback };
}

function pointsSpec(path: string, label: string, minRows: number, help: string): PointsSpec {
  return {
    type: 'points',
    path,
    label,
    required: true,
    help,
    columns: efficiencyColumns,
    minRows,
    default: EXAMPLE_POINTS,
    newRow: (rows) => nextPoint(rows, 'efficiency', 0.95),
  };
}

/** The loss-model group at `path` ("loss"), shared by rectifier, DC–DC, inverter, drive, motor and converter. */
export function lossGroup(path = 'loss', what = 'output'): GroupSpec {
  const at = (e: FormElement) => obj(e[path]);
  const rated = (e: FormElement) => num(at(e)['ratedPower']);
  const idle = (e: FormElement) => num(at(e)['idleLoss']);
  const points = (e: FormElement, min: number) => {
    const p = at(e)['points'];
    return Array.isArray(p) && p.length >= min ? structuredClone(p) : structuredClone(EXAMPLE_POINTS);
  };
  const put = (e: FormElement, value: FormElement) => {
    for (const k of Object.keys(value)) if (value[k] === undefined) delete value[k];
    e[path] = value;
  };
  const ratedField = (required: boolean): NumberSpec => ({
    type: 'number',
    path: `${path}.ratedPower`,
    label: `Rated ${what} power`,
    quantity: 'power',
    required,
    default: 1000,
    help: required ? 'The power the datasheet’s load percentages refer to.' : 'Optional: sets the load fraction shown in the results.',
  });
  const idleField: NumberSpec = {
    type: 'number',
    path: `${path}.idleLoss`,
    label: 'Idle draw (no-load loss)',
    quantity: 'power',
    required: false,
    help: 'Drawn whenever it is on, even with nothing connected; it runs all night.',
  };
  return {
    type: 'group',
    key: path,
    paths: [path],
    label: 'Loss model',
    help: 'How it loses power, from the datasheet you have.',
    current: (e) => {
      const m = at(e)['model'];
      return typeof m === 'string' ? m : undefined;
    },
    variants: [
      {
        id: 'constant',
        label: 'Constant efficiency + idle draw',
        fields: [
          { type: 'number', path: `${path}.efficiency`, label: percentOf('Efficiency'), quantity: 'fraction-percent', required: true, default: 0.95 },
          idleField,
          ratedField(false),
        ],
        apply: (e) => put(e, { model: 'constant', efficiency: 0.95, idleLoss: idle(e), ratedPower: rated(e) }),
      },
      {
        id: 'curve',
        label: 'Efficiency curve from datasheet points',
        fields: [ratedField(true), pointsSpec(`${path}.points`, 'Datasheet points', 2, 'Efficiency at each load; between points it is interpolated, beyond them held.'), idleField],
        apply: (e) => put(e, { model: 'curve', ratedPower: rated(e) ?? 1000, points: points(e, 2), idleLoss: idle(e) }),
      },
      {
        id: 'polynomial',
        label: 'Loss polynomial P0 + k1·P + k2·P²',
        help: `P is the ${what} power in W; the loss is in W.`,
        fields: [
          { type: 'number', path: `${path}.p0`, label: 'P0, no-load loss', quantity: 'power', required: true, default: 5 },
          { type: 'number', path: `${path}.k1`, label: 'k1, loss per W (proportional)', quantity: 'ratio', required: true, default: 0.02 },
          { type: 'number', path: `${path}.k2`, label: 'k2, loss per W² (resistive)', quantity: 'per-watt', required: true, default: 0.00001 },
          ratedField(false),
        ],
        apply: (e) => put(e, { model: 'polynomial', p0: idle(e) ?? 5, k1: 0.02, k2: 0.00001, ratedPower: rated(e) }),
      },
      {
        id: 'polynomial-fit',
        label: 'Polynomial fitted to datasheet points',
        help: 'The three-term loss polynomial fitted by least squares; the fit quality is reported.',
        fields: [ratedField(true), pointsSpec(`${path}.points`, 'Datasheet points', 3, 'At least three points at different loads.')],
        apply: (e) => put(e, { model: 'polynomial-fit', ratedPower: rated(e) ?? 1000, points: points(e, 3) }),
      },
    ],
  };
}

export const phasesField: ChoiceSpec = {
  type: 'choice',
  path: 'phases',
  label: 'Phases',
  required: true,
  default: 1,
  options: [
    { value: 1, label: 'Single-phase' },
    { value: 3, label: 'Three-phase' },
  ],
};

export const voltage = (path: string, label: string, dflt: number, help?: string): NumberSpec => ({
  type: 'number',
  path,
  label,
  quantity: 'voltage',
  required: true,
  default: dflt,
  ...(help ? { help } : {}),
});

export const LINE_TO_LINE = 'RMS, line-to-line on three-phase.';

export const frequency = (path: string, label: string, required = true): NumberSpec => ({
  type: 'number',
  path,
  label,
  quantity: 'frequency',
  required,
  ...(required ? { default: 50 } : {}),
});

export const powerFactor = (path: string, label = 'Power factor (0–1)', required = true, dflt = 0.95): NumberSpec => ({
  type: 'number',
  path,
  label,
  quantity: 'ratio',
  required,
  ...(required ? { default: dflt } : {}),
  help: 'As on the datasheet, e.g. 0.85.',
});

export const pfSense = (path: string, label = 'Power factor sense'): ChoiceSpec => ({
  type: 'choice',
  path,
  label,
  required: false,
  help: 'Lagging: inductive (motors, most loads). Leading: capacitive.',
  options: [
    { value: 'lagging', label: 'Lagging (inductive)' },
    { value: 'leading', label: 'Leading (capacitive)' },
  ],
});

/**
 * An optional part of an element given as a whole (an inverter's surge rating, a protective device,
 * motor starting data): "not given" leaves it out; "given" fills it with example values to replace.
 */
export function optionalBlock(path: string, label: string, givenLabel: string, defaults: () => FormElement, fields: readonly FieldSpec[], help?: string): GroupSpec {
  return {
    type: 'group',
    key: path,
    paths: [path],
    label,
    ...(help ? { help } : {}),
    current: (e) => (e[path] !== undefined ? 'given' : 'none'),
    variants: [
      { id: 'none', label: 'Not given', fields: [], apply: (e) => remove(e, path) },
      { id: 'given', label: givenLabel, fields, apply: (e) => void (e[path] = defaults()) },
    ],
  };
}

/** A fuse or breaker's interrupting rating (checked against the prospective fault current). */
export const deviceBlock = (path: string, label: string, help: string): GroupSpec =>
  optionalBlock(path, label, 'Interrupting rating given', () => ({ interruptingRating: 10000 }), [
    { type: 'number', path: `${path}.interruptingRating`, label: 'Interrupting rating (breaking capacity)', quantity: 'current', required: true, default: 10000, help: 'From the device maker; the DC rating on a DC circuit.' },
  ], help);

/** Fault and dip data of a grid or generator (core/studies/surge/, IEC 60909). */
export const sourceFaultFields = (kind: 'grid' | 'generator'): FieldSpec[] => [
  {
    type: 'number',
    path: 'subtransientReactancePercent',
    label: 'Subtransient reactance X″d (%)',
    quantity: 'percent',
    required: false,
    help: kind === 'generator' ? 'On the generator rating (typical value 10–25 %: use the maker’s figure); sets the first-cycle dip when a motor starts.' : 'Of a generator; leave empty for a utility supply.',
  },
  {
    type: 'number',
    path: 'transientReactancePercent',
    label: 'Transient reactance X′d (%)',
    quantity: 'percent',
    required: false,
    help: kind === 'generator' ? 'On the generator rating (typical value 15–35 %: use the maker’s figure); when given, the dip while a motor starts uses it.' : 'Of a generator; leave empty for a utility supply.',
  },
  { type: 'number', path: 'maxDipPercent', label: 'Largest dip allowed while a motor starts (%)', quantity: 'percent', required: false, placeholder: () => 15 },
  {
    type: 'number',
    path: 'shortCircuitPower',
    label: 'Short-circuit power at the supply point',
    quantity: 'apparent-rating',
    required: false,
    help: 'S″kQ from the network operator (IEC 60909); it also sets the dip when a motor starts.',
  },
  { type: 'number', path: 'shortCircuitRToX', label: 'R/X of the supply', quantity: 'ratio', required: false, placeholder: () => 0.1, help: 'Empty: 0.1 (IEC 60909-0, 6.2).' },
  {
    type: 'choice',
    path: 'voltageTolerancePercent',
    label: 'Voltage tolerance of the LV system',
    required: false,
    help: 'IEC 60909-0 Table 1; empty: 10 %.',
    options: [
      { value: 6, label: '6 % (c max 1.05)' },
      { value: 10, label: '10 % (c max 1.10)' },
    ],
  },
];

/**
 * An equipment rating from the maker's datasheet (optional). The solve does not use it; conductor
 * sizing takes the design current of the cable next to the equipment from it.
 */
export const ratingField = (path: string, label: string, quantity: Quantity, help: string): NumberSpec => ({ type: 'number', path, label, quantity, required: false, help });
export const DESIGN_CURRENT_HELP = 'From the maker’s datasheet; sets the design current of the cable feeding it.';
