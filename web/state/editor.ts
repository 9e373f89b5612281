/**
 * The project being edited: a draft (plain project data), its undo/redo history, the chain
 * operations (add, insert, remove, reorder, duplicate), field edits checked by the engine's own
 * validation before they are taken in, and the solution of the draft with the last valid solved pair (project and result together).
 *
 * Rules:
 * - A field edit the engine rejects for that field (a value out of range, text where a number goes)
 *   never enters the draft: the field shows the message and the results are marked out of date.
 *   So nothing is stored from an invalid value.
 * - Structural states the engine refuses (a kind mismatch after an insert, an infeasible load) may
 *   be in the draft; their problems are listed and the last valid results stay, marked out of date.
 * - Every change goes through `edit()`, which records it for undo. Typing in one field coalesces
 *   into one undo step.
 * - No edit makes a project the import would refuse (web/storage/limits.ts: text lengths, number
 *   sizes, nesting, values and elements): a field edit past a limit is refused at the field, a chain
 *   operation past one is refused with a message, and the draft stays as it was.
 *
 * Split by job (each file says what it holds): draft.ts (the draft, its origin, undo/redo, field
 * paths), draft-limits.ts (the file's limits), field-errors.ts and field-edit.ts (engine-checked
 * field writes), tree.ts (pure reads of the tree), chain-ops.ts (the chain operations), solution.ts
 * (the draft's outcome and the last valid solved pair, `lastSolved`). This file re-exports them: the
 * page imports the editor state from here.
 */
export {
  draft,
  draftOrigin,
  selectedId,
  canUndo,
  canRedo,
  undoLabel,
  redoLabel,
  lastChange,
  draftRevision,
  openCount,
  isEditable,
  loadProject,
  renameDraft,
  closeProject,
  edit,
  undo,
  redo,
  getAt,
  setAt,
  type DraftElement,
  type DraftProject,
  type DraftOrigin,
} from './draft.ts';
export { draftLimitIssue } from './draft-limits.ts';
export { fieldErrors, fieldError, setFieldError } from './field-errors.ts';
export { problemsForField, setField } from './field-edit.ts';
export { elementName, childrenOf, rootOf, freshId, subtreeIds } from './tree.ts';
export {
  newProject,
  addBranch,
  insertAfter,
  insertBefore,
  removeElement,
  removeBranch,
  duplicate,
  moveUpstream,
  moveDownstream,
  reorderBranch,
  reattach,
  roomForElements,
  type OperationOutcome,
} from './chain-ops.ts';
export { outcome, lastSolved, draftProblems, crashMessage, resultsState } from './solution.ts';
