// Every style sheet of the page closes each block it opens. CSS closes open blocks at the end of the file
// (CSS Syntax 3, §5.4), so an unclosed `@media (max-width: 600px) {` is no build error: every rule after it
// silently applies only inside that media query. Checks this repository's files (no external source).
import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';

const repoRoot = join(import.meta.dirname, '..', '..');

function cssFiles(dir: string): string[] {
  return readdirSync(dir, { withFileTypes: true }).flatMap((entry) => {
    const path = join(dir, entry.name);
    if (entry.isDirectory()) return cssFiles(path);
    return entry.name.endsWith('.css') ? [path] : [];
  });
}

/** Lines where the block depth goes below zero, and the depth left open at the end. */
export function blockDepth(css: string): { open: number; extraClose: number[] } {
  const text = css.replace(/\/\*[\s\S]*?\*\//g, (c) => c.replace(/[^\n]/g, ' ')).replace(/"(?:[^"\\\n]|\\.)*"|'(?:[^'\\\n]|\\.)*'/g, (q) => q.replace(/[{}]/g, ' '));
  let depth = 0;
  const extraClose: number[] = [];
  text.split('\n').forEach((line, i) => {
    for (const ch of line) {
      if (ch === '{') depth += 1;
      else if (ch === '}') {
        depth -= 1;
        if (depth < 0) {
          extraClose.push(i + 1);
          depth = 0;
        }
      }
    }
  });
  return { open: depth, extraClose };
}

describe('style sheets close their blocks', () => {
  it('finds an open block and a stray brace (made-up sheets)', () => {
    expect(blockDepth('@media (max-width: 600px) {\n  .a { color: red; }\n.b { color: blue; }\n').open).toBe(1);
    expect(blockDepth('.a { content: "}"; }\n/* { */\n').open).toBe(0);
    expect(blockDepth('.a { }\n}\n').extraClose).toEqual([2]);
  });
  const sheets = cssFiles(join(repoRoot, 'web'));
  it('the page has style sheets to check', () => expect(sheets.length).toBeGreaterThan(3));
  it.each(sheets.map((f) => [f.slice(repoRoot.length + 1), f]))('%s', (_name, file) => {
    expect(blockDepth(readFileSync(file, 'utf8'))).toEqual({ open: 0, extraClose: [] });
  });
});
