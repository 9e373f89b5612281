// Project files (web/storage/file-format.ts): an export reads back as the same project, and every kind
// of bad file is refused with a sentence saying what is wrong. The limits are our own format's rules:
// common practice (no source). The demos are the project's own invented scenarios.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { demoProjects } from '../../core/index.ts';
import type { DraftProject } from '../../web/state/editor.ts';
import {
  EXPORT_FORMAT,
  EXPORT_VERSION,
  IMPORT_LIMITS,
  buildExport,
  checkSize,
  decodeText,
  exportFileName,
  exportText,
  parseImportBytes,
  parseImportText,
} from '../../web/storage/file-format.ts';

const enc = (text: string) => new TextEncoder().encode(text);
const riverside = demoProjects[0]!.project as unknown as DraftProject;

function envelope(project: unknown, extra: Record<string, unknown> = {}): string {
  return JSON.stringify({ format: EXPORT_FORMAT, exportVersion: EXPORT_VERSION, exportedAt: '2025-01-01T00:00:00.000Z', project, ...extra });
}

function refused(result: ReturnType<typeof parseImportText>): string {
  if (result.ok) throw new Error('expected the file to be refused');
  return result.message;
}

describe('export and import back', () => {
  it('round-trips every demo through the export envelope, keeping the project id', () => {
    for (const demo of demoProjects) {
      const p = demo.project as unknown as DraftProject;
      const text = exportText(buildExport(p, { exportedAt: new Date(Date.UTC(2025, 5, 1)), appVersion: '0.1.0', projectId: 'abc-123' }));
      const back = parseImportBytes(enc(text));
      expect(back.ok).toBe(true);
      if (back.ok) {
        // The export names its schema on the envelope; the demo's own `$schema` (a path in the package) is left out.
        const { $schema: _schema, ...bare } = p;
        expect(back.project).toEqual(bare);
        expect(back.projectId).toBe('abc-123');
        expect(back.envelope).toBe(true);
      }
    }
  });

  it('writes the documented envelope fields', () => {
    const env = buildExport(riverside, { exportedAt: new Date(Date.UTC(2025, 5, 1, 8)), appVersion: '0.1.0' });
    expect(env).toMatchObject({ format: 'joulepath-export', exportVersion: 1, exportedAt: '2025-06-01T08:00:00.000Z', exportedBy: 'Joulepath 0.1.0' });
    expect('projectId' in env).toBe(false);
  });

  it('reads a bare project file (the engine and command-line format) as well', () => {
    const back = parseImportText(JSON.stringify(riverside));
    expect(back.ok && back.envelope).toBe(false);
  });

  it('accepts a project the engine rejects field by field, so it can be fixed in the app', () => {
    const broken = { format: 'joulepath-project', version: 2, name: 'Negative heater', elements: [{ id: 'b', kind: 'battery' }, { id: 'h', kind: 'dc-load', from: 'b', power: -5 }] };
    expect(parseImportText(envelope(broken)).ok).toBe(true);
  });

  it('accepts a UTF-8 byte-order mark', () => {
    const bytes = new Uint8Array([0xef, 0xbb, 0xbf, ...enc(JSON.stringify(riverside))]);
    expect(parseImportBytes(bytes).ok).toBe(true);
  });

  it('makes file names from project names', () => {
    expect(exportFileName('Riverside pump station (my copy)')).toBe('riverside-pump-station-my-copy.joulepath.json');
    expect(exportFileName('Café / Zürich')).toBe('cafe-zurich.joulepath.json');
    expect(exportFileName('***')).toBe('project.joulepath.json');
  });
});

