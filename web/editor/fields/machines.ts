/**
 * The forms of the drive and the motor (losses per IEC 61800-9-2, efficiency class, starting data).
 * Part of the form descriptors; web/editor/fields.ts is their entry (today's exports, callers import it).
 */
import { CODE_LETTERS, MOTOR_CLASSES } from '../../../core/page.ts';
import { DESIGN_CURRENT_HELP, frequency, LINE_TO_LINE, lossGroup, name, nextPoint, obj, optionalBlock, percentOf, powerFactor, ratingField, remove, valueAt, voltage } from './common.ts';
import type { KindForm, NumberSpec, PointsSpec } from './types.ts';

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

export const driveForm: KindForm = {
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

export const motorForm: KindForm = {
  kind: 'motor',
  fields: [
    name,
    { type: 'number', path: 'ratedOutput', label: 'Rated shaft output', quantity: 'shaft-power', required: true, default: 7500 },
    { type: 'number', path: 'ratedVoltage', label: 'Rated voltage', quantity: 'voltage', required: false, help: `${LINE_TO_LINE} Used for the NEC Table 430.250 current. A new motor starts at a typical value from the voltage that feeds it (460 V on a 480 V system in North American practice): use the maker's figure.` },
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
