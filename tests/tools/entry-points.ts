/**
 * The page reads the engine through its entry points only (see DEVELOPERS.md, "Entry points"):
 * web/ and service-worker/ may import from `core/page.ts` (what the main thread needs) and
 * `core/studies/index.ts` (the studies, loaded on demand), never from another file of core/.
 * The entry files are re-exports only, and nothing the page loads at start imports a study, so
 * study code stays in lazy chunks. Checked on the code with comments and string text blanked out
 * (`codeOnly`, which keeps every character's place, so a specifier is read back from the source).
 */
import { existsSync, readFileSync } from 'node:fs';
import { dirname, join, normalize } from 'node:path';
import { codeOnly } from './core-purity.ts';

/** The files of core/ that web/ and service-worker/ may import. */
export const ENTRY_POINTS: readonly string[] = ['core/page.ts', 'core/studies/index.ts'];

/** Where study code lives: nothing the page loads at start may reach it. */
export const STUDIES = 'core/studies/';

export type ImportKind = 'static' | 'type' | 'dynamic';

export interface ImportRef {
  spec: string;
  line: number;
  kind: ImportKind;
}

/**
 * Every module specifier of a source with how it is imported: `import type` / `export type` is
 * `type` (erased, loads nothing), `import('…')` is `dynamic` (a lazy chunk), anything else (named,
 * default, namespace, side-effect import, `export … from`) is `static`.
 */
export function importsOf(source: string): ImportRef[] {
  const { code } = codeOnly(source);
  const found: ImportRef[] = [];
  const lineAt = (pos: number) => code.slice(0, pos).split('\n').length;
  const specAt = (quotePos: number) => {
    const quote = source[quotePos]!;
    const end = source.indexOf(quote, quotePos + 1);
    return source.slice(quotePos + 1, end);
  };
  const patterns: { re: RegExp; kind: (m: RegExpExecArray) => ImportKind }[] = [
    { re: /\b(import|export)\s+(type\s+)?[^;'"`()]*?\bfrom\s*(['"])/g, kind: (m) => (m[2] ? 'type' : 'static') },
    { re: /(?<![\w$.])import\s*(['"])/g, kind: () => 'static' },
    { re: /(?<![\w$.])import\s*\(\s*(['"])/g, kind: () => 'dynamic' },
  ];
  for (const { re, kind } of patterns) {
    for (const m of code.matchAll(re)) {
      const quotePos = m.index + m[0].length - 1;
      found.push({ spec: specAt(quotePos), line: lineAt(m.index), kind: kind(m) });
    }
  }
  return found.sort((a, b) => a.line - b.line);
}

/** The repository path an import of `file` names, or undefined for a package or built-in. */
export function resolveImport(file: string, spec: string): string | undefined {
  if (!spec.startsWith('.')) return undefined;
  return normalize(join(dirname(file), spec)).split('\\').join('/');
}

export interface EntryViolation {
  file: string;
  line: number;
  imports: string;
}

/** Every import of one web/ or service-worker/ file that names a core/ file other than an entry point. */
export function checkEntryImports(file: string, source: string): EntryViolation[] {
  return importsOf(source).flatMap(({ spec, line }) => {
    const target = resolveImport(file, spec);
    if (target === undefined || !target.startsWith('core/') || ENTRY_POINTS.includes(target)) return [];
    return [{ file, line, imports: target }];
  });
}

/** What an entry file holds besides `export … from '…';` statements (empty when re-exports only). */
export function notReexports(source: string): string {
  return codeOnly(source)
    .code.replace(/\bexport\s+(type\s+)?(\*|\{[^}]*\})\s*from\s*(['"])\s*\3\s*;/g, '')
    .trim();
}

/**
 * Every file of the repository that `start` loads through static imports (type-only imports and
 * `import()` are not followed unless `followDynamic`), `start` included. Only source files are
 * read; JSON, CSS and packages end the walk.
 */
export function staticClosure(repoRoot: string, start: string, followDynamic = false): Set<string> {
  const seen = new Set<string>();
  const stack = [start];
  while (stack.length > 0) {
    const file = stack.pop()!;
    if (seen.has(file)) continue;
    seen.add(file);
    if (!/\.(ts|tsx|mts|js|mjs)$/.test(file)) continue;
    const path = join(repoRoot, file);
    if (!existsSync(path)) throw new Error(`${file} is imported but does not exist`);
    for (const ref of importsOf(readFileSync(path, 'utf8'))) {
      if (ref.kind === 'type' || (ref.kind === 'dynamic' && !followDynamic)) continue;
      const target = resolveImport(file, ref.spec);
      if (target !== undefined) stack.push(target);
    }
  }
  return seen;
}
