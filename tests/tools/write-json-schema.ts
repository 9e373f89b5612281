/** `npm run schema`: write the JSON Schema files of the file format into schema/ (see json-schema-files.ts). */
import { mkdirSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { schemaFiles } from './json-schema-files.ts';

const folder = join(import.meta.dirname, '..', '..', 'schema');
mkdirSync(folder, { recursive: true });
for (const [name, text] of Object.entries(schemaFiles())) {
  writeFileSync(join(folder, name), text);
  console.log(`schema/${name}: ${text.length} characters`);
}
