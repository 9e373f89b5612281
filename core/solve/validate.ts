/**
 * Step 1 of the solve: check the project file field by field and the tree's shape (structure.ts).
 * Every problem names the element and the field; nothing is computed from a project that has any.
 */
import { OLDEST_PROJECT_VERSION, PROJECT_VERSION, migrateProject } from '../model/migrate.ts';
import { z } from 'zod/mini';
import type { BackupStudy, Element, Project } from '../model/project.ts';
import { REPORT_TEXT_MAX } from '../model/project.ts';
import type { Problem } from '../model/errors.ts';
import { PROJECT_LEVEL } from '../model/errors.ts';
import { KINDS } from '../kinds/index.ts';
import { checkStructure, skeletonOf } from './structure.ts';
import { issueMessage, unknownKindMessage } from './issue-messages.ts';
import { backupSchema, reservedKeyProblems } from './load-profile.ts';
import { dropLimitsSchema } from '../conductors/path-drop.ts';
import { pumpDutySchema } from '../kinds/pump.ts';
import { priceSchema, runningSchema } from './running-schema.ts';
import { standbySchema } from './standby-schema.ts';
import { variantsSchema } from './variants-schema.ts';
import { spreadSchema } from './spread-schema.ts';
import { optionSearchSchema } from './option-search-schema.ts';
import { countSolveStep } from './count.ts';
import { wordedFromParams } from '../model/message.ts';

declare const VALID: unique symbol;
/**
 * A project that passed `validateProject` (or was built from one by core/solve/variant.ts, which
 * checks every element it changes): the brand is a type only, given in these two places alone, so
 * a study cannot hand the solve a project nobody checked. Plain data at run time.
 */
export type ValidProject = Project & { readonly [VALID]: true };

/** The client report's own lines (client, site, prepared by): plain text of a printable length. */
const reportText = z.string({ error: 'must be text' }).check(z.maxLength(REPORT_TEXT_MAX, `must be at most ${REPORT_TEXT_MAX} characters (it is printed on the report's first page)`));

export const projectShape = z.strictObject({
  /** The JSON Schema an editor checks the file against (schema/joulepath-project.schema.json); not read by the engine. */
  $schema: z.optional(z.string({ error: 'must be text (the address of the file format\'s JSON Schema)' })),
  format: z.literal('joulepath-project', { error: 'must be "joulepath-project"' }),
  version: z.literal(PROJECT_VERSION, {
    error: (issue) =>
      typeof issue.input === 'number' && Number.isInteger(issue.input) && issue.input > PROJECT_VERSION
        ? `is ${issue.input}: the file was written by a newer version of Joulepath, which this one (format ${PROJECT_VERSION}) cannot read; update the app`
        : `must be ${PROJECT_VERSION} (files of format ${OLDEST_PROJECT_VERSION} are brought up to date as they are read)`,
  }),
  name: z.string({ error: 'must be text' }),
  description: z.optional(z.string({ error: 'must be text' })),
  client: z.optional(reportText),
  site: z.optional(reportText),
  preparedBy: z.optional(reportText),
  elements: z.array(z.unknown(), { error: 'must be a list of elements' }),
  backup: z.optional(backupSchema),
  dropLimits: z.optional(dropLimitsSchema),
  pumpDuty: z.optional(pumpDutySchema),
  running: z.optional(runningSchema),
  standby: z.optional(standbySchema),
  variants: z.optional(variantsSchema),
  spread: z.optional(spreadSchema),
  optionSearch: z.optional(optionSearchSchema),
});

/**
 * On failure, `fieldsValid` says whether every element passed its own checks (only the tree's
 * shape is wrong); `project` is then still given so the port kinds can be checked as well.
 */
type Validated = { ok: true; project: ValidProject } | { ok: false; problems: Problem[]; project?: Project };

const isRecord = (v: unknown): v is Record<string, unknown> => typeof v === 'object' && v !== null && !Array.isArray(v);

function valueAt(obj: unknown, path: readonly PropertyKey[]): unknown {
  let v = obj;
  for (const key of path) {
    if (!isRecord(v) && !Array.isArray(v)) return undefined;
    // Own fields only: a path through a plain object never reads what it inherits.
    if (!Object.hasOwn(v as object, key)) return undefined;
    v = (v as Record<PropertyKey, unknown>)[key];
  }
  return v;
}

/** Turn schema issues into problems for one element (or the project). */
function fromIssues(issues: readonly z.core.$ZodIssue[], elementId: string, subject: unknown): Problem[] {
  return issues.map((issue) => {
    const path = issue.path.map(String);
    if (issue.code === 'unrecognized_keys') {
      const field = [...path, ...issue.keys].join('.');
      return { code: 'invalid-value', elementId, field, message: `unknown field "${issue.keys.join('", "')}" (check the spelling)` };
    }
    const value = valueAt(subject, issue.path);
    const message = value === undefined && issue.code === 'invalid_type' ? 'is required' : issue.message;
    // A range check keeps its bounds as quantities (core/kinds/ranges.ts rangeWorded).
    const worded = issue.code === 'custom' ? wordedFromParams(issue.params) : {};
    return { code: 'invalid-value', elementId, field: path.join('.'), value, message, ...worded };
  });
}

