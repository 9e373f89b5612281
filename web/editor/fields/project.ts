/**
 * The project-level form (drop limits and what the whole project shares).
 * Part of the form descriptors; web/editor/fields.ts is their entry (today's exports, callers import it).
 */
import { type DropLimits, resolveLimits } from '../../../core/page.ts';
import { valueAt } from './common.ts';
import type { ChoiceOption, FieldSpec, FormElement } from './types.ts';

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

/** The project-level form: written with setField(PROJECT_LEVEL, path, value). */
export const PROJECT_FIELDS: readonly FieldSpec[] = [
  { type: 'text', path: 'name', label: 'Project name', required: true },
  { type: 'text', path: 'description', label: 'Description', required: false, multiline: true, help: 'Site, purpose, anything the client report should say.' },
  { type: 'text', path: 'client', label: 'Client', required: false, help: 'Who the design is for: printed on the report’s first page.' },
  { type: 'text', path: 'site', label: 'Site', required: false, help: 'Address or name of the installation: printed on the report’s first page.' },
  { type: 'text', path: 'preparedBy', label: 'Prepared by', required: false, help: 'Your name, firm or licence number: printed on the report’s first page.' },
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