describe('bad files are refused with the reason', () => {
  const cases: [string, string | Uint8Array, RegExp][] = [
    ['not JSON', 'power chain, 48 V', /not a JSON project file/],
    ['an empty file', '', /empty/],
    ['only white space', '  \n ', /empty/],
    ['JSON but not an object', '[1, 2, 3]', /object at the top level/],
    ['another program\'s JSON', JSON.stringify({ nodes: [], links: [] }), /no "format" field/],
    ['a wrong format name', JSON.stringify({ format: 'circuit-sheet', elements: [] }), /format is "circuit-sheet"/],
    ['a newer export version', envelope(riverside).replace('"exportVersion":1', '"exportVersion":7'), /newer version of Joulepath \(export format version 7\)/],
    ['a nonsense export version', envelope(riverside).replace('"exportVersion":1', '"exportVersion":"one"'), /export format version is "one"/],
    ['a newer project version', JSON.stringify({ ...riverside, version: 3 }), /project schema version 3/],
    ['an envelope without a project', JSON.stringify({ format: EXPORT_FORMAT, exportVersion: 1 }), /project must be an object/],
    ['elements that are not a list', JSON.stringify({ ...riverside, elements: {} }), /elements must be a list/],
    ['a project with 0 elements', envelope({ ...riverside, elements: [] }), /elements is empty/],
    ['an element without an id', JSON.stringify({ ...riverside, elements: [{ kind: 'battery' }] }), /elements\[0\]\.id/],
    ['an element whose kind is a number', JSON.stringify({ ...riverside, elements: [{ id: 'a', kind: 5 }] }), /elements\[0\]\.kind must be text/],
    ['duplicated ids', JSON.stringify({ ...riverside, elements: [{ id: 'a', kind: 'battery' }, { id: 'a', kind: 'dc-load', from: 'a' }] }), /Two elements share the id "a" \(elements 1 and 2\)/],
    ['a number that overflows', JSON.stringify(riverside).replace('"version":2', '"version":2,"x":1e400'), /too large to be read/],
    ['a huge number', envelope({ ...riverside, elements: [{ id: 'a', kind: 'battery', voltage: 1e300 }] }), /larger than any value in a power chain/],
    ['a __proto__ key', '{"format":"joulepath-project","version":1,"name":"x","elements":[{"id":"a","kind":"battery","__proto__":{"polluted":"yes"}}]}', /key named "__proto__"/],
    ['a constructor key', envelope({ ...riverside, constructor: { prototype: { polluted: 'yes' } } }), /key named "constructor"/],
    ['a prototype key', envelope({ ...riverside, elements: [{ id: 'a', kind: 'battery', prototype: 1 }] }), /key named "prototype"/],
    ['deep nesting', `{"format":"joulepath-project","deep":${'['.repeat(5000)}${']'.repeat(5000)}}`, /more than 32 levels deep/],
    ['too many elements', envelope({ ...riverside, elements: Array.from({ length: IMPORT_LIMITS.maxElements + 1 }, (_, i) => ({ id: `e${i}`, kind: 'dc-load' })) }), /more than 2000 elements/],
    ['a key longer than 200 characters', envelope({ ...riverside, elements: [{ id: 'a', kind: 'battery', ['k'.repeat(IMPORT_LIMITS.maxKeyLength + 1)]: 1 }] }), /keys are at most 200 characters/],
    ['a very long text', envelope({ ...riverside, name: 'x'.repeat(IMPORT_LIMITS.maxStringLength + 1) }), /characters long/],
    ['a bad project id in the envelope', envelope(riverside, { projectId: '../../etc' }), /projectId must be letters/],
    ['UTF-16 text', new Uint8Array([0xff, 0xfe, ...Array.from(enc('{}')).flatMap((b) => [b, 0])]), /UTF-16/],
    ['bytes that are not UTF-8', new Uint8Array([0x7b, 0xc3, 0x28, 0x7d]), /not UTF-8 text/],
  ];

  it.each(cases)('%s', (_label, input, message) => {
    const result = typeof input === 'string' ? parseImportBytes(enc(input)) : parseImportBytes(input);
    expect(refused(result)).toMatch(message);
  });

  it('refuses a file over the size limit before reading it', () => {
    expect(checkSize(20 * 1024 * 1024)).toMatch(/20\.0 MB.*limited to 5\.0 MB/);
    expect(checkSize(IMPORT_LIMITS.maxBytes)).toBeNull();
    expect(refused(parseImportBytes(new Uint8Array(IMPORT_LIMITS.maxBytes + 1)))).toMatch(/limited to 5\.0 MB/);
  });

  it('leaves Object.prototype untouched by a file full of prototype keys', () => {
    const before = Object.getOwnPropertyNames(Object.prototype).sort();
    for (const text of [
      '{"__proto__":{"polluted":"yes"},"format":"joulepath-project"}',
      '{"constructor":{"prototype":{"polluted":"yes"}}}',
      // A JSON text (an object literal's __proto__ would set the prototype instead of a key).
      envelope(riverside).replace('"elements":[', '"elements":[{"id":"p","kind":"battery","__proto__":{"polluted":"yes"}},'),
    ]) {
      expect(parseImportText(text).ok).toBe(false);
    }
    expect(({} as Record<string, unknown>)['polluted']).toBeUndefined();
    expect(Object.getOwnPropertyNames(Object.prototype).sort()).toEqual(before);
  });

  it('never throws, whatever the bytes (fast-check)', () => {
    fc.assert(
      fc.property(fc.uint8Array({ maxLength: 400 }), (bytes) => {
        const result = parseImportBytes(bytes);
        return result.ok ? result.project.elements.length > 0 : result.message.length > 10;
      }),
      { numRuns: 300 },
    );
    fc.assert(
      fc.property(fc.jsonValue({ maxDepth: 6 }), (value) => {
        const result = parseImportText(JSON.stringify(value));
        return result.ok || result.message.length > 10;
      }),
      { numRuns: 300 },
    );
  });

  it('decodes plain UTF-8 text', () => {
    expect(decodeText(enc('{"a":"é"}'))).toEqual({ ok: true, text: '{"a":"é"}' });
  });
});
