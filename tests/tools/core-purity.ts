/**
 * Static rules that keep core/ a pure engine (see the architecture notes): no DOM, no storage, no
 * network, no clock, nothing from web/, and Node only in the command-line entry core/cli/cli.ts.
 * Checked on the code with comments and string/template text blanked out, so prose such as
 * "documented" or a message mentioning a window does not trip them.
 */

export interface PurityViolation {
  file: string;
  line: number;
  rule: string;
  text: string;
}

interface Rule {
  name: string;
  pattern: RegExp;
  /** True when the rule also applies to core/cli/cli.ts. */
  appliesToCli: boolean;
}

const CODE_RULES: Rule[] = [
  { name: 'browser global (DOM)', pattern: /(?<![\w$.])(document|window|navigator)\s*[.[]/, appliesToCli: true },
  { name: 'browser storage', pattern: /(?<![\w$.])(localStorage|sessionStorage|indexedDB|caches)(?![\w$])/, appliesToCli: true },
  { name: 'network (fetch)', pattern: /(?<![\w$.])fetch\s*\(/, appliesToCli: true },
  { name: 'clock (Date.now)', pattern: /(?<![\w$])Date\s*\.\s*now(?![\w$])/, appliesToCli: true },
  { name: 'clock (new Date())', pattern: /new\s+Date\s*\(\s*\)/, appliesToCli: false },
  { name: 'clock (performance.now)', pattern: /(?<![\w$.])performance\s*\.\s*now/, appliesToCli: false },
  { name: 'Node process object outside cli.ts', pattern: /(?<![\w$.])process\s*\./, appliesToCli: false },
];

const NODE_BUILTINS = new Set([
  'fs', 'fs/promises', 'path', 'os', 'child_process', 'url', 'util', 'process', 'crypto', 'http',
  'https', 'net', 'stream', 'worker_threads', 'readline', 'module', 'events', 'buffer', 'timers',
]);

/**
 * Blanks comments and the text of string and template literals (keeping `${…}` expressions and
 * line breaks), so line numbers stay right. Also returns every static module specifier.
 */
export function codeOnly(source: string): { code: string; specifiers: { spec: string; line: number }[] } {
  let out = '';
  const specifiers: { spec: string; line: number }[] = [];
  let line = 1;
  let i = 0;
  // Stack of open template literals: each entry is the brace depth at which its `${` opened.
  const templates: number[] = [];
  let braceDepth = 0;
  const blank = (ch: string) => (ch === '\n' ? '\n' : ' ');
  const n = source.length;
  while (i < n) {
    const ch = source[i]!;
    const next = source[i + 1];
    if (ch === '\n') line++;
    if (ch === '/' && next === '/') {
      while (i < n && source[i] !== '\n') { out += ' '; i++; }
      continue;
    }
    if (ch === '/' && next === '*') {
      out += '  '; i += 2;
      while (i < n && !(source[i] === '*' && source[i + 1] === '/')) {
        if (source[i] === '\n') line++;
        out += blank(source[i]!); i++;
      }
      out += '  '; i += 2;
      continue;
    }
    if (ch === '"' || ch === "'") {
      const startLine = line;
      let text = '';
      out += ch; i++;
      while (i < n && source[i] !== ch && source[i] !== '\n') {
        if (source[i] === '\\') { text += source[i + 1] ?? ''; out += '  '; i += 2; continue; }
        text += source[i]; out += ' '; i++;
      }
      out += ch; i++;
      // A string right after `from`, `import(` or `import` is a module specifier.
      if (/(\bfrom|\bimport\s*\(|\bimport)\s*$/.test(out.slice(0, out.length - text.length - 2).slice(-40))) {
        specifiers.push({ spec: text, line: startLine });
      }
      continue;
    }
    if (ch === '`' || (ch === '}' && templates.length > 0 && templates[templates.length - 1] === braceDepth)) {
      if (ch === '}') { templates.pop(); }
      out += ch; i++;
      while (i < n && source[i] !== '`') {
        if (source[i] === '\\') { out += '  '; i += 2; continue; }
        if (source[i] === '$' && source[i + 1] === '{') { templates.push(braceDepth); out += '${'; i += 2; break; }
        if (source[i] === '\n') line++;
        out += blank(source[i]!); i++;
      }
      if (source[i] === '`') { out += '`'; i++; }
      continue;
    }
    if (ch === '{') braceDepth++;
    if (ch === '}') braceDepth--;
    out += ch; i++;
  }
  return { code: out, specifiers };
}

/** Every rule broken by one file of core/ (`file` is its path relative to the repository). */
export function checkCoreFile(file: string, source: string): PurityViolation[] {
  const isCli = /(^|\/)core\/cli\/cli\.ts$/.test(file);
  const { code, specifiers } = codeOnly(source);
  const found: PurityViolation[] = [];
  const lines = code.split('\n');
  const original = source.split('\n');
  lines.forEach((text, idx) => {
    for (const rule of CODE_RULES) {
      if (!isCli || rule.appliesToCli) {
        if (rule.pattern.test(text)) {
          found.push({ file, line: idx + 1, rule: rule.name, text: (original[idx] ?? '').trim() });
        }
      }
    }
  });
  for (const { spec, line } of specifiers) {
    const text = (original[line - 1] ?? '').trim();
    if (/(^|\/)web(\/|$)/.test(spec)) found.push({ file, line, rule: 'imports from web/', text });
    const bare = spec.replace(/^node:/, '');
    if (!isCli && (spec.startsWith('node:') || NODE_BUILTINS.has(bare))) {
      found.push({ file, line, rule: 'Node built-in module outside cli.ts', text });
    }
  }
  return found;
}
