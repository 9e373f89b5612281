/**
 * "Show me the working": a figure on the page (an answer, a card's key figure) asks for the panel or
 * table that explains it. The panel's disclosure opens, scrolls into view and takes the focus; an
 * element id, when given, lets the panel point at that element's row.
 */
import { signal } from '@preact/signals';

/** The study panels and results parts a request can open. */
export type PanelId = 'battery' | 'conductor' | 'machines' | 'starting' | 'project-settings';

export interface WorkingRequest {
  panel: PanelId;
  /** The element whose working is wanted, when the figure belongs to one. */
  elementId?: string;
  /** Distinguishes two requests for the same panel (a second tap scrolls again). */
  seq: number;
}

export const workingRequest = signal<WorkingRequest | null>(null);

let seq = 0;
/** Opens `panel` (and points at `elementId`, when given). */
export function showWorking(panel: PanelId, elementId?: string): void {
  seq += 1;
  workingRequest.value = elementId === undefined ? { panel, seq } : { panel, elementId, seq };
}