/** The element's own fields but its purchase price (a copy; the element is not changed). */
function withoutPrice(raw: Record<string, unknown>): Record<string, unknown> {
  const { price: _price, ...own } = raw;
  return own;
}

/** Validate one element's fields: its kind must be known, then its own schema and cross-field checks. */
export function validateElement(raw: unknown, index: number): { element?: Element; problems: Problem[] } {
  if (!isRecord(raw)) {
    return { problems: [{ code: 'invalid-value', elementId: `#${index + 1}`, field: '', value: raw, message: 'must be an object' }] };
  }
  const id = typeof raw['id'] === 'string' && raw['id'] !== '' ? raw['id'] : `#${index + 1}`;
  const kind = raw['kind'];
  const spec = typeof kind === 'string' ? KINDS.get(kind as Element['kind']) : undefined;
  if (!spec) {
    return {
      problems: [
        {
          code: 'unknown-kind',
          elementId: id,
          field: 'kind',
          value: kind,
          message: unknownKindMessage(kind, [...KINDS.keys()]),
        },
      ],
    };
  }
  // The purchase price belongs to the element base (every kind): checked here once, then set aside
  // so the kind's own strict schema reads the rest (core/schema/json-schema.ts states it per kind).
  // (The copy without the price is made only for an element that has one: an object rest copies
  // every field, a cost each element of every validation paid.)
  const hasPrice = Object.hasOwn(raw, 'price');
  const rawPrice = raw['price'];
  const priced = rawPrice === undefined ? undefined : priceSchema.safeParse(rawPrice, { error: issueMessage });
  const priceProblems = priced && !priced.success ? fromIssues(priced.error.issues, id, rawPrice).map((p) => ({ ...p, field: 'price' })) : [];
  const parsed = spec.schema.safeParse(hasPrice ? withoutPrice(raw) : raw, { error: issueMessage });
  if (!parsed.success) return { problems: [...fromIssues(parsed.error.issues, id, raw), ...priceProblems] };
  if (priceProblems.length) return { problems: priceProblems };
  const element = priced?.success ? ({ ...parsed.data, price: priced.data } as Element) : parsed.data;
  const problems = (spec.check?.(element) ?? []).map((p) => ({ ...p, elementId: id }));
  return problems.length ? { problems } : { element, problems };
}

/**
 * Check a project's backup study settings alone (a study's changed copy of them, core/solve/variant.ts):
 * the same schema and reserved-key checks as in the whole file, problems at `backup.<field>`.
 */
export function validateBackup(raw: unknown): { ok: true; backup: BackupStudy } | { ok: false; problems: Problem[] } {
  const parsed = backupSchema.safeParse(raw, { error: issueMessage });
  if (!parsed.success) return { ok: false, problems: fromIssues(parsed.error.issues, PROJECT_LEVEL, raw).map((p) => ({ ...p, field: p.field ? `backup.${p.field}` : 'backup' })) };
  const reserved = reservedKeyProblems(raw);
  return reserved.length ? { ok: false, problems: reserved } : { ok: true, backup: parsed.data as BackupStudy };
}

/** Check the file, every element and the tree's shape. Port kinds are checked by `plan`. */
export function validateProject(file: unknown): Validated {
  countSolveStep('validations');
  // An older format is brought up to date first (core/model/migrate.ts); the problems name today's fields.
  const input = migrateProject(file).value;
  const top = projectShape.safeParse(input, { error: issueMessage });
  if (!top.success) return { ok: false, problems: fromIssues(top.error.issues, PROJECT_LEVEL, input) };
  const problems: Problem[] = [];
  const elements: Element[] = [];
  top.data.elements.forEach((raw, i) => {
    const r = validateElement(raw, i);
    problems.push(...r.problems);
    if (r.element) elements.push(r.element);
  });
  // A load level keyed by a reserved id: the schema may have dropped it (`__proto__`) unseen.
  if (isRecord(input)) problems.push(...reservedKeyProblems(Object.hasOwn(input, 'backup') ? input['backup'] : undefined));
  const fieldsValid = problems.length === 0;
  // Tree checks on every element whose id and kind can be read, so they come with the field problems.
  problems.push(...checkStructure(top.data.elements.map(skeletonOf).filter((s) => s !== null)));
  // `$schema` names the file's JSON Schema for editors; it is no part of the project the engine solves.
  const { description, $schema: _schema, ...rest } = top.data;
  const project: Project = { ...rest, ...(description !== undefined ? { description } : {}), elements } as Project;
  if (problems.length) return fieldsValid ? { ok: false, problems, project } : { ok: false, problems };
  return { ok: true, project: project as ValidProject };
}
