/**
 * WCAG 2.2 contrast ratio between two sRGB colours, for checking the theme's colour pairs.
 * Method: WCAG 2.2 (W3C Recommendation, 2023), definitions "relative luminance" and "contrast
 * ratio": each 8-bit channel c/255 is linearised (c ≤ 0.04045 ? c/12.92 : ((c+0.055)/1.055)^2.4),
 * L = 0.2126 R + 0.7152 G + 0.0722 B, ratio = (L1 + 0.05) / (L2 + 0.05) with L1 the lighter.
 * (WCAG writes the threshold 0.03928; IEC 61966-2-1 sRGB has 0.04045; no 8-bit value lies between.)
 */

/** Parses "#rgb" or "#rrggbb" into 0–255 channels; throws on anything else. */
export function parseHex(colour: string): [number, number, number] {
  const m = /^#([0-9a-f]{3}|[0-9a-f]{6})$/i.exec(colour.trim());
  if (!m) throw new Error(`Not a #rgb or #rrggbb colour: ${colour}`);
  const hex = m[1]!.length === 3 ? [...m[1]!].map((c) => c + c).join('') : m[1]!;
  return [0, 2, 4].map((i) => parseInt(hex.slice(i, i + 2), 16)) as [number, number, number];
}

function linear(channel: number): number {
  const c = channel / 255;
  return c <= 0.04045 ? c / 12.92 : ((c + 0.055) / 1.055) ** 2.4;
}

/** Relative luminance, 0 (black) to 1 (white). */
export function relativeLuminance(colour: string): number {
  const [r, g, b] = parseHex(colour);
  return 0.2126 * linear(r) + 0.7152 * linear(g) + 0.0722 * linear(b);
}

/** Contrast ratio, 1 to 21. */
export function contrastRatio(a: string, b: string): number {
  const la = relativeLuminance(a);
  const lb = relativeLuminance(b);
  return (Math.max(la, lb) + 0.05) / (Math.min(la, lb) + 0.05);
}

/**
 * The colour seen when `fg` is painted at `alpha` opacity over `bg` (simple alpha compositing,
 * "source over", per 8-bit channel, rounded), as #rrggbb.
 */
export function blend(fg: string, bg: string, alpha: number): string {
  const f = parseHex(fg);
  const b = parseHex(bg);
  return `#${f.map((x, i) => Math.round(alpha * x + (1 - alpha) * b[i]!).toString(16).padStart(2, '0')).join('')}`;
}
