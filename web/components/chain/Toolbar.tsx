/**
 * The chain editor's toolbar parts: its icons (our own, drawn on a 20 × 20 grid), the memo'd button, and the
 * words of the add menu.
 */
import { memo } from 'preact/compat';
import type { AddOperation } from '../../editor/templates.ts';

// ---------- icons (our own, drawn on a 20 × 20 grid) ----------

const ICONS: Record<string, string> = {
  after: 'M3 10h9M9 6l4 4-4 4M16 5v10',
  branch: 'M3 6h6c2 0 3 1 3 3v6M12 15l-3-3M12 15l3-3M3 6h14',
  before: 'M17 10H8M11 6l-4 4 4 4M4 5v10',
  remove: 'M5 5l10 10M15 5 5 15',
  removeBranch: 'M3 10h4M9 5l8 10M17 5l-8 10',
  duplicate: 'M4 4h8v8H4zM8 8h8v8H8z',
  up: 'M10 16V4M5 9l5-5 5 5',
  down: 'M10 4v12M5 11l5 5 5-5',
  left: 'M16 10H4M9 5l-5 5 5 5',
  right: 'M4 10h12M11 5l5 5-5 5',
  undo: 'M7 5 3 9l4 4M3 9h9a5 5 0 0 1 0 10h-2',
  redo: 'M13 5l4 4-4 4M17 9H8a5 5 0 0 0 0 10h2',
};

const Icon = memo(function Icon({ name }: { name: keyof typeof ICONS }) {
  return (
    <svg class="editor-icon" viewBox="0 0 20 20" width="20" height="20" aria-hidden="true" focusable="false">
      <path d={ICONS[name]} fill="none" stroke="currentColor" stroke-width="1.8" stroke-linecap="round" stroke-linejoin="round" />
    </svg>
  );
});

/** What a toolbar button does (ChainEditor's `act` carries it out). */
export type ToolAction = 'undo' | 'redo' | AddOperation | 'duplicate' | 'upstream' | 'downstream' | 'branchUp' | 'branchDown' | 'remove' | 'removeBranch';

/**
 * memo: every prop is a plain value and `onAct` keeps one identity, so an edit elsewhere (typing in
 * a stage form) re-renders only the buttons whose state changed.
 */
export const ToolButton = memo(function ToolButton(props: {
  icon: keyof typeof ICONS;
  label: string;
  action: ToolAction;
  onAct: (action: ToolAction, ev: MouseEvent) => void;
  disabled?: boolean;
  title?: string;
  testId?: string;
  expanded?: boolean;
}) {
  return (
    <button
      type="button"
      class="editor-tool"
      onClick={(ev) => props.onAct(props.action, ev)}
      disabled={props.disabled}
      title={props.title}
      data-testid={props.testId}
      aria-expanded={props.expanded}
    >
      <Icon name={props.icon} />
      <span>{props.label}</span>
    </button>
  );
});

export const ADD_WORDS: Record<AddOperation, { button: string; heading: (name: string) => string }> = {
  after: { button: 'Add after', heading: (n) => `Add after ${n}` },
  branch: { button: 'Add branch', heading: (n) => `New branch from ${n}` },
  before: { button: 'Insert before', heading: (n) => `Insert before ${n}` },
};

export const NOTHING_OFFERED: Record<AddOperation, string> = {
  after: 'Nothing can follow here: a load feeds nothing, and whatever follows must suit what comes after it.',
  branch: 'No branch can start here: a load feeds nothing, and a motor shaft drives one load.',
  before: 'Nothing can go before the source: the chain starts there.',
};
