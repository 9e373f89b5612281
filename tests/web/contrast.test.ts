// Colour contrast of the page's themes against WCAG 2.2 AA: 4.5:1 for text (Success Criterion
// 1.4.3, Contrast (Minimum)) and 3:1 for user-interface components and focus indicators (SC 1.4.11,
// Non-text Contrast). The ratio is the WCAG 2.2 definition (relative luminance of sRGB); the colours
// are read from web/styles.css itself, so a change there is checked here.
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { contrastRatio, parseHex, relativeLuminance } from '../../web/format/contrast.ts';

const css = readFileSync(new URL('../../web/styles.css', import.meta.url), 'utf8');

/** The custom properties declared with a hex colour in the first block that opens with `selector {`. */
function palette(selector: string): Record<string, string> {
  const start = css.indexOf(`${selector} {`);
  if (start < 0) throw new Error(`no ${selector} block in styles.css`);
  const block = css.slice(start, css.indexOf('}', start));
  const out: Record<string, string> = {};
  for (const m of block.matchAll(/--([a-z-]+):\s*(#[0-9a-f]{3,6})\s*;/gi)) out[m[1]!] = m[2]!;
  return out;
}

const THEMES = { light: palette(':root'), dark: palette(":root[data-theme='dark']") };

/** [foreground, background] pairs that carry text. */
const TEXT_PAIRS: [string, string][] = [
  ['ink', 'bg'],
  ['ink', 'surface'],
  ['ink', 'stripe'],
  ['ink', 'total-bg'],
  ['ink', 'current-bg'],
  ['ink', 'code-bg'],
  ['ink', 'control-bg'],
  ['ink-muted', 'bg'],
  ['ink-muted', 'surface'],
  ['ink-muted', 'stripe'],
  ['ink-muted', 'total-bg'],
  ['ink-muted', 'current-bg'],
  ['brand-ink', 'brand'],
  ['link', 'bg'],
  ['link', 'surface'],
  ['warn-ink', 'warn-bg'],
  ['error-ink', 'error-bg'],
  ['in-ink', 'in-bg'],
  ['out-ink', 'out-bg'],
];

/** [component, background] pairs: control borders, the chosen item's border, focus rings. */
const COMPONENT_PAIRS: [string, string][] = [
  ['line-strong', 'surface'],
  ['line-strong', 'bg'],
  ['line-strong', 'control-bg'],
  ['current-line', 'current-bg'],
  ['current-line', 'surface'],
  ['focus', 'bg'],
  ['focus', 'surface'],
  ['focus', 'stripe'],
  ['accent', 'brand'],
  ['error-line', 'error-bg'],
  ['warn-line', 'warn-bg'],
];

describe('the WCAG 2.2 contrast ratio', () => {
  it('black on white is 21:1 and a colour on itself 1:1 (WCAG 2.2, definition of contrast ratio)', () => {
    expect(contrastRatio('#000000', '#ffffff')).toBeCloseTo(21, 10);
    expect(contrastRatio('#fff', '#000')).toBeCloseTo(21, 10);
    expect(contrastRatio('#777777', '#777777')).toBe(1);
  });

  it('relative luminance of the sRGB primaries is their coefficient (WCAG 2.2, relative luminance)', () => {
    expect(relativeLuminance('#ff0000')).toBeCloseTo(0.2126, 12);
    expect(relativeLuminance('#00ff00')).toBeCloseTo(0.7152, 12);
    expect(relativeLuminance('#0000ff')).toBeCloseTo(0.0722, 12);
  });

  it('#767676 on white is 4.54:1, the lightest grey that passes AA (WebAIM contrast checker, from memory)', () => {
    expect(contrastRatio('#767676', '#ffffff')).toBeCloseTo(4.54, 2);
    expect(contrastRatio('#777777', '#ffffff')).toBeLessThan(4.5);
  });

  it('refuses what is not a hex colour', () => {
    expect(() => parseHex('red')).toThrow(/Not a #rgb/);
    expect(parseHex('#0a0')).toEqual([0, 170, 0]);
  });
});

describe.each(Object.entries(THEMES))('the %s theme', (name, colours) => {
  it('declares every colour the checks name', () => {
    const names = new Set([...TEXT_PAIRS, ...COMPONENT_PAIRS].flat());
    for (const n of names) expect(colours[n], `--${n} in the ${name} theme`).toMatch(/^#/);
  });

  it.each(TEXT_PAIRS)('text --%s on --%s reaches 4.5:1 (WCAG 2.2 SC 1.4.3)', (fg, bg) => {
    expect(contrastRatio(colours[fg]!, colours[bg]!)).toBeGreaterThanOrEqual(4.5);
  });

  it.each(COMPONENT_PAIRS)('component --%s on --%s reaches 3:1 (WCAG 2.2 SC 1.4.11)', (fg, bg) => {
    expect(contrastRatio(colours[fg]!, colours[bg]!)).toBeGreaterThanOrEqual(3);
  });
});

// The energy-flow diagram's palettes (web/components/flow-palette.ts): text 4.5:1 (SC 1.4.3) on the
// diagram's background and on the loss band; blocks, loss branches and the selection 3:1 (SC 1.4.11);
// branches checked at the opacity they are drawn with (alpha compositing over the background).
import { FLOW_PALETTES, PAPER_THEME } from '../../web/components/flow-palette.ts';
import { blend } from '../../web/format/contrast.ts';

describe('blend', () => {
  it('gives the background at 0, the colour at 1 and the channel mean at 0.5 (source-over compositing)', () => {
    expect(blend('#204060', '#ffffff', 0)).toBe('#ffffff');
    expect(blend('#204060', '#ffffff', 1)).toBe('#204060');
    expect(blend('#000000', '#ffffff', 0.5)).toBe('#808080'); // 127.5 rounds to 128
  });
});

describe.each(Object.entries(FLOW_PALETTES))('the %s energy-flow palette', (_name, p) => {
  const c = p.colours;
  it.each([
    ['ink', 'background'],
    ['inkMuted', 'background'],
    ['ink', 'band'],
    ['inkMuted', 'band'],
  ] as const)('text %s on %s reaches 4.5:1 (WCAG 2.2 SC 1.4.3)', (fg, bg) => {
    expect(contrastRatio(c[fg], c[bg])).toBeGreaterThanOrEqual(4.5);
  });

  it.each(['source', 'stage', 'load', 'conversion', 'idle', 'lineLoss', 'selected'] as const)('block or key colour %s reaches 3:1 on the background and the band (SC 1.4.11)', (k) => {
    expect(contrastRatio(c[k], c.background)).toBeGreaterThanOrEqual(3);
    expect(contrastRatio(c[k], c.band)).toBeGreaterThanOrEqual(3);
  });

  it('draws feed branches at 3:1 and loss branches at 3:1 over the background at their opacity (SC 1.4.11)', () => {
    expect(contrastRatio(blend(c.feed, c.background, p.feedOpacity), c.background)).toBeGreaterThanOrEqual(3);
    for (const k of ['conversion', 'idle', 'lineLoss'] as const) {
      expect(contrastRatio(blend(c[k], c.band, p.lossOpacity), c.band), k).toBeGreaterThanOrEqual(3);
    }
  });

  it('keeps the feed, idle, conversion and cable colours apart from each other', () => {
    const keys = ['feed', 'idle', 'conversion', 'lineLoss'] as const;
    expect(new Set(keys.map((k) => c[k])).size).toBe(keys.length);
  });
});

it('exports and prints in the light palette (white paper)', () => {
  expect(PAPER_THEME).toBe('light');
  expect(FLOW_PALETTES[PAPER_THEME].colours.background).toBe('#ffffff');
});
