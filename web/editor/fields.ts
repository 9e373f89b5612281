/**
 * What the stage form shows for each element kind: its fields (path, label in the trade's words,
 * physical quantity, required or optional, choices, one line of help) and the choice groups where
 * one of several ways of describing the element is picked (loss model, drive losses, motor
 * efficiency source, cable impedance, battery description).
 *
 * Plain data and small pure functions only: the form components (web/components/fields/) render
 * it, the engine (core/) checks every value written. Defaults are planning examples the user is
 * expected to replace; none of them is a computed engineering figure.
 */
import { CHEMISTRIES, type Chemistry, CHEMISTRY_PRESETS, type ChemistryValues, CODE_LETTERS, defaultCatalogue, type DropLimits, type ElementKind, type IecInstallationMethod, KINDS, MOTOR_CLASSES, resolveLimits } from '../../core/page.ts';
import type { Quantity } from '../format/parse.ts';
import { formatConductorSize, type UnitSystem } from '../format/units.ts';

/** An element as the form sees it: plain data, not yet validated. */
export type FormElement = Record<string, unknown>;

/** Display context some choice lists depend on (conductor sizes show the other system's area). */
export interface FormContext {
  units: UnitSystem;
  locale?: string;
}

export interface ChoiceOption {
  value: string | number;
  label: string;
  /** Why the option cannot be chosen; the option is then shown disabled with this reason. */
  disabled?: string;
}

interface FieldBase {
  /** Dotted path inside the element ("loss.efficiency", "conductor.size"). */
  path: string;
  label: string;
  /** One line shown under the field. */
  help?: string;
  required: boolean;
  /** Shown only when this holds (e.g. the output frequency of a converter with an AC output). */
  when?: (e: FormElement) => boolean;
}

export interface NumberSpec extends FieldBase {
  type: 'number';
  quantity: Quantity;
  integer?: boolean;
  /** SI value a new element starts with. */
  default?: number;
  /** SI value that applies when the field is left empty (shown as the input's placeholder). */
  placeholder?: (e: FormElement) => number | undefined;
}

export interface ChoiceSpec extends FieldBase {
  type: 'choice';
  options: readonly ChoiceOption[] | ((e: FormElement, ctx: FormContext) => readonly ChoiceOption[]);
  default?: string | number;
  /**
   * Other fields that must follow this choice (a conductor size missing from the new material's
   * table goes back to "auto"). Runs on a copy of the element, inside one undoable edit.
   */
  follow?: (e: FormElement, value: string | number | undefined) => void;
}

export interface TextSpec extends FieldBase {
  type: 'text';
  multiline?: boolean;
  default?: string;
}

export interface BooleanSpec extends FieldBase {
  type: 'boolean';
  default?: boolean;
}

export interface PointsColumn {
  key: string;
  label: string;
  quantity: Quantity;
}

/** A small table of datasheet points (load fraction and efficiency or power factor). */
export interface PointsSpec extends FieldBase {
  type: 'points';
  columns: readonly PointsColumn[];
  minRows: number;
  default: readonly Record<string, number>[];
  /** The row added by "Add a point", from the rows there are. */
  newRow(rows: readonly Record<string, number>[]): Record<string, number>;
}

/** A circuit network of R, L, C parts (core/physics/network.ts), values as text with SI prefixes. */
export interface NetworkSpec extends FieldBase {
  type: 'network';
  default: unknown;
}

export interface Variant {
  id: string;
  label: string;
  help?: string;
  fields: readonly FieldSpec[];
  /** Replace the group's part of the element with this variant's defaults (mutates a copy). */
  apply(e: FormElement): void;
}

/** One of several ways of giving part of an element. */
export interface GroupSpec {
  type: 'group';
  /** Stable key (used for ids and to match the engine's problems). */
  key: string;
  /** Paths the engine reports this group's "give exactly one of" problems under. */
  paths: readonly string[];
  label: string;
  help?: string;
  variants: readonly Variant[];
  /** The variant the element uses now (undefined when it uses none, e.g. a damaged file). */
  current(e: FormElement): string | undefined;
  when?: (e: FormElement) => boolean;
}

