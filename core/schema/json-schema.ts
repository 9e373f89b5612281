/**
 * The project file format as JSON Schema (draft-07, which the common editors read), generated from the
 * engine's own zod schemas: the top level of `validateProject` and every element kind of the registry,
 * so the published schema cannot drift from what the engine accepts. `npm run schema` writes it to
 * schema/joulepath-project.schema.json (and the export envelope beside it); a test fails when the
 * committed files are stale.
 *
 * What comes through: every field, its type, required fields, unknown fields refused, enums and
 * literals, the bounds zod states (z.gt, z.lte, lengths, whole numbers), and the plausible range of
 * every physical quantity (core/kinds/ranges.ts: a refinement in zod, stated here as minimum /
 * maximum with a description naming the unit). What JSON Schema cannot say is left out and stays the
 * engine's: cross-field checks (`check(e)` of a kind, e.g. %Z ≥ %R, a segment's loads naming loads of
 * the project), the tree's shape (one source, every `from` naming an element, port kinds), the
 * "0 or at least 1 pΩ" rule of a source impedance and other custom refinements. A file the schema
 * accepts may therefore still be refused by the engine, with a message naming the field.
 */
import { z } from 'zod/mini';
import { projectShape } from '../solve/validate.ts';
import { priceSchema } from '../solve/running-schema.ts';
import { KINDS } from '../kinds/index.ts';
import { RANGES, RANGE_CHECKS, rangeText, type Floor, type Quantity } from '../kinds/ranges.ts';

/** A JSON Schema object (draft-07), as plain data. */
export type JsonSchema = { [key: string]: unknown };

/** The name of the published file (in the package's schema/ folder). */
export const PROJECT_SCHEMA_FILE = 'joulepath-project.schema.json';

/** Options shared by every conversion: draft-07, and the range refinements stated as bounds. */
export const JSON_SCHEMA_OPTIONS = {
  target: 'draft-07',
  // Refinements (z.superRefine, z.refine) have no JSON Schema form; they are checks on a typed
  // value, so the value's type still comes through and only the refinement is left out.
  unrepresentable: 'any',
  override: ({ zodSchema, jsonSchema }) => {
    const checks = (zodSchema._zod.def as { checks?: readonly object[] }).checks ?? [];
    for (const check of checks) {
      const range = RANGE_CHECKS.get(check);
      if (range) applyRange(jsonSchema as JsonSchema, range.quantity, range.floor);
    }
  },
} as const satisfies z.core.ToJSONSchemaParams;

/**
 * State a quantity's plausible range on a number schema, as `rangeMessage` checks it: "positive" is
 * v > 0 then the table's range, "non-negative" v ≥ 0 then the range, "range" the range alone. Keeps
 * any tighter bound zod already stated.
 */
function applyRange(json: JsonSchema, q: Quantity, floor: Floor): void {
  const r = RANGES[q];
  const lowest = floor === 'range' ? r.min : Math.max(r.min, 0);
  if (floor === 'positive' && r.min <= 0) {
    json['exclusiveMinimum'] = Math.max(0, num(json['exclusiveMinimum']) ?? 0);
    if (num(json['minimum']) !== undefined && num(json['minimum'])! <= 0) delete json['minimum'];
  } else {
    json['minimum'] = Math.max(lowest, num(json['minimum']) ?? -Infinity);
  }
  json['maximum'] = Math.min(r.max, num(json['maximum']) ?? Infinity);
  const unit = r.unit ? ` in ${r.unit}` : '';
  json['description'] ??= `${capitalise(r.what)}${unit}; plausible range ${rangeText(q)}.`;
}

const num = (v: unknown): number | undefined => (typeof v === 'number' ? v : undefined);
const capitalise = (s: string) => s.charAt(0).toUpperCase() + s.slice(1);

/** One zod schema as a draft-07 JSON Schema fragment (no `$schema` key of its own). */
export function fragment(schema: z.core.$ZodType): JsonSchema {
  const { $schema: _draft, ...rest } = z.toJSONSchema(schema, JSON_SCHEMA_OPTIONS) as JsonSchema;
  if ('definitions' in rest) throw new Error('a schema reuses a part by reference; inline it or merge its definitions here');
  return rest;
}

/** The definition name of an element kind in `definitions`. */
const kindRef = (kind: string) => `#/definitions/${kind}`;

/**
 * The parts of the schema: `project`, the file's top level (its elements refer to the kinds by
 * `#/definitions/<kind>`), and `definitions`, one schema per element kind named by the kind.
 */
