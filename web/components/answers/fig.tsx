/**
 * A figure of the answers (strip, cards) as a button that opens its working, and the opening itself:
 * a study panel through `showWorking` (web/state/working.ts), or a results part (the element table,
 * the warnings) scrolled to and focused.
 */
import type { ComponentChildren } from 'preact';
import { showWorking, type PanelId } from '../../state/working.ts';

/** Where a figure's working is: a study panel (with the element or figure to point at) or a results part. */
export type WorkingTarget = { panel: PanelId; elementId?: string; figure?: string } | { results: string; elementId?: string };

/** Opens a figure's working. Results parts (the element table, the warnings) are scrolled to and focused. */
export function openWorking(target: WorkingTarget): void {
  if ('panel' in target) {
    showWorking(target.panel, target.elementId, target.figure);
    return;
  }
  const part = document.querySelector<HTMLElement>(`[data-testid="${target.results}"]`);
  if (!part) return;
  const row = target.elementId !== undefined ? part.querySelector<HTMLElement>(`[data-element-id="${CSS.escape(target.elementId)}"]`) : null;
  const at = row ?? part;
  at.scrollIntoView({ block: 'center' });
  if (!at.hasAttribute('tabindex')) at.tabIndex = -1;
  at.focus({ preventScroll: true });
}

/**
 * One figure as a button that opens its working; `label` (the figure's label beside it) names it in
 * the tooltip. `state`: "working" while its study runs, "updating" while a newer one is on its way.
 */
export function Fig({ label, children, to, state, testId }: { label: string; children: ComponentChildren; to: WorkingTarget; state?: 'updating' | 'working' | undefined; testId?: string }) {
  return (
    <button
      type="button"
      class={state ? `answer__fig answer__fig--${state}` : 'answer__fig'}
      onClick={() => openWorking(to)}
      aria-busy={state ? 'true' : undefined}
      data-testid={testId}
      title={`${label}: show the working`}
    >
      {children}
      {state === 'updating' && <span class="visually-hidden"> (updating)</span>}
    </button>
  );
}
