/**
 * "Show me the working": a figure on the page (an answer, a card's key figure) asks for the panel or
 * table that explains it. The panel's disclosure opens, scrolls into view and takes the focus; an
 * element id, when given, lets the panel point at that element's row; a figure (the `data-testid` of
 * the figure in the panel, e.g. "battery-runtime"), when given, is brought into view instead.
 */
import { signal } from '@preact/signals';

/** The study panels and results parts a request can open. */
export type PanelId = 'battery' | 'conductor' | 'machines' | 'starting' | 'project-settings' | 'standby';

export interface WorkingRequest {
  panel: PanelId;
  /** The element whose working is wanted, when the figure belongs to one. */
  elementId?: string;
  /** The `data-testid` of the figure in the panel to bring into view, when the panel has no row per element. */
  figure?: string;
  /** Distinguishes two requests for the same panel (a second tap scrolls again). */
  seq: number;
}

export const workingRequest = signal<WorkingRequest | null>(null);

let seq = 0;
/** Opens `panel` (and points at `elementId`'s row, or at `figure`, when given). */
export function showWorking(panel: PanelId, elementId?: string, figure?: string): void {
  seq += 1;
  workingRequest.value = { panel, seq, ...(elementId !== undefined ? { elementId } : {}), ...(figure !== undefined ? { figure } : {}) };
}
