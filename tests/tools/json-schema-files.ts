/**
 * The published JSON Schema files (schema/ folder), built from the engine's zod schemas: the bare
 * project (core/schema/json-schema.ts) and the export envelope the page writes
 * (web/storage/file-format.ts), which embeds the project's definitions. `npm run schema` writes them
 * (tests/tools/write-json-schema.ts); tests/tools/json-schema.test.ts fails when the committed files
 * differ from what this builds.
 */
import { z } from 'zod/mini';
import { GENERATED_NOTE, JSON_SCHEMA_OPTIONS, PROJECT_SCHEMA_FILE, fragment, projectJsonSchema, projectSchemaParts, type JsonSchema } from '../../core/schema/json-schema.ts';
import { EXPORT_SCHEMA, EXPORT_VERSION, envelopeShape } from '../../web/storage/file-format.ts';

/** The export envelope's JSON Schema: the envelope's fields, its project checked as a bare project. */
export function exportJsonSchema(): JsonSchema {
  const { project, definitions } = projectSchemaParts();
  const envelope = fragment(envelopeShape);
  const properties = envelope['properties'] as Record<string, JsonSchema>;
  properties['$schema'] = { ...properties['$schema'], description: 'The JSON Schema of this file (for editors); the app ignores it.' };
  // The import reads the version itself (a newer one asks to update the app); the schema states the one this build writes.
  properties['exportVersion'] = { type: 'number', const: EXPORT_VERSION };
  properties['project'] = { $ref: '#/definitions/project' };
  envelope['required'] = [...new Set([...((envelope['required'] as string[] | undefined) ?? []), 'project'])];
  return {
    $schema: z.toJSONSchema(z.string(), JSON_SCHEMA_OPTIONS)['$schema'],
    $comment: GENERATED_NOTE,
    title: 'Joulepath project export',
    description: 'A project exported by the Joulepath app: an envelope (when and by which version) around the project file.',
    ...envelope,
    definitions: { ...definitions, project: { title: 'Joulepath project', ...project } },
  };
}

/** File name in schema/ → its text (two-space indent, final newline). */
export function schemaFiles(): Record<string, string> {
  const text = (s: JsonSchema) => `${JSON.stringify(s, null, 2)}\n`;
  return { [PROJECT_SCHEMA_FILE]: text(projectJsonSchema()), [EXPORT_SCHEMA]: text(exportJsonSchema()) };
}
