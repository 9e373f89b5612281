/**
 * The one error map of the engine's schemas: the message of any schema issue that its schema does
 * not word itself (most fields carry their own message, e.g. "must be greater than 0 V"). The
 * schemas are built with zod/mini, which loads no locale, so without this map such issues would
 * read "Invalid input". Plain trade English, naming what the field must be and what it got.
 *
 * Used per parse (`schema.safeParse(raw, { error: issueMessage })` in validate.ts), so core sets no
 * global zod configuration.
 */
import type { z } from 'zod/mini';

type RawIssue = z.core.$ZodRawIssue;

/** A value as quoted in a message: strings in double quotes, numbers and true/false as written. */
const quote = (v: unknown): string => (typeof v === 'string' ? JSON.stringify(v) : String(v));

/** What was given instead, e.g. "the number 3", "the text \"x\"", "a list". */
function given(input: unknown): string {
  if (input === null) return 'null';
  if (Array.isArray(input)) return 'a list';
  switch (typeof input) {
    case 'number':
      return `the number ${input}`;
    case 'string':
      return input === '' ? 'empty text' : `the text ${JSON.stringify(input.length > 40 ? `${input.slice(0, 40)}…` : input)}`;
    case 'boolean':
      return String(input);
    case 'object':
      return 'an object';
    default:
      return typeof input;
  }
}

/** "must be …" for each expected type. */
const EXPECTED: Readonly<Record<string, string>> = {
  number: 'must be a number',
  int: 'must be a whole number',
  string: 'must be text',
  boolean: 'must be true or false',
  object: 'must be an object ({ … })',
  array: 'must be a list ([ … ])',
  record: 'must be an object ({ … })',
};

/** `entries` with its count: "1 entry", "3 entries". */
const entries = (n: number | bigint): string => `${n} ${n === 1 || n === 1n ? 'entry' : 'entries'}`;

function invalidType(issue: Extract<RawIssue, { code: 'invalid_type' }>): string {
  if (issue.input === undefined) return 'is required';
  const want = EXPECTED[issue.expected] ?? `must be of type ${issue.expected}`;
  return `${want}, not ${given(issue.input)}`;
}

function tooSmall(issue: Extract<RawIssue, { code: 'too_small' }>): string {
  const min = issue.minimum;
  switch (issue.origin) {
    case 'array':
    case 'set':
      return issue.exact ? `needs exactly ${entries(min)}` : `needs at least ${entries(min)}`;
    case 'string':
      return Number(min) === 1 && !issue.exact ? 'must not be empty' : `needs at least ${min} characters`;
    default:
      return issue.inclusive ? `must be at least ${min}` : `must be greater than ${min}`;
  }
}

function tooBig(issue: Extract<RawIssue, { code: 'too_big' }>): string {
  const max = issue.maximum;
  switch (issue.origin) {
    case 'array':
    case 'set':
      return issue.exact ? `needs exactly ${entries(max)}` : `must have at most ${entries(max)}`;
    case 'string':
      return `must be at most ${max} characters`;
    default:
      return issue.inclusive ? `must not exceed ${max}` : `must be below ${max}`;
  }
}

/**
 * The message for an element's `kind` that is missing or not one of the known kinds (the kind picks
 * the schema, so it is checked before any schema runs): never "unknown kind undefined".
 */
export function unknownKindMessage(kind: unknown, known: readonly string[]): string {
  const expected = `one of ${known.join(', ')}`;
  if (kind === undefined) return `is required: ${expected}`;
  return typeof kind === 'string' ? `unknown kind ${JSON.stringify(kind)}; expected ${expected}` : `unknown kind: ${given(kind)}; expected ${expected}`;
}

/** The message of a schema issue that has none of its own. Never empty, never zod's wording. */
export function issueMessage(issue: RawIssue): string {
  switch (issue.code) {
    case 'invalid_type':
      return invalidType(issue);
    case 'invalid_value':
      return issue.values.length === 1 ? `must be ${quote(issue.values[0])}` : `must be one of ${issue.values.map(quote).join(', ')}`;
    case 'too_small':
      return tooSmall(issue);
    case 'too_big':
      return tooBig(issue);
    case 'unrecognized_keys':
      return `unknown field "${issue.keys.join('", "')}" (check the spelling)`;
    case 'invalid_union': {
      if (issue.discriminator === undefined) return 'does not match any of the accepted forms';
      const options: unknown = 'options' in issue ? issue.options : undefined;
      const known = Array.isArray(options) && options.length ? `: one of ${options.map(quote).join(', ')}` : '';
      return `needs a known "${issue.discriminator}"${known}`;
    }
    case 'invalid_key':
      return 'has a key that is not allowed';
    case 'invalid_element':
      return 'has an entry that is not allowed';
    case 'not_multiple_of':
      return `must be a multiple of ${issue.divisor}`;
    case 'invalid_format':
      return `is not in the expected form (${issue.format})`;
    case 'custom':
      return 'is not valid';
    default:
      return 'is not valid';
  }
}