export function projectSchemaParts(): { project: JsonSchema; definitions: Record<string, JsonSchema> } {
  const kinds = [...KINDS.entries()];
  const definitions: Record<string, JsonSchema> = {};
  for (const [kind, spec] of kinds) {
    const schema = fragment(spec.schema);
    // Kinds that share one schema (grid and generator) list both; the engine picks the schema by the
    // kind, so each definition takes its own kind only (and `oneOf` matches exactly one).
    (schema['properties'] as Record<string, JsonSchema>)['kind'] = { type: 'string', const: kind };
    // The purchase price of the element base, which validate.ts checks for every kind.
    (schema['properties'] as Record<string, JsonSchema>)['price'] = { ...fragment(priceSchema), description: 'Purchase price of the element, in your currency (optional; the lifetime cost counts it at year 0).' };
    definitions[kind] = { title: `Element of kind "${kind}"`, ...schema };
  }
  // The network of a circuit load is read by parseNetwork (core/physics/network.ts), not by a zod schema
  // (each entry's problem carries its own path): its shape is stated here, the way that parser reads it.
  (definitions['network-load']!['properties'] as Record<string, JsonSchema>)['network'] = { $ref: '#/definitions/circuit-network' };
  definitions['circuit-network'] = circuitNetworkSchema();
  const project = fragment(projectShape);
  const properties = project['properties'] as Record<string, JsonSchema>;
  properties['$schema'] = { ...properties['$schema'], description: 'The JSON Schema of this file (for editors); the engine ignores it.' };
  properties['elements'] = {
    type: 'array',
    description: 'Every element of the chain; the single source has no "from", every other element names the element that feeds it.',
    items: {
      // The kind's own schema decides (one `kind` constant per alternative); the list of kinds is
      // given beside it so editors offer the kinds first.
      type: 'object',
      required: ['id', 'kind'],
      properties: { kind: { type: 'string', enum: kinds.map(([kind]) => kind) } },
      oneOf: kinds.map(([kind]) => ({ $ref: kindRef(kind) })),
    },
  };
  return { project, definitions };
}

/**
 * The circuit network of a `network-load`, as `parseNetwork` reads it: exactly one entry per object,
 * a component (resistor Ω, inductor H, capacitor F: a number > 0 in the base unit, or text with an SI
 * prefix such as "4.7 mH") or a non-empty series / parallel list of entries. Not stated: the depth
 * (MAX_NETWORK_DEPTH) and component (MAX_NETWORK_COMPONENTS) limits and the reading of the text.
 */
function circuitNetworkSchema(): JsonSchema {
  const value = (unit: string, name: string): JsonSchema => ({
    description: `A ${name} in ${unit}: a number greater than 0, or text with an SI prefix (e.g. "4.7 m${unit}", "220 µ${unit}", "10k").`,
    anyOf: [
      { type: 'number', exclusiveMinimum: 0 },
      { type: 'string', minLength: 1 },
    ],
  });
  const one = (key: string, schema: JsonSchema): JsonSchema => ({
    type: 'object',
    properties: { [key]: schema },
    required: [key],
    additionalProperties: false,
  });
  const list = (how: string): JsonSchema => ({
    description: `Entries connected in ${how}.`,
    type: 'array',
    minItems: 1,
    items: { $ref: '#/definitions/circuit-network' },
  });
  return {
    title: 'Circuit network',
    description:
      'Resistors, inductors and capacitors in series and parallel: each entry is exactly one of {"resistor": …}, {"inductor": …}, {"capacitor": …}, {"series": […]}, {"parallel": […]}, nested as needed.',
    oneOf: [
      one('resistor', value('Ω', 'resistance')),
      one('inductor', value('H', 'inductance')),
      one('capacitor', value('F', 'capacitance')),
      one('series', list('series')),
      one('parallel', list('parallel')),
    ],
  };
}

/** The text every generated schema opens with. */
export const GENERATED_NOTE = "Generated from the engine's schemas by `npm run schema` (core/schema/json-schema.ts); do not edit by hand.";

/** The project file's JSON Schema (schema/joulepath-project.schema.json). */
export function projectJsonSchema(): JsonSchema {
  const { project, definitions } = projectSchemaParts();
  return {
    $schema: 'http://json-schema.org/draft-07/schema#',
    $comment: GENERATED_NOTE,
    title: 'Joulepath project file',
    description:
      'A power chain: a flat list of elements, each naming the element that feeds it. SI units throughout (V, A, W, m, Hz, s; temperatures in °C). The engine also checks what this schema cannot say (the tree, cross-field rules).',
    ...project,
    definitions,
  };
}
