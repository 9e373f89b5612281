// The headers file for static hosts (web/public/_headers, issue 15, point 12) carries the same
// Content-Security-Policy as the <meta> in web/index.html plus frame-ancestors 'none', and
// X-Frame-Options: DENY. frame-ancestors is ignored in a <meta> policy (W3C Content Security Policy
// Level 3, the frame-ancestors directive; WHATWG HTML, the http-equiv "Content security policy" state:
// the meta policy must not contain frame-ancestors), so only a header can carry it. The _headers
// syntax (a path line, then indented "Name: value" lines) is Netlify's and Cloudflare Pages' documented
// format (reference: their docs).
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';

const root = new URL('../..', import.meta.url);
const html = readFileSync(new URL('web/index.html', root), 'utf8');
const headersFile = readFileSync(new URL('web/public/_headers', root), 'utf8');

/** A policy as a map: directive → its sources in order. */
function directives(policy: string): Map<string, string[]> {
  const out = new Map<string, string[]>();
  for (const part of policy.split(';')) {
    const [name, ...sources] = part.trim().split(/\s+/);
    if (name) out.set(name.toLowerCase(), sources);
  }
  return out;
}

function metaPolicy(): string {
  const match = /<meta\s+http-equiv="Content-Security-Policy"\s+content="([^"]+)"/.exec(html);
  if (!match) throw new Error('web/index.html has no Content-Security-Policy meta');
  return match[1]!;
}

/** Header name → value for the "/*" block of the _headers file. */
function headersForAll(): Map<string, string> {
  const out = new Map<string, string>();
  let inAll = false;
  for (const line of headersFile.split('\n')) {
    if (line.startsWith('#') || line.trim() === '') continue;
    if (!/^\s/.test(line)) {
      inAll = line.trim() === '/*';
      continue;
    }
    const at = line.indexOf(':');
    if (inAll && at > 0) out.set(line.slice(0, at).trim().toLowerCase(), line.slice(at + 1).trim());
  }
  return out;
}

describe('hosting headers', () => {
  it('the headers file\'s policy is the page\'s <meta> policy plus frame-ancestors \'none\'', () => {
    const header = headersForAll().get('content-security-policy');
    expect(header).toBeDefined();
    const fromHeader = directives(header!);
    const fromMeta = directives(metaPolicy());
    expect(fromHeader.get('frame-ancestors')).toEqual(["'none'"]);
    fromHeader.delete('frame-ancestors');
    expect(fromHeader).toEqual(fromMeta);
    expect(fromMeta.has('frame-ancestors')).toBe(false);
  });

  it('forbids framing for browsers that read only X-Frame-Options', () => {
    expect(headersForAll().get('x-frame-options')).toBe('DENY');
  });
});
