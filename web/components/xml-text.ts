/**
 * Text fit for an XML 1.0 file (the exported SVG). Pure: no DOM, so the Node tests check it directly;
 * flow-draw.ts applies it to every text and attribute of the exported drawing.
 */

/**
 * `text` without the characters XML 1.0 forbids (Char production, XML 1.0 §2.2: C0 controls other
 * than tab, line feed and carriage return; U+FFFE, U+FFFF; unpaired surrogates). A name typed or
 * imported with such a character still exports as an SVG file every reader opens.
 */
export function xmlSafeText(text: string): string {
  return text.replace(/[\u0000-\u0008\u000B\u000C\u000E-\u001F\uFFFE\uFFFF]|[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?<![\uD800-\uDBFF])[\uDC00-\uDFFF]/g, '');
}
