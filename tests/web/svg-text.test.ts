// Names holding characters XML 1.0 forbids export as valid SVG (issue 15, point 12). The allowed set is
// XML 1.0 (Fifth Edition) §2.2, production [2] Char: #x9 | #xA | #xD | [#x20-#xD7FF] | [#xE000-#xFFFD] |
// [#x10000-#x10FFFF]. The browser check (DOMParser on the exported file) is in tests/browser/hostile-page.test.ts.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { xmlSafeText } from '../../web/components/xml-text.ts';

/** XML 1.0 §2.2 Char, code point by code point. */
const xmlChar = (cp: number) => cp === 0x9 || cp === 0xa || cp === 0xd || (cp >= 0x20 && cp <= 0xd7ff) || (cp >= 0xe000 && cp <= 0xfffd) || (cp >= 0x10000 && cp <= 0x10ffff);
const allXml = (text: string) => [...text].every((ch) => xmlChar(ch.codePointAt(0)!));

describe('xmlSafeText', () => {
  it('leaves out C0 controls other than tab, line feed and carriage return, U+FFFE and U+FFFF', () => {
    expect(xmlSafeText('Pump\u0000 1\u0007\u001F\uFFFE\uFFFF')).toBe('Pump 1');
    expect(xmlSafeText('tab\tnew\nline\rok')).toBe('tab\tnew\nline\rok');
    expect(xmlSafeText('Lüfter 2 — 3 kW 🔌')).toBe('Lüfter 2 — 3 kW 🔌');
  });

  it('leaves out unpaired surrogates and keeps pairs', () => {
    expect(xmlSafeText('a\uD800b\uDC00c\uD83D\uDD0C')).toBe('abc\uD83D\uDD0C');
  });

  it('always gives XML 1.0 characters only, and changes nothing that already is (fast-check)', () => {
    fc.assert(
      fc.property(fc.string({ unit: 'binary' }), (text) => {
        const safe = xmlSafeText(text);
        expect(allXml(safe)).toBe(true);
        if (allXml(text)) expect(safe).toBe(text);
      }),
      { numRuns: 2000 },
    );
  });
});
