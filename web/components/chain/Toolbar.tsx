/**
 * The chain editor's toolbar parts: its icons (our own, drawn on a 20 × 20 grid), the memo'd button, the
 * "More" menu (the fitting operations that are not on the toolbar itself), and the words of the add menu.
 */
import { useSignal } from '@preact/signals';
import { memo } from 'preact/compat';
import { useLayoutEffect, useRef } from 'preact/hooks';
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
  more: 'M4 10h.01M10 10h.01M16 10h.01',
};

const Icon = memo(function Icon({ name }: { name: keyof typeof ICONS }) {
  return (
    <svg class="editor-icon" viewBox="0 0 20 20" width="20" height="20" aria-hidden="true" focusable="false">
      <path d={ICONS[name]} fill="none" stroke="currentColor" stroke-width="1.8" stroke-linecap="round" stroke-linejoin="round" />
    </svg>
  );
});

/** What a toolbar button does (ChainEditor's `act` carries it out). */
export type ToolAction = 'undo' | 'redo' | AddOperation | 'addBank' | 'duplicate' | 'upstream' | 'downstream' | 'branchUp' | 'branchDown' | 'remove' | 'removeBranch';

/**
 * memo: every prop is a plain value and `onAct` keeps one identity, so an edit elsewhere (typing in
 * a stage form) re-renders only the buttons whose state changed.
 */
export const ToolButton = memo(function ToolButton(props: {
  icon: keyof typeof ICONS;
  label: string;
  action: ToolAction;
  onAct: (action: ToolAction, opener: HTMLElement | null) => void;
  disabled?: boolean;
  title?: string;
  testId?: string;
  expanded?: boolean;
}) {
  return (
    <button
      type="button"
      class="editor-tool"
      onClick={(ev) => props.onAct(props.action, ev.currentTarget)}
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

/** Each card operation's button: icon, words, test id. */
export const TOOL_WORDS: Record<Exclude<ToolAction, 'undo' | 'redo'>, { icon: keyof typeof ICONS; label: string; testId: string }> = {
  after: { icon: 'after', label: 'Add after', testId: 'op-add-after' },
  branch: { icon: 'branch', label: 'Add branch', testId: 'op-add-branch' },
  before: { icon: 'before', label: 'Insert before', testId: 'op-insert-before' },
  duplicate: { icon: 'duplicate', label: 'Duplicate', testId: 'op-duplicate' },
  upstream: { icon: 'left', label: 'Towards source', testId: 'op-move-up' },
  downstream: { icon: 'right', label: 'Towards loads', testId: 'op-move-down' },
  branchUp: { icon: 'up', label: 'Branch up', testId: 'op-branch-up' },
  branchDown: { icon: 'down', label: 'Branch down', testId: 'op-branch-down' },
  remove: { icon: 'remove', label: 'Remove', testId: 'op-remove' },
  addBank: { icon: 'branch', label: 'Add a battery bank on this bus', testId: 'op-add-bank' },
  removeBranch: { icon: 'removeBranch', label: 'Remove branch', testId: 'op-remove-branch' },
};

/**
 * The "More" menu button and its menu (the menu button pattern): Enter, Space or Down opens it at its
 * first item, Up at its last; in the menu the arrow keys, Home and End move, Escape closes it and gives
 * the focus back to the button, Tab closes it; a tap outside closes it. Choosing an item closes the menu
 * and carries the operation out with the button as its opener (an add operation's chooser gives the
 * focus back there).
 */
export function MoreMenu({ actions, onAct, subject }: {
  actions: readonly Exclude<ToolAction, 'undo' | 'redo'>[];
  onAct: (action: ToolAction, opener: HTMLElement | null) => void;
  /** The selected stage's name, for the menu's label. */
  subject: string;
}) {
  const open = useSignal<false | 'first' | 'last'>(false);
  const button = useRef<HTMLButtonElement>(null);
  const menu = useRef<HTMLUListElement>(null);
  const items = () => [...(menu.current?.querySelectorAll<HTMLElement>('[role="menuitem"]') ?? [])];
  // The focus moves into the menu before the browser paints (a layout effect): a key pressed as soon as
  // the menu shows reaches the menu, not the button (an effect after the paint let an arrow key fall
  // on the button, lost).
  useLayoutEffect(() => {
    if (!open.value) return;
    const list = items();
    (open.value === 'last' ? list[list.length - 1] : list[0])?.focus();
    const onDown = (ev: PointerEvent) => {
      const t = ev.target as Node | null;
      if (t && !menu.current?.contains(t) && !button.current?.contains(t)) open.value = false;
    };
    document.addEventListener('pointerdown', onDown);
    return () => document.removeEventListener('pointerdown', onDown);
  }, [open.value]);
  const close = (refocus: boolean) => {
    open.value = false;
    if (refocus) button.current?.focus();
  };
  const onMenuKey = (ev: KeyboardEvent) => {
    const list = items();
    const at = list.indexOf(document.activeElement as HTMLElement);
    const go = (i: number) => {
      ev.preventDefault();
      list[(i + list.length) % list.length]?.focus();
    };
    if (ev.key === 'ArrowDown') go(at + 1);
    else if (ev.key === 'ArrowUp') go(at - 1);
    else if (ev.key === 'Home') go(0);
    else if (ev.key === 'End') go(list.length - 1);
    else if (ev.key === 'Escape') {
      ev.preventDefault();
      close(true);
    } else if (ev.key === 'Tab') close(false);
  };
  return (
    <div class="more-menu">
      <button
        type="button"
        class="editor-tool"
        ref={button}
        id="more-button"
        aria-haspopup="menu"
        aria-expanded={open.value !== false}
        aria-controls="more-menu"
        data-testid="op-more"
        onClick={() => (open.value = open.value ? false : 'first')}
        onKeyDown={(ev) => {
          if (ev.key === 'ArrowDown' || ev.key === 'ArrowUp') {
            ev.preventDefault();
            open.value = ev.key === 'ArrowUp' ? 'last' : 'first';
          }
        }}
      >
        <Icon name="more" />
        <span>More</span>
      </button>
      {open.value && (
        <ul class="more-menu__list" id="more-menu" role="menu" aria-label={`More changes at ${subject}`} ref={menu} onKeyDown={onMenuKey} data-testid="more-menu">
          {actions.map((a) => {
            const w = TOOL_WORDS[a];
            return (
              <li key={a} role="none">
                <button
                  type="button"
                  role="menuitem"
                  tabIndex={-1}
                  class="more-menu__item"
                  data-testid={w.testId}
                  onClick={() => {
                    close(false);
                    button.current?.focus();
                    onAct(a, button.current);
                  }}
                >
                  <Icon name={w.icon} />
                  <span>{w.label}</span>
                </button>
              </li>
            );
          })}
        </ul>
      )}
    </div>
  );
}