export type FieldSpec = NumberSpec | ChoiceSpec | TextSpec | BooleanSpec | PointsSpec | NetworkSpec | GroupSpec;

export interface KindForm {
  kind: ElementKind;
  fields: readonly FieldSpec[];
}

// ---------- small helpers ----------

/** The value at a dotted path. */
export function valueAt(e: unknown, path: string): unknown {
  let at: unknown = e;
  for (const key of path.split('.')) {
    if (typeof at !== 'object' || at === null) return undefined;
    at = (at as Record<string, unknown>)[key];
  }
  return at;
}

const obj = (v: unknown): FormElement => (typeof v === 'object' && v !== null && !Array.isArray(v) ? (v as FormElement) : {});
const num = (v: unknown): number | undefined => (typeof v === 'number' && Number.isFinite(v) ? v : undefined);
const remove = (e: FormElement, ...keys: string[]) => keys.forEach((k) => delete e[k]);

const name: TextSpec = { type: 'text', path: 'name', label: 'Name', required: false, help: 'What you call it on site, e.g. "Inverter to hut board".' };

const percentOf = (what: string) => `${what} (%)`;

// ---------- loss models ----------

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
function nextPoint(rows: readonly Record<string, number>[], valueKey: string, fallback: number): Record<string, number> {
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
function lossGroup(path = 'loss', what = 'output'): GroupSpec {
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

// ---------- common fields ----------

const phasesField: ChoiceSpec = {
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

const voltage = (path: string, label: string, dflt: number, help?: string): NumberSpec => ({
  type: 'number',
  path,
  label,
  quantity: 'voltage',
  required: true,
  default: dflt,
  ...(help ? { help } : {}),
});

const LINE_TO_LINE = 'RMS, line-to-line on three-phase.';

const frequency = (path: string, label: string, required = true): NumberSpec => ({
  type: 'number',
  path,
  label,
  quantity: 'frequency',
  required,
  ...(required ? { default: 50 } : {}),
});

const powerFactor = (path: string, label = 'Power factor (0–1)', required = true, dflt = 0.95): NumberSpec => ({
  type: 'number',
  path,
  label,
  quantity: 'ratio',
  required,
  ...(required ? { default: dflt } : {}),
  help: 'As on the datasheet, e.g. 0.85.',
});

const pfSense = (path: string, label = 'Power factor sense'): ChoiceSpec => ({
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
function optionalBlock(path: string, label: string, givenLabel: string, defaults: () => FormElement, fields: readonly FieldSpec[], help?: string): GroupSpec {
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
const deviceBlock = (path: string, label: string, help: string): GroupSpec =>
  optionalBlock(path, label, 'Interrupting rating given', () => ({ interruptingRating: 10000 }), [
    { type: 'number', path: `${path}.interruptingRating`, label: 'Interrupting rating (breaking capacity)', quantity: 'current', required: true, default: 10000, help: 'From the device maker; the DC rating on a DC circuit.' },
  ], help);

/** Fault and dip data of a grid or generator (core/studies/surge/, IEC 60909). */
const sourceFaultFields = (kind: 'grid' | 'generator'): FieldSpec[] => [
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

// ---------- sources ----------

const acSource = (kind: 'grid' | 'generator'): KindForm => ({
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

const batteryForm: KindForm = {
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

// ---------- stages ----------

/**
 * An equipment rating from the maker's datasheet (optional). The solve does not use it; conductor
 * sizing takes the design current of the cable next to the equipment from it.
 */
const ratingField = (path: string, label: string, quantity: Quantity, help: string): NumberSpec => ({ type: 'number', path, label, quantity, required: false, help });
const DESIGN_CURRENT_HELP = 'From the maker’s datasheet; sets the design current of the cable feeding it.';

const rectifierForm: KindForm = {
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

const dcdcForm: KindForm = {
  kind: 'dc-dc',
  fields: [
    name,
    voltage('outputVoltage', 'Output voltage', 12),
    lossGroup(),
    ratingField('ratedOutputPower', 'Rated continuous output power', 'power-rating', DESIGN_CURRENT_HELP),
    ratingField('minInputVoltage', 'Lowest input voltage', 'voltage', 'From the maker’s datasheet (the bottom of its input range); with the rated output it sets the design current of the cable feeding it.'),
  ],
};

const dcbusForm: KindForm = {
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

const inverterForm: KindForm = {
  kind: 'inverter',
  fields: [
    name,
    phasesField,
    voltage('outputVoltage', 'AC output voltage', 230, LINE_TO_LINE),
    frequency('frequency', 'Output frequency'),
    lossGroup(),
    { type: 'number', path: 'lowVoltageCutoff', label: 'Low-voltage cut-off (DC input)', quantity: 'voltage', required: false, help: 'Where it shuts down; checked while a motor starts.' },
    ratingField('ratedOutputPower', 'Rated continuous output power', 'power-rating', 'From the maker’s datasheet; with the low-voltage cut-off it sets the design current of the cable feeding it.'),
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

const transformerForm: KindForm = {
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

/** Losses of an IEC 61800-9-2 IE2 reference drive at the eight points, % of rated VA (core/data/iec-61800-9-2.ts). */
const IE2_POINT_LABELS = [
  '0 % speed, 25 % torque',
  '0 % speed, 50 % torque',
  '0 % speed, 100 % torque',
  '50 % speed, 25 % torque',
  '50 % speed, 50 % torque',
  '50 % speed, 100 % torque',
  '90 or 100 % speed, 50 % torque',
  '90 or 100 % speed, 100 % torque',
];

const driveForm: KindForm = {
  kind: 'drive',
  fields: [
    name,
    voltage('outputVoltage', 'Output voltage', 400, 'RMS line-to-line at the output frequency.'),
    { type: 'number', path: 'outputFrequency', label: 'Output frequency', quantity: 'frequency', required: true, default: 50, help: 'Sets the motor speed.' },
    powerFactor('inputPowerFactor', 'Input displacement power factor (0–1)', true, 0.95),
    { type: 'number', path: 'currentThd', label: percentOf('Input current THD'), quantity: 'fraction-percent', required: false, help: 'True power factor = displacement ÷ √(1 + THD²).' },
    frequency('motorRatedFrequency', 'Motor rated frequency', false),
    {
      type: 'number',
      path: 'singlePhaseRating',
      label: 'Output rating on a single-phase supply',
      quantity: 'apparent-power',
      required: false,
      help: 'The maker’s derated figure when a three-phase drive is fed single-phase.',
    },
    ratingField('ratedInputCurrent', 'Rated input current', 'current', DESIGN_CURRENT_HELP),
    {
      type: 'group',
      key: 'drive-loss',
      paths: ['loss', 'standardLoss'],
      label: 'Drive losses',
      current: (e) => (e['standardLoss'] !== undefined ? 'standard' : e['loss'] !== undefined ? 'converter' : undefined),
      variants: [
        {
          id: 'converter',
          label: 'Converter loss model',
          apply: (e) => {
            remove(e, 'standardLoss');
            e['loss'] = { model: 'constant', efficiency: 0.97 };
          },
          fields: [lossGroup('loss')],
        },
        {
          id: 'standard',
          label: 'IEC 61800-9-2 operating points',
          help: 'Losses at the standard’s eight speed/torque points, interpolated.',
          apply: (e) => {
            remove(e, 'loss');
            e['standardLoss'] = { ratedApparentPower: 10000, basis: 'cdm' };
          },
          fields: [
            { type: 'number', path: 'standardLoss.ratedApparentPower', label: 'Drive rating', quantity: 'apparent-rating', required: true, default: 10000 },
            {
              type: 'choice',
              path: 'standardLoss.basis',
              label: 'Points are for',
              required: true,
              default: 'cdm',
              options: [
                { value: 'cdm', label: 'Drive module alone (CDM)' },
                { value: 'pds', label: 'Drive with motor (PDS)' },
              ],
            },
            {
              type: 'group',
              key: 'drive-points',
              paths: ['standardLoss.points'],
              label: 'Losses at the points',
              current: (e) => (Array.isArray(valueAt(e, 'standardLoss.points')) ? 'maker' : 'ie2'),
              variants: [
                {
                  id: 'ie2',
                  label: 'IE2 reference defaults',
                  help: "Typical losses of an IE2 drive module (typical values: use the maker's figures); CDM only.",
                  apply: (e) => {
                    const s = obj(e['standardLoss']);
                    delete s['points'];
                    e['standardLoss'] = s;
                  },
                  fields: [],
                },
                {
                  id: 'maker',
                  label: 'Eight losses from the maker',
                  apply: (e) => {
                    const s = obj(e['standardLoss']);
                    s['points'] = [0, 0, 0, 0, 0, 0, 0, 0].map(() => 100);
                    e['standardLoss'] = s;
                  },
                  fields: IE2_POINT_LABELS.map(
                    (label, i): NumberSpec => ({ type: 'number', path: `standardLoss.points.${i}`, label: `Loss at ${label}`, quantity: 'power', required: true }),
                  ),
                },
              ],
            },
          ],
        },
      ],
    },
  ],
};

const CLASS_LABELS: Record<string, string> = {
  IE1: 'IE1 standard (IEC 60034-30-1)',
  IE2: 'IE2 high (IEC 60034-30-1)',
  IE3: 'IE3 premium (IEC 60034-30-1)',
  IE4: 'IE4 super premium (IEC 60034-30-1)',
  'NEMA-premium': 'NEMA Premium (MG 1 Table 12-12)',
};

const pfCurvePoints: PointsSpec = {
  type: 'points',
  path: 'powerFactor.points',
  label: 'Power factor points',
  required: true,
  columns: [
    { key: 'loadFraction', label: 'Load (% of rated output)', quantity: 'fraction-percent' },
    { key: 'powerFactor', label: 'Power factor (0–1)', quantity: 'ratio' },
  ],
  minRows: 2,
  default: [
    { loadFraction: 0.5, powerFactor: 0.75 },
    { loadFraction: 1, powerFactor: 0.85 },
  ],
  newRow: (rows) => nextPoint(rows, 'powerFactor', 0.85),
};

const motorForm: KindForm = {
  kind: 'motor',
  fields: [
    name,
    { type: 'number', path: 'ratedOutput', label: 'Rated shaft output', quantity: 'shaft-power', required: true, default: 7500 },
    { type: 'number', path: 'ratedVoltage', label: 'Rated voltage', quantity: 'voltage', required: false, help: `${LINE_TO_LINE} Used for the NEC Table 430.250 current.` },
    frequency('ratedFrequency', 'Rated frequency', false),
    {
      type: 'choice',
      path: 'poles',
      label: 'Poles',
      required: false,
      options: [2, 4, 6, 8].map((p) => ({ value: p, label: `${p}` })),
    },
    { type: 'number', path: 'ratedSpeed', label: 'Rated speed', quantity: 'speed', required: false },
    { type: 'number', path: 'serviceFactor', label: 'Service factor', quantity: 'ratio', required: false, placeholder: () => 1, help: 'Above rated output a warning; above this × rated, refused.' },
    {
      type: 'group',
      key: 'motor-efficiency',
      paths: ['loss', 'powerFactor', 'efficiencyClass', 'nameplate'],
      label: 'Efficiency from',
      current: (e) =>
        e['efficiencyClass'] !== undefined ? 'class' : e['nameplate'] !== undefined ? 'nameplate' : e['loss'] !== undefined || e['powerFactor'] !== undefined ? 'explicit' : undefined,
      variants: [
        {
          id: 'class',
          label: 'Efficiency class',
          help: 'Full-load value from the class table, typical part-load shape.',
          apply: (e) => {
            remove(e, 'loss', 'powerFactor', 'nameplate');
            e['efficiencyClass'] = 'IE3';
            e['poles'] ??= 4;
            e['ratedFrequency'] ??= 50;
          },
          fields: [
            {
              type: 'choice',
              path: 'efficiencyClass',
              label: 'Efficiency class',
              required: true,
              default: 'IE3',
              help: 'IEC classes: 4-pole 50 Hz values; NEMA Premium: 4-pole 60 Hz.',
              options: MOTOR_CLASSES.map((c) => ({ value: c, label: CLASS_LABELS[c] ?? c })),
            },
            powerFactor('ratedPowerFactor', 'Full-load power factor (0–1)', false),
          ],
        },
        {
          id: 'nameplate',
          label: 'Nameplate',
          help: 'Full-load values from the plate, typical part-load shape.',
          apply: (e) => {
            remove(e, 'loss', 'powerFactor', 'efficiencyClass', 'ratedPowerFactor');
            e['nameplate'] = { efficiency: 0.9 };
          },
          fields: [
            { type: 'number', path: 'nameplate.efficiency', label: percentOf('Full-load efficiency'), quantity: 'fraction-percent', required: true, default: 0.9 },
            powerFactor('nameplate.powerFactor', 'Full-load power factor (0–1)', false),
            { type: 'number', path: 'nameplate.current', label: 'Full-load current', quantity: 'current', required: false },
          ],
        },
        {
          id: 'explicit',
          label: 'Loss and power-factor models',
          apply: (e) => {
            remove(e, 'efficiencyClass', 'nameplate', 'ratedPowerFactor');
            e['loss'] = { model: 'constant', efficiency: 0.9 };
            e['powerFactor'] = { model: 'constant', powerFactor: 0.85 };
          },
          fields: [
            lossGroup('loss', 'shaft'),
            {
              type: 'group',
              key: 'powerFactor',
              paths: ['powerFactor'],
              label: 'Power factor model',
              current: (e) => {
                const m = obj(e['powerFactor'])['model'];
                return typeof m === 'string' ? m : undefined;
              },
              variants: [
                {
                  id: 'constant',
                  label: 'Constant',
                  apply: (e) => void (e['powerFactor'] = { model: 'constant', powerFactor: 0.85 }),
                  fields: [powerFactor('powerFactor.powerFactor', 'Power factor (0–1)', true, 0.85)],
                },
                {
                  id: 'curve',
                  label: 'Curve from datasheet points',
                  apply: (e) => void (e['powerFactor'] = { model: 'curve', points: structuredClone(pfCurvePoints.default) }),
                  fields: [pfCurvePoints],
                },
              ],
            },
          ],
        },
      ],
    },
    optionalBlock(
      'starting',
      'Motor starting',
      'Starting data given',
      () => ({ method: 'dol' }),
      [
        {
          type: 'choice',
          path: 'starting.method',
          label: 'Starting method',
          required: true,
          default: 'dol',
          options: [
            { value: 'dol', label: 'Direct on line' },
            { value: 'star-delta', label: 'Star-delta (⅓ current and torque)' },
            { value: 'soft-starter', label: 'Soft starter (current limit)' },
            { value: 'drive', label: 'Drive (about 1.5 × full-load current)' },
          ],
        },
        {
          type: 'choice',
          path: 'starting.codeLetter',
          label: 'Locked-rotor code letter (NEC Table 430.7(B))',
          required: false,
          help: 'Give one of: code letter, I_A/I_N or locked-rotor current. None: 6 × full-load current, 7 × for IE3, 8 × for IE4 and NEMA Premium (typical value: use the maker’s figure).',
          options: CODE_LETTERS.map((c) => ({ value: c, label: c })),
        },
        { type: 'number', path: 'starting.startingCurrentRatio', label: 'Starting current ratio I_A/I_N', quantity: 'ratio', required: false, help: 'IEC motor data (typical value 5–8: use the maker’s figure).' },
        { type: 'number', path: 'starting.lockedRotorCurrent', label: 'Locked-rotor current', quantity: 'current', required: false },
        {
          type: 'number',
          path: 'starting.currentLimit',
          label: 'Soft-starter current limit (× full-load current)',
          quantity: 'ratio',
          required: false,
          placeholder: () => 3.5,
          when: (e) => valueAt(e, 'starting.method') === 'soft-starter',
        },
        { type: 'number', path: 'starting.startingPowerFactor', label: 'Power factor at locked rotor (0–1)', quantity: 'ratio', required: false, help: 'Empty: by size, 0.2–0.4 (typical value: use the maker’s figure).' },
        { type: 'number', path: 'starting.startSeconds', label: 'Time to reach speed', quantity: 'seconds', required: false, help: 'Empty: by method (typical value: use the maker’s figure).' },
        { type: 'number', path: 'starting.minTerminalVoltagePercent', label: 'Lowest terminal voltage while starting (% of rated)', quantity: 'percent', required: false, placeholder: () => 80 },
      ],
      'Starting current, the dip it causes, and whether the source can carry it.',
    ),
  ],
};

// ---------- cable ----------

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

const cableForm: KindForm = {
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

// ---------- converter of any sort ----------

const electricalKinds: readonly ChoiceOption[] = [
  { value: 'dc', label: 'DC' },
  { value: 'ac1', label: 'AC single-phase' },
  { value: 'ac3', label: 'AC three-phase' },
];
const acIn = (e: FormElement) => e['inputKind'] !== 'dc';
const acOut = (e: FormElement) => e['outputKind'] !== 'dc';

const genericForm: KindForm = {
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

// ---------- loads ----------

const dcLoadForm: KindForm = {
  kind: 'dc-load',
  fields: [name, { type: 'number', path: 'power', label: 'Power drawn', quantity: 'power', required: true, default: 100 }],
};

const acLoadForm: KindForm = {
  kind: 'ac-load',
  fields: [name, { type: 'number', path: 'power', label: 'Real power drawn', quantity: 'power', required: true, default: 500 }, powerFactor('powerFactor', undefined, true, 0.9), pfSense('pfSense')],
};

const acVaLoadForm: KindForm = {
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

const dcCurrentLoadForm: KindForm = {
  kind: 'dc-current-load',
  fields: [name, { type: 'number', path: 'current', label: 'Current drawn', quantity: 'current', required: true, default: 2, help: CURRENT_LOAD_HELP }],
};

const acCurrentLoadForm: KindForm = {
  kind: 'ac-current-load',
  fields: [
    name,
    { type: 'number', path: 'current', label: 'Line current drawn (rms)', quantity: 'current', required: true, default: 4, help: CURRENT_LOAD_HELP },
    powerFactor('powerFactor', undefined, true, 0.9),
    pfSense('pfSense'),
  ],
};

const shaftLoadForm: KindForm = {
  kind: 'shaft-load',
  fields: [name, { type: 'number', path: 'power', label: 'Shaft power', quantity: 'shaft-power', required: true, default: 5000 }],
};

const networkLoadForm: KindForm = {
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

const pumpForm: KindForm = {
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

// ---------- the registry ----------

export const KIND_FORMS: Readonly<Record<ElementKind, KindForm>> = {
  grid: acSource('grid'),
  generator: acSource('generator'),
  battery: batteryForm,
  rectifier: rectifierForm,
  'dc-dc': dcdcForm,
  'dc-bus': dcbusForm,
  inverter: inverterForm,
  transformer: transformerForm,
  drive: driveForm,
  motor: motorForm,
  cable: cableForm,
  generic: genericForm,
  'dc-load': dcLoadForm,
  'ac-load': acLoadForm,
  'ac-va-load': acVaLoadForm,
  'dc-current-load': dcCurrentLoadForm,
  'ac-current-load': acCurrentLoadForm,
  'shaft-load': shaftLoadForm,
  'network-load': networkLoadForm,
  pump: pumpForm,
};

/** The form of a kind, or undefined for a kind the engine does not know. */
export function formFor(kind: string): KindForm | undefined {
  return KINDS.has(kind as ElementKind) ? KIND_FORMS[kind as ElementKind] : undefined;
}

/** Every field of a form, group variants included (depth-first). */
export function allFields(fields: readonly FieldSpec[]): FieldSpec[] {
  const out: FieldSpec[] = [];
  for (const f of fields) {
    out.push(f);
    if (f.type === 'group') for (const v of f.variants) out.push(...allFields(v.fields));
  }
  return out;
}

/** The fields shown for this element now: groups' chosen variants only, `when` respected. */
export function shownFields(fields: readonly FieldSpec[], e: FormElement): FieldSpec[] {
  const out: FieldSpec[] = [];
  for (const f of fields) {
    if (f.when && !f.when(e)) continue;
    out.push(f);
    if (f.type === 'group') {
      const v = f.variants.find((x) => x.id === f.current(e));
      if (v) out.push(...shownFields(v.fields, e));
    }
  }
  return out;
}

function fillDefaults(fields: readonly FieldSpec[], e: FormElement): void {
  for (const f of fields) {
    if (f.when && !f.when(e)) continue;
    if (f.type === 'group') {
      if (f.current(e) === undefined) f.variants[0]!.apply(e);
      const v = f.variants.find((x) => x.id === f.current(e));
      if (v) fillDefaults(v.fields, e);
      continue;
    }
    if (!f.required || valueAt(e, f.path) !== undefined) continue;
    const d = 'default' in f ? f.default : undefined;
    if (d === undefined) continue;
    setPath(e, f.path, structuredClone(d));
  }
}

function setPath(e: FormElement, path: string, value: unknown): void {
  const keys = path.split('.');
  let at: FormElement = e;
  for (const k of keys.slice(0, -1)) {
    if (typeof at[k] !== 'object' || at[k] === null) at[k] = {};
    at = at[k] as FormElement;
  }
  at[keys[keys.length - 1]!] = value;
}

/** A new element of a kind from the descriptors' defaults (first variant of every group). */
export function defaultElement(kind: ElementKind, id: string, from?: string): FormElement {
  const e: FormElement = { id, kind, ...(from !== undefined ? { from } : {}) };
  fillDefaults(KIND_FORMS[kind].fields, e);
  return e;
}

// ---------- messages ----------

/**
 * The engine's message as shown at a field: fractions typed in per cent get their limits in per cent
 * ("must not exceed 1 (enter 0.95 for 95 %)" → "must not exceed 100 %").
 */
export function messageForField(spec: { label: string; quantity?: Quantity }, message: string): string {
  let text = message;
  if (spec.quantity === 'fraction-percent') {
    text = text
      .replace(/\s*\(enter [^)]*\)/g, '')
      .replace(/\b(exceed|below|above|at least|greater than|less than) (\d+(?:\.\d+)?)(?![\d.]| ?%)/g, (_m, word: string, n: string) => `${word} ${Number((Number(n) * 100).toPrecision(12))} %`);
  }
  return text.startsWith(`${spec.label}:`) ? text : `${spec.label}: ${text}`;
}

// ---------- project ----------

export const DROP_BASES: readonly ChoiceOption[] = [
  { value: 'nec-informational', label: 'NEC informational notes: 3 % per link, 5 % total' },
  { value: 'iec-a-lighting', label: 'IEC 60364-5-52 G.52.1, public LV supply, lighting: 3 %' },
  { value: 'iec-a-other', label: 'IEC 60364-5-52 G.52.1, public LV supply, other uses: 5 %' },
  { value: 'iec-b-lighting', label: 'IEC 60364-5-52 G.52.1, private supply, lighting: 6 %' },
  { value: 'iec-b-other', label: 'IEC 60364-5-52 G.52.1, private supply, other uses: 8 %' },
];

/** The limits of the chosen basis alone (the engine's values shown as placeholders). */
function basisOnly(p: FormElement): DropLimits {
  const basis = valueAt(p, 'dropLimits.basis');
  return DROP_BASES.some((b) => b.value === basis) ? { basis: basis as NonNullable<DropLimits['basis']> } : {};
}

/** The project-level form: written with setField('project', path, value). */
export const PROJECT_FIELDS: readonly FieldSpec[] = [
  { type: 'text', path: 'name', label: 'Project name', required: true },
  { type: 'text', path: 'description', label: 'Description', required: false, multiline: true, help: 'Site, purpose, anything the client report should say.' },
  {
    type: 'choice',
    path: 'dropLimits.basis',
    label: 'Voltage-drop limits from',
    required: false,
    help: 'Empty: NEC informational notes (not enforceable on their own).',
    options: DROP_BASES,
  },
  {
    type: 'number',
    path: 'dropLimits.perLinkPercent',
    label: 'Allowed drop per link (%)',
    quantity: 'percent',
    required: false,
    placeholder: (p) => resolveLimits(basisOnly(p)).perLinkPercent,
    help: 'Empty: from the basis above.',
  },
  {
    type: 'number',
    path: 'dropLimits.totalPercent',
    label: 'Allowed drop in total (%)',
    quantity: 'percent',
    required: false,
    placeholder: (p) => resolveLimits(basisOnly(p)).totalPercent,
    help: 'From the source to each load. Empty: from the basis above.',
  },
];
