/**
 * Which chain operations fit the selected card, so the toolbar offers only those (web/state/chain-ops.ts
 * refuses the others, web/editor/templates.ts says what can be added where): nothing that would only
 * be refused, and no add button that would open an empty chooser (no "Add after" on a load, no
 * "Insert before" on the source). Pure: read from the draft alone.
 */
import { bankOnBusTemplate, offeredTemplates } from '../../editor/templates.ts';
import { addBranch, childrenOf, type DraftProject, type OperationOutcome } from '../../state/editor.ts';
import type { ToolAction } from './Toolbar.tsx';

/** The card operations in the order the toolbar shows them (undo and redo are the editor's, not a card's). */
export type CardAction = Exclude<ToolAction, 'undo' | 'redo'>;

export const CARD_ACTIONS: readonly CardAction[] = ['after', 'branch', 'remove', 'addBank', 'before', 'duplicate', 'upstream', 'downstream', 'branchUp', 'branchDown', 'removeBranch'];

/** The first buttons shown on the card's toolbar when they fit; the others go to its "More" menu. */
export const PRIMARY_ACTIONS: readonly CardAction[] = ['after', 'branch', 'remove'];

/** The operations that fit element `id` of `p`, in toolbar order. */
export function fittingActions(p: DraftProject, id: string): CardAction[] {
  const target = p.elements.find((e) => e.id === id);
  if (!target) return [];
  const byId = new Map(p.elements.map((e) => [e.id, e]));
  const kids = childrenOf(p, id);
  const feeder = target.from !== undefined ? byId.get(target.from) : undefined;
  const siblings = feeder ? childrenOf(p, feeder.id) : [];
  const at = siblings.findIndex((e) => e.id === id);
  // As chain-ops.ts: the source is never removed, duplicated or moved; a swap with the feeder needs a
  // feeder that is not the source and feeds this card alone; a swap with the next card needs one next card.
  const notSource = target.from !== undefined;
  const fits: Record<CardAction, () => boolean> = {
    after: () => offeredTemplates(p, 'after', id).length > 0,
    branch: () => offeredTemplates(p, 'branch', id).length > 0,
    before: () => notSource && offeredTemplates(p, 'before', id).length > 0,
    remove: () => notSource,
    addBank: () => bankOnBusTemplate(p, id) !== null,
    removeBranch: () => notSource && kids.length > 0,
    duplicate: () => notSource,
    upstream: () => feeder !== undefined && feeder.from !== undefined && siblings.length === 1,
    downstream: () => notSource && kids.length === 1,
    branchUp: () => feeder !== undefined && at > 0,
    branchDown: () => feeder !== undefined && at >= 0 && at < siblings.length - 1,
  };
  return CARD_ACTIONS.filter((a) => fits[a]());
}

/**
 * "Add a battery bank on this bus" (issue 19): the bank preset of web/editor/templates.ts as a branch of
 * the DC bus; refused where the card does not offer it (no DC bus, or a bank already on a bus).
 */
export function addBankOnBus(p: DraftProject, busId: string): OperationOutcome {
  const bank = bankOnBusTemplate(p, busId);
  if (!bank) return { ok: false, message: 'A battery bank goes on a DC bus of a chain fed from a supply, one bank on a bus per project.' };
  return addBranch(busId, bank);
}
