/**
 * Colours of the energy-flow diagram, one palette per theme (Joulepath's own: deep teal for power
 * passed on, vermilion for conversion loss, plum for idle loss, ochre for cable loss).
 *
 * Checked against WCAG 2.2 AA by tests/web/contrast.test.ts: text (ink, inkMuted) 4.5:1 on the
 * background; blocks, loss branches and the selection 3:1 (SC 1.4.11), feed and loss branches at
 * the opacity they are drawn with.
 */
export type PaintKey =
  | 'background'
  | 'band'
  | 'ink'
  | 'inkMuted'
  | 'feed'
  | 'conversion'
  | 'idle'
  | 'lineLoss'
  | 'source'
  | 'stage'
  | 'load'
  | 'selected';

export interface FlowPalette {
  colours: Record<PaintKey, string>;
  /** Opacity of the feed branches (they cross each other and the loss branches). */
  feedOpacity: number;
  /** Opacity of the loss branches. */
  lossOpacity: number;
}

export type FlowTheme = 'light' | 'dark';

export const FLOW_PALETTES: Record<FlowTheme, FlowPalette> = {
  light: {
    colours: {
      background: '#ffffff',
      band: '#f7f3f1',
      ink: '#17201d',
      inkMuted: '#45524c',
      feed: '#1f6f7e',
      conversion: '#d2452b',
      idle: '#7b3fa6',
      lineLoss: '#a87200',
      source: '#12433b',
      stage: '#3c5a66',
      load: '#2f6b2a',
      selected: '#1f6feb',
    },
    feedOpacity: 0.7,
    lossOpacity: 0.85,
  },
  dark: {
    colours: {
      background: '#171e1b',
      band: '#1f2623',
      ink: '#e6ece9',
      inkMuted: '#aab8b2',
      feed: '#4fb0c2',
      conversion: '#ff7b5e',
      idle: '#c79bf2',
      lineLoss: '#e3b341',
      source: '#5cc9a7',
      stage: '#9ab8c4',
      load: '#86cf78',
      selected: '#8ab8ff',
    },
    feedOpacity: 0.6,
    lossOpacity: 0.85,
  },
};

/** Exported files and the printed page always use the light palette (white paper). */
export const PAPER_THEME: FlowTheme = 'light';
